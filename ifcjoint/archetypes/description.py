"""From a joint description (what an engineer writes, or a scanned joint exported) to the input.

A description is the ``inputs`` object of a joint in the results JSON (docs/joint-file.md,
schema ``docs/joint-file.schema.json``) with ``demands`` beside it. It may leave out what
ifcjoint can fill the way the model check fills it: a section's dimensions (by name from the
catalogue), strengths (by grade and thickness, EN 1993-1-1 Table 3.1), a bolt's area, hole
and fub (by size and class), welds (assumed full strength). Whatever is filled is written
into the engine input, so the sheet shows the value used. Unknown keys are errors: a typo
never silently leaves a value at its default.
"""

from __future__ import annotations

import math
from collections.abc import Callable
from dataclasses import fields
from typing import Any

from ifcjoint.anatomy.rules import RULES
from ifcjoint.archetypes.builders import assumed_welds, grade_strength
from ifcjoint.catalogue.materials import BOLT_CLASSES
from ifcjoint.catalogue.sections import ISection, section_from_designation
from ifcjoint.ec3 import detailing as dt
from ifcjoint.ec3.bolts import TENSILE_STRESS_AREA
from ifcjoint.ec3.params import Parameters
from ifcjoint.engine.inputs import (
    BoltsInput,
    EndPlateJointInput,
    HaunchInput,
    JointInput,
    MemberInput,
    PlateInput,
    StiffenerInput,
    WebPlateInput,
    WeldedJointInput,
    WeldsInput,
)
from ifcjoint.engine.results import CheckResult
from ifcjoint.engine.settings import CheckSettings
from ifcjoint.model.codes import Archetype, JointModel
from ifcjoint.model.demands import Demand
from ifcjoint.model.joints import Finding

#: Keys that describe the joint but do not enter the check.
INFORMATIONAL = frozenset({"label", "source", "description"})
_MEMBER_KEYS = frozenset(
    {"name", "grade", "h", "b", "tw", "tf", "r", "fy", "fu", "welded", "span_mm", "Iy", "Wpl_y",
     "strength_source"}
)
_PLATE_KEYS = frozenset(
    {"grade", "tp", "bp", "hp", "fy", "fu", "projection_top", "projection_bottom",
     "strength_source"}
)
_BOLT_KEYS = frozenset({"d", "grade", "fub", "As", "d0", "gauge", "rows_from_beam_top", "L_b"})
_WELD_KEYS = frozenset(
    {"top_flange_throat", "bottom_flange_throat", "web_throat", "assumed", "flange_throat",
     "modelled"}
)
_HAUNCH_KEYS = frozenset({"d", "b", "tf", "tw", "fy", "grade", "angle_deg", "length"})
_STIFFENER_KEYS = frozenset({"level", "t", "b", "fy", "grade", "snipe", "weld_leg", "guid"})
_WEB_PLATE_KEYS = frozenset({"t", "b", "fy", "sides", "grade", "guid"})
_DEMAND_KEYS = frozenset(
    {"combination", "M_Ed_kNm", "V_Ed_kN", "N_Ed_kN", "M_Ed_other_side_kNm", "Vc_above_kN",
     "Vc_below_kN", "frame", "assumed_joint", "source", "other_side_source"}
)
_TOP_KEYS = frozenset(
    {"column", "beam", "plate", "bolts", "welds", "params", "beta", "alpha", "alpha_method",
     "column_continues_above", "braced", "stiffeners", "web_plates", "washer_dia",
     "sigma_com_Ed", "double_sided", "demands", "strength_basis", "support", "haunch"}
) | INFORMATIONAL


class DescriptionError(ValueError):
    """A value of a joint description that cannot be used; ``key`` is its dotted path."""

    def __init__(self, key: str, problem: str) -> None:
        self.key = key
        self.problem = problem
        super().__init__(f"{key}: {problem}" if key else problem)


_MISSING: Any = object()


def _keys(d: Any, allowed: frozenset[str], where: str) -> dict:
    if not isinstance(d, dict):
        raise DescriptionError(where, f"expected a table of values, got {type(d).__name__}")
    unknown = sorted(set(d) - allowed)
    if unknown:
        raise DescriptionError(
            f"{where}.{unknown[0]}" if where else unknown[0],
            f"unknown key; expected one of {', '.join(sorted(allowed))}",
        )
    return d


def _num(
    d: dict, key: str, where: str, default: Any = _MISSING, *, minimum: float | None = 0.0,
    strict: bool = True,
) -> Any:
    """A number of the description (mm, MPa, kN ...); ``strict``: above ``minimum``."""
    path = f"{where}.{key}" if where else key
    v = d.get(key, _MISSING)
    if v is _MISSING or v is None:
        if default is _MISSING:
            raise DescriptionError(path, "missing; expected a number")
        return default
    if isinstance(v, bool) or not isinstance(v, (int, float)) or not math.isfinite(v):
        raise DescriptionError(path, f"{v!r} is not a number")
    if minimum is not None and (v <= minimum if strict else v < minimum):
        raise DescriptionError(path, f"{v!r} must be {'above' if strict else 'at least'} "
                                     f"{minimum:g}")
    return float(v)


def _text(d: dict, key: str, where: str, default: Any = _MISSING) -> Any:
    path = f"{where}.{key}" if where else key
    v = d.get(key, _MISSING)
    if v is _MISSING or v is None:
        if default is _MISSING:
            raise DescriptionError(path, "missing; expected text")
        return default
    if not isinstance(v, str):
        raise DescriptionError(path, f"{v!r} is not text")
    return v


def _flag(d: dict, key: str, where: str, default: bool) -> bool:
    v = d.get(key, default)
    if not isinstance(v, bool):
        raise DescriptionError(f"{where}.{key}" if where else key, f"{v!r} is not true/false")
    return v


def _strength(grade: str, t: float, basis: str, where: str):
    try:
        return grade_strength(grade, t, basis)
    except ValueError as exc:
        raise DescriptionError(f"{where}.grade", str(exc)) from None


def member_from(d: Any, where: str, st: CheckSettings, basis: str) -> MemberInput:
    """A column or beam: dimensions given, or by name from the catalogue; strengths by grade."""
    d = _keys(d, _MEMBER_KEYS, where)
    name = _text(d, "name", where, "")
    grade = _text(d, "grade", where)
    dims = ("h", "b", "tw", "tf")
    if all(k in d for k in dims):
        sec = ISection(h=_num(d, "h", where), b=_num(d, "b", where), tw=_num(d, "tw", where),
                      tf=_num(d, "tf", where), r=_num(d, "r", where, 0.0, strict=False),
                      name=name)
    else:
        found = section_from_designation(name) if name else None
        if found is None:
            missing = [k for k in dims if k not in d]
            raise DescriptionError(
                f"{where}.{missing[0]}",
                f"missing, and the section {name!r} is not in the catalogue; give h, b, tw, tf "
                "(and r) in mm or a catalogue name such as 'HEB 300' or 'UB 533x210x92'",
            )
        sec = found
    span = _num(d, "span_mm", where, None)
    given = "fy" in d and "fu" in d
    if given:  # strengths as written: no table needed (any grade, e.g. a foreign one)
        base, fy, fu, source = grade, _num(d, "fy", where), _num(d, "fu", where), "given"
    else:
        base, s = _strength(grade, max(sec.tf, sec.tw), basis, where)
        fy, fu, source = _num(d, "fy", where, s.fy), _num(d, "fu", where, s.fu), s.source
    return MemberInput(
        name=sec.name or name, grade=base, h=sec.h, b=sec.b, tw=sec.tw, tf=sec.tf, r=sec.r,
        fy=fy, fu=fu, welded=_flag(d, "welded", where, sec.r == 0), span=span,
        Iy=_num(d, "Iy", where, sec.Iy), Wpl_y=_num(d, "Wpl_y", where, sec.Wpl_y),
        strength_source=_text(d, "strength_source", where, source),
    )


def plate_from(
    d: Any, beam: MemberInput, st: CheckSettings, basis: str, depth: float | None = None
) -> PlateInput:
    """The end plate; its height from the projections, or the bottom projection from it.

    ``depth``: the beam's with its haunch, when it has one (the bottom projection is below it).
    """
    w = "plate"
    depth = beam.h if depth is None else depth
    d = _keys(d, _PLATE_KEYS, w)
    tp, bp = _num(d, "tp", w), _num(d, "bp", w)
    top = _num(d, "projection_top", w, minimum=None)
    if "projection_bottom" in d:
        bottom = _num(d, "projection_bottom", w, minimum=None)
        hp = _num(d, "hp", w, depth + top + bottom)
    else:
        hp = _num(d, "hp", w)
        bottom = hp - top - depth
    grade = _text(d, "grade", w, beam.grade)
    if "fy" in d and "fu" in d:
        base, fy, fu, source = grade, _num(d, "fy", w), _num(d, "fu", w), "given"
    else:
        base, s = _strength(grade, tp, basis, w)
        fy, fu, source = _num(d, "fy", w, s.fy), _num(d, "fu", w, s.fu), s.source
    return PlateInput(
        grade=base, tp=tp, bp=bp, hp=hp, fy=fy, fu=fu, projection_top=top,
        projection_bottom=bottom, strength_source=_text(d, "strength_source", w, source),
    )


def normal_hole(d: float) -> float:
    """Normal round clearance hole d0 for a bolt of diameter d (mm).

    EN 1090-2 Table 11 (from memory): d + 1 for M12 and M14, d + 2 for M16 to M24, d + 3 from
    M27.
    """
    return d + (1.0 if d <= 14 else 2.0 if d <= 24 else 3.0)


def bolts_from(d: Any) -> BoltsInput:
    """The bolts: size and class, area and hole by size unless given, rows from the top."""
    w = "bolts"
    d = _keys(d, _BOLT_KEYS, w)
    dia = _num(d, "d", w)
    cls = str(d.get("grade", ""))
    if "fub" not in d and cls not in BOLT_CLASSES:
        raise DescriptionError(f"{w}.grade", f"{cls!r}: expected a property class of "
                               f"EN 1993-1-8 Table 3.1 ({', '.join(BOLT_CLASSES)}) or fub")
    if "As" not in d and int(round(dia)) not in TENSILE_STRESS_AREA:
        raise DescriptionError(f"{w}.As", f"missing, and M{dia:g} has no stress area here; "
                                          "give As in mm2")
    fub = _num(d, "fub", w, BOLT_CLASSES.get(cls, (0, 0))[1])
    area = _num(d, "As", w, TENSILE_STRESS_AREA.get(int(round(dia)), 0))
    rows = d.get("rows_from_beam_top")
    if not isinstance(rows, list) or len(rows) < 1:
        raise DescriptionError(f"{w}.rows_from_beam_top",
                               "expected a list of row depths below the beam's top face, mm")
    depths = tuple(_num({"row": z}, "row", f"{w}.rows_from_beam_top", minimum=None)
                   for z in rows)
    if list(depths) != sorted(depths):
        raise DescriptionError(f"{w}.rows_from_beam_top", "rows must go down from the top")
    return BoltsInput(
        d=dia, grade=cls, fub=fub, As=area, d0=_num(d, "d0", w, normal_hole(dia)),
        gauge=_num(d, "gauge", w), rows_from_beam_top=depths, L_b=_num(d, "L_b", w, None),
    )


def welds_from(d: Any, beam: MemberInput, st: CheckSettings) -> WeldsInput:
    """The beam's welds: given throats, or the full-strength welds the model check assumes."""
    if d is None:
        return assumed_welds(beam, st)
    w = "welds"
    d = _keys(d, _WELD_KEYS, w)
    flange = _num(d, "flange_throat", w, None)
    top = _num(d, "top_flange_throat", w, flange if flange is not None else _MISSING)
    bottom = _num(d, "bottom_flange_throat", w, flange if flange is not None else top)
    modelled = d.get("modelled", [])
    if not isinstance(modelled, list) or not set(modelled) <= {"top_flange", "bottom_flange",
                                                               "web"}:
        raise DescriptionError(f"{w}.modelled", "expected a list of top_flange, bottom_flange, "
                                                "web")
    return WeldsInput(top_flange_throat=top, bottom_flange_throat=bottom,
                      web_throat=_num(d, "web_throat", w), assumed=_flag(d, "assumed", w, False),
                      modelled=tuple(modelled))


def _plate_fy(d: dict, w: str, t: float, col: MemberInput, basis: str) -> float:
    if "fy" in d:
        return _num(d, "fy", w)
    grade = _text(d, "grade", w, "")
    return _strength(grade, t, basis, w)[1].fy if grade else col.fy


def stiffeners_from(items: Any, col: MemberInput, basis: str) -> tuple[StiffenerInput, ...]:
    """Pairs of transverse column stiffeners (fy by grade, else the column's)."""
    if not isinstance(items, list):
        raise DescriptionError("stiffeners", "expected a list of stiffener tables")
    out = []
    for k, d in enumerate(items):
        w = f"stiffeners[{k}]"
        d = _keys(d, _STIFFENER_KEYS, w)
        t = _num(d, "t", w)
        out.append(StiffenerInput(
            level=_num(d, "level", w, minimum=None), t=t, b=_num(d, "b", w),
            fy=_plate_fy(d, w, t, col, basis), grade=_text(d, "grade", w, ""),
            snipe=_num(d, "snipe", w, 0.0, strict=False),
            weld_leg=_num(d, "weld_leg", w, 0.0, strict=False), guid=_text(d, "guid", w, ""),
        ))
    return tuple(out)


def haunch_from(d: Any, beam: MemberInput, basis: str) -> HaunchInput | None:
    """A haunch under the beam (fy by grade, else the beam's), or None when not given."""
    if d is None:
        return None
    w = "haunch"
    d = _keys(d, _HAUNCH_KEYS, w)
    tf, tw = _num(d, "tf", w), _num(d, "tw", w)
    fy = d.get("fy")
    if fy is None:
        grade = _text(d, "grade", w, beam.grade)
        try:
            fy = grade_strength(grade, max(tf, tw), basis)[1].fy
        except ValueError:
            fy = beam.fy
    return HaunchInput(d=_num(d, "d", w), b=_num(d, "b", w), tf=tf, tw=tw,
                       fy=_num(d, "fy", w, float(fy)), grade=_text(d, "grade", w, beam.grade),
                       angle_deg=_num(d, "angle_deg", w, 0.0, strict=False),
                       length=_num(d, "length", w, 0.0, strict=False))


def web_plates_from(items: Any, col: MemberInput, basis: str) -> tuple[WebPlateInput, ...]:
    """Supplementary web plates (fy by grade, else the column's)."""
    if not isinstance(items, list):
        raise DescriptionError("web_plates", "expected a list of web plate tables")
    out = []
    for k, d in enumerate(items):
        w = f"web_plates[{k}]"
        d = _keys(d, _WEB_PLATE_KEYS, w)
        t = _num(d, "t", w)
        sides = d.get("sides", 1)
        if sides not in (1, 2):
            raise DescriptionError(f"{w}.sides", f"{sides!r}: expected 1 or 2")
        out.append(WebPlateInput(t=t, b=_num(d, "b", w), fy=_plate_fy(d, w, t, col, basis),
                                 sides=sides, grade=_text(d, "grade", w, ""),
                                 guid=_text(d, "guid", w, "")))
    return tuple(out)


def params_from(d: Any, base: Parameters) -> Parameters:
    """Partial factors and NDPs: the given ones over ``base``."""
    if d is None:
        return base
    known = frozenset(f.name for f in fields(Parameters))
    d = _keys(d, known, "params")
    return Parameters(**{**base.as_dict(), **{k: _num(d, k, "params") for k in d}})


def input_from_description(d: Any, settings: CheckSettings | None = None) -> JointInput:
    """The engine input a description gives: an end plate with ``plate`` and ``bolts``.

    Without either, a welded joint.

    Raises:
        DescriptionError: a value that cannot be used (its dotted key named).
    """
    st = settings or CheckSettings()
    d = _keys(d, _TOP_KEYS, "")
    basis = _text(d, "strength_basis", "", st.strength_basis)
    if basis not in ("EN 1993-1-1", "EN 10025"):
        raise DescriptionError("strength_basis", f"{basis!r}: expected 'EN 1993-1-1' or "
                                                 "'EN 10025'")
    for key in ("column", "beam"):
        if key not in d:
            raise DescriptionError(key, "missing; expected a table with the section and grade")
    col = member_from(d["column"], "column", st, basis)
    beam = member_from(d["beam"], "beam", st, basis)
    method = _text(d, "alpha_method", "", st.alpha_method)
    if method not in ("chart", "conservative"):
        raise DescriptionError("alpha_method", f"{method!r}: expected 'chart' or 'conservative'")
    beta = _num(d, "beta", "", 1.0, minimum=0.0, strict=False)
    if beta > 2.0:
        raise DescriptionError("beta", f"{beta!r}: EN 1993-1-8 Table 5.4 gives 0 to 2")
    shared = dict(
        column=col,
        beam=beam,
        welds=welds_from(d.get("welds"), beam, st),
        params=params_from(d.get("params"), st.params),
        beta=beta,
        column_continues_above=_flag(d, "column_continues_above", "", True),
        braced=_flag(d, "braced", "", st.braced),
        stiffeners=stiffeners_from(d.get("stiffeners", []), col, basis),
        web_plates=web_plates_from(d.get("web_plates", []), col, basis),
        sigma_com_Ed=_num(d, "sigma_com_Ed", "", 0.0, strict=False),
    )
    has_plate, has_bolts = "plate" in d, "bolts" in d
    if has_plate != has_bolts:
        missing = "bolts" if has_plate else "plate"
        raise DescriptionError(missing, "missing: an end-plate joint needs both 'plate' and "
                                        "'bolts'; a welded joint has neither")
    if not has_plate:
        for key in ("alpha", "washer_dia", "support", "haunch"):
            if d.get(key) is not None:
                raise DescriptionError(key, "applies to an end plate; this joint has none")
        return WeldedJointInput(**shared)
    support = _text(d, "support", "", "flange")
    if support not in ("flange", "web", "beam_web", "splice"):
        raise DescriptionError("support", f"{support!r}: expected 'flange', 'web', 'beam_web' "
                                          "or 'splice'")
    haunch = haunch_from(d.get("haunch"), beam, basis)
    return EndPlateJointInput(
        support=support,
        haunch=haunch,
        plate=plate_from(d["plate"], beam, st, basis,
                         beam.h + (haunch.d if haunch is not None else 0.0)),
        bolts=bolts_from(d["bolts"]),
        alpha=_num(d, "alpha", "", None),
        alpha_method=method,
        washer_dia=_num(d, "washer_dia", "", None),
        **shared,
    )


def description_findings(inp: JointInput) -> list[Finding]:
    """The detailing rules a described end-plate joint can be checked against (mm).

    The same rules as a scanned joint's (``ifcjoint.anatomy.rules``), on the geometry the
    description gives: end distances to the plate's top and bottom edges and side edge
    distances on the plate and the column flange (EN 1993-1-8 Table 3.3, e >= 1.2 d0),
    pitches (p1 >= 2.2 d0, p <= min(14 t, 200)), the gauge (p2 >= 2.4 d0), the hole clearance
    (EN 1090-2), the holes clear of the column's root radius and room for the washer. What a
    description does not hold (bolt lengths, the plate's position against the face, bolts off
    their holes) is not checked here.
    """
    if not isinstance(inp, EndPlateJointInput):
        return []
    b, pl, col, beam = inp.bolts, inp.plate, inp.column, inp.beam
    out: list[Finding] = []

    def check(rule: str, measured: float, limit: float, **detail) -> None:
        r = RULES[rule]
        if r.broken(measured, limit):
            out.append(r.finding(measured, limit, (), **detail))

    d0, rows = b.d0, b.rows_from_beam_top
    emin = dt.e_min(d0)
    top_edge = -pl.projection_top
    bottom_edge = beam.h + (inp.haunch.d if inp.haunch is not None else 0.0) + pl.projection_bottom
    check("end_distance", rows[0] - top_edge, emin, edge="top", row=1)
    check("end_distance", bottom_edge - rows[-1], emin, edge="bottom", row=len(rows))
    e_plate = (pl.bp - b.gauge) / 2
    if RULES["bolt_outside_plate"].broken(e_plate, d0 / 2):
        check("bolt_outside_plate", e_plate, d0 / 2, part="plate")
    else:
        check("edge_distance", e_plate, emin, edge="side")
    e_col = (col.b - b.gauge) / 2
    if RULES["bolt_outside_column_flange"].broken(e_col, d0 / 2):
        check("bolt_outside_column_flange", e_col, d0 / 2, part="column_flange")
    else:
        check("column_edge_distance", e_col, emin)
    for i, (z1, z2) in enumerate(zip(rows, rows[1:], strict=False), start=1):
        check("pitch_min", z2 - z1, dt.p1_min(d0), rows=(i, i + 1))
        check("pitch_max", z2 - z1, dt.p_max(pl.tp), rows=(i, i + 1))
    check("spacing_min", b.gauge, dt.p2_min(d0))
    clearance, want = d0 - b.d, dt.normal_hole_clearance(b.d)
    rule = RULES["hole_clearance"]
    if rule.outside(clearance, 0.5, want + 0.5):
        out.append(rule.finding(clearance, want, (), hole=d0, d=b.d))
    clear = b.gauge / 2 - col.tw / 2 - col.r
    if not RULES["hole_on_root_radius"].broken(clear, d0 / 2):
        check("no_spanner_room", clear, dt.washer_half_width(b.d))
    else:
        check("hole_on_root_radius", clear, d0 / 2)
    return out


def archetype_of(inp: JointInput) -> Archetype:
    """The archetype a description's input is: welded, or an end plate extended or flush.

    An end plate is extended when a bolt row lies above or below the beam (as the model
    check's recognition decides it).
    """
    if isinstance(inp, WeldedJointInput):
        return Archetype.WELDED
    h = inp.beam.h
    outside = any(z < 0 or z > h for z in inp.bolts.rows_from_beam_top)
    return Archetype.EXTENDED_END_PLATE if outside else Archetype.FLUSH_END_PLATE


def engine_for(inp: JointInput) -> Callable[[Any], CheckResult]:
    """The engine of an input's kind (the archetype's own ``engine``)."""
    from ifcjoint.archetypes import joint_type

    return joint_type(archetype_of(inp)).engine


def demands_from_description(d: dict, where: str = "") -> list[Demand]:
    """The description's load combinations (kN, kNm, as in the demands CSV) in N and N mm."""
    items = d.get("demands", [])
    if not isinstance(items, list):
        raise DescriptionError("demands", "expected a list of load combinations")
    out = []
    for k, x in enumerate(items):
        w = f"demands[{k}]"
        x = _keys(x, _DEMAND_KEYS, w)
        frame = _text(x, "frame", w, "")
        if frame not in ("", "braced", "unbraced"):
            raise DescriptionError(f"{w}.frame", f"{frame!r}: expected 'braced' or 'unbraced'")
        assumed = _text(x, "assumed_joint", w, "")
        models = [m.value for m in JointModel]
        if assumed and assumed not in models:
            raise DescriptionError(f"{w}.assumed_joint", f"{assumed!r}: expected one of "
                                                         f"{', '.join(models)}")

        def opt(key: str, f: float, *, w: str = w, x: dict = x) -> float | None:
            v = _num(x, key, w, None, minimum=None)
            return None if v is None else v * f

        out.append(Demand(
            combination=_text(x, "combination", w),
            M_Ed=_num(x, "M_Ed_kNm", w, minimum=None) * 1e6,
            V_Ed=abs(_num(x, "V_Ed_kN", w, minimum=None)) * 1e3,
            N_Ed=opt("N_Ed_kN", 1e3) or 0.0,
            M_other=opt("M_Ed_other_side_kNm", 1e6),
            Vc_above=opt("Vc_above_kN", 1e3),
            Vc_below=opt("Vc_below_kN", 1e3),
            braced=None if not frame else frame == "braced",
            assumed_joint=JointModel(assumed) if assumed else None,
            source=f"{where}:demands[{k}]" if where else f"demands[{k}]",
        ))
    return out


def description_from_joint(joint: dict) -> dict:
    """A joint of a results JSON as a description to edit and re-run (None values left out).

    The ``inputs`` object as it is, with the joint's demands, whether it is double-sided, and
    where it came from (informational).
    """
    c = joint.get("check") or {}
    inputs = c.get("inputs")
    if not inputs:
        raise DescriptionError("inputs", "this joint has no engine input (it was not checked: "
                                         f"{c.get('status_reason') or c.get('status')})")
    if "fin" in inputs:
        raise DescriptionError("inputs", "fin plate joints cannot be written as a description "
                               "yet (descriptions hold end-plate and welded joints)")
    keep_demand = _DEMAND_KEYS - {"source", "other_side_source"}
    out: dict = {
        "label": joint.get("label", ""),
        "source": {k: v for k, v in (("joint_id", joint.get("id")),
                                     ("beam", joint.get("beam")),
                                     ("beam_end", joint.get("beam_end")),
                                     ("column", joint.get("column"))) if v},
        **inputs,
        "double_sided": joint.get("partner") is not None,
        "demands": [{k: v for k, v in dm.items() if k in keep_demand}
                    for dm in c.get("demands", [])],
    }
    out["welds"] = {k: v for k, v in out["welds"].items() if k != "flange_throat"}
    return _drop_none(out)


def _drop_none(v: Any) -> Any:
    """The value without None entries (TOML has no null; a missing key takes its default)."""
    if isinstance(v, dict):
        return {k: _drop_none(x) for k, x in v.items() if x is not None}
    if isinstance(v, list):
        return [_drop_none(x) for x in v]
    return v
