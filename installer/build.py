"""Build the double-clickable Slackline folder for this operating system.

    python installer/build.py [--clean] [--package]

Needs the build extra in the active venv: ``pip install -e ".[build]"``. Writes
``dist/Slackline/`` (Linux, Windows) or ``dist/Slackline.app`` (macOS) and prints the build
time and folder size. ``--package`` then wraps it for hand-out: a ``.tar.gz`` with an
``install.sh`` on Linux, the Inno Setup installer on Windows (needs ``iscc`` on PATH), a
``.dmg`` on macOS (``hdiutil``). ``--clean`` drops PyInstaller's cache first.
"""

from __future__ import annotations

import argparse
import os
import re
import shutil
import subprocess
import sys
import tarfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
INSTALLER = ROOT / "installer"
DIST = ROOT / "dist"
WORK = ROOT / "build" / "pyinstaller"
sys.path.insert(0, str(INSTALLER))


def version() -> str:
    text = (ROOT / "workbench" / "__init__.py").read_text(encoding="utf-8")
    return re.search(r'__version__\s*=\s*"([^"]+)"', text).group(1)


def app_folder() -> Path:
    return DIST / ("Slackline.app" if sys.platform == "darwin" else "Slackline")


def folder_size(path: Path) -> int:
    return sum(p.stat().st_size for p in path.rglob("*") if p.is_file() and not p.is_symlink())


def uncommitted() -> list[str]:
    """Files of the app (workbench/, resources/) that differ from the last commit: a release
    should be built from a clean checkout, or it ships work nobody has committed."""
    try:
        result = subprocess.run(["git", "status", "--porcelain", "--", "workbench", "resources"], cwd=ROOT,
                                capture_output=True, text=True, check=True)
    except (OSError, subprocess.CalledProcessError):
        return []
    return [line[3:] for line in result.stdout.splitlines() if line.strip()]


def ensure_icons() -> None:
    import make_icons

    if not make_icons.up_to_date():
        print("icons: rendering resources/icon from slackline.svg")
        make_icons.make_icons()


def run_pyinstaller(clean: bool) -> float:
    command = [sys.executable, "-m", "PyInstaller", str(INSTALLER / "slackline.spec"), "--noconfirm",
               "--distpath", str(DIST), "--workpath", str(WORK), "--log-level", "WARN"]
    if clean:
        command.append("--clean")
    started = time.perf_counter()
    subprocess.run(command, cwd=ROOT, check=True)
    return time.perf_counter() - started


def strip_interpreter(folder: Path) -> int:
    """Drop the debug sections of the bundled Python itself (libpython and its extension
    modules, often built with them); other libraries are left alone (stripping wheel
    libraries rewritten by auditwheel can break them). Returns the bytes saved."""
    strip = shutil.which("strip")
    internal = folder / "_internal"
    targets = list(internal.glob("libpython3*.so*")) + list(internal.glob("python3*/lib-dynload/*.so"))
    if not strip or not targets:
        return 0
    before = sum(p.stat().st_size for p in targets)
    subprocess.run([strip, "--strip-debug", *map(str, targets)], check=True)
    return before - sum(p.stat().st_size for p in targets)


def package_linux(folder: Path) -> Path:
    machine = os.uname().machine
    archive = DIST / f"Slackline-{version()}-linux-{machine}.tar.gz"
    with tarfile.open(archive, "w:gz") as tar:
        tar.add(folder, arcname="Slackline")
    return archive


def package_windows(folder: Path) -> Path:
    iscc = shutil.which("iscc") or shutil.which("ISCC")
    if not iscc:
        raise SystemExit("build: Inno Setup's iscc is not on PATH; install Inno Setup 6 and retry")
    script = INSTALLER / "windows" / "slackline.iss"
    subprocess.run([iscc, f"/DAppVersion={version()}", f"/DAppFolder={folder}", f"/O{DIST}", str(script)], check=True)
    return DIST / f"Slackline-{version()}-setup.exe"


def package_macos(folder: Path) -> Path:
    """A disk image holding Slackline.app beside a link to /Applications to drag it onto."""
    image = DIST / f"Slackline-{version()}.dmg"
    stage = WORK / "dmg"
    shutil.rmtree(stage, ignore_errors=True)
    stage.mkdir(parents=True)
    subprocess.run(["ditto", str(folder), str(stage / folder.name)], check=True)  # keeps bundle metadata
    (stage / "Applications").symlink_to("/Applications")
    image.unlink(missing_ok=True)
    subprocess.run(["hdiutil", "create", "-volname", "Slackline", "-srcfolder", str(stage), "-ov",
                    "-format", "UDZO", str(image)], check=True)
    return image


def package(folder: Path) -> Path:
    if sys.platform == "win32":
        return package_windows(folder)
    if sys.platform == "darwin":
        return package_macos(folder)
    return package_linux(folder)


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(prog="build.py", description="Build the Slackline app folder.")
    parser.add_argument("--clean", action="store_true", help="drop PyInstaller's cache first")
    parser.add_argument("--package", action="store_true", help="also wrap the folder for hand-out")
    args = parser.parse_args(argv)
    changed = uncommitted()
    if changed:
        print(f"warning: building with {len(changed)} uncommitted file(s) in workbench/ or resources/, "
              f"e.g. {', '.join(changed[:3])}; build releases from a clean checkout")
    ensure_icons()
    seconds = run_pyinstaller(args.clean)
    folder = app_folder()
    if sys.platform.startswith("linux"):  # the installer script travels inside the folder too
        shutil.copy2(INSTALLER / "linux" / "install.sh", folder / "install.sh")
        print(f"stripped {strip_interpreter(folder) / 2**20:.0f} MiB of debug data from the bundled Python")
    print(f"built {folder.relative_to(ROOT)} in {seconds:.0f} s; {folder_size(folder) / 2**20:.0f} MiB")
    if args.package:
        out = package(folder)
        print(f"packaged {out.relative_to(ROOT)} ({out.stat().st_size / 2**20:.0f} MiB)")
    return 0


if __name__ == "__main__":
    sys.exit(main())
