"""Field definitions: one source for validation, the OpenAPI document and the browser.

Each field parses its raw JSON value into SI (or a plain value), checks its hard range and
describes itself as a JSON schema. Ranges are SI; messages show them in the user's unit.
"""

import math

from .. import units


class FieldError(Exception):
    """One bad field: its dotted path, a message code and the message's parameters."""

    def __init__(self, path, code, **params):
        super().__init__(path, code)
        self.path = path
        self.code = code
        self.params = params


class FlowValue(tuple):
    """A fuel flow that came as mass or volume: (SI value, its dimension). The calculation
    converts it with the fuel density once the fuel is known."""

    __slots__ = ()

    def __new__(cls, si, dimension):
        return super().__new__(cls, (si, dimension))

    def to(self, dimension, density):
        si, given = self
        if given == dimension:
            return si
        return si * density if given == "volume_flow" else si / density


#: Relative distance from a closed range end that counts as the end (unit conversions round).
RANGE_END_TOLERANCE = 1e-12


def _fmt(x):
    return f"{x:.6g}"


class Field:
    """Base: a named field, required or optional, with a description."""

    type = "field"

    def __init__(self, name, *, required=False, description=""):
        self.name = name
        self.required = required
        self.description = description

    def parse(self, raw, path, errors):
        raise NotImplementedError

    def schema(self):
        raise NotImplementedError

    def export(self):
        return {"name": self.name, "type": self.type, "required": self.required}


class _Ranged(Field):
    def __init__(self, name, lo=None, hi=None, *, lo_open=False, hi_open=False, **kw):
        super().__init__(name, **kw)
        self.lo, self.hi, self.lo_open, self.hi_open = lo, hi, lo_open, hi_open

    def check_range(self, si, path, show=lambda v: v, unit=""):
        # A closed end typed in another unit ("-60 degC" is 213.14999999999998 K) is that end.
        for end, is_open in ((self.lo, self.lo_open), (self.hi, self.hi_open)):
            if end is not None and not is_open and abs(si - end) <= RANGE_END_TOLERANCE * abs(end):
                si = float(end)
        bad = (
            (self.lo is not None and (si < self.lo or (self.lo_open and si == self.lo)))
            or (self.hi is not None and (si > self.hi or (self.hi_open and si == self.hi)))
        )
        if bad or not math.isfinite(si):
            lo = -math.inf if self.lo is None else self.lo
            hi = math.inf if self.hi is None else self.hi
            code = ("range_above" if self.lo_open else "range") + ("" if unit else "_plain")
            params = dict(min=_fmt(show(lo)), max=_fmt(show(hi)), **({"unit": unit} if unit else {}))
            raise FieldError(path, code, **params)
        return si

    def range_schema(self, schema):
        if self.lo is not None:
            schema["exclusiveMinimum" if self.lo_open else "minimum"] = self.lo
        if self.hi is not None:
            schema["exclusiveMaximum" if self.hi_open else "maximum"] = self.hi
        return schema

    def export(self):
        return dict(super().export(), min=self.lo, max=self.hi, min_open=self.lo_open, max_open=self.hi_open)


class Quantity(_Ranged):
    """A dimensional value: ``"15 psi"`` or ``{"value": 15, "unit": "psi"}``; range in SI."""

    type = "quantity"

    def __init__(self, name, kind, lo=None, hi=None, **kw):
        super().__init__(name, lo, hi, **kw)
        self.kind = kind
        self.dimensions = units.KINDS[kind][0]

    def parse(self, raw, path, errors):
        try:
            number, unit = units.parse_quantity(raw)
            dimension = units.dimension_of(unit)
            units.to_si(number, unit, self.dimensions, density=1.0)  # checks the spelling
        except units.UnitError as exc:
            raise FieldError(path, exc.code, **exc.params) from None
        factor, offset = units.conversion(dimension, unit)
        si = number * factor + offset
        if not math.isfinite(si):
            raise FieldError(path, "number_format")
        if len(self.dimensions) > 1:
            return FlowValue(self.check_range(si, path, lambda v: v / factor, unit), dimension)
        return self.check_range(si, path, lambda v: (v - offset) / factor, unit)

    def schema(self):
        spellings = units.accepted(self.dimensions)
        si_unit = units.system_unit(self.kind, "si")
        text = f"{self.description} Range in {si_unit}.".strip()
        return {
            "description": text,
            "oneOf": [
                {"type": "string", "pattern": r"^\s*[+-]?([0-9]+(\.[0-9]*)?|\.[0-9]+)([eE][+-]?[0-9]+)?\s*[A-Za-z°].*$",
                 "examples": [f"1 {spellings[0]}"]},
                {"type": "object", "required": ["value", "unit"], "additionalProperties": False,
                 "properties": {"value": {"type": "number"},
                                "unit": {"type": "string", "enum": spellings}}},
            ],
            "x-si-range": [self.lo, self.hi],
            "x-kind": self.kind,
        }

    def export(self):
        return dict(super().export(), kind=self.kind)


class Fraction(_Ranged):
    """A dimensionless value: a number or a string with ``%``."""

    type = "fraction"

    def parse(self, raw, path, errors):
        try:
            value = units.parse_fraction(raw)
        except units.UnitError as exc:
            raise FieldError(path, exc.code) from None
        return self.check_range(value, path)

    def schema(self):
        return {"description": self.description, "oneOf": [
            self.range_schema({"type": "number"}),
            {"type": "string", "pattern": r"^\s*[+-]?([0-9]+(\.[0-9]*)?|\.[0-9]+)([eE][+-]?[0-9]+)?\s*%?\s*$"}]}


class Number(_Ranged):
    """A plain number (ratios, rpm in rev/min)."""

    type = "number"

    def parse(self, raw, path, errors):
        if not units.is_number(raw):
            raise FieldError(path, "number_format")
        return self.check_range(float(raw), path)

    def schema(self):
        return self.range_schema({"type": "number", "description": self.description})


class Count(_Ranged):
    """A whole number; an integral JSON number such as 4.0 is accepted as 4."""

    type = "count"

    def parse(self, raw, path, errors):
        if not units.is_number(raw) or float(raw) != int(raw):
            raise FieldError(path, "count_format")
        return int(self.check_range(int(raw), path))

    def schema(self):
        return self.range_schema({"type": "integer", "description": self.description})


class Choice(Field):
    """One of a fixed set of strings."""

    type = "choice"

    def __init__(self, name, choices, **kw):
        super().__init__(name, **kw)
        self.choices = tuple(choices)

    def parse(self, raw, path, errors):
        if not isinstance(raw, str) or raw not in self.choices:
            raise FieldError(path, "choice", choices=", ".join(self.choices))
        return raw

    def schema(self):
        return {"type": "string", "enum": list(self.choices), "description": self.description}

    def export(self):
        return dict(super().export(), choices=list(self.choices))


class Text(Field):
    """A short free string (a language tag)."""

    type = "text"

    def parse(self, raw, path, errors):
        if not isinstance(raw, str) or len(raw) > 35:
            raise FieldError(path, "string")
        return raw

    def schema(self):
        return {"type": "string", "maxLength": 35, "description": self.description}


class Object(Field):
    """A nested object of fields; unknown keys are errors."""

    type = "object"

    def __init__(self, name, fields, **kw):
        super().__init__(name, **kw)
        self.fields = list(fields)

    def parse(self, raw, path, errors):
        if not isinstance(raw, dict):
            raise FieldError(path, "object")
        return parse_fields(self.fields, raw, path + ".", errors)

    def schema(self):
        return object_schema(self.fields, self.description)

    def export(self):
        return dict(super().export(), fields=[f.export() for f in self.fields])


class List(Field):
    """A list of items of one field type, with a length range."""

    type = "list"

    def __init__(self, name, item, min_items, max_items, **kw):
        super().__init__(name, **kw)
        self.item, self.min_items, self.max_items = item, min_items, max_items

    def parse(self, raw, path, errors):
        if not isinstance(raw, list):
            raise FieldError(path, "list")
        if not self.min_items <= len(raw) <= self.max_items:
            raise FieldError(path, "list_length", min=self.min_items, max=self.max_items)
        out = []
        for i, value in enumerate(raw):
            try:
                out.append(self.item.parse(value, f"{path}[{i}]", errors))
            except FieldError as exc:
                errors.append(exc)
                out.append(None)
        return out

    def schema(self):
        return {"type": "array", "minItems": self.min_items, "maxItems": self.max_items,
                "items": self.item.schema(), "description": self.description}

    def export(self):
        return dict(super().export(), item=self.item.export(), min_items=self.min_items, max_items=self.max_items)


class UnitMap(Field):
    """``output_units``: {flat field name: unit spelling}; checked against the endpoint."""

    type = "unit_map"

    def parse(self, raw, path, errors):
        if not isinstance(raw, dict) or len(raw) > 100:
            raise FieldError(path, "object")
        for key, value in raw.items():
            if not isinstance(value, str):
                errors.append(FieldError(f"{path}.{key}", "string"))
        return dict(raw)

    def schema(self):
        return {"type": "object", "additionalProperties": {"type": "string"}, "maxProperties": 100,
                "description": self.description}


def parse_fields(fields, raw, prefix, errors):
    """Parse a JSON object against fields; collect every error; return {name: value}."""
    known = {f.name: f for f in fields}
    out = {}
    for key in raw:
        if key not in known:
            errors.append(FieldError(prefix + str(key), "unknown_field"))
    for field in fields:
        path = prefix + field.name
        if field.name not in raw or raw[field.name] is None:
            if field.required:
                errors.append(FieldError(path, "required"))
            continue
        try:
            value = field.parse(raw[field.name], path, errors)
        except FieldError as exc:
            errors.append(exc)
            continue
        out[field.name] = value
    return out


def nullable(schema):
    """The schema of an optional field, which also takes ``null``: :func:`parse_fields` reads
    ``null`` as "not given" (the default applies); a required field stays non-null."""
    if "oneOf" in schema:
        return dict(schema, oneOf=schema["oneOf"] + [{"type": "null"}])
    schema = dict(schema, type=[schema["type"], "null"])
    if "enum" in schema:
        schema["enum"] = schema["enum"] + [None]
    return schema


def object_schema(fields, description=""):
    """JSON schema of an object of fields (used by the OpenAPI document)."""
    def one(f):
        schema = dict(f.schema(), **({"description": f.description} if f.description else {}))
        return schema if f.required else nullable(schema)

    schema = {
        "type": "object",
        "additionalProperties": False,
        "properties": {f.name: one(f) for f in fields},
    }
    required = [f.name for f in fields if f.required]
    if required:
        schema["required"] = required
    if description:
        schema["description"] = description
    return schema
