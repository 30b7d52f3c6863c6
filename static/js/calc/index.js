// Calculations behind each endpoint: validated SI inputs in, SI results and warning codes
// out. mirrors webcalc/calc/__init__.py: endpoint name -> calculation and outputs.
//
// The outputs come in the order of the generated export (static/generated/fields.js,
// `output_order`): that order is the key order of the response JSON. The OUTPUTS tables
// beside each calculation mirror the Python ones and are checked against it by the tests.

import api from '../../generated/fields.js';
import * as airflow from './airflow.js';
import * as boost from './boost.js';
import * as fuel from './fuel.js';
import * as site from './site.js';

/** mirrors CALCULATIONS */
export const CALCULATIONS = Object.freeze({
  site: site.calculate,
  'pressure-ratio': boost.pressureRatio,
  power: boost.powerCheck,
  'boost-for-power': boost.boostForPower,
  airflow: airflow.calculate,
  injectors: fuel.injectors,
  'fuel-pump': fuel.fuelPump,
});

/** mirrors OUTPUTS (as objects; insertion order is the Python order) */
export const OUTPUTS = Object.freeze({
  site: site.OUTPUTS,
  'pressure-ratio': boost.PRESSURE_RATIO_OUTPUTS,
  power: boost.POWER_OUTPUTS,
  'boost-for-power': boost.BOOST_FOR_POWER_OUTPUTS,
  airflow: airflow.OUTPUTS,
  injectors: fuel.INJECTOR_OUTPUTS,
  'fuel-pump': fuel.PUMP_OUTPUTS,
});

/** Endpoint -> outputs as [[name, kind or nested list], ...], from the generated export. */
export const OUTPUT_ORDER = Object.freeze(Object.fromEntries(
  Object.entries(api.endpoints).map(([name, e]) => [name, e.output_order]),
));
