#!/usr/bin/env bash
# The diversity command's contract: exit codes, JSON keys, clear messages for bad environments and
# profile tables. Usage: diversity_cli.sh ELLIPSA WORKDIR
set -uo pipefail
source "$(dirname "$0")/checks.sh"  # ok, bad, expect_rc, finish
E=$1; W=$2; rm -rf "$W"; mkdir -p "$W"; cd "$W"
has() { grep -q "\"$1\":" out.txt && ok "JSON has $1" || bad "JSON lacks $1"; }
expect_rc 0 "synth z dipole" "$E" synth dipole --step 2 --out z.csv
expect_rc 0 "synth x dipole" "$E" synth dipole --step 2 --rotate-y 90 --out x.csv
expect_rc 0 "uniform, one file" "$E" diversity z.csv --json
for k in environment patterns meg_db meg_vertical_db meg_horizontal_db vertical_share horizontal_share balanced_share; do has $k; done
# Taga 1990: a lossless antenna in the uniform environment has MEG -3.01 dB.
grep -q '"meg_db": -3.01' out.txt && ok "uniform MEG is -3.01 dB" || bad "uniform MEG not -3.01 dB: $(head -c 400 out.txt)"
expect_rc 0 "two files, preset, orientations" "$E" diversity z.csv x.csv --environment urban --orientations --json
for k in ecc diversity_gain_db combining selection_db mrc_db selection_effective_db mrc_effective_db diversity_gain_approximation_db cautions correlation orientations min_db median_db max_db worst by_tilt; do has $k; done
grep -q '"0.1": {' out.txt && ok "combining keyed by outage" || bad "combining not keyed by outage"
# conventions.md: a z and an x dipole are uncorrelated (in any azimuth-uniform environment).
grep -Eq '"ecc": (0|[0-9.]+e-(1[2-9]|[2-9][0-9]))[,}]' out.txt && ok "z/x dipoles: ECC 0" || bad "z/x ECC not 0: $(grep -o '"ecc": [^,]*' out.txt)"
expect_rc 0 "human output" "$E" diversity z.csv x.csv --environment indoor --orientations
grep -q 'dBi' out.txt && grep -q 'diversity gain' out.txt && ok "human output has units" || bad "human output lacks units"
# A z dipole has no horizontal part: its share of MEG is zero power, said in the core's words
# (exports/figure_text.hpp level_text), never "-inf dBi".
grep -q 'horizontal part *none (0 % of MEG)' out.txt && ok "zero horizontal part says none (0 %)" || bad "zero horizontal part: $(grep 'horizontal part' out.txt)"
! grep -q -- '-inf' out.txt && ok "human output never prints -inf" || bad "human output prints -inf: $(grep -- -inf out.txt)"
expect_rc 2 "gaussian without all angles is bad usage" "$E" diversity z.csv --environment gaussian --v-mean 10
grep -q 'vertical spread is missing' err.txt && ok "names the missing angle" || bad "does not name the missing angle: $(cat err.txt)"
expect_rc 2 "unknown environment is bad usage" "$E" diversity z.csv --environment moon
expect_rc 2 "angles with the uniform environment are bad usage" "$E" diversity z.csv --environment uniform --v-mean 3
expect_rc 2 "bad XPR is bad usage" "$E" diversity z.csv --xpr lots
expect_rc 2 "an outage of 1 is bad usage" "$E" diversity z.csv x.csv --outage 0.01,1
expect_rc 2 "zero spread is bad usage" "$E" diversity z.csv --environment urban --v-spread 0
expect_rc 0 "XPR inf accepted" "$E" diversity z.csv --environment rural --xpr inf --json
grep -q '"xpr_db": "inf"' out.txt && ok "infinite XPR echoed as \"inf\"" || bad "infinite XPR not echoed"
printf '# horizon-heavy\nelevation_deg,p_v,p_h\n-20,0,0\n0,1,0.5\n40,0,0\n' > prof.csv
expect_rc 0 "profile table" "$E" diversity z.csv --profile prof.csv --json
grep -q '"model": "profile"' out.txt && ok "profile model used" || bad "profile model not used"
printf 'elevation_deg,p_v,p_h\n-20,0,0\n0,oops,0.5\n' > badprof.csv
expect_rc 1 "bad profile is bad input" "$E" diversity z.csv --profile badprof.csv
grep -q 'badprof.csv:3:3:' err.txt && ok "profile error names file:line:column" || bad "profile error: $(cat err.txt)"
# Several frequencies: every figure per frequency; a one-frequency FILE2 pairs with each.
expect_rc 0 "synth at 2.4 GHz" "$E" synth dipole --step 2 --frequency 2.4e9 --out f1.csv
expect_rc 0 "synth loop at 2.5 GHz" "$E" synth small-loop --step 2 --frequency 2.5e9 --out f2.csv
{ cat f1.csv; grep -v '^#' f2.csv | tail -n +2; } > two.csv
expect_rc 0 "two frequencies" "$E" diversity two.csv x.csv --json
# one MEG per frequency and file in "results" (3), plus the first frequency's on each pattern (2)
n=$(grep -o '"meg_db"' out.txt | wc -l)
[[ $n == 5 ]] && ok "one MEG per frequency and file, and the first on each pattern (5)" || bad "expected 5 MEG figures, found $n"
grep -q '"ecc_per_frequency": \[[^],]*,[^],]*\]' out.txt && ok "one ECC per frequency of FILE" || bad "ECC not per frequency: $(grep -o '"ecc": [^]]*]' out.txt)"
expect_rc 0 "one frequency picked" "$E" diversity two.csv --frequency 2.5e9 --json
grep -q '"frequency_hz": 2.5e+09' out.txt && ! grep -q '"frequency_hz": 2.4e+09' out.txt && ok "--frequency picks 2.5 GHz" || bad "--frequency did not pick"
expect_rc 1 "absent frequency is bad input" "$E" diversity two.csv --frequency 5e9
printf '\xEF\xBB\xBFelevation_deg,p_v,p_h\r\n0,1,1\r\n10,1,1\r\n' > bom.csv
expect_rc 0 "profile with byte-order mark and CRLF" "$E" diversity z.csv --profile bom.csv
expect_rc 0 "a sweep option implies --orientations" "$E" diversity z.csv --tilt-step 45 --json
has orientations
expect_rc 1 "missing file is bad input" "$E" diversity no-such.csv
# Issue 13 item 13: a single phi cut is not a sphere; the reason says so (it said "zero everywhere").
{ grep -v '^2' z.csv; grep -E '^[^,]+,[^,]+,90,' z.csv; } > cut.csv
expect_rc 1 "a single phi cut has no MEG" "$E" diversity cut.csv
# Issue 14: cuts are refused while loading, in the words every whole-sphere command uses.
grep -q 'cut.csv: diversity (MEG and ECC) needs the whole sphere; the data hold cuts only (phi 90 deg)' err.txt && ! grep -q 'zero everywhere' out.txt err.txt && ok "the reason is the single cut" || bad "single-cut reason: $(cat out.txt err.txt)"
# Issue 13 item 14: extreme but valid table values. Each column is a shape (conventions.md, Taga 1990):
# 1e308 in both columns is the same environment as 1 in both; 1e-320 against 1 is all vertical.
printf 'elevation_deg,p_v,p_h\n-10,1,1\n10,1,1\n' > unit.csv
printf 'elevation_deg,p_v,p_h\n-10,1e308,1e308\n10,1e308,1e308\n' > huge.csv
printf 'elevation_deg,p_v,p_h\n-10,1,1e-320\n10,1,1e-320\n' > tiny.csv
expect_rc 0 "profile of ones" "$E" diversity z.csv --profile unit.csv --json
want=$(grep -o '"meg_db": [^,]*' out.txt | head -1)
expect_rc 0 "profile of 1e308" "$E" diversity z.csv --profile huge.csv --json
[[ "$(grep -o '"meg_db": [^,]*' out.txt | head -1)" == "$want" ]] && grep -q '"xpr_db": 0[,}]' out.txt && ok "1e308 columns: same MEG, XPR 0 dB" || bad "1e308 columns: $(grep -o '"\(meg\|xpr\)_db": [^,]*' out.txt | head -3) against $want"
expect_rc 0 "profile with p_h 1e-320" "$E" diversity z.csv --profile tiny.csv --json
grep -q '"meg_db": null' out.txt && bad "p_h 1e-320: MEG unavailable" || ok "p_h 1e-320: MEG given"
grep -q '"weight_horizontal": 0[,}]' out.txt && ok "p_h 1e-320: horizontal weight 0" || bad "p_h 1e-320: $(grep -o '"weight_[a-z]*": [^,]*' out.txt)"
finish
