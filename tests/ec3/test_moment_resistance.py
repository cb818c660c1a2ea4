"""EN 1993-1-8 6.2.7: distribution of row resistances and the M-N interaction."""

from __future__ import annotations

import pytest

from ifcjoint.ec3.moment_resistance import (
    Limit,
    LimitScope,
    M_N_interaction,
    distribute_tension,
)


def test_m_n_interaction_by_hand():
    # EN 1993-1-8 6.2.7.1(3), Eq. (6.24), by hand: 120/300 + 200/800 = 0.4 + 0.25 = 0.65.
    assert M_N_interaction(120e6, 300e6, 200e3, 800e3) == pytest.approx(0.65)
    # signs do not matter, magnitudes do (the resistance passed is the one for that sense)
    assert M_N_interaction(-120e6, 300e6, -200e3, 800e3) == pytest.approx(0.65)
    assert M_N_interaction(1e6, 0.0, 0.0, 1.0) == float("inf")


def test_compression_side_limits_the_lower_rows():
    # EN 1993-1-8 6.2.7.2(7), by hand: rows alone 300 and 250 kN, compression 400 kN;
    # row 1 takes 300, row 2 is left with 400 - 300 = 100.
    rows = distribute_tension(h=[500.0, 400.0], alone=[{"a": 300e3}, {"a": 250e3}], groups={},
                              compression={"web": 400e3}, F_t_Rd=1e9)
    assert [r.F_tr_Rd for r in rows] == [pytest.approx(300e3), pytest.approx(100e3)]
    assert rows[1].limited_by == Limit("web", LimitScope.COMPRESSION, 2, 2)


def test_unnamed_distribution_gives_the_same_numbers():
    # explain=False is the same rules without the names (used for Nj,Rd): random cases.
    import random

    rnd = random.Random(7)
    for _ in range(300):
        n = rnd.randint(1, 5)
        h = sorted((rnd.uniform(50, 900) for _ in range(n)), reverse=True)
        alone = [{"a": rnd.uniform(50e3, 500e3), "b": rnd.uniform(50e3, 500e3)} for _ in range(n)]
        groups = {(i, j): {"g": rnd.uniform(100e3, 1500e3)}
                  for i in range(1, n + 1) for j in range(i + 1, n + 1)}
        comp = rnd.choice([{}, {"c": rnd.uniform(200e3, 2000e3)}])
        ft = rnd.uniform(100e3, 300e3)
        full = distribute_tension(h=h, alone=alone, groups=groups, compression=comp, F_t_Rd=ft)
        fast = distribute_tension(h=h, alone=alone, groups=groups, compression=comp, F_t_Rd=ft,
                                  explain=False)
        assert [r.F_tr_Rd for r in fast] == pytest.approx([r.F_tr_Rd for r in full], rel=1e-12)
