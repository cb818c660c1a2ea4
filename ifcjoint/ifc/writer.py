"""Results written back into the model as property sets, to a new file.

Each joint's beam gets one property set per checked end (``ifcjoint_JointAtStart`` /
``ifcjoint_JointAtEnd``); an ``IfcElementAssembly`` that holds the joint's plates or bolts
gets ``ifcjoint_Joint``. Values are typed: ``IfcRatioMeasure``, ``IfcTorqueMeasure`` for
moments (the measure IFC's structural loads use for them), ``IfcForceMeasure``,
``IfcRotationalStiffnessMeasure``, ``IfcLabel``; each carries its unit on the property (kN,
kN m, kN m/rad), so the project's own units are left alone. Running again on our own output
replaces these property sets (same GlobalIds, from uuid5), never duplicates them. The input
file is never written unless asked for.
"""

from __future__ import annotations

import os
import uuid
from pathlib import Path

import ifcopenshell
import ifcopenshell.api.pset
import ifcopenshell.guid
import ifcopenshell.util.element

from ifcjoint.engine.problems import NAMESPACE
from ifcjoint.ifc.reader import open_model

PSET_PREFIX = "ifcjoint_"
PSET_BEAM_END = {"start": "ifcjoint_JointAtStart", "end": "ifcjoint_JointAtEnd"}
PSET_ASSEMBLY = "ifcjoint_Joint"


class OutputError(Exception):
    """The output model cannot be written where asked."""


def _gid(key: str) -> str:
    return ifcopenshell.guid.compress(uuid.uuid5(NAMESPACE, key).hex)


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


def _props(jc, mc, schema: str) -> list[tuple[str, str, object, str | None]]:
    """(name, IFC type, value, unit kind) for one joint; None values are left out."""
    j, g = jc.joint, jc.verdict.governing
    res = jc.result.as_dict()
    rr = res.get("resistance") or {}
    cls = res.get("classification") or {}
    date_type = "IfcLabel" if schema == "IFC2X3" else "IfcDateTime"
    rows = [
        ("JointId", "IfcIdentifier", j.id, None),
        ("Label", "IfcLabel", j.label[:255], None),
        ("Archetype", "IfcLabel", j.archetype, None),
        ("Status", "IfcLabel", jc.status, None),
        ("StatusReason", "IfcText", jc.verdict.reason or None, None),
        ("MaxUtilisation", "IfcRatioMeasure", None if g is None else round(g.utilisation, 4), None),
        ("GoverningCheck", "IfcLabel", None if g is None else g.name, None),
        ("GoverningClause", "IfcLabel", None if g is None else f"EN 1993-1-8 {g.clause}", None),
        ("GoverningCombination", "IfcLabel", None if g is None else g.combination, None),
        ("MjRdHogging", "IfcTorqueMeasure", rr.get("Mj_Rd_hogging_kNm"), "moment"),
        ("MjRdSagging", "IfcTorqueMeasure", rr.get("Mj_Rd_sagging_kNm"), "moment"),
        ("VjRd", "IfcForceMeasure", rr.get("Vj_Rd_kN"), "force"),
        ("SjIni", "IfcRotationalStiffnessMeasure", rr.get("Sj_ini_kNm_per_rad"), "rot"),
        ("StiffnessClass", "IfcLabel", cls.get("stiffness"), None),
        ("StrengthClass", "IfcLabel", cls.get("strength"), None),
        ("FindingCount", "IfcInteger", len(j.findings), None),
        ("ProblemCount", "IfcInteger", len(jc.problems), None),
        ("ToolVersion", "IfcLabel", f"ifcjoint {mc.tool_version}", None),
        ("CheckedOn", date_type, mc.created.isoformat(), None),
        ("InputFingerprint", "IfcIdentifier", jc.fingerprint, None),
    ]
    return [r for r in rows if r[2] is not None and r[2] != ""]


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


def _assembly_of(f, jc):
    """The IfcElementAssembly that holds the joint's plates or bolts, if any."""
    for guid in [p.guid for p in jc.joint.plates] + [b.guid for b in jc.joint.bolts]:
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


def write_results_ifc(mc, out_path: str | Path, *, in_place: bool = False) -> dict[str, int]:
    """Write a copy of the model with every joint's results as property sets.

    Returns counts: ``beams`` and ``assemblies`` annotated, ``missing`` elements not found.

    Raises:
        OutputError: the output path is the input (without ``in_place``) or cannot be written.
    """
    src = Path(mc.scan.model.path)
    out = Path(out_path)
    if out.resolve() == src.resolve() and not in_place:
        raise OutputError(
            f"{out}: this is the input model; give another --ifc-out path (or --in-place to "
            "overwrite it on purpose)"
        )
    f, _ = open_model(src)
    units = _Units(f)
    counts = {"beams": 0, "assemblies": 0, "missing": 0}
    seen_assemblies: set[str] = set()
    for jc in mc.joints:
        j = jc.joint
        try:
            beam = f.by_guid(j.beam)
        except RuntimeError:
            counts["missing"] += 1
            continue
        props = _props(jc, mc, f.schema)
        _replace_pset(f, beam, PSET_BEAM_END[j.beam_end], props, units, f"{j.beam}/{j.beam_end}")
        counts["beams"] += 1
        asm = _assembly_of(f, jc)
        if asm is not None and asm.GlobalId not in seen_assemblies:
            seen_assemblies.add(asm.GlobalId)
            _replace_pset(f, asm, PSET_ASSEMBLY, props, units, f"{asm.GlobalId}/joint")
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
