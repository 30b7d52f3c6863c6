"""Boost & pressure ratio, power check and boost target (SPEC sections 3 and 4)."""

import numpy as np

from ..engine import atmosphere, compressor, fuel, power
from ..engine.compressor import BELT_DRIVEN, BOOST_CONTROLS
from .common import InputError, Result, finite, option, power_scale, resolve_fuel, resolve_site
from ..messages import SEVERITY_ORDER, WARNING_ORDER
from .site import air

#: Manifold temperature limits for warnings, [K]: 60 and 80 degC (common practice, from memory).
CHARGE_CAUTION, CHARGE_DANGER = 333.15, 353.15
#: Shortfall thresholds (fraction below expected) and the above-ideal margin (common practice, from memory).
SHORTFALL_CAUTION, SHORTFALL_DANGER, ABOVE_IDEAL = 0.10, 0.20, 0.05

_STATE = {
    "station_pressure": "abs_pressure",
    "boost_here": "gauge_pressure",
    "manifold_pressure": "abs_pressure",
    "pressure_ratio": None,
    "compressor_inlet_pressure": "abs_pressure",
    "compressor_outlet_pressure": "abs_pressure",
    "compressor_outlet_temperature": "temperature",
    "manifold_temperature": "temperature",
}
PRESSURE_RATIO_OUTPUTS = dict(_STATE, sea_level_boost="gauge_pressure", altitude_table={
    "altitude": "elevation", "station_pressure": "abs_pressure",
    **{c: {"boost_here": "gauge_pressure", "pressure_ratio": None, "warnings": None} for c in BOOST_CONTROLS},
})
POWER_OUTPUTS = dict(
    _STATE, air_mass_flow="air_mass_flow", ideal_power="power", expected_power="power", drive_power="power",
    pumping_power="power", measured_power="power", shortfall=None,
    causes={"code": None, "message": None, "power": "power"},
    altitude_table={
        "altitude": "elevation", "station_pressure": "abs_pressure",
        **{c: {"boost_here": "gauge_pressure", "pressure_ratio": None, "expected_power": "power", "warnings": None}
           for c in BOOST_CONTROLS},
    },
)
BOOST_FOR_POWER_OUTPUTS = {
    "station_pressure": "abs_pressure", "boost_ideal": "gauge_pressure", "boost": "gauge_pressure",
    "manifold_pressure": "abs_pressure", "pressure_ratio": None, "manifold_temperature": "temperature",
    "expected_power": "power", "max_expected_power": "power",
    "altitude_table": {"altitude": "elevation", "station_pressure": "abs_pressure", "boost_ideal": "gauge_pressure",
                       "boost": "gauge_pressure", "pressure_ratio": None},
}


def compressor_setup(inp, site, result):
    """Compressor and intercooler options with their defaults (recorded as assumptions)."""
    induction = option(inp, "induction", "turbo", result)
    setup = {
        "induction": induction,
        "inlet_loss": option(inp, "inlet_loss", 0.0, result, kind="gauge_pressure"),
        "intercooler_loss": option(inp, "intercooler_loss", 0.0, result, kind="gauge_pressure"),
        "efficiency": option(inp, "compressor_efficiency", compressor.DEFAULT_EFFICIENCY[induction], result),
        "effectiveness": option(inp, "intercooler_effectiveness", compressor.DEFAULT_INTERCOOLER_EFFECTIVENESS, result),
        "max_pressure_ratio": option(inp, "max_pressure_ratio", compressor.DEFAULT_MAX_PRESSURE_RATIO[induction], result),
        "coolant": inp.get("coolant_temperature"),
    }
    if setup["coolant"] is None:
        result.assume("coolant_temperature", site["temperature"], "temperature")
    return setup


def check_inlet(p_baro, setup):
    """A compressor inlet pressure at or below zero is the inlet loss's fault."""
    if p_baro - setup["inlet_loss"] <= 0:
        raise InputError("inlet_loss", "pressure_not_positive")


def state_warnings(ratio, Tm, boost, setup, codes):
    """Warnings of one operating point, as (code, severity) appended to ``codes``."""
    if ratio > setup["max_pressure_ratio"]:
        codes.append(("pressure_ratio_high", "danger"))
    elif ratio > compressor.CAUTION_PRESSURE_RATIO[setup["induction"]]:
        codes.append(("pressure_ratio_high", "caution"))
    if Tm > CHARGE_DANGER:
        codes.append(("charge_temperature_high", "danger"))
    elif Tm > CHARGE_CAUTION:
        codes.append(("charge_temperature_high", "caution"))
    if boost > 0 and setup["effectiveness"] == 0:
        codes.append(("no_intercooler", "info"))


def higher_here(boost_here, boost_set):
    return boost_here > boost_set * (1.0 + 1e-12) + 1e-9


def temperatures(T1, ratio, setup, coolant=None):
    T2 = compressor.outlet_temperature(T1, ratio, setup["efficiency"])
    coolant = setup["coolant"] if setup["coolant"] is not None else (T1 if coolant is None else coolant)
    return T2, compressor.intercooler_outlet_temperature(T2, coolant, setup["effectiveness"])


def boost_at_site(inp, site, setup, result):
    """Boost here: the input boost, or carried from ``boost_set_at`` by its control style."""
    boost = inp["boost"]
    if "boost_set_at" not in inp:
        return boost, None
    ref = resolve_site(inp["boost_set_at"].get("site"), result, "boost_set_at.site")
    check_inlet(ref["pressure"], setup)
    here = finite(compressor.boost_here(inp["boost_set_at"]["control"], boost, ref["pressure"], site["pressure"],
                                        setup["inlet_loss"], setup["intercooler_loss"]))
    if higher_here(here, boost):
        result.warn("boost_higher_here", "caution")
    return here, ref


def fill_state(result, site, boost_here, has_set_at, setup):
    map_abs, p1, p2, ratio = (finite(x) for x in compressor.pressures(
        site["pressure"], boost_here, setup["inlet_loss"], setup["intercooler_loss"]))
    T2, Tm = (finite(x) for x in temperatures(site["temperature"], ratio, setup))
    result.values.update(
        station_pressure=site["pressure"], boost_here=boost_here if has_set_at else None,
        manifold_pressure=map_abs, pressure_ratio=ratio, compressor_inlet_pressure=p1,
        compressor_outlet_pressure=p2, compressor_outlet_temperature=T2, manifold_temperature=Tm,
    )
    codes = []
    state_warnings(ratio, Tm, boost_here, setup, codes)
    for code in codes:
        result.warn(*code)
    return map_abs, ratio, T2, Tm


def sort_codes(codes):
    """Codes of (code, severity) pairs, danger first, then in the warning table's order."""
    unique = list(dict.fromkeys(codes))
    unique.sort(key=lambda c: (SEVERITY_ORDER.index(c[1]), WARNING_ORDER.index(c[0])))
    return [code for code, _ in dict.fromkeys(unique)]


def row_weather(inp, ref, setup):
    """Pressure and temperature at each altitude of the table, carried from ``ref``."""
    h = np.asarray(inp["altitudes"], dtype=float)
    p, T = atmosphere.carry_weather(h, ref["altitude"], ref["pressure"], ref["temperature"])
    check_inlet(float(np.min(p)), setup)
    return h, p, T


def control_table(inp, ref, boost_set, setup, expected=None):
    """Altitude table rows: per control style boost here, pressure ratio (and expected power)."""
    h, p, T = row_weather(inp, ref, setup)
    columns = {}
    for control in BOOST_CONTROLS:
        bh = compressor.boost_here(control, boost_set, ref["pressure"], p, setup["inlet_loss"], setup["intercooler_loss"])
        ratio = compressor.pressures(p, bh, setup["inlet_loss"], setup["intercooler_loss"])[3]
        T2, Tm = temperatures(T, ratio, setup)
        exp = None if expected is None else expected(bh, p, T)
        columns[control] = (bh, ratio, Tm, exp)
    rows = []
    for i in range(len(h)):
        row = {"altitude": float(h[i]), "station_pressure": float(p[i])}
        for control, (bh, ratio, Tm, exp) in columns.items():
            codes = []
            state_warnings(float(ratio[i]), float(Tm[i]), float(bh[i]), setup, codes)
            if higher_here(float(bh[i]), boost_set):
                codes.append(("boost_higher_here", "caution"))
            cell = {"boost_here": float(bh[i]), "pressure_ratio": float(ratio[i])}
            if exp is not None:
                cell["expected_power"] = float(exp[i])
            cell["warnings"] = sort_codes(codes)
            row[control] = cell
        rows.append(row)
    return rows


def pressure_ratio(inp):
    result = Result()
    site = resolve_site(inp.get("site"), result)
    setup = compressor_setup(inp, site, result)
    check_inlet(site["pressure"], setup)
    boost_here, ref = boost_at_site(inp, site, setup, result)
    map_abs = fill_state(result, site, boost_here, ref is not None, setup)[0]
    result.values["sea_level_boost"] = map_abs - atmosphere.P_SEA_LEVEL
    if "altitudes" in inp:
        result.values["altitude_table"] = control_table(inp, ref or site, inp["boost"], setup)
    return result


def na_reference(inp, site, setup, result):
    """The NA run: observed crank power, its site, and its air flow (SPEC section 4)."""
    scale = power_scale(inp, result)
    na_site = resolve_site(inp["na_site"], result, "na_site") if "na_site" in inp else site
    na_power = inp["na_power"] * scale
    if inp.get("na_power_basis", "observed") == "sae_j1349":
        na_power /= air(na_site, Result())[2]
    props = resolve_fuel(inp, result)
    bsfc_default, afr_default = fuel.na_air_defaults(props["afr"])
    bsfc = option(inp, "bsfc", bsfc_default, result, kind="bsfc")
    afr = option(inp, "afr", afr_default, result)
    if not 0.6 <= afr / props["afr"] <= 1.2:
        result.warn("afr_implausible", "caution")
    belt = setup["induction"] in BELT_DRIVEN
    drive_efficiency = 1.0
    if belt:
        drive_efficiency = option(inp, "drive_efficiency", compressor.DEFAULT_DRIVE_EFFICIENCY, result)
    return {
        "na_power": na_power, "p_na": na_site["pressure"], "T_na": na_site["temperature"],
        "na_air_mass_flow": na_power * bsfc * afr, "belt_driven": belt, "drive_efficiency": drive_efficiency,
    }


def exhaust_ratio(inp, setup, result):
    """Exhaust gauge pressure per unit boost: given, fixed by a back pressure at the boost, or default."""
    if "exhaust_back_pressure" in inp:
        if "exhaust_to_boost_ratio" in inp:
            raise InputError("exhaust_back_pressure", "both_given", other="exhaust_to_boost_ratio")
        ebp = inp["exhaust_back_pressure"]
        if ebp == 0:
            return 0.0
        if inp["boost"] <= 0:
            raise InputError("exhaust_back_pressure", "ebp_needs_boost")
        return ebp / inp["boost"]
    default = 0.0 if setup["induction"] in BELT_DRIVEN else 1.0
    return option(inp, "exhaust_to_boost_ratio", default, result)


def model(na, setup, ratio_exhaust):
    """Expected power as a function of (boost, station pressure, temperature) arrays."""
    def expected_state(boost, p_baro, T1):
        return power.expected_power(
            boost, p_baro=p_baro, T1=T1, inlet_loss=setup["inlet_loss"], intercooler_loss=setup["intercooler_loss"],
            efficiency=setup["efficiency"], effectiveness=setup["effectiveness"],
            T_coolant=setup["coolant"] if setup["coolant"] is not None else T1,
            exhaust_ratio=ratio_exhaust, **na)
    return expected_state


def power_check(inp):
    result = Result()
    site = resolve_site(inp.get("site"), result)
    setup = compressor_setup(inp, site, result)
    check_inlet(site["pressure"], setup)
    na = na_reference(inp, site, setup, result)
    state_of = model(na, setup, exhaust_ratio(inp, setup, result))
    boost_here, ref = boost_at_site(inp, site, setup, result)
    fill_state(result, site, boost_here, ref is not None, setup)
    s = {k: finite(v) for k, v in state_of(boost_here, site["pressure"], site["temperature"]).items()}
    result.values.update(
        air_mass_flow=s["air_mass_flow"], ideal_power=s["ideal"], expected_power=s["expected"],
        drive_power=s["drive"], pumping_power=s["pumping"], measured_power=None, shortfall=None, causes=None,
    )
    if "measured_power" in inp:
        judge_measured(inp, site, s, result)
    if "altitudes" in inp:
        result.values["altitude_table"] = control_table(
            inp, ref or site, inp["boost"], setup, lambda bh, p, T: state_of(bh, p, T)["expected"])
    return result


def judge_measured(inp, site, s, result):
    """Shortfall against expected, its warnings and the ranked causes (SPEC section 5)."""
    measured = inp["measured_power"] * result.power_scale
    if inp.get("measured_power_basis", "observed") == "sae_j1349":
        measured /= air(site, Result())[2]
        result.warn("correction_boosted", "info")
    shortfall = 1.0 - measured / s["expected"]
    result.values.update(measured_power=measured, shortfall=shortfall)
    if shortfall > SHORTFALL_DANGER:
        result.warn("shortfall_large", "danger")
    elif shortfall > SHORTFALL_CAUTION:
        result.warn("shortfall_large", "caution")
    if measured > s["ideal"] * (1.0 + ABOVE_IDEAL):
        result.warn("above_ideal", "caution")
    if shortfall > 0:
        modelled = [("charge_heat", s["ideal"] - s["gross"]), ("drive_loss", s["drive"]),
                    ("exhaust_back_pressure", max(0.0, -s["pumping"]))]
        ranked = sorted((c for c in modelled if c[1] > 0), key=lambda c: -c[1])
        generic = [("ignition_timing", None), ("fuel_delivery", None), ("boost_measurement", None)]
        result.values["causes"] = [{"code": code, "power": value} for code, value in ranked + generic]


def solve(target, na, setup, ratio_exhaust, p_baro, T1):
    """Ideal and expected boost for a target at one site (the binding algorithm)."""
    state_of = model(na, setup, ratio_exhaust)
    boost_ideal = finite(power.boost_for_ideal_power(target, na["na_power"], na["p_na"], p_baro))
    p1 = p_baro - setup["inlet_loss"]
    boost_max = compressor.highest_boost(setup["max_pressure_ratio"], p1, setup["intercooler_loss"], p_baro)
    boost, max_expected = power.boost_for_expected_power(
        target, boost_max, lambda b: state_of(b, p_baro, T1)["expected"])
    at_zero = finite(state_of(0.0, p_baro, T1)["expected"])
    below = target <= at_zero
    if below:
        boost = 0.0
    return boost_ideal, boost, max_expected, below, state_of


def boost_for_power(inp):
    result = Result()
    site = resolve_site(inp.get("site"), result)
    setup = compressor_setup(inp, site, result)
    check_inlet(site["pressure"], setup)
    na = na_reference(inp, site, setup, result)
    ratio_exhaust = exhaust_ratio(inp, setup, result)
    target = inp["target_power"] * result.power_scale
    boost_ideal, boost, max_expected, below, state_of = solve(
        target, na, setup, ratio_exhaust, site["pressure"], site["temperature"])
    result.values.update(station_pressure=site["pressure"], boost_ideal=boost_ideal, boost=boost,
                         max_expected_power=max_expected, manifold_pressure=None, pressure_ratio=None,
                         manifold_temperature=None, expected_power=None)
    if below:
        result.warn("target_below_na", "info")
    if boost is None:
        result.warn("target_unreachable", "caution")
    else:
        map_abs, ratio, _, Tm = fill_state(Result(), site, boost, False, setup)
        codes = []
        state_warnings(ratio, Tm, boost, setup, codes)
        for code in codes:
            result.warn(*code)
        result.values.update(manifold_pressure=map_abs, pressure_ratio=ratio, manifold_temperature=Tm,
                             expected_power=finite(state_of(boost, site["pressure"], site["temperature"])["expected"]))
    if "altitudes" in inp:
        h, p, T = row_weather(inp, site, setup)
        rows = []
        for i in range(len(h)):
            bi, b, _, _, _ = solve(target, na, setup, ratio_exhaust, float(p[i]), float(T[i]))
            ratio = None if b is None else finite(compressor.pressures(
                float(p[i]), b, setup["inlet_loss"], setup["intercooler_loss"])[3])
            rows.append({"altitude": float(h[i]), "station_pressure": float(p[i]), "boost_ideal": bi,
                         "boost": b, "pressure_ratio": ratio})
        result.values["altitude_table"] = rows
    return result

