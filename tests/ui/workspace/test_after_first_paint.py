"""The window paints the plan in its table first and builds the charts just after, so a
launch is never a blank frame while the chart libraries load."""

from PySide6.QtCore import QEvent, QObject
from PySide6.QtWidgets import QWidget

from support.ui import ui_env, window  # noqa: F401 (fixtures)
from workbench.ui.workspace.after_paint import AfterFirstPaint


class PaintSpy(QObject):
    def __init__(self, window):
        super().__init__(window)
        self.window, self.views_at_first_paint = window, None

    def eventFilter(self, watched, event):
        if event.type() == QEvent.Type.Paint and self.views_at_first_paint is None:
            self.views_at_first_paint = set(self.window.built_views())
        return False


def test_table_is_painted_before_any_chart_is_built(window, qtbot):
    spy = PaintSpy(window)
    window.activities.table.viewport().installEventFilter(spy)
    window.show()
    qtbot.waitExposed(window)
    qtbot.waitUntil(lambda: {"Timeline", "Odds"} <= set(window.built_views()))
    assert spy.views_at_first_paint == set()
    assert "Network" not in window.built_views()       # behind a tab: still not built


def test_after_first_paint_runs_once_after_a_paint_or_the_time_limit(qtbot):
    shown, hidden = QWidget(), QWidget()
    qtbot.addWidget(shown)
    qtbot.addWidget(hidden)
    calls = []
    AfterFirstPaint(shown, lambda: calls.append("shown"))
    AfterFirstPaint(hidden, lambda: calls.append("hidden"))    # never painted: the time limit
    assert calls == []
    shown.show()
    qtbot.waitUntil(lambda: "shown" in calls)
    qtbot.waitUntil(lambda: "hidden" in calls, timeout=5000)
    shown.update()
    qtbot.wait(50)
    assert sorted(calls) == ["hidden", "shown"]
