"""Check of a major-axis bolted end-plate beam-to-column joint, EN 1993-1-8 component method.

Pure Python over plain dataclasses (N, mm, MPa); never imports ifcopenshell. The result keeps
every component with its clause, inputs, resistance and governing mode, the row-by-row tension
resistances with what limited each row, Mj,Rd for both moment signs, Vj,Rd, Sj,ini and the
classification, and the complete input actually used, so the check can be repeated by hand.

Scope now: one column, one beam meeting its flange; extended or flush end plate, two bolts per
row; rolled or welded I/H sections; unstiffened column. Anything else returns a result that
says "not checked" with the reason (never a pass).
"""

from __future__ import annotations

import math
from dataclasses import asdict, dataclass, field

from ifcjoint.ec3 import components as cmp
from ifcjoint.ec3 import effective_lengths as el
from ifcjoint.ec3 import stiffness as stf
from ifcjoint.ec3.bolts import (
    ALPHA_V,
    B_p_Rd,
    F_b_Rd,
    F_t_Rd,
    F_v_Rd,
    alpha_b,
    k1_bearing,
)
from ifcjoint.ec3.moment_resistance import M_j_Rd, RowResult, distribute_tension
from ifcjoint.ec3.params import RECOMMENDED, Parameters
from ifcjoint.ec3.tstub import t_stub

#: Bolt head / nut across flats s and across points e (mm), ISO 4014 / ISO 4032 (from memory).
HEAD_SIZES = {
    12: (18.0, 19.85),
    16: (24.0, 26.17),
    20: (30.0, 32.95),
    22: (34.0, 37.29),
    24: (36.0, 39.55),
    27: (41.0, 45.2),
    30: (46.0, 50.85),
    36: (55.0, 60.79),
}
#: alpha of EN 1993-1-8 Figure 6.11 used when none is given: the chart's smallest value, 4.45,
#: which gives the shortest effective length (conservative). The chart itself is not yet
#: represented numerically; a value read from it may be passed in.
ALPHA_DEFAULT = 4.45


@dataclass(frozen=True, slots=True, kw_only=True)
class MemberInput:
    """A rolled or welded I section with its steel (mm, MPa)."""

    name: str
    grade: str
    h: float
    b: float
    tw: float
    tf: float
    r: float
    fy: float
    fu: float
    welded: bool = False
    span: float | None = None  # beam span for the stiffness classification, mm
    Iy: float | None = None  # noqa: N815 - second moment about the strong axis, mm4
    Wpl_y: float | None = None  # noqa: N815 - plastic modulus, mm3

    @property
    def s(self) -> float:
        """Root radius (rolled) or the weld allowance for welded sections (6.2.6.2)."""
        return self.r


@dataclass(frozen=True, slots=True, kw_only=True)
class PlateInput:
    """End plate (mm, MPa). Projections from the beam's outer flange faces; negative inside."""

    grade: str
    tp: float
    bp: float
    hp: float
    fy: float
    fu: float
    projection_top: float
    projection_bottom: float


@dataclass(frozen=True, slots=True, kw_only=True)
class BoltsInput:
    """Bolts, two per row (mm, MPa). Rows measured down from the beam's top face."""

    d: float
    grade: str
    fub: float
    As: float  # noqa: N815
    d0: float
    gauge: float
    rows_from_beam_top: tuple[float, ...]
    L_b: float | None = None  # noqa: N815 - bolt elongation length; None: no-prying check off


@dataclass(frozen=True, slots=True, kw_only=True)
class WeldsInput:
    """Weld throats a (mm) of the beam to the end plate; ``assumed`` when not modelled."""

    top_flange_throat: float
    bottom_flange_throat: float
    web_throat: float
    assumed: bool = True


@dataclass(frozen=True, slots=True, kw_only=True)
class EndPlateJointInput:
    """Everything the check uses, in N, mm, MPa."""

    column: MemberInput
    beam: MemberInput
    plate: PlateInput
    bolts: BoltsInput
    welds: WeldsInput
    params: Parameters = RECOMMENDED
    beta: float = 1.0  # transformation parameter (5.3(7), Table 5.4): 1 single-sided
    alpha: float | None = None  # Figure 6.11 for the row below the tension flange (fixed)
    alpha_method: str = "conservative"  # "conservative" (4.45) | "approximation" (Fig 6.11)
    column_continues_above: bool = True
    braced: bool = True
    stiffeners: tuple[str, ...] = ()
    supplementary_web_plates: tuple[str, ...] = ()
    stiffener_depths: tuple[float, ...] = ()  # transverse stiffeners, mm below the beam top
    washer_dia: float | None = None  # dw for the mode-1 alternative method; None: from d
    sigma_com_Ed: float = 0.0  # noqa: N815 - longitudinal compression in the column web, MPa


@dataclass(frozen=True, slots=True, kw_only=True)
class ComponentResult:
    """One component's resistance (N), its clause and how it was found."""

    clause: str
    name: str
    F_Rd: float  # noqa: N815
    mode: str = ""
    row: int | None = None
    rows: tuple[int, ...] = ()
    inputs: dict = field(default_factory=dict)

    def as_dict(self) -> dict:
        """Output-contract form (kN)."""
        return {
            "clause": self.clause,
            "name": self.name,
            "row": self.row,
            "rows": list(self.rows),
            "F_Rd_kN": round(float(self.F_Rd) / 1e3, 2),
            "mode": self.mode,
            "inputs": {
                k: (round(float(v), 3) if isinstance(v, (int, float)) else v)
                for k, v in self.inputs.items()
            },
        }


@dataclass(frozen=True, slots=True, kw_only=True)
class SideResult:
    """Resistance for one moment sign."""

    sign: str  # hogging (top in tension) | sagging (bottom in tension)
    M_j_Rd: float  # noqa: N815 - N mm
    z: float  # lever arm, mm (equivalent, 6.3.3.1)
    rows: tuple[RowResult, ...]
    components: tuple[ComponentResult, ...]
    S_j_ini: float  # noqa: N815 - N mm / rad
    governing: str
    F_t_half_Rd: float = 0.0  # noqa: N815 - tension of this half's rows, no compression limit, N
    F_c_flange_Rd: float = 0.0  # noqa: N815 - compression resistance at this sign's flange, N


@dataclass(frozen=True, slots=True, kw_only=True)
class CheckResult:
    """The joint check: both signs, shear, stiffness, classification, or why not checked."""

    status: str  # checked | not_checked
    reason: str = ""
    hogging: SideResult | None = None
    sagging: SideResult | None = None
    V_j_Rd: float | None = None  # noqa: N815
    V_wp_Rd: float | None = None  # noqa: N815
    classification: dict = field(default_factory=dict)
    notes: tuple[str, ...] = ()
    input: EndPlateJointInput | None = None
    welded_input: WeldedJointInput | None = None

    @property
    def N_j_Rd_tension(self) -> float | None:  # noqa: N802
        """Axial tension resistance of the joint with no moment, N (for 6.2.7.1(3)).

        Common practice, no source: every bolt row in tension, each half of the joint by the
        row distribution of 6.2.7.2 without the compression-side limit (welded: the flange
        tension components), both halves added.
        """
        if self.hogging is None or self.sagging is None:
            return None
        return self.hogging.F_t_half_Rd + self.sagging.F_t_half_Rd

    @property
    def N_j_Rd_compression(self) -> float | None:  # noqa: N802
        """Axial compression resistance of the joint with no moment, N (for 6.2.7.1(3)).

        Common practice, no source: both beam flanges bearing, each limited by the column web
        in compression and the beam flange and web in compression at that flange.
        """
        if self.hogging is None or self.sagging is None:
            return None
        return self.hogging.F_c_flange_Rd + self.sagging.F_c_flange_Rd

    @property
    def inputs(self) -> dict:
        """The complete input used (mm, MPa), as plain data."""
        inp = self.input if self.input is not None else self.welded_input
        return _inputs_dict(inp) if inp is not None else {}

    def as_dict(self) -> dict:
        """The output contract (kN, kNm, kNm/rad, mm)."""
        if self.status != "checked":
            return {"status": self.status, "reason": self.reason, "inputs": self.inputs}
        h, s = self.hogging, self.sagging
        return {
            "status": self.status,
            "resistance": {
                "Mj_Rd_hogging_kNm": round(float(h.M_j_Rd) / 1e6, 2),
                "Mj_Rd_sagging_kNm": round(float(s.M_j_Rd) / 1e6, 2) if s else None,
                "Vj_Rd_kN": round(float(self.V_j_Rd) / 1e3, 2),
                "Vwp_Rd_kN": round(float(self.V_wp_Rd) / 1e3, 2),
                "Nj_Rd_tension_kN": round(float(self.N_j_Rd_tension) / 1e3, 2),
                "Nj_Rd_compression_kN": round(float(self.N_j_Rd_compression) / 1e3, 2),
                "Sj_ini_kNm_per_rad": _finite(h.S_j_ini, 1e6, 1),
                "Sj_ini_sagging_kNm_per_rad": _finite(s.S_j_ini, 1e6, 1) if s else None,
                "z_mm": round(float(h.z), 1),
            },
            "components": [c.as_dict() for c in h.components],
            "tension_rows": [
                {
                    "row": r.row,
                    "h_r_mm": round(float(r.h_r), 1),
                    "F_tr_Rd_kN": round(float(r.F_tr_Rd) / 1e3, 2),
                    "limited_by": r.limited_by,
                    "candidates_kN": {
                        k: round(float(v) / 1e3, 2) for k, v in r.candidates.items()
                    },
                }
                for r in h.rows
            ],
            "sagging": None
            if s is None
            else {
                "components": [c.as_dict() for c in s.components],
                "tension_rows": [
                    {
                        "row": r.row,
                        "h_r_mm": round(float(r.h_r), 1),
                        "F_tr_Rd_kN": round(float(r.F_tr_Rd) / 1e3, 2),
                        "limited_by": r.limited_by,
                    }
                    for r in s.rows
                ],
            },
            "classification": self.classification,
            "m_phi": {
                "hogging": [[round(f, 6), round(m / 1e6, 2)] for f, m in self.m_phi("hogging")],
                "sagging": [[round(f, 6), round(m / 1e6, 2)] for f, m in self.m_phi("sagging")],
            },
            "notes": list(self.notes),
            "inputs": self.inputs,
        }

    def m_phi(self, sign: str = "hogging") -> list[tuple[float, float]]:
        """Design M-phi curve (rad, N mm) for one sign, EN 1993-1-8 6.3.1(4)."""
        side = self.hogging if sign == "hogging" else self.sagging
        if side is None or side.S_j_ini <= 0 or not math.isfinite(side.S_j_ini):
            return []
        kind = "welded" if self.welded_input is not None else "bolted_end_plate"
        return stf.m_phi_curve(side.M_j_Rd, side.S_j_ini, kind)


def _finite(x: float, scale: float, digits: int) -> float | None:
    """The value divided by scale and rounded; None when infinite (nothing flexible)."""
    return round(float(x) / scale, digits) if math.isfinite(x) else None


def _not_checked(reason: str, inp: EndPlateJointInput | None = None) -> CheckResult:
    return CheckResult(status="not_checked", reason=reason, input=inp)


def _inputs_dict(inp) -> dict:
    """The input as the output contract names it (mm, MPa)."""
    d = asdict(inp)
    d["params"] = inp.params.as_dict()
    d["beam"]["span_mm"] = d["beam"].pop("span")
    w = d["welds"]
    w["flange_throat"] = max(w["top_flange_throat"], w["bottom_flange_throat"])
    return d


def check_end_plate_joint(inp: EndPlateJointInput) -> CheckResult:
    """Resistance, stiffness and classification of a bolted end-plate joint.

    EN 1993-1-8:2005, 6.2.7.2 (Mj,Rd by the component method, both moment signs), 6.2.2 and
    Table 3.4 (Vj,Rd), 6.3 (Sj,ini), 5.2.2 and 5.2.3 (classification). Out-of-scope layouts
    return ``not_checked`` with the reason.
    """
    why = _out_of_scope(inp)
    if why:
        return _not_checked(why, inp)
    notes = []
    notes.extend(_weld_notes(inp.welds))
    if inp.alpha is None and inp.alpha_method == "approximation":
        notes.append(
            "alpha (EN 1993-1-8 Fig 6.11) from a closed-form representation of the chart "
            "recalled from memory (7.36 where the published example reads 7.5); values per row "
            "in the end-plate components"
        )
    elif inp.alpha is None:
        notes.append(
            f"alpha (EN 1993-1-8 Fig 6.11) taken as {ALPHA_DEFAULT} (the chart's lowest "
            "value, conservative); --alpha approximation uses a representation of the chart"
        )
    if inp.bolts.L_b is None:
        notes.append("bolt elongation length not known: prying assumed (Table 6.2)")
    notes.extend(_column_plate_notes(inp))
    col = inp.column
    p = inp.params
    a_vc = _shear_area(col)
    vwp = cmp.V_wp_Rd(col.fy, a_vc, p)
    hog = _side(inp, "hogging", a_vc, vwp)
    sag = _side(inp, "sagging", a_vc, vwp)
    vjrd, vnote = _shear(inp, hog)
    notes.append(vnote)
    cls = _classify(inp, hog, sag)
    return CheckResult(
        status="checked",
        hogging=hog,
        sagging=sag,
        V_j_Rd=vjrd,
        V_wp_Rd=vwp,
        classification=cls,
        notes=tuple(notes),
        input=inp,
    )


def _classify(inp, hog: SideResult, sag: SideResult) -> dict:
    """Stiffness class (EN 1993-1-8 5.2.2.5) and strength class per sign (5.2.3.3)."""
    beam, col, p = inp.beam, inp.column, inp.params
    cls: dict = {}
    if beam.span and beam.Iy:
        c_s, bounds = stf.classify_stiffness(
            hog.S_j_ini, beam.Iy, beam.span, braced=inp.braced, params=p
        )
        cls["stiffness"] = c_s
        cls["kb"] = bounds["kb"]
        cls["rigid_from_kNm_per_rad"] = round(bounds["rigid_from"] / 1e6, 1)
        cls["pinned_up_to_kNm_per_rad"] = round(bounds["pinned_up_to"] / 1e6, 1)
    else:
        cls["stiffness"] = "not classified: beam span or Iy unknown"
    if beam.Wpl_y and col.Wpl_y:
        mpl_b = beam.Wpl_y * beam.fy / p.gamma_M0
        mpl_c = col.Wpl_y * col.fy / p.gamma_M0
        for key, side in (("strength", hog), ("strength_sagging", sag)):
            c_r, limit = stf.classify_strength(
                side.M_j_Rd, mpl_b, mpl_c, column_continues_above=inp.column_continues_above
            )
            cls[key] = c_r
        cls["full_strength_from_kNm"] = round(float(limit) / 1e6, 1)
    else:
        cls["strength"] = "not classified: plastic moduli unknown"
    return cls


def _out_of_scope(inp: EndPlateJointInput) -> str:
    col, beam, b = inp.column, inp.beam, inp.bolts
    if len(b.rows_from_beam_top) < 2:
        return "fewer than two bolt rows"
    dc = col.h - 2 * col.tf - 2 * col.r
    if not cmp.web_panel_slenderness_ok(dc, col.tw, col.fy):
        return (
            f"column web too slender for 6.2.6.1: dc/tw = {dc / col.tw:.1f} > 69 eps = "
            f"{69 * cmp.epsilon(col.fy):.1f}"
        )
    if b.gauge / 2 - col.tw / 2 - 0.8 * col.r <= 0:
        return "bolts inside the column's root radius: T-stub geometry undefined"
    if beam.h <= 0 or col.h <= 0:
        return "section dimensions missing"
    return ""


#: How far (mm, beyond half the flange thickness) a transverse stiffener may sit from a beam
#: flange's mid-plane and still count as the stiffener of that flange (common practice).
STIFFENER_REACH = 25.0


def stiffened_at(depths: tuple[float, ...], flange_depth: float, t_f: float) -> bool:
    """Whether a transverse column stiffener lines up with a beam flange.

    Common practice, no source: within t_f / 2 + 25 mm of the flange's mid-plane.
    """
    return any(abs(d - flange_depth) <= t_f / 2 + STIFFENER_REACH for d in depths)


def _weld_notes(w: WeldsInput) -> list[str]:
    """Say so when the weld throats were assumed rather than read from the model."""
    if not w.assumed:
        return []
    return [
        f"weld throats assumed (not modelled): flanges a = {w.top_flange_throat:g} / "
        f"{w.bottom_flange_throat:g} mm, web a = {w.web_throat:g} mm"
    ]


def _column_plate_notes(inp) -> list[str]:
    """What the check does with column stiffeners and web plates (EN 1993-1-8 6.2.6, 6.3.2)."""
    notes = []
    if inp.stiffeners:
        notes.append(
            f"{len(inp.stiffeners)} transverse column stiffener(s): the resistances are those "
            "of the unstiffened column (stiffeners ignored, on the safe side: a stiffener cannot "
            "lower the plastic resistance); stiffness with k2 = infinite where the compression "
            "flange and k3 = infinite for the rows next to a tension flange that a stiffener "
            "lines up with (Table 6.11, stiffened web)"
        )
    if inp.supplementary_web_plates:
        notes.append(
            f"{len(inp.supplementary_web_plates)} supplementary web plate(s): ignored "
            "(6.2.6.1(6)-(8) would raise Avc and the web resistances; on the safe side), "
            "stiffness of the unreinforced web"
        )
    return notes


def _shear_area(s: MemberInput) -> float:
    """Avc of a rolled (EN 1993-1-1 6.2.6(3)a) or welded (hw tw) section, mm2."""
    hw = s.h - 2 * s.tf
    if s.welded:
        return hw * s.tw
    a = 2 * s.b * s.tf + hw * s.tw + (4 - math.pi) * s.r**2
    return max(a - 2 * s.b * s.tf + (s.tw + 2 * s.r) * s.tf, hw * s.tw)


def _dw(inp: EndPlateJointInput) -> float:
    if inp.washer_dia:
        return inp.washer_dia
    s_e = HEAD_SIZES.get(int(round(inp.bolts.d)))
    return s_e[1] if s_e else 1.65 * inp.bolts.d


def _dm(inp: EndPlateJointInput) -> float:
    s_e = HEAD_SIZES.get(int(round(inp.bolts.d)))
    return (s_e[0] + s_e[1]) / 2 if s_e else 1.6 * inp.bolts.d


def _side(inp: EndPlateJointInput, sign: str, a_vc: float, vwp: float) -> SideResult:
    """One moment sign: tension rows, components, distribution, Mj,Rd and Sj,ini."""
    col, beam, pl, b, w, p = inp.column, inp.beam, inp.plate, inp.bolts, inp.welds, inp.params
    # Geometry measured from the flange in tension: for sagging, mirror about mid-depth.
    if sign == "hogging":
        rows = list(b.rows_from_beam_top)
        proj, comp_proj = pl.projection_top, pl.projection_bottom
        a_t, a_c = w.top_flange_throat, w.bottom_flange_throat
    else:
        rows = sorted(beam.h - z for z in b.rows_from_beam_top)
        proj, comp_proj = pl.projection_bottom, pl.projection_top
        a_t, a_c = w.bottom_flange_throat, w.top_flange_throat
    cc = beam.h - beam.tf / 2  # centre of compression from the tension face
    # Tension rows: the half of the lever arm nearest the tension flange (common practice, no
    # source: rows near the compression flange are taken as shear rows).
    tension = [z for z in rows if cc - z > (beam.h - beam.tf) / 2]
    h_r = [cc - z for z in tension]
    ft = F_t_Rd(b.fub, b.As, p)
    bp_col = B_p_Rd(_dm(inp), col.tf, col.fu, p)
    bp_pl = B_p_Rd(_dm(inp), pl.tp, pl.fu, p)
    ft_row = 2 * min(ft, bp_col, bp_pl)
    ew = _dw(inp) / 4
    leg_f = a_t * math.sqrt(2)
    leg_w = w.web_throat * math.sqrt(2)
    m_c = b.gauge / 2 - col.tw / 2 - 0.8 * col.r
    e_c = (col.b - b.gauge) / 2
    m_p = b.gauge / 2 - beam.tw / 2 - 0.8 * leg_w
    e_p = (pl.bp - b.gauge) / 2
    lam_base = m_p + e_p

    def alpha_for(z_row: float) -> float:
        """Alpha for the first row below the tension flange at z_row from the tension face."""
        if inp.alpha is not None:
            return inp.alpha
        if inp.alpha_method != "approximation" or lam_base <= 0:
            return ALPHA_DEFAULT
        m2 = z_row - beam.tf - 0.8 * leg_f
        return el.alpha_fig_6_11(m_p / lam_base, max(m2, 0.0) / lam_base)

    alpha = ALPHA_DEFAULT

    def col_tstub(cp: float, nc: float, n_rows: int):
        """Column flange T-stub of n_rows rows (6.2.6.4, Table 6.2)."""
        return t_stub(
            l_eff_1=min(cp, nc),
            l_eff_2=nc,
            tf=col.tf,
            fy=col.fy,
            m=m_c,
            e_min=e_c,
            sum_F_t_Rd=ft_row * n_rows,
            e_w=ew,
            params=p,
        )

    def plate_tstub(cp: float, nc: float, m: float, e_min: float, n_rows: int):
        """End plate T-stub of n_rows rows (6.2.6.5, Table 6.2)."""
        return t_stub(
            l_eff_1=min(cp, nc),
            l_eff_2=nc,
            tf=pl.tp,
            fy=pl.fy,
            m=m,
            e_min=e_min,
            sum_F_t_Rd=ft_row * n_rows,
            e_w=ew,
            params=p,
        )

    comps: list[ComponentResult] = []
    alone: list[dict[str, float]] = []
    kinds = []
    # The column side of a row alone is the same for every row of an unstiffened column.
    cp, nc = el.column_flange_row_alone(m_c, e_c)
    ts = col_tstub(cp, nc, 1)
    om_alone = cmp.omega(inp.beta, min(cp, nc), col.tw, a_vc)
    fwc_alone = cmp.F_t_wc_Rd(
        b_eff=min(cp, nc), t_wc=col.tw, fy_wc=col.fy, omega_=om_alone, params=p
    )
    for i, z in enumerate(tension, start=1):
        d: dict[str, float] = {}
        d["column flange in bending"] = ts.F_T_Rd
        comps.append(
            ComponentResult(
                clause="6.2.6.4",
                name="column flange in bending",
                F_Rd=ts.F_T_Rd,
                mode=ts.mode,
                row=i,
                inputs={"l_eff_cp": cp, "l_eff_nc": nc, "m": m_c, "e": e_c},
            )
        )
        om, fwc = om_alone, fwc_alone
        d["column web in tension"] = fwc
        comps.append(
            ComponentResult(
                clause="6.2.6.3",
                name="column web in tension",
                F_Rd=fwc,
                row=i,
                inputs={"b_eff": min(cp, nc), "omega": om},
            )
        )
        if z < 0:  # extension row (outside the tension flange)
            kinds.append("extension")
            mx = -z - 0.8 * leg_f
            ex = proj + z if proj is not None else -z
            cpp, ncp = el.end_plate_extension_row(mx, ex, e_p, b.gauge, pl.bp)
            tsp = plate_tstub(cpp, ncp, mx, min(ex, e_p), 1)
            d["end plate in bending"] = tsp.F_T_Rd
            comps.append(
                ComponentResult(
                    clause="6.2.6.5",
                    name="end plate in bending",
                    F_Rd=tsp.F_T_Rd,
                    mode=tsp.mode,
                    row=i,
                    inputs={"l_eff_cp": cpp, "l_eff_nc": ncp, "mx": mx, "ex": ex},
                )
            )
        else:
            first = not kinds or kinds[-1] == "extension"
            kinds.append("first" if first else "other")
            if first:
                alpha = alpha_for(z)
                cpp, ncp = el.end_plate_first_row_below_flange(m_p, e_p, alpha)
            else:
                cpp, ncp = el.end_plate_other_row(m_p, e_p)
            tsp = plate_tstub(cpp, ncp, m_p, e_p, 1)
            d["end plate in bending"] = tsp.F_T_Rd
            comps.append(
                ComponentResult(
                    clause="6.2.6.5",
                    name="end plate in bending",
                    F_Rd=tsp.F_T_Rd,
                    mode=tsp.mode,
                    row=i,
                    inputs={
                        "l_eff_cp": cpp,
                        "l_eff_nc": ncp,
                        "m": m_p,
                        "e": e_p,
                        "alpha": alpha if first else None,
                    },
                )
            )
            fwb = cmp.F_t_wb_Rd(b_eff=min(cpp, ncp), t_wb=beam.tw, fy_wb=beam.fy, params=p)
            d["beam web in tension"] = fwb
            comps.append(
                ComponentResult(
                    clause="6.2.6.8",
                    name="beam web in tension",
                    F_Rd=fwb,
                    row=i,
                    inputs={"b_eff": min(cpp, ncp)},
                )
            )
        alone.append(d)
    groups: dict[tuple[int, int], dict[str, float]] = {}
    n = len(tension)
    for i in range(1, n + 1):
        for j in range(i + 1, n + 1):
            g: dict[str, float] = {}
            cp_s = nc_s = 0.0
            for k in range(i, j + 1):
                share = _pitch_share(tension, i, j, k)
                a_, b_ = el.column_flange_row_in_group(m_c, e_c, share, end_row=k in (i, j))
                cp_s, nc_s = cp_s + a_, nc_s + b_
            ts = col_tstub(cp_s, nc_s, (j - i + 1))
            g["column flange in bending"] = ts.F_T_Rd
            om = cmp.omega(inp.beta, min(cp_s, nc_s), col.tw, a_vc)
            g["column web in tension"] = cmp.F_t_wc_Rd(
                b_eff=min(cp_s, nc_s), t_wc=col.tw, fy_wc=col.fy, omega_=om, params=p
            )
            comps.append(
                ComponentResult(
                    clause="6.2.6.4",
                    name="column flange in bending",
                    F_Rd=ts.F_T_Rd,
                    mode=ts.mode,
                    rows=tuple(range(i, j + 1)),
                    inputs={"sum_l_eff_cp": cp_s, "sum_l_eff_nc": nc_s},
                )
            )
            if all(kinds[k - 1] != "extension" for k in range(i, j + 1)):
                cp_s = nc_s = 0.0
                for k in range(i, j + 1):
                    share = _pitch_share(tension, i, j, k)
                    if kinds[k - 1] == "first" and k == i:
                        a_, b_ = el.end_plate_first_row_below_flange(m_p, e_p, alpha, p=share)
                    else:
                        a_, b_ = el.end_plate_other_row(m_p, e_p, p=share, end_row=k in (i, j))
                    cp_s, nc_s = cp_s + a_, nc_s + b_
                tsp = plate_tstub(cp_s, nc_s, m_p, e_p, (j - i + 1))
                g["end plate in bending"] = tsp.F_T_Rd
                g["beam web in tension"] = cmp.F_t_wb_Rd(
                    b_eff=min(cp_s, nc_s), t_wb=beam.tw, fy_wb=beam.fy, params=p
                )
                comps.append(
                    ComponentResult(
                        clause="6.2.6.5",
                        name="end plate in bending",
                        F_Rd=tsp.F_T_Rd,
                        mode=tsp.mode,
                        rows=tuple(range(i, j + 1)),
                        inputs={"sum_l_eff_cp": cp_s, "sum_l_eff_nc": nc_s},
                    )
                )
            groups[(i, j)] = g
    # compression side
    # 45-degree spread through the plate: tp on the beam side, and up to tp more where the
    # plate projects beyond the compression flange (6.2.6.2(1), s_p between tp and 2 tp).
    s_p = pl.tp + min(max(comp_proj, 0.0), pl.tp)
    beff = cmp.b_eff_c_wc_end_plate(beam.tf, a_c, col.tf, col.s, s_p)
    dwc = col.h - 2 * (col.tf + col.r)
    om_c = cmp.omega(inp.beta, beff, col.tw, a_vc)
    kwc = cmp.k_wc(inp.sigma_com_Ed, col.fy)
    fcwc = cmp.F_c_wc_Rd(
        b_eff=beff, t_wc=col.tw, d_wc=dwc, fy_wc=col.fy, omega_=om_c, k_wc_=kwc, params=p
    )
    wpl = beam.Wpl_y or _wpl(beam)
    fcfb = cmp.F_c_fb_Rd(wpl * beam.fy / p.gamma_M0, beam.h, beam.tf)
    compression = {"column web in compression": fcwc, "beam flange and web in compression": fcfb}
    comps.append(
        ComponentResult(
            clause="6.2.6.2",
            name="column web in compression",
            F_Rd=fcwc,
            inputs={"b_eff_c_wc": beff, "omega": om_c, "s_p": s_p, "k_wc": kwc},
        )
    )
    comps.append(
        ComponentResult(
            clause="6.2.6.7",
            name="beam flange and web in compression",
            F_Rd=fcfb,
            inputs={"Mc_Rd": wpl * beam.fy / p.gamma_M0},
        )
    )
    if inp.beta > 0:
        compression["column web panel in shear / beta"] = vwp / inp.beta
    comps.append(
        ComponentResult(
            clause="6.2.6.1",
            name="column web panel in shear",
            F_Rd=vwp,
            inputs={"A_vc": a_vc, "beta": inp.beta},
        )
    )
    rr = distribute_tension(h=h_r, alone=alone, groups=groups, compression=compression, F_t_Rd=ft)
    mj = M_j_Rd(rr)
    # For the axial resistance (6.2.7.1(3)): the same rows with no compression-side limit and
    # no triangular limit (6.2.7.2(9) concerns the bending distribution only).
    rr_n = distribute_tension(
        h=h_r, alone=alone, groups=groups, compression={}, F_t_Rd=float("inf"), explain=False
    )
    gov = min(rr, key=lambda r: r.F_tr_Rd).limited_by if rr else ""
    # stiffness (6.3): per row k3, k4, k5, k10; k1, k2 for the compression side
    lb = b.L_b or (pl.tp + col.tf + 8.0 + 0.5 * (0.65 * b.d + 0.8 * b.d))
    keff = []
    # Stiffeners (Table 6.11, stiffened web): at the compression flange k2 = infinite; at the
    # tension flange k3 = infinite for the nearest row on each side of it.
    comp_depth = beam.h - beam.tf / 2 if sign == "hogging" else beam.tf / 2
    tens_depth = beam.tf / 2 if sign == "hogging" else beam.h - beam.tf / 2
    comp_stiff = stiffened_at(inp.stiffener_depths, comp_depth, beam.tf)
    tens_stiff = stiffened_at(inp.stiffener_depths, tens_depth, beam.tf)
    # rows are measured from the tension face here: the flange sits at tf / 2
    above = [k for k, z in enumerate(tension) if z < beam.tf / 2]
    below = [k for k, z in enumerate(tension) if z >= beam.tf / 2]
    next_to_stiffener = set()
    if tens_stiff:
        next_to_stiffener = {above[-1]} if above else set()
        next_to_stiffener |= {below[0]} if below else set()
    for i in range(len(tension)):
        cp, nc = el.column_flange_row_alone(m_c, e_c)
        lmin = min(cp, nc)
        k3 = (
            float("inf")
            if i in next_to_stiffener
            else stf.k3_web_tension(lmin, col.tw, dwc)
        )
        k4 = stf.k4_column_flange(lmin, col.tf, m_c)
        c_a = [c for c in comps if c.name == "end plate in bending" and c.row == i + 1][0]
        lp = min(c_a.inputs["l_eff_cp"], c_a.inputs["l_eff_nc"])
        mm = c_a.inputs.get("mx") or c_a.inputs.get("m")
        k5 = stf.k5_end_plate(lp, pl.tp, mm)
        k10 = stf.k10_bolts(b.As, lb)
        keff.append(stf.k_eff_row([k3, k4, k5, k10]))
    if len(keff) >= 1:
        zeq, keq = stf.equivalent_lever_arm(keff, h_r)
    else:
        zeq, keq = cc, float("inf")
    k1 = stf.k1_web_panel(a_vc, inp.beta, zeq)
    k2 = float("inf") if comp_stiff else stf.k2_web_compression(beff, col.tw, dwc)
    sj = stf.S_j_ini(zeq, [k1, k2, keq], p)
    return SideResult(
        sign=sign,
        M_j_Rd=mj,
        z=zeq,
        rows=tuple(rr),
        components=tuple(comps),
        S_j_ini=sj,
        governing=gov,
        F_t_half_Rd=sum(r.F_tr_Rd for r in rr_n),
        F_c_flange_Rd=min(fcwc, fcfb),
    )


def _pitch_share(rows: list[float], i: int, j: int, k: int) -> float:
    """Pitch share of row k in group i..j (1-based).

    End rows take the pitch to their neighbour, inner rows the mean of their two pitches.
    """
    z = rows
    if k == i:
        return z[i] - z[i - 1]
    if k == j:
        return z[j - 1] - z[j - 2]
    return (z[k] - z[k - 2]) / 2


def _wpl(s: MemberInput) -> float:
    """Plastic modulus of an I section with root radius (as ifcjoint.engine.sections)."""
    from ifcjoint.engine.sections import ISection

    return ISection(h=s.h, b=s.b, tw=s.tw, tf=s.tf, r=s.r).Wpl_y


def _shear(inp: EndPlateJointInput, hog: SideResult) -> tuple[float, str]:
    """Vj,Rd of the bolt group (EN 1993-1-8 Table 3.4 and 3.6.1; 6.2.2(2) note).

    Common practice: bolts in tension rows take (1 - 1/1.4) Fv,Rd (the interaction of Table 3.4
    with Ft,Ed = Ft,Rd); the other rows their full shear and bearing resistance.
    """
    b, p = inp.bolts, inp.params
    fv = F_v_Rd(b.grade, b.fub, b.As, p) if b.grade in ALPHA_V else 0.0
    # Bearing (Table 3.4) on the end plate and on the column flange, load downwards: end
    # distances to the plate's edges, the smallest pitch, side edge and gauge.
    rows = sorted(b.rows_from_beam_top)
    pl, col = inp.plate, inp.column
    p1 = min((y - x for x, y in zip(rows, rows[1:], strict=False)), default=None)
    e1 = min(rows[0] + pl.projection_top, pl.projection_bottom + inp.beam.h - rows[-1])
    fb_plate = F_b_Rd(
        k1_bearing(d0=b.d0, e2=(pl.bp - b.gauge) / 2, p2=b.gauge),
        alpha_b(d0=b.d0, fub=b.fub, fu=pl.fu, e1=e1, p1=p1),
        pl.fu,
        b.d,
        pl.tp,
        p,
    )
    fb_col = F_b_Rd(
        k1_bearing(d0=b.d0, e2=(col.b - b.gauge) / 2, p2=b.gauge),
        alpha_b(d0=b.d0, fub=b.fub, fu=col.fu, p1=p1),
        col.fu,
        b.d,
        col.tf,
        p,
    )
    fb = min(fb_plate, fb_col)
    per_bolt = min(fv, fb)
    n_tension = len(hog.rows)
    n_rows = len(b.rows_from_beam_top)
    v = 2 * n_tension * (1 - 1 / 1.4) * per_bolt + 2 * (n_rows - n_tension) * per_bolt
    note = (
        f"Vj,Rd: {2 * (n_rows - n_tension)} bolt(s) in shear rows at "
        f"{per_bolt / 1e3:.1f} kN, {2 * n_tension} in tension rows at (1 - 1/1.4) of that "
        "(Table 3.4 interaction, common practice); bearing (Table 3.4) on the plate "
        f"{fb_plate / 1e3:.0f} kN and on the column flange {fb_col / 1e3:.0f} kN per bolt"
    )
    return v, note


@dataclass(frozen=True, slots=True, kw_only=True)
class WeldedJointInput:
    """A beam welded to a column flange (N, mm, MPa)."""

    column: MemberInput
    beam: MemberInput
    welds: WeldsInput
    params: Parameters = RECOMMENDED
    beta: float = 1.0
    column_continues_above: bool = True
    braced: bool = True
    stiffeners: tuple[str, ...] = ()
    supplementary_web_plates: tuple[str, ...] = ()
    stiffener_depths: tuple[float, ...] = ()  # transverse stiffeners, mm below the beam top
    sigma_com_Ed: float = 0.0  # noqa: N815 - longitudinal compression in the column web, MPa


def check_welded_joint(inp: WeldedJointInput) -> CheckResult:
    """Resistance, stiffness and classification of a welded beam-to-column joint.

    EN 1993-1-8:2005, 6.2.7.2 with the welded components: column web panel in shear
    (6.2.6.1), column web in compression (6.2.6.2, Eq. 6.10) and in tension (6.2.6.3,
    Eq. 6.16), column flange in bending (6.2.6.4.3), beam flange and web in compression
    (6.2.6.7), the beam flange welds (4.5.3.3); lever arm h - t_fb (Figure 6.15);
    Sj,ini from k1, k2, k3 (6.3.1, Table 6.11); Vj,Rd from the web welds.
    """
    col, beam, w, p = inp.column, inp.beam, inp.welds, inp.params
    dc = col.h - 2 * col.tf - 2 * col.r
    if not cmp.web_panel_slenderness_ok(dc, col.tw, col.fy):
        return _not_checked("column web too slender for 6.2.6.1")
    a_vc = _shear_area(col)
    vwp = cmp.V_wp_Rd(col.fy, a_vc, p)
    z = beam.h - beam.tf
    sides = []
    for sign, a_t, a_c in (
        ("hogging", w.top_flange_throat, w.bottom_flange_throat),
        ("sagging", w.bottom_flange_throat, w.top_flange_throat),
    ):
        comps = []
        beff_c = cmp.b_eff_c_wc_welded(beam.tf, a_c, col.tf, col.s)
        beff_t = cmp.b_eff_c_wc_welded(beam.tf, a_t, col.tf, col.s)
        fcwc = cmp.F_c_wc_Rd(
            b_eff=beff_c,
            t_wc=col.tw,
            d_wc=dc,
            fy_wc=col.fy,
            omega_=cmp.omega(inp.beta, beff_c, col.tw, a_vc),
            k_wc_=cmp.k_wc(inp.sigma_com_Ed, col.fy),
            params=p,
        )
        ftwc = cmp.F_t_wc_Rd(
            b_eff=beff_t,
            t_wc=col.tw,
            fy_wc=col.fy,
            omega_=cmp.omega(inp.beta, beff_t, col.tw, a_vc),
            params=p,
        )
        bfc = cmp.b_eff_b_fc_welded(col.tw, col.s, col.tf, beam.tf, col.fy, beam.fy)
        ffc = cmp.F_fc_Rd_welded(bfc, beam.tf, beam.fy, p)
        wpl = beam.Wpl_y or _wpl(beam)
        fcfb = cmp.F_c_fb_Rd(wpl * beam.fy / p.gamma_M0, beam.h, beam.tf)
        fvw = cmp.f_vw_d(min(beam.fu, col.fu), cmp.BETA_W.get(beam.grade, 1.0), p)
        fweld = 2 * a_t * beam.b * fvw  # double fillet along the flange width
        for clause, name, f, extra in (
            ("6.2.6.2", "column web in compression", fcwc, {"b_eff_c_wc": beff_c}),
            ("6.2.6.3", "column web in tension", ftwc, {"b_eff_t_wc": beff_t}),
            ("6.2.6.4.3", "column flange in bending", ffc, {"b_eff_b_fc": bfc}),
            ("6.2.6.7", "beam flange and web in compression", fcfb, {}),
            ("4.5.3.3", "beam flange weld", fweld, {"a": a_t, "f_vw_d": fvw}),
            (
                "6.2.6.1",
                "column web panel in shear / beta",
                vwp / inp.beta if inp.beta > 0 else float("inf"),
                {"A_vc": a_vc},
            ),
        ):
            comps.append(ComponentResult(clause=clause, name=name, F_Rd=f, inputs=extra))
        gov = min(comps, key=lambda c: c.F_Rd)
        f_t = gov.F_Rd
        row = RowResult(
            row=1,
            h_r=z,
            F_tr_Rd=f_t,
            limited_by=gov.name,
            candidates={c.name: c.F_Rd for c in comps},
        )
        k1 = stf.k1_web_panel(a_vc, inp.beta, z)
        d_t = beam.tf / 2 if sign == "hogging" else beam.h - beam.tf / 2
        d_c = beam.h - beam.tf / 2 if sign == "hogging" else beam.tf / 2
        k2 = (
            float("inf")
            if stiffened_at(inp.stiffener_depths, d_c, beam.tf)
            else stf.k2_web_compression(beff_c, col.tw, dc)
        )
        k3 = (
            float("inf")
            if stiffened_at(inp.stiffener_depths, d_t, beam.tf)
            else stf.k3_web_tension(beff_t, col.tw, dc)
        )
        sj = stf.S_j_ini(z, [k1, k2, k3], p)
        sides.append(
            SideResult(
                sign=sign,
                M_j_Rd=f_t * z,
                z=z,
                rows=(row,),
                components=tuple(comps),
                S_j_ini=sj,
                governing=gov.name,
                F_t_half_Rd=min(ftwc, ffc, fweld),
                F_c_flange_Rd=min(fcwc, fcfb),
            )
        )
    hog, sag = sides
    fvw_web = cmp.f_vw_d(min(beam.fu, col.fu), cmp.BETA_W.get(beam.grade, 1.0), p)
    vjrd = 2 * w.web_throat * (beam.h - 2 * beam.tf) * fvw_web
    notes = ["Vj,Rd: double fillet web welds over h - 2 tf (4.5.3.3 simplified method)"]
    notes.extend(_column_plate_notes(inp))
    notes.extend(_weld_notes(w))
    cls = _classify(inp, hog, sag)
    return CheckResult(
        status="checked",
        hogging=hog,
        sagging=sag,
        V_j_Rd=vjrd,
        V_wp_Rd=vwp,
        classification=cls,
        notes=tuple(notes),
        input=None,
        welded_input=inp,
    )
