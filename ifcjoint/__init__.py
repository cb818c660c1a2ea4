"""ifcjoint: scan IFC steel models for beam-to-column joints and check them.

Layers (imports point down only)::

    ifcjoint.cli       thin click commands
    ifcjoint.outputs   renderers (text summary, JSON, CSV, BCF)
    ifcjoint.tables    the demands CSV people edit
    ifcjoint.ifc       everything that touches ifcopenshell
    ifcjoint.engine    joint model dataclasses and the joint finder (no IFC)
    ifcjoint.ec3       EN 1993-1-8 formulas (no IFC)
"""

__version__ = "0.1.0"
TOOL_NAME = "ifcjoint"


def check(path, **kwargs):
    """Scan a model and check every joint against its demands (see ``ifcjoint.checker.check``)."""
    from ifcjoint.checker import check as _check

    return _check(path, **kwargs)


def scan(path, **kwargs):
    """Scan a model for beam-to-column joints (see ``ifcjoint.scanner.scan``)."""
    from ifcjoint.scanner import scan as _scan

    return _scan(path, **kwargs)
