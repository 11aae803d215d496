"""The POSIX-only parts of the atomic writer (keeping owner and group, asking whether a
process still runs) are safe no-ops where the OS is Windows. Simulated here by giving the
writer an ``os`` that says "nt" and lacks what Windows lacks; not run on Windows itself."""

import os
import time

import pytest

from workbench.io import atomic

MISSING_ON_WINDOWS = {"fchown", "geteuid", "getegid", "getgroups", "fchmod", "O_NOFOLLOW"}


class WindowsLikeOs:
    """``os`` as the writer sees it on Windows; ``kill`` must never be called there (it
    would end the process, whatever the signal)."""

    name = "nt"

    def __getattr__(self, attr):
        if attr in MISSING_ON_WINDOWS:
            raise AttributeError(attr)
        return getattr(os, attr)

    @staticmethod
    def kill(pid, sig):
        raise AssertionError("os.kill on Windows would end the process")


@pytest.fixture
def windows(monkeypatch):
    monkeypatch.setattr(atomic, "os", WindowsLikeOs())


def leftover(folder, target: str, pid: int, age_s: float = 0.0):
    path = folder / f".{target}.{atomic._host_tag()}-{pid}-0123456789ab.tmp"
    path.write_bytes(b"half a plan")
    if age_s:
        then = time.time() - age_s
        os.utime(path, (then, then))
    return path


def test_owner_and_group_are_neither_checked_nor_changed(windows, tmp_path):
    target = tmp_path / "plan.slw"
    target.write_bytes(b"old")
    someone_else = atomic.Keep(0o640, uid=12345, gid=54321)
    assert atomic.ownership_problem(target, someone_else) is None          # no question asked
    atomic.write_file(target, b"new", like=None)                              # fchown is never reached
    assert target.read_bytes() == b"new"


def test_a_leftover_is_swept_only_when_old_and_no_process_is_asked(windows, tmp_path):
    dead_pid = 4_000_000                      # no such process; on Windows nobody may ask
    fresh = leftover(tmp_path, "plan.slw", dead_pid)
    stale = leftover(tmp_path, "plan.slw", dead_pid + 1, age_s=atomic.LEFTOVER_AGE_S + 60)
    assert atomic.sweep_leftovers(tmp_path / "plan.slw") == [stale]
    assert fresh.exists() and not stale.exists()


def test_the_folder_is_not_opened_for_syncing(windows, tmp_path, monkeypatch):
    opened = []
    monkeypatch.setattr(WindowsLikeOs, "open", lambda self, *a, **k: opened.append(a) or os.open(*a, **k),
                        raising=False)
    atomic.fsync_folder(tmp_path)
    assert opened == []


def test_on_posix_a_young_leftover_of_a_dead_process_is_swept(tmp_path):
    if os.name != "posix":
        pytest.skip("POSIX rule")
    gone = leftover(tmp_path, "plan.slw", 4_000_000)
    mine = leftover(tmp_path, "plan.slw", os.getpid())
    assert atomic.sweep_leftovers(tmp_path / "plan.slw") == [gone]
    assert mine.exists()
