// Comparison of an offline answer with the server's recorded answer (SPEC section 7).
// Used by tests/js/parity.test.mjs; tests/js/parity_compare.py is its Python twin for the
// Chromium run (same rules, same tolerances).
//
// Rules:
// - same status; same keys in the same order at every level (`computed_on` left out: it
//   is "server" in the recording and must be "device" offline);
// - strings equal, except error messages that hold a number (a formatted range limit):
//   those must be equal once every number is masked, and each number must agree to the
//   six significant digits it is written with;
// - numbers: the binding tolerance |a - b| <= 1e-9 max(|a|, |b|) + 1e-6 in SI units.
//   Outputs come in display units, so a quantity {value, unit} is converted to SI with the
//   generated unit table first (both sides carry the same unit, checked); a plain number
//   (ratio, fraction, count) is its own SI value. Comparing display values with the
//   1e-6 floor would be wrong both ways: too loose in kW or bar (1e-6 kW is 1 mW), too
//   tight in nothing; converting keeps the floor where the spec puts it.
// - and a tighter check, because the SI floor alone would let real errors through for
//   small SI quantities (a BSFC is about 1e-7 kg/J, a fuel flow about 1e-5 m^3/s): every
//   number must also agree to |a - b| <= 1e-9 max(|a|, |b|) + 1e-9 in the units it is
//   written in (display units are of human size). Values that come out of the
//   boost-for-power root find are held to the binding tolerance only: the two midpoints
//   of the bisection may differ by its width (1e-6 Pa), which is more than 1e-9 relative
//   for a tiny boost.

import table from '../../static/generated/units.js';

export const REL = 1e-9;
export const FLOOR_SI = 1e-6;
export const FLOOR_DISPLAY = 1e-9;

const FACTORS = {};
for (const spellings of Object.values(table.dimensions)) {
  for (const [unit, { factor, offset }] of Object.entries(spellings)) FACTORS[unit] = [factor, offset];
}

/** Keys of endpoint outputs that come from the root find (binding tolerance only). */
const ROOT_FIND = new Set(['boost', 'manifold_pressure', 'pressure_ratio', 'manifold_temperature', 'expected_power']);

const NUMBER_IN_TEXT = /[-+]?(?:\d+\.?\d*|\.\d+)(?:e[-+]?\d+)?|-?inf|nan/g;

export function makeStats() {
  return {
    numbers: 0, identical: 0, maxRelSi: 0, maxRelSiAt: '', maxAbsSi: 0, maxAbsSiAt: '',
    strings: 0, maskedMessages: 0, maskedIdentical: 0,
  };
}

function fail(where, text) {
  throw new Error(`${where}: ${text}`);
}

function compareNumber(a, b, where, unit, rootFind, stats) {
  if (typeof b !== 'number') fail(where, `expected a number ${a}, got ${JSON.stringify(b)}`);
  if (!Number.isFinite(b)) fail(where, `not finite: ${b}`);
  const [factor, offset] = unit ? FACTORS[unit] : [1, 0];
  const aSi = a * factor + offset;
  const bSi = b * factor + offset;
  const diffSi = Math.abs(aSi - bSi);
  const scaleSi = Math.max(Math.abs(aSi), Math.abs(bSi));
  stats.numbers += 1;
  if (a === b) stats.identical += 1;
  const rel = scaleSi === 0 ? 0 : diffSi / scaleSi;
  if (rel > stats.maxRelSi) [stats.maxRelSi, stats.maxRelSiAt] = [rel, where];
  if (diffSi > stats.maxAbsSi) [stats.maxAbsSi, stats.maxAbsSiAt] = [diffSi, where];
  if (!(diffSi <= REL * scaleSi + FLOOR_SI)) {
    fail(where, `server ${a}, device ${b}${unit ? ` ${unit}` : ''}: outside the parity tolerance of SPEC section 7`);
  }
  if (!rootFind) {
    const diff = Math.abs(a - b);
    if (!(diff <= REL * Math.max(Math.abs(a), Math.abs(b)) + FLOOR_DISPLAY)) {
      fail(where, `server ${a}, device ${b}${unit ? ` ${unit}` : ''}: deviation ${diff} beyond 1e-9 relative`);
    }
  }
}

function compareMessage(a, b, where, stats) {
  if (typeof b !== 'string') fail(where, `expected a string, got ${JSON.stringify(b)}`);
  stats.strings += 1;
  if (!/\d/.test(a)) {
    if (a !== b) fail(where, `text differs:\n  server ${JSON.stringify(a)}\n  device ${JSON.stringify(b)}`);
    return;
  }
  stats.maskedMessages += 1;
  if (a === b) stats.maskedIdentical += 1;
  const mask = (t) => t.replace(NUMBER_IN_TEXT, '#');
  if (mask(a) !== mask(b)) fail(where, `text differs beyond its numbers:\n  server ${JSON.stringify(a)}\n  device ${JSON.stringify(b)}`);
  const na = a.match(NUMBER_IN_TEXT) || [];
  const nb = b.match(NUMBER_IN_TEXT) || [];
  na.forEach((x, i) => {
    const [p, q] = [Number(x), Number(nb[i])];
    const same = x === nb[i] || (Number.isFinite(p) && Math.abs(p - q) <= 5e-6 * Math.max(Math.abs(p), Math.abs(q)));
    if (!same) fail(where, `number ${i} in the message: server ${x}, device ${nb[i]}`);
  });
}

function isQuantity(v) {
  return v !== null && typeof v === 'object' && !Array.isArray(v)
    && Object.keys(v).length === 2 && typeof v.value === 'number' && typeof v.unit === 'string';
}

function compareValue(a, b, where, ctx, stats) {
  if (typeof a === 'number') return compareNumber(a, b, where, null, ctx.rootFind, stats);
  if (typeof a === 'string') {
    if (ctx.inError && ctx.key === 'message') return compareMessage(a, b, where, stats);
    stats.strings += 1;
    if (a !== b) fail(where, `text differs:\n  server ${JSON.stringify(a)}\n  device ${JSON.stringify(b)}`);
    return undefined;
  }
  if (a === null || typeof a === 'boolean') {
    if (a !== b) fail(where, `server ${JSON.stringify(a)}, device ${JSON.stringify(b)}`);
    return undefined;
  }
  if (Array.isArray(a)) {
    if (!Array.isArray(b)) fail(where, `expected a list, got ${JSON.stringify(b)}`);
    if (a.length !== b.length) fail(where, `length ${a.length} against ${b.length}`);
    a.forEach((item, i) => compareValue(item, b[i], `${where}[${i}]`, ctx, stats));
    return undefined;
  }
  if (b === null || typeof b !== 'object' || Array.isArray(b)) fail(where, `expected an object, got ${JSON.stringify(b)}`);
  if (isQuantity(a)) {
    if (!isQuantity(b)) fail(where, `expected a quantity, got ${JSON.stringify(b)}`);
    if (a.unit !== b.unit) fail(where, `unit ${a.unit} against ${b.unit}`);
    if (!(a.unit in FACTORS)) fail(where, `unit ${a.unit} is not in the unit table`);
    return compareNumber(a.value, b.value, `${where}.value`, a.unit, ctx.rootFind, stats);
  }
  const ka = Object.keys(a);
  const kb = Object.keys(b);
  if (JSON.stringify(ka) !== JSON.stringify(kb)) fail(where, `keys differ:\n  server ${ka.join(', ')}\n  device ${kb.join(', ')}`);
  for (const key of ka) {
    compareValue(a[key], b[key], `${where}.${key}`, {
      ...ctx, key, inError: ctx.inError || key === 'error', rootFind: ctx.rootFind || (ctx.bfp && ROOT_FIND.has(key)),
    }, stats);
  }
  return undefined;
}

/**
 * Compare the device's answer with a recorded vector; throws an Error naming the first
 * difference.
 * @param {object} vector {id, endpoint, status, response, ...}
 * @param {{status: number, body: object}} answer what handle() gave
 * @param {object} stats counters (makeStats())
 */
export function compareAnswer(vector, answer, stats) {
  const where = vector.id;
  if (answer.status !== vector.status) {
    fail(where, `status ${answer.status}, server ${vector.status}: ${JSON.stringify(answer.body).slice(0, 400)}`);
  }
  const expected = { ...vector.response };
  const actual = { ...answer.body };
  if (vector.status === 200) {
    if (expected.computed_on !== 'server') fail(where, 'recorded answer lacks computed_on "server"');
    if (actual.computed_on !== 'device') fail(where, `computed_on ${JSON.stringify(actual.computed_on)}, expected "device"`);
  }
  delete expected.computed_on;
  delete actual.computed_on;
  compareValue(expected, actual, where, { inError: false, key: null, rootFind: false, bfp: vector.endpoint === 'boost-for-power' }, stats);
}
