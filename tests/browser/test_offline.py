"""After the first visit the app works with the network off: the service worker serves
the shell and answers the API from the in-browser engine."""

import pytest

from .browser_helpers import SCREENS, close, open_screen, shown_results, wait_for_result

pytestmark = pytest.mark.browser


def controlled(page):
    page.goto("/")
    page.evaluate("() => navigator.serviceWorker.ready")
    page.wait_for_function("() => navigator.serviceWorker.controller !== null")


def test_shell_loads_offline(phone):
    context, page = phone
    controlled(page)
    context.set_offline(True)
    page.reload()
    page.wait_for_selector(".appbar__title")
    assert page.title() == "Boost and fuel check"
    page.wait_for_selector("[data-screen=site] .results :is(.result-list, .error)")
    assert page.locator(".cautions li").count() >= 1  # cautions never gone, also offline
    # the engine view is precached too
    page.goto("/#/engine")
    page.wait_for_selector("[data-screen=engine] .manager")


def test_every_screen_computes_offline_with_the_same_numbers(phone):
    context, page = phone
    controlled(page)
    online = {}
    for screen_id in SCREENS:
        open_screen(page, screen_id)
        online[screen_id] = shown_results(page)
        assert page.locator(".badge--device").count() == 0
    context.set_offline(True)
    page.reload()
    for screen_id in SCREENS:
        page.goto(f"/#/{screen_id}")
        wait_for_result(page, screen_id)
        offline = shown_results(page)
        assert page.locator(".badge--device").is_visible(), f"{screen_id}: no device marker"
        assert offline.keys() == online[screen_id].keys(), screen_id
        for name, (value, unit) in online[screen_id].items():
            # SPEC section 7 parity: |a - b| <= 1e-9 max(|a|, |b|) + floor
            assert close(offline[name][0], value, rel=1e-9, floor=1e-6), f"{screen_id}.{name}"
            assert offline[name][1] == unit


def test_api_down_falls_back_to_the_device(phone):
    """Only the API unreachable (server up): the worker answers from the device."""
    context, page = phone
    controlled(page)
    context.route("**/api/v1/**", lambda route: route.abort("connectionrefused"))
    open_screen(page, "site")
    assert page.locator(".badge--device").is_visible()
    assert page.locator(".results .result-list").is_visible()
