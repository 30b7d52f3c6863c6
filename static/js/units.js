/**
 * Units at the edge of the page: the unit table generated from the server's
 * (`static/generated/units.json`), the choices a picker offers, conversion between
 * units of one dimension, and number parsing/formatting for the page's locale.
 */
import { getJSON } from "./api.js";

let table = null;

/** Load the generated unit table; the page works without it (no conversion). */
export async function loadUnits() {
  table = await getJSON("/static/generated/units.json");
  return table;
}

/**
 * Units people use, by kind, most common first (our UI choice; every entry must exist in
 * the generated table to be offered once it is loaded). The table's own kinds name the
 * default unit per system; `DEFAULTS` is only the fallback until the table is there.
 */
const COMMON = {
  abs_pressure: ["kPa", "hPa", "mbar", "bar", "psi", "inHg", "mmHg", "atm"],
  gauge_pressure: ["bar", "psi", "kPa"],
  temperature: ["degC", "degF", "K"],
  elevation: ["m", "ft", "km"],
  power: ["kW", "hp", "PS", "CV"],
  air_mass_flow: ["kg/min", "lb/min", "kg/h", "g/s", "kg/s"],
  air_volume_flow: ["m^3/min", "ft^3/min", "L/min"],
  injector_flow: ["cc/min", "lb/h", "g/min", "L/h"],
  fuel_flow: ["kg/h", "lb/h", "L/h", "gal/h", "cc/min"],
  pump_flow: ["L/h", "gal/h", "L/min", "gal/min", "kg/h", "lb/h"],
  bsfc: ["g/kWh", "lb/hp/h"],
  density: ["kg/L", "lb/gal", "kg/m^3", "g/cm^3"],
  displacement: ["L", "cc", "in^3"],
};

const DEFAULTS = {
  abs_pressure: { metric: "kPa", imperial: "psi" },
  gauge_pressure: { metric: "bar", imperial: "psi" },
  temperature: { metric: "degC", imperial: "degF" },
  elevation: { metric: "m", imperial: "ft" },
  power: { metric: "kW", imperial: "hp" },
  air_mass_flow: { metric: "kg/min", imperial: "lb/min" },
  air_volume_flow: { metric: "m^3/min", imperial: "ft^3/min" },
  injector_flow: { metric: "cc/min", imperial: "lb/h" },
  fuel_flow: { metric: "kg/h", imperial: "lb/h" },
  pump_flow: { metric: "L/h", imperial: "gal/h" },
  bsfc: { metric: "g/kWh", imperial: "lb/hp/h" },
  density: { metric: "kg/L", imperial: "lb/gal" },
  displacement: { metric: "L", imperial: "in^3" },
};

/** The dimension a unit belongs to, from the table (null when unknown). */
export function dimensionOf(unit) {
  if (!table || !table.dimensions) return null;
  for (const [dim, units] of Object.entries(table.dimensions)) {
    if (Object.prototype.hasOwnProperty.call(units, unit)) return dim;
  }
  return null;
}

function kindUnits(kind) {
  const dims = table && table.kinds && table.kinds[kind] && table.kinds[kind].dimensions;
  if (!dims) return null;
  return dims.flatMap((dim) => Object.keys((table.dimensions && table.dimensions[dim]) || {}));
}

/** The units a picker offers for `kind`, keeping `current` selectable. */
export function choicesFor(kind, current) {
  const known = kindUnits(kind);
  const common = COMMON[kind] || [];
  const list = known ? common.filter((u) => known.includes(u)) : common.slice();
  if (known && list.length === 0) list.push(...known);
  if (current && !list.includes(current)) list.push(current);
  return list;
}

/** Every unit the table accepts for `kind` (null before the table is loaded). */
export function acceptedUnits(kind) {
  return kindUnits(kind);
}

/** The default unit of `kind` in a unit system ("metric" or "imperial"). */
export function systemUnit(kind, system) {
  const fromTable = table && table.kinds && table.kinds[kind] && table.kinds[kind][system];
  return fromTable || (DEFAULTS[kind] && DEFAULTS[kind][system]) || null;
}

/**
 * Convert between two units of one dimension; null when either is unknown or the
 * dimensions differ (mass and volume flows are not converted here: that needs a fuel).
 */
export function convert(value, from, to) {
  if (from === to) return value;
  const dim = dimensionOf(from);
  if (!dim || dim !== dimensionOf(to)) return null;
  const a = table.dimensions[dim][from];
  const b = table.dimensions[dim][to];
  return (value * a.factor + (a.offset || 0) - (b.offset || 0)) / b.factor;
}

const PRETTY = {
  degC: "°C", degF: "°F", degR: "°R", "m^3/min": "m³/min", "m^3/s": "m³/s",
  "ft^3/min": "ft³/min", "in^3": "in³", "m^3": "m³", "kg/m^3": "kg/m³", "g/cm^3": "g/cm³",
  "lb/hp/h": "lb/(hp·h)",
};

/** How a unit is written on screen ("degC" -> "°C"). */
export function unitLabel(unit) {
  return PRETTY[unit] || unit || "";
}

let locale;

/** The locale numbers are formatted in (the page's language). */
export function setNumberLocale(tag) {
  locale = tag;
}

function decimalSeparator() {
  const parts = new Intl.NumberFormat(locale).formatToParts(1.5);
  const dec = parts.find((p) => p.type === "decimal");
  return dec ? dec.value : ".";
}

/**
 * Parse what the user typed: "1.2", "1,2" (decimal comma), "1e3". Returns null for
 * an empty field and NaN for text that is not a number.
 */
export function parseNumber(text) {
  let t = String(text).trim().replace(/\s+/g, "");
  if (t === "") return null;
  if (t.includes(",") && !t.includes(".")) t = t.replace(",", ".");
  if (!/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(t)) return NaN;
  return Number(t);
}

/** Show a stored number in an input (locale decimal mark, no grouping). */
export function inputText(value) {
  if (value === null || value === undefined || Number.isNaN(value)) return "";
  const text = String(value);
  return decimalSeparator() === "," ? text.replace(".", ",") : text;
}

/** Round for display in an input after a conversion: 4 significant digits. */
export function roundForInput(value) {
  return Number(Number(value).toPrecision(4));
}

/**
 * Format a result number: 4 significant digits, whole numbers from 1000 up;
 * `style` "percent" shows a fraction as percent with one decimal.
 */
export function formatNumber(value, style = "number") {
  if (value === null || value === undefined) return "";
  if (style === "percent") {
    return new Intl.NumberFormat(locale, { style: "percent", maximumFractionDigits: 1 })
      .format(value);
  }
  if (style === "ratio") {
    return new Intl.NumberFormat(locale, { maximumFractionDigits: 3 }).format(value);
  }
  const abs = Math.abs(value);
  const options = abs >= 1000 ? { maximumFractionDigits: 0 } : { maximumSignificantDigits: 4 };
  return new Intl.NumberFormat(locale, options).format(value);
}
