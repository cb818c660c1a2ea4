"""Shared fixtures: bundled demo models, generated variants, the shared IFC corpus."""

from __future__ import annotations

import json
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[1]
SAMPLES = ROOT / "sample_models"
SHARED = ROOT.parent / "shared"
CORPUS = SHARED / "ifc-corpus"


@pytest.fixture(scope="session", autouse=True)
def _read_cache_in_a_temporary_folder(tmp_path_factory):
    """Element reads kept by `check --json` go to a folder of this test run, not the home."""
    import os

    folder = tmp_path_factory.mktemp("read-cache")
    old = os.environ.get("IFCJOINT_CACHE_DIR")
    os.environ["IFCJOINT_CACHE_DIR"] = str(folder)
    yield folder
    if old is None:
        os.environ.pop("IFCJOINT_CACHE_DIR", None)
    else:
        os.environ["IFCJOINT_CACHE_DIR"] = old


@pytest.fixture(scope="session")
def samples() -> Path:
    return SAMPLES


def load_truth(name: str) -> dict:
    return json.loads((SAMPLES / f"{name}.truth.json").read_text())


@pytest.fixture(scope="session")
def build_variant(tmp_path_factory):
    """Build (once per session) a generated model variant; returns (path, truth)."""
    from sample_models.generate import Options, build

    cache: dict = {}

    def make(**kw):
        key = tuple(sorted(kw.items()))
        if key not in cache:
            d = tmp_path_factory.mktemp("variant")
            path = d / "model.ifc"
            truth = build(Options(**kw), path)
            cache[key] = (path, truth)
        return cache[key]

    return make


@pytest.fixture(scope="session")
def scan_cached():
    """Scan a path once per session."""
    from ifcjoint.pipeline import scan

    cache: dict = {}

    def run(path, **kw):
        key = (str(path), tuple(sorted(kw.items())))
        if key not in cache:
            cache[key] = scan(path, **kw)
        return cache[key]

    return run


def corpus_files() -> list[Path]:
    if not CORPUS.is_dir():
        return []
    return sorted(p for p in CORPUS.iterdir() if p.suffix.lower() in (".ifc", ".ifczip"))


DEMO_CREATED = "2026-12-01T09:00:00"


@pytest.fixture(scope="session")
def demo_check():
    """The bundled demo checked against its demo demands (a fixed timestamp)."""
    import datetime as dt

    import ifcjoint

    when = dt.datetime.fromisoformat(DEMO_CREATED).replace(tzinfo=dt.UTC)
    return ifcjoint.check(
        SAMPLES / "kestrel-workshop-ifc4-mm.ifc",
        demands=SAMPLES / "kestrel-workshop-demands.csv",
        created=when,
    )
