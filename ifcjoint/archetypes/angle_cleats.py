"""Double angle web cleats: two angles either side of the beam web, nominally pinned.

Recognised from the anatomy's cleat reading (``anatomy.read.read_cleats``: two angles read
from L profiles, each with a leg on the web and one on the support, and their bolts), before
the kinds that take bolts without a plate as incomplete. Checked in shear and tying by
``engine.angle_cleats``, on a column flange or web or a primary beam's web.
"""

from __future__ import annotations

from ifcjoint.anatomy import JointAnatomy
from ifcjoint.archetypes.base import JointType, bolt_count
from ifcjoint.archetypes.builders import angle_cleat_input
from ifcjoint.engine.angle_cleats import check_angle_cleat_joint
from ifcjoint.engine.inputs import AngleCleatJointInput
from ifcjoint.engine.results import CheckResult
from ifcjoint.model.codes import Archetype, Reason, ReasonCode
from ifcjoint.model.joints import Joint


class AngleCleats(JointType):
    """Two angle cleats with bolts through the web and into the support."""

    archetype = Archetype.ANGLE_CLEATS

    def recognise(self, joint: Joint, a: JointAnatomy) -> Reason | None:
        """The cleats read whole, with bolts."""
        if a.cleats is None or a.bolts is None:
            return None
        return Reason(ReasonCode.ANGLE_CLEATS_BOLTS, {"n": bolt_count(a)})

    def engine_input(self, joint, a, members, st):
        """``builders.angle_cleat_input``."""
        return angle_cleat_input(joint, a, members, st)

    def engine(self, inp: AngleCleatJointInput) -> CheckResult:
        """``engine.angle_cleats.check_angle_cleat_joint``."""
        return check_angle_cleat_joint(inp)
