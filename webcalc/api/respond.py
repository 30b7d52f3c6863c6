"""Turning calculation results into response JSON: units, power basis, messages, ordering."""

import functools
import math

from .. import i18n, messages, units
from .fields import FieldError, List, Object, Quantity


def flat_kinds(fields, outputs):
    """{flat field name: kind or None} over an endpoint's inputs and outputs (for output_units)."""
    kinds = {}

    def walk_fields(items):
        for f in items:
            if isinstance(f, Object):
                walk_fields(f.fields)
            elif isinstance(f, List):
                walk_fields([f.item])
            elif isinstance(f, Quantity):
                kinds.setdefault(f.name, f.kind)

    def walk_outputs(spec):
        for name, kind in spec.items():
            if isinstance(kind, dict):
                walk_outputs(kind)
            else:
                kinds[name] = kind

    walk_fields(fields)
    walk_outputs(outputs)
    return kinds


def check_output_units(overrides, kinds):
    """FieldErrors for output_units naming an unknown field or a unit of the wrong dimension."""
    errors = []
    for name, unit in overrides.items():
        path = f"output_units.{name}"
        if name not in kinds or kinds[name] is None:
            errors.append(FieldError(path, "output_unit_field"))
            continue
        if not isinstance(unit, str):
            continue
        try:
            units.to_si(1.0, unit, units.KINDS[kinds[name]][0], density=1.0)
        except units.UnitError as exc:
            errors.append(FieldError(path, exc.code, **exc.params))
    return errors


class Renderer:
    """Formats one result in the request's unit system, overrides and power basis."""

    def __init__(self, inp, result, kinds, locale):
        self.column = 1 + units.SYSTEMS.index(inp.get("units", "metric"))
        self.overrides = inp.get("output_units", {})
        self.result = result
        self.kinds = kinds
        self.locale = locale

    def quantity(self, name, value, kind):
        if value is None:
            return None
        if not math.isfinite(value):
            raise ValueError(name)
        if kind is None:
            return float(value) + 0.0 if isinstance(value, float) else value
        if kind == "power":
            value = value / self.result.power_scale
        unit = self.overrides.get(name) or units.KINDS[kind][self.column]
        out = units.quantity(value, kind, unit, self.result.density)
        if not math.isfinite(out["value"]):  # finite in SI, too big in this unit (1e305 kg/s in cc/min)
            raise ValueError(name)
        return out

    def values(self, values, spec):
        out = {}
        for name, kind in spec.items():
            value = values.get(name)
            if isinstance(kind, dict):
                if isinstance(value, list):
                    out[name] = [self.values(row, kind) for row in value]
                elif isinstance(value, dict):
                    out[name] = self.values(value, kind)
                elif name in values:
                    out[name] = None
                continue
            if name not in values:
                continue
            out[name] = value if isinstance(value, (list, str)) else self.quantity(name, value, kind)
        return out

    def assumptions(self):
        out = {}
        for path, (value, kind) in self.result.assumptions.items():
            name = path.rsplit(".", 1)[-1]
            out[path] = self.quantity(name, value, kind) if kind else value
        return out


def sorted_warnings(pairs):
    order = messages.WARNING_ORDER
    return sorted(pairs, key=lambda p: (messages.SEVERITY_ORDER.index(p[1]), order.index(p[0])))


@functools.lru_cache(maxsize=None)
def _cautions(locale):
    return tuple((code, i18n.gettext(locale, text)) for code, text in messages.CAUTIONS.items())


def cautions(locale):
    """The general cautions (SPEC section 6), always shown, in the request's language."""
    return [{"code": code, "message": text} for code, text in _cautions(locale)]


def render(inp, result, outputs, kinds, locale):
    """The response body of a successful calculation."""
    r = Renderer(inp, result, kinds, locale)
    body = r.values(result.values, outputs)
    if body.get("causes"):
        for cause in body["causes"]:
            cause["message"] = i18n.gettext(locale, messages.CAUSES[cause["code"]])
    body["warnings"] = [
        {"code": code, "severity": severity, "message": i18n.gettext(locale, messages.WARNINGS[(code, severity)])}
        for code, severity in sorted_warnings(result.warnings)
    ]
    body["cautions"] = cautions(locale)
    body["assumptions"] = r.assumptions()
    body["computed_on"] = "server"
    return body


def error_body(locale, code, field_errors=(), **params):
    """The one error shape: {"error": {"message", "fields": [{"field", "message"}]}}."""
    return {"error": {
        "message": i18n.gettext(locale, messages.ERRORS[code], **params),
        "fields": [{"field": e.path, "message": i18n.gettext(locale, messages.ERRORS[e.code], **e.params)}
                   for e in field_errors],
    }}
