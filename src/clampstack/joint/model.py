"""A single-bolt joint after validation: everything in SI floats, every default resolved.

The input layer (:mod:`clampstack.inputs.joint`) builds these objects from a
TOML file; :func:`clampstack.joint.analysis.analyse` turns them into results.
Each default that was applied is recorded in :attr:`JointSpec.defaults` so that
the readable output and the report can print it.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

import numpy as np

from ..catalog import Grade, Material, Thread
from .eccentric import Interface

ROOM = 293.15  # K, 20 degC: the reference temperature of the catalog

#: the quantities of a joint that a scatter study may vary ([distributions] keys) -> quantity kind (for units) and meaning
DIST_KEYS: dict[str, tuple[str, str]] = {
    "thread_friction": ("dimensionless", "thread friction mu_G"),
    "head_friction": ("dimensionless", "head friction mu_K"),
    "torque": ("torque", "tightening torque"),
    "torque_factor": ("dimensionless", "torque-tool accuracy: applied / set torque"),
    "preload": ("force", "assembly preload (tensioner)"),
    "embedding": ("length", "embedding amount f_Z"),
    "temperature": ("temperature", "service temperature"),
    "axial_load": ("force", "largest axial working load"),
    "yield_strength": ("stress", "bolt yield strength R_p0.2"),
    "slip_friction": ("dimensionless", "interface friction mu_T"),
    "angle": ("angle", "nut rotation after the snug torque (method angle)"),
}

#: Physical lower bound of each sampled input (SI): frictions, torque, preload, embedding,
#: tool factor and slip coefficient are not negative, a temperature not below 0 K, a yield
#: strength positive (common practice, no source: what the quantities mean).
DIST_LOWER_BOUNDS: dict[str, float] = {
    "thread_friction": 0.0,
    "head_friction": 0.0,
    "torque": 0.0,
    "torque_factor": 0.0,
    "preload": 0.0,
    "embedding": 0.0,
    "temperature": 0.0,
    "yield_strength": 0.0,
    "slip_friction": 0.0,
    "angle": 0.0,
}
#: A normal distribution may put at most this share of its samples below the bound (they
#: are truncated to it, with a note); a larger share is refused.
MAX_TRUNCATED = 1e-3


@dataclass(frozen=True)
class Dist:
    """A distribution: kind uniform | normal | lognormal | fixed, two parameters (SI)."""

    kind: str
    a: float
    b: float = 0.0

    def share_below(self, bound: float) -> float:
        """Share of the samples that fall below ``bound`` (exact for each kind)."""
        if self.kind == "fixed":
            return 1.0 if self.a < bound else 0.0
        if self.kind == "uniform":
            if self.b <= self.a:
                return 1.0 if self.a < bound else 0.0
            return min(max((bound - self.a) / (self.b - self.a), 0.0), 1.0)
        if self.kind == "normal":
            if self.b == 0:
                return 1.0 if self.a < bound else 0.0
            return 0.5 * math.erfc((self.a - bound) / (self.b * math.sqrt(2)))
        return 0.0 if bound <= 0 else float("nan")  # lognormal: positive

    def sample(self, rng: np.random.Generator, n: int) -> np.ndarray:
        if self.kind == "uniform":
            return rng.uniform(self.a, self.b, n)
        if self.kind == "normal":
            return rng.normal(self.a, self.b, n)
        if self.kind == "lognormal":
            # mean a and standard deviation b of the variable itself
            s2 = math.log(1 + (self.b / self.a) ** 2)
            return rng.lognormal(math.log(self.a) - 0.5 * s2, math.sqrt(s2), n)
        return np.full(n, self.a)

    def describe(
        self,
        unit: str = "",
        factor: float = 1.0,
        offset: float = 0.0,
        spread_unit: str | None = None,
    ) -> str:
        """Text in a display unit: value = SI / factor - offset (a spread: SI / factor)."""
        u = f" {unit}" if unit else ""
        su = f" {spread_unit if spread_unit is not None else unit}".rstrip()

        def v(x: float) -> float:
            return x / factor - offset

        if self.kind == "uniform":
            return f"uniform {v(self.a):.4g}..{v(self.b):.4g}{u}"
        if self.kind in ("normal", "lognormal"):
            return f"{self.kind} mean {v(self.a):.4g}{u}, std {self.b / factor:.4g}{su}"
        return f"fixed {v(self.a):.4g}{u}"


@dataclass(frozen=True)
class PartMaterial:
    """Modulus and expansion of a part, from the catalog or given (then constant)."""

    name: str
    material: Material | None
    modulus: float | None = None  # Pa, overrides the catalog
    expansion: float | None = None  # 1/K mean, overrides the catalog

    def from_catalog(self, props: tuple[str, ...] = ("E", "alpha")) -> tuple[str, ...]:
        """The properties of ``props`` (``"E"``, ``"alpha"``) taken from the catalog, not
        given in the file (none for a material given only by modulus and expansion)."""
        if self.material is None:
            return ()
        given = {"E": self.modulus is not None, "alpha": self.expansion is not None}
        return tuple(p for p in props if not given[p])

    def E(self, T: float, extrapolate: bool = False) -> float:
        """Young's modulus at temperature ``T`` [K] (catalog table, linear interpolation;
        ``extrapolate``: at most ``COLD_MARGIN`` below the data, see the catalog)."""
        if self.modulus is not None:
            return self.modulus
        assert self.material is not None
        return float(self.material.modulus(T, extrapolate=extrapolate))

    def strain(self, T: float, extrapolate: bool = False) -> float:
        """Free thermal strain from 20 degC to ``T`` [K] (mean coefficient times dT)."""
        if self.expansion is not None:
            return self.expansion * (T - ROOM)
        assert self.material is not None
        return float(self.material.thermal_strain(T, extrapolate=extrapolate))

    def alpha(self, T: float) -> float:
        """Mean expansion coefficient from 20 degC to ``T`` [1/K]."""
        if self.expansion is not None:
            return self.expansion
        assert self.material is not None
        return float(self.material.expansion(T))


@dataclass(frozen=True)
class BoltSpec:
    thread: Thread
    grade: Grade
    length: float
    shank_length: float  # plain shank inside the clamp length (0: fully threaded)
    shank_diameter: float | None  # reduced (waisted) shank
    head: str  # hex | socket | stud
    bearing_diameter: float  # d_W under the head
    material: PartMaterial
    temperature: float  # service temperature [K]
    rolled: str  # "before" | "after" heat treatment


@dataclass(frozen=True)
class NutSpec:
    height: float
    bearing_diameter: float
    material: PartMaterial
    Rm: float  # tensile strength of the nut material [Pa] (matched nut: the bolt's)
    shear_ratio: float
    limiting_pressure: float | None = None
    temperature: float = ROOM  # service temperature [K]
    across_flats: float = 0.0  # width across flats s [m] (nut dilation, VDI 2230-1 C1)


@dataclass(frozen=True)
class TappedHoleSpec:
    material: PartMaterial
    engagement: float
    Rm: float
    shear_ratio: float
    temperature: float


@dataclass(frozen=True)
class LayerSpec:
    """A clamped plate, sleeve or washer in the stack (head side first)."""

    name: str
    kind: str  # plate | sleeve | washer
    thickness: float
    hole: float
    outer_diameter: float | None
    material: PartMaterial
    temperature: float
    limiting_pressure: float | None
    family: str  # material family for the Wileman fit
    key: str = ""  # where it came from in the file ("clamped[2]", "washer[1]"), for errors


@dataclass(frozen=True)
class TighteningSpec:
    method: str  # torque | angle | yield | tension
    torque: float | None
    preload: float | None
    thread_friction: tuple[float, float]
    head_friction: tuple[float, float]
    scatter: float | None
    utilization: float
    torque_tolerance: float
    lubricant: str | None = None  # key of the friction catalog that set both ranges
    tool: str | None = None  # key of the tool catalog that set the torque tolerance
    nut_factor: tuple[float, float] | None = None  # K of T = K F d; the friction follows it
    snug_torque: float | None = None  # method angle [N*m]
    angle: tuple[float, float] | None = None  # method angle: rotation after snug [rad]
    angle_tolerance: float = 0.0  # +- [rad]
    load_transfer_factor: float | None = None  # method tension: residual / applied tension


@dataclass(frozen=True)
class ServiceSpec:
    axial_load: tuple[float, float]  # (min, max) N
    shear_load: float
    load_height: float
    temperature: float  # K
    assembly_temperature: float  # K
    bending_moment: tuple[float, float] = (0.0, 0.0)  # (with the min, with the max load) N*m


@dataclass(frozen=True)
class CaseSpec:
    """One ``[[case]]``: what it sets in place of ``[service]`` (None: as the file's)."""

    name: str
    axial_load: tuple[float, float] | None = None
    shear_load: float | None = None
    bending_moment: tuple[float, float] | None = None
    temperature: float | None = None  # K
    assembly_temperature: float | None = None  # K
    part_temperatures: tuple[tuple[str, float], ...] = ()  # (part name, K) set in this case


@dataclass(frozen=True)
class EccentricSpec:
    """``[eccentricity]`` after validation (SI; offsets signed, positive toward the load)."""

    bolt_offset: float  # s_sym [m]
    load_offset: float  # a [m]
    edge_distance: float | None  # u [m], signed; None: the edge that opens first
    interface: Interface
    bending_inertia: float  # I_Bers [m^4], resolved
    bending_inertia_basis: str  # how I_Bers was found (printed)

    @property
    def bolt_outside_core(self) -> bool:
        """True when the preload alone lifts an edge: ``|s_sym| h > I_BT / A_D``."""
        return self.interface.lifts_under_preload(self.bolt_offset)

    def refuse_outside_core(self, command: str) -> None:
        """InputError for a study that does not model a joint open under its preload."""
        from ..errors import InputError

        if self.bolt_outside_core:
            raise InputError(
                f"{command} does not model an eccentric joint whose preload alone lifts an edge "
                "(the bolt lies outside the interface's core); use check",
                key="eccentricity.bolt_offset",
            )


@dataclass(frozen=True)
class RequirementSpec:
    residual_clamp_load: float
    slip_friction: float
    slip_safety: float
    fatigue_safety: float
    #: preload of the checks R8-R10: "permissible" (F_M,zul, VDI 2230-1) or "actual" (F_M,max)
    check_basis: str = "permissible"
    #: largest probability of separation, bolt yield or slip a scatter study may show
    #: (95 % upper bound); None: no limit
    max_failure_probability: float | None = None


@dataclass(frozen=True)
class JointSpec:
    """A validated single-bolt joint."""

    title: str
    bolt: BoltSpec
    nut: NutSpec | None
    tapped_hole: TappedHoleSpec | None
    layers: tuple[LayerSpec, ...]
    embedding_amount: float | None  # given f_Z [m]
    roughness: float  # R_z [m]
    tightening: TighteningSpec
    service: ServiceSpec
    requirements: RequirementSpec
    clamp_model: str
    skips: tuple[tuple[str, str], ...] = ()
    defaults: tuple[tuple[str, str], ...] = field(default=())
    distributions: dict[str, Dist] | None = None  # [distributions] (scatter); None: no table
    given: frozenset[str] = frozenset()  # key paths the file set ("bolt.shank_length", ...)
    eccentric: EccentricSpec | None = None  # [eccentricity]; None: concentric
    cases: tuple[CaseSpec, ...] = ()  # [[case]] load cases; empty: the [service] state only

    @property
    def clamp_length(self) -> float:
        """Clamp length l_K: all plates, sleeves and washers [m]."""
        return sum(layer.thickness for layer in self.layers)

    @property
    def tapped(self) -> bool:
        """True for a tapped thread joint (no nut)."""
        return self.tapped_hole is not None
