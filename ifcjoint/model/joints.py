"""What a scan finds: joints, their parts and findings, the other beam ends (no IFC)."""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass, field
from typing import Any, Literal

from ifcjoint.model.codes import (
    Archetype,
    Axis,
    EndKind,
    Face,
    FindingCode,
    LinkSource,
    PartRole,
    Reason,
    ReasonCode,
    Severity,
    Support,
)
from ifcjoint.model.elements import ModelContents, Unreadable, Vec3

BeamEnd = Literal["start", "end"]


@dataclass(frozen=True, slots=True, kw_only=True)
class PartLink:
    """Why a plate or fastener was attached to a joint, and what it does there."""

    guid: str
    source: LinkSource
    role: PartRole


@dataclass(frozen=True, slots=True, kw_only=True)
class Finding:
    """One detailing or data finding.

    Attributes:
        code: what was found (stable identifier).
        severity: error (a shop could not make it or a checker would reject it), warning
            (doubtful, look at it) or info.
        basis: the clause or rule the finding follows (a citation, as the rule table gives it).
        measured: the value found (mm unless the code says otherwise), or None.
        limit: the limit it was compared with, or None.
        elements: GlobalIds involved.
        detail: the values a renderer needs to put the finding into words (which edge, which
            rows, the bolt size ...).
        fails_joint: the rule is one the resistance model depends on, or the part cannot be
            made as modelled: the joint cannot pass while it is broken.
        source: (code, clause) the rule follows, e.g. ``("EN 1993-1-8", "Table 3.3")``; empty
            for common practice.
        ratio: how far the value is beyond its limit, as a utilisation (limit / measured for a
            minimum, measured / limit for a maximum; above 1 when broken), or None.
    """

    code: FindingCode
    severity: Severity
    basis: str
    measured: float | None = None
    limit: float | None = None
    elements: tuple[str, ...] = ()
    detail: dict[str, Any] = field(default_factory=dict)
    fails_joint: bool = False
    source: tuple[str, str] | tuple[()] = ()
    ratio: float | None = None


NOT_DECIDED = Reason(ReasonCode.NOT_DECIDED)


@dataclass(frozen=True, slots=True, kw_only=True)
class Joint:
    """A beam end framing into the side of a column.

    Attributes:
        id: stable id from the beam GlobalId and the end (survives re-export).
        label: readable position: storey and grid cell, else storey and coordinates.
        beam: beam GlobalId.
        beam_end: start or end of the beam's centreline.
        column: column GlobalId.
        axis: major (beam meets a column flange) or minor (meets the web).
        face: flange or web.
        side: ``+`` or ``-``: which face of the column (sign along its depth or width direction).
        point: the point of the column face the beam centreline meets, mm.
        gap: distance from the beam end to the column face along the beam, mm
            (positive: the beam stops short; negative: it runs into the column).
        partner: id of the joint of the beam on the opposite face at the same level, or None.
        archetype: decided once, from the joint's anatomy (``ifcjoint.archetypes``); UNKNOWN
            straight from the finder.
        archetype_reason: why, as a code with its values.
        plates: plates attached, with the reason.
        fasteners: fasteners attached (bolts, welds, others: see each link's role).
        findings: detailing findings (filled by the anatomy step).
        storey: the storey of the beam.
        haunch_members: short members under the beam end read as a haunch.
        support: what ``column`` is: a column, or the primary beam of a beam-to-beam joint
            (the secondary beam framing square into its web; axis minor, face web), or the
            other beam of a splice (collinear, end to end; face ``end``).
        other_end: for a splice, the end of the other beam that meets this one.
    """

    id: str
    label: str
    beam: str
    beam_end: BeamEnd
    column: str
    axis: Axis
    face: Face
    side: Literal["+", "-"]
    point: Vec3
    gap: float
    partner: str | None
    archetype: Archetype = Archetype.UNKNOWN
    archetype_reason: Reason = NOT_DECIDED
    plates: tuple[PartLink, ...] = ()
    fasteners: tuple[PartLink, ...] = ()
    findings: tuple[Finding, ...] = ()
    storey: str = ""
    haunch_members: tuple[str, ...] = ()
    support: Support = Support.COLUMN
    other_end: BeamEnd | None = None

    @property
    def beam_to_beam(self) -> bool:
        """True for a secondary beam on a primary beam's web."""
        return self.support == Support.BEAM

    def parts(self, role: PartRole) -> tuple[str, ...]:
        """GlobalIds of the attached parts of one role."""
        return tuple(p.guid for p in (*self.plates, *self.fasteners) if p.role == role)

    @property
    def bolt_count(self) -> int:
        """Number of attached bolt elements."""
        return sum(1 for f in self.fasteners if f.role == PartRole.BOLT)


@dataclass(frozen=True, slots=True, kw_only=True)
class OtherBeamEnd:
    """A beam end that is not a beam-to-column joint, and what it is instead."""

    beam: str
    beam_end: BeamEnd
    kind: EndKind
    other: str | None
    point: Vec3
    label: str = ""
    joint: str | None = None  # the joint that checks this end (a beam-to-beam joint), if any


@dataclass(frozen=True, slots=True, kw_only=True)
class ScanResult:
    """Everything one scan found, for every renderer.

    ``anatomy`` maps a joint id to its :class:`ifcjoint.anatomy.JointAnatomy` once the anatomy
    step has run (empty straight from the finder).
    """

    model: ModelContents
    joints: tuple[Joint, ...]
    other_beam_ends: tuple[OtherBeamEnd, ...]
    settings: dict = field(default_factory=dict)
    anatomy: Mapping[str, Any] = field(default_factory=dict)

    @property
    def unreadable(self) -> tuple[Unreadable, ...]:
        """Elements the reader skipped, with reasons."""
        return self.model.unreadable
