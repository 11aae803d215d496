"""The Drivers view: which activities drive the schedule risk (criticality and sensitivity)."""

from __future__ import annotations

__all__ = ['DriversView']


def __getattr__(name: str):
    """The names other rooms use, imported on first use (importing the package stays cheap)."""
    if name == 'DriversView':
        from .view import DriversView
        return DriversView
    raise AttributeError(f"module {__name__!r} has no attribute {name!r}")
