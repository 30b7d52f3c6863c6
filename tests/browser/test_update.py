"""A new service worker version: reload quietly when untouched, else offer a reload.

Playwright's routing does not see the browser's fetch of the worker script, so the app
is served here through a small WSGI wrapper that can change /sw.js (as a deploy with a
new VERSION does).
"""

import threading

import pytest
from werkzeug.serving import make_server

from .browser_helpers import open_screen
from .conftest import PHONE

pytestmark = pytest.mark.browser


class Deploy:
    """WSGI wrapper: after `bump()`, /sw.js ends with a new comment (new bytes)."""

    def __init__(self, app):
        self.app = app
        self.version = 0

    def bump(self):
        self.version += 1

    def __call__(self, environ, start_response):
        if environ.get("PATH_INFO") != "/sw.js" or not self.version:
            return self.app(environ, start_response)
        for key in ("HTTP_IF_NONE_MATCH", "HTTP_IF_MODIFIED_SINCE"):
            environ.pop(key, None)  # always answer the new bytes, never 304
        captured = {}

        def capture(status, headers, exc_info=None):
            captured["status"], captured["headers"] = status, headers

        body = b"".join(self.app(environ, capture))
        if captured["status"].startswith("200"):
            body += f"\n// deploy {self.version}\n".encode()
        headers = [(k, v) for k, v in captured["headers"]
                   if k.lower() not in ("content-length", "etag", "last-modified")]
        start_response(captured["status"], headers + [("Content-Length", str(len(body)))])
        return [body]


@pytest.fixture
def deploy(app):
    wrapper = Deploy(app)
    server = make_server("127.0.0.1", 0, wrapper, threaded=True)
    threading.Thread(target=server.serve_forever, daemon=True).start()
    wrapper.url = f"http://127.0.0.1:{server.server_port}"
    yield wrapper
    server.shutdown()


@pytest.fixture
def updating_page(browser, deploy):
    context = browser.new_context(base_url=deploy.url, **PHONE)
    page = context.new_page()
    page.goto("/")
    page.evaluate("() => navigator.serviceWorker.ready")
    page.wait_for_function("() => navigator.serviceWorker.controller !== null")
    page.wait_for_selector(".results .result-list")
    yield page
    context.close()


def check_for_update(page):
    page.evaluate("() => navigator.serviceWorker.getRegistration().then(r => r.update())")


def test_update_reloads_quietly_when_the_user_has_not_typed(updating_page, deploy):
    page = updating_page
    deploy.bump()
    with page.expect_event("load", timeout=15000):
        check_for_update(page)
    page.wait_for_selector(".results .result-list")
    assert page.locator(".notice--update").count() == 0


def test_update_waits_for_the_user_once_typing_started(updating_page, deploy):
    page = updating_page
    open_screen(page, "pressure-ratio")
    page.get_by_label("Boost (gauge)", exact=True).fill("1.1")
    deploy.bump()
    check_for_update(page)
    notice = page.locator(".notice--update")
    notice.wait_for(timeout=15000)
    assert page.get_by_label("Boost (gauge)", exact=True).input_value() == "1.1"
    with page.expect_event("load", timeout=15000):
        notice.get_by_role("button", name="Reload now").click()
    page.wait_for_selector(".results .result-list")
    # old caches are gone: only the current version's cache is left
    names = page.evaluate("() => caches.keys()")
    assert len([n for n in names if n.startswith("webcalc-")]) == 1
