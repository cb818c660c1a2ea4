"""From the demo's scanned joints to engine inputs and checks.

What is expected follows from what the generator built (sample_models/generate.py): extended
and flush end plates on column flanges are checked; minor-axis fin plates, welded and
incomplete joints are not, each with its reason. Resistance values here are not compared
with a source (the demo is invented); the published example is reproduced in
tests/engine/test_check.py.
"""

from __future__ import annotations

import json

from ifcjoint.archetypes import check_joint
from ifcjoint.archetypes.builders import end_plate_input
from ifcjoint.ec3.code import EN_1993_1_8
from ifcjoint.model.codes import Archetype, Axis, NotChecked, NotCheckedCode, NoteCode
from ifcjoint.report.results import result_dict
from tests.conftest import SAMPLES

CHECKED = (Archetype.EXTENDED_END_PLATE, Archetype.FLUSH_END_PLATE, Archetype.WELDED,
           Archetype.END_PLATE_SPLICE, Archetype.HAUNCHED_END_PLATE)


def test_demo_joints_checked_or_told_why(scan_cached):
    r = scan_cached(SAMPLES / "kestrel-workshop-ifc4-mm.ifc")
    members = {m.guid: m for m in r.model.members}
    results = {j.id: (j, check_joint(j, r.anatomy[j.id], members)) for j in r.joints}
    for j, res in results.values():
        if j.axis == Axis.MINOR and j.archetype in (Archetype.FIN_PLATE,
                                                     Archetype.BEAM_FIN_PLATE):
            # checked in shear, with the column web's local shear and punching rule
            assert res.checked and res.hogging.M_j_Rd == 0.0 and res.V_j_Rd > 0
            comps = {c.component for c in res.hogging.components}
            assert "supporting_web_local_shear" in comps and res.conditions
        elif j.axis == Axis.MINOR:
            assert not res.checked and res.not_checked.code == NotCheckedCode.MINOR_AXIS
        elif j.archetype in CHECKED:
            assert res.checked, res.not_checked
            d = result_dict(res, EN_1993_1_8)
            json.dumps(d)  # the output contract is plain JSON
            assert d["resistance"]["Mj_Rd_hogging_kNm"] > 0
            w = d["inputs"]["welds"]
            assert w["assumed"] is True  # the web weld at least is never modelled in the demo
            if w["modelled"]:  # the flange welds modelled on level 2, line A: as modelled
                assert any(n.code == NoteCode.WELDS_PARTLY_MODELLED for n in res.notes)
                assert w["top_flange_throat"] == 10.0 and list(w["modelled"]) == [
                    "top_flange", "bottom_flange"]
            else:
                assert any(n.code == NoteCode.WELDS_ASSUMED for n in res.notes)
            rows = d["inputs"].get("bolts", {}).get("rows_from_beam_top", [0.0])
            if j.archetype == Archetype.EXTENDED_END_PLATE and min(rows) < 0 < max(rows):
                # extended at the top only: weaker in sagging
                assert res.sagging.M_j_Rd < res.hogging.M_j_Rd
        else:
            assert not res.checked and res.not_checked is not None
    assert sum(1 for _, res in results.values() if res.checked) >= 25


def test_missing_grade_is_not_checked(scan_cached):
    from dataclasses import replace

    r = scan_cached(SAMPLES / "kestrel-workshop-ifc4-mm.ifc")
    members = {m.guid: m for m in r.model.members}
    j = next(j for j in r.joints if j.archetype == Archetype.EXTENDED_END_PLATE
             and j.axis == Axis.MAJOR)
    a = replace(r.anatomy[j.id], beam_grade=None)
    out = end_plate_input(j, a, members)
    assert isinstance(out, NotChecked) and out.code == NotCheckedCode.DATA_NOT_READ
    assert out.values["missing"] == ("beam grade",)


def test_a_secondary_flush_with_the_primary_top_must_be_notched():
    # IPE 400 primary (top at z 4000; tf 13.5, r 21: from memory), IPE 200 secondary
    # (tf 8.5, r 12) ending 10 mm off the primary web: with its top flush, its top flange
    # runs into the primary's; 50 mm lower it clears the flange and its root (34.5 mm).
    from types import SimpleNamespace

    from ifcjoint.archetypes.builders import notch_needed
    from ifcjoint.catalogue.sections import section_from_designation
    from ifcjoint.model.codes import Support
    from ifcjoint.model.elements import Member

    prim = Member(guid="P", ifc_class="IfcBeam", name="P", kind="beam", start=(0, 0, 3800.0),
                  end=(6000, 0, 3800.0), depth_dir=(0, 0, 1.0), width_dir=(0, 1.0, 0),
                  depth=400.0, width=180.0)
    a = SimpleNamespace(beam_section=section_from_designation("IPE 200"),
                        column_section=section_from_designation("IPE 400"))
    for top, want in ((4000.0, "top"), (3950.0, ""), (3800.0 + 200 - 186.5 + 10, "bottom")):
        j = SimpleNamespace(beam_to_beam=True, column="P", gap=10.0,
                            point=(3000.0, 4.3, top - 100.0), support=Support.BEAM)
        assert notch_needed(j, a, {"P": prim}) == want, top
    far = SimpleNamespace(beam_to_beam=True, column="P", gap=120.0, point=(3000.0, 4.3, 3900.0),
                          support=Support.BEAM)
    assert notch_needed(far, a, {"P": prim}) == ""  # stops clear of the flange tips
