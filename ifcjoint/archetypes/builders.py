"""From a joint's anatomy (what the model says) to the check engine's input (N, mm, MPa).

Everything the model does not give is either refused (a ``NotChecked`` with the reason) or
taken from a documented default that is reported as assumed. No IFC here.
"""

from __future__ import annotations

import numpy as np

from ifcjoint.anatomy import JointAnatomy
from ifcjoint.catalogue.materials import (
    BOLT_CLASSES,
    Strength,
    parse_steel_grade,
    steel_strength,
)
from ifcjoint.catalogue.sections import ISection
from ifcjoint.ec3 import detailing as dt
from ifcjoint.ec3.bolts import TENSILE_STRESS_AREA, bolt_elongation_length
from ifcjoint.ec3.components import BETA_W, full_strength_fillet_throat
from ifcjoint.engine.inputs import (
    AngleCleatJointInput,
    BoltsInput,
    CleatInput,
    EndPlateJointInput,
    FinBoltsInput,
    FinPlateInput,
    FinPlateJointInput,
    HaunchInput,
    HeaderPlateInput,
    HeaderPlateJointInput,
    MemberInput,
    PlateInput,
    StiffenerInput,
    WebPlateInput,
    WeldedJointInput,
    WeldsInput,
)
from ifcjoint.engine.settings import CheckSettings
from ifcjoint.model.codes import Axis, NotChecked, NotCheckedCode, Reason, ReasonCode, Support
from ifcjoint.model.elements import Member
from ifcjoint.model.joints import Joint


def support_face(joint: Joint) -> str:
    """What a joint's plate is bolted or welded to.

    A column ``flange`` or ``web``, a primary beam's web (``beam_web``), or the other beam's
    end plate (``splice``).
    """
    if joint.support == Support.SPLICE:
        return "splice"
    if joint.beam_to_beam:
        return "beam_web"
    return "web" if joint.axis != Axis.MAJOR else "flange"


def notch_needed(joint: Joint, a: JointAnatomy, members: dict[str, Member]) -> str:
    """Which flanges of a secondary beam clash with its primary beam's (it must be notched).

    Common practice, no source: a secondary flange above the underside of the primary's top
    flange and its root (or below the top of its bottom flange and root) clashes with it
    where the secondary's end lies within the primary's flange width. Returns ``top``,
    ``bottom``, ``both`` or ``""`` (none, or not a beam-to-beam joint).
    """
    if not joint.beam_to_beam or a.beam_section is None or a.column_section is None:
        return ""
    prim, ps, bs = members[joint.column], a.column_section, a.beam_section
    s, e = np.array(prim.start, dtype=float), np.array(prim.end, dtype=float)
    w = e - s
    p = np.array(joint.point, dtype=float)
    k = float(np.clip(np.dot(p - s, w) / max(float(np.dot(w, w)), 1e-9), 0.0, 1.0))
    mid_z = float((s + k * w)[2])  # the primary's centreline height there
    top_clear = (mid_z + ps.h / 2 - ps.tf - ps.r) - (p[2] + bs.h / 2)
    bottom_clear = (p[2] - bs.h / 2) - (mid_z - ps.h / 2 + ps.tf + ps.r)
    if joint.gap >= ps.b / 2 - ps.tw / 2:  # the end stops clear of the flange tips
        return ""
    top, bottom = top_clear < -1.0, bottom_clear < -1.0
    return "both" if top and bottom else "top" if top else "bottom" if bottom else ""


def require_major_axis(joint: Joint) -> NotChecked | None:
    """Why a joint on a column web cannot be checked (EN 1993-1-8 covers flange joints here)."""
    if joint.axis != Axis.MAJOR:
        return NotChecked(NotCheckedCode.MINOR_AXIS)
    return None


def _throat(t: float, grade: str, fy: float, fu: float, st: CheckSettings) -> float:
    """Assumed throat of a double fillet weld joining a part of thickness t (mm)."""
    if st.weld_throat_ratio is not None:
        return round(st.weld_throat_ratio * t, 1)
    a = full_strength_fillet_throat(t, fy, fu, BETA_W.get(grade, 1.0), st.params)
    return float(-(-a // 1))  # up to the whole mm


def assumed_welds(beam: MemberInput, st: CheckSettings) -> WeldsInput:
    """Beam-to-plate (or -column) welds when the model has none: both flanges and the web."""
    a_f = _throat(beam.tf, beam.grade, beam.fy, beam.fu, st)
    a_w = _throat(beam.tw, beam.grade, beam.fy, beam.fu, st)
    return WeldsInput(top_flange_throat=a_f, bottom_flange_throat=a_f, web_throat=a_w, assumed=True)


def grade_strength(grade: str, t: float, basis: str) -> tuple[str, Strength]:
    """The base grade (``S355``) of a grade as written (``S355J2+N``) and its strengths at t.

    Raises:
        ValueError: a grade or thickness the strength tables do not hold.
    """
    g = parse_steel_grade(grade)
    base, quality = (g.grade, g.quality) if g is not None else (grade, "")
    return base, steel_strength(base, t, basis=basis, quality=quality)


def section_member(
    name: str, sec: ISection, grade: str, basis: str, span: float | None
) -> MemberInput:
    """A section and grade as an engine member, strengths at the section's thickest element.

    A rolled section's strength is read at its thickest element (the flange), as product
    certificates and the published worked examples do; common practice, no source.
    """
    base, s = grade_strength(grade, max(sec.tf, sec.tw), basis)
    return MemberInput(
        name=sec.name or name,
        grade=base,
        strength_source=s.source,
        h=sec.h,
        b=sec.b,
        tw=sec.tw,
        tf=sec.tf,
        r=sec.r,
        fy=s.fy,
        fu=s.fu,
        welded=sec.r == 0,
        span=span,
        Iy=sec.Iy,
        Wpl_y=sec.Wpl_y,
    )


def joint_welds(a: JointAnatomy, beam: MemberInput, st: CheckSettings) -> WeldsInput:
    """The beam's welds: modelled throats where they are, full strength elsewhere (said).

    Where welds are modelled with a size, the smallest at each place (top flange, bottom
    flange, web) is used; the places with none take the full-strength throat.
    """
    assumed = assumed_welds(beam, st)
    sizes: dict[str, list[float]] = {}
    for w in a.welds:
        if w.throat is not None and w.throat > 0:
            sizes.setdefault(w.location, []).append(w.throat)
    if not sizes:
        return assumed
    top = min(sizes.get("top_flange", [assumed.top_flange_throat]))
    bottom = min(sizes.get("bottom_flange", [assumed.bottom_flange_throat]))
    web = min(sizes.get("web", [assumed.web_throat]))
    modelled = tuple(k for k in ("top_flange", "bottom_flange", "web") if k in sizes)
    return WeldsInput(top_flange_throat=top, bottom_flange_throat=bottom, web_throat=web,
                      assumed=len(modelled) < 3, modelled=modelled)


def _member(m: Member, sec: ISection, grade: str, basis: str, *, span: bool) -> MemberInput:
    return section_member(m.name, sec, grade, basis, m.length if span else None)


def beam_and_column(
    joint: Joint,
    a: JointAnatomy,
    members: dict[str, Member],
    st: CheckSettings,
    extra: tuple[tuple[str, object], ...] = (),
    *,
    minor_axis: bool = False,
) -> tuple[MemberInput, MemberInput] | NotChecked:
    """Beam and column engine inputs, or why they cannot be made (axis, missing data).

    ``minor_axis``: the joint type checks joints on a column web too (saying what it leaves).
    """
    minor = None if minor_axis else require_major_axis(joint)
    if minor is not None:
        return minor
    required = (
        ("beam section", a.beam_section),
        ("column section", a.column_section),
        ("beam grade", a.beam_grade),
        ("column grade", a.column_grade),
        *extra,
    )
    missing = [n for n, v in required if v is None]
    if missing:
        return NotChecked(NotCheckedCode.DATA_NOT_READ, {"missing": tuple(missing)})
    try:
        beam = _member(
            members[joint.beam], a.beam_section, a.beam_grade, st.strength_basis, span=True
        )
        col = _member(
            members[joint.column], a.column_section, a.column_grade, st.strength_basis, span=False
        )
    except ValueError as exc:
        return NotChecked(NotCheckedCode.STRENGTH_UNAVAILABLE, {"error": str(exc)})
    return beam, col


#: Corner snipe assumed on a stiffener whose outline the model gives as a box: at least the
#: column's root radius, and 15 mm (common practice, no source).
SNIPE_MIN = 15.0


def _plate_fy(grade: str | None, t: float, col: MemberInput, st: CheckSettings) -> float:
    """A column plate's yield strength: its own grade's, else the column's."""
    if grade:
        g = parse_steel_grade(grade)
        if g is not None and g.en10025:
            try:
                return steel_strength(g.grade, t, basis=st.strength_basis, quality=g.quality).fy
            except ValueError:
                pass
    return col.fy


def column_plate_inputs(
    a: JointAnatomy, col: MemberInput, st: CheckSettings
) -> tuple[tuple[StiffenerInput, ...], tuple[WebPlateInput, ...]]:
    """The column's stiffeners and web plates as engine inputs (sizes read, the rest assumed).

    A stiffener's grade not read: the column's fy; its snipe: ``SNIPE_MIN`` or the root radius;
    its weld to the flange: not known (alpha of Figure 6.11 without the weld deduction).
    """
    stiffeners = tuple(
        StiffenerInput(
            level=s.level,
            t=s.t,
            b=s.b,
            fy=_plate_fy(s.grade, s.t, col, st),
            grade=s.grade or "",
            snipe=max(col.r, SNIPE_MIN),
            guid=" ".join(s.guids),
        )
        for s in a.stiffener_plates
    )
    webs = tuple(
        WebPlateInput(t=w.t, b=w.b, fy=_plate_fy(w.grade, w.t, col, st), sides=w.sides,
                      grade=w.grade or "", guid=" ".join(w.guids))
        for w in a.web_plate_readings
    )
    return stiffeners, webs


def _shared_fields(
    a: JointAnatomy, beam: MemberInput, col: MemberInput, st: CheckSettings
) -> dict:
    """Fields both joint inputs take the same way: welds, factors, beta, column plates."""
    stiffeners, webs = column_plate_inputs(a, col, st)
    return {
        "welds": joint_welds(a, beam, st),
        "params": st.params,
        "beta": 1.0,
        "braced": st.braced,
        "stiffeners": stiffeners,
        "web_plates": webs,
    }


def _bolted_plate(
    joint: Joint, a: JointAnatomy, members: dict[str, Member], st: CheckSettings, *,
    minor_axis: bool, two_lines: bool,
) -> tuple[MemberInput, MemberInput, str, Strength] | NotChecked:
    """What every bolted plate's input needs: beam, column, the plate's grade and strength.

    Or the first reason it cannot be had: sections or grades not read, bolt data missing
    (with ``two_lines``: a gauge and two bolts in every row), no tensile area for the size,
    a plate strength the tables do not hold.
    """
    members_in = beam_and_column(joint, a, members, st, (("plate", a.plate), ("bolts", a.bolts)),
                                 minor_axis=minor_axis)
    if isinstance(members_in, NotChecked):
        return members_in
    b, p = a.bolts, a.plate
    if b.d is None or b.bolt_class is None or b.d0 is None or (two_lines and b.gauge is None):
        return NotChecked(NotCheckedCode.BOLT_DATA_MISSING)
    if int(round(b.d)) not in TENSILE_STRESS_AREA:
        return NotChecked(NotCheckedCode.NO_TENSILE_AREA, {"d": b.d})
    if two_lines and any(len(r.bolts) != 2 for r in b.rows):
        return NotChecked(NotCheckedCode.ROW_NOT_TWO_BOLTS)
    try:
        base, s = grade_strength(p.grade or a.beam_grade, p.tp, st.strength_basis)
    except ValueError as exc:
        return NotChecked(NotCheckedCode.STRENGTH_UNAVAILABLE, {"error": str(exc)})
    return (*members_in, base, s)


def _modelled_throats(a: JointAnatomy) -> list[float]:
    """The weld throats the model gives at the joint (mm; empty when none has a size)."""
    return [w.throat for w in a.welds if w.throat is not None and w.throat > 0]


def end_plate_input(
    joint: Joint, a: JointAnatomy, members: dict[str, Member], settings: CheckSettings | None = None
) -> EndPlateJointInput | NotChecked:
    """The engine input for a bolted end-plate joint, or the reason it cannot be checked.

    On a web (minor axis, or a primary beam's web) too: the engine checks what EN 1993-1-8
    gives there and says the rest is not determined.
    """
    st = settings or CheckSettings()
    got = _bolted_plate(joint, a, members, st, minor_axis=True, two_lines=True)
    if isinstance(got, NotChecked):
        return got
    beam, col, base, s = got
    b, p = a.bolts, a.plate
    fy_p, fu_p = s.fy, s.fu
    support = support_face(joint)
    if support == "splice":
        return _splice_input(a, beam, col, base, s, st)
    haunch = None
    if a.haunch is not None:
        haunch = haunch_input(a, beam, st)
        if isinstance(haunch, NotChecked):
            return haunch
    depth = a.beam_section.h + (haunch.d if haunch is not None else 0.0)
    t_support = a.column_section.tf if support == "flange" else a.column_section.tw
    fub = BOLT_CLASSES[b.bolt_class][1]
    return EndPlateJointInput(
        column=col,
        beam=beam,
        plate=PlateInput(
            grade=base,
            tp=p.tp,
            bp=p.bp,
            hp=p.hp,
            fy=fy_p,
            fu=fu_p,
            projection_top=p.projection_top,
            projection_bottom=p.projection_bottom(depth),
            strength_source=s.source,
        ),
        bolts=BoltsInput(
            d=b.d,
            grade=b.bolt_class,
            fub=fub,
            As=TENSILE_STRESS_AREA[int(round(b.d))],
            d0=b.d0,
            gauge=b.gauge,
            rows_from_beam_top=tuple(r.from_beam_top for r in b.rows),
            L_b=bolt_elongation_length(p.tp + t_support, b.d),
        ),
        alpha_method=st.alpha_method,
        support=support,
        haunch=haunch,
        **_shared_fields(a, beam, col, st),
    )


#: Steepest haunch flange, EN 1993-1-8:2005 6.2.6.7(2) (degrees).
HAUNCH_MAX_ANGLE = 45.0


def haunch_input(a: JointAnatomy, beam: MemberInput, st: CheckSettings):
    """The haunch's engine input, or why the haunch is outside 6.2.6.7(2).

    EN 1993-1-8:2005, 6.2.6.7(2): the haunch's steel grade matches the member's (its yield
    strength not below the beam's), its flange and web not smaller than the beam's (flange
    width and thickness, web thickness), its flange at most 45 degrees to the beam flange.
    A haunch grade not read takes the beam's (said in the joint's notes as an assumption).
    """
    hr = a.haunch
    grade = hr.grade or beam.grade
    try:
        _, sh = grade_strength(grade, max(hr.tf, hr.tw), st.strength_basis)
    except ValueError as exc:
        return NotChecked(NotCheckedCode.STRENGTH_UNAVAILABLE, {"error": str(exc)})
    for what, got, least in (("yield strength", sh.fy, beam.fy - 0.5),
                             ("flange width", hr.b, beam.b - 1.0),
                             ("flange thickness", hr.tf, beam.tf - 0.1),
                             ("web thickness", hr.tw, beam.tw - 0.1)):
        if got < least:
            return NotChecked(NotCheckedCode.HAUNCH_OUTSIDE_RULES,
                              {"what": what, "haunch": got, "beam": least})
    if hr.angle_deg > HAUNCH_MAX_ANGLE:
        return NotChecked(NotCheckedCode.HAUNCH_OUTSIDE_RULES,
                          {"what": "flange angle", "haunch": hr.angle_deg, "beam": 45.0})
    return HaunchInput(d=hr.d, b=hr.b, tf=hr.tf, tw=hr.tw, fy=sh.fy, grade=grade,
                       angle_deg=hr.angle_deg, length=hr.length)


#: Two splice plates this much apart in width, depth or position are not alike (common
#: practice, no source: modelling round-off).
SPLICE_PLATE_TOLERANCE = 5.0


def _splice_input(
    a: JointAnatomy, beam: MemberInput, other: MemberInput, base: str, s: Strength,
    st: CheckSettings,
) -> EndPlateJointInput | NotChecked:
    """A beam splice's input: both plates as the weaker one, no column (``support="splice"``).

    The plates must be alike in width, depth and position (``SPLICE_PLATE_TOLERANCE``); their
    thickness and steel may differ: the thinner plate, and the lower strengths, stand for
    both (on the safe side). The bolts' grip is both plates.
    """
    p, q, b = a.plate, a.other_plate, a.bolts
    if q is None:
        return NotChecked(NotCheckedCode.PARTS_MISSING, {"reason": Reason(
            ReasonCode.SPLICE_PLATE_MISSING)})
    for what, x, y in (("width", p.bp, q.bp), ("depth", p.hp, q.hp),
                       ("top edge", p.top_from_beam_top, q.top_from_beam_top)):
        if abs(x - y) > SPLICE_PLATE_TOLERANCE:
            return NotChecked(NotCheckedCode.SPLICE_PLATES_DIFFER,
                              {"what": what, "this": x, "other": y})
    fy, fu, source = s.fy, s.fu, s.source
    try:
        _, s_q = grade_strength(q.grade or a.column_grade, q.tp, st.strength_basis)
    except ValueError as exc:
        return NotChecked(NotCheckedCode.STRENGTH_UNAVAILABLE, {"error": str(exc)})
    if s_q.fy < fy or s_q.fu < fu:
        fy, fu, source = min(fy, s_q.fy), min(fu, s_q.fu), f"{source}; {s_q.source}"
    return EndPlateJointInput(
        column=other,
        beam=beam,
        plate=PlateInput(
            grade=base, tp=min(p.tp, q.tp), bp=p.bp, hp=p.hp, fy=fy, fu=fu,
            projection_top=p.projection_top,
            projection_bottom=p.projection_bottom(a.beam_section.h), strength_source=source,
        ),
        bolts=BoltsInput(
            d=b.d, grade=b.bolt_class, fub=BOLT_CLASSES[b.bolt_class][1],
            As=TENSILE_STRESS_AREA[int(round(b.d))], d0=b.d0, gauge=b.gauge,
            rows_from_beam_top=tuple(r.from_beam_top for r in b.rows),
            L_b=bolt_elongation_length(p.tp + q.tp, b.d),
        ),
        alpha_method=st.alpha_method,
        support="splice",
        welds=joint_welds(a, beam, st),
        params=st.params,
        beta=1.0,
        braced=st.braced,
    )


def welded_input(
    joint: Joint, a: JointAnatomy, members: dict[str, Member], settings: CheckSettings | None = None
) -> WeldedJointInput | NotChecked:
    """The engine input for a beam welded to a column flange, or the reason it cannot be."""
    st = settings or CheckSettings()
    members_in = beam_and_column(joint, a, members, st)
    if isinstance(members_in, NotChecked):
        return members_in
    beam, _col = members_in
    col = members_in[1]
    return WeldedJointInput(column=col, beam=beam, **_shared_fields(a, beam, col, st))


#: Bolts within this of each other along the beam form one vertical line (common practice).
LINE_TOLERANCE = 5.0


def fin_plate_input(
    joint: Joint, a: JointAnatomy, members: dict[str, Member], settings: CheckSettings | None = None
) -> FinPlateJointInput | NotChecked:
    """The engine input for a fin plate joint, or the reason it cannot be checked.

    Distances along the beam are measured from the column face: the lever arm z to the centre
    of the bolt lines, e2 from the outer line to the plate's free end, and the beam web's
    edge distance from the inner line to the beam end (the joint's gap from the face). With
    pitches that differ the least is used (smaller pitches lower bearing and raise the
    group's eccentricity factors: on the safe side).
    """
    st = settings or CheckSettings()
    got = _bolted_plate(joint, a, members, st, minor_axis=True, two_lines=False)
    if isinstance(got, NotChecked):
        return got
    beam, col, base, s = got
    b, p = a.bolts, a.plate
    lines: list[float] = []
    for x in sorted(-v for r in b.rows for v in r.along):
        if not lines or x - lines[-1] > LINE_TOLERANCE:
            lines.append(x)
    n1, n2 = len(b.rows), len(lines)
    if not b.rows or n2 > 2 or any(len(r.bolts) != n2 for r in b.rows):
        return NotChecked(NotCheckedCode.FIN_BOLT_PATTERN, {"lines": n2, "rows": n1})
    e2 = -p.along_min - lines[-1]
    e2_beam = lines[0] - joint.gap
    if e2 <= 0 or e2_beam <= 0:
        return NotChecked(NotCheckedCode.FIN_BOLT_PATTERN, {"lines": n2, "rows": n1})
    rows = [r.from_beam_top for r in b.rows]
    throats = _modelled_throats(a)
    weld = min(throats) if throats else _throat(p.tp, base, s.fy, s.fu, st)
    return FinPlateJointInput(
        column=col,
        beam=beam,
        welds=WeldsInput(top_flange_throat=0.0, bottom_flange_throat=0.0, web_throat=weld,
                         assumed=not throats, modelled=("fin_plate",) if throats else ()),
        params=st.params,
        braced=st.braced,
        fin=FinPlateInput(
            tp=p.tp, hp=p.hp, fy=s.fy, fu=s.fu, grade=base, strength_source=s.source,
            e1_top=rows[0] - p.top_from_beam_top, e1_bottom=p.bottom_from_beam_top - rows[-1],
            e2=e2, z=sum(lines) / n2, e2_beam=e2_beam,
        ),
        bolts=FinBoltsInput(
            d=b.d, grade=b.bolt_class, fub=BOLT_CLASSES[b.bolt_class][1],
            As=TENSILE_STRESS_AREA[int(round(b.d))], d0=b.d0, n1=n1, n2=n2,
            p1=min(b.pitches) if b.pitches else 0.0,
            gauge=lines[1] - lines[0] if n2 == 2 else 0.0,
            rows_from_beam_top=tuple(rows),
        ),
        support=support_face(joint),
        notch=notch_needed(joint, a, members),
    )


def angle_cleat_input(
    joint: Joint, a: JointAnatomy, members: dict[str, Member], settings: CheckSettings | None = None
) -> AngleCleatJointInput | NotChecked:
    """The engine input for double angle web cleats, or the reason it cannot be checked.

    One web-side line of ``n`` rows and ``2 n`` support-side bolts; the distances as read
    (``anatomy.read.read_cleats``), each at least Table 3.3's minimum for Table 3.4's
    bearing formula (EN 1993-1-8 3.5), else not checked with the distance named.
    """
    st = settings or CheckSettings()
    members_in = beam_and_column(joint, a, members, st, (("bolts", a.bolts),), minor_axis=True)
    if isinstance(members_in, NotChecked):
        return members_in
    beam, col = members_in
    b, c = a.bolts, a.cleats
    if b.d is None or b.bolt_class is None or b.d0 is None:
        return NotChecked(NotCheckedCode.BOLT_DATA_MISSING)
    if int(round(b.d)) not in TENSILE_STRESS_AREA:
        return NotChecked(NotCheckedCode.NO_TENSILE_AREA, {"d": b.d})
    if c.n_sup != 2 * c.n_web or len(c.rows) != c.n_web:
        return NotChecked(NotCheckedCode.CLEAT_BOLT_PATTERN,
                          {"web": c.n_web, "support": c.n_sup})
    e_least = dt.e_min(b.d0)
    checks = [("e1 (cleat)", c.e1, e_least), ("e2 (cleat, web leg)", c.e2_web, e_least),
              ("e2 (cleat, support leg)", c.e2_sup, e_least),
              ("e2 (beam web)", c.e2_beam, e_least)]
    if c.n_web > 1:
        checks.append(("p1", c.p1, dt.p1_min(b.d0)))
    for what, value, least in checks:
        if value < least - 0.5:
            return NotChecked(NotCheckedCode.BEARING_OUT_OF_RANGE,
                              {"what": what, "value": value, "limit": least})
    try:
        base, s = grade_strength(c.grade or a.beam_grade, c.t, st.strength_basis)
    except ValueError as exc:
        return NotChecked(NotCheckedCode.STRENGTH_UNAVAILABLE, {"error": str(exc)})
    return AngleCleatJointInput(
        column=col, beam=beam,
        welds=WeldsInput(top_flange_throat=0.0, bottom_flange_throat=0.0, web_throat=0.0,
                         assumed=False),
        params=st.params, braced=st.braced,
        cleats=CleatInput(t=c.t, hp=c.hp, fy=s.fy, fu=s.fu, grade=base, e1=c.e1,
                          e2_web=c.e2_web, e2_sup=c.e2_sup, cross_centres=c.cross_centres,
                          r=c.r or 0.0, z=c.z, strength_source=s.source),
        bolts=FinBoltsInput(d=b.d, grade=b.bolt_class, fub=BOLT_CLASSES[b.bolt_class][1],
                            As=TENSILE_STRESS_AREA[int(round(b.d))], d0=b.d0, n1=c.n_web,
                            n2=1, p1=c.p1, gauge=0.0, rows_from_beam_top=c.rows),
        e2_beam=c.e2_beam, support=support_face(joint),
        notch=notch_needed(joint, a, members),
    )


def header_plate_input(
    joint: Joint, a: JointAnatomy, members: dict[str, Member], settings: CheckSettings | None = None
) -> HeaderPlateJointInput | NotChecked:
    """The engine input for a partial-depth end plate, or the reason it cannot be checked.

    Two bolt lines (one bolt each side of the web in every row); distances from the plate's
    edges as read; pitches that differ take the least (on the safe side).
    """
    st = settings or CheckSettings()
    got = _bolted_plate(joint, a, members, st, minor_axis=True, two_lines=True)
    if isinstance(got, NotChecked):
        return got
    beam, col, base, s = got
    b, p = a.bolts, a.plate
    rows = [r.from_beam_top for r in b.rows]
    throats = _modelled_throats(a)
    weld = min(throats) if throats else _throat(beam.tw, beam.grade, beam.fy, beam.fu, st)
    return HeaderPlateJointInput(
        column=col,
        beam=beam,
        welds=WeldsInput(top_flange_throat=0.0, bottom_flange_throat=0.0, web_throat=weld,
                         assumed=not throats, modelled=("web",) if throats else ()),
        params=st.params,
        braced=st.braced,
        header=HeaderPlateInput(
            tp=p.tp, hp=p.hp, bp=p.bp, fy=s.fy, fu=s.fu, grade=base, strength_source=s.source,
            e1_top=rows[0] - p.top_from_beam_top, e1_bottom=p.bottom_from_beam_top - rows[-1],
            e2=(p.bp - b.gauge) / 2,
        ),
        bolts=FinBoltsInput(
            d=b.d, grade=b.bolt_class, fub=BOLT_CLASSES[b.bolt_class][1],
            As=TENSILE_STRESS_AREA[int(round(b.d))], d0=b.d0, n1=len(rows), n2=2,
            p1=min(b.pitches) if b.pitches else 0.0, gauge=b.gauge,
            rows_from_beam_top=tuple(rows),
        ),
        support=support_face(joint),
        notch=notch_needed(joint, a, members),
    )
