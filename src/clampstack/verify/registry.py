"""The registry of verification cases and the runner behind ``clampstack verify``.

A case is a small function without arguments that computes one number with the
package and returns it beside the published or hand-calculated value it must
match: ``Outcome(computed, expected, tolerance, source, unit)``.  The tolerance
is relative (``|computed - expected| <= tolerance |expected|``); it is the
rounding of the printed value, or the stated accuracy of the hand working.

Every case says what kind of comparison it is (:data:`KINDS`): ``"published"``
(a value printed in a standard's table or a book's worked example),
``"hand"`` (a published relation worked by hand, the working beside the case) or
``"consistency"`` (the spring network or a study against the tool's own closed
form, evaluated with quantities the tool computed: a check of the solver, not of
the mechanics against the outside world).
"""

from __future__ import annotations

import importlib
import math
from collections.abc import Callable
from dataclasses import dataclass
from typing import Any, NamedTuple

#: Case modules, in the order their groups are listed.
CASE_MODULES = (
    "threads",
    "grades",
    "stiffness",
    "tightening",
    "joint",
    "thermal",
    "flange",
    "network",
    "shigley",
    "checks",
    "sweep",
    "rare",
    "eccentric",
)

#: The kinds of comparison a case makes, and what each means.
KINDS: dict[str, str] = {
    "published": "a value printed in a standard's table or a book's worked example",
    "hand": "a published relation worked by hand (the working is beside the case)",
    "consistency": (
        "the network or a study against the tool's own closed form, with quantities "
        "the tool computed (checks the solver, not the mechanics)"
    ),
}


class Outcome(NamedTuple):
    """What a case returns: ``(computed, expected, tolerance, source, unit)``.

    ``tolerance`` is relative to ``expected``; ``source`` names the standard and
    clause, or the book and example, and says "from memory" where the published
    value was recalled without the document at hand.
    """

    computed: float
    expected: float
    tolerance: float
    source: str
    unit: str = ""


@dataclass(frozen=True)
class Case:
    """A registered case: its name, its group, the function that computes it, its kind."""

    name: str
    group: str
    fn: Callable[[], Outcome]
    kind: str  # one of KINDS


@dataclass(frozen=True)
class CaseResult:
    """The outcome of running one case."""

    name: str
    group: str
    source: str
    expected: float | None
    computed: float | None
    unit: str
    deviation: float | None  # relative: (computed - expected) / |expected|
    tolerance: float | None
    passed: bool
    error: str | None = None
    kind: str = ""  # one of KINDS

    def to_dict(self) -> dict[str, Any]:
        """JSON form (``verify --json``)."""
        d: dict[str, Any] = {
            "name": self.name,
            "group": self.group,
            "kind": self.kind,
            "source": self.source,
            "expected": self.expected,
            "computed": self.computed,
            "unit": self.unit,
            "deviation": self.deviation,
            "tolerance": self.tolerance,
            "pass": self.passed,
        }
        if self.error is not None:
            d["error"] = self.error
        return d


_REGISTRY: dict[str, Case] = {}
_LOADED = False


def register(
    name: str, group: str, *, kind: str
) -> Callable[[Callable[[], Outcome]], Callable[[], Outcome]]:
    """Decorator: register ``fn`` as the verification case ``name`` in ``group``.

    ``kind`` is one of :data:`KINDS` and must be given, so that no case counts as a
    comparison with the outside world by default.
    """

    def deco(fn: Callable[[], Outcome]) -> Callable[[], Outcome]:
        add(name, group, fn, kind=kind)
        return fn

    return deco


def add(name: str, group: str, fn: Callable[[], Outcome], *, kind: str) -> None:
    """Register ``fn`` as case ``name`` of ``kind`` (names are unique)."""
    if name in _REGISTRY:
        raise ValueError(f"duplicate verification case {name!r}")  # programming error
    if kind not in KINDS:
        raise ValueError(f"case {name!r}: kind {kind!r} is not one of {', '.join(KINDS)}")
    _REGISTRY[name] = Case(name, group, fn, kind)


def cases() -> list[Case]:
    """Every registered case, in registration order (imports the case modules once)."""
    global _LOADED
    if not _LOADED:
        for mod in CASE_MODULES:
            importlib.import_module(f"{__package__}.cases_{mod}")
        _LOADED = True
    return list(_REGISTRY.values())


def get(name: str) -> Case:
    """The case called ``name``."""
    cases()
    return _REGISTRY[name]


def run_case(case: Case) -> CaseResult:
    """Run one case; an exception inside it is a failed case, never a crash."""
    try:
        out = case.fn()
        computed = float(out.computed)
        expected = float(out.expected)
        tol = float(out.tolerance)
    except Exception as err:  # a broken case must show up as a failure in the table
        return CaseResult(
            case.name,
            case.group,
            "",
            None,
            None,
            "",
            None,
            None,
            False,
            f"{type(err).__name__}: {err}",
            case.kind,
        )
    if expected == 0 or not (math.isfinite(computed) and math.isfinite(expected)):
        dev = None if not math.isfinite(computed) else computed - expected
        ok = dev is not None and abs(dev) <= tol
    else:
        dev = (computed - expected) / abs(expected)
        ok = abs(dev) <= tol
    return CaseResult(
        case.name,
        case.group,
        out.source,
        expected,
        computed if math.isfinite(computed) else None,
        out.unit,
        dev,
        tol,
        bool(ok),
        kind=case.kind,
    )


def run_all() -> list[CaseResult]:
    """Run every case, in order."""
    return [run_case(c) for c in cases()]


def summary(results: list[CaseResult]) -> dict[str, Any]:
    """The ``verify --json`` document."""
    passed = sum(1 for r in results if r.passed)
    return {
        "cases": [r.to_dict() for r in results],
        "passed": passed,
        "failed": len(results) - passed,
        "ok": passed == len(results),
        "kinds": {k: sum(1 for r in results if r.kind == k) for k in KINDS},
    }


# ----------------------------------------------------------------------------- formatting


def fmt_value(x: float | None) -> str:
    """Six significant figures, plain for ordinary magnitudes."""
    if x is None:
        return "-"
    if x == 0:
        return "0"
    ax = abs(x)
    if ax >= 1e7 or ax < 1e-3:
        return f"{x:.5e}"
    return f"{x:.6g}"


def fmt_deviation(dev: float | None) -> str:
    """Relative deviation in per cent, three decimals (``0.000 %`` for agreement)."""
    if dev is None:
        return "-"
    text = f"{dev * 100:+.3f}"
    if text in ("+0.000", "-0.000"):
        return "0.000 %"
    return f"{text} %"


def fmt_tolerance(tol: float | None) -> str:
    """Relative tolerance in per cent."""
    if tol is None:
        return "-"
    return f"{tol * 100:.2g} %"


HEADERS = (
    "case",
    "kind",
    "source",
    "expected",
    "computed",
    "unit",
    "deviation",
    "tolerance",
    "pass",
)


def rows(results: list[CaseResult]) -> list[list[str]]:
    """Table rows: case, kind, source, expected, computed, unit, deviation, tolerance, pass."""
    out = []
    for r in results:
        out.append(
            [
                r.name,
                r.kind,
                r.source if r.error is None else f"error: {r.error}",
                fmt_value(r.expected),
                fmt_value(r.computed),
                r.unit,
                fmt_deviation(r.deviation),
                fmt_tolerance(r.tolerance),
                "pass" if r.passed else "FAIL",
            ]
        )
    return out
