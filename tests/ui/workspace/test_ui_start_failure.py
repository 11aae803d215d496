"""When Qt cannot start the window, Slackline names the missing libraries (found as the
loader finds them) and exits with code 2, rather than leaving Qt's hint alone and aborting."""

import os
import shutil
import subprocess
import sys
from pathlib import Path

import pytest

from workbench import syslibs

pytestmark = pytest.mark.skipif(not sys.platform.startswith("linux") or shutil.which("ldd") is None,
                                reason="Linux platform plugins, ldd")


def launch(tmp_path, **env):
    base = {k: v for k, v in os.environ.items() if not k.startswith("QT_")}
    base.update(SLACKLINE_DATA_DIR=str(tmp_path / "data"), HOME=str(tmp_path / "home"),
                XDG_CONFIG_HOME=str(tmp_path / "config"), SLACKLINE_MULTI_INSTANCE="1",
                QT_QPA_PLATFORM="xcb", **env)
    return subprocess.run([sys.executable, "-m", "workbench"], capture_output=True, text=True,
                          env=base, timeout=120, cwd=tmp_path)


def doctored_plugin(tmp_path) -> Path:
    """A copy of the xcb plugin that needs a library no system has (one needed name
    renamed in place), beside a link to PySide6's own Qt libraries so that only that
    one is missing."""
    real = syslibs.plugin_file("xcb")
    if real is None:
        pytest.skip("no xcb platform plugin installed")
    data = real.read_bytes()
    if b"libxcb-icccm.so.4\0" not in data:
        pytest.skip("this xcb plugin does not link libxcb-icccm")
    folder = tmp_path / "qt" / "plugins" / "platforms"
    folder.mkdir(parents=True)
    (tmp_path / "qt" / "lib").symlink_to(real.parent.parent.parent / "lib")
    copy = folder / real.name
    copy.write_bytes(data.replace(b"libxcb-icccm.so.4\0", b"libxcb-iccqm.so.4\0"))
    return folder


def test_a_missing_library_is_named_with_its_package(tmp_path):
    folder = doctored_plugin(tmp_path)
    # a machine may lack some of the real plugin's libraries too: those are named as well
    already = syslibs.missing_libraries(syslibs.plugin_file("xcb"))
    missing = syslibs.missing_libraries(folder / "libqxcb.so")
    assert "libxcb-iccqm.so.4" in missing and sorted(set(missing) - {"libxcb-iccqm.so.4"}) == sorted(already)
    done = launch(tmp_path, QT_QPA_PLATFORM_PLUGIN_PATH=str(folder), DISPLAY=":0")
    assert done.returncode == 2, done.stderr
    assert "Could not load the Qt platform plugin" in done.stderr      # Qt's own words stay
    named = done.stderr.split("Missing system libraries: ", 1)[1].split("\n", 1)[0]
    assert "libxcb-iccqm.so.4" in named
    if syslibs.system_family() == "debian":
        assert "apt-get install -y --no-install-recommends" in done.stderr and "libxcb-iccqm4" in done.stderr
    assert "Traceback" not in done.stderr


def test_no_display_is_said_plainly(tmp_path):
    if any(syslibs.missing_for_window({"QT_QPA_PLATFORM": "xcb"}).values()):
        pytest.skip("this machine lacks some of the xcb plugin's libraries")
    done = launch(tmp_path, DISPLAY=":93")
    assert done.returncode == 2, done.stderr
    assert "no display to show it on :93" in done.stderr
