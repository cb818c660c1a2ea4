"""Plots for the report, written as inline SVG text (``svgplot``; no files, no network).

Every plot reads the results dict (docs/results.md); none recomputes a resistance.
"""

from __future__ import annotations

from ifcjoint.model.codes import Status
from ifcjoint.report.svgplot import Chart, nice_step

#: Our own palette (see DEVELOPERS.md on originality).
INK = "#22313f"
CURVE = "#1f6f8b"
DEMAND = "#c8553d"
BOUND = "#8a9aa9"
STATUS_COLOURS = {
    Status.PASS: "#2a9d8f",
    Status.FAIL: "#c8553d",
    Status.NO_DEMANDS: "#8a9aa9",
    Status.INCOMPLETE: "#d4a017",
    Status.UNSUPPORTED: "#6c7a89",
    Status.UNREADABLE: "#7b4f9d",
}

def m_phi_svg(check: dict) -> str | None:
    """M-phi curve (EN 1993-1-8 6.3.1(4)) with Mj,Rd, Sj,ini and the class boundaries.

    The boundaries are the rigid and pinned lines of 5.2.2.5 for the beam (kb E Ib / Lb and
    0.5 E Ib / Lb), drawn as straight lines from the origin; the design moment of the governing
    combination is marked.
    """
    mp = (check.get("m_phi") or {}).get("hogging") or []
    res = check.get("resistance") or {}
    if len(mp) < 2 or not res:
        return None
    phi = [p[0] * 1000 for p in mp]  # mrad
    m = [p[1] for p in mp]
    mj = res.get("Mj_Rd_hogging_kNm")
    sj = res.get("Sj_ini_kNm_per_rad")
    g = check.get("governing") or {}
    demand = _design_moment(check, g.get("combination"))
    xmax = max(phi) * 1.25
    ymax = max(mj, abs(demand or 0)) * 1.2
    ch = Chart(x_max=xmax, y_max=ymax)
    ch.line(phi, m, CURVE, 1.8, label="design curve (hogging)")
    ch.hline(mj, CURVE, 1.0, "2 3", f"Mj,Rd = {mj:.0f} kNm")
    if sj:
        x_end = min(xmax, mj / sj * 1000)
        ch.line([0, x_end], [0, sj * x_end / 1000], CURVE, 0.8, "5 3",
                label=f"Sj,ini = {sj:,.0f} kNm/rad")
    cls = check.get("classification") or {}
    for key, label, dash in (("rigid_from_kNm_per_rad", "rigid boundary", "7 3 2 3"),
                             ("pinned_up_to_kNm_per_rad", "pinned boundary", "2 3")):
        s = cls.get(key)
        if s:
            x_end = min(xmax, ymax / s * 1000, mj * 1.15 / s * 1000)
            ch.line([0, x_end], [0, s * x_end / 1000], BOUND, 1.0, dash, label=label)
    if demand is not None:
        ch.hline(abs(demand), DEMAND, 1.2, "",
                 f"|M_Ed| = {abs(demand):.0f} kNm ({g.get('combination')})", below=True)
    return ch.svg("rotation phi (mrad)", "moment M (kNm)",
                  title="M-phi of the joint: design curve, Sj,ini, class boundaries")


def _design_moment(check: dict, combination: str | None) -> float | None:
    for d in check.get("demands") or []:
        if d.get("combination") == combination:
            return d.get("M_Ed_kNm")
    return None


def utilisation_histogram_svg(joints: list[dict]) -> str | None:
    """Histogram of the highest utilisation of every checked joint, by status colour."""
    u = [j["check"]["utilisation"] for j in joints if j["check"]["utilisation"] is not None]
    if not u:
        return None
    top = 2.2  # the last bin holds every utilisation of 2 and more
    edges = [i / 10 for i in range(0, 21)] + [top]
    ok = [0] * (len(edges) - 1)
    bad = [0] * (len(edges) - 1)
    for x in u:
        k = min(max(next((i for i in range(len(edges) - 1) if x < edges[i + 1]),
                         len(edges) - 2), 0), len(edges) - 2)
        (ok if x <= 1.0 else bad)[k] += 1
    peak = max(a + b for a, b in zip(ok, bad, strict=True))
    ch = Chart(width=500, height=240, right=80, x_max=top,
               y_max=peak + max(1, nice_step(peak) / 2))
    colours = (STATUS_COLOURS[Status.PASS], STATUS_COLOURS[Status.FAIL])
    for i in range(len(edges) - 1):
        base = 0
        for n, colour in zip((ok[i], bad[i]), colours, strict=True):
            if n:
                x0, x1 = ch.x(edges[i]) + 0.5, ch.x(edges[i + 1]) - 0.5
                y0, y1 = ch.y(base + n), ch.y(base)
                ch.parts.append(f'<rect x="{x0:.1f}" y="{y0:.1f}" width="{x1 - x0:.1f}" '
                                f'height="{y1 - y0:.1f}" fill="{colour}"/>')
                base += n
    ch.line([1.0, 1.0], [0, ch.y_max], INK, 1.0)
    ch.legend += [("pass", colours[0], ""), ("fail", colours[1], ""),
                  ("(last bin: 2 and more)", INK, "1 0")]
    return ch.svg("highest utilisation per joint", "joints",
                  title="Highest utilisation per checked joint")
