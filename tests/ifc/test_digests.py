"""Element digests (ifc/digests.py): they change exactly when what an element's read
depends on changes, whatever the entity numbers.

Each test edits a small model the way a modeller's next issue would, and compares every
element's digest before and after: the edited elements differ, every other is equal.
"""

from __future__ import annotations

import ifcopenshell
import ifcopenshell.api.aggregate
import ifcopenshell.api.context
import ifcopenshell.api.feature
import ifcopenshell.api.geometry
import ifcopenshell.api.material
import ifcopenshell.api.pset
import ifcopenshell.api.root
import ifcopenshell.api.spatial
import ifcopenshell.api.type
import ifcopenshell.api.unit
import numpy as np

from ifcjoint.ifc.digests import _parse_lines, _parse_records, element_digests


def _model(schema: str = "IFC4"):
    """Two storeys; beams B1, B2 (S355, typed T1 with its own material), plate P1 with a pset."""
    f = ifcopenshell.file(schema=schema)
    root = ifcopenshell.api.root.create_entity
    project = root(f, ifc_class="IfcProject", name="digest test")
    ifcopenshell.api.unit.assign_unit(f)
    ctx = ifcopenshell.api.context.add_context(f, context_type="Model")
    body = ifcopenshell.api.context.add_context(f, context_type="Model", context_identifier="Body",
                                                target_view="MODEL_VIEW", parent=ctx)
    site = root(f, ifc_class="IfcSite", name="site")
    ifcopenshell.api.aggregate.assign_object(f, products=[site], relating_object=project)
    storeys = []
    for k in range(2):
        s = root(f, ifc_class="IfcBuildingStorey", name=f"L{k}")
        ifcopenshell.api.geometry.edit_object_placement(f, product=s)
        ifcopenshell.api.aggregate.assign_object(f, products=[s], relating_object=site)
        storeys.append(s)
    steel = f.createIfcMaterial("S355")
    other = f.createIfcMaterial("S275")
    typ = root(f, ifc_class="IfcBeamType", name="T1")
    ifcopenshell.api.material.assign_material(f, products=[typ], material=other)
    els = {}
    for name, cls, storey in (("B1", "IfcBeam", 0), ("B2", "IfcBeam", 0), ("B3", "IfcBeam", 1),
                              ("P1", "IfcPlate", 0)):
        e = root(f, ifc_class=cls, name=name)
        ifcopenshell.api.geometry.edit_object_placement(f, product=e)
        rep = ifcopenshell.api.geometry.add_wall_representation(
            f, context=body, length=2.0, height=0.3, thickness=0.02)
        ifcopenshell.api.geometry.assign_representation(f, product=e, representation=rep)
        ifcopenshell.api.spatial.assign_container(f, products=[e],
                                                  relating_structure=storeys[storey])
        els[name] = e
    ifcopenshell.api.material.assign_material(f, products=[els["B1"], els["B2"], els["B3"]],
                                              material=steel)
    ifcopenshell.api.type.assign_type(f, related_objects=[els["B2"]], relating_type=typ)
    ps = ifcopenshell.api.pset.add_pset(f, product=els["P1"], name="ifcjoint_TestSet")
    ifcopenshell.api.pset.edit_pset(f, pset=ps, properties={"Mark": "EP-1; first"})
    return f, els


def _digests(f) -> dict[str, str]:
    """Every element's digest by its name, from the file's text as written."""
    text = f.to_string()
    g = ifcopenshell.file.from_string(text)
    els = [e for e in g.by_type("IfcElement")]
    d = element_digests(text.encode(), g, [e.id() for e in els])
    assert d is not None
    return {e.Name: d[e.id()] for e in els}


def _changed(before: dict, after: dict) -> set[str]:
    return {k for k in before if before[k] != after.get(k)}


def test_renumbered_entities_and_a_new_owner_history_change_nothing():
    f, _ = _model()
    before = _digests(f)
    g = ifcopenshell.file(schema=f.schema)
    for e in reversed(list(f)):  # every entity again, numbered in another order
        g.add(e)
    assert _digests(g) == before
    person, org = f.createIfcPerson(FamilyName="Modeller"), f.createIfcOrganization(Name="Co")
    user = f.createIfcPersonAndOrganization(person, org)
    app = f.createIfcApplication(org, "1", "exporter", "exp")
    history = f.createIfcOwnerHistory(user, app, None, "ADDED", None, None, None, 1000)
    for e in f.by_type("IfcRoot"):
        e.OwnerHistory = history
    before = _digests(f)
    history.CreationDate = 2000  # a re-export stamps its date
    assert _digests(f) == before


def test_a_thicker_plate_changes_the_plate_only():
    f, els = _model()
    before = _digests(f)
    solid = els["P1"].Representation.Representations[0].Items[0]
    solid.Depth = solid.Depth * 1.25
    assert _changed(before, _digests(f)) == {"P1"}


def test_a_property_of_one_element_changes_that_element_only():
    f, els = _model()
    before = _digests(f)
    pset = next(r.RelatingPropertyDefinition for r in els["P1"].IsDefinedBy)
    ifcopenshell.api.pset.edit_pset(f, pset=pset, properties={"Mark": "EP-1; second"})
    assert _changed(before, _digests(f)) == {"P1"}


def test_a_shared_material_or_a_type_material_changes_the_elements_using_it():
    f, _ = _model()
    before = _digests(f)
    f.by_type("IfcMaterial")[0].Name = "S460"  # the beams' material
    assert _changed(before, _digests(f)) == {"B1", "B2", "B3"}
    before = _digests(f)
    next(m for m in f.by_type("IfcMaterial") if m.Name == "S275").Name = "S235"  # the type's
    assert _changed(before, _digests(f)) == {"B2"}


def test_moving_a_storey_changes_its_elements_only():
    f, els = _model()
    before = _digests(f)
    storey = next(s for s in f.by_type("IfcBuildingStorey") if s.Name == "L1")
    storey.ObjectPlacement.RelativePlacement.Location.Coordinates = (0.0, 0.0, 3.5)
    assert _changed(before, _digests(f)) == {"B3"}


def test_a_new_hole_changes_the_plate():
    f, els = _model()
    before = _digests(f)
    opening = ifcopenshell.api.root.create_entity(f, ifc_class="IfcOpeningElement", name="hole")
    ifcopenshell.api.feature.add_feature(f, feature=opening, element=els["P1"])
    after = _digests(f)
    assert _changed(before, after) == {"P1"}


def test_material_properties_are_part_of_the_material():
    f, _ = _model()
    steel = next(m for m in f.by_type("IfcMaterial") if m.Name == "S355")
    props = f.createIfcMaterialProperties("Grade", None, [f.createIfcPropertySingleValue(
        "Grade", None, f.createIfcLabel("S355J2"), None)], steel)
    before = _digests(f)
    props.Properties[0].NominalValue = f.createIfcLabel("S355J0")
    assert _changed(before, _digests(f)) == {"B1", "B2", "B3"}


def test_strings_with_semicolons_and_quotes_are_read_whole():
    f, els = _model()
    els["B1"].Description = "it''s; a test; with #12 in it"
    before = _digests(f)
    els["B1"].Description = "it''s; a test; with #12 in it!"  # after the semicolons
    assert _changed(before, _digests(f)) == {"B1"}


def test_text_not_read_with_certainty_gives_no_digests():
    f, _ = _model()
    text = f.to_string()
    g = ifcopenshell.file.from_string(text)
    ids = [e.id() for e in g.by_type("IfcElement")]
    dropped = "\n".join(x for x in text.split("\n") if "IFCDIRECTION" not in x)
    assert dropped != text  # the text lacks instances ifcopenshell read
    assert element_digests(dropped.encode(), g, ids) is None


def test_comments_are_left_out_and_strings_kept_whole():
    f, els = _model()
    els["B1"].Description = "see /* not a comment */ here"
    text = f.to_string()
    g = ifcopenshell.file.from_string(text)
    ids = [e.id() for e in g.by_type("IfcElement")]
    plain = element_digests(text.encode(), g, ids)
    noted = text.replace("\nDATA;\n", "\nDATA;\n/* a comment; #1=IFCX(); */\n")
    noted = noted.replace(");\n", "); /* trailing; */\n", 3)
    assert element_digests(noted.encode(), g, ids) == plain
    els["B1"].Description = "see /* not a comment, changed */ here"  # inside the string
    g2 = ifcopenshell.file.from_string(f.to_string())
    changed = element_digests(f.to_string().encode(), g2, ids)
    b1 = next(e.id() for e in g.by_type("IfcElement") if e.Name == "B1")
    assert changed[b1] != plain[b1]
    assert {k: v for k, v in changed.items() if k != b1} == {
        k: v for k, v in plain.items() if k != b1}


def test_a_part_changes_with_its_assemblys_storey():
    """A part takes its assembly's storey (ifc/relations.storey_names)."""
    f, els = _model()
    asm = ifcopenshell.api.root.create_entity(f, ifc_class="IfcElementAssembly", name="A1")
    l0, l1 = sorted(f.by_type("IfcBuildingStorey"), key=lambda s: s.Name)
    ifcopenshell.api.spatial.assign_container(f, products=[asm], relating_structure=l0)
    part = ifcopenshell.api.root.create_entity(f, ifc_class="IfcPlate", name="P2")
    ifcopenshell.api.aggregate.assign_object(f, products=[part], relating_object=asm)
    before = _digests(f)
    ifcopenshell.api.spatial.assign_container(f, products=[asm], relating_structure=l1)
    assert _changed(before, _digests(f)) == {"A1", "P2"}


def test_both_parses_read_the_same_graph_and_wrapped_records_are_digested():
    """One instance a line (the numpy parse) or records over lines (the careful parse)."""
    f, els = _model()
    text = f.to_string()
    data = text[text.index("\nDATA;") + 6:text.rindex("ENDSEC;")].encode()
    fast, careful = _parse_lines(data), _parse_records(data)
    assert fast is not None and careful is not None
    for name in ("ids", "tmpl", "parent", "child_ids", "position"):
        assert np.array_equal(getattr(fast, name), getattr(careful, name)), name
    wrapped = text.replace(",", ",\n  ", 40)  # records over lines, as some exporters write
    assert _parse_lines(wrapped[wrapped.index("\nDATA;") + 6:].encode()) is None
    g = ifcopenshell.file.from_string(text)
    ids = [e.id() for e in g.by_type("IfcElement")]
    before = element_digests(wrapped.encode(), g, ids)
    assert before is not None
    joined = text.replace(");\n#", "); #", 30)  # several records on a line
    assert element_digests(joined.encode(), g, ids) == element_digests(text.encode(), g, ids)
    els["P1"].Name = "P1b"
    edited = f.to_string()
    g2 = ifcopenshell.file.from_string(edited)
    after = element_digests(edited.replace(",", ",\n  ", 40).encode(), g2, ids)
    p1 = next(e.id() for e in g.by_type("IfcElement") if e.Name == "P1")
    assert {k for k in ids if after[k] != before[k]} == {p1}


def test_a_reference_cycle_gives_no_digests():
    f, _ = _model()
    text = f.to_string()
    g = ifcopenshell.file.from_string(text)
    a = g.by_type("IfcCartesianPoint")[0].id()
    placement = next(p for p in g.by_type("IfcAxis2Placement3D") if p.Location.id() == a)
    # the point names the placement that names it: no level can be given
    point = f"#{a}=IFCCARTESIANPOINT(("
    looped = text.replace(point, f"{point}#{placement.id()},")
    assert looped != text
    ids = [e.id() for e in g.by_type("IfcElement")]
    assert element_digests(looped.encode(), g, ids) is None
