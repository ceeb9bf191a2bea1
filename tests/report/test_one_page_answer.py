"""The report's first page holds the answer: verdict, tightening, every margin, the joint
diagram and the caution, and it prints on one A4 and one Letter page (Chromium, where the
machine has it; the page count is read from the PDF)."""

from __future__ import annotations

import re
import shutil
import subprocess
from pathlib import Path

import pytest

from clampstack.inputs.files import load_toml
from clampstack.inputs.joint import joint_from_data
from clampstack.joint.analysis import analyse
from clampstack.report.joint import render_joint_report

EX = Path(__file__).parents[2] / "examples"
JOINTS = [
    "m16-through-bolt-alternating.toml",
    "gearbox-foot-load-cases.toml",
    "bracket-on-column-face.toml",
    "conrod-cap-angle-tightened.toml",
]
CHROMIUM = shutil.which("chromium") or shutil.which("chromium-browser")


def _answer(name: str) -> str:
    doc = load_toml(str(EX / name))
    files = render_joint_report(doc, analyse(joint_from_data(doc.data)), with_sweep=False)
    return next(v for k, v in files.items() if k.endswith(".html"))


@pytest.mark.parametrize("name", JOINTS)
def test_the_answer_comes_first(name):
    page = _answer(name)
    first, _, rest = page.partition('<div class="details">')
    assert rest, "the details follow the answer"
    for part in (
        "verdict",
        'class="spec"',
        'table class="small margins"',
        'figure class="compact"',
        "Caution",
    ):
        assert part in first, part
    doc = load_toml(str(EX / name))
    r = analyse(joint_from_data(doc.data))
    for c in r.checks:
        assert f'<td class="l">{c.name}</td>' in first


@pytest.mark.skipif(CHROMIUM is None, reason="Chromium is not installed on this machine")
@pytest.mark.parametrize("size", ["A4", "letter"])
@pytest.mark.parametrize("name", JOINTS)
def test_the_answer_prints_on_one_page(name, size, tmp_path):
    page = _answer(name)
    first = page.partition('<div class="details">')[0] + "</section></body></html>\n"
    first = first.replace("</style>", f"@page{{size:{size}}}</style>", 1)
    html = tmp_path / "answer.html"
    html.write_text(first, encoding="utf-8")
    pdf = tmp_path / "answer.pdf"
    subprocess.run(
        [
            CHROMIUM,
            "--headless",
            "--no-sandbox",
            "--disable-gpu",
            f"--print-to-pdf={pdf}",
            str(html),
        ],
        check=True,
        capture_output=True,
        timeout=120,
    )
    pages = len(re.findall(rb"/Type\s*/Page[^s]", pdf.read_bytes()))
    assert pages == 1, f"{name} on {size}: {pages} pages"
