"""Design quantities of a simple pendulum (point bob on a light rod or a flexible suspension).

Method notes: ``docs/methods/simple-pendulum.md``.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

from ._validate import amplitude_scalar, finite_result, positive_scalar, real_scalar
from .constants import SECONDS_PER_HOUR, STANDARD_GRAVITY
from .errors import InvalidInput
from .kernels import swing as _k
from .swing import natural_angular_frequency

__all__ = ["SUSPENSIONS", "SimplePendulum", "simple_pendulum", "slack_angle"]

#: Kinds of suspension: a rigid (light) rod, or a flexible one (chain, rope, cable)
#: that can carry tension only.
SUSPENSIONS = ("rigid", "flexible")
# An amplitude this close to the separatrix (in 1 - h) gets a warning.
_NEAR_SEPARATRIX = 1e-3


def slack_angle(energy_ratio):
    """Angle [rad] at which the suspension tension of a point bob falls to zero, or None.

    Tension of a point mass from energy conservation: T/(m g) = 4h - 2 + 3 cos(theta)
    with h = v_bottom^2 / (4 g L) the energy over the separatrix energy, so it vanishes
    at cos(theta_s) = (2 - 4h) / 3. That angle is reached only for 1/2 < h < 5/4: below,
    the swing stays under 90 deg and the tension stays positive; above, the bob passes
    the top with tension to spare (v_bottom^2 >= 5 g L).
    """
    h = real_scalar(energy_ratio, "energy_ratio", "a finite energy ratio E/E_sep >= 0", low=0.0)
    if not (0.5 < h < 1.25):
        return None
    return math.acos((2.0 - 4.0 * h) / 3.0)


@dataclass(frozen=True)
class SimplePendulum:
    """Swing of a point bob of mass m on a light suspension of length L at amplitude A.

    All values SI, units in the names. ``zero_tension_angle_rad`` is where the
    suspension force changes sign (a flexible suspension goes slack there, a rigid rod
    goes into compression); None if it never does during the swing.
    """

    length_m: float
    mass_kg: float
    gravity_m_s2: float
    amplitude_rad: float
    suspension: str
    small_angle_period_s: float
    period_s: float
    period_ratio: float
    frequency_hz: float
    beats_per_hour: float
    peak_angular_speed_rad_s: float
    peak_speed_m_s: float
    peak_tension_N: float
    min_tension_N: float
    energy_J: float
    separatrix_margin: float
    over_top_speed_rigid_m_s: float
    over_top_speed_flexible_m_s: float
    zero_tension_angle_rad: float | None
    warnings: tuple = field(default=())

    def to_dict(self) -> dict:
        d = dict(self.__dict__)
        d["warnings"] = list(self.warnings)
        return d


def simple_pendulum(length, amplitude, mass=1.0, gravity=STANDARD_GRAVITY, suspension="rigid"):
    """Period, speeds, loads and energy of a simple pendulum at one amplitude.

    Parameters
    ----------
    length : float
        Pivot to bob centre [m].
    amplitude : float
        Libration amplitude [rad] in [0, pi).
    mass : float
        Bob mass [kg].
    gravity : float
        [m/s^2].
    suspension : {"rigid", "flexible"}

    Notes
    -----
    T0 = 2 pi sqrt(L/g); T = T0 (2/pi) K(sin^2(A/2)); a beat is half a period.
    Peak angular speed 2 omega0 sin(A/2) and peak tension m g (3 - 2 cos A) at the
    bottom, minimum tension m g cos A at the ends (energy conservation with the radial
    equation of motion). Over the top: bottom speed sqrt(4 g L) with a rigid rod
    (zero speed at the top), sqrt(5 g L) with a flexible suspension (zero tension at
    the top). A flexible suspension carries no compression, so its minimum tension is
    reported as 0 once it goes slack (with a warning).

    Examples
    --------
    >>> r = simple_pendulum(1.0, math.radians(60), mass=2.0)
    >>> round(r.peak_tension_N, 6)   # 2 * 9.80665 * (3 - 2 cos 60 deg)
    39.2266
    """
    L = positive_scalar(length, "length", "m")
    mass_kg = positive_scalar(mass, "mass", "kg")
    g = positive_scalar(gravity, "gravity", "m/s^2")
    a = amplitude_scalar(amplitude)
    if suspension not in SUSPENSIONS:
        raise InvalidInput("suspension", suspension, " or ".join(SUSPENSIONS))
    omega0 = natural_angular_frequency(L, g)
    t0 = 2.0 * math.pi / omega0
    m_par, p_par = (float(v) for v in _k.amplitude_parameters(a))
    ratio = 1.0 + float(_k.period_excess(m_par, p_par))
    t = t0 * ratio
    weight = mass_kg * g
    peak_omega = 2.0 * omega0 * math.sin(0.5 * a)
    zero_angle = slack_angle(m_par)
    warnings = []
    if zero_angle is not None:
        deg = math.degrees(zero_angle)
        if suspension == "flexible":
            warnings.append(
                f"the suspension goes slack at {deg:.2f} deg, before the end of the swing: the "
                "bob then falls freely, the suspension snatches taut again, and these results "
                "do not hold past that angle")
        else:
            warnings.append(
                f"the rod is in compression beyond {deg:.2f} deg: size it (and its joints) "
                "for compression and buckling")
    if p_par < _NEAR_SEPARATRIX:
        warnings.append(
            f"the amplitude is within {p_par:.2g} of the separatrix energy: a small push "
            "sends the bob over the top")
    values = dict(
        small_angle_period_s=t0, period_s=t, period_ratio=ratio, frequency_hz=1.0 / t,
        beats_per_hour=2.0 * SECONDS_PER_HOUR / t,
        peak_angular_speed_rad_s=peak_omega, peak_speed_m_s=peak_omega * L,
        peak_tension_N=weight * (1.0 + 4.0 * m_par),
        min_tension_N=(max(0.0, weight * math.cos(a)) if suspension == "flexible"
                       else weight * math.cos(a)),
        energy_J=2.0 * weight * L * m_par,
        separatrix_margin=p_par,
        over_top_speed_rigid_m_s=2.0 * omega0 * L,
        over_top_speed_flexible_m_s=math.sqrt(5.0) * omega0 * L)
    finite_result(values.values(), "length/mass/gravity",
                  "magnitudes whose periods, speeds, loads and energies are finite numbers")
    return SimplePendulum(length_m=L, mass_kg=mass_kg, gravity_m_s2=g, amplitude_rad=a,
                          suspension=suspension, zero_tension_angle_rad=zero_angle,
                          warnings=tuple(warnings), **values)

