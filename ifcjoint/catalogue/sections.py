"""I and H sections: dimensions, properties with the root radius, designations, catalogue.

Pure Python (no IFC). Units: mm, mm2, mm4, mm3.
"""

from __future__ import annotations

import csv
import io
import math
import re
from dataclasses import dataclass
from functools import cache
from importlib import resources


@dataclass(frozen=True, slots=True, kw_only=True)
class ISection:
    """A doubly symmetric I or H section.

    Attributes:
        h: overall depth, mm.
        b: flange width, mm.
        tw: web thickness, mm.
        tf: flange thickness, mm.
        r: root radius between web and flange, mm (0 for welded sections).
        name: designation (canonical form), or empty.
        source: where the dimensions came from (``profile``, ``catalogue``, ``outline``,
            ``designation``, ``mesh``).
    """

    h: float
    b: float
    tw: float
    tf: float
    r: float = 0.0
    name: str = ""
    source: str = ""

    @property
    def hw(self) -> float:
        """Web depth between flanges h - 2 tf, mm."""
        return self.h - 2 * self.tf

    @property
    def d(self) -> float:
        """Depth of straight web h - 2 tf - 2 r, mm (EN 1993-1-8 6.2.6.1: dc for rolled)."""
        return self.h - 2 * self.tf - 2 * self.r

    @property
    def A(self) -> float:  # the code's symbol
        """Area, mm2: 2 b tf + (h - 2 tf) tw + (4 - pi) r^2."""
        return 2 * self.b * self.tf + (self.h - 2 * self.tf) * self.tw + (4 - math.pi) * self.r**2

    @property
    def Avz(self) -> float:
        """Shear area parallel to the web, mm2.

        EN 1993-1-1:2005, 6.2.6(3)a: A - 2 b tf + (tw + 2 r) tf, not less than eta hw tw
        (eta = 1.0, conservative; the National Annex may give 1.2).
        """
        return max(
            self.A - 2 * self.b * self.tf + (self.tw + 2 * self.r) * self.tf, self.hw * self.tw
        )

    @property
    def Iy(self) -> float:
        """Second moment of area about the strong axis, mm4 (fillets as 4 spandrels)."""
        h, b, tw, tf, r = self.h, self.b, self.tw, self.tf, self.r
        rect = (b * h**3 - (b - tw) * (h - 2 * tf) ** 3) / 12
        return rect + _fillets_about(r, h / 2 - tf, along_depth=True)

    @property
    def Iz(self) -> float:
        """Second moment of area about the weak axis, mm4."""
        h, b, tw, tf, r = self.h, self.b, self.tw, self.tf, self.r
        rect = (2 * tf * b**3 + (h - 2 * tf) * tw**3) / 12
        return rect + _fillets_about(r, tw / 2, along_depth=False)

    @property
    def Wel_y(self) -> float:
        """Elastic section modulus about the strong axis, mm3."""
        return self.Iy / (self.h / 2)

    @property
    def Wpl_y(self) -> float:
        """Plastic section modulus about the strong axis, mm3 (twice the first moment of half)."""
        h, b, tw, tf, r = self.h, self.b, self.tw, self.tf, self.r
        flanges = b * tf * (h - tf)
        web = tw * (h - 2 * tf) ** 2 / 4
        return flanges + web + 2 * _fillet_area(r) * 2 * (h / 2 - tf - _fillet_centroid(r))

    @property
    def Wpl_z(self) -> float:
        """Plastic section modulus about the weak axis, mm3."""
        h, b, tw, tf, r = self.h, self.b, self.tw, self.tf, self.r
        flanges = tf * b**2 / 2
        web = (h - 2 * tf) * tw**2 / 4
        return flanges + web + 2 * _fillet_area(r) * 2 * (tw / 2 + _fillet_centroid(r))


def _fillet_area(r: float) -> float:
    """Area of one spandrel (square r x r less a quarter circle), mm2."""
    return (1 - math.pi / 4) * r * r


def _fillet_centroid(r: float) -> float:
    """Distance of a spandrel's centroid from each of its two straight edges, mm.

    The spandrel is the square r x r less the quarter circle of radius r centred at the
    square's far corner (first moments of the square and the quarter circle).
    """
    if r == 0:
        return 0.0
    a_sq, a_q = r * r, math.pi * r * r / 4
    # square centroid at r/2; quarter circle (centred at the far corner (r, r)) centroid at
    # r - 4r/(3 pi) from the same edges
    return (a_sq * r / 2 - a_q * (r - 4 * r / (3 * math.pi))) / (a_sq - a_q)


def _fillets_about(r: float, edge: float, *, along_depth: bool) -> float:
    """Second moment of the four spandrels about the section's centroidal axis, mm4.

    ``edge`` is the distance from the axis to the straight edge the spandrels sit on (inner
    flange face for the strong axis, web face for the weak axis).
    """
    if r == 0:
        return 0.0
    a = _fillet_area(r)
    c = _fillet_centroid(r)
    # own second moment of a spandrel about its centroid (parallel to the edge):
    # square about edge r^4/3, quarter circle (centre at distance r) about the edge:
    # I_c + A d^2 with I_c = (pi/16 - 4/(9 pi)) r^4 and d = r - 4r/(3pi)
    i_sq_edge = r**4 / 3
    dq = r - 4 * r / (3 * math.pi)
    i_q_edge = (math.pi / 16 - 4 / (9 * math.pi)) * r**4 + (math.pi * r * r / 4) * dq**2
    i_edge = i_sq_edge - i_q_edge
    i_own = i_edge - a * c * c
    dist = edge - c if along_depth else edge + c
    return 4 * (i_own + a * dist * dist)


# --- designations --------------------------------------------------------------------------

_EURO = re.compile(
    r"^\s*(?P<fam>IPE|HE|HD)\s*-?\s*(?P<size>\d{2,4})\s*(?P<suf>AA|A|B|M)?\s*$", re.IGNORECASE
)
_EURO_PREFIX = re.compile(r"^\s*(?P<fam>HEA|HEB|HEM)\s*-?\s*(?P<size>\d{2,4})\s*$", re.IGNORECASE)
_UK = re.compile(
    r"^\s*(?P<fam>UB|UC|UKB|UKC)\s*-?\s*(?P<a>\d+(?:\.\d+)?)\s*[xX*]\s*"
    r"(?P<b>\d+(?:\.\d+)?)\s*[xX*]\s*(?P<c>\d+(?:\.\d+)?)\s*$",
    re.IGNORECASE,
)
_UK_SUFFIX = re.compile(
    r"^\s*(?P<a>\d+)\s*[xX*]\s*(?P<b>\d+)\s*[xX*]\s*(?P<c>\d+(?:\.\d+)?)\s*"
    r"(?P<fam>UB|UC|UKB|UKC)\s*$",
    re.IGNORECASE,
)
_WELDED = re.compile(
    r"^\s*(?:H|I|WI|BH|PG)\s*-?\s*(?P<h>\d+(?:\.\d+)?)\s*[*xX/]\s*"
    r"(?P<b>\d+(?:\.\d+)?)\s*[*xX/]\s*(?P<tw>\d+(?:\.\d+)?)\s*[*xX/]\s*"
    r"(?P<tf>\d+(?:\.\d+)?)\s*$",
    re.IGNORECASE,
)
_FIND = re.compile(
    r"(IPE\s*-?\s*\d{2,4}|HE\s*-?\s*\d{2,4}\s*(?:AA|A|B|M)\b|HE[ABM]\s*-?\s*\d{2,4}"
    r"|(?:UKB|UKC|UB|UC)\s*-?\s*\d+\s*[xX*]\s*\d+\s*[xX*]\s*\d+(?:\.\d+)?"
    r"|\d+\s*[xX*]\s*\d+\s*[xX*]\s*\d+(?:\.\d+)?\s*(?:UKB|UKC|UB|UC)"
    r"|(?:H|I|WI|BH|PG)\s*-?\s*\d+(?:\.\d+)?(?:\s*[*xX/]\s*\d+(?:\.\d+)?){3})",
    re.IGNORECASE,
)


def _num(s: str) -> str:
    f = float(s)
    return str(int(f)) if f == int(f) else f"{f:g}"


def canonical_designation(text: str) -> str | None:
    """The canonical catalogue key of a designation, or None when it is not one we know.

    Handles ``HEA200``, ``HE200A``, ``HE 200 A``, ``HEA-200``, ``IPE 300``, ``IPE300``,
    ``UB 457x191x67``, ``457x191x67UB``, ``UKB 457x191x67``, and welded ``H440*300*11*18``.

    Example:
        >>> canonical_designation("HE 200 A")
        'HEA 200'
        >>> canonical_designation("H440*300*11*18")
        'H 440x300x11x18'
    """
    t = text.strip()
    m = _EURO.match(t)
    if m:
        fam, size, suf = m["fam"].upper(), m["size"], (m["suf"] or "").upper()
        if fam == "IPE" and not suf:
            return f"IPE {int(size)}"
        if fam in ("HE", "HD") and suf in ("A", "B", "M", "AA"):
            return f"HE{suf} {int(size)}"
        return None
    m = _EURO_PREFIX.match(t)
    if m:
        return f"{m['fam'].upper()} {int(m['size'])}"
    m = _UK.match(t) or _UK_SUFFIX.match(t)
    if m:
        fam = {"UKB": "UB", "UKC": "UC"}.get(m["fam"].upper(), m["fam"].upper())
        return f"{fam} {_num(m['a'])}x{_num(m['b'])}x{_num(m['c'])}"
    m = _WELDED.match(t)
    if m:
        return f"H {_num(m['h'])}x{_num(m['b'])}x{_num(m['tw'])}x{_num(m['tf'])}"
    return None


def find_designation(*texts: str | None) -> str | None:
    """The first section designation found anywhere in the texts (names, descriptions...)."""
    for t in texts:
        if not t:
            continue
        whole = canonical_designation(t)
        if whole:
            return whole
        for m in _FIND.finditer(t):
            c = canonical_designation(m.group(0))
            if c:
                return c
    return None


@cache
def catalogue() -> dict[str, ISection]:
    """The bundled catalogue (ifcjoint/data/sections.csv), keyed by canonical designation."""
    text = resources.files("ifcjoint").joinpath("data/sections.csv").read_text("utf-8")
    rows = [ln for ln in text.splitlines() if ln and not ln.startswith("#")]
    out = {}
    for row in csv.DictReader(io.StringIO("\n".join(rows))):
        key = canonical_designation(row["designation"])
        if key is None:
            raise ValueError(f"sections.csv: designation {row['designation']!r} not parsable")
        out[key] = ISection(
            h=float(row["h"]),
            b=float(row["b"]),
            tw=float(row["tw"]),
            tf=float(row["tf"]),
            r=float(row["r"]),
            name=key,
            source="catalogue",
        )
    return out


def section_from_designation(designation: str) -> ISection | None:
    """Catalogue section, or a welded section built from its designation, or None.

    Example:
        >>> section_from_designation("HE200A").h
        190.0
    """
    key = canonical_designation(designation)
    if key is None:
        return None
    if key in catalogue():
        return catalogue()[key]
    if key.startswith("H "):
        h, b, tw, tf = (float(x) for x in key[2:].split("x"))
        return ISection(h=h, b=b, tw=tw, tf=tf, r=0.0, name=key, source="designation")
    return None


def dimension_mismatch(
    model: ISection, named: ISection, *, tol_mm: float = 1.0, tol_rel: float = 0.02
) -> dict[str, tuple[float, float]]:
    """Dimensions where the model and the named section differ beyond a tolerance.

    A difference counts when it exceeds both ``tol_mm`` and ``tol_rel`` of the named value
    (common practice, no source: rolling tolerances are of this order). The root radius is
    compared only when the model gives one.

    Returns:
        ``{dimension: (model value, named value)}``, empty when they agree.
    """
    out = {}
    for k in ("h", "b", "tw", "tf", "r"):
        a, b = getattr(model, k), getattr(named, k)
        if k == "r" and (a == 0 or model.source not in ("profile",)):
            continue
        if abs(a - b) > tol_mm and abs(a - b) > tol_rel * max(abs(b), 1e-9):
            out[k] = (a, b)
    return out
