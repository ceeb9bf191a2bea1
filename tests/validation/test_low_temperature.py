"""Design points in the cold: data below 20 degC, flagged extrapolation, errors naming keys.

Sources of the checked values (all recalled without the document: from memory):

- ASME B31.3 Table C-6, aluminum and aluminum alloys: modulus 10.8 / 10.5 / 10.0e6 psi at
  -200 / -100 / 70 degF.  At -100 degC (-148 degF) that is 10.644e6 psi, a ratio of 1.0644
  to 70 degF; at -50 degC (-58 degF) 10.376e6 psi, a ratio of 1.0376 (linear in degF).
- ASME B31.3 Table C-6, carbon steels C <= 0.30 %: 30.8 / 30.2 / 29.5e6 psi at -200 / -100 /
  70 degF (the rows the catalog already held; the data reach -100 degC).
- Moduli of metals rise and mean expansion coefficients from 20 degC fall as they cool
  (every handbook table; the checks on monotone data below).

Extrapolation is this package's own rule (``clampstack.catalog.COLD_MARGIN``, common
practice, no source): linear from the two coldest table points, at most 100 K below the
data, flagged in the notes; never above the data.
"""

from __future__ import annotations

import csv
from importlib import resources

import numpy as np
import pytest
from click.testing import CliRunner

from clampstack.catalog import COLD_MARGIN, grade, grades, material, materials
from clampstack.cli import main
from clampstack.errors import InputError
from clampstack.inputs.joint import joint_from_data
from clampstack.joint import analyse
from clampstack.studies.sweep import sweep

C0 = 273.15
PSI = 6894.757293168361

MATERIAL_KEYS = [m.key for m in materials()]
GRADE_NAMES = list(dict.fromkeys(g.name for g in grades()))


def _rows(name: str) -> list[dict[str, str]]:
    path = resources.files("clampstack").joinpath("data", name)
    with path.open(encoding="utf-8", newline="") as fh:
        return list(csv.DictReader(fh))


def joint(T: str | None = "-40 degC", tapped: str = "steel", clamped: str = "steel", **over):
    data = {
        "bolt": {"thread": "M10", "grade": "8.8", "length": "40 mm"},
        "tapped_hole": {"material": tapped, "engagement": "15 mm"},
        "clamped": [{"name": "cover", "material": clamped, "thickness": "14 mm"}],
        "tightening": {"torque": "35 N*m", "thread_friction": "0.10..0.16"},
        "service": {"axial_load": "0..2 kN"},
    }
    if T is not None:
        data["service"]["temperature"] = T
    data.update(over)
    return data


def through_bolt(name: str, T: str) -> dict:
    """A bolt of grade ``name`` with a nut through 14 mm of steel at service temperature T."""
    inch = name.startswith(("SAE", "ASTM"))
    return {
        "bolt": {
            "thread": "1/2-13" if inch else "M10",
            "grade": name,
            "length": "45 mm" if inch else "25 mm",
        },
        "nut": {},
        "clamped": [{"material": "steel", "thickness": "14 mm"}],
        "tightening": {"thread_friction": "0.10..0.16"},
        "service": {"axial_load": "0..2 kN", "temperature": T},
    }


# ------------------------------------------------------------------ the data rows


@pytest.mark.parametrize(
    ("key", "T", "ratio"),
    [
        # ASME B31.3 Table C-6 aluminum alloys, E(T)/E(70 degF) (from memory)
        ("aluminium-6061-T6", -100, 10.644 / 10.0),
        ("aluminium-6082-T6", -100, 10.644 / 10.0),
        ("aluminium-7075-T6", -100, 10.644 / 10.0),
        ("aluminium-cast", -100, 10.644 / 10.0),
        ("aluminium-cast", -50, 10.376 / 10.0),
    ],
)
def test_aluminium_moduli_in_the_cold_asme_b31_3_c6(key, T, ratio):
    m = material(key)
    assert m.modulus(C0 + T) / m.E20 == pytest.approx(ratio, rel=2e-3)  # B31.3 C-6 (memory)


def test_carbon_steel_modulus_at_minus_100_degc_asme_b31_3_c6():
    # -148 degF between 30.2e6 psi (-100 degF) and 30.8e6 psi (-200 degF), B31.3 C-6 (memory)
    E = material("steel").modulus(C0 - 100)
    assert E / PSI / 1e6 == pytest.approx(30.2 + 0.48 * 0.6, rel=2e-3)


@pytest.mark.parametrize("key", MATERIAL_KEYS)
def test_tables_monotone_and_physical(key):
    m = material(key)
    E = np.array(m.E_T)
    alpha = np.array(m.alpha_T)
    assert np.all(np.diff(E) <= 0), key  # stiffer when colder
    assert np.all(np.diff(alpha) >= 0), key  # the mean coefficient falls as it cools
    # extrapolated a full margin below the data, still monotone and plausible
    lo_E, lo_a = m.data_range("E")[0], m.data_range("alpha")[0]
    T_E = np.linspace(lo_E - COLD_MARGIN, m.data_range("E")[1], 50)
    T_a = np.linspace(lo_a - COLD_MARGIN, m.data_range("alpha")[1], 50)
    E_x = m.modulus(T_E, extrapolate=True)
    a_x = m.expansion(T_a, extrapolate=True)
    assert np.all(np.diff(E_x) <= 1e-6) and E_x[0] < 1.15 * m.E20, key
    # iron contracts about 0.2 % from 20 to -196 degC: a mean of about 9.2e-6/K, 0.8 of its
    # 20 degC value (from memory); no metal here falls below 0.7 of it 100 K past its data
    assert np.all(np.diff(a_x) >= -1e-18) and a_x[0] > 0.7 * m.alpha20, key


def test_every_temperature_row_names_its_source():
    for row in _rows("materials_temperature.csv"):
        assert row["source"].strip(), row
        assert row["E_GPa"] or row["alpha_mean_1e-6_per_K"], row
        if float(row["T_degC"]) < 20:  # the cold rows: recalled values say so
            assert "from memory" in row["source"], row
    for row in _rows("grades_temperature.csv"):
        assert row["source"].strip(), row


def test_a_blank_cell_is_no_data_of_that_property():
    m = material("aluminium-cast")
    assert m.data_range("E")[0] == pytest.approx(C0 - 100)
    assert m.data_range("alpha")[0] == pytest.approx(C0 + 20)
    assert m.valid_range()[0] == pytest.approx(C0 + 20)  # both tabulated from 20 degC
    with pytest.raises(InputError, match="no extrapolation"):
        m.expansion(C0 - 40)  # strict unless asked (the flange model asks nothing)


def test_extrapolation_is_linear_from_the_two_coldest_points():
    mg = material("magnesium")  # 45.0 GPa at 20, 43.5 GPa at 100 degC (catalog rows)
    assert mg.modulus(C0 - 40, extrapolate=True) == pytest.approx((45.0 + 60 * 1.5 / 80) * 1e9)
    al = material("aluminium-6061-T6")  # alpha 21.8 at -50, 22.7 at 20 degC (ASM, memory)
    assert al.expansion(C0 - 60, extrapolate=True) == pytest.approx((21.8 - 10 * 0.9 / 70) * 1e-6)
    with pytest.raises(InputError, match="at most 100 K below"):
        mg.modulus(C0 + 20 - COLD_MARGIN - 1, extrapolate=True)
    with pytest.raises(InputError, match="not above"):
        mg.modulus(C0 + 151, extrapolate=True)  # never above the data


# ------------------------------------------------------------------ every material and grade


@pytest.mark.parametrize("key", MATERIAL_KEYS)
@pytest.mark.parametrize("T", ["-40 degC", "-60 degC"])
@pytest.mark.parametrize("where", ["tapped", "clamped"])
def test_every_material_runs_in_the_cold(key, T, where):
    spec = joint_from_data(joint(T, **{where: key}))
    r = analyse(spec)
    assert r.checks
    lo = material(key).data_range("E")[0]
    if float(T.split()[0]) + C0 < lo:
        assert any(f"({key}): modulus E extrapolated below its data" in n for n in r.notes)


@pytest.mark.parametrize("key", MATERIAL_KEYS)
def test_every_material_sweeps_from_minus_60(key):
    s = sweep(joint_from_data(joint(None, clamped=key)), C0 - 60, C0 + 100, 10.0)
    assert np.all(np.isfinite(s.preload_min))
    lo = max(material(key).data_range("E")[0], material(key).data_range("alpha")[0])
    flagged = [n for n in s.notes if f"plate 'cover' ({key})" in n]
    assert bool(flagged) == (lo > C0 - 60 + 1e-9), (key, s.notes)
    assert all("to -60 degC" in n for n in flagged)


@pytest.mark.parametrize("name", GRADE_NAMES)
@pytest.mark.parametrize("T", ["-40 degC", "-60 degC"])
def test_every_grade_runs_in_the_cold_with_its_yield_held(name, T):
    r = analyse(joint_from_data(through_bolt(name, T)))
    g = grade(name)
    held = [n for n in r.notes if n.startswith(f"bolt (grade {g.name}): yield strength")]
    assert len(held) == 1
    assert f"from 20 to {T.split()[0]} degC, by holding its 20 degC value" in held[0]


def test_cast_aluminium_at_minus_60_is_flagged_in_check_and_sweep(write_toml):
    data = joint("-60 degC", clamped="aluminium-cast")
    r = analyse(joint_from_data(data))
    want = (
        "plate 'cover' (aluminium-cast): mean expansion coefficient alpha extrapolated below "
        "its data, from 20 to -60 degC"
    )
    assert any(n.startswith(want) for n in r.notes), r.notes
    assert not any("modulus E extrapolated" in n for n in r.notes)  # E data reach -100 degC
    # the same through the command line: check prints it, sweep --json carries it
    p = write_toml(
        """
[bolt]
thread = "M10"
grade = "8.8"
length = "40 mm"
[tapped_hole]
material = "steel"
engagement = "15 mm"
[[clamped]]
name = "cover"
material = "aluminium-cast"
thickness = "14 mm"
[tightening]
torque = "35 N*m"
thread_friction = "0.10..0.16"
[service]
axial_load = "0..2 kN"
temperature = "-60 degC"
"""
    )
    res = CliRunner().invoke(main, ["check", str(p)])
    assert res.exit_code in (0, 1) and want in res.stdout
    res = CliRunner().invoke(main, ["sweep", str(p), "--temperature", "-80..60", "--json"])
    assert res.exit_code in (0, 1)
    import json

    notes = json.loads(res.stdout)["notes"]
    assert any(n.startswith(want.replace("-60 degC", "-80 degC")) for n in notes), notes


def test_no_note_inside_the_data():
    r = analyse(joint_from_data(joint("-60 degC", clamped="stainless")))
    assert not any("extrapolated below its data" in n and "(stainless)" in n for n in r.notes)
    s = sweep(joint_from_data(joint(None)), C0 + 20, C0 + 100, 10.0)
    assert s.notes == ()


# ------------------------------------------------------------------ errors name the user's key


def _one_line_error(res, *needles):
    assert res.exit_code == 2, (res.exit_code, res.output)
    assert res.stdout == ""
    lines = res.stderr.strip().splitlines()
    assert len(lines) == 1, res.stderr
    for n in needles:
        assert n in lines[0], (n, lines[0])


BASE = """
[bolt]
thread = "M10"
grade = "8.8"
length = "40 mm"
{bolt}
[tapped_hole]
material = "aluminium-cast"
engagement = "15 mm"
{tapped}
[[clamped]]
material = "steel"
thickness = "7 mm"
[[clamped]]
material = "magnesium"
thickness = "7 mm"
{clamped2}
[service]
{service}
"""


@pytest.mark.parametrize(
    ("parts", "key", "needles"),
    [
        ({"service": 'temperature = "-250 degC"'}, "service.temperature", ["aluminium-cast"]),
        (
            {"service": 'assembly_temperature = "-250 degC"'},
            "service.assembly_temperature",
            ["aluminium-cast"],
        ),
        ({"tapped": 'temperature = "-250 degC"'}, "tapped_hole.temperature", ["tapped hole"]),
        (
            {"clamped2": 'temperature = "-100 degC"'},
            "clamped[2].temperature",
            ["magnesium", "part 2"],
        ),
        (
            {"bolt": 'material = "titanium-6Al-4V"\ntemperature = "-150 degC"'},
            "bolt.temperature",
            ["titanium-6Al-4V", "of the bolt"],
        ),
    ],
)
def test_an_impossible_temperature_names_the_key_it_came_from(write_toml, parts, key, needles):
    text = BASE.format(**{"bolt": "", "tapped": "", "clamped2": "", "service": "", **parts})
    res = CliRunner().invoke(main, ["check", str(write_toml(text))])
    _one_line_error(res, f": {key}: ", "outside the data", *needles)
    assert "layer '" not in res.stderr


def test_a_nut_colder_than_its_data_names_the_bolt_temperature(write_toml):
    p = write_toml(
        """
[bolt]
thread = "M10"
grade = "8.8"
length = "30 mm"
temperature = "-150 degC"
[nut]
material = "brass"
[[clamped]]
material = "steel"
thickness = "14 mm"
"""
    )
    _one_line_error(CliRunner().invoke(main, ["check", str(p)]), ": bolt.temperature: ", "nut")


def test_a_sweep_too_far_below_the_data_names_the_option(write_toml):
    p = write_toml(BASE.format(bolt="", tapped="", clamped2="", service=""))
    res = CliRunner().invoke(main, ["sweep", str(p), "--temperature", "-100..60"])
    # magnesium: data from 20 degC, extrapolated to -80 degC at most
    _one_line_error(res, ": --temperature: ", "magnesium", "-100 degC", "at most 100 K below")
    res = CliRunner().invoke(main, ["sweep", str(p), "--temperature", "-80..60", "--json"])
    assert res.exit_code in (0, 1), res.output


def test_flange_and_scatter_flag_the_extrapolation_too():
    # a nodular cast-iron flange (data from 20 degC, catalog) at -60 degC: extrapolated and
    # noted by `flange`; a magnesium sleeve at -50 degC: noted by `scatter`
    from clampstack.flange.analysis import analyse_flange
    from clampstack.inputs.flange import flange_from_data
    from clampstack.inputs.joint import joint_from_data
    from clampstack.studies.scatter import scatter

    f = flange_from_data(
        {
            "title": "cold flange",
            "flange": {
                "bolt_count": 8,
                "bolt_circle": "160 mm",
                "thickness": "20 mm",
                "inner_diameter": "90 mm",
                "outer_diameter": "200 mm",
                "material": "cast-iron-nodular",
            },
            "bolt": {"thread": "M16", "grade": "8.8"},
            "gasket": {
                "type": "spiral-wound",
                "inner_diameter": "95 mm",
                "outer_diameter": "127 mm",
                "thickness": "4.5 mm",
            },
            "loading": {"pressure": "40 bar", "temperature": "-60 degC"},
        }
    )
    r = analyse_flange(f, compensate=False)
    assert any("flange (cast-iron-nodular): modulus E extrapolated" in n for n in r.notes)
    j = joint_from_data(
        {
            "title": "cold sleeve",
            "bolt": {"thread": "M12", "grade": "8.8", "length": "110 mm"},
            "nut": {},
            "clamped": [
                {"material": "steel", "thickness": "12 mm"},
                {
                    "material": "magnesium",
                    "thickness": "70 mm",
                    "kind": "sleeve",
                    "outer_diameter": "24 mm",
                    "hole": "13 mm",
                },
                {"material": "steel", "thickness": "12 mm"},
            ],
            "tightening": {"torque": "60 N*m", "thread_friction": "0.10..0.16"},
            "service": {"axial_load": "4 kN", "temperature": "-50 degC"},
        }
    )
    sr = scatter(j, {}, 2000)
    assert any("(magnesium): modulus E extrapolated" in n for n in sr.to_dict()["notes"])
