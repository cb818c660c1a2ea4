"""Re-run benchmark: a full check, then the check of a copy with one joint edited, --since.

Not part of the test suite. Run:
    python bench/bench_revisions.py [--size 5000] [--keep DIR]

The model is a generated uniform frame (as ``bench_models``: plates and bolts at every joint,
kept in --keep between runs). Each run is ``ifcjoint check MODEL --demands D --json R`` in a
fresh process, timed in CPU seconds (child process): the first with ``--keep-reads`` (as a
user starting a revision workflow), then the edited copy (one end plate thickened: its joint
changes, every other joint is unchanged) by a plain full check and by a check ``--since``
the first run's results, ``--repeat`` times back to back (CPU time on a shared machine
drifts: each pair's ratio is within one stretch of time). Prints the times, the ratios and
how many joints were carried over.
"""

from __future__ import annotations

import argparse
import json
import resource
import subprocess
import sys
import tempfile
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT))


def cpu_run(args: list[str]) -> float:
    """CPU seconds of one ifcjoint run in a fresh process (its children's usage)."""
    before = resource.getrusage(resource.RUSAGE_CHILDREN)
    p = subprocess.run([sys.executable, "-m", "ifcjoint", *args], capture_output=True,
                       text=True, cwd=ROOT)
    if p.returncode not in (0, 1):
        raise SystemExit(f"ifcjoint {' '.join(args)} failed ({p.returncode}): {p.stderr}")
    after = resource.getrusage(resource.RUSAGE_CHILDREN)
    return (after.ru_utime - before.ru_utime) + (after.ru_stime - before.ru_stime)


def edit_one_plate(model: Path, out: Path, guid: str) -> str:
    """A copy with one plate 5 mm thicker; returns its GlobalId."""
    import ifcopenshell

    f = ifcopenshell.open(str(model))
    plate = f.by_guid(guid)
    solid = plate.Representation.Representations[0].Items[0]
    solid.Depth = solid.Depth + 5.0
    f.write(str(out))
    return plate.GlobalId


def main() -> None:
    from bench.bench_models import model as make_model

    ap = argparse.ArgumentParser()
    ap.add_argument("--size", type=int, default=5000)
    ap.add_argument("--keep", type=Path, default=None, help="folder keeping generated models")
    ap.add_argument("--repeat", type=int, default=3, help="pairs of full check and re-run")
    args = ap.parse_args()
    keep = args.keep or Path(tempfile.mkdtemp(prefix="ifcjoint-bench-"))
    keep.mkdir(parents=True, exist_ok=True)
    path = make_model(args.size, keep)
    with tempfile.TemporaryDirectory() as tmp:
        t = Path(tmp)
        from ifcjoint.pipeline import scan

        joints = scan(path).joints
        dem = t / "demands.csv"
        dem.write_text("joint_id,combination,M_Ed_kNm,V_Ed_kN\n"
                       + "".join(f"{j.id},ULS,-60,40\n" for j in joints))
        edited = t / "edited.ifc"
        plate = next(j.plates[0] for j in joints if j.plates)  # a joint's end plate
        guid = edit_one_plate(path, edited, plate.guid if hasattr(plate, "guid") else plate)
        cache = t / "cache"  # the reads kept by the first run, for the re-run
        import os

        os.environ["IFCJOINT_CACHE_DIR"] = str(cache)
        first = cpu_run(["check", str(path), "--demands", str(dem), "--json", str(t / "a.json"),
                         "--keep-reads", "--fail-on", "never", "-q"])
        fulls, reruns = [], []
        for _ in range(args.repeat):  # pairs back to back: the machine's speed drifts
            fulls.append(cpu_run(["check", str(edited), "--demands", str(dem), "--json",
                                  str(t / "b0.json"), "--fail-on", "never", "-q"]))
            reruns.append(cpu_run(["check", str(edited), "--demands", str(dem), "--json",
                                   str(t / "b.json"), "--since", str(t / "a.json"),
                                   "--fail-on", "never", "-q"]))
        data = json.loads((t / "b.json").read_text())
        counts = data["check"]["comparison"]["counts"]
    print(f"model {path.name}: {len(joints)} joints; plate {guid} thickened by 5 mm")
    ratios = sorted(r / f for f, r in zip(fulls, reruns, strict=True))
    print(f"first check (keeping reads) {first:.1f} s")
    for k, (f, r) in enumerate(zip(fulls, reruns, strict=True), start=1):
        print(f"pair {k}: full check of the edited copy {f:.1f} s; re-run --since {r:.1f} s; "
              f"ratio {r / f:.2f}")
    print(f"median ratio {ratios[len(ratios) // 2]:.2f}, worst {ratios[-1]:.2f} (target < 0.33)")
    print(f"comparison: {counts}")
    print("notes: " + " | ".join(data["check"]["notes"]))


if __name__ == "__main__":
    main()
