#!/bin/sh
# ctest install/destdir: `cmake --install` into a scratch DESTDIR, then every installed piece
# where it belongs and working.
# usage: install_check.sh BUILD_DIR SOURCE_DIR SCRATCH gui|nogui man|noman
set -eu
build=$1 source=$2 scratch=$3 gui=$4 man=$5
rm -rf "$scratch"
DESTDIR="$scratch" cmake --install "$build" --prefix /usr > "$scratch.log" 2>&1 || {
  cat "$scratch.log"; echo "install_check: cmake --install failed" >&2; exit 1; }
root=$scratch/usr
fail() { echo "install_check: $*" >&2; exit 1; }

# The programs, and the CLI runs from its installed place.
[ -x "$root/bin/terzo" ] || fail "bin/terzo missing or not executable"
"$root/bin/terzo" --version | grep -q "^terzo " || fail "installed terzo --version does not say terzo"
"$root/bin/terzo" inspect "$root/share/terzo/scales/equal-12.scl" > /dev/null ||
  fail "installed terzo cannot inspect an installed tuning"

# The library of tunings: every .scl of scales/, byte for byte.
count=0
for f in "$source"/scales/*.scl; do
  cmp -s "$f" "$root/share/terzo/scales/$(basename "$f")" || fail "share/terzo/scales/$(basename "$f") differs or is missing"
  count=$((count + 1))
done
[ "$count" -gt 0 ] || fail "no tunings in scales/"
[ "$(ls "$root/share/terzo/scales" | wc -l)" -eq "$count" ] || fail "share/terzo/scales holds files that are not in scales/"

if [ "$man" = man ]; then
  page=$root/share/man/man1/terzo.1
  [ -f "$page" ] || fail "share/man/man1/terzo.1 missing"
  grep -q '^\.TH TERZO "1"' "$page" || fail "terzo.1 has no man page header"
  # The page is the program's help: every subcommand the help lists appears in it.
  for sub in $("$root/bin/terzo" --help | awk '/^Subcommands:/ {on = 1; next} on && /^  [a-z]/ {print $1}'); do
    grep -q -- "$sub" "$page" || fail "terzo.1 does not mention the subcommand $sub"
    # Each subcommand has its own page, made from its own --help (its options appear in it).
    sub_page=$root/share/man/man1/terzo-$sub.1
    [ -f "$sub_page" ] || fail "share/man/man1/terzo-$sub.1 missing"
    grep -q '^\.SH OPTIONS\|^\.SH DESCRIPTION' "$sub_page" || fail "terzo-$sub.1 has no option section"
    grep -q -e '--help' -e '\\-\\-help' "$sub_page" || fail "terzo-$sub.1 does not list --help"
    grep -q "terzo-$sub" "$page" || fail "terzo.1 does not point to terzo-$sub(1)"
  done
fi

if [ "$gui" = gui ]; then
  [ -x "$root/bin/terzo-gui" ] || fail "bin/terzo-gui missing or not executable"
  desktop=$root/share/applications/terzo-gui.desktop
  [ -f "$desktop" ] || fail "share/applications/terzo-gui.desktop missing"
  grep -q '^Exec=terzo-gui' "$desktop" || fail "the desktop entry does not start terzo-gui"
  grep -q '^Icon=terzo$' "$desktop" || fail "the desktop entry does not name the icon terzo"
  grep -q '<svg' "$root/share/icons/hicolor/scalable/apps/terzo.svg" || fail "icon terzo.svg missing"
  [ -f "$root/share/terzo/assets/fonts/DejaVuSans.ttf" ] || fail "the window's font is not installed"
  if [ "$man" = man ]; then
    grep -q '^\.TH TERZO-GUI "1"' "$root/share/man/man1/terzo-gui.1" || fail "terzo-gui.1 missing"
  fi
fi
rm -rf "$scratch" "$scratch.log"
echo "install_check: ok ($count tunings, gui: $gui, man pages: $man)"
