"""The Trade-off view: what it costs to buy time (the cost curve, and the crash to a confidence)."""

from __future__ import annotations

__all__ = ['TradeoffView']


def __getattr__(name: str):
    """The names other rooms use, imported on first use (importing the package stays cheap)."""
    if name == 'TradeoffView':
        from .view import TradeoffView
        return TradeoffView
    raise AttributeError(f"module {__name__!r} has no attribute {name!r}")
