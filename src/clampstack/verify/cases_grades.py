"""Fastener grades and material data: ISO 898-1, ISO 3506-1, SAE J429, ASTM A193, ASME II-D.

Strengths are compared with the property tables of the standards; proof loads
(A_s x S_p) with the printed loads of ISO 898-1; values at temperature with
ISO 898-1 Annex A and ASME BPVC II-D Tables TM-1 and TE-1.
"""

from __future__ import annotations

from ..catalog import grade, material, thread, yield_at_temperature
from .registry import Outcome, add

MPA = 1e6
KSI = 6.894757293168361e6
PSI = 6894.757293168361
INCH = 0.0254


def _degf(f: float) -> float:
    """degF to kelvin."""
    return (f - 32) / 1.8 + 273.15


def _strength(name: str, cls: str, d: float, attr: str, value: float, unit: str, source: str):
    def fn() -> Outcome:
        g = grade(cls, d)
        got = getattr(g, attr)
        factor = MPA if unit == "MPa" else KSI
        # the catalog stores the standards' own figures: agreement to 0.1 %; ASTM A193
        # prints ksi and MPa values that round each other (1 %)
        tol = 0.01 if "A193" in cls else 1e-3
        return Outcome(got / factor, value, tol, source, unit)

    add(name, "grades", fn, kind="published")


# ISO 898-1:2013 Table 3 (minimum strengths; the project's reference sheet)
_strength(
    "R_p0.2 of class 8.8, d <= 16 mm",
    "8.8",
    12e-3,
    "Rp02",
    640,
    "MPa",
    "ISO 898-1:2013 Table 3",
)
_strength("R_m of class 8.8, d > 16 mm", "8.8", 20e-3, "Rm", 830, "MPa", "ISO 898-1:2013 Table 3")
_strength("R_p0.2 of class 10.9", "10.9", 12e-3, "Rp02", 940, "MPa", "ISO 898-1:2013 Table 3")
_strength("R_m of class 12.9", "12.9", 12e-3, "Rm", 1220, "MPa", "ISO 898-1:2013 Table 3")
_strength(
    "R_p0.2 of A4-80",
    "A4-80",
    12e-3,
    "Rp02",
    600,
    "MPa",
    "ISO 3506-1:2009 Table 3 (from memory)",
)
_strength(
    "proof stress of SAE J429 grade 5, 1/4 to 1 in",
    "SAE J429 5",
    1.0 * INCH,
    "proof",
    85,
    "ksi",
    "SAE J429, grade 5, 1/4 to 1 in",
)
_strength(
    "tensile strength of SAE J429 grade 8",
    "SAE J429 8",
    0.75 * INCH,
    "Rm",
    150,
    "ksi",
    "SAE J429, grade 8",
)
_strength(
    "yield of ASTM A193 B7, over 2-1/2 to 4 in",
    "ASTM A193 B7",
    3.0 * INCH,
    "Rp02",
    95,
    "ksi",
    "ASTM A193/A193M Table 2, grade B7",
)


def _proof_load(size: str, cls: str, load: float):
    # ISO 898-1:2013 Table 5: proof load A_s,nom x S_p,nom, printed to three significant
    # digits (from memory); tolerance 0.5 %
    def fn() -> Outcome:
        t = thread(size)
        g = grade(cls, t.d)
        assert g.proof is not None
        return Outcome(
            t.As * g.proof / 1e3,
            load / 1e3,
            0.005,
            "ISO 898-1:2013 Table 5, proof load (from memory)",
            "kN",
        )

    add(f"proof load {size} class {cls}", "grades", fn, kind="published")


_proof_load("M10", "8.8", 33_700)
_proof_load("M12", "10.9", 70_000)
_proof_load("M20", "8.8", 147_000)


def _yield_hot(cls: str, T_c: float, value: float):
    # ISO 898-1:2013 Annex A, minimum lower yield / 0.2 % proof strength at elevated
    # temperature (from memory); the catalog interpolates a ratio table; 0.5 %
    def fn() -> Outcome:
        val, _ = yield_at_temperature(grade(cls, 10e-3), T_c + 273.15)
        return Outcome(val / MPA, value, 0.005, "ISO 898-1:2013 Annex A (from memory)", "MPa")

    add(f"R_p0.2 of class {cls} at {T_c:g} degC", "grades", fn, kind="published")


_yield_hot("8.8", 200, 545)
_yield_hot("10.9", 300, 745)


def _modulus(F: float, E_mpsi: float):
    # ASME BPVC II-D Table TM-1, carbon steels with C <= 0.30 % (from memory); 1 %
    def fn() -> Outcome:
        E = material("steel").modulus(_degf(F))
        return Outcome(
            E / PSI / 1e6, E_mpsi, 0.01, "ASME BPVC II-D Table TM-1 (from memory)", "Mpsi"
        )

    add(f"modulus of carbon steel at {F:g} degF", "grades", fn, kind="published")


_modulus(200, 28.8)
_modulus(600, 26.7)


def _te1() -> Outcome:
    # ASME BPVC II-D Table TE-1, group 1 carbon steel: mean coefficient from 70 degF at
    # 70 degF about 6.4e-6 /degF = 11.5e-6 /K (from memory); 2 %
    a = material("steel").expansion(_degf(70))
    return Outcome(
        a * 1e6, 11.5, 0.02, "ASME BPVC II-D Table TE-1, group 1 (from memory)", "1e-6/K"
    )


add("mean expansion of carbon steel at 70 degF", "grades", _te1, kind="published")
