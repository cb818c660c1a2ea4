"""Words for people, made from codes: the only place a decision becomes a sentence.

Every table maps a code to a function of the code's values. Nothing outside the renderers
reads these sentences back: decisions compare codes (``ifcjoint.model.codes``).
"""

from __future__ import annotations

from collections.abc import Callable, Mapping
from typing import Any

from ifcjoint.ec3.code import EN_1993_1_8, Component, Eurocode3
from ifcjoint.ec3.moment_resistance import Limit, LimitScope
from ifcjoint.model.codes import (
    Coded,
    FindingCode,
    NotChecked,
    NotCheckedCode,
    NoteCode,
    ProblemKind,
    ReasonCode,
    Status,
    UnsupportedPart,
    Verification,
)
from ifcjoint.model.joints import Finding

Words = Callable[[Mapping[str, Any]], str]

#: Status as the outputs print it.
STATUS_WORDS = {
    Status.PASS: "pass",
    Status.FAIL: "fail",
    Status.NO_DEMANDS: "unchecked: no demands",
    Status.INCOMPLETE: "unchecked: incomplete",
    Status.UNSUPPORTED: "unchecked: unsupported",
    Status.UNREADABLE: "unchecked: unreadable",
}

_PARTS: dict[UnsupportedPart, Words] = {
    UnsupportedPart.HAUNCH_PLATES: lambda v: f"haunch below the beam ({v['n']} plate(s))",
    UnsupportedPart.INCLINED_STIFFENER: lambda v: f"inclined column stiffener ({v['n']} plate(s))",
    UnsupportedPart.HAUNCH_MEMBERS: lambda v: f"haunch below the beam ({v['n']} member(s))",
    UnsupportedPart.SECTION_PARTS: lambda v: (
        f"{v['n']} angle cleat(s) or other short section(s) at the joint, not plates: angle "
        "cleats are not checked yet"),
}


def _unsupported(v: Mapping[str, Any]) -> str:
    parts = "; ".join(_PARTS[UnsupportedPart(p)]({"n": n}) for p, n in v["parts"])
    return f"{parts} (not handled yet; the joint is otherwise read as {v['otherwise']})"


#: Why a joint has its archetype.
REASONS: dict[ReasonCode, Words] = {
    ReasonCode.END_PLATE_NO_BOLTS: lambda v: "end plate at the beam end but no bolts",
    ReasonCode.FIN_PLATE_NO_BOLTS: lambda v: "fin plate but no bolts",
    ReasonCode.BOLTS_NO_PLATE: lambda v: f"{v['n']} bolt(s) but no plate",
    ReasonCode.SHORT_OF_FACE: lambda v: (
        f"beam end with nothing between it and the column face, {v['gap']:.0f} mm short of "
        "it: read as a welded joint standing off the face (a gap finding says so)"
    ),
    ReasonCode.DEPTH_UNKNOWN: lambda v: (
        "end plate with bolts; beam depth unknown, extent not judged"
    ),
    ReasonCode.ROWS_OUTSIDE: lambda v: (
        f"{v['n']} bolt row(s) {' and '.join(v['where'])} the beam depth"
    ),
    ReasonCode.ROWS_WITHIN: lambda v: f"all {v['n']} bolt row(s) within the beam depth",
    ReasonCode.PLATE_SHORT_OF_FLANGE: lambda v: (
        f"end plate {v['top']:.0f} mm below the beam top and {v['bottom']:.0f} mm above its "
        "bottom: it does not reach a flange, so it is a partial-depth (header) plate, "
        "nominally pinned: shear only"
    ),
    ReasonCode.SPLICE_PLATE_MISSING: lambda v: (
        "splice with one end plate and bolts: the other beam's end plate is not in the model"
    ),
    ReasonCode.SPLICE_BARE: lambda v: (
        "two beam ends meet end to end with no plates, bolts or welds modelled: the splice "
        "is not detailed"
    ),
    ReasonCode.ANGLE_CLEATS_BOLTS: lambda v: (
        f"two angle cleats either side of the beam web with {v['n']} bolt(s): nominally pinned"
    ),
    ReasonCode.HAUNCH_END_PLATE: lambda v: (
        f"end plate with {v['n']} bolt(s) running down a haunch {v['d']:.0f} mm deep under "
        "the beam"
    ),
    ReasonCode.SPLICE_PLATES_BOLTS: lambda v: (
        f"two end plates bolted together with {v['n']} bolt(s): a beam splice"
    ),
    ReasonCode.FIN_PLATE_BOLTS: lambda v: (
        f"plate beside the beam web with {v['n']} bolt(s): nominally pinned"
    ),
    ReasonCode.ON_FACE: lambda v: (
        f"beam end on the column face (gap {v['gap']:.1f} mm), no plate or bolts"
    ),
    ReasonCode.DRAWN_INTO: lambda v: (
        f"beam drawn {v['depth']:.0f} mm into the column, no plates or bolts: "
        "the connection is not modelled"
    ),
    ReasonCode.UNSUPPORTED_PARTS: _unsupported,
    ReasonCode.NOT_DECIDED: lambda v: "archetype not decided yet (anatomy not read)",
}

#: Why something was not checked (or classified).
NOT_CHECKED: dict[NotCheckedCode, Words] = {
    NotCheckedCode.NO_ANATOMY: lambda v: "no anatomy for this joint",
    NotCheckedCode.VALUE_NOT_USABLE: lambda v: (
        f"{v['what']} of {v['entity']} is {v['value']:g} mm, which cannot be right "
        "(a dimension must be positive)"
    ),
    NotCheckedCode.DATA_NOT_READ: lambda v: (
        "not read from the model: " + ", ".join(v["missing"])
    ),
    NotCheckedCode.STRENGTH_UNAVAILABLE: lambda v: f"steel strength not available: {v['error']}",
    NotCheckedCode.BOLT_DATA_MISSING: lambda v: "bolt diameter, class, hole or gauge not read",
    NotCheckedCode.NO_TENSILE_AREA: lambda v: f"no tensile stress area for M{v['d']:g}",
    NotCheckedCode.SECTION_DIMENSIONS_MISSING: lambda v: "section dimensions missing",
    NotCheckedCode.MINOR_AXIS: lambda v: (
        "a joint of this kind on a web (a column's minor axis, or a primary beam's): not "
        "checked; EN 1993-1-8 gives no component for a web in bending out of its plane"
    ),
    NotCheckedCode.FIN_PLATE: lambda v: (
        "fin plate, nominally pinned: no moment resistance to check; the fin plate shear "
        "check is not implemented yet"
    ),
    NotCheckedCode.PINNED_NO_MOMENT: lambda v: (
        "nominally pinned joint: it has no moment resistance (EN 1993-1-8 5.2.2.2); the "
        "analysis must give it no moment"
    ),
    NotCheckedCode.CLEAT_BOLT_PATTERN: lambda v: (
        f"angle cleats with {v['web']} web-side and {v['support']} support-side bolt(s): the "
        "check takes one line through the web and one line of as many rows on each cleat's "
        "support leg"
    ),
    NotCheckedCode.NOTCH_NOT_CHECKED: lambda v: (
        f"the beam's {v['where']} flange reaches into the primary beam's flange: the beam must "
        "be notched there, and a notched web (its shear, bending and stability at the notch) "
        "is not checked"
    ),
    NotCheckedCode.HAUNCH_OUTSIDE_RULES: lambda v: (
        f"the haunch's {v['what']} ({v['haunch']:g}) is below the beam's ({v['beam']:g})"
        if v["what"] != "flange angle" else
        f"the haunch's flange slopes {v['haunch']:.0f} degrees (more than 45)"
    ) + ": outside EN 1993-1-8 6.2.6.7(2), the haunched joint is not checked",
    NotCheckedCode.SPLICE_PLATES_DIFFER: lambda v: (
        f"the splice's two end plates differ ({v['what']}: {v['this']:g} and {v['other']:g} "
        "mm): the check takes two alike plates; not checked"
    ),
    NotCheckedCode.WEB_BENDING_NOT_COVERED: lambda v: (
        "end plate on a web: EN 1993-1-8 gives no resistance or stiffness of a web in "
        "bending out of its plane, so Mj,Rd, Sj,ini and the classification are not "
        "determined; the bolts, the beam web, the welds and the web's local shear are checked"
    ),
    NotCheckedCode.SUPPORT_WEB_OTHER_SIDE_MISSING: lambda v: (
        "a beam on the other side of the supporting web has no row for this combination: the "
        "web's local shear takes both reactions, so it is not checked without it"
    ),
    NotCheckedCode.TYING_NOT_CHECKED: lambda v: (
        f"an axial {'tension' if v['N'] > 0 else 'compression'} of {abs(v['N']) / 1e3:.1f} "
        "kN on a nominally pinned joint: not checked for this joint type"
    ),
    NotCheckedCode.FIN_BOLT_PATTERN: lambda v: (
        f"fin plate bolts in {v['lines']} line(s) of {v['rows']} row(s): the check takes one "
        "or two vertical lines with the same bolts in every row, inside the plate and the "
        "beam web"
    ),
    NotCheckedCode.NOT_DUCTILE: lambda v: (
        f"fin plate t_p = {v['tp']:g} mm against bolt d = {v['d']:g} mm: thicker than "
        f"{v['ratio']:g} d, so not shown to rotate as a nominally pinned joint (design guide "
        "for pinned joints; common practice)"
    ),
    NotCheckedCode.PARTS_MISSING: lambda v: (
        f"{coded(v['reason'])}: nothing to check until the model holds the joint's parts"
    ),
    NotCheckedCode.ARCHETYPE_NOT_CHECKED: lambda v: (
        f"archetype {v['archetype']}: only bolted end plates and welded joints are checked"
    ),
    NotCheckedCode.ROW_NOT_TWO_BOLTS: lambda v: (
        "a bolt row without exactly two bolts: outside the method's scope here"
    ),
    NotCheckedCode.FEWER_THAN_TWO_ROWS: lambda v: "fewer than two bolt rows",
    NotCheckedCode.WEB_TOO_SLENDER: lambda v: (
        f"column web too slender for 6.2.6.1: dc/tw = {v['ratio']:.1f} > 69 eps = "
        f"{v['limit']:.1f}"
    ),
    NotCheckedCode.BOLTS_IN_ROOT_RADIUS: lambda v: (
        "bolts inside the column's root radius: T-stub geometry undefined"
    ),
    NotCheckedCode.NO_DEMANDS: lambda v: (
        "the joint description gives no demands" if v.get("source") == "description"
        else "no demand row for this joint"
    ),
    NotCheckedCode.NO_SPAN_OR_IY: lambda v: "not classified: beam span or Iy unknown",
    NotCheckedCode.NO_PLASTIC_MODULI: lambda v: "not classified: plastic moduli unknown",
    NotCheckedCode.NO_TENSION_ROWS: lambda v: (
        f"no bolt row in the tension zone for {v['sign']}: the joint carries no "
        f"{v['sign']} moment (Mj,Rd = 0)"
    ),
    NotCheckedCode.BEARING_OUT_OF_RANGE: lambda v: (
        f"bolt bearing not computed: {v['what']} = {v['value']:.1f} mm is below "
        f"{v['limit']:.1f} mm, the range where Table 3.4 holds (Table 3.3)"
    ),
    NotCheckedCode.CLASS_4_BEAM: lambda v: (
        f"beam {v['section']} is class {v['class']} in bending: M_c,Rd needs its effective "
        "section (EN 1993-1-5), not computed here"
    ),
}


def _beta_from_moments(v: Mapping[str, Any]) -> str:
    src = f" (other side from {v['other_source']})" if v.get("other_source") else ""
    return f"beta = {v['beta']:g} from the moments of both sides (Table 5.4){src}"


#: How a result was obtained.
def _at_level(v: dict) -> str:
    """`` at 525 mm`` for a value dict with a stiffener level (older results have none)."""
    return f" at {v['level']:.0f} mm" if v.get("level") is not None else ""


NOTES: dict[NoteCode, Words] = {
    NoteCode.WELDS_MODELLED: lambda v: "weld throats as modelled (read from the weld elements)",
    NoteCode.WELDS_PARTLY_MODELLED: lambda v: (
        f"weld throats: {', '.join(x.replace('_', ' ') for x in v['modelled'])} as modelled, "
        f"the rest assumed full strength: flanges a = {v['a_top']:g} / {v['a_bottom']:g} mm, "
        f"web a = {v['a_web']:g} mm"
    ),
    NoteCode.WELDS_ASSUMED: lambda v: (
        f"weld throats assumed (not modelled): flanges a = {v['a_top']:g} / "
        f"{v['a_bottom']:g} mm, web a = {v['a_web']:g} mm"
    ),
    NoteCode.ALPHA_CHART: lambda v: (
        "alpha (EN 1993-1-8 Fig 6.11) from the chart's published closed form (SCI P398 "
        "Appendix G), for each row next to a flange or a stiffener; values per row in the "
        "components"
    ),
    NoteCode.ALPHA_GIVEN: lambda v: (
        f"alpha (EN 1993-1-8 Fig 6.11) given: {v['alpha']:g} for the end plate's first row "
        "below the flange; next to a column stiffener, from the chart's published closed form"
    ),
    NoteCode.ALPHA_CONSERVATIVE: lambda v: (
        f"alpha (EN 1993-1-8 Fig 6.11) taken as {v['alpha']} everywhere (the chart's lowest "
        "value, conservative; --alpha chart reads the chart)"
    ),
    NoteCode.PRYING_ASSUMED: lambda v: (
        "T-stubs with prying forces (Table 6.2; the no-prying case is not used); bolt "
        f"elongation length L_b = {v['L_b']:.1f} mm (grip, two washers, half the head and "
        "nut) for k10"
    ),
    NoteCode.COMPRESSION_STIFFENER: lambda v: (
        f"compression stiffeners{_at_level(v)}: {v['F'] / 1e3:.0f} kN, the lesser of crushing "
        f"{v['crushing'] / 1e3:.0f} kN and buckling of the cruciform section "
        f"{v['buckling'] / 1e3:.0f} kN (EN 1993-1-5 9.4, curve c)"
    ),
    NoteCode.STIFFENER_SLENDER: lambda v: (
        f"a compression stiffener {v['b']:.0f} x {v['t']:.0f} mm has a slender outstand "
        "(b / t > 14 epsilon): ignored, on the safe side"
    ),
    NoteCode.TENSION_STIFFENER: lambda v: (
        f"{v.get('sign', 'tension side')}: rows next to a stiffener at the tension flange take "
        "the stiffened column flange of Table 6.5; no group of rows crosses a stiffener"
    ),
    NoteCode.TENSION_STIFFENER_IGNORED: lambda v: (
        f"{v['sign']}: the column flange without its tension stiffener gives more "
        f"({v['without'] / 1e6:.1f} against {v['with'] / 1e6:.1f} kNm with Table 6.5's "
        "alpha m), so the stiffener is left out of the tension zone (on the safe side)"
    ),
    NoteCode.TENSION_STIFFENER_WELDED: lambda v: (
        "tension stiffener: k3 infinite (Table 6.11, stiffened welded connection); the "
        "resistance keeps the unstiffened column web in tension and flange in bending (6.2.6.3, "
        "6.2.6.4.3), on the safe side"
    ),
    NoteCode.WEB_PLATES_USED: lambda v: (
        f"{v['n']} supplementary web plate(s) on {v['sides']} side(s): A_vc raised by b_s t_wc "
        "(6.2.6.1(6)), effective web thickness in compression and tension (6.2.6.2(6), "
        "6.2.6.3(8), fillet welds assumed)"
    ),
    NoteCode.WEB_PLATES_IGNORED: lambda v: (
        f"{v['n']} supplementary web plate(s) thinner or weaker than the web: ignored "
        "(6.2.6.1(7)), on the safe side"
    ),
    NoteCode.WEB_PANEL_STIFFENED: lambda v: (
        f"web panel between stiffeners {v['d_s']:.0f} mm apart: V_wp,add,Rd = "
        f"{v['V_add'] / 1e3:.0f} kN added (6.2.6.1(4))"
    ),
    NoteCode.STIFFNESS_UNREINFORCED: lambda v: (
        "stiffness: stiffeners and web plates raise only the coefficients Table 6.11 lets "
        "them raise (k2 infinite under a compression stiffener; k3 infinite in a stiffened "
        "welded joint, by its formula when bolted); k1 keeps the column's own shear area "
        "(safe side)"
    ),
    NoteCode.BEAM_CLASS_3: lambda v: (
        f"beam {v['section']} is class 3 in bending: M_c,Rd = W_el f_y / gamma_M0 in the beam "
        "flange in compression (EN 1993-1-1 6.2.5(2))"
    ),
    NoteCode.SHEAR_FROM_BOLTS: lambda v: (
        "Vj,Rd: bearing outside Table 3.4's range, not computed"
        if v["out_of_range"] else
        f"Vj,Rd: {v['n_shear']} bolt(s) in shear rows at min(Fv,Rd, Fb,Rd) = "
        f"{v['per_bolt'] / 1e3:.1f} kN, {v['n_tension']} in tension rows at "
        f"min((1 - 1/1.4) Fv,Rd, Fb,Rd) (Table 3.4 interaction, common practice); bearing "
        f"(Table 3.4) on the plate {v['fb_plate'] / 1e3:.0f} kN and on the "
        f"{'other plate' if v.get('splice') else 'column flange'} {v['fb_col'] / 1e3:.0f} kN "
        "per bolt"
    ),
    NoteCode.HAUNCH_SECTION: lambda v: (
        f"haunch {v['d']:.0f} mm deep under the beam: the joint is checked as a beam "
        f"{v['h']:.0f} mm deep, the haunch's flange the compression flange in hogging; "
        "Fc,fb,Rd from the elastic modulus of beam and haunch together, the web's share "
        "limited to 20 % above 600 mm (EN 1993-1-8 6.2.6.7(1)); rows in the haunch take the "
        "beam's web in tension (the haunch's web is at least as thick, 6.2.6.7(2))"
    ),
    NoteCode.SPLICE_PLATES: lambda v: (
        f"beam splice: both end plates taken as the weaker one (t_p {v['tp']:g} mm, f_y "
        f"{v['fy']:g} MPa); the other plate's T-stub stands where a column flange would; no "
        "column components; Sj,ini from k5 of both plates and k10 (EN 1993-1-8 Table 6.10)"
    ),
    NoteCode.BEAM_WEB_UNNOTCHED: lambda v: (
        "beam web taken as unnotched: bearing and shear on it with no edge above or below "
        "the bolts"
    ),
    NoteCode.BOLT_SHEAR_GOVERNS: lambda v: (
        "warning: the bolts' shear governs the fin plate; for a ductile pinned joint bearing "
        "or the plate should govern (design guide for pinned joints; common practice)"
    ),
    NoteCode.FIN_PLATE_PINNED: lambda v: (
        f"fin plate with its bolt group at z = {v['z']:.0f} mm from the support "
        f"(alpha = {v['alpha']:.3f}, beta = {v['beta']:.3f}); nominally pinned: shear only"
    ),
    NoteCode.SHEAR_FROM_WELDS: lambda v: (
        "Vj,Rd: double fillet web welds over h - 2 tf (4.5.3.3 simplified method)"
    ),
    NoteCode.BETA_ONE_SINGLE_SIDED: lambda v: "beta = 1: single-sided joint",
    NoteCode.BETA_ONE_UNTIL_DEMANDS: lambda v: (
        "beta = 1 (single-sided, conservative) until the demands give the moments of both sides"
    ),
    NoteCode.BETA_TABLE_SINGLE_SIDED: lambda v: "beta = 1: single-sided joint (Table 5.4)",
    NoteCode.BETA_OTHER_SIDE_MISSING: lambda v: (
        "beta = 1: double-sided joint but M_Ed of the other side not given (Table 5.4; "
        "unconservative if the two moments are opposed)"
    ),
    NoteCode.BETA_FROM_MOMENTS: _beta_from_moments,
    NoteCode.COLUMN_SHEARS_ZERO: lambda v: (
        "column shears not given: (Vc1,Ed - Vc2,Ed)/2 taken as 0 in Eq. (5.3)"
    ),
    NoteCode.AXIAL_NEGLECTED: lambda v: (
        "N_Ed at most 5 % of the beam's Npl,Rd: neglected (6.2.7.1(2))"
    ),
}


def _bolts(v: Mapping[str, Any]) -> str:
    n = v.get("count")
    return "" if n is None else (f" ({n} bolt)" if n == 1 else f" ({n} bolts)")


def _edge(v: Mapping[str, Any], m: float, lim: float) -> str:
    if v["edge"] == "side":
        return f"bolts are {m:.0f} mm from the plate's side edge (min {lim:.1f}){_bolts(v)}"
    return (f"bolt row {v['row']} is {m:.0f} mm from the plate's {v['edge']} edge "
            f"(min {lim:.1f}){_bolts(v)}")


def _outside(v: Mapping[str, Any], m: float, lim: float) -> str:
    if v["part"] == "column_flange":
        return (
            f"a bolt axis lies {m:.0f} mm from the column flange tip: the hole is not inside "
            f"the flange{_bolts(v)}"
        )
    return (f"a bolt axis lies {m:.0f} mm from the plate's edge: the hole is not inside the "
            f"plate{_bolts(v)}")


def _rows(v: Mapping[str, Any]) -> str:
    i, j = v["rows"]
    return f"rows {i} and {j}"


FindingWords = Callable[[Mapping[str, Any], Any, Any], str]

#: A finding in words: f(detail, measured, limit).
FINDINGS: dict[FindingCode, FindingWords] = {
    FindingCode.SECTION_MISMATCH: lambda v, m, lim: (
        f"{v['who']} is named {v['named']} but its {v['dim']} is {m:.1f} mm "
        f"(catalogue {lim:.1f} mm)"
    ),
    FindingCode.GRADE_MISSING: lambda v, m, lim: (
        f"{v['who']} steel grade not found (material '{v['material'] or 'none'}'); "
        "it will not be checked with a guessed grade"
    ),
    FindingCode.BOLT_CLASS_MISSING: lambda v, m, lim: (
        "bolt property class (4.6 ... 10.9) not found in names or properties"
    ),
    FindingCode.PLATE_WITHOUT_BOLTS: lambda v, m, lim: (
        f"{str(v['role']).replace('_', ' ')} has no bolts"
    ),
    FindingCode.BOLTS_WITHOUT_PLATE: lambda v, m, lim: "bolts at the joint but no plate",
    FindingCode.GAP_TO_COLUMN: lambda v, m, lim: (
        f"{v.get('part', 'end plate')} stands {m:.0f} mm off the column face "
        f"(tolerance {lim:.0f} mm)"
    ),
    FindingCode.OVERLAP_WITH_COLUMN: lambda v, m, lim: (
        f"{v.get('part', 'end plate')} runs {m:.0f} mm into the column"
    ),
    FindingCode.END_DISTANCE_MIN: _edge,
    FindingCode.EDGE_DISTANCE_MIN: _edge,
    FindingCode.BOLT_OUTSIDE_OUTLINE: _outside,
    FindingCode.BOLT_OFF_HOLE: lambda v, m, lim: (
        f"{v['count']} bolt(s) pass through the plate {m:.0f} mm from the nearest hole's "
        f"centre (a {v['hole']:g} mm hole): not through a hole"
    ),
    FindingCode.PITCH_MIN: lambda v, m, lim: (
        f"{_rows(v)} are {m:.0f} mm apart (min {lim:.1f})"
    ),
    FindingCode.PITCH_MAX: lambda v, m, lim: f"{_rows(v)} are {m:.0f} mm apart (max {lim:.0f})",
    FindingCode.SPACING_MIN: lambda v, m, lim: (
        f"gauge {m:.0f} mm below the minimum {lim:.1f} mm"
    ),
    FindingCode.HOLE_CLEARANCE: lambda v, m, lim: (
        f"hole {v['hole']:.1f} mm for an M{v['d']:.0f} bolt: clearance {m:.1f} mm "
        f"(normal {lim:.0f} mm)"
    ),
    FindingCode.BOLT_PATTERN_ASYMMETRIC: lambda v, m, lim: (
        f"row {v['row']} is off the web centreline by {m:.0f} mm"
    ),
    FindingCode.PLATE_THICKNESS_IMPLAUSIBLE: lambda v, m, lim: (
        f"{m:.0f} mm end plate with M{v['d']:.0f} bolts"
    ),
    FindingCode.FIN_PLATE_NOT_DUCTILE: lambda v, m, lim: (
        f"fin plate {m:g} mm thick with M{v['d']:g} bolts: thicker than {lim:.1f} mm, so not "
        "shown to rotate as a pinned joint"
    ),
    FindingCode.PLATE_THICKNESS_NOT_STOCK: lambda v, m, lim: (
        f"plate {v['tp']:g} mm thick: not a stock thickness (nearest {v['nearest']:g} mm)"
    ),
    FindingCode.PLATE_WIDER_THAN_COLUMN_FLANGE: lambda v, m, lim: (
        f"end plate {m:.0f} mm wide on a {lim:.0f} mm column flange"
    ),
    FindingCode.COLUMN_EDGE_DISTANCE_MIN: lambda v, m, lim: (
        f"bolts are {m:.0f} mm from the column flange tip (min {lim:.1f}){_bolts(v)}"
    ),
    FindingCode.HOLE_ON_ROOT_RADIUS: lambda v, m, lim: (
        f"hole edge reaches the column root radius (bolt centre {m:.0f} mm from it)"
    ),
    FindingCode.NO_SPANNER_ROOM: lambda v, m, lim: (
        f"bolt centre {m:.0f} mm from the root radius: no room for the nut and washer"
    ),
    FindingCode.WELD_TOO_SMALL: lambda v, m, lim: (
        f"{str(v['location']).replace('_', ' ')} weld a = {m:.1f} mm, below the "
        f"{lim:.1f} mm of a full-strength weld on the {v['t']:g} mm part"
    ),
    FindingCode.VALUE_NOT_USABLE: lambda v, m, lim: (
        f"{v['what']} of {v['entity']} is {m:g} mm: a dimension must be positive, the value "
        "is not used and the joint is not checked"
    ),
    FindingCode.BOLT_TOO_SHORT: lambda v, m, lim: (
        f"{v['count']} bolt(s) {m:.0f} mm long for a {v['grip']:.0f} mm grip (need {lim:.0f})"
    ),
}

#: What an unchecked joint's problem says it lacks.
UNCHECKED_WHAT = {
    Status.NO_DEMANDS: "no design forces given",
    Status.UNSUPPORTED: "outside what ifcjoint checks",
    Status.UNREADABLE: "data missing in the model",
}

#: Units of a verification as printed: (unit, N or N mm per printed unit).
UNITS = {
    Verification.MOMENT: ("kNm", 1e6),
    Verification.SHEAR: ("kN", 1e3),
    Verification.WEB_PANEL_SHEAR: ("kN", 1e3),
    Verification.BENDING_AND_AXIAL: ("-", 1e3),
    Verification.DETAILING: ("mm", 1.0),
    Verification.TYING: ("kN", 1e3),
    Verification.SUPPORT_WEB_SHEAR: ("kN", 1e3),
    Verification.CONDITION: ("mm", 1.0),
}

#: Conditions of a design method (``engine.results.Condition.name``), in words.
CONDITIONS = {
    "punching": "fin plate no thicker than the supporting web can take without punching "
                "(t_p <= t_w f_u,w / (f_y,p gamma_M2))",
}


_TABLES: dict[type, Mapping] = {ReasonCode: REASONS, NotCheckedCode: NOT_CHECKED, NoteCode: NOTES}


def coded(c: Coded | None) -> str:
    """A code with its values, in words (empty for None)."""
    if c is None:
        return ""
    table: Mapping = _TABLES[type(c.code)]
    return table[c.code](c.values)


def not_checked(reason: NotChecked | None) -> str:
    """Why something was not checked, in words (empty when it was)."""
    return coded(reason)


def finding_message(f: Finding) -> str:
    """A finding in one sentence."""
    return FINDINGS[f.code](f.detail, f.measured, f.limit)


def component_name(c: Component | str, code: Eurocode3 = EN_1993_1_8) -> str:
    """What the design code calls a component."""
    return code.component_name(c)


def limit_words(limit: Limit | None, code: Eurocode3 = EN_1993_1_8) -> str:
    """What limited a bolt row or a joint, in words (``end plate in bending (row 1 alone)``)."""
    if limit is None:
        return ""
    s = limit.scope
    if s == LimitScope.TRIANGULAR:
        return f"triangular limit from row {limit.first} (6.2.7.2(9))"
    name = code.component_name(limit.component)
    if s == LimitScope.ALONE:
        return f"{name} (row {limit.first} alone)"
    if s == LimitScope.GROUP:
        return f"{name} (rows {limit.first}-{limit.last})"
    if s == LimitScope.COMPRESSION:
        return f"{name} (compression side)"
    return name


def verification_name(
    kind: Verification, sense: str, code: Eurocode3 = EN_1993_1_8,
    detail: Mapping[str, Any] | None = None,
) -> str:
    """What a utilisation compares, in words (``moment resistance Mj,Rd (hogging)``)."""
    if kind == Verification.DETAILING:
        return f"detailing: {finding_message((detail or {})['finding'])}"
    if kind == Verification.MOMENT:
        return f"moment resistance {code.symbol('M_j_Rd')} ({sense})"
    if kind == Verification.SHEAR:
        return f"shear resistance {code.symbol('V_j_Rd')}"
    if kind == Verification.WEB_PANEL_SHEAR:
        return code.component_name(Component.WEB_PANEL_SHEAR)
    if kind == Verification.TYING:
        return "tying resistance (axial tension, gamma_Mu)"
    if kind == Verification.SUPPORT_WEB_SHEAR:
        return "supporting web, local shear (both sides' reactions)"
    if kind == Verification.CONDITION:
        name = (detail or {}).get("condition", "")
        return CONDITIONS.get(name, name)
    return f"bending and axial {sense} (Eq. 6.24)"


def verification_detail(u, code: Eurocode3 = EN_1993_1_8) -> str:
    """The line under a utilisation: what governed, the lever arm, Nj,Rd, the rule's basis."""
    if u.verification == Verification.DETAILING:
        f = u.detail["finding"]
        return f"limit {f.limit:g}, measured {f.measured:g}; basis: {f.basis}" if (
            f.limit is not None and f.measured is not None) else f"basis: {f.basis}"
    if u.verification == Verification.MOMENT:
        if u.detail.get("no_tension") is not None:
            return coded(u.detail["no_tension"])
        return f"governed by {limit_words(u.detail.get('governing'), code)}"
    if u.verification == Verification.WEB_PANEL_SHEAR:
        return f"{code.symbol('V_wp_Ed')} by Eq. (5.3) with z = {u.detail['z']:.0f} mm"
    if u.verification == Verification.SUPPORT_WEB_SHEAR:
        other = u.detail.get("V_other")
        return ("this beam's reaction only (single-sided)" if other is None else
                f"with {abs(other) / 1e3:.1f} kN from the beam on the other side")
    if u.verification == Verification.CONDITION:
        return f"limit {u.resistance:.1f} mm, measured {u.demand:g} mm"
    if u.verification == Verification.BENDING_AND_AXIAL:
        return (
            f"Mj,Ed/Mj,Rd + Nj,Ed/Nj,Rd with {code.symbol('N_j_Rd')} = "
            f"{u.resistance / 1e3:.0f} kN"
        )
    return ""


__all__ = [
    "FINDINGS",
    "NOTES",
    "NOT_CHECKED",
    "REASONS",
    "STATUS_WORDS",
    "UNCHECKED_WHAT",
    "UNITS",
    "CONDITIONS",
    "ProblemKind",
    "coded",
    "component_name",
    "finding_message",
    "limit_words",
    "not_checked",
    "verification_detail",
    "verification_name",
]
