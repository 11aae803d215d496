"""The pack's Resources pages: present for a plan with resources (loading, what levelling
moves, the odds with and without the crews), absent otherwise."""

import datetime as dt

from pypdf import PdfReader

from workbench.core.demo import demo_plan
from workbench.core.levelling import level
from workbench.reports.pack import build_pack

from support.plans import footbridge_plan

WHEN = dt.datetime(2027, 2, 1, 9, 0)


def pages_text(path):
    return [p.extract_text() for p in PdfReader(str(path)).pages]


def test_demo_pack_has_the_resources_pages(tmp_path):
    build_pack(demo_plan(), tmp_path / "p.pdf", iterations=500, seed=5, generated_at=WHEN)
    text = "\n".join(pages_text(tmp_path / "p.pdf"))
    assert "Resources: who is needed when" in text and "Electricians" in text
    moved = level(demo_plan()).moves
    assert "What levelling moves, and what holds it" in text and f"{moved[0].id}  " in text
    assert "The odds with and without the crews" in text and "seed 5" in text
    assert "Waiting for crews adds" in text and "Caution" in text


def test_a_plan_without_resources_has_no_resources_page(tmp_path):
    build_pack(footbridge_plan(), tmp_path / "p.pdf", iterations=200, seed=5, generated_at=WHEN)
    assert not any("Resources: who is needed when" in t for t in pages_text(tmp_path / "p.pdf"))


def test_the_logic_only_odds_beside_the_crews_are_the_packs_own_run(tmp_path):
    """The board reads one chance of the deadline without crews: the Resources page's
    logic-only column is the Odds pages' run, not a second, shorter one."""
    from workbench.core.formatting import format_percent
    from workbench.core.montecarlo import simulate

    build_pack(demo_plan(), tmp_path / "p.pdf", iterations=700, seed=5, generated_at=WHEN)
    page = next(t for t in pages_text(tmp_path / "p.pdf") if "The odds with and without the crews" in t)
    run = simulate(demo_plan(), 700, seed=5)
    assert "700 iterations each with seed 5" in page
    assert f"Chance of the deadline\n{format_percent(run.prob_by(run.deadline)[0])}\n" in page


def test_the_crews_odds_caution_names_pert(tmp_path):
    build_pack(demo_plan(), tmp_path / "p.pdf", iterations=300, seed=5, generated_at=WHEN)
    page = next(t for t in pages_text(tmp_path / "p.pdf") if "The odds with and without the crews" in t)
    assert "PERT assumes one path and independent durations" in " ".join(page.split())


def test_what_held_an_activity_is_named_as_the_charts_name_it(tmp_path):
    build_pack(demo_plan(), tmp_path / "p.pdf", iterations=0, generated_at=WHEN)
    page = next(t for t in pages_text(tmp_path / "p.pdf") if "What levelling moves" in t)
    assert "Mon 28 Jun 2027\nHoist and lifting crew\n" in page       # B7, held by the hoist
    assert "\nhoist\n" not in page and "\nelec\n" not in page
