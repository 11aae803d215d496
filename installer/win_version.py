"""The Windows version resource of each executable (Explorer's Properties → Details and
Task Manager show its description and version). Used by slackline.spec on Windows."""

from __future__ import annotations

import re


def version_numbers(version: str) -> tuple[int, int, int, int]:
    """'0.1.0' -> (0, 1, 0, 0); a suffix such as 'rc1' is ignored beyond its digits."""
    parts = [int(p) for p in re.findall(r"\d+", version)[:4]]
    return tuple(parts + [0] * (4 - len(parts)))


def version_info(name: str, description: str, version: str):
    from PyInstaller.utils.win32 import versioninfo as vi

    numbers = version_numbers(version)
    strings = [("CompanyName", "The Slackline developers"), ("FileDescription", description),
               ("FileVersion", version), ("InternalName", name), ("OriginalFilename", f"{name}.exe"),
               ("ProductName", "Slackline"), ("ProductVersion", version), ("LegalCopyright", "MIT licence")]
    return vi.VSVersionInfo(
        ffi=vi.FixedFileInfo(filevers=numbers, prodvers=numbers),
        kids=[vi.StringFileInfo([vi.StringTable("040904B0", [vi.StringStruct(k, v) for k, v in strings])]),
              vi.VarFileInfo([vi.VarStruct("Translation", [0x0409, 1200])])])
