"""Re-align the example blocks of the docs after a change of column widths.

Run:  python tests/refresh_doc_blocks.py [FILE.md ...]   (default: README.md and docs/)

A label that grows widens its whole column, so every shown line of a block can stop
matching although no value changed. For each example this re-runs the command at the
width tests/test_docs.py uses and replaces each shown line by the output line that is the
same text with other spacing. Lines whose words or values changed are left alone and
listed: those need a person to read the new output and rewrite the prose around it.
"""

from __future__ import annotations

import os
import shlex
import subprocess
import sys
from pathlib import Path

sys.path.insert(0, str(Path(__file__).parent))
from test_docs import COLUMNS, ROOT, _markdown_files, examples_in  # noqa: E402


def _words(line: str) -> str:
    return " ".join(line.split())


def refresh(path: Path) -> list[str]:
    lines = path.read_text(encoding="utf-8").splitlines(keepends=True)
    left = []
    for ex in examples_in(path):
        env = dict(os.environ, COLUMNS=COLUMNS)
        out = subprocess.run([sys.executable, "-m", "swingcalc", *shlex.split(ex.command)[1:]],
                             cwd=ROOT, env=env, capture_output=True, text=True).stdout
        real = {_words(r): r.rstrip() for r in out.splitlines() if r.strip()}
        # the shown lines follow the command line in the file, in order
        at = ex.line
        for shown in ex.shown:
            while at < len(lines) and lines[at].rstrip("\n").rstrip() != shown:
                at += 1
            if at >= len(lines) or shown.strip() == "..." or "..." in shown or not shown:
                continue
            new = real.get(_words(shown))
            if new is None:
                if shown not in out:
                    left.append(f"{path.relative_to(ROOT)}:{at + 1}: {shown.strip()}")
            elif new != shown:
                lines[at] = new + "\n"
            at += 1
    path.write_text("".join(lines), encoding="utf-8")
    return left


def main(argv: list[str]) -> int:
    files = [Path(a).resolve() for a in argv] or _markdown_files()
    left = [item for f in files for item in refresh(f)]
    for item in left:
        print(f"changed, not only re-spaced: {item}")
    return 1 if left else 0


if __name__ == "__main__":
    raise SystemExit(main(sys.argv[1:]))
