"""Joint finding on generated models against the generator's sidecar truth.

The truth is what the generator built (sample_models/generate.py); the scanner is never
compared with its own earlier output.
"""

from __future__ import annotations

import json

import numpy as np
import pytest

from tests.conftest import SAMPLES
from tests.support.truth import compare

BUNDLED = ["kestrel-workshop-ifc4-mm", "kestrel-workshop-ifc2x3-mm", "kestrel-workshop-ifc4-m"]


@pytest.mark.parametrize("name", BUNDLED)
def test_bundled_demo_matches_its_truth(name, scan_cached):
    truth = json.loads((SAMPLES / f"{name}.truth.json").read_text())
    result = scan_cached(SAMPLES / f"{name}.ifc")
    cmp = compare(result, truth)
    assert cmp.problems() == {}
    assert len(result.joints) == len(truth["joints"]) == 56
    assert not result.unreadable


VARIANTS = [
    dict(schema="IFC4X3"),
    dict(schema="IFC2X3", relations="realizing"),
    dict(unit="in"),
    dict(profiles="arbitrary"),
    dict(profiles="brep"),
    dict(mapped=True),
    dict(relations="none"),
    dict(relations="assembly"),
    dict(relations="connects"),
    dict(fastener_class="IfcFastener"),
    dict(fastener_class="IfcDiscreteAccessory"),
    dict(fastener_class="IfcBuildingElementProxy"),
    dict(fastener_class="IfcBuildingElementProxy", anonymous_fasteners=True),
    dict(schema="IFC2X3", fastener_class="IfcFastener", bolt_data_in_pset=True),
    dict(nested_parts=False),
    dict(grid_placed_columns=True, rotation_deg=17.0),
    dict(grid_placed_columns=True, schema="IFC4X3", split_columns=True),
    dict(beams_to_axis=True),
    dict(haunch=True, relations="assembly"),
    dict(haunch=True, haunch_member=True, relations="none"),
    dict(plates_as_members=True, relations="none"),
    dict(bolt_groups=True, relations="realizing"),
    dict(stiffeners=True, relations="assembly"),
    dict(bolt_groups=True, schema="IFC2X3", rotation_deg=41.0, relations="none"),
    dict(plates_as_members=True, schema="IFC2X3", profiles="brep"),
    dict(split_columns=True),
    dict(schema="IFC2X3", profiles="brep", rotation_deg=-61.0, relations="none", unit="m"),
    dict(schema="IFC4X3", mapped=True, split_columns=True, beams_to_axis=True,
         fastener_class="IfcDiscreteAccessory", rotation_deg=12.5),
    # flush end plates against the column webs (each web carries one beam)
    dict(minor_end_plates=True, demo_details=False, bays_y=1, relations="none"),
    dict(minor_end_plates=True, demo_details=False, bays_y=1, relations="assembly",
         rotation_deg=33.0),
]


@pytest.mark.parametrize("options", VARIANTS, ids=lambda o: "-".join(f"{k}={v}" for k, v in
                                                                      o.items()))
def test_variant_matches_its_truth(options, build_variant, scan_cached):
    path, truth = build_variant(**options)
    cmp = compare(scan_cached(path), truth)
    assert cmp.problems() == {}


def _joint_points(result):
    return {j.id: np.array(j.point) for j in result.joints}


def test_same_frame_in_mm_and_m_gives_same_joints_and_coordinates(build_variant, scan_cached):
    p_mm, _ = build_variant(unit="mm", relations="none")
    p_m, _ = build_variant(unit="m", relations="none")
    a, b = scan_cached(p_mm), scan_cached(p_m)
    assert b.model.length_unit_to_mm == pytest.approx(1000.0)
    pa, pb = _joint_points(a), _joint_points(b)
    assert set(pa) == set(pb) and len(pa) == 56
    for k in pa:
        assert np.abs(pa[k] - pb[k]).max() < 0.01  # mm
    assert [(j.id, j.partner, j.archetype) for j in a.joints] == [
        (j.id, j.partner, j.archetype) for j in b.joints]


def test_rotated_nested_frame_finds_the_same_joints_at_rotated_points(build_variant, scan_cached):
    angle = 31.7  # non-orthogonal plan rotation through the building's placement
    p0, _ = build_variant(relations="none")
    p1, _ = build_variant(relations="none", rotation_deg=angle, offset=(5000.0, -2500.0))
    a, b = scan_cached(p0), scan_cached(p1)
    c, s = np.cos(np.radians(angle)), np.sin(np.radians(angle))
    R = np.array([[c, -s, 0], [s, c, 0], [0, 0, 1]])
    pa, pb = _joint_points(a), _joint_points(b)
    assert set(pa) == set(pb)
    for k in pa:
        assert np.abs(R @ pa[k] + [5000.0, -2500.0, 0] - pb[k]).max() < 0.01
    assert {(j.id, j.axis, j.partner) for j in a.joints} == {
        (j.id, j.axis, j.partner) for j in b.joints}


def test_labels_use_storey_and_grid(scan_cached):
    name = "kestrel-workshop-ifc4-mm"
    truth = json.loads((SAMPLES / f"{name}.truth.json").read_text())
    r = scan_cached(SAMPLES / f"{name}.ifc")
    labels = {j.label for j in r.joints}
    # Grid lines 1-4 (U) and A-C (V); level-1 beams (top 4000) sit on the ground-floor storey,
    # level-2 beams (top 7500) on the first floor -- also when they are parts of an assembly.
    assert "Ground floor 1/A" in labels
    assert all("/" in lab for lab in labels)
    from tests.support.truth import end_map

    emap = end_map(r, truth)
    by_key = {(j.beam, j.beam_end): j for j in r.joints}
    storey = {4000.0: "Ground floor", 7500.0: "First floor"}
    for t in truth["joints"]:
        j = by_key[(t["beam"], emap[(t["beam"], t["beam_end"])])]
        assert j.storey == storey[t["level_z"]], t["key"]


def test_demo_anatomy_matches_what_was_built(scan_cached):
    """Plate sizes, projections, bolt rows and diameters against the generator's truth."""
    name = "kestrel-workshop-ifc4-mm"
    truth = json.loads((SAMPLES / f"{name}.truth.json").read_text())
    r = scan_cached(SAMPLES / f"{name}.ifc")
    from tests.support.truth import end_map

    emap = end_map(r, truth)
    by_key = {(j.beam, j.beam_end): j for j in r.joints}
    checked = 0
    for t in truth["joints"]:
        j = by_key[(t["beam"], emap[(t["beam"], t["beam_end"])])]
        a = r.anatomy[j.id]
        if t["plate"] and t["rows_from_beam_top"]:
            assert a.plate.tp == pytest.approx(t["plate"]["tp"], abs=0.5)
            assert a.plate.bp == pytest.approx(t["plate"]["bp"], abs=0.5)
            assert a.plate.top_from_beam_top == pytest.approx(
                t["plate"]["top_from_beam_top"], abs=0.5)
            assert [x.from_beam_top for x in a.bolts.rows] == pytest.approx(
                t["rows_from_beam_top"], abs=0.5)
            assert a.bolts.d == t["bolt_d"]
            checked += 1
    assert checked >= 25


def test_stiffened_columns_are_read_and_enter_the_resistance(build_variant, scan_cached):
    """Transverse web stiffeners built at the level-1 beam flanges of line A: recorded in the
    anatomy at the flange levels; the check uses them for the stiffness and says so."""
    from ifcjoint.archetypes import check_joint
    from ifcjoint.model.codes import NoteCode
    from tests.support.truth import end_map

    path, truth = build_variant(stiffeners=True, relations="assembly")
    r = scan_cached(path)
    emap = end_map(r, truth)
    by_key = {(j.beam, j.beam_end): j for j in r.joints}
    members = {m.guid: m for m in r.model.members}
    seen = 0
    for t in truth["joints"]:
        if not t.get("stiffened") or t["axis"] != "major":
            continue
        j = by_key[(t["beam"], emap[(t["beam"], t["beam_end"])])]
        a = r.anatomy[j.id]
        assert sum(len(st.guids) for st in a.stiffener_plates) == 4
        assert len(a.stiffener_plates) == 2 and all(st.sides == 2 for st in a.stiffener_plates)
        h, tf = a.beam_section.h, a.beam_section.tf
        for st in a.stiffener_plates:  # each level lines up with one of the beam's flanges
            assert min(abs(st.level - tf / 2), abs(st.level - (h - tf / 2))) <= tf / 2 + 1.0
            assert st.t > 0 and st.b > 0
        if j.archetype in ("extended_end_plate", "flush_end_plate"):
            res = check_joint(j, a, members)
            assert res.checked
            # both stiffeners enter the resistance (6.2.6.2, 6.2.6.4.2), said in the notes
            codes = {n.code for n in res.notes}
            assert {NoteCode.COMPRESSION_STIFFENER, NoteCode.TENSION_STIFFENER} <= codes
            assert len(res.input.stiffeners) == 2
            seen += 1
    assert seen >= 4


def test_end_plates_on_column_webs_are_checked_in_shear_never_passed(build_variant):
    # the web in bending is not a component of EN 1993-1-8: shear path checked, moment not
    import ifcjoint
    from ifcjoint.model.codes import NotCheckedCode

    path, _ = build_variant(minor_end_plates=True, demo_details=False, bays_y=1,
                            relations="none")
    mc = ifcjoint.check(path)
    minor = [jc for jc in mc.joints if jc.joint.axis == "minor"]
    assert minor and all(jc.capacity.status == "checked" for jc in minor)
    for jc in minor:
        r = jc.capacity
        assert r.joint_kind == "end_plate_on_web" and r.V_j_Rd > 0
        assert NotCheckedCode.WEB_BENDING_NOT_COVERED in {g.code for g in r.gaps}


def test_haunches_read_whole_are_checked_or_told_why(build_variant):
    # plates (web 10, flange 180 x 14 under an IPE 400: 6.2.6.7(2) holds): checked as one
    # deeper section; a cut IPE 200 in S275 under the S355 IPE 400 (flange 100 x 8.5):
    # outside 6.2.6.7(2), the first rule broken named (its grade)
    import ifcjoint
    from ifcjoint.model.codes import NotCheckedCode

    for options, checked in ((dict(haunch=True, relations="assembly"), True),
                             (dict(haunch=True, haunch_member=True, relations="none"), False)):
        path, _ = build_variant(**options)
        mc = ifcjoint.check(path)
        (jc,) = [x for x in mc.joints if x.joint.archetype == "haunched_end_plate"]
        if checked:
            assert jc.capacity.checked and jc.capacity.input.haunch.d == pytest.approx(264.0)
        else:
            assert jc.capacity.not_checked.code == NotCheckedCode.HAUNCH_OUTSIDE_RULES
            assert jc.capacity.not_checked.values["what"] == "yield strength"
