"""Renderers of a :class:`ifcjoint.engine.results.ScanResult`: JSON, CSV and a text summary.

All three render the same result object; none recomputes anything.
"""

from __future__ import annotations

import json
from collections import Counter
from pathlib import Path
from typing import TextIO

import pandas as pd

from ifcjoint import TOOL_NAME, __version__
from ifcjoint.engine.results import ScanResult
from ifcjoint.fileio import atomic_write_text as _atomic_write
from ifcjoint.fileio import safe_cell

SCAN_SCHEMA_VERSION = "1.0"
CAUTION = (
    "ifcjoint supports, and never replaces, a competent engineer: results must be verified by a "
    "qualified engineer and defer to the National Annex, local codes and licensed practice."
)


def _pt(p) -> list[float]:
    return [round(float(x), 3) for x in p]


def scan_to_dict(result: ScanResult) -> dict:
    """The scan as plain JSON-ready data (documented in docs/scan-json.md)."""
    m = result.model
    joints = []
    for j in result.joints:
        joints.append(
            {
                "id": j.id,
                "label": j.label,
                "storey": j.storey,
                "beam": j.beam,
                "beam_end": j.beam_end,
                "column": j.column,
                "axis": j.axis,
                "face": j.face,
                "side": j.side,
                "point_mm": _pt(j.point),
                "gap_mm": round(j.gap, 3),
                "partner": j.partner,
                "haunch_members": list(j.haunch_members),
                "archetype": j.archetype,
                "archetype_reason": j.archetype_reason,
                "plates": [p.guid for p in j.plates],
                "bolts": [b.guid for b in j.bolts if b.role == "bolt"],
                "welds": [b.guid for b in j.bolts if b.role == "weld"],
                "other_fasteners": [b.guid for b in j.bolts if b.role == "other_fastener"],
                "parts": [
                    {"guid": p.guid, "role": p.role, "source": p.source}
                    for p in (*j.plates, *j.bolts)
                ],
                "findings": list(j.findings),
                "anatomy": (result.anatomy[j.id].as_dict() if j.id in result.anatomy else None),
            }
        )
    return {
        "schema_version": SCAN_SCHEMA_VERSION,
        "tool": {"name": TOOL_NAME, "version": __version__},
        "model": {
            "path": m.path,
            "schema": m.schema,
            "length_unit_to_mm": m.length_unit_to_mm,
            "length_unit_source": m.length_unit_source,
            "sha256": m.sha256,
        },
        "counts": dict(sorted(m.counts.items())),
        "settings": result.settings,
        "joints": joints,
        "other_beam_ends": [
            {
                "beam": o.beam,
                "beam_end": o.beam_end,
                "kind": o.kind,
                "other": o.other,
                "point_mm": _pt(o.point),
                "label": o.label,
            }
            for o in result.other_beam_ends
        ],
        "unreadable": [
            {"element": u.element, "ifc_class": u.ifc_class, "reason": u.reason}
            for u in result.unreadable
        ],
        "notes": list(m.notes),
        "caution": CAUTION,
    }


def write_scan_json(result: ScanResult, path: str | Path) -> None:
    """Write the scan JSON (atomically)."""
    _atomic_write(path, json.dumps(scan_to_dict(result), indent=2, ensure_ascii=False) + "\n")


def scan_dataframe(result: ScanResult) -> pd.DataFrame:
    """One row per joint (the CSV's content) as a pandas DataFrame."""
    rows = []
    for j in result.joints:
        rows.append(
            {
                "joint_id": j.id,
                "label": j.label,
                "storey": j.storey,
                "beam_guid": j.beam,
                "beam_end": j.beam_end,
                "column_guid": j.column,
                "axis": j.axis,
                "side_sign": 1 if j.side == "+" else -1,
                "partner": j.partner or "",
                "archetype": j.archetype,
                "archetype_reason": j.archetype_reason,
                "n_plates": len(j.plates),
                "n_bolts": sum(1 for b in j.bolts if b.role == "bolt"),
                "plates": " ".join(p.guid for p in j.plates),
                "bolts": " ".join(b.guid for b in j.bolts if b.role == "bolt"),
                "welds": " ".join(b.guid for b in j.bolts if b.role == "weld"),
                "n_findings": len(j.findings),
                "findings": " ".join(f["code"] for f in j.findings),
                "gap_mm": round(j.gap, 1),
                "x_mm": round(j.point[0], 1),
                "y_mm": round(j.point[1], 1),
                "z_mm": round(j.point[2], 1),
            }
        )
    cols = [
        "joint_id",
        "label",
        "storey",
        "beam_guid",
        "beam_end",
        "column_guid",
        "axis",
        "side_sign",
        "partner",
        "archetype",
        "archetype_reason",
        "n_plates",
        "n_bolts",
        "plates",
        "bolts",
        "welds",
        "n_findings",
        "findings",
        "gap_mm",
        "x_mm",
        "y_mm",
        "z_mm",
    ]
    return pd.DataFrame(rows, columns=cols)


def write_scan_csv(result: ScanResult, path: str | Path) -> None:
    """Write one CSV row per joint (atomically); model text is made formula-safe."""
    df = scan_dataframe(result)
    for c in df.columns:
        if not pd.api.types.is_numeric_dtype(df[c]):
            df[c] = df[c].map(safe_cell)
    _atomic_write(path, df.to_csv(index=False))


def write_scan_summary(result: ScanResult, out: TextIO, *, brief: bool = False) -> None:
    """A human summary: counts, every joint, every other beam end, unreadable elements."""
    m = result.model
    c = m.counts
    w = out.write
    unit = "assumed" if m.length_unit_source == "assumed" else "from the model"
    w(f"{TOOL_NAME} {__version__} scan of {m.path}\n")
    w(f"  schema {m.schema}; 1 length unit = {m.length_unit_to_mm:g} mm ({unit})\n")
    fk = ", ".join(
        f"{k.removeprefix('fasteners_')} {v}"
        for k, v in sorted(c.items())
        if k.startswith("fasteners_")
    )
    w(
        f"  read {c.get('beams', 0)} beams, {c.get('columns', 0)} columns, "
        f"{c.get('braces', 0)} braces, {c.get('plates', 0)} plates, "
        f"{c.get('fasteners', 0)} fastener elements" + (f" ({fk})" if fk else "") + "\n"
    )
    if c.get("non_steel_members"):
        w(f"  {c['non_steel_members']} members read as not steel (concrete, timber...) skipped\n")
    if result.unreadable:
        w(f"  {len(result.unreadable)} element(s) unreadable, listed below\n")
    js = result.joints
    axes = Counter(j.axis for j in js)
    pairs = sum(1 for j in js if j.partner) // 2
    w(
        f"\nBeam-to-column joints: {len(js)} (major axis {axes.get('major', 0)}, "
        f"minor axis {axes.get('minor', 0)}; double-sided pairs {pairs})\n"
    )
    arch = Counter(j.archetype for j in js)
    if arch:
        w("  by archetype: " + ", ".join(f"{k} {v}" for k, v in sorted(arch.items())) + "\n")
    codes = Counter(f["code"] for j in js for f in j.findings)
    if codes:
        w(
            f"  detailing findings: {sum(codes.values())} ("
            + ", ".join(f"{k} {v}" for k, v in sorted(codes.items()))
            + ")\n"
        )
    elif js:
        w("  detailing findings: none\n")
    others = result.other_beam_ends
    kinds = Counter(o.kind for o in others)
    w(
        f"Other beam ends: {len(others)}"
        + (" (" + ", ".join(f"{k} {v}" for k, v in sorted(kinds.items())) + ")" if kinds else "")
        + "\n"
    )
    if not brief and js:
        w("\nJoints\n")
        w(
            f"  {'label':<28} {'id':<15} {'beam end':<30} {'axis':<6} {'archetype':<18} "
            f"{'plates':>6} {'bolts':>5}  partner\n"
        )
        for j in js:
            nb = sum(1 for b in j.bolts if b.role == "bolt")
            w(
                f"  {j.label[:28]:<28} {j.id:<15} {(j.beam + ':' + j.beam_end):<30} {j.axis:<6} "
                f"{j.archetype:<18} {len(j.plates):>6} {nb:>5}  {j.partner or '-'}\n"
            )

    def noted(j) -> bool:
        a = result.anatomy.get(j.id)
        return bool(j.findings or (a and (a.unread or a.assumed)))

    if not brief and any(noted(j) for j in js):
        w("\nFindings, unread and assumed data\n")
        for j in js:
            for f in j.findings:
                w(
                    f"  {j.label[:28]:<28} {f['severity']:<8} {f['code']:<30} {f['message']}"
                    f" [{f['basis']}]\n"
                )
            a = result.anatomy.get(j.id)
            for u in a.unread if a else ():
                w(f"  {j.label[:28]:<28} {'unread':<8} {'-':<30} {u}\n")
            for u in a.assumed if a else ():
                w(f"  {j.label[:28]:<28} {'assumed':<8} {'-':<30} {u}\n")
    if not brief and others:
        w("\nOther beam ends\n")
        for o in others:
            tail = f" -> {o.other}" if o.other else ""
            w(f"  {(o.beam + ':' + o.beam_end):<30} {o.kind:<12} {o.label}{tail}\n")
    if result.unreadable:
        w("\nUnreadable elements\n")
        for u in result.unreadable:
            w(f"  {u.element} ({u.ifc_class}): {u.reason}\n")
    if m.notes and not brief:
        w("\nNotes\n")
        for n in m.notes[:50]:
            w(f"  {n}\n")
        if len(m.notes) > 50:
            w(f"  ... {len(m.notes) - 50} more notes in the JSON output\n")
    w(f"\n{CAUTION}\n")
