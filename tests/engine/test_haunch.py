"""A haunched end-plate joint against a hand calculation built on a published example.

No published haunched example is at hand. The joint is P398 Example C.1 (The Steel
Construction Institute / BCSA, P398, 2013, Appendix C, as quoted in
../shared/reference/published-check-values.md, Source A) with a haunch 300 mm deep welded
under the beam (flange 209.3 x 15.6, web 10.1, S275: the beam's, so 6.2.6.7(2) holds) and
the end plate run down to 20 mm below it. By hand, EN 1993-1-8:2005:

* Rows 1 and 2 as printed: 377 kN (row 1 alone, end plate, sheet 7) and 697 - 377 = 320 kN
  (rows 1-2, column flange, sheets 10-11).
* Compression (hogging: the haunch flange): beam flange and web 6.2.6.7(1) with h = 533.1 +
  300 = 833.1 mm > 600: the web's share limited to 20 %, Fc,fb,Rd <= 209.3 x 15.6 x 275 /
  0.8 = 1122.4 kN. Column web in compression 6.2.6.2: b_eff = 15.6 + 2 sqrt 2 x 5.657 +
  5 (20.5 + 12.7) + s_p (25 + 20, the plate's 20 mm below the haunch) = 242.6 mm;
  lambda_p = 0.932 (242.6 x 200.3 x 265 / (210000 x 12.8^2))^0.5 = 0.570 <= 0.72, rho = 1;
  omega = 1 (beta = 0 as in the example): 242.6 x 12.8 x 265 = 822.9 kN. Row 3 takes
  822.9 - 377 - 320 = 125.9 kN.
* Lever arms from the haunch flange's centre (833.1 - 7.8 = 825.3 mm): 865.3, 765.3,
  675.3 mm; Mj,Rd = 377 x 0.8653 + 320 x 0.7653 + 125.9 x 0.6753 = 655.9 kNm.
"""

from __future__ import annotations

from dataclasses import replace

import numpy as np
import pytest

from ifcjoint.ec3 import components as cmp
from ifcjoint.ec3.code import Component
from ifcjoint.engine.end_plate import check_end_plate_joint
from ifcjoint.engine.inputs import HaunchInput
from tests.engine.test_end_plate import p398

HAUNCH = HaunchInput(d=300.0, b=209.3, tf=15.6, tw=10.1, fy=275.0, grade="S275",
                     angle_deg=10.0, length=1700.0)


def haunched(**kw):
    inp = p398()
    hn = replace(HAUNCH, **kw)
    plate = replace(inp.plate, hp=90 + 533.1 + hn.d + 20, projection_bottom=20.0)
    rows = (-40.0, 60.0, 150.0, 240.0, 533.1 + hn.d - 60.0)
    return replace(inp, haunch=hn, plate=plate,
                   bolts=replace(inp.bolts, rows_from_beam_top=rows))


def test_moment_resistance_by_hand():
    r = check_end_plate_joint(haunched())
    rows = [x.F_tr_Rd / 1e3 for x in r.hogging.rows]
    assert rows[:3] == [pytest.approx(377, rel=0.005), pytest.approx(320, rel=0.01),
                        pytest.approx(125.9, rel=0.02)]
    assert r.hogging.M_j_Rd / 1e6 == pytest.approx(655.9, rel=0.005)
    comp = {c.component: c.F_Rd for c in r.hogging.components}
    assert comp[Component.BEAM_FLANGE_COMPRESSION] / 1e3 == pytest.approx(1122.4, rel=1e-3)
    assert comp[Component.COLUMN_WEB_COMPRESSION] / 1e3 == pytest.approx(822.9, rel=1e-3)


def test_shallow_haunch_keeps_the_whole_web():
    # h = 533.1 + 50 < 600: no 20 % limit, Fc,fb,Rd = M_c,Rd / (h - t_fb) with the elastic
    # modulus of the haunched section
    inp = haunched(d=50.0)
    r = check_end_plate_joint(inp)
    w = cmp.haunched_W_el(533.1, 209.3, 15.6, 10.1, 50.0, 209.3, 15.6, 10.1)
    fc = next(c.F_Rd for c in r.hogging.components
              if c.component == Component.BEAM_FLANGE_COMPRESSION)
    assert fc == pytest.approx(w * 275 / (583.1 - 15.6), rel=1e-9)
    assert fc > 209.3 * 15.6 * 275 / 0.8  # the web adds more than 20 % here


def test_haunched_modulus_against_a_strip_integration():
    # an independent route: the section cut into 0.05 mm strips, I and the centroid summed
    h, b, tf, tw, d, bh, tfh, twh = 533.1, 209.3, 15.6, 10.1, 300.0, 180.0, 14.0, 12.0
    y = np.arange(0.0, h + d, 0.05) + 0.025
    width = np.where(y < tf, b, np.where(y < h - tf, tw, np.where(
        y < h, b, np.where(y < h + d - tfh, twh, bh))))
    da = width * 0.05
    yc = (da * y).sum() / da.sum()
    i = (da * (y - yc) ** 2).sum() + (width * 0.05 ** 3 / 12).sum()
    want = i / max(yc, h + d - yc)
    assert cmp.haunched_W_el(h, b, tf, tw, d, bh, tfh, twh) == pytest.approx(want, rel=1e-4)


def test_deeper_haunch_never_weaker_in_hogging():
    shallow = check_end_plate_joint(haunched(d=200.0))
    deep = check_end_plate_joint(haunched())
    plain = check_end_plate_joint(p398())
    assert deep.hogging.M_j_Rd >= plain.hogging.M_j_Rd
    assert deep.hogging.z > shallow.hogging.z > plain.hogging.z
