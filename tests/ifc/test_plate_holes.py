"""Bolt holes read from a plate's body: boolean differences and profile voids."""

from __future__ import annotations

import ifcopenshell
import ifcopenshell.api.root
import ifcopenshell.api.unit
import pytest

from ifcjoint.ifc.reader import read_model


def _plate_model(tmp_path, with_void: bool):
    f = ifcopenshell.file(schema="IFC4")
    ifcopenshell.api.root.create_entity(f, ifc_class="IfcProject")
    ifcopenshell.api.unit.assign_unit(f)  # millimetres
    ctx = f.createIfcGeometricRepresentationContext(
        "Body", "Model", 3, 1e-5,
        f.createIfcAxis2Placement3D(f.createIfcCartesianPoint((0.0, 0.0, 0.0)), None, None),
        None)

    def a3(o):
        return f.createIfcAxis2Placement3D(f.createIfcCartesianPoint(o), None, None)

    pos2 = f.createIfcAxis2Placement2D(f.createIfcCartesianPoint((0.0, 0.0)), None)
    outer = f.createIfcPolyline([f.createIfcCartesianPoint(p) for p in
                                 ((-100.0, -150.0), (100.0, -150.0), (100.0, 150.0),
                                  (-100.0, 150.0), (-100.0, -150.0))])
    if with_void:
        void = f.createIfcCircle(f.createIfcAxis2Placement2D(
            f.createIfcCartesianPoint((-50.0, 80.0)), None), 11.0)
        prof = f.createIfcArbitraryProfileDefWithVoids("AREA", None, outer, [void])
    else:
        prof = f.createIfcRectangleProfileDef("AREA", None, pos2, 200.0, 300.0)
    body = f.createIfcExtrudedAreaSolid(prof, a3((0.0, 0.0, 0.0)),
                                        f.createIfcDirection((0.0, 0.0, 1.0)), 20.0)
    circ = f.createIfcCircleProfileDef("AREA", None, f.createIfcAxis2Placement2D(
        f.createIfcCartesianPoint((50.0, 80.0)), None), 13.0)
    cyl = f.createIfcExtrudedAreaSolid(circ, a3((0.0, 0.0, -5.0)),
                                       f.createIfcDirection((0.0, 0.0, 1.0)), 30.0)
    item = f.createIfcBooleanResult("DIFFERENCE", body, cyl)
    el = ifcopenshell.api.root.create_entity(f, ifc_class="IfcPlate", name="PL20")
    el.ObjectPlacement = f.createIfcLocalPlacement(None, a3((1000.0, 0.0, 0.0)))
    el.Representation = f.createIfcProductDefinitionShape(
        None, None, [f.createIfcShapeRepresentation(ctx, "Body", "CSG", [item])])
    path = tmp_path / "plate.ifc"
    f.write(str(path))
    return read_model(path)


def test_round_boolean_cut_is_a_hole_on_the_mid_plane(tmp_path):
    (p,) = _plate_model(tmp_path, with_void=False).plates
    assert p.thickness == pytest.approx(20.0)
    ((c, d),) = p.holes
    assert d == pytest.approx(26.0) and c == pytest.approx((1050.0, 80.0, 10.0))


def test_profile_void_and_boolean_cut_both_count(tmp_path):
    (p,) = _plate_model(tmp_path, with_void=True).plates
    assert sorted(round(d) for _, d in p.holes) == [22, 26]
