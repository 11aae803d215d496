"""``slackline simulate PLAN``: the Monte Carlo finish distribution, P50/P80/P90 and drivers."""

from __future__ import annotations

import sys

from .common import add_plan_settings, check_iterations, load_plan_with_settings, parse_offset_or_date, write_json
from .living import add_status_date, apply_status_date
from .text import CAUTION, elide, num, pct, table

DISTRIBUTION_CHOICES = ("beta-pert", "triangular", "uniform", "normal")


def add_arguments(p) -> None:
    p.add_argument("plan", metavar="PLAN")
    add_plan_settings(p)
    p.add_argument("--iterations", type=int, default=10_000, metavar="N")
    p.add_argument("--seed", type=int, default=None, metavar="S")
    p.add_argument("--deadline", metavar="N|YYYY-MM-DD")
    p.add_argument("--distribution", choices=DISTRIBUTION_CHOICES, default=None)
    p.add_argument("--json", action="store_true")
    p.add_argument("--resources", action="store_true",
                   help="schedule every iteration with the plan's resources (levelled order)")
    add_status_date(p)
    p.add_argument("--record-trend", action="store_true",
                   help="record this run as the odds trend point of the status date (saves the .slw)")


def run(args) -> int:
    check_iterations(args.iterations)
    plan = load_plan_with_settings(args)
    apply_status_date(plan, args)
    from ..core.montecarlo import simulate

    deadline = parse_offset_or_date(args.deadline, "--deadline") if args.deadline is not None else None
    progress = None
    if not args.json and sys.stderr.isatty():
        def progress(done, total):
            print(f"\rsimulating {done}/{total}", end="", file=sys.stderr, flush=True)
    result = simulate(plan, args.iterations, args.seed, distribution=args.distribution,
                      deadline=deadline, progress=progress, resources=args.resources)
    if progress:
        print(file=sys.stderr)
    data = result.to_dict()
    data.update(status_fields(plan))
    if args.record_trend:
        record_trend(plan, args, result, deadline)
    data["title"] = plan.settings.title
    data["names"] = {a.id: a.name for a in plan.activities}      # ids above, names here
    if args.json:
        write_json(data)
    else:
        print(render_simulation(plan, data))
    return 0


def status_fields(plan) -> dict:
    from ..core.progress import has_progress
    day = plan.settings.status_date if has_progress(plan) else None
    return {"status_date": day.isoformat() if day else None}


def record_trend(plan, args, result, deadline) -> None:
    """Add the run to the plan's odds trend (one point per status date) and save atomically."""
    from ..core.analysis import analyze
    from ..core.baseline import make_trend_point
    from ..core.baseline_commands import RecordTrendPoint
    from ..core.errors import PlanError
    from ..io.planfile import plan_hash, save_plan

    if not args.plan.lower().endswith(".slw"):
        raise PlanError(f"--record-trend: {args.plan} is not a .slw plan file (a table cannot hold the trend)", "--record-trend")
    RecordTrendPoint(make_trend_point(analyze(plan, deadline=deadline), result, plan_hash(plan))).do(plan)
    save_plan(plan, args.plan)
    print(f"recorded the odds trend point of {plan.odds_trend[-1].status_date.isoformat()} in {args.plan}",
          file=sys.stderr)


def _crews_shift(shift: float, unit: str) -> str:
    """How far the resource-aware mean sits from PERT's, in words that fit when it is none."""
    if abs(shift) < 0.0005:
        return "the same as PERT's"
    return f"{num(abs(shift), 3)} {unit} {'later' if shift > 0 else 'earlier'} (merging paths and crews)"


def render_simulation(plan, data: dict) -> str:
    unit = plan.settings.unit
    mode = ", resource-aware (crews hold work back in every iteration)" if data.get("resource_aware") else ""
    out = [f"{plan.settings.title}: {data['iterations']} iterations, seed {data['seed']}{mode}", ""]
    if data.get("status_date"):
        out[1:1] = [f"From the status date {data['status_date']}: actual dates fixed, only remaining work uncertain"]
    out.append(f"Mean finish    {num(data['mean'])} {unit} (sd {num(data['sd'], 3)}); "
               f"PERT mean {num(data.get('pert_mean', float('nan')))}; "
               + (_crews_shift(data["merge_bias"], unit) if data.get("resource_aware")
                  else f"merge bias {num(data['merge_bias'], 3)} {unit}"))
    dates = data.get("percentile_dates", {})
    for key in ("P10", "P50", "P80", "P90"):
        if key in data["percentiles"]:
            out.append(f"{key:<14} {dates.get(key, '')}  ({num(data['percentiles'][key])} {unit})")
    if "probability" in data:
        out.append(f"P(finish by deadline) = {pct(data['probability'])}")
    for note in data.get("notes", []) + ([data["correlation_note"]] if data.get("correlation_note") else []):
        out.append(f"Note: {note}")
    out += ["", "Top drivers (uncertain activities by rank correlation with the finish)",
            drivers_table(plan, data), "", CAUTION]
    return "\n".join(out)


def drivers_table(plan, data: dict, top: int = 10) -> str:
    crit, sens = data["criticality"], data["sensitivity"]
    uncertain = [a.id for a in plan.activities if a.variance > 0 or a.id in {i for r in plan.risks for i in r.activities}]
    ranked = sorted(uncertain, key=lambda k: (-abs(sens.get(k, 0.0)), -crit.get(k, 0.0), k))[:top]
    rows = [[k, elide(plan.activity(k).name, 32), f"{sens.get(k, 0.0):+.3f}", f"{crit.get(k, 0.0):.3f}"]
            for k in ranked]
    return table(["id", "name", "sensitivity", "criticality"], rows, right={2, 3})
