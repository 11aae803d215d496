"""Writing the exported table as XLSX: bold frozen header, fitted column widths, dates as
date cells, and every text cell typed as a string so it can never run as a formula.
Uses openpyxl's write-only mode (streams rows; several times faster on big plans)."""

from __future__ import annotations

import datetime as dt
from pathlib import Path

from .predecessors import format_number


def _shown(value) -> str:
    if value is None:
        return ""
    if isinstance(value, dt.date):
        return "2026-01-01"
    if isinstance(value, float):
        return format_number(value)
    return str(value)


def _set_widths(sheet, header, rows: list[list]) -> None:
    from openpyxl.utils import get_column_letter

    for c, name in enumerate(header):
        longest = max([len(name)] + [len(_shown(row[c])) for row in rows[:500]])
        sheet.column_dimensions[get_column_letter(c + 1)].width = min(60, max(6, longest + 2))


class _CellMaker:
    """Builds write-only cells; text cells get the string type, dates a date format."""

    def __init__(self, sheet):
        from openpyxl.cell import WriteOnlyCell
        from openpyxl.cell.cell import ILLEGAL_CHARACTERS_RE
        from openpyxl.styles import Font

        self.sheet, self.make, self.illegal, self.bold = sheet, WriteOnlyCell, ILLEGAL_CHARACTERS_RE, Font(bold=True)

    def header(self, name: str):
        cell = self.make(self.sheet, value=name)
        cell.font = self.bold
        return cell

    def value(self, value):
        if value is None or (isinstance(value, (int, float)) and not isinstance(value, bool)):
            return value
        if isinstance(value, dt.date):
            cell = self.make(self.sheet, value=value)
            cell.number_format = "yyyy-mm-dd"
            return cell
        cell = self.make(self.sheet)
        cell.value = self.illegal.sub("\ufffd", str(value))
        cell.data_type = "s"  # text, never a formula
        return cell


def write_xlsx(header, rows: list[list], path: Path, title: str = "", extra=()) -> None:
    """The Activities sheet, then each (sheet name, header, rows) of ``extra``."""
    from openpyxl import Workbook

    book = Workbook(write_only=True)
    sheet = book.create_sheet("Activities")
    sheet.freeze_panes = "A2"
    _set_widths(sheet, header, rows)
    cells = _CellMaker(sheet)
    sheet.append([cells.header(name) for name in header])
    for row in rows:
        sheet.append([cells.value(v) for v in row])
    for name, more_header, more_rows in extra:
        more = book.create_sheet(name)
        more_cells = _CellMaker(more)
        more.append([more_cells.header(h) for h in more_header])
        for row in more_rows:
            more.append([more_cells.value(v) for v in row])
    if title:
        book.properties.title = cells.illegal.sub("\ufffd", title)
    book.save(path)
