"""Generate the demo steel frame: the invented "Kestrel Lane cycle workshop".

A two-storey workshop frame on a 3 x 2 bay grid (columns HEB 260; beams IPE 400 / IPE 360 /
IPE 300), with extended and flush end-plate joints, welded joints, fin plates on the column
webs, a secondary beam, a cantilever, a bolted splice, a ground tie at the column feet, base
plates with anchors, two incomplete joints and several deliberately mis-detailed ones.

Every fact the generator builds is also written to a sidecar JSON (``*.truth.json``): the
tests compare the scanner against it, never against the scanner's own earlier output.

Variants (all used by the tests): schema IFC2X3 / IFC4 / IFC4X3; length unit mm / m / in;
a plan rotation and offset applied through nested placements; relationships none /
assembly / realizing / connects / mixed; fastener class; profiles parametric / arbitrary
(polyline) / brep (faceted, no profile); bodies through IfcMappedItem.

Run ``python sample_models/generate.py`` to rewrite the bundled files. All names, numbers and
the project are invented for the demo. Section dimensions are EN 10365 values from memory.
"""

from __future__ import annotations

import argparse
import json
import math
import uuid
from dataclasses import dataclass, field
from pathlib import Path

import ifcopenshell
import ifcopenshell.api.aggregate
import ifcopenshell.api.context
import ifcopenshell.api.material
import ifcopenshell.api.owner
import ifcopenshell.api.pset
import ifcopenshell.api.root
import ifcopenshell.api.unit
import ifcopenshell.guid
import numpy as np

HERE = Path(__file__).resolve().parent
NAMESPACE = uuid.UUID("6a1f3c52-2b1e-4c8e-9a55-0d4c9e7f1b01")  # invented, for stable GlobalIds
FIXED_TIME = 1764633600  # 2025-12-02T00:00:00Z, so regenerated files are byte-stable

# Section dimensions h, b, tw, tf, r in mm (EN 10365, from memory).
SECTIONS = {
    "HEB 260": (260.0, 260.0, 10.0, 17.5, 24.0),
    "IPE 400": (400.0, 180.0, 8.6, 13.5, 21.0),
    "IPE 360": (360.0, 170.0, 8.0, 12.7, 18.0),
    "IPE 300": (300.0, 150.0, 7.1, 10.7, 15.0),
    "IPE 200": (200.0, 100.0, 5.6, 8.5, 12.0),
}

UNIT_MM = {"mm": 1.0, "m": 1000.0, "in": 25.4}


@dataclass
class Options:
    """What variant of the frame to write."""

    schema: str = "IFC4"
    unit: str = "mm"
    rotation_deg: float = 0.0
    offset: tuple[float, float] = (0.0, 0.0)
    relations: str = "mixed"  # none | assembly | realizing | connects | mixed
    fastener_class: str = "IfcMechanicalFastener"
    profiles: str = "parametric"  # parametric | arbitrary | brep
    mapped: bool = False
    nested_parts: bool = True  # plates and bolts placed relative to their beam
    bays_x: int = 3
    bays_y: int = 2
    storeys: int = 2
    demo_details: bool = True  # the hand-planned joint mix; False = uniform (benchmark)
    beams_to_axis: bool = False  # beam bodies drawn to the column centrelines (overlapping)
    split_columns: bool = False  # one column piece per storey, spliced 600 mm above floor
    anonymous_fasteners: bool = False  # bolts named only "Part n": recognised by shape
    grid_placed_columns: bool = False  # columns placed by IfcGridPlacement (IFC4 and later)
    bolt_data_in_pset: bool = False  # bolt size and class only in a property set
    haunch: bool = False  # one joint (level 1, line A, bay 2 start) gets a haunch
    plates_as_members: bool = False  # plates exported as flat IfcMember/IfcBeam bars
    bolt_groups: bool = False  # all bolts of a joint in one IfcMechanicalFastener
    stiffeners: bool = False  # column web stiffeners at the level-1 beam flanges of line A
    haunch_member: bool = False  # with haunch: the haunch is a short IPE 200 beam, not plates
    detail_parts: bool = True  # model plates and bolts at all
    hole_property: str = ""  # "" holes modelled | "instance" / "type": a HoleDiameter property
    minor_end_plates: bool = False  # beams along Y get flush end plates on the column webs


def gid(name: str) -> str:
    """A stable GlobalId from a readable name."""
    return ifcopenshell.guid.compress(uuid.uuid5(NAMESPACE, name).hex)


# --- joint specifications (mm, in the joint's own frame) --------------------------------


@dataclass
class JointSpec:
    """How one beam end is detailed.

    ``rows`` are bolt-row depths below the top face of the beam's top flange (negative above).
    ``plate_top`` / ``plate_bottom``: plate edges relative to the same datum.
    """

    kind: str  # extended_end_plate | flush_end_plate | welded | fin_plate | none
    first_guess: str  # what the scanner's first archetype guess should say
    tp: float = 20.0
    bp: float = 200.0
    plate_top: float = -100.0
    plate_bottom: float = 420.0
    rows: tuple[float, ...] = (-50.0, 60.0, 160.0, 340.0)
    gauge: float = 100.0
    bolt_d: float = 20.0
    bolt_len: float = 70.0
    with_plate: bool = True
    with_bolts: bool = True
    plate_gap: float = 0.0  # gap between plate and column face
    welds: bool = False
    defects: tuple[str, ...] = ()
    bolt_offsets: tuple[float, ...] | None = None  # lateral bolt positions, overrides gauge
    haunch: bool = False  # plates below the beam at the column: a haunch


#: Bolt rows of the demo's beam splice, below the beam's top (mm; two bolts 100 apart each).
SPLICE_ROWS = (60.0, 150.0, 290.0)


def extended(h: float, **kw) -> JointSpec:
    base = dict(kind="extended_end_plate", first_guess="end_plate", tp=20.0, bp=200.0,
                plate_top=-100.0, plate_bottom=h + 20.0,
                rows=(-50.0, 60.0, 160.0, h - 60.0))
    base.update(kw)
    return JointSpec(**base)


def flush(h: float, **kw) -> JointSpec:
    base = dict(kind="flush_end_plate", first_guess="end_plate", tp=15.0, bp=180.0,
                plate_top=-10.0, plate_bottom=h + 10.0, rows=(60.0, 150.0, h - 70.0))
    base.update(kw)
    return JointSpec(**base)


def welded(**kw) -> JointSpec:
    return JointSpec(kind="welded", first_guess="welded", with_plate=False, with_bolts=False,
                     **kw)


def fin(h: float) -> JointSpec:
    # 8 mm with M20: thin enough to rotate as a pinned joint (t_p <= 0.42 d in S355)
    return JointSpec(kind="fin_plate", first_guess="fin_plate", tp=8.0, bp=0.0,
                     plate_top=60.0, plate_bottom=h - 60.0,
                     rows=tuple(float(x) for x in np.linspace(90.0, h - 90.0, 3)),
                     bolt_d=20.0, bolt_len=50.0)


# --- geometry helpers --------------------------------------------------------------------


def frame_matrix(origin, x, z) -> np.ndarray:
    """4x4 matrix from an origin, a local X and a local Z direction."""
    z = np.asarray(z, float) / np.linalg.norm(z)
    x = np.asarray(x, float)
    x = x - x.dot(z) * z
    x /= np.linalg.norm(x)
    y = np.cross(z, x)
    m = np.eye(4)
    m[:3, 0], m[:3, 1], m[:3, 2], m[:3, 3] = x, y, z, origin
    return m


def i_outline(h: float, b: float, tw: float, tf: float) -> list[tuple[float, float]]:
    """Polygon of an I section without fillets, centred, counter-clockwise."""
    return [(-b / 2, -h / 2), (b / 2, -h / 2), (b / 2, -h / 2 + tf), (tw / 2, -h / 2 + tf),
            (tw / 2, h / 2 - tf), (b / 2, h / 2 - tf), (b / 2, h / 2), (-b / 2, h / 2),
            (-b / 2, h / 2 - tf), (-tw / 2, h / 2 - tf), (-tw / 2, -h / 2 + tf),
            (-b / 2, -h / 2 + tf)]


class Writer:
    """Thin wrapper that writes entities in the chosen unit."""

    def __init__(self, opt: Options) -> None:
        self.opt = opt
        self.k = 1.0 / UNIT_MM[opt.unit]  # model units per mm
        f = ifcopenshell.file(schema=opt.schema)
        self.f = f
        f.header.file_name.name = "kestrel-workshop.ifc"
        f.header.file_name.time_stamp = "2025-12-02T00:00:00"
        ifcopenshell.api.owner.add_application(
            f, application_developer=None, version="0.1", application_full_name="ifcjoint demo "
            "generator", application_identifier="ifcjoint-demo"
        ) if opt.schema == "IFC2X3" else None
        if opt.schema == "IFC2X3":
            person = ifcopenshell.api.owner.add_person(f, identification="demo",
                                                       family_name="Demo", given_name="Kestrel")
            org = ifcopenshell.api.owner.add_organisation(f, identification="KLW",
                                                          name="Kestrel Lane Works")
            ifcopenshell.api.owner.add_person_and_organisation(f, person=person,
                                                               organisation=org)
        self.project = self.root("IfcProject", "Kestrel Lane cycle workshop", "project")
        self.history = self.project.OwnerHistory
        if opt.unit == "in":
            length = ifcopenshell.api.unit.add_conversion_based_unit(f, name="inch")
        else:
            length = ifcopenshell.api.unit.add_si_unit(
                f, unit_type="LENGTHUNIT", prefix="MILLI" if opt.unit == "mm" else None)
        ifcopenshell.api.unit.assign_unit(f, units=[length])
        model = ifcopenshell.api.context.add_context(f, context_type="Model")
        self.body = ifcopenshell.api.context.add_context(
            f, context_type="Model", context_identifier="Body", target_view="MODEL_VIEW",
            parent=model)
        self.axis_ctx = ifcopenshell.api.context.add_context(
            f, context_type="Model", context_identifier="Axis", target_view="GRAPH_VIEW",
            parent=model)
        self.materials: dict[str, object] = {}
        self.contained: dict[int, list] = {}

    def root(self, cls: str, name: str, key: str, **attrs):
        e = ifcopenshell.api.root.create_entity(self.f, ifc_class=cls, name=name)
        e.GlobalId = gid(key)
        for a, v in attrs.items():
            setattr(e, a, v)
        return e

    def L(self, v: float) -> float:
        return float(v) * self.k

    def pt(self, xyz) -> object:
        return self.f.createIfcCartesianPoint([self.L(c) for c in xyz])

    def pt2(self, xy) -> object:
        return self.f.createIfcCartesianPoint([self.L(c) for c in xy])

    def dir(self, v) -> object:
        return self.f.createIfcDirection([float(c) for c in v])

    def a2p(self, m: np.ndarray) -> object:
        return self.f.createIfcAxis2Placement3D(self.pt(m[:3, 3]), self.dir(m[:3, 2]),
                                                self.dir(m[:3, 0]))

    def placement(self, m: np.ndarray, rel_to=None) -> object:
        return self.f.createIfcLocalPlacement(rel_to, self.a2p(m))

    def material(self, name: str):
        if name not in self.materials:
            kw = {} if self.opt.schema == "IFC2X3" else {"category": "steel"}
            self.materials[name] = ifcopenshell.api.material.add_material(self.f, name=name,
                                                                          **kw)
        return self.materials[name]

    # bodies
    def shape(self, items, rep_type: str):
        rep = self.f.createIfcShapeRepresentation(self.body, "Body", rep_type, items)
        return self.f.createIfcProductDefinitionShape(None, None, [rep])

    def i_profile(self, name: str):
        h, b, tw, tf, r = SECTIONS[name]
        pos = self.f.createIfcAxis2Placement2D(self.pt2((0, 0)), None)
        if self.opt.profiles == "arbitrary":
            pts = [self.pt2(p) for p in i_outline(h, b, tw, tf)]
            poly = self.f.createIfcPolyline(pts + [pts[0]])
            return self.f.createIfcArbitraryClosedProfileDef("AREA", name.replace(" ", ""), poly)
        return self.f.createIfcIShapeProfileDef("AREA", name, pos, self.L(b), self.L(h),
                                                self.L(tw), self.L(tf), self.L(r))

    def prism_brep(self, outline, depth: float, m: np.ndarray):
        """Faceted brep of a prism: outline (mm, in the frame's XY) extruded along Z."""
        pts = np.array(outline, float)
        bot = [m @ np.array([x, y, 0, 1.0]) for x, y in pts]
        top = [m @ np.array([x, y, depth, 1.0]) for x, y in pts]
        cp = [self.pt(p[:3]) for p in bot]
        ct = [self.pt(p[:3]) for p in top]
        faces = [self.f.createIfcFace([self.f.createIfcFaceOuterBound(
            self.f.createIfcPolyLoop(list(reversed(cp))), True)]),
            self.f.createIfcFace([self.f.createIfcFaceOuterBound(
                self.f.createIfcPolyLoop(ct), True)])]
        n = len(pts)
        for i in range(n):
            j = (i + 1) % n
            loop = self.f.createIfcPolyLoop([cp[i], cp[j], ct[j], ct[i]])
            faces.append(self.f.createIfcFace([self.f.createIfcFaceOuterBound(loop, True)]))
        return self.f.createIfcFacetedBrep(self.f.createIfcClosedShell(faces))

    def extrusion(self, profile, depth: float, m: np.ndarray):
        return self.f.createIfcExtrudedAreaSolid(profile, self.a2p(m), self.dir((0, 0, 1)),
                                                 self.L(depth))

    def maybe_mapped(self, items, rep_type: str):
        if not self.opt.mapped:
            return self.shape(items, rep_type)
        rep = self.f.createIfcShapeRepresentation(self.body, "Body", rep_type, items)
        origin = self.f.createIfcAxis2Placement3D(self.pt((0, 0, 0)), None, None)
        rmap = self.f.createIfcRepresentationMap(origin, rep)
        target = self.f.createIfcCartesianTransformationOperator3D(
            None, None, self.pt((0, 0, 0)), 1.0, None)
        mapped = self.f.createIfcMappedItem(rmap, target)
        outer = self.f.createIfcShapeRepresentation(self.body, "Body", "MappedRepresentation",
                                                    [mapped])
        return self.f.createIfcProductDefinitionShape(None, None, [outer])


# --- the frame ---------------------------------------------------------------------------


@dataclass
class Truth:
    joints: list[dict] = field(default_factory=list)
    other_beam_ends: list[dict] = field(default_factory=list)
    column_bases: list[dict] = field(default_factory=list)
    counts: dict = field(default_factory=dict)


class Frame:
    """Builds the workshop frame into a :class:`Writer`."""

    def __init__(self, opt: Options) -> None:
        self.opt = opt
        self.w = Writer(opt)
        self.truth = Truth()
        self.dx, self.dy = 6000.0, 5000.0
        self.levels = [4000.0, 7500.0][: opt.storeys] if opt.storeys <= 2 else [
            3600.0 * (i + 1) for i in range(opt.storeys)]
        self.col_section = "HEB 260"
        self.parts_by_beam: dict[str, list] = {}
        self.parts_by_column: dict[str, list] = {}
        self.counter = 0
        self.rel_index = 0
        self.upper_cols: dict = {}
        self.pending_others: list = []
        self.material_members: dict[str, list] = {}
        w = self.w
        f = w.f
        rot = math.radians(opt.rotation_deg)
        site = w.root("IfcSite", "Kestrel Lane site", "site")
        bldg = w.root("IfcBuilding", "Workshop", "building")
        site.ObjectPlacement = w.placement(np.eye(4))
        bm = frame_matrix((opt.offset[0], opt.offset[1], 0.0), (math.cos(rot), math.sin(rot), 0),
                          (0, 0, 1))
        bldg.ObjectPlacement = w.placement(bm, site.ObjectPlacement)
        ifcopenshell.api.aggregate.assign_object(f, products=[site], relating_object=w.project)
        ifcopenshell.api.aggregate.assign_object(f, products=[bldg], relating_object=site)
        self.storeys = []
        names = ["Ground floor", "First floor", "Roof"] + [f"Level {i}" for i in range(3, 99)]
        elevations = [0.0] + self.levels[:-1]
        for i, z in enumerate(elevations):
            st = w.root("IfcBuildingStorey", names[i], f"storey{i}")
            st.Elevation = w.L(z)
            st.ObjectPlacement = w.placement(frame_matrix((0, 0, z), (1, 0, 0), (0, 0, 1)),
                                             bldg.ObjectPlacement)
            self.storeys.append((st, z))
            w.contained[st.id()] = []
        ifcopenshell.api.aggregate.assign_object(f, products=[s for s, _ in self.storeys],
                                                 relating_object=bldg)
        self.grid()

    # storey of a height (beams at a level sit on the storey below their top)
    def storey_for(self, z: float):
        best = self.storeys[0]
        for st, ze in self.storeys:
            if z >= ze - 1:
                best = (st, ze)
        return best

    def contain(self, el, z: float):
        st, _ = self.storey_for(z)
        self.w.contained[st.id()].append(el)

    def grid(self):
        w, f = self.w, self.w.f
        g = w.root("IfcGrid", "Workshop grid", "grid")
        st0 = self.storeys[0][0]
        g.ObjectPlacement = w.placement(np.eye(4), st0.ObjectPlacement)
        ext = 1500.0
        u, v = [], []
        for i in range(self.opt.bays_x + 1):
            x = i * self.dx
            line = f.createIfcPolyline([w.pt2((x, -ext)), w.pt2((x, self.opt.bays_y * self.dy
                                                                   + ext))])
            u.append(f.createIfcGridAxis(str(i + 1), line, True))
        for j in range(self.opt.bays_y + 1):
            y = j * self.dy
            line = f.createIfcPolyline([w.pt2((-ext, y)), w.pt2((self.opt.bays_x * self.dx + ext,
                                                                   y))])
            v.append(f.createIfcGridAxis(chr(ord("A") + j), line, True))
        g.UAxes, g.VAxes = u, v
        self.grid_axes = (u, v)
        w.contained[st0.id()].append(g)

    def name(self, prefix: str) -> str:
        self.counter += 1
        return f"{prefix}-{self.counter:04d}"

    # members
    def column(self, i: int, j: int, z0: float, z1: float):
        w = self.w
        x, y = i * self.dx, j * self.dy
        tag = f"{chr(ord('A') + j)}{i + 1}"
        h, b, tw, tf, r = SECTIONS[self.col_section]
        col = w.root("IfcColumn", f"C {tag}", f"column/{tag}/{z0}",
                     ObjectType=self.col_section)
        st, ze = self.storey_for(z0)
        # Local X = -Y so that the profile's depth (its Y) runs along world X.
        m = frame_matrix((x, y, z0 - ze), (0, -1, 0), (0, 0, 1))
        if self.opt.grid_placed_columns:
            u, v = self.grid_axes
            vgi = w.f.createIfcVirtualGridIntersection([u[i], v[j]], [0.0, 0.0, w.L(z0)])
            col.ObjectPlacement = w.f.create_entity(
                "IfcGridPlacement", PlacementLocation=vgi, PlacementRefDirection=w.dir((0, -1, 0)))
        else:
            col.ObjectPlacement = w.placement(m, st.ObjectPlacement)
        self.member_body(col, self.col_section, z1 - z0, np.eye(4))
        self.contain(col, z0)
        self.assign_material(col, "S355J2")
        return col, np.array([x, y, z0]), np.array([x, y, z1])

    def assign_material(self, el, name: str):
        self.material_members.setdefault(name, []).append(el)

    def flush_materials(self):
        for name, els in self.material_members.items():
            ifcopenshell.api.material.assign_material(self.w.f, products=els,
                                                      type="IfcMaterial",
                                                      material=self.w.material(name))

    def member_body(self, el, section: str, length: float, pos: np.ndarray):
        """Body of a member: its local Z (after `pos`) is the member axis."""
        w = self.w
        h, b, tw, tf, r = SECTIONS[section]
        if self.opt.profiles == "brep":
            item = w.prism_brep(i_outline(h, b, tw, tf), length, pos)
            el.Representation = w.maybe_mapped([item], "Brep")
            if hasattr(el, "Name"):
                el.Description = section
        else:
            item = w.extrusion(w.i_profile(section), length, pos)
            el.Representation = w.maybe_mapped([item], "SweptSolid")

    def beam(self, key: str, section: str, p0, p1, ext=(0.0, 0.0), name=None):
        """A horizontal beam from p0 to p1 (centre points of its end faces, top-of-steel z).

        ``ext`` lengthens the body past p0 / p1 (a beam drawn to the column axis); the returned
        frame and length stay those of the physical beam between p0 and p1.
        """
        w = self.w
        p0, p1 = np.asarray(p0, float), np.asarray(p1, float)
        h = SECTIONS[section][0]
        el = w.root("IfcBeam", name or f"B {key}", f"beam/{key}", ObjectType=section)
        st, ze = self.storey_for(p0[2] - h)
        d = p1 - p0
        length = float(np.linalg.norm(d))
        # Placement at the top-of-steel start point, local X along the beam.
        m = frame_matrix((p0[0], p0[1], p0[2] - ze), d, (0, 0, 1))
        el.ObjectPlacement = w.placement(m, st.ObjectPlacement)
        # Body: extrude along local X; section centre h/2 below the placement.
        pos = frame_matrix((-ext[0], 0, -h / 2), (0, 1, 0), (1, 0, 0))
        self.member_body(el, section, length + ext[0] + ext[1], pos)
        self.contain(el, p0[2] - h)
        self.assign_material(el, "S355J2" if section != "IPE 200" else "S275JR")
        world = np.eye(4)
        world[:3, :3] = m[:3, :3]
        world[:3, 3] = p0
        return el, world, length

    # parts
    def plate(self, key: str, name: str, width: float, height: float, t: float,
              m_world: np.ndarray, parent, holes=(), rel_matrix=None):
        """Rectangular plate: centred on m_world's origin, thickness along its local Z."""
        w = self.w
        f = w.f
        if self.opt.plates_as_members:
            # a flat bar: rectangle t x width extruded along the plate's height, no holes
            cls = "IfcMember" if self.opt.schema != "IFC2X3" else "IfcBeam"
            el = w.root(cls, name, f"plate/{key}", ObjectType=f"PL{t:g}*{width:g}")
            prof = f.createIfcRectangleProfileDef(
                "AREA", f"PL{t:g}*{width:g}",
                f.createIfcAxis2Placement2D(w.pt2((0, 0)), None), w.L(t), w.L(width))
            pos = frame_matrix((0, -height / 2, 0), (0, 0, 1.0), (0, 1.0, 0))
            el.Representation = w.shape([w.extrusion(prof, height, pos)], "SweptSolid")
            self.place_part(el, m_world, parent)
            self.assign_material(el, "S355J2")
            return el
        el = w.root("IfcPlate", name, f"plate/{key}")
        if self.opt.hole_property:
            holes = ()  # the hole diameter is a property of the bolts instead
        pts = [w.pt2(p) for p in ((-width / 2, -height / 2), (width / 2, -height / 2),
                                   (width / 2, height / 2), (-width / 2, height / 2))]
        outer = f.createIfcPolyline(pts + [pts[0]])
        if holes:
            inner = [f.createIfcCircle(f.createIfcAxis2Placement2D(w.pt2(c), None), w.L(r))
                     for c, r in holes]
            prof = f.createIfcArbitraryProfileDefWithVoids("AREA", f"PL{t:g}", outer, inner)
        else:
            prof = f.createIfcArbitraryClosedProfileDef("AREA", f"PL{t:g}", outer)
        local = np.eye(4)
        local[2, 3] = -t / 2
        item = w.extrusion(prof, t, local)
        el.Representation = w.shape([item], "SweptSolid")
        self.place_part(el, m_world, parent)
        self.assign_material(el, "S355J2")
        return el

    def place_part(self, el, m_world: np.ndarray, parent):
        """Place a part relative to its parent member (nested) or to the storey."""
        w = self.w
        pel, pworld = parent
        z = m_world[2, 3]
        if self.opt.nested_parts and pel is not None:
            rel = np.linalg.inv(pworld) @ m_world
            el.ObjectPlacement = w.placement(rel, pel.ObjectPlacement)
        else:
            st, ze = self.storey_for(z)
            rel = m_world.copy()
            rel[2, 3] -= ze
            el.ObjectPlacement = w.placement(rel, st.ObjectPlacement)
        self.contain(el, z)

    def bolt(self, key: str, d: float, length: float, m_world: np.ndarray, parent,
             grade: str = "8.8"):
        """Bolt: head at m_world's origin, shank along its local Z."""
        w, f = self.w, self.w.f
        cls = self.opt.fastener_class
        label = f"M{d:g}x{length:g} {grade}"
        name = {"IfcMechanicalFastener": f"BOLT {label}",
                "IfcFastener": f"Bolt {label}",
                "IfcDiscreteAccessory": f"bolt {label}",
                "IfcBuildingElementProxy": f"Bolt assembly {label}"}[cls]
        if self.opt.anonymous_fasteners or self.opt.bolt_data_in_pset:
            name = self.name("Part")
        el = w.root(cls, name, f"bolt/{key}")
        if cls == "IfcMechanicalFastener" and not self.opt.bolt_data_in_pset:
            el.NominalDiameter = w.L(d)
            el.NominalLength = w.L(length)
            if self.opt.schema != "IFC2X3":
                el.PredefinedType = "BOLT"
        shank = f.createIfcCircleProfileDef("AREA", None,
                                            f.createIfcAxis2Placement2D(w.pt2((0, 0)), None),
                                            w.L(d / 2))
        head = f.createIfcCircleProfileDef("AREA", None,
                                           f.createIfcAxis2Placement2D(w.pt2((0, 0)), None),
                                           w.L(0.9 * d))
        hm = np.eye(4)
        hm[2, 3] = -0.65 * d
        items = [w.extrusion(shank, length, np.eye(4)), w.extrusion(head, 0.65 * d, hm)]
        el.Representation = w.shape(items, "SweptSolid")
        self.place_part(el, m_world, parent)
        if self.opt.hole_property:
            self.hole_property(el, d)
        if self.opt.bolt_data_in_pset:
            pset = ifcopenshell.api.pset.add_pset(w.f, product=el, name="KLW_BoltData")
            ifcopenshell.api.pset.edit_pset(w.f, pset=pset, properties={
                "Diameter": w.L(d), "Length": w.L(length), "Grade": grade})
            pset.GlobalId = gid(f"pset/{el.GlobalId}")
            for rel in w.f.get_inverse(pset):
                if rel.is_a("IfcRelDefinesByProperties"):
                    rel.GlobalId = gid(f"rdp/{el.GlobalId}")
        return el

    def hole_property(self, el, d: float) -> None:
        """A normal hole (d + 2, EN 1090-2) as a HoleDiameter property of the bolt or its type."""
        w, f = self.w, self.w.f
        value = f.create_entity("IfcPositiveLengthMeasure", w.L(d + 2.0))

        def pset(key: str):
            prop = f.createIfcPropertySingleValue("HoleDiameter", None, value, None)
            return f.create_entity("IfcPropertySet", GlobalId=gid(f"holepset/{key}"),
                                   OwnerHistory=w.history, Name="KLW_Hole",
                                   HasProperties=[prop])

        if self.opt.hole_property == "instance":
            f.create_entity("IfcRelDefinesByProperties", GlobalId=gid(f"holerel/{el.GlobalId}"),
                            OwnerHistory=w.history, RelatedObjects=[el],
                            RelatingPropertyDefinition=pset(el.GlobalId))
            return
        types = self.__dict__.setdefault("_fastener_types", {})
        t = types.get(d)
        if t is None:
            cls = ("IfcMechanicalFastenerType" if self.opt.fastener_class == "IfcMechanicalFastener"
                   else "IfcFastenerType")
            if self.opt.schema == "IFC2X3":
                cls = "IfcMechanicalFastenerType"
            t = types[d] = f.create_entity(
                cls, GlobalId=gid(f"ftype/{d:g}"), OwnerHistory=w.history, Name=f"M{d:g} bolt",
                HasPropertySets=[pset(f"type/{d:g}")])
        f.create_entity("IfcRelDefinesByType", GlobalId=gid(f"typerel/{el.GlobalId}"),
                        OwnerHistory=w.history, RelatedObjects=[el], RelatingType=t)

    def bolts_at(self, mats, d: float, length: float, parent) -> list:
        """Bolts at the given head frames: one element each, or one group element."""
        if not self.opt.bolt_groups or len(mats) < 2:
            return [self.bolt(k, d, length, m, parent) for k, m in mats]
        w, f = self.w, self.w.f
        key0, m0 = mats[0]
        el = w.root("IfcMechanicalFastener", f"BOLT GROUP M{d:g}x{length:g} 8.8 ({len(mats)})",
                    f"boltgroup/{key0}")
        if self.opt.schema != "IFC2X3":
            el.PredefinedType = "BOLT"
        el.NominalDiameter = w.L(d)
        el.NominalLength = w.L(length)
        items = []
        inv0 = np.linalg.inv(m0)
        for _, m in mats:
            local = inv0 @ m
            shank = f.createIfcCircleProfileDef(
                "AREA", None, f.createIfcAxis2Placement2D(w.pt2((0, 0)), None), w.L(d / 2))
            head = f.createIfcCircleProfileDef(
                "AREA", None, f.createIfcAxis2Placement2D(w.pt2((0, 0)), None), w.L(0.9 * d))
            hm = local.copy()
            hm[:3, 3] = local[:3, 3] - local[:3, 2] * 0.65 * d
            items += [w.extrusion(shank, length, local), w.extrusion(head, 0.65 * d, hm)]
        el.Representation = w.shape(items, "SweptSolid")
        self.place_part(el, m0, parent)
        return [el]

    def weld(self, key: str, length: float, a: float, m_world: np.ndarray, parent):
        """Fillet weld as a small triangular prism along m_world's local Z."""
        w, f = self.w, self.w.f
        cls = "IfcFastener" if self.opt.schema != "IFC2X3" else "IfcFastener"
        el = w.root(cls, f"Fillet weld a{a:g}", f"weld/{key}")
        if self.opt.schema != "IFC2X3":
            el.PredefinedType = "WELD"
        s = a * math.sqrt(2)
        pts = [w.pt2(p) for p in ((0, 0), (s, 0), (0, s))]
        prof = f.createIfcArbitraryClosedProfileDef("AREA", None,
                                                    f.createIfcPolyline(pts + [pts[0]]))
        local = np.eye(4)
        local[2, 3] = -length / 2
        el.Representation = w.shape([w.extrusion(prof, length, local)], "SweptSolid")
        self.place_part(el, m_world, parent)
        return el

    # relationships
    def relate(self, style: str, beam, column, parts: list, plates_on_column: list):
        w, f = self.w, self.w.f
        if not parts and not plates_on_column:
            return
        if style == "realizing":
            r = f.createIfcRelConnectsWithRealizingElements(
                gid(f"rwre/{beam.GlobalId}/{column.GlobalId}/{self.rel_index}"), w.history,
                None,
                None, None, column, beam, parts + plates_on_column, None)
            self.rel_index += 1
            del r
        elif style == "connects":
            for p in parts + plates_on_column:
                target = column if p in plates_on_column else beam
                f.createIfcRelConnectsElements(gid(f"rce/{p.GlobalId}"), w.history, None,
                                               None, None, p, target)
        elif style == "assembly":
            self.parts_by_beam.setdefault(beam.GlobalId, [beam])
            self.parts_by_beam[beam.GlobalId].extend(
                p for p in parts if p.is_a("IfcPlate") and p not in self.parts_by_beam[
                    beam.GlobalId])
            self.parts_by_column.setdefault(column.GlobalId, [column])
            self.parts_by_column[column.GlobalId].extend(plates_on_column)

    def style_for(self, n: int) -> str:
        s = self.opt.relations
        if s == "mixed":
            return ("none", "assembly", "realizing", "connects")[n % 4]
        return s

    # a joint at a beam end
    def joint(self, spec: JointSpec, beam_info, end: str, column, col_pts, axis: str,
              section: str, top_z: float, key: str):
        """Build the parts of one beam-to-column joint and record its truth."""
        beam, bworld, blen = beam_info
        h, b, tw, tf, r = SECTIONS[section]
        x_axis = bworld[:3, 0]  # along the beam, start -> end
        t = x_axis if end == "end" else -x_axis  # pointing into the column
        lat = np.cross((0, 0, 1.0), t)  # lateral, horizontal
        end_pt = bworld[:3, 3] + (x_axis * blen if end == "end" else 0)
        parts, col_plates, plates, bolts, welds = [], [], [], [], []
        opt = self.opt
        if opt.detail_parts and spec.kind in ("extended_end_plate", "flush_end_plate"):
            hp = spec.plate_bottom - spec.plate_top
            zc = top_z - (spec.plate_top + spec.plate_bottom) / 2
            c = end_pt + t * (spec.tp / 2)
            c = np.array([c[0], c[1], zc])
            # plate frame: X lateral, Y up, Z along t (thickness)
            m = frame_matrix(c, lat, t)
            offs = spec.bolt_offsets or (-spec.gauge / 2, spec.gauge / 2)
            d0 = spec.bolt_d + 2
            # hole centres in plate coordinates: (lateral, vertical relative to plate centre)
            holes = [((o, (top_z - row) - zc), d0 / 2) for row in spec.rows for o in offs]
            if spec.with_plate:
                pl = self.plate(key + "/ep", self.name("EP"), spec.bp, hp, spec.tp, m,
                                (beam, bworld), holes=holes)
                parts.append(pl)
                plates.append(pl.GlobalId)
            if spec.haunch and opt.haunch_member:
                # the haunch as a short beam of its own under the beam end
                p0 = end_pt.copy()
                p1 = end_pt - t * 600.0
                hinfo = self.beam(key + "/haunch", "IPE 200", (p0[0], p0[1], top_z - h),
                                  (p1[0], p1[1], top_z - h), name="Haunch " + key)
                self.pending_others.append((hinfo, "start", "haunch", beam))
                self.pending_others.append((hinfo, "end", "free_end", None))
            elif spec.haunch:
                # haunch web (beside nothing: below the beam) and its bottom flange
                hw = frame_matrix(np.array([*(end_pt - t * 250.0)[:2], top_z - h - 125.0]), t,
                                  lat)
                web = self.plate(key + "/haunch-web", self.name("HW"), 500.0, 250.0, 10.0, hw,
                                 (beam, bworld))
                hf = frame_matrix(np.array([*(end_pt - t * 250.0)[:2], top_z - h - 257.0]), t,
                                  (0, 0, 1.0))
                fl = self.plate(key + "/haunch-flange", self.name("HF"), 500.0, b, 14.0, hf,
                                (beam, bworld))
                parts += [web, fl]
                plates += [web.GlobalId, fl.GlobalId]
            if spec.with_bolts:
                mats = []
                for row in spec.rows:
                    for o in offs:
                        head = end_pt + lat * o
                        head = np.array([head[0], head[1], top_z - row])
                        # head on the beam side of the plate, shank towards the column
                        mats.append((f"{key}/{row}/{o}", frame_matrix(head, lat, t)))
                for bl in self.bolts_at(mats, spec.bolt_d, spec.bolt_len, (beam, bworld)):
                    parts.append(bl)
                    bolts.append(bl.GlobalId)
        elif opt.detail_parts and spec.kind == "fin_plate":
            # Fin plate welded to the column web, beam web bolted to it; beam end stops 10 mm
            # short of the flange tips.
            hp = spec.plate_bottom - spec.plate_top
            zc = top_z - (spec.plate_top + spec.plate_bottom) / 2
            col_w = SECTIONS[self.col_section][1]
            lp = col_w / 2 - SECTIONS[self.col_section][2] / 2 + 100.0  # web face to tip+100
            face_pt = end_pt + t * 10.0  # flange-tip plane
            web_face = face_pt + t * (col_w / 2 - SECTIONS[self.col_section][2] / 2)
            c = web_face - t * lp / 2 + lat * (tw / 2 + spec.tp / 2)
            c = np.array([c[0], c[1], zc])
            m = frame_matrix(c, t, lat)  # thickness along lat
            holes = [((-lp / 2 + 50.0, (top_z - row) - zc), 11.0) for row in spec.rows]
            pl = self.plate(key + "/fin", self.name("FP"), lp, hp, spec.tp, m, (None, None),
                            holes=holes)
            col_plates.append(pl)
            plates.append(pl.GlobalId)
            mats = []
            for row in spec.rows:
                p = end_pt - t * 40.0 + lat * (tw / 2 + spec.tp + 5)
                head = np.array([p[0], p[1], top_z - row])
                mats.append((f"{key}/fin/{row}", frame_matrix(head, t, -lat)))
            for bl in self.bolts_at(mats, spec.bolt_d, spec.bolt_len, (beam, bworld)):
                parts.append(bl)
                bolts.append(bl.GlobalId)
        elif opt.detail_parts and spec.kind == "welded" and spec.welds:
            for side, zz in (("top", top_z), ("bottom", top_z - h)):
                p = end_pt + t * 0.0
                mw = frame_matrix(np.array([p[0], p[1], zz]), t, lat)
                wl = self.weld(f"{key}/{side}", b, 10.0, mw, (beam, bworld))  # full strength
                parts.append(wl)
                welds.append(wl.GlobalId)
        style = self.style_for(len(self.truth.joints))
        self.relate(style, beam, column, parts, col_plates)
        rec = {
            "beam": beam.GlobalId,
            "beam_end": end,
            "end_point_mm": [float(v) for v in end_pt],
            "column": column.GlobalId,
            "axis": axis,
            "kind": spec.kind,
            "first_guess": ("unknown" if (self.opt.beams_to_axis and spec.kind == "welded"
                                          and axis == "major") else spec.first_guess),
            "plates": sorted(plates),
            "bolts": sorted(bolts),
            "welds": sorted(welds),
            "relations": style,
            "defects": list(spec.defects),
            "archetype": self.expected_archetype(spec, axis),
            "plate": ({"tp": spec.tp, "bp": spec.bp, "top_from_beam_top": spec.plate_top,
                       "bottom_from_beam_top": spec.plate_bottom}
                      if plates and spec.kind.endswith("end_plate") else None),
            "rows_from_beam_top": (list(spec.rows) if bolts and spec.kind.endswith("end_plate")
                                   else []),
            "bolt_d": spec.bolt_d if bolts else None,
            "key": key,
            "level_z": float(top_z),
            "approach": [float(v) for v in t],
            "partner": None,
        }
        self.truth.joints.append(rec)
        return rec

    def expected_archetype(self, spec: JointSpec, axis: str) -> str:
        """The archetype a person reading the model would give this joint."""
        if spec.haunch:  # read whole; a member haunch smaller than the beam: not checked
            return "haunched_end_plate"
        if spec.kind in ("extended_end_plate", "flush_end_plate"):
            if not spec.with_plate or not spec.with_bolts:  # a gap keeps the kind
                return "incomplete"
            rows_out = any(r < 0 for r in spec.rows)
            return "extended_end_plate" if rows_out else "flush_end_plate"
        if spec.kind == "welded":
            return "undetailed" if (self.opt.beams_to_axis and axis == "major") else "welded"
        if spec.kind == "fin_plate":
            return "fin_plate" if self.opt.detail_parts else "undetailed"
        return "undetailed"

    def other_end(self, beam_info, end: str, kind: str, other=None):
        beam, bworld, blen = beam_info
        x_axis = bworld[:3, 0]
        end_pt = bworld[:3, 3] + (x_axis * blen if end == "end" else 0)
        self.truth.other_beam_ends.append({
            "beam": beam.GlobalId, "beam_end": end, "kind": kind,
            "other": other.GlobalId if other is not None else None,
            "end_point_mm": [float(v) for v in end_pt]})

    def build(self) -> None:
        opt = self.opt
        hc = SECTIONS[self.col_section][0]
        bc = SECTIONS[self.col_section][1]
        top = self.levels[-1]
        cols = {}
        for i in range(opt.bays_x + 1):
            for j in range(opt.bays_y + 1):
                if opt.split_columns and len(self.levels) > 1:
                    cut = self.levels[0] + 600.0
                    lower = self.column(i, j, 0.0, cut)
                    upper = self.column(i, j, cut, top)
                    cols[(i, j)] = lower
                    self.upper_cols[(i, j)] = upper
                else:
                    cols[(i, j)] = self.column(i, j, 0.0, top)
        if opt.detail_parts:
            self.column_bases(cols)
        plan = self.plan()
        # Main beams along X meet column flanges (major axis).
        for li, z in enumerate(self.levels):
            section = "IPE 400" if li == 0 else "IPE 360"
            h = SECTIONS[section][0]
            for j in range(opt.bays_y + 1):
                for i in range(opt.bays_x):
                    key = f"X/{li}/{j}/{i}"
                    specs = plan.get(key, (extended(h), extended(h)))
                    if specs == "splice":
                        self.spliced_beam(key, self.upper_cols or cols, i, j, z, section)
                        continue
                    s_start, s_end = specs
                    x0 = i * self.dx + hc / 2 + (s_start.tp + s_start.plate_gap
                                                  if s_start.with_plate and s_start.kind
                                                  .endswith("end_plate") else 0.0)
                    x1 = (i + 1) * self.dx - hc / 2 - (s_end.tp + s_end.plate_gap
                                                       if s_end.with_plate and s_end.kind
                                                       .endswith("end_plate") else 0.0)
                    y = j * self.dy
                    ext = ((x0 - i * self.dx, (i + 1) * self.dx - x1) if opt.beams_to_axis
                           else (0.0, 0.0))
                    info = self.beam(key, section, (x0, y, z), (x1, y, z), ext=ext)
                    cset = self.upper_cols if (li > 0 and self.upper_cols) else cols
                    c0, c1 = cset[(i, j)][0], cset[(i + 1, j)][0]
                    self.joint(s_start, info, "start", c0, None, "major", section, z,
                               key + "/s")
                    self.joint(s_end, info, "end", c1, None, "major", section, z, key + "/e")
        # Beams along Y meet column webs (minor axis), first level only, fin plates.
        y_levels = [self.levels[0]] if opt.demo_details else self.levels
        for li, z in enumerate(y_levels if opt.bays_y else []):
            section = "IPE 300"
            h = SECTIONS[section][0]
            cset = self.upper_cols if (li > 0 and self.upper_cols) else cols
            for i in range(opt.bays_x + 1):
                for j in range(opt.bays_y):
                    key = f"Y/{li}/{i}/{j}"
                    y0 = j * self.dy + bc / 2 + 10.0
                    y1 = (j + 1) * self.dy - bc / 2 - 10.0
                    spec = fin(h) if opt.detail_parts else welded()
                    if opt.detail_parts and opt.minor_end_plates:
                        # flush plates against the column web, between its flanges
                        spec = flush(h, bp=150.0, gauge=90.0, tp=15.0, bolt_len=55.0)
                        tw_c = SECTIONS[self.col_section][2]
                        y0 = j * self.dy + tw_c / 2 + spec.tp
                        y1 = (j + 1) * self.dy - tw_c / 2 - spec.tp
                    x = i * self.dx
                    info = self.beam(key, section, (x, y0, z), (x, y1, z))
                    if not opt.detail_parts:
                        spec = JointSpec(kind="none", first_guess="incomplete",
                                         with_plate=False, with_bolts=False)
                    self.joint(spec, info, "start", cset[(i, j)][0], None, "minor", section,
                               z, key + "/s")
                    self.joint(spec, info, "end", cset[(i, j + 1)][0], None, "minor", section,
                               z, key + "/e")
        if opt.demo_details:
            self.extras(cols)
        if opt.stiffeners:
            self.add_stiffeners(cols)
        for info, end, kind, other in self.pending_others:
            self.other_end(info, end, kind, other)
        self.pair_partners()
        self.finish_relations()
        self.flush_materials()

    def add_stiffeners(self, cols):
        """Pairs of transverse web stiffeners at the level-1 beam flanges on grid line A."""
        h, b, tw, tf, r = SECTIONS[self.col_section]
        hb, _, _, tfb, _ = SECTIONS["IPE 400"]
        z_top = self.levels[0]
        for i in range(self.opt.bays_x + 1):
            col, p0, _ = cols[(i, 0)]
            found = []
            for zc in (z_top - tfb / 2, z_top - hb + tfb / 2):
                for side in (-1, 1):
                    c = np.array([p0[0], p0[1] + side * (tw / 2 + (b / 2 - tw / 2) / 2), zc])
                    m = frame_matrix(c, (1, 0, 0), (0, 0, 1))
                    st = self.plate(f"stiff/{i}/{zc}/{side}", self.name("ST"), h - 2 * tf,
                                    b / 2 - tw / 2 - 5, tfb, m, (None, None))
                    found.append(st.GlobalId)
            # A plate inside the column serves every joint at that column and level (the
            # minor-axis beam there too).
            for j in self.truth.joints:
                if j["column"] == col.GlobalId and j["level_z"] == z_top:
                    j["plates"] = sorted(j["plates"] + found)
                    j["stiffened"] = True

    def pair_partners(self):
        """Joints on opposite faces of one column at one level are double-sided partners."""
        js = self.truth.joints
        for a in js:
            for b in js:
                if a is b or a["column"] != b["column"] or a["axis"] != b["axis"]:
                    continue
                if a["level_z"] != b["level_z"]:
                    continue
                if np.dot(a["approach"], b["approach"]) < -0.99:
                    a["partner"] = {"beam": b["beam"], "beam_end": b["beam_end"]}

    def plan(self) -> dict:
        """The hand-planned joint mix of the demo (keys: X/level/line/bay)."""
        if not self.opt.demo_details:
            if self.opt.detail_parts:
                return {}
            w = welded()
            return {f"X/{li}/{j}/{i}": (w, w) for li in range(len(self.levels))
                    for j in range(self.opt.bays_y + 1) for i in range(self.opt.bays_x)}
        h1, h2 = 400.0, 360.0
        extra = {}
        if self.opt.haunch:
            extra["X/0/0/1"] = (extended(h1, haunch=True, plate_bottom=h1 + 270.0,
                                         rows=(-50.0, 60.0, 160.0, 340.0, 480.0, 620.0)),
                                extended(h1))
        return extra | {
            # level 1, line A: extended end plates (default)
            # level 1, line B: flush end plates
            "X/0/1/0": (flush(h1), flush(h1)),
            "X/0/1/1": (flush(h1), flush(h1)),
            "X/0/1/2": (flush(h1), flush(h1)),
            # level 1, line C: extended plates with planted detailing defects, two incomplete
            "X/0/2/0": (extended(h1, bolt_offsets=(-85.0, 85.0), defects=("edge_distance",)),
                        extended(h1, rows=(-50.0, 60.0, 95.0, 200.0, 340.0),
                                 defects=("pitch",))),
            "X/0/2/1": (extended(h1, bp=300.0, bolt_offsets=(-50.0, 50.0),
                                 defects=("plate_wider_than_column_flange",)),
                        extended(h1, bolt_len=30.0, defects=("bolt_too_short",))),
            "X/0/2/2": (extended(h1, with_bolts=False, first_guess="incomplete",
                                 defects=("plate_without_bolts",)),
                        extended(h1, with_plate=False, first_guess="incomplete",
                                 defects=("bolts_without_plate",))),
            # level 2, line A: welded, welds modelled on the first bay
            "X/1/0/0": (welded(welds=True), welded(welds=True)),
            "X/1/0/1": (welded(), welded()),
            "X/1/0/2": (welded(), welded()),
            # level 2, line B: extended at the top only (default extended), one plate short
            # of the column by 30 mm
            "X/1/1/1": (extended(h2, plate_gap=30.0, defects=("gap_to_column",)),
                        extended(h2)),
            # level 2, line C
            "X/1/2/0": (flush(h2), flush(h2)),
            "X/1/2/1": (flush(h2), flush(h2)),
            "X/1/2/2": "splice",
        }

    def spliced_beam(self, key, cols, i, j, z, section):
        hc = SECTIONS[self.col_section][0]
        h = SECTIONS[section][0]
        y = j * self.dy
        xa = i * self.dx + hc / 2
        xb = (i + 1) * self.dx - hc / 2
        xm = (xa + xb) / 2
        sp = flush(h, tp=15.0)
        ex = extended(h)
        a = self.beam(key + "/a", section, (xa + sp.tp, y, z), (xm - 10.0, y, z))
        b = self.beam(key + "/b", section, (xm + 10.0, y, z), (xb - ex.tp, y, z))
        self.joint(sp, a, "start", cols[(i, j)][0], None, "major", section, z, key + "/a/s")
        self.other_end(a, "end", "splice", b[0])
        self.other_end(b, "start", "splice", a[0])
        self.joint(ex, b, "end", cols[(i + 1, j)][0], None, "major", section, z, key + "/b/e")
        # splice end plates (one on each piece) bolted together: a joint of its own, a's end
        plates = []
        for nm, info, end in (("a", a, "end"), ("b", b, "start")):
            beam, bw, bl = info
            xa_ = bw[:3, 0]
            e = bw[:3, 3] + (xa_ * bl if end == "end" else 0)
            t = xa_ if end == "end" else -xa_
            c = e + t * 5.0
            m = frame_matrix(np.array([c[0], c[1], z - h / 2]), np.cross((0, 0, 1.0), t), t)
            holes = [((o, h / 2 - row), 11.0) for row in SPLICE_ROWS for o in (-50.0, 50.0)]
            plates.append(self.plate(f"{key}/splice/{nm}", self.name("SP"), 180.0, h + 20,
                                     10.0, m, (beam, bw), holes=holes))
        beam, bw, bl = a
        xa_ = bw[:3, 0]
        e = bw[:3, 3] + xa_ * bl  # a's end: the bolt heads on a's plate, nuts on b's
        lat = np.cross((0, 0, 1.0), xa_)
        mats = [(f"{key}/splice/{row}/{o}",
                 frame_matrix(np.array([*(e + lat * o)[:2], z - row]), lat, xa_))
                for row in SPLICE_ROWS for o in (-50.0, 50.0)]
        bolts = self.bolts_at(mats, 20.0, 55.0, (beam, bw))
        style = self.style_for(len(self.truth.joints))
        if style == "assembly":
            self.parts_by_beam.setdefault(a[0].GlobalId, [a[0]]).append(plates[0])
            self.parts_by_beam.setdefault(b[0].GlobalId, [b[0]]).append(plates[1])
        else:
            self.relate(style, a[0], b[0], [*bolts, plates[0]], [plates[1]])
        # the joint is the end of the beam whose midpoint comes first by x, y, z (the
        # finder's rule): a's, the piece on the lower x
        first, second = (a[0].GlobalId, "end", a), (b[0].GlobalId, "start", b)
        fb, fw, fl = first[2]
        e = fw[:3, 3] + (fw[:3, 0] * fl if first[1] == "end" else 0)
        self.truth.joints.append({
            "beam": first[0], "beam_end": first[1], "end_point_mm": [float(v) for v in e],
            "column": second[0], "support": "splice", "axis": "major", "kind": "splice",
            "first_guess": "end_plate_splice", "archetype": "end_plate_splice",
            "plates": sorted(p.GlobalId for p in plates),
            "bolts": sorted(x.GlobalId for x in bolts), "welds": [], "relations": style,
            "defects": [], "plate": None, "rows_from_beam_top": [], "bolt_d": 20.0,
            "key": key + "/splice", "level_z": float(z),
            "approach": [float(v) for v in (fw[:3, 0] if first[1] == "end" else -fw[:3, 0])],
            "partner": None,
        })

    def extras(self, cols):
        """Secondary beam, cantilever and ground tie."""
        z = self.levels[0]
        # Secondary beam IPE 200 along Y at x = 3000 from line A beam to line B beam.
        hA = 400.0
        tw_main = SECTIONS["IPE 400"][2]
        x = 3000.0
        y0 = 0 + tw_main / 2 + 10.0
        y1 = self.dy - tw_main / 2 - 10.0
        main_a = next(j for j in self.truth.joints if j["key"] == "X/0/0/0/s")
        main_b = next(j for j in self.truth.joints if j["key"] == "X/0/1/0/s")
        sec = self.beam("secondary/A-B/1-2", "IPE 200", (x, y0, z - 50.0), (x, y1, z - 50.0),
                        name="SB A-B/1-2")
        f = self.w.f
        a_el = f.by_guid(main_a["beam"])
        b_el = f.by_guid(main_b["beam"])
        # fin plates on the main beams' webs: beam-to-beam joints (also beam_to_beam ends)
        for end, main, main_el in (("start", main_a, a_el), ("end", main_b, b_el)):
            self.secondary_joint(sec, end, main_el, main["level_z"], f"secondary/{end}")
            self.other_end(sec, end, "beam_to_beam", a_el if end == "start" else b_el)
        del hA
        # Cantilever canopy beam IPE 200 off column C4 (last line, last column), along +X.
        i, j = self.opt.bays_x, self.opt.bays_y
        zc = self.levels[-1]
        hc = SECTIONS[self.col_section][0]
        spec = extended(200.0, rows=(-40.0, 50.0, 150.0), bp=160.0, gauge=100.0, tp=15.0,
                        plate_bottom=215.0, plate_top=-80.0)
        x0 = i * self.dx + hc / 2 + spec.tp
        info = self.beam("cantilever", "IPE 200", (x0, j * self.dy, zc),
                         (x0 + 1500.0, j * self.dy, zc), name="Canopy cantilever")
        self.joint(spec, info, "start", (self.upper_cols or cols)[(i, j)][0], None, "major",
                   "IPE 200", zc,
                   "cantilever/s")
        self.other_end(info, "end", "free_end")
        # Ground tie IPE 200 between A1 and A2 at the column feet (top of steel at +200).
        tie = self.beam("tie/A/1-2", "IPE 200", (hc / 2, 0.0, 200.0),
                        (self.dx - hc / 2, 0.0, 200.0), name="Ground tie A/1-2")
        self.other_end(tie, "start", "column_base", cols[(0, 0)][0])
        self.other_end(tie, "end", "column_base", cols[(1, 0)][0])

    def secondary_joint(self, sec_info, end: str, main_el, main_top: float, key: str):
        """A fin plate welded to a main beam's web, the secondary beam's web bolted to it.

        Secondary IPE 200 (top 50 mm below the main beam's), 10 mm off the main web; plate
        8 x 130 x 90 from 35 to 165 mm below the secondary's top, two M20 8.8 bolts 70 and
        130 mm down, one line 50 mm from the main web (40 from the beam end).
        """
        beam, bworld, blen = sec_info
        h, b, tw, tf, r = SECTIONS["IPE 200"]
        x_axis = bworld[:3, 0]
        t = x_axis if end == "end" else -x_axis  # into the main beam
        lat = np.cross((0, 0, 1.0), t)
        end_pt = bworld[:3, 3] + (x_axis * blen if end == "end" else 0)
        top_z = float(end_pt[2])
        tp, lp, hp, rows = 8.0, 90.0, 130.0, (70.0, 130.0)
        web_face = end_pt + t * 10.0
        c = web_face - t * lp / 2 + lat * (tw / 2 + tp / 2)
        zc = top_z - (35.0 + 165.0) / 2
        m = frame_matrix(np.array([c[0], c[1], zc]), t, lat)
        holes = [((lp / 2 - 50.0, (top_z - row) - zc), 11.0) for row in rows]
        pl = self.plate(key + "/fin", self.name("FP"), lp, hp, tp, m, (None, None), holes=holes)
        mats = []
        for row in rows:
            p = end_pt - t * 40.0 + lat * (tw / 2 + tp + 5)
            mats.append((f"{key}/{row}", frame_matrix(np.array([p[0], p[1], top_z - row]), t,
                                                      -lat)))
        bolts = self.bolts_at(mats, 20.0, 45.0, (beam, bworld))
        style = self.style_for(len(self.truth.joints))
        if style == "assembly":  # the fin plate joins the main beam's own assembly
            self.parts_by_beam.setdefault(main_el.GlobalId, [main_el]).append(pl)
        else:
            self.relate(style, beam, main_el, list(bolts), [pl])
        self.truth.joints.append({
            "beam": beam.GlobalId, "beam_end": end, "end_point_mm": [float(v) for v in end_pt],
            "column": main_el.GlobalId, "support": "beam", "axis": "minor", "kind": "fin_plate",
            "first_guess": "beam_to_beam_fin_plate", "archetype": "beam_to_beam_fin_plate",
            "plates": [pl.GlobalId], "bolts": sorted(x.GlobalId for x in bolts), "welds": [],
            "relations": style, "defects": [], "plate": None, "rows_from_beam_top": [],
            "bolt_d": 20.0, "key": key, "level_z": float(main_top),
            "approach": [float(v) for v in t],
            "partner": None,
        })

    def column_bases(self, cols):
        for (i, j), (col, p0, _p1) in cols.items():
            key = f"base/{i}/{j}"
            m = frame_matrix(np.array([p0[0], p0[1], -10.0]), (1, 0, 0), (0, 0, 1))
            pl = self.plate(key, self.name("BP"), 400.0, 400.0, 20.0, m, (None, None),
                            holes=[((sx * 150, sy * 150), 15.0) for sx in (-1, 1)
                                   for sy in (-1, 1)])
            anchors = []
            for sx in (-1, 1):
                for sy in (-1, 1):
                    w = self.w
                    el = w.root("IfcMechanicalFastener", "Anchor bolt M24",
                                f"anchor/{key}/{sx}/{sy}")
                    el.NominalDiameter = w.L(24.0)
                    el.NominalLength = w.L(400.0)
                    mb = frame_matrix(np.array([p0[0] + sx * 150, p0[1] + sy * 150, 50.0]),
                                      (1, 0, 0), (0, 0, -1))
                    prof = w.f.createIfcCircleProfileDef(
                        "AREA", None, w.f.createIfcAxis2Placement2D(w.pt2((0, 0)), None),
                        w.L(12.0))
                    el.Representation = w.shape([w.extrusion(prof, 400.0, np.eye(4))],
                                                "SweptSolid")
                    self.place_part(el, mb, (None, None))
                    anchors.append(el.GlobalId)
            self.truth.column_bases.append({"column": col.GlobalId, "plate": pl.GlobalId,
                                            "anchors": anchors})
            if self.opt.relations in ("assembly", "mixed"):
                self.parts_by_column.setdefault(col.GlobalId, [col]).append(pl)

    def finish_relations(self):
        f = self.w.f
        n = 0
        for group in list(self.parts_by_beam.values()) + list(self.parts_by_column.values()):
            if len(group) < 2:
                continue
            asm = self.w.root("IfcElementAssembly", f"Assembly {group[0].Name}",
                              f"assembly/{group[0].GlobalId}")
            if self.opt.schema != "IFC2X3":
                asm.PredefinedType = "USERDEFINED"
                asm.ObjectType = "shop assembly"
            else:
                asm.AssemblyPlace = "FACTORY"
                asm.PredefinedType = "USERDEFINED"
            # the assembly sits in the storey of its main member
            home = next((st for st, _ in self.storeys
                         if group[0] in self.w.contained[st.id()]), self.storeys[0][0])
            asm.ObjectPlacement = self.w.placement(np.eye(4), home.ObjectPlacement)
            ifcopenshell.api.aggregate.assign_object(f, products=group, relating_object=asm)
            self.w.contained[home.id()].append(asm)
            n += 1
        # Containment: one relation per storey; assembly parts are contained via the assembly.
        in_asm = {p.id() for g in list(self.parts_by_beam.values())
                  + list(self.parts_by_column.values()) if len(g) > 1 for p in g}
        for st, _ in self.storeys:
            els = [e for e in self.w.contained[st.id()] if e.id() not in in_asm]
            if els:
                f.createIfcRelContainedInSpatialStructure(gid(f"contain/{st.GlobalId}"),
                                                          self.w.history, None, None, els, st)

    def write(self, path: Path) -> dict:
        f = self.w.f
        # Relationships made by ifcopenshell.api carry random GlobalIds: make them stable.
        for rel in f.by_type("IfcRelationship"):
            if rel.is_a() in ("IfcRelAggregates", "IfcRelAssociatesMaterial"):
                rel.GlobalId = gid(f"rel/{rel.is_a()}/{rel.id()}")
        for oh in f.by_type("IfcOwnerHistory"):
            oh.CreationDate = FIXED_TIME
            if oh.LastModifiedDate is not None:
                oh.LastModifiedDate = FIXED_TIME
        f.write(str(path))
        truth = {
            "generator": "sample_models/generate.py",
            "project": "Kestrel Lane cycle workshop (invented demo)",
            "options": {k: v for k, v in vars(self.opt).items()},
            "length_unit_mm": UNIT_MM[self.opt.unit],
            "joints": self.truth.joints,
            "other_beam_ends": self.truth.other_beam_ends,
            "column_bases": self.truth.column_bases,
        }
        return truth


def build(opt: Options, path: str | Path, truth_path: str | Path | None = None) -> dict:
    """Write a model variant to ``path`` and return (and optionally write) its truth."""
    fr = Frame(opt)
    fr.build()
    truth = fr.write(Path(path))
    if truth_path:
        Path(truth_path).write_text(json.dumps(truth, indent=1) + "\n")
    return truth


BUNDLED = {
    "kestrel-workshop-ifc4-mm": Options(schema="IFC4", unit="mm", relations="mixed",
                                        haunch=True),
    "kestrel-workshop-ifc2x3-mm": Options(schema="IFC2X3", unit="mm", relations="assembly",
                                          fastener_class="IfcMechanicalFastener", haunch=True),
    "kestrel-workshop-ifc4-m": Options(schema="IFC4", unit="m", relations="none",
                                       rotation_deg=23.0, offset=(1250.0, -730.0), haunch=True),
}


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--out", default=str(HERE), help="folder for the .ifc and .truth.json files")
    args = ap.parse_args()
    out = Path(args.out)
    out.mkdir(parents=True, exist_ok=True)
    for name, opt in BUNDLED.items():
        build(opt, out / f"{name}.ifc", out / f"{name}.truth.json")
        print(f"wrote {out / (name + '.ifc')}")


if __name__ == "__main__":
    main()
