"""The Timeline: the Gantt chart of the schedule with slack lines, on screen, printed and exported."""

from __future__ import annotations

__all__ = ['TimelineView']


def __getattr__(name: str):
    """The names other rooms use, imported on first use (importing the package stays cheap)."""
    if name == 'TimelineView':
        from .view import TimelineView
        return TimelineView
    raise AttributeError(f"module {__name__!r} has no attribute {name!r}")
