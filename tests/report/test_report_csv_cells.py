"""Text cells of the report's CSV files cannot start a spreadsheet formula."""

from __future__ import annotations

import csv
import io

from clampstack.report._common import _checks_csv, csv_text


def test_formula_prefixes_are_neutralised():
    for bad in ('=HYPERLINK("x")', "+1+1", "-2+3", "@SUM(A1)", "\t=1"):
        assert csv_text(bad).startswith("'")
    assert csv_text("bolt 3, largest preload") == "bolt 3, largest preload"


def test_a_skip_reason_in_the_checks_csv_is_text():
    row = {
        "name": "slip",
        "value": -1.5,
        "limit": 2.0,
        "unit": "kN",
        "relation": ">=",
        "margin": None,
        "pass": True,
        "skipped": '=cmd|" /c calc"!A1',
        "source": "VDI 2230-1",
        "detail": "",
        "title": "slip",
    }
    rows = list(csv.reader(io.StringIO(_checks_csv([row]))))
    assert rows[1][1] == "-1.5"  # numbers stay numbers
    assert rows[1][7].startswith("'=")


def test_a_skip_of_a_check_the_joint_does_not_have_is_noted():
    from clampstack.inputs.joint import joint_from_data
    from clampstack.joint.analysis import analyse

    r = analyse(
        joint_from_data(
            {
                "title": "no shear",
                "bolt": {"thread": "M10", "grade": "8.8", "length": "40 mm"},
                "nut": {},
                "clamped": [{"material": "steel", "thickness": "20 mm"}],
                "tightening": {"thread_friction": "0.10..0.14"},
                "skip": [{"check": "slip", "reason": "no shear in this joint"}],
            }
        )
    )
    assert any(n.startswith("[[skip]] slip: this joint has no such check") for n in r.notes)
