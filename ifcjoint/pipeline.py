"""The pipeline, stage by stage: read, find, anatomy, archetype, check, verify, report.

``scan(path)`` reads a model (``ifc``), finds its joints (``find``), reads each joint's anatomy
(``anatomy``) and gives it its archetype (``archetypes``). ``check(path, demands=...)`` goes on:
each joint is checked by its archetype's engine (``check``) and verified against its demands.
One :class:`ModelCheck` object holds everything; its ``results`` dictionary (built once, by
``ifcjoint.report.results``) is what every output renders.

Example:
    >>> import ifcjoint
    >>> mc = ifcjoint.check("sample_models/kestrel-workshop-ifc4-mm.ifc",
    ...                     demands="sample_models/kestrel-workshop-demands.csv")  # doctest: +SKIP
    >>> mc.counts()["pass"]  # doctest: +SKIP
    21
"""

from __future__ import annotations

import datetime as _dt
import functools
import hashlib
import json
from collections import Counter
from dataclasses import dataclass, field, replace
from functools import cached_property
from pathlib import Path

from ifcjoint import __version__
from ifcjoint.anatomy import AnatomySettings, JointAnatomy, analyse
from ifcjoint.archetypes import decide, joint_input, joint_type, run_joint
from ifcjoint.archetypes.description import (
    DescriptionError,
    archetype_of,
    demands_from_description,
    description_findings,
    engine_for,
    input_from_description,
)
from ifcjoint.engine.inputs import input_record
from ifcjoint.engine.problems import Problem, joint_problems
from ifcjoint.engine.results import CheckResult
from ifcjoint.engine.settings import CheckSettings
from ifcjoint.engine.verify import JointVerdict, detailing_utilisations, verify_joint
from ifcjoint.errors import JointFileError, NoSteelError
from ifcjoint.find import FinderSettings, find_joints
from ifcjoint.find.parts import AttachMemo
from ifcjoint.ifc.reader import MEMBER_CLASSES, read_model
from ifcjoint.ifc.recognition import load_rules
from ifcjoint.model.codes import (
    UNCHECKED,
    Archetype,
    MemberKind,
    NotChecked,
    NotCheckedCode,
    Priority,
    ProblemKind,
    Status,
    SteelState,
)
from ifcjoint.model.demands import Demand
from ifcjoint.model.elements import Progress, Unreadable
from ifcjoint.model.joints import Finding, Joint, ScanResult
from ifcjoint.tables.demands import DemandsTable, read_demands
from ifcjoint.tables.joint_file import read_description


def scan(
    path: str | Path,
    *,
    settings: FinderSettings | None = None,
    assume_length_unit: str | None = None,
    rules_file: str | Path | None = None,
    progress: Progress | None = None,
    anatomy: AnatomySettings | None = None,
    reads=None,
) -> ScanResult:
    """Read a model and find every beam-to-column joint in it, with its anatomy and archetype.

    Args:
        path: ``.ifc`` or ``.ifczip`` model.
        settings: finder tolerances (defaults when None).
        assume_length_unit: unit to use only if the model declares none.
        rules_file: extra recognition rules (TOML) on top of the bundled ones.
        progress: optional callback ``(stage, done, total)``.
        anatomy: what to assume where the model says nothing (reported as assumptions).
        reads: an earlier run's element reads (``ifcjoint.ifc.read_cache.ReadCache``):
            unchanged elements are not read again; this run's reads are kept in it.

    Raises:
        ifcjoint.errors.ModelError: the model cannot be used.
        ifcjoint.errors.ConfigError: the rules file cannot be used.
    """
    rules = load_rules(rules_file)
    model = read_model(path, assume_length_unit=assume_length_unit, rules=rules,
                       progress=progress, reads=reads)
    memo = None
    if reads is not None and reads.usable:
        memo = AttachMemo(keys=reads.guid_keys, offered=reads.attach_offered)
    found = find_joints(model, settings, progress=progress, memo=memo)
    if memo is not None:
        reads.attach_kept, reads.attach_reused = memo.kept, memo.reused
    return describe_joints(found, anatomy, reads)


def describe_joints(result: ScanResult, settings: AnatomySettings | None = None,
                    reads=None) -> ScanResult:
    """Add each joint's anatomy, archetype and detailing findings to a scan.

    With ``reads`` (``ifcjoint.ifc.read_cache.ReadCache``), a joint's earlier anatomy is
    taken when the joint is the same and every element its anatomy looked up is an
    unchanged read (:func:`_analyse_reusing`).
    """
    if reads is None or not reads.usable:
        anatomy = analyse(result.joints, result.model, settings)
    else:
        anatomy = _analyse_reusing(result.joints, result.model, settings, reads)
    joints = []
    for j, a in zip(result.joints, anatomy, strict=True):
        archetype, reason = decide(j, a)
        joints.append(
            replace(j, archetype=archetype, archetype_reason=reason, findings=a.findings)
        )
    return replace(result, joints=tuple(joints), anatomy={a.joint_id: a for a in anatomy})


class _Seen(dict):
    """A dictionary that notes every key looked up (to know what an anatomy depended on)."""

    def __init__(self, items) -> None:
        super().__init__(items)
        self.seen: set = set()

    def __getitem__(self, k):
        self.seen.add(k)
        return dict.__getitem__(self, k)

    def get(self, k, default=None):
        self.seen.add(k)
        return dict.get(self, k, default)

    def __contains__(self, k) -> bool:
        self.seen.add(k)
        return dict.__contains__(self, k)


def _analyse_reusing(joints, model, settings: AnatomySettings | None, reads):
    """Each joint's anatomy, taken from the earlier run where nothing it used changed.

    Common practice, no source: an anatomy is a function of the joint the finder made, the
    anatomy settings and the elements it looks up; the lookups of a fresh analysis are
    recorded, and an earlier anatomy is used only when the joint is equal and every element
    it looked up has the read key it had then (an element without one, or not in the model,
    means a fresh analysis).
    """
    from ifcjoint.anatomy import analyse_joint

    st = settings or AnatomySettings()
    members = _Seen((m.guid, m) for m in model.members)
    plates = _Seen((p.guid, p) for p in model.plates)
    fasteners = _Seen((x.guid, x) for x in model.fasteners)
    looked = (members, plates, fasteners)
    base = f"{__version__}|{st!r}|"
    keys = reads.guid_keys
    out = []
    for j in joints:
        jk = hashlib.sha256((base + repr(j)).encode()).hexdigest()
        hit = reads.anatomy_offered.get(jk)
        if hit is not None and all(keys.get(g) == k for g, k in hit[0]):
            reads.anatomy_kept[jk] = hit
            reads.anatomy_reused += 1
            out.append(hit[1])
            continue
        for d in looked:
            d.seen.clear()
        a = analyse_joint(j, members, plates, fasteners, st)
        used = tuple(sorted((g, keys.get(g)) for d in looked for g in d.seen))
        if all(k is not None for _, k in used):
            reads.anatomy_kept[jk] = (used, a)
        out.append(a)
    return tuple(out)


def require_steel(result: ScanResult) -> None:
    """Raise when the model holds no steel beams or columns to scan.

    Raises:
        NoSteelError: no steel beam or column was read (exit code 4).
    """
    kinds = (MemberKind.BEAM, MemberKind.COLUMN)
    m = result.model
    if not any(x.kind in kinds and x.steel != SteelState.NON_STEEL for x in m.members):
        c = m.counts
        raise NoSteelError(
            m.path,
            f"{c.get('beams', 0)} beams, {c.get('columns', 0)} columns read, "
            f"{c.get('non_steel_members', 0)} of them not steel",
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
    def status(self) -> Status:
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


@dataclass(frozen=True, slots=True)
class CarriedProblem:
    """A problem of a carried-over joint, as the earlier run recorded it."""

    kind: ProblemKind
    priority: Priority
    guid: str


@dataclass(frozen=True, slots=True, kw_only=True)
class CarriedCheck:
    """A joint whose every input is the earlier run's: its result is carried over, not re-run.

    ``record`` is the earlier run's check of the joint (results JSON), shown as it was, with
    where it came from; the demands are the ones read now (equal in value: the fingerprint
    covers them).
    """

    joint: Joint
    anatomy: JointAnatomy | None
    demands: tuple[Demand, ...]
    fingerprint: str
    record: dict
    previous: PreviousRun

    @property
    def status(self) -> Status:
        """The status the earlier run gave."""
        return Status(self.record["status"])

    @property
    def utilisation(self) -> float | None:
        """The earlier run's highest utilisation (None when not checked)."""
        return self.record.get("utilisation")

    @property
    def problems(self) -> tuple[CarriedProblem, ...]:
        """The earlier run's problems: kind, priority and topic GUID."""
        return tuple(CarriedProblem(ProblemKind(p["kind"]), Priority(p["severity"]), p["guid"])
                     for p in self.record.get("problems", ()))


@dataclass(frozen=True, kw_only=True)
class PreviousRun:
    """An earlier run's results (``check --json``), to compare with and to carry over from.

    A joint's earlier result is carried over only when everything a re-check would start from
    is the same: the joint as the scan describes it (members, parts, anatomy, findings,
    label), its engine input, its demands, the design code with its parameters and the
    frame default, and the tool version.
    """

    path: str
    results: dict

    @cached_property
    def joints(self) -> dict[str, dict]:
        """The earlier run's joints by id."""
        return {j["id"]: j for j in self.results.get("joints", ())}

    @property
    def created(self) -> str:
        """When the earlier run checked (its timestamp)."""
        return self.results.get("check", {}).get("created", "")

    def settings_match(self, st: CheckSettings) -> bool:
        """The earlier run used the same code, parameters, frame default and tool version."""
        c = self.results.get("check", {})
        return (c.get("tool_version") == __version__
                and c.get("design_code") == st.code.name
                and c.get("params") == json.loads(json.dumps(st.params.as_dict()))
                and c.get("braced_default") == st.braced
                and c.get("alpha_method", "chart") == st.alpha_method)


def _scan_digest(joint_record: dict) -> str:
    """A digest of a joint's scan description (the results record without its check).

    As the results file writes it: a value that is not finite reads as null there and
    here (whether the engine saw a missing value or a NaN, the engine input's fingerprint
    tells apart: :func:`fingerprint`).
    """
    import orjson

    body = {k: v for k, v in joint_record.items() if k != "check"}
    text = orjson.dumps(body, default=str, option=orjson.OPT_SORT_KEYS
                        | orjson.OPT_NON_STR_KEYS | orjson.OPT_SERIALIZE_NUMPY)
    return hashlib.sha256(text).hexdigest()


def carry_over(j: Joint, a, members: dict, demands: tuple[Demand, ...], st: CheckSettings,
               previous: PreviousRun, scan_record: dict) -> CarriedCheck | None:
    """The earlier run's result of this joint when nothing a re-check uses has changed.

    Common practice, no source: a result depends only on its inputs, so the same inputs
    give the same result; anything that differs (a value, a part, a demand row, a setting,
    the tool version) means a re-check.
    """
    old = previous.joints.get(j.id)
    if old is None or "check" not in old:
        return None
    if _scan_digest(old) != _scan_digest(scan_record):
        return None
    inp = joint_input(j, a, members, st)
    fp = fingerprint(j, None if isinstance(inp, NotChecked) else inp, demands)
    if fp != old["check"].get("fingerprint"):
        return None
    return CarriedCheck(joint=j, anatomy=a, demands=demands, fingerprint=fp,
                        record=old["check"], previous=previous)


@dataclass(frozen=True, kw_only=True)
class ModelCheck:
    """Everything one ``check`` run produced, for every renderer."""

    scan: ScanResult
    joints: tuple[JointCheck, ...]
    demands: DemandsTable | None
    settings: CheckSettings
    created: _dt.datetime
    tool_version: str = __version__
    notes: tuple[str, ...] = field(default_factory=tuple)
    previous: PreviousRun | None = None
    scan_record: dict | None = None

    @property
    def carried(self) -> int:
        """How many joints' results were carried over from the earlier run."""
        return sum(1 for j in self.joints if isinstance(j, CarriedCheck))

    def counts(self) -> dict[str, int]:
        """Joints by status (every status present, zero or not)."""
        c = Counter(j.status for j in self.joints)
        return {s.value: c.get(s, 0) for s in Status}

    def unchecked(self) -> list[JointCheck]:
        """Joints that are neither pass nor fail."""
        return [j for j in self.joints if j.status in UNCHECKED]

    def unreadable_members(self) -> list[Unreadable]:
        """Beams, columns and members the model holds but that could not be read.

        Their joints cannot even be found: each is listed with its reason, and fails every
        gate but ``never``.
        """
        return [u for u in self.scan.model.unreadable if u.ifc_class in MEMBER_CLASSES]

    def top(self, n: int = 10) -> list[JointCheck]:
        """The n highest utilisations."""
        done = [j for j in self.joints if j.utilisation is not None]
        return sorted(done, key=lambda j: -j.utilisation)[:n]

    def problems(self) -> list[tuple[JointCheck, Problem]]:
        """Every problem of every joint, in joint order."""
        return [(j, p) for j in self.joints for p in j.problems]

    @cached_property
    def results(self) -> dict:
        """The results dictionary every output renders (built once; docs/results.md)."""
        from ifcjoint.report.results import build_results

        return build_results(self)

    def dataframe(self):
        """One row per joint as a pandas DataFrame (the results CSV's content)."""
        from ifcjoint.report.results import results_dataframe

        return results_dataframe(self.results)


def fingerprint(joint: Joint, inp, demands: tuple[Demand, ...]) -> str:
    """A short hash of what the check used: engine input (None: none), demands, tool version.

    Common practice, no source: it changes exactly when a re-check could give another answer.
    """
    blob = (
        (joint.beam, joint.beam_end, joint.column, str(joint.archetype)),
        _input_digest(inp) if inp is not None else "",
        tuple((d.combination, d.M_Ed, d.V_Ed, d.N_Ed, d.M_other, d.Vc_above, d.Vc_below,
               d.braced, None if d.assumed_joint is None else str(d.assumed_joint), d.V_other)
              for d in demands),
        __version__,
    )
    return hashlib.sha256(repr(blob).encode()).hexdigest()[:16]


@functools.lru_cache(maxsize=4096)
def _input_digest(inp) -> str:
    """A digest of an engine input's every value (kept per input: joints share inputs)."""
    text = json.dumps(input_record(inp), sort_keys=True, default=str)
    return hashlib.sha256(text.encode()).hexdigest()


def check_one(
    j: Joint,
    a: JointAnatomy | None,
    members: dict,
    demands: tuple[Demand, ...],
    st: CheckSettings,
    cache: dict | None = None,
) -> JointCheck:
    """Check one joint by its archetype and verify it against its demands.

    ``cache`` (one dict for a whole model) lets joints with equal engine inputs share one
    engine run.
    """
    engine_result, cap = run_joint(j, a, members, st, cache=cache)
    if cap.checked:
        verdict = verify_joint(
            cap.input,
            list(demands),
            engine=joint_type(j.archetype).engine,
            double_sided=j.partner is not None,
            braced_default=st.braced,
            seed=engine_result,
            cache=cache,
        )
    else:
        reason = cap.not_checked
        status = Status.INCOMPLETE if j.archetype.incomplete else reason.status
        verdict = JointVerdict(status=status, reason=reason)
    verdict = with_detailing(verdict, j.findings)
    return JointCheck(
        joint=j,
        anatomy=a,
        capacity=cap,
        verdict=verdict,
        demands=demands,
        fingerprint=fingerprint(j, cap.input, demands),
        problems=joint_problems(j, verdict, cap.not_checked),
    )


def with_detailing(verdict: JointVerdict, findings) -> JointVerdict:
    """The verdict with the broken rules the resistance depends on: any makes the joint fail.

    An incomplete joint stays incomplete (its parts are missing: there is nothing to fail);
    any other status, checked or not, becomes ``fail`` with the worst broken rule governing
    when its utilisation exceeds every load combination's. The reason a joint was not
    checked is kept beside it.
    """
    broken = detailing_utilisations(findings)
    if not broken or verdict.status == Status.INCOMPLETE:
        return verdict
    return replace(verdict, status=Status.FAIL, detailing=broken)


def check_scan(
    scan: ScanResult,
    demands: DemandsTable | None,
    settings: CheckSettings | None = None,
    *,
    created: _dt.datetime | None = None,
    progress: Progress | None = None,
    previous: PreviousRun | None = None,
    notes: tuple[str, ...] = (),
) -> ModelCheck:
    """Check every joint of a scan against its demands (see :func:`check`).

    With ``previous`` (an earlier run's results), a joint whose inputs are all the earlier
    run's is not re-checked: its result is carried over (:func:`carry_over`), and the
    results compare the two runs joint by joint.
    """
    st = settings or CheckSettings()
    members = {m.guid: m for m in scan.model.members}
    out = []
    n = len(scan.joints)
    cache: dict = {}  # engine results by input: a model's repeated joints run once
    records = None
    if previous is not None:
        from ifcjoint.report.scan import build_scan

        records = build_scan(scan)
        by_id = {r["id"]: r for r in records["joints"]}
        if not previous.settings_match(st):
            by_id = {}  # other settings or tool version: everything is checked again
    for k, j in enumerate(scan.joints, start=1):
        ds = tuple(demands.by_joint.get(j.id, ())) if demands is not None else ()
        a = scan.anatomy.get(j.id)
        kept = None
        if records is not None and j.id in by_id:
            kept = carry_over(j, a, members, ds, st, previous, by_id[j.id])
        out.append(kept if kept is not None else check_one(j, a, members, ds, st, cache))
        if progress is not None:
            progress("check", k, n)
    when = created or _dt.datetime.now(_dt.UTC).replace(microsecond=0)
    notes = list(notes)
    if previous is not None:
        carried = sum(1 for x in out if isinstance(x, CarriedCheck))
        why = "" if previous.settings_match(st) else (
            " (it used other settings or another tool version: every joint re-checked)")
        notes.append(f"compared with {previous.path} (checked {previous.created}): "
                     f"{carried} of {n} joint(s) unchanged and carried over, not re-checked"
                     + why)
    if demands is None:
        notes.append("no demands file given: every checkable joint is unchecked (no_demands)")
    rep = scan.model.repeated_ids
    if rep:
        shown = ", ".join(f"{g} ({len(ids)} elements)" for g, ids in list(rep.items())[:5])
        notes.append(
            f"warning: {len(rep)} GlobalId(s) repeated in the model ({shown}"
            f"{', ...' if len(rep) > 5 else ''}): each element is kept apart and named "
            "GlobalId#entity in the results; GlobalIds must be unique, fix the model")
    return ModelCheck(
        scan=scan,
        joints=tuple(out),
        demands=demands,
        settings=st,
        created=when,
        notes=tuple(notes),
        previous=previous,
        scan_record=records,
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
    previous: PreviousRun | None = None,
) -> ModelCheck:
    """Scan a model, read its demands and check every joint.

    Args:
        path: ``.ifc`` or ``.ifczip`` model.
        demands: demands CSV (path) or an already read table; None: nothing is checked
            against forces (every checkable joint is ``no_demands``).
        settings: the design code with its parameters, and check choices.
        finder: finder tolerances, as for :func:`scan`.
        anatomy: what to assume where the model is silent (reported).
        assume_length_unit: unit to use only if the model declares none.
        rules_file: extra recognition rules (TOML).
        created: timestamp to record (inject it for reproducible output).
        progress: optional callback ``(stage, done, total)``.
        previous: an earlier run's results (:class:`PreviousRun`): unchanged joints are
            carried over, and the results compare the two runs.

    Raises:
        ifcjoint.errors.ModelError: the model cannot be used.
        ifcjoint.errors.DemandsError: the demands file cannot be used at all.
    """
    sc = scan(
        path,
        settings=finder,
        assume_length_unit=assume_length_unit,
        rules_file=rules_file,
        progress=progress,
        anatomy=anatomy,
    )
    table = (read_demands(demands, sc.joints, sc.model.unreadable)
             if isinstance(demands, (str, Path)) else demands)
    return check_scan(sc, table, settings, created=created, progress=progress,
                      previous=previous)


@dataclass(frozen=True, kw_only=True)
class JointCalc:
    """One joint checked from a description, without a model (``ifcjoint calc``).

    It answers the same questions as a ``JointCheck`` (status, engine result, verdict,
    demands), so the report's one-joint renderers take either.
    """

    path: str
    label: str
    archetype: Archetype
    capacity: CheckResult
    verdict: JointVerdict
    demands: tuple[Demand, ...]
    fingerprint: str
    settings: CheckSettings
    created: _dt.datetime
    double_sided: bool = False
    findings: tuple[Finding, ...] = ()
    problems: tuple[Problem, ...] = ()
    tool_version: str = __version__

    @property
    def status(self) -> Status:
        """The status: pass, fail, no_demands or unsupported (with the reason)."""
        return self.verdict.status

    @property
    def result(self) -> CheckResult:
        """The engine result of the governing combination, else the check without demands."""
        gc = self.verdict.governing_combination
        return gc.result if gc is not None else self.capacity

    @cached_property
    def results(self) -> dict:
        """The one-joint results dictionary (docs/joint-file.md, "Output")."""
        from ifcjoint.report.calc import build_calc_results

        return build_calc_results(self)


def calc(
    source: str | Path | dict,
    *,
    settings: CheckSettings | None = None,
    created: _dt.datetime | None = None,
) -> JointCalc:
    """Check one joint from a description (a TOML/JSON file, or the dict itself).

    Raises:
        ifcjoint.errors.JointFileError: the file or a value in it cannot be used (the key is
            named).
    """
    st = settings or CheckSettings()
    path = "<description>" if isinstance(source, dict) else str(source)
    data = source if isinstance(source, dict) else read_description(source)
    try:
        inp = input_from_description(data, st)
        demands = tuple(demands_from_description(data, Path(path).name))
    except DescriptionError as exc:
        raise JointFileError(path, exc.key, exc.problem) from None
    double_sided = data.get("double_sided", False)
    if not isinstance(double_sided, bool):
        raise JointFileError(path, "double_sided", f"{double_sided!r} is not true/false")
    archetype = archetype_of(inp)
    engine = engine_for(inp)
    cap = engine(inp)
    if cap.checked and not demands:
        verdict = JointVerdict(status=Status.NO_DEMANDS, reason=NotChecked(
            NotCheckedCode.NO_DEMANDS, {"source": "description"}))
    elif cap.checked:
        verdict = verify_joint(inp, list(demands), engine=engine, double_sided=double_sided,
                               braced_default=inp.braced, seed=cap)
    else:
        verdict = JointVerdict(status=cap.not_checked.status, reason=cap.not_checked)
    findings = tuple(description_findings(inp))
    verdict = with_detailing(verdict, findings)
    blob = json.dumps({"input": input_record(inp), "demands": [repr(d) for d in demands],
                       "double_sided": double_sided, "version": __version__},
                      sort_keys=True, default=str)
    return JointCalc(
        path=path,
        label=str(data.get("label") or Path(path).stem),
        archetype=archetype,
        capacity=cap,
        verdict=verdict,
        demands=demands,
        fingerprint=hashlib.sha256(blob.encode()).hexdigest()[:16],
        settings=replace(st, braced=inp.braced),
        created=created or _dt.datetime.now(_dt.UTC).replace(microsecond=0),
        double_sided=double_sided,
        findings=findings,
    )
