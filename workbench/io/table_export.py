"""Export a plan with its computed schedule to CSV or XLSX.

The first columns are the import columns, so an export re-imports to the same plan; the
computed columns after them (te, sd, early/late start/finish as offsets and dates, floats,
critical) are ignored on import. Text that a spreadsheet would run as a formula (starting
with = + - @, tab or CR) is never written as one: in CSV it gets a leading ``'`` (removed
again on import), in XLSX the cell is typed as a string.
"""

from __future__ import annotations

import csv
import datetime as dt
import math
from pathlib import Path

from workbench.core.calendar import round_offset

from .predecessors import format_number, format_predecessors
from .table_rows import GUARDED

PLAN_COLUMNS = ("id", "name", "group", "optimistic", "most_likely", "pessimistic", "duration", "distribution",
                "predecessors", "start_no_earlier", "finish_no_later", "notes")
COMPUTED_COLUMNS = ("te", "sd", "early_start", "early_finish", "late_start", "late_finish",
                    "early_start_date", "early_finish_date", "late_start_date", "late_finish_date",
                    "total_float", "free_float", "critical")
HEADER = PLAN_COLUMNS + COMPUTED_COLUMNS
TEXT_COLUMNS = {"id", "name", "group", "distribution", "predecessors", "notes", "critical"}


def _point(value):
    if value is None or isinstance(value, dt.date):
        return value
    return float(value)


def plan_cells(plan, act) -> list:
    return [act.id, act.name, act.group, act.optimistic, act.most_likely, act.pessimistic, act.duration,
            act.distribution or "", format_predecessors(plan.predecessors(act.id)),
            _point(act.start_no_earlier), _point(act.finish_no_later), act.notes]


def table_rows(analysis) -> list[list]:
    """One row of values per activity in plan order (None for an empty cell)."""
    plan, s = analysis.plan, analysis.schedule
    dates = {k: v.astype("datetime64[D]").astype(dt.date) for k, v in analysis.dates().items()}
    rows = []
    for i, act in enumerate(plan.activities):
        j = s.index(act.id)
        computed = [round_offset(analysis.means[j]), round_offset(math.sqrt(analysis.variances[j])),
                    *(round_offset(x[j]) for x in (s.es, s.ef, s.ls, s.lf)),
                    *(dates[k][j] for k in ("early_start", "early_finish", "late_start", "late_finish")),
                    round_offset(s.total_float[j]), round_offset(s.free_float[j]),
                    "yes" if s.critical[j] else "no"]
        rows.append(plan_cells(plan, act) + computed)
    return rows


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


def write_csv(rows: list[list], path: Path) -> None:
    """UTF-8 with a byte-order mark, so spreadsheet programs pick the right encoding."""
    with open(path, "w", encoding="utf-8-sig", newline="") as handle:
        writer = csv.writer(handle, lineterminator="\r\n")
        writer.writerow(HEADER)
        for row in rows:
            writer.writerow([csv_value(v, c) for v, c in zip(row, HEADER)])


def write_xlsx(rows: list[list], path: Path, title: str = "") -> None:
    from openpyxl import Workbook
    from openpyxl.cell.cell import ILLEGAL_CHARACTERS_RE
    from openpyxl.styles import Font

    book = Workbook()
    sheet = book.active
    sheet.title = "Activities"
    sheet.append(list(HEADER))
    for cell in sheet[1]:
        cell.font = Font(bold=True)
    for r, row in enumerate(rows, 2):
        for c, value in enumerate(row, 1):
            _put(sheet.cell(row=r, column=c), value, ILLEGAL_CHARACTERS_RE)
    sheet.freeze_panes = "A2"
    _widths(sheet, rows)
    if title:
        book.properties.title = ILLEGAL_CHARACTERS_RE.sub("\ufffd", title)
    book.save(path)


def _put(cell, value, illegal) -> None:
    if value is None:
        return
    if isinstance(value, dt.date):
        cell.value = value
        cell.number_format = "yyyy-mm-dd"
    elif isinstance(value, (int, float)):
        cell.value = value
    else:
        cell.value = illegal.sub("\ufffd", str(value))
        cell.data_type = "s"  # text, never a formula


def _widths(sheet, rows: list[list]) -> None:
    from openpyxl.utils import get_column_letter

    for c, name in enumerate(HEADER):
        longest = max([len(name)] + [len(_shown(row[c])) for row in rows[:500]])
        sheet.column_dimensions[get_column_letter(c + 1)].width = min(60, max(6, longest + 2))


def _shown(value) -> str:
    if value is None:
        return ""
    if isinstance(value, dt.date):
        return "2026-01-01"
    if isinstance(value, float):
        return format_number(value)
    return str(value)
