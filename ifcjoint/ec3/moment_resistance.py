"""Design moment resistance of a beam-to-column joint, EN 1993-1-8 6.2.7 (N, mm).

The distribution works on resistances already computed per component, for each bolt row
alone and for each group of consecutive rows, so it can be shown, checked and tested apart
from the component formulas.
"""

from __future__ import annotations

from dataclasses import dataclass


@dataclass(frozen=True, slots=True, kw_only=True)
class RowResult:
    """Effective design tension resistance of one bolt row.

    Attributes:
        row: row number, 1 = farthest from the centre of compression.
        h_r: distance from the row to the centre of compression, mm.
        F_tr_Rd: effective tension resistance, N.
        limited_by: the component (and rows) that set it, e.g. ``column flange (rows 1-2)``.
        candidates: every limit considered, name -> N, for the calculation sheet.
    """

    row: int
    h_r: float
    F_tr_Rd: float  # noqa: N815
    limited_by: str
    candidates: dict


def distribute_tension(
    *,
    h: list[float],
    alone: list[dict[str, float]],
    groups: dict[tuple[int, int], dict[str, float]],
    compression: dict[str, float],
    F_t_Rd: float,  # noqa: N803
    explain: bool = True,
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
        alone: for each row, component name -> resistance of the row alone, N.
        groups: (first, last) 1-based rows of a group -> component name -> group resistance.
        compression: component name -> resistance of the compression side, N.
        F_t_Rd: tension resistance of one bolt, N (for the 1.9 Ft,Rd rule).
        explain: False skips naming every candidate (``limited_by`` and ``candidates`` stay
            empty): the same numbers, faster, for resistances nobody reads row by row.
    """
    if not explain:
        return _distribute_numbers(h, alone, groups, compression, F_t_Rd)
    out: list[RowResult] = []
    taken: list[float] = []
    for r in range(1, len(h) + 1):
        cands: dict[str, float] = {}
        for name, f in alone[r - 1].items():
            cands[f"{name} (row {r} alone)"] = f
        for (i, j), comps in groups.items():
            if j != r or i >= r:
                continue
            above = sum(taken[i - 1 : r - 1])
            for name, f in comps.items():
                cands[f"{name} (rows {i}-{r})"] = f - above
        done = sum(taken)
        for name, f in compression.items():
            cands[f"{name} (compression side)"] = f - done
        for x, prev in enumerate(out, start=1):
            if prev.F_tr_Rd > 1.9 * F_t_Rd:
                cands[f"triangular limit from row {x} (6.2.7.2(9))"] = (
                    prev.F_tr_Rd * h[r - 1] / h[x - 1]
                )
        name, f = min(cands.items(), key=lambda kv: kv[1])
        f = max(f, 0.0)
        taken.append(f)
        out.append(RowResult(row=r, h_r=h[r - 1], F_tr_Rd=f, limited_by=name, candidates=cands))
    return out


def _distribute_numbers(h, alone, groups, compression, F_t_Rd) -> list[RowResult]:  # noqa: N803
    """``distribute_tension`` without the names (same rules, same order)."""
    out: list[RowResult] = []
    taken: list[float] = []
    comp = list(compression.values())
    for r in range(1, len(h) + 1):
        best = min(alone[r - 1].values())
        for (i, j), comps in groups.items():
            if j == r and i < r:
                above = sum(taken[i - 1 : r - 1])
                best = min(best, min(comps.values()) - above)
        if comp:
            best = min(best, min(comp) - sum(taken))
        for x, prev in enumerate(out):
            if prev.F_tr_Rd > 1.9 * F_t_Rd:
                best = min(best, prev.F_tr_Rd * h[r - 1] / h[x])
        f = max(best, 0.0)
        taken.append(f)
        out.append(RowResult(row=r, h_r=h[r - 1], F_tr_Rd=f, limited_by="", candidates={}))
    return out


def M_j_Rd(rows: list[RowResult]) -> float:  # noqa: N802
    """Design moment resistance Mj,Rd = sum h_r F_tr,Rd (N mm).

    EN 1993-1-8:2005, 6.2.7.2(1), Eq. (6.25).
    """
    return sum(r.h_r * r.F_tr_Rd for r in rows)


def M_N_interaction(  # noqa: N802
    M_j_Ed: float,  # noqa: N803
    M_j_Rd: float,  # noqa: N803
    N_j_Ed: float,  # noqa: N803
    N_j_Rd: float,  # noqa: N803
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
