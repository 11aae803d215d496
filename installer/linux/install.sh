#!/bin/sh
# Install (or remove) the Slackline folder for this user, or for everyone with --system:
# copies the app, puts `slackline` and `slackline-gui` on the PATH, adds the menu entry,
# the icons and the .slw file type, and makes Slackline open .slw files.
#
#   ./install.sh                 this user: ~/.local/share/slackline, ~/.local/bin
#   sudo ./install.sh --system   everyone:  /opt/slackline, /usr/local/bin, /usr/local/share
#   ./install.sh --uninstall     (with --system too, to remove a system install)
set -eu

APP_ID=org.slackline.Slackline
MIME=application/x-slackline-workbook
HERE=$(cd "$(dirname "$0")" && pwd)
META="$HERE/_internal/resources/linux"
ICONS="$HERE/_internal/resources/icon"

SYSTEM=0
UNINSTALL=0
for arg in "$@"; do
  case "$arg" in
    --system) SYSTEM=1 ;;
    --uninstall) UNINSTALL=1 ;;
    -h|--help) sed -n '2,9p' "$0"; exit 0 ;;
    *) echo "install.sh: unknown option $arg (try --help)" >&2; exit 2 ;;
  esac
done

if [ "$SYSTEM" = 1 ]; then
  DEST=/opt/slackline; BIN=/usr/local/bin; DATA=/usr/local/share
else
  DATA=${XDG_DATA_HOME:-$HOME/.local/share}; DEST="$DATA/slackline"; BIN="$HOME/.local/bin"
fi

refresh() {
  command -v update-mime-database >/dev/null && update-mime-database "$DATA/mime" || true
  command -v update-desktop-database >/dev/null && update-desktop-database "$DATA/applications" || true
  command -v gtk-update-icon-cache >/dev/null && gtk-update-icon-cache -q -t "$DATA/icons/hicolor" || true
}

if [ "$UNINSTALL" = 1 ]; then
  rm -rf "$DEST"
  rm -f "$BIN/slackline" "$BIN/slackline-gui" "$DATA/applications/$APP_ID.desktop" \
        "$DATA/metainfo/$APP_ID.metainfo.xml" "$DATA/mime/packages/slackline-workbook.xml"
  rm -f "$DATA"/icons/hicolor/*/apps/$APP_ID.png "$DATA"/icons/hicolor/*/mimetypes/application-x-slackline-workbook.png \
        "$DATA/icons/hicolor/scalable/apps/$APP_ID.svg"
  refresh
  echo "Slackline removed from $DEST"
  exit 0
fi

[ -x "$HERE/slackline-gui" ] || { echo "install.sh: run me from the unpacked Slackline folder" >&2; exit 2; }

if [ "$HERE" != "$DEST" ]; then
  rm -rf "$DEST.new"; mkdir -p "$(dirname "$DEST")"
  cp -a "$HERE" "$DEST.new" && rm -rf "$DEST" && mv "$DEST.new" "$DEST"
fi
mkdir -p "$BIN" "$DATA/applications" "$DATA/metainfo" "$DATA/mime/packages"
ln -sf "$DEST/slackline" "$BIN/slackline"
ln -sf "$DEST/slackline-gui" "$BIN/slackline-gui"

# The menu entry runs the installed copy by its full path (~/.local/bin may not be on the
# desktop session's PATH).
sed -e "s|^Exec=slackline-gui|Exec=\"$DEST/slackline-gui\"|" -e "s|^TryExec=.*|TryExec=$DEST/slackline-gui|" \
    "$META/$APP_ID.desktop" > "$DATA/applications/$APP_ID.desktop"
cp "$META/$APP_ID.metainfo.xml" "$DATA/metainfo/"
cp "$META/slackline-workbook.xml" "$DATA/mime/packages/"
for size in 16 24 32 48 64 128 256 512; do
  for kind in apps mimetypes; do mkdir -p "$DATA/icons/hicolor/${size}x${size}/$kind"; done
  cp "$ICONS/slackline-$size.png" "$DATA/icons/hicolor/${size}x${size}/apps/$APP_ID.png"
  cp "$ICONS/slackline-$size.png" "$DATA/icons/hicolor/${size}x${size}/mimetypes/application-x-slackline-workbook.png"
done
mkdir -p "$DATA/icons/hicolor/scalable/apps"
cp "$ICONS/slackline.svg" "$DATA/icons/hicolor/scalable/apps/$APP_ID.svg"
refresh
if [ "$SYSTEM" = 0 ] && command -v xdg-mime >/dev/null; then
  xdg-mime default "$APP_ID.desktop" "$MIME" || true
fi
echo "Slackline installed in $DEST; start it from the menu, or run: $BIN/slackline-gui"
