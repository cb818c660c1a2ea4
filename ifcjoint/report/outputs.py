"""Every output a check run can write, from the one results dictionary, in one place.

The command line asks for outputs by kind; ``write_outputs`` runs each renderer with the same
signature ``(results, path, **options)`` and turns a file-system failure into an
``OutputError`` naming the file.
"""

from __future__ import annotations

from collections.abc import Callable
from pathlib import Path

from ifcjoint.errors import OutputError
from ifcjoint.fileio import staged_outputs
from ifcjoint.report.bcf import write_bcf
from ifcjoint.report.html import write_html
from ifcjoint.report.markdown import write_markdown
from ifcjoint.report.parts import write_parts_csv
from ifcjoint.report.psets import write_results_ifc
from ifcjoint.report.results import write_issues, write_results_csv, write_results_json

Renderer = Callable[..., dict[str, int]]

#: Output kind -> renderer, in the order they are written.
RENDERERS: dict[str, Renderer] = {
    "json": write_results_json,
    "csv": write_results_csv,
    "issues": write_issues,
    "parts": write_parts_csv,
    "bcf": write_bcf,
    "ifc": write_results_ifc,
    "html": write_html,
    "md": write_markdown,
}


#: Outputs that always hold every joint of the run, whatever the filter.
COMPLETE_KINDS = frozenset({"bcf", "ifc"})


def write_outputs(
    results: dict,
    targets: dict[str, str | Path | None],
    options: dict[str, dict] | None = None,
    *,
    done: Callable[[str, str | Path, dict[str, int]], None] | None = None,
    complete: dict | None = None,
) -> None:
    """Write every output asked for (kind -> path; None: not asked), in the renderers' order.

    The outputs are staged (``ifcjoint.fileio.staged_outputs``): none is moved into place
    unless all were written. ``complete``: the unfiltered results when ``results`` is a
    filtered view (``filter_results``); the BCF issue list and the IFC copy always take every
    joint, so a filter never closes a topic or drops a property set.

    Raises:
        OutputError: an output cannot be written (the message names it).
        ifcjoint.errors.UsageError: an output would replace the input model.
    """
    options = options or {}
    written: list[tuple[str, str | Path, dict[str, int]]] = []
    with staged_outputs():  # all or nothing: moved into place when every one is written
        for kind, render in RENDERERS.items():
            path = targets.get(kind)
            if not path:
                continue
            try:
                data = complete if complete is not None and kind in COMPLETE_KINDS else results
                counts = render(data, path, **options.get(kind, {}))
            except OSError as exc:
                raise OutputError(f"cannot write {path}: {exc.strerror or exc}") from exc
            written.append((kind, path, counts))
    if done is not None:
        for kind, path, counts in written:
            done(kind, path, counts)
