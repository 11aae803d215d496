"""Resources in spreadsheets: the activities' `resources` column, the Resources sheet of an
XLSX workbook, a separate resources CSV, and exports that read back to the same plan."""

from __future__ import annotations

import openpyxl
import pytest

from workbench.core.analysis import analyze
from workbench.core.demo import demo_plan
from workbench.io.errors import TableImportError
from workbench.io.resource_table import format_needs, parse_needs
from workbench.io.tabular import read_resource_file
from workbench.io.tabular import export_table, read_table


def test_needs_cell_reads_and_writes_back():
    assert parse_needs("crew 2; crane 1", "A") == (("crew", 2.0), ("crane", 1.0))
    assert parse_needs(" crew ;  ", "A") == (("crew", 1.0),)            # a bare id: one unit
    assert parse_needs("crew 2,5", "A") == (("crew", 2.5),)             # a decimal comma
    assert format_needs((("crew", 2.0), ("crane", 0.5))) == "crew 2; crane 0.5"


def test_needs_are_separated_as_predecessors_are():
    """Issue 19: items "separated as predecessors are" — a predecessor cell takes ";" or ","."""
    assert parse_needs("crew 2, crane 1", "A") == (("crew", 2.0), ("crane", 1.0))
    assert parse_needs("crew 2,crane 1;hoist", "A") == (("crew", 2.0), ("crane", 1.0), ("hoist", 1.0))
    assert parse_needs("crew 1,5", "A") == (("crew", 1.5),)             # a decimal comma stays one number


def test_xlsx_export_carries_the_resources_sheet_and_reads_back(tmp_path):
    plan = demo_plan()
    path = export_table(analyze(plan), tmp_path / "demo.xlsx")
    book = openpyxl.load_workbook(path)
    assert book.sheetnames == ["Activities", "Resources"]
    assert [c.value for c in book["Resources"][1]] == ["id", "name", "units", "cost"]
    back = read_table(path, plan.settings)
    assert [(r.id, r.name, r.units) for r in back.resources] == [(r.id, r.name, r.units) for r in plan.resources]
    assert [a.resources for a in back.activities] == [a.resources for a in plan.activities]


def test_csv_export_reads_back_with_a_resources_file(tmp_path):
    plan = demo_plan()
    path = export_table(analyze(plan), tmp_path / "demo.csv")
    (tmp_path / "res.csv").write_text("id,name,units\n" + "".join(f"{r.id},{r.name},{r.units:g}\n" for r in plan.resources))
    back = read_table(path, plan.settings, resources=read_resource_file(tmp_path / "res.csv"))
    assert [a.resources for a in back.activities] == [a.resources for a in plan.activities]


def test_resources_file_problems_are_listed_by_row(tmp_path):
    (tmp_path / "res.csv").write_text("id,units,cost\ncrew,2,\ncrew,3,\n,1,\nrig,,\nvan,1,cheap\n")
    with pytest.raises(TableImportError) as info:
        read_resource_file(tmp_path / "res.csv")
    text = str(info.value)
    for part in ("row 3, resource crew: duplicate id, first on row 2", "row 4, column 'id': the resource id is empty",
                 "row 5, resource rig, column 'units'", "row 6, column 'cost': 'cheap' is not a number"):
        assert part in text


def test_resources_table_needs_id_and_units_columns(tmp_path):
    (tmp_path / "res.csv").write_text("name,size\nPainters,2\n")
    with pytest.raises(TableImportError, match="needs columns 'id' and 'units'"):
        read_resource_file(tmp_path / "res.csv")


def test_resource_columns_not_read_are_named_in_the_import_report(tmp_path):
    """An XLSX Resources sheet with a misspelt heading: the report names it (as it names the
    activity sheet's ignored columns); the CSV reader hands them back to its caller."""
    from workbench.io.tabular import read_table_report

    plan = demo_plan()
    path = export_table(analyze(plan), tmp_path / "demo.xlsx")
    book = openpyxl.load_workbook(path)
    book["Resources"].cell(row=1, column=5, value="shift pattern")
    book.save(path)
    back, report = read_table_report(path, plan.settings)
    assert len(back.resources) == len(plan.resources)
    assert "shift pattern (sheet Resources)" in report.ignored_columns
    assert "shift pattern (sheet Resources)" in report.summary()
    (tmp_path / "res.csv").write_text("id,units,Units,colour\ncrew,2,3,red\n")
    unread = []
    assert [r.units for r in read_resource_file(tmp_path / "res.csv", unread)] == [2.0]
    assert unread == ["Units", "colour"]                 # a repeated heading is not read either
