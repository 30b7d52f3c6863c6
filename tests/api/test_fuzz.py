"""API fuzzing driven by the OpenAPI document (schemathesis 4 and Hypothesis).

Every operation of ``GET /api/v1/openapi.json`` is fuzzed in three generation modes:

- ``positive``: schemathesis generates bodies that satisfy the document's request schema;
- ``negative``: schemathesis generates bodies that violate it (wrong types, missing required
  fields, unknown fields, out-of-range numbers, ...);
- ``in_range``: our own Hypothesis strategy, read from the same document, sends every
  quantity in its SI unit within its documented ``x-si-range`` (the document cannot state
  those ranges in JSON Schema terms, since a quantity may come in any unit), so that a
  large share of requests get past validation and the 200 responses are checked too.

Each response must be: never 5xx; every 4xx exactly the error body of SPEC section 3,
``{"error": {"message": str, "fields": [{"field": str, "message": str}]}}``, and a 400 for
a JSON object names at least one field that is a key of the body or of the endpoint's
schema; every 200 conforms to the documented response schema (checked with ``jsonschema``,
a general-purpose reference library, and with schemathesis's own conformance checks), has
no ``-0``, no NaN or Infinity, and with ``units: "si"`` only the SI units of SPEC section 3.

Cost: ``WEBCALC_FUZZ_EXAMPLES`` (default 500) is the Hypothesis ``max_examples`` per
operation and mode: 7 endpoints x 3 modes x 500 gives more than 10 000 requests, which
``test_fuzz_total`` checks at the end of a full run. The totals (requests, by status) are
printed at the end of the run; with ``WEBCALC_FUZZ_REPORT=path`` they are also written there
as JSON.
"""

import collections
import functools
import json
import math
import os

import jsonschema
import pytest
import schemathesis
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st
from schemathesis import GenerationMode
from schemathesis.checks import not_a_server_error
from schemathesis.specs.openapi.checks import (
    content_type_conformance,
    negative_data_rejection,
    response_schema_conformance,
    status_code_conformance,
)

from webcalc import create_app

pytestmark = pytest.mark.slow

EXAMPLES = int(os.environ.get("WEBCALC_FUZZ_EXAMPLES", "500"))
APP = create_app({"TESTING": True})
SCHEMA = schemathesis.openapi.from_wsgi("/api/v1/openapi.json", APP)
DOC = APP.test_client().get("/api/v1/openapi.json").get_json()
CALC_PATHS = [p for p in DOC["paths"] if p.startswith("/api/v1/")]
MODES = ("positive", "negative", "in_range")
STATS = collections.defaultdict(collections.Counter)  # (path, mode) -> Counter of status codes

# SPEC section 3, unit table, column "si" (binding). Air density is kg/m^3 in every system.
SI_UNITS = {"Pa", "K", "m", "W", "kg/s", "m^3/s", "kg/J", "kg/m^3", "m^3"}
# The SI spelling of each kind of quantity in the document's "x-kind" (SPEC section 3, column "si").
SI_UNIT_OF_KIND = {
    "abs_pressure": "Pa", "gauge_pressure": "Pa", "temperature": "K", "elevation": "m", "power": "W",
    "air_mass_flow": "kg/s", "air_volume_flow": "m^3/s", "injector_flow": "kg/s", "fuel_flow": "kg/s",
    "pump_flow": "m^3/s", "bsfc": "kg/J", "density": "kg/m^3", "air_density": "kg/m^3", "displacement": "m^3",
}
CHECKS = [not_a_server_error, status_code_conformance, content_type_conformance, response_schema_conformance]
ERROR_SCHEMA = DOC["components"]["schemas"]["Error"]


def _reject_constant(name):
    raise ValueError(f"{name} in JSON")


def _loads(raw):
    """Strict JSON: NaN and Infinity are not JSON (RFC 8259, section 6)."""
    return json.loads(raw, parse_constant=_reject_constant)


def _request_schema(path):
    return DOC["paths"][path]["post"]["requestBody"]["content"]["application/json"]["schema"]


def _response_schema(path, status):
    op = DOC["paths"][path].get("post") or DOC["paths"][path]["get"]
    schema = op["responses"][status]["content"]["application/json"]["schema"]
    return {**schema, "components": DOC["components"]} if "$ref" in schema else schema


@functools.lru_cache(maxsize=None)
def _validator(path, status):
    """A jsonschema validator of a documented response, its schema checked once (checking the
    schema on every call, as ``jsonschema.validate`` does, was most of this file's run time)."""
    schema = ERROR_SCHEMA if path is None else _response_schema(path, status)
    cls = jsonschema.validators.validator_for(schema)
    cls.check_schema(schema)
    return cls(schema)


def validate(instance, path, status):
    """Like ``jsonschema.validate``: raise the most relevant error, if any."""
    error = jsonschema.exceptions.best_match(_validator(path, status).iter_errors(instance))
    if error is not None:
        raise error


# ---------------------------------------------------------------- our in-range strategy


def _finite(lo, hi, *, exclude_min=False, exclude_max=False):
    return st.floats(min_value=lo, max_value=hi, exclude_min=exclude_min, exclude_max=exclude_max,
                     allow_nan=False, allow_infinity=False)


def _quantity(schema):
    lo, hi = schema["x-si-range"]
    lo = 0.0 if lo is None else lo
    hi = lo + 1.0 if hi is None else hi  # open-ended ranges (pump and injector flows): a plausible span
    unit = SI_UNIT_OF_KIND[schema["x-kind"]]
    value = _finite(lo, hi)
    return st.one_of(
        value.map(lambda v: {"value": v, "unit": unit}),
        value.map(lambda v: f"{v!r} {unit}"),
    )


def _number(schema):
    lo, hi = schema.get("minimum", schema.get("exclusiveMinimum")), schema.get("maximum", schema.get("exclusiveMaximum"))
    lo = -1e6 if lo is None else lo
    hi = 1e6 if hi is None else hi
    if schema["type"] == "integer":
        return st.integers(min_value=math.ceil(lo), max_value=math.floor(hi))
    return _finite(lo, hi, exclude_min="exclusiveMinimum" in schema, exclude_max="exclusiveMaximum" in schema)


def strip_null(schema):
    """The non-null part of an optional field's schema (``null`` means "not given")."""
    if "oneOf" in schema:
        return dict(schema, oneOf=[s for s in schema["oneOf"] if s.get("type") != "null"])
    if isinstance(schema.get("type"), list):
        schema = dict(schema, type=next(t for t in schema["type"] if t != "null"))
        if "enum" in schema:
            schema["enum"] = [v for v in schema["enum"] if v is not None]
    return schema


def strategy_for(schema):
    """A Hypothesis strategy for one property of the document's request schemas."""
    schema = strip_null(schema)
    if "x-kind" in schema:
        return _quantity(schema)
    if "oneOf" in schema:  # a fraction: a number in range, sometimes written with %
        number = next(s for s in schema["oneOf"] if s.get("type") == "number")
        value = _number(number)
        return st.one_of(value, value.map(lambda v: f"{v * 100!r} %"))
    if "enum" in schema:
        return st.sampled_from(schema["enum"])
    kind = schema.get("type")
    if kind in ("number", "integer"):
        return _number(schema)
    if kind == "string":
        return st.one_of(st.sampled_from(["en", "de", "fr-CH", "xx"]), st.text(max_size=schema.get("maxLength", 35)))
    if kind == "array":
        return st.lists(strategy_for(schema["items"]), min_size=schema["minItems"],
                        max_size=min(schema["maxItems"], schema["minItems"] + 4))
    if kind == "object" and "properties" in schema:
        return object_strategy(schema)
    if kind == "object":  # output_units: left to the positive and negative modes
        return st.just({})
    raise AssertionError(f"no strategy for {schema}")


def object_strategy(schema):
    """All required properties and a random subset of the optional ones."""
    props = schema["properties"]
    required = schema.get("required", [])
    optional = [name for name in props if name not in required]

    @st.composite
    def build(draw):
        names = list(required) + draw(st.lists(st.sampled_from(optional), unique=True)) if optional else list(required)
        return {name: draw(strategy_for(props[name])) for name in names}
    return build()


# ---------------------------------------------------------------- the checks


def check_error_body(body, status):
    """SPEC section 3: exactly {"error": {"message": str, "fields": [{"field": str, "message": str}]}}."""
    validate(body, None, "error")
    assert set(body) == {"error"}, body
    assert set(body["error"]) == {"message", "fields"}, body
    assert isinstance(body["error"]["message"], str) and body["error"]["message"], (status, body)
    for item in body["error"]["fields"]:
        assert set(item) == {"field", "message"}, body
        assert isinstance(item["field"], str), body  # "" only for an unknown key "" (checked below)
        assert isinstance(item["message"], str) and item["message"], body


def check_fields_named(path, sent, body):
    """A 400 for a JSON object names the field: a key of the body or of the endpoint's schema."""
    if not isinstance(sent, dict):
        return
    fields = body["error"]["fields"]
    assert fields, f"400 without a field for {sent!r}: {body}"
    known = set(_request_schema(path)["properties"]) | {str(k) for k in sent}
    for item in fields:
        root = item["field"].split(".", 1)[0].split("[", 1)[0]
        assert root in known or item["field"] in known, (item, sent)


def walk_quantities(value):
    if isinstance(value, dict):
        if set(value) == {"value", "unit"}:
            yield value
        else:
            for v in value.values():
                yield from walk_quantities(v)
    elif isinstance(value, list):
        for v in value:
            yield from walk_quantities(v)


def walk_numbers(value):
    if isinstance(value, bool):
        return
    if isinstance(value, (int, float)):
        yield value
    elif isinstance(value, dict):
        for v in value.values():
            yield from walk_numbers(v)
    elif isinstance(value, list):
        for v in value:
            yield from walk_numbers(v)


def check_success(path, sent, body):
    validate(body, path, "200")
    for x in walk_numbers(body):
        # SPEC section 3: -0 is written as 0; never Infinity in JSON
        assert math.isfinite(x) and not (x == 0 and math.copysign(1.0, x) < 0), body
    if isinstance(sent, dict) and sent.get("units") == "si" and not sent.get("output_units"):
        for q in walk_quantities({k: v for k, v in body.items() if k != "assumptions"}):
            assert q["unit"] in SI_UNITS, q


def check_response(path, mode, response, sent):
    status = response.status_code
    STATS[(path, mode)][status] += 1
    assert status < 500, f"{status} for {sent!r}: {response.content[:500]!r}"
    content_type = (response.headers.get("content-type") or [""])[0]
    assert content_type.startswith("application/json"), (status, content_type)
    body = _loads(response.content)
    if 400 <= status < 500:
        check_error_body(body, status)
        if status == 400 and path in CALC_PATHS:
            check_fields_named(path, sent, body)
    elif status == 200:
        if path == "/healthz":
            assert body == {"status": "ok"}
        else:
            check_success(path, sent, body)
    else:
        pytest.fail(f"unexpected status {status}")


def sent_body(response):
    raw = response.request.body
    if raw is None:
        return None
    try:
        return _loads(raw)
    except (ValueError, UnicodeDecodeError):
        return raw


# ---------------------------------------------------------------- the tests


def _settings(examples):
    return settings(max_examples=examples, deadline=None, database=None, derandomize=False,
                    suppress_health_check=list(HealthCheck))


@pytest.mark.parametrize("mode", MODES)
@pytest.mark.parametrize("path", CALC_PATHS)
def test_fuzz_endpoint(path, mode):
    operation = SCHEMA[path]["POST"]
    client = APP.test_client()

    if mode == "in_range":
        @_settings(EXAMPLES)
        @given(object_strategy(_request_schema(path)))
        def run(body):
            response = client.post(path, json=body)
            STATS[(path, mode)][response.status_code] += 1
            assert response.status_code < 500, (body, response.data[:500])
            if response.status_code == 200:
                check_success(path, body, _loads(response.data))
            else:
                assert response.status_code == 400, (response.status_code, body)
                check_error_body(response.json, 400)
                check_fields_named(path, body, response.json)
    else:
        generation = GenerationMode.POSITIVE if mode == "positive" else GenerationMode.NEGATIVE
        checks = CHECKS + ([negative_data_rejection] if mode == "negative" else [])

        @_settings(EXAMPLES)
        @given(operation.as_strategy(generation_mode=generation))
        def run(case):
            response = case.call()
            check_response(path, mode, response, sent_body(response))
            case.validate_response(response, checks=checks)

    run()
    made = sum(STATS[(path, mode)].values())
    assert made >= EXAMPLES, f"only {made} requests for {path} {mode}"


def test_fuzz_healthz():
    operation = SCHEMA["/healthz"]["GET"]

    @_settings(EXAMPLES)
    @given(operation.as_strategy(generation_mode=GenerationMode.POSITIVE))
    def run(case):
        response = case.call()
        check_response("/healthz", "positive", response, None)
        case.validate_response(response, checks=CHECKS)

    run()
    assert sum(STATS[("/healthz", "positive")].values()) >= 1


#: The fuzz budget of a default run: requests across all endpoints and modes (scaled with
#: WEBCALC_FUZZ_EXAMPLES for shorter or longer runs).
TOTAL_TARGET = 10_000 * EXAMPLES // 500


def test_fuzz_total():
    """Runs last (pytest keeps the file's order): the whole run made its budget of requests."""
    ran = {key for key in STATS if key[0] in CALC_PATHS}
    if len(ran) < len(CALC_PATHS) * len(MODES):
        pytest.skip("only part of the fuzz tests ran")
    total = sum(sum(c.values()) for c in STATS.values())
    server_errors = sum(n for c in STATS.values() for status, n in c.items() if status >= 500)
    assert server_errors == 0
    assert total >= TOTAL_TARGET, f"{total} requests, fewer than {TOTAL_TARGET}"


@pytest.fixture(scope="module", autouse=True)
def report(request):
    """Print (and optionally record) the number of requests made, by endpoint, mode and status."""
    yield
    total = sum(sum(c.values()) for c in STATS.values())
    by_status = collections.Counter()
    for counter in STATS.values():
        by_status.update(counter)
    lines = [f"fuzz: {total} requests, by status {dict(sorted(by_status.items()))}, "
             f"5xx: {sum(n for s, n in by_status.items() if s >= 500)}"]
    lines += [f"  {path} {mode}: {sum(c.values())} {dict(sorted(c.items()))}" for (path, mode), c in sorted(STATS.items())]
    reporter = request.config.pluginmanager.get_plugin("terminalreporter")
    for line in lines:
        (reporter.write_line if reporter else print)(line)
    target = os.environ.get("WEBCALC_FUZZ_REPORT")
    if target:
        with open(target, "w", encoding="utf-8") as fh:
            json.dump({"requests": total, "by_status": {str(k): v for k, v in sorted(by_status.items())},
                       "by_operation": {f"{p} {m}": {str(k): v for k, v in sorted(c.items())}
                                        for (p, m), c in sorted(STATS.items())}}, fh, indent=2)
