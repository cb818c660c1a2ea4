"""Relationships that place elements: storeys, parts tied to members, grid lines.

Each map is built in one pass over the relationship entities of its kind.
"""

from __future__ import annotations

from collections import defaultdict

import ifcopenshell
import ifcopenshell.util.element
import numpy as np

from ifcjoint.ifc.context import DamagedData, NeedsMesh, ReadContext
from ifcjoint.model.codes import LinkSource
from ifcjoint.model.elements import GridAxis, Link


def storey_names(f: ifcopenshell.file) -> dict[int, str]:
    """The name of the storey containing each element, by entity id.

    Parts of an assembly take the assembly's storey.
    """
    out: dict[int, str] = {}
    for rel in f.by_type("IfcRelContainedInSpatialStructure"):
        st = rel.RelatingStructure
        name = (st.Name or st.LongName or "") if st.is_a("IfcBuildingStorey") else ""
        for el in rel.RelatedElements:
            out[el.id()] = name or out.get(el.id(), "")
    for rel in f.by_type("IfcRelAggregates"):
        parent = rel.RelatingObject
        if parent.id() in out:
            for el in rel.RelatedObjects:
                out.setdefault(el.id(), out[parent.id()])
    return out


def part_links(ctx: ReadContext, member_ids: set[str], part_ids: set[str]) -> list[Link]:
    """Relationships tying plates/fasteners to members, by source.

    Parts and members are named by their keys (``ReadContext.key``).
    """
    f = ctx.file
    key = ctx.key
    acc: dict[tuple[str, LinkSource], set[str]] = defaultdict(set)

    def parts_of(el) -> list[str]:
        k = key(el)
        if k in part_ids:
            return [k]
        if el.is_a("IfcElementAssembly"):
            return [k for p in ifcopenshell.util.element.get_decomposition(el)
                    if (k := key(p)) in part_ids]
        return []

    for rel in f.by_type("IfcRelConnectsWithRealizingElements"):
        ms = {
            k
            for e in (rel.RelatingElement, rel.RelatedElement)
            if e is not None and (k := key(e)) in member_ids
        }
        for r in rel.RealizingElements or ():
            for p in parts_of(r):
                if ms:
                    acc[(p, LinkSource.REALIZING)] |= ms
    for asm in f.by_type("IfcElementAssembly"):
        parts = [key(p) for p in ifcopenshell.util.element.get_decomposition(asm)]
        ms = {p for p in parts if p in member_ids}
        if not ms:
            continue
        for p in parts:
            if p in part_ids:
                acc[(p, LinkSource.ASSEMBLY)] |= ms
    for rel in f.by_type("IfcRelConnectsElements"):
        if rel.is_a("IfcRelConnectsWithRealizingElements"):
            continue
        a, b = rel.RelatingElement, rel.RelatedElement
        if a is None or b is None:
            continue
        ka, kb = key(a), key(b)
        for x, y in ((ka, kb), (kb, ka)):
            if x in part_ids and y in member_ids:
                acc[(x, LinkSource.CONNECTS)].add(y)
    return [Link(part=p, members=tuple(sorted(ms)), source=s) for (p, s), ms in acc.items()]


def grid_axes(ctx: ReadContext, s: float) -> list[GridAxis]:
    """Grid lines in plan (world mm) from every IfcGrid with polyline axes."""
    out = []
    for grid in ctx.file.by_type("IfcGrid"):
        try:
            m = ctx.placements.matrix(grid.ObjectPlacement)
        except (NeedsMesh, DamagedData):
            continue  # grid lines only label joints: a grid that cannot be placed is skipped
        for fam in ("UAxes", "VAxes", "WAxes"):
            for ax in getattr(grid, fam, None) or ():
                c = ax.AxisCurve
                if c is None or not c.is_a("IfcPolyline") or len(c.Points) < 2:
                    continue
                pts = []
                for pt in (c.Points[0], c.Points[-1]):
                    xyz = list(pt.Coordinates) + [0.0] * (3 - len(pt.Coordinates))
                    w = m @ np.array([*xyz, 1.0])
                    pts.append((float(w[0] * s), float(w[1] * s)))
                if not np.isfinite(pts).all():
                    continue
                out.append(
                    GridAxis(tag=str(ax.AxisTag or "?"), family=fam[0], p0=pts[0], p1=pts[1])
                )
    return out
