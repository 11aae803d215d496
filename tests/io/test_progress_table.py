"""Progress and variance columns in CSV/XLSX import and export."""

import csv
import datetime as dt
import io
from pathlib import Path

import pytest

from workbench.core import analyze
from workbench.core import baseline as bl
from workbench.core.variance import variance_against
from workbench.io.planfile import loads, plan_hash
from workbench.io.tabular import TableImportError, export_table, read_table

DATA = Path(__file__).resolve().parent.parent / "data"
SAMPLE = DATA / "harbour_kiosk_progress_v3.slw"


def sample():
    return loads(SAMPLE.read_text(encoding="utf-8"))


@pytest.mark.parametrize("suffix", [".csv", ".xlsx"])
def test_an_export_reimports_to_the_same_progress(tmp_path, suffix):
    plan = sample()
    path = export_table(analyze(plan), tmp_path / f"p{suffix}")
    back = read_table(path)
    for act in plan.activities:
        assert back.activity(act.id).progress == act.progress, act.id
    back.settings = plan.settings          # a table carries activities, not the plan settings
    assert analyze(back).to_dict()["activities"] == analyze(plan).to_dict()["activities"]


def test_the_export_carries_state_and_variance_columns(tmp_path):
    plan = sample()
    a = analyze(plan)
    path = export_table(a, tmp_path / "v.csv", variance_against(a, plan.baselines[0]))
    rows = {r["id"]: r for r in csv.DictReader(io.StringIO(path.read_text(encoding="utf-8-sig")))}
    facts = a.to_dict(variance_against(a, plan.baselines[0]))["activities"]
    assert rows["SURV"]["state"] == "done" and rows["SURV"]["actual_finish"] == "2026-03-04"
    assert rows["PERM"]["remaining_most_likely"] == "5"
    assert rows["FIT"]["state"] == "not started" and rows["FIT"]["actual_start"] == ""
    for act_id, fact in facts.items():
        assert rows[act_id]["baseline_finish"] == fact["baseline_finish"]
        assert float(rows[act_id]["finish_variance"]) == fact["finish_variance"]


def test_a_plan_without_progress_exports_the_plain_columns(tmp_path):
    plan = sample()
    for act in plan.activities:
        plan.replace_activity(act.id, act.with_(progress=None))
    header = export_table(analyze(plan), tmp_path / "x.csv").read_text(encoding="utf-8-sig").splitlines()[0]
    assert "actual_start" not in header and "state" not in header


def write(tmp_path, text):
    path = tmp_path / "t.csv"
    path.write_text(text, encoding="utf-8")
    return path


def test_progress_columns_import_with_their_aliases(tmp_path):
    path = write(tmp_path, "id,duration,predecessors,actual start,Actual Finish,% complete,days left\n"
                           "A,5,,2027-01-04,2027-01-08,,\nB,4,A,2027-01-11,,45%,\nC,3,B,,,,\n")
    plan = read_table(path)
    assert plan.activity("A").progress.actual_finish == dt.date(2027, 1, 8)
    assert plan.activity("B").progress.percent_complete == 45 and plan.activity("C").progress is None


def test_bad_progress_cells_are_refused_with_row_and_activity(tmp_path):
    path = write(tmp_path, "id,duration,actual_start,actual_finish,percent_complete,remaining\n"
                           "A,5,,2027-01-08,,\nB,4,2027-01-04,,130,\nC,3,2027-01-04,2027-01-06,,2\n"
                           "D,2,2027-02-30,,,\n")
    with pytest.raises(TableImportError) as err:
        read_table(path)
    text = str(err.value)
    assert "row 2, activity A: an actual finish needs an actual start" in text
    assert "row 3, activity B: percent complete 130 lies outside 0\u2013100" in text
    assert "row 4, activity C: is done (it has an actual finish) but remaining work is given" in text
    assert "row 5, activity D, column C 'actual_start': '2027-02-30' is not a valid date" in text
