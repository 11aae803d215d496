"""The window's system libraries: found as the loader finds them, named as packages, installed."""

import shutil
import subprocess
import sys
from types import SimpleNamespace

import pytest

from workbench import syslibs

LDD_SAMPLE = """\
\tlinux-vdso.so.1 (0x00007ffd5c3f1000)
\tlibQt6XcbQpa.so.6 => /venv/PySide6/Qt/lib/libQt6XcbQpa.so.6 (0x00007f0c1c000000)
\tlibxcb-icccm.so.4 => not found
\tlibxcb-keysyms.so.1 => not found
\tlibxcb-cursor.so.0 => /lib/x86_64-linux-gnu/libxcb-cursor.so.0 (0x00007f0c1bff0000)
\tlibxcb-icccm.so.4 => not found
\t/lib64/ld-linux-x86-64.so.2 (0x00007f0c1c600000)
"""


def test_parse_ldd_names_each_missing_library_once_in_order():
    assert syslibs.parse_ldd(LDD_SAMPLE) == ["libxcb-icccm.so.4", "libxcb-keysyms.so.1"]
    assert syslibs.parse_ldd("\tstatically linked\n") == []


@pytest.mark.skipif(not (shutil.which("gcc") and shutil.which("ldd")), reason="needs gcc and ldd")
def test_the_loader_reports_a_library_that_is_gone(tmp_path):
    """A library linked against a stub that is then deleted: ldd, through our check, names it."""
    (tmp_path / "gone.c").write_text("int slw_gone(void) { return 1; }\n")
    (tmp_path / "user.c").write_text("int slw_gone(void);\nint slw_user(void) { return slw_gone(); }\n")
    stub = tmp_path / "libslwgone.so.1"
    subprocess.run(["gcc", "-shared", "-fPIC", "-Wl,-soname,libslwgone.so.1", "-o", str(stub),
                    str(tmp_path / "gone.c")], check=True)
    (tmp_path / "libslwgone.so").symlink_to(stub.name)
    user = tmp_path / "libslwuser.so"
    subprocess.run(["gcc", "-shared", "-fPIC", "-o", str(user), str(tmp_path / "user.c"),
                    f"-L{tmp_path}", "-lslwgone", f"-Wl,-rpath,{tmp_path}"], check=True)
    assert syslibs.missing_libraries(user) == []
    stub.unlink()
    assert syslibs.missing_libraries(user) == ["libslwgone.so.1"]


# Package names as `dpkg -S` reports them for the libraries of PySide6 6.11's xcb and
# wayland plugins on Debian 12 (bookworm), December 2026.
DPKG_ON_DEBIAN_12 = {
    "libxcb-icccm.so.4": "libxcb-icccm4", "libxcb-keysyms.so.1": "libxcb-keysyms1",
    "libxcb-cursor.so.0": "libxcb-cursor0", "libxcb-render-util.so.0": "libxcb-render-util0",
    "libxkbcommon-x11.so.0": "libxkbcommon-x11-0", "libX11-xcb.so.1": "libx11-xcb1",
    "libX11.so.6": "libx11-6", "libEGL.so.1": "libegl1", "libGL.so.1": "libgl1",
    "libGLX.so.0": "libglx0", "libGLdispatch.so.0": "libglvnd0", "libpng16.so.16": "libpng16-16",
    "libfontconfig.so.1": "libfontconfig1", "libglib-2.0.so.0": "libglib2.0-0",
    "libgthread-2.0.so.0": "libglib2.0-0", "libwayland-client.so.0": "libwayland-client0",
    "libxcb-util.so.1": "libxcb-util1", "libstdc++.so.6": "libstdc++6", "libbrotlidec.so.1": "libbrotli1",
    "libzstd.so.1": "libzstd1", "libXau.so.6": "libxau6",
}


@pytest.mark.parametrize("soname, package", sorted(DPKG_ON_DEBIAN_12.items()))
def test_debian_package_names(soname, package):
    assert syslibs.debian_package(soname) == package


@pytest.mark.parametrize("text, family", [
    ('PRETTY_NAME="Debian GNU/Linux 12 (bookworm)"\nID=debian\n', "debian"),
    ('ID=ubuntu\nID_LIKE=debian\n', "debian"),
    ('ID=linuxmint\nID_LIKE="ubuntu debian"\n', "debian"),
    ('ID=fedora\n', "fedora"),
    ('ID="rocky"\nID_LIKE="rhel centos fedora"\n', "fedora"),
    ('ID="opensuse-tumbleweed"\nID_LIKE="opensuse suse"\n', "suse"),
    ('ID=arch\n', "arch"),
    ('ID=nixos\n', None),
])
def test_system_family(text, family):
    assert syslibs.system_family(text) == family


def test_advice_on_debian_asks_for_sudo_only_when_not_root():
    missing = ["libxcb-icccm.so.4", "libxcb-keysyms.so.1"]
    user = syslibs.advise(missing, "debian", is_root=False)
    root = syslibs.advise(missing, "debian", is_root=True)
    assert user.command == ("sudo", "apt-get", "install", "-y", "--no-install-recommends",
                            "libxcb-icccm4", "libxcb-keysyms1")
    assert root.command == user.command[1:]
    assert "libxcb-icccm.so.4, libxcb-keysyms.so.1" in user.text()
    assert "sudo apt-get install" in user.text()


def test_advice_elsewhere_names_the_packages():
    rpm = syslibs.advise(["libxcb-icccm.so.4"], "fedora", is_root=False)
    assert rpm.command == ("sudo", "dnf", "install", "-y", "libxcb-icccm.so.4()(64bit)")
    assert "'libxcb-icccm.so.4()(64bit)'" in rpm.text()  # quoted: the shell would trip on ()
    arch = syslibs.advise(["libxcb-icccm.so.4", "libxcb-keysyms.so.1"], "arch", is_root=True)
    assert arch.packages == ("xcb-util-wm", "xcb-util-keysyms")
    unknown = syslibs.advise(["libxcb-icccm.so.4"], None, is_root=False)
    assert unknown.command == () and "libxcb-icccm.so.4" in unknown.text()


def test_qt_libraries_missing_mean_a_broken_pyside6_not_a_system_package():
    advice = syslibs.advise(["libQt6XcbQpa.so.6", "libxcb-icccm.so.4"], "debian", is_root=True)
    assert advice.packages == ("libxcb-icccm4",)
    assert "reinstall" in advice.text() and "libQt6XcbQpa.so.6" in advice.text()


def _recording_runner(results):
    calls = []

    def run(command):
        calls.append(command)
        return SimpleNamespace(returncode=results.pop(0))
    return run, calls


def test_install_refreshes_apt_lists_after_a_failure_and_tries_again(monkeypatch):
    monkeypatch.setattr(syslibs.shutil, "which", lambda name: f"/usr/bin/{name}")
    advice = syslibs.advise(["libxcb-icccm.so.4"], "debian", is_root=False)
    run, calls = _recording_runner([100, 0, 0])
    assert syslibs.install(advice, run)
    assert calls == [list(advice.command), ["sudo", "apt-get", "update"], list(advice.command)]


def test_install_without_sudo_says_what_to_run_as_root(monkeypatch, capsys):
    monkeypatch.setattr(syslibs.shutil, "which", lambda name: None)
    advice = syslibs.advise(["libxcb-icccm.so.4"], "debian", is_root=False)
    run, calls = _recording_runner([])
    assert not syslibs.install(advice, run)
    assert calls == []
    assert "run this as root" in capsys.readouterr().out


def test_main_installs_then_checks_again(monkeypatch, capsys):
    rounds = [{"xcb": ["libxcb-keysyms.so.1"]}, {"xcb": []}]
    monkeypatch.setattr(syslibs, "missing_for_window", lambda environ=None: rounds.pop(0))
    monkeypatch.setattr(syslibs, "system_family", lambda: "debian")
    monkeypatch.setattr(syslibs.os, "geteuid", lambda: 0)
    run, calls = _recording_runner([0])
    assert syslibs.main(["--install"], run) == 0
    assert calls == [["apt-get", "install", "-y", "--no-install-recommends", "libxcb-keysyms1"]]
    assert "now all present" in capsys.readouterr().out


def test_main_without_install_reports_and_fails(monkeypatch, capsys):
    monkeypatch.setattr(syslibs, "missing_for_window", lambda environ=None: {"xcb": ["libxcb-icccm.so.4"]})
    monkeypatch.setattr(syslibs, "system_family", lambda: "debian")
    assert syslibs.main([], lambda command: pytest.fail("nothing may be installed")) == 1
    assert "libxcb-icccm4" in capsys.readouterr().out


def test_platforms_follow_qt_choice():
    assert syslibs.wanted_platforms({}) == ["xcb"]
    assert syslibs.wanted_platforms({"XDG_SESSION_TYPE": "wayland"}) == ["wayland", "xcb"]
    assert syslibs.wanted_platforms({"QT_QPA_PLATFORM": "xcb:foo=1;offscreen"}) == ["xcb", "offscreen"]


@pytest.mark.skipif(not sys.platform.startswith("linux"), reason="Linux plugin files")
def test_the_installed_xcb_plugin_is_found():
    path = syslibs.plugin_file("xcb")
    assert path is not None and path.name == "libqxcb.so"


def test_no_display_is_named_when_nothing_is_missing(monkeypatch):
    monkeypatch.setattr(syslibs, "missing_for_window", lambda environ=None: {"xcb": []})
    text = syslibs.explain_start_failure(["could not connect to display :77"], {"DISPLAY": ":77"})
    assert "no display" in text and ":77" in text
    text = syslibs.explain_start_failure([], {"DISPLAY": ":0", "QT_QPA_PLATFORM": "xcb"})
    assert "no system library is missing" in text
