"""``slackline check PLAN``: is this schedule sound enough to sign? The Checkup as a table,
or JSON; ``--strict`` exits 1 when any check fails, so a planning office can gate a plan."""

from __future__ import annotations

from .common import load_plan_file, write_json
from .text import CAUTION, elide, table

DEFAULT_ITERATIONS = 5_000
DEFAULT_SEED = 1           # fixed: the same plan always gets the same verdict
OFFENDERS_SHOWN = 6


def add_arguments(p) -> None:
    p.add_argument("plan", metavar="PLAN", help=".slw, .csv or .xlsx")
    p.add_argument("--json", action="store_true", help="one JSON object on stdout")
    p.add_argument("--strict", action="store_true", help="exit 1 when any check fails")
    p.add_argument("--iterations", type=int, default=DEFAULT_ITERATIONS, metavar="N",
                   help=f"simulation runs for the odds checks (0: leave them out; default {DEFAULT_ITERATIONS:,})")
    p.add_argument("--seed", type=int, default=DEFAULT_SEED, metavar="S",
                   help=f"simulation seed (default {DEFAULT_SEED})")


def run(args) -> int:
    from ..core.analysis import analyze
    from ..core.checkup import run_checkup
    from ..core.errors import PlanError

    if args.iterations < 0:
        raise PlanError(f"--iterations must be 0 or more, not {args.iterations}", "--iterations")
    if args.seed < 0:
        raise PlanError(f"--seed must be 0 or more, not {args.seed}", "--seed")
    plan = load_plan_file(args.plan)
    analysis = analyze(plan)
    simulation = None
    if args.iterations and len(plan):
        from ..core.montecarlo import simulate
        from .common import check_iterations
        check_iterations(args.iterations)
        simulation = simulate(plan, args.iterations, args.seed)
    checkup = run_checkup(plan, analysis, simulation)
    if args.json:
        write_json(checkup.to_dict())
    else:
        print(render_checkup(plan, checkup))
    return 1 if args.strict and checkup.failed else 0


def render_checkup(plan, checkup) -> str:
    from ..core.checkup_limits import STANDARD_NAME, STANDARD_SOURCE

    rows = []
    for c in checkup:
        shown = ", ".join(c.offenders[:OFFENDERS_SHOWN]) + (
            f" +{len(c.offenders) - OFFENDERS_SHOWN}" if len(c.offenders) > OFFENDERS_SHOWN else "")
        threshold = c.threshold + (" *" if c.changed else "")
        rows.append([c.mark, c.name, elide(c.value_text, 46), threshold, elide(shown, 40)])
    out = [f"{plan.settings.title}: Checkup", f"Standard: {STANDARD_NAME} ({STANDARD_SOURCE}),",
           "and Slackline's own checks on the estimates and the odds (common practice).", "",
           table(["mark", "check", "figure", "threshold", "offenders"], rows), ""]
    if any(c.changed for c in checkup):
        out.append("* this plan's own threshold, not the standard's")
    out.append(checkup.summary_text() + f" ({checkup.count('n/a')} not applicable)")
    notes = [c for c in checkup if c.status == "fail" or (c.status == "n/a" and c.note)]
    if notes:
        out += ["", "Notes"] + [f"- {c.name}: {c.note}" for c in notes]
    out += ["", CAUTION]
    return "\n".join(out)
