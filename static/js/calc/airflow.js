// Airflow: air for a power, inlet volume flow, corrected flow, implied volumetric efficiency.
// mirrors webcalc/calc/airflow.py

import * as airflow from '../engine/airflow.js';
import * as fuel from '../engine/fuel.js';
import { checkInlet, compressorSetup, fillState } from './boost.js';
import { InputError, Result, has, option, powerScale, resolveFuel, resolveSite } from './common.js';

/** mirrors OUTPUTS */
export const OUTPUTS = Object.freeze({
  station_pressure: 'abs_pressure',
  air_mass_flow: 'air_mass_flow',
  air_volume_flow: 'air_volume_flow',
  corrected_air_flow: 'air_mass_flow',
  manifold_pressure: 'abs_pressure',
  pressure_ratio: null,
  compressor_outlet_temperature: 'temperature',
  manifold_temperature: 'temperature',
  volumetric_efficiency: null,
});

/** BSFC and AFR for the air flow: given, from lambda, or the gasoline-equivalent default. mirrors `air_per_power` */
export function airPerPower(inp, props, result) {
  if (has(inp, 'afr') && has(inp, 'lambda')) throw new InputError('lambda', 'both_given', { other: 'afr' });
  const [bsfcDefault, afrDefault] = fuel.naAirDefaults(props.afr);
  const bsfc = option(inp, 'bsfc', bsfcDefault, result, null, 'bsfc');
  const afr = has(inp, 'lambda') ? inp.lambda * props.afr : option(inp, 'afr', afrDefault, result);
  if (!(afr / props.afr >= 0.6 && afr / props.afr <= 1.2)) result.warn('afr_implausible', 'caution');
  return [bsfc, afr];
}

/** The `airflow` endpoint. mirrors `calculate` */
export function calculate(inp) {
  const result = new Result();
  if (has(inp, 'displacement') !== has(inp, 'rpm')) {
    throw new InputError(has(inp, 'displacement') ? 'rpm' : 'displacement', 'required');
  }
  const scale = powerScale(inp, result);
  const props = resolveFuel(inp, result);
  const [bsfc, afr] = airPerPower(inp, props, result);
  const mass = airflow.airMassFlow(inp.power * scale, bsfc, afr);
  const site = resolveSite(inp.site, result);
  const setup = compressorSetup(inp, site, result);
  checkInlet(site.pressure, setup);
  const boost = option(inp, 'boost', 0.0, result, null, 'gauge_pressure');
  const [mapAbs, ratio, T2, Tm] = fillState(result, site, boost, false, setup);
  const p1 = result.values.compressor_inlet_pressure;
  const T1 = site.temperature;
  const count = option(inp, 'compressor_count', 1, result);
  const pRef = option(inp, 'reference_pressure', airflow.DEFAULT_REFERENCE_PRESSURE, result, null, 'abs_pressure');
  const TRef = option(inp, 'reference_temperature', airflow.DEFAULT_REFERENCE_TEMPERATURE, result, null, 'temperature');
  let ve = null;
  if (has(inp, 'displacement')) {
    ve = airflow.volumetricEfficiency(mass, airflow.gasDensity(mapAbs, Tm), inp.displacement, inp.rpm);
    const [lo, hi] = airflow.PLAUSIBLE_VOLUMETRIC_EFFICIENCY;
    if (!(lo <= ve && ve <= hi)) result.warn('volumetric_efficiency_implausible', 'caution');
  }
  result.values = {
    station_pressure: site.pressure,
    air_mass_flow: mass,
    air_volume_flow: airflow.volumeFlow(mass, p1, T1),
    corrected_air_flow: airflow.correctedFlow(mass / count, p1, T1, pRef, TRef),
    manifold_pressure: mapAbs,
    pressure_ratio: ratio,
    compressor_outlet_temperature: T2,
    manifold_temperature: Tm,
    volumetric_efficiency: ve,
  };
  return result;
}
