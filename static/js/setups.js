/**
 * Engine setups: the saved document's format (`{"format": "webcalc-setups",
 * "version": 2, ...}`) and the migrations from older versions, the demo setup of a
 * first visit, and validation of anything that comes from outside (local storage, an
 * imported file, a share link).
 *
 * Format history:
 * - 1: `{format, version, active, setups: [{id, name, demo, engine}]}`.
 * - 2: each setup also has `notes`, the user's own text (at most NOTES_MAX characters;
 *   "" when none). Share links leave the notes out.
 */
import { _, format } from "./i18n.js";
import { field, siteLabels } from "./fields.js";
import { acceptedUnits } from "./units.js";

export const FORMAT = "webcalc-setups";
export const FORMAT_VERSION = 2;
/** The longest notes text of a setup (characters as JavaScript counts them). */
export const NOTES_MAX = 2000;

const q = (value, unit) => ({ value, unit });

/** Keys of the engine setup, in a stable order. */
export const ENGINE_KEYS = [
  "na_power", "na_power_basis", "na_site", "displacement", "induction", "compressor_count",
  "intercooler", "intercooler_effectiveness", "compressor_efficiency", "inlet_loss",
  "intercooler_loss", "fuel", "ethanol_content", "injector_count", "injector_flow",
  "rated_pressure", "base_fuel_pressure", "regulator", "pump_count", "pump_curve",
  "power_basis", "drivetrain_loss",
];

/** Keys of the inputs of the day (shared by the screens that use them). */
export const INPUT_KEYS = [
  "site", "boost", "target_power", "measured_power", "boost_set_where", "boost_control",
  "rpm", "max_duty", "margin", "line_loss",
];

/** A blank engine: sensible defaults, nothing invented. */
export function blankEngine() {
  return {
    na_power: null, na_power_basis: "observed",
    na_site: { source: "altitude", altitude: q(0, "m"), altimeter_setting: null,
      station_pressure: null, temperature: null, relative_humidity: null },
    displacement: null, induction: "turbo", compressor_count: 1, intercooler: true,
    intercooler_effectiveness: 0.75, compressor_efficiency: null, inlet_loss: null,
    intercooler_loss: null, fuel: "gasoline", ethanol_content: null, injector_count: null,
    injector_flow: null, rated_pressure: q(3, "bar"), base_fuel_pressure: q(3, "bar"),
    regulator: "boost_referenced", pump_count: 1, pump_curve: null, power_basis: "crank",
    drivetrain_loss: null,
  };
}

/**
 * The demo: an invented club hill-climb car (a 2.0 L four-cylinder with a turbo and an
 * air-to-air intercooler, dyno-tested near sea level, racing today at 1200 m). No real
 * person, shop, brand or engine; the numbers are plausible, not measured.
 */
export function demoEngine() {
  return {
    ...blankEngine(),
    na_power: q(150, "kW"),
    na_site: { source: "altitude", altitude: q(50, "m"), altimeter_setting: null,
      station_pressure: null, temperature: q(25, "degC"), relative_humidity: 0.4 },
    displacement: q(2.0, "L"), injector_count: 4, injector_flow: q(650, "cc/min"),
    pump_curve: { pressure_unit: "bar", flow_unit: "L/h",
      points: [[3, 280], [4, 262], [5, 240], [6, 212], [7, 178]] },
  };
}

/** The inputs of the day that go with the demo. */
export function demoInputs() {
  return {
    site: { source: "altitude", altitude: q(1200, "m"), altimeter_setting: null,
      station_pressure: null, temperature: q(18, "degC"), relative_humidity: 0.5 },
    boost: q(1.0, "bar"), target_power: q(280, "kW"), measured_power: q(255, "kW"),
    boost_set_where: "here", boost_control: "held_manifold", rpm: 6500, max_duty: 0.8,
    margin: 0.2, line_loss: null,
  };
}

/** A new id for a setup. */
export function newId() {
  const rnd = crypto.getRandomValues(new Uint32Array(2));
  return `s${Date.now().toString(36)}${rnd[0].toString(36)}${rnd[1].toString(36)}`;
}

/** A fresh document holding only the demo setup. */
export function demoDocument() {
  const demo = { id: "demo", name: _("Demo: club hill-climb car (invented)"), demo: true,
    notes: "", engine: demoEngine() };
  return { format: FORMAT, version: FORMAT_VERSION, active: demo.id, setups: [demo] };
}

const isNum = (v) => typeof v === "number" && Number.isFinite(v);
const isObj = (v) => v !== null && typeof v === "object" && !Array.isArray(v);

function checkQuantity(value, kind) {
  if (!isObj(value) || !isNum(value.value) || typeof value.unit !== "string") {
    return _("must be a number with a unit");
  }
  const units = acceptedUnits(kind);
  if (units && !units.includes(value.unit)) {
    return format(_("unknown unit \"%(unit)s\""), { unit: value.unit });
  }
  return null;
}

function checkSite(value) {
  if (!isObj(value)) return _("must be a set of air conditions");
  if (!["altitude", "altimeter", "station"].includes(value.source)) {
    return _("unknown source of the air pressure");
  }
  const labels = siteLabels();
  const kinds = { altitude: "elevation", altimeter_setting: "abs_pressure",
    station_pressure: "abs_pressure", temperature: "temperature" };
  for (const [key, kind] of Object.entries(kinds)) {
    if (value[key] === null || value[key] === undefined) continue;
    const err = checkQuantity(value[key], kind);
    if (err) return `${labels[key]}: ${err}`;
  }
  const rh = value.relative_humidity;
  if (rh !== null && rh !== undefined && !(isNum(rh) && rh >= 0 && rh <= 1)) {
    return `${labels.relative_humidity}: ${_("must be between 0 and 100 %")}`;
  }
  return null;
}

function checkCurve(value) {
  if (!isObj(value) || !Array.isArray(value.points)) return _("must be a table of points");
  if (checkQuantity({ value: 1, unit: value.pressure_unit }, "gauge_pressure")) {
    return _("unknown pressure unit");
  }
  if (checkQuantity({ value: 1, unit: value.flow_unit }, "pump_flow")) {
    return _("unknown flow unit");
  }
  if (value.points.length > 30) return _("at most 30 points");
  for (const point of value.points) {
    if (!Array.isArray(point) || point.length !== 2 || !point.every((v) => v === null || isNum(v))) {
      return _("each point must be a pressure and a flow");
    }
  }
  return null;
}

/** Why `value` is not acceptable for field `key`, or null when it is. */
export function checkValue(key, value) {
  const def = field(key);
  if (!def) return _("unknown field");
  if (value === null || value === undefined) {
    return ["quantity", "percent", "count", "number", "curve"].includes(def.type) ? null
      : _("is missing");
  }
  switch (def.type) {
    case "quantity": return checkQuantity(value, def.kind);
    case "percent": return isNum(value) && value >= 0 && value <= 1 ? null
      : _("must be between 0 and 100 %");
    case "count": return Number.isInteger(value) && value >= def.min && value <= def.max ? null
      : format(_("must be a whole number from %(min)s to %(max)s"), { min: def.min, max: def.max });
    case "number": return isNum(value) ? null : _("must be a number");
    case "choice": return def.choices.some((c) => c.value === value) ? null
      : format(_("unknown choice \"%(value)s\""), { value: String(value) });
    case "bool": return typeof value === "boolean" ? null : _("must be yes or no");
    case "site": return checkSite(value);
    case "curve": return checkCurve(value);
    default: return _("unknown field");
  }
}

/** Check a group of values (engine or inputs); fills missing keys from `base`. */
function checkGroup(obj, keys, base, where, errors) {
  if (!isObj(obj)) {
    errors.push(format(_("%(where)s: missing or not an object"), { where }));
    return null;
  }
  const out = {};
  for (const key of Object.keys(obj)) {
    if (!keys.includes(key)) errors.push(format(_("%(where)s: unknown field \"%(key)s\""), { where, key }));
  }
  for (const key of keys) {
    const value = Object.prototype.hasOwnProperty.call(obj, key) ? obj[key] : base[key];
    const err = checkValue(key, value);
    if (err) errors.push(`${where}: ${field(key).label}: ${err}`);
    out[key] = value;
  }
  return out;
}

/** Validate one setup; returns `{setup, errors}` (setup normalised, missing keys filled). */
export function validateSetup(raw, where = _("Setup")) {
  const errors = [];
  if (!isObj(raw)) return { setup: null, errors: [format(_("%(where)s: not a setup"), { where })] };
  if (typeof raw.name !== "string" || raw.name.trim() === "" || raw.name.length > 100) {
    errors.push(format(_("%(where)s: the name is missing or too long"), { where }));
  }
  const notes = raw.notes === undefined ? "" : raw.notes;
  if (typeof notes !== "string" || notes.length > NOTES_MAX) {
    errors.push(format(_("%(where)s: the notes are not text or are too long"), { where }));
  }
  const engine = checkGroup(raw.engine, ENGINE_KEYS, blankEngine(), where, errors);
  const setup = { id: typeof raw.id === "string" && raw.id ? raw.id : newId(),
    name: String(raw.name || "").trim(), demo: raw.demo === true, notes, engine };
  return { setup: errors.length ? null : setup, errors };
}

/** Validate the inputs of the day (local storage or a share link). */
export function validateInputs(raw) {
  const errors = [];
  const inputs = checkGroup(raw, INPUT_KEYS, demoInputs(), _("Inputs"), errors);
  return { inputs: errors.length ? null : inputs, errors };
}

/**
 * Migrations of the document, by the version they start from: `MIGRATIONS[n]` takes a
 * version-n document (as read, not yet validated: it may hold anything) and returns a new
 * version-(n + 1) document without changing its argument. To change the format, raise
 * FORMAT_VERSION, add the step from the previous version here, and describe the new
 * version in the format history at the top of this file.
 */
export const MIGRATIONS = {
  // 1 -> 2: every setup gets its notes, empty.
  1: (doc) => ({ ...doc, version: 2,
    setups: Array.isArray(doc.setups)
      ? doc.setups.map((s) => (isObj(s) && !("notes" in s) ? { ...s, notes: "" } : s))
      : doc.setups }),
};

/**
 * Bring a document of an older version up to FORMAT_VERSION. Returns `{raw, from}` (the
 * migrated document and the version it had), or `{raw: null, from}` when no chain of
 * migrations leads from its version (a newer one, or a version that never existed).
 */
export function migrate(doc) {
  const from = doc.version;
  let raw = doc;
  while (Number.isInteger(raw.version) && raw.version < FORMAT_VERSION && MIGRATIONS[raw.version]) {
    raw = MIGRATIONS[raw.version](raw);
  }
  return { raw: raw.version === FORMAT_VERSION ? raw : null, from };
}

/**
 * Validate a whole document (a saved one or an imported file, of this version or an
 * older one, which is migrated first). Returns `{doc, errors, from, newer, skipped}`:
 * `from` is the version it had, `newer` is true when it comes from a newer version of
 * the app. `doc` is null when anything is wrong, so nothing half-read is used; with
 * `partial` (the setups saved on this device), the setups that can be read are kept and
 * `skipped` counts the others.
 */
export function validateDocument(raw, { partial = false } = {}) {
  const refuse = (error, extra = {}) => ({ doc: null, errors: [error], from: null, newer: false,
    skipped: 0, ...extra });
  if (!isObj(raw) || raw.format !== FORMAT) return refuse(_("This is not a setups file of this app."));
  if (Number.isInteger(raw.version) && raw.version > FORMAT_VERSION) {
    return refuse(format(_("This file comes from a newer version of the app (format %(v)s); update the app to read it."),
      { v: String(raw.version) }), { from: raw.version, newer: true });
  }
  const { raw: current, from } = migrate(raw);
  if (!current) {
    return refuse(format(_("Setups file version %(v)s is not supported (this app reads version %(ok)s)."),
      { v: String(raw.version), ok: FORMAT_VERSION }), { from });
  }
  if (!Array.isArray(current.setups) || current.setups.length === 0 || current.setups.length > 100) {
    return refuse(_("The file holds no setups."), { from });
  }
  const errors = [];
  const setups = [];
  current.setups.forEach((item, index) => {
    const where = format(_("Setup %(n)s"), { n: index + 1 });
    const result = validateSetup(item, isObj(item) && typeof item.name === "string" ? item.name : where);
    errors.push(...result.errors);
    if (result.setup) setups.push(result.setup);
  });
  const skipped = current.setups.length - setups.length;
  if ((errors.length && !partial) || setups.length === 0) {
    return { doc: null, errors, from, newer: false, skipped };
  }
  const active = setups.some((st) => st.id === current.active) ? current.active : setups[0].id;
  return { doc: { format: FORMAT, version: FORMAT_VERSION, active, setups }, errors, from,
    newer: false, skipped };
}
