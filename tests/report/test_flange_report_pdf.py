"""The flange report in a real browser: headless Chromium prints it, pdftotext reads it back.

Skipped, like ``test_report_pdf.py`` (whose helpers it uses), only when Chromium
or pdftotext is missing.
"""

from __future__ import annotations

import json

import pytest
from click.testing import CliRunner
from test_report_pdf import CHROMIUM, PDFTOTEXT, flat, page_count, pdf_text, print_pdf

from clampstack.cli import main
from clampstack.outputs.text import fmt_number
from conftest import EXAMPLES

pytestmark = pytest.mark.skipif(
    CHROMIUM is None or PDFTOTEXT is None, reason="needs chromium and pdftotext (poppler-utils)"
)


def test_flange_report_prints_with_torque_and_seating_load(tmp_path):
    out = tmp_path / "rep"
    src = EXAMPLES / "pump-outlet-flange-8-bolts.toml"
    res = CliRunner().invoke(main, ["report", str(src), "-o", str(out)])
    assert res.exit_code == 0, res.output
    pdf = tmp_path / "flange.pdf"
    print_pdf(out / "pump-outlet-flange-8-bolts.html", pdf, tmp_path / "profile")
    text = pdf_text(pdf)
    n = page_count(pdf, text)
    assert 4 <= n <= 10, f"{n} pages"
    t = flat(text)
    data = json.loads((out / "pump-outlet-flange-8-bolts.json").read_text())
    assert f"Torque per bolt {fmt_number(data['torque']['nominal_Nm'])} N·m" in t
    wm2 = fmt_number(data["required_bolt_load"]["seating_N"] / 1e3)
    assert f"Wm2 {wm2} kN" in t  # the App. 2 table row: symbol, value
    assert "1. Summary" in t and "10. References" in t and "pressure equipment" in t
    sha = data["report"]["input_sha256"]
    assert t.count(f"SHA-256 {sha[:12]}") >= n  # the page footer on every page
    assert f"page {n} of {n}" in t
