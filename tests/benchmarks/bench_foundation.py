"""Foundation benchmarks: ratios measured side by side in one run (never timed tests).

Run:  python tests/benchmarks/bench_foundation.py [--size 1000000] [--repeat 15]

1. ``swingcalc.period_ratio`` over 10^6 amplitudes against a raw
   ``scipy.special.ellipkm1`` call on the same number of complementary parameters
   (the special-function work the result needs). Target: at most 1.5x. Large arrays
   run blockwise on all cores (``kernels/parallel.py``); the one-thread figure is
   printed too.
2. Wall time of one CLI period-table run (``swingcalc periods``, default table) against
   ``python -c "import numpy, scipy.special, typer, rich.table"``. Target: at most 1.5x.

The two sides run interleaved and each reports its minimum over the repeats, which is
the figure least disturbed by other load on a shared machine.
"""

from __future__ import annotations

import argparse
import os
import subprocess
import sys
import time


def _interleaved_min(a, b, repeat):
    best_a = best_b = float("inf")
    for _ in range(repeat):
        t = time.perf_counter()
        a()
        best_a = min(best_a, time.perf_counter() - t)
        t = time.perf_counter()
        b()
        best_b = min(best_b, time.perf_counter() - t)
    return best_a, best_b


def bench_period_ratio(size, repeat):
    import numpy as np
    from scipy import special

    import swingcalc

    rng = np.random.default_rng(20261201)
    amplitude = rng.uniform(0.0, np.pi, size)
    p = np.cos(0.5 * amplitude) ** 2
    ours, raw = _interleaved_min(lambda: swingcalc.period_ratio(amplitude),
                                 lambda: special.ellipkm1(p), repeat)
    return ours, raw


def bench_cli(repeat):
    # Measure start-up as an installed package has it: with byte-code. pip compiles it at
    # install time; an editable checkout under PYTHONDONTWRITEBYTECODE would instead
    # recompile every module on every run, which numpy, scipy and typer never pay.
    import compileall

    import swingcalc

    compileall.compile_dir(os.path.dirname(swingcalc.__file__), quiet=1)
    env = dict(os.environ, COLUMNS="120", _TYPER_FORCE_DISABLE_TERMINAL="1")
    env.pop("PYTHONDONTWRITEBYTECODE", None)
    cli = [sys.executable, "-m", "swingcalc", "periods"]
    base = [sys.executable, "-c", "import numpy, scipy.special, typer, rich.table"]

    def run(cmd):
        return lambda: subprocess.run(cmd, env=env, check=True, stdout=subprocess.DEVNULL)

    return _interleaved_min(run(cli), run(base), repeat)


def main(argv=None):
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--size", type=int, default=1_000_000)
    ap.add_argument("--repeat", type=int, default=15)
    args = ap.parse_args(argv)
    ours, raw = bench_period_ratio(args.size, args.repeat)
    print(f"period_ratio, {args.size} amplitudes: {ours * 1e3:8.2f} ms   "
          f"ellipkm1 alone: {raw * 1e3:8.2f} ms   ratio {ours / raw:5.2f}  (target <= 1.5)")
    # For the record: one thread only. The cos(A/2) that forms p costs about as much as
    # ellipkm1 itself on these CPUs, so one thread cannot get under ~1.6x.
    saved = os.environ.get("SWINGCALC_THREADS")
    os.environ["SWINGCALC_THREADS"] = "1"
    try:
        ours1, raw1 = bench_period_ratio(args.size, args.repeat)
    finally:
        if saved is None:
            del os.environ["SWINGCALC_THREADS"]
        else:
            os.environ["SWINGCALC_THREADS"] = saved
    print(f"  the same on one thread:         {ours1 * 1e3:8.2f} ms   "
          f"ellipkm1 alone: {raw1 * 1e3:8.2f} ms   ratio {ours1 / raw1:5.2f}  (information)")
    cli, base = bench_cli(max(5, args.repeat // 2))
    print(f"CLI period table:             {cli * 1e3:8.1f} ms   "
          f"bare imports:   {base * 1e3:8.1f} ms   ratio {cli / base:5.2f}  (target <= 1.5)")


if __name__ == "__main__":
    main()
