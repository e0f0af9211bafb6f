#!/usr/bin/env bash
# The windowed smoke test with Mesa's software renderer forced (--software), on two patterns
# compared (A minus B), with a pinned direction and the cut through it: every panel has content.
set -euo pipefail
: "${ELLIPSA:?}" "${PNG_CHECK:?}"
source "$(dirname "${BASH_SOURCE[0]}")/preamble.sh"  # xvfb-run or skip, $out, XDG_CONFIG_HOME
"$ELLIPSA" synth crossed-dipoles --step 2 --out "$out/a.csv" >/dev/null
"$ELLIPSA" synth dipole --step 2 --out "$out/b.csv" >/dev/null
"$XVFB_RUN" -a -s "-screen 0 1400x900x24" "$ELLIPSA" view "$out/a.csv" "$out/b.csv" --software --size 1024x700 \
  --frames 4 --screenshot "$out/shot.png" --color-by difference --compare 2 --pin 40,30 --frame-stats \
  --export-cut "$out/cut.svg" --export-view "$out/view.png" > "$out/stats.json"
# 1024 x 700 is a narrow window: the header and the key strip beside the scene leave it about 2.9 %.
"$PNG_CHECK" "$out/shot.png" 1024 700 0.02
# The exported cut is well-formed SVG with the A and B curves (one path each at least).
if command -v xmllint >/dev/null; then xmllint --noout "$out/cut.svg"; fi
[[ $(grep -c "<path" "$out/cut.svg") -ge 2 ]]
# The view export from inside the window (a headless context beside the window's) works.
"$PNG_CHECK" "$out/view.png" 1200 900 0.04
# One JSON line with the three figures.
[[ $(wc -l < "$out/stats.json") -eq 1 ]]
grep -Eq '^\{"frames": 4, "median_ms": [0-9.]+, "p95_ms": [0-9.]+\}$' "$out/stats.json"
# A bad file in a scripted run is reported and the run fails (exit 1, issue 14): never the
# examples in its place.
printf 'not a pattern\n' > "$out/bad.csv"
rc=0
"$XVFB_RUN" -a -s "-screen 0 1400x900x24" "$ELLIPSA" view "$out/bad.csv" --software --frames 2 --screenshot "$out/bad.png" 2> "$out/err" || rc=$?
[[ $rc == 1 ]]
grep -q "bad.csv" "$out/err"
[[ ! -e "$out/bad.png" ]]
