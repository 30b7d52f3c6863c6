"""Injectors and fuel pump: sizing, duty, power limits (SPEC sections 3 and 4)."""

import numpy as np

from ..engine import fuel
from .common import InputError, Result, option, power_scale, resolve_fuel

#: Duty cycle above which injectors near static flow (common practice, from memory).
DUTY_CAUTION = 0.85
#: Pressure difference across the injectors below which atomisation suffers, [Pa] (common practice, from memory).
PRESSURE_DIFFERENCE_CAUTION = 2e5

INJECTOR_OUTPUTS = {
    "flow_per_injector": "injector_flow",
    "flow_at_operating_pressure": "injector_flow",
    "total_fuel_flow": "fuel_flow",
    "pressure_difference": "gauge_pressure",
    "injector_flow_at_operating_pressure": "injector_flow",
    "duty_at_power": None,
    "max_power": "power",
}
PUMP_OUTPUTS = {
    "required_flow": "pump_flow",
    "required_pressure": "gauge_pressure",
    "total_fuel_flow": "fuel_flow",
    "pressure_difference": "gauge_pressure",
    "available_flow": "pump_flow",
    "margin_available": None,
    "max_power": "power",
}


def fuel_system(inp, result):
    """Power, fuel, BSFC, boost and regulator shared by injectors and pump, with defaults."""
    scale = power_scale(inp, result)
    props = resolve_fuel(inp, result)
    induction = option(inp, "induction", "turbo", result)
    if induction == "na":
        if inp.get("boost", 0.0) > 0:
            raise InputError("boost", "no_boost_na")
        boost = 0.0
    elif "boost" not in inp:
        raise InputError("boost", "needs_boost")
    else:
        boost = inp["boost"]
    bsfc = option(inp, "bsfc", fuel.sizing_bsfc(induction, props["afr"]), result, kind="bsfc")
    base = option(inp, "base_fuel_pressure", fuel.DEFAULT_FUEL_PRESSURE, result, kind="gauge_pressure")
    regulator = option(inp, "regulator", "boost_referenced", result)
    difference = float(fuel.injector_pressure_difference(base, boost, regulator))
    if difference <= 0:
        result.warn("pressure_difference_low", "danger")
    elif difference < PRESSURE_DIFFERENCE_CAUTION:
        result.warn("pressure_difference_low", "caution")
    power = inp["power"] * scale
    return {"power": power, "density": props["density"], "bsfc": bsfc, "boost": boost, "base": base,
            "regulator": regulator, "difference": difference, "fuel_mass_flow": float(fuel.fuel_mass_flow(power, bsfc))}


def duty_warnings(duty, max_duty, result):
    if duty >= 1.0:
        result.warn("duty_cycle_high", "danger")
    elif duty > DUTY_CAUTION:
        result.warn("duty_cycle_high", "caution")


def given_rating(inp, rho_fuel, result):
    """The given injector's mass-flow rating, corrected for a volumetric test fluid."""
    rating = inp["injector_flow"]
    if rating[1] == "volume_flow":
        volume = rating[0]
        if "rating_fluid_density" in inp:
            volume = volume * float(fuel.rating_fluid_scale(rho_fuel, inp["rating_fluid_density"]))
        else:
            result.warn("rating_fluid_unknown", "info")
        return volume * rho_fuel
    return rating[0]


def injectors(inp):
    result = Result()
    s = fuel_system(inp, result)
    count = inp["injector_count"]
    max_duty = option(inp, "max_duty", fuel.DEFAULT_MAX_DUTY, result)
    rated = option(inp, "rated_pressure", fuel.DEFAULT_FUEL_PRESSURE, result, kind="gauge_pressure")
    values = dict.fromkeys(INJECTOR_OUTPUTS)
    values.update(total_fuel_flow=s["fuel_mass_flow"], pressure_difference=s["difference"])
    if "injector_flow" in inp:
        values["max_power"] = 0.0
    if s["difference"] > 0:
        need = float(fuel.injector_flow_needed(s["power"], s["bsfc"], count, max_duty))
        values["flow_at_operating_pressure"] = need
        values["flow_per_injector"] = need * float(fuel.orifice_scale(rated, s["difference"]))
        if "injector_flow" in inp:
            at_operating = given_rating(inp, s["density"], result) * float(fuel.orifice_scale(s["difference"], rated))
            duty = float(fuel.injector_duty(s["power"], s["bsfc"], count, at_operating))
            values.update(injector_flow_at_operating_pressure=at_operating, duty_at_power=duty,
                          max_power=float(fuel.injector_max_power(at_operating, count, max_duty, s["bsfc"])))
            duty_warnings(duty, max_duty, result)
            if duty > max_duty:
                result.warn("injector_too_small", "caution")
        else:
            duty_warnings(max_duty, max_duty, result)
    elif "injector_flow" in inp and inp["injector_flow"][1] == "volume_flow" and "rating_fluid_density" not in inp:
        result.warn("rating_fluid_unknown", "info")
    result.values = values
    return result


def pump_curve(inp, density):
    """Pump-curve points in SI (pressure [Pa], volume flow [m^3/s]), checked for order."""
    points = inp["pump_curve"]
    pressures = [p["pressure"] for p in points]
    for i in range(1, len(pressures)):
        if pressures[i] <= pressures[i - 1]:
            raise InputError(f"pump_curve[{i}].pressure", "curve_increasing")
    return pressures, [p["flow"].to("volume_flow", density) for p in points]


def fuel_pump(inp):
    result = Result()
    s = fuel_system(inp, result)
    margin = option(inp, "margin", fuel.DEFAULT_PUMP_MARGIN, result)
    line_loss = option(inp, "line_loss", 0.0, result, kind="gauge_pressure")
    count = option(inp, "pump_count", 1, result)
    values = dict.fromkeys(PUMP_OUTPUTS)
    need = s["fuel_mass_flow"] / s["density"]
    pressure = float(fuel.pump_required_pressure(s["base"], s["boost"], s["regulator"], line_loss))
    values.update(
        required_flow=float(fuel.pump_required_flow(s["power"], s["bsfc"], s["density"], margin)),
        required_pressure=pressure, total_fuel_flow=s["fuel_mass_flow"], pressure_difference=s["difference"],
    )
    if "pump_curve" in inp:
        pressures, flows = pump_curve(inp, s["density"])
        flow, extrapolated = fuel.pump_curve_flow(pressures, flows, pressure)
        available = count * float(flow)
        result.warn("pump_voltage", "info")
        if bool(np.any(extrapolated)):
            result.warn("pump_curve_extrapolated", "caution")
        margin_available = available / need - 1.0
        if available < need:
            result.warn("pump_margin_low", "danger")
        elif margin_available < margin:
            result.warn("pump_margin_low", "caution")
        values.update(available_flow=available, margin_available=margin_available,
                      max_power=available * s["density"] / (s["bsfc"] * (1.0 + margin)))
    result.values = values
    return result
