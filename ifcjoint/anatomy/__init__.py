"""Joint anatomy: what each joint is made of, as read from the model, and its detailing findings.

``analyse(joints, model)`` reads every joint in its own frame (``frame``): sections and grades,
the main plate, the bolt rows (``read``), column stiffeners and web plates, parts ifcjoint does
not handle; then checks the detailing against the rule table (``rules``, ``detailing``). No IFC.
The archetype is decided from this reading by ``ifcjoint.archetypes``.
"""

from __future__ import annotations

from dataclasses import dataclass, replace

import numpy as np

from ifcjoint.anatomy.detailing import (
    cleat_bolt_lengths,
    completeness,
    detailing,
    weld_sizes,
)
from ifcjoint.anatomy.frame import joint_frame
from ifcjoint.anatomy.read import (
    BoltReading,
    BoltRow,
    CleatReading,
    HaunchReading,
    PlateReading,
    StiffenerReading,
    WebPlateReading,
    WeldReading,
    column_plates,
    grade_of,
    read_bolts,
    read_cleats,
    read_haunch,
    read_plate,
    read_welds,
    section_of,
    tstub_geometry,
    unsupported_parts,
    unusable_values,
)
from ifcjoint.anatomy.rules import RULES, TOUCH_TOLERANCE
from ifcjoint.catalogue.sections import ISection
from ifcjoint.model.codes import Axis, PartRole, Support, UnsupportedPart
from ifcjoint.model.elements import Fastener, Member, ModelContents, Plate
from ifcjoint.model.joints import Finding, Joint

__all__ = [
    "TOUCH_TOLERANCE",
    "AnatomySettings",
    "BoltReading",
    "BoltRow",
    "CleatReading",
    "HaunchReading",
    "JointAnatomy",
    "PlateReading",
    "StiffenerReading",
    "WebPlateReading",
    "WeldReading",
    "analyse",
    "analyse_joint",
]


@dataclass(frozen=True, slots=True, kw_only=True)
class AnatomySettings:
    """User choices for what the model does not say.

    Attributes:
        assume_steel_grade: grade used where a member or plate has none (e.g. ``S355``); every
            use is reported as an assumption. None: a missing grade stays missing.
        assume_bolt_class: bolt property class used where none is found (e.g. ``8.8``).
    """

    assume_steel_grade: str | None = None
    assume_bolt_class: str | None = None


@dataclass(frozen=True, slots=True, kw_only=True)
class JointAnatomy:
    """What a joint is made of, as read from the model.

    Attributes:
        joint_id: the joint's id.
        main_role: the role of the joint's main plate (end plate, fin plate), or None.
        beam_section, column_section: the sections read (None: not read).
        beam_grade, column_grade: steel grades read (or assumed by the user's setting).
        plate: the main plate in the joint frame, or None.
        bolts: the bolts, or None.
        stiffener_plates: transverse column stiffeners, by level, with their sizes.
        web_plate_readings: supplementary web plates, with their sizes.
        welds: welds modelled as elements, with where they lie and their throats.
        unsupported: parts that make the joint a kind ifcjoint does not handle, with counts.
        findings: detailing and data findings, in report order.
        unread: what could not be read, in words.
        assumed: what was assumed by the user's settings, in words.
        other_plate: a splice's second end plate (on the other beam), or None.
        haunch: the haunch under the beam, read whole, or None.
        cleats: double angle web cleats, read whole, or None.
    """

    joint_id: str
    main_role: PartRole | None
    beam_section: ISection | None
    column_section: ISection | None
    beam_grade: str | None
    column_grade: str | None
    plate: PlateReading | None
    bolts: BoltReading | None
    stiffener_plates: tuple[StiffenerReading, ...] = ()
    web_plate_readings: tuple[WebPlateReading, ...] = ()
    welds: tuple[WeldReading, ...] = ()
    unsupported: tuple[tuple[UnsupportedPart, int], ...] = ()
    findings: tuple[Finding, ...] = ()
    unread: tuple[str, ...] = ()
    assumed: tuple[str, ...] = ()
    other_plate: PlateReading | None = None
    haunch: HaunchReading | None = None
    cleats: CleatReading | None = None


def analyse(
    result_joints: tuple[Joint, ...],
    model: ModelContents,
    settings: AnatomySettings | None = None,
) -> tuple[JointAnatomy, ...]:
    """Anatomy and detailing findings of every joint."""
    members = {m.guid: m for m in model.members}
    plates = {p.guid: p for p in model.plates}
    fasteners = {f.guid: f for f in model.fasteners}
    st = settings or AnatomySettings()
    return tuple(analyse_joint(j, members, plates, fasteners, st) for j in result_joints)


def _grade(m: Member, who: str, st: AnatomySettings, findings, assumed) -> str | None:
    """A member's grade; the user's assumption (reported) or a finding when there is none."""
    g = grade_of(m.material, m.texts)
    if g is None and st.assume_steel_grade:
        assumed.append(f"{who} grade {st.assume_steel_grade} (user setting; none in model)")
        return st.assume_steel_grade
    if g is None:
        findings.append(
            RULES["grade_missing"].finding(elements=(m.guid,), who=who, material=m.material)
        )
    return g


def _main_role(j: Joint) -> PartRole | None:
    roles = {p.role for p in j.plates}
    for role in (PartRole.END_PLATE, PartRole.FIN_PLATE):
        if role in roles:
            return role
    return None


def analyse_joint(
    j: Joint,
    members: dict[str, Member],
    plates: dict[str, Plate],
    fasteners: dict[str, Fastener],
    settings: AnatomySettings | None = None,
) -> JointAnatomy:
    """Anatomy of one joint; never raises for bad data (it goes into ``unread``)."""
    st = settings or AnatomySettings()
    findings: list[Finding] = []
    unread: list[str] = []
    assumed: list[str] = []
    beam, col = members[j.beam], members[j.column]
    fr = joint_frame(j, beam, col)
    bsec = section_of(beam, findings, unread, "beam")
    csec = section_of(col, findings, unread, "column")
    bgrade = _grade(beam, "beam", st, findings, assumed)
    cgrade = _grade(col, "column", st, findings, assumed)
    unusable_values(j, plates, fasteners, findings)
    stiff, web_plates = column_plates(j, fr, plates, col)
    role = _main_role(j)
    main = other = None
    if role is not None:
        cands = [plates[p.guid] for p in j.plates if p.role == role]
        if j.support == Support.SPLICE and role == PartRole.END_PLATE:
            # this beam's plate lies on its side of the face, the other beam's beyond it
            along = {p.guid: float(np.dot(np.subtract(p.center, fr.face), fr.t)) for p in cands}
            mine = [p for p in cands if along[p.guid] <= 0] or cands
            main = max(mine, key=lambda p: p.half_u * p.half_v)
            theirs = [p for p in cands if along[p.guid] > 0 and p is not main]
            other = max(theirs, key=lambda p: p.half_u * p.half_v) if theirs else None
        else:
            main = max(cands, key=lambda p: p.half_u * p.half_v)
    bolt_list = [fasteners[b.guid] for b in j.fasteners if b.role == PartRole.BOLT]
    plate_r = read_plate(main, role, fr) if main is not None else None
    other_r = read_plate(other, role, fr) if other is not None else None
    if plate_r is not None and other_r is not None:  # a splice: the plates bear on each other
        plate_r = replace(plate_r, gap_to_column=other_r.along_min - plate_r.along_max)
    bolt_r = None
    if bolt_list:
        bolt_r = read_bolts(
            bolt_list, fr, main, findings, unread, st.assume_bolt_class, assumed, role
        )
    if bolt_r is not None and plate_r is not None and role == PartRole.END_PLATE:
        bolt_r = replace(bolt_r, tstub=tstub_geometry(plate_r, bolt_r, csec))
    if plate_r is not None and bolt_r is not None:
        detailing(j, fr, plate_r, bolt_r, bolt_list, csec, findings, other=other_r)
    welds = read_welds(j, fr, fasteners, bsec)
    haunch = read_haunch(j, fr, plates, members, bsec)
    cleats = read_cleats(j, fr, plates, fasteners)
    if cleats is not None:
        cleat_bolt_lengths(cleats, bolt_r.d if bolt_r is not None else None, fasteners, bsec,
                           csec, j.axis != Axis.MAJOR or j.beam_to_beam, findings)
    weld_sizes(welds, role, bsec, bgrade, findings)
    if cleats is None:  # the cleats hold the bolts: nothing missing
        completeness(j, plate_r, bolt_r, role, findings)
    return JointAnatomy(
        joint_id=j.id,
        main_role=role,
        beam_section=bsec,
        column_section=csec,
        beam_grade=bgrade,
        column_grade=cgrade,
        plate=plate_r,
        bolts=bolt_r,
        stiffener_plates=stiff,
        web_plate_readings=web_plates,
        welds=welds,
        unsupported=unsupported_parts(j, fr, plates, col, bsec, haunch, cleats is not None),
        findings=tuple(findings),
        unread=tuple(unread),
        assumed=tuple(assumed),
        other_plate=other_r,
        haunch=haunch,
        cleats=cleats,
    )


def _all_guids(readings) -> tuple[str, ...]:
    return tuple(sorted(g for r in readings for g in r.guids))


def stiffener_guids(a: JointAnatomy) -> tuple[str, ...]:
    """GlobalIds of the column's transverse stiffeners at the joint."""
    return _all_guids(a.stiffener_plates)


def web_plate_guids(a: JointAnatomy) -> tuple[str, ...]:
    """GlobalIds of the column's supplementary web plates at the joint."""
    return _all_guids(a.web_plate_readings)
