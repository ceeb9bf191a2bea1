"""A flange in service: temperatures, pressure, gasket creep relaxation and the heat cycle.

The assembled ring (:class:`~clampstack.flange.analysis.Ring`, with its gasket
history and the nuts where the passes left them) is brought to a state of service:

* **Temperatures.**  Bolt, flange rings and gasket each at their own temperature:
  the moduli of bolt and flange at temperature scale their springs, and each part's
  free thermal growth from the assembly temperature (bolt over the grip, each ring
  over its thickness, the gasket over its thickness with its expansion through the
  thickness) enters as a free elongation.
* **Pressure and external loads** at their radii, shared between the bolt circle
  and the gasket reaction by the ring's rotation (:func:`~.analysis.load_split`).
* **Creep relaxation** when hot: the gasket loses thickness until each sector keeps
  ``P_QR`` of the gasket force it had on reaching the hot state (EN 13555 defines
  P_QR as residual over initial gasket stress in a creep relaxation test; applied here
  to the joint's own stiffness, which is conservative where the joint is more
  flexible than the test rig: our model).  The loss of thickness stays on cooling.
* **Unloading** follows the gasket's unloading line from the largest compression
  reached (the ring's gasket history), so what is lost when the bolts shrink back on
  cooling is not regained.

The heat cycle: assembly -> start-up (hot, pressurised) -> hot (after creep
relaxation) -> cooled (back at the assembly temperature, still pressurised: a cold
restart) -> shut down (cold, no pressure).
"""

from __future__ import annotations

import copy
from dataclasses import dataclass
from typing import Any

import numpy as np

from ..errors import SolveError
from .loads import asme_app2, load_split
from .model import FlangeSpec

Ring = Any  # clampstack.flange.analysis.Ring (not imported: analysis imports this module)

STATES = ("start_up", "hot", "cooled", "shut_down")
STATE_TEXT = {
    "assembly": "after the last pass",
    "start_up": "start-up (hot, pressurised)",
    "hot": "hot, after creep relaxation",
    "cooled": "cooled back, pressurised",
    "shut_down": "shut down (cold, no pressure)",
}


@dataclass(frozen=True)
class Conditions:
    """Temperatures [K] and the share of the design loads of one state."""

    T_flange: float
    T_bolt: float
    T_gasket: float
    load: float = 1.0  # 1: pressure and external loads on; 0: off


@dataclass(frozen=True)
class State:
    """Per-bolt loads of one state (SI)."""

    name: str
    conditions: Conditions
    bolt: np.ndarray  # bolt force [N]
    gasket: np.ndarray  # gasket force of each sector [N]
    rotation: np.ndarray  # flange ring rotation at each bolt [rad]
    relaxation: float = 1.0  # P_QR applied on reaching this state (hot only)

    def to_dict(self, sector_area: float) -> dict[str, Any]:
        c = self.conditions
        return {
            "state": self.name,
            "flange_temperature_degC": c.T_flange - 273.15,
            "bolt_temperature_degC": c.T_bolt - 273.15,
            "gasket_temperature_degC": c.T_gasket - 273.15,
            "pressurised": c.load > 0,
            "relaxation_factor": self.relaxation,
            "bolt_load_N": self.bolt.tolist(),
            "gasket_force_N": self.gasket.tolist(),
            "gasket_stress_MPa": (self.gasket / sector_area * 1e-6).tolist(),
            "rotation_deg": np.degrees(self.rotation).tolist(),
            "bolt_load_min_N": float(self.bolt.min()),
            "gasket_stress_min_MPa": float(self.gasket.min()) / sector_area * 1e-6,
            "preload_basis": "nominal",
        }


def service_conditions(spec: FlangeSpec) -> Conditions:
    """The file's service state: its flange, bolt and gasket temperatures, loads on."""
    return Conditions(spec.T_flange, spec.T_bolt, spec.T_gasket_service)


def at_fraction(spec: FlangeSpec, T: float) -> Conditions:
    """Conditions with the flange at ``T`` [K] and bolt and gasket at the same fraction of
    their rise from assembly as in the file (at the assembly temperature all parts are at
    it; beyond the file's flange temperature each part rises in proportion).  A file whose
    flange stays at the assembly temperature moves every part with the flange, each
    keeping its offset."""
    T0 = spec.T_assembly
    rise = spec.T_flange - T0
    if abs(rise) < 1e-3:  # the flange stays at assembly temperature in the file:
        # every part moves with the flange by the same amount, keeping its offset
        return Conditions(
            T, T + (spec.T_bolt - spec.T_flange), T + (spec.T_gasket_service - spec.T_flange)
        )
    s = (T - T0) / rise

    def part(Tp: float) -> float:
        return T0 + s * (Tp - T0)

    return Conditions(T, part(spec.T_bolt), part(spec.T_gasket_service))


def set_conditions(ring: Ring, c: Conditions) -> None:
    """Moduli at temperature and free thermal growths of bolt, rings and gasket."""
    spec = ring.spec
    T0 = spec.T_assembly
    ring.scale_k = (
        spec.bolt_material.E(c.T_bolt, True) / spec.bolt_material.E(T0, True),
        spec.material.E(c.T_flange, True) / spec.material.E(T0, True),
    )
    pair = spec.mating == "flange"
    lK = (2 * spec.thickness if pair else spec.thickness) + spec.gasket.thickness
    ring.thermal_bolt = (lK / (2 if pair else 1)) * (
        spec.bolt_material.strain(c.T_bolt, True) - spec.bolt_material.strain(T0, True)
    )
    ring.thermal_flange = spec.thickness * (
        spec.material.strain(c.T_flange, True) - spec.material.strain(T0, True)
    )
    ring.thermal_gasket = ring.gasket_thickness * spec.gasket.expansion * (c.T_gasket - T0)


def loads(spec: FlangeSpec, rotation: bool) -> tuple[np.ndarray, np.ndarray]:
    """Design working loads per bolt at (U, F): :func:`~.analysis.load_split`."""
    return load_split(spec, asme_app2(spec).G, rotation)


def solve_state(
    ring: Ring, name: str, c: Conditions, split: tuple[np.ndarray, np.ndarray]
) -> State:
    """Set the conditions and solve the ring (its gasket history is updated)."""
    set_conditions(ring, c)
    at_U, at_F = split
    _, bolt, gasket, sol = ring.solve(c.load * at_F, loads_U=c.load * at_U)
    return State(name, c, bolt, gasket, ring.rotations(sol))


def relax(ring: Ring, state: State, split: tuple[np.ndarray, np.ndarray], P: float) -> State:
    """Creep relaxation: each sector keeps ``P`` of its gasket force of ``state``.

    The thickness each loaded sector loses (``ring.creep``) is found by Newton-chord
    steps on the ring with the sensitivity of the loaded sectors (the ring is linear on
    the unloading line, so a few steps); 1e-10 relative.  A sector that carries nothing
    has nothing to relax and loses no thickness.
    """
    if ring.creep is None:
        ring.creep = np.zeros(ring.n)
    g0 = state.gasket
    want = (1.0 - P) * g0  # loss of gasket force per sector
    if not np.any(want > 0):
        return State("hot", state.conditions, state.bolt, state.gasket, state.rotation, P)
    g = ring.spec.gasket
    k_un = g.unload_modulus * ring.sector_area / ring.gasket_thickness
    base = ring.creep.copy()
    tol = 1e-10 * float(np.max(np.abs(want)))

    def loss(dc: np.ndarray) -> tuple[np.ndarray, State]:
        ring.creep = base + dc
        st = solve_state(ring, "hot", state.conditions, split)
        return g0 - st.gasket, st

    # the ring is linear on the gasket's unloading line: the loss of gasket force is
    # S dc, with S from the ring's stiffness (creep_sensitivity); Newton-chord steps on
    # the ring itself until each sector's loss is met
    on = g0 > 0  # loaded sectors; the others stay as they are
    S = creep_sensitivity(ring, k_un)[np.ix_(on, on)]
    l0, _ = loss(np.zeros(ring.n))
    dc = np.zeros(ring.n)
    dc[on] = np.linalg.solve(S, (want - l0)[on])
    for _ in range(30):
        got, new = loss(dc)
        if np.all(np.abs(got - want)[on] <= tol):
            break
        dc[on] += np.linalg.solve(S, (want - got)[on])
    else:
        raise SolveError("the gasket's creep relaxation did not converge")
    return State("hot", new.conditions, new.bolt, new.gasket, new.rotation, P)


def creep_sensitivity(ring: Ring, k_un: float) -> np.ndarray:
    """Loss of gasket force of each sector per unit thickness lost by each sector [N/m].

    The linear ring (bolts in tension, gasket sectors on their unloading line of
    stiffness ``k_un``): with element stiffnesses ``k_e``, element vectors ``b_e`` and
    the reduced stiffness ``K``, a change ``dd0_g`` of gasket g's free elongation changes
    the element forces by ``k_e b_e^T K^-1 b_g k_g dd0_g - k_g dd0_g``; creep is
    ``dd0 = -dc``, so ``S = diag(k_g) - k_g b_g^T K^-1 b_g k_g`` on the gasket block.
    """
    _, i_n, j_n, k, _, _, gparts = ring._parts(None)
    k = np.asarray(k, dtype=float)
    k[gparts] = k_un
    N = ring.n_nodes
    B = np.zeros((len(k), N))
    idx = np.arange(len(k))
    B[idx, np.asarray(j_n)] += 1.0
    B[idx, np.asarray(i_n)] -= 1.0
    B = B[:, 1:]  # node 0 fixed
    K = B.T @ (k[:, None] * B)
    Bg = B[gparts]
    X = np.linalg.solve(K, Bg.T)  # K^-1 b_g
    return np.diag(k[gparts]) - (k[gparts][:, None] * (Bg @ X)) * k[gparts][None, :]


@dataclass(frozen=True)
class Cycle:
    """The heat cycle's states (see the module docstring)."""

    states: dict[str, State]
    relaxation: float  # P_QR at the hot state
    relaxation_basis: str
    creep: np.ndarray  # gasket thickness lost per sector [m] (the whole gasket's)

    def __getitem__(self, name: str) -> State:
        return self.states[name]


def relaxation_basis(spec: FlangeSpec, T: float) -> tuple[float, str]:
    """The relaxation factor at gasket temperature ``T`` and where it comes from."""
    g = spec.gasket
    P = g.relaxation(T, spec.T_assembly)
    if g.relaxation_given is not None:
        return P, "given in the file (gasket.relaxation)"
    lo, hi = g.relax_temperature[0], g.relax_temperature[-1]
    how = "interpolated in" if lo <= T <= hi else "held at the end of"
    return P, (
        f"P_QR = {P:.3g} at {T - 273.15:.4g} degC, {how} the gasket type's table "
        f"({lo - 273.15:g}..{hi - 273.15:g} degC; {g.service_source or 'no source'})"
    )


def heat_cycle(ring: Ring, hot: Conditions | None = None) -> Cycle:
    """Run the heat cycle on ``ring`` (assembled; it is left in the shut-down state).

    ``hot``: the hot state's conditions (default: the file's service state)."""
    spec = ring.spec
    hot = hot or service_conditions(spec)
    split = loads(spec, ring.rotation)
    cold = Conditions(spec.T_assembly, spec.T_assembly, spec.T_assembly)
    start = solve_state(ring, "start_up", hot, split)
    P, basis = relaxation_basis(spec, hot.T_gasket)
    relaxed = relax(ring, start, split, P)
    cooled = solve_state(ring, "cooled", cold, split)
    shut = solve_state(
        ring, "shut_down", Conditions(cold.T_flange, cold.T_bolt, cold.T_gasket, 0.0), split
    )
    creep = creep_lost(ring)
    return Cycle(
        {"start_up": start, "hot": relaxed, "cooled": cooled, "shut_down": shut},
        P,
        basis,
        creep,
    )


def creep_lost(ring: Ring) -> np.ndarray:
    """Gasket thickness lost to creep in each sector [m], of the whole gasket (the ring
    model of a flange pair holds half the gasket)."""
    c = ring.creep if ring.creep is not None else np.zeros(ring.n)
    return c * (2.0 if ring.spec.mating == "flange" else 1.0)


def snapshot(ring: Ring) -> Ring:
    """A copy of the ring's state that solves on its own (the network is shared and set
    afresh by every solve)."""
    out = copy.copy(ring)
    out.bolt_free = ring.bolt_free.copy()
    out.c_max = ring.c_max.copy()
    out.creep = None if ring.creep is None else ring.creep.copy()
    return out
