/**
 * Translation hooks. Every user-visible string goes through `_("English text")` with a
 * plain string literal (Babel's JavaScript extractor reads those calls); placeholders are
 * `%(name)s`, filled by `format()`. Catalogs are `static/generated/locales/<lang>.json`
 * (`{"messages": {"msgid": "translation"}}`); without one the msgid is shown.
 */
import { getJSON } from "./api.js";

let messages = {};
let lang = "en";

/** Translate a message id (the English text). */
export function _(msgid) {
  const text = messages[msgid];
  return typeof text === "string" && text !== "" ? text : msgid;
}

/** Fill `%(name)s` placeholders: `format(_("%(n)s injectors"), {n: 4})`. */
export function format(text, values) {
  return text.replace(/%\((\w+)\)s/g, (match, key) =>
    Object.prototype.hasOwnProperty.call(values, key) ? String(values[key]) : match);
}

/** The language in use (passed to the API as `lang`). */
export function currentLang() {
  return lang;
}

/** Candidate catalog names for a BCP 47 tag: "pt-BR" -> ["pt_BR", "pt"]. */
function candidates(tag) {
  const parts = String(tag || "en").replace("-", "_").split("_");
  const full = parts.length > 1 ? `${parts[0].toLowerCase()}_${parts[1].toUpperCase()}` : null;
  return [full, parts[0].toLowerCase()].filter(Boolean);
}

/**
 * Load the catalog for `wanted` (or its base language). English needs none; for other
 * languages the page's own list (`data-languages`) says which exist, so no missing file
 * is asked for.
 */
export async function setLanguage(wanted) {
  messages = {};
  lang = "en";
  const names = candidates(wanted);
  if (names[names.length - 1] !== "en") {
    const available = Object.keys(pageLanguages());
    // "pt-PT" or "pt" -> "pt_BR": the exact locale, else its language, else any of that language.
    const name = names.find((n) => available.includes(n) && n !== "en")
      || available.find((n) => n !== "en" && n.split("_")[0] === names[names.length - 1]);
    const catalog = name ? await getJSON(`/static/generated/locales/${name}.json`) : null;
    if (catalog && catalog.messages && typeof catalog.messages === "object") {
      messages = catalog.messages;
      lang = name.replace("_", "-");
    }
  }
  document.documentElement.lang = lang;
  return lang;
}

/** The server lists its languages on the page (`data-languages`, webcalc/i18n.py LOCALES). */
function pageLanguages() {
  try {
    const found = JSON.parse(document.documentElement.dataset.languages || "{}");
    return found && typeof found === "object" && Object.keys(found).length ? found : { en: "English" };
  } catch {
    return { en: "English" };
  }
}

/** The languages there are catalogs for: [{code: "pt_BR", tag: "pt-BR", name: "Português (Brasil)"}]. */
export function languages() {
  return Object.entries(pageLanguages()).map(([code, name]) => {
    return { code, tag: code.replace("_", "-"), name: name.charAt(0).toLocaleUpperCase(code.replace("_", "-")) + name.slice(1) };
  });
}

/** The language to start with: the user's choice, else the browser's. */
export function preferredLanguage(stored) {
  return stored || (navigator.languages && navigator.languages[0]) || navigator.language || "en";
}
