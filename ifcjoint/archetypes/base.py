"""What an archetype is: how it is recognised, how its engine input is built, how it is checked.

Each archetype is one object (a subclass of ``JointType``) in a module of this package,
registered in ``ifcjoint.archetypes.REGISTRY``. Recognition reads the joint's anatomy; the
first registered type that recognises a joint gives its archetype. A type that ifcjoint does
not check says why in ``engine_input``; never a pass.
"""

from __future__ import annotations

from typing import Any, ClassVar

from ifcjoint.anatomy import JointAnatomy
from ifcjoint.archetypes.builders import require_major_axis
from ifcjoint.engine.results import CheckResult
from ifcjoint.engine.settings import CheckSettings
from ifcjoint.model.codes import Archetype, NotChecked, NotCheckedCode, Note, PartRole, Reason
from ifcjoint.model.elements import Member
from ifcjoint.model.joints import Joint


class JointType:
    """An archetype: recognise it, build its engine input, check it.

    Subclasses set ``archetype`` and implement ``recognise``; checkable ones override
    ``engine_input`` and ``check``. The default input is a reason not to check.
    """

    archetype: ClassVar[Archetype]

    def recognise(self, joint: Joint, a: JointAnatomy) -> Reason | None:
        """The reason this joint is of this archetype, or None when it is not."""
        raise NotImplementedError

    def engine_input(
        self, joint: Joint, a: JointAnatomy, members: dict[str, Member], st: CheckSettings
    ) -> Any:
        """The engine input, or a ``NotChecked`` that says why there is none."""
        return require_major_axis(joint) or NotChecked(
            NotCheckedCode.ARCHETYPE_NOT_CHECKED, {"archetype": self.archetype}
        )

    def check(self, inp: Any, joint: Joint) -> CheckResult:
        """The check of an engine input made by ``engine_input`` (the engine, by default)."""
        return self.engine(inp)

    def capacity_notes(self, joint: Joint) -> tuple[Note, ...]:
        """What to say beside the result checked without demands (e.g. the beta it took)."""
        return ()

    def engine(self, inp: Any) -> CheckResult:
        """The engine alone (what a per-combination re-check with another beta runs)."""
        raise NotImplementedError(f"{self.archetype} joints are not checked")


def bolt_count(a: JointAnatomy) -> int:
    """Number of bolts read in the joint's rows."""
    return sum(len(r.bolts) for r in a.bolts.rows) if a.bolts is not None else 0


def end_plate_ready(a: JointAnatomy) -> bool:
    """An end plate with bolts (one standing off the face keeps its kind: a gap finding)."""
    return a.main_role == PartRole.END_PLATE and a.bolts is not None


def bare_beam_end(a: JointAnatomy) -> bool:
    """No plate and no bolts at the beam end."""
    return a.main_role is None and a.bolts is None
