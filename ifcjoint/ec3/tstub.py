"""Equivalent T-stub in tension, EN 1993-1-8 6.2.4 and Table 6.2 (N, mm, MPa).

A T-stub outcome is data: the resistance of each failure mode, the governing mode and the
inputs, so a report can show the calculation.
"""

from __future__ import annotations

from dataclasses import dataclass

from ifcjoint.ec3.params import RECOMMENDED, Parameters


@dataclass(frozen=True, slots=True, kw_only=True)
class TStubResult:
    """Resistances of one T-stub (N) and the governing mode.

    Attributes:
        F_T_1_Rd: mode 1, complete yielding of the flange.
        F_T_2_Rd: mode 2, bolt failure with yielding of the flange.
        F_T_3_Rd: mode 3, bolt failure.
        F_T_Rd: the smallest.
        mode: ``1``, ``2``, ``3`` or ``1-2`` (no prying forces).
        prying: False when the bolts are long enough for no prying (Lb > Lb*).
        inputs: the values used.
    """

    F_T_1_Rd: float
    F_T_2_Rd: float
    F_T_3_Rd: float
    F_T_Rd: float
    mode: str
    prying: bool
    inputs: dict


def M_pl_Rd(l_eff: float, tf: float, fy: float, params: Parameters = RECOMMENDED) -> float:
    """Plastic moment of the T-stub flange Mpl,Rd = 0.25 l_eff tf^2 fy / gamma_M0 (N mm).

    EN 1993-1-8:2005, 6.2.4, Table 6.2 (Mpl,1,Rd with l_eff,1, Mpl,2,Rd with l_eff,2).

    Args:
        l_eff: effective length (sum over the rows of the pattern), mm.
        tf: flange (or end plate) thickness, mm.
        fy: its yield strength, MPa.
        params: partial factors.
    """
    return 0.25 * l_eff * tf * tf * fy / params.gamma_M0


def n_distance(e_min: float, m: float) -> float:
    """The distance n = e_min, limited to 1.25 m (mm).

    EN 1993-1-8:2005, 6.2.4, Table 6.2.

    Args:
        e_min: the smaller edge distance of the flange (e, or ex for the extension), mm.
        m: distance from the bolt to the web/flange root (Figure 6.2), mm.
    """
    return min(e_min, 1.25 * m)


def L_b_star(m: float, As: float, n_b: int, l_eff_1: float, tf: float) -> float:
    """Bolt elongation length limit for prying, Lb* = 8.8 m^3 As nb / (sum l_eff,1 tf^3) (mm).

    EN 1993-1-8:2005, 6.2.4, Table 6.2 (prying forces may develop when Lb <= Lb*).
    """
    return 8.8 * m**3 * As * n_b / (l_eff_1 * tf**3)


def t_stub(
    *,
    l_eff_1: float,
    l_eff_2: float,
    tf: float,
    fy: float,
    m: float,
    e_min: float,
    sum_F_t_Rd: float,
    e_w: float | None = None,
    L_b: float | None = None,
    As: float | None = None,
    n_b: int = 2,
    params: Parameters = RECOMMENDED,
) -> TStubResult:
    """Design tension resistance of a T-stub flange, modes 1, 2 and 3.

    EN 1993-1-8:2005, 6.2.4.1, Table 6.2. Mode 1 by method 1 (4 Mpl,1,Rd / m) or, when the
    washer width e_w is given, by the alternative method 2 ((8n - 2ew) Mpl,1,Rd /
    (2mn - ew(m + n))). When the bolt length L_b (and As) show no prying (Lb > Lb*), modes 1
    and 2 are replaced by 2 Mpl,1,Rd / m.

    Args:
        l_eff_1: effective length for mode 1 (min of circular and non-circular), mm.
        l_eff_2: effective length for mode 2 (non-circular), mm.
        tf: flange thickness, mm.
        fy: flange yield strength, MPa.
        m: distance bolt - root of the web/flange (Figure 6.2), mm.
        e_min: smaller edge distance, mm (n = min(e_min, 1.25 m)).
        sum_F_t_Rd: total tension resistance of the bolts of the T-stub, N.
        e_w: a quarter of the washer (or bolt head / nut) diameter, mm; None for method 1.
        L_b: bolt elongation length (grip + half head and nut heights + washers), mm.
        As: tensile stress area, mm2 (with L_b).
        n_b: number of bolt rows (with L_b).
        params: partial factors.
    """
    n = n_distance(e_min, m)
    mpl1 = M_pl_Rd(l_eff_1, tf, fy, params)
    mpl2 = M_pl_Rd(l_eff_2, tf, fy, params)
    if e_w is None:
        f1 = 4 * mpl1 / m
    else:
        f1 = (8 * n - 2 * e_w) * mpl1 / (2 * m * n - e_w * (m + n))
    f2 = (2 * mpl2 + n * sum_F_t_Rd) / (m + n)
    f3 = sum_F_t_Rd
    prying = True
    if L_b is not None and As is not None:
        prying = L_b <= L_b_star(m, As, n_b, l_eff_1, tf)
    inputs = {
        "l_eff_1": l_eff_1,
        "l_eff_2": l_eff_2,
        "tf": tf,
        "fy": fy,
        "m": m,
        "n": n,
        "e_w": e_w,
        "sum_F_t_Rd": sum_F_t_Rd,
        "M_pl_1_Rd": mpl1,
        "M_pl_2_Rd": mpl2,
    }
    if not prying:
        f12 = 2 * mpl1 / m
        best = min(f12, f3)
        return TStubResult(
            F_T_1_Rd=f12,
            F_T_2_Rd=f12,
            F_T_3_Rd=f3,
            F_T_Rd=best,
            mode="1-2" if best == f12 else "3",
            prying=False,
            inputs=inputs,
        )
    best = min(f1, f2, f3)
    mode = "1" if best == f1 else ("2" if best == f2 else "3")
    return TStubResult(
        F_T_1_Rd=f1, F_T_2_Rd=f2, F_T_3_Rd=f3, F_T_Rd=best, mode=mode, prying=True, inputs=inputs
    )


def t_stub_resistance(
    l_eff_1: float,
    l_eff_2: float,
    tf: float,
    fy: float,
    m: float,
    e_min: float,
    sum_F_t_Rd: float,
    e_w: float,
    gamma_M0: float,
) -> tuple[float, str]:
    """F_T,Rd (N) and the governing mode of a T-stub with prying forces, mode 1 by method 2.

    EN 1993-1-8:2005, 6.2.4.1, Table 6.2: the numbers of ``t_stub`` with ``e_w`` given and no
    bolt length (prying assumed), without building the record of inputs; for the engine's
    inner loops. ``t_stub`` gives the same values with every intermediate for a report.
    """
    n = min(e_min, 1.25 * m)
    k = 0.25 * tf * tf * fy / gamma_M0
    f1 = (8 * n - 2 * e_w) * k * l_eff_1 / (2 * m * n - e_w * (m + n))
    f2 = (2 * k * l_eff_2 + n * sum_F_t_Rd) / (m + n)
    if f1 <= f2 and f1 <= sum_F_t_Rd:
        return f1, "1"
    if f2 <= sum_F_t_Rd:
        return f2, "2"
    return sum_F_t_Rd, "3"
