"""The archetype registry: one object per kind of joint, in the order they are tried.

An archetype object (``base.JointType``) says how the kind is recognised from the joint's
anatomy, builds the engine input, and runs the check. ``decide`` gives a joint its archetype
once; ``check_joint`` checks it with its archetype's object. Adding an archetype is one module
here and one line in ``REGISTRY`` (DEVELOPERS.md, "Adding an archetype").
"""

from __future__ import annotations

from dataclasses import replace

from ifcjoint.anatomy import JointAnatomy
from ifcjoint.archetypes.angle_cleats import AngleCleats
from ifcjoint.archetypes.base import JointType
from ifcjoint.archetypes.beam_to_beam import BeamFinPlate, BeamHeaderPlate
from ifcjoint.archetypes.end_plate import (
    EndPlateUnjudged,
    ExtendedEndPlate,
    FlushEndPlate,
    HaunchedEndPlate,
    PartialDepthEndPlate,
)
from ifcjoint.archetypes.fin_plate import FinPlate
from ifcjoint.archetypes.incomplete import Incomplete, Undetailed
from ifcjoint.archetypes.splice import SPLICE_REGISTRY, EndPlateSplice
from ifcjoint.archetypes.unsupported import Unrecognised, Unsupported
from ifcjoint.archetypes.welded import Welded
from ifcjoint.engine.results import CheckResult, not_checked
from ifcjoint.engine.settings import CheckSettings
from ifcjoint.engine.verify import run_engine
from ifcjoint.model.codes import (
    Archetype,
    FindingCode,
    NotChecked,
    NotCheckedCode,
    Reason,
    ReasonCode,
    Support,
)
from ifcjoint.model.elements import Member
from ifcjoint.model.joints import Joint

#: Every archetype, in the order recognition tries them (the first that recognises wins).
REGISTRY: tuple[JointType, ...] = (
    AngleCleats(),
    Incomplete(),
    BeamHeaderPlate(),
    BeamFinPlate(),
    PartialDepthEndPlate(),
    HaunchedEndPlate(),
    ExtendedEndPlate(),
    FlushEndPlate(),
    EndPlateUnjudged(),
    FinPlate(),
    Welded(),
    Undetailed(),
)
#: Tried before the registry: parts that no registered archetype checks.
OVERRIDES: tuple[JointType, ...] = (Unsupported(),)

_LEFT = Unrecognised()
BY_ARCHETYPE: dict[Archetype, JointType] = {
    t.archetype: t for t in (EndPlateSplice(), *REGISTRY, *OVERRIDES, _LEFT)
}


def decide(
    joint: Joint, a: JointAnatomy, registry: tuple[JointType, ...] = REGISTRY
) -> tuple[Archetype, Reason]:
    """A joint's archetype and the reason, decided once from its anatomy.

    The registry's first match gives the joint's kind; a joint with parts no archetype checks
    (an override) is reported as such, saying what it is otherwise. A splice is tried with
    the splice types alone (``archetypes.splice``).
    """
    if joint.support == Support.SPLICE and registry is REGISTRY:
        registry = SPLICE_REGISTRY
    base = next(
        ((t.archetype, r) for t in registry if (r := t.recognise(joint, a)) is not None),
        (Archetype.UNKNOWN, Reason(ReasonCode.NOT_DECIDED)),
    )
    for t in OVERRIDES:
        r = t.recognise(joint, a)
        if r is not None:
            return t.archetype, Reason(r.code, {**r.values, "otherwise": base[0]})
    return base


def joint_type(
    archetype: Archetype, registry: tuple[JointType, ...] | None = None
) -> JointType:
    """The registered object of an archetype (in the given registry, else the default one)."""
    if registry is not None:
        return next((t for t in registry if t.archetype == archetype), _LEFT)
    return BY_ARCHETYPE.get(archetype, _LEFT)


def joint_input(
    joint: Joint,
    a: JointAnatomy | None,
    members: dict[str, Member],
    settings: CheckSettings | None = None,
    registry: tuple[JointType, ...] | None = None,
):
    """The engine input of a joint by its archetype, or why there is none (``NotChecked``).

    No engine runs: this is what a re-check would compute from, so an earlier result can be
    carried over when it is the same.
    """
    if a is None:
        return NotChecked(NotCheckedCode.NO_ANATOMY)
    unusable = next((f for f in a.findings if f.code == FindingCode.VALUE_NOT_USABLE), None)
    if unusable is not None:  # a dimension that cannot be right: nothing is computed with it
        return NotChecked(NotCheckedCode.VALUE_NOT_USABLE, {
            "what": unusable.detail["what"], "entity": unusable.detail["entity"],
            "value": unusable.measured})
    jt = joint_type(joint.archetype, registry)
    return jt.engine_input(joint, a, members, settings or CheckSettings())


def run_joint(
    joint: Joint,
    a: JointAnatomy | None,
    members: dict[str, Member],
    settings: CheckSettings | None = None,
    registry: tuple[JointType, ...] | None = None,
    cache: dict | None = None,
) -> tuple[CheckResult, CheckResult]:
    """Check one joint with its archetype's object.

    Returns the engine's own result and the same result with the archetype's notes for a
    check without demands; both say why when the joint is not checked. ``cache`` shares
    engine results between joints with equal inputs (``engine.verify.run_engine``).
    """
    st = settings or CheckSettings()
    jt = joint_type(joint.archetype, registry)
    inp = joint_input(joint, a, members, st, registry)
    if isinstance(inp, NotChecked):
        r = not_checked(inp)
        return r, r
    r = jt.check(inp, joint) if cache is None else run_engine(jt.engine, inp, cache)
    if not r.checked:
        return r, r
    return r, replace(r, notes=(*r.notes, *jt.capacity_notes(joint)))


def check_joint(
    joint: Joint,
    a: JointAnatomy | None,
    members: dict[str, Member],
    settings: CheckSettings | None = None,
    registry: tuple[JointType, ...] | None = None,
) -> CheckResult:
    """Check one joint with its archetype's object, or say why it is not checked."""
    return run_joint(joint, a, members, settings, registry)[1]


__all__ = [
    "BY_ARCHETYPE", "REGISTRY", "JointType", "check_joint", "decide", "joint_input", "joint_type",
    "run_joint",
]
