"""Support for the ``slackline`` command line (headless parts)."""
