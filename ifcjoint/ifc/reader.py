"""Read an IFC model into :class:`ifcjoint.model.elements.ModelContents` (mm).

The stages, each in its own module: open the file (``open``), convert the length unit once
(``units``), sort the elements into members, plates and fasteners by the recognition rules
(``recognition``), read each one (``elements``, through ``solids``/``profiles``/``placement``,
falling back to ``mesh``), then the relationships (``relations``). One ``ReadContext`` per
file owns every cache.
"""

from __future__ import annotations

import math
from collections import Counter
from dataclasses import dataclass, field
from pathlib import Path

import numpy as np

from ifcjoint.errors import ModelError
from ifcjoint.ifc.context import ReadContext
from ifcjoint.ifc.digests import element_digests
from ifcjoint.ifc.elements import ElementReader
from ifcjoint.ifc.open import SUPPORTED_SCHEMAS, open_model, open_model_text
from ifcjoint.ifc.read_cache import Outcome, ReadCache, rules_key
from ifcjoint.ifc.recognition import Rules, load_rules
from ifcjoint.ifc.relations import grid_axes, part_links
from ifcjoint.ifc.units import LENGTH_UNITS, length_scale_to_mm
from ifcjoint.model.codes import FastenerKind, SteelState
from ifcjoint.model.elements import ModelContents, Progress

__all__ = ["LENGTH_UNITS", "SUPPORTED_SCHEMAS", "open_model", "read_model"]

MEMBER_CLASSES = ("IfcBeam", "IfcColumn", "IfcMember")


@dataclass(slots=True)
class _Sorted:
    """The model's elements sorted by what ifcjoint reads them as."""

    members: list = field(default_factory=list)
    plates: list = field(default_factory=list)
    fasteners: list[tuple[object, FastenerKind]] = field(default_factory=list)
    ignored: Counter = field(default_factory=Counter)


def read_model(
    path: str | Path,
    *,
    assume_length_unit: str | None = None,
    rules: Rules | None = None,
    progress: Progress | None = None,
    reads: ReadCache | None = None,
) -> ModelContents:
    """Read every beam, column, plate and fastener of a model, in mm.

    Args:
        path: ``.ifc`` or ``.ifczip`` file.
        assume_length_unit: unit to use when the model declares none (``mm``, ``m``...).
        rules: recognition rules; the bundled ones when None.
        progress: optional callback ``(stage, done, total)``.
        reads: an earlier run's element reads to reuse where an element is unchanged, and
            where this run's are kept (``ifc.read_cache``); None: every element is read.

    Raises:
        ModelError: the file cannot be used (see :func:`open_model`), or it has no length unit.
    """
    rules = rules or load_rules()
    if reads is None:  # the file's text is kept only to digest it
        f, sha, open_notes = open_model(path)
        raw = b""
    else:
        f, sha, open_notes, raw = open_model_text(path)
    where = str(path)
    scale, unit_source = _model_level(
        where, "the length unit", lambda: length_scale_to_mm(f, where, assume_length_unit))
    if not (math.isfinite(scale) and scale > 0):
        raise ModelError(where, f"the length unit gives {scale} mm per unit",
                         "a positive, finite length unit")
    ctx = ReadContext(f)
    r = _model_level(where, "types, materials and storeys",
                     lambda: ElementReader(ctx, scale, rules))
    candidates = _model_level(where, "the elements' classes and names",
                              lambda: _sort_candidates(f, rules))
    content = None
    if reads is not None:
        content = _content_keys(f, raw, ctx, candidates, scale, unit_source, rules)
        if content is None:
            reads.usable = False
            reads.why_not = "the model's text was not parsed with certainty"
    del raw
    memo = (reads.sort_offered, reads.sort_kept, content) if content is not None else None
    found = _model_level(where, "the elements' classes and names",
                         lambda: _sort_elements(ctx, r, rules, candidates, memo))
    keys = _read_keys(ctx, found, content) if content is not None else None
    _read_elements(r, found, progress, reads, keys)
    member_ids = {m.guid for m in r.members}
    part_ids = {p.guid for p in r.plates} | {x.guid for x in r.fasteners}
    links = _model_level(where, "the relationships of parts to members",
                         lambda: part_links(ctx, member_ids, part_ids))
    axes = _model_level(where, "the grid", lambda: grid_axes(ctx, scale))
    counts, notes = _counts_and_notes(r, found)
    notes = [*open_notes, *notes]
    if reads is not None and (reads.asked or not reads.usable):
        notes.append(reads.summary())
    return ModelContents(
        path=str(path),
        schema=ctx.schema,
        length_unit_to_mm=scale,
        length_unit_source=unit_source,
        sha256=sha,
        members=tuple(sorted(r.members, key=lambda m: m.guid)),
        plates=tuple(sorted(r.plates, key=lambda p: p.guid)),
        fasteners=tuple(sorted(r.fasteners, key=lambda x: x.guid)),
        links=tuple(sorted(links, key=lambda lk: (lk.part, lk.source))),
        grid_axes=tuple(axes),
        counts=counts,
        unreadable=tuple(sorted(r.unreadable, key=lambda u: u.element)),
        notes=tuple(notes),
        repeated_ids={g: tuple(ids) for g, ids in sorted(ctx.duplicates.items())},
    )


def _model_level(path: str, what: str, fn):
    """Run a model-wide reading step; damaged data in it is bad input (exit 3), not a crash.

    Element-level damage never gets here (that element is reported unreadable); this is for
    what the whole model shares: units, relationships, types, the grid.

    Raises:
        ModelError: naming the step and the error.
    """
    try:
        return fn()
    except ModelError:
        raise
    except (AttributeError, TypeError, ValueError, IndexError, KeyError, RuntimeError,
            ZeroDivisionError) as exc:
        raise ModelError(path, f"damaged data while reading {what} ({type(exc).__name__}: "
                         f"{exc})", "a valid IFC file; if it is one, please report this") from exc


def _sort_candidates(f, rules: Rules) -> tuple[list, list, list]:
    """The elements sorting looks at: members by class, IfcPlates, other part classes."""
    members = [el for cls in MEMBER_CLASSES for el in f.by_type(cls)]
    plates = list(f.by_type("IfcPlate"))
    plate_ids = {p.id() for p in plates}
    seen: set[int] = set()
    others = []
    for cls in sorted(rules.fastener_classes | rules.plate_classes):
        try:
            els = f.by_type(cls)
        except RuntimeError:  # class not in this schema
            continue
        for el in els:
            if el.id() in seen or el.id() in plate_ids or el.is_a("IfcPlate"):
                continue
            seen.add(el.id())
            others.append(el)
    return members, plates, others


def _sort_elements(ctx: ReadContext, r: ElementReader, rules: Rules,
                   candidates: tuple[list, list, list],
                   memo: tuple[dict, dict, dict[int, str]] | None = None) -> _Sorted:
    """Members by class; plates and fasteners by class, by their texts, or by their shape.

    ``candidates``: what :func:`_sort_candidates` found. ``memo``: (decisions offered by an
    earlier run, decisions kept for the next, each element's content key); an unchanged
    element takes its earlier decision.
    """
    out = _Sorted()
    members, plates, others = candidates
    out.members, out.plates = list(members), list(plates)
    offered, kept, keys = memo if memo is not None else ({}, {}, {})
    for el in others:
        key = keys.get(el.id())
        decision = offered.get(key) if key is not None else None
        if decision is None:
            decision = _sort_decision(el, r, rules)
        if key is not None:
            kept[key] = decision
        what, _, kind = decision.partition(":")
        if what == "fastener":
            out.fasteners.append((el, FastenerKind(kind)))
        elif what == "plate":
            out.plates.append(el)
        elif what == "shape":
            out.fasteners.append((el, FastenerKind.BOLT))
            r.notes.append(f"{ctx.key(el)} ({el.is_a()}): taken as a bolt by its shape")
        else:
            out.ignored[el.is_a()] += 1
    ctx.register([*out.members, *out.plates, *(el for el, _ in out.fasteners)])
    for gid, ids in sorted(ctx.duplicates.items()):
        r.notes.append(
            f"GlobalId {gid} is shared by {len(ids)} elements "
            f"({', '.join(f'#{i}' for i in ids)}): GlobalIds must be unique; each element is "
            f"kept apart as {gid}#<entity> and results name the entity; fix the model")
    return out


def _sort_decision(el, r: ElementReader, rules: Rules) -> str:
    """What one element of a part class is read as.

    ``fastener:<kind>``, ``plate``, ``shape`` (a bolt by its shape) or ``ignored``.
    """
    texts = r.lookups.texts(el)
    kind = rules.fastener_kind(el.is_a(), texts)
    if kind not in (None, FastenerKind.OTHER):
        return f"fastener:{kind.value}"
    if rules.is_plate(el.is_a(), texts):
        return "plate"
    if r.bolt_shaped(el):
        return "shape"
    if kind == FastenerKind.OTHER:
        return f"fastener:{kind.value}"
    return "ignored"


def _content_keys(f, raw: bytes, ctx: ReadContext, candidates: tuple[list, list, list],
                  scale: float, unit_source: str, rules: Rules) -> dict[int, str] | None:
    """The content key of each element sorting looks at (None: the text gives no digests).

    Its content digest with everything else its reading depends on: the unit, the rules,
    the tool.
    """
    import hashlib

    from ifcjoint import __version__

    els = [el for group in candidates for el in group]
    digests = element_digests(raw, f, [e.id() for e in els])
    if digests is None:
        return None
    common = f"{__version__}|{ctx.schema}|{scale!r}|{unit_source}|{rules_key(rules)}"
    return {e.id(): hashlib.sha256(f"{common}|{digests[e.id()]}|{e.is_a()}".encode()
                                   ).hexdigest() for e in els}


def _read_keys(ctx: ReadContext, found: _Sorted, content: dict[int, str]) -> dict[int, str]:
    """Each sorted element's cache key: its content key, its key in the results, its kind."""
    import hashlib

    kinds = {el.id(): str(k) for el, k in found.fasteners}
    return {e.id(): hashlib.sha256(
        f"{content[e.id()]}|{ctx.key(e)}|{kinds.get(e.id(), '')}".encode()).hexdigest()
        for e in (*found.members, *found.plates, *(el for el, _ in found.fasteners))}


def _read_elements(r: ElementReader, found: _Sorted, progress: Progress | None,
                   reads: ReadCache | None = None, keys: dict[int, str] | None = None) -> None:
    """Read every sorted element; one that fails is recorded and never stops the others.

    Damaged numbers (NaN, infinities, zero lengths) are not warned about by numpy on the way:
    every element's result is checked for finite values before it is kept, and one that is not
    is reported unreadable with the reason (``elements._finite``).
    """
    with np.errstate(all="ignore"):
        _read_each(r, found, progress, reads, keys)


def _sizes(r: ElementReader) -> tuple[int, ...]:
    return (len(r.members), len(r.plates), len(r.fasteners), len(r.unreadable), len(r.notes),
            r.plate_members, len(r.pending_mesh))


def _outcome(r: ElementReader, before: tuple[int, ...]) -> Outcome | None:
    """What one read added, if it may be kept: no note, no failure, nothing left to mesh."""
    if _sizes(r)[3:5] != before[3:5] or len(r.pending_mesh) != before[6]:
        return None
    return Outcome(members=tuple(r.members[before[0]:]), plates=tuple(r.plates[before[1]:]),
                   fasteners=tuple(r.fasteners[before[2]:]),
                   plate_members=r.plate_members - before[5])


def _note_keys(reads: ReadCache, key: str, out: Outcome) -> None:
    for x in (*out.members, *out.plates, *out.fasteners):
        reads.guid_keys[x.guid] = key


def _read_each(r: ElementReader, found: _Sorted, progress: Progress | None,
               reads: ReadCache | None = None, keys: dict[int, str] | None = None) -> None:
    jobs = [
        *((el, r.read_member, "member", ()) for el in found.members),
        *((el, r.read_plate, "plate", ()) for el in found.plates),
        *((el, r.read_fastener, "fastener", (kind,)) for el, kind in found.fasteners),
    ]
    total = len(jobs)
    step = max(1, total // 100)
    caching = reads is not None and keys is not None
    for done, (el, read, what, args) in enumerate(jobs, start=1):
        key = keys.get(el.id()) if caching else None
        earlier = reads.offered.get(key) if key is not None else None
        if earlier is not None:
            r.members.extend(earlier.members)
            r.plates.extend(earlier.plates)
            r.fasteners.extend(earlier.fasteners)
            r.plate_members += earlier.plate_members
            reads.kept[key] = earlier
            reads.reused += 1
            _note_keys(reads, key, earlier)
        else:
            before = _sizes(r)
            try:
                read(el, *args)
            except Exception as exc:  # one bad element never stops the scan
                r.fail(el, f"cannot read {what} geometry: {exc}")
            if key is not None:
                reads.read += 1
                out = _outcome(r, before)
                if out is not None:
                    reads.kept[key] = out
                    _note_keys(reads, key, out)
        if progress and done % step == 0:
            progress("read", done, total)
    if progress:
        progress("read", total, total)
    r.run_mesh(progress)


def _counts_and_notes(r: ElementReader, found: _Sorted) -> tuple[dict[str, int], list[str]]:
    """Elements read per kind, and the notes about the model as a whole."""
    counts: Counter = Counter()
    for m in r.members:
        counts[m.kind + "s"] += 1
        if m.steel == SteelState.NON_STEEL:
            counts["non_steel_members"] += 1
    counts["plates"] = len(r.plates)
    for x in r.fasteners:
        counts["fasteners"] += 1
        counts[f"fasteners_{x.kind}"] += 1
    notes = list(r.notes)
    if r.plate_members:
        counts["plates_from_members"] = r.plate_members
        notes.append(
            f"{r.plate_members} beam/member element(s) read as plates (flat, at most "
            "60 mm thick and 2 m long)"
        )
    for cls, n in sorted(found.ignored.items()):
        notes.append(f"{n} {cls} element(s) not recognised as plates or fasteners (ignored)")
    return dict(counts), notes
