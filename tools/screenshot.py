"""Take the README's phone screenshot: the demo setup's power check at 360 x 740 CSS px,
scrolled to its result.

    python tools/screenshot.py            # writes docs/screenshot-phone.png

Serves the app on 127.0.0.1 (a free port) and drives Debian's Chromium headless through
Playwright, as the browser tests do. Run it again when the look of the app changes.
"""

import shutil
import sys
import threading
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

from playwright.sync_api import sync_playwright  # noqa: E402
from werkzeug.serving import make_server  # noqa: E402

from tests.browser.conftest import CHROMIUM_ARGS, PHONE  # noqa: E402
from webcalc import create_app  # noqa: E402

OUT = ROOT / "docs" / "screenshot-phone.png"


def main():
    server = make_server("127.0.0.1", 0, create_app(), threaded=True)
    threading.Thread(target=server.serve_forever, daemon=True).start()
    base = f"http://127.0.0.1:{server.server_port}"
    try:
        with sync_playwright() as p:
            browser = p.chromium.launch(executable_path=shutil.which("chromium"), args=CHROMIUM_ARGS, headless=True)
            context = browser.new_context(base_url=base, service_workers="block", **PHONE)
            page = context.new_page()
            page.goto("/#/power")
            page.wait_for_selector("[data-screen='power'] .results .result-list")
            page.wait_for_load_state("networkidle")
            # The result and its chart in view, as after typing the boost.
            page.evaluate("() => window.scrollTo(0, document.querySelector('.results').offsetTop - 120)")
            page.wait_for_timeout(100)
            OUT.parent.mkdir(exist_ok=True)
            page.screenshot(path=str(OUT))
            browser.close()
    finally:
        server.shutdown()
    print(f"wrote {OUT.relative_to(ROOT)} ({OUT.stat().st_size // 1024} KB)")


if __name__ == "__main__":
    main()
