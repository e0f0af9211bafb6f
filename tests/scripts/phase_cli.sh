#!/usr/bin/env bash
# The phase of each component in probe and cut (pattern/component_phase.hpp), against closed
# forms worked out by hand. Usage: phase_cli.sh ELLIPSA WORKDIR
set -uo pipefail
source "$(dirname "$0")/checks.sh"  # ok, bad, expect_rc, finish
E=$1; W=$2; rm -rf "$W"; mkdir -p "$W"; cd "$W"
num() { grep -o "\"$1\": *[^,}]*" "${2:-out.txt}" | head -1 | sed 's/.*: *//'; }
near() { awk -v a="$1" -v b="$2" -v t="$3" 'BEGIN { d = a - b; d -= 360 * int(d / 360); if (d > 180) d -= 360; if (d < -180) d += 360; exit !(d <= t && d >= -t) }'; }

expect_rc 0 "synth crossed dipoles" "$E" synth crossed-dipoles --step 5 --out cd.csv
# Turnstile fed in quadrature (pattern/reference.hpp; IEEE Std 145, Balanis sec. 2.12): by hand at
# theta 60, phi 40: Et = -cos(60) exp(-j 40) (phase 140), Ep = j exp(-j 40) (phase 50),
# E_R = -(1 + cos 60) exp(-j 40)/sqrt2 (phase 140), E_L = (1 - cos 60) exp(-j 40)/sqrt2 (phase -40).
expect_rc 0 "probe --json" "$E" probe cd.csv --theta 60 --phi 40 --json
for k in theta_phase_deg phi_phase_deg vertical_phase_deg horizontal_phase_deg rhcp_phase_deg lhcp_phase_deg co_phase_deg \
         cross_phase_deg phase_reference_shift_m total_db rhcp_db stokes; do
  grep -q "\"$k\":" out.txt && ok "probe JSON has $k" || bad "probe JSON lacks $k"
done
grep -q '"total_phase_deg"' out.txt && bad "total has a phase in JSON" || ok "total has no phase field"
for kv in theta:140 phi:50 rhcp:140 lhcp:-40; do
  v=$(num "${kv%%:*}_phase_deg")
  near "$v" "${kv#*:}" 1e-6 && ok "${kv%%:*} phase $v = ${kv#*:} by hand" || bad "${kv%%:*} phase $v, by hand ${kv#*:}"
done
# Toward +z the field is pure right-hand: E_L is zero there, its phase null, never a number.
expect_rc 0 "probe at the zenith" "$E" probe cd.csv --theta 0 --phi 0 --json
grep -q '"lhcp_phase_deg": null' out.txt && ok "zero LHCP: phase null" || bad "zero LHCP phase not null: $(num lhcp_phase_deg)"
expect_rc 0 "probe text at the zenith" "$E" probe cd.csv --theta 0 --phi 0
grep -q 'LHCP.*phase none: no field' out.txt && ok "text: none: no field" || bad "text lacks 'none: no field'"
grep -q "phase relative to *the file's origin" out.txt && ok "text names the phase reference" || bad "text lacks the phase reference"
# A moved reference is named (conventions.md "Phase centre").
expect_rc 0 "probe with a moved reference" "$E" probe cd.csv --theta 60 --phi 40 --phase-centre 0,0,0.01
grep -q "phase relative to *(0.0000, 0.0000, 0.0100) m from the file's origin" out.txt && ok "text names the moved reference" \
  || bad "moved reference not named: $(grep 'relative' out.txt)"
# Magnitude-only data: no phase figures, a message instead.
expect_rc 0 "convert to magnitude-only" "$E" convert cd.csv mag.csv --family theta-phi-db
expect_rc 0 "probe magnitude-only --json" "$E" probe mag.csv --theta 60 --phi 40 --json
grep -q '"theta_phase_deg": null' out.txt && ok "magnitude-only: phase null" || bad "magnitude-only phase not null"
expect_rc 0 "probe magnitude-only" "$E" probe mag.csv --theta 60 --phi 40
grep -q 'phase  *none: the data are magnitude-only' out.txt && ok "magnitude-only: message" || bad "magnitude-only: no message"
grep -q 'phase -\?[0-9]' out.txt && bad "magnitude-only: a phase number printed" || ok "magnitude-only: no phase numbers"
# cut --phase: along the phi = 30 cut the turnstile's E_R = -(1 + cos t) exp(-j phi)/sqrt2 has
# phase 180 - 30 = 150 deg on the positive side and 180 - 210 = -30 deg on the phi = 210 side
# (IEEE Std 145, Balanis sec. 2.12, worked by hand); none at theta 180, where E_R is zero.
expect_rc 0 "cut --phase to CSV" "$E" cut cd.csv --phi 30 --components theta,rhcp --phase --out p.csv
head -1 p.csv | grep -q '^angle_deg,theta_deg,phi_deg,theta_dbi,theta_phase_deg,rhcp_dbic,rhcp_phase_deg$' \
  && ok "CSV: a phase column after each gain column" || bad "CSV header: $(head -1 p.csv)"
grep -q "phase relative to the file's origin" out.txt && ok "cut names the phase reference" || bad "cut lacks the phase reference"
awk -F, 'NR > 1 && $1 > 1 && $1 < 179 { n++; d = $7 - 150; if (d > 1e-6 || d < -1e-6) bad++ }
         NR > 1 && $1 < -1 && $1 > -179 { n++; d = $7 + 30; if (d > 1e-6 || d < -1e-6) bad++ }
         END { exit !(n > 200 && bad == 0) }' p.csv && ok "RHCP phase along the cut = 150 / -30 deg by hand" || bad "RHCP phase along the cut off"
awk -F, '$1 == -180 { exit !($7 == "") }' p.csv && ok "no RHCP phase at theta 180 (zero field)" || bad "a phase where E_R is zero"
expect_rc 0 "cut --phase figure (PNG)" "$E" cut cd.csv --phi 30 --components rhcp,lhcp --phase --out p.png
expect_rc 0 "cut --phase figure (SVG)" "$E" cut cd.csv --theta 45 --components co --phase --style rect --out p.svg
grep -q '<svg' p.svg && ok "SVG figure made" || bad "not an SVG"
expect_rc 2 "cut --phase refuses --style polar" "$E" cut cd.csv --phi 0 --components co --phase --style polar --out q.png
grep -q 'rectangular' err.txt && ok "polar refusal says why" || bad "polar refusal: $(cat err.txt)"
expect_rc 1 "cut --phase refuses total" "$E" cut cd.csv --phi 0 --phase --out q.png
grep -q '"total" is a power and has no phase' err.txt && ok "total refusal says why" || bad "total refusal: $(cat err.txt)"
expect_rc 1 "cut --phase refuses magnitude-only data" "$E" cut mag.csv --phi 0 --components theta --phase --out q.png
grep -q 'magnitude-only (no phase)' err.txt && ok "magnitude-only refusal says why" || bad "magnitude-only refusal: $(cat err.txt)"
[[ ! -e q.png ]] && ok "nothing written on refusal" || bad "a file was written on refusal"
# The viewer's phase view exports what it draws: with a comparison, B's lines beside A's
# (tests/unit/test_export_cut.cpp checks the figure's content); with only the total chosen, nothing.
if "$E" --help | grep -q '^  view ' && command -v xvfb-run >/dev/null; then
  expect_rc 0 "synth a dipole to compare with" "$E" synth dipole --step 5 --rotate-x 30 --out dip.csv
  v() { "$XVFB" -a -s "-screen 0 1024x768x24" "$E" view "$@" --frames 2 --size 800x600 --cut-style phase; }
  expect_rc 0 "view: phase export of A" v cd.csv dip.csv --cut-components rhcp,lhcp --export-cut a.svg
  expect_rc 0 "view: phase export of A and B" v cd.csv dip.csv --compare 2 --cut-components rhcp,lhcp --export-cut ab.svg
  [[ -s a.svg && -s ab.svg ]] && ! cmp -s a.svg ab.svg && ok "the comparison's export draws more than A's" || bad "A and B export same as A's"
  expect_rc 1 "view: phase export of the total alone is refused" v cd.csv --cut-components total --export-cut t.svg
  grep -q 'the total is a power' err.txt && ok "refusal says why" || bad "total refusal: $(cat err.txt)"
  [[ ! -e t.svg ]] && ok "nothing written for the total's phase" || bad "t.svg written"
fi
finish
