"""The HTML report in a real browser (headless Chromium): every joint in the DOM, no script error.

Skips with a reason where Chromium is not installed (``.ci/run`` installs Debian's package).
"""

from __future__ import annotations

import json
import re
import shutil
import subprocess

import pytest

from ifcjoint.report.html import render_html
from ifcjoint.report.results import build_results

CHROMIUM = shutil.which("chromium") or shutil.which("chromium-browser")
pytestmark = pytest.mark.skipif(
    CHROMIUM is None,
    reason="chromium not installed (Debian package 'chromium'); .ci/run installs it",
)
FLAGS = ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
         "--disable-background-networking", "--disable-component-update", "--disable-sync"]


def _chromium(tmp_path, *args) -> subprocess.CompletedProcess:
    profile = tmp_path / "profile"
    return subprocess.run(
        [CHROMIUM, *FLAGS, f"--user-data-dir={profile}", *args],
        capture_output=True, text=True, timeout=120, check=False,
    )


@pytest.fixture(scope="module")
def report_file(demo_check, tmp_path_factory):
    d = tmp_path_factory.mktemp("report")
    page = d / "report.html"
    page.write_text(render_html(json.loads(json.dumps(build_results(demo_check)))))
    return page


def test_report_loads_with_every_joint_and_no_script_error(report_file, demo_check, tmp_path):
    r = _chromium(tmp_path, "--dump-dom", report_file.as_uri())
    dom = r.stdout
    assert r.returncode == 0, r.stderr[-2000:]
    assert 'data-ready="ok"' in dom, "the report's script did not finish"
    assert "data-script-error=" not in dom
    assert "Uncaught" not in r.stderr
    rows = re.findall(r'<tr data-status="[a-z_]+" data-joint="(J-[0-9a-f]{12})"', dom)
    assert rows == [jc.joint.id for jc in demo_check.joints]
    assert f"{len(rows)} of {len(rows)} joints shown" in dom
    shot = tmp_path / "report.png"
    s = _chromium(tmp_path, "--window-size=1400,2000", f"--screenshot={shot}",
                  report_file.as_uri())
    assert s.returncode == 0 and shot.stat().st_size > 10_000


def test_status_filter_from_the_address(report_file, demo_check, tmp_path):
    # A link ending in #status=fail opens the report filtered to failing joints.
    r = _chromium(tmp_path, "--dump-dom", report_file.as_uri() + "#status=fail")
    n_fail = demo_check.counts()["fail"]
    assert f"{n_fail} of {len(demo_check.joints)} joints shown" in r.stdout
    visible = re.findall(r'<tr data-status="([a-z_]+)" data-joint="J-[0-9a-f]{12}">', r.stdout)
    assert set(visible) == {"fail"} and len(visible) == n_fail


def test_large_report_builds_a_sheet_when_it_is_opened(demo_check, tmp_path, monkeypatch):
    # Big reports carry their sheets compressed in chunks; following a link to one unpacks
    # its chunk and builds that sheet, with its content (the others stay unbuilt).
    import ifcjoint.report.html as rep

    monkeypatch.setattr(rep, "LAZY_FROM", 10)
    monkeypatch.setattr(rep, "CHUNK_SHEETS", 20)
    page = tmp_path / "lazy.html"
    html = rep.render_html(json.loads(json.dumps(build_results(demo_check))))
    page.write_text(html)
    assert html.count('type="application/octet-stream"') == -(-len(demo_check.joints) // 20)
    assert "7. Detailing findings" not in html  # every sheet's body is in a chunk
    jid = demo_check.top(1)[0].joint.id
    r = _chromium(tmp_path, "--virtual-time-budget=10000", "--dump-dom",
                  page.as_uri() + f"#sheet-{jid}")
    assert 'data-ready="ok"' in r.stdout, r.stdout[-500:]
    opened = re.search(rf'<details[^>]*id="sheet-{jid}"[^>]*>.*?</details>', r.stdout, re.S)
    assert 'data-filled="1"' in opened.group(0) and " open" in opened.group(0)
    assert "7. Detailing findings" in opened.group(0)
    assert r.stdout.count('data-filled="1"') == 1  # the others stay unbuilt
