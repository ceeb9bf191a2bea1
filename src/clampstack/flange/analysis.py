"""Gasketed flange: ASME VIII-1 Appendix 2 bolt loads, gasket stress window, tightening passes.

Model (our own, stated in docs/theory.md):

* **Ring network.**  N bolt sectors; node ``U_i`` is the flange ring at bolt i,
  node ``F_i`` the flange face over the gasket in sector i, node ``P`` the plane
  of symmetry of an identical flange pair (or the rigid mating face), fixed.
  Per sector: the bolt ``P-U_i`` (tension only; for a pair the half bolt,
  stiffness ``2/delta_S``), the flange plate under the bolt ``U_i-F_i``
  (VDI 2230-1 cone over the flange thickness), the gasket sector ``P-F_i``
  (compression only, non-linear, history dependent).  Neighbouring bolts are
  coupled through the ring, ``U_i-U_i+1``, with the stiffness of a fixed-guided
  beam of the ring's cross-section over one bolt pitch, ``12 E I / s^3``
  (Roark's Formulas for Stress and Strain, beam table, fixed-guided end; from
  memory).  This is what makes tightening one bolt unload its neighbours.
* **Gasket.**  Stress against compression strain from the gasket's loading
  curve; on unloading it springs back along the stiffer unloading modulus from
  the largest compression reached; reloading follows the same line back up.
* **Loads.**  Hydrostatic end force ``H = pi/4 G^2 P`` and external axial force
  shared equally, bending moment as ``4 M cos(theta_i) / (N D_bc)`` per bolt,
  all applied to the flange face ``F_i``.

Bolt loads follow ASME BPVC VIII-1 Appendix 2 (2-5): ``b0 = N/2`` for a flat
ring gasket on a raised face, ``b = b0`` for ``b0 <= 1/4 in``, else
``b = 0.5 sqrt(b0)`` (inches); ``G`` the mean contact diameter, or the contact
OD minus ``2b``; ``H = 0.785 G^2 P``, ``H_p = 2 b pi G m P``,
``W_m1 = H + H_p``, ``W_m2 = pi b G y``, ``A_m = max(W_m1/S_b, W_m2/S_a)``.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass, field
from typing import Any

import numpy as np

from ..catalog import yield_at_temperature
from ..components import (
    bolt_resilience,
    clamped_resilience,
    permissible_preload,
    tightening_factor,
)
from ..display import Shown
from ..errors import InputError
from ..joint.checks import Check
from ..joint.prepare import torque_preload_range
from ..network import CURVE, LINEAR, TENSION, Network
from ..network.core import _CurveTable
from .loads import App2, asme_app2, load_split, working_loads
from .model import FlangeSpec

ROTATION_LIMIT_DEG = 0.2  # ASME VIII-1 App. 2-14: K_L = 0.2 for loose flanges (from memory)
PCC1_RANGE = (0.40, 0.70)  # ASME PCC-1 practice: assembly bolt stress / yield (from memory)


# --------------------------------------------------------------------------- ASME App. 2


# --------------------------------------------------------------------------- cross pattern


#: ASME PCC-1 legacy cross-pattern tightening sequences (bolts numbered 1..N clockwise),
#: ASME PCC-1-2013 Table 4 "Legacy cross-pattern tightening sequence and bolt-numbering
#: system" (from memory).
PCC1_LEGACY: dict[int, tuple[int, ...]] = {
    4: (1, 3, 2, 4),
    8: (1, 5, 3, 7, 2, 6, 4, 8),
    12: (1, 7, 4, 10, 2, 8, 5, 11, 3, 9, 6, 12),
    16: (1, 9, 5, 13, 3, 11, 7, 15, 2, 10, 6, 14, 4, 12, 8, 16),
    20: (1, 11, 6, 16, 3, 13, 8, 18, 5, 15, 10, 20, 2, 12, 7, 17, 4, 14, 9, 19),
    24: (1, 13, 7, 19, 4, 16, 10, 22, 2, 14, 8, 20, 5, 17, 11, 23, 3, 15, 9, 21, 6, 18, 12, 24),
}


def _quarter_offsets(q: int) -> list[int]:
    """Offsets of the groups of four in a PCC-1-style pattern of ``4 q`` bolts.

    The tabulated sequences of 8-24 bolts tighten groups of four bolts 90 degrees apart
    (``1 + k``, ``1 + k + 2q``, ``1 + k + q``, ``1 + k + 3q``); the offsets ``k`` of the
    groups follow ``0, q/2, 1, 1 + q/2, ...`` for even ``q`` and steps of ``(q - 1)/2``
    for odd ``q`` (which reproduces every tabulated sequence).
    """
    if q % 2 == 0:
        return [k for i in range(q // 2) for k in (i, i + q // 2)]
    step = max((q - 1) // 2, 1)
    out: list[int] = []
    k = 0
    while len(out) < q:
        while k in out:
            k = (k + 1) % q
        out.append(k)
        k = (k + step) % q
    return out


def cross_order(n: int) -> list[int]:
    """Cross-pattern tightening order for ``n`` bolts, 0-based (see :func:`cross_rule`).

    4, 8, 12, 16, 20 and 24 bolts: the ASME PCC-1 legacy sequence (:data:`PCC1_LEGACY`).
    Other multiples of four: the same construction (groups of four bolts 90 degrees apart,
    group offsets as in :func:`_quarter_offsets`), our extension of the tabulated rows.
    Any other count: greedy star, the next bolt being the one farthest (angularly) from
    every bolt already tightened, ties to the bolt most nearly opposite the last one, then
    to the lower number (common practice, no source); O(n^2).
    """
    if n in PCC1_LEGACY:
        return [b - 1 for b in PCC1_LEGACY[n]]
    if n % 4 == 0 and n > 0:
        q = n // 4
        return [k + j * q for k in _quarter_offsets(q) for j in (0, 2, 1, 3)]
    idx = np.arange(n)

    def ring_dist(a: np.ndarray, b: int) -> np.ndarray:
        d = np.abs(a - b) % n
        return np.minimum(d, n - d)

    done = [0]
    left = np.ones(n, dtype=bool)
    left[0] = False
    nearest = ring_dist(idx, 0)  # distance to the nearest tightened bolt
    while left.any():
        cand = np.flatnonzero(left)
        m = nearest[cand]
        top = cand[m == m.max()]
        if top.size > 1:
            dl = ring_dist(top, done[-1])
            top = top[dl == dl.max()]
        best = int(top.min())
        done.append(best)
        left[best] = False
        nearest = np.minimum(nearest, ring_dist(idx, best))
    return done


def cross_rule(n: int) -> str:
    """The rule :func:`cross_order` follows for ``n`` bolts, as printed with the passes."""
    if n in PCC1_LEGACY:
        return f"ASME PCC-1 legacy cross pattern for {n} bolts (PCC-1-2013 Table 4, from memory)"
    if n % 4 == 0:
        return (
            f"cross pattern for {n} bolts built as ASME PCC-1's legacy pattern (groups of four "
            "bolts 90 degrees apart); PCC-1's own table was not at hand for this count"
        )
    return (
        f"star pattern for {n} bolts: each next bolt the farthest from those already "
        "tightened (common practice, no source); PCC-1 tabulates multiples of four"
    )


# --------------------------------------------------------------------------- the ring model


@dataclass
class Ring:
    """The flange ring network and its state (gasket history, bolt misfits)."""

    spec: FlangeSpec
    n: int
    k_bolt: float  # per bolt in the model (half bolt for a pair)
    k_flange: float
    k_ring: float
    gasket_thickness: float  # in the model (half for a pair)
    sector_area: float
    node_U: np.ndarray
    node_F: np.ndarray
    n_nodes: int
    bolt_free: np.ndarray  # free elongation (misfit) of each bolt part [m]
    c_max: np.ndarray  # largest gasket compression reached per sector [m]
    thermal_bolt: float = 0.0
    thermal_flange: float = 0.0
    scale_k: tuple[float, float] = (1.0, 1.0)  # modulus ratio (bolt, flange) at temperature
    solves: int = 0
    last_u: np.ndarray | None = None  # previous displacements: the next solve starts there
    k_plate: float = 0.0  # flange plate under the bolt alone (VDI 2230-1 cone) [N/m]
    lever: float = 0.0  # h_G: bolt circle to the gasket reaction circle [m]
    rotation_stiffness: float = math.inf  # K_theta of one flange ring [N m/rad]; inf: off
    thermal_gasket: float = 0.0  # free thermal growth of the gasket in the model [m]
    creep: np.ndarray | None = None  # gasket thickness lost to creep, per sector [m]
    phi: float = 0.0  # h_G theta of the last solve: the ring's rotation at the lever [m]

    @property
    def rotation(self) -> bool:
        """Whether the flange rings rotate (a finite rotational stiffness)."""
        return math.isfinite(self.rotation_stiffness)

    def gasket_free(self) -> np.ndarray:
        """Free elongation of each gasket sector: thermal growth less creep [m]."""
        g = np.full(self.n, self.thermal_gasket)
        return g if self.creep is None else g - self.creep

    def rotations(self, sol: Any = None) -> np.ndarray:
        """Rotation of the flange ring at each bolt after the last solve [rad].

        The ring turns as a whole (:meth:`_parts`): ``theta = phi / h_G``, positive where
        it turns its bolt side toward the mating face.  Zero without rotation.
        """
        if not self.rotation:
            return np.zeros(self.n)
        return np.full(self.n, self.phi / self.lever)

    # ---- structure
    @property
    def node_phi(self) -> int:
        """The rotation node (``u = -phi``), the last node; -1 without rotation."""
        return self.n_nodes - 1 if self.rotation else -1

    def face(self, u: np.ndarray) -> np.ndarray:
        """Displacement of the flange face over the gasket in each sector [m].

        With rotation, node F carries the face less the ring's turn at the lever
        (``u_face - phi``) and the face is ``u[F] - u[phi]``."""
        if not self.rotation:
            return u[self.node_F]
        return u[self.node_F] - u[self.node_phi]

    def _parts(self, skip_bolt: int | None = None):
        """Parts of the ring network: bolts, plates, gasket sectors, ring beams (and the
        rotation).

        With rotation the ring's turn ``phi = h_G theta`` (the same at every bolt) is one
        more node, exactly: node F_i carries ``v_i = u_face - phi``, so the plate is the
        two-node spring F_i-U_i, each gasket sector runs from the rotation node (``u =
        -phi``) to F_i (its elongation ``v_i + phi`` is the face's), and the ring's
        twisting stiffness is the spring ``K_theta / h_G^2`` from the rotation node to the
        fixed plane (its energy ``K_theta theta^2 / 2``); loads on the face act on F_i and,
        with the opposite sign, on the rotation node.  Stationarity in phi is the moment
        balance ``K_theta theta = h_G sum c_i`` (c_i the plates' compressions).
        """
        n = self.n
        bolts = [i for i in range(n) if i != skip_bolt]
        g0 = self.node_phi if self.rotation else 0
        # the flange plate runs from the gasket face F (below) up to the nut bearing U, so
        # that its thermal growth is a positive free elongation along the axis
        i_nodes = [0] * len(bolts) + list(self.node_F) + [g0] * n + list(self.node_U)
        j_nodes = (
            list(self.node_U[bolts])
            + list(self.node_U)
            + list(self.node_F)
            + list(np.roll(self.node_U, -1))
        )
        kb = self.k_bolt * self.scale_k[0]
        kf = self.k_flange * self.scale_k[1]
        kr = self.k_ring * self.scale_k[1]
        k = [kb] * len(bolts) + [kf] * n + [1.0] * n + [kr] * n
        d0 = (
            list(self.bolt_free[bolts] + self.thermal_bolt)
            + [self.thermal_flange] * n
            + list(self.gasket_free())
            + [0.0] * n
        )
        beh = [TENSION] * len(bolts) + [LINEAR] * n + [CURVE] * n + [LINEAR] * n
        if self.rotation:
            i_nodes.append(0)
            j_nodes.append(self.node_phi)
            k.append(self.k_twist * self.scale_k[1])
            d0.append(0.0)
            beh.append(LINEAR)
        gasket_parts = np.arange(len(bolts) + n, len(bolts) + 2 * n)
        return bolts, i_nodes, j_nodes, k, d0, beh, gasket_parts

    @property
    def k_twist(self) -> float:
        """The ring's twisting stiffness at the lever, ``K_theta / h_G^2`` [N/m]."""
        return self.rotation_stiffness / self.lever**2

    def _gasket_law(self) -> tuple[np.ndarray, np.ndarray, float, float]:
        """The sector's loading curve in descending compression (compression [m], force
        [N]), its unloading stiffness and last slope [N/m] (computed once per ring)."""
        law = getattr(self, "_law", None)
        if law is None:
            g = self.spec.gasket
            t, A = self.gasket_thickness, self.sector_area
            cs = np.asarray(g.curve_strain) * t  # compressions on the loading curve
            Fs = np.asarray(g.curve_stress) * A
            last_slope = float((Fs[-1] - Fs[-2]) / (cs[-1] - cs[-2]))
            law = self._law = (
                cs[::-1].copy(),
                Fs[::-1].copy(),
                g.unload_modulus * A / t,
                last_slope,
            )
        return law

    def gasket_table(
        self, parts: np.ndarray, held: Sequence[tuple[int, float]] = ()
    ) -> _CurveTable:
        """Sector laws with their unloading history, as one vectorised curve table.

        Each ``(part, force)`` of ``held`` adds one row of constant force (a bolt held at
        its target while it is tightened, or by its tensioner)."""
        cs_desc, Fs_desc, k_un, last_slope = self._gasket_law()
        n = self.n
        c_max = self.c_max
        cs, Fs = cs_desc[::-1], Fs_desc[::-1]
        # force on the loading curve at the largest compression reached (extrapolated)
        F_at = np.where(
            c_max <= cs[-1], np.interp(c_max, cs, Fs), Fs[-1] + last_slope * (c_max - cs[-1])
        )
        # unloading line: from (c_max, F_at) down to zero at c_max - F_at/k_un
        c0 = np.maximum(c_max - F_at / k_un, 0.0)
        m = cs.size + 2
        # each row, as ascending elongations (x = -c): the loading points beyond c_max (the
        # largest compressions first), then (c_max, F_at), then (c0, 0) where there is a
        # history; +inf pads the rest
        kc = (cs_desc[None, :] > c_max[:, None]).sum(axis=1)  # points beyond c_max
        p = np.arange(m)[None, :]
        on_curve = p < kc[:, None]
        pc = np.minimum(p, cs.size - 1)
        has_hist = (c_max > 0)[:, None]
        at_max = p == kc[:, None]
        at_zero = (p == kc[:, None] + 1) & has_hist
        X = np.where(
            on_curve,
            -cs_desc[pc],
            np.where(at_max, -c_max[:, None], np.where(at_zero, -c0[:, None], np.inf)),
        )
        Fv = np.where(on_curve, -Fs_desc[pc], np.where(at_max, -F_at[:, None], 0.0))
        below = np.full(n, last_slope)
        above = np.zeros(n)
        if held:
            h = len(held)
            row_x = np.full((h, m), np.inf)
            row_x[:, 0] = 0.0
            X = np.vstack((X, row_x))
            Fv = np.vstack((Fv, np.repeat([[f] for _, f in held], m, axis=1)))
            parts = np.append(parts, [p for p, _ in held])
            below, above = np.append(below, np.zeros(h)), np.append(above, np.zeros(h))
        return _CurveTable.from_arrays(parts, X, Fv, below, above)

    def _network(self) -> Network:
        """The ring network with every part in place (built once, updated in place)."""
        net = getattr(self, "_net", None)
        if net is None:
            _, i_n, j_n, k, d0, beh, gparts = self._parts(None)
            net = Network.from_arrays(
                self.n_nodes, i_n, j_n, k, d0, beh, fixed=[0], curve_table=self.gasket_table(gparts)
            )
            self._net = net
        return net

    def solve(
        self,
        loads_F: np.ndarray,
        held: Sequence[tuple[int, float]] = (),
        loads_U: np.ndarray | None = None,
    ):
        """Solve the ring; each ``(bolt, force)`` of ``held`` holds that bolt at that force.

        ``loads_F`` act on the flange face over the gasket, ``loads_U`` on the ring at the
        bolt circle (the lever shares of a load between them, :func:`load_split`)."""
        n = self.n
        net = self._network()
        rot = self.rotation
        base = getattr(self, "_base", None)
        if base is None or base[0] != self.scale_k:
            kb = self.k_bolt * self.scale_k[0]
            kf = self.k_flange * self.scale_k[1]
            kr = self.k_ring * self.scale_k[1]
            parts = [np.full(n, kb), np.full(n, kf), np.ones(n), np.full(n, kr)]
            laws = [np.full(n, TENSION), np.full(n, LINEAR), np.full(n, CURVE), np.full(n, LINEAR)]
            if rot:
                parts.append(np.array([self.k_twist * self.scale_k[1]]))
                laws.append(np.array([LINEAR]))
            base = self._base = (
                self.scale_k,
                np.concatenate(parts),
                np.concatenate(laws).astype(np.int8),
            )
        net.k = base[1]
        free = np.zeros(4 * n + (1 if rot else 0))
        free[:n] = self.bolt_free + self.thermal_bolt
        free[n : 2 * n] = self.thermal_flange
        g_free = self.gasket_free()
        free[2 * n : 3 * n] = g_free
        net.free_elongation = free
        beh = base[2].copy()
        gparts = np.arange(2 * n, 3 * n)
        for b, _ in held:
            # a bolt being tightened carries exactly its target: a constant-force law
            beh[b] = CURVE
        net.behaviour = beh
        # the table changes only with the unloading history and the held bolts: reuse it
        key = (self.c_max.tobytes(), tuple(held))
        cached = getattr(self, "_table_cache", None)
        if cached is None or cached[0] != key:
            cached = self._table_cache = (key, self.gasket_table(gparts, held))
        else:
            self.table_reuses = getattr(self, "table_reuses", 0) + 1
        net.curve_table = cached[1]
        loads = np.zeros(self.n_nodes)
        loads[self.node_F] += loads_F
        if rot:
            loads[self.node_phi] -= float(np.sum(loads_F))
        if loads_U is not None:
            loads[self.node_U] += loads_U
        sol = net.solve(loads, start=self.last_u)
        self.solves += 1
        u = sol.displacement
        self.last_u = u
        if rot:
            self.phi = -float(u[self.node_phi])
        comp = np.maximum(g_free - self.face(u), 0.0)  # mechanical compression
        self.c_max = np.maximum(self.c_max, comp)
        bolt_force = sol.force[:n].copy()
        gasket_force = -sol.force[gparts]
        return u, bolt_force, gasket_force, sol

    def tighten(self, bolt: int, target: float, loads_F: np.ndarray) -> np.ndarray:
        """Turn one nut until its bolt carries ``target`` (never loosen); bolt forces after."""
        u, forces, _, _ = self.solve(loads_F, [(bolt, target)])
        new_free = (
            u[self.node_U[bolt]] - target / (self.k_bolt * self.scale_k[0]) - (self.thermal_bolt)
        )
        if new_free < self.bolt_free[bolt]:
            self.bolt_free[bolt] = new_free
            return forces
        # already tighter than the target: the nut does not turn
        return self.solve(loads_F)[1]

    def tension(
        self, bolts: Sequence[int], applied: float, loss: float, loads_F: np.ndarray
    ) -> np.ndarray:
        """Hydraulic tensioners on ``bolts`` at once: pull each to ``applied``, run the nuts
        down, let go; bolt forces after.

        A nut turns only where the tool stretches its bolt beyond what the nut already
        holds; on release each turned nut's bolt loses the free elongation ``loss`` (the
        load transfer: nut thread and bearing deflect as the nut takes the load).
        """
        active = np.asarray(bolts, dtype=np.int64)
        kb = self.k_bolt * self.scale_k[0]
        for _ in range(len(active) + 1):
            if active.size == 0:
                return self.solve(loads_F)[1]
            u, _, _, _ = self.solve(loads_F, [(int(b), applied) for b in active])
            pulled = u[self.node_U[active]] - applied / kb - self.thermal_bolt
            turns = pulled < self.bolt_free[active]
            if turns.all():
                self.bolt_free[active] = pulled + loss
                return self.solve(loads_F)[1]
            # a bolt already above the applied tension keeps its nut: solve again without it
            active = active[turns]
        raise AssertionError("unreachable: the active set shrinks every round")


def build_ring(spec: FlangeSpec) -> Ring:
    """Stiffnesses of the ring model (SI) and an untightened state."""
    n = spec.bolt_count
    thr = spec.thread
    g = spec.gasket
    pair = spec.mating == "flange"
    t = spec.thickness
    E_b = spec.bolt_material.E(spec.T_assembly, True)
    E_f = spec.material.E(spec.T_assembly, True)
    lK = (2 * t if pair else t) + g.thickness
    try:
        shank = [(spec.shank_length, spec.shank_diameter or thr.d)] if spec.shank_length > 0 else []
        dS = bolt_resilience(
            thr.d,
            thr.P,
            thr.d3,
            E_b,
            lK,
            shank,
            None if spec.head == "stud" else spec.head,
            "nut" if pair else "tapped",
            E_nut=spec.nut_material.E(spec.T_assembly, True) if spec.nut_material else E_b,
            E_tapped=E_f,
        ).total
        ring_width = 0.5 * (spec.ring_outer_diameter - spec.ring_inner_diameter)
        DA = max(ring_width, spec.bearing_diameter * 1.0001)
        dF = float(clamped_resilience([(t, E_f, "steel")], spec.bearing_diameter, spec.hole, DA))
    except ValueError as err:
        raise InputError(str(err), key="flange") from None
    k_bolt = (2.0 if pair else 1.0) / dS  # half bolt in the half model of a pair
    k_plate = 1.0 / dF
    lever = 0.5 * (spec.bolt_circle - asme_app2(spec).G)  # h_G, App. 2-3
    K_theta = ring_rotation_stiffness(spec, E_f) if spec.rotation else math.inf
    pitch = math.pi * spec.bolt_circle / n
    I_ring = ring_width * t**3 / 12
    k_ring = 12 * E_f * I_ring / pitch**3
    # node numbering: zig-zag round the ring keeps the stiffness matrix narrow
    zig = []
    lo, hi = 0, n - 1
    while lo <= hi:
        zig.append(lo)
        if hi != lo:
            zig.append(hi)
        lo, hi = lo + 1, hi - 1
    pos = np.empty(n, dtype=np.int64)
    pos[zig] = np.arange(n)
    node_U = 1 + 2 * pos
    node_F = 2 + 2 * pos
    return Ring(
        spec=spec,
        n=n,
        k_bolt=k_bolt,
        k_flange=k_plate,
        k_ring=k_ring,
        gasket_thickness=g.thickness / 2 if pair else g.thickness,
        sector_area=g.area / n,
        node_U=node_U,
        node_F=node_F,
        n_nodes=2 * n + (2 if spec.rotation else 1),
        bolt_free=np.zeros(n),
        c_max=np.zeros(n),
        k_plate=k_plate,
        lever=lever,
        rotation_stiffness=K_theta,
    )


def ring_rotation_stiffness(spec: FlangeSpec, E: float) -> float:
    """Rotational stiffness K_theta of one flange ring under a uniform twisting moment [N m/rad].

    Ring theory: a ring of rectangular section (thickness t, inner and outer radius a, b)
    turned through theta about its centroid circle carries the hoop stress
    ``E theta z / r``; its energy gives ``K_theta = E t^3 / 12 * 2 pi ln(b/a)`` for the
    whole circumference, the exact form for a rectangular section of the thin-ring result
    ``theta = M_t R^2 / (E I)`` (M_t per unit length of the centroid circle; Timoshenko,
    Strength of Materials, Part II, "twisting of a ring by couples uniformly distributed
    along its centre line"; Roark's Formulas for Stress and Strain, rings under a
    distributed twisting moment; both from memory).  The bolt holes carry no hoop stress:
    each removes ``pi d_h^2 / (4 R_bc^2)`` from ``2 pi ln(b/a)`` (the same energy integral,
    ``dr dphi = dA / r``, over the hole at the bolt circle; our approximation).
    """
    a = 0.5 * spec.ring_inner_diameter
    b = 0.5 * spec.ring_outer_diameter
    Rb = 0.5 * spec.bolt_circle
    log_part = 2 * math.pi * math.log(b / a) - spec.bolt_count * math.pi * spec.hole**2 / (
        4 * Rb**2
    )
    return E * spec.thickness**3 / 12 * log_part


@dataclass(frozen=True)
class TighteningBasis:
    """What the tightening of a flange stands on, before any ring solve (SI)."""

    k_torque: Any  # (mu_G, mu_K) -> torque per unit preload [m] (VDI 2230-1 R13)
    FMzul: float  # permissible assembly preload [N]
    crush: float  # gasket crush limit per sector [N]
    F_rot: float  # rotation-limited nominal preload [N]
    hi_w: float  # top of the preload window [N]
    hi_reason: str
    bolt_reason: str
    rot_reason: str
    torque_range: (
        tuple[Any, float, float, float] | None
    )  # method torque: torque, F_M,min/max, alpha


def tightening_basis(spec: FlangeSpec) -> TighteningBasis:
    """Permissible preload, the window's top and (method torque) the torque and its preload range.

    VDI 2230-1:2015 R7 (permissible preload) and R13 (tightening torque); the window's top
    is the least of the gasket crush limit, the permissible preload and the rotation
    limit (:func:`rotation_limited_preload`).  Cheap: no ring is solved, so sizing screens
    candidates with it.
    """
    thr, g, n = spec.thread, spec.gasket, spec.bolt_count
    DKm = 0.5 * (spec.bearing_diameter + spec.hole)

    def k_torque(muG: float, muK: float) -> float:
        return 0.16 * thr.P + 0.58 * thr.d2 * muG + 0.5 * muK * DKm

    Rp = spec.grade.Rp02
    muG_lo = spec.thread_friction[0]
    if spec.method == "tension":
        FMzul = spec.utilization * Rp * thr.As
    else:
        FMzul = float(
            permissible_preload(thr.As, thr.ds, thr.d2, thr.P, Rp, muG_lo, spec.utilization)
        )
    crush = g.max_stress * g.area / n
    bolt_reason = "bolt permissible preload"
    if spec.method == "tension":  # the window's top follows from the tensioning
        bolt_reason = (
            "bolt permissible preload reached by the tensioner's largest pull (x load transfer "
            "and interaction)"
        )
    F_rot = rotation_limited_preload(spec)
    rot_reason = f"flange rotation limit ({ROTATION_LIMIT_DEG:g} deg, ASME App. 2-14)"
    hi_w, hi_reason = min((crush, "gasket crush limit"), (FMzul, bolt_reason), (F_rot, rot_reason))
    rng = None
    if spec.method == "torque":
        torque, FM_min, FM_max, alpha, _, _ = torque_preload_range(
            spec.torque,
            spec.preload,
            hi_w,
            k_torque,
            spec.thread_friction,
            spec.head_friction,
            spec.torque_tolerance,
            spec.scatter,
        )
        rng = (torque, FM_min, FM_max, alpha)
    return TighteningBasis(
        k_torque, FMzul, crush, F_rot, hi_w, hi_reason, bolt_reason, rot_reason, rng
    )


def rotation_limited_preload(spec: FlangeSpec) -> float:
    """The largest nominal preload per bolt that keeps the ring within the rotation limit [N].

    From the moment balance of the ring (:meth:`Ring._parts`): after assembly the plates
    carry the bolt loads, ``theta = h_G sum F / K_theta``; in service the loads shared onto
    the bolt circle (``f_U`` of :func:`load_split`, negative for the end force inside the
    gasket) add ``-sum f_U`` to the plates, with K_theta at the flange temperature; the
    bolts' own change in service is not counted.  Infinite without rotation.
    """
    if not spec.rotation:
        return math.inf
    G = asme_app2(spec).G
    h = 0.5 * (spec.bolt_circle - G)
    lim = math.radians(ROTATION_LIMIT_DEG)
    K0 = ring_rotation_stiffness(spec, spec.material.E(spec.T_assembly, True))
    K1 = ring_rotation_stiffness(spec, spec.material.E(spec.T_flange, True))
    at_U, _ = load_split(spec, G, True)
    return min(lim * K0 / h, lim * K1 / h + float(np.sum(at_U))) / spec.bolt_count


# --------------------------------------------------------------------------- sequences


def pass_orders(spec: FlangeSpec) -> list[list[int]]:
    """The bolt order of every pass (0-based)."""
    out = []
    for pattern in spec.patterns:
        if pattern == "cross":
            out.append(cross_order(spec.bolt_count))
        elif pattern == "circular":
            out.append(list(range(spec.bolt_count)))
        else:
            assert spec.order is not None
            out.append(list(spec.order))
    return out


def simulate_passes(
    ring: Ring, targets: np.ndarray, fractions: tuple[float, ...], orders: list[list[int]]
) -> list[np.ndarray]:
    """Tighten pass after pass (each bolt to its fraction of its target); forces after each."""
    zero = np.zeros(ring.n)
    out = []
    forces = np.zeros(ring.n)
    for frac, order in zip(fractions, orders, strict=True):
        for b in order:
            forces = ring.tighten(b, frac * targets[b], zero)
        out.append(forces.copy())
    return out


@dataclass(frozen=True)
class Tensioning:
    """A hydraulic-tensioning sequence and what it leaves (SI)."""

    coverage: str  # all | half | sequence
    load_transfer_factor: float  # residual / applied tension of one bolt with its sector
    load_transfer_basis: str
    sets: list[list[int]]  # bolts (0-based) tensioned in each pass
    applied: list[float]  # applied tension of each pass [N]
    passes: list[np.ndarray]  # bolt forces after each pass [N]
    peak: np.ndarray  # each bolt's largest force during the passes (the tool's pull) [N]
    labels: list[str]  # what each pass is
    residual: float  # nominal residual preload per bolt [N]

    @property
    def overtension(self) -> float:
        """Applied tension of the first pass over that of the last (1 unless "half")."""
        return self.applied[0] / self.applied[-1]

    def to_dict(self) -> dict[str, Any]:
        return {
            "coverage": self.coverage,
            "load_transfer_factor": self.load_transfer_factor,
            "load_transfer_basis": self.load_transfer_basis,
            "applied_tension_N": list(self.applied),
            "overtension_ratio": self.overtension,
            "passes": list(self.labels),
        }


def load_transfer(spec: FlangeSpec) -> tuple[float, str]:
    """Load transfer factor of the flange bolts: given, or 1 / (1 + d / l_K).

    l_K is the grip (both rings and the gasket for a pair); tensioner practice, from
    memory, as for a joint (the loss grows as the grip shortens); the tool maker's data
    govern.
    """
    if spec.load_transfer_factor is not None:
        return spec.load_transfer_factor, "given"
    pair = spec.mating == "flange"
    lK = (2 * spec.thickness if pair else spec.thickness) + spec.gasket.thickness
    return 1.0 / (1.0 + spec.thread.d / lK), (
        "1 / (1 + d / l_K) (tensioner practice, from memory; use the tool maker's data)"
    )


def transfer_loss(ring: Ring, ltf: float) -> float:
    """Free elongation lost per unit applied tension when a tensioner lets go [m/N].

    Defined so that one bolt with its own flange plate and gasket sector (unloading along
    the gasket's unloading modulus) keeps ``ltf`` of the applied tension:
    loss = (1 - LTF) x (1/k_bolt + 1/k_flange + t_g / (E_un A_sector) + N h_G^2/K_theta)
    (the last term the sector's share of the ring's rotation); our model of the load
    transfer, the ring's interaction comes on top.
    """
    g = ring.spec.gasket
    c = (
        1.0 / ring.k_bolt
        + 1.0 / ring.k_flange
        + ring.gasket_thickness / (g.unload_modulus * ring.sector_area)
    )
    if ring.rotation:  # the sector's share of the ring's rotation, N h_G^2 / K_theta
        c += ring.n * ring.lever**2 / ring.rotation_stiffness
    return (1.0 - ltf) * c


def simulate_tensioning(
    spec: FlangeSpec,
    residual: float | None,
    orders: list[list[int]],
    hint: Tensioning | None = None,
    pull: float | None = None,
) -> tuple[Tensioning, Ring]:
    """Tension the flange's bolts to a nominal residual preload ``residual`` [N] per bolt,
    or, with ``residual=None``, with the largest applied tension ``pull`` [N].

    * ``all``: a tensioner on every bolt, one pass at ``residual / LTF``.
    * ``half``: every other bolt (1, 3, 5, ...), then the others, then a check pass on the
      first set at the second set's tension (common practice of 50 % tool coverage, from
      memory).  The first pass is overtensioned so that both sets end with the same mean
      preload after the second pass (the overtension found by the secant method on the
      ring model); that mean is the nominal residual; the check pass turns only nuts that
      are still short.
    * ``sequence``: one tool, bolt by bolt, in the order and fractions of the passes; the
      nominal residual is LTF x the last pass's tension.

    ``hint``: a sequence of the same spec at another level; its overtension starts the
    search (secant on the overtension with the pull held; for a given residual, a secant
    on the pull around it).  Returns the sequence and the ring in its state after the last pass.
    """
    if (residual is None) == (pull is None):
        raise ValueError("give the residual preload or the largest pull, not both")
    mode = spec.tensioning or "all"
    n = spec.bolt_count
    ltf, basis = load_transfer(spec)
    zero = np.zeros(n)

    def run(
        sets: list[list[int]], applied: list[float]
    ) -> tuple[list[np.ndarray], np.ndarray, Ring]:
        ring = build_ring(spec)
        loss = transfer_loss(ring, ltf)
        out, peak = [], np.zeros(n)
        for bolts, F in zip(sets, applied, strict=True):
            # one tool moves bolt by bolt; otherwise the tools of a pass act together
            for group in [[b] for b in bolts] if mode == "sequence" else [bolts]:
                f = ring.tension(group, F, loss * F, zero)
                peak = np.maximum(peak, f)
                peak[group] = np.maximum(peak[group], F)
            out.append(f.copy())
        return out, peak, ring

    if mode == "all":
        F_a = residual / ltf if residual is not None else pull
        sets, applied, labels = [list(range(n))], [F_a], ["all bolts at once"]
        nominal = ltf * F_a
    elif mode == "sequence":
        top = max(spec.passes)
        F_a = residual / ltf if residual is not None else pull / top
        sets = [list(o) for o in orders]
        applied = [f * F_a for f in spec.passes]
        labels = [f"bolt by bolt, {p}" for p in spec.patterns]
        nominal = ltf * F_a
    else:
        first, second = list(range(0, n, 2)), list(range(1, n, 2))
        sets = [first, second, first]
        labels = [
            "bolts 1, 3, 5, ... (overtensioned)",
            "bolts 2, 4, 6, ...",
            "check pass on bolts 1, 3, 5, ...",
        ]
        if residual is not None:
            # the pull that leaves the residual: secant on the pull (the mean after the
            # second pass is nearly proportional to it), each a search on r alone
            p0 = residual / ltf * (hint.overtension if hint else 1.3)
            t0, _ = simulate_tensioning(spec, None, orders, hint=hint, pull=p0)
            p1 = p0 * residual / t0.residual
            for _ in range(30):
                t1, _ = simulate_tensioning(spec, None, orders, hint=t0, pull=p1)
                if abs(t1.residual / residual - 1) < 1e-8 or t1.residual == t0.residual:
                    break
                p0, p1, t0 = (
                    p1,
                    p1 + (residual - t1.residual) * (p1 - p0) / (t1.residual - t0.residual),
                    t1,
                )
            applied, nominal = list(t1.applied), residual
        else:

            def gap(r: float) -> tuple[float, float]:
                """(gap between the sets' means / pull, mean) after the second pass."""
                p, _, _ = run(sets[:2], [pull, pull / r])
                a, b = float(np.mean(p[-1][first])), float(np.mean(p[-1][second]))
                return (a - b) / pull, 0.5 * (a + b)

            if hint is not None:
                r0, r1 = hint.overtension * 0.995, hint.overtension
            else:
                r0, r1 = 1.0, 1.2
            g0, mean = gap(r0)
            for _ in range(30):
                g1, mean = gap(r1)
                if abs(g1) < 1e-8 or g1 == g0:
                    break
                r0, r1, g0 = r1, min(max(r1 - g1 * (r1 - r0) / (g1 - g0), 1.0), 3.0), g1
            applied, nominal = [pull, pull / r1, pull / r1], mean
    passes, peak, ring = run(sets, applied)
    return Tensioning(mode, ltf, basis, sets, applied, passes, peak, labels, nominal), ring


def compensated_targets(
    spec: FlangeSpec, F_final: float, order: list[int]
) -> tuple[np.ndarray, np.ndarray]:
    """Per-bolt targets of one pass in ``order`` that end with every bolt at ``F_final``.

    Linear inverse problem: with the bolt-force sensitivity ``C = dF/dd0`` of the
    ring (tangent at the uniform final state), tightening bolt j sets its misfit
    so that its force is t_j given the bolts before it; the final forces are
    ``F = C m`` and ``t = L m`` with ``L`` the part of ``C`` on and before the
    diagonal in tightening order, so ``t = L C^-1 F_final``.  The gasket is not
    linear: the targets are corrected by simulating the pass and repeating
    (at most 16 times) until the spread is below 1e-4.  Returns (targets, final forces).
    """
    ring = build_ring(spec)
    n = ring.n
    # uniform final state: every bolt at F_final
    u, _, _, _ = _uniform_state(ring, F_final)
    C = _sensitivity(ring, u)
    pos = np.empty(n, dtype=np.int64)
    pos[order] = np.arange(n)
    before = pos[None, :] <= pos[:, None]  # bolt k tightened no later than bolt j
    L = np.where(before, C, 0.0)
    want = np.full(n, F_final)
    m = np.linalg.solve(C, want)
    t = L @ m
    final = np.zeros(n)
    for _ in range(16):  # linear convergence, about 0.4 per step
        r = build_ring(spec)
        final = simulate_passes(r, t, (1.0,), [order])[-1]
        err = want - final
        if np.max(np.abs(err)) <= 1e-4 * F_final:
            break
        t = t + L @ np.linalg.solve(C, err)
    return t, final


def _uniform_state(ring: Ring, F: float):
    """Solve the ring with every bolt replaced by the force F (a fresh ring)."""
    bolts, i_n, j_n, k, d0, beh, gparts = ring._parts(None)
    nb = len(bolts)
    keep = np.ones(len(k), dtype=bool)
    keep[:nb] = False
    loads = np.zeros(ring.n_nodes)
    loads[ring.node_U] -= F
    table = ring.gasket_table(gparts - nb)
    net = Network.from_arrays(
        ring.n_nodes,
        np.array(i_n)[keep],
        np.array(j_n)[keep],
        np.array(k)[keep],
        np.array(d0)[keep],
        np.array(beh)[keep],
        fixed=[0],
        curve_table=table,
    )
    sol = net.solve(loads)
    return sol.displacement, None, None, sol


def _sensitivity(ring: Ring, u: np.ndarray) -> np.ndarray:
    """Tangent bolt-force sensitivity C = dF_bolt/d(misfit) at displacements u (dense)."""
    n = ring.n
    N = ring.n_nodes
    K = np.zeros((N, N))

    def add(a, b, kk):
        K[a, a] += kk
        K[b, b] += kk
        K[a, b] -= kk
        K[b, a] -= kk

    kb = ring.k_bolt
    g = ring.spec.gasket
    t = ring.gasket_thickness
    comp = np.maximum(ring.gasket_free() - ring.face(u), 0.0)
    cs = np.asarray(g.curve_strain) * t
    Fs = np.asarray(g.curve_stress) * ring.sector_area
    slopes = np.diff(Fs) / np.diff(cs)
    idx = np.clip(np.searchsorted(cs, comp, side="right") - 1, 0, slopes.size - 1)
    kg = slopes[idx]
    for i in range(n):
        add(0, ring.node_U[i], kb)
        add(ring.node_U[i], ring.node_F[i], ring.k_flange)
        add(ring.node_phi if ring.rotation else 0, ring.node_F[i], kg[i])
        add(ring.node_U[i], ring.node_U[(i + 1) % n], ring.k_ring)
    if ring.rotation:
        K[0, 0] += ring.k_twist
        K[ring.node_phi, ring.node_phi] += ring.k_twist
        K[0, ring.node_phi] -= ring.k_twist
        K[ring.node_phi, 0] -= ring.k_twist
    free = np.arange(1, N)
    Kinv = np.linalg.inv(K[np.ix_(free, free)])
    U = ring.node_U - 1
    # F = k (u_U - d0), K u = k d0 at U  ->  C = k^2 Kinv_UU - k I
    return kb * kb * Kinv[np.ix_(U, U)] - kb * np.eye(n)


# --------------------------------------------------------------------------- analysis


@dataclass(frozen=True)
class FlangeResult(Shown):
    """Everything ``clampstack flange`` reports (SI floats)."""

    spec: FlangeSpec
    app2: App2
    window: tuple[float, float]  # per-bolt preload window (low, high) [N]
    window_reasons: tuple[str, str]
    target: float  # nominal per-bolt preload of the final pass [N]
    assembly_range: tuple[float, float]
    permissible_preload: float
    alpha_A: float
    torque: tuple[float, float, float] | None
    passes: list[np.ndarray]
    orders: list[list[int]]
    final_spread: float
    compensated_targets: np.ndarray
    compensated_final: np.ndarray
    working_loads: np.ndarray
    service_bolt: np.ndarray
    service_gasket: np.ndarray
    assembly_gasket: np.ndarray
    checks: tuple[Check, ...]
    notes: tuple[str, ...]
    equilibrium_residual: float
    defaults: tuple[tuple[str, str], ...] = field(default=())
    pass_fractions: tuple[float, ...] = ()  # each pass's target (or applied tension) / final
    pass_labels: tuple[str, ...] = ()  # each pass's pattern, or which bolts a tensioner pass takes
    tensioning: Tensioning | None = None  # method tension: the tensioning sequence
    cycle: Any = None  # the heat cycle (flange.service.Cycle)
    assembly_rotation: np.ndarray | None = None  # ring rotation per bolt after the passes [rad]
    rotation_stiffness: float = math.inf  # K_theta of one ring [N m/rad]; inf: no rotation
    lever: float = 0.0  # h_G [m]
    pressure_effect: dict[str, Any] = field(default_factory=dict)
    ring: Any = field(default=None, repr=False, compare=False)  # the assembled ring (a copy)

    @property
    def ok(self) -> bool:
        return all(c.passed for c in self.checks)

    @property
    def sector_area(self) -> float:
        """Gasket area of one bolt sector [m^2]."""
        return self.spec.gasket.area / self.spec.bolt_count

    def rotation_dict(self) -> dict[str, Any]:
        """The ring rotation model and the rotations it gives (JSON)."""
        on = math.isfinite(self.rotation_stiffness)
        asm = self.assembly_rotation if self.assembly_rotation is not None else np.zeros(1)
        srv = self.cycle["start_up"].rotation if self.cycle is not None else np.zeros(1)
        return {
            "enabled": on,
            "model": (
                "ring theory, K_theta = E t^3/12 (2 pi ln(b/a) - N pi d_h^2/(4 R_bc^2)) "
                "(Timoshenko, Strength of Materials II; Roark; from memory)"
                if on
                else "off: the flange rings translate only (flange.rotation = false)"
            ),
            "stiffness_Nm_per_rad": self.rotation_stiffness if on else None,
            "lever_mm": self.lever * 1e3,
            "assembly_max_deg": float(np.degrees(np.max(np.abs(asm)))),
            "service_max_deg": float(np.degrees(np.max(np.abs(srv)))),
        }

    def cycle_dict(self) -> dict[str, Any] | None:
        """The heat cycle's states per bolt (JSON)."""
        if self.cycle is None:
            return None
        A = self.sector_area
        return {
            "relaxation_factor": self.cycle.relaxation,
            "relaxation_basis": self.cycle.relaxation_basis,
            "operating_minimum_per_sector_N": self.app2.Hp / self.spec.bolt_count,
            "operating_minimum_stress_MPa": self.app2.Hp / self.spec.bolt_count / A * 1e-6,
            "seating_stress_MPa": self.spec.gasket.y * 1e-6,
            "crush_stress_MPa": self.spec.gasket.max_stress * 1e-6,
            "gasket_creep_mm": (self.cycle.creep * 1e3).tolist(),
            "states": [self.cycle[k].to_dict(A) for k in self.cycle.states],
        }

    def _bolt_cycle(self, i: int) -> dict[str, float]:
        return _bolt_cycle_keys(self, i)

    def to_dict(self) -> dict[str, Any]:
        """JSON form per DESIGN.md (``flange --json``)."""
        s = self.spec
        a = self.app2
        n = s.bolt_count
        torque = dict.fromkeys(("nominal_Nm", "min_Nm", "max_Nm"))
        if self.torque is not None:
            torque = dict(zip(("nominal_Nm", "min_Nm", "max_Nm"), self.torque, strict=True))
        return {
            "title": s.title,
            "bolt_count": n,
            "required_bolt_load": {
                "operating_N": a.Wm1,
                "seating_N": a.Wm2,
                "hydrostatic_end_force_N": a.H,
                "gasket_load_operating_N": a.Hp,
                "required_bolt_area_mm2": a.Am * 1e6,
                "external_load_N": a.external,
                "design_N": a.W,
                "available_bolt_area_mm2": a.Ab * 1e6,
                "bolt_area_basis": a.area_basis,
            },
            "gasket": {
                "effective_width_mm": a.b * 1e3,
                "basic_width_mm": a.b0 * 1e3,
                "reaction_diameter_mm": a.G * 1e3,
                "m": s.gasket.m,
                "y_MPa": s.gasket.y * 1e-6,
                "area_mm2": s.gasket.area * 1e6,
                "assembly_stress_MPa": float(np.sum(self.assembly_gasket)) / s.gasket.area * 1e-6,
            },
            "window": {
                "preload_min_N": self.window[0],
                "preload_max_N": self.window[1],
                "min_reason": self.window_reasons[0],
                "max_reason": self.window_reasons[1],
            },
            "target_preload_N": self.target,
            "assembly_preload_min_N": self.assembly_range[0],
            "assembly_preload_max_N": self.assembly_range[1],
            "permissible_preload_N": self.permissible_preload,
            "tightening_factor": self.alpha_A,
            "tightening": {
                "method": s.method,
                "thread_friction": list(s.thread_friction),
                "head_friction": list(s.head_friction),
                "torque_tolerance": s.torque_tolerance,
                "lubricant": s.lubricant,
                "tool": s.tool,
                "nut_factor": None if s.nut_factor is None else list(s.nut_factor),
                **({"tensioning": self.tensioning.to_dict()} if self.tensioning else {}),
            },
            "target_bolt_stress_ratio": self.target / s.thread.As / float(s.grade.Rp02),
            "torque": torque,
            "bolts": [
                {
                    "bolt": i + 1,
                    "angle_deg": 360.0 * i / n,
                    "preload_N": float(self.service_bolt[i]),
                    "assembly_preload_N": float(self.passes[-1][i]),
                    "working_load_N": float(self.working_loads[i]),
                    "service_load_N": float(self.service_bolt[i]),
                    "gasket_force_assembly_N": float(self.assembly_gasket[i]),
                    "gasket_force_service_N": float(self.service_gasket[i]),
                    "compensated_target_N": _finite(self.compensated_targets[i]),
                    **self._bolt_cycle(i),
                }
                for i in range(n)
            ],
            "passes": [[float(f) for f in p] for p in self.passes],
            "pass_orders": [[b + 1 for b in o] for o in self.orders],
            "pass_fractions": list(self.pass_fractions),
            "pass_labels": list(self.pass_labels),
            "final_spread": self.final_spread,
            "compensated_final_spread": _spread(self.compensated_final),
            "equilibrium_residual_N": self.equilibrium_residual,
            "rotation": self.rotation_dict(),
            "pressure_effect": dict(self.pressure_effect),
            "heat_cycle": self.cycle_dict(),
            "checks": [c.to_dict() for c in self.checks],
            "ok": self.ok,
            "notes": list(self.notes),
            "defaults": dict(self.defaults),
        }


def _bolt_cycle_keys(result: FlangeResult, i: int) -> dict[str, float]:
    """Bolt i's rotation and heat-cycle loads (JSON)."""
    out: dict[str, float] = {}
    if result.assembly_rotation is not None:
        out["rotation_assembly_deg"] = float(np.degrees(result.assembly_rotation[i]))
    if result.cycle is not None:
        out["rotation_service_deg"] = float(np.degrees(result.cycle["start_up"].rotation[i]))
        for k in ("hot", "cooled", "shut_down"):
            st = result.cycle[k]
            out[f"bolt_load_{k}_N"] = float(st.bolt[i])
            out[f"gasket_force_{k}_N"] = float(st.gasket[i])
    return out


def _finite(x: float) -> float | None:
    """A float for JSON, None where the figure does not apply (NaN)."""
    return None if math.isnan(x) else float(x)


def _spread(f: np.ndarray) -> float:
    """(max - min) / mean of the bolt preloads."""
    mean = float(np.mean(f))
    return float((np.max(f) - np.min(f)) / mean) if mean > 0 else 0.0


def analyse_flange(spec: FlangeSpec, compensate: bool = True) -> FlangeResult:
    """App. 2 bolt loads, gasket window, torque, passes, compensated targets, service, checks.

    ``compensate=False`` skips the compensated single-pass targets (sizing studies)."""
    a = asme_app2(spec)
    n = spec.bolt_count
    thr, grd = spec.thread, spec.grade
    notes: list[str] = []
    g = spec.gasket
    FA = working_loads(spec, a.G)

    # --- bolt capacity, gasket window top and the torque (VDI 2230-1 R7, R13)
    tb = tightening_basis(spec)
    muG_lo, muG_hi = spec.thread_friction
    muK_lo, muK_hi = spec.head_friction
    k_torque = tb.k_torque
    Rp = grd.Rp02
    FMzul, crush, F_rot = tb.FMzul, tb.crush, tb.F_rot
    bolt_reason, rot_reason = tb.bolt_reason, tb.rot_reason
    hi_w, hi_reason = tb.hi_w, tb.hi_reason

    # --- target and tightening
    torque = None
    orders = pass_orders(spec)
    tens: Tensioning | None = None
    if spec.method == "torque":
        assert tb.torque_range is not None
        torque, FM_min, FM_max, alpha = tb.torque_range
        target = torque[0] / k_torque(0.5 * (muG_lo + muG_hi), 0.5 * (muK_lo + muK_hi))
    elif spec.method in ("yield", "angle"):
        # tightened to the yield point (VDI 2230-1; R_p0.2max = 1.2 R_p0.2min, from memory)
        from ..components import yield_controlled_preload_range

        FM_min, FM_max = (
            float(x)
            for x in yield_controlled_preload_range(
                thr.As, thr.ds, thr.d2, thr.P, Rp, muG_lo, muG_hi
            )
        )
        alpha = FM_max / FM_min
        target = 0.5 * (FM_min + FM_max)
        FMzul = float(permissible_preload(thr.As, thr.ds, thr.d2, thr.P, 1.2 * Rp, muG_lo, 1.0))
        T_lo = float(permissible_preload(thr.As, thr.ds, thr.d2, thr.P, Rp, muG_lo, 1.0))
        T_hi = float(permissible_preload(thr.As, thr.ds, thr.d2, thr.P, 1.2 * Rp, muG_hi, 1.0))
        torque = (
            target * k_torque(0.5 * (muG_lo + muG_hi), 0.5 * (muK_lo + muK_hi)),
            T_lo * k_torque(muG_lo, muK_lo),
            T_hi * k_torque(muG_hi, muK_hi),
        )
        notes.append(
            f"Method {spec.method}: the bolts are tightened to their yield point; the "
            "torque is indicative."
        )
    else:  # tension: tensioners set the preload, the ring model says what the nuts keep
        alpha = (
            spec.scatter if spec.scatter is not None else tightening_factor("tension", bound="mid")
        )
        hi_s = 2 * alpha / (1 + alpha)  # largest assembly preload / nominal
        if spec.preload is not None:
            target = spec.preload
            tens, tens_ring = simulate_tensioning(spec, target, orders)
        else:
            # the tool's largest pull, at the largest assembly preload, meets F_M,zul
            tens, tens_ring = simulate_tensioning(spec, None, orders, pull=FMzul / hi_s)
            target = tens.residual
        # the window's top for the bolt: the residual preload at which the largest pull
        # reaches F_M,zul (F_M,zul x LTF for "all"; less where the passes interact)
        bolt_hi = FMzul * target / float(np.max(tens.peak))
        hi_w, hi_reason = min(
            (crush, "gasket crush limit"), (bolt_hi, bolt_reason), (F_rot, rot_reason)
        )
        if spec.preload is None and min(crush, F_rot) < bolt_hi:
            target = min(crush, F_rot) / hi_s
            tens, tens_ring = simulate_tensioning(spec, target, orders, hint=tens)
        FM_min, FM_max = 2 * target / (1 + alpha), 2 * alpha * target / (1 + alpha)
    ratio = target / thr.As / Rp
    if not PCC1_RANGE[0] <= ratio <= PCC1_RANGE[1]:
        notes.append(
            f"Target bolt stress is {ratio:.0%} of the yield point, outside the "
            f"{PCC1_RANGE[0]:.0%}-{PCC1_RANGE[1]:.0%} usual in ASME PCC-1 practice (from memory)."
        )
    # --- tightening passes with elastic interaction
    if tens is not None:
        ring = tens_ring
        passes, orders, peak = tens.passes, tens.sets, tens.peak
        fractions = tuple(F / tens.applied[-1] for F in tens.applied)
        labels = tuple(tens.labels)
        notes.append(
            f"Method tension ({tens.coverage}): "
            + "; ".join(
                f"{lab}: {F / 1e3:.4g} kN applied"
                for lab, F in zip(tens.labels, tens.applied, strict=True)
            )
            + f". The nuts keep about {tens.load_transfer_factor:.0%} of the applied tension "
            f"(load transfer factor, {tens.load_transfer_basis}); no torque specification."
        )
    else:
        ring = build_ring(spec)
        targets = np.full(n, target)
        passes = simulate_passes(ring, targets, spec.passes, orders)
        peak = np.max(np.vstack(passes), axis=0)  # each bolt's largest force during the passes
        fractions = spec.passes
        labels = spec.patterns
    assembly_bolts = passes[-1]
    _, asm_bolts, asm_gasket, asm_sol = ring.solve(np.zeros(n))
    comp_order = orders[0]
    if compensate and tens is None:  # compensated single-pass targets: a torque-pass figure
        comp_t, comp_final = compensated_targets(spec, target, comp_order)
    else:
        comp_t, comp_final = np.full(n, np.nan), np.full(n, target)
    if compensate and float(np.max(comp_t)) > FMzul:
        notes.append(
            f"The compensated single-pass targets reach {np.max(comp_t) / 1e3:.4g} kN, above the "
            f"permissible preload {FMzul / 1e3:.4g} kN: use several passes instead."
        )

    # --- service: pressure, external loads, temperatures; then the heat cycle
    from .service import Conditions, heat_cycle, loads, snapshot, solve_state

    asm_rot = ring.rotations(asm_sol)
    cycle = heat_cycle(snapshot(ring))
    start = cycle["start_up"]
    srv_bolts, srv_gasket = start.bolt, start.gasket
    residual = _equilibrium(srv_bolts, srv_gasket, FA)
    # the pressure's (and external loads') effect on the bolts at the assembly temperature:
    # from the compatibility of bolts, rings and gasket, beside App. 2's assumption that
    # the bolts carry all of it (W_m1 = H + H_p)
    T0 = spec.T_assembly
    cold = solve_state(
        snapshot(ring), "pressurised", Conditions(T0, T0, T0), loads(spec, ring.rotation)
    )
    pressure_effect = {
        "working_load_N": float(np.sum(FA)),
        "bolt_load_increase_N": float(np.sum(cold.bolt - asm_bolts)),
        "gasket_load_decrease_N": float(np.sum(asm_gasket - cold.gasket)),
        "load_factor": float(np.sum(cold.bolt - asm_bolts) / np.sum(FA))
        if abs(float(np.sum(FA))) > 0
        else None,
        "app2_operating_N": a.Wm1,
        "app2_basis": "ASME BPVC VIII-1 App. 2, 2-5: W_m1 = H + H_p, the bolts carry all of H",
    }

    # operating requirement: residual gasket load >= H_p/N in service on the worst sector,
    # with the loss of gasket load from assembly to service of the ring's passes
    op_min = a.Hp / n + float(np.max(asm_gasket - srv_gasket))
    lo_w, lo_reason = max(
        (a.Wm2 / n, "gasket seating (W_m2/N)"),
        (op_min, "gasket load in operation (H_p/N plus the loss in service)"),
    )
    if lo_w > hi_w:
        notes.append(
            "The gasket window is empty: no preload both seats the gasket and keeps "
            "it below its crush limit with these bolts; change bolt size, count or gasket."
        )

    # --- checks on the per-bolt loads after the last pass and in service.  The passes are
    # simulated at the nominal preload; the assembly scatter scales the preload part of
    # every load (exact for the linear ring): low = nominal x F_M,min/F_nom, high likewise.
    lo_s, hi_s = FM_min / target, FM_max / target
    after = assembly_bolts
    bolts_lo = after * lo_s
    gasket_asm_lo, gasket_asm_hi = asm_gasket * lo_s, asm_gasket * hi_s
    gasket_srv_lo = srv_gasket - (1 - lo_s) * asm_gasket
    gasket_srv_hi = srv_gasket + (hi_s - 1) * asm_gasket
    bolts_srv_hi = srv_bolts + (hi_s - 1) * after
    sector_area = g.area / n

    def bolt_no(i: int | np.integer) -> str:
        return f"bolt {int(i) + 1}"

    checks = []
    checks.append(
        Check(
            "bolt_area",
            "Available bolt root area at least the required area A_m",
            a.Ab * 1e6,
            a.Am * 1e6,
            "mm2",
            ">=",
            "ASME BPVC VIII-1 Appendix 2, 2-5 (A_m = max(W_m1/S_b, W_m2/S_a)); external force "
            "and moment once in W_m1 = H + H_p + F + 4M/G (form of ASME VIII-2 4.16, from memory)",
            f"S_b = {spec.allowable_stress / 1e6:.4g} MPa, S_a = {spec.allowable_stress_ambient / 1e6:.4g} MPa",
        )
    )
    i = int(np.argmin(bolts_lo))
    checks.append(
        Check(
            "bolt_preload_window",
            "Every bolt after the last pass at least the low end of the preload window",
            float(bolts_lo[i]) / 1e3,
            lo_w / 1e3,
            "kN",
            ">=",
            "ASME BPVC VIII-1 Appendix 2, 2-5 (W_m2/N, H_p/N); bolt loads of the pass "
            "sequence with elastic interaction (ring network, ASME PCC-1 practice)",
            f"{bolt_no(i)}, after the last pass at the smallest assembly preload; window "
            f"{lo_w / 1e3:.4g} .. {hi_w / 1e3:.4g} kN ({lo_reason} .. {hi_reason})",
            extra={"governing_bolt": int(i) + 1},
        )
    )
    i = int(np.argmin(gasket_asm_lo))
    checks.append(
        Check(
            "gasket_seating",
            "Gasket load of every sector after the last pass seats the gasket (W_m2/N)",
            float(gasket_asm_lo[i]) / 1e3,
            a.Wm2 / n / 1e3,
            "kN",
            ">=",
            "ASME BPVC VIII-1 Appendix 2, 2-5 (W_m2 = pi b G y), per bolt sector; ring network "
            "after the pass sequence",
            f"sector of {bolt_no(i)}, smallest assembly preload; total "
            f"{float(np.sum(gasket_asm_lo)) / 1e3:.4g} kN against W_m2 = {a.Wm2 / 1e3:.4g} kN",
            extra={"governing_bolt": int(i) + 1},
        )
    )
    op_need = a.Hp / n
    i = int(np.argmin(gasket_srv_lo))
    checks.append(
        Check(
            "gasket_operating",
            "Gasket load in service at least m times the pressure (per sector)",
            float(gasket_srv_lo[i]) / 1e3,
            op_need / 1e3,
            "kN",
            ">=",
            "ASME BPVC VIII-1 Appendix 2, 2-5 (H_p = 2 b pi G m P); ring network in service "
            "after the pass sequence, at the smallest assembly preload",
            f"sector of {bolt_no(i)}",
            extra={"governing_bolt": int(i) + 1},
        )
    )
    # the heat cycle: losses from assembly to each state taken at the nominal preload and
    # applied to the scattered preloads (conservative for creep, which grows with the
    # gasket stress, at the smallest preload)
    cyc_lo = {k: cycle[k].gasket - (1 - lo_s) * asm_gasket for k in ("hot", "cooled")}
    cyc_hi = {k: cycle[k].gasket + (hi_s - 1) * asm_gasket for k in ("hot", "cooled")}
    crush_all = np.concatenate([gasket_asm_hi, gasket_srv_hi, cyc_hi["hot"], cyc_hi["cooled"]])
    i = int(np.argmax(crush_all))
    when = ("at assembly", "in service", "hot, after relaxation", "cooled back")[i // n]
    checks.append(
        Check(
            "gasket_crush",
            "Largest gasket stress (per sector, assembly and service) below the crush limit",
            float(crush_all[i]) / sector_area / 1e6,
            g.max_stress / 1e6,
            "MPa",
            "<=",
            f"gasket data: {g.source}; ring network after the pass sequence",
            f"sector of {bolt_no(i % n)} {when}, largest assembly preload",
            extra={"governing_bolt": int(i % n) + 1},
        )
    )
    i = int(np.argmax(peak))
    checks.append(
        Check(
            "assembly_preload",
            "Largest bolt load during the passes within the permissible preload"
            + (" (the tensioner's pull)" if tens is not None else ""),
            float(peak[i]) * hi_s / 1e3,
            FMzul / 1e3,
            "kN",
            "<=",
            f"VDI 2230-1:2015, 5.5.1, R7 (nu = {spec.utilization:g})",
            f"{bolt_no(i)}, largest assembly preload",
            extra={"governing_bolt": int(i) + 1},
        )
    )
    low = np.concatenate([cyc_lo["hot"], cyc_lo["cooled"]])
    i = int(np.argmin(low))
    checks.append(
        Check(
            "gasket_heat_cycle",
            "Gasket load after creep relaxation when hot and after cooling back, under "
            "pressure, at least m times the pressure (per sector)",
            float(low[i]) / 1e3,
            op_need / 1e3,
            "kN",
            ">=",
            "ASME BPVC VIII-1 Appendix 2, 2-5 (H_p = 2 b pi G m P); ring network through the "
            f"heat cycle, creep relaxation {cycle.relaxation_basis}",
            f"sector of {bolt_no(i % n)}, "
            + ("hot, after relaxation" if i < n else "cooled back, pressurised")
            + ", smallest assembly preload",
            extra={"governing_bolt": int(i % n) + 1},
        )
    )
    if math.isfinite(ring.rotation_stiffness):
        # the ring rotation of the model against ASME's rigidity limit; App. 2-14's loose-
        # flange index J = 109.4 M_o / (E t^3 ln K K_L) is ring theory's rotation in degrees
        # (109.4 = 12/(2 pi) x 180/pi) over K_L = 0.2 deg (from memory)
        rots = {
            "after the last pass": float(np.max(np.abs(asm_rot))),
            "in service": float(np.max(np.abs(cycle["start_up"].rotation))),
        }
        when_r, rot = max(rots.items(), key=lambda kv: kv[1])
        checks.append(
            Check(
                "flange_rotation",
                "Rotation of the flange ring within the rigidity limit",
                math.degrees(rot),
                ROTATION_LIMIT_DEG,
                "deg",
                "<=",
                "ASME BPVC VIII-1 Appendix 2-14, flange rigidity of a loose-type flange "
                "(J = 109.4 M_o/(E t^3 ln K K_L) <= 1, K_L = 0.2; from memory), with the "
                "rotation of the ring network (ring theory); an integral flange's hub makes "
                "it stiffer, so for it the check is conservative",
                f"{when_r}, nominal preload (App. 2-14 takes the design moment)",
            )
        )
    Rp_T, basis = yield_at_temperature(grd, spec.T_bolt)
    i = int(np.argmax(bolts_srv_hi))
    checks.append(
        Check(
            "bolt_service_stress",
            "Largest bolt stress in service below the yield point",
            float(bolts_srv_hi[i]) / thr.As / 1e6,
            float(Rp_T) / 1e6,
            "MPa",
            "<=",
            f"axial stress on A_s against R_p0.2 at the bolt temperature ({basis})",
            f"{bolt_no(i)}, largest assembly preload",
            extra={"governing_bolt": int(i) + 1},
        )
    )
    if "cross" in spec.patterns and (tens is None or tens.coverage == "sequence"):
        notes.append(f"Cross passes: {cross_rule(n)}.")
    notes.extend(temperature_notes(spec))
    if spec.unused:
        notes.append(
            f"Not used by the flange model: {', '.join(spec.unused)} (no thread-"
            "stripping, surface-pressure or fatigue check for flange bolts here)."
        )
    notes.append(
        "Leakage and tightness classes (EN 1591-1, EN 13555) are not evaluated; the "
        "ASME m and y factors are the gasket criteria used."
    )
    return FlangeResult(
        spec=spec,
        app2=a,
        window=(lo_w, hi_w),
        window_reasons=(lo_reason, hi_reason),
        target=target,
        assembly_range=(FM_min, FM_max),
        permissible_preload=FMzul,
        alpha_A=alpha,
        torque=torque,
        passes=passes,
        orders=orders,
        pass_fractions=tuple(fractions),
        pass_labels=tuple(labels),
        tensioning=tens,
        final_spread=_spread(assembly_bolts),
        compensated_targets=comp_t,
        compensated_final=comp_final,
        working_loads=FA,
        service_bolt=srv_bolts,
        service_gasket=srv_gasket,
        assembly_gasket=asm_gasket,
        checks=tuple(checks),
        notes=tuple(notes),
        equilibrium_residual=residual,
        defaults=spec.defaults,
        cycle=cycle,
        assembly_rotation=asm_rot,
        rotation_stiffness=ring.rotation_stiffness,
        lever=ring.lever,
        pressure_effect=pressure_effect,
        ring=snapshot(ring),
    )


def temperature_notes(spec: FlangeSpec) -> list[str]:
    """Notes for every catalog property the flange model extrapolates below its data."""
    out: list[str] = []
    parts = [
        ("flange", spec.material, (spec.T_flange, spec.T_assembly), ("E", "alpha")),
        ("bolt", spec.bolt_material, (spec.T_bolt, spec.T_assembly), ("E", "alpha")),
    ]
    if spec.nut_material is not None:
        parts.append(("nut", spec.nut_material, (spec.T_assembly,), ("E",)))
    for label, pm, Ts, props in parts:
        use = pm.from_catalog(props)
        if use:
            out.extend(x.text(label) for x in pm.material.extrapolations(np.array(Ts), use))
    return out


def _equilibrium(bolts: np.ndarray, gasket: np.ndarray, FA: np.ndarray) -> float:
    """Whole-ring equilibrium: bolt forces = gasket forces + working loads [N residual]."""
    return float(abs(np.sum(bolts) - np.sum(gasket) - np.sum(FA)))
