"""The Odds view and the living schedule: the odds trend under the curves, 'from the status
date', and a finished run recorded as the trend point of the status date."""

from __future__ import annotations

from PySide6.QtCore import QTimer

from workbench.core.baseline import approved, make_trend_point
from workbench.core.formatting import format_date


def status_note(analysis) -> str:
    """A line for the headline: where the forecast starts (empty without progress)."""
    frame = analysis.progress if analysis is not None else None
    if frame is None:
        return ""
    return (f"<div style='color:#009E73'><b>From the status date {format_date(frame.status_date)}</b>: "
            f"actual dates are fixed; only the remaining work is uncertain.</div>")


def show_trend(view) -> None:
    """Show the trend chart when the plan has trend points or an approved baseline."""
    plan = view.session.plan
    base = approved(plan.baselines)
    shown = bool(plan.odds_trend) or base is not None
    view.trend.setVisible(shown)
    if shown:
        view.trend.show_trend(plan.odds_trend, float(plan.settings.target_confidence), base)
        if not getattr(view, "_trend_shared", False):   # the curves keep the larger share
            view._trend_shared = True
            QTimer.singleShot(0, lambda: _share(view.charts))


ROOM_PX = 560     # below this the curves take the whole height; the trend waits behind the handle


def _share(charts) -> None:
    height = max(sum(charts.sizes()), 1)
    trend = 0 if height < ROOM_PX else height - int(height * 0.62)
    charts.setSizes([height - trend, trend])


def record_run(session, result) -> None:
    """A run from a status date becomes that date's odds trend point (one undo step)."""
    from workbench.io.planfile import plan_hash

    analysis = session.analysis
    if analysis is None or analysis.progress is None:
        return
    session.record_trend(make_trend_point(analysis, result, plan_hash(session.plan)))
