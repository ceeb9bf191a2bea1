"""Small numeric helpers shared by the component modules (no mechanics here)."""

from __future__ import annotations

from typing import Any, TypeAlias

import numpy as np
import numpy.typing as npt

#: A float or a numpy array of floats; the vectorised functions accept either and
#: return a plain ``float`` for scalar input and an array otherwise.
FloatArray: TypeAlias = float | npt.NDArray[np.float64]


def as_array(x: Any) -> npt.NDArray[np.float64]:
    """``x`` as a float64 numpy array (0-d for a scalar)."""
    return np.asarray(x, dtype=np.float64)


def out(x: Any) -> FloatArray:
    """Return a plain ``float`` for a 0-d result, the array otherwise."""
    a = np.asarray(x, dtype=np.float64)
    if a.ndim == 0:
        return float(a)
    return a


def require(condition: Any, message: str) -> None:
    """Raise ``ValueError(message)`` unless ``condition`` holds everywhere.

    NaN inputs make a comparison false and so are refused too.
    """
    if condition is True or condition is np.True_:
        return  # the common scalar case, without the cost of np.all
    if isinstance(condition, np.ndarray) and condition.ndim == 0:
        ok = bool(condition)
    else:
        ok = bool(np.all(condition))
    if not ok:
        raise ValueError(message)
