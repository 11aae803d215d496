"""bootstrap.sh, the README's first step: the steps it takes, in order, and where it stops.

A stand-in for Python records each call, so the script's logic is checked without
making an environment or installing anything.
"""

import os
import shutil
import subprocess
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[2]
FAKE_PYTHON = """#!/bin/sh
echo "$*" >> "$FAKE_LOG"
case "$*" in
  "-V") echo "Python 3.10.12" ;;
  *"version_info < (3, 11)"*) exit "${FAKE_TOO_OLD:-0}" ;;
  "-m venv .venv") mkdir -p .venv/bin && cp "$0" .venv/bin/python && chmod +x .venv/bin/python ;;
  "-m workbench.syslibs --install") exit "${FAKE_SYSLIBS_RC:-0}" ;;
esac
exit 0
"""

pytestmark = pytest.mark.skipif(shutil.which("sh") is None, reason="needs a POSIX shell")


def run_bootstrap(tmp_path, **env):
    shutil.copy(ROOT / "bootstrap.sh", tmp_path / "bootstrap.sh")
    fake = tmp_path / "fake-python"
    fake.write_text(FAKE_PYTHON)
    fake.chmod(0o755)
    log = tmp_path / "calls.log"
    done = subprocess.run(["sh", str(tmp_path / "bootstrap.sh")], capture_output=True, text=True,
                          env={**os.environ, "PYTHON": str(fake), "FAKE_LOG": str(log), **env})
    calls = log.read_text().splitlines() if log.exists() else []
    return done, calls


def test_the_script_is_valid_shell():
    assert subprocess.run(["sh", "-n", str(ROOT / "bootstrap.sh")]).returncode == 0


def test_makes_the_environment_installs_and_checks_the_window_libraries(tmp_path):
    done, calls = run_bootstrap(tmp_path)
    assert done.returncode == 0, done.stdout + done.stderr
    steps = [c for c in calls if c.startswith("-m")]
    assert steps == ["-m venv .venv", "-m pip install -q -e .[gui]", "-m workbench.syslibs --install"]
    assert "slackline resources/demo.slw" in done.stdout


def test_an_existing_environment_is_reused(tmp_path):
    run_bootstrap(tmp_path)
    (tmp_path / "calls.log").unlink()
    done, calls = run_bootstrap(tmp_path)
    assert done.returncode == 0
    assert "-m venv .venv" not in calls


def test_too_old_a_python_stops_with_a_plain_message(tmp_path):
    done, calls = run_bootstrap(tmp_path, FAKE_TOO_OLD="1")
    assert done.returncode == 1
    assert "needs Python 3.11 or newer" in done.stdout and "3.10.12" in done.stdout
    assert not any(c.startswith("-m") for c in calls)


def test_missing_libraries_that_could_not_be_installed_stop_the_chain(tmp_path):
    done, _ = run_bootstrap(tmp_path, FAKE_SYSLIBS_RC="1")
    assert done.returncode != 0
    assert "ready" not in done.stdout
