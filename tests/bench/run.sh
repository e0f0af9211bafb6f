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

echo
echo "-- exports (time per cut figure, SVG/PNG/PDF from one drawing path) --"
"$B/tests/bench_export" || echo "bench_export failed"

echo
echo "-- diversity (MEG, orientation sweep, envelope correlation) --"
"$B/tests/bench_diversity" || echo "bench_diversity failed"
