"""The everyday workflow: filters, unchecked joints with reasons, storeys, printable reports."""

from __future__ import annotations

import inspect
import json

import pandas as pd
from click.testing import CliRunner

import ifcjoint
from ifcjoint.cli import main
from tests.conftest import SAMPLES

DEMO = SAMPLES / "kestrel-workshop-ifc4-mm.ifc"
DEMANDS = SAMPLES / "kestrel-workshop-demands.csv"


def run(*args):
    return CliRunner().invoke(main, list(map(str, args)))


def test_filters_narrow_the_report_but_never_the_gate_bcf_or_ifc(tmp_path):
    out = {k: tmp_path / f"r.{k}" for k in ("json", "csv", "html", "bcf")}
    args = ["check", DEMO, "--demands", DEMANDS, "--storey", "ground*", "--status", "fail",
            "--fail-on", "fail"]
    for k, p in out.items():
        args += [f"--{k}", p]
    r = run(*args)
    assert r.exit_code == 1  # the gate still sees every failing joint
    data = json.loads(out["json"].read_text())
    assert data["joints"] and all(
        j["storey"].lower().startswith("ground") and j["check"]["status"] == "fail"
        for j in data["joints"])
    flt = data["check"]["filter"]
    assert flt["joints_in_run"] == 56 and flt["joints_shown"] == len(data["joints"])
    assert sum(data["check"]["counts"].values()) == len(data["joints"])
    assert len(pd.read_csv(out["csv"])) == len(data["joints"])
    assert "Partial report" in out["html"].read_text()
    assert f"{len(data['joints'])} of 56 joints shown" in r.output
    run("check", DEMO, "--demands", DEMANDS, "--json", tmp_path / "all.json", "-q",
        "--fail-on", "never")
    full = json.loads((tmp_path / "all.json").read_text())
    problems = sum(len(j["check"]["problems"]) for j in full["joints"])
    import zipfile

    with zipfile.ZipFile(out["bcf"]) as z:  # every problem, not only the shown joints'
        assert sum(n.endswith("markup.bcf") for n in z.namelist()) == problems


def test_joint_filter_by_label_or_id(tmp_path):
    js = tmp_path / "r.json"
    assert run("check", DEMO, "--json", js, "--joint", "First floor 2/B", "-q",
               "--fail-on", "never").exit_code == 0
    labels = {j["label"] for j in json.loads(js.read_text())["joints"]}
    assert labels == {"First floor 2/B"}


def test_unchecked_joints_are_listed_with_their_reason(tmp_path):
    html = tmp_path / "r.html"
    r = run("check", DEMO, "--demands", DEMANDS, "--html", html, "--fail-on", "never")
    assert "unchecked joints, by reason:" in r.output
    assert "no demand row for this joint" in r.output
    # an incomplete joint names what is missing, not a generic scope sentence
    assert "end plate at the beam end but no bolts" in r.output
    assert "bolt(s) but no plate" in r.output
    assert "only bolted end plates and welded joints" not in r.output
    page = html.read_text()
    assert 'id="unchecked"' in page and "no demand row for this joint" in page


def test_results_csv_has_the_storey(tmp_path):
    csv = tmp_path / "r.csv"
    run("check", DEMO, "--csv", csv, "-q", "--fail-on", "never")
    df = pd.read_csv(csv)
    assert list(df.columns[:3]) == ["joint_id", "label", "storey"]
    assert set(df["storey"]) == {"Ground floor", "First floor"}
    assert all(lab.startswith(st) for lab, st in zip(df["label"], df["storey"], strict=True))


def test_report_prints_in_full(tmp_path):
    html = tmp_path / "r.html"
    run("check", DEMO, "--html", html, "-q", "--fail-on", "never")
    page = html.read_text()
    assert 'id="expand-all"' in page and "beforeprint" in page and "@media print" in page


def test_library_check_shows_its_real_signature():
    sig = inspect.signature(ifcjoint.check)
    assert {"path", "demands", "settings", "created"} <= set(sig.parameters)
    assert "Scan a model, read its demands and check every joint" in ifcjoint.check.__doc__


def test_help_texts_name_nothing_the_installed_package_lacks():
    for cmd in ("scan", "demands", "check", "report", "calc", "batch"):
        r = run(cmd, "--help")
        assert r.exit_code == 0
        assert "docs/" not in r.output, cmd  # the docs folder is not installed
        assert "..." not in r.output.replace("MODELS...", ""), cmd  # nothing cut off


def test_report_numbers_are_at_the_precision_of_the_trade(tmp_path):
    # No float noise such as -49.999999999999545 anywhere in the page: dimensions to 0.1 mm,
    # forces to 0.1 kN, utilisations to 0.001 (common practice, no source).
    import re

    html, md = tmp_path / "r.html", tmp_path / "r.md"
    run("check", DEMO, "--demands", DEMANDS, "--html", html, "--md", md, "-q",
        "--fail-on", "never")
    for p in (html, md):
        assert not re.findall(r"\d\.\d{4,}", p.read_text()), p
