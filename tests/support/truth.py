"""Compare a scan with the generator's sidecar truth (never with earlier scanner output)."""

from __future__ import annotations

import math
from dataclasses import dataclass, field

import numpy as np

from ifcjoint.model.joints import ScanResult

#: Defects the generator plants -> the finding code that must flag them.
DEFECT_CODES = {
    "edge_distance": "edge_distance_min",
    "pitch": "pitch_min",
    "plate_wider_than_column_flange": "plate_wider_than_column_flange",
    "bolt_too_short": "bolt_too_short",
    "plate_without_bolts": "plate_without_bolts",
    "bolts_without_plate": "bolts_without_plate",
    "gap_to_column": "gap_to_column",
}


@dataclass
class Comparison:
    missing: list = field(default_factory=list)  # truth joints not found
    extra: list = field(default_factory=list)  # found joints not in truth
    wrong_column: list = field(default_factory=list)
    wrong_axis: list = field(default_factory=list)
    wrong_parts: list = field(default_factory=list)
    wrong_guess: list = field(default_factory=list)
    wrong_partner: list = field(default_factory=list)
    wrong_other: list = field(default_factory=list)
    missed_defects: list = field(default_factory=list)  # planted, not flagged
    false_findings: list = field(default_factory=list)  # flagged, not planted
    n_truth: int = 0

    def problems(self) -> dict:
        return {k: v for k, v in vars(self).items() if isinstance(v, list) and v}


def end_map(result: ScanResult, truth: dict) -> dict[tuple[str, str], str]:
    """Map truth (beam, end) to the scanner's end name by geometry.

    The truth's end points are in the unrotated frame; rotation and offset are rigid, so the
    scanner's end whose distance to the *other* truth end matches is found by comparing each
    beam's two end points with the truth's after fitting the rigid plan transform.
    """
    # Collect truth points and scanned points per (beam, end).
    tp, sp = [], []
    members = {m.guid: m for m in result.model.members}
    recs = truth["joints"] + truth["other_beam_ends"]
    for r in recs:
        m = members.get(r["beam"])
        if m is None:
            continue
        tp.append(r["end_point_mm"])
        sp.append((m.start, m.end))
    tp = np.array(tp)
    # Fit plan rotation + offset from the options (known to the generator).
    opt = truth["options"]
    rot = math.radians(opt.get("rotation_deg", 0.0))
    off = np.array([*opt.get("offset", (0.0, 0.0)), 0.0])
    c, s = math.cos(rot), math.sin(rot)
    R = np.array([[c, -s, 0], [s, c, 0], [0, 0, 1.0]])
    out = {}
    for r in recs:
        m = members.get(r["beam"])
        if m is None:
            continue
        p = R @ np.array(r["end_point_mm"]) + off
        ds = np.linalg.norm(np.array(m.start) - p)
        de = np.linalg.norm(np.array(m.end) - p)
        # end_point_mm is the top-of-steel point; the scanner's is the section centre.
        out[(r["beam"], r["beam_end"])] = "start" if ds < de else "end"
    return out


def compare(result: ScanResult, truth: dict) -> Comparison:
    emap = end_map(result, truth)
    cmp = Comparison(n_truth=len(truth["joints"]))
    found = {(j.beam, j.beam_end): j for j in result.joints}
    ids = {(j.beam, j.beam_end): j.id for j in result.joints}
    expected_keys = set()
    for t in truth["joints"]:
        key = (t["beam"], emap.get((t["beam"], t["beam_end"]), t["beam_end"]))
        expected_keys.add(key)
        j = found.get(key)
        if j is None:
            cmp.missing.append(t["key"])
            continue
        if j.column != t["column"]:
            cmp.wrong_column.append(t["key"])
        if j.axis != t["axis"]:
            cmp.wrong_axis.append(t["key"])
        plates = sorted(p.guid for p in j.plates)
        bolts = sorted(b.guid for b in j.fasteners if b.role == "bolt")
        welds = sorted(b.guid for b in j.fasteners if b.role == "weld")
        if plates != t["plates"] or bolts != t["bolts"] or welds != t["welds"]:
            cmp.wrong_parts.append(
                (t["key"], {"plates": (len(plates), len(t["plates"])),
                            "bolts": (len(bolts), len(t["bolts"])),
                            "welds": (len(welds), len(t["welds"]))}))
        want_arch = t.get("archetype", t["first_guess"])
        if j.archetype != want_arch:
            cmp.wrong_guess.append((t["key"], j.archetype, want_arch, j.archetype_reason))
        expected = {DEFECT_CODES[d] for d in t["defects"]}
        if truth["options"].get("anonymous_fasteners") and t["bolts"]:
            expected.add("bolt_class_missing")  # the names say nothing of the class
        got = {f.code for f in j.findings}
        cmp.missed_defects += [(t["key"], c) for c in sorted(expected - got)]
        cmp.false_findings += [(t["key"], c) for c in sorted(got - expected)]
        want = None
        if t["partner"]:
            pk = (t["partner"]["beam"],
                  emap.get((t["partner"]["beam"], t["partner"]["beam_end"])))
            want = ids.get(pk)
        if j.partner != want:
            cmp.wrong_partner.append(t["key"])
    for key in found:
        if key not in expected_keys:
            cmp.extra.append(key)
    others = {(o.beam, o.beam_end): o for o in result.other_beam_ends}
    for t in truth["other_beam_ends"]:
        key = (t["beam"], emap.get((t["beam"], t["beam_end"]), t["beam_end"]))
        o = others.get(key)
        if o is None or o.kind != t["kind"] or (t["other"] and o.other != t["other"]):
            cmp.wrong_other.append((t["beam"], t["beam_end"], t["kind"],
                                    o.kind if o else None))
    return cmp
