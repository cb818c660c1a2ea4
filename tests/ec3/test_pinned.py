"""Formulas of ``ec3.pinned`` that the worked examples at hand do not print.

Each value is a hand calculation from the formula in the function's docstring (sources
there: the design guide for pinned joints, and the plate buckling curve from memory), or an
invariant of the formula.
"""

from __future__ import annotations

import math

import numpy as np
import pytest

from ifcjoint.ec3 import pinned as pin
from ifcjoint.ec3.params import Parameters


def test_buckling_strength_plateau_and_decline():
    # below lambda_L0 = 0.4 (pi^2 E / p_y)^0.5 the curve gives p_y itself
    lim = 0.4 * math.sqrt(math.pi ** 2 * 205_000 / 275)
    assert lim == pytest.approx(34.3, abs=0.05)
    assert pin.f_p_LT(lim - 1, 275) == pytest.approx(275)
    lams = np.linspace(lim, 250, 60)
    vals = [pin.f_p_LT(x, 275) for x in lams]
    assert all(b <= a + 1e-9 for a, b in zip(vals, vals[1:], strict=False))  # never rises
    for x, v in zip(lams, vals, strict=True):  # never above yield or the Euler stress
        assert v <= min(275, math.pi ** 2 * 205_000 / x ** 2) + 1e-9


def test_buckling_strength_by_hand():
    # lambda 100, p_y 275: p_E = pi^2 205000 / 100^2 = 202.3; eta = 7 (100 - 34.3) / 1000 =
    # 0.460; phi = (275 + 1.460 x 202.3) / 2 = 285.2; p_b = 202.3 x 275 / (285.2 +
    # (285.2^2 - 202.3 x 275)^0.5) = 124.9 MPa
    assert pin.f_p_LT(100.0, 275.0) == pytest.approx(124.9, abs=0.1)


def test_long_plate_buckling_by_hand():
    # t_p 10, h_p 200, z 100, z_p 100: lambda = 2.8 (100 x 200 / 150)^0.5 = 32.3 (plateau),
    # W_el = 10 x 200^2 / 6 = 66667 mm3: min(66667 x 355 / (0.6 x 100), 66667 x 355 / 100)
    assert pin.fin_plate_slenderness(100, 200, 10) == pytest.approx(32.33, abs=0.01)
    assert pin.V_Rd_fin_plate_ltb(10, 200, 355, 100, 100) == pytest.approx(236_667, rel=1e-4)
    # a slender plate: thin and deep, far out: the buckling term governs
    slender = pin.V_Rd_fin_plate_ltb(6, 400, 355, 200, 200)
    assert slender < 6 * 400 ** 2 / 6 * 355 / 200


def test_supporting_web_by_hand():
    # 2 x 250 x 7.1 x 355 / sqrt 3 = 727.6 kN; gamma_M0 scales it
    assert pin.V_Rd_supporting_web_local_shear(250, 7.1, 355) / 1e3 == pytest.approx(
        727.6, abs=0.1)
    half = pin.V_Rd_supporting_web_local_shear(250, 7.1, 355, Parameters(gamma_M0=2.0))
    assert half / 1e3 == pytest.approx(363.8, abs=0.1)
    # punching: t_p <= 7.1 x 510 / (355 x 1.25) = 8.16 mm
    assert pin.punching_thickness_limit(7.1, 510, 355) == pytest.approx(8.160, abs=1e-3)
