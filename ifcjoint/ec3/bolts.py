"""Bolt resistances of EN 1993-1-8 Table 3.4 (N, mm, MPa).

Each function's docstring names its clause on the second paragraph.
"""

from __future__ import annotations

import math

from ifcjoint.ec3.params import RECOMMENDED, Parameters

#: Tensile stress area As (mm2) of ISO metric coarse threads, ISO 898-1 (from memory).
TENSILE_STRESS_AREA = {
    12: 84.3,
    16: 157.0,
    20: 245.0,
    22: 303.0,
    24: 353.0,
    27: 459.0,
    30: 561.0,
    36: 817.0,
}

#: Shear factor alpha_v by bolt class (shear plane through the threaded part),
#: EN 1993-1-8 Table 3.4.
ALPHA_V = {"4.6": 0.6, "5.6": 0.6, "8.8": 0.6, "4.8": 0.5, "5.8": 0.5, "6.8": 0.5, "10.9": 0.5}


#: Heights of a bolt head and of a nut as fractions of the diameter: ISO 4014 hexagon heads
#: (about 0.63 d) and EN 14399-3 preloadable nuts (about 0.9 d). From memory.
HEAD_HEIGHT, NUT_HEIGHT = 0.65, 0.9
#: Thickness of one washer, mm (EN 14399-6 washers for M16-M36 are 4-5 mm; from memory).
WASHER_THICKNESS = 4.0


def bolt_elongation_length(grip: float, d: float, washers: int = 2) -> float:
    """Bolt elongation length L_b: the grip, the washers, half the head and half the nut (mm).

    EN 1993-1-8:2005, 6.2.4.1, Table 6.2 (definition of L_b); head 0.65 d, nut 0.9 d and
    4 mm washers as in ``HEAD_HEIGHT``, ``NUT_HEIGHT`` and ``WASHER_THICKNESS``.

    Args:
        grip: total thickness of the plies (end plate and column flange), mm.
        d: bolt diameter, mm.
        washers: number of washers under the head and the nut.

    Example:
        >>> bolt_elongation_length(45.5, 24)
        72.1
    """
    return grip + washers * WASHER_THICKNESS + 0.5 * (HEAD_HEIGHT * d + NUT_HEIGHT * d)


def F_t_Rd(fub: float, As: float, params: Parameters = RECOMMENDED) -> float:
    """Tension resistance of one bolt Ft,Rd = k2 fub As / gamma_M2 (N).

    EN 1993-1-8:2005, 3.6.1, Table 3.4.

    Args:
        fub: ultimate tensile strength of the bolt, MPa.
        As: tensile stress area, mm2.
        params: partial factors (k2, gamma_M2).

    Example:
        >>> round(F_t_Rd(800, 353) / 1e3, 1)
        203.3
    """
    return params.k2 * fub * As / params.gamma_M2


def B_p_Rd(dm: float, tp: float, fu: float, params: Parameters = RECOMMENDED) -> float:
    """Punching shear resistance Bp,Rd = 0.6 pi dm tp fu / gamma_M2 (N).

    EN 1993-1-8:2005, 3.6.1, Table 3.4.

    Args:
        dm: mean of the across-points and across-flats dimensions of the bolt head or nut
            (whichever is smaller), mm.
        tp: thickness of the plate under the bolt or nut, mm.
        fu: ultimate strength of that plate, MPa.
        params: partial factors.
    """
    return 0.6 * math.pi * dm * tp * fu / params.gamma_M2


def F_v_Rd(bolt_class: str, fub: float, As: float, params: Parameters = RECOMMENDED) -> float:
    """Shear resistance per shear plane, threads in the shear plane, Fv,Rd (N).

    EN 1993-1-8:2005, 3.6.1, Table 3.4: alpha_v fub As / gamma_M2 with alpha_v = 0.6 for
    classes 4.6, 5.6 and 8.8 and 0.5 for 4.8, 5.8, 6.8 and 10.9.

    Example:
        >>> round(F_v_Rd("8.8", 800, 353) / 1e3, 1)
        135.6
    """
    return ALPHA_V[bolt_class] * fub * As / params.gamma_M2


def alpha_b(
    *, d0: float, fub: float, fu: float, e1: float | None = None, p1: float | None = None
) -> float:
    """Bearing factor alpha_b = min(alpha_d, fub / fu, 1.0) in the direction of load transfer.

    EN 1993-1-8:2005, 3.6.1, Table 3.4: alpha_d = e1 / (3 d0) for end bolts,
    p1 / (3 d0) - 1/4 for inner bolts (the smaller of the two when both are given).
    """
    ad = []
    if e1 is not None:
        ad.append(e1 / (3 * d0))
    if p1 is not None:
        ad.append(p1 / (3 * d0) - 0.25)
    return min([*ad, fub / fu, 1.0])


def k1_bearing(*, d0: float, e2: float | None = None, p2: float | None = None) -> float:
    """Factor k1 perpendicular to the direction of load transfer.

    EN 1993-1-8:2005, 3.6.1, Table 3.4: edge bolts min(2.8 e2/d0 - 1.7, 1.4 p2/d0 - 1.7, 2.5),
    inner bolts min(1.4 p2/d0 - 1.7, 2.5).
    """
    ks = [2.5]
    if e2 is not None:
        ks.append(2.8 * e2 / d0 - 1.7)
    if p2 is not None:
        ks.append(1.4 * p2 / d0 - 1.7)
    return min(ks)


def F_b_Rd(
    k1: float,
    alpha_b_: float,
    fu: float,
    d: float,
    t: float,
    params: Parameters = RECOMMENDED,
) -> float:
    """Bearing resistance of one bolt Fb,Rd = k1 alpha_b fu d t / gamma_M2 (N).

    EN 1993-1-8:2005, 3.6.1, Table 3.4.
    """
    return k1 * alpha_b_ * fu * d * t / params.gamma_M2
