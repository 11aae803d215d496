"""Any single chart can be copied as a picture (Ctrl+C in its dock), exported and printed."""

from PySide6.QtCore import Qt
from PySide6.QtGui import QGuiApplication, QImage
from PySide6.QtWidgets import QApplication

from workbench.ui.workspace import chart_tools


def shown(window, qtbot, title):
    window.show()
    qtbot.waitExposed(window)
    window.docks[title].raise_()
    view = window.view(title)
    view.setFocus()
    return view


def test_ctrl_c_in_the_odds_dock_copies_the_chart(window, qtbot):
    view = shown(window, qtbot, "Odds")
    QGuiApplication.clipboard().clear()
    holder = window.docks["Odds"].widget().widget()
    qtbot.mouseClick(holder, Qt.MouseButton.LeftButton)    # a click in the dock, as a planner does
    qtbot.waitUntil(lambda: QApplication.focusWidget() is not None
                    and window.docks["Odds"].isAncestorOf(QApplication.focusWidget()))
    qtbot.keyClick(QApplication.focusWidget(), Qt.Key.Key_C, Qt.KeyboardModifier.ControlModifier)
    image = QGuiApplication.clipboard().image()
    assert not image.isNull()
    assert (image.width(), image.height()) == (view.width(), view.height())


def test_export_the_drivers_chart(window, ui_env, qtbot, tmp_path):
    shown(window, qtbot, "Drivers")
    window.last_chart = "Drivers"
    ui_env.replies["ask_save_path"] = lambda parent, title, suggested, filters: (
        ui_env.replies.update(seen=(title, suggested)) or str(tmp_path / "drivers"))
    path = chart_tools.export_chart(window)
    assert path == str(tmp_path / "drivers.png")
    assert "Drivers" in ui_env.replies["seen"][0]
    assert not QImage(path).isNull()


def test_a_chart_prints_onto_one_page(window, ui_env, qtbot, tmp_path):
    from PySide6.QtPrintSupport import QPrinter
    shown(window, qtbot, "Odds")
    window.last_chart = "Odds"
    printer = QPrinter(QPrinter.PrinterMode.HighResolution)
    printer.setOutputFormat(QPrinter.OutputFormat.PdfFormat)
    printer.setOutputFileName(str(tmp_path / "odds.pdf"))
    ui_env.replies["ask_printer"] = printer
    window.menu_actions["print_chart"].trigger()
    data = (tmp_path / "odds.pdf").read_bytes()
    assert data.startswith(b"%PDF") and data.count(b"/Type /Page") - data.count(b"/Type /Pages") == 1
