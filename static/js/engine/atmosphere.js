// Ambient air: standard atmosphere, altimeter setting, humid air, dyno correction.
// mirrors webcalc/engine/atmosphere.py (same names in camelCase, same argument order).
//
// Every function takes and returns SI numbers. Elevations are geometric metres unless
// the name says "geopotential".

import {
  LAPSE_RATE,
  P_SEA_LEVEL,
  PRESSURE_EXPONENT,
  R_DRY,
  R_EARTH,
  R_VAPOUR,
  RHO_SEA_LEVEL,
  T_SEA_LEVEL,
  deepFreeze,
} from './constants.js';

/**
 * Hard validity ranges (outside them the API answers 400), SI units.
 * mirrors webcalc/engine/atmosphere.py VALID
 */
export const VALID = deepFreeze({
  altitude: [-610.0, 11000.0], // m, troposphere of the standard atmosphere
  station_pressure: [22e3, 110e3], // Pa
  altimeter_setting: [85e3, 110e3], // Pa
  temperature: [213.15, 333.15], // K (-60 to +60 degC)
  relative_humidity: [0.0, 1.0],
});
/**
 * SAE J1349 states its correction for 15 to 35 degC and 90 to 105 kPa dry air (from memory).
 * mirrors webcalc/engine/atmosphere.py J1349_RANGE
 */
export const J1349_RANGE = deepFreeze({
  temperature: [288.15, 308.15],
  dry_air_pressure: [90e3, 105e3],
});
/** Upper end of the troposphere, geopotential metres (US Standard Atmosphere 1976). */
export const TROPOPAUSE_GEOPOTENTIAL = 11000.0;

/**
 * Geopotential height from geometric elevation (US Standard Atmosphere 1976, eq. 18):
 * `H = r0 h / (r0 + h)`. Mirrors `geopotential_height`.
 * @param {number} h geometric elevation, [m]
 * @returns {number} geopotential height, [m']
 */
export function geopotentialHeight(h) {
  return R_EARTH * h / (R_EARTH + h);
}

/**
 * Geometric elevation from geopotential height: `h = r0 H / (r0 - H)`.
 * Mirrors `geometric_height`.
 * @param {number} H geopotential height, [m']
 * @returns {number} geometric elevation, [m]
 */
export function geometricHeight(H) {
  return R_EARTH * H / (R_EARTH - H);
}

/**
 * Standard-atmosphere temperature (US Standard Atmosphere 1976, troposphere, eq. 23):
 * `T = 288.15 - 0.0065 H`, H geopotential. Mirrors `isa_temperature`.
 * @param {number} h geometric elevation, [m] (valid -610 to 11 000 m)
 * @returns {number} temperature, [K]
 */
export function isaTemperature(h) {
  return T_SEA_LEVEL - LAPSE_RATE * geopotentialHeight(h);
}

/**
 * Standard-atmosphere pressure (US Standard Atmosphere 1976, troposphere, eq. 33a):
 * `P = 101325 (1 - 0.0065 H / 288.15)^5.25588`, H geopotential. Mirrors `isa_pressure`.
 * @param {number} h geometric elevation, [m] (valid -610 to 11 000 m)
 * @returns {number} static pressure, absolute, [Pa]
 */
export function isaPressure(h) {
  return P_SEA_LEVEL * Math.pow(1.0 - LAPSE_RATE * geopotentialHeight(h) / T_SEA_LEVEL, PRESSURE_EXPONENT);
}

/**
 * Geometric elevation at which the standard atmosphere has pressure `pAbs` (inverse of
 * the USSA 1976 troposphere law): `H = 288.15 / 0.0065 (1 - (P / 101325)^(1/5.25588))`.
 * Mirrors `pressure_altitude`.
 * @param {number} pAbs absolute pressure, [Pa]
 * @returns {number} geometric elevation, [m]
 */
export function pressureAltitude(pAbs) {
  const H = T_SEA_LEVEL / LAPSE_RATE * (1.0 - Math.pow(pAbs / P_SEA_LEVEL, 1.0 / PRESSURE_EXPONENT));
  return geometricHeight(H);
}

/**
 * Station pressure from an altimeter setting (US National Weather Service formula):
 * `P_stn = P_alt ((288 - 0.0065 h) / 288)^5.2561`. Mirrors `station_pressure_from_altimeter`.
 * @param {number} pAltimeter altimeter setting (QNH), absolute, [Pa]
 * @param {number} h station elevation, [m]
 * @returns {number} station pressure, absolute, [Pa]
 */
export function stationPressureFromAltimeter(pAltimeter, h) {
  return pAltimeter * Math.pow((288.0 - 0.0065 * h) / 288.0, 5.2561);
}

/**
 * Altimeter setting from station pressure (inverse of the NWS formula).
 * Mirrors `altimeter_from_station_pressure`.
 * @param {number} pStation station pressure, absolute, [Pa]
 * @param {number} h station elevation, [m]
 * @returns {number} altimeter setting, [Pa]
 */
export function altimeterFromStationPressure(pStation, h) {
  return pStation / Math.pow((288.0 - 0.0065 * h) / 288.0, 5.2561);
}

/**
 * Saturation vapour pressure over liquid water (Buck 1996 equation):
 * `Psat = 611.21 exp((18.678 - t/234.5) t / (257.14 + t))`, t in degC.
 * Mirrors `saturation_vapour_pressure`.
 * @param {number} T temperature, [K]
 * @returns {number} saturation vapour pressure, [Pa]
 */
export function saturationVapourPressure(T) {
  const t = T - 273.15;
  return 611.21 * Math.exp((18.678 - t / 234.5) * t / (257.14 + t));
}

/**
 * Partial pressure of water vapour, `P_v = RH Psat(T)`. Mirrors `vapour_pressure`.
 * @param {number} T temperature, [K]
 * @param {number} relativeHumidity relative humidity, [-] 0..1
 * @returns {number} vapour pressure, [Pa]
 */
export function vapourPressure(T, relativeHumidity) {
  return relativeHumidity * saturationVapourPressure(T);
}

/**
 * Density of humid air as a mix of two ideal gases (Dalton's law):
 * `rho = P_dry / (R_d T) + P_v / (R_v T)`, `P_dry = P - P_v`. Mirrors `humid_air_density`.
 * @param {number} pAbs total (station) pressure, [Pa]
 * @param {number} T temperature, [K]
 * @param {number} relativeHumidity relative humidity, [-] 0..1
 * @returns {number} density, [kg/m^3]
 */
export function humidAirDensity(pAbs, T, relativeHumidity) {
  const pV = vapourPressure(T, relativeHumidity);
  return (pAbs - pV) / (R_DRY * T) + pV / (R_VAPOUR * T);
}

/**
 * Density altitude: inverts `rho = rho0 (1 - 0.0065 H / 288.15)^4.25588` (USSA 1976,
 * troposphere; rho0 = 1.225 kg/m^3) for geopotential H, returns geometric elevation.
 * Mirrors `density_altitude`.
 * @param {number} rho air density, [kg/m^3]
 * @returns {number} geometric density altitude, [m]
 */
export function densityAltitude(rho) {
  const H = T_SEA_LEVEL / LAPSE_RATE * (1.0 - Math.pow(rho / RHO_SEA_LEVEL, 1.0 / (PRESSURE_EXPONENT - 1.0)));
  return geometricHeight(H);
}

/**
 * True where a geometric elevation lies above the troposphere (11 000 m' geopotential).
 * Mirrors `beyond_troposphere`.
 * @param {number} h geometric elevation, [m]
 * @returns {boolean}
 */
export function beyondTroposphere(h) {
  return geopotentialHeight(h) > TROPOPAUSE_GEOPOTENTIAL;
}

/**
 * Dyno correction factor to SAE J1349 standard conditions (2004 and later, from memory):
 * `CF = 1.176 (99 / P_dry[kPa]) sqrt((t + 273) / 298) - 0.176`, t in degC.
 * Mirrors `sae_j1349_correction_factor`.
 * @param {number} pDry dry-air pressure, [Pa]
 * @param {number} T inlet air temperature, [K]
 * @returns {number} correction factor, [-] (corrected = observed x CF)
 */
export function saeJ1349CorrectionFactor(pDry, T) {
  const t = T - 273.15;
  return 1.176 * (99e3 / pDry) * Math.sqrt((t + 273.0) / 298.0) - 0.176;
}

/**
 * Carry a site's weather to another elevation (altitude tables):
 * `P = ISA(h_row) P_site / ISA(h_site)`; `T = ISA_T(h_row) + (T_site - ISA_T(h_site))`.
 * Mirrors `carry_weather`.
 * @param {number} hRow elevation of the row, [m]
 * @param {number} hSite elevation of the site, [m]
 * @param {number} pSite site pressure, [Pa]
 * @param {number} TSite site temperature, [K]
 * @returns {[number, number]} [pressure [Pa], temperature [K]] at `hRow`
 */
export function carryWeather(hRow, hSite, pSite, TSite) {
  const p = isaPressure(hRow) * pSite / isaPressure(hSite);
  const T = isaTemperature(hRow) + (TSite - isaTemperature(hSite));
  return [p, T];
}
