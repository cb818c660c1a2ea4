"""Check of a fin plate joint: a nominally pinned beam end in shear (N, mm, MPa).

The components of ``ec3.pinned`` in the order a designer checks them by hand: the bolt group
(shear, bearing on the plate and on the beam web, each with the eccentricity of the group),
the fin plate (gross and net shear, block tearing, bending), the beam web (gross and net
shear) and the welds to the support. Vj,Rd is the least of them. The joint carries no moment
(EN 1993-1-8 5.2.2.2): its Mj,Rd is zero and a moment in the demands fails it.
"""

from __future__ import annotations

from dataclasses import replace

from ifcjoint.ec3 import bolts as blt
from ifcjoint.ec3 import components as cmp
from ifcjoint.ec3 import pinned as pin
from ifcjoint.ec3.code import EN_1993_1_8 as EC3
from ifcjoint.ec3.code import Clause, Component
from ifcjoint.engine.common import pinned_result, supporting_web
from ifcjoint.engine.inputs import FinPlateJointInput
from ifcjoint.engine.results import (
    CheckResult,
    ComponentResult,
)
from ifcjoint.model.codes import (
    NotChecked,
    Note,
    NoteCode,
)


def _guide(ref: str = "3") -> Clause:
    return Clause(pin.GUIDE, ref)


def _bearing(inp: FinPlateJointInput, t: float, fu: float, *, vertical_end: float | None,
             horizontal_end: float | None) -> tuple[float, float, dict]:
    """Bearing resistances of one bolt (vertical, horizontal) on a ply, EN 1993-1-8 Table 3.4.

    ``vertical_end``: the edge distance below the bottom row (None: no edge, e.g. a beam web
    with its flange); ``horizontal_end``: the edge distance beyond the outer line.
    """
    b = inp.bolts
    p1 = b.p1 if b.n1 > 1 else None
    p2 = b.gauge if b.n2 > 1 else None
    k1_v = blt.k1_bearing(d0=b.d0, e2=horizontal_end, p2=p2)
    ab_v = blt.alpha_b(d0=b.d0, fub=b.fub, fu=fu, e1=vertical_end, p1=p1)
    k1_h = blt.k1_bearing(d0=b.d0, e2=vertical_end, p2=p1)
    ab_h = blt.alpha_b(d0=b.d0, fub=b.fub, fu=fu, e1=horizontal_end, p1=p2)
    f_v = blt.F_b_Rd(k1_v, ab_v, fu, b.d, t, inp.params)
    f_h = blt.F_b_Rd(k1_h, ab_h, fu, b.d, t, inp.params)
    return f_v, f_h, {"k1_ver": round(k1_v, 3), "alpha_b_ver": round(ab_v, 3),
                      "F_b_ver_Rd_kN": round(f_v / 1e3, 1), "k1_hor": round(k1_h, 3),
                      "alpha_b_hor": round(ab_h, 3), "F_b_hor_Rd_kN": round(f_h / 1e3, 1),
                      "t": t}


def fin_plate_components(inp: FinPlateJointInput) -> tuple[list[ComponentResult], dict]:
    """Every shear component of the joint (see the module docstring) and the group factors."""
    f, b, beam, p = inp.fin, inp.bolts, inp.beam, inp.params
    n = b.n1 * b.n2
    alpha, beta = pin.bolt_group_factors(b.n1, b.n2, b.p1, b.gauge, f.z)
    group = {"n": n, "alpha": round(alpha, 4), "beta": round(beta, 4), "z": f.z}
    fv = blt.F_v_Rd(b.grade, b.fub, b.As, p)
    bv, bh, plate_b = _bearing(inp, f.tp, f.fu, vertical_end=f.e1_bottom,
                               horizontal_end=f.e2)
    wv, wh, web_b = _bearing(inp, beam.tw, beam.fu, vertical_end=None,
                             horizontal_end=f.e2_beam)
    a_v_net = f.tp * (f.hp - b.n1 * b.d0)
    a_nt = f.tp * (f.e2 + (b.n2 - 1) * b.gauge - (b.n2 - 0.5) * b.d0)
    # the shear planes run to the farther plate edge: the smaller area, on the safe side
    a_nv = f.tp * (f.hp - max(f.e1_top, f.e1_bottom) - (b.n1 - 0.5) * b.d0)
    hw = beam.h - 2 * beam.tf
    area = 2 * beam.b * beam.tf + hw * beam.tw + (4 - 3.141592653589793) * beam.r ** 2
    a_v = pin.A_v_rolled_i(area, beam.b, beam.tf, beam.tw, beam.r, hw)
    fvw = cmp.f_vw_d(min(f.fu, inp.column.fu), cmp.BETA_W.get(f.grade[:4], 1.0), p)
    a_w = inp.welds.web_throat
    z_p = f.z - (b.n2 - 1) * b.gauge / 2  # to the bolt line nearest the support
    lam = pin.fin_plate_slenderness(z_p, f.hp, f.tp)
    parts = [
        (_guide(), Component.BOLT_GROUP_SHEAR, pin.V_Rd_bolt_group_shear(n, fv, alpha, beta),
         {**group, "F_v_Rd_kN": round(fv / 1e3, 1)}),
        (_guide(), Component.PLATE_BEARING,
         pin.V_Rd_bolt_group_bearing(n, alpha, beta, bv, bh), {**group, **plate_b}),
        (_guide(), Component.BEAM_WEB_BEARING,
         pin.V_Rd_bolt_group_bearing(n, alpha, beta, wv, wh), {**group, **web_b}),
        (_guide(), Component.PLATE_GROSS_SHEAR, pin.V_Rd_plate_gross_shear(f.hp, f.tp, f.fy, p),
         {"h_p": f.hp, "t_p": f.tp, "f_y": f.fy}),
        (_guide(), Component.PLATE_NET_SHEAR, pin.V_Rd_net_shear(a_v_net, f.fu, p),
         {"A_v_net": round(a_v_net, 1), "f_u": f.fu}),
        (EC3.clause("3.10.2(3)"), Component.PLATE_BLOCK_TEARING,
         pin.V_Rd_block_tearing_eccentric(a_nt, a_nv, f.fu, f.fy, p),
         {"A_nt": round(a_nt, 1), "A_nv": round(a_nv, 1)}),
        (_guide(), Component.PLATE_BENDING, pin.V_Rd_plate_bending(f.tp, f.hp, f.fy, f.z, p),
         {"z": f.z, "h_p": f.hp, "limit_2.73z": round(pin.NO_BENDING_DEPTH_RATIO * f.z, 1)}),
        *([(_guide("3.2.4"), Component.PLATE_LTB,
             pin.V_Rd_fin_plate_ltb(f.tp, f.hp, f.fy, f.z, z_p, p),
             {"z": f.z, "z_p": z_p, "lambda_LT": round(lam, 1),
              "f_p_LT": round(pin.f_p_LT(lam, f.fy), 1), "gamma_M1": p.gamma_M1})]
          if f.z > f.tp / pin.SHORT_PLATE_RATIO else []),
        (Clause("EN 1993-1-1", "6.2.6"), Component.BEAM_WEB_GROSS_SHEAR,
         pin.V_pl_Rd(a_v, beam.fy, p), {"A_v": round(a_v, 1), "f_y": beam.fy}),
        (_guide(), Component.BEAM_WEB_NET_SHEAR,
         pin.V_Rd_net_shear(a_v - b.n1 * b.d0 * beam.tw, beam.fu, p),
         {"A_v_net": round(a_v - b.n1 * b.d0 * beam.tw, 1), "f_u": beam.fu}),
        (EC3.clause("4.5.3.3"), Component.PLATE_WELD, pin.V_Rd_fillet_welds(a_w, f.hp, fvw),
         {"a": a_w, "f_vw_d": round(fvw, 1), "assumed": inp.welds.assumed}),
    ]
    comps = [ComponentResult(clause=cl, component=c, F_Rd=v, inputs=x) for cl, c, v, x in parts]
    return comps, group


#: The tying components (an axial tension on the joint), apart from the shear ones.
TYING = frozenset({Component.TIE_BOLT_SHEAR, Component.TIE_PLATE_BEARING,
                   Component.TIE_BEAM_WEB_BEARING, Component.TIE_PLATE_TENSION,
                   Component.TIE_PLATE_BLOCK_TEARING, Component.TIE_BEAM_WEB_TENSION})


def tying_components(inp: FinPlateJointInput) -> list[ComponentResult]:
    """The joint's resistances to an axial tension (tying), with gamma_Mu for gamma_M2.

    Design guide for pinned joints, section 3 (tying): bolts in shear, bearing on the plate
    and on the beam web in the direction of the beam (Table 3.4), the plate's net section
    (0.9 A_net f_u / gamma_Mu) and block tearing (the block inside the outer bolts pulled
    out: tension across the rows, shear along the lines), the beam web's net section.
    """
    f, b, beam, p = inp.fin, inp.bolts, inp.beam, inp.params
    pu = replace(p, gamma_M2=p.gamma_Mu)
    n = b.n1 * b.n2
    tie = replace(inp, params=pu)
    _, bh, plate_b = _bearing(tie, f.tp, f.fu, vertical_end=f.e1_bottom, horizontal_end=f.e2)
    _, wh, web_b = _bearing(tie, beam.tw, beam.fu, vertical_end=None, horizontal_end=f.e2_beam)
    a_nt = f.tp * (b.n1 - 1) * (b.p1 - b.d0)
    a_nv = 2 * f.tp * (f.e2 + (b.n2 - 1) * b.gauge - (b.n2 - 0.5) * b.d0)
    gu = {"gamma_Mu": p.gamma_Mu}
    parts = [
        (Component.TIE_BOLT_SHEAR, n * blt.F_v_Rd(b.grade, b.fub, b.As, pu), {"n": n, **gu}),
        (Component.TIE_PLATE_BEARING, n * bh,
         {"n": n, "k1": plate_b["k1_hor"], "alpha_b": plate_b["alpha_b_hor"], **gu}),
        (Component.TIE_BEAM_WEB_BEARING, n * wh,
         {"n": n, "k1": web_b["k1_hor"], "alpha_b": web_b["alpha_b_hor"], **gu}),
        (Component.TIE_PLATE_TENSION,
         pin.N_Rd_net_tension_tie(f.tp * (f.hp - b.n1 * b.d0), f.fu, p),
         {"A_net": round(f.tp * (f.hp - b.n1 * b.d0), 1), **gu}),
        (Component.TIE_PLATE_BLOCK_TEARING,
         pin.N_Rd_block_tearing_tie(a_nt, a_nv, f.fu, f.fy, p),
         {"A_nt": round(a_nt, 1), "A_nv": round(a_nv, 1), **gu}),
        (Component.TIE_BEAM_WEB_TENSION,
         pin.N_Rd_net_tension_tie(beam.tw * (f.hp - b.n1 * b.d0), beam.fu, p),
         {"A_net": round(beam.tw * (f.hp - b.n1 * b.d0), 1), **gu}),
    ]
    return [ComponentResult(clause=_guide("3 (tying)"), component=c, F_Rd=v, inputs=x)
            for c, v, x in parts]


def check_fin_plate_joint(inp: FinPlateJointInput) -> CheckResult:
    """Shear resistance Vj,Rd of a fin plate joint, its components and its classification.

    EN 1993-1-8:2005 Table 3.4 (bolts), 3.10.2 (block tearing), 4.5.3.3 (welds) and
    5.2.2.2 (nominally pinned: no moment); the eccentric bolt group and the plate checks as
    in the design guide for pinned joints (``ec3.pinned``). What is not checked is listed in
    ``gaps``: the joint cannot pass while any remains, though its utilisations are reported.
    A long fin plate (z > t_p / 0.15) adds its lateral torsional buckling; a plate on a web
    (of a column or a primary beam) adds the web's local shear and its punching rule.
    """
    f = inp.fin
    gaps: list[NotChecked] = []
    comps, group = fin_plate_components(inp)
    web, conditions = supporting_web(inp, f.hp, plate=(f.tp, f.fy))
    comps += web
    ties = tying_components(inp)
    notes = [Note(NoteCode.FIN_PLATE_PINNED, {"z": f.z, "alpha": group["alpha"],
                                              "beta": group["beta"]}),
             Note(NoteCode.BEAM_WEB_UNNOTCHED)]
    if min(comps, key=lambda c: c.F_Rd).component == Component.BOLT_GROUP_SHEAR:
        notes.append(Note(NoteCode.BOLT_SHEAR_GOVERNS))
    return pinned_result(inp, comps + ties, kind="fin_plate", tp=f.tp, grade=f.grade, z=f.z,
                         gaps=gaps, notes=notes, N_j_Rd_tie=min(t.F_Rd for t in ties),
                         conditions=conditions)
