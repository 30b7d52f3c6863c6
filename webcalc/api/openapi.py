"""The OpenAPI 3.1 document, built from the same field definitions the validator uses."""

import functools

from .. import __version__, calc, messages
from .fields import object_schema
from .schemas import ENDPOINTS

QUANTITY = {"type": "object", "required": ["value", "unit"], "additionalProperties": False,
            "properties": {"value": {"type": "number"}, "unit": {"type": "string"}}}
ERROR = {
    "type": "object", "required": ["error"], "additionalProperties": False,
    "properties": {"error": {
        "type": "object", "required": ["message", "fields"], "additionalProperties": False,
        "properties": {
            "message": {"type": "string"},
            "fields": {"type": "array", "items": {
                "type": "object", "required": ["field", "message"], "additionalProperties": False,
                "properties": {"field": {"type": "string"}, "message": {"type": "string"}}}},
        }}},
}
SUMMARIES = {
    "site": "Conditions: station pressure, air density, density altitude, SAE J1349 correction factor",
    "pressure-ratio": "Boost and pressure ratio: manifold pressure, compressor ratio and temperatures",
    "power": "Power check: ideal and expected power at a boost, shortfall and likely causes",
    "boost-for-power": "Boost target: the boost needed for a target power here",
    "airflow": "Airflow: air mass and volume flow, corrected flow, implied volumetric efficiency",
    "injectors": "Injectors: size for a power, or duty and power limit of a given injector",
    "fuel-pump": "Fuel pump: flow and pressure needed, and what a pump curve delivers",
}


def output_schema(spec):
    props = {}
    for name, kind in spec.items():
        if isinstance(kind, dict):
            row = output_schema(kind)
            props[name] = {"oneOf": [{"type": "array", "items": row}, row, {"type": "null"}]}
        elif name == "warnings":
            props[name] = {"type": "array", "items": {"type": "string", "enum": list(messages.WARNING_ORDER)}}
        elif kind is None:
            props[name] = {"type": ["number", "string", "null"]}
        else:
            props[name] = {"oneOf": [QUANTITY, {"type": "null"}], "x-kind": kind}
    return {"type": "object", "properties": props}


def success_schema(endpoint):
    schema = output_schema(calc.OUTPUTS[endpoint])
    schema["properties"].update(
        warnings={"type": "array", "items": {
            "type": "object", "required": ["code", "severity", "message"],
            "properties": {"code": {"enum": list(messages.WARNING_ORDER)},
                           "severity": {"enum": list(messages.SEVERITY_ORDER)}, "message": {"type": "string"}}}},
        cautions={"type": "array", "minItems": len(messages.CAUTIONS), "items": {
            "type": "object", "required": ["code", "message"],
            "properties": {"code": {"enum": list(messages.CAUTIONS)}, "message": {"type": "string"}}}},
        assumptions={"type": "object"},
        computed_on={"enum": ["server", "device"]},
    )
    schema["required"] = ["warnings", "cautions", "assumptions"]
    return schema


def error_response(text):
    return {"description": text, "content": {"application/json": {"schema": {"$ref": "#/components/schemas/Error"}}}}


@functools.lru_cache(maxsize=1)
def document():
    paths = {}
    for endpoint, fields in ENDPOINTS.items():
        paths[f"/api/v1/{endpoint}"] = {"post": {
            "operationId": endpoint.replace("-", "_"),
            "summary": SUMMARIES[endpoint],
            "parameters": [{"name": "lang", "in": "query", "required": False, "schema": {"type": "string"}}],
            "requestBody": {"required": True, "content": {"application/json": {"schema": object_schema(fields)}}},
            "responses": {
                "200": {"description": "Result", "content": {"application/json": {"schema": success_schema(endpoint)}}},
                "400": error_response("Bad input: the fields say which and why"),
                "413": error_response("Body over 64 KiB"),
                "415": error_response("Not JSON"),
            },
        }}
    paths["/healthz"] = {"get": {"operationId": "healthz", "responses": {"200": {
        "description": "Alive", "content": {"application/json": {"schema": {
            "type": "object", "properties": {"status": {"const": "ok"}}, "required": ["status"]}}}}}}}
    return {
        "openapi": "3.1.0",
        "info": {"title": "Boost and fuel check API", "version": __version__,
                 "description": "Quantities in as \"15 psi\" or {\"value\": 15, \"unit\": \"psi\"}; ranges are in SI "
                                "units (x-si-range). Powers are crank power unless power_basis is wheel."},
        "paths": paths,
        "components": {"schemas": {"Error": ERROR}},
    }
