"""swingcalc: design calculations for pendulums and other swinging parts.

The library works in SI floats and numpy arrays, angles in radians. Units, files and
formatting live at the boundary (``swingcalc.quantity``, ``swingcalc.designfile``,
``swingcalc.report``, ``swingcalc.cli``), which this package does not import.
"""

from .constants import SECONDS_PER_DAY, STANDARD_GRAVITY
from .errors import InvalidInput, SolverFailure, SwingcalcError
from .linear import (
    SmallAngleCheck,
    clock_rate_error,
    max_amplitude_for_period_error,
    max_period_error_tolerance,
    peak_speed_error,
    peak_tension_error,
    period_ratio_bounds,
    phase_error,
    series_period_error,
    series_period_ratio,
    small_angle_check,
    small_angle_period_error,
)
from .pendulum import SimplePendulum, simple_pendulum, slack_angle
from .simulate import (HarmonicTorque, ImpulseDrive, PivotMotion, SimulationResult,
                       SwingModel, drag_moment_coefficient, simulate)
from .averaged import AveragedResult, averaged, beat_losses
from .swing import (
    Regime,
    SwingState,
    TimeHistory,
    amplitude_for_period_excess,
    amplitude_for_period_ratio,
    max_period_excess,
    classify,
    harmonic_ratio,
    natural_angular_frequency,
    period,
    period_excess,
    period_ratio,
    rotation_period,
    rotation_period_ratio,
    small_angle_period,
    swing_history,
    time_from_bottom,
)

__version__ = "0.1.0"

__all__ = [
    "__version__",
    "STANDARD_GRAVITY",
    "SECONDS_PER_DAY",
    "SwingcalcError",
    "InvalidInput",
    "SolverFailure",
    # exact swing
    "Regime",
    "SwingState",
    "TimeHistory",
    "natural_angular_frequency",
    "small_angle_period",
    "period_ratio",
    "period_excess",
    "period",
    "rotation_period_ratio",
    "rotation_period",
    "amplitude_for_period_ratio",
    "amplitude_for_period_excess",
    "max_period_excess",
    "time_from_bottom",
    "harmonic_ratio",
    "classify",
    "swing_history",
    # small-angle check
    "SmallAngleCheck",
    "small_angle_period_error",
    "series_period_ratio",
    "series_period_error",
    "period_ratio_bounds",
    "peak_speed_error",
    "peak_tension_error",
    "phase_error",
    "clock_rate_error",
    "max_amplitude_for_period_error",
    "max_period_error_tolerance",
    "small_angle_check",
    # simple pendulum
    "SimplePendulum",
    "simple_pendulum",
    "slack_angle",
    # damped, driven motion
    "SwingModel",
    "HarmonicTorque",
    "PivotMotion",
    "ImpulseDrive",
    "SimulationResult",
    "simulate",
    "drag_moment_coefficient",
    "AveragedResult",
    "averaged",
    "beat_losses",
]
