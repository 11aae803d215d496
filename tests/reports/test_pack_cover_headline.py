"""The pack's cover leads with the simulation's figures, PERT beside them (shared wording)."""

import datetime as dt

from pypdf import PdfReader

from workbench.core.analysis import analyze
from workbench.core.model import Activity, Link, Plan, Settings
from workbench.core.montecarlo import simulate
from workbench.figures.headline import headline, percent
from workbench.reports.pack import build_pack


def merging_plan() -> Plan:
    acts = [Activity(f"P{i}", optimistic=8, most_likely=10, pessimistic=18) for i in range(5)]
    acts.append(Activity("END", duration=0))
    return Plan(Settings(title="Cover odds", start=dt.date(2027, 3, 1), deadline=11.0),
                acts, [Link(a.id, "END") for a in acts[:-1]])


def cover_text(path) -> str:
    return " ".join(PdfReader(str(path)).pages[0].extract_text().split())


def test_cover_leads_with_the_simulation(tmp_path):
    plan = merging_plan()
    sim = simulate(plan, 3000, seed=21)
    build_pack(plan, tmp_path / "pack.pdf", simulation=sim)
    text = cover_text(tmp_path / "pack.pdf")
    analysis = analyze(plan)
    sim_chance, pert_chance = sim.prob_by(analysis.deadline)[0], analysis.probability_by_deadline()
    assert percent(sim_chance) != percent(pert_chance)
    assert "Chance of meeting the deadline (simulation)" in text
    assert f"{percent(sim_chance)} by" in text
    assert f"PERT (single path): {percent(pert_chance)}" in text
    assert headline(analysis, sim).target.value in text
    assert "decision rests with the organisation" in text


def test_cover_without_simulation_says_pert(tmp_path):
    plan = merging_plan()
    build_pack(plan, tmp_path / "pack.pdf", iterations=0)
    text = cover_text(tmp_path / "pack.pdf")
    assert "Chance of meeting the deadline (PERT)" in text
    assert "No simulation yet" in text
