#!/usr/bin/env bash
# ./dev demo: the main job on the bundled scenario (examples/README.md).
# With a display: open the viewer with the three candidate antennas.
# Without one: write the scenario's report, cut plots and 3D snapshots headless, and say where.
set -euo pipefail
cd "$(dirname "$0")/.."
E=build/ellipsa
X=examples
FILES=("$X/printed-dipole.csv" "$X/turnstile.csv" "$X/small-loop.csv")

echo "ellipsa demo: a 2.45 GHz pallet tracker in a cold store (invented scenario, see $X/README.md)"
echo
for f in "${FILES[@]}"; do "$E" info "$f" --frequency 2.45e9 | sed -n '1p;9,20p'; echo; done

if [[ -n "${DISPLAY:-}${WAYLAND_DISPLAY:-}" ]]; then
  echo "Opening the viewer (close the window to finish)."
  exec "$E" view "${FILES[@]}"
fi

OUT=out/demo
mkdir -p "$OUT"
echo "No display: writing the scenario's figures headless to $OUT/"
for f in "${FILES[@]}"; do
  "$E" diversity "$f" --environment indoor --orientations --frequency 2.45e9
  echo
done > "$OUT/diversity.txt"
"$E" diversity "${FILES[0]}" "${FILES[2]}" --environment indoor --frequency 2.45e9 >> "$OUT/diversity.txt"
echo "Mean effective gain indoors at 2.45 GHz over 145 mountings (min / median / max):"
paste <(printf '  %-16s\n' "printed dipole" "turnstile" "small loop") \
      <(grep "min / median / max" "$OUT/diversity.txt" | sed 's/^ *min \/ median \/ max *//')
echo
"$E" report "${FILES[@]}" --out "$OUT/report" --force
"$E" render "${FILES[2]}" --frequency 2.45e9 --out "$OUT/small-loop-3d.png" --color-by axial-ratio --glyphs --force
"$E" cut "${FILES[2]}" --frequency 2.45e9 --through-peak --components total,vertical,horizontal,rhcp,lhcp \
  --out "$OUT/small-loop-cut.svg" --force
echo
echo "Done. Open $OUT/report/index.html in a browser; diversity figures are in $OUT/diversity.txt."
