"""Properties of the engine over its whole valid input space (hypothesis).

The ranges come from the ``VALID`` dicts beside the functions, so a range that widens
there widens here. Example counts are kept modest so the engine suite stays quick.
"""

import numpy as np
import pytest
from hypothesis import assume, event, given, settings
from hypothesis import strategies as st

from webcalc.engine import airflow
from webcalc.engine import atmosphere as atm
from webcalc.engine import compressor as comp
from webcalc.engine import fuel, power

FAST = settings(max_examples=150, deadline=None, database=None)
SLOW = settings(max_examples=60, deadline=None, database=None)


def within(valid, key, exclude_min=False):
    """Floats over a ``VALID`` range. An open lower bound at 0 (power, duty) is sampled from
    1e-9 of the upper bound: subnormal inputs such as 1e-320 W overflow or underflow
    (fuel flow 0, duty 0/0); the API answers those with a 400 for a non-finite result
    (SPEC section 3), so they are not the engine's business."""
    lo, hi = valid[key]
    if exclude_min and lo == 0.0:
        lo = 1e-9 * hi
    return st.floats(lo, hi, exclude_min=exclude_min, allow_nan=False, allow_infinity=False)


altitude = within(atm.VALID, "altitude")
station_pressure = within(atm.VALID, "station_pressure")
altimeter_setting = within(atm.VALID, "altimeter_setting")
temperature = within(atm.VALID, "temperature")
humidity = within(atm.VALID, "relative_humidity")
boost = within(comp.VALID, "boost")
loss = within(comp.VALID, "loss")
efficiency = within(comp.VALID, "efficiency")
effectiveness = within(comp.VALID, "effectiveness")
drive_efficiency = within(comp.VALID, "drive_efficiency")
coolant = within(comp.VALID, "coolant_temperature")
na_power = within(power.VALID, "power", exclude_min=True)
bsfc = within(fuel.VALID, "bsfc")
afr = within(fuel.VALID, "afr")
induction = st.sampled_from(comp.INDUCTIONS)


def finite(*values):
    return all(np.all(np.isfinite(np.asarray(v, dtype=float))) for v in values)


# --- Power with boost --------------------------------------------------------------------------

@FAST
@given(na_power, station_pressure, station_pressure, boost, boost)
def test_more_boost_never_gives_less_ideal_power(na, p_na, p_baro, b1, b2):
    # the pressure-ratio rule is increasing in manifold pressure (common practice, no source)
    lo, hi = sorted((b1, b2))
    assert power.ideal_power(na, p_baro + lo, p_na) <= power.ideal_power(na, p_baro + hi, p_na)


@FAST
@given(induction, efficiency, drive_efficiency, boost, station_pressure, station_pressure,
       temperature, st.floats(0.0, 60.0), na_power, bsfc, afr)
def test_expected_never_exceeds_ideal_with_a_perfect_intercooler(
    kind, eta, eta_drive, b, p_na, p_baro, T_na, warmer, na, sfc, ratio
):
    # SPEC section 4 argument (x^a - 1 >= a ln x >= a (1 - 1/x)): a perfect intercooler at
    # the NA temperature, no losses and the default exhaust pressure (1 x boost for a turbo,
    # 0 for a blower) give expected <= ideal for every efficiency <= 1, and expected = ideal
    # for a turbo. It also holds with inlet air warmer than the NA air (drive work grows
    # with T1, the pumping gain with Tm = T_na).
    T1 = T_na + warmer
    assume(T1 <= atm.VALID["temperature"][1])
    r = power.expected_power(
        b, na_power=na, p_na=p_na, T_na=T_na, na_air_mass_flow=na * sfc * ratio,
        p_baro=p_baro, T1=T1, efficiency=eta, effectiveness=1.0, T_coolant=T_na,
        belt_driven=kind in comp.BELT_DRIVEN, drive_efficiency=eta_drive,
        exhaust_ratio=1.0 if kind == "turbo" else 0.0,
    )
    assert r["expected"] <= r["ideal"] * (1.0 + 1e-12)
    if kind == "turbo":
        assert r["expected"] == pytest.approx(r["ideal"], rel=1e-12)


@SLOW
@given(induction, st.booleans(), st.floats(50.0, 1500.0), st.floats(1.01, 2.5),
       st.floats(60e3, 110e3), temperature, st.floats(0.0, 5e3), st.floats(0.0, 20e3))
def test_boost_for_power_round_trips(kind, intercooled, na_hp, factor, p_baro, T, inlet, ic):
    # our own round trip of the binding root find: expected(boost) = target to 1e-9.
    # Sites and losses are drawn where most targets are reachable; the out-of-reach
    # branch is checked too when it comes up.
    assume(p_baro - inlet > 0)
    na = na_hp * 745.69987158227
    sfc, a = fuel.na_air_defaults(14.7)
    kw = dict(
        na_power=na, p_na=101325.0, T_na=288.15, na_air_mass_flow=na * sfc * a, p_baro=p_baro,
        T1=T, inlet_loss=inlet, intercooler_loss=ic, efficiency=comp.DEFAULT_EFFICIENCY[kind],
        effectiveness=0.75 if intercooled else 0.0, belt_driven=kind in comp.BELT_DRIVEN,
        exhaust_ratio=1.0 if kind == "turbo" else 0.0,
    )
    expected = lambda x: power.expected_power(x, **kw)["expected"]  # noqa: E731
    _, p1, _, _ = comp.pressures(p_baro, 0.0, inlet, ic)
    b_max = comp.highest_boost(comp.DEFAULT_MAX_PRESSURE_RATIO[kind], p1, ic, p_baro)
    target = factor * na
    b, max_expected = power.boost_for_expected_power(target, b_max, expected)
    event("reachable" if b is not None else "unreachable")
    if b is not None:
        assert 0.0 <= b <= b_max
        assert float(expected(b)) == pytest.approx(target, rel=1e-9)
        assert max_expected >= target
    elif b_max >= 0:
        grid = np.linspace(0.0, b_max, power.GRID_POINTS)
        f = expected(grid) - target
        # no upward sign change on the grid: out of reach, or already reached at boost 0
        assert not np.any((f[:-1] < 0) & (f[1:] >= 0))
    # the ideal closed form inverts the rule exactly wherever boost is needed
    b_ideal = power.boost_for_ideal_power(target, na, 101325.0, p_baro)
    if b_ideal > 0:
        assert power.ideal_power(na, p_baro + b_ideal, 101325.0) == pytest.approx(target, rel=1e-12)


# --- Fuel --------------------------------------------------------------------------------------

fuel_pressure = within(fuel.VALID, "fuel_pressure")


@FAST
@given(fuel_pressure, fuel_pressure, fuel_pressure)
def test_injector_flow_scales_with_square_root_of_pressure(p_a, p_b, p_c):
    # orifice equation (ISO 5167-1): Q ~ sqrt(dp)
    assert fuel.orifice_scale(p_a, p_b) ** 2 == pytest.approx(p_a / p_b, rel=1e-12)
    assert fuel.orifice_scale(p_a, p_b) * fuel.orifice_scale(p_b, p_c) == pytest.approx(
        fuel.orifice_scale(p_a, p_c), rel=1e-12
    )


@FAST
@given(st.floats(0.0, 1.0), st.floats(0.0, 1.0))
def test_more_ethanol_means_denser_fuel_and_a_lower_ratio(x1, x2):
    # blend rule between gasoline (745, 14.7) and ethanol (789, 9.0): both monotone
    lo, hi = sorted((x1, x2))
    (rho_lo, afr_lo), (rho_hi, afr_hi) = fuel.blend(lo), fuel.blend(hi)
    assert rho_lo <= rho_hi * (1 + 1e-15)
    assert afr_lo >= afr_hi * (1 - 1e-15)
    assert 745.0 * (1 - 1e-15) <= rho_lo <= 789.0 * (1 + 1e-15)
    assert 9.0 * (1 - 1e-15) <= afr_hi <= 14.7 * (1 + 1e-15)


# --- No NaN or infinity inside the valid ranges -----------------------------------------------------

@FAST
@given(altitude, station_pressure, altimeter_setting, temperature, humidity)
def test_atmosphere_is_finite_in_range(h, p, p_alt, T, rh):
    rho = atm.humid_air_density(p, T, rh)
    p_dry = p - atm.vapour_pressure(T, rh)
    assert p_dry > 0
    assert rho > 0
    assert finite(
        atm.isa_pressure(h), atm.isa_temperature(h), atm.pressure_altitude(p),
        atm.station_pressure_from_altimeter(p_alt, h), rho, atm.density_altitude(rho),
        atm.sae_j1349_correction_factor(p_dry, T), *atm.carry_weather(h, 0.0, p, T),
    )


@FAST
@given(boost, station_pressure, temperature, station_pressure, temperature, loss, loss, efficiency,
       effectiveness, coolant, st.booleans(), drive_efficiency, st.floats(0.0, 5.0), na_power, bsfc, afr)
def test_power_model_is_finite_in_range(b, p_baro, T1, p_na, T_na, inlet, ic, eta, eps, T_c, belt,
                                        eta_drive, ratio, na, sfc, a):
    # a compressor inlet pressure at or below 0 is a 400 at the API (SPEC section 3)
    assume(p_baro - inlet > 0)
    r = power.expected_power(
        b, na_power=na, p_na=p_na, T_na=T_na, na_air_mass_flow=na * sfc * a, p_baro=p_baro, T1=T1,
        inlet_loss=inlet, intercooler_loss=ic, efficiency=eta, effectiveness=eps, T_coolant=T_c,
        belt_driven=belt, drive_efficiency=eta_drive, exhaust_ratio=ratio,
    )
    assert finite(*r.values())
    assert r["Tm"] > 0 and r["T2"] >= T1 * (1 - 1e-12)


@FAST
@given(st.sampled_from(comp.BOOST_CONTROLS), boost, station_pressure, station_pressure, loss, loss)
def test_boost_here_is_finite_and_never_negative(control, b, p_set, p_here, inlet, ic):
    assume(p_set - inlet > 0)
    here = comp.boost_here(control, b, p_set, p_here, inlet, ic)
    assert finite(here)
    assert here >= 0.0


@FAST
@given(na_power, bsfc, afr, station_pressure, temperature,
       within(airflow.VALID, "reference_pressure"), within(airflow.VALID, "reference_temperature"),
       within(airflow.VALID, "displacement"), within(airflow.VALID, "rpm"), st.integers(1, 16))
def test_airflow_is_finite_in_range(P, sfc, a, p1, T1, p_ref, T_ref, vd, rpm, n):
    m = airflow.air_mass_flow(P, sfc, a)
    rho = airflow.gas_density(p1, T1)
    assert finite(m, rho, airflow.volume_flow(m, p1, T1), airflow.corrected_flow(m / n, p1, T1, p_ref, T_ref),
                  airflow.volumetric_efficiency(m, rho, vd, rpm))


@FAST
@given(na_power, bsfc, st.integers(1, 64), within(fuel.VALID, "duty", exclude_min=True), fuel_pressure,
       fuel_pressure, within(fuel.VALID, "fuel_density"), within(fuel.VALID, "margin"),
       within(fuel.VALID, "ethanol_content"))
def test_fuel_model_is_finite_in_range(P, sfc, n, duty, p_rated, p_op, rho, margin, x):
    need = fuel.injector_flow_needed(P, sfc, n, duty)
    rating = need * fuel.orifice_scale(p_rated, p_op)
    # the rating taken back to the operating pressure is the need (our own round trip)
    assert rating * fuel.orifice_scale(p_op, p_rated) == pytest.approx(need, rel=1e-12)
    assert finite(need, rating, fuel.injector_duty(P, sfc, n, need), fuel.injector_max_power(need, n, duty, sfc),
                  fuel.pump_required_flow(P, sfc, rho, margin), *fuel.blend(x),
                  fuel.rating_fluid_scale(rho, 684.0))


# --- Vectorised calls equal per-point calls ------------------------------------------------------

@SLOW
@given(st.lists(boost, min_size=1, max_size=12), induction, station_pressure, temperature, loss, loss)
def test_expected_power_vectorised_equals_per_point(boosts, kind, p_baro, T1, inlet, ic):
    assume(p_baro - inlet > 0)
    kw = dict(
        na_power=3e5, p_na=101325.0, T_na=288.15, na_air_mass_flow=0.3, p_baro=p_baro, T1=T1,
        inlet_loss=inlet, intercooler_loss=ic, efficiency=comp.DEFAULT_EFFICIENCY[kind],
        belt_driven=kind in comp.BELT_DRIVEN,
    )
    arr = power.expected_power(np.array(boosts), **kw)
    for i, b in enumerate(boosts):
        one = power.expected_power(b, **kw)
        for key, value in one.items():
            assert np.broadcast_to(arr[key], (len(boosts),))[i] == pytest.approx(float(value), rel=1e-14, abs=1e-300)


@FAST
@given(st.lists(st.tuples(altitude, station_pressure, temperature, humidity), min_size=1, max_size=10))
def test_atmosphere_vectorised_equals_per_point(rows):
    h, p, T, rh = (np.array(col) for col in zip(*rows))
    vec = [atm.isa_pressure(h), atm.isa_temperature(h), atm.pressure_altitude(p),
           atm.humid_air_density(p, T, rh), atm.density_altitude(atm.humid_air_density(p, T, rh)),
           atm.sae_j1349_correction_factor(p, T)]
    for i in range(len(rows)):
        one = [atm.isa_pressure(h[i]), atm.isa_temperature(h[i]), atm.pressure_altitude(p[i]),
               atm.humid_air_density(p[i], T[i], rh[i]),
               atm.density_altitude(atm.humid_air_density(p[i], T[i], rh[i])),
               atm.sae_j1349_correction_factor(p[i], T[i])]
        for v, o in zip(vec, one):
            assert v[i] == pytest.approx(float(o), rel=1e-14, abs=1e-9)


@FAST
@given(st.lists(st.floats(0.0, 12e5), min_size=1, max_size=10))
def test_pump_curve_vectorised_equals_per_point(pressures):
    curve_p, curve_q = [2e5, 4e5, 6e5], [9e-5, 8e-5, 6e-5]
    flow, ext = fuel.pump_curve_flow(curve_p, curve_q, pressures)
    for i, x in enumerate(pressures):
        f1, e1 = fuel.pump_curve_flow(curve_p, curve_q, x)
        assert flow[i] == float(f1) and ext[i] == bool(e1)
        assert flow[i] >= 0.0
