#!/usr/bin/env bash
# The rank command's contract: JSON rows sorted by score_db with meg_db identical to diversity's,
# the reference dipole's closed-form MEG, CSV/Markdown/HTML outputs, refusals and exit codes.
# Usage: rank_cli.sh ELLIPSA WORKDIR
set -uo pipefail
source "$(dirname "$0")/checks.sh"  # ok, bad, expect_rc, finish
E=$1; W=$2; rm -rf "$W"; mkdir -p "$W"; cd "$W"
py() { /usr/bin/python3 -c "import json,sys; d=json.load(open('out.txt')); $1"; }
expect_rc 0 "synth z dipole" "$E" synth dipole --step 2 --out z.csv
expect_rc 0 "synth x dipole (lying)" "$E" synth dipole --rotate-y 90 --step 2 --out x.csv
expect_rc 0 "synth small loop" "$E" synth small-loop --step 2 --out loop.csv
expect_rc 2 "rank refuses an empty environment name in the list" "$E" rank x.csv z.csv --environment uniform,,urban
expect_rc 2 "rank refuses an environment named twice (it would count twice in the score)" "$E" rank x.csv z.csv --environment urban,indoor,urban
grep -q 'expected each environment once, found "urban" twice' err.txt && ok "... naming it" || bad "repeated environment: $(cat err.txt)"
# Relative levels have no absolute scale: MEG scales them to directivity (a lossless antenna,
# pattern/diversity.hpp), and the ranking must say so rather than rank them as if they were gain.
"$E" convert z.csv zrel.csv --assume quantity=relative >/dev/null
expect_rc 0 "rank a relative-level file" "$E" rank zrel.csv x.csv --environment uniform --no-orientations
grep -q "dipole: relative data scaled to directivity over the full sphere: assumes a lossless antenna" out.txt && ok "... says what it assumed" || bad "relative note: $(tail -5 out.txt)"
expect_rc 0 "... and in JSON" "$E" rank zrel.csv x.csv --environment uniform --no-orientations --json
py "r=[r for r in d['rows'] if r['file']=='zrel.csv'][0]['environments']['uniform']; assert 'lossless' in r['assumption']; assert 'assumption' not in [r for r in d['rows'] if r['file']=='x.csv'][0]['environments']['uniform']" \
  && ok "... an assumption field on the relative file's figures only" || bad "relative assumption in JSON"
expect_rc 0 "rank three, two environments, JSON" "$E" rank x.csv loop.csv z.csv --environment uniform,urban --json
py "s=[r['score_db'] for r in d['rows']]; assert s == sorted(s, reverse=True), s; assert [r['rank'] for r in d['rows']] == [1,2,3]" \
  && ok "rows sorted by score_db descending" || bad "rows not sorted: $(head -c 300 out.txt)"
py "r=d['rows'][0]; assert {'file','name','score_db','environments'} <= r.keys(); assert {'uniform','urban'} == set(r['environments']); assert 'meg_db' in r['environments']['urban']" \
  && ok "rows carry file, name, score_db and per environment meg_db" || bad "row keys"
# A lossless vertical half-wave dipole is the default reference: the z dipole scores 0 dB and the
# isotropic environment gives every lossless antenna -3.01 dBi (Taga 1990; Kildal & Rosengren 2004).
py "r=[r for r in d['rows'] if r['file']=='z.csv'][0]; assert abs(r['score_db']) < 1e-9; assert abs(d['reference']['environments']['uniform']['meg_db'] + 3.0103) < 0.01" \
  && ok "reference dipole: -3.01 dBi isotropic, z dipole scores 0 dB" || bad "reference figures"
py "r=d['rows'][0]['environments']['uniform']; assert abs(r['fading_levels_db']['0.01'] - (r['meg_db'] - 19.978)) < 0.002" \
  && ok "fading level at 1 % is 19.98 dB below MEG (Rayleigh)" || bad "fading level"
cp out.txt rank.json
for f in x.csv loop.csv z.csv; do
  "$E" diversity $f --environment urban --json > div.json
  /usr/bin/python3 -c "
import json; r=[r for r in json.load(open('rank.json'))['rows'] if r['file']=='$f'][0]; d=json.load(open('div.json'))
assert r['environments']['urban']['meg_db'] == d['patterns'][0]['meg_db']" && ok "$f: meg_db identical to diversity's" || bad "$f: meg_db differs from diversity"
done
expect_rc 0 "CSV on stdout" "$E" rank x.csv z.csv --environment uniform --csv --no-orientations
head -1 out.txt | grep -q '^rank,file,name,frequency_hz,score_db,environment,' && ok "CSV header" || bad "CSV header: $(head -1 out.txt)"
[[ $(wc -l < out.txt) == 4 ]] && ok "CSV: one row per candidate and environment plus the reference" || bad "CSV rows: $(wc -l < out.txt)"
expect_rc 0 "Markdown file" "$E" rank x.csv z.csv --environment uniform --out rank.md
grep -q '^| Rank |' rank.md && grep -q 'Caution' rank.md && ok "Markdown table with cautions" || bad "Markdown: $(head -c 300 rank.md)"
expect_rc 0 "HTML file" "$E" rank x.csv z.csv --environment uniform --out rank.html
grep -q '<table>' rank.html && ok "HTML table" || bad "HTML"
expect_rc 1 "no replacing without --force" "$E" rank x.csv z.csv --environment uniform --out rank.md
expect_rc 0 "replacing with --force" "$E" rank x.csv z.csv --environment uniform --out rank.md --force
expect_rc 0 "human tables" "$E" rank x.csv z.csv --environment uniform --score random
grep -q 'Score: random orientation' out.txt && grep -q 'Caution:' out.txt && ok "human output names the score and the cautions" || bad "human: $(head -c 300 out.txt)"
expect_rc 0 "a file as reference" "$E" rank x.csv --reference z.csv --environment uniform --json
py "assert abs(d['rows'][0]['score_db']) < 0.01" && ok "x dipole against z dipole in the isotropic environment: 0 dB" || bad "file reference"
expect_rc 0 "every preset by default" "$E" rank z.csv --no-orientations --json
py "assert len(d['environment_list']) >= 4" && ok "default: every preset" || bad "default environments"
expect_rc 2 "an unknown score" "$E" rank z.csv --score best
expect_rc 2 "random score without the sweep" "$E" rank z.csv --score random --no-orientations
expect_rc 2 "outage outside (0, 1)" "$E" rank z.csv --outage 1
expect_rc 2 "unknown environment" "$E" rank z.csv --environment moon
expect_rc 2 "both --json and --csv" "$E" rank z.csv --json --csv
expect_rc 2 "a bad --out extension" "$E" rank z.csv --out r.txt
expect_rc 1 "missing file" "$E" rank nope.csv
expect_rc 1 "missing reference file" "$E" rank z.csv --reference nope.csv
finish
