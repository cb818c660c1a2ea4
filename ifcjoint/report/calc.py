"""The results of ``ifcjoint calc`` (one joint from a description) and their renderers.

``build_calc_results`` gives one dictionary shaped like a model's results with a single
joint (docs/joint-file.md, "Output"): the joint's ``check`` is the same object a scanned
joint carries, so the text sheet, the HTML sheet and the JSON show the same numbers as a
model check would.
"""

from __future__ import annotations

import json
from pathlib import Path

from ifcjoint import TOOL_NAME, __version__
from ifcjoint.errors import OutputError
from ifcjoint.fileio import atomic_write_text
from ifcjoint.report.results import finite_json, joint_check_dict
from ifcjoint.report.scan import CAUTION, finding_dict

CALC_SCHEMA_VERSION = "1.0"


def _anatomy_for_drawing(inputs: dict | None) -> dict | None:
    """The plate, rows and beam of an end-plate input, as the plate drawing reads them."""
    if not inputs or not inputs.get("plate"):
        return None
    p, b, beam = inputs["plate"], inputs["bolts"], inputs["beam"]
    g = b["gauge"] / 2
    return {
        "plate": {"bp": p["bp"], "hp": p["hp"], "tp": p["tp"],
                  "projection_top": p["projection_top"]},
        "bolts": {"d0": b["d0"],
                  "rows": [{"from_beam_top": z, "lateral": [-g, g]}
                           for z in b["rows_from_beam_top"]]},
        "beam_section": {k: beam[k] for k in ("h", "b", "tw", "tf")},
    }


def build_calc_results(jc) -> dict:
    """The one-joint results of a :class:`ifcjoint.pipeline.JointCalc`."""
    code = jc.settings.code
    check = joint_check_dict(jc, code)
    joint = {
        "id": f"calc-{jc.fingerprint[:8]}",
        "label": jc.label,
        "archetype": jc.archetype,
        "archetype_reason": "Described in a joint file, not read from a model",
        "beam": "",
        "beam_end": "",
        "column": "",
        "axis": "major",
        "partner": "(described as double-sided)" if jc.double_sided else None,
        "findings": [finding_dict(f) for f in jc.findings],
        "parts": [],
        "anatomy": _anatomy_for_drawing(check.get("inputs")),
        "check": check,
    }
    return finite_json({
        "calc_schema_version": CALC_SCHEMA_VERSION,
        "tool": {"name": TOOL_NAME, "version": __version__},
        "description": {"path": jc.path},
        "check": {
            "created": jc.created.isoformat(),
            "tool_version": jc.tool_version,
            "design_code": code.name,
            "params": (check.get("inputs") or {}).get("params") or jc.settings.params.as_dict(),
            "braced_default": jc.settings.braced,
        },
        "joints": [joint],
        "caution": CAUTION,
    })


def write_calc_json(results: dict, path: str | Path) -> dict[str, int]:
    """Write the one-joint results JSON atomically."""
    atomic_write_text(path, json.dumps(results, indent=1, allow_nan=False) + "\n")
    return {}


def write_calc_outputs(results: dict, targets: dict[str, str | Path | None], *,
                       done=None) -> None:
    """Write the one-joint outputs asked for (``json``, ``html``; None: not asked).

    Raises:
        OutputError: an output cannot be written (the message names it).
    """
    from ifcjoint.fileio import staged_outputs
    from ifcjoint.report.html import write_calc_html

    renderers = {"json": write_calc_json, "html": write_calc_html}
    written = []
    with staged_outputs():
        for kind, render in renderers.items():
            path = targets.get(kind)
            if not path:
                continue
            try:
                counts = render(results, path)
            except OSError as exc:
                raise OutputError(f"cannot write {path}: {exc.strerror or exc}") from exc
            written.append((kind, path, counts))
    for kind, path, counts in written if done is not None else ():
        done(kind, path, counts)
