"""Dragging a Timeline bar's end to change its length.

While the pointer moves, the bar is previewed at its new length (snapped to the plan's
resolution: whole working days, or a day's share of a week) and a note beside the end
says the new length and finish date. On release one edit is pushed (one undo step) and
the view stays exactly where it was, although the plan is analysed again. Escape
cancels: the plan stays as it was.
"""

from __future__ import annotations

from workbench.core.commands import EditActivity
from workbench.figures.timeline import bar_span, dragged_estimate
from workbench.figures.timeline_drag import drag_readout
from workbench.ui.timeline.drag_readout import DragReadout

GRAB_PX = 6.0          # how close to a bar's right end a press starts a duration drag


class BarDrag:
    """The drag in progress of one ``TimelineView`` (``view.bar_drag``)."""

    def __init__(self, view):
        self.view = view
        self.readout = DragReadout(view.plot.getPlotItem())
        self.active: tuple[str, int, float] | None = None    # activity id, row, early start

    def near_end(self, row: int, x: float) -> bool:
        """Is ``x`` (data units) within the grab zone of the row's bar end?"""
        span = bar_span(self.view.geometry, row)
        per_px = self.view.item.pixelWidth() or 0.0
        return span is not None and abs(x - span[1]) <= GRAB_PX * per_px

    def start(self, act_id: str, row: int) -> None:
        self.active = (act_id, row, bar_span(self.view.geometry, row)[0])

    def changes(self, x: float) -> tuple[dict, object]:
        """Field changes for the bar's end at ``x``, and the activity as it was."""
        act_id, _, es = self.active
        session = self.view.session
        act = session.plan.activity(act_id)
        per_unit = session.analysis.calendar.per_unit if session.analysis is not None else 1
        return dragged_estimate(act, x - es, resolution=1.0 / per_unit), act

    def move(self, x: float) -> float:
        """Preview the bar ending near ``x``; returns the dragged value (most likely or duration)."""
        act_id, row, es = self.active
        changes, act = self.changes(x)
        new = act.with_(**changes)
        self.view.item.set_preview((row, es, es + new.mean))
        analysis = self.view.session.analysis
        if analysis is not None:
            lines = drag_readout(analysis.calendar, analysis.plan.settings.unit, act, new, es)
            self.readout.show(es + new.mean, row, lines)
        return float(changes.get("most_likely", changes.get("duration")))

    def finish(self, x: float) -> tuple[str, float] | None:
        """Push the edit (one undo step) keeping the view where it is; returns (id, value)
        when the plan changed."""
        changes, act = self.changes(x)
        act_id = self.active[0]
        self.cancel()
        if all(getattr(act, k) == v for k, v in changes.items()):
            return None                        # released where it started: nothing to undo
        box = self.view.view_box
        held = box.viewRange()
        pushed = self.view.session.push(EditActivity(act_id, **changes))
        box.setRange(xRange=held[0], yRange=held[1], padding=0)   # no jump when the plan re-analyses
        if not pushed:
            return None
        return act_id, float(changes.get("most_likely", changes.get("duration")))

    def cancel(self) -> None:
        self.active = None
        self.view.item.set_preview(None)
        self.readout.hide()
