"""What the verbs share for the living schedule: ``--status-date``, ``--baseline``, and the
lines that say where the forecast starts and how it compares with the baseline."""

from __future__ import annotations

import datetime as dt
from dataclasses import replace

from ..core import baseline as bl
from ..core.errors import PlanError
from ..core.model import check_date
from .text import num


def add_status_date(p) -> None:
    p.add_argument("--status-date", metavar="YYYY-MM-DD",
                   help="progress is known to the end of this day (overrides the plan's status date)")


def add_baseline(p) -> None:
    p.add_argument("--baseline", metavar="NAME", help="compare with this baseline (default: the approved one)")


def status_date_way(args) -> str:
    """How to give a missing status date with this verb (its option, when it has one)."""
    if hasattr(args, "status_date"):
        return "give one with --status-date YYYY-MM-DD"
    return ("this verb reads it from the plan: set one in the window (Progress \u2192 Move the Status "
            "Date\u2026) and save, or give the plan file's settings a status_date")


def apply_status_date(plan, args) -> None:
    """Set the plan's status date from ``--status-date`` (refused unless a valid date)."""
    text = getattr(args, "status_date", None)
    if not text:
        return
    try:
        day = dt.date.fromisoformat(text)
    except ValueError:
        raise PlanError(f"--status-date: {text!r} is not a date YYYY-MM-DD", "--status-date") from None
    check_date(day, "--status-date", "date")
    plan.settings = replace(plan.settings, status_date=day)


def variance_for(analysis, args):
    """The variance against ``--baseline NAME`` or, without it, the approved baseline (None
    when the plan has none)."""
    from ..core.variance import variance_against

    chosen = bl.chosen(analysis.plan.baselines, getattr(args, "baseline", None))
    return None if chosen is None else variance_against(analysis, chosen)


def status_lines(analysis, variance, unit: str) -> list[str]:
    """"From the status date" and the baseline comparison, for the text outputs."""
    out = []
    frame = analysis.progress
    if frame is not None:
        counts = {name: frame.state_names().count(name) for name in ("done", "in progress", "not started")}
        out.append(f"Status date    {frame.status_date.isoformat()}: forecast from the status date "
                   f"(remaining work from offset {num(frame.status_offset)}, {frame.rule})")
        out.append("               " + ", ".join(f"{v} {k}" for k, v in counts.items()))
        out += [f"Warning        {w}" for w in frame.warnings]
    if variance is not None:
        moved = variance.finish_variance
        how = "later" if moved > 0 else "earlier" if moved < 0 else "unchanged"
        out.append(f"Baseline       {variance.baseline.name} (finish {variance.baseline.finish.isoformat()}): "
                   f"finish {how}" + (f" by {num(abs(moved))} {unit}" if moved else ""))
    return out
