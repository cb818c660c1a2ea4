"""A beam welded to a column flange: no plate, no bolts, the beam end on the face."""

from __future__ import annotations

from ifcjoint.anatomy import TOUCH_TOLERANCE, JointAnatomy
from ifcjoint.archetypes.base import JointType, bare_beam_end
from ifcjoint.archetypes.builders import welded_input
from ifcjoint.engine.inputs import WeldedJointInput
from ifcjoint.engine.results import CheckResult
from ifcjoint.engine.settings import CheckSettings
from ifcjoint.engine.welded import check_welded_joint
from ifcjoint.model.codes import Archetype, Reason, ReasonCode
from ifcjoint.model.elements import Member
from ifcjoint.model.joints import Joint


class Welded(JointType):
    """A bare beam end at the column face, nothing between (standing off it: a gap finding)."""

    archetype = Archetype.WELDED

    def recognise(self, joint: Joint, a: JointAnatomy) -> Reason | None:
        """A bare beam end on the face, or short of it (not drawn into the column)."""
        if not bare_beam_end(a) or joint.gap < -TOUCH_TOLERANCE:
            return None
        if joint.gap <= TOUCH_TOLERANCE:
            return Reason(ReasonCode.ON_FACE, {"gap": joint.gap})
        return Reason(ReasonCode.SHORT_OF_FACE, {"gap": joint.gap})

    def engine_input(
        self, joint: Joint, a: JointAnatomy, members: dict[str, Member], st: CheckSettings
    ):
        """The welded engine input (``builders.welded_input``)."""
        return welded_input(joint, a, members, st)

    def engine(self, inp: WeldedJointInput) -> CheckResult:
        """``check.welded.check_welded_joint``."""
        return check_welded_joint(inp)

