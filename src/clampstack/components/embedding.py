"""Embedding (settling) of bolted joints after VDI 2230-1.

Surface roughness peaks flatten under the preload; the joint loses the embedding
amount ``f_Z`` of length and so the preload ``F_Z = f_Z/(delta_S + delta_P)``
(VDI 2230-1:2015, section 5.4.2.1, step R4; clause number from memory).

The guide values of VDI 2230-1 (Table 5.4/1, from memory), in micrometres, for solid
steel parts:

==============  =========  ======  =============  =========================
R_z             load       thread  per head/nut   per inner interface
                                   bearing
==============  =========  ======  =============  =========================
< 10 um         axial      3       2.5            1.5
< 10 um         transverse 3       3              2
10 to < 40 um   axial      3       3              2
10 to < 40 um   transverse 3       4.5            2.5
40 to < 160 um  axial      3       4              3
40 to < 160 um  transverse 3       6.5            3.5
==============  =========  ======  =============  =========================

Units: SI (m, N).  Vectorised over ``Rz`` and the counts.
"""

from __future__ import annotations

from typing import Literal

import numpy as np

from ._util import FloatArray, as_array, out, require

__all__ = ["EMBEDDING_TABLE_UM", "embedding_amount", "embedding_preload_loss"]

#: VDI 2230-1 guide values (from memory): (Rz upper bound [um], load) ->
#: (thread, per head or nut bearing, per inner interface) [um].
EMBEDDING_TABLE_UM: dict[tuple[float, str], tuple[float, float, float]] = {
    (10.0, "axial"): (3.0, 2.5, 1.5),
    (10.0, "transverse"): (3.0, 3.0, 2.0),
    (40.0, "axial"): (3.0, 3.0, 2.0),
    (40.0, "transverse"): (3.0, 4.5, 2.5),
    (160.0, "axial"): (3.0, 4.0, 3.0),
    (160.0, "transverse"): (3.0, 6.5, 3.5),
}


def embedding_amount(
    Rz: FloatArray,
    n_interfaces: FloatArray,
    load: Literal["axial", "transverse"] = "axial",
    thread: bool = True,
    n_bearing: FloatArray = 2,
) -> FloatArray:
    """Embedding amount f_Z of a joint from VDI 2230-1's guide values (from memory).

    Formula::

        f_Z = f_thread + n_bearing f_bearing + n_interfaces f_inner

    with the three per-location values from :data:`EMBEDDING_TABLE_UM` chosen by the
    mean roughness ``R_z`` and the load direction.

    Parameters
    ----------
    Rz : float or ndarray
        Mean roughness depth R_z of the contact faces [m]; ``0 <= R_z < 160 um``.
    n_interfaces : int, float or ndarray
        Number of inner interfaces between clamped parts (plates, washers) [-].
    load : {"axial", "transverse"}
        Direction of the working load.
    thread : bool
        Count the thread (one engaged thread pair).
    n_bearing : int, float or ndarray
        Number of head and nut bearing faces [-]: 2 for a through-bolted joint (head and
        nut), 1 for a tapped thread joint (its interface with the tapped part is an inner
        interface).

    Returns
    -------
    float or ndarray
        ``f_Z`` [m].

    Notes
    -----
    Validity: solid steel parts, compressive surface pressure below the limit; VDI
    2230-1 recommends measured values for other materials, coatings and many
    interfaces.  Rough surfaces of 160 um and more are outside the table.

    References
    ----------
    VDI 2230 Part 1 (2015), section 5.4.2.1, Table 5.4/1 (values and numbering from memory).
    """
    if load not in ("axial", "transverse"):
        raise ValueError(f"unknown load {load!r}; expected 'axial' or 'transverse'")
    Rz_um = as_array(Rz) * 1e6
    n_i = as_array(n_interfaces)
    n_b = as_array(n_bearing)
    require(Rz_um >= 0, "roughness Rz must not be negative")
    require(Rz_um < 160.0, "roughness Rz of 160 um or more is outside the VDI 2230-1 table")
    require(n_i >= 0, "number of interfaces must not be negative")
    require(n_b >= 0, "number of bearing faces must not be negative")
    rows = [EMBEDDING_TABLE_UM[(bound, load)] for bound in (10.0, 40.0, 160.0)]
    conds = [Rz_um < 10.0, Rz_um < 40.0, Rz_um < 160.0]
    f_thread = np.select(conds, [r[0] for r in rows])
    f_bear = np.select(conds, [r[1] for r in rows])
    f_inner = np.select(conds, [r[2] for r in rows])
    total_um = (f_thread if thread else 0.0) + n_b * f_bear + n_i * f_inner
    return out(total_um * 1e-6)


def embedding_preload_loss(fZ: FloatArray, delta_S: FloatArray, delta_P: FloatArray) -> FloatArray:
    """Preload loss by embedding, ``F_Z = f_Z / (delta_S + delta_P)``.

    VDI 2230-1:2015, section 5.4.2.1 (step R4): the embedding amount shortens the bolt
    and clamped-part springs in series.

    Parameters
    ----------
    fZ : float or ndarray
        Embedding amount [m], >= 0.
    delta_S : float or ndarray
        Bolt resilience [m/N].
    delta_P : float or ndarray
        Clamped-part resilience [m/N] (concentric; use ``delta_P*`` for eccentric).

    Returns
    -------
    float or ndarray
        Preload loss [N].
    """
    f, dS, dP = as_array(fZ), as_array(delta_S), as_array(delta_P)
    require(f >= 0, "embedding amount must not be negative")
    require(dS > 0, "bolt resilience must be positive")
    require(dP > 0, "clamped-part resilience must be positive")
    return out(f / (dS + dP))
