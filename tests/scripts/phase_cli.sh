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
finish
