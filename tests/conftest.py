"""Shared test set-up: Qt offscreen, temporary settings and data folders."""

import os

os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")
