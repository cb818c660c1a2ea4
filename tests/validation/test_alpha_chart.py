"""alpha of EN 1993-1-8 Figure 6.11 by a closed-form representation of the chart.

Check values:
* the one chart reading available here: The Steel Construction Institute / BCSA, *Joints in
  Steel Construction: Moment-Resisting Joints to Eurocode 3*, P398, 2013, Appendix C, Example
  C.1, sheet 9: alpha = 7.5 read from Figure 6.11 for row 2 of the end plate, as quoted in
  ../shared/reference/published-check-values.md (Source A); a chart reading is good to about
  0.1-0.2, so 3 % is allowed;
* an identity of EN 1993-1-8 itself: on the chart's vertical branch alpha m1 equals the
  unstiffened row's non-circular length 4 m1 + 1.25 e (Table 6.4 / 6.6), since
  lambda_1,lim = 1.25 / (alpha - 2.75) (the representation is recalled from memory);
* invariants: alpha lies in [4.45, 8] and never rises when the bolt moves away from the web
  (lambda_1) or from the flange (lambda_2).
"""

from __future__ import annotations

from dataclasses import replace

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from ifcjoint.ec3.code import Component
from ifcjoint.ec3.effective_lengths import alpha_fig_6_11
from ifcjoint.engine.end_plate import check_end_plate_joint
from ifcjoint.model.codes import NoteCode
from tests.engine.test_end_plate import p398

# Example C.1 row 2 (sheets 8-9): m1 = 38.6 mm (plate), e = 75 mm, m2 = 60 - 15.6 - 0.8 x 12
M1, E, M2 = 38.6, 75.0, 60.0 - 15.6 - 0.8 * 12.0


def test_published_chart_reading():
    a = alpha_fig_6_11(M1 / (M1 + E), M2 / (M1 + E))
    assert a == pytest.approx(7.5, rel=0.03)


@settings(max_examples=60, deadline=None)
@given(m1=st.floats(10, 80), e=st.floats(20, 120))
def test_vertical_branch_is_the_unstiffened_row(m1, e):
    lam1 = m1 / (m1 + e)
    a = alpha_fig_6_11(lam1, 5.0)  # far from the flange
    expected = min(max((4 * m1 + 1.25 * e) / m1, 4.45), 8.0)
    assert a == pytest.approx(expected, rel=1e-6)


@settings(max_examples=80, deadline=None)
@given(l1=st.floats(0.05, 0.95), l2=st.floats(0.0, 2.0), d=st.floats(0.001, 0.2))
def test_alpha_is_bounded_and_monotonic(l1, l2, d):
    a = alpha_fig_6_11(l1, l2)
    assert 4.45 <= a <= 8.0
    assert alpha_fig_6_11(l1 + d, l2) <= a + 1e-9
    assert alpha_fig_6_11(l1, l2 + d) <= a + 1e-9


def test_engine_uses_the_chart_when_asked():
    inp = p398(alpha=None, alpha_method="approximation")
    r = check_end_plate_joint(inp)
    row2 = [c for c in r.hogging.components
            if c.component == Component.END_PLATE_BENDING and c.row == 2][0]
    assert row2.inputs["alpha"] == pytest.approx(7.5, rel=0.03)
    # Sheet 9: l_eff,nc = alpha m = 290 mm with alpha read as 7.5 (3 % for the reading)
    assert row2.inputs["l_eff_nc"] == pytest.approx(290, rel=0.03)
    cons = check_end_plate_joint(replace(inp, alpha_method="conservative"))
    assert r.hogging.M_j_Rd >= cons.hogging.M_j_Rd  # 4.45 is the chart's lowest value
    assert any(n.code == NoteCode.ALPHA_APPROXIMATION for n in r.notes)
