"""Date ticks for charts whose x axis is a plan-unit offset (working time).

``date_ticks(calendar, lo, hi, max_ticks)`` picks the finest of days, weeks, months,
quarters and years whose ticks in ``[lo, hi]`` number at most ``max_ticks`` and returns
``(offset, label)`` pairs. A tick sits at the start of its date (``offset_before``); a
date that is not a working day moves to the start of the next working day, so ticks on
non-working days that would collide are dropped. No Qt.
"""

from __future__ import annotations

import datetime as dt
import math

import numpy as np

from workbench.core.calendar import MAX_DAYS

MONTHS = ("Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec")
DAYS = ("Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun")
FIRST_DAY, LAST_DAY = np.datetime64("0001-01-01", "D"), np.datetime64("9999-12-31", "D")   # Python's dates

# (level name, step, approximate calendar days per tick)
LEVELS = (("day", 1, 1), ("day", 2, 2), ("week", 1, 7), ("week", 2, 14), ("month", 1, 30.4),
          ("month", 2, 60.9), ("quarter", 1, 91.3), ("half", 1, 182.6), ("year", 1, 365.2),
          ("year", 2, 730.5), ("year", 5, 1826), ("year", 10, 3652), ("year", 25, 9131),
          ("year", 100, 36524))
FAR_LEVELS = (("year", 500, 182621), ("year", 1000, 365242))   # tried last: views of millennia


def _day_candidates(first, last, step: int, calendar) -> np.ndarray:
    days = np.arange(first, last + 1)
    return days[np.is_busday(days, busdaycal=calendar._cal)][::step]


def _week_candidates(first, last, step: int) -> np.ndarray:
    monday = first - (first.astype(np.int64) + 3) % 7        # 1 Jan 1970 was a Thursday
    return np.arange(monday, last + 1, 7 * step)


def _month_candidates(first, last, months: int) -> np.ndarray:
    """Month starts every ``months`` months counted from year 0 (so years land on 2000, 2025...)."""
    since_0 = 1970 * 12                       # datetime64[M] counts months from January 1970
    index = (first.astype("datetime64[M]").astype(np.int64) + since_0) // months * months - since_0
    end = last.astype("datetime64[M]").astype(np.int64)
    return np.arange(index, end + 1, months).astype("datetime64[M]").astype("datetime64[D]")


def _candidates(level: str, step: int, first, last, calendar) -> np.ndarray:
    """Candidate tick dates in [first, last] (datetime64[D], ascending)."""
    if level == "day":
        return _day_candidates(first, last, step, calendar)
    if level == "week":
        return _week_candidates(first, last, step)
    months = {"month": step, "quarter": 3, "half": 6, "year": 12 * step}[level]
    return _month_candidates(first, last, months)


def label(level: str, date: dt.date) -> str:
    """Tick label text for one date at one level."""
    if level == "day":
        return f"{DAYS[date.weekday()]} {date.day}"
    if level == "week":
        return f"{date.day} {MONTHS[date.month - 1]}"
    if level == "month":
        return f"{MONTHS[date.month - 1]} {date.year}" if date.month == 1 else MONTHS[date.month - 1]
    if level in ("quarter", "half"):
        part = "Q" if level == "quarter" else "H"
        size = 3 if level == "quarter" else 6
        return f"{part}{(date.month - 1) // size + 1} {date.year}"
    return str(date.year)


def _offsets(calendar, days: np.ndarray) -> np.ndarray:
    n = np.busday_count(calendar.first_day, days, busdaycal=calendar._cal)
    return n.astype(float) / calendar.per_unit


def choose_level(calendar, lo: float, hi: float, max_ticks: int) -> tuple[str, int]:
    """The finest (level, step) giving at most ``max_ticks`` ticks over [lo, hi]."""
    work_days = (hi - lo) * calendar.per_unit
    span_days = work_days * 7.0 / max(1, calendar.weekmask.count("1"))
    for level, step, per_tick in LEVELS:
        count = work_days / step if level == "day" else span_days / per_tick
        if count + 1 <= max_ticks:
            return level, step
    return LEVELS[-1][0], LEVELS[-1][1]


def date_ticks(calendar, lo_offset: float, hi_offset: float, max_ticks: int) -> list[tuple[float, str]]:
    """Ticks ``(offset, label)`` inside [lo_offset, hi_offset], at most ``max_ticks`` of them."""
    if max_ticks < 1 or not np.isfinite([lo_offset, hi_offset]).all():
        return []
    lo, hi = float(min(lo_offset, hi_offset)), float(max(lo_offset, hi_offset))
    reach = MAX_DAYS / calendar.per_unit          # a view may be panned beyond any calendar date
    lo, hi = max(lo, -reach), min(hi, reach)
    if lo > hi:
        return []
    ends = calendar.start_dates([lo, hi], strict=False).astype("datetime64[D]")
    first, last = max(ends[0] - 7, FIRST_DAY), min(ends[1] + 7, LAST_DAY)
    at_the_ends = first == FIRST_DAY or last == LAST_DAY
    chosen = choose_level(calendar, lo, hi, max_ticks)
    start = next(i for i, level in enumerate(LEVELS) if level[:2] == chosen)
    crowded = None
    for level, step, _ in LEVELS[max(0, start - 2):] + FAR_LEVELS:
        dates = _candidates(level, step, first, last, calendar)
        if at_the_ends:
            dates = dates[(dates >= FIRST_DAY) & (dates <= LAST_DAY)]
        if not dates.size:
            continue
        offsets = _offsets(calendar, dates)
        keep = (offsets >= lo - 1e-9) & (offsets <= hi + 1e-9)
        keep[1:] &= offsets[1:] - offsets[:-1] > 1e-9   # collisions on non-working days
        count = int(np.count_nonzero(keep))
        if count and count <= max_ticks:
            kept = dates[keep].astype(dt.date).tolist()
            return _with_context(level, list(zip(offsets[keep].tolist(), kept)))
        if count:          # too many at this step; a coarser one may hold none at all
            crowded = (level, offsets[keep], dates[keep])
    if crowded is None:
        return []
    level, offsets, dates = crowded           # every k-th of the coarsest step that had any
    k = math.ceil(len(offsets) / max_ticks)
    return _with_context(level, list(zip(offsets[::k].tolist(), dates[::k].astype(dt.date).tolist())))


def _with_context(level: str, ticks: list[tuple[float, dt.date]]) -> list[tuple[float, str]]:
    """Labels, adding the month (days) or year (months) at the first tick and where it changes."""
    out, previous = [], None
    for offset, date in ticks:
        text = label(level, date)
        if level == "day" and (previous is None or previous.month != date.month):
            text += f" {MONTHS[date.month - 1]}"
        elif level == "week" and previous is not None and previous.year != date.year:
            text += f" {date.year}"
        elif level == "month" and date.month != 1 and (previous is None or previous.year != date.year):
            text += f" {date.year}"
        out.append((offset, text))
        previous = date
    return out


def fitted_date_ticks(calendar, lo: float, hi: float, width: float, text_width, gap: float = 12.0,
                      smallest: float = 18.0) -> list[tuple[float, str]]:
    """The finest date ticks whose labels fit side by side on an axis ``width`` long (pixels
    or points): days or weeks when there is room for them, not months by habit.

    ``text_width(text)`` measures a label; neighbouring labels, centred on their ticks, keep
    ``gap`` apart. Each try asks :func:`date_ticks` for fewer ticks than the last, so the
    level coarsens step by step (at most a few tries)."""
    if width <= 0 or hi <= lo:
        return []
    count, ticks = max(2, int(width / smallest)), []
    while count >= 2:
        ticks = date_ticks(calendar, lo, hi, count) or ticks
        if len(ticks) < 2 or _labels_fit(ticks, lo, hi, width, text_width, gap):
            return ticks
        count = min(count - 1, len(ticks) - 1)
    return ticks[:1]                      # an axis with room for one label only


def _labels_fit(ticks, lo: float, hi: float, width: float, text_width, gap: float) -> bool:
    xs = (np.array([o for o, _ in ticks]) - lo) / (hi - lo) * width
    half = np.array([text_width(t) for _, t in ticks]) / 2.0
    return bool(np.all(np.diff(xs) >= half[:-1] + half[1:] + gap))
