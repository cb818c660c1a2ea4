"""Thicknesses steel plate is rolled and stocked in (mm).

Common practice, no source: EN 10029 sets tolerances on hot-rolled plate, not a list of
thicknesses; the lists below are the thicknesses plate merchants stock (metric, and the
inch fractions of imperial stock), recalled from memory. A connection plate of another
thickness has to be specially rolled or machined down: worth a look, not an error.
"""

from __future__ import annotations

#: Metric stock thicknesses, mm (from memory).
METRIC_STOCK: tuple[float, ...] = (
    5, 6, 8, 10, 12, 15, 18, 20, 22, 25, 30, 35, 40, 45, 50, 55, 60, 65, 70, 75, 80, 90, 100,
    110, 120, 130, 140, 150,
)
#: Imperial stock thicknesses, inches (from memory): 3/16 to 4 in.
IMPERIAL_STOCK_IN: tuple[float, ...] = (
    3 / 16, 1 / 4, 5 / 16, 3 / 8, 7 / 16, 1 / 2, 9 / 16, 5 / 8, 3 / 4, 7 / 8, 1.0, 1.125, 1.25,
    1.375, 1.5, 1.75, 2.0, 2.25, 2.5, 2.75, 3.0, 3.5, 4.0,
)
#: All stock thicknesses, mm.
STOCK_THICKNESSES: tuple[float, ...] = tuple(
    sorted({*map(float, METRIC_STOCK), *(round(x * 25.4, 3) for x in IMPERIAL_STOCK_IN)})
)


def nearest_stock_thickness(t: float) -> float:
    """The stock thickness nearest to t (mm).

    Example:
        >>> nearest_stock_thickness(19.0), nearest_stock_thickness(19.05)
        (19.05, 19.05)
    """
    return min(STOCK_THICKNESSES, key=lambda s: abs(s - t))


def is_stock_thickness(t: float, tolerance: float = 0.2) -> bool:
    """Whether t (mm) is a thickness plate is stocked in, within a modelling round-off."""
    return abs(nearest_stock_thickness(t) - t) <= tolerance
