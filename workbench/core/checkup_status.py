"""The DCMA 14-point assessment's metrics on progress against the status date and the
approved baseline: invalid dates, missed tasks and the baseline execution index
(DCMA-EA PAM 200.1, EVMS Program Analysis Pamphlet, Defense Contract Management Agency,
October 2012, section 4; thresholds recalled [memory]). They read progress only through
:func:`.checkup_progress.progress_facts` (the connection point to the living schedule)."""

from __future__ import annotations

import numpy as np

from .checkup_frame import count_check, share_check, _source
from .checkup_limits import STANDARD_SHORT, differs
from .checkup_progress import EPS, NEEDS
from .checkup_result import FAIL, NA, PASS, Check


def _not_applicable(check_id: str, name: str, threshold: str, source: str) -> Check:
    return Check(check_id, name, NA, None, threshold, "not applicable", [], NEEDS.capitalize() + ".", source)


def invalid_dates(frame) -> Check:
    """Actual dates after the status date; forecast (early) dates of unfinished work before it."""
    facts = frame.progress
    if not facts.has_progress:
        return _not_applicable("invalid_dates", "Invalid dates", f"<= {frame.limit('invalid_dates_count'):g}",
                               STANDARD_SHORT)
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
    facts = frame.progress
    if not facts.has_baseline:
        return _not_applicable("missed_activities", "Missed tasks",
                               f"<= {frame.limit('missed_activities_pct'):g} %", STANDARD_SHORT)
    due = _due(frame)
    on_time = facts.actual_finish <= facts.baseline_finish + EPS
    missed = due & ~on_time
    return share_check(frame, "missed_activities", "Missed tasks", int(missed.sum()), int(due.sum()),
                       "missed_activities_pct", "due by the status date", frame.ids_of(missed))


def bei(frame) -> Check:
    """Baseline execution index: activities finished by the status date / activities the
    approved baseline had finished by then."""
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
