"""Joints written the way other exporters write them, built here entity by entity.

Independent of sample_models/generate.py on purpose: a column extruded downwards from its
top, an I profile given through IfcDerivedProfileDef with a cardinal-point offset, end plates
extruded along their width (not their thickness), bolts without a body (placement and nominal
sizes only), bolts as swept-disk solids, bolts as German-named proxies, and parts realised
through an IfcElementAssembly. Every model is one HEB 300 column (EN 10365 h 300, b 300,
tw 11, tf 19, r 27; from memory) with two IPE 330 beams (330, 160, 7.5, 11.5, 18) meeting
opposite flanges at the same level, each with a 20 mm extended end plate 200 x 450 and four
rows of two M20 bolts (gauge 120, rows at -50, 60, 160, 270 mm from the beam top).
"""

from __future__ import annotations

import math

import ifcopenshell
import ifcopenshell.api.root
import ifcopenshell.api.unit
import ifcopenshell.guid
import pytest

from ifcjoint.pipeline import scan

TOP = 3500.0  # top of beam steel
ROWS = (-50.0, 60.0, 160.0, 270.0)
GAUGE = 120.0  # a usual gauge on a HEB 300 flange (common practice, no source)


class Model:
    def __init__(self, schema: str, unit_mm: float = 1.0):
        self.f = ifcopenshell.file(schema=schema)
        self.k = 1.0 / unit_mm
        f = self.f
        if schema == "IFC2X3":
            person = f.createIfcPerson(None, "Test", None, None, None, None, None, None)
            org = f.createIfcOrganization(None, "Test", None, None, None)
            po = f.createIfcPersonAndOrganization(person, org, None)
            app = f.createIfcApplication(org, "1", "test", "test")
            self.oh = f.createIfcOwnerHistory(po, app, None, "ADDED", None, None, None, 0)
        else:
            self.oh = None
        proj = ifcopenshell.api.root.create_entity(f, ifc_class="IfcProject", name="conv")
        if schema == "IFC2X3":
            proj.OwnerHistory = self.oh
        if unit_mm == 1.0:
            unit = ifcopenshell.api.unit.add_si_unit(f, unit_type="LENGTHUNIT", prefix="MILLI")
        else:
            unit = ifcopenshell.api.unit.add_si_unit(f, unit_type="LENGTHUNIT")
        ifcopenshell.api.unit.assign_unit(f, units=[unit])
        self.ctx = f.createIfcGeometricRepresentationContext(
            "Body", "Model", 3, 1e-5, self.a2p((0, 0, 0)), None)
        proj.RepresentationContexts = [self.ctx]
        self.n = 0

    def L(self, v):
        return float(v) * self.k

    def pt(self, p):
        return self.f.createIfcCartesianPoint([self.L(c) for c in p])

    def a2p(self, o, z=None, x=None):
        f = self.f
        return f.createIfcAxis2Placement3D(
            self.pt(o), f.createIfcDirection(z) if z else None,
            f.createIfcDirection(x) if x else None)

    def place(self, o, z=None, x=None, rel=None):
        return self.f.createIfcLocalPlacement(rel, self.a2p(o, z, x))

    def rep(self, items, kind="SweptSolid"):
        r = self.f.createIfcShapeRepresentation(self.ctx, "Body", kind, items)
        return self.f.createIfcProductDefinitionShape(None, None, [r])

    def el(self, cls, name, placement, shape, **kw):
        self.n += 1
        e = self.f.create_entity(cls, GlobalId=ifcopenshell.guid.new(), OwnerHistory=self.oh,
                                 Name=name, ObjectPlacement=placement, Representation=shape,
                                 **kw)
        return e

    def ishape(self, name, h, b, tw, tf, r, offset=(0.0, 0.0)):
        f = self.f
        pos = f.createIfcAxis2Placement2D(f.createIfcCartesianPoint([self.L(offset[0]),
                                                                     self.L(offset[1])]), None)
        return f.createIfcIShapeProfileDef("AREA", name, pos, self.L(b), self.L(h), self.L(tw),
                                           self.L(tf), self.L(r))

    def extrude(self, profile, position, direction, depth):
        return self.f.createIfcExtrudedAreaSolid(profile, position,
                                                 self.f.createIfcDirection(direction),
                                                 self.L(depth))


def build(schema="IFC4", *, bolt_style="body", plate_style="width", rel="none",
          unit_mm=1.0, angle=0.0):
    m = Model(schema, unit_mm)
    f = m.f
    c, s = math.cos(math.radians(angle)), math.sin(math.radians(angle))

    def rot(x, y):
        return (c * x - s * y, s * x + y * c)

    # Column: placed at its top and extruded downwards; depth along world x (rotated).
    col_top = 6000.0
    prof = m.ishape("HEB300", 300, 300, 11, 19, 27)
    col = m.el("IfcColumn", "Column HEB300", m.place((0, 0, col_top), None, (*rot(0, -1), 0)),
               None)
    col.Representation = m.rep([m.extrude(prof, m.a2p((0, 0, 0)), (0, 0, -1.0), col_top)])
    parts = {"plates": [], "bolts": [], "beams": []}
    for side in (1, -1):
        # Beam along +-x from the plate's face; profile is derived (rotated 90 deg and back)
        # and offset to the top of steel (cardinal point), extruded along the beam.
        x0 = side * (150.0 + 20.0)
        length = 5000.0
        d = (side * c, side * s, 0.0)
        bx, by = rot(x0, 0)
        base = m.ishape("IPE330", 330, 160, 7.5, 11.5, 18, offset=(0.0, 165.0))
        op = f.createIfcCartesianTransformationOperator2D(
            f.createIfcDirection([0.0, 1.0]), f.createIfcDirection([-1.0, 0.0]),
            f.createIfcCartesianPoint([0.0, 0.0]), 1.0)
        derived = f.createIfcDerivedProfileDef("AREA", "IPE330", base, op, None)
        beam = m.el("IfcBeam", f"Beam {side}", m.place((bx, by, TOP), (*d[:2], 0.0),
                                                       (0.0, 0.0, 1.0)), None)
        # profile local: x = derived y (vertical), so rotate the solid back with RefDirection
        beam.Representation = m.rep([m.extrude(derived, m.a2p((0, 0, 0), (0, 0, 1.0),
                                                              (1.0, 0, 0)), (0, 0, 1.0),
                                               length)])
        parts["beams"].append(beam)
        # End plate 200 wide x 450 high x 20 thick: rectangle (20 x 450) extruded 200 across.
        px, py = rot(side * 160.0, 0)
        lat = (-s, c, 0.0)
        if plate_style == "width":
            rect = f.createIfcRectangleProfileDef(
                "AREA", "PL20*200", f.createIfcAxis2Placement2D(
                    f.createIfcCartesianPoint([0.0, 0.0]), None), m.L(20.0), m.L(450.0))
            pl_place = m.place((px, py, TOP + 100.0 - 225.0), lat, (side * c, side * s, 0.0))
            solid = m.extrude(rect, m.a2p((0, 0, -100.0)), (0, 0, 1.0), 200.0)
        else:
            rect = f.createIfcRectangleProfileDef(
                "AREA", "PL20*200", f.createIfcAxis2Placement2D(
                    f.createIfcCartesianPoint([0.0, 0.0]), None), m.L(200.0), m.L(450.0))
            pl_place = m.place((px, py, TOP + 100.0 - 225.0), (side * c, side * s, 0.0),
                               lat)
            solid = m.extrude(rect, m.a2p((0, 0, -10.0)), (0, 0, 1.0), 20.0)
        plate = m.el("IfcPlate", "PL20", pl_place, m.rep([solid]))
        parts["plates"].append(plate)
        for row in ROWS:
            for o in (-GAUGE / 2, GAUGE / 2):
                hx, hy = rot(side * 170.0, 0)
                ox, oy = lat[0] * o, lat[1] * o
                head = (hx + ox, hy + oy, TOP - row)
                axis = (-side * c, -side * s, 0.0)  # from the plate through the column flange
                bolt = _bolt(m, bolt_style, head, axis, schema)
                parts["bolts"].append(bolt)
    st = f.create_entity("IfcBuildingStorey", GlobalId=ifcopenshell.guid.new(),
                         OwnerHistory=m.oh, Name="Level 1", ObjectPlacement=m.place((0, 0, 0)))
    contained = [col, *parts["beams"], *parts["plates"], *parts["bolts"]]
    if rel == "assembly-realizing":
        for i, beam in enumerate(parts["beams"]):
            asm = m.el("IfcElementAssembly", f"Joint {i}", m.place((0, 0, 0)), None,
                       PredefinedType="USERDEFINED", **({"AssemblyPlace": "SITE"}
                                                       if schema == "IFC2X3" else {}))
            own = [parts["plates"][i], *parts["bolts"][8 * i: 8 * i + 8]]
            f.create_entity("IfcRelAggregates", GlobalId=ifcopenshell.guid.new(),
                            OwnerHistory=m.oh, RelatingObject=asm, RelatedObjects=own)
            f.create_entity("IfcRelConnectsWithRealizingElements",
                            GlobalId=ifcopenshell.guid.new(), OwnerHistory=m.oh,
                            RelatingElement=col, RelatedElement=beam, RealizingElements=[asm])
            contained = [x for x in contained if x not in own] + [asm]
    f.create_entity("IfcRelContainedInSpatialStructure", GlobalId=ifcopenshell.guid.new(),
                    OwnerHistory=m.oh, RelatedElements=contained, RelatingStructure=st)
    steel = f.createIfcMaterial("S355J0")
    f.create_entity("IfcRelAssociatesMaterial", GlobalId=ifcopenshell.guid.new(),
                    OwnerHistory=m.oh, RelatedObjects=[col, *parts["beams"], *parts["plates"]],
                    RelatingMaterial=steel)
    return m.f, parts


def _bolt(m: Model, style: str, head, axis, schema):
    f = m.f
    x = (axis[1], -axis[0], 0.0)
    if style == "body":
        circ = f.createIfcCircleProfileDef("AREA", None, f.createIfcAxis2Placement2D(
            f.createIfcCartesianPoint([0.0, 0.0]), None), m.L(10.0))
        b = m.el("IfcMechanicalFastener", "BOLT M20x80 8.8", m.place(head, axis, x),
                 m.rep([m.extrude(circ, m.a2p((0, 0, 0)), (0, 0, 1.0), 80.0)]))
    elif style == "no_body":
        b = m.el("IfcMechanicalFastener", "HV 8.8", m.place(head, axis, x), None)
        b.NominalDiameter = m.L(20.0)
        b.NominalLength = m.L(80.0)
    elif style == "swept_disk":
        line = f.createIfcPolyline([m.pt((0, 0, 0)), m.pt((0, 0, 80.0))])
        disk = f.createIfcSweptDiskSolid(line, m.L(10.0), None, None, None)
        b = m.el("IfcMechanicalFastener", "M20 8.8", m.place(head, axis, x),
                 m.rep([disk], "AdvancedSweptSolid"))
    else:  # German-named proxy with a tessellated... kept simple: an extruded body
        circ = f.createIfcCircleProfileDef("AREA", None, f.createIfcAxis2Placement2D(
            f.createIfcCartesianPoint([0.0, 0.0]), None), m.L(10.0))
        b = m.el("IfcBuildingElementProxy", "Sechskantschraube M20x80 10.9",
                 m.place(head, axis, x),
                 m.rep([m.extrude(circ, m.a2p((0, 0, 0)), (0, 0, 1.0), 80.0)]))
    return b


CASES = [
    dict(),
    dict(schema="IFC2X3", bolt_style="no_body", unit_mm=1000.0, angle=33.0),
    dict(bolt_style="swept_disk", plate_style="thickness", angle=-12.0),
    dict(schema="IFC2X3", bolt_style="proxy", rel="assembly-realizing"),
    dict(schema="IFC4X3", bolt_style="no_body", rel="assembly-realizing", angle=90.0),
]


@pytest.mark.parametrize("case", CASES, ids=lambda c: "-".join(f"{k}={v}" for k, v in
                                                               c.items()) or "default")
def test_double_sided_extended_end_plate_joint(case, tmp_path):
    f, parts = build(**case)
    path = tmp_path / "m.ifc"
    f.write(str(path))
    r = scan(path)
    assert len(r.joints) == 2, [u.reason for u in r.unreadable]
    a, b = r.joints
    assert a.partner == b.id and b.partner == a.id
    for j in r.joints:
        assert j.axis == "major" and j.archetype == "extended_end_plate", j.archetype_reason
        assert j.findings == (), j.findings
        beam = next(x for x in parts["beams"] if x.GlobalId == j.beam)
        i = parts["beams"].index(beam)
        assert [p.guid for p in j.plates] == [parts["plates"][i].GlobalId]
        want = sorted(x.GlobalId for x in parts["bolts"][8 * i: 8 * i + 8])
        assert sorted(x.guid for x in j.fasteners if x.role == "bolt") == want
        an = r.anatomy[j.id]
        assert an.plate.tp == pytest.approx(20.0, abs=0.1)
        assert an.plate.bp == pytest.approx(200.0, abs=0.1)
        assert an.plate.projection_top == pytest.approx(100.0, abs=0.1)
        assert [x.from_beam_top for x in an.bolts.rows] == pytest.approx(ROWS, abs=0.5)
        assert an.bolts.gauge == pytest.approx(GAUGE, abs=0.5)
        assert an.bolts.d == 20
        assert an.beam_section.name == "IPE 330" and an.column_section.name == "HEB 300"


def _cleat_joint(m: Model, rows=(85.0, 155.0, 225.0), with_support_bolts=True,
                 cls="IfcPlate"):
    """A beam on a column flange with two L 90 x 90 x 10 cleats, 240 long, fully bolted.

    Beam end 10 mm off the flange face (x = 150); the cleats' heels on the face, each beside
    the web (t_w 7.5); web-side line 50 mm from the face, support-side lines 50 mm from the
    web faces (cross-centres 107.5): every end and edge distance 40 mm.
    """
    f = m.f
    col = m.el("IfcColumn", "Column HEB300", m.place((0, 0, 6000.0), None, (0.0, -1.0, 0)),
               None)
    col.Representation = m.rep([m.extrude(m.ishape("HEB300", 300, 300, 11, 19, 27),
                                          m.a2p((0, 0, 0)), (0, 0, -1.0), 6000.0)])
    beam = m.el("IfcBeam", "Beam", m.place((160.0, 0, TOP - 165.0), (1.0, 0, 0), (0, 1.0, 0)),
                None)
    beam.Representation = m.rep([m.extrude(m.ishape("IPE330", 330, 160, 7.5, 11.5, 18),
                                           m.a2p((0, 0, 0)), (0, 0, 1.0), 5000.0)])
    cleats, bolts = [], []
    for side in (1, -1):
        prof = f.createIfcLShapeProfileDef(
            "AREA", "L90X90X10", f.createIfcAxis2Placement2D(
                f.createIfcCartesianPoint([0.0, 0.0]), None), 90.0, 90.0, 10.0, 11.0, None,
            None)
        z0 = TOP - 285.0 if side > 0 else TOP - 45.0
        cleat = m.el(cls, "L90X90X10",
                     m.place((195.0, side * 48.75, z0), (0, 0, float(side)), (1.0, 0, 0)),
                     m.rep([m.extrude(prof, m.a2p((0, 0, 0)), (0, 0, 1.0), 240.0)]))
        cleats.append(cleat)
    for row in rows:
        bolts.append(_bolt(m, "body", (200.0, 20.0, TOP - row), (0.0, -1.0, 0.0), "IFC4"))
        for y in ((53.75, -53.75) if with_support_bolts else ()):
            bolts.append(_bolt(m, "body", (165.0, y, TOP - row), (-1.0, 0.0, 0.0), "IFC4"))
    st = f.create_entity("IfcBuildingStorey", GlobalId=ifcopenshell.guid.new(), Name="L1",
                         ObjectPlacement=m.place((0, 0, 0)))
    f.create_entity("IfcRelContainedInSpatialStructure", GlobalId=ifcopenshell.guid.new(),
                    RelatedElements=[col, beam, *cleats, *bolts], RelatingStructure=st)
    steel = f.createIfcMaterial("S275JR")
    f.create_entity("IfcRelAssociatesMaterial", GlobalId=ifcopenshell.guid.new(),
                    RelatedObjects=[col, beam, *cleats], RelatingMaterial=steel)
    return cleats, bolts


def test_double_angle_web_cleats_are_read_and_checked(tmp_path):
    import ifcjoint
    from ifcjoint.model.codes import Archetype

    m = Model("IFC4")
    cleats, bolts = _cleat_joint(m)
    path = tmp_path / "cleats.ifc"
    m.f.write(str(path))
    r = scan(path)
    (j,) = r.joints
    assert j.archetype == Archetype.ANGLE_CLEATS, (j.archetype, j.archetype_reason)
    c = r.anatomy[j.id].cleats
    assert (c.t, c.hp, c.n_web, c.n_sup) == pytest.approx((10.0, 240.0, 3, 6))
    assert c.rows == pytest.approx((85.0, 155.0, 225.0)) and c.p1 == pytest.approx(70.0)
    assert (c.z, c.e1, c.e2_web, c.e2_sup, c.e2_beam) == pytest.approx(
        (50.0, 40.0, 40.0, 40.0, 40.0), abs=0.01)
    assert c.cross_centres == pytest.approx(107.5) and c.r == pytest.approx(11.0)
    assert j.findings == ()  # 80 mm bolts: grips 27.5 (web side) and 29 (support side)
    mc = ifcjoint.check(path)
    res = mc.joints[0].capacity
    assert res.checked and res.joint_kind == "angle_cleats" and res.V_j_Rd > 0


@pytest.mark.parametrize("cls", ["IfcPlate", "IfcMember"])
def test_angles_short_of_cleats_are_parts_not_plates_or_columns(cls, tmp_path):
    # The same angles with the web-side bolts only: read as short sections, never as 90 mm
    # plates or (upright IfcMembers) as columns; not read as cleats, so the joint is
    # unsupported, saying why, never checked as an end plate.
    from ifcjoint.model.codes import Archetype, UnsupportedPart

    m = Model("IFC4")
    cleats, _ = _cleat_joint(m, with_support_bolts=False, cls=cls)
    path = tmp_path / "cleats.ifc"
    m.f.write(str(path))
    r = scan(path)
    assert sorted(mm.kind for mm in r.model.members) == ["beam", "column"]  # no cleat column
    read = {p.guid: p for p in r.model.plates}
    for c in cleats:
        assert read[c.GlobalId].shape == "IfcLShapeProfileDef"
        assert read[c.GlobalId].thickness == pytest.approx(10.0)
    (j,) = r.joints
    assert {p.role for p in j.plates} == {"other_plate"}
    assert r.anatomy[j.id].cleats is None and j.archetype == Archetype.UNSUPPORTED
    assert dict(r.anatomy[j.id].unsupported)[UnsupportedPart.SECTION_PARTS] == 2
