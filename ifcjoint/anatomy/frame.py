"""The joint's own frame: along the beam into the column, up its depth, across.

Vertical positions in a joint are measured down from the top face of the beam's top flange
(negative above it), lateral positions from the beam's web centreline.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from ifcjoint.model.elements import Member
from ifcjoint.model.joints import Joint


@dataclass(slots=True)
class JointFrame:
    """``t`` along the beam into the column, ``n`` up the beam's depth, ``lat`` across."""

    t: np.ndarray
    n: np.ndarray
    lat: np.ndarray
    beam_top: np.ndarray  # a point on the top face of the beam, on its web plane, at the end
    face: np.ndarray  # point on the column face
    column_axis_point: np.ndarray  # a point of the column's centreline

    def depth_below_top(self, p) -> float:
        """How far a point lies below the top face of the beam (mm; negative above)."""
        return float((self.beam_top - np.asarray(p, dtype=float)).dot(self.n))

    def column_lateral_offset(self) -> float:
        """Lateral offset of the beam's centreline from the column's web plane (mm)."""
        return float((self.face - self.column_axis_point).dot(self.lat))


def unit(v) -> np.ndarray:
    """A vector scaled to unit length (zero stays zero)."""
    v = np.asarray(v, dtype=float)
    n = np.linalg.norm(v)
    return v / n if n else v


def joint_frame(j: Joint, beam: Member, column: Member) -> JointFrame:
    """The joint's own frame from the beam and the face point."""
    s, e = np.array(beam.start), np.array(beam.end)
    t = unit(e - s) if j.beam_end == "end" else unit(s - e)
    n = np.array(beam.depth_dir, dtype=float)
    n = unit(n - n.dot(t) * t)
    if n[2] < 0:
        n = -n
    lat = np.cross(t, n)
    face = np.array(j.point, dtype=float)
    return JointFrame(
        t=t,
        n=n,
        lat=lat,
        beam_top=face + n * beam.depth / 2,
        face=face,
        column_axis_point=np.array(column.start, dtype=float),
    )
