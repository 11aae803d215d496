"""The Checkup slide of Present mode: after the Drivers, the keeper's count, marks drawn without colour."""

from PySide6.QtGui import QColor

from workbench.core.demo import demo_plan
from workbench.ui.checkup.keeper import checkup_keeper
from workbench.ui.present.checkup_slide import PresentCheckupSlide
from workbench.ui.session import Session

from support.ui import present_at


def test_the_checkup_slide_follows_the_drivers_and_reads_in_grayscale(qtbot):
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


def test_at_1024_by_768_no_check_name_is_cut_short(qtbot, monkeypatch):
    """From the back of the room "Critical path len…" or "Baseline executi…" reads as
    nothing: every row's text fits whole (a long name a little smaller, CPLI and BEI by
    their published abbreviations)."""
    from PySide6.QtGui import QFont, QFontMetricsF

    drawn = []
    real = PresentCheckupSlide._line

    def record(p, box, text, px, bold, colour, *rest):
        font = QFont()
        font.setPixelSize(max(8, int(px)))
        font.setBold(bold)
        drawn.append((text, QFontMetricsF(font).horizontalAdvance(text) <= box.width(), px))
        real(p, box, text, px, bold, colour, *rest)

    monkeypatch.setattr(PresentCheckupSlide, "_line", staticmethod(record))
    session = Session(demo_plan())
    checkup_keeper(session, threaded=False)
    win = present_at(qtbot, session, 5)
    win.stack.currentWidget().grab()
    assert len(drawn) >= 3 * 18
    assert [text for text, fits, _ in drawn if not fits] == []
    shown = {text for text, _, _ in drawn}
    assert {"CPLI", "BEI", "Relationship types", "Odds disagreement"} <= shown
    assert min(px for _, _, px in drawn) >= 0.8 * max(px for _, _, px in drawn)
