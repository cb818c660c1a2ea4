"""Plates and fasteners attached to joints: by relationship first, then by geometry.

Each joint has a zone around its beam end; a part is a candidate of the joints whose zone
holds it (found with a shapely ``STRtree`` of the zones' plan boxes), and goes to the one its
relationships name, else to the one on whose side of the column it lies, then the nearest.
"""

from __future__ import annotations

import hashlib
from collections import defaultdict
from dataclasses import dataclass, field

import numpy as np
import shapely

from ifcjoint.find.frames import Frames, unit
from ifcjoint.find.settings import FinderSettings
from ifcjoint.model.codes import FastenerKind, LinkSource, PartRole, Support
from ifcjoint.model.elements import Member, ModelContents, Plate
from ifcjoint.model.joints import PartLink

#: The role of a fastener in its joint, by its kind.
_FASTENER_ROLES = {FastenerKind.BOLT: PartRole.BOLT, FastenerKind.WELD: PartRole.WELD}


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
    col_point: np.ndarray  # a point on the column's axis
    col_half_web: float  # half the column web's thickness (the plane's neutral band)
    on_beam: bool = False  # the support is a beam (beam-to-beam joint, splice): no column plates


def _zones(joints: list[dict], st: FinderSettings) -> list[_Zone]:
    """One zone per joint, computed for all joints at once."""
    if not joints:
        return []
    s = np.array([j["beam"].start for j in joints], dtype=float)
    e = np.array([j["beam"].end for j in joints], dtype=float)
    at_end = np.array([j["beam_end"] == "end" for j in joints])
    t = unit(np.where(at_end[:, None], e - s, s - e))
    n = np.array([j["beam"].depth_dir for j in joints], dtype=float)
    n = unit(n - (n * t).sum(1, keepdims=True) * t)
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
                col_point=np.array(col.start, dtype=float),
                col_half_web=(col.web_thickness or 0.0) / 2,
                on_beam=j.get("support", Support.COLUMN) != Support.COLUMN,
            )
        )
    return zones


def _other_side(z: _Zone, p: np.ndarray) -> bool:
    """Whether a point lies beyond the column's mid-plane, on the side away from the beam.

    Common practice, no source: a part belongs with the beam on its own side of the column
    (of its web, for two beams on a web); a part within the web's thickness of the mid-plane
    (a bolt through both plates and the web) is on neither side.
    """
    return float((p - z.col_point).dot(z.t)) > z.col_half_web + 1.0


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


def _plate_role(z: _Zone, p: Plate, col_frames: Frames, ci: int, reach: float) -> PartRole:
    """What a plate near a joint is, from its orientation and position.

    Stiffener (normal along the column, inside its section) and web plate (parallel to the
    web, inside the section) are ``column_plate``; a plate square to the beam at its end is an
    ``end_plate``; a plate beside the beam web, within its depth, is a ``fin_plate``; anything
    else (a haunch below the beam, an inclined stiffener) is an ``other_plate``.
    """
    if p.shape != "flat":  # an angle cleat or other short section: never a plate role
        return PartRole.OTHER_PLATE
    nrm = np.array(p.normal)
    c = np.array(p.center)
    idx = np.array([ci])
    loc = col_frames.local(idx, c[None, :])[0]
    inside = (abs(loc[0]) < col_frames.half_b[ci] - 1) and (abs(loc[1]) < col_frames.half_h[ci] - 1)
    # a primary beam's web stiffener and a secondary's fin plate share a plane: on a beam,
    # a plate is the joint's own (no support plates are read there)
    inside = inside and not z.on_beam
    along_col = abs(nrm.dot(col_frames.w[ci])) > 0.9
    if inside and along_col:
        return PartRole.COLUMN_PLATE
    # At the beam's end, or at the column face when the beam is drawn into the column.
    at_end = min(abs((c - z.beam_end).dot(z.t)), abs((c - z.origin).dot(z.t))) <= (
        p.thickness / 2 + reach
    )
    if abs(nrm.dot(z.t)) > 0.9 and at_end:
        return PartRole.END_PLATE
    if inside and abs(nrm.dot(col_frames.u[ci])) > 0.9:
        return PartRole.COLUMN_PLATE
    below_beam = (c - z.origin).dot(z.n) < -(z.half_n - z.margin)
    if abs(nrm.dot(z.lat)) > 0.9 and not below_beam:
        return PartRole.FIN_PLATE
    return PartRole.OTHER_PLATE


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


#: Candidate joint of a part: (joint key, inside its zone, distance to its axis).
_Cand = tuple[int, bool, float]


class _Matcher:
    """The joints' zones in an STRtree, and the relationships of every part."""

    _ORDER = {LinkSource.REALIZING: 0, LinkSource.ASSEMBLY: 1, LinkSource.CONNECTS: 2}

    def __init__(self, model: ModelContents, joints: list[dict], st: FinderSettings) -> None:
        self.zones = _zones(joints, st)
        self.zone_by_k = {z.k: z for z in self.zones}
        # the zones as arrays, for the in-zone test of every candidate at once
        zs = self.zones
        self._o = np.array([z.origin for z in zs])
        self._t = np.array([z.t for z in zs])
        self._n = np.array([z.n for z in zs])
        self._lat = np.array([z.lat for z in zs])
        self._back = np.array([z.back for z in zs])
        self._front = np.array([z.front for z in zs])
        self._half_n = np.array([z.half_n for z in zs])
        self._half_l = np.array([z.half_l for z in zs])
        self._inner_n = np.array([z.half_n - z.margin for z in zs])
        self._reach = np.array([z.face_reach for z in zs])
        self._k = np.array([z.k for z in zs])
        self.joint_by_k = {j["k"]: j for j in joints}
        self.tree = shapely.STRtree(_zone_boxes(self.zones))
        self.by_member: dict[str, list[int]] = defaultdict(list)
        for j in joints:
            self.by_member[j["beam"].guid].append(j["k"])
            self.by_member[j["column"].guid].append(j["k"])
        self.links: dict[str, list[tuple[LinkSource, set[str]]]] = defaultdict(list)
        for lk in model.links:
            self.links[lk.part].append((lk.source, set(lk.members)))
        for v in self.links.values():
            v.sort(key=lambda x: self._ORDER.get(x[0], 9))

    def candidates_of(self, centers: np.ndarray) -> list[list[_Cand]]:
        """For each point, the joints whose zone holds it, with inside-ness and distance.

        Every point in one query.
        Inside: within the zone's extents along the beam, up its depth and across. Distance:
        to the beam's centreline segment, from ``back`` behind the beam end to the column
        face, ignoring height within the beam depth (a part beside the beam's web is closer
        to its own joint than to a joint around the corner). The plan query finds the zones
        of every storey above one another; the height test keeps the zones the point's height
        falls in (the others could only hold it by a relation, which names the joint itself).
        """
        out: list[list[_Cand]] = [[] for _ in range(len(centers))]
        if len(centers) == 0 or len(self.zones) == 0:
            return out
        pi, zi = self.tree.query(shapely.points(centers[:, 0], centers[:, 1]))
        if len(pi) == 0:
            return out
        d = centers[pi] - self._o[zi]
        b = np.einsum("ij,ij->i", d, self._n[zi])
        near = np.abs(b) <= self._half_n[zi]
        pi, zi, d, b = pi[near], zi[near], d[near], b[near]
        a = np.einsum("ij,ij->i", d, self._t[zi])
        c = np.einsum("ij,ij->i", d, self._lat[zi])
        inside = (a >= -self._back[zi]) & (a <= self._front[zi]) & (
            np.abs(c) <= self._half_l[zi])
        a_out = np.maximum(np.maximum(-self._back[zi] - a, 0.0), a - self._reach[zi])
        b_out = np.maximum(np.abs(b) - self._inner_n[zi], 0.0)
        dist = np.sqrt(a_out * a_out + b_out * b_out + c * c)
        order = np.lexsort((zi, pi))  # by point, then by zone (the order a point query gives)
        for p, k, ins, x in zip(pi[order].tolist(), self._k[zi[order]].tolist(),
                                inside[order].tolist(), dist[order].tolist(), strict=True):
            out[p].append((k, ins, x))
        return out

    def _names(self, k: int, members: set[str], both: bool) -> bool:
        j = self.joint_by_k[k]
        hits = (j["beam"].guid in members, j["column"].guid in members)
        return all(hits) if both else any(hits)

    def by_relation(self, guid: str, cands: list[_Cand]) -> tuple[list[int], LinkSource]:
        """Joints named by the part's relations, strongest relation first."""
        for source, members in self.links.get(guid, []):
            named_any = {k for m in members for k in self.by_member.get(m, ())}
            both = sorted(k for k in named_any if self._names(k, members, both=True))
            if both and source in (LinkSource.REALIZING, LinkSource.CONNECTS):
                return both, source
            near = {k for k, inside, _ in cands if inside}
            named = [k for k in near if self._names(k, members, both=False)]
            if named:
                return named, source
        return [], LinkSource.GEOMETRY


@dataclass
class AttachMemo:
    """Part attachments of an earlier run, for parts and members that have not changed.

    ``keys`` gives each element's content key (its read's, ``ifc.read_cache``): equal keys,
    equal element. Common practice, no source: an attachment is a function of its inputs, so
    it is taken from the earlier run only when every input is equal:

    * every member and the finder settings (so every joint and its zone is the same): else
      nothing is taken;
    * a plate: its own key (its geometry and relationships);
    * a fastener: its own key, and for every joint it was a candidate of, the same plates
      (by key, role and relation) attached there.

    ``offered`` is the earlier run's ``kept``; ``kept`` is filled for the next run.
    """

    keys: dict[str, str]
    offered: dict = field(default_factory=dict)
    kept: dict = field(default_factory=dict)
    reused: int = 0

    def signature(self, model: ModelContents, joints: list[dict], st: FinderSettings
                  ) -> str | None:
        """What every attachment depends on besides its part (None: an element has no key)."""
        members = [(m.guid, self.keys.get(m.guid)) for m in model.members]
        if any(k is None for _, k in members):
            return None
        text = repr((repr(st), members, [(j["k"], j["beam"].guid, j["column"].guid)
                                         for j in joints]))
        return hashlib.sha256(text.encode()).hexdigest()


def attach_parts(
    model: ModelContents, joints: list[dict], col_frames: Frames, st: FinderSettings,
    memo: AttachMemo | None = None,
) -> dict[int, tuple[tuple[PartLink, ...], tuple[PartLink, ...]]]:
    """Attach plates and fasteners to joints: relations first, then geometry.

    Order: IfcRelConnectsWithRealizingElements, IfcElementAssembly aggregation,
    IfcRelConnectsElements, then geometry (plate near the beam end and column face; bolt whose
    axis passes through an attached plate, or lying in the joint zone). With ``memo``, a
    part whose attachment's inputs are all the earlier run's keeps its earlier attachment
    (:class:`AttachMemo`).
    """
    if not joints:
        return {}
    mt = _Matcher(model, joints, st)
    sig = memo.signature(model, joints, st) if memo is not None else None
    earlier = memo.offered if memo is not None and sig is not None and \
        memo.offered.get("signature") == sig else {}
    keep = {"signature": sig, "plates": {}, "fasteners": {}, "joints": {}}
    keys = memo.keys if memo is not None else {}
    plates_of: dict[int, list[PartLink]] = defaultdict(list)
    old_plates = earlier.get("plates", {})
    todo = [p for p in model.plates if keys.get(p.guid) not in old_plates]
    plate_cands = dict(zip((p.guid for p in todo), mt.candidates_of(
        np.array([p.center for p in todo], dtype=float).reshape(-1, 3)), strict=True))
    for p in model.plates:
        key = keys.get(p.guid)
        if p.guid in plate_cands:
            got = tuple((k, link.role, link.source) for k, link in
                        _attach_plate(mt, p, col_frames, st, plate_cands[p.guid]))
        else:
            got = old_plates[key]
            memo.reused += 1
        if key is not None:
            keep["plates"][key] = got
        for k, role, source in got:
            plates_of[k].append(PartLink(guid=p.guid, source=source, role=role))
    # a joint whose plates are another run's: its fasteners are attached anew
    for k, links in plates_of.items():
        keep["joints"][k] = tuple(sorted((keys.get(pl.guid) or "", str(pl.role),
                                          str(pl.source)) for pl in links))
    old_joints = earlier.get("joints", {})
    same = {k for k, v in keep["joints"].items()
            if all(x[0] for x in v) and old_joints.get(k) == v}
    same |= {j["k"] for j in joints if j["k"] not in plates_of and j["k"] not in old_joints}
    plate_by_guid = {p.guid: p for p in model.plates}
    bolts_of: dict[int, list[PartLink]] = defaultdict(list)
    old_fasteners = earlier.get("fasteners", {})

    def reusable(f) -> bool:
        got = old_fasteners.get(keys.get(f.guid))
        return got is not None and all(k in same for k in got[0])

    todo = [f for f in model.fasteners if not reusable(f)]
    fastener_cands = dict(zip((f.guid for f in todo), mt.candidates_of(
        np.array([f.center for f in todo], dtype=float).reshape(-1, 3)), strict=True))
    for f in model.fasteners:
        key = keys.get(f.guid)
        if f.guid in fastener_cands:
            cands = fastener_cands[f.guid]
            hit = _attach_fastener(mt, f, plates_of, plate_by_guid, cands)
            got = (tuple(sorted({k for k, _, _ in cands})),
                   None if hit is None else (hit[0], hit[1].role, hit[1].source))
        else:
            got = old_fasteners[key]
            memo.reused += 1
        if key is not None:
            keep["fasteners"][key] = got
        if got[1] is not None:
            k, role, source = got[1]
            bolts_of[k].append(PartLink(guid=f.guid, source=source, role=role))
    if memo is not None and sig is not None:
        memo.kept = keep
    out = {}
    for j in joints:
        k = j["k"]
        out[k] = (
            tuple(sorted(plates_of.get(k, []), key=lambda x: x.guid)),
            tuple(sorted(bolts_of.get(k, []), key=lambda x: x.guid)),
        )
    return out


def _attach_plate(
    mt: _Matcher, p: Plate, col_frames: Frames, st: FinderSettings, cands: list[_Cand]
) -> list[tuple[int, PartLink]]:
    """The joints a plate belongs to (several for a plate inside a shared column section)."""
    ks, source = mt.by_relation(p.guid, cands)
    dist = {k: d for k, _, d in cands}
    if not ks:
        ks = [k for k, inside, _ in cands if inside]
    if not ks:
        return []
    reach = st.tolerance + st.end_plate_allowance
    roles = {
        k: _plate_role(mt.zone_by_k[k], p, col_frames, mt.joint_by_k[k]["col_idx"], reach)
        for k in ks
    }
    # A plate square to a beam at its end is that beam's end plate rather than a plate of the
    # column's, even inside the column section (a beam on the web: its plate lies where a web
    # plate would).
    if any(roles[k] == PartRole.END_PLATE for k in ks):
        ks = [k for k in ks if roles[k] != PartRole.COLUMN_PLATE]
    # A plate inside the column section (stiffener, web plate) serves every joint there.
    shared = [k for k in ks if roles[k] == PartRole.COLUMN_PLATE]
    c = np.array(p.center)
    chosen = shared if shared else [min(
        ks, key=lambda k: (_other_side(mt.zone_by_k[k], c), dist.get(k, 0.0)))]
    return [(k, PartLink(guid=p.guid, source=source, role=roles[k])) for k in chosen]


def _attach_fastener(
    mt: _Matcher, f, plates_of: dict[int, list[PartLink]], plate_by_guid: dict[str, Plate],
    cands: list[_Cand],
) -> tuple[int, PartLink] | None:
    """The joint a fastener belongs to: by relation, through an attached plate, or nearest."""
    c, ax = np.array(f.center), np.array(f.axis)
    ks, source = mt.by_relation(f.guid, cands)
    if not ks:
        through = {
            k
            for k, _inside, _ in cands
            for pl in plates_of.get(k, [])
            if pl.role != PartRole.COLUMN_PLATE
            and _bolt_through_plate(plate_by_guid[pl.guid], c, ax, f.length)
        }
        source = LinkSource.GEOMETRY
        ks = sorted(through) if through else [k for k, inside, _ in cands if inside]
    if not ks:
        return None
    dist = {k: d for k, _, d in cands}
    # the beam's own side of the column first (two beams on a web), then the nearest
    k = min(ks, key=lambda kk: (_other_side(mt.zone_by_k[kk], c), dist.get(kk, 0.0)))
    role = _FASTENER_ROLES.get(f.kind, PartRole.OTHER_FASTENER)
    return k, PartLink(guid=f.guid, source=source, role=role)
