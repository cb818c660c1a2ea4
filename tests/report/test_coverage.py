"""Every beam end accounted for (report/coverage.py), against the generator's truth."""

from __future__ import annotations

import copy
from collections import Counter

from ifcjoint.report.coverage import beam_end_coverage, coverage_line
from tests.conftest import load_truth


def test_every_demo_beam_end_is_accounted_for(demo_check):
    cov = demo_check.results["check"]["coverage"]
    truth = load_truth("kestrel-workshop-ifc4-mm")
    beams = {t["beam"] for t in truth["joints"]} | {o["beam"] for o in truth["other_beam_ends"]}
    splice = [t for t in truth["joints"] if t.get("support") == "splice"]
    assert cov["beams"] == len(beams) and cov["beam_ends"] == 2 * len(beams)
    assert cov["accounted"] == cov["beam_ends"] and cov["missing"] == []
    assert sum(cov["categories"].values()) == cov["beam_ends"]
    # the other kinds of end the generator built, none of them checked by a joint
    unjoined = Counter(o["kind"] for o in truth["other_beam_ends"]
                       if o["kind"] not in ("beam_to_beam", "splice"))
    for kind, n in unjoined.items():
        assert cov["categories"].get(kind, 0) == n, kind
    # joint ends by status: a splice joint holds two ends
    statuses = Counter(j["check"]["status"] for j in demo_check.results["joints"])
    checked = sum(cov["categories"].get(k, 0) for k in ("pass", "pinned_pass"))
    assert checked == statuses["pass"] + len(splice)  # the demo's splice passes
    assert "every one accounted for" in coverage_line(cov)


def test_a_lost_end_is_listed_as_missing(demo_check):
    r = copy.deepcopy(demo_check.results)
    gone = r["other_beam_ends"].pop(next(i for i, o in enumerate(r["other_beam_ends"])
                                         if o["kind"] == "free_end"))
    cov = beam_end_coverage(r)
    assert cov["missing"] == [f"{gone['beam']}:{gone['beam_end']}"]
    assert cov["accounted"] == cov["beam_ends"] - 1
    assert "1 missing" in coverage_line(cov)
