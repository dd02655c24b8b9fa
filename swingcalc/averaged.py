"""Cycle-averaged model for weeks of running: the amplitude stepped beat by beat.

For lightly damped, weakly driven motion the orbit over one beat (half swing, turning
point to turning point) is the conservative orbit at the current amplitude to first order
in 1/Q. Each mechanism's loss over a beat is its integral over that exact orbit (closed
forms for viscous damping, quadratic drag and a constant friction torque; Gauss-Legendre
quadrature for friction that follows the pivot reaction), the drive adds its energy per
push, and the energy at the turning points is stepped with a second-order (midpoint)
rule in which the loss is taken at the loss-weighted mean energy of the beat. The
derivation, the error estimates and when the model must not be used are in
``docs/methods/cycle-averaged.md``; :func:`swingcalc.simulate` is the full integrator.
"""

from __future__ import annotations

import math
from array import array
from dataclasses import dataclass, field

import numpy as np

from ._validate import positive_scalar, real_scalar
from .constants import SECONDS_PER_DAY
from .errors import MISSING, InvalidInput
from .simulate import HarmonicTorque, ImpulseDrive, PivotMotion, SwingModel

__all__ = ["AveragedResult", "averaged", "beat_losses"]

_GL_NODES = 48
_TABLE_POINTS = 2049
#: Below this Q (per beat: pi E / loss) the averaged model is flagged as not applicable.
Q_LIMIT = 100.0
# A driven run is checked every this many beats for being next to its limit cycle; within
# _FILL_CLOSE (relative, in energy) of it the remaining beats are the linearised approach,
# whose neglected second-order term is (_FILL_CLOSE)^2 = 1e-12 relative: the rounding
# level of the beat-by-beat stepping itself (docs/methods/cycle-averaged.md).
_FILL_CHECK = 1000
_FILL_CLOSE = 1e-6


def _gauss_legendre(n):
    x, w = np.polynomial.legendre.leggauss(n)
    return x, w


def _orbit(model: SwingModel, A):
    """theta, d(theta)/d(phi), omega^2 on the conservative orbit of amplitude(s) A at
    Gauss-Legendre nodes in phi, theta = A sin(phi), phi in [-pi/2, pi/2] (the substitution
    removes the square-root ends of omega)."""
    x, w = _gauss_legendre(_GL_NODES)
    phi = 0.5 * math.pi * x
    wq = 0.5 * math.pi * w
    A = np.asarray(A, dtype=float)[..., None]
    th = A * np.sin(phi)
    dth = A * np.cos(phi)
    w0sq = model.restoring_moment / model.inertia
    if model.linear:
        om2 = w0sq * (A * A - th * th)
    else:
        # cos(th) - cos(A) = 2 (sin^2(A/2) - sin^2(th/2)), without cancellation
        om2 = 4.0 * w0sq * (np.sin(0.5 * A) ** 2 - np.sin(0.5 * th) ** 2)
    return th, dth, np.maximum(om2, 0.0), wq


def beat_losses(model: SwingModel, amplitude):
    """Energy lost over one beat (a half swing from -A to A) on the conservative orbit of
    amplitude A [rad], by mechanism: dict of arrays [J].

    Notes
    -----
    With w0^2 = M / I and m = sin^2(A/2), p = cos^2(A/2):
    viscous 8 c w0 (E(m) - p K(m)) (linear restoring: pi c w0 A^2 / 2);
    drag 4 D (M / I)(sin A - A cos A) (linear: 4 D w0^2 A^3 / 3);
    constant friction torque 2 T_f A; reaction friction mu_k rho integral of |R| over
    the orbit, with |R| = m sqrt(N^2 + (P + d alpha)^2), N = -g cos th - d omega^2,
    P = g sin th, alpha = -(M / I) sin th, by Gauss-Legendre quadrature.
    """
    from scipy import special

    from .kernels.elliptic import ellipk

    A = np.atleast_1d(np.asarray(amplitude, dtype=float))
    out = {}
    w0 = model.small_angle_frequency
    if model.viscous:
        if model.linear:
            out["viscous"] = 0.5 * math.pi * model.viscous * w0 * A * A
        else:
            m = np.sin(0.5 * A) ** 2
            p = np.cos(0.5 * A) ** 2
            out["viscous"] = 8.0 * model.viscous * w0 * (special.ellipe(m) - p * ellipk(p))
    if model.drag:
        if model.linear:
            out["drag"] = 4.0 / 3.0 * model.drag * w0 * w0 * A ** 3
        else:
            out["drag"] = (4.0 * model.drag * model.restoring_moment / model.inertia
                           * (np.sin(A) - A * np.cos(A)))
    kind = model.friction_kind
    if kind == "torque":
        out["friction"] = 2.0 * model.friction_torque * A
    elif kind == "reaction":
        th, dth, om2, wq = _orbit(model, A)
        g, d = model.gravity, model.com_distance
        S, C = (th, np.ones_like(th)) if model.linear else (np.sin(th), np.cos(th))
        alpha = -(model.restoring_moment / model.inertia) * S
        N = -g * C - d * om2
        P = g * S + d * alpha
        R = model.mass * np.hypot(N, P)
        out["friction"] = model.friction * model.pin_radius * np.sum(R * dth * wq, axis=-1)
    return out


def _loss_density_fraction(model: SwingModel, A, angle):
    """Fraction of a beat's loss spent before the push at ``angle`` (motion from -A to A)."""
    th, dth, om2, wq = _orbit(model, A)
    om = np.sqrt(om2)
    dens = np.zeros_like(th)
    if model.viscous:
        dens = dens + model.viscous * om
    if model.drag:
        dens = dens + model.drag * om2
    kind = model.friction_kind
    if kind == "torque":
        dens = dens + model.friction_torque
    elif kind == "reaction":
        g, d = model.gravity, model.com_distance
        S, C = (th, np.ones_like(th)) if model.linear else (np.sin(th), np.cos(th))
        alpha = -(model.restoring_moment / model.inertia) * S
        dens = dens + model.friction * model.pin_radius * model.mass * np.hypot(
            -g * C - d * om2, g * S + d * alpha)
    total = np.sum(dens * dth * wq, axis=-1)
    before = np.sum(np.where(th < angle, dens * dth * wq, 0.0), axis=-1)
    with np.errstate(invalid="ignore", divide="ignore"):
        frac = np.where(total > 0, before / total, 0.5)
    return frac


class _Table:
    """Cubic Hermite interpolation of a function of u on a uniform grid [0, u_max]."""

    def __init__(self, u_max, values_fn):
        n = _TABLE_POINTS
        self.u_max = u_max
        self.h = u_max / (n - 1)
        self.inv_h = 1.0 / self.h
        u = np.linspace(0.0, u_max, n)
        y = values_fn(u)
        dy = np.gradient(y, self.h, edge_order=2) * self.h
        y0, y1, d0, d1 = y[:-1], y[1:], dy[:-1], dy[1:]
        self.c0 = y0.tolist()
        self.c1 = d0.tolist()
        self.c2 = (3.0 * (y1 - y0) - 2.0 * d0 - d1).tolist()
        self.c3 = (2.0 * (y0 - y1) + d0 + d1).tolist()
        self.last = n - 2

    def __call__(self, u):
        x = u * self.inv_h
        i = int(x)
        if i > self.last:
            i = self.last
        f = x - i
        return self.c0[i] + f * (self.c1[i] + f * (self.c2[i] + f * self.c3[i]))


@dataclass
class AveragedResult:
    """What :func:`averaged` computed: the energy at every turning point, and tables
    derived from it on demand (so a table of 10^6 cycles can be streamed to disk).

    ``assumptions_hold`` is False when the model's assumptions fail somewhere in the run
    (``warnings`` say where and why; use :func:`swingcalc.simulate` there).
    """

    success: bool
    message: str
    assumptions_hold: bool
    warnings: list
    model: SwingModel
    drive: ImpulseDrive | None
    target_period_s: float
    beats: int
    energy_turn_J: np.ndarray      # energy at each turning point, len beats + 1
    energy_mean_J: np.ndarray      # loss-weighted mean energy of each beat, len beats
    push_J: np.ndarray             # energy delivered in each beat
    summary: dict = field(default_factory=dict)

    def amplitude(self, energy):
        """Amplitude [rad] of the conservative orbit with this energy [J]."""
        E = np.asarray(energy, dtype=float)
        M = self.model.restoring_moment
        if self.model.linear:
            return np.sqrt(np.maximum(2.0 * E / M, 0.0))
        return 2.0 * np.arcsin(np.sqrt(np.clip(E / (2.0 * M), 0.0, 1.0)))

    def beat_period(self, energy):
        """Half the exact conservative period at the amplitude of ``energy`` [s]."""
        from .kernels import swing as ks

        t0 = self.model.small_angle_period
        if self.model.linear:
            return 0.5 * t0 * np.ones_like(np.asarray(energy, dtype=float))
        A = self.amplitude(energy)
        return 0.5 * t0 * ks.period_ratio(np.cos(0.5 * A) ** 2)

    @property
    def cycles_count(self) -> int:
        return self.beats // 2

    def cycle_columns(self, start: int = 0, stop: int | None = None) -> dict:
        """Per-cycle columns (two beats each) for cycles [start, stop) (0-based)."""
        n = self.cycles_count
        stop = n if stop is None else min(stop, n)
        start = max(0, min(start, stop))
        b0, b1 = 2 * start, 2 * stop
        e_turn = self.energy_turn_J[b0:b1 + 1]
        e_mean = self.energy_mean_J[b0:b1]
        push = self.push_J[b0:b1]
        half = self.beat_period(e_mean)
        t_before = float(np.sum(self.beat_period(self.energy_mean_J[:b0]))) if b0 else 0.0
        period = half[0::2] + half[1::2]
        beat_end = t_before + np.cumsum(half)
        start_t = np.concatenate(([t_before], beat_end[1:-1:2])) if period.size else beat_end[:0]
        amp = self.amplitude(e_turn)
        cols = {"cycle": np.arange(start + 1, stop + 1),
                "start_time_s": start_t,
                "period_s": period,
                "amplitude_start_rad": amp[0:-1:2],
                "amplitude_half_rad": amp[1::2],
                "amplitude_end_rad": amp[2::2],
                "rate_s_per_day": (self.target_period_s / period - 1.0) * SECONDS_PER_DAY,
                "energy_start_J": e_turn[0:-1:2]}
        losses = beat_losses(self.model, self.amplitude(e_mean)) if e_mean.size else {}
        for name, vals in losses.items():
            cols[f"lost_{name}_J"] = vals[0::2] + vals[1::2]
        if self.drive is not None:
            cols["supplied_impulse_J"] = push[0::2] + push[1::2]
        return cols

    def write_cycles_csv(self, path, chunk: int = 100_000, force: bool = False) -> None:
        """Stream the per-cycle table to ``path`` as CSV, ``chunk`` cycles at a time
        (peak memory stays a few times the chunk, whatever the number of cycles)."""
        import csv
        import os
        import tempfile
        from pathlib import Path

        p = Path(path)
        if p.exists() and not force:
            raise InvalidInput("cycles file", str(path), "a new file (or force)", "file exists")
        fd, tmp = tempfile.mkstemp(prefix=f".{p.name}.", suffix=".tmp",
                                   dir=p.parent if str(p.parent) else ".")
        try:
            with os.fdopen(fd, "w", newline="", encoding="utf-8") as f:
                w = csv.writer(f, lineterminator="\n")
                head = None
                for s in range(0, max(self.cycles_count, 1), chunk):
                    cols = self.cycle_columns(s, s + chunk)
                    if head is None:
                        head = list(cols)
                        w.writerow(head)
                    w.writerows(zip(*(np.asarray(cols[k]).tolist() for k in head)))
            os.replace(tmp, p)
        finally:
            if os.path.exists(tmp):
                os.unlink(tmp)

    def to_dict(self, cycles: bool = True) -> dict:
        d = {"success": self.success, "message": self.message,
             "assumptions_hold": self.assumptions_hold, "warnings": list(self.warnings),
             "model": self.model.to_dict(), "beats": self.beats,
             "summary": dict(self.summary)}
        if cycles:
            d["cycles"] = {k: np.asarray(v).tolist() for k, v in self.cycle_columns().items()}
        return d


def averaged(model: SwingModel, amplitude, *, beats=None, cycles=None, duration=None,
             drive: ImpulseDrive | None = None, drives=(), target_period=None,
             q_limit: float = Q_LIMIT) -> AveragedResult:
    """Step the amplitude of ``model`` beat by beat with the cycle-averaged model.

    Parameters
    ----------
    model : SwingModel
    amplitude : float
        Start amplitude [rad]: the body starts at rest at +amplitude.
    beats, cycles, duration : optional
        Run this many beats (half swings), cycles, or about this long [s] (one needed).
    drive : ImpulseDrive, optional
        The push per beat or per swing.
    drives : sequence, optional
        Other drives: harmonic torques and pivot motion are not part of the model; they
        are checked for resonance (then the assumptions fail) and otherwise ignored, with
        a warning giving the size of the forced response they would add.
    target_period : float, optional
        Period [s] for the rate error (default: the small-angle period).
    q_limit : float
        Beats whose Q (pi E / loss per beat) falls below this are flagged.

    Returns
    -------
    AveragedResult

    Examples
    --------
    >>> m = SwingModel.simple(0.994, 1.0).with_q(5000)
    >>> r = averaged(m, 0.05, cycles=1000, drive=ImpulseDrive(0.0, energy=2e-6))
    >>> r.success, r.cycles_count
    (True, 1000)
    """
    if not isinstance(model, SwingModel):
        raise InvalidInput("model", type(model).__name__, "a SwingModel")
    A0 = real_scalar(amplitude, "amplitude", "an amplitude in (0, pi) rad", low=0.0,
                     high=math.pi, low_open=True, high_open=True)
    if drive is not None and not isinstance(drive, ImpulseDrive):
        raise InvalidInput("drive", type(drive).__name__, "an ImpulseDrive")
    given = [v is not None for v in (beats, cycles, duration)]
    if sum(given) != 1:
        raise InvalidInput("beats", MISSING, "exactly one of beats, cycles or duration",
                           "give exactly one")
    target = (model.small_angle_period if target_period is None
              else positive_scalar(target_period, "target_period", "s"))
    if duration is not None:
        from .kernels import swing as _ks

        T = positive_scalar(duration, "duration", "s")
        beat0 = 0.5 * model.small_angle_period * (
            1.0 if model.linear else float(_ks.period_ratio(math.cos(0.5 * A0) ** 2)))
        n_beats = math.ceil(T / beat0)
    else:
        n = real_scalar(beats if beats is not None else cycles,
                        "beats" if beats is not None else "cycles",
                        "a whole number >= 1", low=1.0)
        if n != int(n):
            raise InvalidInput("beats" if beats is not None else "cycles", n,
                               "a whole number >= 1", "not a whole number")
        n_beats = int(n) * (1 if beats is not None else 2)
    if n_beats > 10 ** 9:
        raise InvalidInput("beats", n_beats, "at most 1e9 beats", "too many")
    warnings: list = []
    ok_assumptions = True
    for dr in drives:
        if isinstance(dr, ImpulseDrive):
            raise InvalidInput("drives", "ImpulseDrive", "harmonic torques or pivot motion "
                               "(pass the push as drive=)")
        if not isinstance(dr, (HarmonicTorque, PivotMotion)):
            raise InvalidInput("drives", type(dr).__name__, "HarmonicTorque or PivotMotion")
        hold, text = _forcing_check(model, dr, A0)
        ok_assumptions &= hold
        warnings.append(text)
    M = model.restoring_moment
    lin = model.linear

    def energy_of(A):
        return 0.5 * M * A * A if lin else 2.0 * M * math.sin(0.5 * A) ** 2

    # the table spans amplitudes up to about twice the larger of the start and the push's
    a_top = min(math.pi - 1e-3, max(2.0 * A0, 0.2))
    tables = _build(model, drive, a_top)
    E = energy_of(A0)
    e_turn = array("d", [E])
    e_mean = array("d")
    pushes = array("d")
    direction = -1      # released at +A0, the first beat runs clockwise
    message = ""
    success = True
    stick_cap = None
    if model.friction_kind == "torque":
        stick_cap = model.static_friction_torque
    elif model.friction_kind == "reaction":
        stick_cap = model.static_friction * model.pin_radius * model.mass * model.gravity
    sqrt = math.sqrt
    loss, inv_2M, push_applies = tables.loss, tables.inv_2M, tables.push_applies

    def beat(E, direction):
        """One beat from the turning energy E > 0: (E at the next turning point, the
        beat's loss-weighted mean energy, the push's energy, the first loss estimate)."""
        u = sqrt(E * inv_2M)
        L1 = loss(u)
        if push_applies(direction, u):
            w = tables.frac(u)
            dE1 = tables.push_energy(E - w * L1)
            Em = E - 0.5 * L1 + (1.0 - w) * dE1
            L2 = loss(sqrt(Em * inv_2M) if Em > 0.0 else 0.0)
            dE = tables.push_energy(E - w * L2)
        else:
            Em = E - 0.5 * L1
            L2 = loss(sqrt(Em * inv_2M) if Em > 0.0 else 0.0)
            dE = 0.0
        return E - L2 + dE, Em, dE, L1

    def holds(u):
        """Whether static friction can hold the body at the turning point u."""
        sin_a = 2.0 * u if lin else 2.0 * u * sqrt(max(0.0, 1.0 - u * u))
        return stick_cap is not None and M * sin_a <= stick_cap

    def fits(E):
        """Whether a beat from E stays inside the model (tables, no stick, Q above the
        limit): the limit cycle is filled in only where every check would pass."""
        u = sqrt(E * inv_2M)
        if u > tables.u_max or holds(u):
            return False
        L1 = loss(u)
        return L1 < 0.5 * E and L1 * q_limit <= math.pi * E

    k = 0
    fill = None
    check_at = _FILL_CHECK
    while k < n_beats:
        u = sqrt(E * inv_2M)
        if u > tables.u_max:
            if tables.a_top >= math.pi - 1e-3:
                ok_assumptions = False
                success = False
                message = (f"stopped after {k} beats: the amplitude nears the inverted "
                           "position (over the top); use simulate")
                break
            tables = _build(model, drive, min(math.pi - 1e-3, 2.0 * tables.a_top))
            loss, inv_2M, push_applies = tables.loss, tables.inv_2M, tables.push_applies
            continue
        if holds(u):
            A = tables.amp_of(E)
            ok_assumptions = False
            success = False
            message = (f"stopped after {k} beats at amplitude {math.degrees(A):.6g} deg: static friction "
                       "can hold the body at its turning point (stick-slip); the averaged "
                       "model cannot follow it further: use simulate")
            break
        E_new, Em, dE, L1 = beat(E, direction)
        if L1 >= 0.5 * E or L1 * q_limit > math.pi * E:
            A = tables.amp_of(E)
        if L1 >= 0.5 * E:
            # the beat would lose most of its energy: the body stops within it (friction)
            ok_assumptions = False
            success = False
            message = (f"stopped after {k} beats at amplitude {math.degrees(A):.6g} deg: the body would "
                       "lose most of its energy in the next beat (stick-slip or heavy "
                       "damping), so this amplitude is only roughly where it stops: use "
                       "simulate for the stop")
            break
        if L1 * q_limit > math.pi * E and ok_assumptions:
            ok_assumptions = False
            warnings.append(f"beat {k + 1}: Q = {math.pi * E / L1:.4g} below {q_limit:g} at "
                            f"amplitude {math.degrees(A):.6g} deg: the averaged model is not accurate "
                            "there; use simulate")
        if E_new <= 0.0:
            e_mean.append(Em if Em > 0.0 else 0.0)
            pushes.append(dE)
            e_turn.append(0.0)
            k += 1
            message = f"came to rest after {k} beats (all energy lost)"
            break
        e_mean.append(Em)
        pushes.append(dE)
        e_turn.append(E_new)
        k += 1
        E = E_new
        direction = -direction
        if k >= check_at and drive is not None and direction == -1:
            check_at = k + _FILL_CHECK
            fill = _limit_cycle(beat, E, fits)
            if fill is not None:
                break
    if fill is not None and k < n_beats:
        turn, mean, push = fill.series(E, n_beats - k)
        e_turn_arr = np.concatenate((np.frombuffer(e_turn, dtype=float), turn))
        e_mean_arr = np.concatenate((np.frombuffer(e_mean, dtype=float), mean))
        push_arr = np.concatenate((np.frombuffer(pushes, dtype=float), push))
        k = n_beats
    else:
        e_turn_arr = np.frombuffer(e_turn, dtype=float).copy()
        e_mean_arr = np.frombuffer(e_mean, dtype=float).copy()
        push_arr = np.frombuffer(pushes, dtype=float).copy()
    if message and not ok_assumptions:
        warnings.append(message)
    res = AveragedResult(success=success, message=message or f"completed {k} beats",
                         assumptions_hold=bool(ok_assumptions), warnings=warnings,
                         model=model, drive=drive, target_period_s=target, beats=k,
                         energy_turn_J=e_turn_arr, energy_mean_J=e_mean_arr,
                         push_J=push_arr)
    res.summary = _summary(res)
    return res


class _LimitCycle:
    """The two-beat limit cycle of a driven run and the linearised approach to it.

    ``E`` is the turning energy before a beat in the start's direction; ``rate`` the
    factor by which its distance from the cycle shrinks per pair of beats; ``values`` and
    ``slopes`` the six quantities of the pair (turning energy after each beat, each beat's
    mean energy and push) at the cycle and their derivatives in that turning energy."""

    def __init__(self, E, rate, values, slopes):
        self.E, self.rate = E, rate
        self.values, self.slopes = np.array(values), np.array(slopes)

    def series(self, E_now: float, n: int):
        """The next ``n`` beats' (turning energies, mean energies, pushes) from the turning
        energy ``E_now`` (a beat in the start's direction comes first)."""
        pairs = (n + 1) // 2
        gap = (E_now - self.E) * self.rate ** np.arange(pairs)
        v = self.values[:, None] + self.slopes[:, None] * gap
        turn = np.empty(2 * pairs)
        mean = np.empty(2 * pairs)
        push = np.empty(2 * pairs)
        turn[0::2], turn[1::2] = v[0], v[1]
        mean[0::2], mean[1::2] = v[2], v[3]
        push[0::2], push[1::2] = v[4], v[5]
        return turn[:n], mean[:n], push[:n]


def _limit_cycle(beat, E: float, fits) -> _LimitCycle | None:
    """The limit cycle of the two-beat map next to the turning energy ``E`` (Newton on
    P(x) - x with central-difference slopes), or None when ``E`` is not yet within
    _FILL_CLOSE of it, the approach is not a contraction, or a beat there would leave
    the model (``fits``)."""

    def pair(x):
        e1, m1, p1, _ = beat(x, -1)
        if not e1 > 0.0:
            raise ArithmeticError
        e2, m2, p2, _ = beat(e1, 1)
        return (e1, e2, m1, m2, p1, p2)

    def gap(x):
        return pair(x)[1] - x

    x = E
    for _ in range(8):
        h = 1e-5 * x
        try:
            slope = (gap(x + h) - gap(x - h)) / (2.0 * h)
            step = gap(x) / slope if slope < 0.0 else math.nan
        except ArithmeticError:
            return None
        if not abs(step) < 0.5 * x:     # no contraction here, or far from it
            return None
        x -= step
        if abs(step) <= 4e-16 * x:
            break
    else:
        return None
    rate = 1.0 + slope
    if not (0.0 < rate < 1.0) or abs(E - x) > _FILL_CLOSE * x:
        return None
    values = pair(x)
    if not (fits(x) and fits(values[0])):
        return None
    h = 1e-5 * x
    up, down = pair(x + h), pair(x - h)
    slopes = [(a - b) / (2.0 * h) for a, b in zip(up, down)]
    values = (values[0], x) + values[2:]
    return _LimitCycle(x, rate, values, slopes)


class _Tables:
    pass


def _build(model: SwingModel, drive, a_top) -> _Tables:
    """Interpolation tables in u (u = sin(A/2), or A/2 for the linear model)."""
    M, I = model.restoring_moment, model.inertia
    lin = model.linear
    t = _Tables()
    t.a_top = a_top
    t.u_max = 0.5 * a_top if lin else math.sin(0.5 * a_top)

    def amp(u):
        return 2.0 * u if lin else 2.0 * np.arcsin(np.clip(u, 0.0, 1.0))

    def total_loss(u):
        parts = beat_losses(model, amp(u))
        return sum(parts.values()) if parts else np.zeros_like(u)

    loss = _Table(t.u_max, total_loss)
    t.loss = loss
    # u = sin(A/2) (A/2 for the linear model) from the energy, for E >= 0
    t.inv_2M = 1.0 / (2.0 * M)
    if lin:
        t.amp_of = lambda E: math.sqrt(max(E, 0.0) * 2.0 / M)
    else:
        t.amp_of = lambda E: 2.0 * math.asin(min(1.0, math.sqrt(max(E, 0.0) / (2.0 * M))))
    if drive is None:
        t.push_applies = lambda direction, u: False
        return t
    a = drive.angle
    dn = drive.direction
    per_beat = drive.per == "beat"
    frac = _Table(t.u_max, lambda u: _loss_density_fraction(model, amp(u), dn * a))
    t.frac = frac

    u_a = 0.5 * abs(a) if lin else math.sin(0.5 * abs(a))

    def push_applies(direction, u):
        """Whether the beat in ``direction`` at amplitude u passes the push angle."""
        return (per_beat or direction == dn) and u_a < u

    t.push_applies = push_applies
    V_a = 0.5 * M * a * a if lin else 2.0 * M * math.sin(0.5 * a) ** 2
    if drive.energy is not None:
        e_push = drive.energy
        t.push_energy = lambda E_before: e_push
    else:
        J = drive.angular_impulse

        def push_energy(E_before):
            om = math.sqrt(max(0.0, 2.0 * (E_before - V_a) / I))
            return om * J + 0.5 * J * J / I

        t.push_energy = push_energy
    return t


def _forcing_check(model: SwingModel, dr, A0) -> tuple[bool, str]:
    """Is a harmonic torque or pivot motion far enough from resonance to be ignored?"""
    from .kernels import swing as ks

    w0 = model.small_angle_frequency
    w_a = w0 if model.linear else w0 / float(ks.period_ratio(math.cos(0.5 * A0) ** 2))
    W = dr.angular_frequency
    zeta = max(model.damping_ratio, 1e-6)
    if isinstance(dr, HarmonicTorque):
        ratios = (1.0, 3.0)
        size = abs(dr.amplitude) / (model.inertia * abs(w0 * w0 - W * W) + 1e-300)
        what = "harmonic torque"
    elif dr.axis == "vertical":
        ratios = (2.0, 1.0)     # parametric resonance at twice and at the natural frequency
        size = abs(dr.amplitude) * W * W / model.gravity * A0
        what = "vertical pivot motion"
    else:
        ratios = (1.0,)
        size = (model.restoring_moment / model.gravity / model.inertia * abs(dr.amplitude)
                * W * W / abs(w0 * w0 - W * W + 1e-300))
        what = "horizontal pivot motion"
    band = max(10.0 * zeta, 0.05)
    for r in ratios:
        if abs(W / (r * w_a) - 1.0) < band:
            return False, (f"{what} at {W:.6g} rad/s is near resonance ({r:g} x the "
                           f"natural frequency {w_a:.6g} rad/s): the averaged model does not "
                           "apply; use simulate")
    return True, (f"{what} at {W:.6g} rad/s is far from resonance and is not part of the "
                  f"averaged model; it would add a forced swing of about {size:.3g} rad")


def _summary(res: AveragedResult) -> dict:
    n = res.cycles_count
    amp0 = float(res.amplitude(res.energy_turn_J[0]))
    amp1 = float(res.amplitude(res.energy_turn_J[-1]))
    half = res.beat_period(res.energy_mean_J) if res.beats else np.zeros(0)
    total_t = float(np.sum(half))
    d = {"beats": res.beats, "cycles": n, "duration_s": total_t,
         "initial_amplitude_rad": amp0, "final_amplitude_rad": amp1,
         "assumptions_hold": res.assumptions_hold}
    if n:
        last = res.cycle_columns(n - 1, n)
        first = res.cycle_columns(0, 1)
        d["first_period_s"] = float(first["period_s"][0])
        d["last_period_s"] = float(last["period_s"][0])
        d["first_rate_s_per_day"] = float(first["rate_s_per_day"][0])
        d["last_rate_s_per_day"] = float(last["rate_s_per_day"][0])
        # mean rate over the run: the clock's error over its whole running time
        periods = half[0:2 * n:2] + half[1:2 * n:2]
        d["mean_rate_s_per_day"] = float(
            (res.target_period_s * n / np.sum(periods) - 1.0) * SECONDS_PER_DAY)
        d["accumulated_error_s"] = float(res.target_period_s * n - np.sum(periods))
    return d
