"""Tolerances of the joint finder (mm, degrees)."""

from __future__ import annotations

from dataclasses import dataclass


@dataclass(frozen=True, slots=True, kw_only=True)
class FinderSettings:
    """Tolerances of the joint finder (mm, degrees). Defaults are common practice, no source.

    Attributes:
        tolerance: how far (mm) a beam end may miss a column face or section and still count.
        end_plate_allowance: extra room (mm) for a beam stopping short of the face by an end
            plate's thickness plus a site gap (end plates rarely exceed 50 mm).
        max_slope_deg: steepest beam (degrees from horizontal) still treated as a beam framing
            into a column side; steeper members are braces.
        part_margin: how far (mm) beyond the beam depth and flange width plates and bolts of a
            joint may lie (extended end plates project 100-200 mm beyond the flange).
        pair_level_tolerance: how far apart (mm) two beam ends on opposite faces may be in
            height and still form one double-sided joint, as a fraction of the smaller beam
            depth when below 1, in mm otherwise.
    """

    tolerance: float = 20.0
    end_plate_allowance: float = 60.0
    max_slope_deg: float = 30.0
    part_margin: float = 300.0
    pair_level_tolerance: float = 0.5
