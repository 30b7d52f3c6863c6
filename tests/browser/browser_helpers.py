"""Shared steps of the browser tests: the screens, reading results, waiting."""

import math

#: Screen ids (= address fragments) and their endpoints; "engine" has no calculation.
SCREENS = {
    "site": "site",
    "pressure-ratio": "pressure-ratio",
    "power": "power",
    "boost-for-power": "boost-for-power",
    "airflow": "airflow",
    "injectors": "injectors",
    "fuel-pump": "fuel-pump",
}
ALL_VIEWS = ["engine", *SCREENS]


def open_screen(page, screen_id):
    """Go to a screen and wait for its result (or its error) to be shown."""
    page.goto(f"/#/{screen_id}")
    wait_for_result(page, screen_id)


def wait_for_result(page, screen_id):
    if screen_id == "engine":
        page.wait_for_selector("[data-screen=engine] .manager")
        return
    page.wait_for_selector(f"[data-screen='{screen_id}'] .results :is(.result-list, .error)")
    page.wait_for_load_state("networkidle")


def shown_results(page):
    """{field: (value, unit)} of the results panel; value None for 'not reached'."""
    rows = page.eval_on_selector_all(
        ".results .result",
        "els => els.map(e => [e.dataset.field, e.querySelector('dd').dataset.value, "
        "e.querySelector('dd').dataset.unit || ''])")
    out = {}
    for name, value, unit in rows:
        out[name] = (None if value == "null" else float(value), unit)
    return out


def api_value(body, name):
    value = body[name]
    if value is None:
        return None, ""
    if isinstance(value, dict):
        return value["value"], value["unit"]
    return value, ""


def close(a, b, rel=1e-9, floor=1e-9):
    if a is None or b is None:
        return a is b
    return math.isclose(a, b, rel_tol=rel, abs_tol=floor)
