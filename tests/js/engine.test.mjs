// Parity of the JavaScript engine (static/js/engine) with the Python engine
// (webcalc/engine), checked against the vectors that tools/engine_vectors.py writes from
// the Python functions. Run: node --test tests/js/
//
// Two bounds are held for every number:
// - the binding parity tolerance of SPEC section 7, |a - b| <= 1e-9 max(|a|, |b|) + 1e-6
//   (SI units), which is what the offline API promises;
// - a tighter engine bound, |a - b| <= 1e-12 max(|a|, |b|): the 1e-6 floor alone would
//   let a wrong formula through for small SI quantities (a BSFC in kg/J is about 1e-7,
//   a fuel flow in m^3/s about 1e-5). The JS code keeps the Python operation order, so
//   results agree to the last bit or two of the libm functions (pow, exp, sqrt).
//   The one exception is the boost answered by the root find: a root right on a grid
//   point may be bracketed from the other side, so the two midpoints can differ by up to
//   the bisection width (1e-6 Pa), which is the bound used there.

import { test } from 'node:test';
import assert from 'node:assert/strict';
import { existsSync, readFileSync } from 'node:fs';

import * as constants from '../../static/js/engine/constants.js';
import * as atmosphere from '../../static/js/engine/atmosphere.js';
import * as compressor from '../../static/js/engine/compressor.js';
import * as power from '../../static/js/engine/power.js';
import * as airflow from '../../static/js/engine/airflow.js';
import * as fuel from '../../static/js/engine/fuel.js';

const MODULES = { constants, atmosphere, compressor, power, airflow, fuel };
/** Exports of the JS engine with no Python counterpart. */
const JS_ONLY = new Set(['constants.deepFreeze']);

const vectors = JSON.parse(readFileSync(new URL('./engine_vectors.json', import.meta.url), 'utf8'));
const PARITY_REL = vectors.tolerance.relative;
const PARITY_ABS = vectors.tolerance.absolute;
const ENGINE_REL = 1e-12;

/** Python snake_case name to the JS camelCase name (`T_na` -> `TNa`). */
const camel = (name) => name.replace(/_([A-Za-z0-9])/g, (_, ch) => ch.toUpperCase());
const camelKeys = (obj) => Object.fromEntries(Object.entries(obj).map(([k, v]) => [camel(k), v]));

function describe(c) {
  const kw = c.kwargs ?? c.expected_power_kwargs;
  return `${c.fn}(${JSON.stringify(c.args)}${kw ? `, ${JSON.stringify(kw)}` : ''})${c.note ? ` [${c.note}]` : ''}`;
}

/** Call the JS mirror of a vector's Python function. */
function run(c) {
  const [moduleName, pyName] = c.fn.split('.');
  const fn = MODULES[moduleName][camel(pyName)];
  assert.equal(typeof fn, 'function', `${c.fn} has no JS mirror ${moduleName}.${camel(pyName)}`);
  if (c.expected_power_kwargs) {
    const options = camelKeys(c.expected_power_kwargs);
    return fn(...c.args, (boost) => power.expectedPower(boost, options).expected);
  }
  if (c.kwargs) return fn(...c.args, camelKeys(c.kwargs));
  return fn(...c.args);
}

const stats = { numbers: 0, identical: 0, maxRel: 0, maxRelAt: '', maxAbs: 0, maxAbsAt: '', maxRelClosed: 0, maxRelClosedAt: '' };

function relativeDeviation(a, b) {
  const scale = Math.max(Math.abs(a), Math.abs(b));
  return scale === 0 ? 0 : Math.abs(a - b) / scale;
}

/** Compare a Python result (JSON) with the JS result, recursively. */
function compare(expect, actual, where, isRootBoost) {
  if (typeof expect === 'number') {
    assert.equal(typeof actual, 'number', `${where}: expected a number, got ${actual}`);
    assert.ok(Number.isFinite(actual), `${where}: not finite: ${actual}`);
    const diff = Math.abs(expect - actual);
    const scale = Math.max(Math.abs(expect), Math.abs(actual));
    const rel = relativeDeviation(expect, actual);
    stats.numbers += 1;
    if (diff === 0) stats.identical += 1;
    if (rel > stats.maxRel) [stats.maxRel, stats.maxRelAt] = [rel, where];
    if (diff > stats.maxAbs) [stats.maxAbs, stats.maxAbsAt] = [diff, where];
    if (!isRootBoost && rel > stats.maxRelClosed) [stats.maxRelClosed, stats.maxRelClosedAt] = [rel, where];
    assert.ok(
      diff <= PARITY_REL * scale + PARITY_ABS,
      `${where}: Python ${expect}, JS ${actual}: outside the parity tolerance of SPEC section 7`,
    );
    if (isRootBoost) {
      assert.ok(diff <= power.BISECTION_WIDTH, `${where}: Python ${expect}, JS ${actual}: more than the bisection width apart`);
    } else {
      assert.ok(diff <= ENGINE_REL * scale, `${where}: Python ${expect}, JS ${actual}: relative deviation ${rel}`);
    }
    return;
  }
  if (Array.isArray(expect)) {
    assert.ok(Array.isArray(actual), `${where}: expected an array, got ${JSON.stringify(actual)}`);
    assert.equal(actual.length, expect.length, `${where}: length`);
    expect.forEach((item, i) => compare(item, actual[i], `${where}[${i}]`, isRootBoost && i === 0));
    return;
  }
  if (expect !== null && typeof expect === 'object') {
    assert.ok(actual !== null && typeof actual === 'object', `${where}: expected an object`);
    assert.deepEqual(Object.keys(actual).sort(), Object.keys(expect).map(camel).sort(), `${where}: keys`);
    for (const key of Object.keys(expect)) compare(expect[key], actual[camel(key)], `${where}.${camel(key)}`, false);
    return;
  }
  assert.equal(actual, expect, `${where}`); // booleans and null
}

test('the vectors file is the expected format and covers the engine', () => {
  assert.equal(vectors.format, 1);
  assert.ok(vectors.cases.length >= 300, `only ${vectors.cases.length} vectors`);
  const covered = new Set(vectors.cases.map((c) => c.fn));
  for (const [moduleName, names] of Object.entries(vectors.functions)) {
    for (const name of names) {
      assert.ok(covered.has(`${moduleName}.${name}`), `no vector for ${moduleName}.${name}`);
    }
  }
});

test('every Python function has a JS mirror and every JS function a Python original', () => {
  for (const [moduleName, names] of Object.entries(vectors.functions)) {
    const mod = MODULES[moduleName];
    assert.ok(mod, `no JS module for webcalc/engine/${moduleName}.py`);
    const pyNames = new Set(names.map(camel));
    for (const name of pyNames) assert.equal(typeof mod[name], 'function', `${moduleName}.js lacks ${name}`);
    for (const [name, value] of Object.entries(mod)) {
      if (typeof value === 'function' && !JS_ONLY.has(`${moduleName}.${name}`)) {
        assert.ok(pyNames.has(name), `${moduleName}.js exports ${name}, which webcalc/engine/${moduleName}.py lacks`);
      }
    }
  }
  assert.deepEqual(Object.keys(MODULES).sort(), Object.keys(vectors.functions).sort());
});

test('data tables and constants equal the Python ones', () => {
  for (const [moduleName, tables] of Object.entries(vectors.tables)) {
    const mod = MODULES[moduleName];
    for (const [name, value] of Object.entries(tables)) {
      assert.ok(name in mod, `${moduleName}.js lacks ${name}`);
      assert.deepStrictEqual(JSON.parse(JSON.stringify(mod[name])), value, `${moduleName}.${name}`);
    }
    for (const [name, value] of Object.entries(mod)) {
      if (typeof value !== 'function') assert.ok(name in tables, `${moduleName}.js exports ${name}, unknown to Python`);
    }
  }
});

// The browser tables generated from Python (static/generated/engine.json) must hold the
// same values as the tables typed into the JS modules, until the modules read that file.
const GENERATED = new URL('../../static/generated/engine.json', import.meta.url);
test('data tables equal the generated static/generated/engine.json', { skip: !existsSync(GENERATED) && 'not generated yet' }, () => {
  const generated = JSON.parse(readFileSync(GENERATED, 'utf8'));
  const plain = (value) => JSON.parse(JSON.stringify(value));
  assert.deepStrictEqual(plain(Object.fromEntries(Object.entries(constants).filter(([, v]) => typeof v !== 'function'))), generated.constants);
  for (const [moduleName, valid] of Object.entries(generated.valid)) {
    assert.deepStrictEqual(plain(MODULES[moduleName].VALID), valid, `${moduleName}.VALID`);
  }
  for (const [key, value] of Object.entries(generated)) {
    if (['constants', 'valid', 'thresholds'].includes(key)) continue; // thresholds belong to the calculation layer
    const name = key.toUpperCase();
    const owners = Object.entries(MODULES).filter(([, mod]) => name in mod);
    assert.equal(owners.length, 1, `${name} should be exported by exactly one JS engine module`);
    assert.deepStrictEqual(plain(owners[0][1][name]), value, `${owners[0][0]}.${name}`);
  }
});

test('data tables cannot be changed by a caller', () => {
  assert.throws(() => {
    fuel.FUELS.gasoline.density = 700;
  }, TypeError);
  assert.throws(() => {
    atmosphere.VALID.altitude[0] = -1000;
  }, TypeError);
  assert.equal(fuel.FUELS.gasoline.density, 745.0);
});

const byFunction = new Map();
for (const [index, c] of vectors.cases.entries()) {
  if (!byFunction.has(c.fn)) byFunction.set(c.fn, []);
  byFunction.get(c.fn).push([index, c]);
}

for (const [fnName, cases] of byFunction) {
  test(`${fnName}: ${cases.length} vectors agree with Python`, () => {
    const rootFind = fnName === 'power.boost_for_expected_power';
    for (const [index, c] of cases) {
      compare(c.expect, run(c), `case ${index} ${describe(c)}`, rootFind);
    }
  });
}

test('summary of deviations', (t) => {
  assert.ok(stats.numbers > 0);
  t.diagnostic(`numbers compared: ${stats.numbers}, bit-identical: ${stats.identical}`);
  t.diagnostic(`max relative deviation: ${stats.maxRel.toExponential(3)} at ${stats.maxRelAt}`);
  t.diagnostic(`max relative deviation, root-find boost left out: ${stats.maxRelClosed.toExponential(3)} at ${stats.maxRelClosedAt}`);
  t.diagnostic(`max absolute deviation (SI): ${stats.maxAbs.toExponential(3)} at ${stats.maxAbsAt}`);
});
