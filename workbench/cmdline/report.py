"""``slackline report PLAN -o pack.pdf``: the approval pack."""

from __future__ import annotations

import os
from pathlib import Path

from ..core.errors import PlanError
from .common import check_iterations, load_plan_file


def add_arguments(p) -> None:
    p.add_argument("plan", metavar="PLAN")
    p.add_argument("-o", "--output", required=True, metavar="PACK.pdf")
    p.add_argument("--paper", choices=("a4", "letter"), default="a4")
    p.add_argument("--iterations", type=int, default=10_000, metavar="N")
    p.add_argument("--seed", type=int, default=None, metavar="S")


def run(args) -> int:
    from ..reports.pack import build_pack

    check_iterations(args.iterations)
    if Path(args.output).suffix.lower() != ".pdf":
        raise PlanError(f"-o {args.output}: the approval pack is written as .pdf", "-o")
    plan = load_plan_file(args.plan)
    info = build_pack(plan, args.output, paper=args.paper, iterations=args.iterations, seed=args.seed,
                      plan_path=os.path.basename(args.plan))
    print(f"wrote {args.output} ({getattr(info, 'pages', '?')} pages, seed {getattr(info, 'seed', args.seed)})")
    return 0
