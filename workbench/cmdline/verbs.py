"""The headless verbs of ``slackline``: analyze, simulate, report, import, export.

Each takes parsed arguments and returns an exit code; bad input raises
:class:`~workbench.core.errors.PlanError` (the caller prints it and exits 2).
"""

from __future__ import annotations

import datetime as dt
import json
import os
import sys
from pathlib import Path

import numpy as np

from ..core.analysis import analyze
from ..core.errors import PlanError
from ..core.model import MAX_UNITS, check_date
from ..figures.odds import confidence_label
from .text import CAUTION, column_table, elide, num, nums, pct, table

PLAN_SUFFIXES = (".slw", ".csv", ".xlsx")
MAX_ITERATIONS = 10_000_000


def check_iterations(n: int) -> None:
    if n <= 0:
        raise PlanError(f"--iterations must be a positive whole number, not {n}", "--iterations")
    if n > MAX_ITERATIONS:
        raise PlanError(f"--iterations {n} is more than {MAX_ITERATIONS:,} (the percentiles settle long before)", "--iterations")


def parse_offset_or_date(text: str, what: str):
    """``--deadline 47`` or ``--deadline 2027-11-30``."""
    try:
        return check_date(dt.date.fromisoformat(text), what, "date")
    except ValueError as exc:
        if isinstance(exc, PlanError):
            raise
    try:
        value = float(text)
    except ValueError:
        raise PlanError(f"{what}: {text!r} is neither a number of plan units nor a date YYYY-MM-DD", what) from None
    if value != value or abs(value) > MAX_UNITS:
        raise PlanError(f"{what}: {text!r} must be a number within {MAX_UNITS:,.0f} plan units of the start", what)
    return value


def load_plan_file(path: str):
    p = Path(path)
    if p.suffix.lower() not in PLAN_SUFFIXES:
        raise PlanError(f"{path}: unsupported file type {p.suffix or '(none)'!r}; use .slw, .csv or .xlsx", "PLAN")
    if not p.exists():
        raise PlanError(f"{path}: no such file", "PLAN")
    if p.is_dir():
        raise PlanError(f"{path}: is a folder, not a plan file", "PLAN")
    if not p.is_file():
        raise PlanError(f"{path}: not a regular file (a pipe or device cannot be read as a plan)", "PLAN")
    from ..io.tabular import load_any

    return load_any(p)


def write_json(obj) -> None:
    sys.stdout.write(json.dumps(obj, indent=2, ensure_ascii=False, allow_nan=False) + "\n")


# --- analyze ---------------------------------------------------------------
def cmd_analyze(args) -> int:
    plan = load_plan_file(args.plan)
    deadline = parse_offset_or_date(args.deadline, "--deadline") if args.deadline else None
    result = analyze(plan, deadline=deadline)
    if args.json:
        write_json(result.to_dict())
    else:
        print(render_analysis(result))
    return 0


def render_analysis(result) -> str:
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
    conf = result.plan.settings.target_confidence
    shown = {confidence_label(q): q for q in sorted({0.5, 0.8, 0.9, conf})}
    for label, q in shown.items():
        d = p.duration_at(q)
        lines.append(f"{label:<14} {result.date_of_duration(d).isoformat()}  ({num(d)} {unit})")
    lines += ["", CAUTION]
    return lines


# --- simulate --------------------------------------------------------------
def cmd_simulate(args) -> int:
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


# --- import / export / report ----------------------------------------------
def cmd_import(args) -> int:
    from ..io.planfile import save_plan
    from ..io.tabular import read_table
    from ..core.model import Settings

    src = Path(args.source)
    if src.suffix.lower() not in (".csv", ".xlsx"):
        raise PlanError(f"{args.source}: import reads .csv or .xlsx files", "SRC")
    if not src.exists():
        raise PlanError(f"{args.source}: no such file", "SRC")
    if not src.is_file():
        raise PlanError(f"{args.source}: not a regular file", "SRC")
    if Path(args.output).suffix.lower() != ".slw":
        raise PlanError(f"-o {args.output}: the output must be a .slw plan file", "-o")
    settings = Settings(title=src.stem, unit=args.unit)
    if args.start:
        try:
            settings.start = dt.date.fromisoformat(args.start)
        except ValueError:
            raise PlanError(f"--start: {args.start!r} is not a date YYYY-MM-DD", "--start") from None
    plan = read_table(src, settings=settings)
    analyze(plan)  # refuse a plan that cannot be scheduled before writing anything
    save_plan(plan, args.output)
    print(f"imported {len(plan)} activities and {len(plan.links)} links into {args.output}")
    return 0


def cmd_export(args) -> int:
    from ..io.tabular import export_table

    out = Path(args.output)
    if out.suffix.lower() not in (".csv", ".xlsx"):
        raise PlanError(f"-o {args.output}: export writes .csv or .xlsx", "-o")
    plan = load_plan_file(args.plan)
    export_table(analyze(plan), out)
    print(f"exported {len(plan)} activities to {out}")
    return 0


def cmd_report(args) -> int:
    from ..reports.pack import build_pack

    check_iterations(args.iterations)
    if Path(args.output).suffix.lower() != ".pdf":
        raise PlanError(f"-o {args.output}: the approval pack is written as .pdf", "-o")
    plan = load_plan_file(args.plan)
    info = build_pack(plan, args.output, paper=args.paper, iterations=args.iterations, seed=args.seed,
                      plan_path=os.path.basename(args.plan))
    print(f"wrote {args.output} ({getattr(info, 'pages', '?')} pages, seed {getattr(info, 'seed', args.seed)})")
    return 0
