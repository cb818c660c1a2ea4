"""A fin plate read in its own plane (built in code, no IFC).

HEB 260 column (h 260, b 260, tw 10, tf 17.5, r 24; EN 10365 from memory) at the origin, depth
along x; an IPE 400 beam along +x stopping 10 mm short of the flange face (x = 130); a 10 mm
fin plate welded to the flange, beside the beam web, 150 mm along the beam and 280 mm high,
with two vertical lines of M20 bolts (d0 = 22) 60 mm apart and rows 70 mm apart. Limits:
EN 1993-1-8 Table 3.3 (e1, e2 >= 1.2 d0 = 26.4; p1 >= 2.2 d0 = 48.4; p2 >= 2.4 d0 = 52.8).
"""

from __future__ import annotations

import pytest

from ifcjoint.anatomy import analyse
from ifcjoint.archetypes import decide
from ifcjoint.find import find_joints
from ifcjoint.model.elements import Fastener, Member, ModelContents, Plate

TOP = 4000.0
FACE = 130.0
MEMBERS: dict = {}  # the members of the last model built, by GlobalId


def build(*, lines=(40.0, 100.0), rows=(90.0, 160.0, 230.0), length=150.0, tp=10.0,
          plate_top=50.0, plate_bottom=330.0, gap=0.0):
    col = Member(guid="COL", ifc_class="IfcColumn", name="C", kind="column",
                 start=(0.0, 0.0, 0.0), end=(0.0, 0.0, 8000.0), depth_dir=(1.0, 0, 0),
                 width_dir=(0, -1.0, 0), depth=260, width=260, web_thickness=10,
                 flange_thickness=17.5, root_radius=24, profile_name="HEB 260",
                 profile_type="IfcIShapeProfileDef", material="S355J2", steel="steel",
                 texts=("HEB 260",))
    beam = Member(guid="BEAM", ifc_class="IfcBeam", name="B", kind="beam",
                  start=(FACE + 10.0, 0.0, TOP - 200), end=(6000.0, 0.0, TOP - 200),
                  depth_dir=(0, 0, 1.0), width_dir=(0, 1.0, 0), depth=400, width=180,
                  web_thickness=8.6, flange_thickness=13.5, root_radius=21,
                  profile_name="IPE 400", profile_type="IfcIShapeProfileDef",
                  material="S355J2", steel="steel", texts=("IPE 400",))
    y = 8.6 / 2 + tp / 2
    x0 = FACE + gap
    zc = TOP - (plate_top + plate_bottom) / 2
    holes = tuple(((x0 + a, y, TOP - r), 22.0) for r in rows for a in lines)
    plate = Plate(guid="FP", ifc_class="IfcPlate", name="FIN PLATE", center=(x0 + length / 2,
                  y, zc), normal=(0, 1.0, 0), u_dir=(1.0, 0, 0), v_dir=(0, 0, 1.0),
                  half_u=length / 2, half_v=(plate_bottom - plate_top) / 2, thickness=tp,
                  material="S355J2", holes=holes)
    bolts = [Fastener(guid=f"B{i}{k}", ifc_class="IfcMechanicalFastener",
                      name="BOLT M20x50 8.8", kind="bolt", center=(x0 + a, y, TOP - r),
                      axis=(0, 1.0, 0), length=50.0, diameter=20.0, nominal_diameter=None,
                      nominal_length=None, texts=("BOLT M20x50 8.8",))
             for i, r in enumerate(rows) for k, a in enumerate(lines)]
    MEMBERS.update({"COL": col, "BEAM": beam})
    m = ModelContents(path="mem", schema="TEST", length_unit_to_mm=1.0, members=(col, beam),
                      plates=(plate,), fasteners=tuple(bolts))
    (j,) = [j for j in find_joints(m).joints if j.beam == "BEAM"]
    (a,) = analyse((j,), m)
    return j, a, decide(j, a)


def codes(a):
    return [f.code for f in a.findings]


def test_two_bolt_lines_are_read_along_the_beam():
    j, a, (archetype, _) = build()
    assert archetype == "fin_plate"
    assert a.plate.bp == pytest.approx(150.0)  # its length along the beam, not its thickness
    assert a.plate.hp == pytest.approx(280.0)
    assert a.bolts.gauge == pytest.approx(60.0)  # between the lines, along the beam
    assert a.bolts.pitches == (pytest.approx(70.0), pytest.approx(70.0))
    # no spacing of 0 mm, no asymmetry; 10 mm of S355 with M20 is thicker than the 0.42 d
    # = 8.4 mm that makes a fin plate rotate as pinned (design guide; a warning only)
    assert codes(a) == ["fin_plate_not_ductile"]
    assert not a.findings[0].fails_joint


def test_a_thin_fin_plate_is_clean():
    _, a, _ = build(tp=8.0)
    assert codes(a) == []


@pytest.mark.parametrize("kw, code, measured", [
    ({"lines": (40.0, 80.0)}, "spacing_min", 40.0),  # p2 < 52.8
    ({"lines": (40.0, 135.0)}, "edge_distance_min", 15.0),  # e2 to the plate's far end
    ({"rows": (65.0, 160.0, 230.0)}, "end_distance_min", 15.0),  # e1 to the plate's top
    ({"rows": (90.0, 130.0, 230.0)}, "pitch_min", 40.0),  # p1 < 48.4
])
def test_fin_plate_distances_in_its_own_plane(kw, code, measured):
    _, a, _ = build(**kw)
    found = [f for f in a.findings if f.code == code]
    assert found and found[0].measured == pytest.approx(measured)
    assert found[0].fails_joint


def test_a_fin_plate_off_the_face_is_a_fin_plate_with_a_gap():
    _, a, (archetype, _) = build(gap=12.0)
    assert archetype == "fin_plate"
    (g,) = [f for f in a.findings if f.code == "gap_to_column"]
    assert g.measured == pytest.approx(12.0) and g.detail["part"] == "fin plate"



def test_fin_plate_engine_input_from_the_anatomy():
    # the geometry the engine gets, measured from the column face (see the module docstring):
    # lines 40 and 100 mm from the face -> z 70; e2 150 - 100 = 50; the beam stops 10 mm off
    # the face -> beam web e2 40 - 10 = 30; e1 90 - 50 = 40 at the top, 330 - 230 = 100 below
    from ifcjoint.archetypes import joint_type
    from ifcjoint.archetypes.builders import fin_plate_input

    j, a, (archetype, _) = build(tp=12.0)
    inp = fin_plate_input(j, a, MEMBERS)
    assert inp.support == "flange" and inp.bolts.n1 == 3 and inp.bolts.n2 == 2
    f = inp.fin
    assert (f.z, f.e2, f.e2_beam, f.e1_top, f.e1_bottom) == pytest.approx(
        (70.0, 50.0, 30.0, 40.0, 100.0))
    assert inp.bolts.gauge == pytest.approx(60.0) and inp.bolts.p1 == pytest.approx(70.0)
    r = joint_type(archetype).engine(inp)
    assert r.checked and r.V_j_Rd > 0 and r.hogging.M_j_Rd == 0.0
    # on a column flange with z = 70 <= 12 / 0.15 = 80: nothing left unchecked
    assert not r.gaps and not r.conditions  # on a flange: no web checks, no punching rule
