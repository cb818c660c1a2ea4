"""Write the demo's design forces (an invented load scenario) as a demands CSV.

The Kestrel Lane workshop demo: beams along X span 6 m. Factored line loads (invented for the
demo, not from any project): first floor 30 kN/m on the edge lines A and C, 62 kN/m on line B
(a heavy storage mezzanine); roof 18 kN/m on A and C, 34 kN/m on B. Two combinations:

* ``ULS-1 gravity``: fixed-end moments w L^2 / 12 (hogging) and shears w L / 2;
* ``ULS-2 sway``: 80 % of the gravity moment plus a sway moment of 60 kNm (first floor) or
  35 kNm (roof), adding at one end of a beam and subtracting at the other (sagging where
  the sway moment exceeds the gravity moment).

Beams along Y (5 m, fin plates on the column webs) are secondary beams analysed as pinned:
shear only, 10 kN/m on the first floor and 6 kN/m on the roof (invented), V = w L / 2 in
ULS-1 and 80 % of it in ULS-2, no moment. The secondary beam between lines A and B (fin
plates on the main beams' webs) carries 14 kN/m over its 5 m the same way (invented).

The bolted splice at mid-span of the roof beam on line C, bay 3 takes w L^2 / 24 of that
line's load as a sagging moment (80 % in ULS-2) and no shear; it was assumed rigid.

The analysis assumed rigid joints on line A of the first floor (to show the assumption check)
and semi-rigid elsewhere; roof line C and the cantilever are left out ("analysis pending"), so
those joints stay unchecked. Reads the generator's truth file so it does not depend on ifcjoint.

Run: ``python sample_models/demo_demands.py`` (rewrites kestrel-workshop-demands.csv).
"""

from __future__ import annotations

import csv
import io
import json
from pathlib import Path

HERE = Path(__file__).parent
SPAN_M = 6.0
LOADS = {  # (level, line) -> factored line load, kN/m (invented)
    (0, 0): 30.0, (0, 1): 62.0, (0, 2): 30.0,
    (1, 0): 18.0, (1, 1): 34.0, (1, 2): 18.0,
}
SWAY = {0: 60.0, 1: 35.0}
SPAN_Y_M = 5.0
LOADS_Y = {0: 10.0, 1: 6.0}  # kN/m on the pinned secondary beams along Y (invented)
LOAD_SECONDARY = 14.0  # kN/m on the secondary beam framing into the main beams (invented)
PENDING = {(1, 2)}  # roof line C: no forces yet
HEADER = (
    "# Kestrel Lane cycle workshop (invented demo): design forces from an invented analysis.\n"
    "# M_Ed < 0 hogging; kNm, kN. See docs/demands.md.\n"
)


def rows(truth: dict) -> list[list[str]]:
    """One row per joint and combination, in the truth's joint order."""
    by_key = {j["key"]: j for j in truth["joints"]}
    out = []
    for j in truth["joints"]:
        parts = j["key"].split("/")
        if parts[0] in ("Y", "secondary"):
            load = LOADS_Y[int(parts[1])] if parts[0] == "Y" else LOAD_SECONDARY
            v = load * SPAN_Y_M / 2.0
            for comb, f in (("ULS-1 gravity", 1.0), ("ULS-2 sway", 0.8)):
                out.append(["", j["beam"], j["beam_end"], comb, "0.0", f"{f * v:.1f}", "0", "",
                            "braced", "pinned"])
            continue
        if j["key"].endswith("/splice"):
            # mid-span of a fixed-end span: w L^2 / 24 sagging, no shear; designed continuous
            m = LOADS[(int(parts[1]), int(parts[2]))] * SPAN_M**2 / 24.0
            for comb, f in (("ULS-1 gravity", 1.0), ("ULS-2 sway", 0.8)):
                out.append(["", j["beam"], j["beam_end"], comb, f"{f * m:.1f}", "0.0", "0", "",
                            "braced", "rigid"])
            continue
        if parts[0] != "X" or j["axis"] != "major":
            continue
        level, line = int(parts[1]), int(parts[2])
        if (level, line) in PENDING:
            continue
        w = LOADS[(level, line)]
        m_g = w * SPAN_M**2 / 12.0
        v_g = w * SPAN_M / 2.0
        at_start = parts[-1] == "s"
        sway = SWAY[level] * (1 if at_start else -1)
        other = None
        if j.get("partner"):
            p = j["partner"]
            pk = next(k for k, x in by_key.items()
                      if x["beam"] == p["beam"] and x["beam_end"] == p["beam_end"])
            po = by_key[pk]
            pl, pn = int(pk.split("/")[1]), int(pk.split("/")[2])
            other = (LOADS[(pl, pn)] * SPAN_M**2 / 12.0, po["key"].endswith("/s"))
        assumed = "rigid" if (level, line) == (0, 0) else "semi-rigid"
        for comb, m, v, m_other in (
            ("ULS-1 gravity", -m_g, v_g, None if other is None else -other[0]),
            (
                "ULS-2 sway",
                -0.8 * m_g + sway,
                0.8 * v_g,
                None if other is None
                else -0.8 * other[0] + SWAY[level] * (1 if other[1] else -1),
            ),
        ):
            out.append([
                "", j["beam"], j["beam_end"], comb, f"{m:.1f}", f"{v:.1f}", "0",
                "" if m_other is None else f"{m_other:.1f}", "braced", assumed,
            ])
    return out


def main() -> None:
    truth = json.loads((HERE / "kestrel-workshop-ifc4-mm.truth.json").read_text())
    buf = io.StringIO()
    buf.write(HEADER)
    w = csv.writer(buf, lineterminator="\n")
    w.writerow(["joint_id", "beam_guid", "beam_end", "combination", "M_Ed_kNm", "V_Ed_kN",
                "N_Ed_kN", "M_Ed_other_side_kNm", "frame", "assumed_joint"])
    w.writerows(rows(truth))
    (HERE / "kestrel-workshop-demands.csv").write_text(buf.getvalue())
    print(f"wrote {HERE / 'kestrel-workshop-demands.csv'}")


if __name__ == "__main__":
    main()
