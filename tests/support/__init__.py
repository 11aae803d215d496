"""Shared test helpers: invented plans (plans) and the window tests' set-up (ui)."""
