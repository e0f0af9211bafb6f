#!/usr/bin/env bash
# Viewer robustness under Xvfb: hostile settings files, a config folder that cannot be made,
# cuts with no power, NaN options, zero components and files that must not be replaced. Every
# run has a time limit (timeout) and a memory limit (ulimit -v), so a hang or unbounded growth
# fails here instead of taking the machine down.
#
# Interactive runs (the only ones that read the settings) are closed with SIGTERM, which the
# viewer treats as closing the window: it draws at least one frame, saves and exits 0.
set -uo pipefail
: "${ELLIPSA:?}"
source "$(dirname "${BASH_SOURCE[0]}")/preamble.sh"  # xvfb-run or skip, $out, XDG_CONFIG_HOME
LIMIT_S=${ROBUST_TIME_LIMIT:-90}       # per run, generous for a loaded 2-core machine
LIMIT_KB=${ROBUST_MEMORY_KB:-4000000}  # address space of the viewer (llvmpipe reserves a lot)
WAIT_S=${ROBUST_WAIT_S:-3}             # before an interactive run is asked to close
failures=0
fail() { echo "FAIL: $*"; failures=$((failures + 1)); }

# run_view NAME [ARGS...]: a scripted or interactive view run with both limits; sets rc, log.
# With INTERACTIVE=1 the run is closed by SIGTERM after WAIT_S seconds.
run_view() {
  local name=$1; shift
  log="$out/$name.log"
  if [[ ${INTERACTIVE:-0} == 1 ]]; then
    timeout -k 5 "$LIMIT_S" "$XVFB_RUN" -a -s "-screen 0 1024x768x24" bash -c '
      ulimit -v "$1"; "$2" view "${@:4}" & p=$!; sleep "$3"; kill -TERM $p 2>/dev/null; wait $p' \
      _ "$LIMIT_KB" "$ELLIPSA" "$WAIT_S" "$@" >"$log" 2>&1
  else
    timeout -k 5 "$LIMIT_S" "$XVFB_RUN" -a -s "-screen 0 1024x768x24" bash -c 'ulimit -v "$1"; exec "$2" view "${@:3}"' \
      _ "$LIMIT_KB" "$ELLIPSA" "$@" >"$log" 2>&1
  fi
  rc=$?
  if [[ $rc == 124 || $rc == 137 ]]; then fail "$name: did not finish within ${LIMIT_S} s (hang or endless loop)"; fi
}
expect_rc() {  # NAME WANT
  [[ $rc == "$2" ]] || { fail "$1: exit code $rc, expected $2"; sed 's/^/    /' "$log" | tail -15; }
}
expect_log() {  # NAME TEXT
  grep -qF -- "$2" "$log" || { fail "$1: expected the message '$2'"; sed 's/^/    /' "$log" | tail -15; }
}

"$ELLIPSA" synth short-dipole --step 5 --out "$out/dipole.csv" >/dev/null
"$ELLIPSA" synth small-loop --step 5 --out "$out/loop.csv" >/dev/null
# A pattern whose field is zero everywhere.
awk -F, 'BEGIN { OFS = "," } /^#/ || /^frequency/ { print; next } { for (i = 4; i <= NF; i++) $i = 0; print }' \
  "$out/dipole.csv" >"$out/zero.csv"

cfg() {  # NAME: a fresh config home; d is its ellipsa folder
  export XDG_CONFIG_HOME="$out/cfg-$1"
  d="$XDG_CONFIG_HOME/ellipsa"
  mkdir -p "$d"
}

echo "-- bad values in viewer.conf: ignored with a warning, never written back --"
bad_values=("window_width = nan" "window_height = -inf" "cut_panel_height = nan" "left_panel_width = inf"
            "right_panel_width = 1e400" "range_db = nan" "cut_kind = 1.5" "cut_angle_deg = nan" "glyph_spacing_deg = -nan"
            "poincare_within_db = 0x1p-1100" "cut_components = 99999999999999999999")
cfg values
printf '%s\n' "${bad_values[@]}" >"$d/viewer.conf"
INTERACTIVE=1 run_view values "$out/loop.csv"
expect_rc "bad values" 0
for bad in "${bad_values[@]}"; do
  key=${bad%% =*}
  expect_log "$bad" "'$key' expects"
  grep -q "^$key = " "$d/viewer.conf" || fail "$bad: the settings were not saved with a valid $key"
done
grep -qiE "= *-?(nan|inf)" "$d/viewer.conf" && fail "bad values: a non-finite value was written back"

echo "-- viewer.conf that is not a regular file of sane size: not read, not replaced --"
cfg fifo
mkfifo "$d/viewer.conf"
INTERACTIVE=1 run_view fifo "$out/loop.csv"
expect_rc "FIFO settings" 0
expect_log "FIFO settings" "expected a regular file"
[[ -p "$d/viewer.conf" ]] || fail "FIFO settings: the FIFO was replaced"

cfg devzero
ln -s /dev/zero "$d/viewer.conf"
ln -s /dev/zero "$d/imgui.ini"
INTERACTIVE=1 run_view devzero "$out/loop.csv"
expect_rc "/dev/zero settings" 0
expect_log "/dev/zero settings" "expected a regular file"
[[ -L "$d/viewer.conf" && -L "$d/imgui.ini" ]] || fail "/dev/zero settings: a link was replaced"

cfg huge
head -c 3000000 /dev/zero | tr '\0' '#' >"$d/viewer.conf"
INTERACTIVE=1 run_view huge "$out/loop.csv"
expect_rc "huge settings" 0
expect_log "huge settings" "expected at most"

echo "-- a config folder that cannot be made: run without saving, say so once --"
touch "$out/not-a-folder"
export XDG_CONFIG_HOME="$out/not-a-folder/cfg"
INTERACTIVE=1 run_view unwritable "$out/loop.csv"
expect_rc "unwritable config" 0
n=$(grep -c "settings will not be saved" "$log")
[[ $n == 1 ]] || fail "unwritable config: said $n times that settings are not saved (expected once)"

echo "-- cuts with no power, zero components, NaN options --"
cfg cone0
printf 'cut_kind = 1\ncut_angle_deg = 0\n' >"$d/viewer.conf"  # theta = 0 cone of a z dipole: zero
INTERACTIVE=1 run_view cone0 "$out/dipole.csv"
expect_rc "theta = 0 cut of a z dipole" 0
cfg zero-component
printf 'component = phi\ncut_components = 4\n' >"$d/viewer.conf"  # E-phi of a z dipole: zero
INTERACTIVE=1 run_view zero-component "$out/dipole.csv"
expect_rc "zero E-phi component" 0
export XDG_CONFIG_HOME="$out/cfg-scripted"
run_view zero-pattern "$out/zero.csv" --frames 3 --screenshot "$out/zero.png"
expect_rc "all-zero pattern" 0
[[ -s "$out/zero.png" ]] || fail "all-zero pattern: no screenshot"
run_view zero-pin "$out/dipole.csv" --frames 3 --pin 0,0 --component phi
expect_rc "pin on a zero component" 0
for opt in "--pin nan,nan" "--pin 0,nan" "--pin inf,0" "--view nan,0" "--cursor nan,1"; do
  # shellcheck disable=SC2086
  run_view nan-option "$out/loop.csv" --frames 2 $opt
  expect_rc "$opt" 2
done

echo "-- files of scripted runs are not replaced without --force --"
echo "keep me" >"$out/keep.png"
for opt in --screenshot --export-view --export-cut; do
  run_view "no-force$opt" "$out/loop.csv" --frames 2 "$opt" "$out/keep.png"
  expect_rc "$opt onto an existing file" 1
  expect_log "$opt onto an existing file" "already exists; use --force"
  [[ $(cat "$out/keep.png") == "keep me" ]] || fail "$opt replaced an existing file without --force"
done
ln -s "$out/nowhere.png" "$out/dangling.png"
run_view no-force-dangling "$out/loop.csv" --frames 2 --screenshot "$out/dangling.png"
expect_rc "--screenshot onto a dangling link" 1
run_view force "$out/loop.csv" --frames 2 --screenshot "$out/keep.png" --force
expect_rc "--screenshot --force" 0
[[ $(head -c 4 "$out/keep.png" | tail -c 3) == PNG ]] || fail "--screenshot --force did not replace the file"

if [[ $failures -gt 0 ]]; then
  echo "viewer robustness: $failures failure(s)"
  exit 1
fi
echo "viewer robustness: all cases passed"
