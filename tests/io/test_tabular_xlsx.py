"""XLSX import and CSV/XLSX export: round trips, zip-bomb guard, formula-injection guard."""

import csv
import datetime as dt
import io
import zipfile
from pathlib import Path

import openpyxl
import pytest
from openpyxl import Workbook

from workbench.core import Activity, Link, Plan, Settings, analyze
from workbench.io import xlsx_safe
from workbench.io.planfile import load_plan, plan_to_dict
from workbench.io.tabular import TableImportError, export_table, read_table, read_table_report

DATA = Path(__file__).resolve().parents[1] / "data"
DANGEROUS = ["=HYPERLINK(\"http://example.invalid\",\"x\")", "+1+1", "-2+3", "@SUM(A1)", "\tpadded", "=1+1"]


@pytest.fixture
def kiosk():
    return load_plan(DATA / "harbour_kiosk_v2.slw")


def same_plan_content(a: Plan, b: Plan):
    assert a.activities == b.activities
    assert sorted(a.links, key=lambda l: (l.key, l.type)) == sorted(b.links, key=lambda l: (l.key, l.type))


def make_xlsx(path, sheets):
    book = Workbook()
    book.remove(book.active)
    for title, rows in sheets:
        sheet = book.create_sheet(title)
        for row in rows:
            sheet.append(row)
    book.save(path)
    return path


# --- import -------------------------------------------------------------------------
def test_xlsx_import_numbers_dates_and_sheet_choice(tmp_path):
    path = make_xlsx(tmp_path / "w.xlsx", [
        ("Cover", [["Not the table"]]),
        ("Activities", [["ID", "Name", "Opt", "ML", "Pess", "Preds", "Finish no later"],
                        ["A", "Dig", 1, 2.5, 4, None, dt.datetime(2026, 5, 4)],
                        ["B", "Pour", 0.1, 0.2, 1 / 3, "A SS 1", 12]]),
    ])
    plan, report = read_table_report(path)
    assert report.kind == "xlsx" and report.sheet == "Activities"
    assert plan.activity("A").finish_no_later == dt.date(2026, 5, 4) and plan.activity("B").finish_no_later == 12.0
    assert plan.activity("B").pessimistic == 1 / 3 and plan.activity("A").most_likely == 2.5
    assert plan.links == [Link("A", "B", "SS", 1.0)]


def test_xlsx_first_sheet_when_none_is_named_for_activities(tmp_path):
    path = make_xlsx(tmp_path / "w.xlsx", [("Sheet A", [["id", "duration"], ["X", 3]]), ("Other", [["id"], ["Y"]])])
    assert read_table(path).ids() == ["X"]


def test_xlsx_problems_use_sheet_rows_and_column_letters(tmp_path):
    book = Workbook()
    sheet = book.active
    sheet["C4"], sheet["D4"], sheet["E4"] = "id", "duration", "predecessors"
    sheet["C6"], sheet["D6"] = "A", "three"
    sheet["C7"], sheet["D7"], sheet["E7"] = "B", 2, "A; Z"
    book.save(tmp_path / "w.xlsx")
    problems = pytest.raises(TableImportError, read_table, tmp_path / "w.xlsx").value.problems
    assert problems == ["row 6, activity A, column D 'duration': 'three' is not a number",
                        "row 7, activity B, column E 'predecessors': unknown predecessor 'Z' (no row has that id)"]


def test_defusedxml_is_in_use():
    assert openpyxl.DEFUSEDXML is True


@pytest.mark.parametrize("content, message", [
    (b"just text, not a workbook", "not a zip container"),
    (b"PK\x03\x04 broken zip", "not a valid XLSX workbook"),
    (b"", "the file is empty"),
])
def test_bad_xlsx_files(tmp_path, content, message):
    path = tmp_path / "bad.xlsx"
    path.write_bytes(content)
    (line,) = pytest.raises(TableImportError, read_table, path).value.problems
    assert message in line


def test_zip_that_is_not_a_workbook(tmp_path):
    path = tmp_path / "other.xlsx"
    with zipfile.ZipFile(path, "w") as z:
        z.writestr("readme.txt", "hello")
    (line,) = pytest.raises(TableImportError, read_table, path).value.problems
    assert "cannot read the workbook" in line


def test_xlsx_renamed_to_csv_is_still_read(tmp_path):
    path = make_xlsx(tmp_path / "w.csv", [("Sheet", [["id", "duration"], ["Q", 1]])])
    assert read_table(path).ids() == ["Q"]


# --- zip-bomb guard -----------------------------------------------------------------
def bomb(tmp_path, megabytes=8):
    """A real workbook plus one part that expands a few kB into megabytes of zeros."""
    path = make_xlsx(tmp_path / "bomb.xlsx", [("Sheet", [["id", "duration"], ["A", 1]])])
    with zipfile.ZipFile(path, "a", compression=zipfile.ZIP_DEFLATED) as z:
        z.writestr("xl/media/padding.bin", b"\0" * (megabytes * 2**20))
    return path


def test_zip_bomb_is_refused_by_ratio(tmp_path):
    path = bomb(tmp_path)
    assert path.stat().st_size < 100_000
    (line,) = pytest.raises(TableImportError, read_table, path).value.problems
    assert "zip bomb" in line and "padding.bin" in line


def test_zip_total_size_and_entry_count_limits(tmp_path, monkeypatch):
    path = bomb(tmp_path, megabytes=2)
    monkeypatch.setattr(xlsx_safe, "MAX_RATIO", 10**9)
    monkeypatch.setattr(xlsx_safe, "MAX_TOTAL_BYTES", 2**20)
    (line,) = pytest.raises(TableImportError, read_table, path).value.problems
    assert "would unpack to" in line and "limit 1 MB" in line
    monkeypatch.setattr(xlsx_safe, "MAX_TOTAL_BYTES", 2**30)
    monkeypatch.setattr(xlsx_safe, "MAX_ENTRIES", 3)
    (line,) = pytest.raises(TableImportError, read_table, path).value.problems
    assert "parts (limit 3)" in line
    monkeypatch.setattr(xlsx_safe, "MAX_ENTRIES", 10_000)
    assert read_table(path).ids() == ["A"]  # within every limit it reads normally


# --- export -------------------------------------------------------------------------
@pytest.mark.parametrize("suffix", [".csv", ".xlsx"])
def test_export_reimports_to_the_same_plan(tmp_path, kiosk, suffix):
    path = export_table(analyze(kiosk), tmp_path / f"k{suffix}")
    back = read_table(path, kiosk.settings)
    same_plan_content(back, kiosk)
    assert plan_to_dict(back)["settings"] == plan_to_dict(kiosk)["settings"]


def test_csv_export_has_bom_and_computed_columns(tmp_path, kiosk):
    result = analyze(kiosk)
    path = export_table(result, tmp_path / "k.csv")
    raw = path.read_bytes()
    assert raw.startswith(b"\xef\xbb\xbf")
    rows = list(csv.DictReader(io.StringIO(raw.decode("utf-8-sig"))))
    by_id = {r["id"]: r for r in rows}
    facts = result.to_dict()["activities"]
    for act_id, fact in facts.items():
        row = by_id[act_id]
        assert float(row["early_start"]) == pytest.approx(fact["es"]) and float(row["late_finish"]) == pytest.approx(fact["lf"])
        assert float(row["total_float"]) == pytest.approx(fact["total_float"])
        assert row["early_start_date"] == fact["early_start"] and row["late_finish_date"] == fact["late_finish"]
        assert row["critical"] == ("yes" if fact["critical"] else "no")
        assert float(row["te"]) == pytest.approx(fact["mean"])
    assert by_id["ELEC"]["predecessors"] == "STRIP; PERM SS 2"


def test_xlsx_export_layout(tmp_path, kiosk):
    path = export_table(analyze(kiosk), tmp_path / "k.xlsx")
    sheet = openpyxl.load_workbook(path).active
    assert sheet.freeze_panes == "A2" and sheet["A1"].font.b and sheet["A1"].value == "id"
    assert sheet.column_dimensions["B"].width > sheet.column_dimensions["A"].width
    header = [c.value for c in sheet[1]]
    col = header.index("early_start_date") + 1
    assert isinstance(sheet.cell(row=2, column=col).value, dt.datetime)


def test_export_refuses_unknown_suffix(tmp_path, kiosk):
    with pytest.raises(Exception, match="export writes .csv or .xlsx"):
        export_table(analyze(kiosk), tmp_path / "k.ods")


# --- formula-injection guard ----------------------------------------------------------
def dangerous_plan():
    acts = [Activity(f"-X{i}" if i == 0 else f"X{i}", name=text, notes=text, group=text, duration=1.0)
            for i, text in enumerate(DANGEROUS)]
    return Plan(Settings(start=dt.date(2026, 1, 5)), acts, [Link("-X0", "X1")])


def test_csv_export_never_writes_a_formula(tmp_path):
    plan = dangerous_plan()
    path = export_table(analyze(plan), tmp_path / "d.csv")
    rows = list(csv.reader(io.StringIO(path.read_text(encoding="utf-8-sig"))))
    text_cols = [rows[0].index(c) for c in ("id", "name", "group", "predecessors", "notes")]
    for row in rows[1:]:
        for c in text_cols:
            assert not row[c] or row[c][0] not in "=+-@\t\r", row[c]
    assert rows[1][0] == "'-X0" and rows[2][rows[0].index("predecessors")] == "'-X0"
    back = read_table(path, plan.settings)  # the guard quote is removed again on import
    assert [a.name for a in back.activities] == [a.name.strip() for a in plan.activities]
    assert back.links == plan.links


def test_xlsx_export_never_writes_a_formula(tmp_path):
    plan = dangerous_plan()
    path = export_table(analyze(plan), tmp_path / "d.xlsx")
    with zipfile.ZipFile(path) as z:
        sheet_xml = z.read("xl/worksheets/sheet1.xml").decode()
    assert "<f>" not in sheet_xml and "<f " not in sheet_xml
    sheet = openpyxl.load_workbook(path).active
    names = [sheet.cell(row=r, column=2) for r in range(2, 2 + len(DANGEROUS))]
    assert [c.value for c in names] == DANGEROUS and all(c.data_type == "s" for c in names)
    back = read_table(path, plan.settings)
    assert [a.name for a in back.activities] == [a.name.strip() for a in plan.activities]


def test_wrong_size_tag_in_sheet_does_not_cut_off_data(tmp_path):
    path = make_xlsx(tmp_path / "w.xlsx", [("Sheet", [["id", "duration", "predecessors"], ["A", 1], ["B", 2, "A"]])])
    patched = tmp_path / "tag.xlsx"
    with zipfile.ZipFile(path) as src, zipfile.ZipFile(patched, "w") as dst:
        for item in src.infolist():
            data = src.read(item.filename)
            if item.filename == "xl/worksheets/sheet1.xml":
                data = data.replace(b'<dimension ref="A1:C3"', b'<dimension ref="A1:B2"')
                assert b'ref="A1:B2"' in data
            dst.writestr(item, data)
    plan = read_table(patched)
    assert plan.ids() == ["A", "B"] and plan.links == [Link("A", "B")]


def test_failed_export_keeps_the_previous_table(tmp_path, kiosk, monkeypatch):
    path = export_table(analyze(kiosk), tmp_path / "k.csv")
    before = path.read_bytes()
    from workbench.io import tabular

    def broken(rows, target):
        Path(target).write_text("half")
        raise OSError(28, "No space left on device")

    monkeypatch.setattr(tabular, "write_csv", broken)
    with pytest.raises(Exception, match="could not write .*No space left"):
        export_table(analyze(kiosk), path)
    assert path.read_bytes() == before and sorted(p.name for p in tmp_path.iterdir()) == ["k.csv"]
