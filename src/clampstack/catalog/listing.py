"""Tabular listings of the catalog for display (``clampstack catalog KIND``).

Each listing is a header (units in brackets) and rows of display strings, the last column
being the published source of the row.
"""

from __future__ import annotations

from clampstack.catalog._common import fmt
from clampstack.catalog.grades import grades
from clampstack.catalog.materials import ZERO_C, materials
from clampstack.catalog.threads import threads
from clampstack.errors import InputError

KINDS = ("threads", "grades", "materials", "gaskets", "friction", "tools")

_MM = 1e-3
_MPA = 1e6
_GPA = 1e9


def _mm(value: float | None, digits: int = 3) -> str:
    return fmt(None if value is None else value / _MM, digits)


def _mpa(value: float | None) -> str:
    return fmt(None if value is None else value / _MPA, 1)


def _thread_listing() -> tuple[list[str], list[list[str]]]:
    header = [
        "designation",
        "series",
        "d [mm]",
        "P [mm]",
        "d2 [mm]",
        "d3 [mm]",
        "D1 [mm]",
        "As [mm^2]",
        "s hex [mm]",
        "dk socket [mm]",
        "m nut [mm]",
        "hole f/m/c [mm]",
        "source",
    ]
    rows = []
    for t in threads():
        holes = "/".join(_mm(h, 2) for h in (t.hole_fine, t.hole_medium, t.hole_coarse))
        rows.append(
            [
                t.designation,
                t.series,
                _mm(t.d),
                _mm(t.P, 4),
                _mm(t.d2),
                _mm(t.d3),
                _mm(t.d1),
                fmt(t.As / _MM**2, 2),
                _mm(t.head_across_flats, 2),
                _mm(t.socket_head_diameter, 2),
                _mm(t.nut_height, 2),
                holes,
                t.source,
            ]
        )
    return header, rows


def _grade_listing() -> tuple[list[str], list[list[str]]]:
    header = [
        "grade",
        "d range [mm]",
        "Rm [MPa]",
        "yield [MPa]",
        "yield basis",
        "proof [MPa]",
        "E [GPa]",
        "alpha [1e-6/K]",
        "material",
        "source",
    ]
    rows = []
    for g in grades():
        lo, hi = g.d_range
        rows.append(
            [
                g.name,
                f"{_mm(lo, 2)}..{_mm(hi, 2)}",
                _mpa(g.Rm),
                _mpa(g.Rp02),
                g.yield_basis,
                _mpa(g.proof),
                fmt(g.E / _GPA, 1),
                fmt(g.alpha * 1e6, 2),
                g.material_key,
                g.source,
            ]
        )
    return header, rows


def _material_listing() -> tuple[list[str], list[list[str]]]:
    header = [
        "key",
        "name",
        "E20 [GPa]",
        "nu",
        "alpha20 [1e-6/K]",
        "Rp0.2 [MPa]",
        "Rm [MPa]",
        "pG [MPa]",
        "tauB/Rm",
        "T range [degC]",
        "source",
    ]
    rows = []
    for m in materials():
        (lo, hi), (a_lo, a_hi) = m.data_range("E"), m.data_range("alpha")
        span = f"{fmt(lo - ZERO_C, 1)}..{fmt(hi - ZERO_C, 1)}"
        if (a_lo, a_hi) != (lo, hi):  # each property has its own data
            span = f"E {span}, alpha {fmt(a_lo - ZERO_C, 1)}..{fmt(a_hi - ZERO_C, 1)}"
        rows.append(
            [
                m.key,
                m.name,
                fmt(m.E20 / _GPA, 1),
                fmt(m.nu, 3),
                fmt(m.alpha20 * 1e6, 2),
                _mpa(m.Rp02),
                _mpa(m.Rm),
                _mpa(m.pG),
                fmt(m.shear_ratio, 2),
                span,
                f"{m.source}; temperature table: {m.table_source}",
            ]
        )
    return header, rows


def _gasket_listing() -> tuple[list[str], list[list[str]]]:
    from clampstack.catalog.gaskets import gasket_listing

    return gasket_listing()


def _friction_listing() -> tuple[list[str], list[list[str]]]:
    from clampstack.catalog.friction import friction_listing

    return friction_listing()


def _tool_listing() -> tuple[list[str], list[list[str]]]:
    from clampstack.catalog.friction import tool_listing

    return tool_listing()


def listing(kind: str) -> tuple[list[str], list[list[str]]]:
    """Return a display table of one part of the catalog.

    Parameters
    ----------
    kind : str
        ``"threads"``, ``"grades"`` or ``"materials"`` (case-insensitive).

    Returns
    -------
    header : list of str
        Column titles with units in brackets; the last one is ``"source"``.
    rows : list of list of str
        One row of display strings per catalog entry (``-`` for a missing value).

    Raises
    ------
    InputError
        An unknown kind; the message lists the known ones.
    """
    builders = {
        "threads": _thread_listing,
        "grades": _grade_listing,
        "materials": _material_listing,
        "gaskets": _gasket_listing,
        "friction": _friction_listing,
        "tools": _tool_listing,
    }
    builder = builders.get(str(kind).strip().lower())
    if builder is None:
        raise InputError(f"unknown catalog listing {kind!r}; known: {', '.join(KINDS)}", key="kind")
    return builder()


def _n(value: float | None, scale: float = 1.0) -> float | None:
    """A catalog number in a JSON unit (None where the catalog has none)."""
    return None if value is None else float(value) / scale


def records(kind: str) -> list[dict[str, object]]:
    """One part of the catalog as records for JSON: snake_case keys with the unit in the
    name (``d_mm``, ``yield_strength_MPa``), numbers as numbers, the source of each row.

    ``kind`` as for :func:`listing`; an unknown kind is an InputError.
    """
    k = str(kind).strip().lower()
    if k == "threads":
        return [
            {
                "designation": t.designation,
                "series": t.series,
                "d_mm": _n(t.d, _MM),
                "pitch_mm": _n(t.P, _MM),
                "d2_mm": _n(t.d2, _MM),
                "d3_mm": _n(t.d3, _MM),
                "d1_mm": _n(t.d1, _MM),
                "stress_area_mm2": _n(t.As, _MM**2),
                "head_across_flats_mm": _n(t.head_across_flats, _MM),
                "socket_head_diameter_mm": _n(t.socket_head_diameter, _MM),
                "nut_height_mm": _n(t.nut_height, _MM),
                "hole_fine_mm": _n(t.hole_fine, _MM),
                "hole_medium_mm": _n(t.hole_medium, _MM),
                "hole_coarse_mm": _n(t.hole_coarse, _MM),
                "source": t.source,
            }
            for t in threads()
        ]
    if k == "grades":
        return [
            {
                "grade": g.name,
                "d_min_mm": _n(g.d_range[0], _MM),
                "d_max_mm": _n(g.d_range[1], _MM),
                "tensile_strength_MPa": _n(g.Rm, _MPA),
                "yield_strength_MPa": _n(g.Rp02, _MPA),
                "yield_basis": g.yield_basis,
                "proof_stress_MPa": _n(g.proof, _MPA),
                "modulus_GPa": _n(g.E, _GPA),
                "expansion_per_K": _n(g.alpha),
                "material": g.material_key,
                "source": g.source,
            }
            for g in grades()
        ]
    if k == "materials":
        out = []
        for m in materials():
            (lo, hi), (a_lo, a_hi) = m.data_range("E"), m.data_range("alpha")
            out.append(
                {
                    "key": m.key,
                    "name": m.name,
                    "modulus_GPa": _n(m.E20, _GPA),  # at 20 degC
                    "poisson_ratio": _n(m.nu),
                    "expansion_per_K": _n(m.alpha20),  # mean, from 20 degC
                    "yield_strength_MPa": _n(m.Rp02, _MPA),
                    "tensile_strength_MPa": _n(m.Rm, _MPA),
                    "limiting_surface_pressure_MPa": _n(m.pG, _MPA),
                    "shear_strength_ratio": _n(m.shear_ratio),
                    "modulus_temperature_range_degC": [lo - ZERO_C, hi - ZERO_C],
                    "expansion_temperature_range_degC": [a_lo - ZERO_C, a_hi - ZERO_C],
                    "source": m.source,
                    "temperature_table_source": m.table_source,
                }
            )
        return out
    if k == "gaskets":
        from clampstack.catalog.gaskets import PSI, gaskets

        return [
            {
                "key": g.key,
                "name": g.name,
                "m": g.m,
                "y_MPa": g.y / _MPA,
                "y_psi": g.y / PSI,
                "max_stress_MPa": g.max_stress / _MPA,
                "unload_modulus_MPa": g.unload_modulus / _MPA,
                "expansion_per_K": g.expansion,
                "relaxation": [
                    {"temperature_degC": T - ZERO_C, "factor": p}
                    for T, p in zip(g.relax_temperature, g.relax_factor, strict=True)
                ],
                "source": g.source,
                "service_source": g.service_source,
            }
            for g in gaskets()
        ]
    if k == "friction":
        from clampstack.catalog.friction import lubricants

        return [
            {
                "key": x.key,
                "name": x.name,
                "thread_friction_min": x.thread[0],
                "thread_friction_max": x.thread[1],
                "head_friction_min": x.head[0],
                "head_friction_max": x.head[1],
                "source": x.source,
            }
            for x in lubricants()
        ]
    if k == "tools":
        from clampstack.catalog.friction import tools

        return [
            {"key": x.key, "name": x.name, "torque_tolerance": x.tolerance, "source": x.source}
            for x in tools()
        ]
    raise InputError(f"unknown catalog listing {kind!r}; known: {', '.join(KINDS)}", key="kind")
