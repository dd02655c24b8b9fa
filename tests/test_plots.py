"""Plots: every kind renders headless on every bundled design, PNG and SVG are valid and
byte-identical from run to run, and the plotted data are right against outside
references, read back from the figure's Line2D objects (by their ``gid``).

Sources of the expectations:
- [calc] mpmath at 30-60 digits (tests/helpers.mp_period_ratio: (2/pi) K(sin^2(A/2)),
  A&S 17.2 / DLMF 19.2.8) and its Taylor series of the same function.
- Textbook pendulum mechanics (e.g. Young & Freedman, *University Physics*, 14th ed.,
  ch. 5 circular motion, ch. 7 energy, ch. 14 the simple pendulum and damped
  oscillations), [mem]: T0 = 2 pi sqrt(L/g); the energy per unit inertia
  omega^2/2 - w0^2 cos(theta) is conserved, the separatrix is the energy of the inverted
  position (omega = 2 w0 cos(theta/2): 2 w0 at the bottom, 0 at the top); a point mass on
  a string has tension m (g cos(theta) + v^2/L) with v^2 = 2 g L (cos(theta) - cos(A)),
  so it goes slack at 3 cos(theta) = 2 cos(A) (A = 120 deg: cos(theta) = -1/3) and at the
  bottom carries m g (3 - 2 cos A); a viscously damped linear oscillator turns at
  t_n = n pi / w_d with |theta_n| = A exp(-zeta w0 t_n).
- PNG signature: the PNG specification (ISO/IEC 15948), the 8 bytes 89 50 4E 47 0D 0A 1A 0A.
- PRODUCT.md "Interface conventions" and "Safety cautions" for the CLI and the footer.
"""

from __future__ import annotations

import glob
import math
import os
import sys
import xml.etree.ElementTree as ET
from pathlib import Path

import mpmath
import numpy as np
import pytest
from helpers import mp_period_ratio

mpl = pytest.importorskip("matplotlib", reason="the plot extra (matplotlib) is not installed")

from cli_run import assert_bad, run, run_ok

from swingcalc import plots
from swingcalc.constants import STANDARD_GRAVITY as G
from swingcalc.designfile import load_design, point_design
from swingcalc.simulate import SwingModel, simulate

EXAMPLES = sorted(glob.glob(os.path.join(os.path.dirname(plots.__file__), "examples",
                                         "*.toml")))
PNG_SIGNATURE = b"\x89PNG\r\n\x1a\n"


def _line(fig, gid):
    found = [ln for ax in fig.axes for ln in ax.lines if ln.get_gid() == gid]
    assert found, f"no line {gid!r}"
    return found[0]


def _xy(fig, gid):
    ln = _line(fig, gid)
    return np.asarray(ln.get_xdata(), float), np.asarray(ln.get_ydata(), float)


def _gids(fig) -> set:
    out = set()
    for ax in fig.axes:
        out |= {a.get_gid() for a in (*ax.lines, *ax.collections, *ax.patches)}
    return out


def _valid(data: bytes, fmt: str) -> None:
    assert len(data) > 1000
    if fmt == "png":
        assert data.startswith(PNG_SIGNATURE)
    else:
        root = ET.fromstring(data)          # parses as XML
        assert root.tag.endswith("svg")


def _point(length, amplitude_deg, suspension="rigid", mass=2.0):
    """A point bob in a vacuum at standard gravity (textbook simple pendulum)."""
    return point_design(length, mass, suspension, amplitudes=(math.radians(amplitude_deg),),
                        name="test bob")


# --------------------------------------------------------------------- rendering

@pytest.mark.slow
@pytest.mark.parametrize("path", EXAMPLES, ids=[os.path.basename(p) for p in EXAMPLES])
@pytest.mark.parametrize("kind", plots.KINDS)
def test_every_kind_renders_on_every_bundled_design(path, kind):
    """Each kind on each bundled design: PNG and SVG, non-empty and valid (about 1-2 s
    a case on this machine, hence slow)."""
    fig = plots.design_figure(kind, load_design(path), cycles=20)
    for fmt in plots.FORMATS:
        _valid(plots.figure_bytes(fig, fmt), fmt)


@pytest.mark.parametrize("kind, name", [("period", "long_case_clock"),
                                        ("phase", "garden_swing_seat"),
                                        ("loads", "playground_seat"), ("decay", "gate_arm")])
def test_each_kind_renders_png_and_svg(kind, name):
    """The quick part of the matrix: one design per kind (the ones with the most on them:
    a close-up panel, a slack region, two named points, friction stopping the swing)."""
    d = load_design(os.path.join(os.path.dirname(plots.__file__), "examples", f"{name}.toml"))
    fig = plots.design_figure(kind, d, cycles=10)
    for fmt in plots.FORMATS:
        _valid(plots.figure_bytes(fig, fmt), fmt)


@pytest.mark.parametrize("fmt", plots.FORMATS)
def test_same_input_gives_byte_identical_files(fmt):
    """Reproducible output (PITFALLS.md, matplotlib): two figures built from the same
    design render to the same bytes, and carry no date or software string."""
    d = _point(1.5, 100.0, "flexible")
    first = plots.figure_bytes(plots.design_figure("phase", d), fmt)
    second = plots.figure_bytes(plots.design_figure("phase", d), fmt)
    assert first == second
    if fmt == "svg":
        assert b"<dc:date>" not in first and mpl.__version__.encode() not in first
    else:
        assert b"Software" not in first


# --------------------------------------------------------------------- period

def test_period_curve_is_the_elliptic_period_against_mpmath():
    """[calc] The exact curve is T0 (2/pi) K(m), m = sin^2(A/2), with T0 = 2 pi sqrt(L/g)
    (textbook) for a point bob in a vacuum, checked at 30-60 digits at several plotted
    amplitudes. Tolerance 1e-13: PRODUCT.md asks 1e-14 of the ratio; the plotted x is in
    degrees, and converting it back moves A by an ulp, which d ln T/dA (at most about 12
    per rad at 170 deg) amplifies to a few 1e-15."""
    L = 0.994
    fig = plots.design_figure("period", _point(L, 20.0))
    x, y = _xy(fig, "exact")
    _, t0_line = _xy(fig, "small-angle")
    t0 = 2.0 * math.pi * math.sqrt(L / G)
    assert np.allclose(t0_line, t0, rtol=1e-14, atol=0)   # a few ulps of sqrt and products
    assert x[0] == 0.0 and x[-1] == pytest.approx(170.0, abs=1e-12)
    for want in (10.0, 60.0, 120.0, 170.0):
        i = int(np.argmin(abs(x - want)))
        with mpmath.workdps(30):
            ref = mpmath.mpf(t0) * mp_period_ratio(math.radians(x[i]), dps=30)
            assert float(abs(mpmath.mpf(y[i]) - ref) / ref) < 1e-13, want


def test_series_curves_match_the_taylor_series_of_the_period():
    """[calc] The 2- and 3-term curves equal T0 times the Taylor polynomial of
    (2/pi) K(sin^2(A/2)) at A = 0 computed by mpmath (1 + A^2/16 + 11 A^4/3072; OEIS
    A223067/A223068 [mem]). Tolerance 1e-14: a polynomial of two or three terms in floats."""
    fig = plots.design_figure("period", _point(1.0, 30.0))
    with mpmath.workdps(30):
        c = mpmath.taylor(lambda a: 2 / mpmath.pi * mpmath.ellipk(mpmath.sin(a / 2) ** 2),
                          0, 4)
    assert float(c[2]) == pytest.approx(1 / 16, rel=1e-25) and float(c[4]) == pytest.approx(
        11 / 3072, rel=1e-25)
    _, t0 = _xy(fig, "small-angle")
    for gid, terms in (("series-2", 3), ("series-3", 5)):
        x, y = _xy(fig, gid)
        a = np.radians(x)
        want = t0 * sum(float(c[k]) * a ** k for k in range(terms))
        assert np.allclose(y, want, rtol=1e-14, atol=0), gid


def test_period_marks_the_working_amplitudes_and_a_close_up_when_they_are_small():
    """The working amplitudes are marked on the exact curve (at T0 (2/pi) K(m), [calc]);
    a small working arc (a clock's 2 deg) gets a close-up panel. Tolerance as above."""
    d = _point(1.0, 2.0)
    fig = plots.design_figure("period", d)
    x, y = _xy(fig, "working")
    assert x == pytest.approx([2.0], rel=1e-15)
    ref = 2 * math.pi * math.sqrt(1.0 / G) * float(mp_period_ratio(math.radians(2.0)))
    assert y[0] == pytest.approx(ref, rel=1e-13)
    xc, _ = _xy(fig, "close-exact")
    assert xc[-1] == pytest.approx(3.2)      # 1.6 times the largest working amplitude
    assert "close-" not in " ".join(g or "" for g in _gids(plots.design_figure(
        "period", _point(1.0, 40.0))))


def test_period_has_no_band_without_tolerances():
    """A design without [tolerances] (the bundled garden swing) draws no band."""
    d = load_design(os.path.join(os.path.dirname(plots.__file__), "examples",
                                 "garden_swing_seat.toml"))
    assert "tolerance-band" not in _gids(plots.design_figure("period", d))


def test_period_band_is_the_first_order_band_of_the_period_without_the_amplitude():
    """Textbook first-order error propagation (GUM, ISO/IEC Guide 98-3, root-sum-square
    of independent contributions): T0 = 2 pi sqrt(L/g) gives dT0 = (T0/2)(dL/L) and
    -(T0/2)(dg/g); the band at amplitude A is T/T0 = (2/pi) K(m) ([calc], mpmath) times
    that, since T/T0 depends on A only. The amplitude's own tolerance is left out (it is
    the x axis). Tolerance 1e-5: the bands come from central differences, whose relative
    error is about (t/x)^2 / 8 < 1e-6 here."""
    from swingcalc.designfile import parse_design

    text = """
name = "banded bob"
revision = "1"
[pendulum]
length = "1.0 m"
bob_mass = "1 kg"
suspension = "rigid"
[swing]
amplitude = ["40 deg"]
[tolerances]
"pendulum.length" = "2 mm"
"environment.gravity" = "0.01 m/s^2"
"swing.amplitude" = "5 deg"
"""
    d = parse_design(text, "band test")
    fig = plots.design_figure("period", d)
    t0 = 2 * math.pi * math.sqrt(1.0 / G)
    rss = math.hypot(0.5 * t0 * 0.002 / 1.0, 0.5 * t0 * 0.01 / G)
    band = [c for ax in fig.axes for c in ax.collections if c.get_gid() == "tolerance-band"]
    assert len(band) == 1
    v = band[0].get_paths()[0].vertices
    for want in (0.0, 90.0, 160.0):
        ys = np.sort(v[np.isclose(v[:, 0], want, rtol=0, atol=1e-9), 1])
        assert ys.size >= 2
        r = float(mp_period_ratio(math.radians(want)))
        assert (ys[-1] - ys[0]) / 2 == pytest.approx(r * rss, rel=1e-5), want
        assert (ys[-1] + ys[0]) / 2 == pytest.approx(r * t0, rel=1e-13), want
    footer = " ".join(t.get_text() for t in fig.texts)
    assert "pendulum.length" in footer and "environment.gravity" in footer
    assert "(swing.amplitude" not in footer and ", swing.amplitude" not in footer


# --------------------------------------------------------------------- phase

def test_separatrix_passes_through_the_inverted_energy_points():
    """Textbook: the separatrix is the energy of the inverted position,
    omega = 2 w0 cos(theta/2), w0 = sqrt(g/L) for a point bob: (0, 2 w0) and (+-pi, 0);
    every plotted point has the energy w0^2 per unit inertia. Tolerance: a few ulps of
    w0^2 (cos and squares in floats), 1e-14 relative; at +-pi, cos(pi/2) in floats is
    6e-17, not 0."""
    L = 2.0
    w0 = math.sqrt(G / L)
    fig = plots.design_figure("phase", _point(L, 30.0))
    for gid, sign in (("separatrix-upper", 1), ("separatrix-lower", -1)):
        x, y = _xy(fig, gid)
        th = np.radians(x)
        mid = int(np.argmin(abs(x)))
        assert x[mid] == 0.0 and y[mid] == pytest.approx(sign * 2 * w0, rel=1e-15)
        assert x[0] == -180.0 and x[-1] == 180.0
        assert abs(y[0]) < 1e-15 * w0 and abs(y[-1]) < 1e-15 * w0
        energy = 0.5 * y ** 2 - w0 ** 2 * np.cos(th)
        assert np.allclose(energy, w0 ** 2, rtol=0, atol=1e-14 * w0 ** 2)
    assert _xy(fig, "stable")[0] == pytest.approx([0.0])
    assert list(_xy(fig, "unstable")[0]) == [-180.0, 180.0]


def test_working_orbit_is_the_energy_contour_of_its_amplitude():
    """Textbook energy conservation: on the orbit of amplitude A, omega^2/2 - w0^2 cos(theta)
    = -w0^2 cos(A); it reaches |theta| = A and the bottom speed 2 w0 sin(A/2).
    Tolerance: 1e-13 w0^2 absolute (arcsin and cos of the plotted degrees, a few ulps)."""
    L, A = 1.2, 70.0
    w0 = math.sqrt(G / L)
    fig = plots.design_figure("phase", _point(L, A))
    x, y = _xy(fig, "working-0")
    th = np.radians(x)
    energy = 0.5 * y ** 2 - w0 ** 2 * np.cos(th)
    assert np.allclose(energy, -w0 ** 2 * math.cos(math.radians(A)), rtol=0,
                       atol=1e-13 * w0 ** 2)
    assert max(abs(x)) == pytest.approx(A, rel=1e-12)
    assert max(abs(y)) == pytest.approx(2 * w0 * math.sin(math.radians(A) / 2), rel=1e-12)
    # rotation orbits lie outside the separatrix, libration orbits inside (energy above /
    # below the inverted position's)
    for gid, above in (("rotation-1.12-upper", True), ("libration-120", False)):
        x, y = _xy(fig, gid)
        e = 0.5 * y ** 2 - w0 ** 2 * np.cos(np.radians(x))
        assert np.all(e > w0 ** 2) if above else np.all(e < w0 ** 2)


def test_slack_region_of_a_point_mass_on_a_chain():
    """Textbook circular motion: a point mass on a string swinging to A = 120 deg goes
    slack where 3 cos(theta) = 2 cos(A), cos(theta) = -1/3, and the slack boundary is
    omega^2 = -g cos(theta) / L (zero tension: v^2/L = -g cos theta). The slack point is a
    closed form (acos) and the boundary a root to 1e-14: tolerance 1e-12 relative."""
    L = 2.0
    fig = plots.design_figure("phase", _point(L, 120.0, "flexible"))
    x, y = _xy(fig, "slack-point-0")
    assert np.cos(np.radians(x)) == pytest.approx([-1 / 3, -1 / 3], rel=1e-12)
    w_slack = math.sqrt(G / (3 * L))           # -g cos(theta) / L at cos(theta) = -1/3
    assert abs(y) == pytest.approx([w_slack, w_slack], rel=1e-12)
    for tag in ("right-upper", "right-lower", "left-upper", "left-lower"):
        bx, by = _xy(fig, f"slack-boundary-{tag}")
        c = np.cos(np.radians(bx))
        assert np.all(abs(bx) >= 90.0) and abs(bx).max() == 180.0
        assert np.allclose(by ** 2, np.maximum(-G * c / L, 0.0), rtol=1e-12, atol=1e-14)
    assert "slack-right" in _gids(fig)
    rigid = plots.design_figure("phase", _point(L, 120.0, "rigid"))
    assert not any(g and g.startswith("slack") for g in _gids(rigid))


# --------------------------------------------------------------------- loads

def test_loads_of_a_point_bob_and_the_cautions_in_the_footer():
    """Textbook: a point bob of mass m on a light rod at A = 60 deg carries
    m g (3 - 2 cos A) = 2 m g at the bottom and m g cos A at the turning points; the bob
    feels 3 cos(theta) - 2 cos(A) g toward the pivot (2 g at the bottom). Tolerance 1e-13:
    a few float operations. PRODUCT.md: loads carry the cautions (a licensed engineer)."""
    m, A = 2.0, 60.0
    fig = plots.design_figure("loads", _point(1.0, A, mass=m))
    x, y = _xy(fig, "arm-tension")
    mid = int(np.argmin(abs(x)))
    assert x[mid] == 0.0 and y[mid] == pytest.approx(2 * m * G, rel=1e-13)
    assert y[0] == pytest.approx(m * G * math.cos(math.radians(A)), rel=1e-13)
    fx, fy = _xy(fig, "felt-normal-0")
    want = 3 * np.cos(np.radians(fx)) - 2 * math.cos(math.radians(A))
    assert np.allclose(fy, want, rtol=1e-12, atol=1e-13)
    footer = " ".join(t.get_text() for t in fig.texts)
    assert "licensed engineer" in footer


def test_loads_past_the_slack_angle_are_left_out_and_rides_name_their_standards():
    """The bundled garden swing at 100 deg goes slack (its file says so): no load is drawn
    past the slack angle (the taut model does not hold there). Its context is a ride:
    the footer names EN 1176 and ASTM F2291 (PRODUCT.md "Safety cautions")."""
    d = load_design(os.path.join(os.path.dirname(plots.__file__), "examples",
                                 "garden_swing_seat.toml"))
    fig = plots.design_figure("loads", d)
    x, y = _xy(fig, "payload-tension")
    # point bob: slack at cos(theta) = 2 cos(A) / 3 (textbook, as above)
    s = math.degrees(math.acos(2 * math.cos(math.radians(100.0)) / 3))
    assert np.all(np.isnan(y[abs(x) > s + 1e-9])) and np.all(np.isfinite(y[abs(x) < s]))
    assert "slack-angles" in _gids(fig)
    footer = " ".join(t.get_text() for t in fig.texts)
    assert "EN 1176" in footer and "ASTM F2291" in footer


# --------------------------------------------------------------------- decay

def test_decay_points_follow_the_damped_linear_oscillator():
    """Textbook damped oscillator: with the linear restoring torque and viscous damping
    (zeta = 1/(2Q)), the turning points are at t_n = n pi / w_d with |theta_n| =
    A exp(-zeta w0 t_n), both sides. Tolerance 1e-8: the integrator runs at rtol 1e-12
    and PRODUCT.md promises measured periods within 1e-9; turning points are located on
    its interpolant."""
    q, a0 = 40.0, 0.05
    model = SwingModel.simple(1.0, linear=True).with_q(q)
    res = simulate(model, a0, cycles=8)
    fig = plots.decay_figure(res, name="damped check")
    w0 = model.small_angle_frequency
    zeta = 1 / (2 * q)
    wd = w0 * math.sqrt(1 - zeta ** 2)
    n_points = 0
    for gid in ("positive-side", "negative-side"):
        t, amp = _xy(fig, gid)
        n = np.round(t * wd / math.pi)
        assert np.allclose(t, n * math.pi / wd, rtol=1e-8, atol=1e-12)
        assert np.allclose(np.radians(amp), a0 * np.exp(-zeta * w0 * t), rtol=1e-8, atol=0)
        n_points += t.size
    assert n_points >= 16                      # 8 cycles: both sides each cycle
    assert _xy(fig, "positive-side")[0][0] == 0.0   # the start is the first point


# --------------------------------------------------------------------- errors

def test_library_refuses_an_unknown_kind_and_format():
    with pytest.raises(plots.InvalidInput, match="KIND"):
        plots.design_figure("phaze", _point(1.0, 10.0))
    fig = plots.design_figure("phase", _point(1.0, 10.0))
    with pytest.raises(plots.InvalidInput, match="format"):
        plots.figure_bytes(fig, "pdf")


def test_library_says_how_to_get_the_extra(monkeypatch):
    """Without matplotlib: one line that says to install the plot extra."""
    monkeypatch.setitem(sys.modules, "matplotlib", None)      # import matplotlib fails
    with pytest.raises(plots.PlotExtraMissing) as info:
        plots.design_figure("period", _point(1.0, 10.0))
    assert "pip install 'swingcalc[plot]'" in str(info.value)
    assert "\n" not in str(info.value)


# --------------------------------------------------------------------- CLI

def test_cli_writes_png_and_svg_byte_identically_and_never_clobbers(tmp_path):
    """PRODUCT.md: --output writes atomically and never overwrites without --force."""
    a, b, s = tmp_path / "a.png", tmp_path / "b.png", tmp_path / "c.svg"
    run_ok("plot", "period", "--to", "60", "-o", a)
    run_ok("plot", "period", "--to", "60", "-o", b)
    run_ok("plot", "period", "--to", "60", "-o", s)
    assert a.read_bytes().startswith(PNG_SIGNATURE) and a.read_bytes() == b.read_bytes()
    _valid(s.read_bytes(), "svg")
    before = a.read_bytes()
    assert_bad(["plot", "phase", "-o", a], "--output", "file exists")
    assert a.read_bytes() == before
    run_ok("plot", "phase", "-o", a, "--force")
    assert a.read_bytes() != before
    assert sorted(p.name for p in tmp_path.iterdir()) == ["a.png", "b.png", "c.svg"]


@pytest.mark.parametrize("args, words", [
    (["plot", "perod", "-o", "{d}/x.png"], ("KIND", "period")),
    (["plot", "period"], ("--output", "required")),
    (["plot", "period", "-o", "{d}/x.pdf"], ("--output", ".png or .svg")),
    (["plot", "period", "-o", "{d}/x.png", "--format", "jpg"], ("--format", "png or svg")),
    (["plot", "phase", "-o", "{d}/x.png", "--from", "10"], ("--from", "period plot only")),
    (["plot", "period", "-o", "{d}/x.png", "--from", "50", "--to", "20"], ("--to",)),
    (["plot", "period", "-o", "{d}/x.png", "--to", "190 deg"], ("--to", "180")),
    (["plot", "decay", "-o", "{d}/x.png", "--cycles", "0"], ("--cycles",)),
    (["plot", "loads", "-o", "{d}/x.png", "--amplitude", "200"], ("--amplitude",)),
    (["plot", "decay", "-o", "{d}/x.png", "--amplitude", "0"], ("--amplitude", "> 0")),
    (["plot", "period", "-o", "{d}/x.png", "--samples", "1"], ("--samples",)),
])
def test_cli_bad_input_is_one_line_and_writes_nothing(tmp_path, args, words):
    """PRODUCT.md: bad input exits 2 with one line on stderr, no traceback, nothing
    written."""
    assert_bad([a.format(d=tmp_path) for a in args], *words)
    assert list(tmp_path.iterdir()) == []


def test_cli_without_matplotlib_says_how_to_get_it(tmp_path, monkeypatch):
    """The plot extra missing: exit 2, one line naming the pip command, nothing written."""
    monkeypatch.setitem(sys.modules, "matplotlib", None)
    assert_bad(["plot", "period", "-o", tmp_path / "x.png"], "pip install 'swingcalc[plot]'")
    assert list(tmp_path.iterdir()) == []


def test_cli_help_lists_the_kinds():
    code, out, _ = run("plot", "--help")
    assert code == 0
    for kind in plots.KINDS:
        assert kind in out


def test_import_of_plots_does_not_load_matplotlib():
    """swingcalc.plots imports matplotlib inside its functions only (checked in a fresh
    interpreter: this one has loaded it already)."""
    import subprocess

    code = ("import sys, swingcalc.plots, swingcalc.cli.plot\n"
            "print('matplotlib' in sys.modules)")
    out = subprocess.run([sys.executable, "-c", code], check=False, capture_output=True,
                         text=True,
                         timeout=120, env=dict(os.environ, PYTHONPATH=str(
                             Path(plots.__file__).parents[1])))
    assert out.returncode == 0, out.stderr
    assert out.stdout.strip() == "False"


def test_a_format_that_contradicts_the_file_name_is_refused(tmp_path):
    out = tmp_path / "q.png"
    assert_bad(("plot", "period", "--format", "svg", "-o", out), "--format", "png")
    assert not out.exists()


def test_the_phase_portrait_names_its_own_sample_limit(tmp_path):
    out = tmp_path / "p.png"
    assert_bad(("plot", "phase", "--samples", "5", "-o", out), "--samples", "[21, 20001]")
    assert not out.exists()
