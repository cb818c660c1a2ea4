"""One model being read: the file, its schema and every cache, owned by one object.

Entity ids and attribute positions are per file and per schema, so nothing read from one model
may be reused for another: every cache lives on the ``ReadContext`` made for one file, and the
attribute index is keyed by the schema as well as the class. Two models read in one process
never share state.
"""

from __future__ import annotations

from typing import Any


class NeedsMesh(Exception):
    """The body cannot be read analytically; tessellate it instead."""


class ReadContext:
    """The file being read, its schema, and the caches that may only serve this file.

    Attributes:
        file: the open ifcopenshell file.
        schema: its schema identifier (``IFC2X3``, ``IFC4``, ``IFC4X3_ADD2`` ...).
        a2p: affine tuples of IfcAxis2Placement entities, by entity id.
        profiles: profile readings, by entity id.
        placements: world transforms of object placements (an ``ifc.placement.PlacementCache``).
    """

    def __init__(self, file: Any) -> None:
        from ifcjoint.ifc.placement import PlacementCache

        self.file = file
        self.schema: str = getattr(file, "schema_identifier", None) or file.schema
        self._index: dict[tuple[str, str, str], int] = {}
        self.a2p: dict[int, tuple] = {}
        self.profiles: dict[int, Any] = {}
        self.placements = PlacementCache(self)

    def att(self, e: Any, name: str) -> Any:
        """Attribute by name through an index of positions (several times faster than ``e.Name``).

        Keyed by schema, class and name: the same class has other attributes at a position in
        another schema (an IFC2X3 proxy's CompositionType where IFC4 has PredefinedType).

        Raises:
            RuntimeError, AttributeError: the class has no such attribute in this schema.
        """
        key = (self.schema, e.is_a(), name)
        i = self._index.get(key)
        if i is None:
            i = self._index[key] = e.get_argument_index(name)
        return e.get_argument(i)
