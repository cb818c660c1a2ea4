"""The welded beam-to-column check against a hand calculation and invariants."""

from __future__ import annotations

from dataclasses import replace

import pytest

from ifcjoint.ec3.code import Component
from ifcjoint.engine.inputs import MemberInput, WeldedJointInput, WeldsInput
from ifcjoint.engine.welded import check_welded_joint


def welded(**kw):
    # HEB 300 column and IPE 400 beam in S355 (EN 10365 dimensions, from memory).
    col = MemberInput(name="HEB 300", grade="S355", h=300, b=300, tw=11, tf=19, r=27, fy=355,
                      fu=490)
    beam = MemberInput(name="IPE 400", grade="S355", h=400, b=180, tw=8.6, tf=13.5, r=21,
                       fy=355, fu=490)
    a = 7.0
    base = dict(column=col, beam=beam, welds=WeldsInput(top_flange_throat=a,
                                                        bottom_flange_throat=a, web_throat=5.0),
                beta=1.0)
    base.update(kw)
    return WeldedJointInput(**base)


def test_welded_joint_by_hand():
    """Hand calculation with EN 1993-1-8 6.2.6 (numbers worked out here, not by ifcjoint):
    b_eff,c,wc = 13.5 + 2 sqrt2 7 + 5 (19 + 27) = 263.3 mm; dwc = 208; lambda_p = 0.932
    sqrt(263.3 * 208 * 355 / (210000 * 11^2)) = 0.815 > 0.72 -> rho = (0.815 - 0.2)/0.815^2
    = 0.926; omega (beta = 1): Avc = 4743 (HEB 300, common practice, no source) ->
    omega1 = 1/sqrt(1 + 1.3 (263.3*11/4743)^2) = 0.821;
    Fc,wc,Rd = 0.821 * 0.926 * 263.3 * 11 * 355 = 781 kN. Column flange: k = (19/13.5)(1) ->
    1; b_eff,b,fc = 11 + 54 + 7*19 = 198 mm; Ffc = 198 * 13.5 * 355 = 949 kN.
    Web panel Vwp,Rd = 0.9*355*4743/sqrt3 = 875 kN. Flange welds (4.5.3.3, beta_w 0.9):
    fvw,d = 490 / (sqrt3 * 0.9 * 1.25) = 251.5 MPa, Fw = 2 * 7 * 180 * 251.5 = 634 kN: the
    7 mm welds govern; Mj,Rd = 634 * (400 - 13.5) = 245 kNm."""
    r = check_welded_joint(welded())
    assert r.checked
    comps = {c.component: c.F_Rd / 1e3 for c in r.hogging.components}
    assert comps[Component.COLUMN_FLANGE_BENDING] == pytest.approx(949, rel=0.005)
    assert comps[Component.COLUMN_WEB_COMPRESSION] == pytest.approx(781, rel=0.005)
    assert comps[Component.BEAM_FLANGE_WELD] == pytest.approx(634, rel=0.005)
    assert r.hogging.M_j_Rd / 1e6 == pytest.approx(245, rel=0.005)
    assert r.hogging.governing.component == Component.BEAM_FLANGE_WELD
    assert r.V_wp_Rd / 1e3 == pytest.approx(875, rel=0.005)


def test_welded_joint_invariants():
    base = check_welded_joint(welded())
    thicker = check_welded_joint(welded(column=replace(welded().column, tf=25)))
    assert thicker.hogging.M_j_Rd >= base.hogging.M_j_Rd
    assert base.hogging.M_j_Rd == pytest.approx(base.sagging.M_j_Rd)  # same welds both ways
    balanced = check_welded_joint(welded(beta=0.0))
    assert balanced.hogging.S_j_ini > base.hogging.S_j_ini
