"""The columns of the Activities table: headings, and cell text in and out.

Reading a cell never changes the plan: ``changes_for`` turns typed text into the field
changes of one ``EditActivity`` command, or raises PlanError naming the activity and the
field. No scheduling here; computed columns come from the core's Analysis.
"""

from __future__ import annotations

import datetime as dt
import math
import re
from dataclasses import dataclass

from workbench.core import formatting as fm
from workbench.core.date_text import maybe_date
from workbench.core.errors import PlanError
from workbench.core.model import DISTRIBUTIONS, Activity
from workbench.ui.activities import cost_columns as CC
from workbench.ui.activities import progress_columns as PC


@dataclass(frozen=True)
class Column:
    key: str
    title: str
    tip: str
    editable: bool = True
    numeric: bool = False
    hidden: bool = False       # hidden until shown from the headings' menu


COLUMNS: tuple[Column, ...] = (
    Column("id", "ID", "Short unique code of the activity"),
    Column("name", "Name", "What is done"),
    Column("group", "Group", "Work package or team, for filtering"),
    Column("optimistic", "Optimistic", "Shortest credible duration (a)", numeric=True),
    Column("most_likely", "Most likely", "Most likely duration (m)", numeric=True),
    Column("pessimistic", "Pessimistic", "Longest credible duration (b)", numeric=True),
    Column("duration", "Duration", "A fixed duration instead of three estimates; 0 makes a milestone", numeric=True),
    Column("predecessors", "Predecessors", "e.g. A; B SS 2; C FF -1  (ID [type [lag]])"),
    Column("te", "te", "PERT expected duration (a + 4m + b) / 6", editable=False, numeric=True),
    Column("sd", "σ", "PERT standard deviation (b − a) / 6", editable=False, numeric=True),
    Column("early_start", "Early start", "Earliest start date", editable=False),
    Column("early_finish", "Early finish", "Earliest finish date", editable=False),
    Column("late_start", "Late start", "Latest start date without delaying the finish", editable=False),
    Column("late_finish", "Late finish", "Latest finish date without delaying the finish", editable=False),
    Column("total_float", "Total float",
           "Delay possible without moving the project finish, or without missing the deadline when one is set",
           editable=False, numeric=True),
    Column("free_float", "Free float", "Delay possible without moving any successor", editable=False, numeric=True),
    Column("critical", "Critical", "On the critical path: zero float, or the least float when a deadline sets the late dates", editable=False),
    Column("distribution", "Distribution", "Duration distribution for simulation; empty = the plan's default"),
    Column("start_no_earlier", "Not before", "Start no earlier than: a date (YYYY-MM-DD) or an offset"),
    Column("finish_no_later", "Not after", "Finish no later than: a date (YYYY-MM-DD) or an offset"),
    Column("notes", "Notes", "Free text"),
    Column("state", "State", "Done, in progress or not started (from the actual dates)", editable=False),
    Column("actual_start", "Actual start", "When work began: a date (YYYY-MM-DD) or an offset; empty = not started"),
    Column("actual_finish", "Actual finish", "When work ended: a date or an offset; empty = not finished"),
    Column("remaining", "Remaining", "Work in progress: remaining duration, or 'a / m / b' as a remaining "
                                     "three-point estimate", numeric=True),
    Column("percent_complete", "% done", "Work in progress: percent complete; remaining = (1 − % done) × estimate",
           numeric=True),
    Column("baseline_start", "Baseline start", "Start date in the compared baseline", editable=False),
    Column("baseline_finish", "Baseline finish", "Finish date in the compared baseline", editable=False),
    Column("start_variance", "Start var.", "Start now minus baseline start (positive = later)", editable=False,
           numeric=True),
    Column("finish_variance", "Finish var.", "Finish now minus baseline finish (positive = later)", editable=False,
           numeric=True),
    Column("cost", "Cost", "Normal direct cost of the activity, for the Trade-off view", numeric=True, hidden=True),
    Column("crash_cost", "Crash cost", "Direct cost when fully shortened to its crash estimate (at least the normal "
                                       "cost; linear in between)", numeric=True, hidden=True),
    Column("crash_optimistic", "Crash optimistic", "Fastest achievable estimate: optimistic. The first crash point "
                                                   "typed fills all three", numeric=True, hidden=True),
    Column("crash_most_likely", "Crash most likely", "Fastest achievable estimate: most likely", numeric=True,
           hidden=True),
    Column("crash_pessimistic", "Crash pessimistic", "Fastest achievable estimate: pessimistic", numeric=True,
           hidden=True),
    Column("crash_duration", "Crash duration", "A fixed crash duration instead of three crash points",
           numeric=True, hidden=True),
)
KEYS = tuple(c.key for c in COLUMNS)
INDEX = {c.key: i for i, c in enumerate(COLUMNS)}
ESTIMATE = ("optimistic", "most_likely", "pessimistic")
CRITICAL_MARK = "● yes"


def format_number(value) -> str:
    if value is None:
        return ""
    value = float(value)
    if abs(value - round(value)) < 1e-9:
        return str(int(round(value)))
    return f"{value:.2f}".rstrip("0").rstrip(".")


def format_constraint(value) -> str:
    if value is None:
        return ""
    if isinstance(value, dt.date):
        return fm.format_date(value)
    return format_number(value)


def format_date(value) -> str:
    """A numpy datetime64 or date in Slackline's one date format ("Wed 3 Mar 2027")."""
    return fm.format_date(value)


_GROUPED = re.compile(r"[+-]?\d{1,3}(,\d{3})+(\.\d+)?")            # 12,500.50  1,500
_GROUPED_DOT = re.compile(r"[+-]?\d{1,3}((\.\d{3})+,\d+|(\.\d{3}){2,})")  # 12.500,50  1.500.000
_SPACES = str.maketrans("", "", " \u00a0\u202f\u2009")


def read_number_text(text: str) -> str:
    """Typed number text in Python's own form. One rule for every number cell: spaces group
    digits; a comma before groups of three digits groups thousands ("1,500" is 1500, as the
    table writes amounts); a dot is the decimal point ("1.500" is 1.5) unless dots group
    thousands before a decimal comma ("12.500,50") or group twice ("1.500.000"); any other
    single comma is a decimal comma ("1,5")."""
    text = text.strip().translate(_SPACES)
    if _GROUPED.fullmatch(text):
        return text.replace(",", "")
    if _GROUPED_DOT.fullmatch(text):
        return text.replace(".", "").replace(",", ".")
    if text.count(",") == 1 and "." not in text:
        return text.replace(",", ".")
    return text


def parse_number(text: str, act_id: str, title: str) -> float | None:
    text = read_number_text(text)
    if not text:
        return None
    try:
        value = float(text)
    except ValueError:
        raise PlanError(f"activity {act_id}: {title}: {text!r} is not a number", act_id) from None
    if not math.isfinite(value):
        raise PlanError(f"activity {act_id}: {title} must be a finite number", act_id)
    return value


def parse_date(text: str) -> dt.date | None:
    """A typed date: ISO ("2027-03-12") or as the table shows it ("Fri 12 Mar 2027",
    "12 Mar 2027"), or None."""
    return maybe_date(text) or fm.parse_date(text)


def parse_constraint(text: str, act_id: str, title: str):
    text = text.strip()
    if not text:
        return None
    day = parse_date(text)
    if day is not None:
        return day
    try:
        return parse_number(text, act_id, title)
    except PlanError:
        raise PlanError(f"activity {act_id}: {title}: {text!r} is neither a date (YYYY-MM-DD) "
                        "nor a number of units from the start", act_id) from None


def parse_distribution(text: str, act_id: str) -> str | None:
    text = text.strip().lower()
    if not text or text == "default":
        return None
    if text not in DISTRIBUTIONS:
        raise PlanError(f"activity {act_id}: distribution {text!r} is unknown (use {', '.join(DISTRIBUTIONS)} or leave empty)", act_id)
    return text


def _estimate_changes(act: Activity, key: str, value: float | None) -> dict:
    """Typing one of a/m/b: a first value fills all three; clearing one clears all three;
    an estimate replaces a fixed duration."""
    if value is None:
        return dict.fromkeys(ESTIMATE)
    if not act.has_estimate:
        return {**dict.fromkeys(ESTIMATE, value), "duration": None}
    return {key: value, "duration": None}


def changes_for(act: Activity, key: str, text: str) -> dict:
    """Field changes for typing ``text`` into column ``key`` of activity ``act``."""
    title = COLUMNS[INDEX[key]].title.lower()
    if key in ("id", "name", "group", "notes"):
        return {key: text.strip() if key == "id" else text}
    if key in ESTIMATE:
        return _estimate_changes(act, key, parse_number(text, act.id, title))
    if key == "duration":
        value = parse_number(text, act.id, "fixed duration")
        return {"duration": value} if value is None else {"duration": value, **dict.fromkeys(ESTIMATE)}
    if key == "distribution":
        return {"distribution": parse_distribution(text, act.id)}
    if key in ("start_no_earlier", "finish_no_later"):
        return {key: parse_constraint(text, act.id, title)}
    if key in PC.EDITABLE:
        return PC.changes_for(act, key, text, parse_number, parse_constraint)
    if key in CC.KEYS:
        return CC.changes_for(act, key, text, parse_number)
    raise PlanError(f"activity {act.id}: column {title!r} cannot be edited", act.id)


def edit_text(act: Activity, key: str) -> str:
    """The text shown for an editable field (display and editor alike)."""
    return _edit_text(act, key)


def _field_text(act: Activity, key: str) -> str:
    value = getattr(act, key)
    if key in ESTIMATE or key == "duration" or key in CC.KEYS:
        return format_number(value)
    if key in ("start_no_earlier", "finish_no_later"):
        return format_constraint(value)
    if key == "distribution":
        return value or ""
    return value


def _edit_text(act: Activity, key: str) -> str:
    if key in PC.EDITABLE:
        return PC.edit_text(act, key, format_number, format_constraint)
    return _field_text(act, key)
