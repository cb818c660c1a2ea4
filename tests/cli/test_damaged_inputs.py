"""Damaged inputs, built in code from the valid demo: every case ends cleanly.

Each case runs the command line in process and asserts what every user relies on: a
documented exit code, a one-line message on an error and no traceback, the inputs unchanged,
no partial set of outputs, no temporary file left, and no joint reported ``pass`` that was
not fully checked. Exit codes: README "Exit codes" (``ifcjoint.cli``).
"""

from __future__ import annotations

import hashlib
import json
import os
import random
import re
import zipfile
from pathlib import Path

import pytest
from click.testing import CliRunner

from ifcjoint.cli import main
from tests.conftest import SAMPLES

DEMO = SAMPLES / "kestrel-workshop-ifc4-mm.ifc"
DEMANDS = SAMPLES / "kestrel-workshop-demands.csv"
DOCUMENTED = {0, 1, 2, 3, 4}
TEXT = DEMO.read_text(encoding="ascii")


def _sha(p: Path) -> str:
    return hashlib.sha256(p.read_bytes()).hexdigest()


def run(*args):
    r = CliRunner().invoke(main, list(map(str, args)))
    assert "Traceback" not in r.output, r.output
    if r.exception is not None and not isinstance(r.exception, SystemExit):
        raise AssertionError(f"uncaught {type(r.exception).__name__}: {r.exception}")
    return r


def _no_temporaries(folder: Path) -> None:
    left = [p.name for p in folder.iterdir() if p.name.endswith(".ifcjoint-part")]
    assert not left, left


def _only_checked_pass(js: Path) -> None:
    """The first rule: a joint is pass only when checked, within its resistance, no rule broken."""
    for j in json.loads(js.read_text())["joints"]:
        c = j["check"]
        if c["status"] == "pass":
            assert c["governing"] is not None and c["utilisation"] <= 1.0
            assert not c["detailing_failures"]


def check_case(tmp_path: Path, model: Path, *extra, demands: Path = DEMANDS):
    """Check MODEL with every output; assert the invariants; return (result, outputs)."""
    out = tmp_path / "out"
    out.mkdir(exist_ok=True)
    targets = {"--json": out / "r.json", "--csv": out / "r.csv", "--html": out / "r.html",
               "--bcf": out / "r.bcf", "--ifc-out": out / "r.ifc", "--issues": out / "i.csv"}
    before = {p: _sha(p) for p in (model, demands) if p.is_file()}
    args = ["check", model, "--demands", demands, "--fail-on", "fail", "-q",
            "--timestamp", "2026-12-01", *extra]
    for k, v in targets.items():
        args += [k, v]
    r = run(*args)
    assert r.exit_code in DOCUMENTED, r.output
    assert {p: _sha(p) for p in before} == before  # inputs unchanged
    written = [p for p in targets.values() if p.exists()]
    assert written in ([], list(targets.values())), written  # all outputs or none
    if r.exit_code >= 2:
        lines = [ln for ln in r.output.splitlines() if ln.strip()]
        assert len(lines) == 1 and lines[0].startswith("ifcjoint: error: "), r.output
    else:
        _only_checked_pass(targets["--json"])
        # what we add to the copy never holds a non-finite number (the input's own text is
        # copied as it is: the element holding it is reported unreadable)
        src = set(model.read_text(encoding="ascii", errors="replace").splitlines())
        added = [ln for ln in targets["--ifc-out"].read_text(encoding="ascii").splitlines()
                 if ln not in src]
        assert added and not any(re.search(r"(?i)\bnan\b|\binf", ln) for ln in added)
    _no_temporaries(out)
    return r, targets


def _mutated(tmp_path: Path, text: str, name: str = "m.ifc") -> Path:
    p = tmp_path / name
    p.write_text(text, encoding="ascii")
    return p


def _entity(text: str, pattern: str) -> re.Match:
    m = re.search(pattern, text, re.M)
    assert m, pattern
    return m


BEAM = _entity(TEXT, r"^#(\d+)=IFCBEAM\('([^']+)',\$,'([^']*)',\$,'[^']*',#(\d+),#(\d+)")
BEAM_GUID, BEAM_PLACEMENT = BEAM.group(2), BEAM.group(4)


def _self_placement(t: str) -> str:
    return re.sub(rf"^#{BEAM_PLACEMENT}=IFCLOCALPLACEMENT\(#\d+,",
                  f"#{BEAM_PLACEMENT}=IFCLOCALPLACEMENT(#{BEAM_PLACEMENT},", t, flags=re.M)


def _two_step_cycle(t: str) -> str:
    m = _entity(t, rf"^#{BEAM_PLACEMENT}=IFCLOCALPLACEMENT\(#(\d+),")
    parent = m.group(1)
    t = re.sub(rf"^#{parent}=IFCLOCALPLACEMENT\((\$|#\d+),", f"#{parent}=IFCLOCALPLACEMENT("
               f"#{BEAM_PLACEMENT},", t, flags=re.M)
    return t


def _beam_point(t: str, value: str) -> str:
    """The location point of the first beam's placement set to VALUE in x."""
    pl = _entity(t, rf"^#{BEAM_PLACEMENT}=IFCLOCALPLACEMENT\([^,]+,#(\d+)\);")
    a2p = _entity(t, rf"^#{pl.group(1)}=IFCAXIS2PLACEMENT3D\(#(\d+)")
    pt = a2p.group(1)
    return re.sub(rf"^#{pt}=IFCCARTESIANPOINT\(\(([^,]+),", f"#{pt}=IFCCARTESIANPOINT(({value},",
                  t, flags=re.M)


def _zero_direction(t: str) -> str:
    return t.replace("IFCDIRECTION((0.,0.,1.))", "IFCDIRECTION((0.,0.,0.))")


def _zero_length_members(t: str) -> str:
    return re.sub(r"(IFCEXTRUDEDAREASOLID\(#\d+,#\d+,#\d+,)[0-9.E+-]+\)", r"\g<1>0.)", t)


def _dangling_reference(t: str) -> str:
    return t.replace(BEAM.group(0), BEAM.group(0)[: -len(BEAM.group(5))] + "999999")


def _duplicate_guids(t: str) -> str:
    beams = re.findall(r"^#\d+=IFCBEAM\('([^']+)'", t, re.M)
    for src, dst in ((beams[0], beams[5]), (beams[1], beams[7]), (beams[2], beams[9])):
        t = t.replace(f"IFCBEAM('{dst}'", f"IFCBEAM('{src}'")
    return t


def _representation_cycle(t: str) -> str:
    rep = _entity(t, rf"^#{BEAM.group(5)}=IFCPRODUCTDEFINITIONSHAPE\(\$,\$,\(#(\d+)")
    sr = rep.group(1)
    m = _entity(t, rf"^#{sr}=IFCSHAPEREPRESENTATION\((.*)\(([^()]*)\)\);$")
    t = t.replace(m.group(0), f"#{sr}=IFCSHAPEREPRESENTATION({m.group(1)}(#990001));")
    extra = (f"#990000=IFCREPRESENTATIONMAP(#990003,#{sr});\n"
             "#990001=IFCMAPPEDITEM(#990000,#990002);\n"
             "#990002=IFCCARTESIANTRANSFORMATIONOPERATOR3D($,$,#990004,$,$);\n"
             "#990003=IFCAXIS2PLACEMENT3D(#990004,$,$);\n"
             "#990004=IFCCARTESIANPOINT((0.,0.,0.));\n")
    i = t.rindex("ENDSEC;")
    return t[:i] + extra + t[i:]


def _no_representation(t: str) -> str:
    return t.replace(BEAM.group(0), BEAM.group(0)[: -len(BEAM.group(5)) - 1] + "$")


HOSTILE = "<script>alert(1)</script>=HYPERLINK(\"x\")"


def _hostile_names(t: str) -> str:
    return t.replace(f"'{BEAM.group(3)}'", f"'{HOSTILE}'", 1)


def _schema_lie(t: str) -> str:
    return t.replace("FILE_SCHEMA(('IFC4'))", "FILE_SCHEMA(('IFC2X3'))")


MUTATIONS = {
    "placement refers to itself": _self_placement,
    "placement cycle of two": _two_step_cycle,
    "NaN coordinate": lambda t: _beam_point(t, "NAN"),
    "huge coordinate": lambda t: _beam_point(t, "1.E300"),
    "zero-length direction": _zero_direction,
    "zero-length members": _zero_length_members,
    "dangling reference": _dangling_reference,
    "representation contains itself": _representation_cycle,
    "schema name lies": _schema_lie,
    "beam without a representation": _no_representation,
    "hostile names": _hostile_names,
}


@pytest.mark.parametrize("case", list(MUTATIONS))
def test_damaged_model_ends_cleanly(tmp_path, case):
    model = _mutated(tmp_path, MUTATIONS[case](TEXT))
    assert model.read_text() != TEXT, "the mutation changed nothing"
    check_case(tmp_path, model)


@pytest.mark.parametrize("case", ["placement refers to itself", "placement cycle of two",
                                  "huge coordinate", "representation contains itself",
                                  "beam without a representation"])
def test_an_unreadable_beam_is_listed_and_fails_the_gate(tmp_path, case):
    model = _mutated(tmp_path, MUTATIONS[case](TEXT))
    r, out = check_case(tmp_path, model)
    data = json.loads(out["--json"].read_text())
    bad = {u["element"]: u for u in data["check"]["unreadable_members"]}
    assert BEAM_GUID in bad and bad[BEAM_GUID]["reason"]
    assert bad[BEAM_GUID]["demand_lines"]  # the demo gives that beam forces: rows listed
    assert r.exit_code == 1  # the gate fails on it, even --fail-on fail


def test_hostile_names_are_inert_in_every_output(tmp_path):
    model = _mutated(tmp_path, _hostile_names(TEXT))
    _, out = check_case(tmp_path, model, "--joint", "*")
    assert "<script>alert" not in out["--html"].read_text()
    for name in ("--csv", "--issues"):
        assert ",=HYPERLINK" not in out[name].read_text()
    with zipfile.ZipFile(out["--bcf"]) as z:  # every XML part still parses
        import xml.etree.ElementTree as ET

        for n in z.namelist():
            if n.endswith((".bcf", ".bcfv", ".xml", ".bcfp", ".version")):
                ET.fromstring(z.read(n))


def test_renderers_take_every_value_the_engine_can_give(demo_check, tmp_path):
    # a utilisation that is missing or not finite is shown as "not available", never a crash
    import copy

    from ifcjoint.report.outputs import write_outputs

    results = copy.deepcopy(demo_check.results)
    hit = 0
    for j in results["joints"]:
        for cb in j["check"].get("combinations") or []:
            for k, u in enumerate(cb["utilisations"]):
                u["utilisation"] = None if k % 2 else float("inf")
                hit += 1
        if j["check"]["utilisation"] is not None:
            j["check"]["utilisation"] = float("inf")
    assert hit
    out = {k: tmp_path / f"r.{k}" for k in ("html", "md", "csv", "ifc")}
    write_outputs(results, out)
    assert "not available" in out["html"].read_text()
    data = out["ifc"].read_text().split("DATA;", 1)[1]
    assert not re.search(r"(?i)[(,]\s*-?(inf|nan)", data)  # no REAL no reader parses
    assert "'ifcjoint_JointAtStart'" in data and "'MaxUtilisation'" not in data


@pytest.mark.parametrize("seed", range(6))
def test_byte_flips(tmp_path, seed):
    rng = random.Random(seed)
    raw = bytearray(DEMO.read_bytes())
    for _ in range(20):
        k = rng.randrange(len(raw) // 10, len(raw) - 100)
        raw[k] = rng.choice(b"#(),;'$.0123456789EZ\x00\xff")
    model = tmp_path / "m.ifc"
    model.write_bytes(bytes(raw))
    check_case(tmp_path, model)


def test_repeated_global_ids_stay_apart(tmp_path):
    model = _mutated(tmp_path, _duplicate_guids(TEXT))
    r, out = check_case(tmp_path, model)
    data = json.loads(out["--json"].read_text())
    ids = [j["id"] for j in data["joints"]]
    assert len(ids) == len(set(ids)) == 56  # as many joints as the intact demo, none shared
    beams = {(j["beam"], j["beam_end"]) for j in data["joints"]}
    assert len(beams) == 56
    assert any("#" in b for b, _ in beams)  # the repeats are keyed GlobalId#entity
    assert any("3 GlobalId(s) repeated" in n for n in data["check"]["notes"])
    # every beam end got its own property set, on its own entity
    ifc = out["--ifc-out"].read_text()
    assert ifc.count("'ifcjoint_JointAt") == 56


def _zip(tmp_path: Path, name: str, member: str, data: bytes) -> Path:
    p = tmp_path / name
    with zipfile.ZipFile(p, "w", zipfile.ZIP_DEFLATED) as z:
        z.writestr(member, data)
    return p


def test_zip_bomb_is_refused(tmp_path):
    bomb = _zip(tmp_path, "bomb.ifczip", "m.ifc", b"ISO-10303-21;" + bytes(70 * 1024**2))
    r, _ = check_case(tmp_path, bomb)
    assert r.exit_code == 3 and "zip bomb" in r.output


def test_zip_path_traversal_writes_nothing_outside(tmp_path):
    z = _zip(tmp_path, "evil.ifczip", "../../escaped.ifc", DEMO.read_bytes())
    r, _ = check_case(tmp_path, z)
    assert r.exit_code == 1  # read as the model it holds; never extracted to the file system
    assert not (tmp_path.parent / "escaped.ifc").exists()
    assert not list(tmp_path.parent.parent.glob("escaped.ifc"))


def test_corrupt_zip_member_is_bad_input(tmp_path):
    z = _zip(tmp_path, "m.ifczip", "m.ifc", DEMO.read_bytes())
    raw = bytearray(z.read_bytes())
    for k in range(200, 400):
        raw[k] ^= 0x5A
    z.write_bytes(bytes(raw))
    r, _ = check_case(tmp_path, z)
    assert r.exit_code == 3 and "zip" in r.output


# --- demands files ----------------------------------------------------------------------


def _demands(tmp_path: Path, text: str, encoding="utf-8", newline="\n") -> Path:
    p = tmp_path / "d.csv"
    p.write_text(text.replace("\n", newline), encoding=encoding, newline="")
    return p


DEMANDS_TEXT = DEMANDS.read_text(encoding="utf-8")


@pytest.mark.parametrize("variant", ["bom", "crlf", "semicolon", "formula", "newline-in-cell"])
def test_demands_variants_read_like_the_original(tmp_path, variant):
    text = DEMANDS_TEXT
    kw = {}
    if variant == "bom":
        kw["encoding"] = "utf-8-sig"
    elif variant == "crlf":
        kw["newline"] = "\r\n"
    elif variant == "semicolon":
        lines = [ln if ln.startswith("#") else ln.replace(",", ";") for ln in text.split("\n")]
        text = "\n".join(re.sub(r"(\d)\.(\d)", r"\1,\2", ln) for ln in lines)
    elif variant == "formula":
        text = text.replace("ULS-1 gravity", "=HYPERLINK(\"http://x\";\"ULS-1\")")
    elif variant == "newline-in-cell":
        text = text.replace("ULS-1 gravity", '"ULS-1\ngravity"')
    d = _demands(tmp_path, text, **kw)
    r, out = check_case(tmp_path, DEMO, demands=d)
    data = json.loads(out["--json"].read_text())
    dem = data["check"]["demands"]
    rows = sum(1 for ln in DEMANDS_TEXT.splitlines()
               if ln.strip() and not ln.startswith(("#", "joint_id")))
    assert dem["rows_read"] == rows and dem["rows_rejected"] == 0, dem["problems"]
    if variant == "formula":  # never a live formula in a spreadsheet output
        for name in ("--csv", "--issues"):
            cells = out[name].read_text().replace('"', "").split(",")
            assert not any(c.startswith("=") for c in cells)


def test_rejected_rows_fail_the_gate_and_suggest_the_closest_id(tmp_path):
    rows = DEMANDS_TEXT.split("\n")
    header = next(i for i, ln in enumerate(rows) if ln.startswith("joint_id"))
    from ifcjoint.pipeline import scan

    jid = scan(DEMO).joints[0].id
    typo = jid[:-1] + ("0" if jid[-1] != "0" else "1")
    text = "\n".join(rows[: header + 1] + [f"{typo},,,ULS-1,-10,10,0,,,"])
    r, _ = check_case(tmp_path, DEMO, demands=_demands(tmp_path, text))
    assert r.exit_code == 1  # every row rejected: the gate fails even --fail-on fail
    r = run("check", DEMO, "--demands", tmp_path / "d.csv", "--fail-on", "fail")
    assert f"did you mean {jid}" in r.output


def test_unclosed_quote_names_the_line(tmp_path):
    text = DEMANDS_TEXT.replace("ULS-2 sway", '"ULS-2 sway', 1)
    r, _ = check_case(tmp_path, DEMO, demands=_demands(tmp_path, text))
    assert r.exit_code == 3 and "d.csv:" in r.output and "quoted" in r.output


# --- outputs and inputs -----------------------------------------------------------------


@pytest.mark.parametrize("option", ["--json", "--csv", "--html", "--md", "--issues", "--bcf"])
@pytest.mark.parametrize("victim", ["model", "demands", "symlink", "hardlink"])
def test_an_output_never_replaces_an_input(tmp_path, option, victim):
    model, demands = tmp_path / "m.ifc", tmp_path / "d.csv"
    model.write_bytes(DEMO.read_bytes())
    demands.write_bytes(DEMANDS.read_bytes())
    target = {"model": model, "demands": demands}.get(victim)
    if victim == "symlink":
        target = tmp_path / "link.ifc"
        target.symlink_to(model)
    elif victim == "hardlink":
        target = tmp_path / "hard.ifc"
        os.link(model, target)
    before = (_sha(model), _sha(demands))
    r = run("check", model, "--demands", demands, option, target, "-q")
    assert r.exit_code == 2 and "never replaces an input" in r.output
    assert (_sha(model), _sha(demands)) == before


def test_scan_and_report_never_replace_their_input(tmp_path):
    model = tmp_path / "m.ifc"
    model.write_bytes(DEMO.read_bytes())
    for opt in ("--json", "--csv"):
        assert run("scan", model, opt, model).exit_code == 2
    js = tmp_path / "r.json"
    run("check", model, "--json", js, "-q", "--fail-on", "never")
    before = _sha(js)
    assert run("report", js, "--html", js).exit_code == 2
    assert _sha(js) == before and _sha(model) == _sha(DEMO)


def test_an_unwritable_output_is_found_before_any_work(tmp_path):
    (tmp_path / "file").write_text("x")
    js = tmp_path / "r.json"
    r = run("check", DEMO, "--json", js, "--html", tmp_path / "file" / "r.html", "-q")
    assert r.exit_code == 2 and "is a file, not a folder" in r.output
    assert not js.exists()  # nothing written: no partial set
    r = run("check", DEMO, "--json", tmp_path, "-q")
    assert r.exit_code == 2 and "is a directory" in r.output


def test_a_failing_output_leaves_the_earlier_set_untouched(tmp_path, monkeypatch):
    import ifcjoint.report.outputs as outputs

    js, csv = tmp_path / "r.json", tmp_path / "r.csv"
    js.write_text("earlier")

    def broken(results, path, **kw):
        raise OSError(28, "No space left on device")

    monkeypatch.setitem(outputs.RENDERERS, "csv", broken)
    r = run("check", DEMO, "--json", js, "--csv", csv, "-q")
    assert r.exit_code == 2 and "No space left" in r.output
    assert js.read_text() == "earlier" and not csv.exists()
    _no_temporaries(tmp_path)


def test_an_interrupt_exits_130_and_leaves_nothing(tmp_path, monkeypatch):
    import ifcjoint.report.outputs as outputs

    js, html = tmp_path / "r.json", tmp_path / "r.html"

    def interrupted(results, path, **kw):
        raise KeyboardInterrupt

    monkeypatch.setitem(outputs.RENDERERS, "html", interrupted)
    r = run("check", DEMO, "--json", js, "--html", html, "-q")
    assert r.exit_code == 130 and "interrupted" in r.output
    assert not js.exists() and not html.exists()
    _no_temporaries(tmp_path)


def test_sigterm_ends_the_run_with_143():
    from ifcjoint.cli import EXIT_TERMINATED, _terminated

    with pytest.raises(SystemExit) as e:
        _terminated(15, None)
    assert e.value.code == EXIT_TERMINATED == 143


def test_a_killed_runs_temporaries_are_removed(tmp_path):
    js = tmp_path / "r.json"
    stale = tmp_path / ".r.json.999999999.ifcjoint-part"  # no such process
    stale.write_text("half")
    mine = tmp_path / f".r.json.{os.getppid()}.ifcjoint-part"  # a live process: kept
    mine.write_text("busy")
    assert run("check", DEMO, "--json", js, "-q", "--fail-on", "never").exit_code == 0
    assert not stale.exists() and mine.exists()


def test_outputs_follow_the_umask(tmp_path):
    old = os.umask(0o022)
    try:
        out = {k: tmp_path / f"r.{k}" for k in ("json", "csv", "html", "md", "bcf")}
        args = ["check", DEMO, "-q", "--fail-on", "never"]
        for k, p in out.items():
            args += [f"--{k}", p]
        assert run(*args).exit_code == 0
        for p in out.values():
            assert p.stat().st_mode & 0o777 == 0o644, p
    finally:
        os.umask(old)


def test_a_folder_or_missing_file_as_model_is_exit_3(tmp_path):
    for cmd in ("scan", "check", "demands"):
        extra = ["-o", tmp_path / "t.csv"] if cmd == "demands" else []
        for model in (tmp_path, tmp_path / "missing.ifc"):
            r = run(cmd, model, *extra)
            assert r.exit_code == 3 and r.output.startswith("ifcjoint: error: "), r.output


def test_parameter_and_rules_file_errors_name_the_file(tmp_path):
    p = tmp_path / "p.toml"
    p.write_text("gamma_M2 = 'abc'\n")
    r = run("check", DEMO, "--params", p)
    assert r.exit_code == 3 and "p.toml (--params)" in r.output
    r = run("check", DEMO, "--params", tmp_path / "none.toml")
    assert r.exit_code == 3 and "none.toml (--params)" in r.output
    rules = tmp_path / "r.toml"
    rules.write_text("[members]\nmember_as_column = 5\n")
    r = run("scan", DEMO, "--rules", rules)
    assert r.exit_code == 3 and "r.toml" in r.output


def test_no_numpy_warnings_reach_stderr(tmp_path):
    import subprocess
    import sys

    model = _mutated(tmp_path, _zero_length_members(_beam_point(TEXT, "NAN")))
    p = subprocess.run([sys.executable, "-m", "ifcjoint", "scan", str(model), "-q"],
                       capture_output=True, text=True, timeout=300)
    assert p.returncode in DOCUMENTED
    assert "Warning" not in p.stderr and "Traceback" not in p.stderr, p.stderr
