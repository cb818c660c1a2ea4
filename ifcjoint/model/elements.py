"""Plain data read from a model, in one unit system (mm), independent of IFC.

The IFC layer fills these; the joint finder and the check engine read them. Vectors are
world-coordinate tuples in millimetres; directions are unit vectors.
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import dataclass, field

from ifcjoint.model.codes import FastenerKind, LinkSource, MemberKind, SteelState

Vec3 = tuple[float, float, float]

#: Progress callback of long stages: ``progress(stage, done, total)``.
Progress = Callable[[str, int, int], None]


@dataclass(frozen=True, slots=True, kw_only=True)
class Member:
    """A linear structural member (beam, column or brace) reduced to its centreline and section box.

    Attributes:
        guid: IFC GlobalId as written in the file.
        ifc_class: IFC entity name, e.g. ``IfcBeam``.
        name: element Name (may be empty).
        kind: beam, column or brace.
        start: centreline point at the start of the member, mm (section centre).
        end: centreline point at the end of the member, mm.
        depth_dir: unit vector of the section depth (profile Y: across the flanges of an I).
        width_dir: unit vector of the section width (profile X: along the flanges of an I).
        depth: overall section depth h, mm.
        width: overall section width b, mm.
        web_thickness: tw in mm when known from a parametric profile, else None.
        flange_thickness: tf in mm when known, else None.
        profile_name: profile designation as found (may be empty).
        profile_type: IFC profile entity (``IfcIShapeProfileDef``...) or ``mesh``.
        material: material name as found (may be empty).
        steel: steel, non_steel or unknown (see ifcjoint/data/recognition.toml).
        storey: name of the containing storey, or empty.
        geometry_source: ``extrusion`` (read analytically) or ``mesh`` (from the tessellated body).
    """

    guid: str
    ifc_class: str
    name: str
    kind: MemberKind
    start: Vec3
    end: Vec3
    depth_dir: Vec3
    width_dir: Vec3
    depth: float
    width: float
    web_thickness: float | None = None
    flange_thickness: float | None = None
    profile_name: str = ""
    profile_type: str = ""
    material: str = ""
    steel: SteelState = SteelState.UNKNOWN
    storey: str = ""
    geometry_source: str = "extrusion"
    root_radius: float | None = None
    #: every text that may name the section or grade: profile and material-profile names,
    #: Name, ObjectType, Description, type name, designation-like properties
    texts: tuple[str, ...] = ()

    @property
    def length(self) -> float:
        """Centreline length in mm."""
        return sum((b - a) ** 2 for a, b in zip(self.start, self.end, strict=True)) ** 0.5


@dataclass(frozen=True, slots=True, kw_only=True)
class PlateLeg:
    """One flat leg of an angle, as a plate box (mm).

    Attributes:
        center: centre of the leg; normal: through its thickness; across: along the leg's
        width (from the heel to its toe); along: along the angle's length.
        half_across, half_along: half extents; thickness: the leg's.
    """

    center: Vec3
    normal: Vec3
    across: Vec3
    along: Vec3
    half_across: float
    half_along: float
    thickness: float


@dataclass(frozen=True, slots=True, kw_only=True)
class Plate:
    """A plate reduced to its mid-plane box.

    Attributes:
        guid: IFC GlobalId.
        ifc_class: IFC entity name.
        name: element Name.
        center: centre of the plate box, mm.
        normal: unit normal (thickness direction).
        u_dir: first in-plane unit direction.
        v_dir: second in-plane unit direction.
        half_u: half extent along ``u_dir``, mm.
        half_v: half extent along ``v_dir``, mm.
        thickness: plate thickness, mm.
        material: material name as found.
        geometry_source: ``extrusion`` or ``mesh``.
    """

    guid: str
    ifc_class: str
    name: str
    center: Vec3
    normal: Vec3
    u_dir: Vec3
    v_dir: Vec3
    half_u: float
    half_v: float
    thickness: float
    material: str = ""
    geometry_source: str = "extrusion"
    holes: tuple[tuple[Vec3, float], ...] = ()  # (centre on the mid-plane, diameter), mm
    texts: tuple[str, ...] = ()
    #: ``flat`` for a plate; a short open section read as a part (an angle cleat, a tee), by
    #: its profile type, or ``section`` for a body far from a flat box: not a plate to check
    shape: str = "flat"
    legs: tuple[PlateLeg, ...] = ()  # an angle's two legs (read from an L profile)
    root_radius: float | None = None  # an angle's, from its profile


@dataclass(frozen=True, slots=True, kw_only=True)
class Fastener:
    """A fastener element (bolt, nut, washer, weld, anchor...) reduced to its axis.

    Attributes:
        guid: IFC GlobalId.
        ifc_class: IFC entity name.
        name: element Name.
        kind: bolt, nut, washer, weld, anchor or other.
        center: centre of the body, mm.
        axis: unit axis direction (bolt shank direction).
        length: extent along the axis, mm.
        diameter: extent across the axis, mm (shank or head, whichever the body gives).
        geometry_source: ``extrusion``, ``mesh`` or ``placement`` (no body: axis from placement).
    """

    guid: str
    ifc_class: str
    name: str
    kind: FastenerKind
    center: Vec3
    axis: Vec3
    length: float
    diameter: float
    geometry_source: str = "extrusion"
    nominal_diameter: float | None = None  # from IfcMechanicalFastener or properties, mm
    nominal_length: float | None = None
    hole_diameter: float | None = None  # a hole-diameter property of it or its type, mm
    weld_throat: float | None = None  # a weld's throat a from its properties, mm
    texts: tuple[str, ...] = ()
    #: one element holding several bolts (a bolt group exported as one fastener): the centre
    #: of each shank; empty for a single bolt
    shanks: tuple[Vec3, ...] = ()


@dataclass(frozen=True, slots=True, kw_only=True)
class Link:
    """A relationship in the model that ties a part (plate, fastener) to members.

    Attributes:
        part: GlobalId of the plate or fastener.
        members: GlobalIds of the beams/columns it is related to.
        source: realizing (IfcRelConnectsWithRealizingElements), assembly
            (IfcElementAssembly aggregation) or connects (IfcRelConnectsElements).
    """

    part: str
    members: tuple[str, ...]
    source: LinkSource


@dataclass(frozen=True, slots=True, kw_only=True)
class GridAxis:
    """One grid line in plan, world mm."""

    tag: str
    family: str  # "U", "V" or "W"
    p0: tuple[float, float]
    p1: tuple[float, float]


@dataclass(frozen=True, slots=True, kw_only=True)
class Unreadable:
    """An element the reader had to skip, with the reason."""

    element: str
    ifc_class: str
    reason: str
    name: str = ""


@dataclass(frozen=True, slots=True, kw_only=True)
class ModelContents:
    """Everything the joint finder needs from one model, in mm.

    Attributes:
        path: the file path as given.
        schema: IFC schema identifier (``IFC4`` ...).
        length_unit_to_mm: millimetres per model length unit.
        length_unit_source: ``model`` or ``assumed`` (user override).
        sha256: hash of the file bytes.
        members: beams, columns and braces.
        plates: plates.
        fasteners: fastener elements.
        links: relationships from parts to members.
        grid_axes: grid lines in plan.
        counts: number of elements read per kind, for the summary.
        unreadable: elements skipped, with reasons.
        notes: messages about the model as a whole (e.g. ignored elements).
    """

    path: str
    schema: str
    length_unit_to_mm: float
    length_unit_source: str = "model"
    sha256: str = ""
    members: tuple[Member, ...] = ()
    plates: tuple[Plate, ...] = ()
    fasteners: tuple[Fastener, ...] = ()
    links: tuple[Link, ...] = ()
    grid_axes: tuple[GridAxis, ...] = ()
    counts: dict[str, int] = field(default_factory=dict)
    unreadable: tuple[Unreadable, ...] = ()
    notes: tuple[str, ...] = ()
    #: GlobalIds that several elements share -> their entity ids (kept apart, see
    #: ``ifcjoint.model.identity.element_key``)
    repeated_ids: dict[str, tuple[int, ...]] = field(default_factory=dict)
