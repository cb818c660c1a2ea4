"""Two revisions of a model compared joint by joint, from their results JSON.

Joints are matched by their id (beam GlobalId and end); joints left over are matched by
position (the face point within ``POSITION_TOLERANCE`` and the same axis and face), for an
exporter that regenerated GlobalIds. Each joint is ``new``, ``removed``, ``unchanged`` or
``changed``, with what changed (the section or grade of the beam or the column, the plate,
bolts, welds and other parts as the engine took them, the joint's kind, the demands, the
tool version) and its status before and after. The engine inputs are compared as recorded
in each results file, so a change is what the check saw, not what the file's bytes did.
"""

from __future__ import annotations

import json
import math
from collections import Counter

#: Two face points this close are the same joint when GlobalIds differ (mm; common practice,
#: no source: a re-export moves nothing, a small edit moves a joint by more).
POSITION_TOLERANCE = 20.0

#: The engine input's parts, in the words a change is reported with.
_PARTS = {
    "beam": "beam section or grade", "column": "supporting member section or grade",
    "plate": "end plate", "fin": "fin plate", "header": "end plate", "cleats": "cleats",
    "bolts": "bolts", "welds": "welds", "haunch": "haunch", "stiffeners": "stiffeners",
    "web_plates": "web plates",
}


def _inputs(j: dict) -> dict:
    return (j.get("check") or {}).get("inputs") or {}


def _demands(j: dict) -> list:
    """The demand rows as values (their source line left out: moving a row is no change)."""
    rows = (j.get("check") or {}).get("demands") or []
    return [{k: v for k, v in r.items() if k not in ("source", "other_side_source")}
            for r in rows]


def _same(x, y) -> bool:
    """Equal as JSON says (a tuple is a list, an enum its value).

    One record may be read from a file and the other still in memory.
    """
    return x == y or json.dumps(x, sort_keys=True, default=str) == json.dumps(
        y, sort_keys=True, default=str)


def what_changed(before: dict, after: dict, tools: tuple[str, str]) -> list[str]:
    """What differs between two revisions of one joint, in words (empty: unchanged)."""
    out = []
    if before.get("archetype") != after.get("archetype"):
        out.append(f"kind ({before.get('archetype')} -> {after.get('archetype')})")
    a, b = _inputs(before), _inputs(after)
    for key, words in _PARTS.items():
        if not _same(a.get(key), b.get(key)) and words not in out:
            out.append(words)
    others = sorted(k for k in set(a) | set(b)
                    if k not in _PARTS and not _same(a.get(k), b.get(k)))
    if others:
        out.append("check settings (" + ", ".join(others) + ")")
    da, db = _demands(before), _demands(after)
    if not _same(da, db) and sorted(json.dumps(r, sort_keys=True, default=str) for r in da) \
            != sorted(json.dumps(r, sort_keys=True, default=str) for r in db):
        out.append("demands")
    if len({p["guid"] for p in before.get("parts", ())}) != len(
            {p["guid"] for p in after.get("parts", ())}):
        out.append("parts attached")
    if out and tools[0] != tools[1]:
        out.append(f"tool version ({tools[0]} -> {tools[1]})")
    return out


def _near(a: dict, b: dict) -> bool:
    pa, pb = a.get("point_mm"), b.get("point_mm")
    if not pa or not pb or a.get("axis") != b.get("axis") or a.get("face") != b.get("face"):
        return False
    return math.dist(pa, pb) <= POSITION_TOLERANCE


def compare_results(before: dict, after: dict) -> dict:
    """Every joint of two results files: its fate, what changed, its status before and after.

    Returns ``joints`` (one entry per joint of either revision: ``id`` (after's, else
    before's), ``label``, ``change``, ``matched_by`` (``id`` or ``position``), ``what``,
    ``status_before``, ``status_after``) and ``counts`` (by change; ``now_failing``: joints
    that fail after and did not before).
    """
    tools = (before.get("check", {}).get("tool_version", ""),
             after.get("check", {}).get("tool_version", ""))
    old = {j["id"]: j for j in before["joints"]}
    new = {j["id"]: j for j in after["joints"]}
    pairs = [(old[k], new[k], "id") for k in new if k in old]
    left_old = [j for k, j in old.items() if k not in new]
    left_new = [j for k, j in new.items() if k not in old]
    for j in list(left_new):
        hit = next((o for o in left_old if _near(o, j)), None)
        if hit is not None:
            pairs.append((hit, j, "position"))
            left_old.remove(hit)
            left_new.remove(j)
    rows = []
    for o, n, how in pairs:
        what = what_changed(o, n, tools)
        rows.append(_row(n, "changed" if what else "unchanged", how, what, o, n))
    rows += [_row(j, "new", None, [], None, j) for j in left_new]
    rows += [_row(j, "removed", None, [], j, None) for j in left_old]
    rows.sort(key=lambda r: (r["change"] == "unchanged", r["label"], r["id"]))
    counts = Counter(r["change"] for r in rows)
    now_failing = sum(1 for r in rows if r["status_after"] == "fail"
                      and r["status_before"] != "fail")
    return {"joints": rows, "counts": {**{k: counts.get(k, 0) for k in
                                          ("new", "removed", "changed", "unchanged")},
                                       "now_failing": now_failing},
            "tool_versions": list(tools)}


def _row(j: dict, change: str, how, what, before, after) -> dict:
    return {
        "id": j["id"], "label": j.get("label", ""), "change": change, "matched_by": how,
        "previous_id": before["id"] if before else None,
        "carried_over": bool(((after or {}).get("check") or {}).get("carried_over")),
        "what": what,
        "status_before": (before or {}).get("check", {}).get("status") if before else None,
        "status_after": (after or {}).get("check", {}).get("status") if after else None,
    }


def write_comparison(cmp: dict, out) -> None:
    """The comparison on a text stream: the counts, then every joint that is not unchanged."""
    c = cmp["counts"]
    out.write(f"joints: {c['changed']} changed ({c['now_failing']} now failing), "
              f"{c['new']} new, {c['removed']} removed, {c['unchanged']} unchanged\n")
    for r in cmp["joints"]:
        if r["change"] == "unchanged":
            continue
        st = f"{r['status_before'] or '-'} -> {r['status_after'] or '-'}"
        how = " (matched by position)" if r["matched_by"] == "position" else ""
        what = f": {', '.join(r['what'])}" if r["what"] else ""
        out.write(f"  {r['change']:9} {r['label']} ({r['id']}){how}  {st}{what}\n")


def comparison_section(path: str, before: dict, after: dict) -> dict:
    """The comparison with an earlier run, for the results (``check.comparison``).

    Besides :func:`compare_results`: where the earlier results came from and when they
    were checked. A joint matched by position (GlobalIds regenerated) keeps the earlier
    joint's problem GUIDs, so its BCF topics, and the comments on them, carry on.
    """
    cmp = compare_results(before, after)
    old = {j["id"]: j for j in before.get("joints", ())}
    new = {j["id"]: j for j in after.get("joints", ())}
    for r in cmp["joints"]:
        if r["matched_by"] != "position":
            continue
        was = {p["kind"]: p["guid"] for p in old[r["previous_id"]]["check"]["problems"]}
        for p in new[r["id"]]["check"]["problems"]:
            p["guid"] = was.get(p["kind"], p["guid"])
    cmp["counts"]["carried_over"] = sum(1 for r in cmp["joints"] if r["carried_over"])
    flt = before.get("check", {}).get("filter")
    return {"previous": {"path": path,
                         "checked": before.get("check", {}).get("created", ""),
                         "tool_version": before.get("check", {}).get("tool_version", ""),
                         # a filtered file lists some joints only: the others count as new
                         "filtered": bool(flt), "joints_listed": len(before.get("joints", ()))},
            **cmp}
