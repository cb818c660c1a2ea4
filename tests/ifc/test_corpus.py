"""Every file of the shared corpus of real public IFC files scans without an uncaught error.

The corpus has no bolts or end plates; these tests show reading never breaks on real
conventions (ifczip, Brep-only members, mapped items, grid placements, inch and metre units).
Skipped when ../shared/ifc-corpus is absent.
"""

from __future__ import annotations

import json
from pathlib import Path

import jsonschema
import pytest

from ifcjoint.report.scan import build_scan
from tests.conftest import CORPUS, ROOT, corpus_files

SCHEMA = json.loads((ROOT / "docs" / "scan-json.schema.json").read_text())
FILES = corpus_files()

pytestmark = pytest.mark.skipif(not FILES, reason="../shared/ifc-corpus is not present")


@pytest.mark.parametrize("path", FILES, ids=lambda p: p.name)
def test_corpus_file_scans_and_json_validates(path: Path, scan_cached):
    result = scan_cached(path)
    data = build_scan(result)
    jsonschema.validate(data, SCHEMA)
    # Every beam end is accounted for exactly once.
    beams = [m for m in result.model.members if m.kind == "beam" and m.steel != "non_steel"]
    ends = {(j.beam, j.beam_end) for j in result.joints} | {
        (o.beam, o.beam_end) for o in result.other_beam_ends}
    assert len(ends) == 2 * len(beams)


def _get(name):
    p = CORPUS / name
    if not p.exists():
        pytest.skip(f"{name} not in the corpus")
    return p


def test_length_units_of_corpus_files(scan_cached):
    # Units as declared in each file's IfcUnitAssignment (read from the files by eye).
    assert scan_cached(_get("ipe240-beam-ifc4-m-german-names.ifc")).model.length_unit_to_mm == 1000
    assert scan_cached(_get("portal-frame-analysis-model-ifc4-inch.ifc")
                       ).model.length_unit_to_mm == pytest.approx(25.4)
    # This file declares an unused FOOT unit besides the assigned millimetre.
    assert scan_cached(_get("ipe240-beam-in-assembly-ifc4-mm.ifc")).model.length_unit_to_mm == 1


def test_ipe240_beam_dimensions_read_from_both_exporters(scan_cached):
    """IPE 240: h = 240, b = 120 mm (EN 10365, from memory), one file in m, one in mm."""
    for name in ("ipe240-beam-ifc4-m-german-names.ifc", "ipe240-beam-in-assembly-ifc4-mm.ifc"):
        beams = [m for m in scan_cached(_get(name)).model.members if m.kind == "beam"]
        assert len(beams) == 1
        assert beams[0].depth == pytest.approx(240.0, abs=0.5)
        assert beams[0].width == pytest.approx(120.0, abs=0.5)
        assert beams[0].steel == "steel"


def test_i_section_recovered_from_polygon_outlines(scan_cached):
    """IPE 240: tw 6.2, tf 9.8, r 15 mm (EN 10365, from memory). One exporter draws the outline
    with arcs (indexed poly-curve, metres, lying on its side), the other without fillets
    (SOURCES.md: "unfilleted"), so r is ~0 there."""
    a = [m for m in scan_cached(_get("ipe240-beam-ifc4-m-german-names.ifc")).model.members][0]
    assert (a.web_thickness, a.flange_thickness) == pytest.approx((6.2, 9.8), abs=0.05)
    assert a.root_radius == pytest.approx(15.0, abs=0.5)  # arcs sampled: close, not exact
    b = [m for m in scan_cached(_get("ipe240-beam-in-assembly-ifc4-mm.ifc")).model.members][0]
    assert (b.web_thickness, b.flange_thickness) == pytest.approx((6.2, 9.8), abs=0.05)
    assert b.root_radius == pytest.approx(0.0, abs=0.5)


def test_base_plates_read_plausibly(scan_cached):
    """Checked by eye in the file: three 400 x 400 x 12 base plates under HEA 240 columns, each
    with four openings of 32 mm (IfcOpeningElement, box representations) at +-159 mm."""
    r = scan_cached(_get("steel-columns-baseplates-holes-ifc4-m.ifc"))
    base = [p for p in r.model.plates if "base" in p.name.lower()]
    assert len(base) == 3
    for p in base:
        assert p.thickness == pytest.approx(12.0, abs=0.1)
        assert (2 * p.half_u, 2 * p.half_v) == pytest.approx((400.0, 400.0), abs=0.5)
        assert [round(h[1]) for h in p.holes] == [32, 32, 32, 32]


def test_concrete_and_timber_controls_give_no_joints(scan_cached):
    for name in ("concrete-frame-building-ifc4x3-mm.ifc",
                 "timber-window-frames-assemblies-ifc2x3-mm.ifczip"):
        assert scan_cached(_get(name)).joints == ()


def test_brep_only_ifczip_members_are_read_from_the_mesh(scan_cached):
    r = scan_cached(_get("steel-beams-columns-brep-ifc2x3-mm.ifczip"))
    assert r.model.counts["beams"] + r.model.counts["columns"] >= 60
    # SOURCES.md: "bodies mostly mapped faceted Breps" -> most members come from the mesh.
    from_mesh = sum(1 for m in r.model.members if m.geometry_source == "mesh")
    assert from_mesh >= 0.8 * len(r.model.members)


def test_grid_placed_columns_are_read_where_the_beams_end(scan_cached):
    """25 columns placed by IfcGridPlacement; every beam end lands on a column (checked by eye:
    the beams run grid line to grid line)."""
    r = scan_cached(_get("grid-placed-beams-columns-ifc4x3.ifc"))
    cols = [m for m in r.model.members if m.kind == "column"]
    assert len(cols) == 25 and not r.unreadable
    xy = {(round(c.start[0]), round(c.start[1])) for c in cols}
    for b in (m for m in r.model.members if m.kind == "beam"):
        for e in (b.start, b.end):
            assert (round(e[0]), round(e[1])) in xy


@pytest.mark.parametrize("path", FILES, ids=lambda p: p.name)
def test_reads_taken_from_an_earlier_run_equal_fresh_reads(path: Path):
    """The read cache (ifc/read_cache.py) on real exporters' files: digests are made (comments,
    IFC4X3 and ifczip included), and a model read with the earlier reads offered is the model
    read afresh."""
    from ifcjoint.ifc.read_cache import ReadCache
    from ifcjoint.ifc.reader import read_model

    first = ReadCache()
    read_model(path, reads=first, assume_length_unit="mm")
    assert first.usable, first.why_not
    again = ReadCache(offered=first.kept, asked=True)
    reused = read_model(path, reads=again, assume_length_unit="mm")
    fresh = read_model(path, assume_length_unit="mm")
    assert again.reused == len(first.kept)
    for key in ("members", "plates", "fasteners", "unreadable", "counts"):
        assert getattr(reused, key) == getattr(fresh, key), key
