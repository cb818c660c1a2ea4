"""Texts of elements that may name a section, grade or bolt: names, types, materials, properties.

Read once per model from the relationships (types, materials, property sets), then looked up
per element.
"""

from __future__ import annotations

import ifcopenshell

from ifcjoint.ifc.context import ReadContext

#: Property names (lower case, no spaces) read for designations, grades and bolt sizes.
INTERESTING_PROPERTIES = frozenset(
    {
        "reference",
        "profile",
        "profilename",
        "section",
        "sectionname",
        "crosssection",
        "material",
        "grade",
        "steelgrade",
        "materialgrade",
        "boltgrade",
        "class",
        "propertyclass",
        "strengthclass",
        "diameter",
        "nominaldiameter",
        "boltdiameter",
        "size",
        "boltsize",
        "length",
        "nominallength",
        "boltlength",
        "standard",
        "boltstandard",
        "description",
        # weld sizes of welds modelled as fasteners
        "throat",
        "throatthickness",
        "nominalthroatthickness",  # Pset_FastenerWeld (IFC4 on)
        "weldthroat",
        "a",
        "leg",
        "leglength",
        "weldleg",
        "weldsize",
        # hole diameters when holes are not modelled
        "holediameter",
        "boltholediameter",
        "holesize",
        "diameterofhole",
        "clearancehole",
        "clearanceholediameter",
    }
)


class ElementTexts:
    """Type names and materials of every element, read once from the relationships."""

    def __init__(self, ctx: ReadContext) -> None:
        f: ifcopenshell.file = ctx.file
        self.ctx = ctx
        self.type_name: dict[int, str] = {}
        for rel in f.by_type("IfcRelDefinesByType"):
            t = rel.RelatingType
            if t is not None and t.Name:
                for el in rel.RelatedObjects:
                    self.type_name[el.id()] = str(t.Name)
        self.material_of: dict[int, object] = {}
        type_mat: dict[int, object] = {}
        for rel in f.by_type("IfcRelAssociatesMaterial"):
            for el in rel.RelatedObjects:
                if el.is_a("IfcTypeObject"):
                    type_mat[el.id()] = rel.RelatingMaterial
                else:
                    self.material_of[el.id()] = rel.RelatingMaterial
        # Elements without their own material take their type's.
        if type_mat:
            for rel in f.by_type("IfcRelDefinesByType"):
                m = type_mat.get(rel.RelatingType.id()) if rel.RelatingType else None
                if m is not None:
                    for el in rel.RelatedObjects:
                        self.material_of.setdefault(el.id(), m)
        self._text_cache: dict[int, tuple[str, str]] = {}
        self._texts_cache: dict[int, dict[str, str]] = {}
        # Designation-like single-value properties, read once for every element: its type's
        # property sets first, then its own (which win).
        self.props: dict[int, dict[str, object]] = {}
        for rel in f.by_type("IfcRelDefinesByType"):
            t = rel.RelatingType
            found = {}
            for pset in (getattr(t, "HasPropertySets", None) or ()) if t is not None else ():
                found.update(_interesting(pset))
            if found:
                for el in rel.RelatedObjects:
                    self.props.setdefault(el.id(), {}).update(found)
        for rel in f.by_type("IfcRelDefinesByProperties"):
            found = _interesting(rel.RelatingPropertyDefinition)
            if found:
                for el in rel.RelatedObjects:
                    self.props.setdefault(el.id(), {}).update(found)

    def texts(self, el) -> dict[str, str]:
        """Name, ObjectType, Description, Tag, PredefinedType, type name, property values."""
        key = el.id()
        hit = self._texts_cache.get(key)
        if hit is not None:
            return hit
        out = {}
        for a in ("Name", "ObjectType", "Description", "Tag", "PredefinedType"):
            try:
                v = self.ctx.att(el, a)
            except (AttributeError, RuntimeError, ValueError):
                continue
            if v is not None:
                out[a] = str(v)
        tn = self.type_name.get(el.id())
        if tn:
            out["TypeName"] = tn
        props = self.props.get(el.id())
        if props:
            out["Properties"] = " ".join(str(v) for v in props.values())
        self._texts_cache[key] = out
        return out

    def all_texts(self, el, *extra: str) -> tuple[str, ...]:
        """Every text of an element that may carry a designation or grade, de-duplicated."""
        t = self.texts(el)
        out = [
            *extra,
            t.get("Name"),
            t.get("ObjectType"),
            t.get("TypeName"),
            t.get("Description"),
            t.get("Tag"),
        ]
        out += [str(v) for v in self.props.get(el.id(), {}).values() if isinstance(v, str)]
        return tuple(dict.fromkeys(x for x in out if x))

    def number(self, el, keys: tuple[str, ...]) -> float | None:
        """First numeric property among ``keys`` (model length units), or None.

        A zero or negative value is returned as it is: the caller reports it as a value that
        cannot be used (never dropped silently).
        """
        props = self.props.get(el.id(), {})
        for k in keys:
            v = props.get(k)
            if isinstance(v, (int, float)) and not isinstance(v, bool):
                return float(v)
        return None

    def material(self, el) -> tuple[str, str]:
        """Material name(s) and material-profile name(s) of an element, joined."""
        mat = self.material_of.get(el.id())
        if mat is None:
            return "", ""
        hit = self._text_cache.get(mat.id())
        if hit is None:
            hit = self._text_cache[mat.id()] = _material_text(mat)
        return hit


def _interesting(pset) -> dict[str, object]:
    """The single values of a property set whose names ifcjoint reads (lower case, no spaces)."""
    if pset is None or not pset.is_a("IfcPropertySet"):
        return {}
    found = {}
    for p in pset.HasProperties or ():
        try:
            if not p.is_a("IfcPropertySingleValue") or p.NominalValue is None:
                continue
            key = str(p.Name or "").replace(" ", "").replace("_", "").lower()
            if key in INTERESTING_PROPERTIES:
                found[key] = p.NominalValue.wrappedValue
        except (AttributeError, TypeError, RuntimeError):
            continue  # a damaged property: skipped (a value it held is reported missing)
    return found


def _material_text(mat) -> tuple[str, str]:
    """Material name(s) and material profile name(s) of a material definition, joined."""
    names, profiles = [], []
    stack = [mat]
    while stack:
        m = stack.pop()
        t = m.is_a()
        if t == "IfcMaterial":
            names.extend(x for x in (m.Name, getattr(m, "Category", None)) if x)
        elif t == "IfcMaterialProfileSet":
            stack.extend(m.MaterialProfiles or ())
        elif t == "IfcMaterialProfile":
            if m.Name:
                profiles.append(m.Name)
            if m.Profile is not None and m.Profile.ProfileName:
                profiles.append(m.Profile.ProfileName)
            if m.Material is not None:
                stack.append(m.Material)
        elif t == "IfcMaterialLayerSet":
            stack.extend(x.Material for x in m.MaterialLayers or () if x.Material)
        elif t == "IfcMaterialConstituentSet":
            stack.extend(x.Material for x in m.MaterialConstituents or () if x.Material)
        elif t == "IfcMaterialList":
            stack.extend(m.Materials or ())
        elif t in ("IfcMaterialLayerSetUsage",):
            stack.append(m.ForLayerSet)
        elif t in ("IfcMaterialProfileSetUsage",):
            stack.append(m.ForProfileSet)
    return " | ".join(dict.fromkeys(names)), " | ".join(dict.fromkeys(profiles))
