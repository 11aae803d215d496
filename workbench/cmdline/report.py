"""``slackline report PLAN -o pack.pdf``: the approval pack."""

from __future__ import annotations

import os
from pathlib import Path

from ..core.errors import PlanError
from .common import add_plan_settings, check_iterations, load_plan_with_settings
from .living import add_status_date, apply_status_date


def add_arguments(p) -> None:
    p.add_argument("plan", metavar="PLAN")
    add_plan_settings(p)
    p.add_argument("-o", "--output", required=True, metavar="PACK.pdf")
    p.add_argument("--paper", choices=("a4", "letter"), default="a4")
    p.add_argument("--iterations", type=int, default=10_000, metavar="N")
    p.add_argument("--seed", type=int, default=None, metavar="S")
    add_status_date(p)
    p.add_argument("--record-baseline", metavar="NAME",
                   help="record the pack as a baseline of this name in the .slw (its hash ties them)")
    p.add_argument("--approved", action="store_true", help="with --record-baseline: mark it approved")


def run(args) -> int:
    from ..reports.pack import build_pack

    check_iterations(args.iterations)
    if Path(args.output).suffix.lower() != ".pdf":
        raise PlanError(f"-o {args.output}: the approval pack is written as .pdf", "-o")
    plan = load_plan_with_settings(args)
    apply_status_date(plan, args)
    if args.record_baseline:
        check_recordable(plan, args)
    info = build_pack(plan, args.output, paper=args.paper, iterations=args.iterations, seed=args.seed,
                      plan_path=os.path.basename(args.plan))
    print(f"wrote {args.output} ({getattr(info, 'pages', '?')} pages, seed {getattr(info, 'seed', args.seed)})")
    if args.record_baseline:
        record_pack_baseline(plan, args, info)
    return 0


def check_recordable(plan, args) -> None:
    from ..core.baseline import check_name

    if Path(args.plan).suffix.lower() != ".slw":
        raise PlanError(f"--record-baseline: {args.plan} is not a .slw plan file (a table cannot hold baselines)",
                        "--record-baseline")
    name = check_name(args.record_baseline)
    if any(b.name == name for b in plan.baselines):
        raise PlanError(f"--record-baseline: a baseline named {name!r} exists already", "--record-baseline")


def record_pack_baseline(plan, args, info) -> None:
    """The signed pack becomes the baseline: same analysis, simulation and plan hash."""
    from ..core.baseline import make_baseline
    from ..core.baseline_commands import RecordBaseline
    from ..io.planfile import save_plan

    RecordBaseline(make_baseline(args.record_baseline, info.analysis, info.hash, info.simulation,
                                 approved=args.approved)).do(plan)
    save_plan(plan, args.plan)
    print(f"recorded baseline {args.record_baseline.strip()!r} (plan hash {info.hash}) in {args.plan}")
