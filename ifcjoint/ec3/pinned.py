"""Shear resistances of nominally pinned joints: fin plates (N, mm, MPa).

EN 1993-1-8 gives the resistances of the parts (bolts in shear and bearing, Table 3.4; block
tearing, 3.10.2); how a bolt group carries a shear force applied at a lever arm, and the
plate checks that go with it, follow the public design guide *Steel Buildings in Europe,
Multi-Storey Steel Buildings, Part 5: Joint Design* (2009/2010), section 3 (fin plates),
named ``GUIDE`` in the clauses. Each function names its source on its docstring's second
paragraph.
"""

from __future__ import annotations

import math

from ifcjoint.ec3.params import RECOMMENDED, Parameters

#: The design guide for pinned joints that the eccentric bolt-group and plate checks follow.
GUIDE = "Multi-Storey Steel Buildings Part 5 (joint design guide)"
#: Factor on the fin plate's gross shear resistance, allowing for the bending present at the
#: bolt line (the guide's 1.27; GUIDE section 3).
GROSS_SHEAR_FACTOR = 1.27
#: A fin plate at least this many lever arms deep needs no bending check (GUIDE section 3).
NO_BENDING_DEPTH_RATIO = 2.73
#: A fin plate rotates as a nominally pinned joint (plate and bolt holes yield before the bolts
#: shear) when t_p <= this fraction of the bolt diameter: design guide for pinned joints
#: (``GUIDE``), fin plates; from memory: 0.5 d for S235 and S275, 0.42 d for S355 and above.
DUCTILE_TP_OVER_D = {"S235": 0.5, "S275": 0.5}
DUCTILE_TP_OVER_D_DEFAULT = 0.42


def ductile_fin_plate_ratio(grade: str) -> float:
    """Largest t_p / d of a fin plate that rotates as nominally pinned, by its steel grade.

    Design guide for pinned joints (``GUIDE``), fin plates (values from memory, see
    ``DUCTILE_TP_OVER_D``); an unknown grade takes the stricter value.
    """
    return DUCTILE_TP_OVER_D.get((grade or "")[:4].upper(), DUCTILE_TP_OVER_D_DEFAULT)


#: Lateral torsional buckling of the fin plate is not relevant for z <= tp / 0.15 (GUIDE
#: section 3).
SHORT_PLATE_RATIO = 0.15


def bolt_group_factors(n1: int, n2: int, p1: float, p2: float, z: float) -> tuple[float, float]:
    """Factors alpha and beta of a bolt group carrying a shear at lever arm z (elastic).

    Design guide for pinned joints (``GUIDE``), section 3 (fin plates): with the polar moment of
    the group I = n1 n2 [p2^2 (n2^2 - 1) + p1^2 (n1^2 - 1)] / 12 (here written for one or two
    vertical lines as n1 p2^2 / 2 + n1 (n1^2 - 1) p1^2 / 6 when n2 = 2, and n1 (n1^2 - 1) p1^2 /
    12 when n2 = 1), alpha = z p2 / (2 I) and beta = z p1 (n1 - 1) / (2 I).

    Args:
        n1: bolt rows (vertical).
        n2: bolt lines (horizontal, 1 or 2).
        p1: vertical pitch, mm.
        p2: horizontal gauge between lines (0 for one line), mm.
        z: lever arm: from the support face to the centre of the bolt group, mm.

    Example:
        >>> a, b = bolt_group_factors(5, 2, 70.0, 60.0, 80.25)
        >>> round(a, 4), round(b, 3)
        (0.0225, 0.105)
    """
    i_p = n1 * n2 * (p2 * p2 * (n2 * n2 - 1) + p1 * p1 * (n1 * n1 - 1)) / 12.0
    if i_p <= 0:  # a single bolt: no moment arm within the group
        return 0.0, 0.0
    return z * p2 / (2 * i_p), z * p1 * (n1 - 1) / (2 * i_p)


def V_Rd_bolt_group_shear(n: int, F_v_Rd: float, alpha: float, beta: float) -> float:
    """Shear resistance of an eccentrically loaded bolt group from the bolts' shear (N).

    Design guide for pinned joints (``GUIDE``), section 3:
    V_Rd = n F_v,Rd / sqrt((1 + alpha n)^2 + (beta n)^2), with F_v,Rd of EN 1993-1-8 Table 3.4.
    """
    return n * F_v_Rd / math.hypot(1 + alpha * n, beta * n)


def V_Rd_bolt_group_bearing(n: int, alpha: float, beta: float, F_b_ver: float,
                            F_b_hor: float) -> float:
    """Shear resistance of an eccentrically loaded bolt group from bearing (N).

    Design guide for pinned joints (``GUIDE``), section 3:
    V_Rd = n / sqrt(((1 + alpha n) / F_b,ver,Rd)^2 + (beta n / F_b,hor,Rd)^2) with the bearing
    resistances of one bolt (EN 1993-1-8 Table 3.4) in the vertical and horizontal direction.
    """
    return n / math.hypot((1 + alpha * n) / F_b_ver, beta * n / F_b_hor)


def V_Rd_plate_gross_shear(hp: float, tp: float, fy: float,
                           params: Parameters = RECOMMENDED) -> float:
    """Gross shear resistance of the fin plate (N).

    Design guide for pinned joints (``GUIDE``), section 3:
    V_Rd = hp tp fy / (1.27 sqrt(3) gamma_M0) (the 1.27 allows for bending).
    """
    return hp * tp * fy / (GROSS_SHEAR_FACTOR * math.sqrt(3) * params.gamma_M0)


def V_Rd_net_shear(A_v_net: float, fu: float, params: Parameters = RECOMMENDED) -> float:
    """Net shear resistance of a plate or web through the bolt holes (N).

    Design guide for pinned joints (``GUIDE``), section 3, on the principle of EN 1993-1-8
    3.10.2: V_Rd = A_v,net fu / (sqrt(3) gamma_M2).
    """
    return A_v_net * fu / (math.sqrt(3) * params.gamma_M2)


def V_Rd_block_tearing_eccentric(A_nt: float, A_nv: float, fu: float, fy: float,
                                 params: Parameters = RECOMMENDED) -> float:
    """Block tearing of a bolt group under eccentric shear (N).

    EN 1993-1-8:2005, 3.10.2(3), Eq. (3.10): 0.5 fu A_nt / gamma_M2 + fy A_nv / (sqrt(3)
    gamma_M0).
    """
    return 0.5 * fu * A_nt / params.gamma_M2 + fy * A_nv / (math.sqrt(3) * params.gamma_M0)


def V_Rd_plate_bending(tp: float, hp: float, fy: float, z: float,
                       params: Parameters = RECOMMENDED) -> float:
    """Shear resistance of the fin plate from its bending at the bolt line (N).

    Design guide for pinned joints (``GUIDE``), section 3:
    V_Rd = W_el fy / (z gamma_M0) with W_el = tp hp^2 / 6; not a limit (infinite) when
    hp >= 2.73 z.
    """
    if hp >= NO_BENDING_DEPTH_RATIO * z:
        return math.inf
    return tp * hp * hp / 6.0 * fy / (z * params.gamma_M0)


def A_v_rolled_i(A: float, b: float, tf: float, tw: float, r: float, hw: float,
                 eta: float = 1.0) -> float:
    """Shear area of a rolled I section, load parallel to the web (mm2).

    EN 1993-1-1:2005, 6.2.6(3)a: A_v = A - 2 b tf + (tw + 2 r) tf, at least eta hw tw.
    """
    return max(A - 2 * b * tf + (tw + 2 * r) * tf, eta * hw * tw)


def V_pl_Rd(A_v: float, fy: float, params: Parameters = RECOMMENDED) -> float:
    """Plastic shear resistance V_pl,Rd = A_v fy / (sqrt(3) gamma_M0) (N).

    EN 1993-1-1:2005, 6.2.6(2), Eq. (6.18).
    """
    return A_v * fy / (math.sqrt(3) * params.gamma_M0)


def V_Rd_fillet_welds(a: float, length: float, f_vw_d: float) -> float:
    """Shear resistance of two fillet welds of throat a along a length, simplified method (N).

    EN 1993-1-8:2005, 4.5.3.3: F_w,Rd = f_vw,d a per unit length, two welds.
    """
    return 2 * a * length * f_vw_d


def N_Rd_net_tension_tie(A_net: float, fu: float, params: Parameters = RECOMMENDED) -> float:
    """Tying resistance of a plate's or web's net section (N).

    Design guide for pinned joints (``GUIDE``), section 3 (tying): 0.9 A_net f_u / gamma_Mu,
    with gamma_Mu of the parameters (an accidental design situation).
    """
    return 0.9 * A_net * fu / params.gamma_Mu


def N_Rd_block_tearing_tie(A_nt: float, A_nv: float, fu: float, fy: float,
                           params: Parameters = RECOMMENDED) -> float:
    """Tying resistance of a bolt group's block in tension (concentric, case 1) (N).

    Design guide for pinned joints (``GUIDE``), section 3 (tying), after EN 1993-1-8 3.10.2(2):
    f_u A_nt / gamma_Mu + f_y A_nv / (sqrt(3) gamma_M0).
    """
    return fu * A_nt / params.gamma_Mu + fy * A_nv / (math.sqrt(3) * params.gamma_M0)


#: Modulus of elasticity of the plate buckling curve below, MPa: the value of the British
#: standard the design guide takes the curve from (from memory).
LTB_CURVE_E = 205_000.0
#: Robertson constant of that curve for rolled sections (from memory).
LTB_CURVE_ALPHA = 7.0


def fin_plate_slenderness(z_p: float, hp: float, tp: float) -> float:
    """Slenderness lambda_LT of a long fin plate.

    Design guide for pinned joints (``GUIDE``), section 3.2.4:
    lambda_LT = 2.8 (z_p h_p / (1.5 t_p^2))^0.5, z_p from the support face to the first bolt
    line.
    """
    return 2.8 * math.sqrt(z_p * hp / (1.5 * tp * tp))


def f_p_LT(lambda_lt: float, fy: float) -> float:
    """Lateral torsional buckling strength of a fin plate, MPa.

    Design guide for pinned joints (``GUIDE``), section 3.2.4, takes it from BS 5950-1
    Table 17; that table is the Perry-Robertson curve of BS 5950-1 Annex B.2.1 (formula from
    memory): p_E = pi^2 E / lambda^2, lambda_L0 = 0.4 (pi^2 E / p_y)^0.5,
    eta = 7.0 (lambda - lambda_L0) / 1000 >= 0, phi = (p_y + (eta + 1) p_E) / 2,
    p_b = p_E p_y / (phi + (phi^2 - p_E p_y)^0.5), with E = 205 000 MPa.

    Example:
        >>> round(f_p_LT(100.0, 275.0), 1)
        124.9
    """
    if lambda_lt <= 0:
        return fy
    p_e = math.pi ** 2 * LTB_CURVE_E / lambda_lt ** 2
    lim = 0.4 * math.sqrt(math.pi ** 2 * LTB_CURVE_E / fy)
    eta = max(LTB_CURVE_ALPHA * (lambda_lt - lim) / 1000.0, 0.0)
    phi = (fy + (eta + 1.0) * p_e) / 2.0
    return p_e * fy / (phi + math.sqrt(max(phi * phi - p_e * fy, 0.0)))


def V_Rd_fin_plate_ltb(tp: float, hp: float, fy: float, z: float, z_p: float,
                       params: Parameters = RECOMMENDED) -> float:
    """Shear resistance of a long fin plate (z > t_p / 0.15) from its buckling (N).

    Design guide for pinned joints (``GUIDE``), section 3.2.4:
    V_Rd = min(W_el f_p,LT / (0.6 z gamma_M1), W_el f_y / (z gamma_M0)), W_el = t_p h_p^2 / 6
    (``f_p_LT`` for the buckling strength).
    """
    w_el = tp * hp * hp / 6.0
    f_lt = f_p_LT(fin_plate_slenderness(z_p, hp, tp), fy)
    return min(w_el * f_lt / (0.6 * z * params.gamma_M1), w_el * fy / (z * params.gamma_M0))


def V_Rd_supporting_web_local_shear(hp: float, tw: float, fy: float,
                                    params: Parameters = RECOMMENDED) -> float:
    """Local shear resistance of the supporting web (column or primary beam) at a plate (N).

    Design guides for pinned joints, supporting web of a fin plate or end plate (the UK
    edition of the same checks; from memory): the reaction spreads into the web on two
    vertical planes of length h_p, so V_Rd = 2 h_p t_w f_y / (sqrt(3) gamma_M0), against the
    reactions of the beams on both sides of the web together.
    """
    return 2.0 * hp * tw * fy / (math.sqrt(3) * params.gamma_M0)


def punching_thickness_limit(tw: float, fu_w: float, fy_p: float,
                             params: Parameters = RECOMMENDED) -> float:
    """Thickest fin plate a supporting web takes without punching shear (mm).

    Design guides for pinned joints, supporting web of a fin plate (common practice, from
    memory; the same rule in the older British guide): t_p <= t_w f_u,w / (f_y,p gamma_M2),
    so the web does not punch before the plate yields. Not a check for a column flange.
    """
    return tw * fu_w / (fy_p * params.gamma_M2)
