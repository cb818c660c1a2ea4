"""A dimensioned drawing of a joint's end plate, as inline SVG, from the extracted geometry.

The view is the plate's face seen from the column, in mm: x across the plate (0 on the beam
web), y down from the top of the beam. The beam's flanges and web behind the plate are drawn
dashed; bolt holes at d0; dimension lines for the gauge, the pitches, the side edge distance and
the end distances. A dimension a detailing finding is about is drawn in the alert colour and
tagged with the finding's code. Every text is escaped.
"""

from __future__ import annotations

from html import escape

from ifcjoint.model.codes import FindingCode

PLATE = "#e9eef2"
EDGE = "#22313f"
BEAM = "#8a9aa9"
HOLE = "#ffffff"
DIM = "#1f6f8b"
ALERT = "#c8553d"

#: Finding code -> the dimensions it is about.
FINDING_DIMENSIONS = {
    FindingCode.EDGE_DISTANCE_MIN: ("edge",),
    FindingCode.END_DISTANCE_MIN: ("end_top", "end_bottom"),
    FindingCode.PITCH_MIN: ("pitch",),
    FindingCode.PITCH_MAX: ("pitch",),
    FindingCode.SPACING_MIN: ("pitch", "gauge"),
    FindingCode.HOLE_ON_ROOT_RADIUS: ("gauge",),
    FindingCode.COLUMN_EDGE_DISTANCE_MIN: ("gauge",),
    FindingCode.NO_SPANNER_ROOM: ("gauge",),
    FindingCode.PLATE_WIDER_THAN_COLUMN_FLANGE: ("width",),
    FindingCode.BOLT_PATTERN_ASYMMETRIC: ("gauge",),
    FindingCode.BOLT_OUTSIDE_OUTLINE: ("edge", "end_top", "end_bottom"),
}


def _line(x1, y1, x2, y2, colour, dash="", width=1.0) -> str:
    d = f' stroke-dasharray="{dash}"' if dash else ""
    return (
        f'<line x1="{x1:.1f}" y1="{y1:.1f}" x2="{x2:.1f}" y2="{y2:.1f}" stroke="{colour}" '
        f'stroke-width="{width}" vector-effect="non-scaling-stroke"{d}/>'
    )


def _text(x, y, s, colour, size, anchor="middle", rotate=False) -> str:
    rot = f' transform="rotate(-90 {x:.1f} {y:.1f})"' if rotate else ""
    return (
        f'<text x="{x:.1f}" y="{y:.1f}" fill="{colour}" font-size="{size:.1f}" '
        f'text-anchor="{anchor}" font-family="sans-serif"{rot}>{escape(s)}</text>'
    )


def _dim(x1, y1, x2, y2, label, colour, size, vertical) -> list[str]:
    """A dimension line with end ticks and its value."""
    t = size * 0.35
    out = [_line(x1, y1, x2, y2, colour)]
    if vertical:
        out += [_line(x1 - t, y1, x1 + t, y1, colour), _line(x2 - t, y2, x2 + t, y2, colour)]
        out.append(_text(x1 - t * 1.4, (y1 + y2) / 2, label, colour, size, "middle", True))
    else:
        out += [_line(x1, y1 - t, x1, y1 + t, colour), _line(x2, y2 - t, x2, y2 + t, colour)]
        out.append(_text((x1 + x2) / 2, y1 - t * 1.3, label, colour, size))
    return out


def _fin_plate_as_seen(pl: dict, bo: dict | None) -> tuple[dict, dict | None]:
    """A fin plate seen from the side of the beam, centred on the plate.

    Its length along the beam runs across the page; the bolts sit at their positions along it.
    """
    lo, hi = pl.get("along_min"), pl.get("along_max")
    if lo is None or hi is None:
        return pl, bo
    mid = (lo + hi) / 2
    rows = [{**r, "lateral": [x - mid for x in r.get("along") or []]}
            for r in (bo or {}).get("rows") or []]
    return {**pl, "bp": hi - lo}, ({**bo, "rows": rows} if bo else None)


def plate_svg(joint: dict) -> str | None:
    """The main plate of one joint (scan JSON joint with its ``anatomy``), or None if none.

    An end plate is seen from the column (the beam's section dashed behind it); a fin plate
    from the side of the beam (its length along the beam across, the beam's flanges dashed).
    """
    a = joint.get("anatomy") or {}
    pl, bo, sec = a.get("plate"), a.get("bolts"), a.get("beam_section")
    if not pl or not sec or not pl.get("bp") or not pl.get("hp"):
        return None
    fin = pl.get("role") == "fin_plate"
    if fin:
        pl, bo = _fin_plate_as_seen(pl, bo)
    bp, hp, top = pl["bp"], pl["hp"], pl.get("projection_top") or 0.0
    h, b, tw, tf = sec["h"], sec["b"], sec["tw"], sec["tf"]
    if fin:  # seen from the side the beam is as wide as the page shows, its web hidden
        b, tw = bp * 1.6, 0.0
    flagged: dict[str, list[str]] = {}
    for f in joint.get("findings") or []:
        for key in FINDING_DIMENSIONS.get(f.get("code"), ()):
            flagged.setdefault(key, []).append(f["code"])

    size = max(bp, hp) / 28
    margin = size * 7
    x0, y0 = -bp / 2 - margin, -top - margin
    width, height = bp + 2 * margin + size * 10, hp + 2 * margin
    parts = [
        f'<svg xmlns="http://www.w3.org/2000/svg" class="plate" role="img" '
        f'viewBox="{x0:.1f} {y0:.1f} {width:.1f} {height:.1f}" width="360" '
        f'height="{360 * height / width:.0f}">',
        f"<title>{'Fin' if fin else 'End'} plate {escape(str(pl.get('guid', '')))}: "
        f"{bp:.0f} x {hp:.0f} x "
        f"{pl.get('tp', 0):.0f} mm</title>",
        f'<rect x="{-bp / 2:.1f}" y="{-top:.1f}" width="{bp:.1f}" height="{hp:.1f}" '
        f'fill="{PLATE}" stroke="{EDGE}" stroke-width="1.6" vector-effect="non-scaling-stroke"/>',
    ]
    # the beam behind the plate, dashed
    for yy in (0.0, h - tf):
        parts.append(
            f'<rect x="{-b / 2:.1f}" y="{yy:.1f}" width="{b:.1f}" height="{tf:.1f}" fill="none" '
            f'stroke="{BEAM}" stroke-dasharray="4 3" vector-effect="non-scaling-stroke"/>'
        )
    if tw > 0:
        parts.append(
            f'<rect x="{-tw / 2:.1f}" y="{tf:.1f}" width="{tw:.1f}" '
            f'height="{h - 2 * tf:.1f}" fill="none" stroke="{BEAM}" stroke-dasharray="4 3" '
            'vector-effect="non-scaling-stroke"/>'
        )
    rows = (bo or {}).get("rows") or []
    d0 = (bo or {}).get("d0") or pl.get("hole_d") or 0.0
    for r in rows:
        for x in r.get("lateral") or []:
            parts.append(
                f'<circle cx="{x:.1f}" cy="{r["from_beam_top"]:.1f}" r="{max(d0, 1) / 2:.1f}" '
                f'fill="{HOLE}" stroke="{EDGE}" vector-effect="non-scaling-stroke"/>'
            )
    parts += _plate_dimensions(rows, bp, hp, top, size, flagged)
    parts.append(_text(0, -top - size * 4.2, f"t_p = {pl.get('tp', 0):.0f} mm, d0 = {d0:.0f} mm",
                       EDGE, size))
    parts.append("</svg>")
    return "".join(parts)


def _plate_dimensions(rows: list, bp: float, hp: float, top: float, size: float,
                      flagged: dict[str, list[str]]) -> list[str]:
    """The plate's dimension lines: width, gauge, edge, pitches and end distances.

    A dimension a finding concerns is drawn in the alert colour with the finding's code.
    """

    def colour(key):
        return ALERT if key in flagged else DIM

    def label(key, value):
        tag = f" ! {', '.join(flagged[key])}" if key in flagged else ""
        return f"{value:.0f}{tag}"

    parts: list[str] = []
    bottom = -top + hp
    parts += _dim(-bp / 2, bottom + size * 4.5, bp / 2, bottom + size * 4.5,
                  label("width", bp), colour("width"), size, False)
    if rows and len(rows[0].get("lateral") or []) >= 2:
        xs = sorted(rows[0]["lateral"])
        yd = -top - size * 1.5
        parts += _dim(xs[0], yd, xs[-1], yd, label("gauge", xs[-1] - xs[0]), colour("gauge"),
                      size, False)
        e = min(xs[0] + bp / 2, bp / 2 - xs[-1])
        yd2 = bottom + size * 1.8
        parts += _dim(-bp / 2, yd2, xs[0], yd2, label("edge", e), colour("edge"), size, False)
    if rows:
        ys = [r["from_beam_top"] for r in rows]
        xr = bp / 2 + size * 2.5
        pitches = [b_ - a_ for a_, b_ in zip(ys, ys[1:], strict=False)]
        worst = None
        if pitches and "pitch" in flagged:
            codes = flagged["pitch"]
            widest = FindingCode.PITCH_MAX in codes
            worst = pitches.index(max(pitches) if widest else min(pitches))
        for i, (ya, yb) in enumerate(zip(ys, ys[1:], strict=False)):
            key = "pitch" if worst == i else "_pitch"
            parts += _dim(xr + size * 2, ya, xr + size * 2, yb, label(key, yb - ya),
                          colour(key), size, True)
        xl = -bp / 2 - size * 2.5
        parts += _dim(xl, -top, xl, ys[0], label("end_top", ys[0] + top), colour("end_top"),
                      size, True)
        parts += _dim(xl, ys[-1], xl, bottom, label("end_bottom", bottom - ys[-1]),
                      colour("end_bottom"), size, True)
    return parts
