"""Verification of a joint against load combinations (EN 1993-1-8 6.2.7, 5.3, 6.2.7.1)."""

from __future__ import annotations

import math
from dataclasses import replace

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from ifcjoint.engine.end_plate import check_end_plate_joint
from ifcjoint.engine.verify import (
    assumption_check,
    transformation_beta,
    verify_combination,
    verify_joint,
    web_panel_shear,
)
from ifcjoint.model.codes import JointModel, NoteCode, Status
from ifcjoint.model.demands import Demand
from tests.engine.test_end_plate import p398

ENGINE = {"engine": check_end_plate_joint}


def test_sagging_demand_is_checked_against_the_sagging_resistance():
    # A plate extended at the top only: sagging resistance is lower (the bottom is flush), and a
    # sagging moment must be compared with it, a hogging one with the hogging resistance.
    inp = p398(beta=1.0)
    r = check_end_plate_joint(inp)
    assert r.sagging.M_j_Rd < r.hogging.M_j_Rd
    m = 0.5 * (r.sagging.M_j_Rd + r.hogging.M_j_Rd)  # between the two resistances
    sag = verify_combination(inp, Demand(combination="s", M_Ed=+m, V_Ed=0.0), double_sided=False,
                             **ENGINE)
    hog = verify_combination(inp, Demand(combination="h", M_Ed=-m, V_Ed=0.0), double_sided=False,
                             **ENGINE)
    u_sag = [u for u in sag.utilisations if u.clause.ref == "6.2.7.2"][0]
    u_hog = [u for u in hog.utilisations if u.clause.ref == "6.2.7.2"][0]
    assert u_sag.sense == "sagging" and u_sag.utilisation > 1.0
    assert u_hog.sense == "hogging" and u_hog.utilisation < 1.0


def test_beta_follows_table_5_4():
    # EN 1993-1-8 Table 5.4: single-sided 1; equal moments both sides 0; opposed moments 2.
    d = Demand(combination="c", M_Ed=-100e6, V_Ed=0.0)
    assert transformation_beta(d, double_sided=False)[0] == 1.0
    assert transformation_beta(replace(d, M_other=-100e6), double_sided=True)[0] == 0.0
    assert transformation_beta(replace(d, M_other=+100e6), double_sided=True)[0] == 2.0
    b, note = transformation_beta(d, double_sided=True)  # other side not given: reported
    assert b == 1.0 and note.code == NoteCode.BETA_OTHER_SIDE_MISSING


def test_web_panel_shear_by_hand():
    # EN 1993-1-8 5.3(3), Eq. (5.3), by hand: (Mb1 - Mb2)/z - (Vc1 - Vc2)/2
    # = (-300e6 - (-100e6)) / 400 - (100e3 - 40e3) / 2 = -500e3 - 30e3 -> 530 kN.
    d = Demand(combination="c", M_Ed=-300e6, V_Ed=0.0, M_other=-100e6, Vc_above=100e3,
               Vc_below=40e3)
    v, note = web_panel_shear(d, 400.0)
    assert v == pytest.approx(530e3) and note is None
    v0, note0 = web_panel_shear(replace(d, Vc_above=None, Vc_below=None), 400.0)
    assert v0 == pytest.approx(500e3) and note0.code == NoteCode.COLUMN_SHEARS_ZERO
    balanced = replace(d, M_other=-300e6, Vc_above=None, Vc_below=None)
    assert web_panel_shear(balanced, 400.0)[0] == pytest.approx(0.0)


def test_balanced_double_sided_joint_is_stronger_than_single_sided():
    # beta = 0 removes the web panel limit and omega reduction (6.2.7.2(7), Table 6.3).
    inp = p398(beta=1.0)
    d = Demand(combination="c", M_Ed=-300e6, V_Ed=100e3)
    single = verify_combination(inp, d, double_sided=False, **ENGINE)
    double = verify_combination(inp, replace(d, M_other=-300e6), double_sided=True, **ENGINE)
    assert double.beta == 0.0
    assert double.result.hogging.M_j_Rd >= single.result.hogging.M_j_Rd


def test_axial_force_above_5_percent_adds_the_interaction():
    # 6.2.7.1(2): N_Ed > 0.05 Npl,Rd of the beam. UKB 533x210x92: A about 11 700 mm2 (from
    # memory), Npl,Rd about 3220 kN in S275, 5 % about 160 kN.
    inp = p398(beta=1.0)
    small = verify_combination(inp, Demand(combination="c", M_Ed=-100e6, V_Ed=0.0,
                                           N_Ed=100e3), double_sided=False, **ENGINE)
    large = verify_combination(inp, Demand(combination="c", M_Ed=-100e6, V_Ed=0.0,
                                           N_Ed=300e3), double_sided=False, **ENGINE)
    assert not any(u.clause.ref == "6.2.7.1(3)" for u in small.utilisations)
    assert any(n.code == NoteCode.AXIAL_NEGLECTED for n in small.notes)
    mn = [u for u in large.utilisations if u.clause.ref == "6.2.7.1(3)"][0]
    m = [u for u in large.utilisations if u.clause.ref == "6.2.7.2"][0]
    # Eq. (6.24): the interaction adds N/Nj,Rd to the moment utilisation
    assert mn.utilisation == pytest.approx(m.utilisation + 300e3 / large.result.N_j_Rd_tension)
    comp = verify_combination(inp, Demand(combination="c", M_Ed=-100e6, V_Ed=0.0,
                                          N_Ed=-300e3), double_sided=False, **ENGINE)
    mn_c = [u for u in comp.utilisations if u.clause.ref == "6.2.7.1(3)"][0]
    assert mn_c.sense == "compression"


@settings(max_examples=25, deadline=None)
@given(k=st.floats(0.1, 5.0), m=st.floats(10, 400), v=st.floats(10, 400))
def test_utilisations_scale_with_the_demand(k, m, v):
    # The check is linear in the demand once beta is fixed (single-sided: beta = 1).
    inp = p398(beta=1.0)
    a = verify_combination(inp, Demand(combination="c", M_Ed=-m * 1e6, V_Ed=v * 1e3),
                           double_sided=False, **ENGINE)
    b = verify_combination(inp, Demand(combination="c", M_Ed=-k * m * 1e6, V_Ed=k * v * 1e3),
                           double_sided=False, **ENGINE)
    for ua, ub in zip(a.utilisations, b.utilisations, strict=True):
        assert ub.utilisation == pytest.approx(k * ua.utilisation, rel=1e-9)


def test_verdict_over_combinations_and_no_demands():
    inp = p398(beta=1.0)
    r = check_end_plate_joint(inp)
    weak = 0.5 * r.hogging.M_j_Rd
    strong = 1.2 * r.hogging.M_j_Rd
    v = verify_joint(inp, [Demand(combination="A", M_Ed=-weak, V_Ed=0.0),
                           Demand(combination="B", M_Ed=-strong, V_Ed=0.0)],
                    double_sided=False, **ENGINE)
    assert v.status == Status.FAIL and v.governing.combination == "B"
    m_b = [u for u in v.combinations[1].utilisations if u.clause.ref == "6.2.7.2"][0]
    assert m_b.utilisation == pytest.approx(1.2, rel=1e-6)
    assert v.governing.utilisation >= m_b.utilisation
    ok = verify_joint(inp, [Demand(combination="A", M_Ed=-weak, V_Ed=0.0)], double_sided=False,
                      **ENGINE)
    assert ok.status == Status.PASS
    none = verify_joint(inp, [], double_sided=False, **ENGINE)
    assert none.status == Status.NO_DEMANDS and none.governing is None


def test_assumption_check_against_stiffness_class():
    # EN 1993-1-8 5.2.2.5: rigid only if Sj,ini >= kb E Ib / Lb. The published example's beam
    # over 6 m is semi-rigid with this joint (Sj,ini well below 8 E Ib / Lb).
    beam = replace(p398().beam, span=6000.0, Iy=55230e4)  # Iy from memory
    r = check_end_plate_joint(p398(beam=beam, beta=1.0))
    rigid_from = 8 * 210000 * 55230e4 / 6000
    assert r.hogging.S_j_ini < rigid_from and math.isfinite(r.hogging.S_j_ini)
    assert assumption_check(r, JointModel.RIGID).match is False
    assert assumption_check(r, JointModel.SEMI_RIGID).match is True
    assert assumption_check(r, None) is None
