"""Check-engine throughput on one core: end-plate joint checks per second.

Not part of the test suite. Run: python bench/bench_engine.py [--n 3000] [--repeat 5]

Two mixes, both from ``tests/support/joints.py`` (random well-detailed joints: catalogue
sections, M16-M30 bolts, flush and extended plates, a third with column stiffeners):

- distinct: every joint different, each checked by the engine (the worst case);
- model: the same number of joints drawn from a pool of 200 designs, checked through the
  engine cache a model check uses (``ifcjoint.engine.verify.run_engine``): a building repeats
  its joints, and equal inputs run once.

Each mix is timed ``--repeat`` times (CPU time of this process, the alpha cache emptied
before each run) and the best run is reported; the target is 5,000 checks/s on one core.
"""

from __future__ import annotations

import argparse
import random
import sys
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT))

TARGET = 5000


def _best_rate(run, n: int, repeat: int) -> float:
    from ifcjoint.ec3.effective_lengths import alpha_fig_6_11

    best = 0.0
    for _ in range(repeat):
        alpha_fig_6_11.cache_clear()
        t = time.process_time()
        run()
        best = max(best, n / max(time.process_time() - t, 1e-9))
    return best


def main() -> None:
    from ifcjoint.engine.end_plate import check_end_plate_joint
    from ifcjoint.engine.verify import run_engine
    from tests.support.joints import random_joints

    ap = argparse.ArgumentParser()
    ap.add_argument("--n", type=int, default=3000)
    ap.add_argument("--repeat", type=int, default=5)
    args = ap.parse_args()

    distinct = random_joints(args.n)
    pool = random_joints(200, start=10**6)
    rnd = random.Random(7)
    model = [rnd.choice(pool) for _ in range(args.n)]

    def run_distinct():
        for inp in distinct:
            check_end_plate_joint(inp)

    def run_model():
        cache: dict = {}
        for inp in model:
            run_engine(check_end_plate_joint, inp, cache)

    run_distinct()  # warm-up (imports, first calls)
    for name, run in (("distinct", run_distinct), ("model", run_model)):
        rate = _best_rate(run, args.n, args.repeat)
        flag = "meets" if rate >= TARGET else "below"
        print(f"{name:9s} {args.n} checks: {rate:7.0f} checks/s ({1e3 / rate:.3f} ms each; "
              f"both moment signs, Vj,Rd, Sj,ini) - {flag} the {TARGET}/s target")


if __name__ == "__main__":
    main()
