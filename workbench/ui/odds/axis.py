"""The Odds view's date axis: the shared plan-date axis (``ui/date_axis.py``)."""

from __future__ import annotations

from workbench.ui.date_axis import DateAxis as OddsAxis

__all__ = ["OddsAxis"]
