"""The bundled demo opens as an untitled copy: Save asks where, the demo stays as shipped."""

from pathlib import Path

from workbench.core.commands import EditActivity
from workbench.resources import demo_path


def test_demo_opens_untitled_and_save_asks_where(window, ui_env, tmp_path):
    shipped = demo_path().read_bytes()
    assert window.files.open_path(str(demo_path()), ask=False)
    assert window.files.path is None
    assert window.files.display_name() == window.session.plan.settings.title
    window.session.push(EditActivity(window.session.plan.ids()[1], name="Changed in the meeting"))
    ui_env.replies["ask_save_path"] = str(tmp_path / "clinic.slw")
    assert window.files.save()
    assert "ask_save_path" in ui_env.names()
    assert window.files.path == str((tmp_path / "clinic.slw").resolve())
    assert demo_path().read_bytes() == shipped
    assert not Path(str(demo_path()) + ".bak").exists()
    assert str(demo_path().resolve()) not in window.files.recent_files()
