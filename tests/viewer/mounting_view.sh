#!/usr/bin/env bash
# The mounting through the viewer's command line (docs/viewer.md, "The mounting of a pattern"):
# a half-wave dipole along x opened as "x.csv::up=+x" shows the cut of the same dipole along z
# opened as it is (docs/conventions.md "The mounting frame"; the x dipole is resampled, so within
# 0.02 dB where the level is above -20 dB), and --up with --rotate opens and draws.
set -euo pipefail
: "${ELLIPSA:?}" "${PNG_CHECK:?}"
source "$(dirname "${BASH_SOURCE[0]}")/preamble.sh"  # xvfb-run or skip, $out, XDG_CONFIG_HOME
cd "$out"
"$ELLIPSA" synth dipole --step 2 --out z.csv >/dev/null
"$ELLIPSA" synth dipole --step 2 --rotate-y 90 --out x.csv >/dev/null
view() { "$XVFB_RUN" -a -s "-screen 0 1400x900x24" "$ELLIPSA" view "$@" --size 800x600 --frames 3; }
view "x.csv::up=+x" --export-cut cx.csv
view z.csv --export-cut cz.csv
/usr/bin/python3 - <<'PY'
import csv
def rows(p):
    return [(float(r["angle_deg"]), float(r["total_dbi"])) for r in csv.DictReader(open(p))]
x, z = rows("cx.csv"), rows("cz.csv")
assert len(x) == len(z) and len(x) > 100, (len(x), len(z))
worst = max(abs(a[1] - b[1]) for a, b in zip(x, z) if b[1] > -20)
assert worst < 0.02, worst
print(f"ok   x dipole with ::up=+x has the z dipole's elevation cut (worst {worst:.4f} dB above -20 dB)")
PY
view x.csv --up +x --rotate z:30,x:10 --diversity --screenshot shot.png
"$PNG_CHECK" shot.png 800 600 0.03
echo "ok   --up +x --rotate z:30,x:10 opens and draws"
