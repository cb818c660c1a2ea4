"""Joint model dataclasses, the joint finder and (later) check orchestration. No IFC here."""
