"""What the check engine returns: data in N, mm, N mm, rad, with clauses and codes.

No words and no display units here: the renderers (``ifcjoint.report``) turn these into the
calculation sheet, the JSON and the property sets.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from typing import Any

from ifcjoint.ec3 import stiffness as stf
from ifcjoint.ec3.code import Clause, Component
from ifcjoint.ec3.moment_resistance import Limit, RowResult
from ifcjoint.engine.inputs import JointInput
from ifcjoint.model.codes import NotChecked, Note, StiffnessClass, StrengthClass


@dataclass(slots=True)
class ComponentResult:
    """One component's resistance (N), its clause and how it was found.

    Attributes:
        clause: the clause that gives the resistance (``Clause("EN 1993-1-8", "6.2.6.4")``).
        component: which component.
        F_Rd: its design resistance, N.
        mode: the governing T-stub mode, when it is one.
        row: the bolt row, for a row alone.
        rows: the rows of a group.
        inputs: the values it was computed with (mm, MPa, N), by their symbols.

    Not frozen (made by the thousand, and a frozen dataclass is twice as slow to make):
    treat as read-only.
    """

    clause: Clause
    component: Component
    F_Rd: float
    mode: str = ""
    row: int | None = None
    rows: tuple[int, ...] = ()
    inputs: dict[str, Any] = field(default_factory=dict)


@dataclass(frozen=True, slots=True, kw_only=True)
class Condition:
    """A rule of a design method that holds or not, whatever the load (measured <= limit).

    Attributes:
        clause: where the rule comes from.
        name: what it limits (a code the renderers put in words, e.g. ``punching``).
        measured: the value of the joint (mm, MPa: ``unit`` says which).
        limit: the largest value the rule allows.
        inputs: the values the limit was computed with.
    """

    clause: Clause
    name: str
    measured: float
    limit: float
    unit: str = "mm"
    inputs: dict[str, Any] = field(default_factory=dict)

    @property
    def holds(self) -> bool:
        """True when the measured value is within the limit."""
        return self.measured <= self.limit + 1e-9


@dataclass(frozen=True, slots=True, kw_only=True)
class SideResult:
    """Resistance and stiffness for one moment sign.

    Attributes:
        sign: hogging (top in tension) or sagging (bottom in tension).
        M_j_Rd: design moment resistance, N mm.
        z: lever arm, mm (equivalent, 6.3.3.1).
        rows: the effective tension resistance of each row.
        components: every component resistance, in the order computed.
        S_j_ini: initial rotational stiffness, N mm / rad (None: no bolt row in tension).
        governing: what limited the resistance.
        F_t_half_Rd: tension of this half's rows with no compression limit, N (for Nj,Rd).
        F_c_flange_Rd: compression resistance at this sign's compression flange, N.
        V_j_Rd: shear resistance of the joint with this sign's tension rows, N (None: not
            available, ``shear_gap`` says why).
        no_tension: why this sign carries no moment (no bolt row in its tension zone), or None.
        shear_gap: why the shear resistance is not available, or None.
    """

    sign: str
    M_j_Rd: float
    z: float
    rows: tuple[RowResult, ...]
    components: tuple[ComponentResult, ...]
    S_j_ini: float | None
    governing: Limit | None
    F_t_half_Rd: float = 0.0
    F_c_flange_Rd: float = 0.0
    V_j_Rd: float | None = None
    no_tension: NotChecked | None = None
    shear_gap: NotChecked | None = None


@dataclass(frozen=True, slots=True, kw_only=True)
class Classification:
    """Classification by stiffness (5.2.2.5) and by strength (5.2.3.3), with the boundaries.

    A class that could not be decided is None, with the reason in ``stiffness_gap`` or
    ``strength_gap``.
    """

    stiffness: StiffnessClass | None = None
    stiffness_gap: NotChecked | None = None
    kb: float | None = None
    rigid_from: float | None = None  # N mm / rad
    pinned_up_to: float | None = None  # N mm / rad
    strength: StrengthClass | None = None
    strength_sagging: StrengthClass | None = None
    strength_gap: NotChecked | None = None
    full_strength_from: float | None = None  # N mm


@dataclass(frozen=True, slots=True, kw_only=True)
class CheckResult:
    """The joint check: both signs, shear, stiffness, classification, or why not checked.

    Attributes:
        not_checked: why the joint was not checked (None: checked).
        hogging, sagging: the two moment signs.
        V_j_Rd: shear resistance of the joint, N.
        V_wp_Rd: shear resistance of the column web panel, N.
        classification: stiffness and strength classes.
        notes: how the result was obtained (assumptions, defaults), as codes.
        input: the engine input used (None when no input could be built).
        joint_kind: the joint type of EN 1993-1-8 Table 6.8 for the M-phi curve's psi.
    """

    not_checked: NotChecked | None = None
    hogging: SideResult | None = None
    sagging: SideResult | None = None
    V_j_Rd: float | None = None
    V_wp_Rd: float | None = None
    classification: Classification | None = None
    notes: tuple[Note, ...] = ()
    input: JointInput | None = None
    joint_kind: str = "bolted_end_plate"
    #: what a checked result still leaves unchecked: the joint cannot pass while any remains
    gaps: tuple[NotChecked, ...] = ()
    #: tying resistance of a nominally pinned joint (axial tension, gamma_Mu), N
    N_j_Rd_tie: float | None = None
    #: rules of the method that hold whatever the load (a broken one fails the joint)
    conditions: tuple[Condition, ...] = ()

    @property
    def checked(self) -> bool:
        """True when the engine computed the joint's resistances."""
        return self.not_checked is None

    @property
    def status(self) -> str:
        """``checked`` or ``not_checked`` (the engine's own status, as the outputs name it)."""
        return "checked" if self.checked else "not_checked"

    def side(self, sign: str) -> SideResult | None:
        """The result of one moment sign."""
        return self.hogging if sign == "hogging" else self.sagging

    @property
    def N_j_Rd_tension(self) -> float | None:
        """Axial tension resistance of the joint with no moment, N (for 6.2.7.1(3)).

        Common practice, no source: every bolt row in tension, each half of the joint by the
        row distribution of 6.2.7.2 without the compression-side limit (welded: the flange
        tension components), both halves added.
        """
        if self.hogging is None or self.sagging is None:
            return None
        return self.hogging.F_t_half_Rd + self.sagging.F_t_half_Rd

    @property
    def N_j_Rd_compression(self) -> float | None:
        """Axial compression resistance of the joint with no moment, N (for 6.2.7.1(3)).

        Common practice, no source: both beam flanges bearing, each limited by the column web
        in compression and the beam flange and web in compression at that flange.
        """
        if self.hogging is None or self.sagging is None:
            return None
        return self.hogging.F_c_flange_Rd + self.sagging.F_c_flange_Rd

    def m_phi(self, sign: str = "hogging") -> list[tuple[float, float]]:
        """Design M-phi curve (rad, N mm) for one sign, EN 1993-1-8 6.3.1(4)."""
        side = self.side(sign)
        if side is None or side.S_j_ini is None or side.S_j_ini <= 0:
            return []
        if not math.isfinite(side.S_j_ini) or side.M_j_Rd <= 0:
            return []
        return stf.m_phi_curve(side.M_j_Rd, side.S_j_ini, self.joint_kind)


def not_checked(reason: NotChecked, inp: JointInput | None = None) -> CheckResult:
    """A result that says why the joint was not checked (never a pass)."""
    return CheckResult(not_checked=reason, input=inp)
