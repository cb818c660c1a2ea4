"""The BCF issue list: re-opens with bcf-client, one topic per problem, stable GUIDs, updates."""

from __future__ import annotations

import copy
import zipfile

import pytest
from bcf.v2.bcfxml import BcfXml as Bcf2
from bcf.v3.bcfxml import BcfXml as Bcf3

from ifcjoint.errors import OutputError
from ifcjoint.report.bcf import CLOSED, OPEN, write_bcf


def _load(path, version):
    return (Bcf3 if version == "3.0" else Bcf2).load(path)


@pytest.mark.parametrize("version", ["3.0", "2.1"])
def test_one_topic_per_problem_with_the_right_elements(tmp_path, demo_check, version):
    p = tmp_path / "issues.bcf"
    counts = write_bcf(demo_check.results, p, version=version)
    problems = demo_check.problems()
    assert counts == {"new": len(problems), "updated": 0, "unchanged": 0, "closed": 0, "kept": 0}
    with zipfile.ZipFile(p) as z:
        assert z.read("bcf.version").decode().count(version) == 1
    doc = _load(p, version)
    topics = doc.topics
    assert len(topics) == len(problems)
    titles = {p["guid"]: p["title"] for j in demo_check.results["joints"]
              for p in j["check"]["problems"]}
    for jc, pr in problems:
        h = topics[pr.guid]
        assert h.topic.title == titles[pr.guid]
        assert h.topic.priority in ("Critical", "Major", "Minor")
        vps = list(h.viewpoints.values())
        assert len(vps) == 1
        sel = vps[0].get_selected_guids()
        assert sel[0] == jc.joint.beam and sel[1] == jc.joint.column
        assert set(sel) == set(pr.elements)
        cam = vps[0].visualization_info.perspective_camera
        # the camera looks towards the joint (metres in BCF, mm in the model)
        target = [c / 1000 for c in jc.joint.point]
        pos = cam.camera_view_point
        d = cam.camera_direction
        to = [target[0] - pos.x, target[1] - pos.y, target[2] - pos.z]
        n = sum(x * x for x in to) ** 0.5
        assert (to[0] * d.x + to[1] * d.y + to[2] * d.z) / n == pytest.approx(1.0, abs=1e-6)
    doc.close()


def test_rerun_updates_topics_and_closes_solved_ones_keeping_comments(tmp_path, demo_check):
    p = tmp_path / "issues.bcf"
    write_bcf(demo_check.results, p)
    # a person comments on the first topic in their coordination tool
    import bcf.v3.model as mdl
    from xsdata.models.datatype import XmlDateTime

    doc = Bcf3.load(p)
    first_guid = demo_check.problems()[0][1].guid
    h = doc.topics[first_guid]
    h.topic.comments = mdl.TopicComments(
        comment=[mdl.Comment(date=XmlDateTime.from_string("2026-12-01T10:00:00Z"),
                             author="coordinator", comment="Seen, asking the engineer.",
                             guid="3b0c6e0e-0000-4000-8000-000000000001")]
    )
    doc.save(p)
    doc.close()
    # same results again: nothing new, nothing duplicated, nothing changed, file untouched
    before = p.read_bytes()
    again = write_bcf(demo_check.results, p)
    assert again["new"] == 0 and again["updated"] == 0
    assert again["unchanged"] == len(demo_check.problems())
    assert p.read_bytes() == before
    # the first joint's problem is solved: its topic is closed, not deleted, comment kept
    solved = copy.deepcopy(demo_check.results)
    first = next(j for j in solved["joints"] if j["check"]["problems"])
    n_first = len(first["check"]["problems"])
    first["check"]["problems"] = []
    c = write_bcf(solved, p)
    assert c["closed"] == n_first and c["new"] == 0 and c["updated"] == 0
    doc = Bcf3.load(p)
    t = doc.topics[first_guid].topic
    assert t.topic_status == CLOSED
    texts = [x.comment for x in t.comments.comment]
    assert "Seen, asking the engineer." in texts and any("no longer found" in x for x in texts)
    assert len(doc.topics) == len(demo_check.problems())
    doc.close()
    # and when the problem comes back the topic reopens
    write_bcf(demo_check.results, p)
    doc = Bcf3.load(p)
    assert doc.topics[first_guid].topic.topic_status == OPEN
    doc.close()


def test_topic_guids_are_stable_across_runs(demo_check):
    import datetime as dt

    import ifcjoint
    from tests.conftest import SAMPLES

    other = ifcjoint.check(
        SAMPLES / "kestrel-workshop-ifc4-mm.ifc",
        demands=SAMPLES / "kestrel-workshop-demands.csv",
        created=dt.datetime(2027, 1, 1, tzinfo=dt.UTC),
    )
    assert [p.guid for _, p in other.problems()] == [p.guid for _, p in demo_check.problems()]


def test_not_a_bcf_file_is_refused(tmp_path, demo_check):
    p = tmp_path / "x.bcf"
    p.write_text("not a zip")
    with pytest.raises(OutputError, match="not a BCF file"):
        write_bcf(demo_check.results, p)
    assert p.read_text() == "not a zip"  # nothing lost


def test_the_direct_bcf3_writer_gives_what_the_library_writes(demo_check, tmp_path):
    # A new BCF 3.0 file is written as XML directly (fast); read back through bcf-client it
    # holds the same topics, fields, labels, selections and cameras as the library's own file.
    import bcf.v3.bcfxml as bx

    from ifcjoint.report.bcf import write_bcf, write_bcf_with_library

    res = demo_check.results
    fast, lib = tmp_path / "fast.bcf", tmp_path / "lib.bcf"
    assert write_bcf(res, fast)["new"] > 0
    write_bcf_with_library(res, lib)

    def content(path):
        doc = bx.BcfXml.load(path)
        out = {}
        for guid, h in doc.topics.items():
            t = h.topic
            vp = next(iter(h.viewpoints.values())).visualization_info
            cam = vp.perspective_camera
            out[guid] = (
                t.title, t.description, t.priority, t.topic_type, t.topic_status,
                tuple(t.labels.label), str(t.creation_date), t.creation_author,
                tuple(c.ifc_guid for c in vp.components.selection.component),
                tuple(round(v, 9) for v in (cam.camera_view_point.x, cam.camera_view_point.y,
                                            cam.camera_view_point.z, cam.camera_direction.x,
                                            cam.camera_up_vector.z)),
            )
        ext = doc.extensions
        doc.close()
        return out, list(ext.topic_types.topic_type), list(ext.topic_labels.topic_label)

    assert content(fast) == content(lib)


def test_an_unchecked_topic_title_names_its_cause(demo_check):
    # a coordinator reads the cause in the list, not "outside what ifcjoint checks"
    from ifcjoint.report.bcf import _topics

    titles = {p["title"] for _, p, _ in _topics(demo_check.results)}
    unchecked = [t for t in titles if "no demand row" in t or "no bolts" in t]
    assert unchecked and all(len(t.split(": ", 1)[1]) <= 140 for t in unchecked)
    assert not any("outside what ifcjoint checks" in t for t in titles)
