"""Finding joints: beam ends against column faces, parts attached, labels.

``find_joints(model)`` returns every beam-to-column joint with its plates and fasteners and
accounts for every other beam end. Pure numpy and shapely over ``ifcjoint.model``; no IFC.
"""

from ifcjoint.find.finder import find_joints
from ifcjoint.find.settings import FinderSettings

__all__ = ["FinderSettings", "find_joints"]
