"""House style that a machine can check: ruff (with docstring rules) and our pset prefix."""

import shutil
import subprocess
import sys
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[1]


def test_ruff_passes():
    ruff = shutil.which("ruff") or str(Path(sys.executable).parent / "ruff")
    if not Path(ruff).exists():
        pytest.skip("ruff is not installed")
    out = subprocess.run([ruff, "check", "ifcjoint", "tests"], cwd=ROOT, capture_output=True,
                         text=True)
    assert out.returncode == 0, out.stdout + out.stderr


def test_no_reserved_pset_prefix_in_our_code():
    for p in (ROOT / "ifcjoint").rglob("*.py"):
        text = p.read_text()
        assert "\"Pset_" not in text and "'Pset_" not in text, p
        assert "\"Qto_" not in text and "'Qto_" not in text, p
