"""A fin plate beside the beam web: nominally pinned, checked in shear."""

from __future__ import annotations

from ifcjoint.anatomy import JointAnatomy
from ifcjoint.archetypes.base import JointType, bolt_count
from ifcjoint.archetypes.builders import fin_plate_input
from ifcjoint.engine.fin_plate import check_fin_plate_joint
from ifcjoint.engine.inputs import FinPlateJointInput
from ifcjoint.engine.results import CheckResult
from ifcjoint.engine.settings import CheckSettings
from ifcjoint.model.codes import Archetype, PartRole, Reason, ReasonCode
from ifcjoint.model.elements import Member
from ifcjoint.model.joints import Joint


class FinPlate(JointType):
    """A plate beside the beam web with bolts: shear only (``engine.fin_plate``)."""

    archetype = Archetype.FIN_PLATE

    def recognise(self, joint: Joint, a: JointAnatomy) -> Reason | None:
        """Fin plate with bolts."""
        if a.main_role == PartRole.FIN_PLATE and a.bolts is not None:
            return Reason(ReasonCode.FIN_PLATE_BOLTS, {"n": bolt_count(a)})
        return None

    def engine_input(
        self, joint: Joint, a: JointAnatomy, members: dict[str, Member], st: CheckSettings
    ):
        """The fin plate input (``builders.fin_plate_input``).

        On a column web too: the web itself is left unchecked, and said so.
        """
        return fin_plate_input(joint, a, members, st)

    def engine(self, inp: FinPlateJointInput) -> CheckResult:
        """``engine.fin_plate.check_fin_plate_joint``."""
        return check_fin_plate_joint(inp)
