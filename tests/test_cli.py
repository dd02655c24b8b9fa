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

import swingcalc

from cli_run import assert_bad, run, run_ok

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




def csv_rows(text):
    """Data rows of our CSV: lines whose first cell starts with '#' are metadata."""
    rows = [r for r in csv.reader(io.StringIO(text)) if r and not r[0].startswith("#")]
    head, body = rows[0], rows[1:]
    return [dict(zip(head, r)) for r in body]


# ---------------------------------------------------------------- the main job

def test_no_arguments_runs_the_bundled_design():
    out, _ = run_ok()
    assert "Long-case clock" in out and "period T" in out and "CAUTION" in out


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
        assert r["peak_pivot_load_N"] == pytest.approx(
            80 * 9.80665 * (3 - 2 * math.cos(a)), rel=1e-13)
        if a < math.pi / 2:   # below 90 deg the chain stays taut: least tension m g cos A
            assert r["least_arm_tension_N"] == pytest.approx(80 * 9.80665 * math.cos(a),
                                                             rel=1e-13)
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
    cautions = [line for line in out.splitlines() if line.startswith("# caution: ")]
    assert cautions and any("ASTM F2291" in line for line in cautions)
    rows = csv_rows(out)
    r = swingcalc.simple_pendulum(2.2, math.radians(60), mass=80, suspension="flexible")
    # Two routes to m g (1 + 4 sin^2(A/2)): the point-pendulum formula and the body's
    # pivot reaction; 1e-14 allows their different rounding.
    assert float(rows[1]["peak_pivot_load_N"]) == pytest.approx(r.peak_tension_N, rel=1e-14)


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


# ---------------------------------------------------------------- review fixes

def _data_and_comments(text):
    """Split our CSV into comment lines and the data lines, checking each comment line
    starts with '#' itself (a spreadsheet or pandas comment='#' must see it as one)."""
    comments, data = [], []
    for line in text.splitlines():
        (comments if line.startswith("#") else data).append(line)
    assert not any(line.startswith('"#') for line in data)
    return comments, data


def test_csv_comment_lines_start_with_a_hash_even_with_commas(tmp_path):
    p = tmp_path / "seat.toml"
    p.write_text(CLOCK_TOML.replace('"Shop regulator"', '"Seat, rear, "').replace(
        'context = "clock"', 'context = "clock"\nrevision = "A, 2"'))
    out, _ = run_ok("pendulum", p, "--format", "csv")
    comments, data = _data_and_comments(out)
    assert comments[0] == "# Pendulum: Seat, rear, , rev. A, 2"
    assert "# input: design_name = Seat, rear, " in comments
    assert any(c.startswith("# note: ") for c in comments)
    assert any(c.startswith("# caution: ") and "licensed engineer" in c for c in comments)
    rows = list(csv.reader(io.StringIO("\n".join(data))))
    assert len(rows) == 2 and len(rows[0]) == len(rows[1])   # header + one amplitude


def test_csv_comments_have_no_line_breaks_and_signed_zero_and_infinities_are_clean():
    """Unit check of the formats on a hand-made report: -0.0 is written as 0.0, +inf and
    -inf as 'inf'/'-inf' in CSV and null in JSON, NaN as an empty cell / null; a text with
    line breaks stays on its comment line."""
    from swingcalc.report.formats import to_csv, to_json
    from swingcalc.report.model import Column, Item, Report, Table

    cols = (Column("a_s", "a"), Column("b_s", "b"), Column("c_s", "c"), Column("d_s", "d"))
    rep = Report("x", "Title, with comma\nand a break\r", [Item("z_m", "z", -0.0)], [],
                 [Table("t", "t", cols, ((-0.0, math.inf, -math.inf, math.nan),))],
                 notes=["one\r\ntwo"], warnings=["w\u2028x"], cautions=["c"])
    lines = to_csv(rep).splitlines()
    assert lines[0] == "# Title, with comma and a break"
    assert lines[1] == "# input: z_m = 0.0"
    assert lines[2] == "a_s,b_s,c_s,d_s" and lines[3] == "0.0,inf,-inf,"
    assert lines[4:] == ["# note: one two", "# warning: w x", "# caution: c"]
    data = json.loads(to_json(rep))
    assert math.copysign(1.0, data["inputs"]["z_m"]) == 1.0
    row = data["tables"]["t"][0]
    assert math.copysign(1.0, row["a_s"]) == 1.0
    assert row["b_s"] is None and row["c_s"] is None and row["d_s"] is None


def test_zero_amplitude_gives_no_negative_zero_in_csv_or_json():
    """At zero amplitude every error is exactly zero (T = T0; any text); the library
    returns some of them as -0.0, which the files show as 0.0."""
    out, _ = run_ok("periods", "--amplitude", "0", "--format", "csv")
    assert "-0.0" not in out.split(",") and ",-0.0" not in out
    data = json.loads(run_ok("periods", "--amplitude", "0", "--format", "json")[0])
    row = data["tables"]["periods"][0]
    assert row["small_angle_period_error_rel"] == 0.0
    assert all(math.copysign(1.0, v) == 1.0 for v in row.values() if v == 0.0)


def test_overlong_output_name_is_one_short_line(tmp_path):
    """A file name over 255 bytes makes stat() fail with ENAMETOOLONG (POSIX NAME_MAX on
    the usual file systems; common practice)."""
    name = "x" * 300 + ".csv"
    line = assert_bad(["periods", "--output", tmp_path / name], "--output", "too long")
    assert len(line) < 300 and name not in line
    assert os.listdir(tmp_path) == []


def test_empty_output_is_refused():
    assert_bad(["periods", "--output", ""], "--output", "an output file path")


def test_file_exists_message_says_force_once(tmp_path):
    target = tmp_path / "t.csv"
    target.write_text("keep me")
    line = assert_bad(["periods", "--output", target], "file exists")
    assert line.count("--force") == 1


def test_close_amplitudes_stay_distinct_in_tables_and_notes():
    """179.9, 179.99 and 179.999 deg are different inputs; .4g showed all three as 180."""
    out, _ = run_ok("periods", "--amplitude", "179.9, 179.99, 179.999")
    cells = [line.split()[0] for line in out.splitlines() if line.strip().startswith("179.9")]
    assert cells == ["179.9", "179.99", "179.999"]
    out, _ = run_ok("small-angle", "--amplitude", "30, 179.99")
    assert "NOT ACCEPTABLE at 30, 179.99 deg" in " ".join(out.split())
    out, _ = run_ok("pendulum", "--length", "1", "--amplitude", "179.99")
    assert "at 179.99 deg amplitude" in " ".join(out.split())
    out, _ = run_ok("periods", "--amplitude", "30")
    assert re.search(r"^ *30 ", out, re.M)                   # not 30.00000000


def test_amplitude_next_to_180_is_never_shown_as_180():
    data = json.loads(run_ok("periods", "--amplitude", "179.9999999999999", "--format",
                             "json")[0])
    assert data["tables"]["periods"][0]["amplitude_deg"] < 180.0
    out, _ = run_ok("periods", "--amplitude", "179.9999999999999")
    assert "179.99999999999" in out and not re.search(r"^ *180 ", out, re.M)


def test_show_value_significant_digits_for_huge_values_and_no_trailing_point():
    from swingcalc.report.model import show_value

    assert show_value(3.2784245000410147e25, fmt=".6f") == "3.278425e+25"
    assert show_value(-1478.3, fmt="#.4g") == "-1478"
    assert show_value(1.5e-12, fmt="#.4g") == "1.500e-12"
    assert show_value(1e10, fmt="#.1g") == "1e+10"
    assert show_value(-1e-9, fmt=".4f") == "0.0000"
    assert show_value(2.5, fmt=".6f") == "2.500000"


def test_upper_bound_near_the_top_is_shown_in_significant_digits():
    """The upper bound (4 - 3k^2)/(4 - 4k^2) grows like 1/cos^2(A/2) (Stewart, Calculus,
    8th ed., 11.11 ex. 38): at 179.999 deg about 3.3e9, which fixed decimals would print
    as a run of ten digits and six decimals."""
    out, _ = run_ok("periods", "--amplitude", "179.999")
    assert not re.search(r"\d{9,}", out)
    with mpmath.workdps(30):     # 4 - 4k^2 cancels badly in floats this close to the top
        k2 = mpmath.sin(mpmath.radians(mpmath.mpf("179.999")) / 2) ** 2
        hi = float((4 - 3 * k2) / (4 - 4 * k2))
    assert f"{hi:#.7g}" in out


def test_periods_table_of_ten_thousand_rows_equals_the_scalar_library():
    """Rows come from one vectorised call per column; the scalar functions give each
    value on its own. 4e-16 (2 ulp): the array and scalar paths of the library may round
    differently in the last place."""
    data = json.loads(run_ok("periods", "--amplitude", "0:179.982:0.018", "--format",
                             "json")[0])
    rows = data["tables"]["periods"]
    assert len(rows) == 10_000
    for r in rows[::997]:
        a = r["amplitude_rad"]
        assert r["period_ratio"] == pytest.approx(swingcalc.period_ratio(a), rel=4e-16)
        for n in (2, 3, 4):
            assert r[f"series_{n}_terms_error_rel"] == pytest.approx(
                swingcalc.series_period_error(a, n), rel=4e-16, abs=1e-300)
        lo, hi = swingcalc.period_ratio_bounds(a, "agm")
        assert r["agm_bound_lower_period_ratio"] == pytest.approx(lo, rel=4e-16)
        assert r["agm_bound_upper_period_ratio"] == pytest.approx(hi, rel=4e-16)


def test_small_angle_rows_equal_small_angle_check():
    """Same 2-ulp allowance as above (array vs scalar paths)."""
    data = json.loads(run_ok("small-angle", "--amplitude", "1, 7.5, 33, 120, 179",
                             "--tolerance", "0.5 %", "--cycles", "250", "--format",
                             "json")[0])
    assert data["inputs"] == {"tolerance_rel": 0.005, "cycles": 250.0}
    for r in data["tables"]["checks"]:
        c = swingcalc.small_angle_check(r["amplitude_rad"], tolerance=0.005, cycles=250)
        assert r["within_tolerance"] is c.acceptable
        for key, want in (("period_ratio", c.period_ratio),
                          ("period_error_rel", c.period_error_rel),
                          ("series_4_terms_error_rel", c.series_error_rel[4]),
                          ("bound_upper_period_ratio", c.bounds[1]),
                          ("peak_tension_error_rel", c.peak_tension_error_rel),
                          ("phase_error_rad", c.phase_error_rad),
                          ("clock_rate_s_per_day", c.clock_rate_s_per_day)):
            assert r[key] == pytest.approx(want, rel=4e-16), key


def test_motion_states_its_model_and_carries_the_cautions():
    data = json.loads(run_ok("motion", "--angle", "100", "--format", "json")[0])
    assert any("point bob on a light rigid rod" in n and "slack" in n for n in data["notes"])
    assert any("licensed engineer" in c for c in data["cautions"])
    out, _ = run_ok("motion", "--angle", "100")
    assert "CAUTION" in out


def test_motion_report_converts_bottom_speed_and_lays_out_the_times():
    """omega = v / L at the bottom (rigid-body kinematics, any mechanics text)."""
    from swingcalc.report.builders import motion_report

    rep = motion_report(0.0, None, 2.0, 9.80665, bottom_speed=3.0, duration=2.0, step=0.5)
    inputs = {i.key: i.value for i in rep.inputs}
    assert inputs["angular_velocity_rad_s"] == 1.5
    assert [r[0] for r in rep.tables[0].rows] == [0.0, 0.5, 1.0, 1.5, 2.0]
    rep = motion_report(0.3, 0.0, 1.0, 9.80665, duration=4.0)
    assert len(rep.tables[0].rows) == 41                 # default step: duration / 40


def test_library_errors_name_the_option_that_gave_the_value():
    """A subnormal length is refused by the library; the message names --length."""
    assert_bad(["periods", "--length", "1e-320"], "--length")
    assert_bad(["motion", "--length", "1e-320"], "--length")


def test_missing_option_value_points_to_the_subcommand_help():
    line = assert_bad(["pendulum", "--length"], "--length")
    assert "swingcalc pendulum --help" in line
    line = assert_bad(["small-angle", "--cycles"], "--cycles")
    assert "swingcalc small-angle --help" in line


def test_gravity_word_and_formats_are_defined_once():
    from swingcalc.cli import options
    from swingcalc.pendulum import SUSPENSIONS
    from swingcalc.report.formats import FORMATS

    assert options.FORMATS is FORMATS and options.SUSPENSIONS is SUSPENSIONS
    data = json.loads(run_ok("periods", "--gravity", " Standard ", "--format", "json")[0])
    assert data["inputs"]["gravity_m_s2"] == 9.80665      # 3rd CGPM (1901)


def test_periods_json_carries_the_harmonic_content_from_the_nome_series():
    """3rd and 5th harmonics of theta(t) over the fundamental at 90 deg. Reference: the
    nome series a_N/a_1 = q^((N-1)/2) (1 + q) / (N (1 + q^N)) evaluated with mpmath's own
    nome at m = 1/2 (mpmath.qfrom), 30 digits; the formula itself is checked against an
    FFT of the integrated swing in test_history.py. 1e-13: the nome carries a few ulp of
    pi K'/K."""
    data = json.loads(run_ok("periods", "--amplitude", "90", "--format", "json")[0])
    row = data["tables"]["periods"][0]
    with mpmath.workdps(30):
        q = mpmath.qfrom(m=mpmath.mpf(1) / 2)
        ref3 = q * (1 + q) / (3 * (1 + q**3))
        ref5 = q**2 * (1 + q) / (5 * (1 + q**5))
    assert row["harmonic_3_rel"] == pytest.approx(float(ref3), rel=1e-13)
    assert row["harmonic_5_rel"] == pytest.approx(float(ref5), rel=1e-13)


def test_version_option_prints_the_package_version():
    out, _ = run_ok("--version")
    assert out.strip() == f"swingcalc {swingcalc.__version__}"


def test_force_never_replaces_a_device_or_pipe(tmp_path):
    """--force replaces a regular file only: a FIFO (like a device node) stays what it is
    and the command refuses with one line (common practice for file-writing tools)."""
    fifo = tmp_path / "pipe.csv"
    os.mkfifo(fifo)
    code, out, err = run("periods", "--output", str(fifo), "--force")
    assert code == 2 and len(err.strip().splitlines()) == 1
    assert "not a regular file" in err
    assert fifo.is_fifo()


def test_main_job_takes_the_format_options_too():
    """`swingcalc --format json` is the main job in JSON (PRODUCT.md: --format on every
    command that prints results); before a subcommand the option is refused by name."""
    data = json.loads(run_ok("--format", "json")[0])
    assert data["command"] == "pendulum" and data["cautions"]
    code, _, err = run("--format", "json", "periods")
    assert code == 2 and len(err.strip().splitlines()) == 1 and "--format" in err
