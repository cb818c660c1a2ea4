"""Design forces on a joint, one load combination (N, N mm), as read from a demands table.

Sign conventions (also in docs/demands.md):
    * M_Ed < 0 is hogging (top flange in tension), M_Ed > 0 sagging; the same convention for
      the beam on the other side of the column (``M_other``), each seen from its own beam.
    * N_Ed > 0 is tension in the beam, N_Ed < 0 compression.
    * Vc_above, Vc_below: shear forces in the column above and below the joint, in the sense
      of EN 1993-1-8 Figure 5.6 (Eq. (5.3) takes their difference).
"""

from __future__ import annotations

from dataclasses import dataclass

from ifcjoint.model.codes import JointModel


@dataclass(frozen=True, slots=True, kw_only=True)
class Demand:
    """One load combination on one joint (N, N mm).

    Attributes:
        combination: name of the load combination.
        M_Ed: moment at the joint, N mm (negative: hogging).
        V_Ed: vertical shear, N (magnitude used).
        N_Ed: axial force in the beam, N (positive: tension).
        M_other: moment of the beam on the other side, N mm, or None (single-sided, or not given).
        Vc_above: shear force in the column above, N, or None when not given.
        Vc_below: shear force in the column below, N, or None when not given.
        braced: frame braced (kb = 8) or not (kb = 25); None: the run's setting.
        assumed_joint: what the analysis model assumed, or None.
        source: where the row came from, e.g. ``demands.csv:12``.
        other_source: where M_other came from when taken from the partner's row.
        V_other: shear of the beam on the other side of the support's web, N, from the
            partner's row of the same combination (None: single-sided, or no such row).
    """

    combination: str
    M_Ed: float
    V_Ed: float
    N_Ed: float = 0.0
    M_other: float | None = None
    Vc_above: float | None = None
    Vc_below: float | None = None
    braced: bool | None = None
    assumed_joint: JointModel | None = None
    source: str = ""
    other_source: str = ""
    V_other: float | None = None
