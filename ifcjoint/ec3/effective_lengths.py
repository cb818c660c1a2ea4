"""Effective lengths of T-stubs for bolt rows (mm), circular (cp) and non-circular (nc).

Unstiffened column flange: EN 1993-1-8 Table 6.4; stiffened column flange: Table 6.5 (rows
next to a stiffener with alpha of Figure 6.11, ``alpha_fig_6_11``); end plate: Table 6.6.
Each function returns ``(l_eff_cp, l_eff_nc)``.
"""

from __future__ import annotations

import functools
import math

PI = math.pi


def column_flange_row_alone(m: float, e: float, e1: float | None = None) -> tuple[float, float]:
    """Unstiffened column flange, bolt row considered individually.

    EN 1993-1-8:2005, 6.2.6.4.1, Table 6.4: inner row cp = 2 pi m, nc = 4 m + 1.25 e; an end
    row near the column's end also min(pi m + 2 e1) and min(2 m + 0.625 e + e1).

    Args:
        m: distance bolt - root radius of the column (Figure 6.8), mm.
        e: bolt to flange edge, mm.
        e1: bolt row to the free end of the column, mm (None: far away).
    """
    cp = 2 * PI * m
    nc = 4 * m + 1.25 * e
    if e1 is not None:
        cp = min(cp, PI * m + 2 * e1)
        nc = min(nc, 2 * m + 0.625 * e + e1)
    return cp, nc


def column_flange_row_in_group(
    m: float, e: float, p: float, *, end_row: bool
) -> tuple[float, float]:
    """Unstiffened column flange, bolt row as part of a group (its share).

    EN 1993-1-8:2005, 6.2.6.4.1, Table 6.4: end row cp = pi m + p, nc = 2 m + 0.625 e + 0.5 p;
    inner row cp = 2 p, nc = p.

    Args:
        m: as above, mm.
        e: as above, mm.
        p: the row's share of pitch: for an end row the pitch to the next row, for an inner
            row the mean of the pitches above and below, mm.
        end_row: True for the first or last row of the group.
    """
    if end_row:
        return PI * m + p, 2 * m + 0.625 * e + 0.5 * p
    return 2 * p, p


def column_flange_row_next_to_stiffener(
    m: float, e: float, alpha: float, p: float | None = None
) -> tuple[float, float]:
    """Stiffened column flange: bolt row adjacent to a stiffener (alone, or end of a group).

    EN 1993-1-8:2005, 6.2.6.4.2, Table 6.5: alone cp = 2 pi m, nc = alpha m; as the end row of
    a group next to the stiffener cp = pi m + p, nc = 0.5 p + alpha m - (2 m + 0.625 e); alpha
    of Figure 6.11 with m2 the distance to the stiffener. The other rows of a stiffened flange
    take the forms of Table 6.4 (``column_flange_row_alone``, ``column_flange_row_in_group``).

    Args:
        m: distance bolt - root radius of the column (Figure 6.8), mm.
        e: bolt to flange edge, mm.
        alpha: factor of Figure 6.11.
        p: the row's pitch share in a group, mm; None for the row alone.
    """
    if p is None:
        return 2 * PI * m, alpha * m
    return PI * m + p, 0.5 * p + alpha * m - (2 * m + 0.625 * e)


def end_plate_extension_row(
    mx: float, ex: float, e: float, w: float, bp: float
) -> tuple[float, float]:
    """End plate: bolt row in the extension, outside the tension flange (alone only).

    EN 1993-1-8:2005, 6.2.6.5, Table 6.6: cp = min(2 pi mx, pi mx + w, pi mx + 2e);
    nc = min(4 mx + 1.25 ex, e + 2 mx + 0.625 ex, 0.5 bp, 0.5 w + 2 mx + 0.625 ex).

    Args:
        mx: bolt row to the flange weld toe less 0.8 x weld leg (Figure 6.10), mm.
        ex: bolt row to the plate's end, mm.
        e: bolt to the plate's side edge, mm.
        w: gauge, mm.
        bp: plate width, mm.
    """
    cp = min(2 * PI * mx, PI * mx + w, PI * mx + 2 * e)
    nc = min(4 * mx + 1.25 * ex, e + 2 * mx + 0.625 * ex, 0.5 * bp, 0.5 * w + 2 * mx + 0.625 * ex)
    return cp, nc


def end_plate_first_row_below_flange(
    m: float, e: float, alpha: float, p: float | None = None
) -> tuple[float, float]:
    """End plate: first bolt row below the tension flange (alone, or as end of a group).

    EN 1993-1-8:2005, 6.2.6.5, Table 6.6: alone cp = 2 pi m, nc = alpha m; in a group
    cp = pi m + p, nc = 0.5 p + alpha m - (2 m + 0.625 e).

    Args:
        m: bolt to the web weld toe less 0.8 x weld leg (Figure 6.10), mm.
        e: bolt to the plate's side edge, mm.
        alpha: factor of Figure 6.11.
        p: pitch to the next row of the group, mm; None for the row alone.
    """
    if p is None:
        return 2 * PI * m, alpha * m
    return PI * m + p, 0.5 * p + alpha * m - (2 * m + 0.625 * e)


def end_plate_other_row(
    m: float, e: float, p: float | None = None, *, end_row: bool = False
) -> tuple[float, float]:
    """End plate: other inner or end bolt row (alone, or as part of a group).

    EN 1993-1-8:2005, 6.2.6.5, Table 6.6: alone cp = 2 pi m, nc = 4 m + 1.25 e; in a group,
    inner row cp = 2 p, nc = p; end row cp = pi m + p, nc = 2 m + 0.625 e + 0.5 p.

    Args:
        m: as above, mm.
        e: as above, mm.
        p: the row's share of pitch in the group (see column_flange_row_in_group); None alone.
        end_row: True for the end row of a group.
    """
    if p is None:
        return 2 * PI * m, 4 * m + 1.25 * e
    if end_row:
        return PI * m + p, 2 * m + 0.625 * e + 0.5 * p
    return 2 * p, p


ALPHA_MIN, ALPHA_MAX = 4.45, 8.0


def alpha_curve_lambda1(alpha: float, lambda_2: float) -> float:
    """lambda_1 at which the curve of a given alpha of Figure 6.11 passes at height lambda_2.

    EN 1993-1-8:2005, 6.2.6.5, Figure 6.11, in the closed form published in SCI P398 (2013),
    Appendix G: lambda_1,lim = 1.25 / (alpha - 2.75), lambda_2,lim = alpha lambda_1,lim / 2;
    lambda_1 = lambda_1,lim where lambda_2 >= lambda_2,lim, else lambda_1 = lambda_1,lim +
    (1 - lambda_1,lim) ((lambda_2,lim - lambda_2) / lambda_2,lim) ^ (0.185 alpha^1.785).

    Args:
        alpha: the curve, 4.45 ... 8.
        lambda_2: m2 / (m1 + e), dimensionless.
    """
    l1_lim = 1.25 / (alpha - 2.75)
    l2_lim = alpha * l1_lim / 2
    if lambda_2 >= l2_lim:
        return l1_lim
    x = (l2_lim - max(lambda_2, 0.0)) / l2_lim
    return l1_lim + (1 - l1_lim) * x ** (0.185 * alpha**1.785)


@functools.lru_cache(maxsize=8192)
def alpha_fig_6_11(lambda_1: float, lambda_2: float, tol: float = 1e-4) -> float:
    """Alpha of Figure 6.11 for a bolt row next to a stiffener or a beam flange.

    EN 1993-1-8:2005, 6.2.6.4.2 and 6.2.6.5, Figure 6.11, with lambda_1 = m1 / (m1 + e) and
    lambda_2 = m2 / (m1 + e): the curve through (lambda_1, lambda_2) of the family
    ``alpha_curve_lambda1`` (SCI P398 Appendix G), found by a bracketed root search and
    bounded to the chart's range 4.45 ... 8. On the vertical branch alpha m1 equals
    4 m1 + 1.25 e, the unstiffened row's non-circular length (Table 6.4), as the chart
    requires.

    Args:
        lambda_1: m1 / (m1 + e), dimensionless.
        lambda_2: m2 / (m1 + e), dimensionless.
        tol: how close (in alpha) the search stops.

    Pure and called with the same geometry again and again in a model: results are cached.

    Example:
        >>> round(alpha_fig_6_11(0.3, 2.0), 3)  # vertical branch: 2.75 + 1.25 / 0.3
        6.917
    """
    # On the vertical branch the curve through lambda_1 is alpha = 2.75 + 1.25 / lambda_1.
    vertical = 2.75 + 1.25 / lambda_1
    if ALPHA_MIN <= vertical <= ALPHA_MAX and lambda_2 >= vertical * lambda_1 / 2:
        return vertical
    f_hi = alpha_curve_lambda1(ALPHA_MAX, lambda_2) - lambda_1
    if f_hi >= 0:
        return ALPHA_MAX
    f_lo = alpha_curve_lambda1(ALPHA_MIN, lambda_2) - lambda_1
    if f_lo <= 0:
        return ALPHA_MIN
    # The curve's lambda_1 falls as alpha rises: a bracketed root, by false position with
    # the Illinois step (a few evaluations), halving when a step would leave the bracket.
    lo, hi = ALPHA_MIN, ALPHA_MAX
    side = 0
    for _ in range(60):
        if hi - lo <= tol:
            break
        mid = (lo * f_hi - hi * f_lo) / (f_hi - f_lo)
        if not lo < mid < hi:
            mid = 0.5 * (lo + hi)
        f_mid = alpha_curve_lambda1(mid, lambda_2) - lambda_1
        if abs(f_mid) < 1e-12:
            return mid
        if f_mid > 0:
            lo, f_lo = mid, f_mid
            if side == 1:
                f_hi /= 2
            side = 1
        else:
            hi, f_hi = mid, f_mid
            if side == -1:
                f_lo /= 2
            side = -1
    return 0.5 * (lo + hi) if hi - lo <= tol else mid
