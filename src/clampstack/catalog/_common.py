"""Shared helpers of the catalog: reading the packaged CSV files, name matching, formatting.

The data files live in ``clampstack/data``; each row carries a ``source`` column naming the
published standard or handbook it comes from (``from memory`` where the value was recalled
without the document at hand).  Reading is lazy and cached: nothing is read at import time.
"""

from __future__ import annotations

import csv
import re
from collections.abc import Iterable
from functools import cache
from typing import TypeVar

from clampstack.errors import InputError

T = TypeVar("T")

#: Package that holds the data directory.
_DATA_PACKAGE = "clampstack"
_DATA_DIR = "data"


@cache
def read_csv(name: str) -> tuple[dict[str, str], ...]:
    """Read one packaged CSV file into a tuple of row dictionaries (cached).

    Parameters
    ----------
    name : str
        File name inside ``clampstack/data``, e.g. ``"grades.csv"``.

    Returns
    -------
    tuple of dict
        One dictionary per data row, keyed by the header; values are stripped strings.
    """
    from importlib import resources

    path = resources.files(_DATA_PACKAGE).joinpath(_DATA_DIR, name)
    with path.open("r", encoding="utf-8", newline="") as fh:
        reader = csv.DictReader(fh)
        rows = []
        for row in reader:
            rows.append({k.strip(): (v or "").strip() for k, v in row.items() if k is not None})
    return tuple(rows)


def opt_float(text: str) -> float | None:
    """Parse a CSV cell as float; a blank cell is ``None``."""
    text = text.strip()
    return float(text) if text else None


def squash(text: str) -> str:
    """Lower-case ``text`` and drop every character that is not a letter or digit.

    Used to compare names tolerant of case, spaces, dashes, dots and underscores
    (``"Ti-6Al-4V"`` and ``"ti6al4v"`` compare equal).
    """
    return re.sub(r"[^a-z0-9]", "", text.lower())


def near_matches(
    query: str,
    candidates: list[str],
    n: int = 5,
    canonical: dict[str, str] | None = None,
) -> list[str]:
    """Return up to ``n`` names that look like ``query`` (case-insensitive, difflib).

    Parameters
    ----------
    query : str
        What the user typed.
    candidates : list of str
        Valid names and aliases (display spelling).
    n : int
        Maximum number of suggestions.
    canonical : dict, optional
        Maps a candidate (alias) to the canonical name to suggest; duplicates are dropped.
    """
    import difflib

    by_key: dict[str, str] = {}
    for cand in candidates:
        by_key.setdefault(cand.lower(), cand)
    hits = difflib.get_close_matches(query.strip().lower(), list(by_key), n=4 * n, cutoff=0.5)
    out: list[str] = []
    for h in hits:
        name = by_key[h]
        if canonical is not None:
            name = canonical.get(name, name)
        if name not in out:
            out.append(name)
    return out[:n]


def unknown(
    kind: str,
    query: str,
    candidates: list[str],
    hint: str,
    canonical: dict[str, str] | None = None,
    suggestions: list[str] | None = None,
) -> InputError:
    """Build the :class:`InputError` for an unknown catalog name, with near matches.

    ``suggestions`` (when given) replaces the difflib search over ``candidates``.
    """
    hits = (
        suggestions
        if suggestions is not None
        else near_matches(query, candidates, canonical=canonical)
    )
    msg = f"unknown {kind} {query!r}"
    if hits:
        msg += "; did you mean: " + ", ".join(hits[:5]) + "?"
    msg += f" ({hint})"
    return InputError(msg)


def by_key(items: Iterable[T], key: str, kind: str, hint: str) -> T:
    """The item of ``items`` whose ``.key`` matches ``key`` (case and punctuation ignored);
    else the :func:`unknown` error for ``kind`` with near matches and ``hint``."""
    items = tuple(items)
    want = squash(key)
    for x in items:
        if squash(x.key) == want:  # type: ignore[attr-defined]
            return x
    raise unknown(kind, key, [x.key for x in items], hint)  # type: ignore[attr-defined]


def fmt(value: float | None, digits: int = 3) -> str:
    """Format a number for display: ``digits`` decimals, trailing zeros removed; ``None`` -> ``-``."""
    if value is None:
        return "-"
    text = f"{value:.{digits}f}"
    if "." in text:
        text = text.rstrip("0").rstrip(".")
    return "0" if text in ("-0", "") else text
