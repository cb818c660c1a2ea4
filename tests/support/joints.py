"""Random, well-detailed end-plate joints for invariants and the engine benchmark.

A joint is built from a seed: catalogue sections, a bolt size and class, a plate, rows laid
out within EN 1993-1-8 Table 3.3's spacings and clear of the welds, and sometimes column
stiffeners. The numbers are a generator's, not a design: they exercise the engine over the
range real joints cover.
"""

from __future__ import annotations

import math
import random
from dataclasses import replace

from ifcjoint.catalogue.materials import steel_strength
from ifcjoint.catalogue.sections import ISection, catalogue
from ifcjoint.engine.inputs import (
    BoltsInput,
    EndPlateJointInput,
    MemberInput,
    PlateInput,
    StiffenerInput,
    WeldsInput,
)

#: Tensile stress areas of ISO metric coarse threads, mm2 (ISO 898-1; from memory).
STRESS_AREA = {16: 157.0, 20: 245.0, 22: 303.0, 24: 353.0, 27: 459.0, 30: 561.0}
#: fub of the bolt classes, MPa (EN 1993-1-8 Table 3.1).
FUB = {"8.8": 800.0, "10.9": 1000.0}

_COLUMNS = [k for k in catalogue() if k.startswith(("HEA", "HEB", "HEM", "UC"))]
_BEAMS = [k for k in catalogue() if k.startswith(("IPE", "UB"))]


def member(name: str, grade: str, *, span: float | None = None) -> MemberInput:
    """A catalogue section as an engine member, strengths from EN 1993-1-1 Table 3.1."""
    s: ISection = catalogue()[name]
    st = steel_strength(grade, s.tf)
    return MemberInput(
        name=name, grade=grade, h=s.h, b=s.b, tw=s.tw, tf=s.tf, r=s.r, fy=st.fy, fu=st.fu,
        span=span, Iy=s.Iy, Wpl_y=s.Wpl_y,
    )


def _d0(d: int) -> float:
    """Normal clearance hole, EN 1090-2 (from memory): d + 2 up to M24, d + 3 above."""
    return d + 2.0 if d <= 24 else d + 3.0


def random_end_plate_joint(seed: int) -> EndPlateJointInput | None:
    """A random end-plate joint, or None when the draw cannot be detailed (caller redraws)."""
    rnd = random.Random(seed)
    grade = rnd.choice(["S235", "S275", "S355"])
    col = member(rnd.choice(_COLUMNS), grade)
    beam = member(rnd.choice(_BEAMS), rnd.choice(["S275", "S355"]),
                  span=rnd.uniform(4000, 12000))
    if beam.h < 240 or beam.b > col.b + 1e-6:
        return None
    d = rnd.choice([16, 20, 24, 27, 30])
    d0 = _d0(d)
    a_f = rnd.choice([6.0, 7.0, 8.0, 10.0])
    a_w = rnd.choice([4.0, 5.0, 6.0])
    tp = float(rnd.choice([12, 15, 20, 25, 30]))
    bp = min(col.b, beam.b + rnd.choice([0.0, 10.0, 20.0, 40.0]))
    # Gauge: bolts clear of the web welds and the column root (m > 0 with room for a nut),
    # edge distances at least 1.25 d0 on plate and column flange.
    low = max(2.4 * d0 + 1, beam.tw + 2 * (0.8 * a_w * math.sqrt(2)) + 2 * d,
              col.tw + 2 * 0.8 * col.r + 2 * d)
    high = min(bp, col.b) - 2 * 1.25 * d0
    if low > high:
        return None
    gauge = round(rnd.uniform(low, high) / 5) * 5
    gauge = min(max(gauge, low), high)
    extended = rnd.random() < 0.6
    leg_f = a_f * math.sqrt(2)
    pitch = max(2.2 * d0 + 1, rnd.choice([3.0, 3.5, 4.0]) * d)
    rows = []
    proj_top = proj_bottom = rnd.choice([10.0, 15.0])
    if extended:
        mx = rnd.uniform(max(1.5 * d, 0.8 * leg_f + d), 2.2 * d + 0.8 * leg_f)
        ex = rnd.uniform(1.25 * d0, 2.0 * d0)
        rows.append(-(mx + 0.8 * leg_f))
        proj_top = -rows[0] + ex
    z = beam.tf + 0.8 * leg_f + rnd.uniform(1.5 * d, 2.5 * d)
    n_rows = rnd.choice([1, 2, 3])
    for _ in range(n_rows):
        if z > beam.h / 2 - beam.tf:
            break
        rows.append(z)
        z += pitch
    rows.append(beam.h - beam.tf - 0.8 * leg_f - rnd.uniform(1.5 * d, 2.5 * d))  # shear row
    if len(rows) < 2 or rows[-1] - rows[-2] < 2.2 * d0:
        return None
    fy_p = steel_strength(grade, tp)
    plate = PlateInput(grade=grade, tp=tp, bp=bp, hp=beam.h + proj_top + proj_bottom,
                       fy=fy_p.fy, fu=fy_p.fu, projection_top=proj_top,
                       projection_bottom=proj_bottom)
    cls = rnd.choice(["8.8", "10.9"])
    bolts = BoltsInput(d=d, grade=cls, fub=FUB[cls], As=STRESS_AREA[d], d0=d0, gauge=gauge,
                       rows_from_beam_top=tuple(rows))
    welds = WeldsInput(top_flange_throat=a_f, bottom_flange_throat=a_f, web_throat=a_w,
                       assumed=False)
    inp = EndPlateJointInput(column=col, beam=beam, plate=plate, bolts=bolts, welds=welds,
                             beta=rnd.choice([0.0, 1.0]))
    kind = rnd.random()
    if kind < 0.3:
        inp = replace(inp, stiffeners=stiffeners_for(inp, rnd.random() < 0.5,
                                                     rnd.random() < 0.7))
    return inp


def stiffeners_for(inp: EndPlateJointInput, tension: bool, compression: bool,
                   t: float | None = None) -> tuple[StiffenerInput, ...]:
    """Pairs of full-width stiffeners in line with the beam flanges (outstand within 14 eps)."""
    col, beam = inp.column, inp.beam
    b = (col.b - col.tw) / 2 - 5
    eps = math.sqrt(235 / col.fy)
    t = t or max(beam.tf, math.ceil(b / (14 * eps)))
    out = []
    if tension:
        out.append(StiffenerInput(level=beam.tf / 2, t=t, b=b, fy=col.fy, snipe=max(col.r, 15),
                                  weld_leg=8))
    if compression:
        out.append(StiffenerInput(level=beam.h - beam.tf / 2, t=t, b=b, fy=col.fy,
                                  snipe=max(col.r, 15), weld_leg=8))
    return tuple(out)


def random_joints(n: int, start: int = 0) -> list[EndPlateJointInput]:
    """n random joints (seeds from ``start``; draws that cannot be detailed are skipped)."""
    out: list[EndPlateJointInput] = []
    seed = start
    while len(out) < n:
        j = random_end_plate_joint(seed)
        seed += 1
        if j is not None:
            out.append(j)
    return out
