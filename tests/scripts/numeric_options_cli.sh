#!/usr/bin/env bash
# Every numeric option of every command is range-checked while the command line is parsed: the
# test walks each command's --help, finds every option whose value is a number (FLOAT, INT, UINT),
# requires a stated range beside the type ("FLOAT:from 3 to 200", "above 0 and up to 90", "between
# 0 and 1, both excluded"), and gives each option hostile values (not numbers, NaN, infinities,
# numbers beyond a double, 1e308, just outside each end of its range). Each must be a usage error
# (exit 2) whose message names the option, never a crash, a hang or a huge allocation (every run
# under timeout and ulimit -v). Options whose text holds numbers in a syntax of their own (FREQ,
# sizes, pairs, gain lists) are in a table below with values of their own.
# Usage: numeric_options_cli.sh ELLIPSA WORKDIR
set -uo pipefail
source "$(dirname "$0")/checks.sh"  # ok, bad, expect_rc, finish
E=$1; W=$2; rm -rf "$W"; mkdir -p "$W"; cd "$W"

# One hostile run: exit 2 and the option's name on stderr; at most 20 s and 4 GB of address space.
hostile() {  # CMD OPTION VALUE ARGS...
  local cmd=$1 opt=$2 val=$3; shift 3
  ( ulimit -v 4000000; timeout 20 "$E" "$cmd" "$@" "$opt" "$val" ) >out.txt 2>err.txt
  local rc=$?
  if [[ $rc == 2 ]] && grep -q -- "$opt" err.txt; then
    ok "$cmd $opt '$val' (exit 2, named)"
  else
    bad "$cmd $opt '$val': exit $rc, expected 2 naming $opt; stderr: $(head -c 300 err.txt)"
  fi
}

# The arguments before the option under test: a FILE (it need not exist: an option refused while
# parsing stops the run before anything is read, and before a missing required option is named).
args_of() { [[ $1 == synth ]] && echo dipole || echo z.csv; }

# The numbers just outside a stated range ("from A to B", "above A and up to B", "between A and B").
outside() {
  sed -nE 's/.*(from|above|between) (-?[0-9.e+-]+) (to|and up to|and) (-?[0-9.e+-]+).*/\2 \4/p' <<<"$1" |
    /usr/bin/python3 -c "import sys
for line in sys.stdin:
    lo, hi = map(float, line.split()); d = max(1.0, abs(hi - lo) * 1e-3)
    print(repr(lo - d), repr(hi + d))"
}

commands=$("$E" --help | awk '/^Subcommands:/{f=1; next} f && /^  [a-z]/{print $1}')
[[ -n $commands ]] && ok "the command list" || bad "no commands in --help"
found=0
for cmd in $commands; do
  "$E" "$cmd" --help >help.txt 2>&1 || continue
  # "  --range FLOAT:from 3 to 200 ..." (help2man reads the same lines)
  while IFS= read -r line; do
    opt=$(sed -nE 's/^ +(-[a-zA-Z], ?)?(--[a-z0-9-]+) (FLOAT|INT|UINT)( \.\.\.)?(:| |$).*/\2/p' <<<"$line")
    [[ -z $opt ]] && continue
    found=$((found + 1))
    type=$(sed -nE 's/^ +(-[a-zA-Z], ?)?--[a-z0-9-]+ (.*)/\2/p' <<<"$line")
    if ! grep -qE '^(FLOAT|INT|UINT)( \.\.\.)?:(from|above|between) ' <<<"$type"; then
      bad "$cmd $opt states no range in --help: $line"
      continue
    fi
    read -r -a a <<<"$(args_of "$cmd")"
    for v in nan inf -inf 1e308 -1e308 1e400 abc "" $(outside "$type"); do
      hostile "$cmd" "$opt" "$v" "${a[@]}"
    done
  done <help.txt
done
[[ $found -gt 40 ]] && ok "$found numeric options walked" || bad "only $found numeric options found in --help"

# Options whose text carries numbers in a syntax of its own: each with values of its own.
table=(
  "cut --frequency nan 1e300 -1 0 inf 1e400GHz 2e15"
  "probe --frequency 1e300 0"
  "cut --size 0x0 -5x100 1e9x1e9 nanxnan 100000x100 12x12 100x x 20001x20001"
  "map --size 0x0 20001x100"
  "band --size 1e308x1"
  "report --size 15x15"
  "fading --size 0x0"
  "coverage --size 99999999x1"
  "gain-transfer --reference-gain nan 1e308 5.8GHz=nan 5.8GHz=1e308 1e400GHz=1 101"
  "fading --k-factor nan 1e308 -1 1e400dB"
  "fading --dominant nan,0 200,0"
  "diversity --xpr nan 1e308"
  "probe --theta 1e308 nan"
)
[[ $("$E" render --help 2>&1) == *--size* ]] &&
  table+=("render --size 0x0 1e9x1e9 nanxnan 63x63 8193x100 1x" "view --size 0x0 1e9x1e9 nanxnan -1x-1 99999x99999 319x800 1280x239")
for row in "${table[@]}"; do
  read -r -a r <<<"$row"
  cmd=${r[0]}; opt=${r[1]}
  read -r -a a <<<"$(args_of "$cmd")"
  for v in "${r[@]:2}"; do hostile "$cmd" "$opt" "$v" "${a[@]}"; done
done
finish
