"""Fuels, blends, injector sizing and fuel-pump flow."""

import numpy as np
import pytest
from CoolProp.CoolProp import PropsSI
from scipy.interpolate import interp1d

from webcalc.engine import fuel
from webcalc.engine.constants import HP, LB, LB_PER_HP_H

LB_PER_H = LB / 3600.0  # kg/s (NIST SP 811)
US_GALLON = 3.785411784e-3  # m^3 (NIST SP 811, exact)
BAR = 1e5  # Pa

# --- Fuel table and blends -------------------------------------------------------------------


def test_e85_blend_values_of_the_spec():
    # SPEC section 3 (binding): E85 = 85 % ethanol by volume: density 782.4 kg/m^3, AFR 9.814.
    # By hand: 0.85 x 789 + 0.15 x 745 = 782.4; w = 670.65 / 782.4 = 0.857 17;
    # AFR = 0.857 17 x 9.0 + 0.142 83 x 14.7 = 9.8141
    rho, afr = fuel.fuel_properties("e85")
    assert rho == pytest.approx(782.4, rel=1e-12)
    assert afr == pytest.approx(9.814, abs=5e-4)
    assert (rho, afr) == fuel.blend(0.85)


def test_blend_endpoints_are_the_pure_fuels():
    # blend rule: 0 % ethanol is gasoline, 100 % is ethanol
    assert fuel.blend(0.0) == pytest.approx((745.0, 14.7), rel=1e-15)
    assert fuel.blend(1.0) == pytest.approx((789.0, 9.0), rel=1e-15)


def test_e10_stoichiometric_ratio():
    # common practice, from memory: E10 is about 14.1:1 stoichiometric
    rho, afr = fuel.fuel_properties("gasoline", 0.10)
    assert afr == pytest.approx(14.1, abs=0.02)
    assert rho == pytest.approx(749.4, rel=1e-12)  # hand: 0.9 x 745 + 0.1 x 789


def _stoichiometric_afr(c, h, o):
    """AFR of C_c H_h O_o with dry air from first principles.

    IUPAC conventional atomic weights (C 12.011, H 1.008, O 15.999); dry air O2 mole
    fraction 0.209476 and mean molar mass 28.9644 kg/kmol (US Standard Atmosphere 1976,
    Table 3).
    """
    m_fuel = 12.011 * c + 1.008 * h + 15.999 * o
    o2 = c + h / 4.0 - o / 2.0
    return o2 / 0.209476 * 28.9644 / m_fuel


def test_stoichiometry_from_chemistry():
    # ethanol C2H5OH: 3 O2 per mol, 9.005; methanol CH3OH: 1.5 O2 per mol, 6.473
    assert fuel.FUELS["ethanol"]["afr"] == pytest.approx(_stoichiometric_afr(2, 6, 1), rel=1e-3)
    assert fuel.FUELS["methanol"]["afr"] == pytest.approx(_stoichiometric_afr(1, 4, 1), rel=1e-3)
    # gasoline as CH1.87 (Heywood 1988, App. D, from memory): 14.60; the trade's 14.7 within 1 %
    assert fuel.FUELS["gasoline"]["afr"] == pytest.approx(_stoichiometric_afr(1, 1.87, 0), rel=1e-2)


@pytest.mark.parametrize("name, fluid", [("ethanol", "Ethanol"), ("methanol", "Methanol")])
def test_alcohol_densities_agree_with_coolprop(name, fluid):
    # CoolProp reference equations of state (ethanol: Schroeder et al. 2014; methanol:
    # de Reuck and Craven 1993) at 20 degC and 1 atm: 789.4 and 791.0 kg/m^3
    assert fuel.FUELS[name]["density"] == pytest.approx(PropsSI("D", "T", 293.15, "P", 101325.0, fluid), rel=1e-3)


# --- Air and fuel per power ------------------------------------------------------------------

@pytest.mark.parametrize("name", ["gasoline", "ethanol", "methanol", "e85"])
def test_na_defaults_keep_lambda_and_air_per_power(name):
    # SPEC section 4 rule (common practice, from memory): every fuel at lambda 12.5 / 14.7
    # = 0.850 (rich of stoichiometric for power, as the trade runs gasoline at about 0.85)
    # and the same 6.25 lb of air per hp-hour
    _, afr_st = fuel.fuel_properties(name)
    bsfc, afr = fuel.na_air_defaults(afr_st)
    assert afr / afr_st == pytest.approx(12.5 / 14.7, rel=1e-12)
    assert 0.8 <= afr / afr_st <= 0.9
    assert bsfc * afr / LB_PER_HP_H == pytest.approx(6.25, rel=1e-12)


def test_e85_needs_half_again_the_fuel_mass_of_gasoline():
    # same lambda, same air (SPEC section 4 BSFC rule): fuel mass scales with
    # 14.7 / 9.814 = 1.498 (by hand); by volume 1.498 x 745 / 782.4 = 1.426
    _, afr = fuel.fuel_properties("e85")
    ratio = fuel.sizing_bsfc("turbo", afr) / fuel.sizing_bsfc("turbo", 14.7)
    assert ratio == pytest.approx(1.4979, rel=1e-4)
    assert ratio * 745.0 / 782.4 == pytest.approx(1.426, rel=1e-3)


# --- Injectors -------------------------------------------------------------------------------

def test_orifice_scaling_four_times_pressure_doubles_flow():
    # orifice equation, flow proportional to sqrt(dp) (ISO 5167-1; Bernoulli)
    assert fuel.orifice_scale(4 * 3e5, 3e5) == pytest.approx(2.0, rel=1e-15)
    assert fuel.orifice_scale(3e5, 4 * 3e5) == pytest.approx(0.5, rel=1e-15)


def test_injector_size_worked_example():
    # common practice, no source: injector lb/h = hp x BSFC / (count x max duty).
    # By hand: 500 hp x 0.60 / (8 x 0.80) = 46.875 lb/h per injector
    need = fuel.injector_flow_needed(500 * HP, 0.60 * LB_PER_HP_H, 8, 0.80)
    assert need / LB_PER_H == pytest.approx(46.875, rel=1e-12)
    # in cc/min for gasoline at 0.745 kg/L: 46.875 x 0.453 592 37 / 60 / 0.745 x 1000 = 475.66
    cc_min = need / 745.0 * 1e6 * 60.0
    assert cc_min == pytest.approx(475.66, rel=1e-4)
    # the trade's "about 10.5 cc/min per lb/h" (common practice, no source) within 5 %
    assert cc_min / 46.875 == pytest.approx(10.5, rel=0.05)


def test_fixed_regulator_needs_a_bigger_rating():
    # orifice equation: with a fixed (not boost-referenced) regulator at 3 bar and 1 bar of
    # boost the injector sees 2 bar, so its 3-bar rating must be sqrt(3 / 2) = 1.2247 larger
    dp_ref = fuel.injector_pressure_difference(3 * BAR, 1 * BAR, "boost_referenced")
    dp_fixed = fuel.injector_pressure_difference(3 * BAR, 1 * BAR, "fixed")
    assert dp_ref == 3 * BAR
    assert dp_fixed == 2 * BAR
    assert fuel.orifice_scale(3 * BAR, dp_fixed) == pytest.approx(1.22474, rel=1e-5)


def test_n_heptane_rating_overstates_gasoline_by_about_four_percent():
    # n-heptane density about 0.684 kg/L at 20 degC (from memory); CoolProp's reference
    # equation (Span and Wagner 2003) gives 683.8 kg/m^3
    rho_heptane = PropsSI("D", "T", 293.15, "P", 101325.0, "n-Heptane")
    assert rho_heptane == pytest.approx(684.0, rel=1e-3)
    # orifice equation: volume flow scales with 1 / sqrt(rho); gasoline flows
    # sqrt(683.8 / 745) = 0.958 of the heptane volume: the rating overstates by about 4 %
    scale = fuel.rating_fluid_scale(745.0, rho_heptane)
    assert scale == pytest.approx(0.95805, rel=1e-4)
    assert 1.0 / scale - 1.0 == pytest.approx(0.04, abs=0.01)


def test_duty_and_power_limit_round_trip():
    # our own round trip: an injector sized for a power at max duty runs at max duty there
    bsfc = 0.6 * LB_PER_HP_H
    need = fuel.injector_flow_needed(600 * HP, bsfc, 6, 0.8)
    assert fuel.injector_duty(600 * HP, bsfc, 6, need) == pytest.approx(0.8, rel=1e-12)
    assert fuel.injector_max_power(need, 6, 0.8, bsfc) == pytest.approx(600 * HP, rel=1e-12)
    # and half the power needs half the duty (duty is linear in fuel flow)
    assert fuel.injector_duty(300 * HP, bsfc, 6, need) == pytest.approx(0.4, rel=1e-12)


# --- Fuel pump -------------------------------------------------------------------------------

def test_pump_required_pressure():
    # boost-referenced regulator: rail follows the manifold (common practice, no source):
    # 3 bar base + 1 bar boost + 0.2 bar line loss = 4.2 bar; fixed: 3.2 bar
    assert fuel.pump_required_pressure(3 * BAR, 1 * BAR, "boost_referenced", 0.2 * BAR) == pytest.approx(4.2 * BAR)
    assert fuel.pump_required_pressure(3 * BAR, 1 * BAR, "fixed", 0.2 * BAR) == pytest.approx(3.2 * BAR)


def test_pump_required_flow_worked_example():
    # by hand: 500 hp x 0.65 lb/hp/h x 1.2 = 390 lb/h = 176.901 kg/h; / 0.745 kg/L =
    # 237.45 L/h = 62.727 US gal/h (NIST SP 811 gallon)
    q = fuel.pump_required_flow(500 * HP, 0.65 * LB_PER_HP_H, 745.0, 0.20)
    assert q * 3.6e6 == pytest.approx(237.45, rel=1e-4)
    assert q * 3600.0 / US_GALLON == pytest.approx(62.727, rel=1e-4)


CURVE_P = [2 * BAR, 4 * BAR, 5 * BAR, 7 * BAR]
CURVE_Q = [300e-3 / 3600, 270e-3 / 3600, 250e-3 / 3600, 190e-3 / 3600]  # m^3/s (arbitrary curve)


def test_pump_curve_interpolation_matches_scipy():
    # scipy.interpolate.interp1d (linear, extrapolating from the two end points of each side)
    ref = interp1d(CURVE_P, CURVE_Q, kind="linear", fill_value="extrapolate")
    x = np.linspace(0.5 * BAR, 10 * BAR, 96)
    flow, extrapolated = fuel.pump_curve_flow(CURVE_P, CURVE_Q, x)
    assert flow == pytest.approx(np.maximum(ref(x), 0.0), rel=1e-12, abs=1e-18)
    assert np.array_equal(extrapolated, (x < CURVE_P[0]) | (x > CURVE_P[-1]))


def test_pump_curve_hand_values():
    # by hand: 4.5 bar lies half way from 270 to 250 L/h -> 260 L/h; 8 bar extrapolates the
    # last segment (-30 L/h per bar) to 160 L/h; 1 bar the first (-15 L/h per bar) to 315 L/h
    f, e = fuel.pump_curve_flow(CURVE_P, CURVE_Q, [4.5 * BAR, 8 * BAR, 1 * BAR, 5 * BAR])
    assert f * 3.6e6 == pytest.approx([260.0, 160.0, 315.0, 250.0], rel=1e-12)
    assert e.tolist() == [False, True, True, False]


def test_pump_curve_never_below_zero():
    # a pump cannot flow backwards through its check valve (common practice, no source):
    # far above the curve the straight line would go negative; the flow stops at 0
    f, e = fuel.pump_curve_flow(CURVE_P, CURVE_Q, 20 * BAR)
    assert float(f) == 0.0
    assert bool(e)
