"""Project-level checks: the README's quick start and CI agree, and the doctests pass."""

from __future__ import annotations

import doctest
import re
from pathlib import Path

import pytest

import swingcalc.linear
import swingcalc.pendulum
import swingcalc.swing

ROOT = Path(__file__).resolve().parents[1]


def _readme_commands():
    text = (ROOT / "README.md").read_text(encoding="utf-8")
    blocks = re.findall(r"^```[a-z]*\n(.*?)^```", text, flags=re.S | re.M)
    lines = [ln.strip().removeprefix("$ ") for b in blocks for ln in b.splitlines()]
    return [ln for ln in lines if re.match(r"(pip|python|python3|swingcalc|pytest|uv)\b", ln)]


@pytest.mark.skipif(not (ROOT / "README.md").exists(), reason="run from a source checkout")
def test_ci_runs_the_readme_test_command():
    """.ci/run must run the README's test command verbatim (the brief's CI rule)."""
    commands = _readme_commands()
    test_cmds = [c for c in commands if "pytest" in c]
    assert len(test_cmds) == 1, commands
    ci = (ROOT / ".ci" / "run").read_text(encoding="utf-8").splitlines()
    assert test_cmds[0] in [ln.strip() for ln in ci]


@pytest.mark.parametrize("module", [swingcalc.swing, swingcalc.linear, swingcalc.pendulum])
def test_docstring_examples_run(module):
    """The numbers in the docstring examples are the published values they quote."""
    result = doctest.testmod(module, extraglobs={"math": __import__("math")}, verbose=False)
    assert result.failed == 0
    assert result.attempted > 0


@pytest.mark.skipif(not (ROOT / "README.md").exists(), reason="run from a source checkout")
def test_readme_library_examples_run():
    """The README's ``>>>`` examples print what the library returns (values quoted there
    are REFERENCES.md's: T/T0(90 deg) = 1.18034059901609623 [calc], and the 0.1 % limit
    7.2477 deg with the (T - T0)/T definition)."""
    result = doctest.testfile(str(ROOT / "README.md"), module_relative=False, verbose=False)
    assert result.failed == 0
    assert result.attempted >= 3
