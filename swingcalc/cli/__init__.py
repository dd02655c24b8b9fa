"""Command-line front end: one typer app (``app``), shared option parsers (``options``) and
the terminal rendering (``render``). It only parses, calls the library and formats."""
