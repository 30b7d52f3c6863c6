"""Generate the browser's data files from the Python side (never typed in twice).

    python tools/generate.py          # write them
    python tools/generate.py --check  # exit 1 if any is stale (tests run this)

Writes under static/generated/: units.json (the closed unit table, factors from pint),
fields.json (every endpoint's fields, outputs and message ids), engine.json (constants,
fuels, defaults and thresholds the calculations use), locales/<lang>.json (catalogs),
catalogs.json (the API messages of every catalog in one file, for the service worker), and each of them again as an ES module (``.js``, ``export default``) for the offline engine.
"""

import json
import sys
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

from babel.core import LOCALE_ALIASES  # noqa: E402

from webcalc import calc, i18n, messages, units  # noqa: E402
from webcalc.api.schemas import ENDPOINTS  # noqa: E402
from webcalc.calc import boost as calc_boost, fuel as calc_fuel  # noqa: E402
from webcalc.engine import airflow, atmosphere, compressor, constants, fuel, power  # noqa: E402

OUT = ROOT / "static" / "generated"


def dump(data):
    return json.dumps(data, sort_keys=True, ensure_ascii=False, separators=(",", ":")) + "\n"


def ordered(spec):
    """An outputs spec as [[name, kind or nested list], ...]: the key order survives sort_keys."""
    return [[name, ordered(kind) if isinstance(kind, dict) else kind] for name, kind in spec.items()]


def units_data():
    """The unit table, plus the order of dimensions and spellings (error messages list them)."""
    return dict(units.table(), dimension_order=list(units.UNITS),
                spelling_order={d: list(spellings) for d, spellings in units.UNITS.items()})


def api_data():
    return {
        "endpoints": {name: {"fields": [f.export() for f in fields], "outputs": calc.OUTPUTS[name],
                             "output_order": ordered(calc.OUTPUTS[name])}
                      for name, fields in ENDPOINTS.items()},
        "warnings": [{"code": c, "severity": s, "message": m} for (c, s), m in messages.WARNINGS.items()],
        "warning_order": list(messages.WARNING_ORDER),
        "severity_order": list(messages.SEVERITY_ORDER),
        "cautions": [{"code": c, "message": m} for c, m in messages.CAUTIONS.items()],
        "causes": messages.CAUSES,
        "errors": messages.ERRORS,
    }


def engine_data():
    names = ("R_DRY", "R_VAPOUR", "CP_AIR", "GAMMA_AIR", "G0", "R_EARTH", "P_SEA_LEVEL", "T_SEA_LEVEL",
             "RHO_SEA_LEVEL", "LAPSE_RATE", "PRESSURE_EXPONENT", "LB", "HP", "LB_PER_HP_H")
    return {
        "constants": {n: getattr(constants, n) for n in names},
        "valid": {"atmosphere": atmosphere.VALID, "compressor": compressor.VALID, "fuel": fuel.VALID,
                  "power": power.VALID, "airflow": airflow.VALID},
        "j1349_range": atmosphere.J1349_RANGE,
        "tropopause_geopotential": atmosphere.TROPOPAUSE_GEOPOTENTIAL,
        "inductions": list(compressor.INDUCTIONS),
        "belt_driven": list(compressor.BELT_DRIVEN),
        "default_efficiency": compressor.DEFAULT_EFFICIENCY,
        "default_max_pressure_ratio": compressor.DEFAULT_MAX_PRESSURE_RATIO,
        "caution_pressure_ratio": compressor.CAUTION_PRESSURE_RATIO,
        "default_intercooler_effectiveness": compressor.DEFAULT_INTERCOOLER_EFFECTIVENESS,
        "default_drive_efficiency": compressor.DEFAULT_DRIVE_EFFICIENCY,
        "boost_controls": list(compressor.BOOST_CONTROLS),
        "fuels": fuel.FUELS,
        "fuel_names": list(fuel.FUEL_NAMES),
        "blendable": list(fuel.BLENDABLE),
        "e85_ethanol": fuel.E85_ETHANOL,
        "na_bsfc_gasoline": fuel.NA_BSFC_GASOLINE,
        "na_afr_gasoline": fuel.NA_AFR_GASOLINE,
        "sizing_bsfc_gasoline": fuel.SIZING_BSFC_GASOLINE,
        "default_max_duty": fuel.DEFAULT_MAX_DUTY,
        "default_fuel_pressure": fuel.DEFAULT_FUEL_PRESSURE,
        "default_pump_margin": fuel.DEFAULT_PUMP_MARGIN,
        "plausible_volumetric_efficiency": airflow.PLAUSIBLE_VOLUMETRIC_EFFICIENCY,
        "default_reference_pressure": airflow.DEFAULT_REFERENCE_PRESSURE,
        "default_reference_temperature": airflow.DEFAULT_REFERENCE_TEMPERATURE,
        "temperature_exponent": power.TEMPERATURE_EXPONENT,
        "grid_points": power.GRID_POINTS,
        "bisection_width": power.BISECTION_WIDTH,
        "bisection_max_halvings": power.BISECTION_MAX_HALVINGS,
        "thresholds": {
            "charge_caution": calc_boost.CHARGE_CAUTION, "charge_danger": calc_boost.CHARGE_DANGER,
            "shortfall_caution": calc_boost.SHORTFALL_CAUTION, "shortfall_danger": calc_boost.SHORTFALL_DANGER,
            "above_ideal": calc_boost.ABOVE_IDEAL, "duty_caution": calc_fuel.DUTY_CAUTION,
            "pressure_difference_caution": calc_fuel.PRESSURE_DIFFERENCE_CAUTION,
        },
    }


def api_message_ids():
    """Every message the API (and so the offline engine) can send."""
    return [*messages.WARNINGS.values(), *messages.CAUTIONS.values(), *messages.CAUSES.values(),
            *messages.ERRORS.values()]


def locale_data(locale):
    return {"locale": locale, "name": i18n.locale_name(locale), "messages": dict(sorted(i18n.catalog(locale).items()))}


def files():
    out = {OUT / "units.json": dump(units_data()), OUT / "fields.json": dump(api_data()),
           OUT / "engine.json": dump(engine_data()),
           OUT / "locales.json": dump({"locales": list(i18n.LOCALES), "default": i18n.DEFAULT_LOCALE,
                                       "aliases": dict(LOCALE_ALIASES),
                                       "decimal": {loc: i18n.decimal_symbol(loc) for loc in i18n.LOCALES}})}
    for locale in i18n.LOCALES:
        out[OUT / "locales" / f"{locale}.json"] = dump(locale_data(locale))
    # Every catalog in one module: a service worker cannot import() a catalog on demand.
    # Only the API's messages: the offline engine sends nothing else (a smaller worker starts faster).
    api_ids = set(api_message_ids())
    out[OUT / "catalogs.json"] = dump({
        locale: dict(data, messages={k: v for k, v in data["messages"].items() if k in api_ids})
        for locale, data in ((loc, locale_data(loc)) for loc in i18n.LOCALES)})
    # The same data as ES modules, for the offline engine (service worker and Node import them).
    for path, text in list(out.items()):
        out[path.with_suffix(".js")] = "// Generated by tools/generate.py: do not edit.\nexport default " + text.rstrip("\n") + ";\n"
    return out


def main(argv):
    check = "--check" in argv
    stale = []
    for path, text in files().items():
        if path.exists() and path.read_text(encoding="utf-8") == text:
            continue
        stale.append(path.relative_to(ROOT))
        if not check:
            path.parent.mkdir(parents=True, exist_ok=True)
            path.write_text(text, encoding="utf-8")
    if check and stale:
        print("stale generated files (run python tools/generate.py):", *stale, sep="\n  ")
        return 1
    print(("up to date" if check else "wrote") + f": {len(stale)} changed")
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
