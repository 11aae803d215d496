"""``slackline baseline PLAN --name NAME [--approved]``: record a baseline in the plan file.

The baseline holds every activity's planned dates and estimates, the links, the project
finish, PERT and simulation figures and the plan hash; the plan file is saved atomically
(the previous file kept as ``PLAN.slw.bak``). ``--list`` shows the recorded baselines.
"""

from __future__ import annotations

from pathlib import Path

from ..core.errors import PlanError
from .common import check_iterations, load_plan_file
from .living import add_status_date, apply_status_date
from workbench.core.formatting import format_whole_percent


def add_arguments(p) -> None:
    p.add_argument("plan", metavar="PLAN.slw")
    p.add_argument("--name", metavar="NAME", help="the baseline's name (required unless --list)")
    p.add_argument("--approved", action="store_true", help="mark it the approved baseline")
    p.add_argument("--iterations", type=int, default=10_000, metavar="N", help="simulation iterations (0: none)")
    p.add_argument("--seed", type=int, default=None, metavar="S")
    p.add_argument("--list", action="store_true", help="list the plan's baselines and change nothing")
    add_status_date(p)


def run(args) -> int:
    if Path(args.plan).suffix.lower() != ".slw":
        raise PlanError(f"{args.plan}: baselines are kept inside a .slw plan file", "PLAN")
    plan = load_plan_file(args.plan)
    if args.list:
        print(listing(plan))
        return 0
    if not args.name:
        raise PlanError("--name: give the baseline a name (or use --list)", "--name")
    if args.iterations:
        check_iterations(args.iterations)
    apply_status_date(plan, args)
    record(plan, args)
    print(f"recorded baseline {args.name.strip()!r}{' (approved)' if args.approved else ''} in {args.plan}")
    return 0


def record(plan, args) -> None:
    from ..core.analysis import analyze
    from ..core.baseline import check_name, make_baseline
    from ..core.baseline_commands import RecordBaseline
    from ..core.montecarlo import simulate
    from ..io.planfile import plan_hash, save_plan

    check_name(args.name)
    if any(b.name == args.name.strip() for b in plan.baselines):
        raise PlanError(f"--name: a baseline named {args.name.strip()!r} exists already; choose another name", "--name")
    analysis = analyze(plan)
    sim = simulate(plan, args.iterations, args.seed) if args.iterations else None
    RecordBaseline(make_baseline(args.name, analysis, plan_hash(plan), sim, approved=args.approved)).do(plan)
    save_plan(plan, args.plan)


def listing(plan) -> str:
    if not plan.baselines:
        return "no baselines recorded"
    lines = []
    for b in plan.baselines:
        odds = b.simulation or b.pert
        chance = "" if odds is None or odds.probability is None else f", chance of the deadline {format_whole_percent(odds.probability)}"
        lines.append(f"{'*' if b.approved else ' '} {b.name}: recorded {b.recorded.isoformat()}, finish "
                     f"{b.finish.isoformat()}{chance}, plan {b.plan_hash}")
    return "\n".join(lines + ["(* approved)"])
