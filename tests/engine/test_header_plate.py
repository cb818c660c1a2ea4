"""Partial-depth (header) end plate in shear, against hand calculations.

No published worked example of this joint is at hand here, so each component is computed by
hand below from its formula (EN 1993-1-8 Table 3.4, 3.10.2(2), 4.5.3.3; EN 1993-1-1 6.2.6;
the design guide for pinned joints' 1.27 on gross shear and 0.8 on the bolts, the 0.8 from
memory), for an invented joint: plate 250 x 150 x 10 S275 (fy 275, fu 430), three rows of
M20 8.8 (d0 22, As 245) at p1 = 70 on a 90 mm gauge (e2 = 30, e1 = 55 top and bottom), IPE
400 beam S275 (tw 8.6), HEB 300 column S275 (tf 19), 5 mm welds.
"""

from __future__ import annotations

import pytest

from ifcjoint.ec3.code import Component
from ifcjoint.engine.header_plate import check_header_plate_joint
from ifcjoint.engine.inputs import (
    FinBoltsInput,
    HeaderPlateInput,
    HeaderPlateJointInput,
    MemberInput,
    WeldsInput,
)

HAND_KN = {
    # 0.8 x 6 x 0.6 x 800 x 245 / 1.25
    Component.HEADER_BOLT_SHEAR: 451.6,
    # 6 x k1 alpha_b fu d t / 1.25, k1 = 2.8 x 30/22 - 1.7 = 2.118, alpha_b = 70/66 - 1/4
    Component.HEADER_PLATE_BEARING: 708.8,
    # inner bolts on the 19 mm flange: k1 = 2.5, alpha_b = 0.811
    Component.HEADER_SUPPORT_BEARING: 1589.0,
    # 2 x 250 x 10 x 275 / (1.27 sqrt 3)
    Component.HEADER_PLATE_GROSS_SHEAR: 625.1,
    # 2 x 10 x (250 - 3 x 22) x 430 / (sqrt 3 x 1.25)
    Component.HEADER_PLATE_NET_SHEAR: 730.9,
    # 2 x (430 x 190 / 1.25 + 275 x 1400 / sqrt 3)
    Component.HEADER_PLATE_BLOCK_TEARING: 575.3,
    # 250 x 8.6 x 275 / sqrt 3
    Component.HEADER_BEAM_WEB_SHEAR: 341.4,
    # 2 x 5 x 250 x 430 / (sqrt 3 x 0.85 x 1.25)
    Component.HEADER_WELD: 584.1,
}


def joint(support="flange", tp=10.0) -> HeaderPlateJointInput:
    col = MemberInput(name="HEB 300", grade="S275", h=300, b=300, tw=11, tf=19, r=27, fy=275,
                      fu=430)
    beam = MemberInput(name="IPE 400", grade="S275", h=400, b=180, tw=8.6, tf=13.5, r=21,
                       fy=275, fu=430)
    return HeaderPlateJointInput(
        column=col, beam=beam,
        welds=WeldsInput(top_flange_throat=0.0, bottom_flange_throat=0.0, web_throat=5.0,
                         assumed=False),
        header=HeaderPlateInput(tp=tp, hp=250.0, bp=150.0, fy=275.0, fu=430.0, grade="S275",
                                e1_top=55.0, e1_bottom=55.0, e2=30.0),
        bolts=FinBoltsInput(d=20, grade="8.8", fub=800, As=245, d0=22, n1=3, n2=2, p1=70.0,
                            gauge=90.0),
        support=support)


@pytest.mark.parametrize("component", list(HAND_KN))
def test_components_by_hand(component):
    r = check_header_plate_joint(joint())
    got = next(c for c in r.hogging.components if c.component == component)
    assert got.F_Rd / 1e3 == pytest.approx(HAND_KN[component], rel=2e-3)


def test_vj_rd_is_the_least_and_no_moment():
    r = check_header_plate_joint(joint())
    assert r.V_j_Rd / 1e3 == pytest.approx(min(HAND_KN.values()), rel=2e-3)
    assert r.hogging.M_j_Rd == 0.0 and not r.gaps


def test_on_a_web_the_web_local_shear_is_added_beside_vj_rd():
    # 2 x 250 x 11 x 275 / sqrt 3 = 873.2 kN (column web 11 mm), kept out of Vj,Rd: the
    # web also takes the other side's reaction (checked per combination)
    r = check_header_plate_joint(joint(support="web"))
    web = next(c for c in r.hogging.components if c.component == Component.SUPPORT_WEB_SHEAR)
    assert web.F_Rd / 1e3 == pytest.approx(873.2, rel=2e-3)
    assert r.V_j_Rd / 1e3 == pytest.approx(min(HAND_KN.values()), rel=2e-3)
    assert not r.gaps and not r.conditions  # a bolted plate: no punching rule
    flange = check_header_plate_joint(joint())
    assert Component.SUPPORT_WEB_SHEAR not in {c.component for c in flange.hogging.components}


def test_thicker_plate_never_weaker():
    thin, thick = check_header_plate_joint(joint()), check_header_plate_joint(joint(tp=12.0))
    for a, b in zip(thin.hogging.components, thick.hogging.components, strict=True):
        assert b.F_Rd >= a.F_Rd - 1e-9, a.component
