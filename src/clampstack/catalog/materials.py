"""Materials of bolts and clamped parts, with modulus and thermal expansion over temperature.

Data: ``materials.csv`` (scalar properties at 20 degC: modulus, Poisson's ratio, expansion
coefficient, minimum 0.2 % proof and tensile strength, limiting surface pressure pG of
VDI 2230-1, shear-to-tensile strength ratio tauB/Rm used for thread stripping) and
``materials_temperature.csv`` (modulus and MEAN coefficient of thermal expansion from
20 degC to T, as handbooks tabulate it, at a few temperatures).  Every row names its
source; values recalled without the document at hand say "from memory".

Each property has its own tabulated range (a blank cell: no published value at that
temperature).  Between the tabulated temperatures the properties are interpolated linearly.
Outside the data the lookups raise :class:`~clampstack.errors.InputError` naming the
material, the property and its range; with ``extrapolate=True`` (the joint's temperature
model) a property is extrapolated linearly from its two coldest table points at most
:data:`COLD_MARGIN` below its data (moduli rise and mean expansion coefficients fall
smoothly as metals cool), and :meth:`Material.extrapolations` says where that happened so
the result can flag it.  Nothing is extrapolated above the data: strength and creep
limits, not the elastic data, end a material's use when hot.  Temperatures are absolute
[K] in the API.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass, field
from functools import cache
from typing import TYPE_CHECKING

from clampstack.catalog._common import fmt, opt_float, read_csv, squash, unknown
from clampstack.errors import InputError

if TYPE_CHECKING:
    import numpy as np
    import numpy.typing as npt

MPA = 1e6
GPA = 1e9
#: 20 degC in kelvin: the reference temperature of the mean expansion coefficients.
T_REF = 293.15
ZERO_C = 273.15
_HINT = "list them with `clampstack catalog materials`"
_TTOL = 1e-9
#: How far below its coldest tabulated temperature a property may be extrapolated [K]
#: (common practice, no source: about the span over which the tables' own end slopes hold).
COLD_MARGIN = 100.0
#: The temperature-dependent properties and how they are named in messages.
PROPERTY_NAMES = {"E": "modulus E", "alpha": "mean expansion coefficient alpha"}


@dataclass(frozen=True)
class Extrapolation:
    """A property used outside its data: linearly extrapolated or its end value held.

    Attributes
    ----------
    subject : str
        What the data belong to: ``"aluminium-cast"``, ``"grade 10.9"``.
    prop : str
        The property, as printed: ``"modulus E"``, ``"yield strength"``.
    side : str
        ``"below"`` or ``"above"`` the data.
    T_data : float
        The end of the data on that side [K].
    T_used : float
        The farthest temperature at which the property was used [K].
    how : str
        ``"linear"`` (from the two end points of the table) or ``"held"`` (end value).
    value : str
        The value used at ``T_used``, with its unit.
    reason : str
        Why holding is acceptable, where it is (``""`` otherwise).
    """

    subject: str
    prop: str
    side: str
    T_data: float
    T_used: float
    how: str
    value: str = ""
    reason: str = ""

    def text(self, part: str | None = None) -> str:
        """One readable sentence; ``part`` names the part the material belongs to."""
        who = f"{part} ({self.subject})" if part else self.subject
        t1, t2 = fmt(self.T_data - ZERO_C, 1), fmt(self.T_used - ZERO_C, 1)
        head = f"{who}: {self.prop} extrapolated {self.side} its data, from {t1} to {t2} degC"
        if self.how == "held":
            tail = f", by holding its {t1} degC value" + (f" of {self.value}" if self.value else "")
        else:
            end = "coldest" if self.side == "below" else "hottest"
            tail = f", linearly from its two {end} table points"
            tail += f" ({self.value} at {t2} degC)" if self.value else ""
        return head + tail + (f" ({self.reason})" if self.reason else "") + "."


@dataclass(frozen=True)
class Material:
    """A catalog material (SI units; temperatures in K).

    Attributes
    ----------
    key : str
        Catalog key, e.g. ``"aluminium-6082-T6"``.
    name : str
        Descriptive name with the standard designation.
    E20 : float
        Modulus of elasticity at 20 degC [Pa].
    nu : float
        Poisson's ratio.
    alpha20 : float
        Coefficient of thermal expansion at 20 degC [1/K].
    Rp02 : float or None
        Minimum 0.2 % proof strength [Pa]; ``None`` where none is defined (grey iron).
    Rm : float
        Minimum tensile strength [Pa].
    pG : float or None
        Limiting surface pressure [Pa] (VDI 2230-1); ``None`` where no value is published.
    shear_ratio : float
        Shear strength over tensile strength tauB/Rm.
    T_E : tuple of float
        Temperatures [K], ascending, at which the modulus is tabulated.
    E_T : tuple of float
        Modulus at ``T_E`` [Pa].
    T_alpha : tuple of float
        Temperatures [K], ascending, at which the mean expansion coefficient is tabulated.
    alpha_T : tuple of float
        Mean coefficient of thermal expansion from 20 degC to ``T_alpha`` [1/K].
    source : str
        Sources of the scalar properties.
    table_source : str
        Sources of the temperature table (distinct texts joined with `` | ``).
    aliases : tuple of str
        Other accepted names.
    """

    key: str
    name: str
    E20: float
    nu: float
    alpha20: float
    Rp02: float | None
    Rm: float
    pG: float | None
    shear_ratio: float
    T_E: tuple[float, ...]
    E_T: tuple[float, ...]
    T_alpha: tuple[float, ...]
    alpha_T: tuple[float, ...]
    source: str
    table_source: str = ""
    aliases: tuple[str, ...] = field(default=())

    @property
    def T(self) -> tuple[float, ...]:
        """Every tabulated temperature of either property [K], ascending."""
        return tuple(sorted(set(self.T_E) | set(self.T_alpha)))

    def _table(self, prop: str) -> tuple[tuple[float, ...], tuple[float, ...]]:
        if prop == "E":
            return self.T_E, self.E_T
        if prop == "alpha":
            return self.T_alpha, self.alpha_T
        raise ValueError(f"unknown property {prop!r}")  # pragma: no cover - programming error

    def data_range(self, prop: str) -> tuple[float, float]:
        """Tabulated range ``(Tmin, Tmax)`` [K] of one property, ``"E"`` or ``"alpha"``."""
        T, _ = self._table(prop)
        return T[0], T[-1]

    def valid_range(self) -> tuple[float, float]:
        """Return the range ``(Tmin, Tmax)`` [K] where both properties are tabulated."""
        (e_lo, e_hi), (a_lo, a_hi) = self.data_range("E"), self.data_range("alpha")
        return max(e_lo, a_lo), min(e_hi, a_hi)

    def usable_range(self, prop: str, extrapolate: bool = True) -> tuple[float, float]:
        """Range [K] in which ``prop`` is given: its data, and :data:`COLD_MARGIN` below."""
        lo, hi = self.data_range(prop)
        return (lo - COLD_MARGIN if extrapolate else lo), hi

    def range_error(
        self, prop: str, T_K: float, extrapolate: bool = False, part: str | None = None
    ) -> str:
        """The one-line message for a temperature ``T_K`` [K] outside ``prop``'s usable range.

        ``part`` (``"tapped hole"``) names the part the material belongs to.
        """
        lo, hi = self.data_range(prop)
        shown = "nan" if math.isnan(T_K) else f"{fmt(T_K - ZERO_C, 2)} degC"
        whose = f" of the {part}" if part else ""
        span = f"{fmt(lo - ZERO_C, 2)} to {fmt(hi - ZERO_C, 2)} degC"
        reach = (
            f"extrapolated at most {fmt(COLD_MARGIN, 0)} K below them and not above"
            if extrapolate
            else "no extrapolation"
        )
        return (
            f"temperature {shown} is outside the data of material {self.key!r}{whose} "
            f"({PROPERTY_NAMES[prop]} {span}; {reach})"
        )

    def check(
        self,
        prop: str,
        T_K: float | npt.ArrayLike,
        extrapolate: bool = False,
        part: str | None = None,
    ) -> None:
        """InputError (:meth:`range_error`) if a temperature lies outside ``prop``'s range."""
        import numpy as np

        arr = np.asarray(T_K, dtype=float)
        lo, hi = self.usable_range(prop, extrapolate)
        bad = ~((arr >= lo - _TTOL) & (arr <= hi + _TTOL))  # NaN counts as bad
        if np.any(bad):
            raise InputError(self.range_error(prop, float(arr[bad].flat[0]), extrapolate, part))

    def _lookup(self, prop: str, T_K: float | npt.ArrayLike, extrapolate: bool) -> np.ndarray:
        import numpy as np

        arr = np.asarray(T_K, dtype=float)
        self.check(prop, arr, extrapolate)
        T, y = self._table(prop)
        out = np.interp(arr, T, y)
        if extrapolate and len(T) > 1 and np.any(arr < T[0]):
            slope = (y[1] - y[0]) / (T[1] - T[0])
            out = np.where(arr < T[0], y[0] + (arr - T[0]) * slope, out)
        return out

    def modulus(self, T_K: float | npt.ArrayLike, extrapolate: bool = False) -> float | np.ndarray:
        """Modulus of elasticity at temperature ``T_K`` [Pa], linear interpolation.

        Parameters
        ----------
        T_K : float or array_like
            Temperature(s) [K]; arrays are handled element-wise.
        extrapolate : bool
            Extrapolate linearly at most :data:`COLD_MARGIN` below the data (see the module
            notes; :meth:`extrapolations` lists where).

        Returns
        -------
        float or numpy.ndarray
            A float for a scalar input, an array of the input's shape otherwise.

        Raises
        ------
        InputError
            A temperature outside the modulus data (or beyond the margin).
        """
        out = self._lookup("E", T_K, extrapolate)
        return float(out) if out.ndim == 0 else out

    def expansion(
        self, T_K: float | npt.ArrayLike, extrapolate: bool = False
    ) -> float | np.ndarray:
        """Mean coefficient of thermal expansion from 20 degC to ``T_K`` [1/K].

        Parameters
        ----------
        T_K : float or array_like
            Temperature(s) [K].
        extrapolate : bool
            As in :meth:`modulus`.

        Returns
        -------
        float or numpy.ndarray

        Raises
        ------
        InputError
            A temperature outside the expansion data (or beyond the margin).
        """
        out = self._lookup("alpha", T_K, extrapolate)
        return float(out) if out.ndim == 0 else out

    def thermal_strain(
        self, T_K: float | npt.ArrayLike, extrapolate: bool = False
    ) -> float | np.ndarray:
        """Free thermal strain from 20 degC: ``alpha_mean(T) * (T - 293.15 K)``.

        Parameters
        ----------
        T_K : float or array_like
            Temperature(s) [K].
        extrapolate : bool
            As in :meth:`modulus`.

        Returns
        -------
        float or numpy.ndarray
            Strain (dimensionless); positive above 20 degC.
        """
        import numpy as np

        arr = np.asarray(T_K, dtype=float)
        out = self._lookup("alpha", arr, extrapolate) * (arr - T_REF)
        return float(out) if out.ndim == 0 else out

    def extrapolations(
        self, T_K: float | npt.ArrayLike, props: Sequence[str] = ("E", "alpha")
    ) -> list[Extrapolation]:
        """Where the temperatures ``T_K`` [K] take ``props`` below their data, one entry each.

        Temperatures beyond the margin are not reported here (:meth:`check` refuses them).
        """
        import numpy as np

        arr = np.asarray(T_K, dtype=float).ravel()
        arr = arr[np.isfinite(arr)]
        out: list[Extrapolation] = []
        if arr.size == 0:
            return out
        coldest = float(arr.min())
        for prop in props:
            lo, _ = self.data_range(prop)
            if coldest < lo - _TTOL:
                v = float(self._lookup(prop, coldest, True))
                value = f"{fmt(v / GPA, 1)} GPa" if prop == "E" else f"{fmt(v * 1e6, 2)}e-6/K"
                _, y = self._table(prop)
                flat = len(y) < 2 or y[1] == y[0]  # linear from a flat end is a hold
                out.append(
                    Extrapolation(
                        self.key,
                        PROPERTY_NAMES[prop],
                        "below",
                        lo,
                        coldest,
                        "held" if flat else "linear",
                        value,
                        "the table is constant at its cold end" if flat else "",
                    )
                )
        return out


def _join_unique(texts: Sequence[str]) -> str:
    seen: list[str] = []
    for t in texts:
        if t and t not in seen:
            seen.append(t)
    return " | ".join(seen)


@cache
def _load() -> tuple[dict[str, Material], dict[str, str]]:
    tables: dict[str, list[dict[str, str]]] = {}
    for r in read_csv("materials_temperature.csv"):
        tables.setdefault(r["key"], []).append(r)
    out: dict[str, Material] = {}
    aliases: dict[str, str] = {}
    for r in read_csv("materials.csv"):
        key = r["key"]
        rows = sorted(tables.get(key, []), key=lambda x: float(x["T_degC"]))
        # a blank cell: no published value of that property at that temperature
        rows_E = [x for x in rows if x["E_GPa"]]
        rows_alpha = [x for x in rows if x["alpha_mean_1e-6_per_K"]]
        if not rows_E or not rows_alpha:  # pragma: no cover - data consistency is tested
            raise RuntimeError(f"materials_temperature.csv lacks E or alpha rows for {key!r}")
        rp = opt_float(r["Rp02_MPa"])
        pg = opt_float(r["pG_MPa"])
        names = tuple(a.strip() for a in r["aliases"].split("|") if a.strip())
        mat = Material(
            key=key,
            name=r["name"],
            E20=float(r["E_GPa"]) * GPA,
            nu=float(r["poisson"]),
            alpha20=float(r["alpha_1e-6_per_K"]) * 1e-6,
            Rp02=None if rp is None else rp * MPA,
            Rm=float(r["Rm_MPa"]) * MPA,
            pG=None if pg is None else pg * MPA,
            shear_ratio=float(r["shear_ratio"]),
            T_E=tuple(float(x["T_degC"]) + ZERO_C for x in rows_E),
            E_T=tuple(float(x["E_GPa"]) * GPA for x in rows_E),
            T_alpha=tuple(float(x["T_degC"]) + ZERO_C for x in rows_alpha),
            alpha_T=tuple(float(x["alpha_mean_1e-6_per_K"]) * 1e-6 for x in rows_alpha),
            source=r["source"],
            table_source=_join_unique([x["source"] for x in rows]),
            aliases=names,
        )
        out[key] = mat
        for alias in (key, *names):
            norm = squash(alias)
            if aliases.setdefault(norm, key) != key:  # pragma: no cover - data bug
                raise RuntimeError(f"material alias {alias!r} is ambiguous in materials.csv")
    return out, aliases


def materials() -> list[Material]:
    """Return every catalog material, in file order.

    Returns
    -------
    list of Material
    """
    return list(_load()[0].values())


def material(key: str) -> Material:
    """Look up a material by key or alias (case, spaces, dashes and dots do not matter).

    Parameters
    ----------
    key : str
        E.g. ``"steel"``, ``"aluminium-6082-T6"``, ``"aluminum-6061-T6"``, ``"304"``,
        ``"42CrMo4"``, ``"Ti-6Al-4V"``, ``"GJL-250"``, ``"AZ91"``.

    Returns
    -------
    Material

    Raises
    ------
    InputError
        Unknown material; the message lists up to five near matches.
    """
    mats, aliases = _load()
    found = aliases.get(squash(str(key)))
    if found is None:
        canonical = {a: m.key for m in mats.values() for a in m.aliases}
        candidates = list(mats) + list(canonical)
        raise unknown("material", str(key), candidates, _HINT, canonical=canonical)
    return mats[found]
