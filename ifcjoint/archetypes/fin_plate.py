"""A fin plate beside the beam web: nominally pinned; its shear check is not implemented."""

from __future__ import annotations

from ifcjoint.anatomy import JointAnatomy
from ifcjoint.archetypes.base import JointType, bolt_count
from ifcjoint.archetypes.builders import require_major_axis
from ifcjoint.engine.settings import CheckSettings
from ifcjoint.model.codes import (
    Archetype,
    NotChecked,
    NotCheckedCode,
    PartRole,
    Reason,
    ReasonCode,
)
from ifcjoint.model.elements import Member
from ifcjoint.model.joints import Joint


class FinPlate(JointType):
    """A plate beside the beam web with bolts."""

    archetype = Archetype.FIN_PLATE

    def recognise(self, joint: Joint, a: JointAnatomy) -> Reason | None:
        """Fin plate with bolts."""
        if a.main_role == PartRole.FIN_PLATE and a.bolts is not None:
            return Reason(ReasonCode.FIN_PLATE_BOLTS, {"n": bolt_count(a)})
        return None

    def engine_input(
        self, joint: Joint, a: JointAnatomy, members: dict[str, Member], st: CheckSettings
    ):
        """Not checked: a fin plate's shear check is not implemented."""
        return require_major_axis(joint) or NotChecked(NotCheckedCode.FIN_PLATE)
