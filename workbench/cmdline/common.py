"""What the command line's verbs share: reading a plan argument, offsets or dates, JSON out."""

from __future__ import annotations

import datetime as dt
import json
import sys
from pathlib import Path

from ..core.errors import PlanError
from ..core.model import MAX_UNITS, check_date

PLAN_SUFFIXES = (".slw", ".csv", ".xlsx")
MAX_ITERATIONS = 10_000_000


def check_iterations(n: int) -> None:
    if n <= 0:
        raise PlanError(f"--iterations must be a positive whole number, not {n}", "--iterations")
    if n > MAX_ITERATIONS:
        raise PlanError(f"--iterations {n} is more than {MAX_ITERATIONS:,} (the percentiles settle long before)", "--iterations")


def parse_offset_or_date(text: str, what: str):
    """``--deadline 47`` or ``--deadline 2027-11-30``."""
    if not text.strip():
        raise PlanError(f"{what}: empty; give a number of plan units or a date YYYY-MM-DD "
                        f"(leave {what} out for none)", what)
    try:
        return check_date(dt.date.fromisoformat(text), what, "date")
    except ValueError as exc:
        if isinstance(exc, PlanError):
            raise
    try:
        value = float(text)
    except ValueError:
        raise PlanError(f"{what}: {text!r} is neither a number of plan units nor a date YYYY-MM-DD", what) from None
    if value != value or abs(value) > MAX_UNITS:
        raise PlanError(f"{what}: {text!r} must be a number within {MAX_UNITS:,.0f} plan units of the start", what)
    return value


def load_plan_file(path: str):
    p = Path(path)
    if p.suffix.lower() not in PLAN_SUFFIXES:
        raise PlanError(f"{path}: unsupported file type {p.suffix or '(none)'!r}; use .slw, .csv or .xlsx", "PLAN")
    if not p.exists():
        raise PlanError(f"{path}: no such file", "PLAN")
    if p.is_dir():
        raise PlanError(f"{path}: is a folder, not a plan file", "PLAN")
    if not p.is_file():
        raise PlanError(f"{path}: not a regular file (a pipe or device cannot be read as a plan)", "PLAN")
    from ..io.tabular import load_any

    return load_any(p)


def write_json(obj) -> None:
    sys.stdout.write(json.dumps(obj, indent=2, ensure_ascii=False, allow_nan=False) + "\n")


def refuse_if_locked(path, force: bool) -> None:
    """A verb that writes a plan file leaves alone a plan a window has open for editing
    (unless ``--force``), naming who holds it."""
    from ..io.lock_info import lock_holder

    holder = None if force else lock_holder(path)
    if holder is not None:
        raise PlanError(f"{path}: open for editing in a Slackline window ({holder.describe()}); close it there "
                        "first, write to another file, or add --force to replace it anyway", "-o")


def save_plan_file(plan, path, force: bool) -> None:
    """Save for a writing verb: honour the window's lock, and say before writing when the
    file's owner or group would change (``--force`` writes anyway)."""
    from ..io.planfile import OwnershipChange, save_plan

    refuse_if_locked(path, force)
    try:
        save_plan(plan, path, accept_owner_change=force)
    except OwnershipChange as exc:
        raise PlanError(f"{exc} (nothing written; add --force to write it anyway)", "-o") from None
