"""Date fields take a whole typed date (ISO or the display format), year included."""

import datetime as dt

from PySide6.QtCore import QDate, Qt

from support.ui import sample_plan
from workbench.ui.workspace.date_field import DateField
from workbench.ui.workspace.settings_dialog import SettingsDialog


def type_into(qtbot, field: DateField, text: str) -> None:
    field.edit.setFocus()
    field.edit.selectAll()
    qtbot.keyClicks(field.edit, text)
    qtbot.keyClick(field.edit, Qt.Key.Key_Return)


def test_select_all_and_type_an_iso_date_keeps_its_year(qtbot):
    dialog = SettingsDialog(sample_plan().settings)       # start 02 Mar 2026
    qtbot.addWidget(dialog)
    dialog.show()
    type_into(qtbot, dialog.start, "2027-03-12")
    assert dialog.result_settings().start == dt.date(2027, 3, 12)
    type_into(qtbot, dialog.deadline, "30 Sep 2027")
    assert dialog.result_settings().deadline == dt.date(2027, 9, 30)


def test_the_display_format_is_shown_and_read_back(qtbot):
    field = DateField(dt.date(2026, 3, 2))
    qtbot.addWidget(field)
    assert field.edit.text() == "Mon 2 Mar 2026"       # the one date format (core.formatting)
    with qtbot.waitSignal(field.dateChanged) as changed:
        type_into(qtbot, field, "Fri 12 Mar 2027")
    assert changed.args == [QDate(2027, 3, 12)]
    assert field.day() == dt.date(2027, 3, 12) and field.edit.text() == "Fri 12 Mar 2027"


def test_text_that_is_not_a_date_is_named_and_the_last_date_kept(qtbot):
    field = DateField(dt.date(2026, 3, 2))
    qtbot.addWidget(field)
    type_into(qtbot, field, "2027-02-30")
    assert "February 2027 has 28 days" in field.problem()
    assert field.day() == dt.date(2026, 3, 2)
    assert "February 2027 has 28 days" in field.edit.toolTip()
    type_into(qtbot, field, "2027-02-28")
    assert field.problem() == "" and field.day() == dt.date(2027, 2, 28)


def test_settings_refuse_a_bad_date_naming_the_field(qtbot, ui_env):
    seen = []
    ui_env.replies["show_error"] = lambda parent, title, message: seen.append(message)
    dialog = SettingsDialog(sample_plan().settings)
    qtbot.addWidget(dialog)
    dialog.show()
    dialog.start.edit.setText("31 Apr 2027")
    dialog._accept()
    assert seen and seen[0].startswith("Start:") and "April 2027 has 30 days" in seen[0]
    assert dialog.result() == 0


def test_working_time_years_are_labelled_and_holidays_named(qtbot):
    from PySide6.QtWidgets import QLabel
    from workbench.ui.workspace.holiday_list import HolidayList
    holidays = HolidayList([dt.date(2027, 12, 25), dt.date(2027, 3, 10)], "DE", 2027)
    qtbot.addWidget(holidays)
    buddies = {label.buddy(): label.text() for label in holidays.findChildren(QLabel) if label.buddy()}
    assert buddies[holidays.first] == "From year" and buddies[holidays.last] == "to year"
    texts = [holidays.list.item(i).text() for i in range(holidays.list.count())]
    assert texts[0] == "Wed 10 Mar 2027"
    assert texts[1].startswith("Sat 25 Dec 2027 — ") and len(texts[1]) > len("Sat 25 Dec 2027 — ")
