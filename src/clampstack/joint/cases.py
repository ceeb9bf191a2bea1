"""Load cases of one joint: the check chain for every ``[[case]]``, and the governing values.

A case replaces the service state of the joint file (axial load, shear load, bending
moment, service and assembly temperature); everything else (bolt, parts, tightening,
requirements) stays.  Parts that have a temperature of their own keep their rise above
the assembly temperature in proportion to the joint's, as in a temperature sweep
(:meth:`~clampstack.joint.thermal.TemperatureModel.part_T`): a hot flange stays hotter
than its bolt in every case; with the file's service temperature equal to its assembly
temperature, they keep their difference instead.

:func:`~clampstack.joint.analysis.analyse` runs the chain per case, and
:func:`merge_cases` returns the result of the governing case (the one holding the smallest margin of any
check) with every check replaced by its worst case (``governing_case`` names it), the
governing values (largest bolt load and required preload, smallest residual clamp load
and separation load over the cases), and the list of the cases.  The states are the
governing case's.
"""

from __future__ import annotations

from dataclasses import dataclass, replace
from typing import Any

from ..errors import InputError
from .model import CaseSpec, JointSpec


def _mapped(T_part: float, spec: JointSpec, T_case: float, T_asm_case: float) -> float:
    """A part's temperature in the case (the sweep's rule, from the file's own state)."""
    srv = spec.service
    rise = srv.temperature - srv.assembly_temperature
    if abs(rise) > 1e-9:
        share = (T_part - srv.assembly_temperature) / rise
        return T_asm_case + share * (T_case - T_asm_case)
    return T_case + (T_part - srv.temperature)


def case_spec(spec: JointSpec, case: CaseSpec) -> JointSpec:
    """The joint in one load case: its loads and temperatures in place of ``[service]``."""
    srv = spec.service
    T = srv.temperature if case.temperature is None else case.temperature
    T0 = (
        srv.assembly_temperature if case.assembly_temperature is None else case.assembly_temperature
    )
    service = replace(
        srv,
        axial_load=srv.axial_load if case.axial_load is None else case.axial_load,
        shear_load=srv.shear_load if case.shear_load is None else case.shear_load,
        bending_moment=srv.bending_moment if case.bending_moment is None else case.bending_moment,
        temperature=T,
        assembly_temperature=T0,
    )

    given = dict(case.part_temperatures)

    def m(name: str, T_part: float) -> float:
        return given[name] if name in given else _mapped(T_part, spec, T, T0)

    bolt = replace(spec.bolt, temperature=m("bolt", spec.bolt.temperature))
    nut = spec.nut
    if nut is not None:
        nut = replace(nut, temperature=m("nut", nut.temperature))
    tapped = spec.tapped_hole
    if tapped is not None:
        tapped = replace(tapped, temperature=m("tapped_hole", tapped.temperature))
    layers = tuple(replace(x, temperature=m(x.name, x.temperature)) for x in spec.layers)
    return replace(
        spec,
        service=service,
        bolt=bolt,
        nut=nut,
        tapped_hole=tapped,
        layers=layers,
        cases=(),
    )


@dataclass(frozen=True)
class CaseResult:
    """One load case's analysis."""

    name: str
    result: Any  # JointResult of the case

    def to_dict(self) -> dict[str, Any]:
        d = self.result.to_dict()
        return {
            "name": self.name,
            "ok": d["ok"],
            "preload": d["preload"],
            "service": d["service"],
            "checks": d["checks"],
            "governing_check": None
            if self.result.governing is None
            else self.result.governing.name,
        }


def _worse(c: Any, than: Any) -> bool:
    """``c`` is the worse of two results of one check: the smaller margin, and on a tie (a
    limit of zero gives -100 % to any value above it) the value further past the limit."""
    if c.margin != than.margin:
        return c.margin < than.margin
    return c.value > than.value if c.relation == "<=" else c.value < than.value


def merge_cases(spec: JointSpec, results: list[CaseResult]) -> Any:
    """The governing case's result with the worst check of every name across the cases
    (each naming its ``governing_case``), the governing values and the cases in
    :attr:`~clampstack.joint.analysis.JointResult.cases`."""
    worst: dict[str, tuple[str, Any]] = {}
    order: list[str] = []
    for cr in results:
        for c in cr.result.checks:
            if c.name not in worst:
                order.append(c.name)
            if c.skipped is not None:
                worst.setdefault(c.name, (cr.name, c))
                continue
            held = worst.get(c.name)
            if held is None or held[1].skipped is not None or _worse(c, held[1]):
                worst[c.name] = (cr.name, c)
    checks = tuple(
        replace(worst[n][1], extra={**(worst[n][1].extra or {}), "governing_case": worst[n][0]})
        for n in order
    )

    def smallest(cr: CaseResult) -> float:  # the case's governing margin
        g = cr.result.governing
        return float("inf") if g is None else g.margin

    gov = min(results, key=smallest)
    base = gov.result
    notes = list(base.notes)
    for cr in results:
        for n in cr.result.notes:
            if n not in base.notes and f"[{cr.name}] {n}" not in notes:
                notes.append(f"[{cr.name}] {n}")
    required = [cr.result.required_assembly_min for cr in results]
    torques = [cr.result.torque_required for cr in results if cr.result.torque_required is not None]
    return replace(
        base,
        spec=replace(base.spec, cases=spec.cases),
        checks=checks,
        notes=tuple(notes),
        required_assembly_min=max(required),
        bolt_load_max=max(cr.result.bolt_load_max for cr in results),
        bolt_load_max_actual=max(cr.result.bolt_load_max_actual for cr in results),
        bolt_load_max_permissible=max(cr.result.bolt_load_max_permissible for cr in results),
        residual_clamp_min=min(cr.result.residual_clamp_min for cr in results),
        separation_load=min(cr.result.separation_load for cr in results),
        required_clamp_load=max(cr.result.required_clamp_load for cr in results),
        torque_required=max(torques) if torques else None,
        cases=tuple(results),
        governing_case=gov.name,
    )


def check_case_name(spec: JointSpec, name: str | None) -> None:
    """InputError (key ``--case``) unless ``name`` is None or one of the file's cases."""
    if name is None:
        return
    if not spec.cases:
        raise InputError("the file has no [[case]] tables", key="--case")
    names = [c.name for c in spec.cases]
    if name not in names:
        raise InputError(
            f"no load case {name!r}; the file has {', '.join(map(repr, names))}", key="--case"
        )
