"""Readable (terminal) renderings of results."""

from __future__ import annotations

from ..assembly import AssemblyResult
from .text import CAUTION, UNIT_SYSTEMS, table


def assembly_text(result: AssemblyResult, units: str = "si") -> str:
    """The ``solve`` result as aligned tables, one block per load case."""
    u = UNIT_SYSTEMS[units]
    asm = result.assembly
    out = [
        f"{asm.title}",
        f"{len(asm.parts)} parts, {len(asm.node_names())} nodes, fixed: {', '.join(asm.fixed)}",
        "",
    ]
    for case in result.cases:
        out.append(f"Case: {case.name}")
        # round-off below 1e-12 of the largest force is shown as 0
        tiny = 1e-12 * max([abs(f) for f in case.force.values()] + [1.0])

        def clean(x: float | None, tiny: float = tiny) -> float | None:
            return None if x is None else (0.0 if abs(x) < tiny else x)

        rows = []
        for p in asm.parts:
            rows.append(
                [
                    p.name if p.count == 1 else f"{p.name} (x {p.count})",
                    f"{p.ends[0]}-{p.ends[1]}",
                    u.fmt("force", case.force[p.name])
                    + (
                        ""
                        if p.count == 1
                        else f" (all: {u.fmt('force', case.force[p.name] * p.count)})"
                    ),
                    u.fmt("stress", case.stress[p.name]),
                    u.fmt("length", case.elongation[p.name]),
                    p.behaviour if p.behaviour != "linear" else "",
                    "yes" if case.carrying[p.name] else "no (slack)",
                ]
            )
        out.append(
            table(
                [
                    "part",
                    "ends",
                    f"force [{u.label('force')}]",
                    f"stress [{u.label('stress')}]",
                    f"elongation [{u.label('length')}]",
                    "contact",
                    "carrying",
                ],
                rows,
                right=[False, False, True, True, True, False, False],
            )
        )
        out.append("")
        node_rows = [
            [
                n,
                u.fmt("length", d),
                u.fmt("force", case.reactions.get(n)) if n in case.reactions else "",
            ]
            for n, d in case.displacement.items()
        ]
        out.append(
            table(
                ["node", f"displacement [{u.label('length')}]", f"reaction [{u.label('force')}]"],
                node_rows,
                right=[False, True, True],
            )
        )
        out.append(f"equilibrium residual: {case.residual:.3g} N")
        F = u.label("force")
        for load, share in case.load_share.items():
            node, _, force = load.partition(": ")
            shown = ", ".join(f"{name} {v:+.3g}" for name, v in share.items())
            out.append(
                f"load share of {u.fmt('force', float(force.split()[0]))} {F} at {node} "
                f"(change of each part's force in all / the load): {shown}"
            )
        for ev in case.events:
            out.append(f"  {ev['part']} {ev['event']} at {ev['at_factor']:.4g} x this case")
        out.append("")
    for name, d in result.fitted_misfits.items():
        part = next(p for p in asm.parts if p.name == name)
        out.append(
            f"preload of {name!r}: {u.fmt('force', part.preload)} {u.label('force')} per part; "
            f"fitted with a misfit (free minus fitted length) of {u.fmt('length', d)} "
            f"{u.label('length')}"
        )
    out.append(
        "Signs: part force tension +; displacement, loads and reactions along +axis "
        "(first end -> second end of a part). Elongation: the change of the distance between "
        "a part's two end nodes from the unloaded geometry (u_second - u_first), its free "
        "elongation from misfit and temperature included; force is per part."
    )
    if result.notes:
        out.append("Warnings")
        out.extend(f"  - {n}" for n in result.notes)
    out.append(CAUTION)
    return "\n".join(out)
