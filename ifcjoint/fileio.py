"""Small file helpers every writer shares: output checks, staged atomic writes, safe cells.

Every output is written to a temporary file beside its target and renamed into place. Inside
``staged_outputs()`` the renames wait until every output of the run has been written, so a run
that fails half-way (or is interrupted) leaves the earlier files as they were and no partial
set. Temporary files are named ``.<target name>.<pid>.ifcjoint-part``: a later run writing the
same target removes those left by a process that no longer runs (a killed run).
"""

from __future__ import annotations

import contextlib
import contextvars
import glob
import os
from collections.abc import Iterator, Mapping
from pathlib import Path

from ifcjoint.errors import OutputError, UsageError

TEMP_SUFFIX = ".ifcjoint-part"

#: The outputs of the run being staged: [(temporary, target)], or None when not staging.
_STAGE: contextvars.ContextVar[list[tuple[Path, Path]] | None] = contextvars.ContextVar(
    "ifcjoint_stage", default=None
)


def _umask() -> int:
    """The process umask (read without changing it where /proc tells it)."""
    try:
        with open("/proc/self/status", encoding="ascii") as fh:
            for line in fh:
                if line.startswith("Umask:"):
                    return int(line.split()[1], 8)
    except (OSError, ValueError):
        pass
    mask = os.umask(0o022)
    os.umask(mask)
    return mask


def _pid_alive(pid: int) -> bool:
    if pid == os.getpid():
        return True
    try:
        os.kill(pid, 0)
    except ProcessLookupError:
        return False
    except PermissionError:
        return True
    return True


def remove_stale_temporaries(target: str | Path) -> int:
    """Remove the temporaries a killed run left beside TARGET; returns how many."""
    target = Path(target)
    n = 0
    try:
        siblings = list(target.parent.glob(f".{glob.escape(target.name)}.*{TEMP_SUFFIX}"))
    except OSError:
        return 0
    for tmp in siblings:
        pid_text = tmp.name[len(target.name) + 2: -len(TEMP_SUFFIX)]
        if not pid_text.isdigit() or _pid_alive(int(pid_text)):
            continue
        with contextlib.suppress(OSError):
            tmp.unlink()
            n += 1
    return n


def temporary_for(target: str | Path) -> Path:
    """The temporary file name this process uses for TARGET (beside it, recognisable)."""
    target = Path(target)
    return target.with_name(f".{target.name}.{os.getpid()}{TEMP_SUFFIX}")


def atomic_write_bytes(path: str | Path, data: bytes) -> None:
    """Write to a temporary file beside the target, then rename over it.

    The file gets the mode a new file gets under the process umask (not the 0600 of a
    private temporary file). Inside ``staged_outputs()`` the rename waits for the end of the
    run.
    """
    path = Path(path)
    path.parent.mkdir(parents=True, exist_ok=True)
    remove_stale_temporaries(path)
    tmp = temporary_for(path)
    stage = _STAGE.get()
    try:
        fd = os.open(tmp, os.O_WRONLY | os.O_CREAT | os.O_TRUNC, 0o666)
        with os.fdopen(fd, "wb") as fh:
            fh.write(data)
        os.chmod(tmp, 0o666 & ~_umask())
        if stage is None:
            os.replace(tmp, path)
        else:
            stage[:] = [(t, p) for t, p in stage if p != path]
            stage.append((tmp, path))
    except BaseException:
        with contextlib.suppress(OSError):
            tmp.unlink()
        raise


def atomic_write_text(path: str | Path, text: str) -> None:
    """UTF-8 text, written atomically (see ``atomic_write_bytes``)."""
    atomic_write_bytes(path, text.encode("utf-8"))


@contextlib.contextmanager
def staged_outputs() -> Iterator[list[tuple[Path, Path]]]:
    """Hold every output written inside until the block ends; then move them all into place.

    On an exception (an output that failed, an interrupt) every temporary is removed and no
    target is touched.
    """
    if _STAGE.get() is not None:  # nested: the outer stage commits
        yield _STAGE.get()
        return
    stage: list[tuple[Path, Path]] = []
    token = _STAGE.set(stage)
    try:
        yield stage
    except BaseException:
        for tmp, _ in stage:
            with contextlib.suppress(OSError):
                tmp.unlink()
        raise
    finally:
        _STAGE.reset(token)
    try:
        for tmp, target in stage:
            os.replace(tmp, target)
    finally:
        for tmp, _ in stage:
            with contextlib.suppress(OSError):
                tmp.unlink()


def same_file(a: str | Path, b: str | Path) -> bool:
    """True when A and B name one file: the same resolved path, a symbolic or a hard link."""
    pa, pb = Path(a), Path(b)
    try:
        if pa.resolve() == pb.resolve():
            return True
    except OSError:
        pass
    try:
        return pa.exists() and pb.exists() and os.path.samefile(pa, pb)
    except OSError:
        return False


def check_output_paths(
    outputs: Mapping[str, str | Path | None],
    inputs: Mapping[str, str | Path | None],
    *,
    may_replace: Mapping[str, str] | None = None,
) -> None:
    """Refuse, before any work, outputs that would replace an input or cannot be written.

    Args:
        outputs: option -> path (None: not asked), e.g. ``{"--json": "r.json"}``.
        inputs: what each input is -> path, e.g. ``{"the model": "m.ifc"}``.
        may_replace: output option -> input name it may replace on purpose
            (``--ifc-out`` with ``--in-place``).

    Raises:
        UsageError: an output is an input (resolved paths, symbolic and hard links), or two
            outputs are one file.
        OutputError: an output is a folder, lies under a file, or its folder is not writable.
    """
    may_replace = may_replace or {}
    asked = [(opt, Path(p)) for opt, p in outputs.items() if p]
    for opt, out in asked:
        for what, src in inputs.items():
            if src and same_file(out, src) and may_replace.get(opt) != what:
                raise UsageError(
                    f"{opt} {out} is {what}; an output never replaces an input: choose "
                    "another path"
                )
    for i, (opt, out) in enumerate(asked):
        for opt2, out2 in asked[i + 1:]:
            if same_file(out, out2):
                raise UsageError(f"{opt} and {opt2} both name {out}; give each its own path")
    for opt, out in asked:
        _check_writable(opt, out)


def _check_writable(opt: str, out: Path) -> None:
    if out.is_dir():
        raise OutputError(f"{opt} {out}: is a folder; give a file path")
    if out.exists() and not os.access(out, os.W_OK):
        raise OutputError(f"{opt} {out}: exists and may not be written (permissions)")
    parent = out.parent if str(out.parent) else Path(".")
    while not parent.exists():
        if parent.is_symlink():
            raise OutputError(f"{opt} {out}: {parent} is a broken link")
        parent = parent.parent
    if not parent.is_dir():
        raise OutputError(f"{opt} {out}: {parent} is a file, not a folder")
    if not os.access(parent, os.W_OK | os.X_OK):
        raise OutputError(f"{opt} {out}: the folder {parent} may not be written (permissions)")


def safe_cell(value: object) -> object:
    """Neutralise text that a spreadsheet would run as a formula (=, +, -, @, tab, CR)."""
    if isinstance(value, str) and value[:1] in ("=", "+", "-", "@", "\t", "\r"):
        return "'" + value
    return value


@contextlib.contextmanager
def no_cycle_collection() -> Iterator[None]:
    """Load or write a large plain structure without the cycle collector (results, reads).

    Plain data (dicts, lists, numbers, data classes) holds no reference cycles, and building
    millions of such objects sets the collector off again and again over every object alive
    (common practice, no source): loading the kept reads of a 5,000-member model took about
    three times as long with it. Reference counting frees everything as usual; the collector
    runs again after the block.
    """
    import gc

    was = gc.isenabled()
    gc.disable()
    try:
        yield
    finally:
        if was:
            gc.enable()


def spare_collector() -> None:
    """Keep every object alive now out of the cycle collector's later passes (``gc.freeze``).

    For the long-lived data of a run (the model's reads, the earlier run's results): each
    full pass of the collector visits every object alive, and a large model keeps millions;
    set aside, they are not visited again (common practice, no source). Acyclic objects are
    still freed when no longer used; :func:`restore_collector` ends it.
    """
    import gc

    gc.freeze()


def restore_collector() -> None:
    """Let the collector see again what :func:`spare_collector` set aside (``gc.unfreeze``)."""
    import gc

    gc.unfreeze()
