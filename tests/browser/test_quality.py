"""Accessibility (axe-core), screenshots at phone and laptop width, and the strict CSP."""

from html.parser import HTMLParser
from urllib.parse import urlsplit

import pytest
from axe_playwright_python.sync_playwright import Axe

from .browser_helpers import ALL_VIEWS, open_screen
from .conftest import PHONE

pytestmark = pytest.mark.browser

CSP = "default-src 'self'"


@pytest.fixture(scope="module")
def axe():
    return Axe()


@pytest.mark.parametrize("theme", ["standard", "sun"])
def test_axe_reports_no_violations_on_any_screen(phone_no_sw, axe, theme):
    _, page = phone_no_sw
    open_screen(page, "site")
    if theme == "sun":
        page.get_by_role("button", name="Sunlight mode").click()
        page.wait_for_selector("html[data-theme=sun]")
    for view in ALL_VIEWS:
        open_screen(page, view)
        page.wait_for_timeout(400)  # charts are drawn shortly after the result
        results = axe.run(page)
        assert results.violations_count == 0, f"{view} ({theme}): {results.generate_report()}"


@pytest.mark.parametrize("width", [360, 1280])
def test_screenshots_of_every_screen(browser, base_url, artifacts, width):
    args = dict(PHONE) if width == 360 else {"viewport": {"width": 1280, "height": 900}, "locale": "en-GB"}
    context = browser.new_context(base_url=base_url, service_workers="block", **args)
    try:
        page = context.new_page()
        for view in ALL_VIEWS:
            open_screen(page, view)
            page.wait_for_timeout(500)
            path = artifacts / f"{view}-{width}.png"
            page.screenshot(path=str(path), full_page=True)
            assert path.stat().st_size > 5000
            # nothing wider than the screen (no sideways scrolling of the page)
            assert page.evaluate("() => document.documentElement.scrollWidth") <= width
    finally:
        context.close()


class ShellParser(HTMLParser):
    def __init__(self):
        super().__init__()
        self.problems = []
        self.urls = []
        self._in_script = False

    def handle_starttag(self, tag, attrs):
        attrs = dict(attrs)
        for name in attrs:
            if name.startswith("on"):
                self.problems.append(f"inline handler {name} on <{tag}>")
        if "style" in attrs:
            self.problems.append(f"style attribute on <{tag}>")
        if tag == "style":
            self.problems.append("<style> element")
        if tag == "script":
            if "src" not in attrs:
                self.problems.append("inline <script>")
            self._in_script = True
        for name in ("src", "href"):
            if name in attrs:
                self.urls.append(attrs[name])

    def handle_endtag(self, tag):
        if tag == "script":
            self._in_script = False

    def handle_data(self, data):
        if self._in_script and data.strip():
            self.problems.append("script with inline code")


def test_shell_has_no_inline_script_and_no_third_party_origin(page, base_url):
    response = page.request.get("/")
    assert response.status == 200
    assert CSP in response.headers["content-security-policy"]
    parser = ShellParser()
    parser.feed(response.text())
    assert parser.problems == []
    for url in parser.urls:
        parts = urlsplit(url)
        assert not parts.scheme and not parts.netloc, f"third-party or absolute URL: {url}"
        assert url.startswith("/")


def test_no_csp_violation_while_using_every_screen(phone):
    context, page = phone
    console = []
    page.on("console", lambda m: console.append(f"{m.type}: {m.text}"))
    context.add_init_script(
        "window.__csp = []; document.addEventListener('securitypolicyviolation', "
        "e => window.__csp.push(e.violatedDirective + ' ' + e.blockedURI));")
    origins = set()
    page.on("request", lambda r: origins.add(urlsplit(r.url).netloc))
    for view in ALL_VIEWS:
        open_screen(page, view)
        page.wait_for_timeout(500)
    page.get_by_role("button", name="Sunlight mode").click()
    page.get_by_role("button", name="Imperial").click()
    open_screen(page, "fuel-pump")
    page.wait_for_timeout(500)
    assert page.evaluate("() => window.__csp") == []
    assert not [c for c in console if "Content Security Policy" in c or c.startswith("error")], console
    assert page.evaluate("() => document.querySelectorAll('[style]').length") == 0
    assert origins == {urlsplit(page.url).netloc}
    # every chart screen drew its chart
    for view in ["power", "boost-for-power", "airflow", "fuel-pump"]:
        open_screen(page, view)
        page.wait_for_selector(f"[data-screen='{view}'] .chart svg")
