"""``slackline export PLAN -o OUT``: the plan with its computed schedule as CSV/XLSX."""

from __future__ import annotations

from pathlib import Path

from ..core.analysis import analyze
from ..core.errors import PlanError
from .common import load_plan_file


def add_arguments(p) -> None:
    p.add_argument("plan", metavar="PLAN")
    p.add_argument("-o", "--output", required=True, metavar="OUT")


def run(args) -> int:
    from ..io.tabular import export_table

    out = Path(args.output)
    if out.suffix.lower() not in (".csv", ".xlsx"):
        raise PlanError(f"-o {args.output}: export writes .csv or .xlsx", "-o")
    plan = load_plan_file(args.plan)
    export_table(analyze(plan), out)
    print(f"exported {len(plan)} activities to {out}")
    return 0
