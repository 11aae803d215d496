"""Where the bundled resources live (the source tree, an installed copy or a frozen build)."""

from __future__ import annotations

import sys
from pathlib import Path


def resources_dir() -> Path:
    frozen = getattr(sys, "_MEIPASS", None)
    if frozen:
        return Path(frozen) / "resources"
    return Path(__file__).resolve().parent.parent / "resources"


def docs_dir() -> Path:
    """The user guides (docs/), beside resources/ in the source tree and in a frozen build."""
    return resources_dir().parent / "docs"


def demo_path() -> Path:
    return resources_dir() / "demo.slw"


def demo_update_path() -> Path:
    """The demo three months later: progress, the approved baseline, the odds trend."""
    return resources_dir() / "demo_update.slw"
