"""The Network: the activity-on-node diagram, on screen, printed and exported."""

from __future__ import annotations

__all__ = ['NetworkView']


def __getattr__(name: str):
    """The names other rooms use, imported on first use (importing the package stays cheap)."""
    if name == 'NetworkView':
        from .view import NetworkView
        return NetworkView
    raise AttributeError(f"module {__name__!r} has no attribute {name!r}")
