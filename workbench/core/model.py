"""The plan model: activities, links, settings. Pure Python, no Qt.

Containers announce changes to listeners (``Plan.subscribe``) so that adapters in
other layers can follow them one-to-one.
"""

from __future__ import annotations

import copy
import datetime as dt
import math
import re
from dataclasses import dataclass, field, replace
from operator import attrgetter
from typing import Callable, Iterable

from .errors import PlanError
from .text import check_text
from .progress_fields import Progress

LINK_TYPES = ("FS", "SS", "FF", "SF")
UNITS = ("days", "weeks")
DISTRIBUTIONS = ("beta-pert", "triangular", "uniform", "normal", "fixed")
PROGRESS_RULES = ("retained logic", "progress override")  # out-of-sequence progress, per plan

_PLAIN = (float, int)  # number types accepted as they are (bool is not one of them)
_BAD_ID = re.compile(r"[;,\s]")
MAX_ID_LENGTH = 40
# Durations, lags, constraints and deadlines stay within a million plan units of the start
# (thousands of years): beyond that a number is a typing slip, and dates would overflow.
MAX_UNITS = 1_000_000.0
EARLIEST_DATE = dt.date(1900, 1, 1)
# Longest text each field takes at entry: room for any real name or note, while a pasted
# essay is refused by name (the approval pack also shortens, with an ellipsis, what it prints).
# Entry only: a plan loaded with longer text keeps it whole (core/long_texts.py says which).
TEXT_LIMITS = {"name": 500, "group": 200, "notes": 20_000, "title": 300, "revision": 100,
               "prepared by": 200, "sign-off name": 200, "sign-off role": 200}
LATEST_DATE = dt.date(2200, 12, 31)


def check_date(value: dt.date, owner: str, field_name: str) -> dt.date:
    """A calendar date within the range plans use (1900–2200), else PlanError."""
    if not EARLIEST_DATE <= value <= LATEST_DATE:
        raise PlanError(f"{owner}: {field_name} {value.isoformat()} lies outside "
                        f"{EARLIEST_DATE.year}–{LATEST_DATE.year}", owner)
    return value


def check_id(act_id) -> str:
    """An activity id: non-empty, at most 40 characters, no spaces, ';', ',' or tabs."""
    if not isinstance(act_id, str) or not act_id.strip():
        raise PlanError("an activity has an empty id", "id")
    if _BAD_ID.search(act_id):
        raise PlanError(f"activity id {act_id!r} must not contain spaces, ';', ',' or tabs "
                        f"(the predecessor column could not name it)", act_id)
    if len(act_id) > MAX_ID_LENGTH:
        raise PlanError(f"activity id {act_id[:20]!r}… is {len(act_id)} characters long; "
                        f"use at most {MAX_ID_LENGTH}", act_id[:MAX_ID_LENGTH])
    return act_id

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


def check_kind(value, owner: str, field_name: str, culprit: str | None = None) -> str:
    """Text, else PlanError naming it. A plan holds text of any length: a file written
    before the limits, or by another tool, opens whole (see ``core/long_texts.py``)."""
    if not isinstance(value, str):
        raise PlanError(f"{owner}: {field_name} must be text, not {type(value).__name__}", culprit or owner)
    return value


def check_length(value, owner: str, field_name: str, culprit: str | None = None) -> str:
    """Text of at most ``TEXT_LIMITS[field_name]`` characters, else PlanError naming it:
    the limit on text *entered* (an edit, a paste); see ``core/long_texts.py``
    (``check_text`` from ``.text`` checks that the file can hold it)."""
    check_kind(value, owner, field_name, culprit)
    limit = TEXT_LIMITS[field_name]
    if len(value) > limit:
        raise PlanError(f"{owner}: {field_name} is {len(value):,} characters long; use at most {limit:,} "
                        f"(it begins {value[:30]!r})", culprit or owner)
    return value


Offset = float | dt.date  # a constraint or deadline: plan-unit offset or a calendar date


def _check_number(value, activity: str, field_name: str, allow_none: bool = True) -> float | None:
    if value is None:
        if allow_none:
            return None
        raise PlanError(f"activity {activity}: {field_name} is missing", activity)
    if isinstance(value, bool) or not isinstance(value, (int, float)):
        raise PlanError(f"activity {activity}: {field_name} must be a number, not {value!r}", activity)
    value = float(value)
    if not math.isfinite(value):
        raise PlanError(f"activity {activity}: {field_name} must be a finite number, not {value}", activity)
    if abs(value) > MAX_UNITS:
        raise PlanError(f"activity {activity}: {field_name} {value:g} is beyond {MAX_UNITS:,.0f} plan units", activity)
    return value


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


@dataclass
class Calendar:
    """Working weekdays (0 = Monday … 6 = Sunday) and holiday dates (stored, never re-derived)."""

    workdays: tuple[int, ...] = (0, 1, 2, 3, 4)
    holidays: tuple[dt.date, ...] = ()
    region: str = ""  # informational: which public-holiday set was added, e.g. "GB-ENG"

    def weekmask(self) -> str:
        return "".join("1" if d in self.workdays else "0" for d in range(7))


@dataclass
class SignOff:
    name: str = ""
    role: str = ""


@dataclass
class Settings:
    title: str = "Untitled plan"
    start: dt.date = field(default_factory=lambda: dt.date.today())
    unit: str = "days"
    calendar: Calendar = field(default_factory=Calendar)
    deadline: Offset | None = None
    status_date: dt.date | None = None
    target_confidence: float = 0.9
    distribution: str = "beta-pert"
    revision: str = ""
    prepared_by: str = ""
    sign_off: list[SignOff] = field(default_factory=list)
    progress_rule: str = "retained logic"  # or "progress override" (see core/progress.py)
    indirect_cost: float = 0.0          # per plan unit of project duration
    late_penalty: float = 0.0           # per plan unit past the deadline
    bought: "BoughtTime | None" = None  # the trade-off option last applied, for the pack

    def validated(self) -> "Settings":
        if self.unit not in UNITS:
            raise PlanError(f"settings: unit must be 'days' or 'weeks', not {self.unit!r}", "unit")
        if not 0.0 < float(self.target_confidence) < 1.0:
            raise PlanError(f"settings: target confidence must lie between 0 and 1, not {self.target_confidence}", "target_confidence")
        if self.distribution not in DISTRIBUTIONS:
            raise PlanError(f"settings: unknown distribution {self.distribution!r}", "distribution")
        if not self.calendar.workdays:
            raise PlanError("settings: the calendar has no working weekdays", "calendar")
        if isinstance(self.deadline, dt.date):
            check_date(self.deadline, "settings", "deadline")
        elif self.deadline is not None:
            _check_number(self.deadline, "settings", "deadline")
        check_date(self.start, "settings", "start date")
        if self.status_date is not None:
            check_date(self.status_date, "settings", "status date")
        self._check_texts()
        if self.progress_rule not in PROGRESS_RULES:
            raise PlanError(f"settings: progress rule must be 'retained logic' or 'progress override', "
                            f"not {self.progress_rule!r}", "progress_rule")
        for name in ("indirect_cost", "late_penalty"):
            value = getattr(self, name)
            if isinstance(value, bool) or not isinstance(value, _PLAIN) or not 0.0 <= value < math.inf:
                raise PlanError(f"settings: {name.replace('_', ' ')} must be a number of at least 0, not {value!r}", name)
        return self

    def _check_texts(self) -> None:
        for name, value in (("title", self.title), ("revision", self.revision), ("prepared by", self.prepared_by)):
            check_kind(value, "settings", name, name)
        for k, person in enumerate(self.sign_off, 1):
            check_kind(person.name, f"settings: sign-off row {k}", "sign-off name", "sign_off")
            check_kind(person.role, f"settings: sign-off row {k}", "sign-off role", "sign_off")


@dataclass(frozen=True)
class BoughtTime:
    """A trade-off option applied to the plan: what was bought, for how much, and the odds
    it was expected to give (None for a deterministic option)."""

    label: str
    cost: float
    chance: float | None = None
    standard_error: float | None = None
    crashed: tuple[tuple[str, float], ...] = ()


@dataclass(frozen=True)
class Risk:
    """A risk event: with ``probability`` it adds a three-point delay to each listed activity."""

    id: str
    name: str = ""
    probability: float = 0.0
    optimistic: float = 0.0
    most_likely: float = 0.0
    pessimistic: float = 0.0
    activities: tuple[str, ...] = ()


@dataclass(frozen=True)
class CorrelationGroup:
    """Activities whose durations move together, with a rank correlation coefficient."""

    name: str
    activities: tuple[str, ...]
    coefficient: float


@dataclass(frozen=True)
class Availability:
    """A period [start, end) in which a resource has ``units`` available instead of its usual
    number (a crew on leave, a second crane hired). Ends are offsets or dates."""

    start: Offset
    end: Offset
    units: float


@dataclass(frozen=True)
class Resource:
    """A crew, machine or rig that activities need: ``units`` available at any time (unless a
    period says otherwise), optionally a cost per unit per plan unit."""

    id: str
    name: str = ""
    units: float = 1.0
    cost: float | None = None
    periods: tuple[Availability, ...] = ()

    def validated(self) -> "Resource":
        owner = f"resource {self.id}"
        if not isinstance(self.id, str) or not self.id.strip() or _BAD_ID.search(self.id) or len(self.id) > MAX_ID_LENGTH:
            raise PlanError(f"resource id {self.id!r} must be 1–{MAX_ID_LENGTH} characters without spaces, ';' or ','", "resource")
        units = _check_number(self.units, owner, "units", allow_none=False)
        if units < 0:
            raise PlanError(f"{owner}: units must not be negative ({units:g})", self.id)
        if self.cost is not None and _check_number(self.cost, owner, "cost") < 0:
            raise PlanError(f"{owner}: cost must not be negative ({self.cost:g})", self.id)
        for p in self.periods:
            if _check_number(p.units, owner, "units of an availability period", allow_none=False) < 0:
                raise PlanError(f"{owner}: an availability period's units must not be negative ({p.units:g})", self.id)
        return self

    @property
    def most_units(self) -> float:
        """The most units this resource ever has."""
        return max([self.units] + [p.units for p in self.periods])


Listener = Callable[[str, dict], None]


def check_activity_text(act: Activity) -> Activity:
    """Refuse text the plan file cannot hold (a lone surrogate), naming activity and field."""
    for name in ("id", "name", "group", "notes"):
        check_text(getattr(act, name), f"activity {act.id}" if name != "id" else "an activity", name, act.id)
    return act


def check_settings_text(settings: Settings) -> Settings:
    for name in ("title", "revision", "prepared_by", "unit", "distribution"):
        check_text(getattr(settings, name), "settings", name.replace("_", " "), name)
    check_text(settings.calendar.region, "settings", "calendar region", "calendar")
    for i, person in enumerate(settings.sign_off, 1):
        check_text(person.name, f"settings: sign-off {i}", "name", "sign_off")
        check_text(person.role, f"settings: sign-off {i}", "role", "sign_off")
    return settings


class Plan:
    """An ordered set of activities, the links between them and the plan settings.

    Listeners receive ``(event, info)`` pairs. Events: ``about_to_change`` and
    ``changed`` around any modification, with ``info['kind']`` one of
    ``activity_inserted``, ``activity_removed``, ``activity_changed``, ``activity_moved``,
    ``links_changed``, ``settings_changed``, ``reset``; plus the row index where it applies.
    """

    def __init__(self, settings: Settings | None = None, activities: Iterable[Activity] = (),
                 links: Iterable[Link] = (), risks: Iterable[Risk] = (),
                 correlations: Iterable[CorrelationGroup] = (), *, validated: bool = False,
                 resources: Iterable[Resource] = (), baselines: Iterable = (), odds_trend: Iterable = (),
                 ends_known: bool = False):
        """``validated=True``: the caller (a file reader) has validated every activity and
        link already; only duplicate ids and link ends are checked again (``ends_known``:
        the caller has also found every link's ends among these activities)."""
        self.settings = settings or Settings()
        if not validated:
            check_settings_text(self.settings)
        self._activities: list[Activity] = []
        self._index: dict[str, int] = {}
        self.links: list[Link] = []
        self.risks: list[Risk] = list(risks)
        self.correlations: list[CorrelationGroup] = list(correlations)
        self.checkup_thresholds: dict[str, float] = {}   # Checkup thresholds this plan changed
        self.resources: list[Resource] = [r.validated() for r in resources]
        self.baselines: list = list(baselines)      # core.baseline.Baseline, oldest first
        self.odds_trend: list = list(odds_trend)    # core.baseline.TrendPoint, by status date
        self._listeners: list[Listener] = []
        self._analyzer = None  # the engine's compiled network for this plan (see analysis.analyze)
        if validated:
            self._take_checked(list(activities), list(links), ends_known)
        else:
            for act in activities:
                self._append(check_activity_text(act.validated()))
            for link in links:
                self._check_link(link)
                self.links.append(link)
        self._check_all_demands()

    def _take_checked(self, acts: list[Activity], links: list[Link], ends_known: bool = False) -> None:
        """Activities and links a file reader has validated: only duplicate ids and link
        ends are checked here, in bulk, falling back to one at a time to name a culprit."""
        self._index = dict(zip(map(attrgetter("id"), acts), range(len(acts))))
        if len(self._index) == len(acts):
            self._activities = acts
        else:
            self._index = {}
            for act in acts:
                self._append(act)       # raises, naming the duplicate
        self.links = links
        if ends_known and len(self._index) == len(acts):
            return
        ends = set(map(attrgetter("pred"), links))
        ends.update(map(attrgetter("succ"), links))
        if not ends <= self._index.keys():
            for link in links:
                if link.pred not in self._index or link.succ not in self._index:
                    self._check_link(link)   # raises, naming the unknown end

    # --- reading -------------------------------------------------------
    @property
    def activities(self) -> tuple[Activity, ...]:
        return tuple(self._activities)

    def __len__(self) -> int:
        return len(self._activities)

    def __contains__(self, act_id: str) -> bool:
        return act_id in self._index

    def activity(self, act_id: str) -> Activity:
        try:
            return self._activities[self._index[act_id]]
        except KeyError:
            raise PlanError(f"no activity with id {act_id!r}", act_id) from None

    def row_of(self, act_id: str) -> int:
        return self._index[act_id]

    def ids(self) -> list[str]:
        return [a.id for a in self._activities]

    def predecessors(self, act_id: str) -> list[Link]:
        return [l for l in self.links if l.succ == act_id]

    def successors(self, act_id: str) -> list[Link]:
        return [l for l in self.links if l.pred == act_id]

    # --- listeners -----------------------------------------------------
    def subscribe(self, listener: Listener) -> None:
        self._listeners.append(listener)

    def unsubscribe(self, listener: Listener) -> None:
        if listener in self._listeners:
            self._listeners.remove(listener)

    def _emit(self, event: str, **info) -> None:
        self._progress_rows = None          # any change may touch progress: found again when asked
        for listener in list(self._listeners):
            listener(event, info)

    def progress_rows(self) -> list[int]:
        """Rows of the activities with progress (kept until the plan next changes)."""
        rows = getattr(self, "_progress_rows", None)
        if rows is None:
            rows = self._progress_rows = [i for i, a in enumerate(self._activities)
                                          if a.progress is not None and not a.progress.is_empty]
        return rows

    # --- changing (commands call these) ---------------------------------
    def _append(self, act: Activity) -> None:
        if act.id in self._index:
            raise PlanError(f"duplicate activity id {act.id!r}", act.id)
        self._index[act.id] = len(self._activities)
        self._activities.append(act)

    def _reindex(self) -> None:
        self._index = {a.id: i for i, a in enumerate(self._activities)}

    def _check_link(self, link: Link) -> None:
        link.validated()
        for end in (link.pred, link.succ):
            if end not in self._index:
                raise PlanError(f"link {link.pred} \u2192 {link.succ}: unknown activity {end!r}", link.succ if end == link.pred else end)

    def resource(self, res_id: str) -> Resource:
        for r in self.resources:
            if r.id == res_id:
                return r
        raise PlanError(f"no resource with id {res_id!r}", res_id)

    def _check_demand(self, act: Activity) -> None:
        """Each resource an activity needs exists and can ever supply the units asked for."""
        if not act.resources:
            return
        known = {r.id: r for r in self.resources}
        for res, units in act.resources:
            if res not in known:
                raise PlanError(f"activity {act.id}: unknown resource {res!r}"
                                + (f" (resources: {', '.join(sorted(known))})" if known else " (the plan has no resources)"), act.id)
            most = known[res].most_units
            if units > most:
                raise PlanError(f"activity {act.id}: needs {units:g} units of {res} but at most {most:g} ever exist; "
                                f"it could never be scheduled", act.id)

    def _check_all_demands(self) -> None:
        ids = [r.id for r in self.resources]
        if len(set(ids)) != len(ids):
            dup = next(i for i in ids if ids.count(i) > 1)
            raise PlanError(f"duplicate resource id {dup!r}", dup)
        for act in self._activities:
            if act.resources:
                self._check_demand(act)

    def set_resources(self, resources: list[Resource]) -> list[Resource]:
        """Replace the plan's resources (checked against every activity's needs first)."""
        new, old = [r.validated() for r in resources], self.resources
        self.resources = new
        try:
            self._check_all_demands()
        finally:
            self.resources = old
        self._emit("about_to_change", kind="settings_changed")
        self.resources = new
        self._emit("changed", kind="settings_changed")
        return old

    def insert_activity(self, row: int, act: Activity) -> None:
        check_activity_text(act.validated())
        self._check_demand(act)
        if act.id in self._index:
            raise PlanError(f"duplicate activity id {act.id!r}", act.id)
        row = max(0, min(row, len(self._activities)))
        self._emit("about_to_change", kind="activity_inserted", row=row)
        self._activities.insert(row, act)
        self._reindex()
        self._emit("changed", kind="activity_inserted", row=row)

    def remove_activity(self, act_id: str) -> tuple[int, Activity, list[tuple[int, Link]]]:
        """Remove an activity and its links; return what is needed to put them back."""
        row = self.row_of(act_id)
        removed = [(i, l) for i, l in enumerate(self.links) if act_id in (l.pred, l.succ)]
        self._emit("about_to_change", kind="activity_removed", row=row)
        act = self._activities.pop(row)
        self.links = [l for l in self.links if act_id not in (l.pred, l.succ)]
        self._reindex()
        self._emit("changed", kind="activity_removed", row=row)
        return row, act, removed

    def restore_activity(self, row: int, act: Activity, links: list[tuple[int, Link]]) -> None:
        self._emit("about_to_change", kind="activity_inserted", row=row)
        self._activities.insert(row, act)
        self._reindex()
        for i, link in sorted(links):
            self.links.insert(i, link)
        self._emit("changed", kind="activity_inserted", row=row)

    def replace_activity(self, act_id: str, new: Activity) -> Activity:
        """Replace an activity (possibly renaming it: links follow the new id)."""
        check_activity_text(new.validated())
        self._check_demand(new)
        row = self.row_of(act_id)
        if new.id != act_id and new.id in self._index:
            raise PlanError(f"duplicate activity id {new.id!r}", new.id)
        self._emit("about_to_change", kind="activity_changed", row=row)
        old = self._activities[row]
        self._activities[row] = new
        if new.id != act_id:
            self.links = [Link(new.id if l.pred == act_id else l.pred, new.id if l.succ == act_id else l.succ, l.type, l.lag)
                          for l in self.links]
            self._reindex()
        self._emit("changed", kind="activity_changed", row=row)
        return old

    def move_activity(self, src: int, dst: int) -> None:
        self._emit("about_to_change", kind="activity_moved", row=src, to=dst)
        act = self._activities.pop(src)
        self._activities.insert(dst, act)
        self._reindex()
        self._emit("changed", kind="activity_moved", row=src, to=dst)

    def set_links(self, links: list[Link]) -> list[Link]:
        """Replace all links at once (validated first); return the old list."""
        for link in links:
            self._check_link(link)
        self._emit("about_to_change", kind="links_changed")
        old, self.links = self.links, list(links)
        self._emit("changed", kind="links_changed")
        return old

    def set_settings(self, settings: Settings) -> Settings:
        check_settings_text(settings.validated())
        self._emit("about_to_change", kind="settings_changed")
        old, self.settings = self.settings, settings
        self._emit("changed", kind="settings_changed")
        return old

    def set_checkup_thresholds(self, values: dict[str, float]) -> dict[str, float]:
        """Replace the plan's own Checkup thresholds (validated; see core.checkup_limits);
        return the old ones. Announced as a settings change."""
        from .checkup_limits import checked_thresholds

        values = checked_thresholds(values)
        self._emit("about_to_change", kind="settings_changed")
        old, self.checkup_thresholds = self.checkup_thresholds, values
        self._emit("changed", kind="settings_changed")
        return old

    def set_baselines(self, baselines: list) -> list:
        """Replace the baselines at once; return the old list."""
        self._emit("about_to_change", kind="baselines_changed")
        old, self.baselines = self.baselines, list(baselines)
        self._emit("changed", kind="baselines_changed")
        return old

    def set_odds_trend(self, points: list) -> list:
        """Replace the odds trend at once; return the old list."""
        self._emit("about_to_change", kind="odds_trend_changed")
        old, self.odds_trend = self.odds_trend, list(points)
        self._emit("changed", kind="odds_trend_changed")
        return old

    def reset(self, other: "Plan") -> None:
        """Take over the whole content of ``other`` (an import, a revert)."""
        self._emit("about_to_change", kind="reset")
        self.settings = other.settings
        self._activities = list(other._activities)
        self.links = list(other.links)
        self.risks = list(other.risks)
        self.correlations = list(other.correlations)
        self.checkup_thresholds = dict(getattr(other, "checkup_thresholds", {}))
        self.resources = list(other.resources)
        self.baselines = list(getattr(other, "baselines", ()))
        self.odds_trend = list(getattr(other, "odds_trend", ()))
        self._reindex()
        self._emit("changed", kind="reset")

    def snapshot(self) -> "Plan":
        """A copy another thread may read while this plan is edited (an autosave): the
        lists are copied (activities, links, risks and correlation groups are immutable),
        everything else deep-copied; no listeners. Cheap: nothing is validated again."""
        shallow = ("_activities", "links", "risks", "correlations", "_index")
        new = object.__new__(Plan)
        for name, value in self.__dict__.items():
            if name in shallow:
                value = type(value)(value)
            elif name not in ("_listeners", "_analyzer"):
                value = copy.deepcopy(value)
            new.__dict__[name] = value
        new._listeners, new._analyzer = [], None
        return new

    def copy(self) -> "Plan":
        twin = Plan(replace(self.settings, calendar=replace(self.settings.calendar),
                            sign_off=list(self.settings.sign_off)),
                    self._activities, self.links, self.risks, self.correlations, resources=self.resources,
                    baselines=self.baselines, odds_trend=self.odds_trend)
        twin.checkup_thresholds = dict(self.checkup_thresholds)
        return twin
