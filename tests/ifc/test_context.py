"""One reading context per file: nothing read from one model serves another."""

from __future__ import annotations

import ifcopenshell
import ifcopenshell.guid
import pytest

from ifcjoint.ifc.context import ReadContext
from ifcjoint.ifc.texts import ElementTexts


def _proxy(schema: str):
    f = ifcopenshell.file(schema=schema)
    if schema == "IFC2X3":
        p = f.createIfcBuildingElementProxy(
            GlobalId=ifcopenshell.guid.new(), Name="P", CompositionType="ELEMENT"
        )
    else:
        p = f.createIfcBuildingElementProxy(
            GlobalId=ifcopenshell.guid.new(), Name="P", PredefinedType="USERDEFINED"
        )
    return f, p


def test_ifc4_then_ifc2x3_read_their_own_attributes():
    # IFC4 puts PredefinedType where IFC2X3 has CompositionType (the same position): an
    # attribute index shared between the two returned the one for the other.
    f4, p4 = _proxy("IFC4")
    f2, p2 = _proxy("IFC2X3")
    c4, c2 = ReadContext(f4), ReadContext(f2)
    assert c4.att(p4, "PredefinedType") == "USERDEFINED"
    with pytest.raises((RuntimeError, AttributeError)):
        c2.att(p2, "PredefinedType")
    assert c2.att(p2, "CompositionType") == "ELEMENT"
    assert ElementTexts(c4).texts(p4)["PredefinedType"] == "USERDEFINED"
    assert "PredefinedType" not in ElementTexts(c2).texts(p2)
    # and the other way round, in a fresh pair of contexts
    c2b, c4b = ReadContext(f2), ReadContext(f4)
    assert "PredefinedType" not in ElementTexts(c2b).texts(p2)
    assert ElementTexts(c4b).texts(p4)["PredefinedType"] == "USERDEFINED"


def test_caches_belong_to_one_context():
    f4, _ = _proxy("IFC4")
    a, b = ReadContext(f4), ReadContext(f4)
    a.a2p[1] = (0.0,) * 12
    assert 1 not in b.a2p and a.placements is not b.placements
