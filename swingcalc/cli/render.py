"""Terminal rendering of a report with rich. rich is imported only here, when a table is
shown on the screen; consoles are built when needed so they pick up the current width."""

from __future__ import annotations

import os

__all__ = ["print_report"]


def _console(stderr: bool = False):
    from rich.console import Console

    width = None
    cols = os.environ.get("COLUMNS", "")
    if cols.isdigit():
        width = int(cols)
    return Console(stderr=stderr, width=width, highlight=False, soft_wrap=False)


def print_report(report) -> None:
    """Show ``report`` as rich tables on standard output."""
    from rich import box
    from rich.table import Table
    from rich.text import Text

    console = _console()
    console.print(Text(report.title, style="bold"))
    console.print()
    items = report.inputs + report.summary
    if items:
        grid = Table(box=None, show_header=False, pad_edge=False, padding=(0, 2, 0, 0))
        grid.add_column(style="dim", no_wrap=True)
        grid.add_column(overflow="fold")
        for i, item in enumerate(items):
            if i == len(report.inputs) and report.inputs:
                grid.add_row("", "")
            grid.add_row(item.label, item.shown)
        console.print(grid)
        console.print()
    for t in report.tables:
        for table in _tables(t, Table, box, console.width):
            console.print(table)
    for note in report.notes:
        style = "dim"
        if note.startswith("Verdict"):
            style = "bold red" if "NOT" in note else "bold green"
        console.print(Text(note, style=style))
        console.print()
    if report.warnings:
        console.print(_bullets(Table, "WARNING", "bold yellow", report.warnings))
        console.print()
    if report.cautions:
        console.print(_bullets(Table, "CAUTION", "bold red", report.cautions))


def _tables(t, Table, box, console_width: int):
    """Rich tables for one report table. Columns are never narrower than their values:
    long headings wrap instead (units on a line of their own), and when the columns do not
    fit the screen they are split over several tables, each repeating the leading column(s)."""
    import textwrap

    heads, rows = t.text_grid()
    lead = 2 if t.transpose else 1
    if not t.transpose:
        heads = [(c.label, c.unit) for c in t.columns if c.in_text]
    else:
        heads = [(h, "") for h in heads]
    specs = []
    for j, (label, unit) in enumerate(heads):
        width = max([len(r[j]) for r in rows] + [len(unit) + 2 if unit else 0,
                                                  len(label) if t.transpose else 6])
        text = label if t.transpose else textwrap.fill(label, width=max(width, 10),
                                                           break_long_words=False)
        if unit:
            text += f"\n[{unit}]"
        width = max(width, *(len(line) for line in text.splitlines()))
        specs.append((text.replace("[", "\\["), width))
    chunks, current, used = [], [], sum(w + 3 for _, w in specs[:lead])
    for j in range(lead, len(specs)):
        w = specs[j][1] + 3  # padding 1 + 1 and the column divider
        if current and used + w > console_width:
            chunks.append(current)
            current, used = [], sum(w2 + 3 for _, w2 in specs[:lead])
        current.append(j)
        used += w
    chunks.append(current)
    out = []
    for n, chunk in enumerate(chunks):
        idx = list(range(lead)) + chunk
        title = t.title if n == 0 else f"{t.title} (continued)"
        table = Table(title=title, title_justify="left", title_style="bold",
                      box=box.SIMPLE_HEAD, pad_edge=False)
        for j in idx:
            text, width = specs[j]
            table.add_column(text, justify="left" if j < lead else "right",
                             style="dim" if (t.transpose and j == 1) else None,
                             no_wrap=True, min_width=width)
        for r in rows:
            table.add_row(*[r[j] for j in idx])
        out.append(table)
    return out


def _bullets(Table, head: str, style: str, texts):
    grid = Table(title=head, title_justify="left", title_style=style, box=None,
                 show_header=False, pad_edge=False, padding=(0, 1, 0, 0))
    grid.add_column(no_wrap=True)
    grid.add_column(overflow="fold")
    for text in texts:
        grid.add_row("  -", text)
    return grid
