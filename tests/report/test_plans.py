"""Storey plans and frame elevations: every joint drawn once, in its status colour, linked."""

from __future__ import annotations

import re
import xml.etree.ElementTree as ET

import pytest

from ifcjoint.model.codes import UNCHECKED, Status
from ifcjoint.report.plans import frame_elevations, storey_plans
from ifcjoint.report.plots import STATUS_COLOURS

SVG = "{http://www.w3.org/2000/svg}"


@pytest.fixture(scope="module")
def results(demo_check):
    return demo_check.results


def _links(svg: str) -> list[ET.Element]:
    root = ET.fromstring(svg)  # well-formed XML, or this raises
    return list(root.iter(f"{SVG}a"))


def test_every_joint_is_on_exactly_one_storey_plan(results):
    plans = storey_plans(results)
    assert [name for name, _ in plans] == ["Ground floor", "First floor"]  # lowest first
    seen: list[str] = []
    for _, svg in plans:
        for a in _links(svg):
            seen.append(a.get("href").removeprefix("#sheet-"))
    assert sorted(seen) == sorted(j["id"] for j in results["joints"])


def test_marks_carry_the_status_colour_and_flagged_joints_a_label(results):
    by_id = {j["id"]: j for j in results["joints"]}
    labelled = 0
    for _, svg in storey_plans(results):
        for a in _links(svg):
            j = by_id[a.get("href").removeprefix("#sheet-")]
            st = Status(j["check"]["status"])
            assert a.find(f"{SVG}circle").get("fill") == STATUS_COLOURS[st]
            text = a.find(f"{SVG}text")
            if text is not None:
                labelled += 1
                assert st == Status.FAIL or st in UNCHECKED  # passing joints are not labelled
                assert text.text in j["label"]
    assert labelled > 0


def test_frame_lines_hold_the_beams_of_one_vertical_plane(results):
    elevations, left = frame_elevations(results)
    assert left == 0
    names = [n for n, _ in elevations]
    # the demo's grid: lines 1-4 one way, A-C the other (sample_models/generate.py)
    assert {"line A", "line B", "line C"} <= set(names) and "line 1" in names
    for _, svg in elevations:
        assert _links(svg) or re.search(r"<circle", svg)
