"""The design-code object of EN 1993-1-8: clause references, NDPs, component names and symbols.

A check result carries clauses as data (``Clause``) and components as codes (``Component``);
renderers ask the design-code object how to cite a clause and what to call a component, so a
second design code can live beside this one without touching them.
"""

from __future__ import annotations

from dataclasses import dataclass, field, replace
from enum import StrEnum

from ifcjoint.ec3.params import RECOMMENDED, Parameters


class Component(StrEnum):
    """Basic joint components of EN 1993-1-8 6.2.6 (and the welds of 4.5) that ifcjoint uses."""

    WEB_PANEL_SHEAR = "column_web_panel_shear"
    WEB_PANEL_SHEAR_OVER_BETA = "column_web_panel_shear_over_beta"
    COLUMN_WEB_COMPRESSION = "column_web_compression"
    STIFFENED_WEB_COMPRESSION = "stiffened_web_compression"
    COLUMN_WEB_TENSION = "column_web_tension"
    COLUMN_FLANGE_BENDING = "column_flange_bending"
    END_PLATE_BENDING = "end_plate_bending"
    BEAM_FLANGE_COMPRESSION = "beam_flange_web_compression"
    BEAM_WEB_TENSION = "beam_web_tension"
    BEAM_FLANGE_WELD = "beam_flange_weld"
    # nominally pinned joints (fin plates): shear components
    BOLT_GROUP_SHEAR = "bolt_group_shear"
    PLATE_BEARING = "fin_plate_bearing"
    BEAM_WEB_BEARING = "beam_web_bearing"
    PLATE_GROSS_SHEAR = "fin_plate_gross_shear"
    PLATE_NET_SHEAR = "fin_plate_net_shear"
    PLATE_BLOCK_TEARING = "fin_plate_block_tearing"
    PLATE_BENDING = "fin_plate_bending"
    BEAM_WEB_GROSS_SHEAR = "beam_web_gross_shear"
    BEAM_WEB_NET_SHEAR = "beam_web_net_shear"
    PLATE_WELD = "fin_plate_weld"
    HEADER_BOLT_SHEAR = "header_bolt_shear"
    HEADER_PLATE_BEARING = "header_plate_bearing"
    HEADER_SUPPORT_BEARING = "header_support_bearing"
    HEADER_PLATE_GROSS_SHEAR = "header_plate_gross_shear"
    HEADER_PLATE_NET_SHEAR = "header_plate_net_shear"
    HEADER_PLATE_BLOCK_TEARING = "header_plate_block_tearing"
    HEADER_BEAM_WEB_SHEAR = "header_beam_web_shear"
    HEADER_WELD = "header_plate_weld"
    PLATE_LTB = "fin_plate_lateral_torsional_buckling"
    ON_WEB_BOLTS = "end_plate_on_web_bolts"
    CLEAT_WEB_BOLTS = "cleat_web_side_bolt_group"
    CLEAT_BEARING = "cleat_bearing_web_side"
    CLEAT_BEAM_WEB_BEARING = "cleat_beam_web_bearing"
    CLEAT_SUPPORT_BOLTS = "cleat_support_side_bolts"
    CLEAT_SUPPORT_BEARING = "cleat_support_side_bearing"
    CLEAT_SHEAR = "cleat_shear"
    CLEAT_BEAM_WEB_BLOCK = "cleat_beam_web_block_tearing"
    TIE_CLEAT_BENDING = "tie_cleat_bending"
    TIE_CLEAT_BEARING = "tie_cleat_bearing"
    TIE_CLEAT_BLOCK_TEARING = "tie_cleat_block_tearing"
    TIE_BEAM_WEB_BLOCK_TEARING = "tie_beam_web_block_tearing"
    SUPPORT_WEB_SHEAR = "supporting_web_local_shear"
    TIE_BOLT_SHEAR = "tie_bolt_shear"
    TIE_PLATE_BEARING = "tie_fin_plate_bearing"
    TIE_BEAM_WEB_BEARING = "tie_beam_web_bearing"
    TIE_PLATE_TENSION = "tie_fin_plate_net_tension"
    TIE_PLATE_BLOCK_TEARING = "tie_fin_plate_block_tearing"
    TIE_BEAM_WEB_TENSION = "tie_beam_web_net_tension"


class Zone(StrEnum):
    """Where a component sits, in the order an engineer checks by hand."""

    TENSION = "tension zone"
    COMPRESSION = "compression zone"
    SHEAR = "shear zone"
    TYING = "tying (axial tension)"
    SUPPORT = "supporting member"


@dataclass(frozen=True, slots=True)
class Clause:
    """A clause of a design code as data: ``Clause("EN 1993-1-8", "6.2.6.4")``."""

    code: str
    ref: str


@dataclass(frozen=True, slots=True, kw_only=True)
class ComponentInfo:
    """How the code names a component, its resistance formula and its zone."""

    name: str
    formula: str
    zone: Zone = Zone.TENSION


_T_STUB = (
    "T-stub (Table 6.2): F_T,1,Rd = 4 M_pl,1,Rd / m (or the alternative with e_w), "
    "F_T,2,Rd = (2 M_pl,2,Rd + n sum F_t,Rd) / (m + n), F_T,3,Rd = sum F_t,Rd; "
    "M_pl,Rd = 0.25 sum l_eff t_f^2 f_y / gamma_M0"
)

#: EN 1993-1-8:2005 names of the components and the formulas the calculation sheet shows.
COMPONENTS: dict[Component, ComponentInfo] = {
    Component.WEB_PANEL_SHEAR: ComponentInfo(
        name="column web panel in shear",
        formula="V_wp,Rd = 0.9 f_y,wc A_vc / (sqrt(3) gamma_M0)",
        zone=Zone.SHEAR,
    ),
    Component.WEB_PANEL_SHEAR_OVER_BETA: ComponentInfo(
        name="column web panel in shear / beta", formula="V_wp,Rd / beta", zone=Zone.SHEAR
    ),
    Component.COLUMN_WEB_COMPRESSION: ComponentInfo(
        name="column web in compression",
        formula=(
            "F_c,wc,Rd = omega k_wc b_eff,c,wc t_wc f_y,wc / gamma_M0, "
            "at most omega k_wc rho b_eff,c,wc t_wc f_y,wc / gamma_M1"
        ),
        zone=Zone.COMPRESSION,
    ),
    Component.STIFFENED_WEB_COMPRESSION: ComponentInfo(
        name="column web with compression stiffeners",
        formula=(
            "min(crushing (A_s,net f_y,s + b_eff,c,wc t_wc f_y,wc) / gamma_M0, buckling of the "
            "cruciform section chi A_s f_y / gamma_M1 (EN 1993-1-5 9.4, curve c))"
        ),
        zone=Zone.COMPRESSION,
    ),
    Component.COLUMN_WEB_TENSION: ComponentInfo(
        name="column web in tension", formula="F_t,wc,Rd = omega b_eff,t,wc t_wc f_y,wc / gamma_M0"
    ),
    Component.COLUMN_FLANGE_BENDING: ComponentInfo(
        name="column flange in bending", formula=_T_STUB
    ),
    Component.END_PLATE_BENDING: ComponentInfo(
        name="end plate in bending",
        formula=(
            "T-stub (Table 6.2) on the plate: modes 1, 2, 3 as for the column flange, with "
            "l_eff of Table 6.6 and t_p, f_y,p"
        ),
    ),
    Component.BEAM_FLANGE_COMPRESSION: ComponentInfo(
        name="beam flange and web in compression",
        formula="F_c,fb,Rd = M_c,Rd / (h - t_fb)",
        zone=Zone.COMPRESSION,
    ),
    Component.BEAM_WEB_TENSION: ComponentInfo(
        name="beam web in tension", formula="F_t,wb,Rd = b_eff,t,wb t_wb f_y,wb / gamma_M0"
    ),
    Component.BEAM_FLANGE_WELD: ComponentInfo(
        name="beam flange weld",
        formula="F_w,Rd = 2 a b_b f_vw,d, f_vw,d = f_u / (sqrt(3) beta_w gamma_M2)",
    ),
    Component.BOLT_GROUP_SHEAR: ComponentInfo(
        name="bolt group in shear (eccentric)",
        formula="V_Rd = n F_v,Rd / sqrt((1 + alpha n)^2 + (beta n)^2)", zone=Zone.SHEAR),
    Component.PLATE_BEARING: ComponentInfo(
        name="bolts in bearing on the fin plate",
        formula="V_Rd = n / sqrt(((1 + alpha n) / F_b,ver,Rd)^2 + (beta n / F_b,hor,Rd)^2), "
        "F_b,Rd = k1 alpha_b f_u d t / gamma_M2", zone=Zone.SHEAR),
    Component.BEAM_WEB_BEARING: ComponentInfo(
        name="bolts in bearing on the beam web",
        formula="as for the fin plate, with t_w and the beam web's edge distances",
        zone=Zone.SHEAR),
    Component.PLATE_GROSS_SHEAR: ComponentInfo(
        name="fin plate, gross section in shear",
        formula="V_Rd = h_p t_p f_y / (1.27 sqrt(3) gamma_M0)", zone=Zone.SHEAR),
    Component.PLATE_NET_SHEAR: ComponentInfo(
        name="fin plate, net section in shear",
        formula="V_Rd = A_v,net f_u / (sqrt(3) gamma_M2), A_v,net = t_p (h_p - n1 d0)",
        zone=Zone.SHEAR),
    Component.PLATE_BLOCK_TEARING: ComponentInfo(
        name="fin plate, block tearing",
        formula="V_eff,2,Rd = 0.5 f_u A_nt / gamma_M2 + f_y A_nv / (sqrt(3) gamma_M0)",
        zone=Zone.SHEAR),
    Component.PLATE_BENDING: ComponentInfo(
        name="fin plate in bending",
        formula="V_Rd = (t_p h_p^2 / 6) f_y / (z gamma_M0); none when h_p >= 2.73 z",
        zone=Zone.SHEAR),
    Component.BEAM_WEB_GROSS_SHEAR: ComponentInfo(
        name="beam web, gross section in shear",
        formula="V_pl,Rd = A_v f_y / (sqrt(3) gamma_M0) (EN 1993-1-1 6.2.6)", zone=Zone.SHEAR),
    Component.BEAM_WEB_NET_SHEAR: ComponentInfo(
        name="beam web, net section in shear",
        formula="V_Rd = (A_v - n1 d0 t_w) f_u / (sqrt(3) gamma_M2)", zone=Zone.SHEAR),
    Component.PLATE_WELD: ComponentInfo(
        name="fin plate to support welds",
        formula="F_w,Rd = 2 a h_p f_vw,d, f_vw,d = f_u / (sqrt(3) beta_w gamma_M2)",
        zone=Zone.SHEAR),
    Component.HEADER_BOLT_SHEAR: ComponentInfo(
        name="bolts in shear (partial-depth end plate)",
        formula="V_Rd = 0.8 n F_v,Rd (0.8: tension in the bolts, design guide)",
        zone=Zone.SHEAR),
    Component.HEADER_PLATE_BEARING: ComponentInfo(
        name="bolts in bearing on the end plate",
        formula="V_Rd = n min F_b,Rd, F_b,Rd = k1 alpha_b f_u d t_p / gamma_M2", zone=Zone.SHEAR),
    Component.HEADER_SUPPORT_BEARING: ComponentInfo(
        name="bolts in bearing on the column",
        formula="V_Rd = n F_b,Rd with t and f_u of the column (inner bolts)", zone=Zone.SHEAR),
    Component.HEADER_PLATE_GROSS_SHEAR: ComponentInfo(
        name="end plate, gross section in shear",
        formula="V_Rd = 2 h_p t_p f_y / (1.27 sqrt(3) gamma_M0)", zone=Zone.SHEAR),
    Component.HEADER_PLATE_NET_SHEAR: ComponentInfo(
        name="end plate, net section in shear",
        formula="V_Rd = 2 t_p (h_p - n1 d0) f_u / (sqrt(3) gamma_M2)", zone=Zone.SHEAR),
    Component.HEADER_PLATE_BLOCK_TEARING: ComponentInfo(
        name="end plate, block tearing",
        formula="V_Rd = 2 (f_u A_nt / gamma_M2 + f_y A_nv / (sqrt(3) gamma_M0))",
        zone=Zone.SHEAR),
    Component.HEADER_BEAM_WEB_SHEAR: ComponentInfo(
        name="beam web in shear at the end plate",
        formula="V_Rd = h_p t_w f_y / (sqrt(3) gamma_M0)", zone=Zone.SHEAR),
    Component.HEADER_WELD: ComponentInfo(
        name="end plate to beam web welds",
        formula="F_w,Rd = 2 a h_p f_vw,d, f_vw,d = f_u / (sqrt(3) beta_w gamma_M2)",
        zone=Zone.SHEAR),
    Component.PLATE_LTB: ComponentInfo(
        name="fin plate, lateral torsional buckling (long plate)",
        formula="V_Rd = min(W_el f_p,LT / (0.6 z gamma_M1), W_el f_y / (z gamma_M0)), "
        "lambda_LT = 2.8 (z_p h_p / (1.5 t_p^2))^0.5", zone=Zone.SHEAR),
    Component.ON_WEB_BOLTS: ComponentInfo(
        name="bolts in shear and bearing (end plate on a web)",
        formula="V_Rd = 2 n_t min(F_v,Rd / 3.5, F_b,Rd) + 2 (n - n_t) min(F_v,Rd, F_b,Rd), "
        "F_b,Rd the least on the plate and on the web", zone=Zone.SHEAR),
    Component.CLEAT_WEB_BOLTS: ComponentInfo(
        name="web-side bolt group in double shear (eccentric)",
        formula="V_Rd = 2 n F_v,Rd / sqrt((1 + alpha n)^2 + (beta n)^2)", zone=Zone.SHEAR),
    Component.CLEAT_BEARING: ComponentInfo(
        name="web-side bolts in bearing on the two cleats",
        formula="V_Rd = 2 n / sqrt(((1 + alpha n) / F_b,ver,Rd)^2 + (beta n / F_b,hor,Rd)^2)",
        zone=Zone.SHEAR),
    Component.CLEAT_BEAM_WEB_BEARING: ComponentInfo(
        name="web-side bolts in bearing on the beam web",
        formula="V_Rd = n / sqrt(((1 + alpha n) / F_b,ver,Rd)^2 + (beta n / F_b,hor,Rd)^2)",
        zone=Zone.SHEAR),
    Component.CLEAT_SUPPORT_BOLTS: ComponentInfo(
        name="support-side bolts in shear", formula="V_Rd = 0.8 n_s F_v,Rd", zone=Zone.SHEAR),
    Component.CLEAT_SUPPORT_BEARING: ComponentInfo(
        name="support-side bolts in bearing (cleats, support)",
        formula="V_Rd = n_s min(F_b,Rd on a cleat, F_b,Rd on the support)", zone=Zone.SHEAR),
    Component.CLEAT_SHEAR: ComponentInfo(
        name="cleats in shear (gross, net, block tearing; the least, either leg)",
        formula="2 min(h_a t_a f_y / (sqrt 3 gamma_M0), A_v,net f_u / (sqrt 3 gamma_M2), "
        "0.5 f_u A_nt / gamma_M2 + f_y A_nv / (sqrt 3 gamma_M0))", zone=Zone.SHEAR),
    Component.CLEAT_BEAM_WEB_BLOCK: ComponentInfo(
        name="beam web, block tearing at a notch",
        formula="V_Rd = 0.5 f_u A_nt / gamma_M2 + f_y A_nv / (sqrt 3 gamma_M0)",
        zone=Zone.SHEAR),
    Component.TIE_CLEAT_BENDING: ComponentInfo(
        name="tying: cleats in bending (support-side legs as T-stubs)",
        formula="N_Rd = 2 min(4 M_pl / m, (2 M_pl + n sum F_t) / (m + n), sum F_t), "
        "M_pl = 0.25 h_a t_a^2 f_y / gamma_Mu", zone=Zone.TYING),
    Component.TIE_CLEAT_BEARING: ComponentInfo(
        name="tying: web-side bolts in bearing on the cleats",
        formula="N_Rd = 2 n k1 alpha_b f_u d t_a / gamma_Mu (horizontal)", zone=Zone.TYING),
    Component.TIE_CLEAT_BLOCK_TEARING: ComponentInfo(
        name="tying: cleats, block tearing",
        formula="N_Rd = f_u A_nt / gamma_Mu + f_y A_nv / (sqrt(3) gamma_M0)", zone=Zone.TYING),
    Component.TIE_BEAM_WEB_BLOCK_TEARING: ComponentInfo(
        name="tying: beam web, block tearing",
        formula="N_Rd = f_u A_nt / gamma_Mu + f_y A_nv / (sqrt(3) gamma_M0)", zone=Zone.TYING),
    Component.SUPPORT_WEB_SHEAR: ComponentInfo(
        name="supporting web, local shear",
        formula="V_Rd = 2 h_p t_w f_y / (sqrt(3) gamma_M0), against the reactions of both sides",
        zone=Zone.SUPPORT),
    Component.TIE_BOLT_SHEAR: ComponentInfo(
        name="tying: bolts in shear", formula="N_Rd = n F_v,Rd (with gamma_Mu)",
        zone=Zone.TYING),
    Component.TIE_PLATE_BEARING: ComponentInfo(
        name="tying: bolts in bearing on the fin plate",
        formula="N_Rd = n k1 alpha_b f_u d t_p / gamma_Mu (horizontal)", zone=Zone.TYING),
    Component.TIE_BEAM_WEB_BEARING: ComponentInfo(
        name="tying: bolts in bearing on the beam web",
        formula="N_Rd = n k1 alpha_b f_u d t_w / gamma_Mu (horizontal)", zone=Zone.TYING),
    Component.TIE_PLATE_TENSION: ComponentInfo(
        name="tying: fin plate net section in tension",
        formula="N_Rd = 0.9 A_net f_u / gamma_Mu, A_net = t_p (h_p - n1 d0)", zone=Zone.TYING),
    Component.TIE_PLATE_BLOCK_TEARING: ComponentInfo(
        name="tying: fin plate block tearing",
        formula="N_Rd = f_u A_nt / gamma_Mu + f_y A_nv / (sqrt(3) gamma_M0)", zone=Zone.TYING),
    Component.TIE_BEAM_WEB_TENSION: ComponentInfo(
        name="tying: beam web net section in tension",
        formula="N_Rd = 0.9 A_net f_u / gamma_Mu, A_net = t_w (h_p - n1 d0)", zone=Zone.TYING),
}

#: Symbols of the joint properties, as EN 1993-1-8 prints them.
SYMBOLS = {
    "M_j_Rd": "Mj,Rd",
    "V_j_Rd": "Vj,Rd",
    "V_wp_Rd": "Vwp,Rd",
    "V_wp_Ed": "Vwp,Ed",
    "N_j_Rd": "Nj,Rd",
    "S_j_ini": "Sj,ini",
}


@dataclass(frozen=True, slots=True, kw_only=True)
class Eurocode3:
    """EN 1993-1-8 as a design-code object: its name, NDPs, clauses, components and symbols.

    Attributes:
        name: the standard's designation, used to cite its clauses.
        edition: the edition the formulas follow.
        params: partial factors and other nationally determined parameters (recommended
            values unless a National Annex file changed them).
    """

    name: str = "EN 1993-1-8"
    edition: str = "2005"
    params: Parameters = RECOMMENDED
    components: dict[Component, ComponentInfo] = field(default_factory=lambda: dict(COMPONENTS))
    symbols: dict[str, str] = field(default_factory=lambda: dict(SYMBOLS))

    def clause(self, ref: str) -> Clause:
        """A clause of this code as data."""
        return Clause(self.name, ref)

    def cite(self, ref: str | Clause) -> str:
        """A clause as people cite it: ``EN 1993-1-8 6.2.7.2`` (``common practice`` alone)."""
        if isinstance(ref, Clause):
            return f"{ref.code} {ref.ref}" if ref.ref else ref.code
        return f"{self.name} {ref}"

    def ref(self, clause: Clause) -> str:
        """A clause as the outputs write it: bare for this code's own, cited for another's."""
        if clause.code == self.name:
            return clause.ref
        return f"{clause.code} {clause.ref}" if clause.ref else clause.code

    def component_name(self, component: Component | str) -> str:
        """What the code calls a component (``column flange in bending``)."""
        return self.components[Component(component)].name

    def symbol(self, key: str) -> str:
        """The printed symbol of a joint property (``M_j_Rd`` -> ``Mj,Rd``)."""
        return self.symbols[key]

    def with_params(self, params: Parameters) -> Eurocode3:
        """The same code with other nationally determined parameters."""
        return replace(self, params=params)


EN_1993_1_8 = Eurocode3()
