"""Importing a table into an open plan: a new plan by default, or the open plan's settings
kept, with the preview saying which."""


from workbench.ui.workspace.import_dialog import KEEP, NEW, ImportDialog
from workbench.ui.workspace.table_transfer import kept_settings

TABLE = "id,name,duration,predecessors\nA,Dig,2,\nB,Pour,3,A\n"


def test_import_as_a_new_plan_leaves_nothing_of_the_old_one(window, ui_env, tmp_path):
    table = tmp_path / "warehouse.csv"
    table.write_text(TABLE, encoding="utf-8")
    seen = {}
    ui_env.replies["preview_import"] = lambda parent, path, plan, problems, kept: seen.update(kept=kept) or NEW
    assert window.files.open_path(str(table))
    plan = window.session.plan
    assert plan.ids() == ["A", "B"]
    assert plan.settings.title == "warehouse"
    assert plan.settings.deadline is None          # not the old plan's 30 Apr 2026
    assert window.files.path is None and window.session.undo_stack.count() == 0
    assert "30 Apr 2026" in seen["kept"] and "Office refit" in seen["kept"]


def test_import_as_new_asks_about_unsaved_changes_first(window, ui_env, tmp_path):
    from workbench.core.commands import EditActivity
    window.session.push(EditActivity("R", name="Survey twice"))
    table = tmp_path / "warehouse.csv"
    table.write_text(TABLE, encoding="utf-8")
    ui_env.replies["preview_import"] = NEW
    ui_env.replies["ask_unsaved"] = "cancel"
    assert not window.files.open_path(str(table))
    assert "R" in window.session.plan.ids()


def test_the_preview_says_which_settings_are_kept_and_starts_new_by_default(window, qtbot, tmp_path):
    from workbench.io.tabular import read_table
    table = tmp_path / "warehouse.csv"
    table.write_text(TABLE, encoding="utf-8")
    kept = kept_settings(window.session.plan)
    assert kept.startswith("title “Office refit”; start Mon 2 Mar 2026; deadline Thu 30 Apr 2026")
    assert "Mon, Tue, Wed, Thu, Fri" in kept
    dialog = ImportDialog(str(table), read_table(str(table)), [], None, kept)
    qtbot.addWidget(dialog)
    assert dialog.choice == NEW and dialog.new_button.isChecked()
    assert "warehouse" in dialog.new_button.text()
    assert dialog.kept.text() == kept and "keep its settings" in dialog.keep_button.text()
    dialog.show()
    assert dialog.width() <= 1000     # fits a 1024-wide projector
    dialog.keep_button.setChecked(True)
    assert dialog.choice == KEEP
