/**
 * The app's state and its persistence on the device: the setups document
 * (local storage key `webcalc-setups`), the inputs of the day and the preferences.
 * Widgets change state through the functions here and subscribe to changes.
 *
 * Nothing the user saved is lost: saved text that cannot be used as it is (an older
 * format, unreadable, partly unreadable) is first copied aside, untouched, under its own
 * key (`webcalc-setups-v1`, `webcalc-setups-unreadable-<time>`), and the document key is
 * only written once that copy is stored. A document from a newer version of the app is
 * never written over. When the device refuses to store anything (storage full or off),
 * `store.notice` says so and the edits stay on screen.
 */
import { _ } from "./i18n.js";
import { field, SITE_KINDS, defaultUnit } from "./fields.js";
import { demoDocument, demoInputs, newId, validateDocument, validateInputs, FORMAT,
  FORMAT_VERSION } from "./setups.js";
import { convert, roundForInput } from "./units.js";

export const KEYS = { doc: "webcalc-setups", inputs: "webcalc-inputs", prefs: "webcalc-prefs" };

export const store = {
  doc: null,
  inputs: null,
  prefs: { system: null, theme: "standard", lang: null, cautionsOpen: true, cautions: [] },
  /** True once the user has typed or picked anything on this page load. */
  typed: false,
  /** A message for the user about the saved data (translated text), or null. */
  notice: null,
};

const listeners = new Set();

/**
 * Call `fn(what)` on every change; `what` is "engine", "inputs", "prefs", "system",
 * "setups" or "notice" (store.notice changed).
 */
export function subscribe(fn) {
  listeners.add(fn);
  return () => listeners.delete(fn);
}

function emit(what) {
  for (const fn of [...listeners]) fn(what);
}

/** The stored text under `key`; null when there is none or storage cannot be read. */
function readText(key) {
  try {
    return localStorage.getItem(key);
  } catch {
    return null;
  }
}

function writeText(key, text) {
  try {
    localStorage.setItem(key, text);
    return true;
  } catch {
    return false;
  }
}

function read(key) {
  const text = readText(key);
  if (text === null) return undefined;
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
}

/** Keys the device refused to store on the last try. */
const failing = new Set();
/** What loading found (translated text), shown when no write is failing. */
let loadNotice = null;
/** Saved text to copy aside before the document key may be written: {key, text}. */
let pendingAside = null;
/** True when the saved document comes from a newer app: it is never written over. */
let held = false;

function showNotice() {
  const text = failing.size
    ? _("This device's storage is full or off, so the latest changes are not saved. Export your setups to keep them.")
    : loadNotice;
  if (text === store.notice) return;
  store.notice = text;
  emit("notice");
}

function noteWrite(key, ok) {
  if (ok) failing.delete(key);
  else failing.add(key);
  showNotice();
  return ok;
}

function write(key, value) {
  return noteWrite(key, writeText(key, JSON.stringify(value)));
}

/**
 * Save the setups document; false when it was not saved (the device refused: storage
 * full or off, reported in store.notice; or the saved one is from a newer app).
 */
export function saveDocument() {
  if (held) return false;
  if (pendingAside) {
    if (!noteWrite(KEYS.doc, writeText(pendingAside.key, pendingAside.text))) return false;
    pendingAside = null;
  }
  return write(KEYS.doc, store.doc);
}

function saveInputs() {
  write(KEYS.inputs, store.inputs);
}

function savePrefs() {
  write(KEYS.prefs, store.prefs);
}

/** `base`, or `base-<time>` when `base` already holds other text. */
function asideKey(base, text) {
  const there = readText(base);
  return there === null || there === text ? base : `${base}-${Date.now()}`;
}

/**
 * Open the saved document text: use what can be read, plan to copy the text aside when
 * it will be replaced (older format, partly or wholly unreadable), hold a newer one.
 */
function openSaved(text) {
  let raw;
  try {
    raw = JSON.parse(text);
  } catch {
    raw = undefined;
  }
  const result = raw === undefined ? { doc: null } : validateDocument(raw, { partial: true });
  if (result.newer) {
    held = true;
    loadNotice = _("The setups on this device come from a newer version of the app and were left unchanged. Reload the app to update it.");
    return;
  }
  if (result.doc && !result.skipped) {
    store.doc = result.doc;
    if (result.from !== FORMAT_VERSION) {
      pendingAside = { key: asideKey(`${KEYS.doc}-v${result.from}`, text), text };
    }
    return;
  }
  pendingAside = { key: `${KEYS.doc}-unreadable-${Date.now()}`, text };
  if (result.doc) {
    store.doc = result.doc;
    loadNotice = _("Some saved setups could not be read; they were kept aside unchanged and the others were opened.");
  } else {
    loadNotice = _("The setups saved on this device could not be read; they were kept aside unchanged and the demo setup was opened.");
  }
}

/** The region's unit system: imperial for the US, Liberia and Myanmar, else metric. */
function regionSystem() {
  const tag = (navigator.languages && navigator.languages[0]) || navigator.language || "";
  return /-(US|LR|MM)\b/i.test(tag) ? "imperial" : "metric";
}

/** Load the preferences (theme, language, unit system) from the device. */
export function loadPrefs() {
  const prefs = read(KEYS.prefs);
  if (prefs && typeof prefs === "object" && !Array.isArray(prefs)) Object.assign(store.prefs, prefs);
  if (!["metric", "imperial"].includes(store.prefs.system)) store.prefs.system = regionSystem();
  if (!Array.isArray(store.prefs.cautions)) store.prefs.cautions = [];
}

/** Load the setups and inputs (after the unit table and language); a first visit gets the demo. */
export function loadStore() {
  const text = readText(KEYS.doc);
  const firstVisit = text === null;
  if (!firstVisit) openSaved(text);
  if (!store.doc) store.doc = demoDocument();

  const inputs = read(KEYS.inputs);
  store.inputs = (inputs && validateInputs(inputs).inputs) || demoInputs();
  if (firstVisit && store.prefs.system !== "metric") convertAll(store.prefs.system);
  if (firstVisit) {
    saveDocument();
    saveInputs();
    savePrefs();
  } else if (pendingAside) {
    saveDocument();
  }
  showNotice();
  return { firstVisit };
}

/** The setup in use. */
export function activeSetup() {
  return store.doc.setups.find((s) => s.id === store.doc.active) || store.doc.setups[0];
}

/** Change one engine value of the active setup (saved at once). */
export function setEngineValue(key, value) {
  activeSetup().engine[key] = value;
  saveDocument();
  emit("engine");
}

/** Change one input of the day (saved at once). */
export function setInput(key, value) {
  store.inputs[key] = value;
  saveInputs();
  emit("inputs");
}

/** Change a preference. A new unit system converts every saved value to its units. */
export function setPref(key, value) {
  if (store.prefs[key] === value) return;
  store.prefs[key] = value;
  if (key === "system") {
    convertAll(value);
    saveDocument();
    saveInputs();
  }
  savePrefs();
  emit(key === "system" ? "system" : "prefs");
}

/** Remember the general cautions last received, so they show at once next time. */
export function rememberCautions(cautions) {
  if (JSON.stringify(cautions) === JSON.stringify(store.prefs.cautions)) return;
  store.prefs.cautions = cautions;
  savePrefs();
}

/** Make another setup the active one. */
export function selectSetup(id) {
  if (!store.doc.setups.some((s) => s.id === id)) return;
  store.doc.active = id;
  saveDocument();
  emit("setups");
}

function uniqueName(name) {
  const names = new Set(store.doc.setups.map((s) => s.name));
  if (!names.has(name)) return name;
  for (let n = 2; ; n += 1) {
    const candidate = `${name} (${n})`;
    if (!names.has(candidate)) return candidate;
  }
}

/** Add a setup (a copy with a new id and a unique name) and make it active. */
export function addSetup(setup) {
  const copy = structuredClone(setup);
  copy.id = newId();
  copy.name = uniqueName(copy.name);
  if (typeof copy.notes !== "string") copy.notes = "";
  store.doc.setups.push(copy);
  store.doc.active = copy.id;
  saveDocument();
  emit("setups");
  return copy;
}

/** Rename a setup; a renamed demo is the user's own. */
export function renameSetup(id, name) {
  const setup = store.doc.setups.find((s) => s.id === id);
  if (!setup || !name.trim()) return;
  setup.name = name.trim();
  setup.demo = false;
  saveDocument();
  emit("setups");
}

/** Change the notes of a setup (saved at once). */
export function setNotes(id, notes) {
  const setup = store.doc.setups.find((s) => s.id === id);
  if (!setup || setup.notes === notes) return;
  setup.notes = notes;
  saveDocument();
  emit("setups");
}

/** Delete a setup; the last one cannot be deleted. */
export function deleteSetup(id) {
  if (store.doc.setups.length < 2) return false;
  store.doc.setups = store.doc.setups.filter((s) => s.id !== id);
  if (store.doc.active === id) store.doc.active = store.doc.setups[0].id;
  saveDocument();
  emit("setups");
  return true;
}

/** The document to export: every saved setup. */
export function exportDocument() {
  return { format: FORMAT, version: FORMAT_VERSION, active: store.doc.active,
    setups: structuredClone(store.doc.setups) };
}

/**
 * Merge an already validated document: setups identical to a saved one are skipped, the
 * others are added (renamed if the name is taken). Returns the names added.
 */
export function importDocument(doc) {
  const same = (a, b) => JSON.stringify(a.engine) === JSON.stringify(b.engine) && a.name === b.name
    && a.notes === b.notes;
  const added = [];
  let activeId = null;
  for (const setup of doc.setups) {
    const existing = store.doc.setups.find((s) => same(s, setup));
    if (existing) {
      if (setup.id === doc.active) activeId = existing.id;
      continue;
    }
    const copy = structuredClone(setup);
    if (store.doc.setups.some((s) => s.id === copy.id)) copy.id = newId();
    copy.name = uniqueName(copy.name);
    store.doc.setups.push(copy);
    added.push(copy.name);
    if (setup.id === doc.active || activeId === null) activeId = copy.id;
  }
  if (activeId) store.doc.active = activeId;
  saveDocument();
  emit("setups");
  return added;
}

/** Replace the inputs of the day (share link). */
export function replaceInputs(inputs) {
  store.inputs = structuredClone(inputs);
  saveInputs();
  emit("inputs");
}

function convertQuantity(qty, def, system) {
  if (!qty || typeof qty.value !== "number") return qty;
  const unit = defaultUnit(def, system);
  const value = unit ? convert(qty.value, qty.unit, unit) : null;
  return value === null ? qty : { value: roundForInput(value), unit };
}

function convertSite(site, system) {
  const out = { ...site };
  for (const [key, def] of Object.entries(SITE_KINDS)) out[key] = convertQuantity(site[key], def, system);
  return out;
}

function convertCurve(curve, system) {
  if (!curve) return curve;
  const pu = defaultUnit({ kind: "gauge_pressure" }, system);
  const fu = defaultUnit({ kind: "pump_flow" }, system);
  const cp = convert(1, curve.pressure_unit, pu) !== null;
  const cf = convert(1, curve.flow_unit, fu) !== null;
  const conv = (v, from, to, ok) => (ok && v !== null ? roundForInput(convert(v, from, to)) : v);
  return {
    pressure_unit: cp ? pu : curve.pressure_unit,
    flow_unit: cf ? fu : curve.flow_unit,
    points: curve.points.map(([p, f]) => [conv(p, curve.pressure_unit, pu, cp),
      conv(f, curve.flow_unit, fu, cf)]),
  };
}

function convertValues(values, system) {
  for (const [key, value] of Object.entries(values)) {
    const def = field(key);
    if (!def || value === null || value === undefined) continue;
    if (def.type === "quantity") values[key] = convertQuantity(value, def, system);
    else if (def.type === "site") values[key] = convertSite(value, system);
    else if (def.type === "curve") values[key] = convertCurve(value, system);
  }
}

/**
 * Convert every quantity to the units of `system`. Values whose unit has another
 * dimension there (an injector rated in cc/min against lb/h) keep their unit: converting
 * them would need the fuel, and a data-sheet figure is best kept as printed.
 */
function convertAll(system) {
  for (const setup of store.doc.setups) convertValues(setup.engine, system);
  convertValues(store.inputs, system);
}

/** Note that the user has started typing (updates then wait for a reload by hand). */
export function markTyped() {
  store.typed = true;
}
