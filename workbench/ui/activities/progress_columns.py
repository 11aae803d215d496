"""The progress and baseline columns of the Activities table: typed text in and out.

Editable: actual start, actual finish (a date YYYY-MM-DD or an offset, as constraints),
remaining work (one number for a fixed remaining duration, or "a / m / b" for a remaining
three-point estimate) and percent complete. Each edit is one ``EditActivity`` of the
activity's whole progress record, so the core checks it and the undo step is one.
Computed: the state, the compared baseline's dates and the start/finish variances.
"""

from __future__ import annotations

import re

from workbench.core.errors import PlanError
from workbench.core.progress_fields import Progress

EDITABLE = ("actual_start", "actual_finish", "remaining", "percent_complete")
COMPUTED = ("state", "baseline_start", "baseline_finish", "start_variance", "finish_variance")
_REMAINING = ("remaining_optimistic", "remaining_most_likely", "remaining_pessimistic", "remaining",
              "percent_complete")
_SPLIT = re.compile(r"\s*[/;]\s*|\s+")
# How refusals name the fields here: as the table's columns are headed.
WINDOW_NAMES = {"actual_start": "actual start", "actual_finish": "actual finish", "remaining": "remaining",
                "remaining_estimate": "remaining", "percent_complete": "% done"}


def edit_text(act, key: str, fmt_number, fmt_point) -> str:
    p = act.progress
    if p is None:
        return ""
    if key in ("actual_start", "actual_finish"):
        return fmt_point(getattr(p, key))
    if key == "percent_complete":
        return fmt_number(p.percent_complete)
    if p.has_remaining_estimate:
        return " / ".join(fmt_number(v) for v in (p.remaining_optimistic, p.remaining_most_likely,
                                                   p.remaining_pessimistic))
    return fmt_number(p.remaining)


def changes_for(act, key: str, text: str, parse_number, parse_point) -> dict:
    """{"progress": the new record (None when empty)} for typing ``text`` into ``key``."""
    p = act.progress or Progress()
    if key in ("actual_start", "actual_finish"):
        p = p.with_(**{key: parse_point(text, act.id, key.replace("_", " "))})
        if key == "actual_finish" and p.actual_finish is not None:   # finished: nothing remains
            p = p.with_(**dict.fromkeys(_REMAINING))
    elif key == "percent_complete":
        value = parse_number(text.strip().rstrip("%"), act.id, WINDOW_NAMES[key])
        p = p.with_(**{**dict.fromkeys(_REMAINING), "percent_complete": value})
    else:
        p = p.with_(**{**dict.fromkeys(_REMAINING), **_remaining(text, act.id, parse_number)})
    p = None if p.is_empty else p
    if p is not None:
        p.validated(act.id, WINDOW_NAMES)
    return {"progress": p}


def _remaining(text: str, act_id: str, parse_number) -> dict:
    parts = [x for x in _SPLIT.split(text.strip()) if x]
    if not parts:
        return {}
    if len(parts) == 1:
        return {"remaining": parse_number(parts[0], act_id, "remaining")}
    if len(parts) == 3:
        a, m, b = (parse_number(x, act_id, "remaining") for x in parts)
        return {"remaining_optimistic": a, "remaining_most_likely": m, "remaining_pessimistic": b}
    raise PlanError(f"activity {act_id}: remaining: write one number, or three as optimistic / most likely / "
                    f"pessimistic (not {text.strip()!r})", act_id)
