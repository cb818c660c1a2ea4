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
    assert run("check", DEMO, "--json", before, "--fail-on", "never", "-q").exit_code == 0
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
    return before, after, thick, gone


def test_the_changes_made_are_found_and_nothing_else(revisions):
    before, after, thick, gone = revisions
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
