"""What happened to one activity so far: its progress record. Pure Python, no Qt.

An activity is *not started* (no actual start), *in progress* (an actual start, no actual
finish) or *done* (an actual finish). Actual dates are plan-unit offsets or calendar
dates, as constraints are. For work in progress, what remains is given in one of three
ways, checked in this order:

- a remaining three-point estimate (``remaining_optimistic``, ``remaining_most_likely``,
  ``remaining_pessimistic``);
- a remaining fixed duration (``remaining``);
- a percent complete pc (0–100): remaining = (1 − pc/100) × the activity's estimate,
  applied to each of the three points (or to the fixed duration). Percent complete is
  a share of the *duration*, not of cost or quantities.

With none of them, the whole estimate remains (as if 0 % complete) and the analysis
lists a warning naming the activity.
"""

from __future__ import annotations

import datetime as dt
import math
from dataclasses import dataclass, replace

from .errors import PlanError

NOT_STARTED, IN_PROGRESS, DONE = 0, 1, 2
STATE_NAMES = ("not started", "in progress", "done")
MAX_PROGRESS_UNITS = 1_000_000.0


# How messages name each field (the plan file's and the command line's words); a window
# passes its own column names to ``Progress.validated``. "remaining_estimate" names the
# three remaining points together.
FIELD_NAMES = {"actual_start": "actual start", "actual_finish": "actual finish",
               "remaining_optimistic": "remaining optimistic", "remaining_most_likely": "remaining most likely",
               "remaining_pessimistic": "remaining pessimistic", "remaining": "remaining duration",
               "percent_complete": "percent complete", "remaining_estimate": "remaining estimate"}


def _number(value, act_id: str, key: str, names: dict) -> float | None:
    if value is None:
        return None
    if isinstance(value, bool) or not isinstance(value, (int, float)):
        raise PlanError(f"activity {act_id}: {names[key]} must be a number, not {value!r}", act_id, key)
    value = float(value)
    if not math.isfinite(value) or abs(value) > MAX_PROGRESS_UNITS:
        raise PlanError(f"activity {act_id}: {names[key]} must be a finite number of plan units, not {value:g}",
                        act_id, key)
    return value


def _point(value, act_id: str, key: str, names: dict):
    if value is None or isinstance(value, dt.date):
        if isinstance(value, dt.datetime):
            raise PlanError(f"activity {act_id}: {names[key]} must be a date without a time", act_id, key)
        return value
    return _number(value, act_id, key, names)


@dataclass(frozen=True)
class Progress:
    """One activity's actuals and remaining work (see the module notes)."""

    actual_start: float | dt.date | None = None
    actual_finish: float | dt.date | None = None
    remaining_optimistic: float | None = None
    remaining_most_likely: float | None = None
    remaining_pessimistic: float | None = None
    remaining: float | None = None
    percent_complete: float | None = None

    @property
    def is_empty(self) -> bool:
        return (self.actual_start is None and self.actual_finish is None and self.remaining_optimistic is None
                and self.remaining_most_likely is None and self.remaining_pessimistic is None
                and self.remaining is None and self.percent_complete is None)

    @property
    def state(self) -> int:
        if self.actual_finish is not None:
            return DONE
        return IN_PROGRESS if self.actual_start is not None else NOT_STARTED

    @property
    def has_remaining_estimate(self) -> bool:
        return self.remaining_optimistic is not None

    @property
    def gives_remaining(self) -> bool:
        """Remaining work is stated in some form (three points, fixed or percent)."""
        return (self.remaining_optimistic is not None or self.remaining_most_likely is not None
                or self.remaining_pessimistic is not None or self.remaining is not None
                or self.percent_complete is not None)

    def with_(self, **changes) -> "Progress":
        return replace(self, **changes)

    def validated(self, act_id: str, names: dict | None = None) -> "Progress":
        """Self if consistent, else a PlanError naming the activity, what is wrong and (as
        ``field``) the field at fault. ``names`` overrides how fields are called (see
        ``FIELD_NAMES``). Checks needing the calendar or the status date are made by
        ``progress.frame``."""
        names = {**FIELD_NAMES, **(names or {})}
        _point(self.actual_start, act_id, "actual_start", names)
        _point(self.actual_finish, act_id, "actual_finish", names)
        a, m, b = (_number(getattr(self, k), act_id, k, names) for k in
                   ("remaining_optimistic", "remaining_most_likely", "remaining_pessimistic"))
        r = _number(self.remaining, act_id, "remaining", names)
        pc = _number(self.percent_complete, act_id, "percent_complete", names)
        if pc is not None and not 0.0 <= pc <= 100.0:
            raise PlanError(f"activity {act_id}: {names['percent_complete']} {pc:g} lies outside 0\u2013100", act_id,
                            "percent_complete")
        if self.actual_finish is not None and self.actual_start is None:
            raise PlanError(f"activity {act_id}: an {names['actual_finish']} needs an {names['actual_start']}", act_id,
                            "actual_finish")
        _check_order_same_kind(self.actual_start, self.actual_finish, act_id)
        _check_remaining_forms(a, m, b, r, pc, act_id)
        if self.gives_remaining:
            _check_remaining_allowed(self, pc, r, act_id, names)
        return self


def _check_order_same_kind(start, finish, act_id: str) -> None:
    if start is None or finish is None or isinstance(start, dt.date) != isinstance(finish, dt.date):
        return
    if finish < start:
        shown = (finish.isoformat(), start.isoformat()) if isinstance(start, dt.date) else (f"{finish:g}", f"{start:g}")
        raise PlanError(f"activity {act_id}: actual finish {shown[0]} is before its actual start {shown[1]}", act_id,
                        "actual_finish")


def _check_remaining_forms(a, m, b, r, pc, act_id: str) -> None:
    three = [v is not None for v in (a, m, b)]
    if any(three) and not all(three):
        raise PlanError(f"activity {act_id}: a remaining three-point estimate needs remaining optimistic, "
                        f"most likely and pessimistic", act_id, "remaining_optimistic")
    forms = sum((all(three), r is not None, pc is not None))
    if forms > 1:
        raise PlanError(f"activity {act_id}: give the remaining work one way only (a remaining estimate, "
                        f"a remaining duration or a percent complete)", act_id, "remaining")
    if all(three) and not 0.0 <= a <= m <= b:
        raise PlanError(f"activity {act_id}: remaining estimates must satisfy 0 \u2264 optimistic {a:g} \u2264 "
                        f"most likely {m:g} \u2264 pessimistic {b:g}", act_id, "remaining_optimistic")
    if r is not None and r < 0:
        raise PlanError(f"activity {act_id}: remaining duration must not be negative ({r:g})", act_id, "remaining")


def _given_form(p: Progress, pc, r) -> str:
    """The field that states the remaining work (one is given)."""
    if pc is not None:
        return "percent_complete"
    return "remaining" if r is not None else "remaining_estimate"


def _check_remaining_allowed(p: Progress, pc, r, act_id: str, names: dict) -> None:
    form = _given_form(p, pc, r)
    key = "remaining_optimistic" if form == "remaining_estimate" else form
    if p.actual_start is None:
        raise PlanError(f"activity {act_id}: {names[form]} needs an actual start: give the "
                        f"{names['actual_start']} (the date work began) first", act_id, key)
    if p.actual_finish is not None:
        nothing_left = (pc == 100.0) or (r == 0.0 and not p.has_remaining_estimate)
        if not nothing_left:
            raise PlanError(f"activity {act_id}: is done (it has an actual finish) but remaining work is given",
                            act_id, key)
