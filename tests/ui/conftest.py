"""The window tests' fixtures: temporary settings and data folder, dialogs that answer at once, a window."""

from support.ui import ui_env, window  # noqa: F401 (fixtures)
