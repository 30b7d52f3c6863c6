// Turning calculation results into response JSON: units, power basis, messages, ordering.
// mirrors webcalc/api/respond.py

import * as i18n from './i18n.js';
import * as messages from './messages.js';
import * as units from './units.js';
import { FieldError } from './fields.js';
import { NotFiniteError } from '../calc/common.js';

/**
 * {flat field name: kind or null} over an endpoint's inputs (quantity fields, first
 * occurrence wins) and outputs (outputs win, nested rows included). mirrors `flat_kinds`
 * @param {object[]} fields exported field definitions
 * @param {Array} outputOrder the endpoint's outputs as [[name, kind or nested], ...]
 */
export function flatKinds(fields, outputOrder) {
  const kinds = new Map();
  const walkFields = (items) => {
    for (const f of items) {
      if (f.type === 'object') walkFields(f.fields);
      else if (f.type === 'list') walkFields([f.item]);
      else if (f.type === 'quantity' && !kinds.has(f.name)) kinds.set(f.name, f.kind);
    }
  };
  const walkOutputs = (spec) => {
    for (const [name, kind] of spec) {
      if (Array.isArray(kind)) walkOutputs(kind);
      else kinds.set(name, kind);
    }
  };
  walkFields(fields);
  walkOutputs(outputOrder);
  return kinds;
}

/** FieldErrors for output_units naming an unknown field or a unit of the wrong dimension. mirrors `check_output_units` */
export function checkOutputUnits(overrides, kinds) {
  const errors = [];
  for (const [name, unit] of Object.entries(overrides)) {
    const path = `output_units.${name}`;
    if (!kinds.has(name) || kinds.get(name) === null) {
      errors.push(new FieldError(path, 'output_unit_field'));
      continue;
    }
    if (typeof unit !== 'string') continue;
    try {
      units.toSi(1.0, unit, units.KINDS[kinds.get(name)].dimensions, 1.0);
    } catch (exc) {
      if (!(exc instanceof units.UnitError)) throw exc;
      errors.push(new FieldError(path, exc.code, exc.params));
    }
  }
  return errors;
}

const own = (obj, key) => Object.prototype.hasOwnProperty.call(obj, key);

/** Formats one result in the request's unit system, overrides and power basis. mirrors Renderer */
export class Renderer {
  constructor(inp, result, kinds, locale) {
    this.system = own(inp, 'units') ? inp.units : 'metric';
    this.overrides = own(inp, 'output_units') ? inp.output_units : {};
    this.result = result;
    this.kinds = kinds;
    this.locale = locale;
  }

  quantity(name, value, kind) {
    if (value === null || value === undefined) return null;
    if (typeof value === 'number' && !Number.isFinite(value)) throw new NotFiniteError(name);
    if (kind === null) return typeof value === 'number' ? value + 0.0 : value;
    let v = value;
    if (kind === 'power') v /= this.result.powerScale;
    const unit = (own(this.overrides, name) && this.overrides[name]) || units.systemUnit(kind, this.system);
    return units.quantity(v, kind, unit, this.result.density);
  }

  values(values, spec) {
    const out = {};
    for (const [name, kind] of spec) {
      const present = own(values, name);
      const value = present ? values[name] : undefined;
      if (Array.isArray(kind)) {
        if (Array.isArray(value)) out[name] = value.map((row) => this.values(row, kind));
        else if (value !== null && typeof value === 'object') out[name] = this.values(value, kind);
        else if (present) out[name] = null;
        continue;
      }
      if (!present) continue;
      out[name] = Array.isArray(value) || typeof value === 'string' ? value : this.quantity(name, value, kind);
    }
    return out;
  }

  assumptions() {
    const out = {};
    for (const [path, [value, kind]] of Object.entries(this.result.assumptions)) {
      const name = path.split('.').pop();
      out[path] = kind ? this.quantity(name, value, kind) : value;
    }
    return out;
  }
}

/** (code, severity) pairs sorted by severity, danger first, then the table's order. mirrors `sorted_warnings` */
export function sortedWarnings(pairs) {
  return [...pairs].sort(messages.compareWarnings);
}

/** The response body of a successful calculation. mirrors `render` (computed_on "device") */
export function render(inp, result, outputOrder, kinds, locale) {
  const r = new Renderer(inp, result, kinds, locale);
  const body = r.values(result.values, outputOrder);
  if (Array.isArray(body.causes) && body.causes.length) {
    for (const cause of body.causes) cause.message = i18n.gettext(locale, messages.CAUSES[cause.code]);
  }
  body.warnings = sortedWarnings(result.warnings).map(([code, severity]) => ({
    code, severity, message: i18n.gettext(locale, messages.WARNINGS[`${code}/${severity}`]),
  }));
  body.cautions = messages.CAUTIONS.map(([code, text]) => ({ code, message: i18n.gettext(locale, text) }));
  body.assumptions = r.assumptions();
  body.computed_on = 'device';
  return body;
}

/** The one error shape: {"error": {"message", "fields": [{"field", "message"}]}}. mirrors `error_body` */
export function errorBody(locale, code, fieldErrors = [], params = {}) {
  return {
    error: {
      message: i18n.gettext(locale, messages.ERRORS[code], params),
      fields: fieldErrors.map((e) => ({ field: e.path, message: i18n.gettext(locale, messages.ERRORS[e.code], e.params) })),
    },
  };
}
