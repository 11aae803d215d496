"""The screen the screenshot tools draw on: Qt's offscreen platform given one 1920×1080
screen (its ``configfile`` option), so a window shot at 1024×768 or 1920×1080 is drawn at
that size — the default offscreen screen is smaller and would squeeze the window."""

from __future__ import annotations

import json
import os
import tempfile


def use_shot_screen(width: int = 1920, height: int = 1080) -> None:
    """Unless a platform was chosen already, draw offscreen on one ``width`` × ``height`` screen."""
    if os.environ.get("QT_QPA_PLATFORM"):
        return
    fd, path = tempfile.mkstemp(prefix="slackline-screen-", suffix=".json")
    with os.fdopen(fd, "w") as f:
        json.dump({"screens": [{"name": "shots", "x": 0, "y": 0, "width": width, "height": height,
                                "logicalDpi": 96, "dpr": 1}]}, f)
    os.environ["QT_QPA_PLATFORM"] = f"offscreen:configfile={path}"
