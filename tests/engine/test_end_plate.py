"""The end-plate joint check end to end, against the published example and invariants.

Published example: The Steel Construction Institute / BCSA, *Joints in Steel Construction:
Moment-Resisting Joints to Eurocode 3*, P398, 2013, Appendix C, Example C.1, sheets 1-23, as
quoted in ../shared/reference/published-check-values.md (Source A): Mj,Rd = 416 kNm with rows
377 / 320 / 144 kN (sheet 22) and Vj,Rd = 500 kN (sheet 23; the source takes 0.28 Fv,Rd for
bolts in tension rows, 1 - 1/1.4 gives about +0.7 %).
"""

from __future__ import annotations

import math
from dataclasses import replace

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from ifcjoint.ec3.code import EN_1993_1_8, Component
from ifcjoint.engine.end_plate import check_end_plate_joint
from ifcjoint.engine.inputs import (
    BoltsInput,
    EndPlateJointInput,
    MemberInput,
    PlateInput,
    StiffenerInput,
    WeldsInput,
)
from ifcjoint.model.codes import NotCheckedCode, NoteCode
from ifcjoint.report.results import result_dict


def p398(**kw) -> EndPlateJointInput:
    col = MemberInput(name="UKC 254x254x107", grade="S275", h=266.7, b=258.8, tw=12.8, tf=20.5,
                      r=12.7, fy=265, fu=410)
    beam = MemberInput(name="UKB 533x210x92", grade="S275", h=533.1, b=209.3, tw=10.1, tf=15.6,
                       r=12.7, fy=275, fu=410)
    plate = PlateInput(grade="S275", tp=25, bp=250, hp=670, fy=265, fu=410, projection_top=90,
                       projection_bottom=670 - 90 - 533.1)
    bolts = BoltsInput(d=24, grade="8.8", fub=800, As=353, d0=26, gauge=100,
                       rows_from_beam_top=(-40.0, 60.0, 150.0, 533.1 - 60.0))
    welds = WeldsInput(top_flange_throat=12 / math.sqrt(2), bottom_flange_throat=8 / math.sqrt(2),
                       web_throat=8 / math.sqrt(2), assumed=False)
    base = dict(column=col, beam=beam, plate=plate, bolts=bolts, welds=welds, beta=0.0,
                alpha=7.5, washer_dia=39.55)
    base.update(kw)
    return EndPlateJointInput(**base)


def test_published_example_moment_and_shear():
    r = check_end_plate_joint(p398())
    assert r.checked
    rows = [x.F_tr_Rd / 1e3 for x in r.hogging.rows]
    assert rows == [pytest.approx(377, rel=0.005), pytest.approx(320, rel=0.01),
                    pytest.approx(144, rel=0.02)]
    assert r.hogging.M_j_Rd / 1e6 == pytest.approx(416, rel=0.005)
    assert r.V_j_Rd / 1e3 == pytest.approx(500, rel=0.01)
    d = result_dict(r, EN_1993_1_8)
    assert d["resistance"]["Mj_Rd_hogging_kNm"] == pytest.approx(416, rel=0.005)
    assert {c["clause"] for c in d["components"]} >= {"6.2.6.1", "6.2.6.2", "6.2.6.3",
                                                        "6.2.6.4", "6.2.6.5", "6.2.6.7",
                                                        "6.2.6.8"}
    assert d["inputs"]["bolts"]["rows_from_beam_top"][0] == -40.0
    assert "span_mm" in d["inputs"]["beam"] and d["inputs"]["welds"]["flange_throat"] > 0
    assert d["m_phi"]["hogging"][-1][1] == pytest.approx(416, rel=0.005)  # curve ends at Mj,Rd


def test_plate_extended_only_at_the_top_is_weaker_in_sagging():
    r = check_end_plate_joint(p398())
    assert r.sagging.M_j_Rd < r.hogging.M_j_Rd


def test_symmetric_flush_joint_is_the_same_both_ways():
    a = 8 / math.sqrt(2)  # the same welds on both flanges (the example's differ)
    inp = p398(plate=replace(p398().plate, projection_top=15, projection_bottom=15, hp=563.1),
               bolts=replace(p398().bolts, rows_from_beam_top=(60.0, 150.0, 383.1, 473.1)),
               welds=WeldsInput(top_flange_throat=a, bottom_flange_throat=a, web_throat=a))
    r = check_end_plate_joint(inp)
    assert r.hogging.M_j_Rd == pytest.approx(r.sagging.M_j_Rd, rel=1e-9)
    assert r.hogging.S_j_ini == pytest.approx(r.sagging.S_j_ini, rel=1e-9)


@settings(max_examples=30, deadline=None)
@given(dtp=st.floats(0, 15), dtf=st.floats(0, 10), fy=st.sampled_from([235, 275, 355]))
def test_thicker_plate_or_flange_or_stronger_steel_never_lowers_mj_rd(dtp, dtf, fy):
    base = check_end_plate_joint(p398()).hogging.M_j_Rd
    thicker = p398(plate=replace(p398().plate, tp=25 + dtp, fy=max(265, fy)),
                   column=replace(p398().column, tf=20.5 + dtf, fy=max(265, fy)))
    assert check_end_plate_joint(thicker).hogging.M_j_Rd >= base * (1 - 1e-9)


def test_larger_bolt_or_stronger_class_never_lowers_mj_rd():
    base = check_end_plate_joint(p398()).hogging.M_j_Rd
    b109 = p398(bolts=replace(p398().bolts, grade="10.9", fub=1000))
    m30 = p398(bolts=replace(p398().bolts, d=30, As=561, d0=33), washer_dia=None)
    assert check_end_plate_joint(b109).hogging.M_j_Rd >= base
    assert check_end_plate_joint(m30).hogging.M_j_Rd >= base * (1 - 1e-9)


def test_web_panel_flexibility_lowers_the_stiffness():
    # Eq. (6.27) with Table 6.11: a balanced double-sided joint (beta = 0) has no k1 term, so
    # it is stiffer than the same joint single-sided (beta = 1); z_eq lies between the rows.
    single = check_end_plate_joint(p398(beta=1.0)).hogging
    double = check_end_plate_joint(p398(beta=0.0)).hogging
    assert 0 < single.S_j_ini < double.S_j_ini
    assert 375.3 < double.z < 565.3


H, TF = 533.1, 15.6
# Pairs of stiffeners as in SCI P398 Example C.2 (../shared/reference, Source C): 15 x 110 mm,
# 15 mm corner snipes, the column's fy.
COMP = StiffenerInput(level=H - TF / 2, t=15, b=110, fy=265, snipe=15)
TENS = StiffenerInput(level=TF / 2, t=15, b=110, fy=265, snipe=15, weld_leg=8)


@pytest.mark.parametrize("stiff", [(COMP,), (TENS,), (COMP, TENS),
                                   (StiffenerInput(level=H / 2, t=15, b=110, fy=265),)])
def test_a_stiffener_never_lowers_a_resistance(stiff):
    # Invariant: adding plate never lowers the plastic resistance of a component (the check
    # keeps the unstiffened value where the stiffened one would be lower).
    for beta in (0.0, 1.0):
        base = check_end_plate_joint(p398(beta=beta))
        r = check_end_plate_joint(p398(beta=beta, stiffeners=stiff))
        assert r.checked
        for sign in ("hogging", "sagging"):
            assert r.side(sign).M_j_Rd >= base.side(sign).M_j_Rd * (1 - 1e-9)
            assert r.side(sign).F_c_flange_Rd >= base.side(sign).F_c_flange_Rd * (1 - 1e-9)
        assert r.V_wp_Rd >= base.V_wp_Rd


def test_compression_stiffener_stiffens_the_compression_zone():
    # EN 1993-1-8 Table 6.11: k2 is infinite under a compression stiffener; k3 follows its
    # formula for a bolted joint whether stiffened or not.
    base = check_end_plate_joint(p398(beta=1.0))
    comp = check_end_plate_joint(p398(beta=1.0, stiffeners=(COMP,)))
    assert comp.hogging.S_j_ini > base.hogging.S_j_ini
    assert any(n.code == NoteCode.COMPRESSION_STIFFENER for n in comp.notes)
    both = check_end_plate_joint(p398(beta=1.0, stiffeners=(COMP, TENS)))
    assert both.V_wp_Rd > base.V_wp_Rd  # 6.2.6.1(4): V_wp,add,Rd between the stiffeners


def test_out_of_scope_is_not_checked_with_a_reason():
    r = check_end_plate_joint(p398(bolts=replace(p398().bolts, rows_from_beam_top=(60.0,))))
    assert not r.checked and r.not_checked.code == NotCheckedCode.FEWER_THAN_TWO_ROWS
    assert result_dict(r, EN_1993_1_8)["status"] == "not_checked"


def test_single_sided_joint_is_limited_by_the_web_panel():
    double = check_end_plate_joint(p398()).hogging.M_j_Rd
    single = check_end_plate_joint(p398(beta=1.0)).hogging.M_j_Rd
    assert single <= double


def test_column_compression_reduces_the_web_in_compression():
    # EN 1993-1-8 6.2.6.2(2): k_wc = 1.7 - sigma / fy above 0.7 fy (0.8 * 265 -> k_wc = 0.9).
    base = check_end_plate_joint(p398()).hogging
    loaded = check_end_plate_joint(p398(sigma_com_Ed=0.8 * 265)).hogging
    cwc = Component.COLUMN_WEB_COMPRESSION
    f0 = next(c.F_Rd for c in base.components if c.component == cwc)
    f1 = next(c.F_Rd for c in loaded.components if c.component == cwc)
    assert f1 == pytest.approx(0.9 * f0)
    assert loaded.M_j_Rd <= base.M_j_Rd


def test_axial_resistances_of_the_joint_for_m_n_interaction():
    # EN 1993-1-8 6.2.7.1(3): Nj,Rd is the joint's resistance with no moment. Invariants: pure
    # tension engages the rows of both halves, so it exceeds what the hogging half carries in
    # bending; compression is at most both flanges' beam-side limit, 2 Fc,fb,Rd.
    r = check_end_plate_joint(p398())
    hog_rows = sum(x.F_tr_Rd for x in r.hogging.rows)
    assert r.N_j_Rd_tension > hog_rows
    fcfb = [c.F_Rd for c in r.hogging.components if c.clause.ref == "6.2.6.7"][0]
    assert 0 < r.N_j_Rd_compression <= 2 * fcfb * (1 + 1e-9)
    d = result_dict(r, EN_1993_1_8)["resistance"]
    assert d["Nj_Rd_tension_kN"] == pytest.approx(r.N_j_Rd_tension / 1e3, abs=0.01)
    thicker = check_end_plate_joint(p398(plate=replace(p398().plate, tp=30)))
    assert thicker.N_j_Rd_tension >= r.N_j_Rd_tension * (1 - 1e-9)


@settings(max_examples=40, deadline=None)
@given(z=st.floats(50, 1500), k=st.lists(st.floats(0.5, 50), min_size=1, max_size=6),
       f=st.floats(0.2, 5))
def test_initial_stiffness_scales_with_z_squared(z, k, f):
    # EN 1993-1-8 6.3.1(4), Eq. (6.27): Sj,ini = E z^2 / sum(1/k_i), so scaling z by f scales
    # Sj,ini by f^2 for the same stiffness coefficients.
    from ifcjoint.ec3.stiffness import S_j_ini

    assert S_j_ini(f * z, k) == pytest.approx(f * f * S_j_ini(z, k), rel=1e-9)


def test_two_tension_rows_midway_lever_arm_is_conservative():
    # Common practice, no source (stated in a lecture on this check, EN 1993-1-8 Figure 6.15):
    # for an extended end plate with two rows active in tension, z may conservatively be taken
    # from the centre of compression to midway between the two rows. With the outer row the
    # stronger one, (F1 + F2) z_mid never exceeds Mj,Rd = F1 h1 + F2 h2.
    inp = p398(bolts=replace(p398().bolts, rows_from_beam_top=(-40.0, 60.0, 473.1)))
    r = check_end_plate_joint(inp).hogging
    assert len(r.rows) == 2
    (f1, h1), (f2, h2) = ((x.F_tr_Rd, x.h_r) for x in r.rows)
    assert f1 >= f2
    assert (f1 + f2) * (h1 + h2) / 2 <= r.M_j_Rd * (1 + 1e-12)
