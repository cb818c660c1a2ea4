"""The model's length unit, converted once to millimetres.

A model with no unit assignment is refused, unless the user states the unit; it is never
silently assumed.
"""

from __future__ import annotations

import ifcopenshell
import ifcopenshell.util.unit

from ifcjoint.errors import ModelError

#: Length units a user may state for a model that declares none (name -> mm per unit).
LENGTH_UNITS = {"mm": 1.0, "cm": 10.0, "m": 1000.0, "in": 25.4, "ft": 304.8}


def length_scale_to_mm(f: ifcopenshell.file, path: str, assume: str | None) -> tuple[float, str]:
    """Millimetres per model length unit, from the project's unit assignment.

    Args:
        f: the model.
        path: file path for messages.
        assume: a unit name from :data:`LENGTH_UNITS` to use when the model declares none.

    Raises:
        ModelError: the model declares no length unit and none was assumed.
    """
    declared = False
    for proj in f.by_type("IfcProject"):
        ua = proj.UnitsInContext
        if ua is not None and any(
            getattr(u, "UnitType", None) == "LENGTHUNIT" for u in ua.Units or ()
        ):
            declared = True
    if declared:
        return ifcopenshell.util.unit.calculate_unit_scale(f) * 1000.0, "model"
    if assume:
        return LENGTH_UNITS[assume], "assumed"
    raise ModelError(
        path,
        "the model declares no length unit (IfcProject.UnitsInContext has no LENGTHUNIT)",
        "a unit assignment; or state the unit with --length-unit mm|cm|m|in|ft",
    )
