"""Library entry point: scan a model, read the demands, check every joint.

One :class:`ModelCheck` object holds everything; the CLI, JSON, CSV, BCF and IFC property sets
all render it and none recomputes.

Example:
    >>> import ifcjoint
    >>> mc = ifcjoint.check("sample_models/kestrel-workshop-ifc4-mm.ifc",
    ...                     demands="sample_models/kestrel-workshop-demands.csv")  # doctest: +SKIP
    >>> mc.counts()["pass"]  # doctest: +SKIP
    24
    >>> mc.dataframe().sort_values("utilisation", ascending=False).head()  # doctest: +SKIP
"""

from __future__ import annotations

import datetime as _dt
import hashlib
import json
from collections import Counter
from dataclasses import dataclass, field
from pathlib import Path

from ifcjoint import __version__
from ifcjoint.engine.anatomy import AnatomySettings, JointAnatomy
from ifcjoint.engine.check import CheckResult
from ifcjoint.engine.demands import STATUSES, UNCHECKED, Demand, JointVerdict, verify_joint
from ifcjoint.engine.finder import FinderSettings, Progress
from ifcjoint.engine.inputs import CheckSettings, check_joint
from ifcjoint.engine.problems import Problem, joint_problems
from ifcjoint.engine.results import Joint, ScanResult
from ifcjoint.tables.demands import DemandsTable, read_demands

#: Archetypes that say the joint is not finished in the model.
_INCOMPLETE = ("incomplete", "undetailed")
#: Engine reasons that mean data could not be read (rather than a layout out of scope).
_UNREADABLE_PREFIXES = (
    "not read from the model",
    "steel strength not available",
    "bolt diameter, class, hole or gauge not read",
    "no tensile stress area",
    "section dimensions missing",
)


@dataclass(frozen=True, slots=True, kw_only=True)
class JointCheck:
    """One joint: what was found, what was checked, and its status."""

    joint: Joint
    anatomy: JointAnatomy | None
    capacity: CheckResult
    verdict: JointVerdict
    demands: tuple[Demand, ...]
    fingerprint: str
    problems: tuple[Problem, ...]

    @property
    def status(self) -> str:
        """The status: pass, fail, no_demands, incomplete, unsupported or unreadable."""
        return self.verdict.status

    @property
    def result(self) -> CheckResult:
        """The engine result of the governing combination, else the capacity check."""
        gc = self.verdict.governing_combination
        return gc.result if gc is not None else self.capacity

    @property
    def utilisation(self) -> float | None:
        """Highest utilisation over every combination, or None when not checked."""
        g = self.verdict.governing
        return None if g is None else g.utilisation

    @property
    def detailing_errors(self) -> int:
        """Detailing findings of severity error."""
        return sum(1 for f in self.joint.findings if f.get("severity") == "error")


@dataclass(frozen=True, slots=True, kw_only=True)
class ModelCheck:
    """Everything one ``check`` run produced, for every renderer."""

    scan: ScanResult
    joints: tuple[JointCheck, ...]
    demands: DemandsTable | None
    settings: CheckSettings
    created: _dt.datetime
    tool_version: str = __version__
    notes: tuple[str, ...] = field(default_factory=tuple)

    def counts(self) -> dict[str, int]:
        """Joints by status (every status present, zero or not)."""
        c = Counter(j.status for j in self.joints)
        return {s: c.get(s, 0) for s in STATUSES}

    def unchecked(self) -> list[JointCheck]:
        """Joints that are neither pass nor fail."""
        return [j for j in self.joints if j.status in UNCHECKED]

    def top(self, n: int = 10) -> list[JointCheck]:
        """The n highest utilisations."""
        done = [j for j in self.joints if j.utilisation is not None]
        return sorted(done, key=lambda j: -j.utilisation)[:n]

    def problems(self) -> list[tuple[JointCheck, Problem]]:
        """Every problem of every joint, in joint order."""
        return [(j, p) for j in self.joints for p in j.problems]

    def dataframe(self):
        """One row per joint as a pandas DataFrame (the results CSV's content)."""
        from ifcjoint.outputs.results import results_dataframe

        return results_dataframe(self)


def _status_of_unchecked(a: JointAnatomy | None, cap: CheckResult) -> str:
    if a is not None and a.archetype in _INCOMPLETE:
        return "incomplete"
    if cap.reason.startswith(_UNREADABLE_PREFIXES):
        return "unreadable"
    return "unsupported"


def fingerprint(joint: Joint, cap: CheckResult, demands: tuple[Demand, ...]) -> str:
    """A short hash of what the check used: engine input, demands, tool version.

    Common practice, no source: it changes exactly when a re-check could give another answer.
    """
    blob = {
        "joint": [joint.beam, joint.beam_end, joint.column, joint.archetype],
        "input": cap.inputs,
        "demands": [
            [d.combination, d.M_Ed, d.V_Ed, d.N_Ed, d.M_other, d.Vc_above, d.Vc_below,
             d.braced, d.assumed_joint]
            for d in demands
        ],
        "version": __version__,
    }
    text = json.dumps(blob, sort_keys=True, default=str)
    return hashlib.sha256(text.encode()).hexdigest()[:16]


def check_scan(
    scan: ScanResult,
    demands: DemandsTable | None,
    settings: CheckSettings | None = None,
    *,
    created: _dt.datetime | None = None,
    progress: Progress | None = None,
) -> ModelCheck:
    """Check every joint of a scan against its demands (see :func:`check`)."""
    st = settings or CheckSettings()
    members = {m.guid: m for m in scan.model.members}
    out = []
    n = len(scan.joints)
    for k, j in enumerate(scan.joints, start=1):
        a = scan.anatomy.get(j.id)
        ds = tuple(demands.by_joint.get(j.id, ())) if demands is not None else ()
        if a is None:
            cap = CheckResult(status="not_checked", reason="no anatomy for this joint")
        else:
            cap = check_joint(j, a, members, st)
        if cap.status == "checked":
            inp = cap.input if cap.input is not None else cap.welded_input
            verdict = verify_joint(
                inp, list(ds), double_sided=j.partner is not None, braced_default=st.braced
            )
        else:
            verdict = JointVerdict(status=_status_of_unchecked(a, cap), reason=cap.reason)
        out.append(
            JointCheck(
                joint=j,
                anatomy=a,
                capacity=cap,
                verdict=verdict,
                demands=ds,
                fingerprint=fingerprint(j, cap, ds),
                problems=joint_problems(j, cap, verdict),
            )
        )
        if progress is not None:
            progress("check", k, n)
    when = created or _dt.datetime.now(_dt.UTC).replace(microsecond=0)
    notes = []
    if demands is None:
        notes.append("no demands file given: every checkable joint is unchecked (no_demands)")
    return ModelCheck(
        scan=scan,
        joints=tuple(out),
        demands=demands,
        settings=st,
        created=when,
        notes=tuple(notes),
    )


def check(
    path: str | Path,
    *,
    demands: str | Path | DemandsTable | None = None,
    settings: CheckSettings | None = None,
    finder: FinderSettings | None = None,
    anatomy: AnatomySettings | None = None,
    assume_length_unit: str | None = None,
    rules_file: str | Path | None = None,
    created: _dt.datetime | None = None,
    progress: Progress | None = None,
) -> ModelCheck:
    """Scan a model, read its demands and check every joint.

    Args:
        path: ``.ifc`` or ``.ifczip`` model.
        demands: demands CSV (path) or an already read table; None: nothing is checked
            against forces (every checkable joint is ``no_demands``).
        settings: partial factors and check choices.
        finder: finder tolerances, as for :func:`ifcjoint.scanner.scan`.
        anatomy: what to assume where the model is silent (reported).
        assume_length_unit: unit to use only if the model declares none.
        rules_file: extra recognition rules (TOML).
        created: timestamp to record (inject it for reproducible output).
        progress: optional callback ``(stage, done, total)``.

    Raises:
        ifcjoint.errors.ModelError: the model cannot be used.
        ifcjoint.errors.DemandsError: the demands file cannot be used at all.
    """
    from ifcjoint.scanner import scan as run_scan

    sc = run_scan(
        path,
        settings=finder,
        assume_length_unit=assume_length_unit,
        rules_file=rules_file,
        progress=progress,
        anatomy=anatomy,
    )
    table = read_demands(demands, sc.joints) if isinstance(demands, (str, Path)) else demands
    return check_scan(sc, table, settings, created=created, progress=progress)
