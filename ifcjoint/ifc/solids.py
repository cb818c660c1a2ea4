"""Body items read analytically as oriented boxes: extrusions, mapped items, CSG, booleans.

Everything in the model's own length unit; bodies that are not extrusion-like (Breps,
tessellations ...) raise ``NeedsMesh`` and are left to :mod:`ifcjoint.ifc.mesh`. Solids that a
boolean difference cuts away (bolt holes) are collected into a list the caller passes in.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from ifcjoint.ifc.context import DamagedData, NeedsMesh, ReadContext
from ifcjoint.ifc.placement import (
    Aff,
    a2p_aff,
    aff_compose,
    aff_to_np,
    cartesian_operator,
    norm3,
    np_to_aff,
)
from ifcjoint.ifc.profiles import ProfileInfo, profile_info

SOLID_REP_IDS = ("Body", "Model", "", None)
AXIS_REP_IDS = ("Axis", "Box", "FootPrint", "Annotation", "Profile", "Clearance", "Reference")


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


def _extrusion_box(ctx: ReadContext, item, m: Aff) -> SolidBox:
    att = ctx.att
    pos = aff_compose(m, a2p_aff(ctx, att(item, "Position")))
    prof = profile_info(ctx, att(item, "SweptArea"))
    d = att(item, "ExtrudedDirection").get_argument(0)
    nd = norm3(d)
    d0, d1, d2 = d[0] / nd, d[1] / nd, d[2] / nd
    x, y, z = pos[3:6], pos[6:9], pos[9:12]
    sx, sy = norm3(x) or 1.0, norm3(y) or 1.0
    dw = (
        x[0] * d0 + y[0] * d1 + z[0] * d2,
        x[1] * d0 + y[1] * d1 + z[1] * d2,
        x[2] * d0 + y[2] * d1 + z[2] * d2,
    )
    ldw = norm3(dw)
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


@dataclass(slots=True)
class _Walk:
    """What every item reader gets: the context, the world affine and the two box lists."""

    ctx: ReadContext
    m: Aff
    out: list[SolidBox]
    cuts: list[SolidBox] | None

    def into(self, item, m: Aff | None = None, out: list[SolidBox] | None = None) -> None:
        """Read a sub-item (its own affine and list when given)."""
        walk(self.ctx, item, self.m if m is None else m, self.out if out is None else out,
             self.cuts)

    def framed(self, position) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
        """Origin, unit axes and scales of a placement under the current affine."""
        return _frame_from(aff_to_np(aff_compose(self.m, a2p_aff(self.ctx, position))))


def _extrusion(w: _Walk, item) -> None:
    w.out.append(_extrusion_box(w.ctx, item, w.m))


def _mapped(w: _Walk, item) -> None:
    src = item.MappingSource
    mm = aff_compose(
        aff_compose(w.m, np_to_aff(cartesian_operator(item.MappingTarget))),
        a2p_aff(w.ctx, src.MappingOrigin),
    )
    for sub in src.MappedRepresentation.Items:
        w.into(sub, m=mm)


def _boolean(w: _Walk, item) -> None:
    w.into(item.FirstOperand)
    if item.Operator == "UNION":
        w.into(item.SecondOperand)
    elif item.Operator == "DIFFERENCE" and w.cuts is not None:
        try:  # keep what is cut away: round cuts through plates are bolt holes
            walk(w.ctx, item.SecondOperand, w.m, w.cuts, w.cuts)
        except NeedsMesh:
            pass


def _csg(w: _Walk, item) -> None:
    w.into(item.TreeRootExpression)


def _cylinder(w: _Walk, item) -> None:
    origin, axes, s = w.framed(item.Position)
    r = item.Radius
    lo, hi = np.array([-r, -r, 0.0]) * s, np.array([r, r, item.Height]) * s
    w.out.append(SolidBox(origin, axes, lo, hi, None, "cylinder"))


def _bounding_box(w: _Walk, item) -> None:
    origin, axes, s = _frame_from(aff_to_np(w.m))
    o = origin + axes @ (np.array(item.Corner.Coordinates, dtype=float) * s)
    hi = np.array([item.XDim, item.YDim, item.ZDim]) * s
    w.out.append(SolidBox(o, axes, np.zeros(3), hi, None, "block"))


def _block(w: _Walk, item) -> None:
    origin, axes, s = w.framed(item.Position)
    hi = np.array([item.XLength, item.YLength, item.ZLength]) * s
    w.out.append(SolidBox(origin, axes, np.zeros(3), hi, None, "block"))


def _swept_disk(w: _Walk, item) -> None:
    if not item.Directrix.is_a("IfcPolyline"):
        raise NeedsMesh("IfcSweptDiskSolid")
    pts = np.array([p.Coordinates for p in item.Directrix.Points], dtype=float)
    if pts.shape[1] == 2:
        pts = np.c_[pts, np.zeros(len(pts))]
    mn = aff_to_np(w.m)
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
    lo, hi = np.array([-r, -r, 0]), np.array([r, r, length])
    w.out.append(SolidBox(pts[0], np.column_stack([x, y, z]), lo, hi, None, "disk"))


def _nothing(w: _Walk, item) -> None:
    """Half-spaces bound other solids: nothing of their own to read."""


#: IFC representation item -> its reader.
ITEM_READERS = {
    "IfcExtrudedAreaSolid": _extrusion,
    "IfcExtrudedAreaSolidTapered": _extrusion,
    "IfcMappedItem": _mapped,
    "IfcBooleanClippingResult": _boolean,
    "IfcBooleanResult": _boolean,
    "IfcCsgSolid": _csg,
    "IfcRightCircularCylinder": _cylinder,
    "IfcBoundingBox": _bounding_box,
    "IfcBlock": _block,
    "IfcSweptDiskSolid": _swept_disk,
    "IfcHalfSpaceSolid": _nothing,
    "IfcPolygonalBoundedHalfSpace": _nothing,
    "IfcBoxedHalfSpace": _nothing,
}


def walk(
    ctx: ReadContext, item, m: Aff, out: list[SolidBox], cuts: list[SolidBox] | None = None
) -> None:
    """Append the boxes of one representation item (world affine ``m``) to ``out``.

    Solids cut away by boolean differences go to ``cuts`` when it is given (round cuts through
    plates are bolt holes).

    Raises:
        NeedsMesh: an item that is not extrusion-like.
    """
    reader = ITEM_READERS.get(item.is_a())
    if reader is None:
        raise NeedsMesh(item.is_a())
    iid = item.id()
    if iid in ctx.walking:
        raise DamagedData(f"representation item #{iid} ({item.is_a()}) contains itself (a cycle)")
    ctx.walking.add(iid)
    try:
        reader(_Walk(ctx, m, out, cuts), item)
    finally:
        ctx.walking.discard(iid)


def body_items(ctx: ReadContext, element):
    """Items of the element's body representation (or of its type's), or None."""
    att = ctx.att
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


def cut_boxes(ctx: ReadContext, element, world) -> list[SolidBox]:
    """Boxes of the solids a body subtracts (second operands of boolean differences)."""
    cuts: list[SolidBox] = []
    try:
        solid_boxes(ctx, element, world, cuts)
    except NeedsMesh:
        pass
    return cuts


def solid_boxes(
    ctx: ReadContext, element, world, cuts: list[SolidBox] | None = None
) -> list[SolidBox]:
    """Oriented boxes of the element's body items in world (model units).

    Raises:
        NeedsMesh: some item is not an extrusion-like solid.
    """
    items = body_items(ctx, element)
    if not items:
        raise NeedsMesh("no body representation")
    if isinstance(world, np.ndarray):
        world = np_to_aff(world)
    out: list[SolidBox] = []
    for kind, it in items:
        if kind == "type":
            mm = aff_compose(world, a2p_aff(ctx, it.MappingOrigin))
            for sub in it.MappedRepresentation.Items:
                walk(ctx, sub, mm, out, cuts)
        else:
            walk(ctx, it, world, out, cuts)
    if not out:
        raise NeedsMesh("no solid items")
    return out
