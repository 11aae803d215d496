"""``slackline import SRC -o PLAN.slw``: a CSV/XLSX activity list into a plan file."""

from __future__ import annotations

import datetime as dt
import sys
from pathlib import Path

from ..core.analysis import analyze
from ..core.errors import PlanError
from .common import refuse_if_locked, save_plan_file


def add_arguments(p) -> None:
    p.add_argument("source", metavar="SRC")
    p.add_argument("-o", "--output", required=True, metavar="PLAN.slw")
    p.add_argument("--start", metavar="YYYY-MM-DD")
    p.add_argument("--unit", choices=("days", "weeks"), default="days")
    p.add_argument("--force", action="store_true",
                   help="replace PLAN.slw even if a window has it open, or its owner or group would change")
    p.add_argument("--resources", metavar="RES.csv",
                   help="the resources (columns id, name, units, cost) for a CSV's 'resources' column")
    p.add_argument("--status-date", metavar="YYYY-MM-DD", help="the status date of the progress columns")


def run(args) -> int:
    from ..io.tabular import read_table_report
    from ..core.model import Settings
    from ..core.text import clean_text

    src = Path(args.source)
    if src.suffix.lower() not in (".csv", ".xlsx"):
        raise PlanError(f"{args.source}: import reads .csv or .xlsx files", "SRC")
    if not src.exists():
        raise PlanError(f"{args.source}: no such file", "SRC")
    if not src.is_file():
        raise PlanError(f"{args.source}: not a regular file", "SRC")
    if Path(args.output).suffix.lower() != ".slw":
        raise PlanError(f"-o {args.output}: the output must be a .slw plan file", "-o")
    settings = Settings(title=clean_text(src.stem), unit=args.unit)  # a file name may hold undecodable bytes
    if args.start:
        try:
            settings.start = dt.date.fromisoformat(args.start)
        except ValueError:
            raise PlanError(f"--start: {args.start!r} is not a date YYYY-MM-DD", "--start") from None
    resources = None
    if args.resources:
        from ..io.tabular import read_resource_file
        res = Path(args.resources)
        if not res.is_file():
            raise PlanError(f"--resources {args.resources}: no such file", "--resources")
        unread: list[str] = []
        resources = read_resource_file(res, unread)
        if unread:
            print(f"warning: {res.name}: columns not read: {', '.join(repr(c) for c in unread)} "
                  "(a resources table reads id, name, units and cost)", file=sys.stderr)
    refuse_if_locked(args.output, args.force)  # before the work of reading
    plan, report = read_table_report(src, settings=settings, resources=resources)
    if report.ignored_columns:
        print(f"warning: {src.name}: columns not read: {', '.join(repr(c) for c in report.ignored_columns)}",
              file=sys.stderr)
    from .living import apply_status_date
    apply_status_date(plan, args)
    analyze(plan)  # refuse a plan that cannot be scheduled before writing anything
    save_plan_file(plan, args.output, args.force)
    extra = f" and {len(plan.resources)} resources" if plan.resources else ""
    print(f"imported {len(plan)} activities, {len(plan.links)} links{extra} into {args.output}")
    return 0
