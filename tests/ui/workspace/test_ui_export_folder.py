"""Export dialogs open in the open plan's folder, not wherever Slackline was started."""

from pathlib import Path

from support.ui import sample_plan
from workbench.io.planfile import save_plan


def test_exports_start_in_the_plans_folder(window, ui_env, tmp_path, monkeypatch):
    folder = tmp_path / "jobs" / "clinic"
    folder.mkdir(parents=True)
    save_plan(sample_plan(), folder / "refit.slw")
    assert window.files.open_path(str(folder / "refit.slw"))
    asked = []
    ui_env.replies["ask_save_path"] = lambda parent, title, suggested, filters: asked.append(suggested)
    window.menu_actions["export"].trigger()
    window.menu_actions["export_pack"].trigger()
    assert [Path(p).parent for p in asked] == [folder, folder]
    assert Path(asked[0]).name == "Office refit.csv"
    from PySide6.QtWidgets import QFileDialog
    seen = []
    monkeypatch.setattr(QFileDialog, "getSaveFileName", staticmethod(lambda *a: seen.append(a[2]) or ("", "")))
    window.view("Network").export_dialog()
    from workbench.ui.timeline.output import ask_and_export
    ask_and_export(window.view("Timeline"), "png")
    assert [Path(p).parent for p in seen] == [folder, folder]
