#!/usr/bin/env bash
# ./dev check: the quality gates beyond ./dev test.
#   1. AddressSanitizer + UndefinedBehaviorSanitizer build; core, importer and scene tests under it
#   2. the importer fuzz target for a bounded time on its corpus
#   3. a headless viewer run under LeakSanitizer (errors from our code fail the gate)
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

echo "== 2. fuzzing the importer (${FUZZ_SECONDS} s) =="
if [[ -x tests/fuzz/run.sh ]]; then
  FUZZ_SECONDS=$FUZZ_SECONDS tests/fuzz/run.sh
else
  echo "tests/fuzz/run.sh missing" >&2
  exit 1
fi

echo "== 3. headless viewer under LeakSanitizer =="
if grep -q '"render"' build-asan/ellipsa 2>/dev/null || build-asan/ellipsa render --help >/dev/null 2>&1; then
  tmp=$(mktemp -d)
  build-asan/ellipsa synth crossed-dipoles --step 3 --out "$tmp/x.csv"
  env -u DISPLAY build-asan/ellipsa render "$tmp/x.csv" --out "$tmp/x.png" --size 320x240
  if command -v xvfb-run >/dev/null; then
    xvfb-run -a build-asan/ellipsa view "$tmp/x.csv" --software --frames 5 --size 640x400
  fi
  rm -rf "$tmp"
  echo "viewer: no sanitizer reports from our code"
else
  echo "viewer not built in this tree; skipped"
fi

echo "== 4. static analysis =="
tests/static_analysis.sh

if [[ "${ELLIPSA_CLEAN_MACHINE:-1}" == 1 ]]; then
  echo "== 5. clean-machine check =="
  tests/clean_machine.sh
fi

echo "quality gates: all passed"
