"""Resilience and free thermal elongation of a joint as functions of temperature.

Every resilience of the joint is a sum of terms ``c_i / E_i(T_i)``: the bolt
segments of VDI 2230-1 (5.1.1), the plate slices of the cone model or the
Shigley frusta (5.1.2; the geometry, and so the cone angle, does not change
with temperature, only the modulus), sleeves ``l/(E A)``.  The coefficients
``c_i = delta_i E_i`` are computed once; a temperature scan then costs one
table interpolation per part and a sum, vectorised over the temperature
points (VDI 2230-1, 5.4.2.3: ``delta_T = delta E_RT / E_T``).

Per-part temperatures: when the service temperature is scanned, every part's
rise above the assembly temperature scales with the joint's (:meth:`part_T`).

Below a material's data the moduli and mean expansion coefficients are extrapolated
linearly at most :data:`~clampstack.catalog.COLD_MARGIN` (100 K) below them
(:meth:`~clampstack.catalog.Material.modulus` with ``extrapolate=True``); the model lists
where with :meth:`TemperatureModel.extrapolations`, so the results can flag it, and
:meth:`TemperatureModel.check_range` refuses what lies further out.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from ..catalog import Extrapolation
from ..components import bolt_resilience, plate_resiliences, wileman_1991
from ..errors import InputError
from .model import JointSpec, PartMaterial


@dataclass(frozen=True)
class _Term:
    coef: float  # resilience times modulus [1/m]
    material: PartMaterial
    T_part: float  # the part's own service temperature from the file [K]
    name: str


@dataclass(frozen=True)
class _Part:
    label: str  # "bolt", "tapped hole", "plate 'cover'" ...
    material: PartMaterial
    T_part: float  # the part's own service temperature from the file [K]
    props: tuple[str, ...]  # catalog properties the model takes from it: "E", "alpha"


class TemperatureModel:
    """Bolt and clamped-part resilience and thermal elongation at any service temperature."""

    def __init__(self, spec: JointSpec, clamp_terms: tuple[_Term, ...] | None = None):
        self.spec = spec
        # memo of resiliences and free elongations by temperature vector (the service
        # temperature, a sweep grid); the cached arrays are never changed by callers
        self._memo: dict[tuple, tuple[np.ndarray, np.ndarray]] = {}
        b = spec.bolt
        thr = b.thread
        T_srv = spec.service.temperature
        T_ref = spec.service.assembly_temperature
        self.T_assembly = T_ref
        self.T_service = T_srv
        lK = spec.clamp_length
        shank = [(b.shank_length, b.shank_diameter or thr.d)] if b.shank_length > 0 else []
        nut_mat = spec.nut.material if spec.nut else None
        nut_T = spec.nut.temperature if spec.nut else b.temperature
        tap = spec.tapped_hole
        # the parts whose catalog data the model uses: modulus of all, expansion of the bolt
        # (over l_K) and of the clamped layers (a nut or tapped part adds no free elongation)
        parts = [_Part("bolt", b.material, b.temperature, ("E", "alpha"))]
        if spec.nut is not None:
            parts.append(_Part("nut", nut_mat or b.material, nut_T, ("E",)))
        if tap is not None:
            parts.append(_Part("tapped hole", tap.material, tap.temperature, ("E",)))
        for lay in spec.layers:
            parts.append(
                _Part(f"{lay.kind} {lay.name!r}", lay.material, lay.temperature, ("E", "alpha"))
            )
        self.parts = tuple(
            _Part(p.label, p.material, p.T_part, p.material.from_catalog(p.props)) for p in parts
        )
        # the bolt's segments with a reference modulus of 1 Pa: resilience x E = coefficient
        try:
            bolt = bolt_resilience(
                thr.d,
                thr.P,
                thr.d3,
                1.0,
                lK,
                shank,
                None if b.head == "stud" else b.head,
                "tapped" if tap else "nut",
                E_nut=1.0,
                E_tapped=1.0,
            )
        except ValueError as err:
            raise InputError(str(err), key="bolt") from None
        bolt_terms = []
        for seg in bolt.segments:
            if seg.name in ("nut", "top nut"):
                mat, T = nut_mat or b.material, nut_T
            elif seg.name == "tapped hole":
                assert tap is not None
                mat, T = tap.material, tap.temperature
            else:
                mat, T = b.material, b.temperature
            bolt_terms.append(_Term(seg.resilience, mat, T, seg.name))
        self.bolt_terms = tuple(bolt_terms)
        self.bolt_segments = tuple((s.name, s.length) for s in bolt.segments)

        if clamp_terms is not None:  # the same plates, computed before
            self.clamp_terms = tuple(clamp_terms)
            self._bending_terms()
            return
        plates = [lay for lay in spec.layers if lay.kind != "sleeve"]
        clamp_terms = []  # type: ignore[assignment]
        if plates:
            dh = max(
                (lay.hole for lay in spec.layers if lay.kind != "washer"),
                default=spec.layers[0].hole,
            )
            # D'_A of the clamped plates (a washer's own diameter does not limit the cone)
            ods = [
                lay.outer_diameter for lay in plates if lay.outer_diameter and lay.kind == "plate"
            ]
            DA = min(ods) if ods else None
            model = spec.clamp_model
            try:
                if model == "wileman":
                    mats = {lay.material.name for lay in plates}
                    if len(mats) != 1 or tap is not None:
                        raise ValueError(
                            "the Wileman (1991) fit covers through-bolted members of one material; "
                            "use clamp_model vdi2230 or shigley"
                        )
                    plt = sum(lay.thickness for lay in plates)
                    k1 = float(wileman_1991(thr.d, plt, 1.0, plates[0].family))
                    clamp_terms.append(
                        _Term(
                            1.0 / k1,
                            plates[0].material,
                            plates[0].temperature,
                            "clamped (Wileman)",
                        )
                    )
                else:
                    unit = [(lay.thickness, 1.0, lay.family) for lay in plates]
                    res = plate_resiliences(
                        unit, b.bearing_diameter, dh, DA, model, tap is not None, thr.d, 1.0
                    )
                    for lay, r in zip(plates, res, strict=False):
                        clamp_terms.append(_Term(float(r), lay.material, lay.temperature, lay.name))
                    if len(res) > len(plates):  # Shigley: the tapped part's slab
                        assert tap is not None
                        clamp_terms.append(
                            _Term(float(res[-1]), tap.material, tap.temperature, "tapped part")
                        )
            except ValueError as err:
                raise InputError(
                    str(err), key="clamp_model" if "Wileman" in str(err) else "clamped"
                ) from None
        for lay in spec.layers:
            if lay.kind == "sleeve":
                assert lay.outer_diameter is not None
                area = math.pi / 4 * (lay.outer_diameter**2 - lay.hole**2)
                clamp_terms.append(
                    _Term(lay.thickness / area, lay.material, lay.temperature, lay.name)
                )
        self.clamp_terms = tuple(clamp_terms)
        self._bending_terms()

    def _bending_terms(self) -> None:
        """Bending resilience of the clamped body ``beta = sum l_i / (E_i I_Bers)`` (eccentric).

        With an ``[eccentricity]`` the clamped parts' resilience at the bolt line is
        ``delta_P* = delta_P + s_sym^2 beta`` (VDI 2230-1:2015, 5.1.2.3): it takes the
        place of ``delta_P`` in everything the preload does (assembly, embedding,
        temperature), as the compatibility at the bolt line requires.
        """
        ecc = self.spec.eccentric
        self.offset2 = 0.0 if ecc is None else ecc.bolt_offset**2
        self.bend_terms: tuple[_Term, ...] = ()
        if ecc is not None:
            self.bend_terms = tuple(
                _Term(lay.thickness / ecc.bending_inertia, lay.material, lay.temperature, lay.name)
                for lay in self.spec.layers
            )

    # ------------------------------------------------------------------ temperatures
    def part_T(self, T_file: float, T_service: float | np.ndarray) -> np.ndarray:
        """A part's temperature when the joint's service temperature is ``T_service`` [K].

        Every part's rise above the assembly temperature scales with the joint's: at the
        assembly temperature all parts are at it, at the file's service temperature each part
        is at its own (a hot flange with a cooler bolt keeps that proportion in a sweep).
        When the file's service and assembly temperatures coincide, the parts keep their
        difference from the service temperature instead.
        """
        T = np.asarray(T_service, dtype=float)
        rise = self.T_service - self.T_assembly
        if abs(rise) > 1e-9:
            return self.T_assembly + (T_file - self.T_assembly) * (T - self.T_assembly) / rise
        return T + (T_file - self.T_service)

    # ------------------------------------------------------------------ moduli
    def _sum(self, terms: tuple[_Term, ...], T: np.ndarray) -> np.ndarray:
        total = np.zeros_like(T)
        for t in terms:
            total = total + t.coef / part_modulus(t.material, self.part_T(t.T_part, T))
        return total

    def resiliences(self, T_service: float | np.ndarray) -> tuple[np.ndarray, np.ndarray]:
        """``(delta_S, delta_P)`` [m/N] with the joint at service temperature(s) [K]."""
        T = np.asarray(T_service, dtype=float)
        key = ("res", T.shape, T.tobytes())
        hit = self._memo.get(key)
        if hit is None:
            dP = self._sum(self.clamp_terms, T)
            if self.bend_terms:
                dP = dP + self.offset2 * self._sum(self.bend_terms, T)
            hit = self._memo[key] = (self._sum(self.bolt_terms, T), dP)
        return hit

    def bending(self, T_service: float | np.ndarray) -> np.ndarray:
        """``beta`` [1/(N m)]: the clamped body's bending resilience at service temperature(s)."""
        return self._sum(self.bend_terms, np.asarray(T_service, dtype=float))

    def bending_at_assembly(self) -> float:
        """``beta`` with every part at the assembly temperature."""
        T = np.asarray(self.T_assembly)
        return float(sum(t.coef / part_modulus(t.material, T) for t in self.bend_terms))

    def resiliences_at_assembly(self) -> tuple[float, float]:
        """``(delta_S, delta_P)`` with every part at the assembly temperature."""
        hit = self._memo.get(("asm",))
        if hit is not None:
            return hit  # type: ignore[return-value]
        T = np.asarray(self.T_assembly)
        dS = sum(t.coef / part_modulus(t.material, T) for t in self.bolt_terms)
        dP = sum(t.coef / part_modulus(t.material, T) for t in self.clamp_terms)
        dP = dP + self.offset2 * self.bending_at_assembly()
        out = (float(dS), float(dP))
        self._memo[("asm",)] = out  # type: ignore[assignment]
        return out

    def segment_resiliences(self, T_service: float | None = None) -> list[tuple[str, float, float]]:
        """Bolt segments ``(name, length, resilience)``; at assembly temperature by default."""
        hit = self._memo.get(("seg", T_service))
        if hit is not None:
            return list(hit)
        out = []
        for (name, length), t in zip(self.bolt_segments, self.bolt_terms, strict=True):
            T = self.T_assembly if T_service is None else self.part_T(t.T_part, T_service)
            out.append((name, length, float(t.coef / part_modulus(t.material, np.asarray(T)))))
        self._memo[("seg", T_service)] = tuple(out)  # type: ignore[assignment]
        return out

    # ------------------------------------------------------------------ expansion
    def part_temperatures(self, T_service: float | np.ndarray) -> dict[str, np.ndarray]:
        """Temperature of bolt and of every layer for service temperature(s) [K]."""
        T = np.asarray(T_service, dtype=float)
        s = self.spec
        out = {"bolt": self.part_T(s.bolt.temperature, T)}
        for lay in s.layers:
            out[lay.name] = self.part_T(lay.temperature, T)
        return out

    def thermal(self, T_service: float | np.ndarray) -> tuple[np.ndarray, np.ndarray]:
        """Free thermal elongation of bolt (over l_K) and clamped stack from assembly [m].

        ``l_K (eps_S(T_S) - eps_S(T_0))`` and ``sum l_i (eps_i(T_i) - eps_i(T_0))`` with
        ``eps = alpha_mean (T - 20 degC)`` (mean coefficients, as handbooks tabulate).
        """
        s = self.spec
        T = np.asarray(T_service, dtype=float)
        key = ("th", T.shape, T.tobytes())
        hit = self._memo.get(key)
        if hit is not None:
            return hit
        T0 = np.asarray(self.T_assembly)
        b = s.bolt
        lK = s.clamp_length
        bolt = lK * (_strain(b.material, self.part_T(b.temperature, T)) - _strain(b.material, T0))
        clamp = np.zeros_like(T)
        for lay in s.layers:
            clamp = clamp + lay.thickness * (
                _strain(lay.material, self.part_T(lay.temperature, T)) - _strain(lay.material, T0)
            )
        self._memo[key] = (bolt, clamp)
        return bolt, clamp

    # ------------------------------------------------------------------ data ranges
    def check_range(self, T_service: float | np.ndarray, extrapolate: bool = False) -> None:
        """InputError if a part's temperature leaves its material's data.

        With ``extrapolate`` the data count as reaching
        :data:`~clampstack.catalog.COLD_MARGIN` below their coldest point (what the model
        evaluates, flagged by :meth:`extrapolations`); without, a property must be tabulated
        at every part's temperature.  The message names the part, the material and the
        property; the caller adds the key the temperatures came from.
        """
        for T in np.atleast_1d(np.asarray(T_service, dtype=float)).ravel():
            for p in self.parts:
                mat = p.material.material
                if mat is None:
                    continue
                T_part = float(self.part_T(p.T_part, T))
                for prop in p.props:
                    try:
                        mat.check(prop, T_part, extrapolate, p.label)
                    except InputError as err:
                        at = "" if abs(T_part - T) < 1e-9 else f" at {T - 273.15:g} degC in service"
                        raise InputError(err.detail + at) from None

    def extrapolations(self, T_service: float | np.ndarray) -> list[tuple[str, Extrapolation]]:
        """``(part, Extrapolation)`` for every catalog property that the model extrapolates.

        Over the parts' temperatures at the service temperature(s) ``T_service`` [K] and at
        the assembly temperature; one entry per part and property, at its coldest point.
        """
        T = np.atleast_1d(np.asarray(T_service, dtype=float))
        out = []
        for p in self.parts:
            if not p.props:
                continue
            Ts = np.append(self.part_T(p.T_part, T), self.T_assembly)
            for x in p.material.material.extrapolations(Ts, p.props):  # type: ignore[union-attr]
                out.append((p.label, x))
        return out

    def extrapolation_notes(self, T_service: float | np.ndarray) -> list[str]:
        """:meth:`extrapolations` as sentences for a result's notes."""
        return [x.text(label) for label, x in self.extrapolations(T_service)]


def part_modulus(pm: PartMaterial, T: np.ndarray) -> np.ndarray:
    """A part's Young's modulus at temperature(s) ``T`` [K] (given, or the catalog's;
    extrapolated as the model does) [Pa]."""
    if pm.modulus is not None:
        return np.full(np.shape(T), pm.modulus) if np.ndim(T) else np.asarray(pm.modulus)
    assert pm.material is not None
    return np.asarray(pm.material.modulus(T, extrapolate=True))


def _strain(pm: PartMaterial, T: np.ndarray) -> np.ndarray:
    if pm.expansion is not None:
        return pm.expansion * (T - 293.15)
    assert pm.material is not None
    return np.asarray(pm.material.thermal_strain(T, extrapolate=True))
