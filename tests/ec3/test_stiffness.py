"""Stiffness and classification: invariants and the code's own boundaries.

Sources: EN 1993-1-8:2005 6.3 (Eq. 6.27, Table 6.8, Table 6.11) and 5.2.2.5 / 5.2.3.3.
No published stiffness value is reproduced yet; these tests show the formulas' structure.
"""

from __future__ import annotations

import pytest
from hypothesis import given
from hypothesis import strategies as st

from ifcjoint.ec3 import stiffness as s


@given(z=st.floats(100, 1000), k=st.lists(st.floats(1, 100), min_size=2, max_size=6),
       f=st.floats(0.5, 3))
def test_sj_ini_scales_with_z_squared(z, k, f):
    assert s.S_j_ini(f * z, k) == pytest.approx(f * f * s.S_j_ini(z, k), rel=1e-9)


@given(k=st.lists(st.floats(1, 100), min_size=1, max_size=5), extra=st.floats(1, 100))
def test_adding_a_component_in_series_never_stiffens(k, extra):
    assert s.k_eff_row(k + [extra]) <= s.k_eff_row(k)


def test_equivalent_lever_arm_of_one_row_is_its_lever_arm():
    z, k = s.equivalent_lever_arm([5.0], [400.0])
    assert z == pytest.approx(400.0) and k == pytest.approx(5.0)


def test_mu_table_6_8():
    assert s.stiffness_ratio_mu(60, 100) == 1.0  # below 2/3 Mj,Rd
    assert s.stiffness_ratio_mu(100, 100) == pytest.approx(1.5**2.7)


def test_stiffness_classification_boundaries():
    e, ib, lb = 210_000.0, 1e8, 6000.0
    rigid = 8 * e * ib / lb
    assert s.classify_stiffness(rigid, ib, lb, braced=True)[0] == "rigid"
    assert s.classify_stiffness(rigid * 0.99, ib, lb, braced=True)[0] == "semi-rigid"
    assert s.classify_stiffness(rigid, ib, lb, braced=False)[0] == "semi-rigid"  # kb = 25
    assert s.classify_stiffness(0.5 * e * ib / lb, ib, lb, braced=True)[0] == "nominally pinned"


def test_strength_classification_boundaries():
    assert s.classify_strength(500, 500, 400)[0] == "full-strength"
    # column stops at the joint: the boundary is Mpl,c,Rd itself (200), not 2 Mpl,c,Rd
    assert s.classify_strength(199, 500, 200, column_continues_above=False) == (
        "partial-strength", 200)
    assert s.classify_strength(199, 500, 200)[0] == "partial-strength"  # boundary 400
    assert s.classify_strength(100, 500, 400)[0] == "nominally pinned"
    assert s.classify_strength(300, 500, 400)[0] == "partial-strength"


def test_web_panel_demand_and_beta():
    # EN 1993-1-8 5.3(3) Eq. (5.3) and Table 5.4 (approximate beta values).
    from ifcjoint.ec3.components import V_wp_Ed, axial_force_significant, beta_from_moments

    assert V_wp_Ed(300e6, 100e6, 400.0) == pytest.approx(500e3)
    assert V_wp_Ed(300e6, 100e6, 400.0, 40e3, -20e3) == pytest.approx(500e3 - 30e3)
    assert beta_from_moments(200e6, None) == 1.0
    assert beta_from_moments(200e6, 200e6) == 0.0
    assert beta_from_moments(200e6, 100e6) == 1.0
    assert beta_from_moments(200e6, -100e6) == 2.0
    # 6.2.7.1(2): 5 % of Npl,Rd = 0.05 * 8446 mm2 * 355 MPa = 149.9 kN (IPE 400 area from
    # memory, 8446 mm2)
    assert not axial_force_significant(149e3, 8446, 355)
    assert axial_force_significant(151e3, 8446, 355)


def test_m_phi_curve_shape():
    # EN 1993-1-8 6.3.1(4): slope Sj,ini up to 2/3 Mj,Rd, softer after, ends at Mj,Rd.
    curve = s.m_phi_curve(300e6, 60e9, n=30)
    assert curve[0] == (0.0, 0.0) and curve[-1][1] == pytest.approx(300e6)
    first = curve[10]  # M = 100 kNm < 2/3 Mj,Rd
    assert first[1] / first[0] == pytest.approx(60e9)
    last = curve[-1]
    assert last[0] == pytest.approx(300e6 * 1.5**2.7 / 60e9)
    phis = [p for p, _ in curve]
    assert phis == sorted(phis)


def test_parameters_from_a_file(tmp_path):
    from ifcjoint.ec3.params import Parameters

    f = tmp_path / "na.toml"
    f.write_text("gamma_M2 = 1.3\nkb_braced = 8\n")
    p = Parameters.from_toml(f)
    assert p.gamma_M2 == 1.3 and p.gamma_M0 == 1.0  # the rest stays recommended
    f.write_text("gamma_M3 = 1.1\n")
    with pytest.raises(ValueError, match="unknown parameter"):
        Parameters.from_toml(f)
    f.write_text("gamma_M0 = -1\n")
    with pytest.raises(ValueError, match="not a positive number"):
        Parameters.from_toml(f)


def test_bearing_by_hand():
    """EN 1993-1-8 Table 3.4 by hand: M24 8.8 (d0 26) in a 25 mm S275 plate (fu 410),
    e1 = 50, e2 = 75, p2 = 100: alpha_b = min(50/78, 800/410, 1) = 0.641; k1 = min(2.8*75/26
    - 1.7, 1.4*100/26 - 1.7, 2.5) = min(6.38, 3.68, 2.5) = 2.5; Fb,Rd = 2.5 * 0.641 * 410 * 24
    * 25 / 1.25 = 315.4 kN."""
    from ifcjoint.ec3.bolts import F_b_Rd, alpha_b, k1_bearing

    ab = alpha_b(d0=26, fub=800, fu=410, e1=50)
    k1 = k1_bearing(d0=26, e2=75, p2=100)
    assert ab == pytest.approx(50 / 78) and k1 == 2.5
    assert F_b_Rd(k1, ab, 410, 24, 25) / 1e3 == pytest.approx(315.4, rel=0.002)
    # inner bolt, p1 = 90: alpha_d = 90/78 - 0.25 = 0.904
    assert alpha_b(d0=26, fub=800, fu=410, p1=90) == pytest.approx(90 / 78 - 0.25)
