"""Command line: thin click commands that parse, call the library and render.

Exit codes (also in the README and ``ifcjoint --help``):
    0  done; for ``check``: the gate passed (see --fail-on)
    1  ``check`` only: the gate failed (failing joints, or unchecked ones, per --fail-on)
    2  usage error (bad option or value, or an output that cannot be written)
    3  model unusable: missing, not IFC, truncated, unsupported schema, no length unit;
       or a rules, parameters or demands file that cannot be used at all
    4  model read, but it holds no steel beams or columns to scan (outputs still written)
    5  internal error (a bug: please report it with the model if you can)
"""

from __future__ import annotations

import sys
import traceback
from pathlib import Path

import click

from ifcjoint import __version__
from ifcjoint.engine.finder import FinderSettings
from ifcjoint.errors import ConfigError, ModelError
from ifcjoint.ifc.reader import LENGTH_UNITS

EXIT_OK, EXIT_GATE, EXIT_USAGE, EXIT_MODEL, EXIT_NO_STEEL, EXIT_INTERNAL = 0, 1, 2, 3, 4, 5

STAGE_NAMES = {
    "read": "reading elements",
    "tessellate": "tessellating bodies",
    "joints": "finding joints",
    "check": "checking joints",
    "report": "plotting M-phi curves",
}


class _Bar:
    """Progress on stderr, only when stderr is a terminal."""

    def __init__(self, enabled: bool) -> None:
        self.enabled = enabled
        self.stage = None
        self.bar = None
        self.done = 0

    def __call__(self, stage: str, done: int, total: int) -> None:
        if not self.enabled or total <= 0:
            return
        if stage != self.stage:
            self.close()
            self.stage = stage
            self.done = 0
            self.bar = click.progressbar(
                length=total, label=STAGE_NAMES.get(stage, stage), file=sys.stderr
            )
            self.bar.__enter__()
        if self.bar is not None and done > self.done:
            self.bar.update(done - self.done)
            self.done = done

    def close(self) -> None:
        if self.bar is not None:
            self.bar.__exit__(None, None, None)
            self.bar = None


def _fail(code: int, msg: str) -> None:
    click.echo(f"ifcjoint: error: {msg}", err=True)
    sys.exit(code)


@click.group(
    context_settings={"help_option_names": ["-h", "--help"]},
    epilog="Exit codes: 0 done (check: gate passed), 1 check gate failed, 2 usage error, "
    "3 model or input file unusable, 4 no steel members, 5 internal error.",
)
@click.version_option(__version__, prog_name="ifcjoint")
def main() -> None:
    """Scan IFC steel models for beam-to-column joints and check them."""


def _model_options(func):
    """Options every command that reads a model shares."""
    for opt in reversed(
        [
            click.option(
                "--tolerance",
                type=click.FloatRange(min=0, max=500),
                default=20.0,
                show_default=True,
                help="How far (mm) a beam end may miss a column and still count.",
            ),
            click.option(
                "--length-unit",
                type=click.Choice(sorted(LENGTH_UNITS)),
                default=None,
                help="Length unit to assume ONLY when the model declares none.",
            ),
            click.option(
                "--rules",
                "rules_file",
                type=click.Path(exists=True, dir_okay=False),
                help="Extra element recognition rules (TOML, like ifcjoint/data/recognition.toml).",
            ),
            click.option(
                "--assume-grade",
                type=click.Choice(["S235", "S275", "S355", "S420", "S460"]),
                default=None,
                help="Steel grade to use where the model gives none (reported as assumed).",
            ),
            click.option(
                "--assume-bolt-class",
                type=click.Choice(["4.6", "4.8", "5.6", "5.8", "6.8", "8.8", "10.9"]),
                default=None,
                help="Bolt property class to use where the model gives none (reported).",
            ),
            click.option(
                "--quiet",
                "-q",
                is_flag=True,
                help="Print nothing on stdout (outputs still written).",
            ),
            click.option("--debug", is_flag=True, help="Show a traceback on internal errors."),
        ]
    ):
        func = opt(func)
    return func


def _run_scan(model, bar, debug, **kw):
    """Scan with the shared error handling: exit 3 for unusable input, 5 for a bug."""
    from ifcjoint.engine.anatomy import AnatomySettings
    from ifcjoint.scanner import scan as run_scan

    try:
        return run_scan(
            model,
            settings=FinderSettings(tolerance=kw["tolerance"]),
            assume_length_unit=kw["length_unit"],
            rules_file=kw["rules_file"],
            progress=bar,
            anatomy=AnatomySettings(
                assume_steel_grade=kw["assume_grade"], assume_bolt_class=kw["assume_bolt_class"]
            ),
        )
    except (ModelError, ConfigError) as exc:
        bar.close()
        _fail(EXIT_MODEL, str(exc))
    except Exception as exc:  # noqa: BLE001 - last resort: a clear message, not a traceback
        bar.close()
        if debug:
            traceback.print_exc()
        _fail(
            EXIT_INTERNAL,
            f"{model}: internal error while scanning ({type(exc).__name__}: "
            f"{exc}); rerun with --debug and please report it",
        )
    finally:
        bar.close()


def _no_steel_exit(result, model) -> None:
    candidates = [
        m for m in result.model.members if m.kind in ("beam", "column") and m.steel != "non_steel"
    ]
    if not candidates:
        c = result.model.counts
        _fail(
            EXIT_NO_STEEL,
            f"{model}: no steel beams or columns found to scan "
            f"({c.get('beams', 0)} beams, {c.get('columns', 0)} columns read, "
            f"{c.get('non_steel_members', 0)} of them not steel)",
        )


@main.command()
@click.argument("model", type=click.Path(dir_okay=False, path_type=str))
@click.option(
    "--json",
    "json_out",
    type=click.Path(dir_okay=False, writable=True),
    help="Write the scan as JSON (schema in docs/scan-json.md).",
)
@click.option(
    "--csv",
    "csv_out",
    type=click.Path(dir_okay=False, writable=True),
    help="Write one CSV row per joint.",
)
@click.option("--brief", is_flag=True, help="Counts only; do not list every joint and beam end.")
@_model_options
def scan(model, json_out, csv_out, brief, quiet, debug, **kw):
    """Find every beam-to-column joint in MODEL (.ifc or .ifczip) and account for every beam end."""
    from ifcjoint.outputs.scan import write_scan_csv, write_scan_json, write_scan_summary

    bar = _Bar(sys.stderr.isatty() and not quiet)
    result = _run_scan(model, bar, debug, **kw)
    try:
        if json_out:
            write_scan_json(result, json_out)
        if csv_out:
            write_scan_csv(result, csv_out)
    except OSError as exc:
        _fail(EXIT_USAGE, f"cannot write output: {exc}")
    if not quiet:
        write_scan_summary(result, sys.stdout, brief=brief)
    _no_steel_exit(result, model)
    sys.exit(EXIT_OK)


@main.command()
@click.argument("model", type=click.Path(dir_okay=False, path_type=str))
@click.option(
    "-o",
    "--output",
    "out",
    required=True,
    type=click.Path(dir_okay=False, writable=True),
    help="Where to write the template CSV.",
)
@_model_options
def demands(model, out, quiet, debug, **kw):
    """Write a demands template for MODEL: one row per joint, ready to fill (docs/demands.md)."""
    from ifcjoint.tables.demands import write_template

    bar = _Bar(sys.stderr.isatty() and not quiet)
    result = _run_scan(model, bar, debug, **kw)
    if Path(out).exists() and not _same_kind_of_file(out):
        _fail(EXIT_USAGE, f"{out}: exists and is not a CSV; refusing to overwrite it")
    try:
        n = write_template(result.joints, out)
    except OSError as exc:
        _fail(EXIT_USAGE, f"cannot write {out}: {exc}")
    if not quiet:
        click.echo(f"{out}: {n} joints, one row each; fill in M_Ed_kNm, V_Ed_kN, combination")
    _no_steel_exit(result, model)
    sys.exit(EXIT_OK)


def _same_kind_of_file(path) -> bool:
    return str(path).lower().endswith((".csv", ".txt"))


GATES = {
    "fail": "exit 1 when a joint fails",
    "unchecked": "exit 1 when a joint fails or is unchecked (default)",
    "problems": "exit 1 on any problem: also detailing errors and analysis-assumption mismatches",
    "never": "exit 0 whatever the results (report only)",
}


def gate_fails(mc, fail_on: str) -> list[str]:
    """Why the gate fails (empty: it passes)."""
    c = mc.counts()
    why = []
    if fail_on == "never":
        return why
    if c["fail"]:
        why.append(f"{c['fail']} joint(s) fail")
    if fail_on in ("unchecked", "problems"):
        n = len(mc.unchecked())
        if n:
            why.append(f"{n} joint(s) unchecked")
    if fail_on == "problems":
        n = sum(1 for _, p in mc.problems() if p.kind in ("detailing", "assumption")
                and p.severity != "minor")
        if n:
            why.append(f"{n} detailing or assumption problem(s)")
    return why


@main.command()
@click.argument("model", type=click.Path(dir_okay=False, path_type=str))
@click.option(
    "--demands",
    "demands_file",
    type=click.Path(dir_okay=False),
    help="Design forces CSV (docs/demands.md). Without it every checkable joint is unchecked.",
)
@click.option(
    "--ifc-out",
    type=click.Path(dir_okay=False),
    help="Write a copy of the model with results as property sets (.ifc or .ifczip).",
)
@click.option("--in-place", is_flag=True, help="Allow --ifc-out to be the input model itself.")
@click.option(
    "--bcf",
    "bcf_out",
    type=click.Path(dir_okay=False),
    help="Write (or update) the issue list as BCF.",
)
@click.option(
    "--bcf-version",
    type=click.Choice(["3.0", "2.1"]),
    default="3.0",
    show_default=True,
    help="BCF version to write.",
)
@click.option(
    "--issues",
    "issues_out",
    type=click.Path(dir_okay=False),
    help="The issue list as CSV (.csv) or JSON (other suffix).",
)
@click.option(
    "--json", "json_out", type=click.Path(dir_okay=False), help="Results JSON (docs/results.md)."
)
@click.option("--csv", "csv_out", type=click.Path(dir_okay=False), help="Results, a row per joint.")
@click.option(
    "--html",
    "html_out",
    type=click.Path(dir_okay=False),
    help="Self-contained HTML report: summary, joint table, calculation sheets, drawings.",
)
@click.option(
    "--md", "md_out", type=click.Path(dir_okay=False), help="Short Markdown summary (for a review)."
)
@click.option(
    "--params",
    "params_file",
    type=click.Path(exists=True, dir_okay=False),
    help="Partial factors and other parameters (TOML; recommended values otherwise).",
)
@click.option(
    "--frame",
    type=click.Choice(["braced", "unbraced"]),
    default="braced",
    show_default=True,
    help="Frame type for the stiffness classification where the demands do not say.",
)
@click.option(
    "--alpha",
    "alpha_method",
    type=click.Choice(["conservative", "approximation"]),
    default="conservative",
    show_default=True,
    help="alpha of EN 1993-1-8 Fig. 6.11: the chart's lowest value 4.45, or a representation "
    "of the chart (docs/check-engine.md).",
)
@click.option(
    "--fail-on",
    type=click.Choice(list(GATES)),
    default="unchecked",
    show_default=True,
    help="What makes the exit code 1: " + "; ".join(f"{k}: {v}" for k, v in GATES.items()),
)
@click.option("--top", type=click.IntRange(0, 1000), default=10, show_default=True,
              help="How many of the highest utilisations to list.")
@click.option(
    "--timestamp",
    type=click.DateTime(formats=["%Y-%m-%dT%H:%M:%S", "%Y-%m-%d"]),
    default=None,
    help="Date to record in the outputs (UTC) instead of now, for reproducible files.",
)
@_model_options
def check(
    model,
    demands_file,
    ifc_out,
    in_place,
    bcf_out,
    bcf_version,
    issues_out,
    json_out,
    csv_out,
    html_out,
    md_out,
    params_file,
    frame,
    alpha_method,
    fail_on,
    top,
    timestamp,
    quiet,
    debug,
    **kw,
):
    """Check every joint of MODEL against the demands; write results, property sets and BCF."""
    import datetime as dt

    from ifcjoint.checker import check_scan
    from ifcjoint.ec3.params import RECOMMENDED, Parameters
    from ifcjoint.engine.inputs import CheckSettings
    from ifcjoint.errors import DemandsError
    from ifcjoint.tables.demands import read_demands

    try:
        params = Parameters.from_toml(params_file) if params_file else RECOMMENDED
    except (ValueError, OSError) as exc:
        _fail(EXIT_MODEL, f"parameters: {exc}")
    if ifc_out and not in_place and Path(ifc_out).resolve() == Path(model).resolve():
        _fail(EXIT_USAGE, f"--ifc-out {ifc_out} is the input model; use another path or --in-place")
    bar = _Bar(sys.stderr.isatty() and not quiet)
    result = _run_scan(model, bar, debug, **kw)
    table = None
    if demands_file:
        try:
            table = read_demands(demands_file, result.joints)
        except DemandsError as exc:
            _fail(EXIT_MODEL, str(exc))
    when = (
        timestamp.replace(tzinfo=dt.UTC)
        if timestamp
        else dt.datetime.now(dt.UTC).replace(microsecond=0)
    )
    settings = CheckSettings(params=params, braced=frame == "braced", alpha_method=alpha_method)
    try:
        mc = check_scan(result, table, settings, created=when, progress=bar)
    except Exception as exc:  # noqa: BLE001 - last resort: a clear message, not a traceback
        bar.close()
        if debug:
            traceback.print_exc()
        _fail(EXIT_INTERNAL, f"{model}: internal error while checking ({type(exc).__name__}: "
              f"{exc}); rerun with --debug and please report it")
    bar.close()
    _write_check_outputs(mc, ifc_out, in_place, bcf_out, bcf_version, issues_out, json_out,
                         csv_out, quiet)
    if html_out or md_out:
        from ifcjoint.outputs.results import results_to_dict

        _write_reports(results_to_dict(mc), html_out, md_out, quiet)
    if not quiet:
        from ifcjoint.outputs.results import write_check_summary

        write_check_summary(mc, sys.stdout, top=top)
    _no_steel_exit(result, model)
    why = gate_fails(mc, fail_on)
    if why:
        click.echo(f"ifcjoint: gate ({fail_on}) failed: {'; '.join(why)}", err=True)
        sys.exit(EXIT_GATE)
    sys.exit(EXIT_OK)


def _write_reports(results: dict, html_out, md_out, quiet) -> None:  # noqa: C901
    """HTML and Markdown reports from a results dict (shared by check and report)."""
    from ifcjoint.fileio import atomic_write_text
    from ifcjoint.outputs.report import render_markdown, write_html

    try:
        if html_out:
            bar = _Bar(sys.stderr.isatty() and not quiet)
            try:
                n = write_html(results, html_out, progress=bar)
            finally:
                bar.close()
            if not quiet:
                click.echo(f"wrote {html_out} ({n / 1e6:.1f} MB)", err=True)
        if md_out:
            atomic_write_text(md_out, render_markdown(results))
            if not quiet:
                click.echo(f"wrote {md_out}", err=True)
    except OSError as exc:
        _fail(EXIT_USAGE, f"cannot write report: {exc}")


@main.command()
@click.argument("results_json", type=click.Path(dir_okay=False, path_type=str))
@click.option("--html", "html_out", type=click.Path(dir_okay=False), help="HTML report to write.")
@click.option("--md", "md_out", type=click.Path(dir_okay=False), help="Markdown summary to write.")
@click.option("--quiet", "-q", is_flag=True, help="Print nothing but errors.")
def report(results_json, html_out, md_out, quiet):
    """Render the reports again from a results JSON written by `check --json` (no re-check)."""
    import json

    if not html_out and not md_out:
        _fail(EXIT_USAGE, "nothing to write: give --html and/or --md")
    try:
        data = json.loads(Path(results_json).read_text(encoding="utf-8"))
    except OSError as exc:
        _fail(EXIT_MODEL, f"{results_json}: cannot read ({exc.strerror or exc})")
    except (UnicodeDecodeError, json.JSONDecodeError) as exc:
        _fail(EXIT_MODEL, f"{results_json}: not JSON ({exc})")
    if not isinstance(data, dict) or "results_schema_version" not in data:
        _fail(
            EXIT_MODEL,
            f"{results_json}: not a results JSON of `ifcjoint check --json` (a scan JSON has no "
            "check results; run check first)",
        )
    if data["results_schema_version"] != "1.0":
        _fail(EXIT_MODEL, f"{results_json}: results schema {data['results_schema_version']!r} "
              "is not one this version reads (1.0)")
    _write_reports(data, html_out, md_out, quiet)
    sys.exit(EXIT_OK)


def _write_check_outputs(mc, ifc_out, in_place, bcf_out, bcf_version, issues_out, json_out,
                         csv_out, quiet) -> None:
    """Every output asked for; a failure to write one is a usage error naming the file."""
    from ifcjoint.outputs.results import write_issues, write_results_csv, write_results_json

    jobs = []
    if json_out:
        jobs.append((json_out, lambda: write_results_json(mc, json_out)))
    if csv_out:
        jobs.append((csv_out, lambda: write_results_csv(mc, csv_out)))
    if issues_out:
        jobs.append((issues_out, lambda: write_issues(mc, issues_out)))
    if bcf_out:
        from ifcjoint.outputs.bcf import write_bcf

        jobs.append((bcf_out, lambda: write_bcf(mc, bcf_out, version=bcf_version)))
    if ifc_out:
        from ifcjoint.ifc.writer import write_results_ifc

        jobs.append((ifc_out, lambda: write_results_ifc(mc, ifc_out, in_place=in_place)))
    for path, job in jobs:
        try:
            done = job()
        except (OSError, ValueError) as exc:
            _fail(EXIT_USAGE, f"cannot write {path}: {exc}")
        except Exception as exc:  # noqa: BLE001 - e.g. the IFC writer's own error
            _fail(EXIT_USAGE, f"cannot write {path}: {exc}")
        if not quiet:
            extra = f" ({', '.join(f'{k} {v}' for k, v in done.items())})" if done else ""
            click.echo(f"wrote {path}{extra}", err=True)


if __name__ == "__main__":  # pragma: no cover
    main()
