"""Cross-section class and bending resistance of I sections, EN 1993-1-1 (mm, MPa, N mm).

What a joint check needs of a member: the class of a beam in bending (Table 5.2), which
decides the moment resistance M_c,Rd of 6.2.5 that the beam flange in compression uses
(EN 1993-1-8 6.2.6.7).
"""

from __future__ import annotations

import math

from ifcjoint.ec3.params import RECOMMENDED, Parameters

#: Table 5.2 limits, class 1 / 2 / 3, as multiples of epsilon: flange outstand (c / tf) of a
#: rolled or welded I in compression, internal web (c / tw) in bending.
FLANGE_OUTSTAND_LIMITS = (9.0, 10.0, 14.0)
WEB_BENDING_LIMITS = (72.0, 83.0, 124.0)


def _class_of(ratio: float, limits: tuple[float, float, float], eps: float) -> int:
    for k, lim in enumerate(limits, start=1):
        if ratio <= lim * eps:
            return k
    return 4


def class_in_bending(*, h: float, b: float, tw: float, tf: float, r: float, fy: float) -> int:
    """Cross-section class (1-4) of a doubly symmetric I section in major-axis bending.

    EN 1993-1-1:2005, 5.5.2 and Table 5.2: the worse of the compression flange outstand,
    c = (b - tw - 2 r) / 2 against 9 / 10 / 14 epsilon tf, and the web in bending,
    c = h - 2 tf - 2 r against 72 / 83 / 124 epsilon tw (r = 0 for a welded section, whose
    weld is not known: conservative).

    Example:
        >>> class_in_bending(h=400, b=180, tw=8.6, tf=13.5, r=21, fy=355)  # IPE 400
        1
    """
    eps = math.sqrt(235.0 / fy)
    flange = _class_of((b - tw - 2 * r) / 2 / tf, FLANGE_OUTSTAND_LIMITS, eps)
    web = _class_of((h - 2 * tf - 2 * r) / tw, WEB_BENDING_LIMITS, eps)
    return max(flange, web)


def M_c_Rd(
    section_class: int, W_pl: float, W_el: float, fy: float, params: Parameters = RECOMMENDED
) -> float | None:
    """Design moment resistance of a cross-section in bending, M_c,Rd (N mm).

    EN 1993-1-1:2005, 6.2.5(2), Eqs. (6.13)-(6.14): W_pl fy / gamma_M0 for class 1 and 2,
    W_el,min fy / gamma_M0 for class 3; None for class 4 (the effective section of
    EN 1993-1-5 is not computed here).
    """
    if section_class <= 2:
        return W_pl * fy / params.gamma_M0
    if section_class == 3:
        return W_el * fy / params.gamma_M0
    return None
