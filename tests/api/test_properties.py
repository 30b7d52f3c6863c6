"""Properties over the API: results do not depend on the units the inputs came in."""

import math

import pytest

from hypothesis import given, settings
from hypothesis import strategies as st

from webcalc import units

PRESSURE_UNITS = ["Pa", "hPa", "kPa", "MPa", "mbar", "bar", "psi", "inHg", "mmHg", "atm"]
POWER_UNITS = ["W", "kW", "hp", "PS", "CV"]
TEMPERATURE_UNITS = ["K", "degC", "°C", "degF", "°F", "degR"]
LENGTH_UNITS = ["m", "km", "ft"]


def expressed(si, dimension, unit):
    factor, offset = units.conversion(dimension, unit)
    return {"value": (si - offset) / factor, "unit": unit}


@pytest.fixture(scope="module")
def call(app):
    client = app.test_client()
    return lambda endpoint, body: client.post(f"/api/v1/{endpoint}", json=body)


def close(a, b):
    return math.isclose(a, b, rel_tol=1e-9, abs_tol=1e-9)


@settings(max_examples=60, deadline=None)
@given(
    boost=st.floats(0.0, 300e3), na=st.floats(20e3, 500e3), h=st.floats(-500.0, 4000.0), t=st.floats(250.0, 320.0),
    pu=st.sampled_from(PRESSURE_UNITS), wu=st.sampled_from(POWER_UNITS), tu=st.sampled_from(TEMPERATURE_UNITS),
    lu=st.sampled_from(LENGTH_UNITS), induction=st.sampled_from(["turbo", "centrifugal", "roots", "twin_screw"]),
)
def test_power_is_unit_independent(call, boost, na, h, t, pu, wu, tu, lu, induction):
    def body(p, w, T, L):
        return {"na_power": expressed(na, "power", w), "boost": expressed(boost, "pressure", p),
                "site": {"altitude": expressed(h, "length", L), "temperature": expressed(t, "temperature", T)},
                "induction": induction, "units": "si"}
    a = call("power", body("Pa", "W", "K", "m")).json
    b = call("power", body(pu, wu, tu, lu)).json
    for name in ("ideal_power", "expected_power", "drive_power", "manifold_temperature", "air_mass_flow"):
        assert close(a[name]["value"], b[name]["value"]), name


@settings(max_examples=40, deadline=None)
@given(power=st.floats(20e3, 800e3), count=st.integers(1, 12), boost=st.floats(0.0, 250e3),
       wu=st.sampled_from(POWER_UNITS), pu=st.sampled_from(PRESSURE_UNITS),
       out=st.sampled_from(["cc/min", "lb/h", "g/min", "kg/s", "L/h"]))
def test_injector_outputs_convert_consistently(call, power, count, boost, wu, pu, out):
    base = {"power": expressed(power, "power", wu), "boost": expressed(boost, "pressure", pu),
            "injector_count": count}
    a = call("injectors", dict(base, units="si")).json
    b = call("injectors", dict(base, output_units={"flow_per_injector": out})).json
    dims = units.KINDS["injector_flow"][0]
    si = units.to_si(b["flow_per_injector"]["value"], out, dims, density=745.0)
    assert close(si, a["flow_per_injector"]["value"])
