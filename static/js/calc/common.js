// Shared pieces of the calculations: the result record, site and fuel resolution.
// mirrors webcalc/calc/common.py (same names in camelCase, same order of defaults,
// assumptions and warnings: the order of assumptions is part of the response JSON).

import * as atmosphere from '../engine/atmosphere.js';
import * as fuel from '../engine/fuel.js';
import { P_SEA_LEVEL } from '../engine/constants.js';

const own = (obj, key) => obj !== null && obj !== undefined && Object.prototype.hasOwnProperty.call(obj, key);
export { own as has };

/** A problem that only shows once fields are combined; names the field to blame. mirrors InputError */
export class InputError extends Error {
  constructor(path, code, params = {}) {
    super(`${path}: ${code}`);
    this.name = 'InputError';
    this.path = path;
    this.code = code;
    this.params = params;
  }
}

/**
 * A result that is not a finite number (Python: ValueError or ArithmeticError), answered
 * as a 400 naming the inputs. JavaScript arithmetic gives Infinity or NaN where Python's
 * float division raises; every such value lands in the outputs, where the renderer
 * throws this error, so both give the same response.
 */
export class NotFiniteError extends Error {
  constructor(what) {
    super(`not finite: ${what}`);
    this.name = 'NotFiniteError';
  }
}

/** Outputs (SI numbers, null, plain values or table rows), warnings and assumptions. mirrors Result */
export class Result {
  constructor() {
    this.values = {};
    this.warnings = []; // [code, severity]
    this.assumptions = {}; // path -> [value, kind or null]
    this.density = null; // fuel density for fuel-flow outputs, [kg/m^3]
    this.powerScale = 1.0; // crank power per unit of reported power (wheel basis)
  }

  warn(code, severity) {
    if (!this.warnings.some(([c, s]) => c === code && s === severity)) this.warnings.push([code, severity]);
  }

  assume(path, value, kind = null) {
    this.assumptions[path] = [value, kind];
    return value;
  }
}

/** An input's value, or its default recorded as an assumption. mirrors `option` */
export function option(inp, name, defaultValue, result, path = null, kind = null) {
  if (own(inp, name)) return inp[name];
  return result.assume(path || name, defaultValue, kind);
}

/**
 * Station pressure, temperature and humidity of a site object (SPEC section 3): pressure
 * from `station_pressure`, else `altimeter_setting` with `altitude` (NWS), else `altitude`
 * by the standard atmosphere, else ISA sea level. mirrors `resolve_site`
 */
export function resolveSite(raw, result, prefix = 'site') {
  const site = raw || {};
  if (own(site, 'station_pressure') && own(site, 'altimeter_setting')) {
    throw new InputError(`${prefix}.altimeter_setting`, 'both_given', { other: `${prefix}.station_pressure` });
  }
  if (own(site, 'altimeter_setting') && !own(site, 'altitude')) {
    throw new InputError(`${prefix}.altimeter_setting`, 'needs', { other: `${prefix}.altitude` });
  }
  let altitude = own(site, 'altitude') ? site.altitude : null;
  let pressure;
  if (own(site, 'station_pressure')) {
    pressure = site.station_pressure;
  } else if (own(site, 'altimeter_setting')) {
    pressure = atmosphere.stationPressureFromAltimeter(site.altimeter_setting, altitude);
  } else if (altitude !== null) {
    pressure = result.assume(`${prefix}.station_pressure`, atmosphere.isaPressure(altitude), 'abs_pressure');
  } else {
    pressure = result.assume(`${prefix}.station_pressure`, P_SEA_LEVEL, 'abs_pressure');
  }
  let temperature;
  if (own(site, 'temperature')) {
    temperature = site.temperature;
  } else {
    const h = altitude !== null ? altitude : atmosphere.pressureAltitude(pressure);
    temperature = result.assume(`${prefix}.temperature`, atmosphere.isaTemperature(h), 'temperature');
  }
  const humidity = own(site, 'relative_humidity')
    ? site.relative_humidity
    : result.assume(`${prefix}.relative_humidity`, 0.0);
  if (humidity > 0 && atmosphere.vapourPressure(temperature, humidity) >= pressure) {
    // Water vapour cannot make up all of the air: the dry-air pressure would be <= 0.
    throw new InputError(`${prefix}.relative_humidity`, 'pressure_not_positive');
  }
  if (altitude === null) altitude = atmosphere.pressureAltitude(pressure);
  return { pressure, temperature, humidity, altitude };
}

/** Density [kg/m^3] and stoichiometric AFR of the request's fuel (blend rule). mirrors `resolve_fuel` */
export function resolveFuel(inp, result) {
  const name = own(inp, 'fuel') ? inp.fuel : 'gasoline';
  if (!own(inp, 'fuel')) result.assume('fuel', 'gasoline');
  const content = own(inp, 'ethanol_content') ? inp.ethanol_content : null;
  if (content !== null && !fuel.BLENDABLE.includes(name)) throw new InputError('ethanol_content', 'not_for_fuel');
  let [density, afr] = fuel.fuelProperties(name, content);
  if (own(inp, 'fuel_density')) density = inp.fuel_density;
  const ethanol = content !== null ? content : (name === 'e85' ? fuel.E85_ETHANOL : 0.0);
  if (ethanol > 0.10 || name === 'ethanol' || name === 'methanol') result.warn('ethanol_compatibility', 'info');
  result.density = density;
  return { name, density, afr };
}

/** Crank power per unit of the request's power figures (1, or 1 / (1 - loss) for wheel). mirrors `power_scale` */
export function powerScale(inp, result) {
  if ((own(inp, 'power_basis') ? inp.power_basis : 'crank') === 'wheel') {
    if (!own(inp, 'drivetrain_loss')) throw new InputError('drivetrain_loss', 'needs_wheel_loss');
    result.warn('drivetrain_loss_estimate', 'info');
    result.powerScale = 1.0 / (1.0 - inp.drivetrain_loss);
  }
  return result.powerScale;
}

/** Raise an InputError naming the inputs when a result is not finite. mirrors `check_finite` */
export function checkFinite(values, names) {
  for (const value of values) {
    if (value !== null && value !== undefined && !Number.isFinite(value)) throw new InputError(names[0], 'not_finite');
  }
}
