"""``clampstack demo``: run the bundled example end to end into a folder."""

from __future__ import annotations

import json
from importlib import resources
from pathlib import Path

DEMO_EXAMPLE = "tie-rod-in-spacer-tube.toml"


def demo_input_path() -> Path:
    """Path of the bundled demo input file (inside the installed package)."""
    return Path(str(resources.files("clampstack") / "examples" / DEMO_EXAMPLE))


def run_demo(out_dir: str) -> list[str]:
    """Solve the bundled example; write input, JSON and an HTML page into ``out_dir``.

    Returns the lines to print.  Everything is rendered before anything is
    written, and each file is replaced atomically.
    """
    from .assembly import solve_assembly
    from .io.assembly_input import read_assembly_file
    from .io.files import write_files
    from .io.html import assembly_html
    from .io.report_text import assembly_text

    src = demo_input_path()
    doc, asm = read_assembly_file(str(src))
    result = solve_assembly(asm)
    files = {
        DEMO_EXAMPLE: doc.text,
        "result.json": json.dumps(result.to_dict(), indent=2, allow_nan=False) + "\n",
        "result.html": assembly_html(result, DEMO_EXAMPLE, doc.sha256),
    }
    written = write_files(out_dir, files)
    text = assembly_text(result)
    return [text, "", "Wrote:", *(f"  {p}" for p in written)]
