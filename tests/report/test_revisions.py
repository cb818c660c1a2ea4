"""Two revisions compared joint by joint (report/revisions.py, ``ifcjoint compare``).

The revisions are the demo and a copy of it edited here, in the IFC itself, the way a
modeller's next issue would differ: one end plate thickened, one beam deleted (its two joints
removed), and the GlobalIds of the beams of one storey regenerated (their joints' ids change:
matched by position). Both revisions run without demands (the demands file names beams by
GlobalId). The comparison must find exactly these changes and call every other joint
unchanged.
"""

from __future__ import annotations

import json

import ifcopenshell
import ifcopenshell.guid
import pytest
from click.testing import CliRunner

from ifcjoint.cli import main
from ifcjoint.report.revisions import compare_results
from tests.conftest import SAMPLES

DEMO = SAMPLES / "kestrel-workshop-ifc4-mm.ifc"


def run(*args):
    return CliRunner().invoke(main, list(map(str, args)))


@pytest.fixture(scope="module")
def revisions(tmp_path_factory):
    d = tmp_path_factory.mktemp("rev")
    before = d / "before.json"
    assert run("check", DEMO, "--json", before, "--keep-reads", "--fail-on", "never",
               "-q").exit_code == 0
    data = json.loads(before.read_text())
    f = ifcopenshell.open(str(DEMO))
    # 1. thicken the end plate of the first checked extended end plate joint (20 -> 25 mm)
    thick = next(j for j in data["joints"] if j["archetype"] == "extended_end_plate"
                 and j["check"]["engine_status"] == "checked")
    plate = f.by_guid(thick["plates"][0])
    solid = plate.Representation.Representations[0].Items[0]
    solid.Depth = 25.0
    # 2. delete a beam with two joints and no other link to the rest
    gone = next(j for j in data["joints"] if j["archetype"] == "welded"
                and j["beam_end"] == "start" and j["partner"] is None)
    for guid in (gone["beam"], *(x for j in data["joints"] if j["beam"] == gone["beam"]
                                 for x in (*j["plates"], *j["bolts"], *j["welds"]))):
        f.remove(f.by_guid(guid))  # the beam and its parts
    # 3. a new GlobalId for every beam of the first floor: their joints' ids change
    storey = {j["beam"] for j in data["joints"] if j["storey"] == "First floor"}
    for b in f.by_type("IfcBeam"):
        if b.GlobalId in storey:
            b.GlobalId = ifcopenshell.guid.new()
    model = d / "after.ifc"
    f.write(str(model))
    after = d / "after.json"
    r = run("check", model, "--json", after, "--fail-on", "never", "-q")
    assert r.exit_code == 0, r.output
    return before, after, thick, gone, model


def test_the_changes_made_are_found_and_nothing_else(revisions):
    before, after, thick, gone, _ = revisions
    a, b = json.loads(before.read_text()), json.loads(after.read_text())
    cmp = compare_results(a, b)
    rows = {r["id"]: r for r in cmp["joints"]}
    removed = [r for r in cmp["joints"] if r["change"] == "removed"]
    assert {r["id"] for r in removed} == {j["id"] for j in a["joints"]
                                          if j["beam"] == gone["beam"]}
    changed = [r for r in cmp["joints"] if r["change"] == "changed"]
    assert len(changed) == 1 and changed[0]["label"] == thick["label"]
    assert "end plate" in changed[0]["what"]  # (and its bolts: their grip is longer)
    # the regenerated GlobalIds: those joints matched by position, the others by id
    moved = {j["id"] for j in a["joints"] if j["storey"] == "First floor"}
    for r in cmp["joints"]:
        if r["change"] in ("changed", "unchanged"):
            want = "position" if r["label"].startswith("First floor") else "id"
            assert r["matched_by"] == want, r
    assert moved
    assert cmp["counts"]["unchanged"] == len(a["joints"]) - len(removed) - 1
    assert cmp["counts"]["new"] == 0
    assert rows  # every joint of both revisions is listed


def test_the_command_prints_and_writes_the_comparison(revisions, tmp_path):
    before, after, *_ = revisions
    out = tmp_path / "cmp.json"
    r = run("compare", before, after, "--json", out)
    assert r.exit_code in (0, 1), r.output
    assert "changed" in r.output and "removed" in r.output
    data = json.loads(out.read_text())
    assert data["counts"]["removed"] >= 1
    same = run("compare", before, before)
    assert same.exit_code == 0 and "0 changed" in same.output
    assert run("compare", before, after, "--json", before).exit_code == 2  # never an input


def _checks(path) -> dict:
    """Every joint's check as written, without where it came from and without its problems'
    GUIDs (a joint matched by position keeps its earlier ones: tested below)."""
    data = json.loads(path.read_text())
    out = {}
    for j in data["joints"]:
        c = {k: v for k, v in j["check"].items() if k != "carried_over"}
        c["problems"] = [{k: v for k, v in p.items() if k != "guid"} for p in c["problems"]]
        out[j["id"]] = c
    return out


def test_a_rerun_carries_over_exactly_the_unchanged_joints_and_equals_a_recheck(revisions,
                                                                              tmp_path):
    before, after, thick, gone, model = revisions
    rerun = tmp_path / "rerun.json"
    r = run("check", model, "--since", before, "--json", rerun, "--fail-on", "never")
    assert r.exit_code == 0, r.output
    data = json.loads(rerun.read_text())
    cmp = data["check"]["comparison"]
    carried = {j["id"] for j in data["joints"] if j["check"]["carried_over"]}
    # only joints matched by id and unchanged may be carried (a regenerated GlobalId is a
    # new identity: re-checked); the thickened plate's joint never is
    by_id = {r["id"]: r for r in cmp["joints"]}
    assert carried and all(by_id[k]["change"] == "unchanged" and by_id[k]["matched_by"] == "id"
                           for k in carried)
    assert thick["id"] not in carried
    assert cmp["counts"]["carried_over"] == len(carried)
    assert f"{len(carried)} result(s) carried over" in r.output
    # invariant: a carried-over result is what checking again gives, and the elements and
    # anatomies taken from the earlier run's reads are what reading again gives
    fresh = _checks(after)
    assert _checks(rerun) == fresh
    again = json.loads(after.read_text())
    for key in ("counts", "other_beam_ends", "unreadable"):
        assert data[key] == again[key], key
    scan_part = [{k: v for k, v in j.items() if k != "check"} for j in data["joints"]]
    assert scan_part == [{k: v for k, v in j.items() if k != "check"} for j in again["joints"]]
    reused = next(n for n in data["notes"] if "taken from its reads" in n)
    assert not reused.startswith("0 element")  # the earlier reads were used
    # the comparison is the one `compare` makes
    alone = compare_results(json.loads(before.read_text()), json.loads(after.read_text()))
    assert {k: v for k, v in cmp["counts"].items() if k != "carried_over"} == alone["counts"]


def test_position_matched_joints_keep_their_problem_guids(revisions, tmp_path):
    before, _, _, _, model = revisions
    rerun = tmp_path / "rerun.json"
    assert run("check", model, "--since", before, "--json", rerun, "--fail-on", "never",
               "-q").exit_code == 0
    a, b = json.loads(before.read_text()), json.loads(rerun.read_text())
    old = {j["id"]: j for j in a["joints"]}
    new = {j["id"]: j for j in b["joints"]}
    moved = [r for r in b["check"]["comparison"]["joints"] if r["matched_by"] == "position"]
    assert moved
    kept = 0
    for r in moved:
        was = {p["kind"]: p["guid"] for p in old[r["previous_id"]]["check"]["problems"]}
        for p in new[r["id"]]["check"]["problems"]:
            if p["kind"] in was:
                assert p["guid"] == was[p["kind"]]
                kept += 1
    assert kept  # no_demands joints have an "unchecked" problem on both sides


def test_other_settings_or_tool_version_recheck_everything(revisions, tmp_path):
    before, *_ = revisions
    out = tmp_path / "unbraced.json"
    assert run("check", DEMO, "--since", before, "--json", out, "--frame", "unbraced",
               "--fail-on", "never", "-q").exit_code == 0
    assert not any(j["check"]["carried_over"] for j in json.loads(out.read_text())["joints"])
    older = json.loads(before.read_text())
    older["check"]["tool_version"] = "0.0.1"
    old_file = tmp_path / "older.json"
    old_file.write_text(json.dumps(older))
    out2 = tmp_path / "again.json"
    assert run("check", DEMO, "--since", old_file, "--json", out2, "--fail-on", "never",
               "-q").exit_code == 0
    data = json.loads(out2.read_text())
    assert not any(j["check"]["carried_over"] for j in data["joints"])
    assert "every joint re-checked" in " ".join(data["check"]["notes"])


def test_with_demands_every_joint_is_carried_and_the_outputs_are_the_same(tmp_path):
    demands = SAMPLES / "kestrel-workshop-demands.csv"
    a, b = tmp_path / "a.json", tmp_path / "b.json"
    assert run("check", DEMO, "--demands", demands, "--json", a, "--fail-on", "never",
               "-q").exit_code == 0
    html = tmp_path / "b.html"
    r = run("check", DEMO, "--demands", demands, "--json", b, "--since", a, "--fail-on",
            "never", "--html", html)
    assert r.exit_code == 0, r.output
    page = html.read_text()
    assert "Since the earlier run" in page and "carried over from the earlier run" in page
    n = len(json.loads(a.read_text())["joints"])
    assert f"{n} result(s) carried over" in r.output and "0 changed" in r.output
    assert _checks(a) == _checks(b)
    assert run("check", DEMO, "--json", a, "--since", a, "-q").exit_code == 2  # never an input
    wrong = run("check", DEMO, "--since", DEMO, "-q")  # the model, not its results
    assert wrong.exit_code == 3 and "an IFC model, not results" in wrong.output


def test_bcf_written_over_the_last_issue_closes_only_what_went_away(revisions, tmp_path):
    """Regenerated GlobalIds must not close a storey's topics and open copies of them."""
    from bcf.v3.bcfxml import BcfXml

    before, _, _, gone, model = revisions
    bcf = tmp_path / "joints.bcf"
    first = tmp_path / "first.json"
    assert run("check", DEMO, "--json", first, "--bcf", bcf, "--fail-on", "never",
               "-q").exit_code == 0
    with BcfXml.load(bcf) as doc:
        n_before = len(doc.topics)
    out = tmp_path / "second.json"
    r = run("check", model, "--since", first, "--json", out, "--bcf", bcf, "--fail-on", "never")
    assert r.exit_code == 0, r.output
    a, b = json.loads(first.read_text()), json.loads(out.read_text())
    now = {p["guid"] for j in b["joints"] for p in j["check"]["problems"]}
    gone_guids = {p["guid"] for j in a["joints"] if j["beam"] == gone["beam"]
                  for p in j["check"]["problems"]}
    with BcfXml.load(bcf) as doc:
        closed = {g for g, h in doc.topics.items() if h.topic.topic_status == "Closed"}
        assert gone_guids and gone_guids <= closed  # the deleted beam's problems went away
        assert not closed & now  # every problem found now is open
        assert len(doc.topics) == len(now | closed)  # no duplicate topics
        assert len(doc.topics) <= n_before + 1  # at most the changed joint's new problem


def test_filtered_earlier_results_are_said_to_be(tmp_path):
    a, b = tmp_path / "a.json", tmp_path / "b.json"
    assert run("check", DEMO, "--json", a, "--storey", "Ground*", "--fail-on", "never",
               "-q").exit_code == 0
    r = run("check", DEMO, "--json", b, "--since", a, "--fail-on", "never")
    assert r.exit_code == 0, r.output
    prev = json.loads(b.read_text())["check"]["comparison"]["previous"]
    assert prev["filtered"] and prev["joints_listed"] == len(json.loads(a.read_text())["joints"])
    assert "joints outside that filter count as new" in r.output
