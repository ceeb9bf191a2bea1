"""Bad input: one line on stderr naming the file and key, exit code 2, nothing on stdout."""

from __future__ import annotations

import pytest
from click.testing import CliRunner

from clampstack.cli import main

GOOD = """
[[part]]
name = "rod"
ends = ["A", "B"]
length = "300 mm"
area = "100 mm^2"
material = "steel"
[supports]
fixed = ["A"]
[[load]]
node = "B"
force = "5 kN"
"""


def run(*args: str):
    return CliRunner().invoke(main, list(args))


def check_one_line_error(res, *needles: str) -> None:
    assert res.exit_code == 2, (res.exit_code, res.output)
    assert res.stdout == ""
    lines = res.stderr.strip().splitlines()
    assert len(lines) == 1, res.stderr
    assert "Traceback" not in res.stderr
    for n in needles:
        assert n in lines[0], (n, lines[0])


def test_good_file_is_fine(write_toml):
    assert run("solve", str(write_toml(GOOD))).exit_code == 0


def test_missing_file(tmp_path):
    p = tmp_path / "nope.toml"
    check_one_line_error(run("solve", str(p)), "nope.toml", "not found")


def test_malformed_toml(write_toml):
    p = write_toml("[[part]\nname = ")
    check_one_line_error(run("solve", str(p)), p.name, "TOML")


@pytest.mark.parametrize(
    ("old", "new", "needles"),
    [
        ('length = "300 mm"', 'lenght = "300 mm"', ["part[1].lenght", "unknown key", "length"]),
        ('length = "300 mm"', 'length = "5 kN"', ["part[1].length", "expected a length", "5 kN"]),
        ('length = "300 mm"', 'length = "-300 mm"', ["part[1].length", "greater than zero"]),
        ('length = "300 mm"', 'length = "0 mm"', ["part[1].length", "greater than zero"]),
        ('area = "100 mm^2"', 'area = "0 mm^2"', ["part[1].area", "greater than zero"]),
        ('area = "100 mm^2"', 'area = "-1 mm^2"', ["part[1].area", "greater than zero"]),
        ('node = "B"', 'node = "Q"', ["load[1].node", "unknown node", "Q"]),
        ('material = "steel"', 'material = "unobtainium"', ["part[1].material", "unobtainium"]),
        ('force = "5 kN"', 'force = "nan kN"', ["load[1].force", "finite"]),
        ('force = "5 kN"', 'force = "inf kN"', ["load[1].force", "finite"]),
        ('force = "5 kN"', "force = nan", ["load[1].force"]),
        ('force = "5 kN"', "force = inf", ["load[1].force"]),
        ('force = "5 kN"', 'force = "5"', ["load[1].force", "unit"]),
        ('fixed = ["A"]', 'fixed = ["Z"]', ["supports.fixed", "Z"]),
        ('fixed = ["A"]', "fixed = []", ["supports.fixed", "at least one"]),
        ('ends = ["A", "B"]', 'ends = ["A", "A"]', ["part[1].ends"]),
    ],
)
def test_bad_values(write_toml, old, new, needles):
    assert old in GOOD
    p = write_toml(GOOD.replace(old, new))
    check_one_line_error(run("solve", str(p)), p.name, *needles)


def test_missing_required_section(write_toml):
    p = write_toml(GOOD.split("[supports]")[0])
    check_one_line_error(run("solve", str(p)), "supports", "missing")


def test_floating_sub_assembly_names_nodes(write_toml):
    text = (
        GOOD
        + """
[[part]]
name = "loose"
ends = ["C", "D"]
stiffness = "10 kN/mm"
"""
    )
    check_one_line_error(run("solve", str(write_toml(text))), "C, D", "floating")


def test_gap_without_contact_is_a_compression_clearance(write_toml):
    # a gap alone is a clearance that closes in compression (documented default)
    p = write_toml(GOOD.replace('material = "steel"', 'material = "steel"\ngap = "0.1 mm"'))
    res = run("solve", str(p), "--json")
    assert res.exit_code == 2  # the rod is the only part: pulled, it is slack: a mechanism
    assert "mechanism" in res.stderr and p.name in res.stderr


def test_unknown_option_is_usage_error(write_toml):
    res = run("solve", str(write_toml(GOOD)), "--bogus")
    assert res.exit_code == 2
