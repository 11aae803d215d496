"""Variance against a baseline: what moved, what was added, removed or re-estimated. No Qt.

Start and finish variances are counted in working time (plan units) on the plan's
current calendar, from the baseline's date to today's forecast date: positive = later
than the baseline. A finish is compared at the end of its day, a start at its beginning.
"""

from __future__ import annotations

from dataclasses import dataclass, field

import numpy as np

from .baseline import Baseline, planned_dates


@dataclass
class Variance:
    baseline: Baseline
    ids: list[str]                  # the current plan's activities, in plan order
    baseline_start: list            # per activity (plan order): a date, or None when not in it
    baseline_finish: list
    start: np.ndarray               # plan units, NaN where the activity is not in the baseline
    finish: np.ndarray
    finish_variance: float          # of the project finish
    added: list[str] = field(default_factory=list)
    removed: list[str] = field(default_factory=list)
    re_estimated: list[tuple[str, tuple, tuple]] = field(default_factory=list)  # id, then, now
    links_added: list = field(default_factory=list)
    links_removed: list = field(default_factory=list)

    def slipped(self, limit: int = 10) -> list[tuple[str, float]]:
        """Activities whose finish moved later, most first (id, finish variance)."""
        ids = self.ids
        order = np.argsort(-np.nan_to_num(self.finish, nan=-np.inf), kind="stable")
        return [(ids[i], float(self.finish[i])) for i in order[:limit] if self.finish[i] > 1e-9]


def working_between(calendar, first, second) -> np.ndarray:
    """Working time from the start of each ``first`` day to the start of each ``second``
    day, in plan units (negative when ``second`` is earlier)."""
    a = np.asarray(first, dtype="datetime64[D]")
    b = np.asarray(second, dtype="datetime64[D]")
    lo, hi = np.minimum(a, b), np.maximum(a, b)
    n = np.busday_count(lo, hi, busdaycal=calendar.busdaycal)
    return np.where(b >= a, n, -n) / calendar.per_unit


def variance_against(analysis, baseline: Baseline) -> Variance:
    """Per activity start/finish variance and the project's, with the plan changes."""
    plan, cal = analysis.plan, analysis.calendar
    ids = plan.ids()
    then = {a.id: a for a in baseline.activities}
    start, finish = planned_dates(analysis)
    rows = [i for i, x in enumerate(ids) if x in then]
    b_start = [then[x].start if x in then else None for x in ids]
    b_finish = [then[x].finish if x in then else None for x in ids]
    sv, fv = np.full(len(ids), np.nan), np.full(len(ids), np.nan)
    if rows:
        one = np.timedelta64(1, "D")
        sv[rows] = working_between(cal, [b_start[i] for i in rows], start[rows])
        fv[rows] = working_between(cal, np.array([b_finish[i] for i in rows], "datetime64[D]") + one, finish[rows] + one)
    project = float(working_between(cal, [baseline.finish], [analysis.finish_date])[0])
    out = Variance(baseline, ids, b_start, b_finish, _clean(sv), _clean(fv), project)
    _changes(out, plan, then)
    return out


def _clean(values: np.ndarray) -> np.ndarray:
    values[values == 0] = 0.0
    return values


def _changes(out: Variance, plan, then: dict) -> None:
    now = {a.id for a in plan.activities}
    out.added = [a.id for a in plan.activities if a.id not in then]
    out.removed = [a.id for a in out.baseline.activities if a.id not in now]
    for act in plan.activities:
        old = then.get(act.id)
        new = (act.optimistic, act.most_likely, act.pessimistic, act.duration)
        if old is not None and old.estimate() != new:
            out.re_estimated.append((act.id, old.estimate(), new))
    before = {(l.pred, l.succ, l.type, float(l.lag)) for l in out.baseline.links}
    after = {(l.pred, l.succ, l.type, float(l.lag)) for l in plan.links}
    out.links_added = sorted(after - before)
    out.links_removed = sorted(before - after)
