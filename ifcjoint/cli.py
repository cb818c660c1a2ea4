"""Command line: thin click commands that parse, call the library and render.

Exit codes (also in the README and ``ifcjoint --help``) come from the exceptions
(``ifcjoint.errors``):
    0  done; for ``check``: the gate passed (see --fail-on)
    1  ``check`` (and ``calc`` with --fail-on): the gate failed (failing joints, or unchecked
       ones, per --fail-on)
    2  usage error (bad option or value, an output that cannot be written, or one that would
       replace the input)
    3  model unusable: missing, not IFC, truncated, unsupported schema, no length unit;
       or a rules, parameters, demands, results or joint description file that cannot be used
    4  model read, but it holds no steel beams or columns to scan (outputs still written)
    5  internal error (a bug: please report it with the model if you can)
    130 interrupted (Ctrl-C), 143 terminated (SIGTERM): no output written or changed
"""

from __future__ import annotations

import contextlib
import sys
import traceback
from collections.abc import Callable
from pathlib import Path

import click

from ifcjoint import __version__
from ifcjoint.errors import (
    EXIT_GATE,
    EXIT_INTERNAL,
    EXIT_OK,
    ConfigError,
    IfcjointError,
    OutputError,
    ResultsFileError,
    UsageError,
)
from ifcjoint.ifc.units import LENGTH_UNITS

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


def _exit(exc: IfcjointError):
    """Say what went wrong and exit with the error's code."""
    click.echo(f"ifcjoint: error: {exc}", err=True)
    sys.exit(exc.exit_code)


def _guarded(what: str, debug: bool, bar: _Bar | None, fn: Callable):
    """Run a step; an ifcjoint error exits with its code, anything else as an internal error."""
    try:
        return fn()
    except IfcjointError as exc:
        if bar is not None:
            bar.close()
        _exit(exc)
    except Exception as exc:  # last resort: a clear message, not a traceback
        if bar is not None:
            bar.close()
        if debug:
            traceback.print_exc()
        click.echo(
            f"ifcjoint: error: internal error while {what} ({type(exc).__name__}: {exc}); "
            "rerun with --debug and please report it",
            err=True,
        )
        sys.exit(EXIT_INTERNAL)
    finally:
        if bar is not None:
            bar.close()


EXIT_INTERRUPTED = 130  # 128 + SIGINT, the shell's convention
EXIT_TERMINATED = 143  # 128 + SIGTERM


def _terminated(signum, frame):
    raise SystemExit(EXIT_TERMINATED)


class _Main(click.Group):
    """The command group: an interrupt or a termination ends the run cleanly.

    Ctrl-C exits 130 and SIGTERM 143; on both the temporaries of the outputs being written
    are removed (``ifcjoint.fileio.staged_outputs``) and no output is left half-written.
    """

    def invoke(self, ctx):
        import signal

        from ifcjoint.fileio import restore_collector

        with contextlib.suppress(ValueError):  # not the main thread: leave signals alone
            signal.signal(signal.SIGTERM, _terminated)
        try:
            return super().invoke(ctx)
        except KeyboardInterrupt:
            click.echo("\nifcjoint: interrupted; no output was changed", err=True)
            sys.exit(EXIT_INTERRUPTED)
        finally:
            restore_collector()  # what a command set aside (fileio.spare_collector)


@click.group(
    cls=_Main,
    context_settings={"help_option_names": ["-h", "--help"]},
    epilog="Exit codes: 0 done (check: gate passed), 1 check gate failed, 2 usage error, "
    "3 model or input file unusable, 4 no steel members, 5 internal error, 130 interrupted "
    "(Ctrl-C), 143 terminated.",
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
                type=click.Path(),
                help="Extra element recognition rules: a TOML file shaped like the "
                "recognition.toml bundled in the installed package (ifcjoint/data); its "
                "lists come first.",
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


def _scan(model, bar, debug, reads=None, **kw):
    """Scan MODEL with the options every command shares.

    The scan lives to the end of the command: it is set aside from the cycle collector's
    later passes (``fileio.spare_collector``; ``_Main.invoke`` restores it).
    """
    from ifcjoint.anatomy import AnatomySettings
    from ifcjoint.fileio import spare_collector
    from ifcjoint.find import FinderSettings
    from ifcjoint.pipeline import scan

    result = _guarded(
        "scanning",
        debug,
        bar,
        lambda: scan(
            model,
            settings=FinderSettings(tolerance=kw["tolerance"]),
            assume_length_unit=kw["length_unit"],
            rules_file=kw["rules_file"],
            progress=bar,
            anatomy=AnatomySettings(
                assume_steel_grade=kw["assume_grade"], assume_bolt_class=kw["assume_bolt_class"]
            ),
            reads=reads,
        ),
    )
    spare_collector()
    return result


def _outputs_ok(outputs: dict, inputs: dict, may_replace: dict | None = None) -> None:
    """Before any work: no output may be an input, and every output must be writable."""
    from ifcjoint.fileio import check_output_paths

    _guarded("checking the output paths", False, None,
             lambda: check_output_paths(outputs, inputs, may_replace=may_replace))


def _wrote(quiet: bool):
    """Report each output written (on stderr)."""

    def done(kind: str, path, counts: dict[str, int]) -> None:
        if quiet:
            return
        if "bytes" in counts:
            extra = f" ({counts['bytes'] / 1e6:.1f} MB)"
        else:
            extra = f" ({', '.join(f'{k} {v}' for k, v in counts.items())})" if counts else ""
        click.echo(f"wrote {path}{extra}", err=True)

    return done


@main.command()
@click.argument("model", type=click.Path(path_type=str))
@click.option(
    "--json",
    "json_out",
    type=click.Path(dir_okay=False, writable=True),
    help="Write the scan as JSON: every joint with its parts and anatomy, every other "
    "beam end, every unreadable element.",
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
    from ifcjoint.errors import OutputError
    from ifcjoint.fileio import staged_outputs
    from ifcjoint.pipeline import require_steel
    from ifcjoint.report.scan import build_scan, write_scan_csv, write_scan_json, write_scan_summary

    _outputs_ok({"--json": json_out, "--csv": csv_out},
                {"the model": model, "the rules file": kw["rules_file"]})
    bar = _Bar(sys.stderr.isatty() and not quiet)
    result = _scan(model, bar, debug, **kw)
    scan_dict = build_scan(result)

    def write() -> None:
        with staged_outputs():
            for out, render in ((json_out, write_scan_json), (csv_out, write_scan_csv)):
                if out:
                    try:
                        render(scan_dict, out)
                    except OSError as exc:
                        raise OutputError(f"cannot write {out}: {exc.strerror or exc}") from exc

    _guarded("writing the outputs", debug, None, write)
    if not quiet:
        write_scan_summary(scan_dict, sys.stdout, brief=brief)
    _guarded("scanning", debug, None, lambda: require_steel(result))
    sys.exit(EXIT_OK)


@main.command()
@click.argument("model", type=click.Path(path_type=str))
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
    """Write a demands template for MODEL: one row per joint, ready to fill.

    Fill M_Ed_kNm, V_Ed_kN and a combination name in each row; add rows for more
    combinations.
    """
    from ifcjoint.errors import OutputError
    from ifcjoint.pipeline import require_steel
    from ifcjoint.tables.demands import write_template

    _outputs_ok({"--output": out}, {"the model": model, "the rules file": kw["rules_file"]})
    bar = _Bar(sys.stderr.isatty() and not quiet)
    result = _scan(model, bar, debug, **kw)

    def write() -> int:
        if Path(out).exists() and not str(out).lower().endswith((".csv", ".txt")):
            raise UsageError(f"{out}: exists and is not a CSV; refusing to overwrite it")
        try:
            return write_template(result.joints, out)
        except OSError as exc:
            raise OutputError(f"cannot write {out}: {exc}") from exc

    n = _guarded("writing the template", debug, None, write)
    if not quiet:
        click.echo(f"{out}: {n} joints, one row each; fill in M_Ed_kNm, V_Ed_kN, combination")
    _guarded("scanning", debug, None, lambda: require_steel(result))
    sys.exit(EXIT_OK)


@main.command()
@click.argument("model", required=False, type=click.Path(path_type=str))
@click.option("-o", "--output", "out", type=click.Path(dir_okay=False),
              help="Where to write the IDS (the MODEL's schema, else --schema).")
@click.option("--schema", type=click.Choice(["IFC2X3", "IFC4", "IFC4X3"]),
              help="The IDS's schema when no MODEL is given.")
@_model_options
def requirements(model, out, schema, quiet, debug, **kw):
    """Write what a model must carry for ifcjoint as an IDS; check MODEL's joints against it.

    The IDS (buildingSMART Information Delivery Specification) names, in the places the IFC
    schema gives them: steel grades on members and plates, section designations, bolt
    diameter, length and property class, weld throats. With MODEL, every joint is listed with
    the requirements its beam, column, plates and fasteners miss. Exit 0 when every joint's
    parts meet them (or no MODEL), 1 when some miss one.
    """
    from ifcjoint.errors import OutputError
    from ifcjoint.ifc.requirements import build_ids, missing_requirements, write_ids

    if model is None and (schema is None or out is None):
        raise UsageError("give a MODEL, or --schema with -o/--output")
    if out:
        _outputs_ok({"--output": out}, {"the model": model, "the rules file": kw["rules_file"]}
                    if model else {})
    if model is None:
        n = _guarded("writing the IDS", debug, None, lambda: write_ids(schema, out))
        if not quiet:
            click.echo(f"{out}: {n} specifications ({schema})")
        sys.exit(EXIT_OK)
    bar = _Bar(sys.stderr.isatty() and not quiet)
    result = _scan(model, bar, debug, **kw)
    schema = result.model.schema
    if out:
        def write() -> int:
            try:
                return write_ids(schema, out)
            except OSError as exc:
                raise OutputError(f"cannot write {out}: {exc}") from exc

        n = _guarded("writing the IDS", debug, None, write)
        if not quiet:
            click.echo(f"{out}: {n} specifications ({schema})", err=True)

    def validate():
        from ifcjoint.ifc.open import open_model

        f, _, _ = open_model(model)
        return missing_requirements(f, build_ids(schema))

    misses = _guarded("checking the requirements", debug, None, validate)
    short = 0
    for j in result.joints:
        els = (j.beam, j.column, *(p.guid for p in (*j.plates, *j.fasteners)))
        found: dict[str, int] = {}
        for e in els:
            for name in misses.get(e.split("#")[0], ()):
                found[name] = found.get(name, 0) + 1
        if found:
            short += 1
            if not quiet:
                what = "; ".join(f"{k} ({n} element(s))" for k, n in found.items())
                click.echo(f"{j.label} ({j.id}): misses {what}")
    if not quiet:
        click.echo(f"{model}: {short} of {len(result.joints)} joints miss a requirement "
                   f"({len(misses)} element(s) in all)")
    sys.exit(1 if short else EXIT_OK)


@main.command()
@click.argument("before", type=click.Path(path_type=str))
@click.argument("after", type=click.Path(path_type=str))
@click.option("--json", "json_out", type=click.Path(dir_okay=False),
              help="The comparison as JSON (every joint, what changed, statuses).")
@click.option("--quiet", "-q", is_flag=True, help="Print nothing but errors.")
def compare(before, after, json_out, quiet):
    """Compare two revisions' results (BEFORE and AFTER, from check --json) joint by joint.

    Joints are matched by id (beam GlobalId and end), else by position when an exporter
    regenerated GlobalIds; each is new, removed, unchanged or changed, with what changed
    (sections, grades, plates, bolts, welds, kind, demands, tool version) and its status
    before and after. Exit 0; 1 when a joint fails now that did not before.
    """
    import json as _json

    from ifcjoint.fileio import atomic_write_text
    from ifcjoint.report.revisions import compare_results, write_comparison

    if json_out:
        _outputs_ok({"--json": json_out}, {"BEFORE": before, "AFTER": after})
    a = _guarded("reading the results", False, None, lambda: _read_results(before))
    b = _guarded("reading the results", False, None, lambda: _read_results(after))
    cmp = compare_results(a, b)
    if json_out:
        _guarded("writing the comparison", False, None,
                 lambda: atomic_write_text(json_out, _json.dumps(cmp, indent=1)))
    if not quiet:
        write_comparison(cmp, sys.stdout)
    sys.exit(1 if cmp["counts"]["now_failing"] else EXIT_OK)


GATES = {
    "fail": "exit 1 when a joint fails, a beam or column cannot be read, or a demand row is "
    "rejected",
    "unchecked": "exit 1 when a joint fails or is unchecked (default)",
    "problems": "exit 1 on any problem: also detailing errors and analysis-assumption mismatches",
    "never": "exit 0 whatever the results (report only)",
}


def gate_fails(mc, fail_on: str) -> list[str]:
    """Why the gate fails (empty: it passes)."""
    from ifcjoint.model.codes import Priority, ProblemKind, Status

    c = mc.counts()
    why = []
    if fail_on == "never":
        return why
    if c[Status.FAIL]:
        why.append(f"{c[Status.FAIL]} joint(s) fail")
    n = len(mc.unreadable_members())
    if n:
        why.append(f"{n} beam(s)/column(s) could not be read (their joints are unknown)")
    if mc.demands is not None and mc.demands.rows_rejected:
        why.append(f"{mc.demands.rows_rejected} demand row(s) rejected (forces meant for a "
                   "joint were not checked)")
    if fail_on in ("unchecked", "problems"):
        n = len(mc.unchecked())
        if n:
            why.append(f"{n} joint(s) unchecked")
    if fail_on == "problems":
        kinds = (ProblemKind.DETAILING, ProblemKind.ASSUMPTION)
        n = sum(
            1 for _, p in mc.problems() if p.kind in kinds and p.priority != Priority.MINOR
        )
        if n:
            why.append(f"{n} detailing or assumption problem(s)")
    return why


def _settings(params_file, frame, alpha_method):
    """The check settings from the options; a parameters file that cannot be used is exit 3."""
    import tomllib

    from ifcjoint.ec3.code import EN_1993_1_8
    from ifcjoint.ec3.params import Parameters
    from ifcjoint.engine.settings import CheckSettings

    code = EN_1993_1_8
    if params_file:
        where = f"{params_file} (--params)"
        try:
            code = code.with_params(Parameters.from_toml(params_file))
        except tomllib.TOMLDecodeError as exc:
            raise ConfigError(f"{where}: not valid TOML ({exc})") from exc
        except UnicodeDecodeError as exc:
            raise ConfigError(
                f"{where}: not UTF-8 text ({exc.reason} at byte {exc.start})") from exc
        except OSError as exc:
            raise ConfigError(f"{where}: cannot read ({exc.strerror or exc})") from exc
        except (ValueError, TypeError) as exc:
            msg = str(exc)
            if msg.startswith(str(params_file)):
                msg = msg[len(str(params_file)):].lstrip(": ")
            raise ConfigError(f"{where}: {msg}") from exc
    return CheckSettings(code=code, braced=frame == "braced", alpha_method=alpha_method)


@main.command()
@click.argument("model", type=click.Path(path_type=str))
@click.option(
    "--demands",
    "demands_file",
    type=click.Path(dir_okay=False),
    help="Design forces CSV, a row per joint and combination (`ifcjoint demands` writes a "
    "template). Without it every checkable joint is unchecked.",
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
    "--json", "json_out", type=click.Path(dir_okay=False),
    help="Results JSON: every joint with its inputs, components, clauses and status.",
)
@click.option("--csv", "csv_out", type=click.Path(dir_okay=False), help="Results, a row per joint.")
@click.option("--parts", "parts_out", type=click.Path(dir_okay=False),
              help="The parts table as CSV: every plate, bolt group and weld of every joint "
              "with its dimensions and grade, to compare with the shop drawings.")
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
    type=click.Path(),
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
    type=click.Choice(["chart", "conservative"]),
    default="chart",
    show_default=True,
    help="alpha of EN 1993-1-8 Fig. 6.11: from the chart (its published closed form), or "
    "the chart's lowest value 4.45 everywhere.",
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
@click.option("--storey", "f_storeys", multiple=True, metavar="NAME",
              help="Print and write only the joints of this storey (repeatable; wildcards "
              "such as 'Level 0*' allowed). The BCF and IFC outputs and the gate still cover "
              "every joint.")
@click.option("--status", "f_statuses", multiple=True,
              type=click.Choice(["pass", "fail", "unchecked", "no_demands", "incomplete",
                                 "unsupported", "unreadable"]),
              help="Print and write only the joints of this status (repeatable).")
@click.option("--archetype", "f_archetypes", multiple=True, metavar="NAME",
              help="Print and write only the joints of this archetype, e.g. flush_end_plate "
              "(repeatable).")
@click.option("--joint", "f_joints", multiple=True, metavar="ID",
              help="Print and write only this joint, by id or label (repeatable; wildcards "
              "allowed).")
@click.option("--since", "since", type=click.Path(dir_okay=False, path_type=str),
              metavar="RESULTS_JSON",
              help="An earlier run's results (check --json): joints whose inputs, demands, "
              "settings and tool version are all the same are carried over, not re-checked; "
              "every joint is compared (new, removed, changed and what, status before and "
              "after) on stdout and in the JSON and HTML; BCF topics carry on.")
@click.option("--keep-reads", is_flag=True,
              help="Keep this run's element reads and joint anatomies in the user's cache "
              "folder, so that a later check --since this run's results reads only what "
              "changed (a run with --since keeps them anyway).")
@click.option("--no-read-cache", is_flag=True,
              help="With --since: read every element again, and keep nothing.")
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
    parts_out,
    html_out,
    md_out,
    params_file,
    frame,
    alpha_method,
    fail_on,
    top,
    f_storeys,
    f_statuses,
    f_archetypes,
    f_joints,
    since,
    keep_reads,
    no_read_cache,
    timestamp,
    quiet,
    debug,
    **kw,
):
    """Check every joint of MODEL against the demands; write results, property sets and BCF."""
    import datetime as dt

    from ifcjoint.pipeline import check_scan, require_steel
    from ifcjoint.report.outputs import write_outputs
    from ifcjoint.report.results import write_check_summary
    from ifcjoint.tables.demands import read_demands

    settings = _guarded("reading the parameters", debug, None,
                        lambda: _settings(params_file, frame, alpha_method))
    if ifc_out and not in_place and Path(ifc_out).resolve() == Path(model).resolve():
        _exit(UsageError(f"--ifc-out {ifc_out} is the input model; use another path or --in-place"))
    _outputs_ok(
        {"--ifc-out": ifc_out, "--bcf": bcf_out, "--issues": issues_out, "--json": json_out,
         "--csv": csv_out, "--parts": parts_out, "--html": html_out, "--md": md_out},
        {"the model": model, "the demands file": demands_file,
         "the parameters file": params_file, "the rules file": kw["rules_file"],
         "the earlier results (--since)": since},
        may_replace={"--ifc-out": "the model"} if in_place else None,
    )
    previous, reads = _earlier_run(since, keep_reads, no_read_cache, debug)
    bar = _Bar(sys.stderr.isatty() and not quiet)
    result = _scan(model, bar, debug, reads=reads, **kw)
    table = None
    if demands_file:
        table = _guarded("reading the demands", debug, None,
                         lambda: read_demands(demands_file, result.joints,
                                              result.model.unreadable))
    when = (
        timestamp.replace(tzinfo=dt.UTC)
        if timestamp
        else dt.datetime.now(dt.UTC).replace(microsecond=0)
    )
    mc = _guarded("checking", debug, bar,
                  lambda: check_scan(result, table, settings, created=when, progress=bar,
                                     previous=previous,
                                     notes=(reads.summary(),) if previous and reads else ()))
    targets = {"json": json_out, "csv": csv_out, "issues": issues_out, "parts": parts_out,
               "bcf": bcf_out, "ifc": ifc_out, "html": html_out, "md": md_out}
    html_bar = _Bar(sys.stderr.isatty() and not quiet)
    options = {"bcf": {"version": bcf_version}, "ifc": {"in_place": in_place},
               "html": {"progress": html_bar}}
    from ifcjoint.report.results import filter_results

    shown = filter_results(mc.results, storeys=f_storeys, statuses=f_statuses,
                           archetypes=f_archetypes, joints=f_joints)
    _guarded("writing the outputs", debug, html_bar,
             lambda: write_outputs(shown, targets, options, done=_wrote(quiet),
                                   complete=mc.results))
    if reads is not None and reads.usable:
        reads.save(result.model.sha256)  # for a later --since (best effort)
    if not quiet:
        write_check_summary(shown, sys.stdout, top=top)
    _guarded("scanning", debug, None, lambda: require_steel(result))
    why = gate_fails(mc, fail_on)
    if why:
        click.echo(f"ifcjoint: gate ({fail_on}) failed: {'; '.join(why)}", err=True)
        sys.exit(EXIT_GATE)
    sys.exit(EXIT_OK)


def _earlier_run(since, keep_reads: bool, no_read_cache: bool, debug: bool):
    """The earlier run's results (``--since``) and the element reads to reuse and keep."""
    previous = reads = None
    if since:
        from ifcjoint.pipeline import PreviousRun

        data = _guarded("reading the earlier results", debug, None, lambda: _read_results(since))
        previous = PreviousRun(path=since, results=data)
    if not no_read_cache and (previous is not None or keep_reads):
        from ifcjoint.ifc.read_cache import ReadCache

        reads = (ReadCache.load(previous.results.get("model", {}).get("sha256"))
                 if previous is not None else ReadCache())
    if previous is not None:
        from ifcjoint.fileio import spare_collector

        spare_collector()  # they live to the end of the run (until _Main.invoke ends)
    return previous, reads


def _read_results(results_json: str) -> dict:
    """A results JSON written by ``check --json``.

    Raises:
        ResultsFileError: unreadable, not JSON, not a results JSON, or of another version.
    """
    import json

    import orjson

    from ifcjoint.fileio import no_cycle_collection
    from ifcjoint.report.results import READABLE_SCHEMA_VERSIONS

    try:
        with Path(results_json).open("rb") as fh:
            head = fh.read(16)
        if head.startswith((b"ISO-10303-21", b"PK\x03\x04")):
            raise ResultsFileError(
                f"{results_json}: an IFC model, not results; give the results JSON that "
                "`ifcjoint check --json` wrote for it")
        with no_cycle_collection():
            data = orjson.loads(Path(results_json).read_bytes())  # strict JSON, UTF-8
    except OSError as exc:
        raise ResultsFileError(f"{results_json}: cannot read ({exc.strerror or exc})") from exc
    except (UnicodeDecodeError, json.JSONDecodeError) as exc:  # orjson's error is one
        raise ResultsFileError(f"{results_json}: not JSON ({exc})") from exc
    if not isinstance(data, dict) or "results_schema_version" not in data:
        raise ResultsFileError(
            f"{results_json}: not a results JSON of `ifcjoint check --json` (a scan JSON has no "
            "check results; run check first)"
        )
    version = data["results_schema_version"]
    if version not in READABLE_SCHEMA_VERSIONS:
        raise ResultsFileError(
            f"{results_json}: results schema {version!r} is not one this version reads "
            f"({', '.join(READABLE_SCHEMA_VERSIONS)})"
        )
    return data


@main.command()
@click.argument("results_json", type=click.Path(path_type=str))
@click.option("--html", "html_out", type=click.Path(dir_okay=False), help="HTML report to write.")
@click.option("--md", "md_out", type=click.Path(dir_okay=False), help="Markdown summary to write.")
@click.option("--quiet", "-q", is_flag=True, help="Print nothing but errors.")
def report(results_json, html_out, md_out, quiet):
    """Render the reports again from a results JSON written by `check --json` (no re-check)."""
    from ifcjoint.report.outputs import write_outputs

    if not html_out and not md_out:
        _exit(UsageError("nothing to write: give --html and/or --md"))
    _outputs_ok({"--html": html_out, "--md": md_out}, {"the results JSON": results_json})
    data = _guarded("reading the results", False, None, lambda: _read_results(results_json))
    bar = _Bar(sys.stderr.isatty() and not quiet)
    _guarded("writing the reports", False, bar,
             lambda: write_outputs(data, {"html": html_out, "md": md_out},
                                   {"html": {"progress": bar}}, done=_wrote(quiet)))
    sys.exit(EXIT_OK)


def _export_description(results_json: str, joint_key: str | None, out: str | None) -> str:
    """Write one joint of a results JSON as a description; returns what was written."""
    from ifcjoint.archetypes.description import DescriptionError, description_from_joint
    from ifcjoint.tables.joint_file import write_description

    data = _read_results(results_json)
    if not joint_key:
        raise UsageError("--from needs --joint ID (a joint id or label of the results JSON)")
    joints = data.get("joints") or []
    found = [j for j in joints if j.get("id") == joint_key] or [
        j for j in joints if j.get("label") == joint_key
    ]
    if len(found) != 1:
        near = [j["id"] for j in joints if joint_key.lower() in
                f"{j.get('id', '')} {j.get('label', '')}".lower()][:5]
        hint = f"; close: {', '.join(near)}" if near else ""
        what = "is not" if not found else f"matches {len(found)} joints; give the id, it"
        raise UsageError(f"{results_json}: {joint_key!r} {what} a joint id or label{hint}")
    try:
        desc = description_from_joint(found[0])
    except DescriptionError as exc:
        raise ResultsFileError(f"{results_json}: joint {joint_key}: {exc}") from exc
    if out:
        try:
            write_description(desc, out)
        except OSError as exc:
            raise OutputError(f"cannot write {out}: {exc}") from exc
        return out
    import tomli_w

    click.echo(tomli_w.dumps(desc), nl=False)
    return ""


@main.command()
@click.argument("description", required=False, type=click.Path(dir_okay=False, path_type=str))
@click.option("--html", "html_out", type=click.Path(dir_okay=False),
              help="The calculation sheet as a self-contained HTML page.")
@click.option("--json", "json_out", type=click.Path(dir_okay=False),
              help="The one-joint results JSON.")
@click.option("--from", "from_results", type=click.Path(dir_okay=False, path_type=str),
              help="Export a joint of this results JSON (of `check --json`) as a description "
              "to edit and run; with --joint and --out.")
@click.option("--joint", "joint_key", help="With --from: the joint's id or label.")
@click.option("--out", "out_path", type=click.Path(dir_okay=False),
              help="With --from: the description to write (.toml or .json); TOML on stdout "
              "when not given.")
@click.option("--fail-on", type=click.Choice(list(GATES)), default="never", show_default=True,
              help="What makes the exit code 1 (as for check).")
@click.option(
    "--timestamp",
    type=click.DateTime(formats=["%Y-%m-%dT%H:%M:%S", "%Y-%m-%d"]),
    default=None,
    help="Date to record in the outputs (UTC) instead of now, for reproducible files.",
)
@click.option("--quiet", "-q", is_flag=True, help="Print nothing but errors.")
@click.option("--debug", is_flag=True, help="Print a traceback on an internal error.")
def calc(description, html_out, json_out, from_results, joint_key, out_path, fail_on,
         timestamp, quiet, debug):
    """Calculate one joint from a DESCRIPTION (TOML or JSON; `--from` exports one to start from).

    Prints its calculation sheet: inputs, components with clauses, row distribution,
    resistances, stiffness, classification and utilisations. With --from, exports a joint of
    a results JSON as a description instead (edit it and run it: "what if the plate were
    25 mm?").
    """
    import datetime as dt

    from ifcjoint.model.codes import UNCHECKED, Status
    from ifcjoint.pipeline import calc as run_calc
    from ifcjoint.report.calc import write_calc_outputs
    from ifcjoint.report.sheet import render_sheet_text

    if from_results:
        if description:
            _exit(UsageError("give a DESCRIPTION to calculate or --from to export, not both"))
        _outputs_ok({"--out": out_path}, {"the results JSON": from_results})
        wrote = _guarded("exporting the joint", debug, None,
                         lambda: _export_description(from_results, joint_key, out_path))
        if wrote and not quiet:
            click.echo(f"wrote {wrote}", err=True)
        sys.exit(EXIT_OK)
    if not description:
        _exit(UsageError("give a joint DESCRIPTION (.toml or .json), or --from RESULTS --joint ID"))
    _outputs_ok({"--html": html_out, "--json": json_out}, {"the description": description})
    when = timestamp.replace(tzinfo=dt.UTC) if timestamp else None
    jc = _guarded("calculating", debug, None, lambda: run_calc(description, created=when))
    _guarded("writing the outputs", debug, None,
             lambda: write_calc_outputs(jc.results, {"json": json_out, "html": html_out},
                                        done=_wrote(quiet)))
    if not quiet:
        joint = jc.results["joints"][0]
        click.echo(render_sheet_text(joint, jc.results, jc.settings.code), nl=False)
    status = jc.status
    failed = (fail_on != "never" and status == Status.FAIL) or (
        fail_on in ("unchecked", "problems") and status in UNCHECKED)
    sys.exit(EXIT_GATE if failed else EXIT_OK)


@main.command()
@click.argument("models", nargs=-1, required=True, type=click.Path(path_type=str))
@click.option("--out", "out_dir", required=True, type=click.Path(file_okay=False),
              help="Folder for every model's outputs (<model name>.json and the --also ones).")
@click.option("--scan-only", is_flag=True, help="Scan the models instead of checking them.")
@click.option("--demands", "demands_pattern", default="{stem}-demands.csv", show_default=True,
              help="Each model's demands CSV beside it; {stem} is the model's file name without "
              "its extension. A model without one is checked without demands.")
@click.option("--also", "also", multiple=True,
              help="More outputs per model, as for check: e.g. --also html:{out}/{stem}.html "
              "--also bcf:{out}/{stem}.bcf (json, csv, issues, bcf, ifc, html, md).")
@click.option("--jobs", "-j", type=click.IntRange(1, 64), default=2, show_default=True,
              help="Models run at the same time, each in its own process.")
@click.option("--timeout", type=click.FloatRange(min=1), default=3600.0, show_default=True,
              help="Seconds a model may take; one that takes longer is stopped and reported.")
@click.option("--quiet", "-q", is_flag=True, help="Print nothing but errors.")
def batch(models, out_dir, scan_only, demands_pattern, also, jobs, timeout, quiet):
    """Check (or scan) several MODELS (files or folders), each in its own process.

    A model that cannot be read, crashes or hangs is reported in the summary and never stops
    the others. Exit code 0 when every model ran, 3 when any could not be used (failed,
    crashed or timed out). Gates are for single models: run check on one with --fail-on.
    """
    from ifcjoint.batch import model_files, run_batch, summary_table

    kinds = {"json": "--json", "csv": "--csv", "issues": "--issues", "parts": "--parts",
             "bcf": "--bcf",
             "ifc": "--ifc-out", "html": "--html", "md": "--md"}
    extra: list[str] = []
    for a in also:
        kind, _, target = a.partition(":")
        if kind not in kinds or not target:
            _exit(UsageError(f"--also {a!r}: expected KIND:PATH with KIND one of "
                             f"{', '.join(kinds)} (PATH may use {{stem}} and {{out}})"))
        if scan_only and kind not in ("json", "csv"):
            _exit(UsageError(f"--also {kind}: a scan writes json and csv only"))
        if "{stem}" not in target:
            _exit(UsageError(f"--also {a!r}: the path needs {{stem}} (one file per model)"))
        extra += [kinds[kind], target]
    found = _guarded("finding the models", False, None, lambda: model_files(list(models)))
    bar = _Bar(sys.stderr.isatty() and not quiet)
    items = _guarded("running the models", False, bar, lambda: run_batch(
        "scan" if scan_only else "check", found, Path(out_dir), jobs=jobs, timeout=timeout,
        demands_pattern=None if scan_only else demands_pattern, extra=extra, progress=bar))
    if not quiet:
        from ifcjoint.batch import summary_table

        click.echo(summary_table(items), nl=False)
    bad = [i for i in items if i.outcome != "done"]
    if bad:
        click.echo(f"ifcjoint: {len(bad)} of {len(items)} model(s) could not be run: "
                   + "; ".join(f"{Path(i.model).name}: {i.outcome} ({i.message})" for i in bad),
                   err=True)
    sys.exit(3 if bad else EXIT_OK)


if __name__ == "__main__":  # pragma: no cover
    main()
