"""HTTP API v1: a Flask blueprint; validation and JSON in and out (SPEC section 3)."""

import json

import orjson
from flask import Blueprint, current_app, jsonify, request

from .. import calc, i18n
from ..calc.common import InputError
from .fields import FieldError, parse_fields
from .respond import check_output_units, error_body, flat_kinds, render
from .schemas import ENDPOINTS

MAX_BODY = 64 * 1024
bp = Blueprint("api", __name__, url_prefix="/api/v1")
KINDS = {name: flat_kinds(fields, calc.OUTPUTS[name]) for name, fields in ENDPOINTS.items()}


class ApiError(Exception):
    """An HTTP error with the one error body."""

    def __init__(self, status, code, fields=(), **params):
        super().__init__(code)
        self.status, self.code, self.fields, self.params = status, code, list(fields), params


def request_locale(body=None):
    lang = request.args.get("lang")
    if lang is None and isinstance(body, dict) and isinstance(body.get("lang"), str):
        lang = body["lang"]
    return i18n.negotiate(lang, request.headers.get("Accept-Language"))


def _reject_constant(name):
    raise ValueError(name)


def read_json():
    """The request body as a JSON object, or an ApiError (415, 413, 400)."""
    if request.mimetype != "application/json":
        raise ApiError(415, "unsupported_media_type")
    if (request.content_length or 0) > MAX_BODY:
        raise ApiError(413, "too_large")
    data = request.stream.read(MAX_BODY + 1)
    if len(data) > MAX_BODY:
        raise ApiError(413, "too_large")
    try:  # NaN and Infinity tokens are refused; 1e999 parses to inf and is refused by its field
        body = json.loads(data.decode("utf-8"), parse_constant=_reject_constant)
    except (ValueError, RecursionError, UnicodeDecodeError):
        raise ApiError(400, "malformed_json") from None
    if not isinstance(body, dict):
        raise ApiError(400, "not_object")
    return body


def calculate(endpoint, body):
    """Validate, calculate and render one request body: (status, JSON body)."""
    locale = request_locale(body)
    errors = []
    inp = parse_fields(ENDPOINTS[endpoint], body, "", errors)
    if "output_units" in inp:
        errors.extend(check_output_units(inp["output_units"], KINDS[endpoint]))
    if errors:
        return 400, error_body(locale, "invalid_request", errors)
    try:
        result = calc.CALCULATIONS[endpoint](inp)
        # render() refuses a number that is not finite in its output unit (ValueError).
        return 200, render(inp, result, calc.OUTPUTS[endpoint], KINDS[endpoint], locale)
    except InputError as exc:
        return 400, error_body(locale, "invalid_request", [FieldError(exc.path, exc.code, **exc.params)])
    except (ValueError, ArithmeticError, FloatingPointError):
        names = [k for k in body if k not in ("units", "output_units", "lang")]
        return 400, error_body(locale, "invalid_request", [FieldError(n, "not_finite") for n in names])


def dumps(out):
    """Response JSON. A lone surrogate (a valid JSON escape such as ``"\\ud800"``) echoed from
    the request in a field path or a message is escaped again, as the browser's
    ``JSON.stringify`` does; orjson refuses such strings (they are not UTF-8)."""
    try:
        return orjson.dumps(out)
    except TypeError:  # orjson.JSONEncodeError is a TypeError
        return json.dumps(out, ensure_ascii=True, allow_nan=False, separators=(",", ":")).encode("ascii")


@bp.post("/<endpoint>")
def endpoint_view(endpoint):
    if endpoint not in ENDPOINTS:
        raise ApiError(404, "not_found")
    body = read_json()
    status, out = calculate(endpoint, body)
    # Every number was checked finite (orjson would write NaN and Infinity as null).
    return current_app.response_class(dumps(out), status=status, mimetype="application/json")


@bp.get("/openapi.json")
def openapi_view():
    from .openapi import document
    return jsonify(document())


@bp.errorhandler(ApiError)
def api_error(exc):
    return jsonify(error_body(request_locale(), exc.code, exc.fields, **exc.params)), exc.status
