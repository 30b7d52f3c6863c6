// Boost & pressure ratio, power check and boost target (SPEC sections 3 and 4).
// mirrors webcalc/calc/boost.py; altitude tables loop per row (the Python side
// vectorises them with numpy, element by element the same formulas).

import * as atmosphere from '../engine/atmosphere.js';
import * as compressor from '../engine/compressor.js';
import * as fuel from '../engine/fuel.js';
import * as power from '../engine/power.js';
import { P_SEA_LEVEL } from '../engine/constants.js';
import { BELT_DRIVEN, BOOST_CONTROLS } from '../engine/compressor.js';
import { SEVERITY_ORDER, WARNING_ORDER } from '../offline/messages.js';
import { InputError, Result, has, option, powerScale, resolveFuel, resolveSite } from './common.js';
import { air } from './site.js';
import engineData from '../../generated/engine.js';

/** Manifold temperature limits for warnings, [K]: 60 and 80 degC (common practice, from memory). */
export const CHARGE_CAUTION = engineData.thresholds.charge_caution;
export const CHARGE_DANGER = engineData.thresholds.charge_danger;
/** Shortfall thresholds and the above-ideal margin (common practice, from memory). */
export const SHORTFALL_CAUTION = engineData.thresholds.shortfall_caution;
export const SHORTFALL_DANGER = engineData.thresholds.shortfall_danger;
export const ABOVE_IDEAL = engineData.thresholds.above_ideal;

const STATE = {
  station_pressure: 'abs_pressure',
  boost_here: 'gauge_pressure',
  manifold_pressure: 'abs_pressure',
  pressure_ratio: null,
  compressor_inlet_pressure: 'abs_pressure',
  compressor_outlet_pressure: 'abs_pressure',
  compressor_outlet_temperature: 'temperature',
  manifold_temperature: 'temperature',
};
const controlCells = (extra) => Object.fromEntries(BOOST_CONTROLS.map((c) => [c, { boost_here: 'gauge_pressure', pressure_ratio: null, ...extra, warnings: null }]));
/** mirrors PRESSURE_RATIO_OUTPUTS */
export const PRESSURE_RATIO_OUTPUTS = Object.freeze({
  ...STATE,
  sea_level_boost: 'gauge_pressure',
  altitude_table: { altitude: 'elevation', station_pressure: 'abs_pressure', ...controlCells({}) },
});
/** mirrors POWER_OUTPUTS */
export const POWER_OUTPUTS = Object.freeze({
  ...STATE,
  air_mass_flow: 'air_mass_flow',
  ideal_power: 'power',
  expected_power: 'power',
  drive_power: 'power',
  pumping_power: 'power',
  measured_power: 'power',
  shortfall: null,
  causes: { code: null, message: null, power: 'power' },
  altitude_table: { altitude: 'elevation', station_pressure: 'abs_pressure', ...controlCells({ expected_power: 'power' }) },
});
/** mirrors BOOST_FOR_POWER_OUTPUTS */
export const BOOST_FOR_POWER_OUTPUTS = Object.freeze({
  station_pressure: 'abs_pressure',
  boost_ideal: 'gauge_pressure',
  boost: 'gauge_pressure',
  manifold_pressure: 'abs_pressure',
  pressure_ratio: null,
  manifold_temperature: 'temperature',
  expected_power: 'power',
  max_expected_power: 'power',
  altitude_table: {
    altitude: 'elevation', station_pressure: 'abs_pressure', boost_ideal: 'gauge_pressure', boost: 'gauge_pressure', pressure_ratio: null,
  },
});

/** Compressor and intercooler options with their defaults (recorded as assumptions). mirrors `compressor_setup` */
export function compressorSetup(inp, site, result) {
  const induction = option(inp, 'induction', 'turbo', result);
  const setup = {
    induction,
    inlet_loss: option(inp, 'inlet_loss', 0.0, result, null, 'gauge_pressure'),
    intercooler_loss: option(inp, 'intercooler_loss', 0.0, result, null, 'gauge_pressure'),
    efficiency: option(inp, 'compressor_efficiency', compressor.DEFAULT_EFFICIENCY[induction], result),
    effectiveness: option(inp, 'intercooler_effectiveness', compressor.DEFAULT_INTERCOOLER_EFFECTIVENESS, result),
    max_pressure_ratio: option(inp, 'max_pressure_ratio', compressor.DEFAULT_MAX_PRESSURE_RATIO[induction], result),
    coolant: has(inp, 'coolant_temperature') ? inp.coolant_temperature : null,
  };
  if (setup.coolant === null) result.assume('coolant_temperature', site.temperature, 'temperature');
  return setup;
}

/** A compressor inlet pressure at or below zero is the inlet loss's fault. mirrors `check_inlet` */
export function checkInlet(pBaro, setup) {
  if (pBaro - setup.inlet_loss <= 0) throw new InputError('inlet_loss', 'pressure_not_positive');
}

/** Warnings of one operating point, as [code, severity] appended to `codes`. mirrors `state_warnings` */
export function stateWarnings(ratio, Tm, boost, setup, codes) {
  if (ratio > setup.max_pressure_ratio) codes.push(['pressure_ratio_high', 'danger']);
  else if (ratio > compressor.CAUTION_PRESSURE_RATIO[setup.induction]) codes.push(['pressure_ratio_high', 'caution']);
  if (Tm > CHARGE_DANGER) codes.push(['charge_temperature_high', 'danger']);
  else if (Tm > CHARGE_CAUTION) codes.push(['charge_temperature_high', 'caution']);
  if (boost > 0 && setup.effectiveness === 0) codes.push(['no_intercooler', 'info']);
}

/** mirrors `higher_here` */
export function higherHere(boostHere, boostSet) {
  return boostHere > boostSet * (1.0 + 1e-12) + 1e-9;
}

/** [T2, Tm] at a pressure ratio; a defaulted coolant follows T1 (or `coolant`). mirrors `temperatures` */
export function temperatures(T1, ratio, setup, coolant = null) {
  const T2 = compressor.outletTemperature(T1, ratio, setup.efficiency);
  const c = setup.coolant !== null ? setup.coolant : (coolant === null ? T1 : coolant);
  return [T2, compressor.intercoolerOutletTemperature(T2, c, setup.effectiveness)];
}

/** Boost here: the input boost, or carried from `boost_set_at` by its control style. mirrors `boost_at_site` */
export function boostAtSite(inp, site, setup, result) {
  const boost = inp.boost;
  if (!has(inp, 'boost_set_at')) return [boost, null];
  const ref = resolveSite(inp.boost_set_at.site, result, 'boost_set_at.site');
  checkInlet(ref.pressure, setup);
  const here = compressor.boostHere(inp.boost_set_at.control, boost, ref.pressure, site.pressure,
    setup.inlet_loss, setup.intercooler_loss);
  if (higherHere(here, boost)) result.warn('boost_higher_here', 'caution');
  return [here, ref];
}

/** The operating point's pressures, temperatures and warnings into `result`. mirrors `fill_state` */
export function fillState(result, site, boostHere, hasSetAt, setup) {
  const [mapAbs, p1, p2, ratio] = compressor.pressures(site.pressure, boostHere, setup.inlet_loss, setup.intercooler_loss);
  const [T2, Tm] = temperatures(site.temperature, ratio, setup);
  Object.assign(result.values, {
    station_pressure: site.pressure,
    boost_here: hasSetAt ? boostHere : null,
    manifold_pressure: mapAbs,
    pressure_ratio: ratio,
    compressor_inlet_pressure: p1,
    compressor_outlet_pressure: p2,
    compressor_outlet_temperature: T2,
    manifold_temperature: Tm,
  });
  const codes = [];
  stateWarnings(ratio, Tm, boostHere, setup, codes);
  for (const [code, severity] of codes) result.warn(code, severity);
  return [mapAbs, ratio, T2, Tm];
}

/** Codes of [code, severity] pairs, danger first, then in the warning table's order. mirrors `sort_codes` */
export function sortCodes(codes) {
  const seen = new Set();
  const unique = [];
  for (const [code, severity] of codes) {
    const key = `${code}/${severity}`;
    if (!seen.has(key)) {
      seen.add(key);
      unique.push([code, severity]);
    }
  }
  unique.sort((a, b) => SEVERITY_ORDER.indexOf(a[1]) - SEVERITY_ORDER.indexOf(b[1])
    || WARNING_ORDER.indexOf(a[0]) - WARNING_ORDER.indexOf(b[0]));
  return [...new Set(unique.map(([code]) => code))];
}

/** Pressure and temperature at each altitude of the table, carried from `ref`. mirrors `row_weather` */
export function rowWeather(inp, ref, setup) {
  const h = [...inp.altitudes];
  const p = [];
  const T = [];
  for (const hi of h) {
    const [pi, Ti] = atmosphere.carryWeather(hi, ref.altitude, ref.pressure, ref.temperature);
    p.push(pi);
    T.push(Ti);
  }
  checkInlet(p.reduce((a, b) => Math.min(a, b)), setup);
  return [h, p, T];
}

/** Altitude table rows: per control style boost here, pressure ratio (and expected power). mirrors `control_table` */
export function controlTable(inp, ref, boostSet, setup, expected = null) {
  const [h, p, T] = rowWeather(inp, ref, setup);
  const rows = [];
  for (let i = 0; i < h.length; i += 1) {
    const row = { altitude: h[i], station_pressure: p[i] };
    for (const control of BOOST_CONTROLS) {
      const bh = compressor.boostHere(control, boostSet, ref.pressure, p[i], setup.inlet_loss, setup.intercooler_loss);
      const ratio = compressor.pressures(p[i], bh, setup.inlet_loss, setup.intercooler_loss)[3];
      const Tm = temperatures(T[i], ratio, setup)[1];
      const codes = [];
      stateWarnings(ratio, Tm, bh, setup, codes);
      if (higherHere(bh, boostSet)) codes.push(['boost_higher_here', 'caution']);
      const cell = { boost_here: bh, pressure_ratio: ratio };
      if (expected !== null) cell.expected_power = expected(bh, p[i], T[i]);
      cell.warnings = sortCodes(codes);
      row[control] = cell;
    }
    rows.push(row);
  }
  return rows;
}

/** The `pressure-ratio` endpoint. mirrors `pressure_ratio` */
export function pressureRatio(inp) {
  const result = new Result();
  const site = resolveSite(inp.site, result);
  const setup = compressorSetup(inp, site, result);
  checkInlet(site.pressure, setup);
  const [boostHere, ref] = boostAtSite(inp, site, setup, result);
  const mapAbs = fillState(result, site, boostHere, ref !== null, setup)[0];
  result.values.sea_level_boost = mapAbs - P_SEA_LEVEL;
  if (has(inp, 'altitudes')) result.values.altitude_table = controlTable(inp, ref || site, inp.boost, setup);
  return result;
}

/** The NA run: observed crank power, its site, and its air flow (SPEC section 4). mirrors `na_reference` */
export function naReference(inp, site, setup, result) {
  const scale = powerScale(inp, result);
  const naSite = has(inp, 'na_site') ? resolveSite(inp.na_site, result, 'na_site') : site;
  let naPower = inp.na_power * scale;
  if ((has(inp, 'na_power_basis') ? inp.na_power_basis : 'observed') === 'sae_j1349') {
    naPower /= air(naSite, new Result())[2];
  }
  const props = resolveFuel(inp, result);
  const [bsfcDefault, afrDefault] = fuel.naAirDefaults(props.afr);
  const bsfc = option(inp, 'bsfc', bsfcDefault, result, null, 'bsfc');
  const afr = option(inp, 'afr', afrDefault, result);
  if (!(afr / props.afr >= 0.6 && afr / props.afr <= 1.2)) result.warn('afr_implausible', 'caution');
  const belt = BELT_DRIVEN.includes(setup.induction);
  let driveEfficiency = 1.0;
  if (belt) driveEfficiency = option(inp, 'drive_efficiency', compressor.DEFAULT_DRIVE_EFFICIENCY, result);
  return {
    naPower,
    pNa: naSite.pressure,
    TNa: naSite.temperature,
    naAirMassFlow: naPower * bsfc * afr,
    beltDriven: belt,
    driveEfficiency,
  };
}

/** Exhaust gauge pressure per unit boost: given, fixed by a back pressure at the boost, or default. mirrors `exhaust_ratio` */
export function exhaustRatio(inp, setup, result) {
  if (has(inp, 'exhaust_back_pressure')) {
    if (has(inp, 'exhaust_to_boost_ratio')) {
      throw new InputError('exhaust_back_pressure', 'both_given', { other: 'exhaust_to_boost_ratio' });
    }
    const ebp = inp.exhaust_back_pressure;
    if (ebp === 0) return 0.0;
    if (inp.boost <= 0) throw new InputError('exhaust_back_pressure', 'ebp_needs_boost');
    return ebp / inp.boost;
  }
  const defaultValue = BELT_DRIVEN.includes(setup.induction) ? 0.0 : 1.0;
  return option(inp, 'exhaust_to_boost_ratio', defaultValue, result);
}

/** Expected power as a function of (boost, station pressure, temperature). mirrors `model` */
export function model(na, setup, ratioExhaust) {
  return (boost, pBaro, T1) => power.expectedPower(boost, {
    pBaro,
    T1,
    inletLoss: setup.inlet_loss,
    intercoolerLoss: setup.intercooler_loss,
    efficiency: setup.efficiency,
    effectiveness: setup.effectiveness,
    TCoolant: setup.coolant !== null ? setup.coolant : T1,
    exhaustRatio: ratioExhaust,
    ...na,
  });
}

/** The `power` endpoint. mirrors `power_check` */
export function powerCheck(inp) {
  const result = new Result();
  const site = resolveSite(inp.site, result);
  const setup = compressorSetup(inp, site, result);
  checkInlet(site.pressure, setup);
  const na = naReference(inp, site, setup, result);
  const stateOf = model(na, setup, exhaustRatio(inp, setup, result));
  const [boostHere, ref] = boostAtSite(inp, site, setup, result);
  fillState(result, site, boostHere, ref !== null, setup);
  const s = stateOf(boostHere, site.pressure, site.temperature);
  Object.assign(result.values, {
    air_mass_flow: s.airMassFlow,
    ideal_power: s.ideal,
    expected_power: s.expected,
    drive_power: s.drive,
    pumping_power: s.pumping,
    measured_power: null,
    shortfall: null,
    causes: null,
  });
  if (has(inp, 'measured_power')) judgeMeasured(inp, site, s, result);
  if (has(inp, 'altitudes')) {
    result.values.altitude_table = controlTable(inp, ref || site, inp.boost, setup, (bh, p, T) => stateOf(bh, p, T).expected);
  }
  return result;
}

/** Shortfall against expected, its warnings and the ranked causes (SPEC section 5). mirrors `judge_measured` */
export function judgeMeasured(inp, site, s, result) {
  let measured = inp.measured_power * result.powerScale;
  if ((has(inp, 'measured_power_basis') ? inp.measured_power_basis : 'observed') === 'sae_j1349') {
    measured /= air(site, new Result())[2];
    result.warn('correction_boosted', 'info');
  }
  // Python raises ZeroDivisionError (or numpy gives inf) for an expected power of 0: either
  // way the shortfall is not finite and the response is the not_finite 400.
  const shortfall = 1.0 - measured / s.expected;
  Object.assign(result.values, { measured_power: measured, shortfall });
  if (shortfall > SHORTFALL_DANGER) result.warn('shortfall_large', 'danger');
  else if (shortfall > SHORTFALL_CAUTION) result.warn('shortfall_large', 'caution');
  if (measured > s.ideal * (1.0 + ABOVE_IDEAL)) result.warn('above_ideal', 'caution');
  if (shortfall > 0) {
    const modelled = [['charge_heat', s.ideal - s.gross], ['drive_loss', s.drive],
      ['exhaust_back_pressure', Math.max(0.0, -s.pumping)]];
    // Python: sorted(..., key=lambda c: -c[1]), a stable sort, largest first
    const ranked = modelled.filter((c) => c[1] > 0).sort((a, b) => (-a[1]) - (-b[1]));
    const generic = [['ignition_timing', null], ['fuel_delivery', null], ['boost_measurement', null]];
    result.values.causes = [...ranked, ...generic].map(([code, value]) => ({ code, power: value }));
  }
}

/** Ideal and expected boost for a target at one site (the binding algorithm). mirrors `solve` */
export function solve(target, na, setup, ratioExhaust, pBaro, T1) {
  const stateOf = model(na, setup, ratioExhaust);
  const boostIdeal = power.boostForIdealPower(target, na.naPower, na.pNa, pBaro);
  const p1 = pBaro - setup.inlet_loss;
  const boostMax = compressor.highestBoost(setup.max_pressure_ratio, p1, setup.intercooler_loss, pBaro);
  let [boost, maxExpected] = power.boostForExpectedPower(target, boostMax, (b) => stateOf(b, pBaro, T1).expected);
  const atZero = stateOf(0.0, pBaro, T1).expected;
  const below = target <= atZero;
  if (below) boost = 0.0;
  return [boostIdeal, boost, maxExpected, below, stateOf];
}

/** The `boost-for-power` endpoint. mirrors `boost_for_power` */
export function boostForPower(inp) {
  const result = new Result();
  const site = resolveSite(inp.site, result);
  const setup = compressorSetup(inp, site, result);
  checkInlet(site.pressure, setup);
  const na = naReference(inp, site, setup, result);
  const ratioExhaust = exhaustRatio(inp, setup, result);
  const target = inp.target_power * result.powerScale;
  const [boostIdeal, boost, maxExpected, below, stateOf] = solve(target, na, setup, ratioExhaust, site.pressure, site.temperature);
  Object.assign(result.values, {
    station_pressure: site.pressure,
    boost_ideal: boostIdeal,
    boost,
    max_expected_power: maxExpected,
    manifold_pressure: null,
    pressure_ratio: null,
    manifold_temperature: null,
    expected_power: null,
  });
  if (below) result.warn('target_below_na', 'info');
  if (boost === null) {
    result.warn('target_unreachable', 'caution');
  } else {
    const [mapAbs, ratio, , Tm] = fillState(new Result(), site, boost, false, setup);
    const codes = [];
    stateWarnings(ratio, Tm, boost, setup, codes);
    for (const [code, severity] of codes) result.warn(code, severity);
    Object.assign(result.values, {
      manifold_pressure: mapAbs,
      pressure_ratio: ratio,
      manifold_temperature: Tm,
      expected_power: stateOf(boost, site.pressure, site.temperature).expected,
    });
  }
  if (has(inp, 'altitudes')) {
    const [h, p, T] = rowWeather(inp, site, setup);
    const rows = [];
    for (let i = 0; i < h.length; i += 1) {
      const [bi, b] = solve(target, na, setup, ratioExhaust, p[i], T[i]);
      const ratio = b === null ? null : compressor.pressures(p[i], b, setup.inlet_loss, setup.intercooler_loss)[3];
      rows.push({ altitude: h[i], station_pressure: p[i], boost_ideal: bi, boost: b, pressure_ratio: ratio });
    }
    result.values.altitude_table = rows;
  }
  return result;
}
