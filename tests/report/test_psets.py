"""Results written as property sets: typed values, a new file, re-runs replace, never duplicate."""

from __future__ import annotations

import datetime as dt
import hashlib
import json

import ifcopenshell
import ifcopenshell.util.element
import ifcopenshell.validate
import pytest

import ifcjoint
from ifcjoint.errors import UsageError
from ifcjoint.report.psets import PSET_ASSEMBLY, PSET_BEAM_END, write_results_ifc
from ifcjoint.report.results import build_results
from tests.conftest import SAMPLES

WHEN = dt.datetime(2026, 12, 1, 9, 0, tzinfo=dt.UTC)
DEMANDS = SAMPLES / "kestrel-workshop-demands.csv"


def _our_psets(f):
    out = {}
    for el in f.by_type("IfcElement"):
        for name, props in ifcopenshell.util.element.get_psets(el).items():
            if name.startswith("ifcjoint_"):
                out[(el.GlobalId, name)] = {k: v for k, v in props.items() if k != "id"}
    return out


@pytest.mark.parametrize("model", ["kestrel-workshop-ifc4-mm", "kestrel-workshop-ifc2x3-mm"])
def test_round_trip_valid_typed_and_input_untouched(tmp_path, model):
    src = SAMPLES / f"{model}.ifc"
    before = hashlib.sha256(src.read_bytes()).hexdigest()
    mc = ifcjoint.check(src, demands=DEMANDS if "ifc4" in model else None, created=WHEN)
    out = tmp_path / "checked.ifc"
    counts = write_results_ifc(mc.results, out)
    assert counts["beams"] == len(mc.joints) and counts["missing"] == 0
    assert hashlib.sha256(src.read_bytes()).hexdigest() == before
    f = ifcopenshell.open(str(out))
    log = ifcopenshell.validate.json_logger()
    ifcopenshell.validate.validate(f, log)
    assert log.statements == []
    data = build_results(mc)
    for j in data["joints"]:
        beam = f.by_guid(j["beam"])
        ps = ifcopenshell.util.element.get_psets(beam)[PSET_BEAM_END[j["beam_end"]]]
        c = j["check"]
        assert ps["JointId"] == j["id"] and ps["Status"] == c["status"]
        if c["utilisation"] is not None:
            assert ps["MaxUtilisation"] == pytest.approx(c["utilisation"], abs=1e-3)
            clause = c["governing"]["clause"]
            bare = clause[:1].isdigit() or clause.startswith("Table")  # the run's own code
            cited = "EN 1993-1-8 " + clause if bare else clause
            assert ps["GoverningClause"] == cited
        if c["resistance"]:
            assert ps["MjRdHogging"] == pytest.approx(c["resistance"]["Mj_Rd_hogging_kNm"])
            s_j = c["resistance"]["Sj_ini_kNm_per_rad"]
            if s_j is None:  # a pinned fin plate has no stiffness: nothing is written
                assert "SjIni" not in ps
            else:
                assert ps["SjIni"] == pytest.approx(s_j)
    # typed values with their unit on the property
    pset = next(p for p in f.by_type("IfcPropertySet") if p.Name == "ifcjoint_JointAtStart")
    types = {p.Name: (p.NominalValue.is_a(), p.Unit) for p in pset.HasProperties}
    assert types["Status"][0] == "IfcLabel"
    if "MjRdHogging" in types:
        assert types["MjRdHogging"][0] == "IfcTorqueMeasure"
        unit = types["MjRdHogging"][1]
        assert unit.UnitType == "TORQUEUNIT"
        assert types["SjIni"][0] == "IfcRotationalStiffnessMeasure"
    assert not any(p.Name.startswith("Pset_") for p in f.by_type("IfcPropertySet")
                   if p.Name.startswith("ifcjoint"))


def test_rerun_on_own_output_replaces_not_duplicates(tmp_path):
    src = SAMPLES / "kestrel-workshop-ifc4-mm.ifc"
    first = tmp_path / "a.ifc"
    second = tmp_path / "b.ifc"
    mc1 = ifcjoint.check(src, demands=DEMANDS, created=WHEN)
    write_results_ifc(mc1.results, first)
    mc2 = ifcjoint.check(first, demands=DEMANDS, created=WHEN)
    write_results_ifc(mc2.results, second)
    f1, f2 = ifcopenshell.open(str(first)), ifcopenshell.open(str(second))
    assert _our_psets(f1) == _our_psets(f2)
    n1 = len([p for p in f1.by_type("IfcPropertySet") if p.Name.startswith("ifcjoint_")])
    n2 = len([p for p in f2.by_type("IfcPropertySet") if p.Name.startswith("ifcjoint_")])
    assert n1 == n2
    g1 = sorted(p.GlobalId for p in f1.by_type("IfcPropertySet") if p.Name.startswith("ifcj"))
    g2 = sorted(p.GlobalId for p in f2.by_type("IfcPropertySet") if p.Name.startswith("ifcj"))
    assert g1 == g2  # GlobalIds derive from stable inputs
    assert [jc.status for jc in mc1.joints] == [jc.status for jc in mc2.joints]
    assert [jc.fingerprint for jc in mc1.joints] == [jc.fingerprint for jc in mc2.joints]
    # and the issue list has the same topics (GUIDs) when checked from our own output
    assert [p.guid for _, p in mc1.problems()] == [p.guid for _, p in mc2.problems()]


def test_assemblies_get_the_joint_pset():
    # The IFC2X3 demo groups plates and bolts in IfcElementAssembly per joint.
    mc = ifcjoint.check(SAMPLES / "kestrel-workshop-ifc2x3-mm.ifc", created=WHEN)
    import tempfile
    from pathlib import Path

    with tempfile.TemporaryDirectory() as d:
        out = Path(d) / "x.ifc"
        counts = write_results_ifc(mc.results, out)
        assert counts["assemblies"] > 0
        f = ifcopenshell.open(str(out))
        asm = [a for a in f.by_type("IfcElementAssembly")
               if PSET_ASSEMBLY in ifcopenshell.util.element.get_psets(a)]
        assert len(asm) == counts["assemblies"]


def test_output_equal_to_input_is_refused(tmp_path):
    copy = tmp_path / "m.ifc"
    copy.write_bytes((SAMPLES / "kestrel-workshop-ifc4-mm.ifc").read_bytes())
    mc = ifcjoint.check(copy, created=WHEN)
    with pytest.raises(UsageError, match="input model"):
        write_results_ifc(mc.results, copy)


def test_results_json_numbers_match_the_engine(demo_check):
    # One result object, many renderers: the JSON carries the engine's own numbers.
    data = json.loads(json.dumps(build_results(demo_check)))
    for j, jc in zip(data["joints"], demo_check.joints, strict=True):
        g = jc.verdict.governing
        if jc.status in ("pass", "fail"):
            assert j["check"]["governing"]["utilisation"] == pytest.approx(g.utilisation, abs=5e-4)
        else:  # a joint not fully checked shows no utilisation of its own
            assert j["check"]["governing"] is None and j["check"]["utilisation"] is None


def test_ifc4x3_model_gets_valid_psets(build_variant, tmp_path):
    path, _ = build_variant(schema="IFC4X3", relations="assembly")
    mc = ifcjoint.check(path, created=WHEN)
    out = tmp_path / "x.ifc"
    counts = write_results_ifc(mc.results, out)
    assert counts["beams"] == len(mc.joints) > 0
    f = ifcopenshell.open(str(out))
    assert f.schema.startswith("IFC4X3")
    log = ifcopenshell.validate.json_logger()
    ifcopenshell.validate.validate(f, log)
    assert log.statements == []
    assert len(_our_psets(f)) >= len(mc.joints)
