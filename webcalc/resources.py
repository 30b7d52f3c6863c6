"""Where the front end and catalogs live: inside the package when installed from a wheel,
at the top of the source tree when run from a checkout."""

from pathlib import Path

_PACKAGE = Path(__file__).resolve().parent


def resource_dir(name):
    """``static`` or ``locales``: the packaged copy if present, else the checkout's."""
    packaged = _PACKAGE / name
    return packaged if packaged.is_dir() else _PACKAGE.parent / name
