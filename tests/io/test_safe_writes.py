"""Every file Slackline writes goes through an exclusive temporary file with an
unpredictable name, never through a planted link, and keeps the permissions, owner and
group of the file it replaces (issue 20, items 4, 5 and 8)."""

import datetime as dt
import os
import shutil
import stat
import subprocess
import sys
import tempfile
import textwrap
from pathlib import Path

import pytest

from workbench.core import Activity, Link, Plan, Settings, analyze
from workbench.io import atomic
from workbench.io.planfile import OwnershipChange, load_plan, save_plan
from workbench.io.tabular import export_table

POSIX = pytest.mark.skipif(os.name == "nt", reason="POSIX permissions and links")


def small_plan(title: str = "shared") -> Plan:
    acts = [Activity("A", "Survey", optimistic=1, most_likely=2, pessimistic=4), Activity("B", "Build", duration=3)]
    return Plan(Settings(title=title, start=dt.date(2027, 3, 1)), acts, [Link("A", "B")])


def plant_links_at_old_names(folder: Path, target: str, victim: Path) -> None:
    """The names a predictable writer would use: ``.NAME.<pid>.tmp`` and ``.NAME.tmp``."""
    for name in (f".{target}.{os.getpid()}.tmp", f".{target}.tmp"):
        (folder / name).symlink_to(victim)


@POSIX
@pytest.mark.parametrize("suffix", [".csv", ".xlsx"])
def test_export_never_writes_through_a_planted_link(tmp_path, suffix):
    victim = tmp_path / "private.txt"
    victim.write_text("keep me")
    victim.chmod(0o600)
    plant_links_at_old_names(tmp_path, f"out{suffix}", victim)
    export_table(analyze(small_plan()), tmp_path / f"out{suffix}")
    assert victim.read_text() == "keep me"
    assert (tmp_path / f"out{suffix}").stat().st_size > 0


@POSIX
def test_a_link_planted_under_the_very_next_name_is_left_alone(tmp_path, monkeypatch):
    """Even if an attacker guessed the random part, creation is exclusive: the writer
    picks another name and the link's target is untouched."""
    victim = tmp_path / "private.txt"
    victim.write_text("keep me")
    tokens = iter(["a" * 12, "b" * 12])
    monkeypatch.setattr(atomic.secrets, "token_hex", lambda n: next(tokens))
    guessed = tmp_path / f".plan.slw.{atomic._host_tag()}-{os.getpid()}-{'a' * 12}.tmp"
    guessed.symlink_to(victim)
    save_plan(small_plan(), tmp_path / "plan.slw")
    assert victim.read_text() == "keep me" and guessed.is_symlink()
    assert load_plan(tmp_path / "plan.slw").settings.title == "shared"


def test_temporary_files_are_opened_exclusively_without_following_links(tmp_path, monkeypatch):
    opened = []
    real_open = os.open

    def spy(path, flags, *mode):
        if str(path).endswith(".tmp"):
            opened.append((Path(path).name, flags))
        return real_open(path, flags, *mode)

    monkeypatch.setattr(atomic.os, "open", spy)
    path = tmp_path / "plan.slw"
    save_plan(small_plan("one"), path)
    save_plan(small_plan("two"), path)  # a backup and a plan
    export_table(analyze(small_plan()), tmp_path / "t.csv")
    assert len(opened) == 4
    assert len({name for name, _ in opened}) == 4
    for name, flags in opened:
        assert flags & os.O_EXCL and flags & os.O_CREAT, name
        assert flags & getattr(os, "O_NOFOLLOW", 0) == getattr(os, "O_NOFOLLOW", 0), name


@POSIX
def test_the_backup_takes_the_plans_permissions(tmp_path):
    path = tmp_path / "private.slw"
    save_plan(small_plan("one"), path)
    path.chmod(0o600)
    save_plan(small_plan("two"), path)
    assert stat.S_IMODE((tmp_path / "private.slw.bak").stat().st_mode) == 0o600
    assert stat.S_IMODE(path.stat().st_mode) == 0o600


@POSIX
def test_no_temporary_file_is_ever_readable_by_others(tmp_path, monkeypatch):
    """A private plan's content never sits in a world-readable temporary file."""
    modes = []
    real_write = atomic._write_fd
    monkeypatch.setattr(atomic, "_write_fd", lambda fd, data: (modes.append(stat.S_IMODE(os.fstat(fd).st_mode)),
                                                             real_write(fd, data)))
    path = tmp_path / "private.slw"
    save_plan(small_plan("one"), path)
    path.chmod(0o600)
    save_plan(small_plan("two"), path)
    assert modes and all(m & 0o077 == 0 for m in modes)


@pytest.mark.skipif(not hasattr(os, "geteuid") or os.geteuid() != 0, reason="needs to give files away (root)")
def test_owner_and_group_are_kept_when_the_os_allows(tmp_path):
    path = tmp_path / "team.slw"
    save_plan(small_plan("one"), path)
    os.chown(path, 4321, 4322)
    path.chmod(0o660)
    save_plan(small_plan("two"), path)
    for name in ("team.slw", "team.slw.bak"):
        st = (tmp_path / name).stat()
        assert (st.st_uid, st.st_gid, stat.S_IMODE(st.st_mode)) == (4321, 4322, 0o660), name


AS_ANOTHER_USER = textwrap.dedent("""
    import os, sys, datetime as dt, grp, pwd
    from workbench.core import Activity, Plan, Settings
    from workbench.io.planfile import OwnershipChange, save_plan
    os.setgid(65534); os.setgroups([]); os.setuid(65534)  # the installed Python may be private
    plan = Plan(Settings(title="colleague", start=dt.date(2027, 3, 1)), [Activity("A", duration=1)])
    try:
        save_plan(plan, sys.argv[1])
    except OwnershipChange as exc:
        print("ASKED:", exc)
    save_plan(plan, sys.argv[1], accept_owner_change=True)
    print("SAVED")
""")


@pytest.mark.skipif(not hasattr(os, "geteuid") or os.geteuid() != 0, reason="needs to switch user (root)")
def test_a_colleague_is_told_before_the_save_changes_the_owner():
    shared = Path(tempfile.mkdtemp(prefix="slackline-shared-", dir="/tmp"))
    shared.chmod(0o777)  # a shared team folder
    path = shared / "team.slw"
    save_plan(small_plan("team"), path)
    os.chown(path, 4321, 4322)
    path.chmod(0o666)
    try:
        proc = subprocess.run([sys.executable, "-c", AS_ANOTHER_USER, str(path)], capture_output=True, text=True,
                              timeout=120, cwd="/")
        owner, title = path.stat().st_uid, load_plan(path).settings.title
    finally:
        shutil.rmtree(shared)
    assert proc.returncode == 0, proc.stderr
    first, second = proc.stdout.splitlines()
    assert first.startswith("ASKED: team.slw belongs to owner 4321 and group 4322") and second == "SAVED"
    assert owner == 65534 and title == "colleague"


def test_ownership_check_happens_before_anything_is_written(tmp_path, monkeypatch):
    path = tmp_path / "team.slw"
    save_plan(small_plan("before"), path)
    monkeypatch.setattr(atomic, "ownership_problem", lambda *a, **k: "team.slw belongs to owner someone")
    with pytest.raises(OwnershipChange, match="belongs to owner someone"):
        save_plan(small_plan("after"), path)
    assert load_plan(path).settings.title == "before" and not (tmp_path / "team.slw.bak").exists()
    assert sorted(p.name for p in tmp_path.iterdir()) == ["team.slw"]


def test_the_next_save_removes_what_a_killed_one_left(tmp_path):
    path = tmp_path / "plan.slw"
    dead = subprocess.run([sys.executable, "-c", "import os; print(os.getpid())"], capture_output=True, text=True)
    dead_pid = int(dead.stdout)
    host = atomic._host_tag()
    left = tmp_path / f".plan.slw.{host}-{dead_pid}-{'c' * 12}.tmp"
    running = tmp_path / f".plan.slw.{host}-{os.getppid()}-{'d' * 12}.tmp"  # a live process: keep
    other = tmp_path / f".other.slw.{host}-{dead_pid}-{'e' * 12}.tmp"    # another target: keep
    for p in (left, running, other):
        p.write_bytes(b"half a plan")
    save_plan(small_plan(), path)
    assert not left.exists() and running.exists() and other.exists()


@POSIX
def test_the_approval_pack_never_writes_through_a_planted_link(tmp_path):
    from workbench.reports.pack import build_pack

    victim = tmp_path / "private.txt"
    victim.write_text("keep me")
    for name in (f".pack.pdf.{os.getpid()}.tmp", ".pack.pdf.tmp", ".pack.pdf.part"):
        (tmp_path / name).symlink_to(victim)
    opened = []
    real_open = os.open

    def spy(path, flags, *mode):
        opened.append((Path(path).name, flags))
        return real_open(path, flags, *mode)

    atomic.os.open = spy
    try:
        build_pack(small_plan(), tmp_path / "pack.pdf", iterations=0)
    finally:
        atomic.os.open = real_open
    assert victim.read_text() == "keep me" and (tmp_path / "pack.pdf").read_bytes().startswith(b"%PDF")
    temps = [flags for name, flags in opened if name.startswith(".pack.pdf.") and name.endswith(".tmp")]
    assert len(temps) == 1 and temps[0] & os.O_EXCL
