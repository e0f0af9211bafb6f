#!/usr/bin/env bash
# A pattern split over files in the viewer (docs/viewer.md; docs/far-field-csv.md "Data split over
# files"): "co.csv::join=cross.csv" is read as every command reads it (one reader,
# importers/far_field_csv.hpp read_joined_far_field_csv), so the viewer's exported cut equals
# `ellipsa cut` on the same argument, and equals the cut of the one file the pair was split from
# (tests/data/csv/split/make_split.py); a join the merge refuses fails the scripted run, naming both files.
set -euo pipefail
: "${ELLIPSA:?}" "${PNG_CHECK:?}" "${SOURCE_DIR:?}"
source "$(dirname "${BASH_SOURCE[0]}")/preamble.sh"  # xvfb-run or skip, $out, XDG_CONFIG_HOME
cd "$out"
cp "$SOURCE_DIR"/tests/data/csv/split/{co,cross,sphere,f2400}.csv .
view() { "$XVFB_RUN" -a -s "-screen 0 1400x900x24" "$ELLIPSA" view "$@" --size 800x600 --frames 3 --frequency 2.45GHz; }
view "co.csv::join=cross.csv" --export-cut viewer.csv --tab patterns --screenshot shot.png
"$PNG_CHECK" shot.png 800 600 0.03
"$ELLIPSA" cut "co.csv::join=cross.csv" --phi 0 --frequency 2.45GHz --out cli.csv 2>/dev/null
"$ELLIPSA" cut sphere.csv --phi 0 --frequency 2.45GHz --out whole.csv 2>/dev/null
/usr/bin/python3 - <<'PY'
import csv, math
def rows(p):
    return [(float(r["angle_deg"]), float(r["total_dbi"])) for r in csv.DictReader(open(p))]
v, c, w = rows("viewer.csv"), rows("cli.csv"), rows("whole.csv")
assert len(v) == len(c) == len(w) and len(v) > 100, (len(v), len(c), len(w))
def worst(a, b):
    return max(abs(x[1] - y[1]) for x, y in zip(a, b) if math.isfinite(y[1]) and y[1] > -60)
assert all(x[0] == y[0] for x, y in zip(v, c))
assert worst(v, c) < 1e-9, worst(v, c)
assert worst(v, w) < 1e-6, worst(v, w)  # the split files hold the whole file's fields to their printed digits
print(f"ok   the viewer's cut of co.csv::join=cross.csv is ellipsa cut's (worst {worst(v, c):.1e} dB) and the whole file's")
PY
if view "co.csv::join=f2400.csv" 2>err.txt; then echo "FAIL a join the merge refuses opened"; exit 1; fi
grep -q "co.csv" err.txt && grep -q "f2400.csv" err.txt || { echo "FAIL the refusal names both files:"; cat err.txt; exit 1; }
echo "ok   a join the merge refuses fails the scripted run, naming both files: $(head -1 err.txt)"
