// Every user-facing message id of the API, by code (English gettext ids).
// mirrors webcalc/messages.py, built from the generated export (static/generated/fields.js).

import api from '../../generated/fields.js';

/** `${code}/${severity}` -> message id, in the order of the warning table. mirrors WARNINGS */
export const WARNINGS = Object.freeze(Object.fromEntries(api.warnings.map((w) => [`${w.code}/${w.severity}`, w.message])));
/** mirrors SEVERITY_ORDER */
export const SEVERITY_ORDER = Object.freeze([...api.severity_order]);
/** mirrors WARNING_ORDER */
export const WARNING_ORDER = Object.freeze([...api.warning_order]);
/** [code, message id] of the general cautions, in order. mirrors CAUTIONS */
export const CAUTIONS = Object.freeze(api.cautions.map((c) => Object.freeze([c.code, c.message])));
/** mirrors CAUSES */
export const CAUSES = api.causes;
/** mirrors ERRORS */
export const ERRORS = api.errors;

/** Sort key of a warning: severity first, then the warning table's order. */
export function warningRank([code, severity]) {
  return [SEVERITY_ORDER.indexOf(severity), WARNING_ORDER.indexOf(code)];
}

/** Compare two (code, severity) pairs by warningRank (for a stable Array.prototype.sort). */
export function compareWarnings(a, b) {
  const [sa, ca] = warningRank(a);
  const [sb, cb] = warningRank(b);
  return sa - sb || ca - cb;
}
