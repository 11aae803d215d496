"""Map plan offsets (working days or weeks from the project start) to calendar dates.

Offset 0 is the start of the first working day on or after the plan start. An activity
with early start ES begins on working day ``floor(ES)``; one that finishes at EF ends on
working day ``ceil(EF) − 1`` (the end of that day): a finish at offset 0 — a deadline on
the working day before the start — is dated on that earlier day. Milestones come in two
kinds (see :meth:`WorkCalendar.milestone_dates`): a start milestone (a gate) is dated the
morning it opens, day ``floor(x)``; a finish milestone (a hand-over) the evening it
happens, day ``ceil(x) − 1``. In weeks, one week is as many working days as the calendar
has working weekdays.
"""

from __future__ import annotations

import datetime as dt
import math

import numpy as np

from .errors import PlanError
from .model import Calendar, Settings


def public_holidays(region: str, years: range | list[int]) -> list[dt.date]:
    """Public holidays of a country (``"DE"``) or subdivision (``"US-CA"``) for some years.

    Resolved once through the ``holidays`` package; the caller stores the dates in the plan.
    """
    import holidays  # imported here: only needed when a planner adds a region's holidays

    country, _, subdiv = region.partition("-")
    try:
        table = holidays.country_holidays(country.upper(), subdiv=subdiv.upper() or None, years=list(years))
    except (NotImplementedError, KeyError) as exc:
        from .errors import PlanError
        raise PlanError(f"calendar: no public holidays known for region {region!r}", "calendar") from exc
    return sorted(table.keys())


MAX_DAYS = 1_500_000  # about 5,700 years of five-day weeks: dates stay inside year 1–9999
# the dates a date object (and every view, export and pack) can hold
FIRST_DATE, LAST_DATE = np.datetime64("0001-01-01", "D"), np.datetime64("9999-12-31", "D")


class OutOfCalendar(PlanError):
    """An offset maps to a date before year 1 or after year 9999. ``worst`` is the index
    (in the offsets given) of the one furthest out, so callers can name its owner."""

    def __init__(self, worst: int, before: bool):
        side = "before year 1" if before else "after year 9999"
        super().__init__(f"a date of the schedule falls {side}, beyond any calendar: check "
                         f"durations, lags, constraints and the deadline", "schedule")
        self.worst, self.before = worst, before


class WorkCalendar:
    """Vectorised offset ↔ date conversion for one plan's settings."""

    def __init__(self, settings: Settings):
        cal: Calendar = settings.calendar
        self.weekmask = cal.weekmask()
        self.holidays = np.array(sorted(set(cal.holidays)), dtype="datetime64[D]")
        self.per_unit = len(cal.workdays) if settings.unit == "weeks" else 1
        self._cal = np.busdaycalendar(weekmask=self.weekmask, holidays=self.holidays)
        self.first_day = np.busday_offset(np.datetime64(settings.start, "D"), 0, roll="forward", busdaycal=self._cal)

    @property
    def busdaycal(self) -> np.busdaycalendar:
        """The working days as numpy counts them (for vectorised date arithmetic)."""
        return self._cal

    # --- offsets to dates ------------------------------------------------
    def _day(self, index, strict: bool = True) -> np.ndarray:
        """Working day ``index`` from the first; ``strict``: OutOfCalendar for a day outside
        years 1–9999 (views panned beyond any date pass False and clip the result)."""
        index = np.asarray(index, dtype=float)
        if index.size and np.abs(index).max() > MAX_DAYS:
            from .errors import PlanError
            raise PlanError(f"the schedule reaches more than {MAX_DAYS:,} working days from the start, "
                            f"beyond any calendar date: check durations, lags and constraints", "schedule")
        days = np.busday_offset(self.first_day, index.astype(np.int64), roll="forward", busdaycal=self._cal)
        if strict and days.size and (days.min() < FIRST_DATE or days.max() > LAST_DATE):
            outside = (days < FIRST_DATE) | (days > LAST_DATE)
            worst = int(np.argmax(np.where(outside, np.abs(index), -1.0)))
            raise OutOfCalendar(worst, bool(days.flat[worst] < FIRST_DATE))
        return days

    def start_dates(self, offsets, strict: bool = True) -> np.ndarray:
        """The working day on which something starting at ``offsets`` begins."""
        days = np.floor(np.asarray(offsets, dtype=float) * self.per_unit + 1e-9)
        return self._day(days, strict)

    def finish_dates(self, offsets) -> np.ndarray:
        """The working day at whose end something finishing at ``offsets`` ends.

        A finish at offset 0 ends on the working day before the start (a deadline on the
        Friday before a Monday start is that Friday); earlier finishes keep their dates.
        """
        fin = np.asarray(offsets, dtype=float) * self.per_unit
        return self._day(np.ceil(fin - 1e-9) - 1)

    def milestone_dates(self, offsets, opens) -> np.ndarray:
        """The dates of milestones at ``offsets``: where ``opens`` is true a start milestone
        (dated the working day that begins at its offset), elsewhere a finish milestone
        (the working day that ends there)."""
        opens = np.asarray(opens, dtype=bool)
        return np.where(opens, self.start_dates(offsets), self.finish_dates(offsets))

    def start_date(self, offset: float) -> dt.date:
        return self.start_dates([offset])[0].astype(dt.date)

    def finish_date(self, offset: float) -> dt.date:
        return self.finish_dates([offset])[0].astype(dt.date)

    # --- dates to offsets ------------------------------------------------
    def offset_before(self, date: dt.date) -> float:
        """Offset of the start of ``date`` (working days before it) — for start constraints."""
        return self._count_to(np.datetime64(date, "D"))

    def offset_through(self, date: dt.date) -> float:
        """Offset of the end of ``date`` (working days up to and including it) — for deadlines."""
        return self._count_to(np.datetime64(date, "D") + 1)

    def offsets_before(self, days) -> np.ndarray:
        """:meth:`offset_before` of many dates at once (datetime64[D] or dates)."""
        d = np.asarray(days, dtype="datetime64[D]")
        first = np.full(d.shape, self.first_day)
        ahead = np.busday_count(first, np.maximum(d, first), busdaycal=self._cal)
        behind = np.busday_count(np.minimum(d, first), first, busdaycal=self._cal)
        return (ahead - behind) / self.per_unit

    def _count_to(self, day) -> float:
        """Working days from the first working day to the start of ``day`` (negative before it).

        numpy counts a reversed range as (end, begin], so it is counted forwards and negated.
        """
        if day >= self.first_day:
            n = np.busday_count(self.first_day, day, busdaycal=self._cal)
        else:
            n = -np.busday_count(day, self.first_day, busdaycal=self._cal)
        return float(n) / self.per_unit

    def resolve(self, value, *, finish: bool) -> float | None:
        """A constraint or deadline given as an offset or a date, as an offset."""
        if value is None:
            return None
        if isinstance(value, dt.date):
            return self.offset_through(value) if finish else self.offset_before(value)
        return float(value)

    def is_working(self, date: dt.date) -> bool:
        return bool(np.is_busday(np.datetime64(date, "D"), busdaycal=self._cal))


def round_offset(value: float) -> float:
    """Round away binary noise (sums of sixths) so 44.00000000001 prints as 44."""
    r = round(float(value), 9)
    return 0.0 if r == 0 else r


def whole(value: float) -> bool:
    return math.isclose(value, round(value), abs_tol=1e-9)
