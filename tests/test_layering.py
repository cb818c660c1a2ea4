"""Imports point one way along the pipeline (DEVELOPERS.md, "Architecture").

Every module of the package is parsed (``ast``, no import needed); each ``ifcjoint.x`` import
must name a stage lower than the importing module's, or the module's own stage. The lower
stages also import with ifcopenshell blocked, so the engine can never quietly depend on IFC.
"""

from __future__ import annotations

import ast
import subprocess
import sys
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[1] / "ifcjoint"

#: Stages from the bottom up; a stage may import only stages of a lower rank (and itself).
LAYERS: tuple[frozenset[str], ...] = (
    frozenset({"errors"}),
    frozenset({"fileio"}),
    frozenset({"model", "ec3"}),
    frozenset({"catalogue"}),
    frozenset({"ifc", "find", "tables"}),
    frozenset({"anatomy"}),
    frozenset({"engine"}),
    frozenset({"archetypes"}),
    frozenset({"report"}),
    frozenset({"pipeline"}),
    frozenset({"batch"}),
    frozenset({"cli"}),
    frozenset({"__main__"}),
)
RANK = {stage: k for k, layer in enumerate(LAYERS) for stage in layer}
#: Stages that must work without ifcopenshell installed.
WITHOUT_IFC = ("model", "ec3", "catalogue", "find", "tables", "anatomy", "engine", "archetypes")


#: Names the package root itself defines (the version): importing them is not a stage.
ROOT_NAMES = frozenset({"__version__", "TOOL_NAME", "check", "scan"})


def _stage(module: str) -> str | None:
    """The stage of a dotted module name (None for the package root and what it defines)."""
    parts = module.split(".")
    if len(parts) < 2 or parts[0] != "ifcjoint" or parts[1] in ROOT_NAMES:
        return None
    return parts[1]


def _imports(tree: ast.AST, module: str) -> list[tuple[int, str]]:
    """(line, dotted name) of every ifcjoint import in a module, nested ones included."""
    out = []
    package = module.rsplit(".", 1)[0]
    for node in ast.walk(tree):
        if isinstance(node, ast.Import):
            out += [(node.lineno, a.name) for a in node.names if a.name.startswith("ifcjoint")]
        elif isinstance(node, ast.ImportFrom):
            name = node.module or ""
            if node.level:
                base = package.split(".")[: len(package.split(".")) - node.level + 1]
                name = ".".join([*base, name] if name else base)
            if name == "ifcjoint":  # from ifcjoint import x: a stage, or a root constant
                out += [(node.lineno, f"ifcjoint.{a.name}") for a in node.names]
            elif name.startswith("ifcjoint"):
                out.append((node.lineno, name))
    return out


def layer_violations(root: Path, package: str = "ifcjoint") -> list[str]:
    """Every import that points up (or sideways) the stages, as ``file:line: a -> b``."""
    bad = []
    for path in sorted(root.rglob("*.py")):
        rel = path.relative_to(root).with_suffix("")
        parts = [p for p in rel.parts if p != "__init__"]
        module = ".".join([package, *parts])
        own = _stage(module)
        if own is None:
            continue
        for line, name in _imports(ast.parse(path.read_text()), module):
            other = _stage(name)
            if other is None or other == own:
                continue
            if other not in RANK or own not in RANK or RANK[other] >= RANK[own]:
                bad.append(f"{path.relative_to(root)}:{line}: {own} -> {other}")
    return bad


def test_every_stage_is_in_a_layer():
    stages = {p.stem if p.is_file() else p.name for p in ROOT.iterdir()
              if (p.suffix == ".py" or (p.is_dir() and (p / "__init__.py").exists()))}
    stages -= {"__init__"}
    assert stages <= set(RANK), stages - set(RANK)


def test_imports_point_down_the_pipeline():
    assert layer_violations(ROOT) == []


def test_the_graph_test_catches_an_upward_import(tmp_path):
    # A package built here: the engine stage importing the report stage must be caught, a
    # report module importing the engine stage must not.
    pkg = tmp_path / "ifcjoint"
    for stage in ("engine", "report"):
        (pkg / stage).mkdir(parents=True)
        (pkg / stage / "__init__.py").write_text("")
    (pkg / "engine" / "bad.py").write_text("from ifcjoint.report.results import build_results\n")
    (pkg / "report" / "good.py").write_text("from ifcjoint.engine import verify\n")
    (pkg / "engine" / "relative.py").write_text("from ..report import html\n")
    bad = layer_violations(pkg)
    assert bad == [
        "engine/bad.py:1: engine -> report",
        "engine/relative.py:1: engine -> report",
    ]


def test_a_sideways_import_is_caught(tmp_path):
    pkg = tmp_path / "ifcjoint"
    (pkg / "find").mkdir(parents=True)
    (pkg / "find" / "x.py").write_text("def f():\n    import ifcjoint.ifc.reader\n")
    assert layer_violations(pkg) == ["find/x.py:2: find -> ifc"]


CODE = r"""
import sys
class Block:
    def find_spec(self, name, path=None, target=None):
        if name == "ifcopenshell" or name.startswith("ifcopenshell."):
            raise ImportError("ifcopenshell is blocked in this test")
        return None
sys.meta_path.insert(0, Block())
import importlib, pkgutil
for stage in STAGES:
    pkg = importlib.import_module("ifcjoint." + stage)
    for m in pkgutil.walk_packages(pkg.__path__, pkg.__name__ + "."):
        importlib.import_module(m.name)
assert "ifcopenshell" not in sys.modules
print("ok")
"""


@pytest.mark.parametrize("stages", [WITHOUT_IFC])
def test_lower_stages_import_without_ifcopenshell(stages):
    code = CODE.replace("STAGES", repr(stages))
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True)
    assert out.returncode == 0, out.stderr
    assert out.stdout.strip() == "ok"
