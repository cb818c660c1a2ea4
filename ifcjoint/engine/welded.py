"""Check of a beam welded to a column flange, EN 1993-1-8 component method (N, mm, MPa)."""

from __future__ import annotations

import math

from ifcjoint.ec3 import components as cmp
from ifcjoint.ec3 import stiffness as stf
from ifcjoint.ec3.code import EN_1993_1_8 as EC3
from ifcjoint.ec3.code import Component
from ifcjoint.ec3.moment_resistance import Limit, LimitScope, RowResult
from ifcjoint.engine.common import (
    ColumnWeb,
    beam_M_c_Rd,
    checked,
    column_web,
    resistances_valid,
    slender_stiffener_note,
    slender_web,
    stiffened_compression,
    stiffener_at,
    unique_notes,
    weld_notes,
)
from ifcjoint.engine.inputs import WeldedJointInput
from ifcjoint.engine.results import ComponentResult, SideResult, not_checked
from ifcjoint.model.codes import NotChecked, NotCheckedCode, Note, NoteCode


def check_welded_joint(inp: WeldedJointInput):
    """Resistance, stiffness and classification of a welded beam-to-column joint.

    EN 1993-1-8:2005, 6.2.7.2 with the welded components: column web panel in shear
    (6.2.6.1), column web in compression (6.2.6.2, Eq. 6.10; with compression stiffeners as
    SCI P398 Step 6B) and in tension (6.2.6.3, Eq. 6.16), column flange in bending
    (6.2.6.4.3), beam flange and web in compression (6.2.6.7), the beam flange welds
    (4.5.3.3); lever arm h - t_fb (Figure 6.15); Sj,ini from k1, k2, k3 (6.3.1, Table 6.11,
    k2 and k3 infinite where a stiffener lines up with the flange); Vj,Rd from the web welds.
    """
    col, beam, w, p = inp.column, inp.beam, inp.welds, inp.params
    slender = slender_web(col)
    if slender is not None:
        return not_checked(slender)
    mc_rd, cls = beam_M_c_Rd(beam, p)
    if mc_rd is None:
        return not_checked(
            NotChecked(NotCheckedCode.CLASS_4_BEAM, {"section": beam.name, "class": cls})
        )
    web = column_web(inp)
    fvw_web = cmp.f_vw_d(min(beam.fu, col.fu), cmp.BETA_W.get(beam.grade, 1.0), p)
    vjrd = 2 * w.web_throat * (beam.h - 2 * beam.tf) * fvw_web
    notes = [Note(NoteCode.SHEAR_FROM_WELDS), *web.notes, *weld_notes(w)]
    hog = _side(inp, "hogging", w.top_flange_throat, w.bottom_flange_throat, web, notes)
    sag = _side(inp, "sagging", w.bottom_flange_throat, w.top_flange_throat, web, notes)
    if cls == 3:
        notes.append(Note(NoteCode.BEAM_CLASS_3, {"section": beam.name}))
    if inp.stiffeners or inp.web_plates:
        notes.append(Note(NoteCode.STIFFNESS_UNREINFORCED))
    r = checked(inp, hog, sag, V_j_Rd=vjrd, V_wp_Rd=web.v_wp_Rd,
                notes=list(unique_notes(notes)), joint_kind="welded")
    return resistances_valid(r)


def _side(
    inp: WeldedJointInput, sign: str, a_t: float, a_c: float, web: ColumnWeb, notes: list
) -> SideResult:
    """One moment sign: the flange force limited by the weakest component, times h - t_fb."""
    col, beam, p = inp.column, inp.beam, inp.params
    dc = col.h - 2 * col.tf - 2 * col.r
    z = beam.h - beam.tf
    d_t = beam.tf / 2 if sign == "hogging" else beam.h - beam.tf / 2
    d_c = beam.h - beam.tf / 2 if sign == "hogging" else beam.tf / 2
    beff_c = cmp.b_eff_c_wc_welded(beam.tf, a_c, col.tf, col.s)
    beff_t = cmp.b_eff_c_wc_welded(beam.tf, a_t, col.tf, col.s)
    fcwc = cmp.F_c_wc_Rd(
        b_eff=beff_c,
        t_wc=web.t_compression,
        d_wc=dc,
        fy_wc=col.fy,
        omega_=cmp.omega(inp.beta, beff_c, col.tw, web.a_vc),
        k_wc_=cmp.k_wc(inp.sigma_com_Ed, col.fy),
        params=p,
    )
    ftwc = cmp.F_t_wc_Rd(
        b_eff=beff_t, t_wc=web.t_tension, fy_wc=col.fy,
        omega_=cmp.omega(inp.beta, beff_t, col.tw, web.a_vc), params=p,
    )
    bfc = cmp.b_eff_b_fc_welded(col.tw, col.s, col.tf, beam.tf, col.fy, beam.fy)
    ffc = cmp.F_fc_Rd_welded(bfc, beam.tf, beam.fy, p)
    mc_rd, _ = beam_M_c_Rd(beam, p)
    fcfb = cmp.F_c_fb_Rd(mc_rd, beam.h, beam.tf)
    fvw = cmp.f_vw_d(min(beam.fu, col.fu), cmp.BETA_W.get(beam.grade, 1.0), p)
    fweld = 2 * a_t * beam.b * fvw  # double fillet along the flange width
    s_c = stiffener_at(inp.stiffeners, d_c, beam.tf)
    notes.extend(slender_stiffener_note(s_c))
    stiffened = stiffened_compression(inp, s_c, beff_c)
    parts = [
        ("6.2.6.2", Component.COLUMN_WEB_COMPRESSION, fcwc, {"b_eff_c_wc": beff_c}),
        ("6.2.6.3", Component.COLUMN_WEB_TENSION, ftwc, {"b_eff_t_wc": beff_t}),
        ("6.2.6.4.3", Component.COLUMN_FLANGE_BENDING, ffc, {"b_eff_b_fc": bfc}),
        ("6.2.6.7", Component.BEAM_FLANGE_COMPRESSION, fcfb, {"Mc_Rd": mc_rd}),
        ("4.5.3.3", Component.BEAM_FLANGE_WELD, fweld, {"a": a_t, "f_vw_d": fvw}),
    ]
    if stiffened is not None:
        f, extra, note = stiffened
        notes.append(note)
        parts[0] = ("6.2.6.2; EN 1993-1-5 9.4", Component.STIFFENED_WEB_COMPRESSION,
                    max(f, fcwc), extra)
    if inp.beta > 0:
        parts.append(("6.2.6.1", Component.WEB_PANEL_SHEAR_OVER_BETA, web.v_wp_Rd / inp.beta,
                      {"A_vc": web.a_vc}))
    comps = [
        ComponentResult(clause=EC3.clause(cl), component=c, F_Rd=f, inputs=extra)
        for cl, c, f, extra in parts
    ]
    gov = min(comps, key=lambda c: c.F_Rd)
    limit = Limit(gov.component, LimitScope.COMPONENT)
    cands = tuple((c.component, LimitScope.COMPONENT, 0, 0, c.F_Rd) for c in comps)
    row = RowResult(row=1, h_r=z, F_tr_Rd=gov.F_Rd, limited_by=limit, raw_candidates=cands)
    k1 = stf.k1_web_panel(web.a_vc_plain, inp.beta, z)
    k2 = math.inf if stiffened is not None else stf.k2_web_compression(beff_c, col.tw, dc)
    s_t = stiffener_at(inp.stiffeners, d_t, beam.tf)
    # Table 6.11: k3 is infinite for a stiffened welded connection
    k3 = math.inf if s_t is not None else stf.k3_web_tension(beff_t, col.tw, dc)
    if s_t is not None:
        notes.append(Note(NoteCode.TENSION_STIFFENER_WELDED))
    return SideResult(
        sign=sign,
        M_j_Rd=gov.F_Rd * z,
        z=z,
        rows=(row,),
        components=tuple(comps),
        S_j_ini=stf.S_j_ini(z, [k1, k2, k3], p),
        governing=limit,
        F_t_half_Rd=min(ftwc, ffc, fweld),
        F_c_flange_Rd=min(comps[0].F_Rd, fcfb),
        V_j_Rd=2 * inp.welds.web_throat * (beam.h - 2 * beam.tf) * fvw,
    )



