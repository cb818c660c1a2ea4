"""Column stiffeners and supplementary web plates in the resistance of a joint (N, mm, MPa).

Transverse stiffeners: the compression stiffener with its strip of web (crushing, and
buckling of the cruciform section as EN 1993-1-5 9.4 treats a stiffener under a transverse
load, the way SCI P398 (2013) Step 6B applies it to a column), the stiffened column flange of
Table 6.5 (``effective_lengths``), and the extra shear resistance of a web panel between
two stiffeners (6.2.6.1(4)). Supplementary web plates: 6.2.6.1(6), 6.2.6.2(6), 6.2.6.3(8).
The clause texts of these three are recalled from memory (no copy of the standard here).
"""

from __future__ import annotations

import math

from ifcjoint.ec3.params import RECOMMENDED, Parameters

#: Imperfection factor of buckling curve c, EN 1993-1-1 Table 6.1 (EN 1993-1-5 9.4(2) puts
#: transverse stiffeners on curve c).
ALPHA_CURVE_C = 0.49


def epsilon(fy: float) -> float:
    """Epsilon = sqrt(235 / fy).

    EN 1993-1-1:2005, Table 5.2.
    """
    return math.sqrt(235.0 / fy)


def stiffener_outstand_ok(b_s: float, t_s: float, fy: float) -> bool:
    """Whether a stiffener outstand is not slender: b_s / t_s <= 14 epsilon.

    EN 1993-1-1:2005, Table 5.2 (outstand flange in compression, class 3 limit), as SCI P398
    (2013) Step 6B applies it to column stiffeners.

    Args:
        b_s: outstand of one stiffener from the web, mm.
        t_s: stiffener thickness, mm.
        fy: stiffener yield strength, MPa.
    """
    return b_s / t_s <= 14.0 * epsilon(fy)


def cruciform_area(b_s: float, t_s: float, t_wc: float, fy_wc: float) -> float:
    """Area of a pair of stiffeners with the web strip that acts with them (mm2).

    EN 1993-1-5:2006, 9.1(2): the stiffeners plus 15 epsilon t_w of web on each side:
    A = 2 b_s t_s + t_wc (30 epsilon t_wc + t_s).

    Args:
        b_s: width of one stiffener, mm.
        t_s: stiffener thickness, mm.
        t_wc: column web thickness, mm.
        fy_wc: web yield strength, MPa (for epsilon).

    Example:
        >>> round(cruciform_area(110, 15, 12.8, 265))
        8121
    """
    return 2 * b_s * t_s + t_wc * (30 * epsilon(fy_wc) * t_wc + t_s)


def cruciform_second_moment(b_s: float, t_s: float, t_wc: float) -> float:
    """Second moment of a pair of stiffeners about the web's mid-plane (mm4).

    EN 1993-1-5:2006, 9.1(2) and 9.4: I = t_s (2 b_s + t_wc)^3 / 12 (the web strip's own
    contribution neglected, as SCI P398 (2013) Step 6B does).
    """
    return t_s * (2 * b_s + t_wc) ** 3 / 12


def chi_curve_c(lambda_bar: float) -> float:
    """Reduction factor chi of buckling curve c for a relative slenderness.

    EN 1993-1-1:2005, 6.3.1.2(1), Eq. (6.49), alpha = 0.49 (curve c); chi = 1 for
    lambda_bar <= 0.2 (6.3.1.2(4)).
    """
    if lambda_bar <= 0.2:
        return 1.0
    phi = 0.5 * (1 + ALPHA_CURVE_C * (lambda_bar - 0.2) + lambda_bar**2)
    return min(1.0, 1.0 / (phi + math.sqrt(phi**2 - lambda_bar**2)))


def stiffener_buckling_Rd(
    *, area: float, second_moment: float, length: float, fy: float,
    params: Parameters = RECOMMENDED,
) -> tuple[float, float]:
    """Buckling resistance of the cruciform stiffener section, and its slenderness (N, -).

    EN 1993-1-5:2006, 9.4(2) with EN 1993-1-1:2005, 6.3.1.2: lambda_bar = (L / i) /
    (93.9 epsilon), curve c, N_b,Rd = chi A fy / gamma_M1.

    Args:
        area: cruciform area, mm2.
        second_moment: its second moment, mm4.
        length: buckling length, mm (the clear web depth; 0.75 of it where both flanges are
            restrained, EN 1993-1-5 9.4(2)).
        fy: yield strength, MPa.
        params: partial factors.
    """
    i = math.sqrt(second_moment / area)
    lam = (length / i) / (93.9 * epsilon(fy))
    return chi_curve_c(lam) * area * fy / params.gamma_M1, lam


def stiffener_crushing_Rd(
    *, a_s_net: float, fy_s: float, b_eff_c_wc: float, t_wc: float, fy_wc: float,
    params: Parameters = RECOMMENDED,
) -> float:
    """Crushing resistance of compression stiffeners with their strip of web (N).

    EN 1993-1-1:2005, 6.2.4 (cross-section in compression) applied as SCI P398 (2013) Step 6B:
    (A_s,net fy,s + b_eff,c,wc t_wc fy,wc) / gamma_M0, A_s,net the stiffeners' area net of
    the corner snipes.

    Example:
        >>> round(stiffener_crushing_Rd(a_s_net=2 * 95 * 15, fy_s=265, b_eff_c_wc=248,
        ...     t_wc=12.8, fy_wc=265) / 1e3)
        1596
    """
    return (a_s_net * fy_s + b_eff_c_wc * t_wc * fy_wc) / params.gamma_M0


def M_pl_plate(b: float, t: float, fy: float, params: Parameters = RECOMMENDED) -> float:
    """Plastic moment of a plate bent about its own axis, b t^2 fy / (4 gamma_M0) (N mm).

    EN 1993-1-8:2005, 6.2.6.1(4): M_pl,fc,Rd of a column flange and M_pl,st,Rd of a stiffener
    (the plastic moment of a rectangle, EN 1993-1-1 6.2.5).
    """
    return b * t * t * fy / (4.0 * params.gamma_M0)


def V_wp_add_Rd(M_pl_fc_Rd: float, M_pl_st_Rd: float, d_s: float) -> float:
    """Extra shear resistance of a web panel between transverse stiffeners (N).

    EN 1993-1-8:2005, 6.2.6.1(4), Eq. (6.8): V_wp,add,Rd = 4 M_pl,fc,Rd / d_s, not more than
    (2 M_pl,fc,Rd + 2 M_pl,st,Rd) / d_s, d_s the distance between the stiffeners' centrelines
    (stiffeners in both the compression and the tension zone). Recalled from memory.
    """
    return min(4 * M_pl_fc_Rd / d_s, (2 * M_pl_fc_Rd + 2 * M_pl_st_Rd) / d_s)


def web_plate_shear_area_increase(b_s: float, t_wc: float) -> float:
    """Increase of the column's shear area by supplementary web plates (mm2).

    EN 1993-1-8:2005, 6.2.6.1(6): A_vc may be increased by b_s t_wc; a plate on the other
    side adds nothing more. Recalled from memory.
    """
    return b_s * t_wc


def web_plate_t_eff_compression(t_wc: float, sides: int) -> float:
    """Effective web thickness in compression with supplementary web plates (mm).

    EN 1993-1-8:2005, 6.2.6.2(6): 1.5 t_wc with a plate on one side, 2.0 t_wc on both.
    Recalled from memory.
    """
    return t_wc * (2.0 if sides >= 2 else 1.5) if sides else t_wc


def web_plate_t_eff_tension(t_wc: float, sides: int, *, butt_welds: bool = False) -> float:
    """Effective web thickness in tension with supplementary web plates (mm).

    EN 1993-1-8:2005, 6.2.6.3(8): with full-penetration longitudinal welds 1.5 t_wc (one
    side) or 2.0 t_wc (both sides); with fillet welds (a >= t_s / sqrt 2) 1.4 t_wc on one or
    both sides. Recalled from memory; fillet welds unless the model says otherwise.
    """
    if not sides:
        return t_wc
    if butt_welds:
        return t_wc * (2.0 if sides >= 2 else 1.5)
    return 1.4 * t_wc
