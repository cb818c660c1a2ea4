"""ifcjoint: scan IFC steel models for beam-to-column joints and check them.

The pipeline, one package per stage, imports pointing down the list only (tests/test_layering)::

    ifcjoint.cli          thin click commands
    ifcjoint.pipeline     scan() and check(): the stages in order, one ModelCheck
    ifcjoint.report       renderers of one results dictionary (JSON, CSV, BCF, HTML, psets)
    ifcjoint.archetypes   one object per kind of joint: recognise, build input, check
    ifcjoint.engine       EN 1993-1-8 check engines, verification against demands, problems
    ifcjoint.anatomy      a joint as read: sections, plate, bolts, detailing rules
    ifcjoint.ifc          everything that touches ifcopenshell (read, write psets)
    ifcjoint.find         beam ends against columns, parts, labels
    ifcjoint.tables       the demands CSV people edit
    ifcjoint.catalogue    sections, steel grades, bolt classes
    ifcjoint.ec3          EN 1993-1-8 formulas and the design-code object
    ifcjoint.model        plain data and typed codes every stage shares
"""

__version__ = "0.1.0"
TOOL_NAME = "ifcjoint"

__all__ = ["TOOL_NAME", "__version__", "check", "scan"]


def __getattr__(name: str):
    """``ifcjoint.engine`` and ``ifcjoint.scan`` are the pipeline's, imported on first use.

    Lazy so that the formulas and the engine import without ifcopenshell.
    """
    if name in ("check", "scan"):
        from ifcjoint import pipeline

        return getattr(pipeline, name)
    raise AttributeError(f"module 'ifcjoint' has no attribute {name!r}")
