"""Verification cases: the package against published values and closed forms.

``clampstack verify`` runs every registered case and prints, per case, the
kind of comparison (published value, hand calculation, or consistency check of
the solver against the tool's own closed form), the published source, the
expected and computed values, the deviation and the tolerance.  The same cases
run in the test suite (``tests/verify``), and ``docs/validation.md`` is generated
from them (``python -m clampstack.verify.docgen``).
"""

from .registry import (
    HEADERS,
    KINDS,
    Case,
    CaseResult,
    Outcome,
    cases,
    get,
    rows,
    run_all,
    run_case,
    summary,
)

__all__ = [
    "HEADERS",
    "KINDS",
    "Case",
    "CaseResult",
    "Outcome",
    "cases",
    "get",
    "rows",
    "run_all",
    "run_case",
    "summary",
]
