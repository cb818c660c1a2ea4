"""Joints with parts ifcjoint does not check: a haunch, an inclined column stiffener."""

from __future__ import annotations

from ifcjoint.anatomy import JointAnatomy
from ifcjoint.archetypes.base import JointType
from ifcjoint.model.codes import Archetype, Reason, ReasonCode
from ifcjoint.model.joints import Joint


class Unsupported(JointType):
    """Whatever else the joint is, it has parts the checks do not cover; not checked."""

    archetype = Archetype.UNSUPPORTED

    def recognise(self, joint: Joint, a: JointAnatomy) -> Reason | None:
        """The parts ifcjoint does not handle (the anatomy lists them)."""
        if not a.unsupported:
            return None
        return Reason(ReasonCode.UNSUPPORTED_PARTS, {"parts": a.unsupported})


class Unrecognised(JointType):
    """A joint no registered archetype recognises: not checked, with that reason."""

    archetype = Archetype.UNKNOWN

    def recognise(self, joint: Joint, a: JointAnatomy) -> Reason | None:
        """Never: it is what is left."""
        return None
