"""``slackline analyze PLAN``: critical path, dates, floats and PERT odds."""

from __future__ import annotations

import numpy as np

from ..core.analysis import analyze
from .common import add_plan_settings, load_plan_with_settings, parse_offset_or_date, write_json
from .living import add_baseline, add_status_date, apply_status_date, status_lines, variance_for
from .text import CAUTION, column_table, elide, num, nums, pct


def add_arguments(p) -> None:
    p.add_argument("plan", metavar="PLAN", help=".slw, .csv or .xlsx")
    add_plan_settings(p)
    p.add_argument("--deadline", metavar="N|YYYY-MM-DD")
    p.add_argument("--json", action="store_true", help="one JSON object on stdout")
    add_status_date(p)
    add_baseline(p)


def run(args) -> int:
    plan = load_plan_with_settings(args)
    apply_status_date(plan, args)
    deadline = parse_offset_or_date(args.deadline, "--deadline") if args.deadline is not None else None
    result = analyze(plan, deadline=deadline)
    variance = variance_for(result, args)
    if args.json:
        data = result.to_dict(variance)
        if plan.resources:
            from ..core.loading import plan_loading
            cal = result.calendar
            span = lambda a, b: (cal.start_date(a).isoformat(), cal.finish_date(b).isoformat())
            data["resources"] = {l.resource: l.to_dict(span) for l in plan_loading(result)}
        write_json(data)
    else:
        print(render_analysis(result, variance))
    return 0


def render_analysis(result, variance=None) -> str:
    s, plan = result.schedule, result.plan
    dates = {k: np.datetime_as_string(v, unit="D").tolist() for k, v in result.dates().items()}
    acts = plan.activities
    columns = [[a.id for a in acts], [elide(a.name, 32) for a in acts], nums(result.means),
               nums(np.sqrt(result.variances)), dates["early_start"], dates["early_finish"],
               dates["late_start"], dates["late_finish"], nums(s.total_float), nums(s.free_float),
               ["yes" if c else "" for c in s.critical.tolist()]]
    headers = ["id", "name", "te", "sd", "early start", "early finish", "late start", "late finish",
               "total float", "free float", "critical"]
    out = [f"{plan.settings.title}", "", column_table(headers, columns, right={2, 3, 8, 9}), ""]
    out += status_lines(result, variance, plan.settings.unit)
    out += summary_lines(result, plan.settings.unit)
    return "\n".join(out)


def summary_lines(result, unit: str) -> list[str]:
    p = result.pert
    lines = [
        f"Start          {result.start_date.isoformat()}",
        f"Finish         {result.finish_date.isoformat()}  ({num(result.schedule.finish)} {unit})",
        f"Critical path  {' - '.join(p.path)}",
        f"PERT           mean {num(p.mean)} {unit}, sd {num(p.sd, 3)}, variance {num(p.variance, 4)}",
    ]
    if p.note:
        lines.append(f"               {p.note}")
    if result.deadline is not None:
        z = p.z(result.deadline)
        lines.append(f"Deadline       {result.date_of_duration(result.deadline).isoformat()}  "
                     f"({num(result.deadline)} {unit}): z = {num(z, 4)}, "
                     f"P(finish by deadline) = {pct(p.prob_by(result.deadline))}")
    from ..figures.odds import confidence_label    # here: the figures module is not needed to start

    conf = result.plan.settings.target_confidence
    shown = {confidence_label(q): q for q in sorted({0.5, 0.8, 0.9, conf})}
    for label, q in shown.items():
        d = p.duration_at(q)
        lines.append(f"{label:<14} {result.date_of_duration(d).isoformat()}  ({num(d)} {unit})")
    lines += ["", CAUTION]
    return lines
