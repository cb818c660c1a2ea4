"""Weld sizes written in names: the throat ``a`` or the leg of a fillet weld (mm).

Common practice, no source: in EN usage ``a5`` or ``a = 5`` is the throat; ``z``, ``s`` or
"leg" is the leg length; a bare "fillet 6" or "6 mm fillet" is the leg (the size a UK
drawing gives). For a fillet with equal legs, a = leg / sqrt(2).
"""

from __future__ import annotations

import math
import re

# lower-case a, z, s as drawings write them (an upper-case "A1" is a grid, not a weld)
_THROAT = re.compile(r"(?<![A-Za-z0-9])a\s*=?\s*(\d+(?:[.,]\d+)?)(?:\s*mm)?(?![0-9])")
_LEG = re.compile(
    r"(?<![A-Za-z0-9])(?:z|s|[Ll]eg)\s*=?\s*(\d+(?:[.,]\d+)?)(?:\s*mm)?(?![0-9])")
_FILLET = re.compile(r"fillet(?:\s*weld)?\s*(\d+(?:[.,]\d+)?)|(\d+(?:[.,]\d+)?)\s*mm\s*fillet",
                     re.I)


def _num(s: str) -> float:
    return float(s.replace(",", "."))


def parse_weld_size(*texts: str | None) -> tuple[float | None, str]:
    """The throat a (mm) written in a weld's texts, and how it was written.

    Example:
        >>> parse_weld_size("Fillet weld a8")
        (8.0, 'throat a in the name')
        >>> round(parse_weld_size("fillet 6")[0], 2)
        4.24
    """
    for t in texts:
        if not t:
            continue
        m = _THROAT.search(t)
        if m:
            return _num(m.group(1)), "throat a in the name"
        m = _LEG.search(t)
        if m:
            return _num(m.group(1)) / math.sqrt(2), "leg in the name (a = leg / sqrt 2)"
        m = _FILLET.search(t)
        if m:
            return _num(m.group(1) or m.group(2)) / math.sqrt(2), (
                "fillet size in the name taken as the leg (a = leg / sqrt 2)")
    return None, ""
