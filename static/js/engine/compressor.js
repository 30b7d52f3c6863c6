// Compressor side: pressures, pressure ratio, outlet and manifold temperature, drive power.
// mirrors webcalc/engine/compressor.py (same names in camelCase, same argument order).
//
// Pressures are absolute unless the parameter says "gauge" or "loss" (a difference).

import { CP_AIR, GAMMA_AIR, deepFreeze } from './constants.js';

/** Induction types. mirrors webcalc/engine/compressor.py INDUCTIONS */
export const INDUCTIONS = deepFreeze(['turbo', 'centrifugal', 'roots', 'twin_screw']);
/** Belt-driven types whose compressor power comes off the crank. mirrors BELT_DRIVEN */
export const BELT_DRIVEN = deepFreeze(['centrifugal', 'roots', 'twin_screw']);

/**
 * Default isentropic efficiency by induction (common practice, from memory).
 * mirrors webcalc/engine/compressor.py DEFAULT_EFFICIENCY
 */
export const DEFAULT_EFFICIENCY = deepFreeze({ turbo: 0.72, centrifugal: 0.70, twin_screw: 0.65, roots: 0.55 });
/**
 * Default highest pressure ratio a compressor of each type is asked for (common practice,
 * from memory). mirrors webcalc/engine/compressor.py DEFAULT_MAX_PRESSURE_RATIO
 */
export const DEFAULT_MAX_PRESSURE_RATIO = deepFreeze({ turbo: 4.0, centrifugal: 3.5, twin_screw: 3.0, roots: 2.5 });
/**
 * Pressure ratio above which a caution is raised (common practice, from memory).
 * mirrors webcalc/engine/compressor.py CAUTION_PRESSURE_RATIO
 */
export const CAUTION_PRESSURE_RATIO = deepFreeze({ turbo: 3.0, centrifugal: 3.0, twin_screw: 2.5, roots: 2.0 });
/** Default intercooler effectiveness (common practice, from memory); 0 = no intercooler. */
export const DEFAULT_INTERCOOLER_EFFECTIVENESS = 0.75;
/** Default mechanical efficiency of a blower drive (belt and gears; common practice, from memory). */
export const DEFAULT_DRIVE_EFFICIENCY = 0.95;

/** Hard validity ranges, SI. mirrors webcalc/engine/compressor.py VALID */
export const VALID = deepFreeze({
  boost: [0.0, 700e3], // Pa gauge
  loss: [0.0, 50e3], // Pa
  exhaust_back_pressure: [0.0, 1000e3], // Pa gauge
  max_pressure_ratio: [1.0, 6.0], // exclusive at 1
  efficiency: [0.3, 1.0],
  effectiveness: [0.0, 1.0],
  drive_efficiency: [0.5, 1.0],
  coolant_temperature: [213.15, 373.15], // K (-60 to +100 degC)
});

/** Styles of boost control. mirrors webcalc/engine/compressor.py BOOST_CONTROLS */
export const BOOST_CONTROLS = deepFreeze(['held_manifold', 'held_gauge', 'fixed_ratio']);

/**
 * Manifold, compressor inlet and outlet pressures, and the compressor pressure ratio
 * (Heywood 1988, sec. 6.8): `MAP = P_baro + boost`; `P1 = P_baro - inlet_loss`;
 * `P2 = MAP + intercooler_loss`; `PR = P2 / P1`. Mirrors `pressures`.
 * @param {number} pBaro station pressure, absolute, [Pa]
 * @param {number} boostGauge boost, gauge, [Pa]
 * @param {number} [inletLoss=0] filter and inlet ducting drop, [Pa]
 * @param {number} [intercoolerLoss=0] intercooler and pipe drop, [Pa]
 * @returns {[number, number, number, number]} [MAP [Pa], P1 [Pa], P2 [Pa], PR [-]]
 */
export function pressures(pBaro, boostGauge, inletLoss = 0.0, intercoolerLoss = 0.0) {
  const mapAbs = pBaro + boostGauge;
  const p1 = pBaro - inletLoss;
  const p2 = mapAbs + intercoolerLoss;
  return [mapAbs, p1, p2, p2 / p1];
}

/**
 * Compressor outlet temperature from the isentropic efficiency (Heywood 1988, eq. 6.32):
 * `T2 = T1 (1 + (PR^((k-1)/k) - 1) / eta_c)`, k = 1.4. Mirrors `outlet_temperature`.
 * @param {number} T1 compressor inlet temperature, [K]
 * @param {number} pressureRatio P2 / P1, [-]
 * @param {number} efficiency isentropic efficiency, [-] 0.3..1
 * @returns {number} outlet temperature, [K]
 */
export function outletTemperature(T1, pressureRatio, efficiency) {
  const exponent = (GAMMA_AIR - 1.0) / GAMMA_AIR;
  return T1 * (1.0 + (Math.pow(pressureRatio, exponent) - 1.0) / efficiency);
}

/**
 * Charge temperature after an intercooler (effectiveness definition, Incropera and
 * DeWitt sec. 11.4): `Tm = T2 - eps (T2 - T_coolant)`. Mirrors
 * `intercooler_outlet_temperature`.
 * @param {number} T2 compressor outlet temperature, [K]
 * @param {number} coolantTemperature cooling medium temperature, [K]
 * @param {number} effectiveness heat-exchanger effectiveness, [-] 0..1 (0 = none)
 * @returns {number} manifold temperature, [K]
 */
export function intercoolerOutletTemperature(T2, coolantTemperature, effectiveness) {
  return T2 - effectiveness * (T2 - coolantTemperature);
}

/**
 * Shaft power taken from the crank by a belt-driven compressor (steady-flow energy
 * equation, Heywood 1988 eq. 6.31): `P = m cp (T2 - T1) / eta_drive`. Mirrors `drive_power`.
 * @param {number} airMassFlow air through the compressor, [kg/s]
 * @param {number} T1 inlet temperature, [K]
 * @param {number} T2 outlet temperature, [K]
 * @param {number} driveEfficiency belt and gear efficiency, [-] 0.5..1
 * @returns {number} drive power, [W]
 */
export function drivePower(airMassFlow, T1, T2, driveEfficiency) {
  return airMassFlow * CP_AIR * (T2 - T1) / driveEfficiency;
}

/**
 * Highest gauge boost the compressor reaches at its maximum pressure ratio:
 * `boost_max = PR_max P1 - intercooler_loss - P_baro` (negative: unreachable).
 * Mirrors `highest_boost`.
 * @param {number} maxPressureRatio highest pressure ratio, [-]
 * @param {number} p1 compressor inlet pressure, [Pa]
 * @param {number} intercoolerLoss [Pa]
 * @param {number} pBaro station pressure, [Pa]
 * @returns {number} boost, gauge, [Pa]
 */
export function highestBoost(maxPressureRatio, p1, intercoolerLoss, pBaro) {
  return maxPressureRatio * p1 - intercoolerLoss - pBaro;
}

/**
 * Gauge boost at another site for boost set elsewhere, by the style of boost control.
 * `held_manifold`: MAP kept, `boost = P_set + boost_set - P_here`; `held_gauge`: gauge
 * boost kept; `fixed_ratio` (and, as in Python, any other value): P2/P1 kept, losses
 * included, `boost = PR_set (P_here - inlet_loss) - intercooler_loss - P_here`.
 * Never below 0. Mirrors `boost_here`.
 * @param {string} control one of BOOST_CONTROLS
 * @param {number} boostSet boost where it was set, gauge, [Pa]
 * @param {number} pSet station pressure where it was set, [Pa]
 * @param {number} pHere station pressure here, [Pa]
 * @param {number} [inletLoss=0] [Pa]
 * @param {number} [intercoolerLoss=0] [Pa]
 * @returns {number} boost here, gauge, [Pa]
 */
export function boostHere(control, boostSet, pSet, pHere, inletLoss = 0.0, intercoolerLoss = 0.0) {
  let boost;
  if (control === 'held_manifold') {
    boost = pSet + boostSet - pHere;
  } else if (control === 'held_gauge') {
    boost = boostSet + 0.0 * pHere;
  } else {
    const ratio = pressures(pSet, boostSet, inletLoss, intercoolerLoss)[3];
    boost = ratio * (pHere - inletLoss) - intercoolerLoss - pHere;
  }
  return Math.max(boost, 0.0);
}
