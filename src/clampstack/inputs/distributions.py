"""The ``[distributions]`` table of a joint file: what a scatter study varies, and how.

Each key (:data:`~clampstack.joint.model.DIST_KEYS`) takes ``"low..high"``
(uniform) or one of ``{uniform = [lo, hi]}``, ``{normal = [mean, std]}``,
``{lognormal = [mean, std]}``, quantities with units.
"""

from __future__ import annotations

from typing import Any

from ..errors import InputError
from ..joint.model import DIST_KEYS, DIST_LOWER_BOUNDS, MAX_TRUNCATED, Dist
from ..units import parse_quantity

#: What a flange file's ``[distributions]`` may vary (each bolt, each pass; the gasket's
#: relaxation factor once per flange).
FLANGE_DIST_KEYS: dict[str, tuple[str, str]] = {
    "thread_friction": DIST_KEYS["thread_friction"],
    "head_friction": DIST_KEYS["head_friction"],
    "nut_factor": ("dimensionless", "nut factor K of T = K F d"),
    "torque": DIST_KEYS["torque"],
    "torque_factor": DIST_KEYS["torque_factor"],
    "preload": DIST_KEYS["preload"],
    "gasket_relaxation": ("dimensionless", "gasket creep relaxation factor P_QR"),
}
FLANGE_LOWER_BOUNDS = {k: 0.0 for k in FLANGE_DIST_KEYS}


def parse_distributions(
    raw: Any, keys: dict[str, tuple[str, str]] | None = None
) -> dict[str, Dist]:
    """The ``[distributions]`` table -> {key: Dist}; InputError naming the key.

    ``keys``: the keys allowed (default: a joint file's, :data:`DIST_KEYS`)."""
    keys = DIST_KEYS if keys is None else keys
    bounds = DIST_LOWER_BOUNDS if keys is DIST_KEYS else FLANGE_LOWER_BOUNDS
    if raw is None:
        return {}
    if not isinstance(raw, dict):
        raise InputError("expected a table", key="distributions")
    out = {}
    for name, spec in raw.items():
        key = f"distributions.{name}"
        if name not in keys:
            import difflib

            near = difflib.get_close_matches(str(name), keys, n=2)
            hint = (
                f" (did you mean {', '.join(near)}?)" if near else (f" (known: {', '.join(keys)})")
            )
            raise InputError(f"unknown key{hint}", key=key)
        kind = keys[name][0]
        d = _parse_one(spec, kind, key, name == "temperature")
        bound = bounds.get(name)
        if bound is not None:
            below = d.share_below(bound)
            if d.kind == "uniform" and below > 0:
                raise InputError(
                    f"the range reaches below {_bound_text(name, bound)}, which "
                    f"{keys[name][1]} cannot be",
                    key=key,
                )
            if below > MAX_TRUNCATED:
                raise InputError(
                    f"{below:.2g} of the samples would fall below {_bound_text(name, bound)} "
                    f"(at most {MAX_TRUNCATED:g} are truncated): give a narrower distribution",
                    key=key,
                )
        out[name] = d
    if "torque" in out and "torque_factor" in out:
        raise InputError("give torque or torque_factor, not both", key="distributions.torque")
    return out


def _parse_one(spec: Any, kind: str, key: str, absolute_temperature: bool) -> Dist:
    if isinstance(spec, str) and ".." in spec:
        from ..units import parse_range

        lo, hi = parse_range(spec, kind, key)
        return Dist("uniform", lo, hi)
    if not isinstance(spec, dict) or len(spec) != 1:
        raise InputError(
            'expected "low..high" or one of {uniform = [lo, hi]}, '
            "{normal = [mean, std]}, {lognormal = [mean, std]}",
            key=key,
        )
    ((form, params),) = spec.items()
    if form not in ("uniform", "normal", "lognormal"):
        raise InputError(f"unknown distribution {form!r} (uniform, normal, lognormal)", key=key)
    if not isinstance(params, list) or len(params) != 2:
        raise InputError(f"{form} takes two values, e.g. {form} = [a, b]", key=f"{key}.{form}")
    a = parse_quantity(params[0], kind, f"{key}.{form}")
    second_kind = kind
    if form != "uniform" and absolute_temperature:
        second_kind = "temperature_difference"  # a spread of temperature is a difference
    b = parse_quantity(params[1], second_kind, f"{key}.{form}")
    if form == "uniform" and a > b:
        raise InputError(
            f"uniform range has its low end above its high end ({a:g} > {b:g})", key=f"{key}.{form}"
        )
    if form != "uniform" and b < 0:
        raise InputError("standard deviation must not be negative", key=f"{key}.{form}")
    if form == "lognormal" and a <= 0:
        raise InputError("a lognormal variable needs a positive mean", key=f"{key}.{form}")
    return Dist(form, a, b)


def _bound_text(name: str, bound: float) -> str:
    return "absolute zero" if name == "temperature" else f"{bound:g}"
