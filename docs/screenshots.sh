#!/usr/bin/env bash
# Makes the guide's images from the real program, so they stay true:
#   docs/images/viewer-overview.png      the viewer under Xvfb with the three demo antennas
#   docs/images/viewer-polarisation.png  a headless 3D snapshot coloured by axial ratio, with ellipses
#   docs/images/small-loop-cut.png       a cut plot through the small loop's peak
#   docs/images/turnstile-band.png       the turnstile's figures against frequency
#   docs/images/turnstile-ar-map.png     the turnstile's axial ratio on Hammer's equal-area map
#   docs/images/coverage-horizon.png     coverage near the horizon: dipole, loop, best of both
#   docs/images/panel-NAME-SIZE.png      every panel (cut, probe, polarisation, diversity, band, map, fading)
#                                        at 1280x800 and 800x600
#   docs/images/viewer-mounting-SIZE.png a dipole along x read with FILE::up=+x (the mounting control,
#                                        the world-up gizmo and horizon ring) at 1280x800 and 800x600
#   docs/images/report-cut.png, report-3d.png   a cut figure and the 3D view of the report
#   docs/images/report-page.png          the guide's comparison report page as a browser shows it (headless
#                                        chromium, installed on demand through ./dev ensure; skipped
#                                        with a message when it cannot be had or cannot run)
#   docs/images/viewer-browser-SIZE.png  the in-window file browser (File > Open in this window)
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
# Every panel at the two window sizes the layout is checked at (nothing may overlap or be cut
# off): the cut comparing two antennas through a pin, probe, polarisation, diversity, band, map,
# fading and combining.
shot() {  # shot NAME SIZE OPTIONS...
  local name=$1 size=$2
  shift 2
  xvfb-run -a -s "-screen 0 1280x800x24" "$E" view "$X/printed-dipole.csv" "$X/turnstile.csv" "$X/small-loop.csv" \
    --size "$size" --frames 20 --screenshot "$I/panel-$name-$size.png" --force "$@"
}
for size in 1280x800 800x600; do
  shot cut "$size" --compare 2 --pin 60,30 --tab cut
  shot probe "$size" --pin 60,30 --tab probe
  shot polarisation "$size" --pin 30,45 --tab polarisation --translucent
  shot diversity "$size" --compare 3 --diversity
  shot band "$size" --band
  shot map "$size" --tab map
  shot fading "$size" --compare 2 --tab fading
done
# The cut's phase view of the turnstile (the phases of its theta, phi and circular parts).
for size in 1280x800 800x600; do
  xvfb-run -a -s "-screen 0 1280x800x24" "$E" view "$X/turnstile.csv" --size "$size" --frames 20 --force \
    --screenshot "$I/panel-cut-phase-$size.png" --pin 60,30 --tab cut --cut-style phase --cut-components theta,phi,rhcp,lhcp
done
# The mounting: a half-wave dipole along x, read with its +x axis up, beside the printed dipole; the
# diversity panel shows the MEG of a vertical dipole.
M=$(mktemp -d)
"$E" synth dipole --step 2 --rotate-y 90 --name "dipole along x" --out "$M/x-dipole.csv" >/dev/null
for size in 1280x800 800x600; do
  xvfb-run -a -s "-screen 0 1280x800x24" "$E" view "$M/x-dipole.csv::up=+x" "$X/printed-dipole.csv" \
    --size "$size" --frames 20 --screenshot "$I/viewer-mounting-$size.png" --force --diversity
done
rm -rf "$M"
# The in-window file browser, open in the examples folder.
for size in 1280x800 800x600; do
  xvfb-run -a -s "-screen 0 1280x800x24" "$E" view "$X/printed-dipole.csv" "$X/turnstile.csv" "$X/small-loop.csv" \
    --size "$size" --frames 20 --screenshot "$I/viewer-browser-$size.png" --force --browse "$X"
done
# The report: its cut figure and its 3D view, as the report's page shows them.
R=$(mktemp -d)
"$E" report "$X/small-loop.csv" --frequency 2.45e9 --out "$R/report" --force >/dev/null
cp "$R"/report/*-phi0.png "$I/report-cut.png"
cp "$R"/report/*-3d-axial-ratio.png "$I/report-3d.png"
# The page itself, its top 2000 px at 1280 px wide, in a headless browser. Chromium is heavy, so it
# is no build or test package: it is installed here on demand (./dev ensure), and the shot is
# skipped, saying why, when it cannot be installed or run (--no-sandbox: run as root in a container).
report_page() {
  local browser
  browser=$(command -v chromium || true)
  if [[ -z $browser ]]; then
    ./dev ensure chromium >/dev/null 2>&1 || true
    browser=$(command -v chromium || true)
  fi
  if [[ -z $browser ]]; then
    echo "screenshots: report-page.png skipped: chromium is not installed and could not be installed (apt-get install chromium)" >&2
    return 0
  fi
  # The comparison report the guide makes (section 9).
  "$E" report "$X/printed-dipole.csv" "$X/turnstile.csv" "$X/small-loop.csv" --environment indoor --frequency 2.45e9 \
    --out "$R/tracker" --force >/dev/null
  if ! timeout 120 "$browser" --headless --no-sandbox --disable-gpu --hide-scrollbars --window-size=1280,2000 \
      --screenshot="$R/page.png" "file://$R/tracker/index.html" >"$R/browser.log" 2>&1 || [[ ! -s $R/page.png ]]; then
    echo "screenshots: report-page.png skipped: chromium could not take the shot ($(tail -1 "$R/browser.log"))" >&2
    return 0
  fi
  cp "$R/page.png" "$I/report-page.png"
}
report_page
rm -rf "$R"
echo "screenshots: wrote $I/viewer-overview.png, viewer-polarisation.png, small-loop-cut.png, turnstile-band.png, turnstile-ar-map.png, coverage-horizon.png, panel-*-1280x800.png, panel-*-800x600.png, viewer-mounting-*.png, viewer-browser-*.png, report-cut.png, report-3d.png, report-page.png (unless skipped above)"
