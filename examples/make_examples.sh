#!/usr/bin/env bash
# Regenerates every example file from `ellipsa synth` models and the invented perturbations in
# perturb.py. The scenario and every number in it are made up for the demo: see README.md here.
set -euo pipefail
cd "$(dirname "$0")"
E=${ELLIPSA:-../build/ellipsa}
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
STEP=2

concat() {  # OUT IN... : one file, the header of the first, the rows of all
  local out=$1; shift
  cat "$1" > "$out"; shift
  for f in "$@"; do grep -v '^#' "$f" | tail -n +2 >> "$out"; done
}

pd=() ts=() lp=()
for f in 2.40e9 2.45e9 2.50e9; do
  # Printed dipole: trimmed to 0.48 wavelength at 2.45 GHz on the tag board; its electrical
  # length follows frequency. The battery and ground plane beside it push the beam toward +x.
  L=$(/usr/bin/python3 -c "print(0.48 * $f / 2.45e9)")
  "$E" synth dipole --length "$L" --step $STEP --frequency "$f" --out "$tmp/dip-$f.csv"
  /usr/bin/python3 perturb.py --add "$tmp/dip-$f.csv" 1@0 --ground-tilt 0.35 --efficiency 0.82 \
    --noise-db 0.1 --noise-deg 0.5 --seed 11 --name "printed dipole" \
    --note "invented: vertical printed dipole beside the tag's ground plane" --out "$tmp/pd-$f.csv"
  pd+=("$tmp/pd-$f.csv")
  # Crossed-dipole turnstile, right-hand circular toward the ceiling (+z); the ground plane below
  # lifts the upper hemisphere a little.
  "$E" synth crossed-dipoles --phase -90 --step $STEP --frequency "$f" --out "$tmp/cd-$f.csv"
  /usr/bin/python3 perturb.py --add "$tmp/cd-$f.csv" 1@0 --ground-tilt 0.15 --efficiency 0.74 \
    --noise-db 0.1 --noise-deg 0.5 --seed 12 --name "turnstile" \
    --note "invented: crossed printed dipoles in quadrature, RHCP toward +z" --out "$tmp/ts-$f.csv"
  ts+=("$tmp/ts-$f.csv")
  # Small loop close to the ground plane, its board tipped 30 deg: the loop's own field plus a
  # vertical current it drives on the ground plane, 0.9 times as strong and 60 deg ahead; the
  # mix spreads power over every polarisation.
  "$E" synth small-loop --rotate-x 30 --step $STEP --frequency "$f" --out "$tmp/sl-$f.csv"
  "$E" synth short-dipole --step $STEP --frequency "$f" --out "$tmp/gz-$f.csv"
  /usr/bin/python3 perturb.py --add "$tmp/sl-$f.csv" 1@0 --add "$tmp/gz-$f.csv" 0.9@60 --ground-tilt 0.25 --efficiency 0.75 \
    --noise-db 0.1 --noise-deg 0.5 --seed 13 --name "small loop" \
    --note "invented: small loop near the tag's ground plane, with the edge current it induces" \
    --out "$tmp/lp-$f.csv"
  lp+=("$tmp/lp-$f.csv")
done
concat printed-dipole.csv "${pd[@]}"
concat turnstile.csv "${ts[@]}"
concat small-loop.csv "${lp[@]}"
/usr/bin/python3 foreign_layout.py "$tmp/lp-2.45e9.csv" measured-loop-range.csv
echo "examples: wrote printed-dipole.csv turnstile.csv small-loop.csv measured-loop-range.csv"
