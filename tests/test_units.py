"""The unit table against NIST SP 811, and the parser's grammar."""

import pytest

from webcalc import units

# NIST Special Publication 811 (2008), Appendix B.8/B.9 factors (exact where NIST says so)
NIST = [
    ("pressure", "psi", 6.894757293168361e3),  # 6.894 757 E+03 Pa (psi = lbf/in^2)
    ("pressure", "inHg", 3.386389e3),  # conventional inch of mercury
    ("pressure", "mmHg", 1.33322387415e2),  # conventional mm of mercury
    ("pressure", "atm", 1.01325e5),  # standard atmosphere, exact
    ("pressure", "bar", 1e5),
    ("power", "hp", 7.4569987158227022e2),  # horsepower (550 ft lbf/s)
    ("power", "PS", 7.3549875e2),  # horsepower, metric
    ("power", "CV", 7.3549875e2),
    ("mass_flow", "lb/h", 0.45359237 / 3600),  # pound (avoirdupois) exact 0.453 592 37 kg
    ("mass_flow", "lb/min", 0.45359237 / 60),
    ("volume_flow", "gal/h", 3.785411784e-3 / 3600),  # US gallon exact 3.785 411 784 L
    ("volume_flow", "cfm", 0.3048 ** 3 / 60),  # foot exact 0.3048 m
    ("volume", "in^3", 1.6387064e-5),
    ("density", "lb/gal", 0.45359237 / 3.785411784e-3),
    ("bsfc", "lb/hp/h", 0.45359237 / (7.4569987158227022e2 * 3600)),
    ("bsfc", "g/kWh", 1e-3 / 3.6e6),
    ("length", "ft", 0.3048),
]


@pytest.mark.parametrize("dimension, unit, factor", NIST)
def test_factors_match_nist_sp811(dimension, unit, factor):
    assert units.conversion(dimension, unit) == (pytest.approx(factor, rel=1e-13), 0.0)


def test_temperature_scales():
    # NIST SP 811 B.9: T/K = t/degC + 273.15; T/K = (t/degF + 459.67) / 1.8
    assert units.to_si(25.0, "degC", ("temperature",)) == pytest.approx(298.15, rel=1e-14)
    assert units.to_si(-40.0, "°F", ("temperature",)) == pytest.approx(233.15, rel=1e-12)
    assert units.to_si(518.67, "degR", ("temperature",)) == pytest.approx(288.15, rel=1e-12)


@pytest.mark.parametrize("raw, expected", [
    ("15 psi", (15.0, "psi")), ("15psi", (15.0, "psi")), ("  1.5e2   kPa ", (150.0, "kPa")),
    ("-.5 degC", (-0.5, "degC")), ({"value": 3, "unit": "bar"}, (3.0, "bar")), ("2 in^3", (2.0, "in^3")),
])
def test_quantity_grammar(raw, expected):
    assert units.parse_quantity(raw) == expected


@pytest.mark.parametrize("raw, code", [
    (15, "quantity_bare_number"), ("15", "quantity_bare_number"), ("psi", "quantity_format"),
    ("1,5 bar", "quantity_format"), (True, "quantity_format"), ({"value": 1}, "quantity_format"),
    ("x" * 500, "quantity_format"), (float("nan"), "quantity_format"),
])
def test_quantity_grammar_rejects(raw, code):
    with pytest.raises(units.UnitError) as info:
        units.parse_quantity(raw)
    assert info.value.code == code


def test_fuel_flow_converts_mass_and_volume_with_density():
    kg_s = units.to_si(1000.0, "cc/min", ("mass_flow", "volume_flow"), density=745.0)
    assert kg_s == pytest.approx(1000e-6 / 60 * 745.0, rel=1e-12)
    assert units.from_si(kg_s, "cc/min", ("mass_flow", "volume_flow"), density=745.0) == pytest.approx(1000.0)


def test_fractions():
    assert units.parse_fraction("80 %") == pytest.approx(0.8)
    assert units.parse_fraction(0.8) == 0.8
    with pytest.raises(units.UnitError):
        units.parse_fraction("80 percent")
