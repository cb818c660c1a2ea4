"""Detailing checks of a bolted plate: each measures, then asks the rule table.

The order of the checks is the order of the findings in every output: completeness last.
"""

from __future__ import annotations

from dataclasses import dataclass

from ifcjoint.anatomy.frame import JointFrame
from ifcjoint.anatomy.read import BoltReading, PlateReading
from ifcjoint.anatomy.rules import RULES, TOUCH_TOLERANCE
from ifcjoint.catalogue.materials import parse_steel_grade, steel_strength
from ifcjoint.catalogue.plates import nearest_stock_thickness
from ifcjoint.catalogue.sections import ISection
from ifcjoint.ec3 import detailing as dt
from ifcjoint.ec3.components import BETA_W, full_strength_fillet_throat
from ifcjoint.ec3.pinned import ductile_fin_plate_ratio
from ifcjoint.model.codes import Axis, PartRole, Support
from ifcjoint.model.elements import Fastener
from ifcjoint.model.joints import Finding, Joint


@dataclass(slots=True)
class _Bolted:
    """A bolted plate being checked: its reading, its bolts and the findings so far."""

    j: Joint
    fr: JointFrame
    p: PlateReading
    b: BoltReading
    fs: list[Fastener]
    csec: ISection | None
    out: list[Finding]

    @property
    def ids(self) -> tuple[str, ...]:
        return tuple(f.guid for f in self.fs)

    def check(self, rule: str, measured: float, limit: float, elements, **detail) -> bool:
        """Add the rule's finding when the value breaks it; True when it did."""
        r = RULES[rule]
        if r.broken(measured, limit):
            self.out.append(r.finding(measured, limit, tuple(elements), **detail))
            return True
        return False


def detailing(
    j: Joint,
    fr: JointFrame,
    p: PlateReading,
    b: BoltReading,
    fs: list[Fastener],
    csec: ISection | None,
    out: list[Finding],
    other: PlateReading | None = None,
) -> None:
    """Detailing rules for a bolted plate (end or fin plate); each finding names its basis.

    ``other``: a splice's second end plate (the bolts' grip runs through both plates).
    """
    if b.d0 is None:
        return
    c = _Bolted(j=j, fr=fr, p=p, b=b, fs=fs, csec=csec, out=out)
    _off_hole(c)
    _plate_edges(c)
    _spacings(c)
    _hole_clearance(c)
    _stock_thickness(c)
    if p.role == PartRole.FIN_PLATE and b.d:
        c.check("fin_plate_ductility", p.tp, ductile_fin_plate_ratio(p.grade or "") * b.d,
                (p.guid,), d=b.d)
    if p.role != PartRole.END_PLATE:
        return
    _symmetry(c)  # about the beam web: an end plate's rows
    _plate_thickness(c)
    if other is not None:
        _bolt_length(c, p.tp + other.tp)
    if csec is None:
        return
    if j.axis != Axis.MAJOR:  # on a web: the plies are the plate and the web
        _bolt_length(c, p.tp + csec.tw)
    elif j.support == Support.COLUMN:
        _column_flange(c, csec)


def _off_hole(c: _Bolted) -> None:
    """Bolts that pass through plate material instead of a modelled hole (left out of rows)."""
    if not c.b.off_hole:
        return
    worst = max(c.b.off_hole, key=lambda m: m[1])
    bolts = tuple(m[0] for m in c.b.off_hole)
    c.out.append(RULES["bolt_off_hole"].finding(
        worst[1], worst[2] / 2, (c.p.guid, *bolts), count=len(bolts), hole=worst[2]))


def _edge_findings(
    c: _Bolted, per_bolt: list[tuple[float, str]], part: str, near_rule: str, els_head: tuple,
    **detail,
) -> None:
    """One edge, bolt by bolt: bolts whose hole is not inside the part, and bolts too close.

    Each bolt is measured; the bolts outside the part give one finding and the bolts inside
    but too close another, each with the worst value and every bolt concerned, so one defect
    never hides another.
    """
    d0 = c.b.d0
    emin = dt.e_min(d0)
    outside = [(e, g) for e, g in per_bolt if RULES["bolt_outside_" + part].broken(e, d0 / 2)]
    close = [(e, g) for e, g in per_bolt
             if (e, g) not in outside and RULES[near_rule].broken(e, emin)]
    for group, rule, limit in ((outside, "bolt_outside_" + part, d0 / 2),
                               (close, near_rule, emin)):
        if group:
            worst = min(e for e, _ in group)
            bolts = tuple(dict.fromkeys(g for _, g in group))
            c.out.append(RULES[rule].finding(worst, limit, (*els_head, *bolts),
                                             count=len(bolts), part=part, **detail))


def _plate_edges(c: _Bolted) -> None:
    """End and edge distances on the plate (EN 1993-1-8 Table 3.3), bolts inside the outline.

    Every bolt is measured against every edge it lies near: the top and bottom edges for the
    first and last rows, the side edges (the ends along the beam for a fin plate) for all.
    """
    p, b = c.p, c.b
    fin = p.role == PartRole.FIN_PLATE  # shear goes down the plate: e1 is vertical
    top, bottom = b.rows[0], b.rows[-1]
    vertical_rule = "end_distance" if fin else "edge_distance"
    _edge_findings(c, [(top.from_beam_top - p.top_from_beam_top, g) for g in top.bolts],
                   "plate", vertical_rule, (p.guid,), edge="top", row=1)
    _edge_findings(c, [(p.bottom_from_beam_top - bottom.from_beam_top, g) for g in bottom.bolts],
                   "plate", vertical_rule, (p.guid,), edge="bottom", row=len(b.rows))
    if fin:  # edges across the load: the plate's ends along the beam
        side = [(min(x - p.along_min, p.along_max - x), g)
                for r in b.rows for x, g in zip(r.along, r.bolts, strict=True)]
    else:
        side = [(p.bp / 2 - abs(y - p.lateral_centre), g)
                for r in b.rows for y, g in zip(r.lateral, r.bolts, strict=True)]
    _edge_findings(c, side, "plate", "edge_distance", (p.guid,), edge="side")


def _spacings(c: _Bolted) -> None:
    """Pitches between rows and the gauge (EN 1993-1-8 Table 3.3)."""
    b, d0 = c.b, c.b.d0
    for i, pitch in enumerate(b.pitches, start=1):
        c.check("pitch_min", pitch, dt.p1_min(d0), c.ids, rows=(i, i + 1))
        c.check("pitch_max", pitch, dt.p_max(c.p.tp), c.ids, rows=(i, i + 1))
    if b.gauge is not None:
        c.check("spacing_min", b.gauge, dt.p2_min(d0), c.ids)


def _hole_clearance(c: _Bolted) -> None:
    """Hole diameter against the bolt's (EN 1090-2 normal round holes).

    The plate's modelled holes, else a hole-diameter property of the bolts; an assumed hole
    is not checked.
    """
    d = c.b.d
    hole = c.p.hole_d
    if hole is None and c.b.d0_source == "model (hole diameter property)":
        hole = c.b.d0
    if d is None or hole is None:
        return
    clearance = hole - d
    want = dt.normal_hole_clearance(d)
    rule = RULES["hole_clearance"]
    if rule.outside(clearance, 0.5, want + 0.5):
        c.out.append(rule.finding(clearance, want, (c.p.guid,), hole=hole, d=d))


def _stock_thickness(c: _Bolted) -> None:
    """A connection plate of a thickness plate is not stocked in (``catalogue.plates``)."""
    tp = c.p.tp
    if tp <= 0:
        return  # not a dimension: reported as a value that cannot be used
    near = nearest_stock_thickness(tp)
    c.check("plate_thickness_stock", abs(tp - near), 0.0, (c.p.guid,), tp=tp, nearest=near)


def _symmetry(c: _Bolted) -> None:
    """Bolt rows symmetric about the beam web (the first row that is not is reported)."""
    for r in c.b.rows:
        ys = sorted(r.lateral)
        if len(ys) >= 2 and c.check(
            "bolt_pattern_asymmetric", abs(ys[0] + ys[-1]) / 2, 1.0, r.bolts, row=r.index
        ):
            break


def _plate_thickness(c: _Bolted) -> None:
    """End-plate thickness plausible for the bolt size (rule of thumb)."""
    d, tp = c.b.d, c.p.tp
    if d is None:
        return
    lo, hi = dt.plate_thickness_plausible(tp, d)
    rule = RULES["plate_thickness"]
    if rule.outside(tp, lo, hi):
        c.out.append(rule.finding(tp, lo if tp < lo else hi, (c.p.guid,), d=d))


def _column_flange(c: _Bolted, csec: ISection) -> None:
    """The end plate on the column flange: width, bolts inside it, root radius, grip."""
    p, b, j = c.p, c.b, c.j
    d0, d = b.d0, b.d
    c.check("plate_wider_than_column_flange", p.bp, csec.b, (p.guid, j.column))
    col_lat = c.fr.column_lateral_offset()
    ys_col = [y + col_lat for r in b.rows for y in r.lateral]
    per_bolt = [(csec.b / 2 - abs(y + col_lat), g)
                for r in b.rows for y, g in zip(r.lateral, r.bolts, strict=True)]
    _edge_findings(c, per_bolt, "column_flange", "column_edge_distance", (j.column,))
    els = (j.column, *c.ids)
    if d is None:
        return
    clear = min(abs(y) for y in ys_col) - csec.tw / 2 - csec.r
    if not c.check("hole_on_root_radius", clear, d0 / 2, els):
        c.check("no_spanner_room", clear, dt.washer_half_width(d), els)
    _bolt_length(c, p.tp + csec.tf)  # the plies; a gap is a finding of its own


def _bolt_length(c: _Bolted, grip: float) -> None:
    """Bolts too short for the plies they clamp (``bolt_too_short``)."""
    d = c.b.d
    if d is None:
        return
    need = dt.required_bolt_length(grip, d)
    rule = RULES["bolt_too_short"]
    short = [f for f in c.fs if rule.broken(f.nominal_length or f.length, need)]
    if short:
        ln = min(f.nominal_length or f.length for f in short)
        elements = tuple(f.guid for f in short)
        c.out.append(rule.finding(ln, need, elements, count=len(short), grip=grip))


def completeness(
    j: Joint,
    p: PlateReading | None,
    b: BoltReading | None,
    role: PartRole | None,
    out: list[Finding],
) -> None:
    """Parts missing, and an end plate that does not bear on the column face."""
    if role in (PartRole.END_PLATE, PartRole.FIN_PLATE) and b is None:
        elements = tuple(x.guid for x in j.plates)
        out.append(RULES["plate_without_bolts"].finding(elements=elements, role=role))
    if role is None and b is not None:
        elements = tuple(x.guid for x in j.fasteners)
        out.append(RULES["bolts_without_plate"].finding(elements=elements))
    gap_to_column(j, p, role, b, out)


def gap_to_column(
    j: Joint, p: PlateReading | None, role: PartRole | None, b: BoltReading | None,
    out: list[Finding],
) -> None:
    """The plate (end or fin plate) or the bare beam end standing off the column face.

    Common practice, no source: a part bears on (or is welded to) the face within
    ``TOUCH_TOLERANCE`` (5 mm, modelling round-off); beyond it, the gap is an error that fails
    the joint, and the joint keeps the kind it was designed as. A plate running into the
    column beyond the tolerance clashes with it.
    """
    if p is not None and role in (PartRole.END_PLATE, PartRole.FIN_PLATE):
        part = "end plate" if role == PartRole.END_PLATE else "fin plate"
        gap, els = p.gap_to_column, (p.guid, j.column)
    elif role is None and b is None and j.gap > TOUCH_TOLERANCE:
        part, gap, els = "beam end", j.gap, (j.beam, j.column)
    else:
        return
    if RULES["gap_to_column"].broken(gap, TOUCH_TOLERANCE):
        out.append(RULES["gap_to_column"].finding(gap, TOUCH_TOLERANCE, els, part=part))
    if RULES["overlap_with_column"].broken(-gap, TOUCH_TOLERANCE):
        out.append(RULES["overlap_with_column"].finding(-gap, TOUCH_TOLERANCE, els, part=part))


def weld_sizes(
    welds, role: PartRole | None, bsec: ISection | None, grade: str | None,
    out: list[Finding],
) -> None:
    """Modelled welds smaller than full strength for the beam part they join.

    EN 1993-1-8:2005, 4.5.3.3 (``ec3.components.full_strength_fillet_throat``, with the
    recommended gamma_M2 = 1.25): the flange welds against the flange, the web welds against
    the web. On an end plate (the check takes full-strength welds) a smaller weld fails the
    joint; on a welded joint the check uses the weld itself, so it is a warning.
    """
    if not welds or bsec is None or grade is None:
        return
    g = parse_steel_grade(grade)
    if g is None or not g.en10025:
        return
    rule = RULES["weld_too_small_end_plate" if role == PartRole.END_PLATE
                 else "weld_too_small_welded"]
    for w in welds:
        if w.throat is None:
            continue
        t = bsec.tw if w.location == "web" else bsec.tf
        try:
            s = steel_strength(g.grade, t, quality=g.quality)
        except ValueError:
            return
        need = full_strength_fillet_throat(t, s.fy, s.fu, BETA_W.get(g.grade, 1.0))
        if rule.broken(w.throat, need):
            out.append(rule.finding(w.throat, need, (w.guid,), location=w.location, t=t))


def cleat_bolt_lengths(
    c, d: float | None, fs: dict, bsec: ISection | None, csec: ISection | None,
    support_web: bool, out: list[Finding],
) -> None:
    """Bolts of angle cleats too short for their plies (``bolt_too_short``).

    The web side clamps both cleats and the beam web (2 t_a + t_w), the support side one
    cleat and the support (its flange, or its web when the beam meets a web).
    """
    rule = RULES["bolt_too_short"]
    plies = []
    if bsec is not None:
        plies.append((c.web_bolts, 2 * c.t + bsec.tw))
    if csec is not None:
        plies.append((c.sup_bolts, c.t + (csec.tw if support_web else csec.tf)))
    for guids, grip in plies:
        bolts = [fs[g] for g in guids if g in fs]
        if d is None or not bolts:
            continue
        need = dt.required_bolt_length(grip, d)
        short = [b for b in bolts if rule.broken(b.nominal_length or b.length, need)]
        if short:
            ln = min(b.nominal_length or b.length for b in short)
            out.append(rule.finding(ln, need, tuple(b.guid for b in short), count=len(short),
                                    grip=grip))
