"""The cost columns of the Activities table: typed text in and out.

Editable, hidden until shown from the headings' menu: the normal direct cost, the crash
cost (the direct cost when fully shortened) and the crash estimate, entered as the normal
one is: three points (the first one typed fills all three; emptying one clears them) or
a fixed crash duration (typing one clears the points, and the other way round). The
headings are the spreadsheet columns' names, so copied rows paste back. Each edit is one
``EditActivity``, so the core checks it as it checks an import (a crash estimate longer
than the normal one, a crash cost below the normal cost, a negative cost) and the undo
step is one.
"""

from __future__ import annotations

from workbench.core.crash_terms import CRASH_POINTS

KEYS = ("cost", "crash_cost") + CRASH_POINTS + ("crash_duration",)
def parse_money(text: str, act_id: str, title: str, parse_number) -> float | None:
    """A typed amount, read as every number cell reads: "12500", "12,500", "12 500",
    "12.500,50" or a decimal comma ("99,5")."""
    return parse_number(text, act_id, title)


def changes_for(act, key: str, text: str, parse_number) -> dict:
    title = key.replace("_", " ")
    if key in ("cost", "crash_cost"):
        return {key: parse_money(text, act.id, title, parse_number)}
    value = parse_number(text, act.id, title)
    if key == "crash_duration":
        return {"crash_duration": value} if value is None else {"crash_duration": value, **dict.fromkeys(CRASH_POINTS)}
    if value is None:
        return dict.fromkeys(CRASH_POINTS)
    if act.crash_optimistic is None:          # the first point typed fills all three
        return {**dict.fromkeys(CRASH_POINTS, value), "crash_duration": None}
    return {key: value, "crash_duration": None}
