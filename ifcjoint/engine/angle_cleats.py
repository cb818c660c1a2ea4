"""Check of double angle web cleats: a nominally pinned beam end in shear, and its tying.

Two angles, one each side of the beam web: one line of bolts through the web in double shear
carries the shear at its lever arm z (the support face to that line), the support side has
one line per cleat. The components, as the design guide for pinned joints lays them out for
angle web cleats (``ec3.pinned.GUIDE``, section 4) with the resistances of EN 1993-1-8: the
web-side bolt group (shear and bearing on the cleats and on the beam web, Table 3.4 with the
group's eccentricity factors), the support-side bolts (0.8 n F_v,Rd, allowing for their
tension, from memory) and their bearing, the cleats' gross and net shear and block tearing
(3.10.2), the beam web's shear (and block tearing where the beam is notched), the supporting
web's local shear on a web. Tying (gamma_Mu): bolts in shear, bearing on cleats and beam web,
cleat and web block tearing, the beam web's net section, and the cleats' support-side legs
in bending as T-stubs. Vj,Rd is the least shear component; no moment (5.2.2.2).
"""

from __future__ import annotations

import math
from dataclasses import replace

from ifcjoint.ec3 import bolts as blt
from ifcjoint.ec3 import pinned as pin
from ifcjoint.ec3.code import EN_1993_1_8 as EC3
from ifcjoint.ec3.code import Clause, Component
from ifcjoint.engine.common import pinned_result, supporting_web
from ifcjoint.engine.inputs import AngleCleatJointInput
from ifcjoint.engine.results import CheckResult, ComponentResult
from ifcjoint.model.codes import Note, NoteCode

#: Share of the support-side bolts' shear resistance, for the tension the cleats' rotation
#: puts in them: design guide for pinned joints (as for partial-depth end plates; from memory).
SUPPORT_BOLT_SHARE = 0.8


def _guide(ref: str = "4") -> Clause:
    return Clause(pin.GUIDE, ref)


def _bearing(inp: AngleCleatJointInput, t: float, fu: float, *, e1: float | None,
             e2: float | None) -> tuple[float, float, dict]:
    """Bearing of one web-side bolt on a ply, vertical and horizontal (Table 3.4).

    ``e1``: the end distance below (or above) the end row (None: the ply continues); ``e2``:
    from the bolt line to the ply's edge along the beam.
    """
    b, p = inp.bolts, inp.params
    p1 = b.p1 if b.n1 > 1 else None
    k1_v = blt.k1_bearing(d0=b.d0, e2=e2)
    ab_v = blt.alpha_b(d0=b.d0, fub=b.fub, fu=fu, e1=e1, p1=p1)
    k1_h = blt.k1_bearing(d0=b.d0, e2=e1, p2=p1)
    ab_h = blt.alpha_b(d0=b.d0, fub=b.fub, fu=fu, e1=e2)
    f_v = blt.F_b_Rd(k1_v, ab_v, fu, b.d, t, p)
    f_h = blt.F_b_Rd(k1_h, ab_h, fu, b.d, t, p)
    return f_v, f_h, {"k1_ver": round(k1_v, 3), "alpha_b_ver": round(ab_v, 3),
                      "F_b_ver_Rd_kN": round(f_v / 1e3, 1), "k1_hor": round(k1_h, 3),
                      "alpha_b_hor": round(ab_h, 3), "F_b_hor_Rd_kN": round(f_h / 1e3, 1),
                      "t": t}


def _cleat_areas(inp: AngleCleatJointInput, e2: float) -> tuple[float, float, float]:
    """One cleat leg's net shear area and its block's A_nt, A_nv (load down the leg)."""
    c, b = inp.cleats, inp.bolts
    a_v_net = c.t * (c.hp - b.n1 * b.d0)
    a_nt = c.t * (e2 - 0.5 * b.d0)
    a_nv = c.t * (c.hp - c.e1 - (b.n1 - 0.5) * b.d0)
    return a_v_net, a_nt, a_nv


def cleat_components(inp: AngleCleatJointInput) -> list[ComponentResult]:
    """Every shear component of the joint (see the module docstring)."""
    c, b, beam, col, p = inp.cleats, inp.bolts, inp.beam, inp.column, inp.params
    n = b.n1
    alpha, beta = pin.bolt_group_factors(n, 1, b.p1, 0.0, c.z)
    group = {"n": n, "alpha": round(alpha, 4), "beta": round(beta, 4), "z": c.z}
    fv = blt.F_v_Rd(b.grade, b.fub, b.As, p)
    cv, ch, cleat_b = _bearing(inp, c.t, c.fu, e1=c.e1, e2=c.e2_web)
    wv, wh, web_b = _bearing(inp, beam.tw, beam.fu, e1=inp.e1_beam, e2=inp.e2_beam)
    t_sup = col.tf if inp.support == "flange" else col.tw
    p1 = b.p1 if b.n1 > 1 else None
    fb_cleat_sup = blt.F_b_Rd(blt.k1_bearing(d0=b.d0, e2=c.e2_sup),
                              blt.alpha_b(d0=b.d0, fub=b.fub, fu=c.fu, e1=c.e1, p1=p1),
                              c.fu, b.d, c.t, p)
    fb_sup = blt.F_b_Rd(blt.k1_bearing(d0=b.d0), blt.alpha_b(d0=b.d0, fub=b.fub, fu=col.fu,
                                                             p1=p1), col.fu, b.d, t_sup, p)
    ns = 2 * n
    gross = c.hp * c.t * c.fy / (math.sqrt(3) * p.gamma_M0)
    legs = []
    for e2 in (c.e2_web, c.e2_sup):
        a_v_net, a_nt, a_nv = _cleat_areas(inp, e2)
        legs.append(min(gross, pin.V_Rd_net_shear(a_v_net, c.fu, p),
                        pin.V_Rd_block_tearing_eccentric(a_nt, a_nv, c.fu, c.fy, p)))
    hw = beam.h - 2 * beam.tf
    area = 2 * beam.b * beam.tf + hw * beam.tw + (4 - math.pi) * beam.r ** 2
    a_v = pin.A_v_rolled_i(area, beam.b, beam.tf, beam.tw, beam.r, hw)
    parts = [
        (_guide(), Component.CLEAT_WEB_BOLTS,
         2 * pin.V_Rd_bolt_group_shear(n, fv, alpha, beta),
         {**group, "F_v_Rd_kN": round(fv / 1e3, 1), "shear_planes": 2}),
        (_guide(), Component.CLEAT_BEARING,
         2 * pin.V_Rd_bolt_group_bearing(n, alpha, beta, cv, ch), {**group, **cleat_b}),
        (_guide(), Component.CLEAT_BEAM_WEB_BEARING,
         pin.V_Rd_bolt_group_bearing(n, alpha, beta, wv, wh), {**group, **web_b}),
        (_guide(), Component.CLEAT_SUPPORT_BOLTS, SUPPORT_BOLT_SHARE * ns * fv,
         {"n_s": ns, "share": SUPPORT_BOLT_SHARE}),
        (EC3.clause("Table 3.4"), Component.CLEAT_SUPPORT_BEARING,
         ns * min(fb_cleat_sup, fb_sup),
         {"n_s": ns, "F_b_cleat_kN": round(fb_cleat_sup / 1e3, 1),
          "F_b_support_kN": round(fb_sup / 1e3, 1), "t_support": t_sup}),
        (EC3.clause("3.10.2"), Component.CLEAT_SHEAR, 2 * min(legs),
         {"web_leg_kN": round(2 * legs[0] / 1e3, 1), "support_leg_kN": round(2 * legs[1] / 1e3, 1),
          "gross_kN": round(2 * gross / 1e3, 1)}),
        (Clause("EN 1993-1-1", "6.2.6"), Component.BEAM_WEB_GROSS_SHEAR,
         pin.V_pl_Rd(a_v, beam.fy, p), {"A_v": round(a_v, 1), "f_y": beam.fy}),
        (_guide(), Component.BEAM_WEB_NET_SHEAR,
         pin.V_Rd_net_shear(a_v - n * b.d0 * beam.tw, beam.fu, p),
         {"A_v_net": round(a_v - n * b.d0 * beam.tw, 1), "f_u": beam.fu}),
    ]
    if inp.e1_beam is not None:  # a notched web: its block above the bolts
        a_nt = beam.tw * (inp.e2_beam - 0.5 * b.d0)
        a_nv = beam.tw * (inp.e1_beam + (n - 1) * b.p1 - (n - 0.5) * b.d0)
        parts.append((EC3.clause("3.10.2(3)"), Component.CLEAT_BEAM_WEB_BLOCK,
                      pin.V_Rd_block_tearing_eccentric(a_nt, a_nv, beam.fu, beam.fy, p),
                      {"A_nt": round(a_nt, 1), "A_nv": round(a_nv, 1)}))
    return [ComponentResult(clause=cl, component=k, F_Rd=v, inputs=x) for cl, k, v, x in parts]


def cleat_tying_components(inp: AngleCleatJointInput) -> list[ComponentResult]:
    """The joint's resistances to an axial tension (tying), gamma_Mu for gamma_M2.

    Design guide for pinned joints, section 4 (tying): the web-side bolts in double shear,
    bearing along the beam on the two cleats and on the beam web (Table 3.4), the cleats' and
    the web's block tearing (tension across the rows, shear along the line to its end), the
    web's net section over the cleat length (0.9 A_net f_u), and the cleats' support-side
    legs in bending: T-stubs of length h_a with m = (cross-centres - t_w) / 2 - t_a - 0.8 r
    and n = min(e2, 1.25 m), modes 1 (4 M_pl / m), 2 and 3 of EN 1993-1-8 Table 6.2 (prying
    assumed; mode 1 by its first method).
    """
    c, b, beam, p = inp.cleats, inp.bolts, inp.beam, inp.params
    pu = replace(p, gamma_M2=p.gamma_Mu)
    tie = replace(inp, params=pu)
    n = b.n1
    _, ch, cleat_b = _bearing(tie, c.t, c.fu, e1=c.e1, e2=c.e2_web)
    _, wh, web_b = _bearing(tie, beam.tw, beam.fu, e1=inp.e1_beam, e2=inp.e2_beam)
    gu = {"gamma_Mu": p.gamma_Mu}
    inner = (n - 1) * (b.p1 - b.d0)
    cleat_nt, cleat_nv = 2 * c.t * inner, 2 * 2 * c.t * (c.e2_web - 0.5 * b.d0)
    web_nt, web_nv = beam.tw * inner, 2 * beam.tw * (inp.e2_beam - 0.5 * b.d0)
    a_net = beam.tw * (c.hp - n * b.d0)
    m = (c.cross_centres - beam.tw) / 2 - c.t - 0.8 * c.r
    n_e = min(c.e2_sup, 1.25 * m)
    m_pl = 0.25 * c.hp * c.t ** 2 * c.fy / p.gamma_Mu
    ft = n * blt.F_t_Rd(b.fub, b.As, pu)  # the bolts of one cleat's support-side line
    modes = (4 * m_pl / m, (2 * m_pl + n_e * ft) / (m + n_e), ft)
    parts = [
        (Component.TIE_BOLT_SHEAR, 2 * n * blt.F_v_Rd(b.grade, b.fub, b.As, pu),
         {"n": n, "shear_planes": 2, **gu}),
        (Component.TIE_CLEAT_BEARING, 2 * n * ch,
         {"n": n, "k1": cleat_b["k1_hor"], "alpha_b": cleat_b["alpha_b_hor"], **gu}),
        (Component.TIE_CLEAT_BLOCK_TEARING, pin.N_Rd_block_tearing_tie(cleat_nt, cleat_nv,
                                                                      c.fu, c.fy, p),
         {"A_nt": round(cleat_nt, 1), "A_nv": round(cleat_nv, 1), **gu}),
        (Component.TIE_BEAM_WEB_BEARING, n * wh,
         {"n": n, "k1": web_b["k1_hor"], "alpha_b": web_b["alpha_b_hor"], **gu}),
        (Component.TIE_BEAM_WEB_TENSION, pin.N_Rd_net_tension_tie(a_net, beam.fu, p),
         {"A_net": round(a_net, 1), **gu}),
        (Component.TIE_BEAM_WEB_BLOCK_TEARING, pin.N_Rd_block_tearing_tie(web_nt, web_nv,
                                                                          beam.fu, beam.fy, p),
         {"A_nt": round(web_nt, 1), "A_nv": round(web_nv, 1), **gu}),
        (Component.TIE_CLEAT_BENDING, 2 * min(modes),
         {"m": round(m, 2), "n": round(n_e, 2), "mode": 1 + modes.index(min(modes)), **gu}),
    ]
    return [ComponentResult(clause=_guide("4 (tying)"), component=k, F_Rd=v, inputs=x)
            for k, v, x in parts]


def check_angle_cleat_joint(inp: AngleCleatJointInput) -> CheckResult:
    """Shear resistance Vj,Rd of a double angle web cleat joint, its tying resistance.

    EN 1993-1-8:2005 Table 3.4 (bolts), 3.10.2 (block tearing), 5.2.2.2 (nominally pinned);
    EN 1993-1-1 6.2.6 (beam web); the eccentric bolt group and the cleat checks as in the
    design guide for pinned joints (``ec3.pinned.GUIDE``, section 4). On a web, the web's
    local shear is added (``engine.common.supporting_web``).
    """
    c = inp.cleats
    comps = cleat_components(inp)
    web, _ = supporting_web(inp, c.hp)
    ties = cleat_tying_components(inp)
    notes = [Note(NoteCode.BEAM_WEB_UNNOTCHED)] if inp.e1_beam is None else []
    return pinned_result(inp, comps + web + ties, kind="angle_cleats", tp=c.t, grade=c.grade,
                         z=c.z, gaps=[], notes=notes, N_j_Rd_tie=min(t.F_Rd for t in ties))
