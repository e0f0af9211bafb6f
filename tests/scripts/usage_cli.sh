#!/usr/bin/env bash
# A command line that helps (issue 14): suggestions for typos, stray arguments in order, frequencies
# with units (the CSV's one parser), range messages in plain numbers, finite angles, the one rule
# for the frequency of a multi-frequency file, choices in the help, the scripted viewer's errors.
# Usage: usage_cli.sh ELLIPSA WORKDIR
set -uo pipefail
source "$(dirname "$0")/checks.sh"  # ok, bad, expect_rc, finish
E=$1; W=$2; rm -rf "$W"; mkdir -p "$W"; cd "$W"
has() { grep -qF -- "$1" err.txt && ok "$2" || bad "$2: $(head -c 400 err.txt)"; }
"$E" synth dipole --step 5 --out d.csv >/dev/null

# 1. Typos: the closest names by edit distance (Damerau 1964, optimal string alignment; common practice).
expect_rc 2 "unknown command" "$E" infoo d.csv
has "unknown command 'infoo'; did you mean 'info'?" "... suggests info"
expect_rc 2 "far-off command" "$E" frobnicate
grep -q "did you mean" err.txt && bad "no suggestion for a far-off word: $(cat err.txt)" || ok "... no suggestion when nothing is close"
expect_rc 2 "unknown option" "$E" info d.csv --frequncy 2.45GHz
has "info: unknown option '--frequncy'; did you mean '--frequency'?" "... suggests --frequency"
expect_rc 2 "unknown option with =" "$E" probe d.csv --theta 10 --phi 0 --ludwig=x
has "probe: unknown option '--ludwig'; did you mean '--ludwig3'?" "... of the command's own options"
expect_rc 2 "root option typo" "$E" --verison
has "unknown option '--verison'; did you mean '--version'?" "... and the root's"
expect_rc 2 "stray arguments" "$E" info d.csv zz aa mm
has "info: unexpected arguments, in the order given: 'zz', 'aa', 'mm'" "... listed in the order given"
expect_rc 2 "a wrong choice" "$E" map d.csv --show axial-ratoi --out m.png
has "did you mean 'axial-ratio'?" "... choices get a suggestion too"

# 2. Frequencies as people write them; units Hz, kHz, MHz, GHz (SI prefixes, BIPM SI Brochure).
for f in 2.45e9 2.45GHz "2.45 GHz" 2450MHz 2450000kHz "2.45 ghz"; do
  expect_rc 0 "probe --frequency '$f'" "$E" probe d.csv --theta 90 --phi 0 --frequency "$f"
  grep -q "2.45 GHz" out.txt && ok "... is 2.45 GHz" || bad "... frequency: $(head -1 out.txt)"
done
expect_rc 2 "a unit that does not exist" "$E" probe d.csv --theta 90 --phi 0 --frequency "2.45 G"
has 'expected the unit Hz, kHz, MHz or GHz after the number, found "G" in "2.45 G" (did you mean GHz?)' "... explained"
expect_rc 2 "a word" "$E" cut d.csv --phi 0 --frequency abc --out c.csv
has 'expected a number >= 0, optionally with a unit (Hz, kHz, MHz or GHz), as 2.45e9, 2.45GHz or 2450 MHz; found "abc"' "... explained"
expect_rc 2 "an infinite frequency" "$E" info d.csv --frequency inf
expect_rc 2 "an overflowing frequency" "$E" info d.csv --frequency 1e308GHz
has "which overflows" "... says it overflows"
expect_rc 0 "synth --frequency 5.8GHz" "$E" synth dipole --step 10 --frequency 5.8GHz --out g.csv
grep -q '^5.8e+09,' g.csv && ok "... writes 5.8e9 Hz" || bad "... synth frequency: $(grep -v '^#' g.csv | sed -n 2p)"
"$E" convert g.csv grel.csv --assume quantity=relative >/dev/null
expect_rc 0 "gain-transfer --reference-gain with the same parser" "$E" gain-transfer grel.csv --reference-level 0 \
  --reference-gain "5800 MHz=2.15" --out gt.csv
expect_rc 2 "... and its explanation" "$E" gain-transfer grel.csv --reference-level 0 --reference-gain "5.8 Gz=2.15" --out gt2.csv
has 'expected the unit Hz, kHz, MHz or GHz after the number, found "Gz"' "... the same words as the option's"
# The CSV reads the same text: "2.45GHz" in the frequency line, no space needed.
{ echo "# frequency: 2.45GHz"; grep -v '^#' d.csv | cut -d, -f2-; } > nofreqcol.csv
expect_rc 0 "CSV frequency line 2.45GHz" "$E" info nofreqcol.csv
grep -q "2.45 GHz" out.txt && ok "... read as 2.45 GHz" || bad "... CSV frequency: $(cat out.txt err.txt | head -3)"
{ echo "# frequency: 2.45 Gz"; grep -v '^#' d.csv | cut -d, -f2-; } > badunit.csv
expect_rc 1 "CSV frequency line with a bad unit" "$E" info badunit.csv
has 'badunit.csv:1:' "... names file and line"
has 'expected the unit Hz, kHz, MHz or GHz after the number, found "Gz"' "... and explains the unit"

# 3. Range messages with numbers as people write them.
expect_rc 2 "theta out of range" "$E" probe d.csv --theta 200 --phi 0
has 'ellipsa: --theta: expected a number from 0 to 180, found "200"' "... 0 to 180"
grep -q "0.000000" err.txt && bad "... printed 0.000000" || ok "... no 0.000000"
expect_rc 2 "synth --step" "$E" synth dipole --step 100 --out x.csv
has 'expected a number from 0.05 to 90, found "100"' "... 0.05 to 90"
expect_rc 2 "synth --frequency 0" "$E" synth dipole --frequency 0 --out x.csv
has 'expected a frequency above 0 Hz and up to 1e15 Hz (1000 THz), found "0"' "... above 0"
expect_rc 2 "cut --range" "$E" cut d.csv --phi 0 --range 1 --out c.csv
has 'expected a number from 3 to 200, found "1"' "... 3 to 200"

# 6. Angles and other numbers: finite and in their documented range.
for v in 1e308 inf -inf nan 400; do
  expect_rc 2 "probe --phi $v" "$E" probe d.csv --theta 10 --phi "$v"
  has 'expected a number from -360 to 360' "... phi from -360 to 360"
  expect_rc 2 "cut --theta $v" "$E" cut d.csv --theta "$v" --out c.csv
done
expect_rc 0 "probe --phi -90 (a documented angle)" "$E" probe d.csv --theta 10 --phi -90
expect_rc 2 "cut --step inf" "$E" cut d.csv --phi 0 --step inf --out c.csv
# The viewer's commands: in a build without it (ELLIPSA_VIEWER=OFF), each is refused with the reason.
if has_command "$E" render; then
  expect_rc 2 "render --range nan" "$E" render d.csv --range nan --out r.png
else
  refused_without_viewer "render --range nan" "$E" render d.csv --range nan --out r.png
fi
# Every numeric option refuses NaN and infinities (its range; numeric_options_cli.sh walks them all).
expect_rc 2 "synth --phase nan" "$E" synth crossed-dipoles --phase nan --out x.csv
has 'ellipsa: --phase: expected a number from -360 to 360, found "nan"' "... its range"
expect_rc 2 "synth --rotate-x 1e400" "$E" synth dipole --rotate-x 1e400 --out x.csv
expect_rc 2 "fading --outage 0.1,inf" "$E" fading d.csv --outage 0.1,inf

# 6b. Options read by our own text parsers (pairs of angles, K-factor, XPR): finite, within their
# documented range, refused while parsing (exit 2) naming the option, the value and what was expected.
"$E" synth dipole --step 10 --frequency 2e9 --out d2.csv >/dev/null
pair_refused() {  # LABEL EXPECTED CMD...: every bad pair below refused with EXPECTED
  local label=$1 want=$2; shift 2
  for v in 1e308,0 inf,0 -inf,0 nan,0 0,1e308 0,nan 1e400,0 181,0 -1,0 -0.5,0 0,400 10 10,20,30 10,x "" ,; do
    expect_rc 2 "$label $v" "$@" "$v"
    grep -qF -- "$want" err.txt && grep -qF -- "found \"$v\"" err.txt && ok "... names the option, what was expected and '$v'" \
      || bad "... $label $v: $(head -c 300 err.txt)"
  done
}
pair_refused "band --direction" '--direction: expected THETA,PHI in degrees, THETA from 0 to 180 and PHI from -360 to 360' \
  "$E" band d.csv --out b.csv --direction
pair_refused "fading --dominant" '--dominant: expected THETA,PHI in degrees, THETA from 0 to 180 and PHI from -360 to 360' \
  "$E" fading d.csv --k-factor 10 --samples 1000 --dominant
if has_command "$E" view; then
  pair_refused "view --pin" '--pin: expected THETA,PHI in degrees, THETA from 0 to 180 and PHI from -360 to 360' \
    "$E" view d.csv --frames 1 --pin
  for v in 1e308,0 inf,0 nan,0 0,91 0,-90.5 0,1e308 10 ""; do
    for c in "view d.csv --frames 1" "render d.csv --out r.png"; do
      read -ra args <<<"$c"
      expect_rc 2 "$c --view $v" "$E" "${args[@]}" --view "$v"
      has "--view: expected AZ,EL in degrees, AZ from -360 to 360 and EL from -90 to 90, found \"$v\"" "... AZ,EL named with its ranges"
    done
  done
  for v in -1,0 0,1e308 nan,1 5; do
    expect_rc 2 "view --cursor $v" "$E" view d.csv --frames 1 --cursor "$v"
    has "--cursor: expected X,Y in window pixels, X from 0 to 16384 and Y from 0 to 16384, found \"$v\"" "... X,Y named"
  done
else
  refused_without_viewer "view --pin nan,0" "$E" view d.csv --frames 1 --pin nan,0
  refused_without_viewer "render --view nan,0" "$E" render d.csv --out r.png --view nan,0
fi
expect_rc 0 "fading --dominant 90,-90 (a documented direction)" "$E" fading d.csv --k-factor 10 --samples 1000 --dominant 90,-90
expect_rc 0 "band --direction 0,0" "$E" band d.csv d2.csv --direction 0,0 --out b0.csv
for v in 1e308 inf nan -0 -1 +1 1e-400x 61dB 1e308dB infdB nandB "" dB; do
  expect_rc 2 "fading --k-factor '$v'" "$E" fading d.csv --samples 1000 --k-factor "$v"
  has "--k-factor: expected a linear power ratio from 0 to 1000000 or the same in dB (up to 60dB, e.g. 10dB), found \"$v\"" \
    "... named with its range"
done
for v in 0 1e6 10dB "10 dB" -10dB 60dB; do
  expect_rc 0 "fading --k-factor '$v'" "$E" fading d.csv --samples 1000 --k-factor "$v" --json
done
for v in 1e308 161 -160.5 nan NaN 1e400 "" 3dB; do
  expect_rc 2 "diversity --xpr '$v'" "$E" diversity d.csv --xpr "$v"
  has "--xpr: expected a number of dB from -160 to 160, inf or -inf, found \"$v\"" "... named with its range"
done
for v in inf -inf 160 -160 -0 6; do expect_rc 0 "diversity --xpr $v" "$E" diversity d.csv --xpr "$v"; done

# 6c. The hint after a usage error names the command whose options were wrong.
expect_rc 2 "cut --range 1" "$E" cut d.csv --phi 0 --range 1 --out c.csv
has "Run 'ellipsa cut --help' for usage." "... the hint names cut"
expect_rc 2 "fading --k-factor nan" "$E" fading d.csv --k-factor nan
has "Run 'ellipsa fading --help' for usage." "... and fading (an error found after parsing)"
expect_rc 2 "a mistyped command" "$E" infoo d.csv
has "Run 'ellipsa --help' for usage." "... the root's help without a command"
# 6d. render's names: one list (the one --help shows), one message.
if has_command "$E" render; then
  expect_rc 2 "render --color-by difference (a viewer-only colouring)" "$E" render d.csv --color-by difference --out r.png
  has "--color-by: expected one of 'component', 'axial-ratio', 'rhcp-minus-lhcp' or 'tilt', found \"difference\"" "... the list in --help"
  expect_rc 0 "render --help" "$E" render --help
  grep -qF "{component,axial-ratio,rhcp-minus-lhcp,tilt}" out.txt && ok "... --help lists the same names" || bad "render --help: $(grep color-by out.txt)"
else
  refused_without_viewer "render --help" "$E" render --help
fi

# 5. A multi-frequency file and no --frequency: the middle one, named on stderr (one rule).
for f in 2.4e9 2.45e9 2.5e9; do "$E" synth dipole --step 5 --frequency $f --out "f$f.csv" >/dev/null; done
{ cat f2.4e9.csv; grep -v '^#' f2.45e9.csv | tail -n +2; grep -v '^#' f2.5e9.csv | tail -n +2; } > three.csv
note="three.csv holds 3 frequencies (2.4 GHz to 2.5 GHz); using the middle one, 2.45 GHz (choose with --frequency)"
expect_rc 0 "probe, 3 frequencies" "$E" probe three.csv --theta 90 --phi 0
has "$note" "probe names the middle one"; grep -q "2.45 GHz" out.txt && ok "... and uses it" || bad "probe: $(head -1 out.txt)"
expect_rc 0 "cut, 3 frequencies" "$E" cut three.csv --phi 0 --out c.csv
has "$note" "cut names the middle one"; grep -q "2.45 GHz" out.txt && ok "... and uses it" || bad "cut: $(head -1 out.txt)"
expect_rc 0 "map, 3 frequencies" "$E" map three.csv --out m.png
has "$note" "map names the middle one"; grep -q "2.45 GHz" out.txt && ok "... and uses it" || bad "map: $(head -1 out.txt)"
expect_rc 0 "coverage, 3 frequencies" "$E" coverage three.csv
has "$note" "coverage names the middle one"; grep -q '2.45 GHz' out.txt && ok "... and uses it" || bad "coverage: $(head -3 out.txt)"
expect_rc 0 "rank, 3 frequencies" "$E" rank three.csv --json
has "$note" "rank names the middle one"; grep -q '"frequency_hz": 2.45e+09' out.txt && ok "... and uses it" || bad "rank: $(head -3 out.txt)"
expect_rc 0 "fading, 3 frequencies" "$E" fading three.csv --samples 2000 --json
has "$note" "fading names the middle one"; grep -q '"frequency_hz": 2.45e+09' out.txt && ok "... and uses it" || bad "fading: $(head -3 out.txt)"
expect_rc 0 "info, 3 frequencies: all of them" "$E" info three.csv
[[ $(grep -c "GHz$" out.txt) == 3 ]] && ok "... three blocks" || bad "info: $(grep GHz out.txt)"
grep -q "using the middle" err.txt && bad "info chose one" || ok "... no choice made"
expect_rc 0 "two frequencies: the lower middle one" "$E" probe f2.4e9.csv --theta 90 --phi 0
{ cat f2.4e9.csv; grep -v '^#' f2.5e9.csv | tail -n +2; } > two.csv
expect_rc 0 "probe, 2 frequencies" "$E" probe two.csv --theta 90 --phi 0
grep -q "2.4 GHz" out.txt && ok "... of two, the lower middle one" || bad "two: $(head -1 out.txt)"

# 7. Choices in the help (and so in the manual pages and completions).
expect_rc 0 "map --help" "$E" map --help
grep -q "{hammer,theta-phi,az-el}" out.txt && ok "map --projection lists its choices" || bad "map --projection choices"
grep -q "{viridis,cividis,magma}" out.txt && ok "map --colormap lists its choices" || bad "map --colormap choices"
expect_rc 0 "fading --help" "$E" fading --help
grep -q "{vertical,horizontal,slant+45,slant-45,rhcp,lhcp}" out.txt && ok "fading --polarisation lists its choices" || bad "fading choices"

# 4. The scripted viewer: a missing file is an error, never the examples; --compare N out of range.
if ! has_command "$E" view; then
  refused_without_viewer "view --compare 3 with one file" "$E" view d.csv --frames 1 --compare 3
  refused_without_viewer "view with a missing file" "$E" view no-such.csv --frames 2 --software
else
  expect_rc 2 "view --compare 3 with one file" "$E" view d.csv --frames 1 --compare 3
  has "--compare expects a FILE number from 1 to 1, found 3" "... names the range"
fi
if has_command "$E" view && command -v xvfb-run >/dev/null; then
  expect_rc 1 "view --frames with a missing file" "$XVFB" -a -s "-screen 0 800x600x24" "$E" view no-such.csv --frames 2 --software
  has "no-such.csv" "... names the file"
  grep -qi "example" err.txt out.txt && bad "... fell back to the examples: $(cat err.txt)" || ok "... no fallback to the examples"
fi
# 7. Every manual page has EXAMPLES, and every example runs as shown (the viewer's need a window).
D=$(dirname "$E")/cli-docs/man1
mkdir -p ex && cd ex
examples_of() { zcat "$1" | sed -n 's/^\\fB\(ellipsa .*\)\\fR$/\1/p' | sed 's/\\-/-/g'; }
for page in "$D/ellipsa.1.gz" "$D"/ellipsa-*.1.gz; do
  name=$(basename "$page" .1.gz)
  zcat "$page" | grep -q '^\.SH EXAMPLES$' && ok "$name has EXAMPLES" || bad "$name lacks EXAMPLES"
  [[ $name == ellipsa-view ]] && continue
  while IFS= read -r line; do
    read -ra words <<<"${line#ellipsa }"
    expect_rc 0 "example: $line" "$E" "${words[@]}"
  done < <(examples_of "$page")
done
cd ..
finish
