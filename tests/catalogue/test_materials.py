"""Steel grades and bolt classes.

Sources: EN 1993-1-1:2005 Table 3.1 (structural steel, t <= 40 and 40 < t <= 80 mm);
EN 10025-2:2004 Table 7 (yield by thickness) for the product-standard basis; EN 1993-1-8:2005
Table 3.1 (bolt classes). Table values from memory; the S275 product-standard pair at
16 < t <= 40 mm (265 / 410 MPa) is also stated in ../shared/reference (Source A conventions).
"""

from __future__ import annotations

import pytest

from ifcjoint.catalogue.materials import (
    parse_bolt,
    parse_steel_grade,
    product_part,
    steel_strength,
    steel_strengths,
)


# EN 1993-1-1:2005 Table 3.1, EN 10025-2 rows (from memory; S355 fu = 510 / 470 MPa as the
# engine-truth review recalls it too).
@pytest.mark.parametrize("grade, t, fy, fu", [
    ("S235", 40.0, 235, 360), ("S235", 40.01, 215, 360),
    ("S275", 40.0, 275, 430), ("S275", 40.01, 255, 410),
    ("S355", 40.0, 355, 510), ("S355", 40.01, 335, 470), ("S355", 80.0, 335, 470),
])
def test_en1993_1_1_table_3_1_at_thickness_boundaries(grade, t, fy, fu):
    assert steel_strengths(grade, t) == (fy, fu)


# EN 1993-1-1:2005 Table 3.1, rows of EN 10025-3 (N) and -4 (M), from memory.
@pytest.mark.parametrize("grade, quality, t, fy, fu", [
    ("S460", "N", 40.0, 460, 540), ("S460", "NL", 40.01, 430, 540),
    ("S460", "M", 40.01, 430, 530), ("S355", "M", 20.0, 355, 470),
    ("S355", "N", 20.0, 355, 490), ("S355", "J2+N", 20.0, 355, 510),
])
def test_table_3_1_row_follows_the_quality_letters(grade, quality, t, fy, fu):
    s = steel_strength(grade, t, quality=quality)
    assert (s.fy, s.fu) == (fy, fu)
    assert "Table 3.1" in s.source and product_part(grade, quality) in s.source


def test_a_grade_without_quality_letters_takes_the_lowest_row_it_may_be():
    # S460 is not in EN 10025-2: with no letters the lower of parts 3 and 4 applies
    # (common practice, no source: a safe reading when the delivery condition is unknown).
    s = steel_strength("S460", 50.0)
    assert (s.fy, s.fu) == (430, 530)


@pytest.mark.parametrize("grade, t, fy, fu", [
    ("S235", 16.0, 235, 360), ("S235", 16.01, 225, 360),
    ("S275", 16.0, 275, 410), ("S275", 16.01, 265, 410), ("S275", 25.0, 265, 410),
    ("S355", 16.0, 355, 470), ("S355", 40.0, 345, 470), ("S355", 40.01, 335, 470),
    ("S460", 16.0, 460, 540), ("S460", 63.0, 430, 540),
])
def test_product_standard_by_thickness(grade, t, fy, fu):
    assert steel_strengths(grade, t, basis="EN 10025") == (fy, fu)


def test_beyond_the_tables_is_an_error_not_a_guess():
    with pytest.raises(ValueError, match="80 mm"):
        steel_strengths("S355", 81.0)
    with pytest.raises(ValueError, match="not in EN 1993-1-1"):
        steel_strengths("A992", 10.0)


@pytest.mark.parametrize("text, grade, quality", [
    ("S355", "S355", ""), ("S355J2+N", "S355", "J2+N"), ("S275JR", "S275", "JR"),
    ("S460M", "S460", "M"), ("structural steel S235", "S235", ""),
    ("Metall - Baustahl S235", "S235", ""), ("acier S 355 J0", "S355", "J0"),
    ("Fe 510", "S355", ""), ("St37-2", "S235", ""),
])
def test_grade_in_free_text(text, grade, quality):
    g = parse_steel_grade(text)
    assert (g.grade, g.quality, g.en10025) == (grade, quality, True)


def test_foreign_and_missing_grades():
    assert parse_steel_grade("ASTM A992").en10025 is False
    assert parse_steel_grade("Steel_Undefined", None) is None
    assert parse_steel_grade("", "05 Staal - RAL 7016") is None


@pytest.mark.parametrize("text, d, length, cls, fub", [
    ("BOLT M20x70 8.8", 20, 70, "8.8", 800), ("M24 10.9", 24, None, "10.9", 1000),
    ("Bolt assembly M16*50 4.6", 16, 50, "4.6", 400), ("HV M 20 x 80 10.9", 20, 80, "10.9", 1000),
])
def test_bolt_text(text, d, length, cls, fub):
    b = parse_bolt(text)
    assert (b.d, b.length, b.bolt_class) == (d, length, cls)
    assert b.fyb_fub[1] == fub
