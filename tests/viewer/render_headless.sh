#!/usr/bin/env bash
# Headless snapshot: `ellipsa render` with DISPLAY (and WAYLAND_DISPLAY) unset writes a PNG of
# the asked size with surface pixels; it refuses to overwrite without --force and leaves the
# existing file untouched; bad options are usage errors (exit 2).
set -euo pipefail
: "${ELLIPSA:?}" "${PNG_CHECK:?}"
out=$(mktemp -d)
trap 'rm -rf "$out"' EXIT
unset DISPLAY WAYLAND_DISPLAY
"$ELLIPSA" synth crossed-dipoles --step 2 --out "$out/turnstile.csv" >/dev/null
"$ELLIPSA" render "$out/turnstile.csv" --out "$out/snap.png" --size 640x480 --view 30,20
"$PNG_CHECK" "$out/snap.png" 640 480 0.04
"$ELLIPSA" render "$out/turnstile.csv" --out "$out/ar.png" --size 500x400 --color-by axial-ratio --component rhcp --glyphs
"$PNG_CHECK" "$out/ar.png" 500 400 0.04
before=$(cksum < "$out/snap.png")
if "$ELLIPSA" render "$out/turnstile.csv" --out "$out/snap.png" --size 320x240 2>"$out/err"; then
  echo "render overwrote an existing file without --force"; exit 1
fi
grep -q -- "--force" "$out/err"
[[ "$(cksum < "$out/snap.png")" == "$before" ]]
"$ELLIPSA" render "$out/turnstile.csv" --out "$out/snap.png" --size 320x240 --force
"$PNG_CHECK" "$out/snap.png" 320 240 0.04
set +e
"$ELLIPSA" render "$out/turnstile.csv" --out "$out/x.png" --view nonsense 2>/dev/null; rc=$?
set -e
[[ $rc -eq 2 ]] || { echo "bad --view gave exit $rc, expected 2"; exit 1; }
# An unknown component is a usage error (exit 2) and writes nothing.
set +e
"$ELLIPSA" render "$out/turnstile.csv" --out "$out/bad.png" --component sideways 2>/dev/null; rc=$?
set -e
[[ $rc -eq 2 ]] || { echo "unknown component gave exit $rc, expected 2"; exit 1; }
[[ ! -e $out/bad.png ]]
ls "$out"/.*tmp* 2>/dev/null && { echo "temporary file left behind"; exit 1; }
"$ELLIPSA" --version | grep -q "OpenGL: "
# The window needs a display: without one, `view` says so and exits 1 instead of hanging.
set +e
timeout 60 "$ELLIPSA" view --frames 1 2>"$out/err"; rc=$?
set -e
[[ $rc -eq 1 ]] || { echo "view without a display gave exit $rc, expected 1"; exit 1; }
grep -qi "display" "$out/err"
echo "render_headless: ok"
# A pattern sampled over the upper hemisphere only (theta 0..90): the directions below the horizon
# are drawn as the quiet "not measured" region (hatched light grey), not as a hole; seen from
# below, its grey fills much of the view's lower part, where a full sphere has none of it. The 3D
# file names it as a node of its own.
"$ELLIPSA" synth small-loop --step 3 --out "$out/loop.csv" >/dev/null
awk -F, '/^#/ {print; next} !t {for (i = 1; i <= NF; i++) if ($i == "theta") t = i; print; next} $t <= 90' \
  "$out/loop.csv" > "$out/upper.csv"
neutral_box=0.05,0.45,0.80,0.90
"$ELLIPSA" render "$out/upper.csv" --out "$out/upper.png" --size 640x480 --view 35,-35
"$PNG_CHECK" "$out/upper.png" 640 480 0.02 "neutral:$neutral_box:0.08:1"
"$ELLIPSA" render "$out/loop.csv" --out "$out/full.png" --size 640x480 --view 35,-35
"$PNG_CHECK" "$out/full.png" 640 480 0.02 "neutral:$neutral_box:0:0.03"
"$ELLIPSA" render "$out/upper.csv" --out "$out/upper.glb" >/dev/null
grep -a -q '"nodes":\[{"mesh":0,"name":"[^"]*"},{"mesh":1,"name":"not measured"}\]' "$out/upper.glb" ||
  { echo "the glTF file of a hemisphere has no node named 'not measured'"; exit 1; }
"$ELLIPSA" render "$out/loop.csv" --out "$out/full.glb" >/dev/null
if grep -a -q '"not measured"' "$out/full.glb"; then echo "a full sphere's glTF file names a 'not measured' node"; exit 1; fi
