"""An end plate on a web: the shear path checked by hand, the moment never determined.

The joint is the extended end plate of tests/engine/test_end_plate.py (P398 example C.1
geometry) turned onto the column's web (t_w 12.8 mm, f_u 410). Hand calculation, EN 1993-1-8
Table 3.4: F_v,Rd = 0.6 x 800 x 353 / 1.25 = 135.55 kN; bearing on the web (no edges, it
continues): k1 = min(1.4 x 100 / 26 - 1.7, 2.5) = 2.5, alpha_b = 90 / (3 x 26) - 1/4 = 0.904
(least pitch 90 mm), F_b,Rd = 2.5 x 0.904 x 410 x 24 x 12.8 / 1.25 = 227.7 kN; three rows in
the upper half of the lever arm take min(F_v,Rd / 3.5, F_b,Rd) per bolt, the fourth
min(F_v,Rd, F_b,Rd): V = 6 x 38.73 + 2 x 135.55 = 503.5 kN. The web's local shear:
2 x 670 x 12.8 x 265 / sqrt 3 = 2624.2 kN (design guide for pinned joints, from memory).
"""

from __future__ import annotations

from dataclasses import replace

import pytest

from ifcjoint.ec3.code import Component
from ifcjoint.engine.end_plate import check_end_plate_joint
from ifcjoint.engine.verify import verify_joint
from ifcjoint.model.codes import NotCheckedCode, Status, Verification
from ifcjoint.model.demands import Demand
from tests.engine.test_end_plate import p398

ENGINE = {"engine": check_end_plate_joint}


def on_web():
    return replace(p398(), support="web")


def _comp(r, c):
    return next(x for x in r.hogging.components if x.component == c)


def test_bolts_and_web_by_hand():
    r = check_end_plate_joint(on_web())
    bolts = _comp(r, Component.ON_WEB_BOLTS)
    assert bolts.F_Rd / 1e3 == pytest.approx(503.5, abs=0.1)
    assert bolts.inputs["F_b_web_kN"] == pytest.approx(227.7, abs=0.1)
    assert _comp(r, Component.SUPPORT_WEB_SHEAR).F_Rd / 1e3 == pytest.approx(2624.2, abs=0.2)
    assert r.V_j_Rd / 1e3 == pytest.approx(503.5, abs=0.1)  # the bolts govern here


def test_moment_stiffness_and_class_are_not_determined():
    r = check_end_plate_joint(on_web())
    assert NotCheckedCode.WEB_BENDING_NOT_COVERED in {g.code for g in r.gaps}
    assert r.hogging.S_j_ini is None and r.m_phi("hogging") == []
    assert r.classification.stiffness is None and r.classification.stiffness_gap is not None
    from ifcjoint.ec3.code import EN_1993_1_8
    from ifcjoint.report.results import result_dict

    d = result_dict(r, EN_1993_1_8)
    assert d["resistance"]["Mj_Rd_hogging_kNm"] is None  # never a zero that reads as a value


def test_never_passes_but_fails_on_what_was_checked():
    light = verify_joint(on_web(), [Demand(combination="c", M_Ed=-50e6, V_Ed=100e3)],
                         double_sided=False, **ENGINE)
    assert light.status == Status.UNSUPPORTED
    assert light.reason.code == NotCheckedCode.WEB_BENDING_NOT_COVERED
    kinds = {u.verification for c in light.combinations for u in c.utilisations}
    assert Verification.MOMENT not in kinds and Verification.SHEAR in kinds
    heavy = verify_joint(on_web(), [Demand(combination="c", M_Ed=0.0, V_Ed=600e3)],
                         double_sided=False, **ENGINE)
    assert heavy.status == Status.FAIL  # 600 kN > Vj,Rd 503.5 kN


def test_on_the_flange_nothing_changes():
    flange = check_end_plate_joint(p398())
    assert flange.joint_kind == "bolted_end_plate" and flange.hogging.M_j_Rd > 0
    assert Component.ON_WEB_BOLTS not in {c.component for c in flange.hogging.components}
