"""Physical constants, each with its source."""

from __future__ import annotations

__all__ = ["STANDARD_GRAVITY", "SECONDS_PER_DAY", "SECONDS_PER_HOUR"]

#: Standard acceleration of gravity g_n [m/s^2], exact by definition
#: (3rd CGPM, 1901; ISO 80000-3; NIST SP 330).
STANDARD_GRAVITY = 9.80665

#: Seconds in a mean solar day [s] (definition of the day as 86 400 s of SI time).
SECONDS_PER_DAY = 86400.0

#: Seconds in an hour [s].
SECONDS_PER_HOUR = 3600.0
