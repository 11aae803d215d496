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
