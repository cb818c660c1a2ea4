"""Content digests of a model's elements, from the file's text.

A digest covers what an element's read depends on, so that an earlier read can be reused
when nothing it depends on changed.

An element's digest covers (common practice, no source: a Merkle hash over the STEP
instance graph, with entity numbers replaced by the digests of what they name):

* the element's own record and everything it names, recursively (placement chain,
  representation, profiles, points, GlobalId, names, tag, type attributes); the
  ``OwnerHistory`` of every rooted record is left out (exporters stamp a new one on every
  export);
* every relationship naming the element (material, property sets, type, spatial container,
  openings, aggregation, connections ...), each without the attribute that holds the element
  (a storey's list of a thousand elements does not make them all change together), the
  other attributes by their digests;
* for its type object, the relationships naming the type in turn (its material); for the
  assembly it is a part of, the assembly's relationships (its storey, which the part takes);
* for every material, the material property sets naming it (IFC4 ``IfcMaterialProperties``,
  IFC2X3 mechanical and other material properties).

Comments in the data section are left out. Anything the parser does not recognise (an
instance it cannot delimit, instances other than those ifcopenshell read) makes
:func:`element_digests` return None: nothing is reused.
"""

from __future__ import annotations

import hashlib
import re
import sys

#: One instance of the data section: ``#12=IFCNAME(args);`` with strings that may hold ``;``.
_INSTANCE = re.compile(rb"#(\d+)\s*=\s*([A-Za-z0-9_]+)\s*\(((?:[^;']|'(?:[^']|'')*')*)\)\s*;",
                       re.S)
_REF = re.compile(rb"#(\d+)")
#: A string (kept) or a comment (dropped): strings first, so a "/*" in a string is text.
_COMMENT = re.compile(rb"('(?:[^']|'')*')|/\*.*?\*/", re.S)
#: One instance on one line (the usual layout): checked by quote parity and entity numbers.
_LINE = re.compile(rb"(?ms)^[ \t]*#(\d+)\s*=\s*([A-Za-z0-9_]+)\s*\((.*?)\)[ \t]*;[ \t\r]*$")
#: A line that ends an instance (or a string that would fool the one-line pattern).
_LINE_END = re.compile(rb"(?m);[ \t\r]*$")
#: The first two attributes of a rooted record: its GlobalId and its OwnerHistory.
_ROOT_HEAD = re.compile(rb"^\s*('(?:[^']|'')*'\s*,\s*)(#\d+|\$)")
#: A top-level attribute: strings, parenthesised lists (two levels) and bare tokens.
_ATTRIBUTE = re.compile(
    rb"(?:'(?:[^']|'')*'|\((?:[^()']|'(?:[^']|'')*'|\((?:[^()']|'(?:[^']|'')*')*\))*\)|[^,()'])+")


def _digest(data: bytes) -> bytes:
    return hashlib.blake2b(data, digest_size=12).hexdigest().encode()


class _Graph:
    """The data section's instances and their digests (memoised)."""

    def __init__(self, body: dict[int, tuple[bytes, bytes]], rooted: set[bytes],
                 types: set[bytes]) -> None:
        self.body = body
        self.rooted = rooted
        self.types = types
        self.memo: dict[int, bytes] = {}
        self.split: dict[int, object] = {}
        self.rel_memo: dict[tuple, bytes] = {}
        self.material_props: dict[int, list[int]] = {}
        self.naming: dict[int, list[int]] = {}  # entity -> relationships naming it
        for k, (name, args) in body.items():
            if name[:6] == b"IFCREL":
                for r in set(_REF.findall(args)):
                    self.naming.setdefault(int(r), []).append(k)
            elif name in _MATERIAL_PROPERTY_TYPES or (
                    name[:11] == b"IFCMATERIAL" and b"PROPERT" in name):
                for r in set(_REF.findall(args)):
                    if body.get(int(r), (b"",))[0] == b"IFCMATERIAL":
                        self.material_props.setdefault(int(r), []).append(k)

    def text(self, k: int, skip: int | None = None) -> bytes:
        """An instance's text with every reference replaced by its digest (``skip``: by *)."""
        name, args = self.body[k]
        if name in self.rooted:
            args = _ROOT_HEAD.sub(rb"\1$", args, count=1)
        pieces = _REF.split(args)  # text, number, text, number, ..., text
        if len(pieces) > 1:
            of = self.of
            for i in range(1, len(pieces), 2):
                r = int(pieces[i])
                pieces[i] = b"*" if r == skip else of(r)
        return name + b"(" + b"#".join(pieces) + b")"

    def of(self, k: int) -> bytes:
        """The digest of an instance and everything it names."""
        d = self.memo.get(k)
        if d is not None:
            return d
        body = self.body.get(k)
        if body is None:
            d = b"missing"
        elif (b"#" not in body[1] and len(body[1]) < 64 and body[0] not in self.rooted
              and k not in self.material_props):
            d = body[0] + b"(" + body[1] + b")"  # a point, a direction: its text is its digest
        else:
            data = self.text(k)
            props = self.material_props.get(k)
            if props:  # a material's property sets name it: digest them without the loop
                data += b"|" + b",".join(sorted(_digest(self.text(p, skip=k)) for p in props))
            d = _digest(data)
        self.memo[k] = d
        return d

    def _above(self, rel: int, k: int) -> list[int]:
        """What ``k`` takes data from through ``rel``.

        Its type object, or the assembly it is a part of (a part takes the assembly's
        storey); nothing for other relationships.
        """
        name = self.body[rel][0]
        if name == b"IFCRELDEFINESBYTYPE":
            return [t for t in map(int, set(_REF.findall(self.body[rel][1])))
                    if t != k and self.body.get(t, (b"",))[0] in self.types]
        if name in (b"IFCRELAGGREGATES", b"IFCRELNESTS"):
            got = self._split(rel)
            if got is None:
                return []
            refs = got[1]
            if len(refs) > 5 and k in refs[5] and k not in refs[4]:
                return sorted(refs[4])
        return []

    def _split(self, rel: int):
        """A relationship's attributes and the instances each names (None: not split)."""
        got = self.split.get(rel, False)
        if got is not False:
            return got
        args = self.body[rel][1]
        parts = _ATTRIBUTE.findall(args)
        if b"".join(b",".join(parts).split()) != b"".join(args.split()):
            got = None  # not split cleanly: the relationship is taken whole
        else:
            got = (parts, [frozenset(int(r) for r in _REF.findall(p)) for p in parts])
        self.split[rel] = got
        return got

    def relation(self, rel: int, target: int) -> bytes:
        """A relationship naming ``target``, without the attribute(s) holding it."""
        got = self._split(rel)
        if got is None:
            return self.of(rel)
        parts, refs = got
        drop = tuple(i for i, r in enumerate(refs) if target in r)
        key = (rel, drop)
        d = self.rel_memo.get(key)
        if d is None:
            kept = b",".join(p for i, p in enumerate(parts) if i > 1 and i not in drop)
            d = _digest(self.body[rel][0] + b"(" + _REF.sub(
                lambda m: self.of(int(m.group(1))), kept) + b")")
            self.rel_memo[key] = d
        return d

    def element(self, k: int) -> str:
        """The digest of an element with its relationships (and its type's, its assembly's)."""
        parts = [self.of(k)]
        rels = self.naming.get(k, ())
        parts += sorted(self.relation(r, k) for r in rels)
        for r in rels:
            for other in self._above(r, k):
                parts += sorted(self.relation(r2, other) for r2 in self.naming.get(other, ())
                                if r2 != r and self.body[r2][0] != b"IFCRELDEFINESBYTYPE")
        return hashlib.blake2b(b"|".join(parts), digest_size=16).hexdigest()


#: IFC2X3's material property records (they name their material).
_MATERIAL_PROPERTY_TYPES = frozenset({
    b"IFCMECHANICALSTEELMATERIALPROPERTIES", b"IFCMECHANICALMATERIALPROPERTIES",
    b"IFCGENERALMATERIALPROPERTIES", b"IFCTHERMALMATERIALPROPERTIES",
    b"IFCHYGROSCOPICMATERIALPROPERTIES", b"IFCOPTICALMATERIALPROPERTIES",
    b"IFCWATERPROPERTIES", b"IFCFUELPROPERTIES", b"IFCPRODUCTSPROPERTIES",
    b"IFCEXTENDEDMATERIALPROPERTIES", b"IFCMATERIALPROPERTIES",
})


def _subtypes(schema: str, of: str) -> set[bytes]:
    """Upper-case names of every entity type of ``schema`` that is ``of`` or derives from it."""
    import ifcopenshell.ifcopenshell_wrapper as w

    s = w.schema_by_name(schema)
    out = set()
    for decl in s.declarations():
        if not hasattr(decl, "supertype"):
            continue
        d = decl
        while d is not None:
            if d.name() == of:
                out.add(decl.name().upper().encode())
                break
            d = d.supertype()
    return out


def element_digests(raw: bytes, schema: str, ids: list[int], entity_ids
                    ) -> dict[int, str] | None:
    """The digest of each element (by entity number).

    None when the text is not one this parser reads with certainty.

    Args:
        raw: the model's IFC-SPF bytes (an ifczip's unpacked .ifc).
        schema: the ifcopenshell schema name of the model (``IFC2X3``, ``IFC4``, ``IFC4X3``).
        ids: the entity numbers of the elements to digest.
        entity_ids: the numbers of every instance ifcopenshell read: the parse must find
            exactly these.
    """
    start = raw.find(b"\nDATA;")
    end = raw.rfind(b"ENDSEC;")
    if start < 0 or end < start:
        return None
    data = raw[start + 6:end]
    if b"/*" in data:  # comments (outside strings) say nothing of the model: left out
        data = _COMMENT.sub(lambda m: m.group(1) or b" ", data)
    wanted = set(entity_ids)
    body = None
    found = _LINE.findall(data)  # one instance a line, the usual way: fast
    if len(_LINE_END.findall(data)) == len(found):  # no ");" ends a line inside a string
        body = {int(k): (n.upper(), a) for k, n, a in found}
        if len(body) != len(found) or body.keys() != wanted:
            body = None
    if body is None:  # instances over lines, several a line: the careful parse
        found = _INSTANCE.findall(data)
        body = {int(k): (n.upper(), a) for k, n, a in found}
        if len(body) != len(found) or body.keys() != wanted:
            return None
    try:
        g = _Graph(body, _subtypes(schema, "IfcRoot"), _subtypes(schema, "IfcTypeObject"))
        old = sys.getrecursionlimit()
        sys.setrecursionlimit(max(old, 20000))
        try:
            return {k: g.element(k) for k in ids}
        finally:
            sys.setrecursionlimit(old)
    except (RecursionError, KeyError, ValueError, RuntimeError):  # RuntimeError: no schema
        return None
