"""Eccentric clamping and loading: VDI 2230-1's linear relations, and the contact past opening.

Coordinates run along the line through the bolt and the load, from the axis of
symmetry of the interface, positive toward the load's side (DESIGN.md):
``s`` the bolt's offset s_sym, ``a`` the line of action of the axial load, ``u``
the edge that opens first (signed).  A bending moment ``M_B`` counts positive in
the sense of an axial load at positive ``a`` (it unloads the interface on the
positive side).

The linear relations (VDI 2230-1:2015, 5.1.2.3, 5.3.2 and 5.5.3; from memory, each
also derived from the compatibility of a beam-like clamped body at the bolt line):

* bending resilience of the clamped body ``beta = l_K / (E_P I_Bers)`` [1/(N m)]
  (layer by layer: ``sum l_i / (E_i I_Bers)``);
* ``delta_P*  = delta_P + s^2 beta``   (eccentric clamping);
* ``delta_P** = delta_P + s a beta``   (eccentric loading);
* ``Phi_en* = n delta_P** / (delta_S + delta_P*)``, and for a moment
  ``Phi_m* = n s beta / (delta_S + delta_P*)`` [1/m];
* the interface pressure is linear over the interface (its area A_D and second
  moment I_BT, Navier), so the edge ``u`` opens when the residual clamp load falls to
  ``F_Kab = (F_A (a - s) u + M_B u) / (I_BT/A_D + s u)``;
* the bolt bends with the rotation of the clamped body:
  ``sigma_b = E_S d_S gamma / (2 l_ers)`` with ``gamma = beta (F_A a + M_B - F_SA s)``
  (VDI's form, the load's moment over the whole clamp length: conservative where n < 1);
  with ``M_B = 0`` this is VDI 2230-1's ``sigma_SAb`` term
  ``(1/Phi_en* - s/a)(l_K/l_ers)(E_S/E_P)(pi a d_S^3/(8 I_Bers)) Phi_en* F_A / A_S``.

Past opening the linear relations no longer hold.  :class:`EccentricJoint` then
solves the same joint as a spring model (our model, not VDI 2230): the bolt and the
clamped body outside the load-introduction planes in series; inside them the body's
resilience ``n delta_P`` and ``n beta`` split between an elastic core and a bed of
compression-only springs across the interface (the interface's width profile,
integrated exactly).  The bed's stiffness per unit area ``k`` is the softest that
fits inside the body's resilience, ``k = max(1/(n delta_P A_D), 1/(n beta I_BT))``.
While the whole interface is in contact the model reproduces ``Phi_en*``,
``Phi_m*`` and ``F_Kab`` exactly (the bed's pressure is Navier's); past opening
the bed lifts where it would pull, the contact shrinks toward the far edge and
the bolt load tends to the lever about that edge.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from ..errors import SolveError

# three-point Gauss-Legendre rule on [0, 1]: exact for polynomials up to degree five
_GX = np.array([0.5 - math.sqrt(0.15), 0.5, 0.5 + math.sqrt(0.15)])
_GW = np.array([5.0, 8.0, 5.0]) / 18.0


# --------------------------------------------------------------------------- interface


@dataclass(frozen=True)
class Interface:
    """The clamped interface, symmetric about its axis.

    ``shape``: ``"rectangle"`` (``width`` across the bolt-load line, ``length`` along
    it), ``"circle"`` (``length`` is the diameter) or ``"given"`` (``area`` and
    ``second_moment`` only; the contact model uses the rectangle of the same area and
    second moment, ``length = sqrt(12 I / A)``).  SI units.
    """

    shape: str
    area: float  # A_D [m^2]
    second_moment: float  # I_BT about the axis of symmetry [m^4]
    length: float  # extent along the bolt-load line [m]
    width: float | None = None

    @classmethod
    def rectangle(cls, width: float, length: float) -> Interface:
        return cls("rectangle", width * length, width * length**3 / 12.0, length, width)

    @classmethod
    def circle(cls, diameter: float) -> Interface:
        return cls("circle", math.pi * diameter**2 / 4, math.pi * diameter**4 / 64, diameter)

    @classmethod
    def given(cls, area: float, second_moment: float) -> Interface:
        length = math.sqrt(12.0 * second_moment / area)
        return cls("given", area, second_moment, length, area / length)

    @property
    def half(self) -> float:
        return 0.5 * self.length

    @property
    def core(self) -> float:
        """``I_BT / A_D`` [m^2]: the square of the section's radius of gyration."""
        return self.second_moment / self.area

    def lifts_under_preload(self, s: float) -> bool:
        """True when a bolt at ``s`` lies outside the core, ``|s| h > I_BT / A_D``: its
        preload alone lifts the far edge (Navier's pressure there is negative)."""
        return s != 0 and abs(s) * self.half > self.core

    def profile(self, segments: int = 256) -> tuple[np.ndarray, np.ndarray]:
        """Width ``b(x)`` at nodes ``x`` across the interface, linear between them [m].

        A rectangle (and the equivalent rectangle of given properties) is one segment,
        exact; a circle is ``segments`` chords of ``b = 2 sqrt(R^2 - x^2)``, with the
        nodes closer together toward the edges.
        """
        h = self.half
        if self.shape != "circle":
            w = self.area / self.length
            return np.array([-h, h]), np.array([w, w])
        t = np.linspace(-math.pi / 2, math.pi / 2, segments + 1)
        x = h * np.sin(t)
        return x, 2.0 * np.sqrt(np.maximum(h * h - x * x, 0.0))


def cone_body_inertia(dW: float, DA: float, lK: float, tan_phi: float, tapped: bool) -> float:
    """Substitute moment of inertia of the deformation body, cone(s) and sleeve [m^4].

    The bending resilience of a solid cone from ``d_W`` to ``D_A`` integrates to
    ``l_V / I_V`` with ``I_V = 3 pi/64 (D_A - d_W) d_W^3 D_A^3 / (D_A^3 - d_W^3)``
    (VDI 2230-1:2015, 5.1.2.3, ``0.147 (D_A - d_W) d_W^3 D_A^3 / (D_A^3 - d_W^3)``; from
    memory, and integrated here); a sleeve of ``D_A`` has ``pi D_A^4 / 64`` (the hole
    neglected, as in the cone's formula).  Two cones (through bolt) or one (tapped thread)
    of length ``l_V = (D_A - d_W) / (2 tan phi)``, the rest of ``l_K`` sleeve:
    ``I_Bers = l_K / (sum l_V/I_V + l_H/I_H)``.
    """
    cones = 1 if tapped else 2
    DA = max(DA, dW)
    lV = min((DA - dW) / (2.0 * tan_phi), lK / cones)
    DA = dW + 2.0 * lV * tan_phi  # the cone's end when l_K limits it
    if DA - dW > 1e-12 * dW:
        IV = 3 * math.pi / 64 * (DA - dW) * dW**3 * DA**3 / (DA**3 - dW**3)
    else:
        IV = math.pi * dW**4 / 64
    IH = math.pi * DA**4 / 64
    lH = max(lK - cones * lV, 0.0)
    return lK / (cones * lV / IV + lH / IH)


# --------------------------------------------------------------------------- the joint


@dataclass(frozen=True)
class ContactState:
    """One service state of the eccentric joint (SI)."""

    bolt_load: float  # F_S [N]
    clamp_load: float  # F_K: the interface's resultant [N]
    contact: tuple[float, float]  # the part of the interface in contact, x from..to [m]
    opened: bool  # a part of the interface has lifted
    rotation: float  # gamma: rotation of the clamped body that bends the bolt [rad]
    model: str  # "VDI 2230-1 linear" or "contact model"

    @property
    def contact_width(self) -> float:
        return self.contact[1] - self.contact[0]


@dataclass(frozen=True)
class EccentricJoint:
    """An eccentric joint at one temperature: the springs and the interface (SI).

    ``dS`` and ``dP`` are the bolt's and the clamped parts' axial resilience for
    concentric clamping [m/N], ``beta`` the clamped body's bending resilience about the
    interface's axis [1/(N m)], ``n`` the load introduction factor.
    """

    dS: float
    dP: float
    beta: float
    n: float
    s: float
    a: float
    u: float
    interface: Interface

    # ------------------------------------------------------------------ VDI linear
    @property
    def dP_star(self) -> float:
        """``delta_P* = delta_P + s^2 beta`` (VDI 2230-1:2015, 5.1.2.3; eccentric clamping)."""
        return self.dP + self.s**2 * self.beta

    @property
    def dP_2star(self) -> float:
        """``delta_P** = delta_P + s a beta`` (VDI 2230-1:2015, 5.1.2.3; eccentric loading)."""
        return self.dP + self.s * self.a * self.beta

    @property
    def phi_en(self) -> float:
        """``Phi_en* = n delta_P** / (delta_S + delta_P*)`` (VDI 2230-1:2015, 5.3.2)."""
        return self.n * self.dP_2star / (self.dS + self.dP_star)

    @property
    def phi_m(self) -> float:
        """``Phi_m* = n s beta / (delta_S + delta_P*)`` [1/m]: bolt load per moment."""
        return self.n * self.s * self.beta / (self.dS + self.dP_star)

    def opening_clamp_load(self, FA: float, MB: float, u: float | None = None) -> float:
        """``F_Kab`` [N]: the residual clamp load at which edge ``u`` starts to open.

        VDI 2230-1:2015, 5.3.2 (from memory):
        ``F_Kab = (F_A (a - s) u + M_B u) / (I_BT/A_D + s u)``, Navier's linear pressure
        over the interface set to zero at ``u``.  Not positive: that edge does not open
        under this load; infinite when the denominator vanishes or is negative (the edge
        is open under any clamp load).
        """
        u = self.u if u is None else u
        den = self.interface.core + self.s * u
        if den <= 0:
            return math.inf
        return (FA * (self.a - self.s) * u + MB * u) / den

    def linear(self, FV: float, FA: float, MB: float) -> tuple[float, float]:
        """Bolt load and residual clamp load while the interface is closed [N]."""
        FS = FV + self.phi_en * FA + self.phi_m * MB
        return FS, FS - FA

    def opening_ratio(self, FV: float, FA: float, MB: float, u: float | None = None) -> float:
        """Factor on ``(F_A, M_B)`` at which edge ``u`` opens (inf: it does not open).

        The residual clamp load ``F_V - lambda((1 - Phi_en*) F_A - Phi_m* M_B)`` meets
        ``lambda F_Kab(F_A, M_B)``; 0 when the edge is open under the preload alone.
        """
        u = self.u if u is None else u
        if self.interface.core + self.s * u <= 0:
            return 0.0
        den = (1 - self.phi_en) * FA - self.phi_m * MB + self.opening_clamp_load(FA, MB, u)
        if den <= 0:
            return math.inf
        return max(FV, 0.0) / den

    # ------------------------------------------------------------------ contact model
    @property
    def bed_stiffness(self) -> float:
        """``k`` [N/m^3]: the softest bed that fits inside ``n delta_P`` and ``n beta``."""
        i = self.interface
        return max(1.0 / (self.n * self.dP * i.area), 1.0 / (self.n * self.beta * i.second_moment))

    def _parts(self) -> tuple[float, float, float]:
        """Resilience of the bolt path, of the core in axial, of the core in bending."""
        k, i = self.bed_stiffness, self.interface
        path = self.dS + (1 - self.n) * self.dP_star
        core_a = max(self.n * self.dP - 1.0 / (k * i.area), 0.0)
        core_b = max(self.n * self.beta - 1.0 / (k * i.second_moment), 0.0)
        return path, core_a, core_b

    def bed(self, w: float, th: float) -> tuple[float, float, np.ndarray]:
        """Force ``P``, moment ``M`` (about the axis) and their Jacobian in ``(w, theta)``.

        The bed presses ``k b(x) (w + theta x)`` where that is positive; the integrals are
        exact on each segment of the width profile (Gauss, degree five).
        """
        x, b = self._profile
        k = self.bed_stiffness
        x0, x1, b0, b1 = x[:-1], x[1:], b[:-1], b[1:]
        f0, f1 = w + th * x0, w + th * x1
        lo, hi = x0.copy(), x1.copy()
        if th != 0.0:
            r = -w / th
            cut_lo = (f0 < 0) & (f1 > 0)
            cut_hi = (f0 > 0) & (f1 < 0)
            lo = np.where(cut_lo, r, lo)
            hi = np.where(cut_hi, r, hi)
        empty = (f0 <= 0) & (f1 <= 0)
        hi = np.where(empty, lo, hi)
        L = hi - lo
        xg = lo[:, None] + L[:, None] * _GX[None, :]
        span = np.where(x1 > x0, x1 - x0, 1.0)
        bg = b0[:, None] + (b1 - b0)[:, None] * (xg - x0[:, None]) / span[:, None]
        wg = (L[:, None] * _GW[None, :]) * bg * k
        fg = w + th * xg
        P = float(np.sum(wg * fg))
        M = float(np.sum(wg * fg * xg))
        J = np.array(
            [
                [np.sum(wg), np.sum(wg * xg)],
                [np.sum(wg * xg), np.sum(wg * xg * xg)],
            ]
        )
        return P, M, J

    @property
    def _profile(self) -> tuple[np.ndarray, np.ndarray]:
        cache = self.__dict__.get("_profile_cache")
        if cache is None:
            cache = self.interface.profile()
            object.__setattr__(self, "_profile_cache", cache)
        return cache

    def _contact(self, w: float, th: float) -> tuple[float, float]:
        h = self.interface.half
        if th == 0.0:
            return (-h, h) if w > 0 else (0.0, 0.0)
        r = -w / th
        if th > 0:
            return (min(max(r, -h), h), h)
        return (-h, min(max(r, -h), h))

    def bed_inverse(self, P: float, M: float, guess: tuple[float, float] | None = None):
        """``(w, theta)`` of the bed that carries force ``P`` > 0 and moment ``M``."""
        i, k = self.interface, self.bed_stiffness
        if guess is None:
            guess = (P / (k * i.area), M / (k * i.second_moment))
        sw, st = P / (k * i.area), max(P, 1.0) / (k * i.second_moment) * i.half
        sP, sM = max(P, 1.0), max(P, 1.0) * i.half

        def res(z):
            Pb, Mb, J = self.bed(z[0], z[1])
            if J[0, 0] <= 0:  # nothing in contact: not a trial point to accept
                return np.array([np.inf, np.inf]), J
            return np.array([(Pb - P) / sP, (Mb - M) / sM]), J

        z = self._newton(np.array(guess, dtype=float), res, (sw, st), (sP, sM))
        return float(z[0]), float(z[1])

    def _newton(self, z, res, zs, rs, tol: float = 1e-13, limit: int = 100):
        """Damped Newton on a residual of two scaled equations."""
        zs, rs = np.asarray(zs), np.asarray(rs)
        r, J = res(z)
        for _ in range(limit):
            nr = float(np.linalg.norm(r))
            if nr < tol:
                return z
            Js = J * zs[None, :] / rs[:, None]
            try:
                step = -np.linalg.solve(Js, r) * zs
            except np.linalg.LinAlgError:
                break
            t = 1.0
            while t > 1e-6:
                zn = z + t * step
                rn, Jn = res(zn)
                if float(np.linalg.norm(rn)) < (1 - 1e-4 * t) * nr:
                    break
                t *= 0.5
            else:
                break
            z, r, J = zn, rn, Jn
        if float(np.linalg.norm(r)) < 1e-9:
            return z
        raise SolveError(
            "the contact model of the eccentric joint finds no equilibrium with the interface "
            "in contact (the clamped parts lift off)"
        )

    def assembly(self, FV: float) -> tuple[float, float]:
        """Bed state ``(w, theta)`` under the preload alone (the bolt at ``s``)."""
        return self.bed_inverse(FV, FV * self.s)

    @property
    def open_at_assembly(self) -> bool:
        """True when the preload alone lifts the far edge (bolt outside the core)."""
        return self.interface.lifts_under_preload(self.s)

    def state(self, FV: float, FA: float, MB: float) -> ContactState:
        """Bolt load, clamp load, contact and rotation under ``F_A`` and ``M_B`` (SI).

        While the interface stays closed: the VDI 2230-1 linear relations, exactly.
        Otherwise the contact model, followed from the opening point (continuation in the
        load, Newton's method on the bed's two unknowns).
        """
        i, h = self.interface, self.interface.half
        if FV <= 0:  # no preload left: nothing holds the parts together
            return _separated(FA)
        lam0 = 0.0
        if not self.open_at_assembly:
            FS, FK = self.linear(FV, FA, MB)
            if FK <= 0 and self._on_bolt_line(FA, MB):
                # the load on the bolt's line: past F_A,sep the bolt carries it alone
                return _separated(FA)
            Mb = FS * self.s - FA * self.a - MB  # the bed's moment about the axis
            if FK > 0 and FK / i.area - abs(Mb) * h / i.second_moment >= -1e-12 * FK / i.area:
                gamma = -self.beta * (Mb - FV * self.s)
                return ContactState(FS, FK, (-h, h), False, gamma, "VDI 2230-1 linear")
            lam0 = min(
                self.opening_ratio(FV, FA, MB, h),
                self.opening_ratio(FV, FA, MB, -h),
                1.0,
            )
        return self._follow(FV, FA, MB, lam0)

    def _on_bolt_line(self, FA: float, MB: float) -> bool:
        """True when the load's moment about the bolt vanishes, ``F_A (s - a) = M_B``:
        the bolt alone can carry it, and the parts may separate as a concentric joint's."""
        scale = abs(FA) * self.interface.half + abs(MB)
        return abs(FA * (self.s - self.a) - MB) <= 1e-9 * scale

    def _follow(self, FV: float, FA: float, MB: float, lam0: float) -> ContactState:
        path, core_a, core_b = self._parts()
        s, a = self.s, self.a
        i, k = self.interface, self.bed_stiffness
        w0, th0 = self.assembly(FV)
        P0, M0 = FV, FV * s
        ref0 = core_a * P0 + s * core_b * M0 + w0 + th0 * s
        if lam0 > 0:  # start at the opening point, where the linear relations still hold
            FS, FK = self.linear(FV, lam0 * FA, lam0 * MB)
            Mb = FS * s - lam0 * (FA * a + MB)
            z = np.array([FK / (k * i.area), Mb / (k * i.second_moment)])
        else:
            z = np.array([w0, th0])
        scale_F = max(abs(FV), abs(FA), abs(MB) / i.half, 1.0)
        zs = (scale_F / (k * i.area), scale_F / (k * i.second_moment) * i.half)
        rs = (scale_F * i.half, path * scale_F)

        def residual(lam: float):
            fa, mb = lam * FA, lam * MB

            def res(zz):
                P, M, J = self.bed(zz[0], zz[1])
                if J[0, 0] <= 0:  # nothing in contact: not a trial point to accept
                    return np.array([np.inf, np.inf]), J
                # equilibrium of moments: M = P s + F_A (s - a) - M_B
                r1 = M - P * s - fa * (s - a) + mb
                # compatibility at the bolt line: bolt path + core + bed
                r2 = (P + fa - FV) * path + core_a * P + s * core_b * M + zz[0] + zz[1] * s - ref0
                Jr = np.array(
                    [
                        [J[1, 0] - s * J[0, 0], J[1, 1] - s * J[0, 1]],
                        [
                            (path + core_a) * J[0, 0] + s * core_b * J[1, 0] + 1.0,
                            (path + core_a) * J[0, 1] + s * core_b * J[1, 1] + s,
                        ],
                    ]
                )
                return np.array([r1 / rs[0], r2 / rs[1]]), Jr

            return res

        # continuation in the load from the opening point; the step shrinks where Newton
        # does not converge and grows again where it does
        lam, step = lam0, (1.0 - lam0) / 12
        while lam < 1.0:
            target = min(1.0, lam + step)
            try:
                z = self._newton(z, residual(target), zs, rs)
            except SolveError:
                if self._on_bolt_line(FA, MB):
                    return _separated(FA)
                step *= 0.25
                if step < 1e-9 * max(1.0 - lam0, 1e-12):
                    raise
                continue
            lam, step = target, step * 1.5
        P, M, _ = self.bed(z[0], z[1])
        FS = P + FA
        dM = M - M0
        extra = (z[1] - th0) - dM / (k * i.second_moment)
        gamma = -self.beta * dM - extra
        lo, hi = (float(v) for v in self._contact(float(z[0]), float(z[1])))
        opened = bool(hi - lo < i.length * (1 - 1e-12))
        return ContactState(float(FS), float(P), (lo, hi), opened, float(gamma), "contact model")

    def edge_in_contact(self, FV: float, FA: float, MB: float, u: float | None = None) -> bool:
        """True when the contact model keeps edge ``u`` in contact under ``(F_A, M_B)``."""
        u = self.u if u is None else u
        h = self.interface.half
        u = max(min(u, h), -h)  # a given interface: the edge of its equivalent rectangle
        lo, hi = self.state(FV, FA, MB).contact
        tol = 1e-9 * self.interface.length
        return lo - tol <= u <= hi + tol

    def contact_opening_ratio(
        self, FV: float, FA: float, MB: float, u: float | None = None, limit: float = 64.0
    ) -> float:
        """Factor on ``(F_A, M_B)`` at which the contact model lifts edge ``u`` (inf: not
        up to ``limit``); bisection to a relative 1e-6.  For joints whose preload alone
        lifts the other edge, where the linear :meth:`opening_ratio` does not apply."""
        if not self.edge_in_contact(FV, 0.0, 0.0, u):
            return 0.0
        lo, hi = 0.0, 1.0
        while self.edge_in_contact(FV, hi * FA, hi * MB, u):
            lo, hi = hi, 2 * hi
            if hi > limit:
                return math.inf
        while hi - lo > 1e-6 * hi:
            mid = 0.5 * (lo + hi)
            if self.edge_in_contact(FV, mid * FA, mid * MB, u):
                lo = mid
            else:
                hi = mid
        return 0.5 * (lo + hi)

    def curve(
        self, FV: float, FA: float, MB: float, ratios: np.ndarray
    ) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
        """Bolt load, clamp load and contact width along ``lambda (F_A, M_B)`` (SI arrays)."""
        FS, FK, cw = [], [], []
        for lam in ratios:
            st = self.state(FV, lam * FA, lam * MB)
            FS.append(st.bolt_load)
            FK.append(st.clamp_load)
            cw.append(st.contact_width)
        return np.array(FS), np.array(FK), np.array(cw)


def _separated(FA: float) -> ContactState:
    """The parts apart: the bolt carries a pulling load alone, nothing is in contact."""
    return ContactState(max(FA, 0.0), 0.0, (0.0, 0.0), True, 0.0, "separated")


def first_opening_edge(joint: EccentricJoint, FV: float, loads: list[tuple[float, float]]) -> float:
    """The edge ``+h`` or ``-h`` that opens first along ``lambda (F_A, M_B)``, over the
    load states ``loads`` (the maximum and the minimum service load) [m]."""
    h = joint.interface.half
    best, edge = math.inf, h
    for FA, MB in loads:
        for u in (h, -h):
            lam = joint.opening_ratio(FV, FA, MB, u)
            if lam < best:
                best, edge = lam, u
    return edge


def bolt_bending_stress(gamma: float, E_S: float, d_S: float, l_ers: float) -> float:
    """Bending stress at the bolt's surface for a rotation ``gamma`` of the clamped body [Pa].

    ``sigma_b = E_S d_S gamma / (2 l_ers)``: the bolt, of substitute bending length
    ``l_ers`` referred to the stress diameter ``d_S``, follows the rotation (VDI
    2230-1:2015, 5.5.3, the bending term of ``sigma_SAb``; from memory, derived).
    """
    return E_S * d_S * gamma / (2.0 * l_ers)


def substitute_inertia(
    dW: float, lK: float, DA: float | None, tapped: bool, interface: Interface
) -> tuple[float, str]:
    """``I_Bers`` [m^4] of the deformation body about the interface's axis, and its basis.

    The VDI 2230-1 cone (angle from :func:`~clampstack.components.cone_tan_phi`) and
    sleeve of :func:`cone_body_inertia`, its outer diameter ``D_A`` the plates' (or the
    full cone's) and not more than the interface's smaller dimension; and never more than
    the interface's own second moment ``I_BT`` (the body cannot be stiffer in bending
    than the section it passes through; VDI 2230-1:2015, 5.1.2.3, from memory).
    """
    from ..components import cone_tan_phi, full_cone_outer_diameter

    full = float(full_cone_outer_diameter(lK, dW, tapped))
    limit = min(interface.length, interface.width or interface.length)
    D = min(full, DA if DA else full, limit)
    D = max(D, dW)
    t = float(cone_tan_phi(lK, dW, D, tapped))
    body = cone_body_inertia(dW, D, lK, t, tapped)
    if body >= interface.second_moment:
        return interface.second_moment, (
            "I_BT of the interface (the deformation body would be stiffer; VDI 2230-1:2015, "
            "5.1.2.3, from memory)"
        )
    return body, (
        f"deformation cone and sleeve, D_A = {D * 1e3:.4g} mm, tan phi = {t:.3g} "
        "(VDI 2230-1:2015, 5.1.2.3, from memory)"
    )


@dataclass(frozen=True)
class States:
    """Bolt load, clamp load and body rotation at many points (SI arrays)."""

    bolt_load: np.ndarray
    clamp_load: np.ndarray
    rotation: np.ndarray
    opened: np.ndarray  # bool: the interface has lifted at that point


def eccentric_states(
    dS: np.ndarray,
    dP_star: np.ndarray,
    beta: np.ndarray,
    n: float,
    s: float,
    a: float,
    u: float,
    interface: Interface,
    FV: np.ndarray,
    FA: float | np.ndarray,
    MB: float,
    lift_off: bool = False,
) -> States:
    """:meth:`EccentricJoint.state` over arrays of springs and preloads (vectorised).

    The VDI 2230-1 linear relations in closed form wherever the interface stays closed;
    the contact model, point by point, only where it opens.  ``dP_star`` is the
    resilience at the bolt line, ``delta_P*`` (what the temperature model gives).
    ``lift_off``: where the contact model finds no equilibrium (the parts lift off), the
    bolt carries the load and the clamp load is zero, instead of a SolveError.
    """
    dS, dPs, beta, FV, FA = (
        np.array(x, dtype=float) for x in np.broadcast_arrays(dS, dP_star, beta, FV, FA)
    )
    dP = dPs - s * s * beta
    den = dS + dPs
    FS = FV + n * (dP + s * a * beta) / den * FA + n * s * beta / den * MB
    FK = FS - FA
    Mb = FS * s - FA * a - MB
    i, h = interface, interface.half
    closed = (FK > 0) & (FK / i.area - np.abs(Mb) * h / i.second_moment >= -1e-12 * FK / i.area)
    if i.lifts_under_preload(s):
        closed[...] = False
    gamma = -beta * (Mb - FV * s)
    opened = np.zeros(FS.shape, dtype=bool)
    for idx in zip(*np.nonzero(~closed), strict=True):
        ej = EccentricJoint(float(dS[idx]), float(dP[idx]), float(beta[idx]), n, s, a, u, interface)
        try:
            st = ej.state(float(FV[idx]), float(FA[idx]), MB)
        except SolveError:
            if not lift_off:
                raise
            FS[idx], FK[idx], gamma[idx], opened[idx] = max(FA[idx], 0.0), 0.0, 0.0, True
            continue
        FS[idx], FK[idx], gamma[idx], opened[idx] = (
            st.bolt_load,
            st.clamp_load,
            st.rotation,
            st.opened,
        )
    return States(FS, FK, gamma, opened)
