"""The formulas and the joint model never import ifcopenshell (STYLE.md: one-way layers)."""

import subprocess
import sys

CODE = r"""
import sys
class Block:
    def find_spec(self, name, path=None, target=None):
        if name == "ifcopenshell" or name.startswith("ifcopenshell."):
            raise ImportError("ifcopenshell is blocked in this test")
        return None
sys.meta_path.insert(0, Block())
import pkgutil, importlib
import ifcjoint.ec3, ifcjoint.engine
for pkg in (ifcjoint.ec3, ifcjoint.engine):
    for m in pkgutil.walk_packages(pkg.__path__, pkg.__name__ + "."):
        importlib.import_module(m.name)
import ifcjoint.engine.finder, ifcjoint.engine.model, ifcjoint.engine.results
assert "ifcopenshell" not in sys.modules
print("ok")
"""


def test_engine_and_formulas_import_without_ifcopenshell():
    out = subprocess.run([sys.executable, "-c", CODE], capture_output=True, text=True)
    assert out.returncode == 0, out.stderr
    assert out.stdout.strip() == "ok"
