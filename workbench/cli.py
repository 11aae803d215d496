"""The ``slackline`` command: no arguments opens the window; verbs work headless.

    slackline [PLAN]                       open the window (on PLAN, or the last plan)
    slackline analyze PLAN [--deadline N|YYYY-MM-DD] [--json]
    slackline simulate PLAN [--iterations N] [--seed S] [--deadline ...] [--distribution D] [--json]
    slackline report PLAN -o pack.pdf [--paper a4|letter] [--iterations N] [--seed S]
    slackline import SRC.csv|SRC.xlsx -o PLAN.slw [--start YYYY-MM-DD] [--unit days|weeks]
    slackline export PLAN -o OUT.csv|OUT.xlsx

Exit codes: 0 success, 2 bad input (the message names the culprit), 1 an internal fault.
"""

from __future__ import annotations

import argparse
import os
import sys

from . import __version__

VERBS = ("analyze", "simulate", "report", "import", "export")
DISTRIBUTION_CHOICES = ("beta-pert", "triangular", "uniform", "normal")


def build_parser() -> argparse.ArgumentParser:
    parser = argparse.ArgumentParser(prog="slackline", description="Slackline: schedules you can defend.")
    parser.add_argument("--version", action="version", version=f"slackline {__version__}")
    parser.add_argument("--self-test", action="store_true", help="run a small analysis, simulation and pack headless")
    sub = parser.add_subparsers(dest="verb", metavar="VERB")

    p = sub.add_parser("analyze", help="critical path, floats and PERT odds")
    p.add_argument("plan", metavar="PLAN", help=".slw, .csv or .xlsx")
    p.add_argument("--deadline", metavar="N|YYYY-MM-DD")
    p.add_argument("--json", action="store_true", help="one JSON object on stdout")

    p = sub.add_parser("simulate", help="Monte Carlo finish distribution and risk drivers")
    p.add_argument("plan", metavar="PLAN")
    p.add_argument("--iterations", type=int, default=10_000, metavar="N")
    p.add_argument("--seed", type=int, default=None, metavar="S")
    p.add_argument("--deadline", metavar="N|YYYY-MM-DD")
    p.add_argument("--distribution", choices=DISTRIBUTION_CHOICES, default=None)
    p.add_argument("--json", action="store_true")

    p = sub.add_parser("report", help="write the approval pack (PDF)")
    p.add_argument("plan", metavar="PLAN")
    p.add_argument("-o", "--output", required=True, metavar="PACK.pdf")
    p.add_argument("--paper", choices=("a4", "letter"), default="a4")
    p.add_argument("--iterations", type=int, default=10_000, metavar="N")
    p.add_argument("--seed", type=int, default=None, metavar="S")

    p = sub.add_parser("import", help="read a CSV/XLSX activity list into a .slw plan")
    p.add_argument("source", metavar="SRC")
    p.add_argument("-o", "--output", required=True, metavar="PLAN.slw")
    p.add_argument("--start", metavar="YYYY-MM-DD")
    p.add_argument("--unit", choices=("days", "weeks"), default="days")

    p = sub.add_parser("export", help="write the plan with its schedule to CSV/XLSX")
    p.add_argument("plan", metavar="PLAN")
    p.add_argument("-o", "--output", required=True, metavar="OUT")
    return parser


def _dispatch(args) -> int:
    from .cmdline import verbs

    handlers = {"analyze": verbs.cmd_analyze, "simulate": verbs.cmd_simulate, "report": verbs.cmd_report,
                "import": verbs.cmd_import, "export": verbs.cmd_export}
    return handlers[args.verb](args)


def _not_a_plan(word: str) -> str | None:
    """Why ``slackline WORD`` cannot open WORD in the window (a typo of a verb, a missing file)."""
    if os.path.exists(word):
        return None
    if os.path.splitext(word)[1].lower() in (".slw", ".csv", ".xlsx"):
        return f"{word}: no such file"
    return f"unknown verb or file {word!r} (verbs: {', '.join(VERBS)}; or give a plan file to open)"


def _fail(message: str, code: int) -> int:
    print(f"slackline: error: {message}", file=sys.stderr)
    return code


def main(argv: list[str] | None = None) -> int:
    argv = sys.argv[1:] if argv is None else list(argv)
    if not argv or (argv[0] not in VERBS and not argv[0].startswith("-")):
        problem = _not_a_plan(argv[0]) if argv else None
        return _fail(problem, 2) if problem else open_window(argv)
    args = build_parser().parse_args(argv)  # exits 2 with usage on malformed arguments
    from .core.errors import PlanError  # after parsing: `--version` and `--help` stay instant

    try:
        if args.self_test:
            from .selftest import run_self_test
            return run_self_test()
        if args.verb is None:
            return open_window([])
        return _dispatch(args)
    except PlanError as exc:
        return _fail(str(exc), 2)
    except (OSError, UnicodeError) as exc:
        return _fail(f"{getattr(exc, 'filename', None) or ''} {exc.strerror if isinstance(exc, OSError) and exc.strerror else exc}".strip(), 2)
    except BrokenPipeError:  # output piped into a pager or `head` that stopped reading
        sys.stderr.close()
        return 0
    except KeyboardInterrupt:
        return _fail("interrupted", 130)
    except Exception as exc:  # an internal fault: say so plainly, keep the trace for developers
        if os.environ.get("SLACKLINE_DEBUG"):
            raise
        return _fail(f"internal error ({type(exc).__name__}: {exc}); rerun with SLACKLINE_DEBUG=1 for details", 1)


def open_window(argv: list[str]) -> int:
    try:
        from .ui.app import run_app
    except ImportError as exc:
        return _fail(f"the window needs the GUI extras: pip install 'slackline[gui]' ({exc})", 2)
    return run_app(argv)


def gui_main() -> int:
    """Entry point for the windowed launcher (no console on Windows)."""
    return open_window(sys.argv[1:])


if __name__ == "__main__":
    sys.exit(main())
