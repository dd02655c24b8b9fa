"""The documentation's example commands run, and print what the documents show.

Every fenced block in README.md and docs/**/*.md whose first line starts with
``$ swingcalc`` is a set of examples: each ``$ swingcalc ...`` line is a command, the
lines after it (up to the next ``$`` line or the end of the block) are its output as the
documents show it. Each command is run in-process from the repository root with the
screen 100 columns wide, and its output (stdout, then stderr) must contain the lines
shown:

- lines that follow each other in the block follow each other in the output; a line
  ``...`` stands for any number of lines left out; the block may start and end anywhere
  in the output (a block need not show the title or the cautions);
- a line with ``...`` inside it stands for a line with part of it left out: the real
  line starts with the text before the first ``...``, ends with the text after the last,
  and holds the text between them in order;
- whitespace at the ends of lines is ignored, and so are blank lines at the ends of the
  block.

A block the test must skip is preceded by ``<!-- not checked: reason -->``; keep them rare.

The expected side is the documents themselves, written from the tool's output when the
pages were written; this test is a regression check that they still agree (the physics is
checked by the other test modules against outside sources). The README's commands run in
the default run; the worked examples and method notes are marked slow (they include
simulations).

docs/cli.md is generated from the app (``python -m swingcalc.cli.reference``); a test
here fails when it is stale.
"""

from __future__ import annotations

import re
import shlex
from dataclasses import dataclass
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parent.parent
COLUMNS = "100"
SKIP = re.compile(r"<!--\s*not checked:\s*\S.*-->")
REGENERATE = "python -m swingcalc.cli.reference > docs/cli.md"


@dataclass(frozen=True)
class Example:
    path: str          # relative to the repository root
    line: int          # line number of the command in the document (1-based)
    command: str       # the text after "$ "
    shown: tuple       # the output lines as the document shows them

    @property
    def id(self) -> str:
        return f"{self.path}:{self.line}: {self.command}"


def examples_in(path: Path) -> list[Example]:
    """The example commands of one Markdown file."""
    rel = path.relative_to(ROOT).as_posix()
    lines = path.read_text(encoding="utf-8").splitlines()
    found: list[Example] = []
    i = 0
    while i < len(lines):
        fence = lines[i].strip()
        if not fence.startswith("```"):
            i += 1
            continue
        start = i
        j = i + 1
        while j < len(lines) and not lines[j].strip().startswith("```"):
            j += 1
        body = lines[start + 1:j]
        i = j + 1
        if not body or not body[0].startswith("$ swingcalc"):
            continue
        before = next((lines[k] for k in range(start - 1, -1, -1) if lines[k].strip()), "")
        if SKIP.search(before):
            continue
        current = None
        for k, text in enumerate(body):
            if text.startswith("$ "):
                if current is not None:
                    found.append(_example(rel, *current))
                current = (start + 2 + k, text[2:].strip(), [])
            else:
                current[2].append(text)
        found.append(_example(rel, *current))
    return found


def _example(path, line, command, shown) -> Example:
    shown = [s.rstrip() for s in shown]
    while shown and not shown[0]:
        shown.pop(0)
    while shown and not shown[-1]:
        shown.pop()
    return Example(path, line, command, tuple(shown))


def line_matches(shown: str, real: str) -> bool:
    """Whether a real output line is the line shown (``...`` inside: a part left out)."""
    real = real.rstrip()
    if "..." not in shown:
        return real == shown
    pieces = shown.split("...")
    head, tail, middle = pieces[0].rstrip(), pieces[-1].strip(), [p.strip() for p in pieces[1:-1]]
    if not real.startswith(head) or not real.endswith(tail):
        return False
    at, end = len(head), len(real) - len(tail)
    if end < at:
        return False
    for piece in middle:
        found = real.find(piece, at, end)
        if found < 0:
            return False
        at = found + len(piece)
    return True


def _segments(shown) -> list[list[str]]:
    segments, current = [], []
    for s in shown:
        if s.strip() == "...":
            if current:
                segments.append(current)
            current = []
        else:
            current.append(s)
    if current:
        segments.append(current)
    return segments


def mismatch(shown, real_lines) -> str | None:
    """None when the output holds the lines shown; else a message naming the first line
    that could not be found and what the output has there."""
    at = 0
    for segment in _segments(shown):
        best, best_pos = -1, at
        for pos in range(at, len(real_lines) - len(segment) + 1):
            n = 0
            while n < len(segment) and line_matches(segment[n], real_lines[pos + n]):
                n += 1
            if n == len(segment):
                best = None
                at = pos + n
                break
            if n > best:
                best, best_pos = n, pos
        if best is None:
            continue
        if best <= 0:
            return f"line not found in the output (after output line {at}):\n  {segment[0]!r}"
        got = real_lines[best_pos + best] if best_pos + best < len(real_lines) else "<end>"
        return (f"after {best} matching line(s), the document shows\n  {segment[best]!r}\n"
                f"where the output (line {best_pos + best + 1}) has\n  {got!r}")
    return None


def _markdown_files() -> list[Path]:
    return [ROOT / "README.md", *sorted((ROOT / "docs").rglob("*.md"))]


README = [e for e in examples_in(ROOT / "README.md")]
DOCS = [e for p in _markdown_files()[1:] for e in examples_in(p)]


def _run(example: Example, monkeypatch):
    monkeypatch.setenv("COLUMNS", COLUMNS)
    monkeypatch.chdir(ROOT)
    from cli_run import run

    argv = shlex.split(example.command)
    assert argv[0] == "swingcalc", example.id
    assert not {"-o", "--output", "--cycles-file", "--history-file"} & set(argv), (
        f"{example.id}: a documented example must not write files")
    return run(*argv[1:])


def _check(example: Example, monkeypatch) -> None:
    code, out, err = _run(example, monkeypatch)
    shows_error = any(s.startswith("swingcalc: ") for s in example.shown)
    if not shows_error:
        assert code == 0, f"{example.id}\nexit status {code}:\n{err}"
    real = (out + err).splitlines()
    problem = mismatch(example.shown, real)
    if problem:
        listing = "\n".join(real[:60]) + ("\n[...]" if len(real) > 60 else "")
        pytest.fail(f"$ {example.command}\n({example.path}, line {example.line})\n{problem}\n"
                    f"--- the output at {COLUMNS} columns:\n{listing}", pytrace=False)


@pytest.mark.parametrize("example", README, ids=[e.id for e in README])
def test_readme_example_prints_what_the_readme_shows(example, monkeypatch):
    _check(example, monkeypatch)


@pytest.mark.slow
@pytest.mark.parametrize("example", DOCS, ids=[e.id for e in DOCS])
def test_docs_example_prints_what_the_page_shows(example, monkeypatch):
    _check(example, monkeypatch)


def test_the_readme_and_the_worked_examples_have_examples_to_check():
    """The collector finds blocks (a change in its rules must not make the test vacuous)."""
    assert len(README) >= 8
    pages = {e.path for e in DOCS}
    assert any(p.startswith("docs/examples/") for p in pages)


def test_cli_reference_is_current():
    """docs/cli.md is what the generator writes for the app as it is now."""
    from swingcalc.cli.reference import reference

    path = ROOT / "docs" / "cli.md"
    assert path.exists(), f"docs/cli.md is missing: run {REGENERATE}"
    if path.read_text(encoding="utf-8") != reference():
        pytest.fail(f"docs/cli.md is stale (the commands or their help changed): run\n"
                    f"    {REGENERATE}", pytrace=False)


def test_cli_reference_lists_every_command_and_option():
    """Each command of the app and each of its options appears in the reference."""
    import typer.main

    from swingcalc.cli.app import app
    from swingcalc.cli.reference import reference

    text = reference()
    root = typer.main.get_command(app)
    for name, command in root.commands.items():
        assert f"## `swingcalc {name}`" in text, name
        for p in command.params:
            if p.param_type_name == "option":
                assert f"`{p.opts[0]}`" in text, (name, p.opts[0])


# The matcher itself: it must be able to fail.

@pytest.mark.parametrize("shown, real, ok", [
    ("a  1", "a  1   ", True),                  # trailing whitespace ignored
    ("a  1", "a 1", False),                     # inner spacing is part of the line
    ("  - Idealised ...", "  - Idealised model: rigid", True),
    ("  - Idealised ...", "  - Ideal", False),
    (" x ... y ... z", " x 1 y 2 z", True),
    (" x ... y ... z", " x 1 z 2 y", False),
    ("... y", "x y", True),
])
def test_line_matcher(shown, real, ok):
    assert line_matches(shown, real) is ok


def test_block_matcher_needs_consecutive_lines_unless_elided():
    real = ["title", "", "a", "b", "c", "d"]
    assert mismatch(["a", "b"], real) is None
    assert mismatch(["a", "c"], real) is not None
    assert mismatch(["a", "...", "c"], real) is None
    assert mismatch(["c", "...", "a"], real) is not None
    assert "'x'" in mismatch(["a", "x"], real)
