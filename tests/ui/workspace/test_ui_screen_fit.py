"""The window fits a 1024×768 projector and a 1366×768 laptop with every dock open, and a
saved position from a screen that is gone comes back onto the screen.

Each case runs in a child process on Qt's offscreen platform given one screen of that size
(its ``configfile`` option), so the window meets the screen as it would on the machine."""

import json
import os
import subprocess
import sys
from pathlib import Path

import pytest

DRIVER = Path(__file__).resolve().parents[2] / "support" / "fit_run.py"


def run(tmp_path, width, height, *extra):
    config = tmp_path / "screen.json"
    config.write_text(json.dumps({"screens": [{"name": "projector", "x": 0, "y": 0, "width": width,
                                               "height": height, "logicalDpi": 96, "dpr": 1}]}))
    env = {**os.environ, "QT_QPA_PLATFORM": f"offscreen:configfile={config}"}
    done = subprocess.run([sys.executable, str(DRIVER), str(tmp_path), str(width), str(height), *extra],
                          capture_output=True, text=True, timeout=180, env=env)
    assert done.returncode == 0, done.stderr[-3000:]
    return json.loads(done.stdout.strip().splitlines()[-1])


@pytest.mark.parametrize("width, height", [(1024, 768), (1366, 768)])
def test_every_dock_open_and_nothing_outside_the_screen(tmp_path, width, height):
    seen = run(tmp_path, width, height)
    assert seen["screen"] == [0, 0, width, height]
    assert seen["hidden_docks"] == []
    assert seen["outside"] == []
    assert seen["min_width"] <= width
    assert len(seen["widths"]) == 1          # bringing a tab forward never widens the window


def test_a_position_on_a_screen_that_is_gone_comes_back(tmp_path):
    seen = run(tmp_path, 1024, 768, "restore")
    assert seen["outside"] == []
