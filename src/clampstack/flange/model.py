"""A gasketed bolted flange after validation (SI floats, defaults resolved)."""

from __future__ import annotations

from dataclasses import dataclass, field

from ..catalog import Grade, Thread
from ..joint.model import PartMaterial


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
