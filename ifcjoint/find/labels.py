"""Readable joint labels: storey and grid cell when the model has a grid, else coordinates."""

from __future__ import annotations

from collections.abc import Sequence

import numpy as np

from ifcjoint.find.frames import unit
from ifcjoint.model.elements import Member, ModelContents


class GridLabeller:
    """Readable labels: storey and grid cell when the model has a grid, else coordinates."""

    def __init__(self, model: ModelContents, snap: float = 500.0) -> None:
        self.axes = list(model.grid_axes)
        self.snap = snap
        if self.axes:
            self.p0 = np.array([a.p0 for a in self.axes])
            d = np.array([a.p1 for a in self.axes]) - self.p0
            self.d = unit(d)
            self.fam = np.array([a.family for a in self.axes])
            self.tags = [a.tag for a in self.axes]

    def labels(
        self, storeys: Sequence[str], points: np.ndarray, columns: Sequence[Member | None]
    ) -> list[str]:
        """Labels for many points at once (vectorised over points and grid lines)."""
        p = np.asarray(points, dtype=float).reshape(-1, 3).copy()
        has = np.array([c is not None for c in columns], dtype=bool)
        if has.any():
            cs = np.array([c.start if c is not None else (0, 0, 0) for c in columns], float)
            ce = np.array([c.end if c is not None else (0, 0, 1) for c in columns], float)
            w = unit(ce - cs)
            proj = cs + w * ((p - cs) * w).sum(1, keepdims=True)
            p[has] = proj[has]
        wheres: list[str | None] = [None] * len(p)
        if self.axes and len(p):
            rel = p[:, None, :2] - self.p0[None, :, :]
            dist = np.abs(rel[..., 0] * self.d[None, :, 1] - rel[..., 1] * self.d[None, :, 0])
            fam_tags = []
            fams = []
            for fam in ("U", "V", "W"):
                cols = np.flatnonzero(self.fam == fam)
                if not len(cols):
                    continue
                fams.append(fam)
                dd = dist[:, cols]
                best = dd.argmin(1)
                ok = dd[np.arange(len(p)), best] <= self.snap
                fam_tags.append((cols[best], ok))
            for i in range(len(p)):
                parts = [self.tags[idx[i]] for idx, ok in fam_tags if ok[i]]
                if len(parts) >= 2:
                    wheres[i] = "/".join(parts)
                elif len(parts) == 1 and len(fam_tags) >= 2:
                    # on one grid line between two of the other family (a secondary beam's
                    # end on a main beam, a splice): that line and the bay, e.g. "1-2/A"
                    on = next(f for f, (idx, ok) in zip(fams, fam_tags, strict=True) if ok[i])
                    across = next(f for f in fams if f != on)
                    bay = self._bay(rel[i], family=across)
                    if bay:  # in the families' order, as a grid cell reads ("3-4/C")
                        tags = {on: parts[0], across: bay}
                        wheres[i] = "/".join(tags[f] for f in fams if f in tags)
        out = []
        for i, st in enumerate(storeys):
            where = wheres[i] or f"({p[i, 0]:.0f}, {p[i, 1]:.0f}, {p[i, 2]:.0f})"
            out.append(f"{st} {where}".strip() if st else where)
        return out

    def _bay(self, rel: np.ndarray, family: str) -> str | None:
        """The two lines of a family on either side of a point (``1-2``), or None."""
        cols = np.flatnonzero(self.fam == family)
        d = self.d[cols]
        d = d * np.sign(d @ d[0])[:, None]  # one sense for the family's parallel lines
        signed = rel[cols, 0] * d[:, 1] - rel[cols, 1] * d[:, 0]
        below, above = signed < 0, signed > 0
        if not below.any() or not above.any():
            return None
        a = cols[below][np.argmax(signed[below])]
        b = cols[above][np.argmin(signed[above])]
        ta, tb = sorted((self.tags[a], self.tags[b]))
        return f"{ta}-{tb}"
