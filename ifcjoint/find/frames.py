"""Member frames as arrays, for vectorised tests in each member's own frame.

``u`` runs along the section width, ``v`` along its depth, ``w`` along the member's axis.
"""

from __future__ import annotations

import functools
from collections.abc import Sequence
from dataclasses import dataclass

import numpy as np
import shapely

from ifcjoint.catalogue.sections import find_designation, section_from_designation
from ifcjoint.model.elements import Member


def unit(v: np.ndarray) -> np.ndarray:
    """Rows of ``v`` scaled to unit length (zero rows stay zero)."""
    n = np.linalg.norm(v, axis=-1, keepdims=True)
    n = np.where(n == 0, 1.0, n)
    return v / n


@dataclass(slots=True)
class Frames:
    """Member frames as arrays: origin, u (width), v (depth), w (axis), length, sizes."""

    origin: np.ndarray
    u: np.ndarray
    v: np.ndarray
    w: np.ndarray
    length: np.ndarray
    half_b: np.ndarray
    half_h: np.ndarray
    half_tw: np.ndarray

    @classmethod
    def of(cls, members: Sequence[Member]) -> Frames:
        """The frames of some members (rows in the same order)."""
        if not members:
            z = np.zeros((0, 3))
            e = np.zeros(0)
            return cls(z, z, z, z, e, e, e, e)
        s = np.array([m.start for m in members], dtype=float)
        e = np.array([m.end for m in members], dtype=float)
        w = unit(e - s)
        v = np.array([m.depth_dir for m in members], dtype=float)
        v = unit(v - (v * w).sum(1, keepdims=True) * w)
        u = np.cross(v, w)
        h = np.array([m.depth for m in members], dtype=float)
        b = np.array([m.width for m in members], dtype=float)
        tw = np.array([web_thickness(m) for m in members], dtype=float)
        return cls(s, u, v, w, np.linalg.norm(e - s, axis=1), b / 2, h / 2, tw / 2)

    def local(self, idx: np.ndarray, pts: np.ndarray) -> np.ndarray:
        """Points in the frames of members ``idx`` (one member per point)."""
        d = pts - self.origin[idx]
        return np.stack(
            [(d * self.u[idx]).sum(1), (d * self.v[idx]).sum(1), (d * self.w[idx]).sum(1)], axis=1
        )

    def local_dir(self, idx: np.ndarray, dirs: np.ndarray) -> np.ndarray:
        """Directions in the frames of members ``idx``."""
        return np.stack(
            [(dirs * self.u[idx]).sum(1), (dirs * self.v[idx]).sum(1), (dirs * self.w[idx]).sum(1)],
            axis=1,
        )


@functools.lru_cache(maxsize=4096)
def _named_web(texts: tuple[str, ...]) -> float | None:
    designation = find_designation(*texts)
    sec = section_from_designation(designation) if designation else None
    return sec.tw if sec is not None else None


def web_thickness(m: Member) -> float:
    """A member's web thickness, mm.

    As read, else its named catalogue section's, else 6 % of its depth (common practice, no
    source: rolled I sections run 4-8 %).
    """
    if m.web_thickness:
        return m.web_thickness
    named = _named_web((m.profile_name, *m.texts))
    return named if named else 0.06 * m.depth


def plan_boxes(members: Sequence[Member], pad: float) -> np.ndarray:
    """Plan bounding boxes of the members' section boxes, padded, as shapely boxes."""
    if not members:
        return np.array([], dtype=object)
    f = Frames.of(members)
    s = f.origin
    e = s + f.w * f.length[:, None]
    ext = np.abs(f.u) * f.half_b[:, None] + np.abs(f.v) * f.half_h[:, None]
    lo = np.minimum(s, e) - ext - pad
    hi = np.maximum(s, e) + ext + pad
    return shapely.box(lo[:, 0], lo[:, 1], hi[:, 0], hi[:, 1])
