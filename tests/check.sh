#!/usr/bin/env bash
# ./dev check: the quality gates beyond ./dev test.
#   1. AddressSanitizer + UndefinedBehaviorSanitizer build; core, importer and scene tests under it
#   2. the readers' fuzz targets (CSV, map file, profile, viewer settings) within FUZZ_SECONDS
#   3. a headless viewer run under LeakSanitizer (errors from our code fail the gate), and the
#      viewer robustness script under the sanitizers
#   4. static analysis (cppcheck)
#   5. a clean-machine check: a fresh clone runs the README's two commands (ELLIPSA_CLEAN_MACHINE=0 skips)
set -euo pipefail
cd "$(dirname "$0")/.."
ROOT=$PWD
JOBS=$(nproc 2>/dev/null || echo 2)
FUZZ_SECONDS=${FUZZ_SECONDS:-60}

echo "== 1. sanitizer build (ASan + UBSan) =="
cmake -S . -B build-asan -DCMAKE_BUILD_TYPE=RelWithDebInfo -DELLIPSA_SANITIZE=ON >/dev/null
cmake --build build-asan -j"$JOBS"
export ASAN_OPTIONS=detect_leaks=1:abort_on_error=1:strict_string_checks=1
export UBSAN_OPTIONS=print_stacktrace=1:halt_on_error=1
export LSAN_OPTIONS=suppressions=$ROOT/tests/lsan.supp:print_suppressions=0
build-asan/tests/ellipsa_tests
if [[ -x build-asan/tests/ellipsa_scene_tests ]]; then build-asan/tests/ellipsa_scene_tests; fi
if [[ -x build-asan/tests/ellipsa_viewer_ui_tests ]]; then build-asan/tests/ellipsa_viewer_ui_tests; fi  # panels, no GPU

echo "== 2. fuzzing the readers (${FUZZ_SECONDS} s in all) =="
if [[ -x tests/fuzz/run.sh ]]; then
  FUZZ_SECONDS=$FUZZ_SECONDS tests/fuzz/run.sh
else
  echo "tests/fuzz/run.sh missing" >&2
  exit 1
fi

echo "== 3. headless viewer under LeakSanitizer =="
# Mesa's software renderer is unloaded at exit, so what it keeps shows up as leaks from an
# "<unknown module>". The gate fails on any ASan or UBSan error, and on any leak whose stack
# passes through our own sources; leaks only inside system libraries are listed, not failed.
viewer_gate() {  # LOG
  local log=$1
  if grep -qE "ERROR: AddressSanitizer|runtime error:" "$log"; then
    echo "sanitizer error in the viewer run:" >&2; cat "$log" >&2; return 1
  fi
  if grep -qE "ERROR: LeakSanitizer" "$log"; then
    if awk '/^(Direct|Indirect) leak/{blk=""} {blk=blk"\n"$0} /^$/{ if (blk ~ /\/(pattern|io|importers|cli|viewer|exports)\/[a-z_\/]+\.(cpp|hpp)/) {print blk; bad=1}; blk=""} END{exit bad?0:1}' "$log"; then
      echo "leak through our own code in the viewer run (above)" >&2; return 1
    fi
    echo "viewer run: leaks reported only inside system libraries ($(grep -c '^\(Direct\|Indirect\) leak' "$log") blocks; Mesa/LLVM)"
  fi
  return 0
}
tmp=$(mktemp -d)
build-asan/ellipsa synth crossed-dipoles --step 3 --out "$tmp/x.csv"
ASAN_OPTIONS=detect_leaks=1:exitcode=0 LSAN_OPTIONS=suppressions=$ROOT/tests/lsan.supp:exitcode=0 \
  env -u DISPLAY build-asan/ellipsa render "$tmp/x.csv" --out "$tmp/x.png" --size 320x240 >"$tmp/render.log" 2>&1 || true
test -s "$tmp/x.png" || { echo "headless render under the sanitizers wrote no image" >&2; cat "$tmp/render.log" >&2; exit 1; }
viewer_gate "$tmp/render.log"
if command -v xvfb-run >/dev/null; then
  ASAN_OPTIONS=detect_leaks=1:exitcode=0 LSAN_OPTIONS=suppressions=$ROOT/tests/lsan.supp:exitcode=0 \
    tests/xvfb_run.sh -a build-asan/ellipsa view "$tmp/x.csv" --software --frames 5 --size 640x400 \
    --screenshot "$tmp/v.png" >"$tmp/view.log" 2>&1 || true
  test -s "$tmp/v.png" || { echo "windowed viewer under the sanitizers wrote no screenshot" >&2; cat "$tmp/view.log" >&2; exit 1; }
  viewer_gate "$tmp/view.log"
fi
rm -rf "$tmp"
echo "viewer: no sanitizer errors and no leaks from our code"
# Hostile settings, empty cuts, NaN options, no replacing without --force (tests/viewer/robustness.sh),
# under the sanitizers: ASan's RSS limit stands in for ulimit -v, which ASan's shadow memory cannot live under.
if command -v xvfb-run >/dev/null; then
  ELLIPSA=build-asan/ellipsa XVFB_RUN=$ROOT/tests/xvfb_run.sh ROBUST_MEMORY_KB=unlimited ROBUST_WAIT_S=8 \
    ASAN_OPTIONS=detect_leaks=0:abort_on_error=1:hard_rss_limit_mb=4000 tests/viewer/robustness.sh
fi

echo "== 4. static analysis =="
tests/static_analysis.sh

if [[ "${ELLIPSA_CLEAN_MACHINE:-1}" == 1 ]]; then
  echo "== 5. clean-machine check =="
  tests/clean_machine.sh
fi

echo "quality gates: all passed"
