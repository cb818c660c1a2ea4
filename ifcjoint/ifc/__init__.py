"""Everything that touches ifcopenshell: opening models, reading geometry, (later) writing."""
