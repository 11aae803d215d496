"""``slackline level PLAN``: a schedule that keeps every link and every resource limit."""

from __future__ import annotations

from pathlib import Path

from ..core.errors import PlanError
from .common import load_plan_file, refuse_if_locked, save_plan_file, write_json
from .text import elide, num, table


def add_arguments(p) -> None:
    p.add_argument("plan", metavar="PLAN")
    p.add_argument("-o", "--output", metavar="LEVELLED.slw",
                   help="write the plan with the levelled dates kept (start-no-earlier constraints)")
    p.add_argument("--rule", choices=("lft", "float", "successors"), default="lft",
                   help="priority: latest finish first (default), least total float, most successors")
    p.add_argument("--budget", type=int, default=0, metavar="N",
                   help="the most schedules to build in all: the rule's and the improvement's, then the genetic "
                        "algorithm's with what they leave (default 0: no genetic algorithm)")
    p.add_argument("--seed", type=int, default=0, metavar="S")
    p.add_argument("--json", action="store_true")
    p.add_argument("--force", action="store_true",
                   help="write LEVELLED.slw even if a window has it open, or its owner or group would change")


def run(args) -> int:
    from ..core.calendar import WorkCalendar
    from ..core.levelling import keep_levelled, level

    if args.budget < 0 or args.budget > 1_000_000:
        raise PlanError(f"--budget must be a whole number from 0 to 1,000,000, not {args.budget}", "--budget")
    if args.output and Path(args.output).suffix.lower() != ".slw":
        raise PlanError(f"-o {args.output}: the levelled plan is written as a .slw plan file", "-o")
    if args.output:
        refuse_if_locked(args.output, args.force)  # before the work of levelling
    plan = load_plan_file(args.plan)
    if not plan.resources:
        raise PlanError(f"{args.plan}: the plan has no resources to level", "PLAN")
    result = level(plan, rule=args.rule, budget=args.budget, seed=args.seed)
    cal = WorkCalendar(plan.settings)
    if args.output:
        keep_levelled(plan, result).do(plan)
        save_plan_file(plan, args.output, args.force)
    if args.json:
        write_json(_as_json(result, cal))
    else:
        print(_as_text(plan, result, cal, args.output))
    return 0


def _as_json(result, cal) -> dict:
    return {"rule": result.rule, "schedules_tried": result.schedules_tried,
            "finish": round(result.finish, 9), "finish_date": cal.finish_date(result.finish).isoformat(),
            "logic_finish": round(result.logic_finish, 9), "delay": round(result.delay, 9),
            "starts": {i: round(float(s), 9) for i, s in zip(result.ids, result.starts)},
            "moved": [{"id": m.id, "logic_start": round(m.logic_start, 9), "start": round(m.start, 9),
                       "held_by": m.held_by} for m in result.moves]}


def _as_text(plan, result, cal, output) -> str:
    unit = plan.settings.unit
    lines = [f"{plan.settings.title}: levelled by rule '{result.rule}' ({result.schedules_tried} schedules built in all)",
             f"Finish         {cal.finish_date(result.finish).isoformat()}  ({num(result.finish)} {unit}); "
             f"logic alone {cal.finish_date(result.logic_finish).isoformat()} ({num(result.logic_finish)} {unit})",
             (f"Delay          {num(result.delay)} {unit}" if result.delay > 1e-9
              else "Delay          none: levelling keeps the logic-only finish"), ""]
    if result.moves:
        rows = [[m.id, elide(plan.activity(m.id).name, 32), cal.start_date(m.logic_start).isoformat(),
                 cal.start_date(m.start).isoformat(), m.held_by] for m in result.moves]
        lines += ["Moved activities", table(["id", "name", "logic start", "levelled start", "held by"], rows)]
    else:
        lines.append("No activity moved: every resource has enough units for the logic-only schedule.")
    if output:
        lines += ["", f"wrote {output} (levelled dates kept as start-no-earlier constraints)"]
    return "\n".join(lines)
