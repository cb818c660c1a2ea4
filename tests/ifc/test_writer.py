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
