#!/usr/bin/env bash
# The fading command's contract: JSON keys, exit codes, reproducible seeds, plot files, refusals.
# Usage: fading_cli.sh ELLIPSA WORKDIR
set -uo pipefail
source "$(dirname "$0")/checks.sh"  # ok, bad, expect_rc, finish
E=$1; W=$2; rm -rf "$W"; mkdir -p "$W"; cd "$W"
py() { /usr/bin/python3 -c "import json,sys; d=json.load(open('out.txt')); $1"; }
expect_rc 0 "synth z dipole" "$E" synth dipole --step 2 --out z.csv
expect_rc 0 "synth crossed dipoles" "$E" synth crossed-dipoles --rotate-x 30 --step 2 --out c.csv
expect_rc 0 "two antennas, JSON" "$E" fading z.csv c.csv --environment urban --samples 20000 --json
# The JSON contract (docs/diversity.md, "ellipsa fading").
py "p=d['patterns'][0]; assert {'mean_db','mean_ci95_db','levels_db','fade_depth_db','cdf'} <= p.keys(); assert set(p['levels_db']) == {'0.01','0.1','0.5'}" \
  && ok "patterns[i] has mean_db, mean_ci95_db, levels_db keyed by outage" || bad "pattern keys: $(head -c 300 out.txt)"
py "q=d['pair']; assert {'power_correlation','selection_levels_db','mrc_levels_db'} <= q.keys(); assert '0.01' in q['mrc_levels_db']" \
  && ok "pair has power_correlation, selection_levels_db, mrc_levels_db" || bad "pair keys"
# conventions.md: the mean is MEG within the simulation's interval; the correlation near the ECC.
py "p=d['patterns'][0]; lo,hi=p['mean_ci95_db']; assert lo <= p['analytic_mean_db'] <= hi, (lo,hi,p['analytic_mean_db'])" \
  && ok "mean agrees with MEG within its 95 % interval" || bad "mean against MEG: $(py "print(d['patterns'][0]['mean_ci95_db'], d['patterns'][0]['analytic_mean_db'])")"
py "q=d['pair']; assert abs(q['power_correlation'] - q['ecc']) < 0.03" && ok "power correlation near the ECC" || bad "correlation far from ECC"
py "assert len(d['cautions']) == 3 and d['simulation']['realisations'] == 20000" && ok "cautions and sample count in the JSON" || bad "cautions/sample count"
cp out.txt first.json
expect_rc 0 "same seed again (one thread)" "$E" fading z.csv c.csv --environment urban --samples 20000 --json --threads 1
cmp -s out.txt first.json && ok "the same seed gives the same output whatever the thread count" || bad "not reproducible"
expect_rc 0 "another seed" "$E" fading z.csv c.csv --environment urban --samples 20000 --json --seed 2
cmp -s out.txt first.json && bad "another seed gave the same output" || ok "another seed differs"
expect_rc 0 "human output" "$E" fading z.csv --samples 5000
grep -q 'mean power' out.txt && grep -q 'caution:' out.txt && grep -q '95 % intervals' out.txt && ok "human output: mean, intervals, cautions" || bad "human output: $(head -c 300 out.txt)"
expect_rc 0 "Rician with a partner antenna" "$E" fading z.csv --samples 5000 --k-factor 10dB --dominant 90,0 --partner z.csv --json
py "assert d['patterns'][0]['k_factor'] > 0" && ok "partner field gives an own K-factor" || bad "partner: $(head -c 300 out.txt)"
expect_rc 0 "random orientation" "$E" fading z.csv --samples 2000 --tilt-max 45 --json
py "assert d['simulation']['random_orientation_tilt_max_deg'] == 45 and d['patterns'][0]['analytic_mean_db'] is None" \
  && ok "random orientation: no closed form claimed" || bad "random orientation JSON"
for f in cdf.svg cdf.png cdf.pdf cdf.csv; do
  expect_rc 0 "plot $f" "$E" fading z.csv c.csv --samples 5000 --plot $f
done
head -c 5 cdf.pdf | grep -q '%PDF' && ok "PDF plot" || bad "PDF plot"
head -1 cdf.csv | grep -q '^probability,' && ok "CSV curves" || bad "CSV: $(head -1 cdf.csv)"
expect_rc 1 "plot refuses to replace without --force" "$E" fading z.csv --samples 1000 --plot cdf.svg
expect_rc 0 "plot replaces with --force" "$E" fading z.csv --samples 1000 --plot cdf.svg --force
expect_rc 2 "too few samples is bad usage" "$E" fading z.csv --samples 5
expect_rc 2 "an outage of 0 is bad usage" "$E" fading z.csv --outage 0
expect_rc 2 "a K-factor that is not a number" "$E" fading z.csv --k-factor lots
expect_rc 2 "a dominant wave without K" "$E" fading z.csv --dominant 90,0
expect_rc 2 "a bad plot extension" "$E" fading z.csv --plot cdf.txt
expect_rc 1 "missing file" "$E" fading nope.csv
# A z dipole in a horizontal-only environment receives nothing: said as "none", never "-inf".
expect_rc 0 "no power received (XPR -inf)" "$E" fading z.csv --xpr -inf --samples 2000
grep -q "none (no power received)" out.txt && ! grep -q -- "-inf dB" out.txt && ok "no power is said as none, not -inf dB" \
  || bad "no power printed as: $(grep -m1 'mean power' out.txt)"
finish
