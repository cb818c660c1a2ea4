"""The library API: one ModelCheck object, a DataFrame view, counts that add up."""

from __future__ import annotations

import ifcjoint
from ifcjoint.model.codes import Status
from tests.conftest import SAMPLES


def test_dataframe_has_one_row_per_joint_and_the_same_statuses(demo_check):
    df = demo_check.dataframe()
    assert len(df) == len(demo_check.joints) == len(demo_check.scan.joints)
    assert list(df["status"]) == [jc.status for jc in demo_check.joints]
    assert set(df["status"]) <= {s.value for s in Status}
    counts = demo_check.counts()
    assert sum(counts.values()) == len(df)
    assert counts["pass"] == (df["status"] == "pass").sum()
    # the ten highest utilisations are sorted and all checked
    top = demo_check.top(10)
    u = [jc.utilisation for jc in top]
    assert u == sorted(u, reverse=True) and all(x is not None for x in u)


def test_a_joint_without_demands_is_never_passed(demo_check):
    for jc in demo_check.joints:
        if not jc.demands:
            assert jc.status != "pass" and jc.status != "fail"


def test_package_level_check_is_the_checker():
    mc = ifcjoint.check(SAMPLES / "kestrel-workshop-ifc4-m.ifc")
    assert mc.demands is None and mc.counts()["pass"] == 0
    assert any("no demands file" in n for n in mc.notes)
