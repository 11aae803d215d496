"""The Checkup dock at the sizes a 1024×768 projector gives it (about 410×330 on the right,
580×330 on the left): nothing scrolls sideways, the headline, *Thresholds…* and the
caution lie inside the view, the table's columns share its width and long cells are said
shorter with the whole text in their tooltips; the real window at 1024×768 shows no
sideways scroll bar in the Checkup dock."""

from pathlib import Path

import pytest
from PySide6.QtCore import QRect, Qt
from PySide6.QtGui import QFont, QFontMetrics
from PySide6.QtWidgets import QLabel, QStyleOptionViewItem

from workbench.core.demo import demo_plan
from workbench.ui.checkup.fitted_text import ELLIPSIS, fitted
from workbench.ui.checkup.view import CheckupView
from workbench.ui.session import Session

from support.dock_fit import run_window
from support.ui import in_dock_frame

DEMO = Path(__file__).resolve().parents[3] / "resources" / "demo.slw"


def in_a_dock(qtbot, size):
    """The demo's Checkup view in the window's dock frame (a scroller), at ``size``."""
    view = CheckupView(Session(demo_plan()))
    host, area = in_dock_frame(qtbot, view, size)
    qtbot.waitUntil(lambda: view.width() > 0 and view.table.viewport().width() > 0)
    qtbot.wait(20)
    view.host = host                 # kept alive with the view (qtbot holds it weakly)
    return view, area


def widen(view, qtbot):
    """The dock made wide; back once the layouts have settled (they settle in the event loop)."""
    view.window().resize(1400, 700)
    qtbot.waitUntil(lambda: view.width() > 1300 and view.table.viewport().width() > 1300)
    qtbot.wait(20)


def _inside(view, widget) -> bool:
    rect = QRect(widget.mapTo(view, widget.rect().topLeft()), widget.size())
    return view.rect().contains(rect)


def _text_fits(label: QLabel) -> bool:
    """The label shows its whole text: on one line, or wrapped in the height it has."""
    one_line = label.fontMetrics().horizontalAdvance(label.text()) <= label.contentsRect().width()
    return one_line or (label.wordWrap() and label.heightForWidth(label.width()) <= label.height())


@pytest.mark.parametrize("size", [(320, 330), (410, 330), (580, 330)], ids=["320x330", "410x330", "580x330"])
def test_nothing_scrolls_sideways_and_nothing_is_cut(qtbot, size):
    view, area = in_a_dock(qtbot, size)
    view.pick(next(r for r, c in enumerate(view.model.checks) if c.id == "leads"))    # details shown
    qtbot.waitUntil(lambda: view.detail.isVisible() and view.detail.height() >= view.detail.heightForWidth(
        view.detail.width()))
    assert view.headline.text().startswith("Checkup: ") and "not applicable" in view.headline.text()
    assert view.minimumSizeHint().width() <= area.viewport().width()
    assert area.horizontalScrollBar().maximum() == 0
    assert view.width() <= area.viewport().width()
    for widget in (view.headline, view.thresholds, view.standard, view.table, view.caution):
        assert widget.isVisible() and _inside(view, widget), widget
    for label in (view.headline, view.standard, view.caution):
        assert _text_fits(label), label.text()
    assert view.thresholds.width() >= view.thresholds.sizeHint().width()       # "Thresholds…" whole
    header = view.table.horizontalHeader()
    assert header.length() <= view.table.viewport().width()
    parts = [view.headline, view.standard, view.thresholds, view.table, view.detail, view.caution]
    for i, a in enumerate(parts):                       # stacked, never drawn over one another
        for b in parts[i + 1:]:
            assert not a.geometry().intersects(b.geometry()), (a, b)
    assert view.table.height() >= view.table.rows_height()          # a few rows always show


def test_a_narrow_dock_puts_the_button_under_the_headline_a_wide_one_beside_it(qtbot):
    view, _ = in_a_dock(qtbot, (410, 330))
    head, button = view.headline.geometry(), view.thresholds.geometry()
    assert button.top() >= head.bottom() and not head.intersects(button)
    assert not view.standard.geometry().intersects(button)
    widen(view, qtbot)
    head, button = view.headline.geometry(), view.thresholds.geometry()
    assert button.left() > head.right() and button.top() < head.bottom()      # one row, as before
    assert view.standard.geometry().top() >= max(head.bottom(), button.bottom())


def _drawn(view, row: int, column: int) -> str:
    """The wording the table draws in a cell, at the cell's present width."""
    table = view.table
    index = view.model.index(row, column)
    option = QStyleOptionViewItem()
    option.initFrom(table)
    option.rect = table.visualRect(index)
    option.widget = table
    option.font = table.font()
    option.fontMetrics = table.fontMetrics()
    return table.itemDelegate().fitted_option(option, index).text


def test_narrow_cells_are_said_shorter_and_the_tooltip_has_them_whole(qtbot):
    view, _ = in_a_dock(qtbot, (410, 330))
    model = view.model
    row = next(r for r, c in enumerate(model.checks) if c.id == "link_types")
    whole = model.checks[row].value_text
    assert whole.startswith("85.5 % (")                                   # the demo's figure
    assert _drawn(view, row, 2) == f"85.5 % {ELLIPSIS}"
    assert model.index(row, 2).data(Qt.ItemDataRole.ToolTipRole).splitlines()[0] == whole
    cpli = next(r for r, c in enumerate(model.checks) if c.id == "cpli")
    assert _drawn(view, cpli, 1) == "CPLI"
    assert model.index(cpli, 1).data(Qt.ItemDataRole.ToolTipRole).splitlines()[0] == model.checks[cpli].name
    for r, check in enumerate(model.checks):
        tip = model.index(r, 3).data(Qt.ItemDataRole.ToolTipRole)
        assert tip.splitlines()[0] == f"Threshold: {check.threshold}"
    logic = next(r for r, c in enumerate(model.checks) if c.id == "missing_logic")
    widen(view, qtbot)
    assert _drawn(view, row, 2) == whole and _drawn(view, logic, 3) == model.checks[logic].threshold


def test_fitted_keeps_the_longest_wording_that_fits():
    metrics = QFontMetrics(QFont())
    figure = "14.5 % (9 of 62 links)"
    assert fitted(figure, 2, metrics.horizontalAdvance(figure), metrics) == figure
    short = fitted(figure, 2, metrics.horizontalAdvance(figure) - 1, metrics)
    assert short == f"14.5 % {ELLIPSIS}"
    tiny = fitted(figure, 2, metrics.horizontalAdvance("14"), metrics)
    assert tiny.endswith(ELLIPSIS) and metrics.horizontalAdvance(tiny) <= metrics.horizontalAdvance("14")
    name = "Relationship types"                     # no short form: cut at the right
    cut = fitted(name, 1, metrics.horizontalAdvance("Relation"), metrics)
    assert cut.startswith("Rel") and cut.endswith(ELLIPSIS)
    assert fitted("Baseline execution index (BEI)", 1, metrics.horizontalAdvance("BEI") + 2, metrics) == "BEI"
    assert fitted("not applicable", 2, metrics.horizontalAdvance("not appl"), metrics).endswith(ELLIPSIS)


def test_the_window_at_1024x768_shows_no_sideways_scroll_bar_in_the_checkup_dock(tmp_path):
    seen = run_window(tmp_path, 1024, 768, "Checkup")
    assert seen["window"][0] <= 1024 and 380 <= seen["dock"][0] <= 460      # the dock as the planner saw it
    assert seen["headline"].startswith("Checkup: 6 of 12 pass")              # the demo's checkup is shown
    assert not seen["sideways"]
    assert seen["min_width"] <= seen["viewport"][0]
    assert all(seen["inside"].values()), seen["inside"]
    assert seen["table_fits"]


def test_the_window_squeezed_onto_a_small_screen_still_needs_no_sideways_scrolling(window, qtbot):
    """The test screen is 800 pixels wide: the Checkup dock gets about 330 of them."""
    window.open_path(str(DEMO))
    window.show()
    qtbot.waitExposed(window)
    window.show_checkup()
    dock = window.docks["Checkup"]
    area = dock.widget()
    qtbot.waitUntil(lambda: window.view("Checkup").isVisible())
    view = window.view("Checkup")
    qtbot.waitUntil(lambda: "6 of" in view.headline.text())
    qtbot.wait(50)
    assert dock.width() < 400
    assert not area.horizontalScrollBar().isVisible() and area.horizontalScrollBar().maximum() == 0
    for widget in (view.headline, view.thresholds, view.caution):
        assert _inside(view, widget)
    assert view.table.horizontalHeader().length() <= view.table.viewport().width()
