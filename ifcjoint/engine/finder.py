"""Find beam-to-column joints and account for every other beam end.

Pure numpy + shapely over :mod:`ifcjoint.engine.model`; no IFC. Candidate pairs come from a
shapely ``STRtree`` over plan boxes (never an all-pairs loop); the exact tests run vectorised
in each member's own frame.
"""

from __future__ import annotations

import hashlib
import math
from collections import defaultdict
from collections.abc import Callable, Sequence
from dataclasses import asdict, dataclass

import numpy as np
import shapely

from ifcjoint.engine.model import Member, ModelContents, Plate
from ifcjoint.engine.results import Joint, OtherBeamEnd, PartLink, ScanResult

Progress = Callable[[str, int, int], None]


@dataclass(frozen=True, slots=True, kw_only=True)
class FinderSettings:
    """Tolerances of the joint finder (mm, degrees). Defaults are common practice, no source.

    Attributes:
        tolerance: how far (mm) a beam end may miss a column face or section and still count.
        end_plate_allowance: extra room (mm) for a beam stopping short of the face by an end
            plate's thickness plus a site gap (end plates rarely exceed 50 mm).
        max_slope_deg: steepest beam (degrees from horizontal) still treated as a beam framing
            into a column side; steeper members are braces.
        part_margin: how far (mm) beyond the beam depth and flange width plates and bolts of a
            joint may lie (extended end plates project 100-200 mm beyond the flange).
        pair_level_tolerance: how far apart (mm) two beam ends on opposite faces may be in
            height and still form one double-sided joint, as a fraction of the smaller beam
            depth when below 1, in mm otherwise.
    """

    tolerance: float = 20.0
    end_plate_allowance: float = 60.0
    max_slope_deg: float = 30.0
    part_margin: float = 300.0
    pair_level_tolerance: float = 0.5


def joint_id(beam_guid: str, beam_end: str) -> str:
    """Stable joint id from the beam GlobalId and the end, so it survives re-export.

    Example:
        >>> joint_id("2O2Fr$t4X7Zf8NOew3FLOH", "end")
        'J-...'
    """
    digest = hashlib.sha256(f"{beam_guid}/{beam_end}".encode()).hexdigest()
    return f"J-{digest[:12]}"


def _unit(v: np.ndarray) -> np.ndarray:
    n = np.linalg.norm(v, axis=-1, keepdims=True)
    n = np.where(n == 0, 1.0, n)
    return v / n


@dataclass(slots=True)
class _Frames:
    """Member frames as arrays: origin, u (width), v (depth), w (axis), length, sizes."""

    origin: np.ndarray
    u: np.ndarray
    v: np.ndarray
    w: np.ndarray
    length: np.ndarray
    half_b: np.ndarray
    half_h: np.ndarray
    half_tw: np.ndarray

    @classmethod
    def of(cls, members: Sequence[Member]) -> _Frames:
        if not members:
            z = np.zeros((0, 3))
            e = np.zeros(0)
            return cls(z, z, z, z, e, e, e, e)
        s = np.array([m.start for m in members], dtype=float)
        e = np.array([m.end for m in members], dtype=float)
        w = _unit(e - s)
        v = np.array([m.depth_dir for m in members], dtype=float)
        v = _unit(v - (v * w).sum(1, keepdims=True) * w)
        u = np.cross(v, w)
        h = np.array([m.depth for m in members], dtype=float)
        b = np.array([m.width for m in members], dtype=float)
        tw = np.array(
            [m.web_thickness if m.web_thickness else 0.06 * m.depth for m in members], dtype=float
        )
        return cls(s, u, v, w, np.linalg.norm(e - s, axis=1), b / 2, h / 2, tw / 2)

    def local(self, idx: np.ndarray, pts: np.ndarray) -> np.ndarray:
        d = pts - self.origin[idx]
        return np.stack(
            [(d * self.u[idx]).sum(1), (d * self.v[idx]).sum(1), (d * self.w[idx]).sum(1)], axis=1
        )

    def local_dir(self, idx: np.ndarray, dirs: np.ndarray) -> np.ndarray:
        return np.stack(
            [(dirs * self.u[idx]).sum(1), (dirs * self.v[idx]).sum(1), (dirs * self.w[idx]).sum(1)],
            axis=1,
        )


def _plan_boxes(members: Sequence[Member], pad: float) -> np.ndarray:
    """Plan bounding boxes of the members' section boxes, padded, as shapely boxes."""
    if not members:
        return np.array([], dtype=object)
    f = _Frames.of(members)
    s = f.origin
    e = s + f.w * f.length[:, None]
    ext = np.abs(f.u) * f.half_b[:, None] + np.abs(f.v) * f.half_h[:, None]
    lo = np.minimum(s, e) - ext - pad
    hi = np.maximum(s, e) + ext + pad
    return shapely.box(lo[:, 0], lo[:, 1], hi[:, 0], hi[:, 1])


def find_joints(
    model: ModelContents,
    settings: FinderSettings | None = None,
    progress: Progress | None = None,
) -> ScanResult:
    """Find every beam-to-column joint and classify every other beam end.

    Args:
        model: the members, plates, fasteners and links read from a model (mm).
        settings: finder tolerances; defaults when None.
        progress: optional callback ``(stage, done, total)``.

    Returns:
        The scan result: joints, other beam ends, and the model contents.
    """
    st = settings or FinderSettings()
    beams = [m for m in model.members if m.kind == "beam" and m.steel != "non_steel"]
    columns = [m for m in model.members if m.kind == "column" and m.steel != "non_steel"]
    if progress:
        progress("joints", 0, len(beams))

    nb = len(beams)
    bs = np.array([m.start for m in beams], dtype=float).reshape(-1, 3)
    be = np.array([m.end for m in beams], dtype=float).reshape(-1, 3)
    # Beam ends: index k = 2*i (start) and 2*i+1 (end); approach dir points out of the beam.
    ends = np.empty((2 * nb, 3))
    ends[0::2], ends[1::2] = bs, be
    approach = np.empty((2 * nb, 3))
    approach[0::2], approach[1::2] = _unit(bs - be), _unit(be - bs)
    beam_of_end = np.repeat(np.arange(nb), 2)
    beam_half_h = np.repeat(np.array([m.depth / 2 for m in beams]), 2)
    reach = st.tolerance + st.end_plate_allowance
    max_vertical = math.sin(math.radians(st.max_slope_deg))

    cf = _Frames.of(columns)
    best_col = np.full(2 * nb, -1)
    res_axis = np.zeros(2 * nb, dtype=int)  # 0 major, 1 minor
    res_side = np.zeros(2 * nb)
    res_gap = np.zeros(2 * nb)
    res_point = np.zeros((2 * nb, 3))
    cap_col = np.full(2 * nb, -1)
    base_col = np.full(2 * nb, -1)

    if columns and nb:
        tree = shapely.STRtree(_plan_boxes(columns, reach + st.part_margin / 2))
        pts = shapely.points(ends[:, 0], ends[:, 1])
        ei, ci = tree.query(pts)
        if len(ei):
            loc = cf.local(ci, ends[ei])
            a = cf.local_dir(ci, approach[ei])
            hb, hh, htw, length = cf.half_b[ci], cf.half_h[ci], cf.half_tw[ci], cf.length[ci]
            flat = np.abs(a[:, 2]) <= max_vertical
            major = np.abs(a[:, 1]) >= np.abs(a[:, 0])
            # Side of the column the beam comes from: its body lies opposite to `a`.
            side_v = np.where(a[:, 1] > 0, -1.0, 1.0)
            side_u = np.where(a[:, 0] > 0, -1.0, 1.0)
            gap_major = (loc[:, 1] - side_v * hh) * side_v
            gap_minor = (loc[:, 0] - side_u * htw) * side_u
            lat_ok_major = np.abs(loc[:, 0]) <= hb + st.tolerance
            lat_ok_minor = np.abs(loc[:, 1]) <= hh + st.tolerance
            gap_ok_major = (gap_major <= reach) & (gap_major >= -(2 * hh + st.tolerance))
            gap_ok_minor = (gap_minor <= hb - htw + reach) & (gap_minor >= -(2 * hb))
            height_ok = (loc[:, 2] >= -st.tolerance) & (loc[:, 2] <= length + st.tolerance)
            ok = (
                flat
                & height_ok
                & np.where(major, lat_ok_major & gap_ok_major, lat_ok_minor & gap_ok_minor)
            )
            gap = np.where(major, gap_major, gap_minor)
            # Column base: the beam's underside is within the tolerance of the column foot.
            hb_end = beam_half_h[ei]
            at_base = ok & (loc[:, 2] <= hb_end + st.tolerance)
            # Column cap: beam end above the column top, inside its footprint.
            # (the end may overhang the cap: also test a point set back along the beam)
            back = loc - a * (reach + np.maximum(hb, hh))[:, None]
            in_plan = (
                (np.abs(loc[:, 0]) <= hb + st.tolerance) & (np.abs(loc[:, 1]) <= hh + st.tolerance)
            ) | (
                (np.abs(back[:, 0]) <= hb + st.tolerance)
                & (np.abs(back[:, 1]) <= hh + st.tolerance)
            )
            on_cap = (
                flat
                & in_plan
                & (loc[:, 2] > length + st.tolerance)
                & (loc[:, 2] <= length + 2 * hb_end + reach)
            )
            # Per beam end, the candidate column with the smallest |gap| wins.
            score = np.abs(gap)
            sel = np.flatnonzero(ok & ~at_base)
            if len(sel):
                sel = sel[np.lexsort((score[sel], ei[sel]))]
                pick = sel[np.r_[True, ei[sel][1:] != ei[sel][:-1]]]
                e = ei[pick]
                best_col[e] = ci[pick]
                res_axis[e] = np.where(major[pick], 0, 1)
                res_side[e] = np.where(major[pick], side_v[pick], side_u[pick])
                res_gap[e] = gap[pick]
                res_point[e] = ends[e] + approach[e] * gap[pick][:, None]
            base_col[ei[at_base]] = ci[at_base]
            cap_col[ei[on_cap]] = ci[on_cap]

    joints_raw: list[dict] = []
    others: list[OtherBeamEnd] = []
    unresolved: list[int] = []
    for k in range(2 * nb):
        beam = beams[beam_of_end[k]]
        end_name = "start" if k % 2 == 0 else "end"
        if best_col[k] >= 0:
            col = columns[best_col[k]]
            joints_raw.append(
                dict(
                    k=k,
                    beam=beam,
                    beam_end=end_name,
                    column=col,
                    col_idx=int(best_col[k]),
                    axis="major" if res_axis[k] == 0 else "minor",
                    side=res_side[k],
                    gap=float(res_gap[k]),
                    point=res_point[k],
                )
            )
        elif cap_col[k] >= 0:
            others.append(_other(beam, end_name, "column_cap", columns[cap_col[k]].guid, ends[k]))
        elif base_col[k] >= 0:
            others.append(_other(beam, end_name, "column_base", columns[base_col[k]].guid, ends[k]))
        else:
            unresolved.append(k)
        if progress and k % 2 == 1 and (k // 2) % 200 == 0:
            progress("joints", k // 2 + 1, nb)

    haunches = _haunches(joints_raw, st)
    for j in [j for j in joints_raw if j["k"] in haunches]:
        top = haunches[j["k"]]
        others.append(_other(j["beam"], j["beam_end"], "haunch", top["beam"].guid, ends[j["k"]]))
    raw_by_k = {j["k"]: j for j in joints_raw}
    haunch_of: dict[int, list[str]] = defaultdict(list)
    for k, top in haunches.items():
        haunch_of[top["k"]].append(raw_by_k[k]["beam"].guid)
    joints_raw = [j for j in joints_raw if j["k"] not in haunches]
    others.extend(_classify_free_ends(beams, ends, approach, beam_of_end, unresolved, st))

    partners = _pair_double_sided(joints_raw, st)
    attached = _attach_parts(model, joints_raw, cf, st)

    grid = _GridLabeller(model)
    labels = grid.labels(
        [j["beam"].storey for j in joints_raw],
        np.array([j["point"] for j in joints_raw]).reshape(-1, 3),
        [j["column"] for j in joints_raw],
    )
    joints: list[Joint] = []
    for j, label in zip(joints_raw, labels, strict=True):
        jid = joint_id(j["beam"].guid, j["beam_end"])
        plates, bolts = attached.get(j["k"], ((), ()))
        arche, why = _first_archetype(j, plates, bolts, model, st)
        joints.append(
            Joint(
                id=jid,
                label=label,
                beam=j["beam"].guid,
                beam_end=j["beam_end"],
                column=j["column"].guid,
                axis=j["axis"],
                face="flange" if j["axis"] == "major" else "web",
                side="+" if j["side"] > 0 else "-",
                point=tuple(round(float(x), 3) for x in j["point"]),
                gap=round(j["gap"], 3),
                partner=partners.get(j["k"]),
                haunch_members=tuple(sorted(haunch_of.get(j["k"], ()))),
                archetype=arche,
                archetype_reason=why,
                plates=plates,
                bolts=bolts,
                storey=j["beam"].storey,
            )
        )
    storey_of = {b.guid: b.storey for b in beams}
    olabels = grid.labels(
        [storey_of.get(o.beam, "") for o in others],
        np.array([o.point for o in others]).reshape(-1, 3),
        [None] * len(others),
    )
    others = [
        OtherBeamEnd(
            beam=o.beam, beam_end=o.beam_end, kind=o.kind, other=o.other, point=o.point, label=lab
        )
        for o, lab in zip(others, olabels, strict=True)
    ]
    others.sort(key=lambda o: (o.beam, o.beam_end))
    joints.sort(key=lambda j: (j.label, j.id))
    if progress:
        progress("joints", nb, nb)
    return ScanResult(
        model=model, joints=tuple(joints), other_beam_ends=tuple(others), settings=asdict(st)
    )


def _other(beam: Member, end: str, kind: str, other: str | None, pt: np.ndarray) -> OtherBeamEnd:
    return OtherBeamEnd(
        beam=beam.guid,
        beam_end=end,
        kind=kind,
        other=other,
        point=tuple(round(float(x), 3) for x in pt),
    )


def _classify_free_ends(
    beams: Sequence[Member],
    ends: np.ndarray,
    approach: np.ndarray,
    beam_of_end: np.ndarray,
    unresolved: list[int],
    st: FinderSettings,
) -> list[OtherBeamEnd]:
    """Beam ends that meet no column: beam-to-beam, splice or free (vectorised per pair)."""
    out: list[OtherBeamEnd] = []
    if not unresolved:
        return out
    reach = st.tolerance + st.end_plate_allowance
    bf = _Frames.of(beams)
    tree = shapely.STRtree(_plan_boxes(beams, reach))
    idx = np.array(unresolved)
    ei, bi = tree.query(shapely.points(ends[idx, 0], ends[idx, 1]))
    ei = idx[ei]
    keep = beam_of_end[ei] != bi
    ei, bi = ei[keep], bi[keep]
    kind: dict[int, tuple[int, str, float]] = {}
    if len(ei):
        loc = bf.local(bi, ends[ei])
        a = bf.local_dir(bi, approach[ei])
        length = bf.length[bi]
        # Distance from the end point to the other beam's section box.
        dx = np.maximum(np.abs(loc[:, 0]) - bf.half_b[bi], 0)
        dy = np.maximum(np.abs(loc[:, 1]) - bf.half_h[bi], 0)
        dz = np.maximum(np.maximum(-loc[:, 2], loc[:, 2] - length), 0)
        dist = np.sqrt(dx**2 + dy**2 + dz**2)
        near = dist <= reach
        near_other_end = (loc[:, 2] <= reach) | (loc[:, 2] >= length - reach)
        collinear = np.abs(a[:, 2]) >= math.cos(math.radians(10))
        for k in np.flatnonzero(near):
            e = int(ei[k])
            kname = "splice" if (near_other_end[k] and collinear[k]) else "beam_to_beam"
            if e not in kind or dist[k] < kind[e][2]:
                kind[e] = (int(bi[k]), kname, float(dist[k]))
    for e in unresolved:
        beam = beams[beam_of_end[e]]
        end_name = "start" if e % 2 == 0 else "end"
        if e in kind:
            other_i, kname, _ = kind[e]
            out.append(_other(beam, end_name, kname, beams[other_i].guid, ends[e]))
        else:
            out.append(_other(beam, end_name, "free_end", None, ends[e]))
    return out


def _haunches(joints: list[dict], st: FinderSettings) -> dict[int, dict]:
    """Short members that meet a column face right under another beam's end: haunches.

    A haunch exported as a beam of its own would otherwise count as a joint. It is one when its
    beam is at most 2.5 m long (common practice, no source: haunches run a fraction of the
    span), meets the same column face on the same side, and its top lies within the
    tolerance of the other beam's underside.
    """
    out: dict[int, dict] = {}
    by_face: dict[tuple[int, str, float], list[dict]] = defaultdict(list)
    for j in joints:
        by_face[(j["col_idx"], j["axis"], j["side"])].append(j)
    for group in by_face.values():
        for h in group:
            if h["beam"].length > 2500.0:
                continue
            for top in group:
                if top is h or top["k"] in out:
                    continue
                under = top["point"][2] - top["beam"].depth / 2
                h_top = h["point"][2] + h["beam"].depth / 2
                lateral = np.linalg.norm(np.subtract(top["point"][:2], h["point"][:2]))
                if abs(under - h_top) <= st.tolerance + 5 and lateral <= st.tolerance + 50:
                    out[h["k"]] = top
                    break
    return out


def _pair_double_sided(joints: list[dict], st: FinderSettings) -> dict[int, str]:
    """Pair joints of two beams meeting opposite faces of one column at the same level."""
    by_col: dict[tuple[int, str], list[dict]] = defaultdict(list)
    for j in joints:
        by_col[(j["col_idx"], j["axis"])].append(j)
    partners: dict[int, str] = {}
    for group in by_col.values():
        if len(group) < 2:
            continue
        cands = []
        for i, a in enumerate(group):
            for b in group[i + 1 :]:
                if a["side"] == b["side"]:
                    continue
                dz = abs(a["point"][2] - b["point"][2])
                depth = min(a["beam"].depth, b["beam"].depth)
                tol = (
                    st.pair_level_tolerance * depth
                    if st.pair_level_tolerance < 1
                    else st.pair_level_tolerance
                )
                if dz <= tol:
                    cands.append((dz, a["k"], b["k"], a, b))
        cands.sort(key=lambda c: c[0])
        for _, ka, kb, a, b in cands:
            if ka in partners or kb in partners:
                continue
            partners[ka] = joint_id(b["beam"].guid, b["beam_end"])
            partners[kb] = joint_id(a["beam"].guid, a["beam_end"])
    return partners


@dataclass(slots=True)
class _Zone:
    k: int
    origin: np.ndarray  # face point
    t: np.ndarray  # along the beam, pointing into the column
    n: np.ndarray  # beam depth direction, upwards
    lat: np.ndarray  # across
    half_n: float
    half_l: float
    back: float  # how far back along the beam the zone reaches
    front: float  # how far into the column
    beam_end: np.ndarray  # the beam's end point
    margin: float  # how far beyond the beam depth the zone reaches
    face_reach: float  # the distance segment stops this far past the column face


def _zones(joints: list[dict], st: FinderSettings) -> list[_Zone]:
    """One zone per joint, computed for all joints at once."""
    if not joints:
        return []
    s = np.array([j["beam"].start for j in joints], dtype=float)
    e = np.array([j["beam"].end for j in joints], dtype=float)
    at_end = np.array([j["beam_end"] == "end" for j in joints])
    t = _unit(np.where(at_end[:, None], e - s, s - e))
    n = np.array([j["beam"].depth_dir for j in joints], dtype=float)
    n = _unit(n - (n * t).sum(1, keepdims=True) * t)
    n = np.where(n[:, 2:3] < 0, -n, n)
    lat = np.cross(t, n)
    origin = np.array([j["point"] for j in joints], dtype=float)
    gap = np.array([j["gap"] for j in joints], dtype=float)
    beam_end = origin - t * gap[:, None]
    zones = []
    for i, j in enumerate(joints):
        beam: Member = j["beam"]
        col: Member = j["column"]
        col_extent = col.depth if j["axis"] == "major" else col.width
        zones.append(
            _Zone(
                k=j["k"],
                origin=origin[i],
                t=t[i],
                n=n[i],
                lat=lat[i],
                half_n=beam.depth / 2 + st.part_margin,
                half_l=max(beam.width, col.width) / 2 + st.part_margin / 2,
                back=st.part_margin,
                front=col_extent + st.tolerance,
                beam_end=beam_end[i],
                margin=st.part_margin,
                face_reach=st.tolerance,
            )
        )
    return zones


def _zone_boxes(zones: list[_Zone]) -> np.ndarray:
    """Plan bounding boxes of the zones (shapely boxes), vectorised over zones."""
    o = np.array([z.origin for z in zones])
    t = np.array([z.t for z in zones])
    n = np.array([z.n for z in zones])
    lat = np.array([z.lat for z in zones])
    a = np.array([[-z.back, z.front] for z in zones])
    b = np.array([[-z.half_n, z.half_n] for z in zones])
    c = np.array([[-z.half_l, z.half_l] for z in zones])
    corners = [
        o + a[:, i, None] * t + b[:, jj, None] * n + c[:, kk, None] * lat
        for i in (0, 1)
        for jj in (0, 1)
        for kk in (0, 1)
    ]
    cc = np.stack(corners, axis=1)
    lo, hi = cc[:, :, :2].min(1), cc[:, :, :2].max(1)
    return shapely.box(lo[:, 0], lo[:, 1], hi[:, 0], hi[:, 1])


def _in_zone(z: _Zone, p: np.ndarray) -> tuple[bool, float]:
    """Whether a point lies in the joint's zone, and how far it is from the joint's axis.

    The distance is measured to the beam's centreline segment running from ``back`` behind
    the beam end to the column face, ignoring height within the beam depth: a part
    beside the beam's web is closer to its own joint than to a joint around the corner.
    """
    d = p - z.origin
    a, b, c = d.dot(z.t), d.dot(z.n), d.dot(z.lat)
    inside = (-z.back <= a <= z.front) and abs(b) <= z.half_n and abs(c) <= z.half_l
    a_out = max(-z.back - a, 0.0, a - z.face_reach)
    b_out = max(abs(b) - (z.half_n - z.margin), 0.0)
    return inside, float(math.sqrt(a_out * a_out + b_out * b_out + c * c))


def _plate_role(z: _Zone, p: Plate, col_frames: _Frames, ci: int, reach: float) -> str:
    """What a plate near a joint is, from its orientation and position.

    Stiffener (normal along the column, inside its section) and web plate (parallel to the
    web, inside the section) are ``column_plate``; a plate square to the beam at its end is an
    ``end_plate``; a plate beside the beam web, within its depth, is a ``fin_plate``; anything
    else (a haunch below the beam, an inclined stiffener) is an ``other_plate``.
    """
    nrm = np.array(p.normal)
    c = np.array(p.center)
    idx = np.array([ci])
    loc = col_frames.local(idx, c[None, :])[0]
    inside = (abs(loc[0]) < col_frames.half_b[ci] - 1) and (abs(loc[1]) < col_frames.half_h[ci] - 1)
    along_col = abs(nrm.dot(col_frames.w[ci])) > 0.9
    if inside and along_col:
        return "column_plate"
    # At the beam's end, or at the column face when the beam is drawn into the column.
    at_end = min(abs((c - z.beam_end).dot(z.t)), abs((c - z.origin).dot(z.t))) <= (
        p.thickness / 2 + reach
    )
    if abs(nrm.dot(z.t)) > 0.9 and at_end:
        return "end_plate"
    if inside and abs(nrm.dot(col_frames.u[ci])) > 0.9:
        return "column_plate"
    below_beam = (c - z.origin).dot(z.n) < -(z.half_n - z.margin)
    if abs(nrm.dot(z.lat)) > 0.9 and not below_beam:
        return "fin_plate"
    return "other_plate"


def _bolt_through_plate(p: Plate, center: np.ndarray, axis: np.ndarray, length: float) -> bool:
    """True when the bolt's axis crosses the plate inside its outline, within the bolt's length."""
    nrm = np.array(p.normal)
    denom = axis.dot(nrm)
    if abs(denom) < 0.5:  # bolt axis must be roughly normal to the plate
        return False
    c = np.array(p.center)
    s = (c - center).dot(nrm) / denom
    if abs(s) > length / 2 + p.thickness:
        return False
    hit = center + s * axis - c
    return (
        abs(hit.dot(np.array(p.u_dir))) <= p.half_u and abs(hit.dot(np.array(p.v_dir))) <= p.half_v
    )


def _attach_parts(
    model: ModelContents, joints: list[dict], col_frames: _Frames, st: FinderSettings
) -> dict[int, tuple[tuple[PartLink, ...], tuple[PartLink, ...]]]:
    """Attach plates and fasteners to joints: relations first, then geometry.

    Order: IfcRelConnectsWithRealizingElements, IfcElementAssembly aggregation,
    IfcRelConnectsElements, then geometry (plate near the beam end and column face; bolt whose
    axis passes through an attached plate, or lying in the joint zone).
    """
    if not joints:
        return {}
    zones = _zones(joints, st)
    zone_by_k = {z.k: z for z in zones}
    joint_by_k = {j["k"]: j for j in joints}
    tree = shapely.STRtree(_zone_boxes(zones))
    by_member: dict[str, list[int]] = defaultdict(list)
    for j in joints:
        by_member[j["beam"].guid].append(j["k"])
        by_member[j["column"].guid].append(j["k"])

    order = {"realizing": 0, "assembly": 1, "connects": 2}
    links: dict[str, list[tuple[str, set[str]]]] = defaultdict(list)
    for lk in model.links:
        links[lk.part].append((lk.source, set(lk.members)))
    for v in links.values():
        v.sort(key=lambda x: order.get(x[0], 9))

    def candidates(center: np.ndarray) -> list[tuple[int, bool, float]]:
        out = []
        for zi in tree.query(shapely.points(center[0], center[1])):
            z = zones[int(zi)]
            inside, dist = _in_zone(z, center)
            out.append((z.k, inside, dist))
        return out

    def by_relation(guid: str, cands: list[tuple[int, bool, float]]) -> tuple[list[int], str]:
        """Joints named by the part's relations, strongest relation first."""
        for source, members in links.get(guid, []):
            named_any = {k for m in members for k in by_member.get(m, ())}
            both = sorted(
                k
                for k in named_any
                if joint_by_k[k]["beam"].guid in members and joint_by_k[k]["column"].guid in members
            )
            if both and source in ("realizing", "connects"):
                return both, source
            near = {k for k, inside, _ in cands if inside}
            named = [
                k
                for k in near
                if joint_by_k[k]["beam"].guid in members or joint_by_k[k]["column"].guid in members
            ]
            if named:
                return named, source
        return [], "geometry"

    plates_of: dict[int, list[PartLink]] = defaultdict(list)
    plate_joints: dict[str, list[int]] = {}
    for p in model.plates:
        c = np.array(p.center)
        cands = candidates(c)
        ks, source = by_relation(p.guid, cands)
        dist = {k: d for k, _, d in cands}
        if not ks:
            ks = [k for k, inside, _ in cands if inside]
        if not ks:
            continue
        # A plate inside the column section (stiffener, web plate) serves every joint there.
        roles = {
            k: _plate_role(
                zone_by_k[k],
                p,
                col_frames,
                joint_by_k[k]["col_idx"],
                st.tolerance + st.end_plate_allowance,
            )
            for k in ks
        }
        shared = [k for k in ks if roles[k] == "column_plate"]
        chosen = shared if shared else [min(ks, key=lambda k: dist.get(k, 0.0))]
        plate_joints[p.guid] = chosen
        for k in chosen:
            plates_of[k].append(PartLink(guid=p.guid, source=source, role=roles[k]))

    plate_by_guid = {p.guid: p for p in model.plates}
    bolts_of: dict[int, list[PartLink]] = defaultdict(list)
    for f in model.fasteners:
        c = np.array(f.center)
        ax = np.array(f.axis)
        cands = candidates(c)
        ks, source = by_relation(f.guid, cands)
        if not ks:
            through = set()
            for k, _inside, _ in cands:
                for pl in plates_of.get(k, []):
                    p = plate_by_guid[pl.guid]
                    if pl.role != "column_plate" and _bolt_through_plate(p, c, ax, f.length):
                        through.add(k)
            if through:
                ks, source = sorted(through), "geometry"
            else:
                ks = [k for k, inside, _ in cands if inside]
                source = "geometry"
        if not ks:
            continue
        dist = {k: d for k, _, d in cands}
        k = min(ks, key=lambda kk: dist.get(kk, 0.0))
        role = {"bolt": "bolt", "weld": "weld"}.get(f.kind, "other_fastener")
        bolts_of[k].append(PartLink(guid=f.guid, source=source, role=role))

    out = {}
    for j in joints:
        k = j["k"]
        out[k] = (
            tuple(sorted(plates_of.get(k, []), key=lambda x: x.guid)),
            tuple(sorted(bolts_of.get(k, []), key=lambda x: x.guid)),
        )
    return out


def _first_archetype(
    j: dict,
    plates: tuple[PartLink, ...],
    bolts: tuple[PartLink, ...],
    model: ModelContents,
    st: FinderSettings,
) -> tuple[str, str]:
    """First guess of the joint type from the parts found; refined by the anatomy step."""
    roles = {p.role for p in plates}
    nbolts = sum(1 for b in bolts if b.role == "bolt")
    if "end_plate" in roles:
        if nbolts:
            return "end_plate", f"end plate at the beam end with {nbolts} bolt(s)"
        return "incomplete", "end plate at the beam end but no bolts found"
    if "fin_plate" in roles:
        if nbolts:
            return "fin_plate", f"plate along the beam web with {nbolts} bolt(s)"
        return "incomplete", "plate along the beam web but no bolts found"
    if nbolts:
        return "incomplete", f"{nbolts} bolt(s) at the joint but no plate found"
    if abs(j["gap"]) <= st.tolerance / 2:
        return "welded", f"beam end touches the column face (gap {j['gap']:.1f} mm), no plate"
    if j["gap"] > 0:
        return "incomplete", f"beam stops {j['gap']:.0f} mm short of the column, nothing bridges"
    return "unknown", f"beam runs {-j['gap']:.0f} mm into the column and no parts were found"


class _GridLabeller:
    """Readable labels: storey and grid cell when the model has a grid, else coordinates."""

    def __init__(self, model: ModelContents, snap: float = 500.0) -> None:
        self.axes = list(model.grid_axes)
        self.snap = snap
        if self.axes:
            self.p0 = np.array([a.p0 for a in self.axes])
            d = np.array([a.p1 for a in self.axes]) - self.p0
            self.d = _unit(d)
            self.fam = np.array([a.family for a in self.axes])
            self.tags = [a.tag for a in self.axes]

    def labels(
        self, storeys: Sequence[str], points: np.ndarray, columns: Sequence[Member | None]
    ) -> list[str]:
        """Labels for many points at once (vectorised over points and grid lines)."""
        p = np.asarray(points, dtype=float).reshape(-1, 3).copy()
        has = np.array([c is not None for c in columns], dtype=bool)
        if has.any():
            cs = np.array([c.start if c is not None else (0, 0, 0) for c in columns], float)
            ce = np.array([c.end if c is not None else (0, 0, 1) for c in columns], float)
            w = _unit(ce - cs)
            proj = cs + w * ((p - cs) * w).sum(1, keepdims=True)
            p[has] = proj[has]
        wheres: list[str | None] = [None] * len(p)
        if self.axes and len(p):
            rel = p[:, None, :2] - self.p0[None, :, :]
            dist = np.abs(rel[..., 0] * self.d[None, :, 1] - rel[..., 1] * self.d[None, :, 0])
            fam_tags = []
            for fam in ("U", "V", "W"):
                cols = np.flatnonzero(self.fam == fam)
                if not len(cols):
                    continue
                dd = dist[:, cols]
                best = dd.argmin(1)
                ok = dd[np.arange(len(p)), best] <= self.snap
                fam_tags.append((cols[best], ok))
            for i in range(len(p)):
                parts = [self.tags[idx[i]] for idx, ok in fam_tags if ok[i]]
                if len(parts) >= 2:
                    wheres[i] = "/".join(parts)
        out = []
        for i, st in enumerate(storeys):
            where = wheres[i] or f"({p[i, 0]:.0f}, {p[i, 1]:.0f}, {p[i, 2]:.0f})"
            out.append(f"{st} {where}".strip() if st else where)
        return out
