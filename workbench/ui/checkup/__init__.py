"""The Checkup view: is this schedule sound enough to sign? (schedule quality checks)."""

from __future__ import annotations

__all__ = ['CheckupView', 'checkup_keeper']


def __getattr__(name: str):
    """The names other rooms use, imported on first use (importing the package stays cheap)."""
    if name == 'CheckupView':
        from .view import CheckupView
        return CheckupView
    if name == 'checkup_keeper':
        from .keeper import checkup_keeper
        return checkup_keeper
    raise AttributeError(f"module {__name__!r} has no attribute {name!r}")
