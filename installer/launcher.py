"""Entry script of the frozen app. One script serves both executables of the folder:
``slackline-gui`` (windowed, no console on Windows) opens the window, ``slackline`` runs the
verbs, ``--version`` and ``--self-test``. The executable's own name chooses."""

from __future__ import annotations

import os
import sys
from pathlib import Path


def _quiet_streams() -> None:
    """A windowed build on Windows has no console: sys.stdout/sys.stderr are None and any
    message would raise. Send them to a log file in the user's data folder instead."""
    if sys.stdout is not None and sys.stderr is not None:
        return
    try:
        from platformdirs import user_log_dir

        folder = Path(user_log_dir("Slackline", "Slackline"))
        folder.mkdir(parents=True, exist_ok=True)
        stream = open(folder / "slackline-gui.log", "a", encoding="utf-8", buffering=1)
    except OSError:
        stream = open(os.devnull, "w", encoding="utf-8")
    sys.stdout = sys.stdout or stream
    sys.stderr = sys.stderr or stream


def _is_gui() -> bool:
    return Path(sys.executable).stem.lower().endswith("-gui")


def run() -> int:
    if _is_gui():
        _quiet_streams()
        from workbench.cli import gui_main
        return gui_main()
    from workbench.cli import main
    return main()


if __name__ == "__main__":
    sys.exit(run())
