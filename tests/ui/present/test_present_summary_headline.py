"""Present mode's Summary slide says what the summary strip and the pack cover say, in
the same order: a current simulation leads with PERT beside it as the single-path
estimate; after an edit the slide says the simulation is out of date."""

import datetime as dt

from workbench.core import Activity, Link, Plan, Settings
from workbench.core.commands import EditActivity
from workbench.core.montecarlo import simulate
from workbench.figures.headline import headline, percent
from workbench.ui.present.summary_slide import PresentSummarySlide
from workbench.ui.session import Session
from workbench.ui.workspace.summary_strip import SummaryStrip


def merging_plan() -> Plan:
    """Five parallel paths into one finish: PERT, on one path, is far too hopeful."""
    acts = [Activity(f"P{i}", optimistic=8, most_likely=10, pessimistic=18) for i in range(5)]
    acts.append(Activity("END", duration=0))
    return Plan(Settings(title="Merge", start=dt.date(2027, 3, 1), deadline=11.0, target_confidence=0.8),
                acts, [Link(a.id, "END") for a in acts[:-1]])


def _slide_and_strip(qtbot):
    session = Session(merging_plan())
    slide, strip = PresentSummarySlide(session), SummaryStrip(session)
    for widget in (slide, strip):
        qtbot.addWidget(widget)
    return session, slide, strip


def _figure_rows(slide) -> list[tuple[str, str]]:
    return [(label, value) for label, value, role in slide.lines() if label and role in ("text", "probability")]


def test_a_current_simulation_leads_the_slide_as_it_leads_the_strip(qtbot):
    session, slide, strip = _slide_and_strip(qtbot)
    sim = simulate(session.plan, 3000, seed=8)
    session.set_simulation(sim)
    chance = sim.prob_by(session.analysis.deadline)[0]
    pert = session.analysis.probability_by_deadline()
    assert chance < pert - 0.2                      # the two methods disagree plainly here
    rows = _figure_rows(slide)
    assert [label for label, _ in rows] == [strip.texts()[f"{k}_caption"] for k in strip.FIELDS]
    assert [value for _, value in rows] == [strip.values[k].text() for k in strip.FIELDS]
    assert rows[1][1].startswith(percent(chance))    # the simulation's chance, before PERT's
    lines = slide.lines()
    odds_at = next(i for i, (label, _, _) in enumerate(lines) if label.startswith("Chance"))
    assert lines[odds_at + 1] == ("", f"PERT (single path): {percent(pert)}", "beside")
    labels = " ".join(label for label, _, _ in lines)
    assert labels.index("(simulation)") < len(labels) and "(PERT)" not in labels


def test_after_an_edit_the_slide_says_the_simulation_is_stale(qtbot):
    session, slide, strip = _slide_and_strip(qtbot)
    sim = simulate(session.plan, 3000, seed=8)
    session.set_simulation(sim)
    session.push(EditActivity("P0", name="Path zero"))
    note = [value for _, value, role in slide.lines() if role == "stale"]
    assert note == [strip.note.text()]
    assert "out of date" in note[0] and percent(sim.prob_by(11.0)[0]) in note[0]
    expected = headline(session.analysis, sim, stale=True)
    assert [v for _, v, role in slide.lines() if role in ("text", "probability")] == \
        [f.value for f in expected.figures()]
    session.load(merging_plan())
    assert not [1 for _, _, role in slide.lines() if role == "stale"]
    assert "No simulation yet" in slide.lines()[-1][1]


def test_the_slide_draws_the_headline_at_projector_size(qtbot):
    session, slide, _ = _slide_and_strip(qtbot)
    session.set_simulation(simulate(session.plan, 2000, seed=3))
    slide.resize(1024, 700)
    image = slide.grab().toImage()
    ink_rows = [y for y in range(image.height()) if any(image.pixelColor(x, y).lightness() < 128
                                                         for x in range(40, 600, 3))]
    assert ink_rows and ink_rows[-1] < image.height() - 4      # everything fits on the slide


def test_the_slide_carries_the_caution_on_odds(qtbot):
    from support.ui import present_at
    win = present_at(qtbot, Session(merging_plan()))
    assert win.current_title() == "Summary"
    assert "judgement" in win.caution.text() and win.caution.isVisible()
