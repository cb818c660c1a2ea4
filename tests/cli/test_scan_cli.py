"""`ifcjoint scan` through click's CliRunner: exit codes, messages, written outputs."""

from __future__ import annotations

import json
import zipfile

import jsonschema
import pandas as pd
import pytest
from click.testing import CliRunner

from ifcjoint.cli import main
from tests.conftest import ROOT, SAMPLES

DEMO = SAMPLES / "kestrel-workshop-ifc4-mm.ifc"
SCHEMA = json.loads((ROOT / "docs" / "scan-json.schema.json").read_text())


def run(*args):
    return CliRunner().invoke(main, list(map(str, args)))


def test_scan_demo_prints_summary_and_writes_json_and_csv(tmp_path):
    js, csv = tmp_path / "j.json", tmp_path / "j.csv"
    r = run("scan", DEMO, "--json", js, "--csv", csv)
    assert r.exit_code == 0, r.output
    assert "Beam-to-column joints: 53" in r.output
    assert "double-sided pairs 17" in r.output
    assert "qualified engineer" in r.output  # the caution is always printed
    data = json.loads(js.read_text())
    jsonschema.validate(data, SCHEMA)
    assert data["model"]["schema"] == "IFC4"
    assert len(data["joints"]) == 56
    df = pd.read_csv(csv)
    assert list(df["joint_id"]) == [j["id"] for j in data["joints"]]


def test_scan_ifczip(tmp_path):
    z = tmp_path / "demo.ifczip"
    with zipfile.ZipFile(z, "w", zipfile.ZIP_DEFLATED) as zf:
        zf.write(DEMO, "demo.ifc")
    r = run("scan", z, "--brief")
    assert r.exit_code == 0, r.output
    assert "Beam-to-column joints: 53" in r.output


@pytest.mark.parametrize(
    "content, message",
    [
        (None, "file not found"),
        (b"hello, this is not a model\n", "not an IFC file"),
        (b"ISO-10303-21;\nHEADER;\nFILE_SCHEMA(('IFC5'));\nENDSEC;\nDATA;\nENDSEC;\n"
         b"END-ISO-10303-21;\n", "unsupported schema 'IFC5'"),
    ],
    ids=["missing", "not-ifc", "unsupported-schema"],
)
def test_bad_input_gives_one_clear_message_and_exit_3(tmp_path, content, message):
    p = tmp_path / "bad.ifc"
    if content is not None:
        p.write_bytes(content)
    r = run("scan", p)
    assert r.exit_code == 3
    assert message in r.output and str(p) in r.output
    assert "Traceback" not in r.output


def test_truncated_file_exit_3(tmp_path):
    raw = DEMO.read_bytes()
    p = tmp_path / "cut.ifc"
    p.write_bytes(raw[: len(raw) // 2])
    r = run("scan", p)
    assert r.exit_code == 3 and "truncated" in r.output


def test_damaged_zip_exit_3(tmp_path):
    p = tmp_path / "bad.ifczip"
    p.write_bytes(b"PK\x03\x04" + b"\x00" * 64)
    r = run("scan", p)
    assert r.exit_code == 3 and "zip" in r.output


def test_model_without_length_unit_is_reported_not_assumed(tmp_path):
    import ifcopenshell

    f = ifcopenshell.open(str(DEMO))
    for proj in f.by_type("IfcProject"):
        proj.UnitsInContext = None
    p = tmp_path / "nounit.ifc"
    f.write(str(p))
    r = run("scan", p)
    assert r.exit_code == 3 and "no length unit" in r.output and "--length-unit" in r.output
    r = run("scan", p, "--length-unit", "mm", "--brief")
    assert r.exit_code == 0 and "(assumed)" in r.output


def test_model_with_no_steel_exit_4(tmp_path):
    import ifcopenshell
    import ifcopenshell.api.root
    import ifcopenshell.api.unit

    f = ifcopenshell.file(schema="IFC4")
    ifcopenshell.api.root.create_entity(f, ifc_class="IfcProject", name="empty")
    ifcopenshell.api.unit.assign_unit(f)
    p = tmp_path / "empty.ifc"
    f.write(str(p))
    js = tmp_path / "e.json"
    r = run("scan", p, "--json", js)
    assert r.exit_code == 4 and "no steel beams or columns" in r.output
    assert json.loads(js.read_text())["joints"] == []  # outputs are still written


def test_bad_option_values_are_usage_errors():
    assert run("scan", DEMO, "--tolerance", "-5").exit_code == 2
    assert run("scan", DEMO, "--length-unit", "furlong").exit_code == 2


def test_bad_rules_file_exit_3(tmp_path):
    rules = tmp_path / "rules.toml"
    rules.write_text("[steel]\nmaterial_patterns = ['(unclosed']\n")
    r = run("scan", DEMO, "--rules", rules)
    assert r.exit_code == 3 and "bad pattern" in r.output


def test_user_rules_extend_bundled_rules(tmp_path):
    # A proxy called "Verbindungsmittel" (German: fastener) is not known to the bundled rules.
    from ifcjoint.ifc.recognition import load_rules

    rules = tmp_path / "rules.toml"
    rules.write_text(
        "[[fasteners.rule]]\nclasses = ['IfcBuildingElementProxy']\nfields = ['Name']\n"
        "pattern = 'verbindungsmittel'\nkind = 'bolt'\n")
    r = load_rules(rules)
    assert r.fastener_kind("IfcBuildingElementProxy", {"Name": "Verbindungsmittel 12"}) == "bolt"
    assert load_rules().fastener_kind("IfcBuildingElementProxy",
                                      {"Name": "Verbindungsmittel 12"}) is None


def test_version_and_help():
    assert run("--version").exit_code == 0
    r = run("scan", "--help")
    assert r.exit_code == 0 and "--json" in r.output
    assert "Exit codes" in run("--help").output


def test_progress_bar_draws_on_stderr_only_when_enabled(capsys):
    from ifcjoint.cli import _Bar

    bar = _Bar(enabled=True)
    for stage in ("read", "joints"):
        for i in range(0, 101, 25):
            bar(stage, i, 100)
    bar.close()
    out = capsys.readouterr()
    assert out.out == "" and "finding joints" in out.err
    off = _Bar(enabled=False)
    off("read", 5, 10)
    off.close()
    assert capsys.readouterr().err == ""
