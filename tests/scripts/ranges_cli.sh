#!/usr/bin/env bash
# Real range and simulator files from the command line (issue 14): the load options on every
# command (the viewer included), options for one file (FILE::key=value), the map file beside a
# file, and the viewer's scripted-run refusals. Usage: ranges_cli.sh ELLIPSA WORKDIR SOURCE_DIR
set -uo pipefail
source "$(dirname "$0")/checks.sh"  # ok, bad, expect_rc, finish
E=$1; W=$2; SRC=$3; rm -rf "$W"; mkdir -p "$W"; cd "$W"
R3="$SRC/tests/data/csv/foreign/range3.csv"; M3="$SRC/tests/data/csv/foreign/range3.map"
"$E" synth short-dipole --step 10 --out sim.csv >/dev/null || bad "synth"
cp "$R3" meas.csv  # a foreign file with no map beside it

# --- The same load options on every command that reads patterns (docs/far-field-csv.md, section 9) ---
has_view=0; has_command "$E" view && has_view=1  # not in a build without the viewer
for cmd in info cut map probe render view convert band coverage diversity fading report; do
  if [[ $has_view == 0 && ( $cmd == view || $cmd == render ) ]]; then
    refused_without_viewer "$cmd --help" "$E" $cmd --help; continue
  fi
  h=$("$E" $cmd --help 2>&1)
  all=1
  for o in --map --map-file --assume --scale --offset; do grep -q -- "^  $o " <<<"$h" || all=0; done
  grep -q "FILE::map=" <<<"$h" || all=0
  [[ $all == 1 ]] && ok "$cmd takes --map, --map-file, --assume, --scale, --offset and FILE::key=value" || bad "$cmd lacks a load option"
done

# --- Options for one file: a measured file with its map beside a simulated one ---
ref=$("$E" info meas.csv --map-file "$M3" --json)
got=$("$E" info "meas.csv::map=$M3" --json)
[[ "$ref" == "$got" ]] && ok "FILE::map=MAPFILE reads as --map-file" || bad "FILE::map differs"
got=$("$E" info "meas.csv::map-file=$M3" --json)
[[ "$ref" == "$got" ]] && ok "FILE::map-file=MAPFILE reads as --map-file" || bad "FILE::map-file differs"
got=$("$E" info "meas.csv::map=Sample=ignore,Remark=ignore,Az/deg=azimuth,El/deg=elevation,Level re horn/dB=e_total_db::offset=e_total_db=7.5::assume=quantity=gain,frequency=5.8 GHz" --json)
[[ "$ref" == "$got" ]] && ok "FILE::map=...::offset=...::assume=... gives the same as the map file" || bad "inline per-file options differ"
expect_rc 0 "diversity: a simulated file and a measured one with its own map" "$E" diversity sim.csv "meas.csv::map=$M3"
grep -q "meas.csv" out.txt && ! grep -q "::map" out.txt && ok "the output names the file, not its options" || bad "file name shown: $(head -3 out.txt)"
expect_rc 0 "band: two files, one with its own map" "$E" band sim.csv "meas.csv::map=$M3" --out band.svg
expect_rc 2 "an unknown per-file key is a usage error" "$E" info "meas.csv::mapp=$M3"
grep -q 'meas.csv: expected ::key=value after the file name, key one of map, map-file, assume, scale, offset, angles, up, rotate, phase-centre, join, found "mapp=' err.txt \
  && ok "... naming the key and the choices" || bad "unknown key message: $(cat err.txt)"
expect_rc 1 "a key given for the file and for all files is refused" "$E" info "meas.csv::map=$M3::assume=quantity=relative"
grep -q "meas.csv::assume: expected metadata \"quantity\" once, found it again (first from .*range3.map:8)" err.txt \
  && ok "... naming both places" || bad "repeat message: $(cat err.txt)"
expect_rc 1 "the command's options apply to every file, the file's own are added" "$E" info "meas.csv::map=$M3" --assume quantity=relative
grep -q "expected metadata \"quantity\" once" err.txt && ok "... and a clash between them is named" || bad "clash: $(cat err.txt)"

# --- The map file beside the file (the viewer's convention, now every command's) ---
cp "$R3" beside.csv; cp "$M3" beside.map
expect_rc 0 "a map file beside the file (same stem) is used when no map is given" "$E" info beside.csv --json
grep -q "beside.csv: read with the map file beside it, beside.map" err.txt && ok "... and named on stderr" || bad "beside note: $(cat err.txt)"
mkdir -p named && cp "$R3" named/export-0001.csv && { echo "# for export-0001.csv"; cat "$M3"; } >named/range.map
expect_rc 0 "a .map file in the folder that names the file is used" "$E" info named/export-0001.csv
expect_rc 1 "an explicit map replaces the one beside (here: a wrong one)" "$E" info beside.csv --map "Sample=ignore"

# --- A free-text preamble before the header row (docs/far-field-csv.md) ---
P3="$SRC/tests/data/csv/foreign/range3_preamble.csv"
expect_rc 0 "a preamble before the header is skipped by the mapped names" "$E" info "$P3" --map-file "$M3" --json
grep -q "range3_preamble.csv: skipped 6 lines of free text before the header row (line 8)" err.txt && ok "... and the count is reported" || bad "preamble note: $(cat err.txt)"
got=$("$E" info "$P3" --map-file "$M3" --json | sed 's/range3_preamble/range3/g')
[[ "$got" == "$("$E" info "$R3" --map-file "$M3" --json)" ]] && ok "... with the figures of the file without it" || bad "preamble figures differ"
{ printf 'Controller export\nrun 17\n'; cat sim.csv; } >sim_pre.csv
expect_rc 0 "--assume skip-lines=2 skips two lines of a schema file" "$E" info sim_pre.csv --assume skip-lines=2
expect_rc 1 "skip-lines that is not a count is refused" "$E" info sim_pre.csv --assume skip-lines=two
grep -q -- "--assume: skip-lines: expected a whole number of lines" err.txt && ok "... naming the option" || bad "skip-lines: $(cat err.txt)"

# --- Gain transfer (IEEE Std 149 sec. 12): relative levels to gain through a reference ---
"$E" synth dipole --step 5 --frequency 5.8e9 --out aut_g.csv >/dev/null
"$E" synth short-dipole --step 5 --frequency 5.8e9 --out ref_g.csv >/dev/null
# The range sees both 25 dB down, in relative units (an invented set-up).
for f in aut ref; do
  "$E" convert "${f}_g.csv" "${f}_rel.csv" --force --assume quantity=relative --scale "e_theta_re=0.056234132519034905,e_theta_im=0.056234132519034905,e_phi_re=0.056234132519034905,e_phi_im=0.056234132519034905" >/dev/null || bad "make $f"
done
expect_rc 0 "gain-transfer with a reference file and its known gain" "$E" gain-transfer aut_rel.csv --reference ref_rel.csv --reference-gain 1.7609 --out aut_gain.csv
grep -q "wrote aut_gain.csv: gain by comparison with reference ref_rel.csv" out.txt && ok "... naming the reference used" || bad "gain-transfer output: $(cat out.txt)"
pk=$("$E" info aut_gain.csv --json | /usr/bin/python3 -c 'import json,sys; print(json.load(sys.stdin)["results"][0]["peak_db"])')
/usr/bin/python3 -c "import sys; sys.exit(0 if abs($pk - 2.15) < 0.01 else 1)" \
  && ok "the half-wave dipole comes back at 2.15 dBi (Balanis sec. 4.5)" || bad "transferred peak $pk"
grep -q "^# note: gain by comparison with the reference ref_rel.csv (IEEE Std 149 sec. 12)" aut_gain.csv && ok "the file's note says which reference" || bad "note"
expect_rc 0 "gain-transfer with the reference's measured level" "$E" gain-transfer aut_rel.csv --reference-level -23.24 --reference-gain "5.8GHz=1.76" --out aut_gain2.csv
expect_rc 2 "gain-transfer needs one reference" "$E" gain-transfer aut_rel.csv --reference-gain 1 --out x.csv
expect_rc 2 "a gain list without the file's frequency is a usage error" "$E" gain-transfer aut_rel.csv --reference-level 0 --reference-gain "2.4GHz=1" --out x.csv
grep -q "expected a gain for 5.8 GHz, found none" err.txt && ok "... naming the frequency" || bad "gain list: $(cat err.txt)"
expect_rc 1 "gain data are refused (already gain)" "$E" gain-transfer aut_g.csv --reference-level 0 --reference-gain 1 --out x.csv
# A list that gives one frequency two gains, or bare gains among several items, is ambiguous:
# refused rather than the last item silently winning.
expect_rc 2 "two gains for one frequency are refused" "$E" gain-transfer aut_rel.csv --reference-level 0 --reference-gain "5.8GHz=1,5.8GHz=2" --out x.csv
grep -q "expected one gain for 5.8 GHz, found two items that match it" err.txt && ok "... naming the frequency" || bad "duplicate gain: $(cat err.txt)"
expect_rc 2 "two items within 0.5 % of one frequency are refused" "$E" gain-transfer aut_rel.csv --reference-level 0 --reference-gain "5.79GHz=1,5.81GHz=2" --out x.csv
expect_rc 2 "bare gains among several items are refused" "$E" gain-transfer aut_rel.csv --reference-level 0 --reference-gain "1,2" --out x.csv
grep -q "found a gain without a frequency among 2 items" err.txt && ok "... saying what is missing" || bad "bare gains: $(cat err.txt)"
[[ ! -e x.csv ]] && ok "... and nothing is written" || bad "x.csv written by a refused transfer"

# --- The viewer: the same options, and scripted runs that fail instead of falling back ---
if [[ $has_view == 0 ]]; then  # a build without the viewer: refused with the reason, before reading
  refused_without_viewer "view with options for one file" "$E" view sim.csv "meas.csv::map=nothing-here.map" --frames 2
  refused_without_viewer "render to a name it cannot write" "$E" render sim.csv --out view.jpg
  finish; exit
fi
expect_rc 1 "view --frames with a missing file fails (no fallback to the examples)" "$E" view missing.csv --frames 2
grep -q "missing.csv: expected a pattern file, found nothing" err.txt && ok "... naming the file" || bad "missing file: $(cat err.txt)"
expect_rc 2 "view --compare beyond the files given is a usage error" "$E" view sim.csv --compare 3 --frames 2
grep -q -- "--compare expects a FILE number from 1 to 1, found 3" err.txt && ok "... naming the range" || bad "compare: $(cat err.txt)"
# --- Angle layouts (docs/far-field-csv.md, "Angle layouts"): ::angles= for one file ---
L="$SRC/tests/data/csv/layouts"
cp "$L/range_el_over_az.csv" eoa.csv  # no map beside the copy
EOA_MAP="AZ=azimuth,EL=elevation,E_az re=e_az_re,E_az im=e_az_im,E_el re=e_el_re,E_el im=e_el_im"
strip_names() { sed 's/"name": "[^"]*", "source": "[^"]*", //'; }
ref=$("$E" info "$L/range_el_over_az.csv" --json 2>/dev/null | strip_names)
got=$("$E" info "eoa.csv::map=$EOA_MAP::angles=el-over-az::assume=quantity=directivity,frequency=3.5 GHz" --json 2>/dev/null | strip_names)
[[ -n "$ref" && "$ref" == "$got" ]] && ok "FILE::angles=el-over-az reads as the map file's angles line" || bad "::angles differs"
expect_rc 0 "the reading note says how the positioner grid was read" "$E" info "eoa.csv::map=$EOA_MAP::angles=el-over-az"
grep -q "eoa.csv: read as elevation over azimuth and resampled onto theta 0..180 step 5" err.txt \
  && ok "... on stderr" || bad "note: $(cat err.txt)"
expect_rc 1 "a layout the columns cannot have is refused" "$E" info "eoa.csv::map=$EOA_MAP::angles=theta-phi"
grep -q "eoa.csv::assume: angles: expected horizon, az-over-el or el-over-az for azimuth and elevation columns" err.txt \
  && ok "... saying which layouts fit" || bad "bad layout: $(cat err.txt)"
expect_rc 2 "render refuses an output name it cannot write" "$E" render sim.csv --out view.jpg
grep -q "expected a file name ending in .png, .glb or .ply, found 'view.jpg'" err.txt && ok "... naming the names it writes" || bad "render ext: $(cat err.txt)"
expect_rc 1 "view refuses a bad map file before opening a window" "$E" view "meas.csv::map=nothing-here.map" --frames 2
if command -v xvfb-run >/dev/null && [[ "${ELLIPSA_SKIP_WINDOW:-0}" != 1 ]]; then
  export XDG_CONFIG_HOME="$W/config"
  expect_rc 0 "view reads a measured file with its own map beside a simulated one" \
    "$XVFB" -a -s "-screen 0 1024x768x24" "$E" view sim.csv "meas.csv::map=$M3" --compare 2 --frames 2 --size 800x600 --software
  printf 'theta,phi,e_total_db\n0,0,x\n' >broken.csv
  expect_rc 1 "view --frames with a file that does not read fails" \
    "$XVFB" -a -s "-screen 0 1024x768x24" "$E" view broken.csv --frames 2 --size 800x600 --software
  grep -q "broken.csv:2:5: expected a number" err.txt && ok "... with the reader's message" || bad "broken: $(cat err.txt)"
else
  echo "xvfb-run not available: the windowed checks are skipped"
fi
finish
