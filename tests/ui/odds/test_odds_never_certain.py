"""The Odds view's headline says a far-off deadline's chance as the summary strip does:
"> 99.9 %", never "100.0 %" (an estimate is never certain)."""

import datetime as dt

from support.ui import sample_plan
from workbench.core.montecarlo import simulate
from workbench.ui.odds.view import OddsView
from workbench.ui.session import Session


def test_a_far_deadline_reads_above_99_9_and_never_100(qtbot):
    plan = sample_plan()
    plan.settings.deadline = dt.date(2027, 12, 31)           # months after any possible finish
    session = Session(plan)
    session.set_simulation(simulate(plan, iterations=500, seed=3))
    view = OddsView(session)
    qtbot.addWidget(view)
    view.resize(1200, 700)
    view.show()
    view.refresh()
    text = view.panel.headline.text()
    assert text.count("&gt; 99.9 %") + text.count("> 99.9 %") == 2, text      # PERT and the simulation
    assert "100.0 %" not in text and "100 %" not in text
