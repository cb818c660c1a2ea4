"""Everything that touches ifcopenshell: reading a model into plain data, writing property sets.

Reading: ``reader.read_model`` (open, units, texts, elements, relations, placement, profiles,
solids, mesh), one ``context.ReadContext`` per file. Writing: ``writer.write_property_sets``.
"""
