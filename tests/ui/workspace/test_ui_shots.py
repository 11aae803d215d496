"""Screenshots render at 1920×1080; the main window shows critical activities in the
critical colour (a pixel fact, not a stored image)."""

import os
import subprocess
import sys

from PySide6.QtGui import QColor, QImage

from support.ui import sample_plan
from workbench.figures import style
from workbench.io.planfile import save_plan


def count_colour(image: QImage, colour: str, step: int = 1) -> int:
    target = QColor(colour).rgb() & 0xFFFFFF
    return sum(1 for y in range(0, image.height(), step) for x in range(0, image.width() // 2, step)
               if image.pixel(x, y) & 0xFFFFFF == target)


def test_shots_render_main_window_and_existing_views(tmp_path):
    plan_path = tmp_path / "refit.slw"
    save_plan(sample_plan(), plan_path)
    out = tmp_path / "shots"
    env = dict(os.environ, QT_QPA_PLATFORM="offscreen", XDG_CONFIG_HOME=str(tmp_path / "config"))
    result = subprocess.run([sys.executable, "-m", "workbench.ui.shots", str(out), str(plan_path)],
                            env=env, capture_output=True, text=True, timeout=300)
    assert result.returncode == 0, result.stderr[-3000:]
    main = QImage(str(out / "main.png"))
    assert (main.width(), main.height()) == (1920, 1080)
    assert count_colour(main, style.CRITICAL, 1) > 20  # critical ids are drawn in the critical colour
    listed = [line.strip() for line in result.stdout.splitlines() if line.strip().endswith(".png")]
    for name in listed:
        assert QImage(name).size().width() == (1024 if name.endswith("main-1024x768.png") else 1920)
    assert any(name.endswith("main-1024x768.png") for name in listed)
