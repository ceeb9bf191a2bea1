"""Materials of bolts and clamped parts, with modulus and thermal expansion over temperature.

Data: ``materials.csv`` (scalar properties at 20 degC: modulus, Poisson's ratio, expansion
coefficient, minimum 0.2 % proof and tensile strength, limiting surface pressure pG of
VDI 2230-1, shear-to-tensile strength ratio tauB/Rm used for thread stripping) and
``materials_temperature.csv`` (modulus and MEAN coefficient of thermal expansion from
20 degC to T, as handbooks tabulate it, at a few temperatures).  Every row names its
source; values recalled without the document at hand say "from memory".

Between the tabulated temperatures the properties are interpolated linearly; outside the
table nothing is extrapolated: the lookup raises :class:`~clampstack.errors.InputError`
naming the material and its valid range.  Temperatures are absolute [K] in the API.
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
    T : tuple of float
        Tabulated temperatures [K], ascending.
    E_T : tuple of float
        Modulus at ``T`` [Pa].
    alpha_T : tuple of float
        Mean coefficient of thermal expansion from 20 degC to ``T`` [1/K].
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
    T: tuple[float, ...]
    E_T: tuple[float, ...]
    alpha_T: tuple[float, ...]
    source: str
    table_source: str = ""
    aliases: tuple[str, ...] = field(default=())

    def valid_range(self) -> tuple[float, float]:
        """Return the tabulated temperature range ``(Tmin, Tmax)`` [K]."""
        return self.T[0], self.T[-1]

    def _check(self, T_K: float | npt.ArrayLike) -> tuple[np.ndarray, bool]:
        import numpy as np

        arr = np.asarray(T_K, dtype=float)
        lo, hi = self.valid_range()
        bad = ~((arr >= lo - _TTOL) & (arr <= hi + _TTOL))  # NaN counts as bad
        if np.any(bad):
            worst = arr[bad].flat[0]
            shown = "nan" if math.isnan(worst) else f"{fmt(worst - ZERO_C, 2)} degC"
            raise InputError(
                f"material {self.key!r}: temperature {shown} is outside its tabulated range "
                f"{fmt(lo - ZERO_C, 2)} to {fmt(hi - ZERO_C, 2)} degC (no extrapolation)"
            )
        return arr, arr.ndim == 0

    def modulus(self, T_K: float | npt.ArrayLike) -> float | np.ndarray:
        """Modulus of elasticity at temperature ``T_K`` [Pa], linear interpolation.

        Parameters
        ----------
        T_K : float or array_like
            Temperature(s) [K]; arrays are handled element-wise.

        Returns
        -------
        float or numpy.ndarray
            A float for a scalar input, an array of the input's shape otherwise.

        Raises
        ------
        InputError
            A temperature outside :meth:`valid_range`.
        """
        import numpy as np

        arr, scalar = self._check(T_K)
        out = np.interp(arr, self.T, self.E_T)
        return float(out) if scalar else out

    def expansion(self, T_K: float | npt.ArrayLike) -> float | np.ndarray:
        """Mean coefficient of thermal expansion from 20 degC to ``T_K`` [1/K].

        Parameters
        ----------
        T_K : float or array_like
            Temperature(s) [K].

        Returns
        -------
        float or numpy.ndarray

        Raises
        ------
        InputError
            A temperature outside :meth:`valid_range`.
        """
        import numpy as np

        arr, scalar = self._check(T_K)
        out = np.interp(arr, self.T, self.alpha_T)
        return float(out) if scalar else out

    def thermal_strain(self, T_K: float | npt.ArrayLike) -> float | np.ndarray:
        """Free thermal strain from 20 degC: ``alpha_mean(T) * (T - 293.15 K)``.

        Parameters
        ----------
        T_K : float or array_like
            Temperature(s) [K].

        Returns
        -------
        float or numpy.ndarray
            Strain (dimensionless); positive above 20 degC.
        """
        import numpy as np

        arr, scalar = self._check(T_K)
        out = np.interp(arr, self.T, self.alpha_T) * (arr - T_REF)
        return float(out) if scalar else out


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
        if not rows:  # pragma: no cover - data consistency is tested
            raise RuntimeError(f"materials_temperature.csv has no rows for {key!r}")
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
            T=tuple(float(x["T_degC"]) + ZERO_C for x in rows),
            E_T=tuple(float(x["E_GPa"]) * GPA for x in rows),
            alpha_T=tuple(float(x["alpha_mean_1e-6_per_K"]) * 1e-6 for x in rows),
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
