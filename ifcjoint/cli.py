"""Command line: thin click commands that parse, call the library and render.

Exit codes (also in the README and ``ifcjoint --help``):
    0  scan completed
    2  usage error (bad option or value)
    3  model unusable: missing, not IFC, truncated, unsupported schema, no length unit;
       or a rules file that cannot be read
    4  model read, but it holds no steel beams or columns to scan (outputs still written)
    5  internal error (a bug: please report it with the model if you can)
"""

from __future__ import annotations

import sys
import traceback

import click

from ifcjoint import __version__
from ifcjoint.engine.finder import FinderSettings
from ifcjoint.errors import ConfigError, ModelError
from ifcjoint.ifc.reader import LENGTH_UNITS

EXIT_OK, EXIT_USAGE, EXIT_MODEL, EXIT_NO_STEEL, EXIT_INTERNAL = 0, 2, 3, 4, 5

STAGE_NAMES = {
    "read": "reading elements",
    "tessellate": "tessellating bodies",
    "joints": "finding joints",
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
    epilog="Exit codes: 0 done, 2 usage error, 3 model unusable, 4 no steel members, "
    "5 internal error.",
)
@click.version_option(__version__, prog_name="ifcjoint")
def main() -> None:
    """Scan IFC steel models for beam-to-column joints and check them."""


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
@click.option(
    "--tolerance",
    type=click.FloatRange(min=0, max=500),
    default=20.0,
    show_default=True,
    help="How far (mm) a beam end may miss a column and still count.",
)
@click.option(
    "--length-unit",
    type=click.Choice(sorted(LENGTH_UNITS)),
    default=None,
    help="Length unit to assume ONLY when the model declares none.",
)
@click.option(
    "--rules",
    "rules_file",
    type=click.Path(exists=True, dir_okay=False),
    help="Extra element recognition rules (TOML, like ifcjoint/data/recognition.toml).",
)
@click.option(
    "--assume-grade",
    type=click.Choice(["S235", "S275", "S355", "S420", "S460"]),
    default=None,
    help="Steel grade to use where the model gives none (reported as assumed).",
)
@click.option(
    "--assume-bolt-class",
    type=click.Choice(["4.6", "4.8", "5.6", "5.8", "6.8", "8.8", "10.9"]),
    default=None,
    help="Bolt property class to use where the model gives none (reported).",
)
@click.option("--brief", is_flag=True, help="Counts only; do not list every joint and beam end.")
@click.option(
    "--quiet", "-q", is_flag=True, help="Print nothing on stdout (outputs still written)."
)
@click.option("--debug", is_flag=True, help="Show a traceback on internal errors.")
def scan(
    model,
    json_out,
    csv_out,
    tolerance,
    length_unit,
    rules_file,
    assume_grade,
    assume_bolt_class,
    brief,
    quiet,
    debug,
):
    """Find every beam-to-column joint in MODEL (.ifc or .ifczip) and account for every beam end."""
    from ifcjoint.engine.anatomy import AnatomySettings
    from ifcjoint.outputs.scan import write_scan_csv, write_scan_json, write_scan_summary
    from ifcjoint.scanner import scan as run_scan

    bar = _Bar(sys.stderr.isatty() and not quiet)
    try:
        result = run_scan(
            model,
            settings=FinderSettings(tolerance=tolerance),
            assume_length_unit=length_unit,
            rules_file=rules_file,
            progress=bar,
            anatomy=AnatomySettings(
                assume_steel_grade=assume_grade, assume_bolt_class=assume_bolt_class
            ),
        )
    except ModelError as exc:
        bar.close()
        _fail(EXIT_MODEL, str(exc))
    except ConfigError as exc:
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
    bar.close()
    try:
        if json_out:
            write_scan_json(result, json_out)
        if csv_out:
            write_scan_csv(result, csv_out)
    except OSError as exc:
        _fail(EXIT_USAGE, f"cannot write output: {exc}")
    if not quiet:
        write_scan_summary(result, sys.stdout, brief=brief)
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
    sys.exit(EXIT_OK)


if __name__ == "__main__":  # pragma: no cover
    main()
