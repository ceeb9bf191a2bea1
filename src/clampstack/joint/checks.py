"""Design checks of a joint: one result object per published rule.

Each :class:`Check` carries the value, the limit, the unit, the margin, whether
it passes and its published source.  The margin is the relative reserve: for a
check of the form ``value <= limit`` it is ``limit / value - 1``; for
``value >= limit`` it is ``value / limit - 1``.  A check passes when its margin
is not negative (to a relative round-off of 1e-9).
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Any

#: Names of the checks (stable: used in files to switch a check off, and in JSON).
CHECK_NAMES: tuple[str, ...] = (
    "assembly_preload",
    "working_stress",
    "fatigue",
    "residual_clamp_load",
    "separation",
    "opening",
    "slip",
    "surface_pressure_head",
    "surface_pressure_nut",
    "thread_stripping",
    "plastic_collapse",
    "cycle_yield",
)

_TOL = 1e-9


#: display unit of a check -> (factor to SI, SI unit)
SI_UNITS: dict[str, tuple[float, str]] = {
    "kN": (1e3, "N"),
    "N": (1.0, "N"),
    "MPa": (1e6, "Pa"),
    "mm": (1e-3, "m"),
    "um": (1e-6, "m"),
    "mm2": (1e-6, "m2"),
    "deg": (math.pi / 180.0, "rad"),
    "N*m": (1.0, "N*m"),
    "": (1.0, ""),
}


@dataclass(frozen=True)
class Check:
    """One design check.  ``value`` and ``limit`` are in ``unit``."""

    name: str
    title: str
    value: float
    limit: float
    unit: str
    relation: str  # "<=" or ">="
    source: str
    detail: str = ""
    skipped: str | None = None  # reason, when switched off in the input
    #: the same check on another basis, shown as information: {basis, preload_N, value, limit, margin}
    information: dict[str, Any] | None = None
    extra: dict[str, Any] | None = None  # further keys of the check's JSON form

    @property
    def margin(self) -> float:
        """Relative reserve (>= 0 passes); ``inf`` where the value is zero in a ``<=`` check."""
        if self.relation == "<=":
            if self.value <= 0:
                return math.inf
            return self.limit / self.value - 1.0
        if self.limit <= 0:
            return math.inf
        return self.value / self.limit - 1.0

    @property
    def passed(self) -> bool:
        """True if the rule is met (always true for a check switched off)."""
        if self.skipped is not None:
            return True
        return self.margin >= -_TOL

    @property
    def si(self) -> tuple[float | None, float | None, str]:
        """Value, limit and unit in SI (N, Pa, m, m^2, rad; a ratio as it is)."""
        factor, unit = SI_UNITS.get(self.unit, (1.0, self.unit))

        def conv(x: float | None) -> float | None:
            if x is None or not math.isfinite(x):
                return None
            return x * factor

        return conv(self.value), conv(self.limit), unit

    def to_dict(self) -> dict[str, Any]:
        """JSON form: ``{name, value, limit, unit, value_si, limit_si, unit_si, margin, pass,
        source, ...}`` (value and limit in the display unit of the check, and in SI)."""
        m = self.margin
        v_si, l_si, u_si = self.si
        return {
            "name": self.name,
            "title": self.title,
            "value": self.value,
            "limit": self.limit,
            "unit": self.unit,
            "value_si": v_si,
            "limit_si": l_si,
            "unit_si": u_si,
            "relation": self.relation,
            "margin": None if math.isinf(m) else m,
            "pass": self.passed,
            "source": self.source,
            "detail": self.detail,
            "skipped": self.skipped,
            "information": self.information,
            **(self.extra or {}),
        }
