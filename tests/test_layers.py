"""The layers below the window import no Qt (see the layer picture in the design notes).

A fresh interpreter imports core, io, figures and reports and every module under them,
then reports which Qt-related modules got loaded; there must be none.
"""

import json
import subprocess
import sys

import pytest

LAYERS = ["workbench.core", "workbench.io", "workbench.figures", "workbench.reports"]
FORBIDDEN = ("PySide6", "shiboken6", "pyqtgraph", "PyQt5", "PyQt6")

PROBE = r"""
import importlib, json, pkgutil, sys
layers = json.loads(sys.argv[1])
imported, failed = [], {}
for name in layers:
    package = importlib.import_module(name)
    imported.append(name)
    for info in pkgutil.walk_packages(package.__path__, prefix=name + "."):
        try:
            importlib.import_module(info.name)
            imported.append(info.name)
        except Exception as exc:  # reported, so a broken module cannot hide a Qt import
            failed[info.name] = f"{type(exc).__name__}: {exc}"
qt = sorted(m for m in sys.modules if m.split(".")[0] in json.loads(sys.argv[2]))
print(json.dumps({"imported": imported, "failed": failed, "qt": qt}))
"""


def _probe(layers):
    out = subprocess.run([sys.executable, "-c", PROBE, json.dumps(layers), json.dumps(FORBIDDEN)],
                         capture_output=True, text=True, timeout=300, check=True)
    return json.loads(out.stdout.strip().splitlines()[-1])


@pytest.fixture(scope="module")
def probe():
    return _probe(LAYERS)


def test_no_qt_below_the_window(probe):
    assert probe["qt"] == [], f"Qt modules loaded by {LAYERS}: {probe['qt']}"


def test_every_module_was_imported(probe):
    assert not probe["failed"], probe["failed"]
    for layer in LAYERS:
        assert layer in probe["imported"]
    assert "workbench.core.cpm" in probe["imported"] and "workbench.core.network" in probe["imported"]


def test_the_probe_can_see_qt():
    # The check itself must be able to fail: importing the window layer loads Qt.
    pytest.importorskip("PySide6")
    assert any(m.startswith("PySide6") for m in _probe(["workbench.ui"])["qt"])
