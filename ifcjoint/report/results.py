"""The results of a check as one dictionary (docs/results.md), and its table renderers.

``build_results`` turns a :class:`ifcjoint.pipeline.ModelCheck` into the one dictionary that
every output renders: the results JSON, the CSV, the issue list, the text summary, BCF, HTML,
Markdown and the IFC property sets. Display units (kN, kNm, kNm/rad) and words are made here,
from the engine's data and codes. Every renderer has the same signature:
``write_x(results, target, **options)``.
"""

from __future__ import annotations

import csv
import io
import json
import math
import re
from collections import Counter
from pathlib import Path
from typing import TextIO

import pandas as pd

from ifcjoint.ec3.code import Eurocode3
from ifcjoint.engine.inputs import input_record
from ifcjoint.engine.problems import Problem
from ifcjoint.engine.results import CheckResult, Classification, ComponentResult
from ifcjoint.engine.verify import Assumption, Utilisation
from ifcjoint.fileio import atomic_write_bytes, atomic_write_text, safe_cell
from ifcjoint.model.codes import UNCHECKED, NotCheckedCode, ProblemKind, Status
from ifcjoint.report.coverage import beam_end_coverage, coverage_line
from ifcjoint.report.scan import CAUTION, build_scan
from ifcjoint.report.words import (
    STATUS_WORDS,
    UNCHECKED_WHAT,
    UNITS,
    coded,
    finding_message,
    limit_words,
    verification_detail,
    verification_name,
)

RESULTS_SCHEMA_VERSION = "1.1"
#: Results JSON versions the report command reads.
READABLE_SCHEMA_VERSIONS = ("1.0", "1.1")


def _k(x: float | None, f: float, digits: int = 2) -> float | None:
    """A value in N or N mm as kN or kNm, rounded (None stays None)."""
    return None if x is None else round(float(x) / f, digits)


def _finite_k(x: float | None, f: float, digits: int) -> float | None:
    """As ``_k``; None when infinite (nothing flexible) or not available."""
    return round(float(x) / f, digits) if x is not None and math.isfinite(x) else None


def _demand_dict(d) -> dict:
    return {
        "combination": d.combination,
        "M_Ed_kNm": _k(d.M_Ed, 1e6, 3),
        "V_Ed_kN": _k(d.V_Ed, 1e3, 3),
        "N_Ed_kN": _k(d.N_Ed, 1e3, 3),
        "M_Ed_other_side_kNm": _k(d.M_other, 1e6, 3),
        "Vc_above_kN": _k(d.Vc_above, 1e3, 3),
        "Vc_below_kN": _k(d.Vc_below, 1e3, 3),
        "V_Ed_other_side_kN": _k(d.V_other, 1e3, 3),
        "frame": None if d.braced is None else ("braced" if d.braced else "unbraced"),
        "assumed_joint": d.assumed_joint,
        "source": d.source,
        "other_side_source": d.other_source or None,
    }


#: Component inputs that are forces (N) or moments (N mm): shown in kN and kNm, renamed.
_INPUT_UNITS = {"crushing": ("crushing_kN", 1e3), "buckling": ("buckling_kN", 1e3),
                "Mc_Rd": ("Mc_Rd_kNm", 1e6)}


def _input_value(k: str, v) -> tuple[str, object]:
    name, f = _INPUT_UNITS.get(k, (k, 1.0))
    if isinstance(v, (int, float)) and not isinstance(v, bool):
        return name, round(float(v) / f, 3)
    return name, v


def _component_dict(c: ComponentResult, code: Eurocode3) -> dict:
    return {
        "clause": code.ref(c.clause),
        "name": code.component_name(c.component),
        "component": c.component,
        "row": c.row,
        "rows": list(c.rows),
        "F_Rd_kN": round(float(c.F_Rd) / 1e3, 2),
        "mode": c.mode,
        "inputs": dict(_input_value(k, v) for k, v in c.inputs.items()),
    }


def _rows_dict(side, code: Eurocode3, candidates: bool) -> list[dict]:
    out = []
    for r in side.rows:
        d = {
            "row": r.row,
            "h_r_mm": round(float(r.h_r), 1),
            "F_tr_Rd_kN": round(float(r.F_tr_Rd) / 1e3, 2),
            "limited_by": limit_words(r.limited_by, code),
        }
        if candidates:
            d["candidates_kN"] = {
                limit_words(lim, code): round(float(v) / 1e3, 2) for lim, v in r.candidates
            }
        out.append(d)
    return out


def classification_dict(c: Classification | None) -> dict:
    """The stiffness and strength classes with their boundaries (kNm/rad, kNm)."""
    if c is None:
        return {}
    out: dict = {}
    if c.stiffness is not None:
        out["stiffness"] = c.stiffness
        out["kb"] = c.kb
        # a joint classed by its detailing (a fin plate) has no stiffness boundaries
        out["rigid_from_kNm_per_rad"] = _k(c.rigid_from, 1e6, 1)
        out["pinned_up_to_kNm_per_rad"] = _k(c.pinned_up_to, 1e6, 1)
    else:
        out["stiffness"] = coded(c.stiffness_gap)
    if c.strength is not None:
        out["strength"] = c.strength
        out["strength_sagging"] = c.strength_sagging
        out["full_strength_from_kNm"] = round(float(c.full_strength_from) / 1e6, 1)
    else:
        out["strength"] = coded(c.strength_gap)
    return out


def _moment_k(side) -> float | None:
    """Mj,Rd in kNm, or None when the method does not determine it (an end plate on a web)."""
    gap = side.no_tension
    if gap is not None and gap.code == NotCheckedCode.WEB_BENDING_NOT_COVERED:
        return None
    return round(float(side.M_j_Rd) / 1e6, 2)


def result_dict(r: CheckResult, code: Eurocode3) -> dict:
    """An engine result in the output's units (kN, kNm, kNm/rad, mm)."""
    inputs = input_record(r.input) if r.input is not None else {}
    if not r.checked:
        return {"status": r.status, "reason": coded(r.not_checked), "inputs": inputs}
    h, s = r.hogging, r.sagging
    return {
        "status": r.status,
        "resistance": {
            "Mj_Rd_hogging_kNm": _moment_k(h),
            "Mj_Rd_sagging_kNm": _moment_k(s) if s else None,
            "Vj_Rd_kN": _k(r.V_j_Rd, 1e3),
            "Vj_Rd_hogging_kN": _k(h.V_j_Rd, 1e3),
            "Vj_Rd_sagging_kN": _k(s.V_j_Rd, 1e3) if s else None,
            "Vwp_Rd_kN": _k(r.V_wp_Rd, 1e3),
            "Nj_Rd_tension_kN": _k(r.N_j_Rd_tension, 1e3),
            "Nj_Rd_compression_kN": _k(r.N_j_Rd_compression, 1e3),
            "Sj_ini_kNm_per_rad": _finite_k(h.S_j_ini, 1e6, 1),
            "Sj_ini_sagging_kNm_per_rad": _finite_k(s.S_j_ini, 1e6, 1) if s else None,
            "z_mm": round(float(h.z), 1),
        },
        "components": [_component_dict(c, code) for c in h.components],
        "tension_rows": _rows_dict(h, code, candidates=True),
        "sagging": None
        if s is None
        else {
            "components": [_component_dict(c, code) for c in s.components],
            "tension_rows": _rows_dict(s, code, candidates=False),
        },
        "classification": classification_dict(r.classification),
        "m_phi": {
            sign: [[round(f, 6), round(m / 1e6, 2)] for f, m in r.m_phi(sign)]
            for sign in ("hogging", "sagging")
        },
        "notes": [coded(n) for n in r.notes],
        "gaps": [
            {"sign": side.sign, "code": gap.code, "reason": coded(gap)}
            for side in (h, s)
            if side is not None
            for gap in (side.no_tension, side.shear_gap)
            if gap is not None
        ],
        "inputs": inputs,
    }


def utilisation_dict(u: Utilisation, code: Eurocode3) -> dict:
    """One utilisation in the output's units (kN, kNm, mm; ``-`` for an interaction)."""
    unit, f = UNITS[u.verification]
    return {
        "clause": code.ref(u.clause),
        "name": verification_name(u.verification, u.sense, code, u.detail),
        "combination": u.combination,
        "demand": round(u.demand / f, 2),
        "resistance": round(u.resistance / f, 2),
        "unit": unit,
        "utilisation": round(u.utilisation, 3),
        "detail": verification_detail(u, code),
    }


def assumption_dict(a: Assumption | None) -> dict | None:
    """The analysis assumption against the joint's class, or None when none was stated."""
    if a is None:
        return None
    if a.computed is not None:
        computed = a.computed
    elif a.classification is not None:
        computed = coded(a.classification.stiffness_gap)
    else:
        computed = "unknown"
    return {"assumed": a.assumed, "computed": computed, "match": a.match}


def _problem_texts(jc, p: Problem, code: Eurocode3) -> tuple[str, str]:
    """A problem's title and description, in words."""
    j = jc.joint
    name = f"{j.label} ({j.id})"
    if p.kind == ProblemKind.RESISTANCE:
        g = utilisation_dict(p.governing, code)
        lines = [f"Joint {name}, archetype {j.archetype}."]
        for u in p.exceeded:
            d = utilisation_dict(u, code)
            lines.append(
                f"[{d['combination']}] {d['name']} ({code.cite(u.clause)}): "
                f"{u.demand / UNITS[u.verification][1]:.1f} {d['unit']} > "
                f"{u.resistance / UNITS[u.verification][1]:.1f} {d['unit']}, "
                f"utilisation {u.utilisation:.2f}" + (f"; {d['detail']}" if d["detail"] else "")
            )
        share = f"{p.governing.utilisation:.0%}"
        title = f"{name}: {g['name']} exceeded, {share} ({g['combination']})"
        return title, "\n".join(lines)
    if p.kind == ProblemKind.INCOMPLETE:
        return f"{name}: joint incomplete ({j.archetype})", "\n".join(
            [f"Joint {name}: {coded(j.archetype_reason)}.", f"Not checked: {coded(p.reason)}."]
        )
    if p.kind == ProblemKind.UNCHECKED:
        what = UNCHECKED_WHAT[p.status]
        if p.status != Status.NO_DEMANDS and p.reason is not None:
            what = _short(coded(p.reason))  # the real cause, in words
        hint = data_hint(p.reason)
        return f"{name}: not checked, {what}", "\n".join(
            [
                f"Joint {name}, archetype {j.archetype}: not checked ({p.status}).",
                f"Reason: {coded(p.reason)}.",
                *([f"To check it: {hint}."] if hint else []),
            ]
        )
    if p.kind == ProblemKind.DETAILING:
        fs = p.findings
        lines = [f"Joint {name}: {len(fs)} detailing finding(s)."]
        if p.governing is not None:
            lines[0] += " The joint fails: a rule its resistance depends on is broken."
        for f in fs:
            lim = ""
            if f.measured is not None and f.limit is not None:
                lim = f" (measured {round(f.measured, 2):g}, limit {round(f.limit, 2):g})"
            fails = ", fails the joint" if f.fails_joint else ""
            lines.append(f"[{f.severity}{fails}] {finding_message(f)}{lim}; basis: {f.basis}")
        first = p.governing.detail["finding"] if p.governing is not None else fs[0]
        head = "fails detailing" if p.governing is not None else f"{len(fs)} detailing finding(s)"
        return f"{name}: {head}: {finding_message(first)}", "\n".join(lines)
    a = assumption_dict(p.assumption)
    return f"{name}: analysed as {a['assumed']}, the joint is {a['computed']}", (
        f"Joint {name}: the analysis model assumed a {a['assumed']} joint; by its "
        f"initial stiffness Sj,ini the joint is {a['computed']} ({code.cite('5.2.2.5')}). "
        "The frame analysis may need the joint's stiffness (5.1.1, 5.2.2.1)."
    )


def data_hint(reason) -> str:
    """What the model misses for a joint not checked for lack of data, in words.

    The IDS requirements of ``ifcjoint requirements``; empty for any other reason.
    """
    from ifcjoint.ifc.requirements import requirements_for

    reqs = requirements_for(reason)
    if not reqs:
        return ""
    return ("the model misses: " + "; ".join(f"{r.name} [IDS {r.identifier}]" for r in reqs)
            + " (`ifcjoint requirements` writes the IDS)")


def joint_check_dict(jc, code: Eurocode3) -> dict:
    """The check part of one joint (added to the scan JSON's joint).

    The joint's utilisation and governing check are given only for a joint that was checked
    (pass or fail): a partial check (a resistance not available) never shows a ratio below 1
    as if it were the joint's; its combinations still list what was computed.
    """
    g = jc.verdict.governing if Status(jc.status).checked else None
    r = result_dict(jc.result, code)
    problems = []
    for p in jc.problems:
        title, description = _problem_texts(jc, p, code)
        problems.append(
            {
                "guid": p.guid,
                "kind": p.kind,
                "severity": p.priority,
                "title": title,
                "description": description,
                "elements": list(p.elements),
            }
        )
    gd = utilisation_dict(g, code) if g is not None else None
    from ifcjoint.ifc.requirements import requirements_for

    hint = data_hint(jc.verdict.reason)
    return {
        "status": jc.status,
        "status_reason": "; ".join(x for x in (coded(jc.verdict.reason), hint) if x),
        "data_requirements": [r.identifier for r in requirements_for(jc.verdict.reason)],
        "utilisation": None if g is None else round(float(g.utilisation), 3),
        "governing": None
        if g is None
        else {
            "clause": gd["clause"],
            "name": gd["name"],
            "utilisation": gd["utilisation"],
            "combination": gd["combination"],
        },
        "engine_status": r["status"],
        "engine_reason": r.get("reason", ""),
        "resistance": r.get("resistance"),
        "components": r.get("components", []),
        "tension_rows": r.get("tension_rows", []),
        "classification": r.get("classification", {}),
        "engine_notes": r.get("notes", []),
        "gaps": r.get("gaps", []),
        "m_phi": r.get("m_phi"),
        "sagging": r.get("sagging"),
        "inputs": r.get("inputs") or None,
        "demands": [_demand_dict(d) for d in jc.demands],
        "detailing_failures": [utilisation_dict(u, code) for u in jc.verdict.detailing],
        "combinations": [
            {
                "combination": c.demand.combination,
                "beta": c.beta,
                "utilisations": [utilisation_dict(u, code) for u in c.utilisations],
                "notes": [coded(n) for n in c.notes],
            }
            for c in jc.verdict.combinations
        ],
        "assumption": assumption_dict(jc.verdict.assumption),
        "fingerprint": jc.fingerprint,
        "problems": problems,
        "carried_over": None,
    }


def _short(text: str, most: int = 120) -> str:
    """A sentence cut at a word to at most ``most`` characters (a topic title's length)."""
    if len(text) <= most:
        return text
    return text[: text.rfind(" ", 0, most - 3)].rstrip(",;:") + "..."


def finite_json(obj):
    """Replace non-finite floats by None so the JSON stays strict.

    An infinite utilisation (a resistance of zero) becomes null; the status still says fail.
    The usual case, nothing to replace, is found by the C JSON encoder in one pass; only then
    is the structure walked.
    """
    try:
        json.dumps(obj, allow_nan=False, default=float)
        return obj
    except ValueError:
        return _finite_walk(obj)


def _finite_walk(obj):
    if isinstance(obj, float):
        return obj if math.isfinite(obj) else None
    if isinstance(obj, dict):
        return {k: _finite_walk(v) for k, v in obj.items()}
    if isinstance(obj, (list, tuple)):
        return [_finite_walk(v) for v in obj]
    return obj


def build_results(mc) -> dict:
    """The scan dictionary extended with the check of every joint (docs/results.md)."""
    code = mc.settings.code
    d = mc.scan_record if mc.scan_record is not None else build_scan(mc.scan)
    d["results_schema_version"] = RESULTS_SCHEMA_VERSION
    by_id = {jc.joint.id: jc for jc in mc.joints}
    joints = []
    for j in d["joints"]:
        jc = by_id[j["id"]]
        if hasattr(jc, "record"):  # carried over: the earlier record (strict JSON already)
            earlier = jc.previous.joints[j["id"]]
            joints.append({**{k: v for k, v in earlier.items() if k != "check"},
                           "check": carried_check_dict(jc)})
        else:
            j["check"] = joint_check_dict(jc, code)
            joints.append(finite_json(j))
    d["joints"] = joints
    dem = mc.demands
    d["check"] = {
        "created": mc.created.isoformat(),
        "tool_version": mc.tool_version,
        "design_code": code.name,
        "params": mc.settings.params.as_dict(),
        "braced_default": mc.settings.braced,
        "alpha_method": mc.settings.alpha_method,
        "counts": mc.counts(),
        "demands": None
        if dem is None
        else {
            "path": dem.path,
            "rows_read": dem.rows_read,
            "rows_used": dem.rows_used,
            "rows_rejected": dem.rows_rejected,
            "problems": [
                {"line": p.line, "severity": p.severity, "message": p.message}
                for p in dem.problems
            ],
        },
        "notes": list(mc.notes),
        "unreadable_members": [
            {"element": u.element, "ifc_class": u.ifc_class, "name": u.name,
             "reason": u.reason,
             "demand_lines": list(dem.unreadable_rows.get(u.element, ())) if dem else []}
            for u in mc.unreadable_members()
        ],
    }
    d["check"]["coverage"] = beam_end_coverage(d)
    d["caution"] = CAUTION
    d = {k: v if k == "joints" else finite_json(v) for k, v in d.items()}  # joints: above
    if mc.previous is not None:
        from ifcjoint.report.revisions import comparison_section

        d["check"]["comparison"] = comparison_section(mc.previous.path, mc.previous.results, d)
    return d


def carried_check_dict(cc) -> dict:
    """The check part of a joint carried over from an earlier run.

    As that run wrote it, with the demands as read now (equal in value) and where the
    result comes from.
    """
    first = cc.record.get("carried_over") or {}  # carried before: it was checked then
    return {**cc.record, "demands": [_demand_dict(x) for x in cc.demands],
            "carried_over": {"from": cc.previous.path,
                             "checked": first.get("checked") or cc.previous.created,
                             "tool_version": first.get("tool_version")
                             or cc.previous.results["check"].get("tool_version")}}


def cite(results: dict, clause: str) -> str:
    """A clause as people cite it (``EN 1993-1-8 6.2.7.2``).

    The results write the run's own clauses bare and another code's with its name
    (``Eurocode3.ref``); a bare one gets the run's design code.
    """
    name = results.get("check", {}).get("design_code") or "EN 1993-1-8"
    if not re.match(r"(\d|Table|Figure|Annex|Eq)", clause):
        return clause  # already names its source (another code, a design guide, practice)
    return f"{name} {clause}"


def write_results_json(results: dict, path: str | Path) -> dict[str, int]:
    """Write the results JSON atomically (compact: one line, UTF-8, by ``orjson``).

    The results are strict JSON already (``finite_json``): nothing is left to replace.
    """
    import orjson

    data = orjson.dumps(results, default=float,
                        option=orjson.OPT_NON_STR_KEYS | orjson.OPT_SERIALIZE_NUMPY)
    atomic_write_bytes(path, data + b"\n")
    return {}


def results_dataframe(results: dict) -> pd.DataFrame:
    """One row per joint: identity, status, governing check, resistances, classification."""
    rows = []
    for j in results["joints"]:
        c = j["check"]
        g = c["governing"] or {}
        rr = c["resistance"] or {}
        cls = c["classification"] or {}
        rows.append(
            {
                "joint_id": j["id"],
                "label": j["label"],
                "storey": j.get("storey", ""),
                "beam_guid": j["beam"],
                "beam_end": j["beam_end"],
                "column_guid": j["column"],
                "archetype": j["archetype"],
                "status": c["status"],
                "status_reason": c["status_reason"],
                "utilisation": c["utilisation"],
                "governing": g.get("name", ""),
                "governing_clause": g.get("clause", ""),
                "governing_combination": g.get("combination", ""),
                "Mj_Rd_hogging_kNm": rr.get("Mj_Rd_hogging_kNm"),
                "Mj_Rd_sagging_kNm": rr.get("Mj_Rd_sagging_kNm"),
                "Vj_Rd_kN": rr.get("Vj_Rd_kN"),
                "Sj_ini_kNm_per_rad": rr.get("Sj_ini_kNm_per_rad"),
                "stiffness_class": cls.get("stiffness", ""),
                "strength_class": cls.get("strength", ""),
                "assumed_joint": (c["assumption"] or {}).get("assumed", ""),
                "n_combinations": len(c["demands"]),
                "n_findings": len(j["findings"]),
                "n_problems": len(c["problems"]),
                "fingerprint": c["fingerprint"],
            }
        )
    return pd.DataFrame(rows)


def write_results_csv(results: dict, path: str | Path) -> dict[str, int]:
    """One row per joint, spreadsheet-safe."""
    df = results_dataframe(results).map(safe_cell)
    atomic_write_text(path, df.to_csv(index=False, lineterminator="\n"))
    return {}


ISSUE_COLUMNS = (
    "topic_guid", "joint_id", "label", "kind", "severity", "title", "description", "elements",
)


def issues_rows(results: dict) -> list[dict]:
    """The issue list: one row per problem (the same problems as the BCF topics)."""
    return [
        {
            "topic_guid": p["guid"],
            "joint_id": j["id"],
            "label": j["label"],
            "kind": p["kind"],
            "severity": p["severity"],
            "title": p["title"],
            "description": p["description"],
            "elements": " ".join(p["elements"]),
        }
        for j in results["joints"]
        for p in j["check"]["problems"]
    ]


def write_issues(results: dict, path: str | Path) -> dict[str, int]:
    """The issue list as CSV (``.csv``) or JSON (any other suffix)."""
    rows = issues_rows(results)
    if str(path).lower().endswith(".csv"):
        buf = io.StringIO()
        w = csv.DictWriter(buf, fieldnames=list(ISSUE_COLUMNS), lineterminator="\n")
        w.writeheader()
        for r in rows:
            w.writerow({k: safe_cell(v) for k, v in r.items()})
        atomic_write_text(path, buf.getvalue())
    else:
        atomic_write_text(path, json.dumps({"issues": rows}, indent=1) + "\n")
    return {}


def top_joints(results: dict, n: int = 10) -> list[dict]:
    """The joints with the n highest utilisations."""
    done = [j for j in results["joints"] if j["check"]["utilisation"] is not None]
    return sorted(done, key=lambda j: -j["check"]["utilisation"])[:n]


def filter_results(
    results: dict,
    *,
    storeys: tuple[str, ...] = (),
    statuses: tuple[str, ...] = (),
    archetypes: tuple[str, ...] = (),
    joints: tuple[str, ...] = (),
) -> dict:
    """The results with only the joints that match every given criterion (any of its values).

    Storeys and joints (id or label) match case-insensitively and may use shell wildcards
    (``Level 0*``); the status ``unchecked`` stands for every unchecked status. Counts are
    those of the joints kept; ``check.filter`` records the criteria and how many joints the
    run had, so no report hides that it is partial. Returns the results unchanged when no
    criterion is given.
    """
    import fnmatch

    if not (storeys or statuses or archetypes or joints):
        return results

    def like(text: str, patterns) -> bool:
        t = (text or "").casefold()
        return any(fnmatch.fnmatchcase(t, p.casefold()) for p in patterns)

    want_status = {x for x in statuses if x != "unchecked"}
    if "unchecked" in statuses:
        want_status |= {str(x) for x in UNCHECKED}

    def keep(j: dict) -> bool:
        return ((not storeys or like(j.get("storey", ""), storeys))
                and (not statuses or j["check"]["status"] in want_status)
                and (not archetypes or j["archetype"] in archetypes)
                and (not joints or like(j["id"], joints) or like(j["label"], joints)))

    kept = [j for j in results["joints"] if keep(j)]
    out = dict(results)
    out["joints"] = kept
    ck = dict(results["check"])
    counts = Counter(j["check"]["status"] for j in kept)
    ck["counts"] = {s: counts.get(s, 0) for s in results["check"]["counts"]}
    ck["filter"] = {"storeys": list(storeys), "statuses": list(statuses),
                    "archetypes": list(archetypes), "joints": list(joints),
                    "joints_in_run": len(results["joints"]), "joints_shown": len(kept)}
    out["check"] = ck
    return out


def unchecked_groups(results: dict) -> list[tuple[str, str, list[dict]]]:
    """The unchecked joints grouped by status and reason: (status, reason, joints)."""
    groups: dict[tuple[str, str], list[dict]] = {}
    for j in results["joints"]:
        c = j["check"]
        if c["status"] in UNCHECKED:
            groups.setdefault((c["status"], c["status_reason"] or ""), []).append(j)
    return [(s, r, js) for (s, r), js in sorted(groups.items(), key=lambda kv: -len(kv[1]))]


def write_unchecked(results: dict, out: TextIO, *, shown: int = 8) -> None:
    """Every unchecked joint's reason, grouped, with the first labels of each group."""
    groups = unchecked_groups(results)
    if not groups:
        return
    out.write("  unchecked joints, by reason:\n")
    for status, reason, js in groups:
        names = ", ".join(f"{j['label']} ({j['id']})" for j in js[:shown])
        more = f", ... {len(js) - shown} more" if len(js) > shown else ""
        out.write(f"    {len(js)} {status.replace('_', ' ')}: {reason}\n      {names}{more}\n")


def write_check_summary(results: dict, out: TextIO, *, top: int = 10) -> None:
    """Counts by status, the highest utilisations, rejected demand rows, the caution."""
    ck = results["check"]
    c = ck["counts"]
    n = len(results["joints"])
    unchecked = sum(c[s] for s in UNCHECKED)
    out.write(f"{results['model']['path']}: {n} joints checked by ifcjoint {ck['tool_version']}\n")
    flt = ck.get("filter")
    if flt:
        crit = "; ".join(f"{k} {', '.join(v)}" for k, v in flt.items()
                         if isinstance(v, list) and v)
        out.write(f"  filtered ({crit}): {flt['joints_shown']} of {flt['joints_in_run']} joints "
                  "shown; the gate and the BCF and IFC outputs cover every joint\n")
    out.write(f"  pass {c['pass']}, fail {c['fail']}, unchecked {unchecked}")
    if unchecked:
        parts = [f"{STATUS_WORDS[s].split(': ')[1]} {c[s]}" for s in UNCHECKED if c[s]]
        out.write(f" ({', '.join(parts)})")
    out.write("\n")
    bad = ck.get("unreadable_members") or []
    if bad:
        out.write(f"  {len(bad)} beam(s)/column(s) could not be read; their joints are unknown:\n")
        for u in bad[:20]:
            rows = f" (demand rows on line {', '.join(map(str, u['demand_lines']))})" \
                if u["demand_lines"] else ""
            name = f" '{u['name']}'" if u["name"] else ""
            out.write(f"    {u['element']} ({u['ifc_class']}){name}: {u['reason']}{rows}\n")
        if len(bad) > 20:
            out.write(f"    ... and {len(bad) - 20} more (results JSON: unreadable_members)\n")
    dem = ck["demands"]
    if dem is None:
        out.write("  demands: none given\n")
    else:
        out.write(
            f"  demands: {dem['rows_used']} rows used, {dem['rows_rejected']} rejected "
            f"of {dem['rows_read']} read ({dem['path']})\n"
        )
        for p in dem["problems"]:
            out.write(f"    {p['severity']}: {dem['path']}:{p['line']}: {p['message']}\n")
    best = top_joints(results, top)
    if best:
        out.write(f"  highest utilisations (top {len(best)}):\n")
        for j in best:
            ch = j["check"]
            g = ch["governing"]
            where = "; ".join(x for x in (cite(results, g["clause"]), g["combination"]) if x)
            out.write(
                f"    {g['utilisation']:6.2f}  {ch['status']:4}  {j['label']} ({j['id']})  "
                f"{g['name']} ({where})\n"
            )
    write_unchecked(results, out)
    cov = ck.get("coverage")
    if cov:
        out.write(f"  {coverage_line(cov)}\n")
        for m in cov["missing"][:20]:
            out.write(f"    missing: {m}\n")
    cmp = ck.get("comparison")
    if cmp:
        c2 = cmp["counts"]
        out.write(f"  since {cmp['previous']['path']} (checked {cmp['previous']['checked']}): "
                  f"{c2['changed']} changed ({c2['now_failing']} now failing), {c2['new']} new, "
                  f"{c2['removed']} removed, {c2['unchanged']} unchanged; "
                  f"{c2['carried_over']} result(s) carried over, not re-checked\n")
        if cmp["previous"].get("filtered"):
            out.write(f"    the earlier results were filtered ({cmp['previous']['joints_listed']} "
                      "joints listed): joints outside that filter count as new\n")
        moved = [r for r in cmp["joints"] if r["change"] != "unchanged"]
        for r in moved[:20]:
            what = f": {', '.join(r['what'])}" if r["what"] else ""
            out.write(f"    {r['change']:8} {r['label']} ({r['id']})  "
                      f"{r['status_before'] or '-'} -> {r['status_after'] or '-'}{what}\n")
        if len(moved) > 20:
            out.write(f"    ... and {len(moved) - 20} more (results JSON: check.comparison)\n")
    kinds = Counter(p["kind"] for j in results["joints"] for p in j["check"]["problems"])
    if kinds:
        out.write("  problems: " + ", ".join(f"{k} {v}" for k, v in sorted(kinds.items())) + "\n")
    for note in ck["notes"]:
        out.write(f"  note: {note}\n")
    out.write(f"  {CAUTION}\n")


__all__ = [
    "READABLE_SCHEMA_VERSIONS",
    "RESULTS_SCHEMA_VERSION",
    "Status",
    "build_results",
    "issues_rows",
    "results_dataframe",
    "write_check_summary",
    "write_issues",
    "write_results_csv",
    "write_results_json",
]
