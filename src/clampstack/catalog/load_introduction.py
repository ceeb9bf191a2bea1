"""Load introduction factor ``n`` of VDI 2230-1:2015, 5.2.2.2, for the joint types SV1-SV6.

The table gives ``n`` by joint type (where the parts that carry the working load join
the clamped parts: SV1 near the head and nut side faces, SV6 near the interface), by
``a_k/h`` (distance of the load's entry from the edge of the basic solid, over its
height) and ``l_A/h`` (length of the connecting solid over the height).  Values in
``data/load_introduction.csv``, recalled without the document (each row says so):
check them against the standard before relying on them.  Between the table's points
``n`` is interpolated linearly in both ratios; beyond its last column (``a_k/h >= 0.5``)
and row (``l_A/h >= 0.3``) the last value holds, as the table's headings say.
"""

from __future__ import annotations

from bisect import bisect_right
from functools import cache

from clampstack.catalog._common import read_csv

AK_POINTS = (0.0, 0.1, 0.3, 0.5)
_AK_COLUMNS = ("n_ak_0", "n_ak_0.1", "n_ak_0.3", "n_ak_0.5")


@cache
def _table() -> tuple[tuple[float, ...], dict[int, tuple[tuple[float, ...], ...]], str]:
    rows = read_csv("load_introduction.csv")
    lA = sorted({float(r["lA_over_h"]) for r in rows})
    by_type: dict[int, dict[float, tuple[float, ...]]] = {}
    for r in rows:
        by_type.setdefault(int(r["joint_type"]), {})[float(r["lA_over_h"])] = tuple(
            float(r[c]) for c in _AK_COLUMNS
        )
    table = {t: tuple(v[x] for x in lA) for t, v in by_type.items()}
    return tuple(lA), table, rows[0]["source"]


def _interp(points: tuple[float, ...], x: float) -> tuple[int, float]:
    """Index of the interval and the weight of its upper point (clamped to the table)."""
    if x <= points[0]:
        return 0, 0.0
    if x >= points[-1]:
        return len(points) - 2, 1.0
    i = bisect_right(points, x) - 1
    return i, (x - points[i]) / (points[i + 1] - points[i])


def joint_types() -> tuple[int, ...]:
    """The joint types of the table (1 to 6)."""
    return tuple(sorted(_table()[1]))


def load_introduction_factor(
    joint_type: int, ak_over_h: float, lA_over_h: float
) -> tuple[float, str]:
    """``n`` for joint type SV``joint_type`` at ``a_k/h`` and ``l_A/h``, and the source."""
    lA_pts, table, source = _table()
    if joint_type not in table:
        raise KeyError(joint_type)
    rows = table[joint_type]
    i, wi = _interp(lA_pts, lA_over_h)
    j, wj = _interp(AK_POINTS, ak_over_h)

    def at(row: tuple[float, ...]) -> float:
        return row[j] * (1 - wj) + row[j + 1] * wj

    return at(rows[i]) * (1 - wi) + at(rows[i + 1]) * wi, source
