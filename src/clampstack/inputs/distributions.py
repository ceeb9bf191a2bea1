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


def parse_distributions(raw: Any) -> dict[str, Dist]:
    """The ``[distributions]`` table -> {key: Dist}; InputError naming the key."""
    if raw is None:
        return {}
    if not isinstance(raw, dict):
        raise InputError("expected a table", key="distributions")
    out = {}
    for name, spec in raw.items():
        key = f"distributions.{name}"
        if name not in DIST_KEYS:
            import difflib

            near = difflib.get_close_matches(str(name), DIST_KEYS, n=2)
            hint = (
                f" (did you mean {', '.join(near)}?)"
                if near
                else (f" (known: {', '.join(DIST_KEYS)})")
            )
            raise InputError(f"unknown key{hint}", key=key)
        kind = DIST_KEYS[name][0]
        d = _parse_one(spec, kind, key, name == "temperature")
        bound = DIST_LOWER_BOUNDS.get(name)
        if bound is not None:
            below = d.share_below(bound)
            if d.kind == "uniform" and below > 0:
                raise InputError(
                    f"the range reaches below {_bound_text(name, bound)}, which "
                    f"{DIST_KEYS[name][1]} cannot be",
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
