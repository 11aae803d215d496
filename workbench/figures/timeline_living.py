"""Timeline marks of the living schedule: the compared baseline as a thin bar beneath each
activity's bar, the work done so far, and a mark where an activity now finishes after its
baseline finish. Geometry only (plan offsets and rows), shared by screen and paper."""

from __future__ import annotations

import numpy as np

from workbench.core.progress_fields import DONE, IN_PROGRESS
from workbench.core.variance import working_between

EPS = 1e-9
LIVING_KINDS = ("baseline", "done", "slipped")


def living_marks(analysis, variance, rows: np.ndarray, idx: np.ndarray, marks_class) -> dict:
    """``baseline``: baseline start → finish per activity in it; ``done``: actual start →
    actual finish (done) or → the status offset (in progress); ``slipped``: a point at the
    current finish of activities finishing later than in the baseline."""
    out = {k: marks_class.empty() for k in LIVING_KINDS}
    frame = analysis.progress
    if frame is not None:
        state = frame.state[idx]
        end = np.where(state == DONE, frame.actual_finish[idx], frame.status_offset)
        keep = (state == DONE) | (state == IN_PROGRESS)
        out["done"] = marks_class(rows, frame.actual_start[idx], end, idx).take(keep & (end > frame.actual_start[idx] + EPS))
    if variance is not None:
        out["baseline"], out["slipped"] = _baseline_marks(analysis, variance, rows, idx, marks_class)
    return out


def _baseline_marks(analysis, variance, rows, idx, marks_class):
    """Baseline dates as offsets of today's calendar (a start at the beginning of its day,
    a finish at the end of its day; a milestone at the end of its day)."""
    cal = analysis.calendar
    known = np.array([variance.baseline_start[i] is not None for i in idx.tolist()], dtype=bool)
    start, finish = np.zeros(idx.size), np.zeros(idx.size)
    if known.any():
        k, first = idx[known].tolist(), cal.start_dates([0.0])[0]
        days_s = np.array([variance.baseline_start[i] for i in k], dtype="datetime64[D]")
        days_f = np.array([variance.baseline_finish[i] for i in k], dtype="datetime64[D]") + np.timedelta64(1, "D")
        start[known] = working_between(cal, np.full(len(k), first), days_s)
        finish[known] = working_between(cal, np.full(len(k), first), days_f)
    milestone = analysis.schedule.durations[idx] <= EPS
    start = np.where(milestone, finish, start)
    base = marks_class(rows, start, finish, idx).take(known)
    late = np.nan_to_num(variance.finish[idx], nan=0.0) > EPS
    ef = analysis.schedule.ef[idx]
    return base, marks_class(rows, ef, ef, idx).take(late)
