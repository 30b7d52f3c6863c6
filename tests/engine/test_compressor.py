"""Compressor side against textbook worked examples and CoolProp's real air."""

import numpy as np
import pytest
from CoolProp.CoolProp import PropsSI

from webcalc.engine import atmosphere as atm
from webcalc.engine import compressor as comp

PSI = 0.45359237 * 9.80665 / 0.0254**2  # Pa, NIST SP 811 (exact definition)


def test_pressures_worked_example():
    # Pressure ratio as total outlet over total inlet pressure (SAE J922 nomenclature,
    # from memory; Heywood 1988, sec. 6.8). By hand: ISA sea level, 100 kPa boost, 1.5 kPa
    # filter loss, 7 kPa intercooler loss: MAP = 201 325, P1 = 99 825, P2 = 208 325 Pa,
    # PR = 208 325 / 99 825 = 2.086 90
    map_abs, p1, p2, pr = comp.pressures(101325.0, 100e3, 1.5e3, 7e3)
    assert (map_abs, p1, p2) == (201325.0, 99825.0, 208325.0)
    assert pr == pytest.approx(2.08690, rel=1e-5)


def test_one_atmosphere_of_boost_is_pressure_ratio_two():
    # common practice, no source: 14.7 psi of boost at sea level is a 2:1 pressure ratio
    pr = comp.pressures(101325.0, 14.696 * PSI)[3]
    assert pr == pytest.approx(2.0, rel=1e-4)


def test_outlet_temperature_textbook_example():
    # Textbook worked example (isentropic efficiency definition, Heywood 1988 eq. 6.32),
    # by hand: T1 = 300 K, PR = 2, eta = 0.7: 2^(0.4/1.4) = 1.219 01; T2s = 365.70 K;
    # T2 = 300 + 65.704 / 0.7 = 393.86 K
    assert comp.outlet_temperature(300.0, 2.0, 1.0) == pytest.approx(365.704, rel=1e-5)
    assert comp.outlet_temperature(300.0, 2.0, 0.7) == pytest.approx(393.863, rel=1e-5)


def _coolprop_outlet(T1, pr, eta, p1=1e5):
    """Real-air outlet temperature from CoolProp: isentropic enthalpy rise divided by eta."""
    s1 = PropsSI("S", "T", T1, "P", p1, "Air")
    h1 = PropsSI("H", "T", T1, "P", p1, "Air")
    h2s = PropsSI("H", "P", pr * p1, "S", s1, "Air")
    h2 = h1 + (h2s - h1) / eta
    return PropsSI("T", "P", pr * p1, "H", h2, "Air"), h2 - h1


@pytest.mark.parametrize(
    "T1, pr, eta",
    [(288.15, 1.5, 0.72), (288.15, 2.0, 0.70), (288.15, 3.0, 0.72), (310.0, 2.5, 0.65),
     (250.0, 2.0, 0.55), (330.0, 2.5, 1.0)],
)
def test_outlet_temperature_agrees_with_coolprop_real_air(T1, pr, eta):
    # CoolProp 'Air' (Lemmon et al. 2000): enthalpy-based isentropic efficiency with
    # real cp(T). Constant k = 1.4 holds to 0.5 % over ordinary boost (PR up to 3);
    # the error grows with outlet temperature (about 2 % near 800 K).
    T2_ref, _ = _coolprop_outlet(T1, pr, eta)
    assert comp.outlet_temperature(T1, pr, eta) == pytest.approx(T2_ref, rel=5e-3)


def test_intercooler_effectiveness_definition():
    # Heat-exchanger effectiveness, air the minimum-capacity stream (Incropera and DeWitt,
    # sec. 11.4). By hand: 393.86 K in, 300 K coolant, eps 0.75:
    # Tm = 393.86 - 0.75 x 93.86 = 323.47 K; eps 0 leaves T2; eps 1 reaches the coolant
    T2 = comp.outlet_temperature(300.0, 2.0, 0.7)
    assert comp.intercooler_outlet_temperature(T2, 300.0, 0.75) == pytest.approx(323.466, rel=1e-5)
    assert comp.intercooler_outlet_temperature(T2, 300.0, 0.0) == T2
    assert comp.intercooler_outlet_temperature(T2, 300.0, 1.0) == pytest.approx(300.0, rel=1e-12)


def test_drive_power_worked_example():
    # Steady-flow energy equation, compressor work m cp dT (Heywood 1988, eq. 6.31), by hand:
    # 0.2 kg/s, 300 K -> 393.863 K, cp 1005, drive 0.95:
    # 0.2 x 1005 x 93.863 / 0.95 = 19 859.6 W (about 26.6 hp)
    T2 = comp.outlet_temperature(300.0, 2.0, 0.7)
    assert comp.drive_power(0.2, 300.0, T2, 0.95) == pytest.approx(19859.6, rel=1e-5)


@pytest.mark.parametrize("T1, pr, eta", [(288.15, 1.6, 0.70), (300.0, 2.0, 0.70), (300.0, 2.5, 0.55)])
def test_drive_power_agrees_with_coolprop_enthalpy_rise(T1, pr, eta):
    # CoolProp 'Air': shaft work per kg = h2 - h1 (real air); constant cp = 1005 J/(kg K)
    # with the constant-k outlet temperature agrees to 0.3 %
    _, dh = _coolprop_outlet(T1, pr, eta)
    T2 = comp.outlet_temperature(T1, pr, eta)
    assert comp.drive_power(1.0, T1, T2, 1.0) == pytest.approx(dh, rel=3e-3)


def test_highest_boost_reaches_the_max_pressure_ratio():
    # our own round trip: at boost_max the pressure ratio is max_pressure_ratio
    p_baro, inlet, ic = 84e3, 2e3, 8e3
    b = comp.highest_boost(3.5, p_baro - inlet, ic, p_baro)
    assert comp.pressures(p_baro, b, inlet, ic)[3] == pytest.approx(3.5, rel=1e-12)
    # a ratio too small to cover the losses leaves no boost at all
    assert comp.highest_boost(1.05, p_baro - inlet, ic, p_baro) < 0


def test_default_efficiencies_are_ordered_as_the_trade_expects():
    # common practice, no source: turbo > centrifugal > twin-screw > roots
    e = comp.DEFAULT_EFFICIENCY
    assert e["turbo"] > e["centrifugal"] > e["twin_screw"] > e["roots"]
    assert all(comp.VALID["efficiency"][0] <= v <= 1.0 for v in e.values())


# --- Boost with altitude ----------------------------------------------------------------------

P_SET = 101325.0  # set at ISA sea level
P_HERE = float(atm.isa_pressure(2000.0))  # 79 501 Pa at 2000 m (US Standard Atmosphere 1976)


def test_held_manifold_keeps_manifold_pressure():
    # closed-loop MAP control (common practice, no source): 1 bar set at sea level is
    # 201 325 Pa absolute; at 2000 m that needs 201 325 - 79 501.4 = 121 823.6 Pa gauge
    b = comp.boost_here("held_manifold", 100e3, P_SET, P_HERE)
    assert b == pytest.approx(121823.6, rel=1e-6)
    assert P_HERE + b == pytest.approx(P_SET + 100e3, rel=1e-12)


def test_held_gauge_keeps_gauge_boost():
    # wastegate spring referenced to the atmosphere (common practice, no source)
    assert comp.boost_here("held_gauge", 100e3, P_SET, P_HERE) == pytest.approx(100e3, rel=1e-12)


@pytest.mark.parametrize("inlet, ic", [(0.0, 0.0), (2e3, 0.0), (1.5e3, 8e3)])
def test_fixed_ratio_keeps_the_pressure_ratio(inlet, ic):
    # belt-driven blower at fixed rpm keeps its ratio P2/P1 (common practice, no source)
    b = comp.boost_here("fixed_ratio", 8 * PSI, P_SET, P_HERE, inlet, ic)
    pr_set = comp.pressures(P_SET, 8 * PSI, inlet, ic)[3]
    pr_here = comp.pressures(P_HERE, b, inlet, ic)[3]
    assert pr_here == pytest.approx(pr_set, rel=1e-12)
    # so a blower makes less gauge boost up high (fact of the trade)
    assert b < 8 * PSI


def test_fixed_ratio_without_losses_scales_boost_with_pressure():
    # PR constant and no losses: boost_here = boost_set x P_here / P_set (hand algebra)
    b = comp.boost_here("fixed_ratio", 50e3, P_SET, P_HERE)
    assert b == pytest.approx(50e3 * P_HERE / P_SET, rel=1e-12)


def test_boost_here_is_never_below_zero():
    # SPEC section 3: boost here is floored at 0 (the engine then runs unboosted).
    # Tuned at 2000 m to 10 kPa: MAP 89.5 kPa, below sea-level pressure
    assert comp.boost_here("held_manifold", 10e3, P_HERE, P_SET) == 0.0
    # a ratio barely above the losses gives no boost at a site with more inlet loss
    assert comp.boost_here("fixed_ratio", 1e3, P_SET, 30e3, 20e3, 0.0) == 0.0


def test_boost_here_is_vectorised_over_sites():
    # our own consistency check: an array of sites equals one call per site
    p_here = atm.isa_pressure(np.array([0.0, 1000.0, 2000.0, 3500.0]))
    for control in comp.BOOST_CONTROLS:
        arr = comp.boost_here(control, 70e3, P_SET, p_here, 1e3, 5e3)
        one = [float(comp.boost_here(control, 70e3, P_SET, p, 1e3, 5e3)) for p in p_here]
        assert arr == pytest.approx(one, rel=1e-15)
