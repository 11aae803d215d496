"""The least-total-cost label stays inside the cost chart when the optimum sits at an end
of the curve (a high indirect cost puts it at the shortest duration), at projector size."""

import dataclasses

import pytest
from PySide6.QtGui import QFontMetrics

from workbench.core.demo import demo_plan
from workbench.ui.session import Session
from workbench.ui.tradeoff.view import TradeoffView
from support.ui import shown


def _plan(indirect: float):
    plan = demo_plan()
    plan.settings = dataclasses.replace(plan.settings, indirect_cost=indirect)
    return plan


@pytest.mark.parametrize("indirect", [200_000.0, 0.0])      # optimum at the shortest / the longest duration
def test_the_optimum_label_is_inside_the_chart(qtbot, indirect):
    view = TradeoffView(Session(_plan(indirect)))
    qtbot.addWidget(view)
    view.resize(570, 600)                                     # about the dock's width at 1024×768
    view.show()
    qtbot.waitExposed(view)
    qtbot.waitUntil(lambda: view.result is not None, timeout=30000)
    try:
        qtbot.wait(50)
        plot = view.curve_plot.getPlotItem()
        labels = [i for i in plot.items if hasattr(i, "textItem") and i.textItem.toPlainText().startswith("optimum")]
        assert len(labels) == 1
        inside = plot.vb.sceneBoundingRect()
        shown = labels[0].textItem.sceneBoundingRect()
        assert inside.left() <= shown.left() and shown.right() <= inside.right(), (inside, shown)
    finally:
        view.runner.stop()
        view.runner.wait()


@pytest.mark.parametrize("width", [570, None])          # a dock at 1024×768; the narrowest side-by-side view
def test_the_hint_to_find_confidence_plans_wraps_inside_the_chance_chart(qtbot, width):
    view = shown(qtbot, TradeoffView(Session(_plan(2400.0))), (570, 600))
    qtbot.waitUntil(lambda: view.result is not None, timeout=30000)
    try:
        if width is None:
            view.resize(view.arrangement.threshold, 600)
            qtbot.waitUntil(lambda: not view.arrangement.narrow)
        else:
            view.arrangement.show_page("Cost vs chance")
        qtbot.waitUntil(lambda: view.chance_plot.isVisible())
        qtbot.wait(50)
        plot = view.chance_plot.getPlotItem()
        hints = [i for i in plot.items if hasattr(i, "textItem") and "confidence plans" in i.textItem.toPlainText()]
        assert len(hints) == 1
        inside, hint = plot.vb.sceneBoundingRect(), hints[0].textItem.sceneBoundingRect()
        assert inside.left() <= hint.left() and hint.right() <= inside.right(), (inside, hint)
        line = QFontMetrics(hints[0].textItem.font()).lineSpacing()
        assert hint.height() > 1.5 * line                          # on more than one line: wrapped
    finally:
        view.runner.stop()
        view.runner.wait()
