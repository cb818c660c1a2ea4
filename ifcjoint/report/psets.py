"""The results as IFC property sets: which sets, on which elements, with which typed values.

Each joint's beam gets one set per checked end (``ifcjoint_JointAtStart`` /
``ifcjoint_JointAtEnd``); an ``IfcElementAssembly`` that holds the joint's plates or bolts
gets ``ifcjoint_Joint``. ``ifcjoint.ifc.writer.write_property_sets`` writes them.
"""

from __future__ import annotations

from pathlib import Path

from ifcjoint.ifc.writer import PsetRequest, write_property_sets
from ifcjoint.report.results import cite

PSET_PREFIX = "ifcjoint_"
PSET_BEAM_END = {"start": "ifcjoint_JointAtStart", "end": "ifcjoint_JointAtEnd"}
PSET_ASSEMBLY = "ifcjoint_Joint"


def _values(j: dict, results: dict) -> tuple:
    """(name, IFC type, value, unit kind) of one joint; the writer drops empty values."""
    c = j["check"]
    g = c["governing"]
    rr = c["resistance"] or {}
    cls = c["classification"] or {}
    ck = results["check"]
    return (
        ("JointId", "IfcIdentifier", j["id"], None),
        ("Label", "IfcLabel", j["label"][:255], None),
        ("Archetype", "IfcLabel", j["archetype"], None),
        ("Status", "IfcLabel", c["status"], None),
        ("StatusReason", "IfcText", c["status_reason"] or None, None),
        ("MaxUtilisation", "IfcRatioMeasure", c["utilisation"], None),
        ("GoverningCheck", "IfcLabel", None if g is None else g["name"], None),
        ("GoverningClause", "IfcLabel", None if g is None else cite(results, g["clause"]), None),
        ("GoverningCombination", "IfcLabel", None if g is None else g["combination"], None),
        ("MjRdHogging", "IfcTorqueMeasure", rr.get("Mj_Rd_hogging_kNm"), "moment"),
        ("MjRdSagging", "IfcTorqueMeasure", rr.get("Mj_Rd_sagging_kNm"), "moment"),
        ("VjRd", "IfcForceMeasure", rr.get("Vj_Rd_kN"), "force"),
        ("SjIni", "IfcRotationalStiffnessMeasure", rr.get("Sj_ini_kNm_per_rad"), "rot"),
        ("StiffnessClass", "IfcLabel", cls.get("stiffness"), None),
        ("StrengthClass", "IfcLabel", cls.get("strength"), None),
        ("FindingCount", "IfcInteger", len(j["findings"]), None),
        ("ProblemCount", "IfcInteger", len(c["problems"]), None),
        ("ToolVersion", "IfcLabel", f"ifcjoint {ck['tool_version']}", None),
        ("CheckedOn", "IfcDateTime", ck["created"], None),
        ("InputFingerprint", "IfcIdentifier", c["fingerprint"], None),
    )


def pset_requests(results: dict) -> list[PsetRequest]:
    """One property set per checked beam end (and on the assembly holding its parts)."""
    return [
        PsetRequest(
            guid=j["beam"],
            name=PSET_BEAM_END[j["beam_end"]],
            key=f"{j['beam']}/{j['beam_end']}",
            values=_values(j, results),
            parts=tuple(p["guid"] for p in j["parts"]),
            assembly_name=PSET_ASSEMBLY,
        )
        for j in results["joints"]
    ]


def write_results_ifc(
    results: dict, path: str | Path, *, in_place: bool = False
) -> dict[str, int]:
    """A copy of the checked model with every joint's results as property sets.

    Raises:
        ifcjoint.errors.UsageError: the output is the input model (without ``in_place``).
        ifcjoint.errors.OutputError: the output cannot be written.
    """
    model = results["model"]["path"]
    return write_property_sets(model, path, pset_requests(results), in_place=in_place)
