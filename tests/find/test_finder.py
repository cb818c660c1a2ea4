"""Joint finder on models built in code (no IFC): each case states the geometry it builds.

Dimensions are round invented numbers for the geometry; HEB 260 / IPE 400 sizes are EN 10365
values from memory, used only to make the shapes realistic.
"""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from ifcjoint.find import FinderSettings, find_joints
from ifcjoint.model.elements import Fastener, Link, Member, ModelContents, Plate
from ifcjoint.model.identity import joint_id

HC, BC, TWC = 260.0, 260.0, 10.0  # HEB 260 (from memory)
HB, BB = 400.0, 180.0  # IPE 400 (from memory)
# these beams carry no web thickness: the finder's stand-in is 6 % of the depth
MAIN_HALF_TW = 0.06 * HB / 2


def column(guid, x, y, z0=0.0, z1=8000.0, depth_dir=(1.0, 0, 0), steel="steel"):
    w = (0.0, 0.0, 1.0)
    d = np.array(depth_dir)
    wd = tuple(np.cross(d, w))
    return Member(guid=guid, ifc_class="IfcColumn", name=guid, kind="column", start=(x, y, z0),
                  end=(x, y, z1), depth_dir=tuple(depth_dir), width_dir=wd, depth=HC, width=BC,
                  web_thickness=TWC, flange_thickness=17.5, steel=steel)


def beam(guid, p0, p1, h=HB, b=BB, steel="steel"):
    return Member(guid=guid, ifc_class="IfcBeam", name=guid, kind="beam", start=tuple(p0),
                  end=tuple(p1), depth_dir=(0.0, 0.0, 1.0),
                  width_dir=tuple(np.cross((0, 0, 1.0), np.subtract(p1, p0) /
                                           np.linalg.norm(np.subtract(p1, p0)))),
                  depth=h, width=b, steel=steel)


def model(members, plates=(), fasteners=(), links=()):
    return ModelContents(path="mem", schema="TEST", length_unit_to_mm=1.0,
                         members=tuple(members), plates=tuple(plates),
                         fasteners=tuple(fasteners), links=tuple(links))


def by_beam(result):
    return {(j.beam, j.beam_end): j for j in result.joints}


def others(result):
    return {(o.beam, o.beam_end): o for o in result.other_beam_ends}


def test_beam_against_column_flange_is_major_axis_joint_with_gap():
    # Beam along +X ends 20 mm (an end plate) short of the flange face at x = 130.
    r = find_joints(model([column("C", 0, 0), beam("B", (150, 0, 3800), (6000, 0, 3800))]))
    j = by_beam(r)[("B", "start")]
    assert (j.column, j.axis, j.face) == ("C", "major", "flange")
    assert j.gap == pytest.approx(20.0)
    assert j.point == pytest.approx((130.0, 0.0, 3800.0))
    assert j.side == "+"


def test_beam_between_flanges_is_minor_axis_joint():
    # Beam along +Y ends 10 mm outside the flange tips (y = 130): meets the web.
    r = find_joints(model([column("C", 0, 0), beam("B", (0, 140, 3800), (0, 5000, 3800))]))
    j = by_beam(r)[("B", "start")]
    assert (j.axis, j.face) == ("minor", "web")
    assert j.gap == pytest.approx(140 - TWC / 2)


def test_beam_drawn_to_column_axis_is_still_a_joint_with_negative_gap():
    r = find_joints(model([column("C", 0, 0), beam("B", (0, 0, 3800), (6000, 0, 3800))]))
    j = by_beam(r)[("B", "start")]
    assert j.axis == "major" and j.gap == pytest.approx(-130.0)


def test_opposite_faces_same_level_are_partners_and_other_levels_are_not():
    ms = [column("C", 0, 0), beam("L", (-6000, 0, 3800), (-150, 0, 3800)),
          beam("R", (150, 0, 3800), (6000, 0, 3800)),
          beam("R2", (150, 0, 7300), (6000, 0, 7300))]
    r = find_joints(model(ms))
    j = by_beam(r)
    assert j[("L", "end")].partner == j[("R", "start")].id
    assert j[("R", "start")].partner == j[("L", "end")].id
    assert j[("R2", "start")].partner is None


def test_major_and_minor_joints_at_one_column_are_not_partners():
    ms = [column("C", 0, 0), beam("X", (150, 0, 3800), (6000, 0, 3800)),
          beam("Y", (0, -5000, 3800), (0, -140, 3800))]
    j = by_beam(find_joints(model(ms)))
    assert j[("X", "start")].partner is None and j[("Y", "end")].partner is None


def test_other_beam_ends_are_each_accounted_for():
    ms = [
        column("C1", 0, 0), column("C2", 6000, 0),
        beam("MAIN", (150, 0, 3800), (5850, 0, 3800)),
        # secondary beam framing into MAIN's web at mid-span
        beam("SEC", (3000, 15, 3700), (3000, 5000, 3700), h=200, b=100),
        # two collinear pieces meeting end to end: a splice
        beam("P1", (150, 9000, 3800), (3000, 9000, 3800)),
        beam("P2", (3010, 9000, 3800), (6000, 9000, 3800)),
        # beam resting on top of column C2 (column top at 8000)
        beam("CAP", (6000, 0, 8200), (6000, 3000, 8200)),
        # ground tie at the foot of C1
        beam("TIE", (0, 140, 100), (0, 3000, 100), h=200, b=100),
    ]
    r = find_joints(model(ms))
    o = others(r)
    assert o[("SEC", "start")].kind == "beam_to_beam" and o[("SEC", "start")].other == "MAIN"
    assert o[("SEC", "end")].kind == "free_end"
    assert o[("P1", "end")].kind == "splice" and o[("P1", "end")].other == "P2"
    assert o[("P2", "start")].kind == "splice"
    assert o[("CAP", "start")].kind == "column_cap" and o[("CAP", "start")].other == "C2"
    assert o[("TIE", "start")].kind == "column_base" and o[("TIE", "start")].other == "C1"
    # every beam end is a joint or another kind, never lost; the only ends in both are
    # beam-to-beam ends, each linked to the joint that checks it
    ends = {(m.guid, e) for m in ms if m.kind == "beam" for e in ("start", "end")}
    got = set(by_beam(r)) | set(o)
    assert got == ends
    both = set(by_beam(r)) & set(o)
    assert both == {("SEC", "start"), ("P1", "end")}
    sp = by_beam(r)[("P1", "end")]  # one joint per splice, for the first end by GlobalId
    assert sp.support == "splice" and sp.column == "P2" and sp.other_end == "start"
    assert o[("P1", "end")].joint == o[("P2", "start")].joint == sp.id
    assert sp.point == pytest.approx((3005.0, 9000.0, 3800.0)) and sp.partner is None
    sec = by_beam(r)[("SEC", "start")]
    assert o[("SEC", "start")].joint == sec.id and sec.beam_to_beam
    assert sec.column == "MAIN" and sec.axis == "minor" and sec.face == "web"
    assert sec.gap == pytest.approx(15 - MAIN_HALF_TW)


def test_non_steel_members_and_steep_members_make_no_joints():
    ms = [column("C", 0, 0, steel="non_steel"), beam("B", (150, 0, 3800), (6000, 0, 3800)),
          column("S", 20000, 0),
          # inclined at 45 degrees: a brace, not a beam framing into the column
          beam("D", (20150, 0, 3800), (23000, 0, 6650))]
    r = find_joints(model(ms))
    assert not any(j.column == "C" for j in r.joints)
    assert ("D", "start") not in by_beam(r)


def end_plate(guid, x, z=3800.0, t=20.0):
    return Plate(guid=guid, ifc_class="IfcPlate", name=guid, center=(x, 0, z),
                 normal=(1.0, 0, 0), u_dir=(0, 1.0, 0), v_dir=(0, 0, 1.0), half_u=100,
                 half_v=260, thickness=t)


def bolt(guid, x, y, z, axis=(1.0, 0, 0), length=70.0):
    return Fastener(guid=guid, ifc_class="IfcMechanicalFastener", name=guid, kind="bolt",
                    center=(x, y, z), axis=axis, length=length, diameter=20.0)


def test_end_plate_and_bolts_attach_by_geometry_and_base_plate_does_not():
    ms = [column("C", 0, 0), beam("B", (150, 0, 3800), (6000, 0, 3800))]
    plates = [end_plate("EP", 140),
              Plate(guid="BASE", ifc_class="IfcPlate", name="base", center=(0, 0, -10),
                    normal=(0, 0, 1.0), u_dir=(1.0, 0, 0), v_dir=(0, 1.0, 0), half_u=200,
                    half_v=200, thickness=20)]
    bolts = [bolt(f"BT{i}", 165, y, z) for i, (y, z) in
             enumerate([(-50, 4000), (50, 4000), (-50, 3900), (50, 3900)])]
    bolts.append(bolt("ANCHOR", 150, 150, 50, axis=(0, 0, 1.0), length=400))
    j = by_beam(find_joints(model(ms, plates, bolts)))[("B", "start")]
    assert [p.guid for p in j.plates] == ["EP"]
    assert j.plates[0].role == "end_plate" and j.plates[0].source == "geometry"
    assert sorted(b.guid for b in j.fasteners) == ["BT0", "BT1", "BT2", "BT3"]


def test_realizing_relation_wins_over_geometry():
    # A plate far from any joint zone, but a realizing relationship names beam and column.
    ms = [column("C", 0, 0), beam("B", (150, 0, 3800), (6000, 0, 3800))]
    far = end_plate("FAR", 3000, z=3800)
    links = [Link(part="FAR", members=("B", "C"), source="realizing")]
    j = by_beam(find_joints(model(ms, [far], [], links)))[("B", "start")]
    assert [(p.guid, p.source) for p in j.plates] == [("FAR", "realizing")]


def test_the_finder_leaves_the_archetype_to_the_anatomy():
    # One decision, from the joint's anatomy (ifcjoint.archetypes): the finder decides none.
    from ifcjoint.model.codes import ReasonCode
    from ifcjoint.pipeline import describe_joints

    ms = [column("C", 0, 0), column("D", 6000, 0), beam("B", (150, 0, 3800), (5870, 0, 3800))]
    found = find_joints(model(ms, [end_plate("EP", 140)]))
    assert {j.archetype for j in found.joints} == {"unknown"}
    jj = by_beam(describe_joints(found))
    assert jj[("B", "start")].archetype == "incomplete"
    assert jj[("B", "start")].archetype_reason.code == ReasonCode.END_PLATE_NO_BOLTS
    assert jj[("B", "end")].archetype == "welded"  # touches the flange face at x = 5870


def test_joint_id_depends_only_on_beam_guid_and_end():
    a = joint_id("2O2Fr$t4X7Zf8NOew3FLOH", "end")
    assert a == joint_id("2O2Fr$t4X7Zf8NOew3FLOH", "end")
    assert a != joint_id("2O2Fr$t4X7Zf8NOew3FLOH", "start")
    assert a.startswith("J-") and len(a) == 14


def _moved(members, angle, dx, dy):
    c, s = math.cos(angle), math.sin(angle)
    R = np.array([[c, -s, 0], [s, c, 0], [0, 0, 1.0]])
    t = np.array([dx, dy, 0.0])
    out = []
    for m in members:
        out.append(Member(guid=m.guid, ifc_class=m.ifc_class, name=m.name, kind=m.kind,
                          start=tuple(R @ m.start + t), end=tuple(R @ m.end + t),
                          depth_dir=tuple(R @ m.depth_dir), width_dir=tuple(R @ m.width_dir),
                          depth=m.depth, width=m.width, web_thickness=m.web_thickness,
                          steel=m.steel))
    return out


FRAME = [column("C1", 0, 0), column("C2", 6000, 0), column("C3", 12000, 0),
         beam("B1", (150, 0, 3800), (5850, 0, 3800)),
         beam("B2", (6150, 0, 3800), (11850, 0, 3800)),
         beam("Y1", (0, 140, 3800), (0, 5000, 3800), h=300, b=150),
         beam("FREE", (12150, 0, 3800), (14000, 0, 3800))]


@settings(max_examples=25, deadline=None)
@given(angle=st.floats(-math.pi, math.pi), dx=st.floats(-1e5, 1e5), dy=st.floats(-1e5, 1e5))
def test_rigid_motion_of_the_frame_changes_no_joint(angle, dx, dy):
    base = find_joints(model(FRAME))
    moved = find_joints(model(_moved(FRAME, angle, dx, dy)))
    key = lambda j: (j.id, j.column, j.axis, j.partner)  # noqa: E731
    assert sorted(map(key, base.joints)) == sorted(map(key, moved.joints))
    gaps = {j.id: j.gap for j in base.joints}
    for j in moved.joints:
        assert j.gap == pytest.approx(gaps[j.id], abs=1e-6)
    assert sorted((o.beam, o.beam_end, o.kind) for o in base.other_beam_ends) == sorted(
        (o.beam, o.beam_end, o.kind) for o in moved.other_beam_ends)


def test_tolerance_setting_controls_how_far_a_beam_end_may_miss():
    # Beam stops 120 mm short of the face: beyond the default reach (20 + 60 mm).
    ms = [column("C", 0, 0), beam("B", (250, 0, 3800), (6000, 0, 3800))]
    assert not find_joints(model(ms)).joints
    wide = FinderSettings(tolerance=80.0)
    assert find_joints(model(ms), wide).joints


def test_secondary_beams_on_both_sides_of_a_web_pair_only_when_facing():
    # two secondaries meet MAIN's web from either side at x = 3000: a double-sided pair; a
    # third at x = 4500 on one side only has no partner (same level, another place along it)
    ms = [
        column("C1", 0, 0), column("C2", 6000, 0),
        beam("MAIN", (150, 0, 3800), (5850, 0, 3800)),
        beam("S1", (3000, 15, 3700), (3000, 5000, 3700), h=200, b=100),
        beam("S2", (3000, -5000, 3700), (3000, -15, 3700), h=200, b=100),
        beam("S3", (4500, 15, 3700), (4500, 5000, 3700), h=200, b=100),
    ]
    j = by_beam(find_joints(model(ms)))
    s1, s2, s3 = j[("S1", "start")], j[("S2", "end")], j[("S3", "start")]
    assert all(x.beam_to_beam and x.column == "MAIN" for x in (s1, s2, s3))
    assert s1.partner == s2.id and s2.partner == s1.id and s3.partner is None
    assert s1.side != s2.side
    # the beam-to-column joints are unchanged by them
    assert not j[("MAIN", "start")].beam_to_beam and j[("MAIN", "start")].column == "C1"


def test_a_skewed_or_sloping_secondary_is_not_a_web_joint():
    # 30 degrees off square in plan: not framing square into the web (stays an other end)
    ms = [column("C1", 0, 0), column("C2", 6000, 0),
          beam("MAIN", (150, 0, 3800), (5850, 0, 3800)),
          beam("SK", (3000, 15, 3700), (3000 + 2500, 15 + 4330, 3700), h=200, b=100)]
    r = find_joints(model(ms))
    assert ("SK", "start") not in by_beam(r)
    assert others(r)[("SK", "start")].kind == "beam_to_beam"


def test_an_apex_of_a_pitched_roof_is_a_splice():
    # two rafters pitched 8 degrees, meeting at the ridge 10 mm apart: a splice (apex),
    # within SPLICE_KINK_DEG (20) between them; one joint, the other beam as its "column"
    rise = 5000 * math.tan(math.radians(8))
    ms = [beam("R1", (0, 0, 3800), (5000, 0, 3800 + rise)),
          beam("R2", (5010, 0, 3800 + rise), (10010, 0, 3800))]
    r = find_joints(model(ms))
    (j,) = r.joints
    assert j.support == "splice" and (j.beam, j.beam_end, j.column) == ("R1", "end", "R2")
    assert others(r)[("R2", "start")].joint == j.id
