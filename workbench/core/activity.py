"""An activity and a link between two activities. Pure Python, no Qt."""

from __future__ import annotations

import datetime as dt
from dataclasses import dataclass, replace

from .errors import PlanError
from .plan_checks import (_BAD_ID, _PLAIN, DISTRIBUTIONS, LINK_TYPES, MAX_ID_LENGTH, MAX_UNITS, TEXT_LIMITS,
                          Offset, check_date, check_id, check_kind, check_number as _check_number)
from .progress_fields import Progress
from .text import check_text


def check_demands(act: "Activity") -> None:
    """An activity's resource needs: (resource id, units) pairs, each id once, units a
    finite number ≥ 0. Whether the resource exists is the plan's check."""
    seen = set()
    for item in act.resources:
        if not (isinstance(item, tuple) and len(item) == 2 and isinstance(item[0], str) and item[0].strip()):
            raise PlanError(f"activity {act.id}: a resource need must be a resource id and its units, not {item!r}", act.id)
        res, units = item
        if res in seen:
            raise PlanError(f"activity {act.id}: resource {res!r} is listed twice", act.id)
        seen.add(res)
        units = _check_number(units, act.id, f"units of resource {res}", allow_none=False)
        if units < 0:
            raise PlanError(f"activity {act.id}: units of resource {res} must not be negative ({units:g})", act.id)


@dataclass(frozen=True)
class Activity:
    """One activity. Either a three-point estimate (optimistic ≤ most_likely ≤ pessimistic)
    or a single fixed ``duration``; a duration of zero makes a milestone."""

    id: str
    name: str = ""
    group: str = ""
    notes: str = ""
    optimistic: float | None = None
    most_likely: float | None = None
    pessimistic: float | None = None
    duration: float | None = None
    distribution: str | None = None  # None: the plan's default
    start_no_earlier: Offset | None = None
    finish_no_later: Offset | None = None
    resources: tuple[tuple[str, float], ...] = ()  # (resource id, units) needed for the whole duration
    progress: Progress | None = None  # actuals and remaining work (None: not started)
    # costs and the fastest achievable estimate (see core/crash_terms.py)
    cost: float | None = None
    crash_cost: float | None = None
    crash_optimistic: float | None = None
    crash_most_likely: float | None = None
    crash_pessimistic: float | None = None
    crash_duration: float | None = None

    def _plainly_valid(self) -> bool:
        """The common case, checked cheaply: a clean id, plain finite numbers in order."""
        i, a, m, b, d = self.id, self.optimistic, self.most_likely, self.pessimistic, self.duration
        if type(i) is not str or not i or len(i) > MAX_ID_LENGTH or _BAD_ID.search(i):
            return False
        if not _short_texts(self):
            return False
        if self.start_no_earlier is not None or self.finish_no_later is not None or self.resources:
            return False
        if self.progress is not None or self.cost is not None or self.crash_cost is not None or self.has_crash:
            return False
        if self.distribution is not None and self.distribution not in DISTRIBUTIONS:
            return False
        if d is not None and not (type(d) in _PLAIN and 0 <= d <= MAX_UNITS):
            return False
        if a is None and m is None and b is None:
            return d is not None
        return (type(a) in _PLAIN and type(m) in _PLAIN and type(b) in _PLAIN
                and 0 <= a <= m <= b <= MAX_UNITS)

    def validated(self) -> "Activity":
        """Return self if valid, else raise PlanError naming the activity and field."""
        if self._plainly_valid():
            return self
        check_id(self.id)
        for name in ("name", "group", "notes"):    # the length is checked at entry (see check_length)
            check_kind(getattr(self, name), f"activity {self.id}", name, self.id)
        a = _check_number(self.optimistic, self.id, "optimistic")
        m = _check_number(self.most_likely, self.id, "most likely")
        b = _check_number(self.pessimistic, self.id, "pessimistic")
        d = _check_number(self.duration, self.id, "duration")
        three = [v is not None for v in (a, m, b)]
        if any(three) and not all(three):
            raise PlanError(f"activity {self.id}: a three-point estimate needs optimistic, most likely and pessimistic", self.id)
        if all(three):
            if min(a, m, b) < 0:
                raise PlanError(f"activity {self.id}: estimates must not be negative ({a:g}, {m:g}, {b:g})", self.id)
            if not a <= m <= b:
                raise PlanError(f"activity {self.id}: estimates out of order: optimistic {a:g} \u2264 most likely {m:g} \u2264 pessimistic {b:g} does not hold", self.id)
        elif d is None:
            raise PlanError(f"activity {self.id}: needs a duration or a three-point estimate", self.id)
        if d is not None and d < 0:
            raise PlanError(f"activity {self.id}: duration must not be negative ({d:g})", self.id)
        if self.distribution is not None and self.distribution not in DISTRIBUTIONS:
            raise PlanError(f"activity {self.id}: unknown distribution {self.distribution!r} (use one of {', '.join(DISTRIBUTIONS)})", self.id)
        for name in ("start_no_earlier", "finish_no_later"):
            v = getattr(self, name)
            if isinstance(v, dt.date):
                check_date(v, f"activity {self.id}", name.replace("_", " "))
            elif v is not None:
                _check_number(v, self.id, name.replace("_", " "))
        from .crash_terms import check_costs
        check_costs(self)
        check_demands(self)
        if self.progress is not None:
            if not isinstance(self.progress, Progress):
                raise PlanError(f"activity {self.id}: progress must be a Progress record", self.id)
            self.progress.validated(self.id)
        return self

    @property
    def has_crash(self) -> bool:
        """A crash estimate was given (three points or a fixed crash duration)."""
        return (self.crash_duration is not None or self.crash_optimistic is not None
                or self.crash_most_likely is not None or self.crash_pessimistic is not None)

    @property
    def has_estimate(self) -> bool:
        return self.optimistic is not None and self.most_likely is not None and self.pessimistic is not None

    @property
    def mean(self) -> float:
        """PERT expected duration te = (a + 4m + b) / 6, or the fixed duration."""
        if self.has_estimate:
            return (self.optimistic + 4.0 * self.most_likely + self.pessimistic) / 6.0
        return float(self.duration or 0.0)

    @property
    def variance(self) -> float:
        """PERT variance ((b − a) / 6)², zero for a fixed duration."""
        if self.has_estimate:
            return ((self.pessimistic - self.optimistic) / 6.0) ** 2
        return 0.0

    @property
    def is_milestone(self) -> bool:
        return self.mean == 0.0 and self.variance == 0.0

    def with_(self, **changes) -> "Activity":
        return replace(self, **changes)


def _short_texts(act: Activity) -> bool:
    limits, name, group, notes = TEXT_LIMITS, act.name, act.group, act.notes
    return (type(name) is str and type(group) is str and type(notes) is str and len(name) <= limits["name"]
            and len(group) <= limits["group"] and len(notes) <= limits["notes"])


@dataclass(frozen=True)
class Link:
    """A precedence link ``pred → succ`` of type FS/SS/FF/SF with a lag in plan units."""

    pred: str
    succ: str
    type: str = "FS"
    lag: float = 0.0

    def validated(self) -> "Link":
        lag = self.lag
        if self.type in LINK_TYPES and self.pred != self.succ and type(lag) in _PLAIN and -MAX_UNITS <= lag <= MAX_UNITS:
            return self                     # the common case, checked cheaply
        if self.type not in LINK_TYPES:
            raise PlanError(f"link {self.pred} \u2192 {self.succ}: unknown link type {self.type!r} (use FS, SS, FF or SF)", self.succ)
        if self.pred == self.succ:
            raise PlanError(f"activity {self.succ} is linked to itself", self.succ)
        _check_number(self.lag, self.succ, f"lag of the link from {self.pred}", allow_none=False)
        return self

    @property
    def key(self) -> tuple[str, str]:
        return (self.pred, self.succ)


def check_activity_text(act: Activity) -> Activity:
    """Refuse text the plan file cannot hold (a lone surrogate), naming activity and field."""
    for name in ("id", "name", "group", "notes"):
        check_text(getattr(act, name), f"activity {act.id}" if name != "id" else "an activity", name, act.id)
    return act
