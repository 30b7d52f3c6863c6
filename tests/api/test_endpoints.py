"""The seven endpoints against hand-worked numbers, published formulas and trade facts."""

import math

import pytest

from webcalc.engine.constants import HP, LB

PSI = 6894.757293168361  # Pa, NIST SP 811
ATM = 101325.0


def si(body, name):
    """An output quantity in SI (requests here ask for units=si)."""
    return body[name]["value"]


def test_healthz(client):
    r = client.get("/healthz")
    assert r.status_code == 200 and r.json == {"status": "ok"}


def test_site_defaults_to_isa_sea_level_and_j1349_is_about_095(post):
    body = post("site", {"units": "si"}).json
    # US Standard Atmosphere 1976: 101 325 Pa, 288.15 K, 1.225 kg/m^3 at sea level
    assert si(body, "station_pressure") == pytest.approx(101325.0, rel=1e-12)
    assert si(body, "temperature") == pytest.approx(288.15, rel=1e-12)
    assert si(body, "air_density") == pytest.approx(1.225, rel=1e-4)
    assert si(body, "density_altitude") == pytest.approx(0.0, abs=0.5)
    # SAE J1349: CF = 1.176 (99/101.325) sqrt(288/298) - 0.176 = 0.9536 (worked by hand)
    assert body["correction_factor"] == pytest.approx(0.9536, abs=2e-4)
    assert {a for a in body["assumptions"]} >= {"site.station_pressure", "site.temperature", "site.relative_humidity"}
    assert [c["code"] for c in body["cautions"]] == ["estimates_only", "engine_limits", "fuel_safety", "rules"]


def test_site_altimeter_setting_follows_the_nws_formula(post):
    # US NWS: P_stn = 30.00 inHg ((288 - 0.0065 x 1500) / 288)^5.2561 = 25.0325 inHg (worked by hand)
    body = post("site", {"site": {"altitude": "1500 m", "altimeter_setting": "30.00 inHg"}, "units": "si"}).json
    assert si(body, "station_pressure") / 3386.389 == pytest.approx(30.0 * ((288 - 9.75) / 288) ** 5.2561, rel=1e-12)
    assert si(body, "station_pressure") / 3386.389 == pytest.approx(25.0325, abs=1e-4)


def test_site_hot_day_raises_density_altitude_and_flags_j1349_range(post):
    body = post("site", {"site": {"altitude": "1500 m", "temperature": "35 degC", "relative_humidity": 0.5},
                         "units": "si"}).json
    # A hot humid day at 1500 m has a density altitude well above the elevation (common practice, no source)
    assert si(body, "density_altitude") > 2500
    assert "correction_out_of_range" in [w["code"] for w in body["warnings"]]


def test_site_rejects_ambiguous_pressure_and_altimeter_without_altitude(post):
    r = post("site", {"site": {"station_pressure": "90 kPa", "altimeter_setting": "101 kPa", "altitude": "1 km"}})
    assert r.status_code == 400 and r.json["error"]["fields"][0]["field"] == "site.altimeter_setting"
    r = post("site", {"site": {"altimeter_setting": "101 kPa"}})
    assert r.status_code == 400 and r.json["error"]["fields"][0]["field"] == "site.altimeter_setting"


def test_one_atmosphere_of_boost_doubles_manifold_pressure(post):
    # The pressure-ratio rule (common practice, no source): 14.696 psi boost at sea level = 2 atm MAP
    body = post("pressure-ratio", {"boost": "1 atm", "units": "si"}).json
    assert si(body, "manifold_pressure") == pytest.approx(2 * ATM, rel=1e-12)
    assert body["pressure_ratio"] == pytest.approx(2.0, rel=1e-12)
    assert si(body, "sea_level_boost") == pytest.approx(ATM, rel=1e-12)
    # isentropic outlet temperature: 288.15 (1 + (2^(0.4/1.4) - 1) / 0.72) = 375.80 K (worked by hand)
    assert si(body, "compressor_outlet_temperature") == pytest.approx(375.80, abs=0.01)


def test_losses_raise_the_pressure_ratio(post):
    body = post("pressure-ratio", {"boost": "100 kPa", "inlet_loss": "2 kPa", "intercooler_loss": "10 kPa",
                                   "site": {"station_pressure": "100 kPa"}, "units": "si"}).json
    assert body["pressure_ratio"] == pytest.approx(210 / 98, rel=1e-12)
    assert si(body, "compressor_inlet_pressure") == pytest.approx(98e3)
    assert si(body, "compressor_outlet_pressure") == pytest.approx(210e3)


def test_boost_set_at_home_carries_to_altitude_by_control_style(post):
    base = {"boost": "1 bar", "site": {"altitude": "2000 m"}, "units": "si"}
    home = {"site": {"altitude": "0 m"}}
    held = post("pressure-ratio", dict(base, boost_set_at=dict(home, control="held_manifold"))).json
    gauge = post("pressure-ratio", dict(base, boost_set_at=dict(home, control="held_gauge"))).json
    ratio = post("pressure-ratio", dict(base, boost_set_at=dict(home, control="fixed_ratio"))).json
    assert si(held, "manifold_pressure") == pytest.approx(ATM + 1e5, rel=1e-12)
    assert si(gauge, "boost_here") == pytest.approx(1e5, rel=1e-12)
    assert ratio["pressure_ratio"] == pytest.approx((ATM + 1e5) / ATM, rel=1e-12)
    assert si(held, "boost_here") > 1e5 > si(ratio, "boost_here")
    assert "boost_higher_here" in [w["code"] for w in held["warnings"]]
    assert "boost_higher_here" not in [w["code"] for w in ratio["warnings"]]


def test_altitude_table_rows_carry_the_weather(post):
    body = post("pressure-ratio", {"boost": "1 bar", "site": {"altitude": "0 m", "temperature": "25 degC"},
                                   "altitudes": ["0 m", "1000 m", "3000 m"], "units": "si"}).json
    rows = body["altitude_table"]
    assert [r["altitude"]["value"] for r in rows] == [0, 1000, 3000]
    # US Standard Atmosphere 1976 Table I: 89 876 Pa at 1000 m (from memory)
    assert rows[1]["station_pressure"]["value"] == pytest.approx(89876, rel=1e-4)
    assert rows[0]["held_gauge"]["boost_here"]["value"] == pytest.approx(1e5)
    assert rows[2]["held_manifold"]["boost_here"]["value"] > rows[1]["held_manifold"]["boost_here"]["value"]


def power_case(post, na_hp, psi, **extra):
    body = dict({"na_power": f"{na_hp} hp", "boost": f"{psi} psi", "units": "imperial"}, **extra)
    r = post("power", body)
    assert r.status_code == 200, r.json
    return r.json


@pytest.mark.parametrize("na_hp, psi, measured, extra", [
    # Trade facts (common practice, no source): intercooled turbo 530 hp NA -> ~1050 hp at 14.6 psi
    (530, 14.6, 1050, {}),
    # non-intercooled turbo 350 hp NA -> ~510 hp at 8 psi (charge heat)
    (350, 8.0, 510, {"intercooler_effectiveness": 0}),
    # centrifugal blower 430 hp NA -> ~645 hp at 8.2 psi (blower drive power)
    (430, 8.2, 645, {"induction": "centrifugal"}),
])
def test_expected_power_matches_trade_cases_within_5_percent(post, na_hp, psi, measured, extra):
    body = power_case(post, na_hp, psi, **extra)
    assert body["expected_power"]["value"] == pytest.approx(measured, rel=0.05)
    assert body["expected_power"]["value"] <= body["ideal_power"]["value"]


def test_ideal_power_follows_the_pressure_ratio_rule(post):
    # one atmosphere doubles NA power; half an atmosphere adds 50 % (common practice, no source)
    assert power_case(post, 400, 14.695948775513)["ideal_power"]["value"] == pytest.approx(800, rel=1e-9)
    assert power_case(post, 400, 14.695948775513 / 2)["ideal_power"]["value"] == pytest.approx(600, rel=1e-9)
    # the ideal near 545 hp for 350 hp NA at 8 psi (common practice, no source)
    assert power_case(post, 350, 8)["ideal_power"]["value"] == pytest.approx(545, rel=0.01)


def test_blower_drive_power_is_the_gap_to_ideal(post):
    body = power_case(post, 430, 8.2, induction="centrifugal")
    assert body["drive_power"]["value"] > 20
    assert body["pumping_power"]["value"] > 0  # blower: exhaust at ambient, manifold above
    assert body["ideal_power"]["value"] / 430 - 1 == pytest.approx(0.56, abs=0.01)


def test_shortfall_ranks_causes_and_warns(post):
    body = power_case(post, 430, 8.2, induction="centrifugal", measured_power="480 hp")
    assert body["shortfall"] > 0.2
    codes = [c["code"] for c in body["causes"]]
    assert codes[-3:] == ["ignition_timing", "fuel_delivery", "boost_measurement"]
    modelled = [c["power"]["value"] for c in body["causes"][:-3]]
    assert modelled == sorted(modelled, reverse=True) and set(codes[:-3]) <= {"charge_heat", "drive_loss"}
    assert ("shortfall_large", "danger") in [(w["code"], w["severity"]) for w in body["warnings"]]
    assert "retard" in body["causes"][-3]["message"]


def test_above_ideal_is_flagged(post):
    body = power_case(post, 400, 10, measured_power="800 hp")
    assert body["shortfall"] < 0 and "above_ideal" in [w["code"] for w in body["warnings"]]


def test_boost_for_power_inverts_the_power_check(post):
    body = post("boost-for-power", {"na_power": "430 hp", "target_power": "645 hp", "induction": "centrifugal",
                                    "units": "si"}).json
    check = post("power", {"na_power": "430 hp", "induction": "centrifugal", "units": "si",
                           "boost": {"value": body["boost"]["value"], "unit": "Pa"}}).json
    assert check["expected_power"]["value"] == pytest.approx(645 * HP, rel=1e-9)
    assert body["expected_power"]["value"] == pytest.approx(645 * HP, rel=1e-9)
    # ideal closed form: (645/430 - 1) atm
    assert body["boost_ideal"]["value"] == pytest.approx(ATM * (645 / 430 - 1), rel=1e-12)


def test_boost_for_power_unreachable_and_below_na(post):
    far = post("boost-for-power", {"na_power": "300 hp", "target_power": "3000 hp"}).json
    assert far["boost"] is None and far["pressure_ratio"] is None and far["boost_ideal"] is not None
    assert "target_unreachable" in [w["code"] for w in far["warnings"]]
    low = post("boost-for-power", {"na_power": "300 hp", "target_power": "250 hp", "units": "si"}).json
    assert low["boost"]["value"] == 0 and low["boost_ideal"]["value"] == 0
    assert "target_below_na" in [w["code"] for w in low["warnings"]]


def test_boost_for_power_altitude_rows_need_more_boost_higher_up(post):
    body = post("boost-for-power", {"na_power": "300 hp", "target_power": "450 hp", "units": "si",
                                    "altitudes": ["0 m", "1500 m", "3000 m"]}).json
    boosts = [r["boost"]["value"] for r in body["altitude_table"]]
    assert boosts == sorted(boosts) and boosts[0] < boosts[-1]


def test_airflow_about_ten_hp_per_lb_min(post):
    # 0.50 lb/hp/h x 12.5 = 6.25 lb/h of air per hp: 9.6 hp per lb/min (trade rule ~10, common practice)
    body = post("airflow", {"power": "600 hp", "units": "imperial"}).json
    assert 600 / body["air_mass_flow"]["value"] == pytest.approx(9.6, abs=0.01)


def test_airflow_corrected_flow_and_volumetric_efficiency(post):
    body = post("airflow", {"power": "300 kW", "boost": "1 bar", "compressor_count": 2, "displacement": "3 L",
                            "rpm": 6500, "site": {"altitude": "1500 m"}, "units": "si"}).json
    m = body["air_mass_flow"]["value"]
    p1 = body["station_pressure"]["value"]
    T1 = 288.15 - 0.0065 * 1500 * 6356766 / (6356766 + 1500)
    # corrected flow per compressor = (m/2) sqrt(T1/288.15) / (P1/101325) (SAE J922 definition)
    assert body["corrected_air_flow"]["value"] == pytest.approx(m / 2 * math.sqrt(T1 / 288.15) / (p1 / ATM), rel=1e-9)
    assert 0.5 < body["volumetric_efficiency"] < 1.3
    assert body["assumptions"]["reference_pressure"]["value"] == ATM


def test_injector_sizing_with_rated_pressure_scaling(post):
    # 500 hp x 0.60 lb/hp/h / (8 x 0.80) = 46.875 lb/h at 3 bar (common practice worked example)
    body = post("injectors", {"power": "500 hp", "boost": "1 bar", "injector_count": 8, "units": "imperial"}).json
    assert body["flow_per_injector"]["value"] == pytest.approx(46.875, rel=1e-9)
    rated4 = post("injectors", {"power": "500 hp", "boost": "1 bar", "injector_count": 8, "units": "imperial",
                                "rated_pressure": "4 bar"}).json
    # orifice equation: the rating at 4 bar is sqrt(4/3) times the flow at 3 bar
    assert rated4["flow_per_injector"]["value"] == pytest.approx(46.875 * math.sqrt(4 / 3), rel=1e-9)


def test_injector_duty_and_limit_of_a_given_injector(post):
    body = post("injectors", {"power": "500 hp", "boost": "1 bar", "injector_count": 4,
                              "injector_flow": "60 lb/h", "units": "imperial"}).json
    assert body["duty_at_power"] == pytest.approx(500 * 0.6 / (4 * 60), rel=1e-9)
    assert body["max_power"]["value"] == pytest.approx(4 * 60 * 0.8 / 0.6, rel=1e-9)
    codes = {(w["code"], w["severity"]) for w in body["warnings"]}
    assert ("duty_cycle_high", "danger") in codes and ("injector_too_small", "caution") in codes


def test_fixed_regulator_at_base_pressure_cannot_inject(post):
    body = post("injectors", {"power": "400 hp", "boost": "3 bar", "injector_count": 6, "regulator": "fixed",
                              "injector_flow": "500 cc/min"}).json
    assert body["flow_per_injector"] is None and body["duty_at_power"] is None
    assert body["max_power"]["value"] == 0 and body["total_fuel_flow"] is not None
    assert ("pressure_difference_low", "danger") == (body["warnings"][0]["code"], body["warnings"][0]["severity"])


def test_boost_is_required_for_a_boosted_engine(post):
    r = post("injectors", {"power": "400 hp", "injector_count": 6})
    assert r.status_code == 400 and r.json["error"]["fields"][0]["field"] == "boost"
    assert post("injectors", {"power": "200 hp", "injector_count": 4, "induction": "na"}).status_code == 200


def test_fuel_pump_flow_pressure_and_curve(post):
    curve = [{"pressure": "3 bar", "flow": "300 L/h"}, {"pressure": "5 bar", "flow": "250 L/h"}]
    body = post("fuel-pump", {"power": "500 hp", "boost": "1 bar", "pump_curve": curve, "units": "si"}).json
    assert body["required_pressure"]["value"] == pytest.approx(4e5)
    assert body["available_flow"]["value"] * 3.6e6 == pytest.approx(275, rel=1e-9)  # halfway on the curve
    need = 500 * HP * 0.6 * LB / (HP * 3600) / 745.0  # m^3/s without margin
    assert body["required_flow"]["value"] == pytest.approx(need * 1.2, rel=1e-9)
    assert body["margin_available"] == pytest.approx(275 / 3.6e6 / need - 1, rel=1e-9)
    assert "pump_voltage" in [w["code"] for w in body["warnings"]]


def test_pump_curve_extrapolation_is_flagged_and_never_negative(post):
    curve = [{"pressure": "2 bar", "flow": "100 L/h"}, {"pressure": "3 bar", "flow": "50 L/h"}]
    body = post("fuel-pump", {"power": "500 hp", "boost": "2 bar", "pump_curve": curve, "units": "si"}).json
    assert body["available_flow"]["value"] == 0
    assert ("pump_margin_low", "danger") in [(w["code"], w["severity"]) for w in body["warnings"]]
    assert "pump_curve_extrapolated" in [w["code"] for w in body["warnings"]]


def test_e85_needs_more_fuel_than_gasoline(post):
    gas = post("injectors", {"power": "400 hp", "boost": "1 bar", "injector_count": 6, "units": "si"}).json
    e85 = post("injectors", {"power": "400 hp", "boost": "1 bar", "injector_count": 6, "fuel": "e85",
                             "units": "si"}).json
    # blend rule: AFR 9.814 for E85, so 14.7 / 9.814 times the fuel mass
    assert e85["total_fuel_flow"]["value"] / gas["total_fuel_flow"]["value"] == pytest.approx(14.7 / 9.814, rel=1e-3)
    assert "ethanol_compatibility" in [w["code"] for w in e85["warnings"]]
