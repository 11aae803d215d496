"""The layers: no Qt below the window (a fresh interpreter imports every module), the import
contracts of pyproject.toml (import-linter), and no import circles. See docs/architecture.md.

A fresh interpreter imports core, io, figures and reports and every module under them,
then reports which Qt-related modules got loaded; there must be none.
"""

import json
import os
import shutil
import subprocess
import sys
from pathlib import Path

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


# --- the import contracts in pyproject.toml, kept by import-linter ------------------------
ROOT = Path(__file__).resolve().parents[1]


def _lint(cwd: Path, pythonpath: Path) -> subprocess.CompletedProcess:
    env = dict(os.environ, PYTHONPATH=str(pythonpath))
    return subprocess.run([sys.executable, "-c", "from importlinter.cli import lint_imports_command; lint_imports_command()"],
                          cwd=cwd, env=env, capture_output=True, text=True, timeout=300)


def test_import_contracts_are_kept():
    out = _lint(ROOT, ROOT)
    assert out.returncode == 0, out.stdout + out.stderr
    assert "0 broken" in out.stdout


@pytest.mark.parametrize("module, line", [
    ("core/pert.py", "import PySide6.QtCore"),                     # Qt below the window
    ("figures/odds.py", "import workbench.reports.pack"),          # a lower layer importing a higher one
    ("ui/timeline/view.py", "import workbench.ui.odds.view"),       # one view importing another
    ("ui/odds/view.py", "import workbench.ui.workspace.window"),    # a view importing the workspace
])
def test_a_wrong_import_breaks_a_contract(tmp_path, module, line):
    shutil.copytree(ROOT / "workbench", tmp_path / "workbench", ignore=shutil.ignore_patterns("__pycache__"))
    shutil.copy(ROOT / "pyproject.toml", tmp_path / "pyproject.toml")
    target = tmp_path / "workbench" / module
    target.write_text(target.read_text(encoding="utf-8") + f"\n{line}\n", encoding="utf-8")
    out = _lint(tmp_path, tmp_path)
    assert out.returncode != 0 and "BROKEN" in out.stdout, out.stdout + out.stderr


def test_no_import_circles():
    import grimp
    import networkx as nx

    graph = grimp.build_graph("workbench")
    edges = nx.DiGraph((m, d) for m in graph.modules for d in graph.find_modules_directly_imported_by(m))
    assert list(nx.simple_cycles(edges)) == []
