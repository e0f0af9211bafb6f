#!/usr/bin/env bash
# ellipsa report end to end: the folder holds a well-formed, self-contained index.html and a
# report.md whose images all exist; SVG figures are well-formed; an existing folder is kept
# without --force and replaced with it; failed writes (file in the way, read-only parent as a
# non-root user) exit 1 and leave the existing folder untouched, with no temporary folder left.
# Usage: report_cli.sh ELLIPSA WORKDIR
set -uo pipefail
source "$(dirname "$0")/checks.sh"  # ok, bad, expect_rc, finish
E=$1; W=$2; rm -rf "$W"; mkdir -p "$W"; chmod 755 "$W"; cd "$W"
OPTS=(--size 480x360 --dpi 60)
expect_rc 0 "synth dipole" "$E" synth dipole --length 1 --step 3 --name "Full-wave dipole" --out a.csv
expect_rc 0 "synth turnstile" "$E" synth crossed-dipoles --step 3 --rotate-x 35 --rotate-z 30 --name "Turnstile" --out b.csv
chmod 644 a.csv b.csv
expect_rc 0 "report on two patterns" "$E" report a.csv b.csv --out rep "${OPTS[@]}"
[[ -f rep/index.html && -f rep/report.md ]] && ok "index.html and report.md written" || bad "missing index.html/report.md"
xmllint --noout rep/index.html 2>err.txt && ok "index.html is well-formed (xmllint)" || bad "index.html: $(head -c 300 err.txt)"
grep -qi 'http\|<script\|@import\|url(' rep/index.html && bad "index.html refers to something outside the folder" || ok "index.html has no network resources"
missing=0
for f in $(grep -o '\(src\|href\)="[^"]*"' rep/index.html | sed 's/.*="\(.*\)"/\1/'); do [[ -f rep/$f ]] || { missing=1; echo "  missing $f"; }; done
for f in $(grep -o '](\([^)]*\))' rep/report.md | sed 's/](\(.*\))/\1/'); do [[ -f rep/$f ]] || { missing=1; echo "  missing $f"; }; done
[[ $missing == 0 ]] && ok "every referenced image and file exists in the folder" || bad "references to missing files"
nsvg=$(ls rep/*.svg | wc -l); bad_svg=0
for f in rep/*.svg; do xmllint --noout "$f" 2>/dev/null || bad_svg=1; done
[[ $bad_svg == 0 && $nsvg -ge 9 ]] && ok "$nsvg SVG figures, all well-formed" || bad "SVG figures: $nsvg, malformed: $bad_svg"
ls rep/ | grep -q -- '-peak\.svg$' && ok "cut through an off-plane peak included" || bad "no peak cut: $(ls rep)"
ls rep/ | grep -q '^compare-phi0\.svg$' && ok "comparison figures written" || bad "no comparison figures"
# 3D views: required when this build can render headless (ellipsa render works), else a note.
if "$E" render a.csv --out probe3d.png --size 96x72 >/dev/null 2>&1; then
  [[ $(ls rep/*-3d.png 2>/dev/null | wc -l) == 2 ]] && ok "one 3D snapshot per pattern and frequency" || bad "3D snapshots: $(ls rep | grep 3d)"
  [[ $(ls rep/*-3d-axial-ratio.png 2>/dev/null | wc -l) == 2 ]] && ok "and one coloured by axial ratio (data with phase)" || bad "AR snapshots: $(ls rep | grep 3d)"
  grep -q -- '-3d.png' rep/index.html && grep -q -- '-3d.png' rep/report.md && ok "snapshots shown in both documents" || bad "snapshots not referenced"
else
  grep -q "3D view unavailable\|3D views are not included" rep/report.md && ok "no headless renderer here: the report says so" || bad "no snapshots and no note"
fi
# Handbook figure in both documents: full-wave dipole D = 3.82 dBi, HPBW 47.8 deg (Balanis sec. 4.5, Table 4.2).
for d in index.html report.md; do
  grep -q '3\.8[12]' rep/$d && grep -q '47\.[6-9]' rep/$d && ok "$d carries the full-wave dipole's 3.82 dBi and 47.8 deg" || bad "$d lacks the dipole figures"
done
# The same rows in both documents.
rows_md=$(grep '^| ' rep/report.md | grep -vc -- '^| ---'); rows_html=$(grep -c '<tr>' rep/index.html)
[[ $rows_md == "$rows_html" ]] && ok "same number of table rows in HTML and Markdown ($rows_md)" || bad "table rows: md $rows_md, html $rows_html"

# Existing folder kept without --force, replaced with it, nothing left behind.
echo marker > rep/marker.txt
expect_rc 1 "existing folder without --force" "$E" report a.csv --out rep "${OPTS[@]}"
grep -q 'use --force' err.txt && ok "message says to use --force" || bad "message: $(cat err.txt)"
[[ -f rep/marker.txt && -f rep/compare-phi0.svg ]] && ok "existing folder untouched" || bad "existing folder changed"
expect_rc 0 "--force replaces the folder" "$E" report a.csv --out rep --force "${OPTS[@]}"
[[ ! -f rep/marker.txt && ! -f rep/compare-phi0.svg && -f rep/index.html ]] && ok "folder replaced as a whole" || bad "old content left in the folder"
[[ $(ls -d rep* | wc -l) == 1 ]] && ok "no temporary or old folder left beside it" || bad "left: $(ls -d rep*)"

# --force never replaces a folder that is not a report.
mkdir -p notreport && echo "my notes" > notreport/notes.txt
expect_rc 1 "--force refuses a folder that is not a report" "$E" report a.csv --out notreport --force "${OPTS[@]}"
[[ $(cat notreport/notes.txt) == "my notes" ]] && ok "the other folder is untouched" || bad "notreport changed"
# Not even one that merely holds an index.html and report.md (it used to be deleted whole, .git too).
mkdir -p site/.git && echo page > site/index.html && echo text > site/report.md && echo "my notes" > site/notes.txt
expect_rc 1 "--force refuses a folder ellipsa did not make" "$E" report a.csv --out site --force "${OPTS[@]}"
grep -q 'not made by ellipsa' err.txt && [[ -d site/.git && $(cat site/notes.txt) == "my notes" && $(cat site/index.html) == page ]] \
  && ok "the user's folder, its notes and .git are untouched" || bad "site changed: $(cat err.txt)"
[[ -f rep/.ellipsa-folder ]] && ok "a report folder carries ellipsa's marker" || bad "no marker in rep"
# Nor a report folder that holds the report's own input.
cp a.csv rep/a.csv
expect_rc 1 "--force refuses a folder holding an input" "$E" report rep/a.csv --out rep --force "${OPTS[@]}"
grep -q 'an input of this run' err.txt && [[ -f rep/a.csv ]] && ok "the input is kept" || bad "input folder: $(cat err.txt)"
rm rep/a.csv
(umask 077 && "$E" report a.csv --out private "${OPTS[@]}" >/dev/null) && [[ $(stat -c %a private) == 700 && $(stat -c %a private/index.html) == 600 ]] \
  && ok "a new report folder follows the umask (077: 700, files 600)" || bad "umask: $(stat -c %a private) $(stat -c %a private/index.html)"

# A regular file where the folder's parent should be.
echo keep > plain
expect_rc 1 "output under a regular file fails" "$E" report a.csv --out plain/rep "${OPTS[@]}"
[[ $(cat plain) == keep ]] && ok "the file in the way is untouched" || bad "plain changed"

# Read-only parent folder holding an existing report: as user nobody when running as root
# (root ignores permission bits).
mkdir -p ro && cp -r rep ro/rep && chmod -R a+rX ro && chmod 555 ro
run_unprivileged() { if [[ $(id -u) == 0 ]]; then setpriv --reuid=65534 --regid=65534 --clear-groups "$@"; else "$@"; fi; }
before=$(cd ro/rep && sha256sum * | sha256sum)
run_unprivileged "$E" report a.csv --out ro/rep --force "${OPTS[@]}" >out.txt 2>err.txt; rc=$?
[[ $rc == 1 ]] && ok "report into a read-only folder exits 1: $(head -1 err.txt)" || bad "read-only: exit $rc; $(cat err.txt)"
after=$(cd ro/rep && sha256sum * | sha256sum)
[[ $before == "$after" ]] && ok "existing report in the read-only folder untouched" || bad "ro/rep changed"
[[ $(ls ro | wc -l) == 1 ]] && ok "no temporary folder left in the read-only folder" || bad "left: $(ls ro)"
chmod 755 ro

expect_rc 2 "unknown environment is bad usage" "$E" report a.csv --out rep3 --environment moon
[[ ! -e rep3 ]] && ok "nothing created on a usage error" || bad "rep3 created"
expect_rc 0 "report with the urban environment" "$E" report a.csv --out rep3 --environment urban "${OPTS[@]}"
grep -q 'MEG, urban environment' rep3/report.md && ok "MEG row names the environment" || bad "no MEG row"
# Names with markup characters are escaped; rectangular cuts on request.
expect_rc 0 "synth a dipole named with markup characters" "$E" synth dipole --step 6 --name 'Dipole <A&B> "x" | *y*' --out m.csv
expect_rc 0 "report with --style rect" "$E" report m.csv --out rep4 --style rect "${OPTS[@]}"
xmllint --noout rep4/index.html 2>err.txt && ok "names with < & > \" stay well-formed HTML" || bad "escaping: $(head -c 300 err.txt)"
grep -q 'Dipole &lt;A&amp;B&gt;' rep4/index.html && ok "HTML shows the name escaped" || bad "name not escaped in HTML"
grep -qF 'Dipole \<A&B> "x" \| \*y\*' rep4/report.md && ok "Markdown escapes < | * in text" || bad "Markdown cell: $(grep -m1 'Dipole' rep4/report.md)"
expect_rc 2 "unknown style is bad usage" "$E" report a.csv --out rep5 --style pie
expect_rc 2 "no output folder is bad usage" "$E" report a.csv
expect_rc 1 "missing input is bad input" "$E" report a.csv nope.csv --out rep2
[[ ! -e rep2 ]] && ok "nothing created when an input is missing" || bad "rep2 created"
expect_rc 0 "report --help" "$E" report --help
# The Method section states the world frame and each pattern's mounting in the words of every
# output (exports::mounting_text), not "+z up" whatever the file's axes (issue 12).
expect_rc 0 "report with a mounting" "$E" report "a.csv::up=+x" b.csv --out rep5 --environment urban "${OPTS[@]}"
grep -q "Frame: every figure refers to the installed antenna in the world frame" rep5/report.md \
  && grep -q "Mounting applied: A. up +x; rotation resampled (interpolated between samples); B. as in the file (+z up)." rep5/report.md \
  && ok "Method names the world frame and each mounting" || bad "Method: $(grep -A2 '## Method' rep5/report.md | head -c 400)"
grep -q "antenna +z up" rep5/report.md && bad "the MEG paragraph still assumes +z up" || ok "the MEG paragraph refers to the mounting"
finish
