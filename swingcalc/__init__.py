"""swingcalc: design calculations for pendulums and other swinging parts.

The library works in SI floats and numpy arrays, angles in radians. Units, files and
formatting live at the boundary (``swingcalc.quantity``, ``swingcalc.designfile``,
``swingcalc.report``, ``swingcalc.cli``), which this package does not import.
"""

from .body import Part, Pivot, Suspension, assemble, point_bob
from .compound import CompoundPendulum, compound_pendulum, thermal_rate
from .loads import impact, point_motion, swing_loads
from .sizing import (
    drop_angle_for_energy,
    drop_angle_for_speed,
    length_for_period,
    max_amplitude_for_limit,
    period_at,
    position_for_period,
    rating_adjustment,
    sensitivities,
)
from .constants import SECONDS_PER_DAY, STANDARD_GRAVITY
from .environment import (
    Air,
    added_mass_rate_shift,
    air,
    air_density,
    air_viscosity,
    buoyancy_rate_shift,
    fluid_period_factor,
    fluid_rate_shift,
    isa_pressure,
    isa_temperature,
    normal_gravity,
    rate_change_per_kelvin,
    saturation_vapour_pressure,
)
from .errors import InvalidInput, SolverFailure, SwingcalcError
from .fluids import (
    added_mass,
    added_mass_coefficient,
    cylinder_drag_coefficient,
    drag_coefficient,
    friction_drag_coefficient,
    sphere_drag_coefficient,
    spheroid_added_mass_coefficient,
)
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
from .materials import MATERIALS, Material, material
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
    # bodies, loads, sizing
    "Part",
    "Pivot",
    "Suspension",
    "assemble",
    "point_bob",
    "CompoundPendulum",
    "compound_pendulum",
    "thermal_rate",
    "swing_loads",
    "point_motion",
    "impact",
    "period_at",
    "length_for_period",
    "position_for_period",
    "drop_angle_for_energy",
    "drop_angle_for_speed",
    "max_amplitude_for_limit",
    "sensitivities",
    "rating_adjustment",
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
    # environment
    "normal_gravity",
    "isa_temperature",
    "isa_pressure",
    "saturation_vapour_pressure",
    "air_density",
    "air_viscosity",
    "Air",
    "air",
    "fluid_period_factor",
    "buoyancy_rate_shift",
    "added_mass_rate_shift",
    "fluid_rate_shift",
    "rate_change_per_kelvin",
    # materials
    "Material",
    "MATERIALS",
    "material",
    # air-flow coefficients of part shapes
    "added_mass_coefficient",
    "spheroid_added_mass_coefficient",
    "added_mass",
    "drag_coefficient",
    "sphere_drag_coefficient",
    "cylinder_drag_coefficient",
    "friction_drag_coefficient",
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
