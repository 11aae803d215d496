"""Workbooks of awkward shapes are refused early, naming the sheet and the limit
(issue 20, item 12): no sheets, only a chart sheet, a sheet of huge dimensions."""

import re

import openpyxl
import pytest

from workbench.io import xlsx_safe
from workbench.io.tabular import TableImportError, read_table

from support.hostile import rewrite_zip as rewrite
from support.hostile import xlsx_bytes as workbook_bytes


def simple_book() -> openpyxl.Workbook:
    book = openpyxl.Workbook()
    sheet = book.active
    sheet.title = "Activities"
    sheet.append(["id", "name", "duration", "predecessors"])
    sheet.append(["A", "Dig", 3, ""])
    return book


def refusal(tmp_path, data: bytes) -> str:
    path = tmp_path / "odd.xlsx"
    path.write_bytes(data)
    with pytest.raises(TableImportError) as info:
        read_table(path)
    assert "Error:" not in str(info.value)  # no internal exception name
    return str(info.value)


def test_a_workbook_without_sheets(tmp_path):
    def drop_sheets(name, content):
        if name == "xl/workbook.xml":
            return re.sub(rb"<sheets>.*</sheets>", b"<sheets/>", content, flags=re.S)
        return None if name.startswith("xl/worksheets/") else content

    message = refusal(tmp_path, rewrite(workbook_bytes(simple_book()), drop_sheets))
    assert "no worksheet with cells to read (sheets: none)" in message


def test_a_workbook_holding_only_a_chart_sheet(tmp_path):
    book = openpyxl.Workbook()
    chart_sheet = book.create_chartsheet("Progress chart")
    chart_sheet.add_chart(openpyxl.chart.BarChart())
    book.remove(book.active)
    message = refusal(tmp_path, workbook_bytes(book))
    assert "no worksheet with cells to read (sheets: 'Progress chart')" in message


def test_a_chart_sheet_before_the_activity_sheet_is_passed_over(tmp_path):
    book = simple_book()
    book.create_chartsheet("Chart", 0).add_chart(openpyxl.chart.BarChart())
    path = tmp_path / "chart-first.xlsx"
    path.write_bytes(workbook_bytes(book))
    assert read_table(path).ids() == ["A"]


def far_cell_book(rows: int) -> bytes:
    """Rows with a single cell in the last column (XFD), written as XML directly."""
    body = "".join(f'<row r="{r}"><c r="XFD{r}" t="inlineStr"><is><t>x</t></is></c></row>' for r in range(1, rows + 1))
    return rewrite(workbook_bytes(simple_book()), lambda name, content: content if name != "xl/worksheets/sheet1.xml"
                   else re.sub(rb"<sheetData>.*</sheetData>|<sheetData/>", f"<sheetData>{body}</sheetData>".encode(),
                               re.sub(rb'<dimension ref="[^"]*" ?/>', b'<dimension ref="A1:XFD%d"/>' % rows, content),
                               flags=re.S))


def test_huge_declared_dimensions_are_refused_before_reading(tmp_path):
    message = refusal(tmp_path, far_cell_book(2_000))
    assert "sheet 'Activities' spans 2,000 rows \u00d7 16,384 columns" in message
    assert f"more than the {xlsx_safe.MAX_CELLS:,} cells" in message


def test_a_sheet_that_hides_its_size_is_capped_while_reading(tmp_path, monkeypatch):
    monkeypatch.setattr(xlsx_safe, "MAX_CELLS", 100_000)
    data = rewrite(far_cell_book(70), lambda name, c: re.sub(rb'<dimension ref="[^"]*" ?/>', b"", c)
                   if name == "xl/worksheets/sheet1.xml" else c)
    message = refusal(tmp_path, data)
    assert "sheet 'Activities' holds more than 7 rows \u00d7 16,384 columns" in message



def test_a_pasted_or_imported_cell_with_a_lone_surrogate_is_refused_naming_row_and_column():
    """Rows pasted into the table go through the import's checks (``rows_to_plan``); a
    clipboard from a broken source may carry half a UTF-16 pair."""
    from workbench.io.tabular import rows_to_plan

    with pytest.raises(TableImportError) as info:
        rows_to_plan([{"id": "A", "name": "Dig", "duration": "3"},
                      {"id": "B", "name": "Pour \udc9f slab", "duration": "2", "predecessors": "A"}])
    assert "row 3, activity B" in str(info.value)
    assert "name holds a broken character (lone surrogate U+DC9F" in str(info.value)
