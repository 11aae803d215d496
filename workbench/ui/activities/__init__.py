"""The Activities table: the plan's rows, editing, filtering, pasting and the predecessor picker."""

from __future__ import annotations

__all__ = ['ActivitiesPanel']


def __getattr__(name: str):
    """The names other rooms use, imported on first use (importing the package stays cheap)."""
    if name == 'ActivitiesPanel':
        from .panel import ActivitiesPanel
        return ActivitiesPanel
    raise AttributeError(f"module {__name__!r} has no attribute {name!r}")
