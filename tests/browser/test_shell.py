"""The app shell's files: manifest, icons, and the service worker's precache list."""

import json
import re
import struct
from pathlib import Path

import pytest

STATIC = Path(__file__).resolve().parents[2] / "static"


def png_size(path):
    data = path.read_bytes()
    assert data[:8] == b"\x89PNG\r\n\x1a\n"
    return struct.unpack(">II", data[16:24])


def test_manifest_is_installable():
    manifest = json.loads((STATIC / "manifest.webmanifest").read_text())
    assert manifest["name"] == "Boost and fuel check" and manifest["short_name"]
    assert manifest["display"] == "standalone" and manifest["start_url"] == "/"
    assert manifest["theme_color"] and manifest["background_color"]
    maskable = {i["sizes"] for i in manifest["icons"] if i["purpose"] == "maskable"}
    assert {"192x192", "512x512"} <= maskable
    for icon in manifest["icons"]:
        path = STATIC / icon["src"].removeprefix("/static/")
        w, h = png_size(path)
        assert f"{w}x{h}" == icon["sizes"]


def shell_list():
    text = (STATIC / "sw.js").read_text()
    block = re.search(r"const SHELL = \[(.*?)\];", text, re.S).group(1)
    return re.findall(r'"([^"]+)"', block)


def test_precache_holds_every_front_end_file():
    """Every module the page can load (lazy ones too) is precached, and nothing missing."""
    shell = set(shell_list())
    ours = {f"/static/{p.relative_to(STATIC).as_posix()}" for p in (STATIC / "js").rglob("*.js")
            if p.relative_to(STATIC / "js").parts[0] not in ("engine", "offline", "calc")}
    ours |= {"/static/css/app.css", "/", "/manifest.webmanifest"}
    assert ours <= shell, f"not precached: {sorted(ours - shell)}"
    for url in shell - {"/", "/manifest.webmanifest"}:
        assert (STATIC / url.removeprefix("/static/")).is_file(), url


def test_one_version_source():
    text = (STATIC / "sw.js").read_text()
    assert 'import { VERSION } from "/static/js/version.js"' in text
    assert "`webcalc-shell-${VERSION}`" in text
    assert re.search(r'export const VERSION = "[^"]+";', (STATIC / "js" / "version.js").read_text())


UI_FILES = sorted(p for p in (STATIC / "js").rglob("*.js")
                  if p.relative_to(STATIC / "js").parts[0] not in ("engine", "offline", "calc"))


@pytest.mark.parametrize("path", UI_FILES, ids=lambda p: p.relative_to(STATIC).as_posix())
def test_no_inline_style_or_unextractable_text(path):
    """CSP: no style attributes set from JS; i18n: `_()` takes plain string literals."""
    if path.name == "i18n.js":
        pytest.skip("the definition of _()")
    text = re.sub(r"/\*.*?\*/|^\s*//.*$", "", path.read_text(), flags=re.S | re.M)
    assert not re.search(r"setAttribute\(\s*[\"']style", text)
    assert ".innerHTML" not in text
    for call in re.finditer(r"(?<![\w.])_\(([^)]?)", text):
        assert call.group(1) in ('"',), f"{path.name}: _() must take a string literal"
