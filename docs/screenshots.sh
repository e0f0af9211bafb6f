#!/usr/bin/env bash
# Makes the guide's images from the real program, so they stay true:
#   docs/images/viewer-overview.png      the viewer under Xvfb with the three demo antennas
#   docs/images/viewer-polarisation.png  a headless 3D snapshot coloured by axial ratio, with ellipses
#   docs/images/small-loop-cut.png       a cut plot through the small loop's peak
#   docs/images/turnstile-band.png       the turnstile's figures against frequency
#   docs/images/turnstile-ar-map.png     the turnstile's axial ratio on Hammer's equal-area map
#   docs/images/coverage-horizon.png     coverage near the horizon: dipole, loop, best of both
set -euo pipefail
cd "$(dirname "$0")/.."
E=build/ellipsa
X=examples
I=docs/images
mkdir -p "$I"
export XDG_CONFIG_HOME=$(mktemp -d)  # a first run: default settings, not the developer's own
trap 'rm -rf "$XDG_CONFIG_HOME"' EXIT
xvfb-run -a -s "-screen 0 1280x800x24" "$E" view "$X/printed-dipole.csv" "$X/turnstile.csv" "$X/small-loop.csv" \
  --size 1280x800 --frames 20 --screenshot "$I/viewer-overview.png" --force
"$E" render "$X/small-loop.csv" --frequency 2.45e9 --color-by axial-ratio --glyphs --size 1000x750 \
  --out "$I/viewer-polarisation.png" --force
"$E" cut "$X/small-loop.csv" --frequency 2.45e9 --through-peak \
  --components total,vertical,horizontal,rhcp,lhcp --size 1000x750 --out "$I/small-loop-cut.png" --force
"$E" band "$X/turnstile.csv" --show gain,efficiency,axial-ratio,ar-beamwidth --size 1000x800 \
  --out "$I/turnstile-band.png" --force
"$E" map "$X/turnstile.csv" --frequency 2.45e9 --show axial-ratio --size 1000x600 --out "$I/turnstile-ar-map.png" --force
"$E" coverage "$X/printed-dipole.csv" "$X/small-loop.csv" --frequency 2.45e9 --horizon 30 --size 1000x750 \
  --out "$I/coverage-horizon.png" --force
echo "screenshots: wrote $I/viewer-overview.png, viewer-polarisation.png, small-loop-cut.png, turnstile-band.png, turnstile-ar-map.png, coverage-horizon.png"
