"""Atomic save of .slw files: backups, failures midway, a process killed while saving."""

import datetime as dt
import os
import signal
import subprocess
import sys
import textwrap
from pathlib import Path

import pytest

from workbench.core import Activity, Link, Plan, Settings
from workbench.io import planfile
from workbench.io.planfile import PlanFileError, load_plan, plan_to_dict, save_plan


def make_plan(n: int, title: str) -> Plan:
    acts = [Activity(f"T{i}", f"Task {i} " + "x" * 40, optimistic=1, most_likely=2, pessimistic=3 + i % 5)
            for i in range(n)]
    links = [Link(f"T{i - 1}", f"T{i}") for i in range(1, n)]
    return Plan(Settings(title=title, start=dt.date(2026, 6, 1)), acts, links)


def test_save_creates_file_and_backup(tmp_path):
    path = tmp_path / "plan.slw"
    first, second = make_plan(3, "first"), make_plan(4, "second")
    save_plan(first, path)
    assert not (tmp_path / "plan.slw.bak").exists()
    save_plan(second, path)
    assert load_plan(path).settings.title == "second"
    assert load_plan(tmp_path / "plan.slw.bak").settings.title == "first"
    assert sorted(p.name for p in tmp_path.iterdir()) == ["plan.slw", "plan.slw.bak"]


def test_save_keeps_file_mode(tmp_path):
    path = tmp_path / "plan.slw"
    save_plan(make_plan(2, "a"), path)
    os.chmod(path, 0o640)
    save_plan(make_plan(2, "b"), path)
    assert (path.stat().st_mode & 0o777) == 0o640


def test_failed_rename_leaves_previous_file_and_no_temp(tmp_path, monkeypatch):
    path = tmp_path / "plan.slw"
    save_plan(make_plan(3, "good"), path)
    real_replace = os.replace

    def failing_replace(src, dst):
        if Path(dst) == path:
            raise OSError(28, "No space left on device")
        return real_replace(src, dst)

    monkeypatch.setattr(planfile.os, "replace", failing_replace)
    with pytest.raises(PlanFileError, match="previous file is unchanged"):
        save_plan(make_plan(5, "bad"), path)
    monkeypatch.undo()
    assert load_plan(path).settings.title == "good"
    assert not list(tmp_path.glob("*.tmp"))


def test_failed_write_midway_leaves_previous_file(tmp_path, monkeypatch):
    path = tmp_path / "plan.slw"
    save_plan(make_plan(3, "good"), path)
    calls = []

    def failing_write_all(handle, data):
        handle.write(data[: len(data) // 2])
        calls.append(1)
        if len(calls) == 2:  # first call writes the backup, the second the new file
            raise OSError(5, "Input/output error")
        handle.write(data[len(data) // 2:])

    monkeypatch.setattr(planfile, "_write_all", failing_write_all)
    with pytest.raises(PlanFileError):
        save_plan(make_plan(5, "bad"), path)
    assert load_plan(path).settings.title == "good"
    assert not list(tmp_path.glob("*.tmp"))


KILLER = textwrap.dedent("""
    import os, signal, sys
    sys.path.insert(0, {tests!r})
    from test_planfile_save import make_plan
    from workbench.io import planfile

    def write_half_then_die(handle, data):
        handle.write(data[: len(data) // 2])
        handle.flush()
        if {at_rename!r}:
            handle.write(data[len(data) // 2:])
            return
        os.kill(os.getpid(), signal.SIGKILL)

    def die(src, dst):
        os.kill(os.getpid(), signal.SIGKILL)

    planfile._write_all = write_half_then_die
    if {at_rename!r}:
        planfile.os.replace = die
    planfile.save_plan(make_plan(2000, "interrupted"), sys.argv[1], backup=False)
""")


@pytest.mark.skipif(not hasattr(signal, "SIGKILL"), reason="needs SIGKILL")
@pytest.mark.parametrize("at_rename", [False, True], ids=["killed-while-writing", "killed-before-rename"])
def test_killed_save_leaves_previous_file_loadable(tmp_path, at_rename):
    path = tmp_path / "plan.slw"
    good = make_plan(4, "good")
    save_plan(good, path)
    script = KILLER.format(tests=str(Path(__file__).parent), at_rename=at_rename)
    proc = subprocess.run([sys.executable, "-c", script, str(path)], capture_output=True, timeout=120)
    assert proc.returncode == -signal.SIGKILL, proc.stderr.decode()
    temps = list(tmp_path.glob(".plan.slw.*.tmp"))
    assert len(temps) == 1 and temps[0].stat().st_size > 0  # the save really got under way
    assert plan_to_dict(load_plan(path)) == plan_to_dict(good)
    save_plan(make_plan(5, "after"), path)  # and the next save still works
    assert load_plan(path).settings.title == "after"


def test_refuses_to_write_a_plan_it_could_not_read_back(tmp_path):
    plan = make_plan(3, "loop")
    plan.links.append(Link("T2", "T0"))  # bypasses the checks, as a buggy caller might
    path = tmp_path / "loop.slw"
    with pytest.raises(PlanFileError, match="loop"):
        save_plan(plan, path)
    assert not path.exists()


def test_unwritable_folder_gives_clear_message(tmp_path):
    with pytest.raises(PlanFileError, match="could not save"):
        save_plan(make_plan(2, "x"), tmp_path / "missing-folder" / "plan.slw")


def test_damaged_file_message_points_to_the_backup(tmp_path):
    path = tmp_path / "plan.slw"
    save_plan(make_plan(2, "one"), path)
    save_plan(make_plan(2, "two"), path)
    path.write_bytes(path.read_bytes()[:100])  # damaged by some other program
    with pytest.raises(PlanFileError, match=r"not valid JSON[\s\S]*kept as plan\.slw\.bak"):
        load_plan(path)
    assert load_plan(tmp_path / "plan.slw.bak").settings.title == "one"


@pytest.mark.skipif(os.name == "nt", reason="POSIX permissions")
def test_new_file_gets_the_usual_permissions(tmp_path):
    old = os.umask(0o027)
    try:
        save_plan(make_plan(2, "a"), tmp_path / "new.slw")
    finally:
        os.umask(old)
    assert ((tmp_path / "new.slw").stat().st_mode & 0o777) == 0o640
