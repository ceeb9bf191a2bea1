"""Embedding amounts and preload loss (VDI 2230-1, section 5.4.2; table values from memory)."""

from __future__ import annotations

import numpy as np
import pytest

from clampstack.components.embedding import embedding_amount, embedding_preload_loss


@pytest.mark.parametrize(
    ("Rz_um", "load", "per_location"),
    [
        (6.3, "axial", (3.0, 2.5, 1.5)),  # Rz < 10 um (VDI 2230-1 table, from memory)
        (6.3, "transverse", (3.0, 3.0, 2.0)),
        (10.0, "axial", (3.0, 3.0, 2.0)),  # 10 <= Rz < 40
        (25.0, "transverse", (3.0, 4.5, 2.5)),
        (40.0, "axial", (3.0, 4.0, 3.0)),  # 40 <= Rz < 160
        (100.0, "transverse", (3.0, 6.5, 3.5)),
    ],
)
def test_table_rows(Rz_um, load, per_location):
    t, b, i = per_location
    f = embedding_amount(Rz_um * 1e-6, n_interfaces=2, load=load)
    assert f == pytest.approx((t + 2 * b + 2 * i) * 1e-6)


def test_counts_and_thread_switch():
    # Through bolt, one inner interface, Rz 6.3 um, axial: 3 + 2 x 2.5 + 1.5 = 9.5 um
    assert embedding_amount(6.3e-6, 1) == pytest.approx(9.5e-6)
    # Tapped joint: one bearing face, the interface to the tapped part is an inner one.
    assert embedding_amount(6.3e-6, 1, n_bearing=1) == pytest.approx(7.0e-6)
    assert embedding_amount(6.3e-6, 0, thread=False, n_bearing=0) == 0.0


def test_vectorised_and_limits():
    f = embedding_amount(np.array([1e-6, 20e-6, 80e-6]), 1)
    np.testing.assert_allclose(f, [9.5e-6, 11e-6, 14e-6])
    with pytest.raises(ValueError, match="160"):
        embedding_amount(160e-6, 1)
    with pytest.raises(ValueError):
        embedding_amount(6.3e-6, 1, load="torsion")  # type: ignore[arg-type]
    with pytest.raises(ValueError):
        embedding_amount(-1e-6, 1)


def test_preload_loss():
    # VDI 2230-1: F_Z = f_Z / (delta_S + delta_P)
    assert embedding_preload_loss(9.5e-6, 3.5e-9, 0.6e-9) == pytest.approx(9.5e-6 / 4.1e-9)
    with pytest.raises(ValueError):
        embedding_preload_loss(1e-6, 0.0, 1e-9)
