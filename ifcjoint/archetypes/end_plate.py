"""Bolted end plates on a column flange: extended, flush, and one whose extent is not known."""

from __future__ import annotations

from ifcjoint.anatomy import JointAnatomy
from ifcjoint.archetypes.base import JointType, bolt_count, end_plate_ready
from ifcjoint.archetypes.builders import end_plate_input, header_plate_input
from ifcjoint.engine.end_plate import check_end_plate_joint
from ifcjoint.engine.header_plate import check_header_plate_joint
from ifcjoint.engine.inputs import EndPlateJointInput, HeaderPlateJointInput
from ifcjoint.engine.results import CheckResult
from ifcjoint.engine.settings import CheckSettings
from ifcjoint.model.codes import (
    Archetype,
    Note,
    NoteCode,
    Reason,
    ReasonCode,
)
from ifcjoint.model.elements import Member
from ifcjoint.model.joints import Joint


def _rows_outside(a: JointAnatomy) -> list:
    h = a.beam_section.h
    return [r for r in a.bolts.rows if r.from_beam_top < 0 or r.from_beam_top > h]


class _CheckedEndPlate(JointType):
    """An end plate checked by the component method (EN 1993-1-8 6.2.7, 6.3)."""

    def engine_input(
        self, joint: Joint, a: JointAnatomy, members: dict[str, Member], st: CheckSettings
    ):
        """The end-plate engine input (``builders.end_plate_input``)."""
        return end_plate_input(joint, a, members, st)

    def engine(self, inp: EndPlateJointInput) -> CheckResult:
        """``check.end_plate.check_end_plate_joint``."""
        return check_end_plate_joint(inp)


    def capacity_notes(self, joint: Joint) -> tuple[Note, ...]:
        """Beta = 1 until the demands give both sides' moments."""
        if joint.partner is None:
            return (Note(NoteCode.BETA_ONE_SINGLE_SIDED),)
        return (Note(NoteCode.BETA_ONE_UNTIL_DEMANDS),)


#: A plate edge this far inside a flange's outer face leaves that flange off the plate
#: (common practice, no source: a plate welded to a flange covers it).
FLANGE_COVER_TOLERANCE = 2.0


class PartialDepthEndPlate(JointType):
    """An end plate that does not reach a beam flange: a header plate, nominally pinned.

    Tried before the moment end plates: its flanges are not welded to the plate, so the
    component method of a moment end plate does not apply: it is checked in shear only
    (``engine.header_plate``), never as a moment joint.
    """

    archetype = Archetype.PARTIAL_DEPTH_END_PLATE

    def recognise(self, joint: Joint, a: JointAnatomy) -> Reason | None:
        """An end plate that leaves a flange off.

        Its top edge below the top flange, or its bottom edge above the bottom flange
        (beyond ``FLANGE_COVER_TOLERANCE``).
        """
        if not end_plate_ready(a) or a.beam_section is None or a.plate is None:
            return None
        sec, p = a.beam_section, a.plate
        top = p.top_from_beam_top
        bottom = sec.h - p.bottom_from_beam_top
        if top <= sec.tf - FLANGE_COVER_TOLERANCE and bottom <= sec.tf - FLANGE_COVER_TOLERANCE:
            return None
        return Reason(ReasonCode.PLATE_SHORT_OF_FLANGE, {"top": top, "bottom": bottom})

    def engine_input(self, joint, a, members, st):
        """The header plate input (``builders.header_plate_input``)."""
        return header_plate_input(joint, a, members, st)

    def engine(self, inp: HeaderPlateJointInput) -> CheckResult:
        """``engine.header_plate.check_header_plate_joint``."""
        return check_header_plate_joint(inp)


class ExtendedEndPlate(_CheckedEndPlate):
    """An end plate with bolt rows above (or below) the beam's depth."""

    archetype = Archetype.EXTENDED_END_PLATE

    def recognise(self, joint: Joint, a: JointAnatomy) -> Reason | None:
        """Bolt rows outside the beam depth."""
        if not end_plate_ready(a) or a.beam_section is None:
            return None
        outside = _rows_outside(a)
        if not outside:
            return None
        where = sorted({"above" if r.from_beam_top < 0 else "below" for r in outside})
        return Reason(ReasonCode.ROWS_OUTSIDE, {"n": len(outside), "where": tuple(where)})


class FlushEndPlate(_CheckedEndPlate):
    """An end plate with every bolt row within the beam's depth."""

    archetype = Archetype.FLUSH_END_PLATE

    def recognise(self, joint: Joint, a: JointAnatomy) -> Reason | None:
        """Every bolt row within the beam depth."""
        if not end_plate_ready(a) or a.beam_section is None or _rows_outside(a):
            return None
        return Reason(ReasonCode.ROWS_WITHIN, {"n": len(a.bolts.rows)})


class EndPlateUnjudged(JointType):
    """An end plate with bolts on a beam whose depth is unknown: its extent cannot be judged."""

    archetype = Archetype.END_PLATE

    def recognise(self, joint: Joint, a: JointAnatomy) -> Reason | None:
        """End plate and bolts, but no beam section."""
        if end_plate_ready(a) and a.beam_section is None:
            return Reason(ReasonCode.DEPTH_UNKNOWN)
        return None


class HaunchedEndPlate(_CheckedEndPlate):
    """An end plate running down a haunch welded under the beam (EN 1993-1-8 6.2.6.7).

    Tried before the other end plates: its rows below the beam are inside the haunched
    section, not an extension. A haunch that could not be read whole leaves the joint
    unsupported (``archetypes.unsupported``); one outside 6.2.6.7(2) is not checked, said.
    """

    archetype = Archetype.HAUNCHED_END_PLATE

    def recognise(self, joint: Joint, a: JointAnatomy) -> Reason | None:
        """An end plate with bolts and a haunch read whole."""
        if a.haunch is None or not end_plate_ready(a):
            return None
        return Reason(ReasonCode.HAUNCH_END_PLATE, {"n": bolt_count(a), "d": a.haunch.d})
