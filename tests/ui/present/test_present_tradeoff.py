"""The Trade-off slide of Present mode: shown for a plan with cost data and a deadline,
worked out off the window thread as the pack works it out (same options, same figures),
redone after an edit, and left out for a plan without cost data."""

from PySide6.QtGui import QColor

from support.ui import present_at, sample_plan
from workbench.core.commands import EditActivity
from workbench.core.demo import demo_plan
from workbench.reports.context import PackContext
from workbench.reports.tradeoff_pages import compute
from workbench.ui.present.tradeoff_slide import PresentTradeoffSlide, option_lines
from workbench.ui.session import Session


def tradeoff_slide(qtbot, session):
    win = present_at(qtbot, session)
    win.go(win.slide_count() - 1)                 # the last slide
    slide = win.stack.currentWidget()
    qtbot.waitUntil(lambda: slide.result is not None, timeout=60_000)
    return win, slide


def test_the_slide_shows_the_packs_options_for_the_demo(qtbot):
    session = Session(demo_plan())
    win, slide = tradeoff_slide(qtbot, session)
    assert win.slide_count() == 8 and win.current_title() == "Trade-off"
    assert isinstance(slide, PresentTradeoffSlide)
    pack = compute(PackContext(session.plan, session.analysis, session.simulation, None, "a4"))
    assert option_lines(slide.result) == option_lines(pack)          # same seed, same scenarios
    lines = option_lines(slide.result)
    assert lines[0].startswith("crash the mean schedule to the deadline: ")
    assert [line.split(":")[0] for line in lines[1:]] == ["50 % plan", "80 % plan", "90 % plan"]
    image = slide.grab().toImage()
    orange = sum(1 for x in range(0, image.width(), 2) for y in range(0, image.height(), 2)
                 if QColor(image.pixel(x, y)).name() in ("#d55e00", "#e69f00"))
    assert orange > 200                         # the total-cost curve and the chance points are drawn


def test_an_edit_works_the_trade_off_out_again(qtbot):
    session = Session(demo_plan())
    _, slide = tradeoff_slide(qtbot, session)
    before = slide.result
    act = next(a for a in session.plan.activities if a.cost is not None and a.crash_cost is not None)
    assert session.push(EditActivity(act.id, cost=act.cost + 50_000, crash_cost=act.crash_cost + 50_000))
    qtbot.waitUntil(lambda: slide.result is not before, timeout=60_000)
    assert slide.result.curve.points[-1].direct_cost == before.curve.points[-1].direct_cost + 50_000


def test_no_slide_without_cost_data():
    session = Session(sample_plan())
    from workbench.ui.present.slides import build_slides
    slides = build_slides(session)
    assert "Trade-off" not in [title for title, _ in slides] and len(slides) == 6
    for _, widget in slides:
        widget.deleteLater()
