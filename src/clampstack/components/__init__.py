"""Components of a bolted joint and their published models (pure SI floats, numpy).

Modules:

* :mod:`.bolt` - bolt and stud resilience (VDI 2230-1), ISO 4014 thread length.
* :mod:`.plates` - clamped-part resilience: VDI 2230-1 cone/sleeve, Shigley frusta,
  Wileman et al. (1991); sleeves and washers.
* :mod:`.tightening` - torque and preload (VDI 2230-1, ISO 16047), permissible preload,
  assembly stress, tightening factor.
* :mod:`.embedding` - embedding amounts and preload loss (VDI 2230-1).
* :mod:`.strength` - fatigue endurance, working stress, surface pressure, thread
  stripping (FED-STD-H28, Alexander), slip.

No units library is used here: lengths in m, areas in m^2, forces in N, moduli and
stresses in Pa, torques in N*m, resilience in m/N, stiffness in N/m.  Invalid input
raises ``ValueError``; the input layer turns it into an ``InputError``.
"""

from .bolt import (
    BoltResilience,
    BoltSegment,
    ThreadGeometry,
    bolt_resilience,
    cylinder_resilience,
    default_shank_length,
    iso4014_thread_length,
    thread_geometry,
)
from .embedding import embedding_amount, embedding_preload_loss
from .plates import (
    WILEMAN_COEFFICIENTS,
    clamped_resilience,
    cone_limit_diameter,
    cone_tan_phi,
    full_cone_outer_diameter,
    plate_resiliences,
    shigley_frustum,
    shigley_members,
    sleeve_resilience,
    vdi2230_cone,
    vdi2230_plates,
    wileman_1991,
)
from .strength import (
    BOLT_SHEAR_RATIO,
    SHEAR_STRENGTH_RATIO,
    Stripping,
    bearing_area,
    bolt_shear_ratio,
    endurance_rolled_after_heat_treatment,
    endurance_rolled_before_heat_treatment,
    external_thread_shear_area,
    internal_thread_shear_area,
    minimum_engagement,
    nut_dilation_factor,
    slip_clamp_load,
    stress_amplitude,
    strip_force,
    stripping_engagement,
    surface_pressure,
    thread_bending_factors,
    working_stress,
)
from .tightening import (
    TIGHTENING_FACTOR_RANGES,
    CombinedStress,
    assembly_stress,
    assembly_torque,
    bearing_diameter_default,
    effective_bearing_diameter,
    friction_from_nut_factor,
    head_torque,
    iso16047_head_friction,
    iso16047_thread_friction,
    permissible_preload,
    preload_from_torque,
    thread_torque,
    tightening_factor,
    torsional_section_modulus,
    yield_controlled_preload_range,
)

__all__ = [
    "SHEAR_STRENGTH_RATIO",
    "TIGHTENING_FACTOR_RANGES",
    "WILEMAN_COEFFICIENTS",
    "BoltResilience",
    "BoltSegment",
    "CombinedStress",
    "ThreadGeometry",
    "assembly_stress",
    "assembly_torque",
    "bearing_area",
    "bearing_diameter_default",
    "bolt_resilience",
    "clamped_resilience",
    "cone_limit_diameter",
    "cone_tan_phi",
    "cylinder_resilience",
    "default_shank_length",
    "effective_bearing_diameter",
    "embedding_amount",
    "embedding_preload_loss",
    "endurance_rolled_after_heat_treatment",
    "endurance_rolled_before_heat_treatment",
    "external_thread_shear_area",
    "full_cone_outer_diameter",
    "head_torque",
    "internal_thread_shear_area",
    "iso16047_head_friction",
    "iso16047_thread_friction",
    "iso4014_thread_length",
    "minimum_engagement",
    "BOLT_SHEAR_RATIO",
    "Stripping",
    "bolt_shear_ratio",
    "nut_dilation_factor",
    "stripping_engagement",
    "thread_bending_factors",
    "permissible_preload",
    "friction_from_nut_factor",
    "plate_resiliences",
    "preload_from_torque",
    "shigley_frustum",
    "shigley_members",
    "sleeve_resilience",
    "slip_clamp_load",
    "strip_force",
    "stress_amplitude",
    "surface_pressure",
    "thread_geometry",
    "thread_torque",
    "tightening_factor",
    "torsional_section_modulus",
    "vdi2230_cone",
    "vdi2230_plates",
    "wileman_1991",
    "working_stress",
    "yield_controlled_preload_range",
]
