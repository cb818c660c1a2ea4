"""Elements of a model reduced to what the joint finder needs, in mm.

Members become centrelines with a section box, plates mid-plane boxes with their holes,
fasteners axes. Bodies are read analytically (``solids``); what cannot be read that way is
tessellated afterwards in one batch (``mesh``). An element that cannot be read is recorded
with the reason and never stops the others.
"""

from __future__ import annotations

import math

import numpy as np

from ifcjoint.ifc.context import DamagedData, NeedsMesh, ReadContext
from ifcjoint.ifc.mesh import principal_box, section_outline, tessellate
from ifcjoint.ifc.profiles import i_shape_from_outline
from ifcjoint.ifc.recognition import Rules
from ifcjoint.ifc.relations import storey_names
from ifcjoint.ifc.solids import SolidBox, cut_boxes, solid_boxes, walk
from ifcjoint.ifc.texts import ElementTexts
from ifcjoint.model.codes import FastenerKind, MemberKind, SteelState
from ifcjoint.model.elements import Fastener, Member, Plate, PlateLeg, Progress, Unreadable

#: Property names (lower case, no spaces) read for bolt sizes.
_SIZE_KEYS = ("nominaldiameter", "boltdiameter", "diameter")
_LENGTH_KEYS = ("nominallength", "boltlength", "length")
_THROAT_KEYS = ("throat", "throatthickness", "nominalthroatthickness", "weldthroat", "a")
_LEG_KEYS = ("leg", "leglength", "weldleg", "weldsize")
_HOLE_KEYS = ("holediameter", "boltholediameter", "clearanceholediameter", "diameterofhole",
              "clearancehole", "holesize")


def _unit(v) -> np.ndarray:
    x, y, z = float(v[0]), float(v[1]), float(v[2])
    n = math.sqrt(x * x + y * y + z * z)
    return np.array((x / n, y / n, z / n)) if n > 0 else np.array((x, y, z))


#: Largest coordinate or size believed, mm (1e9 mm = 1,000 km; common practice, no source).
_LIMIT_MM = 1e9


def _finite(el, *values) -> None:
    """Refuse an element whose read numbers are not finite or beyond any building.

    Raises:
        DamagedData: naming the element; it is reported unreadable, never written back.
    """
    for v in values:
        a = np.asarray(v, dtype=float)
        if not np.isfinite(a).all() or (np.abs(a) > _LIMIT_MM).any():
            raise DamagedData(
                f"#{el.id()} {el.is_a()}: coordinates or sizes not finite or beyond 1,000 km "
                "(damaged geometry)")


def _orient(axis: np.ndarray) -> np.ndarray:
    """Give an undirected axis a stable sense: upwards, else towards +x, else +y."""
    for i in (2, 0, 1):
        if abs(axis[i]) > 1e-6 and (i != 2 or abs(axis[2]) > 0.5):
            return axis if axis[i] > 0 else -axis
    return axis



#: Open sections read as parts of a joint (cleats), not as plates or members.
SECTION_PART_PROFILES = frozenset({"IfcLShapeProfileDef", "IfcTShapeProfileDef",
                                   "IfcUShapeProfileDef", "IfcCShapeProfileDef",
                                   "IfcZShapeProfileDef"})
#: A member this short with such a profile is a part (a cleat), mm (common practice, no
#: source: cleats and brackets run to a few hundred millimetres).
SECTION_PART_MAX_LENGTH = 1500.0
#: A plate's body fills at least this share of its box; below, it is some other section
#: (common practice, no source: holes and chamfers take a few per cent).
FLAT_FILL = 0.6

class ElementReader:
    """Reads members, plates and fasteners of one model into mm, collecting what fails."""

    def __init__(self, ctx: ReadContext, scale: float, rules: Rules) -> None:
        self.ctx = ctx
        self.s = scale
        self.rules = rules
        self.members: list[Member] = []
        self.plates: list[Plate] = []
        self.fasteners: list[Fastener] = []
        self.unreadable: list[Unreadable] = []
        self.notes: list[str] = []
        self.storey = storey_names(ctx.file)
        self.lookups = ElementTexts(ctx)
        self.pending_mesh: list[tuple[object, str, dict]] = []  # (element, role, ctx)
        self.plate_members = 0  # beams/members read as plates (flat and short)

    def fail(self, el, reason: str) -> None:
        """Record an element that could not be read, with the reason."""
        self.unreadable.append(Unreadable(element=self.ctx.key(el), ifc_class=el.is_a(),
                                          reason=reason, name=el.Name or ""))

    def _boxes(self, el) -> list[SolidBox] | None:
        """Analytic boxes in model units, or None when the body must be tessellated."""
        try:
            world = self.ctx.placements.matrix(el.ObjectPlacement)
            return solid_boxes(self.ctx, el, world)
        except NeedsMesh:
            return None
        except DamagedData:
            raise  # never to the kernel: the element is unreadable
        except (AttributeError, TypeError, ValueError, ZeroDivisionError, IndexError) as exc:
            # Malformed analytic data: let the geometry kernel try before giving up.
            self.notes.append(f"{self.ctx.key(el)}: analytic read failed ({exc}); tessellated")
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
    def member_kind(self, el, axis: np.ndarray) -> MemberKind:
        """Beam, column or brace from the class, the predefined type and the orientation."""
        vert = abs(float(axis[2]))
        ang_from_vertical = math.degrees(math.acos(min(1.0, vert)))
        ang_from_horizontal = 90.0 - ang_from_vertical
        is_vertical = ang_from_vertical <= self.rules.vertical_within_deg
        is_horizontal = ang_from_horizontal <= self.rules.horizontal_within_deg
        beam, column, brace = MemberKind.BEAM, MemberKind.COLUMN, MemberKind.BRACE
        if el.is_a("IfcColumn"):
            return beam if is_horizontal and ang_from_horizontal < 10 else column
        if el.is_a("IfcBeam"):
            return column if is_vertical else (beam if is_horizontal else brace)
        ptype = str(getattr(el, "PredefinedType", "") or "")
        if ptype == "USERDEFINED":
            ptype = (el.ObjectType or "").upper()
        if ptype in self.rules.member_as_column and not is_horizontal:
            return column
        if ptype in self.rules.member_as_beam and not is_vertical:
            return beam
        if is_vertical:
            return column
        if is_horizontal:
            return beam
        return brace

    def read_member(self, el) -> None:
        """Read a beam, column or member (or a flat bar read as a plate)."""
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
        if (prof is not None and prof.ifc_type in SECTION_PART_PROFILES
                and size[2] * self.s <= SECTION_PART_MAX_LENGTH):
            # A short angle or tee (a cleat): a part of a joint, never a member of the frame.
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
        _finite(el, start, end, depth_dir, width_dir, depth, width)
        axis = _unit(np.asarray(end) - np.asarray(start))
        if not np.isfinite(axis).all() or not axis.any():
            raise DamagedData("member has zero length")
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
        if steel == SteelState.UNKNOWN and fill is not None and fill > 0.8:
            steel = SteelState.NON_STEEL  # solid section, no steel hint: concrete/timber-like
        self.members.append(
            Member(
                guid=self.ctx.key(el),
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
        """A member from its tessellated body (principal axes, mid-length cut)."""
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
        """Read a plate as its mid-plane box with its holes."""
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
        shape, t, legs = "flat", size[n], ()
        if prof is not None and (prof.ifc_type in SECTION_PART_PROFILES
                                 or (prof.fill is not None and prof.fill < FLAT_FILL)):
            # an angle, a tee, a channel: its box is not a plate; its leg is the thickness
            shape = prof.ifc_type if prof.ifc_type in SECTION_PART_PROFILES else "section"
            t = min(x for x in (prof.tf, prof.tw, size[n] / self.s) if x) * self.s
            legs = self._legs(main, prof)
        for hx, hy, dia in prof.extra.get("holes", ()) if prof is not None else ():
            p = main.origin + main.axes[:, 0] * hx + main.axes[:, 1] * hy
            p = p * self.s
            nrm = main.axes[:, n]
            p = p + nrm * float((center - p) @ nrm)  # onto the mid-plane
            holes.append((tuple(float(x) for x in p), dia * self.s))
        holes.extend(self._opening_holes(el, center, main.axes[:, n]))
        holes.extend(
            self._round_holes(
                cut_boxes(self.ctx, el, self.ctx.placements.aff(el.ObjectPlacement)),
                center,
                main.axes[:, n],
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
            t,
            "extrusion",
            holes=holes,
            shape=shape,
            legs=legs if shape != "flat" else (),
            root_radius=(prof.r * self.s if legs and prof.r else None),
        )

    def _opening_holes(self, el, center, normal) -> list:
        """Round holes cut by IfcOpeningElement voids (circle extrusions), on the mid-plane."""
        out = []
        for rel in getattr(el, "HasOpenings", None) or ():
            op = rel.RelatedOpeningElement
            boxes: list = []
            try:
                world = self.ctx.placements.aff(op.ObjectPlacement)
            except NeedsMesh:
                continue
            # Any representation that reads as boxes will do (Body extrusion, or the Box).
            for rep in op.Representation.Representations if op.Representation else ():
                found: list = []
                try:
                    for it in rep.Items:
                        walk(self.ctx, it, world, found)
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

    def _legs(self, box, prof) -> tuple[PlateLeg, ...]:
        """An angle's legs in world coordinates (mm), from its L profile (none otherwise)."""
        out = []
        zmid = (box.lo[2] + box.hi[2]) / 2
        half_len = (box.hi[2] - box.lo[2]) / 2 * self.s
        t = prof.extra.get("thickness", 0.0) * self.s
        for (cx, cy), (ax, ay), (nx, ny), length in prof.extra.get("legs", ()):
            c = (box.origin + box.axes @ np.array([cx, cy, zmid])) * self.s
            out.append(PlateLeg(
                center=tuple(float(x) for x in c),
                normal=tuple(float(x) for x in _unit(box.axes @ np.array([nx, ny, 0.0]))),
                across=tuple(float(x) for x in _unit(box.axes @ np.array([ax, ay, 0.0]))),
                along=tuple(float(x) for x in _unit(box.axes[:, 2])),
                half_across=float(length) * self.s / 2, half_along=float(half_len),
                thickness=float(t)))
        return tuple(out)

    def _add_plate(
        self, el, center, normal, u, v, hu, hv, t, source, holes=(), shape="flat", legs=(),
        root_radius=None,
    ) -> None:
        _finite(el, center, normal, u, v, hu, hv, t, *(h[0] for h in holes))
        mat, _ = self.lookups.material(el)
        self.plates.append(
            Plate(
                guid=self.ctx.key(el),
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
                shape=shape,
                legs=tuple(legs),
                root_radius=root_radius,
            )
        )

    def plate_from_mesh(self, el, v: np.ndarray, fcs: np.ndarray) -> None:
        """A plate from its tessellated body."""
        box = principal_box(v, fcs)
        # the body's share of its box (divergence theorem), trusted only on a closed mesh
        # whose faces all point out (their area vectors then sum to zero)
        tri = v[np.asarray(fcs)]
        cross = np.cross(tri[:, 1] - tri[:, 0], tri[:, 2] - tri[:, 0])
        closed = np.linalg.norm(cross.sum(0)) <= 1e-6 * np.linalg.norm(cross, axis=1).sum()
        volume = abs(float(np.einsum("ij,ij->i", tri[:, 0], cross).sum())) / 6
        filled = volume / max(float(np.prod(box.size)), 1e-12) if closed else 1.0
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
            shape="flat" if filled >= FLAT_FILL else "section",
        )

    # fasteners
    def read_fastener(self, el, kind: FastenerKind) -> None:
        """Read a fastener as its axis (several shanks: a bolt group)."""
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

    def _fastener_from_placement(self, el, kind: FastenerKind) -> None:
        try:
            m = self.ctx.placements.matrix(el.ObjectPlacement)
        except NeedsMesh:
            self.fail(el, "no body and a placement ifcjoint cannot resolve")
            return
        except DamagedData as exc:
            self.fail(el, f"damaged placement: {exc}")
            return
        if el.ObjectPlacement is None:
            self.fail(el, "no body and no placement")
            return
        length = float(getattr(el, "NominalLength", None) or 0.0)
        dia = float(getattr(el, "NominalDiameter", None) or 0.0)
        axis = _unit(m[:3, 2])
        center = m[:3, 3] + axis * length / 2
        self._add_fastener(
            el, kind, center * self.s, axis, length * self.s, dia * self.s, "placement"
        )

    def _add_fastener(self, el, kind, center, axis, length, dia, source, shanks=()) -> None:
        _finite(el, center, axis, length, dia, *shanks)
        nd = nl = None
        if el.is_a("IfcMechanicalFastener"):
            nd = self.ctx.att(el, "NominalDiameter")
            nl = self.ctx.att(el, "NominalLength")
        nd = nd if nd is not None else self.lookups.number(el, _SIZE_KEYS)
        nl = nl if nl is not None else self.lookups.number(el, _LENGTH_KEYS)
        hole = self.lookups.number(el, _HOLE_KEYS)
        throat = None
        if kind == FastenerKind.WELD:  # a size property: the throat a, or the leg (a = leg/√2)
            throat = self.lookups.number(el, _THROAT_KEYS)
            leg = self.lookups.number(el, _LEG_KEYS) if throat is None else None
            throat = throat if leg is None else leg / math.sqrt(2)
        mat, _ = self.lookups.material(el)
        self.fasteners.append(
            Fastener(
                guid=self.ctx.key(el),
                ifc_class=el.is_a(),
                name=el.Name or "",
                kind=kind,
                center=tuple(float(x) for x in center),
                axis=tuple(float(x) for x in axis),
                length=float(length),
                diameter=float(dia),
                geometry_source=source,
                nominal_diameter=float(nd) * self.s if nd is not None else None,
                nominal_length=float(nl) * self.s if nl is not None else None,
                hole_diameter=float(hole) * self.s if hole is not None else None,
                weld_throat=float(throat) * self.s if throat is not None else None,
                texts=self.lookups.all_texts(el, mat),
                shanks=shanks,
            )
        )

    def fastener_from_mesh(self, el, v, fcs, kind: FastenerKind) -> None:
        """A fastener from its tessellated body."""
        box = principal_box(v, fcs)
        self._add_fastener(el, kind, box.center, box.axes[:, 0], box.size[0], box.size[1], "mesh")

    def run_mesh(self, progress: Progress | None) -> None:
        """Tessellate every body that could not be read analytically."""
        if not self.pending_mesh:
            return
        roles = {el.id(): (role, extra) for el, role, extra in self.pending_mesh}
        total = len(self.pending_mesh)
        done = 0
        pending = [e for e, _, _ in self.pending_mesh]
        for el, v, fcs, err in tessellate(self.ctx.file, pending, self.s):
            role, extra = roles[el.id()]
            done += 1
            if progress and done % 50 == 0:
                progress("tessellate", done, total)
            if err is not None or v is None or len(fcs) == 0:
                if role == "fastener" and el.ObjectPlacement is not None:
                    self._fastener_from_placement(el, extra["kind"])
                    continue
                self.fail(el, err or "body has no triangles")
                continue
            try:
                if role == "member":
                    self.member_from_mesh(el, v, fcs)
                elif role == "plate":
                    self.plate_from_mesh(el, v, fcs)
                else:
                    self.fastener_from_mesh(el, v, fcs, extra["kind"])
            except (ValueError, np.linalg.LinAlgError) as exc:
                self.fail(el, f"tessellated body unusable: {exc}")
        if progress:
            progress("tessellate", total, total)
