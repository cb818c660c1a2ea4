"""Basic joint components of EN 1993-1-8 6.2.6 (N, mm, MPa).

Pure functions over floats. The column's yield strength is an input: which thickness it is
read at (web, or the section's thickest element as some National Annexes and handbooks do)
is the caller's choice and is reported by the check.
"""

from __future__ import annotations

import math

from ifcjoint.ec3.params import RECOMMENDED, Parameters


def epsilon(fy: float) -> float:
    """Epsilon = sqrt(235 / fy).

    EN 1993-1-1:2005, Table 5.2.
    """
    return math.sqrt(235.0 / fy)


def web_panel_slenderness_ok(dc: float, tw: float, fy: float) -> bool:
    """Whether the web panel rules apply: dc / tw <= 69 epsilon.

    EN 1993-1-8:2005, 6.2.6.1(1).

    Args:
        dc: clear depth of the column web (h - 2 tf - 2 r for rolled sections), mm.
        tw: web thickness, mm.
        fy: web yield strength, MPa.
    """
    return dc / tw <= 69.0 * epsilon(fy)


def V_wp_Rd(fy_wc: float, A_vc: float, params: Parameters = RECOMMENDED) -> float:
    """Column web panel shear resistance Vwp,Rd = 0.9 fy,wc Avc / (sqrt(3) gamma_M0) (N).

    EN 1993-1-8:2005, 6.2.6.1(2), Eq. (6.7), for an unstiffened web panel without
    supplementary web plates.

    Example:
        >>> round(V_wp_Rd(355, 4743) / 1e3)
        875
    """
    return 0.9 * fy_wc * A_vc / (math.sqrt(3.0) * params.gamma_M0)


def omega(beta: float, b_eff: float, t_wc: float, A_vc: float) -> float:
    """Reduction factor omega for interaction with shear in the column web panel.

    EN 1993-1-8:2005, 6.2.6.2(1), Table 6.3 (omega_1 and omega_2 with the effective width of
    the web in compression or tension).

    Args:
        beta: transformation parameter (5.3(7), Table 5.4).
        b_eff: effective width of the web, mm.
        t_wc: web thickness, mm.
        A_vc: shear area of the column, mm2.
    """
    r = b_eff * t_wc / A_vc
    w1 = 1.0 / math.sqrt(1.0 + 1.3 * r * r)
    w2 = 1.0 / math.sqrt(1.0 + 5.2 * r * r)
    if beta <= 0.5:
        return 1.0
    if beta < 1.0:
        return w1 + 2.0 * (1.0 - beta) * (1.0 - w1)
    if beta == 1.0:
        return w1
    if beta < 2.0:
        return w1 + (beta - 1.0) * (w2 - w1)
    return w2


def b_eff_c_wc_end_plate(t_fb: float, a_p: float, t_fc: float, s: float, s_p: float) -> float:
    """Effective width of the column web in compression for a bolted end plate (mm).

    EN 1993-1-8:2005, 6.2.6.2(1), Eq. (6.11): t_fb + 2 sqrt(2) a_p + 5 (t_fc + s) + s_p.

    Args:
        t_fb: beam flange thickness, mm.
        a_p: throat of the end-plate-to-flange weld, mm.
        t_fc: column flange thickness, mm.
        s: root radius of a rolled column (r_c), or sqrt(2) a_c for a welded one, mm.
        s_p: spread through the end plate at 45 degrees: at least t_p and up to 2 t_p where
            the plate extends enough below the flange, mm.
    """
    return t_fb + 2.0 * math.sqrt(2.0) * a_p + 5.0 * (t_fc + s) + s_p


def b_eff_c_wc_welded(t_fb: float, a_b: float, t_fc: float, s: float) -> float:
    """Effective width of the column web in compression for a welded joint (mm).

    EN 1993-1-8:2005, 6.2.6.2(1), Eq. (6.10): t_fb + 2 sqrt(2) a_b + 5 (t_fc + s).
    """
    return t_fb + 2.0 * math.sqrt(2.0) * a_b + 5.0 * (t_fc + s)


def rho_web(
    b_eff: float, d_wc: float, fy_wc: float, t_wc: float, params: Parameters = RECOMMENDED
) -> float:
    """Plate buckling reduction factor rho of the column web in compression.

    EN 1993-1-8:2005, 6.2.6.2(1), Eqs. (6.13a)-(6.13c): lambda_p = 0.932 sqrt(b_eff d_wc fy
    / (E t_wc^2)); rho = 1 for lambda_p <= 0.72, else (lambda_p - 0.2) / lambda_p^2.
    """
    lam = 0.932 * math.sqrt(b_eff * d_wc * fy_wc / (params.E * t_wc * t_wc))
    return 1.0 if lam <= 0.72 else (lam - 0.2) / lam**2


def k_wc(sigma_com_Ed: float, fy_wc: float) -> float:
    """Factor k_wc for the longitudinal compressive stress in the column web.

    EN 1993-1-8:2005, 6.2.6.2(2): 1 when sigma_com,Ed <= 0.7 fy,wc, else
    1.7 - sigma_com,Ed / fy,wc.
    """
    return 1.0 if sigma_com_Ed <= 0.7 * fy_wc else 1.7 - sigma_com_Ed / fy_wc


def F_c_wc_Rd(
    *,
    b_eff: float,
    t_wc: float,
    d_wc: float,
    fy_wc: float,
    omega_: float = 1.0,
    k_wc_: float = 1.0,
    params: Parameters = RECOMMENDED,
) -> float:
    """Column web in transverse compression Fc,wc,Rd (N).

    EN 1993-1-8:2005, 6.2.6.2(1), Eq. (6.9): omega k_wc b_eff t_wc fy,wc / gamma_M0, not
    more than omega k_wc rho b_eff t_wc fy,wc / gamma_M1.
    """
    rho = rho_web(b_eff, d_wc, fy_wc, t_wc, params)
    base = omega_ * k_wc_ * b_eff * t_wc * fy_wc
    return min(base / params.gamma_M0, rho * base / params.gamma_M1)


def F_t_wc_Rd(
    *,
    b_eff: float,
    t_wc: float,
    fy_wc: float,
    omega_: float = 1.0,
    params: Parameters = RECOMMENDED,
) -> float:
    """Column web in transverse tension Ft,wc,Rd = omega b_eff t_wc fy,wc / gamma_M0 (N).

    EN 1993-1-8:2005, 6.2.6.3(1), Eq. (6.15); for a bolted joint b_eff,t,wc is the effective
    length of the column flange T-stub (6.2.6.3(3)).
    """
    return omega_ * b_eff * t_wc * fy_wc / params.gamma_M0


def F_c_fb_Rd(M_c_Rd: float, h: float, t_fb: float) -> float:
    """Beam flange and web in compression Fc,fb,Rd = Mc,Rd / (h - t_fb) (N).

    EN 1993-1-8:2005, 6.2.6.7(1), Eq. (6.21).

    Args:
        M_c_Rd: design moment resistance of the beam cross-section, N mm.
        h: beam depth, mm.
        t_fb: beam flange thickness, mm.
    """
    return M_c_Rd / (h - t_fb)


def F_t_wb_Rd(
    *, b_eff: float, t_wb: float, fy_wb: float, params: Parameters = RECOMMENDED
) -> float:
    """Beam web in tension Ft,wb,Rd = b_eff,t,wb t_wb fy,wb / gamma_M0 (N).

    EN 1993-1-8:2005, 6.2.6.8(1), Eq. (6.22); b_eff,t,wb is the effective length of the end
    plate T-stub (6.2.6.8(2)).
    """
    return b_eff * t_wb * fy_wb / params.gamma_M0


#: Correlation factor beta_w of fillet welds, EN 1993-1-8:2005 Table 4.1 (from memory).
BETA_W = {"S235": 0.80, "S275": 0.85, "S355": 0.90, "S420": 1.0, "S460": 1.0}


def f_vw_d(fu: float, beta_w: float, params: Parameters = RECOMMENDED) -> float:
    """Design shear strength of a fillet weld fvw,d = fu / (sqrt(3) beta_w gamma_M2) (MPa).

    EN 1993-1-8:2005, 4.5.3.3(3), Eq. (4.4) (simplified method).
    """
    return fu / (math.sqrt(3.0) * beta_w * params.gamma_M2)


def full_strength_fillet_throat(
    t: float, fy: float, fu: float, beta_w: float, params: Parameters = RECOMMENDED
) -> float:
    """Throat of the double fillet weld as strong as the part of thickness t it joins (mm).

    EN 1993-1-8:2005, 4.5.3.3 (simplified method, Eq. (4.4)): two welds of throat a carry
    2 a f_vw,d per unit length; the part carries t f_y / gamma_M0 (gamma_M0 = 1), so
    a = t f_y sqrt(3) beta_w gamma_M2 / (2 f_u).
    """
    return t * fy / (2 * f_vw_d(fu, beta_w, params))


def b_eff_b_fc_welded(
    t_wc: float, s: float, t_fc: float, t_fb: float, fy_fc: float, fy_fb: float
) -> float:
    """Effective breadth of the beam flange on an unstiffened column flange, welded (mm).

    EN 1993-1-8:2005, 6.2.6.4.3(1), Eqs. (6.20)-(6.21): b_eff,b,fc = t_wc + 2 s + 7 k t_fc with
    k = (t_fc / t_fb)(fy,fc / fy,fb), k <= 1.
    """
    k = min((t_fc / t_fb) * (fy_fc / fy_fb), 1.0)
    return t_wc + 2.0 * s + 7.0 * k * t_fc


def F_fc_Rd_welded(
    b_eff_b_fc: float,
    t_fb: float,
    fy_fb: float,
    params: Parameters = RECOMMENDED,
) -> float:
    """Unstiffened column flange in bending for a welded joint Ffc,Rd (N).

    EN 1993-1-8:2005, 6.2.6.4.3(1), Eq. (6.20): b_eff,b,fc t_fb fy,fb / gamma_M0.
    """
    return b_eff_b_fc * t_fb * fy_fb / params.gamma_M0


def V_wp_Ed(
    M_b1_Ed: float,
    M_b2_Ed: float,
    z: float,
    V_c1_Ed: float = 0.0,
    V_c2_Ed: float = 0.0,
) -> float:
    """Shear force in the column web panel Vwp,Ed (N).

    EN 1993-1-8:2005, 5.3(3), Eq. (5.3): (Mb1,Ed - Mb2,Ed) / z - (Vc1,Ed - Vc2,Ed) / 2, with
    the moments of the beams on the two sides (N mm; same sign convention on both sides), z the
    lever arm (mm) and Vc1, Vc2 the shear forces in the column above and below (N).
    """
    return (M_b1_Ed - M_b2_Ed) / z - (V_c1_Ed - V_c2_Ed) / 2.0


def beta_from_moments(M_b1_Ed: float, M_b2_Ed: float | None) -> float:
    """Approximate transformation parameter beta of the web panel.

    EN 1993-1-8:2005, 5.3(7), Table 5.4 (approximate values): single-sided joint 1;
    double-sided with Mb1,Ed = Mb2,Ed (balanced) 0, Mb1,Ed / Mb2,Ed > 0 1, Mb1,Ed / Mb2,Ed < 0
    2, Mb1,Ed + Mb2,Ed = 0 2. Moments in the sign convention of Table 5.4.

    Args:
        M_b1_Ed: the larger moment, N mm.
        M_b2_Ed: the other side's moment, N mm; None for a single-sided joint.
    """
    if M_b2_Ed is None:
        return 1.0
    if M_b1_Ed == M_b2_Ed:
        return 0.0
    if M_b1_Ed + M_b2_Ed == 0 or (M_b2_Ed != 0 and M_b1_Ed / M_b2_Ed < 0):
        return 2.0
    return 1.0


def axial_force_significant(
    N_Ed: float,
    A: float,
    fy: float,
    params: Parameters = RECOMMENDED,
) -> bool:
    """Whether the beam's axial force must be taken into account (N_Ed > 5 % Npl,Rd).

    EN 1993-1-8:2005, 6.2.7.1(2): above that, the moment resistance alone does not verify the
    joint (6.2.7.1(3), Eq. (6.24)).
    """
    return abs(N_Ed) > 0.05 * A * fy / params.gamma_M0


#: Above this depth of a beam with its haunch, the web's share of Fc,fb,Rd is limited,
#: EN 1993-1-8:2005, 6.2.6.7(1) (mm).
HAUNCH_WEB_LIMIT_DEPTH = 600.0


def haunched_W_el(h: float, b: float, tf: float, tw: float, d_h: float, b_h: float,
                  tf_h: float, tw_h: float) -> float:
    """Least elastic modulus of a beam with a haunch welded under it, at the column face (mm3).

    EN 1993-1-1:2005 6.2.5(2) (W_el, as for a class 3 section) on the section of rectangles
    (fillets left out, on the safe side): the beam's top flange
    (b x tf), web (tw x (h - 2 tf)) and bottom flange (b x tf), the haunch's web
    (tw_h x (d_h - tf_h)) and flange (b_h x tf_h) under it; I about the centroid over the
    farther fibre (EN 1993-1-1 6.2.5(2), W_el of a class 3 section: on the safe side for
    every class, as the haunched section's class is not classified here).
    """
    parts = [  # (area, centroid from the top)
        (b * tf, tf / 2),
        (tw * (h - 2 * tf), h / 2),
        (b * tf, h - tf / 2),
        (tw_h * (d_h - tf_h), h + (d_h - tf_h) / 2),
        (b_h * tf_h, h + d_h - tf_h / 2),
    ]
    heights = [tf, h - 2 * tf, tf, d_h - tf_h, tf_h]
    widths = [b, tw, b, tw_h, b_h]
    area = sum(a for a, _ in parts)
    yc = sum(a * y for a, y in parts) / area
    i = sum(w * t ** 3 / 12 + a * (y - yc) ** 2
            for (a, y), w, t in zip(parts, widths, heights, strict=True))
    return i / max(yc, h + d_h - yc)


def F_c_fb_Rd_haunched(M_c_Rd: float, h_total: float, t_fc: float, b_fc: float,
                       fy: float) -> float:
    """Flange and web in compression of a haunched beam, Fc,fb,Rd (N).

    EN 1993-1-8:2005, 6.2.6.7(1): Mc,Rd / (h - t_fb) with h the depth with the haunch and
    t_fb the compression flange's thickness; above 600 mm the web contributes at most 20 %,
    so Fc,fb,Rd <= b t_fb f_y / 0.8 (the flange's force over 80 %).
    """
    f = M_c_Rd / (h_total - t_fc)
    if h_total > HAUNCH_WEB_LIMIT_DEPTH:
        f = min(f, b_fc * t_fc * fy / 0.8)
    return f
