"""The window opens a plan or table whose texts run past the entry limits, says which, and
asks for a shorter text only when that text itself is edited."""

import pytest

from support.ui import sample_plan, ui_env, window  # noqa: F401 (fixtures)
from workbench.core.analysis import analyze
from workbench.core.commands import EditActivity
from workbench.core.model import Activity
from workbench.io.planfile import save_plan
from workbench.io.tabular import export_table

NAME = ("Re-route the chilled water main around the old plant room " * 12).strip()


def long_named_plan():
    plan = sample_plan()
    plan.replace_activity("D", Activity("D", NAME, group="Design", optimistic=3, most_likely=5, pessimistic=9))
    return plan


def test_opening_says_which_texts_run_long_and_keeps_them(window, ui_env, tmp_path):
    path = save_plan(long_named_plan(), tmp_path / "chilled.slw")
    ui_env.replies["show_info"] = None
    assert window.files.open_path(str(path))
    [(_, (parent, title, message))] = [a for a in ui_env.asked if a[0] == "show_info"]
    assert title == "Long texts kept"
    assert message.startswith("chilled.slw: 1 text is longer than Slackline lets you type:\n\n- activity D: name")
    assert window.session.plan.activity("D").name == NAME


@pytest.mark.parametrize("suffix", [".csv", ".xlsx"])
def test_importing_a_table_says_so_too(window, ui_env, tmp_path, suffix):
    path = export_table(analyze(long_named_plan()), tmp_path / f"chilled{suffix}")
    ui_env.replies["preview_import"] = "keep"
    ui_env.replies["show_info"] = None
    assert window.files.open_path(str(path))
    assert any(a[0] == "show_info" and "activity D: name" in a[1][2] for a in ui_env.asked)
    assert window.session.plan.activity("D").name == NAME


def test_an_edit_keeps_the_long_text_unless_it_changes_it(window, ui_env, tmp_path):
    window.session.load(long_named_plan())
    assert window.session.push(EditActivity("D", duration=None, optimistic=2.0))     # another field: kept
    assert window.session.plan.activity("D").name == NAME
    assert not window.session.push(EditActivity("D", name=NAME + " (phase 2)"))
    assert window.notice.text().startswith(f"Not applied: activity D: name is {len(NAME) + 10:,} characters long; "
                                           "use at most 500")
    assert window.session.push(EditActivity("D", name="Re-route the chilled water main"))
