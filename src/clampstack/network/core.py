"""Axial spring network: parts between nodes on one axis, solved exactly.

This module knows nothing of units or of what the parts stand for.  Values are
plain floats in one consistent unit system (the package uses SI: N, m).

Model
-----
Nodes carry one displacement ``u`` along the axis.  A part joins node ``i`` (its
first end) to node ``j`` (its second end, further along +axis).  Its elongation
is ``D = u_j - u_i``; its *free* elongation ``d0 = misfit + strain * length`` is
the elongation at which it carries no force (a length error or a thermal
strain).  The part force ``N`` (tension positive) is a function of the
mechanical elongation ``e = D - d0``:

* linear: ``N = k e`` (``k = E A / L`` or given);
* compression-only with gap ``g``: ``N = k min(e + g, 0)`` (a contact that
  first closes a clearance ``g``);
* tension-only with gap ``g``: ``N = k max(e - g, 0)`` (a slack link);
* piecewise-linear curve: ``N = f(e)`` through given points, extended with the
  end slopes; the curve must not fall (a stable material).

Every part pulls its first node with ``+N`` and its second with ``-N``; the
equilibrium at the free nodes is ``B^T N(u) = F`` and the reaction at a fixed
node is ``R = (B^T N)_n - F_n`` (the force the support exerts, +axis).

The linear system is the usual direct-stiffness assembly (any text on the
matrix stiffness method, e.g. Przemieniecki, *Theory of Matrix Structural
Analysis*, 1968, ch. 3).  Unilateral parts and curves make the equations
piecewise linear; they are solved by a semi-smooth Newton (active-set)
iteration with a backtracking line search on the total potential energy, which
is convex because every part's force rises with its elongation.  The
iteration stops with :class:`SolveError` if a state repeats or the iteration
limit is reached.  The linear solver is chosen by size, band and memory
(:class:`_LinearSolver`): dense for a few nodes, banded Cholesky (LAPACK
``pbtrf``) while it fits, SuperLU for wide local patterns, preconditioned
conjugate gradients for non-local ones; long linear networks are refined
against residuals in extended precision.
"""

from __future__ import annotations

import math
import os
from collections.abc import Sequence
from dataclasses import dataclass, field

import numpy as np

from ..errors import InputError, SolveError

LINEAR, COMPRESSION, TENSION, CURVE = 0, 1, 2, 3
BEHAVIOURS = {"linear": LINEAR, "compression": COMPRESSION, "tension": TENSION, "curve": CURVE}

_EPS_SLOPE = 1e-10  # relative stiffness given to a slack part in the Newton matrix only
_DENSE_MAX = 96  # free nodes up to which the matrix is factorised dense (numpy only)
_BAND_FLOPS = 5e9  # banded Cholesky while n * (band + 1)**2 (its work) stays below this
_SPARSE_ALWAYS = 20_000  # below this many free nodes a sparse direct solve is always cheap
_LOCAL_BAND = 8.0  # band (after RCM) below this times sqrt(n): a local, mesh-like network
_CG_RTOL = 1e-13  # relative residual (2-norm) at which the conjugate gradients stop
_CG_MAXITER = 5000
_EXTENDED_FROM = 2000  # free nodes from which a linear solve is refined in extended precision
_EXTENDED = np.finfo(np.longdouble).eps < np.finfo(float).eps  # long double is wider here
_MAX_ITER = 500
_KINK = 1e-11  # relative residual accepted when a part sits on the kink of its law
_POLISH = 1e-9  # one step of iterative refinement when the residual is above this (relative)


@dataclass(frozen=True)
class Curve:
    """A piecewise-linear force-elongation law ``N = f(e)``.

    ``x`` are elongations (ascending), ``f`` the forces there (not falling);
    below ``x[0]`` and above ``x[-1]`` the law continues with ``slope_below`` and
    ``slope_above``.
    """

    x: np.ndarray
    f: np.ndarray
    slope_below: float
    slope_above: float

    @staticmethod
    def make(
        x: Sequence[float],
        f: Sequence[float],
        slope_below: float | None = None,
        slope_above: float | None = None,
    ) -> Curve:
        """Build and validate a curve; end slopes default to the end segments' slopes."""
        xa = np.asarray(x, dtype=float)
        fa = np.asarray(f, dtype=float)
        if xa.ndim != 1 or xa.size < 2 or xa.shape != fa.shape:
            raise InputError("a curve needs at least two points of (elongation, force)")
        if not (np.all(np.isfinite(xa)) and np.all(np.isfinite(fa))):
            raise InputError("a curve point is not a finite number")
        if np.any(np.diff(xa) <= 0):
            raise InputError("curve points must be in rising order of elongation")
        seg = np.diff(fa) / np.diff(xa)
        if np.any(seg < 0):
            raise InputError("the curve falls somewhere (force must not drop as elongation grows)")
        sb = float(seg[0]) if slope_below is None else float(slope_below)
        sa = float(seg[-1]) if slope_above is None else float(slope_above)
        if sb < 0 or sa < 0 or not (np.isfinite(sb) and np.isfinite(sa)):
            raise InputError("curve end slopes must be finite and not negative")
        return Curve(xa, fa, sb, sa)

    def _segments(self) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
        x, f = self.x, self.f
        slopes = np.concatenate(([self.slope_below], np.diff(f) / np.diff(x), [self.slope_above]))
        # energy at each breakpoint, measured from x[0]
        w = np.concatenate(([0.0], np.cumsum(0.5 * (f[1:] + f[:-1]) * np.diff(x))))
        return slopes, w, x

    def evaluate(self, e: np.ndarray) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
        """Force, tangent slope and stored energy at elongations ``e``."""
        e = np.asarray(e, dtype=float)
        slopes, w, x = self._segments()
        f = self.f
        # segment index: 0 below x[0], m for x[m-1] <= e < x[m], len(x) above
        idx = np.searchsorted(x, e, side="right")
        base = np.clip(idx - 1, 0, len(x) - 1)
        s = slopes[idx]
        de = e - x[base]
        force = f[base] + s * de
        energy = w[base] + f[base] * de + 0.5 * s * de * de
        return force, s, energy


@dataclass
class Network:
    """An axial spring network held as arrays (nodes are integers ``0..n-1``).

    Use :meth:`add_part` for a few parts or :meth:`from_arrays` for many.
    """

    n_nodes: int
    i: np.ndarray
    j: np.ndarray
    k: np.ndarray
    free_elongation: np.ndarray
    behaviour: np.ndarray
    gap: np.ndarray
    curves: dict[int, Curve] = field(default_factory=dict)
    fixed: np.ndarray | None = None  # bool per node
    prescribed: np.ndarray | None = None  # displacement of fixed nodes
    curve_table: _CurveTable | None = None  # many curves as arrays (instead of ``curves``)

    # ------------------------------------------------------------------ build
    @staticmethod
    def from_arrays(
        n_nodes: int,
        i: Sequence[int] | np.ndarray,
        j: Sequence[int] | np.ndarray,
        k: Sequence[float] | np.ndarray,
        free_elongation: Sequence[float] | np.ndarray | None = None,
        behaviour: Sequence[int] | np.ndarray | None = None,
        gap: Sequence[float] | np.ndarray | None = None,
        curves: dict[int, Curve] | None = None,
        fixed: Sequence[int] | np.ndarray = (),
        curve_table: _CurveTable | None = None,
        prescribed: Sequence[float] | np.ndarray | None = None,
    ) -> Network:
        """Build a network from arrays, one entry per part (validated)."""
        ia = np.asarray(i, dtype=np.int64)
        ja = np.asarray(j, dtype=np.int64)
        ka = np.asarray(k, dtype=float)
        m = ia.size
        d0 = np.zeros(m) if free_elongation is None else np.asarray(free_elongation, dtype=float)
        beh = np.zeros(m, dtype=np.int8) if behaviour is None else np.asarray(behaviour, np.int8)
        ga = np.zeros(m) if gap is None else np.asarray(gap, dtype=float)
        fx = np.zeros(n_nodes, dtype=bool)
        fixed_idx = np.asarray(fixed, dtype=np.int64)
        if fixed_idx.size and (fixed_idx.min() < 0 or fixed_idx.max() >= n_nodes):
            raise InputError("a fixed node is not in the network")
        fx[fixed_idx] = True
        pre = np.zeros(n_nodes)
        if prescribed is not None:
            pre[fixed_idx] = np.asarray(prescribed, dtype=float)
        net = Network(n_nodes, ia, ja, ka, d0, beh, ga, dict(curves or {}), fx, pre, curve_table)
        net.validate()
        return net

    def validate(self) -> None:
        """Check shapes, finiteness and that every node is held (raises InputError)."""
        m = self.i.size
        for name, arr in (
            ("j", self.j),
            ("k", self.k),
            ("free_elongation", self.free_elongation),
            ("behaviour", self.behaviour),
            ("gap", self.gap),
        ):
            if arr.shape != (m,):
                raise InputError(f"network array {name} has {arr.size} entries for {m} parts")
        if m and (
            min(self.i.min(), self.j.min()) < 0 or max(self.i.max(), self.j.max()) >= self.n_nodes
        ):
            raise InputError("a part refers to a node that is not in the network")
        same = np.flatnonzero(self.i == self.j)
        if same.size:
            raise InputError(f"part {same[0]} joins node {self.i[same[0]]} to itself")
        is_curve = self.behaviour == CURVE
        bad = np.flatnonzero(~is_curve & ~(np.isfinite(self.k) & (self.k > 0)))
        if bad.size:
            p = bad[0]
            raise InputError(
                f"part {p} between nodes {self.i[p]} and {self.j[p]} has stiffness {self.k[p]!r}"
                " (must be positive and finite)"
            )
        if not np.all(np.isfinite(self.free_elongation)) or not np.all(np.isfinite(self.gap)):
            raise InputError("a part's free elongation or gap is not finite")
        if np.any(self.gap < 0):
            raise InputError("a gap is negative")
        covered = set(self.curves)
        if self.curve_table is not None:
            covered |= {int(p) for p in self.curve_table.parts}
        missing = [int(p) for p in np.flatnonzero(is_curve) if int(p) not in covered]
        if missing:
            raise InputError(f"part {missing[0]} is a curve part without a curve")
        if self.fixed is None or not self.fixed.any():
            raise InputError("no node is fixed: the assembly can move as a rigid body")

    def components(self) -> tuple[int, np.ndarray]:
        """Connected groups of nodes (through any part), as ``(count, label per node)``."""
        from scipy.sparse import coo_array
        from scipy.sparse.csgraph import connected_components

        g = coo_array((np.ones(self.i.size), (self.i, self.j)), shape=(self.n_nodes, self.n_nodes))
        return connected_components(g, directed=False)

    def unheld_groups(self) -> list[np.ndarray]:
        """Groups of nodes joined to no fixed node at all (each an array of node ids)."""
        key = (self.i, self.j, self.fixed)
        cached = getattr(self, "_unheld_cache", None)
        if cached is not None and all(a is b for a, b in zip(cached[0], key, strict=True)):
            return cached[1]
        groups = self._unheld_groups()
        object.__setattr__(self, "_unheld_cache", (key, groups))
        return groups

    def _unheld_groups(self) -> list[np.ndarray]:
        count, label = self.components()
        held = np.zeros(count, dtype=bool)
        held[label[self.fixed]] = True
        return [np.flatnonzero(label == c) for c in range(count) if not held[c]]

    # ------------------------------------------------------------------ laws
    def part_law(self, e: np.ndarray) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
        """Force, tangent slope and energy of every part at mechanical elongation ``e``."""
        beh, k, g = self.behaviour, self.k, self.gap
        force = k * e
        slope = k.copy()
        if np.any(beh != LINEAR):
            comp = beh == COMPRESSION
            if comp.any():
                ec = e[comp] + g[comp]
                act = ec < 0
                force[comp] = np.where(act, k[comp] * ec, 0.0)
                slope[comp] = np.where(act, k[comp], 0.0)
            tens = beh == TENSION
            if tens.any():
                et = e[tens] - g[tens]
                act = et > 0
                force[tens] = np.where(act, k[tens] * et, 0.0)
                slope[tens] = np.where(act, k[tens], 0.0)
            energy = 0.5 * force * force / np.where(slope > 0, slope, 1.0)
            if self.curves or self.curve_table is not None:
                table = self._curve_table()
                f_, s_, w_ = table.evaluate(e[table.parts])
                force[table.parts], slope[table.parts], energy[table.parts] = f_, s_, w_
        else:
            energy = 0.5 * k * e * e
        return force, slope, energy

    def _curve_table(self) -> _CurveTable:
        if self.curve_table is not None:
            return self.curve_table
        cached = getattr(self, "_table_cache", None)
        if cached is None or cached[0] is not self.curves or cached[1] != len(self.curves):
            cached = (self.curves, len(self.curves), _CurveTable.build(self.curves))
            object.__setattr__(self, "_table_cache", cached)
        return cached[2]

    # ------------------------------------------------------------------ solve
    def solve(
        self,
        loads: np.ndarray | None = None,
        extra_elongation: np.ndarray | None = None,
        start: np.ndarray | None = None,
    ) -> Solution:
        """Solve for the displacements under nodal ``loads`` (one per node).

        ``extra_elongation`` adds to every part's free elongation (a load case's
        temperature change); ``start`` is a displacement vector to begin the
        iteration from (the previous state).
        """
        n = self.n_nodes
        f_ext = np.zeros(n) if loads is None else np.asarray(loads, dtype=float)
        if f_ext.shape != (n,) or not np.all(np.isfinite(f_ext)):
            raise InputError("loads must be one finite value per node")
        d0 = self.free_elongation
        if extra_elongation is not None:
            d0 = d0 + np.asarray(extra_elongation, dtype=float)
        free = ~self.fixed
        free_idx = np.full(n, -1, dtype=np.int64)
        nf = int(free.sum())
        free_idx[free] = np.arange(nf)
        u = np.zeros(n) if start is None else np.array(start, dtype=float)
        u[self.fixed] = self.prescribed[self.fixed]

        fi, fj = free_idx[self.i], free_idx[self.j]
        solver = _LinearSolver(nf, fi, fj, self._explain_singular)
        # slack parts get _EPS_SLOPE of the softest part's stiffness in the Newton matrix:
        # small against every real spring, so refinement converges fast
        positive = self.k[(self.behaviour != CURVE) & (self.k > 0)]
        kscale = float(np.min(positive)) if positive.size else 0.0
        if self.curve_table is not None:
            tab = np.abs(self.curve_table.seg)
            if np.any(tab > 0):
                low = float(np.min(tab[tab > 0]))
                kscale = low if kscale == 0.0 else min(kscale, low)
        for c in self.curves.values():
            slopes = np.abs(np.diff(c.f) / np.diff(c.x))
            if np.any(slopes > 0):
                low = float(np.min(slopes[slopes > 0]))
                kscale = low if kscale == 0.0 else min(kscale, low)
        kscale = kscale if kscale > 0 else 1.0
        # forces below what the stiffest part makes from a femtometre are round-off
        force_floor = 1e-15 * float(np.max(self.k[self.behaviour != CURVE], initial=kscale))
        nonlinear = bool(np.any(self.behaviour != LINEAR))

        def state(uu: np.ndarray):
            e = uu[self.j] - uu[self.i] - d0
            if nonlinear:
                force, slope, energy = self.part_law(e)
                pot = float(energy.sum() - f_ext[free] @ uu[free])
            else:
                force, slope, pot = self.k * e, self.k, 0.0
            internal = np.bincount(self.j, force, n)
            internal -= np.bincount(self.i, force, n)
            resid = f_ext - internal
            resid[self.fixed] = 0.0
            return e, force, slope, resid, pot

        e, force, slope, resid, pot = state(u)
        visits: dict[bytes, int] = {}
        iterations = 0
        while True:
            if nonlinear and iterations > 0:
                # equilibrium reached (a part may sit exactly on a kink of its law, where
                # either neighbouring state is the same answer): done
                scale = max(
                    float(np.max(np.abs(f_ext), initial=0.0)),
                    float(np.max(np.abs(force), initial=0.0)),
                    force_floor,
                )
                if np.max(np.abs(resid), initial=0.0) <= _KINK * scale:
                    break
            if iterations >= _MAX_ITER:
                raise SolveError(
                    f"the contact iteration did not settle in {_MAX_ITER} steps "
                    f"(residual {np.max(np.abs(resid)):.3g})"
                )
            # the state of a piecewise-linear system is the slope of every part
            active = slope.tobytes() if nonlinear else b""
            if nonlinear:
                visits[active] = visits.get(active, 0) + 1
                if visits[active] > 12:
                    raise SolveError(
                        "the contact iteration cycles between the same states of the "
                        "compression-only / tension-only parts; check gaps and loads"
                    )
            s_mat = np.where(slope > 0, slope, _EPS_SLOPE * kscale)
            du = np.zeros(n)
            du[free] = solver.solve(s_mat, resid[free])
            # backtracking line search on the (convex) total potential energy
            step = 1.0
            for _ in range(60):
                trial = u + step * du
                t_state = state(trial)
                if not nonlinear or t_state[4] <= pot + 1e-12 * abs(pot) + 1e-300:
                    break
                step *= 0.5
            u = trial
            e, force, slope, resid, pot = t_state
            iterations += 1
            same_set = not nonlinear or slope.tobytes() == active
            if step == 1.0 and same_set:
                # exact for this set of carrying parts; polish round-off once
                scale = max(
                    float(np.max(np.abs(f_ext), initial=0.0)),
                    float(np.max(np.abs(force), initial=0.0)),
                    1e-300,
                )
                if not nonlinear and nf >= _EXTENDED_FROM and _EXTENDED:
                    # a long, weakly held network: residuals in double precision lose
                    # digits to the large displacements; refine against residuals in
                    # extended precision instead (mixed-precision iterative refinement,
                    # Wilkinson 1963; Higham, Accuracy and Stability of Numerical
                    # Algorithms, 2nd ed., ch. 12)
                    for _ in range(4):
                        r_ext = self._residual_extended(u, d0, f_ext)[free]
                        if np.max(np.abs(r_ext), initial=0.0) <= 1e-15 * scale:
                            break
                        du[free] = solver.solve(s_mat, r_ext)
                        u = u + du
                        # stop once a correction only moves round-off
                        if np.max(np.abs(du)) <= 1e-14 * np.max(np.abs(u)):
                            break
                    e, force, slope, resid, pot = state(u)
                    break
                # slack parts stiffened by _EPS_SLOPE bias the step slightly: polish harder
                polish = _POLISH if not nonlinear else 1e-13
                for _ in range(10 if nonlinear else 1):  # iterative refinement
                    if np.max(np.abs(resid), initial=0.0) <= polish * scale:
                        break
                    du[free] = solver.solve(s_mat, resid[free])
                    t_state = state(u + du)
                    if not (
                        np.max(np.abs(t_state[3])) < np.max(np.abs(resid))
                        and (not nonlinear or t_state[2].tobytes() == active)
                    ):
                        break
                    u = u + du
                    e, force, slope, resid, pot = t_state
                break

        # a group that is held only through slack parts and carries a net load
        # would fly off: report it instead of returning a huge displacement
        if nonlinear:
            scale = max(
                float(np.max(np.abs(f_ext), initial=0.0)),
                float(np.max(np.abs(force), initial=0.0)),
                force_floor,
            )
            # round-off of the part forces: each is a slope times a difference of
            # displacements and free elongations that may be far larger than the result
            roundoff = 1e-9 * float(
                np.max(slope * (np.abs(u[self.i]) + np.abs(u[self.j]) + np.abs(d0)), initial=0.0)
            )
            if np.max(np.abs(resid), initial=0.0) > max(1e-6 * scale, roundoff):
                # far from equilibrium: a group held only by slack parts is the usual cause
                self._check_mechanism(slope, f_ext)
                raise SolveError(
                    f"no equilibrium found (residual {np.max(np.abs(resid)):.3g} of a load scale "
                    f"{scale:.3g}); check the supports, gaps and contact parts"
                )
        internal = np.bincount(self.j, force, n) - np.bincount(self.i, force, n)
        reactions = np.where(self.fixed, internal - f_ext, 0.0)
        resid = f_ext + reactions - internal
        return Solution(
            displacement=u,
            force=force,
            elongation=u[self.j] - u[self.i],
            carrying=(force != 0.0) | (self.behaviour == LINEAR),
            reaction=reactions,
            residual=float(np.max(np.abs(resid), initial=0.0)),
            iterations=iterations,
        )

    def _residual_extended(self, u: np.ndarray, d0: np.ndarray, f_ext: np.ndarray) -> np.ndarray:
        """Out-of-balance force per node, ``F - B^T k (B u - d0)``, summed in extended
        precision (numpy's long double) and rounded to double at the end."""
        ld = np.longdouble
        order = getattr(self, "_order_cache", None)
        if order is None or order[0] is not self.i:
            nodes = np.concatenate((self.j, self.i))
            perm = np.argsort(nodes, kind="stable")
            sorted_nodes = nodes[perm]
            starts = np.flatnonzero(np.r_[True, sorted_nodes[1:] != sorted_nodes[:-1]])
            order = (self.i, perm, starts, sorted_nodes[starts], self.k.astype(ld))
            object.__setattr__(self, "_order_cache", order)
        _, perm, starts, at, k_ld = order
        # the difference of two neighbouring doubles is exact (Sterbenz), so only the
        # products and sums need the wider type
        e = (u[self.j] - u[self.i]).astype(ld)
        if np.any(d0):
            e -= d0.astype(ld)
        force = k_ld * e
        signed = np.concatenate((force, -force))[perm]
        internal = np.zeros(self.n_nodes, dtype=ld)
        internal[at] = np.add.reduceat(signed, starts)
        resid = f_ext.astype(ld) - internal
        resid[self.fixed] = 0
        return resid.astype(float)

    def _explain_singular(self) -> None:
        """Called when a factorisation fails or looks singular: name a floating group."""
        unheld = self.unheld_groups()
        if unheld:
            nodes = ", ".join(str(n) for n in unheld[0][:6])
            raise InputError(f"nodes {nodes} are not joined to any fixed node (a floating group)")

    def _check_mechanism(self, slope: np.ndarray, f_ext: np.ndarray) -> None:
        from scipy.sparse import coo_array
        from scipy.sparse.csgraph import connected_components

        act = slope > 0
        g = coo_array(
            (np.ones(int(act.sum())), (self.i[act], self.j[act])),
            shape=(self.n_nodes, self.n_nodes),
        )
        count, label = connected_components(g, directed=False)
        held = np.zeros(count, dtype=bool)
        held[label[self.fixed]] = True
        net_load = np.bincount(label, f_ext, count)
        scale = max(float(np.max(np.abs(f_ext), initial=0.0)), 1e-300)
        bad = np.flatnonzero(~held & (np.abs(net_load) > 1e-9 * scale))
        if bad.size:
            nodes = np.flatnonzero(label == bad[0])
            names = ", ".join(str(x) for x in nodes[:6])
            raise SolveError(
                f"nodes {names} carry a load of {net_load[bad[0]]:.6g} but every part that could "
                "hold them has gone slack (a mechanism); add a support or a part that carries it"
            )


@dataclass(frozen=True)
class _CurveTable:
    """All curve parts of a network as padded arrays, evaluated in one vectorised pass."""

    parts: np.ndarray  # part index per row
    x: np.ndarray  # (rows, m) breakpoints, padded with +inf
    f: np.ndarray  # (rows, m) forces, padded with the last force
    w: np.ndarray  # (rows, m) energy at each breakpoint from x[:, 0]
    seg: np.ndarray  # (rows, m + 1) slope of each segment (below, between, above)
    count: np.ndarray  # breakpoints per row

    @staticmethod
    def build(curves: dict[int, Curve]) -> _CurveTable:
        parts = np.array(sorted(curves), dtype=np.int64)
        m = max(curves[p].x.size for p in parts)
        rows = parts.size
        x = np.full((rows, m), np.inf)
        f = np.zeros((rows, m))
        w = np.zeros((rows, m))
        seg = np.zeros((rows, m + 1))
        count = np.zeros(rows, dtype=np.int64)
        for r, p in enumerate(parts):
            c = curves[int(p)]
            n = c.x.size
            slopes, energy, _ = c._segments()
            x[r, :n], f[r, :n], f[r, n:] = c.x, c.f, c.f[-1]
            w[r, :n], w[r, n:] = energy, energy[-1]
            seg[r, : n + 1], seg[r, n + 1 :] = slopes, slopes[-1]
            count[r] = n
        return _CurveTable(parts, x, f, w, seg, count)

    @staticmethod
    def from_arrays(
        parts: np.ndarray,
        x: np.ndarray,
        f: np.ndarray,
        slope_below: np.ndarray,
        slope_above: np.ndarray,
    ) -> _CurveTable:
        """Many curves at once: rows of breakpoints ``x`` (ascending, +inf padding allowed)
        and forces ``f``; end slopes per row.  No Python loop over the rows."""
        x = np.asarray(x, dtype=float)
        f = np.asarray(f, dtype=float)
        rows, m = x.shape
        finite = np.isfinite(x)
        count = finite.sum(axis=1)
        if np.any(count < 1):
            raise InputError("a curve needs at least one point")
        last = count - 1
        r = np.arange(rows)
        f = np.where(finite, f, f[r, last][:, None])
        with np.errstate(invalid="ignore"):  # inf - inf in the padding
            dx = np.diff(x, axis=1)
        with np.errstate(invalid="ignore", divide="ignore"):
            inner = np.where(
                np.isfinite(dx) & (dx > 0),
                np.diff(f, axis=1) / np.where(np.isfinite(dx) & (dx > 0), dx, 1.0),
                0.0,
            )
        seg = np.zeros((rows, m + 1))
        seg[:, 0] = slope_below
        seg[:, 1:m] = inner
        # segments from the last real point on carry the slope above
        cols = np.arange(m + 1)[None, :]
        seg = np.where(cols >= count[:, None], np.asarray(slope_above, float)[:, None], seg)
        area = np.where(
            np.isfinite(dx), 0.5 * (f[:, 1:] + f[:, :-1]) * np.where(np.isfinite(dx), dx, 0.0), 0.0
        )
        w = np.concatenate((np.zeros((rows, 1)), np.cumsum(area, axis=1)), axis=1)
        return _CurveTable(np.asarray(parts, dtype=np.int64), x, f, w, seg, count)

    def evaluate(self, e: np.ndarray) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
        """Force, slope and energy of each row at elongation ``e`` (one value per row)."""
        idx = np.sum(self.x <= e[:, None], axis=1)  # 0 below x[0], n above x[n-1]
        rows = np.arange(idx.size)
        base = np.clip(idx - 1, 0, self.count - 1)
        s = self.seg[rows, idx]
        de = e - self.x[rows, base]
        force = self.f[rows, base] + s * de
        energy = self.w[rows, base] + self.f[rows, base] * de + 0.5 * s * de * de
        return force, s, energy


@dataclass(frozen=True)
class Solution:
    """Result of :meth:`Network.solve` (arrays per node and per part)."""

    displacement: np.ndarray
    force: np.ndarray
    elongation: np.ndarray
    carrying: np.ndarray
    reaction: np.ndarray
    residual: float
    iterations: int


def _memory_budget() -> float:
    """Bytes a banded factor may take: a quarter of the machine's memory, at most 4 GiB."""
    try:
        total = os.sysconf("SC_PHYS_PAGES") * os.sysconf("SC_PAGE_SIZE")
    except (AttributeError, ValueError, OSError):  # pragma: no cover - not POSIX
        total = 8 * 2**30
    return min(total / 4, 4 * 2**30)


def _banded_fits(nf: int, band: int) -> bool:
    """Whether a banded Cholesky of ``nf`` unknowns and half band ``band`` is the right
    solver: its work ``nf (band + 1)^2`` and its storage (factor plus a copy) fit."""
    return nf * (band + 1) ** 2 <= _BAND_FLOPS and 16.0 * nf * (band + 1) <= _memory_budget()


class _LinearSolver:
    """Solves ``B^T diag(s) B x = r`` on the free nodes by the method the size, band and
    memory call for: dense Cholesky (a few nodes, numpy only), banded Cholesky (after
    reverse Cuthill-McKee ordering when that narrows the band; hub nodes eliminated
    by their Schur complement), sparse direct (SuperLU) for wide but local patterns, or
    preconditioned conjugate gradients for non-local ones."""

    def __init__(self, nf: int, fi: np.ndarray, fj: np.ndarray, explain):
        self.nf = nf
        self.explain = explain  # raises InputError if the network has a floating group
        both = (fi >= 0) & (fj >= 0)
        self.fi, self.fj = fi, fj
        self.bi, self.bj = fi[both], fj[both]
        self.both = both
        self.perm: np.ndarray | None = None
        self.hubs: tuple[np.ndarray, ...] | None = None
        self.method = "dense"
        band = int(np.max(np.abs(self.bi - self.bj), initial=0))
        self.band = band
        if nf <= _DENSE_MAX:
            return  # numpy alone: no import of scipy's linear algebra for a small network
        self.method = "banded"
        if band > 8 and nf > 16:
            self._find_hubs(nf, band)
            if self.hubs is not None:
                self.method = "hubs"
                return
        if _banded_fits(nf, band):
            return
        from scipy.sparse import coo_array
        from scipy.sparse.csgraph import reverse_cuthill_mckee

        g = coo_array((np.ones(self.bi.size), (self.bi, self.bj)), shape=(nf, nf)).tocsr()
        perm = reverse_cuthill_mckee(g, symmetric_mode=False)
        inv = np.empty(nf, dtype=np.int64)
        inv[perm] = np.arange(nf)
        band_rcm = int(np.max(np.abs(inv[self.bi] - inv[self.bj]), initial=0))
        if _banded_fits(nf, band_rcm):
            self.perm, self.inv, self.band = perm, inv, band_rcm
        elif nf <= _SPARSE_ALWAYS or band_rcm <= _LOCAL_BAND * math.sqrt(nf):
            # a wide but local structure (a plate-like mesh): sparse direct keeps its fill low
            self.method, self.band = "sparse", -1
        else:
            # non-local couplings: any direct factor fills in; conjugate gradients instead
            self.method, self.band = "iterative", -1

    def _find_hubs(self, nf: int, band: int) -> None:
        """Nodes coupled to very many others (a common node of many parts, such as one
        rotation shared by a ring of parts) widen the band for all.  When a few such hubs
        leave the rest narrow, the solve eliminates them by their Schur complement
        (:meth:`_with_hubs`): a banded Cholesky of the rest with one right-hand side per
        hub, then a small dense system."""
        deg = np.bincount(self.bi, minlength=nf) + np.bincount(self.bj, minlength=nf)
        hub = deg > max(16, 8 * float(np.median(deg)))
        nh = int(hub.sum())
        if nh == 0 or nh > 8:
            return
        rest = np.flatnonzero(~hub)
        pos = np.full(nf, -1, dtype=np.int64)
        pos[rest] = np.arange(rest.size)
        inner = ~hub[self.bi] & ~hub[self.bj]
        rb = int(np.max(np.abs(pos[self.bi[inner]] - pos[self.bj[inner]]), initial=0))
        if (rb + 1) ** 2 * (rest.size + 1) * 4 > (band + 1) ** 2 * nf:
            return  # not worth it: the rest is about as wide
        hidx = np.flatnonzero(hub)
        nh = hidx.size
        hpos = np.full(nf, -1, dtype=np.int64)
        hpos[hidx] = np.arange(nh)
        a, b = self.bi[~inner], self.bj[~inner]
        both = hub[a] & hub[b]
        r = np.where(hub[a], b, a)  # the node of the rest
        h = np.where(hub[a], a, b)  # the hub
        flat_B = np.where(both, -1, pos[r] * nh + hpos[h])
        flat_D = np.where(both, hpos[a] * nh + hpos[b], -1)
        flat_Dt = np.where(both, hpos[b] * nh + hpos[a], -1)
        self.hubs = (hub, rest, hidx, pos, inner, rb, both, flat_B, flat_D, flat_Dt)

    def _with_hubs(self, diag, sb, rhs) -> np.ndarray:
        """Solve by eliminating the hub nodes (see :meth:`_find_hubs`)."""
        assert self.hubs is not None
        hub, rest, hidx, pos, inner, rb, both, flat_B, flat_D, flat_Dt = self.hubs
        bi, bj = self.bi, self.bj
        nh, nr = hidx.size, rest.size
        # couplings of the rest with the hubs (B) and among the hubs (D), from the
        # index arrays set up once
        v = sb[~inner]
        B = np.bincount(flat_B[~both], -v[~both], nr * nh).reshape(nr, nh)
        D = np.diag(diag[hidx])
        if both.any():
            D += np.bincount(flat_D[both], -v[both], nh * nh).reshape(nh, nh)
            D += np.bincount(flat_Dt[both], -v[both], nh * nh).reshape(nh, nh)
        saved = self.band, self.nf
        try:
            self.band, self.nf = rb, nr
            rhs_r = np.column_stack((rhs[rest], B))
            XY = self._banded(diag[rest], pos[bi[inner]], pos[bj[inner]], sb[inner], rhs_r)
        finally:
            self.band, self.nf = saved
        XY = XY.reshape(nr, nh + 1)
        x_r, Y = XY[:, 0], XY[:, 1:]
        S = D - B.T @ Y
        # a floating group shows as a (nearly) singular Schur complement: the same test
        # as the banded Cholesky's tiny pivot
        if np.min(np.linalg.eigvalsh(0.5 * (S + S.T))) <= 1e-12 * max(float(diag.max()), 1e-300):
            self.explain()
        x_h = np.linalg.solve(S, rhs[hidx] - B.T @ x_r)
        out = np.empty(self.nf)
        out[rest] = x_r - Y @ x_h
        out[hidx] = x_h
        return out

    def solve(self, s: np.ndarray, rhs: np.ndarray) -> np.ndarray:
        nf = self.nf
        if nf == 0:
            return np.zeros(0)
        fi, fj = self.fi, self.fj
        diag = np.bincount(fi[fi >= 0], s[fi >= 0], nf) + np.bincount(fj[fj >= 0], s[fj >= 0], nf)
        sb = s[self.both]
        bi, bj = self.bi, self.bj
        if self.method == "dense":
            return self._dense(diag, bi, bj, sb, rhs)
        if self.method == "iterative":
            return self._iterative(diag, bi, bj, sb, rhs)
        if self.hubs is not None:
            try:
                x = self._with_hubs(diag, sb, rhs)
                if np.all(np.isfinite(x)):
                    return x
            except np.linalg.LinAlgError:
                pass
            self.explain()
            return self._sparse(diag, bi, bj, sb, rhs)
        # the same matrix again (iterative refinement): reuse the banded factor
        self._reuse = s is getattr(self, "_last_s", None)
        self._last_s = s
        if self.band >= 0:
            if self.perm is not None:
                diag, bi, bj, rhs = diag[self.perm], self.inv[bi], self.inv[bj], rhs[self.perm]
            x = self._banded(diag, bi, bj, sb, rhs)
            if self.perm is not None:
                out = np.empty(nf)
                out[self.perm] = x
                return out
            return x
        return self._sparse(diag, bi, bj, sb, rhs)

    def _dense(self, diag, bi, bj, sb, rhs) -> np.ndarray:
        """A few free nodes: dense Cholesky test and solve with numpy alone."""
        nf = self.nf
        flat = np.concatenate((bi * nf + bj, bj * nf + bi))
        mat = np.diag(np.asarray(diag, dtype=float))
        if flat.size:
            mat += np.bincount(flat, np.concatenate((-sb, -sb)), nf * nf).reshape(nf, nf)
        try:
            low = np.linalg.cholesky(mat)
            if np.min(np.diag(low)) ** 2 <= 1e-14 * max(float(diag.max()), 1e-300):
                self.explain()  # a tiny pivot: a floating group or merely ill-conditioned
        except np.linalg.LinAlgError:
            # not positive definite to round-off (parts of very different stiffness):
            # unless a group floats, an LU solve with pivoting still answers
            self.explain()
        try:
            x = np.linalg.solve(mat, rhs)
        except np.linalg.LinAlgError:
            x = np.full(nf, np.nan)
        if not np.all(np.isfinite(x)):
            self.explain()
            raise SolveError("the stiffness matrix is singular (a mechanism)")
        return x

    def _iterative(self, diag, bi, bj, sb, rhs) -> np.ndarray:
        """Conjugate gradients (Hestenes & Stiefel, 1952) with a two-level additive
        preconditioner: Jacobi on every node plus an exact correction of each connected
        group's rigid translation (the mode a network held at few supports is soft in;
        the coarse space of two-level Schwarz / aggregation methods, e.g. Saad,
        *Iterative Methods for Sparse Linear Systems*, 2nd ed., ch. 13-14).  For a
        network whose parts join distant nodes the remaining spectrum is narrow, so
        the iteration count hardly grows with size."""
        from scipy.sparse import csr_array

        nf = self.nf
        rows = np.concatenate((bi, bj))
        cols = np.concatenate((bj, bi))
        mat = csr_array((np.concatenate((-sb, -sb)), (rows, cols)), shape=(nf, nf))
        mat.sum_duplicates()
        label, count = self._groups()
        # stiffness of each group to the supports: z^T K z for the group's indicator z
        ground = diag - np.bincount(bi, sb, nf) - np.bincount(bj, sb, nf)
        coarse = np.bincount(label, ground, count)
        if np.any(coarse <= 1e-12 * np.bincount(label, diag, count)):
            self.explain()
        inv_d = 1.0 / diag

        def precondition(r: np.ndarray) -> np.ndarray:
            return inv_d * r + (np.bincount(label, r, count) / coarse)[label]

        def apply(x: np.ndarray) -> np.ndarray:
            return diag * x + mat @ x

        x = np.zeros(nf)
        r = np.array(rhs, dtype=float)
        target = _CG_RTOL * float(np.linalg.norm(r))
        z = precondition(r)
        p = z.copy()
        rz = float(r @ z)
        for it in range(_CG_MAXITER):
            if float(np.linalg.norm(r)) <= target:
                break
            q = apply(p)
            pq = float(p @ q)
            if not pq > 0:
                self.explain()
                raise SolveError("the stiffness matrix is singular (a mechanism)")
            alpha = rz / pq
            x += alpha * p
            r -= alpha * q
            if it % 50 == 49:
                r = rhs - apply(x)  # replace the recurrence's residual by the true one
            z = precondition(r)
            rz_new = float(r @ z)
            p *= rz_new / rz
            p += z
            rz = rz_new
        else:
            return self._sparse(diag, bi, bj, sb, rhs)  # did not converge: direct after all
        self.iterations = it
        return x

    def _groups(self) -> tuple[np.ndarray, int]:
        """Connected groups of the free nodes (cached: the pattern never changes)."""
        cached = getattr(self, "_group_cache", None)
        if cached is None:
            from scipy.sparse import coo_array
            from scipy.sparse.csgraph import connected_components

            g = coo_array((np.ones(self.bi.size), (self.bi, self.bj)), shape=(self.nf, self.nf))
            count, label = connected_components(g, directed=False)
            cached = self._group_cache = (label, int(count))
        return cached

    def _banded(self, diag, bi, bj, sb, rhs) -> np.ndarray:
        from scipy.linalg.lapack import dpbtrf, dpbtrs

        b, nf = self.band, self.nf
        if getattr(self, "_reuse", False) and getattr(self, "_factor", None) is not None:
            self._reuse = False
            return dpbtrs(self._factor, rhs, lower=0)[0]
        ab = np.zeros((b + 1, nf))
        ab[b] = diag
        if b > 0 and bi.size:
            hi = np.maximum(bi, bj)
            d = np.abs(bi - bj)
            flat = (b - d) * nf + hi
            # every coupling has d > 0, so row b (the diagonal) is left as it is
            ab += np.bincount(flat, -sb, (b + 1) * nf).reshape(b + 1, nf)
        c, info = dpbtrf(ab, lower=0, overwrite_ab=1)
        if info != 0:
            self.explain()
            return self._sparse(diag, bi, bj, sb, rhs)
        pivots = c[b] ** 2
        if pivots.min() <= 1e-14 * max(float(diag.max()), 1e-300):
            self.explain()  # a tiny pivot: either a floating group or merely ill-conditioned
        x, info = dpbtrs(c, rhs, lower=0)
        if self.hubs is None:
            self._factor = c
        return x

    def _sparse(self, diag, bi, bj, sb, rhs) -> np.ndarray:
        import warnings

        from scipy.sparse import coo_array
        from scipy.sparse.linalg import MatrixRankWarning, spsolve

        nf = self.nf
        rows = np.concatenate((np.arange(nf), bi, bj))
        cols = np.concatenate((np.arange(nf), bj, bi))
        vals = np.concatenate((diag, -sb, -sb))
        mat = coo_array((vals, (rows, cols)), shape=(nf, nf)).tocsc()
        with warnings.catch_warnings():
            warnings.simplefilter("error", MatrixRankWarning)
            try:
                x = spsolve(mat, rhs, permc_spec="MMD_AT_PLUS_A")
            except (MatrixRankWarning, RuntimeError) as err:
                self.explain()
                raise SolveError(f"the stiffness matrix is singular ({err})") from None
        if not np.all(np.isfinite(x)):
            self.explain()
            raise SolveError("the stiffness matrix is singular (a mechanism)")
        return np.atleast_1d(x)


def elastic_plastic_curve(
    k: float,
    plastic: float = 0.0,
    yield_tension: float = math.inf,
    yield_compression: float = math.inf,
    carries_tension: bool = True,
    carries_compression: bool = True,
) -> Curve:
    """Elastic-perfectly-plastic force law as a :class:`Curve` for one load step.

    ``N = k (e - plastic)`` clipped to ``[-yield_compression, yield_tension]``;
    a part that carries no tension (or no compression) is slack on that side.
    After the step the plastic elongation moves to ``e - N/k`` wherever the part
    sits on a yield plateau (:func:`update_plastic`), so unloading follows the
    elastic slope (the classic elastic-perfectly-plastic bar, e.g. Gere & Goodno,
    *Mechanics of Materials*, ch. 2, elastoplastic analysis).
    """
    if not (k > 0 and math.isfinite(k)):
        raise InputError("an elastic-plastic part needs a positive, finite stiffness")
    Yt = yield_tension if carries_tension else 0.0
    Yc = yield_compression if carries_compression else 0.0
    xs: list[float] = []
    fs: list[float] = []
    if math.isfinite(Yc):
        xs.append(plastic - Yc / k)
        fs.append(-Yc)
    xs.append(plastic)
    fs.append(0.0)
    if math.isfinite(Yt):
        xs.append(plastic + Yt / k)
        fs.append(Yt)
    if len(xs) == 1:  # elastic both ways: a line through the plastic offset
        xs, fs = [plastic - 1.0, plastic], [-k, 0.0]
        return Curve(np.array(xs), np.array(fs), k, k)
    below = 0.0 if math.isfinite(Yc) else (k if carries_compression else 0.0)
    above = 0.0 if math.isfinite(Yt) else (k if carries_tension else 0.0)
    # zero-width segments (a side that carries nothing) are dropped
    pts = [(x, f) for n, (x, f) in enumerate(zip(xs, fs, strict=True)) if n == 0 or x > xs[n - 1]]
    if len(pts) == 1:
        x0 = pts[0][0]
        return Curve(np.array([x0 - 1.0, x0]), np.array([-below, 0.0]), below, above)
    return Curve(np.array([p[0] for p in pts]), np.array([p[1] for p in pts]), below, above)


def update_plastic(
    k: float,
    plastic: float,
    elongation: float,
    force: float,
    yield_tension: float,
    yield_compression: float,
) -> float:
    """New plastic elongation after a step: ``e - N/k`` where the part has yielded."""
    if math.isfinite(yield_tension) and force >= yield_tension * (1 - 1e-12):
        return max(plastic, elongation - yield_tension / k)
    if math.isfinite(yield_compression) and force <= -yield_compression * (1 - 1e-12):
        return min(plastic, elongation + yield_compression / k)
    return plastic
