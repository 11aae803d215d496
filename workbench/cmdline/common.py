"""What the command line's verbs share: reading a plan argument, offsets or dates, JSON out."""

from __future__ import annotations

import datetime as dt
import gc
import json
import math
import sys
from pathlib import Path

from ..core.errors import PlanError
from ..core.model import MAX_UNITS, check_date, check_length

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


def add_plan_settings(p) -> None:
    """``--start`` and ``--title``: what a CSV/XLSX list cannot carry (they also override a plan file's)."""
    p.add_argument("--start", metavar="YYYY-MM-DD", help="project start (default: the plan's; a table: today)")
    p.add_argument("--title", metavar="TEXT", help="plan title (default: the plan's; a table: its file name)")


def load_plan_with_settings(args):
    """The plan named by ``args.plan`` with ``--start`` and ``--title`` applied; a table
    without ``--title`` is titled by its file name rather than "Untitled plan"."""
    from dataclasses import replace

    plan = load_plan_file(args.plan)
    changes = {}
    if getattr(args, "start", None):
        try:
            changes["start"] = check_date(dt.date.fromisoformat(args.start), "--start", "date")
        except ValueError as exc:
            if isinstance(exc, PlanError):
                raise
            raise PlanError(f"--start: {args.start!r} is not a date YYYY-MM-DD", "--start") from None
    title = getattr(args, "title", None)
    if title is not None and title.strip():
        changes["title"] = check_length(title.strip(), "--title", "title", "--title")
    elif Path(args.plan).suffix.lower() != ".slw":
        changes["title"] = Path(args.plan).stem
    if changes:
        plan.set_settings(replace(plan.settings, **changes))
    return plan


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
    if p.suffix.lower() == ".slw":
        from ..io.planfile import load_plan as load_any    # without the table readers' imports
    else:
        from ..io.tabular import load_any

    plan = load_any(p)
    _note_long_texts(plan, p.name)
    gc.freeze()     # a verb keeps its plan to the end: later collections need not scan it
    return plan


def _note_long_texts(plan, name: str) -> None:
    """Texts over the entry limits are kept whole; say which, on stderr."""
    from ..core.long_texts import describe, long_texts
    note = describe(long_texts(plan))
    if note:
        print(f"note: {name}: {note}", file=sys.stderr)


def write_json(obj) -> None:
    """``obj`` as indented JSON on stdout. msgspec writes the same text as the standard
    library's indenting encoder, about ten times faster; what it would write differently
    (NaN or an infinity, which it spells null) or cannot write (a lone surrogate) goes to
    the standard library as before."""
    import msgspec

    try:
        text = msgspec.json.encode(obj)
    except (TypeError, ValueError, UnicodeError, msgspec.EncodeError):
        text = None
    if text is None or (b"null" in text and _has_bad_float(obj)):
        sys.stdout.write(json.dumps(obj, indent=2, ensure_ascii=False, allow_nan=False) + "\n")
        return
    text = msgspec.json.format(text, indent=2) + b"\n"
    out = getattr(sys.stdout, "buffer", None)
    if out is None:
        sys.stdout.write(text.decode("utf-8"))
        return
    sys.stdout.flush()
    out.write(text)
    out.flush()


def _has_bad_float(obj) -> bool:
    if isinstance(obj, float):
        return obj != obj or obj in (math.inf, -math.inf)
    if isinstance(obj, dict):
        return any(map(_has_bad_float, obj.values()))
    if isinstance(obj, (list, tuple)):
        return any(map(_has_bad_float, obj))
    return False




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
