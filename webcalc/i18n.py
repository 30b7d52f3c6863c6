"""Languages: the one list of supported locales, negotiation, and message lookup.

Catalogs are the gettext ``.po`` files under ``locales/``, read with Babel once per
process (no compile step is needed at run time; ``.mo`` files are optional build output).
The same ``.po`` files are exported to JSON for the browser by ``tools/generate.py``.
"""

import functools
import re

from babel import Locale, negotiate_locale
from babel.messages.pofile import read_po
from babel.numbers import get_decimal_symbol

from .resources import resource_dir

#: The one list of supported locales (English is the source language). Everything reads
#: it: negotiation here, tools/i18n.py (catalogs), tools/generate.py (the browser's list,
#: catalogs and number symbols), the tests.
LOCALES = ("en", "de", "es", "fr", "it", "pt_BR")
DEFAULT_LOCALE = "en"


def negotiate(lang=None, accept_language=None):
    """Pick a supported locale from an explicit ``lang`` or an Accept-Language header.

    An unknown language falls back to English without error. Answers are cached (a
    browser sends the same header every time).
    """
    try:
        return _negotiate(lang, accept_language)
    except TypeError:  # an unhashable ``lang`` (a list from a JSON body): not a language
        return _negotiate(None, accept_language)


@functools.lru_cache(maxsize=1024)
def _negotiate(lang, accept_language):
    wanted = []
    if isinstance(lang, str) and lang.strip():
        wanted.append(lang.strip().replace("-", "_"))
    if accept_language:
        for part in accept_language.split(","):
            tag = part.split(";")[0].strip()
            if tag and tag != "*":
                wanted.append(tag.replace("-", "_"))
    for tag in wanted:
        found = negotiate_locale([tag], list(LOCALES), sep="_")
        if found is None:
            found = negotiate_locale([tag.split("_")[0]], list(LOCALES), sep="_")
        if found is None:
            found = same_language(tag)
        if found:
            # Babel answers in the caller's spelling ("DE"); the catalogs use ours ("de").
            return next(loc for loc in LOCALES if loc.lower() == found.lower())
    return DEFAULT_LOCALE


def same_language(tag):
    """The first supported locale of the tag's language ("pt_PT" or "pt" -> "pt_BR"), or None."""
    language = tag.split("_")[0].lower()
    return next((loc for loc in LOCALES if loc.split("_")[0].lower() == language), None)


@functools.lru_cache(maxsize=None)
def catalog(locale):
    """{msgid: translation} of a locale (empty for English or a missing catalog)."""
    path = resource_dir("locales") / locale / "LC_MESSAGES" / "messages.po"
    if locale == DEFAULT_LOCALE or not path.exists():
        return {}
    with path.open("rb") as handle:
        po = read_po(handle, locale=locale)
    return {m.id: m.string for m in po if m.id and m.string and not m.fuzzy}


_PLAIN_NUMBER = re.compile(r"-?\d+(\.\d+)?(e[-+]\d+)?")


@functools.lru_cache(maxsize=None)
def decimal_symbol(locale):
    """The locale's decimal separator from CLDR ("," for de, es, fr, it, pt_BR)."""
    return get_decimal_symbol(Locale.parse(locale))


def format_number(locale, text):
    """A plain number ("0.5", "-40", "1e+06") written with the locale's decimal separator.

    Numbers in messages carry no grouping separator, so that "3500" reads the same
    everywhere and the offline engine (static/js/offline/i18n.js) writes them identically.
    Anything that is not a plain number is returned unchanged.
    """
    if isinstance(text, bool) or not isinstance(text, (str, int, float)):
        return text
    text = str(text)
    return text.replace(".", decimal_symbol(locale)) if _PLAIN_NUMBER.fullmatch(text) else text


def gettext(locale, message, **params):
    """Translate a message id and fill its ``%(name)s`` placeholders (numbers in the locale's style)."""
    text = catalog(locale).get(message, message)
    if not params:
        return text
    return text % {name: format_number(locale, value) for name, value in params.items()}


def locale_name(locale):
    """The locale's own name for a language picker (CLDR via Babel)."""
    return Locale.parse(locale).get_display_name(locale)


_PLACEHOLDER = re.compile(r"%\((\w+)\)s")


def placeholders(text):
    """The ``%(name)s`` placeholders of a message (a translation must keep the same set)."""
    return sorted(set(_PLACEHOLDER.findall(text)))
