"""Terminal rendering of a report with rich. rich is imported only here, when a table is
shown on the screen; consoles are built when needed so they pick up the current width."""

from __future__ import annotations

import os

__all__ = ["print_report", "print_error"]


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
        console.print(_table(t, Table, box))
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


def _table(t, Table, box):
    """A rich table whose columns are never narrower than their values: long headings
    wrap onto several lines instead (units on a line of their own)."""
    import textwrap

    heads, rows = t.text_grid()
    lead = 2 if t.transpose else 1
    if not t.transpose:
        cols = [c for c in t.columns if c.in_text]
        heads = [(c.label, c.unit) for c in cols]
    else:
        heads = [(h, "") for h in heads]
    table = Table(title=t.title, title_justify="left", title_style="bold",
                  box=box.SIMPLE_HEAD, pad_edge=False)
    for j, (label, unit) in enumerate(heads):
        width = max([len(r[j]) for r in rows] + [len(unit) + 2 if unit else 0, 6])
        text = label if t.transpose else textwrap.fill(label, width=max(width, 10))
        if unit:
            text += f"\n[{unit}]"
        table.add_column(text.replace("[", "\\["), justify="left" if j < lead else "right",
                         style="dim" if (t.transpose and j == 1) else None,
                         no_wrap=True, min_width=width if j >= lead or not t.transpose else None)
    for r in rows:
        table.add_row(*r)
    return table


def _bullets(Table, head: str, style: str, texts):
    grid = Table(title=head, title_justify="left", title_style=style, box=None,
                 show_header=False, pad_edge=False, padding=(0, 1, 0, 0))
    grid.add_column(no_wrap=True)
    grid.add_column(overflow="fold")
    for text in texts:
        grid.add_row("  -", text)
    return grid
