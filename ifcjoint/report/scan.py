"""The scan as one dictionary (docs/scan-json.md), and its renderers: JSON, CSV, text summary.

``build_scan`` makes the dictionary once from a :class:`ifcjoint.model.joints.ScanResult`;
every renderer takes that dictionary (``write_x(scan_dict, target, **options)``) and none
recomputes anything.
"""

from __future__ import annotations

import json
from collections import Counter
from pathlib import Path
from typing import TextIO

import pandas as pd

from ifcjoint import TOOL_NAME, __version__
from ifcjoint.anatomy import JointAnatomy, stiffener_guids, web_plate_guids
from ifcjoint.catalogue.sections import ISection
from ifcjoint.fileio import atomic_write_text, safe_cell
from ifcjoint.model.codes import Axis, PartRole, Support
from ifcjoint.model.joints import Finding, Joint, ScanResult
from ifcjoint.report.words import coded, finding_message

SCAN_SCHEMA_VERSION = "1.0"
CAUTION = (
    "ifcjoint supports, and never replaces, a competent engineer: results must be verified by a "
    "qualified engineer and defer to the National Annex, local codes and licensed practice."
)


def _r(x: float | None, digits: int = 2) -> float | None:
    return None if x is None else round(x, digits)


def _pt(p) -> list[float]:
    return [round(float(x), 3) for x in p]


def finding_dict(f: Finding) -> dict:
    """A finding as JSON-ready data, with its sentence."""
    return {
        "code": f.code,
        "severity": f.severity,
        "basis": f.basis,
        "measured": _r(f.measured),
        "limit": _r(f.limit),
        "message": finding_message(f),
        "elements": list(f.elements),
        "fails_joint": f.fails_joint,
    }


def _section(s: ISection | None) -> dict | None:
    if s is None:
        return None
    return {"name": s.name, "source": s.source, "h": s.h, "b": s.b, "tw": s.tw, "tf": s.tf,
            "r": s.r}


def anatomy_dict(j: Joint, a: JointAnatomy) -> dict:
    """A joint's anatomy as JSON-ready data (mm, MPa)."""
    p, b = a.plate, a.bolts
    return {
        "archetype": j.archetype,
        "archetype_reason": coded(j.archetype_reason),
        "beam_section": _section(a.beam_section),
        "column_section": _section(a.column_section),
        "beam_grade": a.beam_grade,
        "column_grade": a.column_grade,
        "plate": None
        if p is None
        else {
            "guid": p.guid,
            "role": p.role,
            "tp": _r(p.tp),
            "bp": _r(p.bp),
            "hp": _r(p.hp),
            "projection_top": _r(p.projection_top),
            "projection_bottom": (
                _r(p.projection_bottom(a.beam_section.h)) if a.beam_section else None
            ),
            "gap_to_column": _r(p.gap_to_column),
            "along_min": _r(p.along_min),
            "along_max": _r(p.along_max),
            "hole_d": p.hole_d,
            "grade": p.grade,
        },
        "bolts": None
        if b is None
        else {
            "d": b.d,
            "d_source": b.d_source,
            "class": b.bolt_class,
            "length": b.length,
            "d0": b.d0,
            "d0_source": b.d0_source,
            "gauge": _r(b.gauge),
            "pitches": [_r(x) for x in b.pitches],
            "rows_from_beam_top": [_r(r.from_beam_top) for r in b.rows],
            "tstub": None if b.tstub is None else {k: _r(v) for k, v in b.tstub.items()},
            "rows": [
                {
                    "index": r.index,
                    "from_beam_top": _r(r.from_beam_top),
                    "lateral": [_r(x) for x in r.lateral],
                    "along": [_r(x) for x in r.along],
                    "bolts": list(r.bolts),
                }
                for r in b.rows
            ],
        },
        "welds": [{"guid": w.guid, "location": w.location, "throat": _r(w.throat),
                   "source": w.source} for w in a.welds],
        "stiffeners": list(stiffener_guids(a)),
        "stiffener_depths_mm": [round(float(x.level), 1) for x in a.stiffener_plates],
        "stiffener_plates": [
            {"guids": list(x.guids), "level_mm": _r(x.level), "t": _r(x.t), "b": _r(x.b),
             "sides": x.sides, "grade": x.grade}
            for x in a.stiffener_plates
        ],
        "web_plates": list(web_plate_guids(a)),
        "unread": list(a.unread),
        "assumed": list(a.assumed),
    }


def _axis_xy(m, z: float) -> list[float] | None:
    """Plan position (mm) of a member's axis at height z (None without the member)."""
    if m is None:
        return None
    (x0, y0, z0), (x1, y1, z1) = m.start, m.end
    t = 0.0 if abs(z1 - z0) < 1e-9 else min(1.0, max(0.0, (z - z0) / (z1 - z0)))
    return [round(x0 + t * (x1 - x0), 1), round(y0 + t * (y1 - y0), 1)]


def joint_dict(j: Joint, a: JointAnatomy | None, column=None) -> dict:
    """One joint of the scan as JSON-ready data (``column``: the column member, for its axis)."""
    return {
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
        "column_axis_mm": (_axis_xy(column, j.point[2]) if j.support == Support.COLUMN
                           else None),
        "gap_mm": round(j.gap, 3),
        "partner": j.partner,
        "haunch_members": list(j.haunch_members),
        "support": j.support,
        "other_end": j.other_end,
        "archetype": j.archetype,
        "archetype_reason": coded(j.archetype_reason),
        "plates": [p.guid for p in j.plates],
        "bolts": list(j.parts(PartRole.BOLT)),
        "welds": list(j.parts(PartRole.WELD)),
        "other_fasteners": list(j.parts(PartRole.OTHER_FASTENER)),
        "parts": [
            {"guid": p.guid, "role": p.role, "source": p.source} for p in (*j.plates, *j.fasteners)
        ],
        "findings": [finding_dict(f) for f in j.findings],
        "anatomy": anatomy_dict(j, a) if a is not None else None,
    }


def build_scan(result: ScanResult) -> dict:
    """The scan as plain JSON-ready data (documented in docs/scan-json.md)."""
    m = result.model
    members = {x.guid: x for x in m.members}
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
        "joints": [joint_dict(j, result.anatomy.get(j.id), members.get(j.column))
                   for j in result.joints],
        "other_beam_ends": [
            {
                "beam": o.beam,
                "beam_end": o.beam_end,
                "kind": o.kind,
                "other": o.other,
                "point_mm": _pt(o.point),
                "label": o.label,
                "storey": members[o.beam].storey if o.beam in members else "",
                "joint": o.joint,
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


def write_scan_json(scan: dict, path: str | Path) -> dict[str, int]:
    """Write the scan JSON (atomically)."""
    # compact (one line): the C encoder writes a 10,000-joint scan in a second
    atomic_write_text(path, json.dumps(scan, separators=(",", ":"), ensure_ascii=False) + "\n")
    return {}


#: Columns of the scan CSV, in order.
SCAN_CSV_COLUMNS = (
    "joint_id", "label", "storey", "beam_guid", "beam_end", "column_guid", "axis", "side_sign",
    "partner", "archetype", "archetype_reason", "n_plates", "n_bolts", "plates", "bolts",
    "welds", "n_findings", "findings", "gap_mm", "x_mm", "y_mm", "z_mm",
)


def scan_dataframe(scan: dict) -> pd.DataFrame:
    """One row per joint (the CSV's content) as a pandas DataFrame."""
    rows = []
    for j in scan["joints"]:
        x, y, z = j["point_mm"]
        rows.append(
            {
                "joint_id": j["id"],
                "label": j["label"],
                "storey": j["storey"],
                "beam_guid": j["beam"],
                "beam_end": j["beam_end"],
                "column_guid": j["column"],
                "axis": j["axis"],
                "side_sign": 1 if j["side"] == "+" else -1,
                "partner": j["partner"] or "",
                "archetype": j["archetype"],
                "archetype_reason": j["archetype_reason"],
                "n_plates": len(j["plates"]),
                "n_bolts": len(j["bolts"]),
                "plates": " ".join(j["plates"]),
                "bolts": " ".join(j["bolts"]),
                "welds": " ".join(j["welds"]),
                "n_findings": len(j["findings"]),
                "findings": " ".join(f["code"] for f in j["findings"]),
                "gap_mm": round(j["gap_mm"], 1),
                "x_mm": round(x, 1),
                "y_mm": round(y, 1),
                "z_mm": round(z, 1),
            }
        )
    return pd.DataFrame(rows, columns=list(SCAN_CSV_COLUMNS))


def write_scan_csv(scan: dict, path: str | Path) -> dict[str, int]:
    """Write one CSV row per joint (atomically); model text is made formula-safe."""
    df = scan_dataframe(scan)
    for c in df.columns:
        if not pd.api.types.is_numeric_dtype(df[c]):
            df[c] = df[c].map(safe_cell)
    atomic_write_text(path, df.to_csv(index=False))
    return {}


def _counts_line(counts: Counter) -> str:
    return ", ".join(f"{k} {v}" for k, v in sorted(counts.items()))


def write_scan_summary(scan: dict, out: TextIO, *, brief: bool = False) -> None:
    """A human summary: counts, every joint, every other beam end, unreadable elements."""
    m, c, w = scan["model"], scan["counts"], out.write
    unit = "assumed" if m["length_unit_source"] == "assumed" else "from the model"
    w(f"{TOOL_NAME} {__version__} scan of {m['path']}\n")
    w(f"  schema {m['schema']}; 1 length unit = {m['length_unit_to_mm']:g} mm ({unit})\n")
    fk = ", ".join(
        f"{k.removeprefix('fasteners_')} {v}" for k, v in sorted(c.items())
        if k.startswith("fasteners_")
    )
    w(
        f"  read {c.get('beams', 0)} beams, {c.get('columns', 0)} columns, "
        f"{c.get('braces', 0)} braces, {c.get('plates', 0)} plates, "
        f"{c.get('fasteners', 0)} fastener elements" + (f" ({fk})" if fk else "") + "\n"
    )
    if c.get("non_steel_members"):
        w(f"  {c['non_steel_members']} members read as not steel (concrete, timber...) skipped\n")
    unreadable = scan["unreadable"]
    if unreadable:
        w(f"  {len(unreadable)} element(s) unreadable, listed below\n")
    js = scan["joints"]
    on_cols = [j for j in js if j.get("support", "column") == "column"]
    axes = Counter(j["axis"] for j in on_cols)
    pairs = sum(1 for j in on_cols if j["partner"]) // 2
    w(
        f"\nBeam-to-column joints: {len(on_cols)} (major axis {axes.get(Axis.MAJOR, 0)}, "
        f"minor axis {axes.get(Axis.MINOR, 0)}; double-sided pairs {pairs})\n"
    )
    on_beams = [j for j in js if j.get("support") == "beam"]
    if on_beams:
        pairs = sum(1 for j in on_beams if j["partner"]) // 2
        w(f"Beam-to-beam joints: {len(on_beams)} (secondary beams on a primary beam's web; "
          f"double-sided pairs {pairs})\n")
    splices = [j for j in js if j.get("support") == "splice"]
    if splices:
        w(f"Beam splices: {len(splices)} (collinear beams meeting end to end)\n")
    arch = Counter(j["archetype"] for j in js)
    if arch:
        w(f"  by archetype: {_counts_line(arch)}\n")
    codes = Counter(f["code"] for j in js for f in j["findings"])
    if codes:
        w(f"  detailing findings: {sum(codes.values())} ({_counts_line(codes)})\n")
    elif js:
        w("  detailing findings: none\n")
    others = scan["other_beam_ends"]
    kinds = Counter(o["kind"] for o in others)
    w(f"Other beam ends: {len(others)}" + (f" ({_counts_line(kinds)})" if kinds else "") + "\n")
    if not brief:
        _summary_lists(scan, w)
    if unreadable:
        w("\nUnreadable elements\n")
        for u in unreadable:
            w(f"  {u['element']} ({u['ifc_class']}): {u['reason']}\n")
    notes = scan["notes"]
    if notes and not brief:
        w("\nNotes\n")
        for n in notes[:50]:
            w(f"  {n}\n")
        if len(notes) > 50:
            w(f"  ... {len(notes) - 50} more notes in the JSON output\n")
    w(f"\n{CAUTION}\n")


def _summary_lists(scan: dict, w) -> None:
    """Every joint, every finding, unread and assumed datum, every other beam end."""
    js, others = scan["joints"], scan["other_beam_ends"]
    if js:
        w("\nJoints\n")
        width = max(28, *(len(j["label"]) for j in js))  # labels are never cut
        w(
            f"  {'label':<{width}} {'id':<15} {'beam end':<30} {'axis':<6} {'archetype':<18} "
            f"{'plates':>6} {'bolts':>5}  partner\n"
        )
        for j in js:
            w(
                f"  {j['label']:<{width}} {j['id']:<15} "
                f"{(j['beam'] + ':' + j['beam_end']):<30} "
                f"{j['axis']:<6} {j['archetype']:<18} {len(j['plates']):>6} "
                f"{len(j['bolts']):>5}  {j['partner'] or '-'}\n"
            )

    def extra(j: dict, key: str) -> list[str]:
        return (j["anatomy"] or {}).get(key) or []

    if any(j["findings"] or extra(j, "unread") or extra(j, "assumed") for j in js):
        w("\nFindings, unread and assumed data\n")
        width = max(44, *(len(j["label"]) + len(j["id"]) + 3 for j in js))
        for j in js:
            lab = f"{j['label']} ({j['id']})"  # label and id: two joints may share a label
            for f in j["findings"]:
                w(
                    f"  {lab:<{width}} {f['severity']:<8} {f['code']:<30} {f['message']}"
                    f" [{f['basis']}]\n"
                )
            for u in extra(j, "unread"):
                w(f"  {lab:<{width}} {'unread':<8} {'-':<30} {u}\n")
            for u in extra(j, "assumed"):
                w(f"  {lab:<{width}} {'assumed':<8} {'-':<30} {u}\n")
    if others:
        w("\nOther beam ends\n")
        for o in others:
            tail = f" -> {o['other']}" if o["other"] else ""
            w(f"  {(o['beam'] + ':' + o['beam_end']):<30} {o['kind']:<12} {o['label']}{tail}\n")
