"""Joints whose parts are missing from the model: incomplete, and beams drawn into columns."""

from __future__ import annotations

from ifcjoint.anatomy import TOUCH_TOLERANCE, JointAnatomy
from ifcjoint.archetypes.base import JointType, bare_beam_end, bolt_count
from ifcjoint.model.codes import (
    Archetype,
    NotChecked,
    NotCheckedCode,
    PartRole,
    Reason,
    ReasonCode,
)
from ifcjoint.model.joints import Joint


def parts_missing(joint: Joint) -> NotChecked:
    """Not checked because parts are missing, naming which (the archetype's reason)."""
    return NotChecked(NotCheckedCode.PARTS_MISSING, {"reason": joint.archetype_reason})


class Incomplete(JointType):
    """Parts missing: a plate without bolts, bolts without a plate.

    A joint whose parts are all there but stand off the column face keeps the archetype it was
    designed as; its gap is a detailing finding that fails it.
    """

    archetype = Archetype.INCOMPLETE

    def engine_input(self, joint, a, members, st):
        """Never an engine input: the reason names the missing part."""
        return parts_missing(joint)

    def recognise(self, joint: Joint, a: JointAnatomy) -> Reason | None:
        """The first missing part, in the order a detailer would look."""
        if a.main_role == PartRole.END_PLATE:
            return Reason(ReasonCode.END_PLATE_NO_BOLTS) if a.bolts is None else None
        if a.main_role == PartRole.FIN_PLATE:
            return Reason(ReasonCode.FIN_PLATE_NO_BOLTS) if a.bolts is None else None
        if a.bolts is not None:
            return Reason(ReasonCode.BOLTS_NO_PLATE, {"n": bolt_count(a)})
        return None


class Undetailed(JointType):
    """A beam drawn into the column with no plates or bolts: the connection is not modelled."""

    archetype = Archetype.UNDETAILED

    def engine_input(self, joint, a, members, st):
        """Never an engine input: the beam is drawn into the column without parts."""
        return parts_missing(joint)

    def recognise(self, joint: Joint, a: JointAnatomy) -> Reason | None:
        """A bare beam end inside the column."""
        if bare_beam_end(a) and joint.gap < -TOUCH_TOLERANCE:
            return Reason(ReasonCode.DRAWN_INTO, {"depth": -joint.gap})
        return None
