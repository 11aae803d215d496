"""The command line and the living schedule: --status-date, the JSON fields, `baseline`."""

from __future__ import annotations

import csv
import datetime as dt
import io
import json
import shutil
from pathlib import Path

import pytest

from workbench.cli import main
from workbench.io.planfile import load_plan

SAMPLE = Path(__file__).resolve().parent.parent / "data" / "harbour_kiosk_progress_v3.slw"


@pytest.fixture
def kiosk(tmp_path) -> Path:
    path = tmp_path / "kiosk.slw"
    shutil.copy(SAMPLE, path)
    return path


def run(capsys, *argv):
    code = main([str(a) for a in argv])
    out, err = capsys.readouterr()
    return code, out, err


def test_analyze_json_gives_the_progress_and_baseline_fields(capsys, kiosk):
    code, out, _ = run(capsys, "analyze", kiosk, "--status-date", "2026-03-16", "--json")
    data = json.loads(out)
    assert code == 0
    # Monday 16 March: remaining work from the start of Tuesday, 11 working days in.
    assert data["status_date"] == "2026-03-16" and data["status_offset"] == 11
    assert data["baseline"] == "Board approval rev B" and data["progress_rule"] == "progress override"
    surv, perm, fit = (data["activities"][k] for k in ("SURV", "PERM", "FIT"))
    assert (surv["state"], surv["actual_start"], surv["actual_finish"], surv["remaining_mean"]) == ("done", 0, 3, 0)
    assert (perm["state"], perm["actual_start"], perm["actual_finish"]) == ("in progress", 3, None)
    assert perm["remaining_mean"] == pytest.approx((3 + 20 + 9) / 6)
    assert fit["state"] == "not started" and fit["baseline_finish"] is not None
    for act in data["activities"].values():
        assert {"baseline_start", "baseline_finish", "start_variance", "finish_variance"} <= act.keys()
    assert data["finish_variance"] == 4      # one more day of status than the sample's own date: 3 + 1


def test_analyze_without_a_baseline_and_without_progress_keeps_the_fields_null(capsys, tmp_path):
    plain = tmp_path / "plain.slw"
    shutil.copy(SAMPLE.parent / "harbour_kiosk_v3.slw", plain)
    data = json.loads(run(capsys, "analyze", plain, "--json")[1])
    assert data["status_offset"] is None and data["finish_variance"] is None and data["baseline"] is None
    assert all(a["state"] == "not started" and a["actual_start"] is None for a in data["activities"].values())


@pytest.mark.parametrize("argv, words", [
    (["--status-date", "16/03/2026"], ["--status-date", "'16/03/2026' is not a date"]),
    (["--status-date", "2026-03-03"], ["activity SURV", "actual finish 2026-03-04 is after the status date 2026-03-03"]),
    (["--baseline", "Tender"], ["no baseline named 'Tender'", "Board approval rev B"]),
])
def test_bad_living_arguments_exit_2_naming_the_culprit(capsys, kiosk, argv, words):
    code, out, err = run(capsys, "analyze", kiosk, *argv)
    assert code == 2 and out == ""
    for word in words:
        assert word in err


def test_the_baseline_verb_records_one_and_saves_atomically(capsys, kiosk):
    code, out, _ = run(capsys, "baseline", kiosk, "--name", "March update", "--approved", "--iterations", "300",
                       "--seed", "4")
    assert code == 0 and "recorded baseline 'March update' (approved)" in out
    plan = load_plan(kiosk)
    assert [(b.name, b.approved) for b in plan.baselines] == [("Board approval rev B", False), ("March update", True)]
    new = plan.baselines[1]
    assert new.simulation.seed == 4 and new.simulation.iterations == 300 and new.status_date == dt.date(2026, 3, 13)
    assert (kiosk.parent / "kiosk.slw.bak").read_bytes() == SAMPLE.read_bytes()
    code, out, _ = run(capsys, "baseline", kiosk, "--list")
    assert "* March update" in out and "  Board approval rev B" in out
    code, _, err = run(capsys, "baseline", kiosk, "--name", "March update")
    assert code == 2 and "exists already" in err
    code, _, err = run(capsys, "baseline", kiosk)
    assert code == 2 and "--name" in err


def test_simulate_from_a_status_date_and_recording_the_trend(capsys, kiosk):
    code, out, _ = run(capsys, "simulate", kiosk, "--iterations", "400", "--seed", "2", "--status-date",
                       "2026-03-20", "--json", "--record-trend")
    assert code == 0 and json.loads(out)["status_date"] == "2026-03-20"
    points = load_plan(kiosk).odds_trend
    assert [p.status_date.isoformat() for p in points] == ["2026-03-06", "2026-03-13", "2026-03-20"]
    assert points[-1].seed == 2 and points[-1].iterations == 400


def test_export_carries_the_variance_and_import_sets_the_status_date(capsys, kiosk, tmp_path):
    table = tmp_path / "k.csv"
    assert run(capsys, "export", kiosk, "-o", table)[0] == 0
    rows = list(csv.DictReader(io.StringIO(table.read_text(encoding="utf-8-sig"))))
    assert rows[0]["state"] == "done" and rows[0]["finish_variance"] == "0"
    back = tmp_path / "back.slw"
    code, _, err = run(capsys, "import", table, "-o", back)
    assert code == 2 and "activity SURV has progress, so the plan needs a status date" in err
    assert run(capsys, "import", table, "-o", back, "--start", "2026-03-02", "--status-date", "2026-03-13")[0] == 0
    assert load_plan(back).settings.status_date == dt.date(2026, 3, 13)
