"""The OpenAPI document is valid and describes the real responses."""

import jsonschema
import pytest
from openapi_spec_validator import validate

from webcalc.api.schemas import ENDPOINTS

EXAMPLES = {
    "site": {"site": {"altitude": "1200 m", "temperature": "28 degC", "relative_humidity": "30 %"}},
    "pressure-ratio": {"boost": "1.2 bar", "altitudes": ["0 m", "2000 m"],
                       "boost_set_at": {"site": {"altitude": "0 m"}, "control": "held_manifold"}},
    "power": {"na_power": "200 kW", "boost": "0.8 bar", "measured_power": "300 kW", "induction": "roots",
              "altitudes": ["500 m"]},
    "boost-for-power": {"na_power": "200 kW", "target_power": "320 kW", "altitudes": ["0 m", "3000 m"]},
    "airflow": {"power": "300 kW", "boost": "1 bar", "displacement": "2.5 L", "rpm": 6800},
    "injectors": {"power": "300 kW", "boost": "1 bar", "injector_count": 6, "injector_flow": "650 cc/min"},
    "fuel-pump": {"power": "300 kW", "boost": "1 bar", "pump_curve": [
        {"pressure": "3 bar", "flow": "280 L/h"}, {"pressure": "6 bar", "flow": "200 L/h"}]},
}


@pytest.fixture(scope="module")
def doc(app):
    return app.test_client().get("/api/v1/openapi.json").json


def test_document_is_valid_openapi_31(doc):
    validate(doc)
    assert doc["openapi"].startswith("3.1")
    assert set(doc["paths"]) == {f"/api/v1/{e}" for e in ENDPOINTS} | {"/healthz"}


def test_ranges_are_documented(doc):
    props = doc["paths"]["/api/v1/pressure-ratio"]["post"]["requestBody"]["content"]["application/json"]["schema"]
    assert props["properties"]["boost"]["x-si-range"] == [0.0, 700e3]
    assert props["properties"]["max_pressure_ratio"]["exclusiveMinimum"] == 1.0


def schema_of(doc, endpoint, status):
    op = doc["paths"][f"/api/v1/{endpoint}"]["post"]
    schema = op["responses"][status]["content"]["application/json"]["schema"]
    return {**schema, "components": doc["components"]} if "$ref" in schema else schema


@pytest.mark.parametrize("endpoint", list(EXAMPLES))
def test_real_responses_match_the_document(doc, post, endpoint):
    body = EXAMPLES[endpoint]
    request_schema = doc["paths"][f"/api/v1/{endpoint}"]["post"]["requestBody"]["content"]["application/json"]["schema"]
    jsonschema.validate(body, request_schema)
    ok = post(endpoint, body)
    assert ok.status_code == 200
    jsonschema.validate(ok.json, schema_of(doc, endpoint, "200"))
    bad = post(endpoint, dict(body, nonsense=1))
    assert bad.status_code == 400
    error_schema = dict(doc["components"]["schemas"]["Error"])
    jsonschema.validate(bad.json, error_schema)
