"""The package's import graph: no cycle anywhere, no writer importing another writer layer or
a command, and the config / standards / plan / design layers never importing a CAD or drawing
library (so ``threads``, ``check`` and the sizing search start fast)."""

from __future__ import annotations

import ast
import pathlib

import networkx as nx

PKG = pathlib.Path(__file__).resolve().parents[2] / "generators"
WRITER_LAYERS = ("generators.cad", "generators.drawings", "generators.report")
LIGHT_LAYERS = ("generators.config", "generators.standards", "generators.plan", "generators.design",
                "generators.sizing")
HEAVY = ("cadquery", "OCP", "ezdxf", "matplotlib", "trimesh", "vtk")


def _module_name(path: pathlib.Path) -> str:
    rel = path.relative_to(PKG.parent).with_suffix("")
    parts = list(rel.parts)
    if parts[-1] == "__init__":
        parts.pop()
    return ".".join(parts)


def _imports(path: pathlib.Path, name: str) -> set[str]:
    out = set()
    package = name if path.name == "__init__.py" else name.rpartition(".")[0]
    for node in ast.walk(ast.parse(path.read_text(encoding="utf-8"))):
        if isinstance(node, ast.Import):
            out.update(a.name for a in node.names)
        elif isinstance(node, ast.ImportFrom):
            base = node.module or ""
            if node.level:
                base = ".".join(package.split(".")[: len(package.split(".")) - node.level + 1] + ([base] if base else []))
            out.add(base)
            out.update(f"{base}.{a.name}" for a in node.names)
    return out


def _graph() -> tuple[nx.DiGraph, dict[str, set[str]]]:
    mods = {_module_name(p): p for p in PKG.rglob("*.py")}
    g = nx.DiGraph()
    raw = {}
    for name, path in mods.items():
        g.add_node(name)
        raw[name] = _imports(path, name)
        for imp in raw[name]:
            if imp in mods and imp != name:
                g.add_edge(name, imp)
    return g, raw


def _layer(name: str) -> str | None:
    return next((w for w in WRITER_LAYERS if name == w or name.startswith(w + ".")), None)


def test_no_import_cycle():
    g, _ = _graph()
    cycles = [c for c in nx.simple_cycles(g) if not all(m.endswith("__init__") for m in c)]
    assert cycles == [], cycles


def test_writers_import_no_other_writer_layer_and_no_command():
    g, _ = _graph()
    bad = []
    for a, b in g.edges:
        la, lb = _layer(a), _layer(b)
        if la and ((lb and lb != la) or b.startswith("generators.commands")):
            bad.append((a, b))
    assert bad == []


def test_light_layers_never_import_heavy_libraries():
    _, raw = _graph()
    bad = [(m, i) for m, imps in raw.items() if m.startswith(LIGHT_LAYERS)
           for i in imps if i.split(".")[0] in HEAVY]
    assert bad == []


def test_the_graph_sees_imports_inside_functions():
    # the walker must see function-level imports, or the tests above could not fail
    _, raw = _graph()
    assert "generators.plan.hub" in raw["generators.design"]
