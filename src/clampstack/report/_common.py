"""Helpers shared by the calculation reports: page style, escaping, tables, figures.

Both reports (:mod:`clampstack.report.joint`, :mod:`clampstack.report.flange`)
use the one style sheet and the same table, figure and check-table markup, so
they look alike on screen and on paper.
"""

from __future__ import annotations

import csv
import io
import re
from collections.abc import Callable, Iterable, Sequence
from typing import Any

from ..outputs.html import css_string, html_text
from ..outputs.joint import _margin
from ..outputs.joint import check_value as _check_value
from ..outputs.text import DisplayUnits, localize

_CSS = """
:root{--ink:#1e2b33;--muted:#5d6b73;--rule:#d6dde1;--accent:#1b6c8f;--accent-bg:#eaf2f6;
--pass:#2f7a4a;--pass-bg:#e7f3eb;--fail:#b3261e;--fail-bg:#fbe9e7;--warn:#9a5b12;--warn-bg:#fbf2e4}
*{box-sizing:border-box}
html{-webkit-print-color-adjust:exact;print-color-adjust:exact}
body{font-family:"DejaVu Sans","Liberation Sans",Arial,Helvetica,sans-serif;font-size:10pt;
line-height:1.4;color:var(--ink);max-width:186mm;margin:1.5rem auto;padding:0 1rem}
h1{font-size:16pt;margin:0 0 .2rem;line-height:1.2}
h2{font-size:12pt;margin:1.4rem 0 .5rem;padding-bottom:.15rem;border-bottom:2px solid var(--accent);
color:var(--ink)}
h3{font-size:10.5pt;margin:1rem 0 .35rem;color:var(--accent)}
p{margin:.35rem 0}
.sub{color:var(--muted);margin:0 0 .6rem}
.meta{color:var(--muted);font-size:8.5pt}
.mono,code,pre{font-family:"DejaVu Sans Mono","Liberation Mono",Consolas,monospace}
code{font-size:9pt}
table{border-collapse:collapse;margin:.4rem 0 .6rem;font-variant-numeric:tabular-nums;width:100%}
th,td{border-bottom:1px solid var(--rule);padding:.2rem .45rem;text-align:right;vertical-align:top}
th{background:var(--accent-bg);font-weight:600;font-size:9pt}
td.l,th.l{text-align:left}
table.kv{width:auto}table.kv th{text-align:left;background:none;font-weight:normal;color:var(--muted)}
table.kv td{text-align:left}
table.small td,table.small th{font-size:8.5pt}
table.checks th:first-child{width:25%}table.checks th:last-child{width:38%}
td.src{font-size:8pt;color:var(--muted);text-align:left}
.pass{color:var(--pass);font-weight:600}.fail{color:var(--fail);font-weight:700}
.off{color:var(--muted)}
.verdict{border-radius:4px;padding:.55rem .8rem;margin:.6rem 0;font-size:11pt}
.verdict.ok{background:var(--pass-bg);border-left:6px solid var(--pass)}
.verdict.bad{background:var(--fail-bg);border-left:6px solid var(--fail)}
.verdict b{font-size:13pt}
.spec{display:flex;flex-wrap:wrap;gap:.5rem 1.5rem;align-items:baseline;background:var(--accent-bg);
border-radius:4px;padding:.55rem .8rem;margin:.6rem 0}
.spec .big{font-size:17pt;font-weight:700;color:var(--accent)}
.caution{border-left:5px solid var(--warn);background:var(--warn-bg);padding:.5rem .8rem;margin:.8rem 0;
font-size:9pt}
pre.input{background:#f6f8f9;border:1px solid var(--rule);border-radius:3px;padding:.5rem .7rem;
font-size:8.5pt;white-space:pre-wrap;word-break:break-word;margin:.4rem 0}
figure{margin:.6rem 0 .9rem}
figure svg.figure{width:100%;height:auto;display:block}
figcaption{font-size:8.5pt;color:var(--muted);margin-top:.25rem}
ol.refs li,ul.notes li{margin:.2rem 0}
footer{margin-top:1.5rem;border-top:1px solid var(--rule);padding-top:.4rem}
.hash{font-family:"DejaVu Sans Mono","Liberation Mono",monospace;font-size:8pt;word-break:break-all}
@page{margin:16mm 15mm 17mm 15mm;
@bottom-left{content:"__FOOTER__";font-family:"DejaVu Sans",Arial,sans-serif;font-size:7pt;color:#5d6b73}
@bottom-right{content:"page " counter(page) " of " counter(pages);
font-family:"DejaVu Sans",Arial,sans-serif;font-size:7pt;color:#5d6b73}}
@media print{
body{max-width:none;margin:0;padding:0;font-size:9pt}
h2{break-after:avoid-page;page-break-after:avoid}
h3{break-after:avoid-page;page-break-after:avoid}
figure,.verdict,.spec,.caution,table.kv,.keep{break-inside:avoid;page-break-inside:avoid}
tr,td,th{break-inside:avoid;page-break-inside:avoid}
thead{display:table-header-group}
pre.input{break-inside:auto}
section.newpage{break-before:page;page-break-before:always}
}
"""


def _e(x: object) -> str:
    """Escape text for HTML text and quoted attributes (:func:`~clampstack.outputs.html.html_text`);
    ``scheme://`` is written with an entity so the file names no URL."""
    s = html_text(x)
    return s.replace("http://", "http&#58;//").replace("https://", "https&#58;//")


def _lab(u: DisplayUnits, kind: str) -> str:
    lab = u.label(kind)
    return (
        lab.replace("N*m", "N&middot;m")
        .replace("ft*lbf", "ft&middot;lbf")
        .replace("^2", "&sup2;")
        .replace("um", "&micro;m")
    )


def _f(u: DisplayUnits, kind: str, value: float | None) -> str:
    """A value with its unit: ``13.51 kN``."""
    if value is None:
        return "&ndash;"
    return f"{u.fmt(kind, value)}&nbsp;{_lab(u, kind)}"


def report_block(doc: Any, now: Any, units: str, version: str) -> dict[str, Any]:
    """The ``report`` block of a report's JSON: tool version, date, input file and its
    SHA-256, units."""
    from pathlib import Path

    return {
        "clampstack_version": version,
        "generated": now.isoformat(timespec="seconds"),
        "input_file": Path(doc.path).name,
        "input_sha256": doc.sha256,
        "units": units,
    }


def _T(u: DisplayUnits, T: float) -> str:
    """A temperature [K] in the report's scale: ``20&nbsp;&deg;C`` or ``68&nbsp;&deg;F``."""
    return f"{u.temp(T):.4g}&nbsp;&deg;{'F' if u.us else 'C'}"


def _table(
    headers: list[str], rows: list[list[str]], left: set[int] | None = None, cls: str = ""
) -> str:
    left = left or {0}

    def cell(tag: str, i: int, content: str) -> str:
        return f'<{tag} class="l">{content}</{tag}>' if i in left else f"<{tag}>{content}</{tag}>"

    th = "".join(cell("th", i, h) for i, h in enumerate(headers))
    body = "".join(
        "<tr>" + "".join(cell("td", i, c) for i, c in enumerate(r)) + "</tr>" for r in rows
    )
    c = f' class="{cls}"' if cls else ""
    return f"<table{c}><thead><tr>{th}</tr></thead><tbody>{body}</tbody></table>"


def _kv(rows: list[tuple[str, str]]) -> str:
    body = "".join(f"<tr><th>{k}</th><td>{v}</td></tr>" for k, v in rows)
    return f'<table class="kv"><tbody>{body}</tbody></table>'


def _figure(fig: Any, prefix: str, title: str, caption: str) -> str:
    from ..plots import inline_svg

    svg = inline_svg(fig, prefix, title=title)
    return f"<figure>{svg}<figcaption>{caption}</figcaption></figure>"


def _css_string(text: str) -> str:
    """The page footer text for ``content:"..."``: one line of at most 90 characters, every
    character outside a small safe set as a CSS escape (the title and the file name come
    from the input, and ``</style>`` must not end the style sheet)."""
    t = " ".join(text.split())
    if len(t) > 90:
        t = t[:87] + "..."
    return css_string(t)


# --------------------------------------------------------------------------- checks

MARGIN_NOTE = (
    "<p class=meta>Margin: limit/value &minus; 1 for an upper limit, value/limit &minus; 1 "
    "for a lower limit; a check passes at a margin of zero or more.</p>"
)


def _checks_table(
    checks: Iterable[Any],
    u: DisplayUnits,
    value: Callable[[Any, DisplayUnits], tuple[str, str]] = _check_value,
) -> str:
    """The table of checks: name and title, value, relation, limit, margin, result, source."""
    rows = []
    for c in checks:
        v, lim = value(c, u)
        if c.skipped:
            verdict = '<span class="off">off</span>'
        elif c.passed:
            verdict = '<span class="pass">pass</span>'
        else:
            verdict = '<span class="fail">FAIL</span>'
        src = _e(localize(c.source, u)) + (f"<br>{_e(localize(c.detail, u))}" if c.detail else "")
        if c.skipped:
            src += f"<br><b>switched off:</b> {_e(c.skipped)}"
        rows.append(
            [
                f"<b>{_e(c.name)}</b><br><span class=meta>{_e(c.title)}</span>"
                + (
                    f"<br><span class=meta>worst in case: {_e(c.extra['governing_case'])}</span>"
                    if c.extra and "governing_case" in c.extra
                    else ""
                ),
                _e(v).replace(" ", "&nbsp;"),
                _e(c.relation),
                _e(lim).replace(" ", "&nbsp;"),
                _e(_margin(c)).replace(" ", "&nbsp;"),
                verdict,
                f'<span class="src">{src}</span>',
            ]
        )
    return _table(
        ["check", "value", "", "limit", "margin", "result", "source"],
        rows,
        left={0, 5, 6},
        cls="small checks",
    )


def csv_text(text: str) -> str:
    """A text cell that a spreadsheet will not run as a formula: a leading ``=``, ``+``,
    ``-``, ``@``, tab or carriage return gets a ``'`` before it (common practice against
    CSV formula injection, e.g. the OWASP guidance; no standard)."""
    return "'" + text if text[:1] in ("=", "+", "-", "@", "\t", "\r") else text


def _checks_csv(checks: Sequence[dict[str, Any]]) -> str:
    """CSV of the checks' JSON form (``Check.to_dict()``), SI numbers in full precision."""
    buf = io.StringIO()
    w = csv.writer(buf, lineterminator="\n")
    keys = ["name", "value", "limit", "unit", "relation", "margin", "pass", "skipped", "source"]
    w.writerow([*keys, "detail", "title"])
    for c in checks:
        row = []
        for k in keys:
            v = c[k]
            if isinstance(v, bool):
                row.append(str(v).lower())
            elif isinstance(v, float):
                row.append(repr(v))
            else:
                row.append("" if v is None else csv_text(str(v)))
        w.writerow([*row, csv_text(c["detail"]), csv_text(c["title"])])
    return buf.getvalue()


# --------------------------------------------------------------------------- page


_H2 = re.compile(r"<h2>(\d+)\. ")


def _renumber(body: str) -> str:
    """Number the ``<h2>N. `` section headings 1, 2, 3 ... in the order they appear."""
    count = iter(range(1, 1000))
    return _H2.sub(lambda m: f"<h2>{next(count)}. ", body)


def _page(title: str, version: str, footer: str, body: str, extra_css: str = "") -> str:
    """The whole HTML document: style sheet (page footer text ``footer``), title and body."""
    css = _CSS.replace("__FOOTER__", _css_string(footer)) + extra_css
    return (
        '<!DOCTYPE html>\n<html lang="en"><head><meta charset="utf-8">'
        '<meta name="viewport" content="width=device-width, initial-scale=1">'
        f'<meta name="generator" content="clampstack {_e(version)}">'
        f"<title>{_e(title)} &mdash; calculation report</title><style>{css}</style></head>"
        f"<body>\n{body}\n</body></html>\n"
    )


def verdict_html(checks: Any, gov: Any) -> str:
    """The PASS / FAIL banner of a report: every active check, and the governing one."""
    active = [c for c in checks if c.skipped is None]
    failed = [c for c in checks if not c.passed]
    if not failed:
        return (
            f'<div class="verdict ok"><b>PASS</b> &mdash; all {len(active)} checks pass'
            + (
                f"; governing check <b>{_e(gov.name)}</b> (margin {_e(_margin(gov))})"
                if gov
                else ""
            )
            + "</div>"
        )
    names = ", ".join(_e(c.name) for c in failed)
    return (
        f'<div class="verdict bad"><b>FAIL</b> &mdash; {names}'
        + (f"; smallest margin: {_e(gov.name)} ({_e(_margin(gov))})" if gov else "")
        + "</div>"
    )
