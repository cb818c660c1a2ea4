"""The archetype registry: every archetype is one object; adding one is a module and a line.

A kind of joint is recognised from the anatomy, builds its engine input and is checked by its
own object (DEVELOPERS.md, "Adding an archetype"). Here a type written in the test takes over
the fin plates of the demo and is checked, without touching any other module.
"""

from __future__ import annotations

from ifcjoint.archetypes import BY_ARCHETYPE, REGISTRY, check_joint, decide
from ifcjoint.archetypes.base import JointType, bolt_count
from ifcjoint.engine.results import CheckResult
from ifcjoint.model.codes import Archetype, PartRole, Reason, ReasonCode
from tests.conftest import SAMPLES


class CheckedFinPlate(JointType):
    """A stand-in: recognises fin plates and 'checks' them by returning a fixed shear."""

    archetype = Archetype.FIN_PLATE

    def recognise(self, joint, a):
        if a.main_role == PartRole.FIN_PLATE and a.bolts is not None:
            return Reason(ReasonCode.FIN_PLATE_BOLTS, {"n": bolt_count(a)})
        return None

    def engine_input(self, joint, a, members, st):
        return {"bolts": bolt_count(a)}

    def check(self, inp, joint):
        return CheckResult(V_j_Rd=1000.0 * inp["bolts"])


def test_every_archetype_has_its_object():
    assert set(BY_ARCHETYPE) == set(Archetype)
    assert len({type(t) for t in REGISTRY}) == len(REGISTRY)


def test_a_new_type_registered_is_recognised_and_checked(scan_cached):
    r = scan_cached(SAMPLES / "kestrel-workshop-ifc4-mm.ifc")
    members = {m.guid: m for m in r.model.members}
    fins = [j for j in r.joints if j.archetype == Archetype.FIN_PLATE]
    assert fins
    registry = (CheckedFinPlate(), *(t for t in REGISTRY if t.archetype != Archetype.FIN_PLATE))
    for j in fins:
        a = r.anatomy[j.id]
        assert decide(j, a, registry)[0] == Archetype.FIN_PLATE
        default = check_joint(j, a, members)
        assert default.checked and default.joint_kind == "fin_plate"  # the registered engine
        new = check_joint(j, a, members, registry=registry)
        assert new.checked and new.V_j_Rd == 1000.0 * bolt_count(a)


def test_the_registry_order_decides_overlaps(scan_cached):
    # Angle cleats first (their bolts have no plate, which Incomplete would take for
    # missing parts), then Incomplete: a plate without bolts is incomplete even though an
    # end-plate type would also look at it.
    assert [type(t).__name__ for t in REGISTRY[:2]] == ["AngleCleats", "Incomplete"]


def test_a_plate_short_of_a_flange_is_never_checked_as_a_moment_joint(scan_cached):
    # A header plate (partial depth): its flanges are not on the plate, so the moment
    # components of an end plate do not apply. Built from a demo flush plate, lowered.
    from dataclasses import replace

    from ifcjoint.archetypes import check_joint

    r = scan_cached(SAMPLES / "kestrel-workshop-ifc4-mm.ifc")
    members = {m.guid: m for m in r.model.members}
    plates = [j for j in r.joints if j.archetype in (Archetype.FLUSH_END_PLATE,
                                                     Archetype.EXTENDED_END_PLATE)]
    assert plates  # none of the demo's full plates is taken for a header plate
    j = next(x for x in plates if x.archetype == Archetype.FLUSH_END_PLATE)
    a = r.anatomy[j.id]
    h = a.beam_section.h
    header = replace(a, plate=replace(a.plate, top_from_beam_top=40.0,
                                      bottom_from_beam_top=h - 40.0))
    arche, reason = decide(j, header)
    assert arche == Archetype.PARTIAL_DEPTH_END_PLATE and reason.values["top"] == 40.0
    res = check_joint(replace(j, archetype=arche), header, members)
    assert res.checked and res.joint_kind == "header_plate"  # checked in shear only
    assert res.hogging.M_j_Rd == 0.0 and res.V_j_Rd > 0
