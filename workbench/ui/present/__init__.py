"""Present mode: the views as large slides for a projector, stepped with a clicker."""

from __future__ import annotations

__all__ = ['open_present']


def __getattr__(name: str):
    """The names other rooms use, imported on first use (importing the package stays cheap)."""
    if name == 'open_present':
        from .window import open_present
        return open_present
    raise AttributeError(f"module {__name__!r} has no attribute {name!r}")
