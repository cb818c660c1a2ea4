"""Body items read analytically as oriented boxes: extrusions, mapped items, CSG, booleans.

Everything in the model's own length unit; bodies that are not extrusion-like (Breps,
tessellations ...) raise ``NeedsMesh`` and are left to :mod:`ifcjoint.ifc.mesh`. Solids that a
boolean difference cuts away (bolt holes) are collected into a list the caller passes in.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from ifcjoint.ifc.context import NeedsMesh, ReadContext
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


def walk(
    ctx: ReadContext, item, m: Aff, out: list[SolidBox], cuts: list[SolidBox] | None = None
) -> None:
    """Append the boxes of one representation item (world affine ``m``) to ``out``.

    Solids cut away by boolean differences go to ``cuts`` when it is given (round cuts through
    plates are bolt holes).

    Raises:
        NeedsMesh: an item that is not extrusion-like.
    """
    t = item.is_a()
    if t in ("IfcExtrudedAreaSolid", "IfcExtrudedAreaSolidTapered"):
        out.append(_extrusion_box(ctx, item, m))
    elif t == "IfcMappedItem":
        src = item.MappingSource
        mm = aff_compose(
            aff_compose(m, np_to_aff(cartesian_operator(item.MappingTarget))),
            a2p_aff(ctx, src.MappingOrigin),
        )
        for sub in src.MappedRepresentation.Items:
            walk(ctx, sub, mm, out, cuts)
    elif t in ("IfcBooleanClippingResult", "IfcBooleanResult"):
        if item.Operator == "UNION":
            walk(ctx, item.FirstOperand, m, out, cuts)
            walk(ctx, item.SecondOperand, m, out, cuts)
        else:
            walk(ctx, item.FirstOperand, m, out, cuts)
            if item.Operator == "DIFFERENCE" and cuts is not None:
                try:  # keep what is cut away: round cuts through plates are bolt holes
                    walk(ctx, item.SecondOperand, m, cuts, cuts)
                except NeedsMesh:
                    pass
    elif t == "IfcCsgSolid":
        walk(ctx, item.TreeRootExpression, m, out, cuts)
    elif t == "IfcRightCircularCylinder":
        origin, axes, s = _frame_from(aff_to_np(aff_compose(m, a2p_aff(ctx, item.Position))))
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
        origin, axes, s = _frame_from(aff_to_np(aff_compose(m, a2p_aff(ctx, item.Position))))
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
