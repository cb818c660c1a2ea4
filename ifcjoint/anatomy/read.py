"""Reading a joint as a person looking at the model would: sections, grades, plate, bolts.

Everything in the joint's frame (``frame``), in mm. What cannot be read goes into ``unread``
with the reason; what is wrong becomes a finding from the rule table (``rules``).
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from ifcjoint.anatomy.frame import JointFrame, unit
from ifcjoint.anatomy.rules import RULES
from ifcjoint.catalogue.materials import parse_bolt, parse_steel_grade
from ifcjoint.catalogue.sections import (
    ISection,
    dimension_mismatch,
    find_designation,
    section_from_designation,
)
from ifcjoint.catalogue.welds import parse_weld_size
from ifcjoint.ec3 import detailing as dt
from ifcjoint.model.codes import PartRole, UnsupportedPart
from ifcjoint.model.elements import Fastener, Member, Plate
from ifcjoint.model.joints import Finding, Joint

ROW_TOLERANCE = 10.0  # mm: bolts closer than this in height form one row (common practice)


@dataclass(frozen=True, slots=True, kw_only=True)
class BoltRow:
    """A horizontal row of bolts, numbered from the top."""

    index: int
    from_beam_top: float
    lateral: tuple[float, ...]
    bolts: tuple[str, ...]
    along: tuple[float, ...] = ()  # positions along the beam from the column face


@dataclass(frozen=True, slots=True, kw_only=True)
class PlateReading:
    """The joint's main plate in the joint frame (mm)."""

    guid: str
    role: PartRole
    tp: float
    bp: float
    hp: float
    top_from_beam_top: float
    bottom_from_beam_top: float
    lateral_centre: float
    along_min: float  # plate extent along the beam, from the column face (negative: beam side)
    along_max: float
    gap_to_column: float
    hole_d: float | None
    grade: str | None

    @property
    def projection_top(self) -> float:
        """Plate edge above the top face of the beam's top flange (negative: below it)."""
        return -self.top_from_beam_top

    def projection_bottom(self, beam_h: float) -> float:
        """Plate edge below the bottom face of the beam's bottom flange (negative: above)."""
        return self.bottom_from_beam_top - beam_h


@dataclass(frozen=True, slots=True, kw_only=True)
class BoltReading:
    """The joint's bolts: size, grade, rows, spacings (mm)."""

    d: float | None
    d_source: str
    bolt_class: str | None
    length: float | None
    d0: float | None
    d0_source: str
    rows: tuple[BoltRow, ...]
    gauge: float | None
    pitches: tuple[float, ...]
    tstub: dict | None = None  # T-stub geometry, see tstub_geometry()
    off_hole: tuple[tuple[str, float, float], ...] = ()  # (bolt, distance, hole d) missing


def section_of(m: Member, findings: list[Finding], unread: list[str], who: str) -> ISection | None:
    """The member's section: model dimensions, checked against the named catalogue section."""
    designation = find_designation(m.profile_name, *m.texts)
    named = section_from_designation(designation) if designation else None
    model = None
    if m.web_thickness and m.flange_thickness:
        model = ISection(
            h=m.depth,
            b=m.width,
            tw=m.web_thickness,
            tf=m.flange_thickness,
            r=m.root_radius or 0.0,
            name=designation or "",
            source="profile"
            if m.profile_type.startswith("IfcIShape")
            else ("mesh" if m.geometry_source == "mesh" else "outline"),
        )
    if model is not None and named is not None:
        diff = dimension_mismatch(model, named)
        if diff:
            worst = max(diff, key=lambda k: abs(diff[k][0] - diff[k][1]))
            findings.append(
                RULES["section_mismatch"].finding(
                    diff[worst][0], diff[worst][1], (m.guid,), who=who, named=named.name, dim=worst
                )
            )
        # keep the model's reading, with the catalogue's root radius when the model has none
        if model.r == 0 and named.r:
            model = ISection(
                h=model.h,
                b=model.b,
                tw=model.tw,
                tf=model.tf,
                r=named.r,
                name=named.name,
                source=model.source + "+catalogue r",
            )
        return model
    if named is not None:
        if m.geometry_source == "mesh" and (abs(m.depth - named.h) > 0.1 * named.h):
            unread.append(
                f"{who}: named {named.name} but the body measures "
                f"{m.depth:.0f} mm deep; catalogue section used"
            )
        return named
    if model is not None:
        return model
    unread.append(
        f"{who}: section not read (no parametric profile and no designation "
        f"found in {', '.join(m.texts[:3]) or 'its names'})"
    )
    return None


def grade_of(material: str, texts: tuple[str, ...]) -> str | None:
    """Steel designation (``S355J2+N``: grade and quality letters) from material and texts."""
    g = parse_steel_grade(material, *texts)
    if g is None:
        return None
    return f"{g.grade}{g.quality}" if g.en10025 else g.grade


def tstub_geometry(
    p: PlateReading, b: BoltReading, csec: ISection | None
) -> dict[str, float | None]:
    """Geometric distances of the T-stubs (mm), in the notation of EN 1993-1-8.

    EN 1993-1-8:2005, 6.2.6.4 Figure 6.8 (column flange: m = w/2 - tw/2 - 0.8 r,
    e = (b - w)/2) and 6.2.6.5 Figure 6.10 (end plate: e = (bp - w)/2; extension: ex from
    the top row to the plate's top edge, and the row's distance to the top face of the beam
    flange, from which the check engine deducts 0.8 x the weld's leg to get mx). The weld
    deductions need weld sizes, which models rarely carry: they are left to the check.
    """
    w = b.gauge
    out: dict[str, float | None] = {"w": w}
    if w is None:
        return out
    if csec is not None:
        out["m_column"] = w / 2 - csec.tw / 2 - 0.8 * csec.r
        out["e_column"] = (csec.b - w) / 2
    out["e_plate"] = (p.bp - w) / 2
    top = b.rows[0]
    if top.from_beam_top < 0:
        out["ex"] = top.from_beam_top - p.top_from_beam_top
        out["row1_above_flange"] = -top.from_beam_top
    return out


def _plate_extent(p: Plate, axis: np.ndarray) -> float:
    """Half extent of the plate's box along a direction."""
    u, v, w = np.array(p.u_dir), np.array(p.v_dir), np.array(p.normal)
    return (
        abs(u.dot(axis)) * p.half_u
        + abs(v.dot(axis)) * p.half_v
        + abs(w.dot(axis)) * p.thickness / 2
    )


def read_plate(p: Plate, role: PartRole, fr: JointFrame) -> PlateReading:
    """The joint's main plate in the joint frame."""
    c = np.array(p.center)
    hz = _plate_extent(p, fr.n)
    hl = _plate_extent(p, fr.lat)
    ht = _plate_extent(p, fr.t)
    zc = float((fr.beam_top - c).dot(fr.n))  # plate centre below beam top
    gap = float((fr.face - c).dot(fr.t)) - ht  # column face minus plate's column-side face
    holes = [h[1] for h in p.holes if h[1] > 0]
    grade = grade_of(p.material, p.texts)
    # a fin plate lies in the beam's vertical plane: its "width" is its length along the beam
    # (its extent across is its thickness)
    width = 2 * ht if role == PartRole.FIN_PLATE else 2 * hl
    return PlateReading(
        guid=p.guid,
        role=role,
        tp=p.thickness,
        bp=width,
        hp=2 * hz,
        top_from_beam_top=zc - hz,
        bottom_from_beam_top=zc + hz,
        lateral_centre=float((c - fr.face).dot(fr.lat)),
        along_min=float((c - fr.face).dot(fr.t)) - ht,
        along_max=float((c - fr.face).dot(fr.t)) + ht,
        gap_to_column=gap,
        hole_d=round(float(np.median(holes)), 2) if holes else None,
        grade=grade,
    )


def _positive(x: float | None) -> float | None:
    """A dimension if it is one (positive), else None (reported by ``unusable_values``)."""
    return x if x is not None and x > 0 else None


def unusable_values(
    j: Joint, plates: dict[str, Plate], fasteners: dict[str, Fastener], out: list[Finding]
) -> None:
    """Dimensions read that cannot be right, each a finding naming its entity (never used).

    Zero or negative bolt diameters and lengths, plate thicknesses and hole diameters.
    """
    rule = RULES["value_not_usable"]

    def bad(what: str, value: float | None, guid: str) -> None:
        if value is not None and value <= 0:
            out.append(rule.finding(value, 0.0, (guid,), what=what, entity=guid))

    for link in j.fasteners:
        f = fasteners.get(link.guid)
        if f is None or f.kind != "bolt":
            continue
        bad("bolt diameter", f.nominal_diameter, f.guid)
        bad("bolt length", f.nominal_length, f.guid)
        bad("hole diameter (property)", f.hole_diameter, f.guid)
        if f.nominal_length is None:
            bad("bolt length (body)", f.length, f.guid)
    for link in j.plates:
        p = plates.get(link.guid)
        if p is None:
            continue
        bad("plate thickness", p.thickness, p.guid)
        for _, d in p.holes:
            if d <= 0:
                bad("hole diameter (modelled)", d, p.guid)
                break


def bolt_size(fs: list[Fastener]) -> tuple[float | None, str, str | None, float | None]:
    """Diameter (and where it came from), class and length of a group of bolts.

    Zero or negative values are not used (``unusable_values`` reports them).
    """
    ds, cls, lens, src = [], None, [], ""
    for f in fs:
        spec = parse_bolt(*f.texts)
        if _positive(f.nominal_diameter):
            ds.append(f.nominal_diameter)
            src = src or "model attribute or property"
        elif spec.d:
            ds.append(spec.d)
            src = src or "name"
        elif _positive(f.diameter):
            ds.append(round(f.diameter))
            src = src or "body radius"
        cls = cls or spec.bolt_class
        length = _positive(f.nominal_length) or spec.length or _positive(f.length)
        if length is not None:
            lens.append(length)
    d = float(np.median(ds)) if ds else None
    length = float(np.median(lens)) if lens else None
    return d, src or "not found", cls, length


#: A bolt where it crosses the plate, in the joint frame: (depth below the beam top, lateral
#: offset, id, distance along the beam from the column face), mm.
BoltPoint = tuple[float, float, str, float]


def off_hole(c: np.ndarray, plate: Plate) -> tuple[float, float] | None:
    """Whether a bolt axis crossing the plate at c misses every modelled hole.

    Returns (distance to the nearest hole's centre, its diameter) when it passes through
    plate material, else None. Common practice, no source: the axis must lie within the
    hole's circle (a bolt in a clearance hole is off centre by at most the clearance).
    """
    if not plate.holes:
        return None
    centres, dias = _hole_arrays(plate)
    nrm = np.asarray(plate.normal, dtype=float)
    v = centres - c
    v -= np.outer(v @ nrm, nrm)  # in the plate's plane
    dist = np.sqrt((v * v).sum(axis=1))
    k = int(dist.argmin())
    return (float(dist[k]), float(dias[k])) if dist[k] > dias[k] / 2 else None


def _hole_arrays(plate: Plate) -> tuple[np.ndarray, np.ndarray]:
    """A plate's hole centres and diameters as arrays."""
    return (np.array([h[0] for h in plate.holes], dtype=float),
            np.array([h[1] for h in plate.holes], dtype=float))


def bolt_points(
    fs: list[Fastener], fr: JointFrame, plate: Plate | None,
    missed: list[tuple[str, float, float]] | None = None,
) -> list[BoltPoint]:
    """Where each bolt's axis crosses the plate (its centre without a plate), per shank.

    A bolt that misses every modelled hole of the plate is left out of the points (it would
    make a false row or pitch) and put in ``missed`` as (id, distance, hole diameter), unless
    every bolt misses (then the holes are what is off, and all are kept and listed).
    """
    pts, misses = [], []
    for f in fs:
        # a bolt group exported as one element counts once per shank
        centres = f.shanks or (f.center,)
        for k, cc in enumerate(centres, start=1):
            c = np.array(cc)
            if plate is not None:
                nrm = np.array(plate.normal)
                ax = np.array(f.axis)
                den = ax.dot(nrm)
                if abs(den) > 0.5:
                    c = c + ax * ((np.array(plate.center) - c).dot(nrm) / den)
            z = float((fr.beam_top - c).dot(fr.n))
            y = float((c - fr.face).dot(fr.lat))
            x = float((c - fr.face).dot(fr.t))
            name = f"{f.guid}[{k}]" if f.shanks else f.guid
            miss = off_hole(c, plate) if plate is not None else None
            (misses if miss else pts).append(((z, y, name, x), miss))
    if missed is not None:
        missed.extend((q[2], m[0], m[1]) for q, m in misses)
    if not pts:  # every bolt misses: keep them all (the holes, not the bolts, are off)
        return [q for q, _ in misses]
    return [q for q, _ in pts]


def bolt_rows(pts: list[BoltPoint]) -> list[BoltRow]:
    """Bolts closer than ``ROW_TOLERANCE`` in height form a row; rows numbered from the top."""
    rows: list[list[BoltPoint]] = []
    for q in sorted(pts):
        if rows and abs(q[0] - rows[-1][0][0]) <= ROW_TOLERANCE:
            rows[-1].append(q)
        else:
            rows.append([q])
    out = []
    for i, r in enumerate(rows, start=1):
        r.sort(key=lambda q: (q[1], q[3]))
        out.append(
            BoltRow(
                index=i,
                from_beam_top=float(np.mean([q[0] for q in r])),
                lateral=tuple(q[1] for q in r),
                bolts=tuple(q[2] for q in r),
                along=tuple(q[3] for q in r),
            )
        )
    return out


def read_bolts(
    fs: list[Fastener],
    fr: JointFrame,
    plate: Plate | None,
    findings: list[Finding],
    unread: list[str],
    assume_bolt_class: str | None = None,
    assumed: list[str] | None = None,
    role: PartRole | None = None,
) -> BoltReading:
    """Size, class, rows, gauge and pitches of the joint's bolts, where they cross the plate.

    The gauge is the spacing across the row: between the bolts either side of the web on an
    end plate, between the bolt lines along the beam on a fin plate (``role``).
    """
    d, d_src, cls, length = bolt_size(fs)
    if cls is None and assume_bolt_class:
        cls = assume_bolt_class
        if assumed is not None:
            assumed.append(f"bolt class {cls} (user setting; none in model)")
    elif cls is None:
        findings.append(RULES["bolt_class_missing"].finding(elements=tuple(f.guid for f in fs)))
    missed: list[tuple[str, float, float]] = []
    brows = bolt_rows(bolt_points(fs, fr, plate, missed))
    if role == PartRole.FIN_PLATE:  # bolt lines side by side along the beam
        gauges = [max(r.along) - min(r.along) for r in brows if len(r.along) == 2]
    else:
        gauges = [r.lateral[-1] - r.lateral[0] for r in brows if len(r.lateral) == 2]
    gauge = float(np.median(gauges)) if gauges else None
    pitches = tuple(
        b.from_beam_top - a.from_beam_top for a, b in zip(brows, brows[1:], strict=False)
    )
    modelled = [h[1] for h in plate.holes if h[1] > 0] if plate is not None else []
    hole_props = [f.hole_diameter for f in fs if _positive(f.hole_diameter)]
    if modelled:
        d0, d0_src = float(np.median(modelled)), "model (plate holes)"
    elif hole_props:
        d0, d0_src = float(np.median(hole_props)), "model (hole diameter property)"
    elif d is not None:
        d0, d0_src = d + dt.normal_hole_clearance(d), "EN 1090-2 normal clearance (assumed)"
    else:
        d0, d0_src = None, "not found"
    if d is None:
        unread.append("bolt diameter not found (no attribute, property, name or body)")
    return BoltReading(
        d=d,
        d_source=d_src,
        bolt_class=cls,
        length=length,
        d0=d0,
        d0_source=d0_src,
        rows=tuple(brows),
        gauge=gauge,
        pitches=pitches,
        off_hole=tuple(missed),
    )


@dataclass(frozen=True, slots=True, kw_only=True)
class WeldReading:
    """A weld modelled as an element (mm).

    Attributes:
        guid: the weld element.
        location: where it joins the beam: ``top_flange``, ``bottom_flange`` or ``web``.
        throat: its throat a, or None when no size was found.
        source: where the size was read (a property, the name), or why none.
    """

    guid: str
    location: str
    throat: float | None
    source: str


def read_welds(
    j: Joint, fr: JointFrame, fasteners: dict[str, Fastener], bsec: ISection | None
) -> tuple[WeldReading, ...]:
    """The joint's welds: where each lies (by its direction and height) and its throat.

    A weld running up the beam's depth is a web weld; one running across is on the flange
    nearer to it (common practice, no source). Its throat: a size property, else the name
    (``catalogue.welds.parse_weld_size``).
    """
    out = []
    h = bsec.h if bsec is not None else None
    for link in j.fasteners:
        f = fasteners.get(link.guid)
        if f is None or link.role != PartRole.WELD:
            continue
        vertical = abs(float(np.dot(np.asarray(f.axis), fr.n))) > 0.7
        z = fr.depth_below_top(f.center)
        if vertical:
            location = "web"
        elif h is not None and z > h / 2:
            location = "bottom_flange"
        else:
            location = "top_flange"
        if f.weld_throat is not None:
            throat, source = f.weld_throat, "size property"
        else:
            throat, source = parse_weld_size(f.name, *f.texts)
            source = source or "no size in its properties or name"
        out.append(WeldReading(guid=f.guid, location=location, throat=throat, source=source))
    return tuple(out)


@dataclass(frozen=True, slots=True, kw_only=True)
class StiffenerReading:
    """Transverse column stiffeners at one level (one plate or a pair), in mm.

    Attributes:
        guids: the plates.
        level: depth of their mid-plane below the top face of the beam.
        t: thickness.
        b: width of one stiffener from the web face (the narrower of a pair).
        sides: 1 or 2 (a plate each side of the web, or one across it).
        grade: steel grade as read, or None.
    """

    guids: tuple[str, ...]
    level: float
    t: float
    b: float
    sides: int
    grade: str | None


@dataclass(frozen=True, slots=True, kw_only=True)
class WebPlateReading:
    """Supplementary plates on the column web, in mm.

    Attributes:
        guids: the plates.
        t: thickness.
        b: width across the web (along the column's depth).
        sides: plates on one side of the web or on both.
        grade: steel grade as read, or None.
    """

    guids: tuple[str, ...]
    t: float
    b: float
    sides: int
    grade: str | None


def _extent(p: Plate, axis: np.ndarray) -> float:
    """Half extent of a plate's box along a direction (in its plane)."""
    u, v = abs(float(np.dot(p.u_dir, axis))), abs(float(np.dot(p.v_dir, axis)))
    return u * p.half_u + v * p.half_v


def column_plates(
    j: Joint, fr: JointFrame, plates: dict[str, Plate], col: Member
) -> tuple[tuple[StiffenerReading, ...], tuple[WebPlateReading, ...]]:
    """Transverse stiffeners (grouped by level) and supplementary web plates of the column."""
    axis = unit(np.subtract(col.end, col.start))
    width_dir = unit(col.width_dir)
    web_t = col.web_thickness or 0.0
    origin = np.asarray(col.start, dtype=float)
    stiff: list[tuple[float, Plate, float, float]] = []
    webs: list[Plate] = []
    for link in j.plates:
        if link.role != PartRole.COLUMN_PLATE:
            continue
        p = plates[link.guid]
        if abs(np.dot(p.normal, axis)) > 0.9:
            offset = abs(float(np.dot(np.asarray(p.center) - origin, width_dir)))
            outer = offset + _extent(p, width_dir)
            stiff.append((fr.depth_below_top(p.center), p, outer - web_t / 2, offset))
        else:
            webs.append(p)
    levels: list[list[tuple[float, Plate, float, float]]] = []
    for item in sorted(stiff, key=lambda x: x[0]):
        if levels and abs(item[0] - levels[-1][0][0]) <= 2.0:
            levels[-1].append(item)
        else:
            levels.append([item])
    readings = tuple(
        StiffenerReading(
            guids=tuple(sorted(x[1].guid for x in group)),
            level=float(np.mean([x[0] for x in group])),
            t=min(x[1].thickness for x in group),
            b=min(x[2] for x in group),
            sides=2 if len(group) >= 2 or group[0][3] < web_t / 2 else 1,
            grade=grade_of(group[0][1].material, group[0][1].texts),
        )
        for group in levels
    )
    web = ()
    if webs:
        depth_dir = unit(col.depth_dir)
        sides = {np.sign(round(float(np.dot(np.asarray(w.center) - origin, width_dir)), 1))
                 for w in webs}
        web = (WebPlateReading(
            guids=tuple(sorted(w.guid for w in webs)),
            t=min(w.thickness for w in webs),
            b=min(2 * _extent(w, depth_dir) for w in webs),
            sides=2 if len(sides) >= 2 else 1,
            grade=grade_of(webs[0].material, webs[0].texts),
        ),)
    return readings, web


@dataclass(frozen=True, slots=True)
class HaunchReading:
    """A haunch under the beam at the column, in mm (``read_haunch``).

    Attributes:
        guids: its plates or member.
        d: depth below the beam's underside at the column face, to the haunch's bottom.
        b, tf: its flange (the bottom one) at the column face; tw its web.
        angle_deg: the flange's slope to the beam flange.
        length: along the beam, from the column face.
        grade: its steel grade as read, or None.
        source: ``plates`` (a web and a flange plate) or ``member`` (a cut section).
    """

    guids: tuple[str, ...]
    d: float
    b: float
    tf: float
    tw: float
    angle_deg: float
    length: float
    grade: str | None
    source: str


def _haunch_plates(
    j: Joint, fr: JointFrame, plates: dict[str, Plate], h: float | None
) -> list[Plate]:
    """Plates of the joint below the beam's underside that are not its end plate."""
    if h is None:
        return []
    return [plates[lk.guid] for lk in j.plates if lk.role == PartRole.OTHER_PLATE
            and plates[lk.guid].shape == "flat"
            and fr.depth_below_top(plates[lk.guid].center) - h > 0]


def read_haunch(
    j: Joint, fr: JointFrame, plates: dict[str, Plate], members: dict[str, Member],
    bsec: ISection | None,
) -> HaunchReading | None:
    """The haunch under the beam, from its plates or its member (None: none, or not whole).

    A haunch that cannot be read whole stays an unsupported part. Plates: the one beside the
    beam's plane (normal across) is the web, the one facing down (normal within 45 degrees
    of vertical) the flange; the depth runs to the flange's lowest
    point, the length to the farthest plate end from the face. A member: a short beam right
    under this one (``Joint.haunch_members``), its section the haunch's.
    """
    if bsec is None:
        return None
    h = bsec.h
    hp = _haunch_plates(j, fr, plates, h)
    if hp and not j.haunch_members:
        webs = [p for p in hp if abs(np.dot(p.normal, fr.lat)) > 0.9]
        flanges = [p for p in hp if abs(np.dot(p.normal, fr.n)) > 0.7]
        if len(webs) != 1 or len(flanges) != 1 or len(hp) != 2:
            return None
        web, fl = webs[0], flanges[0]
        low = max(fr.depth_below_top(p.center) + _plate_extent(p, fr.n) for p in hp)
        reach = max(-float(np.dot(np.subtract(p.center, fr.face), fr.t))
                    + _plate_extent(p, fr.t) for p in hp)
        tilt = float(np.degrees(np.arccos(min(1.0, abs(float(np.dot(fl.normal, fr.n)))))))
        return HaunchReading(
            guids=tuple(sorted((web.guid, fl.guid))), d=low - h,
            b=2 * _plate_extent(fl, fr.lat), tf=fl.thickness, tw=web.thickness,
            angle_deg=tilt, length=reach,
            grade=grade_of(fl.material, fl.texts) or grade_of(web.material, web.texts),
            source="plates")
    if len(j.haunch_members) == 1 and not hp:
        m = members.get(j.haunch_members[0])
        if m is None or not m.flange_thickness:
            return None
        sec = section_of(m, [], [], "haunch")
        if sec is None:
            return None
        s, e = np.array(m.start, dtype=float), np.array(m.end, dtype=float)
        near = s if np.dot(s - fr.face, fr.t) > np.dot(e - fr.face, fr.t) else e
        low = fr.depth_below_top(near) + m.depth / 2
        axis = unit(e - s)
        tilt = float(np.degrees(np.arcsin(min(1.0, abs(float(np.dot(axis, fr.n)))))))
        return HaunchReading(
            guids=(m.guid,), d=low - h, b=sec.b, tf=sec.tf, tw=sec.tw, angle_deg=tilt,
            length=float(np.linalg.norm(e - s)), grade=grade_of(m.material, m.texts),
            source="member")
    return None


@dataclass(frozen=True, slots=True)
class CleatReading:
    """Double angle web cleats as read, in mm (``read_cleats``).

    Attributes:
        guids: the two angles; t their leg thickness; hp their length up the web.
        top_from_beam_top: the cleats' top end below the beam's top.
        rows: the web-side bolt rows below the beam's top; p1 the least pitch.
        z: from the support face to the web-side bolt line.
        e1: from the end rows to the cleats' ends (the least).
        e2_web: from the web-side line to the toes of the legs on the web.
        e2_sup: from the support-side bolts to the toes of the legs on the support.
        cross_centres: between the support-side bolt lines.
        e2_beam: from the web-side line to the beam end.
        r: the angles' root radius, if read; grade their steel.
        n_web, n_sup: web-side and support-side bolts; web_bolts, sup_bolts their GlobalIds.
    """

    guids: tuple[str, ...]
    t: float
    hp: float
    top_from_beam_top: float
    rows: tuple[float, ...]
    p1: float
    z: float
    e1: float
    e2_web: float
    e2_sup: float
    cross_centres: float
    e2_beam: float
    r: float | None
    grade: str | None
    n_web: int
    n_sup: int
    web_bolts: tuple[str, ...] = ()
    sup_bolts: tuple[str, ...] = ()


def read_cleats(
    j: Joint, fr: JointFrame, plates: dict[str, Plate], fasteners: dict[str, Fastener]
) -> CleatReading | None:
    """Two angles either side of the beam web, bolted to it and to the support, or None.

    Each angle (a part read from an L profile, with its legs) has one leg beside the web
    (its normal across the beam) and one on the support face (its normal along the beam),
    on opposite sides of the web. The bolts whose axis runs across the beam are the web
    side's (one line), those along the beam the support side's. Anything else: None.
    """
    angles = [plates[lk.guid] for lk in j.plates if len(plates[lk.guid].legs) == 2]
    if len(angles) != 2 or len(j.plates) != 2:
        return None
    web_legs, sup_legs = [], []
    for a in angles:
        legs = {abs(float(np.dot(g.normal, fr.lat))) > 0.9: g for g in a.legs}
        if True not in legs or False not in legs:
            return None
        w, s_ = legs[True], legs[False]
        if abs(float(np.dot(s_.normal, fr.t))) < 0.9:
            return None
        web_legs.append(w)
        sup_legs.append(s_)
    sides = [float(np.dot(np.subtract(w.center, fr.face), fr.lat)) for w in web_legs]
    if sides[0] * sides[1] >= 0:
        return None  # both on one side of the web
    bolts = [fasteners[f.guid] for f in j.fasteners if f.role == PartRole.BOLT]
    web_b = [b for b in bolts if abs(float(np.dot(b.axis, fr.lat))) > 0.9]
    sup_b = [b for b in bolts if abs(float(np.dot(b.axis, fr.t))) > 0.9]
    if not web_b or not sup_b or len(web_b) + len(sup_b) != len(bolts):
        return None
    along = [float(np.dot(np.subtract(b.center, fr.face), fr.t)) for b in web_b]
    if max(along) - min(along) > 5.0:
        return None  # one line only
    line = sum(along) / len(along)
    rows = sorted(fr.depth_below_top(b.center) for b in web_b)
    w0 = web_legs[0]
    half = w0.half_along
    top = fr.depth_below_top(w0.center) - half
    toe_web = min(float(np.dot(np.add(w.center, np.multiply(w.across, w.half_across))
                               - fr.face, fr.t)) for w in web_legs)
    sup_lat = [float(np.dot(np.subtract(b.center, fr.face), fr.lat)) for b in sup_b]
    e2_sup = []
    for g in sup_legs:
        toe = float(np.dot(np.add(g.center, np.multiply(g.across, g.half_across)) - fr.face,
                           fr.lat))
        mine = [y for y in sup_lat if y * toe > 0]
        if not mine:
            return None
        e2_sup.append(min(abs(toe - y) for y in mine))
    return CleatReading(
        guids=tuple(sorted(a.guid for a in angles)), t=min(g.thickness for g in web_legs),
        hp=2 * half, top_from_beam_top=top, rows=tuple(rows),
        p1=min((b - a for a, b in zip(rows, rows[1:], strict=False)), default=0.0),
        z=-line, e1=min(rows[0] - top, top + 2 * half - rows[-1]),
        e2_web=line - toe_web, e2_sup=min(e2_sup),
        cross_centres=max(sup_lat) - min(sup_lat), e2_beam=-line - j.gap,
        r=angles[0].root_radius, grade=grade_of(angles[0].material, angles[0].texts),
        n_web=len(web_b), n_sup=len(sup_b), web_bolts=tuple(b.guid for b in web_b),
        sup_bolts=tuple(b.guid for b in sup_b))


def unsupported_parts(
    j: Joint, fr: JointFrame, plates: dict[str, Plate], col: Member, bsec: ISection | None,
    haunch: HaunchReading | None = None, cleats_read: bool = False,
) -> tuple[tuple[UnsupportedPart, int], ...]:
    """Parts that make the joint a kind ifcjoint does not handle yet, with their counts.

    A haunch that could not be read whole (plates below the beam's bottom flange, not part of
    the end plate; ``haunch`` is the one read), column plates that are neither transverse
    stiffeners nor web plates (e.g. diagonal stiffeners), and short sections that are not
    plates (angle cleats, tees: ``Plate.shape``).
    """
    out: list[tuple[UnsupportedPart, int]] = []
    h = bsec.h if bsec else None
    col_axis = unit(np.subtract(col.end, col.start))
    haunch_plates, diagonal = [], []
    sections = [] if cleats_read else [
        lk.guid for lk in j.plates if plates[lk.guid].shape != "flat"]
    for link in j.plates:
        p = plates[link.guid]
        if p.shape != "flat":
            continue
        nrm = np.array(p.normal)
        if link.role == PartRole.OTHER_PLATE and h is not None:
            c = np.array(p.center)
            below = fr.depth_below_top(c) - h
            if below > 0:
                haunch_plates.append(p.guid)
        if link.role in (PartRole.OTHER_PLATE, PartRole.COLUMN_PLATE):
            a_col = abs(float(nrm.dot(col_axis)))
            if 0.2 < a_col < 0.9:
                diagonal.append(p.guid)
    read_whole = haunch is not None
    if haunch_plates and not read_whole:
        out.append((UnsupportedPart.HAUNCH_PLATES, len(haunch_plates)))
    if diagonal:
        out.append((UnsupportedPart.INCLINED_STIFFENER, len(diagonal)))
    if sections:
        out.append((UnsupportedPart.SECTION_PARTS, len(sections)))
    if j.haunch_members and not read_whole:
        out.append((UnsupportedPart.HAUNCH_MEMBERS, len(j.haunch_members)))
    return tuple(out)
