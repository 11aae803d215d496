"""The summary strip leads with a current simulation's figures, PERT beside them; says
when the simulation is out of date; forgets it when another plan is loaded."""

import datetime as dt

from workbench.core import Activity, Link, Plan, Settings
from workbench.core.commands import EditActivity
from workbench.core.montecarlo import simulate
from workbench.figures.headline import percent
from workbench.ui.session import Session
from workbench.ui.workspace.summary_strip import SummaryStrip


def merging_plan() -> Plan:
    """Five parallel paths into one finish: PERT, on one path, is far too hopeful."""
    acts = [Activity(f"P{i}", optimistic=8, most_likely=10, pessimistic=18) for i in range(5)]
    acts.append(Activity("END", duration=0))
    return Plan(Settings(title="Merge", start=dt.date(2027, 3, 1), deadline=11.0, target_confidence=0.8),
                acts, [Link(a.id, "END") for a in acts[:-1]])


def test_strip_follows_the_simulation_and_says_when_it_is_stale(qtbot):
    session = Session(merging_plan())
    strip = SummaryStrip(session)
    qtbot.addWidget(strip)
    pert = session.analysis.probability_by_deadline()
    assert strip.values["odds"].text().startswith(percent(pert))
    sim = simulate(session.plan, 3000, seed=8)
    session.set_simulation(sim)
    chance = sim.prob_by(session.analysis.deadline)[0]
    assert chance < pert - 0.2
    assert strip.values["odds"].text().startswith(percent(chance))
    assert strip.captions["odds"].text() == "Chance of meeting the deadline (simulation)"
    assert strip.besides["odds"].text() == f"PERT (single path): {percent(pert)}"
    assert strip.captions["target"].text().startswith("P80")
    session.push(EditActivity("P0", name="Path zero"))
    assert "out of date" in strip.note.text() and percent(chance) in strip.note.text()
    session.load(merging_plan())
    assert "No simulation yet" in strip.note.text()
    assert strip.captions["odds"].text().endswith("(PERT)")
