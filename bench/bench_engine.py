"""Check-engine throughput: four-row extended end-plate joints on one core.

Not part of the test suite. Run: python bench/bench_engine.py [--n 3000]
Inputs are the published example's joint (see tests/engine/test_check.py) with the plate
thickness varied so no result is reused.
"""

from __future__ import annotations

import argparse
import sys
import time
from dataclasses import replace
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT))


def main() -> None:
    from ifcjoint.engine.end_plate import check_end_plate_joint
    from tests.engine.test_end_plate import p398

    ap = argparse.ArgumentParser()
    ap.add_argument("--n", type=int, default=3000)
    args = ap.parse_args()
    from ifcjoint.catalogue.sections import ISection

    base = p398(beta=1.0)
    # as from a scan: the plastic moduli come with the sections
    for key in ("beam", "column"):
        m = getattr(base, key)
        wpl = ISection(h=m.h, b=m.b, tw=m.tw, tf=m.tf, r=m.r).Wpl_y
        base = replace(base, **{key: replace(m, Wpl_y=wpl)})
    inputs = [replace(base, plate=replace(base.plate, tp=15 + (i % 200) * 0.1))
              for i in range(args.n)]
    check_end_plate_joint(inputs[0])  # warm-up
    t = time.perf_counter()
    for inp in inputs:
        check_end_plate_joint(inp)
    dt = time.perf_counter() - t
    print(f"{args.n} checks in {dt:.2f} s: {args.n / dt:.0f} checks/s "
          f"({dt / args.n * 1e3:.3f} ms each; both moment signs, Vj,Rd, Sj,ini)")


if __name__ == "__main__":
    main()
