#!/usr/bin/env bash
# ellipsa convert: every family round-trips through the command, foreign layouts convert with the
# import options, and convert never writes over its input. Usage: convert_cli.sh ELLIPSA WORKDIR SOURCE_DIR
set -uo pipefail
source "$(dirname "$0")/checks.sh"  # ok, bad, expect_rc, finish
E=$1; W=$2; SRC=$3; rm -rf "$W"; mkdir -p "$W"; cd "$W"
"$E" synth crossed-dipoles --step 5 --out x.csv || bad "synth"
ref=$("$E" info x.csv --json)
for fam in complex theta-phi-db-phase circular-db-phase ludwig3-db-phase; do
  if "$E" convert x.csv "x-$fam.csv" --family "$fam" 2>err.txt; then
    got=$("$E" info "x-$fam.csv" --json)
    # The same figures (peak, directivity, beamwidths, axial ratio, sense) whatever the family,
    # to 1e-9 relative (the dB/phase families round-trip to a few ulps).
    if /usr/bin/python3 - "$ref" "$got" <<'PY'
import json, sys
a, b = json.loads(sys.argv[1]), json.loads(sys.argv[2])
def same(x, y):
    if isinstance(x, dict):
        return all(same(x[k], y.get(k)) for k in x if k not in ("name", "source"))
    if isinstance(x, list):
        return len(x) == len(y) and all(same(p, q) for p, q in zip(x, y))
    if isinstance(x, float) or isinstance(y, float):
        return x is not None and y is not None and abs(x - y) <= 1e-9 * max(1.0, abs(x))
    return x == y
sys.exit(0 if same(a, b) else 1)
PY
    then ok "$fam: info unchanged"; else bad "$fam: info differs"; fi
  else
    bad "$fam: convert failed: $(cat err.txt)"
  fi
done
"$E" convert x.csv x-mag.csv --family theta-phi-db && grep -q '"content": "magnitude-only"' <("$E" info x-mag.csv --json) \
  && ok "theta-phi-db gives magnitude-only data" || bad "theta-phi-db"
"$E" convert x-mag.csv x-bad.csv --family complex 2>err.txt; rc=$?
[[ $rc == 1 ]] && grep -q "expected complex data" err.txt && ok "no phase family from magnitudes (exit 1)" || bad "magnitude to complex: exit $rc $(cat err.txt)"
"$E" convert x.csv x.csv 2>err.txt; rc=$?
[[ $rc == 2 ]] && grep -q "other than the input" err.txt && ok "refuses to write over its input (exit 2)" || bad "overwrite input: exit $rc"
ln -sf x.csv link.csv
"$E" convert link.csv x.csv 2>err.txt; rc=$?
[[ $rc == 2 ]] && ok "refuses its input through a link too" || bad "link: exit $rc"
"$E" convert "$SRC/tests/data/csv/foreign/range3.csv" r3.csv --map-file "$SRC/tests/data/csv/foreign/range3.map" \
  && head -12 r3.csv | grep -q '^frequency,theta,phi,e_total_db$' && ok "foreign layout converts with --map-file" || bad "foreign convert"
"$E" convert "$SRC/tests/data/csv/foreign/range3.csv" r3b.csv --map "Sample=ignore,Remark=ignore,Az/deg=azimuth,El/deg=elevation,Level re horn/dB=e_total_db" \
  --offset "e_total_db=7.5" --assume "quantity=gain,frequency=5.8 GHz" && cmp -s r3.csv r3b.csv \
  && ok "--map/--offset/--assume give the same file as the map file" || bad "options differ from map file"
"$E" info "$SRC/tests/data/csv/foreign/range3.csv" --map-file "$SRC/tests/data/csv/foreign/range3.map" --map "Nope=theta" 2>err.txt; rc=$?
[[ $rc == 1 ]] && grep -q 'range3.csv:1: --map: expected a column named "Nope"' err.txt && ok "a map entry matching nothing is refused" || bad "unused map: $rc $(cat err.txt)"
R3="$SRC/tests/data/csv/foreign/range3.csv"; M3="$SRC/tests/data/csv/foreign/range3.map"
"$E" info "$R3" --map "@$M3" >/dev/null && ok "--map @FILE reads a map file" || bad "--map @FILE"
"$E" info "$R3" --map-file "$M3" --scale "e_total_db=x" 2>err.txt; rc=$?
[[ $rc == 1 ]] && grep -q -- '--scale: expected a finite number after "e_total_db="' err.txt && ok "--scale needs a number" || bad "--scale: $rc $(cat err.txt)"
"$E" info "$R3" --map-file "$M3" --scale "gain=2" 2>err.txt; rc=$?
[[ $rc == 1 ]] && grep -q -- '--scale: expected a schema column name, found "gain"' err.txt && ok "--scale needs a schema column" || bad "--scale column: $rc $(cat err.txt)"
"$E" info "$R3" --map-file "$M3" --assume "colour=red" 2>err.txt; rc=$?
[[ $rc == 1 ]] && grep -q -- '--assume: expected a metadata key' err.txt && ok "--assume needs a metadata key" || bad "--assume key: $rc $(cat err.txt)"
"$E" info "$R3" --map-file "$M3" --assume "angle-unit=grad" 2>err.txt; rc=$?
[[ $rc == 1 ]] && grep -q -- '--assume: angle-unit: expected deg or rad, found "grad"' err.txt && ok "--assume values are checked" || bad "--assume value: $rc $(cat err.txt)"
printf 'column: Sample = ignore\nscale: e_total_db 2\n' > broken.map
"$E" info "$R3" --map-file broken.map 2>err.txt; rc=$?
[[ $rc == 1 ]] && grep -q 'broken.map:2:8: expected "name = value"' err.txt && ok "map file errors name file:line:column" || bad "map file error: $rc $(cat err.txt)"
# Nothing is replaced without --force; a replaced file keeps its mode; new files follow the umask.
cp x.csv keep.csv
"$E" synth short-dipole --step 10 --out x.csv 2>err.txt; rc=$?
[[ $rc == 1 ]] && grep -q 'x.csv: already exists; use --force' err.txt && cmp -s x.csv keep.csv \
  && ok "synth refuses to replace a file without --force (exit 1)" || bad "synth overwrite: exit $rc $(cat err.txt)"
"$E" convert "$R3" r3.csv --map-file "$M3" 2>err.txt; rc=$?
[[ $rc == 1 ]] && grep -q 'r3.csv: already exists; use --force' err.txt \
  && ok "convert refuses to replace a file without --force (exit 1)" || bad "convert overwrite: exit $rc $(cat err.txt)"
chmod 600 x.csv
"$E" synth short-dipole --step 10 --out x.csv --force && ! cmp -s x.csv keep.csv && [[ $(stat -c %a x.csv) == 600 ]] \
  && ok "synth --force replaces and keeps the file's mode 600" || bad "synth --force: $(stat -c %a x.csv)"
"$E" convert "$R3" r3.csv --map-file "$M3" --force && ok "convert --force replaces" || bad "convert --force"
(umask 077 && "$E" synth short-dipole --step 10 --out private.csv) && [[ $(stat -c %a private.csv) == 600 ]] \
  && ok "a new file follows the umask (077: mode 600)" || bad "umask: $(stat -c %a private.csv)"
ln -sf nowhere.csv dangling.csv
"$E" synth short-dipole --step 10 --out dangling.csv 2>err.txt; rc=$?
[[ $rc == 1 && -L dangling.csv ]] && ok "a dangling link at the target is not replaced" || bad "dangling link: exit $rc"
# Repeated keys are refused, naming where they came from; side files must be regular files.
"$E" info "$R3" --map-file "$M3" --assume "angle-unit=deg,angle-unit=rad" 2>err.txt; rc=$?
[[ $rc == 1 ]] && grep -q -- '--assume: expected metadata "angle-unit" once, found it again (first from --assume)' err.txt \
  && ok "a repeated --assume key is refused" || bad "--assume repeat: $rc $(cat err.txt)"
"$E" info "$R3" --map-file "$M3" --assume "quantity=directivity" 2>err.txt; rc=$?
[[ $rc == 1 ]] && grep -q -- '--assume: expected metadata "quantity" once, found it again (first from .*range3.map:' err.txt \
  && ok "a key in both the map file and --assume is refused" || bad "map/assume repeat: $rc $(cat err.txt)"
"$E" info "$R3" --map "Sample=ignore,Sample=theta" 2>err.txt; rc=$?
[[ $rc == 1 ]] && grep -q -- '--map: expected each source column once, found "Sample" again' err.txt \
  && ok "a repeated --map source is refused as such" || bad "--map repeat: $rc $(cat err.txt)"
timeout 20 "$E" info "$R3" --map-file /dev/zero 2>err.txt; rc=$?
[[ $rc == 1 ]] && grep -q 'expected a map file (a regular file)' err.txt && ok "--map-file /dev/zero is refused at once" || bad "/dev/zero map: $rc"
mkfifo fifo.map
timeout 20 "$E" info "$R3" --map-file fifo.map 2>err.txt; rc=$?
[[ $rc == 1 ]] && ok "--map-file FIFO is refused without blocking" || bad "FIFO map: $rc"
timeout 20 "$E" info "$R3" --map-file . 2>err.txt; rc=$?
[[ $rc == 1 ]] && grep -q 'found a folder' err.txt && ok "--map-file on a folder is refused" || bad "folder map: $rc"
# A FIFO anywhere a file is read is refused at once (opening one without a writer would block),
# naming it; an empty file name (an unset variable in a script) says so.
mkfifo fifo.csv
"$E" synth short-dipole --step 10 --out sd.csv >/dev/null && "$E" convert sd.csv sdrel.csv --assume quantity=relative >/dev/null
for args in "info fifo.csv" "info sd.csv::join=fifo.csv" "info $R3::map=fifo.map" "diversity sd.csv --environment profile --profile fifo.csv" \
            "gain-transfer sdrel.csv --reference fifo.csv --reference-gain 0 --out gt.csv" "rank sd.csv --reference fifo.csv --no-orientations"; do
  timeout 20 "$E" $args >/dev/null 2>err.txt; rc=$?
  [[ $rc == 1 ]] && grep -q "fifo\.[a-z]*: expected .*a regular file.*found a device, pipe or socket" err.txt && ok "FIFO refused: $args" || bad "FIFO ($args): rc $rc, $(cat err.txt)"
done
timeout 20 "$E" info "" 2>err.txt; rc=$?
[[ $rc == 2 ]] && grep -q "expected a file name, found an empty one" err.txt && ok "an empty file name is a usage error, saying so" || bad "empty name: rc $rc, $(cat err.txt)"
timeout 20 "$E" diversity sd.csv --environment profile --profile "" 2>err.txt; rc=$?
[[ $rc == 1 || $rc == 2 ]] && grep -q "expected a file name, found an empty one\|needs --profile FILE" err.txt && ok "an empty --profile is refused, saying so" || bad "empty profile: rc $rc, $(cat err.txt)"
finish
