"""EN 1993-1-8 (with the EN 1993-1-1 values it needs): formulas and the design-code object.

Pure functions over floats, one per component or rule, each docstring's second paragraph
citing its clause; ``code.EN_1993_1_8`` is the design-code object the check and the renderers
use for clause references, partial factors and the names and symbols it prints. Never imports
ifcopenshell.
"""
