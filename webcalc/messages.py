"""Every user-facing message of the API, by code, as gettext message ids (English).

Babel extracts the ``N_()`` markers; :mod:`webcalc.i18n` translates at response time.
Messages hold no formatted result numbers (the browser engine gives the same texts);
placeholders in ``%(name)s`` form are filled with plain values (field limits, units).
"""


def N_(message):
    """Mark a message for extraction without translating it here."""
    return message


#: Warnings (SPEC section 5), in the order of its table; keyed by (code, severity).
WARNINGS = {
    ("pressure_ratio_high", "caution"): N_(
        "Pressure ratio is high for this compressor type: check the compressor map; at altitude the turbo spins faster for the same boost."),
    ("pressure_ratio_high", "danger"): N_(
        "Pressure ratio is above the highest ratio set for this compressor: it may overspeed or surge. Reduce boost."),
    ("charge_temperature_high", "caution"): N_(
        "Charge air is hot (above 60 °C): knock risk rises; consider more intercooling or less boost."),
    ("charge_temperature_high", "danger"): N_(
        "Charge air is very hot (above 80 °C): high knock risk. Reduce boost or improve intercooling."),
    ("boost_higher_here", "caution"): N_(
        "Boost here is higher than where it was set: the engine needs more fuel and knock risk rises."),
    ("no_intercooler", "info"): N_(
        "No intercooler: the charge enters the engine at the compressor outlet temperature."),
    ("shortfall_large", "caution"): N_(
        "Measured power is more than 10 % below expected: see the likely causes."),
    ("shortfall_large", "danger"): N_(
        "Measured power is more than 20 % below expected: stop and find the cause before adding boost."),
    ("above_ideal", "caution"): N_(
        "Measured power is more than 5 % above the ideal: check the boost gauge, the barometer and the claim."),
    ("target_unreachable", "caution"): N_(
        "The target needs a higher pressure ratio than the highest set for this compressor."),
    ("target_below_na", "info"): N_(
        "The target is reached without boost."),
    ("duty_cycle_high", "caution"): N_(
        "Injector duty cycle is above 85 %: injectors go static near 100 %; leave headroom."),
    ("duty_cycle_high", "danger"): N_(
        "Injector duty cycle is at or above 100 %: the injectors are static and the engine will run lean."),
    ("injector_too_small", "caution"): N_(
        "These injectors need more than the allowed duty cycle for this power: choose larger injectors or more fuel pressure."),
    ("pressure_difference_low", "caution"): N_(
        "Pressure across the injectors is below 2 bar: atomisation and flow suffer."),
    ("pressure_difference_low", "danger"): N_(
        "No pressure across the injectors at this boost: they cannot deliver fuel. Use a boost-referenced regulator or more fuel pressure."),
    ("pump_margin_low", "caution"): N_(
        "The pump keeps up, but with less margin than requested."),
    ("pump_margin_low", "danger"): N_(
        "The pump cannot supply the fuel needed at this pressure: the engine will run lean."),
    ("pump_curve_extrapolated", "caution"): N_(
        "The required pressure lies outside the pump curve: its flow is extrapolated."),
    ("pump_voltage", "info"): N_(
        "Pump curves hold at their rated voltage only: a lower voltage at the pump gives less flow."),
    ("rating_fluid_unknown", "info"): N_(
        "The injector rating is a volume flow without its test fluid: a lighter test fluid overstates the fuel flow by a few percent."),
    ("ethanol_compatibility", "info"): N_(
        "Ethanol and methanol need compatible fuel-system parts and more fuel flow."),
    ("afr_implausible", "caution"): N_(
        "This air-fuel ratio is implausible for this fuel: is it a gasoline-scale reading?"),
    ("volumetric_efficiency_implausible", "caution"): N_(
        "Implied volumetric efficiency is implausible: check the power, displacement and rpm."),
    ("correction_out_of_range", "caution"): N_(
        "Conditions are outside the range of SAE J1349 (15 to 35 °C, 90 to 105 kPa dry air): the correction is less reliable."),
    ("beyond_troposphere", "info"): N_(
        "Density altitude lies above 11 km: the standard-atmosphere law is extrapolated."),
    ("drivetrain_loss_estimate", "info"): N_(
        "Wheel power is converted with an estimated drivetrain loss: treat crank figures as estimates."),
    ("correction_boosted", "info"): N_(
        "SAE J1349 correction overstates a boosted engine whose boost control holds manifold pressure."),
}
SEVERITY_ORDER = ("danger", "caution", "info")
WARNING_ORDER = tuple(dict.fromkeys(code for code, _ in WARNINGS))

#: General cautions (SPEC section 6), always shown.
CAUTIONS = {
    "estimates_only": N_(
        "These are estimates, not guarantees: verify on a dyno with wideband lambda and knock monitoring, and raise boost in small steps."),
    "engine_limits": N_(
        "Engines and drivetrains have limits: more boost can destroy them."),
    "fuel_safety": N_(
        "Fuel is flammable, and ethanol and methanol attack some materials: use fuel-rated parts, and wiring and fusing sized for the pump."),
    "rules": N_(
        "Follow local laws, emissions rules and your sanctioning body's rules; have work done or checked by qualified professionals."),
}

#: Causes of a shortfall (SPEC section 5).
CAUSES = {
    "charge_heat": N_("Charge heat: hot charge air carries less oxygen; check intercooling and compressor efficiency."),
    "drive_loss": N_("Blower drive: the supercharger takes power from the crank; check drive ratio and belt slip."),
    "exhaust_back_pressure": N_("Exhaust back pressure: pressure before the turbine pushes back on the pistons; check turbine size and exhaust."),
    "ignition_timing": N_("Ignition timing: check for knock and retard; never advance timing blindly."),
    "fuel_delivery": N_("Fuel delivery: check fuel pressure under boost, injector duty and lambda."),
    "boost_measurement": N_("Boost measurement: check the gauge, its reference and leaks in the intake."),
}

#: Error messages; placeholders are filled with plain values.
ERRORS = {
    "invalid_request": N_("The request has errors."),
    "malformed_json": N_("The body is not valid JSON."),
    "not_object": N_("The body must be a JSON object."),
    "unsupported_media_type": N_("Send the request as JSON (Content-Type: application/json)."),
    "too_large": N_("The request body is larger than 64 KiB."),
    "not_found": N_("Not found."),
    "method_not_allowed": N_("Method not allowed."),
    "required": N_("This field is required."),
    "unknown_field": N_("Unknown field."),
    "quantity_bare_number": N_("A unit is required, for example \"15 psi\" or {\"value\": 15, \"unit\": \"psi\"}."),
    "quantity_format": N_("Expected a quantity such as \"15 psi\" or {\"value\": 15, \"unit\": \"psi\"}."),
    "unit_unknown": N_("Unknown unit \"%(unit)s\". Accepted: %(accepted)s."),
    "unit_wrong_dimension": N_("The unit \"%(unit)s\" does not fit this field. Accepted: %(accepted)s."),
    "unit_gauge_absolute": N_("Write \"%(unit)s\" without g or a: this field says whether it is gauge or absolute."),
    "fraction_format": N_("Expected a number or a percentage such as \"80 %\"."),
    "number_format": N_("Expected a number."),
    "count_format": N_("Expected a whole number."),
    "choice": N_("Expected one of: %(choices)s."),
    "object": N_("Expected an object."),
    "list": N_("Expected a list."),
    "string": N_("Expected a string."),
    "range": N_("Must be from %(min)s to %(max)s %(unit)s."),
    "range_above": N_("Must be above %(min)s and at most %(max)s %(unit)s."),
    "range_plain": N_("Must be from %(min)s to %(max)s."),
    "range_above_plain": N_("Must be above %(min)s and at most %(max)s."),
    "list_length": N_("Expected from %(min)s to %(max)s entries."),
    "both_given": N_("Give either this field or %(other)s, not both."),
    "needs": N_("This field needs %(other)s."),
    "not_for_fuel": N_("Only gasoline and e85 take an ethanol content."),
    "needs_wheel_loss": N_("Wheel power needs drivetrain_loss."),
    "needs_boost": N_("Boost is required for a boosted engine: a default of 0 would hide a lean condition."),
    "no_boost_na": N_("An NA engine has no boost."),
    "pressure_not_positive": N_("This value makes an absolute pressure zero or negative."),
    "curve_increasing": N_("Pump-curve pressures must be strictly increasing."),
    "curve_flow_positive": N_("Pump-curve flows must be above 0."),
    "output_unit_field": N_("No field of this name in this calculation."),
    "not_finite": N_("These inputs give a result that is not finite."),
    "ebp_needs_boost": N_("An exhaust back pressure needs boost above 0 (it fixes the exhaust-to-boost ratio)."),
}
