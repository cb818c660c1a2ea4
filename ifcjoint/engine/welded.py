"""Check of a beam welded to a column flange, EN 1993-1-8 component method (N, mm, MPa)."""

from __future__ import annotations

import math

from ifcjoint.ec3 import components as cmp
from ifcjoint.ec3 import stiffness as stf
from ifcjoint.ec3.code import EN_1993_1_8 as EC3
from ifcjoint.ec3.code import Component
from ifcjoint.ec3.moment_resistance import Limit, LimitScope, RowResult
from ifcjoint.engine.common import (
    checked,
    column_plate_notes,
    plastic_modulus,
    shear_area,
    slender_web,
    stiffened_at,
    weld_notes,
)
from ifcjoint.engine.inputs import WeldedJointInput
from ifcjoint.engine.results import CheckResult, ComponentResult, SideResult, not_checked
from ifcjoint.model.codes import Note, NoteCode


def check_welded_joint(inp: WeldedJointInput) -> CheckResult:
    """Resistance, stiffness and classification of a welded beam-to-column joint.

    EN 1993-1-8:2005, 6.2.7.2 with the welded components: column web panel in shear
    (6.2.6.1), column web in compression (6.2.6.2, Eq. 6.10) and in tension (6.2.6.3,
    Eq. 6.16), column flange in bending (6.2.6.4.3), beam flange and web in compression
    (6.2.6.7), the beam flange welds (4.5.3.3); lever arm h - t_fb (Figure 6.15);
    Sj,ini from k1, k2, k3 (6.3.1, Table 6.11); Vj,Rd from the web welds.
    """
    col, beam, w, p = inp.column, inp.beam, inp.welds, inp.params
    slender = slender_web(col)
    if slender is not None:
        return not_checked(slender)
    a_vc = shear_area(col)
    vwp = cmp.V_wp_Rd(col.fy, a_vc, p)
    hog = _side(inp, "hogging", w.top_flange_throat, w.bottom_flange_throat, a_vc, vwp)
    sag = _side(inp, "sagging", w.bottom_flange_throat, w.top_flange_throat, a_vc, vwp)
    fvw_web = cmp.f_vw_d(min(beam.fu, col.fu), cmp.BETA_W.get(beam.grade, 1.0), p)
    vjrd = 2 * w.web_throat * (beam.h - 2 * beam.tf) * fvw_web
    notes = [Note(NoteCode.SHEAR_FROM_WELDS), *column_plate_notes(inp), *weld_notes(w)]
    return checked(inp, hog, sag, V_j_Rd=vjrd, V_wp_Rd=vwp, notes=notes, joint_kind="welded")


def _side(
    inp: WeldedJointInput, sign: str, a_t: float, a_c: float, a_vc: float, vwp: float
) -> SideResult:
    """One moment sign: the flange force limited by the weakest component, times h - t_fb."""
    col, beam, p = inp.column, inp.beam, inp.params
    dc = col.h - 2 * col.tf - 2 * col.r
    z = beam.h - beam.tf
    beff_c = cmp.b_eff_c_wc_welded(beam.tf, a_c, col.tf, col.s)
    beff_t = cmp.b_eff_c_wc_welded(beam.tf, a_t, col.tf, col.s)
    fcwc = cmp.F_c_wc_Rd(
        b_eff=beff_c,
        t_wc=col.tw,
        d_wc=dc,
        fy_wc=col.fy,
        omega_=cmp.omega(inp.beta, beff_c, col.tw, a_vc),
        k_wc_=cmp.k_wc(inp.sigma_com_Ed, col.fy),
        params=p,
    )
    ftwc = cmp.F_t_wc_Rd(
        b_eff=beff_t, t_wc=col.tw, fy_wc=col.fy, omega_=cmp.omega(inp.beta, beff_t, col.tw, a_vc),
        params=p,
    )
    bfc = cmp.b_eff_b_fc_welded(col.tw, col.s, col.tf, beam.tf, col.fy, beam.fy)
    ffc = cmp.F_fc_Rd_welded(bfc, beam.tf, beam.fy, p)
    fcfb = cmp.F_c_fb_Rd(plastic_modulus(beam) * beam.fy / p.gamma_M0, beam.h, beam.tf)
    fvw = cmp.f_vw_d(min(beam.fu, col.fu), cmp.BETA_W.get(beam.grade, 1.0), p)
    fweld = 2 * a_t * beam.b * fvw  # double fillet along the flange width
    panel = vwp / inp.beta if inp.beta > 0 else math.inf
    comps = [
        ComponentResult(clause=EC3.clause(clause), component=c, F_Rd=f, inputs=extra)
        for clause, c, f, extra in (
            ("6.2.6.2", Component.COLUMN_WEB_COMPRESSION, fcwc, {"b_eff_c_wc": beff_c}),
            ("6.2.6.3", Component.COLUMN_WEB_TENSION, ftwc, {"b_eff_t_wc": beff_t}),
            ("6.2.6.4.3", Component.COLUMN_FLANGE_BENDING, ffc, {"b_eff_b_fc": bfc}),
            ("6.2.6.7", Component.BEAM_FLANGE_COMPRESSION, fcfb, {}),
            ("4.5.3.3", Component.BEAM_FLANGE_WELD, fweld, {"a": a_t, "f_vw_d": fvw}),
            ("6.2.6.1", Component.WEB_PANEL_SHEAR_OVER_BETA, panel, {"A_vc": a_vc}),
        )
    ]
    gov = min(comps, key=lambda c: c.F_Rd)
    limit = Limit(gov.component, LimitScope.COMPONENT)
    cands = tuple((Limit(c.component, LimitScope.COMPONENT), c.F_Rd) for c in comps)
    row = RowResult(row=1, h_r=z, F_tr_Rd=gov.F_Rd, limited_by=limit, candidates=cands)
    d_t = beam.tf / 2 if sign == "hogging" else beam.h - beam.tf / 2
    d_c = beam.h - beam.tf / 2 if sign == "hogging" else beam.tf / 2
    depths = inp.stiffener_depths
    k1 = stf.k1_web_panel(a_vc, inp.beta, z)
    k2 = math.inf if stiffened_at(depths, d_c, beam.tf) else stf.k2_web_compression(
        beff_c, col.tw, dc
    )
    k3 = math.inf if stiffened_at(depths, d_t, beam.tf) else stf.k3_web_tension(
        beff_t, col.tw, dc
    )
    return SideResult(
        sign=sign,
        M_j_Rd=gov.F_Rd * z,
        z=z,
        rows=(row,),
        components=tuple(comps),
        S_j_ini=stf.S_j_ini(z, [k1, k2, k3], p),
        governing=limit,
        F_t_half_Rd=min(ftwc, ffc, fweld),
        F_c_flange_Rd=min(fcwc, fcfb),
    )
