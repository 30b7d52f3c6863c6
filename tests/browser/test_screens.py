"""Every screen computes from the saved (demo) setup and shows what the API answers."""

import pytest

from .browser_helpers import SCREENS, api_value, close, open_screen, shown_results

pytestmark = pytest.mark.browser


def test_every_screen_shows_the_api_numbers(phone_no_sw):
    context, page = phone_no_sw
    sent = []

    def record(request):
        if "/api/v1/" in request.url and request.headers.get("x-webcalc-purpose") == "result":
            sent.append(request)

    page.on("request", record)
    page.goto("/")
    for screen_id, endpoint in SCREENS.items():
        sent.clear()
        open_screen(page, screen_id)
        mine = [r for r in sent if r.url.endswith(f"/api/v1/{endpoint}")]
        assert mine, f"{screen_id}: no result request seen"
        body = mine[-1].post_data_json
        assert body["units"] == "metric" and body["lang"] == "en"
        direct = page.request.post(f"/api/v1/{endpoint}", data=body)
        assert direct.status == 200, direct.text()
        expected = direct.json()
        shown = shown_results(page)
        assert len(shown) >= 4, f"{screen_id}: too few results shown: {shown}"
        for name, (value, unit) in shown.items():
            want, want_unit = api_value(expected, name)
            assert close(value, want), f"{screen_id}.{name}: shown {value}, API {want}"
            assert unit == want_unit, f"{screen_id}.{name}: unit {unit} vs {want_unit}"
        # the general cautions are on every screen, from the response
        codes = page.eval_on_selector_all(".cautions li", "els => els.map(e => e.dataset.code)")
        assert codes == [c["code"] for c in expected["cautions"]]
        # warnings from the response are shown next to the result, in the same order
        warn = page.eval_on_selector_all(".results .warning", "els => els.map(e => e.dataset.code)")
        assert warn == [w["code"] for w in expected["warnings"]]


def test_demo_is_marked_and_shows_real_results(phone_no_sw):
    _, page = phone_no_sw
    open_screen(page, "power")
    assert page.locator(".setup-line .badge--demo").is_visible()
    shown = shown_results(page)
    assert shown["expected_power"][0] > 0 and shown["expected_power"][1] == "kW"
    assert page.locator(".scope").is_visible()


def test_typing_updates_the_result_and_field_errors_sit_by_the_field(phone_no_sw):
    _, page = phone_no_sw
    open_screen(page, "pressure-ratio")
    before = shown_results(page)["pressure_ratio"][0]
    boost = page.get_by_label("Boost (gauge)", exact=True)
    assert boost.get_attribute("inputmode") == "decimal"
    boost.fill("1.5")
    page.wait_for_function(
        "v => document.querySelector('[data-field=pressure_ratio] dd')?.dataset.value !== v",
        arg=str(before))
    assert shown_results(page)["pressure_ratio"][0] > before
    boost.fill("9")  # 900 kPa: above the hard range, a 400 naming "boost"
    error = page.locator("[data-field=boost] .field__error")
    error.wait_for(state="visible")
    assert error.inner_text().strip()
    boost.fill("abc")
    assert "number" in error.inner_text()


def test_unit_system_switch_converts_inputs_and_results(phone_no_sw):
    _, page = phone_no_sw
    open_screen(page, "power")
    metric = shown_results(page)["expected_power"]
    page.get_by_role("button", name="Imperial").click()
    page.wait_for_selector("[data-field=expected_power] dd[data-unit=hp]")
    page.wait_for_load_state("networkidle")
    imperial = shown_results(page)["expected_power"]
    # 1 hp = 745.69987158227 W; inputs are rounded to 4 digits on conversion
    assert imperial[0] * 0.74569987158227 == pytest.approx(metric[0], rel=2e-3)
    assert page.get_by_label("Unit of Boost (gauge)").input_value() == "psi"


def test_tap_targets_are_big(phone_no_sw):
    _, page = phone_no_sw
    open_screen(page, "fuel-pump")
    small = page.eval_on_selector_all(
        "button, select, input, .nav__link, summary",
        "els => els.filter(e => e.offsetParent !== null).map(e => [e.outerHTML.slice(0, 60), "
        "e.getBoundingClientRect().height]).filter(([, h]) => h < 44)")
    assert small == []
