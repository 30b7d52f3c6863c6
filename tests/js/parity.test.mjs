// Parity of the offline API (static/js/offline/handler.js) with the server: every vector
// that tools/parity_vectors.py recorded from the real Flask API is answered by handle()
// and compared by the rules of tests/js/parity_compare.mjs (SPEC section 7).
// Run: node --test tests/js/

import { test } from 'node:test';
import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';

import { handle, ENDPOINTS, KINDS } from '../../static/js/offline/handler.js';
import { OUTPUTS, OUTPUT_ORDER } from '../../static/js/calc/index.js';
import { formatG6 } from '../../static/js/offline/fields.js';
import { negotiate } from '../../static/js/offline/i18n.js';
import { compareAnswer, makeStats } from './parity_compare.mjs';

const data = JSON.parse(readFileSync(new URL('./parity_vectors.json', import.meta.url), 'utf8'));

/** Run one vector through handle(), as the service worker would. */
export function answer(vector) {
  const body = vector.raw !== undefined ? vector.raw : vector.request;
  return handle(vector.endpoint, body, vector.query_lang ?? null, vector.accept_language ?? null);
}

test('the vectors file is the expected format and size', () => {
  assert.equal(data.format, 1);
  assert.ok(data.vectors.length >= 1000, `only ${data.vectors.length} vectors`);
  const endpoints = new Set(data.vectors.map((v) => v.endpoint));
  for (const name of Object.keys(ENDPOINTS)) assert.ok(endpoints.has(name), `no vector for ${name}`);
  const statuses = new Set(data.vectors.map((v) => v.status));
  for (const status of [200, 400, 404, 413]) assert.ok(statuses.has(status), `no vector with status ${status}`);
});

test('the JS outputs tables mirror the Python ones, key order included', () => {
  const asOrder = (spec) => Object.entries(spec).map(([k, v]) => [k, v !== null && typeof v === 'object' ? asOrder(v) : v]);
  for (const [name, spec] of Object.entries(OUTPUTS)) {
    assert.deepStrictEqual(asOrder(spec), OUTPUT_ORDER[name], name);
  }
  assert.deepStrictEqual(Object.keys(OUTPUTS).sort(), Object.keys(ENDPOINTS).sort());
  // output_units may name inputs and outputs, nested rows included; not the row containers
  assert.equal(KINDS.power.get('causes'), undefined);
  assert.equal(KINDS.power.get('power'), 'power');
  assert.equal(KINDS['pressure-ratio'].get('pressure_ratio'), null);
});

test('formatG6 writes numbers as Python f"{x:.6g}" does', () => {
  // Python 3.11: format(x, ".6g") for each value (the values were run through Python and
  // pasted here); ties go to even on the exact binary value.
  const cases = [
    [0, '0'], [-0, '-0'], [1, '1'], [0.3, '0.3'], [101.52632, '101.526'], [1234565, '1.23456e+06'],
    [1234575, '1.23458e+06'], [1e-5, '1e-05'], [123456.5, '123456'], [999999.5, '1e+06'], [9999995, '1e+07'],
    [5e-324, '4.94066e-324'], [-610 / 0.3048, '-2001.31'], [3.3793188213431184e-08, '3.37932e-08'],
    [1e16, '1e+16'], [0.0001, '0.0001'], [0.00012345678, '0.000123457'], [100000, '100000'],
    [1e6, '1e+06'], [Infinity, 'inf'], [-Infinity, '-inf'], [NaN, 'nan'], [2.5, '2.5'],
  ];
  for (const [x, text] of cases) assert.equal(formatG6(x), text, `formatG6(${x})`);
  for (const [x, text] of data.format_g6 ?? []) assert.equal(formatG6(x), text, `formatG6(${x})`);
});

test('language negotiation falls back to English as webcalc/i18n.py does', () => {
  assert.equal(negotiate(null, null), 'en');
  assert.equal(negotiate('xx', 'yy, *'), 'en');
  assert.equal(negotiate(' en-GB ', null), 'en');
  assert.equal(negotiate(null, 'sv-SE,ja;q=0.8'), 'en');
  assert.equal(negotiate(null, 'fr-CA,en;q=0.8'), 'fr');
  assert.equal(negotiate('pt-PT', null), 'pt_BR');
  assert.equal(negotiate('pt', null), 'pt_BR');
  assert.equal(negotiate('DE-at', null), 'de');
});

const stats = makeStats();
const byEndpoint = new Map();
for (const vector of data.vectors) {
  if (!byEndpoint.has(vector.endpoint)) byEndpoint.set(vector.endpoint, []);
  byEndpoint.get(vector.endpoint).push(vector);
}
for (const [endpoint, vectors] of byEndpoint) {
  test(`${endpoint}: ${vectors.length} vectors answer as the server does`, async () => {
    const failures = [];
    for (const vector of vectors) {
      try {
        compareAnswer(vector, await answer(vector), stats);
      } catch (err) {
        failures.push(err.message);
      }
    }
    assert.equal(failures.length, 0, `${failures.length} of ${vectors.length} differ:\n${failures.slice(0, 8).join('\n')}`);
  });
}

test('summary of deviations', (t) => {
  assert.ok(stats.numbers > 10000, `only ${stats.numbers} numbers compared`);
  t.diagnostic(`vectors: ${data.vectors.length}, numbers compared: ${stats.numbers}, bit-identical: ${stats.identical}`);
  t.diagnostic(`max relative deviation (SI): ${stats.maxRelSi.toExponential(3)} at ${stats.maxRelSiAt}`);
  t.diagnostic(`max absolute deviation (SI): ${stats.maxAbsSi.toExponential(3)} at ${stats.maxAbsSiAt}`);
  t.diagnostic(`strings compared: ${stats.strings}; messages with numbers: ${stats.maskedMessages}, byte-identical: ${stats.maskedIdentical}`);
});
