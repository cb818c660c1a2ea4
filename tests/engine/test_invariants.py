"""Invariants of the end-plate check over random well-detailed joints (hypothesis).

Each property is a consequence of the component method itself (EN 1993-1-8 6.2, 6.3), not of
ifcjoint's numbers: more material never weakens a component; springs in series are never
stiffer than their stiffest part; a joint turned upside down swaps its moment signs.

One step belongs to the standard itself: 6.2.7.2(9) cuts the rows below a row stronger than
1.9 Ft,Rd to a triangular distribution (that row is no longer ductile). A thicker plate can
push a row over that line and lower Mj,Rd; the monotonicity properties hold where neither
joint has the cut, and the step is asserted where it is.
"""

from __future__ import annotations

import math
from dataclasses import replace

import pytest
from hypothesis import HealthCheck, assume, given, settings
from hypothesis import strategies as st

from ifcjoint.ec3.bolts import bolt_elongation_length
from ifcjoint.ec3.moment_resistance import LimitScope
from ifcjoint.ec3.params import RECOMMENDED
from ifcjoint.engine.end_plate import check_end_plate_joint
from ifcjoint.engine.inputs import EndPlateJointInput
from tests.support.joints import random_end_plate_joint, stiffeners_for

SIGNS = ("hogging", "sagging")
SETTINGS = settings(max_examples=60, deadline=None,
                    suppress_health_check=[HealthCheck.filter_too_much])
seeds = st.integers(0, 10**6)


def joint(seed: int) -> EndPlateJointInput:
    inp = random_end_plate_joint(seed)
    assume(inp is not None)
    return inp


def _m(r, sign):
    return r.side(sign).M_j_Rd


def _cut(*results) -> bool:
    """Whether 6.2.7.2(9)'s triangular limit acts on any row of the results."""
    return any(x.limited_by is not None and x.limited_by.scope == LimitScope.TRIANGULAR
               for r in results for sign in SIGNS for x in r.side(sign).rows)


def _assert_not_lower(a, b, sign):
    """Mj,Rd of ``a`` is at least that of ``b``, unless 6.2.7.2(9) cuts rows in either."""
    if _cut(a, b):
        return
    assert _m(a, sign) >= _m(b, sign) * (1 - 1e-9)


@SETTINGS
@given(seed=seeds, dt=st.sampled_from([2.0, 5.0, 10.0]))
def test_a_thicker_end_plate_never_lowers_mj_rd(seed, dt):
    # 6.2.6.5 and Table 6.2: every T-stub mode grows with t_p. Same strengths kept (a thicker
    # plate of a lower Table 3.1 row is another question).
    inp = joint(seed)
    base = check_end_plate_joint(inp)
    thicker = check_end_plate_joint(replace(inp, plate=replace(inp.plate, tp=inp.plate.tp + dt)))
    for sign in SIGNS:
        _assert_not_lower(thicker, base, sign)


@SETTINGS
@given(seed=seeds, dt=st.sampled_from([1.0, 3.0, 6.0]))
def test_a_thicker_column_flange_never_lowers_mj_rd(seed, dt):
    # 6.2.6.4 (T-stub grows with t_fc), 6.2.6.2 (b_eff,c,wc grows with t_fc), 6.2.6.1 (A_vc
    # grows when 2 r > t_w, true of rolled sections).
    inp = joint(seed)
    assume(2 * inp.column.r > inp.column.tw)
    base = check_end_plate_joint(inp)
    col = replace(inp.column, tf=inp.column.tf + dt)
    thicker = check_end_plate_joint(replace(inp, column=col))
    for sign in SIGNS:
        _assert_not_lower(thicker, base, sign)


@SETTINGS
@given(seed=seeds, tension=st.booleans(), compression=st.booleans())
def test_adding_a_stiffener_never_lowers_a_resistance(seed, tension, compression):
    # 6.2.6.1(4), 6.2.6.2, 6.2.6.4.2 (Table 6.5): a stiffener adds resistance or none.
    assume(tension or compression)
    inp = joint(seed)
    assume(not inp.stiffeners)
    base = check_end_plate_joint(inp)
    r = check_end_plate_joint(replace(inp, stiffeners=stiffeners_for(inp, tension, compression)))
    assert r.checked
    for sign in SIGNS:
        _assert_not_lower(r, base, sign)
        assert r.side(sign).F_c_flange_Rd >= base.side(sign).F_c_flange_Rd * (1 - 1e-9)
    assert r.V_wp_Rd >= base.V_wp_Rd * (1 - 1e-9)


@SETTINGS
@given(seed=seeds)
def test_sj_ini_never_exceeds_the_bolts_alone(seed):
    # 6.3.1 Eq. (6.27) with 6.3.3.1: with k1 = k2 = infinity, Sj,ini = E z_eq k_eq z_eq
    # = E sum(k_eff,r h_r^2), and k_eff,r <= k10 (springs in series), so
    # Sj,ini <= E k10 sum(h_r^2) with k10 = 1.6 As / L_b (Table 6.11).
    inp = joint(seed)
    r = check_end_plate_joint(inp)
    lb = bolt_elongation_length(inp.plate.tp + inp.column.tf, inp.bolts.d)
    k10 = 1.6 * inp.bolts.As / lb
    for sign in SIGNS:
        side = r.side(sign)
        if not side.rows:
            assert side.S_j_ini is None and side.M_j_Rd == 0
            continue
        bound = RECOMMENDED.E * k10 * sum(x.h_r**2 for x in side.rows)
        assert 0 < side.S_j_ini <= bound * (1 + 1e-9)


@SETTINGS
@given(seed=seeds)
def test_a_joint_turned_upside_down_swaps_its_signs(seed):
    # Geometry only: mirroring the rows, projections and flange welds about mid-depth turns
    # hogging into sagging (6.2.7.2 applies to either face in tension).
    inp = joint(seed)
    h = inp.beam.h
    b, pl, w = inp.bolts, inp.plate, inp.welds
    flipped = replace(
        inp,
        bolts=replace(b, rows_from_beam_top=tuple(sorted(h - z for z in b.rows_from_beam_top))),
        plate=replace(pl, projection_top=pl.projection_bottom,
                      projection_bottom=pl.projection_top),
        welds=replace(w, top_flange_throat=w.bottom_flange_throat,
                      bottom_flange_throat=w.top_flange_throat),
        stiffeners=tuple(replace(s, level=h - s.level) for s in inp.stiffeners),
    )
    a, f = check_end_plate_joint(inp), check_end_plate_joint(flipped)
    assert f.sagging.M_j_Rd == pytest.approx(a.hogging.M_j_Rd, rel=1e-9)
    assert f.hogging.M_j_Rd == pytest.approx(a.sagging.M_j_Rd, rel=1e-9)
    if a.hogging.S_j_ini is not None:
        assert f.sagging.S_j_ini == pytest.approx(a.hogging.S_j_ini, rel=1e-9)


@SETTINGS
@given(seed=seeds)
def test_every_resistance_is_finite_and_not_negative(seed):
    # A resistance is never negative (the engine also asserts it); the row forces sum to the
    # moment over their lever arms (6.2.7.2(1), Eq. (6.25)).
    r = check_end_plate_joint(joint(seed))
    for sign in SIGNS:
        side = r.side(sign)
        for c in side.components:
            assert math.isfinite(c.F_Rd) and c.F_Rd >= 0, c
        assert side.M_j_Rd == pytest.approx(sum(x.F_tr_Rd * x.h_r for x in side.rows))
        assert all(x.F_tr_Rd >= 0 for x in side.rows)


@SETTINGS
@given(seed=seeds)
def test_the_triangular_cut_acts_only_below_a_row_stronger_than_1_9_ft_rd(seed):
    # 6.2.7.2(9): F_tr,Rd <= F_tx,Rd h_r / h_x below a row x with F_tx,Rd > 1.9 Ft,Rd, and
    # only there.
    inp = joint(seed)
    r = check_end_plate_joint(inp)
    ft = 0.9 * inp.bolts.fub * inp.bolts.As / RECOMMENDED.gamma_M2  # Table 3.4
    for sign in SIGNS:
        rows = r.side(sign).rows
        for x in rows:
            lim = x.limited_by
            if lim is not None and lim.scope == LimitScope.TRIANGULAR:
                top = rows[lim.first - 1]
                assert top.F_tr_Rd > 1.9 * ft
                assert x.F_tr_Rd == pytest.approx(top.F_tr_Rd * x.h_r / top.h_r)
        strong = [x for x in rows if x.F_tr_Rd > 1.9 * ft * (1 + 1e-9)]
        if strong:
            first = strong[0]
            for x in rows[first.row:]:
                assert x.F_tr_Rd <= first.F_tr_Rd * x.h_r / first.h_r * (1 + 1e-9)
