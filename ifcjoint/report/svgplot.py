"""Small charts written as SVG text directly from the data (no plotting library per chart).

A report of thousands of joints draws thousands of M-phi curves: a plotting library's figure
costs about 85 ms each, this text a fraction of a millisecond. The charts are ours in look:
the report's ink and palette, text as text (searchable, small).
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from html import escape

FONT = 'font-family="system-ui, sans-serif" font-size="10"'


def nice_step(span: float, ticks: int = 5) -> float:
    """A round tick step (1, 2 or 5 times a power of ten) giving about ``ticks`` ticks."""
    if span <= 0 or not math.isfinite(span):
        return 1.0
    raw = span / ticks
    p = 10 ** math.floor(math.log10(raw))
    for m in (1, 2, 5, 10):
        if raw <= m * p:
            return m * p
    return 10 * p


def _fmt(v: float) -> str:
    return f"{v:.1f}".rstrip("0").rstrip(".") if abs(v) < 10 else f"{v:,.0f}"


@dataclass
class Chart:
    """An x-y chart: plot area, axes with ticks, lines, labels and a legend on the right."""

    width: float = 560
    height: float = 290
    left: float = 56
    right: float = 190  # room for the legend
    top: float = 12
    bottom: float = 42
    x_max: float = 1.0
    y_max: float = 1.0
    ink: str = "#22313f"
    parts: list[str] = field(default_factory=list)
    legend: list[tuple[str, str, str]] = field(default_factory=list)

    def x(self, v: float) -> float:
        """Page x of a data x."""
        w = self.width - self.left - self.right
        return self.left + w * v / self.x_max

    def y(self, v: float) -> float:
        """Page y of a data y."""
        h = self.height - self.top - self.bottom
        return self.top + h * (1 - v / self.y_max)

    def line(self, xs, ys, colour: str, width: float = 1.2, dash: str = "",
             label: str = "") -> None:
        """A polyline through the points (clipped to the plot area by the caller's data)."""
        pts = " ".join(f"{self.x(a):.1f},{self.y(b):.1f}" for a, b in zip(xs, ys, strict=True))
        d = f' stroke-dasharray="{dash}"' if dash else ""
        self.parts.append(f'<polyline points="{pts}" fill="none" stroke="{colour}" '
                          f'stroke-width="{width}"{d}/>')
        if label:
            self.legend.append((label, colour, dash))

    def hline(self, v: float, colour: str, width: float = 1.0, dash: str = "",
              text: str = "", below: bool = False) -> None:
        """A horizontal line across the plot area, with a note at its left end."""
        self.line([0, self.x_max], [v, v], colour, width, dash)
        if text:
            dy = 11 if below else -3
            self.parts.append(f'<text x="{self.x(0) + 4:.1f}" y="{self.y(v) + dy:.1f}" '
                              f'fill="{colour}" {FONT}>{escape(text)}</text>')

    def svg(self, x_label: str, y_label: str, title: str = "") -> str:
        """The chart as one <svg> element."""
        ink = self.ink
        x0, x1 = self.x(0), self.x(self.x_max)
        y0, y1 = self.y(0), self.y(self.y_max)
        out = [f'<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 {self.width:.0f} '
               f'{self.height:.0f}" width="{self.width:.0f}" height="{self.height:.0f}" '
               f'role="img">']
        if title:
            out.append(f"<title>{escape(title)}</title>")
        out.append(f'<path d="M{x0:.1f},{y1:.1f}V{y0:.1f}H{x1:.1f}" fill="none" '
                   f'stroke="{ink}" stroke-width="1"/>')
        for axis, vmax in (("x", self.x_max), ("y", self.y_max)):
            step = nice_step(vmax)
            k = 0
            while k * step <= vmax * 1.0001:
                v = k * step
                if axis == "x":
                    px = self.x(v)
                    out.append(f'<line x1="{px:.1f}" y1="{y0:.1f}" x2="{px:.1f}" '
                               f'y2="{y0 + 4:.1f}" stroke="{ink}"/>')
                    out.append(f'<text x="{px:.1f}" y="{y0 + 15:.1f}" text-anchor="middle" '
                               f'fill="{ink}" {FONT}>{_fmt(v)}</text>')
                else:
                    py = self.y(v)
                    out.append(f'<line x1="{x0 - 4:.1f}" y1="{py:.1f}" x2="{x0:.1f}" '
                               f'y2="{py:.1f}" stroke="{ink}"/>')
                    out.append(f'<text x="{x0 - 6:.1f}" y="{py + 3:.1f}" text-anchor="end" '
                               f'fill="{ink}" {FONT}>{_fmt(v)}</text>')
                k += 1
        out.append(f'<text x="{(x0 + x1) / 2:.1f}" y="{self.height - 6:.1f}" '
                   f'text-anchor="middle" fill="{ink}" {FONT}>{escape(x_label)}</text>')
        out.append(f'<text transform="translate(12 {(y0 + y1) / 2:.1f}) rotate(-90)" '
                   f'text-anchor="middle" fill="{ink}" {FONT}>{escape(y_label)}</text>')
        out += self.parts
        lx = x1 + 14
        for i, (label, colour, dash) in enumerate(self.legend):
            ly = self.top + 14 + 16 * i
            d = f' stroke-dasharray="{dash}"' if dash else ""
            out.append(f'<line x1="{lx:.1f}" y1="{ly:.1f}" x2="{lx + 22:.1f}" y2="{ly:.1f}" '
                       f'stroke="{colour}" stroke-width="1.4"{d}/>')
            out.append(f'<text x="{lx + 27:.1f}" y="{ly + 3:.1f}" fill="{ink}" {FONT}>'
                       f"{escape(label)}</text>")
        out.append("</svg>")
        return "".join(out)
