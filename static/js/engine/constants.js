// Physical constants shared by every model (binding values of the product spec).
// mirrors webcalc/engine/constants.py
//
// The gas constant for dry air is the one consistent with the US Standard Atmosphere
// 1976 (R* / M0 = 8314.32 / 28.9644); the others are standard handbook values.

/** Gas constant of dry air, [J/(kg K)] (US Standard Atmosphere 1976). */
export const R_DRY = 287.05287;
/** Gas constant of water vapour, [J/(kg K)] (handbook value). */
export const R_VAPOUR = 461.5;
/** Specific heat of air at constant pressure, [J/(kg K)]. */
export const CP_AIR = 1005.0;
/** Ratio of specific heats of air, [-]. */
export const GAMMA_AIR = 1.4;
/** Standard gravity, [m/s^2]. */
export const G0 = 9.80665;
/** Effective earth radius for geopotential height, [m] (USSA 1976). */
export const R_EARTH = 6356766.0;

/** ISA sea-level pressure, [Pa]. */
export const P_SEA_LEVEL = 101325.0;
/** ISA sea-level temperature, [K]. */
export const T_SEA_LEVEL = 288.15;
/** ISA sea-level density, [kg/m^3]. */
export const RHO_SEA_LEVEL = 1.225;
/** Troposphere temperature lapse rate, [K/m] (geopotential). */
export const LAPSE_RATE = 0.0065;
/** Exponent g0 / (R lapse) of the troposphere pressure law, [-]. */
export const PRESSURE_EXPONENT = 5.25588;

// Conversions used by formulas that are stated in customary units.
/** Pound, [kg] (NIST SP 811). */
export const LB = 0.45359237;
/** Mechanical horsepower, [W] (NIST SP 811). */
export const HP = 745.69987158227;
/** 1 lb/hp/h in [kg/J]. */
export const LB_PER_HP_H = LB / (HP * 3600.0);

/**
 * Freeze a table and everything inside it (JavaScript only, no Python counterpart):
 * the data tables of the engine are shared, and a caller must not change them.
 *
 * @template T
 * @param {T} value object or array
 * @returns {T} the same value, frozen all the way down
 */
export function deepFreeze(value) {
  if (value !== null && typeof value === 'object' && !Object.isFrozen(value)) {
    for (const key of Object.keys(value)) deepFreeze(value[key]);
    Object.freeze(value);
  }
  return value;
}
