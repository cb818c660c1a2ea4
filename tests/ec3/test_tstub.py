"""T-stub resistance (EN 1993-1-8 Table 6.2): the engine's lean path against the full one."""

from __future__ import annotations

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from ifcjoint.ec3.params import RECOMMENDED
from ifcjoint.ec3.tstub import t_stub, t_stub_resistance


@settings(max_examples=200, deadline=None)
@given(l1=st.floats(50, 900), extra=st.floats(0, 300), tf=st.floats(8, 60),
       fy=st.sampled_from([235.0, 275.0, 355.0]), m=st.floats(15, 90), e=st.floats(20, 120),
       ft=st.floats(50e3, 2e6), ew=st.floats(4, 15))
def test_lean_t_stub_gives_the_full_calculation_s_numbers(l1, extra, tf, fy, m, e, ft, ew):
    # Same formulas (modes 1 by method 2, 2, 3, prying assumed): the two paths must agree.
    full = t_stub(l_eff_1=l1, l_eff_2=l1 + extra, tf=tf, fy=fy, m=m, e_min=e,
                  sum_F_t_Rd=ft, e_w=ew)
    f, mode = t_stub_resistance(l1, l1 + extra, tf, fy, m, e, ft, ew, RECOMMENDED.gamma_M0)
    assert f == pytest.approx(full.F_T_Rd, rel=1e-12)
    assert full.prying
    if len({round(full.F_T_1_Rd, 6), round(full.F_T_2_Rd, 6), round(full.F_T_3_Rd, 6)}) == 3:
        assert mode == full.mode
