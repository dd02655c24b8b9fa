"""Figures of a design: period against amplitude, the phase portrait, the loads through
the swing and the decay of a simulated swing (matplotlib, the ``plot`` extra).

Each builder takes library results (a :class:`~swingcalc.compound.CompoundPendulum`,
a :class:`~swingcalc.loads.SwingLoads`, a :class:`~swingcalc.simulate.SimulationResult`)
and returns a :class:`matplotlib.figure.Figure` drawn without pyplot, so no global figure
state is kept and no display is needed; :func:`design_figure` builds one from a design
file's :class:`~swingcalc.designfile.Design`. :func:`figure_bytes` renders PNG or SVG
reproducibly: the same input gives the same bytes (within one matplotlib version).

matplotlib is imported inside the functions only (``import swingcalc`` stays light);
without it they raise :class:`PlotExtraMissing`. Every curve carries a ``gid`` naming
what it is (``exact``, ``separatrix-upper``, ``slack-point``, ...), which the SVG keeps
as the element id. Method notes: ``docs/plots.md``.
"""

from __future__ import annotations

import math
import textwrap
from contextlib import contextmanager

import numpy as np

from .errors import MISSING, InvalidInput, suggest

__all__ = [
    "FORMATS",
    "KINDS",
    "RC",
    "PlotExtraMissing",
    "decay_figure",
    "design_figure",
    "figure_bytes",
    "loads_figure",
    "period_figure",
    "phase_figure",
    "require_matplotlib",
    "style",
]

#: Plot kinds of :func:`design_figure`.
KINDS = ("period", "phase", "loads", "decay")
#: File formats of :func:`figure_bytes`.
FORMATS = ("png", "svg")

#: rcParams every figure is built and saved under (on top of matplotlib's defaults, so a
#: user's matplotlibrc changes nothing): a fixed SVG id salt, glyphs as paths, the font
#: matplotlib ships, and a fixed resolution.
RC = {
    "svg.hashsalt": "swingcalc-plots",
    "svg.fonttype": "path",
    "font.family": "DejaVu Sans",
    "font.size": 9.0,
    "figure.dpi": 100,
    "savefig.dpi": 120,
    "path.simplify": True,
    "axes.grid": True,
    "grid.alpha": 0.35,
    "legend.fontsize": 8.0,
    "legend.framealpha": 0.9,
}
# No dates or software strings in the files (PITFALLS.md, matplotlib): SVG 'Date' and
# 'Creator' and PNG 'Software' are left out.
_METADATA = {"png": {"Software": None}, "svg": {"Date": None, "Creator": None}}

# Our own colours (no other program's scheme).
_INK = "#1f3b57"        # the exact result
_GREY = "#7a7a7a"       # the small-angle model, reference lines
_RUST = "#b5541c"       # series, payload
_MOSS = "#4f7d2c"       # series, second quantity
_PLUM = "#7b3f78"       # third quantity
_WORK = "#c21f3a"       # the design's working state
_BAND = "#9cc3e0"       # tolerance band
_SLACK = "#f2c57c"      # slack region

_MPL_ALLOWED = "install the plot extra: pip install 'swingcalc[plot]'"


class PlotExtraMissing(InvalidInput):
    """matplotlib is not installed. An :class:`~swingcalc.errors.InvalidInput` (what was
    asked for cannot be done here), with a one-line message that says how to get it."""

    def __init__(self):
        self.field = "plot"
        self.value = MISSING
        self.allowed = _MPL_ALLOWED
        self.problem = "matplotlib is not installed"
        Exception.__init__(self, "the plot extra is not installed (no matplotlib): pip "
                                 "install 'swingcalc[plot]'")


def require_matplotlib():
    """The matplotlib module, or :class:`PlotExtraMissing`."""
    try:
        import matplotlib
    except ImportError:
        raise PlotExtraMissing() from None
    return matplotlib


@contextmanager
def style(rc=None):
    """matplotlib's own defaults, then ``rc`` (default :data:`RC`): a user's matplotlibrc
    changes nothing we draw. Shared with the spec sheet's vector table."""
    mpl = require_matplotlib()
    import matplotlib.style

    with matplotlib.style.context("default"), mpl.rc_context(RC if rc is None else rc):
        yield mpl


def _figure(width: float, height: float):
    """A Figure with an Agg canvas, no pyplot."""
    from matplotlib.backends.backend_agg import FigureCanvasAgg
    from matplotlib.figure import Figure

    fig = Figure(figsize=(width, height))
    FigureCanvasAgg(fig)
    return fig


def figure_bytes(fig, fmt: str) -> bytes:
    """The figure as PNG or SVG bytes, reproducibly (fixed metadata and SVG ids).

    Parameters
    ----------
    fig : matplotlib.figure.Figure
    fmt : {"png", "svg"}
    """
    import io

    word = str(fmt).strip().lower()
    if word not in FORMATS:
        raise InvalidInput("format", fmt, " or ".join(FORMATS),
                           f"unknown figure format{suggest(word, FORMATS)}")
    buf = io.BytesIO()
    with style():
        fig.savefig(buf, format=word, metadata=_METADATA[word])
    return buf.getvalue()


def _title(ax_or_fig, name: str, revision: str, what: str) -> None:
    head = name or "design"
    if revision:
        head = f"{head}, rev. {revision}"
    ax_or_fig.suptitle(f"{head}\n{what}", fontsize=10.5)


def _deg(x):
    return np.degrees(np.asarray(x, dtype=float))


def _footer(fig, lines, size: float = 6.8) -> int:
    """Wrapped footer text at the bottom of the figure; returns the number of lines."""
    # characters per line: the figure's width over an average glyph (about 0.55 em)
    width = int(0.94 * fig.get_figwidth() * 72.0 / (0.55 * size))
    wrapped = []
    for line in lines:
        wrapped.extend(textwrap.wrap(line, width=width) or [""])
    if wrapped:
        fig.text(0.02, 0.01, "\n".join(wrapped), fontsize=size, va="bottom", ha="left",
                 color="#333333", gid="footer", linespacing=1.25)
    return len(wrapped)


# --------------------------------------------------------------------------- period

def period_figure(pendulum, amplitudes=(), *, low: float = 0.0,
                  high: float = math.radians(170.0), samples: int = 341, band=None,
                  band_note: str = "", name: str = "", revision: str = ""):
    """Period against amplitude of ``pendulum`` (a CompoundPendulum).

    Parameters
    ----------
    pendulum : CompoundPendulum
    amplitudes : sequence of float
        Working amplitudes [rad] to mark.
    low, high : float
        Amplitude range [rad], 0 <= low < high < pi.
    samples : int
        Amplitudes on the curves (2 to 20001).
    band : swingcalc.tolerance.Band, optional
        The RSS band of the small-angle period T0 [s]; drawn as T/T0 times its half-width
        (the exact T/T0 depends on the amplitude only, so the band scales with it).
    band_note : str
        What the band covers, for the footer.
    name, revision : str
        For the title.

    Notes
    -----
    Exact: T = T0 (2/pi) K(m), m = sin^2(A/2) (:func:`swingcalc.swing.period_ratio`);
    small-angle: T0; series: T0 (1 + A^2/16) and T0 (1 + A^2/16 + 11 A^4/3072)
    (:func:`swingcalc.linear.series_period_ratio`).
    """
    from .swing import period_ratio

    lo, hi = _range(low, high)
    n = _count(samples, "samples", 2, 20001)
    amps = _amplitudes(amplitudes)
    t0 = pendulum.small_angle_period_s
    zoom = amps.size > 0 and 0.0 < float(amps.max()) < math.radians(25.0) and hi > 0.5
    with style():
        fig = _figure(12.0 if zoom else 8.0, 5.8)
        ax = fig.add_subplot(1, 2, 1) if zoom else fig.add_subplot(1, 1, 1)
        _period_axes(ax, np.linspace(lo, hi, n), t0, band, amps, "")
        if zoom:
            top = min(1.6 * float(amps.max()), hi)
            zx = fig.add_subplot(1, 2, 2)
            _period_axes(zx, np.linspace(0.0, top, 201), t0, band, amps, "close-")
            zx.set_title("close-up of the working amplitudes", fontsize=9)
        if amps.size:
            listed = "; ".join(f"{math.degrees(a):.4g}°: {t0 * float(period_ratio(a)):.7g} s"
                               for a in amps)
            (zx if zoom else ax).text(
                0.98, 0.03, f"working amplitudes, T:\n{listed}", transform=(
                    zx if zoom else ax).transAxes, ha="right", va="bottom", fontsize=7.5,
                color=_WORK, wrap=True,
                bbox={"boxstyle": "round,pad=0.3", "fc": "white", "ec": _WORK, "lw": 0.6})
        _title(fig, name, revision, "Period against amplitude")
        notes = [("Conservative swing (no friction or drag); T0 = 2π √(I/M) with the air's "
                  "buoyancy and added mass where the design has air.")]
        if band_note:
            notes.append(band_note)
        lines = _footer(fig, notes)
        fig.subplots_adjust(left=0.08 if zoom else 0.1, right=0.93 if zoom else 0.9,
                            top=0.88, bottom=0.1 + 0.022 * lines, wspace=0.35)
    return fig


def _period_axes(ax, a, t0, band, amps, gid: str) -> None:
    """Exact, small-angle and series periods over the amplitudes ``a`` [rad] on ``ax``."""
    from .linear import series_period_ratio
    from .swing import period_ratio

    ratio = np.asarray(period_ratio(a), dtype=float)
    x = _deg(a)
    if band is not None and band.rss > 0.0:
        half = ratio * band.rss
        ax.fill_between(x, t0 * ratio - half, t0 * ratio + half, color=_BAND, alpha=0.6,
                        lw=0, label=f"tolerance band, RSS (T0 ± {band.rss:.3g} s)",
                        gid=f"{gid}tolerance-band")
    ax.plot(x, t0 * ratio, color=_INK, lw=2.0, label="exact: T0 (2/π) K(m)", gid=f"{gid}exact")
    ax.plot(x, np.full_like(x, t0), color=_GREY, lw=1.2, ls="--",
            label=f"small-angle: T0 = {t0:.6g} s", gid=f"{gid}small-angle")
    ax.plot(x, t0 * series_period_ratio(a, 2), color=_RUST, lw=1.2, ls="-.",
            label="series, 2 terms: T0 (1 + A²/16)", gid=f"{gid}series-2")
    ax.plot(x, t0 * series_period_ratio(a, 3), color=_MOSS, lw=1.2, ls=":",
            label="series, 3 terms: + 11 A⁴/3072", gid=f"{gid}series-3")
    if amps.size:
        ax.plot(_deg(amps), t0 * np.asarray(period_ratio(amps), dtype=float), ls="none",
                marker="D", ms=6, mfc="white", mec=_WORK, mew=1.6, label="working amplitudes",
                gid=f"{gid}working", zorder=5)
    from matplotlib.ticker import ScalarFormatter

    ax.set_xlim(x[0], x[-1])
    ax.set_xlabel("amplitude A [deg]")
    ax.set_ylabel("period T [s]")
    ax.yaxis.set_major_formatter(ScalarFormatter(useOffset=False))
    sec = ax.secondary_yaxis("right", functions=(lambda t: t / t0, lambda r: r * t0))
    sec.yaxis.set_major_formatter(ScalarFormatter(useOffset=False))
    sec.set_ylabel("T / T0 [-]")
    ax.legend(loc="upper left")


# --------------------------------------------------------------------------- phase

def phase_figure(pendulum, amplitudes=(), *, name: str = "", revision: str = "",
                 samples: int = 721):
    """Phase portrait of ``pendulum``: angle against angular velocity.

    Parameters
    ----------
    pendulum : CompoundPendulum
    amplitudes : sequence of float
        Working amplitudes [rad] (libration, < pi): their orbits are highlighted.
    samples : int
        Points per curve.

    Notes
    -----
    With w0 = sqrt(M/I): libration orbits of amplitude A, exactly, by
    sin(theta/2) = k sin(phi), k = sin(A/2): omega = 2 w0 k cos(phi); rotation orbits
    omega = +-2 w0 sqrt(h - sin^2(theta/2)), h > 1; the separatrix (h = 1)
    omega = +-2 w0 cos(theta/2). For a flexible suspension the slack region is where
    the payload-end tension of :mod:`swingcalc.loads` is negative; its boundary is
    solved from that tension, and the slack point of each working orbit is the loads'
    ``slack_angle_rad``.
    """
    from .loads import swing_loads

    n = _count(samples, "samples", 21, 20001)
    amps = _amplitudes(amplitudes)
    w0 = pendulum.natural_angular_frequency_rad_s
    theta = np.linspace(-math.pi, math.pi, n)
    flexible = pendulum.body.suspension.flexible
    zoom = amps.size > 0 and 0.0 < float(amps.max()) < math.radians(25.0)
    with style():
        fig = _figure(11.0 if zoom else 8.4, 6.6)
        ax = fig.add_subplot(1, 2, 1) if zoom else fig.add_subplot(1, 1, 1)
        x = _deg(theta)
        if flexible:
            _slack_region(ax, pendulum, n)
        for h in (1.12, 1.5, 2.2):
            w = 2.0 * w0 * np.sqrt(h - np.sin(0.5 * theta) ** 2)
            for sign, tag in ((1, "upper"), (-1, "lower")):
                ax.plot(x, sign * w, color=_MOSS, lw=0.9, gid=f"rotation-{h:g}-{tag}",
                        label="rotation orbits (over the top)" if (h, sign) == (1.12, 1)
                        else None)
        for i, a in enumerate(np.radians([30.0, 60.0, 90.0, 120.0, 150.0])):
            th, w = _libration(a, w0, n)
            ax.plot(_deg(th), w, color=_RUST, lw=0.9, gid=f"libration-{math.degrees(a):g}",
                    label="libration orbits" if i == 0 else None)
        sep = 2.0 * w0 * np.cos(0.5 * theta)
        ax.plot(x, sep, color=_INK, lw=1.8, label="separatrix: ω = ±2 ω0 cos(θ/2)",
                gid="separatrix-upper")
        ax.plot(x, -sep, color=_INK, lw=1.8, gid="separatrix-lower")
        _working(ax, pendulum, amps, w0, n, swing_loads)
        ax.plot([0.0], [0.0], ls="none", marker="o", ms=7, color=_INK,
                label="stable equilibrium (hanging)", gid="stable", zorder=6)
        ax.plot([-180.0, 180.0], [0.0, 0.0], ls="none", marker="o", ms=7, mfc="white",
                mec=_INK, mew=1.6, label="unstable equilibrium (inverted)", gid="unstable",
                zorder=6, clip_on=False)
        ax.set_xlim(-180.0, 180.0)
        ax.set_xticks(np.arange(-180, 181, 45))
        ax.set_ylim(-3.3 * w0, 3.3 * w0)
        ax.set_xlabel("angle θ from hanging [deg]")
        ax.set_ylabel("angular velocity ω [rad/s]")
        sec = ax.secondary_yaxis("right", functions=(lambda w: w / w0, lambda r: r * w0))
        sec.set_ylabel("ω / ω0 [-]")
        ax.legend(loc="upper center", bbox_to_anchor=(0.5, -0.12), ncol=2, fontsize=7.0)
        if zoom:
            zx = fig.add_subplot(1, 2, 2)
            _working(zx, pendulum, amps, w0, n, swing_loads, close_up=True)
            zx.plot([0.0], [0.0], ls="none", marker="o", ms=6, color=_INK)
            zx.set_xlabel("angle θ from hanging [deg]")
            zx.set_ylabel("angular velocity ω [rad/s]")
            zx.set_title("close-up of the working orbits", fontsize=9)
            zx.legend(loc="upper right", fontsize=7.0)
        _title(fig, name, revision, f"Phase portrait (ω0 = {w0:.6g} rad/s)")
        notes = [("Conservative swing: orbits are exact energy contours; damping would make "
                  "them spiral in toward the hanging position.")]
        if flexible:
            notes.append("Shaded: the flexible suspension would be in compression (it goes "
                         "slack and the payload falls freely); no state inside it holds.")
        lines = _footer(fig, notes)
        fig.subplots_adjust(left=0.08, right=0.92, top=0.88, bottom=0.26 + 0.02 * lines,
                            wspace=0.35)
    return fig


def _libration(a: float, w0: float, n: int):
    """(theta, omega) around the closed libration orbit of amplitude ``a`` [rad]."""
    k = math.sin(0.5 * a)
    phi = np.linspace(0.0, 2.0 * math.pi, n)
    th = 2.0 * np.arcsin(np.clip(k * np.sin(phi), -1.0, 1.0))
    return th, 2.0 * w0 * k * np.cos(phi)


def _working(ax, pendulum, amps, w0, n, swing_loads, close_up: bool = False) -> None:
    for i, a in enumerate(amps):
        th, w = _libration(float(a), w0, n)
        ax.plot(_deg(th), w, color=_WORK, lw=2.4 if i == 0 else 1.6, ls="-" if i == 0 else "--",
                label=f"working orbit, A = {math.degrees(a):.4g}°", gid=f"working-{i}",
                zorder=5)
        if pendulum.body.suspension.flexible and a > 0.5 * math.pi:
            slack = swing_loads(pendulum, float(a), samples=3).slack_angle_rad
            if slack is not None:
                ws = 2.0 * w0 * math.sqrt(max(math.sin(0.5 * a) ** 2
                                              - math.sin(0.5 * slack) ** 2, 0.0))
                ax.plot(_deg([slack, -slack]), [ws, -ws], ls="none", marker="X", ms=8,
                        color=_WORK, mec="black", mew=0.6, zorder=7, gid=f"slack-point-{i}",
                        label="suspension goes slack" if i == int(np.argmax(amps > 0.5 * math.pi))
                        else None)
    if close_up and amps.size:
        top = float(amps.max())
        ax.set_xlim(-1.15 * math.degrees(top), 1.15 * math.degrees(top))
        ax.set_ylim(-2.6 * w0 * math.sin(0.5 * top), 2.6 * w0 * math.sin(0.5 * top))


def _slack_region(ax, pendulum, n: int) -> None:
    """Shade the states where the payload-end tension is negative (from
    :mod:`swingcalc.loads`): for each angle the speed below which the suspension is slack,
    by root-finding on that tension (it grows with the speed)."""
    from scipy.optimize import brentq

    from .loads import _payload_tension

    def tension(th, w2):
        return float(_payload_tension(pendulum, np.array([th]), np.array([w2]))[0])

    w0sq = pendulum.natural_angular_frequency_rad_s ** 2
    th = np.linspace(0.5 * math.pi, math.pi, max(n // 4, 41))
    ws = np.zeros_like(th)
    for j, t in enumerate(th):
        if tension(t, 0.0) >= 0.0:
            continue
        top = w0sq
        while tension(t, top) <= 0.0:
            top *= 2.0
        ws[j] = math.sqrt(brentq(lambda w2, t=t: tension(t, w2), 0.0, top,
                                 xtol=1e-14 * top, rtol=1e-15))
    for side, tag in ((1.0, "right"), (-1.0, "left")):
        xs = side * _deg(th)
        ax.fill_between(xs, -ws, ws, color=_SLACK, alpha=0.75, lw=0, gid=f"slack-{tag}",
                        label="slack region (suspension tension < 0)" if side > 0 else None)
        ax.plot(xs, ws, color="#a0661a", lw=0.9, gid=f"slack-boundary-{tag}-upper")
        ax.plot(xs, -ws, color="#a0661a", lw=0.9, gid=f"slack-boundary-{tag}-lower")


# --------------------------------------------------------------------------- loads

def loads_figure(loads, *, context: str = "general", name: str = "", revision: str = ""):
    """Loads and felt accelerations through one swing (a :class:`SwingLoads`).

    Top: pivot reaction magnitude, arm tension (along the arm), the reaction across the
    arm, and for a flexible suspension the payload-end tension, with the weight for
    scale. Bottom: the felt acceleration (specific force) in g at each named point.
    Past a slack angle the rows do not hold: they are left out and the angles shaded.
    The footer carries the loads' warnings and the safety cautions for ``context``.
    """
    from .report.cautions import cautions_for

    x = _deg(loads.angle_rad)
    taut = np.asarray(loads.taut, dtype=bool)

    def held(v):
        return np.where(taut, np.asarray(v, dtype=float), np.nan)

    with style():
        fig = _figure(8.4, 8.6)
        top = fig.add_subplot(2, 1, 1)
        bottom = fig.add_subplot(2, 1, 2, sharex=top)
        top.plot(x, held(loads.reaction_N), color=_INK, lw=2.0, label="pivot reaction |R|",
                 gid="reaction")
        top.plot(x, held(loads.arm_tension_N), color=_RUST, lw=1.4,
                 label="along the arm (tension +)", gid="arm-tension")
        top.plot(x, held(loads.reaction_tangential_N), color=_MOSS, lw=1.2, ls="-.",
                 label="across the arm", gid="reaction-across")
        if loads.payload_tension_N is not None:
            top.plot(x, held(loads.payload_tension_N), color=_PLUM, lw=1.4, ls="--",
                     label="suspension tension at the payload", gid="payload-tension")
        top.plot(x, np.full_like(x, loads.weight_N), color=_GREY, lw=1.0, ls=":",
                 label=f"weight {loads.weight_N:.5g} N", gid="weight")
        top.axhline(0.0, color="black", lw=0.6)
        top.set_ylabel("force on the body at the pivot [N]")
        top.legend(loc="best")
        colours = (_INK, _RUST, _MOSS, _PLUM, _WORK)
        for i, p in enumerate(loads.points):
            c = colours[i % len(colours)]
            bottom.plot(x, held(p.felt_g), color=c, lw=1.8, label=f"{p.name}: magnitude",
                        gid=f"felt-{i}")
            bottom.plot(x, held(p.felt_normal_g), color=c, lw=1.0, ls="--",
                        label=f"{p.name}: toward the pivot", gid=f"felt-normal-{i}")
        bottom.axhline(1.0, color=_GREY, lw=0.8, ls=":")
        bottom.axhline(0.0, color="black", lw=0.6)
        bottom.set_ylabel("felt acceleration [g]")
        bottom.set_xlabel("angle θ from hanging [deg]")
        if loads.points:
            bottom.legend(loc="best")
        if loads.slack_angle_rad is not None:
            s = math.degrees(loads.slack_angle_rad)
            for ax in (top, bottom):
                for lo, hi in ((x[0], -s), (s, x[-1])):
                    ax.axvspan(lo, hi, color=_SLACK, alpha=0.6, lw=0, gid="slack-angles")
            bottom.text(0.5, 0.03, f"shaded: suspension slack beyond ±{s:.4g}°, loads do not "
                        "hold", transform=bottom.transAxes, ha="center", va="bottom",
                        fontsize=7.5, bbox={"fc": "white", "ec": "none", "alpha": 0.85})
        if x[0] < x[-1]:
            top.set_xlim(x[0], x[-1])
        _title(fig, name, revision,
               f"Loads through the swing at A = {math.degrees(loads.amplitude_rad):.4g}°")
        notes = list(loads.warnings) + ["Caution: " + c for c in cautions_for(context, True)]
        lines = _footer(fig, notes)
        fig.subplots_adjust(left=0.11, right=0.96, top=0.91, bottom=0.07 + 0.0135 * lines,
                            hspace=0.12)
        top.tick_params(labelbottom=False)
    return fig


# --------------------------------------------------------------------------- decay

def decay_figure(result, *, name: str = "", revision: str = ""):
    """Amplitude at each turning point of a simulated swing (a :class:`SimulationResult`),
    each side of the swing apart, against time, with the cycle count on the top axis.

    Notes
    -----
    The turning points are the run's ``cycles.turning_time_s`` / ``turning_angle_rad``
    (located on the integrator's dense output); the start is the first point.
    """
    t = np.asarray(result.cycles.turning_time_s, dtype=float)
    th = np.asarray(result.cycles.turning_angle_rad, dtype=float)
    s = result.summary
    t0 = result.model.small_angle_period
    if s.initial_amplitude_rad is not None and result.history.time_s.size:
        t = np.concatenate(([float(result.history.time_s[0])], t))
        th = np.concatenate(([float(result.history.angle_rad[0])], th))
    pos, neg = th > 0, th < 0
    marks = t.size <= 600
    with style():
        fig = _figure(8.4, 5.4)
        ax = fig.add_subplot(1, 1, 1)
        ax.plot(t[pos], _deg(th[pos]), color=_INK, lw=1.2, marker="^" if marks else None,
                ms=3.5, label="turning points on the + side", gid="positive-side")
        ax.plot(t[neg], _deg(-th[neg]), color=_RUST, lw=1.2, ls="--",
                marker="v" if marks else None, ms=3.5, label="turning points on the − side",
                gid="negative-side")
        ax.set_xlabel("time t [s]")
        ax.set_ylabel("amplitude |θ| at the turning point [deg]")
        top = float(np.max(np.abs(_deg(th)))) if th.size else 0.0
        low = float(np.min(np.abs(_deg(th)))) if th.size else 0.0
        if top > 0 and low > 0.9 * top:
            # a light decay (a clock: Q ~ 1e4): zoom on it instead of a flat line at the top
            pad = max(0.1 * (top - low), 1e-6 * top)
            ax.set_ylim(low - pad, top + pad)
        else:
            ax.set_ylim(0.0, 1.1 * top if top > 0 else 1.0)
        if t.size:
            ax.set_xlim(0.0, max(float(t[-1]), 1e-9))
        sec = ax.secondary_xaxis("top", functions=(lambda x: x / t0, lambda c: c * t0))
        sec.set_xlabel(f"time in small-angle periods t / T0 [-] (T0 = {t0:.6g} s)")
        ax.legend(loc="best")
        _title(fig, name, revision, f"Amplitude decay over {s.cycles} cycles")
        facts = [f"status: {result.status}"]
        if s.q_last is not None:
            facts.append(f"Q (last cycle) {s.q_last:.4g}")
        if s.decay_time_s is not None:
            facts.append(f"to {100 * s.decay_fraction:.3g} % of the start: {s.decay_time_s:.4g} s")
        if s.at_rest and s.rest_time_s is not None:
            facts.append(f"at rest (held by friction) at {s.rest_time_s:.4g} s")
        notes = ["; ".join(facts) + "."] + list(result.warnings)
        lines = _footer(fig, notes)
        fig.subplots_adjust(left=0.1, right=0.96, top=0.8, bottom=0.11 + 0.022 * lines)
    return fig


# --------------------------------------------------------------------------- designs

def design_figure(kind: str, design, *, low: float | None = None, high: float | None = None,
                  amplitude: float | None = None, cycles: int = 100, samples: int | None = None):
    """The figure ``kind`` (one of :data:`KINDS`) of a design file's ``design``.

    Parameters
    ----------
    kind : str
    design : swingcalc.designfile.Design
    low, high : float, optional
        Amplitude range of the period plot [rad] (default 0 to 170 deg).
    amplitude : float, optional
        Loads: the amplitude [rad] (default the design's largest); decay: the start
        amplitude (default the design's first).
    cycles : int
        Decay: complete cycles to simulate.
    samples : int, optional
        Points on the curves (period, phase) or angles (loads).
    """
    word = str(kind).strip().lower()
    if word not in KINDS:
        raise InvalidInput("KIND", kind, ", ".join(KINDS), f"unknown plot{suggest(word, KINDS)}")
    require_matplotlib()
    label = {"name": design.name, "revision": design.revision}
    amps = design.amplitudes_rad
    if word == "period":
        band, note = _period_band(design)
        lo = 0.0 if low is None else low
        hi = math.radians(170.0) if high is None else high
        n = samples or max(2, min(20001, round(math.degrees(hi - lo) * 2) + 1))
        return period_figure(design.pendulum, amps, low=lo, high=hi, samples=n, band=band,
                             band_note=note, **label)
    if word == "phase":
        return phase_figure(design.pendulum, amps, samples=samples or 721, **label)
    if word == "loads":
        from .loads import swing_loads

        a = max(amps) if amplitude is None else amplitude
        points = design.points_dict()
        if not points:
            b = design.body
            points = {"centre of mass": (b.com_along_m, b.com_across_m)}
        loads = swing_loads(design.pendulum, a, points, samples=samples or 361)
        return loads_figure(loads, context=design.context, **label)
    from .simulate import SwingModel, simulate

    model = SwingModel.from_pendulum(design.pendulum, design.pivot, name=design.name)
    a = amps[0] if amplitude is None else amplitude
    res = simulate(model, a, cycles=cycles)
    return decay_figure(res, **label)


def _period_band(design):
    """(Band of the small-angle period or None, footer note): the RSS band over the
    design's tolerances except the amplitude's (the amplitude is the x axis)."""
    tols = tuple(t for t in design.tolerances if not t.path.startswith("swing.amplitude"))
    if not tols:
        return None, ""
    from .tolerance import linear_bands

    bands = linear_bands(design, lambda d: {"T0": d.pendulum.small_angle_period_s}, tols)
    band = bands.get("T0")
    if band is None:
        return None, ""
    paths = ", ".join(p for p, _ in band.contributions)
    return band, (f"Tolerance band: root-sum-square of the period changes at ± each "
                  f"tolerance ({paths}); the amplitude's tolerance is not in it (the "
                  "amplitude is the x axis).")


# --------------------------------------------------------------------------- checks

def _range(low, high):
    lo = float(low)
    hi = float(high)
    if not (math.isfinite(lo) and math.isfinite(hi) and 0.0 <= lo < hi < math.pi):
        raise InvalidInput("amplitude range", (low, high),
                           "0 <= from < to < 180 deg", "out of range")
    return lo, hi


def _count(n, field, low, high) -> int:
    if isinstance(n, bool) or not isinstance(n, (int, np.integer)) or not low <= n <= high:
        raise InvalidInput(field, n, f"a whole number in [{low}, {high}]")
    return int(n)


def _amplitudes(values) -> np.ndarray:
    a = np.asarray(tuple(values), dtype=float).reshape(-1)
    if a.size and not (np.all(np.isfinite(a)) and np.all(a >= 0) and np.all(a < math.pi)):
        raise InvalidInput("amplitudes", tuple(values), "libration amplitudes in [0, pi) rad")
    return a
