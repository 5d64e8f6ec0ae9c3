"""The shape of the code: no import circles, imports point inward, small modules.

The rules are the project's own (DESIGN.md §2, DEVELOPERS.md "Layout"):

* no circle between modules; an import used only for typing (under ``if TYPE_CHECKING:``)
  counts, except in a package ``__init__`` façade, whose typing imports only describe
  the names it loads lazily;
* ``engine`` and ``data`` import nothing of ours outside themselves; ``report`` never
  imports ``ui``, ``commands`` or ``cli``; PySide6 and pyqtgraph are imported only in
  ``ui``;
* no module over 400 lines.

The import graph is read from the source with ``ast`` (nothing is imported), so a
module that fails to import still gets checked.  Relative imports are resolved against
the importing module's package; ``from package import name`` points at the submodule
``package.name`` when there is one, else at the package.
"""

from __future__ import annotations

import ast
from collections.abc import Iterable, Iterator
from dataclasses import dataclass
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
SOURCE = ROOT / "desktop"
PACKAGE = "tauscope"
MAX_LINES = 400
QT_MODULES = ("PySide6", "pyqtgraph")


@dataclass(frozen=True)
class Import:
    """One import statement's target as written (absolute, dotted), and where it is."""

    source: str
    target: str
    line: int
    typing_only: bool


def module_name(path: Path, source: Path) -> str:
    parts = list(path.relative_to(source).with_suffix("").parts)
    if parts[-1] == "__init__":
        parts.pop()
    return ".".join(parts)


def _is_type_checking(test: ast.expr) -> bool:
    return (isinstance(test, ast.Name) and test.id == "TYPE_CHECKING") or (
        isinstance(test, ast.Attribute) and test.attr == "TYPE_CHECKING")


def _walk(nodes: Iterable[ast.stmt], typing_only: bool = False) -> Iterator[tuple[ast.stmt, bool]]:
    """Every statement, with whether it sits under ``if TYPE_CHECKING:``."""
    for node in nodes:
        yield node, typing_only
        if isinstance(node, ast.If):
            yield from _walk(node.body, typing_only or _is_type_checking(node.test))
            yield from _walk(node.orelse, typing_only)
            continue
        for field in ("body", "orelse", "finalbody", "handlers"):
            children = getattr(node, field, None)
            if isinstance(children, list):
                yield from _walk([c for c in children if isinstance(c, ast.stmt | ast.excepthandler)],
                                 typing_only)  # type: ignore[misc]


def imports_of(path: Path, name: str, is_package: bool) -> list[Import]:
    tree = ast.parse(path.read_text(encoding="utf-8"), filename=str(path))
    package = name if is_package else name.rpartition(".")[0]
    found: list[Import] = []
    for node, typing_only in _walk(tree.body):
        if isinstance(node, ast.Import):
            found.extend(Import(name, alias.name, node.lineno, typing_only) for alias in node.names)
        elif isinstance(node, ast.ImportFrom):
            if node.level:
                base = package.split(".")
                base = base[: len(base) - (node.level - 1)]
                module = ".".join(base + ([node.module] if node.module else []))
            else:
                module = node.module or ""
            for alias in node.names:
                found.append(Import(name, f"{module}.{alias.name}", node.lineno, typing_only))
    return found


@dataclass(frozen=True)
class Graph:
    modules: dict[str, Path]
    edges: dict[str, set[str]]  # our module -> our modules it imports
    external: dict[str, set[str]]  # our module -> top-level names of other packages


def build_graph(source: Path, package: str) -> Graph:
    paths = {module_name(p, source): p for p in (source / package).rglob("*.py")
             if "__pycache__" not in p.parts}
    edges: dict[str, set[str]] = {name: set() for name in paths}
    external: dict[str, set[str]] = {name: set() for name in paths}
    for name, path in paths.items():
        is_package = path.name == "__init__.py"
        for item in imports_of(path, name, is_package):
            if item.typing_only and is_package:
                continue  # a façade's typing imports describe its lazy names
            top = item.target.split(".")[0]
            if top != package:
                external[name].add(top)
                continue
            # "from a.b import c": the submodule a.b.c if there is one, else a.b itself.
            target = item.target
            while target and target not in paths:
                target = target.rpartition(".")[0]
            if target and target != name:
                edges[name].add(target)
    return Graph(paths, edges, external)


def circles(edges: dict[str, set[str]]) -> list[list[str]]:
    """Strongly connected components with more than one module (Tarjan 1972)."""
    index: dict[str, int] = {}
    low: dict[str, int] = {}
    stack: list[str] = []
    on_stack: set[str] = set()
    found: list[list[str]] = []

    def visit(node: str) -> None:
        index[node] = low[node] = len(index)
        stack.append(node)
        on_stack.add(node)
        for nxt in sorted(edges.get(node, ())):
            if nxt not in index:
                visit(nxt)
                low[node] = min(low[node], low[nxt])
            elif nxt in on_stack:
                low[node] = min(low[node], index[nxt])
        if low[node] == index[node]:
            component = []
            while True:
                top = stack.pop()
                on_stack.discard(top)
                component.append(top)
                if top == node:
                    break
            if len(component) > 1:
                found.append(sorted(component))

    for node in sorted(edges):
        if node not in index:
            visit(node)
    return found


def _inside(module: str, package: str) -> bool:
    return module == package or module.startswith(package + ".")


def layer_breaks(graph: Graph, package: str = PACKAGE) -> list[str]:
    problems = []
    closed = (f"{package}.engine", f"{package}.data")
    never_from_report = (f"{package}.ui", f"{package}.commands", f"{package}.cli")
    for source, targets in sorted(graph.edges.items()):
        for target in sorted(targets):
            for room in closed:
                if _inside(source, room) and not _inside(target, room):
                    problems.append(f"{source} imports {target}: {room} imports nothing of ours outside itself")
            if _inside(source, f"{package}.report") and any(_inside(target, r) for r in never_from_report):
                problems.append(f"{source} imports {target}: report never imports ui, commands or cli")
    for source, names in sorted(graph.external.items()):
        for qt in QT_MODULES:
            if qt in names and not _inside(source, f"{package}.ui"):
                problems.append(f"{source} imports {qt}: Qt is imported only in {package}.ui")
    return problems


GRAPH = build_graph(SOURCE, PACKAGE)


def test_the_graph_is_read() -> None:
    # A resolver that silently found nothing would pass every rule below.
    assert len(GRAPH.modules) > 80
    assert f"{PACKAGE}.engine.results" in GRAPH.edges[f"{PACKAGE}.engine.procedure.many"]
    assert "PySide6" in GRAPH.external[f"{PACKAGE}.ui.main_window"]


def test_no_import_circles() -> None:
    assert circles(GRAPH.edges) == []


def test_imports_point_inward() -> None:
    assert layer_breaks(GRAPH) == []


def test_no_module_over_400_lines() -> None:
    too_long = []
    for _, path in sorted(GRAPH.modules.items()):
        relative = path.relative_to(SOURCE).as_posix()
        lines = len(path.read_text(encoding="utf-8").splitlines())
        if lines > MAX_LINES:
            too_long.append(f"{relative}: {lines} lines")
    assert too_long == []


def _write(root: Path, files: dict[str, str]) -> None:
    for relative, text in files.items():
        path = root / relative
        path.parent.mkdir(parents=True, exist_ok=True)
        path.write_text(text, encoding="utf-8")


def test_the_rules_catch_what_they_are_meant_to(tmp_path: Path) -> None:
    """A planted circle through a typing-only relative import, a layer break and a Qt import
    outside ui are found; a façade's typing-only import is not a circle."""
    _write(tmp_path, {
        "pkg/__init__.py": "",
        "pkg/engine/__init__.py": (
            "from typing import TYPE_CHECKING\nif TYPE_CHECKING:\n    from pkg.engine.a import A\n"),
        "pkg/engine/a.py": "from typing import TYPE_CHECKING\nif TYPE_CHECKING:\n    from .b import B\n",
        "pkg/engine/b.py": "from pkg.engine import a\nimport pkg.engine\n",
        "pkg/engine/c.py": "def f():\n    from pkg.ui import window\n",
        "pkg/report/r.py": "from ..ui.window import W\nimport pyqtgraph\n",
        "pkg/ui/__init__.py": "",
        "pkg/ui/window.py": "from PySide6 import QtCore\nfrom pkg.engine import a\n",
    })
    graph = build_graph(tmp_path, "pkg")
    assert circles(graph.edges) == [["pkg.engine.a", "pkg.engine.b"]]
    assert layer_breaks(graph, "pkg") == [
        "pkg.engine.c imports pkg.ui.window: pkg.engine imports nothing of ours outside itself",
        "pkg.report.r imports pkg.ui.window: report never imports ui, commands or cli",
        "pkg.report.r imports pyqtgraph: Qt is imported only in pkg.ui",
    ]
