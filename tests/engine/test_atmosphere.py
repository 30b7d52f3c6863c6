"""Ambient air against the standard atmosphere, the NWS formula, CoolProp and SAE J1349."""

import math

import numpy as np
import pytest
from ambiance import Atmosphere
from CoolProp.CoolProp import PropsSI
from CoolProp.HumidAirProp import HAPropsSI

from webcalc.engine import atmosphere as atm

INHG = 3386.389  # Pa, conventional inch of mercury (NIST SP 811, B.8)


def isa_density(h):
    return atm.humid_air_density(atm.isa_pressure(h), atm.isa_temperature(h), 0.0)


# --- US Standard Atmosphere 1976 -------------------------------------------------------

# US Standard Atmosphere 1976, Table I (geometric altitude): temperature [K], pressure [Pa],
# density [kg/m^3]. Values from memory (the printed table to its 5 significant figures).
USSA_TABLE_I = [
    (-500.0, 291.400, 1.07478e5, 1.2849),
    (0.0, 288.150, 1.01325e5, 1.2250),
    (1000.0, 281.651, 8.9876e4, 1.1117),
    (2000.0, 275.154, 7.9501e4, 1.0066),
    (5000.0, 255.676, 5.4048e4, 7.3643e-1),
    (8000.0, 236.215, 3.5652e4, 5.2579e-1),
    (11000.0, 216.774, 2.2700e4, 3.6480e-1),
]


@pytest.mark.parametrize("h, T, P, rho", USSA_TABLE_I)
def test_standard_atmosphere_table_values(h, T, P, rho):
    # US Standard Atmosphere 1976, Table I, at h metres geometric (from memory)
    assert atm.isa_temperature(h) == pytest.approx(T, rel=1e-3)
    assert atm.isa_pressure(h) == pytest.approx(P, rel=1e-3)
    assert isa_density(h) == pytest.approx(rho, rel=1e-3)


def test_standard_atmosphere_agrees_with_ambiance():
    # ambiance 1.3 (ICAO 1993 / USSA 1976 implementation): Atmosphere(h) takes GEOMETRIC
    # height and converts it with the same r0 = 6 356 766 m, so no convention converts
    # between the two. ambiance raises the exact exponent g0/(R L) = 5.255877, the engine
    # the rounded 5.25588: that leaves about 3e-7 relative in pressure at 11 km.
    h = np.linspace(-500.0, 11000.0, 231)
    ref = Atmosphere(h)
    assert atm.geopotential_height(h) == pytest.approx(ref.H, rel=1e-12, abs=1e-9)
    assert atm.isa_temperature(h) == pytest.approx(ref.temperature, rel=1e-9)
    assert atm.isa_pressure(h) == pytest.approx(ref.pressure, rel=1e-6)
    assert isa_density(h) == pytest.approx(ref.density, rel=1e-6)
    worst = np.max(np.abs(atm.isa_pressure(h) / ref.pressure - 1.0))
    assert worst < 1e-6  # measured: 2.6e-7


def test_pressure_altitude_agrees_with_ambiance_inverse():
    # ambiance Atmosphere.from_pressure (Newton solve of its own model)
    p = np.linspace(23e3, 107e3, 40)
    assert atm.pressure_altitude(p) == pytest.approx(Atmosphere.from_pressure(p).h, abs=0.05)


def test_pressure_altitude_round_trip():
    # our own round trip
    h = np.linspace(-610.0, 11000.0, 101)
    assert atm.pressure_altitude(atm.isa_pressure(h)) == pytest.approx(h, rel=1e-9, abs=1e-9)


def test_geopotential_height_definition():
    # US Standard Atmosphere 1976, eq. 18: H = r0 h / (r0 + h); at 11 000 m, H = 10 981.0 m'
    # (hand: 6 356 766 x 11 000 / 6 367 766 = 10 980.998)
    assert atm.geopotential_height(11000.0) == pytest.approx(10980.998, abs=1e-3)
    assert atm.geometric_height(atm.geopotential_height(7777.0)) == pytest.approx(7777.0, rel=1e-12)
    assert not atm.beyond_troposphere(11000.0)
    assert atm.beyond_troposphere(11030.0)  # geopotential 11 011 m' > 11 000 m'


# --- NWS altimeter setting ---------------------------------------------------------------

def test_nws_altimeter_worked_example_1000_m():
    # US National Weather Service station-pressure formula, worked by hand:
    # (288 - 0.0065 x 1000) / 288 = 281.5 / 288 = 0.977 430 56; ^5.2561 = 0.886 932
    # 29.92 inHg x 0.886 932 = 26.537 0 inHg = 89 864.7 Pa
    p = atm.station_pressure_from_altimeter(29.92 * INHG, 1000.0)
    assert p / INHG == pytest.approx(26.5370, rel=1e-4)
    assert p == pytest.approx(89864.7, rel=1e-4)


def test_nws_altimeter_worked_example_1609_m():
    # US National Weather Service formula by hand: (288 - 10.4585) / 288 = 0.963 686;
    # ^5.2561 = 0.823 309; 30.12 inHg x 0.823 309 = 24.798 1 inHg = 83 975.9 Pa
    p = atm.station_pressure_from_altimeter(30.12 * INHG, 1609.0)
    assert p / INHG == pytest.approx(24.7981, rel=1e-4)
    assert p == pytest.approx(83975.9, rel=1e-4)


def test_nws_altimeter_round_trip():
    # our own round trip (altimeter setting from station pressure and back)
    h = np.linspace(-610.0, 11000.0, 57)
    p_alt = np.linspace(85e3, 110e3, 57)
    p_stn = atm.station_pressure_from_altimeter(p_alt, h)
    assert atm.altimeter_from_station_pressure(p_stn, h) == pytest.approx(p_alt, rel=1e-9)


def test_nws_path_agrees_with_standard_atmosphere_path():
    # SPEC section 4 note: the NWS constants are rounded; the two paths agree within
    # 0.05 % or 100 Pa (about 17 Pa at 2000 m and 90 Pa at 11 km)
    h = np.linspace(-610.0, 11000.0, 233)
    for p_alt in (85e3, 95e3, 101325.0, 110e3):
        nws = atm.station_pressure_from_altimeter(p_alt, h)
        isa = atm.isa_pressure(h) * p_alt / 101325.0
        assert np.all(np.abs(nws - isa) <= np.maximum(100.0, 5e-4 * isa))
    d2000 = atm.station_pressure_from_altimeter(101325.0, 2000.0) - atm.isa_pressure(2000.0)
    d11k = atm.station_pressure_from_altimeter(101325.0, 11000.0) - atm.isa_pressure(11000.0)
    assert abs(d2000) == pytest.approx(17.0, abs=2.0)
    assert abs(d11k) == pytest.approx(90.0, abs=3.0)


# --- Density altitude -----------------------------------------------------------------------

@pytest.mark.parametrize("h", [-500.0, 0.0, 1000.0, 2500.0, 5000.0, 11000.0])
def test_standard_day_density_altitude_is_the_elevation(h):
    # definition of density altitude (US Standard Atmosphere 1976 density law): on a
    # standard day it equals the elevation; 5 cm covers the rounded exponent
    assert atm.density_altitude(isa_density(h)) == pytest.approx(h, abs=0.05)


def test_hot_day_density_altitude_worked_example():
    # Worked by hand: 1500 m, standard pressure there (84 559.7 Pa), 35 degC, dry air.
    # rho = 84 559.7 / (287.052 87 x 308.15) = 0.955 96 kg/m^3; rho / 1.225 = 0.780 37;
    # ^(1/4.255 88) = 0.943 40; H = 44 330.77 x (1 - 0.943 40) = 2509.2 m';
    # h = r0 H / (r0 - H) = 2510.2 m
    rho = atm.humid_air_density(atm.isa_pressure(1500.0), 308.15, 0.0)
    assert rho == pytest.approx(0.95596, rel=1e-4)
    da = atm.density_altitude(rho)
    assert da == pytest.approx(2510.2, abs=0.5)
    # ambiance Atmosphere.from_density: independent inversion of the standard atmosphere
    assert da == pytest.approx(float(Atmosphere.from_density(rho).h[0]), abs=0.1)
    # pilots' rule, about 120 ft per degC above standard (FAA Pilot's Handbook of
    # Aeronautical Knowledge, from memory): 29.75 K x 36.6 m = 1088 m, i.e. 2588 m;
    # the rule runs high, so only 10 % on the rise
    rise_rule = 120.0 * 0.3048 * (308.15 - atm.isa_temperature(1500.0))
    assert da - 1500.0 == pytest.approx(rise_rule, rel=0.10)


def test_density_altitude_agrees_with_ambiance_across_the_troposphere():
    # ambiance Atmosphere.from_density over 0.365 to 1.28 kg/m^3 (-500 m to 11 km)
    rho = np.linspace(0.3648, 1.28, 60)
    assert atm.density_altitude(rho) == pytest.approx(Atmosphere.from_density(rho).h, abs=0.1)


def test_density_altitude_round_trip():
    # our own round trip through the documented law rho0 (1 - L H / T0)^4.25588
    h = np.linspace(-610.0, 11000.0, 77)
    H = atm.geopotential_height(h)
    rho = 1.225 * (1.0 - 0.0065 * H / 288.15) ** 4.25588
    assert atm.density_altitude(rho) == pytest.approx(h, rel=1e-9, abs=1e-8)


def test_humidity_raises_density_altitude():
    # fact of the trade / physics (water vapour is lighter than dry air: M 18 < 29):
    # humid air at the same pressure and temperature is less dense
    dry = atm.humid_air_density(101325.0, 303.15, 0.0)
    wet = atm.humid_air_density(101325.0, 303.15, 1.0)
    assert wet < dry
    assert atm.density_altitude(wet) > atm.density_altitude(dry) + 100.0


# --- Humid air ----------------------------------------------------------------------------

def _humid_grid():
    for t in range(-40, 61, 10):
        for p in (22e3, 30e3, 40e3, 60e3, 80e3, 101325.0, 110e3):
            for rh in (0.0, 0.25, 0.5, 0.75, 1.0):
                yield t + 273.15, p, rh


def test_humid_air_density_agrees_with_coolprop():
    # CoolProp HAPropsSI (ASHRAE RP-1485 real-gas humid air): 'Vha' is the volume per kg of
    # humid air, so density = 1 / Vha. Ideal mixing agrees to 0.3 % wherever the mix is
    # mostly air; where vapour exceeds half the pressure (60 degC, 22 kPa, saturated) the
    # enhancement factor and vapour non-ideality matter: 0.5 % there.
    worst = 0.0
    for T, p, rh in _humid_grid():
        ref = 1.0 / HAPropsSI("Vha", "T", T, "P", p, "R", rh)
        ours = atm.humid_air_density(p, T, rh)
        err = abs(ours / ref - 1.0)
        vapour_fraction = float(atm.vapour_pressure(T, rh)) / p
        assert err <= (3e-3 if vapour_fraction <= 0.5 else 5e-3), (T, p, rh, err)
        worst = max(worst, err)
    assert worst < 5e-3  # measured: 0.45 % at the corner, 0.15 % elsewhere


def test_dry_air_density_agrees_with_coolprop_within_a_tenth_percent():
    # CoolProp HAPropsSI at RH 0 (dry air, real gas): at engine-bay pressures and
    # temperatures the ideal gas law holds to about 0.1 %
    for T in (253.15, 288.15, 313.15, 333.15):
        for p in (60e3, 101325.0, 110e3):
            ref = 1.0 / HAPropsSI("Vha", "T", T, "P", p, "R", 0.0)
            assert atm.humid_air_density(p, T, 0.0) == pytest.approx(ref, rel=1.5e-3)


# Buck / WMO table values of saturation vapour pressure over water (from memory).
@pytest.mark.parametrize("t_c, psat", [(0.0, 611.2), (20.0, 2339.0), (30.0, 4246.0)])
def test_buck_saturation_pressure_table_values(t_c, psat):
    # Buck (1981) and WMO No. 8 tables, over liquid water (from memory)
    assert atm.saturation_vapour_pressure(t_c + 273.15) == pytest.approx(psat, rel=1e-3)


def test_buck_agrees_with_iapws95_above_freezing():
    # CoolProp PropsSI('P', 'T', T, 'Q', 0, 'Water'): IAPWS-95 saturation pressure
    worst = 0.0
    for t_c in np.arange(0.01, 60.01, 2.5):
        ref = PropsSI("P", "T", t_c + 273.15, "Q", 0, "Water")
        err = abs(atm.saturation_vapour_pressure(t_c + 273.15) / ref - 1.0)
        worst = max(worst, err)
    assert worst < 5e-4  # measured: 0.044 % near 30 degC


def murphy_koop_liquid(T):
    """Murphy and Koop (2005), Q. J. R. Meteorol. Soc. 131, eq. 10: over liquid water, 123 to 332 K."""
    lnT = math.log(T)
    return math.exp(
        54.842763 - 6763.22 / T - 4.210 * lnT + 0.000367 * T
        + math.tanh(0.0415 * (T - 218.8)) * (53.878 - 1331.22 / T - 9.44523 * lnT + 0.014025 * T)
    )


def test_buck_agrees_with_murphy_koop_for_supercooled_water():
    # Murphy and Koop (2005), eq. 10 (the formula recalled from memory; it reproduces the
    # triple point, 611.657 Pa at 273.16 K, checked here). Below 0 degC the data for
    # supercooled water are sparse: Buck agrees within 0.4 % down to -40 degC.
    assert murphy_koop_liquid(273.16) == pytest.approx(611.657, rel=1e-4)
    for t_c in np.arange(-40.0, 0.01, 5.0):
        T = t_c + 273.15
        assert atm.saturation_vapour_pressure(T) == pytest.approx(murphy_koop_liquid(T), rel=4e-3)


# --- SAE J1349 ------------------------------------------------------------------------------

def test_sae_j1349_standard_conditions_give_one():
    # SAE J1349 (2004): CF = 1.176 (99 / Pd) sqrt((t + 273) / 298) - 0.176; at its own
    # reference, 99 kPa dry and 25 degC: 1.176 x 1 x 1 - 0.176 = 1.000 (from memory)
    assert atm.sae_j1349_correction_factor(99e3, 298.15) == pytest.approx(1.0, rel=1e-12)


def test_sae_j1349_isa_sea_level_dry():
    # SAE J1349 (2004) by hand: 99 / 101.325 = 0.977 054; sqrt(288 / 298) = 0.983 078;
    # 1.176 x 0.977 054 x 0.983 078 - 0.176 = 0.953 57 ("about 0.95", SPEC section 4)
    cf = atm.sae_j1349_correction_factor(101325.0, 288.15)
    assert cf == pytest.approx(0.95357, rel=1e-4)
    assert cf == pytest.approx(0.95, abs=0.005)


def test_sae_j1349_hot_thin_day():
    # SAE J1349 (2004) by hand: 90 kPa dry, 35 degC: 1.176 x 1.1 x sqrt(308 / 298) - 0.176
    # = 1.2936 x 1.016 640 - 0.176 = 1.139 13
    assert atm.sae_j1349_correction_factor(90e3, 308.15) == pytest.approx(1.13913, rel=1e-4)


def test_sae_j1349_uses_dry_air_pressure():
    # SAE J1349: the pressure term is dry-air pressure (total minus vapour pressure).
    # 100 kPa, 25 degC, RH 0.5: Pv = 0.5 x 3168.5 = 1584 Pa (Buck), Pd = 98.416 kPa;
    # CF = 1.176 x 99 / 98.416 x sqrt(298 / 298) - 0.176 = 1.0070
    T = 298.15
    p_dry = 100e3 - atm.vapour_pressure(T, 0.5)
    assert p_dry == pytest.approx(98416.0, rel=1e-4)
    assert atm.sae_j1349_correction_factor(p_dry, T) == pytest.approx(1.0070, rel=2e-4)


# --- Weather carried to other elevations -----------------------------------------------------

def test_carry_weather_of_a_standard_day_is_the_standard_atmosphere():
    # US Standard Atmosphere 1976: a standard day at the site stays standard at every row
    rows = np.array([0.0, 1000.0, 3000.0])
    p, T = atm.carry_weather(rows, 1500.0, atm.isa_pressure(1500.0), atm.isa_temperature(1500.0))
    assert p == pytest.approx(atm.isa_pressure(rows), rel=1e-12)
    assert T == pytest.approx(atm.isa_temperature(rows), rel=1e-12)


def test_carry_weather_keeps_the_pressure_ratio_and_temperature_offset():
    # SPEC section 3: P = ISA(row) P_site / ISA(site), T = ISA_T(row) + (T_site - ISA_T(site))
    p, T = atm.carry_weather(2000.0, 500.0, 97e3, 303.15)
    assert p / atm.isa_pressure(2000.0) == pytest.approx(97e3 / atm.isa_pressure(500.0), rel=1e-12)
    assert T - atm.isa_temperature(2000.0) == pytest.approx(303.15 - atm.isa_temperature(500.0), rel=1e-12)
