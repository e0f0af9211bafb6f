#!/usr/bin/env bash
# Data split over files and cut-only data from the command line (issue 14): FILE::join=OTHER
# for one file per frequency and one per polarisation, the refusals that name both files, and
# cut-only data (cut, probe and info work; whole-sphere commands say they need a sphere).
# Usage: split_cli.sh ELLIPSA WORKDIR SOURCE_DIR
set -uo pipefail
source "$(dirname "$0")/checks.sh"  # ok, bad, expect_rc, finish
E=$1; W=$2; SRC=$3; rm -rf "$W"; mkdir -p "$W"; cd "$W"
cp "$SRC"/tests/data/csv/split/*.csv .
figures() { "$E" info "$@" | sed -n '/^  [0-9]/,$p'; }  # the per-frequency figures, without the file's name

# --- One file per frequency, one per polarisation ---
ref=$(figures sphere.csv)
[[ "$(figures "f2450.csv::join=f2500.csv::join=f2400.csv")" == "$ref" ]] && ok "three files of one frequency each give the figures of the one file" || bad "per-frequency merge differs"
[[ "$(figures "co.csv::join=cross.csv")" == "$ref" ]] && ok "co- and cross-polar files give the figures of the one file" || bad "co/cross merge differs: $(diff <(figures "co.csv::join=cross.csv") <(echo "$ref") | head -5)"
[[ "$(figures "e_theta.csv::join=e_phi.csv")" == "$ref" ]] && ok "E_theta and E_phi files give the figures of the one file" || bad "theta/phi merge differs"
expect_rc 0 "info on a joined pair" "$E" info "co.csv::join=cross.csv"
grep -q "co.csv: merged co-polar and cross-polar parts from 2 files: co.csv + cross.csv" err.txt && ok "... says what it merged" || bad "merge note: $(cat err.txt)"
# The header names the files joined once, then the pattern's name (never the path again).
name=$(sed -n 's/^# name: //p' co.csv)
[[ "$(head -1 out.txt)" == "co.csv + cross.csv: ${name:-(no name)}" ]] && ok "... its header names both files once" || bad "header: $(head -2 out.txt)"
grep -q "^  source       co.csv + cross.csv" out.txt && bad "... repeats the files as the source" || ok "... not repeated as the source"
grep -v '^# name:' co.csv > unnamed.csv
expect_rc 0 "info on a file without a name" "$E" info unnamed.csv
[[ "$(head -1 out.txt)" == "unnamed.csv: (no name)" ]] && ok "... its path once" || bad "unnamed header: $(head -1 out.txt)"
expect_rc 0 "info on one part alone" "$E" info co.csv
grep -q "the co-polar part only (the other stored as zero)" out.txt && ok "... says it is one part" || bad "part line: $(grep data out.txt)"
grep -q "polarisation at peak  unavailable (axial ratio, tilt and sense need the whole field, but the data hold its co-polar part only" out.txt \
  && ok "... and gives no polarisation for it" || bad "part polarisation: $(grep polarisation out.txt)"
expect_rc 0 "convert writes one part as a part" "$E" convert co.csv co_part.csv
grep -q "^# part: co$" co_part.csv && ok "... with its part line" || bad "convert part: $(head -8 co_part.csv)"
[[ "$(figures "co_part.csv::join=cross.csv")" == "$ref" ]] && ok "... which joins its other part as the original did" || bad "part round trip"
# Gain transfer per polarisation (IEEE Std 149 sec. 12): each part by its own reference level. The
# relative files are the fixtures shifted down (co by 20 dB, cross by 26 dB: another range gain
# for the other orientation); each reference measured at that level with a known 0 dBi gives the
# gain back.
expect_rc 0 "gain transfer of the co-polar part by its own reference" "$E" gain-transfer co.csv --assume quantity=relative --offset e_co_db=-20 --reference-level -20 --reference-gain 0 --out co_g.csv
expect_rc 0 "... and of the cross-polar part by its own" "$E" gain-transfer cross.csv --assume quantity=relative --offset e_cross_db=-26 --reference-level -26 --reference-gain 0 --out cross_g.csv
[[ "$(figures "co_g.csv::join=cross_g.csv")" == "$ref" ]] && ok "... joined, they give the figures of the gain file" || bad "per-part transfer: $(diff <(figures "co_g.csv::join=cross_g.csv") <(echo "$ref") | head -6)"
expect_rc 1 "a part line that contradicts the columns is refused" "$E" info co.csv --assume part=cross
grep -q "part: expected co (the columns hold the co-polar part only), found \"cross\"" err.txt && ok "... saying which part the columns hold" || bad "part clash: $(cat err.txt)"
expect_rc 0 "convert writes a joined pair as one file" "$E" convert "co.csv::join=cross.csv" merged.csv
[[ "$(figures merged.csv)" == "$ref" ]] && ok "... with the figures of the one file" || bad "merged file differs"
expect_rc 1 "two files of the same frequency are refused" "$E" info "f2400.csv::join=f2400.csv"
grep -q "f2400.csv and f2400.csv: expected distinct frequencies, found 2.4 GHz in both" err.txt && ok "... naming both" || bad "duplicate: $(cat err.txt)"
expect_rc 1 "a cut file joined to a sphere is refused" "$E" info "sphere.csv::join=cuts.csv"
grep -q "sphere.csv and cuts.csv: expected the same grid, found surface and cuts sampling" err.txt && ok "... naming both" || bad "grid: $(cat err.txt)"
expect_rc 1 "parts of two bases are refused" "$E" info "co.csv::join=e_phi.csv"
grep -q "found co-polar and E_phi" err.txt && ok "... naming the parts" || bad "bases: $(cat err.txt)"
expect_rc 2 "join= without a file is a usage error" "$E" info "co.csv::join="
# The viewer reads joined files too: tests/viewer/joined_view.sh (under Xvfb).

# --- Cut-only data ---
expect_rc 0 "info reads principal cuts" "$E" info cuts.csv --frequency 2.45e9
grep -q "coverage     none: the data hold cuts only (phi 0, 90, 180, 270 deg)" out.txt && ok "... says they are cuts" || bad "coverage: $(grep coverage out.txt)"
grep -q "directivity           unavailable (needs the whole sphere; the data hold cuts only" out.txt && ok "... directivity needs a sphere" || bad "directivity: $(grep directivity out.txt)"
grep -q "radiation efficiency  unavailable (needs the whole sphere" out.txt && ok "... so does efficiency" || bad "efficiency: $(grep efficiency out.txt)"
grep -q "HPBW plane phi = 0    131.0 deg" out.txt && ok "... the HPBW of the cut through the peak (131.1 deg closed form; 131.0 from 2-degree samples)" || bad "HPBW: $(grep HPBW out.txt)"
# issue 17: the side lobe's plane by the same wording as the HPBW's (exports::beam_plane_text), never "elevation" at a pole
grep -q "side lobe             plane phi = 0: " out.txt && ! grep -qi "elevation" out.txt && ok "... the side lobe named by its plane, no elevation label at the zenith" || bad "side lobe: $(grep -i 'side lobe\|elevation' out.txt)"
grep -q '"sampling": "cuts"' <("$E" info cuts.csv --json) && ok "info --json gives the sampling" || bad "json sampling"
expect_rc 0 "cut on a principal plane" "$E" cut cuts.csv --phi 90 --frequency 2.45e9 --out h_plane.csv
expect_rc 0 "probe on a cut" "$E" probe cuts.csv --theta 30 --phi 90 --frequency 2.45e9
expect_rc 1 "probe between two cuts has no value" "$E" probe cuts.csv --theta 30 --phi 45 --frequency 2.45e9
for cmd in "diversity cuts.csv" "fading cuts.csv" "map cuts.csv --out m.svg" "coverage cuts.csv" "rank cuts.csv" "report cuts.csv --out rep"; do
  expect_rc 1 "$cmd says it needs a sphere" "$E" $cmd
  grep -q "cuts.csv: .* needs the whole sphere; the data hold cuts only (phi 0, 90, 180, 270 deg): cut, probe and info read cuts" err.txt \
    && ok "... in words" || bad "$cmd: $(cat err.txt)"
done
expect_rc 0 "an azimuth cut reads too" "$E" info azimuth_cut.csv --frequency 2.45e9
grep -q "none: the data hold cuts only (theta 90 deg)" out.txt && ok "... as one cut" || bad "azimuth: $(grep coverage out.txt)"
finish
