"""Library entry point: scan a model file for beam-to-column joints.

Example:
    >>> from ifcjoint.scanner import scan
    >>> result = scan("sample_models/kestrel-workshop-ifc4-mm.ifc")  # doctest: +SKIP
    >>> len(result.joints)  # doctest: +SKIP
    30
"""

from __future__ import annotations

from dataclasses import replace
from pathlib import Path

from ifcjoint.engine.anatomy import AnatomySettings, analyse
from ifcjoint.engine.finder import FinderSettings, Progress, find_joints
from ifcjoint.engine.results import ScanResult
from ifcjoint.ifc.reader import read_model
from ifcjoint.ifc.recognition import load_rules


def scan(
    path: str | Path,
    *,
    settings: FinderSettings | None = None,
    assume_length_unit: str | None = None,
    rules_file: str | Path | None = None,
    progress: Progress | None = None,
    anatomy: AnatomySettings | None = None,
) -> ScanResult:
    """Read a model and find every beam-to-column joint in it.

    Args:
        path: ``.ifc`` or ``.ifczip`` model.
        settings: finder tolerances (defaults when None).
        assume_length_unit: unit to use only if the model declares none.
        rules_file: extra recognition rules (TOML) on top of the bundled ones.
        progress: optional callback ``(stage, done, total)``.
        anatomy: what to assume where the model says nothing (reported as assumptions).

    Raises:
        ifcjoint.errors.ModelError: the model cannot be used.
        ifcjoint.errors.ConfigError: the rules file cannot be used.
    """
    rules = load_rules(rules_file)
    model = read_model(path, assume_length_unit=assume_length_unit, rules=rules, progress=progress)
    return describe_joints(find_joints(model, settings, progress=progress), anatomy)


def describe_joints(result: ScanResult, settings: AnatomySettings | None = None) -> ScanResult:
    """Add each joint's anatomy, refined archetype and detailing findings to a scan."""
    anatomy = analyse(result.joints, result.model, settings)
    joints = tuple(
        replace(
            j,
            archetype=a.archetype,
            archetype_reason=a.archetype_reason,
            findings=tuple(f.as_dict() for f in a.findings),
        )
        for j, a in zip(result.joints, anatomy, strict=True)
    )
    return replace(result, joints=joints, anatomy={a.joint_id: a for a in anatomy})
