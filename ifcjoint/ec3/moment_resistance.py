"""Design moment resistance of a beam-to-column joint, EN 1993-1-8 6.2.7 (N, mm).

The distribution works on resistances already computed per component, for each bolt row
alone and for each group of consecutive rows, so it can be shown, checked and tested apart
from the component formulas.
"""

from __future__ import annotations

from collections.abc import Hashable
from dataclasses import dataclass
from enum import StrEnum
from operator import itemgetter
from typing import NamedTuple


class LimitScope(StrEnum):
    """Which rule of 6.2.7.2 set a row's effective tension resistance."""

    ALONE = "alone"  # a component of the row considered alone
    GROUP = "group"  # a component of a group of rows ending with this row
    COMPRESSION = "compression"  # the compression side less the rows above
    TRIANGULAR = "triangular"  # 6.2.7.2(9): a row above exceeds 1.9 Ft,Rd
    COMPONENT = "component"  # a single component (a joint with one tension zone, e.g. welded)


class Limit(NamedTuple):
    """What limited (or might have limited) a row: a component in a scope, with its rows.

    A named tuple: made for every candidate of every row, so it is kept cheap.

    Attributes:
        component: the caller's key of the component (None for the triangular limit).
        scope: alone, group, compression, triangular or component.
        first: the row alone, the group's first row, or the row above for the triangular limit.
        last: the group's last row (the row itself otherwise).
    """

    component: Hashable | None
    scope: LimitScope
    first: int = 0
    last: int = 0


@dataclass(slots=True, kw_only=True)
class RowResult:
    """Effective design tension resistance of one bolt row.

    Attributes:
        row: row number, 1 = farthest from the centre of compression.
        h_r: distance from the row to the centre of compression, mm.
        F_tr_Rd: effective tension resistance, N.
        limited_by: the limit that set it (None when not explained).
        raw_candidates: every limit considered, as (component, scope, first, last, value N)
            in the order tried (``candidates`` gives them as ``(Limit, value)``).

    Not frozen (made by the thousand, and a frozen dataclass is twice as slow to make):
    treat as read-only.
    """

    row: int
    h_r: float
    F_tr_Rd: float
    limited_by: Limit | None = None
    raw_candidates: tuple[tuple, ...] = ()

    @property
    def candidates(self) -> tuple[tuple[Limit, float], ...]:
        """Every limit considered with its value (N), in the order tried."""
        return tuple((Limit(c[0], c[1], c[2], c[3]), c[4]) for c in self.raw_candidates)


def distribute_tension(
    *,
    h: list[float],
    alone: list[dict[Hashable, float]],
    groups: dict[tuple[int, int], dict[Hashable, float]],
    compression: dict[Hashable, float],
    F_t_Rd: float,
    explain: bool = True,
    candidates: bool = True,
) -> list[RowResult]:
    """Effective tension resistance of each bolt row, row by row from the top.

    EN 1993-1-8:2005, 6.2.7.2(6)-(9): each row takes the least of its own resistance (row
    alone, every tension component), of every group of consecutive rows ending with it less
    what the rows above in the group already take, and of the compression resistance
    (column web in compression, beam flange in compression, web panel shear / beta) less the
    rows above. When a row above takes more than 1.9 Ft,Rd, the rows below are limited to the
    triangular distribution F_tx,Rd h_r / h_x (6.2.7.2(9)).

    Args:
        h: distance of each row to the centre of compression, mm, row 1 first.
        alone: for each row, component key -> resistance of the row alone, N.
        groups: (first, last) 1-based rows of a group -> component key -> group resistance.
        compression: component key -> resistance of the compression side, N.
        F_t_Rd: tension resistance of one bolt, N (for the 1.9 Ft,Rd rule).
        explain: False skips recording the limits (``limited_by`` None, no candidates): the
            same numbers, faster, for resistances nobody reads row by row.
        candidates: False keeps the governing limit of each row but not the list of every
            limit tried.
    """
    if not explain:
        return _distribute_numbers(h, alone, groups, compression, F_t_Rd)
    by_last = _groups_by_last_row(groups)
    out: list[RowResult] = []
    prefix = [0.0]  # prefix[k]: what rows 1..k take
    strong = 1.9 * F_t_Rd
    alone_s, group_s, comp_s = LimitScope.ALONE, LimitScope.GROUP, LimitScope.COMPRESSION
    for r in range(1, len(h) + 1):
        # candidates as plain (component, scope, first, last, value) tuples: cheap to make,
        # turned into Limits only when read (RowResult.candidates)
        cands = [(key, alone_s, r, r, f) for key, f in alone[r - 1].items()]
        for i, comps in by_last.get(r, ()):
            above = prefix[r - 1] - prefix[i - 1]
            cands += [(key, group_s, i, r, f - above) for key, f in comps.items()]
        done = prefix[r - 1]
        cands += [(key, comp_s, r, r, f - done) for key, f in compression.items()]
        for x, prev in enumerate(out, start=1):
            if prev.F_tr_Rd > strong:
                cands.append((None, LimitScope.TRIANGULAR, x, r,
                              prev.F_tr_Rd * h[r - 1] / h[x - 1]))
        best = min(cands, key=_value)
        f = max(best[4], 0.0)
        prefix.append(done + f)
        out.append(RowResult(row=r, h_r=h[r - 1], F_tr_Rd=f, limited_by=Limit(*best[:4]),
                             raw_candidates=tuple(cands) if candidates else ()))
    return out


_value = itemgetter(4)


def _groups_by_last_row(groups) -> dict[int, list[tuple[int, dict]]]:
    """Groups of two rows or more keyed by their last row: last -> [(first, components)]."""
    by_last: dict[int, list[tuple[int, dict]]] = {}
    for (i, j), comps in groups.items():
        if i < j:
            by_last.setdefault(j, []).append((i, comps))
    return by_last


def _distribute_numbers(h, alone, groups, compression, F_t_Rd) -> list[RowResult]:
    """``distribute_tension`` without the limits (same rules, same order)."""
    by_last = _groups_by_last_row(groups)
    out: list[RowResult] = []
    prefix = [0.0]
    comp = min(compression.values()) if compression else None
    strong = 1.9 * F_t_Rd
    for r in range(1, len(h) + 1):
        best = min(alone[r - 1].values())
        for i, comps in by_last.get(r, ()):
            best = min(best, min(comps.values()) - (prefix[r - 1] - prefix[i - 1]))
        if comp is not None:
            best = min(best, comp - prefix[r - 1])
        for x, prev in enumerate(out):
            if prev.F_tr_Rd > strong:
                best = min(best, prev.F_tr_Rd * h[r - 1] / h[x])
        f = max(best, 0.0)
        prefix.append(prefix[r - 1] + f)
        out.append(RowResult(row=r, h_r=h[r - 1], F_tr_Rd=f))
    return out


def M_j_Rd(rows: list[RowResult]) -> float:
    """Design moment resistance Mj,Rd = sum h_r F_tr,Rd (N mm).

    EN 1993-1-8:2005, 6.2.7.2(1), Eq. (6.25).
    """
    return sum(r.h_r * r.F_tr_Rd for r in rows)


def M_N_interaction(
    M_j_Ed: float,
    M_j_Rd: float,
    N_j_Ed: float,
    N_j_Rd: float,
) -> float:
    """Utilisation of a joint under bending and axial force, Mj,Ed/Mj,Rd + Nj,Ed/Nj,Rd.

    EN 1993-1-8:2005, 6.2.7.1(3), Eq. (6.24): the joint is verified when the value is at most
    1.0. Use it when the axial force exceeds 5 % of the beam's Npl,Rd (6.2.7.1(2)).

    Args:
        M_j_Ed: design moment, N mm (its magnitude is used).
        M_j_Rd: moment resistance for the same sign, N mm.
        N_j_Ed: design axial force, N (its magnitude is used).
        N_j_Rd: axial resistance of the joint for the same sense (tension or compression), N.

    Example:
        >>> round(M_N_interaction(100e6, 200e6, 50e3, 500e3), 3)
        0.6
    """
    if M_j_Rd <= 0 or N_j_Rd <= 0:
        return float("inf")
    return abs(M_j_Ed) / M_j_Rd + abs(N_j_Ed) / N_j_Rd
