#!/usr/bin/env bash
# Windowed smoke test: the viewer opens the example under Xvfb, draws 5 frames and writes a
# screenshot of the right size, not blank, with surface pixels (checked by png_check).
set -euo pipefail
: "${ELLIPSA:?}" "${PNG_CHECK:?}"
source "$(dirname "${BASH_SOURCE[0]}")/preamble.sh"  # xvfb-run or skip, $out, XDG_CONFIG_HOME
# The pointer rests over the 3D view, so hover picking and the probe run too.
"$XVFB_RUN" -a -s "-screen 0 1400x900x24" "$ELLIPSA" view ${VIEW_EXTRA:-} --size 1280x800 --frames 5 --cursor 620,240 \
  --screenshot "$out/shot.png"
"$PNG_CHECK" "$out/shot.png" 1280 800 0.03
# --browse: the in-window file browser open from the start, in a folder that exists and in one
# that does not (the browser says it cannot be read; the viewer draws on and exits 0).
if [[ -z "${VIEW_EXTRA:-}" ]]; then
  "$XVFB_RUN" -a -s "-screen 0 1400x900x24" "$ELLIPSA" view --size 800x600 --frames 3 --browse "$out" --screenshot "$out/browse.png"
  "$PNG_CHECK" "$out/browse.png" 800 600 0  # the browser covers most of the surface
  "$XVFB_RUN" -a -s "-screen 0 1400x900x24" "$ELLIPSA" view --size 800x600 --frames 3 --browse "$out/no such folder"
fi
# Settings persist: an interactive run (no --frames) that is closed by SIGTERM saves viewer.conf
# and imgui.ini under $XDG_CONFIG_HOME/ellipsa, with the opened file in the recent list.
if [[ -z "${VIEW_EXTRA:-}" ]]; then
  "$ELLIPSA" synth small-loop --step 3 --out "$out/loop.csv" >/dev/null
  # A loaded machine may need longer before the first frame: give it 6, 20, then 60 s.
  saved=0
  for wait_s in 6 20 60; do
    rm -rf "$XDG_CONFIG_HOME/ellipsa"
    "$XVFB_RUN" -a -s "-screen 0 1400x900x24" bash -c \
      '"$0" view "$1" --size 800x600 & p=$!; sleep "$2"; kill -TERM $p; wait $p' "$ELLIPSA" "$out/loop.csv" "$wait_s" || true
    if grep -q "^recent = .*loop.csv$" "$XDG_CONFIG_HOME/ellipsa/viewer.conf" 2>/dev/null &&
       grep -q "^window_width = 800$" "$XDG_CONFIG_HOME/ellipsa/viewer.conf" &&
       [[ -s "$XDG_CONFIG_HOME/ellipsa/imgui.ini" ]]; then
      saved=1; break
    fi
    echo "settings not saved after ${wait_s} s; trying with more time"
  done
  [[ $saved == 1 ]] || { echo "settings were not saved on SIGTERM"; exit 1; }
fi
