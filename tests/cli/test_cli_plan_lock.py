"""A verb that writes a plan file honours a window's lock (issue 20, item 7): it refuses,
naming who holds the lock, unless ``--force``; and ``--deadline ''`` is refused (item 14)."""

from __future__ import annotations

import os
import subprocess
import sys
from pathlib import Path

import pytest

from workbench.cli import main
from workbench.io.lock_info import lock_holder, lock_path
from workbench.io.planfile import load_plan, save_plan
from support.plans import footbridge_plan as footbridge

CSV = "id,name,duration,predecessors\nA,Survey,2,\nB,Build,3,A\n"


def slackline(*argv, cwd=None):
    return subprocess.run([sys.executable, "-m", "workbench.cli", *map(str, argv)], capture_output=True,
                          text=True, timeout=300, cwd=cwd)


@pytest.fixture
def held_plan(tmp_path):
    """A plan open for editing in a window of this process (the real Qt lock)."""
    from workbench.ui.workspace.lock import PlanLock

    plan = tmp_path / "bridge.slw"
    save_plan(footbridge(), plan)
    lock = PlanLock(str(plan.resolve()))
    assert lock.acquire() and lock.held
    (tmp_path / "new.csv").write_text(CSV, encoding="utf-8")
    yield plan
    lock.release()


def test_import_refuses_a_plan_a_window_holds_naming_the_holder(held_plan):
    before = held_plan.read_bytes()
    proc = slackline("import", held_plan.parent / "new.csv", "-o", held_plan)
    assert proc.returncode == 2
    assert "bridge.slw: open for editing in a Slackline window" in proc.stderr
    assert f"process {os.getpid()}" in proc.stderr and "--force" in proc.stderr
    assert held_plan.read_bytes() == before


def test_import_with_force_replaces_it(held_plan):
    proc = slackline("import", held_plan.parent / "new.csv", "-o", held_plan, "--force")
    assert proc.returncode == 0, proc.stderr
    assert load_plan(held_plan).ids() == ["A", "B"]


def test_a_lock_left_by_a_process_that_is_gone_is_stale(tmp_path):
    plan = tmp_path / "bridge.slw"
    save_plan(footbridge(), plan)
    gone = subprocess.run([sys.executable, "-c", "import os; print(os.getpid())"], capture_output=True, text=True)
    import socket
    lock_path(plan).write_text(f"{gone.stdout.strip()}\nslackline\n{socket.gethostname()}\n")
    assert lock_holder(plan) is None
    (tmp_path / "new.csv").write_text(CSV, encoding="utf-8")
    assert main(["import", str(tmp_path / "new.csv"), "-o", str(plan)]) == 0


def test_a_lock_from_another_computer_is_honoured(tmp_path, capsys):
    plan = tmp_path / "bridge.slw"
    save_plan(footbridge(), plan)
    lock_path(plan).write_text("4242\nslackline\nsite-office-pc\n")
    (tmp_path / "new.csv").write_text(CSV, encoding="utf-8")
    assert main(["import", str(tmp_path / "new.csv"), "-o", str(plan)]) == 2
    assert "process 4242 (slackline) on site-office-pc" in capsys.readouterr().err


@pytest.mark.parametrize("verb", ["analyze", "simulate"])
def test_an_empty_deadline_is_refused(tmp_path, capsys, verb):
    plan = tmp_path / "bridge.slw"
    save_plan(footbridge(), plan)
    extra = ["--iterations", "200"] if verb == "simulate" else []
    assert main([verb, str(plan), "--deadline", "", *extra]) == 2
    assert "--deadline: empty" in capsys.readouterr().err


def test_level_refuses_to_write_a_plan_a_window_holds(tmp_path, capsys):
    source = Path(__file__).parents[1] / "data" / "boathouse_crews_v3.slw"
    target = tmp_path / "levelled.slw"
    save_plan(footbridge(), target)
    lock_path(target).write_text("4242\nslackline\nsite-office-pc\n")
    before = target.read_bytes()
    assert main(["level", str(source), "-o", str(target)]) == 2
    assert "process 4242 (slackline) on site-office-pc" in capsys.readouterr().err
    assert target.read_bytes() == before
    assert main(["level", str(source), "-o", str(target), "--force"]) == 0
    assert load_plan(target).resources
