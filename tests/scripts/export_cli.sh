#!/usr/bin/env bash
# ellipsa cut end to end: SVG is well-formed XML with one stroked path per curve (plus its legend
# swatch), the PDF opens in poppler, the PNG has the asked-for size, the CSV equals the core's
# values (cross-checked against `ellipsa probe`, which interpolates with the same core), usage
# errors exit 2, and a failed write (existing file, file where a folder is expected, read-only
# folder) exits 1 and leaves existing files untouched.
# Usage: export_cli.sh ELLIPSA WORKDIR
set -uo pipefail
source "$(dirname "$0")/checks.sh"  # ok, bad, expect_rc, finish
E=$1; W=$2; rm -rf "$W"; mkdir -p "$W"; chmod 755 "$W"; cd "$W"
# Cairo writes colours as percentages; these are the first three Okabe-Ito curve colours.
C1='stroke:rgb(0%,44.705882%,69.803922%)'
C2='stroke:rgb(83.529412%,36.862745%,0%)'
C3='stroke:rgb(0%,61.960784%,45.098039%)'
C4='stroke:rgb(80%,47.45098%,65.490196%)'
count_paths() { xmllint --xpath "count(//*[local-name()='path'][contains(@style,'$2')])" "$1" 2>/dev/null; }

expect_rc 0 "synth crossed dipoles" "$E" synth crossed-dipoles --step 2 --out x.csv
expect_rc 0 "synth dipole" "$E" synth dipole --length 1.25 --step 2 --out d.csv

# SVG
expect_rc 0 "cut to SVG, three components" "$E" cut x.csv --phi 0 --components total,rhcp,lhcp --out c.svg
# The summary lines say the core's words: its labels (pattern/components.hpp short_label), the
# nadir as theta = 180 (pattern/cut.hpp: -180 and +180 are one direction of the closed loop), a
# missing HPBW with its reason (exports/figure_text.hpp beamwidth_text).
grep -q '^  Total: peak' out.txt && grep -q '^  RHCP: peak' out.txt && grep -q '^  LHCP: peak' out.txt \
  && ok "cut text: core labels Total, RHCP, LHCP" || bad "cut text labels: $(cat out.txt)"
! grep -Eq '^  (total|rhcp|lhcp):' out.txt && ok "cut text: no machine names" || bad "cut text machine names: $(cat out.txt)"
! grep -q 'theta = -180\.0' out.txt && ok "cut text: no -180.0 (same direction as 180)" || bad "cut text -180: $(cat out.txt)"
! grep -Eq 'HPBW none(,|$)' out.txt && ok "cut text: HPBW none always has a reason" || bad "bare HPBW none: $(cat out.txt)"
! grep -q -- '-inf' out.txt && ok "cut text: never -inf" || bad "cut text -inf: $(cat out.txt)"
# A z dipole's azimuth cut has no beam: the reason is given (omnidirectional, with its ripple).
expect_rc 0 "azimuth cut of a dipole" "$E" cut d.csv --theta 90 --out o.svg
grep -q '^  Total: peak .* HPBW none: omnidirectional (ripple ' out.txt && ok "cut text: HPBW none says why" || bad "HPBW reason: $(cat out.txt)"
xmllint --noout c.svg 2>err.txt && ok "SVG is well-formed XML (xmllint)" || bad "SVG not well-formed: $(head -c 300 err.txt)"
for c in "$C1" "$C2" "$C3"; do
  n=$(count_paths c.svg "$c"); [[ $n == 2 ]] && ok "SVG: curve + legend swatch in $c" || bad "SVG: $n paths in $c, expected 2"
done
n=$(count_paths c.svg "$C4"); [[ $n == 0 ]] && ok "SVG: no fourth curve" || bad "SVG: $n paths in a fourth colour"
expect_rc 0 "rect style SVG" "$E" cut x.csv --theta 90 --components total,phi --style rect --out r.svg
xmllint --noout r.svg 2>/dev/null && ok "rect SVG well-formed" || bad "rect SVG not well-formed"
n1=$(count_paths r.svg "$C1"); n3=$(count_paths r.svg "$C3")
[[ $n1 == 2 && $n3 == 0 ]] && ok "rect SVG: two curves" || bad "rect SVG: colour counts $n1/$n3"

# PDF
expect_rc 0 "cut to PDF" "$E" cut d.csv --through-peak --components total,theta --title "Dipole 1.25 wl" --out c.pdf
pdfinfo c.pdf >info.txt 2>err.txt && ok "pdfinfo opens the PDF" || bad "pdfinfo failed: $(cat err.txt)"
grep -q '^Pages: *1$' info.txt && ok "PDF has one page" || bad "PDF pages: $(grep Pages info.txt)"
grep -q '^Page size: *576 x 432 pts' info.txt && ok "PDF page is 8 x 6 in (1200x900 px at 150 dpi)" || bad "PDF size: $(grep 'Page size' info.txt)"
grep -q '^Title: *Dipole 1.25 wl' info.txt && ok "PDF title metadata" || bad "PDF title: $(grep Title info.txt)"
pdffonts c.pdf 2>/dev/null | grep -q DejaVuSans && ok "PDF embeds the bundled DejaVu Sans" || bad "PDF fonts: $(pdffonts c.pdf 2>&1 | tail -n +3)"

# PNG: width and height from the IHDR chunk (PNG spec: bytes 16..23, big-endian)
expect_rc 0 "cut to PNG" "$E" cut d.csv --phi 90 --size 640x480 --dpi 96 --out c.png
wh=$(od -An -tu1 -j16 -N8 c.png | awk '{print $1*16777216+$2*65536+$3*256+$4 "x" $5*16777216+$6*65536+$7*256+$8}')
[[ $wh == 640x480 ]] && ok "PNG is 640x480" || bad "PNG size $wh"
[[ $(stat -c %s c.png) -gt 8000 ]] && ok "PNG has content (not a blank page)" || bad "PNG suspiciously small: $(stat -c %s c.png) bytes"

# CSV: header, sample count, and the values against `probe` (same core interpolation)
expect_rc 0 "cut to CSV" "$E" cut x.csv --phi 0 --components total,rhcp --step 1 --out c.csv
head -1 c.csv | grep -q '^angle_deg,theta_deg,phi_deg,total_dbi,rhcp_dbic$' && ok "CSV header" || bad "CSV header: $(head -1 c.csv)"
[[ $(($(wc -l <c.csv) - 1)) == 360 ]] && ok "CSV has 360 samples at 1 deg" || bad "CSV rows: $(wc -l <c.csv)"
for ang in 30 -60 135; do
  row=$(awk -F, -v a="$ang" 'NR>1 && $1==a' c.csv)
  th=$(echo "$row" | cut -d, -f2); ph=$(echo "$row" | cut -d, -f3)
  "$E" probe x.csv --theta "$th" --phi "$ph" --json >probe.txt 2>/dev/null
  want_t=$(grep -o '"total_db": *[-0-9.e+]*' probe.txt | awk -F: '{print $2}')
  want_r=$(grep -o '"rhcp_db": *[-0-9.e+]*' probe.txt | awk -F: '{print $2}')
  got_t=$(echo "$row" | cut -d, -f4); got_r=$(echo "$row" | cut -d, -f5)
  awk -v a="$got_t" -v b="$want_t" -v c="$got_r" -v d="$want_r" 'BEGIN{exit !((a-b)^2 < 1e-16 && (c-d)^2 < 1e-16)}' \
    && ok "CSV at angle $ang equals probe (total $got_t, rhcp $got_r)" \
    || bad "CSV at angle $ang: $got_t/$got_r vs probe $want_t/$want_r"
done

# Magnitude-only data: components that need the phase are refused, the others are plotted.
expect_rc 0 "convert to magnitude-only (theta-phi-db)" "$E" convert x.csv xm.csv --family theta-phi-db
expect_rc 1 "rhcp on magnitude-only data is refused" "$E" cut xm.csv --phi 0 --components total,rhcp --out m.svg
grep -q 'needs the phase' err.txt && ok "message says the component needs the phase: $(head -1 err.txt)" || bad "message: $(cat err.txt)"
[[ ! -e m.svg ]] && ok "nothing written when refused" || bad "m.svg written"
expect_rc 0 "theta/phi on magnitude-only data are plotted" "$E" cut xm.csv --phi 0 --components total,theta,phi --out m.svg
expect_rc 0 "total-only data" "$E" convert x.csv xt.csv --family total-db
expect_rc 1 "theta on total-only data is refused" "$E" cut xt.csv --phi 0 --components theta --out t.svg
grep -q 'only the total' err.txt && ok "message says only the total is known" || bad "message: $(cat err.txt)"

# Usage errors
expect_rc 2 "two cuts at once is bad usage" "$E" cut d.csv --phi 0 --theta 90 --out u.svg
expect_rc 2 "no cut is bad usage" "$E" cut d.csv --out u.svg
expect_rc 2 "unknown extension is bad usage" "$E" cut d.csv --phi 0 --out u.jpg
expect_rc 2 "bad size is bad usage" "$E" cut d.csv --phi 0 --size 12by10 --out u.svg
expect_rc 2 "unknown component is bad usage" "$E" cut d.csv --phi 0 --components total,circular --out u.svg
grep -q 'circular' err.txt && ok "message names the unknown component" || bad "message: $(cat err.txt)"
expect_rc 2 "theta outside 0..180 is bad usage" "$E" cut d.csv --theta 200 --out u.svg
for o in "--range nan" "--step nan" "--dpi nan"; do
  expect_rc 2 "$o is bad usage" "$E" cut d.csv --theta 90 $o --out u.svg
done
expect_rc 2 "--phi nan is bad usage" "$E" cut d.csv --phi nan --out u.svg
grep -q -- '--phi: expected a number from -360 to 360, found "nan"' err.txt && ok "message: $(head -1 err.txt)" || bad "message: $(cat err.txt)"
expect_rc 1 "missing input file is bad input" "$E" cut nope.csv --phi 0 --out u.svg
[[ ! -e u.svg ]] && ok "nothing written on errors" || bad "u.svg written despite errors"

# Existing files are kept without --force
cp c.svg keep.svg
expect_rc 1 "existing output without --force" "$E" cut d.csv --phi 0 --out c.svg
grep -q 'already exists; use --force' err.txt && ok "message says to use --force" || bad "message: $(cat err.txt)"
cmp -s c.svg keep.svg && ok "existing file untouched" || bad "existing file changed"
expect_rc 0 "--force replaces it" "$E" cut d.csv --phi 0 --force --out c.svg
cmp -s c.svg keep.svg && bad "--force did not replace the file" || ok "file replaced with --force"

# A regular file where a folder is expected: the write must fail cleanly (works as root too).
echo "precious" > notadir
expect_rc 1 "output under a regular file fails" "$E" cut d.csv --phi 0 --force --out notadir/c.svg
grep -q 'notadir/c.svg' err.txt && ok "message names the path" || bad "message: $(cat err.txt)"
[[ $(cat notadir) == precious ]] && ok "the file in the way is untouched" || bad "notadir changed"

# A read-only folder holding an existing export. Root ignores permission bits, so when running as
# root the export runs as user nobody (setpriv), for whom the 0555 folder really is read-only.
mkdir -p ro && cp keep.svg ro/c.svg && chmod 755 ro/c.svg && chmod 555 ro
run_unprivileged() { if [[ $(id -u) == 0 ]]; then setpriv --reuid=65534 --regid=65534 --clear-groups "$@"; else "$@"; fi; }
if [[ $(id -u) != 0 ]] || command -v setpriv >/dev/null; then
  chmod 644 d.csv
  run_unprivileged "$E" cut d.csv --phi 0 --force --out ro/c.svg >out.txt 2>err.txt; rc=$?
  [[ $rc == 1 ]] && ok "export into a read-only folder exits 1" || bad "read-only folder: exit $rc; $(cat err.txt)"
  grep -q 'ro/c.svg' err.txt && ok "message names the file: $(head -1 err.txt)" || bad "message: $(cat err.txt)"
  cmp -s ro/c.svg keep.svg && ok "existing file in the read-only folder untouched" || bad "ro/c.svg changed"
  [[ $(ls ro | wc -l) == 1 ]] && ok "no temporary file left behind" || bad "left: $(ls ro)"
else
  bad "cannot test a read-only folder: running as root without setpriv"
fi
chmod 755 ro

for c in cut; do expect_rc 0 "$c --help" "$E" "$c" --help; done
finish
