"""A hand-written catalogue of hostile inputs: every one gets a 4xx in the one error body.

Each case names the endpoint, what is sent, the status expected and the field path the
error body must name (``None`` where no field is involved: the body is not JSON, is not a
JSON object, has the wrong content type or is too large). The expectations come from the
product contract (SPEC section 3: conventions, units table, hard ranges, error body) and
from RFC 8259 (JSON: NaN and Infinity are not numbers, section 6; text is UTF-8, section 8.1).
``tests/api/test_errors.py`` holds the first error tests; the cases here do not repeat them.
"""

import json

import pytest

# Bodies that are valid on their own (checked by test_base_bodies_are_valid), so that each
# case below fails only for the one thing it changes.
SITE = {"site": {}}
PR = {"boost": "1 bar"}
POWER = {"na_power": "300 hp", "boost": "1 bar"}
BFP = {"target_power": "400 hp", "na_power": "300 hp"}
AIR = {"power": "300 hp"}
INJ = {"power": "300 hp", "boost": "1 bar", "injector_count": 4}
PUMP = {"power": "300 hp", "boost": "1 bar"}
BASES = {"site": SITE, "pressure-ratio": PR, "power": POWER, "boost-for-power": BFP, "airflow": AIR,
         "injectors": INJ, "fuel-pump": PUMP}
ENGINE = {"displacement": "2 L", "rpm": 6000}


def w(base, *more, **changes):
    """A base body with some fields set (from dicts, then keywords)."""
    out = dict(base)
    for extra in more:
        out.update(extra)
    out.update(changes)
    return out


class Raw:
    """A request body sent as bytes, with its content type (None: no Content-Type header)."""

    def __init__(self, data, content_type="application/json"):
        self.data = data if isinstance(data, bytes) else data.encode("utf-8")
        self.content_type = content_type

    def __repr__(self):
        return f"Raw({self.data[:40]!r}..., {self.content_type!r})"


def curve(*pressures, flow="150 L/h"):
    return [{"pressure": p, "flow": flow} for p in pressures]


def nested_list(depth, leaf="1 m"):
    value = leaf
    for _ in range(depth):
        value = [value]
    return value


def nested_object(depth):
    value = {}
    for _ in range(depth):
        value = {"a": value}
    return value


# (id, endpoint, body, status, field named in the error body or None)
CASES = [
    # --- strings in number fields (SPEC 3: counts are integers, rpm a plain number)
    ("rpm-numeric-string", "airflow", w(AIR, ENGINE, rpm="6000"), 400, "rpm"),
    ("rpm-with-unit", "airflow", w(AIR, ENGINE, rpm="6000 rpm"), 400, "rpm"),
    ("afr-written-as-ratio", "power", w(POWER, afr="12.5:1"), 400, "afr"),
    ("count-as-word", "injectors", w(INJ, injector_count="four"), 400, "injector_count"),
    ("count-as-numeric-string", "fuel-pump", w(PUMP, pump_count="2"), 400, "pump_count"),
    ("ratio-as-string", "pressure-ratio", w(PR, max_pressure_ratio="3"), 400, "max_pressure_ratio"),
    ("quantity-value-string", "site", {"site": {"altitude": {"value": "1500", "unit": "m"}}}, 400, "site.altitude"),
    ("hex-number", "power", w(POWER, boost="0x1 bar"), 400, "boost"),
    ("unicode-minus", "pressure-ratio", w(PR, site={"temperature": "\u221210 degC"}), 400, "site.temperature"),
    # --- NaN and Infinity: not JSON numbers (RFC 8259, section 6), not numbers as strings (SPEC 3)
    ("nan-token", "site", Raw('{"site": {"altitude": {"value": NaN, "unit": "m"}}}'), 400, None),
    ("minus-infinity-token", "injectors",
     Raw('{"power": {"value": -Infinity, "unit": "hp"}, "boost": "1 bar", "injector_count": 4}'), 400, None),
    ("nan-token-as-count", "fuel-pump", Raw('{"power": "300 hp", "boost": "1 bar", "pump_count": NaN}'), 400, None),
    ("nan-string-quantity", "power", w(POWER, na_power="NaN hp"), 400, "na_power"),
    ("infinity-string-quantity", "boost-for-power", w(BFP, target_power="Infinity hp"), 400, "target_power"),
    ("inf-string-temperature", "site", {"site": {"temperature": "inf degC"}}, 400, "site.temperature"),
    ("nan-string-fraction", "injectors", w(INJ, max_duty="NaN"), 400, "max_duty"),
    ("infinity-percent", "site", {"site": {"relative_humidity": "Infinity %"}}, 400, "site.relative_humidity"),
    ("nan-string-number", "airflow", w(AIR, **{"lambda": "NaN"}), 400, "lambda"),
    ("nan-string-in-quantity-object", "fuel-pump", w(PUMP, boost={"value": "NaN", "unit": "bar"}), 400, "boost"),
    ("nan-string-count", "injectors", w(INJ, injector_count="NaN"), 400, "injector_count"),
    # --- 1e308 (finite, out of range or overflowing in SI) and 1e999 (parses to infinity)
    ("1e308-watts", "airflow", w(AIR, power={"value": 1e308, "unit": "W"}), 400, "power"),
    ("1e308-kpa-overflows-in-si", "site", {"site": {"station_pressure": "1e308 kPa"}}, 400, "site.station_pressure"),
    ("1e308-count", "injectors", w(INJ, injector_count=1e308), 400, "injector_count"),
    ("minus-1e308-fraction", "pressure-ratio", w(PR, intercooler_effectiveness=-1e308), 400,
     "intercooler_effectiveness"),
    ("1e999-token-number", "airflow", Raw('{"power": "300 hp", "displacement": "2 L", "rpm": 1e999}'), 400, "rpm"),
    ("1e999-token-count", "injectors", Raw('{"power": "300 hp", "boost": "1 bar", "injector_count": 1e999}'), 400,
     "injector_count"),
    ("1e999-token-in-quantity", "boost-for-power",
     Raw('{"target_power": {"value": 1e999, "unit": "kW"}, "na_power": "300 hp"}'), 400, "target_power"),
    ("1e999-string", "power", w(POWER, boost="1e999 psi"), 400, "boost"),
    # a finite SI result (3e305 kg/s) that overflows in the output unit (cc/min): SPEC 3,
    # "a result that is not finite is a 400 naming the inputs", never null or Infinity
    ("overflow-in-output-unit", "injectors", w(INJ, max_duty=2.2e-309), 400, "max_duty"),
    # --- counts: whole numbers within 1..64 injectors, 1..16 pumps and compressors (SPEC 3)
    ("count-negative-pumps", "fuel-pump", w(PUMP, pump_count=-1), 400, "pump_count"),
    ("count-fractional-pumps", "fuel-pump", w(PUMP, pump_count=1.5), 400, "pump_count"),
    ("count-fractional-compressors", "airflow", w(AIR, compressor_count=0.5), 400, "compressor_count"),
    ("count-negative-compressors", "airflow", w(AIR, compressor_count=-2), 400, "compressor_count"),
    ("count-zero-injectors", "injectors", w(INJ, injector_count=0), 400, "injector_count"),
    ("count-65-injectors", "injectors", w(INJ, injector_count=65), 400, "injector_count"),
    ("count-boolean", "injectors", w(INJ, injector_count=True), 400, "injector_count"),
    ("count-nearly-whole", "injectors", w(INJ, injector_count=4.000001), 400, "injector_count"),
    ("count-17-pumps", "fuel-pump", w(PUMP, pump_count=17), 400, "pump_count"),
    # --- wrong dimensions (SPEC 3, units table)
    ("power-in-psi", "power", w(POWER, na_power="300 psi"), 400, "na_power"),
    ("power-as-mass-flow", "airflow", w(AIR, power="300 kg/s"), 400, "power"),
    ("target-power-in-bar", "boost-for-power", w(BFP, target_power="300 bar"), 400, "target_power"),
    ("bsfc-in-horsepower", "injectors", w(INJ, bsfc="0.6 hp"), 400, "bsfc"),
    ("displacement-as-length", "airflow", w(AIR, ENGINE, displacement="2 m"), 400, "displacement"),
    ("fuel-density-as-mass", "fuel-pump", w(PUMP, fuel_density="0.75 kg"), 400, "fuel_density"),
    ("altitude-as-pressure", "site", {"site": {"altitude": "850 hPa"}}, 400, "site.altitude"),
    ("injector-flow-as-pressure", "injectors", w(INJ, injector_flow="550 bar"), 400, "injector_flow"),
    ("loss-as-temperature", "fuel-pump", w(PUMP, line_loss="5 degC"), 400, "line_loss"),
    ("measured-power-as-flow", "power", w(POWER, measured_power="400 cfm"), 400, "measured_power"),
    # --- unknown and misspelt units: the table is closed and case-sensitive (SPEC 3)
    ("unit-HP-uppercase", "boost-for-power", w(BFP, target_power="400 HP"), 400, "target_power"),
    ("unit-Bar-capitalised", "pressure-ratio", w(PR, boost="1 Bar"), 400, "boost"),
    ("unit-typo-pis", "power", w(POWER, boost="15 pis"), 400, "boost"),
    ("unit-plural-meters", "site", {"site": {"altitude": "2000 meters"}}, 400, "site.altitude"),
    ("unit-bhp", "power", w(POWER, na_power="300 bhp"), 400, "na_power"),
    ("unit-kpa-lowercase", "site", {"site": {"station_pressure": "95 kpa"}}, 400, "site.station_pressure"),
    ("unit-barg", "injectors", w(INJ, base_fuel_pressure="3 barg"), 400, "base_fuel_pressure"),
    ("unit-kPaa", "site", {"site": {"station_pressure": "95 kPaa"}}, 400, "site.station_pressure"),
    ("unit-unknown-in-object", "fuel-pump", w(PUMP, line_loss={"value": 1, "unit": "psid"}), 400, "line_loss"),
    ("unit-empty", "pressure-ratio", w(PR, boost={"value": 1, "unit": ""}), 400, "boost"),
    ("unit-not-a-string", "pressure-ratio", w(PR, boost={"value": 1, "unit": 5}), 400, "boost"),
    ("unit-missing", "power", w(POWER, boost={"value": 1}), 400, "boost"),
    # --- offset-unit traps: a temperature rate or difference is not a temperature
    ("degC-per-second-coolant", "pressure-ratio", w(PR, coolant_temperature="5 degC/s"), 400, "coolant_temperature"),
    ("delta-degC-for-temperature", "site", {"site": {"temperature": "10 delta_degC"}}, 400, "site.temperature"),
    ("delta-degF-for-reference", "airflow", w(AIR, reference_temperature="20 delta_degF"), 400,
     "reference_temperature"),
    ("kelvin-spelt-out", "power", w(POWER, site={"temperature": "293 kelvin"}), 400, "site.temperature"),
    ("celsius-as-bare-C", "site", {"site": {"temperature": "25 C"}}, 400, "site.temperature"),
    ("below-absolute-zero", "site", {"site": {"temperature": "-300 degC"}}, 400, "site.temperature"),
    ("zero-kelvin-reference", "airflow", w(AIR, reference_temperature="0 K"), 400, "reference_temperature"),
    ("negative-rankine-coolant", "power", w(POWER, coolant_temperature="-10 degR"), 400, "coolant_temperature"),
    # --- absurd elevations (site range -610 m to 11 000 m, SPEC 3)
    ("altitude-just-below-range", "site", {"site": {"altitude": "-700 m"}}, 400, "site.altitude"),
    ("altitude-ocean-trench", "site", {"site": {"altitude": "-11 km"}}, 400, "site.altitude"),
    ("altitude-in-space", "airflow", w(AIR, site={"altitude": "100000 ft"}), 400, "site.altitude"),
    ("altitude-1e6", "boost-for-power", w(BFP, site={"altitude": "1e6 m"}), 400, "site.altitude"),
    ("na-site-altitude", "power", w(POWER, na_site={"altitude": "50 km"}), 400, "na_site.altitude"),
    ("boost-set-at-altitude", "pressure-ratio",
     w(PR, boost_set_at={"site": {"altitude": "-5 km"}, "control": "held_gauge"}), 400, "boost_set_at.site.altitude"),
    ("altitude-table-row", "boost-for-power", w(BFP, altitudes=["0 m", "12 km"]), 400, "altitudes[1]"),
    ("altimeter-without-altitude", "site", {"site": {"altimeter_setting": "30 inHg"}}, 400, "site.altimeter_setting"),
    ("station-and-altimeter", "site",
     {"site": {"altitude": "100 m", "station_pressure": "99 kPa", "altimeter_setting": "101 kPa"}}, 400,
     "site.altimeter_setting"),
    # --- boost below full vacuum and absolute pressures at or below zero
    ("boost-below-vacuum-bar", "power", w(POWER, boost="-2 bar"), 400, "boost"),
    ("boost-full-vacuum-inHg", "pressure-ratio", w(PR, boost="-30 inHg"), 400, "boost"),
    ("boost-below-vacuum-object", "injectors", w(INJ, boost={"value": -20, "unit": "psi"}), 400, "boost"),
    ("boost-above-range", "fuel-pump", w(PUMP, boost="800 kPa"), 400, "boost"),
    ("station-pressure-zero", "site", {"site": {"station_pressure": "0 kPa"}}, 400, "site.station_pressure"),
    ("station-pressure-negative", "power", w(POWER, site={"station_pressure": "-5 psi"}), 400, "site.station_pressure"),
    ("reference-pressure-zero", "airflow", w(AIR, reference_pressure="0 kPa"), 400, "reference_pressure"),
    # --- duty and other fractions over 100 %
    ("duty-150-percent", "injectors", w(INJ, max_duty="150 %"), 400, "max_duty"),
    ("duty-just-over-1", "injectors", w(INJ, max_duty=1.01), 400, "max_duty"),
    ("duty-zero", "injectors", w(INJ, max_duty=0), 400, "max_duty"),
    ("duty-negative-percent", "injectors", w(INJ, max_duty="-5 %"), 400, "max_duty"),
    ("margin-200-percent", "fuel-pump", w(PUMP, margin=2), 400, "margin"),
    ("humidity-101-percent", "site", {"site": {"relative_humidity": "101 %"}}, 400, "site.relative_humidity"),
    ("humidity-boolean", "site", {"site": {"relative_humidity": True}}, 400, "site.relative_humidity"),
    ("efficiency-10-percent", "airflow", w(AIR, compressor_efficiency=0.1), 400, "compressor_efficiency"),
    ("drivetrain-loss-60-percent", "power", w(POWER, power_basis="wheel", drivetrain_loss=0.6), 400,
     "drivetrain_loss"),
    ("ethanol-150-percent", "injectors", w(INJ, ethanol_content="150 %"), 400, "ethanol_content"),
    # --- pump curves: 2 to 30 points, pressures strictly increasing, flows positive (SPEC 3)
    ("curve-unsorted", "fuel-pump", w(PUMP, pump_curve=curve("4 bar", "3 bar")), 400, "pump_curve[1].pressure"),
    ("curve-repeated-later", "fuel-pump", w(PUMP, pump_curve=curve("3 bar", "4 bar", "4 bar")), 400,
     "pump_curve[2].pressure"),
    ("curve-non-monotonic", "fuel-pump", w(PUMP, pump_curve=curve("3 bar", "5 bar", "4 bar", "6 bar")), 400,
     "pump_curve[2].pressure"),
    ("curve-same-pressure-other-units", "fuel-pump", w(PUMP, pump_curve=curve("3 bar", "300 kPa")), 400,
     "pump_curve[1].pressure"),
    ("curve-too-long", "fuel-pump", w(PUMP, pump_curve=curve(*[f"{i} bar" for i in range(1, 32)])), 400,
     "pump_curve"),
    ("curve-single-point-object-form", "fuel-pump",
     w(PUMP, pump_curve=[{"pressure": {"value": 4, "unit": "bar"}, "flow": {"value": 150, "unit": "L/h"}}]), 400,
     "pump_curve"),
    ("curve-empty", "fuel-pump", w(PUMP, pump_curve=[]), 400, "pump_curve"),
    ("curve-not-a-list", "fuel-pump", w(PUMP, pump_curve={"pressure": "3 bar", "flow": "150 L/h"}), 400,
     "pump_curve"),
    ("curve-point-not-an-object", "fuel-pump", w(PUMP, pump_curve=["3 bar", {"pressure": "4 bar", "flow": "1 L/h"}]),
     400, "pump_curve[0]"),
    ("curve-point-missing-flow", "fuel-pump", w(PUMP, pump_curve=[{"pressure": "3 bar"}] + curve("4 bar")), 400,
     "pump_curve[0].flow"),
    ("curve-point-extra-key", "fuel-pump",
     w(PUMP, pump_curve=[{"pressure": "3 bar", "flow": "1 L/h", "voltage": "12 V"}] + curve("4 bar")), 400,
     "pump_curve[0].voltage"),
    ("curve-negative-flow", "fuel-pump", w(PUMP, pump_curve=curve("3 bar") + curve("4 bar", flow="-5 L/h")), 400,
     "pump_curve[1].flow"),
    ("curve-pressure-as-flow", "fuel-pump", w(PUMP, pump_curve=curve("3 L/h", "4 bar")), 400,
     "pump_curve[0].pressure"),
    ("curve-flow-as-pressure", "fuel-pump", w(PUMP, pump_curve=curve("3 bar", "4 bar", flow="3 bar")), 400,
     "pump_curve[0].flow"),
    ("curve-pressure-too-high", "fuel-pump", w(PUMP, pump_curve=curve("3 bar", "25 MPa")), 400,
     "pump_curve[1].pressure"),
    ("curve-flow-bare-number", "fuel-pump", w(PUMP, pump_curve=curve("3 bar", "4 bar", flow=150)), 400,
     "pump_curve[1].flow"),
    # --- deeply nested JSON, huge arrays, huge strings (all within the 64 KiB limit)
    ("nested-lists-in-a-field", "site", {"site": {"altitude": nested_list(500)}}, 400, "site.altitude"),
    ("nested-objects-in-unknown-field", "pressure-ratio", w(PR, extra=nested_object(400)), 400, "extra"),
    ("nesting-beyond-the-parser", "power",
     Raw('{"na_power": "300 hp", "boost": ' + "[" * 25000 + "]" * 25000 + "}"), 400, None),
    ("huge-altitude-table", "power", w(POWER, altitudes=["0 m"] * 5000), 400, "altitudes"),
    ("altitude-table-51-rows", "pressure-ratio", w(PR, altitudes=["0 m"] * 51), 400, "altitudes"),
    ("huge-pump-curve", "fuel-pump", w(PUMP, pump_curve=[0] * 20000), 400, "pump_curve"),
    ("huge-string-quantity", "pressure-ratio", w(PR, boost="1" * 60000 + " bar"), 400, "boost"),
    ("huge-string-unit", "airflow", w(AIR, power="300 " + "h" * 60000), 400, "power"),
    ("huge-string-lang", "site", w(SITE, lang="de" * 20000), 400, "lang"),
    ("huge-string-choice", "injectors", w(INJ, fuel="e" * 60000), 400, "fuel"),
    ("huge-key", "airflow", w(AIR, **{"k" * 60000: 1}), 400, "k" * 60000),
    # --- invalid UTF-8 (RFC 8259, section 8.1) and lone surrogates (valid JSON escapes)
    ("invalid-utf8-byte", "pressure-ratio", Raw(b'{"boost": "1 \xff bar"}'), 400, None),
    ("overlong-utf8", "boost-for-power", Raw(b'{"target_power": "400 hp", "na_power": "3\xc0\xb0 hp"}'), 400, None),
    ("utf16-body", "site", Raw('{"site": {}}'.encode("utf-16")), 400, None),
    ("lone-surrogate-key", "power", w(POWER, **{"\ud800": 1}), 400, "\ud800"),
    ("lone-surrogate-in-unit", "airflow", w(AIR, power="300 h\udfff"), 400, "power"),
    # --- transport: content type (415), size (413), empty body and bodies that are not objects
    ("content-type-form", "pressure-ratio", Raw(b"boost=1+bar", "application/x-www-form-urlencoded"), 415, None),
    ("content-type-missing", "fuel-pump", Raw(json.dumps(PUMP), None), 415, None),
    ("content-type-multipart", "site", Raw(b"--x\r\n\r\n{}\r\n--x--", "multipart/form-data; boundary=x"), 415, None),
    ("content-type-json-lookalike", "airflow", Raw(json.dumps(AIR), "application/jsonx"), 415, None),
    ("oversized-body", "airflow", Raw(json.dumps(w(AIR, pad="x" * 70000))), 413, None),
    ("oversized-whitespace", "injectors", Raw(json.dumps(INJ) + " " * 65536), 413, None),
    ("empty-body", "power", Raw(b""), 400, None),
    ("whitespace-body", "boost-for-power", Raw(b" \r\n\t "), 400, None),
    ("truncated-json", "injectors", Raw(json.dumps(INJ)[:-1]), 400, None),
    ("trailing-garbage", "site", Raw(b'{"site": {}} {}'), 400, None),
    ("body-is-a-string", "site", Raw(b'"site"'), 400, None),
    ("body-is-a-number", "pressure-ratio", Raw(b"42"), 400, None),
    ("body-is-null", "airflow", Raw(b"null"), 400, None),
    ("body-is-true", "fuel-pump", Raw(b"true"), 400, None),
    ("body-is-an-array-of-objects", "power", Raw(json.dumps([POWER])), 400, None),
    # --- unknown fields: every key outside the endpoint's schema is a 400 naming it (SPEC 3)
    ("unknown-misspelt-nested", "site", {"site": {"elevation": "100 m"}}, 400, "site.elevation"),
    ("unknown-wrong-case", "pressure-ratio", {"Boost": "1 bar"}, 400, "Boost"),
    ("unknown-in-boost-set-at", "power",
     w(POWER, boost_set_at={"site": {}, "control": "held_gauge", "mode": "x"}), 400, "boost_set_at.mode"),
    ("unknown-field-of-other-endpoint", "site", w(SITE, boost="1 bar"), 400, "boost"),
    ("pump-field-on-injectors", "injectors", w(INJ, margin=0.2), 400, "margin"),
    ("back-pressure-on-boost-for-power", "boost-for-power", w(BFP, exhaust_back_pressure="1 bar"), 400,
     "exhaust_back_pressure"),
    ("unknown-empty-key", "airflow", w(AIR, **{"": 1}), 400, ""),
    # --- choices, objects and the request's own options
    ("lang-not-a-string", "power", w(POWER, lang=5), 400, "lang"),
    ("units-misspelt", "boost-for-power", w(BFP, units="metrics"), 400, "units"),
    ("output-units-not-an-object", "site", w(SITE, output_units="si"), 400, "output_units"),
    ("output-unit-not-a-string", "pressure-ratio", w(PR, output_units={"boost": 5}), 400, "output_units.boost"),
    ("output-unit-wrong-dimension", "injectors", w(INJ, output_units={"total_fuel_flow": "bar"}), 400,
     "output_units.total_fuel_flow"),
    ("output-unit-unknown-spelling", "airflow", w(AIR, output_units={"air_mass_flow": "lbs/min"}), 400,
     "output_units.air_mass_flow"),
    ("fuel-unknown", "fuel-pump", w(PUMP, fuel="diesel"), 400, "fuel"),
    ("fuel-not-a-string", "power", w(POWER, fuel=1), 400, "fuel"),
    ("induction-rotary", "injectors", w(INJ, induction="rotary"), 400, "induction"),
    ("regulator-misspelt", "fuel-pump", w(PUMP, regulator="boost-referenced"), 400, "regulator"),
    ("control-unknown", "pressure-ratio", w(PR, boost_set_at={"site": {}, "control": "held_rpm"}), 400,
     "boost_set_at.control"),
    ("boost-set-at-not-an-object", "power", w(POWER, boost_set_at="held_gauge"), 400, "boost_set_at"),
    ("site-not-an-object", "airflow", w(AIR, site="high"), 400, "site"),
    ("site-a-list", "site", {"site": []}, 400, "site"),
    ("altitudes-not-a-list", "pressure-ratio", w(PR, altitudes="0 m"), 400, "altitudes"),
    ("quantity-extra-key", "pressure-ratio", w(PR, boost={"value": 1, "unit": "bar", "gauge": True}), 400, "boost"),
    ("quantity-as-list", "power", w(POWER, boost=[1, "bar"]), 400, "boost"),
    ("required-null", "power", w(POWER, na_power=None), 400, "na_power"),
    ("required-missing", "boost-for-power", {"na_power": "300 hp"}, 400, "target_power"),
    # --- values outside their hard ranges and cross-field rules (SPEC 3)
    ("negative-power", "airflow", w(AIR, power="-300 hp"), 400, "power"),
    ("power-over-10-MW", "boost-for-power", w(BFP, target_power="20000 kW"), 400, "target_power"),
    ("bsfc-too-low", "injectors", w(INJ, bsfc="0.01 lb/hp/h"), 400, "bsfc"),
    ("lambda-3", "airflow", w(AIR, **{"lambda": 3}), 400, "lambda"),
    ("afr-boolean", "power", w(POWER, afr=False), 400, "afr"),
    ("rpm-too-low", "airflow", w(AIR, ENGINE, rpm=100), 400, "rpm"),
    ("rpm-without-displacement", "airflow", w(AIR, rpm=6000), 400, "displacement"),
    ("fuel-density-too-high", "fuel-pump", w(PUMP, fuel_density="1.5 kg/L"), 400, "fuel_density"),
    ("rating-fluid-density-as-volume", "injectors", w(INJ, rating_fluid_density="0.7 L"), 400,
     "rating_fluid_density"),
    ("exhaust-ratio-6", "power", w(POWER, exhaust_to_boost_ratio=6), 400, "exhaust_to_boost_ratio"),
    ("coolant-150-degC", "pressure-ratio", w(PR, coolant_temperature="150 degC"), 400, "coolant_temperature"),
    ("inlet-loss-60-kPa", "airflow", w(AIR, inlet_loss="60 kPa"), 400, "inlet_loss"),
    ("max-pressure-ratio-7", "boost-for-power", w(BFP, max_pressure_ratio=7), 400, "max_pressure_ratio"),
    ("na-engine-with-boost", "fuel-pump", w(PUMP, induction="na"), 400, "boost"),
    ("boosted-without-boost", "injectors", {"power": "300 hp", "injector_count": 4}, 400, "boost"),
    # --- routes and methods (SPEC 3: 404/405 as JSON with the same error body, empty fields)
    ("unknown-endpoint", "boost", Raw(json.dumps(PR)), 404, None),
    ("openapi-by-post", "openapi.json", Raw(b"{}"), 404, None),
]
IDS = [case[0] for case in CASES]
assert len(set(IDS)) == len(IDS), "case ids must be unique"


def send(client, endpoint, body, query=""):
    url = f"/api/v1/{endpoint}{query}"
    if isinstance(body, Raw):
        headers = {} if body.content_type is None else {"Content-Type": body.content_type}
        return client.post(url, data=body.data, headers=headers)
    return client.post(url, json=body)


def error_fields(response):
    """The fields named by the one error body of SPEC section 3, after checking its shape."""
    assert response.mimetype == "application/json", response.mimetype
    body = json.loads(response.data)
    assert set(body) == {"error"}, body
    assert set(body["error"]) == {"message", "fields"}, body
    assert isinstance(body["error"]["message"], str) and body["error"]["message"].strip(), body
    assert isinstance(body["error"]["fields"], list), body
    for item in body["error"]["fields"]:
        assert set(item) == {"field", "message"}, item
        assert isinstance(item["field"], str), item
        assert isinstance(item["message"], str) and item["message"].strip(), item
    return [item["field"] for item in body["error"]["fields"]]


def test_catalogue_size_and_coverage():
    # The brief for this catalogue: at least 45 cases, every endpoint at least once.
    assert len(CASES) >= 45
    assert set(BASES) <= {endpoint for _, endpoint, *_ in CASES}


@pytest.mark.parametrize("endpoint", sorted(BASES))
def test_base_bodies_are_valid(client, endpoint):
    r = send(client, endpoint, BASES[endpoint])
    assert r.status_code == 200, r.json


@pytest.mark.parametrize("case_id, endpoint, body, status, field", CASES, ids=IDS)
def test_hostile_input_gets_a_4xx_naming_the_field(client, case_id, endpoint, body, status, field):
    r = send(client, endpoint, body)
    assert r.status_code == status, (r.status_code, r.data[:300])
    fields = error_fields(r)
    if field is None:
        assert fields == [], fields
    else:
        assert field in fields, fields


@pytest.mark.parametrize("case_id, endpoint, body, status, field", CASES, ids=IDS)
def test_german_request_names_the_same_fields(client, case_id, endpoint, body, status, field):
    # The field paths are part of the contract, not text: they do not depend on the language.
    # (No assertion on the messages' language: catalogs are filled in separately.)
    english = send(client, endpoint, body, "?lang=en")
    german = send(client, endpoint, body, "?lang=de")
    assert german.status_code == english.status_code == status
    assert error_fields(german) == error_fields(english)


def test_non_ascii_digits_are_not_numbers(client):
    # SPEC section 3: "a number with `.` as decimal point"; the browser's engine reads ASCII
    # digits only, so the server must too (Python's float() also reads Arabic-Indic and
    # full-width digits).
    for text in ("\u0661 bar", "\uff11 bar", "1\u0660 bar"):
        r = send(client, "pressure-ratio", w(PR, boost=text))
        assert r.status_code == 400 and "boost" in error_fields(r), text
    r = send(client, "injectors", w(INJ, max_duty="\u0668\u0660 %"))
    assert r.status_code == 400 and "max_duty" in error_fields(r)


def test_every_error_of_a_request_is_reported(client):
    # Every field error is collected (not only the first): three bad fields, three paths.
    body = {"na_power": "300 psi", "boost": "-1 bar", "site": {"altitude": "20 km"}, "turbo": True}
    fields = error_fields(send(client, "power", body))
    assert {"na_power", "boost", "site.altitude", "turbo"} <= set(fields)


def test_body_lang_field_in_german_names_the_field(client):
    r = send(client, "injectors", w(INJ, injector_count=2.5, lang="de"))
    assert r.status_code == 400 and error_fields(r) == ["injector_count"]
    r = client.post("/api/v1/injectors", json=w(INJ, injector_count=2.5), headers={"Accept-Language": "de-DE,de;q=0.9"})
    assert r.status_code == 400 and error_fields(r) == ["injector_count"]
