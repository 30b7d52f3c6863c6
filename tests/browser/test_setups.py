"""Saved setups: survive a reload, export/import round trip, share links, bad files."""

import json

import pytest

from .browser_helpers import open_screen, shown_results

pytestmark = pytest.mark.browser


def saved(page):
    return page.evaluate("() => JSON.parse(localStorage.getItem('webcalc-setups'))")


def edit_engine(page, name, na_power):
    open_screen(page, "engine")
    page.get_by_role("button", name="New setup").click()
    page.get_by_label("Name", exact=True).fill(name)
    page.get_by_label("Name", exact=True).dispatch_event("change")
    page.get_by_label("NA power (without boost)", exact=True).fill(str(na_power))
    page.get_by_label("Number of injectors", exact=True).fill("6")
    page.wait_for_function(
        "n => JSON.parse(localStorage.getItem('webcalc-setups')).setups.some(s => s.name === n "
        "&& s.engine.injector_count === 6)", arg=name)


def test_document_format_and_demo_on_first_visit(phone_no_sw):
    _, page = phone_no_sw
    open_screen(page, "site")
    doc = saved(page)
    assert doc["format"] == "webcalc-setups" and doc["version"] == 2
    assert [s["demo"] for s in doc["setups"]] == [True]


def test_saved_setups_survive_a_reload(phone_no_sw):
    _, page = phone_no_sw
    edit_engine(page, "Test car", 123)
    page.reload()
    open_screen(page, "engine")
    assert page.get_by_label("Setup in use").evaluate("s => s.selectedOptions[0].text") == "Test car"
    assert page.get_by_label("NA power (without boost)", exact=True).input_value() == "123"
    names = [s["name"] for s in saved(page)["setups"]]
    assert len(names) == 2 and "Test car" in names
    # and the calculation screens use it
    open_screen(page, "power")
    assert "Test car" in page.locator(".setup-line").inner_text()


def test_export_then_import_gives_back_the_same_setup(phone_no_sw, browser, base_url, tmp_path):
    _, page = phone_no_sw
    edit_engine(page, "Export me", 111)
    with page.expect_download() as info:
        page.get_by_role("button", name="Export file").click()
    path = tmp_path / "setups.json"
    info.value.save_as(path)
    exported = json.loads(path.read_text())
    assert exported["format"] == "webcalc-setups" and exported["version"] == 2
    original = next(s for s in exported["setups"] if s["name"] == "Export me")

    from .conftest import PHONE
    other = browser.new_context(base_url=base_url, service_workers="block", **PHONE)
    try:
        fresh = other.new_page()
        open_screen(fresh, "engine")
        fresh.locator("input[type=file]").set_input_files(str(path))
        fresh.wait_for_selector(".message--ok")
        back = next(s for s in saved(fresh)["setups"] if s["name"] == "Export me")
        assert back["engine"] == original["engine"]
        # importing the same file again adds nothing
        fresh.locator("input[type=file]").set_input_files(str(path))
        fresh.wait_for_function("() => document.querySelector('.manager__message').textContent.includes('already')")
        assert len(saved(fresh)["setups"]) == 2
    finally:
        other.close()


@pytest.mark.parametrize("content", [
    "{not json",
    json.dumps({"format": "something-else", "version": 1, "setups": []}),
    json.dumps({"format": "webcalc-setups", "version": 99, "setups": []}),
    json.dumps({"format": "webcalc-setups", "version": 1, "setups": [
        {"name": "Bad", "engine": {"na_power": {"value": "lots", "unit": "kW"}}}]}),
    json.dumps({"format": "webcalc-setups", "version": 1, "setups": [
        {"name": "Bad unit", "engine": {"na_power": {"value": 100, "unit": "psig"}}}]}),
])
def test_corrupt_import_is_refused_and_nothing_is_lost(phone_no_sw, tmp_path, content):
    _, page = phone_no_sw
    edit_engine(page, "Keep me", 99)
    before = saved(page)
    path = tmp_path / "bad.json"
    path.write_text(content)
    page.locator("input[type=file]").set_input_files(str(path))
    message = page.locator(".message--error")
    message.wait_for()
    assert "Import refused" in message.inner_text()
    assert "nothing saved was changed" in message.inner_text()
    assert saved(page) == before
    page.reload()
    assert saved(page) == before


def test_share_link_restores_the_inputs(phone_no_sw, browser, base_url):
    context, page = phone_no_sw
    edit_engine(page, "Shared car", 140)
    open_screen(page, "pressure-ratio")
    page.get_by_label("Boost (gauge)", exact=True).fill("1.35")
    page.wait_for_function("() => JSON.parse(localStorage.getItem('webcalc-inputs')).boost.value === 1.35")
    open_screen(page, "pressure-ratio")
    shown = shown_results(page)
    open_screen(page, "engine")
    context.grant_permissions(["clipboard-read", "clipboard-write"])
    page.get_by_role("button", name="Share link").click()
    link = page.locator(".share-link").input_value()
    assert "#/site?s=" in link

    from .conftest import PHONE
    other = browser.new_context(base_url=base_url, service_workers="block", **PHONE)
    try:
        fresh = other.new_page()
        fresh.goto(link.replace("#/site", "#/pressure-ratio"))
        fresh.wait_for_selector(".notice")
        assert "Shared car" in fresh.locator(".notice").inner_text()
        open_screen(fresh, "pressure-ratio")
        assert fresh.get_by_label("Boost (gauge)", exact=True).input_value() == "1.35"
        assert "Shared car" in fresh.locator(".setup-line").inner_text()
        assert shown_results(fresh) == shown
        assert "s=" not in fresh.url  # the data leaves the address bar once restored
    finally:
        other.close()
