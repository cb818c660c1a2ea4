"""Read an IFC model into :class:`ifcjoint.engine.model.ModelContents` (mm).

Opens ``.ifc`` and zipped ``.ifczip`` files, converts the length unit once, resolves placements,
reads member axes from extrusions (through mapped items and boolean first operands) and falls
back to the tessellated body when there is no extrusion to read.
"""

from __future__ import annotations

import hashlib
import math
import re
import tempfile
import zipfile
from collections import defaultdict
from collections.abc import Callable
from pathlib import Path

import ifcopenshell
import ifcopenshell.util.element
import ifcopenshell.util.unit
import numpy as np

from ifcjoint.engine.model import (
    Fastener,
    GridAxis,
    Link,
    Member,
    ModelContents,
    Plate,
    Unreadable,
)
from ifcjoint.errors import ModelError
from ifcjoint.ifc.geometry import (
    NeedsMesh,
    PlacementCache,
    SolidBox,
    att,
    cut_boxes,
    i_shape_from_outline,
    reset_caches,
    solid_boxes,
)
from ifcjoint.ifc.geometry import _walk as walk_item
from ifcjoint.ifc.mesh import principal_box, section_outline, tessellate
from ifcjoint.ifc.recognition import Rules, load_rules

Progress = Callable[[str, int, int], None]

SUPPORTED_SCHEMAS = ("IFC2X3", "IFC4", "IFC4X3")
#: Length units a user may state for a model that declares none (name -> mm per unit).
LENGTH_UNITS = {"mm": 1.0, "cm": 10.0, "m": 1000.0, "in": 25.4, "ft": 304.8}
MEMBER_CLASSES = ("IfcBeam", "IfcColumn", "IfcMember")


# --- opening -----------------------------------------------------------------------------


def _header(raw: bytes) -> str:
    return raw[:8192].decode("latin-1", errors="replace")


def open_model(path: str | Path) -> tuple[ifcopenshell.file, str]:
    """Open an IFC-SPF file or an ifczip, checking it is whole and of a supported schema.

    Returns:
        The opened file and the SHA-256 of the bytes on disk.

    Raises:
        ModelError: missing, unreadable, not IFC, truncated, or an unsupported schema.
    """
    p = Path(path)
    if not p.exists():
        raise ModelError(str(path), "file not found")
    if p.is_dir():
        raise ModelError(str(path), "is a folder", "an .ifc or .ifczip file")
    try:
        raw = p.read_bytes()
    except OSError as exc:
        raise ModelError(str(path), f"cannot read the file: {exc.strerror}") from exc
    sha = hashlib.sha256(raw).hexdigest()
    with tempfile.TemporaryDirectory(prefix="ifcjoint-") as tmp:
        spf = p
        if raw[:4] == b"PK\x03\x04":
            try:
                with zipfile.ZipFile(p) as zf:
                    names = [n for n in zf.namelist() if n.lower().endswith(".ifc")]
                    if not names:
                        raise ModelError(
                            str(path),
                            "zip archive holds no .ifc file",
                            "an ifczip with one .ifc inside",
                        )
                    spf = Path(zf.extract(names[0], tmp))
                    raw = spf.read_bytes()
            except zipfile.BadZipFile as exc:
                raise ModelError(str(path), f"damaged zip archive ({exc})") from exc
        head = _header(raw)
        if not head.lstrip().startswith("ISO-10303-21"):
            raise ModelError(
                str(path),
                "not an IFC file (no ISO-10303-21 header)",
                "an IFC-SPF (.ifc) or .ifczip file",
            )
        m = re.search(r"FILE_SCHEMA\s*\(\s*\(\s*'([^']*)'", head, re.IGNORECASE)
        schema = (m.group(1) if m else "").upper()
        if not any(schema == s or schema.startswith(s + "_") for s in SUPPORTED_SCHEMAS):
            raise ModelError(
                str(path),
                f"unsupported schema {schema or '(none given)'!r}",
                "IFC2X3, IFC4 or IFC4X3",
            )
        tail = raw[-2048:].decode("latin-1", errors="replace")
        if "END-ISO-10303-21" not in tail:
            raise ModelError(
                str(path),
                "file is truncated (no END-ISO-10303-21; at its end)",
                "a complete IFC file",
            )
        try:
            f = ifcopenshell.open(str(spf), format=".ifc")
        except Exception as exc:  # noqa: BLE001 - the parser raises several kinds
            raise ModelError(str(path), f"the IFC parser rejected the file: {exc}") from exc
    return f, sha


def length_scale_to_mm(f: ifcopenshell.file, path: str, assume: str | None) -> tuple[float, str]:
    """Millimetres per model length unit, from the project's unit assignment.

    Args:
        f: the model.
        path: file path for messages.
        assume: a unit name from :data:`LENGTH_UNITS` to use when the model declares none.

    Raises:
        ModelError: the model declares no length unit and none was assumed.
    """
    declared = False
    for proj in f.by_type("IfcProject"):
        ua = proj.UnitsInContext
        if ua is not None and any(
            getattr(u, "UnitType", None) == "LENGTHUNIT" for u in ua.Units or ()
        ):
            declared = True
    if declared:
        return ifcopenshell.util.unit.calculate_unit_scale(f) * 1000.0, "model"
    if assume:
        return LENGTH_UNITS[assume], "assumed"
    raise ModelError(
        path,
        "the model declares no length unit (IfcProject.UnitsInContext has no LENGTHUNIT)",
        "a unit assignment; or state the unit with --length-unit mm|cm|m|in|ft",
    )


# --- text helpers ------------------------------------------------------------------------


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
    }
)
_SIZE_KEYS = ("nominaldiameter", "boltdiameter", "diameter")
_LENGTH_KEYS = ("nominallength", "boltlength", "length")


class _Lookups:
    """Type names and materials of every element, read once from the relationships."""

    def __init__(self, f: ifcopenshell.file) -> None:
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
        # Designation-like single-value properties, read once for every element.
        self.props: dict[int, dict[str, object]] = {}
        for rel in f.by_type("IfcRelDefinesByProperties"):
            pset = rel.RelatingPropertyDefinition
            if pset is None or not pset.is_a("IfcPropertySet"):
                continue
            found = {}
            for p in pset.HasProperties or ():
                if not p.is_a("IfcPropertySingleValue") or p.NominalValue is None:
                    continue
                key = p.Name.replace(" ", "").lower()
                if key in INTERESTING_PROPERTIES:
                    found[key] = p.NominalValue.wrappedValue
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
                v = att(el, a)
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
        """First numeric property among ``keys`` (model length units), or None."""
        props = self.props.get(el.id(), {})
        for k in keys:
            v = props.get(k)
            if isinstance(v, (int, float)) and v > 0:
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


def _unit(v) -> np.ndarray:
    x, y, z = float(v[0]), float(v[1]), float(v[2])
    n = math.sqrt(x * x + y * y + z * z)
    return np.array((x / n, y / n, z / n)) if n > 0 else np.array((x, y, z))


def _orient(axis: np.ndarray) -> np.ndarray:
    """Give an undirected axis a stable sense: upwards, else towards +x, else +y."""
    for i in (2, 0, 1):
        if abs(axis[i]) > 1e-6 and (i != 2 or abs(axis[2]) > 0.5):
            return axis if axis[i] > 0 else -axis
    return axis


# --- the reader --------------------------------------------------------------------------


class _Reader:
    def __init__(self, f: ifcopenshell.file, path: str, scale: float, rules: Rules) -> None:
        self.f = f
        self.path = path
        self.s = scale
        self.rules = rules
        self.placements = PlacementCache()
        self.members: list[Member] = []
        self.plates: list[Plate] = []
        self.fasteners: list[Fastener] = []
        self.unreadable: list[Unreadable] = []
        self.notes: list[str] = []
        self.storey = self._storey_map()
        self.lookups = _Lookups(f)
        self.pending_mesh: list[tuple[object, str, dict]] = []  # (element, role, ctx)
        self.plate_members = 0  # beams/members read as plates (flat and short)

    # storeys
    def _storey_map(self) -> dict[int, str]:
        out: dict[int, str] = {}
        for rel in self.f.by_type("IfcRelContainedInSpatialStructure"):
            st = rel.RelatingStructure
            name = (st.Name or st.LongName or "") if st.is_a("IfcBuildingStorey") else ""
            for el in rel.RelatedElements:
                out[el.id()] = name or out.get(el.id(), "")
        # Parts of an assembly take the assembly's storey.
        for rel in self.f.by_type("IfcRelAggregates"):
            parent = rel.RelatingObject
            if parent.id() in out:
                for el in rel.RelatedObjects:
                    out.setdefault(el.id(), out[parent.id()])
        return out

    def _fail(self, el, reason: str) -> None:
        self.unreadable.append(Unreadable(element=el.GlobalId, ifc_class=el.is_a(), reason=reason))

    def _boxes(self, el) -> list[SolidBox] | None:
        """Analytic boxes in model units, or None when the body must be tessellated."""
        try:
            world = self.placements.matrix(el.ObjectPlacement)
            return solid_boxes(el, world)
        except NeedsMesh:
            return None
        except (AttributeError, TypeError, ValueError, ZeroDivisionError, IndexError) as exc:
            # Malformed analytic data: let the geometry kernel try before giving up.
            self.notes.append(f"{el.GlobalId}: analytic read failed ({exc}); tessellated")
            return None

    def bolt_shaped(self, el) -> bool:
        """An unrecognised element whose body is one extruded circle of a bolt's size."""
        if el.is_a() not in self.rules.bolt_shape_classes:
            return False
        boxes = self._boxes(el)
        if not boxes or len(boxes) > 3:
            return False
        main = max(boxes, key=lambda b: b.size[2])
        prof = main.profile
        if prof is None or prof.ifc_type not in (
            "IfcCircleProfileDef",
            "IfcCircleHollowProfileDef",
        ):
            return False
        return self.rules.looks_like_bolt(
            el.is_a(), float(prof.b or 0) * self.s, float(main.size[2]) * self.s
        )

    # members
    def member_kind(self, el, axis: np.ndarray) -> str:
        vert = abs(float(axis[2]))
        ang_from_vertical = math.degrees(math.acos(min(1.0, vert)))
        ang_from_horizontal = 90.0 - ang_from_vertical
        is_vertical = ang_from_vertical <= self.rules.vertical_within_deg
        is_horizontal = ang_from_horizontal <= self.rules.horizontal_within_deg
        cls = el.is_a()
        if el.is_a("IfcColumn"):
            return "beam" if is_horizontal and ang_from_horizontal < 10 else "column"
        if el.is_a("IfcBeam"):
            return "column" if is_vertical else ("beam" if is_horizontal else "brace")
        ptype = str(getattr(el, "PredefinedType", "") or "")
        if ptype == "USERDEFINED":
            ptype = (el.ObjectType or "").upper()
        if ptype in self.rules.member_as_column and not is_horizontal:
            return "column"
        if ptype in self.rules.member_as_beam and not is_vertical:
            return "beam"
        del cls
        if is_vertical:
            return "column"
        if is_horizontal:
            return "beam"
        return "brace"

    def read_member(self, el) -> None:
        boxes = self._boxes(el)
        if boxes is None:
            self.pending_mesh.append((el, "member", {}))
            return
        main = max(boxes, key=lambda b: b.size[2] * max(b.size[0], b.size[1], 1e-9))
        size = main.size
        prof = main.profile
        if main.kind != "extrusion" or size[2] < 0.5 * max(size[0], size[1]):
            # Not extruded along its length (a sideways extrusion): read the mesh instead.
            self.pending_mesh.append((el, "member", {}))
            return
        if self._flat_and_short(size * self.s, prof):
            # A plate exported as a beam or member (e.g. a "PL20*250" flat): read as a plate.
            self.plate_members += 1
            self._plate_from_boxes(el, boxes)
            return
        cx, cy = (main.lo[0] + main.hi[0]) / 2, (main.lo[1] + main.hi[1]) / 2
        a = main.origin + main.axes @ np.array([cx, cy, main.lo[2]])
        b = main.origin + main.axes @ np.array([cx, cy, main.hi[2]])
        s = self.s
        di, wi = (0, 1) if prof is not None and prof.depth_axis == "x" else (1, 0)
        self._add_member(
            el,
            start=a * s,
            end=b * s,
            depth_dir=main.axes[:, di],
            width_dir=main.axes[:, wi],
            depth=size[di] * s,
            width=size[wi] * s,
            tw=prof.tw * s if prof and prof.tw else None,
            tf=prof.tf * s if prof and prof.tf else None,
            profile_name=prof.name if prof else "",
            profile_type=prof.ifc_type if prof else main.kind,
            fill=prof.fill if prof else None,
            source="extrusion",
            r=prof.r if prof else None,
        )

    @staticmethod
    def _flat_and_short(size_mm: np.ndarray, prof) -> bool:
        """Whether a member's body is really a plate, whatever its IFC class.

        A solid flat no thicker than 60 mm, at least 4 x wider than thick and at most 2 m long
        (common practice, no source).
        """
        if prof is None or prof.ifc_type not in (
            "IfcRectangleProfileDef",
            "IfcArbitraryClosedProfileDef",
        ):
            return False
        if prof.fill is not None and prof.fill < 0.9:
            return False
        t, w, ln = sorted(float(x) for x in size_mm)
        return t <= 60.0 and w >= 4.0 * t and ln <= 2000.0

    def _add_member(
        self,
        el,
        *,
        start,
        end,
        depth_dir,
        width_dir,
        depth,
        width,
        tw,
        tf,
        profile_name,
        profile_type,
        fill,
        source,
        r=None,
    ) -> None:
        axis = _unit(np.asarray(end) - np.asarray(start))
        kind = self.member_kind(el, axis)
        mat, mat_profiles = self.lookups.material(el)
        texts = self.lookups.texts(el)
        designation = " | ".join(
            x
            for x in (
                profile_name,
                mat_profiles,
                texts.get("Name"),
                texts.get("ObjectType"),
                texts.get("TypeName"),
                texts.get("Description"),
            )
            if x
        )
        steel = self.rules.steel_state(mat, profile_type, designation)
        if steel == "unknown" and fill is not None and fill > 0.8:
            steel = "non_steel"  # solid section, no steel hint: concrete/timber-like
        self.members.append(
            Member(
                guid=el.GlobalId,
                ifc_class=el.is_a(),
                name=el.Name or "",
                kind=kind,
                start=tuple(float(x) for x in start),
                end=tuple(float(x) for x in end),
                depth_dir=tuple(float(x) for x in _unit(np.asarray(depth_dir))),
                width_dir=tuple(float(x) for x in _unit(np.asarray(width_dir))),
                depth=float(depth),
                width=float(width),
                web_thickness=float(tw) if tw else None,
                flange_thickness=float(tf) if tf else None,
                profile_name=profile_name or mat_profiles or "",
                profile_type=profile_type,
                material=mat,
                steel=steel,
                storey=self.storey.get(el.id(), ""),
                geometry_source=source,
                root_radius=float(r) * self.s if r is not None else None,
                texts=self.lookups.all_texts(el, profile_name, mat_profiles, mat),
            )
        )

    def member_from_mesh(self, el, v: np.ndarray, fcs: np.ndarray) -> None:
        box = principal_box(v, fcs)
        axis = _orient(box.axes[:, 0])
        half = box.size[0] / 2
        fill = box.volume / max(box.size.prod(), 1e-9)
        # An I section's web and flanges from a cut at mid-length (the ends may be coped).
        dims = None
        try:
            outline = section_outline(
                v, fcs, box.center, box.axes[:, 0], box.axes[:, 2], box.axes[:, 1]
            )
            if outline is not None:
                dims = i_shape_from_outline(outline, "y")
        except (ValueError, TypeError):  # a degenerate cut only loses the thicknesses
            dims = None
        self._add_member(
            el,
            start=box.center - axis * half,
            end=box.center + axis * half,
            depth_dir=box.axes[:, 1],
            width_dir=box.axes[:, 2],
            depth=box.size[1],
            width=box.size[2],
            tw=dims[0] if dims else None,
            tf=dims[1] if dims else None,
            profile_name="",
            profile_type="mesh",
            fill=fill,
            source="mesh",
            r=(dims[2] / self.s) if dims else None,
        )

    # plates
    def read_plate(self, el) -> None:
        boxes = self._boxes(el)
        if boxes is None:
            self.pending_mesh.append((el, "plate", {}))
            return
        self._plate_from_boxes(el, boxes)

    def _plate_from_boxes(self, el, boxes) -> None:
        main = max(boxes, key=lambda b: b.volume)
        size = main.size * self.s
        order = np.argsort(size)  # smallest = thickness
        n, u, v = order[0], order[2], order[1]
        center = main.center() * self.s
        holes = []
        prof = main.profile
        for hx, hy, dia in prof.extra.get("holes", ()) if prof is not None else ():
            p = main.origin + main.axes[:, 0] * hx + main.axes[:, 1] * hy
            p = p * self.s
            nrm = main.axes[:, n]
            p = p + nrm * float((center - p) @ nrm)  # onto the mid-plane
            holes.append((tuple(float(x) for x in p), dia * self.s))
        holes.extend(self._opening_holes(el, center, main.axes[:, n]))
        holes.extend(
            self._round_holes(
                cut_boxes(el, self.placements.aff(el.ObjectPlacement)), center, main.axes[:, n]
            )
        )
        self._add_plate(
            el,
            center,
            main.axes[:, n],
            main.axes[:, u],
            main.axes[:, v],
            size[u] / 2,
            size[v] / 2,
            size[n],
            "extrusion",
            holes=holes,
        )

    def _opening_holes(self, el, center, normal) -> list:
        """Round holes cut by IfcOpeningElement voids (circle extrusions), on the mid-plane."""
        out = []
        for rel in getattr(el, "HasOpenings", None) or ():
            op = rel.RelatedOpeningElement
            boxes: list = []
            try:
                world = self.placements.aff(op.ObjectPlacement)
            except NeedsMesh:
                continue
            # Any representation that reads as boxes will do (Body extrusion, or the Box).
            for rep in op.Representation.Representations if op.Representation else ():
                found: list = []
                try:
                    for it in rep.Items:
                        walk_item(it, world, found)
                except (NeedsMesh, AttributeError, TypeError, ValueError):
                    continue
                if found:
                    boxes = found
                    break
            out.extend(self._round_holes(boxes, center, normal))
        return out

    def _round_holes(self, boxes, center, normal) -> list:
        """Cut boxes square to a plate with a round (or square) cross-section: holes."""
        out = []
        for b in boxes:
            size = b.size * self.s
            along = int(np.argmax(np.abs(b.axes.T @ normal)))
            if abs(float(b.axes[:, along] @ normal)) < 0.9:
                continue  # not square to the plate
            across = [size[i] for i in range(3) if i != along]
            if abs(across[0] - across[1]) > 0.1 * max(across) or max(across) > 80.0:
                continue  # a slot, a notch or a cut-out, not a bolt hole
            c = b.center() * self.s
            c = c + normal * float((center - c) @ normal)
            out.append((tuple(float(x) for x in c), float(sum(across) / 2)))
        return out

    def _add_plate(self, el, center, normal, u, v, hu, hv, t, source, holes=()) -> None:
        mat, _ = self.lookups.material(el)
        self.plates.append(
            Plate(
                guid=el.GlobalId,
                ifc_class=el.is_a(),
                name=el.Name or "",
                center=tuple(float(x) for x in center),
                normal=tuple(float(x) for x in _unit(np.asarray(normal))),
                u_dir=tuple(float(x) for x in _unit(np.asarray(u))),
                v_dir=tuple(float(x) for x in _unit(np.asarray(v))),
                half_u=float(hu),
                half_v=float(hv),
                thickness=float(t),
                material=mat,
                geometry_source=source,
                holes=tuple(holes),
                texts=self.lookups.all_texts(el, mat),
            )
        )

    def plate_from_mesh(self, el, v: np.ndarray, fcs: np.ndarray) -> None:
        box = principal_box(v, fcs)
        self._add_plate(
            el,
            box.center,
            box.axes[:, 2],
            box.axes[:, 0],
            box.axes[:, 1],
            box.size[0] / 2,
            box.size[1] / 2,
            box.size[2],
            "mesh",
        )

    # fasteners
    def read_fastener(self, el, kind: str) -> None:
        if el.Representation is None:
            self._fastener_from_placement(el, kind)
            return
        boxes = self._boxes(el)
        if boxes is None:
            self.pending_mesh.append((el, "fastener", {"kind": kind}))
            return
        main = max(boxes, key=lambda b: b.size[2])
        axis = _unit(main.axes[:, 2])
        dia = float(min(main.size[0], main.size[1]))
        # Several parallel shanks far apart: a bolt group exported as one element.
        shanks = [
            b
            for b in boxes
            if b.size[2] > 0.8 * main.size[2] and abs(float(_unit(b.axes[:, 2]) @ axis)) > 0.99
        ]
        centres = [b.center() for b in shanks]
        lateral = [c - axis * float((c - centres[0]) @ axis) for c in centres]
        spread = max((float(np.linalg.norm(p - lateral[0])) for p in lateral), default=0.0)
        group = len(shanks) >= 2 and spread > 2 * dia
        base = np.mean(centres, axis=0) if group else main.center()
        pts = np.vstack([b.corners() for b in boxes])
        t = (pts - base) @ axis
        lo, hi = float(t.min()), float(t.max())
        if group:
            lo = min(
                float((c - base) @ axis) - b.size[2] / 2
                for c, b in zip(centres, shanks, strict=True)
            )
            hi = max(
                float((c - base) @ axis) + b.size[2] / 2
                for c, b in zip(centres, shanks, strict=True)
            )
        center = base + axis * (lo + hi) / 2
        self._add_fastener(
            el,
            kind,
            center * self.s,
            axis,
            (hi - lo) * self.s,
            dia * self.s,
            "extrusion",
            shanks=tuple(tuple(float(x) for x in c * self.s) for c in centres) if group else (),
        )

    def _fastener_from_placement(self, el, kind: str) -> None:
        try:
            m = self.placements.matrix(el.ObjectPlacement)
        except NeedsMesh:
            self._fail(el, "no body and a placement ifcjoint cannot resolve")
            return
        if el.ObjectPlacement is None:
            self._fail(el, "no body and no placement")
            return
        length = float(getattr(el, "NominalLength", None) or 0.0)
        dia = float(getattr(el, "NominalDiameter", None) or 0.0)
        axis = _unit(m[:3, 2])
        center = m[:3, 3] + axis * length / 2
        self._add_fastener(
            el, kind, center * self.s, axis, length * self.s, dia * self.s, "placement"
        )

    def _add_fastener(self, el, kind, center, axis, length, dia, source, shanks=()) -> None:
        nd = nl = None
        if el.is_a("IfcMechanicalFastener"):
            nd = att(el, "NominalDiameter")
            nl = att(el, "NominalLength")
        nd = nd or self.lookups.number(el, _SIZE_KEYS)
        nl = nl or self.lookups.number(el, _LENGTH_KEYS)
        mat, _ = self.lookups.material(el)
        self.fasteners.append(
            Fastener(
                guid=el.GlobalId,
                ifc_class=el.is_a(),
                name=el.Name or "",
                kind=kind,
                center=tuple(float(x) for x in center),
                axis=tuple(float(x) for x in axis),
                length=float(length),
                diameter=float(dia),
                geometry_source=source,
                nominal_diameter=float(nd) * self.s if nd else None,
                nominal_length=float(nl) * self.s if nl else None,
                texts=self.lookups.all_texts(el, mat),
                shanks=shanks,
            )
        )

    def fastener_from_mesh(self, el, v, fcs, kind: str) -> None:
        box = principal_box(v, fcs)
        self._add_fastener(el, kind, box.center, box.axes[:, 0], box.size[0], box.size[1], "mesh")

    def run_mesh(self, progress: Progress | None) -> None:
        if not self.pending_mesh:
            return
        roles = {el.id(): (role, ctx) for el, role, ctx in self.pending_mesh}
        total = len(self.pending_mesh)
        done = 0
        for el, v, fcs, err in tessellate(self.f, [e for e, _, _ in self.pending_mesh], self.s):
            role, ctx = roles[el.id()]
            done += 1
            if progress and done % 50 == 0:
                progress("tessellate", done, total)
            if err is not None or v is None or len(fcs) == 0:
                if role == "fastener" and el.ObjectPlacement is not None:
                    self._fastener_from_placement(el, ctx["kind"])
                    continue
                self._fail(el, err or "body has no triangles")
                continue
            try:
                if role == "member":
                    self.member_from_mesh(el, v, fcs)
                elif role == "plate":
                    self.plate_from_mesh(el, v, fcs)
                else:
                    self.fastener_from_mesh(el, v, fcs, ctx["kind"])
            except (ValueError, np.linalg.LinAlgError) as exc:
                self._fail(el, f"tessellated body unusable: {exc}")
        if progress:
            progress("tessellate", total, total)


def _links(f: ifcopenshell.file, member_ids: set[str], part_ids: set[str]) -> list[Link]:
    """Relationships tying plates/fasteners to members, by source."""
    acc: dict[tuple[str, str], set[str]] = defaultdict(set)

    def parts_of(el) -> list:
        if el.GlobalId in part_ids:
            return [el]
        if el.is_a("IfcElementAssembly"):
            return [
                p for p in ifcopenshell.util.element.get_decomposition(el) if p.GlobalId in part_ids
            ]
        return []

    for rel in f.by_type("IfcRelConnectsWithRealizingElements"):
        ms = {
            e.GlobalId
            for e in (rel.RelatingElement, rel.RelatedElement)
            if e is not None and e.GlobalId in member_ids
        }
        for r in rel.RealizingElements or ():
            for p in parts_of(r):
                if ms:
                    acc[(p.GlobalId, "realizing")] |= ms
    for asm in f.by_type("IfcElementAssembly"):
        parts = ifcopenshell.util.element.get_decomposition(asm)
        ms = {p.GlobalId for p in parts if p.GlobalId in member_ids}
        if not ms:
            continue
        for p in parts:
            if p.GlobalId in part_ids:
                acc[(p.GlobalId, "assembly")] |= ms
    for rel in f.by_type("IfcRelConnectsElements"):
        if rel.is_a("IfcRelConnectsWithRealizingElements"):
            continue
        a, b = rel.RelatingElement, rel.RelatedElement
        if a is None or b is None:
            continue
        for x, y in ((a, b), (b, a)):
            if x.GlobalId in part_ids and y.GlobalId in member_ids:
                acc[(x.GlobalId, "connects")].add(y.GlobalId)
    return [Link(part=p, members=tuple(sorted(ms)), source=s) for (p, s), ms in acc.items()]


def _grid_axes(f: ifcopenshell.file, placements: PlacementCache, s: float) -> list[GridAxis]:
    out = []
    for grid in f.by_type("IfcGrid"):
        try:
            m = placements.matrix(grid.ObjectPlacement)
        except NeedsMesh:
            continue
        for fam in ("UAxes", "VAxes", "WAxes"):
            for ax in getattr(grid, fam, None) or ():
                c = ax.AxisCurve
                if c is None or not c.is_a("IfcPolyline") or len(c.Points) < 2:
                    continue
                pts = []
                for pt in (c.Points[0], c.Points[-1]):
                    xyz = list(pt.Coordinates) + [0.0] * (3 - len(pt.Coordinates))
                    w = m @ np.array([*xyz, 1.0])
                    pts.append((float(w[0] * s), float(w[1] * s)))
                out.append(
                    GridAxis(tag=str(ax.AxisTag or "?"), family=fam[0], p0=pts[0], p1=pts[1])
                )
    return out


def read_model(
    path: str | Path,
    *,
    assume_length_unit: str | None = None,
    rules: Rules | None = None,
    progress: Progress | None = None,
) -> ModelContents:
    """Read every beam, column, plate and fastener of a model, in mm.

    Args:
        path: ``.ifc`` or ``.ifczip`` file.
        assume_length_unit: unit to use when the model declares none (``mm``, ``m``...).
        rules: recognition rules; the bundled ones when None.
        progress: optional callback ``(stage, done, total)``.

    Raises:
        ModelError: the file cannot be used (see :func:`open_model`), or it has no length unit.
    """
    rules = rules or load_rules()
    f, sha = open_model(path)
    scale, unit_source = length_scale_to_mm(f, str(path), assume_length_unit)
    reset_caches(f)
    try:
        return _read(f, path, sha, scale, unit_source, rules, progress)
    finally:
        reset_caches(None)


def _read(f, path, sha, scale, unit_source, rules, progress) -> ModelContents:
    r = _Reader(f, str(path), scale, rules)

    members = []
    for cls in MEMBER_CLASSES:
        members.extend(f.by_type(cls))
    plates = list(f.by_type("IfcPlate"))
    plate_ids = {p.id() for p in plates}
    fasteners: list[tuple[object, str]] = []
    counts: dict[str, int] = defaultdict(int)
    ignored: dict[str, int] = defaultdict(int)
    seen = set()
    for cls in sorted(rules.fastener_classes | rules.plate_classes):
        try:
            els = f.by_type(cls)
        except RuntimeError:  # class not in this schema
            continue
        for el in els:
            if el.id() in seen or el.id() in plate_ids or el.is_a("IfcPlate"):
                continue
            seen.add(el.id())
            texts = r.lookups.texts(el)
            kind = rules.fastener_kind(el.is_a(), texts)
            if kind not in (None, "other"):
                fasteners.append((el, kind))
            elif rules.is_plate(el.is_a(), texts):
                plates.append(el)
            elif r.bolt_shaped(el):
                fasteners.append((el, "bolt"))
                r.notes.append(f"{el.GlobalId} ({el.is_a()}): taken as a bolt by its shape")
            elif kind == "other":
                fasteners.append((el, kind))
            else:
                ignored[el.is_a()] += 1

    total = len(members) + len(plates) + len(fasteners)
    done = 0
    step = max(1, total // 100)

    def tick() -> None:
        nonlocal done
        done += 1
        if progress and done % step == 0:
            progress("read", done, total)

    for el in members:
        try:
            r.read_member(el)
        except Exception as exc:  # noqa: BLE001 - one bad element never stops the scan
            r._fail(el, f"cannot read member geometry: {exc}")
        tick()
    for el in plates:
        try:
            r.read_plate(el)
        except Exception as exc:  # noqa: BLE001
            r._fail(el, f"cannot read plate geometry: {exc}")
        tick()
    for el, kind in fasteners:
        try:
            r.read_fastener(el, kind)
        except Exception as exc:  # noqa: BLE001
            r._fail(el, f"cannot read fastener geometry: {exc}")
        tick()
    if progress:
        progress("read", total, total)
    r.run_mesh(progress)

    member_ids = {m.guid for m in r.members}
    part_ids = {p.guid for p in r.plates} | {x.guid for x in r.fasteners}
    links = _links(f, member_ids, part_ids)
    grid = _grid_axes(f, r.placements, scale)

    for m in r.members:
        counts[m.kind + "s"] += 1
        if m.steel == "non_steel":
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
    for cls, n in sorted(ignored.items()):
        notes.append(f"{n} {cls} element(s) not recognised as plates or fasteners (ignored)")
    return ModelContents(
        path=str(path),
        schema=f.schema_identifier if hasattr(f, "schema_identifier") else f.schema,
        length_unit_to_mm=scale,
        length_unit_source=unit_source,
        sha256=sha,
        members=tuple(sorted(r.members, key=lambda m: m.guid)),
        plates=tuple(sorted(r.plates, key=lambda p: p.guid)),
        fasteners=tuple(sorted(r.fasteners, key=lambda x: x.guid)),
        links=tuple(sorted(links, key=lambda lk: (lk.part, lk.source))),
        grid_axes=tuple(grid),
        counts=dict(counts),
        unreadable=tuple(sorted(r.unreadable, key=lambda u: u.element)),
        notes=tuple(notes),
    )
