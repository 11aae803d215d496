"""A plan's settings (calendar, sign-off, risks, correlation groups) and its resources.
Pure Python, no Qt."""

from __future__ import annotations

import datetime as dt
import math
from dataclasses import dataclass, field

from .errors import PlanError
from .plan_checks import (_BAD_ID, _PLAIN, DISTRIBUTIONS, MAX_ID_LENGTH, PROGRESS_RULES, UNITS, Offset, check_date,
                          check_kind, check_number as _check_number)
from .text import check_text


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


def check_settings_text(settings: Settings) -> Settings:
    for name in ("title", "revision", "prepared_by", "unit", "distribution"):
        check_text(getattr(settings, name), "settings", name.replace("_", " "), name)
    check_text(settings.calendar.region, "settings", "calendar region", "calendar")
    for i, person in enumerate(settings.sign_off, 1):
        check_text(person.name, f"settings: sign-off {i}", "name", "sign_off")
        check_text(person.role, f"settings: sign-off {i}", "role", "sign_off")
    return settings
