"""The HTML report: one self-contained file people read.

It renders the results dictionary (``report.results.build_results``, docs/results.md), the
same object the JSON, BCF and property sets come from, so ``ifcjoint report results.json``
gives the same page as ``ifcjoint check --html``. Templates are jinja2 with autoescaping:
every string taken from the model is escaped. No network: no CDN, fonts or scripts from
elsewhere.
"""

from __future__ import annotations

import base64
import gzip
from collections import Counter

from jinja2 import Environment, PackageLoader, select_autoescape
from markupsafe import Markup

from ifcjoint.ec3.code import EN_1993_1_8
from ifcjoint.engine.settings import DESIGN_CODES, design_code
from ifcjoint.fileio import atomic_write_text
from ifcjoint.model.codes import UNCHECKED, Status
from ifcjoint.report.coverage import CATEGORIES
from ifcjoint.report.drawing import plate_svg
from ifcjoint.report.parts import parts_rows
from ifcjoint.report.plans import frame_elevations, storey_plans
from ifcjoint.report.plots import STATUS_COLOURS, m_phi_svg, utilisation_histogram_svg
from ifcjoint.report.results import unchecked_groups
from ifcjoint.report.sheet import component_rows, fmt
from ifcjoint.report.words import STATUS_WORDS

#: From this many joints on, calculation sheets are built in the page only when opened.
LAZY_FROM = 300

def _env() -> Environment:
    env = Environment(
        loader=PackageLoader("ifcjoint", "templates"),
        autoescape=select_autoescape(default=True, default_for_string=True),
        trim_blocks=True,
        lstrip_blocks=True,
    )
    env.filters["num"] = _num
    env.filters["mm"] = _mm
    return env


def _num(v, digits: int = 1) -> str:
    return fmt(v, digits)


def _mm(v) -> str:
    """A dimension as drawings give it: to 0.1 mm, without a trailing .0 (common practice)."""
    text = fmt(v, 1)
    return text[:-2] if text.endswith(".0") else text


def _m_phi_all(checks: list[dict], progress=None) -> list[str | None]:
    """Every joint's M-phi plot (SVG text written directly: well under a millisecond each)."""
    n = len(checks)
    out: list[str | None] = []
    for k, c in enumerate(checks, start=1):
        out.append(m_phi_svg(c))
        if progress and (k % 500 == 0 or k == n):
            progress("report", k, n)
    return out


def _code_of(results: dict):
    """The run's design code (results JSON of schema 1.0 have none: EN 1993-1-8)."""
    name = results.get("check", {}).get("design_code")
    return design_code(name) if name in DESIGN_CODES else EN_1993_1_8


def _sheet(j: dict, svg_mphi: str | None, code) -> dict:
    """What one joint's section of the report shows (no numbers made here)."""
    c = j["check"]
    svg_plate = plate_svg(j)
    return {
        "chunk": None,
        "joint": j,
        "check": c,
        "components": component_rows(c, code),
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
    code = _code_of(results)
    sheets = [_sheet(j, svg, code) for j, svg in zip(joints, plots, strict=True)]
    lazy = len(joints) > LAZY_FROM
    elevations, elevations_left = frame_elevations(results)
    chunks = _compressed_chunks(sheets, code) if lazy else []
    return {
        "r": results,
        "ck": ck,
        "design_code": code.name,
        "design_code_edition": f"{code.name}:{code.edition}",
        "counts": [(s, STATUS_WORDS[s], counts.get(s, 0), STATUS_COLOURS[s]) for s in Status],
        "unchecked": sum(counts.get(s, 0) for s in UNCHECKED),
        "unchecked_groups": unchecked_groups(results),
        "coverage": ck.get("coverage"),
        "coverage_words": CATEGORIES,
        "parts": None if lazy else parts_rows(results),
        "plans": [(name, Markup(svg)) for name, svg in storey_plans(results)],
        "elevations": [(name, Markup(svg)) for name, svg in elevations],
        "elevations_left": elevations_left,
        "archetypes": sorted(arche.items(), key=lambda kv: -kv[1]),
        "histogram": Markup(hist) if hist else None,
        "sheets": sheets,
        "chunks": chunks,
        "statuses": STATUS_WORDS,
        # Large reports carry their sheets compressed, unpacked when opened: a small page.
        "lazy": lazy,
    }


#: Sheets per compressed chunk of a large report (one chunk is unpacked per sheet opened).
CHUNK_SHEETS = 200


def _compressed_chunks(sheets: list[dict], code) -> list[tuple[int, str]]:
    """The sheets' full markup, gzip-compressed and base64-encoded, ``CHUNK_SHEETS`` a chunk.

    Each sheet keeps only its summary in the page (``chunk`` set): a 10,000-joint report is a
    few megabytes instead of a hundred, and a sheet costs nothing until it is opened.
    """
    tpl = _env().get_template("_sheet.html.j2")
    out = []
    for k in range(0, len(sheets), CHUNK_SHEETS):
        html = "".join(
            tpl.render(s=s, j=s["joint"], c=s["check"], design_code=code.name,
                       open_sheets=False)
            for s in sheets[k:k + CHUNK_SHEETS]
        )
        data = gzip.compress(html.encode("utf-8"), compresslevel=6, mtime=0)
        out.append((k // CHUNK_SHEETS, base64.b64encode(data).decode("ascii")))
        for s in sheets[k:k + CHUNK_SHEETS]:
            s["chunk"] = k // CHUNK_SHEETS
    return out


def render_html(results: dict, progress=None) -> str:
    """The self-contained HTML report (``progress(stage, done, total)`` while plotting)."""
    return _env().get_template("report.html.j2").render(**report_context(results, progress))


def write_html(results: dict, path, *, progress=None) -> dict[str, int]:
    """Write the HTML report atomically; returns its size in bytes."""
    html = render_html(results, progress)
    atomic_write_text(path, html)
    return {"bytes": len(html.encode("utf-8"))}


def render_calc_html(results: dict) -> str:
    """The one-joint page of ``ifcjoint calc --html`` (the sheet open, nothing fetched)."""
    code = _code_of(results)
    joints = results["joints"]
    plots = [m_phi_svg(j["check"]) if j["check"].get("engine_status") == "checked" else None
             for j in joints]
    return _env().get_template("calc.html.j2").render(
        r=results,
        ck=results["check"],
        design_code=code.name,
        design_code_edition=f"{code.name}:{code.edition}",
        sheets=[_sheet(j, svg, code) for j, svg in zip(joints, plots, strict=True)],
        lazy=False,
        open_sheets=True,
    )


def write_calc_html(results: dict, path) -> dict[str, int]:
    """Write the one-joint page atomically; returns its size in bytes."""
    html = render_calc_html(results)
    atomic_write_text(path, html)
    return {"bytes": len(html.encode("utf-8"))}
