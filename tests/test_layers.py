"""The one-way layers of DEVELOPERS.md, read from the package's own imports (with ``ast``).

Each unit (a package or a top-level module) may import only the units of the
layers above it, and modules of its own package; units that share a layer are
peers and do not import each other.  Every import counts, including those inside
functions.  No module may take part in an import circle.  A new package or
top-level module must be given its place here (the test says so).
"""

from __future__ import annotations

import ast
from pathlib import Path

import clampstack

PACKAGE = Path(clampstack.__file__).parent

#: top (imported by everything) to bottom (imports everything); peers share a row
LAYERS: tuple[tuple[str, ...], ...] = (
    ("_version", "errors", "display"),
    ("units",),
    ("catalog",),
    ("network",),
    ("components",),
    ("joint",),
    ("flange", "assembly"),
    ("studies",),
    ("inputs", "outputs"),
    ("plots",),
    ("report",),
    ("verify",),
    ("demo",),
    ("api",),  # the Python interface: the commands as functions
    ("apidoc",),  # docs/api.md from the interface's docstrings
    ("cli",),
    ("__main__",),  # python -m clampstack: the command line
    ("",),  # clampstack/__init__.py: the package's front door, above every layer
)
RANK = {unit: i for i, row in enumerate(LAYERS) for unit in row}
DOMAIN = ("units", "catalog", "network", "components", "joint", "flange", "assembly", "studies")
PRESENTATION = ("inputs", "outputs", "plots", "report", "cli")


def module_name(path: Path) -> str:
    parts = list(path.relative_to(PACKAGE.parent).with_suffix("").parts)
    if parts[-1] == "__init__":
        parts.pop()
    return ".".join(parts)


def modules() -> dict[str, Path]:
    return {module_name(p): p for p in PACKAGE.rglob("*.py")}


def imports_of(name: str, path: Path, known: set[str]) -> set[str]:
    """Every clampstack module that ``name`` imports, anywhere in the file."""
    is_pkg = path.name == "__init__.py"
    here = name.split(".") if is_pkg else name.split(".")[:-1]
    out: set[str] = set()
    for node in ast.walk(ast.parse(path.read_text(encoding="utf-8"))):
        if isinstance(node, ast.ImportFrom):
            if node.level:
                base = here[: len(here) - (node.level - 1)]
                target = ".".join(base + ([node.module] if node.module else []))
            else:
                target = node.module or ""
            if target.split(".")[0] != "clampstack":
                continue
            subs = {f"{target}.{a.name}" for a in node.names} & known
            out |= subs or {target}
            if target in known:
                out.add(target)
        elif isinstance(node, ast.Import):
            out |= {a.name for a in node.names if a.name.split(".")[0] == "clampstack"}
        elif isinstance(node, ast.Call) and getattr(node.func, "attr", "") == "import_module":
            arg = node.args[0] if node.args else None
            if isinstance(arg, ast.Constant) and str(arg.value).startswith("clampstack"):
                out.add(str(arg.value))
    return {t for t in out if t in known and t != name}


def unit_of(name: str) -> str:
    parts = name.split(".")
    return parts[1] if len(parts) > 1 else ""


def graph() -> dict[str, set[str]]:
    mods = modules()
    known = set(mods)
    return {m: imports_of(m, p, known) for m, p in mods.items()}


def test_every_unit_has_a_layer() -> None:
    missing = sorted({unit_of(m) for m in modules()} - set(RANK))
    assert not missing, f"give these a row in LAYERS (tests/test_layers.py): {missing}"


def test_imports_go_one_way() -> None:
    bad = []
    for mod, targets in graph().items():
        u = unit_of(mod)
        for t in targets:
            v = unit_of(t)
            if v == u:
                continue  # inside one package; circles are the next test's business
            if RANK[v] >= RANK[u]:
                bad.append(f"{mod} -> {t}")
    assert not bad, "imports against the layers:\n" + "\n".join(sorted(bad))


def test_the_domain_never_imports_readers_or_presentation() -> None:
    # the rule of DESIGN.md's second-round additions, stated on its own
    bad = [
        f"{m} -> {t}"
        for m, ts in graph().items()
        for t in ts
        if unit_of(m) in DOMAIN and unit_of(t) in PRESENTATION
    ]
    assert not bad, bad


def find_circles(g: dict[str, set[str]]) -> list[list[str]]:
    """Strongly connected components of more than one module, or a module importing itself."""
    index: dict[str, int] = {}
    low: dict[str, int] = {}
    stack: list[str] = []
    on: set[str] = set()
    out: list[list[str]] = []
    counter = [0]

    def visit(v: str) -> None:  # Tarjan, recursive (the graph is a few hundred modules)
        index[v] = low[v] = counter[0]
        counter[0] += 1
        stack.append(v)
        on.add(v)
        for w in g.get(v, ()):
            if w not in index:
                visit(w)
                low[v] = min(low[v], low[w])
            elif w in on:
                low[v] = min(low[v], index[w])
        if low[v] == index[v]:
            comp = []
            while True:
                w = stack.pop()
                on.discard(w)
                comp.append(w)
                if w == v:
                    break
            if len(comp) > 1 or v in g.get(v, ()):
                out.append(sorted(comp))

    for v in sorted(g):
        if v not in index:
            visit(v)
    return out


def test_no_import_circles() -> None:
    g = graph()
    # a module imports its package's __init__ implicitly; that edge is no circle of its own
    circles = find_circles(g)
    assert not circles, f"import circles: {circles}"


def test_the_checker_sees_a_violation_and_a_circle() -> None:
    assert find_circles({"a": {"b"}, "b": {"c"}, "c": {"a"}, "d": {"a"}}) == [["a", "b", "c"]]
    assert find_circles({"a": {"b"}, "b": set()}) == []
    assert unit_of("clampstack.joint.analysis") == "joint" and unit_of("clampstack") == ""
    assert RANK["inputs"] == RANK["outputs"] > RANK["studies"] > RANK["joint"]
