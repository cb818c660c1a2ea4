"""Renderers of a :class:`ifcjoint.checker.ModelCheck`: JSON, CSV, issue list, text summary.

Every renderer reads the same object; none recomputes a number (docs/results.md).
"""

from __future__ import annotations

import csv
import io
import json
import math
from pathlib import Path
from typing import TextIO

import pandas as pd

from ifcjoint.engine.demands import UNCHECKED
from ifcjoint.fileio import atomic_write_text, safe_cell
from ifcjoint.outputs.scan import CAUTION, scan_to_dict

RESULTS_SCHEMA_VERSION = "1.0"
STATUS_WORDS = {
    "pass": "pass",
    "fail": "fail",
    "no_demands": "unchecked: no demands",
    "incomplete": "unchecked: incomplete",
    "unsupported": "unchecked: unsupported",
    "unreadable": "unchecked: unreadable",
}


def _demand_dict(d) -> dict:
    def k(x, f):
        return None if x is None else round(x / f, 3)

    return {
        "combination": d.combination,
        "M_Ed_kNm": k(d.M_Ed, 1e6),
        "V_Ed_kN": k(d.V_Ed, 1e3),
        "N_Ed_kN": k(d.N_Ed, 1e3),
        "M_Ed_other_side_kNm": k(d.M_other, 1e6),
        "Vc_above_kN": k(d.Vc_above, 1e3),
        "Vc_below_kN": k(d.Vc_below, 1e3),
        "frame": None if d.braced is None else ("braced" if d.braced else "unbraced"),
        "assumed_joint": d.assumed_joint,
        "source": d.source,
        "other_side_source": d.other_source or None,
    }


def joint_check_dict(jc) -> dict:
    """The check part of one joint (added to the scan JSON's joint)."""
    g = jc.verdict.governing
    r = jc.result.as_dict()
    return {
        "status": jc.status,
        "status_reason": jc.verdict.reason,
        "utilisation": None if g is None else round(float(g.utilisation), 3),
        "governing": None
        if g is None
        else {
            "clause": g.clause,
            "name": g.name,
            "utilisation": round(float(g.utilisation), 3),
            "combination": g.combination,
        },
        "engine_status": r["status"],
        "engine_reason": r.get("reason", ""),
        "resistance": r.get("resistance"),
        "components": r.get("components", []),
        "tension_rows": r.get("tension_rows", []),
        "classification": r.get("classification", {}),
        "engine_notes": r.get("notes", []),
        "m_phi": r.get("m_phi"),
        "sagging": r.get("sagging"),
        "inputs": r.get("inputs") or None,
        "demands": [_demand_dict(d) for d in jc.demands],
        "combinations": [
            {
                "combination": c.demand.combination,
                "beta": c.beta,
                "utilisations": [u.as_dict() for u in c.utilisations],
                "notes": list(c.notes),
            }
            for c in jc.verdict.combinations
        ],
        "assumption": jc.verdict.assumption or None,
        "fingerprint": jc.fingerprint,
        "problems": [
            {"guid": p.guid, "kind": p.kind, "severity": p.severity, "title": p.title}
            for p in jc.problems
        ],
    }


def _finite(obj):
    """Replace non-finite floats by None so the JSON stays strict.

    An infinite utilisation (a resistance of zero) becomes null; the status still says fail.
    """
    if isinstance(obj, float):
        return obj if math.isfinite(obj) else None
    if isinstance(obj, dict):
        return {k: _finite(v) for k, v in obj.items()}
    if isinstance(obj, (list, tuple)):
        return [_finite(v) for v in obj]
    return obj


def results_to_dict(mc) -> dict:
    """The scan JSON extended with the check of every joint (docs/results.md)."""
    d = scan_to_dict(mc.scan)
    d["results_schema_version"] = RESULTS_SCHEMA_VERSION
    by_id = {jc.joint.id: jc for jc in mc.joints}
    for j in d["joints"]:
        j["check"] = joint_check_dict(by_id[j["id"]])
    dem = mc.demands
    d["check"] = {
        "created": mc.created.isoformat(),
        "tool_version": mc.tool_version,
        "params": mc.settings.params.as_dict(),
        "braced_default": mc.settings.braced,
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
    }
    d["caution"] = CAUTION
    return _finite(d)


def write_results_json(mc, path: str | Path) -> None:
    """Write the results JSON atomically."""
    text = json.dumps(results_to_dict(mc), indent=1, default=float, allow_nan=False)
    atomic_write_text(path, text + "\n")


def results_dataframe(mc) -> pd.DataFrame:
    """One row per joint: identity, status, governing check, resistances, classification."""
    rows = []
    for jc in mc.joints:
        j, g = jc.joint, jc.verdict.governing
        res = jc.result.as_dict()
        rr = res.get("resistance") or {}
        cls = res.get("classification") or {}
        rows.append(
            {
                "joint_id": j.id,
                "label": j.label,
                "beam_guid": j.beam,
                "beam_end": j.beam_end,
                "column_guid": j.column,
                "archetype": j.archetype,
                "status": jc.status,
                "status_reason": jc.verdict.reason,
                "utilisation": None if g is None else round(float(g.utilisation), 3),
                "governing": "" if g is None else g.name,
                "governing_clause": "" if g is None else g.clause,
                "governing_combination": "" if g is None else g.combination,
                "Mj_Rd_hogging_kNm": rr.get("Mj_Rd_hogging_kNm"),
                "Mj_Rd_sagging_kNm": rr.get("Mj_Rd_sagging_kNm"),
                "Vj_Rd_kN": rr.get("Vj_Rd_kN"),
                "Sj_ini_kNm_per_rad": rr.get("Sj_ini_kNm_per_rad"),
                "stiffness_class": cls.get("stiffness", ""),
                "strength_class": cls.get("strength", ""),
                "assumed_joint": (jc.verdict.assumption or {}).get("assumed", ""),
                "n_combinations": len(jc.demands),
                "n_findings": len(j.findings),
                "n_problems": len(jc.problems),
                "fingerprint": jc.fingerprint,
            }
        )
    return pd.DataFrame(rows)


def write_results_csv(mc, path: str | Path) -> None:
    """One row per joint, spreadsheet-safe."""
    df = results_dataframe(mc).map(safe_cell)
    atomic_write_text(path, df.to_csv(index=False, lineterminator="\n"))


def issues_rows(mc) -> list[dict]:
    """The issue list: one row per problem (the same problems as the BCF topics)."""
    return [
        {
            "topic_guid": p.guid,
            "joint_id": jc.joint.id,
            "label": jc.joint.label,
            "kind": p.kind,
            "severity": p.severity,
            "title": p.title,
            "description": p.description,
            "elements": " ".join(p.elements),
        }
        for jc, p in mc.problems()
    ]


def write_issues(mc, path: str | Path) -> None:
    """The issue list as CSV (``.csv``) or JSON (any other suffix)."""
    rows = issues_rows(mc)
    if str(path).lower().endswith(".csv"):
        buf = io.StringIO()
        cols = ["topic_guid", "joint_id", "label", "kind", "severity", "title", "description",
                "elements"]
        w = csv.DictWriter(buf, fieldnames=cols, lineterminator="\n")
        w.writeheader()
        for r in rows:
            w.writerow({k: safe_cell(v) for k, v in r.items()})
        atomic_write_text(path, buf.getvalue())
    else:
        atomic_write_text(path, json.dumps({"issues": rows}, indent=1) + "\n")


def write_check_summary(mc, out: TextIO, *, top: int = 10) -> None:
    """Counts by status, the highest utilisations, rejected demand rows, the caution."""
    c = mc.counts()
    n = len(mc.joints)
    unchecked = sum(c[s] for s in UNCHECKED)
    out.write(f"{mc.scan.model.path}: {n} joints checked by ifcjoint {mc.tool_version}\n")
    out.write(f"  pass {c['pass']}, fail {c['fail']}, unchecked {unchecked}")
    if unchecked:
        parts = [f"{STATUS_WORDS[s].split(': ')[1]} {c[s]}" for s in UNCHECKED if c[s]]
        out.write(f" ({', '.join(parts)})")
    out.write("\n")
    dem = mc.demands
    if dem is None:
        out.write("  demands: none given\n")
    else:
        out.write(
            f"  demands: {dem.rows_used} rows used, {dem.rows_rejected} rejected "
            f"of {dem.rows_read} read ({dem.path})\n"
        )
        for p in dem.problems:
            out.write(f"    {p.severity}: {p}\n")
    best = mc.top(top)
    if best:
        out.write(f"  highest utilisations (top {len(best)}):\n")
        for jc in best:
            g = jc.verdict.governing
            out.write(
                f"    {g.utilisation:6.2f}  {jc.status:4}  {jc.joint.label:<24} {g.name} "
                f"(EN 1993-1-8 {g.clause}; {g.combination})\n"
            )
    kinds: dict[str, int] = {}
    for _, p in mc.problems():
        kinds[p.kind] = kinds.get(p.kind, 0) + 1
    if kinds:
        out.write("  problems: " + ", ".join(f"{k} {v}" for k, v in sorted(kinds.items())) + "\n")
    for note in mc.notes:
        out.write(f"  note: {note}\n")
    out.write(f"  {CAUTION}\n")
