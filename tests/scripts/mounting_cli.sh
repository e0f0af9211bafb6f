#!/usr/bin/env bash
# The mounting frame and the phase reference on the command line (docs/conventions.md, "The
# mounting frame" and "Phase centre"; docs/guide.md): --up, --rotate, --phase-centre, the CSV's
# mounting-up / mounting-turns metadata, the JSON mounting object and the refusals.
# The repeatable check of /work/shared/conventions.md: a dipole along x read with --up +x has the
# vertical gain, MEG in every environment and orientation curve of the dipole along z read as it is.
# Usage: mounting_cli.sh ELLIPSA WORKDIR
set -uo pipefail
source "$(dirname "$0")/checks.sh"  # ok, bad, expect_rc, finish
E=$1; W=$2; rm -rf "$W"; mkdir -p "$W"; cd "$W"
py() { /usr/bin/python3 -c "import json,sys; $1"; }
expect_rc 0 "synth dipole along z" "$E" synth dipole --step 2 --out z.csv
expect_rc 0 "synth dipole along x (turned 90 deg about y)" "$E" synth dipole --step 2 --rotate-y 90 --out x.csv

# Vertical gain at the same world directions (probe), within 0.02 dB: the x dipole is resampled
# onto the grid (interpolation), the z dipole is exact.
for dir in "90 0" "60 45" "30 120" "120 200" "150 300"; do
  set -- $dir
  "$E" probe z.csv --theta "$1" --phi "$2" --json >z.json 2>err.txt
  "$E" probe x.csv --up +x --theta "$1" --phi "$2" --json >x.json 2>err.txt
  py "z=json.load(open('z.json')); x=json.load(open('x.json')); assert abs(z['vertical_db']-x['vertical_db']) < 0.02, (z['vertical_db'], x['vertical_db']); assert x['mounting']['up']=='+x'" \
    && ok "vertical gain at theta $1, phi $2 equal (x dipole --up +x)" || bad "vertical gain at theta $1, phi $2: $(head -c 200 x.json)"
done

# MEG and the orientation curve in every environment (presets and the isotropic reference).
for env in uniform indoor urban rural; do
  "$E" diversity z.csv --environment "$env" --orientations --json >z.json 2>err.txt
  "$E" diversity x.csv --up +x --environment "$env" --orientations --json >x.json 2>err.txt
  py "
z=json.load(open('z.json'))['patterns'][0]; x=json.load(open('x.json'))['patterns'][0]
assert abs(z['meg_db']-x['meg_db']) < 0.01, (z['meg_db'], x['meg_db'])
zt=z['orientations']['by_tilt']; xt=x['orientations']['by_tilt']
assert len(zt)==len(xt)
for a,b in zip(zt,xt):
    for k in ('min_db','mean_db','max_db'): assert abs(a[k]-b[k]) < 0.02, (a, b)
assert x['mounting']['up']=='+x' and x['mounting']['rotation']=='resampled' and z['mounting']['identity']
" && ok "$env: MEG and orientation curve equal (x dipole --up +x)" || bad "$env: $(head -c 300 err.txt)"
done

# The same mounting from the file's own metadata, written by convert (fields untouched).
expect_rc 0 "convert records --up +x as metadata" "$E" convert x.csv xm.csv --up +x
grep -q '^# mounting-up: +x$' xm.csv && ok "convert wrote # mounting-up: +x" || bad "no mounting-up line: $(head -8 xm.csv)"
"$E" info xm.csv --json >m.json; "$E" info x.csv --up +x --json >x.json; "$E" info z.csv --json >z.json
py "
m=json.load(open('m.json')); x=json.load(open('x.json')); z=json.load(open('z.json'))
assert m['mounting']['from_file'] and not x['mounting']['from_file']
for k in ('peak_db','directivity_dbi','hpbw_elevation_deg'):
    assert m['results'][0][k] == x['results'][0][k], k
    assert abs(m['results'][0][k] - z['results'][0][k]) < 0.1, (k, m['results'][0][k], z['results'][0][k])
" && ok "the file's mounting reads as --up +x (and as the z dipole)" || bad "file mounting: $(head -c 300 m.json)"
"$E" info xm.csv --up +z --json >o.json
py "o=json.load(open('o.json')); assert o['mounting']['identity'] and abs(o['results'][0]['peak_theta_deg']) < 1e-9 or abs(o['results'][0]['peak_theta_deg']-180) < 1e-9 or o['results'][0]['peak_theta_deg']==90, o['results'][0]['peak_theta_deg']" \
  && ok "--up +z overrides the file's mounting" || bad "--up +z override: $(head -c 300 o.json)"
"$E" info xm.csv --up +z >o.txt
grep -q "mounting     as in the file (+z up) (the options replace or extend the file's up +x)" o.txt \
  && ok "info says the options replaced the file's mounting" || bad "override text: $(grep mounting o.txt)"

# Exact rotations: a half turn about x (--up -z) and quarter turns about z permute the samples.
"$E" info z.csv --up -z --rotate z:90 --json >e.json
py "e=json.load(open('e.json')); m=e['mounting']; assert m['rotation']=='exact' and [t['axis'] for t in m['turns']]==['z'], m" \
  && ok "--up -z --rotate z:90 is exact" || bad "exact rotation: $(head -c 300 e.json)"
"$E" info z.csv --up -z --rotate z:90 >e.txt
grep -q "mounting     up -z, then turns z:90 about the world axes; rotation exact (samples permuted)" e.txt \
  && ok "info text names the mounting" || bad "mounting text: $(grep mounting e.txt)"
# Turns apply left to right about the world axes: the x dipole turned z:90 lies along y, so x:90
# after it stands it up (vertical), while x:90 first leaves it horizontal.
"$E" probe x.csv --rotate z:90,x:90 --theta 90 --phi 0 --json >a.json
"$E" probe x.csv --rotate x:90,z:90 --theta 90 --phi 0 --json >b.json
py "a=json.load(open('a.json')); b=json.load(open('b.json')); assert abs(a['vertical_db']-2.15) < 0.02 and b['vertical_db'] is None or b['vertical_db'] < -40, (a['vertical_db'], b['vertical_db'])" \
  && ok "z:90,x:90 stands the x dipole up; x:90,z:90 does not" || bad "turn order: $(head -c 200 a.json) / $(head -c 200 b.json)"

# Phase centre (conventions.md): moving the reference to c multiplies by exp(-j k r.c), so a
# source at the origin then has its phase centre at -c; auto moves it onto the estimate.
"$E" info z.csv --phase-centre 0,0,0.1 --json >p.json
py "
r=json.load(open('p.json'))['results'][0]
x,y,zz=r['phase_centre']['position_m']; assert abs(x)<1e-6 and abs(y)<1e-6 and abs(zz+0.1)<1e-6, r['phase_centre']
s=r['phase_reference_shift_m']; assert abs(s[0])<1e-12 and abs(s[1])<1e-12 and abs(s[2]-0.1)<1e-12, s
assert abs(r['phase_centre']['position_wavelengths'][2] + 0.1*2.45e9/299792458) < 1e-6
" && ok "--phase-centre 0,0,0.1: phase centre at -0.1 m, shift reported" || bad "phase centre: $(head -c 400 p.json)"
"$E" convert z.csv moved.csv --phase-centre 0.05,0,0
"$E" info moved.csv --phase-centre auto --json >a.json
py "
r=json.load(open('a.json'))['results'][0]
assert max(abs(v) for v in r['phase_centre']['position_m']) < 1e-6, r['phase_centre']
s=r['phase_reference_shift_m']; assert abs(s[0]+0.05)<1e-6 and abs(s[1])<1e-6 and abs(s[2])<1e-6, s
" && ok "--phase-centre auto moves the reference back onto the source" || bad "auto: $(head -c 400 a.json)"
"$E" convert z.csv mag.csv --family theta-phi-db
"$E" info mag.csv --json >n.json
py "r=json.load(open('n.json'))['results'][0]; assert r['phase_centre'] is None and 'phase' in r['phase_centre_reason']" \
  && ok "magnitude-only data: phase_centre null with the reason" || bad "no phase: $(head -c 300 n.json)"
expect_rc 1 "--phase-centre on magnitude-only data is refused" "$E" info mag.csv --phase-centre auto
grep -q "needs the phase" err.txt && ok "and says it needs the phase" || bad "message: $(cat err.txt)"
# A reference 1e300 m away leaves phases that are rounding noise (2 pi r.c far beyond 2^53): refused.
expect_rc 1 "a phase reference a million wavelengths away or more is refused" "$E" info "z.csv::phase-centre=1e300,0,0"
grep -q "expected a phase reference within 1e+06 wavelengths of the origin" err.txt && ok "... saying how far it may be" || bad "far reference: $(cat err.txt)"

# Every command that reads patterns takes the options.
for c in "info z.csv" "probe z.csv --theta 90 --phi 0" "cut z.csv --phi 0 --out c.svg" "map z.csv --out m.png" \
         "coverage z.csv" "band z.csv --out b.json" "diversity z.csv" "fading z.csv --samples 2000" "convert z.csv c2.csv"; do
  rm -f c.svg m.png b.json c2.csv
  expect_rc 0 "${c%% *} --up +x --rotate z:30" "$E" $c --up +x --rotate z:30
done
"$E" cut x.csv --up +x --phi 0 --out c.csv --force >out.txt
grep -q "mounting: up +x" out.txt && ok "cut says the mounting" || bad "cut text: $(cat out.txt)"

# Refusals: what was expected, bad usage (2) on the command line, bad input (1) in a file.
expect_rc 2 "--up sideways" "$E" info z.csv --up sideways
grep -q "expected an axis (+x, -x, +y, -y, +z, -z) or a direction THETA,PHI" err.txt && ok "--up says what it expects" || bad "$(cat err.txt)"
expect_rc 2 "--up 200,0" "$E" info z.csv --up 200,0
expect_rc 2 "--rotate z30" "$E" info z.csv --rotate z30
grep -q "expected turns AXIS:DEG" err.txt && ok "--rotate says what it expects" || bad "$(cat err.txt)"
expect_rc 2 "--rotate w:10" "$E" diversity z.csv --rotate w:10
expect_rc 2 "--phase-centre 1,2" "$E" info z.csv --phase-centre 1,2
grep -q "expected X,Y,Z in metres" err.txt && ok "--phase-centre says what it expects" || bad "$(cat err.txt)"
# Each mention of a file carries its own options: a z dipole against itself turned up +x (an x
# dipole) is read twice, once turned. Two orthogonal short dipoles have zero envelope correlation
# in a uniform isotropic environment (Vaughan & Andersen, IEEE Trans. VT-36(4), 1987), either order
# (the closed form for short dipoles; for half-wave ones it is 0 by the same symmetry: the x
# dipole's field is odd where the z dipole's is even). The turned mention alone is turned.
for order in "z.csv z.csv::up=+x" "z.csv::up=+x z.csv"; do
  set -- $order
  "$E" diversity "$1" "$2" --environment uniform --json >twice.json 2>err.txt
  py "d=json.load(open('twice.json')); assert abs(d['ecc']) < 1e-6, d['ecc']; assert len(d['patterns']) == 2" \
    && ok "ECC 0 for a dipole against itself turned ($order)" || bad "$order: $(head -c 300 twice.json) $(cat err.txt)"
done
"$E" diversity z.csv z.csv::up=+x --environment uniform >twice.txt 2>err.txt
grep -q "mounting: up +x" twice.txt && ok "... and the text names the turned mention's mounting" || bad "$(cat twice.txt)"
# gain-transfer: the reference mention keeps its own options (it is read as relative levels while
# the antenna under test, the same file, is read as its gain); the added gain is the reference's
# gain minus its own peak level (IEEE Std 149 sec. 12), so here 5 dB minus the dipole's peak
expect_rc 0 "gain-transfer with the same file as its own reference (its own ::assume=)" \
  "$E" gain-transfer "z.csv::assume=quantity=relative" --reference "z.csv::assume=quantity=relative" --reference-gain 5 --out gt.csv
grep -q "2.45 GHz *5.00 *2.15 *2.85" out.txt && ok "... adds 5 dB minus the half-wave dipole's 2.15 dBi peak (Balanis 4.6)" || bad "$(cat out.txt)"
# the plain reference mention does not take the other mention's ::assume=: it is read as the file
# says (gain) and refused as no relative levels
expect_rc 1 "a plain --reference mention of the same file keeps the file's own quantity" \
  "$E" gain-transfer "z.csv::assume=quantity=relative" --reference z.csv --reference-gain 5 --out gt2.csv
grep -q "z.csv: expected the reference's relative levels (quantity relative), found gain" err.txt && ok "... saying so" || bad "$(cat err.txt)"
expect_rc 0 "a file named twice without options is read twice" "$E" diversity z.csv z.csv
sed 's/^# mounting-up: +x$/# mounting-up: upwards/' xm.csv >bad.csv
expect_rc 1 "a bad mounting-up line" "$E" info bad.csv
grep -q "bad.csv:[0-9]*:16: mounting-up: expected an axis" err.txt && ok "the file's line and column" || bad "$(cat err.txt)"
# One file's own mounting (FILE::up=, FILE::rotate=, FILE::phase-centre=; docs/far-field-csv.md,
# "Options for one file"): the same as the options, for that file only.
"$E" diversity x.csv::up=+x z.csv --environment urban --json >pf.json 2>err.txt
py "
p=json.load(open('pf.json'))['patterns']; x,z=p[0],p[1]
assert x['mounting']['up']=='+x' and z['mounting']['identity'], (x['mounting'], z['mounting'])
assert abs(x['meg_db']-z['meg_db']) < 0.01, (x['meg_db'], z['meg_db'])
" && ok "x.csv::up=+x beside z.csv: same MEG, each file its own mounting" || bad "per-file up: $(head -c 300 err.txt)"
"$E" info x.csv::rotate=z:30,x:10::up=-y --json >pr.json 2>err.txt
py "m=json.load(open('pr.json'))['mounting']; assert m['up']=='-y' and [(t['axis'],t['angle_deg']) for t in m['turns']]==[('z',30),('x',10)], m" \
  && ok "x.csv::rotate=z:30,x:10::up=-y" || bad "per-file rotate: $(head -c 300 err.txt)"
"$E" info z.csv::phase-centre=0,0,0.1 --json >pp.json 2>err.txt
py "s=json.load(open('pp.json'))['results'][0]['phase_reference_shift_m']; assert abs(s[2]-0.1)<1e-12, s" \
  && ok "z.csv::phase-centre=0,0,0.1" || bad "per-file phase centre: $(head -c 300 err.txt)"
expect_rc 2 "x.csv::up=sideways" "$E" info x.csv::up=sideways
grep -q "x.csv: ::up=: expected an axis" err.txt && ok "::up= says what it expects" || bad "$(cat err.txt)"
expect_rc 2 "x.csv::rotate=z30" "$E" diversity x.csv::rotate=z30
grep -q "::rotate=: expected turns AXIS:DEG" err.txt && ok "::rotate= says what it expects" || bad "$(cat err.txt)"
expect_rc 1 "x.csv::up=+x with --up +y" "$E" info x.csv::up=+x --up +y
grep -q "expected the mounting once, found --up and ::up= both" err.txt && ok "a mounting given twice names both" || bad "$(cat err.txt)"
finish
