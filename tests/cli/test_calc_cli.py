"""``ifcjoint calc``: one joint from a description; a scanned joint exported and re-run."""

from __future__ import annotations

import json
import tomllib

import jsonschema
import pytest
from click.testing import CliRunner

from ifcjoint.cli import main
from ifcjoint.tables.joint_file import joint_file_schema
from tests.conftest import DEMO_CREATED

MINIMAL = """
label = "Grid 3/C, level 2"
[column]
name = "HEB 300"
grade = "S355"
[beam]
name = "IPE 450"
grade = "S355"
span_mm = 7200
[plate]
tp = 20
bp = 200
projection_top = 80
projection_bottom = 15
[bolts]
d = 20
grade = "10.9"
gauge = 100
rows_from_beam_top = [-40.0, 70.0, 150.0, 380.0]
[[demands]]
combination = "ULS-A"
M_Ed_kNm = -180.0
V_Ed_kN = 120.0
"""


def run(*args):
    return CliRunner().invoke(main, [str(a) for a in args])


def test_a_minimal_description_prints_its_sheet(tmp_path):
    f = tmp_path / "j.toml"
    f.write_text(MINIMAL)
    html, js = tmp_path / "j.html", tmp_path / "j.json"
    r = run("calc", f, "--html", html, "--json", js, "--timestamp", DEMO_CREATED)
    assert r.exit_code == 0, r.output
    out = r.output
    # what was filled is shown: catalogue dimensions, Table 3.1 strengths, bolt area and hole
    assert "HEB 300 S355: h 300.0, b 300.0, tw 11.0, tf 19.0" in out
    assert "EN 1993-1-1 Table 3.1 (EN 10025-2), t = 19 mm" in out
    assert "M20 class 10.9 (fub 1000 MPa), As 245 mm2, d0 22" in out
    assert "(assumed: not modelled)" in out  # welds not given: the check's full-strength welds
    for heading in ("1. Inputs", "2. Demands", "3. Components", "4. Effective tension",
                    "5. Resistance", "6. Utilisation per combination"):
        assert heading in out
    assert "qualified engineer" in out
    data = json.loads(js.read_text())
    c = data["joints"][0]["check"]
    assert c["status"] in ("pass", "fail")
    g = c["governing"]
    assert g["clause"] and g["combination"] == "ULS-A"
    assert f"{c['utilisation']:.3f}" in out
    page = html.read_text()
    assert "Grid 3/C, level 2" in page and data["caution"] in page and "<details" in page


def test_failing_joint_and_the_gate(tmp_path):
    f = tmp_path / "j.toml"
    f.write_text(MINIMAL.replace("M_Ed_kNm = -180.0", "M_Ed_kNm = -900.0"))
    r = run("calc", f, "-q")
    assert r.exit_code == 0  # default: report only
    r = run("calc", f, "--fail-on", "fail")
    assert r.exit_code == 1 and ": fail, utilisation" in r.output


@pytest.mark.parametrize("change, key", [
    (("grade = \"10.9\"", "grade = \"10.9\"\ngage = 90"), "bolts.gage"),
    (("tp = 20", "tp = -20"), "plate.tp"),
    (("name = \"HEB 300\"", "name = \"HEB 999\""), "column.h"),
    (("M_Ed_kNm = -180.0", "M_Ed_kNm = \"big\""), "demands[0].M_Ed_kNm"),
    (("grade = \"10.9\"", "grade = \"12.9\""), "bolts.grade"),
])
def test_a_bad_value_names_its_file_and_key(tmp_path, change, key):
    f = tmp_path / "j.toml"
    f.write_text(MINIMAL.replace(*change))
    r = run("calc", f)
    assert r.exit_code == 3, r.output
    assert f"{f}: {key}:" in r.output


def test_unusable_files_and_outputs(tmp_path):
    assert run("calc", tmp_path / "none.toml").exit_code == 3
    bad = tmp_path / "bad.toml"
    bad.write_text("[column\nname =")
    r = run("calc", bad)
    assert r.exit_code == 3 and "not valid TOML" in r.output
    f = tmp_path / "j.json"
    f.write_text("{}")
    r = run("calc", f, "--json", f)
    assert r.exit_code == 2 and "is the description; an output never replaces an input" in r.output
    assert f.read_text() == "{}"  # never overwritten
    assert run("calc").exit_code == 2


def test_scanned_joints_export_and_rerun_to_the_same_numbers(tmp_path, demo_check):
    # The description is the results JSON's `inputs` with the joint's demands: exporting a
    # checked joint and calculating it again gives the same resistances, stiffness, status
    # and utilisation (one calculation path). Every export validates against the schema.
    results = tmp_path / "r.json"
    results.write_text(json.dumps(demo_check.results))
    schema = joint_file_schema()
    done = 0
    for j in demo_check.results["joints"]:
        c = j["check"]
        if c["engine_status"] != "checked":
            continue
        if "fin_plate" in j["archetype"]:  # not describable yet: said so, exit 3
            r = run("calc", "--from", results, "--joint", j["id"], "-q")
            assert r.exit_code == 3 and "fin plate" in r.output
            continue
        ext = ".toml" if done % 2 == 0 else ".json"
        desc = tmp_path / f"{j['id']}{ext}"
        r = run("calc", "--from", results, "--joint", j["id"], "--out", desc, "-q")
        assert r.exit_code == 0, r.output
        text = desc.read_text()
        data = tomllib.loads(text) if ext == ".toml" else json.loads(text)
        jsonschema.validate(data, schema)
        out = tmp_path / f"{j['id']}.out.json"
        r = run("calc", desc, "--json", out, "-q")
        assert r.exit_code == 0, r.output
        again = json.loads(out.read_text())["joints"][0]["check"]
        assert again["resistance"] == c["resistance"], j["id"]
        if not c["detailing_failures"]:
            # a joint failing detailing the description cannot show (bolt length, the plate
            # off the face ...) is compared by its numbers only
            assert again["status"] == c["status"], j["id"]
            assert again["utilisation"] == c["utilisation"], j["id"]
        if again["detailing_failures"]:  # what a description shows, the model showed too
            assert c["status"] == "fail", j["id"]
        assert again["classification"] == c["classification"], j["id"]
        done += 1
    assert done >= 20


def test_export_by_label_and_its_errors(tmp_path, demo_check):
    results = tmp_path / "r.json"
    results.write_text(json.dumps(demo_check.results))
    checked = [j for j in demo_check.results["joints"] if j["check"]["engine_status"] ==
               "checked"]
    labels = [j["label"] for j in checked]
    unique = next(lb for lb in labels if labels.count(lb) == 1 and
                  sum(x["label"] == lb for x in demo_check.results["joints"]) == 1)
    r = run("calc", "--from", results, "--joint", unique)
    assert r.exit_code == 0, r.output
    assert tomllib.loads(r.output)["label"] == unique  # TOML on stdout
    r = run("calc", "--from", results, "--joint", "J-nope")
    assert r.exit_code == 2 and "is not a joint id or label" in r.output
    unchecked = next(j for j in demo_check.results["joints"]
                     if j["check"]["engine_status"] != "checked")
    r = run("calc", "--from", results, "--joint", unchecked["id"])
    assert r.exit_code == 3 and "no engine input" in r.output


def test_the_bundled_schema_is_a_valid_json_schema():
    jsonschema.Draft202012Validator.check_schema(joint_file_schema())
