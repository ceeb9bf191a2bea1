"""The Python interface of clampstack: the commands as functions.

Every function here is re-exported by the package (``import clampstack``); the
command line calls the same code.  Inputs are the input files' tables as Python
dicts (the TOML keys of docs/input-reference.md); a quantity is a string with its
unit (``"12 mm"``, ``"65 ft*lbf"``) or a pint Quantity, never a bare number (the
unit would be a guess); temperatures of a sweep may also be plain kelvin.
Results are frozen dataclasses with ``to_dict()`` (the ``--json`` document without
its header) and an HTML view in a notebook.  Results support, and do not replace,
the judgement of a qualified engineer; applicable codes and regulations govern.

>>> import clampstack
>>> spec = clampstack.load("examples/m10-cover-screw-aluminium.toml")
>>> result = clampstack.analyse(spec)
>>> result.ok, round(result.to_dict()["torque"]["nominal_Nm"], 1)
(True, 48.0)
"""

from __future__ import annotations

import os
from typing import Any

__all__ = [
    "analyse",
    "analyse_flange",
    "assembly_from_dict",
    "flange_from_dict",
    "joint_from_dict",
    "load",
    "scatter",
    "size",
    "solve",
    "sweep",
]


def _plain(value: Any) -> Any:
    """A pint Quantity as the string the readers parse (``"12.0 millimeter"``); dicts and
    lists walked; anything else as it is."""
    if isinstance(value, dict):
        return {k: _plain(v) for k, v in value.items()}
    if isinstance(value, list | tuple):
        return [_plain(v) for v in value]
    if hasattr(value, "magnitude") and hasattr(value, "units"):
        return f"{value.magnitude!r} {value.units}"
    return value


def load(path: str | os.PathLike[str]) -> Any:
    """Read and validate an input file of any kind (joint, flange or assembly).

    Returns the validated spec (``JointSpec``, ``FlangeSpec`` or ``Assembly``) with every
    default resolved; an ``InputError`` names the file and the key.  ``"-"`` reads
    standard input.
    """
    from .inputs.files import file_kind, load_toml

    doc = load_toml(path)
    kind = file_kind(doc.data)
    try:
        if kind == "flange":
            return flange_from_dict(doc.data)
        if kind == "assembly":
            return assembly_from_dict(doc.data)
        return joint_from_dict(doc.data)
    except Exception as err:
        from .errors import InputError

        if isinstance(err, InputError):
            raise err.with_source(doc.path) from None
        raise


def joint_from_dict(data: dict[str, Any]) -> Any:
    """A single-bolt joint from its tables (the keys of a joint file) -> ``JointSpec``."""
    from .inputs.joint import joint_from_data

    return joint_from_data(_plain(data))


def flange_from_dict(data: dict[str, Any]) -> Any:
    """A gasketed flange from its tables (the keys of a flange file) -> ``FlangeSpec``."""
    from .inputs.flange import flange_from_data

    return flange_from_data(_plain(data))


def assembly_from_dict(data: dict[str, Any]) -> Any:
    """An assembly of parts between named nodes (the keys of a ``solve`` file) -> ``Assembly``."""
    from .inputs.assembly import assembly_from_data

    return assembly_from_data(_plain(data))


def analyse(spec: Any) -> Any:
    """Run the check chain of a joint (``clampstack check``) -> ``JointResult``."""
    from .joint import analyse as run

    return run(spec)


def analyse_flange(spec: Any) -> Any:
    """Analyse a gasketed flange (``clampstack flange``) -> ``FlangeResult``."""
    from .flange import analyse_flange as run

    return run(spec)


def solve(assembly: Any) -> Any:
    """Solve an assembly's load share and cases (``clampstack solve``) -> ``AssemblyResult``."""
    from .assembly import solve_assembly

    return solve_assembly(assembly)


def _kelvin(T: Any, name: str) -> float:
    from .units import parse_quantity

    if isinstance(T, int | float) and not isinstance(T, bool):
        return float(T)  # documented: plain kelvin
    return parse_quantity(_plain(T), "temperature", name)


def sweep(spec: Any, low: Any, high: Any, step: float | None = None, cycle: bool = False) -> Any:
    """Sweep the service temperature of a joint or the flange temperature of a flange.

    ``low``, ``high``: ``"-20 degC"``, a pint Quantity, or plain kelvin; ``step`` in
    kelvin (default: 100 intervals); ``cycle``: the heat cycle (a joint's elastic-plastic
    cycle, a flange's start-up, creep relaxation and cooling back).  Returns a
    ``SweepResult`` or a ``FlangeSweepResult``.
    """
    from .flange.model import FlangeSpec

    lo, hi = _kelvin(low, "low"), _kelvin(high, "high")
    if isinstance(spec, FlangeSpec):
        from .studies.flange_sweep import flange_sweep

        return flange_sweep(spec, lo, hi, step, cycle)
    from .studies.sweep import sweep as run

    return run(spec, lo, hi, step, cycle)


def scatter(spec: Any, samples: int = 10_000, seed: int = 0) -> Any:
    """Monte Carlo of the assembly scatter (``clampstack scatter --samples N --seed S``):
    the file's friction ranges and ``[distributions]``, each bolt of a flange on its own.
    Returns a ``ScatterResult`` or a ``FlangeScatterResult``."""
    from .flange.model import FlangeSpec

    if isinstance(spec, FlangeSpec):
        from .studies.flange_scatter import flange_scatter

        return flange_scatter(spec, samples, seed)
    from .studies.scatter import scatter as run

    return run(spec, spec.distributions or {}, samples, seed)


def size(spec: Any) -> Any:
    """The smallest passing designs (``clampstack size``): a ``SizeResult`` for a joint, a
    ``FlangeSizeResult`` (its ``to_dict()`` the ``size --json`` document) for a flange."""
    from .flange.model import FlangeSpec

    if isinstance(spec, FlangeSpec):
        from .studies.flange_size import FlangeSizeResult, size_flange

        return FlangeSizeResult(size_flange(spec))
    from .studies.size import size as run

    return run(spec)
