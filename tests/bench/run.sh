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
echo "-- figures against frequency, maps, coverage (band plot over 100 frequencies: target < 1 s after loading) --"
"$B/tests/bench_views" || echo "bench_views failed"

echo
echo "-- diversity (MEG, orientation sweep, envelope correlation) --"
"$B/tests/bench_diversity" || echo "bench_diversity failed"

echo
echo "-- fading (random-field simulation, exact combining) --"
"$B/tests/bench_fading" || echo "bench_fading failed"

echo
echo "-- rank (10 candidates x 3 environments with the orientation sweep: target < 3 s; then 20 candidates in every preset; load $(cut -d' ' -f1 /proc/loadavg)) --"
"$B/tests/bench_rank" || echo "bench_rank failed"

echo
echo "-- CSV importer (1M rows, 16 frequencies, ~70 MB; target >= 800 MB/s per core; peak memory target < 2x arrays; load $(cut -d' ' -f1 /proc/loadavg)) --"
BENCH_DIR=${BENCH_DIR:-$B/bench-data}
mkdir -p "$BENCH_DIR"
"$B/tests/bench_csv" "$BENCH_DIR" || echo "bench_csv failed"
CSV=$BENCH_DIR/bench_csv_1m.csv
if [[ -f $CSV ]]; then
  read -r e_wall e_cpu < <(/usr/bin/python3 tests/bench/time_cmd.py 5 "$B/ellipsa" info "$CSV")
  printf "%-42s %7s s wall %7s s CPU\n" "ellipsa info (read + 16 summaries)" "$e_wall" "$e_cpu"
  if /usr/bin/python3 -c "import pandas, numpy" 2>/dev/null; then
    read -r p_wall p_cpu < <(/usr/bin/python3 tests/bench/time_cmd.py 3 /usr/bin/python3 tests/bench/pandas_info.py "$CSV")
    printf "%-42s %7s s wall %7s s CPU\n" "pandas read_csv + numpy integration" "$p_wall" "$p_cpu"
    awk -v pw="$p_wall" -v ew="$e_wall" -v pc="$p_cpu" -v ec="$e_cpu" 'BEGIN {
      printf "%-42s %7.1fx wall %6.1fx CPU  (target >= 10x; whole processes, medians, same run)\n", "ellipsa info speed-up over pandas+numpy", pw / ew, pc / ec }'
  else
    echo "python3-pandas / python3-numpy missing: no comparison"
  fi
fi

echo
echo "-- cut export: ellipsa cut to SVG, then to PNG (two processes, RHCP and LHCP, polar) against the pandas +"
echo "   matplotlib script that writes the same two files (target >= 10x; whole processes, medians of 5 and 3; load $(cut -d' ' -f1 /proc/loadavg)) --"
CUTDIR=$(mktemp -d)
CUT=(cut examples/turnstile.csv --frequency 2.45e9 --phi 0 --components rhcp,lhcp --force)
read -r s_wall s_cpu < <(/usr/bin/python3 tests/bench/time_cmd.py 5 "$B/ellipsa" "${CUT[@]}" --out "$CUTDIR/cut.svg")
read -r g_wall g_cpu < <(/usr/bin/python3 tests/bench/time_cmd.py 5 "$B/ellipsa" "${CUT[@]}" --out "$CUTDIR/cut.png")
printf "  %-40s %7s s wall %7s s CPU\n" "ellipsa cut -> SVG" "$s_wall" "$s_cpu" "ellipsa cut -> PNG" "$g_wall" "$g_cpu"
if /usr/bin/python3 -c "import pandas, matplotlib" 2>/dev/null; then
  read -r m_wall m_cpu < <(/usr/bin/python3 tests/bench/time_cmd.py 3 /usr/bin/python3 tests/bench/matplotlib_cut.py examples/turnstile.csv 2450 "$CUTDIR/mpl")
  printf "  %-40s %7s s wall %7s s CPU\n" "pandas + matplotlib, SVG and PNG" "$m_wall" "$m_cpu"
  awk -v sw="$s_wall" -v gw="$g_wall" -v mw="$m_wall" -v sc="$s_cpu" -v gc="$g_cpu" -v mc="$m_cpu" 'BEGIN {
    printf "  %-40s %7.1fx wall %6.1fx CPU  (target >= 10x)\n", "ellipsa speed-up over matplotlib", mw / (sw + gw), mc / (sc + gc) }'
else
  echo "  python3-pandas / python3-matplotlib missing: no comparison"
fi
rm -rf "$CUTDIR"

echo
echo "-- the demo report with 3D views (examples/demo.sh's report: three patterns at 2.45 GHz, indoor; target < 5 s wall;"
echo "   median of 3; load $(cut -d' ' -f1 /proc/loadavg)) --"
if [[ -x $B/tests/bench_viewer_mesh ]]; then
  REPDIR=$(mktemp -d)
  read -r r_wall r_cpu < <(/usr/bin/python3 tests/bench/time_cmd.py 3 env -u DISPLAY -u WAYLAND_DISPLAY "$B/ellipsa" report \
    examples/printed-dipole.csv examples/turnstile.csv examples/small-loop.csv --environment indoor --frequency 2.45e9 \
    --out "$REPDIR/report" --force)
  printf "  %-40s %7s s wall %7s s CPU (%s files)\n" "ellipsa report, 3D views included" "$r_wall" "$r_cpu" "$(ls "$REPDIR/report" | wc -l)"
  rm -rf "$REPDIR"
else
  echo "  viewer not built: the report has no 3D views"
fi

echo
echo "-- large sweep (100 frequencies, 0.5-degree grid, about 2.5 GB of CSV; peak memory target <= 1.3x the arrays) --"
if [[ ${ELLIPSA_BENCH_SWEEP:-0} == 1 ]]; then
  SWEEP=$BENCH_DIR/bench_sweep.csv
  tests/bench/make_sweep.sh "$B/ellipsa" "$SWEEP" 100 0.5
  /usr/bin/time -v "$B/ellipsa" info "$SWEEP" --json >/dev/null 2>"$BENCH_DIR/sweep_time.txt"
  awk -v mb="$(du -m "$SWEEP" | cut -f1)" '
    /Maximum resident set size/ { rss = $NF / 1024 }
    /Elapsed \(wall clock\)/ { wall = $NF }
    /User time/ { u = $NF } /System time/ { s = $NF }
    END { arrays = 361 * 720 * 100 * 32 / 1048576
          printf "  ellipsa info: %s wall, %.1f s CPU, %d MB read; peak memory %.0f MiB for %.0f MiB of arrays (%.2fx)\n",
                 wall, u + s, mb, rss, arrays, rss / arrays }' "$BENCH_DIR/sweep_time.txt"
  # The viewer on the same sweep: the frequency stepped on every frame (as a slider dragged
  # through the band without pause), with the cut and the probe's figures redrawn each time.
  if command -v xvfb-run >/dev/null; then
    VS=$(mktemp -d)
    for step in 0 1; do
      stats=$(ELLIPSA_BENCH_STEP_FREQUENCY=$step XDG_CONFIG_HOME="$VS/config" /usr/bin/time -v -o "$VS/time.txt" \
        tests/xvfb_run.sh -a -s "-screen 0 1400x900x24" "$B/ellipsa" view "$SWEEP" --software --size 1280x800 \
        --frames 200 --frame-stats 2>/dev/null | tail -1)
      label="viewer, one frequency shown"; [[ $step == 1 ]] && label="viewer, next frequency every frame"
      printf "  %-40s %s (target at 0.5 deg: median <= 33 ms)\n" "$label" "$stats"
    done
    awk '/Maximum resident set size/ { printf "  viewer peak memory %.0f MiB (the arrays, the mesh, the window and its textures)\n", $NF / 1024 }' "$VS/time.txt"
    rm -rf "$VS"
  fi
  rm -f "$SWEEP"
else
  echo "  skipped (2.5 GB of disk and a few minutes): ELLIPSA_BENCH_SWEEP=1 ./dev bench"
fi

echo
echo "-- viewer (mesh rebuild: 1-deg < 20 ms, 0.25-deg < 33 ms; hover pick at 0.25 deg < 2 ms; frame at 1280x800 under llvmpipe:"
echo "   1-deg median <= 16.7 ms, 0.5-deg <= 33 ms, 0.25-deg median <= 16.7 ms and p95 <= 25 ms; load $(cut -d' ' -f1 /proc/loadavg)) --"
if [[ -x $B/tests/bench_viewer_mesh ]]; then
  "$B/tests/bench_viewer_mesh" || echo "bench_viewer_mesh failed"
  if command -v xvfb-run >/dev/null; then
    VB=$(mktemp -d)
    for step in 1 0.5 0.25 1-full; do
      full=0
      if [[ $step == 1-full ]]; then step=1; full=1; fi
      export ELLIPSA_FULL_DETAIL=$full
      [[ -f $VB/grid-$step.csv ]] || "$B/ellipsa" synth crossed-dipoles --step "$step" --out "$VB/grid-$step.csv" >/dev/null
      stats=$(XDG_CONFIG_HOME="$VB/config" tests/xvfb_run.sh -a -s "-screen 0 1400x900x24" \
        "$B/ellipsa" view "$VB/grid-$step.csv" --software --size 1280x800 --frames 150 --frame-stats 2>/dev/null | tail -1)
      label="$step-deg grid"; [[ $full == 1 ]] && label="$step-deg grid, every grid line"
      printf "  %-44s %s\n" "frame time, $label, 1280x800" "$stats"
      # CPU time per frame barely depends on other load: (CPU of 160 frames - CPU of 10) / 150,
      # all threads of llvmpipe and the X server included (on 2 cores, wall >= CPU / 2).
      run() { XDG_CONFIG_HOME="$VB/config" /usr/bin/python3 tests/bench/time_cmd.py 1 tests/xvfb_run.sh -a -s "-screen 0 1400x900x24" \
        "$B/ellipsa" view "$VB/grid-$step.csv" --software --size 1280x800 --frames "$1"; }
      read -r _ c10 < <(run 10)
      read -r _ c160 < <(run 160)
      awk -v a="$c10" -v b="$c160" -v s="$step" -v l="$label" 'BEGIN { printf "  %-44s %7.1f ms CPU per frame (all threads)\n", "frame cost, " l, (b - a) / 150 * 1000 }'
    done
    unset ELLIPSA_FULL_DETAIL
    rm -rf "$VB"
    echo "  (includes ImGui panels, glyphs, cut plot and Poincare sphere; load from other processes inflates wall times;"
    echo "   by default cells under 3 px are drawn with every 2nd grid line, ELLIPSA_FULL_DETAIL=1 draws them all)"
  else
    echo "  xvfb-run missing: no frame-time figures"
  fi
else
  echo "viewer not built"
fi
