"""Joint descriptions: what a description may leave out, and how it is filled."""

from __future__ import annotations

import pytest

from ifcjoint.archetypes.builders import assumed_welds
from ifcjoint.archetypes.description import (
    DescriptionError,
    archetype_of,
    demands_from_description,
    input_from_description,
    normal_hole,
)
from ifcjoint.engine.inputs import EndPlateJointInput, WeldedJointInput
from ifcjoint.engine.settings import CheckSettings
from ifcjoint.model.codes import Archetype


def base(**kw) -> dict:
    d = {
        "column": {"name": "HEB 300", "grade": "S355"},
        "beam": {"name": "IPE 400", "grade": "S275JR"},
        "plate": {"tp": 20, "bp": 180, "projection_top": 0, "projection_bottom": 0},
        "bolts": {"d": 20, "grade": "8.8", "gauge": 100,
                  "rows_from_beam_top": [60.0, 150.0, 320.0]},
    }
    d.update(kw)
    return d


def test_catalogue_section_and_table_3_1_strengths():
    inp = input_from_description(base())
    # HEB 300: 300 x 300 x 11 x 19, r 27 (EN 10365, from memory)
    c = inp.column
    assert (c.h, c.b, c.tw, c.tf, c.r) == (300, 300, 11, 19, 27)
    # EN 1993-1-1 Table 3.1, EN 10025-2, t <= 40 mm: S355 355 / 510, S275 275 / 430
    assert (c.fy, c.fu, inp.beam.fy, inp.beam.fu) == (355, 510, 275, 430)
    assert "Table 3.1" in c.strength_source and inp.beam.grade == "S275"
    assert c.Iy > 0 and c.Wpl_y > 0
    assert isinstance(inp, EndPlateJointInput)
    assert archetype_of(inp) == Archetype.FLUSH_END_PLATE


def test_bolts_filled_by_size_and_class():
    b = input_from_description(base()).bolts
    # EN 1993-1-8 Table 3.1 fub 800 for 8.8; As 245 mm2 for M20 (ISO 898-1, from memory);
    # normal hole d0 = 22 (EN 1090-2 Table 11, from memory)
    assert (b.fub, b.As, b.d0) == (800, 245, 22)
    assert [normal_hole(d) for d in (12, 20, 24, 27, 30)] == [13, 22, 26, 30, 33]


def test_welds_left_out_are_the_checks_assumed_welds():
    inp = input_from_description(base())
    assert inp.welds == assumed_welds(inp.beam, CheckSettings())
    given = input_from_description(base(welds={"flange_throat": 7, "web_throat": 5}))
    w = given.welds
    assert (w.top_flange_throat, w.bottom_flange_throat, w.web_throat, w.assumed) == (7, 7, 5,
                                                                                       False)


def test_plate_height_and_projections_follow_each_other():
    p = input_from_description(base(plate={"tp": 20, "bp": 180, "projection_top": 90,
                                           "projection_bottom": 15})).plate
    assert p.hp == pytest.approx(400 + 90 + 15)
    p = input_from_description(base(plate={"tp": 20, "bp": 180, "projection_top": 90,
                                           "hp": 520})).plate
    assert p.projection_bottom == pytest.approx(520 - 90 - 400)


def test_an_extended_plate_and_a_welded_joint():
    ext = base(plate={"tp": 20, "bp": 180, "projection_top": 90, "projection_bottom": 15})
    ext["bolts"]["rows_from_beam_top"] = [-45.0, 60.0, 150.0, 320.0]
    assert archetype_of(input_from_description(ext)) == Archetype.EXTENDED_END_PLATE
    welded = base()
    del welded["plate"], welded["bolts"]
    inp = input_from_description(welded)
    assert isinstance(inp, WeldedJointInput) and archetype_of(inp) == Archetype.WELDED


@pytest.mark.parametrize("change, key", [
    (lambda d: d.pop("bolts"), "bolts"),
    (lambda d: d["column"].update(fy="high"), "column.fy"),
    (lambda d: d["bolts"].update(rows_from_beam_top=[150.0, 60.0]), "bolts.rows_from_beam_top"),
    (lambda d: d.update(alpha_method="guess"), "alpha_method"),
    (lambda d: d.update(beta=3), "beta"),
    (lambda d: d.update(stiffeners=[{"level": 10, "t": 10}]), "stiffeners[0].b"),
    (lambda d: d.update(params={"gamma_M7": 1.1}), "params.gamma_M7"),
    (lambda d: d["beam"].update(grade="S999"), "beam.grade"),
])
def test_errors_name_the_key(change, key):
    d = base()
    change(d)
    with pytest.raises(DescriptionError) as exc:
        input_from_description(d)
    assert exc.value.key == key


def test_demands_in_kn_and_knm_become_n_and_nmm():
    (d,) = demands_from_description(
        {"demands": [{"combination": "A", "M_Ed_kNm": -120, "V_Ed_kN": -80, "N_Ed_kN": 10,
                      "frame": "unbraced", "assumed_joint": "rigid"}]}, "j.toml")
    assert (d.M_Ed, d.V_Ed, d.N_Ed, d.braced) == (-120e6, 80e3, 10e3, False)
    assert d.source == "j.toml:demands[0]"
    with pytest.raises(DescriptionError) as exc:
        demands_from_description({"demands": [{"combination": "A", "M_Ed_kNm": 1,
                                                "V_Ed_kN": 1, "frame": "sway"}]})
    assert exc.value.key == "demands[0].frame"
