"""CSV import: columns and aliases, predecessor syntax, every kind of bad row, encodings."""

import datetime as dt
from pathlib import Path

import pytest

from workbench.core import Link, PlanError, Settings
from workbench.io.tabular import (TableImportError, format_predecessors, load_any, parse_predecessors,
                                  read_table, read_table_report, rows_to_plan)

DATA = Path(__file__).resolve().parents[1] / "data"
HEADER = "id,name,optimistic,most_likely,pessimistic,duration,predecessors\n"


def write(tmp_path, text, name="t.csv", encoding="utf-8"):
    path = tmp_path / name
    path.write_bytes(text.encode(encoding) if isinstance(text, str) else text)
    return path


def problems_of(path_or_rows, **kw):
    with pytest.raises(TableImportError) as info:
        if isinstance(path_or_rows, list):
            rows_to_plan(path_or_rows, **kw)
        else:
            read_table(path_or_rows, **kw)
    assert info.value.problems and isinstance(info.value, PlanError)
    return info.value.problems


# --- predecessor syntax -------------------------------------------------------------
def test_parse_predecessors_all_forms():
    links = parse_predecessors("A; B SS 2; C ff -1, D sf", "X")
    assert links == [Link("A", "X", "FS", 0.0), Link("B", "X", "SS", 2.0), Link("C", "X", "FF", -1.0),
                     Link("D", "X", "SF", 0.0)]
    assert parse_predecessors("  ", "X") == [] and parse_predecessors("A;;", "X") == [Link("A", "X")]


@pytest.mark.parametrize("cell, message", [
    ("B XS 2", "unknown link type 'XS'"),
    ("B SS two", "lag 'two'"),
    ("B SS nan", "finite"),
    ("B SS 1 2", "cannot read predecessor"),
    ("X", "its own predecessor"),
    ("A; A", "listed twice"),
])
def test_parse_predecessors_errors(cell, message):
    with pytest.raises(PlanError, match=message):
        parse_predecessors(cell, "X")


def test_format_predecessors_reads_back():
    links = [Link("A", "X"), Link("B", "X", "SS", 2.0), Link("C", "X", "FF", -0.5), Link("D", "X", "SF", 0.0),
             Link("E", "X", "FS", 1 / 3)]
    text = format_predecessors(links)
    assert text.startswith("A; B SS 2; C FF -0.5; D SF; E FS 0.333")
    assert parse_predecessors(text, "X") == links


# --- good imports -------------------------------------------------------------------
def test_basic_csv_import(tmp_path):
    path = write(tmp_path, HEADER + "A,Dig,1,2,3,,\nB,Pour,,,,4,A\nC,Cure,2,3,7,,A; B SS 2\n")
    plan = read_table(path, Settings(start=dt.date(2026, 2, 2)))
    assert plan.ids() == ["A", "B", "C"]
    assert plan.activity("A").most_likely == 2.0 and plan.activity("B").duration == 4.0
    assert plan.links == [Link("A", "B"), Link("A", "C"), Link("B", "C", "SS", 2.0)]
    assert plan.settings.start == dt.date(2026, 2, 2)


def test_default_settings_start_today_in_days(tmp_path):
    plan = read_table(write(tmp_path, "id,duration\nA,1\n"))
    assert plan.settings.start == dt.date.today() and plan.settings.unit == "days"


def test_headers_are_case_insensitive_trimmed_and_aliased(tmp_path):
    path = write(tmp_path, " ACTIVITY ,Description, a ,M,B, Depends-On ,Phase,Comment,Dist,Not Before,mood\n"
                           "A,Dig,1,2,3,,Site,wet,tri,2026-02-09,happy\nB,Pour,1,1,1,A SS,Site,,pert,3,\n")
    plan, report = read_table_report(path)
    a, b = plan.activity("A"), plan.activity("B")
    assert (a.name, a.group, a.notes, a.distribution) == ("Dig", "Site", "wet", "triangular")
    assert a.start_no_earlier == dt.date(2026, 2, 9) and b.start_no_earlier == 3.0
    assert b.distribution == "beta-pert" and plan.links == [Link("A", "B", "SS", 0.0)]
    assert report.ignored_columns == ["mood"] and report.delimiter == "comma" and report.encoding == "utf-8"


def test_min_likely_max_aliases(tmp_path):
    plan = read_table(write(tmp_path, "key,min,likely,max,preds\nA,1,2,3,\nB,2,2,2,A\n"))
    assert plan.activity("B").optimistic == 2.0 and plan.links == [Link("A", "B")]


def test_blank_rows_are_skipped_and_row_numbers_count_them(tmp_path):
    path = write(tmp_path, "\nid,duration\n\nA,1\n,\nB,x\n")
    assert problems_of(path) == ["row 6, activity B, column B 'duration': 'x' is not a number"]


def test_semicolon_cp1252_decimal_comma_sample():
    plan, report = read_table_report(DATA / "kiosk_semicolon_cp1252.csv")
    assert report.encoding == "cp1252" and report.delimiter == "semicolon"
    assert plan.activity("K1").name == "Caf\u00e9 fit-out survey" and plan.activity("K1").optimistic == 1.5
    assert plan.activity("K3").duration == 2.5 and plan.activity("K1").notes == "measured in m\u00e9tres"
    assert Link("K3", "K4", "FF", -0.5) in plan.links and Link("K1", "K3", "SS", 1.0) in plan.links
    assert plan.activity("K2").group == "Buy"


def test_utf16_tab_sample():
    plan, report = read_table_report(DATA / "heatpump_utf16_tab.csv")
    assert report.encoding == "utf-16" and report.delimiter == "tab"
    assert plan.activity("W1").name == "W\u00e4rmepumpe bestellen" and report.ignored_columns == ["extra column"]
    assert plan.links == [Link("W1", "W2"), Link("W2", "W3", "FS", 1.0)]


def test_utf8_bom_is_detected(tmp_path):
    path = write(tmp_path, "\ufeffid;name;duration\nA;\u00c5se;2\n")
    plan, report = read_table_report(path)
    assert report.encoding == "utf-8-sig" and plan.activity("A").name == "\u00c5se"


def test_quoted_cells_with_delimiters_and_newlines(tmp_path):
    path = write(tmp_path, 'id,name,duration,predecessors,notes\nA,"Dig, then fill",1,,"two\nlines"\nB,x,2,"A, A SS 1",\n')
    plan = read_table(path)
    assert plan.activity("A").name == "Dig, then fill" and plan.activity("A").notes == "two\nlines"
    assert plan.links == [Link("A", "B"), Link("A", "B", "SS", 1.0)]


def test_rows_to_plan_from_dicts():
    plan = rows_to_plan([{"ID": "A", "Dur": "2"}, {"ID": "B", "Dur": "3", "Preds": "A FS 1"}])
    assert plan.ids() == ["A", "B"] and plan.links == [Link("A", "B", "FS", 1.0)]


def test_load_any_dispatches_by_extension(tmp_path):
    assert load_any(DATA / "harbour_kiosk_v2.slw").settings.title == "Harbour kiosk refit"
    assert load_any(write(tmp_path, "id,duration\nA,1\n", "t.txt")).ids() == ["A"]
    with pytest.raises(PlanError, match="cannot open a .pdf"):
        load_any(tmp_path / "x.pdf")


# --- bad rows: everything reported, nothing imported ----------------------------------
def test_every_row_problem_is_collected(tmp_path):
    path = write(tmp_path, HEADER + "\n".join([
        "A,ok,1,2,3,,",                 # row 2 fine
        "B,order,5,3,8,,A",             # row 3 estimates out of order
        "C,neg,-1,2,3,,A",              # row 4 negative
        "D,nan,1,nan,3,,A",             # row 5 NaN
        "E,inf,1,2,inf,,A",             # row 6 inf
        "F,text,one,2,3,,A",            # row 7 not a number
        "G,nothing,,,,,A",              # row 8 neither duration nor estimate
        "A,dup,,,,1,",                  # row 9 duplicate id
        "H,self,,,,1,H",                # row 10 self link
        "I,type,,,,1,A XX 2",           # row 11 unknown link type
        "J,ghost,,,,1,A; Q",            # row 12 unknown predecessor
        "K,part,1,,3,,",                # row 13 partial estimate
    ]) + "\n")
    got = problems_of(path)
    expect = [
        ("row 3, activity B", "out of order"),
        ("row 4, activity C", "negative"),
        ("row 5, activity D, column D 'most_likely'", "finite"),
        ("row 6, activity E, column E 'pessimistic'", "finite"),
        ("row 7, activity F, column C 'optimistic'", "'one' is not a number"),
        ("row 8, activity G", "needs a duration or a three-point estimate"),
        ("row 9, activity A, column A 'id'", "duplicate id, first used on row 2"),
        ("row 10, activity H, column G 'predecessors'", "own predecessor"),
        ("row 11, activity I, column G 'predecessors'", "unknown link type 'XX'"),
        ("row 12, activity J, column G 'predecessors'", "unknown predecessor 'Q'"),
        ("row 13, activity K", "three-point estimate needs"),
    ]
    assert len(got) == len(expect), got
    for line, (where, what) in zip(got, expect):
        assert line.startswith(where) and what in line, line


def test_cycle_is_reported_in_order_with_rows(tmp_path):
    path = write(tmp_path, "id,duration,predecessors\nA,1,C\nB,1,A\nC,1,B\nD,1,\n")
    (line,) = problems_of(path)
    assert "the links form a loop" in line
    loop = line.split(": ", 1)[1].split(" (")[0].split(" \u2192 ")
    assert loop[0] == loop[-1] and len(loop) == 4 and set(loop) == {"A", "B", "C"}
    for a, b in zip(loop, loop[1:]):  # each step follows a real link a → b
        assert {"A": "B", "B": "C", "C": "A"}[a] == b
    assert "rows" in line and all(r in line for r in ("2", "3", "4"))


def test_missing_id_column(tmp_path):
    (line,) = problems_of(write(tmp_path, "name,duration\nDig,1\n"))
    assert "row 1" in line and "no id column" in line and "'name', 'duration'" in line


def test_missing_estimate_columns_and_partial_estimate_columns(tmp_path):
    (line,) = problems_of(write(tmp_path, "id,name\nA,Dig\n"))
    assert "no duration or estimate columns" in line
    (line,) = problems_of(write(tmp_path, "id,optimistic,pessimistic\nA,1,2\n"))
    assert "most likely column" in line


def test_two_columns_meaning_the_same_field(tmp_path):
    (line,) = problems_of(write(tmp_path, "id,min,optimistic,m,b\nA,1,1,2,3\n"))
    assert "'min' and 'optimistic' both mean optimistic" in line


def test_empty_id_cell_and_header_only(tmp_path):
    assert problems_of(write(tmp_path, "id,duration\n,3\n")) == ["row 2, column A 'id': the id is empty"]
    assert "no activity rows" in problems_of(write(tmp_path, "id,duration\n\n"))[0]


@pytest.mark.parametrize("content, message", [
    (b"", "the file is empty"),
    (b"\r\n \r\n", "the file is empty"),
    (b"\x89PNG\r\n\x1a\n\x00\x00\x00\rIHDR\x00\x00", "binary file"),
    (bytes(range(1, 32)) * 20, "binary file"),
])
def test_empty_and_binary_files(tmp_path, content, message):
    (line,) = problems_of(write(tmp_path, content))
    assert message in line


def test_unreadable_file(tmp_path):
    (line,) = problems_of(tmp_path / "missing.csv")
    assert "cannot read" in line
    (line,) = problems_of(tmp_path)
    assert "cannot read" in line


def test_error_message_lists_problems_and_names_file(tmp_path):
    path = write(tmp_path, "id,duration\nA,x\nB,y\n", "plan.csv")
    with pytest.raises(TableImportError) as info:
        read_table(path)
    text = str(info.value)
    assert text.startswith("plan.csv: nothing imported, 2 problems") and "row 3, activity B" in text


def test_cells_beyond_the_header_are_refused_not_dropped(tmp_path):
    path = write(tmp_path, "id;duration;predecessors\nA;1;\nB;2;A;C\nC;1;\n")
    (line,) = problems_of(path)
    assert line.startswith("row 3, activity B") and "beyond the last header column ('C')" in line


def test_decimal_comma_lag_in_semicolon_file(tmp_path):
    path = write(tmp_path, 'id;duration;predecessors\nA;1,5;\nB;2;\nC;1;"A FF -0,5, B SS 1"\n')
    plan = read_table(path)
    assert plan.activity("A").duration == 1.5
    assert plan.links == [Link("A", "C", "FF", -0.5), Link("B", "C", "SS", 1.0)]


def test_comma_file_does_not_read_decimal_commas(tmp_path):
    (line,) = problems_of(write(tmp_path, 'id,duration\nA,"1,5"\n'))
    assert "'1,5' is not a number" in line


def test_bad_constraint_date(tmp_path):
    (line,) = problems_of(write(tmp_path, "id,duration,not before\nA,1,2026-02-30\n"))
    assert "row 2, activity A, column C 'not before'" in line and "not a valid date" in line


def test_title_lines_above_the_header_are_skipped(tmp_path):
    path = write(tmp_path, "Harbour works; phase 2\nexported by the site office\n\nid;name;duration;preds\nA;Dig;1;\nB;Fill;2,5;A\nC;x;y;\n")
    (line,) = problems_of(path)
    assert line == "row 7, activity C, column C 'duration': 'y' is not a number"
    plan = read_table(write(tmp_path, "Harbour works; phase 2\n\nid;name;duration;preds\nA;Dig;1;\nB;Fill;2,5;A\n"))
    assert plan.ids() == ["A", "B"] and plan.activity("B").duration == 2.5 and plan.links == [Link("A", "B")]


def test_import_report_summary(tmp_path):
    _, report = read_table_report(DATA / "kiosk_semicolon_cp1252.csv")
    assert report.summary() == "4 activities, 4 links (cp1252, semicolon-separated)"


def test_unknown_predecessor_differing_only_in_case_gets_a_hint(tmp_path):
    (line,) = problems_of(write(tmp_path, "id,duration,predecessors\nDIG,1,\nFILL,1,dig\n"))
    assert line.startswith("row 3, activity FILL") and "unknown predecessor 'dig'" in line and "did you mean 'DIG'" in line


def test_ids_with_spaces_are_refused(tmp_path):
    (line,) = problems_of(write(tmp_path, "id,duration\nSite survey,1\n"))
    assert line == "row 2, activity Site survey, column A 'id': an id cannot contain spaces (a predecessor cell could not name it)"
