"""What the end-plate and welded checks share: shear area, classification, column plates."""

from __future__ import annotations

import math

from ifcjoint.catalogue.sections import ISection
from ifcjoint.ec3 import components as cmp
from ifcjoint.ec3 import stiffness as stf
from ifcjoint.engine.inputs import JointInput, MemberInput, WeldsInput
from ifcjoint.engine.results import CheckResult, Classification, SideResult
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


def stiffened_at(depths: tuple[float, ...], flange_depth: float, t_f: float) -> bool:
    """Whether a transverse column stiffener lines up with a beam flange.

    Common practice, no source: within t_f / 2 + 25 mm of the flange's mid-plane.
    """
    return any(abs(d - flange_depth) <= t_f / 2 + STIFFENER_REACH for d in depths)


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
    if beam.span and beam.Iy:
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
        return []
    throats = {"a_top": w.top_flange_throat, "a_bottom": w.bottom_flange_throat}
    return [Note(NoteCode.WELDS_ASSUMED, {**throats, "a_web": w.web_throat})]


def column_plate_notes(inp: JointInput) -> list[Note]:
    """What the check does with column stiffeners and web plates (EN 1993-1-8 6.2.6, 6.3.2)."""
    notes = []
    if inp.stiffeners:
        notes.append(Note(NoteCode.STIFFENERS_IGNORED, {"n": len(inp.stiffeners)}))
    if inp.supplementary_web_plates:
        notes.append(Note(NoteCode.WEB_PLATES_IGNORED, {"n": len(inp.supplementary_web_plates)}))
    return notes


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
