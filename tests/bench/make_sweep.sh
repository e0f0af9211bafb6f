#!/usr/bin/env bash
# A large frequency sweep for the benchmarks (never committed): N frequencies (default 100) of
# crossed dipoles whose quadrature phase and tilt drift with frequency, on a STEP-degree grid
# (default 0.5: 361 x 720 directions each, about 2 GB of CSV for 100 frequencies), written by
# `ellipsa synth` one frequency at a time and joined under one header.
# Usage: make_sweep.sh ELLIPSA OUT [N] [STEP]
set -euo pipefail
ELLIPSA=$1 OUT=$2 N=${3:-100} STEP=${4:-0.5}
TMP=$(mktemp -d)
trap 'rm -rf "$TMP"' EXIT
for ((k = 0; k < N; ++k)); do
  f=$(awk -v k="$k" -v n="$N" 'BEGIN { printf "%.6e", 2.40e9 + 0.2e9 * k / (n > 1 ? n - 1 : 1) }')
  ph=$(awk -v k="$k" -v n="$N" 'BEGIN { printf "%.3f", -90 + 40.0 * (k - n / 2) / n }')
  tilt=$(awk -v k="$k" 'BEGIN { printf "%.3f", 0.2 * k }')
  "$ELLIPSA" synth crossed-dipoles --phase "$ph" --rotate-x "$tilt" --step "$STEP" --frequency "$f" \
    --name "bench sweep" --out "$TMP/one.csv" --force >/dev/null
  if ((k == 0)); then cat "$TMP/one.csv" > "$OUT"; else grep -v '^[#f]' "$TMP/one.csv" >> "$OUT"; fi
done
