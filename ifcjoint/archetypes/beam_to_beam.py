"""Secondary beams on a primary beam's web: fin plates and partial-depth end plates.

The same checks as on a column web (``engine.fin_plate``, ``engine.header_plate``) with the
primary beam as the support: its web's local shear (both sides' reactions together) and, for
a welded fin plate, its punching rule. Recognised before the beam-to-column kinds, so a
beam-to-beam joint has an archetype of its own. A notch (cope) in the secondary beam's
flange, where its flange would clash with the primary's, is not checked: said so.
"""

from __future__ import annotations

from ifcjoint.anatomy import JointAnatomy
from ifcjoint.archetypes.end_plate import PartialDepthEndPlate
from ifcjoint.archetypes.fin_plate import FinPlate
from ifcjoint.model.codes import Archetype, Reason
from ifcjoint.model.joints import Joint


class BeamFinPlate(FinPlate):
    """A fin plate on a primary beam's web, bolted to the secondary beam's web."""

    archetype = Archetype.BEAM_FIN_PLATE

    def recognise(self, joint: Joint, a: JointAnatomy) -> Reason | None:
        """A beam-to-beam joint with a fin plate and bolts."""
        return super().recognise(joint, a) if joint.beam_to_beam else None


class BeamHeaderPlate(PartialDepthEndPlate):
    """A partial-depth end plate on the secondary beam, bolted to a primary beam's web."""

    archetype = Archetype.BEAM_HEADER_PLATE

    def recognise(self, joint: Joint, a: JointAnatomy) -> Reason | None:
        """A beam-to-beam joint with a partial-depth end plate and bolts."""
        return super().recognise(joint, a) if joint.beam_to_beam else None
