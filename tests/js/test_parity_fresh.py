"""The offline API's parity vectors are what the server answers today, and the browser's
handler agrees with them.

``tests/js/parity_vectors.json`` is written by ``tools/parity_vectors.py`` from the real
Flask API; when the API changes, the offline handler (``static/js/offline/``,
``static/js/calc/``) must change with it, and these tests say so: the first fails until
the vectors are regenerated, the Node run fails until the JavaScript agrees again.
"""

import json
import shutil
import subprocess
import sys
from pathlib import Path

import pytest

from webcalc import messages

ROOT = Path(__file__).resolve().parents[2]
GENERATOR = ROOT / "tools" / "parity_vectors.py"
COMMITTED = ROOT / "tests" / "js" / "parity_vectors.json"
NODE = shutil.which("node")


def generate(out):
    subprocess.run([sys.executable, str(GENERATOR), "--out", str(out)], check=True, cwd=ROOT, capture_output=True)
    return out.read_bytes()


def test_committed_vectors_are_fresh(tmp_path):
    fresh = generate(tmp_path / "vectors.json")
    assert COMMITTED.exists(), "tests/js/parity_vectors.json is missing: run python tools/parity_vectors.py"
    assert fresh == COMMITTED.read_bytes(), (
        "tests/js/parity_vectors.json is stale: run python tools/parity_vectors.py, "
        "then update static/js/calc/ and static/js/offline/ until node --test tests/js/ passes"
    )


def test_generation_is_deterministic(tmp_path):
    assert generate(tmp_path / "a.json") == generate(tmp_path / "b.json")


def test_vectors_cover_the_api():
    data = json.loads(COMMITTED.read_text(encoding="utf-8"))
    vectors = data["vectors"]
    assert len(vectors) >= 1000
    assert len(COMMITTED.read_bytes()) < 3.5e6, "keep the vectors file compact"
    by_endpoint = {}
    for v in vectors:
        by_endpoint.setdefault(v["endpoint"], []).append(v)
    for endpoint in ("site", "pressure-ratio", "power", "boost-for-power", "airflow", "injectors", "fuel-pump"):
        statuses = {v["status"] for v in by_endpoint[endpoint]}
        assert {200, 400} <= statuses, f"{endpoint}: {statuses}"
    assert {v["status"] for v in vectors} >= {200, 400, 404, 413}
    # every warning (code, severity) of SPEC section 5 at least once
    seen = {(w["code"], w["severity"]) for v in vectors for w in v["response"].get("warnings", [])}
    assert set(messages.WARNINGS) <= seen, set(messages.WARNINGS) - seen
    ok = [v for v in vectors if v["status"] == 200]
    requests = [v.get("request") or {} for v in ok]
    # every unit system, induction, fuel, regulator and boost control among the answered
    assert {r.get("units") for r in requests} >= {None, "metric", "imperial", "si"}
    assert {r.get("induction") for r in requests} >= {None, "na", "turbo", "centrifugal", "roots", "twin_screw"}
    assert {r.get("fuel") for r in requests} >= {None, "gasoline", "ethanol", "methanol", "e85"}
    assert {r.get("regulator") for r in requests} >= {"boost_referenced", "fixed"}
    assert {r.get("boost_set_at", {}).get("control") for r in requests} >= {"held_manifold", "held_gauge", "fixed_ratio"}
    assert any("altitude_table" in v["response"] for v in ok if v["endpoint"] == "boost-for-power")
    assert any(r.get("output_units") for r in requests)
    assert any(r.get("power_basis") == "wheel" for r in requests)
    assert any(r.get("na_power_basis") == "sae_j1349" for r in requests)
    assert any(r.get("measured_power_basis") == "sae_j1349" for r in requests)
    # unreachable targets keep boost_ideal; fixed regulators at or above base give max_power 0
    assert any(v["response"]["boost"] is None and v["response"]["boost_ideal"] is not None
               for v in ok if v["endpoint"] == "boost-for-power")
    assert any(v["response"]["max_power"] == {"value": 0.0, "unit": v["response"]["max_power"]["unit"]}
               for v in ok if v["endpoint"] == "injectors" and v["response"]["max_power"])
    # the formatting sample for error-message numbers is there
    assert len(data["format_g6"]) > 300


@pytest.mark.skipif(NODE is None, reason="node is not installed: the offline parity test needs Node 20 or later")
def test_node_parity_test_passes():
    result = subprocess.run([NODE, "--test", "tests/js/parity.test.mjs"], cwd=ROOT, capture_output=True, text=True,
                            timeout=300)
    assert result.returncode == 0, f"node --test tests/js/parity.test.mjs failed:\n{result.stdout[-6000:]}\n{result.stderr}"
    assert "# fail 0" in result.stdout
    assert "# pass 0" not in result.stdout
