"""Blockwise / threaded evaluation gives bit-for-bit the serial result."""

from __future__ import annotations

import numpy as np

import swingcalc
from swingcalc.kernels import parallel


def test_threaded_period_ratio_equals_serial_elementwise(monkeypatch):
    """The kernels are elementwise, so splitting the array between threads and blocks
    must change no bit (no reference value needed: this checks the plumbing, and the
    values themselves are checked against mpmath in test_period.py)."""
    rng = np.random.default_rng(7)
    a = rng.uniform(0.0, np.pi, 200_001)  # above the threading threshold, odd length
    monkeypatch.setenv("SWINGCALC_THREADS", "3")
    threaded = swingcalc.period_ratio(a)
    monkeypatch.setenv("SWINGCALC_THREADS", "1")
    serial = swingcalc.period_ratio(a)
    one_by_one = np.array([swingcalc.period_ratio(float(x)) for x in a[:: 20_000]])
    assert np.array_equal(threaded, serial)
    # The scalar path uses math.cos, the array path np.cos: allow 2 ulp between them.
    assert np.allclose(serial[:: 20_000], one_by_one, rtol=4.5e-16, atol=0)


def test_thread_count_honours_the_environment(monkeypatch):
    monkeypatch.setenv("SWINGCALC_THREADS", "2")
    assert parallel.thread_count() == 2
    monkeypatch.setenv("SWINGCALC_THREADS", "junk")   # ignored: falls back to the cores
    monkeypatch.setattr(parallel.os, "sched_getaffinity", lambda pid: {0, 1, 2}, raising=False)
    assert parallel.thread_count() == 3


def test_two_dimensional_input_keeps_its_shape():
    a = np.linspace(0.0, 3.0, 300_000).reshape(600, 500)
    out = swingcalc.period_ratio(a)
    assert out.shape == (600, 500)
    assert out[0, 0] == 1.0
