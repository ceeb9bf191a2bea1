"""Bolt load and clamp load against the axial working load, from the joint network.

:func:`load_curve` solves the same spring network that
:func:`clampstack.joint.analysis.analyse` builds for the service state (bolt
``H-N`` in parallel with the clamped stack ``H-A-B-N`` split at the load
introduction planes; VDI 2230-1:2015, 5.3 and 5.2.2) at a series of working
loads ``F_A``, at the service temperature.  Nothing new is modelled here: the
springs, the preload misfit, the embedding and the thermal free elongations are
those of the analysis, taken from the :class:`~clampstack.joint.analysis.JointResult`
(the thermal elongations from the joint's
:class:`~clampstack.joint.thermal.TemperatureModel`, as ``analyse`` does).

While both the bolt and the interface carry, the curves are the straight lines
``F_S = F_V + Phi_n F_A`` and ``F_K = F_V - (1 - Phi_n) F_A`` (VDI 2230-1,
5.3.1); at the separation load ``F_A,sep = F_V / (1 - Phi_n)`` (5.3.2) the
interface opens and beyond it the bolt carries all of ``F_A``.  The knee is
included as one of the points so that a plot through the points is exact.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from .analysis import JointResult
from .prepare import joint_network, solve_service
from .thermal import TemperatureModel


@dataclass(frozen=True)
class LoadCurve:
    """Bolt load and clamp load of one preload branch over working loads [N]."""

    branch: str  # "min": minimum assembly preload with embedding; "max": maximum, without
    axial_load: np.ndarray  # F_A, ascending
    bolt_load: np.ndarray  # F_S
    clamp_load: np.ndarray  # F_K (clamp load at the interface)
    preload: float  # F_V at service temperature, F_A = 0
    separation_load: float  # F_A at the knee (the interface opens)
    temperature: float  # service temperature [K]


def load_curve(
    result: JointResult, n_points: int = 61, branch: str = "min", up_to: float | None = None
) -> LoadCurve:
    """Solve the joint network at working loads from 0 to 1.5 x the larger of F_A,sep and F_A,max.

    Parameters
    ----------
    result
        The analysed joint.
    n_points
        Number of evenly spaced working loads (at least 2); the separation load,
        the service loads and zero are added, so the curve may hold a few more.
    branch
        ``"min"`` (default): minimum assembly preload ``F_M,min`` with embedding,
        the branch that governs the residual clamp load and separation;
        ``"max"``: maximum assembly preload ``F_M,max`` without embedding, the
        branch that governs the bolt load (VDI 2230-1 R8, R10).
    up_to
        Largest working load [N]; default 1.5 times the larger of the separation
        load (minimum branch) and the maximum axial load.

    Returns
    -------
    LoadCurve
        Working loads ``F_A`` [N] and the bolt and clamp loads there [N].
    """
    if branch not in ("min", "max"):
        raise ValueError(f'branch must be "min" or "max", not {branch!r}')
    if n_points < 2:
        raise ValueError("n_points must be at least 2")
    s = result.spec
    srv = s.service
    dSa, dPa = result.springs.delta_S, result.springs.delta_P
    dSs, dPs = result.springs_service.delta_S, result.springs_service.delta_P
    n = srv.load_height
    th_bolt, th_clamp = (float(x) for x in TemperatureModel(s).thermal(srv.temperature))
    if branch == "min":
        FM, fz = result.assembly_min, result.embedding_amount
    else:
        FM, fz = result.assembly_max, 0.0
    # the 'hot' network of analyse(): preload misfit, thermal free elongations, embedding
    misfit = -FM * (dSa + dPa)
    jn = joint_network(dSs, dPs, n, misfit + th_bolt, th_clamp - fz)
    FV = solve_service(jn, 0.0)[1]  # clamp load at F_A = 0 (the preload at service temperature)
    phi = result.load_factor_service
    if branch == "min":
        sep = result.separation_load
    else:
        sep = max(FV, 0.0) / (1.0 - phi)  # VDI 2230-1, 5.3.2, for the maximum-preload branch
    FA_lo, FA_hi = srv.axial_load
    top = 1.5 * max(result.separation_load, FA_hi) if up_to is None else float(up_to)
    if not top > 0:
        top = 1.5 * max(result.assembly_max, abs(FA_lo), 1.0)
    bottom = min(0.0, FA_lo)
    FA = np.linspace(bottom, top, n_points)
    extra = [x for x in (0.0, FA_lo, FA_hi, sep) if bottom <= x <= top and (x != sep or sep > 0)]
    FA = np.unique(np.concatenate([FA, np.asarray(extra, dtype=float)]))
    bolt = np.empty_like(FA)
    clamp = np.empty_like(FA)
    for i, f in enumerate(FA):
        bolt[i], clamp[i] = solve_service(jn, float(f))
    return LoadCurve(branch, FA, bolt, clamp, FV, sep, srv.temperature)
