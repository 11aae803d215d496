"""The Odds panel's caution sits right under the headline's chances, so a 1024×768 dock
shows it without scrolling."""

from support.ui import sample_plan, shown
from workbench.ui.odds.view import OddsView
from workbench.ui.session import Session


def test_the_caution_follows_the_headline_and_is_in_sight_in_a_small_dock(qtbot):
    view = shown(qtbot, OddsView(Session(sample_plan())), (420, 340))
    view.refresh()
    qtbot.wait(50)
    panel = view.panel
    layout = panel.layout()
    order = [layout.itemAt(k).widget() for k in range(layout.count())]
    assert order.index(panel.caution) == order.index(panel.headline) + 1
    scroller = panel.parentWidget().parentWidget()          # the side panel's scroll area
    top = panel.caution.mapTo(panel, panel.caution.rect().topLeft()).y()
    assert top < scroller.viewport().height(), (top, scroller.viewport().height())
