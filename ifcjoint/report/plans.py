"""Storey plans and frame elevations for the report: a picture of the model before the table.

Drawn as SVG text from the results alone (beam ends and column axes of the scan), so a report
rendered again from a results JSON draws the same. Every beam is a line between its two ends;
every column a square at its axis; every beam end at a column a dot in its joint's status
colour. Failing and unchecked joints carry their grid label and link to their calculation
sheet. Plans look down (x to the right, y up); an elevation looks at one frame line (beams
in one vertical plane) across, with heights upwards.
"""

from __future__ import annotations

import math
from collections import defaultdict
from html import escape

from ifcjoint.model.codes import UNCHECKED, Status
from ifcjoint.report.plots import STATUS_COLOURS

OTHER_END = "#b8c2cc"
MEMBER = "#3d4b59"
#: A frame line holds at least this many beams to get an elevation (common practice, no
#: source: a single beam is no frame).
MIN_FRAME_BEAMS = 2
#: Most elevations drawn in one report; the rest are listed by name only.
MAX_ELEVATIONS = 40


def _ends(results: dict) -> dict[str, dict[str, tuple[list[float], dict | None]]]:
    """Beam -> end -> (point, joint or None) from the joints and the other beam ends."""
    out: dict[str, dict] = defaultdict(dict)
    for j in results["joints"]:
        out[j["beam"]][j["beam_end"]] = (j["point_mm"], j)
    for o in results.get("other_beam_ends") or []:
        if o.get("point_mm"):
            out[o["beam"]].setdefault(o["beam_end"], (o["point_mm"], None))
    return out


def _storey_of(results: dict) -> dict[str, str]:
    """Beam -> storey name, from its joints and its other ends."""
    st: dict[str, str] = {}
    for o in results.get("other_beam_ends") or []:
        st.setdefault(o["beam"], o.get("storey") or "")
    for j in results["joints"]:
        st[j["beam"]] = j.get("storey") or st.get(j["beam"], "")
    return st


def _is_flagged(j: dict | None) -> bool:
    return j is not None and (j["check"]["status"] == Status.FAIL
                              or j["check"]["status"] in UNCHECKED)


def _grid_part(label: str, storey: str) -> str:
    """The grid cell of a joint label ('First floor 2/B' -> '2/B')."""
    return label[len(storey):].strip() if storey and label.startswith(storey) else label


class _Canvas:
    """An SVG in model millimetres, mapped to a page of fixed width."""

    def __init__(self, xs: list[float], ys: list[float], title: str, width_px: int = 880):
        self.x0, self.x1 = min(xs), max(xs)
        self.y0, self.y1 = min(ys), max(ys)
        span = max(self.x1 - self.x0, self.y1 - self.y0, 1000.0)
        self.m = span * 0.06
        self.r = span / 140  # mark radius
        self.font = span / 70
        self.w = self.x1 - self.x0 + 4 * self.m  # room on the right for labels
        self.h = self.y1 - self.y0 + 2 * self.m
        self.px = width_px
        self.labelled: set[str] = set()
        self.parts = [
            f'<svg xmlns="http://www.w3.org/2000/svg" class="plan" role="img" '
            f'viewBox="0 0 {self.w:.0f} {self.h:.0f}" width="{width_px}" '
            f'height="{width_px * self.h / self.w:.0f}"><title>{escape(title)}</title>']

    def xy(self, x: float, y: float) -> tuple[float, float]:
        return x - self.x0 + self.m, self.y1 - y + self.m

    def line(self, a, b, colour=MEMBER, width=1.4, dash="") -> None:
        (xa, ya), (xb, yb) = self.xy(*a), self.xy(*b)
        d = f' stroke-dasharray="{dash}"' if dash else ""
        self.parts.append(f'<line x1="{xa:.0f}" y1="{ya:.0f}" x2="{xb:.0f}" y2="{yb:.0f}" '
                          f'stroke="{colour}" stroke-width="{width}" '
                          f'vector-effect="non-scaling-stroke"{d}/>')

    def square(self, p, colour=MEMBER) -> None:
        x, y = self.xy(*p)
        s = self.r * 1.6
        self.parts.append(f'<rect x="{x - s / 2:.0f}" y="{y - s / 2:.0f}" width="{s:.0f}" '
                          f'height="{s:.0f}" fill="{colour}"/>')

    def mark(self, p, j: dict | None, text: str) -> None:
        x, y = self.xy(*p)
        if j is None:
            self.parts.append(f'<circle cx="{x:.0f}" cy="{y:.0f}" r="{self.r * 0.6:.0f}" '
                              f'fill="{OTHER_END}"/>')
            return
        st = j["check"]["status"]
        colour = STATUS_COLOURS.get(Status(st), OTHER_END)
        tip = f"{j['label']} ({j['id']}): {st.replace('_', ' ')}"
        label = ""
        if _is_flagged(j) and text not in self.labelled:  # one label per place
            self.labelled.add(text)
            label = (f'<text x="{x + self.r * 1.3:.0f}" y="{y - self.r * 1.3:.0f}" '
                     f'font-size="{self.font:.0f}" fill="{colour}">{escape(text)}</text>')
        self.parts.append(
            f'<a href="#sheet-{escape(j["id"])}"><title>{escape(tip)}</title>'
            f'<circle cx="{x:.0f}" cy="{y:.0f}" r="{self.r:.0f}" fill="{colour}" '
            f'stroke="#fff" stroke-width="1" vector-effect="non-scaling-stroke"/>{label}</a>')

    def svg(self) -> str:
        return "".join(self.parts) + "</svg>"


def storey_plans(results: dict) -> list[tuple[str, str]]:
    """(storey, SVG) for every storey with beams, lowest first."""
    ends = _ends(results)
    storey = _storey_of(results)
    by_storey: dict[str, list[str]] = defaultdict(list)
    for beam in ends:
        by_storey[storey.get(beam, "")].append(beam)
    cols: dict[str, dict[str, list[float]]] = defaultdict(dict)
    for j in results["joints"]:
        if j.get("column_axis_mm"):
            cols[j.get("storey") or ""][j["column"]] = j["column_axis_mm"]
    out = []
    for name, beams in by_storey.items():
        pts = [p for b in beams for p, _ in ends[b].values()]
        zs = [p[2] for p in pts]
        col_pts = list(cols[name].values())
        xs = [p[0] for p in pts] + [c[0] for c in col_pts]
        ys = [p[1] for p in pts] + [c[1] for c in col_pts]
        cv = _Canvas(xs, ys, f"Plan of {name or 'beams without a storey'}")
        for b in beams:
            e = ends[b]
            if "start" in e and "end" in e:
                cv.line(e["start"][0][:2], e["end"][0][:2])
        for c in col_pts:
            cv.square(c)
        for b in beams:
            for p, j in ends[b].values():
                cv.mark(p[:2], j, _grid_part(j["label"], name) if j else "")
        out.append((sum(zs) / len(zs), name, cv.svg()))
    return [(name, svg) for _, name, svg in sorted(out, key=lambda t: (t[0], t[1]))]


def _frame_key(a, b) -> tuple[str, float, float] | None:
    """A beam's vertical plane: direction family and offset (100 mm bins), or None."""
    dx, dy = b[0] - a[0], b[1] - a[1]
    n = math.hypot(dx, dy)
    if n < 1.0:
        return None
    ux, uy = dx / n, dy / n
    if ux < -1e-9 or (abs(ux) <= 1e-9 and uy < 0):
        ux, uy = -ux, -uy
    ang = round(math.degrees(math.atan2(uy, ux)) / 2.0) * 2.0  # 2 degree bins
    off = -uy * a[0] + ux * a[1]  # signed distance of the plane from the origin
    return (f"{ang:g}", round(off / 100.0) * 100.0, ang)


def frame_elevations(results: dict) -> tuple[list[tuple[str, str]], int]:
    """(name, SVG) of every frame line with beams, and how many lines were left undrawn."""
    ends = _ends(results)
    frames: dict[tuple, list[str]] = defaultdict(list)
    for beam, e in ends.items():
        if "start" in e and "end" in e:
            k = _frame_key(e["start"][0], e["end"][0])
            if k is not None:
                frames[k[:2]].append(beam)
    lines = sorted(((k, bs) for k, bs in frames.items() if len(bs) >= MIN_FRAME_BEAMS),
                   key=lambda kb: (float(kb[0][0]), kb[0][1]))
    out = []
    for (ang, off), beams in lines[:MAX_ELEVATIONS]:
        a = math.radians(float(ang))
        ux, uy = math.cos(a), math.sin(a)

        def along(p, ux=ux, uy=uy):
            return (p[0] * ux + p[1] * uy, p[2])

        pts = [along(p) for b in beams for p, _ in ends[b].values()]
        cols: dict[str, list[tuple[float, float]]] = defaultdict(list)
        for b in beams:
            for _, j in ends[b].values():
                if j is not None and j.get("column_axis_mm"):
                    cx, cy = j["column_axis_mm"]
                    cols[j["column"]].append((cx * ux + cy * uy, j["point_mm"][2]))
        zs = [p[1] for p in pts]
        floor = min(zs) - (max(zs) - min(zs)) * 0.25 - 500.0
        name = _frame_name(results, beams, ends, ang, off)
        cv = _Canvas([p[0] for p in pts], [*zs, floor], f"Elevation of {name}")
        for cpts in cols.values():
            s = sum(x for x, _ in cpts) / len(cpts)
            cv.line((s, floor), (s, max(z for _, z in cpts) + 300.0), width=2.2)
        for b in beams:
            e = ends[b]
            cv.line(along(e["start"][0]), along(e["end"][0]))
            for p, j in e.values():
                cv.mark(along(p), j, j["label"] if j else "")
        out.append((name, cv.svg()))
    return out, max(0, len(lines) - MAX_ELEVATIONS)


def _frame_name(results, beams, ends, ang, off) -> str:
    """A frame line's name: the grid letters or numbers its joints share, else its offset."""
    cells = [j["label"].rsplit(" ", 1)[-1] for b in beams for _, j in ends[b].values() if j]
    parts = [c.split("/") for c in cells if "/" in c]
    for k in (0, 1):
        vals = {p[k] for p in parts}
        if len(vals) == 1 and parts:
            return f"line {vals.pop()}"
    return f"line at {ang} degrees, {off / 1000:.1f} m from the origin"
