"""Readers of the tables that joint and flange files share, and the one record of defaults.

Every reader takes a table as :func:`~clampstack.inputs.schema.read_table` returns
it (keys checked, quantities in SI floats, absent keys None) and a
:class:`Defaults` record, to which it adds each default it applies with the text
that is printed beside the results.
"""

from __future__ import annotations

from typing import Any

from ..catalog import Grade, Thread
from ..catalog import grade as catalog_grade
from ..catalog import material as catalog_material
from ..catalog import thread as catalog_thread
from ..errors import InputError
from ..joint.model import PartMaterial, TighteningSpec


class Defaults:
    """The defaults applied while a file is read, in order: (key path, printed text)."""

    def __init__(self) -> None:
        self.items: list[tuple[str, str]] = []

    def note(self, key: str, text: str) -> None:
        """Record that ``key`` took its default, printed as ``text``."""
        self.items.append((key, text))

    def pick(self, key: str, given: Any, default: Any, text: str) -> Any:
        """``given`` if the file set it, else ``default`` (recorded, printed as ``text``)."""
        if given is not None:
            return given
        self.note(key, text)
        return default

    def as_tuple(self) -> tuple[tuple[str, str], ...]:
        return tuple(self.items)


def empty(schema: Any) -> dict[str, Any]:
    """An absent table read as one whose every key is absent."""
    return {k.name: None for k in schema.keys}


def given_keys(raw: dict[str, Any], path: str = "") -> frozenset[str]:
    """Key paths that a read table sets: ``bolt.length``, ``clamped[2].hole``, ``nut`` ..."""
    out: set[str] = set()
    for name, value in raw.items():
        if value is None:
            continue
        kp = f"{path}.{name}" if path else name
        out.add(kp)
        if isinstance(value, dict) and name != "distributions":
            out |= given_keys(value, kp)
        elif isinstance(value, list) and value and all(isinstance(v, dict) for v in value):
            for i, v in enumerate(value):
                out |= given_keys(v, f"{kp}[{i + 1}]")
    return frozenset(out)


def thread_and_grade(b: dict[str, Any]) -> tuple[Thread, Grade]:
    """The ``[bolt]`` table's thread and grade from the catalog (errors name the key)."""
    try:
        thr = catalog_thread(b["thread"])
    except InputError as err:
        raise InputError(err.detail, key="bolt.thread") from None
    try:
        grd = catalog_grade(b["grade"], thr.d)
    except InputError as err:
        raise InputError(err.detail, key="bolt.grade") from None
    return thr, grd


def part_material(
    raw: dict[str, Any], key: str, default: str | None, rec: Defaults
) -> PartMaterial:
    """A part's material: a catalog key, and/or a constant modulus and expansion.

    ``default`` (a catalog key) applies when neither material nor modulus is given;
    without a default that is an error.  A modulus given alone takes its expansion
    from the default material.
    """
    name = raw.get("material")
    mat = None
    if name is None and raw.get("modulus") is None:
        if default is None:
            raise InputError(
                "required key is missing (give material, or modulus and expansion)",
                key=f"{key}.material",
            )
        name = default
        rec.note(f"{key}.material", default)
    if name is not None:
        try:
            mat = catalog_material(name)
        except InputError as err:
            raise InputError(err.detail, key=f"{key}.material") from None
    if mat is None and raw.get("expansion") is None:
        if default is None:
            raise InputError(
                "a part given by modulus needs its expansion too (or a material)",
                key=f"{key}.expansion",
            )
        mat = catalog_material(default)  # the modulus overrides; expansion from the default
        rec.note(f"{key}.expansion", f"from {default}")
    label = mat.key if mat is not None else "user modulus"
    return PartMaterial(label, mat, raw.get("modulus"), raw.get("expansion"))


def _check_methods(tr: dict[str, Any], method: str) -> None:
    if tr["torque"] is not None and tr["preload"] is not None:
        raise InputError("give torque or preload, not both", key="tightening.preload")
    if method == "yield" and (tr["torque"] is not None or tr["preload"] is not None):
        raise InputError(
            "method 'yield' tightens to the yield point; remove torque and "
            'preload, or use method "torque"',
            key="tightening.method",
        )
    angle_keys = [k for k in ("snug_torque", "angle", "angle_tolerance") if tr.get(k) is not None]
    if method == "angle":
        if tr["torque"] is not None or tr["preload"] is not None:
            raise InputError(
                "method 'angle' takes snug_torque and angle, not torque or preload",
                key="tightening.torque" if tr["torque"] is not None else "tightening.preload",
            )
        for k in ("snug_torque", "angle"):
            if tr.get(k) is None:
                raise InputError(
                    f"method 'angle' needs {k} (a snug torque, then the angle turned)",
                    key=f"tightening.{k}",
                )
    elif angle_keys:
        raise InputError(
            f'{angle_keys[0]} applies to method = "angle" only', key=f"tightening.{angle_keys[0]}"
        )
    if method == "tension" and tr["torque"] is not None:
        raise InputError(
            "a tensioner sets a preload, not a torque; give preload", key="tightening.torque"
        )


def _load_transfer(tr: dict[str, Any], method: str) -> float | None:
    ltf = tr.get("load_transfer_factor")
    if ltf is not None and method != "tension":
        raise InputError(
            'load_transfer_factor applies to method = "tension" only',
            key="tightening.load_transfer_factor",
        )
    if ltf is not None and not 0.3 <= ltf <= 1.0:
        raise InputError(
            "a load transfer factor lies between 0.3 and 1 (residual / applied tension)",
            key="tightening.load_transfer_factor",
        )
    return ltf


def tightening(
    tr: dict[str, Any], thr: Thread, grd: Grade, rec: Defaults, DKm: float | None = None
) -> TighteningSpec:
    """The ``[tightening]`` table: method, torque or preload, friction, utilisation, tolerance.

    Defaults: thread friction 0.10..0.16, head friction as the thread's, utilisation
    nu = 0.9 of the yield point (VDI 2230-1, 5.4.3), torque tolerance +-6 % (common
    practice, no source).
    """
    method = rec.pick("tightening.method", tr["method"], "torque", "torque")
    _check_methods(tr, method)
    lub = None
    nut_factor = tr.get("nut_factor")
    if nut_factor is not None:
        from ..components import friction_from_nut_factor

        given = [k for k in ("thread_friction", "head_friction", "lubricant") if tr.get(k)]
        if given:
            raise InputError(
                f"give a nut factor or friction (coefficients or a lubricant), not both (also "
                f"given: tightening.{given[0]})",
                key="tightening.nut_factor",
            )
        if not (0.05 <= nut_factor[0] and nut_factor[1] <= 0.6):
            raise InputError(
                f"nut factor {nut_factor[0]:g}..{nut_factor[1]:g} is outside 0.05..0.6, the "
                "range of any lubricated or dry steel thread (common practice)",
                key="tightening.nut_factor",
            )
        assert DKm is not None
        mu = tuple(
            float(friction_from_nut_factor(K, thr.d, thr.P, thr.d2, DKm)) for K in nut_factor
        )
        if mu[0] <= 0:
            raise InputError(
                f"nut factor {nut_factor[0]:g} is too small for a {thr.designation} thread: it "
                "implies no friction at all",
                key="tightening.nut_factor",
            )
        muG = muK = (mu[0], mu[1])
        text = f"{mu[0]:.3f}..{mu[1]:.3f}" if mu[1] > mu[0] else f"{mu[0]:.3f}"
        rec.note(
            "tightening.thread_friction",
            f"{text} (implied by the nut factor; thread and bearing face alike)",
        )
        rec.note("tightening.head_friction", f"{text} (implied by the nut factor)")
    elif tr.get("lubricant") is not None:
        from ..catalog.friction import lubricant

        given = [k for k in ("thread_friction", "head_friction") if tr[k] is not None]
        if given:
            raise InputError(
                f"give a lubricant or friction coefficients, not both (also given: "
                f"tightening.{given[0]})",
                key="tightening.lubricant",
            )
        try:
            lub = lubricant(tr["lubricant"])
        except InputError as err:
            raise InputError(err.detail, key="tightening.lubricant") from None
        muG, muK = lub.thread, lub.head
        rng = f"{muG[0]:.2f}..{muG[1]:.2f}"
        rec.note("tightening.thread_friction", f"{rng} (lubricant {lub.key})")
        rec.note(
            "tightening.head_friction",
            f"{lub.head[0]:.2f}..{lub.head[1]:.2f} (lubricant {lub.key})",
        )
    else:
        muG = rec.pick(
            "tightening.thread_friction", tr["thread_friction"], (0.10, 0.16), "0.10..0.16"
        )
        muK = rec.pick("tightening.head_friction", tr["head_friction"], muG, "as thread friction")
    for name, mu in (("thread_friction", muG), ("head_friction", muK)):
        if mu[1] > 1.0:
            raise InputError(
                f"friction coefficient {mu[1]:g} is not plausible (above 1)",
                key=f"tightening.{name}",
            )
    nu = rec.pick("tightening.utilization", tr["utilization"], 0.9, "0.9")
    if nu > 1.0:
        raise InputError("utilization must not exceed 1", key="tightening.utilization")
    tool_ = None
    if tr.get("tool") is not None:
        from ..catalog.friction import tool

        if tr["torque_tolerance"] is not None:
            raise InputError(
                "give a tool or a torque tolerance, not both (also given: "
                "tightening.torque_tolerance)",
                key="tightening.tool",
            )
        try:
            tool_ = tool(tr["tool"])
        except InputError as err:
            raise InputError(err.detail, key="tightening.tool") from None
        tol = tool_.tolerance
        rec.note("tightening.torque_tolerance", f"+-{tol:.0%} (tool {tool_.key})")
    else:
        tol = tr["torque_tolerance"] if tr["torque_tolerance"] is not None else 0.06
        if tr["torque_tolerance"] is None and method == "torque":
            rec.note("tightening.torque_tolerance", "+-6 %")
    if tol >= 0.5:
        raise InputError("torque tolerance must be below 0.5", key="tightening.torque_tolerance")
    if tr["preload"] is not None and tr["preload"] > thr.As * grd.Rm:
        raise InputError(
            f"preload {tr['preload'] / 1e3:g} kN is above the bolt's tensile strength "
            f"(As x Rm = {thr.As * grd.Rm / 1e3:.4g} kN)",
            key="tightening.preload",
        )
    return TighteningSpec(
        method,
        tr["torque"],
        tr["preload"],
        muG,
        muK,
        tr["scatter"],
        nu,
        tol,
        lub.key if lub else None,
        tool_.key if tool_ else None,
        nut_factor,
        tr.get("snug_torque"),
        tr.get("angle"),
        tr.get("angle_tolerance") or 0.0,
        _load_transfer(tr, method),
    )
