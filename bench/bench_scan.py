"""Scan benchmark: generated frames of growing size, scan time vs a bare ifcopenshell.open.

Not part of the test suite. Run:  python bench/bench_scan.py [--sizes 2500 5000 10000]
Prints one line per size and a Markdown table for docs/performance.md.
"""

from __future__ import annotations

import argparse
import math
import subprocess
import sys
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT))

CHILD = r"""
import sys, time, resource, json
what, path = sys.argv[1], sys.argv[2]
import ifcopenshell
from ifcjoint.pipeline import scan
t = time.perf_counter()  # imports are not timed: only the work on the file
if what == "open":
    f = ifcopenshell.open(path)
    n = len(f.by_type("IfcProduct"))
    out = {"n": n}
else:
    r = scan(path)
    out = {"joints": len(r.joints), "members": len(r.model.members),
           "unreadable": len(r.model.unreadable)}
out["seconds"] = time.perf_counter() - t
out["peak_mb"] = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024
print(json.dumps(out))
"""


def bays_for(members: int, storeys: int) -> int:
    # members ~ (n+1)^2 columns + 2 n (n+1) storeys beams
    n = 1
    while (n + 1) ** 2 + 2 * n * (n + 1) * storeys < members:
        n += 1
    return n


def run_child(what: str, path: Path) -> dict:
    import json

    out = subprocess.run([sys.executable, "-c", CHILD, what, str(path)], capture_output=True,
                         text=True, check=True, cwd=ROOT)
    return json.loads(out.stdout.strip().splitlines()[-1])


def main() -> None:
    from sample_models.generate import Options, build

    ap = argparse.ArgumentParser()
    ap.add_argument("--sizes", type=int, nargs="+", default=[2500, 5000, 10000])
    ap.add_argument("--storeys", type=int, default=5)
    ap.add_argument("--repeat", type=int, default=3)
    ap.add_argument("--detailed", action="store_true",
                    help="also model end plates and bolts at every joint (much larger files)")
    args = ap.parse_args()
    rows = []
    with tempfile.TemporaryDirectory() as tmp:
        for size in args.sizes:
            n = bays_for(size, args.storeys)
            path = Path(tmp) / f"frame-{size}.ifc"
            t = time.perf_counter()
            build(Options(demo_details=False, detail_parts=args.detailed, bays_x=n, bays_y=n,
                          storeys=args.storeys, relations="none"), path)
            gen = time.perf_counter() - t
            opens = [run_child("open", path) for _ in range(args.repeat)]
            scans = [run_child("scan", path) for _ in range(args.repeat)]
            o = min(x["seconds"] for x in opens)
            s = min(x["seconds"] for x in scans)
            row = {
                "target_members": size, "members": scans[0]["members"],
                "products": opens[0]["n"], "joints": scans[0]["joints"],
                "file_mb": path.stat().st_size / 1e6, "open_s": o, "scan_s": s,
                "ratio": s / o, "peak_mb": max(x["peak_mb"] for x in scans),
                "generate_s": gen,
            }
            rows.append(row)
            print(row, flush=True)
    print()
    print("| members | products | joints | file MB | bare open s | scan s | scan/open | "
          "peak MB |")
    print("|---:|---:|---:|---:|---:|---:|---:|---:|")
    for r in rows:
        print(f"| {r['members']} | {r['products']} | {r['joints']} | {r['file_mb']:.1f} | "
              f"{r['open_s']:.2f} | {r['scan_s']:.2f} | {r['ratio']:.2f} | {r['peak_mb']:.0f} |")
    if len(rows) >= 2:
        a, b = rows[0], rows[-1]
        k = math.log(b["scan_s"] / a["scan_s"]) / math.log(b["members"] / a["members"])
        print(f"\nscan time grows as members^{k:.2f} between {a['members']} and {b['members']}")


if __name__ == "__main__":
    main()
