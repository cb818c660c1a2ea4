"""Steel grades and bolt property classes: recognition from free text, strengths by thickness.

Pure Python (no IFC). Strengths in MPa, thicknesses in mm.
"""

from __future__ import annotations

import re
from dataclasses import dataclass

#: Nominal yield and ultimate strengths of hot-rolled structural steel, EN 1993-1-1:2005
#: (with corrigendum AC:2009), Table 3.1, by the part of EN 10025 the steel is delivered to:
#: (part, grade) -> ((fy, fu) for t <= 40 mm, (fy, fu) for 40 < t <= 80 mm).
#: All rows are recalled from memory: no printed copy of the standard was available to check
#: them; the S355 and S275 rows of EN 10025-2 agree with the values the published worked
#: examples use (../shared/reference, Source A: S275 fu = 410 MPa above 40 mm is not used).
EN1993_1_1_TABLE_3_1: dict[tuple[str, str], tuple[tuple[float, float], tuple[float, float]]] = {
    ("EN 10025-2", "S235"): ((235, 360), (215, 360)),
    ("EN 10025-2", "S275"): ((275, 430), (255, 410)),
    ("EN 10025-2", "S355"): ((355, 510), (335, 470)),
    ("EN 10025-2", "S450"): ((440, 550), (410, 550)),
    ("EN 10025-3", "S275"): ((275, 390), (255, 370)),
    ("EN 10025-3", "S355"): ((355, 490), (335, 470)),
    ("EN 10025-3", "S420"): ((420, 520), (390, 520)),
    ("EN 10025-3", "S460"): ((460, 540), (430, 540)),
    ("EN 10025-4", "S275"): ((275, 370), (255, 360)),
    ("EN 10025-4", "S355"): ((355, 470), (335, 450)),
    ("EN 10025-4", "S420"): ((420, 520), (390, 500)),
    ("EN 10025-4", "S460"): ((460, 540), (430, 530)),
    ("EN 10025-5", "S235"): ((235, 360), (215, 340)),
    ("EN 10025-5", "S355"): ((355, 510), (335, 490)),
    ("EN 10025-6", "S460"): ((460, 570), (440, 550)),
}
#: The part of EN 10025 the first quality letter names (N, NL: part 3; M, ML: part 4;
#: Q, QL, QL1: part 6); a W anywhere (J0W, J2W, K2W, J2WP) is weathering steel, part 5.
_PART_BY_FIRST_LETTER = {"N": "EN 10025-3", "M": "EN 10025-4", "Q": "EN 10025-6"}


def product_part(grade: str, quality: str = "") -> str:
    """The part of EN 10025 a steel belongs to, from its quality letters.

    Common practice, no source: the designation system of EN 10025-2 to -6 (JR/J0/J2/K2 are
    part 2, N/NL part 3, M/ML part 4, W weathering part 5, Q/QL part 6; a delivery condition
    after "+" does not change the part). Without quality letters: part 2 where the grade is in
    it (the part sections are rolled to), else the part with the lowest strengths.

    Example:
        >>> product_part("S355", "J2+N"), product_part("S355", "ML"), product_part("S460")
        ('EN 10025-2', 'EN 10025-4', 'EN 10025-4')
    """
    q = quality.upper().split("+")[0].strip()
    named = "EN 10025-5" if "W" in q else _PART_BY_FIRST_LETTER.get(q[:1], "")
    if (named, grade) in EN1993_1_1_TABLE_3_1:
        return named
    if ("EN 10025-2", grade) in EN1993_1_1_TABLE_3_1:
        return "EN 10025-2"
    parts = [k[0] for k in EN1993_1_1_TABLE_3_1 if k[1] == grade]
    if not parts:
        return ""
    return min(parts, key=lambda pt: EN1993_1_1_TABLE_3_1[(pt, grade)][1])

#: Minimum yield strength by nominal thickness, product standard EN 10025-2 (S235..S355) and
#: EN 10025-3/-4 (S420, S460), as upper thickness limits in mm -> fy. From memory.
PRODUCT_STANDARD_FY: dict[str, tuple[tuple[float, float], ...]] = {
    "S235": ((16, 235), (40, 225), (63, 215), (80, 215), (100, 215), (150, 195)),
    "S275": ((16, 275), (40, 265), (63, 255), (80, 245), (100, 235), (150, 225)),
    "S355": ((16, 355), (40, 345), (63, 335), (80, 325), (100, 315), (150, 295)),
    "S420": ((16, 420), (40, 400), (63, 390), (80, 370), (100, 360), (150, 340)),
    "S460": ((16, 460), (40, 440), (63, 430), (80, 410), (100, 400), (150, 380)),
}
#: Tensile strength for 3 <= t <= 100 mm in the same product standards. From memory.
PRODUCT_STANDARD_FU: dict[str, float] = {
    "S235": 360,
    "S275": 410,
    "S355": 470,
    "S420": 520,
    "S460": 540,
}

#: Bolt property classes, EN 1993-1-8:2005, Table 3.1: class -> (fyb, fub) in MPa.
BOLT_CLASSES: dict[str, tuple[float, float]] = {
    "4.6": (240, 400),
    "4.8": (320, 400),
    "5.6": (300, 500),
    "5.8": (400, 500),
    "6.8": (480, 600),
    "8.8": (640, 800),
    "10.9": (900, 1000),
}

# Old national names still found in models, mapped to the EN 10025 grade (common practice,
# no source).
_OLD_NAMES = {
    "FE360": "S235",
    "FE 360": "S235",
    "ST37": "S235",
    "ST 37": "S235",
    "ST37-2": "S235",
    "FE430": "S275",
    "FE 430": "S275",
    "ST44": "S275",
    "FE510": "S355",
    "FE 510": "S355",
    "ST52": "S355",
    "ST 52": "S355",
    "ST52-3": "S355",
}

_EN_GRADE = re.compile(r"(?<![A-Z0-9])S\s?(235|275|355|420|450|460)\s*([A-Z0-9+]*)", re.IGNORECASE)
_OLD = re.compile(
    r"(?<![A-Z0-9])(FE\s?(?:360|430|510)|ST\s?(?:37|44|52)(?:-\d)?)(?![0-9])", re.IGNORECASE
)
_FOREIGN = re.compile(
    r"(?<![A-Z0-9])(A\s?(?:36|572|992|913)|Q\s?(?:235|345|355|390|420|460)|"
    r"SS\s?400|SM\s?(?:400|490)|GR(?:ADE)?\.?\s?50)(?![0-9])",
    re.IGNORECASE,
)
_BOLT = re.compile(r"(?<![0-9.])(4\.6|4\.8|5\.6|5\.8|6\.8|8\.8|10\.9)(?![0-9])")
_BOLT_D = re.compile(r"(?<![A-Z0-9])M\s?(\d{1,2})(?:\s*[xX*]\s*(\d{2,3}))?(?![0-9])")


@dataclass(frozen=True, slots=True, kw_only=True)
class SteelGrade:
    """A structural steel grade as recognised, with its designation as found.

    Attributes:
        grade: EN 10025 strength grade (``S355``) or a foreign designation (``A992``).
        quality: sub-grade as found (``J2+N``, ``JR``, ``M``), may be empty.
        found_in: the text it was read from.
        en10025: True for an EN 10025 grade whose strengths ifcjoint knows.
    """

    grade: str
    quality: str = ""
    found_in: str = ""
    en10025: bool = True


def parse_steel_grade(*texts: str | None) -> SteelGrade | None:
    """The first steel grade found in the texts (material names, categories, descriptions).

    Example:
        >>> parse_steel_grade("Metall - Baustahl S235").grade
        'S235'
        >>> parse_steel_grade("S355J2+N").quality
        'J2+N'
    """
    for t in texts:
        if not t:
            continue
        m = _EN_GRADE.search(t)
        if m:
            return SteelGrade(grade=f"S{m.group(1)}", quality=m.group(2).upper(), found_in=t)
        m = _OLD.search(t)
        if m:
            key = re.sub(r"\s+", " ", m.group(1).upper())
            key = _OLD_NAMES.get(key) or _OLD_NAMES.get(key.replace(" ", ""))
            if key:
                return SteelGrade(grade=key, quality="", found_in=t)
        m = _FOREIGN.search(t)
        if m:
            return SteelGrade(
                grade=re.sub(r"\s+", "", m.group(1).upper()), found_in=t, en10025=False
            )
    return None


@dataclass(frozen=True, slots=True, kw_only=True)
class Strength:
    """Nominal strengths of a steel element and where they were read.

    Attributes:
        fy: yield strength, MPa.
        fu: ultimate strength, MPa.
        source: the table and row, e.g. ``EN 1993-1-1 Table 3.1 (EN 10025-2), t = 19 mm``.
    """

    fy: float
    fu: float
    source: str


def steel_strength(
    grade: str, t: float, *, basis: str = "EN 1993-1-1", quality: str = ""
) -> Strength:
    """Nominal fy, fu (MPa) of a grade for an element of thickness t (mm), with the table used.

    EN 1993-1-1:2005, 3.2.1(1) and Table 3.1 (``basis="EN 1993-1-1"``, the recommended
    simplification: steps at 40 and 80 mm, the row of the EN 10025 part the quality letters
    name); or the product standard EN 10025-2/-3/-4 (``basis="EN 10025"``, as some National
    Annexes require).

    Raises:
        ValueError: unknown grade, or thickness beyond the table (t > 80 mm for Table 3.1,
            t > 150 mm for the product standard, t > 100 mm for fu).

    Example:
        >>> steel_strength("S355", 19.0).fu
        510
        >>> steel_strength("S275", 25.0, basis="EN 10025").fy
        265
    """
    if t <= 0:
        raise ValueError(f"thickness must be positive, got {t}")
    if basis == "EN 1993-1-1":
        part = product_part(grade, quality)
        if not part:
            raise ValueError(f"grade {grade!r} is not in EN 1993-1-1 Table 3.1")
        low, high = EN1993_1_1_TABLE_3_1[(part, grade)]
        if t > 80:
            raise ValueError(f"t = {t} mm exceeds 80 mm, the limit of EN 1993-1-1 Table 3.1")
        fy, fu = low if t <= 40 else high
        return Strength(fy=fy, fu=fu, source=f"EN 1993-1-1 Table 3.1 ({part}), t = {t:g} mm")
    if basis == "EN 10025":
        if grade not in PRODUCT_STANDARD_FY:
            raise ValueError(f"grade {grade!r} has no product-standard table here")
        if t > 100:
            raise ValueError(f"t = {t} mm exceeds 100 mm, the limit of the fu table")
        for limit, fy in PRODUCT_STANDARD_FY[grade]:
            if t <= limit:
                return Strength(fy=fy, fu=PRODUCT_STANDARD_FU[grade],
                                source=f"EN 10025 product standard, t = {t:g} mm")
    raise ValueError(f"unknown strength basis {basis!r}")


def steel_strengths(grade: str, t: float, *, basis: str = "EN 1993-1-1") -> tuple[float, float]:
    """Nominal (fy, fu) in MPa of a grade for an element of thickness t (mm).

    EN 1993-1-1:2005, 3.2.1(1) and Table 3.1 (EN 10025-2 row when no quality is known), or
    the product standard; see ``steel_strength``.

    Example:
        >>> steel_strengths("S355", 19.0)
        (355, 510)
    """
    s = steel_strength(grade, t, basis=basis)
    return s.fy, s.fu


@dataclass(frozen=True, slots=True, kw_only=True)
class BoltSpec:
    """Bolt size and class as recognised from text or attributes."""

    d: float | None = None
    length: float | None = None
    bolt_class: str | None = None
    found_in: str = ""

    @property
    def fyb_fub(self) -> tuple[float, float] | None:
        """(fyb, fub) in MPa, EN 1993-1-8:2005, Table 3.1, or None when the class is unknown."""
        return BOLT_CLASSES.get(self.bolt_class or "")


def parse_bolt(*texts: str | None) -> BoltSpec:
    """Diameter, length and property class from texts like ``BOLT M20x70 8.8``.

    Example:
        >>> parse_bolt("M24x90 10.9")
        BoltSpec(d=24.0, length=90.0, bolt_class='10.9', found_in='M24x90 10.9')
    """
    d = length = cls = None
    where = ""
    for t in texts:
        if not t:
            continue
        if d is None:
            m = _BOLT_D.search(t)
            if m and 5 <= int(m.group(1)) <= 72:
                d = float(m.group(1))
                length = float(m.group(2)) if m.group(2) else None
                where = where or t
        if cls is None:
            m = _BOLT.search(t)
            if m:
                cls = m.group(1)
                where = where or t
    return BoltSpec(d=d, length=length, bolt_class=cls, found_in=where)
