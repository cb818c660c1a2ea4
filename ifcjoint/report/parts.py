"""The parts table: every plate, bolt group and weld of every joint, as modelled.

For a fabricator's detailing lead comparing the model with the shop drawings: one row per
part, with the dimensions read from the model (mm) and the grades found. Edge distances are
measured on end plates from the bolt rows read: top ``e1`` from the plate's top edge to the
first row, bottom ``e1`` from the last row to the bottom edge, side ``e2`` from the outer
bolt line to the side edge (EN 1993-1-8 Table 3.3 names).
"""

from __future__ import annotations

from pathlib import Path

import pandas as pd

from ifcjoint.fileio import atomic_write_text, safe_cell

COLUMNS = [
    "joint_id", "label", "storey", "archetype", "part", "role", "elements", "grade",
    "thickness_mm", "width_mm", "height_mm", "bolt_size", "bolt_class", "bolt_length_mm",
    "hole_mm", "bolts", "rows", "gauge_mm", "pitches_mm", "e1_top_mm", "e1_bottom_mm",
    "e2_side_mm", "weld_location", "throat_mm",
]


def _r(v, digits: int = 1):
    """A dimension at the precision a shop drawing gives (0.1 mm), or None."""
    return None if v is None else round(float(v), digits)


def _plate_row(plate: dict) -> dict:
    return {"part": "plate", "role": plate.get("role", ""), "elements": plate.get("guid", ""),
            "grade": plate.get("grade") or "", "thickness_mm": _r(plate.get("tp")),
            "width_mm": _r(plate.get("bp")), "height_mm": _r(plate.get("hp")),
            "hole_mm": _r(plate.get("hole_d"))}


def _bolt_row(bolts: dict, plate: dict | None) -> dict:
    rows = bolts.get("rows") or []
    ids = [b for r in rows for b in r.get("bolts", [])]
    from_top = [r["from_beam_top"] for r in rows if r.get("from_beam_top") is not None]
    out = {"part": "bolt group", "role": "bolts", "elements": " ".join(ids),
           "bolt_size": f"M{bolts['d']:g}" if bolts.get("d") else "",
           "bolt_class": bolts.get("class") or "", "bolt_length_mm": _r(bolts.get("length")),
           "hole_mm": _r(bolts.get("d0")), "bolts": len(ids), "rows": len(rows),
           "gauge_mm": _r(bolts.get("gauge")),
           "pitches_mm": " ".join(f"{p:g}" for p in bolts.get("pitches") or [])}
    if plate and plate.get("role") == "end_plate" and from_top:
        top = plate.get("projection_top")
        hp, bp, gauge = plate.get("hp"), plate.get("bp"), bolts.get("gauge")
        if top is not None:
            out["e1_top_mm"] = _r(from_top[0] + top)
            if hp is not None:
                out["e1_bottom_mm"] = _r(hp - top - from_top[-1])
        if bp is not None and gauge is not None:
            out["e2_side_mm"] = _r((bp - gauge) / 2)
    return out


def parts_rows(results: dict) -> list[dict]:
    """One row per plate, bolt group and weld of every joint (see the module docstring)."""
    out = []
    for j in results["joints"]:
        a = j.get("anatomy") or {}
        head = {"joint_id": j["id"], "label": j["label"], "storey": j.get("storey", ""),
                "archetype": j["archetype"]}
        plate = a.get("plate")
        rows = []
        if plate:
            rows.append(_plate_row(plate))
        for key, role in (("stiffener_plates", "stiffener"), ("web_plates", "web_plate")):
            for p in a.get(key) or []:
                rows.append(_plate_row({"role": role, **p}) if isinstance(p, dict) else
                            {"part": "plate", "role": role, "elements": str(p)})
        if a.get("bolts"):
            rows.append(_bolt_row(a["bolts"], plate))
        for w in a.get("welds") or []:
            rows.append({"part": "weld", "role": "weld", "elements": w.get("guid", ""),
                         "weld_location": str(w.get("location", "")).replace("_", " "),
                         "throat_mm": _r(w.get("throat"))})
        out += [{**head, **r} for r in rows]
    return out


def write_parts_csv(results: dict, path: str | Path) -> dict[str, int]:
    """The parts table as CSV (spreadsheet-safe), one row per part."""
    df = pd.DataFrame(parts_rows(results), columns=COLUMNS)
    for col in ("bolts", "rows"):
        df[col] = df[col].astype("Int64")  # counts, not 8.0
    df = df.map(safe_cell)
    atomic_write_text(path, df.to_csv(index=False, lineterminator="\n"))
    return {"parts": len(df)}
