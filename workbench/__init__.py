"""Slackline: a desktop workbench for project planners."""

__version__ = "0.1.0"
