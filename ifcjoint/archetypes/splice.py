"""Beam splices: two collinear beams meeting end to end (a splice in a span, an apex).

A splice joint (``Joint.support == "splice"``) is recognised by these types alone, never by
the beam-to-column ones (its "column" is the other beam). Two end plates bolted together are
checked by the component method without the column components (``engine.end_plate``,
``support="splice"``; EN 1993-1-8 6.2.7.2, 6.3 with Table 6.10's k5, k5, k10). Parts
missing make it incomplete; bare ends make it undetailed.
"""

from __future__ import annotations

from ifcjoint.anatomy import JointAnatomy
from ifcjoint.archetypes.base import JointType, bare_beam_end, bolt_count, end_plate_ready
from ifcjoint.archetypes.builders import end_plate_input
from ifcjoint.archetypes.incomplete import Incomplete, parts_missing
from ifcjoint.engine.end_plate import check_end_plate_joint
from ifcjoint.engine.inputs import EndPlateJointInput
from ifcjoint.engine.results import CheckResult
from ifcjoint.model.codes import Archetype, PartRole, Reason, ReasonCode
from ifcjoint.model.joints import Joint


class EndPlateSplice(JointType):
    """End plates on both beams, bolted together: a moment splice."""

    archetype = Archetype.END_PLATE_SPLICE

    def recognise(self, joint: Joint, a: JointAnatomy) -> Reason | None:
        """An end plate with bolts at a splice (the other plate: checked by the builder)."""
        if end_plate_ready(a):
            return Reason(ReasonCode.SPLICE_PLATES_BOLTS, {"n": bolt_count(a)})
        return None

    def engine_input(self, joint, a, members, st):
        """``builders.end_plate_input`` (a splice's input: both plates, no column)."""
        return end_plate_input(joint, a, members, st)

    def engine(self, inp: EndPlateJointInput) -> CheckResult:
        """``engine.end_plate.check_end_plate_joint`` (its splice mode)."""
        return check_end_plate_joint(inp)


class BareSplice(JointType):
    """Two beam ends with nothing modelled between them: the splice is not detailed."""

    archetype = Archetype.UNDETAILED

    def recognise(self, joint: Joint, a: JointAnatomy) -> Reason | None:
        """No plate and no bolts."""
        if bare_beam_end(a) or a.main_role not in (PartRole.END_PLATE, None):
            return Reason(ReasonCode.SPLICE_BARE)
        return None

    def engine_input(self, joint, a, members, st):
        """Never an engine input: the splice's parts are not in the model."""
        return parts_missing(joint)


#: The types a splice joint is tried with, in order.
SPLICE_REGISTRY: tuple[JointType, ...] = (EndPlateSplice(), Incomplete(), BareSplice())
