"""The checkup's view of progress and the approved baseline, and the metrics that need them.

CONNECTION POINT. Progress (actual dates) and baselines come with the living-schedule work,
which is not in this model yet. :func:`progress_facts` is the only place that reads them,
through ``getattr`` with defaults, so today every activity reads as not started and there
is no approved baseline, and the metrics below report "needs a status date and an approved
baseline". When the model gains them, adapt :func:`_actual` and :func:`_baseline_finishes`
to its field names; nothing else needs to change. What it reads:

- ``plan.settings.status_date`` (exists): progress is known to the end of that day;
- per activity ``actual_start`` / ``actual_finish`` (a date or an offset, or None);
- ``plan.baselines``: objects with ``approved`` (bool) and per-activity finishes
  (``finishes``: a mapping id → date or offset, or ``activities``: id → object with ``finish``).

Metrics of the DCMA 14-point assessment (DCMA-EA PAM 200.1, Oct 2012, §4) [memory]:
invalid dates, missed tasks and the baseline execution index.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from .checkup_limits import differs
from .checkup_result import FAIL, NA, PASS, Check

NEEDS = "needs a status date and an approved baseline"
EPS = 1e-9


@dataclass(frozen=True)
class ProgressFacts:
    status_offset: float | None            # end of the status date, in plan units
    tracked: bool                          # the model carries actual dates at all
    actual_start: np.ndarray               # offsets, NaN where none
    actual_finish: np.ndarray
    baseline_finish: np.ndarray | None     # approved baseline's finish offsets (NaN: not in it)

    @property
    def done(self) -> np.ndarray:
        return ~np.isnan(self.actual_finish)

    @property
    def has_progress(self) -> bool:
        return self.status_offset is not None and self.tracked

    @property
    def has_baseline(self) -> bool:
        return self.has_progress and self.baseline_finish is not None


def progress_facts(plan, calendar) -> ProgressFacts:
    """Status date, actual dates and the approved baseline's finishes of ``plan``."""
    acts = plan.activities
    status = plan.settings.status_date
    offset = None if status is None else calendar.resolve(status, finish=True)
    tracked = any(hasattr(a, "actual_start") or hasattr(a, "actual_finish") for a in acts[:1])
    if tracked:
        starts = np.array([_actual(calendar, a, "actual_start", False) for a in acts], dtype=float)
        finishes = np.array([_actual(calendar, a, "actual_finish", True) for a in acts], dtype=float)
    else:
        starts = finishes = np.full(len(acts), np.nan)
    baseline = _approved(plan)
    base = None if baseline is None else _baseline_finishes(baseline, plan.ids(), calendar)
    return ProgressFacts(offset, tracked, starts, finishes, base)


def _actual(calendar, act, name: str, finish: bool) -> float:
    value = getattr(act, name, None)
    return np.nan if value is None else float(calendar.resolve(value, finish=finish))


def _approved(plan):
    for baseline in getattr(plan, "baselines", None) or ():
        if getattr(baseline, "approved", False):
            return baseline
    return None


def _baseline_finishes(baseline, ids: list[str], calendar) -> np.ndarray:
    table = getattr(baseline, "finishes", None)
    if table is None:
        table = {k: getattr(v, "finish", None) for k, v in (getattr(baseline, "activities", None) or {}).items()}
    out = np.full(len(ids), np.nan)
    for i, act_id in enumerate(ids):
        value = table.get(act_id)
        if value is not None:
            out[i] = calendar.resolve(value, finish=True)
    return out


# --- metrics ------------------------------------------------------------------------
def _not_applicable(check_id: str, name: str, threshold: str, source: str) -> Check:
    return Check(check_id, name, NA, None, threshold, "not applicable", [], NEEDS.capitalize() + ".", source)


def invalid_dates(frame) -> Check:
    """Actual dates after the status date; forecast (early) dates of unfinished work before it."""
    from .checkup_frame import count_check
    facts = frame.progress
    if not facts.has_progress:
        return _not_applicable("invalid_dates", "Invalid dates", f"<= {frame.limit('invalid_dates_count'):g}",
                               "DCMA-EA PAM 200.1 (Oct 2012) \u00a74")
    status, s = facts.status_offset, frame.schedule
    future_actual = (facts.actual_start >= status - EPS) | (facts.actual_finish > status + EPS)
    not_started = np.isnan(facts.actual_start)
    past_forecast = frame.incomplete & ((not_started & (s.es < status - EPS)) | (s.ef <= status - EPS))
    bad = frame.ids_of(future_actual | past_forecast)
    return count_check(frame, "invalid_dates", "Invalid dates", bad, "invalid_dates_count",
                       "activities with an actual date after the status date or a forecast before it")


def _due(frame) -> np.ndarray:
    facts = frame.progress
    return facts.baseline_finish <= facts.status_offset + EPS


def missed_activities(frame) -> Check:
    """Activities the approved baseline had finished by the status date that did not finish
    by their baseline finish."""
    from .checkup_frame import share_check
    facts = frame.progress
    if not facts.has_baseline:
        return _not_applicable("missed_activities", "Missed tasks",
                               f"<= {frame.limit('missed_activities_pct'):g} %", "DCMA-EA PAM 200.1 (Oct 2012) \u00a74")
    due = _due(frame)
    on_time = facts.actual_finish <= facts.baseline_finish + EPS
    missed = due & ~on_time
    return share_check(frame, "missed_activities", "Missed tasks", int(missed.sum()), int(due.sum()),
                       "missed_activities_pct", "due by the status date", frame.ids_of(missed))


def bei(frame) -> Check:
    """Baseline execution index: activities finished by the status date / activities the
    approved baseline had finished by then."""
    from .checkup_frame import _source
    facts = frame.progress
    limit = frame.limit("bei_min")
    if not facts.has_baseline or not _due(frame).any():
        check = _not_applicable("bei", "Baseline execution index (BEI)", f">= {limit:g}", _source("bei_min"))
        if facts.has_baseline:
            check.note = "No activity was due to finish by the status date."
        return check
    due = _due(frame)
    in_baseline = ~np.isnan(facts.baseline_finish)
    finished = in_baseline & facts.done & (facts.actual_finish <= facts.status_offset + EPS)
    value = float(finished.sum()) / float(due.sum())
    offenders = frame.ids_of(due & ~finished)
    return Check("bei", "Baseline execution index (BEI)", PASS if value >= limit - 1e-9 else FAIL, value,
                 f">= {limit:g}", f"{value:.2f} ({int(finished.sum())} finished of {int(due.sum())} due)",
                 offenders, "", _source("bei_min"), changed=differs("bei_min", limit))
