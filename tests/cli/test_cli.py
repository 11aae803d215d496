"""The `slackline` command line: the JSON contract, exit codes and messages on bad input."""

from __future__ import annotations

import json
import subprocess
import sys
from pathlib import Path

import pytest

from workbench.cli import main

# R1 (reference-cases.md): Hillier & Lieberman, *Introduction to Operations Research*,
# PERT/CPM chapter, house-building bid. The three-point estimates are [memory] and
# reproduce the published totals (mean 44 weeks, variance 9).
R1_CSV = """id,name,optimistic,most_likely,pessimistic,predecessors
A,Excavate,1,2,3,
B,Lay the foundation,2,3.5,8,A
C,Put up the rough wall,6,9,18,B
D,Put up the roof,4,5.5,10,C
E,Install the exterior plumbing,1,4.5,5,C
F,Install the interior plumbing,4,4,10,E
G,Put up the exterior siding,5,6.5,11,D
H,Do the exterior painting,5,8,17,E;G
I,Do the electrical work,3,7.5,9,C
J,Put up the wallboard,3,9,9,F;I
K,Install the flooring,4,4,4,J
L,Do the interior painting,1,5.5,7,J
M,Install the exterior fixtures,1,2,3,H
N,Install the interior fixtures,5,5.5,9,K;L
"""


def run(capsys, *argv):
    code = main(list(argv))
    out, err = capsys.readouterr()
    return code, out, err


@pytest.fixture
def r1_csv(tmp_path: Path) -> Path:
    path = tmp_path / "house.csv"
    path.write_text(R1_CSV, encoding="utf-8")
    return path


def test_analyze_json_r1_published_answers(capsys, r1_csv):
    code, out, err = run(capsys, "analyze", str(r1_csv), "--deadline", "47", "--json")
    assert code == 0, err
    data = json.loads(out)
    # Published: critical path A-B-C-E-F-J-L-N, mean 44, variance 9, P(T <= 47) = Φ(1).
    assert data["critical_path"] == list("ABCEFJLN")
    assert data["duration"] == 44
    assert data["pert"]["mean"] == 44 and data["pert"]["variance"] == 9
    assert data["pert"]["z"] == 1
    assert data["pert"]["probability"] == pytest.approx(0.841345, abs=1e-6)  # R4: scipy.stats.norm
    # Published total floats with the project finish as reference: D, G, H, M = 4 etc.
    # With the deadline 47 every float grows by the 3 weeks of margin.
    floats = {k: v["total_float"] - 3 for k, v in data["activities"].items()}
    assert floats == {**dict.fromkeys("ABCEFJLN", 0), **dict.fromkeys("DGHM", 4), "I": 2, "K": 1}
    for key in ("es", "ef", "ls", "lf", "free_float", "critical", "mean", "variance", "early_start"):
        assert key in data["activities"]["A"]
    assert data["start"] <= data["finish"]


def test_analyze_text_names_path_and_odds(capsys, r1_csv):
    code, out, _ = run(capsys, "analyze", str(r1_csv), "--deadline", "47")
    assert code == 0
    assert "A - B - C - E - F - J - L - N" in out
    assert "0.8413" in out and "Caution" in out  # R1 published: P(T ≤ 47) = Φ(1) = 0.8413


def test_analyze_deadline_as_date(capsys, r1_csv):
    code, out, _ = run(capsys, "analyze", str(r1_csv), "--json")
    finish = json.loads(out)["finish"]
    code, out, err = run(capsys, "analyze", str(r1_csv), "--json", "--deadline", finish)
    assert code == 0, err
    pert = json.loads(out)["pert"]
    assert pert["deadline"] == pytest.approx(44)   # finishing on the finish date = 44 days
    assert pert["probability"] == pytest.approx(0.5)


BAD_TABLES = {
    "cycle": ("id,duration,predecessors\nP1,1,P3\nP2,1,P1\nP3,1,P2\n", ["P1 \u2192 P2 \u2192 P3 \u2192 P1"]),
    "unknown predecessor": ("id,duration,predecessors\nA,1,\nB,2,Z\n", ["Z", "B"]),
    "estimates out of order": ("id,optimistic,most_likely,pessimistic\nA,5,3,8\n", ["A"]),
    "negative estimate": ("id,optimistic,most_likely,pessimistic\nA,-1,3,8\n", ["A"]),
    "not a number": ("id,optimistic,most_likely,pessimistic\nA,1,three,8\n", ["A"]),
    "nan": ("id,optimistic,most_likely,pessimistic\nA,1,nan,8\n", ["A"]),
    "infinite": ("id,duration\nA,inf\n", ["A"]),
    "duplicate ids": ("id,duration\nA,1\nA,2\n", ["A"]),
    "self link": ("id,duration,predecessors\nA,1,A\n", ["A"]),
    "unknown link type": ("id,duration,predecessors\nA,1,\nB,1,A XX 2\n", ["XX"]),
    "empty file": ("", ["empty"]),
}


@pytest.mark.parametrize("case", sorted(BAD_TABLES))
def test_bad_input_exits_2_naming_the_culprit(capsys, tmp_path, case):
    text, culprits = BAD_TABLES[case]
    path = tmp_path / "plan.csv"
    path.write_text(text, encoding="utf-8")
    code, out, err = run(capsys, "analyze", str(path))
    assert code == 2, (case, out, err)
    assert "Traceback" not in err
    for word in culprits:
        assert word.lower() in err.lower(), (case, err)


def test_binary_and_missing_files(capsys, tmp_path):
    binary = tmp_path / "plan.slw"
    binary.write_bytes(bytes(range(256)) * 4)
    code, _, err = run(capsys, "analyze", str(binary))
    assert code == 2 and "plan.slw" in err
    code, _, err = run(capsys, "analyze", str(tmp_path / "missing.slw"))
    assert code == 2 and "no such file" in err
    code, _, err = run(capsys, "analyze", str(tmp_path / "plan.docx"))
    assert code == 2 and ".docx" in err


def test_bad_arguments(capsys, r1_csv):
    assert run(capsys, "analyze", str(r1_csv), "--deadline", "soon")[0] == 2
    with pytest.raises(SystemExit) as exc:
        main(["simulate", str(r1_csv), "--iterations", "many"])
    assert exc.value.code == 2
    code, _, err = run(capsys, "simulate", str(r1_csv), "--iterations", "0")
    assert code == 2 and "--iterations" in err


def test_import_then_analyze_and_export(capsys, tmp_path, r1_csv):
    plan = tmp_path / "house.slw"
    code, _, err = run(capsys, "import", str(r1_csv), "-o", str(plan), "--start", "2027-03-01", "--unit", "weeks")
    assert code == 0, err
    code, out, _ = run(capsys, "analyze", str(plan), "--json")
    data = json.loads(out)
    assert data["unit"] == "weeks" and data["start"] == "2027-03-01" and data["duration"] == 44
    out_csv = tmp_path / "out.csv"
    assert run(capsys, "export", str(plan), "-o", str(out_csv))[0] == 0
    code, out2, _ = run(capsys, "analyze", str(out_csv), "--json")
    assert code == 0 and json.loads(out2)["critical_path"] == data["critical_path"]


def test_failed_import_leaves_existing_output_untouched(capsys, tmp_path):
    target = tmp_path / "keep.slw"
    target.write_bytes(b"previous content")
    bad = tmp_path / "bad.csv"
    bad.write_text("id,duration,predecessors\nA,1,B\nB,1,A\n", encoding="utf-8")
    code, _, err = run(capsys, "import", str(bad), "-o", str(target))
    assert code == 2 and "\u2192" in err
    assert target.read_bytes() == b"previous content"


def test_a_real_process_exits_2_without_traceback(tmp_path):
    bad = tmp_path / "loop.csv"
    bad.write_text("id,duration,predecessors\nX,1,Y\nY,1,X\n", encoding="utf-8")
    proc = subprocess.run([sys.executable, "-m", "workbench", "analyze", str(bad)],
                          capture_output=True, text=True, timeout=120)
    assert proc.returncode == 2
    assert "Traceback" not in proc.stderr and "loop" in proc.stderr


def test_deadline_before_the_start_keeps_its_own_date(capsys, r1_csv):
    code, out, err = run(capsys, "analyze", str(r1_csv), "--deadline", "2020-01-03", "--json")
    assert code == 0, err
    pert = json.loads(out)["pert"]
    assert pert["deadline_date"] == "2020-01-03" and pert["deadline"] < 0
    assert pert["probability"] == pytest.approx(0.0, abs=1e-12)


@pytest.mark.parametrize("value", ["1e308", "-2e6", "nan", "9999-12-31", "1066-10-14"])
def test_deadline_out_of_range_is_refused(capsys, r1_csv, value):
    code, _, err = run(capsys, "analyze", str(r1_csv), f"--deadline={value}")
    assert code == 2 and "--deadline" in err and "Traceback" not in err


def test_huge_numbers_in_a_table_are_named(capsys, tmp_path):
    path = tmp_path / "huge.csv"
    path.write_text("id,duration,predecessors\nA,1e308,\nB,2,A FS 1e300\n", encoding="utf-8")
    code, _, err = run(capsys, "analyze", str(path))
    assert code == 2
    assert "row 2, activity A" in err and "row 3, activity B" in err and "beyond" in err


def test_a_typo_of_a_verb_is_not_opened_as_a_file(capsys):
    code, _, err = run(capsys, "analyse", "plan.slw")
    assert code == 2 and "unknown verb" in err
    code, _, err = run(capsys, "missing-plan.slw")
    assert code == 2 and "no such file" in err
