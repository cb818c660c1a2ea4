"""Joints whose parts are missing from the model: incomplete, and beams drawn into columns."""

from __future__ import annotations

from ifcjoint.anatomy import TOUCH_TOLERANCE, JointAnatomy
from ifcjoint.archetypes.base import JointType, bare_beam_end, bolt_count
from ifcjoint.model.codes import Archetype, PartRole, Reason, ReasonCode
from ifcjoint.model.joints import Joint


class Incomplete(JointType):
    """A plate without bolts, bolts without a plate, a plate off the face, a gap unbridged."""

    archetype = Archetype.INCOMPLETE

    def recognise(self, joint: Joint, a: JointAnatomy) -> Reason | None:
        """The first missing part, in the order a detailer would look."""
        if a.main_role == PartRole.END_PLATE:
            if a.bolts is None:
                return Reason(ReasonCode.END_PLATE_NO_BOLTS)
            if a.plate is not None and a.plate.gap_to_column > TOUCH_TOLERANCE:
                return Reason(ReasonCode.PLATE_OFF_FACE, {"gap": a.plate.gap_to_column})
            return None
        if a.main_role == PartRole.FIN_PLATE:
            return Reason(ReasonCode.FIN_PLATE_NO_BOLTS) if a.bolts is None else None
        if a.bolts is not None:
            return Reason(ReasonCode.BOLTS_NO_PLATE, {"n": bolt_count(a)})
        if joint.gap > TOUCH_TOLERANCE:
            return Reason(ReasonCode.STOPS_SHORT, {"gap": joint.gap})
        return None


class Undetailed(JointType):
    """A beam drawn into the column with no plates or bolts: the connection is not modelled."""

    archetype = Archetype.UNDETAILED

    def recognise(self, joint: Joint, a: JointAnatomy) -> Reason | None:
        """A bare beam end inside the column."""
        if bare_beam_end(a) and joint.gap < -TOUCH_TOLERANCE:
            return Reason(ReasonCode.DRAWN_INTO, {"depth": -joint.gap})
        return None
