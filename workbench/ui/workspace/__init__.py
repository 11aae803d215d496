"""The workspace: the main window, menus, files, session recovery, locks, single instance and dialogs."""

from __future__ import annotations

__all__ = ['MainWindow', 'run_app']


def __getattr__(name: str):
    """The names other rooms use, imported on first use (importing the package stays cheap)."""
    if name == 'MainWindow':
        from .window import MainWindow
        return MainWindow
    if name == 'run_app':
        from .app import run_app
        return run_app
    raise AttributeError(f"module {__name__!r} has no attribute {name!r}")
