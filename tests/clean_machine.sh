#!/usr/bin/env bash
# Clean-machine check: clone the committed tree into a temporary folder and run the README's
# two commands exactly as written there, so a missing install or build step shows up.
set -euo pipefail
cd "$(dirname "$0")/.."
ROOT=$PWD
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
git clone -q "$ROOT" "$tmp/ellipsa"
# The commands are the lines starting with ./dev in the README's "Two commands" block.
mapfile -t cmds < <(awk '/^## Two commands/{f=1} f&&/^```sh/{c=1;next} c&&/^```/{exit} c&&/^\.\/dev /{sub(/ *#.*/,""); print}' README.md)
if ((${#cmds[@]} != 2)); then
  echo "clean-machine check: expected two ./dev commands in README.md, found ${#cmds[@]}" >&2
  exit 1
fi
cd "$tmp/ellipsa"
for c in "${cmds[@]}"; do
  echo "clean-machine check: running '$c'"
  env -u DISPLAY bash -c "$c"
done
echo "clean-machine check: both README commands passed on a fresh clone"
