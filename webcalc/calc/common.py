"""Shared pieces of the calculations: the result record, site and fuel resolution."""

import math

import numpy as np

from ..engine import atmosphere, fuel
from ..engine.constants import P_SEA_LEVEL


class InputError(Exception):
    """A problem that only shows once fields are combined; names the field to blame."""

    def __init__(self, path, code, **params):
        super().__init__(path, code)
        self.path = path
        self.code = code
        self.params = params


class Result:
    """Outputs (SI floats, None, plain values or table rows), warnings and assumptions."""

    def __init__(self):
        self.values = {}
        self.warnings = []  # (code, severity)
        self.assumptions = {}  # path -> (value, kind or None)
        self.density = None  # fuel density for fuel-flow outputs, [kg/m^3]
        self.power_scale = 1.0  # crank power per unit of reported power (wheel basis)

    def warn(self, code, severity):
        if (code, severity) not in self.warnings:
            self.warnings.append((code, severity))

    def assume(self, path, value, kind=None):
        self.assumptions[path] = (value, kind)
        return value


def finite(x):
    """Plain float of a finite number (numpy scalars included)."""
    return float(x)


def option(inp, name, default, result, path=None, kind=None):
    """An input's value, or its default recorded as an assumption."""
    if name in inp:
        return inp[name]
    return result.assume(path or name, default, kind)


def resolve_site(raw, result, prefix="site"):
    """Station pressure, temperature and humidity of a site object (SPEC section 3).

    Pressure from ``station_pressure``, else ``altimeter_setting`` with ``altitude`` (NWS),
    else ``altitude`` by the standard atmosphere, else ISA sea level. Temperature defaults
    to the standard temperature at the altitude, or at the pressure altitude when only a
    pressure is given; humidity to 0.
    """
    raw = raw or {}
    if "station_pressure" in raw and "altimeter_setting" in raw:
        raise InputError(prefix + ".altimeter_setting", "both_given", other=prefix + ".station_pressure")
    if "altimeter_setting" in raw and "altitude" not in raw:
        raise InputError(prefix + ".altimeter_setting", "needs", other=prefix + ".altitude")
    altitude = raw.get("altitude")
    if "station_pressure" in raw:
        pressure = raw["station_pressure"]
    elif "altimeter_setting" in raw:
        pressure = finite(atmosphere.station_pressure_from_altimeter(raw["altimeter_setting"], altitude))
    elif altitude is not None:
        pressure = result.assume(prefix + ".station_pressure", finite(atmosphere.isa_pressure(altitude)), "abs_pressure")
    else:
        pressure = result.assume(prefix + ".station_pressure", P_SEA_LEVEL, "abs_pressure")
    if "temperature" in raw:
        temperature = raw["temperature"]
    else:
        h = altitude if altitude is not None else finite(atmosphere.pressure_altitude(pressure))
        temperature = result.assume(prefix + ".temperature", finite(atmosphere.isa_temperature(h)), "temperature")
    humidity = raw["relative_humidity"] if "relative_humidity" in raw else result.assume(prefix + ".relative_humidity", 0.0)
    if humidity > 0 and finite(atmosphere.vapour_pressure(temperature, humidity)) >= pressure:
        # Water vapour cannot make up all of the air: the dry-air pressure would be <= 0.
        raise InputError(prefix + ".relative_humidity", "pressure_not_positive")
    if altitude is None:
        altitude = finite(atmosphere.pressure_altitude(pressure))
    return {"pressure": pressure, "temperature": temperature, "humidity": humidity, "altitude": altitude}


def resolve_fuel(inp, result):
    """Density [kg/m^3] and stoichiometric AFR of the request's fuel (blend rule)."""
    name = inp.get("fuel", "gasoline")
    if "fuel" not in inp:
        result.assume("fuel", "gasoline")
    content = inp.get("ethanol_content")
    if content is not None and name not in fuel.BLENDABLE:
        raise InputError("ethanol_content", "not_for_fuel")
    density, afr = fuel.fuel_properties(name, content)
    density = inp.get("fuel_density", density)
    ethanol = content if content is not None else (fuel.E85_ETHANOL if name == "e85" else 0.0)
    if ethanol > 0.10 or name in ("ethanol", "methanol"):
        result.warn("ethanol_compatibility", "info")
    result.density = density
    return {"name": name, "density": float(density), "afr": float(afr)}


def power_scale(inp, result):
    """Crank power per unit of the request's power figures (1, or 1 / (1 - loss) for wheel)."""
    if inp.get("power_basis", "crank") == "wheel":
        if "drivetrain_loss" not in inp:
            raise InputError("drivetrain_loss", "needs_wheel_loss")
        result.warn("drivetrain_loss_estimate", "info")
        result.power_scale = 1.0 / (1.0 - inp["drivetrain_loss"])
    return result.power_scale


def check_finite(values, names):
    """Raise an InputError naming the inputs when a result is not finite."""
    for value in values:
        if value is not None and not math.isfinite(float(value)):
            raise InputError(names[0], "not_finite")


def as_list(x):
    return [float(v) for v in np.atleast_1d(x)]
