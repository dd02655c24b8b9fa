"""Speeds, accelerations, pivot reaction, suspension tension and energies through the swing
of a compound pendulum at its working amplitude, with the peaks and where they occur.

Angles: theta from the hanging position (the line from the pivot through the centre of
mass straight down), positive counter-clockwise. The swing is conservative (the exact
libration of :mod:`swingcalc.swing`): omega^2 = 2 (M/I)(cos theta - cos A) and
alpha = -(M/I) sin theta, with M and I the restoring moment and inertia of
:func:`swingcalc.compound.compound_pendulum`. Forces use the body's real mass and gravity.

Method notes: ``docs/methods/loads.md``.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

import numpy as np

from ._validate import amplitude_scalar, positive_scalar, real_scalar
from .compound import CompoundPendulum
from .errors import InvalidInput

__all__ = ["Peak", "PointMotion", "SwingLoads", "ImpactResult", "swing_loads", "peak",
           "point_motion", "payload_tension", "first_slack",
           "impact", "over_top_speed", "DEFAULT_SAMPLES"]

#: Angles in a loads table over the full swing -A..A (odd, so the bottom is a sample).
DEFAULT_SAMPLES = 181
_REFINE_SAMPLES = 2049


@dataclass(frozen=True)
class Peak:
    """The largest magnitude of one quantity over the swing, and an angle where it occurs."""

    quantity: str
    value: float
    angle_rad: float

    def to_dict(self) -> dict:
        return dict(self.__dict__)


@dataclass(frozen=True)
class PointMotion:
    """Motion of one named point of the body over the swing (arrays over ``angle_rad``).

    ``felt_normal_g`` is the specific force (acceleration less gravity, what an
    accelerometer or a rider feels) along the line from the point to the pivot, in units
    of g, positive pressing the rider into a seat that faces the pivot;
    ``felt_tangential_g`` the component along the motion; ``felt_g`` their magnitude.
    """

    name: str
    along_m: float
    across_m: float
    radius_m: float
    speed_m_s: np.ndarray
    tangential_acceleration_m_s2: np.ndarray
    normal_acceleration_m_s2: np.ndarray
    felt_normal_g: np.ndarray
    felt_tangential_g: np.ndarray
    felt_g: np.ndarray

    def to_dict(self) -> dict:
        return {k: (v.tolist() if isinstance(v, np.ndarray) else v)
                for k, v in self.__dict__.items()}


@dataclass(frozen=True)
class SwingLoads:
    """Loads through a swing of amplitude ``amplitude_rad``; arrays over ``angle_rad``.

    Pivot reaction: the force of the pivot on the body, split along the arm
    (``arm_tension_N``: positive pulls the body toward the pivot; negative is compression
    of a rigid arm) and across it (``reaction_tangential_N``), its magnitude, and its
    horizontal and vertical parts (``reaction_x_N`` to the right, ``reaction_y_N`` up;
    the pivot carries the opposite). ``payload_tension_N`` (flexible suspension only):
    the tension at the payload end of the suspension; the suspension goes slack at
    ``slack_angle_rad`` when that falls to zero before the end of the swing: the rows past
    it (``taut`` False) are what the taut model would give, not what happens, and the
    peaks are taken over the taut part of the swing only.
    """

    amplitude_rad: float
    angle_rad: np.ndarray
    taut: np.ndarray                # False past the slack angle (the rows do not hold)
    angular_speed_rad_s: np.ndarray
    angular_acceleration_rad_s2: np.ndarray
    arm_tension_N: np.ndarray
    reaction_tangential_N: np.ndarray
    reaction_N: np.ndarray
    reaction_x_N: np.ndarray
    reaction_y_N: np.ndarray
    kinetic_energy_J: np.ndarray
    potential_energy_J: np.ndarray
    payload_tension_N: np.ndarray | None
    points: tuple
    peaks: tuple
    energy_J: float
    separatrix_energy_J: float
    separatrix_margin: float
    over_top_speed_rad_s: float
    slack_angle_rad: float | None
    compression_angle_rad: float | None
    weight_N: float
    warnings: tuple = field(default=())

    @property
    def least_tension_N(self) -> float:
        """Least tension over the swing [N] in what holds the body: a flexible
        suspension's payload end (0 once it goes slack), or the arm (negative:
        compression). The tension falls with |theta|, so the ends of the swing, which
        every sampling holds, give it."""
        if self.payload_tension_N is not None:
            least = max(float(np.min(self.payload_tension_N)), 0.0)
        else:
            least = float(np.min(self.arm_tension_N))
        # a tension that is zero in exact arithmetic (an end of the swing at 90 deg) comes
        # out as rounding, ~1e-16 of the weight: shown as what it is, zero
        return 0.0 if abs(least) <= 1e-13 * self.weight_N else least

    def peak(self, quantity: str) -> Peak:
        for p in self.peaks:
            if p.quantity == quantity:
                return p
        raise KeyError(quantity)

    def to_dict(self) -> dict:
        out = {}
        for k, v in self.__dict__.items():
            if isinstance(v, np.ndarray):
                out[k] = v.tolist()
            elif k in ("points", "peaks"):
                out[k] = [x.to_dict() for x in v]
            elif k == "warnings":
                out[k] = list(v)
            else:
                out[k] = v
        return out


def _kinematics(pend: CompoundPendulum, amplitude: float, theta):
    k = pend.restoring_moment_N_m / pend.inertia_kg_m2
    # cos(theta) - cos(A) = 2 (sin^2(A/2) - sin^2(theta/2)): exact at small amplitudes
    # (the cosine form loses 1 - cos A there); next to the turning point the difference
    # of squares still loses ~eps / (1 - theta/A), harmless for loads.
    diff = 2.0 * (math.sin(0.5 * amplitude) ** 2 - np.sin(0.5 * theta) ** 2)
    omega2 = np.maximum(2.0 * k * diff, 0.0)
    return omega2, -k * np.sin(theta)


def _reaction(pend: CompoundPendulum, theta, omega2, alpha):
    m, d, g = pend.mass_kg, pend.com_distance_m, pend.gravity_m_s2
    radial = m * (d * omega2 + g * np.cos(theta))            # pull toward the pivot
    # m (d alpha + g sin) with alpha = -(M/I) sin: m sin (g I - d M) / I, and
    # g I - d M = g (I_G + added inertia) + d (buoyancy moment), free of cancellation
    # (exactly 0 for a point bob in a vacuum).
    b = pend.body
    excess = (g * (b.inertia_com_kg_m2 + pend.air.added_inertia_kg_m2)
              + d * pend.air.buoyancy_moment_N_m)
    tangential = m * np.sin(theta) * excess / pend.inertia_kg_m2
    # R = m a_com + m g y_hat, with r_hat = (sin, -cos), t_hat = (cos, sin).
    rx = -radial * np.sin(theta) + tangential * np.cos(theta)
    ry = radial * np.cos(theta) + tangential * np.sin(theta)
    return radial, tangential, np.hypot(radial, tangential), rx, ry


def point_motion(pend: CompoundPendulum, name: str, along: float, across: float,
                 amplitude: float, theta) -> PointMotion:
    """Speed and accelerations of the body point at (``along``, ``across``) [m] from the
    pivot (body frame, as the parts are placed), at the angles ``theta`` [rad] of a swing
    of ``amplitude`` [rad].

    Notes
    -----
    With r the point's distance from the pivot and psi = theta + phi its angle from the
    downward vertical (phi its angle from the centre-of-mass line): speed |omega| r,
    tangential acceleration alpha r, normal acceleration omega^2 r toward the pivot; the
    felt (specific) force f = a - g: normal (omega^2 r + g cos psi)/g, tangential
    (alpha r + g sin psi)/g. A point bob of a simple pendulum feels no tangential force.
    """
    s = real_scalar(along, f"point '{name}': along", "a finite position along the arm [m]")
    u = real_scalar(across, f"point '{name}': across", "a finite offset across the arm [m]")
    a = amplitude_scalar(amplitude)
    theta = np.asarray(theta, dtype=float)
    omega2, alpha = _kinematics(pend, a, theta)
    r = math.hypot(s, u)
    phi = math.atan2(u, s) - pend.body.hang_tilt_rad
    psi = theta + phi
    g = pend.gravity_m_s2
    omega = np.sqrt(omega2)
    fn = (omega2 * r + g * np.cos(psi)) / g
    ft = (alpha * r + g * np.sin(psi)) / g
    return PointMotion(name=name, along_m=s, across_m=u, radius_m=r, speed_m_s=omega * r,
                       tangential_acceleration_m_s2=alpha * r,
                       normal_acceleration_m_s2=omega2 * r, felt_normal_g=fn,
                       felt_tangential_g=ft, felt_g=np.hypot(fn, ft))


def over_top_speed(pend: CompoundPendulum) -> float:
    """Least angular speed [rad/s] at the bottom that carries the body over the top.

    Rigid arm: the energy to reach the inverted position, omega_b^2 = 4 M/I. Flexible
    suspension: the payload must still pull the suspension taut at the top,
    d_p omega_top^2 >= g (d_p the payload's centre-of-mass distance), so
    omega_b^2 = 4 M/I + g/d_p; for a point mass 5 g/L (any mechanics text; e.g. the
    loop-the-loop condition [mem: standard]).
    """
    k = pend.restoring_moment_N_m / pend.inertia_kg_m2
    if not pend.body.suspension.flexible:
        return 2.0 * math.sqrt(k)
    _, d_p = _payload(pend)
    return math.sqrt(4.0 * k + pend.gravity_m_s2 / d_p)


def _payload(pend: CompoundPendulum) -> tuple[float, float]:
    """(mass, centre-of-mass distance along the hanging line) of all but the suspension."""
    parts = [p for p in pend.body.parts if p.shape != "line"]
    m = sum(p.mass_kg for p in parts)
    t = pend.body.hang_tilt_rad
    d = sum(p.mass_kg * (p.centre_along_m * math.cos(t) + p.centre_across_m * math.sin(t))
            for p in parts) / m
    return m, d


def _payload_tension(pend: CompoundPendulum, theta, omega2):
    m_p, d_p = _payload(pend)
    return m_p * (d_p * omega2 + pend.gravity_m_s2 * np.cos(theta))


def payload_tension(pend: CompoundPendulum, angle, angular_velocity):
    """Tension [N] a flexible suspension carries at its payload end in the state (angle
    [rad], angular velocity [rad/s]): m_p (d_p omega^2 + g cos theta), the payload's
    centripetal need plus its weight along the line (fixed pivot; see swing_loads).
    Negative where the line would have to push: it goes slack there."""
    theta = np.asarray(angle, dtype=float)
    omega = np.asarray(angular_velocity, dtype=float)
    return _payload_tension(pend, theta, omega * omega)


def first_slack(pend: CompoundPendulum, time, angle, angular_velocity):
    """(time [s], angle [rad]) of the first state of a time history where a flexible
    suspension would go slack (payload-end tension below zero), or None: also when the
    suspension is rigid. For a simulated run, whose model keeps the line taut: past that
    time its motion and loads are not those of the real body."""
    if not pend.body.suspension.flexible:
        return None
    tension = payload_tension(pend, angle, angular_velocity)
    bad = np.flatnonzero(tension < 0.0)
    if bad.size == 0:
        return None
    i = int(bad[0])
    return float(np.asarray(time)[i]), float(np.asarray(angle)[i])


def swing_loads(pend: CompoundPendulum, amplitude: float, points=None,
                samples: int = DEFAULT_SAMPLES) -> SwingLoads:
    """Loads and motion through a swing of ``amplitude`` [rad] of ``pend``.

    Parameters
    ----------
    pend : CompoundPendulum
    amplitude : float
        Libration amplitude [rad] in [0, pi).
    points : mapping name -> (along, across), optional
        Named points of the body [m] (a seat, a striker, the bob centre).
    samples : int
        Angles in the returned arrays, evenly spaced over -A..A (at least 3).

    Returns
    -------
    SwingLoads
        Arrays over the angles, and ``peaks``: the largest magnitude of each quantity
        over the whole swing, found on a fine grid and refined to the float (the arrays
        need not contain the peak angle).

    Notes
    -----
    Pivot reaction R = m a_G + m g y_hat (Newton's second law for the centre of mass):
    along the arm m (d omega^2 + g cos theta), across it m (d alpha + g sin theta),
    which vanishes for a point mass (I = m d^2). Energies: kinetic (1/2) I omega^2,
    potential M (1 - cos theta). Flexible suspension: while taut the body swings as one
    (the point-mass-plus-line model); the payload end carries
    m_p (d_p omega^2 + g cos theta), which falls to zero at
    cos theta_s = 2 d_p (M/I) cos A / (2 d_p (M/I) + g), only for A > 90 deg.

    Examples
    --------
    >>> from swingcalc.body import assemble, point_bob
    >>> from swingcalc.compound import compound_pendulum
    >>> p = compound_pendulum(assemble(*point_bob(1.0, 2.0)))
    >>> r = swing_loads(p, math.radians(60))
    >>> round(r.peak("arm_tension_N").value, 6)     # 2 * 9.80665 * (3 - 2 cos 60 deg)
    39.2266
    """
    a = amplitude_scalar(amplitude)
    n = int(samples) if isinstance(samples, (int, np.integer)) and not isinstance(
        samples, bool) else -1
    if n < 3 or n > 100_001:
        raise InvalidInput("samples", samples, "a whole number of angles in [3, 100001]")
    points = dict(points or {})
    theta = np.linspace(-a, a, n)
    if n % 2:
        theta[n // 2] = 0.0
    series = _series(pend, a, theta, points)
    energy = 2.0 * pend.restoring_moment_N_m * math.sin(0.5 * a) ** 2
    flexible = pend.body.suspension.flexible
    compression = None
    warnings = []
    slack = _slack_angle(pend, a)
    peaks = _peaks(pend, a, points, slack)
    if slack is not None:
        warnings.append(
            f"the suspension goes slack at {math.degrees(slack):.2f} deg, before the end "
            f"of the {math.degrees(a):.2f} deg swing: the payload then falls freely and "
            "snatches the suspension taut again; these loads do not hold past that angle")
    if not flexible:
        c_arm = _zero_tension_angle(pend, a, pend.com_distance_m)
        if c_arm is not None:
            compression = c_arm
            warnings.append(
                f"the arm is in compression beyond {math.degrees(c_arm):.2f} deg: size it "
                "and its joints for compression and buckling")
    p = math.cos(0.5 * a) ** 2
    if p < 1e-3:
        warnings.append(f"the swing is within {p:.2g} of the separatrix energy: a small push "
                        "sends the body over the top")
    return SwingLoads(
        amplitude_rad=a, angle_rad=theta,
        taut=(np.ones(theta.shape, dtype=bool) if slack is None
              else np.abs(theta) <= slack),
        angular_speed_rad_s=series["angular_speed_rad_s"],
        angular_acceleration_rad_s2=series["angular_acceleration_rad_s2"],
        arm_tension_N=series["arm_tension_N"],
        reaction_tangential_N=series["reaction_tangential_N"],
        reaction_N=series["reaction_N"], reaction_x_N=series["reaction_x_N"],
        reaction_y_N=series["reaction_y_N"],
        kinetic_energy_J=series["kinetic_energy_J"],
        potential_energy_J=series["potential_energy_J"],
        payload_tension_N=series.get("payload_tension_N"),
        points=tuple(point_motion(pend, name, s, u, a, theta)
                     for name, (s, u) in points.items()),
        peaks=peaks, energy_J=energy, separatrix_energy_J=2.0 * pend.restoring_moment_N_m,
        separatrix_margin=p, over_top_speed_rad_s=over_top_speed(pend),
        slack_angle_rad=slack, compression_angle_rad=compression,
        weight_N=pend.mass_kg * pend.gravity_m_s2, warnings=tuple(warnings))


def _peaks(pend, a, points, slack, only: str | None = None) -> tuple:
    """The peaks over the swing (only where the model holds: a slack suspension's payload
    falls freely), of every quantity or of ``only``."""
    reach = a if slack is None else slack
    fine = np.linspace(-reach, reach, _REFINE_SAMPLES)
    fine_series = _series(pend, a, fine, points)
    return tuple(_peak(pend, a, points, key, fine, values)
                 for key, values in fine_series.items()
                 if key not in ("potential_energy_J", "kinetic_energy_J")
                 and (only is None or key == only))


def peak(pend: CompoundPendulum, amplitude: float, quantity: str, points=None) -> Peak:
    """The peak of one quantity of :func:`swing_loads` (a key of its ``peaks``), computed
    alone: what a search over amplitudes needs."""
    a = amplitude_scalar(amplitude)
    found = _peaks(pend, a, dict(points or {}), _slack_angle(pend, a), only=quantity)
    if not found:
        raise KeyError(quantity)
    return found[0]


def _series(pend, a, theta, points) -> dict:
    omega2, alpha = _kinematics(pend, a, theta)
    radial, tangential, mag, rx, ry = _reaction(pend, theta, omega2, alpha)
    out = {"angular_speed_rad_s": np.sqrt(omega2), "angular_acceleration_rad_s2": alpha,
           "arm_tension_N": radial, "reaction_tangential_N": tangential, "reaction_N": mag,
           "reaction_x_N": rx, "reaction_y_N": ry,
           "kinetic_energy_J": 0.5 * pend.inertia_kg_m2 * omega2,
           "potential_energy_J": 2.0 * pend.restoring_moment_N_m * np.sin(0.5 * theta) ** 2}
    if pend.body.suspension.flexible:
        out["payload_tension_N"] = _payload_tension(pend, theta, omega2)
    for name, (s, u) in points.items():
        pm = point_motion(pend, name, s, u, a, theta)
        out[f"{name}.speed_m_s"] = pm.speed_m_s
        out[f"{name}.felt_normal_g"] = pm.felt_normal_g
        out[f"{name}.felt_tangential_g"] = pm.felt_tangential_g
        out[f"{name}.felt_g"] = pm.felt_g
    return out


def _peak(pend, a, points, key, theta, values) -> Peak:
    """Largest |value| over the swing: the best grid point, refined by golden section."""
    mags = np.abs(values)
    i = int(np.argmax(mags))
    best_t, best_v = float(theta[i]), float(values[i])
    if 0 < i < len(theta) - 1 and a > 0.0:
        from scipy.optimize import minimize_scalar

        def neg(t):
            return -abs(float(_series(pend, a, np.array([t]), points)[key][0]))

        res = minimize_scalar(neg, bounds=(float(theta[i - 1]), float(theta[i + 1])),
                              method="bounded", options={"xatol": 1e-12 * max(a, 1e-300)})
        if res.success and -res.fun > abs(best_v):
            best_t = float(res.x)
            best_v = float(_series(pend, a, np.array([best_t]), points)[key][0])
    return Peak(key, best_v, best_t)


def _zero_tension_angle(pend, a, d) -> float | None:
    """Angle in (0, A) where a tension m (d omega^2 + g cos theta) changes sign, if any:
    with omega^2 = 2 (M/I)(cos theta - cos A) it vanishes at
    cos theta = 2 d (M/I) cos A / (2 d (M/I) + g), reached only for A > 90 deg. ``d`` is
    the centre-of-mass distance of what the tension carries (the body for the arm, the
    payload for a flexible suspension's end)."""
    if a <= 0.5 * math.pi:
        return None
    k = pend.restoring_moment_N_m / pend.inertia_kg_m2
    c = 2.0 * d * k * math.cos(a) / (2.0 * d * k + pend.gravity_m_s2)
    return math.acos(c) if -1.0 <= c <= 1.0 else None


def _slack_angle(pend, a) -> float | None:
    """Where a flexible suspension goes slack during a swing of ``a`` (None: never)."""
    if not pend.body.suspension.flexible:
        return None
    return _zero_tension_angle(pend, a, _payload(pend)[1])


@dataclass(frozen=True)
class ImpactResult:
    """Energies and speeds of an impact-test pendulum (a hammer released from rest).

    ``potential_energy_J`` = M (1 - cos alpha) at the drop angle alpha; ``absorbed_J`` =
    M (cos beta - cos alpha) for a rise angle beta (None when no rise angle is given);
    the striking speed is that of the strike point at the bottom. The centre-of-
    percussion offset is (strike radius - L_eq) / strike radius: near zero the pivot
    feels no shock from the blow.
    """

    drop_angle_rad: float
    strike_radius_m: float
    potential_energy_J: float
    striking_speed_m_s: float
    striking_angular_speed_rad_s: float
    rise_angle_rad: float | None
    absorbed_J: float | None
    centre_of_percussion_m: float
    percussion_offset_rel: float

    def to_dict(self) -> dict:
        return dict(self.__dict__)


def impact(pend: CompoundPendulum, drop_angle: float, strike_radius: float,
           rise_angle: float | None = None) -> ImpactResult:
    """Energy and striking speed of a pendulum hammer, and the energy a specimen absorbed.

    Parameters
    ----------
    drop_angle, rise_angle : float
        Angles from the hanging position [rad] in (0, pi]; the rise must not exceed the
        drop (no energy comes from the specimen).
    strike_radius : float
        Pivot to the centre of strike [m].

    Notes
    -----
    Energy conservation with M = m g d (the restoring moment, less buoyancy when air is
    set): K_P = M (1 - cos alpha), K = M (cos beta - cos alpha) (the method of ISO 148-1
    and ASTM E23, friction and windage losses not deducted), omega_b^2 = 2 K_P / I.

    Examples
    --------
    >>> from swingcalc.body import assemble, point_bob
    >>> from swingcalc.compound import compound_pendulum
    >>> p = compound_pendulum(assemble(*point_bob(0.8, 20.0)))
    >>> r = impact(p, math.radians(150), 0.8, math.radians(60))
    >>> round(r.potential_energy_J, 4), round(r.absorbed_J, 4)
    (292.7913, 214.3381)
    """
    allowed = "an angle in (0, 180] deg from the hanging position"
    alpha = real_scalar(drop_angle, "drop angle", allowed, low=0.0, high=math.pi,
                        low_open=True)
    r = positive_scalar(strike_radius, "strike radius", "m")
    M, inertia = pend.restoring_moment_N_m, pend.inertia_kg_m2
    kp = 2.0 * M * math.sin(0.5 * alpha) ** 2
    omega_b = math.sqrt(2.0 * kp / inertia)
    absorbed = beta = None
    if rise_angle is not None:
        beta = real_scalar(rise_angle, "rise angle", f"an angle in [0, drop angle = "
                           f"{math.degrees(alpha):.6g} deg]", low=0.0, high=alpha)
        absorbed = M * (math.cos(beta) - math.cos(alpha))
    l_eq = pend.body.centre_of_percussion_m
    return ImpactResult(drop_angle_rad=alpha, strike_radius_m=r, potential_energy_J=kp,
                        striking_speed_m_s=omega_b * r, striking_angular_speed_rad_s=omega_b,
                        rise_angle_rad=beta, absorbed_J=absorbed,
                        centre_of_percussion_m=l_eq, percussion_offset_rel=(r - l_eq) / r)
