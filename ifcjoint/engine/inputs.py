"""What the check engine takes: plain dataclasses in N, mm, MPa (no IFC, no scan objects).

Every value the check uses is here, so a check can be repeated by hand from its input alone;
``input_record`` gives the same input as plain data for the outputs and the fingerprint.
"""

from __future__ import annotations

import functools
from dataclasses import asdict, dataclass

from ifcjoint.ec3.params import RECOMMENDED, Parameters


@dataclass(frozen=True, slots=True, kw_only=True)
class MemberInput:
    """A rolled or welded I section with its steel (mm, MPa).

    Attributes:
        r: root radius of a rolled section; 0 for a welded one (its web-to-flange weld is
            not known, so EN 1993-1-8 6.2.6.2's s = sqrt(2) a_c is taken as 0: conservative).
        span: beam span for the stiffness classification, mm.
        Iy: second moment about the strong axis, mm4.
        Wpl_y: plastic modulus, mm3.
        strength_source: the table and row fy and fu were read from.
    """

    name: str
    grade: str
    h: float
    b: float
    tw: float
    tf: float
    r: float
    fy: float
    fu: float
    welded: bool = False
    span: float | None = None
    Iy: float | None = None
    Wpl_y: float | None = None
    strength_source: str = ""

    @property
    def s(self) -> float:
        """S of EN 1993-1-8 6.2.6.2(1): the root radius r_c (0 for a welded section, above)."""
        return self.r


@dataclass(frozen=True, slots=True, kw_only=True)
class StiffenerInput:
    """A pair of transverse column stiffeners, one each side of the web (mm, MPa).

    Attributes:
        level: depth of the stiffener's mid-plane below the top face of the beam, mm.
        t: thickness, mm.
        b: width of one stiffener from the web face, mm.
        fy: yield strength, MPa.
        grade: steel grade as read (empty: not known, the column's fy is used).
        snipe: corner snipe at the web-flange root, mm (lost from the width in crushing).
        weld_leg: leg of the stiffener-to-flange fillet weld, mm (0: not known; alpha of
            Figure 6.11 is then taken with no weld deduction, the lower value).
        guid: GlobalId of the plate(s) in the model, if any.
    """

    level: float
    t: float
    b: float
    fy: float
    grade: str = ""
    snipe: float = 0.0
    weld_leg: float = 0.0
    guid: str = ""


@dataclass(frozen=True, slots=True, kw_only=True)
class WebPlateInput:
    """Supplementary web plates on the column web (mm, MPa).

    Attributes:
        t: thickness, mm.
        b: width b_s across the web, mm.
        fy: yield strength, MPa.
        sides: 1 (one plate) or 2 (a plate each side of the web).
        grade: steel grade as read.
        guid: GlobalId(s) in the model.
    """

    t: float
    b: float
    fy: float
    sides: int = 1
    grade: str = ""
    guid: str = ""


@dataclass(frozen=True, slots=True, kw_only=True)
class PlateInput:
    """End plate (mm, MPa). Projections from the beam's outer flange faces; negative inside."""

    grade: str
    tp: float
    bp: float
    hp: float
    fy: float
    fu: float
    projection_top: float
    projection_bottom: float
    strength_source: str = ""


@dataclass(frozen=True, slots=True, kw_only=True)
class BoltsInput:
    """Bolts, two per row (mm, MPa). Rows measured down from the beam's top face.

    Attributes:
        L_b: bolt elongation length (Table 6.2 definition, ``ec3.bolts.bolt_elongation_length``)
            for the bolts' stiffness k10; None: computed from the plies by the engine. The
            T-stubs always assume prying forces (the Table 6.2 note allows it).
    """

    d: float
    grade: str
    fub: float
    As: float
    d0: float
    gauge: float
    rows_from_beam_top: tuple[float, ...]
    L_b: float | None = None


@dataclass(frozen=True, slots=True, kw_only=True)
class WeldsInput:
    """Weld throats a (mm) of the beam to the end plate (or column).

    ``assumed`` when any throat was not modelled; ``modelled`` names the ones read from the
    model (``top_flange``, ``bottom_flange``, ``web``).
    """

    top_flange_throat: float
    bottom_flange_throat: float
    web_throat: float
    assumed: bool = True
    modelled: tuple[str, ...] = ()


@dataclass(frozen=True, slots=True, kw_only=True)
class _JointInputBase:
    """What every beam-to-column joint input shares (N, mm, MPa)."""

    column: MemberInput
    beam: MemberInput
    welds: WeldsInput
    params: Parameters = RECOMMENDED
    beta: float = 1.0  # transformation parameter (5.3(7), Table 5.4): 1 single-sided
    column_continues_above: bool = True
    braced: bool = True
    stiffeners: tuple[StiffenerInput, ...] = ()  # transverse column stiffeners (pairs)
    web_plates: tuple[WebPlateInput, ...] = ()  # supplementary web plates
    sigma_com_Ed: float = 0.0  # longitudinal compression in the column web, MPa


@dataclass(frozen=True, slots=True, kw_only=True)
class HaunchInput:
    """A haunch welded under the beam at the column (mm, MPa).

    Attributes:
        d: depth below the beam's underside at the column face, to the haunch's bottom.
        b, tf: the haunch flange at the column face (its compression flange in hogging).
        tw: the haunch web.
        fy: the haunch's yield strength; grade its steel.
        angle_deg: the haunch flange's slope to the beam flange.
        length: along the beam, from the column face.
    """

    d: float
    b: float
    tf: float
    tw: float
    fy: float
    grade: str
    angle_deg: float
    length: float


@dataclass(frozen=True, slots=True, kw_only=True)
class EndPlateJointInput(_JointInputBase):
    """A beam bolted to a column flange through an end plate (N, mm, MPa).

    ``support``: the column ``flange`` (the component method of 6.2.7), or a ``web`` (a
    column's, minor axis) or ``beam_web`` (a primary beam's): EN 1993-1-8 gives no resistance
    of a web in bending out of its plane, so on a web only the shear path is checked
    (``engine.end_plate_on_web``) and the moment is reported as not determined.
    """

    plate: PlateInput
    bolts: BoltsInput
    alpha: float | None = None  # Figure 6.11 for the end plate's first row below the flange
    alpha_method: str = "chart"  # "chart" (Figure 6.11, SCI P398 App. G) | "conservative" (4.45)
    washer_dia: float | None = None  # dw for the mode-1 alternative method; None: from d
    support: str = "flange"
    haunch: HaunchInput | None = None  # rows from the beam top run down into the haunch


@dataclass(frozen=True, slots=True, kw_only=True)
class WeldedJointInput(_JointInputBase):
    """A beam welded to a column flange (N, mm, MPa)."""


@dataclass(frozen=True, slots=True, kw_only=True)
class FinPlateInput:
    """A fin plate welded to the support, bolted to the beam web (mm, MPa).

    Attributes:
        tp, hp: thickness and depth of the plate; fy, fu, grade its steel.
        e1_top, e1_bottom: from the top and the bottom row to the plate's top and bottom edges.
        e2: from the bolt line farthest from the support to the plate's free end.
        z: lever arm, from the support face to the centre of the bolt group.
        e2_beam: from the bolt line nearest the beam end to the beam end.
    """

    tp: float
    hp: float
    fy: float
    fu: float
    grade: str
    e1_top: float
    e1_bottom: float
    e2: float
    z: float
    e2_beam: float
    strength_source: str = ""


@dataclass(frozen=True, slots=True, kw_only=True)
class FinBoltsInput:
    """The fin plate's bolts in single shear: n1 rows of n2 lines (mm, MPa)."""

    d: float
    grade: str
    fub: float
    As: float
    d0: float
    n1: int
    n2: int
    p1: float  # vertical pitch (0 for one row)
    gauge: float  # p2, between the lines (0 for one line)
    rows_from_beam_top: tuple[float, ...] = ()


@dataclass(frozen=True, slots=True, kw_only=True)
class FinPlateJointInput(_JointInputBase):
    """A beam bolted to a fin plate welded to a column (N, mm, MPa).

    ``welds.web_throat`` is the throat of the fin plate's welds to the support.
    ``support`` says what carries the plate: a column ``flange`` or ``web``, or a primary
    beam's web (``beam_web``); a web adds its local shear and punching rule.
    """

    fin: FinPlateInput
    bolts: FinBoltsInput
    support: str = "flange"
    notch: str = ""  # "top", "bottom" or "both": the beam must be notched at a primary beam


@dataclass(frozen=True, slots=True, kw_only=True)
class HeaderPlateInput:
    """A partial-depth end plate welded to the beam web only (mm, MPa).

    Attributes:
        e1_top, e1_bottom: from the top and the bottom row to the plate's edges.
        e2: from a bolt line to the plate's side edge.
    """

    tp: float
    hp: float
    bp: float
    fy: float
    fu: float
    grade: str
    e1_top: float
    e1_bottom: float
    e2: float
    strength_source: str = ""


@dataclass(frozen=True, slots=True, kw_only=True)
class HeaderPlateJointInput(_JointInputBase):
    """A beam with a partial-depth end plate bolted to a column (N, mm, MPa).

    ``welds.web_throat`` is the throat of the plate's welds to the beam web; ``support``:
    the column ``flange`` or ``web``, or the primary beam's web (``beam_web``), it is bolted
    to.
    """

    header: HeaderPlateInput
    bolts: FinBoltsInput
    support: str = "flange"
    notch: str = ""  # "top", "bottom" or "both": the beam must be notched at a primary beam


@dataclass(frozen=True, slots=True, kw_only=True)
class CleatInput:
    """Two angle cleats, one each side of the beam web (mm, MPa).

    Attributes:
        t: leg thickness; hp: length (up the web); fy, fu, grade: their steel.
        e1: from the top and bottom bolt rows to the cleats' ends (the least).
        e2_web: from the web-side bolt line to the edge of the leg on the beam web.
        e2_sup: from a support-side bolt line to the edge of the leg on the support.
        cross_centres: between the two support-side bolt lines (across the web).
        r: root radius of the angle.
        z: lever arm, from the support face to the web-side bolt line.
    """

    t: float
    hp: float
    fy: float
    fu: float
    grade: str
    e1: float
    e2_web: float
    e2_sup: float
    cross_centres: float
    r: float
    z: float
    strength_source: str = ""


@dataclass(frozen=True, slots=True, kw_only=True)
class AngleCleatJointInput(_JointInputBase):
    """A beam with double angle web cleats bolted to its web and to the support.

    ``bolts`` are the web-side bolts (one line of ``n1`` rows, in double shear); the support
    side has one line per cleat of the same rows (``n1`` each). ``e1_beam``: from the top row
    to the beam web's top edge when the beam is notched (None: unnotched); ``e2_beam``: from
    the web-side line to the beam end. ``support``: ``flange``, ``web`` or ``beam_web``.
    """

    cleats: CleatInput
    bolts: FinBoltsInput
    e2_beam: float
    e1_beam: float | None = None
    washer_dia: float | None = None
    support: str = "flange"
    notch: str = ""  # "top", "bottom" or "both": the beam must be notched at a primary beam


#: Any input of the beam-to-column engines.
JointInput = (EndPlateJointInput | WeldedJointInput | FinPlateJointInput
              | HeaderPlateJointInput | AngleCleatJointInput)


#: The order of the input's fields in the outputs (the order a calculation sheet reads).
_RECORD_ORDER = (
    "column", "beam", "plate", "fin", "header", "cleats", "bolts", "welds", "params", "beta",
    "alpha",
    "alpha_method", "haunch",
    "column_continues_above", "braced", "stiffeners", "web_plates", "washer_dia",
    "sigma_com_Ed",
)


@functools.lru_cache(maxsize=4096)
def input_record(inp: JointInput) -> dict:
    """The complete input as plain data (mm, MPa), as the outputs and the fingerprint name it.

    Kept per input (a model's joints share inputs): the dictionary is shared, never modify it.
    """
    d = asdict(inp)
    d["params"] = inp.params.as_dict()
    d["beam"]["span_mm"] = d["beam"].pop("span")
    w = d["welds"]
    w["flange_throat"] = max(w["top_flange_throat"], w["bottom_flange_throat"])
    rank = {k: i for i, k in enumerate(_RECORD_ORDER)}
    return dict(sorted(d.items(), key=lambda kv: rank.get(kv[0], len(rank))))
