"""Simulation benchmarks: ratios measured side by side in one run (never timed tests).

Run:  python tests/benchmarks/bench_simulate.py [--repeat 5] [--periods 1000]

1. ``swingcalc.simulate`` (compiled DOP853 loop, events on each step's interpolant,
   per-cycle table and summary) against a plain ``scipy.integrate.solve_ivp(method=
   "DOP853")`` with a Python right-hand side on the same problem (pendulum at 0.5 rad,
   viscous and quadratic damping, 1,000 periods): first at the same tolerances, then at
   equal accuracy. Target: at least 6x faster at equal accuracy.
   Accuracy is the final-energy error against a 1e-13 reference run, taken at each
   side's own final time. That error is far from monotone in the tolerance (it swings by
   10x between neighbouring tolerances as errors cancel or not), so one run at one
   tolerance says little and a bisection on it lands on a lucky or unlucky tolerance.
   Each side's error is therefore measured over a sweep of tolerances (3 per decade, from
   10x looser to 100x tighter than ours) and fitted as log err = a + b log tol; solve_ivp
   runs at the tolerance where its fitted error equals our fitted error at ours.
   The same with ``solve_ivp`` given the two events (angle and angular velocity zero)
   is printed for information.
2. A week of clock running with the cycle-averaged model (a seconds pendulum pushed
   every beat, over 600,000 beats). Target: under 1 s.
3. Its per-cycle table for 10^6 cycles streamed to a CSV file in a child process; the
   child's peak resident memory (VmHWM; ru_maxrss would carry the parent's over fork and
   exec). Target: under 300 MB.

Each side runs interleaved with the other and reports its minimum over the repeats, in
wall-clock time and in process CPU time (both sides run on one thread; on a shared
machine the CPU time is the steadier of the two, as waiting for a core is left out).
"""

from __future__ import annotations

import argparse
import math
import os
import subprocess
import sys
import tempfile
import time


def _interleaved_min(fns, repeat):
    """Minimum wall and CPU time of each function over ``repeat`` interleaved rounds."""
    best = [float("inf")] * len(fns)
    cpu = [float("inf")] * len(fns)
    out = [None] * len(fns)
    for _ in range(repeat):
        for i, fn in enumerate(fns):
            c = time.process_time()
            t = time.perf_counter()
            out[i] = fn()
            best[i] = min(best[i], time.perf_counter() - t)
            cpu[i] = min(cpu[i], time.process_time() - c)
    return best, cpu, out


def _fit(tols, errs):
    """Least-squares line log10 err = a + b log10 tol."""
    xs = [math.log10(t) for t in tols]
    ys = [math.log10(max(e, 1e-300)) for e in errs]
    n = len(xs)
    mx, my = sum(xs) / n, sum(ys) / n
    b = (sum((x - mx) * (y - my) for x, y in zip(xs, ys))
         / sum((x - mx) ** 2 for x in xs))
    return my - b * mx, b


def bench_integrator(periods, repeat, rtol):
    from scipy.integrate import solve_ivp

    from swingcalc.simulate import SwingModel, simulate

    m = SwingModel.simple(1.0, 1.0, drag=1e-4).with_q(2000)
    I, M, c, D = m.inertia, m.restoring_moment, m.viscous, m.drag
    w0 = m.small_angle_frequency
    theta0 = 0.5
    simulate(m, theta0, cycles=2)      # imports and first-call costs outside the timing
    t_end = simulate(m, theta0, cycles=periods).summary.duration_s

    def rhs(t, y):
        th, om = y
        return [om, (-M * math.sin(th) - c * om - D * om * abs(om)) / I]

    def ev_angle(t, y):
        return y[0]

    def ev_speed(t, y):
        return y[1]

    def atol_for(tol):
        return 1e-2 * tol * theta0     # simulate's default atol for this start

    def ours_at(tol):
        return simulate(m, theta0, cycles=periods, rtol=tol, atol=atol_for(tol))

    def plain_at(tol, **kw):
        # the angular velocity is integrated unscaled here; its atol is scaled to match
        return solve_ivp(rhs, (0.0, t_end), [theta0, 0.0], method="DOP853", rtol=tol,
                         atol=[atol_for(tol), atol_for(tol) * w0], **kw)

    def ours():
        return ours_at(rtol)

    def plain():
        return plain_at(rtol)

    def with_events():
        return plain_at(rtol, events=[ev_angle, ev_speed])

    (t_ours, t_plain, t_ev), (c_ours, c_plain, c_ev), (r, s, _) = _interleaved_min(
        [ours, plain, with_events], repeat)

    # the reference, with dense output to read it at each side's own final time
    ref = solve_ivp(rhs, (0.0, 1.001 * t_end), [theta0, 0.0], method="DOP853", rtol=1e-13,
                    atol=1e-16, dense_output=True)

    def energy(th, om):
        return 0.5 * I * om ** 2 + M * (1 - math.cos(th))

    def error(t, th, om):
        return abs(energy(th, om) / energy(*ref.sol(t)) - 1)

    def ours_error(res):
        h = res.history
        return error(float(h.time_s[-1]), float(h.angle_rad[-1]),
                     float(h.angular_velocity_rad_s[-1]))

    def plain_error(sol):
        return error(float(sol.t[-1]), float(sol.y[0, -1]), float(sol.y[1, -1]))

    err_ours, err_plain = ours_error(r), plain_error(s)
    tols = [rtol * 10.0 ** (-k / 3.0) for k in range(-3, 7)]
    a_o, b_o = _fit(tols, [ours_error(ours_at(tol)) for tol in tols])
    a_p, b_p = _fit(tols, [plain_error(plain_at(tol)) for tol in tols])
    fit_ours = 10.0 ** (a_o + b_o * math.log10(rtol))
    tight = 10.0 ** ((math.log10(fit_ours) - a_p) / b_p)

    def plain_equal():
        return plain_at(tight)

    (t_ours2, t_equal), (c_ours2, c_equal), _ = _interleaved_min([ours, plain_equal], repeat)
    return {"same": (t_ours, t_plain, c_ours, c_plain), "events": (t_ev, c_ev),
            "equal": (t_ours2, t_equal, c_ours2, c_equal), "tight": tight,
            "fit_ours": fit_ours, "slopes": (b_o, b_p), "err_ours": err_ours,
            "err_plain": err_plain, "result": r}


def bench_week(repeat):
    """A week of (1) a seconds pendulum with Q = 5000, (2) the bundled long-case clock
    (Q about 4e4 from its air drag, so it takes ~220,000 beats to settle to rounding) with
    a 1.5 uJ push per beat, as the README runs it."""
    from swingcalc import examples
    from swingcalc.averaged import averaged
    from swingcalc.designfile import load_design
    from swingcalc.simulate import ImpulseDrive, SwingModel

    m = SwingModel.simple(0.994, 1.0, drag=1e-5).with_q(5000)
    dr = ImpulseDrive(0.0, energy=2e-6)
    clock = load_design(examples.path("long_case_clock.toml"))
    mc = SwingModel.from_pendulum(clock.pendulum)
    dc = ImpulseDrive(0.0, energy=1.5e-6)
    averaged(m, 0.05, cycles=10, drive=dr)
    (t, tc), _, (r, rc) = _interleaved_min(
        [lambda: averaged(m, 0.06, duration=7 * 86400.0, drive=dr),
         lambda: averaged(mc, clock.amplitudes_rad[0], duration=7 * 86400.0, drive=dc,
                          target_period=clock.target_period_s)], repeat)
    return (t, r), (tc, rc)


# Peak memory of a child: VmHWM of its own address space (Linux). ru_maxrss is not used
# there: it survives fork and exec, so a child of a large parent reports the parent's size.
_PEAK = """
def peak_mb():
    try:
        with open("/proc/self/status") as f:
            for line in f:
                if line.startswith("VmHWM:"):
                    return int(line.split()[1]) / 1024.0
    except OSError:
        pass
    import resource
    return resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024.0
"""

_CHILD = _PEAK + """
import sys, time
from swingcalc.averaged import averaged
from swingcalc.simulate import ImpulseDrive, SwingModel
m = SwingModel.simple(0.994, 1.0, drag=1e-5).with_q(5000)
t = time.perf_counter()
r = averaged(m, 0.06, cycles=1_000_000, drive=ImpulseDrive(0.0, energy=2e-6))
r.write_cycles_csv(sys.argv[1], force=True)
dt = time.perf_counter() - t
print(peak_mb(), dt)
"""


def bench_stream():
    with tempfile.TemporaryDirectory() as d:
        path = os.path.join(d, "cycles.csv")
        out = subprocess.run([sys.executable, "-c", _CHILD, path], capture_output=True,
                             text=True, check=True)
        rss_mb, seconds = map(float, out.stdout.split())
        size = os.path.getsize(path) / 1e6
    # the same child with only the imports, for the baseline memory
    probe = _PEAK + "import swingcalc.averaged, scipy.integrate, scipy.special\nprint(peak_mb())"
    base = subprocess.run([sys.executable, "-c", probe],
                          capture_output=True, text=True, check=True)
    return rss_mb, float(base.stdout), seconds, size


def main(argv=None):
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--repeat", type=int, default=5)
    ap.add_argument("--periods", type=int, default=1000)
    ap.add_argument("--rtol", type=float, default=1e-10)
    ap.add_argument("--integrator-only", action="store_true",
                    help="part 1 only (the integrator against solve_ivp)")
    args = ap.parse_args(argv)
    b = bench_integrator(args.periods, args.repeat, args.rtol)
    t_o, t_p, c_o, c_p = b["same"]
    print(f"full integrator, {args.periods} periods, rtol {args.rtol:g}: "
          f"{t_o * 1e3:8.1f} ms   solve_ivp DOP853 at the same rtol: {t_p * 1e3:8.1f} ms   "
          f"ratio {t_p / t_o:5.2f} (CPU time {c_p / c_o:5.2f})  (information)")
    t_o, t_p, c_o, c_p = b["equal"]
    print(f"  at equal accuracy (fitted final-energy error {b['fit_ours']:.2e}; solve_ivp "
          f"rtol {b['tight']:.3g}): {t_o * 1e3:8.1f} ms vs {t_p * 1e3:8.1f} ms   "
          f"ratio {t_p / t_o:5.2f} (CPU time {c_p / c_o:5.2f})  (target >= 6)")
    t_ev, c_ev = b["events"]
    t_o, _, c_o, _ = b["same"]
    print(f"  solve_ivp with the two events:  {t_ev * 1e3:8.1f} ms   ratio "
          f"{t_ev / t_o:5.2f} (CPU time {c_ev / c_o:5.2f})  (information)")
    print(f"  final energy error vs a 1e-13 reference at rtol {args.rtol:g}: ours "
          f"{b['err_ours']:.2e}, solve_ivp {b['err_plain']:.2e}; fitted slopes d log err / "
          f"d log tol {b['slopes'][0]:.2f} (ours), {b['slopes'][1]:.2f} (solve_ivp); our "
          f"budget closure {b['result'].energy.closure_rel:.2e}")
    if args.integrator_only:
        return
    (t_week, w), (t_clock, wc) = bench_week(args.repeat)
    print(f"averaged model, one week ({w.beats} beats):  {t_week * 1e3:8.1f} ms  "
          f"(target < 1000 ms)")
    print(f"  the same, bundled long-case clock pushed with 1.5 uJ ({wc.beats} beats): "
          f"{t_clock * 1e3:8.1f} ms  (target < 1000 ms)")
    rss, base, seconds, size = bench_stream()
    print(f"averaged model, 10^6 cycles streamed to CSV ({size:.0f} MB): peak RSS "
          f"{rss:6.1f} MB (imports alone {base:5.1f} MB), {seconds:5.1f} s  "
          f"(target < 300 MB)")


if __name__ == "__main__":
    main()
