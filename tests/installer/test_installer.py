"""The installer files agree with each other and with the app: icon files, the Linux desktop
entry, MIME type and AppStream metainfo, the macOS Info.plist, the Windows Inno Setup
script, the PyInstaller spec and its launcher. No build here: installer/check_frozen.sh
builds and runs the frozen app before a release."""

from __future__ import annotations

import configparser
import fnmatch
import plistlib
import re
import shutil
import struct
import subprocess
import sys
from pathlib import Path
from xml.etree import ElementTree

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

import workbench

ROOT = Path(__file__).resolve().parents[2]
INSTALLER = ROOT / "installer"
ICON_DIR = ROOT / "resources" / "icon"
LINUX = ROOT / "resources" / "linux"
APP_ID = "org.slackline.Slackline"
MIME = "application/x-slackline-workbook"
MIME_NS = "{http://www.freedesktop.org/standards/shared-mime-info}"
sys.path.insert(0, str(INSTALLER))

import make_icons  # noqa: E402  (installer/ is not a package)


def png_size(blob: bytes) -> tuple[int, int]:
    """Width and height from a PNG's IHDR chunk (PNG specification, ISO/IEC 15948)."""
    assert blob[:8] == b"\x89PNG\r\n\x1a\n", "not PNG data"
    assert blob[12:16] == b"IHDR"
    return struct.unpack(">II", blob[16:24])


def spec_text() -> str:
    return (INSTALLER / "slackline.spec").read_text(encoding="utf-8")


def spec_executables() -> dict[str, bool]:
    """Executable name -> console flag, as the spec builds them."""
    found = re.findall(r'executable\("([^"]+)",\s*console=(True|False)\)', spec_text())
    return {name: flag == "True" for name, flag in found}


def desktop_entry() -> configparser.SectionProxy:
    parser = configparser.ConfigParser(interpolation=None)
    parser.optionxform = str  # keys are case-sensitive
    parser.read(LINUX / f"{APP_ID}.desktop", encoding="utf-8")
    return parser["Desktop Entry"]


def iss_text() -> str:
    return (INSTALLER / "windows" / "slackline.iss").read_text(encoding="utf-8")


def iss_defines() -> dict[str, str]:
    return dict(re.findall(r'#define\s+(\w+)\s+"([^"]*)"', iss_text()))


# --- the icon -------------------------------------------------------------------------

def test_every_png_size_exists_with_its_own_pixel_size():
    for size in make_icons.PNG_SIZES:
        assert png_size(make_icons.png_path(size).read_bytes()) == (size, size)


def test_ico_directory_points_at_png_images_of_the_stated_sizes():
    data = (ICON_DIR / "slackline.ico").read_bytes()
    reserved, kind, count = struct.unpack("<HHH", data[:6])
    assert (reserved, kind, count) == (0, 1, len(make_icons.ICO_SIZES))
    sizes = []
    for i in range(count):
        w, h, _, _, planes, bits, length, offset = struct.unpack("<BBBBHHII", data[6 + 16 * i:22 + 16 * i])
        side = w or 256
        assert (h or 256) == side and planes == 1 and bits == 32
        assert png_size(data[offset:offset + length]) == (side, side)
        sizes.append(side)
    assert sorted(sizes) == sorted(make_icons.ICO_SIZES)


def fake_png(size: int, payload: bytes) -> bytes:
    """Enough of a PNG for the writers: signature, IHDR with the size, then any bytes."""
    return b"\x89PNG\r\n\x1a\n" + struct.pack(">I4sII", 13, b"IHDR", size, size) + payload


@settings(max_examples=50, deadline=None)
@given(st.dictionaries(st.integers(1, 256), st.binary(max_size=64), min_size=1, max_size=12))
def test_ico_writer_directory_finds_every_image(images):
    pngs = {size: fake_png(size, payload) for size, payload in images.items()}
    data = make_icons.ico_bytes(pngs)
    count = struct.unpack("<HHH", data[:6])[2]
    found = {}
    for i in range(count):
        w, h, _, _, _, _, length, offset = struct.unpack("<BBBBHHII", data[6 + 16 * i:22 + 16 * i])
        found[w or 256] = data[offset:offset + length]
    assert found == pngs


def test_icns_entries_chain_to_the_end_of_the_file_and_hold_pngs():
    data = (ICON_DIR / "slackline.icns").read_bytes()
    assert data[:4] == b"icns" and struct.unpack(">I", data[4:8])[0] == len(data)
    pos, seen = 8, {}
    while pos < len(data):
        kind, length = data[pos:pos + 4].decode("ascii"), struct.unpack(">I", data[pos + 4:pos + 8])[0]
        seen[kind] = png_size(data[pos + 8:pos + length])[0]
        pos += length
    assert pos == len(data)
    assert seen == dict(make_icons.ICNS_TYPES)
    assert {"ic07", "ic08", "ic09", "ic10"} <= set(seen)  # 128, 256, 512, 1024 pixels


def test_the_committed_pngs_are_drawn_from_the_current_svg(qapp):
    from PySide6.QtGui import QImage

    svg = make_icons.SVG.read_bytes()
    for size in (32, 128):
        fresh = QImage.fromData(make_icons.render_png(svg, size))
        stored = QImage(str(make_icons.png_path(size)))
        diffs = [abs(a - b) for y in range(size) for x in range(size)
                 for a, b in zip(fresh.pixelColor(x, y).getRgb(), stored.pixelColor(x, y).getRgb())]
        assert sum(diffs) / len(diffs) < 2, "run installer/make_icons.py after editing slackline.svg"


def test_the_icon_uses_the_palette_on_a_transparent_corner(qapp):
    from PySide6.QtGui import QImage

    image = QImage(str(make_icons.png_path(256)))
    assert image.pixelColor(0, 0).alpha() == 0
    colours = {image.pixelColor(x, y).name() for y in range(0, 256, 4) for x in range(0, 256, 4)}
    assert {"#0072b2", "#e69f00", "#ffffff"} <= colours


# --- Linux ----------------------------------------------------------------------------

def test_desktop_entry_launches_the_windowed_executable_with_a_file():
    entry = desktop_entry()
    assert entry["Type"] == "Application" and entry["Name"] == "Slackline"
    program, *args = entry["Exec"].split()
    assert program in spec_executables() and spec_executables()[program] is False  # windowed
    assert args and args[0] in ("%f", "%F", "%u", "%U")
    assert entry["TryExec"] == program and entry["Terminal"] == "false"
    assert entry["Icon"] == APP_ID
    assert MIME in entry["MimeType"].split(";") and entry["MimeType"].endswith(";")
    categories = entry["Categories"].split(";")
    assert "Office" in categories and entry["Categories"].endswith(";")


def test_mime_type_globs_slw_and_its_magic_is_in_a_saved_plan(tmp_path):
    from workbench.core.demo import demo_plan
    from workbench.io.planfile import save_plan

    root = ElementTree.parse(LINUX / "slackline-workbook.xml").getroot()
    kind = root.find(f"{MIME_NS}mime-type")
    assert kind.get("type") == MIME
    globs = [g.get("pattern") for g in kind.findall(f"{MIME_NS}glob")]
    assert globs == ["*.slw"] and fnmatch.fnmatch("Quarry road.slw", globs[0])
    match = kind.find(f"{MIME_NS}magic/{MIME_NS}match")
    start, end = (int(v) for v in match.get("offset").split(":"))
    path = tmp_path / "plan.slw"
    save_plan(demo_plan(), path)
    value = match.get("value").encode("utf-8")
    assert value in path.read_bytes()[start:end + len(value)]


def test_metainfo_names_the_desktop_entry_the_version_and_the_file_type():
    root = ElementTree.parse(LINUX / f"{APP_ID}.metainfo.xml").getroot()
    assert root.tag == "component" and root.get("type") == "desktop-application"
    assert root.findtext("id") == APP_ID
    assert root.findtext("launchable") == f"{APP_ID}.desktop"
    assert (LINUX / root.findtext("launchable")).exists()
    assert root.find("releases/release").get("version") == workbench.__version__
    assert [m.text for m in root.findall("provides/mediatype")] == [MIME]
    assert {b.text for b in root.findall("provides/binary")} == set(spec_executables())
    assert root.findtext("summary") and root.find("description/p") is not None


@pytest.mark.skipif(not shutil.which("appstreamcli"), reason="appstreamcli is not installed")
def test_metainfo_passes_appstream_validation():
    result = subprocess.run(["appstreamcli", "validate", "--no-net", str(LINUX / f"{APP_ID}.metainfo.xml")],
                            capture_output=True, text=True)
    assert result.returncode == 0, result.stdout + result.stderr


@pytest.mark.skipif(not shutil.which("desktop-file-validate"), reason="desktop-file-validate is not installed")
def test_desktop_entry_passes_validation():
    result = subprocess.run(["desktop-file-validate", str(LINUX / f"{APP_ID}.desktop")], capture_output=True, text=True)
    assert result.returncode == 0 and "error" not in result.stdout, result.stdout + result.stderr


def fake_app_folder(tmp_path: Path) -> Path:
    folder = tmp_path / "Slackline"
    resources = folder / "_internal" / "resources"
    resources.mkdir(parents=True)
    shutil.copytree(LINUX, resources / "linux")
    shutil.copytree(ICON_DIR, resources / "icon")
    for name in spec_executables():
        (folder / name).write_text("#!/bin/sh\necho fake\n")
        (folder / name).chmod(0o755)
    shutil.copy2(INSTALLER / "linux" / "install.sh", folder / "install.sh")
    return folder


def test_linux_install_script_installs_and_removes_for_this_user(tmp_path):
    folder = fake_app_folder(tmp_path)
    home, data = tmp_path / "home", tmp_path / "my data"  # a space, as in many home folders
    env = {"HOME": str(home), "XDG_DATA_HOME": str(data), "PATH": "/usr/bin:/bin"}
    subprocess.run(["sh", str(folder / "install.sh")], env=env, check=True, capture_output=True)
    installed = data / "slackline"
    assert (installed / "slackline-gui").exists()
    assert (home / ".local" / "bin" / "slackline").resolve() == (installed / "slackline").resolve()
    desktop = (data / "applications" / f"{APP_ID}.desktop").read_text()
    assert f'Exec="{installed}/slackline-gui" %f' in desktop
    assert (data / "mime" / "packages" / "slackline-workbook.xml").exists()
    assert (data / "icons" / "hicolor" / "48x48" / "apps" / f"{APP_ID}.png").exists()
    assert (data / "icons" / "hicolor" / "48x48" / "mimetypes" / "application-x-slackline-workbook.png").exists()
    if shutil.which("desktop-file-validate"):  # the rewritten Exec line is still a valid entry
        check = subprocess.run(["desktop-file-validate", str(data / "applications" / f"{APP_ID}.desktop")],
                               capture_output=True, text=True)
        assert check.returncode == 0, check.stdout
    if shutil.which("update-mime-database"):  # the shared MIME database took the type and its glob
        assert f"{MIME}:*.slw" in (data / "mime" / "globs2").read_text(encoding="utf-8")
    subprocess.run(["sh", str(folder / "install.sh"), "--uninstall"], env=env, check=True, capture_output=True)
    assert not installed.exists() and not (data / "applications" / f"{APP_ID}.desktop").exists()
    assert not (home / ".local" / "bin" / "slackline").exists()


def test_linux_install_script_refuses_an_unknown_option(tmp_path):
    folder = fake_app_folder(tmp_path)
    result = subprocess.run(["sh", str(folder / "install.sh"), "--everywhere"], capture_output=True, text=True,
                            env={"HOME": str(tmp_path), "PATH": "/usr/bin:/bin"})
    assert result.returncode == 2 and "--everywhere" in result.stderr


# --- macOS and Windows ----------------------------------------------------------------

def test_info_plist_opens_slw_documents_with_the_windowed_executable():
    with open(INSTALLER / "macos" / "Info.plist", "rb") as handle:
        plist = plistlib.load(handle)
    assert plist["CFBundleExecutable"] in spec_executables()
    assert spec_executables()[plist["CFBundleExecutable"]] is False
    assert plist["LSBackgroundOnly"] is False
    assert (ICON_DIR / plist["CFBundleIconFile"]).exists()
    exported = {t["UTTypeIdentifier"]: t for t in plist["UTExportedTypeDeclarations"]}
    (document,) = plist["CFBundleDocumentTypes"]
    (uti,) = document["LSItemContentTypes"]
    tags = exported[uti]["UTTypeTagSpecification"]
    assert tags["public.filename-extension"] == ["slw"] and tags["public.mime-type"] == [MIME]
    assert document["CFBundleTypeRole"] == "Editor"


def test_inno_setup_script_associates_slw_and_adds_a_start_menu_entry():
    text, defines = iss_text(), iss_defines()
    exe = defines["AppExe"]
    assert exe.removesuffix(".exe") in spec_executables() and not spec_executables()[exe.removesuffix(".exe")]
    prog_id = defines["ProgId"]
    assert re.search(r'Subkey: "Software\\Classes\\\.slw"; .*ValueData: "\{#ProgId\}"', text)
    assert re.search(r'Subkey: "Software\\Classes\\\{#ProgId\}\\shell\\open\\command"; .*'
                     r'ValueData: """\{app\}\\\{#AppExe\}"" ""%1"""', text)
    assert prog_id and re.search(r'^Name: "\{group\}\\Slackline"; Filename: "\{app\}\\\{#AppExe\}"', text, re.M)
    assert re.search(r"^ChangesAssociations=yes$", text, re.M)
    icon = re.search(r"^SetupIconFile=(.+)$", text, re.M).group(1).strip()
    assert (INSTALLER / "windows" / icon.replace("\\", "/")).resolve() == ICON_DIR / "slackline.ico"
    folder = (INSTALLER / "windows" / defines["AppFolder"].replace("\\", "/")).resolve()
    assert folder == ROOT / "dist" / "Slackline"
    assert defines["AppVersion"] == workbench.__version__


# --- the spec, the launcher and the build script --------------------------------------

def test_spec_compiles_and_builds_a_windowed_and_a_console_executable():
    compile(spec_text(), "slackline.spec", "exec")
    assert spec_executables() == {"slackline-gui": False, "slackline": True}
    assert '(str(ROOT / "resources"), "resources")' in spec_text()
    assert 'INSTALLER / "launcher.py"' in spec_text() and (INSTALLER / "launcher.py").exists()
    for name in re.findall(r'ICON_DIR / "([^"]+)"', spec_text()):
        assert (ICON_DIR / name).exists(), name


@pytest.mark.parametrize("executable, gui", [("/opt/slackline/slackline-gui", True),
                                             ("C:/Program Files/Slackline/slackline-gui.exe", True),
                                             ("/opt/slackline/slackline", False),
                                             ("C:/Program Files/Slackline/slackline.exe", False)])
def test_launcher_chooses_by_executable_name(monkeypatch, executable, gui):
    import launcher

    monkeypatch.setattr(sys, "executable", executable)
    assert launcher._is_gui() is gui


def test_launcher_without_a_console_writes_messages_to_a_log(monkeypatch, tmp_path):
    import launcher

    monkeypatch.setenv("XDG_STATE_HOME", str(tmp_path))
    monkeypatch.setattr(sys, "stdout", None)
    monkeypatch.setattr(sys, "stderr", None)
    launcher._quiet_streams()
    print("a message with no console", file=sys.stderr)
    sys.stderr.flush()
    logs = list(tmp_path.rglob("slackline-gui.log"))
    assert logs and "a message with no console" in logs[0].read_text(encoding="utf-8")
    sys.stderr.close()


def test_build_script_reads_the_package_version():
    import importlib.util

    spec = importlib.util.spec_from_file_location("slackline_build", INSTALLER / "build.py")
    build = importlib.util.module_from_spec(spec)  # not `import build`: a PyPI package has that name
    spec.loader.exec_module(build)
    assert build.version() == workbench.__version__
    assert build.app_folder().parent == ROOT / "dist"


def test_windows_version_numbers_come_from_the_package_version():
    import win_version  # the resource itself is built on Windows only (PyInstaller needs pywin32 there)

    assert win_version.version_numbers("1.12.3rc4") == (1, 12, 3, 4)
    assert win_version.version_numbers("2.0") == (2, 0, 0, 0)
    assert len(win_version.version_numbers(workbench.__version__)) == 4
