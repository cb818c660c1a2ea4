"""Attachments taken from an earlier run (find/parts.AttachMemo) equal fresh attachments.

The invariant: for any edit, a finder run offered the earlier run's attachments gives the
joints a run without them gives. The demo model is read once; edits are made on its
contents (a plate moved to another joint, a plate and a bolt removed, a member moved), with
each element's content key standing for its read key (an edited element gets a new key).
"""

from __future__ import annotations

from dataclasses import replace

import numpy as np
import pytest

from ifcjoint.find import find_joints
from ifcjoint.find.parts import AttachMemo
from ifcjoint.ifc.reader import read_model
from tests.conftest import SAMPLES


@pytest.fixture(scope="module")
def demo():
    return read_model(SAMPLES / "kestrel-workshop-ifc4-mm.ifc")


def _keys(model, edited=()) -> dict[str, str]:
    keys = {x.guid: f"k-{x.guid}" for x in (*model.members, *model.plates, *model.fasteners)}
    for g in edited:
        keys[g] = f"edited-{g}"
    return keys


def _parts(result) -> dict:
    return {j.id: (j.plates, j.fasteners) for j in result.joints}


def _rerun(first_model, model, edited):
    """(with the earlier run's attachments, fresh, parts reused)."""
    memo = AttachMemo(keys=_keys(first_model))
    find_joints(first_model, memo=memo)
    again = AttachMemo(keys=_keys(model, edited), offered=memo.kept)
    with_memo = find_joints(model, memo=again)
    return _parts(with_memo), _parts(find_joints(model)), again.reused


def test_unchanged_model_takes_every_attachment_and_equals_fresh(demo):
    got, fresh, reused = _rerun(demo, demo, ())
    assert got == fresh
    assert reused == len(demo.plates) + len(demo.fasteners)


def test_a_plate_moved_to_another_joint_equals_fresh(demo):
    first = find_joints(demo)
    with_plates = [j for j in first.joints if j.plates and j.fasteners]
    a, b = with_plates[0], with_plates[-1]
    plate = next(p for p in demo.plates if p.guid == a.plates[0].guid)
    target = next(p for p in demo.plates if p.guid == b.plates[0].guid)
    moved = replace(plate, center=tuple(np.array(target.center) + 1.0),
                    normal=target.normal, u_dir=target.u_dir, v_dir=target.v_dir)
    model = replace(demo, plates=tuple(moved if p.guid == plate.guid else p
                                       for p in demo.plates))
    got, fresh, reused = _rerun(demo, model, (plate.guid,))
    assert got == fresh
    assert got != _parts(first)  # the edit changed the attachments
    assert 0 < reused < len(demo.plates) + len(demo.fasteners)


def test_a_plate_and_a_bolt_removed_equals_fresh(demo):
    first = find_joints(demo)
    j = next(j for j in first.joints if j.plates and j.fasteners)
    model = replace(demo, plates=tuple(p for p in demo.plates if p.guid != j.plates[0].guid),
                    fasteners=tuple(f for f in demo.fasteners
                                    if f.guid != j.fasteners[0].guid))
    got, fresh, _ = _rerun(demo, model, ())
    assert got == fresh and got != _parts(first)


def test_a_member_changed_takes_nothing(demo):
    beam = next(m for m in demo.members if m.kind.value == "beam")
    moved = replace(beam, start=tuple(np.array(beam.start) + (0, 0, 5.0)),
                    end=tuple(np.array(beam.end) + (0, 0, 5.0)))
    model = replace(demo, members=tuple(moved if m.guid == beam.guid else m
                                        for m in demo.members))
    got, fresh, reused = _rerun(demo, model, (beam.guid,))
    assert got == fresh and reused == 0


def test_bolts_attached_through_a_plate_follow_the_plate_when_it_changes():
    """Two beams on a column web, no relations: bolts go to the joint whose plate they pass
    through. With one plate removed, the bolts it held are attached anew (not taken from
    the earlier run, whose joint had that plate)."""
    from tests.find.test_parts import build

    first = build()
    model = replace(first, plates=tuple(p for p in first.plates if p.guid != "PA"))
    got, fresh, reused = _rerun(first, model, ())
    assert got == fresh
    before = _parts(find_joints(first))
    assert got != before  # the removal moved bolts: a memo that ignored plates would fail
    assert reused > 0  # the other joint's plate was taken
