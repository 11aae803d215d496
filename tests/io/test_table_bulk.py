"""A clean table read by columns gives the same plan as the row reader; anything less
than clean goes to the row reader, so every problem is still named by row and column."""

import datetime as dt

import pytest

from workbench.core.model import Settings
from workbench.io import row_reader
from workbench.io.errors import TableImportError
from workbench.io.plan_codec import plan_to_dict
from workbench.io.table_bulk import bulk_plan
from workbench.io.table_columns import map_header
from workbench.io.tabular import read_table

HEADER = "id,name,optimistic,most_likely,pessimistic,duration,predecessors"
CLEAN = [
    "SITE,Site survey,2,3,5,,",
    "DRAW,Drawings,4,6,11,,SITE",
    "ORDER,Order steel,,,,10,SITE",
    "ERECT,Erect frame,5,7,12,,DRAW; ORDER",
    "DONE,Handover,,,,0,ERECT",
]
SETTINGS = Settings(start=dt.date(2027, 3, 1))


def write(tmp_path, lines, header=HEADER):
    path = tmp_path / "table.csv"
    path.write_text("\n".join([header, *lines]) + "\n", encoding="utf-8")
    return path


def outcome(path):
    try:
        return plan_to_dict(read_table(path, SETTINGS))
    except TableImportError as exc:
        return exc.problems


def row_reader_outcome(path, monkeypatch):
    with monkeypatch.context() as m:
        m.setattr(row_reader, "bulk_plan", lambda *args: None)
        return outcome(path)


def bulk_taken(lines, header=HEADER) -> bool:
    rows = [(i, line.split(",")) for i, line in enumerate(lines, 2)]
    return bulk_plan(map_header(header.split(","), 1), rows, SETTINGS, False) is not None


def test_clean_table_read_by_columns_equals_the_row_reader(tmp_path, monkeypatch):
    path = write(tmp_path, CLEAN)
    assert bulk_taken(CLEAN)
    plan = outcome(path)
    assert plan == row_reader_outcome(path, monkeypatch)
    assert [l["pred"] + ">" + l["succ"] for l in plan["links"]] == [
        "SITE>DRAW", "SITE>ORDER", "DRAW>ERECT", "ORDER>ERECT", "ERECT>DONE"]


def _change(row: int, old: str, new: str) -> list[str]:
    lines = list(CLEAN)
    assert old in lines[row]
    lines[row] = lines[row].replace(old, new, 1)
    return lines


ROW_READER_CASES = [
    ("link type and lag", _change(3, "DRAW; ORDER", "DRAW SS 2; ORDER")),
    ("unknown predecessor", _change(3, "DRAW; ORDER", "DRAW; ORDRE")),
    ("own predecessor", _change(3, "DRAW; ORDER", "DRAW; ERECT")),
    ("predecessor twice", _change(3, "DRAW; ORDER", "DRAW; DRAW")),
    ("comma separator", _change(3, "DRAW; ORDER", '"DRAW, ORDER"')),
    ("text number", _change(1, ",4,", ",four,")),
    ("not a number", _change(1, ",4,", ",nan,")),
    ("underscore number", _change(1, ",4,", ",1_0,")),
    ("estimates out of order", _change(1, ",4,6,", ",7,6,")),
    ("negative duration", _change(2, ",10,", ",-1,")),
    ("half an estimate", _change(1, ",4,6,11,", ",4,,11,")),
    ("nothing to schedule", _change(2, ",10,", ",,")),
    ("duplicate id", _change(1, "DRAW,", "SITE,")),
    ("id with a space", _change(1, "DRAW,", "DR AW,")),
    ("formula guard", _change(1, "Drawings", "'=Drawings")),
    ("blank row", CLEAN[:2] + [",,,,,,"] + CLEAN[2:]),
    ("cell beyond the header", _change(0, "SITE,Site survey,2,3,5,,", "SITE,Site survey,2,3,5,,,extra")),
    ("short row", _change(0, "SITE,Site survey,2,3,5,,", "SITE,Site survey,2,3,5")),
    ("a loop", _change(0, "2,3,5,,", "2,3,5,,DONE")),
]


@pytest.mark.parametrize("label, lines", ROW_READER_CASES, ids=[c[0] for c in ROW_READER_CASES])
def test_anything_unusual_gets_the_row_readers_answer(tmp_path, monkeypatch, label, lines):
    path = write(tmp_path, lines)
    assert outcome(path) == row_reader_outcome(path, monkeypatch)


def test_loop_is_named_with_its_rows_on_either_route(tmp_path):
    lines = _change(0, "2,3,5,,", "2,3,5,,DONE")
    assert bulk_taken([line.replace("; ", ";") for line in lines])
    problems = outcome(write(tmp_path, lines))
    assert "rows" in problems[0] and "predecessors" in problems[0]


def test_constraint_and_distribution_columns_go_to_the_row_reader(tmp_path, monkeypatch):
    header = HEADER + ",distribution,start_no_earlier"
    lines = [line + ",," for line in CLEAN]
    assert bulk_taken(lines, header)
    lines[1] = lines[1][:-2] + ",triangular,2027-03-08"
    assert not bulk_taken(lines, header)
    path = write(tmp_path, lines, header)
    assert outcome(path) == row_reader_outcome(path, monkeypatch)
