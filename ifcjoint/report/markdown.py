"""The short Markdown summary of a check, for a review or a CI log (model strings made inert)."""

from __future__ import annotations

from collections import Counter

from ifcjoint.fileio import atomic_write_text
from ifcjoint.model.codes import UNCHECKED, Status
from ifcjoint.report.results import cite, top_joints
from ifcjoint.report.words import STATUS_WORDS


def render_markdown(results: dict, top: int = 10) -> str:
    """A short summary for a review or a CI log (Markdown; model strings made inert)."""

    def md(s) -> str:
        t = str(s)
        for ch in "\\`*_[]<>|#":
            t = t.replace(ch, "\\" + ch)
        return t

    ck, joints = results["check"], results["joints"]
    c = ck["counts"]
    lines = [
        f"## ifcjoint check of {md(results['model']['path'])}",
        "",
        f"{len(joints)} joints, ifcjoint {md(ck['tool_version'])}, {md(ck['created'])}.",
        "",
        "| status | joints |",
        "|---|---|",
    ]
    lines += [f"| {STATUS_WORDS[s]} | {c.get(s, 0)} |" for s in Status]
    done = top_joints(results, top)
    if done:
        lines += ["", f"Highest utilisations (top {len(done)}):", "",
                  "| joint | status | utilisation | governing | clause | combination |",
                  "|---|---|---|---|---|---|"]
        for j in done:
            g = j["check"]["governing"]
            lines.append(
                f"| {md(j['label'])} (`{j['id']}`) | {j['check']['status']} | "
                f"{g['utilisation']:.2f} | {md(g['name'])} | {md(cite(results, g['clause']))} | "
                f"{md(g['combination'] or '(any: detailing)')} |"
            )
    reasons = Counter(
        (j["check"]["status"], j["check"]["status_reason"])
        for j in joints
        if j["check"]["status"] in UNCHECKED
    )
    if reasons:
        lines += ["", "Unchecked joints:", ""]
        for (st, why), n in reasons.most_common():
            lines.append(f"- {n} x {STATUS_WORDS[st]}: {md(why)}")
    probs = Counter(p["kind"] for j in joints for p in j["check"]["problems"])
    if probs:
        lines += ["", "Problems (BCF topics): " + ", ".join(f"{k} {v}" for k, v in
                                                        sorted(probs.items()))]
    dem = ck.get("demands")
    if dem:
        lines += ["", f"Demands: {dem['rows_used']} rows used, {dem['rows_rejected']} rejected."]
    lines += ["", f"> {results['caution']}", ""]
    return "\n".join(lines)


def write_markdown(results: dict, path, *, top: int = 10) -> dict[str, int]:
    """Write the Markdown summary atomically."""
    atomic_write_text(path, render_markdown(results, top))
    return {}
