"""Every screen in every language: no English left, nothing overflowing at 360 px, numbers
typed with the locale's decimal mark, the language and unit system remembered, the offline
engine speaking the same language. Screenshots of every screen per language are artefacts."""

import re

import pytest

from webcalc import i18n
from webcalc.units import table

from .browser_helpers import ALL_VIEWS, SCREENS, close, open_screen, shown_results, wait_for_result
from .conftest import PHONE

pytestmark = pytest.mark.browser

OTHERS = [loc for loc in i18n.LOCALES if loc != i18n.DEFAULT_LOCALE]
WORD = re.compile(r"[^\W\d_]{4,}")


def words(text):
    return {w.lower() for w in WORD.findall(text)}


def unit_words():
    """Unit spellings (symbols are the same in every language)."""
    return words(" ".join(u for units in table()["dimensions"].values() for u in units))


def english_only(locale):
    """Words of the English message ids that the language's translations never use.

    A word like "boost" or "lambda" that the trade keeps in the language appears in the
    translations and is not counted; anything else seen on screen is English left behind.
    """
    catalog = i18n.catalog(locale)
    english = set().union(*(words(m) for m in catalog))
    native = set().union(*(words(t) for t in catalog.values()))
    return english - native - unit_words()


#: Every visible text of the app (text nodes, labels for assistive technology, options,
#: placeholders), with the elements whose content sticks out of their box.
PAGE_TEXT = """() => {
  const root = document.body;
  const texts = [];
  const walker = document.createTreeWalker(root, NodeFilter.SHOW_TEXT);
  for (let n = walker.nextNode(); n; n = walker.nextNode()) {
    const el = n.parentElement;
    if (!el || !n.textContent.trim() || el.closest("script, style, noscript")) continue;
    if (el.tagName === "OPTION" || el.checkVisibility()) texts.push(n.textContent.trim());
  }
  for (const el of root.querySelectorAll("[aria-label], [placeholder], [title]")) {
    for (const a of ["aria-label", "placeholder", "title"]) if (el.getAttribute(a)) texts.push(el.getAttribute(a));
  }
  const overflowing = [];
  for (const el of root.querySelectorAll("*")) {
    // Form controls scroll their own text, and visually hidden text is 1 px on purpose.
    if (!el.checkVisibility() || el.closest("svg") || ["INPUT", "TEXTAREA", "SELECT"].includes(el.tagName)) continue;
    if (el.getBoundingClientRect().width <= 1) continue;
    const style = getComputedStyle(el);
    if (["auto", "scroll"].includes(style.overflowX) || style.display === "inline") continue;
    if (el.clientWidth > 0 && el.scrollWidth > el.clientWidth + 1) {
      overflowing.push(`${el.tagName.toLowerCase()}.${el.className}: ${el.textContent.trim().slice(0, 60)}`);
    }
  }
  const pageWidth = document.documentElement.scrollWidth;
  return { texts, overflowing, pageWidth, innerWidth: window.innerWidth, lang: document.documentElement.lang };
}"""


def open_everything(page):
    """Open the collapsible parts (help, cautions, charts' tables) so their text is checked."""
    page.evaluate("() => document.querySelectorAll('details').forEach(d => { d.open = true; })")


@pytest.mark.parametrize("locale", OTHERS)
def test_every_screen_in_the_language_without_english_or_overflow(browser, base_url, artifacts, locale):
    tag = locale.replace("_", "-")
    context = browser.new_context(base_url=base_url, service_workers="block", **dict(PHONE, locale=tag))
    page = context.new_page()
    leftovers = english_only(locale)
    problems = []
    try:
        for view in ALL_VIEWS:
            page.goto(f"/#/{view}")
            wait_for_result(page, view)
            open_everything(page)
            page.wait_for_timeout(50)
            seen = page.evaluate(PAGE_TEXT)
            assert seen["lang"] == tag
            english = sorted(set().union(*(words(t) for t in seen["texts"])) & leftovers)
            if english:
                problems.append(f"{view}: English left: {english}")
            if seen["overflowing"]:
                problems.append(f"{view}: overflowing: {seen['overflowing'][:5]}")
            if seen["pageWidth"] > seen["innerWidth"]:
                problems.append(f"{view}: page {seen['pageWidth']} px wide at {seen['innerWidth']} px")
            page.screenshot(path=str(artifacts / f"lang-{locale}-{view}.png"), full_page=True)
    finally:
        context.close()
    assert not problems, "\n".join(problems)


def _typed_boost_result(browser, base_url, tag, text):
    context = browser.new_context(base_url=base_url, service_workers="block", **dict(PHONE, locale=tag))
    page = context.new_page()
    try:
        open_screen(page, "pressure-ratio")
        locale = i18n.negotiate(tag)
        label = i18n.catalog(locale).get("Boost (gauge)", "Boost (gauge)")
        field = page.get_by_label(label, exact=True)
        before = shown_results(page)["pressure_ratio"][0]
        field.fill(text)
        page.wait_for_function(
            "(b) => { const d = document.querySelector('.results [data-field=pressure_ratio] dd');"
            " return d && Number(d.dataset.value) !== b; }", arg=before)
        page.wait_for_load_state("networkidle")
        return shown_results(page), field.input_value()
    finally:
        context.close()


def test_a_decimal_comma_in_german_gives_the_same_result_as_a_point_in_english(browser, base_url):
    german, shown_de = _typed_boost_result(browser, base_url, "de-DE", "1,35")
    english, shown_en = _typed_boost_result(browser, base_url, "en-GB", "1.35")
    assert shown_de == "1,35" and shown_en == "1.35"
    assert german.keys() == english.keys()
    for name, (value, unit) in english.items():
        assert close(german[name][0], value), name
        assert german[name][1] == unit


def test_results_are_formatted_for_the_locale(browser, base_url):
    # CLDR (Intl in the browser): German writes 1,234 where English writes 1.234.
    context = browser.new_context(base_url=base_url, service_workers="block", **dict(PHONE, locale="de-DE"))
    page = context.new_page()
    try:
        open_screen(page, "pressure-ratio")
        text = page.locator(".results [data-field=pressure_ratio] dd").inner_text()
        value = float(page.locator(".results [data-field=pressure_ratio] dd").get_attribute("data-value"))
        assert "," in text and "." not in text, text
        assert text.replace(",", ".").split()[0] == f"{value:.3f}".rstrip("0").rstrip(".")
    finally:
        context.close()


def test_language_picker_is_remembered_on_the_device(phone_no_sw):
    _, page = phone_no_sw
    page.goto("/")
    page.wait_for_selector(".appbar__title")
    assert page.evaluate("document.documentElement.lang") == "en"
    with page.expect_navigation():
        page.select_option("select.language", "pt_BR")
    page.wait_for_selector(".appbar__title")
    assert page.evaluate("document.documentElement.lang") == "pt-BR"
    assert page.locator(".appbar__title").inner_text() == i18n.catalog("pt_BR")["Boost and fuel check"]
    page.reload()
    page.wait_for_selector(".appbar__title")
    assert page.evaluate("document.documentElement.lang") == "pt-BR"
    assert page.locator("select.language").input_value() == "pt_BR"


@pytest.mark.parametrize("tag, system", [("en-US", "imperial"), ("de-DE", "metric"), ("pt-BR", "metric"),
                                         ("en-GB", "metric")])
def test_unit_system_defaults_by_region_and_the_choice_wins(browser, base_url, tag, system):
    # Common practice, no source: the US works in imperial units, most of the world in metric.
    context = browser.new_context(base_url=base_url, service_workers="block", **dict(PHONE, locale=tag))
    page = context.new_page()
    try:
        open_screen(page, "power")
        pressed = page.locator(".segmented [aria-pressed=true]").get_attribute("data-system")
        assert pressed == system
        other = "metric" if system == "imperial" else "imperial"
        page.click(f".segmented [data-system={other}]")
        page.reload()
        wait_for_result(page, "power")
        assert page.locator(".segmented [aria-pressed=true]").get_attribute("data-system") == other
    finally:
        context.close()


def test_offline_engine_answers_in_the_same_language(browser, base_url):
    context = browser.new_context(base_url=base_url, **dict(PHONE, locale="fr-FR"))
    page = context.new_page()
    try:
        page.goto("/")
        page.evaluate("() => navigator.serviceWorker.ready")
        page.wait_for_function("() => navigator.serviceWorker.controller !== null")
        online = {}
        for screen_id in ("injectors", "power"):
            open_screen(page, screen_id)
            online[screen_id] = page.eval_on_selector_all(".results .warning, .cautions li",
                                                           "els => els.map(e => e.textContent)")
        context.set_offline(True)
        page.reload()
        for screen_id in ("injectors", "power"):
            page.goto(f"/#/{screen_id}")
            wait_for_result(page, screen_id)
            assert page.locator(".badge--device").is_visible()
            offline = page.eval_on_selector_all(".results .warning, .cautions li",
                                                "els => els.map(e => e.textContent)")
            assert offline == online[screen_id] and offline, screen_id
        french = set(i18n.catalog("fr").values())
        assert any(text in french for text in online["power"]) or any(
            any(t in text for t in french) for text in online["power"])
    finally:
        context.close()
