#!/bin/sh
# Release check (too slow for CI): build the Linux app folder, copy it somewhere else and
# run it there in a clean environment — `env -i`, PATH=/usr/bin:/bin (no venv, no
# PYTHONPATH), an empty HOME, the working directory outside the source tree — and prove it
# runs without the Python it was built from:
#   --version, --self-test (analysis, simulation, approval pack, Qt offscreen), analyze and
#   report on a plan, a bad path answered with exit 2 and no traceback, the Qt plugins on
#   disk, and the windowed launcher kept alive for a few seconds without mapping one file of
#   the build machine's Python or source tree.
# Prints the time of each step and `--version` start times against `python -m workbench`.
#
#   installer/check_frozen.sh              build, then check
#   installer/check_frozen.sh --no-build   check the existing dist/Slackline
set -eu

ROOT=$(cd "$(dirname "$0")/.." && pwd)
PY=${PYTHON:-$ROOT/.venv/bin/python}
[ -x "$PY" ] || PY=python3
BUILD=1
[ "${1:-}" = "--no-build" ] && BUILD=0

now() { date +%s.%N; }
since() { echo "$(now) $1" | awk '{printf "%.1f", $1 - $2}'; }
since_ms() { echo "$(now) $1" | awk '{printf "%.0f", ($1 - $2) * 1000}'; }
fail() { echo "FAIL  $*" >&2; exit 1; }
ok() { echo "ok    $*"; }

T0=$(now)
if [ "$BUILD" = 1 ]; then
  "$PY" "$ROOT/installer/build.py"
  ok "build ($(since "$T0") s)"
fi
[ -x "$ROOT/dist/Slackline/slackline" ] || fail "no dist/Slackline/slackline: build first"

WORK=$(mktemp -d)
trap 'rm -rf "$WORK"' EXIT INT TERM
T=$(now)
cp -a "$ROOT/dist/Slackline" "$WORK/app"
mkdir -p "$WORK/home" "$WORK/run" "$WORK/cwd"
chmod 700 "$WORK/run"
cp "$ROOT/tests/data/harbour_kiosk_v1.slw" "$WORK/cwd/plan.slw"
ok "relocated copy in $WORK/app ($(du -sm "$WORK/app" | cut -f1) MiB, $(since "$T") s)"
APP="$WORK/app"

clean() {
  (cd "$WORK/cwd" && env -i HOME="$WORK/home" PATH=/usr/bin:/bin LANG=C.UTF-8 \
     XDG_RUNTIME_DIR="$WORK/run" QT_QPA_PLATFORM=offscreen SLACKLINE_MULTI_INSTANCE=1 "$@")
}

for plugin in platforms/libqoffscreen.so platforms/libqxcb.so imageformats/libqsvg.so iconengines/libqsvgicon.so; do
  [ -f "$APP/_internal/PySide6/Qt/plugins/$plugin" ] || fail "Qt plugin $plugin is missing"
done
[ -d "$APP/_internal/resources/icons" ] || fail "resources/ is not bundled"
if [ -f "$ROOT/resources/demo.slw" ]; then
  cmp -s "$ROOT/resources/demo.slw" "$APP/_internal/resources/demo.slw" || fail "resources/demo.slw is not bundled (or is stale): rebuild"
fi
ok "Qt plugins (offscreen, xcb, svg image format and icon engine) and resources/ bundled"

VERSION=$(sed -n 's/^__version__ = "\(.*\)"/\1/p' "$ROOT/workbench/__init__.py")
T=$(now)
OUT=$(clean "$APP/slackline" --version)
[ "$OUT" = "slackline $VERSION" ] || fail "--version said '$OUT', expected 'slackline $VERSION'"
ok "--version: $OUT ($(since "$T") s, first run of the copy)"

T=$(now)
clean "$APP/slackline" --self-test > "$WORK/selftest.txt" 2>&1 || { cat "$WORK/selftest.txt"; fail "--self-test"; }
sed 's/^/      /' "$WORK/selftest.txt"
ok "--self-test ($(since "$T") s)"

T=$(now)
clean "$APP/slackline" analyze plan.slw --json > "$WORK/analysis.json" || fail "analyze"
"$PY" -c "import json,sys; d=json.load(open(sys.argv[1])); assert d" "$WORK/analysis.json" || fail "analyze --json is not JSON"
clean "$APP/slackline" report plan.slw -o pack.pdf --iterations 500 --seed 1 > /dev/null || fail "report"
[ "$(head -c 5 "$WORK/cwd/pack.pdf")" = "%PDF-" ] || fail "report did not write a PDF"
ok "analyze --json and report on a plan file ($(since "$T") s)"

set +e
clean "$APP/slackline" analyze no-such-plan.slw > "$WORK/bad.txt" 2>&1
CODE=$?
set -e
[ "$CODE" = 2 ] || fail "a missing plan file gave exit $CODE, expected 2"
grep -q Traceback "$WORK/bad.txt" && fail "a missing plan file printed a traceback"
ok "bad input: exit 2, message: $(head -n 1 "$WORK/bad.txt")"

T=$(now)
clean "$APP/slackline-gui" plan.slw > "$WORK/gui.txt" 2>&1 &
GUI=$!
sleep 12
kill -0 "$GUI" 2>/dev/null || { cat "$WORK/gui.txt"; fail "the windowed launcher exited early"; }
# The window records the plan it opened in its settings (files/last) once the plan is open.
grep -q "^last=$WORK/cwd/plan.slw$" "$WORK/home/.config/Slackline/Slackline.conf" 2>/dev/null \
  || fail "the window did not record plan.slw as opened (files/last in ~/.config/Slackline/Slackline.conf)"
# The launcher's own processes (the subshell and env exec into it; a bootloader may fork).
PIDS=$(for exe in /proc/[0-9]*/exe; do
         [ "$(readlink "$exe" 2>/dev/null)" = "$APP/slackline-gui" ] && basename "$(dirname "$exe")"
       done || true)
MAPS=$(for pid in $PIDS; do cat "/proc/$pid/maps" 2>/dev/null; done || true)
for pid in $PIDS; do kill "$pid" 2>/dev/null || true; done
kill "$GUI" 2>/dev/null || true; wait "$GUI" 2>/dev/null || true
[ -n "$MAPS" ] || fail "could not read the launcher's memory map"
echo "$MAPS" | grep -q "$WORK/app/_internal/PySide6" || fail "the launcher did not load the bundled Qt"
if echo "$MAPS" | grep -E -q "$ROOT/|/usr/lib/python3|/usr/local/lib/python3"; then
  echo "$MAPS" | grep -E "$ROOT/|/usr/lib/python3|/usr/local/lib/python3" | head -n 5 >&2
  fail "the launcher mapped files of the build machine's Python or source tree"
fi
[ -s "$WORK/gui.txt" ] && sed 's/^/      launcher said: /' "$WORK/gui.txt" | head -n 5
grep -q "QFontDatabase" "$WORK/gui.txt" "$WORK/selftest.txt" && fail "Qt found no fonts (see the lines above)"
grep -q Traceback "$WORK/gui.txt" && { cat "$WORK/gui.txt"; fail "the windowed launcher printed a traceback"; }
ok "windowed launcher up for 12 s with the plan open, only bundled Python and Qt mapped ($(since "$T") s)"

# The Linux installer script, for this (empty) HOME: the app on PATH through a symlink.
clean env XDG_DATA_HOME="$WORK/data" sh "$APP/install.sh" > /dev/null || fail "install.sh"
OUT=$(clean "$WORK/home/.local/bin/slackline" --version) || fail "the installed slackline did not start"
[ "$OUT" = "slackline $VERSION" ] || fail "the installed slackline said '$OUT'"
grep -q "Exec=\"$WORK/data/slackline/slackline-gui\" %f" "$WORK/data/applications/org.slackline.Slackline.desktop" \
  || fail "the installed menu entry does not run the installed copy"
clean env XDG_DATA_HOME="$WORK/data" sh "$WORK/data/slackline/install.sh" --uninstall > /dev/null || fail "install.sh --uninstall"
[ ! -e "$WORK/data/slackline" ] || fail "install.sh --uninstall left the app folder"
ok "install.sh: installed for a user, ran through ~/.local/bin, uninstalled"

# Start times: the frozen --version against the source tree's, alternating, three each.
: > "$WORK/frozen.t"; : > "$WORK/source.t"
for i in 1 2 3; do
  T=$(now); clean "$APP/slackline" --version > /dev/null; since_ms "$T" >> "$WORK/frozen.t"; echo >> "$WORK/frozen.t"
  T=$(now); (cd "$ROOT" && "$PY" -m workbench --version > /dev/null); since_ms "$T" >> "$WORK/source.t"; echo >> "$WORK/source.t"
done
F=$(sort -n "$WORK/frozen.t" | sed -n 2p); S=$(sort -n "$WORK/source.t" | sed -n 2p)
echo "info  --version start, median of 3: frozen $F ms, python -m workbench $S ms (ratio $(echo "$F $S" | awk '{printf "%.1f", $1 / ($2 > 0 ? $2 : 1)}'))"
echo "frozen check passed in $(since "$T0") s"
