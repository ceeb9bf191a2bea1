"""Readable terminal output: aligned tables, display units and the safety caution."""

from __future__ import annotations

import re
from collections.abc import Sequence
from dataclasses import dataclass, replace

CAUTION = (
    "Caution: these results support, and do not replace, the judgement of a qualified "
    "engineer. Check the inputs and assumptions; applicable codes, standards and local "
    "regulations govern (pressure equipment, structures, lifting, vehicles)."
)


@dataclass(frozen=True)
class DisplayUnits:
    """Units used for readable output: name and factor from SI per quantity."""

    name: str
    force: tuple[str, float]
    length: tuple[str, float]
    small_length: tuple[str, float]
    stress: tuple[str, float]
    torque: tuple[str, float]
    stiffness: tuple[str, float]
    area: tuple[str, float]

    def fmt(self, kind: str, value: float | None, digits: int = 4) -> str:
        """Format an SI value in this system's unit for ``kind`` (no unit label)."""
        if value is None:
            return "-"
        _, factor = getattr(self, kind)
        return fmt_number(value / factor, digits, us=self.name == "us")

    def label(self, kind: str) -> str:
        """Unit label for ``kind``."""
        return getattr(self, kind)[0]

    @property
    def us(self) -> bool:
        return self.name == "us"

    def for_torque(self, nominal: float | None) -> DisplayUnits:
        """US customary: torques below 20 ft*lbf in in*lbf, as US torque specifications of
        small fasteners are written (common practice, no source); otherwise ``self``."""
        if self.us and nominal is not None and 0 < nominal < 20 * 1.3558179483314004:
            return replace(self, torque=("in*lbf", 0.1129848290276167))
        return self

    def temp(self, T: float) -> float:
        """A temperature [K] in this system's scale: degC, or degF for US customary."""
        c = T - 273.15
        return c * 1.8 + 32.0 if self.us else c

    @property
    def temp_label(self) -> str:
        """``degC`` or ``degF`` (plain text)."""
        return "degF" if self.us else "degC"

    @property
    def temp_symbol(self) -> str:
        """``°C`` or ``°F`` (figures and HTML)."""
        return "°F" if self.us else "°C"


SI = DisplayUnits(
    "si",
    force=("kN", 1e3),
    length=("mm", 1e-3),
    small_length=("um", 1e-6),
    stress=("MPa", 1e6),
    torque=("N*m", 1.0),
    stiffness=("kN/mm", 1e6),
    area=("mm^2", 1e-6),
)
US = DisplayUnits(
    "us",
    force=("lbf", 4.4482216152605),
    length=("in", 0.0254),
    small_length=("mil", 0.0254e-3),
    stress=("ksi", 6894757.293168361),
    torque=("ft*lbf", 1.3558179483314004),
    stiffness=("lbf/in", 4.4482216152605 / 0.0254),
    area=("in^2", 0.0254**2),
)
UNIT_SYSTEMS = {"si": SI, "us": US}


def fmt_number(x: float, digits: int = 4, us: bool = False) -> str:
    """Compact number: ``digits`` significant figures, no exponent for ordinary magnitudes.

    Thousands are grouped with a space from 10 000 (SI style, ISO 80000-1); ``us``: with a
    comma from 1,000, as US readers expect."""
    if x != x:  # NaN
        return "nan"
    if x == 0:
        return "0"
    ax = abs(x)
    if ax >= 1e7 or ax < 1e-4:
        return f"{x:.{digits - 1}e}"
    import math

    decimals = max(0, digits - 1 - int(math.floor(math.log10(ax))))
    if us:
        return f"{x:,.{decimals}f}"
    return f"{x:,.{decimals}f}".replace(",", " ") if ax >= 1e4 else f"{x:.{decimals}f}"


def table(
    headers: Sequence[str], rows: Sequence[Sequence[str]], right: Sequence[bool] | None = None
) -> str:
    """An aligned plain-text table with a rule under the header."""
    cols = len(headers)
    right = list(right) if right is not None else [False] * cols
    width = [len(h) for h in headers]
    for r in rows:
        for c in range(cols):
            width[c] = max(width[c], len(str(r[c])))

    def line(cells: Sequence[str]) -> str:
        out = []
        for c in range(cols):
            s = str(cells[c])
            out.append(s.rjust(width[c]) if right[c] else s.ljust(width[c]))
        return "  ".join(out).rstrip()

    rule = "  ".join("-" * w for w in width)
    return "\n".join([line(headers), rule, *(line(r) for r in rows)])


#: Characters that act on a terminal: C0 controls but the line feed, DEL, C1 controls, and
#: the Unicode bidirectional overrides and isolates (they reorder what is shown).
_TERMINAL_UNSAFE = re.compile("[\x00-\x09\x0b-\x1f\x7f-\x9f\u200e\u200f\u202a-\u202e\u2066-\u2069]")


def terminal_safe(text: str) -> str:
    """``text`` with every control character shown escaped (``\\x1b``, ``\\u202e``).

    Line feeds are kept: they are the output's own line structure (a line feed inside a
    title or name is escaped where the file is read, see :func:`single_line`).
    """

    def esc(m: re.Match[str]) -> str:
        c = ord(m.group(0))
        return f"\\x{c:02x}" if c < 0x100 else f"\\u{c:04x}"

    return _TERMINAL_UNSAFE.sub(esc, text)


def notes_block(
    notes: Sequence[str], title: str = "Notes", u: DisplayUnits | None = None
) -> list[str]:
    """A blank line, ``title`` and one ``  - `` line per note; nothing without notes.
    With US display units ``u`` the quantities in the notes are shown in them
    (:func:`localize`)."""
    if not notes:
        return []
    show = (lambda n: n) if u is None else (lambda n: localize(n, u))
    return ["", title, *(f"  - {show(n)}" for n in notes)]


#: A quantity in a text the tool wrote: a number (or a range a..b) and an SI unit.
_QUANTITY = re.compile(
    r"(?<![\w.])(-?\d+(?:\.\d+)?(?:e[+-]?\d+)?)(?:\.\.(-?\d+(?:\.\d+)?(?:e[+-]?\d+)?))?"
    r" (mm|kN|N\*m|MPa|degC)(?=[\s,;:.)]|$)"
)


def localize(text: str, u: DisplayUnits) -> str:
    """``text`` (a note or a default the tool wrote in SI) with every quantity in mm, kN,
    N*m, MPa or degC shown in the display units ``u``; SI text is returned as is."""
    if not u.us:
        return text

    def one(x: float, unit: str) -> str:
        if unit == "degC":
            return f"{u.temp(x + 273.15):.4g}"
        kind = _KIND[unit]
        return u.fmt(kind, x * _SI_FACTOR[unit])

    def repl(m: re.Match[str]) -> str:
        a, b, unit = m.group(1), m.group(2), m.group(3)
        label = "degF" if unit == "degC" else u.label(_KIND[unit])
        shown = one(float(a), unit) + ("" if b is None else ".." + one(float(b), unit))
        return f"{shown} {label}"

    return _QUANTITY.sub(repl, text)


#: A default that starts with a small length in um ("6.3 um", a roughness or an amount).
_LEADING_UM = re.compile(r"^(-?\d+(?:\.\d+)?(?:e[+-]?\d+)?) um(?=[\s,)]|$)")
_SI_FACTOR = {"mm": 1e-3, "kN": 1e3, "N*m": 1.0, "MPa": 1e6}
_KIND = {"mm": "length", "kN": "force", "N*m": "torque", "MPa": "stress"}


def default_text(value: str, u: DisplayUnits, key: str = "") -> str:
    """A default's text in the display units (US customary: in, lbf, ft*lbf, ksi, degF
    through :func:`localize`; a leading um in mil, a roughness in microinch); SI text is
    returned as is."""
    if not u.us:
        return value
    m = _LEADING_UM.match(value)
    if m is not None:
        x = float(m.group(1))
        shown = (
            f"{fmt_number(x / 0.0254, us=True)} microinch"
            if key.endswith("roughness")
            else f"{u.fmt('small_length', x * 1e-6)} {u.label('small_length')}"
        )
        value = shown + value[m.end() :]
    return localize(value, u)


def defaults_block(defaults: Sequence[tuple[str, str]], u: DisplayUnits | None = None) -> list[str]:
    """A blank line, "Defaults applied" and one ``  key = value`` line per default (values
    in the display units ``u``, SI when None)."""
    if not defaults:
        return []
    show = (lambda k, v: v) if u is None else (lambda k, v: default_text(v, u, k))
    return ["", "Defaults applied", *(f"  {k} = {show(k, v)}" for k, v in defaults)]
