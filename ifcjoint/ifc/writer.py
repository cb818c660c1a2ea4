"""Property sets written into a copy of the model, to a new file.

Which sets and values come from the report layer (``ifcjoint.report.psets``); this module
only writes them. Values are typed (``IfcRatioMeasure``, ``IfcTorqueMeasure`` for moments, the
measure IFC's structural loads use for them, ``IfcForceMeasure``,
``IfcRotationalStiffnessMeasure``, ``IfcLabel`` ...); each carries its unit on the property
(kN, kN m, kN m/rad), so the project's own units are left alone. Running again on our own
output replaces these property sets (same GlobalIds, from uuid5), never duplicates them. The
input file is never written unless asked for.
"""

from __future__ import annotations

import os
from dataclasses import dataclass
from pathlib import Path

import ifcopenshell
import ifcopenshell.api.pset
import ifcopenshell.guid
import ifcopenshell.util.element

from ifcjoint.errors import OutputError, UsageError
from ifcjoint.ifc.open import open_model
from ifcjoint.model.identity import stable_uuid

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


class _Units:
    """kN, kN m and kN m/rad as units on properties; reused when already in the file."""

    def __init__(self, f: ifcopenshell.file) -> None:
        self.f = f
        self._kn = self._si("FORCEUNIT", "KILO", "NEWTON")
        self._m = self._si("LENGTHUNIT", None, "METRE")
        self._rad = self._si("PLANEANGLEUNIT", None, "RADIAN")
        self.force = self._kn
        self.moment = self._derived("TORQUEUNIT", [(self._kn, 1), (self._m, 1)])
        self.rot = self._derived(
            "ROTATIONALSTIFFNESSUNIT", [(self._kn, 1), (self._m, 1), (self._rad, -1)]
        )

    def _si(self, unit_type: str, prefix: str | None, name: str):
        for u in self.f.by_type("IfcSIUnit"):
            if (u.UnitType, u.Prefix, u.Name) == (unit_type, prefix, name):
                return u
        return self.f.createIfcSIUnit(UnitType=unit_type, Prefix=prefix, Name=name)

    def _derived(self, unit_type: str, parts):
        want = sorted((p[0].id(), p[1]) for p in parts)
        for u in self.f.by_type("IfcDerivedUnit"):
            got = sorted((e.Unit.id(), e.Exponent) for e in u.Elements)
            if u.UnitType == unit_type and got == want:
                return u
        elems = [self.f.createIfcDerivedUnitElement(u, e) for u, e in parts]
        return self.f.createIfcDerivedUnit(elems, unit_type, None)


def _replace_pset(f, element, name: str, props, units: _Units, key: str) -> None:
    """Remove our earlier pset of that name on the element, then write it afresh."""
    for rel in list(getattr(element, "IsDefinedBy", None) or ()):
        if rel.is_a("IfcRelDefinesByProperties"):
            pd = rel.RelatingPropertyDefinition
            if pd.is_a("IfcPropertySet") and pd.Name == name:
                ifcopenshell.api.pset.remove_pset(f, product=element, pset=pd)
    pset = ifcopenshell.api.pset.add_pset(f, product=element, name=name)
    pset.GlobalId = _gid(key + "/pset")
    pset.Description = "Joint check by ifcjoint; verify with a qualified engineer."
    values = []
    for pname, ptype, value, unit in props:
        v = f.create_entity(ptype, value)
        u = {"moment": units.moment, "force": units.force, "rot": units.rot}.get(unit)
        values.append(f.createIfcPropertySingleValue(pname, None, v, u))
    pset.HasProperties = values
    for rel in f.get_inverse(pset):
        if rel.is_a("IfcRelDefinesByProperties"):
            rel.GlobalId = _gid(key + "/rel")


def _assembly_of(f, part_guids: tuple[str, ...]):
    """The IfcElementAssembly that holds one of the parts, if any."""
    for guid in part_guids:
        try:
            el = f.by_guid(guid)
        except RuntimeError:
            continue
        agg = ifcopenshell.util.element.get_aggregate(el)
        while agg is not None and not agg.is_a("IfcElementAssembly"):
            agg = ifcopenshell.util.element.get_aggregate(agg)
        if agg is not None:
            return agg
    return None


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
    """
    src = Path(model_path)
    out = Path(out_path)
    if out.resolve() == src.resolve() and not in_place:
        raise UsageError(
            f"{out}: this is the input model; give another --ifc-out path (or --in-place to "
            "overwrite it on purpose)"
        )
    f, _, _ = open_model(src)
    units = _Units(f)
    counts = {"beams": 0, "assemblies": 0, "missing": 0}
    seen_assemblies: set[str] = set()
    for req in requests:
        try:
            element = f.by_guid(req.guid)
        except RuntimeError:
            counts["missing"] += 1
            continue
        props = [p for p in req.props(f.schema) if p[2] is not None and p[2] != ""]
        _replace_pset(f, element, req.name, props, units, req.key)
        counts["beams"] += 1
        asm = _assembly_of(f, req.parts) if req.assembly_name else None
        if asm is not None and asm.GlobalId not in seen_assemblies:
            seen_assemblies.add(asm.GlobalId)
            _replace_pset(f, asm, req.assembly_name, props, units, f"{asm.GlobalId}/joint")
            counts["assemblies"] += 1
    out.parent.mkdir(parents=True, exist_ok=True)
    zipped = out.suffix.lower() == ".ifczip"
    tmp = out.with_name(f".{out.name}.writing{out.suffix}")
    try:
        f.write(str(tmp), format=".ifc", zipped=zipped) if zipped else f.write(str(tmp))
        os.replace(tmp, out)
    except OSError as exc:
        if tmp.exists():
            tmp.unlink()
        raise OutputError(f"{out}: cannot write the model ({exc.strerror or exc})") from exc
    return counts
