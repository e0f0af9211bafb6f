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
# One frequency has no band: every band figure says why instead of a bare "unavailable".
"$E" synth dipole --step 5 --out one.csv >/dev/null
expect_rc 0 "band of a one-frequency file" "$E" band one.csv --out one.json
grep -q "peak within 1 dB      unavailable (needs two or more frequencies)" out.txt && ok "... the gain band says why it is missing" || bad "one-frequency band: $(cat out.txt)"
python3 -c "import json; b=json.load(open('one.json'))['patterns'][0]['band']; assert b['gain_bandwidth_1db'] is None and b['gain_bandwidth_unavailable_reason'] == 'needs two or more frequencies' and b['ar_bandwidth_unavailable_reason'] == 'needs two or more frequencies'" \
  && ok "... and so does the JSON" || bad "one-frequency band JSON"

# ---- map
TS=$SRC/examples/turnstile.csv
expect_rc 0 "map to SVG (Hammer, total)" "$E" map "$TS" --frequency 2.45e9 --out m.svg
xmllint --noout m.svg 2>/dev/null && ok "map SVG well-formed" || bad "map SVG not well-formed"
expect_rc 0 "map of the axial ratio to PNG, theta/phi" "$E" map "$TS" --frequency 2.45e9 --show axial-ratio --projection theta-phi --out m.png --size 800x480
python3 -c "import struct,sys; d=open('m.png','rb').read(24); w,h=struct.unpack('>II', d[16:24]); sys.exit(0 if (w,h)==(800,480) else 1)" \
  && ok "map PNG is 800x480" || bad "map PNG size"
expect_rc 0 "map of A minus B to PDF" "$E" map "$TS" --frequency 2.45e9 --minus "$TS" --projection az-el --out m.pdf
pdfinfo m.pdf >/dev/null 2>&1 && ok "map PDF opens" || bad "map PDF"
expect_rc 0 "map values to CSV" "$E" map "$TS" --frequency 2.45e9 --show tilt --out m.csv
python3 - m.csv <<'PY' && ok "map CSV: one row per sample, tilt within (-90, 90]" || bad "map CSV content"
import csv, math, sys
rows = list(csv.reader(open(sys.argv[1])))
assert rows[0][-1] == "tilt_deg" and len(rows) == 1 + 37 * 72
vals = [float(r[-1]) for r in rows[1:] if r[-1]]
assert all(-90 < v <= 90 for v in vals)
PY
expect_rc 2 "map: unknown quantity" "$E" map "$TS" --show colour --out x.svg
expect_rc 2 "map: bad levels" "$E" map "$TS" --levels 3,abc --out x.svg
expect_rc 2 "map: bad bar" "$E" map "$TS" --bar 5,1 --out x.svg
expect_rc 2 "map: unknown projection" "$E" map "$TS" --projection mercator --out x.svg
expect_rc 1 "map: refuses to replace" "$E" map "$TS" --out m.csv
[[ ! -e x.svg ]] && ok "map: nothing written on usage errors" || bad "map: x.svg written"

# ---- coverage
PD=$SRC/examples/printed-dipole.csv; SL=$SRC/examples/small-loop.csv
expect_rc 0 "coverage table, one file" "$E" coverage "$PD" --frequency 2.45e9
grep -q "Vertical" out.txt && grep -q "share of the sphere at or above" out.txt && ok "coverage prints per component" || bad "coverage table"
expect_rc 0 "coverage of two files near the horizon, JSON" "$E" coverage "$PD" "$SL" --frequency 2.45e9 --horizon 30 --out c.json
python3 - c.json <<'PY' && ok "coverage JSON: best of both covers at least each" || bad "coverage JSON"
import json, math, sys
d = json.load(open(sys.argv[1]))
assert abs(d["band"]["solid_angle_sr"] - 2 * math.pi) < 1e-9  # |elevation| <= 30: 4 pi sin 30
s = {x["pattern"]: x for x in d["series"]}
for k in range(len(s["A"]["at_levels"])):
    best = s["best of both"]["at_levels"][k]["share"]
    assert best >= s["A"]["at_levels"][k]["share"] - 1e-12 and best >= s["B"]["at_levels"][k]["share"] - 1e-12
PY
expect_rc 0 "coverage curves to SVG" "$E" coverage "$PD" --frequency 2.45e9 --out c.svg
xmllint --noout c.svg 2>/dev/null && ok "coverage SVG well-formed" || bad "coverage SVG"
expect_rc 0 "coverage curves to CSV" "$E" coverage "$PD" --frequency 2.45e9 --components total --out c.csv
python3 - c.csv <<'PY' && ok "coverage CSV: shares rise as the level falls" || bad "coverage CSV"
import csv, sys
rows = list(csv.reader(open(sys.argv[1])))[1:]
sh = [float(r[1]) for r in rows]
assert all(b >= a for a, b in zip(sh, sh[1:])) and sh[0] == 0 and sh[-1] > 0.99
assert rows[1][0] == "3.9"
PY
expect_rc 2 "coverage: three files" "$E" coverage "$PD" "$PD" "$PD"
expect_rc 2 "coverage: bad elevation" "$E" coverage "$PD" --elevation 40,10
expect_rc 2 "coverage: horizon and elevation" "$E" coverage "$PD" --horizon 30 --elevation -10,10
expect_rc 2 "coverage: bad levels" "$E" coverage "$PD" --levels 0,x
expect_rc 2 "coverage: unknown component" "$E" coverage "$PD" --components total,colour

# ---- 3D files (render is built with the viewer)
if has_command "$E" render; then
  expect_rc 0 "render the surface to GLB" "$E" render "$TS" --frequency 2.45e9 --out s.glb
  expect_rc 0 "render the surface coloured by axial ratio to PLY" "$E" render "$TS" --frequency 2.45e9 --color-by axial-ratio --out s.ply
  python3 "$SRC/tests/scripts/check_mesh_files.py" s.glb s.ply >out.txt 2>&1 && ok "GLB and PLY pass the structural check" || bad "mesh files: $(cat out.txt)"
  expect_rc 1 "render refuses to replace a GLB" "$E" render "$TS" --out s.glb
  if command -v xvfb-run >/dev/null; then  # the viewer's export of the surface on screen, same writer
    expect_rc 0 "view --export-view v.glb" "$XVFB" -a -s "-screen 0 800x600x24" "$E" view "$TS" --frames 3 --export-view v.glb
    python3 "$SRC/tests/scripts/check_mesh_files.py" v.glb >out.txt 2>&1 && ok "the viewer's GLB passes the structural check" || bad "viewer GLB: $(cat out.txt)"
  fi
  # A hemisphere's 3D file: the directions it does not sample as a part of its own, "not measured".
  expect_rc 0 "render an upper hemisphere to GLB and PLY" "$E" render "$SRC/tests/data/csv/upper_hemisphere.csv" --out u.glb
  expect_rc 0 "render an upper hemisphere to PLY" "$E" render "$SRC/tests/data/csv/upper_hemisphere.csv" --out u.ply
  python3 "$SRC/tests/scripts/check_mesh_files.py" u.glb u.ply >out.txt 2>&1 && grep -q "parts: .*, not measured$" out.txt &&
    grep -a -q "grey faces: not measured" u.ply && ok "a hemisphere's GLB names its 'not measured' part; the PLY says which faces" ||
    bad "hemisphere mesh files: $(cat out.txt)"
  python3 "$SRC/tests/scripts/check_mesh_files.py" s.glb >out.txt 2>&1 && ! grep -q "not measured" out.txt && ok "a full sphere's GLB has no 'not measured' part" ||
    bad "full sphere GLB parts: $(cat out.txt)"
  expect_rc 1 "render: magnitude-only data cannot colour by axial ratio" "$E" render "$SRC/tests/data/csv/upper_hemisphere.csv" --color-by axial-ratio --out n.glb
else
  refused_without_viewer "render the surface to GLB" "$E" render "$TS" --frequency 2.45e9 --out s.glb
  [[ ! -e s.glb ]] && ok "... nothing written" || bad "... s.glb written"
fi

finish
