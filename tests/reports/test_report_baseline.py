"""The pack's living-schedule pages: since the approved baseline, the odds trend, the status
date on the cover and every footer; and the signed pack recorded as a baseline."""

from __future__ import annotations

import datetime as dt
import shutil

import pytest
from pypdf import PdfReader

from workbench.cli import main
from workbench.core.analysis import analyze
from workbench.core.variance import variance_against
from workbench.figures import odds_trend as ot
from workbench.io.planfile import load_plan, plan_hash
from workbench.reports.pack import build_pack
from workbench.resources import demo_update_path
from workbench.core.formatting import format_whole_percent

WHEN = dt.datetime(2027, 5, 31, 9, 0, tzinfo=dt.timezone.utc)


@pytest.fixture(scope="module")
def pack(tmp_path_factory):
    plan = load_plan(demo_update_path())
    path = tmp_path_factory.mktemp("living") / "pack.pdf"
    info = build_pack(plan, path, iterations=1000, seed=3, generated_at=WHEN, plan_path="demo_update.slw")
    return plan, info, PdfReader(str(path))


def _sections(reader) -> dict[str, int]:
    return {item.title: reader.get_destination_page_number(item) for item in reader.outline}


def test_the_baseline_pages_follow_the_summary(pack):
    _, _, reader = pack
    names = list(_sections(reader))
    assert names[:3] == ["Cover", "Summary", "Since the approved baseline"]


def test_the_baseline_page_says_what_moved_and_how_the_odds_went(pack):
    plan, info, reader = pack
    page = _sections(reader)["Since the approved baseline"]
    text = reader.pages[page].extract_text()
    base = plan.baselines[0]
    assert "Since the approved baseline: Board approval, February 2027" in text
    assert ot.headline(plan.odds_trend, base) in text.replace("\n", " ")
    v = variance_against(analyze(plan), base)
    assert f"{v.finish_variance:g} days later" in text
    assert format_whole_percent(base.simulation.probability) in text
    assert format_whole_percent(info.simulation.prob_by(info.analysis.deadline)[0]) in text
    changed = reader.pages[page + 1].extract_text()
    assert "What changed since 'Board approval, February 2027'" in changed
    assert "B2A" in changed and "re-estimated" in changed and "20 / 25 / 40" in changed
    top_id, top_slip = v.slipped(1)[0]
    assert top_id in changed


def test_the_status_date_is_on_the_cover_and_in_every_footer(pack):
    _, _, reader = pack
    assert "2027-05-28" in reader.pages[0].extract_text()
    for page in reader.pages:
        assert "status date 2027-05-28" in page.extract_text()


def test_the_odds_page_says_from_the_status_date(pack):
    _, _, reader = pack
    text = reader.pages[_sections(reader)["Odds"]].extract_text().replace("\n", " ")
    assert "from the status date" in text


def test_a_plan_without_baseline_or_trend_has_no_such_page(tmp_path):
    plan = load_plan(demo_update_path())
    plan.baselines, plan.odds_trend = [], []
    info = build_pack(plan, tmp_path / "p.pdf", iterations=0, generated_at=WHEN)
    assert "Since the approved baseline" not in _sections(PdfReader(str(tmp_path / "p.pdf")))


def test_report_can_record_the_signed_pack_as_the_baseline(tmp_path, capsys):
    path = tmp_path / "clinic.slw"
    shutil.copy(demo_update_path(), path)
    code = main(["report", str(path), "-o", str(tmp_path / "pack.pdf"), "--iterations", "300", "--seed", "8",
                 "--record-baseline", "Board, June 2027", "--approved"])
    out = capsys.readouterr().out
    assert code == 0
    plan = load_plan(path)
    new = plan.baselines[-1]
    assert (new.name, new.approved, new.simulation.seed) == ("Board, June 2027", True, 8)
    assert new.plan_hash == plan_hash(plan) and f"plan hash {new.plan_hash}" in out
    assert not plan.baselines[0].approved
    footer = PdfReader(str(tmp_path / "pack.pdf")).pages[0].extract_text()
    assert f"plan hash {new.plan_hash}" in footer


def test_the_timeline_pages_draw_the_approved_baseline_done_work_and_slips(pack):
    _, _, reader = pack
    text = reader.pages[_sections(reader)["Timeline"]].extract_text()
    for label in ("Done", "Baseline", "Later than baseline"):
        assert label in text
