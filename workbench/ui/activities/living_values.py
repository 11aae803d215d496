"""Values behind the Activities table's progress and baseline columns (read from core)."""

from __future__ import annotations


def progress_value(act, key: str):
    """The raw progress value of an editable progress column, for sorting and filters."""
    p = act.progress
    if p is None:
        return None
    if key == "remaining":
        return p.remaining_most_likely if p.has_remaining_estimate else p.remaining
    return getattr(p, key)


def living_columns(analysis, variance) -> dict[str, list]:
    """State per activity, and the compared baseline's dates and variances (None where the
    activity is not in it, or without a baseline)."""
    n = len(analysis.schedule.ids)
    frame = analysis.progress
    states = frame.state_names() if frame is not None else ["not started"] * n
    if variance is None:
        empty = [None] * n
        return {"state": states, "baseline_start": empty, "baseline_finish": empty,
                "start_variance": empty, "finish_variance": empty}
    return {"state": states, "baseline_start": variance.baseline_start, "baseline_finish": variance.baseline_finish,
            "start_variance": [float(x) for x in variance.start], "finish_variance": [float(x) for x in variance.finish]}
