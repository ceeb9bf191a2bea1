"""Units layer: parsing quantities and ranges, dimension errors naming the key.

Conversion factors checked against NIST SP 811 (2008), Appendix B:
1 in = 25.4 mm exactly; 1 lbf = 4.448 222 N; 1 ft*lbf = 1.355 818 N*m;
degF -> K: T/K = (T/degF + 459.67)/1.8.
"""

from __future__ import annotations

import time
from pathlib import Path

import pytest

from clampstack.errors import InputError
from clampstack.units import parse_quantity, parse_range, to_unit


@pytest.mark.parametrize(
    ("text", "kind", "si"),
    [
        ("12 mm", "length", 0.012),
        ("0.5 in", "length", 0.0127),  # NIST SP 811: 1 in = 0.0254 m exactly
        ("85 N*m", "torque", 85.0),
        ("65 ft*lbf", "torque", 65 * 1.3558179483314004),  # NIST SP 811 B.9
        ("20 degC", "temperature", 293.15),
        ("68 degF", "temperature", 293.15),
        ("293.15 K", "temperature", 293.15),
        ("11.5e-6 / K", "expansion", 11.5e-6),
        ("6.4e-6 / delta_degF", "expansion", 6.4e-6 * 1.8),
        ("60 K", "temperature_difference", 60.0),
        ("60 delta_degC", "temperature_difference", 60.0),
        ("108 delta_degF", "temperature_difference", 60.0),
        ("314 mm^2", "area", 314e-6),
        ("314 mm**2", "area", 314e-6),
        ("0.5 in^2", "area", 0.5 * 0.0254**2),
        ("120 kN/mm", "stiffness", 1.2e8),
        ("210 GPa", "stress", 210e9),
        ("30 ksi", "stress", 30 * 6894757.293168361),
        ("6.3 um", "length", 6.3e-6),
        ("2 kip", "force", 2 * 4448.2216152605),
        ("-5 kN", "force", -5000.0),
        ("90 deg", "angle", 1.5707963267948966),
    ],
)
def test_parse_quantity(text, kind, si):
    assert parse_quantity(text, kind) == pytest.approx(si, rel=1e-12)


def test_plain_number_for_dimensionless():
    assert parse_quantity(0.12, "dimensionless") == 0.12
    assert parse_quantity("12 %", "dimensionless") == pytest.approx(0.12)


@pytest.mark.parametrize(
    ("text", "kind", "si"),
    [
        ("0.10..0.16", "dimensionless", (0.10, 0.16)),
        ("0..10 kN", "force", (0.0, 1e4)),
        ("-40..150 degC", "temperature", (233.15, 423.15)),
        ("-40 degC..150 degC", "temperature", (233.15, 423.15)),
        ("-5..-1 kN", "force", (-5e3, -1e3)),
        ("45 N*m", "torque", (45.0, 45.0)),
    ],
)
def test_parse_range(text, kind, si):
    lo, hi = parse_range(text, kind)
    assert lo == pytest.approx(si[0]) and hi == pytest.approx(si[1])


def test_wrong_dimension_names_key_path():
    with pytest.raises(InputError) as err:
        parse_quantity("5 kN", "length", "part[2].length")
    assert str(err.value) == 'part[2].length: expected a length, got "5 kN"'


def test_absolute_temperature_where_a_difference_is_expected():
    with pytest.raises(InputError, match="temperature difference"):
        parse_quantity("60 degC", "temperature_difference", "case[1].temperature_change")


@pytest.mark.parametrize(
    "bad", ["12", 12, "nan mm", "inf mm", "1e999 mm", "mm", "", "12 blorps", True, None, [1, 2]]
)
def test_bad_quantities(bad):
    with pytest.raises(InputError):
        parse_quantity(bad, "length", "k")


def test_reversed_range_is_error():
    with pytest.raises(InputError, match="low end above"):
        parse_range("0.16..0.10", "dimensionless", "tightening.thread_friction")


def test_to_unit_fast_and_pint_paths():
    assert to_unit(1e3, "kN") == 1.0
    assert to_unit(0.0254, "in") == pytest.approx(1.0)
    assert to_unit(1.0, "ft") == pytest.approx(1 / 0.3048)  # NIST SP 811: 1 ft = 0.3048 m


# ---------------------------------------------------------------- hostile unit strings


@pytest.mark.parametrize(
    "text",
    ["4 m*9**9**9", "4 m**9**9", "4 m^99", "1 mm*2**1000", "4 (m**2)**3**4", "4 m*9"],
)
def test_no_arithmetic_in_units(text):
    # pint would evaluate a tower of powers for minutes; the grammar refuses it at once
    t0 = time.perf_counter()
    with pytest.raises(InputError) as err:
        parse_quantity(text, "length", "bolt.length")
    assert time.perf_counter() - t0 < 1.0
    assert err.value.key == "bolt.length" and "\n" not in str(err.value)


def test_the_temperature_option_refuses_a_power_tower_within_a_second(tmp_path):
    from click.testing import CliRunner

    from clampstack.cli import main

    f = Path(__file__).parent.parent / "examples" / "gearbox-cover-cold-to-hot.toml"
    t0 = time.perf_counter()
    res = CliRunner().invoke(main, ["sweep", str(f), "--temperature", "4 m*9**9**9..5 degC"])
    assert time.perf_counter() - t0 < 5.0  # start-up and reading included
    assert res.exit_code == 2 and "--temperature" in res.stderr and res.stdout == ""


@pytest.mark.parametrize(
    ("text", "kind", "words"),
    [
        ("48 ± 1 N*m", "torque", "tolerance"),
        ("48 +/- 1 N*m", "torque", "tolerance"),
        ("20 rad*degC", "temperature", "absolute temperature"),
        ("5 degC^2", "temperature", "absolute temperature"),
        ("8 deg", "dimensionless", "angle"),
        ("0.1 rad", "dimensionless", "angle"),
    ],
)
def test_no_silently_dropped_text(text, kind, words):
    with pytest.raises(InputError) as err:
        parse_quantity(text, kind, "k")
    assert words in str(err.value)


@pytest.mark.parametrize(
    ("text", "kind", "si"),
    [
        ("11e-6 /degC", "expansion", 11e-6),
        ("2 mm^2", "area", 2e-6),
        ("2 (mm)^2", "area", 2e-6),
        ("1.5 N*m/rad", "torque", 1.5),
        ("10 µm", "length", 10e-6),
        ("5 delta_degC", "temperature_difference", 5.0),
        ("120 kN/mm", "stiffness", 1.2e8),
    ],
)
def test_ordinary_units_still_read(text, kind, si):
    assert parse_quantity(text, kind) == pytest.approx(si)


def test_a_damaged_unit_cache_is_rebuilt_not_bypassed(tmp_path, capsys):
    # common practice, no source: a cache that fails to load is deleted and written again
    from clampstack.units import build_registry

    folder = tmp_path / "pint-cache"
    build_registry(folder)
    files = sorted(folder.iterdir())
    assert files
    for f in files:
        f.write_text("garbage")
    ureg = build_registry(folder)
    assert ureg.Quantity(1, "inch").to("mm").magnitude == pytest.approx(25.4)
    assert all(f.read_bytes() != b"garbage" for f in sorted(folder.iterdir()))
    assert capsys.readouterr().err == ""
    build_registry(folder)  # and it now loads from the rebuilt cache
    assert capsys.readouterr().err == ""


def test_an_unwritable_unit_cache_is_reported(tmp_path, capsys):
    from clampstack.units import build_registry

    blocker = tmp_path / "file"
    blocker.write_text("not a folder")
    ureg = build_registry(blocker / "pint-cache")
    assert ureg.Quantity(1, "inch").to("mm").magnitude == pytest.approx(25.4)
    assert "unit cache" in capsys.readouterr().err
