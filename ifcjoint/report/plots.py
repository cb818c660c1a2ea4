"""Plots for the report, rendered by matplotlib to inline SVG text (no files, no network).

Every plot reads the results dict (docs/results.md); none recomputes a resistance.
"""

from __future__ import annotations

import io

import matplotlib

matplotlib.use("Agg")
import matplotlib.pyplot as plt

from ifcjoint.model.codes import Status

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

plt.rcParams.update(
    {
        "svg.fonttype": "none",  # text stays text: small files, searchable
        "svg.hashsalt": "ifcjoint",  # stable ids: the same input gives the same file
        "font.size": 8,
        "axes.edgecolor": INK,
        "axes.labelcolor": INK,
        "xtick.color": INK,
        "ytick.color": INK,
    }
)


def _svg(fig) -> str:
    buf = io.StringIO()
    fig.savefig(buf, format="svg", metadata={"Date": None})
    plt.close(fig)
    text = buf.getvalue()
    return text[text.index("<svg") :]  # drop the XML prolog: the SVG is inlined in HTML


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
    fig, ax = plt.subplots(figsize=(5.6, 2.9))
    fig.subplots_adjust(left=0.11, right=0.66, bottom=0.16, top=0.95)
    ax.plot(phi, m, color=CURVE, lw=1.8, label="design curve (hogging)")
    mj = res.get("Mj_Rd_hogging_kNm")
    sj = res.get("Sj_ini_kNm_per_rad")
    xmax = max(phi) * 1.25
    ax.axhline(mj, color=CURVE, ls=":", lw=1)
    ax.annotate(f"Mj,Rd = {mj:.0f} kNm", (xmax * 0.02, mj), va="bottom", color=CURVE)
    if sj:
        ax.plot([0, mj / sj * 1000], [0, mj], color=CURVE, lw=0.8, ls="--",
                label=f"Sj,ini = {sj:,.0f} kNm/rad")
    cls = check.get("classification") or {}
    for key, label, style in (("rigid_from_kNm_per_rad", "rigid boundary", "-."),
                              ("pinned_up_to_kNm_per_rad", "pinned boundary", ":")):
        s = cls.get(key)
        if s:
            x_end = min(xmax, mj * 1.15 / s * 1000)
            ax.plot([0, x_end], [0, s * x_end / 1000], color=BOUND, lw=1.0, ls=style,
                    label=label)
    g = check.get("governing") or {}
    demand = _design_moment(check, g.get("combination"))
    if demand is not None:
        ax.axhline(abs(demand), color=DEMAND, lw=1.2)
        ax.annotate(f"|M_Ed| = {abs(demand):.0f} kNm ({g.get('combination')})",
                    (xmax * 0.02, abs(demand)), va="top", color=DEMAND)
    ax.set_xlim(0, xmax)
    ax.set_ylim(0, max(mj, abs(demand or 0)) * 1.2)
    ax.set_xlabel("rotation phi (mrad)")
    ax.set_ylabel("moment M (kNm)")
    ax.legend(loc="center left", bbox_to_anchor=(1.02, 0.5), fontsize=7, frameon=False)
    ax.spines[["top", "right"]].set_visible(False)
    return _svg(fig)


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
    fig, ax = plt.subplots(figsize=(5.0, 2.4))
    fig.subplots_adjust(left=0.1, right=0.98, bottom=0.2, top=0.95)
    edges = [i / 10 for i in range(0, 21)]
    top = max(2.0, max(u) + 0.1)
    edges[-1] = top
    ok = [x for x in u if x <= 1.0]
    bad = [x for x in u if x > 1.0]
    colours = [STATUS_COLOURS[Status.PASS], STATUS_COLOURS[Status.FAIL]]
    ax.hist([ok, bad], bins=edges, stacked=True, color=colours, label=["pass", "fail"])
    ax.axvline(1.0, color=INK, lw=1)
    ax.set_xlabel("highest utilisation per joint")
    ax.set_ylabel("joints")
    ax.legend(frameon=False, fontsize=7)
    ax.spines[["top", "right"]].set_visible(False)
    return _svg(fig)
