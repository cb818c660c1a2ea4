"""Every beam end of the model accounted for, in one table (from the results dictionary).

A beam end is either a joint's (its status: pass, fail, no demands, incomplete, unsupported,
unreadable; a pinned joint's apart), or another kind of end (a beam-to-beam end or a splice
no joint checks, a column cap or base, a haunch, a free end). A splice joint accounts for
both ends it joins; a beam-to-beam end checked as a joint is counted with its joint. The
beams read give 2 ends each: any end the results do not hold is listed as missing (there
should be none), so a coordinator can say "every end is accounted for".
"""

from __future__ import annotations

from collections import Counter

from ifcjoint.model.codes import Archetype

#: The categories in the summary line's words (same order as ``CATEGORIES``).
SHORT = {
    "pass": "pass", "fail": "fail", "pinned_pass": "pinned pass", "pinned_fail": "pinned fail",
    "no_demands": "no demands", "incomplete": "incomplete", "unsupported": "unsupported",
    "unreadable": "unreadable", "beam_to_beam": "beam-to-beam", "splice": "splice",
    "column_cap": "column cap", "column_base": "column base", "haunch": "haunch",
    "free_end": "free end",
}
#: The categories, in the order the table lists them, with their words.
CATEGORIES = {
    "pass": "checked: pass",
    "fail": "checked: fail",
    "pinned_pass": "pinned, checked: pass",
    "pinned_fail": "pinned, checked: fail",
    "no_demands": "joint not checked: no demands",
    "incomplete": "joint not checked: parts missing",
    "unsupported": "joint not checked: outside what ifcjoint checks",
    "unreadable": "joint not checked: data missing",
    "beam_to_beam": "on another beam, no joint found",
    "splice": "splice, no joint found",
    "column_cap": "on a column cap",
    "column_base": "at a column base",
    "haunch": "a haunch under another beam",
    "free_end": "free end (cantilever, wall bearing ...)",
}


def _joint_category(j: dict) -> str:
    status = j["check"]["status"]
    if status in ("pass", "fail") and Archetype(j["archetype"]).pinned:
        return f"pinned_{status}"
    return status


def beam_end_coverage(results: dict) -> dict:
    """Counts of every beam end by category, the total against the beams read, and gaps.

    Returns ``beams`` (read), ``beam_ends`` (2 per beam), ``accounted``, ``categories``
    (category -> count, in ``CATEGORIES`` order, zeros left out), ``missing`` (beam ends no
    joint or other end holds) and ``members_not_read`` (members whose ends cannot be known).
    """
    where: dict[tuple[str, str], str] = {}
    for j in results["joints"]:
        cat = _joint_category(j)
        where[(j["beam"], j["beam_end"])] = cat
        if j.get("support") == "splice" and j.get("other_end"):
            where[(j["column"], j["other_end"])] = cat
    for o in results["other_beam_ends"]:
        key = (o["beam"], o["beam_end"])
        if key not in where:  # an end a joint checks is counted with that joint
            where[key] = o["kind"]
    beams = sorted({b for b, _ in where})
    n_beams = results.get("counts", {}).get("beams", len(beams))
    counts = Counter(where.values())
    missing = sorted(f"{b}:{e}" for b in beams for e in ("start", "end") if (b, e) not in where)
    not_read = len((results.get("check") or {}).get("unreadable_members") or ())
    return {
        "beams": n_beams,
        "beam_ends": 2 * n_beams,
        "accounted": len(where),
        "categories": {c: counts[c] for c in CATEGORIES if counts.get(c)},
        "missing": missing,
        "members_not_read": not_read,
    }


def coverage_line(cov: dict) -> str:
    """The coverage in one line of the summary."""
    parts = ", ".join(f"{SHORT[c]} {n}" for c, n in cov["categories"].items())
    whole = cov["accounted"] == cov["beam_ends"] and not cov["missing"]
    verdict = ("every one accounted for" if whole else
               f"{cov['accounted']} accounted for, {len(cov['missing'])} missing")
    tail = (f"; {cov['members_not_read']} member(s) not read, their ends unknown"
            if cov["members_not_read"] else "")
    return f"beam ends: {cov['beam_ends']} of {cov['beams']} beams, {verdict}{tail} ({parts})"
