"""Design forces on joints and their verification against the check engine (N, mm, MPa).

A ``Demand`` is one load combination on one joint, already converted to N and N mm. The
functions here take a joint's engine input and its demands, re-run the check for each
combination (the transformation parameter beta and the frame's bracing depend on the demands),
and return utilisations with their clause, so every number can be traced. No IFC, no files.

Sign conventions (also in docs/demands.md):
    * M_Ed < 0 is hogging (top flange in tension), M_Ed > 0 sagging; the same convention for
      the beam on the other side of the column (``M_other``), each seen from its own beam.
    * N_Ed > 0 is tension in the beam, N_Ed < 0 compression.
    * Vc_above, Vc_below: shear forces in the column above and below the joint, in the sense
      of EN 1993-1-8 Figure 5.6 (Eq. (5.3) takes their difference).
"""

from __future__ import annotations

from dataclasses import dataclass, field, replace

from ifcjoint.ec3 import components as cmp
from ifcjoint.ec3.moment_resistance import M_N_interaction
from ifcjoint.engine.check import (
    CheckResult,
    EndPlateJointInput,
    WeldedJointInput,
    check_end_plate_joint,
    check_welded_joint,
)

#: Joint statuses; everything but pass and fail counts as unchecked.
STATUSES = ("pass", "fail", "no_demands", "incomplete", "unsupported", "unreadable")
UNCHECKED = ("no_demands", "incomplete", "unsupported", "unreadable")
JOINT_MODELS = ("rigid", "semi-rigid", "pinned")


@dataclass(frozen=True, slots=True, kw_only=True)
class Demand:
    """One load combination on one joint (N, N mm).

    Attributes:
        combination: name of the load combination.
        M_Ed: moment at the joint, N mm (negative: hogging).
        V_Ed: vertical shear, N (magnitude used).
        N_Ed: axial force in the beam, N (positive: tension).
        M_other: moment of the beam on the other side, N mm, or None (single-sided, or not given).
        Vc_above: shear force in the column above, N, or None when not given.
        Vc_below: shear force in the column below, N, or None when not given.
        braced: frame braced (kb = 8) or not (kb = 25); None: the run's setting.
        assumed_joint: what the analysis model assumed (rigid, semi-rigid, pinned) or None.
        source: where the row came from, e.g. ``demands.csv:12``.
    """

    combination: str
    M_Ed: float  # noqa: N815
    V_Ed: float  # noqa: N815
    N_Ed: float = 0.0  # noqa: N815
    M_other: float | None = None
    Vc_above: float | None = None  # noqa: N815
    Vc_below: float | None = None  # noqa: N815
    braced: bool | None = None
    assumed_joint: str | None = None
    source: str = ""
    other_source: str = ""  # where M_other came from when taken from the partner's row


@dataclass(frozen=True, slots=True, kw_only=True)
class Utilisation:
    """One demand over one resistance, with the clause that gives the resistance."""

    clause: str
    name: str
    demand: float
    resistance: float
    unit: str  # kN, kNm or "-" for an interaction value
    utilisation: float
    combination: str
    detail: str = ""

    def as_dict(self) -> dict:
        """JSON-ready form (kN, kNm)."""
        return {
            "clause": self.clause,
            "name": self.name,
            "combination": self.combination,
            "demand": round(self.demand, 2),
            "resistance": round(self.resistance, 2),
            "unit": self.unit,
            "utilisation": round(self.utilisation, 3),
            "detail": self.detail,
        }


@dataclass(frozen=True, slots=True, kw_only=True)
class CombinationResult:
    """The check of one joint for one load combination."""

    demand: Demand
    beta: float
    result: CheckResult
    utilisations: tuple[Utilisation, ...]
    notes: tuple[str, ...] = ()

    @property
    def governing(self) -> Utilisation | None:
        """The highest utilisation of this combination."""
        return max(self.utilisations, key=lambda u: u.utilisation, default=None)


@dataclass(frozen=True, slots=True, kw_only=True)
class JointVerdict:
    """A joint's status over all its combinations, and the assumption check."""

    status: str
    reason: str = ""
    combinations: tuple[CombinationResult, ...] = ()
    assumption: dict = field(default_factory=dict)

    @property
    def governing(self) -> Utilisation | None:
        """The highest utilisation over every combination."""
        best = [c.governing for c in self.combinations if c.governing is not None]
        return max(best, key=lambda u: u.utilisation, default=None)

    @property
    def governing_combination(self) -> CombinationResult | None:
        """The combination holding the governing utilisation."""
        g = self.governing
        if g is None:
            return None
        return next(c for c in self.combinations if c.demand.combination == g.combination)


def transformation_beta(demand: Demand, double_sided: bool) -> tuple[float, str]:
    """Transformation parameter beta of the column web panel for one combination.

    EN 1993-1-8:2005, 5.3(7), Table 5.4 (approximate values); single-sided joints take 1.
    With a beam on the other side whose moment is not given, 1 is kept for that side (the
    value of a one-sided joint; for a balanced pair it is conservative, for opposed moments
    it is not, so it is reported).
    """
    if not double_sided:
        return 1.0, "beta = 1: single-sided joint (Table 5.4)"
    if demand.M_other is None:
        return 1.0, (
            "beta = 1: double-sided joint but M_Ed of the other side not given (Table 5.4; "
            "unconservative if the two moments are opposed)"
        )
    b = cmp.beta_from_moments(demand.M_Ed, demand.M_other)
    src = f" (other side from {demand.other_source})" if demand.other_source else ""
    return b, f"beta = {b:g} from the moments of both sides (Table 5.4){src}"


def web_panel_shear(demand: Demand, z: float) -> tuple[float, str]:
    """Shear force in the column web panel Vwp,Ed for one combination, N (magnitude).

    EN 1993-1-8:2005, 5.3(3), Eq. (5.3) with z the joint's lever arm (6.2.7). Moments in this
    module's convention (hogging negative on each side), so two equal hogging moments balance.
    Column shears not given are taken as zero, which is reported.
    """
    m2 = demand.M_other if demand.M_other is not None else 0.0
    vc1 = demand.Vc_above if demand.Vc_above is not None else 0.0
    vc2 = demand.Vc_below if demand.Vc_below is not None else 0.0
    v = abs(cmp.V_wp_Ed(demand.M_Ed, m2, z, vc1, vc2))
    note = ""
    if demand.Vc_above is None and demand.Vc_below is None:
        note = "column shears not given: (Vc1,Ed - Vc2,Ed)/2 taken as 0 in Eq. (5.3)"
    return v, note


def _recheck(inp: EndPlateJointInput | WeldedJointInput, beta: float, braced: bool, cache=None):
    """The engine result for this beta and bracing (one run per distinct pair and joint)."""
    key = (beta, braced)
    if cache is not None and key in cache:
        return cache[key]
    r = _run(replace(inp, beta=beta, braced=braced))
    if cache is not None:
        cache[key] = r
    return r


def _run(new: EndPlateJointInput | WeldedJointInput) -> CheckResult:
    if isinstance(new, WeldedJointInput):
        return check_welded_joint(new)
    return check_end_plate_joint(new)


def verify_combination(
    inp: EndPlateJointInput | WeldedJointInput,
    demand: Demand,
    *,
    double_sided: bool,
    braced_default: bool = True,
    _cache: dict | None = None,
) -> CombinationResult:
    """Check a joint for one load combination.

    EN 1993-1-8:2005: moment against Mj,Rd of the moment's sign (6.2.7.2), shear against
    Vj,Rd (Table 3.4), web panel shear Vwp,Ed (5.3(3)) against Vwp,Rd (6.2.6.1), and the M-N
    interaction (6.2.7.1(3)) when N_Ed exceeds 5 % of the beam's Npl,Rd (6.2.7.1(2)).
    """
    beta, beta_note = transformation_beta(demand, double_sided)
    braced = braced_default if demand.braced is None else demand.braced
    r = _recheck(inp, beta, braced, _cache)
    notes = [beta_note]
    if r.status != "checked":
        return CombinationResult(demand=demand, beta=beta, result=r, utilisations=(), notes=())
    c = demand.combination
    sign = "hogging" if demand.M_Ed < 0 else "sagging"
    side = r.hogging if sign == "hogging" else r.sagging
    us = []
    m_rd = side.M_j_Rd
    us.append(
        Utilisation(
            clause="6.2.7.2",
            name=f"moment resistance Mj,Rd ({sign})",
            demand=abs(demand.M_Ed) / 1e6,
            resistance=m_rd / 1e6,
            unit="kNm",
            utilisation=float(abs(demand.M_Ed) / m_rd) if m_rd > 0 else float("inf"),
            combination=c,
            detail=f"governed by {side.governing}",
        )
    )
    us.append(
        Utilisation(
            clause="Table 3.4",
            name="shear resistance Vj,Rd",
            demand=abs(demand.V_Ed) / 1e3,
            resistance=r.V_j_Rd / 1e3,
            unit="kN",
            utilisation=float(abs(demand.V_Ed) / r.V_j_Rd) if r.V_j_Rd > 0 else float("inf"),
            combination=c,
        )
    )
    v_wp, vnote = web_panel_shear(demand, side.z)
    if vnote:
        notes.append(vnote)
    us.append(
        Utilisation(
            clause="6.2.6.1; 5.3(3)",
            name="column web panel in shear",
            demand=v_wp / 1e3,
            resistance=r.V_wp_Rd / 1e3,
            unit="kN",
            utilisation=float(v_wp / r.V_wp_Rd),
            combination=c,
            detail=f"Vwp,Ed by Eq. (5.3) with z = {side.z:.0f} mm",
        )
    )
    beam = (inp.beam.h, inp.beam.b, inp.beam.tw, inp.beam.tf, inp.beam.r)
    area = _i_area(*beam)
    if cmp.axial_force_significant(demand.N_Ed, area, inp.beam.fy, inp.params):
        n_rd = r.N_j_Rd_tension if demand.N_Ed > 0 else r.N_j_Rd_compression
        sense = "tension" if demand.N_Ed > 0 else "compression"
        us.append(
            Utilisation(
                clause="6.2.7.1(3)",
                name=f"bending and axial {sense} (Eq. 6.24)",
                demand=abs(demand.N_Ed) / 1e3,
                resistance=n_rd / 1e3,
                unit="-",
                utilisation=M_N_interaction(demand.M_Ed, m_rd, demand.N_Ed, n_rd),
                combination=c,
                detail=f"Mj,Ed/Mj,Rd + Nj,Ed/Nj,Rd with Nj,Rd = {n_rd / 1e3:.0f} kN",
            )
        )
    elif demand.N_Ed:
        notes.append("N_Ed at most 5 % of the beam's Npl,Rd: neglected (6.2.7.1(2))")
    return CombinationResult(
        demand=demand, beta=beta, result=r, utilisations=tuple(us), notes=tuple(notes)
    )


def _i_area(h: float, b: float, tw: float, tf: float, r: float) -> float:
    """Gross area of an I section with root radii, mm2."""
    return 2 * b * tf + (h - 2 * tf) * tw + (4 - 3.141592653589793) * r * r


def assumption_check(result: CheckResult, assumed: str | None) -> dict:
    """Compare what the analysis assumed with the stiffness class of the joint.

    EN 1993-1-8:2005, 5.2.2.1 and 5.2.2.5: a joint may be modelled as rigid only when it
    classifies as rigid, as pinned only when nominally pinned; a semi-rigid model is fine in
    every case here as long as its stiffness is that of the joint (Sj,ini reported).
    """
    if not assumed:
        return {}
    cls = result.classification.get("stiffness", "") if result.classification else ""
    if not cls or cls.startswith("not classified"):
        return {"assumed": assumed, "computed": cls or "unknown", "match": None}
    computed = "pinned" if cls == "nominally pinned" else cls
    match = assumed == "semi-rigid" or assumed == computed
    return {"assumed": assumed, "computed": cls, "match": match}


def verify_joint(
    inp: EndPlateJointInput | WeldedJointInput,
    demands: list[Demand],
    *,
    double_sided: bool,
    braced_default: bool = True,
) -> JointVerdict:
    """Verify a checkable joint against every load combination; governing over all.

    EN 1993-1-8:2005, 6.2.7, 6.2.6.1, Table 3.4, 6.2.7.1(3) per combination (see
    ``verify_combination``) and 5.2.2 for the assumption check. No demands: ``no_demands``.
    """
    if not demands:
        return JointVerdict(status="no_demands", reason="no demand row for this joint")
    cache: dict = {}  # combinations with the same beta and bracing share one engine run
    combos = tuple(
        verify_combination(
            inp, d, double_sided=double_sided, braced_default=braced_default, _cache=cache
        )
        for d in demands
    )
    bad = [c for c in combos if c.result.status != "checked"]
    if bad:
        return JointVerdict(status="unsupported", reason=bad[0].result.reason, combinations=combos)
    assumed = next((d.assumed_joint for d in demands if d.assumed_joint), None)
    gov = max((c.governing for c in combos), key=lambda u: u.utilisation)
    assumption = assumption_check(combos[0].result, assumed)
    status = "fail" if gov.utilisation > 1.0 else "pass"
    return JointVerdict(status=status, combinations=combos, assumption=assumption)

