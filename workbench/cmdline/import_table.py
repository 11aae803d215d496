"""``slackline import SRC -o PLAN.slw``: a CSV/XLSX activity list into a plan file."""

from __future__ import annotations

import datetime as dt
from pathlib import Path

from ..core.analysis import analyze
from ..core.errors import PlanError


def add_arguments(p) -> None:
    p.add_argument("source", metavar="SRC")
    p.add_argument("-o", "--output", required=True, metavar="PLAN.slw")
    p.add_argument("--start", metavar="YYYY-MM-DD")
    p.add_argument("--unit", choices=("days", "weeks"), default="days")


def run(args) -> int:
    from ..io.planfile import save_plan
    from ..io.tabular import read_table
    from ..core.model import Settings

    src = Path(args.source)
    if src.suffix.lower() not in (".csv", ".xlsx"):
        raise PlanError(f"{args.source}: import reads .csv or .xlsx files", "SRC")
    if not src.exists():
        raise PlanError(f"{args.source}: no such file", "SRC")
    if not src.is_file():
        raise PlanError(f"{args.source}: not a regular file", "SRC")
    if Path(args.output).suffix.lower() != ".slw":
        raise PlanError(f"-o {args.output}: the output must be a .slw plan file", "-o")
    settings = Settings(title=src.stem, unit=args.unit)
    if args.start:
        try:
            settings.start = dt.date.fromisoformat(args.start)
        except ValueError:
            raise PlanError(f"--start: {args.start!r} is not a date YYYY-MM-DD", "--start") from None
    plan = read_table(src, settings=settings)
    analyze(plan)  # refuse a plan that cannot be scheduled before writing anything
    save_plan(plan, args.output)
    print(f"imported {len(plan)} activities and {len(plan.links)} links into {args.output}")
    return 0
