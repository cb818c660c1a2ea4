"""Several models in one run, each in its own process: one bad model never stops the others."""

from __future__ import annotations

import json
import shutil

from click.testing import CliRunner

from ifcjoint.batch import model_files, run_batch
from ifcjoint.cli import main
from tests.conftest import SAMPLES


def _models(tmp_path):
    d = tmp_path / "models"
    d.mkdir()
    shutil.copy(SAMPLES / "kestrel-workshop-ifc4-mm.ifc", d / "hall.ifc")
    shutil.copy(SAMPLES / "kestrel-workshop-demands.csv", d / "hall-demands.csv")
    text = (SAMPLES / "kestrel-workshop-ifc2x3-mm.ifc").read_text()
    (d / "cut.ifc").write_text(text[: len(text) // 2])  # truncated: cannot be used
    return d


def test_a_folder_of_models_with_one_broken(tmp_path):
    d = _models(tmp_path)
    out = tmp_path / "out"
    r = CliRunner().invoke(main, ["batch", str(d), "--out", str(out), "-j", "2",
                                  "--also", "html:{out}/{stem}.html"])
    assert r.exit_code == 3, r.output  # one model could not be used: said, the other done
    assert "cut.ifc" in r.output and "truncated" in r.output
    hall = json.loads((out / "hall.json").read_text())
    assert hall["check"]["demands"]["path"].endswith("hall-demands.csv")
    assert hall["check"]["counts"]["pass"] > 0
    assert (out / "hall.html").exists() and not (out / "cut.json").exists()
    line = next(ln for ln in r.output.splitlines() if ln.startswith("hall.ifc"))
    assert "done" in line and "pass" in line


def test_a_model_past_its_time_is_stopped_and_reported(tmp_path):
    d = _models(tmp_path)
    items = run_batch("scan", [d / "hall.ifc"], tmp_path / "o", timeout=0.01)
    assert items[0].outcome == "timeout" and items[0].exit_code is None


def test_models_named_twice_are_refused(tmp_path):
    import pytest

    from ifcjoint.errors import UsageError

    d = _models(tmp_path)
    other = tmp_path / "other"
    other.mkdir()
    shutil.copy(d / "hall.ifc", other / "hall.ifc")
    with pytest.raises(UsageError, match="share the name"):
        model_files([d, other])
