"""`ifcjoint check` end to end on the demo: statuses as designed, outputs, gates, exit codes."""

from __future__ import annotations

import hashlib
import json

import pandas as pd
import pytest
from click.testing import CliRunner

from ifcjoint.cli import main
from ifcjoint.ec3.code import EN_1993_1_8
from ifcjoint.report.results import result_dict
from tests.conftest import DEMO_CREATED, SAMPLES, load_truth

DEMO = SAMPLES / "kestrel-workshop-ifc4-mm.ifc"
DEMANDS = SAMPLES / "kestrel-workshop-demands.csv"
INCOMPLETE_DEFECTS = {"plate_without_bolts", "bolts_without_plate"}
# broken rules the resistance depends on (EN 1993-1-8 Table 3.3, bolt length, bearing on
# the column): the joint fails whatever its forces
FAILING_DEFECTS = {"edge_distance", "pitch", "bolt_too_short", "gap_to_column"}


def run(*args):
    return CliRunner().invoke(main, list(map(str, args)))


def designed_status(t: dict) -> str:
    """What the demo scenario (sample_models/demo_demands.py) was designed to show."""
    if t["axis"] != "major":
        return "pass"  # fin plates on the column web: light shears, the web's checks hold
    if t.get("support") == "splice":
        return "pass"  # the roof beam's splice: a light mid-span moment
    if INCOMPLETE_DEFECTS & set(t["defects"]):
        return "incomplete"
    if FAILING_DEFECTS & set(t["defects"]):
        return "fail"
    if not t["key"].startswith("X/"):
        return "no_demands"  # the cantilever: the scenario gives it no forces
    level, line = (int(x) for x in t["key"].split("/")[1:3])
    if (level, line) == (1, 2):
        return "no_demands"  # roof line C: analysis pending, no rows
    if (level, line) == (0, 1):
        return "fail"  # flush plates under the heavy mezzanine load
    return "pass"


def test_demo_statuses_are_the_designed_ones(tmp_path):
    js = tmp_path / "r.json"
    r = run("check", DEMO, "--demands", DEMANDS, "--json", js, "--timestamp", DEMO_CREATED)
    assert r.exit_code == 1, r.output  # default gate: failing and unchecked joints fail it
    assert "gate (unchecked) failed" in r.output
    data = json.loads(js.read_text())
    got = {(j["beam"], j["beam_end"]): j["check"]["status"] for j in data["joints"]}
    truth = load_truth("kestrel-workshop-ifc4-mm")["joints"]
    want = {(t["beam"], t["beam_end"]): designed_status(t) for t in truth}
    assert got == want
    assert {"pass", "fail", "no_demands", "incomplete"} <= set(got.values())
    # the summary lists the highest utilisations with clause and combination
    assert "highest utilisations" in r.output and "EN 1993-1-8 6.2.7.2" in r.output
    assert "qualified engineer" in r.output
    # every failing joint names its governing check, clause and combination
    for j in data["joints"]:
        c = j["check"]
        if c["status"] == "fail":
            assert c["governing"]["utilisation"] > 1 and c["governing"]["clause"]
            if c["detailing_failures"]:  # a broken rule governs: no load combination
                assert c["governing"]["name"].startswith("detailing: ")
            else:
                assert c["governing"]["combination"] in ("ULS-1 gravity", "ULS-2 sway")
        if c["status"] in ("no_demands", "incomplete", "unsupported"):
            assert c["governing"] is None and c["utilisation"] is None
    assert data["check"]["created"].startswith("2026-12-01T09:00:00")
    assert data["check"]["params"]["gamma_M2"] == 1.25  # EN 1993-1-8 Table 2.1 note, recommended


def test_analysis_assumption_mismatch_is_its_own_problem(demo_check):
    # The demo analysis assumed rigid joints on first-floor line A; single-sided extended end
    # plates there are semi-rigid by EN 1993-1-8 5.2.2.5, so each is reported.
    mism = [(jc, p) for jc, p in demo_check.problems() if p.kind == "assumption"]
    assert mism
    texts = {p["guid"]: p["description"] for j in demo_check.results["joints"]
             for p in j["check"]["problems"]}
    for jc, p in mism:
        assert jc.verdict.assumption.assumed == "rigid"
        assert jc.verdict.assumption.computed != "rigid" and "5.2.2" in texts[p.guid]


@pytest.mark.parametrize(
    ("gate", "code"), [("never", 0), ("fail", 1), ("unchecked", 1), ("problems", 1)]
)
def test_gate_exit_codes(gate, code):
    r = run("check", DEMO, "--demands", DEMANDS, "--fail-on", gate, "-q")
    assert r.exit_code == code, r.output


def test_gate_passes_when_every_joint_passes(tmp_path, build_variant):
    # A uniform frame with no detailing defects (welded joints and fin plates on column
    # webs), demands far below the resistances: both gates pass. Without the row of one fin
    # plate whose column web carries a beam on its other side too, that partner's web check
    # lacks the other reaction: --fail-on unchecked fails, --fail-on fail still passes.
    import ifcjoint

    model, _ = build_variant(demo_details=False, bays_x=2, bays_y=2)
    mc = ifcjoint.check(model)
    p = tmp_path / "light.csv"
    head = "joint_id,combination,M_Ed_kNm,V_Ed_kN"
    checked = [jc.joint for jc in mc.joints if jc.capacity.status == "checked"]
    rows = [f"{j.id},C1,{0 if 'fin_plate' in j.archetype else -1},1" for j in checked]
    assert len(rows) > 1
    p.write_text("\n".join([head, *rows]) + "\n")
    r = run("check", model, "--demands", p, "--fail-on", "fail", "-q")
    assert r.exit_code == 0, r.output
    r = run("check", model, "--demands", p, "-q")
    assert r.exit_code == 0, r.output
    paired = next(j for j in checked if j.archetype == "fin_plate" and j.partner)
    p.write_text("\n".join([head, *(x for x, j in zip(rows, checked, strict=True)
                                     if j.id != paired.partner)]) + "\n")
    r = run("check", model, "--demands", p, "--fail-on", "fail", "-q")
    assert r.exit_code == 0, r.output
    r = run("check", model, "--demands", p, "-q")
    assert r.exit_code == 1 and "unchecked" in r.output


def test_without_demands_nothing_passes():
    # No demands: nothing passes; only joints that break a detailing rule fail (4 in the demo)
    r = run("check", DEMO, "--fail-on", "never")
    assert r.exit_code == 0
    assert "pass 0, fail 4" in r.output and "demands: none given" in r.output


def test_outputs_are_written_and_the_input_is_untouched(tmp_path):
    before = hashlib.sha256(DEMO.read_bytes()).hexdigest()
    out = {k: tmp_path / f"o.{k}" for k in ("ifc", "bcf", "json", "csv")}
    issues = tmp_path / "issues.csv"
    r = run("check", DEMO, "--demands", DEMANDS, "--ifc-out", out["ifc"], "--bcf", out["bcf"],
            "--json", out["json"], "--csv", out["csv"], "--issues", issues, "--fail-on", "never")
    assert r.exit_code == 0, r.output
    assert all(p.stat().st_size > 0 for p in (*out.values(), issues))
    assert hashlib.sha256(DEMO.read_bytes()).hexdigest() == before
    df = pd.read_csv(out["csv"])
    data = json.loads(out["json"].read_text())
    assert list(df["joint_id"]) == [j["id"] for j in data["joints"]]
    assert list(df["status"]) == [j["check"]["status"] for j in data["joints"]]
    iss = pd.read_csv(issues)
    n_problems = sum(len(j["check"]["problems"]) for j in data["joints"])
    assert len(iss) == n_problems and iss["topic_guid"].is_unique


def test_ifc_out_may_not_be_the_input(tmp_path):
    copy = tmp_path / "m.ifc"
    copy.write_bytes(DEMO.read_bytes())
    r = run("check", copy, "--ifc-out", copy, "-q")
    assert r.exit_code == 2 and "is the input model" in r.output
    before = copy.read_bytes()
    r = run("check", copy, "--ifc-out", copy, "--in-place", "-q", "--fail-on", "never")
    assert r.exit_code == 0, r.output
    assert copy.read_bytes() != before and b"ifcjoint_JointAt" in copy.read_bytes()


def test_bad_params_file_exit_3(tmp_path):
    p = tmp_path / "p.toml"
    p.write_text("gamma_M9 = 1.1\n")
    r = run("check", DEMO, "--params", p)
    assert r.exit_code == 3 and "gamma_M9" in r.output


def test_params_file_changes_the_resistance(tmp_path, demo_check):
    # gamma_M2 scales bolt resistances (EN 1993-1-8 Table 3.4): a larger factor never raises
    # a resistance.
    p = tmp_path / "p.toml"
    p.write_text("gamma_M2 = 1.5\n")
    js = tmp_path / "r.json"
    r = run("check", DEMO, "--demands", DEMANDS, "--params", p, "--json", js, "-q",
            "--fail-on", "never")
    assert r.exit_code == 0, r.output
    data = json.loads(js.read_text())
    assert data["check"]["params"]["gamma_M2"] == 1.5
    base = {jc.joint.id: jc for jc in demo_check.joints}
    changed = 0
    for j in data["joints"]:
        res = j["check"]["resistance"]
        if res:
            ref = result_dict(base[j["id"]].result, EN_1993_1_8)["resistance"]
            assert (res["Vj_Rd_kN"] is None) == (ref["Vj_Rd_kN"] is None)
            if res["Vj_Rd_kN"] is not None:
                assert res["Vj_Rd_kN"] <= ref["Vj_Rd_kN"] + 1e-9
                changed += res["Vj_Rd_kN"] < ref["Vj_Rd_kN"] - 1e-6
    assert changed > 0


def test_html_and_markdown_from_check_and_again_from_the_json(tmp_path):
    js, html, md, html2 = (tmp_path / n for n in ("r.json", "r.html", "r.md", "again.html"))
    r = run("check", DEMO, "--demands", DEMANDS, "--json", js, "--html", html, "--md", md,
            "--fail-on", "never", "--timestamp", DEMO_CREATED)
    assert r.exit_code == 0, r.output
    r2 = run("report", js, "--html", html2)
    assert r2.exit_code == 0, r2.output
    assert html.read_bytes() == html2.read_bytes()  # no second calculation path
    assert "qualified engineer" in md.read_text()


def test_report_refuses_what_is_not_a_results_json(tmp_path):
    scan_json = tmp_path / "scan.json"
    assert run("scan", DEMO, "--json", scan_json, "-q").exit_code == 0
    r = run("report", scan_json, "--html", tmp_path / "x.html")
    assert r.exit_code == 3 and "not a results JSON" in r.output
    bad = tmp_path / "bad.json"
    bad.write_text("{not json")
    r = run("report", bad, "--html", tmp_path / "x.html")
    assert r.exit_code == 3 and "not JSON" in r.output
    r = run("report", bad)
    assert r.exit_code == 2 and "nothing to write" in r.output
    assert not (tmp_path / "x.html").exists()


def test_results_do_not_depend_on_the_model_length_unit():
    # The demo frame written in mm and in m (rotated and moved in plan): the same joints get
    # the same resistances, stiffnesses and classes.
    import ifcjoint

    a = ifcjoint.check(SAMPLES / "kestrel-workshop-ifc4-mm.ifc")
    b = ifcjoint.check(SAMPLES / "kestrel-workshop-ifc4-m.ifc")
    ra = {(jc.joint.beam, jc.joint.beam_end): result_dict(jc.capacity, EN_1993_1_8)
          for jc in a.joints}
    rb = {(jc.joint.beam, jc.joint.beam_end): result_dict(jc.capacity, EN_1993_1_8)
          for jc in b.joints}
    assert ra.keys() == rb.keys()
    compared = 0
    for key, x in ra.items():
        y = rb[key]
        assert x["status"] == y["status"]
        if x["status"] == "checked":
            for k, v in x["resistance"].items():
                if v is None:
                    assert y["resistance"][k] is None, (key, k)
                else:
                    assert y["resistance"][k] == pytest.approx(v, rel=1e-3, abs=0.05), (key, k)
            assert x["classification"] == y["classification"]
            compared += 1
    assert compared >= 30


def test_exit_codes_come_from_the_errors(tmp_path, monkeypatch):
    # A path that cannot be written is a usage error (2); a renderer that breaks is a bug (5),
    # never passed off as the user's mistake.
    import ifcjoint.report.outputs as outputs

    blocker = tmp_path / "file"
    blocker.write_text("x")
    r = run("check", DEMO, "--csv", blocker / "under-a-file.csv", "-q")
    assert r.exit_code == 2 and "is a file, not a folder" in r.output

    def broken(results, path):
        raise RuntimeError("renderer bug")

    monkeypatch.setitem(outputs.RENDERERS, "csv", broken)
    r = run("check", DEMO, "--csv", tmp_path / "r.csv", "-q")
    assert r.exit_code == 5 and "internal error" in r.output and "renderer bug" in r.output


def test_mis_detailed_joints_fail_and_the_fail_gate_says_so(tmp_path):
    # A bolt 15 mm from the plate edge (min 1.2 d0 = 26.4 mm), rows 35 mm apart (min 2.2 d0),
    # bolts shorter than their grip, a plate 30 mm off the face: each breaks a rule the
    # resistance depends on (EN 1993-1-8 Table 3.3; common practice), so the joint fails and
    # its broken rule governs; --fail-on fail exits 1.
    js = tmp_path / "r.json"
    r = run("check", DEMO, "--demands", DEMANDS, "--json", js, "--fail-on", "fail", "-q")
    assert r.exit_code == 1 and "gate (fail) failed" in r.output
    data = json.loads(js.read_text())
    by_key = {(j["beam"], j["beam_end"]): j for j in data["joints"]}
    truth = load_truth("kestrel-workshop-ifc4-mm")["joints"]
    seen = set()
    for t in truth:
        broken = FAILING_DEFECTS & set(t["defects"])
        if not broken:
            continue
        j = by_key[(t["beam"], t["beam_end"])]
        c = j["check"]
        assert c["status"] == "fail", t["key"]
        assert c["detailing_failures"] and c["governing"]["utilisation"] > 1
        assert j["archetype"] == t["archetype"]  # the designed kind, not "incomplete"
        assert any(p["kind"] == "detailing" and p["severity"] == "critical"
                   for p in c["problems"])
        seen |= broken
    assert seen == FAILING_DEFECTS
