"""The geometry kernel runs in a child process: a crash in it costs one element, not the run."""

from __future__ import annotations

import os
import signal

import ifcopenshell
import pytest

import ifcjoint.ifc.mesh as mesh


@pytest.fixture(scope="module")
def brep_model(tmp_path_factory):
    from sample_models.generate import Options, build

    path = tmp_path_factory.mktemp("brep") / "m.ifc"
    build(Options(profiles="brep", bays_x=1, bays_y=1, storeys=1, demo_details=False), path)
    return ifcopenshell.open(str(path))


def test_a_kernel_crash_costs_only_the_element_it_crashed_on(brep_model, monkeypatch):
    if "fork" not in __import__("multiprocessing").get_all_start_methods():
        pytest.skip("no fork on this platform: the kernel runs in process")
    members = list(brep_model.by_type("IfcBeam")) + list(brep_model.by_type("IfcColumn"))
    victim = members[1].id()
    here, one = mesh._tessellate_here, mesh._shape

    def crash_if_victim(els):
        if any(e.id() == victim for e in els):
            os.kill(os.getpid(), signal.SIGSEGV)  # what damaged data does to the kernel

    def here_crashing(model, els, scale):
        crash_if_victim(els)
        yield from here(model, els, scale)

    def shape_crashing(settings, el):
        crash_if_victim([el])
        return one(settings, el)

    monkeypatch.setattr(mesh, "_tessellate_here", here_crashing)
    monkeypatch.setattr(mesh, "_shape", shape_crashing)
    got = {el.id(): (v, err) for el, v, _, err in mesh.tessellate(brep_model, members, 1.0)}
    assert set(got) == {e.id() for e in members}  # every element answered, none lost
    v, err = got[victim]
    assert v is None and "crashed" in err and "signal 11" in err
    others = [got[e.id()] for e in members if e.id() != victim]
    assert all(v is not None and err is None for v, err in others)


def test_in_process_and_isolated_give_the_same_meshes(brep_model):
    members = list(brep_model.by_type("IfcBeam"))[:3]
    a = {el.id(): v for el, v, _, _ in mesh.tessellate(brep_model, members, 1.0)}
    b = {el.id(): v for el, v, _, _ in mesh.tessellate(brep_model, members, 1.0, isolate=False)}
    assert a.keys() == b.keys()
    for k in a:
        assert a[k].shape == b[k].shape and abs(a[k] - b[k]).max() < 1e-9
