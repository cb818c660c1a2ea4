"""Element reads kept between runs, by content digest (``ifc.digests``).

A run that is told of an earlier one (``check --since``) is offered that run's reads: an
element whose digest (its record, everything it names, its relationships, its type's), the
length unit, the recognition rules and the tool version are all the same is not read again,
its earlier read is taken. A part's attachment to its joint is taken when nothing it
depends on changed (``find.parts.AttachMemo``), and a joint's anatomy when the joint the
finder made is the same and every element its anatomy looked up is an unchanged read. Every
element
read anew is read exactly as without a cache; reads that left a note or failed, and bodies
that had to be tessellated, are never kept (their messages name entity numbers), so what a
run reports never depends on the cache.

The cache is a file per model (named by the SHA-256 of the model's bytes) in the user's cache
folder: ``$IFCJOINT_CACHE_DIR``, else ``$XDG_CACHE_HOME/ifcjoint``, else
``~/.cache/ifcjoint``; the newest :data:`KEEP` files are kept (a file read is touched, so
the files later ones build on stay). A revision's file holds only the reads it added and
names the earlier model's file to read first (:data:`MAX_CHAIN` files at most). The files are
Python pickles: only the user's own folder is read, and a file of another format or tool
version is ignored.
"""

from __future__ import annotations

import contextlib
import hashlib
import json
import os
import pickle
import re
from dataclasses import dataclass, field, fields
from pathlib import Path

from ifcjoint import __version__
from ifcjoint.fileio import no_cycle_collection

#: Cache files kept (the newest; common practice, no source).
KEEP = 8
#: The file format: a file of another is ignored.
FORMAT = 2
#: Files a model's reads may be spread over (its own, then the earlier models' it adds to).
MAX_CHAIN = 4


def cache_folder() -> Path:
    """Where the read caches live."""
    env = os.environ.get("IFCJOINT_CACHE_DIR")
    if env:
        return Path(env)
    base = os.environ.get("XDG_CACHE_HOME") or str(Path.home() / ".cache")
    return Path(base) / "ifcjoint"


def cache_file(model_sha256: str) -> Path:
    """The cache file of the model with these bytes."""
    return cache_folder() / f"reads-{model_sha256[:32]}.pickle"


#: The field names of each data class written to a cache file.
_NAMES: dict[type, tuple[str, ...]] = {}


def _names(cls: type) -> tuple[str, ...]:
    got = _NAMES.get(cls)
    if got is None:
        got = _NAMES[cls] = tuple(f.name for f in fields(cls))
    return got


def _rebuild(cls: type, values: tuple):
    """A data class instance from its field values, as written by :class:`_Pickler`."""
    obj = object.__new__(cls)
    for name, value in zip(_names(cls), values, strict=True):
        object.__setattr__(obj, name, value)
    return obj


class _Pickler(pickle.Pickler):
    """Writes data classes with ``__slots__`` as their field values.

    The standard library's way re-reads every class's field list for every instance, which
    made loading a large model's reads take seconds; this one reads it once per class.
    """

    def reducer_override(self, obj):
        cls = type(obj)
        if "__slots__" in cls.__dict__ and hasattr(cls, "__dataclass_fields__"):
            return _rebuild, (cls, tuple(getattr(obj, n) for n in _names(cls)))
        return NotImplemented


@dataclass(frozen=True, slots=True)
class Outcome:
    """What reading one element added: its member, plate or fastener (or several)."""

    members: tuple = ()
    plates: tuple = ()
    fasteners: tuple = ()
    plate_members: int = 0


def rules_key(rules) -> str:
    """A digest of the recognition rules (the reads depend on them)."""

    def plain(x):
        if isinstance(x, re.Pattern):
            return x.pattern
        if isinstance(x, (set, frozenset)):
            return sorted(map(plain, x))
        if isinstance(x, (list, tuple)):
            return [plain(v) for v in x]
        if hasattr(x, "__dataclass_fields__"):
            return {f.name: plain(getattr(x, f.name)) for f in fields(x)}
        return x if isinstance(x, (str, int, float, bool, type(None))) else repr(x)

    text = json.dumps(plain(rules), sort_keys=True)
    return hashlib.sha256(text.encode()).hexdigest()


def _read_chain(path: Path) -> list[dict]:
    """A cache file's content, then its earlier files' (newest first); [] when unusable.

    Each file read is touched, so the newest-kept pruning keeps the files others build on.
    """
    chain: list[dict] = []
    seen: set[Path] = set()
    while path not in seen and len(chain) <= MAX_CHAIN:
        seen.add(path)
        try:
            with path.open("rb") as fh, no_cycle_collection():
                data = pickle.load(fh)  # the user's own cache folder (see the module)
        except (OSError, pickle.UnpicklingError, EOFError, AttributeError, ImportError,
                TypeError, ValueError):
            break
        if not (isinstance(data, dict) and data.get("format") == FORMAT
                and data.get("tool_version") == __version__):
            break
        with contextlib.suppress(OSError):
            os.utime(path)
        chain.append(data)
        if not data.get("base"):
            break
        path = path.with_name(str(data["base"]))
    return chain


@dataclass
class ReadCache:
    """The reads offered by an earlier run, and the ones this run keeps for the next."""

    offered: dict[str, Outcome] = field(default_factory=dict)
    kept: dict[str, Outcome] = field(default_factory=dict)
    reused: int = 0
    read: int = 0
    source: str = ""  # the file the offered reads came from ("" when none)
    usable: bool = True  # False: the model's text could not be digested (nothing reused)
    why_not: str = ""
    asked: bool = False  # an earlier run's reads were asked for (their note is due)
    guid_keys: dict[str, str] = field(default_factory=dict)  # element key -> its read's key
    anatomy_offered: dict[str, tuple] = field(default_factory=dict)
    anatomy_kept: dict[str, tuple] = field(default_factory=dict)
    anatomy_reused: int = 0
    depth: int = 0  # how many files the offered reads were read from
    attach_offered: dict = field(default_factory=dict)  # part attachments (find.parts)
    attach_kept: dict = field(default_factory=dict)
    attach_reused: int = 0
    sort_offered: dict[str, str] = field(default_factory=dict)  # what an element is read as
    sort_kept: dict[str, str] = field(default_factory=dict)

    @classmethod
    def load(cls, model_sha256: str | None) -> ReadCache:
        """The reads kept for the model with these bytes (empty when there are none).

        A file that adds to an earlier model's (see :meth:`save`) is read with that file
        first; a missing or foreign earlier file only means fewer reads offered.
        """
        if not model_sha256:
            return cls(asked=True)
        path = cache_file(model_sha256)
        reads: dict = {}
        anatomy: dict = {}
        sorts: dict = {}
        chain = _read_chain(path)
        if not chain:
            return cls(asked=True)
        for data in reversed(chain):  # the oldest first: a later file's entries win
            reads.update(data.get("reads", {}))
            anatomy.update(data.get("anatomy", {}))
            sorts.update(data.get("sorts", {}))
        return cls(offered=reads, anatomy_offered=anatomy, source=str(path), asked=True,
                   depth=len(chain), attach_offered=chain[0].get("attach") or {},
                   sort_offered=sorts)

    def save(self, model_sha256: str) -> Path | None:
        """Keep this run's reads for the next run (best effort: a cache never fails a run).

        When this run was offered another model's reads and kept most of them (a revision),
        only the reads it added are written, naming the earlier file to read first (at most
        :data:`MAX_CHAIN` files deep; then everything is written again).
        """
        folder = cache_folder()
        path = cache_file(model_sha256)
        content = {"format": FORMAT, "tool_version": __version__, "base": None,
                   "reads": self.kept, "anatomy": self.anatomy_kept, "sorts": self.sort_kept,
                   "attach": self.attach_kept}  # the model's own, never spread
        base = Path(self.source) if self.source else None
        if base is not None and base != path and self.depth < MAX_CHAIN:
            reads = {k: v for k, v in self.kept.items() if self.offered.get(k) is not v}
            anatomy = {k: v for k, v in self.anatomy_kept.items()
                       if self.anatomy_offered.get(k) is not v}
            sorts = {k: v for k, v in self.sort_kept.items() if self.sort_offered.get(k) != v}
            if len(reads) + len(anatomy) < (len(self.kept) + len(self.anatomy_kept)) / 2:
                content.update(base=base.name, reads=reads, anatomy=anatomy, sorts=sorts)
        try:
            folder.mkdir(parents=True, exist_ok=True)
            tmp = path.with_suffix(f".{os.getpid()}.tmp")  # two runs may keep one model
            with tmp.open("wb") as fh, no_cycle_collection():
                _Pickler(fh, protocol=pickle.HIGHEST_PROTOCOL).dump(content)
            tmp.replace(path)
            old = sorted(folder.glob("reads-*.pickle"), key=lambda p: p.stat().st_mtime,
                         reverse=True)
            for p in old[KEEP:]:
                with contextlib.suppress(OSError):
                    p.unlink()
        except (OSError, pickle.PicklingError, TypeError, AttributeError, RecursionError):
            with contextlib.suppress(OSError, UnboundLocalError):
                tmp.unlink()
            return None
        return path

    def summary(self) -> str:
        """One line for the run's notes."""
        if not self.usable:
            return f"read cache not used: {self.why_not}; every element read"
        if not self.source:
            return "no earlier reads kept for the earlier run's model: every element read"
        return (f"{self.reused} element(s) unchanged since the earlier run taken from its "
                f"reads, {self.read} read; {self.attach_reused} part attachment(s) and "
                f"{self.anatomy_reused} joint anatomies whose inputs are unchanged taken "
                "from it")
