"""Joint anatomy: sections, grades, plate and bolt geometry, archetype, detailing findings.

Works on a :class:`~ifcjoint.engine.results.ScanResult` (no IFC). Every joint gets the way a
person looking at the model would read it, and every detailing finding carries a code, a
severity, its basis (clause or "common practice"), the measured value, the limit and the
GlobalIds involved. Anything that cannot be read is said, with the reason.

Joint frame: ``t`` along the beam into the column, ``n`` up the beam's depth, ``lat`` across.
Vertical positions are measured down from the top face of the beam's top flange (negative =
above it), lateral positions from the beam's web centreline.
"""

from __future__ import annotations

from dataclasses import dataclass, replace

import numpy as np

from ifcjoint.ec3 import detailing as dt
from ifcjoint.engine.materials import parse_bolt, parse_steel_grade
from ifcjoint.engine.model import Fastener, Member, ModelContents, Plate
from ifcjoint.engine.results import Joint
from ifcjoint.engine.sections import (
    ISection,
    dimension_mismatch,
    find_designation,
    section_from_designation,
)


@dataclass(frozen=True, slots=True, kw_only=True)
class AnatomySettings:
    """User choices for what the model does not say.

    Attributes:
        assume_steel_grade: grade used where a member or plate has none (e.g. ``S355``); every
            use is reported as an assumption. None: a missing grade stays missing.
        assume_bolt_class: bolt property class used where none is found (e.g. ``8.8``).
    """

    assume_steel_grade: str | None = None
    assume_bolt_class: str | None = None


ROW_TOLERANCE = 10.0  # mm: bolts closer than this in height form one row (common practice)
TOUCH_TOLERANCE = 5.0  # mm: a plate this close to the column face touches it


@dataclass(frozen=True, slots=True, kw_only=True)
class Finding:
    """One detailing finding.

    Attributes:
        code: stable identifier (e.g. ``edge_distance_min``).
        severity: ``error`` (a shop could not make it or a checker would reject it),
            ``warning`` (doubtful, look at it) or ``info``.
        basis: the clause or rule it follows.
        measured: the value found (mm unless said), or None.
        limit: the limit it was compared with, or None.
        message: one sentence a person can read.
        elements: GlobalIds involved.
    """

    code: str
    severity: str
    basis: str
    measured: float | None
    limit: float | None
    message: str
    elements: tuple[str, ...] = ()

    def as_dict(self) -> dict:
        """JSON-ready form."""
        return {
            "code": self.code,
            "severity": self.severity,
            "basis": self.basis,
            "measured": None if self.measured is None else round(self.measured, 2),
            "limit": None if self.limit is None else round(self.limit, 2),
            "message": self.message,
            "elements": list(self.elements),
        }


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
    role: str
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


@dataclass(frozen=True, slots=True, kw_only=True)
class JointAnatomy:
    """What a joint is made of, as read from the model."""

    joint_id: str
    archetype: str
    archetype_reason: str
    beam_section: ISection | None
    column_section: ISection | None
    beam_grade: str | None
    column_grade: str | None
    plate: PlateReading | None
    bolts: BoltReading | None
    stiffeners: tuple[str, ...] = ()
    web_plates: tuple[str, ...] = ()
    stiffener_depths: tuple[float, ...] = ()  # centre of each transverse stiffener below beam top
    findings: tuple[Finding, ...] = ()
    unread: tuple[str, ...] = ()
    assumed: tuple[str, ...] = ()

    def as_dict(self) -> dict:
        """JSON-ready form (mm, MPa)."""

        def sec(s: ISection | None):
            if s is None:
                return None
            return {
                "name": s.name,
                "source": s.source,
                "h": s.h,
                "b": s.b,
                "tw": s.tw,
                "tf": s.tf,
                "r": s.r,
            }

        p = self.plate
        b = self.bolts
        return {
            "archetype": self.archetype,
            "archetype_reason": self.archetype_reason,
            "beam_section": sec(self.beam_section),
            "column_section": sec(self.column_section),
            "beam_grade": self.beam_grade,
            "column_grade": self.column_grade,
            "plate": None
            if p is None
            else {
                "guid": p.guid,
                "role": p.role,
                "tp": round(p.tp, 2),
                "bp": round(p.bp, 2),
                "hp": round(p.hp, 2),
                "projection_top": round(p.projection_top, 2),
                "projection_bottom": (
                    round(p.projection_bottom(self.beam_section.h), 2)
                    if self.beam_section
                    else None
                ),
                "gap_to_column": round(p.gap_to_column, 2),
                "hole_d": p.hole_d,
                "grade": p.grade,
            },
            "bolts": None
            if b is None
            else {
                "d": b.d,
                "d_source": b.d_source,
                "class": b.bolt_class,
                "length": b.length,
                "d0": b.d0,
                "d0_source": b.d0_source,
                "gauge": _r(b.gauge),
                "pitches": [round(x, 2) for x in b.pitches],
                "rows_from_beam_top": [round(r.from_beam_top, 2) for r in b.rows],
                "tstub": b.tstub,
                "rows": [
                    {
                        "index": r.index,
                        "from_beam_top": round(r.from_beam_top, 2),
                        "lateral": [round(x, 2) for x in r.lateral],
                        "bolts": list(r.bolts),
                    }
                    for r in b.rows
                ],
            },
            "stiffeners": list(self.stiffeners),
            "stiffener_depths_mm": [round(float(x), 1) for x in self.stiffener_depths],
            "web_plates": list(self.web_plates),
            "unread": list(self.unread),
            "assumed": list(self.assumed),
        }


def _r(x: float | None) -> float | None:
    return None if x is None else round(x, 2)


@dataclass(slots=True)
class _Frame:
    t: np.ndarray
    n: np.ndarray
    lat: np.ndarray
    beam_top: np.ndarray  # a point on the top face of the beam, on its web plane, at the end
    face: np.ndarray  # point on the column face
    column_axis_point: np.ndarray  # a point of the column's centreline


def _unit(v) -> np.ndarray:
    v = np.asarray(v, dtype=float)
    n = np.linalg.norm(v)
    return v / n if n else v


def joint_frame(j: Joint, beam: Member, column: Member) -> _Frame:
    """The joint's own frame from the beam and the face point."""
    s, e = np.array(beam.start), np.array(beam.end)
    t = _unit(e - s) if j.beam_end == "end" else _unit(s - e)
    n = np.array(beam.depth_dir, dtype=float)
    n = _unit(n - n.dot(t) * t)
    if n[2] < 0:
        n = -n
    lat = np.cross(t, n)
    face = np.array(j.point, dtype=float)
    return _Frame(
        t=t,
        n=n,
        lat=lat,
        beam_top=face + n * beam.depth / 2,
        face=face,
        column_axis_point=np.array(column.start, dtype=float),
    )


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
                Finding(
                    code="section_mismatch",
                    severity="warning",
                    basis="model dimensions vs catalogue (EN 10365 / BS 4-1), common practice "
                    "tolerance max(1 mm, 2 %)",
                    measured=diff[worst][0],
                    limit=diff[worst][1],
                    message=f"{who} is named {named.name} but its {worst} is "
                    f"{diff[worst][0]:.1f} mm "
                    f"(catalogue {diff[worst][1]:.1f} mm)",
                    elements=(m.guid,),
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
    """Steel grade name (``S355``) from material and texts, or None."""
    g = parse_steel_grade(material, *texts)
    return g.grade if g else None


def analyse(
    result_joints: tuple[Joint, ...],
    model: ModelContents,
    settings: AnatomySettings | None = None,
) -> tuple[JointAnatomy, ...]:
    """Anatomy and detailing findings of every joint."""
    members = {m.guid: m for m in model.members}
    plates = {p.guid: p for p in model.plates}
    fasteners = {f.guid: f for f in model.fasteners}
    st = settings or AnatomySettings()
    return tuple(analyse_joint(j, members, plates, fasteners, st) for j in result_joints)


def analyse_joint(
    j: Joint,
    members: dict[str, Member],
    plates: dict[str, Plate],
    fasteners: dict[str, Fastener],
    settings: AnatomySettings | None = None,
) -> JointAnatomy:
    """Anatomy of one joint; never raises for bad data (it goes into ``unread``)."""
    st = settings or AnatomySettings()
    findings: list[Finding] = []
    unread: list[str] = []
    assumed: list[str] = []
    beam, col = members[j.beam], members[j.column]
    fr = joint_frame(j, beam, col)
    bsec = section_of(beam, findings, unread, "beam")
    csec = section_of(col, findings, unread, "column")
    bgrade = grade_of(beam.material, beam.texts)
    cgrade = grade_of(col.material, col.texts)
    for who, g, m in (("beam", bgrade, beam), ("column", cgrade, col)):
        if g is None and st.assume_steel_grade:
            assumed.append(f"{who} grade {st.assume_steel_grade} (user setting; none in model)")
            if who == "beam":
                bgrade = st.assume_steel_grade
            else:
                cgrade = st.assume_steel_grade
        elif g is None:
            findings.append(
                Finding(
                    code="grade_missing",
                    severity="warning",
                    basis="EN 1993-1-1 3.2 needs fy, fu",
                    measured=None,
                    limit=None,
                    message=f"{who} steel grade not found (material '{m.material or 'none'}'); "
                    "it will not be checked with a guessed grade",
                    elements=(m.guid,),
                )
            )
    roles = {p.guid: p.role for p in j.plates}
    main_role = (
        "end_plate"
        if "end_plate" in roles.values()
        else ("fin_plate" if "fin_plate" in roles.values() else None)
    )
    stiff, web_plates, depths = [], [], []
    for g, role in roles.items():
        if role == "column_plate":
            p = plates[g]
            if abs(np.dot(p.normal, _unit(np.subtract(col.end, col.start)))) > 0.9:
                stiff.append(g)
                depths.append(float((fr.beam_top - np.asarray(p.center)).dot(fr.n)))
            else:
                web_plates.append(g)
    main = None
    if main_role:
        cands = [plates[g] for g, r in roles.items() if r == main_role]
        main = max(cands, key=lambda p: p.half_u * p.half_v)
    bolt_list = [fasteners[b.guid] for b in j.bolts if b.role == "bolt"]
    plate_r = _read_plate(main, main_role, fr, beam, col, j) if main is not None else None
    bolt_r = _read_bolts(bolt_list, fr, main, findings, unread, st, assumed) if bolt_list else None
    if bolt_r is not None and plate_r is not None and main_role == "end_plate":
        bolt_r = replace(bolt_r, tstub=tstub_geometry(plate_r, bolt_r, csec))
    archetype, why = _archetype(j, plate_r, bolt_r, bsec, main_role)
    odd = _unsupported_parts(j, fr, plates, col, bsec)
    if j.haunch_members:
        odd.append(f"haunch below the beam ({len(j.haunch_members)} member(s))")
    if odd:
        archetype, why = (
            "unsupported",
            "; ".join(odd) + f" (not handled yet; the joint is otherwise read as {archetype})",
        )
    if plate_r is not None and bolt_r is not None and main is not None:
        _detailing(j, fr, main, plate_r, bolt_r, bolt_list, bsec, csec, findings)
    _completeness(j, plate_r, bolt_r, main_role, findings)
    return JointAnatomy(
        joint_id=j.id,
        archetype=archetype,
        archetype_reason=why,
        beam_section=bsec,
        column_section=csec,
        beam_grade=bgrade,
        column_grade=cgrade,
        plate=plate_r,
        bolts=bolt_r,
        stiffeners=tuple(sorted(stiff)),
        web_plates=tuple(sorted(web_plates)),
        stiffener_depths=tuple(sorted(depths)),
        findings=tuple(findings),
        unread=tuple(unread),
        assumed=tuple(assumed),
    )


def tstub_geometry(p: PlateReading, b: BoltReading, csec: ISection | None) -> dict:
    """Geometric distances of the T-stubs (mm), in the notation of EN 1993-1-8.

    EN 1993-1-8:2005, 6.2.6.4 Figure 6.8 (column flange: m = w/2 - tw/2 - 0.8 r,
    e = (b - w)/2) and 6.2.6.5 Figure 6.10 (end plate: e = (bp - w)/2; extension: ex from
    the top row to the plate's top edge, and the row's distance to the top face of the beam
    flange, from which the check engine deducts 0.8 x the weld's leg to get mx). The weld
    deductions need weld sizes, which models rarely carry: they are left to the check.
    """
    w = b.gauge
    out: dict = {"w": _r(w)}
    if w is None:
        return out
    if csec is not None:
        out["m_column"] = _r(w / 2 - csec.tw / 2 - 0.8 * csec.r)
        out["e_column"] = _r((csec.b - w) / 2)
    out["e_plate"] = _r((p.bp - w) / 2)
    top = b.rows[0]
    if top.from_beam_top < 0:
        out["ex"] = _r(top.from_beam_top - p.top_from_beam_top)
        out["row1_above_flange"] = _r(-top.from_beam_top)
    return out


def _plate_extent(p: Plate, axis: np.ndarray) -> float:
    """Half extent of the plate's box along a direction."""
    u, v, w = np.array(p.u_dir), np.array(p.v_dir), np.array(p.normal)
    return (
        abs(u.dot(axis)) * p.half_u
        + abs(v.dot(axis)) * p.half_v
        + abs(w.dot(axis)) * p.thickness / 2
    )


def _read_plate(
    p: Plate, role: str, fr: _Frame, beam: Member, col: Member, j: Joint
) -> PlateReading:
    c = np.array(p.center)
    hz = _plate_extent(p, fr.n)
    hl = _plate_extent(p, fr.lat)
    ht = _plate_extent(p, fr.t)
    zc = float((fr.beam_top - c).dot(fr.n))  # plate centre below beam top
    gap = float((fr.face - c).dot(fr.t)) - ht  # column face minus plate's column-side face
    holes = [h[1] for h in p.holes]
    grade = grade_of(p.material, p.texts)
    return PlateReading(
        guid=p.guid,
        role=role,
        tp=p.thickness,
        bp=2 * hl,
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


def _bolt_size(fs: list[Fastener]) -> tuple[float | None, str, str | None, float | None]:
    """Diameter (and where it came from), class and length of a group of bolts."""
    ds, cls, lens, src = [], None, [], ""
    for f in fs:
        spec = parse_bolt(*f.texts)
        if f.nominal_diameter:
            ds.append(f.nominal_diameter)
            src = src or "model attribute or property"
        elif spec.d:
            ds.append(spec.d)
            src = src or "name"
        elif f.diameter:
            ds.append(round(f.diameter))
            src = src or "body radius"
        cls = cls or spec.bolt_class
        lens.append(f.nominal_length or spec.length or f.length)
    d = float(np.median(ds)) if ds else None
    length = float(np.median(lens)) if lens else None
    return d, src or "not found", cls, length


def _read_bolts(
    fs: list[Fastener],
    fr: _Frame,
    plate: Plate | None,
    findings: list[Finding],
    unread: list[str],
    st: AnatomySettings | None = None,
    assumed: list[str] | None = None,
) -> BoltReading:
    d, d_src, cls, length = _bolt_size(fs)
    if cls is None and st is not None and st.assume_bolt_class:
        cls = st.assume_bolt_class
        if assumed is not None:
            assumed.append(f"bolt class {cls} (user setting; none in model)")
    elif cls is None:
        findings.append(
            Finding(
                code="bolt_class_missing",
                severity="warning",
                basis="EN 1993-1-8 Table 3.1 needs the property class",
                measured=None,
                limit=None,
                message="bolt property class (4.6 ... 10.9) not found in names or properties",
                elements=tuple(f.guid for f in fs),
            )
        )
    # Bolt positions where their axes cross the plate (or their centres).
    pts = []
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
            pts.append((z, y, f"{f.guid}[{k}]" if f.shanks else f.guid, x))
    pts.sort()
    rows: list[list[tuple[float, float, str, float]]] = []
    for z, y, g, x in pts:
        if rows and abs(z - rows[-1][0][0]) <= ROW_TOLERANCE:
            rows[-1].append((z, y, g, x))
        else:
            rows.append([(z, y, g, x)])
    brows = []
    for i, r in enumerate(rows, start=1):
        r.sort(key=lambda q: (q[1], q[3]))
        brows.append(
            BoltRow(
                index=i,
                from_beam_top=float(np.mean([q[0] for q in r])),
                lateral=tuple(q[1] for q in r),
                bolts=tuple(q[2] for q in r),
                along=tuple(q[3] for q in r),
            )
        )
    gauges = [r.lateral[-1] - r.lateral[0] for r in brows if len(r.lateral) == 2]
    gauge = float(np.median(gauges)) if gauges else None
    pitches = tuple(
        b.from_beam_top - a.from_beam_top for a, b in zip(brows, brows[1:], strict=False)
    )
    if plate is not None and plate.holes:
        d0, d0_src = float(np.median([h[1] for h in plate.holes])), "model (plate holes)"
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
    )


def _unsupported_parts(
    j: Joint, fr: _Frame, plates: dict[str, Plate], col: Member, bsec: ISection | None
) -> list[str]:
    """Parts that make the joint a kind ifcjoint does not handle yet, in words.

    A haunch (plates below the beam's bottom flange, not part of the end plate) and column
    plates that are neither transverse stiffeners nor web plates (e.g. diagonal stiffeners).
    """
    out = []
    h = bsec.h if bsec else None
    col_axis = _unit(np.subtract(col.end, col.start))
    haunch, diagonal = [], []
    for link in j.plates:
        p = plates[link.guid]
        nrm = np.array(p.normal)
        if link.role == "other_plate" and h is not None:
            c = np.array(p.center)
            below = float((fr.beam_top - c).dot(fr.n)) - h
            if below > 0:
                haunch.append(p.guid)
        if link.role in ("other_plate", "column_plate"):
            a_col = abs(float(nrm.dot(col_axis)))
            if 0.2 < a_col < 0.9:
                diagonal.append(p.guid)
    if haunch:
        out.append(f"haunch below the beam ({len(haunch)} plate(s))")
    if diagonal:
        out.append(f"inclined column stiffener ({len(diagonal)} plate(s))")
    return out


def _archetype(
    j: Joint, p: PlateReading | None, b: BoltReading | None, bsec: ISection | None, role: str | None
) -> tuple[str, str]:
    """Joint archetype (names are ours) and the reason, from the parts read."""
    h = bsec.h if bsec else None
    if role == "end_plate":
        if b is None:
            return "incomplete", "end plate at the beam end but no bolts"
        if p is not None and p.gap_to_column > TOUCH_TOLERANCE:
            return "incomplete", (f"end plate stands {p.gap_to_column:.0f} mm off the column face")
        if h is None:
            return "end_plate", "end plate with bolts; beam depth unknown, extent not judged"
        outside = [r for r in b.rows if r.from_beam_top < 0 or r.from_beam_top > h]
        if outside:
            where = sorted({"above" if r.from_beam_top < 0 else "below" for r in outside})
            return "extended_end_plate", (
                f"{len(outside)} bolt row(s) {' and '.join(where)} the beam depth"
            )
        return "flush_end_plate", f"all {len(b.rows)} bolt row(s) within the beam depth"
    if role == "fin_plate":
        if b is None:
            return "incomplete", "fin plate but no bolts"
        return (
            "fin_plate",
            f"plate beside the beam web with {sum(len(r.bolts) for r in b.rows)} "
            "bolt(s): nominally pinned",
        )
    if b is not None:
        return "incomplete", f"{sum(len(r.bolts) for r in b.rows)} bolt(s) but no plate"
    if abs(j.gap) <= TOUCH_TOLERANCE:
        return "welded", f"beam end on the column face (gap {j.gap:.1f} mm), no plate or bolts"
    if j.gap > 0:
        return "incomplete", f"beam stops {j.gap:.0f} mm short of the column and nothing bridges"
    return "undetailed", (
        f"beam drawn {-j.gap:.0f} mm into the column, no plates or bolts: "
        "the connection is not modelled"
    )


def _completeness(
    j: Joint,
    p: PlateReading | None,
    b: BoltReading | None,
    role: str | None,
    findings: list[Finding],
) -> None:
    if role in ("end_plate", "fin_plate") and b is None:
        findings.append(
            Finding(
                code="plate_without_bolts",
                severity="error",
                basis="joint incomplete",
                measured=None,
                limit=None,
                message=f"{role.replace('_', ' ')} has no bolts",
                elements=tuple(x.guid for x in j.plates),
            )
        )
    if role is None and b is not None:
        findings.append(
            Finding(
                code="bolts_without_plate",
                severity="error",
                basis="joint incomplete",
                measured=None,
                limit=None,
                message="bolts at the joint but no plate",
                elements=tuple(x.guid for x in j.bolts),
            )
        )
    if p is not None and role == "end_plate" and p.gap_to_column > TOUCH_TOLERANCE:
        findings.append(
            Finding(
                code="gap_to_column",
                severity="error",
                basis="common practice: plate bears on the column "
                f"(tolerance {TOUCH_TOLERANCE} mm)",
                measured=p.gap_to_column,
                limit=TOUCH_TOLERANCE,
                message=f"end plate stands {p.gap_to_column:.0f} mm off the column face",
                elements=(p.guid, j.column),
            )
        )
    if p is not None and role == "end_plate" and p.gap_to_column < -TOUCH_TOLERANCE:
        findings.append(
            Finding(
                code="overlap_with_column",
                severity="error",
                basis=f"common practice: parts must not clash (tolerance {TOUCH_TOLERANCE} mm)",
                measured=-p.gap_to_column,
                limit=TOUCH_TOLERANCE,
                message=f"end plate runs {-p.gap_to_column:.0f} mm into the column",
                elements=(p.guid, j.column),
            )
        )


def _detailing(
    j: Joint,
    fr: _Frame,
    plate: Plate,
    p: PlateReading,
    b: BoltReading,
    fs: list[Fastener],
    bsec: ISection | None,
    csec: ISection | None,
    out: list[Finding],
) -> None:
    """Detailing rules for a bolted plate; each finding names its basis."""
    d0, d = b.d0, b.d
    if d0 is None:
        return
    ids = tuple(f.guid for f in fs)
    tp = p.tp
    vertical_load = p.role == "fin_plate"  # shear goes down the plate
    top, bot = p.top_from_beam_top, p.bottom_from_beam_top
    half_b = p.bp / 2
    emin = dt.e_min(d0)
    # end/edge distances on the plate
    e_top = b.rows[0].from_beam_top - top
    e_bot = bot - b.rows[-1].from_beam_top
    if p.role == "fin_plate":
        # edges across the load: the plate's ends along the beam
        xs = [x for r in b.rows for x in r.along]
        e_side = min(min(x - p.along_min, p.along_max - x) for x in xs)
    else:
        lats = [y - p.lateral_centre for r in b.rows for y in r.lateral]
        e_side = min(half_b - abs(y) for y in lats)
    for name, val in (("e_top", e_top), ("e_bottom", e_bot)):
        if val < emin - 0.5:
            out.append(
                Finding(
                    code="end_distance_min" if vertical_load else "edge_distance_min",
                    severity="error",
                    basis="EN 1993-1-8 Table 3.3: e >= 1.2 d0",
                    measured=val,
                    limit=emin,
                    message=f"bolt row {'1' if name == 'e_top' else len(b.rows)} is {val:.0f} mm "
                    f"from the plate's {'top' if name == 'e_top' else 'bottom'} edge "
                    f"(min {emin:.1f})",
                    elements=(p.guid, *ids),
                )
            )
    if e_side < d0 / 2:
        out.append(
            Finding(
                code="bolt_outside_outline",
                severity="error",
                basis="the hole must lie within the plate (3D position of the bolt axis)",
                measured=e_side,
                limit=d0 / 2,
                message=f"a bolt axis lies {e_side:.0f} mm from the plate's edge: the hole is "
                "not inside the plate",
                elements=(p.guid, *ids),
            )
        )
    elif e_side < emin - 0.5:
        out.append(
            Finding(
                code="edge_distance_min",
                severity="error",
                basis="EN 1993-1-8 Table 3.3: e >= 1.2 d0",
                measured=e_side,
                limit=emin,
                message=f"bolts are {e_side:.0f} mm from the plate's side edge (min {emin:.1f})",
                elements=(p.guid, *ids),
            )
        )
    # spacings
    for i, pitch in enumerate(b.pitches, start=1):
        if pitch < dt.p1_min(d0) - 0.5:
            out.append(
                Finding(
                    code="pitch_min",
                    severity="error",
                    basis="EN 1993-1-8 Table 3.3: p1 >= 2.2 d0",
                    measured=pitch,
                    limit=dt.p1_min(d0),
                    message=f"rows {i} and {i + 1} are {pitch:.0f} mm apart (min "
                    f"{dt.p1_min(d0):.1f})",
                    elements=ids,
                )
            )
        if pitch > dt.p_max(tp) + 0.5:
            out.append(
                Finding(
                    code="pitch_max",
                    severity="warning",
                    basis="EN 1993-1-8 Table 3.3: p <= min(14 t, 200 mm)",
                    measured=pitch,
                    limit=dt.p_max(tp),
                    message=f"rows {i} and {i + 1} are {pitch:.0f} mm apart (max "
                    f"{dt.p_max(tp):.0f})",
                    elements=ids,
                )
            )
    if b.gauge is not None and b.gauge < dt.p2_min(d0) - 0.5:
        out.append(
            Finding(
                code="spacing_min",
                severity="error",
                basis="EN 1993-1-8 Table 3.3: p2 >= 2.4 d0",
                measured=b.gauge,
                limit=dt.p2_min(d0),
                message=f"gauge {b.gauge:.0f} mm below the minimum {dt.p2_min(d0):.1f} mm",
                elements=ids,
            )
        )
    # hole clearance
    if d is not None and p.hole_d is not None:
        c = p.hole_d - d
        want = dt.normal_hole_clearance(d)
        if c < 0.5 or c > want + 0.5:
            out.append(
                Finding(
                    code="hole_clearance",
                    severity="warning",
                    basis="EN 1090-2 Table 11 normal round holes",
                    measured=c,
                    limit=want,
                    message=f"hole {p.hole_d:.1f} mm for an M{d:.0f} bolt: clearance {c:.1f} mm "
                    f"(normal {want:.0f} mm)",
                    elements=(p.guid,),
                )
            )
    # symmetry about the beam web
    for r in b.rows:
        ys = sorted(r.lateral)
        if len(ys) >= 2 and abs(ys[0] + ys[-1]) > 2.0:
            out.append(
                Finding(
                    code="bolt_pattern_asymmetric",
                    severity="warning",
                    basis="common practice: bolt rows symmetric about the beam web (2 mm)",
                    measured=abs(ys[0] + ys[-1]) / 2,
                    limit=1.0,
                    message=f"row {r.index} is off the web centreline by "
                    f"{abs(ys[0] + ys[-1]) / 2:.0f} mm",
                    elements=r.bolts,
                )
            )
            break
    if p.role != "end_plate":
        return
    # plate thickness plausibility
    if d is not None:
        lo, hi = dt.plate_thickness_plausible(tp, d)
        if not lo <= tp <= hi:
            out.append(
                Finding(
                    code="plate_thickness_implausible",
                    severity="info",
                    basis="common practice rule of thumb: 0.5 d <= tp <= 1.5 d",
                    measured=tp,
                    limit=lo if tp < lo else hi,
                    message=f"{tp:.0f} mm end plate with M{d:.0f} bolts",
                    elements=(p.guid,),
                )
            )
    if csec is None or j.axis != "major":
        return
    # column flange: width, edge distance, root radius, grip
    if p.bp > csec.b + 2.0:
        out.append(
            Finding(
                code="plate_wider_than_column_flange",
                severity="warning",
                basis="common practice: an end plate bolted to a flange is no wider than it (2 mm)",
                measured=p.bp,
                limit=csec.b,
                message=f"end plate {p.bp:.0f} mm wide on a {csec.b:.0f} mm column flange",
                elements=(p.guid, j.column),
            )
        )
    col_lat = _column_lateral_offset(j, fr)
    ys_col = [y + col_lat for r in b.rows for y in r.lateral]
    e_col = min(csec.b / 2 - abs(y) for y in ys_col)
    if e_col < d0 / 2:
        out.append(
            Finding(
                code="bolt_outside_outline",
                severity="error",
                basis="the hole must lie within the column flange (3D position of the bolt axis)",
                measured=e_col,
                limit=d0 / 2,
                message=f"a bolt axis lies {e_col:.0f} mm from the column flange tip: the hole "
                "is not inside the flange",
                elements=(j.column, *ids),
            )
        )
    elif e_col < emin - 0.5:
        out.append(
            Finding(
                code="column_edge_distance_min",
                severity="error",
                basis="EN 1993-1-8 Table 3.3 on the column flange: e >= 1.2 d0",
                measured=e_col,
                limit=emin,
                message=f"bolts are {e_col:.0f} mm from the column flange tip (min {emin:.1f})",
                elements=(j.column, *ids),
            )
        )
    if d is not None:
        clear = min(abs(y) for y in ys_col) - csec.tw / 2 - csec.r
        need = dt.washer_half_width(d)
        if clear < d0 / 2 - 0.5:
            out.append(
                Finding(
                    code="hole_on_root_radius",
                    severity="error",
                    basis="common practice: holes clear the column's root radius",
                    measured=clear,
                    limit=d0 / 2,
                    message=f"hole edge reaches the column root radius (bolt centre {clear:.0f} mm "
                    "from it)",
                    elements=(j.column, *ids),
                )
            )
        elif clear < need - 0.5:
            out.append(
                Finding(
                    code="no_spanner_room",
                    severity="warning",
                    basis="common practice: a washer (about 0.93 d across half) fits beside the "
                    "root radius",
                    measured=clear,
                    limit=need,
                    message=f"bolt centre {clear:.0f} mm from the root radius: no room for the "
                    "nut and washer",
                    elements=(j.column, *ids),
                )
            )
        grip = tp + csec.tf  # the plies; a gap is a finding of its own
        need_len = dt.required_bolt_length(grip, d)
        short = [f for f in fs if (f.nominal_length or f.length) < need_len - 0.5]
        if short:
            ln = min(f.nominal_length or f.length for f in short)
            out.append(
                Finding(
                    code="bolt_too_short",
                    severity="error",
                    basis="common practice: grip + 2 washers (4 mm) + nut 0.9 d "
                    "+ 0.15 d protrusion",
                    measured=ln,
                    limit=need_len,
                    message=f"{len(short)} bolt(s) {ln:.0f} mm long for a {grip:.0f} mm grip "
                    f"(need {need_len:.0f})",
                    elements=tuple(f.guid for f in short),
                )
            )


def _column_lateral_offset(j: Joint, fr: _Frame) -> float:
    """Lateral offset of the beam's centreline from the column's web plane (mm)."""
    return float((fr.face - fr.column_axis_point).dot(fr.lat))


def summary_counts(anatomy: tuple[JointAnatomy, ...]) -> tuple[dict, dict]:
    """Joints by archetype and findings by code."""
    arche: dict[str, int] = {}
    codes: dict[str, int] = {}
    for a in anatomy:
        arche[a.archetype] = arche.get(a.archetype, 0) + 1
        for f in a.findings:
            codes[f.code] = codes.get(f.code, 0) + 1
    return arche, codes
