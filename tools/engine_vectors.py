"""Write the parity vectors of the JavaScript engine from the Python engine.

Calls the functions of ``webcalc/engine`` over a spread of inputs (edges of the VALID
ranges, blends from 0 to 1, both regulators, pump curves with extrapolation on both
sides, boost here for all three controls, the boost-for-power root find reachable and
unreachable, belt-driven and turbo) and writes them, with the engine's data tables, to
``tests/js/engine_vectors.json``. ``tests/js/engine.test.mjs`` checks the JavaScript
mirror in ``static/js/engine/`` against that file.

The output is deterministic: sorted keys, floats written by ``repr(float)``, no clock,
no randomness. Regenerating gives identical bytes (``tests/js/test_engine_vectors_fresh.py``
fails when the committed file is stale).

Usage (from the repository root)::

    python tools/engine_vectors.py              # rewrite tests/js/engine_vectors.json
    python tools/engine_vectors.py --out FILE   # write elsewhere (used by the freshness test)
    python tools/engine_vectors.py --check      # exit 1 if the committed file is stale
"""

from __future__ import annotations

import argparse
import inspect
import json
import math
import sys
from pathlib import Path

import numpy as np

ROOT = Path(__file__).resolve().parents[1]
if str(ROOT) not in sys.path:
    sys.path.insert(0, str(ROOT))

from webcalc.engine import airflow, atmosphere, compressor, constants, fuel, power  # noqa: E402

MODULES = {
    "constants": constants,
    "atmosphere": atmosphere,
    "compressor": compressor,
    "power": power,
    "airflow": airflow,
    "fuel": fuel,
}
DEFAULT_OUT = ROOT / "tests" / "js" / "engine_vectors.json"
#: Bump when the layout of the file changes (the JavaScript test checks it).
FORMAT = 1


# --------------------------------------------------------------------------- building blocks


def plain(value):
    """Turn a Python engine result into JSON data (floats must be finite)."""
    if isinstance(value, dict):
        return {str(k): plain(v) for k, v in value.items()}
    if isinstance(value, (tuple, list)):
        return [plain(v) for v in value]
    if isinstance(value, np.ndarray):
        if value.ndim == 0:
            return plain(value[()])
        return [plain(v) for v in value.tolist()]
    if value is None or isinstance(value, str):
        return value
    if isinstance(value, (bool, np.bool_)):
        return bool(value)
    if isinstance(value, (int, np.integer)):
        return int(value)
    if isinstance(value, (float, np.floating)):
        number = float(value)
        if not math.isfinite(number):
            raise ValueError(f"non-finite value in a vector: {number!r}")
        return number
    raise TypeError(f"cannot write {type(value).__name__} into the vectors")


class Cases:
    """Collects ``{"fn", "args", "kwargs", "expect", "note"}`` records."""

    def __init__(self):
        self.items = []

    def add(self, module, name, *args, note=None, **kwargs):
        fn = getattr(MODULES[module], name)
        record = {"fn": f"{module}.{name}", "args": plain(list(args)), "expect": plain(fn(*args, **kwargs))}
        if kwargs:
            record["kwargs"] = plain(kwargs)
        if note:
            record["note"] = note
        self.items.append(record)

    def add_root_find(self, target, boost_max, expected_kwargs, note):
        """``boost_for_expected_power`` with ``expected = expected_power(b, **kw)["expected"]``."""

        def expected(boost):
            return power.expected_power(boost, **expected_kwargs)["expected"]

        result = power.boost_for_expected_power(target, boost_max, expected)
        self.items.append(
            {
                "fn": "power.boost_for_expected_power",
                "args": plain([target, boost_max]),
                "expected_power_kwargs": plain(expected_kwargs),
                "expect": plain(result),
                "note": note,
            }
        )


def spread(lo, hi, n):
    """``n`` values from ``lo`` to ``hi`` inclusive (Python floats)."""
    return [float(v) for v in np.linspace(lo, hi, n)]


def edges(table, key):
    lo, hi = table[key]
    return float(lo), float(hi)


# --------------------------------------------------------------------------- cases


def atmosphere_cases(c):
    h_lo, h_hi = edges(atmosphere.VALID, "altitude")
    heights = [h_lo, -300.0, 0.0, 250.0, 1000.0, 1609.344, 2000.0, 3048.0, 4500.0, 6000.0, 8848.0, h_hi]
    for h in heights + [11019.1, 12000.0]:
        c.add("atmosphere", "geopotential_height", h)
    for H in [-610.0, 0.0, 1000.0, 5000.0, 10981.0, 11000.0]:
        c.add("atmosphere", "geometric_height", H)
    for h in heights:
        c.add("atmosphere", "isa_temperature", h, note="VALID edge" if h in (h_lo, h_hi) else None)
        c.add("atmosphere", "isa_pressure", h, note="VALID edge" if h in (h_lo, h_hi) else None)
    p_lo, p_hi = edges(atmosphere.VALID, "station_pressure")
    for p in [p_lo, 30e3, 50e3, 70e3, 80e3, 89876.0, 95e3, 100e3, 101325.0, 105e3, p_hi]:
        c.add("atmosphere", "pressure_altitude", p)
    a_lo, a_hi = edges(atmosphere.VALID, "altimeter_setting")
    for p_alt in [a_lo, 98e3, 101325.0, a_hi]:
        for h in [h_lo, 0.0, 2000.0, h_hi]:
            c.add("atmosphere", "station_pressure_from_altimeter", p_alt, h)
    for p_stn in [p_lo, 80e3, 101325.0]:
        for h in [h_lo, 0.0, 2000.0, h_hi]:
            c.add("atmosphere", "altimeter_from_station_pressure", p_stn, h)
    t_lo, t_hi = edges(atmosphere.VALID, "temperature")
    temperatures = spread(t_lo, t_hi, 13) + [273.15, 288.15, 298.15]
    for T in temperatures:
        c.add("atmosphere", "saturation_vapour_pressure", T)
    for T in [t_lo, 273.15, 303.15, t_hi]:
        for rh in [0.0, 0.35, 1.0]:
            c.add("atmosphere", "vapour_pressure", T, rh)
    for p in [p_lo, 80e3, 101325.0, p_hi]:
        for T in [t_lo, 288.15, t_hi]:
            for rh in [0.0, 0.6, 1.0]:
                c.add("atmosphere", "humid_air_density", p, T, rh)
    for rho in [0.3, 0.4, 0.6, 0.8, 0.9, 1.0, 1.1, 1.2, 1.225, 1.3, 1.45]:
        c.add("atmosphere", "density_altitude", rho)
    for h in [10000.0, 10999.0, 11000.0, 11019.0, 11020.0, 12000.0]:
        c.add("atmosphere", "beyond_troposphere", h)
    for p_dry in [80e3, 90e3, 95e3, 99e3, 101325.0, 105e3]:
        for T in [273.15, 288.15, 298.15, 308.15]:
            c.add("atmosphere", "sae_j1349_correction_factor", p_dry, T)
    for h_row in [h_lo, 0.0, 1500.0, 3000.0, h_hi]:
        for h_site, p_site, T_site in [(0.0, 101325.0, 288.15), (1200.0, 86.5e3, 305.0)]:
            c.add("atmosphere", "carry_weather", h_row, h_site, p_site, T_site)


def compressor_cases(c):
    b_lo, b_hi = edges(compressor.VALID, "boost")
    l_lo, l_hi = edges(compressor.VALID, "loss")
    c.add("compressor", "pressures", 101325.0, 0.0, note="defaults, no boost")
    c.add("compressor", "pressures", 101325.0, 100e3)
    c.add("compressor", "pressures", 79.5e3, 150e3, 2e3)
    for p_baro in [22e3, 80e3, 101325.0, 110e3]:
        for boost in [b_lo, 120e3, b_hi]:
            for losses in [(l_lo, l_lo), (3e3, 12e3), (l_lo, l_hi), (15e3, l_hi)]:
                if p_baro - losses[0] > 0:
                    c.add("compressor", "pressures", p_baro, boost, *losses)
    e_lo, e_hi = edges(compressor.VALID, "efficiency")
    pr_lo, pr_hi = edges(compressor.VALID, "max_pressure_ratio")
    for pr in [pr_lo, 1.25, 1.8, 2.5, 3.6, pr_hi]:
        for eta in [e_lo, 0.55, 0.72, e_hi]:
            c.add("compressor", "outlet_temperature", 288.15, pr, eta)
    for T1 in [213.15, 333.15]:
        c.add("compressor", "outlet_temperature", T1, 2.2, 0.68)
    x_lo, x_hi = edges(compressor.VALID, "effectiveness")
    c_lo, c_hi = edges(compressor.VALID, "coolant_temperature")
    for eps in [x_lo, 0.5, 0.75, x_hi]:
        for coolant in [c_lo, 300.0, c_hi]:
            c.add("compressor", "intercooler_outlet_temperature", 410.0, coolant, eps)
    d_lo, d_hi = edges(compressor.VALID, "drive_efficiency")
    for m in [0.05, 0.4, 1.2]:
        for eta_d in [d_lo, 0.95, d_hi]:
            c.add("compressor", "drive_power", m, 295.0, 372.5, eta_d)
    for pr_max, p1, ic_loss, p_baro in [
        (4.0, 101325.0, 0.0, 101325.0),
        (2.5, 95e3, 10e3, 98e3),
        (pr_hi, 110e3, l_hi, 110e3),
        (1.01, 60e3, 5e3, 62e3),  # negative: unreachable
    ]:
        c.add("compressor", "highest_boost", pr_max, p1, ic_loss, p_baro)
    p_set_list = [101325.0, 84.5e3]
    p_here_list = [float(atmosphere.isa_pressure(h)) for h in (-610.0, 0.0, 1500.0, 3000.0, 11000.0)]
    for control in compressor.BOOST_CONTROLS:
        for p_set in p_set_list:
            for boost_set in [0.0, 55e3, 140e3]:
                for p_here in p_here_list:
                    c.add("compressor", "boost_here", control, boost_set, p_set, p_here)
            c.add("compressor", "boost_here", control, 100e3, p_set, 70e3, 2.5e3, 9e3, note="with losses")
            c.add("compressor", "boost_here", control, 20e3, p_set, 110e3, 4e3, 1e3, note="clamped at 0 where negative")


NA_POWER = 150e3  # W (invented demo scale, about 200 hp)
NA_AIR = float(airflow.air_mass_flow(NA_POWER, fuel.NA_BSFC_GASOLINE, fuel.NA_AFR_GASOLINE))

#: Expected-power setups: turbo and each belt-driven type, with and without intercooler.
SETUPS = {
    "turbo, defaults": dict(efficiency=0.72, effectiveness=0.75),
    "turbo, losses, no intercooler, high back pressure": dict(
        inlet_loss=3e3, intercooler_loss=0.0, efficiency=0.65, effectiveness=0.0, exhaust_ratio=1.6
    ),
    "turbo, perfect intercooler at NA temperature": dict(efficiency=0.78, effectiveness=1.0, T_coolant=298.15),
    "centrifugal, belt": dict(
        efficiency=0.70, effectiveness=0.7, belt_driven=True, drive_efficiency=0.95, exhaust_ratio=0.0
    ),
    "roots, belt, no intercooler": dict(
        inlet_loss=1e3, efficiency=0.55, effectiveness=0.0, belt_driven=True, drive_efficiency=0.9, exhaust_ratio=0.0
    ),
    "twin screw, belt, warm coolant": dict(
        intercooler_loss=8e3, efficiency=0.65, effectiveness=0.8, T_coolant=330.0, belt_driven=True,
        drive_efficiency=0.5, exhaust_ratio=0.2,
    ),
}
INDUCTION_OF = {
    "turbo, defaults": "turbo",
    "turbo, losses, no intercooler, high back pressure": "turbo",
    "turbo, perfect intercooler at NA temperature": "turbo",
    "centrifugal, belt": "centrifugal",
    "roots, belt, no intercooler": "roots",
    "twin screw, belt, warm coolant": "twin_screw",
}


def site_kwargs(p_baro, T1):
    return dict(na_power=NA_POWER, p_na=101325.0, T_na=298.15, na_air_mass_flow=NA_AIR, p_baro=p_baro, T1=T1)


def power_cases(c):
    for na, map_abs, p_na in [(NA_POWER, 202650.0, 101325.0), (75e3, 150e3, 95e3), (1e3, 22e3, 110e3), (10e6, 800e3, 50e3)]:
        c.add("power", "ideal_power", na, map_abs, p_na)
    c.add("power", "expected_power", 0.0, **site_kwargs(101325.0, 298.15), note="keyword defaults")
    for label, setup in SETUPS.items():
        for p_baro, T1 in [(101325.0, 298.15), (float(atmosphere.isa_pressure(2000.0)), 288.0)]:
            for boost in [0.0, 35e3, 101325.0, 250e3, 700e3]:
                c.add("power", "expected_power", boost, **site_kwargs(p_baro, T1), **setup, note=label)
    for target, na, p_na, p_baro in [
        (2 * NA_POWER, NA_POWER, 101325.0, 101325.0),
        (300e3, NA_POWER, 101325.0, 79.5e3),
        (100e3, NA_POWER, 101325.0, 101325.0),  # below NA: floored at 0
        (NA_POWER, NA_POWER, 95e3, 101325.0),  # floored at 0
        (1e6, 2e5, 99e3, 70e3),
    ]:
        c.add("power", "boost_for_ideal_power", target, na, p_na, p_baro)

    for label, setup in SETUPS.items():
        induction = INDUCTION_OF[label]
        for altitude in (0.0, 2500.0):
            p_baro = float(atmosphere.isa_pressure(altitude))
            T1 = float(atmosphere.isa_temperature(altitude)) + 10.0
            kw = dict(site_kwargs(p_baro, T1), **setup)
            _, p1, _, _ = compressor.pressures(p_baro, 0.0, setup.get("inlet_loss", 0.0))
            boost_max = float(
                compressor.highest_boost(
                    compressor.DEFAULT_MAX_PRESSURE_RATIO[induction], p1, setup.get("intercooler_loss", 0.0), p_baro
                )
            )
            for factor in (0.6, 1.1, 1.5, 2.0, 2.6, 4.0):
                c.add_root_find(factor * NA_POWER, boost_max, kw, f"{label}, {altitude:g} m, target {factor:g} x NA")
            # a target exactly on a grid point of the root find
            grid = np.linspace(0.0, boost_max, power.GRID_POINTS)
            on_grid = float(power.expected_power(float(grid[100]), **kw)["expected"])
            c.add_root_find(on_grid, boost_max, kw, f"{label}, {altitude:g} m, target on grid point 100")
    kw = dict(site_kwargs(70e3, 300.0), **SETUPS["turbo, defaults"])
    c.add_root_find(2 * NA_POWER, -1.5e3, kw, "highest boost below 0: unreachable")
    c.add_root_find(2 * NA_POWER, 0.0, kw, "highest boost exactly 0")
    low = float(power.expected_power(0.0, **kw)["expected"])
    high = float(power.expected_power(1e3, **kw)["expected"])
    c.add_root_find(low + 0.3 * (high - low), 1e3, kw, "narrow range of 1 kPa, root inside")
    c.add_root_find(low, 1e3, kw, "target equal to the expected power at 0 boost: no sign change")
    c.add_root_find(high, 1e3, kw, "target equal to the expected power at the highest boost")


def airflow_cases(c):
    b_lo, b_hi = edges(fuel.VALID, "bsfc")
    a_lo, a_hi = edges(fuel.VALID, "afr")
    for p in [1e3, NA_POWER, 10e6]:
        for bsfc in [b_lo, fuel.NA_BSFC_GASOLINE, b_hi]:
            for afr in [a_lo, 12.5, a_hi]:
                c.add("airflow", "air_mass_flow", p, bsfc, afr)
    for p, T in [(22e3, 213.15), (101325.0, 288.15), (250e3, 330.0), (800e3, 400.0)]:
        c.add("airflow", "gas_density", p, T)
        c.add("airflow", "volume_flow", 0.25, p, T)
    r_lo, r_hi = edges(airflow.VALID, "reference_pressure")
    t_lo, t_hi = edges(airflow.VALID, "reference_temperature")
    c.add("airflow", "corrected_flow", 0.3, 101325.0 / 2, 288.15, note="defaults")
    for p1, T1 in [(60e3, 250.0), (98e3, 300.0), (110e3, 320.0)]:
        c.add("airflow", "corrected_flow", 0.2, p1, T1)
        for p_ref, T_ref in [(r_lo, t_lo), (100e3, 298.0), (r_hi, t_hi)]:
            c.add("airflow", "corrected_flow", 0.2, p1, T1, p_ref, T_ref)
    d_lo, d_hi = edges(airflow.VALID, "displacement")
    n_lo, n_hi = edges(airflow.VALID, "rpm")
    for m, rho in [(0.002, 1.1), (0.25, 2.3), (1.5, 4.0)]:
        for disp in [d_lo, 2e-3, d_hi]:
            for rpm in [n_lo, 6500.0, n_hi]:
                c.add("airflow", "volumetric_efficiency", m, rho, disp, rpm)


def pump_curves():
    """Invented data-sheet curves: pressure [Pa] gauge, flow [m^3/s]."""
    lph = 1e-3 / 3600.0  # 1 L/h in m^3/s
    two = ([2e5, 6e5], [180 * lph, 120 * lph])
    three = ([1e5, 3e5, 5e5], [3e-5, 2e-5, 1e-5])
    five = ([2.5e5, 3.5e5, 4.5e5, 5.5e5, 6.5e5], [310 * lph, 290 * lph, 262 * lph, 228 * lph, 180 * lph])
    p30 = [float(0.5e5 + i * 0.3e5) for i in range(30)]
    f30 = [float((400.0 - 0.00012 * (p - 0.5e5) - 1.1e-10 * (p - 0.5e5) ** 2) * lph) for p in p30]
    return {"two points": two, "three points": three, "five points": five, "thirty points": (p30, f30)}


def fuel_cases(c):
    x_lo, x_hi = edges(fuel.VALID, "ethanol_content")
    for x in spread(x_lo, x_hi, 21) + [0.1, 0.85, 0.15, 0.7]:
        c.add("fuel", "blend", x)
    c.add("fuel", "blend", 0.5, {"density": 720.0, "afr": 14.6}, {"density": 794.0, "afr": 9.0}, note="other parents")
    c.add("fuel", "fuel_properties", note="defaults")
    for name in fuel.FUEL_NAMES:
        c.add("fuel", "fuel_properties", name)
    for name, x in [("gasoline", 0.0), ("gasoline", 0.1), ("gasoline", 1.0), ("e85", 0.7), ("e85", 0.85)]:
        c.add("fuel", "fuel_properties", name, x)
    stoich = [fuel.FUELS[n]["afr"] for n in ("gasoline", "ethanol", "methanol")] + [float(fuel.blend(0.85)[1])]
    for afr in stoich + [fuel.VALID["afr"][0], fuel.VALID["afr"][1]]:
        c.add("fuel", "na_air_defaults", afr)
        for induction in fuel.SIZING_BSFC_GASOLINE:
            c.add("fuel", "sizing_bsfc", induction, afr)
    for p in [1e3, NA_POWER, 10e6]:
        c.add("fuel", "fuel_mass_flow", p, fuel.SIZING_BSFC_GASOLINE["turbo"])
    fp_lo, fp_hi = edges(fuel.VALID, "fuel_pressure")
    for regulator in ("boost_referenced", "fixed"):
        for base in [fp_lo, fuel.DEFAULT_FUEL_PRESSURE, 4.3e5, fp_hi]:
            for boost in [0.0, 1.5e5, 3e5, 7e5]:
                c.add("fuel", "injector_pressure_difference", base, boost, regulator)
                c.add("fuel", "pump_required_pressure", base, boost, regulator)
            c.add("fuel", "pump_required_pressure", base, 1.2e5, regulator, 0.35e5, note="with line loss")
    for to, frm in [(4e5, 1e5), (3e5, 3e5), (fp_lo, fp_hi), (fp_hi, fp_lo), (2.2e5, 3e5)]:
        c.add("fuel", "orifice_scale", to, frm)
    n_lo, n_hi = edges(fuel.VALID, "injector_count")
    d_lo, d_hi = edges(fuel.VALID, "duty")
    bsfc = fuel.SIZING_BSFC_GASOLINE["turbo"]
    for p in [20e3, 400e3, 10e6]:
        for count in [int(n_lo), 4, 8, int(n_hi)]:
            for duty in [0.05, fuel.DEFAULT_MAX_DUTY, d_hi]:
                c.add("fuel", "injector_flow_needed", p, bsfc, count, duty)
            flow = 8e-3 / 4 / 0.8  # kg/s per injector: invented
            c.add("fuel", "injector_duty", p, bsfc, count, flow)
            c.add("fuel", "injector_max_power", flow, count, fuel.DEFAULT_MAX_DUTY, bsfc)
    rho_lo, rho_hi = edges(fuel.VALID, "fuel_density")
    for rho_fuel in [rho_lo, 745.0, rho_hi]:
        for rho_test in [684.0, 745.0]:
            c.add("fuel", "rating_fluid_scale", rho_fuel, rho_test)
    m_lo, m_hi = edges(fuel.VALID, "margin")
    for p in [20e3, 400e3, 10e6]:
        for density in [rho_lo, float(fuel.blend(0.85)[0]), rho_hi]:
            for margin in [m_lo, fuel.DEFAULT_PUMP_MARGIN, m_hi]:
                c.add("fuel", "pump_required_flow", p, bsfc, density, margin)
    for label, (xp, fp) in pump_curves().items():
        probes = [0.0, xp[0] - 0.4e5, xp[0], 0.5 * (xp[0] + xp[1]), xp[1], xp[-2] + 0.25 * (xp[-1] - xp[-2])]
        probes += [xp[-1], xp[-1] + 0.3e5, xp[-1] + 8e5, 20e5]
        for pressure in probes:
            note = label
            if pressure < xp[0]:
                note += ", extrapolated below"
            elif pressure > xp[-1]:
                note += ", extrapolated above"
            c.add("fuel", "pump_curve_flow", xp, fp, float(pressure), note=note)
    flat = ([3e5, 4e5, 5e5], [2e-5, 2e-5, 2e-5])
    c.add("fuel", "pump_curve_flow", *flat, 4.5e5, note="flat curve")
    c.add("fuel", "pump_curve_flow", *flat, 8e5, note="flat curve, extrapolated above")
    rising = ([1e5, 2e5], [1e-5, 3e-5])
    c.add("fuel", "pump_curve_flow", *rising, 0.2e5, note="rising curve, extrapolated below")


# --------------------------------------------------------------------------- document


def tables():
    """UPPER_CASE data of every module (the constants module's names listed once)."""
    own = {}
    for name, module in MODULES.items():
        entries = {}
        for attr, value in vars(module).items():
            if not attr.isupper() or attr.startswith("_"):
                continue
            if name != "constants" and hasattr(constants, attr):
                continue  # imported from constants
            entries[attr] = plain(value)
        own[name] = entries
    return own


def public_functions():
    out = {}
    for name, module in MODULES.items():
        out[name] = sorted(
            attr
            for attr, value in vars(module).items()
            if inspect.isfunction(value) and value.__module__ == module.__name__ and not attr.startswith("_")
        )
    return out


def build():
    c = Cases()
    atmosphere_cases(c)
    compressor_cases(c)
    power_cases(c)
    airflow_cases(c)
    fuel_cases(c)
    return {
        "format": FORMAT,
        "about": "Parity vectors: Python engine (webcalc/engine) results for the JavaScript mirror "
        "(static/js/engine). Generated by tools/engine_vectors.py; do not edit by hand.",
        "tolerance": {"relative": 1e-9, "absolute": 1e-6},
        "functions": public_functions(),
        "tables": tables(),
        "cases": c.items,
    }


def render():
    return json.dumps(build(), sort_keys=True, indent=1, allow_nan=False, ensure_ascii=True) + "\n"


def main(argv=None):
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--out", type=Path, default=DEFAULT_OUT, help="output file (default: %(default)s)")
    parser.add_argument("--check", action="store_true", help="exit 1 if the output file differs")
    args = parser.parse_args(argv)
    text = render()
    if args.check:
        current = args.out.read_text(encoding="utf-8") if args.out.exists() else None
        if current != text:
            print(f"{args.out} is stale: run python tools/engine_vectors.py", file=sys.stderr)
            return 1
        return 0
    args.out.parent.mkdir(parents=True, exist_ok=True)
    args.out.write_bytes(text.encode("utf-8"))
    count = len(json.loads(text)["cases"])
    print(f"wrote {count} vectors to {args.out}")
    return 0


if __name__ == "__main__":
    sys.exit(main())
