"""Dates typed by a planner: ISO (2027-03-12) or the plan's display format (12 Mar 2027).

``read_date`` accepts, whatever the locale:

- ISO dates, ``2027-03-12`` (also ``2027/03/12`` and ``20270312``);
- day, month name, year: ``12 Mar 2027``, ``12 March 2027``, ``12-Mar-2027``, with an
  optional weekday in front (``Fri 12 Mar 2027``, as dates are shown);
- month name, day, year: ``Mar 12 2027``, ``March 12, 2027``.

Numeric day/month orders other than ISO (03/12/2027) are refused: they mean different
days in different countries, and a plan is read in both. Every refusal says what was
wrong and what is understood.
"""

from __future__ import annotations

import calendar
import datetime as dt
import re

from workbench.core.errors import PlanError

DISPLAY_FORMAT = "%d %b %Y"   # how the window shows a date: 12 Mar 2027
EXAMPLES = "2027-03-12 or 12 Mar 2027"
_ENGLISH = ("january", "february", "march", "april", "may", "june", "july", "august",
            "september", "october", "november", "december")
_ISO = re.compile(r"(\d{4})[-/.](\d{1,2})[-/.](\d{1,2})|(\d{4})(\d{2})(\d{2})")
_WORD = r"([^\W\d_]+)\.?"
_DAY_FIRST = re.compile(rf"(\d{{1,2}})[\s\-/.]+{_WORD}[\s\-/.,]+(\d{{4}})")
_MONTH_FIRST = re.compile(rf"{_WORD}[\s\-/.]+(\d{{1,2}})(?:st|nd|rd|th)?[\s,]+(\d{{4}})")
_WEEKDAY = re.compile(r"^[^\W\d_]+\.?,?\s+(?=\d)")


def show_date(day: dt.date) -> str:
    """A date the way the window shows it: the one format of ``core.formatting``
    ("Thu 2 Sep 2027"), which ``read_date`` reads back."""
    from .formatting import format_date

    return format_date(day)


def _month_names() -> dict[str, int]:
    """English names and abbreviations, and those of the current locale."""
    names = {"sept": 9}
    for m, word in enumerate(_ENGLISH, start=1):
        names[word] = names[word[:3]] = m
        for local in (calendar.month_name[m], calendar.month_abbr[m]):
            if local:
                names[local.lower().rstrip(".")] = m
    return names


def _month(word: str, text: str) -> int:
    month = _month_names().get(word.lower())
    if month is None:
        raise PlanError(f"{text!r}: {word!r} is not a month name; type a date as {EXAMPLES}")
    return month


def _make(year: int, month: int, day: int, text: str) -> dt.date:
    if not 1 <= month <= 12:
        raise PlanError(f"{text!r}: there is no month {month}; type a date as {EXAMPLES}")
    last = calendar.monthrange(year, month)[1] if 1 <= year <= 9999 else 31
    if not 1 <= day <= last:
        raise PlanError(f"{text!r}: {_ENGLISH[month - 1].title()} {year} has {last} days")
    try:
        return dt.date(year, month, day)
    except ValueError as exc:
        raise PlanError(f"{text!r} is not a date ({exc})") from None


def read_date(text: str) -> dt.date:
    """The date ``text`` stands for; PlanError saying why not (never a silent guess)."""
    raw = text.strip()
    if not raw:
        raise PlanError(f"no date given; type a date as {EXAMPLES}")
    m = _ISO.fullmatch(raw)
    if m:
        y, mo, d = (int(g) for g in (m.groups()[:3] if m.group(1) else m.groups()[3:]))
        return _make(y, mo, d, raw)
    m = _MONTH_FIRST.fullmatch(raw)
    if m:
        return _make(int(m.group(3)), _month(m.group(1), raw), int(m.group(2)), raw)
    m = _DAY_FIRST.fullmatch(_WEEKDAY.sub("", raw))
    if m:
        return _make(int(m.group(3)), _month(m.group(2), raw), int(m.group(1)), raw)
    if re.fullmatch(r"\d{1,2}[-/.]\d{1,2}[-/.]\d{2,4}", raw):
        raise PlanError(f"{raw!r}: day and month could be either way round; type {EXAMPLES}")
    raise PlanError(f"{raw!r} is not a date; type a date as {EXAMPLES}")


def maybe_date(text: str) -> dt.date | None:
    """The date ``text`` stands for, or None when it is not one."""
    try:
        return read_date(text)
    except PlanError:
        return None
