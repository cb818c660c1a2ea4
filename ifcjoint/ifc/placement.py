"""Placements as affine maps: IfcAxis2Placement, transformation operators, placement chains.

Affine maps are 12-tuples of plain floats (origin, then the x, y and z axis columns), which is
faster than numpy at 3 x 3. Everything is in the model's own length unit.
"""

from __future__ import annotations

import math

import numpy as np

from ifcjoint.ifc.context import DamagedData, NeedsMesh, ReadContext

Aff = tuple  # (ox, oy, oz, xx, xy, xz, yx, yy, yz, zx, zy, zz): origin and axis columns

IDENTITY: Aff = (0.0, 0.0, 0.0, 1.0, 0.0, 0.0, 0.0, 1.0, 0.0, 0.0, 0.0, 1.0)


def norm3(v) -> float:
    """Length of a 3-vector given as a sequence."""
    return math.sqrt(v[0] * v[0] + v[1] * v[1] + v[2] * v[2])


def _cross3(a, b) -> tuple[float, float, float]:
    return (a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0])


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


#: Largest coordinate believed, in model units of any kind: beyond it a value is damage
#: (1e12 mm is a million km; common practice, no source).
COORDINATE_LIMIT = 1e12


def _numbers(e, least: int, what: str) -> tuple[float, ...]:
    """The numbers of an IfcCartesianPoint or IfcDirection, checked: enough, finite, sane.

    Raises:
        DamagedData: too few values, not numbers, not finite, beyond ``COORDINATE_LIMIT``,
            or (a direction) of zero length.
    """
    try:
        v = tuple(float(x) for x in e.get_argument(0))
    except (TypeError, ValueError, AttributeError, RuntimeError) as exc:
        raise DamagedData(f"#{e.id()} {e.is_a()} holds no usable {what} ({exc})") from exc
    if len(v) < least:
        raise DamagedData(f"#{e.id()} {e.is_a()} has {len(v)} {what}, expected {least} or more")
    if not all(math.isfinite(x) and abs(x) < COORDINATE_LIMIT for x in v):
        raise DamagedData(f"#{e.id()} {e.is_a()} {what} {v} are not finite or beyond any model")
    if what == "direction" and not any(v):
        raise DamagedData(f"#{e.id()} IfcDirection has zero length")
    return v


def a2p_aff(ctx: ReadContext, p) -> Aff:
    """Affine tuple of an IfcAxis2Placement2D/3D (model units), cached per entity."""
    if p is None:
        return IDENTITY
    pid = p.id()
    hit = ctx.a2p.get(pid)
    if hit is not None:
        return hit
    att = ctx.att
    loc = att(p, "Location")
    c = _numbers(loc, 2, "coordinates") if loc is not None else (0.0, 0.0, 0.0)
    o = (c[0], c[1], c[2] if len(c) > 2 else 0.0)
    t = p.is_a()
    if t == "IfcAxis2Placement3D":
        ax, ref = att(p, "Axis"), att(p, "RefDirection")
        z = _numbers(ax, 3, "direction") if ax is not None else (0.0, 0.0, 1.0)
        x = _numbers(ref, 3, "direction") if ref is not None else (1.0, 0.0, 0.0)
        nz = norm3(z)
        z = (z[0] / nz, z[1] / nz, z[2] / nz)
        d = x[0] * z[0] + x[1] * z[1] + x[2] * z[2]
        x = (x[0] - d * z[0], x[1] - d * z[1], x[2] - d * z[2])
        nx = norm3(x)
        if nx < 1e-9:  # RefDirection parallel to Axis: pick any perpendicular
            x = _cross3(z, (0.0, 1.0, 0.0)) if abs(z[1]) < 0.9 else _cross3(z, (1.0, 0.0, 0.0))
            nx = norm3(x)
        x = (x[0] / nx, x[1] / nx, x[2] / nx)
        y = _cross3(z, x)
        out = (*o, *x, *y, *z)
    elif t == "IfcAxis2Placement2D":
        ref = att(p, "RefDirection")
        x = _numbers(ref, 2, "direction")[:2] if ref is not None else (1.0, 0.0)
        nx = math.hypot(x[0], x[1])
        if nx == 0.0:
            raise DamagedData(f"#{ref.id()} IfcDirection has zero length")
        cx, cy = x[0] / nx, x[1] / nx
        out = (*o, cx, cy, 0.0, -cy, cx, 0.0, 0.0, 0.0, 1.0)
    else:
        out = (*o, 1.0, 0.0, 0.0, 0.0, 1.0, 0.0, 0.0, 0.0, 1.0)
    ctx.a2p[pid] = out
    return out


def axis2placement(ctx: ReadContext, p) -> np.ndarray:
    """4x4 matrix of an IfcAxis2Placement2D/3D (model units)."""
    return aff_to_np(a2p_aff(ctx, p))


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

    def __init__(self, ctx: ReadContext) -> None:
        self.ctx = ctx
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
                raise DamagedData(f"placement #{p.id()} is its own ancestor (a cycle)")
            seen.add(p.id())
            chain.append(p)
            p = self.ctx.att(p, "PlacementRelTo")
        m = self.aff(p) if p is not None else IDENTITY
        for q in reversed(chain):
            m = aff_compose(m, a2p_aff(self.ctx, self.ctx.att(q, "RelativePlacement")))
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
            if not math.isfinite(n) or n == 0.0:
                raise DamagedData(f"grid axis #{ax.id()} has no length")
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
