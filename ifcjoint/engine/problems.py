"""What is wrong with a joint, as a list a coordinator can work through (data, not words).

Each problem becomes a BCF topic and a row of the issue list; the renderers write its title
and description from its kind and its facts. One problem per joint and kind, so a re-run finds
the same problems under the same identities.
"""

from __future__ import annotations

from dataclasses import dataclass

from ifcjoint.engine.verify import Assumption, JointVerdict, Utilisation
from ifcjoint.model.codes import NotChecked, Priority, ProblemKind, Severity, Status
from ifcjoint.model.identity import problem_key, stable_uuid
from ifcjoint.model.joints import Finding, Joint


@dataclass(frozen=True, slots=True, kw_only=True)
class Problem:
    """One reportable problem of a joint.

    Attributes:
        kind: what kind of problem.
        priority: critical, major or minor (the BCF priority).
        elements: GlobalIds of the beam, column, plates, bolts and welds involved.
        key: stable identity: beam GlobalId, beam end and kind.
        exceeded: the utilisations above 1 (resistance problems).
        governing: the governing utilisation (resistance problems).
        status: the joint's status (unchecked problems).
        reason: why it was not checked (unchecked and incomplete problems).
        findings: the detailing findings (detailing problems).
        assumption: the analysis assumption that does not hold (assumption problems).
    """

    kind: ProblemKind
    priority: Priority
    elements: tuple[str, ...]
    key: str
    exceeded: tuple[Utilisation, ...] = ()
    governing: Utilisation | None = None
    status: Status | None = None
    reason: NotChecked | None = None
    findings: tuple[Finding, ...] = ()
    assumption: Assumption | None = None

    @property
    def guid(self) -> str:
        """A GUID that is the same on every run for the same joint and kind (uuid5)."""
        return str(stable_uuid(self.key))


def _elements(j: Joint) -> tuple[str, ...]:
    parts = [j.beam, j.column, *(p.guid for p in j.plates), *(b.guid for b in j.fasteners)]
    return tuple(dict.fromkeys(parts))


#: Priority of an unchecked joint's problem by its status.
_UNCHECKED_PRIORITY = {
    Status.NO_DEMANDS: Priority.MINOR,
    Status.UNSUPPORTED: Priority.MINOR,
    Status.UNREADABLE: Priority.MAJOR,
}


def joint_problems(
    j: Joint, verdict: JointVerdict, reason: NotChecked | None
) -> tuple[Problem, ...]:
    """Every problem of one joint: failing checks, incomplete or unchecked, detailing, assumption.

    ``reason`` is the engine's reason for not checking the joint, when the verdict has none.
    """
    out: list[Problem] = []
    els = _elements(j)

    def add(kind: ProblemKind, priority: Priority, **facts) -> None:
        key = problem_key(j.beam, j.beam_end, kind)
        out.append(Problem(kind=kind, priority=priority, elements=els, key=key, **facts))

    st = verdict.status
    exceeded = tuple(
        u for c in verdict.combinations for u in c.utilisations if u.utilisation > 1.0
    )
    if st == Status.FAIL and exceeded:
        governing = max(exceeded, key=lambda u: u.utilisation)
        add(ProblemKind.RESISTANCE, Priority.CRITICAL, exceeded=exceeded, governing=governing)
    elif st == Status.INCOMPLETE:
        add(ProblemKind.INCOMPLETE, Priority.MAJOR, reason=verdict.reason or reason)
    elif st in _UNCHECKED_PRIORITY:
        add(ProblemKind.UNCHECKED, _UNCHECKED_PRIORITY[st], status=st,
            reason=verdict.reason or reason)
    findings = tuple(f for f in j.findings if f.severity in (Severity.ERROR, Severity.WARNING))
    if findings:
        errors = any(f.severity == Severity.ERROR for f in findings)
        # a broken rule the resistance depends on fails the joint: as urgent as a failing check
        priority = (Priority.CRITICAL if verdict.detailing
                    else Priority.MAJOR if errors else Priority.MINOR)
        add(ProblemKind.DETAILING, priority, findings=findings,
            governing=verdict.detailing[0] if verdict.detailing else None)
    a = verdict.assumption
    if a is not None and a.match is False:
        add(ProblemKind.ASSUMPTION, Priority.MAJOR, assumption=a)
    return tuple(out)
