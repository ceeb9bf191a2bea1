"""The options that hold ``clampstack size`` to threads, methods and grades."""

from __future__ import annotations

from ..catalog import grades, thread
from ..errors import InputError
from ..studies.size import Constraints


def _names(text: str | None, key: str) -> tuple[str, ...] | None:
    if text is None:
        return None
    out = tuple(x.strip() for x in text.split(",") if x.strip())
    if not out:
        raise InputError("expected a comma-separated list", key=key)
    return out


def size_constraints(
    threads: tuple[str, ...],
    thread_range: str | None,
    methods: str | None,
    grade_names: str | None,
    allowed_methods: tuple[str, ...],
) -> Constraints:
    """``--thread`` (repeatable), ``--threads A..B``, ``--methods a,b``, ``--grades a,b``
    as :class:`~clampstack.studies.size.Constraints`; InputError naming the option."""
    fixed = None
    if threads:
        fixed = []
        for t in threads:
            try:
                fixed.append(thread(t).designation)
            except InputError as err:
                raise InputError(err.detail, key="--thread") from None
        fixed = tuple(fixed)
    diameters = None
    if thread_range is not None:
        lo, sep, hi = thread_range.partition("..")
        if not sep or not lo.strip() or not hi.strip():
            raise InputError(
                f'expected a range of threads "M6..M12", got {thread_range!r}', key="--threads"
            )
        try:
            d = (thread(lo.strip()).d, thread(hi.strip()).d)
        except InputError as err:
            raise InputError(err.detail, key="--threads") from None
        if d[0] > d[1]:
            raise InputError("the range must run from the smaller thread", key="--threads")
        diameters = d
    m = _names(methods, "--methods")
    if m is not None:
        bad = [x for x in m if x not in allowed_methods]
        if bad:
            raise InputError(
                f"unknown method {bad[0]!r}; size chooses from {', '.join(allowed_methods)}",
                key="--methods",
            )
    g = _names(grade_names, "--grades")
    if g is not None:
        known = {x.name for x in grades()}
        bad = [x for x in g if x not in known]
        if bad:
            raise InputError(
                f"unknown grade {bad[0]!r} (see `clampstack catalog grades`)", key="--grades"
            )
    return Constraints(fixed, diameters, m, g)
