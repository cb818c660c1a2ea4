"""The property-set writer alone: typed values with units, a new file, schema-aware types."""

from __future__ import annotations

import ifcopenshell
import ifcopenshell.util.element
import ifcopenshell.validate
import pytest

from ifcjoint.errors import UsageError
from ifcjoint.ifc.writer import PsetRequest, write_property_sets
from tests.conftest import SAMPLES


def _request(beam: str) -> PsetRequest:
    return PsetRequest(
        guid=beam,
        name="ifcjoint_Test",
        key=f"{beam}/test",
        values=(
            ("Note", "IfcLabel", "a label", None),
            ("Moment", "IfcTorqueMeasure", 12.5, "moment"),
            ("When", "IfcDateTime", "2026-12-01T09:00:00+00:00", None),
            ("Empty", "IfcLabel", None, None),
        ),
    )


@pytest.mark.parametrize("model", ["kestrel-workshop-ifc4-mm", "kestrel-workshop-ifc2x3-mm"])
def test_requested_sets_are_written_typed_and_valid(tmp_path, model):
    src = ifcopenshell.open(str(SAMPLES / f"{model}.ifc"))
    beam = src.by_type("IfcBeam")[0].GlobalId
    out = tmp_path / "out.ifc"
    requests = [_request(beam), _request("0" * 22)]
    counts = write_property_sets(SAMPLES / f"{model}.ifc", out, requests)
    assert counts == {"beams": 1, "assemblies": 0, "missing": 1}
    f = ifcopenshell.open(str(out))
    pset = ifcopenshell.util.element.get_psets(f.by_guid(beam))["ifcjoint_Test"]
    assert pset["Note"] == "a label" and pset["Moment"] == pytest.approx(12.5)
    assert "Empty" not in pset  # empty values are left out, never written as ''
    ps = next(p for p in f.by_type("IfcPropertySet") if p.Name == "ifcjoint_Test")
    kinds = {p.Name: p.NominalValue.is_a() for p in ps.HasProperties}
    # IFC2X3 has no IfcDateTime: the date goes as a label there (the schema's own types)
    assert kinds["When"] == ("IfcLabel" if "2x3" in model else "IfcDateTime")
    log = ifcopenshell.validate.json_logger()
    ifcopenshell.validate.validate(f, log)
    assert log.statements == []


def test_writing_over_the_input_needs_in_place(tmp_path):
    copy = tmp_path / "m.ifc"
    copy.write_bytes((SAMPLES / "kestrel-workshop-ifc4-mm.ifc").read_bytes())
    with pytest.raises(UsageError, match="input model"):
        write_property_sets(copy, copy, [])
    assert write_property_sets(copy, copy, [], in_place=True)["beams"] == 0


def test_text_and_numbers_as_iso_10303_21_writes_them():
    # ISO 10303-21: apostrophes doubled, backslashes doubled, characters beyond ASCII as
    # \X2\hhhh\X0\; a REAL always has a decimal point.
    from ifcjoint.ifc.writer import step_real, step_string

    assert step_string("it's") == "'it''s'"
    assert step_string("a\\b") == "'a\\\\b'"
    assert step_string("Träger") == "'Tr\\X2\\00E4\\X0\\ger'"
    assert [step_real(x) for x in (1.0, 0.125, 1e-7, 2.5e20)] == ["1.0", "0.125", "1.E-7",
                                                                  "2.5E20"]
    with pytest.raises(ValueError):
        step_real(float("inf"))


def test_names_beyond_ascii_survive_the_copy(tmp_path):
    # A label with an apostrophe and an umlaut goes into the copy and reads back unchanged.
    src = ifcopenshell.open(str(SAMPLES / "kestrel-workshop-ifc4-mm.ifc"))
    beam = src.by_type("IfcBeam")[0].GlobalId
    req = PsetRequest(guid=beam, name="ifcjoint_Test", key=f"{beam}/t",
                      values=(("Label", "IfcLabel", "Träger's end, 2/B", None),
                              ("Count", "IfcInteger", 3, None)))
    out = tmp_path / "o.ifc"
    write_property_sets(SAMPLES / "kestrel-workshop-ifc4-mm.ifc", out, [req])
    f = ifcopenshell.open(str(out))
    ps = ifcopenshell.util.element.get_psets(f.by_guid(beam))["ifcjoint_Test"]
    assert ps["Label"] == "Träger's end, 2/B" and ps["Count"] == 3
