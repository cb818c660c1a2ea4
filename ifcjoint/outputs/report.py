"""Reports people read: one self-contained HTML file, and a short Markdown summary.

Both render the results dict (``results_to_dict``, docs/results.md), the same object the JSON,
BCF and property sets come from, so ``ifcjoint report results.json`` gives the same page as
``ifcjoint check --html``. Templates are jinja2 with autoescaping: every string taken from the
model is escaped. No network: no CDN, fonts or scripts from elsewhere.
"""

from __future__ import annotations

from collections import Counter

from jinja2 import Environment, PackageLoader, select_autoescape
from markupsafe import Markup

from ifcjoint.engine.demands import STATUSES, UNCHECKED
from ifcjoint.fileio import atomic_write_text
from ifcjoint.outputs.drawing import plate_svg
from ifcjoint.outputs.plots import STATUS_COLOURS, m_phi_svg, utilisation_histogram_svg
from ifcjoint.outputs.results import STATUS_WORDS

#: From this many joints on, calculation sheets are built in the page only when opened.
LAZY_FROM = 300

#: How each component's resistance is found (EN 1993-1-8:2005 clause in the sheet's column).
FORMULAS = {
    "column web panel in shear": "V_wp,Rd = 0.9 f_y,wc A_vc / (sqrt(3) gamma_M0)",
    "column web in compression": (
        "F_c,wc,Rd = omega k_wc b_eff,c,wc t_wc f_y,wc / gamma_M0, "
        "at most omega k_wc rho b_eff,c,wc t_wc f_y,wc / gamma_M1"
    ),
    "column web in tension": "F_t,wc,Rd = omega b_eff,t,wc t_wc f_y,wc / gamma_M0",
    "column flange in bending": (
        "T-stub (Table 6.2): F_T,1,Rd = 4 M_pl,1,Rd / m (or the alternative with e_w), "
        "F_T,2,Rd = (2 M_pl,2,Rd + n sum F_t,Rd) / (m + n), F_T,3,Rd = sum F_t,Rd; "
        "M_pl,Rd = 0.25 sum l_eff t_f^2 f_y / gamma_M0"
    ),
    "end plate in bending": (
        "T-stub (Table 6.2) on the plate: modes 1, 2, 3 as for the column flange, with "
        "l_eff of Table 6.6 and t_p, f_y,p"
    ),
    "beam flange and web in compression": "F_c,fb,Rd = M_c,Rd / (h - t_fb)",
    "beam web in tension": "F_t,wb,Rd = b_eff,t,wb t_wb f_y,wb / gamma_M0",
    "beam flange weld": "F_w,Rd = 2 a b_b f_vw,d, f_vw,d = f_u / (sqrt(3) beta_w gamma_M2)",
    "column web panel in shear / beta": "V_wp,Rd / beta",
}
ZONE = {
    "column web panel in shear": "shear zone",
    "column web panel in shear / beta": "shear zone",
    "column web in compression": "compression zone",
    "beam flange and web in compression": "compression zone",
}


def _env() -> Environment:
    env = Environment(
        loader=PackageLoader("ifcjoint", "templates"),
        autoescape=select_autoescape(default=True, default_for_string=True),
        trim_blocks=True,
        lstrip_blocks=True,
    )
    env.filters["num"] = _num
    return env


def _num(v, digits: int = 1) -> str:
    if v is None:
        return "-"
    if isinstance(v, (int, float)):
        return f"{v:,.{digits}f}"
    return str(v)


def _m_phi_all(checks: list[dict], progress=None) -> list[str | None]:
    """Every joint's M-phi plot; on all cores for big models (matplotlib is the slow part)."""
    n = len(checks)
    out: list[str | None] = []
    if n < 150:
        for k, c in enumerate(checks, start=1):
            out.append(m_phi_svg(c))
            if progress:
                progress("report", k, n)
        return out
    import os
    from concurrent.futures import ProcessPoolExecutor

    workers = max(1, min(4, os.cpu_count() or 1))
    with ProcessPoolExecutor(max_workers=workers) as ex:
        for k, svg in enumerate(ex.map(m_phi_svg, checks, chunksize=25), start=1):
            out.append(svg)
            if progress:
                progress("report", k, n)
    return out


def _sheet(j: dict, svg_mphi: str | None) -> dict:
    """What one joint's section of the report shows (no numbers made here)."""
    c = j["check"]
    comps = []
    for x in c.get("components") or []:
        name = x["name"]
        where = (
            f"row {x['row']}"
            if x.get("row")
            else (f"rows {x['rows'][0]}-{x['rows'][-1]}" if x.get("rows") else "")
        )
        comps.append(
            {
                **x,
                "where": where,
                "zone": ZONE.get(name, "tension zone"),
                "formula": FORMULAS.get(name, ""),
                "inputs_text": ", ".join(
                    f"{k} = {_num(v, 2) if isinstance(v, float) else v}"
                    for k, v in (x.get("inputs") or {}).items()
                    if v is not None
                ),
            }
        )
    order = {"tension zone": 0, "compression zone": 1, "shear zone": 2}
    comps.sort(key=lambda x: order[x["zone"]])
    svg_plate = plate_svg(j)
    return {
        "joint": j,
        "check": c,
        "components": comps,
        "plate_svg": Markup(svg_plate) if svg_plate else None,  # built by us, text escaped
        "m_phi_svg": Markup(svg_mphi) if svg_mphi else None,
        "status_word": STATUS_WORDS[c["status"]],
        "colour": STATUS_COLOURS[c["status"]],
    }


def report_context(results: dict, progress=None) -> dict:
    """Everything the HTML template shows, from the results dict."""
    joints = results["joints"]
    ck = results["check"]
    counts = ck["counts"]
    arche = Counter(j["archetype"] for j in joints)
    hist = utilisation_histogram_svg(joints)
    checked = [j["check"] if j["check"].get("engine_status") == "checked" else {} for j in joints]
    plots = _m_phi_all(checked, progress)
    return {
        "r": results,
        "ck": ck,
        "counts": [(s, STATUS_WORDS[s], counts.get(s, 0), STATUS_COLOURS[s]) for s in STATUSES],
        "unchecked": sum(counts.get(s, 0) for s in UNCHECKED),
        "archetypes": sorted(arche.items(), key=lambda kv: -kv[1]),
        "histogram": Markup(hist) if hist else None,
        "sheets": [_sheet(j, svg) for j, svg in zip(joints, plots, strict=True)],
        "statuses": STATUS_WORDS,
        # Large reports keep each sheet in a <template>, built when opened: the page loads fast.
        "lazy": len(joints) > LAZY_FROM,
    }


def render_html(results: dict, progress=None) -> str:
    """The self-contained HTML report (``progress(stage, done, total)`` while plotting)."""
    return _env().get_template("report.html.j2").render(**report_context(results, progress))


def write_html(results: dict, path, progress=None) -> int:
    """Write the HTML report atomically; returns its size in bytes."""
    html = render_html(results, progress)
    atomic_write_text(path, html)
    return len(html.encode("utf-8"))


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
    lines += [f"| {STATUS_WORDS[s]} | {c.get(s, 0)} |" for s in STATUSES]
    done = [j for j in joints if j["check"]["utilisation"] is not None]
    done.sort(key=lambda j: -j["check"]["utilisation"])
    if done:
        lines += ["", f"Highest utilisations (top {min(top, len(done))}):", "",
                  "| joint | status | utilisation | governing | clause | combination |",
                  "|---|---|---|---|---|---|"]
        for j in done[:top]:
            g = j["check"]["governing"]
            lines.append(
                f"| {md(j['label'])} (`{j['id']}`) | {j['check']['status']} | "
                f"{g['utilisation']:.2f} | {md(g['name'])} | EN 1993-1-8 {md(g['clause'])} | "
                f"{md(g['combination'])} |"
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
