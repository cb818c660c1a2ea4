"""Content digests of a model's elements, from the file's text.

A digest covers what an element's read depends on, so that an earlier read can be reused
when nothing it depends on changed.

An element's digest covers (common practice, no source: a Merkle hash over the STEP
instance graph, with entity numbers replaced by the digests of what they name):

* the element's own record and everything it names, recursively (placement chain,
  representation, profiles, points, GlobalId, names, tag, type attributes); an
  ``IfcOwnerHistory`` counts as one and the same everywhere (exporters stamp a new one on
  every export);
* every relationship naming the element (material, property sets, type, spatial container,
  openings, aggregation, connections ...), each without the attribute that holds the element
  (a storey's list of a thousand elements does not make them all change together), the
  other attributes by their digests;
* for its type object, the relationships naming the type in turn (its material); for the
  assembly it is a part of, the assembly's relationships (its storey, which the part takes);
* for every material, the material property sets naming it (IFC4 ``IfcMaterialProperties``,
  IFC2X3 mechanical and other material properties).

How (so that a model of two million instances digests in a few seconds): the text is parsed
once into each instance's *template* (its record with every entity number taken out) and its
references in order, with numpy over the file's bytes when the file has one instance a line
(the usual layout), else instance by instance. Each template is hashed (BLAKE2b, 64 bits),
and the graph is hashed level by level from the leaves up with a 64-bit mixing function
(the SplitMix64 finaliser, common practice, no source) over the children's hashes and
their positions. Both parses give the same digests for the same records, so a model that
is only laid out differently (lines wrapped, comments added) is still recognised.

Comments in the data section are left out. Anything the parser does not recognise (an
instance it cannot delimit, instances other than those ifcopenshell read, a reference
cycle) makes :func:`element_digests` return None: nothing is reused.
"""

from __future__ import annotations

import hashlib
import re
from functools import partial
from operator import itemgetter, methodcaller

import numpy as np

#: One instance of the data section: ``#12=IFCNAME(args);`` with strings that may hold ``;``.
_INSTANCE = re.compile(rb"#(\d+)\s*=\s*([A-Za-z0-9_]+)\s*\(((?:[^;']|'(?:[^']|'')*')*)\)\s*;",
                       re.S)
_REF = re.compile(rb"#(\d+)")
#: A string (kept) or a comment (dropped): strings first, so a "/*" in a string is text.
_COMMENT = re.compile(rb"('(?:[^']|'')*')|/\*.*?\*/", re.S)
#: A top-level attribute: strings, parenthesised lists (two levels) and bare tokens.
_ATTRIBUTE = re.compile(
    rb"(?:'(?:[^']|'')*'|\((?:[^()']|'(?:[^']|'')*'|\((?:[^()']|'(?:[^']|'')*')*\))*\)|[^,()'])+")
#: One record of one line (fast layout): its name and its attributes.
_RECORD = re.compile(rb"#\d+= *([A-Za-z0-9_]+)\((.*)\);", re.S)

_U = np.uint64
_C1, _C2, _GOLD = _U(0xBF58476D1CE4E5B9), _U(0x94D049BB133111EB), _U(0x9E3779B97F4A7C15)
_S30, _S27, _S31 = _U(30), _U(27), _U(31)
#: The hashes standing for a reference to nothing and for any owner history.
_MISSING, _OWNER = _U(0x6D697373696E6721), _U(0x6F776E6572686973)
#: The position given to a material's property sets (one multiset, any order).
_PROPS_POSITION = 1 << 20
#: More levels than this is taken as a reference cycle.
_MAX_DEPTH = 4000


def _mix(z: np.ndarray) -> np.ndarray:
    """SplitMix64's finaliser over uint64 (wrapping arithmetic)."""
    z = (z ^ (z >> _S30)) * _C1
    z = (z ^ (z >> _S27)) * _C2
    return z ^ (z >> _S31)


def _template_hashes(templates) -> np.ndarray:
    """64-bit BLAKE2b of each template.

    Each distinct template is hashed once (most records repeat: directions, placements,
    representations), by C calls only: no Python step per instance.
    """
    templates = list(templates)
    index = {x: i for i, x in enumerate(dict.fromkeys(templates))}
    codes = np.fromiter(map(index.__getitem__, templates), dtype=np.int64, count=len(templates))
    blake = partial(hashlib.blake2b, digest_size=8)
    unique = np.frombuffer(b"".join(map(methodcaller("digest"), map(blake, index))), dtype=_U)
    return unique[codes]


class _Parsed:
    """Every instance: entity number, template hash, references (holder, named, position)."""

    def __init__(self, ids: np.ndarray, tmpl: np.ndarray, parent: np.ndarray,
                 child_ids: np.ndarray, position: np.ndarray, text) -> None:
        self.ids = ids
        self.tmpl = tmpl
        self.parent = parent  # instance index of each reference's holder
        self.child_ids = child_ids  # the entity number each reference names
        self.position = position  # its place among the holder's references
        self._text = text  # instance index -> (NAME, attributes text)
        self.order = np.argsort(ids, kind="stable")
        self.sorted_ids = ids[self.order]

    def index(self, ks: np.ndarray) -> np.ndarray:
        """The instance index of each entity number (-1: no such instance)."""
        at = np.minimum(np.searchsorted(self.sorted_ids, ks), len(self.ids) - 1)
        return np.where(self.sorted_ids[at] == ks, self.order[at], -1)

    def record(self, k: int) -> tuple[bytes, bytes] | None:
        """An instance's upper-case name and attributes text (None: no such instance)."""
        i = int(self.index(np.array([k]))[0])
        return None if i < 0 else self._text(i)


#: Blank bytes: space, tab, carriage return.
_BLANK = np.zeros(256, dtype=bool)
_BLANK[[32, 9, 13]] = True
#: Lines of another kind than instances that are looked at one by one (more: careful parse).
_MAX_OTHER_LINES = 100_000


def _numbers_after(padded: np.ndarray, at: np.ndarray) -> tuple[np.ndarray, np.ndarray] | None:
    """The number written after each position (``#123``: 123) and its count of digits.

    ``padded`` ends in non-digits. None when a number has 18 digits or more.
    """
    value = np.zeros(len(at), dtype=np.int64)
    digits = np.zeros(len(at), dtype=np.int64)
    active = np.ones(len(at), dtype=bool)
    for k in range(1, 19):
        c = padded[at + k] - np.uint8(48)  # a digit: 0-9 (wrapping below '0')
        active &= c < 10
        if not active.any():
            return value, digits
        value = np.where(active, value * 10 + c, value)
        digits += active
    return None


def _parse_lines(data: bytes) -> _Parsed | None:
    """The usual layout, with numpy: one instance a line, ``#N=NAME(...);``, blank lines.

    Spaces after ``=`` and blanks after ``;`` are allowed (and left out of the template).
    None when any line is not of that layout (the careful parse then reads it).
    """
    buf = np.frombuffer(data, dtype=np.uint8)
    n = len(buf)
    if n == 0:
        return None
    padded = np.frombuffer(data + b"\0" * 24, dtype=np.uint8)
    nl = np.flatnonzero(buf == 10)
    starts = np.concatenate(([0], nl + 1))
    ends = np.concatenate((nl, [n]))
    inst = padded[starts] == 35  # '#' (a line at the very end reads the padding)
    inst &= ends > starts
    others = np.flatnonzero(~inst & (ends > starts))
    if len(others) > _MAX_OTHER_LINES or any(
            data[a:b].strip() for a, b in zip(starts[others].tolist(), ends[others].tolist(),
                                               strict=True)):
        return None  # a line that is neither an instance nor blank
    s, e = starts[inst], ends[inst]
    if not len(s):
        return None
    last = e - 1  # the ';' ending the record, after any blanks
    for _ in range(64):
        blank = _BLANK[buf[last]] & (last > s)
        if not blank.any():
            break
        last = last - blank
    else:
        return None
    if np.any(buf[last] != 59) or np.any(buf[np.maximum(last - 1, 0)] != 41):  # ');'
        return None
    quotes = np.flatnonzero(buf == 39)
    if len(quotes) and np.any(np.bincount(np.searchsorted(starts, quotes, "right") - 1,
                                          minlength=len(starts)) % 2):
        return None  # a string spans lines
    hashes = np.flatnonzero(buf == 35)
    got = _numbers_after(padded, hashes)
    if got is None:
        return None
    value, digits = got
    at = np.searchsorted(hashes, s)  # every instance line starts with its '#'
    defining = np.zeros(len(hashes), dtype=bool)
    defining[at] = True
    equals = s + 1 + digits[at]
    if np.any(digits[at] == 0) or np.any(padded[equals] != 61):  # '#N='
        return None
    spaces = np.zeros(len(s), dtype=np.int64)  # blanks between '=' and the name
    for _ in range(16):
        more = padded[equals + 1 + spaces] == 32
        if not more.any():
            break
        spaces += more
    name_first = padded[equals + 1 + spaces]
    if np.any((name_first < 65) | (name_first > 122)):  # '#N= NAME(', no other layout
        return None
    ids = value[at]
    ref = ~defining & (digits > 0)
    line_of = np.cumsum(inst) - 1  # each line's instance index (instance lines)
    parent = line_of[np.searchsorted(starts, hashes[ref], "right") - 1]
    position = np.arange(len(parent)) - np.searchsorted(parent, parent)
    # the template NAME(...): the record without '#N=', ';' and blanks, numbers taken out
    drop = np.zeros(n + 1, dtype=bool)
    for k in range(1, int(digits.max()) + 1):
        drop[hashes[digits >= k] + k] = True
    drop[s] = True
    for k in range(int(spaces.max()) + 2):  # '=' and the blanks after it
        drop[(equals + k)[k <= spaces]] = True
    tail = e - last  # ';' and the blanks after it
    for k in range(int(tail.max())):
        drop[(last + k)[k < tail]] = True
    lines = buf[~drop[:n]].tobytes().split(b"\n")
    keep = np.flatnonzero(inst).tolist()
    templates = itemgetter(*keep)(lines) if len(keep) > 1 else [lines[keep[0]]]
    tmpl = _template_hashes(templates)

    def text(i: int):
        m = _RECORD.match(data, int(s[i]), int(last[i]) + 1)
        return (m.group(1).upper(), m.group(2)) if m else None

    return _Parsed(ids, tmpl, parent, value[ref], position, text)


def _parse_records(data: bytes) -> _Parsed | None:
    """Any layout: instance by instance with a regular expression (slower)."""
    found = _INSTANCE.findall(data)
    body = [(n.upper(), a) for _, n, a in found]
    ids = np.array([int(k) for k, _, _ in found], dtype=np.int64)
    if len(np.unique(ids)) != len(ids):
        return None
    refs = [_REF.findall(a) for _, a in body]
    tmpl = _template_hashes(n + b"(" + _REF.sub(b"#", a) + b")" for n, a in body)
    counts = np.fromiter(map(len, refs), dtype=np.int64, count=len(refs))
    parent = np.repeat(np.arange(len(ids)), counts)
    child = np.array([int(r) for rs in refs for r in rs], dtype=np.int64)
    position = np.arange(len(parent)) - np.searchsorted(parent, parent)
    return _Parsed(ids, tmpl, parent, child, position, body.__getitem__)


def _instance_hashes(p: _Parsed, owners: np.ndarray, materials: np.ndarray,
                     material_props: np.ndarray) -> np.ndarray | None:
    """Each instance's Merkle hash (None: a reference cycle).

    A reference to an owner history, or to nothing, hashes as a constant. A material
    property set's reference to its material is turned round: the material's hash covers
    its property sets (in any order), the property set's does not cover the material.
    """
    n = len(p.ids)
    child = p.index(p.child_ids)
    parent, position = p.parent, p.position
    is_owner = np.zeros(n, dtype=bool)
    is_owner[owners[owners >= 0]] = True
    is_material = np.zeros(n, dtype=bool)
    is_material[materials[materials >= 0]] = True
    is_props = np.zeros(n, dtype=bool)
    is_props[material_props[material_props >= 0]] = True
    turn = is_props[parent] & (child >= 0) & is_material[np.maximum(child, 0)]
    if turn.any():
        parent = np.concatenate((parent[~turn], child[turn]))
        child = np.concatenate((child[~turn], p.parent[turn]))
        position = np.concatenate((position[~turn],
                                   np.full(int(turn.sum()), _PROPS_POSITION)))
        order = np.argsort(parent, kind="stable")
        parent, child, position = parent[order], child[order], position[order]
    # two more nodes: "nothing" (n) and "an owner history" (n + 1)
    child = np.where(child < 0, n, np.where(is_owner[np.maximum(child, 0)], n + 1, child))
    h = _mix(p.tmpl ^ _GOLD)
    h = np.concatenate((h, [_MISSING, _OWNER]))
    if not len(parent):
        return h[:n]
    heads = np.flatnonzero(np.concatenate(([True], parent[1:] != parent[:-1])))
    holders = parent[heads]
    depth = np.zeros(n + 2, dtype=np.int64)
    for _ in range(_MAX_DEPTH):
        new = np.maximum.reduceat(depth[child], heads) + 1
        if np.array_equal(new, depth[holders]):
            break
        depth[holders] = new
    else:
        return None
    salt = _mix(position.astype(_U) + _U(1))
    edge_depth = depth[parent]
    order = np.argsort(edge_depth, kind="stable")  # a holder's references stay together
    parent, child, salt = parent[order], child[order], salt[order]
    top = int(edge_depth.max())
    bounds = np.searchsorted(edge_depth[order], np.arange(1, top + 2))
    for level in range(1, top + 1):
        lo, hi = bounds[level - 1], bounds[level]
        holder = parent[lo:hi]
        terms = _mix(h[child[lo:hi]] ^ salt[lo:hi])
        first = np.flatnonzero(np.concatenate(([True], holder[1:] != holder[:-1])))
        who = holder[first]
        h[who] = _mix(p.tmpl[who] + _mix(np.add.reduceat(terms, first) ^ _GOLD))
    return h[:n]


class _Graph:
    """An element's relationships over the instance hashes."""

    def __init__(self, p: _Parsed, h: np.ndarray, rels: dict[int, bytes], types: set[int]) -> None:
        self.p = p
        self.h = h
        self.rels = rels  # relationship entity number -> its upper-case type name
        self.types = types
        self.split: dict[int, object] = {}
        self.rel_memo: dict[tuple, bytes] = {}
        self.naming: dict[int, list[int]] = {}  # entity -> relationships naming it
        rel_index = p.index(np.fromiter(rels, dtype=np.int64, count=len(rels)))
        is_rel = np.zeros(len(p.ids), dtype=bool)
        is_rel[rel_index[rel_index >= 0]] = True
        sel = is_rel[p.parent]
        if sel.any():
            pairs = np.unique(np.stack((p.child_ids[sel], p.ids[p.parent[sel]]), axis=1),
                              axis=0)
            for k, r in pairs.tolist():
                self.naming.setdefault(k, []).append(r)
        self.memo: dict[int, bytes] = {}

    def know(self, ks: list[int]) -> None:
        """Look up the hashes of many instances at once (the elements)."""
        at = self.p.index(np.array(ks, dtype=np.int64))
        for k, i in zip(ks, at.tolist(), strict=True):
            self.memo[k] = b"missing" if i < 0 else b"%016x" % int(self.h[i])

    def of(self, k: int) -> bytes:
        """The hash of an instance and everything it names, as text."""
        d = self.memo.get(k)
        if d is None:
            i = int(self.p.index(np.array([k]))[0])
            d = b"missing" if i < 0 else b"%016x" % int(self.h[i])
            self.memo[k] = d
        return d

    def _above(self, rel: int, k: int) -> list[int]:
        """What ``k`` takes data from through ``rel``.

        Its type object, or the assembly it is a part of (a part takes the assembly's
        storey); nothing for other relationships.
        """
        name = self.rels[rel]
        if name == b"IFCRELDEFINESBYTYPE":
            rec = self.p.record(rel)
            named = {int(r) for r in _REF.findall(rec[1])} if rec else set()
            return sorted(t for t in named if t != k and t in self.types)
        if name in (b"IFCRELAGGREGATES", b"IFCRELNESTS"):
            got = self._split(rel)
            refs = got[1] if got else ()
            if len(refs) > 5 and k in refs[5] and k not in refs[4]:
                return sorted(refs[4])
        return []

    def _split(self, rel: int):
        """A relationship's attributes and the instances each names (None: not split)."""
        got = self.split.get(rel, False)
        if got is not False:
            return got
        rec = self.p.record(rel)
        args = rec[1] if rec else b""
        parts = _ATTRIBUTE.findall(args)
        if not rec or b"".join(b",".join(parts).split()) != b"".join(args.split()):
            got = None  # not split cleanly: the relationship is taken whole
        else:
            refs = [frozenset(int(r) for r in _REF.findall(x)) for x in parts]
            holds: dict[int, tuple] = {}  # entity -> the attributes naming it
            for i, r in enumerate(refs):
                for k in r:
                    holds[k] = (*holds.get(k, ()), i)
            got = (parts, refs, holds)
        self.split[rel] = got
        return got

    def relation(self, rel: int, target: int) -> bytes:
        """A relationship naming ``target``, without the attribute(s) holding it."""
        got = self._split(rel)
        if got is None:
            return self.of(rel)
        parts, _, holds = got
        drop = holds.get(target, ())
        key = (rel, drop)
        d = self.rel_memo.get(key)
        if d is None:
            kept = b",".join(x for i, x in enumerate(parts) if i > 1 and i not in drop)
            d = hashlib.blake2b(self.rels[rel] + b"(" + _REF.sub(
                lambda m: self.of(int(m.group(1))), kept) + b")", digest_size=12).hexdigest(
            ).encode()
            self.rel_memo[key] = d
        return d

    def element(self, k: int) -> str:
        """The digest of an element with its relationships (and its type's, its assembly's)."""
        rels = self.naming.get(k, ())
        above = sorted(self.relation(r2, other) for r in rels for other in self._above(r, k)
                       for r2 in self.naming.get(other, ())
                       if r2 != r and self.rels[r2] != b"IFCRELDEFINESBYTYPE")
        parts = [self.of(k), *sorted(self.relation(r, k) for r in rels), b"^", *above]
        return hashlib.blake2b(b"|".join(parts), digest_size=16).hexdigest()


def _ids(f, ifc_class: str) -> list[int]:
    try:
        return [e.id() for e in f.by_type(ifc_class)]
    except RuntimeError:  # not a class of this schema
        return []


def element_digests(raw: bytes, f, ids: list[int]) -> dict[int, str] | None:
    """The digest of each element (by entity number).

    None when the text is not one this parser reads with certainty.

    Args:
        raw: the model's IFC-SPF bytes (an ifczip's unpacked .ifc).
        f: the model as ifcopenshell read it from those bytes: the parse must find exactly
            its instances; it tells which are relationships, owner histories, materials,
            material property sets and type objects.
        ids: the entity numbers of the elements to digest.
    """
    start = raw.find(b"\nDATA;")
    end = raw.rfind(b"ENDSEC;")
    if start < 0 or end < start:
        return None
    data = raw[start + 6:end]
    if b"/*" in data:  # comments (outside strings) say nothing of the model: left out
        data = _COMMENT.sub(lambda m: m.group(1) or b" ", data)
    wanted = np.sort(np.fromiter(f.entity_names(), dtype=np.int64))
    p = _parse_lines(data)  # two records on a line read as one: the careful parse then
    if p is None or not np.array_equal(p.sorted_ids, wanted):
        p = _parse_records(data)
    if p is None or not len(p.ids) or not np.array_equal(p.sorted_ids, wanted):
        return None
    with np.errstate(over="ignore"):
        h = _instance_hashes(p, p.index(np.array(_ids(f, "IfcOwnerHistory"), dtype=np.int64)),
                             p.index(np.array(_ids(f, "IfcMaterial"), dtype=np.int64)),
                             p.index(np.array(_ids(f, "IfcMaterialProperties"), dtype=np.int64)))
    if h is None:
        return None
    rels = {e.id(): e.is_a().upper().encode() for e in f.by_type("IfcRelationship")}
    g = _Graph(p, h, rels, set(_ids(f, "IfcTypeObject")))
    g.know(list(ids))
    try:
        return {k: g.element(k) for k in ids}
    except (KeyError, ValueError):
        return None
