// Fuels, blends, BSFC defaults, injector sizing and fuel-pump flow.
// mirrors webcalc/engine/fuel.py (same names in camelCase, same argument order).
//
// Fuel mass flows in [kg/s], volume flows in [m^3/s], densities in [kg/m^3], BSFC in
// [kg/J], pressures in [Pa] (fuel pressures are gauge or differences).

import { LB_PER_HP_H, deepFreeze } from './constants.js';

/**
 * Binding fuel table: density [kg/m^3] and stoichiometric air-fuel ratio by mass [-].
 * gasoline: common practice; Heywood, ICE Fundamentals, App. D (from memory).
 * ethanol, methanol: CRC Handbook densities at 20 degC (from memory); stoichiometry of
 * C2H5OH (9.0) and CH3OH (6.47).
 * mirrors webcalc/engine/fuel.py FUELS
 */
export const FUELS = deepFreeze({
  gasoline: { density: 745.0, afr: 14.7 },
  ethanol: { density: 789.0, afr: 9.0 },
  methanol: { density: 791.0, afr: 6.47 },
});
/** E85: 85 % ethanol by volume in gasoline (the blend rule computes density and AFR). */
export const E85_ETHANOL = 0.85;
/** mirrors webcalc/engine/fuel.py FUEL_NAMES */
export const FUEL_NAMES = deepFreeze(['gasoline', 'ethanol', 'methanol', 'e85']);
/** Fuels that take an ethanol content. mirrors webcalc/engine/fuel.py BLENDABLE */
export const BLENDABLE = deepFreeze(['gasoline', 'e85']);

/**
 * NA air per power: gasoline at 0.50 lb/hp/h and AFR 12.5 (common practice, from memory):
 * about 9.6 hp per lb/min of air, close to the trade's 10.
 */
export const NA_BSFC_GASOLINE = 0.50 * LB_PER_HP_H;
export const NA_AFR_GASOLINE = 12.5;
/**
 * Default BSFC for fuel-system sizing, gasoline, by induction, [kg/J] (common practice,
 * from memory). mirrors webcalc/engine/fuel.py SIZING_BSFC_GASOLINE
 */
export const SIZING_BSFC_GASOLINE = deepFreeze({
  na: 0.50 * LB_PER_HP_H,
  turbo: 0.60 * LB_PER_HP_H,
  centrifugal: 0.65 * LB_PER_HP_H,
  roots: 0.65 * LB_PER_HP_H,
  twin_screw: 0.65 * LB_PER_HP_H,
});
export const DEFAULT_MAX_DUTY = 0.80; // common practice, from memory
export const DEFAULT_FUEL_PRESSURE = 3e5; // Pa, 3 bar (common practice for port injection)
export const DEFAULT_PUMP_MARGIN = 0.20; // common practice, from memory

/** Hard validity ranges, SI. mirrors webcalc/engine/fuel.py VALID */
export const VALID = deepFreeze({
  bsfc: [0.2 * LB_PER_HP_H, 2.0 * LB_PER_HP_H], // kg/J
  afr: [3.0, 25.0],
  lambda: [0.5, 1.5],
  injector_count: [1, 64],
  pump_count: [1, 16],
  duty: [0.0, 1.0], // exclusive at 0
  margin: [0.0, 1.0],
  fuel_pressure: [0.5e5, 10e5], // Pa
  fuel_density: [600.0, 1000.0], // kg/m^3
  ethanol_content: [0.0, 1.0],
});

function tableEntry(table, key, what) {
  if (!Object.prototype.hasOwnProperty.call(table, key)) {
    throw new RangeError(`unknown ${what}: ${String(key)}`);
  }
  return table[key];
}

/**
 * Density and stoichiometric AFR of an ethanol-gasoline blend (blend rule, ideal mixing):
 * `w = x rho_e / (x rho_e + (1 - x) rho_g)`; `AFR = w AFR_e + (1 - w) AFR_g`;
 * `rho = x rho_e + (1 - x) rho_g`. Mirrors `blend`.
 * @param {number} ethanolContent ethanol by volume, [-] 0..1
 * @param {{density: number, afr: number}} [gasoline=FUELS.gasoline]
 * @param {{density: number, afr: number}} [ethanol=FUELS.ethanol]
 * @returns {[number, number]} [density [kg/m^3], stoichiometric AFR [-]]
 */
export function blend(ethanolContent, gasoline = FUELS.gasoline, ethanol = FUELS.ethanol) {
  const x = ethanolContent;
  const massE = x * ethanol.density;
  const massG = (1.0 - x) * gasoline.density;
  const w = massE / (massE + massG);
  const afr = w * ethanol.afr + (1.0 - w) * gasoline.afr;
  return [massE + massG, afr];
}

/**
 * Density [kg/m^3] and stoichiometric AFR [-] of a fuel of the table, blends included:
 * `e85`, or any fuel with an ethanol content, goes through the blend rule (as in Python).
 * Mirrors `fuel_properties`.
 * @param {string} [fuel='gasoline'] one of FUEL_NAMES
 * @param {?number} [ethanolContent=null] ethanol by volume, [-]
 * @returns {[number, number]} [density, AFR]
 * @throws {RangeError} for a fuel outside the table (Python raises KeyError)
 */
export function fuelProperties(fuel = 'gasoline', ethanolContent = null) {
  const hasContent = ethanolContent !== null && ethanolContent !== undefined;
  if (fuel === 'e85' || hasContent) {
    return blend(hasContent ? ethanolContent : E85_ETHANOL);
  }
  const props = tableEntry(FUELS, fuel, 'fuel');
  return [props.density, props.afr];
}

/**
 * Default NA BSFC [kg/J] and AFR [-] for a fuel: same lambda and air per power as
 * gasoline at 0.50 lb/hp/h and 12.5 (common practice, from memory); scale `14.7 / AFR_st`.
 * Mirrors `na_air_defaults`.
 * @param {number} afrStoich stoichiometric AFR of the fuel, [-]
 * @returns {[number, number]} [bsfc [kg/J], afr [-]]
 */
export function naAirDefaults(afrStoich) {
  const scale = FUELS.gasoline.afr / afrStoich;
  return [NA_BSFC_GASOLINE * scale, NA_AFR_GASOLINE / scale];
}

/**
 * Default BSFC for injector and pump sizing, [kg/J] (common practice, from memory):
 * gasoline value by induction times `14.7 / AFR_st`. Mirrors `sizing_bsfc`.
 * @param {string} induction `na` or one of the compressor INDUCTIONS
 * @param {number} afrStoich stoichiometric AFR of the fuel, [-]
 * @returns {number} bsfc, [kg/J]
 * @throws {RangeError} for an unknown induction (Python raises KeyError)
 */
export function sizingBsfc(induction, afrStoich) {
  return tableEntry(SIZING_BSFC_GASOLINE, induction, 'induction') * FUELS.gasoline.afr / afrStoich;
}

/**
 * Fuel mass flow `m_f = P bsfc` (definition of BSFC). Mirrors `fuel_mass_flow`.
 * @param {number} power [W]
 * @param {number} bsfc [kg/J]
 * @returns {number} [kg/s]
 */
export function fuelMassFlow(power, bsfc) {
  return power * bsfc;
}

/**
 * Pressure across the injector: `fixed` regulator `base - boost`; otherwise (boost
 * referenced) `base`. Mirrors `injector_pressure_difference`.
 * @param {number} basePressure rail pressure at zero boost, gauge, [Pa]
 * @param {number} boostGauge [Pa]
 * @param {string} regulator `boost_referenced` or `fixed`
 * @returns {number} [Pa]
 */
export function injectorPressureDifference(basePressure, boostGauge, regulator) {
  if (regulator === 'fixed') return basePressure - boostGauge;
  return basePressure;
}

/**
 * Flow ratio of an injector between two pressure differences (orifice equation, ISO
 * 5167-1 with constant discharge coefficient): `Q_to / Q_from = sqrt(dp_to / dp_from)`.
 * Mirrors `orifice_scale`.
 * @param {number} pTo [Pa]
 * @param {number} pFrom [Pa]
 * @returns {number} [-]
 */
export function orificeScale(pTo, pFrom) {
  return Math.sqrt(pTo / pFrom);
}

/**
 * Static flow each injector must deliver at its operating pressure:
 * `m_inj = P bsfc / (n duty_max)`. Mirrors `injector_flow_needed`.
 * @param {number} power [W]
 * @param {number} bsfc [kg/J]
 * @param {number} count number of injectors
 * @param {number} maxDuty [-]
 * @returns {number} [kg/s]
 */
export function injectorFlowNeeded(power, bsfc, count, maxDuty) {
  return power * bsfc / (count * maxDuty);
}

/**
 * Duty cycle of `count` injectors each flowing `flowAtOperating` (raw, may exceed 1):
 * `duty = P bsfc / (n m_inj)`. Mirrors `injector_duty`.
 * @param {number} power [W]
 * @param {number} bsfc [kg/J]
 * @param {number} count
 * @param {number} flowAtOperating [kg/s]
 * @returns {number} [-]
 */
export function injectorDuty(power, bsfc, count, flowAtOperating) {
  return power * bsfc / (count * flowAtOperating);
}

/**
 * Power that `count` injectors feed at `maxDuty`: `P = m_inj n duty_max / bsfc`.
 * Mirrors `injector_max_power`.
 * @param {number} flowAtOperating [kg/s]
 * @param {number} count
 * @param {number} maxDuty [-]
 * @param {number} bsfc [kg/J]
 * @returns {number} [W]
 */
export function injectorMaxPower(flowAtOperating, count, maxDuty, bsfc) {
  return flowAtOperating * count * maxDuty / bsfc;
}

/**
 * Volume-flow ratio of fuel to the test fluid of a rating (orifice equation):
 * `Q_fuel / Q_test = sqrt(rho_test / rho_fuel)`. Mirrors `rating_fluid_scale`.
 * @param {number} rhoFuel [kg/m^3]
 * @param {number} rhoTest [kg/m^3]
 * @returns {number} [-]
 */
export function ratingFluidScale(rhoFuel, rhoTest) {
  return Math.sqrt(rhoTest / rhoFuel);
}

/**
 * Pump outlet pressure needed, gauge: base (+ boost when `boost_referenced`) + line loss.
 * Mirrors `pump_required_pressure` (any other regulator value adds no boost, as in Python).
 * @param {number} basePressure [Pa]
 * @param {number} boostGauge [Pa]
 * @param {string} regulator `boost_referenced` or `fixed`
 * @param {number} [lineLoss=0] [Pa]
 * @returns {number} [Pa]
 */
export function pumpRequiredPressure(basePressure, boostGauge, regulator, lineLoss = 0.0) {
  const boostPart = regulator === 'boost_referenced' ? boostGauge : 0.0;
  return basePressure + boostPart + lineLoss;
}

/**
 * Total fuel volume flow needed including margin: `P bsfc (1 + margin) / rho`.
 * Mirrors `pump_required_flow`.
 * @param {number} power [W]
 * @param {number} bsfc [kg/J]
 * @param {number} density [kg/m^3]
 * @param {number} margin [-]
 * @returns {number} [m^3/s]
 */
export function pumpRequiredFlow(power, bsfc, density, margin) {
  return power * bsfc * (1.0 + margin) / density;
}

/**
 * Flow of a pump at a pressure from its data-sheet curve (piecewise linear, as
 * `numpy.interp` inside; outside, linear extrapolation from the two nearest points),
 * never below 0. Mirrors `pump_curve_flow`.
 * @param {number[]} curvePressure outlet pressures, gauge, strictly increasing, [Pa]
 * @param {number[]} curveFlow flows at those pressures, [m^3/s]
 * @param {number} pressure pressure to evaluate, [Pa]
 * @returns {[number, boolean]} [flow [m^3/s], extrapolated]
 */
export function pumpCurveFlow(curvePressure, curveFlow, pressure) {
  const xp = curvePressure;
  const fp = curveFlow;
  const n = xp.length;
  if (n < 2 || fp.length !== n) {
    throw new RangeError('a pump curve needs at least 2 points, pressures and flows alike');
  }
  const x = pressure;
  let flow;
  if (x < xp[0]) {
    const loSlope = (fp[1] - fp[0]) / (xp[1] - xp[0]);
    flow = fp[0] + loSlope * (x - xp[0]);
  } else if (x > xp[n - 1]) {
    const hiSlope = (fp[n - 1] - fp[n - 2]) / (xp[n - 1] - xp[n - 2]);
    flow = fp[n - 1] + hiSlope * (x - xp[n - 1]);
  } else {
    flow = interp(x, xp, fp);
  }
  return [Math.max(flow, 0.0), x < xp[0] || x > xp[n - 1]];
}

/**
 * `numpy.interp(x, xp, fp)` for one x inside [xp[0], xp[n-1]] (or NaN), with numpy's
 * arithmetic: `slope (x - xp[j]) + fp[j]`, `slope = (fp[j+1] - fp[j]) / (xp[j+1] - xp[j])`.
 */
function interp(x, xp, fp) {
  const n = xp.length;
  if (Number.isNaN(x)) return x;
  if (x >= xp[n - 1]) return fp[n - 1];
  let lo = 0;
  let hi = n - 1; // invariant: xp[lo] <= x < xp[hi]
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (x < xp[mid]) hi = mid;
    else lo = mid;
  }
  const j = lo;
  if (xp[j] === x) return fp[j];
  const slope = (fp[j + 1] - fp[j]) / (xp[j + 1] - xp[j]);
  let y = slope * (x - xp[j]) + fp[j];
  if (Number.isNaN(y)) {
    y = slope * (x - xp[j + 1]) + fp[j + 1];
    if (Number.isNaN(y) && fp[j] === fp[j + 1]) y = fp[j];
  }
  return y;
}
