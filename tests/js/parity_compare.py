"""Comparison of an offline answer with the server's recorded answer (SPEC section 7).

The Python twin of ``tests/js/parity_compare.mjs`` (same rules, same tolerances; read the
rules there), used by the Chromium run ``tests/browser/test_offline_parity.py``, which
brings the browser's answers back to Python as JSON text (so key order survives).
"""

import json
import math
import re
from pathlib import Path

ROOT = Path(__file__).resolve().parents[2]
REL = 1e-9
FLOOR_SI = 1e-6
FLOOR_DISPLAY = 1e-9
ROOT_FIND = {"boost", "manifold_pressure", "pressure_ratio", "manifold_temperature", "expected_power"}
NUMBER_IN_TEXT = re.compile(r"[-+]?(?:\d+\.?\d*|\.\d+)(?:e[-+]?\d+)?|-?inf|nan")


def _factors():
    table = json.loads((ROOT / "static" / "generated" / "units.json").read_text(encoding="utf-8"))
    return {unit: (v["factor"], v["offset"]) for spellings in table["dimensions"].values() for unit, v in spellings.items()}


FACTORS = _factors()


class Mismatch(AssertionError):
    """The first difference between the two answers."""


def make_stats():
    return {"numbers": 0, "identical": 0, "max_rel_si": 0.0, "max_rel_si_at": "", "max_abs_si": 0.0,
            "max_abs_si_at": "", "strings": 0, "masked_messages": 0, "masked_identical": 0}


def _is_number(x):
    return isinstance(x, (int, float)) and not isinstance(x, bool)


def _number(a, b, where, unit, root_find, stats):
    if not _is_number(b):
        raise Mismatch(f"{where}: expected a number {a}, got {b!r}")
    if not math.isfinite(b):
        raise Mismatch(f"{where}: not finite: {b}")
    factor, offset = FACTORS[unit] if unit else (1.0, 0.0)
    a_si, b_si = a * factor + offset, b * factor + offset
    diff_si, scale_si = abs(a_si - b_si), max(abs(a_si), abs(b_si))
    stats["numbers"] += 1
    stats["identical"] += a == b
    rel = diff_si / scale_si if scale_si else 0.0
    if rel > stats["max_rel_si"]:
        stats["max_rel_si"], stats["max_rel_si_at"] = rel, where
    if diff_si > stats["max_abs_si"]:
        stats["max_abs_si"], stats["max_abs_si_at"] = diff_si, where
    if not diff_si <= REL * scale_si + FLOOR_SI:
        raise Mismatch(f"{where}: server {a}, device {b} {unit or ''}: outside the parity tolerance of SPEC section 7")
    if not root_find and not abs(a - b) <= REL * max(abs(a), abs(b)) + FLOOR_DISPLAY:
        raise Mismatch(f"{where}: server {a}, device {b} {unit or ''}: beyond 1e-9 relative")


def _message(a, b, where, stats):
    if not isinstance(b, str):
        raise Mismatch(f"{where}: expected a string, got {b!r}")
    stats["strings"] += 1
    if not re.search(r"\d", a):
        if a != b:
            raise Mismatch(f"{where}: text differs:\n  server {a!r}\n  device {b!r}")
        return
    stats["masked_messages"] += 1
    stats["masked_identical"] += a == b
    if NUMBER_IN_TEXT.sub("#", a) != NUMBER_IN_TEXT.sub("#", b):
        raise Mismatch(f"{where}: text differs beyond its numbers:\n  server {a!r}\n  device {b!r}")
    for i, (x, y) in enumerate(zip(NUMBER_IN_TEXT.findall(a), NUMBER_IN_TEXT.findall(b))):
        p, q = float(x), float(y)
        if x != y and not (math.isfinite(p) and abs(p - q) <= 5e-6 * max(abs(p), abs(q))):
            raise Mismatch(f"{where}: number {i} in the message: server {x}, device {y}")


def _is_quantity(v):
    return (isinstance(v, dict) and list(v) in (["value", "unit"], ["unit", "value"]) and _is_number(v["value"])
            and isinstance(v["unit"], str))


def _value(a, b, where, ctx, stats):
    if _is_number(a):
        return _number(a, b, where, None, ctx["root_find"], stats)
    if isinstance(a, str):
        if ctx["in_error"] and ctx["key"] == "message":
            return _message(a, b, where, stats)
        stats["strings"] += 1
        if a != b:
            raise Mismatch(f"{where}: text differs:\n  server {a!r}\n  device {b!r}")
        return None
    if a is None or isinstance(a, bool):
        if a is not b:
            raise Mismatch(f"{where}: server {a!r}, device {b!r}")
        return None
    if isinstance(a, list):
        if not isinstance(b, list) or len(a) != len(b):
            raise Mismatch(f"{where}: lists differ: {len(a)} items against {b!r:.200}")
        for i, (x, y) in enumerate(zip(a, b)):
            _value(x, y, f"{where}[{i}]", ctx, stats)
        return None
    if not isinstance(b, dict):
        raise Mismatch(f"{where}: expected an object, got {b!r:.200}")
    if _is_quantity(a):
        if not _is_quantity(b) or list(a) != list(b):
            raise Mismatch(f"{where}: expected a quantity, got {b!r}")
        if a["unit"] != b["unit"]:
            raise Mismatch(f"{where}: unit {a['unit']} against {b['unit']}")
        return _number(a["value"], b["value"], f"{where}.value", a["unit"], ctx["root_find"], stats)
    if list(a) != list(b):
        raise Mismatch(f"{where}: keys differ:\n  server {', '.join(a)}\n  device {', '.join(b)}")
    for key in a:
        _value(a[key], b[key], f"{where}.{key}", dict(
            ctx, key=key, in_error=ctx["in_error"] or key == "error",
            root_find=ctx["root_find"] or (ctx["bfp"] and key in ROOT_FIND)), stats)
    return None


def compare_answer(vector, status, body, stats):
    """Raise Mismatch at the first difference between the device's answer and the vector."""
    where = vector["id"]
    if status != vector["status"]:
        raise Mismatch(f"{where}: status {status}, server {vector['status']}: {json.dumps(body)[:400]}")
    expected, actual = dict(vector["response"]), dict(body)
    if vector["status"] == 200:
        if expected.get("computed_on") != "server":
            raise Mismatch(f"{where}: recorded answer lacks computed_on 'server'")
        if actual.get("computed_on") != "device":
            raise Mismatch(f"{where}: computed_on {actual.get('computed_on')!r}, expected 'device'")
    expected.pop("computed_on", None)
    actual.pop("computed_on", None)
    _value(expected, actual, where, {"in_error": False, "key": None, "root_find": False,
                                     "bfp": vector["endpoint"] == "boost-for-power"}, stats)
