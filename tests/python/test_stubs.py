"""The type stubs (python/ellipsa.pyi) name everything the module has, and nothing it lacks."""
import ast
from pathlib import Path

import ellipsa
from conftest import SOURCE


def stub_names():
    tree = ast.parse((SOURCE / "python" / "ellipsa.pyi").read_text())
    top, members = set(), {}
    for node in tree.body:
        if isinstance(node, (ast.FunctionDef, ast.ClassDef)):
            top.add(node.name)
        elif isinstance(node, ast.AnnAssign):
            top.add(node.target.id)
        if isinstance(node, ast.ClassDef):
            members[node.name] = {n.name for n in node.body if isinstance(n, ast.FunctionDef)}
    return top, members


def test_stubs_match_the_module():
    top, members = stub_names()
    public = {n for n in dir(ellipsa) if not n.startswith("_")} | {"__version__"}
    aliases = {"FloatArray", "ComplexArray", "OptionText"}
    assert top - aliases == public
    for cls in ("Pattern", "Environment"):
        have = {n for n in dir(getattr(ellipsa, cls)) if not n.startswith("_")}
        assert members[cls] == have, cls
    for name in public - {"__version__", "SENSES", "COMPONENTS"}:
        assert getattr(ellipsa, name).__doc__, name  # every function and class documented
