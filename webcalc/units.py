"""Units at the edge: the one pint registry, the closed unit table, parsing and formatting.

Nothing else in webcalc imports pint. The engine sees SI floats only: quantities are
parsed once here (factors cached per unit spelling) and formatted back on the way out.

The accepted spellings form a closed, case-sensitive table per dimension (the product
spec's binding table). Their factors to SI come from pint, rounded to 15 significant
digits so that binary noise (``0.0010000000000000002``) does not leak into the table
the browser shares; where pint differs from NIST SP 811 we define the unit ourselves.
"""

import functools
import math
import re

import pint

_REGISTRY = pint.UnitRegistry()
# pint reads "PS" as petasiemens and has no "CV": metric horsepower, NIST SP 811 (735.49875 W).
_REGISTRY.define("metric_horsepower = 735.49875 * watt")
# Conventional inch of mercury, NIST SP 811 (3386.389 Pa); pint derives 3386.38864 from g0 and rho_Hg.
_REGISTRY.define("inch_mercury_conventional = 3386.389 * pascal")

#: Binding table: dimension -> {accepted spelling: pint expression}.
UNITS = {
    "pressure": {
        "Pa": "pascal", "hPa": "hectopascal", "kPa": "kilopascal", "MPa": "megapascal",
        "mbar": "millibar", "bar": "bar", "psi": "psi", "inHg": "inch_mercury_conventional",
        "mmHg": "millimeter_Hg", "atm": "atmosphere",
    },
    "temperature": {
        "K": "kelvin", "degC": "degree_Celsius", "°C": "degree_Celsius",
        "degF": "degree_Fahrenheit", "°F": "degree_Fahrenheit", "degR": "degree_Rankine",
    },
    "length": {"m": "meter", "km": "kilometer", "ft": "foot"},
    "volume": {"L": "liter", "cc": "cubic_centimeter", "in^3": "inch**3", "m^3": "meter**3"},
    "power": {
        "W": "watt", "kW": "kilowatt", "hp": "horsepower",
        "PS": "metric_horsepower", "CV": "metric_horsepower",
    },
    "mass_flow": {
        "kg/s": "kg/s", "kg/min": "kg/min", "kg/h": "kg/hour", "g/s": "g/s",
        "g/min": "g/min", "lb/h": "lb/hour", "lb/min": "lb/min",
    },
    "volume_flow": {
        "cc/min": "cubic_centimeter/min", "L/h": "liter/hour", "L/min": "liter/min",
        "gal/h": "gallon/hour", "gal/min": "gallon/min", "m^3/s": "meter**3/s",
        "m^3/min": "meter**3/min", "ft^3/min": "foot**3/min", "cfm": "foot**3/min",
    },
    "density": {"kg/m^3": "kg/meter**3", "kg/L": "kg/liter", "g/cm^3": "g/cm**3", "lb/gal": "lb/gallon"},
    "bsfc": {"lb/hp/h": "lb/horsepower/hour", "g/kWh": "g/kilowatt/hour", "kg/J": "kg/joule"},
}
SI_UNIT = {
    "pressure": "pascal", "temperature": "kelvin", "length": "meter", "volume": "meter**3",
    "power": "watt", "mass_flow": "kg/s", "volume_flow": "meter**3/s",
    "density": "kg/meter**3", "bsfc": "kg/joule",
}

#: Output kinds: which dimensions a field of that kind accepts, and its unit per system.
#: Kinds with two dimensions are fuel flows: mass and volume convert with the fuel density.
KINDS = {
    "abs_pressure": (("pressure",), "kPa", "psi", "Pa"),
    "gauge_pressure": (("pressure",), "bar", "psi", "Pa"),
    "temperature": (("temperature",), "degC", "degF", "K"),
    "elevation": (("length",), "m", "ft", "m"),
    "power": (("power",), "kW", "hp", "W"),
    "air_mass_flow": (("mass_flow",), "kg/min", "lb/min", "kg/s"),
    "air_volume_flow": (("volume_flow",), "m^3/min", "ft^3/min", "m^3/s"),
    "injector_flow": (("mass_flow", "volume_flow"), "cc/min", "lb/h", "kg/s"),
    "fuel_flow": (("mass_flow", "volume_flow"), "kg/h", "lb/h", "kg/s"),
    "pump_flow": (("volume_flow", "mass_flow"), "L/h", "gal/h", "m^3/s"),
    "bsfc": (("bsfc",), "g/kWh", "lb/hp/h", "kg/J"),
    "density": (("density",), "kg/L", "lb/gal", "kg/m^3"),
    # Air density: the table's customary density unit (lb/gal) suits fuel, not air, so
    # every system reports air density in kg/m^3.
    "air_density": (("density",), "kg/m^3", "kg/m^3", "kg/m^3"),
    "displacement": (("volume",), "L", "in^3", "m^3"),
}
SYSTEMS = ("metric", "imperial", "si")
GAUGE_ABSOLUTE_SPELLINGS = ("psig", "psia", "barg", "bara", "kPag", "kPaa")

_NUMBER = r"[+-]?(?:[0-9]+(?:\.[0-9]*)?|\.[0-9]+)(?:[eE][+-]?[0-9]+)?"  # ASCII digits only
_QUANTITY = re.compile(rf"^\s*({_NUMBER})\s*([A-Za-z°](?:.*\S)?)\s*$")
_PERCENT = re.compile(rf"^\s*({_NUMBER})\s*%\s*$")
_PLAIN_NUMBER = re.compile(rf"^\s*({_NUMBER})\s*$")


class UnitError(ValueError):
    """A quantity that cannot be read. ``code`` names the problem, ``params`` fill its message."""

    def __init__(self, code, **params):
        super().__init__(code)
        self.code = code
        self.params = params


def _significant(x):
    return float(f"{x:.15g}")


@functools.lru_cache(maxsize=None)
def conversion(dimension, unit):
    """(factor, offset) so that ``SI = value * factor + offset`` for an accepted spelling.

    Computed once per spelling with pint and cached.
    """
    expression = UNITS[dimension][unit]
    zero = _REGISTRY.Quantity(0.0, expression).to(SI_UNIT[dimension]).magnitude
    if zero:  # an offset scale (degC, degF): the factor is that of its temperature difference
        expression = "delta_" + expression
    one = _REGISTRY.Quantity(1.0, expression).to(SI_UNIT[dimension]).magnitude
    return _significant(one), _significant(zero)


_DIMENSION_OF = {u: d for d, spellings in UNITS.items() for u in spellings}


def dimension_of(unit):
    """Dimension of an accepted spelling, or None."""
    return _DIMENSION_OF.get(unit)


def accepted(dimensions):
    """Accepted spellings for a field that takes these dimensions, in table order."""
    return [u for d in dimensions for u in UNITS[d]]


def to_si(value, unit, dimensions, density=None):
    """Convert ``value`` in ``unit`` to SI for a field accepting ``dimensions``.

    For fuel-flow fields (two dimensions) the result is in the first dimension's SI unit,
    converting mass and volume with ``density`` [kg/m^3].

    :raises UnitError: unknown spelling, gauge/absolute spelling, wrong dimension.
    """
    if unit in GAUGE_ABSOLUTE_SPELLINGS:
        raise UnitError("unit_gauge_absolute", unit=unit)
    dimension = dimension_of(unit)
    if dimension is None:
        raise UnitError("unit_unknown", unit=unit, accepted=", ".join(accepted(dimensions)))
    if dimension not in dimensions:
        raise UnitError("unit_wrong_dimension", unit=unit, accepted=", ".join(accepted(dimensions)))
    factor, offset = conversion(dimension, unit)
    si = value * factor + offset
    if dimension != dimensions[0]:
        si = si * density if dimension == "volume_flow" else si / density
    return si


def from_si(si, unit, dimensions, density=None):
    """Inverse of :func:`to_si`: an SI value of the field's first dimension in ``unit``."""
    dimension = dimension_of(unit)
    if dimension != dimensions[0]:
        si = si / density if dimension == "volume_flow" else si * density
    factor, offset = conversion(dimension, unit)
    return (si - offset) / factor


def parse_quantity(raw):
    """Split a quantity input into (number, unit spelling).

    Accepts ``"15 psi"`` (a number with ``.`` as decimal point, optional exponent, optional
    spaces, a unit) or ``{"value": 15, "unit": "psi"}``.

    :raises UnitError: with code ``quantity_bare_number``, ``quantity_format``.
    """
    if isinstance(raw, dict):
        if set(raw) != {"value", "unit"}:
            raise UnitError("quantity_format")
        value, unit = raw["value"], raw["unit"]
        if not is_number(value) or not isinstance(unit, str):
            raise UnitError("quantity_format")
        return float(value), unit.strip()
    if is_number(raw):
        raise UnitError("quantity_bare_number")
    if isinstance(raw, str) and len(raw) <= 100:
        parsed = _parse_text(raw)
        if isinstance(parsed, str):
            raise UnitError(parsed)
        return parsed
    raise UnitError("quantity_format")


@functools.lru_cache(maxsize=4096)
def _parse_text(raw):
    """(number, unit) of a quantity string, or the error code (cached: a phone sends the
    same few strings again and again)."""
    if _PLAIN_NUMBER.match(raw):
        return "quantity_bare_number"
    match = _QUANTITY.match(raw)
    if match:
        value = float(match.group(1))
        if math.isfinite(value):
            return value, match.group(2)
    return "quantity_format"


def parse_fraction(raw):
    """A dimensionless input: a number, or a string with ``%`` (``"80 %"`` is 0.8)."""
    if is_number(raw):
        return float(raw)
    if isinstance(raw, str) and len(raw) <= 100:
        match = _PERCENT.match(raw)
        if match:
            return float(match.group(1)) / 100.0
        match = _PLAIN_NUMBER.match(raw)
        if match:
            return float(match.group(1))
    raise UnitError("fraction_format")


def is_number(x):
    """A finite JSON number that is not a boolean."""
    return isinstance(x, (int, float)) and not isinstance(x, bool) and math.isfinite(x)


def system_unit(kind, system):
    """The output unit of a kind in a unit system (``metric``, ``imperial``, ``si``)."""
    return KINDS[kind][1 + SYSTEMS.index(system)]


def quantity(si, kind, unit, density=None):
    """An output quantity ``{"value", "unit"}`` (``None`` stays ``None``; -0 becomes 0)."""
    if si is None:
        return None
    dimensions = KINDS[kind][0]
    if len(dimensions) == 1 and unit in UNITS[dimensions[0]]:
        factor, offset = conversion(dimensions[0], unit)
        value = (float(si) - offset) / factor
    else:
        value = float(from_si(float(si), unit, dimensions, density))
    return {"value": value + 0.0, "unit": unit}


def table():
    """The unit table for the browser: factors and offsets per spelling, and the kinds."""
    return {
        "dimensions": {
            d: {u: dict(zip(("factor", "offset"), conversion(d, u))) for u in spellings}
            for d, spellings in UNITS.items()
        },
        "kinds": {
            k: {"dimensions": list(dims), "metric": m, "imperial": i, "si": s}
            for k, (dims, m, i, s) in KINDS.items()
        },
        "systems": list(SYSTEMS),
        "gauge_absolute_spellings": list(GAUGE_ABSOLUTE_SPELLINGS),
    }
