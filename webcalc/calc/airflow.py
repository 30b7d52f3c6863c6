"""Airflow: air for a power, inlet volume flow, corrected flow, implied volumetric efficiency."""

from ..engine import airflow, fuel
from .boost import check_inlet, compressor_setup, fill_state
from .common import InputError, Result, option, power_scale, resolve_fuel, resolve_site

OUTPUTS = {
    "station_pressure": "abs_pressure",
    "air_mass_flow": "air_mass_flow",
    "air_volume_flow": "air_volume_flow",
    "corrected_air_flow": "air_mass_flow",
    "manifold_pressure": "abs_pressure",
    "pressure_ratio": None,
    "compressor_outlet_temperature": "temperature",
    "manifold_temperature": "temperature",
    "volumetric_efficiency": None,
}


def air_per_power(inp, props, result):
    """BSFC and AFR for the air flow: given, from lambda, or the gasoline-equivalent default."""
    if "afr" in inp and "lambda" in inp:
        raise InputError("lambda", "both_given", other="afr")
    bsfc_default, afr_default = fuel.na_air_defaults(props["afr"])
    bsfc = option(inp, "bsfc", bsfc_default, result, kind="bsfc")
    if "lambda" in inp:
        afr = inp["lambda"] * props["afr"]
    else:
        afr = option(inp, "afr", afr_default, result)
    if not 0.6 <= afr / props["afr"] <= 1.2:
        result.warn("afr_implausible", "caution")
    return bsfc, afr


def calculate(inp):
    result = Result()
    if ("displacement" in inp) != ("rpm" in inp):
        missing = "rpm" if "displacement" in inp else "displacement"
        raise InputError(missing, "required")
    scale = power_scale(inp, result)
    props = resolve_fuel(inp, result)
    bsfc, afr = air_per_power(inp, props, result)
    mass = airflow.air_mass_flow(inp["power"] * scale, bsfc, afr)
    site = resolve_site(inp.get("site"), result)
    setup = compressor_setup(inp, site, result)
    check_inlet(site["pressure"], setup)
    boost = option(inp, "boost", 0.0, result, kind="gauge_pressure")
    map_abs, ratio, T2, Tm = fill_state(result, site, boost, False, setup)
    p1, T1 = result.values["compressor_inlet_pressure"], site["temperature"]
    count = option(inp, "compressor_count", 1, result)
    p_ref = option(inp, "reference_pressure", airflow.DEFAULT_REFERENCE_PRESSURE, result, kind="abs_pressure")
    T_ref = option(inp, "reference_temperature", airflow.DEFAULT_REFERENCE_TEMPERATURE, result, kind="temperature")
    ve = None
    if "displacement" in inp:
        ve = float(airflow.volumetric_efficiency(mass, airflow.gas_density(map_abs, Tm), inp["displacement"], inp["rpm"]))
        lo, hi = airflow.PLAUSIBLE_VOLUMETRIC_EFFICIENCY
        if not lo <= ve <= hi:
            result.warn("volumetric_efficiency_implausible", "caution")
    result.values = {
        "station_pressure": site["pressure"],
        "air_mass_flow": float(mass),
        "air_volume_flow": float(airflow.volume_flow(mass, p1, T1)),
        "corrected_air_flow": float(airflow.corrected_flow(mass / count, p1, T1, p_ref, T_ref)),
        "manifold_pressure": map_abs,
        "pressure_ratio": ratio,
        "compressor_outlet_temperature": T2,
        "manifold_temperature": Tm,
        "volumetric_efficiency": ve,
    }
    return result
