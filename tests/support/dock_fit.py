"""Runs ``dock_fit_run.py`` in a child process on Qt's offscreen platform given one screen
of the size asked (its ``configfile`` option), so the maximized window meets the screen as
it would on a projector; returns what the driver measured."""

import json
import os
import subprocess
import sys
from pathlib import Path

DRIVER = Path(__file__).resolve().parent / "dock_fit_run.py"


def run_window(tmp_path, width: int, height: int, dock: str) -> dict:
    config = tmp_path / "screen.json"
    config.write_text(json.dumps({"screens": [{"name": "projector", "x": 0, "y": 0, "width": width,
                                               "height": height, "logicalDpi": 96, "dpr": 1}]}))
    env = {**os.environ, "QT_QPA_PLATFORM": f"offscreen:configfile={config}"}
    done = subprocess.run([sys.executable, str(DRIVER), str(tmp_path), str(width), str(height), dock],
                          capture_output=True, text=True, timeout=180, env=env)
    assert done.returncode == 0, done.stderr[-3000:]
    return json.loads(done.stdout.strip().splitlines()[-1])
