"""XLSX reading with guards, and text cells that can never become formulas.

Before openpyxl sees a workbook the zip container is checked: total uncompressed size,
number of entries, and the compression ratio of each large entry (a zip bomb expands a
few kilobytes into gigabytes). openpyxl then reads it in read-only mode; with defusedxml
installed (a dependency) it parses the XML without entity expansion.
"""

from __future__ import annotations

import datetime as dt
import zipfile
from pathlib import Path

from .errors import TableImportError
from .predecessors import format_number

MAX_TOTAL_BYTES = 200 * 1024 * 1024
MAX_ENTRIES = 10_000
MAX_RATIO = 100
RATIO_FLOOR = 1024 * 1024  # entries smaller than this may compress as well as they like
SHEET_HINTS = ("activities", "activity", "plan", "schedule")


def check_zip(path: Path, source: str) -> None:
    """Refuse a workbook whose zip container could exhaust memory or disk."""
    try:
        with zipfile.ZipFile(path) as archive:
            entries = archive.infolist()
    except zipfile.BadZipFile as exc:
        raise TableImportError(["not a valid XLSX workbook (the zip container is damaged, or this is an "
                                "old .xls or password-protected file; save it as .xlsx or CSV)"], source) from exc
    if len(entries) > MAX_ENTRIES:
        raise TableImportError([f"refused: the workbook has {len(entries)} parts (limit {MAX_ENTRIES})"], source)
    total = sum(e.file_size for e in entries)
    if total > MAX_TOTAL_BYTES:
        raise TableImportError([f"refused: the workbook would unpack to {total // 2**20} MB "
                                f"(limit {MAX_TOTAL_BYTES // 2**20} MB)"], source)
    for entry in entries:
        ratio = entry.file_size / max(entry.compress_size, 1)
        if entry.file_size > RATIO_FLOOR and ratio > MAX_RATIO:
            raise TableImportError([f"refused: part {entry.filename!r} is compressed {ratio:.0f} to 1 "
                                    f"(limit {MAX_RATIO} to 1); this looks like a zip bomb"], source)


def cell_text(value) -> str:
    """A cell value as import text; floats keep every digit, dates become YYYY-MM-DD."""
    if value is None:
        return ""
    if isinstance(value, bool):
        return "TRUE" if value else "FALSE"
    if isinstance(value, (int, float)):
        return format_number(value)
    if isinstance(value, dt.datetime):
        return value.date().isoformat() if value.time() == dt.time() else value.isoformat(sep=" ")
    if isinstance(value, dt.date):
        return value.isoformat()
    return str(value)


def _pick_sheet(workbook):
    for name in workbook.sheetnames:
        if name.strip().lower() in SHEET_HINTS:
            return workbook[name]
    return workbook[workbook.sheetnames[0]]


def read_xlsx(path: Path, source: str) -> tuple[str, list[tuple[int, list[str]]]]:
    """The chosen sheet's name and its rows, numbered as the spreadsheet shows them."""
    check_zip(path, source)
    import openpyxl

    with open(path, "rb") as handle:  # a handle, so a workbook named .csv still opens
        try:
            workbook = openpyxl.load_workbook(handle, read_only=True, data_only=True)
        except Exception as exc:  # openpyxl raises many kinds for a broken workbook
            raise TableImportError([f"cannot read the workbook: {type(exc).__name__}: {exc}"], source) from exc
        try:
            sheet = _pick_sheet(workbook)
            return sheet.title, _numbered_rows(sheet)
        finally:
            workbook.close()


def _numbered_rows(sheet) -> list[tuple[int, list[str]]]:
    """Rows by their real row numbers; the stored size tag is ignored (some writers get it
    wrong, and read-only mode would then silently cut off rows or columns)."""
    sheet.reset_dimensions()
    rows = []
    for cells in sheet.iter_rows():
        number = next((c.row for c in cells if getattr(c, "row", None)), None)
        if number is not None:
            rows.append((number, [cell_text(c.value) for c in cells]))
    return rows


def read_xlsx_sheet(path: Path, source: str, name: str) -> list[tuple[int, list[str]]] | None:
    """The rows of the sheet called ``name`` (any case), or None when the workbook has none."""
    check_zip(path, source)
    import openpyxl

    with open(path, "rb") as handle:
        try:
            workbook = openpyxl.load_workbook(handle, read_only=True, data_only=True)
        except Exception as exc:  # openpyxl raises many kinds for a broken workbook
            raise TableImportError([f"cannot read the workbook: {type(exc).__name__}: {exc}"], source) from exc
        try:
            found = next((s for s in workbook.sheetnames if s.strip().lower() == name.lower()), None)
            return None if found is None else _numbered_rows(workbook[found])
        finally:
            workbook.close()
