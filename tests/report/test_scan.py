"""Renderers: CSV cells from the model cannot run as spreadsheet formulas; writes are atomic."""

from __future__ import annotations

import json

import jsonschema
import pandas as pd

from ifcjoint.fileio import safe_cell
from ifcjoint.find import find_joints
from ifcjoint.model.elements import Member, ModelContents
from ifcjoint.report.scan import build_scan, write_scan_csv, write_scan_json
from tests.conftest import ROOT


def _result(storey: str):
    col = Member(guid="C", ifc_class="IfcColumn", name="c", kind="column", start=(0, 0, 0),
                 end=(0, 0, 8000), depth_dir=(1.0, 0, 0), width_dir=(0, -1.0, 0), depth=260,
                 width=260, steel="steel", storey=storey)
    beam = Member(guid="B", ifc_class="IfcBeam", name="b", kind="beam", start=(150, 0, 3800),
                  end=(6000, 0, 3800), depth_dir=(0, 0, 1.0), width_dir=(0, 1.0, 0), depth=400,
                  width=180, steel="steel", storey=storey)
    m = ModelContents(path="mem", schema="TEST", length_unit_to_mm=1.0, members=(col, beam))
    return find_joints(m)


def test_formula_like_model_text_is_neutralised_in_csv(tmp_path):
    r = _result('=HYPERLINK("http://x")')
    p = tmp_path / "o.csv"
    write_scan_csv(build_scan(r), p)
    df = pd.read_csv(p)
    assert df.loc[0, "storey"].startswith("'=")
    assert df.loc[0, "label"].startswith("'=")
    assert safe_cell("+1") == "'+1" and safe_cell("@a") == "'@a" and safe_cell("ok") == "ok"
    assert safe_cell(-3.5) == -3.5  # numbers stay numbers


def test_json_has_tool_model_and_joint_fields(tmp_path):
    r = _result("Level 1")
    d = build_scan(r)
    assert d["tool"]["name"] == "ifcjoint"
    j = d["joints"][0]
    assert (j["beam"], j["beam_end"], j["column"], j["axis"]) == ("B", "start", "C", "major")
    p = tmp_path / "sub" / "o.json"
    write_scan_json(build_scan(r), p)
    assert p.exists() and not list(p.parent.glob(".*tmp"))


def test_csv_side_is_a_number_not_a_formula_lookalike(tmp_path):
    r = _result("Level 1")
    p = tmp_path / "s.csv"
    write_scan_csv(build_scan(r), p)
    df = pd.read_csv(p)
    assert list(df["side_sign"]) == [1]


def test_results_json_validates_against_both_schemas(demo_check):
    # The results JSON is the scan JSON plus each joint's check: both schemas hold.
    from ifcjoint.report.results import build_results

    data = json.loads(json.dumps(build_results(demo_check)))
    scan_schema = json.loads((ROOT / "docs" / "scan-json.schema.json").read_text())
    res_schema = json.loads((ROOT / "docs" / "results-json.schema.json").read_text())
    jsonschema.validate(data, scan_schema)
    jsonschema.validate(data, res_schema)


def test_results_json_is_strict_when_a_resistance_is_zero(demo_check, tmp_path):
    # A zero resistance gives an infinite utilisation: written as null, status still fail.
    import dataclasses

    from ifcjoint.report.results import build_results, write_results_json

    jc = next(j for j in demo_check.joints if j.verdict.combinations)
    c0 = jc.verdict.combinations[0]
    bad_u = dataclasses.replace(c0.utilisations[0], utilisation=float("inf"))
    c_bad = dataclasses.replace(c0, utilisations=(bad_u, *c0.utilisations[1:]))
    v = dataclasses.replace(jc.verdict, status="fail", combinations=(c_bad,))
    mc = dataclasses.replace(demo_check, joints=tuple(
        dataclasses.replace(x, verdict=v) if x is jc else x for x in demo_check.joints))
    out = tmp_path / "r.json"
    write_results_json(build_results(mc), out)
    data = json.loads(out.read_text())  # strict JSON: no Infinity
    j = next(x for x in data["joints"] if x["id"] == jc.joint.id)
    assert j["check"]["status"] == "fail" and j["check"]["utilisation"] is None
