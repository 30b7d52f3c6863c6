"""Constants of the engine against their published definitions."""

import math

import ambiance
import pint
import pytest
from CoolProp.CoolProp import PropsSI

from webcalc.engine import constants as c

# NIST SP 811 (2008), Appendix B.8: exact definitions
NIST_LB = 0.45359237  # kg
NIST_HP = 550.0 * 0.3048 * NIST_LB * 9.80665  # W, 550 ft lbf/s


def test_dry_air_gas_constant_is_the_standard_atmosphere_one():
    # ICAO Standard Atmosphere (Doc 7488/3), Table A: R* = 8314.32 J/(kmol K), M = 28.964420
    # kg/kmol, R = 287.052 87 J/(kg K) (from memory; the ambiance package uses the same figures)
    assert c.R_DRY == pytest.approx(8314.32 / 28.964420, rel=1e-7)  # 287.052 874, rounded
    assert c.R_DRY == pytest.approx(ambiance.CONST.R, rel=1e-12)
    # US Standard Atmosphere 1976, Table 2: M0 = 28.9644 kg/kmol (rounded), so R* / M0 =
    # 287.0531: the two agree to 1e-6, which is all the tables below need
    assert c.R_DRY == pytest.approx(8314.32 / 28.9644, rel=1e-6)


def test_standard_gravity_and_earth_radius():
    # US Standard Atmosphere 1976, Table 2: g0 = 9.80665 m/s^2, r0 = 6 356 766 m
    assert c.G0 == 9.80665
    assert c.R_EARTH == 6356766.0


def test_troposphere_pressure_exponent_is_g0_over_R_lapse():
    # US Standard Atmosphere 1976, eq. 33a: exponent g0 M0 / (R* L) with L = 6.5 K/km'
    exact = 9.80665 / (8314.32 / 28.9644 * 0.0065)
    assert exact == pytest.approx(5.255877, abs=1e-6)
    # the engine carries the rounded ICAO figure 5.25588 (ICAO Doc 7488, from memory)
    assert c.PRESSURE_EXPONENT == pytest.approx(exact, rel=1e-6)


def test_sea_level_state_is_consistent_with_the_gas_law():
    # US Standard Atmosphere 1976, Table I at 0 m: 101 325 Pa, 288.15 K, 1.2250 kg/m^3
    assert c.P_SEA_LEVEL == 101325.0
    assert c.T_SEA_LEVEL == 288.15
    assert c.P_SEA_LEVEL / (c.R_DRY * c.T_SEA_LEVEL) == pytest.approx(c.RHO_SEA_LEVEL, rel=1e-6)


def test_specific_heat_agrees_with_ideal_gas_and_real_air():
    # ideal gas: cp = k R / (k - 1) (any thermodynamics text; Heywood 1988, App. C)
    assert c.CP_AIR == pytest.approx(c.GAMMA_AIR * c.R_DRY / (c.GAMMA_AIR - 1.0), rel=1e-3)
    # CoolProp 'Air' (Lemmon et al. 2000 pseudo-pure fluid) at 300 K, 1 atm: cp about 1007 J/(kg K)
    assert c.CP_AIR == pytest.approx(PropsSI("C", "T", 300.0, "P", 101325.0, "Air"), rel=5e-3)


def test_pound_and_horsepower_are_the_nist_factors():
    # NIST SP 811 (2008), B.8: lb = 0.453 592 37 kg (exact); hp (550 ft lbf/s) = 745.699 87 W
    assert c.LB == NIST_LB
    assert c.HP == pytest.approx(NIST_HP, rel=1e-14)
    assert c.HP == pytest.approx(745.69987158227, rel=1e-14)


def test_one_lb_per_hp_hour_in_kg_per_joule():
    # NIST SP 811 factors: 1 lb/(hp h) = 0.45359237 kg / (745.69987158227 W x 3600 s)
    expected = 0.45359237 / (745.69987158227 * 3600.0)
    assert expected == pytest.approx(1.689659e-7, rel=1e-6)  # hand: 0.45359237 / 2 684 519.54
    assert c.LB_PER_HP_H == pytest.approx(expected, rel=1e-14)


def test_lb_per_hp_hour_agrees_with_pint():
    # pint's default unit definitions (general-purpose reference library; hp = 550 ft lbf/s)
    ureg = pint.UnitRegistry()
    assert ureg.Quantity(1.0, "lb/hp/h").m_as("kg/J") == pytest.approx(c.LB_PER_HP_H, rel=1e-12)
    assert ureg.Quantity(1.0, "hp").m_as("W") == pytest.approx(c.HP, rel=1e-12)
    # and 1 lb/hp/h is about 608.3 g/kWh (common conversion, from memory)
    assert c.LB_PER_HP_H * 1e3 * 3.6e6 == pytest.approx(608.277, rel=1e-5)
    assert math.isclose(ureg.Quantity(1.0, "lb/hp/h").m_as("g/kWh"), 608.277, rel_tol=1e-5)
