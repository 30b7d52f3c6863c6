"""Languages: the one list of supported locales, negotiation, and message lookup.

Catalogs are the gettext ``.po`` files under ``locales/``, read with Babel once per
process (no compile step is needed at run time; ``.mo`` files are optional build output).
The same ``.po`` files are exported to JSON for the browser by ``tools/generate.py``.
"""

import functools

from babel import Locale, negotiate_locale
from babel.messages.pofile import read_po

from .resources import resource_dir

#: The one list of supported locales (English is the source language).
LOCALES = ("en",)
DEFAULT_LOCALE = "en"


def negotiate(lang=None, accept_language=None):
    """Pick a supported locale from an explicit ``lang`` or an Accept-Language header.

    An unknown language falls back to English without error.
    """
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
        if found:
            return found
    return DEFAULT_LOCALE


@functools.lru_cache(maxsize=None)
def catalog(locale):
    """{msgid: translation} of a locale (empty for English or a missing catalog)."""
    path = resource_dir("locales") / locale / "LC_MESSAGES" / "messages.po"
    if locale == DEFAULT_LOCALE or not path.exists():
        return {}
    with path.open("rb") as handle:
        po = read_po(handle, locale=locale)
    return {m.id: m.string for m in po if m.id and m.string and not m.fuzzy}


def gettext(locale, message, **params):
    """Translate a message id and fill its ``%(name)s`` placeholders."""
    text = catalog(locale).get(message, message)
    return text % params if params else text


def locale_name(locale):
    """The locale's own name for a language picker (CLDR via Babel)."""
    return Locale.parse(locale).get_display_name(locale)
