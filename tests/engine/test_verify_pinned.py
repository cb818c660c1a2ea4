"""Verification of nominally pinned joints on a supporting web: both sides' reactions, rules.

The joint is the fin plate of the published example (tests/validation) placed on a column
web; its web's local shear, 2 h_p t_w f_y / (sqrt 3 gamma_M0) = 2 x 360 x 11 x 275 / sqrt 3
= 1257.4 kN by hand (design guide for pinned joints, from memory), takes this beam's reaction
and the other side's together; the punching rule t_p <= t_w f_u,w / (f_y,p gamma_M2) =
11 x 430 / (275 x 1.25) = 13.76 mm holds for the 10 mm plate.
"""

from __future__ import annotations

from dataclasses import replace

import pytest

from ifcjoint.engine.fin_plate import check_fin_plate_joint
from ifcjoint.engine.verify import verify_joint
from ifcjoint.model.codes import NotCheckedCode, Status, Verification
from ifcjoint.model.demands import Demand
from tests.validation.test_published_fin_plate_example import example

ENGINE = {"engine": check_fin_plate_joint}


def on_web(**fin):
    return replace(example(**fin), support="web")


def _u(verdict, kind):
    return [u for c in verdict.combinations for u in c.utilisations if u.verification == kind]


def test_web_local_shear_takes_both_reactions():
    inp = on_web(z=60.0)
    one = verify_joint(inp, [Demand(combination="c", M_Ed=0.0, V_Ed=300e3)],
                       double_sided=False, **ENGINE)
    (u,) = _u(one, Verification.SUPPORT_WEB_SHEAR)
    assert u.resistance / 1e3 == pytest.approx(1257.4, abs=0.2)
    assert u.demand == pytest.approx(300e3)
    both = verify_joint(inp, [Demand(combination="c", M_Ed=0.0, V_Ed=300e3, V_other=1000e3)],
                        double_sided=True, **ENGINE)
    (u2,) = _u(both, Verification.SUPPORT_WEB_SHEAR)
    assert u2.demand == pytest.approx(1300e3) and u2.utilisation > 1.0
    assert both.status == Status.FAIL  # the web fails though the joint's own Vj,Rd holds


def test_other_side_without_its_row_never_passes():
    v = verify_joint(on_web(z=60.0), [Demand(combination="c", M_Ed=0.0, V_Ed=100e3)],
                     double_sided=True, **ENGINE)
    assert v.status != Status.PASS
    assert v.reason.code == NotCheckedCode.SUPPORT_WEB_OTHER_SIDE_MISSING


def test_punching_rule_is_a_utilisation_that_fails_a_thick_plate():
    ok = verify_joint(on_web(z=60.0), [Demand(combination="c", M_Ed=0.0, V_Ed=100e3)],
                      double_sided=False, **ENGINE)
    (p,) = _u(ok, Verification.CONDITION)
    assert p.resistance == pytest.approx(13.76, abs=0.01) and p.demand == 10.0
    assert ok.status == Status.PASS
    thick = verify_joint(on_web(z=100.0, tp=15.0),
                         [Demand(combination="c", M_Ed=0.0, V_Ed=100e3)],
                         double_sided=False, **ENGINE)
    assert thick.status == Status.FAIL
    assert max(_u(thick, Verification.CONDITION), key=lambda u: u.utilisation).utilisation > 1


def test_on_a_flange_no_web_checks():
    v = verify_joint(example(z=60.0), [Demand(combination="c", M_Ed=0.0, V_Ed=100e3)],
                     double_sided=True, **ENGINE)
    assert not _u(v, Verification.SUPPORT_WEB_SHEAR) and not _u(v, Verification.CONDITION)
    assert v.status == Status.PASS
