"""Check of a major-axis bolted end-plate beam-to-column joint, EN 1993-1-8 component method.

Pure Python over plain dataclasses (N, mm, MPa); never imports ifcopenshell. The result keeps
every component with its clause, inputs, resistance and governing mode, the row-by-row tension
resistances with what limited each row, Mj,Rd for both moment signs, Vj,Rd, Sj,ini and the
classification, and the complete input actually used, so the check can be repeated by hand.

Scope: one column, one beam meeting its flange; extended or flush end plate, two bolts per
row; rolled or welded I/H sections; transverse column stiffeners (Table 6.5, compression
stiffeners) and supplementary web plates. Anything else returns a result that says "not
checked" with the reason (never a pass).

Modelling choices (each reported in the result's notes): n = e_min = the smaller of the
column-flange and end-plate edge distances for both T-stubs (Table 6.2, Figure 6.8), n = e_x
for the extension; alpha of Figure 6.11 from the chart's published closed form; prying forces
assumed (Table 6.2 note); rows in the half of the lever arm nearest the tension flange are
tension rows.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field, replace

from ifcjoint.ec3 import components as cmp
from ifcjoint.ec3 import effective_lengths as el
from ifcjoint.ec3 import stiffeners as sti
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
from ifcjoint.ec3.code import Clause, Component
from ifcjoint.ec3.detailing import e_min, p1_min, p2_min
from ifcjoint.ec3.moment_resistance import M_j_Rd, distribute_tension
from ifcjoint.ec3.tstub import t_stub_resistance
from ifcjoint.engine.common import (
    ColumnWeb,
    beam_M_c_Rd,
    checked,
    column_web,
    resistances_valid,
    slender_stiffener_note,
    slender_web,
    stiffened_compression,
    stiffener_at,
    unique_notes,
    weld_notes,
)
from ifcjoint.engine.end_plate_on_web import check_end_plate_on_web
from ifcjoint.engine.inputs import EndPlateJointInput, StiffenerInput
from ifcjoint.engine.results import ComponentResult, SideResult, not_checked
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
#: alpha of EN 1993-1-8 Figure 6.11 for ``alpha_method="conservative"``: the chart's smallest
#: value, 4.45, which gives the shortest effective length.
ALPHA_DEFAULT = 4.45

_CFB = Component.COLUMN_FLANGE_BENDING
_CWT = Component.COLUMN_WEB_TENSION
_EPB = Component.END_PLATE_BENDING
_BWT = Component.BEAM_WEB_TENSION


_CLAUSES: dict[str, Clause] = {}


def _clause(ref: str) -> Clause:
    """A clause of EN 1993-1-8 as data (made once per reference)."""
    found = _CLAUSES.get(ref)
    if found is None:
        found = _CLAUSES[ref] = EC3.clause(ref)
    return found


def check_end_plate_joint(inp: EndPlateJointInput):
    """Resistance, stiffness and classification of a bolted end-plate joint.

    EN 1993-1-8:2005, 6.2.7.2 (Mj,Rd by the component method, both moment signs), 6.2.2 and
    Table 3.4 (Vj,Rd), 6.3 (Sj,ini), 5.2.2 and 5.2.3 (classification). Out-of-scope layouts
    return a not-checked result with the reason.
    """
    if inp.support in ("web", "beam_web"):  # the shear path only (no web in bending, 6.2.6)
        return check_end_plate_on_web(inp)
    given = inp
    if inp.haunch is not None:  # the beam with its haunch: one deeper section (6.2.6.7)
        inp = replace(inp, beam=replace(inp.beam, h=inp.beam.h + inp.haunch.d))
    why = _out_of_scope(inp)
    if why is not None:
        return not_checked(why, given)
    web = column_web(inp)
    shared = _Shared.of(inp)
    notes = [*weld_notes(inp.welds), *_alpha_note(inp), *web.notes]
    hog, hog_result = _best_side(inp, "hogging", web, shared)
    sag, sag_result = _best_side(inp, "sagging", web, shared)
    sides = (hog_result, sag_result)
    notes += [Note(NoteCode.PRYING_ASSUMED, {"L_b": shared.lb}), *hog.notes, *sag.notes]
    if inp.stiffeners or inp.web_plates:
        notes.append(Note(NoteCode.STIFFNESS_UNREINFORCED))
    notes.append(Note(NoteCode.SHEAR_FROM_BOLTS, _shear_summary(shared, sides[0])))
    if _splice(inp):
        notes.append(Note(NoteCode.SPLICE_PLATES, {"tp": inp.plate.tp, "fy": inp.plate.fy}))
    if inp.haunch is not None:
        notes.append(Note(NoteCode.HAUNCH_SECTION, {"d": inp.haunch.d, "h": inp.beam.h}))
    r = checked(
        given, *sides, V_j_Rd=sides[0].V_j_Rd, V_wp_Rd=None if _splice(inp) else web.v_wp_Rd,
        notes=list(unique_notes(notes)), joint_kind="bolted_end_plate",
    )
    return resistances_valid(r)


def _best_side(inp: EndPlateJointInput, sign: str, web: ColumnWeb, shared: _Shared):
    """One moment sign, with its tension stiffeners or, when it gives more, without them.

    Table 6.5 gives a row next to a stiffener l_eff,nc = alpha m, which for a wide column
    flange (e much larger than m) is below the unstiffened inner row's 4 m + 1.25 e of
    Table 6.4. A stiffener only adds material, and leaving it out of the calculation is on
    the safe side, so the larger of the two resistances is kept, said in a note (common
    practice, no source).
    """
    side = _SideCheck(inp, sign, web, shared)
    result = side.result()
    if not side.stiffeners or side.stiffened_flange_never_weaker():
        return side, result
    plain = _SideCheck(inp, sign, web, shared, tension_stiffeners=False)
    plain_result = plain.result()
    if plain_result.M_j_Rd > result.M_j_Rd:
        plain.notes.append(Note(NoteCode.TENSION_STIFFENER_IGNORED, {
            "sign": sign, "with": result.M_j_Rd, "without": plain_result.M_j_Rd}))
        return plain, plain_result
    return side, result


def _alpha_note(inp: EndPlateJointInput) -> list[Note]:
    """How alpha of Figure 6.11 was found."""
    if inp.alpha is not None:
        return [Note(NoteCode.ALPHA_GIVEN, {"alpha": inp.alpha})]
    if inp.alpha_method == "conservative":
        return [Note(NoteCode.ALPHA_CONSERVATIVE, {"alpha": ALPHA_DEFAULT})]
    return [Note(NoteCode.ALPHA_CHART)]


def _splice(inp: EndPlateJointInput) -> bool:
    """A beam splice: two end plates bolted together, no column (EN 1993-1-8 6.2.7.2, 6.3).

    ``plate`` stands for both plates (the builder gives the weaker of the two); the column
    components (web panel, web in compression and tension, column flange) do not exist: the
    other plate's T-stub takes the column flange's place, the same as this one's.
    """
    return inp.support == "splice"


def _out_of_scope(inp: EndPlateJointInput) -> NotChecked | None:
    col, beam, b = inp.column, inp.beam, inp.bolts
    if beam.h <= 0 or col.h <= 0:
        return NotChecked(NotCheckedCode.SECTION_DIMENSIONS_MISSING)
    if len(b.rows_from_beam_top) < 2:
        return NotChecked(NotCheckedCode.FEWER_THAN_TWO_ROWS)
    if _splice(inp):
        mc_rd, cls = beam_M_c_Rd(beam, inp.params)
        if mc_rd is None:
            return NotChecked(NotCheckedCode.CLASS_4_BEAM, {"section": beam.name, "class": cls})
        return None
    slender = slender_web(col)
    if slender is not None:
        return slender
    if inp.haunch is not None:
        return None  # the haunched section's M_c,Rd is elastic (``haunched_M_c_Rd``)
    if b.gauge / 2 - col.tw / 2 - 0.8 * col.r <= 0:
        return NotChecked(NotCheckedCode.BOLTS_IN_ROOT_RADIUS)
    mc_rd, cls = beam_M_c_Rd(beam, inp.params)
    if mc_rd is None:
        return NotChecked(NotCheckedCode.CLASS_4_BEAM, {"section": beam.name, "class": cls})
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
class _Shared:
    """What both moment signs of one joint share: bolt and T-stub geometry, bearing, shear.

    Computed once per joint; the bolt group's shear and the column components of a row are
    kept by their inputs, so a row or sign with the same geometry reuses them.
    """

    inp: EndPlateJointInput
    ft: float  # Ft,Rd of one bolt (Table 3.4)
    ft_row: float  # two bolts, each min(Ft,Rd, Bp,Rd) (Table 6.2 sum of Ft,Rd)
    ew: float  # d_w / 4 for the mode-1 alternative method
    m_c: float
    e_c: float
    m_p: float
    e_p: float
    e_min: float  # n = e_min for both T-stubs (Table 6.2, Figure 6.8)
    lb: float  # bolt elongation length L_b (Table 6.2)
    fv: float  # Fv,Rd of one bolt (Table 3.4)
    bearing: tuple[float, float, NotChecked | None]  # on plate, on column flange, or why not
    shears: dict = field(default_factory=dict)
    column_rows: dict = field(default_factory=dict)  # (cp, nc, alpha) -> column components
    plate_rows: dict = field(default_factory=dict)  # (cp, nc, alpha) -> plate, beam web

    @classmethod
    def of(cls, inp: EndPlateJointInput) -> _Shared:
        """The shared values of one joint."""
        beam, col, pl, b, w, p = inp.beam, inp.column, inp.plate, inp.bolts, inp.welds, inp.params
        ft = F_t_Rd(b.fub, b.As, p)
        dm = _dm(inp)
        leg_w = w.web_throat * math.sqrt(2)
        e_p = (pl.bp - b.gauge) / 2
        splice = _splice(inp)
        e_c = e_p if splice else (col.b - b.gauge) / 2
        t_other, fu_other = (pl.tp, pl.fu) if splice else (col.tf, col.fu)
        return cls(
            inp=inp,
            ft=ft,
            ft_row=2 * min(ft, B_p_Rd(dm, t_other, fu_other, p), B_p_Rd(dm, pl.tp, pl.fu, p)),
            ew=_dw(inp) / 4,
            m_c=b.gauge / 2 - col.tw / 2 - 0.8 * col.r,
            e_c=e_c,
            m_p=b.gauge / 2 - beam.tw / 2 - 0.8 * leg_w,
            e_p=e_p,
            e_min=min(e_c, e_p),
            lb=b.L_b or bolt_elongation_length(pl.tp + t_other, b.d),
            fv=F_v_Rd(b.grade, b.fub, b.As, p) if b.grade in ALPHA_V else 0.0,
            bearing=_bearing(inp),
        )

    def t_stub(self, cp, nc, t, fy, m, n_edge, n_rows) -> tuple[float, str]:
        """F_T,Rd and mode of the Table 6.2 T-stub of n_rows rows (``t_stub_resistance``)."""
        return t_stub_resistance(
            min(cp, nc), nc, t, fy, m, n_edge, self.ft_row * n_rows, self.ew,
            self.inp.params.gamma_M0,
        )

    def shear(self, n_tension: int) -> tuple[float | None, NotChecked | None]:
        """Vj,Rd with n_tension rows in tension (kept by n_tension)."""
        found = self.shears.get(n_tension)
        if found is None:
            found = self.shears[n_tension] = _shear(self, n_tension)
        return found


@dataclass
class _Stiffener:
    """A transverse column stiffener seen from one moment sign's tension face."""

    z: float  # its mid-plane below the tension face, mm
    s: StiffenerInput


@dataclass
class _SideCheck:
    """One moment sign: tension rows, components, distribution, Mj,Rd, Sj,ini and Vj,Rd.

    Geometry is measured from the flange in tension: for sagging, mirrored about mid-depth.
    """

    inp: EndPlateJointInput
    sign: str
    web: ColumnWeb
    shared: _Shared
    tension_stiffeners: bool = True
    comps: list[ComponentResult] = field(default_factory=list)
    kinds: list[str] = field(default_factory=list)  # extension | first | other, per row
    leff_col: list[float] = field(default_factory=list)  # smallest column l_eff per row
    leff_plate: list[float] = field(default_factory=list)  # smallest plate l_eff per row
    m_plate: list[float] = field(default_factory=list)  # m (or mx) of the plate per row
    notes: list[Note] = field(default_factory=list)
    alpha_plate: float = ALPHA_DEFAULT

    def __post_init__(self) -> None:
        inp = self.inp
        beam, pl, b, w = inp.beam, inp.plate, inp.bolts, inp.welds
        hog = self.sign == "hogging"
        if hog:
            rows = list(b.rows_from_beam_top)
            self.a_t, self.a_c = w.top_flange_throat, w.bottom_flange_throat
        else:
            rows = sorted(beam.h - z for z in b.rows_from_beam_top)
            self.a_t, self.a_c = w.bottom_flange_throat, w.top_flange_throat
        self.proj = pl.projection_top if hog else pl.projection_bottom
        self.comp_proj = pl.projection_bottom if hog else pl.projection_top
        # flange thicknesses on the tension and compression sides (a haunch's flange is the
        # bottom one of a haunched beam)
        bottom_tf = inp.haunch.tf if inp.haunch is not None else beam.tf
        self.tf_t, self.tf_c = (beam.tf, bottom_tf) if hog else (bottom_tf, beam.tf)
        self.cc = beam.h - self.tf_c / 2  # centre of compression from the tension face
        # Tension rows: the half of the lever arm nearest the tension flange (common practice,
        # no source: rows near the compression flange are taken as shear rows).
        self.tension = [z for z in rows if self.cc - z > (beam.h - beam.tf) / 2]
        self.h_r = [self.cc - z for z in self.tension]
        sh = self.shared
        self.ft, self.ew = sh.ft, sh.ew
        self.leg_f = self.a_t * math.sqrt(2)
        self.m_c, self.e_c, self.m_p, self.e_p = sh.m_c, sh.e_c, sh.m_p, sh.e_p
        # n = e_min for both T-stubs: the smaller edge distance of column flange and plate
        # (EN 1993-1-8 Table 6.2, Figure 6.8, 6.2.6.4.1(4), 6.2.6.5(3)).
        self.e_min = sh.e_min
        self.lb = sh.lb
        # Stiffeners of the tension zone (Table 6.5); those of the compression zone are the
        # compression stiffeners of 6.2.6.2.
        in_tension = [
            _Stiffener(z=s.level if hog else beam.h - s.level, s=s) for s in inp.stiffeners
        ]
        self.stiffeners = [
            x for x in in_tension
            if self.tension_stiffeners and self.cc - x.z > (beam.h - beam.tf) / 2
        ]
        if self.stiffeners:
            self.notes.append(Note(NoteCode.TENSION_STIFFENER, {"sign": self.sign}))
        flange_c = beam.h - beam.tf / 2 if hog else beam.tf / 2
        s_c = stiffener_at(inp.stiffeners, flange_c, beam.tf)
        ok = s_c is not None and sti.stiffener_outstand_ok(s_c.b, s_c.t, s_c.fy)
        self.comp_stiffener = s_c if ok else None
        self.slender = s_c if s_c is not None and not ok else None

    # --- T-stubs (6.2.6.4, 6.2.6.5, Table 6.2) ---------------------------------------
    def _tstub(self, cp, nc, t, fy, m, n_edge, n_rows) -> tuple[float, str]:
        return self.shared.t_stub(cp, nc, t, fy, m, n_edge, n_rows)

    def col_tstub(self, cp: float, nc: float, n_rows: int) -> tuple[float, str]:
        """Column flange T-stub of n_rows rows (6.2.6.4, Table 6.2), n from e_min."""
        col = self.inp.column
        return self._tstub(cp, nc, col.tf, col.fy, self.m_c, self.e_min, n_rows)

    def plate_tstub(
        self, cp: float, nc: float, m: float, n_edge: float, n_rows: int
    ) -> tuple[float, str]:
        """End plate T-stub of n_rows rows (6.2.6.5, Table 6.2)."""
        pl = self.inp.plate
        return self._tstub(cp, nc, pl.tp, pl.fy, m, n_edge, n_rows)

    def alpha(self, m1: float, e: float, m2: float, *, given: float | None = None) -> float:
        """Alpha of Figure 6.11 for a row next to a flange or a stiffener (``given`` wins)."""
        inp = self.inp
        if given is not None:
            return given
        if inp.alpha_method == "conservative" or m1 + e <= 0:
            return ALPHA_DEFAULT
        return el.alpha_fig_6_11(m1 / (m1 + e), max(m2, 0.0) / (m1 + e))

    def add(
        self, clause: str, component: Component, f: float, mode: str = "",
        row: int | None = None, rows: tuple[int, ...] = (), inputs: dict | None = None,
    ) -> float:
        """Record a component's resistance; returns it."""
        self.comps.append(ComponentResult(
            _clause(clause), component, f, mode, row, rows, {} if inputs is None else inputs))
        return f

    # --- the column flange, stiffened or not (Tables 6.4, 6.5) ------------------------
    def _stiffener_next(self, i: int) -> tuple[_Stiffener, float] | None:
        """The stiffener row i (1-based) lies next to, with m2, or None (Table 6.5)."""
        z = self.tension[i - 1]
        best = None
        for st in self.stiffeners:
            between = [x for x in self.tension if min(z, st.z) < x < max(z, st.z)]
            if between:
                continue  # another row lies between: not adjacent
            m2 = abs(z - st.z) - st.s.t / 2 - 0.8 * st.s.weld_leg
            if best is None or m2 < best[1]:
                best = (st, m2)
        return best

    def stiffened_flange_never_weaker(self) -> bool:
        """Whether Table 6.5 gives every row next to a stiffener at least Table 6.4's length.

        alpha m >= 4 m + 1.25 e for each such row: its non-circular length alone and in a group
        is then no shorter than unstiffened (the circular ones are equal), and a group that
        may not cross the stiffener only drops a limit; the stiffened side is never weaker.
        """
        for i in range(1, len(self.tension) + 1):
            nxt = self._stiffener_next(i)
            if nxt is None:
                continue
            a = self.alpha(self.m_c, self.e_c, nxt[1])
            if a * self.m_c < 4 * self.m_c + 1.25 * self.e_c:
                return False
        return True

    def _crosses_stiffener(self, i: int, j: int) -> bool:
        """Whether a stiffener lies between rows i and j (no group crosses one, Table 6.5)."""
        a, b = self.tension[i - 1], self.tension[j - 1]
        return any(a < st.z < b for st in self.stiffeners)

    def col_flange_alone(self, i: int) -> tuple[float, float, float | None]:
        """Column flange l_eff (cp, nc) of row i alone, and alpha when next to a stiffener."""
        nxt = self._stiffener_next(i)
        if nxt is None:
            return (*el.column_flange_row_alone(self.m_c, self.e_c), None)
        a = self.alpha(self.m_c, self.e_c, nxt[1])
        return (*el.column_flange_row_next_to_stiffener(self.m_c, self.e_c, a), a)

    def col_flange_in_group(self, i: int, j: int, k: int) -> tuple[float, float]:
        """Column flange l_eff share of row k in group i..j (Tables 6.4 and 6.5)."""
        share = _pitch_share(self.tension, i, j, k)
        end = k in (i, j)
        nxt = self._stiffener_next(k) if end else None
        if nxt is not None:
            a = self.alpha(self.m_c, self.e_c, nxt[1])
            return el.column_flange_row_next_to_stiffener(self.m_c, self.e_c, a, p=share)
        return el.column_flange_row_in_group(self.m_c, self.e_c, share, end_row=end)

    # --- rows alone ----------------------------------------------------------------------
    def rows_alone(self) -> list[dict]:
        """Each tension row alone: column flange and web, end plate and beam web."""
        inp = self.inp
        col, beam, p = inp.column, inp.beam, inp.params
        alone = []
        for i, z in enumerate(self.tension, start=1):
            d: dict[Component, float] = {}
            if _splice(inp):  # no column: the other plate's T-stub is this one's
                self.leff_col.append(math.inf)
                if z < 0:
                    self._extension_row(i, z, d)
                else:
                    self._row_below_flange(i, z, d, beam, p)
                alone.append(d)
                continue
            cp, nc, a_col = self.col_flange_alone(i)
            found = self.shared.column_rows.get((cp, nc, a_col))
            if found is None:  # rows of the same geometry share their column components
                ts = self.col_tstub(cp, nc, 1)
                col_in = {"l_eff_cp": cp, "l_eff_nc": nc, "m": self.m_c, "e": self.e_c,
                          "n": min(self.e_min, 1.25 * self.m_c), "alpha": a_col}
                om = cmp.omega(inp.beta, min(cp, nc), col.tw, self.web.a_vc)
                fwc = cmp.F_t_wc_Rd(
                    b_eff=min(cp, nc), t_wc=self.web.t_tension, fy_wc=col.fy, omega_=om,
                    params=p,
                )
                web_in = {"b_eff": min(cp, nc), "omega": om, "t_wc": self.web.t_tension}
                found = self.shared.column_rows[(cp, nc, a_col)] = (ts, col_in, fwc, web_in)
            ts, col_in, fwc, web_in = found
            d[_CFB] = self.add("6.2.6.4", _CFB, ts[0], mode=ts[1], row=i, inputs=col_in)
            d[_CWT] = self.add("6.2.6.3", _CWT, fwc, row=i, inputs=web_in)
            self.leff_col.append(min(cp, nc))
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
        # n = e_x for the extension (Figure 6.10; the T-stub takes n <= 1.25 m_x)
        tsp = self.plate_tstub(cpp, ncp, mx, ex, 1)
        self.leff_plate.append(min(cpp, ncp))
        self.m_plate.append(mx)
        inputs = {"l_eff_cp": cpp, "l_eff_nc": ncp, "mx": mx, "ex": ex,
                  "n": min(ex, 1.25 * mx)}
        d[_EPB] = self.add("6.2.6.5", _EPB, tsp[0], mode=tsp[1], row=i, inputs=inputs)

    def _row_below_flange(self, i: int, z: float, d: dict, beam, p) -> None:
        first = not self.kinds or self.kinds[-1] == "extension"
        self.kinds.append("first" if first else "other")
        alpha = None
        if first:
            m2 = z - self.tf_t - 0.8 * self.leg_f
            alpha = self.alpha_plate = self.alpha(self.m_p, self.e_p, m2, given=self.inp.alpha)
            cpp, ncp = el.end_plate_first_row_below_flange(self.m_p, self.e_p, alpha)
        else:
            cpp, ncp = el.end_plate_other_row(self.m_p, self.e_p)
        self.leff_plate.append(min(cpp, ncp))
        self.m_plate.append(self.m_p)
        found = self.shared.plate_rows.get((cpp, ncp, alpha))
        if found is None:  # inner rows share their plate and beam web components
            tsp = self.plate_tstub(cpp, ncp, self.m_p, self.e_min, 1)
            inputs = {
                "l_eff_cp": cpp,
                "l_eff_nc": ncp,
                "m": self.m_p,
                "e": self.e_p,
                "n": min(self.e_min, 1.25 * self.m_p),
                "alpha": alpha,
            }
            fwb = cmp.F_t_wb_Rd(b_eff=min(cpp, ncp), t_wb=beam.tw, fy_wb=beam.fy, params=p)
            found = self.shared.plate_rows[(cpp, ncp, alpha)] = (
                tsp, inputs, fwb, {"b_eff": min(cpp, ncp)})
        tsp, inputs, fwb, web_in = found
        d[_EPB] = self.add("6.2.6.5", _EPB, tsp[0], mode=tsp[1], row=i, inputs=inputs)
        d[_BWT] = self.add("6.2.6.8", _BWT, fwb, row=i, inputs=web_in)

    # --- groups of rows ------------------------------------------------------------------
    def groups(self) -> dict[tuple[int, int], dict[Component, float]]:
        """Every group of consecutive tension rows (Tables 6.4, 6.5 and 6.6, rows as a group)."""
        out: dict[tuple[int, int], dict[Component, float]] = {}
        n = len(self.tension)
        for i in range(1, n + 1):
            for j in range(i + 1, n + 1):
                g = self._group(i, j)
                if g:
                    out[(i, j)] = g
        return out

    def _group(self, i: int, j: int) -> dict[Component, float]:
        inp = self.inp
        col, beam, p = inp.column, inp.beam, inp.params
        rows = tuple(range(i, j + 1))
        g: dict[Component, float] = {}
        if not _splice(inp) and not self._crosses_stiffener(i, j):
            shares = [self.col_flange_in_group(i, j, k) for k in rows]
            cp_s, nc_s = sum(a for a, _ in shares), sum(b for _, b in shares)
            for k, (a_, b_) in zip(rows, shares, strict=True):
                self.leff_col[k - 1] = min(self.leff_col[k - 1], a_, b_)
            ts = self.col_tstub(cp_s, nc_s, len(rows))
            g[_CFB] = ts[0]
            om = cmp.omega(inp.beta, min(cp_s, nc_s), col.tw, self.web.a_vc)
            g[_CWT] = cmp.F_t_wc_Rd(
                b_eff=min(cp_s, nc_s), t_wc=self.web.t_tension, fy_wc=col.fy, omega_=om,
                params=p,
            )
            col_in = {"sum_l_eff_cp": cp_s, "sum_l_eff_nc": nc_s}
            self.add("6.2.6.4", _CFB, ts[0], mode=ts[1], rows=rows, inputs=col_in)
        if self.kinds[i - 1] == "extension":  # only the first row can be (Table 6.6)
            return g
        shares = []
        for k in rows:
            share = _pitch_share(self.tension, i, j, k)
            if self.kinds[k - 1] == "first" and k == i:
                shares.append(el.end_plate_first_row_below_flange(
                    self.m_p, self.e_p, self.alpha_plate, p=share))
            else:
                shares.append(el.end_plate_other_row(
                    self.m_p, self.e_p, p=share, end_row=k in (i, j)))
        cp_s, nc_s = sum(a for a, _ in shares), sum(b for _, b in shares)
        for k, (a_, b_) in zip(rows, shares, strict=True):
            self.leff_plate[k - 1] = min(self.leff_plate[k - 1], a_, b_)
        tsp = self.plate_tstub(cp_s, nc_s, self.m_p, self.e_min, len(rows))
        g[_EPB] = tsp[0]
        g[_BWT] = cmp.F_t_wb_Rd(b_eff=min(cp_s, nc_s), t_wb=beam.tw, fy_wb=beam.fy, params=p)
        plate_in = {"sum_l_eff_cp": cp_s, "sum_l_eff_nc": nc_s}
        self.add("6.2.6.5", _EPB, tsp[0], mode=tsp[1], rows=rows, inputs=plate_in)
        return g

    # --- compression side ----------------------------------------------------------------
    def compression(self) -> tuple[dict[Component, float], float, float, float]:
        """Column web in compression (or its stiffeners), beam flange, web panel / beta.

        Returns the compression limits, the column side's resistance, Fc,fb,Rd and
        b_eff,c,wc.
        """
        inp = self.inp
        col, beam, pl, p = inp.column, inp.beam, inp.plate, inp.params
        if _splice(inp):  # the beam flange and web alone (6.2.6.7): no column
            mc_rd, cls = beam_M_c_Rd(beam, p)
            fcfb = cmp.F_c_fb_Rd(mc_rd, beam.h, beam.tf)
            if cls == 3:
                self.notes.append(Note(NoteCode.BEAM_CLASS_3, {"section": beam.name}))
            self.add("6.2.6.7", Component.BEAM_FLANGE_COMPRESSION, fcfb,
                     inputs={"Mc_Rd": mc_rd, "section_class": cls})
            return {Component.BEAM_FLANGE_COMPRESSION: fcfb}, math.inf, fcfb, 0.0
        # 45-degree spread through the plate: tp on the beam side, and up to tp more where the
        # plate projects beyond the compression flange (6.2.6.2(1), s_p between tp and 2 tp).
        s_p = pl.tp + min(max(self.comp_proj, 0.0), pl.tp)
        beff = cmp.b_eff_c_wc_end_plate(self.tf_c, self.a_c, col.tf, col.s, s_p)
        dwc = col.h - 2 * (col.tf + col.r)
        t_wc = self.web.t_compression
        om_c = cmp.omega(inp.beta, beff, col.tw, self.web.a_vc)
        kwc = cmp.k_wc(inp.sigma_com_Ed, col.fy)
        fcwc = cmp.F_c_wc_Rd(
            b_eff=beff, t_wc=t_wc, d_wc=dwc, fy_wc=col.fy, omega_=om_c, k_wc_=kwc, params=p
        )
        web_in = {"b_eff_c_wc": beff, "omega": om_c, "s_p": s_p, "k_wc": kwc, "t_wc": t_wc}
        self.add("6.2.6.2", Component.COLUMN_WEB_COMPRESSION, fcwc, inputs=web_in)
        column_side = fcwc
        stiffened = self._stiffened_compression(beff, dwc)
        if stiffened is not None:
            column_side = max(fcwc, stiffened)
        mc_rd, cls, fcfb = self._beam_compression()
        compression = {
            Component.COLUMN_WEB_COMPRESSION if stiffened is None
            else Component.STIFFENED_WEB_COMPRESSION: column_side,
            Component.BEAM_FLANGE_COMPRESSION: fcfb,
        }
        self.add("6.2.6.7", Component.BEAM_FLANGE_COMPRESSION, fcfb,
                 inputs={"Mc_Rd": mc_rd, "section_class": cls})
        if inp.beta > 0:
            compression[Component.WEB_PANEL_SHEAR_OVER_BETA] = self.web.v_wp_Rd / inp.beta
        panel_in = {"A_vc": self.web.a_vc, "beta": inp.beta}
        self.add("6.2.6.1", Component.WEB_PANEL_SHEAR, self.web.v_wp_Rd, inputs=panel_in)
        return compression, column_side, fcfb, beff

    def _beam_compression(self) -> tuple[float, int | str, float]:
        """M_c,Rd, the section class and Fc,fb,Rd of the beam (with its haunch) (6.2.6.7).

        A haunched beam: the elastic modulus of the beam and haunch together
        (``cmp.haunched_W_el``) with the lower yield strength, over h - t_fb with h the depth
        with the haunch and t_fb the compression flange's, and the web's share limited to
        20 % above 600 mm (6.2.6.7(1)).
        """
        inp, beam, p = self.inp, self.inp.beam, self.inp.params
        hh = inp.haunch
        if hh is None:
            mc_rd, cls = beam_M_c_Rd(beam, p)
            if cls == 3:
                self.notes.append(Note(NoteCode.BEAM_CLASS_3, {"section": beam.name}))
            return mc_rd, cls, cmp.F_c_fb_Rd(mc_rd, beam.h, beam.tf)
        h0 = beam.h - hh.d
        fy = min(beam.fy, hh.fy)
        w_el = cmp.haunched_W_el(h0, beam.b, beam.tf, beam.tw, hh.d, hh.b, hh.tf, hh.tw)
        mc_rd = w_el * fy / p.gamma_M0
        b_c = hh.b if self.sign == "hogging" else beam.b
        return mc_rd, "elastic", cmp.F_c_fb_Rd_haunched(mc_rd, beam.h, self.tf_c, b_c, fy)

    def _stiffened_compression(self, beff: float, dwc: float) -> float | None:
        """Compression stiffeners with their strip of web (``common.stiffened_compression``)."""
        self.notes.extend(slender_stiffener_note(self.slender))
        found = stiffened_compression(self.inp, self.comp_stiffener, beff)
        if found is None:
            return None
        f, inputs, note = found
        self.add("6.2.6.2; EN 1993-1-5 9.4", Component.STIFFENED_WEB_COMPRESSION, f,
                 inputs=inputs)
        self.notes.append(note)
        return f

    # --- stiffness (6.3) -----------------------------------------------------------------
    def stiffness(self, beff: float) -> tuple[float, float]:
        """Sj,ini and the equivalent lever arm from k1, k2 and k3, k4, k5, k10 per row.

        EN 1993-1-8:2005, 6.3.1, 6.3.3.1, Table 6.11: l_eff of k3, k4 and k5 is the smallest
        of the row's effective lengths alone or as part of a group; k3 follows its formula for
        a bolted joint, stiffened or not; k2 is infinite with a compression stiffener. The web
        panel and web take the unreinforced column (safe side for the stiffness).
        """
        inp = self.inp
        col, pl, b = inp.column, inp.plate, inp.bolts
        if _splice(inp):  # Table 6.10, beam splice with bolted end plates: k5, k5, k10
            keff = [stf.k_eff_row([k5, k5, stf.k10_bolts(b.As, self.lb)])
                    for k5 in (stf.k5_end_plate(self.leff_plate[i], pl.tp, self.m_plate[i])
                               for i in range(len(self.tension)))]
            zeq, keq = stf.equivalent_lever_arm(keff, self.h_r)
            return stf.S_j_ini(zeq, [keq], inp.params), zeq
        dwc = col.h - 2 * (col.tf + col.r)
        keff = []
        for i in range(len(self.tension)):
            lc = self.leff_col[i]
            k3 = stf.k3_web_tension(lc, col.tw, dwc)
            k4 = stf.k4_column_flange(lc, col.tf, self.m_c)
            k5 = stf.k5_end_plate(self.leff_plate[i], pl.tp, self.m_plate[i])
            k10 = stf.k10_bolts(b.As, self.lb)
            keff.append(stf.k_eff_row([k3, k4, k5, k10]))
        zeq, keq = stf.equivalent_lever_arm(keff, self.h_r)
        k1 = stf.k1_web_panel(self.web.a_vc_plain, inp.beta, zeq)
        k2 = math.inf if self.comp_stiffener is not None else stf.k2_web_compression(
            beff, col.tw, dwc
        )
        return stf.S_j_ini(zeq, [k1, k2, keq], inp.params), zeq

    def result(self) -> SideResult:
        """The side's resistance, stiffness, shear and governing limit."""
        alone = self.rows_alone()
        groups = self.groups()
        compression, column_side, fcfb, beff = self.compression()
        v, gap = self.shared.shear(len(self.tension))
        if not self.tension:
            return SideResult(
                sign=self.sign, M_j_Rd=0.0, z=0.0, rows=(), components=tuple(self.comps),
                S_j_ini=None, governing=None, F_c_flange_Rd=min(column_side, fcfb),
                V_j_Rd=v, shear_gap=gap,
                no_tension=NotChecked(NotCheckedCode.NO_TENSION_ROWS, {"sign": self.sign}),
            )
        # every limit tried is kept for hogging (the sheet lists them); sagging keeps the
        # governing one of each row
        rr = distribute_tension(
            h=self.h_r, alone=alone, groups=groups, compression=compression, F_t_Rd=self.ft,
            candidates=self.sign == "hogging",
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
            governing=min(rr, key=lambda r: r.F_tr_Rd).limited_by,
            F_t_half_Rd=sum(r.F_tr_Rd for r in rr_n),
            F_c_flange_Rd=min(column_side, fcfb),
            V_j_Rd=v,
            shear_gap=gap,
        )


def _bearing_gap(inp: EndPlateJointInput, e1: float, p1: float | None) -> NotChecked | None:
    """Why Table 3.4's bearing formula does not apply: a spacing below Table 3.3's minimum.

    EN 1993-1-8:2005, 3.5 and Table 3.3: k1 and alpha_b of Table 3.4 hold for e1, e2 >= 1.2 d0,
    p1 >= 2.2 d0, p2 >= 2.4 d0 (0.5 mm allowed for modelling round-off).
    """
    b, pl, col = inp.bolts, inp.plate, inp.column
    d0 = b.d0
    checks = [
        ("e1", e1, e_min(d0)),
        ("e2 (plate)", (pl.bp - b.gauge) / 2, e_min(d0)),
        *([] if _splice(inp) else [("e2 (column flange)", (col.b - b.gauge) / 2, e_min(d0))]),
        ("p2", b.gauge, p2_min(d0)),
    ]
    if p1 is not None:
        checks.append(("p1", p1, p1_min(d0)))
    for name, value, least in checks:
        if value < least - 0.5:
            return NotChecked(NotCheckedCode.BEARING_OUT_OF_RANGE,
                              {"what": name, "value": value, "limit": least})
    return None


def _bearing(inp: EndPlateJointInput) -> tuple[float, float, NotChecked | None]:
    """Bearing of one bolt on the end plate and on the column flange, load downwards (N).

    EN 1993-1-8:2005, 3.6.1, Table 3.4: end distances to the plate's edges, the smallest
    pitch, side edge and gauge; the column flange has no end distance (it continues).
    """
    b, pl, col, p = inp.bolts, inp.plate, inp.column, inp.params
    rows = sorted(b.rows_from_beam_top)
    p1 = min((y - x for x, y in zip(rows, rows[1:], strict=False)), default=None)
    e1 = min(rows[0] + pl.projection_top, pl.projection_bottom + inp.beam.h - rows[-1])
    gap = _bearing_gap(inp, e1, p1)
    if gap is not None:
        return 0.0, 0.0, gap
    fb_plate = F_b_Rd(
        k1_bearing(d0=b.d0, e2=(pl.bp - b.gauge) / 2, p2=b.gauge),
        alpha_b(d0=b.d0, fub=b.fub, fu=pl.fu, e1=e1, p1=p1),
        pl.fu, b.d, pl.tp, p,
    )
    if _splice(inp):  # the other plate, the same as this one
        return fb_plate, fb_plate, None
    fb_col = F_b_Rd(
        k1_bearing(d0=b.d0, e2=(col.b - b.gauge) / 2, p2=b.gauge),
        alpha_b(d0=b.d0, fub=b.fub, fu=col.fu, p1=p1),
        col.fu, b.d, col.tf, p,
    )
    return fb_plate, fb_col, None


def _shear(sh: _Shared, n_tension: int) -> tuple[float | None, NotChecked | None]:
    """Vj,Rd of the bolt group with n_tension rows in tension (N), or why not.

    EN 1993-1-8:2005, Table 3.4 and 6.2.2(2) note; common practice: a bolt in a tension row
    takes min((1 - 1/1.4) Fv,Rd, Fb,Rd) (the interaction of Table 3.4 with Ft,Ed = Ft,Rd),
    the other bolts min(Fv,Rd, Fb,Rd); two bolts per row.
    """
    b, fv = sh.inp.bolts, sh.fv
    fb_plate, fb_col, gap = sh.bearing
    if gap is not None:
        return None, gap
    fb = min(fb_plate, fb_col)
    n_rows = len(b.rows_from_beam_top)
    tension_bolt = min((1 - 1 / 1.4) * fv, fb)
    return 2 * n_tension * tension_bolt + 2 * (n_rows - n_tension) * min(fv, fb), None


def _shear_summary(sh: _Shared, hog: SideResult) -> dict:
    """What the Vj,Rd note says: bolts in each kind of row and their resistances (N)."""
    b, fv = sh.inp.bolts, sh.fv
    fb_plate, fb_col, gap = sh.bearing
    n_tension = len(hog.rows)
    n_rows = len(b.rows_from_beam_top)
    return {
        "n_shear": 2 * (n_rows - n_tension),
        "per_bolt": min(fv, fb_plate, fb_col) if gap is None else 0.0,
        "n_tension": 2 * n_tension,
        "fb_plate": fb_plate,
        "fb_col": fb_col,
        "fv": fv,
        "out_of_range": gap is not None,
        "splice": _splice(sh.inp),
    }
