"""Whole-run benchmark: open, scan and check with every output, on generated steel models.

Not part of the test suite. Run:
    python bench/bench_models.py [--sizes 1000 5000 10000 50000] [--keep DIR]

Models are generated (sample_models/generate.py: uniform frames, 5 storeys, plates and bolts
at every joint, no relationships) and kept in --keep between runs (generation is slow). Each
measurement runs in a fresh process (imports not timed), in CPU seconds, with the process's
peak resident memory: a bare ``ifcopenshell.open``, ``scan``, and ``check`` with demands and
every output (JSON, CSV, issues, BCF, IFC copy, HTML, Markdown). Ratios are taken within one
run (absolute times vary on a shared machine).
"""

from __future__ import annotations

import argparse
import json
import subprocess
import sys
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT))

CHILD = r"""
import sys, time, resource, json
what, path, out = sys.argv[1], sys.argv[2], sys.argv[3]
import ifcopenshell
import ifcjoint
from ifcjoint.pipeline import scan, check_scan
from ifcjoint.report.outputs import write_outputs
from ifcjoint.tables.demands import read_demands
t = time.process_time()
if what == "open":
    f = ifcopenshell.open(path)
    res = {"products": len(f.by_type("IfcProduct"))}
elif what == "scan":
    r = scan(path)
    res = {"joints": len(r.joints), "members": len(r.model.members)}
else:
    sc = scan(path)
    dem = out + "/demands.csv"
    with open(dem, "w") as fh:
        fh.write("joint_id,combination,M_Ed_kNm,V_Ed_kN\n")
        fh.writelines(f"{j.id},ULS,-60,40\n" for j in sc.joints)
    mc = check_scan(sc, read_demands(dem, sc.joints))
    targets = {k: f"{out}/o.{e}" for k, e in (("json", "json"), ("csv", "csv"),
               ("issues", "issues.csv"), ("bcf", "bcf"), ("ifc", "ifc"), ("html", "html"),
               ("md", "md"))}
    write_outputs(mc.results, targets)
    res = {"checked": mc.counts()["pass"] + mc.counts()["fail"]}
res["cpu_s"] = time.process_time() - t
res["peak_mb"] = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024
print(json.dumps(res))
"""


def run_child(what: str, path: Path, out: Path) -> dict:
    p = subprocess.run([sys.executable, "-c", CHILD, what, str(path), str(out)],
                       capture_output=True, text=True, check=True, cwd=ROOT)
    return json.loads(p.stdout.strip().splitlines()[-1])


def model(size: int, keep: Path) -> Path:
    from bench.bench_scan import bays_for
    from sample_models.generate import Options, build

    path = keep / f"frame-{size}.ifc"
    if not path.exists():
        n = bays_for(size, 5)
        t = time.perf_counter()
        build(Options(demo_details=False, detail_parts=True, bays_x=n, bays_y=n, storeys=5,
                      relations="none"), path)
        print(f"generated {path.name} in {time.perf_counter() - t:.0f} s", flush=True)
    return path


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--sizes", type=int, nargs="+", default=[1000, 5000, 10000])
    ap.add_argument("--keep", type=Path, default=None, help="folder keeping generated models")
    args = ap.parse_args()
    keep = args.keep or Path(tempfile.mkdtemp(prefix="ifcjoint-bench-"))
    keep.mkdir(parents=True, exist_ok=True)
    rows = []
    for size in args.sizes:
        path = model(size, keep)
        with tempfile.TemporaryDirectory() as out:
            o = run_child("open", path, Path(out))
            s = run_child("scan", path, Path(out))
            c = run_child("check", path, Path(out))
        row = {"members": s["members"], "joints": s["joints"], "products": o["products"],
               "mb": path.stat().st_size / 1e6, "open": o["cpu_s"], "scan": s["cpu_s"],
               "check": c["cpu_s"], "open_mb": o["peak_mb"], "scan_mb": s["peak_mb"],
               "check_mb": c["peak_mb"]}
        rows.append(row)
        print(row, flush=True)
    print()
    print("| members | joints | file MB | open s | scan s | scan/open | check+outputs s | "
          "check/open | peak MB open / scan / check |")
    print("|---:|---:|---:|---:|---:|---:|---:|---:|---|")
    for r in rows:
        print(f"| {r['members']} | {r['joints']} | {r['mb']:.0f} | {r['open']:.1f} | "
              f"{r['scan']:.1f} | {r['scan'] / r['open']:.1f} | {r['check']:.1f} | "
              f"{r['check'] / r['open']:.1f} | {r['open_mb']:.0f} / {r['scan_mb']:.0f} / "
              f"{r['check_mb']:.0f} |")
    if len(rows) >= 2:
        a, b = rows[0], rows[-1]
        print(f"\ncheck time {b['check'] / a['check']:.1f} x for {b['members'] / a['members']:.1f}"
              " x the members")


if __name__ == "__main__":
    main()
