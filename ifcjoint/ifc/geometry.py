"""Analytic reading of IFC body geometry: placements, profiles and extrusions.

Everything here works in the model's own length unit; the reader scales to mm once. Bodies
that are not extrusions (Breps, tessellations...) are left to :mod:`ifcjoint.ifc.mesh`.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

import numpy as np
import shapely
import shapely.affinity

SOLID_REP_IDS = ("Body", "Model", "", None)
AXIS_REP_IDS = ("Axis", "Box", "FootPrint", "Annotation", "Profile", "Clearance", "Reference")


class NeedsMesh(Exception):
    """The body cannot be read analytically; tessellate it instead."""


# --- placements --------------------------------------------------------------------------


_ARG_INDEX: dict[tuple[str, str], int] = {}


def att(e, name: str):
    """Attribute by name through a cached index (several times faster than ``e.Name``)."""
    key = (e.is_a(), name)
    i = _ARG_INDEX.get(key)
    if i is None:
        i = _ARG_INDEX[key] = e.get_argument_index(name)
    return e.get_argument(i)


def _norm3(v) -> float:
    return math.sqrt(v[0] * v[0] + v[1] * v[1] + v[2] * v[2])


def _cross3(a, b) -> tuple[float, float, float]:
    return (a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0])


_A2P_CACHE: dict[int, np.ndarray] = {}
_A2P_OWNER: list = [None]


def reset_caches(owner) -> None:
    """Start (owner = the model) or stop (None) caching placements and profiles by entity id.

    Entity ids are per file, so the caches live only while one model is being read.
    """
    _A2P_CACHE.clear()
    _PROFILE_CACHE.clear()
    _A2P_OWNER[0] = owner


Aff = tuple  # (ox, oy, oz, xx, xy, xz, yx, yy, yz, zx, zy, zz): origin and axis columns

IDENTITY: Aff = (0.0, 0.0, 0.0, 1.0, 0.0, 0.0, 0.0, 1.0, 0.0, 0.0, 0.0, 1.0)


def aff_compose(a: Aff, b: Aff) -> Aff:
    """A after b: the affine map x -> a(b(x)), in plain floats (faster than numpy at 3x3)."""
    ox, oy, oz, ax0, ax1, ax2, ay0, ay1, ay2, az0, az1, az2 = a
    bo0, bo1, bo2 = b[0], b[1], b[2]
    out = [
        ox + ax0 * bo0 + ay0 * bo1 + az0 * bo2,
        oy + ax1 * bo0 + ay1 * bo1 + az1 * bo2,
        oz + ax2 * bo0 + ay2 * bo1 + az2 * bo2,
    ]
    for k in (3, 6, 9):
        c0, c1, c2 = b[k], b[k + 1], b[k + 2]
        out.append(ax0 * c0 + ay0 * c1 + az0 * c2)
        out.append(ax1 * c0 + ay1 * c1 + az1 * c2)
        out.append(ax2 * c0 + ay2 * c1 + az2 * c2)
    return tuple(out)


def aff_to_np(a: Aff) -> np.ndarray:
    """4x4 numpy matrix of an affine tuple."""
    m = np.eye(4)
    m[:3, 3] = a[0:3]
    m[:3, 0], m[:3, 1], m[:3, 2] = a[3:6], a[6:9], a[9:12]
    return m


def np_to_aff(m: np.ndarray) -> Aff:
    """Affine tuple of a 4x4 numpy matrix."""
    return tuple(float(x) for x in (*m[:3, 3], *m[:3, 0], *m[:3, 1], *m[:3, 2]))


def a2p_aff(p) -> Aff:
    """Affine tuple of an IfcAxis2Placement2D/3D (model units), cached per entity."""
    if p is None:
        return IDENTITY
    pid = p.id()
    hit = _A2P_CACHE.get(pid)
    if hit is not None:
        return hit
    loc = att(p, "Location")
    c = loc.get_argument(0) if loc is not None else (0.0, 0.0, 0.0)
    o = (float(c[0]), float(c[1]), float(c[2]) if len(c) > 2 else 0.0)
    t = p.is_a()
    if t == "IfcAxis2Placement3D":
        ax, ref = att(p, "Axis"), att(p, "RefDirection")
        z = ax.get_argument(0) if ax is not None else (0.0, 0.0, 1.0)
        x = ref.get_argument(0) if ref is not None else (1.0, 0.0, 0.0)
        nz = _norm3(z)
        z = (z[0] / nz, z[1] / nz, z[2] / nz)
        d = x[0] * z[0] + x[1] * z[1] + x[2] * z[2]
        x = (x[0] - d * z[0], x[1] - d * z[1], x[2] - d * z[2])
        nx = _norm3(x)
        if nx < 1e-9:  # RefDirection parallel to Axis: pick any perpendicular
            x = _cross3(z, (0.0, 1.0, 0.0)) if abs(z[1]) < 0.9 else _cross3(z, (1.0, 0.0, 0.0))
            nx = _norm3(x)
        x = (x[0] / nx, x[1] / nx, x[2] / nx)
        y = _cross3(z, x)
        out = (*o, *x, *y, *z)
    elif t == "IfcAxis2Placement2D":
        ref = att(p, "RefDirection")
        x = ref.get_argument(0)[:2] if ref is not None else (1.0, 0.0)
        nx = math.hypot(x[0], x[1])
        cx, cy = x[0] / nx, x[1] / nx
        out = (*o, cx, cy, 0.0, -cy, cx, 0.0, 0.0, 0.0, 1.0)
    else:
        out = (*o, 1.0, 0.0, 0.0, 0.0, 1.0, 0.0, 0.0, 0.0, 1.0)
    if _A2P_OWNER[0] is not None:
        _A2P_CACHE[pid] = out
    return out


def axis2placement(p) -> np.ndarray:
    """4x4 matrix of an IfcAxis2Placement2D/3D (model units)."""
    return aff_to_np(a2p_aff(p))


def cartesian_operator(op) -> np.ndarray:
    """4x4 matrix of an IfcCartesianTransformationOperator (2D or 3D, uniform or not)."""
    m = np.eye(4)
    if op is None:
        return m
    o = op.LocalOrigin.Coordinates
    m[: len(o), 3] = o
    dim = 3 if op.is_a("IfcCartesianTransformationOperator3D") else 2
    a1 = np.array(op.Axis1.DirectionRatios, dtype=float) if op.Axis1 else None
    a2 = np.array(op.Axis2.DirectionRatios, dtype=float) if op.Axis2 else None
    if dim == 3:
        a3 = np.array(op.Axis3.DirectionRatios, dtype=float) if op.Axis3 else np.array([0, 0, 1.0])
        a3 = a3 / np.linalg.norm(a3)
        x = a1 if a1 is not None else np.array([1.0, 0, 0])
        x = x - x.dot(a3) * a3
        x = x / np.linalg.norm(x)
        y = np.cross(a3, x)
        if a2 is not None and a2.dot(y) < 0:  # mirrored
            y = -y
        axes = [x, y, a3]
    else:
        x = a1[:2] if a1 is not None else np.array([1.0, 0])
        x = x / np.linalg.norm(x)
        y = np.array([-x[1], x[0]])
        axes = [np.r_[x, 0], np.r_[y, 0], np.array([0, 0, 1.0])]
    scale = op.Scale if op.Scale is not None else 1.0
    scales = [scale, scale, scale]
    for i, attr in ((1, "Scale2"), (2, "Scale3")):
        if hasattr(op, attr) and getattr(op, attr) is not None:
            scales[i] = getattr(op, attr)
    for i in range(3):
        m[:3, i] = axes[i] * scales[i]
    return m


class PlacementCache:
    """World transforms of object placements, each placement computed once.

    Resolves ``IfcLocalPlacement`` chains (``PlacementRelTo``) with Axis/RefDirection, and
    ``IfcGridPlacement`` (offset intersection of two grid axes in the grid's frame; x-axis from
    ``PlacementRefDirection``, else the grid's own x-axis). Anything else raises
    :class:`NeedsMesh` so the tessellator resolves it.
    """

    def __init__(self) -> None:
        self._cache: dict[int, Aff] = {}

    def aff(self, placement) -> Aff:
        """World affine tuple (model units) of an object placement."""
        if placement is None:
            return IDENTITY
        pid = placement.id()
        hit = self._cache.get(pid)
        if hit is not None:
            return hit
        if placement.is_a("IfcGridPlacement"):
            m = self._grid_placement(placement)
            self._cache[pid] = m
            return m
        chain = []
        p = placement
        seen = set()
        while p is not None and p.id() not in self._cache:
            if p.is_a("IfcGridPlacement"):
                break
            if not p.is_a("IfcLocalPlacement"):
                raise NeedsMesh(f"{p.is_a()} placement")
            if p.id() in seen:
                raise NeedsMesh("cyclic placement")
            seen.add(p.id())
            chain.append(p)
            p = att(p, "PlacementRelTo")
        m = self.aff(p) if p is not None else IDENTITY
        for q in reversed(chain):
            m = aff_compose(m, a2p_aff(att(q, "RelativePlacement")))
            self._cache[q.id()] = m
        return m

    def _grid_point(self, vgi) -> tuple[object, tuple[float, float, float]]:
        """The grid and the point (grid coordinates) of an IfcVirtualGridIntersection."""
        axes = list(vgi.IntersectingAxes)
        offs = list(vgi.OffsetDistances or ()) + [0.0, 0.0, 0.0]
        lines = []
        grid = None
        for ax, off in zip(axes[:2], offs[:2], strict=True):
            c = ax.AxisCurve
            if c is None or not c.is_a("IfcPolyline") or len(c.Points) < 2:
                raise NeedsMesh("grid axis is not a polyline")
            p0 = c.Points[0].Coordinates
            p1 = c.Points[-1].Coordinates
            dx, dy = p1[0] - p0[0], p1[1] - p0[1]
            n = math.hypot(dx, dy)
            if not ax.SameSense:
                dx, dy = -dx, -dy
            # positive offsets lie to the left of the axis direction
            lines.append((p0[0] - dy / n * off, p0[1] + dx / n * off, dx / n, dy / n))
            for inv in ("PartOfU", "PartOfV", "PartOfW"):
                owner = getattr(ax, inv, None)
                if owner:
                    grid = owner[0]
        (x1, y1, u1, v1), (x2, y2, u2, v2) = lines
        det = u1 * (-v2) - v1 * (-u2)
        if abs(det) < 1e-12:
            raise NeedsMesh("parallel grid axes")
        t = ((x2 - x1) * (-v2) - (y2 - y1) * (-u2)) / det
        return grid, (x1 + t * u1, y1 + t * v1, float(offs[2]))

    def _grid_placement(self, gp) -> Aff:
        """An IfcGridPlacement: the (offset) intersection of two grid axes, in the grid's frame."""
        grid, (x, y, z) = self._grid_point(gp.PlacementLocation)
        if grid is None:
            raise NeedsMesh("grid axes belong to no grid")
        base = self.aff(grid.ObjectPlacement)
        ref = gp.PlacementRefDirection
        cx, cy = 1.0, 0.0
        if ref is not None and ref.is_a("IfcDirection"):
            r = ref.DirectionRatios
            n = math.hypot(r[0], r[1]) or 1.0
            cx, cy = r[0] / n, r[1] / n
        elif ref is not None and ref.is_a("IfcVirtualGridIntersection"):
            _, (x2, y2, _) = self._grid_point(ref)
            n = math.hypot(x2 - x, y2 - y) or 1.0
            cx, cy = (x2 - x) / n, (y2 - y) / n
        local = (x, y, z, cx, cy, 0.0, -cy, cx, 0.0, 0.0, 0.0, 1.0)
        return aff_compose(base, local)

    def matrix(self, placement) -> np.ndarray:
        """World matrix (4x4, model units) of an object placement."""
        return aff_to_np(self.aff(placement))


# --- profiles ----------------------------------------------------------------------------


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


def _pos2d(profile) -> np.ndarray:
    try:
        pos = att(profile, "Position")
    except (AttributeError, RuntimeError):  # arbitrary profiles have no Position
        pos = None
    m = np.eye(3)
    if pos is None:
        return m
    m4 = axis2placement(pos)
    m[:2, :2] = m4[:2, :2]
    m[:2, 2] = m4[:2, 3]
    return m


def _box_of(points: np.ndarray, m: np.ndarray) -> tuple[float, float, float, float]:
    p = points @ m[:2, :2].T + m[:2, 2]
    return float(p[:, 0].min()), float(p[:, 0].max()), float(p[:, 1].min()), float(p[:, 1].max())


def curve_points(curve) -> np.ndarray:
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
            out.append(curve_points(seg.ParentCurve))
        return np.vstack(out) if out else np.zeros((0, 2))
    if t == "IfcTrimmedCurve":
        basis = curve.BasisCurve
        pts = [
            tr.Coordinates[:2]
            for tr in list(curve.Trim1) + list(curve.Trim2)
            if hasattr(tr, "Coordinates") and tr.is_a("IfcCartesianPoint")
        ]
        if basis.is_a("IfcCircle") and len(pts) == 2:
            return _arc_points(basis, np.array(pts[0]), np.array(pts[1]), curve.SenseAgreement)
        if pts:
            return np.array(pts, dtype=float)
        return curve_points(basis)
    if t == "IfcCircle":
        m = axis2placement(curve.Position)
        ang = np.linspace(0, 2 * math.pi, 33)[:-1]
        pts = np.c_[np.cos(ang), np.sin(ang)] * curve.Radius
        return pts @ m[:2, :2].T + m[:2, 3]
    if t == "IfcEllipse":
        m = axis2placement(curve.Position)
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


def _arc_points(circle, p0: np.ndarray, p1: np.ndarray, sense: bool) -> np.ndarray:
    m = axis2placement(circle.Position)
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
    add to the three rectangles, (4 - pi) r^2. None when the outline is not an I (web not
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
    r = math.sqrt(extra / (4 - math.pi)) if extra > 0 else 0.0
    return tw, tf, r


def profile_info(profile) -> ProfileInfo:
    """Box, area and dimensions of an IFC profile definition (model units)."""
    t = profile.is_a()
    name = (att(profile, "ProfileName") or "").strip()
    m = _pos2d(profile)

    def sym(sx: float, sy: float, **kw) -> ProfileInfo:
        c = np.array([[-sx / 2, -sy / 2], [sx / 2, sy / 2], [-sx / 2, sy / 2], [sx / 2, -sy / 2]])
        return ProfileInfo(t, name, *_box_of(c, m), **kw)

    if t == "IfcIShapeProfileDef":
        b, h = att(profile, "OverallWidth"), att(profile, "OverallDepth")
        tw, tf = att(profile, "WebThickness"), att(profile, "FlangeThickness")
        r = att(profile, "FilletRadius") or 0.0
        area = 2 * b * tf + (h - 2 * tf) * tw + (4 - math.pi) * r * r
        return sym(b, h, area=area, h=h, b=b, tw=tw, tf=tf, r=r)
    if t == "IfcAsymmetricIShapeProfileDef":
        h = att(profile, "OverallDepth")
        bt = att(profile, "TopFlangeWidth") or att(profile, "BottomFlangeWidth")
        bb = att(profile, "BottomFlangeWidth")
        b = max(bt, bb)
        tw, tfb = att(profile, "WebThickness"), att(profile, "BottomFlangeThickness")
        tft = att(profile, "TopFlangeThickness") or tfb
        area = bb * tfb + bt * tft + (h - tfb - tft) * tw
        return sym(
            b,
            h,
            area=area,
            h=h,
            b=b,
            tw=tw,
            tf=max(tfb, tft),
            extra={"b_top": bt, "b_bottom": bb, "tf_top": tft, "tf_bottom": tfb},
        )
    if t in ("IfcRectangleProfileDef", "IfcRoundedRectangleProfileDef"):
        xd, yd = att(profile, "XDim"), att(profile, "YDim")
        return sym(xd, yd, area=xd * yd, h=yd, b=xd)
    if t == "IfcRectangleHollowProfileDef":
        w, h, tw = att(profile, "XDim"), att(profile, "YDim"), att(profile, "WallThickness")
        return sym(
            w, h, area=w * h - (w - 2 * tw) * (h - 2 * tw), h=h, b=w, tw=tw, tf=tw, hollow=True
        )
    if t == "IfcCircleProfileDef":
        d = 2 * att(profile, "Radius")
        return sym(d, d, area=math.pi * att(profile, "Radius") ** 2, h=d, b=d)
    if t == "IfcCircleHollowProfileDef":
        r, tw = att(profile, "Radius"), att(profile, "WallThickness")
        return sym(
            2 * r,
            2 * r,
            area=math.pi * (r * r - (r - tw) ** 2),
            h=2 * r,
            b=2 * r,
            tw=tw,
            hollow=True,
        )
    if t in (
        "IfcLShapeProfileDef",
        "IfcUShapeProfileDef",
        "IfcCShapeProfileDef",
        "IfcZShapeProfileDef",
        "IfcTShapeProfileDef",
    ):
        h = att(profile, "Depth")
        b = getattr(profile, "Width", None) or getattr(profile, "FlangeWidth", None) or h
        tw = getattr(profile, "WebThickness", None) or getattr(profile, "Thickness", None)
        tf = getattr(profile, "FlangeThickness", None) or getattr(profile, "Thickness", None) or tw
        area = (b * (tf or 0) + h * (tw or 0)) if tw else None
        info = sym(b, h, area=area, h=h, b=b, tw=tw, tf=tf)
        if t == "IfcLShapeProfileDef":
            # The L's corner sits at the origin side; IFC centres its bounding box.
            pass
        return info
    if t == "IfcEllipseProfileDef":
        a, bb = att(profile, "SemiAxis1"), att(profile, "SemiAxis2")
        return sym(2 * a, 2 * bb, area=math.pi * a * bb, h=2 * bb, b=2 * a)
    if t in ("IfcArbitraryClosedProfileDef", "IfcArbitraryProfileDefWithVoids"):
        outer = curve_points(att(profile, "OuterCurve"))
        if len(outer) < 3:
            raise NeedsMesh("degenerate outer curve")
        poly = shapely.Polygon(outer)
        if not poly.is_valid:
            poly = shapely.make_valid(poly)
        area = poly.area
        holes = []
        for inner in (att(profile, "InnerCurves") if t.endswith("WithVoids") else None) or ():
            try:
                pts = curve_points(inner)
                area -= shapely.Polygon(pts).area
                c = pts.mean(axis=0)
                dia = 2 * float(np.sqrt(((pts - c) ** 2).sum(axis=1)).mean())
                holes.append((float(c[0]), float(c[1]), dia))
            except Exception:  # noqa: BLE001 - a bad void only spoils the area
                pass
        x0, x1, y0, y1 = _box_of(outer, m)
        # Exporters draw I sections lying on their side too: the depth is the direction
        # along which the area is spread most (larger second moment).
        pts = outer @ m[:2, :2].T
        ixx, iyy = _second_moments(pts)
        depth_axis = "x" if iyy > 1.2 * ixx else "y"
        h, b = (x1 - x0, y1 - y0) if depth_axis == "x" else (y1 - y0, x1 - x0)
        i_dims = i_shape_from_outline(poly, depth_axis) if not holes else None
        return ProfileInfo(
            t,
            name,
            x0,
            x1,
            y0,
            y1,
            area=area,
            h=h,
            b=b,
            tw=i_dims[0] if i_dims else None,
            tf=i_dims[1] if i_dims else None,
            r=i_dims[2] if i_dims else None,
            depth_axis=depth_axis,
            extra={"outline": outer, "holes": holes},
        )
    if t == "IfcDerivedProfileDef":
        parent = profile_info(att(profile, "ParentProfile"))
        op = cartesian_operator(att(profile, "Operator"))
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
        d = np.array(op[:2, :2])
        swapped = abs(d[0, 1]) > abs(d[0, 0])
        axis = parent.depth_axis
        if swapped:
            axis = "x" if axis == "y" else "y"
        return ProfileInfo(
            t,
            name or parent.name,
            x0,
            x1,
            y0,
            y1,
            area=parent.area,
            h=parent.h,
            b=parent.b,
            tw=parent.tw,
            tf=parent.tf,
            r=parent.r,
            hollow=parent.hollow,
            depth_axis=axis,
            extra={"parent": parent.ifc_type, "rotated": swapped},
        )
    if t == "IfcCompositeProfileDef":
        parts = [profile_info(p) for p in att(profile, "Profiles")]
        return ProfileInfo(
            t,
            name,
            min(p.xmin for p in parts),
            max(p.xmax for p in parts),
            min(p.ymin for p in parts),
            max(p.ymax for p in parts),
            area=sum((p.area or 0) for p in parts) or None,
        )
    raise NeedsMesh(f"profile {t}")


# --- solids ------------------------------------------------------------------------------


@dataclass(slots=True)
class SolidBox:
    """An item of a body as an oriented box in world (model units).

    ``frame`` columns are the box axes (x, y: profile axes; z: extrusion), not unit when the
    mapping scales; ``lo``/``hi`` are extents along each axis in that frame.
    """

    origin: np.ndarray
    axes: np.ndarray  # 3x3, columns unit vectors
    lo: np.ndarray
    hi: np.ndarray
    profile: ProfileInfo | None
    kind: str  # extrusion | cylinder | block | disk

    @property
    def size(self) -> np.ndarray:
        """Extents along the box axes."""
        return self.hi - self.lo

    @property
    def volume(self) -> float:
        """Box volume times the profile's fill ratio."""
        s = self.size
        fill = self.profile.fill if self.profile and self.profile.fill else 1.0
        return float(s[0] * s[1] * s[2] * fill)

    def corners(self) -> np.ndarray:
        """The eight corners in world coordinates."""
        pts = []
        for i in (self.lo[0], self.hi[0]):
            for j in (self.lo[1], self.hi[1]):
                for k in (self.lo[2], self.hi[2]):
                    pts.append(self.origin + self.axes @ np.array([i, j, k]))
        return np.array(pts)

    def center(self) -> np.ndarray:
        """Centre of the box in world coordinates."""
        return self.origin + self.axes @ ((self.lo + self.hi) / 2)


def _frame_from(m: np.ndarray) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """Origin, unit axes and per-axis scale of a 4x4 matrix."""
    a = m[:3, :3].copy()
    s = np.linalg.norm(a, axis=0)
    s[s == 0] = 1.0
    return m[:3, 3].copy(), a / s, s


_PROFILE_CACHE: dict[int, ProfileInfo] = {}


def _extrusion_box(item, m: Aff) -> SolidBox:
    pos = aff_compose(m, a2p_aff(att(item, "Position")))
    area = att(item, "SweptArea")
    aid = area.id()
    caching = _A2P_OWNER[0] is not None
    prof = _PROFILE_CACHE.get(aid) if caching else None
    if prof is None:
        prof = profile_info(area)
        if caching:
            _PROFILE_CACHE[aid] = prof
    d = att(item, "ExtrudedDirection").get_argument(0)
    nd = _norm3(d)
    d0, d1, d2 = d[0] / nd, d[1] / nd, d[2] / nd
    x, y, z = pos[3:6], pos[6:9], pos[9:12]
    sx, sy = _norm3(x) or 1.0, _norm3(y) or 1.0
    dw = (
        x[0] * d0 + y[0] * d1 + z[0] * d2,
        x[1] * d0 + y[1] * d1 + z[1] * d2,
        x[2] * d0 + y[2] * d1 + z[2] * d2,
    )
    ldw = _norm3(dw)
    depth = att(item, "Depth") * ldw
    # Box frame: profile x, profile y, extrusion direction (oblique extrusions: the box is
    # slightly conservative, enough for locating parts).
    ax = np.array(
        (
            (x[0] / sx, y[0] / sy, dw[0] / ldw),
            (x[1] / sx, y[1] / sy, dw[1] / ldw),
            (x[2] / sx, y[2] / sy, dw[2] / ldw),
        )
    )
    lo = np.array((prof.xmin * sx, prof.ymin * sy, 0.0))
    hi = np.array((prof.xmax * sx, prof.ymax * sy, depth))
    return SolidBox(np.array(pos[0:3]), ax, lo, hi, prof, "extrusion")


def _walk(item, m: Aff, out: list[SolidBox]) -> None:
    t = item.is_a()
    if t in ("IfcExtrudedAreaSolid", "IfcExtrudedAreaSolidTapered"):
        out.append(_extrusion_box(item, m))
    elif t == "IfcMappedItem":
        src = item.MappingSource
        mm = aff_compose(
            aff_compose(m, np_to_aff(cartesian_operator(item.MappingTarget))),
            a2p_aff(src.MappingOrigin),
        )
        for sub in src.MappedRepresentation.Items:
            _walk(sub, mm, out)
    elif t in ("IfcBooleanClippingResult", "IfcBooleanResult"):
        if item.Operator == "UNION":
            _walk(item.FirstOperand, m, out)
            _walk(item.SecondOperand, m, out)
        else:
            _walk(item.FirstOperand, m, out)
            if item.Operator == "DIFFERENCE" and _CUTS[0] is not None:
                try:  # keep what is cut away: round cuts through plates are bolt holes
                    _walk(item.SecondOperand, m, _CUTS[0])
                except NeedsMesh:
                    pass
    elif t == "IfcCsgSolid":
        _walk(item.TreeRootExpression, m, out)
    elif t == "IfcRightCircularCylinder":
        origin, axes, s = _frame_from(aff_to_np(aff_compose(m, a2p_aff(item.Position))))
        r = item.Radius
        out.append(
            SolidBox(
                origin,
                axes,
                np.array([-r, -r, 0.0]) * s,
                np.array([r, r, item.Height]) * s,
                None,
                "cylinder",
            )
        )
    elif t == "IfcBoundingBox":
        c = item.Corner.Coordinates
        origin, axes, s = _frame_from(aff_to_np(m))
        o = origin + axes @ (np.array(c, dtype=float) * s)
        out.append(
            SolidBox(
                o, axes, np.zeros(3), np.array([item.XDim, item.YDim, item.ZDim]) * s, None, "block"
            )
        )
    elif t == "IfcBlock":
        origin, axes, s = _frame_from(aff_to_np(aff_compose(m, a2p_aff(item.Position))))
        out.append(
            SolidBox(
                origin,
                axes,
                np.zeros(3),
                np.array([item.XLength, item.YLength, item.ZLength]) * s,
                None,
                "block",
            )
        )
    elif t == "IfcSweptDiskSolid" and item.Directrix.is_a("IfcPolyline"):
        pts = np.array([p.Coordinates for p in item.Directrix.Points], dtype=float)
        if pts.shape[1] == 2:
            pts = np.c_[pts, np.zeros(len(pts))]
        mn = aff_to_np(m)
        pts = (mn[:3, :3] @ pts.T).T + mn[:3, 3]
        z = pts[-1] - pts[0]
        length = float(np.linalg.norm(z))
        if length == 0:
            raise NeedsMesh("zero-length directrix")
        z /= length
        x = np.cross(z, [0, 0, 1.0]) if abs(z[2]) < 0.9 else np.cross(z, [1.0, 0, 0])
        x /= np.linalg.norm(x)
        y = np.cross(z, x)
        r = item.Radius
        out.append(
            SolidBox(
                pts[0],
                np.column_stack([x, y, z]),
                np.array([-r, -r, 0]),
                np.array([r, r, length]),
                None,
                "disk",
            )
        )
    elif t in ("IfcHalfSpaceSolid", "IfcPolygonalBoundedHalfSpace", "IfcBoxedHalfSpace"):
        return
    else:
        raise NeedsMesh(t)


def body_items(element):
    """Items of the element's body representation (or of its type's), or None."""
    rep = att(element, "Representation")
    reps = list(att(rep, "Representations")) if rep is not None else []
    if not reps:
        # Some exporters put the body only on the type (RepresentationMaps).
        for rel in getattr(element, "IsTypedBy", None) or getattr(element, "IsDefinedBy", ()):
            typ = getattr(rel, "RelatingType", None)
            if typ is not None and getattr(typ, "RepresentationMaps", None):
                return [("type", rm) for rm in typ.RepresentationMaps]
        return None
    ids = [att(r, "RepresentationIdentifier") for r in reps]
    chosen = [r for r, i in zip(reps, ids, strict=True) if (i or "") in ("Body", "Model")]
    if not chosen:
        chosen = [r for r, i in zip(reps, ids, strict=True) if i not in AXIS_REP_IDS]
    if not chosen:
        return None
    return [("items", it) for r in chosen[:1] for it in att(r, "Items")]


_CUTS: list = [None]


def cut_boxes(element, world) -> list[SolidBox]:
    """Boxes of the solids a body subtracts (second operands of boolean differences)."""
    _CUTS[0] = []
    try:
        solid_boxes(element, world)
        return _CUTS[0]
    except NeedsMesh:
        return _CUTS[0] or []
    finally:
        _CUTS[0] = None


def solid_boxes(element, world) -> list[SolidBox]:
    """Oriented boxes of the element's body items in world (model units).

    Raises:
        NeedsMesh: some item is not an extrusion-like solid.
    """
    items = body_items(element)
    if not items:
        raise NeedsMesh("no body representation")
    if isinstance(world, np.ndarray):
        world = np_to_aff(world)
    out: list[SolidBox] = []
    for kind, it in items:
        if kind == "type":
            mm = aff_compose(world, a2p_aff(it.MappingOrigin))
            for sub in it.MappedRepresentation.Items:
                _walk(sub, mm, out)
        else:
            _walk(it, world, out)
    if not out:
        raise NeedsMesh("no solid items")
    return out
