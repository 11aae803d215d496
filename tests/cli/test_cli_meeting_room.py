"""Command-line fixes a planner needed: --start and --title for a table, short seeds,
quiet exit into `head`, a table's loop reported with its other problems, names in --json."""

import json
import subprocess
import sys

import pytest

from workbench.cli import main

TABLE = ("id,name,optimistic,most_likely,pessimistic,predecessors\n"
         "A,Survey the site,1,2,3,\nB,Pour the slab,2,3,5,A\nC,Raise the frame,4,5,9,B\n")


@pytest.fixture
def table(tmp_path):
    path = tmp_path / "warehouse.csv"
    path.write_text(TABLE, encoding="utf-8")
    return path


def _json(capsys, *argv):
    assert main(list(argv)) == 0
    return json.loads(capsys.readouterr().out)


def test_a_table_takes_its_start_and_title_from_the_command_line(table, capsys):
    data = _json(capsys, "analyze", str(table), "--start", "2027-03-01", "--title", "Warehouse bay 4", "--json")
    assert data["start"] == "2027-03-01" and data["title"] == "Warehouse bay 4"
    plain = _json(capsys, "analyze", str(table), "--json")
    assert plain["title"] == "warehouse"                         # the file's name, not "Untitled plan"
    sim = _json(capsys, "simulate", str(table), "--start", "2027-03-01", "--iterations", "200", "--json")
    assert sim["percentile_dates"]["P50"] >= "2027-03-01"


def test_a_bad_start_is_named_and_exits_2(table, capsys):
    assert main(["analyze", str(table), "--start", "2027-02-30"]) == 2
    assert "--start" in capsys.readouterr().err


def test_json_carries_activity_names(table, capsys):
    data = _json(capsys, "analyze", str(table), "--json")
    assert data["activities"]["B"]["name"] == "Pour the slab"
    sim = _json(capsys, "simulate", str(table), "--iterations", "200", "--seed", "5", "--json")
    assert sim["names"]["C"] == "Raise the frame"


def test_a_drawn_seed_is_short_enough_to_read_aloud(table, capsys):
    for _ in range(5):
        seed = _json(capsys, "simulate", str(table), "--iterations", "100", "--json")["seed"]
        assert 0 <= seed < 1_000_000


def test_a_table_with_bad_cells_and_a_loop_reports_both_at_once(tmp_path, capsys):
    path = tmp_path / "bad.csv"
    path.write_text("id,name,duration,predecessors\nP1,Dig,abc,P3\nP2,Pour,2,P1\nP3,Cure,2,P2\n"
                    "P4,Frame,3,P2\nP5,Roof,x,P4\n", encoding="utf-8")
    assert main(["analyze", str(path)]) == 2
    err = capsys.readouterr().err
    assert "row 2" in err and "row 6" in err                      # the bad cells
    assert "loop" in err.lower() and "P2" in err and "P3" in err    # and the loop P2 -> P3 -> P2


def test_piping_into_head_exits_quietly(table):
    cmd = (f"{sys.executable} -m workbench.cli simulate {table} --iterations 3000 --seed 1 "
           f"| head -n 1")
    done = subprocess.run(["bash", "-o", "pipefail", "-c", cmd], capture_output=True, text=True)
    assert "Broken pipe" not in done.stderr and "Traceback" not in done.stderr
    assert done.stderr == ""


def test_report_says_where_the_pack_went_and_how_many_pages(table, tmp_path, capsys):
    out = tmp_path / "pack.pdf"
    assert main(["report", str(table), "-o", str(out), "--iterations", "200", "--seed", "3"]) == 0
    said = capsys.readouterr().out
    assert str(out) in said and "pages" in said
