"""Tests of the catalog layer: lookup, parsing, errors, interpolation, provenance."""

from __future__ import annotations

import math
import subprocess
import sys

import numpy as np
import pytest

from clampstack.catalog import (
    KINDS,
    grade,
    grades,
    listing,
    material,
    materials,
    thread,
    threads,
)
from clampstack.catalog._common import read_csv
from clampstack.errors import InputError

MM = 1e-3
K0 = 273.15


# ---------------------------------------------------------------- threads


@pytest.mark.parametrize(
    ("text", "expected"),
    [
        ("M10", "M10"),
        ("m10", "M10"),
        (" M10 ", "M10"),
        ("M10x1.5", "M10"),  # coarse pitch given explicitly -> coarse M10 (ISO 261)
        ("M10x1.25", "M10x1.25"),
        ("M10 x 1.25", "M10x1.25"),
        ("m10x1,25", "M10x1.25"),
        ("M10X1", "M10x1"),
        ("M3.5", "M3.5"),
        ("M64x4", "M64x4"),
        ("1/2-13 UNC", "1/2-13 UNC"),
        ("1/2-13UNC", "1/2-13 UNC"),
        ("1/2-13", "1/2-13 UNC"),
        ("1/2-13 unc-2A", "1/2-13 UNC"),
        ("1/2-20 UNF", "1/2-20 UNF"),
        ("1-8 UNC", "1-8 UNC"),
        ("1-1/2-6 UNC", "1-1/2-6 UNC"),
        ("1-1/2-12 UNF", "1-1/2-12 UNF"),
    ],
)
def test_thread_designation_parsing(text: str, expected: str) -> None:
    assert thread(text).designation == expected


def test_thread_series_and_units() -> None:
    # ISO 261: M10 coarse pitch 1.5 mm; ASME B1.1: 1/2-13 UNC, P = 1/13 in
    m10 = thread("M10")
    assert m10.series == "coarse" and m10.system == "metric"
    assert m10.d == pytest.approx(10 * MM) and m10.P == pytest.approx(1.5 * MM)
    fine = thread("M12x1.25")
    assert fine.series == "fine"
    unc = thread("1/2-13 UNC")
    assert unc.series == "UNC" and unc.system == "unified" and unc.tpi == 13
    assert unc.d == pytest.approx(0.5 * 0.0254)


def test_thread_derived_areas() -> None:
    # VDI 2230-1: Ad3 = pi d3^2/4, AN = pi d^2/4, dS = (d2 + d3)/2
    for t in threads():
        assert t.Ad3 == pytest.approx(math.pi / 4 * t.d3**2)
        assert t.AN == pytest.approx(math.pi / 4 * t.d**2)
        assert t.ds == pytest.approx((t.d2 + t.d3) / 2)
        assert t.d3 < t.d1 < t.d2 < t.d
        assert t.Ad3 < t.As < t.AN


def test_thread_default_dimensions() -> None:
    # ISO 4017 s = 16 mm, ISO 4762 dk = 16 mm, ISO 4032 m = 8.4 mm, ISO 273 11 mm medium (M10)
    t = thread("M10x1.25")
    assert t.head_across_flats == pytest.approx(16 * MM)
    assert t.socket_head_diameter == pytest.approx(16 * MM)
    assert t.nut_height == pytest.approx(8.4 * MM)
    assert (t.hole_fine, t.hole_medium, t.hole_coarse) == (
        pytest.approx(10.5 * MM),
        pytest.approx(11 * MM),
        pytest.approx(12 * MM),
    )
    # ASME B18.2.1 hex cap screw F = 3/4 in, ASME B18.2.2 nut H = 7/16 in (1/2 in)
    u = thread("1/2-13 UNC")
    assert u.head_across_flats == pytest.approx(0.75 * 0.0254)
    assert u.nut_height == pytest.approx(7 / 16 * 0.0254)
    # ISO 4762 has no M18: no socket head default
    assert thread("M18").socket_head_diameter is None


def test_every_thread_has_dimensions_and_holes_ordered() -> None:
    for t in threads():
        assert t.head_across_flats > t.d
        assert 0 < t.nut_height < 1.2 * t.d
        holes = [h for h in (t.hole_fine, t.hole_medium, t.hole_coarse) if h is not None]
        assert holes == sorted(holes) and all(h > t.d for h in holes)


def test_thread_catalog_covers_the_brief() -> None:
    names = {t.designation for t in threads()}
    for d in (3, 4, 5, 6, 8, 10, 12, 16, 20, 24, 30, 36, 42, 48, 56, 64):
        assert f"M{d}" in names
    for n in ("M8x1", "M10x1.25", "M10x1", "M12x1.5", "M12x1.25", "M36x3", "M64x4"):
        assert n in names
    for n in ("1/4-20 UNC", "1-1/2-6 UNC", "1/4-28 UNF", "1-1/2-12 UNF"):
        assert n in names


def test_unknown_thread_lists_near_matches() -> None:
    with pytest.raises(InputError) as err:
        thread("M11")
    msg = str(err.value)
    assert "M11" in msg and "did you mean" in msg
    assert "M10" in msg or "M12" in msg


def test_unknown_fine_pitch_lists_near_matches() -> None:
    with pytest.raises(InputError, match=r"M10x1\.25"):
        thread("M10x1.75")


def test_wrong_unified_series_is_named() -> None:
    with pytest.raises(InputError, match="1/2-20 UNF"):
        thread("1/2-20 UNC")


@pytest.mark.parametrize("text", ["", "bolt", "M", "10", "1/0-13 UNC", "M10x"])
def test_garbage_thread_is_input_error(text: str) -> None:
    with pytest.raises(InputError):
        thread(text)


# ---------------------------------------------------------------- grades


@pytest.mark.parametrize(
    ("alias", "name"),
    [
        ("8.8", "8.8"),
        ("ISO 898-1 8.8", "8.8"),
        ("property class 10.9", "10.9"),
        ("10.9", "10.9"),
        ("a2-70", "A2-70"),
        ("A4-80", "A4-80"),
        ("A4 70", "A4-70"),
        ("SAE J429 5", "SAE J429 5"),
        ("SAE 5", "SAE J429 5"),
        ("sae j429 grade 8", "SAE J429 8"),
        ("J429-8", "SAE J429 8"),
        ("ASTM A193 B7", "ASTM A193 B7"),
        ("B7", "ASTM A193 B7"),
        ("b7", "ASTM A193 B7"),
    ],
)
def test_grade_aliases(alias: str, name: str) -> None:
    assert grade(alias).name == name


def test_grade_rows_by_size() -> None:
    # ISO 898-1:2013 Table 3: 8.8 d <= 16 mm 640 MPa, d > 16 mm 660 MPa
    assert grade("8.8", 16 * MM).Rp02 == pytest.approx(640e6)  # boundary -> smaller row
    assert grade("8.8", 16.0001 * MM).Rp02 == pytest.approx(660e6)
    assert grade("8.8", 10 * MM).Rp02 == pytest.approx(640e6)
    assert grade("8.8", thread("M20").d).Rp02 == pytest.approx(660e6)
    # SAE J429: a 1 in bolt belongs to the 1/4-1 in row (inclusive)
    assert grade("SAE 5", thread("1-8 UNC").d).Rm == pytest.approx(120 * 6.894757e6, rel=1e-3)
    # ASTM A193 B7: 2-1/2 in and under; over 2-1/2 to 4 in
    assert grade("B7", 2.5 * 0.0254).Rm == pytest.approx(860e6)
    assert grade("B7", 3 * 0.0254).Rm == pytest.approx(795e6)


def test_grade_without_diameter_gives_first_row() -> None:
    assert grade("8.8").d_range[1] == pytest.approx(16 * MM)


def test_grade_size_outside_range() -> None:
    with pytest.raises(InputError) as err:
        grade("9.8", 20 * MM)  # ISO 898-1: 9.8 only for d <= 16 mm
    msg = str(err.value)
    assert "9.8" in msg and "1.6 to 16 mm" in msg
    with pytest.raises(InputError, match=r"8\.8.*1\.6 to 39 mm"):
        grade("8.8", 48 * MM)
    with pytest.raises(InputError, match="SAE J429 5.*6.35 to 38.1 mm"):
        grade("SAE 5", 2 * 0.0254)
    with pytest.raises(InputError, match="positive"):
        grade("8.8", -1.0)


def test_unknown_grade_lists_near_matches() -> None:
    with pytest.raises(InputError) as err:
        grade("8.9")
    msg = str(err.value)
    assert "did you mean" in msg and "8.8" in msg


def test_grade_material_keys_exist_and_values_sane() -> None:
    for g in grades():
        m = material(g.material_key)
        assert m.key == g.material_key
        assert g.Rp02 < g.Rm
        if g.proof is not None:
            assert g.proof < g.Rp02
        assert 150e9 < g.E < 220e9
        assert 10e-6 < g.alpha < 18e-6
        assert g.d_range[0] < g.d_range[1]


# ---------------------------------------------------------------- materials


REQUIRED_MATERIALS = [
    "steel",
    "steel-alloy",
    "stainless",
    "cast-iron-grey",
    "cast-iron-nodular",
    "aluminium-6061-T6",
    "aluminium-6082-T6",
    "aluminium-7075-T6",
    "aluminium-cast",
    "magnesium",
    "titanium-6Al-4V",
    "brass",
    "bronze",
]


@pytest.mark.parametrize("key", REQUIRED_MATERIALS)
def test_required_materials_present(key: str) -> None:
    m = material(key)
    assert m.key == key
    lo, hi = m.valid_range()
    assert lo <= 293.15 <= hi
    # the 20 degC scalars agree with the temperature table
    assert m.modulus(293.15) == pytest.approx(m.E20, rel=1e-3)
    assert m.expansion(293.15) == pytest.approx(m.alpha20, rel=1e-3)


@pytest.mark.parametrize(
    ("alias", "key"),
    [
        ("aluminum-6061-T6", "aluminium-6061-T6"),
        ("Aluminium-6082-t6", "aluminium-6082-T6"),
        ("304", "stainless"),
        ("S355", "steel"),
        ("42CrMo4", "steel-alloy"),
        ("Ti-6Al-4V", "titanium-6Al-4V"),
        ("ti6al4v", "titanium-6Al-4V"),
        ("GJL-250", "cast-iron-grey"),
        ("GJS-400", "cast-iron-nodular"),
        ("AZ91", "magnesium"),
        ("STEEL", "steel"),
        ("C45", "steel-C45"),
    ],
)
def test_material_aliases(alias: str, key: str) -> None:
    assert material(alias).key == key


def test_unknown_material_lists_near_matches() -> None:
    with pytest.raises(InputError) as err:
        material("aluminium-6063-T6")
    msg = str(err.value)
    assert "did you mean" in msg and "aluminium-6061-T6" in msg


def test_temperature_interpolation() -> None:
    # EN 10088-1 (stainless): E 194 GPa at 100 degC, 186 GPa at 200 degC -> 190 at 150 degC
    ss = material("stainless")
    assert ss.modulus(K0 + 150) == pytest.approx(190e9)
    # mean alpha 16.0 (100 degC) and 16.5 (200 degC) -> 16.25e-6 at 150 degC
    assert ss.expansion(K0 + 150) == pytest.approx(16.25e-6)
    assert ss.thermal_strain(K0 + 150) == pytest.approx(16.25e-6 * 130)
    assert ss.thermal_strain(293.15) == 0.0


def test_temperature_vectorised() -> None:
    steel = material("steel")
    T = np.array([[253.15, 293.15], [373.15, 673.15]])
    E = steel.modulus(T)
    assert isinstance(E, np.ndarray) and E.shape == T.shape
    assert np.all(np.diff(E.ravel()) < 0)  # modulus falls with temperature
    alpha = steel.expansion(T)
    assert alpha.shape == T.shape
    strain = steel.thermal_strain(T)
    assert strain[0, 1] == 0.0 and strain[0, 0] < 0 < strain[1, 1]
    assert isinstance(steel.modulus(300.0), float)


def test_monotonic_tables() -> None:
    for m in materials():
        for T in (m.T, m.T_E, m.T_alpha):
            assert np.all(np.diff(np.array(T)) > 0)
        assert np.all(np.diff(np.array(m.E_T)) <= 0), m.key  # stiffness never rises with T
        assert all(1e-6 < a < 40e-6 for a in m.alpha_T)


def test_out_of_range_temperature_error_text() -> None:
    al = material("aluminium-6082-T6")
    with pytest.raises(InputError) as err:
        al.modulus(K0 + 300)
    msg = str(err.value)
    assert "aluminium-6082-T6" in msg
    assert "300 degC" in msg
    assert "modulus E -100 to 250 degC" in msg  # the modulus's own data
    with pytest.raises(InputError, match="no extrapolation"):
        al.expansion(np.array([293.15, K0 - 60]))
    with pytest.raises(InputError):
        al.thermal_strain(float("nan"))


def test_required_temperature_spans() -> None:
    # the brief: steels and stainless at least -50..400 degC, aluminium to 200 degC,
    # titanium and cast irons to about 400 degC, copper alloys to about 250 degC
    def span(key: str) -> tuple[float, float]:
        lo, hi = material(key).valid_range()
        return lo - K0, hi - K0

    for key in ("steel", "steel-alloy", "stainless"):
        lo, hi = span(key)
        assert lo <= -50 and hi >= 400
    for key in ("aluminium-6061-T6", "aluminium-6082-T6", "aluminium-7075-T6"):
        assert span(key)[1] >= 200
    for key in ("titanium-6Al-4V", "cast-iron-grey", "cast-iron-nodular"):
        assert span(key)[1] >= 400
    for key in ("brass", "bronze"):
        assert span(key)[1] >= 250


# ---------------------------------------------------------------- provenance and listing


@pytest.mark.parametrize(
    "name",
    [
        "threads_iso_metric.csv",
        "threads_unified.csv",
        "dims_iso_metric.csv",
        "dims_unified.csv",
        "grades.csv",
        "materials.csv",
        "materials_temperature.csv",
    ],
)
def test_every_data_row_names_its_source(name: str) -> None:
    rows = read_csv(name)
    assert rows
    for row in rows:
        assert row["source"].strip(), row


@pytest.mark.parametrize("kind", KINDS)
def test_listing_shape(kind: str) -> None:
    header, rows = listing(kind)
    assert header[-1] == "source"
    assert rows and all(len(r) == len(header) for r in rows)
    assert all(isinstance(c, str) for r in rows for c in r)
    assert all(r[-1] for r in rows)
    assert any("[" in h for h in header)


def test_listing_units_and_values() -> None:
    header, rows = listing("Threads")
    assert "As [mm^2]" in header and "d [mm]" in header
    m10 = next(r for r in rows if r[0] == "M10")
    assert m10[header.index("As [mm^2]")] == "57.99"
    header, rows = listing("grades")
    assert "Rm [MPa]" in header
    header, rows = listing("materials")
    assert "E20 [GPa]" in header and "T range [degC]" in header


def test_listing_unknown_kind() -> None:
    with pytest.raises(InputError, match="threads, grades, materials"):
        listing("bolts")


def test_import_is_cheap() -> None:
    code = "import sys, clampstack.catalog; print('numpy' in sys.modules)"
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.strip() == "False"
