"""I sections drawn as polylines: the root radius from fillets drawn as a few segments.

An IPE 300 (h 300, b 150, tw 7.1, tf 10.7, r 15; EN 10365, from memory) drawn with each fillet
as n chords of its quarter circle (n = 1 ... 12), as some exporters write sections, and with
true arcs (many short segments): the reading stays within 2 % of r.
"""

from __future__ import annotations

import math

import pytest
import shapely

from ifcjoint.ifc.profiles import i_shape_from_outline

H, B, TW, TF, R = 300.0, 150.0, 7.1, 10.7, 15.0


def i_outline(n: int) -> shapely.Polygon:
    """The outline, fillets as n chords each, counter-clockwise from the bottom left."""
    x_w, y_f = TW / 2, H / 2 - TF

    def fillet(cx, cy, a0, a1):
        angles = [a0 + (a1 - a0) * k / n for k in range(n + 1)]
        return [(cx + R * math.cos(a), cy + R * math.sin(a)) for a in angles]

    pts = [(-B / 2, -H / 2), (B / 2, -H / 2), (B / 2, -y_f)]
    pts += fillet(x_w + R, -y_f + R, -math.pi / 2, -math.pi)  # bottom right
    pts += fillet(x_w + R, y_f - R, math.pi, math.pi / 2)  # top right
    pts += [(B / 2, y_f), (B / 2, H / 2), (-B / 2, H / 2), (-B / 2, y_f)]
    pts += fillet(-x_w - R, y_f - R, math.pi / 2, 0.0)  # top left
    pts += fillet(-x_w - R, -y_f + R, 0.0, -math.pi / 2)  # bottom left
    pts += [(-B / 2, -y_f)]
    poly = shapely.Polygon(pts)
    assert poly.is_valid
    return poly


@pytest.mark.parametrize("n", [1, 2, 3, 4, 6, 8, 12, 90])
def test_root_radius_within_two_percent(n):
    tw, tf, r = i_shape_from_outline(i_outline(n))
    assert tw == pytest.approx(TW, rel=0.01) and tf == pytest.approx(TF, rel=0.01)
    assert r == pytest.approx(R, rel=0.02)
