"""The Odds view: nothing claimed for an empty plan; no chart-library auto-range button."""

from workbench.core.model import Plan
from workbench.ui.odds.view import EMPTY_PLAN, OddsView
from workbench.ui.session import Session
from support.ui import sample_plan


def test_an_empty_plan_shows_no_chance(qtbot):
    session = Session(sample_plan())
    view = OddsView(session)
    qtbot.addWidget(view)
    view.show()
    view.refresh()
    assert "Chance" in view.panel.headline.text()
    session.load(Plan())
    view.refresh()
    assert "100" not in view.panel.headline.text() and view.panel.headline.text() == ""
    assert view.panel.error.text() == EMPTY_PLAN and not view.panel.error.isHidden()


def test_no_auto_range_button_on_the_charts(qtbot):
    view = OddsView(Session(sample_plan()))
    qtbot.addWidget(view)
    view.show()
    for plot in (view.plot.getItem(0, 0), view.plot.getItem(1, 0)):
        assert plot.buttonsHidden and not plot.autoBtn.isVisible()
