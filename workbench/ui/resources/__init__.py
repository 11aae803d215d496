"""The Resources view: loading against availability, levelling, and odds with the crews."""

from __future__ import annotations

__all__ = ['ResourcesView']


def __getattr__(name: str):
    """The names other rooms use, imported on first use (importing the package stays cheap)."""
    if name == 'ResourcesView':
        from .view import ResourcesView
        return ResourcesView
    raise AttributeError(f"module {__name__!r} has no attribute {name!r}")
