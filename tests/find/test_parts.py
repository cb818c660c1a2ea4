"""Parts attached by geometry where no relation groups them: two beams on one column web.

A HEB 260 column (tw 10 mm; from memory) with IPE 300 beams (h 300, b 150; from memory) on
both sides of its web at one level, each ending on a 15 mm end plate against the web, each
plate with four bolts whose centres lie on its own side, and one bolt passing through both
plates and the web. No relationship in the model ties any part to a member.
"""

from __future__ import annotations

import numpy as np

from ifcjoint.find import find_joints
from ifcjoint.model.elements import Fastener, Member, ModelContents, Plate

TW, TP, Z = 10.0, 15.0, 3800.0


def _beam(guid, y0, y1):
    d = np.sign(y1 - y0)
    return Member(guid=guid, ifc_class="IfcBeam", name=guid, kind="beam",
                  start=(0.0, y0, Z), end=(0.0, y1, Z), depth_dir=(0.0, 0.0, 1.0),
                  width_dir=(-d, 0.0, 0.0), depth=300.0, width=150.0, web_thickness=7.1,
                  flange_thickness=10.7, steel="steel")


def _plate(guid, side):
    y = side * (TW / 2 + TP / 2)
    return Plate(guid=guid, ifc_class="IfcPlate", name=guid, center=(0.0, y, Z),
                 normal=(0.0, side, 0.0), u_dir=(1.0, 0, 0), v_dir=(0, 0, 1.0), half_u=75.0,
                 half_v=170.0, thickness=TP, material="S355")


def _bolt(guid, x, z, y, length):
    return Fastener(guid=guid, ifc_class="IfcMechanicalFastener", name="BOLT M20 8.8",
                    kind="bolt", center=(x, y, z), axis=(0.0, 1.0, 0.0), length=length,
                    diameter=20.0, texts=("BOLT M20 8.8",))


def build():
    col = Member(guid="C", ifc_class="IfcColumn", name="C", kind="column", start=(0, 0, 0),
                 end=(0, 0, 8000.0), depth_dir=(1.0, 0, 0), width_dir=(0, 1.0, 0),
                 depth=260.0, width=260.0, web_thickness=TW, flange_thickness=17.5,
                 steel="steel")
    a = _beam("A", TW / 2 + TP, 5000.0)  # along +y, on the web's +y side
    b = _beam("B", -(TW / 2 + TP), -5000.0)
    bolts = []
    for side, name in ((1, "a"), (-1, "b")):
        for i, (x, dz) in enumerate(((-40, 100), (40, 100), (-40, -100), (40, -100))):
            # a stud-like bolt through its own plate only: centre on its side
            bolts.append(_bolt(f"{name}{i}", x, Z + dz, side * (TW / 2 + TP / 2 + 10), 40.0))
    bolts.append(_bolt("through", 0.0, Z, 0.0, 2 * TP + TW + 30))
    return ModelContents(path="mem", schema="TEST", length_unit_to_mm=1.0,
                         members=(col, a, b), plates=(_plate("PA", 1), _plate("PB", -1)),
                         fasteners=tuple(bolts))


def test_each_side_keeps_its_own_parts():
    r = find_joints(build())
    joints = {j.beam: j for j in r.joints}
    assert {j.axis for j in joints.values()} == {"minor"}
    assert joints["A"].partner == joints["B"].id
    a, b = joints["A"], joints["B"]
    assert [p.guid for p in a.plates] == ["PA"] and [p.guid for p in b.plates] == ["PB"]
    fa = {f.guid for f in a.fasteners}
    fb = {f.guid for f in b.fasteners}
    assert {f"a{i}" for i in range(4)} <= fa and {f"b{i}" for i in range(4)} <= fb
    assert not fa & {f"b{i}" for i in range(4)} and not fb & {f"a{i}" for i in range(4)}
    # the bolt through both plates and the web is attached once, to one of the two
    assert ("through" in fa) != ("through" in fb)
