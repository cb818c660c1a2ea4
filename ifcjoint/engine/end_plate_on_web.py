"""An end plate bolted to a web (a column's, minor axis; or a primary beam's): the shear path.

EN 1993-1-8's component method has no component for a web loaded in bending out of its plane
(its T-stubs are a column flange and an end plate; 6.2.6 lists no column web in bending), so
the moment resistance, the rotational stiffness and the classification of such a joint are
not determined: the result says so, and the joint is never passed. What the standard does
give is checked, so a joint that fails it fails whatever the web does: the bolts in shear
and bearing on the end plate and on the web (Table 3.4, with the interaction of a bolt in a
tension row as on a flange), the beam web in shear (EN 1993-1-1 6.2.6), the end plate's welds
to the beam web (4.5.3.3) and the supporting web's local shear (design guides for pinned
joints, ``engine.common.supporting_web``). The end plate and bolts in tension are not
computed alone: without the web's share they bound nothing.
"""

from __future__ import annotations

import math

from ifcjoint.ec3 import components as cmp
from ifcjoint.ec3 import pinned as pin
from ifcjoint.ec3.bolts import ALPHA_V, F_b_Rd, F_v_Rd, alpha_b, k1_bearing
from ifcjoint.ec3.code import EN_1993_1_8 as EC3
from ifcjoint.ec3.code import Clause, Component
from ifcjoint.ec3.detailing import e_min, p1_min, p2_min
from ifcjoint.engine.common import supporting_web
from ifcjoint.engine.inputs import EndPlateJointInput
from ifcjoint.engine.results import (
    CheckResult,
    Classification,
    ComponentResult,
    SideResult,
)
from ifcjoint.model.codes import NotChecked, NotCheckedCode, Note, NoteCode

#: Why the moment is not determined on a web.
NOT_COVERED = NotChecked(NotCheckedCode.WEB_BENDING_NOT_COVERED)


def _bearing(inp: EndPlateJointInput) -> tuple[float, float, dict, NotChecked | None]:
    """Bearing of one bolt on the end plate and on the supporting web, load downwards (N).

    EN 1993-1-8:2005, 3.6.1, Table 3.4: on the plate with its end and side edges, the least
    pitch and the gauge; on the web with no edge (it continues both ways) and its thickness.
    Outside Table 3.3's spacings the formula does not apply (returned as the reason).
    """
    b, pl, sup, p = inp.bolts, inp.plate, inp.column, inp.params
    rows = sorted(b.rows_from_beam_top)
    p1 = min((y - x for x, y in zip(rows, rows[1:], strict=False)), default=None)
    e1 = min(rows[0] + pl.projection_top, pl.projection_bottom + inp.beam.h - rows[-1])
    e2 = (pl.bp - b.gauge) / 2
    for what, value, least in (("e1", e1, e_min(b.d0)), ("e2 (plate)", e2, e_min(b.d0)),
                               ("p2", b.gauge, p2_min(b.d0)),
                               *((("p1", p1, p1_min(b.d0)),) if p1 is not None else ())):
        if value < least - 0.5:
            return 0.0, 0.0, {}, NotChecked(NotCheckedCode.BEARING_OUT_OF_RANGE,
                                            {"what": what, "value": value, "limit": least})
    k1_p, ab_p = k1_bearing(d0=b.d0, e2=e2, p2=b.gauge), alpha_b(d0=b.d0, fub=b.fub, fu=pl.fu,
                                                                  e1=e1, p1=p1)
    k1_w, ab_w = k1_bearing(d0=b.d0, e2=None, p2=b.gauge), alpha_b(d0=b.d0, fub=b.fub,
                                                                    fu=sup.fu, p1=p1)
    fb_p = F_b_Rd(k1_p, ab_p, pl.fu, b.d, pl.tp, p)
    fb_w = F_b_Rd(k1_w, ab_w, sup.fu, b.d, sup.tw, p)
    return fb_p, fb_w, {"k1_plate": round(k1_p, 3), "alpha_b_plate": round(ab_p, 3),
                        "F_b_plate_kN": round(fb_p / 1e3, 1), "k1_web": round(k1_w, 3),
                        "alpha_b_web": round(ab_w, 3), "F_b_web_kN": round(fb_w / 1e3, 1),
                        "t_web": sup.tw}, None


def check_end_plate_on_web(inp: EndPlateJointInput) -> CheckResult:
    """The shear path of an end plate on a web; the moment not determined (module docstring).

    Vj,Rd is the least of the bolts (Table 3.4: 2 bolts per row; a bolt of a row in the upper
    half of the lever arm takes min((1 - 1/1.4) Fv,Rd, Fb,Rd) for the tension a moment would
    give it, as on a flange; the others min(Fv,Rd, Fb,Rd)), the beam web's gross shear and the
    web welds. The supporting web's local shear is beside them (both sides' reactions).
    """
    beam, pl, b, p = inp.beam, inp.plate, inp.bolts, inp.params
    rows = sorted(b.rows_from_beam_top)
    cc = beam.h - beam.tf / 2
    n_t = sum(1 for z in rows if cc - z > (beam.h - beam.tf) / 2)
    fv = F_v_Rd(b.grade, b.fub, b.As, p) if b.grade in ALPHA_V else 0.0
    fb_p, fb_w, bearing, gap = _bearing(inp)
    gaps = [NOT_COVERED]
    comps: list[ComponentResult] = []
    if gap is not None:
        gaps.append(gap)
    else:
        fb = min(fb_p, fb_w)
        v_bolts = 2 * n_t * min((1 - 1 / 1.4) * fv, fb) + 2 * (len(rows) - n_t) * min(fv, fb)
        comps.append(ComponentResult(
            EC3.clause("Table 3.4"), Component.ON_WEB_BOLTS, v_bolts,
            inputs={"n_rows": len(rows), "rows_in_tension": n_t, "F_v_Rd_kN": round(fv / 1e3, 1),
                    **bearing}))
    hw = beam.h - 2 * beam.tf
    area = 2 * beam.b * beam.tf + hw * beam.tw + (4 - math.pi) * beam.r ** 2
    a_v = pin.A_v_rolled_i(area, beam.b, beam.tf, beam.tw, beam.r, hw)
    comps.append(ComponentResult(Clause("EN 1993-1-1", "6.2.6"), Component.BEAM_WEB_GROSS_SHEAR,
                                 pin.V_pl_Rd(a_v, beam.fy, p),
                                 inputs={"A_v": round(a_v, 1), "f_y": beam.fy}))
    a_w = inp.welds.web_throat
    fvw = cmp.f_vw_d(min(beam.fu, pl.fu), cmp.BETA_W.get(beam.grade[:4], 1.0), p)
    comps.append(ComponentResult(EC3.clause("4.5.3.3"), Component.HEADER_WELD,
                                 pin.V_Rd_fillet_welds(a_w, hw, fvw),
                                 inputs={"a": a_w, "length": round(hw, 1),
                                         "f_vw_d": round(fvw, 1),
                                         "assumed": inp.welds.assumed}))
    web, _ = supporting_web(inp, pl.hp)
    comps += web
    shear = [c for c in comps if c.component != Component.SUPPORT_WEB_SHEAR]
    v_j = min(c.F_Rd for c in shear)
    sides = [SideResult(sign=sign, M_j_Rd=0.0, z=cc - min(rows), rows=(),
                        components=tuple(comps), S_j_ini=None, governing=None, V_j_Rd=v_j,
                        no_tension=NOT_COVERED) for sign in ("hogging", "sagging")]
    notes = [Note(NoteCode.WELDS_ASSUMED, {"a_top": inp.welds.top_flange_throat,
                                           "a_bottom": inp.welds.bottom_flange_throat,
                                           "a_web": a_w})] if inp.welds.assumed else []
    return CheckResult(hogging=sides[0], sagging=sides[1], V_j_Rd=v_j, V_wp_Rd=None,
                       classification=Classification(stiffness_gap=NOT_COVERED,
                                                     strength_gap=NOT_COVERED),
                       notes=tuple(notes), input=inp, joint_kind="end_plate_on_web",
                       gaps=tuple(gaps))
