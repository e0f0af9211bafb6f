#!/usr/bin/env bash
# Build the CSV fuzz target with clang (ASan + UBSan + libFuzzer) and run it for a bounded time
# on a scratch copy of the seed corpus. Exit status non-zero on any finding.
#   FUZZ_SECONDS (default 60)   how long to fuzz
#   FUZZ_BUILD   (default build-fuzz)
set -euo pipefail
cd "$(dirname "$0")/../.."
SECONDS_TO_RUN=${FUZZ_SECONDS:-60}
BUILD=${FUZZ_BUILD:-build-fuzz}
CXX_BIN=${FUZZ_CXX:-$(command -v clang++-14 || command -v clang++)}
CC_BIN=${FUZZ_CC:-$(command -v clang-14 || command -v clang)}
cmake -S . -B "$BUILD" -DCMAKE_BUILD_TYPE=RelWithDebInfo -DCMAKE_CXX_COMPILER="$CXX_BIN" -DCMAKE_C_COMPILER="$CC_BIN" \
  -DELLIPSA_FUZZ=ON -DELLIPSA_VIEWER=OFF >/dev/null
cmake --build "$BUILD" --target fuzz_csv -j"$(nproc 2>/dev/null || echo 2)"
WORK=$BUILD/fuzz-work
rm -rf "$WORK" && mkdir -p "$WORK/corpus" "$WORK/artifacts"
cp tests/fuzz/corpus/* "$WORK/corpus/"
cp tests/data/csv/*.csv "$WORK/corpus/"
export ASAN_OPTIONS=detect_leaks=1:abort_on_error=1:allocator_may_return_null=1
export UBSAN_OPTIONS=print_stacktrace=1:halt_on_error=1
echo "fuzzing the CSV reader for ${SECONDS_TO_RUN} s"
"$BUILD/tests/fuzz/fuzz_csv" "$WORK/corpus" -max_total_time="$SECONDS_TO_RUN" -timeout=10 -rss_limit_mb=2048 \
  -dict=tests/fuzz/csv.dict -max_len=16384 -print_final_stats=1 -artifact_prefix="$WORK/artifacts/" 2>&1 | tail -15
status=${PIPESTATUS[0]}
if [[ $status != 0 ]] || compgen -G "$WORK/artifacts/*" >/dev/null; then
  echo "fuzz_csv: FINDINGS (see $WORK/artifacts)" >&2
  exit 1
fi
echo "fuzz_csv: no findings in ${SECONDS_TO_RUN} s"
