"""What the Timeline says while a bar's end is dragged: the new length and the new
finish date, in the words and date format used everywhere else. No Qt.

The dragged length itself is found by :func:`workbench.figures.timeline.dragged_estimate`
(snapped to the plan's resolution); this module only words the result.
"""

from __future__ import annotations

from workbench.core.formatting import format_date, format_duration, format_number


def drag_readout(calendar, unit: str, before, after, early_start: float) -> list[str]:
    """Lines for a bar dragged from activity ``before`` to ``after`` (same activity, new
    fields), starting at offset ``early_start``: the length (te for an estimate), the most
    likely value when that is what moves (and the pessimistic one when it widens), and the
    date the activity would then finish."""
    was, now = before.mean, after.mean
    label = "te " if after.has_estimate else ""
    lines = [f"{label}{format_duration(now, unit)} (was {format_number(was)})"]
    if after.has_estimate and after.most_likely != before.most_likely:
        lines.append(f"most likely {format_number(after.most_likely, 2)} (was {format_number(before.most_likely, 2)})")
    if after.has_estimate and after.pessimistic != before.pessimistic:     # widened to the most likely
        lines.append(f"pessimistic {format_number(after.pessimistic, 2)} (was {format_number(before.pessimistic, 2)})")
    lines.append(f"finishes {format_date(finish_day(calendar, early_start, now))}")
    return lines


def finish_day(calendar, early_start: float, length: float):
    """The calendar day an activity starting at ``early_start`` and lasting ``length``
    plan units ends on (a zero length is dated the day it starts, like a milestone)."""
    if length <= 1e-9:
        return calendar.start_date(early_start)
    return calendar.finish_date(early_start + length)
