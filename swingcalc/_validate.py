"""Input checks at the API boundary: every public function validates through these."""

from __future__ import annotations

import math

import numpy as np

from .errors import InvalidInput

__all__ = ["real_array", "real_scalar", "positive_scalar", "finalize"]


def real_array(value, field: str, allowed: str, *, low=None, high=None,
               low_open: bool = False, high_open: bool = False):
    """Return ``(array, is_scalar)`` for a finite real input inside the stated range.

    The range check uses one min/max pass (NaN propagates into both), so it costs a
    fraction of a millisecond on 10^6 values.
    """
    try:
        arr = np.asarray(value, dtype=float)
    except (TypeError, ValueError):
        raise InvalidInput(field, value, allowed, "not a real number") from None
    if arr.size == 0:
        return arr, False
    lo = arr.min()
    hi = arr.max()
    if not (math.isfinite(lo) and math.isfinite(hi)):
        bad = arr[~np.isfinite(arr)].flat[0]
        raise InvalidInput(field, float(bad), allowed, "not a finite number")
    if low is not None and (lo < low or (low_open and lo == low)):
        raise InvalidInput(field, float(lo), allowed, "out of range")
    if high is not None and (hi > high or (high_open and hi == high)):
        raise InvalidInput(field, float(hi), allowed, "out of range")
    return arr, arr.ndim == 0


def real_scalar(value, field: str, allowed: str, **limits):
    """A single finite float inside the stated range (see :func:`real_array`)."""
    arr, scalar = real_array(value, field, allowed, **limits)
    if not scalar:
        raise InvalidInput(field, value, f"a single value: {allowed}", "not a scalar")
    return float(arr)


def positive_scalar(value, field: str, unit: str):
    """A finite, strictly positive float (a length, a gravity, a mass)."""
    return real_scalar(value, field, f"a finite number > 0 [{unit}]", low=0.0, low_open=True)


def finalize(result, scalar: bool):
    """Scalars in give Python floats out; arrays in give arrays out."""
    return float(result) if scalar else result
