"""``slackline export PLAN -o OUT``: the plan with its computed schedule as CSV/XLSX."""

from __future__ import annotations

from pathlib import Path

from ..core.analysis import analyze
from ..core.errors import PlanError
from .common import load_plan_file
from .living import add_baseline, add_status_date, apply_status_date, variance_for


def add_arguments(p) -> None:
    p.add_argument("plan", metavar="PLAN")
    p.add_argument("-o", "--output", required=True, metavar="OUT")
    add_status_date(p)
    add_baseline(p)


def run(args) -> int:
    from ..io.tabular import export_table

    out = Path(args.output)
    if out.suffix.lower() not in (".csv", ".xlsx"):
        raise PlanError(f"-o {args.output}: export writes .csv or .xlsx", "-o")
    plan = load_plan_file(args.plan)
    apply_status_date(plan, args)
    result = analyze(plan)
    export_table(result, out, variance_for(result, args))
    print(f"exported {len(plan)} activities to {out}")
    return 0
