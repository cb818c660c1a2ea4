"""What a model must carry for ifcjoint to check its joints, as an IDS; and the check of it.

The Information Delivery Specification (buildingSMART IDS 1.0) is written and read with the
``ifctester`` package. Each specification names one datum the checks need, in the place the
IFC schema gives it (ifcjoint also reads the same data from names and free text, but a
modeller told what to deliver should deliver it there):

* a steel grade on beams, columns and members (their material), and on plates;
* a section designation on beams, columns and members (their ``ObjectType``);
* a bolt's diameter and length (``NominalDiameter``, ``NominalLength``) and property class
  (its material) on mechanical fasteners;
* a weld's throat (``Pset_FastenerWeld.NominalThroatThickness``) on weld fasteners (IFC4
  and later: IFC2X3 has no weld type on a fastener).

Hole diameters have no place in the IFC schema other than the plate's geometry (voids),
which an IDS cannot state: they are not in the IDS; ifcjoint reads them from the geometry
or a ``HoleDiameter`` property, and takes EN 1090-2's normal clearance otherwise (said).
"""

from __future__ import annotations

from dataclasses import dataclass
from pathlib import Path

#: buildingSMART's own property set for welds: required by the IDS, never written by us.
WELD_PSET = "Pset_FastenerWeld"  # standard set, never written
#: IFC schema of the model -> IDS ifcVersion.
IDS_VERSION = {"IFC2X3": "IFC2X3", "IFC4": "IFC4", "IFC4X3": "IFC4X3_ADD2"}

#: A steel grade as EN 10025 writes it, anywhere in the material's name (S235 ... S460).
GRADE_PATTERN = r".*S ?(235|275|355|420|450|460).*"
#: A bolt property class of EN ISO 898-1, anywhere in the material's name.
BOLT_CLASS_PATTERN = r".*(4\.6|4\.8|5\.6|5\.8|6\.8|8\.8|10\.9).*"
#: A rolled or welded I/H section's designation (European, British, American families).
SECTION_PATTERN = (r".*(IPE|HE ?[ABM]|HL|HD|UB|UC|W ?[0-9]|[0-9]+ ?x ?[0-9]+ ?x ?[0-9]+).*")


@dataclass(frozen=True, slots=True)
class Requirement:
    """One requirement of the IDS: its identifier, what it asks for, where."""

    identifier: str
    name: str
    entities: tuple[str, ...]
    description: str


REQUIREMENTS = (
    Requirement("grade-members", "steel grade on beams, columns and members",
                ("IFCBEAM", "IFCCOLUMN", "IFCMEMBER"),
                "the material names an EN 10025 steel grade (S235 ... S460)"),
    Requirement("section-members", "section designation on beams, columns and members",
                ("IFCBEAM", "IFCCOLUMN", "IFCMEMBER"),
                "ObjectType names the rolled or welded section (e.g. IPE 400, HEB 300)"),
    Requirement("grade-plates", "steel grade on plates", ("IFCPLATE",),
                "the material names an EN 10025 steel grade"),
    Requirement("bolt-size", "bolt diameter and length", ("IFCMECHANICALFASTENER",),
                "NominalDiameter and NominalLength are given"),
    Requirement("bolt-class", "bolt property class", ("IFCMECHANICALFASTENER",),
                "the material names the property class (e.g. 8.8, 10.9)"),
    Requirement("weld-throat", "weld throat", ("IFCFASTENER",),
                f"{WELD_PSET}.NominalThroatThickness is given on weld fasteners"),
)


#: What a missing datum named by a reason's ``missing`` list asks the model for.
_MISSING_DATUM = {
    "beam section": ("section-members",), "column section": ("section-members",),
    "beam grade": ("grade-members",), "column grade": ("grade-members",),
    "bolts": ("bolt-size", "bolt-class"),
}


def requirements_for(reason) -> tuple[Requirement, ...]:
    """The IDS requirements that, met, give a joint the data it was not checked for lack of.

    ``reason`` is the joint's ``NotChecked`` (or None). A reason that is not missing data
    (out of scope, no forces, parts missing, a dimension that cannot be right) names none.
    The same requirements ``ifcjoint requirements`` writes and validates.
    """
    from ifcjoint.model.codes import NotCheckedCode as C

    if reason is None:
        return ()
    code = reason.code
    if code == C.DATA_NOT_READ:
        ids = [i for m in reason.values.get("missing", ()) for i in _MISSING_DATUM.get(m, ())]
    elif code == C.STRENGTH_UNAVAILABLE:
        ids = ["grade-members", "grade-plates"]
    elif code == C.BOLT_DATA_MISSING:
        ids = ["bolt-size", "bolt-class"]
    elif code == C.NO_TENSILE_AREA:
        ids = ["bolt-size"]
    elif code == C.SECTION_DIMENSIONS_MISSING:
        ids = ["section-members"]
    else:
        ids = []
    by_id = {r.identifier: r for r in REQUIREMENTS}
    return tuple(by_id[i] for i in dict.fromkeys(ids))


def build_ids(schema: str, title: str = "ifcjoint: data a checkable steel model carries"):
    """The IDS for a model of ``schema`` (``IFC2X3``, ``IFC4``, ``IFC4X3``)."""
    from ifctester import ids

    version = IDS_VERSION.get(schema.upper().split("_")[0], "IFC4")
    doc = ids.Ids(title=title, purpose="steel joint check",
                  description="What ifcjoint needs to find and check beam-to-column and "
                              "beam-to-beam joints (names and patterns: ifcjoint's own).")
    for r in REQUIREMENTS:
        if r.identifier == "weld-throat" and version == "IFC2X3":
            continue
        for ent in r.entities:
            spec = ids.Specification(name=f"{r.name} ({ent})", identifier=f"{r.identifier}:{ent}",
                                     description=r.description, ifcVersion=[version],
                                     minOccurs=0, maxOccurs="unbounded")
            if r.identifier == "weld-throat":
                spec.applicability.append(ids.Entity(name=ent, predefinedType="WELD"))
            else:
                spec.applicability.append(ids.Entity(name=ent))
            spec.requirements.extend(_facets(r.identifier, ids))
            doc.specifications.append(spec)
    return doc


def _facets(identifier: str, ids) -> list:
    def pattern(p: str):
        return ids.Restriction(options={"pattern": p})

    if identifier in ("grade-members", "grade-plates"):
        return [ids.Material(value=pattern(GRADE_PATTERN))]
    if identifier == "section-members":
        return [ids.Attribute(name="ObjectType", value=pattern(SECTION_PATTERN))]
    if identifier == "bolt-size":
        return [ids.Attribute(name="NominalDiameter"), ids.Attribute(name="NominalLength")]
    if identifier == "bolt-class":
        return [ids.Material(value=pattern(BOLT_CLASS_PATTERN))]
    return [ids.Property(propertySet=WELD_PSET, baseName="NominalThroatThickness")]


def write_ids(schema: str, path: str | Path) -> int:
    """Write the IDS for a schema; returns the number of specifications."""
    from ifcjoint.fileio import atomic_write_text

    doc = build_ids(schema)
    atomic_write_text(path, doc.to_string())
    return len(doc.specifications)


def missing_requirements(ifc_file, doc) -> dict[str, list[str]]:
    """For each element failing a specification: the requirement names it misses.

    ``ifc_file`` is an open ifcopenshell file; ``doc`` an ``ifctester`` IDS. Keys are
    GlobalIds; values the requirement names (``REQUIREMENTS``), each once.
    """
    doc.validate(ifc_file)
    names = {r.identifier: r.name for r in REQUIREMENTS}
    out: dict[str, list[str]] = {}
    for spec in doc.specifications:
        ident = (spec.identifier or "").split(":")[0]
        for el in getattr(spec, "failed_entities", ()) or ():
            el = getattr(el, "element", el)
            gid = getattr(el, "GlobalId", None)
            if gid is None:
                continue
            name = names.get(ident, spec.name)
            if name not in out.setdefault(gid, []):
                out[gid].append(name)
    return out
