"""Report benchmark: check a generated frame of about N joints and time/size the HTML report.

Not part of the test suite. Run:  python bench/bench_report.py [--joints 2000]
The frame is uniform (welded major-axis joints, fin plates on column webs); every joint gets
one invented demand row (the same hogging moment and shear) so that every checkable joint
has a calculation sheet with its M-phi plot.
"""

from __future__ import annotations

import argparse
import sys
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT))


def main() -> None:
    from bench.bench_scan import bays_for
    from ifcjoint.pipeline import check_scan, scan
    from ifcjoint.report.html import write_html
    from ifcjoint.report.results import build_results
    from ifcjoint.tables.demands import read_demands
    from sample_models.generate import Options, build

    ap = argparse.ArgumentParser()
    ap.add_argument("--joints", type=int, default=2000)
    ap.add_argument("--keep", help="also copy the report here (to open it in a browser)")
    args = ap.parse_args()
    storeys = 5
    n = bays_for(int(args.joints / 1.8), storeys)
    with tempfile.TemporaryDirectory() as d:
        model = Path(d) / "frame.ifc"
        build(Options(bays_x=n, bays_y=n, storeys=storeys, demo_details=False,
                      detail_parts=False), model)
        t0 = time.perf_counter()
        sc = scan(model)
        t1 = time.perf_counter()
        dem = Path(d) / "demands.csv"
        rows = ["joint_id,combination,M_Ed_kNm,V_Ed_kN"]
        rows += [f"{j.id},ULS,-120,90" for j in sc.joints]
        dem.write_text("\n".join(rows) + "\n")
        table = read_demands(dem, sc.joints)
        mc = check_scan(sc, table)
        t2 = time.perf_counter()
        data = build_results(mc)
        t3 = time.perf_counter()
        size = write_html(data, Path(d) / "report.html")["bytes"]
        t4 = time.perf_counter()
        if args.keep:
            Path(args.keep).write_bytes((Path(d) / "report.html").read_bytes())
        c = mc.counts()
        print(f"joints {len(sc.joints)} (checked {c['pass'] + c['fail']}); scan {t1 - t0:.1f} s, "
              f"check {t2 - t1:.1f} s, results dict {t3 - t2:.1f} s, HTML {t4 - t3:.1f} s, "
              f"{size / 1e6:.1f} MB")


if __name__ == "__main__":
    main()
