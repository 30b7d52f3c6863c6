"""Write the parity vectors of the offline API from the server's real answers.

Builds requests for all seven endpoints of ``/api/v1`` (typical cases in every unit
system, every induction, fuel, regulator and boost control, altitude tables, output_units
overrides, wheel power, SAE J1349 bases, measured powers, unreachable and below-NA
targets, pump curves with extrapolation, every warning code, and error cases), posts them
through ``webcalc.create_app().test_client()`` and records status and JSON body. The
browser's offline handler (``static/js/offline/handler.js``) must give the same answers:
``tests/js/parity.test.mjs`` (Node) and ``tests/browser/test_offline_parity.py``
(Chromium) check it.

The file is deterministic (seeded random cases, no clock). The envelope of each vector has
sorted keys; request and response bodies keep their key order, which is part of what is
compared (the order of unknown-field errors and of response fields).

Usage (from the repository root)::

    python tools/parity_vectors.py              # rewrite tests/js/parity_vectors.json
    python tools/parity_vectors.py --out FILE   # write elsewhere (the freshness test does)
    python tools/parity_vectors.py --check      # exit 1 if the committed file is stale
"""

from __future__ import annotations

import argparse
import json
import random
import sys
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
if str(ROOT) not in sys.path:
    sys.path.insert(0, str(ROOT))

from webcalc import create_app, messages, units  # noqa: E402
from webcalc.api import KINDS  # noqa: E402

DEFAULT_OUT = ROOT / "tests" / "js" / "parity_vectors.json"
SEED = 1976
#: Bump when the layout of the file changes (the tests check it).
FORMAT = 1
#: How many random cases per endpoint (on top of the targeted ones).
RANDOM_CASES = {
    "site": 110, "pressure-ratio": 170, "power": 230, "boost-for-power": 130,
    "airflow": 140, "injectors": 150, "fuel-pump": 150,
}
#: Share of random cases that get one deliberately bad input.
MUTATION_RATE = 0.12
#: Error codes no request through handle() can give (other HTTP paths, or unused).
UNREACHABLE_ERRORS = {"unsupported_media_type", "method_not_allowed", "curve_flow_positive"}


# --------------------------------------------------------------------------- value builders


class Builder:
    """Random request pieces in every accepted spelling (seeded)."""

    def __init__(self, rng):
        self.r = rng

    def chance(self, p):
        return self.r.random() < p

    def number(self, x):
        """A number as JSON would carry it: rounded, full precision, or an integer."""
        kind = self.r.random()
        if kind < 0.5:
            return float(f"{x:.4g}")
        if kind < 0.8:
            return x
        return int(round(x)) if abs(x) >= 10 else float(f"{x:.3g}")

    def text(self, x):
        kind = self.r.random()
        if kind < 0.6:
            return f"{x:.5g}"
        if kind < 0.8:
            return repr(float(x))
        return f"{x:.3e}"

    def q(self, si, dimension, unit=None):
        """A quantity input with value ``si`` (SI) in a random unit of ``dimension``."""
        unit = unit or self.r.choice(list(units.UNITS[dimension]))
        factor, offset = units.conversion(dimension, unit)
        value = (si - offset) / factor
        form = self.r.random()
        if form < 0.45:
            return f"{self.text(value)} {unit}"
        if form < 0.55:
            return f"{self.text(value)}{unit}"
        if form < 0.62:
            return f"  {self.text(value)}   {unit} "
        return {"value": self.number(value), "unit": unit}

    def frac(self, x):
        form = self.r.random()
        if form < 0.6:
            return self.number(x)
        if form < 0.85:
            return f"{x * 100:.3g} %"
        return f"{x * 100:.3g}%"

    def uniform(self, lo, hi):
        return self.r.uniform(lo, hi)

    def site(self, p=0.8, allow_high=True):
        if not self.chance(p):
            return None
        s = {}
        mode = self.r.random()
        top = 5000.0 if allow_high else 2500.0
        if mode < 0.35:
            s["altitude"] = self.q(self.uniform(-400, top), "length")
        elif mode < 0.6:
            s["station_pressure"] = self.q(self.uniform(62e3, 104e3), "pressure")
            if self.chance(0.3):
                s["altitude"] = self.q(self.uniform(0, 3000), "length")
        elif mode < 0.8:
            s["altitude"] = self.q(self.uniform(-200, 3500), "length")
            s["altimeter_setting"] = self.q(self.uniform(97e3, 104e3), "pressure")
        if self.chance(0.6):
            s["temperature"] = self.q(self.uniform(258.15, 318.15), "temperature")
        if self.chance(0.4):
            s["relative_humidity"] = self.frac(self.uniform(0, 1))
        return s

    def compressor(self, body, induction=None):
        induction = induction or (self.r.choice(["turbo", "centrifugal", "roots", "twin_screw"])
                                  if self.chance(0.75) else None)
        if induction:
            body["induction"] = induction
        if self.chance(0.35):
            body["inlet_loss"] = self.q(self.uniform(0, 6e3), "pressure")
        if self.chance(0.35):
            body["intercooler_loss"] = self.q(self.uniform(0, 20e3), "pressure")
        if self.chance(0.35):
            body["compressor_efficiency"] = self.frac(self.uniform(0.5, 0.8))
        if self.chance(0.4):
            body["intercooler_effectiveness"] = 0 if self.chance(0.3) else self.frac(self.uniform(0.4, 0.95))
        if self.chance(0.2):
            body["coolant_temperature"] = self.q(self.uniform(273.15, 323.15), "temperature")
        if self.chance(0.15):
            body["max_pressure_ratio"] = self.number(self.uniform(1.8, 5.0))
        return induction or "turbo"

    def altitudes(self, n=None):
        n = n or self.r.randint(1, 6)
        return [self.q(self.uniform(-500, 4500), "length") for _ in range(n)]

    def boost_set_at(self):
        return {"site": self.site(0.9) or {}, "control": self.r.choice(["held_manifold", "held_gauge", "fixed_ratio"])}

    def power(self, lo, hi):
        return self.q(self.uniform(lo, hi), "power")

    def fuel(self, body):
        if self.chance(0.6):
            body["fuel"] = self.r.choice(["gasoline", "ethanol", "methanol", "e85"])
        if body.get("fuel", "gasoline") in ("gasoline", "e85") and self.chance(0.25):
            body["ethanol_content"] = self.frac(self.r.choice([0.0, 0.05, 0.1, 0.15, 0.3, 0.7, 0.85, 1.0]))

    def power_basis(self, body):
        if self.chance(0.15):
            body["power_basis"] = "wheel"
            body["drivetrain_loss"] = self.frac(self.uniform(0.08, 0.25))
        elif self.chance(0.05):
            body["power_basis"] = "crank"

    def output(self, body, endpoint):
        """Unit system and output_units overrides (valid ones)."""
        if self.chance(0.7):
            body["units"] = self.r.choice(["metric", "imperial", "si"])
        if self.chance(0.3):
            kinds = {n: k for n, k in KINDS[endpoint].items() if k}
            overrides = {}
            for name in self.r.sample(sorted(kinds), k=min(len(kinds), self.r.randint(1, 3))):
                overrides[name] = self.r.choice(units.accepted(units.KINDS[kinds[name]][0]))
            body["output_units"] = overrides


# --------------------------------------------------------------------------- random cases


def random_site(b):
    body = {}
    site = b.site(0.92)
    if site is not None:
        body["site"] = site
    b.output(body, "site")
    return body


def random_pressure_ratio(b):
    body = {"boost": b.q(b.uniform(0, 260e3) if b.chance(0.95) else 0.0, "pressure")}
    site = b.site()
    if site is not None:
        body["site"] = site
    b.compressor(body)
    if b.chance(0.35):
        body["boost_set_at"] = b.boost_set_at()
    if b.chance(0.35):
        body["altitudes"] = b.altitudes()
    b.output(body, "pressure-ratio")
    return body


def random_na(b, body):
    if b.chance(0.25):
        body["na_site"] = b.site(1.0) or {}
    if b.chance(0.25):
        body["na_power_basis"] = b.r.choice(["observed", "sae_j1349"])
    b.fuel(body)
    if b.chance(0.3):
        body["bsfc"] = b.q(b.uniform(0.42, 0.62) * 1.68965941067156e-07, "bsfc")
    if b.chance(0.3):
        body["afr"] = b.number(b.uniform(10.5, 13.5) if body.get("fuel", "gasoline") == "gasoline" else b.uniform(4.5, 13))


def random_power(b):
    na = b.uniform(60e3, 450e3)
    boost = b.uniform(0, 220e3) if b.chance(0.95) else 0.0
    body = {"na_power": b.q(na, "power"), "boost": b.q(boost, "pressure")}
    site = b.site()
    if site is not None:
        body["site"] = site
    random_na(b, body)
    b.compressor(body)
    choice = b.r.random()
    if choice < 0.15 and boost > 0:
        body["exhaust_back_pressure"] = b.q(boost * b.uniform(0.5, 2.0), "pressure")
    elif choice < 0.3:
        body["exhaust_to_boost_ratio"] = b.number(b.uniform(0, 2.5))
    if b.chance(0.2):
        body["drive_efficiency"] = b.frac(b.uniform(0.8, 1.0))
    if b.chance(0.6):
        body["measured_power"] = b.q(na * (1 + boost / 1e5) * b.uniform(0.55, 1.2), "power")
        if b.chance(0.3):
            body["measured_power_basis"] = b.r.choice(["observed", "sae_j1349"])
    if b.chance(0.3):
        body["boost_set_at"] = b.boost_set_at()
    if b.chance(0.3):
        body["altitudes"] = b.altitudes()
    b.power_basis(body)
    b.output(body, "power")
    return body


def random_boost_for_power(b):
    na = b.uniform(60e3, 450e3)
    body = {"target_power": b.q(na * b.uniform(0.7, 3.8), "power"), "na_power": b.q(na, "power")}
    site = b.site()
    if site is not None:
        body["site"] = site
    random_na(b, body)
    b.compressor(body)
    if b.chance(0.2):
        body["exhaust_to_boost_ratio"] = b.number(b.uniform(0, 2))
    if b.chance(0.15):
        body["drive_efficiency"] = b.frac(b.uniform(0.8, 1.0))
    if b.chance(0.3):
        body["altitudes"] = b.altitudes(b.r.randint(1, 4))
    b.power_basis(body)
    b.output(body, "boost-for-power")
    return body


def random_airflow(b):
    body = {"power": b.power(50e3, 900e3)}
    b.fuel(body)
    if b.chance(0.3):
        body["bsfc"] = b.q(b.uniform(0.45, 0.7) * 1.68965941067156e-07, "bsfc")
    pick = b.r.random()
    if pick < 0.25:
        body["afr"] = b.number(b.uniform(5, 14))
    elif pick < 0.5:
        body["lambda"] = b.number(b.uniform(0.7, 1.05))
    site = b.site()
    if site is not None:
        body["site"] = site
    if b.chance(0.8):
        body["boost"] = b.q(b.uniform(0, 250e3), "pressure")
    b.compressor(body)
    if b.chance(0.3):
        body["compressor_count"] = b.r.choice([1, 2, 2.0, 4])
    if b.chance(0.45):
        body["displacement"] = b.q(b.uniform(1.0e-3, 7.0e-3), "volume")
        body["rpm"] = b.number(b.uniform(3000, 9000))
    if b.chance(0.2):
        body["reference_pressure"] = b.q(b.uniform(95e3, 101.325e3), "pressure")
    if b.chance(0.2):
        body["reference_temperature"] = b.q(b.uniform(288.15, 302.0), "temperature")
    b.power_basis(body)
    b.output(body, "airflow")
    return body


def random_fuel_system(b, body):
    body["power"] = b.power(60e3, 900e3)
    b.fuel(body)
    if b.chance(0.3):
        body["bsfc"] = b.q(b.uniform(0.45, 0.75) * 1.68965941067156e-07, "bsfc")
    if b.chance(0.15):
        body["fuel_density"] = b.q(b.uniform(700, 800), "density")
    induction = b.r.choice(["na", "turbo", "centrifugal", "roots", "twin_screw", None])
    if induction:
        body["induction"] = induction
    if induction != "na":
        body["boost"] = b.q(b.uniform(0, 250e3), "pressure")
    elif b.chance(0.3):
        body["boost"] = b.q(0.0, "pressure")
    if b.chance(0.4):
        body["base_fuel_pressure"] = b.q(b.uniform(2.5e5, 5e5), "pressure")
    if b.chance(0.5):
        body["regulator"] = b.r.choice(["boost_referenced", "fixed"])


def random_injectors(b):
    body = {}
    random_fuel_system(b, body)
    body["injector_count"] = b.r.choice([4, 6, 8, 8.0, 12])
    if b.chance(0.3):
        body["max_duty"] = b.frac(b.uniform(0.6, 0.95))
    if b.chance(0.3):
        body["rated_pressure"] = b.q(b.r.choice([3e5, 2.7e5, 4e5]), "pressure")
    if b.chance(0.6):
        dim = "volume_flow" if b.chance(0.6) else "mass_flow"
        si = b.uniform(300, 1600) * 1e-6 / 60 if dim == "volume_flow" else b.uniform(2.5, 12) * 1e-3
        body["injector_flow"] = b.q(si, dim)
        if b.chance(0.4):
            body["rating_fluid_density"] = b.q(b.uniform(680, 760), "density")
    b.power_basis(body)
    b.output(body, "injectors")
    return body


def random_curve(b, points=None):
    n = points or b.r.randint(2, 6)
    start = b.uniform(1e5, 3e5)
    step = b.uniform(0.5e5, 1.5e5)
    flow = b.uniform(150, 450) / 3.6e6  # m^3/s
    curve = []
    for i in range(n):
        pressure = start + i * step
        f = flow * (1 - 0.12 * i * b.uniform(0.5, 1.5))
        if f <= 0:
            break
        dim = "volume_flow" if b.chance(0.75) else "mass_flow"
        si = f if dim == "volume_flow" else f * 745.0
        curve.append({"pressure": b.q(pressure, "pressure"), "flow": b.q(si, dim)})
    return curve if len(curve) >= 2 else curve + [{"pressure": b.q(start + 20 * step, "pressure"), "flow": "1 L/h"}]


def random_fuel_pump(b):
    body = {}
    random_fuel_system(b, body)
    if b.chance(0.3):
        body["line_loss"] = b.q(b.uniform(0, 30e3), "pressure")
    if b.chance(0.3):
        body["margin"] = b.frac(b.uniform(0, 0.5))
    if b.chance(0.3):
        body["pump_count"] = b.r.choice([1, 2, 3])
    if b.chance(0.7):
        body["pump_curve"] = random_curve(b)
    b.power_basis(body)
    b.output(body, "fuel-pump")
    return body


RANDOM = {
    "site": random_site, "pressure-ratio": random_pressure_ratio, "power": random_power,
    "boost-for-power": random_boost_for_power, "airflow": random_airflow,
    "injectors": random_injectors, "fuel-pump": random_fuel_pump,
}

#: One bad value per kind of field, with the error it should give.
BAD_QUANTITIES = [15, "15", "15 psig", "15 psia", "2 barg", "15 furlongs", "15 kg/s", "abc", True, None,
                  {"value": 15}, {"value": "15", "unit": "psi"}, {"value": 1, "unit": "bar", "x": 1},
                  "1e999 psi", "-5 bar", "1e9 bar", "  ", "15 P a", [15, "psi"]]
BAD_FRACTIONS = ["80 percent", True, "x %", 1.5, -0.1, "150 %", [0.5], {"value": 0.5}]
BAD_NUMBERS = ["12.5", True, [1], 1e6, -3]
BAD_COUNTS = [4.5, "4", True, 0, 100, 1e20, [4]]
BAD_CHOICES = ["supercharger", 3, "Turbo", None]


def mutate(b, body, endpoint, fields):
    """Make one input bad (a random field of the endpoint's schema, or an unknown one)."""
    field = b.r.choice(fields)
    name = field.name
    kind = type(field).__name__
    pick = b.r.random()
    if pick < 0.1:
        body[b.r.choice(["boots", "Boost", "site_altitude", "unit"])] = 1
        return
    if kind == "Quantity":
        body[name] = b.r.choice(BAD_QUANTITIES)
    elif kind == "Fraction":
        body[name] = b.r.choice(BAD_FRACTIONS)
    elif kind == "Number":
        body[name] = b.r.choice(BAD_NUMBERS)
    elif kind == "Count":
        body[name] = b.r.choice(BAD_COUNTS)
    elif kind == "Choice":
        body[name] = b.r.choice(BAD_CHOICES)
    elif kind == "Text":
        body[name] = b.r.choice([5, "x" * 40, ["en"]])
    elif kind == "Object":
        body[name] = b.r.choice(["here", [1], {"altitude": "1 parsec", "colour": "red"}, {"control": "by_hand"}])
    elif kind == "List":
        body[name] = b.r.choice(["0 m", [], ["0 m"] * 51, ["0 m", "1e6 m", 5], [{"pressure": "3 bar"}]])
    elif kind == "UnitMap":
        body[name] = b.r.choice([{"boost_here": 5}, {"nonsense": "bar"}, {"pressure_ratio": "bar"},
                                 {"manifold_pressure": "kg/s"}, {"manifold_pressure": "psig"}, "psi"])


# --------------------------------------------------------------------------- targeted cases


def targeted():
    """(id, endpoint, request) cases chosen for coverage: every option, warning and error."""
    cases = []

    def add(case_id, endpoint, body=None, **extra):
        cases.append(dict(id=case_id, endpoint=endpoint, request=body, **extra))

    # site: every way to give pressure; the J1349 range; beyond the troposphere; humidity
    add("site/default", "site", {})
    add("site/null-site", "site", {"site": None})
    add("site/altitude-ft", "site", {"site": {"altitude": "5280 ft"}, "units": "imperial"})
    add("site/altimeter", "site", {"site": {"altitude": "1200 m", "altimeter_setting": "29.92 inHg", "temperature": "30 degC"}})
    add("site/station-si", "site", {"site": {"station_pressure": "98 kPa", "temperature": "25 degC", "relative_humidity": "50 %"}, "units": "si"})
    add("site/in-range", "site", {"site": {"station_pressure": "990 hPa", "temperature": "298.15 K"}})
    add("site/beyond-troposphere", "site", {"site": {"station_pressure": "22 kPa", "temperature": "60 degC", "relative_humidity": 1}})
    add("site/hot-humid", "site", {"site": {"altitude": "0 m", "temperature": "140 degF", "relative_humidity": 1.0}})
    add("site/cold", "site", {"site": {"altitude": "11000 m", "temperature": "-60 °C"}})
    add("site/degR", "site", {"site": {"altitude": "-610 m", "temperature": "540 degR"}})
    add("site/both-pressures", "site", {"site": {"station_pressure": "100 kPa", "altimeter_setting": "101 kPa"}})
    add("site/altimeter-no-altitude", "site", {"site": {"altimeter_setting": "101 kPa"}})
    add("site/below-range", "site", {"site": {"altitude": "-700 m"}})
    add("site/above-range-ft", "site", {"site": {"altitude": "40000 ft"}})
    add("site/temperature-degF-range", "site", {"site": {"temperature": "200 degF"}})
    add("site/psig", "site", {"site": {"station_pressure": "14.7 psig"}})
    add("site/bare", "site", {"site": {"altitude": 1500}})
    add("site/unknown-in-site", "site", {"site": {"elevation": "100 m"}})
    add("site/not-object", "site", {"site": "sea level"})
    add("site/output-units", "site", {"site": {"altitude": "2000 m"}, "output_units": {"station_pressure": "inHg", "temperature": "degF", "density_altitude": "ft"}})
    add("site/output-units-bad", "site", {"output_units": {"correction_factor": "bar", "station_pressure": "kg/L", "temperature": "celsius", "nothing": "m", "altitude": 3}})
    add("site/output-units-not-object", "site", {"output_units": ["kPa"]})
    add("site/units-bad", "site", {"units": "furlongs"})
    add("site/lang-de", "site", {"lang": "de"})
    # Every language: a warning-rich success and field errors with decimal numbers in them.
    from webcalc import i18n
    for loc in i18n.LOCALES:
        add(f"lang/{loc}/warnings", "injectors", {"lang": loc, "power": "600 hp", "boost": "2.2 bar",
                                                 "injector_count": 4, "injector_flow": "550 cc/min", "fuel": "e85"})
        add(f"lang/{loc}/errors", "power", {"lang": loc, "na_power": "-3 hp", "boost": "x psi",
                                             "site": {"relative_humidity": 1.5, "altitude": "9 km"}})
    # Range ends typed as printed (-60 degC is 213.14999999999998 K) are the end; just past is not.
    add("range/end-degC", "site", {"site": {"temperature": "-60 degC"}})
    add("range/end-lb-hp-h", "injectors", {"power": "300 hp", "boost": "1 bar", "injector_count": 4, "bsfc": "2.0 lb/hp/h"})
    add("range/past-end-degC", "site", {"site": {"temperature": "-60.000001 degC"}})
    # Vapour pressure above the station pressure: no dry air left, a 400 naming the humidity.
    add("site/humidity-above-station", "site", {"site": {"altitude": "11000 m", "altimeter_setting": "85 kPa",
                                                         "temperature": "60 degC", "relative_humidity": 1}})
    add("power/humidity-above-station-na", "power", {"na_power": "200 kW", "boost": "1 bar",
                                                     "na_site": {"station_pressure": "22 kPa", "temperature": "60 degC",
                                                                 "relative_humidity": 1}})
    # A finite SI result that overflows in its output unit (3e305 kg/s in cc/min): 400 naming inputs.
    add("injectors/output-unit-overflow", "injectors", {"power": "300 hp", "boost": "1 bar", "injector_count": 4,
                                                         "max_duty": 2.2e-309})
    add("lang/pt-PT-header", "site", {"site": {"altitude": "x"}}, accept_language="pt-PT,pt;q=0.9")
    add("lang/fr-CA-query", "fuel-pump", {"power": "1 W"}, query_lang="fr-CA")
    add("site/lang-not-string", "site", {"lang": 7})
    add("site/lang-long", "site", {"lang": "x" * 36})
    add("site/query-lang", "site", {}, query_lang="fr-CA")
    add("site/accept-language", "site", {}, accept_language="de-DE,de;q=0.9,en;q=0.5")
    add("site/accept-language-en", "site", {"site": {"altitude": "x"}}, accept_language="EN-us")
    add("site/dict-quantity-strip", "site", {"site": {"altitude": {"value": 100, "unit": " m "}}})
    add("site/exponent", "site", {"site": {"altitude": "1.5e3m", "temperature": "+2.5E1 degC"}})
    add("site/long-string", "site", {"site": {"altitude": "1" * 101 + " m"}})
    add("site/boolean", "site", {"site": {"relative_humidity": True}})
    add("site/percent-plain-string", "site", {"site": {"relative_humidity": "0.3"}})
    add("site/unicode-unit", "site", {"site": {"altitude": "100 m²"}})
    add("units/nbsp", "site", {"site": {"altitude": "100\u00a0m", "temperature": "\u200320 degC\u3000"}})
    add("units/unit-starts-odd", "pressure-ratio", {"boost": "15 %psi", "site": {"altitude": "15 2m", "temperature": "20 _degC"}})
    add("units/unit-carriage-return", "pressure-ratio", {"boost": "15 p\rsi", "site": {"altitude": "15 m\n"}})
    add("units/unit-separator-space", "pressure-ratio", {"boost": "15\x1cpsi\x1f"})
    add("site/lang-astral-ok", "site", {"lang": "\U0001F600" * 30})
    add("site/lang-astral-long", "site", {"lang": "\U0001F600" * 36, "site": {"altitude": "\U0001F600" * 40 + " m"}})
    add("site/quantity-astral-101", "site", {"site": {"altitude": "1 " + "m" * 98 + "\U0001F600"}})

    # pressure ratio: every induction, controls, tables, losses, intercooler off
    for ind in ("turbo", "centrifugal", "roots", "twin_screw"):
        add(f"pr/{ind}", "pressure-ratio", {"boost": "1.2 bar", "induction": ind})
        add(f"pr/{ind}-high", "pressure-ratio", {"boost": "30 psi", "induction": ind, "intercooler_effectiveness": 0})
    for control in ("held_manifold", "held_gauge", "fixed_ratio"):
        add(f"pr/set-at-{control}", "pressure-ratio", {
            "boost": "1 bar", "site": {"altitude": "2000 m"}, "induction": "roots",
            "boost_set_at": {"site": {"altitude": "0 m"}, "control": control},
            "altitudes": ["0 m", "1000 m", "2000 m", "3000 m"]})
        add(f"pr/set-at-{control}-lower", "pressure-ratio", {
            "boost": "0.5 bar", "site": {"altitude": "0 m"},
            "boost_set_at": {"site": {"altitude": "2500 m"}, "control": control}, "units": "imperial"})
    add("pr/set-at-just-higher", "pressure-ratio", {  # 1e-4 Pa more boost here: above the 1e-9 Pa slack
        "boost": "1 bar", "site": {"station_pressure": "100 kPa"},
        "boost_set_at": {"site": {"station_pressure": "100.0000001 kPa"}, "control": "held_manifold"}})
    add("pr/set-at-same", "pressure-ratio", {
        "boost": "1 bar", "site": {"station_pressure": "100 kPa"},
        "boost_set_at": {"site": {"station_pressure": "100 kPa"}, "control": "fixed_ratio"}, "inlet_loss": "2 kPa"})
    add("pr/set-at-missing-control", "pressure-ratio", {"boost": "1 bar", "boost_set_at": {"site": {}}})
    add("pr/set-at-bad-control", "pressure-ratio", {"boost": "1 bar", "boost_set_at": {"site": {}, "control": "wastegate"}})
    add("pr/set-at-inlet", "pressure-ratio", {"boost": "1 bar", "site": {"station_pressure": "60 kPa"}, "inlet_loss": "45 kPa",
                                              "boost_set_at": {"site": {"station_pressure": "40 kPa"}, "control": "held_gauge"}})
    add("pr/inlet-not-positive", "pressure-ratio", {"boost": "1 bar", "site": {"station_pressure": "30 kPa"}, "inlet_loss": "40 kPa"})
    add("pr/table-inlet", "pressure-ratio", {"boost": "1 bar", "site": {"station_pressure": "60 kPa", "altitude": "0 m"},
                                             "inlet_loss": "45 kPa", "altitudes": ["0 m", "10000 m"]})
    add("pr/table-50", "pressure-ratio", {"boost": "15 psi", "altitudes": [f"{i * 200} m" for i in range(50)]})
    add("pr/table-51", "pressure-ratio", {"boost": "15 psi", "altitudes": [f"{i * 200} m" for i in range(51)]})
    add("pr/table-empty", "pressure-ratio", {"boost": "15 psi", "altitudes": []})
    add("pr/table-bad-items", "pressure-ratio", {"boost": "15 psi", "altitudes": ["0 m", 100, "20 km", "5 kPa"]})
    add("pr/table-output-units", "pressure-ratio", {"boost": "1 bar", "altitudes": ["0 ft", "5000 ft"],
                                                     "output_units": {"boost_here": "psi", "altitude": "ft", "station_pressure": "inHg"}})
    add("pr/zero-boost", "pressure-ratio", {"boost": "0 bar", "intercooler_effectiveness": 0})
    add("pr/max-boost", "pressure-ratio", {"boost": "700 kPa"})
    add("pr/boost-over", "pressure-ratio", {"boost": "700.001 kPa"})
    add("pr/max-ratio-open", "pressure-ratio", {"boost": "1 bar", "max_pressure_ratio": 1})
    add("pr/max-ratio-low", "pressure-ratio", {"boost": "1 bar", "max_pressure_ratio": 1.5})
    add("pr/efficiency-range", "pressure-ratio", {"boost": "1 bar", "compressor_efficiency": "20 %"})
    add("pr/coolant", "pressure-ratio", {"boost": "2 bar", "coolant_temperature": "90 degC", "intercooler_effectiveness": 0.9})
    add("pr/missing-boost", "pressure-ratio", {})
    add("pr/all-errors", "pressure-ratio", {"zzz": 1, "boost": "1 psig", "site": {"altitude": "1 mile", "temperature": 20},
                                            "induction": "blower", "inlet_loss": "60 kPa", "intercooler_loss": "-1 kPa",
                                            "compressor_efficiency": "x", "intercooler_effectiveness": 2,
                                            "coolant_temperature": "150 degC", "max_pressure_ratio": "3",
                                            "altitudes": "0 m", "units": 1, "output_units": {"boost": 1}, "aaa": 2})

    # power: measured shortfall, above ideal, causes, J1349 bases, wheel, exhaust, tables
    base = {"na_power": "250 kW", "boost": "1 bar"}
    for ind in ("turbo", "centrifugal", "roots", "twin_screw"):
        add(f"power/{ind}-short", "power", dict(base, induction=ind, measured_power="300 kW"))
        add(f"power/{ind}-table", "power", dict(base, induction=ind, altitudes=["0 m", "1500 m", "3000 m"],
                                                 boost_set_at={"site": {"altitude": "0 m"}, "control": "held_manifold"},
                                                 site={"altitude": "1500 m"}))
    add("power/above-ideal", "power", dict(base, measured_power="600 kW"))
    add("power/shortfall-caution", "power", dict(base, measured_power="430 kW", intercooler_effectiveness=0.95))
    add("power/shortfall-none", "power", dict(base, measured_power="460 kW"))
    add("power/exhaust-cause", "power", dict(base, measured_power="300 kW", exhaust_back_pressure="2 bar"))
    add("power/exhaust-zero", "power", dict(base, exhaust_back_pressure="0 bar", induction="roots"))
    add("power/exhaust-ratio", "power", dict(base, exhaust_to_boost_ratio=1.8, altitudes=["2000 m"]))
    add("power/exhaust-both", "power", dict(base, exhaust_to_boost_ratio=1.0, exhaust_back_pressure="1 bar"))
    add("power/exhaust-no-boost", "power", {"na_power": "250 kW", "boost": "0 bar", "exhaust_back_pressure": "1 bar"})
    add("power/j1349-na", "power", dict(base, na_power_basis="sae_j1349", na_site={"altitude": "300 m", "temperature": "30 degC"}))
    add("power/j1349-measured", "power", dict(base, measured_power="420 kW", measured_power_basis="sae_j1349",
                                             site={"altitude": "1600 m", "temperature": "28 degC"}))
    add("power/wheel", "power", dict(base, power_basis="wheel", drivetrain_loss="15 %", measured_power="350 kW", units="imperial"))
    add("power/wheel-no-loss", "power", dict(base, power_basis="wheel"))
    add("power/wheel-loss-range", "power", dict(base, power_basis="wheel", drivetrain_loss=0.6))
    add("power/na-zero", "power", {"na_power": "0 kW", "boost": "1 bar"})
    add("power/na-ps", "power", {"na_power": "300 PS", "boost": "0.8 bar", "output_units": {"ideal_power": "PS", "power": "CV"}})
    add("power/ethanol-fuels", "power", dict(base, fuel="methanol", afr=5.5))
    add("power/afr-implausible", "power", dict(base, fuel="e85", afr=14.7))
    add("power/ethanol-methanol", "power", dict(base, fuel="methanol", ethanol_content=0.5))
    add("power/e85-content", "power", dict(base, fuel="e85", ethanol_content="70 %"))
    add("power/hot", "power", {"na_power": "200 kW", "boost": "2.5 bar", "induction": "roots", "intercooler_effectiveness": 0,
                               "site": {"temperature": "45 degC"}, "measured_power": "150 kW"})
    add("power/warm", "power", {"na_power": "200 kW", "boost": "1.2 bar", "intercooler_effectiveness": 0.35})
    add("power/causes-power-hp", "power", dict(base, induction="twin_screw", measured_power="250 kW", output_units={"power": "hp"}))
    add("power/negative-expected", "power", {"na_power": "100 kW", "boost": "7 bar", "induction": "roots", "compressor_efficiency": 0.3,
                                             "drive_efficiency": 0.5, "intercooler_effectiveness": 1, "measured_power": "10 kW",
                                             "max_pressure_ratio": 6})
    add("power/bsfc-range", "power", dict(base, bsfc="0.1 lb/hp/h"))
    add("power/bsfc-gkwh", "power", dict(base, bsfc="300 g/kWh", output_units={"bsfc": "lb/hp/h"}))
    add("power/missing", "power", {})

    # boost for power: reachable, unreachable, below NA, tables with both
    bfp = {"na_power": "200 kW", "target_power": "350 kW"}
    for ind in ("turbo", "centrifugal", "roots", "twin_screw"):
        add(f"bfp/{ind}", "boost-for-power", dict(bfp, induction=ind, altitudes=["0 m", "2000 m", "4000 m"]))
    add("bfp/unreachable", "boost-for-power", dict(bfp, target_power="1000 kW", altitudes=["0 m", "3000 m"]))
    add("bfp/unreachable-roots", "boost-for-power", dict(bfp, target_power="600 kW", induction="roots"))
    add("bfp/below-na", "boost-for-power", dict(bfp, target_power="150 kW", altitudes=["0 m", "4000 m"]))
    add("bfp/equal-na", "boost-for-power", dict(bfp, target_power="200 kW"))
    add("bfp/boost-max-negative", "boost-for-power", dict(bfp, max_pressure_ratio=1.01, inlet_loss="10 kPa", intercooler_loss="20 kPa"))
    add("bfp/boost-max-negative-below", "boost-for-power", dict(bfp, target_power="50 kW", max_pressure_ratio=1.01,
                                                                inlet_loss="10 kPa", intercooler_loss="20 kPa"))
    add("bfp/altitude-site", "boost-for-power", dict(bfp, site={"altitude": "1800 m", "temperature": "30 degC"},
                                                     na_site={"altitude": "0 m"}, units="imperial"))
    add("bfp/wheel", "boost-for-power", dict(bfp, power_basis="wheel", drivetrain_loss=0.12, units="si"))
    add("bfp/j1349", "boost-for-power", dict(bfp, na_power_basis="sae_j1349"))
    add("bfp/pr-danger", "boost-for-power", dict(bfp, target_power="700 kW", max_pressure_ratio=5.5))
    add("bfp/missing-target", "boost-for-power", {"na_power": "200 kW"})
    add("bfp/bad-target", "boost-for-power", {"na_power": "200 kW", "target_power": "11 MW"})

    # airflow
    add("airflow/basic", "airflow", {"power": "400 hp", "boost": "18 psi", "units": "imperial"})
    add("airflow/ve", "airflow", {"power": "300 kW", "boost": "1.2 bar", "displacement": "2.0 L", "rpm": 7000})
    add("airflow/ve-implausible", "airflow", {"power": "600 kW", "displacement": "1.0 L", "rpm": 6000})
    add("airflow/ve-low", "airflow", {"power": "50 kW", "displacement": "5 L", "rpm": 8000, "boost": "1 bar"})
    add("airflow/lambda", "airflow", {"power": "300 kW", "fuel": "e85", "lambda": 0.8, "boost": "1 bar"})
    add("airflow/afr-lambda", "airflow", {"power": "300 kW", "afr": 12, "lambda": 0.8})
    add("airflow/afr-implausible", "airflow", {"power": "300 kW", "fuel": "ethanol", "afr": 14.0})
    add("airflow/displacement-only", "airflow", {"power": "300 kW", "displacement": "2 L"})
    add("airflow/rpm-only", "airflow", {"power": "300 kW", "rpm": 6000})
    add("airflow/rpm-range", "airflow", {"power": "300 kW", "rpm": 400, "displacement": "2 L"})
    add("airflow/twin", "airflow", {"power": "700 kW", "compressor_count": 2, "boost": "1.5 bar",
                                    "reference_pressure": "100 kPa", "reference_temperature": "298 K"})
    add("airflow/count-float", "airflow", {"power": "700 kW", "compressor_count": 2.0})
    add("airflow/count-bad", "airflow", {"power": "700 kW", "compressor_count": 2.5})
    add("airflow/count-range", "airflow", {"power": "700 kW", "compressor_count": 17})
    add("airflow/wheel", "airflow", {"power": "300 kW", "power_basis": "wheel", "drivetrain_loss": 0.15})
    add("airflow/in3", "airflow", {"power": "300 kW", "displacement": "122 in^3", "rpm": 6500, "units": "imperial",
                                   "output_units": {"air_volume_flow": "cfm", "displacement": "cc"}})
    add("airflow/cfm-out", "airflow", {"power": "300 kW", "output_units": {"air_volume_flow": "L/min", "air_mass_flow": "g/s"}})
    add("airflow/ref-range", "airflow", {"power": "300 kW", "reference_temperature": "100 degC"})

    # injectors: both regulators, NA, fixed at/above base, fluids, duty warnings
    inj = {"power": "300 kW", "boost": "1 bar", "injector_count": 6}
    add("inj/sizing", "injectors", dict(inj))
    add("inj/sizing-duty-caution", "injectors", dict(inj, max_duty=0.9))
    add("inj/sizing-duty-danger", "injectors", dict(inj, max_duty=1.0))
    add("inj/fixed", "injectors", dict(inj, regulator="fixed", injector_flow="700 cc/min"))
    add("inj/fixed-low", "injectors", dict(inj, regulator="fixed", base_fuel_pressure="2.5 bar"))
    add("inj/fixed-at-base", "injectors", dict(inj, regulator="fixed", base_fuel_pressure="1 bar", injector_flow="700 cc/min"))
    add("inj/fixed-above-base", "injectors", dict(inj, regulator="fixed", base_fuel_pressure="0.8 bar", boost="1.5 bar",
                                                  injector_flow="60 lb/h"))
    add("inj/fixed-above-base-volume", "injectors", dict(inj, regulator="fixed", base_fuel_pressure="0.8 bar", boost="1.5 bar"))
    add("inj/fluid", "injectors", dict(inj, injector_flow="550 cc/min", rating_fluid_density="0.684 kg/L"))
    add("inj/fluid-unknown", "injectors", dict(inj, injector_flow="550 cc/min"))
    add("inj/mass-rating", "injectors", dict(inj, injector_flow="5 g/s", units="imperial"))
    add("inj/too-small", "injectors", dict(inj, injector_flow="300 cc/min"))
    add("inj/static", "injectors", dict(inj, injector_flow="200 cc/min"))
    add("inj/na", "injectors", {"power": "150 kW", "induction": "na", "injector_count": 4})
    add("inj/na-zero-boost", "injectors", {"power": "150 kW", "induction": "na", "injector_count": 4, "boost": "0 psi"})
    add("inj/na-with-boost", "injectors", {"power": "150 kW", "induction": "na", "injector_count": 4, "boost": "5 psi"})
    add("inj/needs-boost", "injectors", {"power": "150 kW", "injector_count": 4})
    add("inj/needs-count", "injectors", {"power": "150 kW", "boost": "1 bar"})
    add("inj/count-bad", "injectors", {"power": "150 kW", "boost": "1 bar", "injector_count": "six"})
    add("inj/count-range", "injectors", {"power": "150 kW", "boost": "1 bar", "injector_count": 65})
    add("inj/duty-open", "injectors", dict(inj, max_duty=0))
    add("inj/e85-density", "injectors", dict(inj, fuel="e85", fuel_density="0.78 kg/L", injector_flow="1000 cc/min",
                                             output_units={"total_fuel_flow": "L/h", "flow_per_injector": "lb/h"}))
    add("inj/methanol", "injectors", dict(inj, fuel="methanol", induction="roots", injector_flow="1600 cc/min", units="si"))
    add("inj/output-mass-volume", "injectors", dict(inj, injector_flow="40 lb/h",
                                                    output_units={"injector_flow_at_operating_pressure": "cc/min",
                                                                  "flow_at_operating_pressure": "g/min", "total_fuel_flow": "gal/h"}))
    add("inj/wheel", "injectors", dict(inj, power_basis="wheel", drivetrain_loss=0.15, injector_flow="800 cc/min"))
    add("inj/tiny-rating", "injectors", dict(inj, injector_flow="1e-320 kg/s"))
    add("inj/rated-range", "injectors", dict(inj, rated_pressure="11 bar"))
    add("inj/density-range", "injectors", dict(inj, fuel_density="1.2 kg/L"))
    add("inj/flow-not-positive", "injectors", dict(inj, injector_flow="0 cc/min"))
    add("inj/induction-bad", "injectors", dict(inj, induction="rotary"))

    # fuel pump: curves inside, extrapolated both sides, clamped at 0, margins, errors
    pump = {"power": "400 kW", "boost": "1.5 bar"}
    curve = [{"pressure": "3 bar", "flow": "320 L/h"}, {"pressure": "5 bar", "flow": "260 L/h"}, {"pressure": "7 bar", "flow": "180 L/h"}]
    add("pump/no-curve", "fuel-pump", dict(pump))
    add("pump/inside", "fuel-pump", dict(pump, pump_curve=curve))
    add("pump/extrapolated-above", "fuel-pump", dict(pump, boost="5 bar", pump_curve=curve))
    add("pump/extrapolated-below", "fuel-pump", dict(pump, induction="na", boost="0 bar", base_fuel_pressure="2 bar", pump_curve=curve))
    add("pump/clamped-zero", "fuel-pump", dict(pump, boost="6 bar", base_fuel_pressure="4 bar", line_loss="0.5 bar",
                                               pump_curve=[{"pressure": "1 bar", "flow": "200 L/h"}, {"pressure": "2 bar", "flow": "100 L/h"}]))
    add("pump/margin-caution", "fuel-pump", dict(pump, power="560 kW", pump_curve=curve))
    add("pump/margin-ok-two", "fuel-pump", dict(pump, power="560 kW", pump_count=2, pump_curve=curve))
    add("pump/fixed", "fuel-pump", dict(pump, regulator="fixed", base_fuel_pressure="4 bar", pump_curve=curve))
    add("pump/fixed-at-base", "fuel-pump", dict(pump, regulator="fixed", base_fuel_pressure="1.5 bar"))
    add("pump/mass-curve", "fuel-pump", dict(pump, fuel="e85", pump_curve=[{"pressure": "3 bar", "flow": "250 kg/h"},
                                                                          {"pressure": "6 bar", "flow": {"value": 0.5, "unit": "gal/min"}}],
                                             units="imperial", output_units={"available_flow": "kg/h", "required_flow": "lb/h"}))
    add("pump/curve-not-increasing", "fuel-pump", dict(pump, pump_curve=[{"pressure": "3 bar", "flow": "300 L/h"},
                                                                         {"pressure": "5 bar", "flow": "250 L/h"},
                                                                         {"pressure": "5 bar", "flow": "200 L/h"}]))
    add("pump/curve-decreasing", "fuel-pump", dict(pump, pump_curve=[{"pressure": "5 bar", "flow": "300 L/h"},
                                                                     {"pressure": "3 bar", "flow": "250 L/h"}]))
    add("pump/curve-short", "fuel-pump", dict(pump, pump_curve=[{"pressure": "3 bar", "flow": "300 L/h"}]))
    add("pump/curve-long", "fuel-pump", dict(pump, pump_curve=[{"pressure": f"{1 + i * 0.1:.1f} bar", "flow": "300 L/h"} for i in range(31)]))
    add("pump/curve-bad-points", "fuel-pump", dict(pump, pump_curve=[{"pressure": "3 bar"}, {"pressure": "5 bar", "flow": "-5 L/h", "x": 1},
                                                                     "5 bar", {"pressure": "4 psig", "flow": "300 bar"}]))
    add("pump/curve-zero-flow", "fuel-pump", dict(pump, pump_curve=[{"pressure": "3 bar", "flow": "0 L/h"}, {"pressure": "5 bar", "flow": "200 L/h"}]))
    add("pump/curve-not-list", "fuel-pump", dict(pump, pump_curve={"pressure": "3 bar", "flow": "300 L/h"}))
    add("pump/count-range", "fuel-pump", dict(pump, pump_count=17))
    add("pump/margin-range", "fuel-pump", dict(pump, margin="150 %"))
    add("pump/line-loss-range", "fuel-pump", dict(pump, line_loss="1 bar"))
    add("pump/wheel", "fuel-pump", dict(pump, power_basis="wheel", drivetrain_loss=0.2, pump_curve=curve))
    add("pump/ethanol-content-bad", "fuel-pump", dict(pump, fuel="ethanol", ethanol_content=0.5))
    add("pump/needs-boost", "fuel-pump", {"power": "400 kW"})
    add("pump/gal", "fuel-pump", dict(pump, units="imperial", pump_curve=[{"pressure": "40 psi", "flow": "70 gal/h"},
                                                                          {"pressure": "80 psi", "flow": "50 gal/h"}]))

    # unknown fields, bodies that are not objects, malformed JSON, big bodies, unknown endpoint
    add("any/unknown-fields", "injectors", {"a": 1, "power": "300 kW", "b": {"c": 1}, "boost": "1 bar", "injector_count": 4, "c": None})
    add("any/not-object-list", "site", raw="[1, 2]")
    add("any/not-object-string", "power", raw='"power"')
    add("any/not-object-null", "airflow", raw="null")
    add("any/malformed", "site", raw='{"site": ')
    add("any/nan", "site", raw='{"site": {"relative_humidity": NaN}}')
    add("any/infinity", "pressure-ratio", raw='{"boost": {"value": Infinity, "unit": "psi"}}')
    add("any/huge-exponent", "pressure-ratio", raw='{"boost": {"value": 1e999, "unit": "psi"}}')
    add("any/huge-exponent-number", "airflow", raw='{"power": "300 kW", "rpm": 1e999, "displacement": "2 L"}')
    add("any/duplicate-keys", "site", raw='{"units": "si", "site": {"altitude": "1 m"}, "units": "imperial"}')
    add("any/too-large", "site", raw='{"site": {}, "pad": "' + "x" * (64 * 1024) + '"}')
    add("any/unknown-endpoint", "turbo-lag", {})
    add("any/unknown-endpoint-lang", "pressure", {}, query_lang="de")
    return cases


# --------------------------------------------------------------------------- running


def post(client, case):
    """Send one case to the real API: (status, body as ordered JSON)."""
    query = {"lang": case["query_lang"]} if case.get("query_lang") is not None else None
    headers = {"Accept-Language": case["accept_language"]} if case.get("accept_language") else {}
    data = case["raw"] if case.get("raw") is not None else json.dumps(case["request"])
    response = client.post(f"/api/v1/{case['endpoint']}", data=data, content_type="application/json",
                           query_string=query, headers=headers)
    if response.status_code >= 500:
        raise RuntimeError(f"the server answered {response.status_code} to {case['id']}: {data[:300]}")
    return response.status_code, json.loads(response.get_data(as_text=True))


def build_cases():
    rng = random.Random(SEED)
    b = Builder(rng)
    from webcalc.api.schemas import ENDPOINTS

    cases = targeted()
    for endpoint, count in RANDOM_CASES.items():
        for i in range(count):
            body = RANDOM[endpoint](b)
            if b.chance(MUTATION_RATE):
                mutate(b, body, endpoint, ENDPOINTS[endpoint])
            case = {"id": f"random/{endpoint}/{i:03d}", "endpoint": endpoint, "request": body}
            if b.chance(0.03):
                case["query_lang"] = b.r.choice(["de", "en-GB", "pt_BR", ""])
            cases.append(case)
    return cases


def coverage(vectors):
    """What the vectors exercise: statuses, warning (code, severity) pairs, error codes."""
    statuses, warnings, errors = set(), set(), set()
    texts = {msg: code for code, msg in messages.ERRORS.items()}
    for v in vectors:
        statuses.add(v["status"])
        body = v["response"]
        for w in body.get("warnings", []):
            warnings.add((w["code"], w["severity"]))
        for row in body.get("altitude_table") or []:
            for cell in row.values():
                if isinstance(cell, dict):
                    warnings.update((code, None) for code in cell.get("warnings", []))
        if "error" in body:
            for text in [body["error"]["message"]] + [f["message"] for f in body["error"]["fields"]]:
                for msgid, code in texts.items():
                    if "%(" in msgid:
                        head = msgid.split("%(")[0]
                        if head and text.startswith(head):
                            errors.add(code)
                    elif text == msgid:
                        errors.add(code)
    return statuses, warnings, errors


def check_coverage(vectors):
    statuses, warnings, errors = coverage(vectors)
    missing_warnings = [pair for pair in messages.WARNINGS if pair not in warnings]
    missing_errors = sorted(set(messages.ERRORS) - errors - UNREACHABLE_ERRORS)
    problems = []
    if missing_warnings:
        problems.append(f"warnings never raised: {missing_warnings}")
    if missing_errors:
        problems.append(f"errors never given: {missing_errors}")
    if not {200, 400, 404, 413} <= statuses:
        problems.append(f"statuses: {sorted(statuses)}")
    if len(vectors) < 1000:
        problems.append(f"only {len(vectors)} vectors")
    if problems:
        raise RuntimeError("parity vectors miss coverage:\n  " + "\n  ".join(problems))


def dumps(value):
    return json.dumps(value, ensure_ascii=False, separators=(",", ":"), allow_nan=False)


def format_samples():
    """[x, f"{x:.6g}"] for the numbers error messages show: every range limit of every
    quantity field in every accepted unit, and seeded random values with exact ties."""
    from webcalc.api.fields import List, Object, Quantity
    from webcalc.api.schemas import ENDPOINTS

    values = set()

    def walk(fields):
        for f in fields:
            if isinstance(f, Object):
                walk(f.fields)
            elif isinstance(f, List):
                walk([f.item])
            elif isinstance(f, Quantity):
                for unit in units.accepted(f.dimensions):
                    factor, offset = units.conversion(units.dimension_of(unit), unit)
                    for limit in (f.lo, f.hi):
                        if limit is not None:
                            show = limit / factor if len(f.dimensions) > 1 else (limit - offset) / factor
                            values.add(show)
            elif getattr(f, "lo", None) is not None:
                values.update(v for v in (f.lo, f.hi) if v is not None)

    for fields in ENDPOINTS.values():
        walk(fields)
    rng = random.Random(SEED + 1)
    for _ in range(200):
        values.add(rng.uniform(-1, 1) * 10 ** rng.uniform(-12, 12))
    for _ in range(60):  # exact ties at the seventh digit
        values.add(float(rng.randrange(10 ** 6, 10 ** 7)) + 0.5)
        values.add(rng.randrange(10 ** 6, 10 ** 7) * 10 + 5.0)
    return [[float(x), f"{x:.6g}"] for x in sorted(values)]


def render_file(vectors):
    """The file text: one vector per line; envelope keys sorted, bodies in their own order."""
    lines = []
    for v in vectors:
        envelope = {k: v[k] for k in sorted(v) if k not in ("request", "response")}
        head = dumps(envelope)[:-1]
        parts = [head]
        if v.get("request") is not None or "raw" not in v:
            parts.append(f'"request":{dumps(v.get("request"))}')
        parts.append(f'"response":{dumps(v["response"])}')
        lines.append(",".join(parts) + "}")
    header = dumps({"format": FORMAT, "format_g6": format_samples(), "generator": "tools/parity_vectors.py",
                    "seed": SEED, "tolerance": {"relative": 1e-9, "absolute_si": 1e-6}})
    return header[:-1] + ',"vectors":[\n' + ",\n".join(lines) + "\n]}\n"


def build():
    client = create_app({"TESTING": True}).test_client()
    vectors = []
    for case in build_cases():
        status, body = post(client, case)
        vector = {k: v for k, v in case.items() if v is not None and k != "request"}
        if case.get("raw") is None:
            vector["request"] = case["request"]
        vector["status"] = status
        vector["response"] = body
        vectors.append(vector)
    ids = [v["id"] for v in vectors]
    if len(set(ids)) != len(ids):
        raise RuntimeError("duplicate vector ids")
    check_coverage(vectors)
    return render_file(vectors)


def main(argv=None):
    parser = argparse.ArgumentParser(description=__doc__.split("\n\n")[0])
    parser.add_argument("--out", type=Path, default=DEFAULT_OUT)
    parser.add_argument("--check", action="store_true", help="exit 1 if the committed file is stale")
    args = parser.parse_args(argv)
    text = build()
    if args.check:
        current = args.out.read_text(encoding="utf-8") if args.out.exists() else None
        if current != text:
            print(f"{args.out.relative_to(ROOT) if args.out.is_relative_to(ROOT) else args.out} is stale: "
                  "run python tools/parity_vectors.py")
            return 1
        print("up to date")
        return 0
    args.out.parent.mkdir(parents=True, exist_ok=True)
    args.out.write_text(text, encoding="utf-8")
    count = text.count('\n"id"') + text.count('\n{"')
    print(f"wrote {args.out.relative_to(ROOT) if args.out.is_relative_to(ROOT) else args.out}: "
          f"{count} vectors, {len(text.encode('utf-8')) / 1e6:.2f} MB")
    return 0


if __name__ == "__main__":
    sys.exit(main())
