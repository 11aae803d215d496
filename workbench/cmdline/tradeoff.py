"""``slackline tradeoff PLAN``: what it costs to buy time — the exact cost curve, the
total-cost optimum, the crash of the mean schedule to the deadline and the cheapest crash
to a confidence, checked on an independent simulation."""

from __future__ import annotations

import sys

from ..core.errors import PlanError
from .common import check_iterations, load_plan_file, parse_offset_or_date, write_json
from .text import CAUTION, num, table


def add_arguments(p) -> None:
    p.add_argument("plan", metavar="PLAN")
    p.add_argument("--deadline", metavar="N|YYYY-MM-DD")
    p.add_argument("--confidence", type=float, default=None, metavar="P",
                   help="target chance of the deadline, 0 < P < 1 (default: the plan's target)")
    p.add_argument("--iterations", type=int, default=2000, metavar="N",
                   help="scenarios to optimise on, and as many again for the check")
    p.add_argument("--seed", type=int, default=None, metavar="S")
    p.add_argument("--indirect-cost", type=float, default=None, metavar="X", help="per plan unit")
    p.add_argument("--penalty", type=float, default=None, metavar="X", help="per plan unit past the deadline")
    p.add_argument("--json", action="store_true")


def _checked(value, what: str):
    if value is not None and (value != value or value < 0 or value == float("inf")):
        raise PlanError(f"{what} must be a finite number of at least 0, not {value}", what)
    return value


def run(args) -> int:
    check_iterations(args.iterations)
    target = args.confidence
    if target is not None and not 0.0 < target < 1.0:
        raise PlanError(f"--confidence must lie between 0 and 1 (e.g. 0.9), not {target:g}", "--confidence")
    if args.seed is not None and args.seed < 0:
        raise PlanError(f"--seed must be a non-negative whole number, not {args.seed}", "--seed")
    plan = load_plan_file(args.plan)
    from ..core.tradeoff import tradeoff

    deadline = parse_offset_or_date(args.deadline, "--deadline") if args.deadline else None
    target = plan.settings.target_confidence if target is None else target
    progress = None
    if not args.json and sys.stderr.isatty():
        def progress(done, total):
            print(f"\rsearching {done}/{total}", end="", file=sys.stderr, flush=True)
    result = tradeoff(plan, deadline, [target], args.iterations, args.seed,
                      indirect_cost=_checked(args.indirect_cost, "--indirect-cost"),
                      penalty=_checked(args.penalty, "--penalty"), progress=progress)
    if progress:
        print(file=sys.stderr)
    data = result.to_dict()
    if args.json:
        write_json(data)
    else:
        print(render_tradeoff(plan, data))
    return 0


def pct(p: float) -> str:
    return f"{100 * p:.1f} %"


def _crashed(plan, crashed: dict) -> str:
    rows = [[k, plan.activity(k).name[:34], num(v)] for k, v in crashed.items()]
    return table(["id", "name", "shortened by"], rows, right={2}) if rows else "(nothing)"


def render_tradeoff(plan, data: dict) -> str:
    unit = plan.settings.unit
    out = [f"{plan.settings.title}: what it costs to buy time", ""]
    rows = [[num(p["duration"]), f"{p['direct_cost']:,.0f}", str(len(p["crashed"]))] for p in data["curve"]]
    out += ["Least direct cost by duration (breakpoints, shortest first)",
            table([f"duration ({unit})", "direct cost", "activities shortened"], rows, right={0, 1, 2}), ""]
    o = data["optimum"]
    out.append(f"Total-cost optimum: {num(o['duration'])} {unit}: direct {o['direct_cost']:,.0f} + indirect "
               f"{o['indirect_cost']:,.0f} = {o['total_cost']:,.0f}")
    d, c = data["to_deadline"], data["to_confidence"]
    if d is not None:
        out += ["", f"Crash the mean schedule to the deadline ({num(data['deadline'])} {unit}): "
                f"{d['extra_cost']:,.0f} extra; simulated chance {pct(d['chance'])} (\u00b1{pct(d['standard_error'])})",
                _crashed(plan, d["crashed"])]
    if c is not None and c["reachable"]:
        out += ["", f"Cheapest crash to a {pct(c['target'])} chance: {c['extra_cost']:,.0f} extra; chance "
                f"{pct(c['chance_out_of_sample'])} \u00b1 {pct(c['standard_error'])} on a fresh simulation "
                f"({pct(c['chance_in_sample'])} on the one it was fitted to; seed {data['seed']})",
                _crashed(plan, c["crashed"])]
    elif c is not None:
        out += ["", f"A {pct(c['target'])} chance cannot be reached even fully crashed "
                f"(best {pct(c['chance_out_of_sample'])})."]
    if data["not_shortened"]:
        out += ["", "Not shortened, crash data incomplete: " + "; ".join(
            f"{k} (no {what})" for k, what in data["not_shortened"].items())]
    return "\n".join(out + ["", CAUTION])
