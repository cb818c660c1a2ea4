"""Rotational stiffness and classification of joints, EN 1993-1-8 6.3 and 5.2 (N, mm, rad).

Stiffness coefficients k_i are in mm (they multiply E).
"""

from __future__ import annotations

import math
from collections.abc import Sequence

from ifcjoint.ec3.params import RECOMMENDED, Parameters

#: psi for the stiffness ratio mu, EN 1993-1-8 Table 6.8.
PSI = {"welded": 2.7, "bolted_end_plate": 2.7, "bolted_angle_flange_cleats": 3.1}


def k1_web_panel(A_vc: float, beta: float, z: float) -> float:
    """Column web panel in shear, unstiffened: k1 = 0.38 Avc / (beta z) (mm).

    EN 1993-1-8:2005, 6.3.2, Table 6.11 (infinite for a stiffened panel or beta = 0).
    """
    return float("inf") if beta == 0 else 0.38 * A_vc / (beta * z)


def k2_web_compression(b_eff_c_wc: float, t_wc: float, d_c: float) -> float:
    """Column web in compression, unstiffened: k2 = 0.7 b_eff,c,wc t_wc / d_c (mm).

    EN 1993-1-8:2005, 6.3.2, Table 6.11.
    """
    return 0.7 * b_eff_c_wc * t_wc / d_c


def k3_web_tension(b_eff_t_wc: float, t_wc: float, d_c: float) -> float:
    """Column web in tension, bolted, unstiffened: k3 = 0.7 b_eff,t,wc t_wc / d_c (mm).

    EN 1993-1-8:2005, 6.3.2, Table 6.11.
    """
    return 0.7 * b_eff_t_wc * t_wc / d_c


def k4_column_flange(l_eff: float, t_fc: float, m: float) -> float:
    """Column flange in bending, one bolt row: k4 = 0.9 l_eff t_fc^3 / m^3 (mm).

    EN 1993-1-8:2005, 6.3.2, Table 6.11 (l_eff the smallest of the row alone or in a group).
    """
    return 0.9 * l_eff * t_fc**3 / m**3


def k5_end_plate(l_eff: float, t_p: float, m: float) -> float:
    """End plate in bending, one bolt row: k5 = 0.9 l_eff t_p^3 / m^3 (mm).

    EN 1993-1-8:2005, 6.3.2, Table 6.11.
    """
    return 0.9 * l_eff * t_p**3 / m**3


def k10_bolts(As: float, L_b: float) -> float:
    """Bolts in tension, one row of two bolts: k10 = 1.6 As / L_b (mm).

    EN 1993-1-8:2005, 6.3.2, Table 6.11 (L_b: grip + washers + half the head and nut).
    """
    return 1.6 * As / L_b


def k_eff_row(ks: Sequence[float]) -> float:
    """Effective stiffness of one bolt row, k_eff,r = 1 / sum(1 / k_i,r) (mm).

    EN 1993-1-8:2005, 6.3.3.1(2), Eq. (6.30).
    """
    return 1.0 / sum(1.0 / k for k in ks if k != math.inf)


def equivalent_lever_arm(k_eff: Sequence[float], h: Sequence[float]) -> tuple[float, float]:
    """Equivalent lever arm z_eq and stiffness k_eq of several tension rows (mm, mm).

    EN 1993-1-8:2005, 6.3.3.1(3)-(4), Eqs. (6.31) and (6.29): z_eq = sum k h^2 / sum k h,
    k_eq = sum k h / z_eq.
    """
    s1 = sum(k * x for k, x in zip(k_eff, h, strict=True))
    s2 = sum(k * x * x for k, x in zip(k_eff, h, strict=True))
    z = s2 / s1
    return z, s1 / z


def S_j_ini(z: float, ks: Sequence[float], params: Parameters = RECOMMENDED) -> float:
    """Initial rotational stiffness Sj,ini = E z^2 / sum(1 / k_i) (N mm / rad).

    EN 1993-1-8:2005, 6.3.1(4), Eq. (6.27) with mu = 1.
    """
    flex = sum(1.0 / k for k in ks if k != math.inf)
    return params.E * z * z / flex if flex > 0 else float("inf")


def stiffness_ratio_mu(M_j_Ed: float, M_j_Rd: float, joint: str = "bolted_end_plate") -> float:
    """Stiffness ratio mu = Sj,ini / Sj for a design moment Mj,Ed.

    EN 1993-1-8:2005, 6.3.1(6), Eqs. (6.28a)-(6.28b), Table 6.8: 1 for Mj,Ed <= 2/3 Mj,Rd,
    else (1.5 Mj,Ed / Mj,Rd)^psi.
    """
    if M_j_Ed <= 2.0 / 3.0 * M_j_Rd:
        return 1.0
    return (1.5 * M_j_Ed / M_j_Rd) ** PSI[joint]


def classify_stiffness(
    S_j_ini_: float,
    I_b: float,
    L_b: float,
    *,
    braced: bool,
    params: Parameters = RECOMMENDED,
) -> tuple[str, dict]:
    """Classification by stiffness: rigid, semi-rigid or nominally pinned.

    EN 1993-1-8:2005, 5.2.2.5: rigid when Sj,ini >= kb E Ib / Lb (kb = 8 for frames whose
    bracing reduces the horizontal displacement by at least 80 %, 25 otherwise); nominally
    pinned when Sj,ini <= 0.5 E Ib / Lb; semi-rigid between.

    Returns:
        The class and the boundaries used (N mm / rad).
    """
    kb = params.kb_braced if braced else params.kb_unbraced
    rigid = kb * params.E * I_b / L_b
    pinned = 0.5 * params.E * I_b / L_b
    if S_j_ini_ >= rigid:
        cls = "rigid"
    elif S_j_ini_ <= pinned:
        cls = "nominally pinned"
    else:
        cls = "semi-rigid"
    return cls, {"kb": kb, "rigid_from": rigid, "pinned_up_to": pinned}


def classify_strength(
    M_j_Rd_: float,
    M_pl_b_Rd: float,
    M_pl_c_Rd: float,
    *,
    column_continues_above: bool = True,
) -> tuple[str, float]:
    """Classification by strength: full-strength, partial-strength or nominally pinned.

    EN 1993-1-8:2005, 5.2.3.3 and Figure 5.8: full strength when Mj,Rd is at least the smaller
    of the beam's Mpl,b,Rd and the column's Mpl,c,Rd (2 Mpl,c,Rd where the column continues
    above the joint); nominally pinned when Mj,Rd <= 0.25 of that; partial strength between.

    Returns:
        The class and the full-strength boundary (N mm).
    """
    limit = min(M_pl_b_Rd, (2.0 if column_continues_above else 1.0) * M_pl_c_Rd)
    if M_j_Rd_ >= limit:
        return "full-strength", limit
    if M_j_Rd_ <= 0.25 * limit:
        return "nominally pinned", limit
    return "partial-strength", limit


def m_phi_curve(
    M_j_Rd_: float,
    S_j_ini_: float,
    joint: str = "bolted_end_plate",
    n: int = 24,
) -> list[tuple[float, float]]:
    """Design moment-rotation curve as (phi in rad, M in N mm) points.

    EN 1993-1-8:2005, 6.3.1(4) and 6.1.2, Figure 6.1(c)/6.3.1(6): linear with Sj,ini up to
    2/3 Mj,Rd, then Sj = Sj,ini / mu with mu = (1.5 Mj / Mj,Rd)^psi up to Mj,Rd; the curve ends
    at Mj,Rd (the rotation capacity phi_Cd is not evaluated here).
    """
    out = [(0.0, 0.0)]
    for k in range(1, n + 1):
        m = M_j_Rd_ * k / n
        mu = stiffness_ratio_mu(m, M_j_Rd_, joint)
        out.append((m * mu / S_j_ini_, m))
    return out
