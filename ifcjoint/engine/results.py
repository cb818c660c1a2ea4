"""Result objects of a scan: one object for the whole model, rendered by every output."""

from __future__ import annotations

from dataclasses import dataclass, field

from ifcjoint.engine.model import ModelContents, Unreadable, Vec3

#: Kinds of beam ends that are not beam-to-column joints.
OTHER_END_KINDS = (
    "beam_to_beam",  # ends on the side of another beam (secondary beam, knee, apex)
    "splice",  # meets the end of a collinear beam
    "column_cap",  # sits on top of a column rather than against its side
    "column_base",  # lands at the foot of a column
    "haunch",  # a short member under another beam's end at the same column face
    "free_end",  # touches no member within the tolerance (cantilever, wall bearing...)
)


@dataclass(frozen=True, slots=True, kw_only=True)
class PartLink:
    """Why a plate or fastener was attached to a joint."""

    guid: str
    source: str  # realizing | assembly | connects | geometry
    role: str  # end_plate | fin_plate | column_plate | other_plate | bolt | weld | other_fastener


@dataclass(frozen=True, slots=True, kw_only=True)
class Joint:
    """A beam end framing into the side of a column.

    Attributes:
        id: stable id from the beam GlobalId and the end (survives re-export).
        label: readable position: storey and grid cell, else storey and coordinates.
        beam: beam GlobalId.
        beam_end: ``start`` or ``end`` of the beam's centreline.
        column: column GlobalId.
        axis: ``major`` (beam meets a column flange) or ``minor`` (meets the web).
        face: ``flange`` or ``web``.
        side: ``+`` or ``-``: which face of the column (sign along its depth or width direction).
        point: the point of the column face the beam centreline meets, mm.
        gap: distance from the beam end to the column face along the beam, mm
            (positive: the beam stops short; negative: it runs into the column).
        partner: id of the joint of the beam on the opposite face at the same level, or None.
        archetype: first guess (``end_plate``, ``welded``, ``fin_plate``, ``incomplete``,
            ``unknown``), refined by the anatomy step.
        archetype_reason: why, in words.
        plates: plates attached, with the reason.
        bolts: fasteners attached (bolts, welds, others: see each link's role), with the reason.
        findings: detailing findings (filled by the anatomy/detailing step).
    """

    id: str
    label: str
    beam: str
    beam_end: str
    column: str
    axis: str
    face: str
    side: str
    point: Vec3
    gap: float
    partner: str | None
    archetype: str
    archetype_reason: str
    plates: tuple[PartLink, ...] = ()
    bolts: tuple[PartLink, ...] = ()
    findings: tuple[dict, ...] = ()
    storey: str = ""
    haunch_members: tuple[str, ...] = ()  # short members under the beam end read as a haunch


@dataclass(frozen=True, slots=True, kw_only=True)
class OtherBeamEnd:
    """A beam end that is not a beam-to-column joint, and what it is instead."""

    beam: str
    beam_end: str
    kind: str
    other: str | None
    point: Vec3
    label: str = ""


@dataclass(frozen=True, slots=True, kw_only=True)
class ScanResult:
    """Everything one scan found, for every renderer."""

    model: ModelContents
    joints: tuple[Joint, ...]
    other_beam_ends: tuple[OtherBeamEnd, ...]
    settings: dict = field(default_factory=dict)
    anatomy: dict = field(default_factory=dict)  # joint id -> JointAnatomy

    @property
    def unreadable(self) -> tuple[Unreadable, ...]:
        """Elements the reader skipped, with reasons."""
        return self.model.unreadable
