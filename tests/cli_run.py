"""Running the command line in-process for the CLI tests: exit status, stdout and stderr
with ANSI codes stripped, and the checks every bad input must pass."""

from __future__ import annotations

import re

from typer.testing import CliRunner

from swingcalc.cli.app import app

ANSI = re.compile(r"\x1b\[[0-9;?]*[ -/]*[@-~]")
runner = CliRunner()


def run(*args):
    """(exit status, stdout, stderr) of ``swingcalc *args``; never a traceback."""
    result = runner.invoke(app, [str(a) for a in args])
    out, err = ANSI.sub("", result.stdout), ANSI.sub("", result.stderr)
    assert "Traceback" not in out + err
    return result.exit_code, out, err


def run_ok(*args):
    code, out, err = run(*args)
    assert code == 0, err
    return out, err


def assert_bad(args, *words):
    """Exit status 2, one line on stderr holding each of ``words``, nothing on stdout."""
    code, out, err = run(*args)
    assert code == 2, (code, out, err)
    lines = err.strip().splitlines()
    assert len(lines) == 1, err
    for w in words:
        assert w in lines[0], (w, lines[0])
    assert out == ""
    return lines[0]
