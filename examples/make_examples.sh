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
