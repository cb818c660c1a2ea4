"""Hole diameters read from properties when the plates' holes are not modelled.

Generated models (sample_models/generate.py, ``hole_property``): each bolt carries a
``HoleDiameter`` of d + 2 = 22 mm for M20 (the normal hole of EN 1090-2 Table 11, from
memory) in a property set of its own, or of its type (IfcRelDefinesByType with the type's
HasPropertySets), in IFC2X3 and IFC4.
"""

from __future__ import annotations

import pytest


@pytest.mark.parametrize("schema", ["IFC4", "IFC2X3"])
@pytest.mark.parametrize("where", ["instance", "type"])
def test_hole_diameter_property_of_the_bolt_or_its_type(build_variant, scan_cached, schema,
                                                       where):
    path, _ = build_variant(schema=schema, hole_property=where)
    r = scan_cached(path)
    bolted = [a for a in r.anatomy.values() if a.bolts is not None and a.plate is not None]
    assert bolted
    for a in bolted:
        assert a.plate.hole_d is None  # no modelled holes
        assert a.bolts.d0 == pytest.approx(a.bolts.d + 2.0)
        assert a.bolts.d0_source == "model (hole diameter property)"
