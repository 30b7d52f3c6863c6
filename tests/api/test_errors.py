"""Bad input gets a 4xx in the one error shape, naming the field; never a 500."""

import json

import pytest


def fields_of(r):
    assert set(r.json) == {"error"} and set(r.json["error"]) == {"message", "fields"}
    return [f["field"] for f in r.json["error"]["fields"]]


@pytest.mark.parametrize("body, field", [
    ({"boost": 15}, "boost"),  # bare number: a unit is required
    ({"boost": "15 psig"}, "boost"),
    ({"boost": "15 psia"}, "boost"),
    ({"boost": "15 furlongs"}, "boost"),
    ({"boost": "15 degC"}, "boost"),  # wrong dimension
    ({"boost": "1,5 bar"}, "boost"),  # the API's grammar has '.' as decimal point
    ({"boost": {"value": "15", "unit": "psi"}}, "boost"),
    ({"boost": {"value": True, "unit": "psi"}}, "boost"),
    ({"boost": "-1 bar"}, "boost"),
    ({"boost": "1e308 bar"}, "boost"),
    ({"boost": "1 bar", "site": {"altitude": "20 km"}}, "site.altitude"),
    ({"boost": "1 bar", "site": {"temperature": "5 degC/s"}}, "site.temperature"),
    ({"boost": "1 bar", "compressor_efficiency": "120 %"}, "compressor_efficiency"),
    ({"boost": "1 bar", "max_pressure_ratio": 1}, "max_pressure_ratio"),
    ({"boost": "1 bar", "induction": "rotary"}, "induction"),
    ({"boost": "1 bar", "turbo": True}, "turbo"),
    ({"boost": "1 bar", "inlet_loss": "50 kPa", "site": {"station_pressure": "40 kPa"}}, "inlet_loss"),
    ({"boost": "1 bar", "boost_set_at": {"site": {}}}, "boost_set_at.control"),
    ({"boost": "1 bar", "altitudes": []}, "altitudes"),
    ({"boost": "1 bar", "altitudes": ["1 km", "99 km"]}, "altitudes[1]"),
    ({"boost": "1 bar", "output_units": {"manifold_pressure": "kg/s"}}, "output_units.manifold_pressure"),
    ({"boost": "1 bar", "output_units": {"nonsense": "kPa"}}, "output_units.nonsense"),
    ({}, "boost"),
])
def test_pressure_ratio_bad_inputs_name_the_field(post, body, field):
    r = post("pressure-ratio", body)
    assert r.status_code == 400
    assert field in fields_of(r)


def test_unknown_unit_lists_the_accepted_ones(post):
    r = post("pressure-ratio", {"boost": "15 PSI"})  # units are case-sensitive
    message = r.json["error"]["fields"][0]["message"]
    assert "psi" in message and "kPa" in message and "inHg" in message


@pytest.mark.parametrize("endpoint, body, field", [
    ("power", {"na_power": "300 hp", "boost": "1 bar", "power_basis": "wheel"}, "drivetrain_loss"),
    ("power", {"na_power": "300 hp", "boost": "0 bar", "exhaust_back_pressure": "1 bar"}, "exhaust_back_pressure"),
    ("power", {"na_power": "300 hp", "boost": "1 bar", "fuel": "methanol", "ethanol_content": 0.5}, "ethanol_content"),
    ("power", {"na_power": "0 hp", "boost": "1 bar"}, "na_power"),
    ("airflow", {"power": "300 hp", "afr": 12, "lambda": 0.8}, "lambda"),
    ("airflow", {"power": "300 hp", "displacement": "2 L"}, "rpm"),
    ("injectors", {"power": "300 hp", "boost": "1 bar", "injector_count": 4.5}, "injector_count"),
    ("injectors", {"power": "300 hp", "boost": "1 bar", "injector_count": -4}, "injector_count"),
    ("injectors", {"power": "300 hp", "boost": "1 bar", "injector_count": 4, "max_duty": "120 %"}, "max_duty"),
    ("fuel-pump", {"power": "300 hp", "boost": "1 bar", "pump_curve": [{"pressure": "3 bar", "flow": "1 L/h"}]},
     "pump_curve"),
    ("fuel-pump", {"power": "300 hp", "boost": "1 bar", "pump_curve": [
        {"pressure": "3 bar", "flow": "100 L/h"}, {"pressure": "3 bar", "flow": "90 L/h"}]}, "pump_curve[1].pressure"),
    ("fuel-pump", {"power": "300 hp", "boost": "1 bar", "pump_curve": [
        {"pressure": "3 bar", "flow": "100 L/h"}, {"pressure": "4 bar", "flow": "0 L/h"}]}, "pump_curve[1].flow"),
])
def test_cross_field_errors_name_the_field(post, endpoint, body, field):
    r = post(endpoint, body)
    assert r.status_code == 400 and field in fields_of(r)


def test_counts_accept_integral_floats(post):
    assert post("injectors", {"power": "300 hp", "boost": "1 bar", "injector_count": 4.0}).status_code == 200


def test_nan_and_infinity_are_not_numbers(client):
    for text in ('{"boost": {"value": NaN, "unit": "bar"}}', '{"boost": {"value": Infinity, "unit": "bar"}}',
                 '{"boost": {"value": 1e999, "unit": "bar"}}'):
        r = client.post("/api/v1/pressure-ratio", data=text, content_type="application/json")
        assert r.status_code == 400 and "error" in r.json


def test_transport_errors(client):
    assert client.post("/api/v1/site", data="{", content_type="application/json").status_code == 400
    assert client.post("/api/v1/site", data="[]", content_type="application/json").status_code == 400
    assert client.post("/api/v1/site", data=b"\xff\xfe", content_type="application/json").status_code == 400
    assert client.post("/api/v1/site", data="{}", content_type="text/plain").status_code == 415
    big = json.dumps({"site": {}, "pad": "x" * 70000})
    assert client.post("/api/v1/site", data=big, content_type="application/json").status_code == 413
    deep = "[" * 100000 + "]" * 100000
    assert client.post("/api/v1/site", data=deep[:60000], content_type="application/json").status_code == 400
    for r, status in ((client.post("/api/v1/nothing", json={}), 404), (client.get("/api/v1/site"), 405),
                      (client.get("/nothing"), 404)):
        assert r.status_code == status and fields_of(r) == []


def test_output_units_override_and_fuel_flow_mass_volume(post):
    body = post("injectors", {"power": "400 hp", "boost": "1 bar", "injector_count": 6, "fuel_density": "0.75 kg/L",
                              "output_units": {"flow_per_injector": "g/min", "total_fuel_flow": "L/h"}}).json
    lb_h = post("injectors", {"power": "400 hp", "boost": "1 bar", "injector_count": 6, "fuel_density": "0.75 kg/L",
                              "units": "imperial"}).json
    assert body["flow_per_injector"]["unit"] == "g/min"
    assert body["flow_per_injector"]["value"] == pytest.approx(lb_h["flow_per_injector"]["value"] * 453.59237 / 60)
    assert body["total_fuel_flow"]["unit"] == "L/h"
    assert body["total_fuel_flow"]["value"] == pytest.approx(lb_h["total_fuel_flow"]["value"] * 0.45359237 / 0.75)


def test_results_do_not_depend_on_input_units(post):
    a = post("power", {"na_power": "300 kW", "boost": "1.2 bar", "site": {"altitude": "1200 m", "temperature": "25 degC"},
                       "units": "si"}).json
    b = post("power", {"na_power": {"value": 300e3 / 745.69987158227, "unit": "hp"}, "boost": "17.404528 psi",
                       "site": {"altitude": {"value": 1200 / 0.3048, "unit": "ft"}, "temperature": "77 degF"},
                       "units": "si"}).json
    for name in ("ideal_power", "expected_power", "manifold_temperature"):
        assert a[name]["value"] == pytest.approx(b[name]["value"], rel=1e-6)


def test_wheel_basis_applies_to_inputs_and_outputs(post):
    crank = post("power", {"na_power": "300 hp", "boost": "1 bar", "units": "imperial"}).json
    wheel = post("power", {"na_power": "255 hp", "boost": "1 bar", "units": "imperial", "power_basis": "wheel",
                           "drivetrain_loss": 0.15}).json
    assert wheel["expected_power"]["value"] == pytest.approx(crank["expected_power"]["value"] * 0.85, rel=1e-12)
    assert "drivetrain_loss_estimate" in [w["code"] for w in wheel["warnings"]]


def test_j1349_corrected_na_figure_is_turned_into_observed(post):
    site = {"altitude": "1500 m", "temperature": "30 degC"}
    observed = post("site", {"site": site}).json
    cf = observed["correction_factor"]
    a = post("power", {"na_power": "300 hp", "na_power_basis": "sae_j1349", "boost": "1 bar", "site": site,
                       "units": "imperial"}).json
    b = post("power", {"na_power": f"{300 / cf} hp", "boost": "1 bar", "site": site, "units": "imperial"}).json
    assert a["ideal_power"]["value"] == pytest.approx(b["ideal_power"]["value"], rel=1e-9)
