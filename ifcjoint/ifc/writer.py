"""Property sets written into a copy of the model, to a new file.

Which sets and values come from the report layer (``ifcjoint.report.psets``); this module
only writes them. Values are typed (``IfcRatioMeasure``, ``IfcTorqueMeasure`` for moments, the
measure IFC's structural loads use for them, ``IfcForceMeasure``,
``IfcRotationalStiffnessMeasure``, ``IfcLabel`` ...); each carries its unit on the property
(kN, kN m, kN m/rad), so the project's own units are left alone. Running again on our own
output replaces these property sets (same GlobalIds, from uuid5), never duplicates them. The
input file is never written unless asked for.

The copy is the input's own text with the new entities added at the end of its DATA section
(and our earlier sets taken out): the model is not parsed and written again, which for a
large model took most of the time. The entities are written as ISO 10303-21 requires.
"""

from __future__ import annotations

import math
import re
import zipfile
from dataclasses import dataclass
from pathlib import Path

import ifcopenshell.guid

from ifcjoint.errors import ModelError, OutputError, UsageError
from ifcjoint.fileio import atomic_write_bytes
from ifcjoint.ifc.open import encode_raw_text
from ifcjoint.model.identity import split_key, stable_uuid

#: One property: name, IFC value type, value, unit kind (moment, force, rot or None).
Prop = tuple[str, str, object, str | None]


@dataclass(frozen=True, slots=True, kw_only=True)
class PsetRequest:
    """One property set to write on an element (and on the assembly holding its parts).

    Attributes:
        guid: GlobalId of the element that gets the set.
        name: the property set's name (our own prefix, never ``Pset_``).
        key: stable identity of the set (its GlobalIds derive from it).
        values: the properties for IFC4 and later; ``props`` adapts them to the schema.
        parts: GlobalIds of parts whose IfcElementAssembly also gets the set.
        assembly_name: the set's name on that assembly, or empty for none.
    """

    guid: str
    name: str
    key: str
    values: tuple[Prop, ...]
    parts: tuple[str, ...] = ()
    assembly_name: str = ""

    def props(self, schema: str) -> list[Prop]:
        """The properties in a schema's types (IFC2X3 has no IfcDateTime: a label)."""
        if schema != "IFC2X3":
            return list(self.values)
        return [(n, "IfcLabel" if t == "IfcDateTime" else t, v, u) for n, t, v, u in self.values]


def _gid(key: str) -> str:
    return ifcopenshell.guid.compress(stable_uuid(key).hex)


#: Measures written as numbers (the others are text).
_INTEGERS = {"IfcInteger", "IfcCountMeasure"}
_TEXT = {"IfcLabel", "IfcText", "IfcIdentifier", "IfcDateTime"}


def step_string(text: str) -> str:
    """A string as ISO 10303-21 writes it: quotes doubled, backslashes and non-ASCII escaped."""
    if text.isascii() and text.isprintable():  # the usual case
        return "'" + text.replace("\\", "\\\\").replace("'", "''") + "'"
    out = []
    for ch in text:
        o = ord(ch)
        if ch == "'":
            out.append("''")
        elif ch == "\\":
            out.append("\\\\")
        elif 32 <= o < 127:
            out.append(ch)
        elif o <= 0xFFFF:
            out.append(f"\\X2\\{o:04X}\\X0\\")
        else:
            out.append(f"\\X4\\{o:08X}\\X0\\")
    return "'" + "".join(out) + "'"


def _writable(value) -> bool:
    """A value worth a property: not empty and, a number, finite.

    A non-finite number is left out rather than written as text no IFC reader parses.
    """
    if value is None or value == "":
        return False
    return not (isinstance(value, float) and not math.isfinite(value))


def step_real(v: float) -> str:
    """A REAL as ISO 10303-21 writes it: always with a decimal point."""
    if not math.isfinite(v):
        raise ValueError(f"{v} cannot be written in an IFC file")
    r = repr(float(v))
    if "e" in r or "E" in r:
        mant, exp = r.lower().split("e")
        if "." not in mant:
            mant += "."
        return f"{mant}E{int(exp)}"
    return r if "." in r else r + "."


def _value(ptype: str, value) -> str:
    if ptype in _TEXT:
        return f"{ptype.upper()}({step_string(str(value))})"
    if ptype in _INTEGERS:
        return f"{ptype.upper()}({int(value)})"
    return f"{ptype.upper()}({step_real(float(value))})"


_ENTITY = re.compile(r"^#(\d+)\s*=\s*(IFC[A-Z0-9_]+)\s*\(\s*'([^']*)'", re.M | re.I)
_LINE = re.compile(r"^#(\d+)\s*=.*?;[ \t]*\r?$", re.M | re.S)
_STRING = re.compile(r"'(?:[^']|'')*'")


class _Text:
    """The model's text: where its DATA section ends, its entities by GlobalId, its ids."""

    def __init__(self, path: Path) -> None:
        raw = path.read_bytes()
        self.zipped = raw[:4] == b"PK\x03\x04"
        if self.zipped:
            with zipfile.ZipFile(path) as zf:
                names = [n for n in zf.namelist() if n.lower().endswith(".ifc")]
                if not names:
                    raise ModelError(str(path), "zip archive holds no .ifc file")
                raw = zf.read(names[0])
        text, _note = encode_raw_text(raw)
        self.text = text if text is not None else raw.decode("ascii")
        m = re.search(r"FILE_SCHEMA\s*\(\s*\(\s*'([^']*)'", self.text[:8192], re.I)
        self.schema = (m.group(1) if m else "IFC4").upper()
        ends = [m.start() for m in re.finditer(r"\bENDSEC\s*;", self.text)]
        if len(ends) < 2:
            raise ModelError(str(path), "no DATA section to add to")
        self.data_end = ends[-1]
        self.by_guid: dict[str, tuple[int, str]] = {}
        self.guid_of: dict[int, str] = {}
        self.class_of: dict[int, str] = {}
        for m in _ENTITY.finditer(self.text):
            sid = int(m.group(1))
            hit = self.by_guid.get(m.group(3))
            if hit is None or sid < hit[0]:  # a repeated GlobalId: the lowest id keeps it
                self.by_guid[m.group(3)] = (sid, m.group(2).upper())
            self.guid_of[sid] = m.group(3)
            self.class_of[sid] = m.group(2).upper()
        self._spans: dict[int, tuple[int, int]] | None = None
        ids = re.findall(r"^#(\d+)\s*=", self.text, re.M)
        longest = max(map(len, ids), default=0)  # the largest number has the most digits
        self.max_id = int(max((x for x in ids if len(x) == longest), default="0"))
        oh = re.search(r"^#(\d+)\s*=\s*IFCOWNERHISTORY\s*\(", self.text, re.M)
        self.owner_history = f"#{oh.group(1)}" if oh else "$"

    def find(self, key: str) -> tuple[int, str] | None:
        """(entity id, class) of an element key, or None.

        A key is a GlobalId, or ``GlobalId#entity`` where the model repeats the GlobalId
        (``ifcjoint.model.identity.element_key``).
        """
        gid, ent = split_key(key)
        if ent is None:
            return self.by_guid.get(gid)
        return (ent, self.class_of[ent]) if self.guid_of.get(ent) == gid else None

    def entity_span(self, step_id: int) -> tuple[int, int] | None:
        """Where an entity's text (``#id=...;``) starts and ends (indexed on first use)."""
        if self._spans is None:
            self._spans = {int(m.group(1)): (m.start(), m.end())
                           for m in _LINE.finditer(self.text, 0, self.data_end)}
        return self._spans.get(step_id)


class _Writer:
    """New entities, numbered after the model's last id."""

    def __init__(self, t: _Text) -> None:
        self.t = t
        self.next = t.max_id + 1
        self.lines: list[str] = []
        self._units: dict[str, str] = {}

    def add(self, body: str) -> str:
        ref = f"#{self.next}"
        self.lines.append(f"{ref}={body};")
        self.next += 1
        return ref

    def unit(self, kind: str | None) -> str:
        """kN, kN m and kN m/rad as units on properties (made once per file)."""
        if kind is None:
            return "$"
        if not self._units:
            kn = self.add("IFCSIUNIT(*,.FORCEUNIT.,.KILO.,.NEWTON.)")
            m = self.add("IFCSIUNIT(*,.LENGTHUNIT.,$,.METRE.)")
            rad = self.add("IFCSIUNIT(*,.PLANEANGLEUNIT.,$,.RADIAN.)")
            e = [self.add(f"IFCDERIVEDUNITELEMENT({u},{x})")
                 for u, x in ((kn, 1), (m, 1), (kn, 1), (m, 1), (rad, -1))]
            self._units = {
                "force": kn,
                "moment": self.add(f"IFCDERIVEDUNIT(({e[0]},{e[1]}),.TORQUEUNIT.,$)"),
                "rot": self.add(f"IFCDERIVEDUNIT(({e[2]},{e[3]},{e[4]}),"
                                ".ROTATIONALSTIFFNESSUNIT.,$)"),
            }
        return self._units[kind]

    def pset(self, element: int, name: str, props: list[Prop], key: str) -> None:
        values = [self.add(f"IFCPROPERTYSINGLEVALUE({step_string(n)},$,{_value(t, v)},"
                           f"{self.unit(u)})") for n, t, v, u in props]
        oh = self.t.owner_history
        pset = self.add(
            f"IFCPROPERTYSET('{_gid(key + '/pset')}',{oh},{step_string(name)},"
            f"{step_string('Joint check by ifcjoint; verify with a qualified engineer.')},"
            f"({','.join(values)}))")
        self.add(f"IFCRELDEFINESBYPROPERTIES('{_gid(key + '/rel')}',{oh},$,$,(#{element}),"
                 f"{pset})")


def _earlier_sets(t: _Text, keys: list[str]) -> list[tuple[int, int]]:
    """Text spans of our earlier sets of these keys (the set, its relation, its values)."""
    spans = []
    for key in keys:
        for suffix in ("/pset", "/rel"):
            hit = t.by_guid.get(_gid(key + suffix))
            span = t.entity_span(hit[0]) if hit is not None else None
            if span is None:
                continue
            spans.append(span)
            if suffix == "/pset":
                body = _STRING.sub("''", t.text[span[0]: span[1]])
                inner = body[body.rfind("(") + 1: body.rfind(")")]
                for ref in re.findall(r"#(\d+)", inner):
                    v = t.entity_span(int(ref))
                    if v is not None and "IFCPROPERTYSINGLEVALUE" in t.text[v[0]: v[1]].upper():
                        spans.append(v)
    return spans


def _assemblies(t: _Text) -> dict[int, int]:
    """Part id -> id of the IfcElementAssembly aggregating it (through nested aggregates)."""
    parent: dict[int, int] = {}
    for m in re.finditer(r"^#\d+\s*=\s*IFCRELAGGREGATES\s*\((.*?)\)\s*;", t.text,
                         re.M | re.S | re.I):
        # (GlobalId, OwnerHistory, Name, Description, RelatingObject, (RelatedObjects)):
        # strings blanked, the last two arguments read from the end
        args = _STRING.sub("''", m.group(1))
        tail = re.search(r"#(\d+)\s*,\s*\(([^()]*)\)\s*$", args)
        if tail is None:
            continue
        for child in re.findall(r"#(\d+)", tail.group(2)):
            parent[int(child)] = int(tail.group(1))
    kinds = t.class_of
    out: dict[int, int] = {}
    for child in parent:
        p = parent.get(child)
        seen = set()
        while p is not None and kinds.get(p) != "IFCELEMENTASSEMBLY" and p not in seen:
            seen.add(p)
            p = parent.get(p)
        if p is not None and kinds.get(p) == "IFCELEMENTASSEMBLY":
            out[child] = p
    return out


def write_property_sets(
    model_path: str | Path,
    out_path: str | Path,
    requests: list[PsetRequest],
    *,
    in_place: bool = False,
) -> dict[str, int]:
    """Write a copy of the model with the requested property sets.

    Returns counts: ``beams`` (elements annotated), ``assemblies`` annotated, ``missing``
    elements not found in the model.

    Raises:
        UsageError: the output path is the input (without ``in_place``).
        OutputError: the output cannot be written.
        ModelError: the model cannot be read as IFC text.
    """
    src = Path(model_path)
    out = Path(out_path)
    if out.resolve() == src.resolve() and not in_place:
        raise UsageError(
            f"{out}: this is the input model; give another --ifc-out path (or --in-place to "
            "overwrite it on purpose)"
        )
    try:
        t = _Text(src)
    except OSError as exc:
        raise ModelError(str(src), f"cannot read the model ({exc.strerror or exc})") from exc
    w = _Writer(t)
    counts = {"beams": 0, "assemblies": 0, "missing": 0}
    keys: list[str] = []
    asm_of = _assemblies(t) if any(r.assembly_name for r in requests) else {}
    seen_assemblies: set[int] = set()
    for req in requests:
        hit = t.find(req.guid)
        if hit is None:
            counts["missing"] += 1
            continue
        props = [p for p in req.props(t.schema) if _writable(p[2])]
        w.pset(hit[0], req.name, props, req.key)
        keys.append(req.key)
        counts["beams"] += 1
        if not req.assembly_name:
            continue
        part_ids = [h[0] for g in req.parts if (h := t.find(g)) is not None]
        asm = next((asm_of[i] for i in part_ids if i in asm_of), None)
        if asm is not None and asm not in seen_assemblies:
            seen_assemblies.add(asm)
            key = f"{t.guid_of[asm]}/joint"
            w.pset(asm, req.assembly_name, props, key)
            keys.append(key)
            counts["assemblies"] += 1
    text = t.text
    spans = sorted(set(_earlier_sets(t, keys)))
    pieces, at = [], 0
    for a, b in spans:  # our earlier sets go (their ids are never reused)
        pieces.append(text[at:a])
        at = b
    pieces.append(text[at: t.data_end])
    head = "".join(pieces)
    new = "\n".join(w.lines) + "\n" if w.lines else ""
    body = head.rstrip() + "\n" + new + text[t.data_end:]
    data = body.encode("ascii")
    if out.suffix.lower() == ".ifczip":
        import io

        buf = io.BytesIO()
        with zipfile.ZipFile(buf, "w", zipfile.ZIP_DEFLATED) as zf:
            zf.writestr(out.with_suffix(".ifc").name, data)
        data = buf.getvalue()
    try:
        atomic_write_bytes(out, data)
    except OSError as exc:
        raise OutputError(f"{out}: cannot write the model ({exc.strerror or exc})") from exc
    return counts
