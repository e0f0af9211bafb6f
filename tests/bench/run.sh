#!/usr/bin/env bash
# ./dev bench: print performance figures beside their targets. Never pass/fail.
# Each section is a small block; add new benchmarks as their own block below.
set -uo pipefail
cd "$(dirname "$0")/../.."
B=build
echo "== ellipsa benchmarks ($(nproc) cores, $(date -u +%Y-%m-%dT%H:%MZ)) =="

echo
echo "-- core kernels --"
"$B/tests/bench_core" || echo "bench_core failed"
