#!/usr/bin/env bash
# Build the libFuzzer targets with clang (ASan + UBSan + libFuzzer) and run each for a share of
# FUZZ_SECONDS on a scratch copy of its seed corpus. Exit status non-zero on any finding.
#   FUZZ_SECONDS (default 60)   the whole budget: half to the CSV reader, the rest shared by the
#                               map-file, profile and settings readers (at least 5 s each)
#   FUZZ_BUILD   (default build-fuzz)
# Single allocations are capped (-malloc_limit_mb) far below the RSS limit: the readers must bound
# what a small input makes them allocate by themselves.
set -euo pipefail
cd "$(dirname "$0")/../.."
SECONDS_TO_RUN=${FUZZ_SECONDS:-60}
BUILD=${FUZZ_BUILD:-build-fuzz}
CXX_BIN=${FUZZ_CXX:-$(command -v clang++-14 || command -v clang++)}
CC_BIN=${FUZZ_CC:-$(command -v clang-14 || command -v clang)}
# The viewer is configured for its pure scene library (fuzz_settings); only the fuzz targets are built.
cmake -S . -B "$BUILD" -DCMAKE_BUILD_TYPE=RelWithDebInfo -DCMAKE_CXX_COMPILER="$CXX_BIN" -DCMAKE_C_COMPILER="$CC_BIN" \
  -DELLIPSA_FUZZ=ON -DELLIPSA_VIEWER=ON >/dev/null
TARGETS=(fuzz_csv fuzz_map fuzz_profile fuzz_settings)
cmake --build "$BUILD" --target "${TARGETS[@]}" -j"$(nproc 2>/dev/null || echo 2)"
export ASAN_OPTIONS=detect_leaks=1:abort_on_error=1:allocator_may_return_null=1
export UBSAN_OPTIONS=print_stacktrace=1:halt_on_error=1
csv_seconds=$(( SECONDS_TO_RUN / 2 > 5 ? SECONDS_TO_RUN / 2 : 5 ))
side_seconds=$(( (SECONDS_TO_RUN - csv_seconds) / 3 > 5 ? (SECONDS_TO_RUN - csv_seconds) / 3 : 5 ))
findings=0
fuzz() {  # TARGET SECONDS DICT SEED_FILE...
  local target=$1 seconds=$2 dict=$3; shift 3
  local work=$BUILD/fuzz-work/$target
  local status=0
  rm -rf "$work" && mkdir -p "$work/corpus" "$work/artifacts"
  cp "$@" "$work/corpus/"
  echo "fuzzing $target for $seconds s"
  "$BUILD/tests/fuzz/$target" "$work/corpus" -max_total_time="$seconds" -timeout=10 -rss_limit_mb=2048 \
    -malloc_limit_mb=256 -dict="$dict" -max_len=16384 -print_final_stats=1 -artifact_prefix="$work/artifacts/" \
    >"$work/log" 2>&1 || status=1  # a finding must reach the message below, not end the script under set -e
  tail -6 "$work/log"
  if [[ $status != 0 ]] || compgen -G "$work/artifacts/*" >/dev/null; then
    echo "$target: FINDINGS (see $work/artifacts); what it printed:" >&2
    grep -v -E '^#[0-9]+|NEW_FUNC|^INFO:' "$work/log" | head -60 >&2
    for a in "$work"/artifacts/*; do
      if [[ -f $a ]]; then echo "-- $a (first 400 bytes, escaped):" >&2; head -c 400 "$a" | od -c | head -20 >&2; fi
    done
    findings=1
  else
    echo "$target: no findings in $seconds s"
  fi
}
fuzz fuzz_csv "$csv_seconds" tests/fuzz/csv.dict tests/fuzz/corpus-csv/* tests/data/csv/*.csv
fuzz fuzz_map "$side_seconds" tests/fuzz/map.dict tests/fuzz/corpus-map/*
fuzz fuzz_profile "$side_seconds" tests/fuzz/profile.dict tests/fuzz/corpus-profile/*
fuzz fuzz_settings "$side_seconds" tests/fuzz/settings.dict tests/fuzz/corpus-settings/*
exit $findings
