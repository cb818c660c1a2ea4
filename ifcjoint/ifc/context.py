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


class DamagedData(ValueError):
    """The element's data is damaged (a cycle, a zero or non-finite direction or coordinate).

    Never handed to the geometry kernel, which may crash on the same data: the element is
    reported unreadable with this message.
    """


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
        self.walking: set[int] = set()  # representation items being read (cycle guard)
        self.keys: dict[int, str] = {}  # entity id -> key, for elements whose GlobalId repeats
        self.duplicates: dict[str, list[int]] = {}  # GlobalId -> entity ids sharing it

    def register(self, elements: list[Any]) -> None:
        """Give every element a distinct key even where exporters repeated a GlobalId.

        An element keeps its GlobalId as its key unless another element read here has the
        same one (copy-paste in some modelling tools): then the first (lowest entity id)
        keeps it and each other one is keyed ``GlobalId#entity`` (``model.identity``), so no
        two elements ever merge and joint ids stay unique.
        """
        from ifcjoint.model.identity import element_key

        by_gid: dict[str, list[int]] = {}
        for el in elements:
            by_gid.setdefault(self.att(el, "GlobalId"), []).append(el.id())
        for gid, ids in by_gid.items():
            if len(ids) > 1:
                ids.sort()
                self.duplicates[gid] = ids
                for i in ids[1:]:
                    self.keys[i] = element_key(gid, i)

    def key(self, e: Any) -> str:
        """The element's key: its GlobalId, made distinct where it repeats (``register``)."""
        return self.keys.get(e.id()) or self.att(e, "GlobalId")

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
