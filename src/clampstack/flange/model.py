"""A gasketed bolted flange after validation (SI floats, defaults resolved)."""

from __future__ import annotations

import math
from dataclasses import dataclass, field

from ..catalog import Grade, Thread
from ..errors import InputError
from ..joint.geometry import check_temperature
from ..joint.model import PartMaterial

PSI = 6894.757293168361  # Pa per psi


@dataclass(frozen=True)
class GasketSpec:
    """Ring gasket: geometry, ASME factors and its loading / unloading behaviour."""

    name: str
    inner_diameter: float
    outer_diameter: float
    thickness: float
    m: float
    y: float  # seating stress [Pa]
    max_stress: float  # crush limit [Pa]
    unload_modulus: float  # [Pa]
    curve_strain: tuple[float, ...]
    curve_stress: tuple[float, ...]  # [Pa]
    source: str
    expansion: float = 0.0  # thermal expansion through the thickness [1/K]
    relax_temperature: tuple[float, ...] = (293.15,)  # [K]
    relax_factor: tuple[float, ...] = (1.0,)  # creep relaxation factor P_QR at those
    relaxation_given: float | None = None  # a P_QR from the file: applies when hot
    service_source: str = ""  # source of expansion and relaxation

    def relaxation(self, T: float, T_assembly: float) -> float:
        """Creep relaxation factor P_QR at gasket temperature ``T`` [K] (1: no creep).

        A factor given in the file applies at any temperature above assembly; otherwise
        the type's table (EN 13555 P_QR, typical values from memory), linear and held
        beyond its ends."""
        if self.relaxation_given is not None:
            return self.relaxation_given if T > T_assembly + 1e-9 else 1.0
        import numpy as np

        return float(np.interp(T, self.relax_temperature, self.relax_factor))

    @property
    def area(self) -> float:
        """Contact area pi/4 (OD^2 - ID^2) [m^2]."""
        import math

        return math.pi / 4 * (self.outer_diameter**2 - self.inner_diameter**2)


@dataclass(frozen=True)
class FlangeSpec:
    """A validated flange joint: N bolts on a circle, a ring gasket, loads and passes."""

    title: str
    bolt_count: int
    bolt_circle: float
    thickness: float  # each flange ring
    ring_inner_diameter: float
    ring_outer_diameter: float
    material: PartMaterial
    mating: str  # "flange" (identical pair) or "rigid"
    thread: Thread
    grade: Grade
    bolt_material: PartMaterial
    nut_height: float
    bearing_diameter: float
    hole: float
    allowable_stress: float  # S_b, at design temperature [Pa]
    allowable_stress_ambient: float  # S_a [Pa]
    gasket: GasketSpec
    pressure: float
    axial_force: float
    bending_moment: float
    T_assembly: float
    T_flange: float
    T_bolt: float
    method: str
    torque: float | None
    preload: float | None
    thread_friction: tuple[float, float]
    head_friction: tuple[float, float]
    scatter: float | None
    utilization: float
    torque_tolerance: float
    passes: tuple[float, ...]  # fractions of the target preload
    patterns: tuple[str, ...]  # one per pass: cross | circular | custom
    order: tuple[int, ...] | None  # custom order (0-based)
    defaults: tuple[tuple[str, str], ...] = field(default=())
    head: str = "stud"  # stud (two nuts) | hex | socket
    shank_length: float = 0.0
    shank_diameter: float | None = None
    nut_material: PartMaterial | None = None  # None: the bolt's
    unused: tuple[str, ...] = ()  # keys accepted for a joint that the flange model does not use
    bolt_length: float | None = None  # given nominal length (checked to reach through the joint)
    given: frozenset[str] = frozenset()  # key paths the file set ("flange.outer_diameter", ...)
    lubricant: str | None = None  # friction catalog key that set both friction ranges
    tool: str | None = None  # tool catalog key that set the torque tolerance
    nut_factor: tuple[float, float] | None = None  # K of T = K F d (friction implied from it)
    #: method tension: "all" (a tensioner on every bolt, one pass), "half" (every other bolt,
    #: then the rest, then a check pass) or "sequence" (one tool, bolt by bolt, in the passes)
    tensioning: str | None = None
    load_transfer_factor: float | None = None  # method tension: residual / applied tension
    rotation: bool = True  # the flange rings rotate (ring theory); False: axial only
    T_gasket: float | None = None  # gasket temperature in operation [K]; None: the flange's
    distributions: dict = field(default_factory=dict)  # [distributions]: key -> Dist (scatter)

    @property
    def T_gasket_service(self) -> float:
        """The gasket's service temperature [K] (the flange's unless given)."""
        return self.T_flange if self.T_gasket is None else self.T_gasket


def bolt_allowable_stress(grade: Grade, thread: Thread) -> tuple[float, str]:
    """Default allowable bolt stress S_b [Pa] for ASME VIII-1 App. 2, with its note.

    SA-193 B7 up to 2.5 in: 25 ksi (ASME II-D Table 3, from memory); other grades:
    min(R_m/5, R_p0.2/4), the bolting design factors of ASME II-D (from memory).
    """
    if grade.name == "ASTM A193 B7" and thread.d <= 2.5 * 0.0254:
        return 25000 * PSI, "172.4 MPa (25 ksi, ASME II-D Table 3, SA-193 B7, from memory)"
    Sb = min(grade.Rm / 5, grade.Rp02 / 4)
    return Sb, f"{Sb / 1e6:.4g} MPa (min(R_m/5, R_p0.2/4), bolting design factors, from memory)"


def ring_outer_diameter(bolt_circle: float, hole: float) -> float:
    """Default outer diameter of the flange ring [m]: bolt circle + 2.5 holes (common practice, no source)."""
    return bolt_circle + 2.5 * hole


def check_fit(spec: FlangeSpec) -> None:
    """The bolts, nuts, gasket and rings of a flange must fit together (InputError names the key).

    Bolt holes inside the ring and outside the gasket, nuts not overlapping each
    other or overhanging the ring, bearing faces wider than the holes, the bolt
    long enough for the grip and the nuts, the plain shank inside the grip, and the
    materials' temperature data at the assembly and service temperatures.
    """
    n, Dbc, hole, dW = spec.bolt_count, spec.bolt_circle, spec.hole, spec.bearing_diameter
    if dW <= hole:
        key = (
            "nut.bearing_diameter"
            if "nut.bearing_diameter" in spec.given
            else "bolt.bearing_diameter"
        )
        raise InputError("bearing diameter must exceed the bolt hole", key=key)
    chord = Dbc * math.sin(math.pi / n)  # distance between neighbouring bolt axes
    if chord < dW:
        raise InputError(
            f"{n} bolts do not fit on a {Dbc * 1e3:.4g} mm bolt circle: neighbouring bolts "
            f"are {chord * 1e3:.3g} mm apart, less than the nut bearing diameter "
            f"{dW * 1e3:.3g} mm",
            key="flange.bolt_count",
        )
    go = spec.gasket.outer_diameter
    if go > Dbc - hole:
        raise InputError(
            f"gasket outer diameter {go * 1e3:g} mm reaches the bolt holes (bolt circle "
            f"{Dbc * 1e3:g} mm minus hole {hole * 1e3:g} mm); a ring gasket lies inside the bolts",
            key="gasket.outer_diameter",
        )
    ring_in, ring_out = spec.ring_inner_diameter, spec.ring_outer_diameter
    given = spec.given
    inner_key = (
        "flange.inner_diameter" if "flange.inner_diameter" in given else ("gasket.inner_diameter")
    )
    if ring_in >= ring_out:
        raise InputError(
            f"the flange ring's inner diameter {ring_in * 1e3:g} mm is not below its outer "
            f"diameter {ring_out * 1e3:g} mm",
            key=inner_key,
        )
    if not ring_in < Dbc - hole:
        raise InputError(
            f"the flange ring's inner diameter {ring_in * 1e3:g} mm reaches the bolt holes "
            f"(bolt circle {Dbc * 1e3:g} mm minus hole {hole * 1e3:g} mm)",
            key=inner_key,
        )
    if not ring_out > Dbc + hole:
        raise InputError(
            f"the flange ring's outer diameter {ring_out * 1e3:g} mm does not reach past the "
            f"bolt holes (bolt circle {Dbc * 1e3:g} mm plus hole {hole * 1e3:g} mm)",
            key="flange.outer_diameter"
            if "flange.outer_diameter" in given
            else "flange.bolt_circle",
        )
    if ring_out < Dbc + dW * (1 - 1e-9):
        raise InputError(
            f"the nuts ({dW * 1e3:.4g} mm bearing face) overhang the flange: bolt circle "
            f"{Dbc * 1e3:g} mm + nut > outer diameter {ring_out * 1e3:.4g} mm",
            key="flange.outer_diameter",
        )
    pair = spec.mating == "flange"
    grip = (2 if pair else 1) * spec.thickness + spec.gasket.thickness
    need = grip + (2 if pair else 1) * spec.nut_height
    if spec.bolt_length is not None and spec.bolt_length < need * (1 - 1e-9):
        raise InputError(
            f"bolt length {spec.bolt_length * 1e3:g} mm does not reach through the joint "
            f"({need * 1e3:.4g} mm with {'both nuts' if pair else 'the nut'})",
            key="bolt.length",
        )
    if spec.shank_length > grip:
        raise InputError("the plain shank is longer than the grip", key="bolt.shank_length")
    if spec.shank_diameter is not None and spec.shank_diameter >= spec.thread.d:
        raise InputError(
            "a reduced shank must be thinner than the thread", key="bolt.shank_diameter"
        )
    for pm, T, key in (
        (spec.material, spec.T_flange, "loading.temperature"),
        (spec.material, spec.T_assembly, "loading.assembly_temperature"),
        (spec.bolt_material, spec.T_bolt, "loading.bolt_temperature"),
        (spec.bolt_material, spec.T_assembly, "loading.assembly_temperature"),
    ):
        # below the data: extrapolated at most COLD_MARGIN, flagged in the notes
        check_temperature(pm, T, key, extrapolate=True)
