#!/usr/bin/env bash
# Regenerates every file of the demo scenario (examples/README.md) from the closed-form models in
# scenario.py, deterministically (the range noise has a fixed seed). The scenario and every number
# in it are invented for the demo. Needs Debian's python3-numpy; build/ellipsa (or $ELLIPSA) reads
# each file back as a check.
set -euo pipefail
cd "$(dirname "$0")"
E=${ELLIPSA:-../build/ellipsa}
/usr/bin/python3 scenario.py models .
/usr/bin/python3 scenario.py range measured-loop-range.csv
for f in printed-dipole.csv turnstile.csv small-loop.csv; do "$E" info "$f" --frequency 2.45e9 >/dev/null; done
"$E" info measured-loop-range.csv --map-file measured-loop.map --frequency 2.45e9 >/dev/null
echo "examples: wrote printed-dipole.csv turnstile.csv small-loop.csv measured-loop-range.csv"

# A turnstile over a band (2.30-2.60 GHz, 7 frequencies, 5-degree grid): fed through a quadrature
# hybrid whose phase drifts 8 deg per 50 MHz from -90 deg at 2.45 GHz, and matched best at
# 2.45 GHz (efficiency falling off on both sides). Invented, for the figures against frequency.
tb=()
for k in -3 -2 -1 0 1 2 3; do
  f=$(/usr/bin/python3 -c "print(2.45e9 + $k * 50e6)")
  ph=$(/usr/bin/python3 -c "print(-90 + 8 * $k)")
  eff=$(/usr/bin/python3 -c "print(round(0.74 - 0.05 * $k * $k, 3))")
  "$E" synth crossed-dipoles --phase "$ph" --step 5 --frequency "$f" --out "$tmp/tb-$k.csv"
  /usr/bin/python3 perturb.py --add "$tmp/tb-$k.csv" 1@0 --ground-tilt 0.15 --efficiency "$eff" \
    --noise-db 0.1 --noise-deg 0.5 --seed 14 --name "turnstile over the band" \
    --note "invented: crossed printed dipoles through a quadrature hybrid whose phase drifts with frequency" \
    --out "$tmp/tbp-$k.csv"
  tb+=("$tmp/tbp-$k.csv")
done
concat turnstile-band.csv "${tb[@]}"
echo "examples: wrote turnstile-band.csv"
