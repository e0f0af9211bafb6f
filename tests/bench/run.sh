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

echo
echo "-- CSV importer (1M rows, 16 frequencies, ~70 MB; MB/s target >= 300; peak memory target < 2x arrays) --"
BENCH_DIR=${BENCH_DIR:-$B/bench-data}
mkdir -p "$BENCH_DIR"
"$B/tests/bench_csv" "$BENCH_DIR" || echo "bench_csv failed"
CSV=$BENCH_DIR/bench_csv_1m.csv
if [[ -f $CSV ]]; then
  read -r e_wall e_cpu < <(/usr/bin/python3 tests/bench/time_cmd.py 3 "$B/ellipsa" info "$CSV")
  printf "%-42s %7s s wall %7s s CPU\n" "ellipsa info (read + 16 summaries)" "$e_wall" "$e_cpu"
  if /usr/bin/python3 -c "import pandas, numpy" 2>/dev/null; then
    read -r p_wall p_cpu < <(/usr/bin/python3 tests/bench/time_cmd.py 2 /usr/bin/python3 tests/bench/pandas_info.py "$CSV")
    printf "%-42s %7s s wall %7s s CPU\n" "pandas read_csv + numpy integration" "$p_wall" "$p_cpu"
    awk -v pw="$p_wall" -v ew="$e_wall" -v pc="$p_cpu" -v ec="$e_cpu" 'BEGIN {
      printf "%-42s %7.1fx wall %6.1fx CPU  (target >= 5x, aim 10x)\n", "ellipsa info speed-up over pandas+numpy", pw / ew, pc / ec }'
  else
    echo "python3-pandas / python3-numpy missing: no comparison"
  fi
fi

echo
echo "-- viewer (mesh rebuild target < 20 ms; frame at 1280x800 under llvmpipe: 1-deg median <= 16.7 ms, 0.5-deg <= 33 ms) --"
if [[ -x $B/tests/bench_viewer_mesh ]]; then
  "$B/tests/bench_viewer_mesh" || echo "bench_viewer_mesh failed"
  if command -v xvfb-run >/dev/null; then
    VB=$(mktemp -d)
    for step in 1 0.5; do
      "$B/ellipsa" synth crossed-dipoles --step "$step" --out "$VB/grid-$step.csv" >/dev/null
      stats=$(XDG_CONFIG_HOME="$VB/config" xvfb-run -a -s "-screen 0 1400x900x24" \
        "$B/ellipsa" view "$VB/grid-$step.csv" --software --size 1280x800 --frames 150 --frame-stats 2>/dev/null | tail -1)
      printf "  %-44s %s\n" "frame time, $step-deg grid, 1280x800, llvmpipe" "$stats"
    done
    rm -rf "$VB"
    echo "  (includes ImGui panels, glyphs, cut plot and Poincare sphere; load from other processes inflates these)"
  else
    echo "  xvfb-run missing: no frame-time figures"
  fi
else
  echo "viewer not built"
fi
