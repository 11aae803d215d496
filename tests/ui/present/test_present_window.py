"""Present mode: clicker keys step through the slides, Esc returns to the window, the
odds slide's date marker can be dragged, slides follow plan edits. Offscreen Qt."""

from __future__ import annotations

import numpy as np
import pytest
from PySide6.QtCore import QPoint, Qt
from PySide6.QtGui import QColor
from PySide6.QtWidgets import QWidget

from support.plans import footbridge_plan
from support.ui import shown, present_at
from workbench.core.commands import EditActivity
from workbench.figures import style
from workbench.figures.headline import percent
from workbench.ui.present.odds_slide import PresentOddsSlide
from workbench.core.formatting import format_date
from workbench.ui.present.summary_slide import summary_lines
from workbench.ui.present.chart_slide import session_context
from workbench.ui.present.window import open_present
from workbench.ui.session import Session

TITLES = ["Summary", "Timeline", "Network", "Odds", "Drivers", "Checkup"]


@pytest.fixture
def window(qtbot):
    return present_at(qtbot, Session(footbridge_plan()))


def _titles(win):
    return [title for title, _ in win.slides]


def test_slides_in_order(window):
    assert _titles(window) == TITLES
    assert window.current_index() == 0


@pytest.mark.parametrize("forward, back", [(Qt.Key.Key_PageDown, Qt.Key.Key_PageUp),
                                           (Qt.Key.Key_Right, Qt.Key.Key_Left),
                                           (Qt.Key.Key_Space, Qt.Key.Key_Backspace),
                                           (Qt.Key.Key_Down, Qt.Key.Key_Up)])
def test_clicker_keys_step_and_stop_at_the_ends(window, qtbot, forward, back):
    seen = []
    for _ in range(6):
        qtbot.keyClick(window, forward)
        seen.append(window.current_title())
    assert seen == TITLES[1:] + ["Checkup"]
    qtbot.keyClick(window, back)
    assert window.current_title() == "Drivers"
    qtbot.keyClick(window, Qt.Key.Key_Home)
    assert window.current_index() == 0
    qtbot.keyClick(window, Qt.Key.Key_End)
    assert window.current_index() == 5


def test_keys_work_while_a_chart_inside_has_the_focus(window, qtbot):
    window.go(1)
    inner = window.stack.currentWidget().findChildren(QWidget) or [window.stack.currentWidget()]
    qtbot.keyClick(inner[-1], Qt.Key.Key_PageDown)
    assert window.current_title() == "Network"


def test_escape_returns_to_the_window(qtbot):
    main = QWidget()
    qtbot.addWidget(main)
    session = Session(footbridge_plan())
    present = open_present(session, main)
    qtbot.waitExposed(present)
    assert present.windowState() & Qt.WindowState.WindowFullScreen
    with qtbot.waitSignal(present.closed, timeout=2000):
        qtbot.keyClick(present, Qt.Key.Key_Escape)
    assert not present.isVisible()
    assert main.isVisible()


def test_summary_slide_shows_screen_probability_and_follows_edits(window, qtbot):
    session = window.session
    ctx = session_context(session)
    values = [v for _, v, _ in summary_lines(ctx)]
    # worded as the summary strip words it (workbench.figures.headline)
    assert f"{percent(session.analysis.probability_by_deadline())} by " in " ".join(values)
    before = session.analysis.finish_date
    session.push(EditActivity("T2", most_likely=40.0, pessimistic=60.0))
    after = [v for _, v, _ in summary_lines(session_context(session))]
    assert session.analysis.finish_date > before
    assert format_date(session.analysis.finish_date) in after


def _orange_pixels(widget) -> int:
    image = widget.grab().toImage()
    target = QColor(style.PROBABILITY)
    count = 0
    for y in range(0, image.height(), 4):
        for x in range(0, image.width(), 4):
            c = image.pixelColor(x, y)
            count += abs(c.red() - target.red()) + abs(c.green() - target.green()) + abs(c.blue() - target.blue()) < 30
    return count


@pytest.fixture
def odds_slide(qtbot):
    session = Session(footbridge_plan())
    slide = shown(qtbot, PresentOddsSlide(session), (1024, 680))
    return slide


def test_window_odds_slide_keeps_a_draggable_marker(window):
    window.go(3)
    slide = window.stack.currentWidget()
    assert isinstance(slide, PresentOddsSlide)
    before = slide.probability()
    slide.move_marker_to(slide.width() * 0.2)
    assert slide.probability() != before          # the marker moved and the odds followed
    assert window.caution.isVisible() and "judgement" in window.caution.text()
    window.go(2)                                   # the Network slide shows no odds
    assert not window.caution.isVisible()


def test_odds_marker_drags_and_the_probability_follows(odds_slide, qtbot):
    slide = odds_slide
    pert = slide.session.analysis.pert
    qtbot.mousePress(slide, Qt.MouseButton.LeftButton, pos=QPoint(int(slide.width() * 0.35), slide.height() // 2))
    early, early_p, early_orange = slide.d1, slide.probability(), _orange_pixels(slide)
    qtbot.mouseMove(slide, QPoint(int(slide.width() * 0.8), slide.height() // 2))
    qtbot.mouseRelease(slide, Qt.MouseButton.LeftButton, pos=QPoint(int(slide.width() * 0.8), slide.height() // 2))
    late, late_p, late_orange = slide.d1, slide.probability(), _orange_pixels(slide)
    assert late > early
    assert early_p == pytest.approx(pert.prob_by(early)) and late_p == pytest.approx(pert.prob_by(late))
    assert late_p > early_p
    assert late_orange > early_orange > 0        # the shaded area grows with the date


def test_odds_marker_steps_by_working_days(odds_slide, qtbot):
    slide = odds_slide
    start = slide.question(session_context(slide.session)).d1
    qtbot.keyClick(slide, Qt.Key.Key_BracketRight)
    qtbot.keyClick(slide, Qt.Key.Key_BracketRight)
    assert slide.d1 == pytest.approx(start + 2)


def test_odds_marker_resets_when_the_plan_changes(odds_slide, qtbot):
    slide = odds_slide
    qtbot.keyClick(slide, Qt.Key.Key_BracketRight)
    assert slide.d1 is not None
    slide.session.push(EditActivity("W3", most_likely=13.0))
    assert slide.d1 is None


def test_network_slide_shows_critical_nodes_in_the_critical_colour(window):
    window.go(2)
    image = window.stack.currentWidget().grab().toImage()
    target = QColor(style.CRITICAL)
    pixels = np.array([[image.pixelColor(x, y).getRgb()[:3] for x in range(0, image.width(), 3)]
                       for y in range(0, image.height(), 3)])
    close = np.abs(pixels - np.array([target.red(), target.green(), target.blue()])).sum(axis=2) < 30
    assert close.sum() > 50


def test_unschedulable_plan_shows_a_message_not_a_crash(qtbot):
    from workbench.core.model import Plan, Settings
    win = present_at(qtbot, Session(Plan(Settings(title="Empty"))))
    for _ in range(win.slide_count()):
        win.grab()
        win.next_slide()
    assert win.current_title() == "Checkup"
