"""Run the JavaScript engine tests (``node --test tests/js/``) as part of the Python suite."""

import shutil
import subprocess
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[2]
NODE = shutil.which("node")


@pytest.mark.skipif(NODE is None, reason="node is not installed: the JavaScript engine tests need Node 20 or later")
def test_node_engine_tests_pass():
    result = subprocess.run(
        [NODE, "--test", "tests/js/"], cwd=ROOT, capture_output=True, text=True, timeout=300
    )
    assert result.returncode == 0, f"node --test tests/js/ failed:\n{result.stdout}\n{result.stderr}"
    # the runner must actually have found and run the engine tests
    assert "# fail 0" in result.stdout
    assert "# pass 0" not in result.stdout
