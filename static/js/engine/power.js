// Power with boost: the pressure-ratio rule, expected power, and the boost for a target.
// mirrors webcalc/engine/power.py (same names in camelCase, same argument order).
//
// Powers are crank power in [W]; pressures absolute in [Pa] unless named gauge.

import * as compressor from './compressor.js';
import { R_DRY, deepFreeze } from './constants.js';

/** Hard validity ranges, SI. mirrors webcalc/engine/power.py VALID */
export const VALID = deepFreeze({ power: [0.0, 10e6], drivetrain_loss: [0.0, 0.5] }); // W (exclusive at 0)

/** Exponent of the temperature term: SAE J1349 uses 0.5 (ISO 1585 uses 0.6, from memory). */
export const TEMPERATURE_EXPONENT = 0.5;
/** Grid of the binding boost-for-power root find. */
export const GRID_POINTS = 257;
/** Bisection stops when the interval is at most this wide, [Pa]. */
export const BISECTION_WIDTH = 1e-6;
/** Bisection gives up after this many halvings. */
export const BISECTION_MAX_HALVINGS = 200;

/**
 * Ideal power by the pressure-ratio rule (common practice, no source; Heywood 1988,
 * sec. 2.12): `P_ideal = P_na MAP / p_na`. Mirrors `ideal_power`.
 * @param {number} naPower NA power, observed, [W]
 * @param {number} mapAbs manifold absolute pressure, [Pa]
 * @param {number} pNa station pressure where the NA power was measured, [Pa]
 * @returns {number} ideal power, [W]
 */
export function idealPower(naPower, mapAbs, pNa) {
  return naPower * mapAbs / pNa;
}

/**
 * Expected crank power at a boost, and its parts. Mirrors `expected_power` (the Python
 * keyword-only arguments are the fields of `options`, in camelCase):
 * ideal `= P_na MAP / p_na`; gross `= ideal (T_na / Tm)^0.5` (SAE J1349 temperature law);
 * air `m = m_na (MAP / p_na) (T_na / Tm)`; drive `= m cp (T2 - T1) / eta_drive` when belt
 * driven, else 0; pumping `= (MAP - EMAP) m / rho_m`, `rho_m = MAP / (R_d Tm)`,
 * `EMAP = P_baro + exhaust_ratio boost` (Heywood 1988, sec. 5.4); expected
 * `= gross + pumping - drive`.
 *
 * @param {number} boostGauge boost, gauge, [Pa]
 * @param {object} options
 * @param {number} options.naPower NA power, observed, [W]
 * @param {number} options.pNa station pressure of the NA run, [Pa]
 * @param {number} options.TNa air temperature of the NA run, [K]
 * @param {number} options.naAirMassFlow air mass flow of the NA run, [kg/s]
 * @param {number} options.pBaro station pressure here, [Pa]
 * @param {number} options.T1 air temperature here (compressor inlet), [K]
 * @param {number} [options.inletLoss=0] [Pa]
 * @param {number} [options.intercoolerLoss=0] [Pa]
 * @param {number} [options.efficiency=0.72] compressor isentropic efficiency, [-]
 * @param {number} [options.effectiveness=0.75] intercooler effectiveness, [-]
 * @param {?number} [options.TCoolant=null] coolant temperature, [K] (default T1)
 * @param {boolean} [options.beltDriven=false] crank-driven compressor
 * @param {number} [options.driveEfficiency=0.95] belt and gear efficiency, [-]
 * @param {number} [options.exhaustRatio=1] exhaust gauge pressure per unit boost, [-]
 * @returns {{map: number, p1: number, p2: number, pressureRatio: number, T2: number,
 *   Tm: number, ideal: number, gross: number, airMassFlow: number, drive: number,
 *   pumping: number, expected: number}} SI values
 */
export function expectedPower(boostGauge, {
  naPower,
  pNa,
  TNa,
  naAirMassFlow,
  pBaro,
  T1,
  inletLoss = 0.0,
  intercoolerLoss = 0.0,
  efficiency = 0.72,
  effectiveness = 0.75,
  TCoolant = null,
  beltDriven = false,
  driveEfficiency = compressor.DEFAULT_DRIVE_EFFICIENCY,
  exhaustRatio = 1.0,
}) {
  const coolant = TCoolant === null || TCoolant === undefined ? T1 : TCoolant;
  const [mapAbs, p1, p2, ratio] = compressor.pressures(pBaro, boostGauge, inletLoss, intercoolerLoss);
  const T2 = compressor.outletTemperature(T1, ratio, efficiency);
  const Tm = compressor.intercoolerOutletTemperature(T2, coolant, effectiveness);
  const ideal = idealPower(naPower, mapAbs, pNa);
  const gross = ideal * Math.pow(TNa / Tm, TEMPERATURE_EXPONENT);
  const air = naAirMassFlow * (mapAbs / pNa) * (TNa / Tm);
  const drive = beltDriven ? compressor.drivePower(air, T1, T2, driveEfficiency) : 0.0;
  const emap = pBaro + exhaustRatio * boostGauge;
  const rhoM = mapAbs / (R_DRY * Tm);
  const pumping = (mapAbs - emap) * air / rhoM;
  return {
    map: mapAbs,
    p1,
    p2,
    pressureRatio: ratio,
    T2,
    Tm,
    ideal,
    gross,
    airMassFlow: air,
    drive,
    pumping,
    expected: gross + pumping - drive,
  };
}

/**
 * Boost that gives a target power by the pressure-ratio rule (closed form):
 * `boost = p_na target / P_na - P_baro`, floored at 0. Mirrors `boost_for_ideal_power`.
 * @param {number} targetPower [W]
 * @param {number} naPower [W]
 * @param {number} pNa [Pa]
 * @param {number} pBaro [Pa]
 * @returns {number} boost, gauge, [Pa]
 */
export function boostForIdealPower(targetPower, naPower, pNa, pBaro) {
  return Math.max(pNa * targetPower / naPower - pBaro, 0.0);
}

/**
 * Grid point `i` of `numpy.linspace(start, stop, n)`, the way numpy computes it:
 * `i * ((stop - start) / (n - 1)) + start`, and the last point exactly `stop`.
 * @param {number} start
 * @param {number} stop
 * @param {number} n number of points (at least 2)
 * @returns {number[]}
 */
function linspace(start, stop, n) {
  const div = n - 1;
  const delta = stop - start;
  const step = delta / div;
  const grid = new Array(n);
  for (let i = 0; i < n; i += 1) {
    // numpy divides first when the step underflows to 0 (denormal delta)
    grid[i] = (step === 0 ? (i / div) * delta : i * step) + start;
  }
  grid[n - 1] = stop;
  return grid;
}

/**
 * Boost for a target expected power: the binding grid-and-bisection root find (SPEC
 * section 4). Evaluates `expectedFn(boost)` on 257 equally spaced boosts from 0 to
 * `boostMax` (numpy's linspace), takes the first interval where `expected - target`
 * goes from below 0 to at or above 0, and bisects it until it is at most 1e-6 Pa wide
 * (at most 200 halvings); answers its midpoint. Mirrors `boost_for_expected_power`.
 * @param {number} targetPower target, [W]
 * @param {number} boostMax highest allowed boost, gauge, [Pa]
 * @param {(boost: number) => number} expectedFn expected power [W] at a boost [Pa]
 * @returns {[?number, ?number]} [boost [Pa] or null when unreachable,
 *   max expected power on the grid [W] (null when boostMax < 0)]
 */
export function boostForExpectedPower(targetPower, boostMax, expectedFn) {
  if (boostMax < 0) return [null, null];
  const grid = linspace(0.0, boostMax, GRID_POINTS);
  const f = grid.map((boost) => Number(expectedFn(boost)) - targetPower);
  let fMax = f[0];
  for (let i = 1; i < f.length; i += 1) fMax = Math.max(fMax, f[i]); // NaN propagates, as np.max
  const maxExpected = fMax + targetPower;
  let i = -1;
  for (let k = 0; k < f.length - 1; k += 1) {
    if (f[k] < 0 && f[k + 1] >= 0) {
      i = k;
      break;
    }
  }
  if (i < 0) return [null, maxExpected];
  let lo = grid[i];
  let hi = grid[i + 1];
  for (let n = 0; n < BISECTION_MAX_HALVINGS; n += 1) {
    if (hi - lo <= BISECTION_WIDTH) break;
    const mid = 0.5 * (lo + hi);
    if (Number(expectedFn(mid)) - targetPower < 0) {
      lo = mid;
    } else {
      hi = mid;
    }
  }
  return [0.5 * (lo + hi), maxExpected];
}
