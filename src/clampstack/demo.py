"""``clampstack demo``: run the bundled examples end to end into a folder."""

from __future__ import annotations

import json
from importlib import resources
from pathlib import Path

DEMO_JOINT = "m10-cover-screw-aluminium.toml"
DEMO_ASSEMBLY = "tie-rod-in-spacer-tube.toml"
DEMO_EXAMPLE = DEMO_JOINT  # the main example


def demo_input_path(name: str = DEMO_JOINT) -> Path:
    """Path of a bundled example input file (inside the installed package)."""
    return Path(str(resources.files("clampstack") / "examples" / name))


def run_demo(out_dir: str) -> list[str]:
    """Report the bundled joint and solve the bundled assembly; write the results into ``out_dir``.

    The joint gets the full calculation report (HTML with its JSON and CSV
    files, :mod:`clampstack.report`) and the readable ``check`` output; the
    assembly its JSON and HTML.  Returns the lines to print.  Everything is
    rendered before anything is written, and the set is written all or nothing
    (:func:`clampstack.outputs.files.write_files`, the report page last); a
    folder that cannot be written is an :class:`~clampstack.errors.InputError`
    naming it.
    """
    from .assembly import solve_assembly
    from .inputs.assembly import read_assembly_file
    from .inputs.joint import read_joint_file
    from .joint import analyse
    from .outputs.files import write_files
    from .outputs.html import assembly_html
    from .outputs.joint import joint_text
    from .report import render_joint_report, report_file_names

    jdoc, spec = read_joint_file(str(demo_input_path(DEMO_JOINT)))
    joint = analyse(spec)
    adoc, asm = read_assembly_file(str(demo_input_path(DEMO_ASSEMBLY)))
    assembly = solve_assembly(asm)
    text = joint_text(joint)
    files: dict[str, str | bytes] = {
        DEMO_JOINT: jdoc.text,
        "check.txt": text + "\n",
        DEMO_ASSEMBLY: adoc.text,
        "solve.json": json.dumps(assembly.to_dict(), indent=2, allow_nan=False) + "\n",
        "solve.html": assembly_html(assembly, DEMO_ASSEMBLY, adoc.sha256),
    }
    files.update(render_joint_report(jdoc, joint))
    written = write_files(out_dir, files)
    page = Path(out_dir) / report_file_names(Path(DEMO_JOINT).stem)["html"]
    return [text, "", f"Report: {page}", "", "Wrote:", *(f"  {p}" for p in written)]


def bundled_examples() -> dict[str, str]:
    """Every example input file shipped in the package: {file name: text}."""
    folder = resources.files("clampstack") / "examples"
    return {
        e.name: e.read_text(encoding="utf-8")
        for e in sorted(folder.iterdir(), key=lambda e: e.name)
        if e.name.endswith(".toml")
    }
