"""ifcjoint: scan IFC steel models for beam-to-column joints and check them.

Layers (imports point down only)::

    ifcjoint.cli       thin click commands
    ifcjoint.outputs   renderers (text summary, JSON, CSV)
    ifcjoint.ifc       everything that touches ifcopenshell
    ifcjoint.engine    joint model dataclasses and the joint finder (no IFC)
    ifcjoint.ec3       EN 1993-1-8 formulas (no IFC)
"""

__version__ = "0.1.0"
TOOL_NAME = "ifcjoint"
