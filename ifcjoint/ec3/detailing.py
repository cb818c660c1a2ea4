"""Detailing limits for bolted joints: spacing, edge distances, holes, grip.

Pure functions over floats (mm). Each docstring's second line names its source. Rules that are
common practice rather than code clauses say so.
"""

from __future__ import annotations

#: Normal round-hole clearance by bolt diameter, EN 1090-2 Table 11 (from memory):
#: M12 and M14: 1 mm (2 mm also allowed when coated); M16 to M24: 2 mm; M27 and larger: 3 mm.
_NORMAL_CLEARANCE = ((14.0, 1.0), (24.0, 2.0), (1e9, 3.0))


def e_min(d0: float) -> float:
    """Minimum end or edge distance e1, e2 = 1.2 d0 (mm).

    EN 1993-1-8:2005, 3.5(1), Table 3.3.

    Args:
        d0: hole diameter, mm.
    """
    return 1.2 * d0


def p1_min(d0: float) -> float:
    """Minimum spacing p1 in the direction of load transfer = 2.2 d0 (mm).

    EN 1993-1-8:2005, 3.5(1), Table 3.3.

    Args:
        d0: hole diameter, mm.
    """
    return 2.2 * d0


def p2_min(d0: float) -> float:
    """Minimum spacing p2 perpendicular to load transfer = 2.4 d0 (mm).

    EN 1993-1-8:2005, 3.5(1), Table 3.3.

    Args:
        d0: hole diameter, mm.
    """
    return 2.4 * d0


def p_max(t: float) -> float:
    """Maximum spacing p1, p2 = min(14 t, 200 mm) (mm).

    EN 1993-1-8:2005, 3.5(1), Table 3.3 (steel exposed or not exposed to the weather).

    Args:
        t: thickness of the thinner outer connected part, mm.
    """
    return min(14.0 * t, 200.0)


def normal_hole_clearance(d: float) -> float:
    """Nominal clearance of a normal round hole for a bolt of diameter d (mm).

    EN 1090-2, 6.6.1 and Table 11 (values from memory).

    Args:
        d: bolt nominal diameter, mm.
    """
    for limit, c in _NORMAL_CLEARANCE:
        if d <= limit:
            return c
    return 3.0


def required_bolt_length(grip: float, d: float) -> float:
    """Shortest bolt that closes a grip with two washers, a nut and one thread beyond it (mm).

    Common practice, no source: two washers of 4 mm, nut height 0.9 d (preloadable nuts are of
    this order), and a protrusion of at least one thread pitch taken as 0.15 d.

    Args:
        grip: total thickness of the plies clamped, mm.
        d: bolt diameter, mm.
    """
    return grip + 2 * 4.0 + 0.9 * d + 0.15 * d


def plate_thickness_plausible(tp: float, d: float) -> tuple[float, float]:
    """Plausible end-plate thickness range for a bolt diameter: (0.5 d, 1.5 d) (mm).

    Common practice, no source: a rule of thumb for end plates; thinner plates bend before the
    bolts work, thicker ones make the joint brittle. Not a code limit.

    Args:
        tp: plate thickness, mm (not used for the range, kept for a uniform signature).
        d: bolt diameter, mm.
    """
    del tp
    return 0.5 * d, 1.5 * d


def washer_half_width(d: float) -> float:
    """Half the outside diameter of a washer for bolt diameter d: about 0.93 d (mm).

    Common practice, no source: washers to EN 14399-6 are about 1.85 d across. Used as the
    room a nut or bolt head needs beside a web's root radius or weld.

    Args:
        d: bolt diameter, mm.
    """
    return 0.93 * d
