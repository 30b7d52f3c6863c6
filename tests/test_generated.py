"""Generated browser files must match what the Python side generates now."""

import subprocess
import sys
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent


def test_generated_files_are_fresh():
    r = subprocess.run([sys.executable, "tools/generate.py", "--check"], cwd=ROOT, capture_output=True, text=True)
    assert r.returncode == 0, r.stdout + r.stderr
