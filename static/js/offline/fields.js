// Field definitions of the offline engine: parse raw JSON values into SI, check hard
// ranges, collect errors. mirrors webcalc/api/fields.py, reading the field definitions
// that tools/generate.py exports (static/generated/fields.js) instead of typing them in:
// quantity / fraction / number / count / choice / text / object / list / unit_map.

import * as units from './units.js';

/** One bad field: its dotted path, a message code and the message's parameters. mirrors FieldError */
export class FieldError extends Error {
  constructor(path, code, params = {}) {
    super(`${path}: ${code}`);
    this.name = 'FieldError';
    this.path = path;
    this.code = code;
    this.params = params;
  }
}

/**
 * A fuel flow that came as mass or volume: [SI value, its dimension]; the calculation
 * converts it with the fuel density once the fuel is known. mirrors FlowValue
 */
export class FlowValue {
  constructor(si, dimension) {
    this.si = si;
    this.dimension = dimension;
    Object.freeze(this);
  }

  to(dimension, density) {
    if (this.dimension === dimension) return this.si;
    return this.dimension === 'volume_flow' ? this.si * density : this.si / density;
  }
}

/**
 * Round a decimal digit string (no sign, no point) to `n` digits, ties to even, as the
 * exact binary value is rounded by Python's formatting. Returns [digits, carry].
 */
function roundDigits(digits, n) {
  if (digits.length <= n) return [digits.padEnd(n, '0'), 0];
  const head = digits.slice(0, n);
  const next = digits.charCodeAt(n) - 48;
  const rest = digits.slice(n + 1);
  const restZero = !/[1-9]/.test(rest);
  let up = next > 5 || (next === 5 && !restZero);
  if (next === 5 && restZero) up = (head.charCodeAt(n - 1) - 48) % 2 === 1; // exact tie: to even
  if (!up) return [head, 0];
  const out = head.split('');
  let i = n - 1;
  while (i >= 0) {
    if (out[i] === '9') {
      out[i] = '0';
      i -= 1;
    } else {
      out[i] = String.fromCharCode(out[i].charCodeAt(0) + 1);
      break;
    }
  }
  if (i < 0) return [`1${out.join('').slice(0, n - 1)}`, 1];
  return [out.join(''), 0];
}

/**
 * Python's `f"{x:.6g}"`: six significant digits, round half to even on the exact binary
 * value, fixed notation for exponents -4 to 5, else `d.ddddde+XX`; trailing zeros and a
 * trailing point removed; `inf`, `-inf`, `nan`, `-0` as Python writes them.
 * @param {number} x
 * @returns {string}
 */
export function formatG6(x) {
  const precision = 6;
  if (Number.isNaN(x)) return 'nan';
  if (x === Infinity) return 'inf';
  if (x === -Infinity) return '-inf';
  const sign = x < 0 || Object.is(x, -0) ? '-' : '';
  const a = Math.abs(x);
  if (a === 0) return `${sign}0`;
  // toExponential(99) gives 100 correctly rounded significant digits: the exact decimal
  // expansion for all but extreme values (whose later digits cannot make a tie at the 7th).
  const [mantissa, expText] = a.toExponential(99).split('e');
  let exponent = Number(expText);
  let [digits, carry] = roundDigits(mantissa.replace('.', ''), precision);
  exponent += carry;
  if (exponent >= -4 && exponent < precision) {
    let text;
    if (exponent >= 0) {
      text = `${digits.slice(0, exponent + 1)}.${digits.slice(exponent + 1)}`;
    } else {
      text = `0.${'0'.repeat(-exponent - 1)}${digits}`;
    }
    text = text.replace(/\.?0+$/, '');
    if (text.endsWith('.')) text = text.slice(0, -1);
    return sign + text;
  }
  digits = digits.replace(/0+$/, '');
  const body = digits.length > 1 ? `${digits[0]}.${digits.slice(1)}` : digits;
  const expSign = exponent < 0 ? '-' : '+';
  return `${sign}${body}e${expSign}${String(Math.abs(exponent)).padStart(2, '0')}`;
}

/** Relative distance from a closed range end that counts as the end. mirrors RANGE_END_TOLERANCE */
const RANGE_END_TOLERANCE = 1e-12;

function checkRange(field, si, path, show = (v) => v, unit = '') {
  const lo = field.min;
  const hi = field.max;
  // A closed end typed in another unit ("-60 degC" is 213.14999999999998 K) is that end.
  for (const [end, isOpen] of [[lo, field.min_open], [hi, field.max_open]]) {
    if (end !== null && end !== undefined && !isOpen && Math.abs(si - end) <= RANGE_END_TOLERANCE * Math.abs(end)) si = end;
  }
  const bad = (lo !== null && lo !== undefined && (si < lo || (field.min_open && si === lo)))
    || (hi !== null && hi !== undefined && (si > hi || (field.max_open && si === hi)));
  if (bad || !Number.isFinite(si)) {
    const min = lo === null || lo === undefined ? -Infinity : lo;
    const max = hi === null || hi === undefined ? Infinity : hi;
    const code = (field.min_open ? 'range_above' : 'range') + (unit ? '' : '_plain');
    const params = { min: formatG6(show(min)), max: formatG6(show(max)) };
    if (unit) params.unit = unit;
    throw new FieldError(path, code, params);
  }
  return si;
}

function parseQuantityField(field, raw, path) {
  const dimensions = units.KINDS[field.kind].dimensions;
  let number;
  let unit;
  let dimension;
  try {
    [number, unit] = units.parseQuantity(raw);
    dimension = units.dimensionOf(unit);
    units.toSi(number, unit, dimensions, 1.0); // checks the spelling
  } catch (exc) {
    if (exc instanceof units.UnitError) throw new FieldError(path, exc.code, exc.params);
    throw exc;
  }
  const [factor, offset] = units.conversion(dimension, unit);
  const si = number * factor + offset;
  if (!Number.isFinite(si)) throw new FieldError(path, 'number_format');
  if (dimensions.length > 1) return new FlowValue(checkRange(field, si, path, (v) => v / factor, unit), dimension);
  return checkRange(field, si, path, (v) => (v - offset) / factor, unit);
}

const PARSERS = {
  quantity: parseQuantityField,
  fraction(field, raw, path) {
    let value;
    try {
      value = units.parseFraction(raw);
    } catch (exc) {
      if (exc instanceof units.UnitError) throw new FieldError(path, exc.code);
      throw exc;
    }
    return checkRange(field, value, path);
  },
  number(field, raw, path) {
    if (!units.isNumber(raw)) throw new FieldError(path, 'number_format');
    return checkRange(field, raw, path);
  },
  count(field, raw, path) {
    if (!units.isNumber(raw) || !Number.isInteger(raw)) throw new FieldError(path, 'count_format');
    return checkRange(field, raw, path) + 0;
  },
  choice(field, raw, path) {
    if (typeof raw !== 'string' || !field.choices.includes(raw)) {
      throw new FieldError(path, 'choice', { choices: field.choices.join(', ') });
    }
    return raw;
  },
  text(field, raw, path) {
    if (typeof raw !== 'string' || units.pyLength(raw) > 35) throw new FieldError(path, 'string');
    return raw;
  },
  object(field, raw, path, errors) {
    if (!units.isObject(raw)) throw new FieldError(path, 'object');
    return parseFields(field.fields, raw, `${path}.`, errors);
  },
  list(field, raw, path, errors) {
    if (!Array.isArray(raw)) throw new FieldError(path, 'list');
    if (!(field.min_items <= raw.length && raw.length <= field.max_items)) {
      throw new FieldError(path, 'list_length', { min: field.min_items, max: field.max_items });
    }
    return raw.map((value, i) => {
      try {
        return parseField(field.item, value, `${path}[${i}]`, errors);
      } catch (exc) {
        if (!(exc instanceof FieldError)) throw exc;
        errors.push(exc);
        return null;
      }
    });
  },
  unit_map(field, raw, path, errors) {
    if (!units.isObject(raw) || Object.keys(raw).length > 100) throw new FieldError(path, 'object');
    for (const [key, value] of Object.entries(raw)) {
      if (typeof value !== 'string') errors.push(new FieldError(`${path}.${key}`, 'string'));
    }
    return { ...raw };
  },
};

/** Parse one raw value against an exported field definition (throws FieldError). */
export function parseField(field, raw, path, errors) {
  const parser = PARSERS[field.type];
  if (!parser) throw new TypeError(`unknown field type ${field.type}`);
  return parser(field, raw, path, errors);
}

/**
 * Parse a JSON object against field definitions; collect every error (unknown keys
 * first, then the fields in their order); return {name: value}. mirrors `parse_fields`
 */
export function parseFields(fields, raw, prefix, errors) {
  const known = new Set(fields.map((f) => f.name));
  const out = {};
  for (const key of Object.keys(raw)) {
    if (!known.has(key)) errors.push(new FieldError(prefix + key, 'unknown_field'));
  }
  for (const field of fields) {
    const path = prefix + field.name;
    if (!Object.prototype.hasOwnProperty.call(raw, field.name) || raw[field.name] === null) {
      if (field.required) errors.push(new FieldError(path, 'required'));
      continue;
    }
    try {
      out[field.name] = parseField(field, raw[field.name], path, errors);
    } catch (exc) {
      if (!(exc instanceof FieldError)) throw exc;
      errors.push(exc);
    }
  }
  return out;
}
