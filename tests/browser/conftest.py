"""Browser test fixtures: the app served by Werkzeug in a thread, Debian's Chromium.

Follows shared BROWSER-TESTS.md: system chromium found with shutil.which, the listed
flags, a session server on a free port (``make_server("127.0.0.1", 0, ...)``),
pytest-playwright's ``base_url`` overridden, a phone context (360 x 740, touch).
"""

import shutil
import threading
from pathlib import Path

import pytest
from werkzeug.serving import make_server

ARTIFACTS = Path(__file__).parent / "artifacts"

CHROMIUM_ARGS = [
    "--no-sandbox",
    "--disable-gpu",
    "--disable-quic",
    "--no-first-run",
    "--disable-background-networking",
    "--disable-component-update",
    "--disable-sync",
    "--host-resolver-rules=MAP * ~NOTFOUND , EXCLUDE localhost , EXCLUDE 127.0.0.1",
]

PHONE = {
    "viewport": {"width": 360, "height": 740},
    "device_scale_factor": 2,
    "has_touch": True,
    "is_mobile": True,
    "locale": "en-GB",
}


def chromium_path():
    path = shutil.which("chromium") or shutil.which("chromium-browser")
    if not path:
        pytest.fail("No Chromium found: install it with `apt-get install -y chromium fonts-liberation`",
                    pytrace=False)
    return path


@pytest.fixture(scope="session")
def browser_type_launch_args(browser_type_launch_args):
    return {**browser_type_launch_args, "executable_path": chromium_path(), "args": CHROMIUM_ARGS}


@pytest.fixture(scope="session")
def live_server(app):
    """The app (``webcalc.create_app()``, shared fixture) on a free port, in a daemon thread."""
    server = make_server("127.0.0.1", 0, app, threaded=True)
    thread = threading.Thread(target=server.serve_forever, daemon=True)
    thread.start()
    yield f"http://127.0.0.1:{server.server_port}"
    server.shutdown()


@pytest.fixture(scope="session")
def base_url(live_server):
    return live_server


@pytest.fixture(scope="session")
def browser_context_args(browser_context_args):
    return {**browser_context_args, **PHONE}


@pytest.fixture(scope="session")
def artifacts():
    ARTIFACTS.mkdir(exist_ok=True)
    return ARTIFACTS


@pytest.fixture
def phone(browser, base_url):
    """A fresh phone context with the service worker allowed; yields (context, page)."""
    context = browser.new_context(base_url=base_url, **PHONE)
    page = context.new_page()
    yield context, page
    context.close()


@pytest.fixture
def phone_no_sw(browser, base_url):
    """A phone context without service workers: every request reaches the server."""
    context = browser.new_context(base_url=base_url, service_workers="block", **PHONE)
    page = context.new_page()
    yield context, page
    context.close()
