"""The approval pack with a Monte Carlo simulation: seed recorded and reproducible, the
simulated odds printed as the Odds view formats them, drivers ranked, charts vector."""

from __future__ import annotations

import datetime as dt
import re

import pytest
from pypdf import PdfReader

from support.plans import footbridge_plan
from workbench.core import montecarlo
from workbench.figures.drivers import sensitivity_bars
from workbench.figures.odds import format_probability
from workbench.reports.pack import build_pack


WHEN = dt.datetime(2027, 2, 23, 9, 30, tzinfo=dt.timezone.utc)
ITERATIONS = 2000


def _sections(reader):
    return {item.title: reader.get_destination_page_number(item) for item in reader.outline}


def _text(reader, pages) -> str:
    return "\n".join(reader.pages[p].extract_text() or "" for p in pages)


@pytest.fixture(scope="module")
def simulated(tmp_path_factory):
    path = tmp_path_factory.mktemp("sim") / "pack.pdf"
    info = build_pack(footbridge_plan(), path, iterations=ITERATIONS, seed=42, generated_at=WHEN)
    return info, PdfReader(str(path)), path


def test_seed_is_recorded_on_every_page(simulated):
    info, reader, _ = simulated
    assert info.seed == 42
    for number in range(len(reader.pages)):
        assert "seed 42" in (reader.pages[number].extract_text() or ""), number


def test_summary_shows_the_simulated_probability_as_the_screen_does(simulated):
    _, reader, _ = simulated
    plan = footbridge_plan()
    sim = montecarlo.simulate(plan, iterations=ITERATIONS, seed=42)
    from workbench.core.analysis import analyze
    deadline = analyze(plan).deadline
    p, _ = sim.prob_by(deadline)
    summary = _text(reader, [_sections(reader)["Summary"]])
    assert format_probability(p) in summary
    odds = _text(reader, [_sections(reader)["Odds"]])
    assert f"Simulation ({ITERATIONS:,} runs, seed 42)" in odds


def test_drivers_page_ranks_the_top_driver_first(simulated):
    _, reader, _ = simulated
    plan = footbridge_plan()
    sim = montecarlo.simulate(plan, iterations=ITERATIONS, seed=42)
    top = sensitivity_bars(sim, plan, top=15)[0]
    text = _text(reader, [_sections(reader)["Drivers"]])
    assert top.act_id in text
    summary = _text(reader, [_sections(reader)["Summary"]])
    assert re.search(rf"\b{re.escape(top.act_id)}\b", summary.split("Top risk drivers")[1])


def test_simulation_chart_pages_are_vector(simulated):
    _, reader, _ = simulated
    found = _sections(reader)
    for number in range(found["Odds"], found["Activities"]):
        page = reader.pages[number]
        ops = page.get_contents().get_data().decode("latin-1")
        assert len(re.findall(r"(?<=\s)(?:m|l|re)(?=\s)", ops)) >= 30, number
        xobjects = page["/Resources"].get("/XObject", {})
        assert not [k for k, v in xobjects.items() if v.get_object().get("/Subtype") == "/Image"]


def test_same_seed_same_bytes(simulated, tmp_path):
    _, _, first = simulated
    again = tmp_path / "again.pdf"
    build_pack(footbridge_plan(), again, iterations=ITERATIONS, seed=42, generated_at=WHEN)
    assert again.read_bytes() == first.read_bytes()


def test_without_a_seed_one_is_chosen_and_printed(tmp_path):
    info = build_pack(footbridge_plan(), tmp_path / "p.pdf", iterations=500, generated_at=WHEN)
    assert isinstance(info.seed, int) and info.seed >= 0
    reader = PdfReader(str(tmp_path / "p.pdf"))
    assert f"seed {info.seed}" in (reader.pages[0].extract_text() or "")
    again = build_pack(footbridge_plan(), tmp_path / "q.pdf", iterations=500, seed=info.seed, generated_at=WHEN)
    assert (tmp_path / "q.pdf").read_bytes() == (tmp_path / "p.pdf").read_bytes()
    assert again.seed == info.seed


@pytest.mark.parametrize("paper", ["a4", "letter"])
def test_each_simulation_chart_fills_exactly_one_page(tmp_path, paper):
    path = tmp_path / f"{paper}.pdf"
    build_pack(footbridge_plan(), path, iterations=500, seed=3, paper=paper, generated_at=WHEN)
    found = _sections(PdfReader(str(path)))
    assert found["S-curve"] - found["Odds"] == 1
    assert found["Drivers"] - found["S-curve"] == 1
    assert found["Activities"] - found["Drivers"] == 1


def test_fixed_durations_give_a_certain_finish_without_nan(tmp_path):
    from workbench.core.model import Activity, Link, Plan, Settings

    plan = Plan(Settings(title="Fixed", start=dt.date(2027, 1, 4), deadline=9.0),
                [Activity("A", duration=3), Activity("B", duration=4), Activity("M", duration=0)],
                [Link("A", "B"), Link("B", "M")])
    path = tmp_path / "fixed.pdf"
    build_pack(plan, path, iterations=300, seed=2, generated_at=WHEN)
    reader = PdfReader(str(path))
    summary = _text(reader, [_sections(reader)["Summary"]])
    assert format_probability(1.0) in summary
    assert "nan" not in _text(reader, range(len(reader.pages))).lower()


def test_simulated_finishes_and_the_answer_differ_in_a_grayscale_copy(simulated):
    """Full sky blue and orange print as the same grey; the histogram behind the shaded
    answer is a light tint, so the answer stays clearly darker on a black-and-white copy."""
    from reportlab.lib.rl_accel import fp_str
    from workbench.reports import styles
    _, reader, _ = simulated

    def gray(c):
        return 0.299 * c.red + 0.587 * c.green + 0.114 * c.blue

    assert gray(styles.FLOAT_TINT) - gray(styles.PROBABILITY) >= 0.25
    page = _sections(reader)["Odds"]
    stream = reader.pages[page].get_contents().get_data().decode("latin-1")
    fills = set(re.findall(r"([\d.]+ [\d.]+ [\d.]+) rg", stream))
    tint = fp_str(styles.FLOAT_TINT.red, styles.FLOAT_TINT.green, styles.FLOAT_TINT.blue)
    assert tint in fills
    assert fp_str(styles.FLOAT.red, styles.FLOAT.green, styles.FLOAT.blue) not in fills


def test_risk_events_are_listed_with_how_often_they_struck(tmp_path):
    from workbench.core.demo import demo_plan
    plan = demo_plan()
    path = tmp_path / "demo.pdf"
    build_pack(plan, path, iterations=3000, seed=3, generated_at=WHEN)
    reader = PdfReader(str(path))
    found = _sections(reader)
    text = re.sub(r"\s+", " ", _text(reader, range(found["Assumptions and cautions"], len(reader.pages))))
    risk = plan.risks[0]
    assert "Risk events" in text and risk.id in text and f"{risk.probability * 100:.0f} %" in text
    struck = re.search(rf"{risk.id} .*? (\d+\.\d) % [+-]\d+\.\d days", text)
    assert struck and abs(float(struck.group(1)) / 100 - risk.probability) < 0.03   # 3,000 runs
    assert "1 risk event adds delays" in text and "event(s)" not in text
    summary = re.sub(r"\s+", " ", _text(reader, [found["Summary"]]))
    assert f"Risk events, which PERT leaves out, also add delay: {risk.id}" in summary


def test_a_rarely_critical_driver_is_explained_through_its_correlation_group():
    from types import SimpleNamespace as NS
    from workbench.core.model import CorrelationGroup
    from workbench.reports.summary import _through_others
    ctx = NS(plan=NS(correlations=[CorrelationGroup("Crew speed", ("X", "Y", "W"), 0.5)]))
    shown = [NS(id="X", criticality=0.0, sensitivity=0.3), NS(id="Z", criticality=0.01, sensitivity=0.4),
             NS(id="Y", criticality=0.6, sensitivity=0.3)]
    note = _through_others(ctx, shown)
    assert "X is rarely critical but its duration moves with Y, W ('Crew speed')" in note
    assert "Z " not in note and "Y is" not in note


def test_a_seed_drawn_for_the_pack_can_be_read_aloud(tmp_path):
    """README: a seed drawn for you has at most six digits (the pack's footer prints it)."""
    seeds = {build_pack(footbridge_plan(), tmp_path / f"p{k}.pdf", iterations=50, generated_at=WHEN).seed
             for k in range(3)}
    assert all(0 <= s < montecarlo.SEED_RANGE for s in seeds), seeds
