"""File ▸ Export Approval Pack from the window: the pack matches the screen, progress can
cancel without touching an earlier pack, bad cases are named, the PDF is opened."""

import re

import pytest
from pypdf import PdfReader

from support.ui import sample_plan, ui_env, window  # noqa: F401 (fixtures)
from workbench.core.montecarlo import simulate
from workbench.figures.odds import format_probability
from workbench.ui.workspace import pack_export


def _text(path) -> str:
    reader = PdfReader(str(path))
    return re.sub(r"\s+", " ", " ".join(page.extract_text() or "" for page in reader.pages))


def test_the_pack_uses_the_simulation_on_screen_and_opens(window, ui_env, tmp_path):
    target = tmp_path / "refit pack"                       # no suffix: .pdf is added
    ui_env.replies.update({"ask_save_path": str(target), "open_externally": True})
    result = simulate(window.session.plan, 800, seed=11)
    window.session.set_simulation(result)
    window.menu_actions["export_pack"].trigger()
    written = tmp_path / "refit pack.pdf"
    assert written.is_file()
    assert ("open_externally", (window, str(written))) in ui_env.asked
    text = _text(written)
    assert "seed 11" in text
    by_deadline = window.session.analysis.deadline
    assert format_probability(float((result.finish <= by_deadline + 1e-9).mean())) in text
    assert "Approval pack written" in window.statusBar().currentMessage()


def test_without_a_simulation_the_odds_views_seed_and_iterations_are_used(window, ui_env, tmp_path, monkeypatch):
    ui_env.replies.update({"ask_save_path": str(tmp_path / "p.pdf"), "open_externally": True})
    monkeypatch.setattr(pack_export, "run_settings", lambda w: (400, 77))
    assert window.session.simulation is None
    assert pack_export.export_pack(window) == str(tmp_path / "p.pdf")
    assert "seed 77" in _text(tmp_path / "p.pdf")


def test_the_odds_views_controls_give_the_run_settings(window):
    view = window.view("Odds")
    view.controls.iterations.setValue(2500)
    view.controls.seed.setValue(31)
    assert pack_export.run_settings(window) == (2500, 31)


def test_cancel_writes_nothing_and_keeps_an_earlier_pack(window, ui_env, tmp_path, monkeypatch):
    folder = tmp_path / "packs"
    folder.mkdir()
    earlier = folder / "pack.pdf"
    earlier.write_bytes(b"%PDF-1.4 an earlier, signed pack")
    ui_env.replies.update({"ask_save_path": str(earlier)})
    monkeypatch.setattr(pack_export.QProgressDialog, "wasCanceled", lambda self: True)
    assert pack_export.export_pack(window) is None
    assert earlier.read_bytes() == b"%PDF-1.4 an earlier, signed pack"
    assert [p.name for p in folder.iterdir()] == ["pack.pdf"]              # no part file left
    assert "open_externally" not in ui_env.names()
    assert "cancelled" in window.statusBar().currentMessage()


def test_an_unschedulable_plan_is_named_and_nothing_is_asked(window, ui_env, monkeypatch):
    # edits that would make a loop are refused; a file can still bring an unschedulable plan
    monkeypatch.setattr(window.session, "analysis", None)
    monkeypatch.setattr(window.session, "analysis_error", "the links make a loop: S → E → S")
    ui_env.replies.update({"show_error": None})
    assert pack_export.export_pack(window) is None
    (name, args), = [(n, a) for n, a in ui_env.asked if n == "show_error"]
    assert "cannot be scheduled" in args[2] and "ask_save_path" not in ui_env.names()


def test_an_unwritable_place_is_named(window, ui_env, tmp_path):
    target = tmp_path / "no such folder" / "pack.pdf"
    ui_env.replies.update({"ask_save_path": str(target), "show_error": None})
    assert pack_export.export_pack(window) is None
    message = [a for n, a in ui_env.asked if n == "show_error"][0][2]
    assert "no such folder" in message and not target.exists()


@pytest.mark.parametrize("answer", [None, ""])
def test_no_path_chosen_does_nothing(window, ui_env, answer):
    ui_env.replies.update({"ask_save_path": answer})
    assert pack_export.export_pack(window) is None
    assert ui_env.names() == ["ask_save_path"]
