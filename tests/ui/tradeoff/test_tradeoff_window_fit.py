"""The real window on a 1024×768 projector: the Trade-off dock (bottom left) and the Drivers
dock (bottom right) need no sideways scrolling, their views showing one chart at a time.

It runs in a child process on Qt's offscreen platform given one screen of that size (its
``configfile`` option), so the window meets the screen as it would on the machine."""

import json
import os
import subprocess
import sys
from pathlib import Path

DRIVER = Path(__file__).resolve().parents[2] / "support" / "tradeoff_fit_run.py"


def test_at_1024_by_768_the_tradeoff_and_drivers_docks_do_not_scroll_sideways(tmp_path):
    config = tmp_path / "screen.json"
    config.write_text(json.dumps({"screens": [{"name": "projector", "x": 0, "y": 0, "width": 1024,
                                               "height": 768, "logicalDpi": 96, "dpr": 1}]}))
    env = {**os.environ, "QT_QPA_PLATFORM": f"offscreen:configfile={config}"}
    done = subprocess.run([sys.executable, str(DRIVER), str(tmp_path), "1024", "768"],
                          capture_output=True, text=True, timeout=180, env=env)
    assert done.returncode == 0, done.stderr[-3000:]
    seen = json.loads(done.stdout.strip().splitlines()[-1])
    assert seen["screen"] == [0, 0, 1024, 768]
    tradeoff, drivers = seen["Trade-off"], seen["Drivers"]
    assert tradeoff["result"]                                   # the curve is drawn, not a blank view
    assert tradeoff["dock"][0] < 700 and drivers["dock"][0] < 500      # the docks the planner saw
    for dock in (tradeoff, drivers):
        assert not dock["horizontal_bar"] and dock["view_width"] <= dock["viewport_width"]
        assert dock["narrow"]
    assert tradeoff["titles_whole"] == [True, True]            # each chart brought forward, its title whole
