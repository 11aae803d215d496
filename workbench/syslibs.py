"""The system libraries Qt's window needs on Linux: find the missing ones, name their
packages, install them.

Qt's desktop platform plugin (``libqxcb.so`` on X11) links against a dozen small X11
libraries that a fresh desktop may lack. When one is missing Qt only says that it could
not load the plugin, and its hint names a package that may well be installed already.
This module asks ``ldd`` (the dynamic loader itself, so it finds libraries exactly as the
plugin will) which ones are missing, maps them to the packages of the system's package
manager, and can install them::

    python -m workbench.syslibs            # report; exit 1 when something is missing
    python -m workbench.syslibs --install  # ... and install it (apt, asking for sudo)

No Qt and no scheduling code here: it must run when Qt cannot.
"""

from __future__ import annotations

import importlib.util
import os
import re
import shlex
import shutil
import subprocess
import sys
from dataclasses import dataclass
from pathlib import Path

# Debian package names that do not follow the soname rule (see debian_package), as
# dpkg -S reports them on Debian 12.
DEBIAN_EXCEPTIONS = {
    "libglib-2.0.so.0": "libglib2.0-0", "libgthread-2.0.so.0": "libglib2.0-0",
    "libgobject-2.0.so.0": "libglib2.0-0", "libgio-2.0.so.0": "libglib2.0-0",
    "libGLdispatch.so.0": "libglvnd0", "libbrotlidec.so.1": "libbrotli1",
    "libbrotlicommon.so.1": "libbrotli1", "libz.so.1": "zlib1g", "libgcc_s.so.1": "libgcc-s1",
    "libc.so.6": "libc6", "libm.so.6": "libc6", "libdl.so.2": "libc6", "libpthread.so.0": "libc6",
}
# Arch Linux packages for the libraries the X11 plugin needs [memory]; anything else is
# named by its file, which `pacman -F` resolves.
ARCH_PACKAGES = {
    "libxcb-cursor.so.0": "xcb-util-cursor", "libxcb-icccm.so.4": "xcb-util-wm",
    "libxcb-keysyms.so.1": "xcb-util-keysyms", "libxcb-image.so.0": "xcb-util-image",
    "libxcb-render-util.so.0": "xcb-util-renderutil", "libxcb-util.so.1": "xcb-util",
    "libxkbcommon-x11.so.0": "libxkbcommon-x11", "libxkbcommon.so.0": "libxkbcommon",
    "libX11-xcb.so.1": "libx11", "libX11.so.6": "libx11", "libEGL.so.1": "libglvnd",
    "libGL.so.1": "libglvnd", "libfontconfig.so.1": "fontconfig", "libdbus-1.so.3": "dbus",
}
NOT_FOUND = re.compile(r"^\s*(\S+)\s+=>\s+not found\s*$")
FAMILIES = ("debian", "fedora", "suse", "arch")


@dataclass(frozen=True)
class Advice:
    """What to do about missing libraries: the packages, and the command installing them."""

    missing: tuple[str, ...]
    packages: tuple[str, ...]
    command: tuple[str, ...]     # empty when no package manager is known
    bundled: tuple[str, ...]     # Qt's own libraries: PySide6 itself is incomplete

    def text(self) -> str:
        lines = [f"Missing system libraries: {', '.join(self.missing)}."]
        if self.bundled:
            lines.append(f"Of these, {', '.join(self.bundled)} belong to PySide6 itself: reinstall "
                         "it (pip install --force-reinstall PySide6-Essentials).")
        if self.command:
            lines.append(f"Install them with:  {shlex.join(self.command)}")
        elif self.packages:
            lines.append(f"Install the packages that provide: {', '.join(self.packages)}")
        return "\n".join(lines)


# --- where the plugins are -----------------------------------------------------
def qt_plugin_dirs() -> list[Path]:
    """Folders Qt searches for platform plugins, in Qt's order (environment first)."""
    dirs = [Path(p) for p in os.environ.get("QT_QPA_PLATFORM_PLUGIN_PATH", "").split(os.pathsep) if p]
    dirs += [Path(p) / "platforms" for p in os.environ.get("QT_PLUGIN_PATH", "").split(os.pathsep) if p]
    frozen = getattr(sys, "_MEIPASS", None)
    roots = [Path(frozen) / "PySide6"] if frozen else []
    spec = importlib.util.find_spec("PySide6")  # finds the package without loading Qt
    if spec is not None and spec.submodule_search_locations:
        roots += [Path(p) for p in spec.submodule_search_locations]
    dirs += [root / "Qt" / "plugins" / "platforms" for root in roots]
    return dirs


def wanted_platforms(environ=os.environ) -> list[str]:
    """The platform plugins Qt will try, first choice first."""
    chosen = environ.get("QT_QPA_PLATFORM", "")
    if chosen:
        return [part.split(":")[0] for part in chosen.split(";") if part.split(":")[0]]
    if environ.get("XDG_SESSION_TYPE") == "wayland" or environ.get("WAYLAND_DISPLAY"):
        return ["wayland", "xcb"]
    return ["xcb"]


def plugin_file(platform: str) -> Path | None:
    for folder in qt_plugin_dirs():
        candidate = folder / f"libq{platform}.so"
        if candidate.is_file():
            return candidate
    return None


# --- asking the loader ------------------------------------------------------------
def parse_ldd(text: str) -> list[str]:
    """The sonames ldd reports as ``not found``, in its order, once each."""
    found = [m.group(1) for m in map(NOT_FOUND.match, text.splitlines()) if m]
    return list(dict.fromkeys(found))


def missing_libraries(path: Path) -> list[str]:
    """Libraries the loader cannot find for ``path`` (directly or through another library)."""
    ldd = shutil.which("ldd")
    if ldd is None or not sys.platform.startswith("linux"):
        return []
    done = subprocess.run([ldd, str(path)], capture_output=True, text=True, check=False,
                          env={**os.environ, "LC_ALL": "C"})
    return parse_ldd(done.stdout)


def missing_for_window(environ=os.environ) -> dict[str, list[str]]:
    """For each platform plugin Qt will try (and that exists): its missing libraries."""
    out = {}
    for platform in wanted_platforms(environ):
        path = plugin_file(platform)
        if path is not None:
            out[platform] = missing_libraries(path)
    return out


# --- packages ----------------------------------------------------------------------
def debian_package(soname: str) -> str:
    """The Debian/Ubuntu package shipping ``soname``: by Debian's library naming rule
    (name lowered, then the major version, with a dash when the name ends in a digit)."""
    if soname in DEBIAN_EXCEPTIONS:
        return DEBIAN_EXCEPTIONS[soname]
    m = re.fullmatch(r"(.+?)\.so\.(\d+)(?:\.[\d.]+)?", soname)
    if m is None:
        return soname
    name, major = m.group(1).lower(), m.group(2)
    return f"{name}-{major}" if name[-1].isdigit() else f"{name}{major}"


def system_family(os_release: str | None = None) -> str | None:
    """'debian', 'fedora', 'suse' or 'arch' from /etc/os-release (ID and ID_LIKE)."""
    if os_release is None:
        try:
            os_release = Path("/etc/os-release").read_text(encoding="utf-8", errors="replace")
        except OSError:
            return None
    words = []
    for line in os_release.splitlines():
        key, _, value = line.partition("=")
        if key in ("ID", "ID_LIKE"):
            words += value.strip().strip('"').lower().split()
    aliases = {"ubuntu": "debian", "rhel": "fedora", "centos": "fedora", "opensuse": "suse",
               "manjaro": "arch"}
    for word in words:
        family = aliases.get(word, word)
        if family in FAMILIES:
            return family
    return None


def packages_for(sonames: list[str], family: str | None) -> list[str]:
    if family == "debian":
        names = [debian_package(s) for s in sonames]
    elif family in ("fedora", "suse"):
        names = [f"{s}()(64bit)" for s in sonames]  # RPM installs by the soname it provides
    elif family == "arch":
        names = [ARCH_PACKAGES.get(s, s) for s in sonames]
    else:
        names = list(sonames)
    return list(dict.fromkeys(names))


def install_command(packages: list[str], family: str | None, is_root: bool) -> tuple[str, ...]:
    tool = {"debian": ("apt-get", "install", "-y", "--no-install-recommends"),
            "fedora": ("dnf", "install", "-y"), "suse": ("zypper", "install", "-y"),
            "arch": ("pacman", "-S", "--needed")}.get(family or "")
    if not tool or not packages:
        return ()
    return (() if is_root else ("sudo",)) + tool + tuple(packages)


def advise(missing: list[str], family: str | None = "detect", is_root: bool | None = None) -> Advice:
    """The advice for ``missing``; ``family`` None means no known package manager."""
    family = system_family() if family == "detect" else family
    is_root = (os.geteuid() == 0) if is_root is None else is_root
    bundled = [s for s in missing if s.startswith("libQt6")]
    system = [s for s in missing if s not in bundled]
    packages = packages_for(system, family)
    return Advice(tuple(missing), tuple(packages), install_command(packages, family, is_root),
                  tuple(bundled))


def explain_start_failure(qt_messages: list[str] = (), environ=os.environ) -> str:
    """What to tell a planner when Qt could not start the window (``qt_messages``: what
    Qt said while trying)."""
    missing = sorted({lib for libs in missing_for_window(environ).values() for lib in libs})
    if missing:
        return "Slackline's window cannot start.\n" + advise(missing).text()
    unreachable = next((m for m in qt_messages if "could not connect to display" in m), None)
    if unreachable is not None or ("xcb" in wanted_platforms(environ) and not environ.get("DISPLAY")):
        where = environ.get("DISPLAY") or "(DISPLAY is not set)"
        return (f"Slackline's window cannot start: no display to show it on {where}. Start it "
                "from a desktop session, or use the command-line verbs (slackline --help).")
    return ("Slackline's window cannot start, and no system library is missing. Qt's own "
            "message is above; `slackline --self-test` checks the rest of the installation.")


# --- installing ------------------------------------------------------------------------
def _run(command, runner) -> bool:
    print("+ " + shlex.join(command), flush=True)
    return runner(list(command)).returncode == 0


def install(advice: Advice, runner=subprocess.run) -> bool:
    """Run the advice's command (through sudo when not root). On apt, a failed install is
    tried once more after refreshing the package lists (a fresh machine's may be stale)."""
    command = advice.command
    if not command:
        return False
    if command[0] == "sudo" and shutil.which("sudo") is None:
        print("sudo is not available: run this as root:\n  " + shlex.join(command[1:]))
        return False
    if command[0] == "sudo":
        print("Installing them needs administrator rights: sudo may ask for your password.")
    if _run(command, runner):
        return True
    if "apt-get" not in command:
        return False
    prefix = command[:command.index("apt-get")]
    return _run((*prefix, "apt-get", "update"), runner) and _run(command, runner)


def main(argv: list[str] | None = None, runner=subprocess.run) -> int:
    """Report (and with --install, install) what the window's platform plugin lacks.
    Exit 0 when nothing is missing (any more), 1 otherwise."""
    args = sys.argv[1:] if argv is None else argv
    found = missing_for_window()
    if not found:
        print("No Qt platform plugin found to check (is PySide6 installed?).")
        return 1
    missing = sorted({lib for libs in found.values() for lib in libs})
    if not missing:
        print(f"The window's system libraries are all present ({', '.join(found)}).")
        return 0
    advice = advise(missing)
    print(advice.text())
    if "--install" not in args or not install(advice, runner):
        return 1
    still = sorted({lib for libs in missing_for_window().values() for lib in libs})
    if still:
        print(f"Still missing after installing: {', '.join(still)}")
        return 1
    print("The window's system libraries are now all present.")
    return 0


if __name__ == "__main__":
    sys.exit(main())
