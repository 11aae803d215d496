"""The checks every part of a plan shares: limits, ids, dates, numbers and text.
Pure Python, no Qt."""

from __future__ import annotations

import datetime as dt
import math
import re

from .errors import PlanError

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


def check_number(value, activity: str, field_name: str, allow_none: bool = True) -> float | None:
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
