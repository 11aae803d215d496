"""Before any simulation the Drivers slide says how to get one."""

from support.plans import small_plan
from workbench.reports.context import PackContext
from workbench.core.analysis import analyze
from workbench.ui.present.slides import NO_SIMULATION_HOW, paint_drivers_slide


class Canvas:
    def __init__(self):
        self.texts = []

    def setFont(self, *a):  # noqa: N802 (the canvas API's names)
        pass

    def drawCentredString(self, x, y, text):  # noqa: N802
        self.texts.append(text)


def test_the_drivers_slide_says_how_to_run_a_simulation():
    plan = small_plan()
    canvas = Canvas()
    paint_drivers_slide(canvas, PackContext(plan, analyze(plan), None, None, "a4"), 500, 330)
    assert canvas.texts[0] == "No simulation yet."
    assert canvas.texts[1] == NO_SIMULATION_HOW and "Run simulation" in NO_SIMULATION_HOW and "Esc" in NO_SIMULATION_HOW
