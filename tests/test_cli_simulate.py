"""The simulate command: every format, the cycles and history files, the averaged model,
and bad input as exit status 2 with one line on stderr."""

import csv
import io
import json
import math

import pytest


from cli_run import assert_bad, run_ok




BASE = ("simulate", "--length", "994 mm", "--q", "300", "--cycles", "6", "--amplitude", "5")


@pytest.mark.parametrize("fmt", ["table", "csv", "json", "markdown"])
def test_every_format_carries_summary_and_cautions(fmt):
    out, _ = run_ok(*BASE, "--format", fmt)
    if fmt == "json":
        d = json.loads(out)
        assert d["command"] == "simulate"
        assert d["summary"]["cycles"] == 6
        assert d["cautions"]
        assert len(d["tables"]["cycles"]) == 6
    else:
        assert "caution" in out.lower()


def test_json_q_matches_the_damping_given():
    """--q 300 at 5 deg: Q from the measured decrement is close to 300 (the pendulum's Q
    rises slightly with amplitude under viscous damping; 1 % covers 5 deg, common
    practice estimate)."""
    d = json.loads(run_ok(*BASE, "--format", "json")[0])
    assert d["summary"]["q_first"] == pytest.approx(300, rel=0.01)
    assert d["summary"]["energy_closure_rel"] <= 1e-8


def test_cycles_and_history_files(tmp_path):
    cyc = tmp_path / "cycles.csv"
    hist = tmp_path / "history.json"
    run_ok(*BASE, "--cycles-file", cyc, "--history-file", hist, "--format", "json")
    rows = [r for r in csv.reader(io.StringIO(cyc.read_text())) if r and not r[0].startswith("#")]
    assert rows[0][:3] == ["cycle", "start_time_s", "period_s"]
    assert len(rows) == 7
    h = json.loads(hist.read_text())
    t = h["tables"]["history"]
    assert t[0]["time_s"] == 0.0 and t[0]["angle_rad"] == pytest.approx(math.radians(5))
    # never overwritten without --force
    assert_bad((*BASE, "--cycles-file", cyc), "--cycles-file", "exists")
    run_ok(*BASE, "--cycles-file", cyc, "--force", "--format", "csv")


def test_push_and_averaged_model(tmp_path):
    cyc = tmp_path / "week.csv"
    out, _ = run_ok("simulate", "--length", "994 mm", "--q", "5000", "--amplitude", "3",
                    "--push-energy", "2e-6", "--duration", "1 day", "--averaged",
                    "--cycles-file", cyc, "--format", "json")
    d = json.loads(out)
    assert d["summary"]["assumptions_hold"] is True
    assert d["summary"]["cycles"] > 40000
    assert cyc.read_text().count("\n") == d["summary"]["cycles"] + 1


def test_friction_run_reports_rest():
    d = json.loads(run_ok("simulate", "--length", "1", "--amplitude", "10", "--pin-radius",
                          "5 mm", "--friction", "0.2", "--duration", "600",
                          "--format", "json")[0])
    assert d["summary"]["at_rest"] is True


def test_body_from_inertia_and_harmonic_torque():
    d = json.loads(run_ok("simulate", "--inertia", "0.5", "--com-distance", "0.4", "--mass",
                          "2", "--damping-ratio", "0.05", "--amplitude", "0", "--torque",
                          "0.01", "--torque-frequency", "0.2 Hz", "--duration", "60",
                          "--format", "json")[0])
    assert d["summary"]["duration_s"] == pytest.approx(60.0)
    assert any(k.startswith("supplied_torque") for k in d["summary"])


@pytest.mark.parametrize("args, words", [
    (("simulate", "--length", "-1", "--cycles", "3"), ("--length",)),
    (("simulate", "--cycles", "2.5"), ("--cycles",)),
    (("simulate", "--cycles", "3", "--q", "0.1"), ("--q",)),
    (("simulate", "--cycles", "3", "--q", "50", "--damping-ratio", "0.1"), ("--q",)),
    (("simulate", "--cycles", "3", "--friction", "0.1"), ("pin_radius",)),
    (("simulate", "--cycles", "3", "--torque", "1"), ("--torque-frequency",)),
    (("simulate", "--cycles", "3", "--pivot-motion", "diagonal"), ("--pivot-motion",)),
    (("simulate", "--cycles", "3", "--push-energy", "1 kg"), ("--push-energy", "not an energy")),
    (("simulate", "--cycles", "3", "--inertia", "1"), ("--com-distance",)),
    (("simulate", "--cycles", "3", "--format", "xml"), ("--format",)),
    (("simulate", "--cycles", "3", "--cycles-file", "x.pdf"), ("--cycles-file",)),
    (("simulate", "--cycles", "3", "--context", "boat"), ("--context",)),
    (("simulate", "--cycles", "3", "--amplitude", "200"), ("--amplitude",)),
    (("simulate", "x.toml", "--cycles", "3"), ("x.toml", "no such file")),
    (("simulate", "x.toml", "--length", "1", "--cycles", "3"), ("--length", "design file")),
])
def test_bad_input_is_one_line_exit_2(args, words):
    assert_bad(args, *words)


def test_design_file_runs_with_its_context_amplitude_and_target():
    """The bundled playground seat: its context's cautions (EN 1176), its first working
    amplitude as the start and its pin friction (the run reports friction torque)."""
    from swingcalc import examples

    d = json.loads(run_ok("simulate", examples.path("playground_seat.toml"), "--cycles", "4",
                          "--format", "json")[0])
    assert any("EN 1176" in c for c in d["cautions"])
    assert d["summary"]["initial_amplitude_rad"] == pytest.approx(math.radians(30), rel=1e-12)
    assert d["inputs"]["pin_radius_m"] == pytest.approx(0.006, rel=1e-15)


def test_friction_options_change_the_design_pivot_field_by_field():
    """The gate arm has a 25 mm pin (mu 0.12, static 0.18): --friction 0.3 keeps its pin
    radius and raises the static coefficient to at least the kinetic one; a friction
    torque replaces the pin's friction (plumbing)."""
    from swingcalc import examples

    gate = examples.path("gate_arm.toml")
    d = json.loads(run_ok("simulate", gate, "--friction", "0.3", "--cycles", "2",
                          "--format", "json")[0])["inputs"]
    assert d["pin_radius_m"] == pytest.approx(0.0125, rel=1e-15)
    assert d["friction_kinetic"] == 0.3 and d["friction_static"] == 0.3
    d = json.loads(run_ok("simulate", gate, "--friction-torque", "0.1 N m", "--cycles", "2",
                          "--format", "json")[0])["inputs"]
    assert d["friction_torque_N_m"] == 0.1 and "pin_radius_m" not in d


def test_simulate_runs_with_no_arguments_on_the_bundled_design():
    """PRODUCT.md: a default design is bundled, so a command runs with no arguments
    (100 cycles when no length of run is given)."""
    d = json.loads(run_ok("simulate", "--format", "json")[0])
    assert d["summary"]["cycles"] == 100
    assert d["cautions"]


def test_decay_fraction_gives_the_textbook_decay_time():
    """A linear viscous oscillator decays as exp(-zeta w0 t) (any vibrations text): to 10 %
    in t = ln(10) / (zeta w0) = 2 Q ln(10) / w0. With the pendulum at 5 deg the nonlinear
    period shift (A^2/16 ~ 5e-4) and the interpolation between turning points are what
    is left: 2e-3 relative."""
    d = json.loads(run_ok("simulate", "--length", "1", "--q", "30", "--linear",
                          "--amplitude", "5", "--cycles", "60", "--decay-fraction", "10 %",
                          "--format", "json")[0])
    w0 = math.sqrt(9.80665)
    assert d["summary"]["decay_time_s"] == pytest.approx(60 * math.log(10) / w0, rel=2e-3)


@pytest.mark.parametrize("args, words", [
    (("simulate", "--cycles", "2", "--push-angle", "10"), ("--push-angle", "no push")),
    (("simulate", "--cycles", "2", "--push-per", "beat"), ("--push-per", "no push")),
    (("simulate", "--cycles", "2", "--push-energy", "1 mJ", "--push-direction", "up"),
     ("--push-direction", "clockwise")),
    (("simulate", "--cycles", "2", "--decay-fraction", "150 %"), ("--decay-fraction",)),
    (("simulate", "--cycles", "2", "--averaged", "--decay-fraction", "10 %"),
     ("--decay-fraction", "averaged")),
])
def test_push_and_decay_options_are_checked(args, words):
    assert_bad(args, *words)


def test_a_bad_value_is_named_before_a_missing_partner_option():
    """--amplitude 500 is out of range whatever else is missing (--torque without its
    frequency): the value check comes first."""
    assert_bad(("simulate", "--torque", "1", "--amplitude", "500"), "--amplitude")


def test_averaged_with_a_history_file_is_refused_before_anything_is_written(tmp_path):
    c, h = tmp_path / "c.csv", tmp_path / "h.csv"
    assert_bad(("simulate", "--averaged", "--cycles", "10", "--cycles-file", c,
                "--history-file", h), "--history-file")
    assert not c.exists() and not h.exists()


def test_a_run_that_would_slacken_the_chains_says_so():
    """A point mass on a line released at A: the line pulls m g cos A at the turning point
    (textbook circular motion), negative past 90 deg, so a seat on chains started at
    120 deg is slack at once; at 30 deg it stays taut (tension >= m g cos 30 deg)."""
    from swingcalc import examples

    seat = str(examples.path("playground_seat.toml"))
    out, _ = run_ok("simulate", seat, "--amplitude", "120", "--cycles", "2")
    assert "would go slack at t = 0 s" in out
    out, _ = run_ok("simulate", seat, "--amplitude", "30", "--cycles", "2")
    assert "slack" not in out.split("CAUTION")[0]
    out, _ = run_ok("simulate", seat, "--averaged", "--amplitude", "100", "--cycles", "2")
    assert "past 90 deg the suspension goes slack" in out


def test_a_duration_beyond_the_cycle_bound_is_refused():
    """1e12 s is some 5e11 periods of the bundled clock (T0 about 2 s): beyond the 1e9
    cycles --cycles allows, so refused at once rather than run for days."""
    assert_bad(("simulate", "--duration", "1e12 s"), "--duration", "1e9")
