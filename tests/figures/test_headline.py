"""The headline figures shared by the summary strip, Present's summary and the pack cover."""

import datetime as dt

import pytest

from workbench.core.analysis import analyze
from workbench.core.date_text import show_date
from workbench.core.model import Activity, Link, Plan, Settings
from workbench.core.montecarlo import simulate
from workbench.figures.headline import PERT, SIMULATION, headline, percent


def merging_plan(deadline: float) -> Plan:
    """Six equal parallel paths merging into one finish: PERT follows one of them and is
    optimistic; a simulation sees the merge (the finish waits for the slowest path)."""
    acts = [Activity(f"P{i}", optimistic=8, most_likely=10, pessimistic=18) for i in range(6)]
    acts.append(Activity("END", duration=0))
    links = [Link(a.id, "END") for a in acts[:-1]]
    return Plan(Settings(title="Merge", start=dt.date(2027, 3, 1), deadline=deadline,
                         target_confidence=0.8), acts, links)


@pytest.fixture(scope="module")
def current():
    plan = merging_plan(deadline=11.0)
    analysis = analyze(plan)
    return analysis, simulate(plan, 4000, seed=11)


def test_a_current_simulation_leads_with_pert_beside_it(current):
    analysis, sim = current
    h = headline(analysis, sim)
    assert h.source == SIMULATION and not h.stale
    sim_chance = sim.prob_by(analysis.deadline)[0]
    pert_chance = analysis.probability_by_deadline()
    assert sim_chance < pert_chance - 0.2     # the merge: PERT says far more than the simulation
    assert h.odds.value.startswith(percent(sim_chance))
    assert h.odds.value.endswith(f"by {show_date(analysis.date_of_duration(11.0))}")
    assert h.odds.beside == f"PERT (single path): {percent(pert_chance)}"
    assert h.target.caption.startswith("P80")
    assert h.target.value == show_date(analysis.calendar.finish_date(sim.percentile(80)))
    assert h.target.beside == f"PERT (single path): {show_date(analysis.date_at(0.8))}"
    assert "4,000 runs" in h.note and "seed 11" in h.note


def test_an_out_of_date_simulation_is_said_to_be_so(current):
    analysis, sim = current
    h = headline(analysis, sim, stale=True)
    assert h.source == PERT and h.stale
    assert h.odds.value.startswith(percent(analysis.probability_by_deadline()))
    assert "out of date" in h.note and "run it again" in h.note
    assert percent(sim.prob_by(analysis.deadline)[0]) in h.note


def test_without_a_simulation_pert_leads_and_the_note_says_how_to_get_one(current):
    analysis, _ = current
    h = headline(analysis)
    assert h.source == PERT and not h.stale
    assert "(PERT)" in h.odds.caption and h.odds.beside == ""
    assert "run a simulation" in h.note


def test_no_deadline_is_said_plainly():
    plan = merging_plan(deadline=11.0)
    plan.settings.deadline = None
    h = headline(analyze(plan), simulate(plan, 500, seed=3))
    assert h.odds.value == "no deadline set" and h.odds.beside == ""


@pytest.mark.parametrize("p, text", [(0.437, "44 %"), (0.8547, "85 %"), (0.953, "95.3 %"),
                                     (0.04, "4.0 %"), (1.0, "> 99.9 %"), (0.0, "< 0.1 %")])
def test_percent_is_rounded_for_people(p, text):
    assert percent(p) == text
