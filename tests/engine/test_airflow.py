"""Air mass and volume flow, corrected flow and volumetric efficiency."""

import numpy as np
import pytest
from CoolProp.CoolProp import PropsSI

from webcalc.engine import airflow
from webcalc.engine import atmosphere as atm
from webcalc.engine import fuel
from webcalc.engine.constants import HP, LB

LB_PER_MIN = LB / 60.0  # kg/s (NIST SP 811: lb = 0.453 592 37 kg)
FT3 = 0.3048**3  # m^3 (NIST SP 811: ft = 0.3048 m)


def test_about_ten_hp_per_lb_per_min_of_air():
    # common practice, no source: about 10 hp per lb/min of air on gasoline. With the
    # NA defaults 0.50 lb/hp/h x 12.5 = 6.25 lb of air per hp-hour: 60 / 6.25 = 9.6 hp
    bsfc, afr = fuel.na_air_defaults(14.7)
    per_hp = airflow.air_mass_flow(HP, bsfc, afr)
    hp_per_lb_min = 1.0 / (per_hp / LB_PER_MIN)
    assert hp_per_lb_min == pytest.approx(9.6, rel=1e-12)
    assert hp_per_lb_min == pytest.approx(10.0, rel=0.05)


def test_air_flow_of_a_500_hp_engine():
    # Heywood (1988), eq. 2.24/2.29 (sfc and AFR definitions), by hand: 500 hp x 0.50 lb/hp/h
    # = 250 lb/h of fuel; x 12.5 = 3125 lb/h = 52.08 lb/min = 0.393 74 kg/s
    bsfc, afr = fuel.na_air_defaults(14.7)
    m = airflow.air_mass_flow(500 * HP, bsfc, afr)
    assert m / LB_PER_MIN == pytest.approx(52.083, rel=1e-4)
    assert m == pytest.approx(0.39374, rel=1e-4)


def test_dry_air_density_agrees_with_coolprop():
    # CoolProp 'Air' (Lemmon et al. 2000 real-gas dry air): the ideal gas law holds to
    # 0.2 % at compressor-inlet states (250 to 330 K, 22 to 110 kPa) and to 0.3 % at
    # outlet and manifold states (288 to 450 K, 100 to 400 kPa)
    for T in (250.0, 288.15, 330.0):
        for p in (22e3, 60e3, 101325.0, 110e3):
            assert airflow.gas_density(p, T) == pytest.approx(PropsSI("D", "T", T, "P", p, "Air"), rel=2e-3)
    for T in (288.15, 330.0, 400.0, 450.0):
        for p in (100e3, 200e3, 400e3):
            assert airflow.gas_density(p, T) == pytest.approx(PropsSI("D", "T", T, "P", p, "Air"), rel=3e-3)


def test_standard_air_density_in_lb_per_ft3():
    # ASHRAE "standard air", about 0.075 lb/ft^3 at 68 degF and 29.92 inHg (from memory)
    rho = airflow.gas_density(101325.0, 293.15) * FT3 / LB
    assert rho == pytest.approx(0.075, rel=3e-3)


def test_volume_flow_worked_example():
    # ideal gas law, by hand: 1 lb/min = 0.007 559 87 kg/s at ISA sea level (1.225 kg/m^3)
    # is 0.006 171 3 m^3/s = 13.077 ft^3/min
    v = airflow.volume_flow(LB_PER_MIN, 101325.0, 288.15)
    assert v == pytest.approx(0.0061713, rel=1e-4)
    assert v * 60.0 / FT3 == pytest.approx(13.077, rel=1e-4)


def test_corrected_flow_worked_example():
    # corrected flow definition (SAE J922, from memory; Watson and Janota 1982, sec. 4.2),
    # by hand at 2000 m standard day: 0.5 x sqrt(275.154 / 288.15) / (79 501.4 / 101 325)
    # = 0.5 x 0.977 187 / 0.784 618 = 0.622 72 kg/s
    p1, T1 = atm.isa_pressure(2000.0), atm.isa_temperature(2000.0)
    assert airflow.corrected_flow(0.5, p1, T1) == pytest.approx(0.62272, rel=1e-5)
    # at the map's own reference state, corrected = actual
    assert airflow.corrected_flow(0.5, 101325.0, 288.15) == pytest.approx(0.5, rel=1e-15)
    # a map stated at 100 kPa and 298 K (a common alternative reference, from memory)
    ref = airflow.corrected_flow(0.5, 100e3, 298.0, p_ref=100e3, T_ref=298.0)
    assert ref == pytest.approx(0.5, rel=1e-15)


def test_corrected_flows_on_two_references_differ_by_a_fixed_factor():
    # our own consistency check from the definition: whatever the inlet state, the flow
    # corrected to (100 kPa, 298 K) over the flow corrected to (101.325 kPa, 288.15 K) is
    # sqrt(288.15 / 298) x 100 / 101.325
    m, p1, T1 = 0.4, 85e3, 300.0
    a = airflow.corrected_flow(m, p1, T1, 101325.0, 288.15)
    b = airflow.corrected_flow(m, p1, T1, 100e3, 298.0)
    assert b / a == pytest.approx(np.sqrt(288.15 / 298.0) * 100e3 / 101325.0, rel=1e-12)


def test_volumetric_efficiency_worked_example():
    # Heywood (1988), eq. 2.27: VE = m / (rho V_d N / 2), four-stroke, N in rev/s. By hand:
    # 2.0 L at 6000 rev/min = 0.002 x 50 = 0.1 m^3/s swept; 0.1 kg/s at 1.2 kg/m^3 -> 0.8333
    assert airflow.volumetric_efficiency(0.1, 1.2, 2.0e-3, 6000.0) == pytest.approx(0.83333, rel=1e-5)


def test_volumetric_efficiency_of_a_typical_na_engine_is_plausible():
    # common practice, no source: a good two-valve NA engine reaches about 0.85 to 1.0 VE at
    # peak power. An invented engine: 5.7 L making 400 hp at 5500 rev/min on the NA air
    # defaults at ISA sea level
    bsfc, afr = fuel.na_air_defaults(14.7)
    m = airflow.air_mass_flow(400 * HP, bsfc, afr)
    ve = airflow.volumetric_efficiency(m, atm.humid_air_density(101325.0, 288.15, 0.0), 5.7e-3, 5500.0)
    lo, hi = airflow.PLAUSIBLE_VOLUMETRIC_EFFICIENCY
    assert 0.85 < ve < 1.0
    assert lo < ve < hi
