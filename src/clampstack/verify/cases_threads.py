"""Thread geometry: ISO 898-1 and ASME B1.1 stress areas, ISO 724 / ISO 898-1 diameters.

The catalog computes every stress area from the basic profile (ISO 68-1, ISO 724;
ISO 898-1 clause 9.1.6.1 for metric, ASME B1.1 for unified threads); here it is
compared with the areas printed in the standards.  The tolerance is half a unit
of the last printed digit (the printed tables round), as a fraction of the value.
"""

from __future__ import annotations

from ..catalog import thread
from .registry import Outcome, add, register

MM2 = 1e-6
IN2 = 0.0254**2
INCH = 0.0254


def _half_step(printed: str) -> float:
    """Half a unit of the last printed digit of ``printed`` ("58.0" -> 0.05, "157" -> 0.5)."""
    decimals = len(printed.split(".")[1]) if "." in printed else 0
    return 0.5 * 10.0**-decimals


# ISO 898-1:2013 Table 4 (coarse) and Table 6 (fine): nominal stress areas A_s,nom [mm^2].
# M6..M30 are also listed on the project's reference sheet; the fine-pitch rows are
# recalled without the standard at hand (from memory).
ISO_STRESS_AREAS = (
    ("M6", "20.1", "ISO 898-1:2013 Table 4"),
    ("M8", "36.6", "ISO 898-1:2013 Table 4"),
    ("M10", "58.0", "ISO 898-1:2013 Table 4"),
    ("M12", "84.3", "ISO 898-1:2013 Table 4"),
    ("M16", "157", "ISO 898-1:2013 Table 4"),
    ("M20", "245", "ISO 898-1:2013 Table 4"),
    ("M24", "353", "ISO 898-1:2013 Table 4"),
    ("M30", "561", "ISO 898-1:2013 Table 4"),
    ("M10x1.25", "61.2", "ISO 898-1:2013 Table 6 (from memory)"),
    ("M12x1.5", "88.1", "ISO 898-1:2013 Table 6 (from memory)"),
)

# ASME B1.1 tensile stress areas A_t [in^2]: UNC rows as on the project's reference sheet,
# the UNF row from memory.  The printed tables were evaluated with rounded intermediates
# (1/2-20 UNF: the formula gives 0.15995, the table 0.1599), so 0.01 % is added.
ASME_STRESS_AREAS = (
    ("1/4-20 UNC", "0.0318", "ASME B1.1-2019 Table 2 (UNC)"),
    ("3/8-16 UNC", "0.0775", "ASME B1.1-2019 Table 2 (UNC)"),
    ("1/2-13 UNC", "0.1419", "ASME B1.1-2019 Table 2 (UNC)"),
    ("5/8-11 UNC", "0.226", "ASME B1.1-2019 Table 2 (UNC)"),
    ("3/4-10 UNC", "0.334", "ASME B1.1-2019 Table 2 (UNC)"),
    ("1-8 UNC", "0.606", "ASME B1.1-2019 Table 2 (UNC)"),
    ("1/2-20 UNF", "0.1599", "ASME B1.1-2019 Table 2 (UNF, from memory)"),
)


def _iso_case(designation: str, printed: str, source: str):
    def fn() -> Outcome:
        value = float(printed)
        return Outcome(
            thread(designation).As / MM2,
            value,
            _half_step(printed) / value + 1e-9,
            f"{source}, A_s of {designation}",
            "mm^2",
        )

    return fn


def _asme_case(designation: str, printed: str, source: str):
    def fn() -> Outcome:
        value = float(printed)
        return Outcome(
            thread(designation).As / IN2,
            value,
            _half_step(printed) / value + 1e-4,
            f"{source}, A_t of {designation}",
            "in^2",
        )

    return fn


for _d, _p, _s in ISO_STRESS_AREAS:
    add(f"stress area {_d}", "thread geometry", _iso_case(_d, _p, _s), kind="published")
for _d, _p, _s in ASME_STRESS_AREAS:
    add(f"stress area {_d}", "thread geometry", _asme_case(_d, _p, _s), kind="published")


# M10 (P = 1.5 mm), printed to 0.001 mm in ISO 724 Table 1 (from memory):
#   d2 = 10 - 0.649519 x 1.5 = 9.026 mm;  D1 = 10 - 1.082532 x 1.5 = 8.376 mm.
# ISO 898-1 clause 9.1.6.1: d3 = d1 - H/6 = 10 - 1.226869 x 1.5 = 8.160 mm.
@register("pitch diameter d2 of M10", "thread geometry", kind="published")
def m10_d2() -> Outcome:
    return Outcome(
        thread("M10").d2 * 1e3, 9.026, 0.0005 / 9.026, "ISO 724 Table 1 (from memory)", "mm"
    )


@register("minor diameter D1 of M10", "thread geometry", kind="published")
def m10_d1() -> Outcome:
    return Outcome(
        thread("M10").d1 * 1e3, 8.376, 0.0005 / 8.376, "ISO 724 Table 1 (from memory)", "mm"
    )


@register("minor diameter d3 of M10", "thread geometry", kind="hand")
def m10_d3() -> Outcome:
    return Outcome(
        thread("M10").d3 * 1e3,
        8.160,
        0.0005 / 8.160,
        "ISO 898-1:2013 9.1.6.1, d3 = d - 1.226869 P, by hand",
        "mm",
    )


# ASME B1.1 basic pitch diameter of 1/2-13 UNC: E = D - 0.649519/n = 0.5 - 0.049963 = 0.4500 in
@register("pitch diameter of 1/2-13 UNC", "thread geometry", kind="published")
def half_inch_d2() -> Outcome:
    return Outcome(
        thread("1/2-13 UNC").d2 / INCH,
        0.4500,
        0.00005 / 0.45,
        "ASME B1.1-2019 Table 2, basic pitch diameter (from memory)",
        "in",
    )
