"""Units: one shared pint registry and the parsers used at the input boundary.

Quantities arrive as strings with units (``"12 mm"``, ``"0.5 in"``,
``"85 N*m"``, ``"65 ft*lbf"``, ``"20 degC"``, ``"11.5e-6 / K"``) and ranges as
``"0.10..0.16"`` or ``"0..10 kN"``.  Everything inside the package below this
layer works in plain SI floats (m, m^2, N, N*m, Pa, K, 1/K, N/m); the parsers
here return those floats.

Temperatures: an absolute temperature (``degC``, ``degF``, ``K``) converts to
kelvin; a temperature *difference* must be written in ``K`` or ``delta_degC`` /
``delta_degF`` - ``"60 degC"`` where a difference is expected is refused rather
than guessed.

The pint registry is built lazily on first use (importing pint costs about
0.2 s, which ``clampstack --help`` must not pay) and uses pint's on-disk
definition cache (:func:`cache_folder`); a damaged cache is rebuilt, not bypassed.
"""

from __future__ import annotations

import math
import os
import re
from dataclasses import dataclass
from functools import lru_cache
from pathlib import Path
from typing import Any

from .errors import InputError

# kind -> (pint dimensionality string, SI unit to convert to, human name)
KINDS: dict[str, tuple[str, str, str]] = {
    "length": ("[length]", "m", "a length"),
    "area": ("[length] ** 2", "m**2", "an area"),
    "force": ("[force]", "N", "a force"),
    "torque": ("[force] * [length]", "N*m", "a torque"),
    "stress": ("[pressure]", "Pa", "a stress or pressure"),
    "stiffness": ("[force] / [length]", "N/m", "a stiffness (force per length)"),
    "expansion": ("1 / [temperature]", "1/K", "a thermal expansion coefficient (per K)"),
    "temperature": ("[temperature]", "K", "a temperature"),
    "temperature_difference": ("[temperature]", "K", "a temperature difference"),
    "angle": ("", "rad", "an angle"),
    "dimensionless": ("", "", "a plain number"),
    "moment": ("[force] * [length]", "N*m", "a moment"),
    "second_moment": ("[length] ** 4", "m**4", "a second moment of area"),
}

_NUMBER = re.compile(r"^\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(.*?)\s*$")
_OFFSET_UNITS = {"degree_Celsius", "degree_Fahrenheit", "degree_Rankine", "degree_Reaumur"}
_ANGLE_UNITS = {"radian", "degree", "arcminute", "arcsecond", "turn", "gradian", "revolution"}
#: Tokens of a unit expression: names, operators, parentheses, small integer exponents.
_UNIT_TOKEN = re.compile(
    r"\s*(\*\*|\^|[*/()]|[A-Za-z_%\u00b0\u00b5\u03bc\u03a9][A-Za-z0-9_]*|[+-]?\d+|\S)"
)
MAX_UNIT_POWER = 4  # largest exponent of a unit written in a file (m^3, mm^4)


def check_unit_text(unit_text: str, shown: str) -> None:
    """Refuse anything in a unit but names, ``*``, ``/``, parentheses and small exponents.

    The unit goes to pint only after this: pint would evaluate arbitrary arithmetic
    (``"m*9**9**9"`` is a tower of powers that runs for minutes).  An exponent is an
    integer of at most :data:`MAX_UNIT_POWER` in size after a name or ``)``, not followed
    by another exponent; a bare number is allowed only as the ``1`` of ``1/K``.
    """
    toks = _UNIT_TOKEN.findall(unit_text)
    prev = ""
    for i, t in enumerate(toks):
        if t in ("**", "^"):
            nxt = toks[i + 1] if i + 1 < len(toks) else ""
            ok_base = bool(prev) and (prev == ")" or prev[0].isalpha() or prev[0] in "%_")
            if not ok_base or not re.fullmatch(r"[+-]?\d+", nxt):
                raise InputError(f"expected a unit with integer powers, got {shown}")
            if abs(int(nxt)) > MAX_UNIT_POWER or (i + 2 < len(toks) and toks[i + 2] in ("**", "^")):
                raise InputError(
                    f"unit powers beyond {MAX_UNIT_POWER} are not accepted, got {shown}"
                )
        elif re.fullmatch(r"[+-]?\d+", t):
            if prev not in ("**", "^") and not (
                t == "1" and i + 1 < len(toks) and toks[i + 1] == "/"
            ):
                raise InputError(f"expected a unit after the number, got {shown}")
        elif t in ("\u00b1", "+/-") or t == "+" or t == "-":
            raise InputError(
                f"a tolerance is not read in {shown}: give a single value, or a range "
                '"low..high" where the key takes one'
            )
        elif not (
            t in ("*", "/", "(", ")") or t[0].isalpha() or t[0] in "%_\u00b0\u00b5\u03bc\u03a9"
        ):
            raise InputError(f"unexpected {t!r} in the unit of {shown}")
        prev = t


@lru_cache(maxsize=1)
def registry():
    """The one pint ``UnitRegistry`` of the package (built on first call)."""
    ureg = build_registry(cache_folder())
    if hasattr(ureg, "formatter"):  # pint >= 0.24
        ureg.formatter.default_format = "~P"
    else:  # pint 0.23, the dependency floor
        ureg.default_format = "~P"
    return ureg


def cache_folder() -> Path:
    """Where the unit definitions are cached: ``$CLAMPSTACK_CACHE`` if set, else the
    user's cache directory (``$XDG_CACHE_HOME`` or ``~/.cache``; ``%LOCALAPPDATA%`` on
    Windows), one folder per pint version so an upgrade never meets an old cache."""
    import pint

    base = os.environ.get("CLAMPSTACK_CACHE")
    if not base:
        root = os.environ.get("XDG_CACHE_HOME") or os.environ.get("LOCALAPPDATA")
        base = (
            str(Path(root) / "clampstack") if root else str(Path.home() / ".cache" / "clampstack")
        )
    return Path(base) / f"pint-{pint.__version__}"


def build_registry(folder: Path):
    """A pint registry loaded from the definition cache in ``folder``.

    A cache that cannot be read (damaged, or written by another build of pint) is
    deleted and built again, so the next start is fast again.  Only when the folder
    cannot be written at all does the registry load without a cache, and a one-line
    note on stderr says so (start-up is then about 0.1 s slower)."""
    import shutil
    import sys

    import pint

    for attempt in (1, 2):
        try:
            folder.mkdir(parents=True, exist_ok=True)
            return pint.UnitRegistry(cache_folder=folder)
        except Exception as err:  # a damaged cache raises anything from pickle or json
            if attempt == 1 and folder.is_dir():
                shutil.rmtree(folder, ignore_errors=True)
                continue
            print(
                f"clampstack: note: the unit cache in {folder} cannot be used ({err}); "
                "units load without it",
                file=sys.stderr,
            )
    return pint.UnitRegistry()


MAX_QUANTITY_TEXT = 80  # characters of a quantity string ("12 mm", "0.10..0.16 N*m/rad")
#: Magnitudes accepted at the input boundary (SI units): no bolted joint needs more,
#: and anything beyond would overflow or lose all precision in the arithmetic that
#: follows.  A value smaller than SI_NEGLIGIBLE in size counts as zero (subnormal
#: numbers would otherwise turn into infinities when divided).
SI_LARGEST = 1e15
SI_NEGLIGIBLE = 1e-30


def check_magnitude(value: float, shown: str) -> float:
    """Return ``value`` (zero if smaller than :data:`SI_NEGLIGIBLE` in size); an
    InputError quoting ``shown`` if it is not finite or larger than :data:`SI_LARGEST`."""
    if not math.isfinite(value):
        raise InputError(f"expected a finite number, got {shown}")
    if abs(value) > SI_LARGEST:
        raise InputError(
            f"{shown} is larger than this tool accepts (at most {SI_LARGEST:g} in SI units)"
        )
    return 0.0 if abs(value) < SI_NEGLIGIBLE else value


def _show(raw: Any) -> str:
    text = f'"{raw}"' if isinstance(raw, str) else repr(raw)
    return text if len(text) <= 60 else f"{text[:55]}...{text[-3:]}"


@dataclass(frozen=True)
class Parsed:
    """A parsed quantity: SI value plus the text as entered (for echoing back)."""

    value: float
    text: str


@lru_cache(maxsize=4096)
def _parse_cached(text: str, kind: str) -> float:
    """Parse one quantity string to an SI float; raises InputError without a key."""
    dim, si_unit, human = KINDS[kind]
    m = _NUMBER.match(text)
    if not m and re.match(r"^\s*[+-]?(nan|inf|infinity)\b", text, re.IGNORECASE):
        raise InputError(f"expected a finite number, got {_show(text)}")
    if not m:
        raise InputError(f"expected {human}, got {_show(text)} (write a number and a unit)")
    number = float(m.group(1))
    unit_text = m.group(2)
    if not math.isfinite(number):
        raise InputError(f"expected a finite number, got {_show(text)}")
    if kind in ("dimensionless",) and unit_text in ("", "%"):
        return check_magnitude(number / 100.0 if unit_text == "%" else number, _show(text))
    if not unit_text:
        if kind == "angle":
            raise InputError(f"expected {human} with a unit (deg or rad), got {_show(text)}")
        raise InputError(f"expected {human} with a unit, got {_show(text)}")
    check_unit_text(unit_text, _show(text))
    ureg = registry()
    try:
        ut = unit_text.replace("^", "**")
        unit = ureg.parse_units("1 " + ut if ut.startswith("/") else ut)
    except Exception:
        raise InputError(f"unknown unit {_show(unit_text)} in {_show(text)}") from None
    try:
        units_names = {str(u) for u in unit._units.keys()}
    except Exception:  # pragma: no cover
        units_names = set()
    is_offset = bool(units_names & _OFFSET_UNITS)
    # pint turns degC in a product into delta_degC: look at what was written
    offset_written = is_offset or re.search(
        r"(?<!delta_)(degC|degF|degree_Celsius|degree_Fahrenheit|\u00b0C|\u00b0F)", unit_text
    )
    if offset_written and (len(units_names) > 1 or any(abs(e) != 1 for e in unit._units.values())):
        raise InputError(
            f"an absolute temperature unit (degC, degF) cannot be part of a product or power: "
            f"{_show(text)}"
        )
    if kind in ("dimensionless",) and units_names & _ANGLE_UNITS:
        raise InputError(f"expected a plain number, got the angle {_show(text)}")
    if kind == "temperature_difference" and is_offset:
        raise InputError(
            f"expected a temperature difference, got {_show(text)} (an absolute temperature); "
            'write it in K or delta_degC, e.g. "60 K"'
        )
    try:
        q = ureg.Quantity(number, unit)
        if kind == "expansion" and q.dimensionality == ureg.parse_units("1/K").dimensionality:
            value = float(q.to("1/K").magnitude)
        elif q.dimensionality != ureg.get_dimensionality(dim) if dim else not q.dimensionless:
            raise InputError(f"expected {human}, got {_show(text)}")
        elif kind == "dimensionless":
            value = float(q.to("").magnitude)
        else:
            value = float(q.to(si_unit).magnitude)
    except InputError:
        raise
    except Exception:  # pint refuses some combinations (offset units in products, ...)
        raise InputError(f"cannot convert {_show(text)} to {human}") from None
    if kind == "temperature" and value < 0:
        raise InputError(f"{_show(text)} is below absolute zero")
    return check_magnitude(value, _show(text))


def parse_quantity(raw: Any, kind: str, key: str | None = None) -> float:
    """Parse ``raw`` (a string with a unit) as ``kind`` and return its SI value.

    Parameters
    ----------
    raw : str or float
        ``"12 mm"``, ``"65 ft*lbf"``, ``"20 degC"``; a bare number only for
        ``kind="dimensionless"``.
    kind : str
        One of :data:`KINDS` (``"length"``, ``"force"``, ``"temperature"``, ...).
    key : str, optional
        Key path used in the error message (``part[2].length``).

    Returns
    -------
    float
        The value in SI units (m, m^2, N, N*m, Pa, K, 1/K, N/m, rad).

    Raises
    ------
    InputError
        Wrong dimension, missing unit, not a number, NaN or infinity.
    """
    if kind not in KINDS:  # programming error, not input
        raise KeyError(kind)
    try:
        if isinstance(raw, bool):
            raise InputError(f"expected {KINDS[kind][2]}, got {raw!r}")
        if isinstance(raw, int | float):
            if isinstance(raw, int) and abs(raw) > 1e300:
                raise InputError(f"number is too large: {_show(raw)}")
            if not math.isfinite(raw):
                raise InputError(f"expected a finite number, got {raw!r}")
            if kind == "dimensionless":
                return check_magnitude(float(raw), _show(raw))
            raise InputError(
                f"expected {KINDS[kind][2]} with a unit, got {raw!r} (write it as a string, "
                f'e.g. "{raw} {_example_unit(kind)}")'
            )
        if not isinstance(raw, str):
            raise InputError(f"expected {KINDS[kind][2]}, got {_show(raw)}")
        if len(raw) > MAX_QUANTITY_TEXT:
            raise InputError(
                f"expected {KINDS[kind][2]}, got a text of {len(raw)} characters "
                f"(at most {MAX_QUANTITY_TEXT})"
            )
        if ".." in raw:
            raise InputError(f"expected a single value, got the range {_show(raw)}")
        return _parse_cached(raw.strip(), kind)
    except InputError as err:
        raise InputError(err.detail, key=key) from None


def _example_unit(kind: str) -> str:
    return {
        "length": "mm",
        "area": "mm^2",
        "force": "kN",
        "torque": "N*m",
        "stress": "MPa",
        "stiffness": "kN/mm",
        "expansion": "1/K",
        "temperature": "degC",
        "temperature_difference": "K",
        "angle": "deg",
        "moment": "N*m",
        "second_moment": "mm^4",
    }.get(kind, "")


def parse_range(raw: Any, kind: str, key: str | None = None) -> tuple[float, float]:
    """Parse a value or a range ``"lo..hi [unit]"`` to ``(lo, hi)`` in SI units.

    A single value gives ``(v, v)``.  In ``"0..10 kN"`` the unit written after
    the upper end applies to a bare lower end; ``"-40 degC..150 degC"`` works too.
    ``lo > hi`` is an error.
    """
    if isinstance(raw, str) and len(raw) > 2 * MAX_QUANTITY_TEXT:
        raise InputError(
            f"expected a value or range, got a text of {len(raw)} characters "
            f"(at most {2 * MAX_QUANTITY_TEXT})",
            key=key,
        )
    if isinstance(raw, str) and ".." in raw:
        left, sep, right = raw.partition("..")
        if ".." in right or not left.strip() or not right.strip():
            raise InputError(f'expected a range "low..high", got {_show(raw)}', key=key)
        left, right = left.strip(), right.strip()
        ml, mr = _NUMBER.match(left), _NUMBER.match(right)
        if ml and mr and not ml.group(2) and mr.group(2):
            left = f"{left} {mr.group(2)}"
        lo = parse_quantity(left, kind, key)
        hi = parse_quantity(right, kind, key)
        if lo > hi:
            raise InputError(f"range {_show(raw)} has its low end above its high end", key=key)
        return lo, hi
    v = parse_quantity(raw, kind, key)
    return v, v


def to_unit(value_si: float, unit: str) -> float:
    """Convert an SI float (m, N, Pa, ...) to ``unit`` (``"mm"``, ``"kN"``, ``"MPa"``)."""
    fast = _FAST_FACTORS.get(unit)
    if fast is not None:
        return value_si / fast
    ureg = registry()
    q = ureg.Quantity(1.0, unit)
    return value_si / float(q.to_base_units().magnitude)


# Factors from common display units to SI, so that output formatting never needs pint.
_FAST_FACTORS: dict[str, float] = {
    "m": 1.0,
    "mm": 1e-3,
    "um": 1e-6,
    "mm2": 1e-6,
    "mm^2": 1e-6,
    "N": 1.0,
    "kN": 1e3,
    "MPa": 1e6,
    "N/mm": 1e3,
    "kN/mm": 1e6,
    "N*m": 1.0,
    "Nm": 1.0,
    "1/K": 1.0,
    "in": 0.0254,
    "in2": 0.0254**2,
    "lbf": 4.4482216152605,
    "kip": 4448.2216152605,
    "ksi": 6894757.293168361,
    "psi": 6894.757293168361,
    "ft*lbf": 1.3558179483314004,
    "lbf/in": 4.4482216152605 / 0.0254,
}

KELVIN_OFFSET = 273.15


def kelvin_to_degc(t: float) -> float:
    """Absolute temperature in K to degC."""
    return t - KELVIN_OFFSET


def degc_to_kelvin(t: float) -> float:
    """Absolute temperature in degC to K."""
    return t + KELVIN_OFFSET
