"""From the demo's scanned joints to engine inputs and checks.

What is expected follows from what the generator built (sample_models/generate.py): extended
and flush end plates on column flanges are checked; minor-axis fin plates, welded and
incomplete joints are not, each with its reason. Resistance values here are not compared
with a source (the demo is invented); the published example is reproduced in
tests/engine/test_check.py.
"""

from __future__ import annotations

import json

from ifcjoint.engine.inputs import check_joint, end_plate_input
from tests.conftest import SAMPLES


def test_demo_joints_checked_or_told_why(scan_cached):
    r = scan_cached(SAMPLES / "kestrel-workshop-ifc4-mm.ifc")
    members = {m.guid: m for m in r.model.members}
    results = {j.id: (j, check_joint(j, r.anatomy[j.id], members)) for j in r.joints}
    for j, res in results.values():
        if j.axis == "minor":
            assert res.status == "not_checked" and "minor-axis" in res.reason
        elif j.archetype in ("extended_end_plate", "flush_end_plate", "welded"):
            assert res.status == "checked", res.reason
            d = res.as_dict()
            json.dumps(d)  # the output contract is plain JSON
            assert d["resistance"]["Mj_Rd_hogging_kNm"] > 0
            assert d["inputs"]["welds"]["assumed"] is True
            assert any("assumed" in n for n in d["notes"])
            rows = d["inputs"].get("bolts", {}).get("rows_from_beam_top", [0.0])
            if j.archetype == "extended_end_plate" and min(rows) < 0 < max(rows):
                # extended at the top only: weaker in sagging
                assert res.sagging.M_j_Rd < res.hogging.M_j_Rd
        else:
            assert res.status == "not_checked" and res.reason
    assert sum(1 for _, res in results.values() if res.status == "checked") >= 25


def test_missing_grade_is_not_checked(scan_cached):
    from dataclasses import replace

    r = scan_cached(SAMPLES / "kestrel-workshop-ifc4-mm.ifc")
    members = {m.guid: m for m in r.model.members}
    j = next(j for j in r.joints if j.archetype == "extended_end_plate" and j.axis == "major")
    a = replace(r.anatomy[j.id], beam_grade=None)
    out = end_plate_input(j, a, members)
    assert isinstance(out, str) and "beam grade" in out
