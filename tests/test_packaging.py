"""A non-editable install serves the same app: the wheel carries the front end and catalogs."""

import subprocess
import sys
import zipfile
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parent.parent


@pytest.mark.slow
def test_wheel_ships_front_end_and_serves_it(tmp_path):
    r = subprocess.run([sys.executable, "-m", "build", "--wheel", "--outdir", str(tmp_path), str(ROOT)],
                       capture_output=True, text=True)
    assert r.returncode == 0, r.stdout[-2000:] + r.stderr[-2000:]
    wheel = next(tmp_path.glob("webcalc-*.whl"))
    names = set(zipfile.ZipFile(wheel).namelist())
    for needed in ("webcalc/static/sw.js", "webcalc/static/manifest.webmanifest",
                   "webcalc/static/generated/units.json", "webcalc/engine/atmosphere.py", "webcalc/cli.py"):
        assert needed in names, needed
    assert any(n.startswith("webcalc/locales/") for n in names)
    target = tmp_path / "site"
    r = subprocess.run([sys.executable, "-m", "pip", "install", "--no-deps", "--no-index", "--quiet",
                        "--target", str(target), str(wheel)], capture_output=True, text=True)
    assert r.returncode == 0, r.stderr
    probe = (
        "import webcalc, sys; app = webcalc.create_app(); c = app.test_client();"
        "page = c.get('/').get_data(as_text=True); sw = c.get('/sw.js');"
        "ok = c.post('/api/v1/site', json={}).status_code;"
        "print(webcalc.__file__); print('manifest' in page, sw.status_code, ok)"
    )
    r = subprocess.run([sys.executable, "-c", probe], capture_output=True, text=True, cwd=tmp_path,
                       env={"PYTHONPATH": str(target), "PATH": "/usr/bin:/bin"})
    assert r.returncode == 0, r.stderr
    where, result = r.stdout.strip().splitlines()
    assert str(target) in where  # the installed copy, not the checkout
    assert result == "True 200 200"
