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

The metrics that read them are in :mod:`.checkup_status`.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np


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
    tracked = bool(acts) and (hasattr(acts[0], "actual_start") or hasattr(acts[0], "actual_finish"))
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
