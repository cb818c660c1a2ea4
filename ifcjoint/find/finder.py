"""Find beam-to-column joints and account for every other beam end.

Pure numpy + shapely over :mod:`ifcjoint.model.elements`; no IFC. The stages: every beam end
is tested against the columns a shapely ``STRtree`` of plan boxes proposes (never an
all-pairs loop), vectorised in each column's own frame (``_column_hits``); the nearest face
wins; short members under another beam's end are haunches; ends meeting no column are
beam-to-beam, splices or free (``_classify_free_ends``); beams on opposite faces at one
level pair up; parts are attached (``parts``) and joints labelled (``labels``). The archetype
is decided later, once, from the joint's anatomy.
"""

from __future__ import annotations

import math
from collections import defaultdict
from collections.abc import Sequence
from dataclasses import asdict, dataclass, replace

import numpy as np
import shapely

from ifcjoint.find.frames import Frames, plan_boxes, unit
from ifcjoint.find.labels import GridLabeller
from ifcjoint.find.parts import AttachMemo, attach_parts
from ifcjoint.find.settings import FinderSettings
from ifcjoint.model.codes import Axis, EndKind, Face, MemberKind, SteelState, Support
from ifcjoint.model.elements import Member, ModelContents, Progress
from ifcjoint.model.identity import joint_id
from ifcjoint.model.joints import Joint, OtherBeamEnd, ScanResult

#: Largest angle between two beams meeting end to end that is still a splice (degrees;
#: common practice, no source: roof apexes are pitched up to about 10 degrees each way).
SPLICE_KINK_DEG = 20.0


@dataclass(slots=True)
class _Ends:
    """Every beam end as arrays: index k = 2 i (start of beam i) and 2 i + 1 (its end)."""

    beams: list[Member]
    points: np.ndarray  # (2n, 3)
    approach: np.ndarray  # unit direction pointing out of the beam at the end
    beam_of: np.ndarray
    half_h: np.ndarray

    @classmethod
    def of(cls, beams: list[Member]) -> _Ends:
        nb = len(beams)
        bs = np.array([m.start for m in beams], dtype=float).reshape(-1, 3)
        be = np.array([m.end for m in beams], dtype=float).reshape(-1, 3)
        pts, app = np.empty((2 * nb, 3)), np.empty((2 * nb, 3))
        pts[0::2], pts[1::2] = bs, be
        app[0::2], app[1::2] = unit(bs - be), unit(be - bs)
        return cls(
            beams=beams,
            points=pts,
            approach=app,
            beam_of=np.repeat(np.arange(nb), 2),
            half_h=np.repeat(np.array([m.depth / 2 for m in beams]), 2),
        )

    def name(self, k: int) -> str:
        """``start`` or ``end``."""
        return "start" if k % 2 == 0 else "end"

    def beam(self, k: int) -> Member:
        """The beam of end k."""
        return self.beams[self.beam_of[k]]


@dataclass(slots=True)
class _Hits:
    """Per beam end: the column it frames into (or caps, or sits at the foot of)."""

    column: np.ndarray  # index of the column framed into, -1 none
    minor: np.ndarray  # True: the beam meets the column's web
    side: np.ndarray
    gap: np.ndarray
    point: np.ndarray
    cap: np.ndarray  # index of the column it sits on, -1 none
    base: np.ndarray  # index of the column at whose foot it lands, -1 none

    @classmethod
    def empty(cls, n: int) -> _Hits:
        return cls(
            column=np.full(n, -1),
            minor=np.zeros(n, dtype=bool),
            side=np.zeros(n),
            gap=np.zeros(n),
            point=np.zeros((n, 3)),
            cap=np.full(n, -1),
            base=np.full(n, -1),
        )


def find_joints(
    model: ModelContents,
    settings: FinderSettings | None = None,
    progress: Progress | None = None,
    memo: AttachMemo | None = None,
) -> ScanResult:
    """Find every beam-to-column joint and classify every other beam end.

    Args:
        model: the members, plates, fasteners and links read from a model (mm).
        settings: finder tolerances; defaults when None.
        progress: optional callback ``(stage, done, total)``.
        memo: an earlier run's part attachments, taken where nothing they depend on
            changed; this run's are kept in it (``parts.AttachMemo``).

    Returns:
        The scan result: joints, other beam ends, and the model contents.
    """
    st = settings or FinderSettings()
    steel = [m for m in model.members if m.steel != SteelState.NON_STEEL]
    beams = [m for m in steel if m.kind == MemberKind.BEAM]
    columns = [m for m in steel if m.kind == MemberKind.COLUMN]
    if progress:
        progress("joints", 0, len(beams))
    ends = _Ends.of(beams)
    cf = Frames.of(columns)
    hits = _column_hits(ends, columns, cf, st)
    raw, others, unresolved = _sort_ends(ends, columns, hits, progress)
    haunches = _haunches(raw, st)
    raw_by_k = {j["k"]: j for j in raw}
    haunch_of: dict[int, list[str]] = defaultdict(list)
    for k, top in haunches.items():
        others.append(_other(raw_by_k[k]["beam"], ends.name(k), EndKind.HAUNCH,
                             top["beam"].guid, ends.points[k]))
        haunch_of[top["k"]].append(raw_by_k[k]["beam"].guid)
    raw = [j for j in raw if j["k"] not in haunches]
    on_webs = _beam_web_hits(ends, unresolved, len(columns), st)
    raw.extend(on_webs)
    free = _classify_free_ends(ends, unresolved, st)
    others.extend(free)
    raw.extend(_splice_joints(ends, free, len(columns)))
    grid = GridLabeller(model)
    # the supports' frames: the columns, then the beams (a beam-to-beam joint's col_idx)
    joints = _make_joints(raw, model, Frames.of([*columns, *beams]), st, grid, haunch_of,
                          memo)
    # an end checked by a joint of its own besides its kind: beam-to-beam, and both ends of
    # a splice (the joint is the first end's)
    by_end = {(j.beam, j.beam_end): j.id for j in joints if j.support != Support.COLUMN}
    for j in joints:
        if j.support == Support.SPLICE:
            by_end[(j.column, j.other_end)] = j.id
    others = [replace(o, joint=by_end.get((o.beam, o.beam_end))) for o in others]
    others = _label_others(others, beams, grid)
    if progress:
        progress("joints", len(beams), len(beams))
    return ScanResult(
        model=model, joints=tuple(joints), other_beam_ends=tuple(others), settings=asdict(st)
    )


def _column_hits(
    ends: _Ends, columns: list[Member], cf: Frames, st: FinderSettings
) -> _Hits:
    """For every beam end, the column face it meets (nearest), the cap or foot it lands on.

    Candidates from an STRtree of the columns' padded plan boxes; the exact tests run
    vectorised in each column's frame: the beam runs flat (within ``max_slope_deg``), its end
    lies within the column's height, beside the flange (major axis) or the web (minor axis),
    with a gap no larger than the reach of an end plate.
    """
    n = len(ends.points)
    out = _Hits.empty(n)
    if not columns or not n:
        return out
    reach = st.tolerance + st.end_plate_allowance
    tree = shapely.STRtree(plan_boxes(columns, reach + st.part_margin / 2))
    ei, ci = tree.query(shapely.points(ends.points[:, 0], ends.points[:, 1]))
    if not len(ei):
        return out
    loc = cf.local(ci, ends.points[ei])
    a = cf.local_dir(ci, ends.approach[ei])
    hb, hh, htw, length = cf.half_b[ci], cf.half_h[ci], cf.half_tw[ci], cf.length[ci]
    flat = np.abs(a[:, 2]) <= math.sin(math.radians(st.max_slope_deg))
    major = np.abs(a[:, 1]) >= np.abs(a[:, 0])
    # Side of the column the beam comes from: its body lies opposite to `a`.
    side_v = np.where(a[:, 1] > 0, -1.0, 1.0)
    side_u = np.where(a[:, 0] > 0, -1.0, 1.0)
    gap_major = (loc[:, 1] - side_v * hh) * side_v
    gap_minor = (loc[:, 0] - side_u * htw) * side_u
    ok_major = (
        (np.abs(loc[:, 0]) <= hb + st.tolerance)
        & (gap_major <= reach)
        & (gap_major >= -(2 * hh + st.tolerance))
    )
    ok_minor = (
        (np.abs(loc[:, 1]) <= hh + st.tolerance)
        & (gap_minor <= hb - htw + reach)
        & (gap_minor >= -(2 * hb))
    )
    height_ok = (loc[:, 2] >= -st.tolerance) & (loc[:, 2] <= length + st.tolerance)
    ok = flat & height_ok & np.where(major, ok_major, ok_minor)
    gap = np.where(major, gap_major, gap_minor)
    # Column base: the beam's underside is within the tolerance of the column foot.
    hb_end = ends.half_h[ei]
    at_base = ok & (loc[:, 2] <= hb_end + st.tolerance)
    # Column cap: beam end above the column top, inside its footprint (the end may overhang
    # the cap: also test a point set back along the beam).
    back = loc - a * (reach + np.maximum(hb, hh))[:, None]

    def in_plan(q: np.ndarray) -> np.ndarray:
        return (np.abs(q[:, 0]) <= hb + st.tolerance) & (np.abs(q[:, 1]) <= hh + st.tolerance)

    on_cap = (
        flat
        & (in_plan(loc) | in_plan(back))
        & (loc[:, 2] > length + st.tolerance)
        & (loc[:, 2] <= length + 2 * hb_end + reach)
    )
    # Per beam end, the candidate column with the smallest |gap| wins.
    sel = np.flatnonzero(ok & ~at_base)
    if len(sel):
        sel = sel[np.lexsort((np.abs(gap)[sel], ei[sel]))]
        pick = sel[np.r_[True, ei[sel][1:] != ei[sel][:-1]]]
        e = ei[pick]
        out.column[e] = ci[pick]
        out.minor[e] = ~major[pick]
        out.side[e] = np.where(major[pick], side_v[pick], side_u[pick])
        out.gap[e] = gap[pick]
        out.point[e] = ends.points[e] + ends.approach[e] * gap[pick][:, None]
    out.base[ei[at_base]] = ci[at_base]
    out.cap[ei[on_cap]] = ci[on_cap]
    return out


def _sort_ends(
    ends: _Ends, columns: list[Member], hits: _Hits, progress: Progress | None
) -> tuple[list[dict], list[OtherBeamEnd], list[int]]:
    """Beam ends into joints (as raw records), caps and bases, and ends still to classify."""
    joints: list[dict] = []
    others: list[OtherBeamEnd] = []
    unresolved: list[int] = []
    nb = len(ends.beams)
    for k in range(len(ends.points)):
        beam, end_name = ends.beam(k), ends.name(k)
        if hits.column[k] >= 0:
            joints.append(
                dict(
                    k=k,
                    beam=beam,
                    beam_end=end_name,
                    column=columns[hits.column[k]],
                    col_idx=int(hits.column[k]),
                    axis=Axis.MINOR if hits.minor[k] else Axis.MAJOR,
                    side=hits.side[k],
                    gap=float(hits.gap[k]),
                    point=hits.point[k],
                )
            )
        elif hits.cap[k] >= 0:
            col = columns[hits.cap[k]].guid
            others.append(_other(beam, end_name, EndKind.COLUMN_CAP, col, ends.points[k]))
        elif hits.base[k] >= 0:
            col = columns[hits.base[k]].guid
            others.append(_other(beam, end_name, EndKind.COLUMN_BASE, col, ends.points[k]))
        else:
            unresolved.append(k)
        if progress and k % 2 == 1 and (k // 2) % 200 == 0:
            progress("joints", k // 2 + 1, nb)
    return joints, others, unresolved


def _make_joints(
    raw: list[dict],
    model: ModelContents,
    cf: Frames,
    st: FinderSettings,
    grid: GridLabeller,
    haunch_of: dict[int, list[str]],
    memo: AttachMemo | None = None,
) -> list[Joint]:
    """Joints from the raw records: partners, parts and labels, sorted by label."""
    partners = _pair_double_sided(raw, st)
    attached = attach_parts(model, raw, cf, st, memo)
    labels = grid.labels(
        [j["beam"].storey for j in raw],
        np.array([j["point"] for j in raw]).reshape(-1, 3),
        [j["column"] if j.get("support", Support.COLUMN) == Support.COLUMN else None
         for j in raw],
    )
    joints = []
    for j, label in zip(raw, labels, strict=True):
        plates, fasteners = attached.get(j["k"], ((), ()))
        joints.append(
            Joint(
                id=joint_id(j["beam"].guid, j["beam_end"]),
                label=label,
                beam=j["beam"].guid,
                beam_end=j["beam_end"],
                column=j["column"].guid,
                axis=j["axis"],
                face=(Face.END if j.get("support") == Support.SPLICE
                      else Face.FLANGE if j["axis"] == Axis.MAJOR else Face.WEB),
                side="+" if j["side"] > 0 else "-",
                point=tuple(round(float(x), 3) for x in j["point"]),
                gap=round(j["gap"], 3),
                partner=partners.get(j["k"]),
                haunch_members=tuple(sorted(haunch_of.get(j["k"], ()))),
                plates=plates,
                fasteners=fasteners,
                storey=j["beam"].storey,
                support=j.get("support", Support.COLUMN),
                other_end=j.get("other_end"),
            )
        )
    joints.sort(key=lambda j: (j.label, j.id))
    return joints


def _label_others(
    others: list[OtherBeamEnd], beams: Sequence[Member], grid: GridLabeller
) -> list[OtherBeamEnd]:
    """The other beam ends with their labels, sorted by beam and end."""
    storey_of = {b.guid: b.storey for b in beams}
    labels = grid.labels(
        [storey_of.get(o.beam, "") for o in others],
        np.array([o.point for o in others]).reshape(-1, 3),
        [None] * len(others),
    )
    out = [replace(o, label=lab) for o, lab in zip(others, labels, strict=True)]
    out.sort(key=lambda o: (o.beam, o.beam_end))
    return out


def _other(beam: Member, end: str, kind: EndKind, other: str | None, pt) -> OtherBeamEnd:
    return OtherBeamEnd(
        beam=beam.guid,
        beam_end=end,
        kind=kind,
        other=other,
        point=tuple(round(float(x), 3) for x in pt),
    )


def _other_beams_near(
    ends: _Ends, unresolved: list[int], reach: float
) -> tuple[Frames, np.ndarray, np.ndarray]:
    """The beams' frames, and (end, other beam) pairs whose padded plan box holds the end.

    Candidates from an STRtree of the beams' plan boxes padded by ``reach``, every end at
    once; an end's own beam left out.
    """
    bf = Frames.of(ends.beams)
    tree = shapely.STRtree(plan_boxes(ends.beams, reach))
    idx = np.array(unresolved)
    ei, bi = tree.query(shapely.points(ends.points[idx, 0], ends.points[idx, 1]))
    ei = idx[ei]
    keep = ends.beam_of[ei] != bi
    return bf, ei[keep], bi[keep]


def _classify_free_ends(
    ends: _Ends, unresolved: list[int], st: FinderSettings
) -> list[OtherBeamEnd]:
    """Beam ends that meet no column: beam-to-beam, splice or free (vectorised per pair)."""
    out: list[OtherBeamEnd] = []
    if not unresolved:
        return out
    reach = st.tolerance + st.end_plate_allowance
    beams = ends.beams
    bf, ei, bi = _other_beams_near(ends, unresolved, reach)
    kind: dict[int, tuple[int, EndKind, float]] = {}
    if len(ei):
        loc = bf.local(bi, ends.points[ei])
        a = bf.local_dir(bi, ends.approach[ei])
        length = bf.length[bi]
        # Distance from the end point to the other beam's section box.
        dx = np.maximum(np.abs(loc[:, 0]) - bf.half_b[bi], 0)
        dy = np.maximum(np.abs(loc[:, 1]) - bf.half_h[bi], 0)
        dz = np.maximum(np.maximum(-loc[:, 2], loc[:, 2] - length), 0)
        dist = np.sqrt(dx**2 + dy**2 + dz**2)
        near_other_end = (loc[:, 2] <= reach) | (loc[:, 2] >= length - reach)
        # in line within SPLICE_KINK_DEG: a straight splice, or an apex of a roof pitched up
        # to half of it each way
        collinear = np.abs(a[:, 2]) >= math.cos(math.radians(SPLICE_KINK_DEG))
        for k in np.flatnonzero(dist <= reach):
            e = int(ei[k])
            splice = near_other_end[k] and collinear[k]
            kname = EndKind.SPLICE if splice else EndKind.BEAM_TO_BEAM
            if e not in kind or dist[k] < kind[e][2]:
                kind[e] = (int(bi[k]), kname, float(dist[k]))
    for e in unresolved:
        beam, end_name = ends.beam(e), ends.name(e)
        if e in kind:
            other_i, kname, _ = kind[e]
            out.append(_other(beam, end_name, kname, beams[other_i].guid, ends.points[e]))
        else:
            out.append(_other(beam, end_name, EndKind.FREE_END, None, ends.points[e]))
    return out


def _splice_order(ends: _Ends, k: int) -> tuple:
    """Which end of a splice holds its joint: its beam's midpoint, then its GlobalId."""
    b = ends.beam(k)
    mid = (np.asarray(b.start, dtype=float) + np.asarray(b.end, dtype=float)) / 2
    return (*np.round(mid).tolist(), b.guid, ends.name(k))


def _beam_web_hits(
    ends: _Ends, unresolved: list[int], n_columns: int, st: FinderSettings
) -> list[dict]:
    """Beam ends framing square into another beam's web: beam-to-beam joints (raw records).

    Tested in each candidate beam's frame (candidates from an STRtree of plan boxes, all
    pairs at once): the end's beam runs square to the other beam (within ``max_slope_deg``)
    and level with it, its end lies within the other's depth and length, beside its web with
    a gap no larger than the reach of a plate. The nearest web wins. The end stays in
    ``unresolved`` too: it is also a ``beam_to_beam`` other end, linked to its joint.
    ``col_idx`` counts the beams after the columns (the finder's support frames).
    """
    if not unresolved:
        return []
    reach = st.tolerance + st.end_plate_allowance
    beams = ends.beams
    bf, ei, bi = _other_beams_near(ends, unresolved, reach)
    if not len(ei):
        return []
    loc = bf.local(bi, ends.points[ei])
    a = bf.local_dir(bi, ends.approach[ei])
    tilt = math.sin(math.radians(st.max_slope_deg))
    square = (np.abs(a[:, 2]) <= tilt) & (np.abs(a[:, 1]) <= tilt)
    side_u = np.where(a[:, 0] > 0, -1.0, 1.0)
    hb, hh, htw, length = bf.half_b[bi], bf.half_h[bi], bf.half_tw[bi], bf.length[bi]
    gap = (loc[:, 0] - side_u * htw) * side_u
    ok = (
        square
        & (np.abs(loc[:, 1]) <= hh + st.tolerance)
        & (loc[:, 2] >= -st.tolerance)
        & (loc[:, 2] <= length + st.tolerance)
        & (gap <= hb - htw + reach)
        & (gap >= -hb)
    )
    sel = np.flatnonzero(ok)
    if not len(sel):
        return []
    sel = sel[np.lexsort((np.abs(gap)[sel], ei[sel]))]
    pick = sel[np.r_[True, ei[sel][1:] != ei[sel][:-1]]]
    out = []
    for q in pick:
        k, b = int(ei[q]), int(bi[q])
        out.append(dict(
            k=k, beam=ends.beam(k), beam_end=ends.name(k), column=beams[b],
            col_idx=n_columns + b, axis=Axis.MINOR, side=float(side_u[q]),
            gap=float(gap[q]), point=ends.points[k] + ends.approach[k] * gap[q],
            support=Support.BEAM,
        ))
    return out


def _splice_joints(ends: _Ends, free: list[OtherBeamEnd], n_columns: int) -> list[dict]:
    """One joint for each splice: two collinear beam ends that found each other.

    The joint is the end whose beam's midpoint comes first by x, then y, then z (rounded to
    the millimetre; then by GlobalId): the same joint whatever the model's order, and when a
    re-export regenerates GlobalIds. Its "column" is the other beam
    (``col_idx`` counts the beams after the columns), its face point the midpoint of the two
    end points (the plates' contact plane when they are alike: the anatomy measures it).
    """
    k_of = {(ends.beam(k).guid, ends.name(k)): k for k in range(len(ends.points))}
    idx = {id(b): i for i, b in enumerate(ends.beams)}
    splice = {(o.beam, o.beam_end): o for o in free if o.kind == EndKind.SPLICE}
    out = []
    for (guid, end), o in splice.items():
        k = k_of[(guid, end)]
        mates = [m for m in splice.values() if m.beam == o.other and m.other == guid]
        if not mates:
            continue
        mate = min(mates, key=lambda m: float(np.linalg.norm(np.subtract(m.point, o.point))))
        km = k_of[(mate.beam, mate.beam_end)]
        if _splice_order(ends, km) < _splice_order(ends, k):
            continue  # the pair's joint is the other end's
        other = ends.beam(km)
        mid = (ends.points[k] + ends.points[km]) / 2
        gap = float(np.dot(mid - ends.points[k], ends.approach[k]))
        out.append(dict(
            k=k, beam=ends.beam(k), beam_end=ends.name(k), column=other,
            col_idx=n_columns + idx[id(other)], axis=Axis.MAJOR, side=1.0, gap=gap,
            point=mid, support=Support.SPLICE, other_end=ends.name(km),
        ))
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


def _facing(a: dict, b: dict, st: FinderSettings) -> bool:
    """Two beams on opposite faces of a primary beam's web meet it at the same place along it."""
    w = unit(np.subtract(a["column"].end, a["column"].start, dtype=float)[None, :])[0]
    along = abs(float(np.dot(np.subtract(a["point"], b["point"]), w)))
    return along <= st.tolerance + max(a["beam"].width, b["beam"].width) / 2


def _pair_double_sided(joints: list[dict], st: FinderSettings) -> dict[int, str]:
    """Pair joints of two beams meeting opposite faces of one column at the same level."""
    by_col: dict[tuple[int, str], list[dict]] = defaultdict(list)
    for j in joints:
        if j.get("support") != Support.SPLICE:  # a splice has no beam opposite
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
                if a.get("support") == Support.BEAM and not _facing(a, b, st):
                    continue
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
