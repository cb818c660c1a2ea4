"""From a joint's anatomy (what the model says) to the check engine's input (N, mm, MPa).

Everything the model does not give is either refused (the joint is "not checked" with the
reason) or taken from a documented default that is reported as assumed. No IFC here.
"""

from __future__ import annotations

from dataclasses import dataclass, replace

from ifcjoint.ec3.bolts import TENSILE_STRESS_AREA
from ifcjoint.ec3.params import RECOMMENDED, Parameters
from ifcjoint.engine.anatomy import JointAnatomy
from ifcjoint.engine.check import (
    BoltsInput,
    CheckResult,
    EndPlateJointInput,
    MemberInput,
    PlateInput,
    WeldedJointInput,
    WeldsInput,
    check_end_plate_joint,
    check_welded_joint,
)
from ifcjoint.engine.materials import BOLT_CLASSES, steel_strengths
from ifcjoint.engine.model import Member
from ifcjoint.engine.results import Joint
from ifcjoint.engine.sections import ISection


@dataclass(frozen=True, slots=True, kw_only=True)
class CheckSettings:
    """Choices for the check where the model is silent.

    Attributes:
        params: partial factors and nationally determined parameters.
        weld_throat_ratio: fillet weld throat as a fraction of the thickness of the part it
            joins when welds are not modelled; None (default): full-strength double fillet
            welds by the simplified method, a = t fy sqrt(3) beta_w gamma_M2 / (2 fu)
            (EN 1993-1-8 4.5.3.3), rounded up to the mm.
        strength_basis: ``EN 1993-1-1`` (Table 3.1) or ``EN 10025`` (product standard).
        braced: frame braced (kb = 8) or not (kb = 25) for the stiffness classification.
        alpha_method: alpha of EN 1993-1-8 Figure 6.11: ``conservative`` (4.45, the chart's
            lowest value) or ``approximation`` (a representation of the chart, see
            ``ifcjoint.ec3.effective_lengths.alpha_fig_6_11``).
    """

    params: Parameters = RECOMMENDED
    weld_throat_ratio: float | None = None
    strength_basis: str = "EN 1993-1-1"
    braced: bool = True
    alpha_method: str = "conservative"


def _throat(t: float, grade: str, fy: float, fu: float, st: CheckSettings) -> float:
    """Assumed throat of a double fillet weld joining a part of thickness t (mm)."""
    if st.weld_throat_ratio is not None:
        return round(st.weld_throat_ratio * t, 1)
    from ifcjoint.ec3.components import BETA_W

    bw = BETA_W.get(grade, 1.0)
    a = t * fy * 3**0.5 * bw * st.params.gamma_M2 / (2 * fu)
    return float(-(-a // 1))  # up to the whole mm


def _assumed_welds(beam: MemberInput, st: CheckSettings) -> WeldsInput:
    """Beam-to-plate (or -column) welds when the model has none: both flanges and the web."""
    a_f = _throat(beam.tf, beam.grade, beam.fy, beam.fu, st)
    a_w = _throat(beam.tw, beam.grade, beam.fy, beam.fu, st)
    return WeldsInput(top_flange_throat=a_f, bottom_flange_throat=a_f, web_throat=a_w, assumed=True)


def _member(m: Member, sec: ISection, grade: str, basis: str, *, span: bool) -> MemberInput:
    # A rolled section's strength is read at its thickest element (the flange), as product
    # certificates and the published worked examples do; common practice, no source.
    fy, fu = steel_strengths(grade, max(sec.tf, sec.tw), basis=basis)
    return MemberInput(
        name=sec.name or m.name,
        grade=grade,
        h=sec.h,
        b=sec.b,
        tw=sec.tw,
        tf=sec.tf,
        r=sec.r,
        fy=fy,
        fu=fu,
        welded=sec.r == 0,
        span=m.length if span else None,
        Iy=sec.Iy,
        Wpl_y=sec.Wpl_y,
    )


def _beam_and_column(
    joint: Joint,
    a: JointAnatomy,
    members: dict[str, Member],
    st: CheckSettings,
    extra: tuple[tuple[str, object], ...] = (),
) -> tuple[MemberInput, MemberInput] | str:
    """Beam and column engine inputs, or why they cannot be made (axis, missing data)."""
    if joint.axis != "major":
        return "minor-axis joint (beam on the column web): not handled yet"
    required = (
        ("beam section", a.beam_section),
        ("column section", a.column_section),
        ("beam grade", a.beam_grade),
        ("column grade", a.column_grade),
        *extra,
    )
    missing = [n for n, v in required if v is None]
    if missing:
        return "not read from the model: " + ", ".join(missing)
    try:
        beam = _member(
            members[joint.beam], a.beam_section, a.beam_grade, st.strength_basis, span=True
        )
        col = _member(
            members[joint.column], a.column_section, a.column_grade, st.strength_basis, span=False
        )
    except ValueError as exc:
        return f"steel strength not available: {exc}"
    return beam, col


def _shared_fields(a: JointAnatomy, beam: MemberInput, st: CheckSettings) -> dict:
    """Fields both joint inputs take the same way: welds, factors, beta, column plates."""
    return {
        "welds": _assumed_welds(beam, st),
        "params": st.params,
        "beta": 1.0,
        "braced": st.braced,
        "stiffeners": a.stiffeners,
        "supplementary_web_plates": a.web_plates,
        "stiffener_depths": a.stiffener_depths,
    }


def end_plate_input(
    joint: Joint, a: JointAnatomy, members: dict[str, Member], settings: CheckSettings | None = None
) -> EndPlateJointInput | str:
    """The engine input for a bolted end-plate joint, or the reason it cannot be checked."""
    st = settings or CheckSettings()
    if joint.axis != "major":
        return "minor-axis joint (beam on the column web): not handled yet"
    if a.archetype == "fin_plate":
        return (
            "fin plate, nominally pinned: no moment resistance to check; the fin plate "
            "shear check is not implemented yet"
        )
    if a.archetype not in ("extended_end_plate", "flush_end_plate"):
        return f"archetype {a.archetype}: only bolted end plates and welded joints are checked"
    members_in = _beam_and_column(joint, a, members, st, (("plate", a.plate), ("bolts", a.bolts)))
    if isinstance(members_in, str):
        return members_in
    beam, col = members_in
    b, p = a.bolts, a.plate
    if b.d is None or b.bolt_class is None or b.d0 is None or b.gauge is None:
        return "bolt diameter, class, hole or gauge not read"
    if int(round(b.d)) not in TENSILE_STRESS_AREA:
        return f"no tensile stress area for M{b.d:g}"
    if any(len(r.bolts) != 2 for r in b.rows):
        return "a bolt row without exactly two bolts: outside the method's scope here"
    plate_grade = p.grade or a.beam_grade
    try:
        fy_p, fu_p = steel_strengths(plate_grade, p.tp, basis=st.strength_basis)
    except ValueError as exc:
        return f"steel strength not available: {exc}"
    fyb, fub = BOLT_CLASSES[b.bolt_class]
    del fyb
    sec = a.beam_section
    grip = p.tp + a.column_section.tf
    return EndPlateJointInput(
        column=col,
        beam=beam,
        plate=PlateInput(
            grade=plate_grade,
            tp=p.tp,
            bp=p.bp,
            hp=p.hp,
            fy=fy_p,
            fu=fu_p,
            projection_top=p.projection_top,
            projection_bottom=p.projection_bottom(sec.h),
        ),
        bolts=BoltsInput(
            d=b.d,
            grade=b.bolt_class,
            fub=fub,
            As=TENSILE_STRESS_AREA[int(round(b.d))],
            d0=b.d0,
            gauge=b.gauge,
            rows_from_beam_top=tuple(r.from_beam_top for r in b.rows),
            L_b=grip + 8.0 + 0.5 * (0.65 * b.d + 0.9 * b.d),
        ),
        alpha_method=st.alpha_method,
        **_shared_fields(a, beam, st),
    )


def welded_input(
    joint: Joint, a: JointAnatomy, members: dict[str, Member], settings: CheckSettings | None = None
) -> WeldedJointInput | str:
    """The engine input for a beam welded to a column flange, or the reason it cannot be."""
    st = settings or CheckSettings()
    members_in = _beam_and_column(joint, a, members, st)
    if isinstance(members_in, str):
        return members_in
    beam, col = members_in
    return WeldedJointInput(
        column=col,
        beam=beam,
        **_shared_fields(a, beam, st),
    )


def check_joint(
    joint: Joint, a: JointAnatomy, members: dict[str, Member], settings: CheckSettings | None = None
) -> CheckResult:
    """Check one joint, or say why it is not checked."""
    if a.archetype == "welded":
        winp = welded_input(joint, a, members, settings)
        if isinstance(winp, str):
            return CheckResult(status="not_checked", reason=winp)
        return check_welded_joint(winp)
    inp = end_plate_input(joint, a, members, settings)
    if isinstance(inp, str):
        return CheckResult(status="not_checked", reason=inp)
    r = check_end_plate_joint(inp)
    if r.status == "checked":
        note = (
            "beta = 1 (single-sided, conservative) until the demands give the moments of both sides"
            if joint.partner
            else "beta = 1: single-sided joint"
        )
        r = replace(r, notes=(*r.notes, note))
    return r


__all__ = ["CheckSettings", "check_joint", "end_plate_input"]
