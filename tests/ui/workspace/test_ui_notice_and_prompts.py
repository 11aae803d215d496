"""The 'Not applied' bar goes once the plan is saved; question boxes are wide enough for
their titles."""

from workbench.ui import prompts


def test_not_applied_bar_is_cleared_by_saving(window, ui_env, tmp_path):
    window.session.refuse("activity R: most likely 9 is above pessimistic 6")
    assert window.notice.text().startswith("Not applied")
    ui_env.replies["ask_save_path"] = str(tmp_path / "refit.slw")
    assert window.files.save()
    assert window.notice.text() == ""


def test_unsaved_changes_box_fits_its_title(qtbot):
    box = prompts.message_box(None, "Unsaved changes", "Save the changes to refit.slw?",
                              detail="Changes you don't save are lost.")
    qtbot.addWidget(box)
    box.show()
    title = box.fontMetrics().horizontalAdvance("Unsaved changes")
    assert box.width() >= title + prompts.TITLE_ROOM
