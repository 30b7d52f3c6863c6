// Injectors and fuel pump: sizing, duty, power limits (SPEC sections 3 and 4).
// mirrors webcalc/calc/fuel.py

import * as fuel from '../engine/fuel.js';
import { InputError, Result, has, option, powerScale, resolveFuel } from './common.js';
import engineData from '../../generated/engine.js';

/** Duty cycle above which injectors near static flow (common practice, from memory). */
export const DUTY_CAUTION = engineData.thresholds.duty_caution;
/** Pressure difference across the injectors below which atomisation suffers, [Pa] (common practice, from memory). */
export const PRESSURE_DIFFERENCE_CAUTION = engineData.thresholds.pressure_difference_caution;

/** mirrors INJECTOR_OUTPUTS */
export const INJECTOR_OUTPUTS = Object.freeze({
  flow_per_injector: 'injector_flow',
  flow_at_operating_pressure: 'injector_flow',
  total_fuel_flow: 'fuel_flow',
  pressure_difference: 'gauge_pressure',
  injector_flow_at_operating_pressure: 'injector_flow',
  duty_at_power: null,
  max_power: 'power',
});
/** mirrors PUMP_OUTPUTS */
export const PUMP_OUTPUTS = Object.freeze({
  required_flow: 'pump_flow',
  required_pressure: 'gauge_pressure',
  total_fuel_flow: 'fuel_flow',
  pressure_difference: 'gauge_pressure',
  available_flow: 'pump_flow',
  margin_available: null,
  max_power: 'power',
});

const nulls = (spec) => Object.fromEntries(Object.keys(spec).map((k) => [k, null]));

/** Power, fuel, BSFC, boost and regulator shared by injectors and pump, with defaults. mirrors `fuel_system` */
export function fuelSystem(inp, result) {
  const scale = powerScale(inp, result);
  const props = resolveFuel(inp, result);
  const induction = option(inp, 'induction', 'turbo', result);
  let boost;
  if (induction === 'na') {
    if ((has(inp, 'boost') ? inp.boost : 0.0) > 0) throw new InputError('boost', 'no_boost_na');
    boost = 0.0;
  } else if (!has(inp, 'boost')) {
    throw new InputError('boost', 'needs_boost');
  } else {
    boost = inp.boost;
  }
  const bsfc = option(inp, 'bsfc', fuel.sizingBsfc(induction, props.afr), result, null, 'bsfc');
  const base = option(inp, 'base_fuel_pressure', fuel.DEFAULT_FUEL_PRESSURE, result, null, 'gauge_pressure');
  const regulator = option(inp, 'regulator', 'boost_referenced', result);
  const difference = fuel.injectorPressureDifference(base, boost, regulator);
  if (difference <= 0) result.warn('pressure_difference_low', 'danger');
  else if (difference < PRESSURE_DIFFERENCE_CAUTION) result.warn('pressure_difference_low', 'caution');
  const power = inp.power * scale;
  return {
    power, density: props.density, bsfc, boost, base, regulator, difference, fuelMassFlow: fuel.fuelMassFlow(power, bsfc),
  };
}

/** mirrors `duty_warnings` */
export function dutyWarnings(duty, maxDuty, result) {
  if (duty >= 1.0) result.warn('duty_cycle_high', 'danger');
  else if (duty > DUTY_CAUTION) result.warn('duty_cycle_high', 'caution');
}

/** The given injector's mass-flow rating, corrected for a volumetric test fluid. mirrors `given_rating` */
export function givenRating(inp, rhoFuel, result) {
  const rating = inp.injector_flow;
  if (rating.dimension === 'volume_flow') {
    let volume = rating.si;
    if (has(inp, 'rating_fluid_density')) volume *= fuel.ratingFluidScale(rhoFuel, inp.rating_fluid_density);
    else result.warn('rating_fluid_unknown', 'info');
    return volume * rhoFuel;
  }
  return rating.si;
}

/** The `injectors` endpoint. mirrors `injectors` */
export function injectors(inp) {
  const result = new Result();
  const s = fuelSystem(inp, result);
  const count = inp.injector_count;
  const maxDuty = option(inp, 'max_duty', fuel.DEFAULT_MAX_DUTY, result);
  const rated = option(inp, 'rated_pressure', fuel.DEFAULT_FUEL_PRESSURE, result, null, 'gauge_pressure');
  const values = nulls(INJECTOR_OUTPUTS);
  Object.assign(values, { total_fuel_flow: s.fuelMassFlow, pressure_difference: s.difference });
  if (has(inp, 'injector_flow')) values.max_power = 0.0;
  if (s.difference > 0) {
    const need = fuel.injectorFlowNeeded(s.power, s.bsfc, count, maxDuty);
    values.flow_at_operating_pressure = need;
    values.flow_per_injector = need * fuel.orificeScale(rated, s.difference);
    if (has(inp, 'injector_flow')) {
      const atOperating = givenRating(inp, s.density, result) * fuel.orificeScale(s.difference, rated);
      const duty = fuel.injectorDuty(s.power, s.bsfc, count, atOperating);
      Object.assign(values, {
        injector_flow_at_operating_pressure: atOperating,
        duty_at_power: duty,
        max_power: fuel.injectorMaxPower(atOperating, count, maxDuty, s.bsfc),
      });
      dutyWarnings(duty, maxDuty, result);
      if (duty > maxDuty) result.warn('injector_too_small', 'caution');
    } else {
      dutyWarnings(maxDuty, maxDuty, result);
    }
  } else if (has(inp, 'injector_flow') && inp.injector_flow.dimension === 'volume_flow' && !has(inp, 'rating_fluid_density')) {
    result.warn('rating_fluid_unknown', 'info');
  }
  result.values = values;
  return result;
}

/** Pump-curve points in SI (pressure [Pa], volume flow [m^3/s]), checked for order. mirrors `pump_curve` */
export function pumpCurve(inp, density) {
  const points = inp.pump_curve;
  const pressures = points.map((p) => p.pressure);
  for (let i = 1; i < pressures.length; i += 1) {
    if (pressures[i] <= pressures[i - 1]) throw new InputError(`pump_curve[${i}].pressure`, 'curve_increasing');
  }
  return [pressures, points.map((p) => p.flow.to('volume_flow', density))];
}

/** The `fuel-pump` endpoint. mirrors `fuel_pump` */
export function fuelPump(inp) {
  const result = new Result();
  const s = fuelSystem(inp, result);
  const margin = option(inp, 'margin', fuel.DEFAULT_PUMP_MARGIN, result);
  const lineLoss = option(inp, 'line_loss', 0.0, result, null, 'gauge_pressure');
  const count = option(inp, 'pump_count', 1, result);
  const values = nulls(PUMP_OUTPUTS);
  const need = s.fuelMassFlow / s.density;
  const pressure = fuel.pumpRequiredPressure(s.base, s.boost, s.regulator, lineLoss);
  Object.assign(values, {
    required_flow: fuel.pumpRequiredFlow(s.power, s.bsfc, s.density, margin),
    required_pressure: pressure,
    total_fuel_flow: s.fuelMassFlow,
    pressure_difference: s.difference,
  });
  if (has(inp, 'pump_curve')) {
    const [pressures, flows] = pumpCurve(inp, s.density);
    const [flow, extrapolated] = fuel.pumpCurveFlow(pressures, flows, pressure);
    const available = count * flow;
    result.warn('pump_voltage', 'info');
    if (extrapolated) result.warn('pump_curve_extrapolated', 'caution');
    const marginAvailable = available / need - 1.0;
    if (available < need) result.warn('pump_margin_low', 'danger');
    else if (marginAvailable < margin) result.warn('pump_margin_low', 'caution');
    Object.assign(values, {
      available_flow: available,
      margin_available: marginAvailable,
      max_power: available * s.density / (s.bsfc * (1.0 + margin)),
    });
  }
  result.values = values;
  return result;
}
