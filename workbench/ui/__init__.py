"""The window (PySide6, pyqtgraph): one package per view, the workspace that holds them, and the
session they share. Layers and how a change flows: docs/architecture.md."""
