"""A beam splice assembled by hand from a published example's end-plate components.

No published worked example of an end-plate beam splice is at hand. The end plate, bolts and
beam of P398 Example C.1 (The Steel Construction Institute / BCSA, *Joints in Steel
Construction: Moment-Resisting Joints to Eurocode 3*, P398, 2013, Appendix C, as quoted in
../shared/reference/published-check-values.md, Source A) are turned into a splice: two such
plates bolted together, no column. The expected values are assembled here by EN 1993-1-8
6.2.7.2 from the example's printed plate-side values (sheet numbers in brackets):

* F_t,Rd = 203 kN per bolt (5); row 1 (extension), end plate 377 kN (7).
* Row 2 alone: end plate min(502 kN mode 2 (9), 2 x 203 = 406 kN mode 3) = 406; beam web
  675 kN (10): 406 kN.
* Row 3 alone: the same plate T-stub as an inner row (l_eff,nc = 4 m + 1.25 e = 248 mm with
  the printed m = 38.6 and e = 75; mode 2 = (2 x 0.25 x 248 x 25^2 x 265 + 48.3 x 406e3) /
  (38.6 + 48.3) = 462 kN > mode 3 406 kN): 406 kN.
* Rows 2-3 as a group: end plate 812 kN (17-18), beam web 1052 kN (19): row 3 <= 406 kN.
  No column: no column flange or web rows; the extension row is never grouped with the
  inner rows on the plate side (Table 6.6).
* Compression: beam flange and web 1254 kN (21) >= 377 + 406 + 406 = 1189 kN.
* 6.2.7.2(9): row 2 carries 406 > 1.9 x 203 = 385.7 kN, so row 3 <= 406 x 375 / 465 =
  327.4 kN, with the printed lever arms 565 / 465 / 375 mm (22).
* Mj,Rd = 377 x 0.565 + 406 x 0.465 + 327.4 x 0.375 = 524.6 kNm.
* Vj,Rd: the bolts' shear governs bearing on either 25 mm plate, as in the example: 500 kN
  printed (23) (the source's 0.28 for tension rows; 1 - 1/1.4 gives about +0.7 %).

Sj,ini of the splice (Table 6.10: k5 of both plates and k10) has no printed value here and
is checked only as invariants: stiffer bolts (a larger A_s, k10 = 1.6 A_s / L_b) raise it, and
here it exceeds the same plate's on the example's column (the column's springs are gone from the
series). A thicker plate is no invariant: it lengthens the bolts (lower k10) and, with mode 3
in row 1, brings in 6.2.7.2(9)'s limit, so Mj,Rd may even drop.
"""

from __future__ import annotations

from dataclasses import replace

import pytest

from ifcjoint.ec3.code import Component
from ifcjoint.engine.end_plate import check_end_plate_joint
from tests.engine.test_end_plate import p398


def splice(**kw):
    inp = p398(**kw)
    return replace(inp, support="splice", column=inp.beam, beta=1.0)


@pytest.fixture(scope="module")
def result():
    return check_end_plate_joint(splice())


def test_rows_and_moment_resistance(result):
    rows = [r.F_tr_Rd / 1e3 for r in result.hogging.rows]
    assert rows == [pytest.approx(377, rel=0.005), pytest.approx(406, rel=0.005),
                    pytest.approx(327.4, rel=0.01)]
    assert result.hogging.M_j_Rd / 1e6 == pytest.approx(524.6, rel=0.005)
    assert result.V_j_Rd / 1e3 == pytest.approx(500 * 1.007, rel=0.01)


def test_no_column_component_and_no_web_panel(result):
    kinds = {c.component for c in result.hogging.components}
    assert kinds <= {Component.END_PLATE_BENDING, Component.BEAM_WEB_TENSION,
                     Component.BEAM_FLANGE_COMPRESSION}
    assert result.V_wp_Rd is None
    # the splice is stronger than the same plate on the example's column (416 kNm, sheet 22)
    assert result.hogging.M_j_Rd / 1e6 > 416


def test_stiffness_invariants(result):
    s = result.hogging.S_j_ini
    assert s is not None and s > 0
    stiffer = check_end_plate_joint(splice(bolts=replace(p398().bolts, As=459)))
    assert stiffer.hogging.S_j_ini > s
    on_column = check_end_plate_joint(p398())
    assert s > on_column.hogging.S_j_ini
