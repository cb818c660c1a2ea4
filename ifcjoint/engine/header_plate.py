"""Check of a partial-depth (header) end plate: a nominally pinned beam end in shear.

The plate is welded to the beam web only and bolted to the column with two bolt lines. The
components, as for a fin plate but with the shear through the bolt group's centre (no lever
arm): the bolts in shear, bearing on the plate and on the column, the plate's gross and net
shear and block tearing (two planes, one each side of the web), the beam web's shear over
the plate depth, and the welds to the web. Vj,Rd is the least of them; the joint carries no
moment (EN 1993-1-8 5.2.2.2). Tying is not checked here (an axial force is a gap, said).
"""

from __future__ import annotations

import math

from ifcjoint.ec3 import bolts as blt
from ifcjoint.ec3 import components as cmp
from ifcjoint.ec3 import pinned as pin
from ifcjoint.ec3.code import EN_1993_1_8 as EC3
from ifcjoint.ec3.code import Clause, Component
from ifcjoint.engine.common import pinned_result, supporting_web
from ifcjoint.engine.inputs import HeaderPlateJointInput
from ifcjoint.engine.results import CheckResult, ComponentResult

#: Share of the bolts' shear resistance a header plate's bolt group may use, allowing for the
#: tension the plate's rotation puts in them: design guide for pinned joints (partial-depth
#: end plates), from memory.
BOLT_SHEAR_SHARE = 0.8


def _bearing_per_bolt(inp: HeaderPlateJointInput, t: float, fu: float,
                      e1: float | None, e2: float | None) -> tuple[float, dict]:
    """The least bearing resistance of one bolt on a ply, vertical load (Table 3.4)."""
    b = inp.bolts
    p1 = b.p1 if b.n1 > 1 else None
    k1 = blt.k1_bearing(d0=b.d0, e2=e2, p2=b.gauge if e2 is None else None)
    ab = blt.alpha_b(d0=b.d0, fub=b.fub, fu=fu, e1=e1, p1=p1)
    f = blt.F_b_Rd(k1, ab, fu, b.d, t, inp.params)
    return f, {"k1": round(k1, 3), "alpha_b": round(ab, 3), "F_b_Rd_kN": round(f / 1e3, 1),
               "t": t}


def header_plate_components(inp: HeaderPlateJointInput) -> list[ComponentResult]:
    """Every shear component of the joint (see the module docstring)."""
    h, b, beam, col, p = inp.header, inp.bolts, inp.beam, inp.column, inp.params
    n = b.n1 * b.n2
    guide = Clause(pin.GUIDE, "2")
    fv = blt.F_v_Rd(b.grade, b.fub, b.As, p)
    fb_plate, x_plate = _bearing_per_bolt(inp, h.tp, h.fu, h.e1_bottom, h.e2)
    t_sup = col.tf if inp.support == "flange" else col.tw
    fb_sup, x_sup = _bearing_per_bolt(inp, t_sup, col.fu, None, None)
    a_nt = h.tp * (h.e2 - 0.5 * b.d0)
    # the shear planes run to the farther plate edge: the smaller area, on the safe side
    a_nv = h.tp * (h.hp - max(h.e1_top, h.e1_bottom) - (b.n1 - 0.5) * b.d0)
    fvw = cmp.f_vw_d(min(beam.fu, h.fu), cmp.BETA_W.get(h.grade[:4], 1.0), p)
    a_w = inp.welds.web_throat
    parts = [
        (guide, Component.HEADER_BOLT_SHEAR, BOLT_SHEAR_SHARE * n * fv,
         {"n": n, "F_v_Rd_kN": round(fv / 1e3, 1), "share": BOLT_SHEAR_SHARE}),
        (EC3.clause("Table 3.4"), Component.HEADER_PLATE_BEARING, n * fb_plate,
         {"n": n, **x_plate}),
        (EC3.clause("Table 3.4"), Component.HEADER_SUPPORT_BEARING, n * fb_sup,
         {"n": n, **x_sup}),
        (guide, Component.HEADER_PLATE_GROSS_SHEAR,
         2 * pin.V_Rd_plate_gross_shear(h.hp, h.tp, h.fy, p), {"h_p": h.hp, "t_p": h.tp}),
        (guide, Component.HEADER_PLATE_NET_SHEAR,
         2 * pin.V_Rd_net_shear(h.tp * (h.hp - b.n1 * b.d0), h.fu, p),
         {"A_v_net": round(h.tp * (h.hp - b.n1 * b.d0), 1)}),
        (EC3.clause("3.10.2(2)"), Component.HEADER_PLATE_BLOCK_TEARING,
         2 * (h.fu * a_nt / p.gamma_M2 + h.fy * a_nv / (math.sqrt(3) * p.gamma_M0)),
         {"A_nt": round(a_nt, 1), "A_nv": round(a_nv, 1)}),
        (Clause("EN 1993-1-1", "6.2.6"), Component.HEADER_BEAM_WEB_SHEAR,
         pin.V_pl_Rd(h.hp * beam.tw, beam.fy, p), {"A_v": round(h.hp * beam.tw, 1)}),
        (EC3.clause("4.5.3.3"), Component.HEADER_WELD, pin.V_Rd_fillet_welds(a_w, h.hp, fvw),
         {"a": a_w, "f_vw_d": round(fvw, 1), "assumed": inp.welds.assumed}),
    ]
    return [ComponentResult(clause=cl, component=c, F_Rd=v, inputs=x) for cl, c, v, x in parts]


def check_header_plate_joint(inp: HeaderPlateJointInput) -> CheckResult:
    """Shear resistance Vj,Rd of a partial-depth end plate joint; no moment.

    EN 1993-1-8:2005 Table 3.4 (bolts), 3.10.2(2) (block tearing, concentric), 4.5.3.3
    (welds), 5.2.2.2 (nominally pinned); EN 1993-1-1 6.2.6 (beam web); the plate's gross and
    net shear and the bolts' 0.8 as in the design guide for pinned joints (partial-depth end
    plates; the 0.8 from memory). On a web (of a column or a primary beam), the web's local
    shear is added (``engine.common.supporting_web``).
    """
    h = inp.header
    web, _ = supporting_web(inp, h.hp)
    return pinned_result(inp, header_plate_components(inp) + web, kind="header_plate",
                         tp=h.tp, grade=h.grade, z=0.0, gaps=[], notes=[])
