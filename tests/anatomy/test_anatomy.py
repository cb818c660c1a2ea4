"""Joint anatomy and detailing rules on joints built in code (no IFC).

The joint: a HEB 260 column (h 260, b 260, tw 10, tf 17.5, r 24; EN 10365 from memory) at the
origin, depth along x; an IPE 400 beam (400, 180, 8.6, 13.5, 21) along +x with its top at
z = 4000, ending on an end plate against the column flange at x = 130. Bolts M20 (d0 = 22,
EN 1090-2 normal clearance). Each rule is shown on its pass side (the clean joint has no
finding at all) and its fail side; limits are those of EN 1993-1-8 Table 3.3 or the
common-practice rules stated in ifcjoint/ec3/detailing.py.
"""

from __future__ import annotations

from dataclasses import dataclass, replace

import pytest

from ifcjoint.anatomy import JointAnatomy, analyse
from ifcjoint.archetypes import decide
from ifcjoint.find import find_joints
from ifcjoint.model.codes import Archetype, Reason
from ifcjoint.model.elements import Fastener, Member, ModelContents, Plate


@dataclass
class Read:
    """A joint's anatomy with the archetype the registry decides from it."""

    a: JointAnatomy
    archetype: Archetype
    reason: Reason

    def __getattr__(self, name):
        return getattr(self.a, name)

TOP = 4000.0


def build(*, tp=20.0, bp=200.0, top=-100.0, bottom=420.0, rows=(-50.0, 60.0, 160.0, 340.0),
          offsets=(-50.0, 50.0), d=20.0, length=70.0, bolt_text="BOLT M20x70 8.8",
          hole=22.0, gap=0.0, beam_y=0.0, beam_tf=13.5, beam_material="S355J2",
          with_bolts=True, with_plate=True, modelled_holes=True, bolt_kw=None,
          hole_rows=None, welds=()):
    col = Member(guid="COL", ifc_class="IfcColumn", name="C", kind="column",
                 start=(0.0, 0.0, 0.0), end=(0.0, 0.0, 8000.0), depth_dir=(1.0, 0, 0),
                 width_dir=(0, -1.0, 0), depth=260, width=260, web_thickness=10,
                 flange_thickness=17.5, root_radius=24, profile_name="HEB 260",
                 profile_type="IfcIShapeProfileDef", material="S355J2", steel="steel",
                 texts=("HEB 260",))
    x0 = 130.0 + gap + tp
    beam = Member(guid="BEAM", ifc_class="IfcBeam", name="B", kind="beam",
                  start=(x0, beam_y, TOP - 200), end=(6000.0, beam_y, TOP - 200),
                  depth_dir=(0, 0, 1.0), width_dir=(0, 1.0, 0), depth=400, width=180,
                  web_thickness=8.6, flange_thickness=beam_tf, root_radius=21,
                  profile_name="IPE 400", profile_type="IfcIShapeProfileDef",
                  material=beam_material, steel="steel", texts=("IPE 400",))
    xp = 130.0 + gap + tp / 2
    zc = TOP - (top + bottom) / 2
    holes = tuple(((xp, beam_y + o, TOP - r), hole) for r in (hole_rows or rows)
                  for o in offsets if modelled_holes)
    plates = [Plate(guid="EP", ifc_class="IfcPlate", name="EP", center=(xp, beam_y, zc),
                    normal=(1.0, 0, 0), u_dir=(0, 1.0, 0), v_dir=(0, 0, 1.0), half_u=bp / 2,
                    half_v=(bottom - top) / 2, thickness=tp, material="S355J2",
                    holes=holes)] if with_plate else []
    bolts = [Fastener(guid=f"BT{i}{k}", ifc_class="IfcMechanicalFastener", name=bolt_text,
                      kind="bolt", center=(xp, beam_y + o, TOP - r), axis=(1.0, 0, 0),
                      length=length, diameter=d, **{"nominal_diameter": None,
                                                    "nominal_length": None, **(bolt_kw or {})},
                      texts=(bolt_text,))
             for i, r in enumerate(rows) for k, o in enumerate(offsets)] if with_bolts else []
    xw = 130.0 + gap + tp + 3
    at = {"top_flange": ((xw, beam_y, TOP - 3), (0, 1.0, 0), 180.0),
          "bottom_flange": ((xw, beam_y, TOP - 397), (0, 1.0, 0), 180.0),
          "web": ((xw, beam_y + 6, TOP - 200), (0, 0, 1.0), 300.0)}
    bolts += [Fastener(guid=f"W{k}", ifc_class="IfcFastener", name=name, kind="weld",
                       center=at[where][0], axis=at[where][1], length=at[where][2],
                       diameter=6.0, texts=(name,), **(kw or {}))
              for k, (where, name, kw) in enumerate(welds)]
    m = ModelContents(path="mem", schema="TEST", length_unit_to_mm=1.0, members=(col, beam),
                      plates=tuple(plates), fasteners=tuple(bolts))
    res = find_joints(m)
    (j,) = [j for j in res.joints if j.beam == "BEAM"]
    _LAST[:] = [(j,), m]
    (a,) = analyse((j,), m)
    return Read(a, *decide(j, a))


_LAST: list = []


def _last_model():
    return _LAST


def codes(a):
    return sorted(f.code for f in a.findings)


def test_clean_extended_end_plate_reads_right_and_has_no_findings():
    a = build()
    assert a.archetype == "extended_end_plate"
    assert codes(a) == []
    assert (a.plate.tp, a.plate.bp, a.plate.hp) == pytest.approx((20, 200, 520))
    assert a.plate.projection_top == pytest.approx(100)
    assert a.plate.projection_bottom(a.beam_section.h) == pytest.approx(20)
    assert [r.from_beam_top for r in a.bolts.rows] == pytest.approx([-50, 60, 160, 340])
    assert a.bolts.gauge == pytest.approx(100)
    assert a.bolts.pitches == pytest.approx((110, 100, 180))
    assert (a.bolts.d, a.bolts.bolt_class, a.bolts.d0) == (20, "8.8", 22)
    assert a.bolts.d0_source.startswith("model")
    assert (a.beam_section.name, a.column_section.name) == ("IPE 400", "HEB 260")
    assert (a.beam_grade, a.column_grade) == ("S355J2", "S355J2")  # grade with its quality


def test_flush_plate_and_assumed_hole_diameter():
    a = build(top=-10, bottom=410, rows=(60.0, 150.0, 330.0), tp=15.0, bp=180.0)
    assert a.archetype == "flush_end_plate" and codes(a) == []
    b = build(modelled_holes=False)
    # EN 1090-2 Table 11 normal clearance for M20: 2 mm (from memory) -> d0 = 22
    assert b.bolts.d0 == 22 and "assumed" in b.bolts.d0_source


@pytest.mark.parametrize("kw, code", [
    (dict(offsets=(-85.0, 85.0)), "edge_distance_min"),  # e2 = 15 < 26.4
    (dict(rows=(-50.0, 60.0, 95.0, 200.0, 340.0)), "pitch_min"),  # p1 = 35 < 48.4
    (dict(offsets=(-20.0, 20.0)), "spacing_min"),  # p2 = 40 < 52.8
    (dict(rows=(-50.0, 60.0, 300.0, 340.0)), "pitch_max"),  # 240 > 200
    (dict(hole=26.0), "hole_clearance"),  # 6 mm for M20, normal 2 mm
    (dict(offsets=(-35.0, 35.0)), "hole_on_root_radius"),  # 35 - 5 - 24 = 6 < 11
    (dict(offsets=(-43.0, 43.0)), "no_spanner_room"),  # 14 < 0.93 * 20
    (dict(length=50.0), "bolt_too_short"),  # grip 37.5 needs 66.5
    (dict(tp=40.0), "plate_thickness_implausible"),  # 40 > 1.5 * 20
    (dict(offsets=(-50.0, 60.0)), "bolt_pattern_asymmetric"),
    (dict(bp=300.0), "plate_wider_than_column_flange"),
    (dict(gap=30.0), "gap_to_column"),
    (dict(beam_y=60.0), "column_edge_distance_min"),  # bolts at 110 from the web: e = 20
    (dict(beam_tf=16.0), "section_mismatch"),  # named IPE 400 (tf 13.5)
    (dict(beam_material="Steel_Undefined"), "grade_missing"),
    (dict(bolt_text="BOLT M20x70"), "bolt_class_missing"),
])
def test_each_rule_flags_its_defect(kw, code):
    assert code in codes(build(**kw))


def test_fail_side_findings_carry_measured_value_limit_and_elements():
    a = build(offsets=(-85.0, 85.0))
    (f,) = [f for f in a.findings if f.code == "edge_distance_min"]
    assert f.measured == pytest.approx(15) and f.limit == pytest.approx(26.4)
    assert "Table 3.3" in f.basis and "EP" in f.elements


def test_incomplete_joints():
    a = build(with_bolts=False)
    assert a.archetype == "incomplete" and "plate_without_bolts" in codes(a)
    b = build(with_plate=False)
    assert b.archetype == "incomplete" and "bolts_without_plate" in codes(b)
    # parts all there but off the face: the designed kind, with a gap that fails the joint
    c = build(gap=30.0)
    assert c.archetype == "extended_end_plate"
    (gap,) = [f for f in c.findings if f.code == "gap_to_column"]
    assert gap.measured == pytest.approx(30.0) and gap.fails_joint
    assert gap.detail["part"] == "end plate"
    assert not [f for f in build(gap=4.0).findings if f.code == "gap_to_column"]  # tolerance


def test_thicker_plate_and_longer_bolt_only_remove_findings():
    # Invariant: a thicker end plate (within the plausible range) or a longer bolt never adds a
    # detailing finding.
    base = set(codes(build(tp=15.0, length=50.0)))
    assert set(codes(build(tp=20.0, length=50.0))) <= base
    assert set(codes(build(tp=15.0, length=90.0))) <= base


def test_assumed_grade_and_bolt_class_are_reported_not_silent():
    from ifcjoint.anatomy import AnatomySettings

    a = build(beam_material="Steel_Undefined", bolt_text="BOLT M20x70")
    assert a.beam_grade is None and a.bolts.bolt_class is None
    assert {"grade_missing", "bolt_class_missing"} <= set(codes(a))
    # same joint with user defaults: used, and said so
    import ifcjoint.anatomy as an

    j_model = _last_model()
    (b,) = an.analyse(j_model[0], j_model[1], AnatomySettings(assume_steel_grade="S355",
                                                              assume_bolt_class="8.8"))
    assert b.beam_grade == "S355" and b.bolts.bolt_class == "8.8"
    assert any("user setting" in x for x in b.assumed) and len(b.assumed) == 2
    assert "grade_missing" not in codes(b)


def test_tstub_geometry_of_the_clean_joint():
    # EN 1993-1-8 Fig 6.8: m = w/2 - tw/2 - 0.8 r = 50 - 5 - 19.2 = 25.8; e = (260 - 100)/2 = 80;
    # plate e = (200 - 100)/2 = 50; ex = 100 - 50 = 50 (row 1 is 50 above the flange).
    t = build().bolts.tstub
    assert t["m_column"] == pytest.approx(25.8) and t["e_column"] == pytest.approx(80)
    assert t["e_plate"] == pytest.approx(50) and t["ex"] == pytest.approx(50)
    assert t["row1_above_flange"] == pytest.approx(50)


def test_hole_outside_the_plate_is_its_own_finding():
    a = build(offsets=(-95.0, 95.0))  # 5 mm from a 200 mm plate's edge, d0/2 = 11
    assert "bolt_outside_outline" in codes(a) and "edge_distance_min" not in codes(a)


def test_every_bolt_is_measured_so_one_defect_never_hides_another():
    # Left bolts 120 mm off the plate's centre (outside a 200 mm plate), right bolts 85 mm
    # (15 mm from the edge, below e2 >= 1.2 d0 = 26.4 mm, EN 1993-1-8 Table 3.3): both found,
    # each naming its own bolts.
    a = build(offsets=(-120.0, 85.0))
    (out,) = [f for f in a.findings if f.code == "bolt_outside_outline"
              and f.detail["part"] == "plate"]
    (close,) = [f for f in a.findings if f.code == "edge_distance_min"
                and f.detail["edge"] == "side"]
    assert out.measured == pytest.approx(-20) and out.detail["count"] == 4
    assert close.measured == pytest.approx(15) and close.detail["count"] == 4
    assert not set(out.elements[1:]) & set(close.elements[1:])  # different bolts
    assert out.fails_joint and close.fails_joint


def test_values_that_cannot_be_right_are_named_and_the_joint_is_unreadable():
    # A bolt diameter of -20 mm or a plate 0 mm thick is not a dimension: a finding names the
    # entity, the value is never used (no "M-20" anywhere), the joint is not checked.
    from ifcjoint.archetypes import run_joint
    from ifcjoint.model.codes import NotCheckedCode, Status

    a = build(bolt_kw={"nominal_diameter": -20.0}, bolt_text="BOLT 8.8")
    bad = [f for f in a.findings if f.code == "value_not_usable"]
    assert bad and bad[0].detail["what"] == "bolt diameter"
    assert bad[0].detail["entity"].startswith("BT") and bad[0].measured == -20.0
    assert a.bolts.d != -20.0
    j, m = _LAST
    joint = replace(j[0], archetype=a.archetype, archetype_reason=a.reason)
    _, r = run_joint(joint, a.a, {x.guid: x for x in m.members})
    assert r.not_checked.code == NotCheckedCode.VALUE_NOT_USABLE
    assert r.not_checked.status == Status.UNREADABLE
    from ifcjoint.report.words import coded, finding_message
    assert "M-20" not in finding_message(bad[0]) and "-20" in coded(r.not_checked)


def test_hole_diameter_from_a_property_when_holes_are_not_modelled():
    # 26 mm holes for M20 bolts: clearance 6 mm against the normal 2 mm of EN 1090-2 Table 11
    # (from memory): an error that fails the joint.
    a = build(modelled_holes=False, bolt_kw={"hole_diameter": 26.0})
    assert a.bolts.d0 == 26.0 and "property" in a.bolts.d0_source
    (f,) = [f for f in a.findings if f.code == "hole_clearance"]
    assert f.measured == pytest.approx(6.0) and f.fails_joint
    ok = build(modelled_holes=False, bolt_kw={"hole_diameter": 22.0})
    assert "hole_clearance" not in codes(ok) and ok.bolts.d0 == 22.0


def test_plate_thickness_not_rolled_is_a_warning():
    # 17 mm is neither a metric stock thickness nor an inch one; 20 mm, 25 mm and 3/4 in
    # (19.05 mm) are (common practice stock lists, from memory: ifcjoint/catalogue/plates.py).
    odd = build(tp=17.0)
    (f,) = [f for f in odd.findings if f.code == "plate_thickness_not_stock"]
    assert f.severity == "warning" and not f.fails_joint
    assert f.detail["nearest"] in (15.0, 18.0)
    for tp in (20.0, 19.05, 25.0):
        assert "plate_thickness_not_stock" not in codes(build(tp=tp))


def test_a_bolt_through_plate_material_is_found_and_makes_no_false_row():
    # Holes at rows -50, 60, 160, 340; an extra pair of bolts at 185 has no hole (it passes
    # through plate material, inside the outline). It is reported and fails the joint, and it
    # is left out of the rows: no row at 185, no 25 mm pitch.
    a = build(rows=(-50.0, 60.0, 160.0, 185.0, 340.0), hole_rows=(-50.0, 60.0, 160.0, 340.0))
    (f,) = [f for f in a.findings if f.code == "bolt_off_hole"]
    assert f.detail["count"] == 2 and f.measured == pytest.approx(25.0) and f.fails_joint
    assert [r.from_beam_top for r in a.bolts.rows] == [-50.0, 60.0, 160.0, 340.0]
    assert not [x for x in a.findings if x.code in ("pitch_min", "pitch_max")]
    assert "bolt_off_hole" not in codes(build())


def test_modelled_welds_are_read_placed_and_sized():
    # Flange welds "Fillet weld a5" (throat in the name), a web weld with a leg property of
    # 10 mm (a = 10 / sqrt 2 = 7.07). Full strength on the S355 IPE 400 (EN 1993-1-8
    # 4.5.3.3, beta_w 0.9, gamma_M2 1.25, fu 510): flange 13.5 mm -> a >= 9.16 mm, web 8.6 mm
    # -> a >= 5.83 mm. On an end plate the smaller flange welds fail the joint.
    import math

    a = build(welds=[("top_flange", "Fillet weld a5", None),
                     ("bottom_flange", "Fillet weld a5", None),
                     ("web", "WELD", {"weld_throat": 10 / math.sqrt(2)})])
    got = {w.location: round(w.throat, 2) for w in a.welds}
    assert got == {"top_flange": 5.0, "bottom_flange": 5.0, "web": 7.07}
    small = [f for f in a.findings if f.code == "weld_too_small"]
    assert {f.detail["location"] for f in small} == {"top_flange", "bottom_flange"}
    assert all(f.fails_joint and f.limit == pytest.approx(9.16, abs=0.01) for f in small)
    assert a.archetype == "extended_end_plate"


def test_modelled_welds_enter_the_check_and_the_rest_are_assumed():
    from ifcjoint.archetypes import run_joint

    a = build(welds=[("top_flange", "Fillet weld a12", None)])
    j, m = _LAST
    joint = replace(j[0], archetype=a.archetype, archetype_reason=a.reason)
    _, r = run_joint(joint, a.a, {x.guid: x for x in m.members})
    w = r.input.welds
    assert w.top_flange_throat == 12.0 and w.modelled == ("top_flange",) and w.assumed
    assert w.bottom_flange_throat == 10.0  # assumed full strength there: 9.16 rounded up
    assert any(n.code == "welds_partly_modelled" for n in r.notes)
