"""The read cache file (ifc/read_cache.py): kept per model, ignored when not ours, pruned."""

from __future__ import annotations

import hashlib
import os
import pickle

from ifcjoint.ifc import read_cache
from ifcjoint.ifc.read_cache import KEEP, Outcome, ReadCache, cache_file


def test_reads_kept_are_offered_to_the_next_run(tmp_path, monkeypatch):
    monkeypatch.setenv("IFCJOINT_CACHE_DIR", str(tmp_path))
    rc = ReadCache()
    rc.kept["k1"] = Outcome(plate_members=1)
    rc.anatomy_kept["j1"] = ((("g", "k1"),), "anatomy")
    assert rc.save("ab" * 32) == cache_file("ab" * 32)
    again = ReadCache.load("ab" * 32)
    assert again.offered == {"k1": Outcome(plate_members=1)} and again.asked
    assert again.anatomy_offered == {"j1": ((("g", "k1"),), "anatomy")}
    assert "taken from its reads" in again.summary()


def test_a_file_not_ours_or_damaged_is_ignored(tmp_path, monkeypatch):
    monkeypatch.setenv("IFCJOINT_CACHE_DIR", str(tmp_path))
    cache_file("cd" * 32).write_bytes(b"not a pickle")
    assert ReadCache.load("cd" * 32).offered == {}
    with cache_file("ef" * 32).open("wb") as fh:
        pickle.dump({"format": 1, "tool_version": "0.0.0-other", "reads": {"k": 1}}, fh)
    got = ReadCache.load("ef" * 32)
    assert got.offered == {} and "every element read" in got.summary()
    assert ReadCache.load(None).offered == {}


def test_only_the_newest_files_are_kept(tmp_path, monkeypatch):
    monkeypatch.setenv("IFCJOINT_CACHE_DIR", str(tmp_path))
    shas = [hashlib.sha256(str(k).encode()).hexdigest() for k in range(KEEP + 3)]
    for k, sha in enumerate(shas):
        path = ReadCache().save(sha)
        os.utime(path, (1000 + k, 1000 + k))
    ReadCache().save("f" * 64)
    left = sorted(tmp_path.glob("reads-*.pickle"))
    assert len(left) == KEEP and cache_file("f" * 64) in left
    assert cache_file(shas[0]) not in left  # the oldest went first
    assert cache_file(shas[-1]) in left


def test_check_keeps_reads_only_when_asked(tmp_path, monkeypatch):
    from click.testing import CliRunner

    from ifcjoint.cli import main
    from tests.conftest import SAMPLES

    monkeypatch.setenv("IFCJOINT_CACHE_DIR", str(tmp_path / "c"))
    model = str(SAMPLES / "kestrel-workshop-ifc4-mm.ifc")
    run = CliRunner().invoke
    assert run(main, ["check", model, "--fail-on", "never", "-q",
                      "--json", str(tmp_path / "a.json")]).exit_code == 0
    assert not (tmp_path / "c").exists()  # a plain check keeps nothing
    assert run(main, ["check", model, "--fail-on", "never", "-q", "--since",
                      str(tmp_path / "a.json"), "--no-read-cache"]).exit_code == 0
    assert not (tmp_path / "c").exists()
    assert run(main, ["check", model, "--fail-on", "never", "-q", "--keep-reads"]).exit_code == 0
    assert len(list((tmp_path / "c").glob("reads-*.pickle"))) == 1


def test_a_revision_keeps_only_what_it_added_and_reads_the_earlier_file_first(
        tmp_path, monkeypatch):
    monkeypatch.setenv("IFCJOINT_CACHE_DIR", str(tmp_path))
    first = ReadCache()
    first.kept = {f"k{i}": Outcome(plate_members=i) for i in range(10)}
    first.save("a" * 64)
    b = ReadCache.load("a" * 64)
    b.kept = {k: b.offered[k] for k in list(b.offered)[:9]}  # one element removed ...
    b.kept["new"] = Outcome(plate_members=99)  # ... one added
    b.save("b" * 64)
    with cache_file("b" * 64).open("rb") as fh:
        written = pickle.load(fh)
    assert written["base"] == cache_file("a" * 64).name
    assert written["reads"] == {"new": Outcome(plate_members=99)}  # only what it added
    again = ReadCache.load("b" * 64)
    assert again.offered["new"] == Outcome(plate_members=99)
    assert all(again.offered[k] == Outcome(plate_members=i) for i, k in
               enumerate(f"k{i}" for i in range(9)))
    assert again.depth == 2
    # the earlier file gone (pruned, deleted): fewer reads offered, never an error
    cache_file("a" * 64).unlink()
    assert ReadCache.load("b" * 64).offered == {"new": Outcome(plate_members=99)}


def test_a_chain_of_revisions_is_written_whole_again_at_its_longest(tmp_path, monkeypatch):
    monkeypatch.setenv("IFCJOINT_CACHE_DIR", str(tmp_path))
    rc = ReadCache()
    rc.kept = {f"k{i}": Outcome(plate_members=i) for i in range(10)}
    shas = [c * 64 for c in "abcdefg"]
    rc.save(shas[0])
    for prev, sha in zip(shas, shas[1:], strict=False):
        nxt = ReadCache.load(prev)
        nxt.kept = dict(nxt.offered)
        nxt.kept[f"from-{sha[0]}"] = Outcome(plate_members=1)
        nxt.save(sha)
        assert nxt.depth <= read_cache.MAX_CHAIN
        got = ReadCache.load(sha)
        assert set(got.offered) == set(nxt.kept)  # every read offered again, however kept
    with cache_file(shas[read_cache.MAX_CHAIN]).open("rb") as fh:
        assert pickle.load(fh)["base"] is None  # the chain was at its longest: written whole
    # the same model again: never a file naming itself
    same = ReadCache.load(shas[-1])
    same.kept = dict(same.offered)
    same.save(shas[-1])
    assert set(ReadCache.load(shas[-1]).offered) == set(same.kept)
