#!/usr/bin/env bash
# ./dev demo: the main job on the bundled scenario (examples/README.md, docs/guide.md).
# With a display: open the viewer with the three candidate antennas.
# Without one: write the scenario's report, cut plots and 3D snapshots headless, and say where.
set -euo pipefail
cd "$(dirname "$0")/.."
E=build/ellipsa
X=examples
FILES=("$X/printed-dipole.csv" "$X/turnstile.csv" "$X/small-loop.csv")
NAMES=("printed dipole" "turnstile" "small loop")

echo "ellipsa demo: a 2.45 GHz pallet tracker in a cold store (invented scenario, see $X/README.md)"
echo
for f in "${FILES[@]}"; do "$E" info "$f" --frequency 2.45e9 | sed -n '1p;9,15p'; echo; done

# MEG as mounted at the band edges and the centre: "2.4 GHz" is followed by its "MEG" line.
echo "Mean effective gain indoors as mounted (dBi), 2.40 / 2.45 / 2.48 GHz:"
for i in "${!FILES[@]}"; do
  printf '  %-16s' "${NAMES[$i]}"
  "$E" diversity "${FILES[$i]}" --environment indoor |
    awk '/^  [0-9.]+ GHz/ { f = $1 } /^    MEG/ && (f == "2.4" || f == "2.45" || f == "2.48") { printf " %7s", $2 }'
  echo
done
echo

# The three candidates ranked against a lossless vertical half-wave dipole, indoors and in the
# isotropic environment (docs/diversity.md, "Ranking candidates"): the table's first lines.
echo "Ranking at 2.45 GHz (score: fading level at 1 % as mounted over the reference dipole's, mean of the environments):"
"$E" rank "${FILES[@]}" --environment indoor,uniform --frequency 2.45e9 | sed -n '2,7p' | sed 's/^/  /'
echo

if [[ -n "${DISPLAY:-}${WAYLAND_DISPLAY:-}" ]]; then
  echo "Opening the viewer (close the window to finish)."
  exec "$E" view "${FILES[@]}"
fi

OUT=out/demo
rm -rf "$OUT" && mkdir -p "$OUT"  # the demo's own output, written afresh each run
echo "No display: writing the scenario's figures headless to $OUT/"
for f in "${FILES[@]}"; do
  "$E" diversity "$f" --environment indoor --orientations --frequency 2.45e9
  echo
done > "$OUT/diversity.txt"
"$E" diversity "${FILES[0]}" "${FILES[1]}" --environment indoor --frequency 2.45e9 >> "$OUT/diversity.txt"
echo "Mean effective gain indoors at 2.45 GHz over 145 mountings (min / median / max):"
paste <(printf '  %-16s\n' "${NAMES[@]}") \
      <(grep "min / median / max" "$OUT/diversity.txt" | sed 's/^ *min \/ median \/ max *//')
echo
# Fading of the two best candidates and their combination: distribution curves (simulated, with
# the closed forms dashed) and the levels at 1 % beside their exact values.
"$E" fading "${FILES[0]}" "${FILES[1]}" --environment indoor --frequency 2.45e9 --samples 50000 \
  --plot "$OUT/fading.svg" --force > "$OUT/fading.txt"
echo "Received power at 1 % outage indoors (simulated [95 % interval], closed form), from $OUT/fading.txt:"
grep -E "^[A-Z]\. |level at 1 %|combining" "$OUT/fading.txt" | sed 's/^ */  /'
echo
"$E" rank "${FILES[@]}" --environment indoor,uniform --frequency 2.45e9 --out "$OUT/ranking.html" --force 2>/dev/null
"$E" report "${FILES[@]}" --environment indoor --frequency 2.45e9 --out "$OUT/report" --force
"$E" render "${FILES[1]}" --frequency 2.45e9 --out "$OUT/turnstile-3d.png" --color-by axial-ratio --glyphs --force
"$E" cut "${FILES[1]}" --frequency 2.45e9 --phi 0 --components total,vertical,horizontal,rhcp,lhcp \
  --out "$OUT/turnstile-cut.svg" --force
echo
echo "Done. Open $OUT/report/index.html in a browser (its Link reliability section holds the fading curves and"
echo "the ranking); diversity figures are in $OUT/diversity.txt, the fading curves in $OUT/fading.svg and the"
echo "ranking in $OUT/ranking.html."
echo "docs/guide.md walks through the band, the orientations and the range measurement."
