"""The progress and baseline fields of ``slackline analyze --json`` (see docs/progress.md)."""

from __future__ import annotations

import numpy as np

from .calendar import round_offset
from .progress_fields import DONE


def _offsets(values: np.ndarray) -> list:
    return [None if np.isnan(v) else round_offset(v) for v in values.tolist()]


def progress_columns(analysis) -> dict[str, list]:
    """Per activity: state, actual_start/actual_finish (offsets or None), remaining_mean."""
    n, frame = len(analysis.schedule.ids), analysis.progress
    means = np.asarray(analysis.means, dtype=float)
    if frame is None:
        return {"state": ["not started"] * n, "actual_start": [None] * n, "actual_finish": [None] * n,
                "remaining_mean": [round_offset(x) for x in means.tolist()]}
    remaining = np.where(frame.state == DONE, 0.0, means)
    return {"state": frame.state_names(), "actual_start": _offsets(frame.actual_start),
            "actual_finish": _offsets(frame.actual_finish),
            "remaining_mean": [round_offset(x) for x in remaining.tolist()]}


def variance_columns(variance) -> dict[str, list]:
    """Per activity: baseline_start/baseline_finish (dates or None) and the variances."""
    def iso(days):
        return [None if d is None else d.isoformat() for d in days]
    return {"baseline_start": iso(variance.baseline_start), "baseline_finish": iso(variance.baseline_finish),
            "start_variance": _offsets(variance.start), "finish_variance": _offsets(variance.finish)}


def progress_top(analysis, variance) -> dict:
    """Top-level fields: the status date and offset, the rule, warnings, the baseline compared."""
    frame = analysis.progress
    top = {"status_date": None if frame is None else frame.status_date.isoformat(),
           "status_offset": None if frame is None else round_offset(frame.status_offset),
           "progress_rule": analysis.plan.settings.progress_rule,
           "warnings": [] if frame is None else list(frame.warnings)}
    if variance is not None:
        top["baseline"] = variance.baseline.name
        top["baseline_finish"] = variance.baseline.finish.isoformat()
        top["finish_variance"] = round_offset(variance.finish_variance)
    else:
        top["baseline"] = top["baseline_finish"] = top["finish_variance"] = None
    return top
