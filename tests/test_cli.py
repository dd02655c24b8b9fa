"""The command line: every bad input gives exit status 2 and one line on stderr naming
the input; the formats carry SI values, unit-suffixed keys and the cautions; files are
written atomically and never overwritten without --force."""

import csv
import io
import json
import math
import os
import re
import sys

import mpmath
import pytest
from typer.testing import CliRunner

import swingcalc
from swingcalc.cli.app import app

ANSI = re.compile(r"\x1b\[[0-9;?]*[ -/]*[@-~]")
runner = CliRunner()

SEAT = os.path.join(os.path.dirname(swingcalc.__file__), "examples", "garden_swing_seat.toml")

CLOCK_TOML = """\
name = "Shop regulator"
context = "clock"
[pendulum]
length = "994 mm"
bob_mass = "1.2 kg"
suspension = "rigid"
[swing]
amplitude = "2 deg"
"""


def run(*args):
    result = runner.invoke(app, [str(a) for a in args])
    out, err = ANSI.sub("", result.stdout), ANSI.sub("", result.stderr)
    assert "Traceback" not in out + err
    return result.exit_code, out, err


def run_ok(*args):
    code, out, err = run(*args)
    assert code == 0, err
    return out, err


def assert_bad(args, *words):
    code, out, err = run(*args)
    assert code == 2, (code, out, err)
    lines = err.strip().splitlines()
    assert len(lines) == 1, err
    for w in words:
        assert w in lines[0], (w, lines[0])
    assert out == ""
    return lines[0]


def csv_rows(text):
    """Data rows of our CSV: lines whose first cell starts with '#' are metadata."""
    rows = [r for r in csv.reader(io.StringIO(text)) if r and not r[0].startswith("#")]
    head, body = rows[0], rows[1:]
    return [dict(zip(head, r)) for r in body]


# ---------------------------------------------------------------- the main job

def test_no_arguments_runs_the_bundled_design():
    out, _ = run_ok()
    assert "Workshop regulator" in out and "period T" in out and "CAUTION" in out


def test_no_arguments_equals_pendulum_without_arguments():
    assert run_ok()[0] == run_ok("pendulum")[0]


def test_help_lists_the_commands():
    out, _ = run_ok("--help")
    for cmd in ("pendulum", "periods", "small-angle"):
        assert cmd in out


def test_pendulum_json_is_one_object_in_si_with_cautions():
    out, _ = run_ok("pendulum", SEAT, "--format", "json")
    data = json.loads(out)
    assert isinstance(data, dict)
    assert data["inputs"]["length_m"] == 2.2 and data["inputs"]["bob_mass_kg"] == 80.0
    rows = data["tables"]["swing"]
    assert [round(math.degrees(r["amplitude_rad"]), 9) for r in rows] == [30, 60, 100]
    for r in rows:
        # peak tension at the bottom m g (3 - 2 cos A): energy conservation plus the
        # radial equation (any mechanics text, e.g. Young & Freedman, ch. 7 and 5);
        # 1e-13 allows the library's rounding in sin^2 and the product.
        a = r["amplitude_rad"]
        assert r["peak_tension_N"] == pytest.approx(80 * 9.80665 * (3 - 2 * math.cos(a)),
                                                    rel=1e-13)
        if a < math.pi / 2:   # below 90 deg the chain stays taut: least tension m g cos A
            assert r["min_tension_N"] == pytest.approx(80 * 9.80665 * math.cos(a), rel=1e-13)
    for key in rows[0]:
        assert key.endswith(("_s", "_rad", "_deg", "_hz", "_N", "_J", "_m_s", "_rad_s",
                             "_rel", "_ratio", "_hour", "_per_weight", "margin")), key
    assert data["cautions"] and any("EN 1176" in c for c in data["cautions"])
    assert any("slack" in w for w in data["warnings"])


def test_slack_angle_of_seat_matches_the_closed_form():
    """Tension m g (3 cos t - 2 cos A) vanishes at cos t = 2 cos A / 3 (same derivation)."""
    data = json.loads(run_ok("pendulum", SEAT, "--format", "json")[0])
    last = data["tables"]["swing"][-1]
    expected = math.acos(2 * math.cos(math.radians(100)) / 3)
    assert last["zero_tension_angle_rad"] == pytest.approx(expected, rel=1e-12)
    assert data["tables"]["swing"][0]["zero_tension_angle_rad"] is None


def test_period_ratio_at_90_degrees_matches_the_reference():
    """T/T0 at 90 deg = (2/pi) K(m = 1/2). Reference: mpmath.ellipk at 30 digits, checked
    against the special value K(1/2) = Gamma(1/4)^2 / (4 sqrt(pi)) (DLMF section 19.6,
    section cited from memory). 1e-14: the accuracy the product brief sets for the exact
    result (PRODUCT.md "Quality bar")."""
    data = json.loads(run_ok("periods", "--amplitude", "90", "--format", "json")[0])
    with mpmath.workdps(30):
        k_half = mpmath.ellipk(mpmath.mpf(1) / 2)
        assert abs(k_half - mpmath.gamma(0.25) ** 2 / (4 * mpmath.sqrt(mpmath.pi))) < 1e-25
        ref = float(2 * k_half / mpmath.pi)
    row = data["tables"]["periods"][0]
    assert row["period_ratio"] == pytest.approx(ref, rel=1e-14)
    assert row["amplitude_rad"] == math.pi / 2
    # T0 = 2 pi sqrt(L/g) with L = 1 m (default) and g_n = 9.80665 m/s^2 (CGPM 1901)
    assert row["small_angle_period_s"] == pytest.approx(2 * math.pi / math.sqrt(9.80665),
                                                        rel=1e-15)
    assert data["cautions"] == []          # no loads in a period table


def test_length_in_feet_reaches_the_library_in_metres():
    data = json.loads(run_ok("periods", "--length", "3 ft", "--amplitude", "10",
                             "--format", "json")[0])
    # NIST SP 811 B.8: 1 ft = 0.3048 m exactly; pint's float chain may be 1 ulp off.
    assert data["inputs"]["length_m"] == pytest.approx(0.9144, rel=4e-16)


def test_csv_parses_and_equals_the_library_values():
    out, _ = run_ok("periods", "--amplitude", "0:60:20", "--length", "2", "--format", "csv")
    rows = csv_rows(out)
    assert len(rows) == 4
    for r in rows:
        a = float(r["amplitude_rad"])
        assert float(r["period_s"]) == swingcalc.period(2.0, a)
        assert float(r["period_ratio"]) == swingcalc.period_ratio(a)
        assert float(r["series_3_terms_error_rel"]) == swingcalc.series_period_error(a, 3)
        lo, hi = swingcalc.period_ratio_bounds(a)
        assert float(r["bound_lower_period_ratio"]) == lo
        assert float(r["bound_upper_period_ratio"]) == hi


def test_csv_of_pendulum_carries_the_cautions():
    out, _ = run_ok("pendulum", SEAT, "--format", "csv")
    cautions = [r for r in csv.reader(io.StringIO(out)) if r and r[0] == "# caution"]
    assert cautions and any("ASTM F2291" in r[1] for r in cautions)
    rows = csv_rows(out)
    r = swingcalc.simple_pendulum(2.2, math.radians(60), mass=80, suspension="flexible")
    assert float(rows[1]["peak_tension_N"]) == r.peak_tension_N


def test_markdown_has_a_table_and_the_cautions():
    out, _ = run_ok("pendulum", "--format", "markdown")
    assert re.search(r"^\| .+ \|$", out, re.M) and re.search(r"^\|---\|", out, re.M)
    assert "### Cautions" in out


def test_cautions_are_in_every_format_when_loads_are_shown():
    for fmt in ("table", "csv", "json", "markdown"):
        out, _ = run_ok("pendulum", "--format", fmt)
        assert "licensed engineer" in out, fmt


def test_pendulum_options_without_file_start_from_a_general_design():
    data = json.loads(run_ok("pendulum", "--length", "2 m", "--format", "json")[0])
    assert data["inputs"]["context"] == "general"
    assert data["inputs"]["bob_mass_kg"] == 1.0 and data["inputs"]["suspension"] == "rigid"
    assert data["tables"]["swing"][0]["amplitude_rad"] == pytest.approx(math.radians(10),
                                                                         rel=1e-15)


def test_options_override_the_design_file(tmp_path):
    p = tmp_path / "clock.toml"
    p.write_text(CLOCK_TOML)
    data = json.loads(run_ok("pendulum", p, "--amplitude", "1, 4", "--mass", "2 kg",
                             "--format", "json")[0])
    assert data["inputs"]["length_m"] == pytest.approx(0.994, rel=1e-15)
    assert data["inputs"]["bob_mass_kg"] == 2.0
    assert len(data["tables"]["swing"]) == 2
    assert "clock_rate_s_per_day" in data["tables"]["swing"][0]


def test_small_angle_verdict_and_limit_against_mpmath():
    """Largest amplitude with |T0 - T| / T <= 0.1 %: T/T0 = 1/(1 - 0.001), solved here with
    mpmath (K at 30 digits, findroot). 1e-12: the library's Newton solve stops at a few ulp
    in ln(m/p), far below that."""
    code, out, err = run("small-angle", "--amplitude", "2, 15", "--tolerance", "0.1 %",
                         "--format", "json")
    assert code == 0, err
    data = json.loads(out)
    with mpmath.workdps(30):
        target = 1 / (1 - mpmath.mpf("0.001"))
        limit = mpmath.findroot(
            lambda a: 2 / mpmath.pi * mpmath.ellipk(mpmath.sin(a / 2) ** 2) - target, 0.12)
    assert data["summary"]["max_amplitude_rad"] == pytest.approx(float(limit), rel=1e-12)
    assert [r["within_tolerance"] for r in data["tables"]["checks"]] == [True, False]
    assert data["verdict"] == "acceptable at some amplitudes only"
    assert data["acceptable"] is False


def test_small_angle_table_shows_a_clear_verdict():
    out, _ = run_ok("small-angle", "--amplitude", "15", "--tolerance", "0.1%")
    assert "NOT ACCEPTABLE" in out
    out, _ = run_ok("small-angle", "--amplitude", "1", "--tolerance", "1 %")
    assert "ACCEPTABLE" in out and "NOT ACCEPTABLE" not in out


def test_periods_range_with_unit():
    data = json.loads(run_ok("periods", "--amplitude", "0:90:5 deg", "--format", "json")[0])
    assert len(data["tables"]["periods"]) == 19


# ---------------------------------------------------------------- output files

def test_output_file_is_written_and_format_inferred(tmp_path):
    target = tmp_path / "periods.json"
    code, out, err = run("periods", "--output", target)
    assert code == 0 and out == ""
    assert len(err.strip().splitlines()) == 1 and "wrote json" in err
    json.loads(target.read_text())
    assert sorted(os.listdir(tmp_path)) == ["periods.json"]      # no temp file left


def test_output_is_not_overwritten_without_force(tmp_path):
    target = tmp_path / "t.csv"
    target.write_text("keep me")
    assert_bad(["periods", "--output", target], "--output", "file exists", "--force")
    assert target.read_text() == "keep me"
    run_ok("periods", "--output", target, "--force")
    assert target.read_text().startswith("# Period against amplitude")
    assert sorted(os.listdir(tmp_path)) == ["t.csv"]


def test_write_atomic_refuses_a_file_that_appears_meanwhile(tmp_path):
    """The no-clobber check is the hard link itself, not only the early check."""
    from swingcalc.errors import InvalidInput
    from swingcalc.report import files

    target = tmp_path / "r.txt"
    real_check = files.check_writable

    def racing_check(path, force=False, field="--output"):
        p = real_check(path, force, field)
        target.write_text("written by someone else")
        return p

    files.check_writable = racing_check
    try:
        with pytest.raises(InvalidInput, match="file exists"):
            files.write_atomic(target, "ours")
    finally:
        files.check_writable = real_check
    assert target.read_text() == "written by someone else"
    assert sorted(os.listdir(tmp_path)) == ["r.txt"]


@pytest.mark.skipif(sys.platform == "win32" or os.geteuid() == 0,
                    reason="permissions are not enforced for root")
def test_unwritable_folder(tmp_path):
    folder = tmp_path / "ro"
    folder.mkdir()
    folder.chmod(0o500)
    try:
        assert_bad(["periods", "--output", folder / "x.csv"], "--output", "not writable")
    finally:
        folder.chmod(0o700)


def test_failed_write_leaves_nothing_behind(tmp_path, monkeypatch):
    """A write that fails midway (disk full) is reported as one line; no file appears."""
    from swingcalc.report import files

    def full_disk(fd):
        raise OSError(28, "No space left on device")

    monkeypatch.setattr(files.os, "fsync", full_disk)
    line = assert_bad(["periods", "--output", tmp_path / "x.csv"], "--output",
                      "No space left on device")
    assert "cannot write" in line
    assert os.listdir(tmp_path) == []


def test_output_under_a_file_is_refused(tmp_path):
    blocker = tmp_path / "file.txt"
    blocker.write_text("")
    assert_bad(["periods", "--output", blocker / "x.csv"], "--output", "does not exist")


def test_missing_folder_and_unknown_suffix(tmp_path):
    assert_bad(["periods", "--output", tmp_path / "no" / "x.csv"], "--output", "does not exist")
    assert_bad(["periods", "--output", tmp_path / "x.dat"], "--output", "format")
    assert_bad(["periods", "--output", tmp_path], "--output", "folder")


# ---------------------------------------------------------------- bad input

@pytest.mark.parametrize("args, words", [
    (["periods", "--length", "0"], ["--length", "out of range", "> 0"]),
    (["periods", "--length", "-1 m"], ["--length", "out of range"]),
    (["pendulum", "--length", "0 mm"], ["--length", "out of range"]),
    (["pendulum", "--mass", "-2 kg", "--length", "1"], ["--mass", "out of range"]),
    (["periods", "--amplitude", "180"], ["--amplitude", "out of range", "[0, 180) deg"]),
    (["periods", "--amplitude", "3.15 rad"], ["--amplitude", "out of range"]),
    (["small-angle", "--amplitude", "200"], ["--amplitude", "out of range"]),
    (["pendulum", "--amplitude", "180 deg"], ["--amplitude", "out of range"]),
    (["periods", "--amplitude", "nan"], ["--amplitude", "not a finite number"]),
    (["periods", "--length", "inf"], ["--length", "not a finite number"]),
    (["periods", "--gravity", "NaN m/s^2"], ["--gravity", "not a finite number"]),
    (["periods", "--length", "3 flurb"], ["--length", "unknown unit 'flurb'"]),
    (["periods", "--length", "2 FT"], ["--length", "unknown unit", "did you mean 'ft'"]),
    (["periods", "--length", "2 kg"], ["--length", "not a length"]),
    (["periods", "--amplitude", "10 mm"], ["--amplitude", "not an angle"]),
    (["periods", "--gravity", "9.8 m/s"], ["--gravity", "not an acceleration"]),
    (["small-angle", "--tolerance", "0.1 deg"], ["--tolerance", "not a fraction"]),
    (["periods", "--amplitude", "0:90"], ["--amplitude", "start:stop:step"]),
    (["periods", "--amplitude", "90:0:10"], ["--amplitude", "start must not exceed"]),
    (["periods", "--amplitude", "0:90:0"], ["--amplitude", "step must be > 0"]),
    (["periods", "--amplitude", "0:90:-10"], ["--amplitude", "step must be > 0"]),
    (["periods", "--amplitude", "10,,20"], ["--amplitude", "empty item"]),
    (["periods", "--amplitude", "0:170:0.00001"], ["--amplitude", "more than 10000"]),
    (["small-angle", "--tolerance", "0"], ["--tolerance", "out of range"]),
    (["small-angle", "--tolerance", "150 %"], ["--tolerance", "out of range"]),
    (["small-angle", "--cycles", "-3"], ["--cycles", "out of range"]),
    (["periods", "--format", "xml"], ["--format", "table, csv, json, markdown"]),
    (["pendulum", "--suspension", "rope", "--length", "1"], ["--suspension", "rigid or flexible"]),
    (["pendulum", "--mass", "2 kg"], ["--length", "required"]),
    (["periods", "--no-such-option"], ["No such option"]),
    (["no-such-command"], ["No such command"]),
])
def test_bad_input_exit_2_one_line(args, words):
    assert_bad(args, *words)


@pytest.mark.parametrize("text, words", [
    (CLOCK_TOML.replace('"994 mm"', "994 mm"), ["line 4", "TOML syntax error", "quotes"]),
    (CLOCK_TOML.replace("bob_mass", "bob_mas"), ["pendulum.bob_mas", "did you mean 'bob_mass'"]),
    (CLOCK_TOML.replace('"1.2 kg"', "[1.2]"), ["pendulum.bob_mass", "wrong type"]),
    (CLOCK_TOML.replace('length = "994 mm"\n', ""), ["missing required field 'length'"]),
    (CLOCK_TOML.replace('"2 deg"', '"190 deg"'), ["swing.amplitude", "out of range"]),
    (CLOCK_TOML.replace('"994 mm"', '"0 mm"'), ["pendulum.length", "out of range"]),
])
def test_broken_design_files(tmp_path, text, words):
    p = tmp_path / "clock.toml"
    p.write_text(text)
    line = assert_bad(["pendulum", p], str(p), *words)
    assert "allowed:" in line


def test_missing_design_file(tmp_path):
    assert_bad(["pendulum", tmp_path / "none.toml"], "design file", "no such file")


def test_nothing_is_written_when_the_input_is_bad(tmp_path):
    target = tmp_path / "out.json"
    assert_bad(["periods", "--amplitude", "190", "--output", target], "--amplitude")
    assert os.listdir(tmp_path) == []


# ---------------------------------------------------------------- motion

def test_motion_regimes_either_side_of_the_separatrix_speed():
    """Over the top needs a bottom speed above 2 sqrt(g L) (energy: v^2 = 4 g L reaches the
    top with zero speed; any mechanics text). L = 1 m, g_n: 6.2631 m/s."""
    v_sep = 2 * math.sqrt(9.80665)
    slow = json.loads(run_ok("motion", "--bottom-speed", f"{0.99 * v_sep} m/s",
                             "--format", "json")[0])
    fast = json.loads(run_ok("motion", "--bottom-speed", f"{1.01 * v_sep}",
                             "--format", "json")[0])
    assert slow["summary"]["regime"] == "libration"
    assert fast["summary"]["regime"] == "rotation"
    assert fast["summary"]["top_angular_speed_rad_s"] > 0


def test_motion_history_starts_at_the_given_state():
    data = json.loads(run_ok("motion", "--angle", "30", "--duration", "2 s", "--step", "0.5",
                             "--format", "json")[0])
    hist = data["tables"]["history"]
    assert [r["time_s"] for r in hist] == [0.0, 0.5, 1.0, 1.5, 2.0]
    assert hist[0]["angle_rad"] == pytest.approx(math.radians(30), rel=1e-14)
    # |angle| never exceeds the amplitude released from rest (energy conservation)
    assert max(abs(r["angle_rad"]) for r in hist) <= math.radians(30) * (1 + 1e-14)


@pytest.mark.parametrize("args, words", [
    (["motion", "--angular-speed", "1", "--bottom-speed", "2"], ["--bottom-speed", "only one"]),
    (["motion", "--angle", "10", "--bottom-speed", "2"], ["--angle", "bottom"]),
    (["motion", "--angular-speed", "2 Hz"], ["--angular-speed", "frequency"]),
    (["motion", "--duration", "0"], ["--duration", "out of range"]),
    (["motion", "--duration", "1 s", "--step", "1 us"], ["--step", "too many"]),
    (["motion", "--step", "1"], ["--duration", "needs"]),
])
def test_motion_bad_input(args, words):
    assert_bad(args, *words)
