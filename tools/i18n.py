"""The translation workflow (Babel), reproducible and checked by the tests.

    python tools/i18n.py extract        # sources -> locales/messages.pot (babel.cfg is the map)
    python tools/i18n.py init LANG      # a new catalog locales/LANG/LC_MESSAGES/messages.po
    python tools/i18n.py update         # merge the template into every catalog of i18n.LOCALES
    python tools/i18n.py compile        # .po -> .mo (optional: the app reads the .po files)
    python tools/i18n.py check          # template in sync with the sources, every catalog
                                        # complete (no empty, no fuzzy) and Babel's checkers pass

The list of languages is ``webcalc.i18n.LOCALES`` (English is the source language and has no
catalog). After translating, run ``python tools/generate.py`` so the browser's catalogs follow.
The template is written without line numbers (file names only) and keeps its creation date
while its messages do not change, so extracting twice gives the same file.
"""

import io
import os
import sys
import tempfile
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

from babel.messages import frontend  # noqa: E402
from babel.messages.pofile import read_po, write_po  # noqa: E402

from webcalc import i18n  # noqa: E402

LOCALES_DIR = ROOT / "locales"
TEMPLATE = LOCALES_DIR / "messages.pot"
KEYWORDS = ["-k", "_", "-k", "N_"]
HEADER = ["--project", "webcalc", "--version", "1.0", "--copyright-holder", "webcalc contributors",
          "--msgid-bugs-address", "webcalc contributors"]


def catalog_path(locale):
    return LOCALES_DIR / locale / "LC_MESSAGES" / "messages.po"


def translated_locales():
    return [loc for loc in i18n.LOCALES if loc != i18n.DEFAULT_LOCALE]


def pybabel(*args):
    """Run a pybabel command in the repository (relative paths in the output)."""
    here = os.getcwd()
    os.chdir(ROOT)
    try:
        frontend.CommandLineInterface().run(["pybabel", "-q", *args])
    finally:
        os.chdir(here)


def read(path):
    with open(path, "rb") as handle:
        return read_po(handle)


def messages_of(catalog):
    """What the template says, without its header: (id, locations' files, flags, comments)."""
    return sorted((str(m.id), tuple(sorted({loc[0] for loc in m.locations})), tuple(sorted(m.flags)),
                   tuple(m.auto_comments)) for m in catalog if m.id)


def extract_to(path):
    """Extract the sources into a catalog (written to ``path`` on the way); locations keep
    their file names but drop line numbers, so moving code does not change the template."""
    pybabel("extract", "-F", "babel.cfg", *KEYWORDS, *HEADER, "--sort-output",
            "--add-comments", "TRANSLATORS:", "-o", str(path), ".")
    fresh = read(path)
    for message in fresh:
        if message.id:
            message.locations = sorted({(loc[0], None) for loc in message.locations})
    return fresh


def write(path, catalog):
    buffer = io.BytesIO()
    write_po(buffer, catalog, sort_output=True, include_lineno=False, width=96)
    path.write_bytes(buffer.getvalue())


def extract():
    with tempfile.TemporaryDirectory() as tmp:
        fresh = extract_to(Path(tmp) / "messages.pot")
    if TEMPLATE.exists():
        old = read(TEMPLATE)
        if messages_of(old) == messages_of(fresh):
            print(f"{TEMPLATE.relative_to(ROOT)}: unchanged ({len(messages_of(fresh))} messages)")
            return 0
    write(TEMPLATE, fresh)
    print(f"{TEMPLATE.relative_to(ROOT)}: written ({len(messages_of(fresh))} messages)")
    return 0


def init(locale):
    if catalog_path(locale).exists():
        print(f"{catalog_path(locale).relative_to(ROOT)} exists: use update")
        return 1
    pybabel("init", "-i", str(TEMPLATE), "-d", str(LOCALES_DIR), "-l", locale, "--width", "96")
    normalise(locale)
    print(f"created {catalog_path(locale).relative_to(ROOT)}; add {locale!r} to LOCALES in webcalc/i18n.py")
    return 0


def normalise(locale):
    """Rewrite a catalog the way extract writes the template (sorted, no line numbers)."""
    path = catalog_path(locale)
    with open(path, "rb") as handle:
        catalog = read_po(handle, locale=locale)
    write(path, catalog)


def update():
    for locale in translated_locales():
        if not catalog_path(locale).exists():
            print(f"missing catalog for {locale}: python tools/i18n.py init {locale}")
            return 1
        pybabel("update", "-i", str(TEMPLATE), "-d", str(LOCALES_DIR), "-l", locale, "--ignore-obsolete",
                "--width", "96")
        normalise(locale)
    print("updated:", ", ".join(translated_locales()))
    return 0


def compile_all():
    pybabel("compile", "-d", str(LOCALES_DIR), "--statistics")
    return 0


def problems():
    """Every reason the catalogs are not ready, as readable lines (empty when all is well)."""
    out = []
    with tempfile.TemporaryDirectory() as tmp:
        fresh = extract_to(Path(tmp) / "messages.pot")
    template = read(TEMPLATE)
    if messages_of(fresh) != messages_of(template):
        new = {m[0] for m in messages_of(fresh)} ^ {m[0] for m in messages_of(template)}
        out.append(f"locales/messages.pot is stale (run python tools/i18n.py extract): {sorted(new)[:5]}")
    ids = {m.id for m in template if m.id}
    for locale in translated_locales():
        path = catalog_path(locale)
        if not path.exists():
            out.append(f"{locale}: no catalog")
            continue
        with open(path, "rb") as handle:
            catalog = read_po(handle, locale=locale)
        have = {m.id for m in catalog if m.id}
        for missing in sorted(ids - have):
            out.append(f"{locale}: not in the catalog (run update): {missing!r}")
        for extra in sorted(have - ids):
            out.append(f"{locale}: not in the template: {extra!r}")
        for message in catalog:
            if not message.id:
                continue
            if message.fuzzy:
                out.append(f"{locale}: fuzzy: {message.id!r}")
            if not message.string or not str(message.string).strip():
                out.append(f"{locale}: untranslated: {message.id!r}")
            if i18n.placeholders(message.id) != i18n.placeholders(message.string or ""):
                out.append(f"{locale}: placeholders differ: {message.id!r}")
        for message, errors in catalog.check():
            for error in errors:
                out.append(f"{locale}: Babel checker: {message.id!r}: {error}")
    return out


def check():
    found = problems()
    print("\n".join(found) if found else "catalogs complete and in sync")
    return 1 if found else 0


def main(argv):
    commands = {"extract": extract, "update": update, "compile": compile_all, "check": check}
    if len(argv) == 2 and argv[0] == "init":
        return init(argv[1])
    if len(argv) == 1 and argv[0] in commands:
        return commands[argv[0]]()
    print(__doc__)
    return 2


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
