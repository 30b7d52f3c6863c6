// Languages of the offline engine: negotiation and message lookup.
// mirrors webcalc/i18n.py (negotiate, catalog, gettext) with the generated catalogs
// (static/generated/catalogs.js, from the gettext .po files); English is the identity.

import locales from '../../generated/locales.js';
import catalogs from '../../generated/catalogs.js';

export const LOCALES = Object.freeze([...locales.locales]);
export const DEFAULT_LOCALE = locales.default;
const ALIASES = locales.aliases || {};

/**
 * Babel's negotiate_locale for one preferred tag (`sep` "_"): exact match ignoring case
 * (answering the preferred spelling), then Babel's alias table, then the language part.
 */
function negotiateOne(tag, available) {
  const lower = available.map((a) => a.toLowerCase());
  const ll = tag.toLowerCase();
  if (lower.includes(ll)) return tag;
  const alias = ALIASES[ll];
  if (alias && lower.includes(alias.toLowerCase())) return alias;
  const parts = tag.split('_');
  if (parts.length > 1 && lower.includes(parts[0].toLowerCase())) return parts[0];
  return null;
}

/**
 * Pick a supported locale from an explicit `lang` or an Accept-Language header; an
 * unknown language falls back to English. mirrors `negotiate`
 * @param {?string} lang
 * @param {?string} acceptLanguage
 * @returns {string}
 */
export function negotiate(lang = null, acceptLanguage = null) {
  const wanted = [];
  if (typeof lang === 'string' && lang.trim()) wanted.push(lang.trim().replaceAll('-', '_'));
  if (acceptLanguage) {
    for (const part of acceptLanguage.split(',')) {
      const tag = part.split(';')[0].trim();
      if (tag && tag !== '*') wanted.push(tag.replaceAll('-', '_'));
    }
  }
  for (const tag of wanted) {
    let found = negotiateOne(tag, LOCALES);
    if (found === null) found = negotiateOne(tag.split('_')[0], LOCALES);
    if (found === null) found = sameLanguage(tag);
    // Babel answers in the caller's spelling ("DE"); the catalogs use ours ("de").
    if (found) return LOCALES.find((loc) => loc.toLowerCase() === found.toLowerCase());
  }
  return DEFAULT_LOCALE;
}

/** The first supported locale of the tag's language, or null. mirrors `same_language` */
export function sameLanguage(tag) {
  const language = tag.split('_')[0].toLowerCase();
  return LOCALES.find((loc) => loc.split('_')[0].toLowerCase() === language) || null;
}

const PLAIN_NUMBER = /^-?\d+(\.\d+)?(e[-+]\d+)?$/;

/**
 * A plain number written with the locale's decimal separator (CLDR, generated from
 * Babel); anything else unchanged. mirrors `format_number`
 */
export function formatNumber(locale, value) {
  if (typeof value === 'boolean' || (typeof value !== 'string' && typeof value !== 'number')) return value;
  const text = String(value);
  return PLAIN_NUMBER.test(text) ? text.replace('.', locales.decimal[locale] || '.') : text;
}

/** {msgid: translation} of a locale (empty for English or a missing catalog). mirrors `catalog` */
export function catalog(locale) {
  if (locale === DEFAULT_LOCALE || !Object.prototype.hasOwnProperty.call(catalogs, locale)) return {};
  return catalogs[locale].messages;
}

/** Translate a message id and fill its `%(name)s` placeholders. mirrors `gettext` */
export function gettext(locale, message, params = null) {
  const messages = catalog(locale);
  const text = Object.prototype.hasOwnProperty.call(messages, message) ? messages[message] : message;
  if (!params || Object.keys(params).length === 0) return text;
  return text.replace(/%(?:\(([^)]*)\)s|%)/g, (whole, name) => {
    if (name === undefined) return '%';
    if (!Object.prototype.hasOwnProperty.call(params, name)) throw new RangeError(`no parameter ${name} for a message`);
    return String(formatNumber(locale, params[name]));
  });
}
