"""``slackline simulate PLAN``: the Monte Carlo finish distribution, P50/P80/P90 and drivers."""

from __future__ import annotations

import sys

from .common import check_iterations, load_plan_file, parse_offset_or_date, write_json
from .text import CAUTION, elide, num, pct, table

DISTRIBUTION_CHOICES = ("beta-pert", "triangular", "uniform", "normal")


def add_arguments(p) -> None:
    p.add_argument("plan", metavar="PLAN")
    p.add_argument("--iterations", type=int, default=10_000, metavar="N")
    p.add_argument("--seed", type=int, default=None, metavar="S")
    p.add_argument("--deadline", metavar="N|YYYY-MM-DD")
    p.add_argument("--distribution", choices=DISTRIBUTION_CHOICES, default=None)
    p.add_argument("--json", action="store_true")


def run(args) -> int:
    check_iterations(args.iterations)
    plan = load_plan_file(args.plan)
    from ..core.montecarlo import simulate

    deadline = parse_offset_or_date(args.deadline, "--deadline") if args.deadline else None
    progress = None
    if not args.json and sys.stderr.isatty():
        def progress(done, total):
            print(f"\rsimulating {done}/{total}", end="", file=sys.stderr, flush=True)
    result = simulate(plan, args.iterations, args.seed, distribution=args.distribution,
                      deadline=deadline, progress=progress)
    if progress:
        print(file=sys.stderr)
    data = result.to_dict()
    if args.json:
        write_json(data)
    else:
        print(render_simulation(plan, data))
    return 0


def render_simulation(plan, data: dict) -> str:
    unit = plan.settings.unit
    out = [f"{plan.settings.title}: {data['iterations']} iterations, seed {data['seed']}", ""]
    out.append(f"Mean finish    {num(data['mean'])} {unit} (sd {num(data['sd'], 3)}); "
               f"PERT mean {num(data.get('pert_mean', float('nan')))}; merge bias {num(data['merge_bias'], 3)} {unit}")
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
