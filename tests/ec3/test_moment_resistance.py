"""EN 1993-1-8 6.2.7: distribution of row resistances and the M-N interaction."""

from __future__ import annotations

import pytest

from ifcjoint.ec3.moment_resistance import M_N_interaction, distribute_tension


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
    assert "compression" in rows[1].limited_by
