"""The detailing and data rules as a table: what each finding is, how bad, on what basis.

Every finding ifcjoint reports comes from one row here. A rule says which code it gives, its
severity, the source it follows (a clause, or "common practice" when it is a fact of the trade
with no code clause), and how a measured value is compared with the limit (a minimum, a
maximum or a range, with a tolerance for modelling round-off). The functions that measure live
in ``read`` and ``detailing``; the words a person reads are made by the renderers.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any, Literal

from ifcjoint.model.codes import FindingCode, Severity
from ifcjoint.model.joints import Finding

#: A plate this close (mm) to the column face touches it (common practice, no source).
TOUCH_TOLERANCE = 5.0


#: Float round-off allowed on every rule, mm (common practice, no source).
ROUND_OFF = 1e-3


@dataclass(frozen=True, slots=True, kw_only=True)
class Rule:
    """One rule: its finding code, severity, basis and how values are compared.

    Attributes:
        code: the finding it gives.
        severity: error, warning or info.
        basis: the clause or practice it follows, as cited in every finding.
        bound: ``min`` (measured must reach the limit), ``max`` (must not exceed it),
            ``range`` (must lie within [lo, hi]) or ``present`` (a part that must exist).
        tolerance: modelling round-off allowed beyond the limit, mm.
        fails_joint: breaking it makes the joint fail (the resistance model depends on it, or
            the part cannot be made as modelled); warnings never do.
        source: (code, clause) the rule follows, for the governing check; empty for common
            practice.
    """

    code: FindingCode
    severity: Severity
    basis: str
    bound: Literal["min", "max", "range", "present"] = "present"
    tolerance: float = 0.0
    fails_joint: bool = False
    source: tuple[str, str] | tuple[()] = ()

    def broken(self, measured: float, limit: float) -> bool:
        """Whether a measured value breaks a minimum or maximum rule.

        Beside the rule's own tolerance, a micrometre: geometry read through placements and
        unit conversions carries float round-off (10 mm read as 9.999999999999998).
        """
        if self.bound == "min":
            return measured < limit - self.tolerance - ROUND_OFF
        if self.bound == "max":
            return measured > limit + self.tolerance + ROUND_OFF
        raise ValueError(f"rule {self.code} is a {self.bound} rule, not min/max")

    def outside(self, measured: float, lo: float, hi: float) -> bool:
        """Whether a measured value lies outside a range rule's [lo, hi]."""
        return not lo - self.tolerance - ROUND_OFF <= measured <= hi + self.tolerance + ROUND_OFF

    def finding(
        self,
        measured: float | None = None,
        limit: float | None = None,
        elements: tuple[str, ...] = (),
        **detail: Any,
    ) -> Finding:
        """The finding this rule gives, with what was measured and what the words need."""
        return Finding(
            code=self.code,
            severity=self.severity,
            basis=self.basis,
            measured=measured,
            limit=limit,
            elements=elements,
            detail=detail,
            fails_joint=self.fails_joint,
            source=self.source,
            ratio=self.ratio(measured, limit),
        )

    def ratio(self, measured: float | None, limit: float | None) -> float | None:
        """How far a value is beyond its limit, as a utilisation (None for other rules).

        A minimum: limit / measured; a maximum: measured / limit; infinite when the divisor is
        not positive (a bolt outside the plate, a zero edge distance).
        """
        if measured is None or limit is None or self.bound not in ("min", "max", "range"):
            return None
        num, den = (limit, measured) if self.bound == "min" else (measured, limit)
        if self.bound == "range" and measured < limit:
            num, den = limit, measured
        return num / den if den > 0 else float("inf")


_E = Severity.ERROR
_W = Severity.WARNING
_TABLE_3_3_E = "EN 1993-1-8 Table 3.3: e >= 1.2 d0"

#: Every rule by name (a finding code may have several rules: the plate's and the column's).
RULES: dict[str, Rule] = {
    "section_mismatch": Rule(
        code=FindingCode.SECTION_MISMATCH,
        severity=_W,
        basis="model dimensions vs catalogue (EN 10365 / BS 4-1), common practice tolerance "
        "max(1 mm, 2 %)",
    ),
    "grade_missing": Rule(
        code=FindingCode.GRADE_MISSING, severity=_W, basis="EN 1993-1-1 3.2 needs fy, fu"
    ),
    "bolt_class_missing": Rule(
        code=FindingCode.BOLT_CLASS_MISSING,
        severity=_W,
        basis="EN 1993-1-8 Table 3.1 needs the property class",
    ),
    "end_distance": Rule(
        code=FindingCode.END_DISTANCE_MIN,
        severity=_E,
        basis=_TABLE_3_3_E,
        bound="min",
        tolerance=0.5,
        fails_joint=True,
        source=('EN 1993-1-8', 'Table 3.3'),
    ),
    "edge_distance": Rule(
        code=FindingCode.EDGE_DISTANCE_MIN,
        severity=_E,
        basis=_TABLE_3_3_E,
        bound="min",
        tolerance=0.5,
        fails_joint=True,
        source=('EN 1993-1-8', 'Table 3.3'),
    ),
    "bolt_outside_plate": Rule(
        code=FindingCode.BOLT_OUTSIDE_OUTLINE,
        severity=_E,
        basis="the hole must lie within the plate (3D position of the bolt axis)",
        bound="min",
        fails_joint=True,
        source=(),
    ),
    "bolt_off_hole": Rule(
        code=FindingCode.BOLT_OFF_HOLE,
        severity=_E,
        basis="the bolt must pass through a hole: its axis within a modelled hole's circle",
        bound="max",
        fails_joint=True,
    ),
    "pitch_min": Rule(
        code=FindingCode.PITCH_MIN,
        severity=_E,
        basis="EN 1993-1-8 Table 3.3: p1 >= 2.2 d0",
        bound="min",
        tolerance=0.5,
        fails_joint=True,
        source=('EN 1993-1-8', 'Table 3.3'),
    ),
    "pitch_max": Rule(
        code=FindingCode.PITCH_MAX,
        severity=_W,
        basis="EN 1993-1-8 Table 3.3: p <= min(14 t, 200 mm)",
        bound="max",
        tolerance=0.5,
    ),
    "spacing_min": Rule(
        code=FindingCode.SPACING_MIN,
        severity=_E,
        basis="EN 1993-1-8 Table 3.3: p2 >= 2.4 d0",
        bound="min",
        tolerance=0.5,
        fails_joint=True,
        source=('EN 1993-1-8', 'Table 3.3'),
    ),
    "hole_clearance": Rule(
        code=FindingCode.HOLE_CLEARANCE,
        severity=_E,
        basis="EN 1090-2 Table 11 normal round holes",
        bound="range",
        fails_joint=True,
        source=('EN 1090-2', 'Table 11'),
    ),
    "bolt_pattern_asymmetric": Rule(
        code=FindingCode.BOLT_PATTERN_ASYMMETRIC,
        severity=_W,
        basis="common practice: bolt rows symmetric about the beam web (2 mm)",
        bound="max",
    ),
    "plate_thickness": Rule(
        code=FindingCode.PLATE_THICKNESS_IMPLAUSIBLE,
        severity=Severity.INFO,
        basis="common practice rule of thumb: 0.5 d <= tp <= 1.5 d",
        bound="range",
    ),
    "fin_plate_ductility": Rule(
        code=FindingCode.FIN_PLATE_NOT_DUCTILE,
        severity=_W,
        basis="design guide for pinned joints (Multi-Storey Steel Buildings Part 5), fin "
        "plates: t_p <= 0.5 d (S235, S275) or 0.42 d (S355 and above) so the plate yields "
        "before the bolts shear (from memory)",
        bound="max",
        tolerance=0.05,
    ),
    "plate_thickness_stock": Rule(
        code=FindingCode.PLATE_THICKNESS_NOT_STOCK,
        severity=_W,
        basis="common practice: thicknesses plate merchants stock (metric and inch; "
        "ifcjoint/catalogue/plates.py, from memory), 0.2 mm round-off",
        bound="max",
        tolerance=0.2,
    ),
    "plate_wider_than_column_flange": Rule(
        code=FindingCode.PLATE_WIDER_THAN_COLUMN_FLANGE,
        severity=_W,
        basis="common practice: an end plate bolted to a flange is no wider than it (2 mm)",
        bound="max",
        tolerance=2.0,
    ),
    "bolt_outside_column_flange": Rule(
        code=FindingCode.BOLT_OUTSIDE_OUTLINE,
        severity=_E,
        basis="the hole must lie within the column flange (3D position of the bolt axis)",
        bound="min",
        fails_joint=True,
        source=(),
    ),
    "column_edge_distance": Rule(
        code=FindingCode.COLUMN_EDGE_DISTANCE_MIN,
        severity=_E,
        basis="EN 1993-1-8 Table 3.3 on the column flange: e >= 1.2 d0",
        bound="min",
        tolerance=0.5,
        fails_joint=True,
        source=('EN 1993-1-8', 'Table 3.3'),
    ),
    "hole_on_root_radius": Rule(
        code=FindingCode.HOLE_ON_ROOT_RADIUS,
        severity=_E,
        basis="common practice: holes clear the column's root radius",
        bound="min",
        tolerance=0.5,
        fails_joint=True,
        source=(),
    ),
    "no_spanner_room": Rule(
        code=FindingCode.NO_SPANNER_ROOM,
        severity=_W,
        basis="common practice: a washer (about 0.93 d across half) fits beside the root radius",
        bound="min",
        tolerance=0.5,
    ),
    "bolt_too_short": Rule(
        code=FindingCode.BOLT_TOO_SHORT,
        severity=_E,
        basis="common practice: grip + 2 washers (4 mm) + nut 0.9 d + 0.15 d protrusion",
        bound="min",
        tolerance=0.5,
        fails_joint=True,
        source=(),
    ),
    "weld_too_small_end_plate": Rule(
        code=FindingCode.WELD_TOO_SMALL,
        severity=_E,
        basis="EN 1993-1-8 4.5.3.3: the end-plate check takes full-strength beam welds "
        "(a >= t fy sqrt 3 beta_w gamma_M2 / 2 fu, gamma_M2 = 1.25 recommended)",
        bound="min",
        tolerance=0.1,
        fails_joint=True,
        source=("EN 1993-1-8", "4.5.3.3"),
    ),
    "weld_too_small_welded": Rule(
        code=FindingCode.WELD_TOO_SMALL,
        severity=_W,
        basis="EN 1993-1-8 4.5.3.3: below full strength (gamma_M2 = 1.25 recommended); the "
        "welded joint's check uses this weld's own resistance",
        bound="min",
        tolerance=0.1,
    ),
    "value_not_usable": Rule(
        code=FindingCode.VALUE_NOT_USABLE,
        severity=_E,
        basis="a length, diameter or thickness must be positive: the value read cannot be right",
        bound="min",
    ),
    "plate_without_bolts": Rule(
        code=FindingCode.PLATE_WITHOUT_BOLTS, severity=_E, basis="joint incomplete"
    ),
    "bolts_without_plate": Rule(
        code=FindingCode.BOLTS_WITHOUT_PLATE, severity=_E, basis="joint incomplete"
    ),
    "gap_to_column": Rule(
        code=FindingCode.GAP_TO_COLUMN,
        severity=_E,
        basis=f"common practice: plate bears on the column (tolerance {TOUCH_TOLERANCE} mm)",
        bound="max",
        fails_joint=True,
        source=(),
    ),
    "overlap_with_column": Rule(
        code=FindingCode.OVERLAP_WITH_COLUMN,
        severity=_E,
        basis=f"common practice: parts must not clash (tolerance {TOUCH_TOLERANCE} mm)",
        bound="max",
        fails_joint=True,
        source=(),
    ),
}
