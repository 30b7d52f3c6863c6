"""The command line: version, a calculation as a table and as JSON."""

import json

from webcalc import __version__, cli


def test_version(capsys):
    try:
        cli.main(["--version"])
    except SystemExit as exc:
        assert exc.code == 0
    assert __version__ in capsys.readouterr().out


def test_calc_json_and_table(capsys):
    assert cli.main(["calc", "pressure-ratio", "boost=1 atm", "site.altitude=0 m", "units=si", "--json"]) == 0
    body = json.loads(capsys.readouterr().out)
    assert body["pressure_ratio"] == 2.0
    assert cli.main(["calc", "power", "na_power=300 hp", "boost=10 psi", "measured_power=350 hp"]) == 0
    out = capsys.readouterr().out
    assert "expected_power" in out and "shortfall_large" in out and "caution:" in out


def test_calc_error_exits_nonzero(capsys):
    assert cli.main(["calc", "site", "site.altitude=99 km"]) == 1
    assert "site.altitude" in capsys.readouterr().out


def test_calc_table_in_another_language(capsys):
    from webcalc import i18n, messages

    # One standard atmosphere of boost at sea level doubles the absolute pressure: PR 2
    # (the pressure-ratio rule; US Standard Atmosphere 1976 sea-level pressure 101.325 kPa).
    assert cli.main(["calc", "pressure-ratio", "boost=1 atm", "site.altitude=0 m", "--lang", "de"]) == 0
    out = capsys.readouterr().out
    assert "101,325 kPa" in out and "101.325" not in out
    german = [i18n.catalog("de")[text] for text in messages.CAUTIONS.values()]
    assert all(f"caution: {text}" in out for text in german)
