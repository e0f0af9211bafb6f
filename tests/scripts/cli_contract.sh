#!/usr/bin/env bash
# The command-line contract scripts depend on: exit codes, --help, --version and the JSON keys of
# info and probe. Usage: cli_contract.sh ELLIPSA WORKDIR
set -uo pipefail
source "$(dirname "$0")/checks.sh"  # ok, bad, expect_rc, finish
E=$1; W=$2; rm -rf "$W"; mkdir -p "$W"; cd "$W"
expect_rc 0 "synth writes a file" "$E" synth dipole --length 1.25 --step 1 --out d.csv
expect_rc 0 "info --json" "$E" info d.csv --json
for k in quantity frequencies_hz coverage results frequency_hz peak_db peak_theta_deg peak_phi_deg \
         directivity_dbi radiation_efficiency hpbw_elevation_deg hpbw_azimuth_deg front_to_back_db \
         axial_ratio_db sense; do
  grep -q "\"$k\":" out.txt && ok "info JSON has $k" || bad "info JSON lacks $k"
done
expect_rc 0 "probe --json" "$E" probe d.csv --theta 45 --phi 30 --json
for k in total_db theta_db phi_db rhcp_db lhcp_db co_db cross_db axial_ratio_db tilt_deg sense stokes; do
  grep -q "\"$k\":" out.txt && ok "probe JSON has $k" || bad "probe JSON lacks $k"
done
grep -q '"axial_ratio_db": null' out.txt && ok "linear field: axial ratio null, not a made-up number" || bad "linear AR not null"
expect_rc 2 "unknown command is bad usage" "$E" frobnicate
expect_rc 2 "missing required option is bad usage" "$E" probe d.csv --theta 10
expect_rc 2 "theta out of range is bad usage" "$E" probe d.csv --theta 200 --phi 0
# CLI11's range checks let NaN through; NaN angles and frequencies are bad usage too.
expect_rc 2 "probe --phi nan is bad usage" "$E" probe d.csv --theta 10 --phi nan
expect_rc 2 "probe --theta nan is bad usage" "$E" probe d.csv --theta nan --phi 0
expect_rc 2 "probe --frequency nan is bad usage" "$E" probe d.csv --theta 10 --phi 0 --frequency nan
expect_rc 1 "missing file is bad input" "$E" info no-such-file.csv
printf 'theta,phi,e_theta_re,e_theta_im,e_phi_re,e_phi_im\n0,0,1,0,0,x\n' > bad.csv
expect_rc 1 "non-numeric cell is bad input" "$E" info bad.csv
grep -q 'bad.csv:2:' err.txt && ok "message names file and line" || bad "message lacks file:line: $(cat err.txt)"
expect_rc 0 "--version" "$E" --version
grep -q 'OpenGL' out.txt && ok "--version names the GL renderer" || bad "--version lacks renderer line"
for c in synth info probe; do expect_rc 0 "$c --help" "$E" "$c" --help; done
finish
