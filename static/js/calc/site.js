// Conditions: station pressure, humid air, density altitude, SAE J1349 correction.
// mirrors webcalc/calc/site.py

import * as atmosphere from '../engine/atmosphere.js';
import { Result, resolveSite } from './common.js';

/** mirrors OUTPUTS (the order of the response comes from the generated output_order) */
export const OUTPUTS = Object.freeze({
  station_pressure: 'abs_pressure',
  dry_air_pressure: 'abs_pressure',
  vapour_pressure: 'abs_pressure',
  temperature: 'temperature',
  air_density: 'air_density',
  density_altitude: 'elevation',
  pressure_altitude: 'elevation',
  correction_factor: null,
});

/** Humid-air state and the J1349 factor of a resolved site; adds its warnings. mirrors `air` */
export function air(site, result) {
  const { pressure: p, temperature: T, humidity: rh } = site;
  const pV = atmosphere.vapourPressure(T, rh);
  const pDry = p - pV;
  const cf = atmosphere.saeJ1349CorrectionFactor(pDry, T);
  const [tLo, tHi] = atmosphere.J1349_RANGE.temperature;
  const [pLo, pHi] = atmosphere.J1349_RANGE.dry_air_pressure;
  if (!(tLo <= T && T <= tHi && pLo <= pDry && pDry <= pHi)) result.warn('correction_out_of_range', 'caution');
  return [pV, pDry, cf];
}

/** The `site` endpoint. mirrors `calculate` */
export function calculate(inp) {
  const result = new Result();
  const site = resolveSite(inp.site, result);
  const [pV, pDry, cf] = air(site, result);
  const rho = atmosphere.humidAirDensity(site.pressure, site.temperature, site.humidity);
  const hDensity = atmosphere.densityAltitude(rho);
  if (atmosphere.beyondTroposphere(hDensity)) result.warn('beyond_troposphere', 'info');
  Object.assign(result.values, {
    station_pressure: site.pressure,
    dry_air_pressure: pDry,
    vapour_pressure: pV,
    temperature: site.temperature,
    air_density: rho,
    density_altitude: hDensity,
    pressure_altitude: atmosphere.pressureAltitude(site.pressure),
    correction_factor: cf,
  });
  return result;
}
