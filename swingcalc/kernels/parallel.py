"""Run an elementwise array kernel over large arrays in cache-sized blocks on all cores.

numpy and scipy.special ufuncs release the GIL inside their loops, so a large array split
between threads runs on every core; blocks of 2^14 values keep the temporaries in cache.
The result is bit-for-bit the same as one call on the whole array (the kernels are
elementwise). ``SWINGCALC_THREADS=1`` in the environment turns the threads off.
"""

from __future__ import annotations

import os
import threading

import numpy as np

__all__ = ["blockwise", "thread_count"]

_BLOCK = 1 << 14
_PARALLEL_MIN = 1 << 16
_pool = None
_pool_workers = 0
_pool_lock = threading.Lock()


def thread_count() -> int:
    """Threads used for large arrays: ``SWINGCALC_THREADS`` if set, else the usable cores."""
    env = os.environ.get("SWINGCALC_THREADS", "").strip()
    if env.isdigit() and int(env) >= 1:
        return int(env)
    try:
        return max(1, len(os.sched_getaffinity(0)))
    except AttributeError:  # not on Linux
        return max(1, os.cpu_count() or 1)


def _executor(workers):
    global _pool, _pool_workers
    with _pool_lock:
        if _pool is None or _pool_workers != workers:
            from concurrent.futures import ThreadPoolExecutor

            if _pool is not None:
                _pool.shutdown(wait=False)
            _pool = ThreadPoolExecutor(max_workers=workers, thread_name_prefix="swingcalc")
            _pool_workers = workers
        return _pool


def blockwise(kernel, x):
    """``kernel(x_block, out_block)`` over a 1-d float array ``x``; returns the output array."""
    out = np.empty_like(x)
    n = x.size
    workers = thread_count() if n >= _PARALLEL_MIN else 1

    def run(lo, hi):
        for i in range(lo, hi, _BLOCK):
            j = min(i + _BLOCK, hi)
            kernel(x[i:j], out[i:j])

    if workers == 1:
        run(0, n)
        return out
    edges = np.linspace(0, n, workers + 1).astype(int)
    futures = [_executor(workers).submit(run, lo, hi) for lo, hi in zip(edges[:-1], edges[1:])]
    for f in futures:
        f.result()
    return out
