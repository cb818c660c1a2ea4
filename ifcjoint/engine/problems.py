"""What is wrong with a joint, as a list a coordinator can work through.

Each problem becomes a BCF topic and a row of the issue list. One problem per joint and kind,
so a re-run finds the same problems under the same identities.
"""

from __future__ import annotations

import uuid
from dataclasses import dataclass

from ifcjoint.engine.check import CheckResult
from ifcjoint.engine.demands import JointVerdict
from ifcjoint.engine.results import Joint

#: Namespace of every identity ifcjoint derives (topic and viewpoint GUIDs); never change it.
NAMESPACE = uuid.UUID("6f1d2c3a-5b7e-4c1d-9a8f-0e2b4c6d8a10")
KINDS = ("resistance", "incomplete", "unchecked", "detailing", "assumption")
SEVERITIES = ("critical", "major", "minor")


@dataclass(frozen=True, slots=True, kw_only=True)
class Problem:
    """One reportable problem of a joint.

    Attributes:
        kind: one of ``KINDS``.
        severity: ``critical`` | ``major`` | ``minor`` (the BCF priority).
        title: one line a person can scan.
        description: the numbers and clauses, several lines.
        elements: GlobalIds of the beam, column, plates, bolts and welds involved.
        key: stable identity: beam GlobalId, beam end and kind.
    """

    kind: str
    severity: str
    title: str
    description: str
    elements: tuple[str, ...]
    key: str

    @property
    def guid(self) -> str:
        """A GUID that is the same on every run for the same joint and kind (uuid5)."""
        return str(uuid.uuid5(NAMESPACE, self.key))


def _elements(j: Joint) -> tuple[str, ...]:
    parts = [j.beam, j.column, *(p.guid for p in j.plates), *(b.guid for b in j.bolts)]
    return tuple(dict.fromkeys(parts))


def joint_problems(j: Joint, cap: CheckResult, verdict: JointVerdict) -> tuple[Problem, ...]:
    """Every problem of one joint: failing checks, incomplete or unchecked, detailing, assumption.

    Resistance problems quote each exceeded check with its clause (EN 1993-1-8); detailing
    problems quote each finding with its basis; the assumption problem quotes 5.2.2.
    """
    out: list[Problem] = []
    els = _elements(j)
    name = f"{j.label} ({j.id})"

    def add(kind: str, severity: str, title: str, lines: list[str]) -> None:
        out.append(
            Problem(
                kind=kind,
                severity=severity,
                title=title,
                description="\n".join(lines),
                elements=els,
                key=f"{j.beam}/{j.beam_end}/{kind}",
            )
        )

    st = verdict.status
    if st == "fail":
        g = verdict.governing
        lines = [f"Joint {name}, archetype {j.archetype}."]
        for c in verdict.combinations:
            for u in c.utilisations:
                if u.utilisation > 1.0:
                    lines.append(
                        f"[{u.combination}] {u.name} (EN 1993-1-8 {u.clause}): "
                        f"{u.demand:.1f} {u.unit} > {u.resistance:.1f} {u.unit}, "
                        f"utilisation {u.utilisation:.2f}" + (f"; {u.detail}" if u.detail else "")
                    )
        add(
            "resistance",
            "critical",
            f"{j.label}: {g.name} exceeded, {g.utilisation:.0%} ({g.combination})",
            lines,
        )
    elif st == "incomplete":
        add(
            "incomplete",
            "major",
            f"{j.label}: joint incomplete ({j.archetype})",
            [f"Joint {name}: {j.archetype_reason}.", f"Not checked: {verdict.reason}."],
        )
    elif st in ("no_demands", "unsupported", "unreadable"):
        what = {
            "no_demands": "no design forces given",
            "unsupported": "outside what ifcjoint checks",
            "unreadable": "data missing in the model",
        }[st]
        add(
            "unchecked",
            "major" if st == "unreadable" else "minor",
            f"{j.label}: not checked, {what}",
            [
                f"Joint {name}, archetype {j.archetype}: not checked ({st}).",
                f"Reason: {verdict.reason or cap.reason}.",
            ],
        )
    findings = [f for f in j.findings if f.get("severity") in ("error", "warning")]
    if findings:
        errors = [f for f in findings if f.get("severity") == "error"]
        lines = [f"Joint {name}: {len(findings)} detailing finding(s)."]
        for f in findings:
            lim = ""
            if f.get("measured") is not None and f.get("limit") is not None:
                lim = f" (measured {f['measured']:g}, limit {f['limit']:g})"
            lines.append(f"[{f['severity']}] {f['message']}{lim}; basis: {f['basis']}")
        add(
            "detailing",
            "major" if errors else "minor",
            f"{j.label}: {len(findings)} detailing finding(s), first: {findings[0]['code']}",
            lines,
        )
    a = verdict.assumption
    if a and a.get("match") is False:
        add(
            "assumption",
            "major",
            f"{j.label}: analysed as {a['assumed']}, the joint is {a['computed']}",
            [
                f"Joint {name}: the analysis model assumed a {a['assumed']} joint; by its "
                f"initial stiffness Sj,ini the joint is {a['computed']} (EN 1993-1-8 5.2.2.5). "
                "The frame analysis may need the joint's stiffness (5.1.1, 5.2.2.1).",
            ],
        )
    return tuple(out)
