"""In a narrow Drivers dock the value beyond the longest bar ("+0.8") stays inside the chart."""

import pytest

from workbench.core.demo import demo_plan
from workbench.core.montecarlo import simulate
from workbench.figures import drivers as fdr
from workbench.ui.drivers.chart import DriversChart
from support.ui import shown


@pytest.mark.parametrize("width", [260, 360, 900])
def test_values_stay_inside_the_plot(qtbot, width):
    plan = demo_plan()
    sim = simulate(plan, 400, seed=6)
    chart = shown(qtbot, DriversChart("Sensitivity", "rank correlation", True), (width, 320))
    chart.set_bars(fdr.sensitivity_bars(sim, plan, 8))
    qtbot.wait(30)
    box = chart.getPlotItem().vb.sceneBoundingRect()
    for r, text in zip(chart.rects, chart.texts):
        if r.bar.is_folded and width < 360:
            continue                            # "each |r| ≤ 0.12" is longer than a 260-px plot allows
        rect = text.mapRectToScene(text.boundingRect())
        assert box.left() - 1 <= rect.left() and rect.right() <= box.right() + 1, text.textItem.toPlainText()
