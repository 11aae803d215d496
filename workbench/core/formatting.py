"""One way to write dates and numbers for people: the window, its dialogs, Present mode and
the approval pack all call these (files, ``--json`` and command-line tables keep ISO dates).

Dates read ``Thu 2 Sep 2027`` with English names whatever the desktop's locale (Qt sets
the C library's locale, which would otherwise change ``strftime``'s words). Numbers are
rounded for people: one decimal, whole values without one, never ``-0``.
"""

from __future__ import annotations

import datetime as dt
import math

DAYS = ("Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun")
MONTHS = ("Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec")
MONTH_NAMES = ("January", "February", "March", "April", "May", "June", "July", "August",
               "September", "October", "November", "December")
NONE = "-"


def as_date(value) -> dt.date | None:
    """A ``datetime.date`` from a date, a datetime or a numpy datetime64 (None stays None)."""
    if value is None:
        return None
    if isinstance(value, dt.datetime):
        return value.date()
    if isinstance(value, dt.date):
        return value
    return value.astype("datetime64[D]").astype(dt.date)


def format_date(value) -> str:
    """``Thu 2 Sep 2027``: the one date format people read."""
    day = as_date(value)
    if day is None:
        return NONE
    return f"{DAYS[day.weekday()]} {day.day} {MONTHS[day.month - 1]} {day.year}"


def format_day_month(value) -> str:
    """``Thu 2 Sep``: the same format without the year, where the year is said nearby."""
    day = as_date(value)
    return NONE if day is None else f"{DAYS[day.weekday()]} {day.day} {MONTHS[day.month - 1]}"


def format_timestamp(value: dt.datetime | float) -> str:
    """``Thu 2 Sep 2027 14:05`` for a moment (a datetime, or seconds since the epoch)."""
    if not isinstance(value, dt.datetime):
        value = dt.datetime.fromtimestamp(float(value))
    return f"{format_date(value.date())} {value:%H:%M}"


def format_stored_timestamp(text: str) -> str:
    """A moment stored as ISO text ("2027-03-01T14:05:33") as people read it; text that
    is no timestamp is shown as it is."""
    try:
        return format_timestamp(dt.datetime.fromisoformat(str(text)))
    except ValueError:
        return str(text)


def parse_date(text: str) -> dt.date | None:
    """A date typed as ISO (``2027-09-02``) or as shown (``Thu 2 Sep 2027``, ``2 Sep 2027``,
    ``02 September 2027``); None when the text is neither."""
    text = " ".join(str(text).replace(",", " ").split())
    try:
        return dt.date.fromisoformat(text)
    except ValueError:
        pass
    words = text.split(" ")
    if len(words) == 4 and words[0][:3].title() in DAYS:
        words = words[1:]
    if len(words) != 3 or not words[0].isdigit() or not words[2].isdigit():
        return None
    month = _month(words[1])
    try:
        return dt.date(int(words[2]), month, int(words[0])) if month else None
    except ValueError:
        return None


def _month(word: str) -> int:
    word = word.title()
    for i, (short, full) in enumerate(zip(MONTHS, MONTH_NAMES)):
        if word in (short, full):
            return i + 1
    return 0


def format_number(value, digits: int = 1) -> str:
    """A duration, float or lag for people: ``12``, ``1.3``, ``-2.5``; never ``-0``."""
    if value is None:
        return NONE
    value = float(value)
    if math.isnan(value):
        return NONE
    if math.isinf(value):
        return "\u221e" if value > 0 else "\u2212\u221e"
    text = f"{value:.{digits}f}"
    if "." in text:
        text = text.rstrip("0").rstrip(".")
    return "0" if text in ("-0", "") else text


def format_signed(value, digits: int = 1) -> str:
    """``+0.8``, ``-0.3``, ``0``: a change or a correlation, with its sign."""
    text = format_number(value, digits)
    return text if text.startswith("-") or text in ("0", NONE) else "+" + text


def plural(unit: str, value) -> str:
    """``day`` for one, ``days`` otherwise (the unit as stored in the plan is plural)."""
    single = unit[:-1] if unit.endswith("s") else unit
    return single if format_number(value) in ("1", "-1") else unit


def format_duration(value, unit: str = "days", digits: int = 1) -> str:
    """``1.3 days``, ``1 day``, ``12 weeks``."""
    text = format_number(value, digits)
    return text if text == NONE else f"{text} {plural(unit, value)}"


def format_whole_percent(p) -> str:
    """A probability in whole percent, with the space: ``43 %``; ``< 1 %`` and ``> 99 %`` near
    the ends, ``0 %`` and ``100 %`` only when exact."""
    if p is None or math.isnan(float(p)):
        return NONE
    p = float(p)
    if 0.0 < p < 0.005:
        return "< 1 %"
    if 0.995 < p < 1.0:
        return "> 99 %"
    return f"{max(0.0, min(1.0, p)) * 100:.0f} %"


def format_chance(p) -> str:
    """The chance of a date worked out from estimates (PERT or a simulation): as
    ``format_percent``, but never ``0 %`` or ``100 %`` — an estimate is never certain, so the
    ends read ``< 0.1 %`` and ``> 99.9 %`` (as the summary strip says them)."""
    if p is None or math.isnan(float(p)):
        return NONE
    return format_percent(min(max(float(p), 0.0001), 0.9999))


def format_percent(p) -> str:
    """A probability for people: ``85.5 %``; ``< 0.1 %`` and ``> 99.9 %`` near the ends so
    an uncertain finish never reads as certain; ``0 %`` and ``100 %`` only when exact."""
    if p is None or math.isnan(float(p)):
        return NONE
    p = float(p)
    if p <= 0.0:
        return "0 %"
    if p >= 1.0:
        return "100 %"
    if p < 0.0005:
        return "< 0.1 %"
    if p > 0.9995:
        return "> 99.9 %"
    return f"{p * 100:.1f} %"
