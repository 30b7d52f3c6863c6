"""Hardening properties over every engine model (hypothesis).

Audit of the issue's list against what already exists (``tests/engine/test_properties.py``);
this file adds what was missing: "across the valid range" for every public engine function
(the audit test fails when a new public function has no entry here); monotonicity where
physics guarantees it (each with its reason); every inverse against its forward model
(pressure and density altitude, altimeter setting, geopotential height, carried weather,
boost control, highest boost, injector duty and power limit, pump curve); no NaN or
infinity leaves the engine for in-range input. "Just beyond the range", unit independence
and the inverses through the API are in ``tests/api/test_hardening.py``.

Example counts are modest (``database=None``, ``deadline=None``) so the file runs in well
under a minute on a small machine.
"""

import inspect

import numpy as np
import pytest
from hypothesis import assume, given, settings
from hypothesis import strategies as st

from webcalc.engine import airflow, compressor as comp, fuel, power
from webcalc.engine import atmosphere as atm
from strategies import (  # tests/ is on the path
    A, C, F, P, AF, ENGINE, altitude, station_p, altimeter, boost, loss, eta, density, ethanol,
    duty, margin, fuel_p, eps, coolant, eta_drive, injectors, pr_max, temperature, humidity,
    watts, bsfc, afr, inside, finite, pump_curves)
from webcalc.engine.constants import R_DRY

# --- Audit: every public engine function has a property here or in test_properties.py -----------

COVERED = {
    atm: {"geopotential_height", "geometric_height", "isa_temperature", "isa_pressure", "pressure_altitude",
          "station_pressure_from_altimeter", "altimeter_from_station_pressure", "saturation_vapour_pressure",
          "vapour_pressure", "humid_air_density", "density_altitude", "beyond_troposphere",
          "sae_j1349_correction_factor", "carry_weather"},
    comp: {"pressures", "outlet_temperature", "intercooler_outlet_temperature", "drive_power", "highest_boost",
           "boost_here"},
    power: {"ideal_power", "expected_power", "boost_for_ideal_power", "boost_for_expected_power"},
    airflow: {"air_mass_flow", "gas_density", "volume_flow", "corrected_flow", "volumetric_efficiency"},
    fuel: {"blend", "fuel_properties", "na_air_defaults", "sizing_bsfc", "fuel_mass_flow",
           "injector_pressure_difference", "orifice_scale", "injector_flow_needed", "injector_duty",
           "injector_max_power", "rating_fluid_scale", "pump_required_pressure", "pump_required_flow",
           "pump_curve_flow"},
}


@pytest.mark.parametrize("module", list(COVERED), ids=lambda m: m.__name__.rsplit(".", 1)[-1])
def test_every_public_engine_function_is_audited(module):
    # the issue asks for every model: a new public function must get its properties here
    public = {name for name, f in inspect.getmembers(module, inspect.isfunction)
              if f.__module__ == module.__name__ and not name.startswith("_")}
    assert public == COVERED[module]


# SPEC section 3 "Hard ranges" (binding), in SI: the engine's VALID dicts must say the same.
LB_HP_H = 0.45359237 / (745.69987158227 * 3600.0)  # NIST SP 811, lb and hp: 1 lb/hp/h in kg/J
SPEC_RANGES = [
    (A, "altitude", -610.0, 11000.0), (A, "station_pressure", 22e3, 110e3), (A, "altimeter_setting", 85e3, 110e3),
    (A, "temperature", 213.15, 333.15), (A, "relative_humidity", 0.0, 1.0), (C, "boost", 0.0, 700e3),
    (C, "loss", 0.0, 50e3), (C, "exhaust_back_pressure", 0.0, 1000e3), (C, "max_pressure_ratio", 1.0, 6.0),
    (C, "efficiency", 0.3, 1.0), (C, "effectiveness", 0.0, 1.0), (C, "drive_efficiency", 0.5, 1.0),
    (C, "coolant_temperature", 213.15, 373.15), (P, "power", 0.0, 10e6), (P, "drivetrain_loss", 0.0, 0.5),
    (F, "bsfc", 0.2 * LB_HP_H, 2.0 * LB_HP_H), (F, "afr", 3.0, 25.0), (F, "lambda", 0.5, 1.5),
    (AF, "displacement", 0.05e-3, 30e-3), (AF, "rpm", 500.0, 30000.0), (F, "injector_count", 1, 64),
    (F, "pump_count", 1, 16), (F, "duty", 0.0, 1.0), (F, "margin", 0.0, 1.0), (F, "fuel_pressure", 0.5e5, 10e5),
    (F, "fuel_density", 600.0, 1000.0), (F, "ethanol_content", 0.0, 1.0), (AF, "reference_pressure", 50e3, 110e3),
    (AF, "reference_temperature", 200.0, 350.0),
]


@pytest.mark.parametrize("valid, key, lo, hi", SPEC_RANGES, ids=[r[1] for r in SPEC_RANGES])
def test_engine_ranges_are_the_spec_hard_ranges(valid, key, lo, hi):
    # SPEC section 3, hard ranges (binding); degC to K by +273.15 (ISO 80000-5)
    assert valid[key] == (pytest.approx(lo, rel=1e-12, abs=1e-12), pytest.approx(hi, rel=1e-12))


# --- Atmosphere ------------------------------------------------------------------------------------

@ENGINE
@given(altitude, altitude)
def test_higher_is_thinner_and_colder_in_the_standard_atmosphere(h1, h2):
    # US Standard Atmosphere 1976: P and T fall with height in the troposphere (lapse 6.5 K/km);
    # a millimetre apart at least, so that the difference shows in a double
    assume(h2 - h1 > 1e-3)
    assert atm.isa_pressure(h1) > atm.isa_pressure(h2)
    assert atm.isa_temperature(h1) > atm.isa_temperature(h2)
    rho1 = atm.humid_air_density(atm.isa_pressure(h1), atm.isa_temperature(h1), 0.0)
    rho2 = atm.humid_air_density(atm.isa_pressure(h2), atm.isa_temperature(h2), 0.0)
    assert rho1 > rho2
    # density altitude is decreasing in density (inverse of a decreasing law)
    assert atm.density_altitude(rho1) < atm.density_altitude(rho2)


@ENGINE
@given(altitude, station_p, altimeter)
def test_height_and_pressure_inverses_round_trip(h, p, p_alt):
    # US Standard Atmosphere 1976 eq. 18 and 33a, and the NWS formula, each against its inverse
    assert atm.geometric_height(atm.geopotential_height(h)) == pytest.approx(h, rel=1e-12, abs=1e-9)
    assert atm.pressure_altitude(atm.isa_pressure(h)) == pytest.approx(h, rel=1e-9, abs=1e-6)
    assert atm.isa_pressure(atm.pressure_altitude(p)) == pytest.approx(p, rel=1e-12)
    p_stn = atm.station_pressure_from_altimeter(p_alt, h)
    assert atm.altimeter_from_station_pressure(p_stn, h) == pytest.approx(p_alt, rel=1e-12)
    p_alt_back = atm.altimeter_from_station_pressure(p, h)
    assert atm.station_pressure_from_altimeter(p_alt_back, h) == pytest.approx(p, rel=1e-12)
    # a higher station sees a lower pressure for the same altimeter setting (NWS formula)
    assert atm.station_pressure_from_altimeter(p_alt, min(h + 100.0, 11000.0)) <= p_stn


@ENGINE
@given(altitude)
def test_density_altitude_inverts_the_density_law(h):
    # the documented law rho0 (1 - L H / T0)^4.25588 (US Standard Atmosphere 1976) and its inverse
    H = atm.geopotential_height(h)
    rho = 1.225 * (1.0 - 0.0065 * H / 288.15) ** 4.25588
    assert atm.density_altitude(rho) == pytest.approx(h, rel=1e-9, abs=1e-6)
    # on a standard day the density altitude is the elevation; 5 cm covers rho0 = 1.225
    # being the table's rounded 101325 / (R 288.15) (US Standard Atmosphere 1976, Table I)
    rho_isa = atm.humid_air_density(atm.isa_pressure(h), atm.isa_temperature(h), 0.0)
    assert atm.density_altitude(rho_isa) == pytest.approx(h, abs=0.05)
    assert bool(atm.beyond_troposphere(h)) is False  # the whole site range is troposphere


@ENGINE
@given(station_p, temperature, temperature, humidity, humidity)
def test_humid_air_monotonicity(p, T1, T2, rh1, rh2):
    # Clausius-Clapeyron: saturation pressure rises with temperature (Buck 1996 follows it)
    lo, hi = sorted((T1, T2))
    assume(hi - lo > 1e-6)
    assert atm.saturation_vapour_pressure(lo) < atm.saturation_vapour_pressure(hi)
    # Dalton + ideal gas: water vapour (R_v 461.5) is lighter than dry air (R_d 287.05), so
    # moist air is less dense at the same P and T
    a, b = sorted((rh1, rh2))
    assume(b - a > 1e-6)
    assert atm.humid_air_density(p, T1, a) > atm.humid_air_density(p, T1, b)
    # ideal gas law: warmer air at the same pressure is thinner
    assert atm.humid_air_density(p, lo, 0.0) > atm.humid_air_density(p, hi, 0.0)


@ENGINE
@given(st.floats(2e3, 110e3), st.floats(2e3, 110e3), temperature, temperature)
def test_correction_factor_monotonicity(p1, p2, T1, T2):
    # SAE J1349 CF = 1.176 (99/P_dry) sqrt(T/298) - 0.176: thinner or hotter air, bigger factor
    lo, hi = sorted((p1, p2))
    assume(hi - lo > 1e-6)
    assert atm.sae_j1349_correction_factor(lo, T1) > atm.sae_j1349_correction_factor(hi, T1)
    cold, hot = sorted((T1, T2))
    assume(hot - cold > 1e-6)
    assert atm.sae_j1349_correction_factor(p1, cold) < atm.sae_j1349_correction_factor(p1, hot)


@ENGINE
@given(altitude, altitude, altitude, station_p, temperature)
def test_carry_weather_round_trips(h_site, h_row, h_back, p_site, T_site):
    # SPEC section 3 (altitude tables): the carried weather keeps P / ISA(h) and T - ISA_T(h),
    # so carrying to the site's own elevation, or there and back, returns the site's weather
    p, T = atm.carry_weather(h_site, h_site, p_site, T_site)
    assert (p, T) == (pytest.approx(p_site, rel=1e-12), pytest.approx(T_site, rel=1e-12))
    p_row, T_row = atm.carry_weather(h_row, h_site, p_site, T_site)
    p2, T2 = atm.carry_weather(h_back, h_row, p_row, T_row)
    p3, T3 = atm.carry_weather(h_back, h_site, p_site, T_site)
    assert p2 == pytest.approx(p3, rel=1e-12) and T2 == pytest.approx(T3, rel=1e-12)
    assert finite(p_row, T_row) and p_row > 0 and T_row > 0


@ENGINE
@given(altitude, station_p, altimeter, temperature, humidity)
def test_every_atmosphere_function_is_finite_in_range(h, p, p_alt, T, rh):
    # no NaN or infinity for in-range input (issue; SPEC section 3)
    p_stn = atm.station_pressure_from_altimeter(p_alt, h)
    values = [atm.geopotential_height(h), atm.geometric_height(atm.geopotential_height(h)), atm.isa_temperature(h),
              atm.isa_pressure(h), atm.pressure_altitude(p), p_stn, atm.altimeter_from_station_pressure(p, h),
              atm.saturation_vapour_pressure(T), atm.vapour_pressure(T, rh), atm.humid_air_density(p, T, rh),
              atm.density_altitude(atm.humid_air_density(p, T, rh)),
              atm.sae_j1349_correction_factor(p - atm.vapour_pressure(T, rh), T), *atm.carry_weather(h, 500.0, p, T)]
    assert finite(*values)
    assert p_stn > 0


# --- Compressor ------------------------------------------------------------------------------------

@ENGINE
@given(station_p, boost, boost, loss, loss, temperature, eta, eta, eps, coolant)
def test_more_boost_more_ratio_and_heat(p_baro, b1, b2, inlet, ic, T1, e1, e2, e, T_c):
    assume(p_baro - inlet > 0)
    lo, hi = sorted((b1, b2))
    assume(hi - lo > 1e-3)
    pr_lo = comp.pressures(p_baro, lo, inlet, ic)[3]
    pr_hi = comp.pressures(p_baro, hi, inlet, ic)[3]
    # PR = (P_baro + boost + loss) / (P_baro - loss) is increasing in boost (Heywood 1988, 6.8)
    assert pr_lo < pr_hi
    # isentropic relation T2 = T1 (1 + (PR^0.2857 - 1) / eta): more ratio, hotter air
    assert comp.outlet_temperature(T1, pr_lo, e1) < comp.outlet_temperature(T1, pr_hi, e1)
    # ... and a better compressor heats it less (for PR > 1)
    weak, good = sorted((e1, e2))
    assume(good - weak > 1e-6 and pr_hi > 1.001)
    assert comp.outlet_temperature(T1, pr_hi, good) < comp.outlet_temperature(T1, pr_hi, weak)
    # effectiveness definition (Incropera): Tm lies between T2 and the coolant temperature
    T2 = comp.outlet_temperature(T1, pr_hi, weak)
    Tm = comp.intercooler_outlet_temperature(T2, T_c, e)
    assert min(T2, T_c) * (1 - 1e-12) <= Tm <= max(T2, T_c) * (1 + 1e-12)
    # compressor work m cp (T2 - T1) / eta_drive is never negative (second law, eta <= 1)
    assert comp.drive_power(0.3, T1, T2, 0.9) >= 0.0


@ENGINE
@given(pr_max, station_p, loss, loss)
def test_highest_boost_inverts_the_pressure_ratio(ratio, p_baro, inlet, ic):
    # highest_boost solves PR(boost) = PR_max for the forward model of pressures()
    assume(p_baro - inlet > 0)
    b = comp.highest_boost(ratio, p_baro - inlet, ic, p_baro)
    assert finite(b)
    assert comp.pressures(p_baro, b, inlet, ic)[3] == pytest.approx(ratio, rel=1e-9)
    # a compressor allowed a higher ratio reaches a higher boost (linear in PR_max, P1 > 0)
    assert comp.highest_boost(min(ratio + 0.1, 6.0), p_baro - inlet, ic, p_baro) >= b


@ENGINE
@given(boost, station_p, station_p, loss, loss)
def test_boost_control_styles_round_trip(b, p_set, p_here, inlet, ic):
    assume(p_set - inlet > 0 and p_here - inlet > 0)
    # held_manifold keeps MAP: there and back gives the boost set, when no floor at 0 was hit
    here = float(comp.boost_here("held_manifold", b, p_set, p_here))
    if here > 0:
        assert float(comp.boost_here("held_manifold", here, p_here, p_set)) == pytest.approx(b, rel=1e-9, abs=1e-6)
        assert p_here + here == pytest.approx(p_set + b, rel=1e-12)
    # fixed_ratio keeps P2/P1 with losses included (the blower's ratio at the same rpm)
    here = float(comp.boost_here("fixed_ratio", b, p_set, p_here, inlet, ic))
    if here > 0:
        ratio_set = comp.pressures(p_set, b, inlet, ic)[3]
        assert comp.pressures(p_here, here, inlet, ic)[3] == pytest.approx(ratio_set, rel=1e-9)
    # held_gauge keeps the gauge boost
    assert float(comp.boost_here("held_gauge", b, p_set, p_here)) == b
    # thinner air: a MAP-holding control adds boost, a fixed-ratio blower loses it (if above 0)
    if p_here < p_set:
        assert comp.boost_here("held_manifold", b, p_set, p_here) >= b
        assert comp.boost_here("fixed_ratio", b, p_set, p_here, inlet, ic) <= b * (1 + 1e-12) + 1e-9


# --- Power with boost ----------------------------------------------------------------------------

def turbo_kwargs(na, p_na, T_na, p_baro, T1, inlet, ic, e, effect, T_c, ratio, sfc=None, a=None):
    sfc0, a0 = fuel.na_air_defaults(14.7)
    return dict(na_power=na, p_na=p_na, T_na=T_na, na_air_mass_flow=na * (sfc or sfc0) * (a or a0), p_baro=p_baro,
                T1=T1, inlet_loss=inlet, intercooler_loss=ic, efficiency=e, effectiveness=effect, T_coolant=T_c,
                belt_driven=False, exhaust_ratio=ratio)


turbo_cases = st.tuples(watts, station_p, temperature, station_p, temperature, loss, loss, eta, eps, coolant,
                        st.floats(0.0, 1.0))


@ENGINE
@given(turbo_cases, boost, boost)
def test_more_boost_gives_more_ideal_and_expected_power_on_a_turbo(case, b1, b2):
    # ideal = P_na MAP / p_na is increasing in MAP (pressure-ratio rule, common practice, no source).
    # expected, turbo with exhaust ratio r <= 1: gross ~ MAP Tm^-0.5 grows, since with
    # x = PR, x T2'/T2 = a x^a / (eta + x^a - 1) < 2 for eta > 0.15 (a = 0.2857, isentropic
    # relation) and the intercooler only damps Tm; pumping = (1 - r) boost m_na R T_na / p_na
    # grows with boost (SPEC section 4 model, Heywood 1988 sec. 5.4). Belt-driven blowers and
    # r > 1 may peak, so they are not claimed.
    na, p_na, T_na, p_baro, T1, inlet, ic, e, effect, T_c, ratio = case
    assume(p_baro - inlet > 0)
    lo, hi = sorted((b1, b2))
    assume(hi - lo > 1.0)
    kw = turbo_kwargs(*case)
    r_lo, r_hi = power.expected_power(lo, **kw), power.expected_power(hi, **kw)
    assert r_lo["ideal"] < r_hi["ideal"]
    assert r_lo["expected"] < r_hi["expected"]
    assert r_lo["pressure_ratio"] < r_hi["pressure_ratio"]
    # with no drive and pumping (1 - r) boost m_na R T_na / p_na, the rest is the SAE J1349
    # square-root temperature law on the ideal power (SPEC section 4, from memory)
    pumping = (1.0 - kw["exhaust_ratio"]) * hi * kw["na_air_mass_flow"] * R_DRY * kw["T_na"] / kw["p_na"]
    assert r_hi["pumping"] == pytest.approx(pumping, rel=1e-9, abs=1e-9 * r_hi["ideal"])  # MAP - EMAP cancels
    gross = r_hi["ideal"] * (kw["T_na"] / r_hi["Tm"]) ** 0.5
    assert r_hi["expected"] - r_hi["pumping"] == pytest.approx(gross, rel=1e-9)


@ENGINE
@given(watts, station_p, station_p, st.floats(0.0, 20.0), boost)
def test_ideal_boost_inverts_the_pressure_ratio_rule(na, p_na, p_baro, factor, b):
    # boost_for_ideal_power is the closed-form inverse of ideal_power (SPEC section 4)
    target = float(power.ideal_power(na, p_baro + b, p_na))
    assert float(power.boost_for_ideal_power(target, na, p_na, p_baro)) == pytest.approx(b, rel=1e-9, abs=1e-6)
    # any target: boost 0 when the rule reaches it unboosted, else the rule gives the target back
    target = factor * na
    b_ideal = float(power.boost_for_ideal_power(target, na, p_na, p_baro))
    assert finite(b_ideal) and b_ideal >= 0.0
    if b_ideal > 0:
        assert float(power.ideal_power(na, p_baro + b_ideal, p_na)) == pytest.approx(target, rel=1e-9)
    else:
        assert target <= float(power.ideal_power(na, p_baro, p_na)) * (1 + 1e-12)
    # thinner air here needs more boost for the same target (MAP fixed by the rule)
    assert power.boost_for_ideal_power(target, na, p_na, 0.9 * p_baro) >= b_ideal


@settings(max_examples=50, deadline=None, database=None)
@given(turbo_cases, pr_max, st.floats(0.2, 8.0))
def test_expected_boost_root_find_against_the_monotone_forward_model(case, ratio_max, factor):
    # expected power of a turbo with r <= 1 is increasing (see above), so the binding grid and
    # bisection (SPEC section 4) finds a root exactly when expected(0) < target <= expected(b_max),
    # and that root gives the target back (our own round trip, 1e-9)
    na, p_na, T_na, p_baro, T1, inlet, ic, e, effect, T_c, ratio = case
    assume(p_baro - inlet > 0)
    kw = turbo_kwargs(*case)
    expected = lambda x: power.expected_power(x, **kw)["expected"]  # noqa: E731
    b_max = float(comp.highest_boost(ratio_max, p_baro - inlet, ic, p_baro))
    target = factor * na
    b, max_expected = power.boost_for_expected_power(target, b_max, expected)
    if b_max < 0:
        assert b is None
        return
    e0, e_max = float(expected(0.0)), float(expected(b_max))
    assert max_expected == pytest.approx(e_max, rel=1e-12)
    assume(abs(target - e0) > 1e-9 * target and abs(target - e_max) > 1e-9 * target)
    assert (b is not None) == (e0 < target <= e_max)
    if b is not None:
        assert 0.0 <= b <= b_max
        assert float(expected(b)) == pytest.approx(target, rel=1e-9)
        # a bigger target needs more boost (inverse of an increasing function)
        b2, _ = power.boost_for_expected_power(min(target * 1.01, e_max), b_max, expected)
        assert b2 is not None and b2 >= b - 1e-6


@ENGINE
@given(st.sampled_from(comp.INDUCTIONS), boost, turbo_cases, eta_drive, st.floats(0.0, 5.0), bsfc, afr, pr_max)
def test_power_and_root_find_are_finite_for_every_induction(kind, b, case, drive_eff, ratio, sfc, a, ratio_max):
    # no NaN or infinity for in-range input, blowers included (issue; SPEC section 3)
    na, p_na, T_na, p_baro, T1, inlet, ic, e, effect, T_c, _ = case
    assume(p_baro - inlet > 0)
    kw = turbo_kwargs(na, p_na, T_na, p_baro, T1, inlet, ic, e, effect, T_c, ratio, sfc, a)
    kw.update(belt_driven=kind in comp.BELT_DRIVEN, drive_efficiency=drive_eff)
    r = power.expected_power(b, **kw)
    assert finite(*r.values())
    b_max = float(comp.highest_boost(ratio_max, p_baro - inlet, ic, p_baro))
    expected = lambda x: power.expected_power(x, **kw)["expected"]  # noqa: E731
    found, max_expected = power.boost_for_expected_power(1.5 * na, b_max, expected)
    assert found is None or (finite(found) and 0.0 <= found <= b_max)
    assert max_expected is None or finite(max_expected)
    assert finite(power.boost_for_ideal_power(1.5 * na, na, p_na, p_baro))


# --- Airflow -------------------------------------------------------------------------------------

@ENGINE
@given(watts, bsfc, afr, station_p, station_p, temperature, inside(AF, "displacement"), inside(AF, "rpm"),
       inside(AF, "rpm"), inside(AF, "reference_pressure"), inside(AF, "reference_temperature"))
def test_airflow_monotonicity_and_inverses(Pw, sfc, a, p1, p2, T, vd, n1, n2, p_ref, T_ref):
    m = airflow.air_mass_flow(Pw, sfc, a)
    # definitions of sfc and AFR (Heywood 1988 eq. 2.24, 2.29): air = fuel x AFR
    assert m == pytest.approx(fuel.fuel_mass_flow(Pw, sfc) * a, rel=1e-12)
    # ideal gas law: volume flow x density is the mass flow again
    assert airflow.volume_flow(m, p1, T) * airflow.gas_density(p1, T) == pytest.approx(m, rel=1e-12)
    lo, hi = sorted((p1, p2))
    assume(hi - lo > 1e-6)
    # corrected flow (SAE J922) falls as inlet pressure rises; at the reference state it is the flow
    assert airflow.corrected_flow(m, lo, T, p_ref, T_ref) > airflow.corrected_flow(m, hi, T, p_ref, T_ref)
    assert airflow.corrected_flow(m, p_ref, T_ref, p_ref, T_ref) == pytest.approx(m, rel=1e-12)
    # VE = m / (rho V N / 120): the same air at a higher speed fills the cylinders less
    slow, fast = sorted((n1, n2))
    assume(fast - slow > 1e-6)
    rho = airflow.gas_density(p1, T)
    assert airflow.volumetric_efficiency(m, rho, vd, slow) > airflow.volumetric_efficiency(m, rho, vd, fast)
    # VE inverts: the air of a VE-1 engine at this density, speed and displacement gives VE = 1
    assert airflow.volumetric_efficiency(rho * vd * slow / 120.0, rho, vd, slow) == pytest.approx(1.0, rel=1e-12)
    assert finite(m, airflow.volume_flow(m, p1, T), airflow.corrected_flow(m, p1, T, p_ref, T_ref))


# --- Fuel ----------------------------------------------------------------------------------------

@ENGINE
@given(watts, bsfc, bsfc, injectors, injectors, duty, duty)
def test_injector_sizing_monotonicity_and_inverses(Pw, s1, s2, n1, n2, d1, d2):
    need = fuel.injector_flow_needed(Pw, s1, n1, d1)
    # m_inj = P bsfc / (n duty): duty of the needed flow is the duty limit, and the power limit
    # of that injector is the power (the three formulas invert each other; SPEC section 4)
    assert fuel.injector_duty(Pw, s1, n1, need) == pytest.approx(d1, rel=1e-12)
    assert fuel.injector_max_power(need, n1, d1, s1) == pytest.approx(Pw, rel=1e-12)
    few, many = sorted((n1, n2))
    assume(many > few)
    # more injectors share the fuel: each one can be smaller
    assert fuel.injector_flow_needed(Pw, s1, many, d1) < fuel.injector_flow_needed(Pw, s1, few, d1)
    lo, hi = sorted((s1, s2))
    assume(hi > lo * (1 + 1e-9))
    # m_f = P bsfc: a thirstier engine needs more fuel and bigger injectors
    assert fuel.fuel_mass_flow(Pw, lo) < fuel.fuel_mass_flow(Pw, hi)
    assert fuel.injector_flow_needed(Pw, lo, n1, d1) < fuel.injector_flow_needed(Pw, hi, n1, d1)
    short, long_ = sorted((d1, d2))
    assume(long_ > short * (1 + 1e-9))
    # a higher duty limit lets a smaller injector do the job
    assert fuel.injector_flow_needed(Pw, s1, n1, long_) < fuel.injector_flow_needed(Pw, s1, n1, short)


@ENGINE
@given(watts, bsfc, density, margin, margin, fuel_p, boost, loss)
def test_pump_sizing_monotonicity(Pw, sfc, rho, m1, m2, base, b, line):
    lo, hi = sorted((m1, m2))
    assume(hi - lo > 1e-9)
    # required = P bsfc (1 + margin) / rho: more margin, bigger pump (SPEC section 4)
    assert fuel.pump_required_flow(Pw, sfc, rho, lo) < fuel.pump_required_flow(Pw, sfc, rho, hi)
    # with no margin it is exactly the fuel volume flow m_f / rho
    assert fuel.pump_required_flow(Pw, sfc, rho, 0.0) == pytest.approx(fuel.fuel_mass_flow(Pw, sfc) / rho, rel=1e-12)
    # a boost-referenced regulator adds boost to the rail (rail - manifold held): more
    # boost, more pump pressure; a fixed rail does not, and loses injector pressure instead
    more = min(b + 10e3, C["boost"][1])
    assume(more - b > 1.0)
    assert fuel.pump_required_pressure(base, more, "boost_referenced", line) > fuel.pump_required_pressure(
        base, b, "boost_referenced", line)
    assert fuel.pump_required_pressure(base, more, "fixed", line) == fuel.pump_required_pressure(base, b, "fixed", line)
    assert fuel.injector_pressure_difference(base, more, "fixed") < fuel.injector_pressure_difference(base, b, "fixed")
    assert fuel.injector_pressure_difference(base, more, "boost_referenced") == base


@ENGINE
@given(fuel_p, fuel_p, density, density, ethanol, ethanol, st.sampled_from(("na",) + comp.INDUCTIONS))
def test_orifice_fluid_and_blend_properties(p1, p2, rho1, rho2, x1, x2, induction):
    # orifice equation (ISO 5167-1): Q ~ sqrt(dp / rho); each scale and its reverse multiply to 1
    assert fuel.rating_fluid_scale(rho1, rho2) * fuel.rating_fluid_scale(rho2, rho1) == pytest.approx(1.0, rel=1e-12)
    lo, hi = sorted((p1, p2))
    assume(hi - lo > 1e-6)
    assert fuel.orifice_scale(hi, lo) > 1.0  # more pressure difference, more flow
    # blend rule (SPEC section 3): the ends are the table's fuels; e85 is the blend at 0.85
    assert fuel.fuel_properties("gasoline", 0.0) == (pytest.approx(745.0), pytest.approx(14.7))
    assert fuel.fuel_properties("gasoline", 1.0) == (pytest.approx(789.0), pytest.approx(9.0))
    assert fuel.fuel_properties("e85") == fuel.blend(fuel.E85_ETHANOL)
    # more ethanol needs more fuel mass for the same air: sizing BSFC scales with 14.7 / AFR_st
    # (same lambda, same air per power; common practice, from memory)
    a, b = sorted((x1, x2))
    assume(b - a > 1e-9)
    afr_a, afr_b = fuel.blend(a)[1], fuel.blend(b)[1]
    assert fuel.sizing_bsfc(induction, afr_a) < fuel.sizing_bsfc(induction, afr_b)
    sfc_a, na_afr_a = fuel.na_air_defaults(afr_a)
    # the same air per power for every fuel (SPEC section 4): bsfc x afr is the gasoline figure
    assert sfc_a * na_afr_a == pytest.approx(fuel.NA_BSFC_GASOLINE * fuel.NA_AFR_GASOLINE, rel=1e-12)
    assert finite(*fuel.blend(a), fuel.sizing_bsfc(induction, afr_a), sfc_a, na_afr_a)


@ENGINE
@given(pump_curves(), st.floats(0.0, 20e5), st.floats(0.0, 20e5), st.floats(0.0, 1.0))
def test_pump_curve_interpolation(curve, x1, x2, t):
    ps, qs = curve
    # piecewise linear interpolation: exact at the data-sheet points, linear between them
    flow, ext = fuel.pump_curve_flow(ps, qs, ps)
    assert flow == pytest.approx(qs, rel=1e-12) and not np.any(ext)
    i = int(t * (len(ps) - 2))
    x = ps[i] + t * (ps[i + 1] - ps[i])
    want = qs[i] + (x - ps[i]) * (qs[i + 1] - qs[i]) / (ps[i + 1] - ps[i])
    assert float(fuel.pump_curve_flow(ps, qs, x)[0]) == pytest.approx(want, rel=1e-9, abs=1e-18)
    # a pump flows less against more pressure when its curve says so (monotone data, linear
    # pieces, linear extrapolation with the end slopes, floored at 0: SPEC section 3)
    lo, hi = sorted((x1, x2))
    f_lo, f_hi = (float(v) for v in fuel.pump_curve_flow(ps, qs, [lo, hi])[0])
    assert f_lo >= f_hi * (1 - 1e-12) - 1e-18 and f_hi >= 0.0
    # outside the curve: the line through the two nearest points, never below 0 (SPEC section 3)
    for x_out, (i0, i1) in ((ps[0] - (x1 + 1.0), (0, 1)), (ps[-1] + x2 + 1.0, (-2, -1))):
        slope = (qs[i1] - qs[i0]) / (ps[i1] - ps[i0])
        want = max(0.0, qs[i1] + slope * (x_out - ps[i1]))
        flow, ext = fuel.pump_curve_flow(ps, qs, x_out)
        assert float(flow) == pytest.approx(want, rel=1e-9, abs=1e-15) and bool(ext)
    # inverse: the pressure at which the curve gives a flow, read back through the curve
    if qs[0] > qs[-1]:
        q = qs[-1] + t * (qs[0] - qs[-1])
        p_at = float(np.interp(q, qs[::-1], ps[::-1]))
        assert float(fuel.pump_curve_flow(ps, qs, p_at)[0]) == pytest.approx(q, rel=1e-9, abs=1e-15)
    assert finite(*fuel.pump_curve_flow(ps, qs, [x1, x2]))
