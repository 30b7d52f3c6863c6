// Units at the edge of the offline engine: parsing and formatting with the closed unit
// table. mirrors webcalc/units.py (parsing and formatting only; the table and its
// factors are generated from the Python side by tools/generate.py, never typed in here).
//
// Works in a module service worker: no DOM, no fetch; the table is an imported module.

import table from '../../generated/units.js';

/** Dimension -> accepted spellings, in the binding table's order. mirrors UNITS */
export const UNITS = Object.freeze(Object.fromEntries(
  table.dimension_order.map((d) => [d, Object.freeze([...table.spelling_order[d]])]),
));
/** Output kinds: {dimensions, metric, imperial, si}. mirrors KINDS */
export const KINDS = table.kinds;
/** mirrors SYSTEMS */
export const SYSTEMS = Object.freeze([...table.systems]);
/** mirrors GAUGE_ABSOLUTE_SPELLINGS */
export const GAUGE_ABSOLUTE_SPELLINGS = Object.freeze([...table.gauge_absolute_spellings]);

// Python's str.isspace() characters: what `\s` matches in a Python `re` str pattern and
// what str.strip() removes (JavaScript's \s and trim() differ on a few of them).
const WS = '\\t\\n\\x0b\\x0c\\r\\x1c-\\x1f \\x85\\xa0\\u1680\\u2000-\\u200a\\u2028\\u2029\\u202f\\u205f\\u3000';
const S = `[${WS}]`;
const NOT_S = `[^${WS}]`;
// ASCII digits only: the spec's grammar (Python's `\d` also takes other scripts' digits).
const NUMBER = '[+-]?(?:[0-9]+(?:\\.[0-9]*)?|\\.[0-9]+)(?:[eE][+-]?[0-9]+)?';
// `.` of Python matches anything but "\n" (JavaScript's also stops at \r, \u2028, \u2029).
// A unit starts with a letter or the degree sign.
const QUANTITY = new RegExp(`^${S}*(${NUMBER})${S}*([A-Za-z\u00b0](?:[^\\n]*${NOT_S})?)${S}*$`);
const PERCENT = new RegExp(`^${S}*(${NUMBER})${S}*%${S}*$`);
const PLAIN_NUMBER = new RegExp(`^${S}*(${NUMBER})${S}*$`);
const STRIP = new RegExp(`^${S}+|${S}+$`, 'g');

/** A quantity that cannot be read: `code` names the problem, `params` fill its message. */
export class UnitError extends Error {
  constructor(code, params = {}) {
    super(code);
    this.name = 'UnitError';
    this.code = code;
    this.params = params;
  }
}

/** Python's str.strip() (no arguments). */
export function pyStrip(text) {
  return text.replace(STRIP, '');
}

/** Length in code points, as Python's len() of a str. */
export function pyLength(text) {
  let n = 0;
  for (const _ of text) n += 1; // eslint-disable-line no-unused-vars
  return n;
}

const own = (obj, key) => Object.prototype.hasOwnProperty.call(obj, key);

/** A plain JSON object (not null, not an array), as Python's isinstance(x, dict). */
export function isObject(x) {
  return x !== null && typeof x === 'object' && !Array.isArray(x);
}

/** (factor, offset) so that `SI = value * factor + offset`. mirrors `conversion` */
export function conversion(dimension, unit) {
  const entry = table.dimensions[dimension][unit];
  return [entry.factor, entry.offset];
}

/** Dimension of an accepted spelling, or null. mirrors `dimension_of` */
export function dimensionOf(unit) {
  for (const [dimension, spellings] of Object.entries(UNITS)) {
    if (spellings.includes(unit)) return dimension;
  }
  return null;
}

/** Accepted spellings for a field that takes these dimensions, in table order. mirrors `accepted` */
export function accepted(dimensions) {
  return dimensions.flatMap((d) => UNITS[d]);
}

/**
 * Convert `value` in `unit` to SI for a field accepting `dimensions` (fuel flows: in the
 * first dimension's SI unit, converting mass and volume with `density` [kg/m^3]).
 * mirrors `to_si`
 * @throws {UnitError} unknown spelling, gauge/absolute spelling, wrong dimension
 */
export function toSi(value, unit, dimensions, density = null) {
  if (GAUGE_ABSOLUTE_SPELLINGS.includes(unit)) throw new UnitError('unit_gauge_absolute', { unit });
  const dimension = dimensionOf(unit);
  if (dimension === null) throw new UnitError('unit_unknown', { unit, accepted: accepted(dimensions).join(', ') });
  if (!dimensions.includes(dimension)) {
    throw new UnitError('unit_wrong_dimension', { unit, accepted: accepted(dimensions).join(', ') });
  }
  const [factor, offset] = conversion(dimension, unit);
  let si = value * factor + offset;
  if (dimension !== dimensions[0]) si = dimension === 'volume_flow' ? si * density : si / density;
  return si;
}

/** Inverse of toSi: an SI value of the field's first dimension in `unit`. mirrors `from_si` */
export function fromSi(si, unit, dimensions, density = null) {
  const dimension = dimensionOf(unit);
  let value = si;
  if (dimension !== dimensions[0]) value = dimension === 'volume_flow' ? value / density : value * density;
  const [factor, offset] = conversion(dimension, unit);
  return (value - offset) / factor;
}

/** A finite JSON number that is not a boolean. mirrors `is_number` */
export function isNumber(x) {
  return typeof x === 'number' && Number.isFinite(x);
}

/**
 * Split a quantity input into [number, unit spelling]: `"15 psi"` or
 * `{"value": 15, "unit": "psi"}`. mirrors `parse_quantity`
 * @throws {UnitError} `quantity_bare_number`, `quantity_format`
 */
export function parseQuantity(raw) {
  if (isObject(raw)) {
    const keys = Object.keys(raw);
    if (keys.length !== 2 || !own(raw, 'value') || !own(raw, 'unit')) throw new UnitError('quantity_format');
    const { value, unit } = raw;
    if (!isNumber(value) || typeof unit !== 'string') throw new UnitError('quantity_format');
    return [value, pyStrip(unit)];
  }
  if (isNumber(raw)) throw new UnitError('quantity_bare_number');
  if (typeof raw === 'string' && pyLength(raw) <= 100) {
    if (PLAIN_NUMBER.test(raw)) throw new UnitError('quantity_bare_number');
    const match = QUANTITY.exec(raw);
    if (match) {
      const value = Number(match[1]);
      if (Number.isFinite(value)) return [value, match[2]];
    }
  }
  throw new UnitError('quantity_format');
}

/** A dimensionless input: a number, or a string with `%` (`"80 %"` is 0.8). mirrors `parse_fraction` */
export function parseFraction(raw) {
  if (isNumber(raw)) return raw;
  if (typeof raw === 'string' && pyLength(raw) <= 100) {
    let match = PERCENT.exec(raw);
    if (match) return Number(match[1]) / 100.0;
    match = PLAIN_NUMBER.exec(raw);
    if (match) return Number(match[1]);
  }
  throw new UnitError('fraction_format');
}

/** The output unit of a kind in a unit system. mirrors `system_unit` */
export function systemUnit(kind, system) {
  return KINDS[kind][system];
}

/** An output quantity `{value, unit}` (null stays null; -0 becomes 0). mirrors `quantity` */
export function quantity(si, kind, unit, density = null) {
  if (si === null || si === undefined) return null;
  const value = fromSi(Number(si), unit, KINDS[kind].dimensions, density);
  return { value: value + 0.0, unit };
}
