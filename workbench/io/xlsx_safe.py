"""XLSX reading with guards, and text cells that can never become formulas.

Before openpyxl sees a workbook the zip container is checked: total uncompressed size,
number of entries, and the compression ratio of each large entry (a zip bomb expands a
few kilobytes into gigabytes). openpyxl then reads it in read-only mode; with defusedxml
installed (a dependency) it parses the XML without entity expansion.
"""

from __future__ import annotations

import datetime as dt
import io
import zipfile
from pathlib import Path

from .errors import TableImportError
from .predecessors import format_number

MAX_TOTAL_BYTES = 200 * 1024 * 1024
MAX_ENTRIES = 10_000
MAX_RATIO = 100
RATIO_FLOOR = 1024 * 1024  # entries smaller than this may compress as well as they like
MAX_CELLS = 12_000_000  # rows × columns read from one sheet (a million activities × 12 columns)
SHEET_HINTS = ("activities", "activity", "plan", "schedule")


def check_zip(content, source: str) -> None:
    """Refuse a workbook whose zip container could exhaust memory or disk."""
    try:
        with zipfile.ZipFile(content) as archive:
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


def _pick_sheet(workbook, source: str):
    """The sheet to read: one named like an activity list, else the first worksheet
    (chart sheets hold no cells and are passed over)."""
    sheets = [ws for ws in workbook.worksheets if hasattr(ws, "iter_rows")]
    if not sheets:
        kinds = ", ".join(f"'{name}'" for name in workbook.sheetnames) or "none"
        raise TableImportError([f"the workbook has no worksheet with cells to read (sheets: {kinds}); "
                                "put the activity list on an ordinary worksheet"], source)
    for sheet in sheets:
        if sheet.title.strip().lower() in SHEET_HINTS:
            return sheet
    return sheets[0]


def _open_workbook(content, source: str):
    """The workbook (read-only, values) from its bytes, a file object or a path; checked
    as a zip container first. Refused with TableImportError when it cannot be read."""
    if isinstance(content, (bytes, bytearray)):
        content = io.BytesIO(content)
    elif not hasattr(content, "read"):
        content = io.BytesIO(Path(content).read_bytes())
    check_zip(content, source)
    import openpyxl

    content.seek(0)
    try:
        return openpyxl.load_workbook(content, read_only=True, data_only=True)
    except Exception as exc:  # openpyxl raises many kinds for a broken workbook
        raise TableImportError([f"cannot read the workbook: {type(exc).__name__}: {exc}"], source) from exc


def read_xlsx(content, source: str) -> tuple[str, list[tuple[int, list[str]]]]:
    """The chosen sheet's name and its rows, numbered as the spreadsheet shows them.
    ``content``: the workbook's bytes (already read from a regular file) or a path."""
    workbook = _open_workbook(content, source)
    try:
        sheet = _pick_sheet(workbook, source)
        return sheet.title, _numbered_rows(sheet, source)
    except TableImportError:
        raise
    except Exception as exc:  # a damaged sheet part
        raise TableImportError([f"cannot read the workbook: {type(exc).__name__}: {exc}"], source) from exc
    finally:
        workbook.close()


def _too_large(sheet, source: str, what: str) -> TableImportError:
    return TableImportError([f"refused: sheet '{sheet.title}' {what}, more than the {MAX_CELLS:,} cells "
                             f"(rows \u00d7 columns) an activity list may have; delete the unused rows and "
                             f"columns, or copy the activity list to a new sheet"], source)


def _check_declared_size(sheet, source: str) -> None:
    """Refuse at once a sheet whose stored size tag already says it is too large."""
    try:
        rows, cols = sheet.max_row or 0, sheet.max_column or 0
    except Exception:  # a damaged size tag: the count while reading still guards
        return
    if rows * cols > MAX_CELLS:
        raise _too_large(sheet, source, f"spans {rows:,} rows \u00d7 {cols:,} columns")


def _numbered_rows(sheet, source: str) -> list[tuple[int, list[str]]]:
    """Rows by their real row numbers; the stored size tag is ignored once checked (some
    writers get it wrong, and read-only mode would then silently cut off rows or columns).
    The cells read (rows \u00d7 the widest row so far) are counted and capped."""
    _check_declared_size(sheet, source)
    sheet.reset_dimensions()
    rows, width, count = [], 0, 0
    for cells in sheet.iter_rows():
        number = next((c.row for c in cells if getattr(c, "row", None)), None)
        width = max(width, len(cells))
        count += 1
        if count * width > MAX_CELLS:
            raise _too_large(sheet, source, f"holds more than {count:,} rows \u00d7 {width:,} columns")
        if number is not None:
            values = [cell_text(c.value) for c in cells]
            while values and values[-1] == "":
                values.pop()
            rows.append((number, values))
    return rows


def read_xlsx_sheet(content, source: str, name: str) -> list[tuple[int, list[str]]] | None:
    """The rows of the worksheet called ``name`` (any case), or None when the workbook has
    none. ``content``: the workbook's bytes or a path."""
    workbook = _open_workbook(content, source)
    try:
        found = next((ws for ws in workbook.worksheets
                      if hasattr(ws, "iter_rows") and ws.title.strip().lower() == name.lower()), None)
        return None if found is None else _numbered_rows(found, source)
    finally:
        workbook.close()
