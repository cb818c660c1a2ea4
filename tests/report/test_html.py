"""The HTML report and the Markdown summary: escaped, self-contained, same numbers as the JSON."""

from __future__ import annotations

import datetime as dt
import json
import re
from html.parser import HTMLParser

import ifcopenshell
import pytest

import ifcjoint
from ifcjoint.report.drawing import ALERT, plate_svg
from ifcjoint.report.html import render_html
from ifcjoint.report.markdown import render_markdown
from ifcjoint.report.results import build_results
from tests.conftest import SAMPLES

EVIL = '<script>alert("x")</script>'
EVIL_Q = "Bay \"A\" & 'B' <img src=x onerror=alert(1)>"


@pytest.fixture(scope="module")
def demo_results(demo_check):
    return json.loads(json.dumps(build_results(demo_check)))


@pytest.fixture(scope="module")
def demo_html(demo_results):
    return render_html(demo_results)


class _Fields(HTMLParser):
    """Collect (sheet joint id, data-field, text) and table rows' joint ids."""

    def __init__(self):
        super().__init__()
        self.sheet = None
        self.field = None
        self.values: list[tuple[str, str, str]] = []
        self.rows: list[str] = []
        self.scripts = 0
        self.external = []

    def handle_starttag(self, tag, attrs):
        a = dict(attrs)
        if tag == "details" and "data-joint" in a:
            self.sheet = a["data-joint"]
        if tag == "tr" and "data-joint" in a:
            self.rows.append(a["data-joint"])
        if "data-field" in a:
            self.field = a["data-field"]
        if tag == "script":
            self.scripts += 1
            if "src" in a:
                self.external.append(a["src"])
        if tag in ("link", "img") and ("href" in a or "src" in a):
            self.external.append(a.get("href") or a.get("src"))

    def handle_data(self, data):
        if self.field:
            self.values.append((self.sheet, self.field, data.strip()))
            self.field = None


def test_every_joint_is_in_the_table_and_has_a_sheet(demo_html, demo_results):
    p = _Fields()
    p.feed(demo_html)
    ids = [j["id"] for j in demo_results["joints"]]
    assert p.rows == ids
    assert all(f'id="sheet-{i}"' in demo_html for i in ids)
    assert p.scripts == 1 and p.external == []  # one inline script, nothing fetched
    assert demo_results["caution"] in demo_html
    for k in ("gamma_M0", "gamma_M2"):  # the parameters used are printed
        assert f"<th>{k}</th>" in demo_html


def test_numbers_in_the_report_equal_the_json(demo_html, demo_results):
    p = _Fields()
    p.feed(demo_html)
    by_id = {j["id"]: j["check"] for j in demo_results["joints"]}
    checked = 0
    for jid, field, text in p.values:
        c = by_id[jid]
        if text == "-":  # a value not available is printed as a dash, never as a number
            assert field != "utilisation" and c["resistance"][field] is None, (jid, field)
            continue
        value = float(text.replace(",", ""))
        if field == "utilisation":
            expected = c["utilisation"]
            assert value == pytest.approx(expected, abs=5e-4)
        elif field == "F_tr_Rd_kN":
            assert value in [pytest.approx(t["F_tr_Rd_kN"], abs=5e-3) for t in c["tension_rows"]]
        else:
            assert value == pytest.approx(c["resistance"][field], abs=5e-3), (jid, field)
        checked += 1
    assert checked > 100


def test_report_from_json_is_the_report_from_check(demo_results, demo_html, tmp_path):
    # One result object: rendering a results JSON read back from disk gives the same page.
    f = tmp_path / "r.json"
    f.write_text(json.dumps(demo_results))
    assert render_html(json.loads(f.read_text())) == demo_html


def test_model_strings_come_out_inert(tmp_path):
    f = ifcopenshell.open(str(SAMPLES / "kestrel-workshop-ifc4-mm.ifc"))
    for s in f.by_type("IfcBuildingStorey"):
        s.Name = EVIL
    for p in f.by_type("IfcPlate")[:5]:
        p.Name = EVIL_Q
    for g in f.by_type("IfcGridAxis"):
        g.AxisTag = EVIL_Q
    path = tmp_path / "evil.ifc"
    f.write(str(path))
    mc = ifcjoint.check(path, created=dt.datetime(2026, 12, 1, tzinfo=dt.UTC))
    data = json.loads(json.dumps(build_results(mc)))
    assert any(EVIL in j["label"] for j in data["joints"])  # the names did reach the results
    html = render_html(data)
    assert EVIL not in html and "<img" not in html
    assert html.count("<script") == 1  # ours only
    assert "&lt;script&gt;alert(&#34;x&#34;)&lt;/script&gt;" in html


def test_markdown_makes_model_strings_inert(demo_results):
    data = json.loads(json.dumps(demo_results))
    top = max((j for j in data["joints"] if j["check"]["utilisation"] is not None),
              key=lambda j: j["check"]["utilisation"])
    top["label"] = EVIL + " | col"
    md = render_markdown(data)
    assert "<script>" not in md and "\\<script\\>" in md and "\\| col" in md


def test_plate_drawing_marks_the_finding_on_its_dimension(demo_results):
    flagged = [j for j in demo_results["joints"]
               if any(f["code"] == "edge_distance_min" for f in j["findings"])]
    assert flagged
    svg = plate_svg(flagged[0])
    assert ALERT in svg and "edge_distance_min" in svg
    clean = next(j for j in demo_results["joints"]
                 if j["anatomy"] and j["anatomy"]["plate"] and not j["findings"]
                 and j["archetype"] == "extended_end_plate")
    svg2 = plate_svg(clean)
    assert ALERT not in svg2
    n_bolts = sum(len(r["lateral"]) for r in clean["anatomy"]["bolts"]["rows"])
    assert svg2.count("<circle") == n_bolts
    # dimensions shown are the extracted ones: gauge and plate width
    assert f">{clean['anatomy']['bolts']['gauge']:.0f}<" in svg2
    assert f">{clean['anatomy']['plate']['bp']:.0f}<" in svg2


def test_markdown_summary(demo_results):
    md = render_markdown(demo_results)
    c = demo_results["check"]["counts"]
    assert f"| pass | {c['pass']} |" in md and f"| fail | {c['fail']} |" in md
    assert "Highest utilisations" in md and "EN 1993-1-8 6.2.7.2" in md
    assert demo_results["caution"] in md
    top = re.findall(r"\| (\d\.\d\d) \|", md)
    assert [float(x) for x in top] == sorted((float(x) for x in top), reverse=True)


def test_m_phi_plot_is_there_for_checked_joints(demo_html, demo_results):
    # every checked joint with a moment resistance (a pinned fin plate has no curve)
    n_checked = sum(1 for j in demo_results["joints"] if j["check"]["engine_status"] == "checked"
                    and "fin_plate" not in j["archetype"])
    assert n_checked and demo_html.count("Design M-phi curve") == n_checked
