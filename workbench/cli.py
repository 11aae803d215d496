"""The ``slackline`` command: no arguments opens the window; verbs work headless.

    slackline [PLAN]                       open the window (on PLAN, or the last plan)
    slackline analyze PLAN [--start D] [--title T] [--deadline N|YYYY-MM-DD] [--json]
    slackline simulate PLAN [--start D] [--title T] [--iterations N] [--seed S] [--deadline ...] [--distribution D] [--json]
    slackline report PLAN -o pack.pdf [--start D] [--title T] [--paper a4|letter] [--iterations N] [--seed S]
    slackline import SRC.csv|SRC.xlsx -o PLAN.slw [--start YYYY-MM-DD] [--unit days|weeks] [--force]
    slackline export PLAN -o OUT.csv|OUT.xlsx
    slackline tradeoff PLAN [--deadline N|YYYY-MM-DD] [--confidence P] [--iterations N] [--seed S] [--json]
    slackline check PLAN [--json] [--strict] [--iterations N] [--seed S]
    slackline baseline PLAN.slw --name NAME [--approved] [--iterations N] [--seed S] [--list]

Exit codes: 0 success, 2 bad input (the message names the culprit), 1 an internal fault.
"""

from __future__ import annotations

import argparse
import os
import sys

from . import __version__

# verb → (module under workbench.cmdline, one-line help). A verb's module is imported only
# when that verb runs (or its --help is asked for): each verb pays only for what it needs.
VERBS = {
    "analyze": ("analyze", "critical path, floats and PERT odds"),
    "simulate": ("simulate", "Monte Carlo finish distribution and risk drivers"),
    "report": ("report", "write the approval pack (PDF)"),
    "import": ("import_table", "read a CSV/XLSX activity list into a .slw plan"),
    "export": ("export", "write the plan with its schedule to CSV/XLSX"),
    "tradeoff": ("tradeoff", "what it costs to buy time: cost curve, crash to a date or a confidence"),
    "check": ("check", "Checkup: grade the schedule's soundness (exit 1 with --strict when a check fails)"),
    "level": ("level", "level resources: a schedule within every resource's units"),
    "baseline": ("baseline", "record a named baseline in the plan file (or --list them)"),
}


def verb_module(verb: str):
    import importlib

    return importlib.import_module(f"workbench.cmdline.{VERBS[verb][0]}")


def build_parser(verb: str | None = None) -> argparse.ArgumentParser:
    """The parser; only ``verb``'s arguments are added (every verb's when ``verb`` is None)."""
    parser = argparse.ArgumentParser(prog="slackline", description="Slackline: schedules you can defend.")
    parser.add_argument("--version", action="version", version=f"slackline {__version__}")
    parser.add_argument("--self-test", action="store_true", help="run a small analysis, simulation and pack headless")
    sub = parser.add_subparsers(dest="verb", metavar="VERB")
    for name, (_module, help_text) in VERBS.items():
        p = sub.add_parser(name, help=help_text)
        if verb is None or verb == name:
            verb_module(name).add_arguments(p)
    return parser


def _dispatch(args) -> int:
    return verb_module(args.verb).run(args)


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
    # Only the verb that runs has its arguments added (and its module imported); with no
    # verb (--version, --help, --self-test) none is: the top-level help lists verbs by name.
    verb = next((word for word in argv if word in VERBS), "")
    args = build_parser(verb).parse_args(argv)  # exits 2 with usage on malformed arguments
    from .core.errors import PlanError  # after parsing: `--version` and `--help` stay instant

    try:
        if args.self_test:
            from .selftest import run_self_test
            return run_self_test()
        if args.verb is None:
            return open_window([])
        return _dispatch(args)
    except PlanError as exc:
        return _fail(_worded_for_here(exc, args), 2)
    except BrokenPipeError:  # output piped into a pager or `head` that stopped reading
        return _quiet_exit()
    except (OSError, UnicodeError) as exc:
        return _fail(f"{getattr(exc, 'filename', None) or ''} {exc.strerror if isinstance(exc, OSError) and exc.strerror else exc}".strip(), 2)
    except KeyboardInterrupt:
        return _fail("interrupted", 130)
    except Exception as exc:  # an internal fault: say so plainly, keep the trace for developers
        if os.environ.get("SLACKLINE_DEBUG"):
            raise
        return _fail(f"internal error ({type(exc).__name__}: {exc}); rerun with SLACKLINE_DEBUG=1 for details", 1)


def _worded_for_here(exc, args) -> str:
    """The refusal as the command line words it: a missing status date names how to give
    one with this verb."""
    from .core.errors import StatusDateMissing

    if not isinstance(exc, StatusDateMissing):
        return str(exc)
    from .cmdline.living import status_date_way
    return exc.with_way(status_date_way(args))


def _quiet_exit() -> int:
    """The reader of our output went away (``| head``): stop without a word. Standard output
    is pointed at the null device so the interpreter's final flush cannot complain either."""
    try:
        devnull = os.open(os.devnull, os.O_WRONLY)
        os.dup2(devnull, sys.stdout.fileno())
    except (OSError, ValueError):
        pass
    return 0


def open_window(argv: list[str]) -> int:
    try:
        from .ui.workspace.app import run_app
    except ImportError as exc:
        return _fail(f"the window needs the GUI extras: pip install 'slackline[gui]' ({exc})", 2)
    return run_app(argv)


def gui_main() -> int:
    """Entry point for the windowed launcher (no console on Windows)."""
    return open_window(sys.argv[1:])


if __name__ == "__main__":
    sys.exit(main())
