"""The Checkup slide of Present mode: last, the keeper's count, marks drawn without colour."""

from PySide6.QtGui import QColor

from workbench.core.demo import demo_plan
from workbench.ui.checkup.keeper import checkup_keeper
from workbench.ui.present.checkup_slide import PresentCheckupSlide
from workbench.ui.session import Session

from support.ui import present_at


def test_the_checkup_slide_comes_last_and_reads_in_grayscale(qtbot):
    session = Session(demo_plan())
    keeper = checkup_keeper(session, threaded=False)
    win = present_at(qtbot, session, 5)
    slide = win.stack.currentWidget()
    assert win.current_title() == "Checkup" and isinstance(slide, PresentCheckupSlide)
    image = slide.grab().toImage()
    assert keeper.checkup.failed                       # the demo fails some checks
    # each failing row starts with a black rule (a shape, not a colour): find one on the left
    column = [QColor(image.pixel(42, y)) for y in range(image.height())]
    dark = sum(1 for c in column if c.lightness() < 40)
    assert dark > 150, dark                            # five failing rows on the left, ~44 px each
