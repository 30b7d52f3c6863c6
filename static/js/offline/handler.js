// The offline API: answers a `POST /api/v1/<endpoint>` body in the browser with the same
// JSON as the server (SPEC section 7), marked `"computed_on": "device"`.
// mirrors webcalc/api/__init__.py (calculate and the JSON error cases of the view).
//
// Runs inside a module service worker: no DOM, no fetch, no dynamic import; all data
// (fields, units, messages, catalogs) comes from the generated ES modules.

import api from '../../generated/fields.js';
import { CALCULATIONS, OUTPUT_ORDER } from '../calc/index.js';
import { InputError, NotFiniteError } from '../calc/common.js';
import { FieldError, parseFields } from './fields.js';
import { negotiate } from './i18n.js';
import { checkOutputUnits, errorBody, flatKinds, render } from './respond.js';
import { isObject } from './units.js';

/** Endpoint -> exported field definitions. mirrors webcalc/api/schemas.py ENDPOINTS */
export const ENDPOINTS = Object.freeze(Object.fromEntries(
  Object.entries(api.endpoints).map(([name, e]) => [name, e.fields]),
));
/** Endpoint -> {flat field name: kind}. mirrors KINDS */
export const KINDS = Object.freeze(Object.fromEntries(
  Object.keys(ENDPOINTS).map((name) => [name, flatKinds(ENDPOINTS[name], OUTPUT_ORDER[name])]),
));
/** The largest body the server accepts, [bytes]. mirrors MAX_BODY */
export const MAX_BODY = 64 * 1024;

const own = (obj, key) => Object.prototype.hasOwnProperty.call(obj, key);

/** True when a JSON value holds a number that JSON cannot write (Infinity, NaN). */
function hasNonFinite(value) {
  if (typeof value === 'number') return !Number.isFinite(value);
  if (Array.isArray(value)) return value.some(hasNonFinite);
  if (value !== null && typeof value === 'object') return Object.values(value).some(hasNonFinite);
  return false;
}

/**
 * Validate, calculate and render one request body: [status, JSON body]. mirrors `calculate`
 * @param {string} endpoint
 * @param {object} body the request's JSON object
 * @param {string} locale a negotiated locale
 */
export function calculate(endpoint, body, locale) {
  const errors = [];
  const inp = parseFields(ENDPOINTS[endpoint], body, '', errors);
  if (own(inp, 'output_units')) errors.push(...checkOutputUnits(inp.output_units, KINDS[endpoint]));
  if (errors.length) return [400, errorBody(locale, 'invalid_request', errors)];
  try {
    const result = CALCULATIONS[endpoint](inp);
    const out = render(inp, result, OUTPUT_ORDER[endpoint], KINDS[endpoint], locale);
    // never Infinity in JSON: a finite SI value can overflow in its output unit
    if (hasNonFinite(out)) throw new NotFiniteError('not finite');
    return [200, out];
  } catch (exc) {
    if (exc instanceof InputError) {
      return [400, errorBody(locale, 'invalid_request', [new FieldError(exc.path, exc.code, exc.params)])];
    }
    if (exc instanceof NotFiniteError) {
      const names = Object.keys(body).filter((k) => !['units', 'output_units', 'lang'].includes(k));
      return [400, errorBody(locale, 'invalid_request', names.map((n) => new FieldError(n, 'not_finite')))];
    }
    throw exc; // a bug of the offline engine (the server would answer 500)
  }
}

/** Parse a request text as the server does (NaN and Infinity are not JSON). */
function readJson(text) {
  if (new TextEncoder().encode(text).length > MAX_BODY) return [413, 'too_large'];
  try {
    return [200, JSON.parse(text)];
  } catch {
    return [400, 'malformed_json'];
  }
}

/**
 * Answer `POST /api/v1/<endpoint>` on the device.
 *
 * @param {string} endpoint the path segment after `/api/v1/` (`site`, `power`, ...)
 * @param {object|string} body the request's parsed JSON (or its text, parsed here as the
 *   server parses it)
 * @param {?string} lang the request's `lang` query parameter (or the caller's choice of
 *   language); when absent, the body's `lang` field is used, as on the server
 * @param {?string} [acceptLanguage] the request's Accept-Language header, if any
 * @returns {Promise<{status: number, body: object}>} the server's status and JSON, with
 *   `"computed_on": "device"` in successful bodies
 */
export async function handle(endpoint, body, lang = null, acceptLanguage = null) {
  // Errors before the body is read take their language from the query and header only.
  const early = negotiate(lang, acceptLanguage);
  if (typeof endpoint !== 'string' || !own(ENDPOINTS, endpoint)) {
    return { status: 404, body: errorBody(early, 'not_found') };
  }
  let data = body;
  if (typeof body === 'string') {
    const [status, parsed] = readJson(body);
    if (status !== 200) return { status, body: errorBody(early, parsed) };
    data = parsed;
  }
  if (!isObject(data)) return { status: 400, body: errorBody(early, 'not_object') };
  const explicit = typeof lang === 'string' ? lang : (typeof data.lang === 'string' ? data.lang : null);
  const locale = negotiate(explicit, acceptLanguage);
  const [status, out] = calculate(endpoint, data, locale);
  if (hasNonFinite(out)) return { status: 400, body: errorBody(locale, 'not_finite') };
  return { status, body: out };
}
