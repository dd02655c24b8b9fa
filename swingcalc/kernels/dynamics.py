"""Right-hand sides, energies, reactions and dense output for the damped, driven swing.

Conventions (the package's): theta from the downward vertical through the pivot to the
pivot -> centre-of-mass line, positive counter-clockwise; x to the right, y up;
r_hat = (sin th, -cos th), t_hat = (cos th, sin th). The pivot moves with acceleration
a_p = (ax, ay); G = a_p - g_vec = (ax, ay + g).

Equation of motion about the pivot (in the pivot's frame):

    I alpha = -M sin(th) - (M/g)(ay sin th + ax cos th)            gravity, pivot motion
              + sum tau_k cos(W_k t + phi_k)                         harmonic torques
              - c omega - D omega |omega|                            viscous, quadratic drag
              + f                                                    Coulomb pivot friction

with M the restoring moment (m g d, less buoyancy). The pivot reaction on the body is
R = m (a_p + d alpha t_hat - d omega^2 r_hat - g_vec), so

    R . r_hat = m (G . r_hat - d omega^2) = m N,    R . t_hat = m (G . t_hat + d alpha).

Sliding friction of direction s = sign(omega) is f = -s mu_k rho |R|; since |R| depends on
alpha the equation is implicit. With B the sum of the other torques, c_f = mu_k rho m,
e = c_f d / I and Q = G . t_hat + d B / I, squaring f^2 = c_f^2 (N^2 + (Q + d f / I)^2)
gives a quadratic whose root with s f <= 0 is

    f = -s c_f (sqrt(Q^2 + (1 - e^2) N^2) - s e Q) / (1 - e^2),

exact (no lagging), valid for e < 1 (the model refuses e >= 1: friction lock).

State of the integrator (scaled so one scalar tolerance suits every component):
y = [theta, omega / w0, ledger_1 / E_ref, ...], w0 = sqrt(M / I). The ledger components
integrate the power of each mechanism: dissipated by viscous damping, drag and friction
(>= 0) and supplied by each harmonic torque and pivot motion, so the energy budget closes
to the integrator's accuracy.

Plain floats and numpy arrays, SI units, no validation (``swingcalc.simulate`` validates).
"""

from __future__ import annotations

import math
from typing import NamedTuple

import numpy as np

__all__ = [
    "FRICTION_NONE",
    "FRICTION_REACTION",
    "FRICTION_TORQUE",
    "DenseStep",
    "HermiteStep",
    "HermiteSteps",
    "Params",
    "energy",
    "energy_array",
    "find_root",
    "find_roots",
    "friction_torque_array",
    "hermite_step",
    "hermite_steps",
    "holding",
    "ledger_names",
    "make_rhs",
    "make_rhs_array",
    "other_torque_array",
    "reaction_array",
    "replay_step",
]

FRICTION_NONE, FRICTION_REACTION, FRICTION_TORQUE = 0, 1, 2


class Params(NamedTuple):
    """The model as plain SI floats (see the module notes for the symbols)."""

    inertia: float          # I [kg m^2] about the pivot
    restoring: float        # M [N m]
    mass: float             # m [kg]
    com: float              # d [m]
    gravity: float          # g [m/s^2]
    linear: bool            # restoring torque -M theta (linearised pendulum)
    viscous: float          # c [N m s]
    drag: float             # D [N m s^2]
    friction_mode: int      # FRICTION_NONE / _REACTION / _TORQUE
    kinetic: float          # mu_k rho m [N s^2... i.e. torque per unit |R|/m] or T_f [N m]
    static: float           # mu_s rho m, or the static torque [N m]
    torques: tuple          # ((amplitude [N m], W [rad/s], phase [rad]), ...)
    pivots: tuple           # ((axis 0 = x / 1 = y, amplitude [m], W [rad/s], phase), ...)
    e_ref: float            # energy scale of the ledger components [J]

    @property
    def w0(self) -> float:
        return math.sqrt(self.restoring / self.inertia)


def ledger_names(p: Params) -> list[str]:
    """Names of the ledger components, in state order after [theta, omega / w0]."""
    names = []
    if p.viscous:
        names.append("viscous")
    if p.drag:
        names.append("drag")
    if p.friction_mode:
        names.append("friction")
    names += [f"torque_{k + 1}" for k in range(len(p.torques))]
    names += [f"pivot_{k + 1}" for k in range(len(p.pivots))]
    return names


class _Terms(NamedTuple):
    """The constants both right-hand sides derive from the parameters."""

    I: float            # inertia [kg m^2]
    M: float            # restoring moment [N m]
    d: float            # pivot to centre of mass [m]
    g: float
    w0: float
    inv_iw: float       # 1 / (I w0)
    inv_e: float        # 1 / reference energy
    m_g: float          # M / g
    c: float            # viscous
    D: float            # quadratic drag
    mode: int           # friction mode
    cf: float           # kinetic friction coefficient
    e: float            # cf d / I for reaction-following friction, else 0
    one_e2: float       # 1 - e^2
    d_i: float          # d / I
    i_c: int            # ledger rows of each loss (0: none) and of the first drive
    i_d: int
    i_f: int
    i_drive: int
    n: int              # length of the state: angle, speed and the ledger


def _terms(p: Params) -> _Terms:
    I, d, c, D, mode = p.inertia, p.com, p.viscous, p.drag, p.friction_mode
    e = p.kinetic * d / I if mode == FRICTION_REACTION else 0.0
    names = ledger_names(p)
    return _Terms(I, p.restoring, d, p.gravity, p.w0, 1.0 / (I * p.w0), 1.0 / p.e_ref,
                  p.restoring / p.gravity, c, D, mode, p.kinetic, e, 1.0 - e * e, d / I,
                  2 + names.index("viscous") if c else 0,
                  2 + names.index("drag") if D else 0,
                  2 + names.index("friction") if mode else 0,
                  2 + len(names) - len(p.torques) - len(p.pivots), 2 + len(names))


def make_rhs(p: Params, s: float, out: np.ndarray):
    """The right-hand side f(t, y) for sliding direction ``s`` (+1/-1; ignored without
    friction). It writes into ``out`` (a float array) and returns it (the integrator
    copies it), and it never raises: a failure is reported through ``rhs.state`` and the
    caller stops."""
    sin, cos, sqrt = math.sin, math.cos, math.sqrt
    (_, M, d, g, w0, inv_iw, inv_e, m_g, c, D, mode, cf, e, one_e2, d_i,
     i_c, i_d, i_f, i_drive, _) = _terms(p)
    linear = bool(p.linear)
    torques = tuple((float(a), float(w), float(ph)) for a, w, ph in p.torques)
    pivots = tuple((int(ax), float(a) * float(w) ** 2, float(w), float(ph))
                   for ax, a, w, ph in p.pivots)
    state = {"failed": False}
    # element writes through a memoryview of ``out`` cost less than numpy's own
    o = memoryview(out)
    if not (mode or torques or pivots):
        return _free_rhs(p, out, o, state, i_c, i_d)

    def rhs(t, y):
        try:
            yl = y.tolist()     # plain floats: numpy scalars are slower to compute with
            th = yl[0]
            om = yl[1] * w0
            if linear:
                S, C = th, 1.0
            else:
                S, C = sin(th), cos(th)
            B = -M * S
            k = i_drive
            for amp, w, ph in torques:
                q = amp * cos(w * t + ph)
                B += q
                o[k] = q * om * inv_e
                k += 1
            ax = ay = 0.0
            for axis, acc, w, ph in pivots:
                a = -acc * cos(w * t + ph)
                if axis:
                    ay += a
                    q = -m_g * a * S
                else:
                    ax += a
                    q = -m_g * a * C
                B += q
                o[k] = q * om * inv_e
                k += 1
            if c:
                q = c * om
                B -= q
                o[i_c] = q * om * inv_e
            if D:
                q = D * om * abs(om)
                B -= q
                o[i_d] = q * om * inv_e
            if mode == 1:
                gy = ay + g
                N = ax * S - gy * C - d * om * om
                Q = ax * C + gy * S + d_i * B
                f = -s * cf * (sqrt(Q * Q + one_e2 * N * N) - s * e * Q) / one_e2
                B += f
                o[i_f] = -f * om * inv_e
            elif mode == 2:
                f = -s * cf
                B += f
                o[i_f] = -f * om * inv_e
            o[0] = om
            o[1] = B * inv_iw
        except (ArithmeticError, ValueError, TypeError):
            state["failed"] = True
            out[:] = 0.0
        return out

    rhs.state = state
    return rhs


def _free_rhs(p: Params, out, o, state, i_c, i_d):
    """The lean right-hand side without friction or drives (most of the long runs)."""
    sin = math.sin
    w0 = p.w0
    c, D = p.viscous, p.drag
    inv_iw = 1.0 / (p.inertia * w0)
    inv_e = 1.0 / p.e_ref
    M = p.restoring
    if not (c or D):
        if p.linear:
            def rhs(t, y):
                th, w = y.tolist()
                o[0] = w0 * w
                o[1] = -w0 * th
                return out
        else:
            def rhs(t, y):
                try:
                    th, w = y.tolist()
                    o[0] = w0 * w
                    o[1] = -w0 * sin(th)
                except (ArithmeticError, ValueError, TypeError):
                    state["failed"] = True
                    out[:] = 0.0
                return out
    elif c and D and not p.linear:
        # viscous and air drag together, the usual real case: no branches left
        def rhs(t, y):
            try:
                yl = y.tolist()
                om = w0 * yl[1]
                pv = c * om
                pd = D * om * abs(om)
                o[0] = om
                o[1] = (-M * sin(yl[0]) - pv - pd) * inv_iw
                o[i_c] = pv * om * inv_e
                o[i_d] = pd * om * inv_e
            except (ArithmeticError, ValueError, TypeError):
                state["failed"] = True
                out[:] = 0.0
            return out
    else:
        linear = bool(p.linear)

        def rhs(t, y):
            try:
                yl = y.tolist()
                th = yl[0]
                om = w0 * yl[1]
                pv = c * om
                pd = D * om * abs(om)
                o[0] = om
                o[1] = (-M * (th if linear else sin(th)) - pv - pd) * inv_iw
                if i_c:
                    o[i_c] = pv * om * inv_e
                if i_d:
                    o[i_d] = pd * om * inv_e
            except (ArithmeticError, ValueError, TypeError):
                state["failed"] = True
                out[:] = 0.0
            return out
    rhs.state = state
    return rhs


def energy(p: Params, theta: float, omega: float) -> float:
    """Mechanical energy 1/2 I omega^2 + M (1 - cos theta) [J] (M theta^2 / 2 if linear),
    measured from rest at the bottom, in the pivot's frame."""
    if p.linear:
        pot = 0.5 * p.restoring * theta * theta
    else:
        s = math.sin(0.5 * theta)
        pot = 2.0 * p.restoring * s * s
    return 0.5 * p.inertia * omega * omega + pot


def energy_array(p: Params, theta, omega):
    theta = np.asarray(theta, dtype=float)
    omega = np.asarray(omega, dtype=float)
    if p.linear:
        pot = 0.5 * p.restoring * theta * theta
    else:
        pot = 2.0 * p.restoring * np.sin(0.5 * theta) ** 2
    return 0.5 * p.inertia * omega * omega + pot


def _pivot_acceleration(p: Params, t):
    t = np.asarray(t, dtype=float)
    ax = np.zeros_like(t)
    ay = np.zeros_like(t)
    for axis, a, w, ph in p.pivots:
        acc = -a * w * w * np.cos(w * t + ph)
        if axis:
            ay = ay + acc
        else:
            ax = ax + acc
    return ax, ay


def _sc(p: Params, theta):
    theta = np.asarray(theta, dtype=float)
    if p.linear:
        return theta, np.ones_like(theta)
    return np.sin(theta), np.cos(theta)


def other_torque_array(p: Params, t, theta, omega):
    """B: every torque except pivot friction [N m], elementwise."""
    t = np.asarray(t, dtype=float)
    omega = np.asarray(omega, dtype=float)
    S, C = _sc(p, theta)
    ax, ay = _pivot_acceleration(p, t)
    B = -p.restoring * S - (p.restoring / p.gravity) * (ay * S + ax * C)
    for amp, w, ph in p.torques:
        B = B + amp * np.cos(w * t + ph)
    return B - p.viscous * omega - p.drag * omega * np.abs(omega)


def friction_torque_array(p: Params, t, theta, omega, B, s):
    """Sliding friction torque f [N m] for direction ``s`` (elementwise; 0 where s == 0)."""
    s = np.asarray(s, dtype=float)
    if p.friction_mode == FRICTION_NONE:
        return np.zeros(np.broadcast(s, B).shape)
    if p.friction_mode == FRICTION_TORQUE:
        return -s * p.kinetic
    S, C = _sc(p, theta)
    ax, ay = _pivot_acceleration(p, t)
    gy = ay + p.gravity
    omega = np.asarray(omega, dtype=float)
    N = ax * S - gy * C - p.com * omega * omega
    Q = ax * C + gy * S + p.com * np.asarray(B) / p.inertia
    e = p.kinetic * p.com / p.inertia
    return -s * p.kinetic * (np.sqrt(Q * Q + (1.0 - e * e) * N * N) - s * e * Q) / (1.0 - e * e)


def reaction_array(p: Params, t, theta, omega, alpha):
    """Pivot reaction on the body, (R . r_hat, R . t_hat) [N], elementwise."""
    S, C = _sc(p, theta)
    ax, ay = _pivot_acceleration(p, t)
    gy = ay + p.gravity
    omega = np.asarray(omega, dtype=float)
    radial = p.mass * (ax * S - gy * C - p.com * omega * omega)
    tangential = p.mass * (ax * C + gy * S + p.com * np.asarray(alpha, dtype=float))
    return radial, tangential


def holding(p: Params, t: float, theta: float) -> tuple[float, float]:
    """(B, capacity) for a body at rest at ``theta``: the torque friction must hold and the
    most static friction can give [N m]. The body stays stuck while |B| <= capacity."""
    B = float(other_torque_array(p, t, theta, 0.0))
    if p.friction_mode == FRICTION_TORQUE:
        return B, p.static
    if p.friction_mode == FRICTION_NONE:
        return B, 0.0
    S, C = _sc(p, theta)
    ax, ay = _pivot_acceleration(p, t)
    gy = float(ay) + p.gravity
    N = float(ax) * float(S) - gy * float(C)
    P = float(ax) * float(C) + gy * float(S)
    return B, p.static * math.hypot(N, P)


class DenseStep:
    """One DOP853 step replayed from its start with the 7th-order dense output of Hairer,
    Norsett & Wanner (Solving ODEs I, 2nd ed., 1993, §II.6; DOP853 ``CONTD8``), built with
    scipy's published coefficients. ``value(x)`` is the state at t_a + x h, 0 <= x <= 1."""

    __slots__ = ("F", "h", "t_a", "y_a")

    def __init__(self, t_a, h, y_a, F):
        self.t_a, self.h, self.y_a, self.F = t_a, h, y_a, F

    def value(self, x: float) -> np.ndarray:
        y = np.zeros_like(self.y_a)
        for i, f in enumerate(self.F[::-1]):
            y += f
            y *= x if i % 2 == 0 else (1.0 - x)
        return y + self.y_a

    def component(self, j: int, x: float) -> float:
        F = self.F
        acc = 0.0
        for i in range(len(F) - 1, -1, -1):
            acc += F[i][j]
            acc *= x if (len(F) - 1 - i) % 2 == 0 else (1.0 - x)
        return acc + self.y_a[j]


class HermiteStep:
    """Quintic Hermite interpolant of a step from the values, first and second time
    derivatives of the state at both ends (error about (h w0)^6 / 46080 of the swing:
    4e-10 at the default tolerance's step of T/38). ``component(j, x)`` at t_a + x h."""

    __slots__ = ("coef", "h", "t_a")

    def __init__(self, t_a, h, coef):
        self.t_a, self.h, self.coef = t_a, h, coef

    def component(self, j: int, x: float) -> float:
        c0, c1, c2, c3, c4, c5 = self.coef[j]
        return c0 + x * (c1 + x * (c2 + x * (c3 + x * (c4 + x * c5))))

    def value(self, x: float) -> np.ndarray:
        return np.array([self.component(j, x) for j in range(len(self.coef))])


def _ends(rhs, t, y, eps):
    """f(t, y) and d f / dt along the solution by a forward difference over eps (one more
    right-hand side; eps w0 = 1e-7 keeps both its truncation and rounding below 1e-8 of
    f', which enters the interpolant times h^2 / 64)."""
    f = rhs(t, np.array(y)).tolist()
    f2 = rhs(t + eps, np.array([a + eps * b for a, b in zip(y, f)])).tolist()
    inv = 1.0 / eps
    return f, [(b - a) * inv for a, b in zip(f, f2)]


def hermite_step(rhs, t_a: float, y_a, t_b: float, y_b, w0: float = 1.0) -> HermiteStep:
    """The quintic Hermite interpolant of the step [t_a, t_b] (four right-hand sides)."""
    h = t_b - t_a
    ya = [float(v) for v in y_a]
    yb = [float(v) for v in y_b]
    eps = min(1e-7 / w0, 1e-3 * h)
    fa, ga = _ends(rhs, t_a, ya, eps)
    fb, gb = _ends(rhs, t_b, yb, eps)
    hh = h * h
    coef = []
    for p0, f0, g0, p1, f1, g1 in zip(ya, fa, ga, yb, fb, gb):
        v0, a0, v1, a1 = h * f0, hh * g0, h * f1, hh * g1
        coef.append((p0, v0, 0.5 * a0,
                     -10.0 * p0 - 6.0 * v0 - 1.5 * a0 + 10.0 * p1 - 4.0 * v1 + 0.5 * a1,
                     15.0 * p0 + 8.0 * v0 + 1.5 * a0 - 15.0 * p1 + 7.0 * v1 - a1,
                     -6.0 * p0 - 3.0 * v0 - 0.5 * a0 + 6.0 * p1 - 3.0 * v1 + 0.5 * a1))
    return HermiteStep(t_a, h, coef)


_COEF = None


def _coefficients():
    global _COEF
    if _COEF is None:
        from scipy.integrate._ivp import dop853_coefficients as dc

        n = dc.N_STAGES
        _COEF = (n, dc.A, dc.B, dc.C, dc.D, dc.N_STAGES_EXTENDED)
    return _COEF


def replay_step(rhs, t_a: float, y_a: np.ndarray, h: float) -> DenseStep:
    """Redo one DOP853 step of size ``h`` from (t_a, y_a) and return its dense output."""
    n_st, A, B, C, D, n_ext = _coefficients()
    K = np.empty((n_ext, y_a.size))
    K[0] = rhs(t_a, y_a)
    for s in range(1, n_st):
        K[s] = rhs(t_a + C[s] * h, y_a + h * (A[s, :s] @ K[:s]))
    y_b = y_a + h * (B @ K[:n_st])
    K[n_st] = rhs(t_a + h, y_b)
    for s in range(n_st + 1, n_ext):
        K[s] = rhs(t_a + C[s] * h, y_a + h * (A[s, :s] @ K[:s]))
    F = np.empty((7, y_a.size))
    dy = y_b - y_a
    F[0] = dy
    F[1] = h * K[0] - dy
    F[2] = 2.0 * dy - h * (K[n_st] + K[0])
    F[3:] = h * (D @ K)
    return DenseStep(t_a, h, y_a.copy(), F)


def find_root(fun, x0: float, x1: float, f0: float, f1: float) -> float:
    """A root of ``fun`` in [x0, x1] with f0, f1 of opposite signs (or one zero): the
    Illinois variant of regula falsi, to the last bits of x."""
    if f0 == 0.0:
        return x0
    if f1 == 0.0:
        return x1
    side = 0
    for _ in range(200):
        x = (x0 * f1 - x1 * f0) / (f1 - f0)
        if not (min(x0, x1) < x < max(x0, x1)):
            x = 0.5 * (x0 + x1)
        fx = fun(x)
        if fx == 0.0 or abs(x1 - x0) <= 4e-16 * max(1.0, abs(x)):
            return x
        if (fx > 0.0) == (f1 > 0.0):
            x1, f1 = x, fx
            if side == 1:
                f0 *= 0.5
            side = 1
        else:
            x0, f0 = x, fx
            if side == -1:
                f1 *= 0.5
            side = -1
    return x


def make_rhs_array(p: Params, s: float):
    """The right-hand side of :func:`make_rhs` for many states at once: ``f(t, Y)`` with
    ``t`` of shape (k,) and ``Y`` of shape (n, k) returns an (n, k) array (the same
    formulas, elementwise; used to locate the events of many steps in one pass)."""
    (_, M, d, g, w0, inv_iw, inv_e, m_g, c, D, mode, cf, e, one_e2, d_i,
     i_c, i_d, i_f, i_drive, n) = _terms(p)
    free = not (mode or p.torques or p.pivots)

    def rhs(t, Y):
        t = np.asarray(t, dtype=float)
        Y = np.asarray(Y, dtype=float)
        out = np.zeros((n,) + Y.shape[1:])
        th = Y[0]
        if free:
            # the operations of _free_rhs, in its order (the same values to the bit)
            S = th if p.linear else np.sin(th)
            if not (c or D):
                out[0] = w0 * Y[1]
                out[1] = -w0 * S
                return out
            om = w0 * Y[1]
            pv = c * om
            pd = D * om * np.abs(om)
            out[0] = om
            out[1] = (-M * S - pv - pd) * inv_iw
            if i_c:
                out[i_c] = pv * om * inv_e
            if i_d:
                out[i_d] = pd * om * inv_e
            return out
        om = Y[1] * w0
        if p.linear:
            S, C = th, 1.0
        else:
            S, C = np.sin(th), np.cos(th)
        B = -M * S
        k = i_drive
        for amp, w, ph in p.torques:
            q = amp * np.cos(w * t + ph)
            B = B + q
            out[k] = q * om * inv_e
            k += 1
        ax = ay = 0.0
        for axis, a, w, ph in p.pivots:
            acc = -(a * w ** 2) * np.cos(w * t + ph)
            if axis:
                ay = ay + acc
                q = -m_g * acc * S
            else:
                ax = ax + acc
                q = -m_g * acc * C
            B = B + q
            out[k] = q * om * inv_e
            k += 1
        if c:
            q = c * om
            B = B - q
            out[i_c] = q * om * inv_e
        if D:
            q = D * om * np.abs(om)
            B = B - q
            out[i_d] = q * om * inv_e
        if mode == FRICTION_REACTION:
            gy = ay + g
            N = ax * S - gy * C - d * om * om
            Q = ax * C + gy * S + d_i * B
            f = -s * cf * (np.sqrt(Q * Q + one_e2 * N * N) - s * e * Q) / one_e2
            B = B + f
            out[i_f] = -f * om * inv_e
        elif mode == FRICTION_TORQUE:
            f = -s * cf
            B = B + f
            out[i_f] = -f * om * inv_e
        out[0] = om
        out[1] = B * inv_iw
        return out

    return rhs


class HermiteSteps:
    """Quintic Hermite interpolants of many steps at once (the :class:`HermiteStep` of each,
    built the same way): ``coef`` has shape (6, n, k) for n components and k steps."""

    __slots__ = ("coef", "h", "t_a")

    def __init__(self, t_a, h, coef):
        self.t_a, self.h, self.coef = t_a, h, coef

    def take(self, idx) -> HermiteSteps:
        """The interpolants of the steps ``idx``."""
        return HermiteSteps(self.t_a[idx], self.h[idx], self.coef[:, :, idx])

    def component(self, j: int, x):
        c0, c1, c2, c3, c4, c5 = self.coef[:, j]
        return c0 + x * (c1 + x * (c2 + x * (c3 + x * (c4 + x * c5))))

    def slope(self, j: int, x):
        """d component / d x."""
        _, c1, c2, c3, c4, c5 = self.coef[:, j]
        return c1 + x * (2.0 * c2 + x * (3.0 * c3 + x * (4.0 * c4 + x * 5.0 * c5)))

    def value(self, x):
        """Every component at x (shape (k,)): an (n, k) array."""
        c0, c1, c2, c3, c4, c5 = self.coef
        return c0 + x * (c1 + x * (c2 + x * (c3 + x * (c4 + x * c5))))


def hermite_steps(rhs_array, t_a, Y_a, t_b, Y_b, w0: float = 1.0) -> HermiteSteps:
    """:func:`hermite_step` for k steps at once: ``t_a``, ``t_b`` of shape (k,), ``Y_a``,
    ``Y_b`` of shape (n, k); ``rhs_array`` from :func:`make_rhs_array`."""
    t_a = np.asarray(t_a, dtype=float)
    t_b = np.asarray(t_b, dtype=float)
    h = t_b - t_a
    eps = np.minimum(1e-7 / w0, 1e-3 * h)

    def ends(t, Y):
        f = rhs_array(t, Y)
        f2 = rhs_array(t + eps, Y + eps * f)
        return f, (f2 - f) / eps

    fa, ga = ends(t_a, Y_a)
    fb, gb = ends(t_b, Y_b)
    p0, p1 = Y_a, Y_b
    v0, a0, v1, a1 = h * fa, (h * h) * ga, h * fb, (h * h) * gb
    coef = np.array((p0, v0, 0.5 * a0,
                     -10.0 * p0 - 6.0 * v0 - 1.5 * a0 + 10.0 * p1 - 4.0 * v1 + 0.5 * a1,
                     15.0 * p0 + 8.0 * v0 + 1.5 * a0 - 15.0 * p1 + 7.0 * v1 - a1,
                     -6.0 * p0 - 3.0 * v0 - 0.5 * a0 + 6.0 * p1 - 3.0 * v1 + 0.5 * a1))
    return HermiteSteps(t_a, h, coef)


def find_roots(fun, slope, f0, f1):
    """Roots in [0, 1] of many smooth functions at once, each with f0 = fun(0) and
    f1 = fun(1) of opposite signs, or f1 == 0 (the caller selects those): Newton's method
    kept inside the shrinking sign bracket (bisection where a step would leave it), to the
    last bits of x. ``fun(x)`` and ``slope(x)`` take and return arrays of shape (k,)."""
    f0 = np.asarray(f0, dtype=float)
    f1 = np.asarray(f1, dtype=float)
    lo = np.zeros_like(f0)
    hi = np.ones_like(f0)
    pos0 = f0 > 0.0
    active = f1 != 0.0
    with np.errstate(divide="ignore", invalid="ignore"):
        x = np.where(active, f0 / (f0 - f1), 1.0)
        x = np.where(active & ~((x > 0.0) & (x < 1.0)), 0.5, x)
        for _ in range(100):
            fx = fun(x)
            right = (fx > 0.0) == pos0         # the root lies above x
            lo = np.where(active & right, x, lo)
            hi = np.where(active & ~right, x, hi)
            xn = x - fx / slope(x)
            xn = np.where((xn > lo) & (xn < hi), xn, 0.5 * (lo + hi))
            done = (fx == 0.0) | (np.abs(xn - x) <= 2e-16) | (hi - lo <= 4e-16)
            x = np.where(active & ~(fx == 0.0), xn, x)
            active = active & ~done
            if not active.any():
                break
    return x
