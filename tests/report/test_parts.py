"""The parts table against the demo scenario's own design (the generator's truth file)."""

from __future__ import annotations

import pandas as pd
import pytest
from click.testing import CliRunner

from ifcjoint.cli import main
from tests.conftest import SAMPLES, load_truth

DEMO = SAMPLES / "kestrel-workshop-ifc4-mm.ifc"


@pytest.fixture(scope="module")
def parts(tmp_path_factory):
    p = tmp_path_factory.mktemp("parts") / "parts.csv"
    r = CliRunner().invoke(main, ["check", str(DEMO), "--parts", str(p), "-q",
                                  "--fail-on", "never"])
    assert r.exit_code == 0, r.output
    return pd.read_csv(p, dtype={"joint_id": str})


def test_end_plates_and_bolt_groups_are_as_designed(parts, scan_cached):
    sc = scan_cached(DEMO)
    by_beam = {(j.beam, j.beam_end): j.id for j in sc.joints}
    truth = [t for t in load_truth("kestrel-workshop-ifc4-mm")["joints"]
             if t["axis"] == "major" and t.get("plate") and t["bolts"] and not t["defects"]]
    assert len(truth) >= 10
    for t in truth:
        jid = by_beam[(t["beam"], t["beam_end"])]
        rows = parts[parts["joint_id"] == jid]
        plate = rows[rows["part"] == "plate"].iloc[0]
        d = t["plate"]
        assert plate["thickness_mm"] == pytest.approx(d["tp"], abs=0.05)
        assert plate["width_mm"] == pytest.approx(d["bp"], abs=0.05)
        height = d["bottom_from_beam_top"] - d["top_from_beam_top"]
        assert plate["height_mm"] == pytest.approx(height, abs=0.05)
        bolts = rows[rows["part"] == "bolt group"].iloc[0]
        assert bolts["bolt_size"] == f"M{t['bolt_d']:g}"
        assert bolts["bolts"] == len(t["bolts"]) and bolts["rows"] == len(t["rows_from_beam_top"])
        r = t["rows_from_beam_top"]
        assert bolts["e1_top_mm"] == pytest.approx(r[0] - d["top_from_beam_top"], abs=0.05)
        assert bolts["e1_bottom_mm"] == pytest.approx(d["bottom_from_beam_top"] - r[-1], abs=0.05)


def test_welds_are_listed_with_their_throat(parts):
    welds = parts[parts["part"] == "weld"]
    assert len(welds) and set(welds["weld_location"]) >= {"top flange", "bottom flange"}
    assert (welds["throat_mm"] > 0).all()
