"""`slackline simulate` and `slackline report` on the bundled demo plan."""

from __future__ import annotations

import json

import pytest
from pypdf import PdfReader

from workbench.cli import main
from workbench.resources import demo_path


def run(capsys, *argv):
    code = main(list(argv))
    out, err = capsys.readouterr()
    return code, out, err


def test_simulate_json_contract_and_merge_bias(capsys):
    code, out, err = run(capsys, "simulate", str(demo_path()), "--iterations", "3000", "--seed", "11", "--json")
    assert code == 0, err
    data = json.loads(out)
    assert data["iterations"] == 3000 and data["seed"] == 11
    for key in ("P10", "P50", "P80", "P90"):
        assert key in data["percentiles"]
    p = data["percentiles"]
    assert p["P10"] <= p["P50"] <= p["P80"] <= p["P90"]
    # The demo plan's near-critical paths merge late: the simulated mean lies above PERT's.
    assert data["mean"] > data["pert_mean"] and data["merge_bias"] == pytest.approx(data["mean"] - data["pert_mean"])
    assert 0.0 <= data["probability"] <= 1.0
    assert set(data["criticality"]) == set(data["sensitivity"])
    assert all(0.0 <= v <= 1.0 for v in data["criticality"].values())


def test_simulate_same_seed_same_answer(capsys):
    args = ("simulate", str(demo_path()), "--iterations", "1500", "--seed", "5", "--json")
    first = run(capsys, *args)[1]
    second = run(capsys, *args)[1]
    assert first == second


def test_simulate_text_shows_drivers_and_caution(capsys):
    code, out, _ = run(capsys, "simulate", str(demo_path()), "--iterations", "1000", "--seed", "2")
    assert code == 0
    assert "P80" in out and "P90" in out and "merge bias" in out
    assert "Top drivers" in out and "Caution" in out


def test_simulate_bad_distribution_exits_2(capsys):
    with pytest.raises(SystemExit) as exc:
        main(["simulate", str(demo_path()), "--distribution", "lognormal"])
    assert exc.value.code == 2


def test_report_writes_a_pack(capsys, tmp_path):
    out = tmp_path / "pack.pdf"
    code, text, err = run(capsys, "report", str(demo_path()), "-o", str(out), "--iterations", "500", "--seed", "3")
    assert code == 0, err
    reader = PdfReader(str(out))
    assert len(reader.pages) >= 5
    from workbench.io.planfile import load_plan

    title = load_plan(demo_path()).settings.title
    assert title.split(":")[0] in reader.pages[0].extract_text()


def test_report_refuses_bad_output_name(capsys, tmp_path):
    code, _, err = run(capsys, "report", str(demo_path()), "-o", str(tmp_path / "pack.docx"))
    assert code == 2 and ".pdf" in err
