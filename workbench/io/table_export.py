"""Export a plan with its computed schedule to CSV or XLSX.

The first columns are the import columns, so an export re-imports to the same plan; the
computed columns after them (te, sd, early/late start/finish as offsets and dates, floats,
critical) are ignored on import. Text that a spreadsheet would run as a formula (starting
with = + - @, tab or CR) is never written as one: in CSV it gets a leading ``'`` (removed
again on import), in XLSX the cell is typed as a string.
"""

from __future__ import annotations

import csv
import io
import datetime as dt
import math
from pathlib import Path

from workbench.core.calendar import round_offset

from .predecessors import format_number, format_predecessors
from .xlsx_write import write_xlsx as _write_xlsx
from .resource_table import format_needs
from .row_reader import GUARDED

PLAN_COLUMNS = ("id", "name", "group", "optimistic", "most_likely", "pessimistic", "duration", "distribution",
                "predecessors", "start_no_earlier", "finish_no_later", "notes", "resources",
                "cost", "crash_cost", "crash_optimistic", "crash_most_likely", "crash_pessimistic", "crash_duration")
COMPUTED_COLUMNS = ("te", "sd", "early_start", "early_finish", "late_start", "late_finish",
                    "early_start_date", "early_finish_date", "late_start_date", "late_finish_date",
                    "total_float", "free_float", "critical")
HEADER = PLAN_COLUMNS + COMPUTED_COLUMNS
TEXT_COLUMNS = {"id", "name", "group", "distribution", "predecessors", "notes", "critical", "resources"}


def _point(value):
    if value is None or isinstance(value, dt.date):
        return value
    return float(value)


def plan_cells(act, links) -> list:
    return [act.id, act.name, act.group, act.optimistic, act.most_likely, act.pessimistic, act.duration,
            act.distribution or "", format_predecessors(links),
            _point(act.start_no_earlier), _point(act.finish_no_later), act.notes, format_needs(act.resources),
            act.cost, act.crash_cost, act.crash_optimistic, act.crash_most_likely, act.crash_pessimistic,
            act.crash_duration]


def _links_into(plan) -> dict[str, list]:
    into: dict[str, list] = {}
    for link in plan.links:
        into.setdefault(link.succ, []).append(link)
    return into


def _computed(analysis) -> list[list]:
    """te, sd, offsets, dates, floats and the critical flag, one list per activity (as
    many floats as possible converted in bulk: this runs for every exported row)."""
    s = analysis.schedule
    offsets = [[round_offset(x) for x in col.tolist()] for col in (s.es, s.ef, s.ls, s.lf)]
    found = analysis.dates()
    dates = [found[k].astype("datetime64[D]").astype(dt.date).tolist()
             for k in ("early_start", "early_finish", "late_start", "late_finish")]
    te = [round_offset(x) for x in analysis.means.tolist()]
    sd = [round_offset(math.sqrt(x)) for x in analysis.variances.tolist()]
    floats = [[round_offset(x) for x in col.tolist()] for col in (s.total_float, s.free_float)]
    critical = ["yes" if c else "no" for c in s.critical.tolist()]
    return [[te[j], sd[j], *(c[j] for c in offsets), *(c[j] for c in dates), *(c[j] for c in floats), critical[j]]
            for j in range(len(te))]


def table_rows(analysis) -> list[list]:
    """One row of values per activity in plan order (None for an empty cell)."""
    plan = analysis.plan
    computed = _computed(analysis)
    position = {act_id: j for j, act_id in enumerate(analysis.schedule.ids)}
    into = _links_into(plan)
    return [plan_cells(act, into.get(act.id, [])) + computed[position[act.id]] for act in plan.activities]


def guard_csv(text: str) -> str:
    """Prefix a quote so a spreadsheet shows the text instead of running it (and double a
    leading quote, so the import can tell the guard from the planner's own quote)."""
    return "'" + text if text and (text[0] in GUARDED or text[0] == "'") else text


def csv_value(value, column: str) -> str:
    if value is None:
        return ""
    if isinstance(value, dt.date):
        return value.isoformat()
    if isinstance(value, (int, float)):
        return format_number(value)
    return guard_csv(str(value)) if column in TEXT_COLUMNS else str(value)


def write_csv(rows: list[list], target, header=HEADER) -> None:
    """UTF-8 with a byte-order mark, so spreadsheet programs pick the right encoding.
    ``target`` is a path or a binary file object (the export's exclusive temporary file)."""
    if isinstance(target, (str, Path)):
        with open(target, "wb") as raw:
            return write_csv(rows, raw, header)
    with io.TextIOWrapper(target, encoding="utf-8-sig", newline="") as handle:
        writer = csv.writer(handle, lineterminator="\r\n")
        writer.writerow(header)
        for row in rows:
            writer.writerow([csv_value(v, c) for v, c in zip(row, header)])


def write_xlsx(rows: list[list], path: Path, title: str = "", resources=(), header=HEADER) -> None:
    """The activities, and the plan's resources on a sheet named Resources (read back on import)."""
    extra = [("Resources", ("id", "name", "units", "cost"),
              [[r.id, r.name, r.units, r.cost] for r in resources])] if resources else ()
    _write_xlsx(header, rows, path, title, extra)
