"""Verification cases: the package against published values and closed forms.

``clampstack verify`` runs every registered case and prints, per case, the
published source, the expected and computed values, the deviation and the
tolerance.  The same cases run in the test suite (``tests/verify``), and
``docs/validation.md`` is generated from them (``python -m clampstack.verify.docgen``).
"""

from .registry import (
    HEADERS,
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
