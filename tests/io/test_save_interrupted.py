"""The atomic save stopped between every pair of its system calls (issue 20): the plan's
name always holds a loadable old or new plan, the backup is always loadable, and the next
successful save clears whatever the interrupted one left behind.

Each interruption is a real one: a forked child runs the save and ends with ``os._exit``
at the chosen call, so no clean-up code of the save runs (as with ``kill -9``)."""

import datetime as dt
import os

import pytest

from workbench.core import Activity, Link, Plan, Settings
from workbench.io import atomic, safe_read
from workbench.io.planfile import load_plan, plan_to_dict, save_plan

pytestmark = pytest.mark.skipif(not hasattr(os, "fork"), reason="needs fork")
STOPPED = 70


def plan_of(title: str, n: int) -> Plan:
    acts = [Activity(f"K{i}", f"Kiosk step {i}", optimistic=1, most_likely=2 + i % 3, pessimistic=6) for i in range(n)]
    return Plan(Settings(title=title, start=dt.date(2027, 5, 3)), acts, [Link(f"K{i}", f"K{i + 1}") for i in range(n - 1)])


class CallCounter:
    """Stands in for the ``os`` module: counts each call and stops the process at one."""

    def __init__(self, stop_at: int | None):
        self.stop_at, self.calls = stop_at, []

    def __getattr__(self, name):
        real = getattr(os, name)
        if not callable(real) or isinstance(real, type):
            return real

        def call(*args, **kwargs):
            if len(self.calls) == self.stop_at:
                os._exit(STOPPED)
            self.calls.append(name)
            return real(*args, **kwargs)
        return call


def save_through(counter: CallCounter, plan: Plan, path) -> None:
    originals = atomic.os, safe_read.os
    atomic.os = safe_read.os = counter
    try:
        save_plan(plan, path)
    finally:
        atomic.os, safe_read.os = originals


def save_stopped_at(step: int, plan: Plan, path) -> int:
    pid = os.fork()
    if pid == 0:  # the child: save, stopped at one call
        try:
            save_through(CallCounter(step), plan, path)
        finally:
            os._exit(0)
    return os.waitstatus_to_exitcode(os.waitpid(pid, 0)[1])


def start_from(folder, with_backup: bool, old: Plan) -> None:
    """The folder as the save finds it: empty (a first save), or a plan and its backup."""
    folder.mkdir(exist_ok=True)
    for p in folder.iterdir():
        p.unlink()
    if with_backup:
        save_plan(plan_of("older", 5), folder / "plan.slw")
        save_plan(old, folder / "plan.slw")


@pytest.mark.parametrize("with_backup", [True, False], ids=["over-a-plan", "first-save"])
def test_a_save_stopped_at_any_call_leaves_the_old_or_the_new_plan(tmp_path, with_backup):
    old, new = plan_of("old", 40), plan_of("new", 60)
    work, path, bak = tmp_path, tmp_path / "plan.slw", tmp_path / "plan.slw.bak"
    start_from(work, with_backup, old)
    record = CallCounter(None)
    save_through(record, new, path)
    calls = record.calls
    assert {"open", "write", "fsync", "fchmod", "close", "replace"} <= set(calls)
    wanted = [plan_to_dict(old), plan_to_dict(new)]
    seen = set()
    for step in range(len(calls)):
        start_from(work, with_backup, old)
        assert save_stopped_at(step, new, path) == STOPPED
        where = f"stopped before call {step} ({calls[step]})"
        if with_backup or path.exists():
            on_disk = plan_to_dict(load_plan(path))
            assert on_disk in wanted, where
            seen.add(on_disk["settings"]["title"])
        if bak.exists():
            assert load_plan(bak).settings.title in ("older", "old"), where
        save_plan(new, path)  # the next successful save clears what the stopped one left
        left = sorted(p.name for p in work.iterdir())
        assert left in (["plan.slw"], ["plan.slw", "plan.slw.bak"]), f"{where}: {left}"
        assert plan_to_dict(load_plan(path)) == plan_to_dict(new)
    assert seen == ({"old", "new"} if with_backup else {"new"})
