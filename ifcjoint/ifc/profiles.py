"""Profile definitions read analytically: 2D box, area and I-section dimensions.

One reader per IFC profile type, chosen from a table; everything in the model's own length
unit. Curves are sampled well enough for a box and an area (arcs as chords).
"""

from __future__ import annotations

import math
from collections.abc import Callable
from dataclasses import dataclass, field

import numpy as np
import shapely
import shapely.affinity

from ifcjoint.ifc.context import NeedsMesh, ReadContext
from ifcjoint.ifc.placement import axis2placement, cartesian_operator


@dataclass(slots=True)
class ProfileInfo:
    """What a profile tells: its 2D box in profile coordinates and its dimensions."""

    ifc_type: str
    name: str
    xmin: float
    xmax: float
    ymin: float
    ymax: float
    area: float | None = None  # net area when known (for the fill ratio)
    h: float | None = None
    b: float | None = None
    tw: float | None = None
    tf: float | None = None
    r: float | None = None
    hollow: bool = False
    depth_axis: str = "y"  # profile axis along the section depth (IFC puts I depths on y)
    extra: dict = field(default_factory=dict)

    @property
    def fill(self) -> float | None:
        """Net area over bounding-box area, when the area is known."""
        box = (self.xmax - self.xmin) * (self.ymax - self.ymin)
        if self.area is None or box <= 0:
            return None
        return self.area / box


def _pos2d(ctx: ReadContext, profile) -> np.ndarray:
    try:
        pos = ctx.att(profile, "Position")
    except (AttributeError, RuntimeError):  # arbitrary profiles have no Position
        pos = None
    m = np.eye(3)
    if pos is None:
        return m
    m4 = axis2placement(ctx, pos)
    m[:2, :2] = m4[:2, :2]
    m[:2, 2] = m4[:2, 3]
    return m


def _box_of(points: np.ndarray, m: np.ndarray) -> tuple[float, float, float, float]:
    p = points @ m[:2, :2].T + m[:2, 2]
    return float(p[:, 0].min()), float(p[:, 0].max()), float(p[:, 1].min()), float(p[:, 1].max())


def curve_points(ctx: ReadContext, curve) -> np.ndarray:
    """2D points of a bounded curve good enough for a box and an area (arcs sampled)."""
    t = curve.is_a()
    if t == "IfcPolyline":
        return np.array([p.Coordinates[:2] for p in curve.Points], dtype=float)
    if t == "IfcIndexedPolyCurve":
        pts = np.array(curve.Points.CoordList, dtype=float)[:, :2]
        segs = curve.Segments
        if not segs:
            return pts
        out = []
        for seg in segs:
            idx = [i - 1 for i in seg.wrappedValue]
            if seg.is_a("IfcArcIndex") and len(idx) == 3:
                out.extend(_arc_through(pts[idx[0]], pts[idx[1]], pts[idx[2]]))
            else:
                out.extend(pts[i] for i in idx)
        return np.array(out, dtype=float)
    if t in ("IfcCompositeCurve", "IfcCompositeCurveOnSurface"):
        out = []
        for seg in curve.Segments:
            out.append(curve_points(ctx, seg.ParentCurve))
        return np.vstack(out) if out else np.zeros((0, 2))
    if t == "IfcTrimmedCurve":
        basis = curve.BasisCurve
        pts = [
            tr.Coordinates[:2]
            for tr in list(curve.Trim1) + list(curve.Trim2)
            if hasattr(tr, "Coordinates") and tr.is_a("IfcCartesianPoint")
        ]
        if basis.is_a("IfcCircle") and len(pts) == 2:
            return _arc_points(ctx, basis, np.array(pts[0]), np.array(pts[1]), curve.SenseAgreement)
        if pts:
            return np.array(pts, dtype=float)
        return curve_points(ctx, basis)
    if t == "IfcCircle":
        m = axis2placement(ctx, curve.Position)
        ang = np.linspace(0, 2 * math.pi, 33)[:-1]
        pts = np.c_[np.cos(ang), np.sin(ang)] * curve.Radius
        return pts @ m[:2, :2].T + m[:2, 3]
    if t == "IfcEllipse":
        m = axis2placement(ctx, curve.Position)
        ang = np.linspace(0, 2 * math.pi, 33)[:-1]
        pts = np.c_[np.cos(ang) * curve.SemiAxis1, np.sin(ang) * curve.SemiAxis2]
        return pts @ m[:2, :2].T + m[:2, 3]
    raise NeedsMesh(f"curve {t}")


def _arc_through(a: np.ndarray, b: np.ndarray, c: np.ndarray, n: int = 9) -> list[np.ndarray]:
    """Points along the circular arc from a through b to c (a straight line if collinear)."""
    d = 2 * (a[0] * (b[1] - c[1]) + b[0] * (c[1] - a[1]) + c[0] * (a[1] - b[1]))
    if abs(d) < 1e-12:
        return [a, b, c]
    ux = ((a @ a) * (b[1] - c[1]) + (b @ b) * (c[1] - a[1]) + (c @ c) * (a[1] - b[1])) / d
    uy = ((a @ a) * (c[0] - b[0]) + (b @ b) * (a[0] - c[0]) + (c @ c) * (b[0] - a[0])) / d
    ctr = np.array([ux, uy])
    rad = float(np.linalg.norm(a - ctr))
    t0, t1, tm = (math.atan2(*(p - ctr)[::-1]) for p in (a, c, b))

    # go from t0 to t1 the way that passes tm
    def between(x, s, e):
        return (x - s) % (2 * math.pi) <= (e - s) % (2 * math.pi)

    if between(tm, t0, t1):
        span = (t1 - t0) % (2 * math.pi)
    else:
        span = -((t0 - t1) % (2 * math.pi))
    return [
        ctr + rad * np.array([math.cos(t0 + span * k / (n - 1)), math.sin(t0 + span * k / (n - 1))])
        for k in range(n)
    ]


def _arc_points(
    ctx: ReadContext, circle, p0: np.ndarray, p1: np.ndarray, sense: bool
) -> np.ndarray:
    m = axis2placement(ctx, circle.Position)
    c = m[:2, 3]
    a0 = math.atan2(*(p0 - c)[::-1])
    a1 = math.atan2(*(p1 - c)[::-1])
    if sense:
        if a1 <= a0:
            a1 += 2 * math.pi
    elif a1 >= a0:
        a1 -= 2 * math.pi
    ang = np.linspace(a0, a1, 9)
    return c + circle.Radius * np.c_[np.cos(ang), np.sin(ang)]


def _second_moments(pts: np.ndarray) -> tuple[float, float]:
    """Second moments of area (about the centroid) of a closed polygon: (Ixx, Iyy).

    Ixx = integral of y^2 dA, Iyy = integral of x^2 dA (shoelace formulas).
    """
    x, y = pts[:, 0], pts[:, 1]
    xn, yn = np.roll(x, -1), np.roll(y, -1)
    cr = x * yn - xn * y
    a = cr.sum() / 2
    if abs(a) < 1e-12:
        return 0.0, 0.0
    cx = ((x + xn) * cr).sum() / (6 * a)
    cy = ((y + yn) * cr).sum() / (6 * a)
    ixx = ((y * y + y * yn + yn * yn) * cr).sum() / 12 - a * cy * cy
    iyy = ((x * x + x * xn + xn * xn) * cr).sum() / 12 - a * cx * cx
    return abs(float(ixx)), abs(float(iyy))


def i_shape_from_outline(poly, depth_axis: str = "y") -> tuple[float, float, float] | None:
    """Web and flange thickness and root radius of an I drawn as a polygon, or None.

    Widths are measured with shapely on lines across the section: the web at mid-depth, the
    flanges just inside the outer faces; the flange thickness is where the width drops from
    the flange's to less than its half; the root radius follows from the area the fillets
    add to the three rectangles, (4 - pi) r^2 for arcs, more for fillets drawn as a few
    straight segments (``_fillet_area_factor``). None when the outline is not an I (web not
    clearly narrower than the flanges, or flanges of unequal width).
    """
    if poly.is_empty or poly.area <= 0:
        return None
    x0, y0, x1, y1 = poly.bounds
    if depth_axis == "x":  # measure in a frame where the depth runs along y
        poly = shapely.affinity.rotate(poly, 90, origin=(0, 0))
        x0, y0, x1, y1 = poly.bounds
    h, b = y1 - y0, x1 - x0

    def width_at(y: float) -> float:
        line = shapely.LineString([(x0 - 1, y), (x1 + 1, y)])
        return float(poly.intersection(line).length)

    tw = width_at((y0 + y1) / 2)
    top, bottom = width_at(y1 - 1e-3 * h), width_at(y0 + 1e-3 * h)
    if not (tw < 0.5 * b and abs(top - bottom) < 0.02 * b and top > 0.9 * b):
        return None
    # flange thickness: bisect the height where the width drops below half the flange width
    lo, hi = y1 - 0.5 * h, y1
    for _ in range(40):
        mid = (lo + hi) / 2
        if width_at(mid) > 0.5 * (b + tw):
            hi = mid
        else:
            lo = mid
    tf = y1 - hi
    rect = 2 * b * tf + (h - 2 * tf) * tw
    extra = max(poly.area - rect, 0.0)
    r = math.sqrt(extra / (4 * _fillet_area_factor(poly))) if extra > 0 else 0.0
    return tw, tf, r


def _fillet_area_factor(poly) -> float:
    """Area of one fillet over r^2: 1 - pi/4 for an arc, more when drawn with chords.

    A fillet drawn as n straight segments (the chords of its quarter circle) adds
    r^2 (1 - (n/2) sin(pi / 2n)): the chords cut inside the arc. An I outline has 12 corners
    plus n vertices per fillet, so n = (vertices - 12) / 4 (collinear points dropped); an
    outline that does not count out (curves tessellated unevenly) is taken as true arcs.
    """
    ring = shapely.simplify(poly, 0.0).exterior
    v = len(ring.coords) - 1
    if v > 12 and (v - 12) % 4 == 0:
        n = (v - 12) // 4
        if n <= 32:
            return 1 - (n / 2) * math.sin(math.pi / (2 * n))
    return 1 - math.pi / 4


class _Profile:
    """What every profile reader gets: the context, the entity, its name and 2D placement."""

    __slots__ = ("ctx", "p", "t", "name", "m")

    def __init__(self, ctx: ReadContext, p) -> None:
        self.ctx, self.p, self.t = ctx, p, p.is_a()
        self.name = (ctx.att(p, "ProfileName") or "").strip()
        self.m = _pos2d(ctx, p)

    def __getitem__(self, name: str):
        return self.ctx.att(self.p, name)

    def opt(self, *names: str):
        """The first of several attributes the profile has and sets (schema-tolerant)."""
        for n in names:
            v = getattr(self.p, n, None)
            if v:
                return v
        return None

    def sym(self, sx: float, sy: float, **kw) -> ProfileInfo:
        """A profile symmetric about its position: box from the overall sizes."""
        c = np.array([[-sx / 2, -sy / 2], [sx / 2, sy / 2], [-sx / 2, sy / 2], [sx / 2, -sy / 2]])
        return ProfileInfo(self.t, self.name, *_box_of(c, self.m), **kw)


def _i_shape(q: _Profile) -> ProfileInfo:
    b, h, tw, tf = q["OverallWidth"], q["OverallDepth"], q["WebThickness"], q["FlangeThickness"]
    r = q["FilletRadius"] or 0.0
    area = 2 * b * tf + (h - 2 * tf) * tw + (4 - math.pi) * r * r
    return q.sym(b, h, area=area, h=h, b=b, tw=tw, tf=tf, r=r)


def _asymmetric_i(q: _Profile) -> ProfileInfo:
    h = q["OverallDepth"]
    bt = q["TopFlangeWidth"] or q["BottomFlangeWidth"]
    bb = q["BottomFlangeWidth"]
    b = max(bt, bb)
    tw, tfb = q["WebThickness"], q["BottomFlangeThickness"]
    tft = q["TopFlangeThickness"] or tfb
    area = bb * tfb + bt * tft + (h - tfb - tft) * tw
    extra = {"b_top": bt, "b_bottom": bb, "tf_top": tft, "tf_bottom": tfb}
    return q.sym(b, h, area=area, h=h, b=b, tw=tw, tf=max(tfb, tft), extra=extra)


def _rectangle(q: _Profile) -> ProfileInfo:
    xd, yd = q["XDim"], q["YDim"]
    return q.sym(xd, yd, area=xd * yd, h=yd, b=xd)


def _rectangle_hollow(q: _Profile) -> ProfileInfo:
    w, h, tw = q["XDim"], q["YDim"], q["WallThickness"]
    area = w * h - (w - 2 * tw) * (h - 2 * tw)
    return q.sym(w, h, area=area, h=h, b=w, tw=tw, tf=tw, hollow=True)


def _circle(q: _Profile) -> ProfileInfo:
    r = q["Radius"]
    return q.sym(2 * r, 2 * r, area=math.pi * r**2, h=2 * r, b=2 * r)


def _circle_hollow(q: _Profile) -> ProfileInfo:
    r, tw = q["Radius"], q["WallThickness"]
    area = math.pi * (r * r - (r - tw) ** 2)
    return q.sym(2 * r, 2 * r, area=area, h=2 * r, b=2 * r, tw=tw, hollow=True)


def _open_shape(q: _Profile) -> ProfileInfo:
    """L, U, C, Z and T shapes: their overall box; an L's two legs as rectangles.

    An L (IFC's ``IfcLShapeProfileDef``): the heel at the negative corner of the box centred
    on the profile's position, one leg of the width along x, the other of the depth along y,
    both ``Thickness`` thick. ``extra["legs"]``: for each leg, its centre, its direction along
    the leg and its normal (through its thickness), in the profile's placement, with its
    length (mm, in the file's units).
    """
    h = q["Depth"]
    b = q.opt("Width", "FlangeWidth") or h
    tw = q.opt("WebThickness", "Thickness")
    tf = q.opt("FlangeThickness", "Thickness") or tw
    area = (b * (tf or 0) + h * (tw or 0)) if tw else None
    info = q.sym(b, h, area=area, h=h, b=b, tw=tw, tf=tf)
    if q.t == "IfcLShapeProfileDef" and tw:
        t = float(tw)
        rot, off = q.m[:2, :2], q.m[:2, 2]
        legs = []
        for centre, along, normal, length in (
            ((0.0, -h / 2 + t / 2), (1.0, 0.0), (0.0, 1.0), b),
            ((-b / 2 + t / 2, 0.0), (0.0, 1.0), (1.0, 0.0), h),
        ):
            legs.append((tuple(rot @ np.array(centre) + off), tuple(rot @ np.array(along)),
                         tuple(rot @ np.array(normal)), float(length)))
        info.extra["legs"] = legs
        info.extra["thickness"] = t
        info.r = q.opt("FilletRadius")
    return info


def _ellipse(q: _Profile) -> ProfileInfo:
    a, bb = q["SemiAxis1"], q["SemiAxis2"]
    return q.sym(2 * a, 2 * bb, area=math.pi * a * bb, h=2 * bb, b=2 * a)


def _voids(q: _Profile) -> tuple[float, list[tuple[float, float, float]]]:
    """Area of the inner curves and their centres and diameters (bolt holes in plates)."""
    removed, holes = 0.0, []
    for inner in (q["InnerCurves"] if q.t.endswith("WithVoids") else None) or ():
        try:
            if inner.is_a("IfcCircle"):  # a round hole: its centre and radius, no sampling
                r = float(inner.Radius)
                m = axis2placement(q.ctx, inner.Position)
                removed += math.pi * r * r
                holes.append((float(m[0, 3]), float(m[1, 3]), 2 * r))
                continue
            pts = curve_points(q.ctx, inner)
            removed += shapely.Polygon(pts).area
            c = pts.mean(axis=0)
            dia = 2 * float(np.sqrt(((pts - c) ** 2).sum(axis=1)).mean())
            holes.append((float(c[0]), float(c[1]), dia))
        except Exception:  # a bad void only spoils the area
            pass
    return removed, holes


def _arbitrary(q: _Profile) -> ProfileInfo:
    outer = curve_points(q.ctx, q["OuterCurve"])
    if len(outer) < 3:
        raise NeedsMesh("degenerate outer curve")
    poly = shapely.Polygon(outer)
    if not poly.is_valid:
        poly = shapely.make_valid(poly)
    removed, holes = _voids(q)
    x0, x1, y0, y1 = _box_of(outer, q.m)
    # Exporters draw I sections lying on their side too: the depth is the direction
    # along which the area is spread most (larger second moment).
    ixx, iyy = _second_moments(outer @ q.m[:2, :2].T)
    depth_axis = "x" if iyy > 1.2 * ixx else "y"
    h, b = (x1 - x0, y1 - y0) if depth_axis == "x" else (y1 - y0, x1 - x0)
    dims = i_shape_from_outline(poly, depth_axis) if not holes else None
    tw, tf, r = dims if dims else (None, None, None)
    return ProfileInfo(
        q.t, q.name, x0, x1, y0, y1, area=poly.area - removed, h=h, b=b, tw=tw, tf=tf, r=r,
        depth_axis=depth_axis, extra={"outline": outer, "holes": holes},
    )


def _derived(q: _Profile) -> ProfileInfo:
    parent = profile_info(q.ctx, q["ParentProfile"])
    op = cartesian_operator(q["Operator"])
    c = np.array(
        [
            [parent.xmin, parent.ymin],
            [parent.xmax, parent.ymax],
            [parent.xmin, parent.ymax],
            [parent.xmax, parent.ymin],
        ]
    )
    mm = np.eye(3)
    mm[:2, :2], mm[:2, 2] = op[:2, :2], op[:2, 3]
    x0, x1, y0, y1 = _box_of(c, mm)
    swapped = abs(op[0, 1]) > abs(op[0, 0])
    axis = parent.depth_axis
    if swapped:
        axis = "x" if axis == "y" else "y"
    return ProfileInfo(
        q.t, q.name or parent.name, x0, x1, y0, y1, area=parent.area, h=parent.h, b=parent.b,
        tw=parent.tw, tf=parent.tf, r=parent.r, hollow=parent.hollow, depth_axis=axis,
        extra={"parent": parent.ifc_type, "rotated": swapped},
    )


def _composite(q: _Profile) -> ProfileInfo:
    parts = [profile_info(q.ctx, p) for p in q["Profiles"]]
    return ProfileInfo(
        q.t,
        q.name,
        min(p.xmin for p in parts),
        max(p.xmax for p in parts),
        min(p.ymin for p in parts),
        max(p.ymax for p in parts),
        area=sum((p.area or 0) for p in parts) or None,
    )


#: IFC profile type -> its reader.
PROFILE_READERS: dict[str, Callable[[_Profile], ProfileInfo]] = {
    "IfcIShapeProfileDef": _i_shape,
    "IfcAsymmetricIShapeProfileDef": _asymmetric_i,
    "IfcRectangleProfileDef": _rectangle,
    "IfcRoundedRectangleProfileDef": _rectangle,
    "IfcRectangleHollowProfileDef": _rectangle_hollow,
    "IfcCircleProfileDef": _circle,
    "IfcCircleHollowProfileDef": _circle_hollow,
    "IfcLShapeProfileDef": _open_shape,
    "IfcUShapeProfileDef": _open_shape,
    "IfcCShapeProfileDef": _open_shape,
    "IfcZShapeProfileDef": _open_shape,
    "IfcTShapeProfileDef": _open_shape,
    "IfcEllipseProfileDef": _ellipse,
    "IfcArbitraryClosedProfileDef": _arbitrary,
    "IfcArbitraryProfileDefWithVoids": _arbitrary,
    "IfcDerivedProfileDef": _derived,
    "IfcCompositeProfileDef": _composite,
}


def profile_info(ctx: ReadContext, profile) -> ProfileInfo:
    """Box, area and dimensions of an IFC profile definition (model units), cached per entity.

    Raises:
        NeedsMesh: a profile type (or curve) this module does not read.
    """
    pid = profile.id()
    hit = ctx.profiles.get(pid)
    if hit is not None:
        return hit
    reader = PROFILE_READERS.get(profile.is_a())
    if reader is None:
        raise NeedsMesh(f"profile {profile.is_a()}")
    info = reader(_Profile(ctx, profile))
    ctx.profiles[pid] = info
    return info
