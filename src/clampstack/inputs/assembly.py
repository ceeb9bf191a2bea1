"""The ``solve`` input file: schema and reader (TOML -> :class:`~clampstack.assembly.Assembly`)."""

from __future__ import annotations

import math
from typing import Any

from ..assembly import Assembly, LoadCase, PartSpec
from ..errors import InputError
from ..network import Curve
from ..units import parse_quantity
from .files import InputDocument, load_toml, require_kind
from .schema import Key, Schema, read_table

LOAD = Schema(
    "load",
    "A point force on a node, along +axis (from a part's first end to its second).",
    (
        Key("node", "text", "node the force acts on", required=True),
        Key("force", "force", "force along +axis (negative: towards -axis)", required=True),
    ),
)

PART = Schema(
    "part",
    "A part between two nodes; the axis runs from its first end to its second.",
    (
        Key("name", "text", "unique name of the part", required=True),
        Key("ends", "names", "the two node names [first, second]", required=True),
        Key(
            "length",
            "length",
            "length between the nodes (needed unless stiffness is given)",
            positive=True,
        ),
        Key("area", "area", "cross-section area", positive=True),
        Key(
            "outer_diameter",
            "length",
            "outer diameter of a round or tubular section (instead of area)",
            positive=True,
        ),
        Key("inner_diameter", "length", "bore of a tubular section", default="0 mm", minimum=0.0),
        Key("material", "text", "catalog material key (modulus and expansion at 20 degC)"),
        Key("modulus", "stress", "Young's modulus (overrides the material's)", positive=True),
        Key("expansion", "expansion", "thermal expansion coefficient (overrides the material's)"),
        Key(
            "stiffness",
            "stiffness",
            "axial stiffness given directly (instead of area and modulus)",
            positive=True,
        ),
        Key(
            "contact", "text", "carries only this sign of force", choices=("compression", "tension")
        ),
        Key(
            "gap",
            "length",
            "clearance closed before a contact part carries load",
            default="0 mm",
            minimum=0.0,
        ),
        Key(
            "misfit",
            "length",
            "free length minus fitted length (positive: too long)",
            default="0 mm",
        ),
        Key(
            "temperature_change",
            "temperature_difference",
            "temperature change of the part in the assembled state",
            default="0 K",
        ),
        Key(
            "preload",
            "force",
            "force the part carries when assembled (tension +): its fitted length is set so "
            "(instead of misfit)",
        ),
        Key(
            "count",
            "integer",
            "identical parts in parallel (force reported per part and in total)",
            default="1",
        ),
        Key(
            "curve",
            "pairs",
            'force-elongation points [["-0.2 mm", "-40 kN"], ["0 mm", "0 kN"], ...] '
            "(non-linear part; elongation from the free length)",
        ),
    ),
)

CASE = Schema(
    "case",
    "A load case solved from the assembled state: its loads add to the assembly loads.",
    (
        Key("name", "text", "name of the load case", required=True),
        Key(
            "temperature_change",
            "temperature_difference",
            "uniform temperature change of every part, added to its own",
            default="0 K",
        ),
        Key("load", "tables", "loads of this case", schema=LOAD),
    ),
)

SUPPORTS = Schema(
    "supports",
    "Boundary conditions.",
    (Key("fixed", "names", "nodes held at zero displacement", required=True),),
)

ASSEMBLY = Schema(
    "assembly file",
    "A generic axial assembly for `clampstack solve`.",
    (
        Key("title", "text", "title printed on the result", default='"untitled assembly"'),
        Key("part", "tables", "the parts", required=True, schema=PART),
        Key("supports", "table", "supports", required=True, schema=SUPPORTS),
        Key("load", "tables", "loads in the assembled state", schema=LOAD),
        Key("case", "tables", "further load cases", schema=CASE),
    ),
)


def read_assembly_file(path: str, command: str = "solve") -> tuple[InputDocument, Assembly]:
    """Load and validate a ``solve`` input file (InputError names the file and key)."""
    doc = load_toml(path)
    require_kind(doc, "assembly", command)
    try:
        return doc, assembly_from_data(doc.data)
    except InputError as err:
        raise err.with_source(doc.path) from None


def _ends(raw: dict[str, Any], key: str) -> tuple[str, str]:
    ends = raw["ends"]
    if len(ends) != 2:
        raise InputError(f"expected two node names, got {len(ends)}", key=f"{key}.ends")
    if ends[0] == ends[1]:
        raise InputError(f"a part cannot join node {ends[0]!r} to itself", key=f"{key}.ends")
    return ends[0], ends[1]


def _area(raw: dict[str, Any], key: str) -> float | None:
    """Cross-section [m^2]: given, or from outer and inner diameter."""
    area = raw["area"]
    if raw["outer_diameter"] is not None:
        if area is not None:
            raise InputError("give area or outer_diameter, not both", key=f"{key}.outer_diameter")
        inner = raw["inner_diameter"] or 0.0
        if inner >= raw["outer_diameter"]:
            raise InputError(
                "inner diameter must be below the outer diameter", key=f"{key}.inner_diameter"
            )
        area = math.pi / 4 * (raw["outer_diameter"] ** 2 - inner**2)
    elif raw["inner_diameter"] is not None:
        raise InputError("inner_diameter needs outer_diameter", key=f"{key}.inner_diameter")
    return area


def _curve(raw: dict[str, Any], key: str) -> tuple[Curve, float]:
    """A force-elongation curve and its steepest slope [N/m] (the part's stiffness)."""
    if raw["contact"] is not None:
        raise InputError(
            "a curve part takes no contact key (shape the curve instead)", key=f"{key}.contact"
        )
    xs = [parse_quantity(p[0], "length", f"{key}.curve") for p in raw["curve"]]
    fs = [parse_quantity(p[1], "force", f"{key}.curve") for p in raw["curve"]]
    try:
        curve = Curve.make(xs, fs)
    except InputError as err:
        raise InputError(err.detail, key=f"{key}.curve") from None
    for k in ("stiffness", "area", "outer_diameter", "modulus"):
        if raw[k] is not None:
            raise InputError(f"a curve part takes no {k}", key=f"{key}.{k}")
    slope = max((fs[n + 1] - fs[n]) / (xs[n + 1] - xs[n]) for n in range(len(xs) - 1))
    return curve, float(slope)


def _axial_stiffness(
    raw: dict[str, Any], key: str, area: float | None, modulus: float | None
) -> float:
    """Stiffness [N/m]: given, or E A / L."""
    if raw["stiffness"] is not None:
        if raw["modulus"] is not None:
            raise InputError("give stiffness or modulus, not both", key=f"{key}.modulus")
        return raw["stiffness"]
    if raw["length"] is None:
        raise InputError("required key is missing (or give stiffness)", key=f"{key}.length")
    if area is None:
        raise InputError(
            "required key is missing (or give outer_diameter, or stiffness)", key=f"{key}.area"
        )
    if modulus is None:
        raise InputError(
            "required key is missing (give material or modulus, or stiffness)",
            key=f"{key}.material",
        )
    return modulus * area / raw["length"]


def part(raw: dict[str, Any], key: str) -> PartSpec:
    """One ``[[part]]``: ends, material or modulus, section, stiffness or curve, contact, gap."""
    from ..catalog import material as catalog_material

    ends = _ends(raw, key)
    mat = None
    if raw["material"] is not None:
        try:
            mat = catalog_material(raw["material"])
        except InputError as err:
            raise InputError(err.detail, key=f"{key}.material") from None
    modulus = raw["modulus"] if raw["modulus"] is not None else (mat.E20 if mat else None)
    expansion = raw["expansion"] if raw["expansion"] is not None else (mat.alpha20 if mat else None)
    area = _area(raw, key)
    behaviour, curve = raw["contact"] or "linear", None
    if raw["curve"] is not None:
        curve, stiffness = _curve(raw, key)
        behaviour = "curve"
    else:
        stiffness = _axial_stiffness(raw, key, area, modulus)
    if not (math.isfinite(stiffness) and stiffness > 0):
        raise InputError(f"stiffness comes out as {stiffness!r}", key=key)
    if raw["gap"] and behaviour == "linear":
        behaviour = "compression"  # a clearance that closes: a contact that only pushes
    if raw["gap"] and behaviour == "curve":
        raise InputError("a curve part takes no gap (shift the curve instead)", key=f"{key}.gap")
    count = raw["count"] if raw["count"] is not None else 1
    if isinstance(count, bool) or not isinstance(count, int) or not 1 <= count <= 10_000:
        raise InputError(
            f"count must be a whole number from 1 to 10000, got {count!r}", key=f"{key}.count"
        )
    if count > 1 and behaviour == "curve":
        raise InputError(
            "a curve part takes no count (give the curve of the group)", key=f"{key}.count"
        )
    if raw["preload"] is not None:
        if raw["misfit"]:
            raise InputError("give preload or misfit, not both", key=f"{key}.preload")
        if behaviour == "curve":
            raise InputError("a curve part takes no preload", key=f"{key}.preload")
        if (behaviour == "compression" and raw["preload"] > 0) or (
            behaviour == "tension" and raw["preload"] < 0
        ):
            raise InputError(
                f"a {behaviour}-only part cannot carry a preload of that sign (tension +)",
                key=f"{key}.preload",
            )
    return PartSpec(
        name=raw["name"],
        ends=ends,
        stiffness=stiffness,
        length=raw["length"],
        area=area,
        modulus=modulus,
        expansion=expansion,
        material=mat.key if mat else None,
        behaviour=behaviour,
        gap=raw["gap"] or 0.0,
        misfit=raw["misfit"] or 0.0,
        temperature_change=raw["temperature_change"] or 0.0,
        curve=curve,
        key=key,
        count=count,
        preload=raw["preload"],
    )


def _loads(items: list[dict[str, Any]] | None) -> tuple[tuple[str, float], ...]:
    return tuple((it["node"], it["force"]) for it in items or [])


def parts_table(rows: list[dict[str, Any]]) -> tuple[PartSpec, ...]:
    """Every ``[[part]]``, with unique names."""
    parts: list[PartSpec] = []
    names: set[str] = set()
    for n, praw in enumerate(rows):
        key = f"part[{n + 1}]"
        p = part(praw, key)
        if p.name in names:
            raise InputError(f"duplicate part name {p.name!r}", key=f"{key}.name")
        names.add(p.name)
        parts.append(p)
    if not parts:
        raise InputError("no parts", key="part")
    return tuple(parts)


def near_node(name: str, nodes: set[str]) -> str | None:
    """The node a misspelt ``name`` most likely means (case or a few letters off), or None."""
    import difflib

    by_lower = {n.lower(): n for n in sorted(nodes)}
    near = difflib.get_close_matches(str(name).lower(), list(by_lower), n=1, cutoff=0.6)
    return by_lower[near[0]] if near else None


def unknown_node(name: str, nodes: set[str], key: str) -> InputError:
    """The error for a node no part has: the nearest name as a did-you-mean, then all."""
    near = near_node(name, nodes)
    hint = f"did you mean {near!r}? " if near else ""
    return InputError(f"unknown node {name!r} ({hint}nodes: {', '.join(sorted(nodes))})", key=key)


def supports_table(supports: dict[str, Any], nodes: set[str]) -> tuple[str, ...]:
    """``[supports] fixed``: nodes that parts join (a misspelt name is refused)."""
    fixed = supports["fixed"]
    if not fixed:
        raise InputError("at least one node must be fixed", key="supports.fixed")
    if not any(node in nodes for node in fixed):
        raise InputError(
            f"none of the fixed nodes {', '.join(map(repr, fixed))} is an end "
            f"of a part (nodes: {', '.join(sorted(nodes))})",
            key="supports.fixed",
        )
    for n, node in enumerate(fixed):
        # a node that no part joins is a support with nothing on it (reaction 0; DESIGN.md's
        # own example has one), unless it looks like a misspelling of a node that exists
        if node not in nodes and near_node(node, nodes) is not None:
            raise unknown_node(node, nodes, f"supports.fixed[{n + 1}]")
    return tuple(fixed)


def load_table(items: list[dict[str, Any]] | None, nodes: set[str], key: str) -> tuple:
    """``[[load]]`` (or a case's): forces on nodes that exist."""
    for n, it in enumerate(items or []):
        if it["node"] not in nodes:
            raise unknown_node(it["node"], nodes, f"{key}[{n + 1}].node")
    return _loads(items)


def case_table(rows: list[dict[str, Any]] | None, parts: tuple[PartSpec, ...], nodes: set[str]):
    """``[[case]]``: named load cases with their own loads and temperature change."""
    cases = []
    case_names = set()
    for c, craw in enumerate(rows or []):
        loads = load_table(craw["load"], nodes, f"case[{c + 1}].load")
        if craw["name"] in case_names or craw["name"] == "assembly":
            raise InputError(f"duplicate case name {craw['name']!r}", key=f"case[{c + 1}].name")
        case_names.add(craw["name"])
        dT = craw["temperature_change"] or 0.0
        if dT:
            for p in parts:
                if p.expansion is None:
                    raise InputError(
                        f"part {p.name!r} has no expansion coefficient for the temperature change "
                        "(give material or expansion)",
                        key=f"case[{c + 1}].temperature_change",
                    )
        cases.append(LoadCase(craw["name"], loads, dT))
    return tuple(cases)


def assembly_from_data(data: dict[str, Any]) -> Assembly:
    """Validate the TOML data of a ``solve`` file and build the :class:`Assembly`."""
    raw = read_table(ASSEMBLY, data)
    parts = parts_table(raw["part"])
    nodes = {e for p in parts for e in p.ends}
    fixed = supports_table(raw["supports"], nodes)
    loads = load_table(raw["load"], nodes, "load")
    cases = case_table(raw["case"], parts, nodes)
    for p in parts:
        p.thermal_elongation(p.temperature_change)  # raises if expansion is missing
    return Assembly(
        title=raw["title"] or "untitled assembly",
        parts=parts,
        fixed=fixed,
        loads=loads,
        cases=cases,
    )
