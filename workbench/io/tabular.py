"""CSV and XLSX import and export of activity tables.

>>> plan = read_table("activities.csv")          # all or nothing: TableImportError lists every problem
>>> export_table(analyze(plan), "schedule.xlsx")  # plan columns + computed schedule
>>> plan = load_any("bridge.slw")                 # by extension: .slw, .csv/.tsv/.txt, .xlsx/.xlsm

Columns: ``id, name, optimistic, most_likely, pessimistic, duration, predecessors`` and
optionally ``group, notes, distribution, start_no_earlier, finish_no_later`` (headers
case-insensitive, with aliases: see :mod:`table_columns`). Unknown columns are ignored.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from functools import partial
from itertools import islice
from pathlib import Path

from workbench.core.errors import PlanError
from workbench.core.model import Plan, Settings

from . import atomic
from .csv_text import DELIMITER_NAMES, csv_rows, decode, looks_binary, sniff_delimiter
from .errors import TableImportError
from .predecessors import format_predecessors, parse_predecessors
from .table_columns import LOOKUP, map_header, normalise
from .table_export import HEADER, table_rows, write_csv, write_xlsx
from .table_progress import table_layout
from .row_reader import build_plan, rows_to_plan
from .safe_read import NotReadable, read_regular_file
from .xlsx_safe import read_xlsx, read_xlsx_sheet

__all__ = ["ImportReport", "TableImportError", "export_table", "format_predecessors", "load_any",
           "parse_predecessors", "read_table", "read_table_report", "rows_to_plan"]

CSV_SUFFIXES = (".csv", ".tsv", ".txt")
XLSX_SUFFIXES = (".xlsx", ".xlsm")
ZIP_MAGIC = b"PK\x03\x04"
MAX_CSV_BYTES = 200 * 1024 * 1024


@dataclass
class ImportReport:
    """How a table was read: shown to the planner beside the import preview."""

    kind: str = ""             # "csv" or "xlsx"
    encoding: str = ""         # CSV only: utf-8-sig, utf-16, utf-8 or cp1252
    delimiter: str = ""        # CSV only: comma, semicolon or tab
    sheet: str = ""            # XLSX only: the sheet read
    ignored_columns: list[str] = field(default_factory=list)
    activities: int = 0
    links: int = 0

    def summary(self) -> str:
        how = f"sheet '{self.sheet}'" if self.kind == "xlsx" else f"{self.encoding}, {self.delimiter}-separated"
        text = f"{self.activities} activities, {self.links} links ({how})"
        if self.ignored_columns:
            text += "; ignored columns: " + ", ".join(self.ignored_columns)
        return text


def _read_bytes(path: Path, source: str) -> bytes:
    try:
        return read_regular_file(path, MAX_CSV_BYTES, "; split the table into smaller files")
    except NotReadable as exc:
        raise TableImportError([f"refused: {exc}"], source) from None
    except OSError as exc:
        raise TableImportError([f"cannot read {path}: {exc.strerror or exc}"], source) from exc


def _is_header(cells) -> bool:
    known = [LOOKUP.get(normalise(c)) for c in cells if str(c).strip()]
    return "id" in known and len([k for k in known if k]) >= 2


def _header_and_rows(rows):
    """The header is the first of the first ten non-blank rows that names an id column
    and another known column (title lines above it are skipped), else the first
    non-blank row. Returns (header row number, header cells, rows below it)."""
    filled = list(islice((k for k, (_, cells) in enumerate(rows) if any(str(c).strip() for c in cells)), 10))
    if not filled:
        return None, [], []
    k = next((k for k in filled[:10] if _is_header(rows[k][1])), filled[0])
    return rows[k][0], rows[k][1], rows[k + 1:]


def _csv_table(path: Path, raw: bytes, source: str, report: ImportReport):
    text, report.encoding = decode(raw, source)
    if looks_binary(text):
        raise TableImportError(["this is a binary file, not CSV text (use .csv or .xlsx)"], source)
    delimiter = sniff_delimiter(text)
    report.kind, report.delimiter = "csv", DELIMITER_NAMES[delimiter]
    return csv_rows(text, delimiter, source), delimiter != ","


def table_rows_of(path, sheet: str | None = None) -> list[tuple[int, list[str]]]:
    """The numbered rows of a CSV file, or of an XLSX workbook's sheet ``sheet`` (its first
    sheet when it has none by that name)."""
    path = Path(path)
    raw = _read_bytes(path, path.name)
    if raw.startswith(ZIP_MAGIC):
        rows = read_xlsx_sheet(raw, path.name, sheet) if sheet else None
        return rows if rows is not None else read_xlsx(raw, path.name)[1]
    return _csv_table(path, raw, path.name, ImportReport())[0]


def read_resource_file(path, ignored: list | None = None) -> list:
    """A resources table (columns id, name, units, cost) from its own CSV file, or an XLSX
    workbook's Resources sheet (else its first); headings not read go to ``ignored``."""
    from .resource_table import SHEET, resources_from_rows

    path = Path(path)
    return resources_from_rows(table_rows_of(path, sheet=SHEET), path.name, ignored)


def read_table_report(path, settings: Settings | None = None, resources=None) -> tuple[Plan, ImportReport]:
    """Read a CSV or XLSX activity table (all or nothing) and say how it was read.
    ``resources``: the plan's resources (else an XLSX workbook's ``Resources`` sheet, if any)."""
    path = Path(path)
    source = path.name
    report = ImportReport()
    raw = _read_bytes(path, source)
    if not raw.strip(b" \t\r\n\x00"):
        raise TableImportError(["the file is empty"], source)
    if raw.startswith(ZIP_MAGIC):
        report.kind = "xlsx"
        report.sheet, rows = read_xlsx(raw, source)
        decimal_comma = False
        if resources is None:
            sheet = read_xlsx_sheet(raw, source, "Resources")
            if sheet is not None and report.sheet.strip().lower() != "resources":
                from .resource_table import resources_from_rows
                unread: list[str] = []
                resources = resources_from_rows(sheet, f"{source}, sheet Resources", unread)
                report.ignored_columns += [f"{c} (sheet Resources)" for c in unread]
    elif path.suffix.lower() in XLSX_SUFFIXES:
        raise TableImportError(["not a valid XLSX workbook (it is not a zip container; an old .xls or a "
                                "password-protected file? save it as .xlsx or CSV)"], source)
    else:
        rows, decimal_comma = _csv_table(path, raw, source, report)
    header_row, header, body = _header_and_rows(rows)
    if header_row is None:
        raise TableImportError(["the file is empty" if report.kind == "csv" else "the sheet is empty"], source)
    report.ignored_columns = map_header(header, header_row).ignored + report.ignored_columns
    plan = build_plan(header, body, settings, header_row=header_row, decimal_comma=decimal_comma,
                      guarded=report.kind == "csv", source=source, resources=resources)
    report.activities, report.links = len(plan), len(plan.links)
    return plan, report


def read_table(path, settings: Settings | None = None, resources=None) -> Plan:
    """A checked Plan from a CSV/XLSX table; default settings start today, in days."""
    return read_table_report(path, settings, resources)[0]


def export_table(analysis, path, variance=None) -> Path:
    """Write the plan and its computed schedule to ``.csv`` (UTF-8 with BOM) or ``.xlsx``;
    with progress and, for a compared baseline (``variance``), their columns.

    Written through an exclusive temporary file with an unpredictable name and renamed into
    place (:mod:`atomic`), so a failed export never leaves a half-written table where a
    good one was, and a link planted in a shared folder is never followed."""
    path = Path(path)
    suffix = path.suffix.lower()
    header, rows = table_layout(analysis, variance)
    more = {} if header == HEADER else {"header": header}   # progress or variance columns
    if suffix in XLSX_SUFFIXES:
        write = partial(write_xlsx, title=analysis.plan.settings.title, resources=analysis.plan.resources, **more)
    elif suffix in CSV_SUFFIXES:
        write = partial(write_csv, **more)
    else:
        raise PlanError(f"{path.name}: export writes .csv or .xlsx, not {suffix or 'a file without extension'}", "path")
    try:
        atomic.write_with(path, partial(write, rows))
    except OSError as exc:
        raise PlanError(f"could not write {path}: {exc.strerror or exc}", "path") from exc
    return path


def load_any(path) -> Plan:
    """Open a plan from a ``.slw`` plan file or a ``.csv``/``.xlsx`` table, by extension."""
    path = Path(path)
    suffix = path.suffix.lower()
    if suffix == ".slw":
        from .planfile import load_plan
        return load_plan(path)
    if suffix in CSV_SUFFIXES + XLSX_SUFFIXES:
        return read_table(path)
    raise PlanError(f"{path.name}: cannot open a {suffix or 'file without extension'} file "
                    "(use .slw, .csv or .xlsx)", "path")
