"""Write the bundled demo plans: ``python -m workbench.io.demo_files [FOLDER]``.

``demo.slw`` is the Kestrel Vale clinic fit-out as approved (``core.demo``);
``demo_update.slw`` the same plan three months later, with progress, the approved
baseline and three updates' odds trend (``core.demo_update``). Both are generated with
fixed seeds, so rewriting them changes nothing unless the scenario or the format changed.
"""

from __future__ import annotations

import sys
from pathlib import Path

from workbench.core.demo_update import demo_update_plan

from .planfile import dumps, plan_hash


def demo_update_text() -> str:
    return dumps(demo_update_plan(plan_hash))


def main(argv: list[str]) -> int:
    folder = Path(argv[0]) if argv else Path(__file__).resolve().parents[2] / "resources"
    (folder / "demo_update.slw").write_text(demo_update_text(), encoding="utf-8")
    print(f"wrote {folder / 'demo_update.slw'}")
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
