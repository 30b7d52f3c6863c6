"""What the user saved survives: a format migration, corrupt or full storage, a document
from a newer version of the app, and export then import (a property test).

Saved data is seeded with ``page.add_init_script`` before the app's own scripts run.
Full storage is simulated by making ``Storage.prototype.setItem`` throw a
``QuotaExceededError`` (the DOMException name browsers use for it, per the HTML
standard's Web Storage section) for the setups key only.
"""

import json
import re

import pytest
from hypothesis import HealthCheck, given, seed, settings
from hypothesis import strategies as st

from .browser_helpers import open_screen

pytestmark = pytest.mark.browser

KEY = "webcalc-setups"
FULL_TEXT = "storage is full or off"
UNREADABLE_TEXT = "could not be read"
DEMO_NAME = "Demo: club hill-climb car (invented)"


# --- helpers ----------------------------------------------------------------------------

def q(value, unit):
    return {"value": value, "unit": unit}


def engine(**changes):
    """A complete, valid engine setup (invented values), with `changes` applied."""
    base = {
        "na_power": q(160, "kW"), "na_power_basis": "observed",
        "na_site": {"source": "altitude", "altitude": q(300, "m"), "altimeter_setting": None,
                    "station_pressure": None, "temperature": q(20, "degC"), "relative_humidity": 0.3},
        "displacement": q(1.8, "L"), "induction": "turbo", "compressor_count": 1,
        "intercooler": True, "intercooler_effectiveness": 0.7, "compressor_efficiency": None,
        "inlet_loss": None, "intercooler_loss": None, "fuel": "gasoline", "ethanol_content": None,
        "injector_count": 4, "injector_flow": q(440, "cc/min"), "rated_pressure": q(3, "bar"),
        "base_fuel_pressure": q(3, "bar"), "regulator": "boost_referenced", "pump_count": 1,
        "pump_curve": None, "power_basis": "crank", "drivetrain_loss": None,
    }
    base.update(changes)
    return base


def v1_document():
    """A version-1 document (no notes) with two setups and unusual names."""
    return {"format": KEY, "version": 1, "active": "s-track", "setups": [
        {"id": "s-hill", "name": "Hill-climb car «A»", "demo": False, "engine": engine(
            na_power=q(180, "kW"), displacement=q(2.5, "L"), injector_count=6,
            pump_curve={"pressure_unit": "bar", "flow_unit": "L/h",
                        "points": [[3, 250], [5, 221.5], [7, None]]})},
        {"id": "s-track", "name": 'Track "B" \u2014 \u6f22\u5b57', "demo": False, "engine": engine(
            na_power=q(97, "hp"), induction="roots", intercooler=False, fuel="e85",
            ethanol_content=0.85, compressor_count=2, power_basis="wheel", drivetrain_loss=0.15,
            na_site={"source": "station", "altitude": None, "altimeter_setting": None,
                     "station_pressure": q(29.1, "inHg"), "temperature": q(77, "degF"),
                     "relative_humidity": None})},
    ]}


def seed_storage(context, items, only_if_empty=True):
    """Put `items` ({key: text}) in local storage before the app runs (first load only)."""
    context.add_init_script(
        "(([items, onlyIfEmpty]) => {"
        " if (onlyIfEmpty && localStorage.getItem('webcalc-setups') !== null) return;"
        " for (const [k, v] of Object.entries(items)) localStorage.setItem(k, v); })"
        f"({json.dumps([items, only_if_empty])});")


def make_storage_full(context, key=KEY):
    """setItem throws QuotaExceededError for `key` until `window.storageFreed` is set."""
    context.add_init_script("""((full) => {
      const setItem = Storage.prototype.setItem;
      Storage.prototype.setItem = function (key, value) {
        if (key === full && !window.storageFreed) {
          throw new DOMException('The quota has been exceeded.', 'QuotaExceededError');
        }
        return setItem.call(this, key, value);
      };
    })(%s);""" % json.dumps(key))


def stored(page, key=KEY):
    return page.evaluate("k => localStorage.getItem(k)", key)


def stored_keys(page):
    return page.evaluate("() => Object.keys(localStorage)")


def watch_errors(page):
    errors = []
    page.on("pageerror", lambda exc: errors.append(str(exc)))
    return errors


def storage_note(page):
    return page.locator(".manager__storage")


def picker_names(page):
    return page.get_by_label("Setup in use").evaluate("s => [...s.options].map(o => o.text)")


def difference(a, b, path="$"):
    """Where two JSON values differ (a path), or None when they are exactly equal: bool
    is not a number, dict keys and list lengths must match. Numbers compare as the
    doubles JSON carries (a JavaScript export writes 1e16 as 10000000000000000)."""
    if isinstance(a, bool) or isinstance(b, bool):
        return None if type(a) is type(b) and a == b else path
    if isinstance(a, (int, float)) and isinstance(b, (int, float)):
        return None if float(a) == float(b) else path
    if isinstance(a, dict) and isinstance(b, dict):
        if a.keys() != b.keys():
            return f"{path} keys {sorted(a.keys() ^ b.keys())}"
        return next((d for k in a if (d := difference(a[k], b[k], f"{path}.{k}"))), None)
    if isinstance(a, list) and isinstance(b, list):
        if len(a) != len(b):
            return f"{path} length {len(a)} != {len(b)}"
        return next((d for i, (x, y) in enumerate(zip(a, b)) if (d := difference(x, y, f"{path}[{i}]"))),
                    None)
    return None if type(a) is type(b) and a == b else path


def same(a, b):
    return difference(a, b) is None


def with_notes(doc, notes=""):
    out = json.loads(json.dumps(doc))
    out["version"] = 2
    for setup in out["setups"]:
        setup.setdefault("notes", notes)
    return out


# --- migration --------------------------------------------------------------------------

def test_a_version_1_document_is_migrated_on_load_and_the_old_text_kept(phone_no_sw):
    context, page = phone_no_sw
    errors = watch_errors(page)
    old_text = json.dumps(v1_document(), ensure_ascii=False)
    seed_storage(context, {KEY: old_text})
    open_screen(page, "engine")

    saved = json.loads(stored(page))
    # every setup and value is there, in the version-2 format (notes added, empty)
    assert same(saved, with_notes(v1_document()))
    # the original text is kept aside, untouched
    assert stored(page, f"{KEY}-v1") == old_text
    assert picker_names(page) == ["Hill-climb car «A»", 'Track "B" \u2014 \u6f22\u5b57']
    assert page.get_by_label("Setup in use").evaluate("s => s.value") == "s-track"
    assert page.get_by_label("NA power (without boost)", exact=True).input_value() == "97"
    assert storage_note(page).is_hidden()
    assert errors == []

    # a second load finds version 2: nothing more is copied aside
    page.reload()
    open_screen(page, "engine")
    assert same(json.loads(stored(page)), with_notes(v1_document()))
    assert sorted(k for k in stored_keys(page) if k.startswith(KEY)) == [KEY, f"{KEY}-v1"]


def test_the_old_text_stays_in_place_until_the_migrated_one_is_written(phone_no_sw):
    context, page = phone_no_sw
    errors = watch_errors(page)
    old_text = json.dumps(v1_document(), ensure_ascii=False)
    seed_storage(context, {KEY: old_text})
    make_storage_full(context)
    open_screen(page, "engine")

    # the device refused the migrated document: the version-1 text is where it was
    assert stored(page) == old_text
    assert stored(page, f"{KEY}-v1") == old_text
    assert FULL_TEXT in storage_note(page).inner_text()
    # the setups are on screen all the same, and an edit stays on screen
    assert picker_names(page) == ["Hill-climb car «A»", 'Track "B" \u2014 \u6f22\u5b57']
    page.get_by_label("NA power (without boost)", exact=True).fill("101")
    page.get_by_label("NA power (without boost)", exact=True).blur()
    assert stored(page) == old_text
    assert page.get_by_label("NA power (without boost)", exact=True).input_value() == "101"

    # space comes back: the next change writes the migrated document, edit included
    page.evaluate("() => { window.storageFreed = true; }")
    page.get_by_label("Number of injectors", exact=True).fill("8")
    page.wait_for_function("() => JSON.parse(localStorage.getItem('webcalc-setups')).version === 2")
    saved = json.loads(stored(page))
    track = next(s for s in saved["setups"] if s["id"] == "s-track")
    assert track["engine"]["na_power"] == q(101, "hp") and track["engine"]["injector_count"] == 8
    assert track["notes"] == ""
    storage_note(page).wait_for(state="hidden")
    assert stored(page, f"{KEY}-v1") == old_text
    assert errors == []


def test_without_room_for_the_copy_aside_the_old_text_is_not_replaced(phone_no_sw):
    context, page = phone_no_sw
    errors = watch_errors(page)
    old_text = json.dumps(v1_document(), ensure_ascii=False)
    seed_storage(context, {KEY: old_text})
    make_storage_full(context, f"{KEY}-v1")
    open_screen(page, "engine")
    assert FULL_TEXT in storage_note(page).inner_text()
    page.get_by_label("Number of injectors", exact=True).fill("7")
    page.get_by_label("Number of injectors", exact=True).blur()
    assert stored(page) == old_text and stored(page, f"{KEY}-v1") is None
    assert page.get_by_label("Number of injectors", exact=True).input_value() == "7"
    assert errors == []


def test_an_older_export_file_is_migrated_on_import(phone_no_sw, tmp_path):
    _, page = phone_no_sw
    open_screen(page, "engine")
    path = tmp_path / "old-export.json"
    path.write_text(json.dumps(v1_document(), ensure_ascii=False), encoding="utf-8")
    page.locator("input[type=file]").set_input_files(str(path))
    page.wait_for_selector(".message--ok")
    saved = json.loads(stored(page))
    assert saved["version"] == 2
    imported = [s for s in saved["setups"] if s["id"] in ("s-hill", "s-track")]
    assert same(imported, with_notes(v1_document())["setups"])
    assert saved["active"] == "s-track"


def test_notes_are_saved_shown_and_exported(phone_no_sw, tmp_path):
    _, page = phone_no_sw
    open_screen(page, "engine")
    text = "Dyno day: 98 RON, cold morning.\nCheck the \"wastegate\" line."
    page.get_by_label("Notes", exact=True).fill(text)
    page.wait_for_function("t => JSON.parse(localStorage.getItem('webcalc-setups')).setups[0].notes === t",
                           arg=text)
    page.reload()
    open_screen(page, "engine")
    assert page.get_by_label("Notes", exact=True).input_value() == text
    with page.expect_download() as info:
        page.get_by_role("button", name="Export file").click()
    path = tmp_path / "export.json"
    info.value.save_as(path)
    exported = json.loads(path.read_text(encoding="utf-8"))
    assert exported["version"] == 2 and exported["setups"][0]["notes"] == text
    # a new setup starts with empty notes, saved as such
    page.get_by_role("button", name="New setup").click()
    assert page.get_by_label("Notes", exact=True).input_value() == ""
    assert [s["notes"] for s in json.loads(stored(page))["setups"]] == [text, ""]


# --- a document from a newer version ------------------------------------------------------

def test_a_document_from_a_newer_version_is_refused_and_never_overwritten(phone_no_sw):
    context, page = phone_no_sw
    errors = watch_errors(page)
    future = {"format": KEY, "version": 3, "active": "x",
              "setups": [{"id": "x", "name": "From the future", "engine": {"warp": 9}}]}
    text = json.dumps(future)
    seed_storage(context, {KEY: text})
    open_screen(page, "engine")
    assert "newer version" in storage_note(page).inner_text()
    assert picker_names(page) == [DEMO_NAME]
    # editing what is shown does not write over the newer document, even after a reload
    page.get_by_label("NA power (without boost)", exact=True).fill("123")
    page.get_by_role("button", name="New setup").click()
    assert stored(page) == text
    page.reload()
    open_screen(page, "engine")
    assert stored(page) == text
    assert "newer version" in storage_note(page).inner_text()
    assert errors == []


def test_an_export_file_from_a_newer_version_is_refused_with_a_clear_message(phone_no_sw, tmp_path):
    _, page = phone_no_sw
    open_screen(page, "engine")
    before = stored(page)
    path = tmp_path / "future.json"
    path.write_text(json.dumps({"format": KEY, "version": 3, "setups": [{"name": "x"}]}))
    page.locator("input[type=file]").set_input_files(str(path))
    message = page.locator(".message--error")
    message.wait_for()
    assert "Import refused" in message.inner_text()
    assert "newer version of the app (format 3)" in message.inner_text()
    assert stored(page) == before


# --- corrupt storage --------------------------------------------------------------------

INPUTS = {"site": {"source": "altitude", "altitude": q(800, "m"), "altimeter_setting": None,
                   "station_pressure": None, "temperature": q(15, "degC"), "relative_humidity": None},
          "boost": q(1.35, "bar"), "target_power": q(250, "kW"), "measured_power": None,
          "boost_set_where": "here", "boost_control": "held_manifold", "rpm": 6000,
          "max_duty": 0.8, "margin": 0.2, "line_loss": None}


@pytest.mark.parametrize("text", [
    "{not json",
    "",
    "null",
    "[1, 2, 3]",
    json.dumps({"format": KEY, "version": 2, "setups": "lots"}),
    json.dumps({"format": KEY, "version": 0, "setups": []}),
    json.dumps({"format": KEY, "version": 2, "setups": [
        {"name": "Bad", "engine": {"na_power": {"value": "lots", "unit": "kW"}}}]}),
], ids=["invalid-json", "empty", "null", "array", "setups-not-a-list", "version-0", "only-bad-setup"])
def test_unreadable_storage_is_reported_kept_aside_and_nothing_else_lost(phone_no_sw, text):
    context, page = phone_no_sw
    errors = watch_errors(page)
    seed_storage(context, {KEY: text, "webcalc-inputs": json.dumps(INPUTS)})
    open_screen(page, "engine")
    assert UNREADABLE_TEXT in storage_note(page).inner_text()
    aside = [k for k in stored_keys(page) if re.fullmatch(rf"{KEY}-unreadable-\d+", k)]
    assert len(aside) == 1 and stored(page, aside[0]) == text
    assert picker_names(page) == [DEMO_NAME]
    # the inputs of the day were not touched
    assert json.loads(stored(page, "webcalc-inputs")) == INPUTS
    open_screen(page, "pressure-ratio")
    assert page.get_by_label("Boost (gauge)", exact=True).input_value() == "1.35"
    # a reload finds a readable document: nothing more is copied aside
    page.reload()
    open_screen(page, "engine")
    assert [k for k in stored_keys(page) if k.startswith(f"{KEY}-unreadable-")] == aside
    assert storage_note(page).is_hidden()
    assert errors == []


@pytest.mark.parametrize("version", [1, 2])
def test_one_bad_setup_among_good_ones_loses_only_itself(phone_no_sw, version):
    context, page = phone_no_sw
    errors = watch_errors(page)
    doc = v1_document()
    doc["version"] = version
    bad = {"id": "s-bad", "name": "Broken", "engine": engine(injector_count=999)}
    doc["setups"].insert(1, bad)
    if version == 2:
        for setup in doc["setups"]:
            setup["notes"] = "kept"
    text = json.dumps(doc, ensure_ascii=False)
    seed_storage(context, {KEY: text})
    open_screen(page, "engine")
    assert "Some saved setups could not be read" in storage_note(page).inner_text()
    assert picker_names(page) == ["Hill-climb car «A»", 'Track "B" \u2014 \u6f22\u5b57']
    aside = [k for k in stored_keys(page) if k.startswith(f"{KEY}-unreadable-")]
    assert len(aside) == 1 and stored(page, aside[0]) == text
    saved = json.loads(stored(page))
    good = with_notes(v1_document(), "kept" if version == 2 else "")
    assert same(saved["setups"], good["setups"]) and saved["active"] == "s-track"
    assert errors == []


# --- full storage -----------------------------------------------------------------------

def test_full_storage_is_reported_and_the_edits_stay_on_screen(phone_no_sw):
    context, page = phone_no_sw
    errors = watch_errors(page)
    make_storage_full(context)
    open_screen(page, "engine")
    note = storage_note(page)
    assert FULL_TEXT in note.inner_text()
    assert stored(page) is None
    # the other keys are stored as usual
    assert stored(page, "webcalc-inputs") is not None and stored(page, "webcalc-prefs") is not None
    page.get_by_role("button", name="New setup").click()
    page.get_by_label("Name", exact=True).fill("Unsaved car")
    page.get_by_label("Name", exact=True).dispatch_event("change")
    page.get_by_label("NA power (without boost)", exact=True).fill("144")
    page.get_by_label("NA power (without boost)", exact=True).blur()
    assert picker_names(page) == [DEMO_NAME, "Unsaved car"]
    assert page.get_by_label("NA power (without boost)", exact=True).input_value() == "144"
    assert FULL_TEXT in note.inner_text()
    # once there is room again, the next change saves everything shown
    page.evaluate("() => { window.storageFreed = true; }")
    page.get_by_label("Number of injectors", exact=True).fill("5")
    page.wait_for_function("() => localStorage.getItem('webcalc-setups') !== null")
    saved = json.loads(stored(page))
    car = next(s for s in saved["setups"] if s["name"] == "Unsaved car")
    assert car["engine"]["na_power"]["value"] == 144 and car["engine"]["injector_count"] == 5
    note.wait_for(state="hidden")
    assert errors == []


def test_full_storage_while_saved_setups_exist_keeps_them(phone_no_sw):
    context, page = phone_no_sw
    errors = watch_errors(page)
    text = json.dumps(with_notes(v1_document()), ensure_ascii=False)
    seed_storage(context, {KEY: text})
    make_storage_full(context)
    open_screen(page, "engine")
    assert storage_note(page).is_hidden()
    page.get_by_role("button", name="Delete").click()
    page.get_by_role("button", name="Tap again to delete").click()
    assert FULL_TEXT in storage_note(page).inner_text()
    assert picker_names(page) == ["Hill-climb car «A»"]
    assert stored(page) == text  # what was saved is still there, whole
    assert errors == []


# --- export then import: a property test --------------------------------------------------

ENGINE_FIELDS = {
    # key: (type, detail); mirrors the engine fields of the app (static/js/fields.js)
    "na_power": ("quantity", "power"),
    "na_power_basis": ("choice", ["observed", "sae_j1349"]),
    "na_site": ("site", None),
    "displacement": ("quantity", "displacement"),
    "induction": ("choice", ["turbo", "centrifugal", "roots", "twin_screw"]),
    "compressor_count": ("count", (1, 8)),
    "intercooler": ("bool", None),
    "intercooler_effectiveness": ("percent", None),
    "compressor_efficiency": ("percent", None),
    "inlet_loss": ("quantity", "gauge_pressure"),
    "intercooler_loss": ("quantity", "gauge_pressure"),
    "fuel": ("choice", ["gasoline", "e85", "ethanol", "methanol"]),
    "ethanol_content": ("percent", None),
    "injector_count": ("count", (1, 64)),
    "injector_flow": ("quantity", "injector_flow"),
    "rated_pressure": ("quantity", "gauge_pressure"),
    "base_fuel_pressure": ("quantity", "gauge_pressure"),
    "regulator": ("choice", ["boost_referenced", "fixed"]),
    "pump_count": ("count", (1, 16)),
    "pump_curve": ("curve", None),
    "power_basis": ("choice", ["crank", "wheel"]),
    "drivetrain_loss": ("percent", None),
}
KINDS = ["power", "displacement", "gauge_pressure", "injector_flow", "pump_flow", "elevation",
         "abs_pressure", "temperature"]

# JavaScript's String.prototype.trim() removes these (ECMAScript WhiteSpace and LineTerminator)
JS_SPACE = set("\t\n\v\f\r \u00a0\u1680\u2028\u2029\u202f\u205f\u3000\ufeff") | {
    chr(c) for c in range(0x2000, 0x200B)}


def utf16_len(text):
    return len(text.encode("utf-16-le")) // 2


# any finite double: -0.0, subnormals and the largest ones included
extreme = st.floats(allow_nan=False, allow_infinity=False)
fraction = st.floats(min_value=0, max_value=1)

names = st.one_of(
    st.text(min_size=1, max_size=100),
    st.sampled_from(['"quoted"', "it's", "back\\slash", "<b>&amp;</b>", "x" * 100,
                     "\U0001f697" * 50, "\u05e2\u05d1\u05e8\u05d9\u05ea", "a\u0000b", "tab\tin"]),
).filter(lambda n: utf16_len(n) <= 100 and n[0] not in JS_SPACE and n[-1] not in JS_SPACE
         and n != DEMO_NAME)
notes_text = st.one_of(st.text(max_size=200), st.just("\u00e9" * 2000), st.just("\U0001f527" * 1000),
                       st.just("line 1\r\nline 2\n\"quoted\" 'single'"))


def documents(units):
    def quantity(kind):
        return st.builds(q, extreme, st.sampled_from(units[kind]))

    def maybe(strategy):
        return st.one_of(st.none(), strategy)

    site = st.fixed_dictionaries({
        "source": st.sampled_from(["altitude", "altimeter", "station"]),
        "altitude": maybe(quantity("elevation")),
        "altimeter_setting": maybe(quantity("abs_pressure")),
        "station_pressure": maybe(quantity("abs_pressure")),
        "temperature": maybe(quantity("temperature")),
        "relative_humidity": maybe(fraction),
    })
    curve = st.fixed_dictionaries({
        "pressure_unit": st.sampled_from(units["gauge_pressure"]),
        "flow_unit": st.sampled_from(units["pump_flow"]),
        "points": st.lists(st.lists(maybe(extreme), min_size=2, max_size=2), max_size=30),
    })

    def value(kind, detail):
        return {
            "quantity": lambda: maybe(quantity(detail)),
            "choice": lambda: st.sampled_from(detail),
            "site": lambda: site,
            "count": lambda: maybe(st.integers(*detail)),
            "bool": st.booleans,
            "percent": lambda: maybe(fraction),
            "curve": lambda: maybe(curve),
        }[kind]()

    engines = st.fixed_dictionaries({k: value(*spec) for k, spec in ENGINE_FIELDS.items()})
    setup = st.fixed_dictionaries({
        "id": st.text(min_size=1, max_size=40).filter(lambda i: i != "demo"),
        "name": names, "demo": st.booleans(), "notes": notes_text, "engine": engines,
    })
    setups = st.lists(setup, min_size=1, max_size=6, unique_by=(lambda s: s["id"], lambda s: s["name"]))
    return setups.flatmap(lambda ss: st.fixed_dictionaries({
        "format": st.just(KEY), "version": st.just(2),
        "active": st.sampled_from([s["id"] for s in ss]), "setups": st.just(ss)}))


ROUND_TRIP = """async (text) => {
  const store = await import('/static/js/store.js');
  const { readSetupsFile } = await import('/static/js/ui/setup-manager.js');
  const { demoDocument } = await import('/static/js/setups.js');
  store.store.doc = demoDocument();              // a device holding only the demo
  const read = async (t) => readSetupsFile(new File([t], 'setups.json', { type: 'application/json' }));
  const first = await read(text);
  if (!first.doc) return { errors: first.errors };
  const added = store.importDocument(first.doc);
  const exported = JSON.stringify(store.exportDocument(), null, 2);
  const again = await read(exported);
  const addedAgain = again.doc ? store.importDocument(again.doc) : null;
  return { added, exported, addedAgain, saved: localStorage.getItem('webcalc-setups') };
}"""


@pytest.fixture(scope="module")
def round_trip_page(browser, base_url):
    from .conftest import PHONE
    context = browser.new_context(base_url=base_url, service_workers="block", **PHONE)
    page = context.new_page()
    open_screen(page, "engine")
    units = page.evaluate("""async (kinds) => {
      const { acceptedUnits } = await import('/static/js/units.js');
      return Object.fromEntries(kinds.map((k) => [k, acceptedUnits(k)]));
    }""", KINDS)
    assert all(units[k] for k in KINDS), units
    yield page, units
    context.close()


@seed(20240611)
@settings(max_examples=30, deadline=None, database=None,
          suppress_health_check=[HealthCheck.too_slow, HealthCheck.data_too_large])
@given(data=st.data())
def test_export_then_import_is_lossless(round_trip_page, data):
    page, units = round_trip_page
    doc = data.draw(documents(units), label="document")
    as_v1 = data.draw(st.booleans(), label="as a version-1 file")
    sent = json.loads(json.dumps(doc))
    expected = json.loads(json.dumps(doc))
    if as_v1:  # an older export: no notes; they come back empty
        sent["version"] = 1
        for setup in sent["setups"]:
            del setup["notes"]
        for setup in expected["setups"]:
            setup["notes"] = ""
    result = page.evaluate(ROUND_TRIP, json.dumps(sent, ensure_ascii=False))
    assert "errors" not in result, result.get("errors")
    exported = json.loads(result["exported"])
    assert exported["format"] == KEY and exported["version"] == 2
    assert exported["setups"][0]["name"] == DEMO_NAME
    assert difference(exported["setups"][1:], expected["setups"]) is None
    assert exported["active"] == expected["active"]
    assert result["added"] == [s["name"] for s in expected["setups"]]
    # what is stored on the device is the same document, and importing the export again
    # adds nothing
    assert difference(json.loads(result["saved"]), exported) is None
    assert result["addedAgain"] == []


# --- the notice at the top of every screen (needs main.js to show store.notice) ---------------

def test_the_storage_notice_shows_on_the_first_screen(phone_no_sw):
    context, page = phone_no_sw
    make_storage_full(context)
    open_screen(page, "site")
    page.locator(".notices", has_text=FULL_TEXT).wait_for(timeout=3000)
