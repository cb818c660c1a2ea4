"""The demands CSV: every kind of bad row is reported with its line, and the run goes on."""

from __future__ import annotations

import pytest
from click.testing import CliRunner

from ifcjoint.cli import main
from ifcjoint.errors import DemandsError
from ifcjoint.tables.demands import TEMPLATE_COLUMNS, read_demands, write_template
from tests.conftest import SAMPLES

DEMO = SAMPLES / "kestrel-workshop-ifc4-mm.ifc"


def run(*args):
    return CliRunner().invoke(main, list(map(str, args)))


@pytest.fixture(scope="module")
def ids(demo_check):
    checked = [jc.joint for jc in demo_check.joints if jc.capacity.status == "checked"]
    return checked


def test_bad_rows_each_get_a_message_with_their_line(tmp_path, ids):
    a, b = ids[0], ids[1]
    text = (
        "# a comment line\n"  # line 1
        "joint_id,beam_guid,beam_end,combination,M_Ed_kNm,V_Ed_kN\n"  # line 2 (header)
        f"{a.id},,,C1,-50,40\n"  # 3: fine
        "J-doesnotexist,,,C1,-50,40\n"  # 4: unknown joint
        f"{a.id},,,C1,-60,40\n"  # 5: same joint and combination again
        f"{b.id},,,C1,minus fifty,40\n"  # 6: not a number
        f"{b.id},,,C2,,40\n"  # 7: required value missing
        f",{b.beam},middle,C3,-10,10\n"  # 8: bad beam end
        ",,,C4,-10,10\n"  # 9: names no joint
        f",{b.beam},{b.beam_end},C5,-10,10\n"  # 10: fine, by beam and end
    )
    p = tmp_path / "demands.csv"
    p.write_text(text)
    r = run("check", DEMO, "--demands", p, "--fail-on", "never")
    assert r.exit_code == 0, r.output
    out = r.output
    assert f"{p}:4: unknown joint_id 'J-doesnotexist'" in out
    assert f"{p}:5: joint {a.id}" in out and "already on line 3" in out
    assert f"{p}:6: V_Ed_kN" not in out and "M_Ed_kNm = 'minus fifty' is not a number" in out
    assert f"{p}:7: missing required value(s): M_Ed_kNm" in out
    assert f"{p}:8: beam_end 'middle'" in out
    assert f"{p}:9: no joint_id and no beam_guid" in out
    assert "2 rows used, 6 rejected of 8 read" in out
    t = read_demands(p, ids)
    assert [x.line for x in t.problems] == [4, 5, 6, 7, 8, 9]
    assert t.by_joint[b.id][0].combination == "C5" and t.by_joint[b.id][0].source.endswith(":10")


@pytest.mark.parametrize(
    ("header", "message"),
    [
        ("joint_id,combination,V_Ed_kN", "required column 'M_Ed_kNm' missing"),
        ("joint_id,combination,M_Ed_Nmm,V_Ed_kN", "column 'M_Ed_Nmm': unit 'Nmm' is not accepted"),
        ("joint_id,combination,M_Ed,V_Ed_kN", "column 'M_Ed': unit '(none)' is not accepted"),
        ("joint_id,combination,M_Ed_kNm,V_Ed_N", "column 'V_Ed_N': unit 'N' is not accepted"),
        ("combination,M_Ed_kNm,V_Ed_kN", "no way to identify joints"),
    ],
)
def test_wrong_header_is_refused_with_exit_3(tmp_path, header, message):
    p = tmp_path / "d.csv"
    p.write_text("# comment\n" + header + "\nJ-x,C1,1,2\n")
    r = run("check", DEMO, "--demands", p)
    assert r.exit_code == 3, r.output
    assert f"{p}:2:" in r.output and message in r.output


def test_missing_or_binary_demands_file_exit_3(tmp_path):
    r = run("check", DEMO, "--demands", tmp_path / "nope.csv")
    assert r.exit_code == 3 and "cannot read the file" in r.output
    empty = tmp_path / "empty.csv"
    empty.write_text("# only a comment\n")
    r = run("check", DEMO, "--demands", empty)
    assert r.exit_code == 3 and "no header line" in r.output


def test_semicolons_decimal_commas_and_bom(tmp_path, ids):
    # Spreadsheets in many locales save ';' separated files with decimal commas and a BOM.
    a = ids[0]
    p = tmp_path / "d.csv"
    p.write_bytes(
        ("\ufeffjoint_id;combination;M_Ed_kNm;V_Ed_kN\n" f"{a.id};C1;-1.234,5;40,5\n").encode()
    )
    t = read_demands(p, ids)
    assert not t.problems
    d = t.by_joint[a.id][0]
    assert d.M_Ed == pytest.approx(-1234.5e6) and d.V_Ed == pytest.approx(40.5e3)


def test_unknown_columns_warn_and_other_side_moment_on_single_sided_joint_is_ignored(
    tmp_path, ids
):
    single = next(j for j in ids if j.partner is None)
    p = tmp_path / "d.csv"
    p.write_text(
        "joint_id,combination,M_Ed_kNm,V_Ed_kN,M_Ed_other_side_kNm,remarks\n"
        f"{single.id},C1,-50,40,-20,hello\n"
    )
    t = read_demands(p, ids)
    assert [x.severity for x in t.problems] == ["warning", "warning"]
    assert "remarks" in t.problems[0].message and "no beam on the opposite face" in str(
        t.problems[1]
    )
    assert t.by_joint[single.id][0].M_other is None


def test_demands_template_round_trips(tmp_path, demo_check):
    out = tmp_path / "t.csv"
    r = run("demands", DEMO, "-o", out)
    assert r.exit_code == 0, r.output
    lines = out.read_text().splitlines()
    assert lines[0].startswith("#") and any("hogging" in ln for ln in lines if ln.startswith("#"))
    header = next(ln for ln in lines if not ln.startswith("#"))
    assert header.split(",") == list(TEMPLATE_COLUMNS)
    # an unfilled template is refused row by row (values missing), never passed
    t = read_demands(out, demo_check.scan.joints)
    assert t.rows_read == len(demo_check.scan.joints) and t.rows_used == 0
    assert all("missing required value" in x.message for x in t.problems)
    n = write_template(demo_check.scan.joints[:2], tmp_path / "two.csv")
    assert n == 2


def test_unreadable_header_line_number_counts_comments(tmp_path):
    p = tmp_path / "d.csv"
    p.write_text("# one\n\n# two\njoint_id,combination,M_Ed_kNm\n")
    with pytest.raises(DemandsError) as e:
        read_demands(p, [])
    assert e.value.line == 4 and "V_Ed_kN" in str(e.value)


def test_other_side_moment_comes_from_the_partner_row(tmp_path, ids):
    # Both beams of a double-sided joint have rows for the same combination: each takes the
    # other's M_Ed for beta and the web panel shear (EN 1993-1-8 5.3); a given value that
    # disagrees with the partner's row is kept and warned about.
    a = next(j for j in ids if j.partner is not None and j.partner in {x.id for x in ids})
    p = tmp_path / "d.csv"
    p.write_text(
        "joint_id,combination,M_Ed_kNm,V_Ed_kN,M_Ed_other_side_kNm\n"
        f"{a.id},C1,-150,40,\n"  # line 2
        f"{a.partner},C1,-90,40,\n"  # line 3
        f"{a.id},C2,-150,40,-20\n"  # line 4: says -20 but the partner's row says -90
        f"{a.partner},C2,-90,40,\n"  # line 5
    )
    t = read_demands(p, ids)
    mine = {d.combination: d for d in t.by_joint[a.id]}
    theirs = {d.combination: d for d in t.by_joint[a.partner]}
    assert mine["C1"].M_other == pytest.approx(-90e6) and mine["C1"].other_source.endswith(":3")
    assert theirs["C1"].M_other == pytest.approx(-150e6)
    assert mine["C2"].M_other == pytest.approx(-20e6)
    warn = [x for x in t.problems if x.line == 4]
    assert warn and warn[0].severity == "warning" and "differs" in warn[0].message


def test_empty_spreadsheet_rows_are_not_counted(tmp_path, ids):
    a = ids[0]
    p = tmp_path / "d.csv"
    p.write_text(f"joint_id,combination,M_Ed_kNm,V_Ed_kN\n{a.id},C1,-5,5\n,,,\n;;;\n,,,\n")
    t = read_demands(p, ids)
    assert t.rows_read == 2 and t.rows_rejected == 1  # ';;;' is one cell of text
    assert t.rows_used == 1


def test_template_gives_pinned_joints_no_moment(tmp_path, demo_check):
    # a fin plate is nominally pinned (EN 1993-1-8 5.2.2.2): its row starts at M_Ed = 0
    import pandas as pd

    out = tmp_path / "t.csv"
    write_template(demo_check.scan.joints, out)
    df = pd.read_csv(out, comment="#")
    pinned = df["archetype"].isin(["fin_plate", "beam_to_beam_fin_plate"])
    assert pinned.sum() == 18 and (df[pinned]["M_Ed_kNm"] == 0).all()  # 16 + 2 on beams
    assert df[~pinned]["M_Ed_kNm"].isna().all()
