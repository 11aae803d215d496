"""Bringing one activity's row on screen (asked for from another view's menu)."""

from __future__ import annotations


def show_activity(view, act_id: str) -> None:
    """Scroll ``view`` (a TimelineView; same zoom) so the row of ``act_id`` is on screen,
    opening its group when it is folded."""
    geo = view.geometry
    if geo is not None and act_id not in geo.row_of:
        group = view.session.plan.activity(act_id).group
        if group in view.collapsed:
            view.toggle_group(group)
        geo = view.geometry
    if geo is None or act_id not in geo.row_of:
        return
    row = geo.row_of[act_id]
    _, (y0, y1) = view.view_box.viewRange()
    if not y0 + 0.5 <= row <= y1 - 0.5:
        view.view_box.translateBy(y=row - (y0 + y1) / 2)
