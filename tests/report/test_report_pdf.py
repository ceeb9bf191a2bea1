"""The report in a real browser: headless Chromium prints it to PDF on A4 and on Letter.

Skipped only when Chromium or pdftotext (poppler-utils) is missing; ``.ci/run``
installs both.  The page count must stay in a sensible range and the key
numbers of the JSON result must be in the printed text, formatted as the
report formats them.
"""

from __future__ import annotations

import json
import re
import shutil
import subprocess
from pathlib import Path

import pytest
from click.testing import CliRunner

from clampstack.cli import main
from clampstack.outputs.text import fmt_number

CHROMIUM = shutil.which("chromium") or (
    "/usr/bin/chromium" if Path("/usr/bin/chromium").exists() else None
)
PDFTOTEXT = shutil.which("pdftotext")
PDFINFO = shutil.which("pdfinfo")

pytestmark = pytest.mark.skipif(
    CHROMIUM is None or PDFTOTEXT is None, reason="needs chromium and pdftotext (poppler-utils)"
)

FLAGS = [
    "--headless",
    "--no-sandbox",
    "--disable-gpu",
    "--disable-quic",
    "--no-first-run",
    "--disable-background-networking",
    "--disable-component-update",
    "--disable-sync",
    "--no-pdf-header-footer",
]


def print_pdf(page: Path, pdf: Path, profile: Path) -> None:
    cmd = [CHROMIUM, *FLAGS, f"--user-data-dir={profile}", f"--print-to-pdf={pdf}", page.as_uri()]
    out = subprocess.run(cmd, capture_output=True, text=True, timeout=240)
    assert pdf.is_file() and pdf.stat().st_size > 0, out.stderr[-2000:]


def pdf_text(pdf: Path) -> str:
    out = subprocess.run(
        [PDFTOTEXT, "-enc", "UTF-8", str(pdf), "-"], capture_output=True, check=True
    )
    return out.stdout.decode("utf-8")


def page_count(pdf: Path, text: str) -> int:
    if PDFINFO:
        info = subprocess.run([PDFINFO, str(pdf)], capture_output=True, text=True, check=True)
        return int(re.search(r"^Pages:\s+(\d+)", info.stdout, re.M).group(1))
    return text.count("\f")  # pdftotext ends every page with a form feed


def page_size(pdf: Path) -> str:
    if not PDFINFO:
        return ""
    info = subprocess.run([PDFINFO, str(pdf)], capture_output=True, text=True, check=True)
    return re.search(r"^Page size:\s+(.*)$", info.stdout, re.M).group(1)


def flat(text: str) -> str:
    return " ".join(text.replace("\u00a0", " ").split())


@pytest.fixture(scope="module")
def demo_report(tmp_path_factory):
    from conftest import EXAMPLES

    out = tmp_path_factory.mktemp("report")
    res = CliRunner().invoke(
        main, ["report", str(EXAMPLES / "m10-cover-screw-aluminium.toml"), "-o", str(out)]
    )
    assert res.exit_code == 0, res.output
    return out


@pytest.mark.parametrize("paper", ["A4", "letter"])
def test_report_prints_on_a4_and_letter_with_the_key_numbers(demo_report, tmp_path, paper):
    page = demo_report / "m10-cover-screw-aluminium.html"
    html = page.read_text(encoding="utf-8")
    # the report leaves the paper to the printer; here each size is asked for explicitly
    sized = tmp_path / f"report-{paper}.html"
    sized.write_text(
        html.replace("</style>", f"@page{{size:{paper}}}</style>", 1), encoding="utf-8"
    )
    pdf = tmp_path / f"report-{paper}.pdf"
    print_pdf(sized, pdf, tmp_path / "profile")
    text = pdf_text(pdf)
    n = page_count(pdf, text)
    assert 4 <= n <= 10, f"{n} pages on {paper}"
    if PDFINFO:
        assert page_size(pdf).endswith(f"({paper})")
    t = flat(text)
    data = json.loads((demo_report / "m10-cover-screw-aluminium.json").read_text())
    torque = fmt_number(data["torque"]["nominal_Nm"])
    # the label and the big number share a line; which one a PDF text extractor gives
    # first depends on their baselines (the number is set larger), so either order counts
    assert f"Tightening torque {torque} N·m" in t or f"{torque} N·m Tightening torque" in t
    assert f"min {fmt_number(data['torque']['min_Nm'])} N·m" in t
    residual = fmt_number(data["service"]["residual_clamp_load_min_N"] / 1e3)
    assert f"{residual} kN (required" in t
    assert fmt_number(data["service"]["separation_load_N"] / 1e3) in t
    assert fmt_number(data["preload"]["assembly_max_N"] / 1e3) in t
    assert data["title"] in t
    assert "PASS" in t and "qualified engineer" in t
    assert "1. Summary" in t and "10. References" not in t and "9. References" in t
    # traceability on every page: the page footer names the input's hash and the page
    sha = data["report"]["input_sha256"]
    assert t.count(f"SHA-256 {sha[:12]}") >= n
    assert f"page {n} of {n}" in t


def test_hot_report_with_sweep_prints(tmp_path):
    from conftest import EXAMPLES

    out = tmp_path / "hot"
    res = CliRunner().invoke(
        main, ["report", str(EXAMPLES / "exhaust-flange-hot.toml"), "-o", str(out)]
    )
    assert res.exit_code == 1  # a check fails; the report is still written
    pdf = tmp_path / "hot.pdf"
    print_pdf(out / "exhaust-flange-hot.html", pdf, tmp_path / "profile")
    text = pdf_text(pdf)
    assert 4 <= page_count(pdf, text) <= 12
    t = flat(text)
    assert "8. Temperature" in t and "FAIL" in t and "working_stress fails above" in t
    data = json.loads((out / "exhaust-flange-hot.json").read_text())
    assert fmt_number(data["service"]["residual_clamp_load_min_N"] / 1e3) in t
