"""Typed codes for everything the program decides.

Decisions compare these codes, never text: a status, an archetype, a finding, the reason a
joint was not checked, a note the engine attaches to a result. Words for people are made
only by the renderers (``ifcjoint.report.words``) from a code and its values, so rewording a
message can never change a decision.

The string values are the identifiers written to the JSON and CSV outputs; they are stable.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from enum import StrEnum
from typing import Any


class Status(StrEnum):
    """What became of a joint in a check run."""

    PASS = "pass"
    FAIL = "fail"
    NO_DEMANDS = "no_demands"
    INCOMPLETE = "incomplete"
    UNSUPPORTED = "unsupported"
    UNREADABLE = "unreadable"

    @property
    def checked(self) -> bool:
        """True for pass and fail: the joint was verified against its demands."""
        return self in (Status.PASS, Status.FAIL)


#: Every status but pass and fail: the joint was not verified against its forces.
UNCHECKED: tuple[Status, ...] = tuple(s for s in Status if not s.checked)


class Archetype(StrEnum):
    """What kind of joint a beam end is (names of our own; see ``ifcjoint.archetypes``)."""

    EXTENDED_END_PLATE = "extended_end_plate"
    FLUSH_END_PLATE = "flush_end_plate"
    PARTIAL_DEPTH_END_PLATE = "partial_depth_end_plate"  # a header plate short of a flange
    END_PLATE = "end_plate"  # an end plate whose extent could not be judged (no beam depth)
    WELDED = "welded"
    FIN_PLATE = "fin_plate"
    BEAM_FIN_PLATE = "beam_to_beam_fin_plate"  # on a primary beam's web
    BEAM_HEADER_PLATE = "beam_to_beam_end_plate"  # partial depth, on a primary beam's web
    END_PLATE_SPLICE = "end_plate_splice"  # two beams' end plates bolted together
    HAUNCHED_END_PLATE = "haunched_end_plate"  # an end plate down a haunch under the beam
    ANGLE_CLEATS = "angle_cleats"  # double angle web cleats
    INCOMPLETE = "incomplete"
    UNDETAILED = "undetailed"
    UNSUPPORTED = "unsupported"
    UNKNOWN = "unknown"  # not decided yet (a joint straight from the finder)

    @property
    def incomplete(self) -> bool:
        """True when the model does not hold the joint's parts (it cannot be checked)."""
        return self in (Archetype.INCOMPLETE, Archetype.UNDETAILED)

    @property
    def pinned(self) -> bool:
        """True for the nominally pinned kinds (checked in shear; no moment)."""
        return self in (Archetype.FIN_PLATE, Archetype.PARTIAL_DEPTH_END_PLATE,
                        Archetype.BEAM_FIN_PLATE, Archetype.BEAM_HEADER_PLATE,
                        Archetype.ANGLE_CLEATS)


class Axis(StrEnum):
    """Which axis of the column the beam frames into."""

    MAJOR = "major"  # the beam meets a column flange
    MINOR = "minor"  # the beam meets the column web


class Face(StrEnum):
    """The column face the beam meets."""

    FLANGE = "flange"
    WEB = "web"
    END = "end"  # the end of a collinear beam (a splice)


class MemberKind(StrEnum):
    """Linear members the finder distinguishes."""

    BEAM = "beam"
    COLUMN = "column"
    BRACE = "brace"


class SteelState(StrEnum):
    """How sure the reader is that a member is structural steel."""

    STEEL = "steel"
    NON_STEEL = "non_steel"
    UNKNOWN = "unknown"


class FastenerKind(StrEnum):
    """Kinds of fastener elements (recognition rules in ``ifcjoint/data/recognition.toml``)."""

    BOLT = "bolt"
    NUT = "nut"
    WASHER = "washer"
    WELD = "weld"
    ANCHOR = "anchor"
    OTHER = "other"


class LinkSource(StrEnum):
    """Why a part was attached to a joint, strongest first."""

    REALIZING = "realizing"  # IfcRelConnectsWithRealizingElements
    ASSEMBLY = "assembly"  # IfcElementAssembly aggregation
    CONNECTS = "connects"  # IfcRelConnectsElements
    GEOMETRY = "geometry"  # position and orientation only


class PartRole(StrEnum):
    """What a plate or fastener does in its joint."""

    END_PLATE = "end_plate"
    FIN_PLATE = "fin_plate"
    COLUMN_PLATE = "column_plate"  # stiffener or supplementary web plate
    OTHER_PLATE = "other_plate"  # haunch plate, inclined stiffener ...
    BOLT = "bolt"
    WELD = "weld"
    OTHER_FASTENER = "other_fastener"


class Support(StrEnum):
    """The member a joint's beam frames into."""

    COLUMN = "column"
    BEAM = "beam"  # a primary beam's web: a beam-to-beam joint
    SPLICE = "splice"  # the end of a collinear beam: a beam splice


class EndKind(StrEnum):
    """Beam ends that are not beam-to-column joints, and what they are instead."""

    BEAM_TO_BEAM = "beam_to_beam"  # ends on the side of another beam
    SPLICE = "splice"  # meets the end of a collinear beam
    COLUMN_CAP = "column_cap"  # sits on top of a column
    COLUMN_BASE = "column_base"  # lands at the foot of a column
    HAUNCH = "haunch"  # a short member under another beam's end at the same column face
    FREE_END = "free_end"  # touches no member (cantilever, wall bearing ...)


class Severity(StrEnum):
    """How bad a detailing finding is."""

    ERROR = "error"  # a shop could not make it or a checker would reject it
    WARNING = "warning"  # doubtful: look at it
    INFO = "info"


class FindingCode(StrEnum):
    """Detailing and data findings (rules in ``ifcjoint.anatomy.detailing``)."""

    SECTION_MISMATCH = "section_mismatch"
    GRADE_MISSING = "grade_missing"
    BOLT_CLASS_MISSING = "bolt_class_missing"
    PLATE_WITHOUT_BOLTS = "plate_without_bolts"
    BOLTS_WITHOUT_PLATE = "bolts_without_plate"
    GAP_TO_COLUMN = "gap_to_column"
    OVERLAP_WITH_COLUMN = "overlap_with_column"
    END_DISTANCE_MIN = "end_distance_min"
    EDGE_DISTANCE_MIN = "edge_distance_min"
    BOLT_OUTSIDE_OUTLINE = "bolt_outside_outline"
    BOLT_OFF_HOLE = "bolt_off_hole"
    PITCH_MIN = "pitch_min"
    PITCH_MAX = "pitch_max"
    SPACING_MIN = "spacing_min"
    HOLE_CLEARANCE = "hole_clearance"
    BOLT_PATTERN_ASYMMETRIC = "bolt_pattern_asymmetric"
    PLATE_THICKNESS_IMPLAUSIBLE = "plate_thickness_implausible"
    PLATE_THICKNESS_NOT_STOCK = "plate_thickness_not_stock"
    FIN_PLATE_NOT_DUCTILE = "fin_plate_not_ductile"
    PLATE_WIDER_THAN_COLUMN_FLANGE = "plate_wider_than_column_flange"
    COLUMN_EDGE_DISTANCE_MIN = "column_edge_distance_min"
    HOLE_ON_ROOT_RADIUS = "hole_on_root_radius"
    NO_SPANNER_ROOM = "no_spanner_room"
    BOLT_TOO_SHORT = "bolt_too_short"
    WELD_TOO_SMALL = "weld_too_small"
    VALUE_NOT_USABLE = "value_not_usable"  # a dimension that cannot be right (zero, negative)


class ProblemKind(StrEnum):
    """Kinds of problems a joint can have (one BCF topic each)."""

    RESISTANCE = "resistance"
    INCOMPLETE = "incomplete"
    UNCHECKED = "unchecked"
    DETAILING = "detailing"
    ASSUMPTION = "assumption"


class Priority(StrEnum):
    """How urgent a problem is (the BCF priority)."""

    CRITICAL = "critical"
    MAJOR = "major"
    MINOR = "minor"


class NotCheckedCode(StrEnum):
    """Why a joint (or a sign of it) was not checked."""

    NO_ANATOMY = "no_anatomy"
    DATA_NOT_READ = "data_not_read"
    STRENGTH_UNAVAILABLE = "strength_unavailable"
    BOLT_DATA_MISSING = "bolt_data_missing"
    NO_TENSILE_AREA = "no_tensile_area"
    SECTION_DIMENSIONS_MISSING = "section_dimensions_missing"
    MINOR_AXIS = "minor_axis"
    FIN_PLATE = "fin_plate"
    ARCHETYPE_NOT_CHECKED = "archetype_not_checked"
    ROW_NOT_TWO_BOLTS = "row_not_two_bolts"
    FEWER_THAN_TWO_ROWS = "fewer_than_two_rows"
    WEB_TOO_SLENDER = "web_too_slender"
    BOLTS_IN_ROOT_RADIUS = "bolts_in_root_radius"
    NO_DEMANDS = "no_demands"
    NO_SPAN_OR_IY = "no_span_or_iy"  # stiffness not classified
    NO_PLASTIC_MODULI = "no_plastic_moduli"  # strength not classified
    NO_TENSION_ROWS = "no_tension_rows"  # a moment sign with no bolt row in its tension zone
    BEARING_OUT_OF_RANGE = "bearing_out_of_range"  # Table 3.4 used outside Table 3.3's limits
    CLASS_4_BEAM = "class_4_beam"  # M_c,Rd needs the effective section (EN 1993-1-5)
    VALUE_NOT_USABLE = "unusable_value"  # a dimension read that cannot be right
    PARTS_MISSING = "parts_missing"  # incomplete: the model lacks parts the joint needs
    PINNED_NO_MOMENT = "pinned_no_moment"  # a nominally pinned joint has no moment resistance
    SUPPORT_WEB_OTHER_SIDE_MISSING = "support_web_other_side_missing"  # no partner reaction
    WEB_BENDING_NOT_COVERED = "web_bending_not_covered"  # an end plate on a web: no moment
    SPLICE_PLATES_DIFFER = "splice_plates_differ"  # a splice's two plates not alike
    HAUNCH_OUTSIDE_RULES = "haunch_outside_rules"  # EN 1993-1-8 6.2.6.7(2) not met
    NOTCH_NOT_CHECKED = "notch_not_checked"  # a secondary beam that must be notched
    CLEAT_BOLT_PATTERN = "cleat_bolt_pattern"  # not one web line and two support lines alike
    TYING_NOT_CHECKED = "tying_not_checked"  # an axial force on a fin plate joint
    NOT_DUCTILE = "not_ductile"  # the rules that make a fin plate nominally pinned fail
    FIN_BOLT_PATTERN = "fin_bolt_pattern"  # not one or two regular lines within the plate

    @property
    def status(self) -> Status:
        """The joint status this reason leads to (missing data, out of scope, no forces)."""
        return _NOT_CHECKED_STATUS.get(self, Status.UNSUPPORTED)


_NOT_CHECKED_STATUS = {
    NotCheckedCode.NO_ANATOMY: Status.UNREADABLE,
    NotCheckedCode.DATA_NOT_READ: Status.UNREADABLE,
    NotCheckedCode.STRENGTH_UNAVAILABLE: Status.UNREADABLE,
    NotCheckedCode.BOLT_DATA_MISSING: Status.UNREADABLE,
    NotCheckedCode.NO_TENSILE_AREA: Status.UNREADABLE,
    NotCheckedCode.SECTION_DIMENSIONS_MISSING: Status.UNREADABLE,
    NotCheckedCode.NO_DEMANDS: Status.NO_DEMANDS,
    NotCheckedCode.SUPPORT_WEB_OTHER_SIDE_MISSING: Status.NO_DEMANDS,
    NotCheckedCode.VALUE_NOT_USABLE: Status.UNREADABLE,
}


class ReasonCode(StrEnum):
    """Why a joint was given its archetype."""

    END_PLATE_NO_BOLTS = "end_plate_no_bolts"
    PLATE_SHORT_OF_FLANGE = "plate_short_of_flange"
    FIN_PLATE_NO_BOLTS = "fin_plate_no_bolts"
    BOLTS_NO_PLATE = "bolts_no_plate"
    SHORT_OF_FACE = "short_of_face"  # a bare beam end stopping short: welded, with a gap
    DEPTH_UNKNOWN = "depth_unknown"
    ROWS_OUTSIDE = "rows_outside"
    ROWS_WITHIN = "rows_within"
    FIN_PLATE_BOLTS = "fin_plate_bolts"
    SPLICE_PLATES_BOLTS = "splice_plates_bolts"
    HAUNCH_END_PLATE = "haunch_end_plate"
    ANGLE_CLEATS_BOLTS = "angle_cleats_bolts"
    SPLICE_PLATE_MISSING = "splice_plate_missing"  # one end plate and bolts, the other absent
    SPLICE_BARE = "splice_bare"  # two beam ends meeting with no plates or bolts
    ON_FACE = "on_face"
    DRAWN_INTO = "drawn_into"
    UNSUPPORTED_PARTS = "unsupported_parts"
    NOT_DECIDED = "not_decided"


class UnsupportedPart(StrEnum):
    """Parts that make a joint a kind ifcjoint does not check."""

    HAUNCH_PLATES = "haunch_plates"
    INCLINED_STIFFENER = "inclined_stiffener"
    HAUNCH_MEMBERS = "haunch_members"
    SECTION_PARTS = "section_parts"  # angle cleats, tees: short open sections at the joint


class NoteCode(StrEnum):
    """What the engine or the verification says about how a result was obtained."""

    WELDS_ASSUMED = "welds_assumed"
    SPLICE_PLATES = "splice_plates"  # a beam splice: both plates as the weaker one, no column
    HAUNCH_SECTION = "haunch_section"  # a haunched beam: one deeper section at the column
    BEAM_WEB_UNNOTCHED = "beam_web_unnotched"
    FIN_PLATE_PINNED = "fin_plate_pinned"
    BOLT_SHEAR_GOVERNS = "bolt_shear_governs"
    WELDS_MODELLED = "welds_modelled"
    WELDS_PARTLY_MODELLED = "welds_partly_modelled"
    ALPHA_CHART = "alpha_chart"
    ALPHA_GIVEN = "alpha_given"
    ALPHA_CONSERVATIVE = "alpha_conservative"
    PRYING_ASSUMED = "prying_assumed"
    COMPRESSION_STIFFENER = "compression_stiffener"
    STIFFENER_SLENDER = "stiffener_slender"
    TENSION_STIFFENER = "tension_stiffener"
    TENSION_STIFFENER_IGNORED = "tension_stiffener_ignored"  # Table 6.4 gives more
    TENSION_STIFFENER_WELDED = "tension_stiffener_welded"  # welded: stiffness only
    WEB_PLATES_USED = "web_plates_used"
    WEB_PLATES_IGNORED = "web_plates_ignored"
    WEB_PANEL_STIFFENED = "web_panel_stiffened"
    STIFFNESS_UNREINFORCED = "stiffness_unreinforced"
    BEAM_CLASS_3 = "beam_class_3"
    SHEAR_FROM_BOLTS = "shear_from_bolts"
    SHEAR_FROM_WELDS = "shear_from_welds"
    BETA_ONE_SINGLE_SIDED = "beta_one_single_sided"
    BETA_ONE_UNTIL_DEMANDS = "beta_one_until_demands"
    BETA_TABLE_SINGLE_SIDED = "beta_table_single_sided"
    BETA_OTHER_SIDE_MISSING = "beta_other_side_missing"
    BETA_FROM_MOMENTS = "beta_from_moments"
    COLUMN_SHEARS_ZERO = "column_shears_zero"
    AXIAL_NEGLECTED = "axial_neglected"


class Verification(StrEnum):
    """What a utilisation compares (a demand against a resistance of the joint)."""

    MOMENT = "moment"
    SHEAR = "shear"
    WEB_PANEL_SHEAR = "web_panel_shear"
    BENDING_AND_AXIAL = "bending_and_axial"
    DETAILING = "detailing"  # a rule the resistance depends on, broken (limit over measured)
    TYING = "tying"  # an axial tension on a pinned joint against its tying resistance
    SUPPORT_WEB_SHEAR = "support_web_shear"  # the reactions of both sides on a supporting web
    CONDITION = "condition"  # a rule of the method that holds whatever the load


class StiffnessClass(StrEnum):
    """Classification by stiffness, EN 1993-1-8 5.2.2 (values as the code words them)."""

    RIGID = "rigid"
    SEMI_RIGID = "semi-rigid"
    PINNED = "nominally pinned"


class StrengthClass(StrEnum):
    """Classification by strength, EN 1993-1-8 5.2.3 (values as the code words them)."""

    FULL = "full-strength"
    PARTIAL = "partial-strength"
    PINNED = "nominally pinned"


class JointModel(StrEnum):
    """What a frame analysis assumed for a joint (a demands column)."""

    RIGID = "rigid"
    SEMI_RIGID = "semi-rigid"
    PINNED = "pinned"


@dataclass(frozen=True, slots=True)
class Coded:
    """A code with the values a renderer needs to put it into words."""

    code: StrEnum
    values: dict[str, Any] = field(default_factory=dict)


@dataclass(frozen=True, slots=True)
class NotChecked(Coded):
    """Why something was not checked: ``NotChecked(NotCheckedCode.MINOR_AXIS)``."""

    code: NotCheckedCode

    @property
    def status(self) -> Status:
        """The joint status this reason leads to."""
        return self.code.status


@dataclass(frozen=True, slots=True)
class Reason(Coded):
    """Why a joint has its archetype, e.g. ``Reason(ReasonCode.ROWS_WITHIN, {"n": 4})``."""

    code: ReasonCode


@dataclass(frozen=True, slots=True)
class Note(Coded):
    """How a result was obtained (an assumption, a default, a simplification)."""

    code: NoteCode
