// Air mass and volume flow, corrected flow for compressor maps, volumetric efficiency.
// mirrors webcalc/engine/airflow.py (same names in camelCase, same argument order).

import { P_SEA_LEVEL, R_DRY, T_SEA_LEVEL, deepFreeze } from './constants.js';

/** Hard validity ranges, SI. mirrors webcalc/engine/airflow.py VALID */
export const VALID = deepFreeze({
  displacement: [0.05e-3, 30e-3], // m^3
  rpm: [500.0, 30000.0], // rev/min
  reference_pressure: [50e3, 110e3], // Pa
  reference_temperature: [200.0, 350.0], // K
  compressor_count: [1, 16],
});
/** Plausible band of implied volumetric efficiency (common practice, from memory). */
export const PLAUSIBLE_VOLUMETRIC_EFFICIENCY = deepFreeze([0.5, 1.3]);
/** Reference pressure of a compressor map when none is given, [Pa]. */
export const DEFAULT_REFERENCE_PRESSURE = P_SEA_LEVEL;
/** Reference temperature of a compressor map when none is given, [K]. */
export const DEFAULT_REFERENCE_TEMPERATURE = T_SEA_LEVEL;

/**
 * Engine air mass flow for a power (definitions of sfc and AFR, Heywood 1988 eq. 2.24,
 * 2.29): `m_air = P bsfc AFR`. Mirrors `air_mass_flow`.
 * @param {number} power crank power, [W]
 * @param {number} bsfc brake specific fuel consumption, [kg/J]
 * @param {number} afr air-fuel ratio by mass, [-]
 * @returns {number} air mass flow, [kg/s]
 */
export function airMassFlow(power, bsfc, afr) {
  return power * bsfc * afr;
}

/**
 * Dry-air density by the ideal gas law, `rho = P / (R_d T)`. Mirrors `gas_density`.
 * @param {number} pAbs absolute pressure, [Pa]
 * @param {number} T temperature, [K]
 * @returns {number} density, [kg/m^3]
 */
export function gasDensity(pAbs, T) {
  return pAbs / (R_DRY * T);
}

/**
 * Volume flow of air at a pressure and temperature (ideal gas law): `V = m / rho`,
 * `rho = P / (R_d T)`. Mirrors `volume_flow`.
 * @param {number} massFlow [kg/s]
 * @param {number} pAbs absolute pressure, [Pa]
 * @param {number} T temperature, [K]
 * @returns {number} volume flow, [m^3/s]
 */
export function volumeFlow(massFlow, pAbs, T) {
  return massFlow / gasDensity(pAbs, T);
}

/**
 * Corrected mass flow for reading a compressor map (SAE J922 definition):
 * `m_corr = m sqrt(T1 / T_ref) / (P1 / P_ref)`. Mirrors `corrected_flow`.
 * @param {number} massFlow air through one compressor, [kg/s]
 * @param {number} p1 compressor inlet pressure, absolute, [Pa]
 * @param {number} T1 compressor inlet temperature, [K]
 * @param {number} [pRef=101325] the map's reference pressure, [Pa]
 * @param {number} [TRef=288.15] the map's reference temperature, [K]
 * @returns {number} corrected flow, [kg/s]
 */
export function correctedFlow(massFlow, p1, T1, pRef = DEFAULT_REFERENCE_PRESSURE, TRef = DEFAULT_REFERENCE_TEMPERATURE) {
  return massFlow * Math.pow(T1 / TRef, 0.5) / (p1 / pRef);
}

/**
 * Implied volumetric efficiency of a four-stroke engine relative to manifold density
 * (Heywood 1988, eq. 2.27): `VE = m / (rho_m V_d N / 120)`. Mirrors `volumetric_efficiency`.
 * @param {number} massFlow engine air mass flow, [kg/s]
 * @param {number} rhoManifold charge density in the manifold, [kg/m^3]
 * @param {number} displacement swept volume, [m^3]
 * @param {number} rpm engine speed, [rev/min] (a plain number)
 * @returns {number} volumetric efficiency, [-]
 */
export function volumetricEfficiency(massFlow, rhoManifold, displacement, rpm) {
  return massFlow / (rhoManifold * displacement * rpm / 120.0);
}
