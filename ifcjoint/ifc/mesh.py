"""Fallback for bodies that are not extrusions: tessellate with ``ifcopenshell.geom``.

The principal axes come from the area-weighted second moments of the surface triangles:
for a prismatic member the largest spread is along its length, the next across its depth
(an I section's flanges put most surface far from its strong axis), the least across its width.
"""

from __future__ import annotations

import multiprocessing
from collections.abc import Iterable
from dataclasses import dataclass

import ifcopenshell
import ifcopenshell.geom
import numpy as np


@dataclass(slots=True)
class MeshBox:
    """Principal frame and extents of a tessellated body (world, mm)."""

    center: np.ndarray  # centre of the box
    axes: np.ndarray  # 3x3, columns: largest, middle, smallest spread
    size: np.ndarray  # extents along the axes
    volume: float
    depth_hint: np.ndarray | None = None


def tessellate(model: ifcopenshell.file, elements: Iterable, scale_to_mm: float, *,
               isolate: bool = True):
    """Yield ``(element, verts_mm, faces, error)`` for the elements, in world coordinates.

    Elements the kernel cannot process are yielded with ``verts`` None and the error text.
    With ``isolate`` (the default where processes can be forked) the kernel runs in a child
    process: damaged data that crashes it (a segmentation fault) costs that element, which
    is reported as unreadable, never the run.
    """
    elements = list(elements)
    if not elements:
        return
    if isolate and "fork" in multiprocessing.get_all_start_methods():
        yield from _tessellate_isolated(model, elements, scale_to_mm)
    else:
        yield from _tessellate_here(model, elements, scale_to_mm)


def _child(model, ids: list[int], one_by_one: bool, conn) -> None:
    """Tessellate in a forked child; send each result as it is made, then None."""
    import faulthandler

    faulthandler.disable()  # a crash here is reported by the parent, not dumped on stderr
    try:
        els = [model.by_id(i) for i in ids]
        gen = (_tessellate_one_by_one if one_by_one else _tessellate_here)(model, els, 1.0)
        for el, v, f, err in gen:
            conn.send((el.id(), v, f, err))
        conn.send(None)
    finally:
        conn.close()


def _tessellate_isolated(model, elements: list, scale_to_mm: float):
    """Tessellate in forked children; a child that dies loses one element, named, not all.

    A first child runs the kernel's multi-threaded iterator; if it dies, the rest go one by
    one, and each death marks the element in hand as unreadable before a new child goes on.
    """
    ctx = multiprocessing.get_context("fork")
    remaining = [e.id() for e in elements]
    one_by_one = False
    while remaining:
        recv, send = ctx.Pipe(duplex=False)
        proc = ctx.Process(target=_child, args=(model, remaining, one_by_one, send), daemon=True)
        proc.start()
        send.close()
        got: set[int] = set()
        finished = False
        try:
            while True:
                msg = recv.recv()
                if msg is None:
                    finished = True
                    break
                eid, v, f, err = msg
                got.add(eid)
                yield model.by_id(eid), v, f, err
        except EOFError:
            pass
        finally:
            recv.close()
            proc.join()
        remaining = [i for i in remaining if i not in got]
        if finished or not remaining:
            break
        if not one_by_one:
            one_by_one = True  # the iterator's order is unknown: find the culprit one by one
            continue
        code = proc.exitcode
        why = f"signal {-code}" if code is not None and code < 0 else f"exit code {code}"
        yield (model.by_id(remaining[0]), None, None,
               f"the geometry kernel crashed on this element's body ({why}); damaged data?")
        remaining = remaining[1:]


def _tessellate_one_by_one(model, elements: list, scale_to_mm: float):
    """The kernel on each element alone, in order (to find one that crashes it)."""
    settings = ifcopenshell.geom.settings()
    settings.set("use-world-coords", True)
    for el in elements:
        yield _shape(settings, el)


def _shape(settings, el):
    try:
        shape = ifcopenshell.geom.create_shape(settings, el)
        v = np.asarray(shape.geometry.verts, dtype=float).reshape(-1, 3) * 1000.0
        f = np.asarray(shape.geometry.faces, dtype=int).reshape(-1, 3)
        if len(f) == 0:
            return el, None, None, "body has no triangles"
        return el, v, f, None
    except Exception as exc:  # the kernel raises many kinds
        return el, None, None, f"geometry kernel could not process the body: {exc}"


def _tessellate_here(model: ifcopenshell.file, elements: list, scale_to_mm: float):
    """Tessellate in this process (see ``tessellate``)."""
    settings = ifcopenshell.geom.settings()
    settings.set("use-world-coords", True)
    done = set()
    threads = max(1, min(4, multiprocessing.cpu_count()))
    try:
        it = ifcopenshell.geom.iterator(settings, model, threads, include=elements)
        ok = it.initialize()
    except Exception:  # fall back to one element at a time
        ok = False
    if ok:
        while True:
            shape = it.get()
            el = model.by_id(shape.id)
            v = np.asarray(shape.geometry.verts, dtype=float).reshape(-1, 3) * 1000.0
            f = np.asarray(shape.geometry.faces, dtype=int).reshape(-1, 3)
            done.add(el.id())
            yield el, v, f, None
            if not it.next():
                break
    for el in elements:
        if el.id() not in done:
            yield _shape(settings, el)


def principal_box(verts: np.ndarray, faces: np.ndarray) -> MeshBox:
    """Principal axes and extents of a closed triangle mesh.

    Axes from the area-weighted second moments of the surface (about its area centroid);
    extents from the vertices projected on those axes.
    """
    tri = verts[faces]
    a, b, c = tri[:, 0], tri[:, 1], tri[:, 2]
    cross = np.cross(b - a, c - a)
    area = 0.5 * np.linalg.norm(cross, axis=1)
    total = area.sum()
    if total <= 0:
        raise ValueError("degenerate mesh")
    cent = (a + b + c) / 3
    mean = (cent * area[:, None]).sum(0) / total
    # Second moment of each triangle about `mean`: A/12 (sum vi vi^T + s s^T), s = a+b+c.
    ra, rb, rc = a - mean, b - mean, c - mean
    s = ra + rb + rc
    cov = np.einsum("n,ni,nj->ij", area / 12.0, ra, ra)
    cov += np.einsum("n,ni,nj->ij", area / 12.0, rb, rb)
    cov += np.einsum("n,ni,nj->ij", area / 12.0, rc, rc)
    cov += np.einsum("n,ni,nj->ij", area / 12.0, s, s)
    w, vecs = np.linalg.eigh(cov)
    order = np.argsort(w)[::-1]
    axes = vecs[:, order]
    proj = (verts - mean) @ axes
    lo, hi = proj.min(0), proj.max(0)
    center = mean + axes @ ((lo + hi) / 2)
    volume = abs(float(np.einsum("ij,ij->i", a, np.cross(b, c)).sum()) / 6.0)
    return MeshBox(center=center, axes=axes, size=hi - lo, volume=volume)


def section_outline(
    verts: np.ndarray,
    faces: np.ndarray,
    point: np.ndarray,
    axis: np.ndarray,
    x_dir: np.ndarray,
    y_dir: np.ndarray,
):
    """The body's cross-section at ``point`` across ``axis``, as a shapely polygon in (x, y).

    Triangle edges crossing the cutting plane give segments; shapely polygonises them and the
    largest polygon is returned (None when the cut gives no closed outline).
    """
    import shapely

    d = (verts - point) @ axis
    tri = faces
    segs = []
    for a, b, c in tri:
        da, db, dc = d[a], d[b], d[c]
        pts = []
        for (i, di), (k, dk) in (((a, da), (b, db)), ((b, db), (c, dc)), ((c, dc), (a, da))):
            if (di < 0) != (dk < 0):
                s = di / (di - dk)
                pts.append(verts[i] + s * (verts[k] - verts[i]))
        if len(pts) == 2:
            p = [((q - point) @ x_dir, (q - point) @ y_dir) for q in pts]
            segs.append(shapely.LineString(p))
    if not segs:
        return None
    merged = shapely.union_all(segs)
    polys = list(shapely.get_parts(shapely.polygonize(shapely.get_parts(merged))))
    if not polys:
        return None
    return max(polys, key=lambda g: g.area)
