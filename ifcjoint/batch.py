"""Several models at once: each checked (or scanned) in its own process, a summary across them.

A coordinator's pipeline often holds several models (one per building, per discipline, per
revision). ``run_batch`` runs ``ifcjoint check`` (or ``scan``) on each in a child process of
its own, ``jobs`` at a time: a model that crashes the reader or hangs past ``timeout`` is
reported as such and never stops the others. Each model's outputs go to its own names in the
output folder; the summary table says, per model, what became of it.
"""

from __future__ import annotations

import json
import subprocess
import sys
import time
from concurrent.futures import ThreadPoolExecutor
from dataclasses import dataclass
from pathlib import Path

from ifcjoint.errors import UsageError

#: Model files a folder is searched for.
MODEL_SUFFIXES = (".ifc", ".ifczip")


@dataclass(frozen=True, slots=True, kw_only=True)
class BatchItem:
    """One model of a batch and what became of it.

    Attributes:
        model: the model file.
        outcome: ``done`` (the run finished; see the exit code), ``failed`` (the model or an
            input could not be used: exit code 2 to 5), ``timeout`` or ``crashed`` (the child
            process died without an exit code of ours).
        exit_code: the child's exit code (None on a timeout).
        seconds: wall time of the child.
        counts: joints by status (from its JSON output), when it finished.
        message: the child's last error line, when it failed.
        outputs: the files written for it.
    """

    model: str
    outcome: str
    exit_code: int | None
    seconds: float
    counts: dict[str, int]
    message: str
    outputs: tuple[str, ...]


def model_files(paths: list[str | Path]) -> list[Path]:
    """The models named: files as given, folders searched (not recursively) for IFC files.

    Raises:
        UsageError: a path that does not exist, or no model found.
    """
    out: list[Path] = []
    for p in map(Path, paths):
        if p.is_dir():
            out += sorted(x for x in p.iterdir() if x.suffix.lower() in MODEL_SUFFIXES)
        elif p.exists():
            out.append(p)
        else:
            raise UsageError(f"{p}: no such file or folder")
    if not out:
        raise UsageError("no .ifc or .ifczip model found in " + ", ".join(map(str, paths)))
    stems = [m.stem for m in out]
    dup = sorted({s for s in stems if stems.count(s) > 1})
    if dup:
        raise UsageError(f"two models share the name {dup[0]!r}: their outputs would collide")
    return out


def _child_command(command: str, model: Path, out_dir: Path, demands: Path | None,
                   extra: list[str]) -> tuple[list[str], tuple[Path, ...]]:
    stem = model.stem
    js = out_dir / f"{stem}.json"
    cmd = [sys.executable, "-m", "ifcjoint", command, str(model), "--json", str(js), "-q"]
    outputs = [js]
    if command == "check":
        cmd += ["--fail-on", "never"]
        if demands is not None:
            cmd += ["--demands", str(demands)]
    cmd += [a.replace("{stem}", stem).replace("{out}", str(out_dir)) for a in extra]
    outputs += [Path(a.replace("{stem}", stem).replace("{out}", str(out_dir)))
                for a in extra if "{stem}" in a]
    return cmd, tuple(outputs)


def _run_one(command: str, model: Path, out_dir: Path, demands: Path | None, timeout: float,
             extra: list[str]) -> BatchItem:
    cmd, outputs = _child_command(command, model, out_dir, demands, extra)
    t = time.perf_counter()
    try:
        p = subprocess.run(cmd, capture_output=True, text=True, timeout=timeout, check=False)
    except subprocess.TimeoutExpired:
        return BatchItem(model=str(model), outcome="timeout", exit_code=None,
                         seconds=time.perf_counter() - t, counts={},
                         message=f"stopped after {timeout:g} s", outputs=())
    dt = time.perf_counter() - t
    last = next((ln for ln in reversed(p.stderr.splitlines()) if ln.strip()), "")
    if p.returncode < 0 or p.returncode > 5:
        return BatchItem(model=str(model), outcome="crashed", exit_code=p.returncode,
                         seconds=dt, counts={}, message=last or "the process died",
                         outputs=())
    counts: dict[str, int] = {}
    js = outputs[0]
    if js.exists():
        try:
            data = json.loads(js.read_text("utf-8"))
            counts = (data.get("check") or {}).get("counts") or {
                "joints": len(data.get("joints") or [])}
        except (OSError, ValueError):
            pass
    ok = p.returncode in (0, 1, 4)  # 1: a gate failed (not asked for here); 4: no steel
    return BatchItem(model=str(model), outcome="done" if ok else "failed",
                     exit_code=p.returncode, seconds=dt, counts=counts,
                     message="" if ok else last, outputs=tuple(str(o) for o in outputs
                                                                  if o.exists()))


def run_batch(
    command: str,
    models: list[Path],
    out_dir: Path,
    *,
    jobs: int = 2,
    timeout: float = 3600.0,
    demands_pattern: str | None = None,
    extra: list[str] | None = None,
    progress=None,
) -> list[BatchItem]:
    """Run ``ifcjoint <command>`` on every model, each in its own process, ``jobs`` at a time.

    Args:
        command: ``check`` or ``scan``.
        models: the model files.
        out_dir: where each model's outputs go (``<stem>.json`` and the ``extra`` ones).
        jobs: models run at the same time.
        timeout: seconds a model may take before it is stopped (reported as ``timeout``).
        demands_pattern: the demands CSV of a model, ``{stem}`` replaced by the model's name
            (relative to the model's folder); none found: checked without demands.
        extra: more arguments for each run; ``{stem}`` and ``{out}`` are replaced.
        progress: optional callback ``(stage, done, total)``.
    """
    out_dir.mkdir(parents=True, exist_ok=True)
    done = [0]

    def one(model: Path) -> BatchItem:
        dem = None
        if command == "check" and demands_pattern:
            cand = model.parent / demands_pattern.replace("{stem}", model.stem)
            dem = cand if cand.exists() else None
        item = _run_one(command, model, out_dir, dem, timeout, extra or [])
        done[0] += 1
        if progress is not None:
            progress("batch", done[0], len(models))
        return item

    with ThreadPoolExecutor(max_workers=max(1, jobs)) as ex:
        return list(ex.map(one, models))


def summary_table(items: list[BatchItem]) -> str:
    """The summary across models, one line each (text)."""
    head = f"{'model':<40} {'outcome':<8} {'exit':>4} {'s':>7}  joints by status"
    lines = [head, "-" * len(head)]
    for it in items:
        counts = ", ".join(f"{k} {v}" for k, v in it.counts.items() if v) or it.message
        code = "-" if it.exit_code is None else str(it.exit_code)
        lines.append(f"{Path(it.model).name:<40} {it.outcome:<8} {code:>4} "
                     f"{it.seconds:7.1f}  {counts}")
    return "\n".join(lines) + "\n"
