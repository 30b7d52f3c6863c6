"""Hardening properties of the API that guards the engine (hypothesis).

The engine only documents its ranges (the ``VALID`` dicts); the API's field definitions
enforce them, so "just beyond the range" is checked here: one float past each end of every
ranged field of every endpoint, and in every accepted unit. Also: in-range bodies give
finite JSON; the same physical input in any units gives the same SI result; monotonicity
and inverses through the calculation layer (injectors, fuel pump, power against
boost-for-power, site). The engine's own properties are in ``tests/engine/test_hardening.py``.
"""

import json
import math
import re

import pytest
from hypothesis import assume, event, example, given, settings
from hypothesis import strategies as st

from webcalc import units
from webcalc.engine import compressor as comp
from webcalc.engine import atmosphere as atm
from strategies import (  # tests/ is on the path
    A, C, F, P, AF, API, altitude, station_p, altimeter, boost, loss, eta, density, ethanol,
    duty, margin, fuel_p, eps, coolant, eta_drive, injectors, pr_max, temperature, humidity,
    watts, bsfc, afr, inside, pump_curves)

# --- The API: just beyond each end of every range is refused, naming the field ----------------------

BASE = {
    "site": {},
    "pressure-ratio": {"boost": "1 bar"},
    "power": {"na_power": "200 kW", "boost": "1 bar"},
    "boost-for-power": {"target_power": "300 kW", "na_power": "200 kW"},
    "airflow": {"power": "300 kW"},
    "injectors": {"power": "300 kW", "boost": "1 bar", "injector_count": 6},
    "fuel-pump": {"power": "300 kW", "boost": "1 bar"},
}
BOOSTED = ("pressure-ratio", "power", "boost-for-power", "airflow")
NA_RUN = ("power", "boost-for-power")
FUEL_SYSTEM = ("injectors", "fuel-pump")
# extra fields a value needs to be accepted at all (SPEC section 3 cross-field rules)
COMPANIONS = {"drivetrain_loss": {"power_basis": "wheel"}, "rpm": {"displacement": {"value": 2e-3, "unit": "m^3"}},
              "displacement": {"rpm": 6000}}


def cases():
    out = []

    def add(endpoints, path, valid, key, unit, open_low=False):
        lo, hi = valid[key]
        out.extend((ep, path, lo, hi, open_low, unit) for ep in endpoints)

    for prefix, site_endpoints in (("site.", ("site",) + BOOSTED), ("na_site.", NA_RUN),
                                   ("boost_set_at.site.", BOOSTED[:2])):
        for name, unit in (("altitude", "m"), ("station_pressure", "Pa"), ("altimeter_setting", "Pa"),
                           ("temperature", "K"), ("relative_humidity", "frac")):
            add(site_endpoints, prefix + name, A, name, unit)
    add(BOOSTED[:3], "altitudes[0]", A, "altitude", "m")
    add(("pressure-ratio", "power", "airflow") + FUEL_SYSTEM, "boost", C, "boost", "Pa")
    add(BOOSTED, "inlet_loss", C, "loss", "Pa")
    add(BOOSTED, "intercooler_loss", C, "loss", "Pa")
    add(("fuel-pump",), "line_loss", C, "loss", "Pa")
    add(BOOSTED, "compressor_efficiency", C, "efficiency", "frac")
    add(BOOSTED, "intercooler_effectiveness", C, "effectiveness", "frac")
    add(BOOSTED, "coolant_temperature", C, "coolant_temperature", "K")
    add(BOOSTED, "max_pressure_ratio", C, "max_pressure_ratio", None, open_low=True)
    add(("power",), "exhaust_back_pressure", C, "exhaust_back_pressure", "Pa")
    add(NA_RUN, "drive_efficiency", C, "drive_efficiency", "frac")
    add(NA_RUN, "na_power", P, "power", "W", open_low=True)
    add(("boost-for-power",), "target_power", P, "power", "W", open_low=True)
    add(("power",), "measured_power", P, "power", "W", open_low=True)
    add(("airflow",) + FUEL_SYSTEM, "power", P, "power", "W", open_low=True)
    add(NA_RUN + ("airflow",) + FUEL_SYSTEM, "drivetrain_loss", P, "drivetrain_loss", "frac")
    add(NA_RUN + ("airflow",) + FUEL_SYSTEM, "bsfc", F, "bsfc", "kg/J")
    add(NA_RUN + ("airflow",) + FUEL_SYSTEM, "ethanol_content", F, "ethanol_content", "frac")
    add(NA_RUN + ("airflow",), "afr", F, "afr", None)
    add(("airflow",), "lambda", F, "lambda", None)
    add(("airflow",), "displacement", AF, "displacement", "m^3")
    add(("airflow",), "rpm", AF, "rpm", None)
    add(("airflow",), "reference_pressure", AF, "reference_pressure", "Pa")
    add(("airflow",), "reference_temperature", AF, "reference_temperature", "K")
    add(("airflow",), "compressor_count", AF, "compressor_count", "count")
    add(("injectors",), "injector_count", F, "injector_count", "count")
    add(("injectors",), "max_duty", F, "duty", "frac", open_low=True)
    add(("injectors",), "rated_pressure", F, "fuel_pressure", "Pa")
    add(("injectors",), "rating_fluid_density", F, "fuel_density", "kg/m^3")
    add(FUEL_SYSTEM, "base_fuel_pressure", F, "fuel_pressure", "Pa")
    add(FUEL_SYSTEM, "fuel_density", F, "fuel_density", "kg/m^3")
    add(("fuel-pump",), "margin", F, "margin", "frac")
    add(("fuel-pump",), "pump_count", F, "pump_count", "count")
    # open-ended flows: only "above 0" is a range (SPEC section 3: flows positive)
    out.append(("injectors", "injector_flow", 0.0, None, True, "kg/s"))
    out.append(("fuel-pump", "pump_curve[1].flow", 0.0, None, True, "m^3/s"))
    return out


CASES = cases()


def encode(value, unit):
    if unit == "count":
        return int(value)
    return value if unit in (None, "frac") else {"value": value, "unit": unit}


def body_with(endpoint, path, raw):
    """The endpoint's base body with one field set (dotted path), plus what it needs."""
    body = json.loads(json.dumps(BASE[endpoint]))
    for name, value in COMPANIONS.get(path, {}).items():
        body[name] = value
    if path.startswith("boost_set_at."):
        body["boost_set_at"] = {"site": {}, "control": "held_gauge"}
    if path.endswith("altimeter_setting"):
        parent = path.rsplit(".", 1)[0]
        node = body
        for key in parent.split("."):
            node = node.setdefault(key, {})
        node["altitude"] = {"value": 0.0, "unit": "m"}
    if path == "altitudes[0]":
        body["altitudes"] = [raw]
    elif path == "pump_curve[1].flow":
        body["pump_curve"] = [{"pressure": "2 bar", "flow": "200 L/h"}, {"pressure": "6 bar", "flow": raw}]
    else:
        *parents, leaf = path.split(".")
        node = body
        for key in parents:
            node = node.setdefault(key, {})
        node[leaf] = raw
    return body


@pytest.fixture(scope="module")
def call(app):
    """POST a JSON body to an endpoint (module-scoped: hypothesis runs many inputs per test)."""
    client = app.test_client()
    return lambda endpoint, body: client.post(f"/api/v1/{endpoint}", json=body)


def named(response):
    return [f["field"] for f in response.json["error"]["fields"]]


def beyond(lo, hi, open_low, unit):
    """The values one step past each end: (side, value)."""
    out = []
    if unit == "count":
        return [("low", lo - 1), ("high", hi + 1)]
    out.append(("low", lo if open_low else past(lo, -1)))
    if open_low:
        out.append(("below", math.nextafter(lo, -math.inf)))
    if hi is not None:
        out.append(("high", past(hi, 1)))
    return out


def past(end, sign):
    """The nearest value beyond a closed end that is not taken as the end: within 1e-12
    relative the API treats a value as the end (webcalc/api/fields.py RANGE_END_TOLERANCE,
    so "-60 degC" = 213.14999999999998 K is -60 degC); at 0 the next float already is out."""
    if end == 0:
        return math.nextafter(0.0, sign * math.inf)
    return end + sign * abs(end) * 1e-11


@pytest.mark.parametrize("endpoint, path, lo, hi, open_low, unit",
                         CASES, ids=[f"{c[0]}:{c[1]}" for c in CASES])
def test_one_step_beyond_either_end_is_a_400_naming_the_field(call, endpoint, path, lo, hi, open_low, unit):
    # SPEC section 3: outside its hard range a value is a 400 naming the field; the ends of a
    # closed range are accepted (a 200 from the base body, which is valid on its own)
    for side, value in beyond(lo, hi, open_low, unit):
        r = call(endpoint, body_with(endpoint, path, encode(value, unit)))
        assert r.status_code == 400, (side, value)
        assert path in named(r), (side, value, r.json)
        if unit not in (None, "frac", "count"):
            message = next(f["message"] for f in r.json["error"]["fields"] if f["field"] == path)
            assert unit in message  # the range is shown in the user's unit
    ends = ([] if open_low else [lo]) + ([] if hi is None else [hi])
    if open_low and hi is not None:
        ends.append(lo + 1e-6 * (hi - lo))
    for value in ends:
        r = call(endpoint, body_with(endpoint, path, encode(value, unit)))
        assert r.status_code == 200, (value, r.json)


# SI = value x factor + offset, written out from NIST SP 811 (2008) Appendix B (exact
# definitions; inHg and mmHg conventional as in SPEC section 3, metric hp 735.49875 W) rather
# than taken from the project, so a wrong factor anywhere on the way in shows as a difference
LB, FT, IN, GAL, HP_W = 0.45359237, 0.3048, 0.0254, 3.785411784e-3, 745.69987158227
NIST_SI = {
    "pressure": {"Pa": 1.0, "hPa": 100.0, "kPa": 1e3, "MPa": 1e6, "mbar": 100.0, "bar": 1e5,
                 "psi": LB * 9.80665 / IN**2, "inHg": 3386.389, "mmHg": 133.322387415, "atm": 101325.0},
    "temperature": {"K": (1.0, 0.0), "degC": (1.0, 273.15), "°C": (1.0, 273.15), "degF": (5 / 9, 459.67 * 5 / 9),
                    "°F": (5 / 9, 459.67 * 5 / 9), "degR": (5 / 9, 0.0)},
    "length": {"m": 1.0, "km": 1e3, "ft": FT},
    "volume": {"L": 1e-3, "cc": 1e-6, "in^3": IN**3, "m^3": 1.0},
    "power": {"W": 1.0, "kW": 1e3, "hp": HP_W, "PS": 735.49875, "CV": 735.49875},
    "mass_flow": {"kg/s": 1.0, "kg/min": 1 / 60, "kg/h": 1 / 3600, "g/s": 1e-3, "g/min": 1e-3 / 60,
                  "lb/h": LB / 3600, "lb/min": LB / 60},
    "volume_flow": {"cc/min": 1e-6 / 60, "L/h": 1e-3 / 3600, "L/min": 1e-3 / 60, "gal/h": GAL / 3600,
                    "gal/min": GAL / 60, "m^3/s": 1.0, "m^3/min": 1 / 60, "ft^3/min": FT**3 / 60, "cfm": FT**3 / 60},
    "density": {"kg/m^3": 1.0, "kg/L": 1e3, "g/cm^3": 1e3, "lb/gal": LB / GAL},
    "bsfc": {"lb/hp/h": LB / (HP_W * 3600), "g/kWh": 1e-3 / 3.6e6, "kg/J": 1.0},
}


def test_the_independent_factor_table_covers_the_closed_unit_table():
    # SPEC section 3 (binding unit table): the same spellings, and the project's factors agree
    assert {d: set(u) for d, u in NIST_SI.items()} == {d: set(u) for d, u in units.UNITS.items()}
    for dimension, table in NIST_SI.items():
        for unit, factor in table.items():
            want = factor if isinstance(factor, tuple) else (factor, 0.0)
            assert units.conversion(dimension, unit) == (pytest.approx(want[0], rel=1e-12),
                                                         pytest.approx(want[1], rel=1e-12, abs=1e-12))


def expressed(si, dimension, unit):
    factor = NIST_SI[dimension][unit]
    factor, offset = factor if isinstance(factor, tuple) else (factor, 0.0)
    return (si - offset) / factor


@settings(max_examples=150, deadline=None, database=None)
@given(st.sampled_from([c for c in CASES if c[5] not in ("count",)]), st.booleans(), st.floats(1e-6, 1.0),
       st.data())
def test_beyond_the_range_in_any_unit_is_a_400_naming_the_field(call, case, high, excess, data):
    # the same hard range whatever the unit the value comes in (SPEC section 3)
    endpoint, path, lo, hi, open_low, unit = case
    span = (hi - lo) if hi is not None else 1.0
    si = hi + excess * span if (high and hi is not None) else lo - excess * span
    if unit is None:  # a plain number (ratios, rpm)
        raw = si
    elif unit == "frac":  # a dimensionless value, plain or in percent
        raw = data.draw(st.sampled_from([si, f"{si * 100.0!r} %"]))
    else:
        dimension = units.dimension_of(unit)
        spelling = data.draw(st.sampled_from(list(units.UNITS[dimension])))
        raw = {"value": expressed(si, dimension, spelling), "unit": spelling}
    r = call(endpoint, body_with(endpoint, path, raw))
    assert r.status_code == 400 and path in named(r), r.json
    if unit not in (None, "frac"):
        message = next(f["message"] for f in r.json["error"]["fields"] if f["field"] == path)
        assert raw["unit"] in message


SPEC_ENDS = [  # SPEC section 3 "Hard ranges", each end written as the SPEC writes it
    ("site", "site.altitude", "-610 m"), ("site", "site.altitude", "11000 m"),
    ("site", "site.station_pressure", "22 kPa"), ("site", "site.station_pressure", "110 kPa"),
    ("site", "site.altimeter_setting", "85 kPa"), ("site", "site.altimeter_setting", "110 kPa"),
    ("site", "site.temperature", "-60 degC"), ("site", "site.temperature", "60 degC"),
    ("pressure-ratio", "coolant_temperature", "-60 degC"),
    ("pressure-ratio", "coolant_temperature", "100 degC"), ("site", "site.relative_humidity", 1),
    ("pressure-ratio", "boost", "0 kPa"), ("pressure-ratio", "boost", "700 kPa"),
    ("pressure-ratio", "inlet_loss", "50 kPa"), ("pressure-ratio", "intercooler_loss", "50 kPa"),
    ("power", "exhaust_back_pressure", "1000 kPa"), ("pressure-ratio", "max_pressure_ratio", 6),
    ("pressure-ratio", "compressor_efficiency", 0.3), ("pressure-ratio", "compressor_efficiency", 1),
    ("pressure-ratio", "intercooler_effectiveness", 0), ("power", "drive_efficiency", 0.5),
    ("power", "na_power", "10000 kW"), ("injectors", "drivetrain_loss", 0.5),
    ("injectors", "bsfc", "0.2 lb/hp/h"), ("injectors", "bsfc", "2.0 lb/hp/h"),
    ("airflow", "afr", 3), ("airflow", "afr", 25), ("airflow", "lambda", 0.5), ("airflow", "lambda", 1.5),
    ("airflow", "displacement", "0.05 L"), ("airflow", "displacement", "30 L"),
    ("airflow", "rpm", 500), ("airflow", "rpm", 30000), ("injectors", "injector_count", 1),
    ("injectors", "injector_count", 64), ("fuel-pump", "pump_count", 16), ("injectors", "max_duty", 1),
    ("fuel-pump", "margin", 1), ("injectors", "base_fuel_pressure", "0.5 bar"),
    ("injectors", "rated_pressure", "10 bar"), ("injectors", "fuel_density", "0.6 kg/L"),
    ("fuel-pump", "fuel_density", "1.0 kg/L"), ("fuel-pump", "ethanol_content", 1),
    ("airflow", "reference_pressure", "50 kPa"), ("airflow", "reference_pressure", "110 kPa"),
    ("airflow", "reference_temperature", "200 K"), ("airflow", "reference_temperature", "350 K"),
]


@pytest.mark.parametrize("endpoint, path, raw", SPEC_ENDS)
def test_spec_range_ends_in_spec_units_are_accepted(call, endpoint, path, raw):
    # SPEC section 3: the hard ranges include their ends ("-60 to +60 degC", "0.2 to 2.0
    # lb/hp/h"); a user typing an end as printed must not be refused
    r = call(endpoint, body_with(endpoint, path, raw))
    assert r.status_code == 200, r.json


# --- The API: in-range bodies -------------------------------------------------------------------

def q(strategy, unit):
    return strategy.map(lambda v: {"value": v, "unit": unit})


@st.composite
def sites(draw):
    kind = draw(st.sampled_from(["none", "altitude", "station", "altimeter"]))
    s = {}
    if kind in ("altitude", "altimeter"):
        s["altitude"] = draw(q(altitude, "m"))
    if kind == "station":
        s["station_pressure"] = draw(q(station_p, "Pa"))
    if kind == "altimeter":
        s["altimeter_setting"] = draw(q(altimeter, "Pa"))
    if draw(st.booleans()):
        s["temperature"] = draw(q(temperature, "K"))
    if draw(st.booleans()):
        s["relative_humidity"] = draw(humidity)
    return s


def optional(draw, body, **strategies):
    for name, strategy in strategies.items():
        if draw(st.booleans()):
            body[name] = draw(strategy)
    return body


def fuel_choice(draw, body):
    name = draw(st.sampled_from([None, "gasoline", "ethanol", "methanol", "e85"]))
    if name:
        body["fuel"] = name
    if name in (None, "gasoline", "e85") and draw(st.booleans()):
        body["ethanol_content"] = draw(ethanol)
    if draw(st.booleans()):
        body["power_basis"], body["drivetrain_loss"] = "wheel", draw(inside(P, "drivetrain_loss"))


def compressor_options(draw, body):
    optional(draw, body, site=sites(), induction=st.sampled_from(comp.INDUCTIONS), inlet_loss=q(loss, "Pa"),
             intercooler_loss=q(loss, "Pa"), compressor_efficiency=eta, intercooler_effectiveness=eps,
             coolant_temperature=q(coolant, "K"), max_pressure_ratio=pr_max)


def altitude_rows(draw, body):
    if draw(st.booleans()):
        body["altitudes"] = draw(st.lists(q(altitude, "m"), min_size=1, max_size=4))


@st.composite
def bodies(draw, endpoint):
    """Valid in-range bodies in SI units (every combination the cross-field rules allow)."""
    b = {}
    if endpoint == "site":
        return optional(draw, b, site=sites())
    if endpoint in ("pressure-ratio", "power"):
        b["boost"] = draw(q(boost, "Pa"))
        compressor_options(draw, b)
        if draw(st.booleans()):
            b["boost_set_at"] = {"site": draw(sites()), "control": draw(st.sampled_from(comp.BOOST_CONTROLS))}
        altitude_rows(draw, b)
    if endpoint in ("power", "boost-for-power"):
        b["na_power"] = draw(q(watts, "W"))
        fuel_choice(draw, b)
        optional(draw, b, na_site=sites(), na_power_basis=st.sampled_from(["observed", "sae_j1349"]),
                 bsfc=q(bsfc, "kg/J"), afr=afr, drive_efficiency=eta_drive)
        exhaust = draw(st.sampled_from(["none", "ratio", "pressure"]))
        if exhaust == "ratio":
            b["exhaust_to_boost_ratio"] = draw(st.floats(0.0, 5.0))
        elif exhaust == "pressure" and endpoint == "power" and b["boost"]["value"] >= 1.0:
            # a back pressure over a sub-pascal boost overflows the ratio: a 400 by SPEC section 3
            b["exhaust_back_pressure"] = draw(q(inside(C, "exhaust_back_pressure"), "Pa"))
    if endpoint == "power":
        optional(draw, b, measured_power=q(watts, "W"), measured_power_basis=st.sampled_from(["observed", "sae_j1349"]))
    if endpoint == "boost-for-power":
        b["target_power"] = draw(q(watts, "W"))
        compressor_options(draw, b)
        altitude_rows(draw, b)
    if endpoint == "airflow":
        b["power"] = draw(q(watts, "W"))
        fuel_choice(draw, b)
        compressor_options(draw, b)
        optional(draw, b, bsfc=q(bsfc, "kg/J"), boost=q(boost, "Pa"), compressor_count=st.integers(1, 16),
                 reference_pressure=q(inside(AF, "reference_pressure"), "Pa"),
                 reference_temperature=q(inside(AF, "reference_temperature"), "K"))
        air = draw(st.sampled_from(["none", "afr", "lambda"]))
        if air != "none":
            b[air] = draw(afr if air == "afr" else inside(F, "lambda"))
        if draw(st.booleans()):
            b["displacement"], b["rpm"] = draw(q(inside(AF, "displacement"), "m^3")), draw(inside(AF, "rpm"))
    if endpoint in FUEL_SYSTEM:
        b["power"] = draw(q(watts, "W"))
        fuel_choice(draw, b)
        induction = draw(st.sampled_from(("na",) + comp.INDUCTIONS))
        b["induction"] = induction
        if induction != "na":
            b["boost"] = draw(q(boost, "Pa"))
        optional(draw, b, bsfc=q(bsfc, "kg/J"), fuel_density=q(density, "kg/m^3"),
                 base_fuel_pressure=q(fuel_p, "Pa"), regulator=st.sampled_from(["boost_referenced", "fixed"]))
    if endpoint == "injectors":
        b["injector_count"] = draw(injectors)
        optional(draw, b, max_duty=duty, rated_pressure=q(fuel_p, "Pa"),
                 injector_flow=q(st.floats(1e-6, 1.0), "kg/s"), rating_fluid_density=q(density, "kg/m^3"))
    if endpoint == "fuel-pump":
        optional(draw, b, line_loss=q(loss, "Pa"), margin=margin, pump_count=st.integers(1, 16))
        if draw(st.booleans()):
            ps, qs = draw(pump_curves())
            b["pump_curve"] = [{"pressure": {"value": p, "unit": "Pa"}, "flow": {"value": v, "unit": "m^3/s"}}
                               for p, v in zip(ps, qs)]
    return b


def strict_json(raw):
    def refuse(name):
        raise AssertionError(f"{name} in the response")  # RFC 8259, section 6: not JSON
    return json.loads(raw, parse_constant=refuse)


def numbers(node):
    if isinstance(node, dict):
        for v in node.values():
            yield from numbers(v)
    elif isinstance(node, list):
        for v in node:
            yield from numbers(v)
    elif isinstance(node, (int, float)) and not isinstance(node, bool):
        yield node


def refused_for_inlet_loss(call, endpoint, body, r):
    """The one refusal in-range fields can combine into: an inlet loss that takes a
    compressor inlet pressure to 0 or below (SPEC section 3). Without it, a 200."""
    if r.status_code == 400 and named(r) == ["inlet_loss"] and "inlet_loss" in body:
        rest = {k: v for k, v in body.items() if k != "inlet_loss"}
        assert call(endpoint, rest).status_code == 200
        return True
    return False


ENDPOINTS = list(BASE)


@API
@given(st.data())
@pytest.mark.parametrize("endpoint", ENDPOINTS)
def test_in_range_bodies_give_finite_json(call, endpoint, data):
    # no NaN or infinity ever leaves the API; in-range input is answered (SPEC section 3)
    body = data.draw(bodies(endpoint))
    r = call(endpoint, dict(body, units="si"))
    if refused_for_inlet_loss(call, endpoint, body, r):
        event("400: inlet loss takes an inlet pressure to 0")
        return
    event("200")
    assert r.status_code == 200, (body, r.json)
    out = strict_json(r.get_data(as_text=True))
    assert all(math.isfinite(x) for x in numbers(out))
    assert {"warnings", "cautions", "assumptions"} <= set(out)


def reexpress(draw, node, chosen=None):
    """The same physical body in a unit system drawn per example: one spelling of the closed
    table per dimension (as a user would pick), each quantity as a string or an object.
    Like quantities share a factor, so equal inputs stay equal and a knife-edge of the model
    (a fixed rail exactly at the boost, a target exactly the NA power) does not flip on
    rounding."""
    chosen = {} if chosen is None else chosen
    if isinstance(node, dict) and set(node) == {"value", "unit"}:
        dimension = units.dimension_of(node["unit"])
        if dimension not in chosen:
            chosen[dimension] = draw(st.sampled_from(list(units.UNITS[dimension])))
        spelling = chosen[dimension]
        value = expressed(node["value"], dimension, spelling)
        return draw(st.sampled_from([{"value": value, "unit": spelling}, f"{value!r} {spelling}"]))
    if isinstance(node, dict):
        return {k: reexpress(draw, v, chosen) for k, v in node.items()}
    if isinstance(node, list):
        return [reexpress(draw, v, chosen) for v in node]
    return node


# absolute floors in SI: the root find stops at 1e-6 Pa (SPEC section 4) and parity allows
# 1e-6 in SI units (SPEC section 7); others far below any displayed digit
FLOOR = {"Pa": 1e-6, "W": 1e-6, "m": 1e-6, "K": 1e-9, "kg/s": 1e-15, "m^3/s": 1e-18, "kg/J": 1e-21}


def assert_same(a, b, where="", unit=None):
    if isinstance(a, dict):
        assert isinstance(b, dict) and set(a) == set(b), where
        unit = a.get("unit", unit)
        for k in a:
            # warnings compare an input with a threshold exactly, and a threshold written in
            # another unit can round either way (35 degC is 554.67 degR = 308.15000000000003 K),
            # so they are left out; every number and null is compared
            if k not in ("message", "computed_on", "warnings"):
                assert_same(a[k], b[k], f"{where}.{k}", unit)
    elif isinstance(a, list):
        if where.endswith(".causes"):
            # a modelled cause is listed when its power is above 0; one of a few microwatts
            # (below the parity floor) can come and go with the rounding of a unit factor
            a, b = ([c for c in x if c["power"] is None or c["power"]["value"] > FLOOR["W"]] for x in (a, b))
        assert isinstance(b, list) and len(a) == len(b), where
        for i, (x, y) in enumerate(zip(a, b)):
            assert_same(x, y, f"{where}[{i}]", unit)
    elif isinstance(a, float) or isinstance(b, float):
        assert math.isclose(a, b, rel_tol=1e-9, abs_tol=FLOOR.get(unit, 1e-12)), (where, a, b)
    else:
        assert a == b, where


def at_range_end(endpoint, body, path):
    """True when the SI value of the body at ``path`` is an end of its range (to 1e-12)."""
    key = re.sub(r"\[\d+\]", "[0]", path)
    ends = [(c[2], c[3]) for c in CASES if c[0] == endpoint and c[1] == key]
    node = body
    for token in re.findall(r"[^.\[\]]+|\[\d+\]", path):
        node = node[int(token[1:-1])] if token.startswith("[") else node.get(token)
        if node is None:
            return False
    value = node["value"] if isinstance(node, dict) else node
    return bool(ends) and any(e is not None and math.isclose(value, e, rel_tol=1e-12, abs_tol=1e-300)
                              for e in ends[0])


@API
@given(st.data())
@pytest.mark.parametrize("endpoint", ENDPOINTS)
def test_same_physical_input_in_any_units_gives_the_same_si_result(call, endpoint, data):
    # unit independence: physics does not depend on the units it is written in; quantities in
    # any spelling of the closed table give the same SI result within 1e-9 (SPEC section 3)
    body = data.draw(bodies(endpoint))
    a = call(endpoint, dict(body, units="si"))
    assume(a.status_code == 200)
    b = call(endpoint, dict(reexpress(data.draw, body), units="si"))
    if b.status_code == 400 and all(at_range_end(endpoint, body, f) for f in named(b)):
        # a value at a range end, converted, can land a rounding step outside: that is the
        # separate finding of test_spec_range_ends_in_spec_units_are_accepted
        assume(False)
    assert b.status_code == 200, b.json
    assert_same(a.json, b.json)


# --- The API: monotonicity and inverses through the calculation layer --------------------------------

def si(response, name):
    assert response.status_code == 200, response.json
    value = response.json[name]
    return value["value"] if isinstance(value, dict) else value


@API
@given(st.floats(1e3, 2e6), injectors, injectors, st.floats(0.0, 300e3), st.floats(1e-4, 0.05))
def test_injectors_api_more_injectors_smaller_each_and_power_limit_inverts_duty(call, Pw, n1, n2, b, flow):
    # m_inj = P bsfc / (n duty): more injectors, smaller each; the total fuel does not change
    few, many = sorted((n1, n2))
    assume(many > few)
    base = {"power": {"value": Pw, "unit": "W"}, "boost": {"value": b, "unit": "Pa"}, "units": "si"}
    r_few = call("injectors", dict(base, injector_count=few))
    r_many = call("injectors", dict(base, injector_count=many))
    assert si(r_many, "flow_per_injector") < si(r_few, "flow_per_injector")
    assert si(r_many, "total_fuel_flow") == pytest.approx(si(r_few, "total_fuel_flow"), rel=1e-12)
    # inverse: at the power limit of a given injector its duty is the duty limit (SPEC section 3)
    given_ = dict(base, injector_count=few, injector_flow={"value": flow, "unit": "kg/s"})
    limit = si(call("injectors", given_), "max_power")
    assume(limit <= P["power"][1])
    at_limit = call("injectors", dict(given_, power={"value": limit, "unit": "W"}))
    assert si(at_limit, "duty_at_power") == pytest.approx(0.80, rel=1e-9)  # default max_duty (SPEC section 3)


@API
@given(st.floats(1e3, 2e6), injectors, fuel_p, fuel_p, fuel_p, st.floats(0.0, 300e3), st.floats(0.0, 300e3))
def test_injectors_api_rating_follows_the_orifice_equation(call, Pw, n, base_p, r1, r2, b1, b2):
    pa = lambda v: {"value": v, "unit": "Pa"}  # noqa: E731
    body = {"power": {"value": Pw, "unit": "W"}, "injector_count": n, "base_fuel_pressure": pa(base_p), "units": "si"}
    lo, hi = sorted((r1, r2))
    assume(hi - lo > 1.0)
    r_lo = call("injectors", dict(body, boost=pa(b1), rated_pressure=pa(lo)))
    r_hi = call("injectors", dict(body, boost=pa(b1), rated_pressure=pa(hi)))
    # orifice equation (ISO 5167-1): Q ~ sqrt(dp), so the rating at rated_pressure is the
    # flow needed at the operating difference times sqrt(rated / difference) ...
    need, dp = si(r_lo, "flow_at_operating_pressure"), si(r_lo, "pressure_difference")
    assert si(r_lo, "flow_per_injector") == pytest.approx(need * math.sqrt(lo / dp), rel=1e-12)
    # ... and the same injector shows a bigger number when rated at a higher pressure
    assert si(r_lo, "flow_per_injector") < si(r_hi, "flow_per_injector")
    # a fixed rail loses injector pressure as boost rises: the same power needs bigger injectors
    small, big = sorted((b1, b2))
    assume(big - small > 1.0 and base_p - big > 1e3)
    fixed = dict(body, regulator="fixed", rated_pressure=pa(lo))
    f_small, f_big = call("injectors", dict(fixed, boost=pa(small))), call("injectors", dict(fixed, boost=pa(big)))
    assert si(f_big, "pressure_difference") == pytest.approx(base_p - big, rel=1e-12)
    assert si(f_small, "flow_per_injector") < si(f_big, "flow_per_injector")


@API
@given(st.floats(1e3, 2e6), st.floats(0.0, 1.0), st.floats(0.0, 1.0), st.floats(0.0, 300e3),
       pump_curves(max_flow=1e-4), st.integers(1, 4))
def test_fuel_pump_api_more_margin_bigger_pump_and_power_limit_inverts_flow(call, Pw, m1, m2, b, curve, count):
    lo, hi = sorted((m1, m2))
    assume(hi - lo > 1e-9)
    base = {"power": {"value": Pw, "unit": "W"}, "boost": {"value": b, "unit": "Pa"}, "units": "si"}
    # required = P bsfc (1 + margin) / rho: more margin, bigger pump (SPEC section 4)
    assert si(call("fuel-pump", dict(base, margin=lo)), "required_flow") < si(
        call("fuel-pump", dict(base, margin=hi)), "required_flow")
    # inverse: at max_power the pumps deliver exactly the required flow with the margin
    ps, qs = curve
    body = dict(base, margin=lo, pump_count=count, pump_curve=[
        {"pressure": {"value": p, "unit": "Pa"}, "flow": {"value": v, "unit": "m^3/s"}} for p, v in zip(ps, qs)])
    r = call("fuel-pump", body)
    limit, available = si(r, "max_power"), si(r, "available_flow")
    assume(0 < limit <= P["power"][1])
    at_limit = call("fuel-pump", dict(body, power={"value": limit, "unit": "W"}))
    assert si(at_limit, "required_flow") == pytest.approx(available, rel=1e-9)
    assert si(at_limit, "margin_available") == pytest.approx(lo, rel=1e-9, abs=1e-12)


@API
@given(st.floats(20e3, 1e6), st.floats(1.05, 3.0), st.floats(-600.0, 4000.0), boost, boost,
       st.sampled_from(comp.INDUCTIONS), st.booleans())
def test_power_and_boost_for_power_invert_each_other_at_the_api(call, na, factor, h, b1, b2, kind, cooled):
    site = {"altitude": {"value": h, "unit": "m"}}
    common = {"na_power": {"value": na, "unit": "W"}, "site": site, "na_site": site, "induction": kind, "units": "si",
              "intercooler_effectiveness": 0.75 if cooled else 0.0}
    # more boost, more ideal power (pressure-ratio rule); on a turbo with the default exhaust
    # ratio 1 also more expected power (see the engine property above)
    lo, hi = sorted((b1, b2))
    assume(hi - lo > 1.0)
    r_lo, r_hi = call("power", dict(common, boost={"value": lo, "unit": "Pa"})), call(
        "power", dict(common, boost={"value": hi, "unit": "Pa"}))
    assert si(r_lo, "ideal_power") < si(r_hi, "ideal_power")
    if kind == "turbo":
        assert si(r_lo, "expected_power") < si(r_hi, "expected_power")
    # boost-for-power then power at that boost gives the target back (our own round trip, 1e-9)
    target = factor * na
    r = call("boost-for-power", dict(common, target_power={"value": target, "unit": "W"}))
    b_ideal, b = si(r, "boost_ideal"), si(r, "boost")
    assert si(call("power", dict(common, boost={"value": b_ideal, "unit": "Pa"})), "ideal_power") == pytest.approx(
        target, rel=1e-9)
    if b is not None and b > 0:
        if b <= C["boost"][1]:  # the solve may go past the boost input range
            back = call("power", dict(common, boost={"value": b, "unit": "Pa"}))
            assert si(back, "expected_power") == pytest.approx(target, rel=1e-9)
        assert si(r, "expected_power") == pytest.approx(target, rel=1e-9)
    # higher up (the NA run stays where it was), more boost for the same ideal target:
    # the rule fixes MAP, the station pressure falls
    up = call("boost-for-power", dict(common, target_power={"value": target, "unit": "W"},
                                      site={"altitude": {"value": h + 1000.0, "unit": "m"}}))
    assert si(up, "boost_ideal") >= b_ideal


@API
@given(altitude, altitude, altimeter, st.one_of(st.none(), temperature), humidity)
def test_site_api_altitude_pressure_and_inverses(call, h1, h2, p_alt, T, rh):
    lo, hi = sorted((h1, h2))
    assume(hi - lo > 1e-3)
    extra = {} if T is None else {"temperature": {"value": T, "unit": "K"}}
    r_lo = call("site", {"site": {"altitude": {"value": lo, "unit": "m"}, **extra}, "units": "si"})
    r_hi = call("site", {"site": {"altitude": {"value": hi, "unit": "m"}, **extra}, "units": "si"})
    # higher altitude, lower pressure (US Standard Atmosphere 1976) and, dry air at the
    # standard or a fixed temperature, a higher density altitude
    assert si(r_hi, "station_pressure") < si(r_lo, "station_pressure")
    assert si(r_hi, "density_altitude") > si(r_lo, "density_altitude")
    # the altimeter setting read back from the station pressure it gave (NWS formula, inverse)
    weather = {"altitude": {"value": lo, "unit": "m"}, "altimeter_setting": {"value": p_alt, "unit": "Pa"},
               "relative_humidity": rh, **extra}
    r = call("site", {"site": weather, "units": "si"})
    assert atm.altimeter_from_station_pressure(si(r, "station_pressure"), lo) == pytest.approx(p_alt, rel=1e-12)
    # density altitude put back into the standard density law gives the air density
    H = atm.geopotential_height(si(r, "density_altitude"))
    assert 1.225 * (1 - 0.0065 * H / 288.15) ** 4.25588 == pytest.approx(si(r, "air_density"), rel=1e-9)


@API
@given(sites())
@example({"altitude": {"value": 11000.0, "unit": "m"}, "altimeter_setting": {"value": 85e3, "unit": "Pa"},
          "temperature": {"value": 333.15, "unit": "K"}, "relative_humidity": 1.0})
def test_dry_air_pressure_is_positive_or_refused(call, site):
    # Dalton's law: P_dry = P - P_v is a partial pressure, so it must be above 0; a derived
    # pressure at or below 0 is a 400 naming a field (SPEC section 3)
    r = call("site", {"site": site, "units": "si"})
    if r.status_code == 400:
        assert any(f.startswith("site.") for f in named(r))
        return
    assert si(r, "dry_air_pressure") > 0
    assert si(r, "correction_factor") > 0
