"""What the end-plate and welded checks share: shear area, classification, column plates."""

from __future__ import annotations

import functools
import math
from dataclasses import dataclass, field

from ifcjoint.catalogue.sections import ISection
from ifcjoint.ec3 import components as cmp
from ifcjoint.ec3 import pinned as pin
from ifcjoint.ec3 import sections as sec
from ifcjoint.ec3 import stiffeners as sti
from ifcjoint.ec3 import stiffness as stf
from ifcjoint.ec3.code import EN_1993_1_8, Clause, Component, Zone
from ifcjoint.ec3.moment_resistance import Limit, LimitScope
from ifcjoint.engine.inputs import JointInput, MemberInput, StiffenerInput, WeldsInput
from ifcjoint.engine.results import (
    CheckResult,
    Classification,
    ComponentResult,
    Condition,
    SideResult,
)
from ifcjoint.model.codes import (
    NotChecked,
    NotCheckedCode,
    Note,
    NoteCode,
    StiffnessClass,
    StrengthClass,
)

#: How far (mm, beyond half the flange thickness) a transverse stiffener may sit from a beam
#: flange's mid-plane and still count as the stiffener of that flange (common practice).
STIFFENER_REACH = 25.0


def stiffener_at(
    stiffeners: tuple[StiffenerInput, ...], flange_depth: float, t_f: float
) -> StiffenerInput | None:
    """The transverse column stiffener that lines up with a beam flange, or None.

    Common practice, no source: within t_f / 2 + 25 mm of the flange's mid-plane.
    """
    near = [s for s in stiffeners if abs(s.level - flange_depth) <= t_f / 2 + STIFFENER_REACH]
    return min(near, key=lambda s: abs(s.level - flange_depth)) if near else None


@functools.lru_cache(maxsize=1024)
def beam_M_c_Rd(beam: MemberInput, params) -> tuple[float | None, int]:
    """M_c,Rd of the beam by its class in bending, and the class.

    EN 1993-1-1:2005, 5.5.2, Table 5.2 and 6.2.5(2): W_pl for class 1 and 2, W_el for class 3,
    None for class 4 (the check of 6.2.6.7 then cannot be made). Kept per beam and factors
    (a model repeats its beams).
    """
    c = sec.class_in_bending(h=beam.h, b=beam.b, tw=beam.tw, tf=beam.tf, r=beam.r, fy=beam.fy)
    iy = beam.Iy or ISection(h=beam.h, b=beam.b, tw=beam.tw, tf=beam.tf, r=beam.r).Iy
    return sec.M_c_Rd(c, plastic_modulus(beam), iy / (beam.h / 2), beam.fy, params), c


@dataclass
class ColumnWeb:
    """The column web panel with what reinforces it (mm, mm2, N).

    Attributes:
        a_vc: shear area for the resistance (raised by supplementary web plates).
        a_vc_plain: shear area of the column alone (used for the stiffness k1).
        v_wp_Rd: web panel shear resistance (with V_wp,add,Rd between stiffeners).
        t_compression: effective web thickness in compression (6.2.6.2(6)).
        t_tension: effective web thickness in tension (6.2.6.3(8)).
        notes: what the reinforcements changed, as codes.
    """

    a_vc: float
    a_vc_plain: float
    v_wp_Rd: float
    t_compression: float
    t_tension: float
    notes: list[Note] = field(default_factory=list)


def column_web(inp: JointInput) -> ColumnWeb:
    """The web panel of the joint: shear area, Vwp,Rd, effective thicknesses.

    EN 1993-1-8:2005, 6.2.6.1(2), Eq. (6.7), with supplementary web plates (6.2.6.1(6)-(7),
    6.2.6.2(6), 6.2.6.3(8)) and transverse stiffeners at both beam flanges (6.2.6.1(4),
    Eq. (6.8)).
    """
    col, beam, p = inp.column, inp.beam, inp.params
    a_plain = shear_area(col)
    out = ColumnWeb(
        a_vc=a_plain, a_vc_plain=a_plain, v_wp_Rd=0.0, t_compression=col.tw, t_tension=col.tw
    )
    plate = _usable_web_plate(inp, out.notes)
    if plate is not None:
        b_s, sides = plate
        out.a_vc += sti.web_plate_shear_area_increase(b_s, col.tw)
        out.t_compression = sti.web_plate_t_eff_compression(col.tw, sides)
        out.t_tension = sti.web_plate_t_eff_tension(col.tw, sides)
        out.notes.append(Note(NoteCode.WEB_PLATES_USED, {"n": len(inp.web_plates), "sides": sides}))
    out.v_wp_Rd = cmp.V_wp_Rd(col.fy, out.a_vc, p)
    top = stiffener_at(inp.stiffeners, beam.tf / 2, beam.tf)
    bottom = stiffener_at(inp.stiffeners, beam.h - beam.tf / 2, beam.tf)
    if top is not None and bottom is not None and top is not bottom:
        m_fc = sti.M_pl_plate(col.b, col.tf, col.fy, p)
        m_st = min(sti.M_pl_plate(2 * s.b + col.tw, s.t, s.fy, p) for s in (top, bottom))
        d_s = abs(bottom.level - top.level)
        add = sti.V_wp_add_Rd(m_fc, m_st, d_s)
        out.v_wp_Rd += add
        out.notes.append(Note(NoteCode.WEB_PANEL_STIFFENED, {"V_add": add, "d_s": d_s}))
    return out


def _usable_web_plate(inp: JointInput, notes: list[Note]) -> tuple[float, int] | None:
    """(b_s, sides) of the supplementary web plates that may be counted, or None, said why.

    EN 1993-1-8:2005, 6.2.6.1(7) (recalled from memory): the plate's steel at least the
    column's and the plate at least as thick as the web; otherwise it is ignored (safe side).
    """
    if not inp.web_plates:
        return None
    col = inp.column
    if any(w.fy < col.fy or w.t < col.tw for w in inp.web_plates):
        notes.append(Note(NoteCode.WEB_PLATES_IGNORED, {"n": len(inp.web_plates)}))
        return None
    sides = 2 if len(inp.web_plates) >= 2 or any(w.sides >= 2 for w in inp.web_plates) else 1
    return min(w.b for w in inp.web_plates), sides


def shear_area(s: MemberInput) -> float:
    """Avc of a rolled (EN 1993-1-1 6.2.6(3)a) or welded (hw tw) section, mm2."""
    hw = s.h - 2 * s.tf
    if s.welded:
        return hw * s.tw
    a = 2 * s.b * s.tf + hw * s.tw + (4 - math.pi) * s.r**2
    return max(a - 2 * s.b * s.tf + (s.tw + 2 * s.r) * s.tf, hw * s.tw)


def plastic_modulus(s: MemberInput) -> float:
    """Wpl,y of the member: the input's, else that of its I section with root radius (mm3)."""
    if s.Wpl_y:
        return s.Wpl_y
    return ISection(h=s.h, b=s.b, tw=s.tw, tf=s.tf, r=s.r).Wpl_y


def classify(inp: JointInput, hog: SideResult, sag: SideResult) -> Classification:
    """Stiffness class (EN 1993-1-8 5.2.2.5) and strength class per sign (5.2.3.3)."""
    beam, col, p = inp.beam, inp.column, inp.params
    out: dict = {}
    if hog.S_j_ini is None:
        out["stiffness_gap"] = hog.no_tension
    elif beam.span and beam.Iy:
        c_s, bounds = stf.classify_stiffness(
            hog.S_j_ini, beam.Iy, beam.span, braced=inp.braced, params=p
        )
        out.update(
            stiffness=StiffnessClass(c_s),
            kb=bounds["kb"],
            rigid_from=bounds["rigid_from"],
            pinned_up_to=bounds["pinned_up_to"],
        )
    else:
        out["stiffness_gap"] = NotChecked(NotCheckedCode.NO_SPAN_OR_IY)
    if beam.Wpl_y and col.Wpl_y:
        mpl_b = beam.Wpl_y * beam.fy / p.gamma_M0
        mpl_c = col.Wpl_y * col.fy / p.gamma_M0
        above = inp.column_continues_above
        hog_c, limit = stf.classify_strength(hog.M_j_Rd, mpl_b, mpl_c, column_continues_above=above)
        sag_c, limit = stf.classify_strength(sag.M_j_Rd, mpl_b, mpl_c, column_continues_above=above)
        out.update(
            strength=StrengthClass(hog_c),
            strength_sagging=StrengthClass(sag_c),
            full_strength_from=limit,
        )
    else:
        out["strength_gap"] = NotChecked(NotCheckedCode.NO_PLASTIC_MODULI)
    return Classification(**out)


def weld_notes(w: WeldsInput) -> list[Note]:
    """Say so when the weld throats were assumed rather than read from the model."""
    if not w.assumed:
        return [Note(NoteCode.WELDS_MODELLED)]
    throats = {"a_top": w.top_flange_throat, "a_bottom": w.bottom_flange_throat}
    if w.modelled:
        return [Note(NoteCode.WELDS_PARTLY_MODELLED,
                     {**throats, "a_web": w.web_throat, "modelled": tuple(w.modelled)})]
    return [Note(NoteCode.WELDS_ASSUMED, {**throats, "a_web": w.web_throat})]


def resistances_valid(result: CheckResult) -> CheckResult:
    """The result, after making sure every resistance is a finite, non-negative number.

    Common practice, no source: a negative or infinite resistance is a bug, never a result.

    Raises:
        ArithmeticError: a resistance is negative, infinite or not a number.
    """
    numbers = [result.V_wp_Rd] if result.V_wp_Rd is not None else []  # none in a splice
    for side in (result.hogging, result.sagging):
        if side is not None:
            numbers += [side.M_j_Rd, *(c.F_Rd for c in side.components),
                        *(r.F_tr_Rd for r in side.rows)]
            if side.V_j_Rd is not None:
                numbers.append(side.V_j_Rd)
    if all(v is not None and 0 <= v < math.inf for v in numbers):
        return result  # the usual case; below, the name of the bad value
    values = [("V_wp_Rd", result.V_wp_Rd)] if result.V_wp_Rd is not None else []
    for side in (result.hogging, result.sagging):
        if side is None:
            continue
        values += [(f"{side.sign} M_j_Rd", side.M_j_Rd)]
        if side.V_j_Rd is not None:
            values.append((f"{side.sign} V_j_Rd", side.V_j_Rd))
        values += [(f"{side.sign} {c.component}", c.F_Rd) for c in side.components]
        values += [(f"{side.sign} row {r.row}", r.F_tr_Rd) for r in side.rows]
    for name, v in values:
        if v is None or not math.isfinite(v) or v < 0:
            raise ArithmeticError(f"resistance {name} = {v}: not a finite non-negative number")
    return result


def slender_web(col: MemberInput) -> NotChecked | None:
    """Why the web-panel rules of 6.2.6.1 do not apply (dc/tw > 69 eps), or None."""
    dc = col.h - 2 * col.tf - 2 * col.r
    if cmp.web_panel_slenderness_ok(dc, col.tw, col.fy):
        return None
    return NotChecked(
        NotCheckedCode.WEB_TOO_SLENDER,
        {"ratio": dc / col.tw, "limit": 69 * cmp.epsilon(col.fy)},
    )


def checked(
    inp: JointInput,
    hog: SideResult,
    sag: SideResult,
    *,
    V_j_Rd: float,
    V_wp_Rd: float,
    notes: list[Note],
    joint_kind: str,
) -> CheckResult:
    """A checked joint's result: both signs, shear, classification and the input used."""
    return CheckResult(
        hogging=hog,
        sagging=sag,
        V_j_Rd=V_j_Rd,
        V_wp_Rd=V_wp_Rd,
        classification=classify(inp, hog, sag),
        notes=tuple(notes),
        input=inp,
        joint_kind=joint_kind,
    )


def stiffened_compression(
    inp: JointInput, s: StiffenerInput | None, beff: float
) -> tuple[float, dict, Note] | None:
    """Compression stiffeners with their strip of web: crushing and buckling (N), or None.

    SCI P398 (2013) Step 6B with EN 1993-1-5:2006 9.4 and EN 1993-1-1 6.3.1: the lesser of
    crushing, (A_s,net f_y,s + b_eff,c,wc t_wc f_y,wc) / gamma_M0, and buckling of the
    cruciform section over the clear web depth (curve c). None when no stiffener lines up with
    the compression flange, or its outstand is slender (b_s / t_s > 14 epsilon: then ignored,
    on the safe side, and a note says so).
    """
    if s is None:
        return None
    col, p = inp.column, inp.params
    if not sti.stiffener_outstand_ok(s.b, s.t, s.fy):
        return None
    a_net = 2 * max(s.b - s.snipe, 0.0) * s.t
    crush = sti.stiffener_crushing_Rd(
        a_s_net=a_net, fy_s=s.fy, b_eff_c_wc=beff, t_wc=col.tw, fy_wc=col.fy, params=p
    )
    area = sti.cruciform_area(s.b, s.t, col.tw, col.fy)
    inertia = sti.cruciform_second_moment(s.b, s.t, col.tw)
    hw = col.h - 2 * col.tf
    buckle, lam = sti.stiffener_buckling_Rd(
        area=area, second_moment=inertia, length=hw, fy=min(s.fy, col.fy), params=p
    )
    f = min(crush, buckle)
    inputs = {"A_s_net": a_net, "crushing": crush, "A_cruciform": area, "I_s": inertia,
              "lambda_bar": lam, "buckling": buckle, "L": hw, "snipe": s.snipe}
    note = Note(NoteCode.COMPRESSION_STIFFENER,
                {"F": f, "crushing": crush, "buckling": buckle, "level": s.level})
    return f, inputs, note


def slender_stiffener_note(s: StiffenerInput | None) -> list[Note]:
    """A note when a compression stiffener is too slender to count (b_s / t_s > 14 epsilon)."""
    if s is None or sti.stiffener_outstand_ok(s.b, s.t, s.fy):
        return []
    return [Note(NoteCode.STIFFENER_SLENDER, {"b": s.b, "t": s.t})]


def unique_notes(notes: list[Note]) -> tuple[Note, ...]:
    """The notes in order, each once."""
    seen, out = set(), []
    for n in notes:
        try:
            key = (n.code, tuple(sorted(n.values.items())))
            hash(key)
        except TypeError:  # a value that is a list or a dict
            key = (n.code, repr(sorted(n.values.items())))
        if key not in seen:
            seen.add(key)
            out.append(n)
    return tuple(out)


def pinned_result(
    inp: JointInput,
    comps: list,
    *,
    kind: str,
    tp: float,
    grade: str,
    z: float,
    gaps: list[NotChecked],
    notes: list[Note],
    N_j_Rd_tie: float | None = None,
    conditions: tuple = (),
) -> CheckResult:
    """The result of a nominally pinned joint from its components (shear only, no moment).

    EN 1993-1-8:2005 5.2.2.2: Mj,Rd = 0 on both signs; Vj,Rd is the least of the shear
    components (``Zone.SHEAR``; tying components, and the supporting web that also takes the
    other side's reaction, are kept beside them). Classified
    nominally pinned when the plate is thin enough to rotate (``ec3.pinned``: design guide
    for pinned joints), otherwise not classified, with the reason. Assumed welds are said.
    """
    shear = [c for c in comps if EN_1993_1_8.components[c.component].zone == Zone.SHEAR]
    gov = min(shear, key=lambda c: c.F_Rd)
    if getattr(inp, "notch", ""):  # a notched beam's web and its stability: not checked
        gaps = [*gaps, NotChecked(NotCheckedCode.NOTCH_NOT_CHECKED, {"where": inp.notch})]
    d = inp.bolts.d
    if inp.welds.assumed:
        notes = [*notes, Note(NoteCode.WELDS_ASSUMED, {"a_top": 0.0, "a_bottom": 0.0,
                                                       "a_web": inp.welds.web_throat})]
    ratio = pin.ductile_fin_plate_ratio(grade)
    if tp <= ratio * d:
        cls = Classification(stiffness=StiffnessClass.PINNED)
    else:
        cls = Classification(stiffness_gap=NotChecked(NotCheckedCode.NOT_DUCTILE, {
            "tp": tp, "d": d, "ratio": ratio}))
    limit = Limit(gov.component, LimitScope.COMPONENT)
    no_moment = NotChecked(NotCheckedCode.PINNED_NO_MOMENT)
    sides = [SideResult(sign=sign, M_j_Rd=0.0, z=z, rows=(), components=tuple(comps),
                        S_j_ini=None, governing=limit, V_j_Rd=gov.F_Rd, no_tension=no_moment)
             for sign in ("hogging", "sagging")]
    return CheckResult(hogging=sides[0], sagging=sides[1], V_j_Rd=gov.F_Rd, V_wp_Rd=None,
                       classification=cls, notes=tuple(notes), input=inp, joint_kind=kind,
                       gaps=tuple(gaps), N_j_Rd_tie=N_j_Rd_tie, conditions=tuple(conditions))


#: Supports that are a web (of a column, or of a primary beam for a beam-to-beam joint).
WEB_SUPPORTS = frozenset({"web", "beam_web"})


def supporting_web(inp: JointInput, hp: float, plate: tuple[float, float] | None = None):
    """The supporting web's local shear, and (for a welded plate) its punching rule.

    ``inp.column`` is the supporting member (a column, or the primary beam of a beam-to-beam
    joint), ``hp`` the depth of the plate on its web; ``plate`` gives (t_p, f_y,p) of a plate
    welded to the web (fin plate), None for a bolted one. Returns ([component], [condition]);
    both empty when the support is a flange (the design guides check a flange support for
    neither). Local shear and punching: ``ec3.pinned`` (design guides for pinned joints).
    """
    if getattr(inp, "support", "flange") not in WEB_SUPPORTS:
        return [], []
    sup, p = inp.column, inp.params
    comps = [ComponentResult(
        clause=Clause(pin.GUIDE, "supporting web (from memory)"),
        component=Component.SUPPORT_WEB_SHEAR,
        F_Rd=pin.V_Rd_supporting_web_local_shear(hp, sup.tw, sup.fy, p),
        inputs={"h_p": hp, "t_w": sup.tw, "f_y": sup.fy, "support": sup.name})]
    conds = []
    if plate is not None:
        tp, fy_p = plate
        conds.append(Condition(
            clause=Clause(pin.GUIDE, "supporting web, punching "
                          "(common practice, from memory)"),
            name="punching", measured=tp,
            limit=pin.punching_thickness_limit(sup.tw, sup.fu, fy_p, p),
            inputs={"t_w": sup.tw, "f_u_w": sup.fu, "f_y_p": fy_p, "gamma_M2": p.gamma_M2}))
    return comps, conds
