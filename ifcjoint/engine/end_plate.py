"""Check of a major-axis bolted end-plate beam-to-column joint, EN 1993-1-8 component method.

Pure Python over plain dataclasses (N, mm, MPa); never imports ifcopenshell. The result keeps
every component with its clause, inputs, resistance and governing mode, the row-by-row tension
resistances with what limited each row, Mj,Rd for both moment signs, Vj,Rd, Sj,ini and the
classification, and the complete input actually used, so the check can be repeated by hand.

Scope: one column, one beam meeting its flange; extended or flush end plate, two bolts per
row; rolled or welded I/H sections; transverse stiffeners count for the stiffness only.
Anything else returns a result that says "not checked" with the reason (never a pass).
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

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
    bolt_elongation_length,
    k1_bearing,
)
from ifcjoint.ec3.code import EN_1993_1_8 as EC3
from ifcjoint.ec3.code import Component
from ifcjoint.ec3.moment_resistance import M_j_Rd, distribute_tension
from ifcjoint.ec3.tstub import TStubResult, t_stub
from ifcjoint.engine.common import (
    checked,
    column_plate_notes,
    plastic_modulus,
    shear_area,
    slender_web,
    stiffened_at,
    weld_notes,
)
from ifcjoint.engine.inputs import EndPlateJointInput
from ifcjoint.engine.results import CheckResult, ComponentResult, SideResult, not_checked
from ifcjoint.model.codes import NotChecked, NotCheckedCode, Note, NoteCode

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
#: which gives the shortest effective length (conservative). A value read from the chart may
#: be passed in; ``alpha_method="approximation"`` uses a representation of the chart.
ALPHA_DEFAULT = 4.45

_CFB = Component.COLUMN_FLANGE_BENDING
_CWT = Component.COLUMN_WEB_TENSION
_EPB = Component.END_PLATE_BENDING
_BWT = Component.BEAM_WEB_TENSION


def check_end_plate_joint(inp: EndPlateJointInput) -> CheckResult:
    """Resistance, stiffness and classification of a bolted end-plate joint.

    EN 1993-1-8:2005, 6.2.7.2 (Mj,Rd by the component method, both moment signs), 6.2.2 and
    Table 3.4 (Vj,Rd), 6.3 (Sj,ini), 5.2.2 and 5.2.3 (classification). Out-of-scope layouts
    return a not-checked result with the reason.
    """
    why = _out_of_scope(inp)
    if why is not None:
        return not_checked(why, inp)
    notes = [*weld_notes(inp.welds), *_alpha_note(inp)]
    if inp.bolts.L_b is None:
        notes.append(Note(NoteCode.PRYING_ASSUMED))
    notes.extend(column_plate_notes(inp))
    a_vc = shear_area(inp.column)
    vwp = cmp.V_wp_Rd(inp.column.fy, a_vc, inp.params)
    hog = _SideCheck(inp, "hogging", a_vc, vwp).result()
    sag = _SideCheck(inp, "sagging", a_vc, vwp).result()
    vjrd, vnote = _shear(inp, hog)
    notes.append(vnote)
    return checked(
        inp, hog, sag, V_j_Rd=vjrd, V_wp_Rd=vwp, notes=notes, joint_kind="bolted_end_plate"
    )


def _alpha_note(inp: EndPlateJointInput) -> list[Note]:
    """How alpha of Figure 6.11 was found, when it was not given."""
    if inp.alpha is not None:
        return []
    if inp.alpha_method == "approximation":
        return [Note(NoteCode.ALPHA_APPROXIMATION)]
    return [Note(NoteCode.ALPHA_CONSERVATIVE, {"alpha": ALPHA_DEFAULT})]


def _out_of_scope(inp: EndPlateJointInput) -> NotChecked | None:
    col, beam, b = inp.column, inp.beam, inp.bolts
    if len(b.rows_from_beam_top) < 2:
        return NotChecked(NotCheckedCode.FEWER_THAN_TWO_ROWS)
    slender = slender_web(col)
    if slender is not None:
        return slender
    if b.gauge / 2 - col.tw / 2 - 0.8 * col.r <= 0:
        return NotChecked(NotCheckedCode.BOLTS_IN_ROOT_RADIUS)
    if beam.h <= 0 or col.h <= 0:
        return NotChecked(NotCheckedCode.SECTION_DIMENSIONS_MISSING)
    return None


def _dw(inp: EndPlateJointInput) -> float:
    if inp.washer_dia:
        return inp.washer_dia
    s_e = HEAD_SIZES.get(int(round(inp.bolts.d)))
    return s_e[1] if s_e else 1.65 * inp.bolts.d


def _dm(inp: EndPlateJointInput) -> float:
    s_e = HEAD_SIZES.get(int(round(inp.bolts.d)))
    return (s_e[0] + s_e[1]) / 2 if s_e else 1.6 * inp.bolts.d


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


@dataclass
class _SideCheck:
    """One moment sign: tension rows, components, distribution, Mj,Rd and Sj,ini.

    Geometry is measured from the flange in tension: for sagging, mirrored about mid-depth.
    """

    inp: EndPlateJointInput
    sign: str
    a_vc: float
    vwp: float
    comps: list[ComponentResult] = field(default_factory=list)
    kinds: list[str] = field(default_factory=list)  # extension | first | other, per row
    plate_leff: list[tuple[float, float]] = field(default_factory=list)  # (min l_eff, m)
    alpha: float = ALPHA_DEFAULT

    def __post_init__(self) -> None:
        inp = self.inp
        beam, col, pl, b, w = inp.beam, inp.column, inp.plate, inp.bolts, inp.welds
        if self.sign == "hogging":
            rows = list(b.rows_from_beam_top)
            self.proj = pl.projection_top
            self.a_t, self.a_c = w.top_flange_throat, w.bottom_flange_throat
        else:
            rows = sorted(beam.h - z for z in b.rows_from_beam_top)
            self.proj = pl.projection_bottom
            self.a_t, self.a_c = w.bottom_flange_throat, w.top_flange_throat
        self.comp_proj = pl.projection_bottom if self.sign == "hogging" else pl.projection_top
        self.cc = beam.h - beam.tf / 2  # centre of compression from the tension face
        # Tension rows: the half of the lever arm nearest the tension flange (common practice,
        # no source: rows near the compression flange are taken as shear rows).
        self.tension = [z for z in rows if self.cc - z > (beam.h - beam.tf) / 2]
        self.h_r = [self.cc - z for z in self.tension]
        p = inp.params
        self.ft = F_t_Rd(b.fub, b.As, p)
        bp_col = B_p_Rd(_dm(inp), col.tf, col.fu, p)
        bp_pl = B_p_Rd(_dm(inp), pl.tp, pl.fu, p)
        self.ft_row = 2 * min(self.ft, bp_col, bp_pl)
        self.ew = _dw(inp) / 4
        self.leg_f = self.a_t * math.sqrt(2)
        leg_w = w.web_throat * math.sqrt(2)
        self.m_c = b.gauge / 2 - col.tw / 2 - 0.8 * col.r
        self.e_c = (col.b - b.gauge) / 2
        self.m_p = b.gauge / 2 - beam.tw / 2 - 0.8 * leg_w
        self.e_p = (pl.bp - b.gauge) / 2

    # --- T-stubs (6.2.6.4, 6.2.6.5, Table 6.2) ---------------------------------------
    def col_tstub(self, cp: float, nc: float, n_rows: int) -> TStubResult:
        """Column flange T-stub of n_rows rows (6.2.6.4, Table 6.2)."""
        col = self.inp.column
        return self._tstub(cp, nc, col.tf, col.fy, self.m_c, self.e_c, n_rows)

    def plate_tstub(self, cp: float, nc: float, m: float, e_min: float, n_rows: int):
        """End plate T-stub of n_rows rows (6.2.6.5, Table 6.2)."""
        pl = self.inp.plate
        return self._tstub(cp, nc, pl.tp, pl.fy, m, e_min, n_rows)

    def _tstub(self, cp, nc, t, fy, m, e_min, n_rows) -> TStubResult:
        return t_stub(
            l_eff_1=min(cp, nc),
            l_eff_2=nc,
            tf=t,
            fy=fy,
            m=m,
            e_min=e_min,
            sum_F_t_Rd=self.ft_row * n_rows,
            e_w=self.ew,
            params=self.inp.params,
        )

    def alpha_for(self, z_row: float) -> float:
        """Alpha for the first row below the tension flange at z_row from the tension face."""
        inp = self.inp
        lam_base = self.m_p + self.e_p
        if inp.alpha is not None:
            return inp.alpha
        if inp.alpha_method != "approximation" or lam_base <= 0:
            return ALPHA_DEFAULT
        m2 = z_row - inp.beam.tf - 0.8 * self.leg_f
        return el.alpha_fig_6_11(self.m_p / lam_base, max(m2, 0.0) / lam_base)

    def add(self, clause: str, component: Component, f: float, **kw) -> float:
        """Record a component's resistance; returns it."""
        c = ComponentResult(clause=EC3.clause(clause), component=component, F_Rd=f, **kw)
        self.comps.append(c)
        return f

    # --- rows alone --------------------------------------------------------------------
    def rows_alone(self) -> list[dict]:
        """Each tension row alone: column flange and web, end plate and beam web."""
        inp = self.inp
        col, beam, p = inp.column, inp.beam, inp.params
        # The column side of a row alone is the same for every row of an unstiffened column.
        cp, nc = el.column_flange_row_alone(self.m_c, self.e_c)
        ts = self.col_tstub(cp, nc, 1)
        om = cmp.omega(inp.beta, min(cp, nc), col.tw, self.a_vc)
        fwc = cmp.F_t_wc_Rd(b_eff=min(cp, nc), t_wc=col.tw, fy_wc=col.fy, omega_=om, params=p)
        alone = []
        for i, z in enumerate(self.tension, start=1):
            d: dict[Component, float] = {}
            col_in = {"l_eff_cp": cp, "l_eff_nc": nc, "m": self.m_c, "e": self.e_c}
            d[_CFB] = self.add("6.2.6.4", _CFB, ts.F_T_Rd, mode=ts.mode, row=i, inputs=col_in)
            web_in = {"b_eff": min(cp, nc), "omega": om}
            d[_CWT] = self.add("6.2.6.3", _CWT, fwc, row=i, inputs=web_in)
            if z < 0:  # extension row (outside the tension flange)
                self._extension_row(i, z, d)
            else:
                self._row_below_flange(i, z, d, beam, p)
            alone.append(d)
        return alone

    def _extension_row(self, i: int, z: float, d: dict) -> None:
        b, pl = self.inp.bolts, self.inp.plate
        self.kinds.append("extension")
        mx = -z - 0.8 * self.leg_f
        ex = self.proj + z if self.proj is not None else -z
        cpp, ncp = el.end_plate_extension_row(mx, ex, self.e_p, b.gauge, pl.bp)
        tsp = self.plate_tstub(cpp, ncp, mx, min(ex, self.e_p), 1)
        self.plate_leff.append((min(cpp, ncp), mx))
        inputs = {"l_eff_cp": cpp, "l_eff_nc": ncp, "mx": mx, "ex": ex}
        d[_EPB] = self.add("6.2.6.5", _EPB, tsp.F_T_Rd, mode=tsp.mode, row=i, inputs=inputs)

    def _row_below_flange(self, i: int, z: float, d: dict, beam, p) -> None:
        first = not self.kinds or self.kinds[-1] == "extension"
        self.kinds.append("first" if first else "other")
        if first:
            self.alpha = self.alpha_for(z)
            cpp, ncp = el.end_plate_first_row_below_flange(self.m_p, self.e_p, self.alpha)
        else:
            cpp, ncp = el.end_plate_other_row(self.m_p, self.e_p)
        tsp = self.plate_tstub(cpp, ncp, self.m_p, self.e_p, 1)
        self.plate_leff.append((min(cpp, ncp), self.m_p))
        inputs = {
            "l_eff_cp": cpp,
            "l_eff_nc": ncp,
            "m": self.m_p,
            "e": self.e_p,
            "alpha": self.alpha if first else None,
        }
        d[_EPB] = self.add("6.2.6.5", _EPB, tsp.F_T_Rd, mode=tsp.mode, row=i, inputs=inputs)
        fwb = cmp.F_t_wb_Rd(b_eff=min(cpp, ncp), t_wb=beam.tw, fy_wb=beam.fy, params=p)
        d[_BWT] = self.add("6.2.6.8", _BWT, fwb, row=i, inputs={"b_eff": min(cpp, ncp)})

    # --- groups of rows ------------------------------------------------------------------
    def groups(self) -> dict[tuple[int, int], dict[Component, float]]:
        """Every group of consecutive tension rows (Tables 6.4 and 6.6, rows as a group)."""
        out: dict[tuple[int, int], dict[Component, float]] = {}
        n = len(self.tension)
        for i in range(1, n + 1):
            for j in range(i + 1, n + 1):
                out[(i, j)] = self._group(i, j)
        return out

    def _group(self, i: int, j: int) -> dict[Component, float]:
        inp, col, beam, p = self.inp, self.inp.column, self.inp.beam, self.inp.params
        rows = tuple(range(i, j + 1))
        g: dict[Component, float] = {}
        cp_s = nc_s = 0.0
        for k in rows:
            share = _pitch_share(self.tension, i, j, k)
            a_, b_ = el.column_flange_row_in_group(self.m_c, self.e_c, share, end_row=k in (i, j))
            cp_s, nc_s = cp_s + a_, nc_s + b_
        ts = self.col_tstub(cp_s, nc_s, len(rows))
        g[_CFB] = ts.F_T_Rd
        om = cmp.omega(inp.beta, min(cp_s, nc_s), col.tw, self.a_vc)
        g[_CWT] = cmp.F_t_wc_Rd(
            b_eff=min(cp_s, nc_s), t_wc=col.tw, fy_wc=col.fy, omega_=om, params=p
        )
        col_in = {"sum_l_eff_cp": cp_s, "sum_l_eff_nc": nc_s}
        self.add("6.2.6.4", _CFB, ts.F_T_Rd, mode=ts.mode, rows=rows, inputs=col_in)
        if any(self.kinds[k - 1] == "extension" for k in rows):
            return g
        cp_s = nc_s = 0.0
        for k in rows:
            share = _pitch_share(self.tension, i, j, k)
            if self.kinds[k - 1] == "first" and k == i:
                a_, b_ = el.end_plate_first_row_below_flange(
                    self.m_p, self.e_p, self.alpha, p=share
                )
            else:
                a_, b_ = el.end_plate_other_row(
                    self.m_p, self.e_p, p=share, end_row=k in (i, j)
                )
            cp_s, nc_s = cp_s + a_, nc_s + b_
        tsp = self.plate_tstub(cp_s, nc_s, self.m_p, self.e_p, len(rows))
        g[_EPB] = tsp.F_T_Rd
        g[_BWT] = cmp.F_t_wb_Rd(b_eff=min(cp_s, nc_s), t_wb=beam.tw, fy_wb=beam.fy, params=p)
        plate_in = {"sum_l_eff_cp": cp_s, "sum_l_eff_nc": nc_s}
        self.add("6.2.6.5", _EPB, tsp.F_T_Rd, mode=tsp.mode, rows=rows, inputs=plate_in)
        return g

    # --- compression side ----------------------------------------------------------------
    def compression(self) -> tuple[dict[Component, float], float, float, float]:
        """Column web in compression, beam flange in compression, web panel / beta.

        Returns the compression limits, Fc,wc,Rd, Fc,fb,Rd and b_eff,c,wc.
        """
        inp = self.inp
        col, beam, pl, p = inp.column, inp.beam, inp.plate, inp.params
        # 45-degree spread through the plate: tp on the beam side, and up to tp more where the
        # plate projects beyond the compression flange (6.2.6.2(1), s_p between tp and 2 tp).
        s_p = pl.tp + min(max(self.comp_proj, 0.0), pl.tp)
        beff = cmp.b_eff_c_wc_end_plate(beam.tf, self.a_c, col.tf, col.s, s_p)
        dwc = col.h - 2 * (col.tf + col.r)
        om_c = cmp.omega(inp.beta, beff, col.tw, self.a_vc)
        kwc = cmp.k_wc(inp.sigma_com_Ed, col.fy)
        fcwc = cmp.F_c_wc_Rd(
            b_eff=beff, t_wc=col.tw, d_wc=dwc, fy_wc=col.fy, omega_=om_c, k_wc_=kwc, params=p
        )
        mc_rd = plastic_modulus(beam) * beam.fy / p.gamma_M0
        fcfb = cmp.F_c_fb_Rd(mc_rd, beam.h, beam.tf)
        compression = {
            Component.COLUMN_WEB_COMPRESSION: fcwc,
            Component.BEAM_FLANGE_COMPRESSION: fcfb,
        }
        web_in = {"b_eff_c_wc": beff, "omega": om_c, "s_p": s_p, "k_wc": kwc}
        self.add("6.2.6.2", Component.COLUMN_WEB_COMPRESSION, fcwc, inputs=web_in)
        self.add("6.2.6.7", Component.BEAM_FLANGE_COMPRESSION, fcfb, inputs={"Mc_Rd": mc_rd})
        if inp.beta > 0:
            compression[Component.WEB_PANEL_SHEAR_OVER_BETA] = self.vwp / inp.beta
        panel_in = {"A_vc": self.a_vc, "beta": inp.beta}
        self.add("6.2.6.1", Component.WEB_PANEL_SHEAR, self.vwp, inputs=panel_in)
        return compression, fcwc, fcfb, beff

    # --- stiffness (6.3) -----------------------------------------------------------------
    def stiffness(self, beff: float) -> tuple[float, float]:
        """Sj,ini and the equivalent lever arm from k1, k2 and k3, k4, k5, k10 per row."""
        inp = self.inp
        col, beam, pl, b = inp.column, inp.beam, inp.plate, inp.bolts
        dwc = col.h - 2 * (col.tf + col.r)
        lb = b.L_b or bolt_elongation_length(pl.tp + col.tf, b.d)
        # Stiffeners (Table 6.11, stiffened web): at the compression flange k2 = infinite; at
        # the tension flange k3 = infinite for the nearest row on each side of it.
        hog = self.sign == "hogging"
        comp_depth = beam.h - beam.tf / 2 if hog else beam.tf / 2
        tens_depth = beam.tf / 2 if hog else beam.h - beam.tf / 2
        comp_stiff = stiffened_at(inp.stiffener_depths, comp_depth, beam.tf)
        next_to_stiffener = set()
        if stiffened_at(inp.stiffener_depths, tens_depth, beam.tf):
            # rows are measured from the tension face here: the flange sits at tf / 2
            above = [k for k, z in enumerate(self.tension) if z < beam.tf / 2]
            below = [k for k, z in enumerate(self.tension) if z >= beam.tf / 2]
            next_to_stiffener = set(above[-1:]) | set(below[:1])
        cp, nc = el.column_flange_row_alone(self.m_c, self.e_c)
        lmin = min(cp, nc)
        keff = []
        for i in range(len(self.tension)):
            k3 = math.inf if i in next_to_stiffener else stf.k3_web_tension(lmin, col.tw, dwc)
            k4 = stf.k4_column_flange(lmin, col.tf, self.m_c)
            lp, mm = self.plate_leff[i]
            k5 = stf.k5_end_plate(lp, pl.tp, mm)
            k10 = stf.k10_bolts(b.As, lb)
            keff.append(stf.k_eff_row([k3, k4, k5, k10]))
        if keff:
            zeq, keq = stf.equivalent_lever_arm(keff, self.h_r)
        else:
            zeq, keq = self.cc, math.inf
        k1 = stf.k1_web_panel(self.a_vc, inp.beta, zeq)
        k2 = math.inf if comp_stiff else stf.k2_web_compression(beff, col.tw, dwc)
        return stf.S_j_ini(zeq, [k1, k2, keq], inp.params), zeq

    def result(self) -> SideResult:
        """The side's resistance, stiffness and governing limit."""
        alone = self.rows_alone()
        groups = self.groups()
        compression, fcwc, fcfb, beff = self.compression()
        rr = distribute_tension(
            h=self.h_r, alone=alone, groups=groups, compression=compression, F_t_Rd=self.ft
        )
        # For the axial resistance (6.2.7.1(3)): the same rows with no compression-side limit
        # and no triangular limit (6.2.7.2(9) concerns the bending distribution only).
        rr_n = distribute_tension(
            h=self.h_r, alone=alone, groups=groups, compression={}, F_t_Rd=math.inf,
            explain=False,
        )
        sj, zeq = self.stiffness(beff)
        return SideResult(
            sign=self.sign,
            M_j_Rd=M_j_Rd(rr),
            z=zeq,
            rows=tuple(rr),
            components=tuple(self.comps),
            S_j_ini=sj,
            governing=min(rr, key=lambda r: r.F_tr_Rd).limited_by if rr else None,
            F_t_half_Rd=sum(r.F_tr_Rd for r in rr_n),
            F_c_flange_Rd=min(fcwc, fcfb),
        )


def _shear(inp: EndPlateJointInput, hog: SideResult) -> tuple[float, Note]:
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
    per_bolt = min(fv, fb_plate, fb_col)
    n_tension = len(hog.rows)
    n_rows = len(b.rows_from_beam_top)
    v = 2 * n_tension * (1 - 1 / 1.4) * per_bolt + 2 * (n_rows - n_tension) * per_bolt
    note = Note(
        NoteCode.SHEAR_FROM_BOLTS,
        {
            "n_shear": 2 * (n_rows - n_tension),
            "per_bolt": per_bolt,
            "n_tension": 2 * n_tension,
            "fb_plate": fb_plate,
            "fb_col": fb_col,
        },
    )
    return v, note
