"""Verification of a checked joint against its demands, one load combination at a time.

The functions here take a joint's engine input and its demands, re-run the check for each
combination where the demands change the input (the transformation parameter beta and the
frame's bracing), and return utilisations with their clause, so every number can be traced.
No IFC, no files, no words. Sign conventions are those of :mod:`ifcjoint.model.demands`.
"""

from __future__ import annotations

import math
from collections.abc import Callable
from dataclasses import dataclass, field, replace
from typing import Any

from ifcjoint.ec3 import components as cmp
from ifcjoint.ec3.code import EN_1993_1_8 as EC3
from ifcjoint.ec3.code import Clause, Zone
from ifcjoint.ec3.moment_resistance import M_N_interaction
from ifcjoint.engine.inputs import JointInput
from ifcjoint.engine.results import CheckResult, Classification
from ifcjoint.model.codes import (
    JointModel,
    NotChecked,
    NotCheckedCode,
    Note,
    NoteCode,
    Status,
    StiffnessClass,
    Verification,
)
from ifcjoint.model.demands import Demand

#: An engine: input in, result out (``check_end_plate_joint``, ``check_welded_joint`` ...).
Engine = Callable[[Any], CheckResult]


@dataclass(frozen=True, slots=True, kw_only=True)
class Utilisation:
    """One demand over one resistance, with the clause that gives the resistance.

    Attributes:
        verification: what is compared (moment, shear, web panel shear, bending and axial).
        clause: the clause (of a design code) that gives the resistance.
        demand: the demand's magnitude, N or N mm (the axial force for bending and axial).
        resistance: the resistance, N or N mm (Nj,Rd for bending and axial).
        utilisation: demand over resistance (the Eq. 6.24 sum for bending and axial).
        combination: the load combination.
        sense: hogging or sagging (moment), tension or compression (axial), else empty.
        detail: values the words need (the governing limit, the lever arm ...).
    """

    verification: Verification
    clause: Clause
    demand: float
    resistance: float
    utilisation: float
    combination: str
    sense: str = ""
    detail: dict[str, Any] = field(default_factory=dict)


@dataclass(frozen=True, slots=True, kw_only=True)
class CombinationResult:
    """The check of one joint for one load combination.

    ``gaps`` are the verifications that could not be made (a resistance not available): the
    combination is not fully checked while any remains.
    """

    demand: Demand
    beta: float
    result: CheckResult
    utilisations: tuple[Utilisation, ...]
    notes: tuple[Note, ...] = ()
    gaps: tuple[NotChecked, ...] = ()

    @property
    def governing(self) -> Utilisation | None:
        """The highest utilisation of this combination."""
        return max(self.utilisations, key=lambda u: u.utilisation, default=None)


@dataclass(frozen=True, slots=True, kw_only=True)
class Assumption:
    """What the frame analysis assumed for the joint, against its stiffness class (5.2.2).

    ``match`` is None when the joint could not be classified.
    """

    assumed: JointModel
    classification: Classification | None
    match: bool | None

    @property
    def computed(self) -> StiffnessClass | None:
        """The joint's stiffness class, or None."""
        return self.classification.stiffness if self.classification else None


@dataclass(frozen=True, slots=True, kw_only=True)
class JointVerdict:
    """A joint's status over all its combinations, the assumption check, broken rules.

    ``detailing`` holds the rules the resistance model depends on that the joint breaks, as
    utilisations (``detailing_utilisations``): any of them makes the joint fail.
    """

    status: Status
    reason: NotChecked | None = None
    combinations: tuple[CombinationResult, ...] = ()
    assumption: Assumption | None = None
    detailing: tuple[Utilisation, ...] = ()

    @property
    def governing(self) -> Utilisation | None:
        """The highest utilisation over every combination and every broken rule."""
        best = [c.governing for c in self.combinations if c.governing is not None]
        best += self.detailing
        return max(best, key=lambda u: u.utilisation, default=None)

    @property
    def governing_combination(self) -> CombinationResult | None:
        """The combination holding the governing utilisation (else the highest one)."""
        g = self.governing
        if g is None:
            return None
        found = next((c for c in self.combinations if c.governing is g), None)
        if found is not None:
            return found
        return max((c for c in self.combinations if c.governing is not None),
                   key=lambda c: c.governing.utilisation, default=None)


def detailing_utilisations(findings) -> tuple[Utilisation, ...]:
    """The broken rules a joint's resistance depends on, as utilisations (worst first).

    Each finding whose rule fails a joint (``Finding.fails_joint``: EN 1993-1-8 Table 3.3
    distances and spacings, EN 1090-2 hole clearances, a bolt outside its plate or shorter
    than its grip, a plate that does not bear on the column ...) becomes a utilisation of
    its rule: limit over measured for a minimum, measured over limit for a maximum, so the
    worst broken rule governs. Warnings never fail a joint.
    """
    out = []
    for f in findings:
        if not f.fails_joint:
            continue
        ratio = f.ratio if f.ratio is not None else math.inf
        out.append(Utilisation(
            verification=Verification.DETAILING,
            clause=Clause(*f.source) if f.source else Clause("common practice", ""),
            demand=f.limit if f.limit is not None else 0.0,
            resistance=f.measured if f.measured is not None else 0.0,
            utilisation=max(ratio, 1.0 + 1e-9),
            combination="",
            detail={"finding": f},
        ))
    return tuple(sorted(out, key=lambda u: -u.utilisation))


def transformation_beta(demand: Demand, double_sided: bool) -> tuple[float, Note]:
    """Transformation parameter beta of the column web panel for one combination.

    EN 1993-1-8:2005, 5.3(7), Table 5.4 (approximate values); single-sided joints take 1.
    With a beam on the other side whose moment is not given, 1 is kept for that side (the
    value of a one-sided joint; for a balanced pair it is conservative, for opposed moments
    it is not, so it is reported).
    """
    if not double_sided:
        return 1.0, Note(NoteCode.BETA_TABLE_SINGLE_SIDED)
    if demand.M_other is None:
        return 1.0, Note(NoteCode.BETA_OTHER_SIDE_MISSING)
    b = cmp.beta_from_moments(demand.M_Ed, demand.M_other)
    return b, Note(NoteCode.BETA_FROM_MOMENTS, {"beta": b, "other_source": demand.other_source})


def web_panel_shear(demand: Demand, z: float) -> tuple[float, Note | None]:
    """Shear force in the column web panel Vwp,Ed for one combination, N (magnitude).

    EN 1993-1-8:2005, 5.3(3), Eq. (5.3) with z the joint's lever arm (6.2.7). Moments in this
    module's convention (hogging negative on each side), so two equal hogging moments balance.
    Column shears not given are taken as zero, which is reported.
    """
    m2 = demand.M_other if demand.M_other is not None else 0.0
    vc1 = demand.Vc_above if demand.Vc_above is not None else 0.0
    vc2 = demand.Vc_below if demand.Vc_below is not None else 0.0
    v = abs(cmp.V_wp_Ed(demand.M_Ed, m2, z, vc1, vc2))
    note = None
    if demand.Vc_above is None and demand.Vc_below is None:
        note = Note(NoteCode.COLUMN_SHEARS_ZERO)
    return v, note


def _ratio(demand: float, resistance: float) -> float:
    """Demand over resistance; a zero demand is 0 whatever the resistance."""
    if demand == 0:
        return 0.0
    return float(demand / resistance) if resistance > 0 else float("inf")


def _i_area(h: float, b: float, tw: float, tf: float, r: float) -> float:
    """Gross area of an I section with root radii, mm2."""
    return 2 * b * tf + (h - 2 * tf) * tw + (4 - 3.141592653589793) * r * r


def run_engine(engine: Engine, inp: JointInput, cache: dict | None) -> CheckResult:
    """The engine's result for an input, run once per distinct input when given a cache.

    Inputs are frozen dataclasses: equal inputs (every field, GlobalIds of stiffeners
    included) give the same result, so a model's repeated joints are computed once.
    """
    if cache is None:
        return engine(inp)
    key = (engine, inp)
    found = cache.get(key)
    if found is None:
        found = cache[key] = engine(inp)
    return found


def verify_combination(
    inp: JointInput,
    demand: Demand,
    *,
    engine: Engine,
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
    this = inp if (inp.beta, inp.braced) == (beta, braced) else replace(
        inp, beta=beta, braced=braced)
    r = run_engine(engine, this, _cache)
    if not r.checked:
        return CombinationResult(demand=demand, beta=beta, result=r, utilisations=())
    if r.joint_kind in SHEAR_ONLY_KINDS:
        return verify_pinned(demand, r, beta, double_sided=double_sided)
    notes = [beta_note]
    c = demand.combination
    sign = "hogging" if demand.M_Ed < 0 else "sagging"
    side = r.side(sign)
    us = [_moment(demand, side, c)]
    gaps = []
    if side.V_j_Rd is None:
        gaps.append(side.shear_gap)
    else:
        us.append(
            Utilisation(
                verification=Verification.SHEAR,
                clause=EC3.clause("Table 3.4"),
                demand=abs(demand.V_Ed),
                resistance=side.V_j_Rd,
                utilisation=_ratio(abs(demand.V_Ed), side.V_j_Rd),
                combination=c,
            )
        )
    if r.V_wp_Rd is not None:  # no column web panel in a beam splice
        v_wp, vnote = web_panel_shear(demand, side.z if side.z > 0 else inp.beam.h - inp.beam.tf)
        if vnote is not None:
            notes.append(vnote)
        us.append(
            Utilisation(
                verification=Verification.WEB_PANEL_SHEAR,
                clause=EC3.clause("6.2.6.1; 5.3(3)"),
                demand=v_wp,
                resistance=r.V_wp_Rd,
                utilisation=_ratio(v_wp, r.V_wp_Rd),
                combination=c,
                detail={"z": side.z if side.z > 0 else inp.beam.h - inp.beam.tf},
            )
        )
    mn = _axial(inp, demand, r, side.M_j_Rd, c)
    if mn is not None:
        us.append(mn)
    elif demand.N_Ed:
        notes.append(Note(NoteCode.AXIAL_NEGLECTED))
    return CombinationResult(
        demand=demand, beta=beta, result=r, utilisations=tuple(us), notes=tuple(notes),
        gaps=tuple(gaps),
    )


#: Joint kinds that are nominally pinned: shear only, no moment (``verify_pinned``).
PINNED_KINDS = frozenset({"fin_plate", "header_plate", "angle_cleats"})
#: Joint kinds verified in shear alone: the pinned ones, and an end plate on a web, whose
#: moment EN 1993-1-8 does not determine (a gap of its result, never a pass).
SHEAR_ONLY_KINDS = PINNED_KINDS | {"end_plate_on_web"}


def verify_pinned(demand: Demand, r: CheckResult, beta: float, *,
                  double_sided: bool = False) -> CombinationResult:
    """A nominally pinned joint (fin plate, partial-depth end plate) for one combination.

    EN 1993-1-8:2005, 5.2.2.2: the joint carries the shear (against Vj,Rd, its least shear
    component) and no moment: a moment in the demands is checked against a resistance of
    zero, so any moment fails it. An axial force (tying) and what the engine left unchecked
    (``CheckResult.gaps``) keep it from passing. An axial tension is checked against the
    tying resistance (gamma_Mu, an accidental design situation); a compression is not checked.
    A supporting web's local shear takes the reactions of both sides together (the other
    side's from its own row; missing, a gap); the method's conditions (``r.conditions``, e.g.
    punching) are utilisations of their own, measured over limit.
    """
    c = demand.combination
    side = r.hogging
    shear = [x for x in side.components
             if EC3.components[x.component].zone == Zone.SHEAR]  # not the tying ones
    gov = min(shear, key=lambda x: x.F_Rd)
    us = [
        *([_moment(demand, side, c)] if r.joint_kind in PINNED_KINDS else []),
        Utilisation(verification=Verification.SHEAR, clause=gov.clause,
                    demand=abs(demand.V_Ed), resistance=r.V_j_Rd,
                    utilisation=_ratio(abs(demand.V_Ed), r.V_j_Rd), combination=c,
                    detail={"component": gov.component}),
    ]
    gaps = list(r.gaps)
    for x in side.components:
        if EC3.components[x.component].zone != Zone.SUPPORT:
            continue
        if double_sided and demand.V_other is None:
            gaps.append(NotChecked(NotCheckedCode.SUPPORT_WEB_OTHER_SIDE_MISSING))
        both = abs(demand.V_Ed) + abs(demand.V_other or 0.0)
        us.append(Utilisation(verification=Verification.SUPPORT_WEB_SHEAR, clause=x.clause,
                              demand=both, resistance=x.F_Rd,
                              utilisation=_ratio(both, x.F_Rd), combination=c,
                              detail={"component": x.component,
                                      "V_other": demand.V_other}))
    for k in r.conditions:
        us.append(Utilisation(verification=Verification.CONDITION, clause=k.clause,
                              demand=k.measured, resistance=k.limit,
                              utilisation=_ratio(k.measured, k.limit), combination=c,
                              detail={"condition": k.name, "unit": k.unit}))
    if demand.N_Ed > 0 and r.N_j_Rd_tie is not None:
        us.append(Utilisation(verification=Verification.TYING, clause=Clause(
            "design guide for pinned joints", "3 (tying)"), demand=demand.N_Ed,
            resistance=r.N_j_Rd_tie, utilisation=_ratio(demand.N_Ed, r.N_j_Rd_tie),
            combination=c, sense="tension"))
    elif demand.N_Ed:
        gaps.append(NotChecked(NotCheckedCode.TYING_NOT_CHECKED, {"N": demand.N_Ed}))
    return CombinationResult(demand=demand, beta=beta, result=r, utilisations=tuple(us),
                             gaps=tuple(gaps))


def _moment(demand: Demand, side, c: str) -> Utilisation:
    """The moment against Mj,Rd of its sign (6.2.7.2); a sign with no tension row has none."""
    detail = {"governing": side.governing}
    if side.no_tension is not None:
        detail = {"no_tension": side.no_tension}
    return Utilisation(
        verification=Verification.MOMENT,
        clause=EC3.clause("6.2.7.2"),
        demand=abs(demand.M_Ed),
        resistance=side.M_j_Rd,
        utilisation=_ratio(abs(demand.M_Ed), side.M_j_Rd),
        combination=c,
        sense=side.sign,
        detail=detail,
    )


def _axial(inp: JointInput, demand: Demand, r: CheckResult, m_rd: float, c: str):
    """The M-N interaction when the axial force matters (6.2.7.1(2)-(3)), else None."""
    beam = inp.beam
    area = _i_area(beam.h, beam.b, beam.tw, beam.tf, beam.r)
    if not cmp.axial_force_significant(demand.N_Ed, area, beam.fy, inp.params):
        return None
    n_rd = r.N_j_Rd_tension if demand.N_Ed > 0 else r.N_j_Rd_compression
    return Utilisation(
        verification=Verification.BENDING_AND_AXIAL,
        clause=EC3.clause("6.2.7.1(3)"),
        demand=abs(demand.N_Ed),
        resistance=n_rd,
        utilisation=M_N_interaction(demand.M_Ed, m_rd, demand.N_Ed, n_rd),
        combination=c,
        sense="tension" if demand.N_Ed > 0 else "compression",
    )


def assumption_check(result: CheckResult, assumed: JointModel | None) -> Assumption | None:
    """Compare what the analysis assumed with the stiffness class of the joint.

    EN 1993-1-8:2005, 5.2.2.1 and 5.2.2.5: a joint may be modelled as rigid only when it
    classifies as rigid, as pinned only when nominally pinned; a semi-rigid model is fine in
    every case here as long as its stiffness is that of the joint (Sj,ini reported).
    """
    if not assumed:
        return None
    cls = result.classification
    if cls is None or cls.stiffness is None:
        return Assumption(assumed=assumed, classification=cls, match=None)
    computed = {
        StiffnessClass.RIGID: JointModel.RIGID,
        StiffnessClass.SEMI_RIGID: JointModel.SEMI_RIGID,
        StiffnessClass.PINNED: JointModel.PINNED,
    }[cls.stiffness]
    match = assumed == JointModel.SEMI_RIGID or assumed == computed
    return Assumption(assumed=assumed, classification=cls, match=match)


def verify_joint(
    inp: JointInput,
    demands: list[Demand],
    *,
    engine: Engine,
    double_sided: bool,
    braced_default: bool = True,
    seed: CheckResult | None = None,
    cache: dict | None = None,
) -> JointVerdict:
    """Verify a checkable joint against every load combination; governing over all.

    EN 1993-1-8:2005, 6.2.7, 6.2.6.1, Table 3.4, 6.2.7.1(3) per combination (see
    ``verify_combination``) and 5.2.2 for the assumption check. No demands: not checked.
    A combination that could not be fully verified keeps the joint from passing. ``seed`` is
    the engine's result for ``inp`` itself, so the engine does not run again for it; ``cache``
    (see ``run_engine``) shares engine results between joints.
    """
    if not demands:
        return JointVerdict(status=Status.NO_DEMANDS, reason=NotChecked(NotCheckedCode.NO_DEMANDS))
    # combinations with the same beta and bracing share one engine run (and joints with the
    # same input, when the caller passes one cache for all its joints)
    cache: dict = {} if cache is None else cache
    if seed is not None:
        cache[(engine, inp)] = seed
    combos = tuple(
        verify_combination(
            inp,
            d,
            engine=engine,
            double_sided=double_sided,
            braced_default=braced_default,
            _cache=cache,
        )
        for d in demands
    )
    bad = [c for c in combos if not c.result.checked]
    if bad:
        reason = bad[0].result.not_checked
        return JointVerdict(status=reason.status, reason=reason, combinations=combos)
    assumed = next((d.assumed_joint for d in demands if d.assumed_joint), None)
    gov = max((c.governing for c in combos), key=lambda u: u.utilisation)
    assumption = assumption_check(combos[0].result, assumed)
    gaps = [g for c in combos for g in c.gaps]
    if gov.utilisation > 1.0:
        status, reason = Status.FAIL, None
    elif gaps:
        status, reason = gaps[0].status, gaps[0]
    else:
        status, reason = Status.PASS, None
    return JointVerdict(status=status, reason=reason, combinations=combos, assumption=assumption)
