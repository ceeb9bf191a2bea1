"""No injection into the reports: hostile text in every free-text field of an input file.

Every text an input file can carry into a page (the title, clamped-part names, the
reasons of switched-off checks, assembly part, node and case names, TOML comments of
the input shown as entered, the input's file name) is filled with strings that break
out of HTML text, attributes, the ``<title>``, the CSS string of the page footer
(``content:"..."`` in ``<style>``), comments and CDATA.  Each would set
``document.title`` to ``PWNED`` if it got out.  The joint and flange reports
(``clampstack report``), the assembly page and the notebook views are rendered to
files and checked twice: as strings (always), and in headless Chromium, whose
document after loading must show no script effect and no injected element (skipped
only when no browser is installed; ``.ci/run`` installs it).  Free text that must
name a catalog entry, a unit or a known key is refused with one line and exit 2.
"""

from __future__ import annotations

import html
import json
import re
import shutil
import subprocess
from html.parser import HTMLParser
from pathlib import Path

import pytest
from click.testing import CliRunner

from clampstack import __version__
from clampstack.cli import main

PWN = "document.title='PWNED'"
#: each breaks out of one context: style sheet, attribute (both quotes), title, CDATA,
#: comment, script string, CSS string, raw text, a foreign-content parser switch
HOSTILE = (
    f"</style><script>{PWN}</script>",
    f'"><img src=x onerror="{PWN}">',
    f"'><img src=x onerror={PWN}>",
    f"</title><script>{PWN}</script>",
    f']]><svg onload="{PWN}">',
    f"--><svg onload={PWN}><!--",
    f"';{PWN};'",
    f'\\"}}body{{display:none}}</style><svg onload={PWN}>',
    f"</textarea></pre><svg/onload={PWN}>",
    f"<math><mtext><table><mglyph><style><img src=x onerror={PWN}>",
)
COMBINED = "".join(HOSTILE)  # every breakout in one text (under the 500-character limit)
#: 34 characters: the whole of it lands in the page footer (cut at 90 characters)
SHORT = "</style><svg onload=title='PWNED'>"
HOSTILE_FILE = f"\"'><svg onload={PWN}>.toml"

FORBIDDEN_TAGS = {
    "script",
    "img",
    "iframe",
    "object",
    "embed",
    "link",
    "base",
    "form",
    "input",
    "textarea",
    "math",
    "mtext",
    "mglyph",
    "foreignobject",
    "image",
    "a",
    "animate",
    "set",
    "audio",
    "video",
    "template",
    "noscript",
}
CSS_ESCAPED = re.compile(r"(?:[A-Za-z0-9 ,.:_()/+-]|\\[0-9a-f]{6} )*")


def toml_str(s: str) -> str:
    """A TOML basic string holding ``s`` (JSON's escapes are TOML's)."""
    return json.dumps(s, ensure_ascii=False)


# --------------------------------------------------------------------------- documents


def joint_doc(f: list[str]) -> str:
    """A joint file: comment, title, two part names, two skip reasons (``f[0..5]``)."""
    s = [toml_str(x) for x in f]
    return f"""# {f[0]}
title = {s[1]}

[bolt]
thread = "M10"
grade = "10.9"
length = "40 mm"
head = "socket"

[tapped_hole]
material = "aluminium-6082-T6"
engagement = "20 mm"

[[clamped]]
name = {s[2]}
material = "steel"
thickness = "10 mm"
outer_diameter = "32 mm"

[[clamped]]
name = {s[3]}
material = "steel"
thickness = "4 mm"
outer_diameter = "32 mm"

[tightening]
method = "torque"
torque = "48 N*m"

[service]
axial_load = "0..5 kN"

[requirements]
residual_clamp_load = "4 kN"

[[skip]]
check = "separation"
reason = {s[4]}

[[skip]]
check = "fatigue"
reason = {s[5]}
"""


def flange_doc(f: list[str]) -> str:
    """A flange file: comment and title (its other texts are catalog keys or choices)."""
    return f"""# {f[0]}
title = {toml_str(f[1])}

[flange]
bolt_count = 8
bolt_circle = "160 mm"
thickness = "20 mm"
inner_diameter = "90 mm"
outer_diameter = "200 mm"

[bolt]
thread = "M16"
grade = "8.8"

[gasket]
type = "spiral-wound"
inner_diameter = "95 mm"
outer_diameter = "127 mm"
thickness = "4.5 mm"

[loading]
pressure = "40 bar"
"""


def assembly_doc(f: list[str]) -> str:
    """An assembly file: comment, title, two part names, three node names, a case name."""
    s = [toml_str(x) for x in f]
    return f"""# {f[0]}
title = {s[1]}

[[part]]
name = {s[2]}
ends = [{s[4]}, {s[5]}]
length = "100 mm"
area = "100 mm^2"
material = "steel"

[[part]]
name = {s[3]}
ends = [{s[5]}, {s[6]}]
length = "50 mm"
stiffness = "500 kN/mm"
expansion = "11.5e-6 / K"

[supports]
fixed = [{s[4]}, {s[6]}]

[[load]]
node = {s[5]}
force = "5 kN"

[[case]]
name = {s[7]}
temperature_change = "30 K"
[[case.load]]
node = {s[5]}
force = "-2 kN"
"""


KINDS = {  # document, number of text fields, fields that must show in the page, figures
    "joint": (joint_doc, 6, range(6), 4),  # three figures and the first page's diagram
    "flange": (flange_doc, 2, range(2), 2),  # the passes and the heat cycle
    "assembly": (assembly_doc, 8, range(1, 8), 0),  # the page does not show the input
}


def fields(variant: str, n: int) -> list[str]:
    """``each``: one breakout per field and the short one as title (whole in the footer);
    ``all``: every breakout in every field.  Tagged, so names stay unique."""
    if variant == "each":
        out = [f"[{i}]{HOSTILE[i % len(HOSTILE)]}" for i in range(n)]
        out[1] = SHORT
    else:
        out = [f"[{i}]{COMBINED}" for i in range(n)]
        out[1] = COMBINED
    return out


# --------------------------------------------------------------------------- rendering


class Page(HTMLParser):
    """Start tags with their attributes, the ``<title>`` text and the style blocks."""

    def __init__(self, text: str) -> None:
        super().__init__(convert_charrefs=True)
        self.tags: list[tuple[str, list[tuple[str, str | None]]]] = []
        self.title = ""
        self.styles: list[str] = []
        self._in: str | None = None
        self.feed(text)
        self.close()

    def handle_starttag(self, tag, attrs):
        self.tags.append((tag, attrs))
        self._in = tag if tag in ("title", "style") else None
        if tag == "style":
            self.styles.append("")

    def handle_startendtag(self, tag, attrs):
        self.tags.append((tag, attrs))

    def handle_endtag(self, tag):
        self._in = None

    def handle_data(self, data):
        if self._in == "title":
            self.title += data
        elif self._in == "style":
            self.styles[-1] += data

    def count(self, tag: str) -> int:
        return sum(1 for t, _ in self.tags if t == tag)


@pytest.fixture(scope="module")
def pages(tmp_path_factory) -> list[dict]:
    """Every hostile document rendered to files: report pages, assembly page, notebook views."""
    from clampstack.assembly import solve_assembly
    from clampstack.inputs.assembly import read_assembly_file
    from clampstack.inputs.flange import read_flange_file
    from clampstack.inputs.joint import read_joint_file
    from clampstack.outputs.html import assembly_html

    out = []
    for kind, (doc, n, shown, figures) in KINDS.items():
        for variant in ("each", "all"):
            base = tmp_path_factory.mktemp(f"{kind}-{variant}")
            f = fields(variant, n)
            name = f"{kind[0]}.toml"  # short: the whole title fits in the footer
            if variant == "all":
                name = HOSTILE_FILE
            src = base / name
            src.write_text(doc(f), encoding="utf-8")
            expect = [f[i] for i in shown] + [name]
            rep = base / "report"
            if kind == "assembly":
                adoc, asm = read_assembly_file(str(src))
                result = solve_assembly(asm)
                page = rep / f"{src.stem}.html"
                rep.mkdir()
                page.write_text(assembly_html(result, name, adoc.sha256), encoding="utf-8")
                title, footer = f[1], None
            else:
                res = CliRunner().invoke(main, ["report", str(src), "-o", str(rep)])
                assert res.exit_code in (0, 1), res.output
                page = rep / f"{src.stem}.html"
                sha = json.loads((rep / f"{src.stem}.json").read_text())["report"]["input_sha256"]
                title = f"{f[1]} \u2014 calculation report"
                footer = f"clampstack {__version__} - {name} (SHA-256 {sha[:12]}) - {f[1]}"
                read = read_joint_file if kind == "joint" else read_flange_file
                result = analyse(kind, read(str(src))[1])
            view = base / "notebook.html"  # the notebook view, as a page of its own
            view.write_text(
                f"<!DOCTYPE html><title>view</title><body>{result._repr_html_()}</body>",
                encoding="utf-8",
            )
            out.append(
                dict(
                    kind=kind,
                    variant=variant,
                    page=page,
                    title=title,
                    footer=footer,
                    shown=expect,
                    figures=figures,
                    view=view,
                )
            )
    return out


def analyse(kind: str, spec):
    from clampstack.flange import analyse_flange
    from clampstack.joint import analyse as analyse_joint

    return analyse_joint(spec) if kind == "joint" else analyse_flange(spec)


def footer_text(footer: str) -> str:
    t = " ".join(footer.split())
    return t if len(t) <= 90 else t[:87] + "..."


def assert_no_markup_injected(p: Page, where: str, figures: int | None = None) -> None:
    """No foreign element, no event handler, no URL; only our own svg and style blocks."""
    for tag, attrs in p.tags:
        assert tag not in FORBIDDEN_TAGS, f"{where}: injected <{tag}>"
        for a, v in attrs:
            assert not a.startswith("on"), f"{where}: injected {a}= on <{tag}>"
            if a in ("href", "src", "xlink:href", "action", "formaction"):
                assert (v or "").startswith("#"), f"{where}: {a}={v!r} on <{tag}>"
    if figures is not None:
        assert p.count("svg") == figures, where
        assert p.count("style") == 1 + figures, where  # the page's and one per figure


# --------------------------------------------------------------------------- string checks


def test_hostile_text_is_escaped_in_every_page(pages):
    assert len(COMBINED) <= 500 and len(SHORT) == 34
    for item in pages:
        where = f"{item['kind']}/{item['variant']}"
        text = item["page"].read_text(encoding="utf-8")
        # (a) as a string: no script, no event handler attribute, no extra </style>
        assert re.search(r"<\s*script", text, re.I) is None, where
        assert re.search(r"<[a-zA-Z][^<>]*[\s/\"']on[a-z]+\s*=", text) is None, where
        figures = item["figures"]
        closes = len(re.findall(r"</style", text, re.I))
        assert closes == len(re.findall(r"<style[\s>]", text, re.I)) == 1 + figures, where
        # every field's text is in the page, escaped for HTML
        for s in item["shown"]:
            assert html.escape(s, quote=True) in text, (where, s)
        # parsed: the title is the input's, nothing injected, the style sheet holds no tag
        p = Page(text)
        assert p.title == item["title"], where
        assert_no_markup_injected(p, where, figures)
        sheet = p.styles[0]
        assert "<" not in sheet, where
        if item["footer"] is not None:
            # the footer string: safe characters and CSS escapes only, read back unchanged
            m = re.search(r'@bottom-left\{content:"((?:[^"\\]|\\.)*)"', sheet)
            assert m and CSS_ESCAPED.fullmatch(m.group(1)), (where, m and m.group(1))
            shown = re.sub(r"\\([0-9a-f]{6}) ", lambda g: chr(int(g.group(1), 16)), m.group(1))
            assert shown == footer_text(item["footer"]), where
            if item["variant"] == "each":
                assert SHORT in shown  # the whole breakout reached the style sheet, escaped
        # the notebook view of the same result
        view_text = item["view"].read_text(encoding="utf-8")
        assert re.search(r"<\s*script", view_text, re.I) is None, where
        view = Page(view_text)
        assert view.title == "view", where
        assert_no_markup_injected(view, f"{where} notebook")
        assert view.count("svg") == view.count("style") == 0, where


# --------------------------------------------------------------------------- browser

CHROMIUM = next(
    (
        b
        for b in (
            shutil.which("chromium"),
            shutil.which("chromium-browser"),
            shutil.which("google-chrome"),
            "/usr/bin/chromium" if Path("/usr/bin/chromium").exists() else None,
        )
        if b
    ),
    None,
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
    "--allow-file-access-from-files",  # the harness reads the documents of its frames
    "--dump-dom",
]
#: one browser for every page: each in a frame; once all have loaded (their scripts,
#: had any got in, have run by then) the harness writes each frame's document out
HARNESS = """<!DOCTYPE html><title>harness</title><body>{frames}
<script>
addEventListener("load", () => {{
  document.querySelectorAll("iframe").forEach((f, k) => {{
    const out = document.createElement("pre");
    out.id = "dom-" + k;
    const d = f.contentDocument;
    out.textContent = d ? "<!DOCTYPE html>" + d.documentElement.outerHTML : "NO ACCESS";
    document.body.append(out);
  }});
}});
</script>"""


def dump_doms(files: list[Path], where: Path) -> list[str]:
    """The document of each file after loading, as the browser holds it."""
    frames = "".join(f'<iframe src="{html.escape(f.as_uri())}"></iframe>' for f in files)
    harness = where / "harness.html"
    harness.write_text(HARNESS.format(frames=frames), encoding="utf-8")
    cmd = [CHROMIUM, *FLAGS, f"--user-data-dir={where / 'profile'}", harness.as_uri()]
    out = subprocess.run(cmd, capture_output=True, text=True, timeout=180)
    doms = [
        html.unescape(m.group(1))
        for m in re.finditer(r'<pre id="dom-\d+">(.*?)</pre>', out.stdout, re.S)
    ]
    assert len(doms) == len(files), out.stderr[-2000:]
    assert "NO ACCESS" not in doms, "the harness could not read its frames"
    return doms


def test_no_script_runs_in_the_browser(pages, tmp_path):
    if CHROMIUM is None:
        pytest.skip("needs chromium (.ci/run installs it)")
    control = tmp_path / "control.html"  # the browser does run such a handler
    control.write_text(
        f'<!DOCTYPE html><title>x</title><body><svg onload="{PWN}"></svg>', encoding="utf-8"
    )
    files = [control]
    for item in pages:
        files += [item["page"], item["view"]]
    doms = dump_doms(files, tmp_path)
    assert Page(doms[0]).title == "PWNED", "the browser ran no script: the test proves nothing"
    for k, item in enumerate(pages):
        where = f"{item['kind']}/{item['variant']}"
        dom, view = Page(doms[1 + 2 * k]), Page(doms[2 + 2 * k])
        assert dom.tags, f"{where}: no document from the browser"
        assert dom.title == item["title"] and dom.title != "PWNED", where
        assert_no_markup_injected(dom, f"{where} in the browser", item["figures"])
        assert view.title == "view", f"{where}: notebook view in the browser"
        assert_no_markup_injected(view, f"{where}: notebook view in the browser")
        assert view.count("svg") == view.count("style") == 0, where


# --------------------------------------------------------------------------- refused


@pytest.mark.parametrize(
    "kind, old, new",
    [
        ("joint", 'thread = "M10"', f"thread = {toml_str(HOSTILE[0])}"),
        ("joint", 'grade = "10.9"', f"grade = {toml_str(HOSTILE[1])}"),
        ("joint", 'material = "steel"', f"material = {toml_str(HOSTILE[4])}"),
        ("joint", 'torque = "48 N*m"', f"torque = {toml_str('48 N*m' + HOSTILE[0])}"),
        ("joint", 'check = "separation"', f"check = {toml_str(HOSTILE[3])}"),
        ("joint", "[bolt]", f"{toml_str(HOSTILE[0])} = 1\n[bolt]"),
        ("joint", "[bolt]", f"[distributions]\n{toml_str(SHORT)} = '1..2'\n[bolt]"),
        ("flange", 'type = "spiral-wound"', f"type = {toml_str(HOSTILE[5])}"),
        ("flange", 'grade = "8.8"', f"grade = {toml_str(HOSTILE[8])}"),
        ("flange", "[loading]", f"[tightening]\npattern = {toml_str(HOSTILE[2])}\n[loading]"),
        ("flange", 'pressure = "40 bar"', f"pressure = {toml_str('40 bar' + SHORT)}"),
        ("assembly", 'material = "steel"', f"material = {toml_str(HOSTILE[9])}"),
        ("assembly", 'force = "5 kN"', f"force = {toml_str('5 kN' + HOSTILE[6])}"),
    ],
)
def test_catalog_keys_units_and_keys_are_refused(kind, old, new, tmp_path):
    doc, n, _, _ = KINDS[kind]
    text = doc([f"plain {i}" for i in range(n)])
    assert old in text
    src = tmp_path / f"{kind}.toml"
    src.write_text(text.replace(old, new, 1), encoding="utf-8")
    out = tmp_path / "out"
    args = ["solve", str(src)] if kind == "assembly" else ["report", str(src), "-o", str(out)]
    res = CliRunner().invoke(main, args)
    assert res.exit_code == 2, res.output
    assert res.output.count("\n") == 1, res.output
    assert not out.exists()
