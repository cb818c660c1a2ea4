"""The IDS of what a checkable model carries (ifc/requirements.py), with ifctester.

A model holding every datum meets it; one missing each datum in turn is reported with that
requirement, and only that one. The IDS file itself validates against the IDS 1.0 XML
schema that ifctester ships.
"""

from __future__ import annotations

import ifcopenshell
import ifcopenshell.api.material
import ifcopenshell.api.pset
import ifcopenshell.api.root
import ifcopenshell.guid
import pytest
from click.testing import CliRunner

from ifcjoint.cli import main
from ifcjoint.ifc.requirements import REQUIREMENTS, build_ids, missing_requirements
from tests.conftest import SAMPLES

NAMES = {r.identifier: r.name for r in REQUIREMENTS}


@pytest.mark.parametrize("schema", ["IFC2X3", "IFC4", "IFC4X3"])
def test_the_ids_is_valid_ids(schema):
    from ifctester.ids import get_schema

    doc = build_ids(schema)
    get_schema().validate(doc.to_string())  # raises on an invalid IDS
    idents = {s.identifier.split(":")[0] for s in doc.specifications}
    assert ("weld-throat" in idents) == (schema != "IFC2X3")  # no weld type in IFC2X3


def _model(drop: str = ""):
    """Elements without geometry, each carrying its datum unless ``drop`` names it."""
    f = ifcopenshell.file(schema="IFC4")
    ifcopenshell.api.root.create_entity(f, ifc_class="IfcProject", name="req")

    def el(cls, **kw):
        return ifcopenshell.api.root.create_entity(f, ifc_class=cls, **kw)

    steel = f.createIfcMaterial("S355J2")
    bolt_steel = f.createIfcMaterial("Bolt 8.8")
    beam = el("IfcBeam", name="B1")
    col = el("IfcColumn", name="C1")
    plate = el("IfcPlate", name="EP1")
    bolt = el("IfcMechanicalFastener", name="M20")
    weld = el("IfcFastener", name="W1", predefined_type="WELD")
    if drop != "section-members":
        beam.ObjectType, col.ObjectType = "IPE 400", "HEB 300"
    if drop != "grade-members":
        ifcopenshell.api.material.assign_material(f, products=[beam, col], material=steel)
    if drop != "grade-plates":
        ifcopenshell.api.material.assign_material(f, products=[plate], material=steel)
    if drop != "bolt-size":
        bolt.NominalDiameter, bolt.NominalLength = 20.0, 70.0
    if drop != "bolt-class":
        ifcopenshell.api.material.assign_material(f, products=[bolt], material=bolt_steel)
    if drop != "weld-throat":
        ps = ifcopenshell.api.pset.add_pset(f, product=weld, name="Pset_FastenerWeld")
        ifcopenshell.api.pset.edit_pset(f, pset=ps, properties={"NominalThroatThickness": 5.0})
    return f, {"members": (beam.GlobalId, col.GlobalId), "plate": plate.GlobalId,
               "bolt": bolt.GlobalId, "weld": weld.GlobalId}


def test_a_complete_model_meets_every_requirement():
    f, _ = _model()
    assert missing_requirements(f, build_ids("IFC4")) == {}


@pytest.mark.parametrize("ident", [r.identifier for r in REQUIREMENTS])
def test_each_missing_datum_is_reported_with_its_requirement(ident):
    f, ids_ = _model(drop=ident)
    miss = missing_requirements(f, build_ids("IFC4"))
    assert miss and all(v == [NAMES[ident]] for v in miss.values())
    where = {"grade-members": set(ids_["members"]), "section-members": set(ids_["members"]),
             "grade-plates": {ids_["plate"]}, "bolt-size": {ids_["bolt"]},
             "bolt-class": {ids_["bolt"]}, "weld-throat": {ids_["weld"]}}[ident]
    assert set(miss) == where


def test_the_demo_joints_are_told_what_they_miss(tmp_path):
    # the demo names its bolts' class in their names only, and its welds' size in theirs:
    # the IDS asks for the class in the material and the throat in Pset_FastenerWeld
    out = tmp_path / "k.ids"
    r = CliRunner().invoke(main, ["requirements", str(SAMPLES / "kestrel-workshop-ifc4-mm.ifc"),
                                  "-o", str(out)])
    assert r.exit_code == 1, r.output
    assert out.read_text().startswith("<ids")
    assert "misses bolt property class" in r.output and "misses weld throat" in r.output
    assert "joints miss a requirement" in r.output
    lone = CliRunner().invoke(main, ["requirements", "--schema", "IFC2X3", "-o",
                                     str(tmp_path / "x.ids")])
    assert lone.exit_code == 0 and "specifications (IFC2X3)" in lone.output


def test_the_reader_takes_the_throat_where_the_ids_asks_for_it(tmp_path):
    # a weld fastener whose throat is only in Pset_FastenerWeld.NominalThroatThickness
    from ifcjoint.pipeline import scan
    from tests.ifc.test_other_conventions import Model

    m = Model("IFC4")
    f = m.f
    prof = f.createIfcRectangleProfileDef("AREA", None, f.createIfcAxis2Placement2D(
        f.createIfcCartesianPoint([0.0, 0.0]), None), 5.0, 5.0)
    weld = m.el("IfcFastener", "W", m.place((0, 0, 0)),
                m.rep([m.extrude(prof, m.a2p((0, 0, 0)), (0, 0, 1.0), 200.0)]),
                PredefinedType="WELD")
    prop = f.createIfcPropertySingleValue(
        "NominalThroatThickness", None, f.create_entity("IfcPositiveLengthMeasure", 6.0), None)
    ps = f.create_entity("IfcPropertySet", GlobalId=ifcopenshell.guid.new(),
                         Name="Pset_FastenerWeld", HasProperties=[prop])
    f.create_entity("IfcRelDefinesByProperties", GlobalId=ifcopenshell.guid.new(),
                    RelatedObjects=[weld], RelatingPropertyDefinition=ps)
    col = m.el("IfcColumn", "C", m.place((1000.0, 0, 0)),
               m.rep([m.extrude(m.ishape("HEB300", 300, 300, 11, 19, 27), m.a2p((0, 0, 0)),
                                (0, 0, 1.0), 3000.0)]))
    st = f.create_entity("IfcBuildingStorey", GlobalId=ifcopenshell.guid.new(), Name="L1",
                         ObjectPlacement=m.place((0, 0, 0)))
    f.create_entity("IfcRelContainedInSpatialStructure", GlobalId=ifcopenshell.guid.new(),
                    RelatedElements=[weld, col], RelatingStructure=st)
    path = tmp_path / "w.ifc"
    f.write(str(path))
    (w,) = [x for x in scan(path).model.fasteners if x.guid == weld.GlobalId]
    assert w.weld_throat == pytest.approx(6.0)


def test_a_joint_unreadable_for_lack_of_a_grade_names_the_requirement(tmp_path):
    """The reason of an unreadable joint is the IDS requirement `requirements` finds missed."""
    import json

    f = ifcopenshell.open(str(SAMPLES / "kestrel-workshop-ifc4-mm.ifc"))
    for rel in f.by_type("IfcRelAssociatesMaterial"):
        f.remove(rel)  # no grade anywhere: the demo's names carry none
    model = tmp_path / "no-grades.ifc"
    f.write(str(model))
    out = tmp_path / "r.json"
    r = CliRunner().invoke(main, ["check", str(model), "--json", str(out), "--fail-on", "never",
                                  "-q"])
    assert r.exit_code == 0, r.output
    joints = json.loads(out.read_text())["joints"]
    bad = [j for j in joints if j["check"]["status"] == "unreadable"]
    assert bad
    for j in bad:
        assert j["check"]["data_requirements"] == ["grade-members"]
        assert "[IDS grade-members]" in j["check"]["status_reason"]
        unchecked = [p for p in j["check"]["problems"] if p["kind"] == "unchecked"]
        assert "grade-members" in unchecked[0]["description"]
    # and the validation of the model against the IDS finds the same requirement missed
    req = CliRunner().invoke(main, ["requirements", str(model)])
    assert req.exit_code == 1 and f"misses {NAMES['grade-members']}" in req.output
