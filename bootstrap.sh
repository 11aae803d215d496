#!/bin/sh
# Get Slackline ready to run from this folder:
#   1. Python 3.11 or newer, with its virtual-environment module (on Debian/Ubuntu the
#      python3.X-venv package is installed with apt when it is missing);
#   2. a virtual environment in .venv with Slackline and its window (pip install -e .[gui]);
#   3. the system libraries Qt's window needs, found the way the loader finds them
#      (python -m workbench.syslibs): on Debian/Ubuntu installed with apt, elsewhere named.
# Administrator rights are asked for (sudo) only when something has to be installed.
# Then:  . .venv/bin/activate && slackline resources/demo.slw
set -eu
cd "$(dirname "$0")"
PY=${PYTHON:-python3}

say() { printf 'bootstrap: %s\n' "$*"; }

as_root() {
    if [ "$(id -u)" = 0 ]; then
        "$@"
    elif command -v sudo >/dev/null 2>&1; then
        say "administrator rights needed: sudo may ask for your password"
        sudo "$@"
    else
        say "run this as root, then run bootstrap.sh again: $*"
        return 1
    fi
}

if ! command -v "$PY" >/dev/null 2>&1; then
    say "no $PY found: install Python 3.11 or newer (Debian/Ubuntu: sudo apt-get install python3)"
    exit 1
fi
if ! "$PY" -c 'import sys; sys.exit(sys.version_info < (3, 11))'; then
    say "Slackline needs Python 3.11 or newer; $PY is $("$PY" -V 2>&1)"
    exit 1
fi

if [ ! -x .venv/bin/python ]; then
    if ! "$PY" -c 'import ensurepip, venv' >/dev/null 2>&1; then
        version=$("$PY" -c 'import sys; print("%d.%d" % sys.version_info[:2])')
        if command -v apt-get >/dev/null 2>&1; then
            say "Python's virtual-environment module is missing: installing python$version-venv"
            as_root apt-get install -y "python$version-venv" || {
                as_root apt-get update && as_root apt-get install -y "python$version-venv"; }
        else
            say "Python's virtual-environment module (venv with ensurepip) is missing: install it"
            exit 1
        fi
    fi
    say "making the virtual environment .venv"
    "$PY" -m venv .venv
fi

say "installing Slackline and its window into .venv"
.venv/bin/python -m pip install -q -e ".[gui]"

say "checking the system libraries of Qt's window"
.venv/bin/python -m workbench.syslibs --install
say "ready: . .venv/bin/activate && slackline resources/demo.slw"
