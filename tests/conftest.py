"""Test set-up shared by the suite.

CLI tests: typer/rich must not emit colour or terminal features, and the console width
must be fixed before the app (and any rich console) is imported.
"""

import os

os.environ["_TYPER_FORCE_DISABLE_TERMINAL"] = "1"
os.environ["COLUMNS"] = "200"
os.environ.setdefault("NO_COLOR", "1")
