"""The ``tolerance`` command: worst case, root-sum-square and Monte Carlo bands of a
design's period, rate and loads under its ``[tolerances]``. It parses its options, calls
one report builder and renders it."""

from __future__ import annotations

from typing import Annotated

import typer

from ..errors import MISSING, InvalidInput, suggest
from . import options as opt
from .designs import DesignArg, _run

__all__ = ["register"]

_NO_TOLERANCES = ("a [tolerances] section in the design file, one +- half-width per input, "
                  "e.g. [tolerances] \"part.bob.centre\" = \"0.2 mm\", "
                  "\"environment.temperature\" = \"5 K\", \"part.bob.mass\" = \"1 %\"")


def _distribution(text: str) -> str:
    from ..tolerance import DISTRIBUTIONS  # here: not loaded at start-up

    word = text.strip().lower()
    if word not in DISTRIBUTIONS:
        raise InvalidInput("--distribution", text, " or ".join(DISTRIBUTIONS),
                           f"unknown distribution{suggest(word, DISTRIBUTIONS)}")
    return word


def _quantities(text: str | None) -> tuple | None:
    if text is None:
        return None
    names = tuple(n.strip() for n in text.split(","))
    if not all(names):
        raise InvalidInput("--quantity", text, "output names separated by commas, e.g. "
                           "'period_s, rate_s_per_day, reaction_N'", "an empty name")
    return names


def register(app: typer.Typer) -> None:
    """Add the ``tolerance`` command to ``app``."""

    @app.command("tolerance")
    def tolerance(design: DesignArg = None,
                  quantity: Annotated[str | None, typer.Option(
                      "--quantity", metavar="NAMES",
                      help="Outputs, separated by commas: period_s, rate_s_per_day, and "
                           "load peaks reaction_N, arm_tension_N, angular_speed_rad_s, "
                           "angular_acceleration_rad_s2, '<point>.speed_m_s', "
                           "'<point>.felt_g' (default: period and rate, and the pivot load "
                           "for any design but a clock).")] = None,
                  samples: Annotated[str, typer.Option(
                      "--samples", metavar="N",
                      help="Monte Carlo samples (100-10000000).")] = "100000",
                  seed: Annotated[str, typer.Option(
                      "--seed", metavar="N",
                      help="Seed of the random numbers (the same seed, the same result).")]
                  = "0",
                  distribution: Annotated[str, typer.Option(
                      "--distribution", metavar="KIND",
                      help="normal (each band at +-3 sigma, truncated there) or uniform.")]
                  = "normal",
                  gravity: opt.Gravity = None, fmt: opt.Format = None,
                  output: opt.Output = None, force: opt.Force = False) -> None:
        """Worst case, root-sum-square and Monte Carlo bands of the period, the rate and
        any load peak under the design file's tolerances, with the inputs ranked by their
        contribution."""
        from ..report.tolerance import tolerance_report

        names = _quantities(quantity)
        n = opt.count(samples, "--samples", low=100, high=10_000_000)
        s = opt.count(seed, "--seed", low=0, high=2**53)
        kind = _distribution(distribution)

        def build(d):
            if not d.tolerances:
                raise InvalidInput(f"{d.source}", MISSING, _NO_TOLERANCES,
                                   "the design has no tolerances")
            with _app()._options_named(quantity="--quantity"):
                return tolerance_report(d, names, samples=n, seed=s, distribution=kind)

        _run(design, fmt, output, force, build, gravity=gravity)


def _app():
    from . import app as a

    return a
