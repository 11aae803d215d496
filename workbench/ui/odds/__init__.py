"""The Odds view: PERT and simulated chances of the deadline, the S-curve and histogram, and the simulation runner."""

from __future__ import annotations

__all__ = ['OddsView']


def __getattr__(name: str):
    """The names other rooms use, imported on first use (importing the package stays cheap)."""
    if name == 'OddsView':
        from .view import OddsView
        return OddsView
    raise AttributeError(f"module {__name__!r} has no attribute {name!r}")
