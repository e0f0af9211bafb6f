#!/usr/bin/env bash
# Every command that writes a file or a folder, against every bad destination: (a) its folder is
# missing, (b) the path is a folder, (c) a device (/dev/full: refused up front, io/atomic_write.hpp)
# and a disk that fills up or a file-size limit (the write fails: ENOSPC, EFBIG), (d) a read-only
# folder holding the file, (e) an existing file without and with --force, (f) a FIFO and a
# dangling link at the path. Each case checks the exit code (1), that the message names the path
# and the reason, and what is on disk afterwards: the old file untouched, nothing new, no
# temporary file left (common practice for tools that write files; docs/exports.md, "Writing
# files safely", states the rules). Every run has a time limit, so a write that blocks (a FIFO
# opened for writing waits for a reader) fails here instead of hanging.
# Usage: writers_cli.sh ELLIPSA WORKDIR
set -uo pipefail
source "$(dirname "$0")/checks.sh"  # ok, bad, finish, $XVFB
E=$1; W=$2; rm -rf "$W"; mkdir -p "$W"; chmod 755 "$W"; cd "$W" || exit 1
LIMIT_S=120

"$E" synth dipole --step 10 --out d.csv >/dev/null || { bad "synth of the input failed"; finish; exit 1; }
"$E" convert d.csv rel.csv --family theta-phi-db >/dev/null && sed -i 's/^# quantity: .*/# quantity: relative/' rel.csv
chmod 644 d.csv rel.csv

# The writers: NAME EXTENSION; write NAME PATH [ARGS...] runs the command that writes PATH.
WRITERS="synth:csv convert:csv gain-transfer:csv cut:svg cut:csv band:png map:pdf coverage:json rank:md
fading:svg report:dir"
if has_command "$E" render; then
  WRITERS="$WRITERS render:png render:glb render:ply"
else  # a build without the viewer: render writes nothing, whatever the destination
  refused_without_viewer "render to a missing folder" "$E" render d.csv --out missing/v.png
  [[ ! -e missing ]] && ok "... nothing written" || bad "... nothing written"
fi
if has_command "$E" view && command -v xvfb-run >/dev/null; then
  WRITERS="$WRITERS view-screenshot:png view-export-view:png view-export-cut:pdf"
fi
# Running the viewer under Xvfb as another user needs an X authority file that user can read.
view_as() {  # PREFIX... -- ARGS: run the viewer under Xvfb, the command after PREFIX
  timeout -k 5 "$LIMIT_S" "$XVFB" -a -s "-screen 0 640x480x24" bash -c \
    'a=$(mktemp); cp "$XAUTHORITY" "$a"; chmod 644 "$a"; XAUTHORITY=$a "$@"; rc=$?; rm -f "$a"; exit $rc' _ "$@"
}
write() {  # NAME PATH [EXTRA...]; a PREFIX (e.g. setpriv ...) may come from $AS
  local name=$1 path=$2; shift 2
  local -a as
  read -ra as <<<"${AS:-}"  # a command prefix: setpriv ..., prlimit ...
  # stderr through a pipe: a file-size limit on the command must not cut its message short.
  { case $name in
    synth) timeout "$LIMIT_S" "${as[@]}" "$E" synth dipole --step 10 --out "$path" "$@" ;;
    convert) timeout "$LIMIT_S" "${as[@]}" "$E" convert d.csv "$path" "$@" ;;
    gain-transfer) timeout "$LIMIT_S" "${as[@]}" "$E" gain-transfer rel.csv --reference-level 0 --reference-gain 2 --out "$path" "$@" ;;
    cut) timeout "$LIMIT_S" "${as[@]}" "$E" cut d.csv --phi 0 --out "$path" "$@" ;;
    band) timeout "$LIMIT_S" "${as[@]}" "$E" band d.csv --out "$path" "$@" ;;
    map) timeout "$LIMIT_S" "${as[@]}" "$E" map d.csv --out "$path" "$@" ;;
    coverage) timeout "$LIMIT_S" "${as[@]}" "$E" coverage d.csv --out "$path" "$@" ;;
    rank) timeout "$LIMIT_S" "${as[@]}" "$E" rank d.csv --out "$path" "$@" ;;
    fading) timeout "$LIMIT_S" "${as[@]}" "$E" fading d.csv --samples 500 --plot "$path" "$@" ;;
    render) timeout "$LIMIT_S" "${as[@]}" "$E" render d.csv --size 320x240 --out "$path" "$@" ;;
    report) timeout "$LIMIT_S" "${as[@]}" "$E" report d.csv --out "$path" "$@" ;;
    view-screenshot) view_as "${as[@]}" "$E" view d.csv --frames 1 --size 320x240 --screenshot "$path" "$@" ;;
    view-export-view) view_as "${as[@]}" "$E" view d.csv --frames 1 --size 320x240 --export-view "$path" "$@" ;;
    view-export-cut) view_as "${as[@]}" "$E" view d.csv --frames 1 --size 320x240 --export-cut "$path" "$@" ;;
  esac 2>&1 >out.txt; } | cat >err.txt
}
# check LABEL WANT_RC PATH REASON: the exit code, and the message names the path and the reason.
check() {
  local label=$1 want=$2 path=$3 reason=$4 rc=$5
  if [[ $rc == 124 || $rc == 137 ]]; then bad "$label: did not finish within $LIMIT_S s"; return; fi
  [[ $rc == "$want" ]] && ok "$label: exit $rc" || bad "$label: exit $rc, expected $want; stderr: $(head -c 300 err.txt)"
  [[ $want == 0 ]] && return
  grep -qF -- "$path" err.txt && grep -qF -- "$reason" err.txt \
    && ok "$label: message names the path and says '$reason'" || bad "$label: message: $(head -c 300 err.txt)"
}
no_temporary() {  # LABEL FOLDER
  local left; left=$(find "$2" -maxdepth 1 -name '*.tmp-*' 2>/dev/null | head -3)
  [[ -z $left ]] && ok "$1: no temporary left in $2" || bad "$1: left behind: $left"
}
unprivileged() { [[ $(id -u) == 0 ]] && echo "setpriv --reuid=65534 --regid=65534 --clear-groups" || echo ""; }
export -f write view_as; export E LIMIT_S XVFB
can_drop=1; [[ $(id -u) == 0 ]] && ! command -v setpriv >/dev/null && can_drop=0

for w in $WRITERS; do
  name=${w%%:*}; ext=${w##*:}; t="t-$name-$ext"; mkdir -p "$t"; chmod 755 "$t"
  if [[ $ext == dir ]]; then out=out; else out=out.$ext; fi
  echo "== $name (.$ext)"

  # (a) the folder is missing: nothing is created, not even the folder.
  write "$name" "$t/missing/$out"; check "$name (a) missing folder" 1 "$t/missing/$out" "does not exist" $?
  [[ ! -e $t/missing ]] && ok "$name (a): the folder was not created" || bad "$name (a): $t/missing made"

  # (b) the path is a folder (the report: a folder ellipsa did not make), with and without --force.
  mkdir -p "$t/folder.$ext"; echo "mine" >"$t/folder.$ext/mine.txt"
  want=$([[ $ext == dir ]] && echo "already exists" || echo "is a folder")
  write "$name" "$t/folder.$ext"; check "$name (b) a folder" 1 "$t/folder.$ext" "$want" $?
  want=$([[ $ext == dir ]] && echo "was not made by ellipsa" || echo "is a folder")
  write "$name" "$t/folder.$ext" --force; check "$name (b) a folder, --force" 1 "$t/folder.$ext" "$want" $?
  [[ $(ls -A "$t/folder.$ext") == mine.txt && $(cat "$t/folder.$ext/mine.txt") == mine ]] \
    && ok "$name (b): the folder and its file untouched" || bad "$name (b): folder now holds $(ls -A "$t/folder.$ext")"
  no_temporary "$name (b)" "$t"

  # (c) a device: refused up front, with --force too; the device node stays a device. A command
  # that picks the format by the name's ending refuses /dev/full as a usage error (exit 2); the
  # same device under a name with the ending (mknod, root only) is refused as a device.
  write "$name" /dev/full --force; rc=$?
  if grep -q "expected a file name ending in" err.txt; then check "$name (c) /dev/full --force" 2 /dev/full "expected a file name ending in" $rc
  else check "$name (c) /dev/full --force" 1 /dev/full "character device" $rc; fi
  [[ -c /dev/full ]] && ok "$name (c): /dev/full is still a character device" || bad "$name (c): /dev/full replaced!"
  no_temporary "$name (c)" /dev
  if [[ $ext != dir ]] && mknod "$t/dev.$ext" c 1 7 2>/dev/null; then
    write "$name" "$t/dev.$ext" --force; check "$name (c) a device named .$ext, --force" 1 "$t/dev.$ext" "character device" $?
    [[ -c $t/dev.$ext ]] && ok "$name (c): the device node is still there" || bad "$name (c): the device node was replaced"
  fi
  # (c) the write itself fails (a file-size limit: EFBIG) over an existing file with --force.
  if [[ $ext != dir ]]; then echo "keep me" >"$t/big.$ext"; else write report "$t/big" >/dev/null; fi
  big=$([[ $ext == dir ]] && echo "$t/big" || echo "$t/big.$ext"); before=$(ls -lR --time-style=+%s.%N "$big" | md5sum)
  ( trap '' XFSZ; AS="prlimit --fsize=0" write "$name" "$big" --force ); check "$name (c) file-size limit" 1 "$big" "File too large" $?
  [[ $(ls -lR --time-style=+%s.%N "$big" | md5sum) == "$before" ]] && ok "$name (c): existing output untouched" || bad "$name (c): $big changed"
  no_temporary "$name (c) EFBIG" "$t"
  # (c) a full disk (ENOSPC): a 16 KiB tmpfs in a mount namespace of our own, where one is allowed.
  if unshare -rm true 2>/dev/null; then
    mkdir -p "$t/full"
    rc=$(unshare -rm bash -c 'set -o pipefail; d=$1; shift; mount -t tmpfs -o size=16k tmpfs "$d" || { echo 99; exit; }
      head -c 1M /dev/zero >"$d/filler" 2>/dev/null; write "$@"; rc=$?
      ls -A "$d" >"$d.left"; echo $rc' _ "$t/full" "$name" "$t/full/$out" --force)
    if [[ $rc == 99 ]]; then echo "skip $name (c) full disk: tmpfs cannot be mounted here"; else
      check "$name (c) full disk" 1 "$t/full/$out" "No space left on device" "$rc"
      [[ $(cat "$t/full.left") == filler ]] && ok "$name (c) full disk: nothing but the filler left" || bad "$name (c) full disk left: $(cat "$t/full.left")"
    fi
  else
    echo "skip $name (c) full disk: no mount namespace here"
  fi

  # (e) an existing output: refused without --force, replaced with it.
  if [[ $ext == dir ]]; then write "$name" "$t/$out" && ok "$name (e): first report written" || bad "$name (e): $(cat err.txt)"
    touch -d 2000-01-01 "$t/$out/index.html"; keep=$(md5sum <"$t/$out/index.html")
  else echo "keep me" >"$t/$out"; keep=$(md5sum <"$t/$out"); fi
  file=$([[ $ext == dir ]] && echo "$t/$out/index.html" || echo "$t/$out")
  write "$name" "$t/$out"; check "$name (e) existing, no --force" 1 "$t/$out" "already exists; use --force" $?
  [[ $(md5sum <"$file") == "$keep" ]] && ok "$name (e): untouched" || bad "$name (e): replaced without --force"
  write "$name" "$t/$out" --force; check "$name (e) existing, --force" 0 "$t/$out" "" $?
  if [[ $ext == dir ]]; then [[ $(stat -c %Y "$file") != 946684800 ]]; else [[ $(md5sum <"$file") != "$keep" ]]; fi \
    && ok "$name (e): replaced with --force" || bad "$name (e): not replaced with --force"
  no_temporary "$name (e)" "$t"

  # (d) a read-only folder holding the output: as user nobody when running as root.
  if [[ $can_drop == 1 ]]; then
    mkdir -p "$t/ro"; rm -rf "$t/ro/$out"; cp -a "$t/$out" "$t/ro/$out"; chmod -R a+rX "$t/ro"; chmod 555 "$t/ro"
    before=$(ls -lR --time-style=+%s.%N "$t/ro" | md5sum)
    AS=$(unprivileged) write "$name" "$t/ro/$out" --force; check "$name (d) read-only folder" 1 "$t/ro/$out" "Permission denied" $?
    [[ $(ls -lR --time-style=+%s.%N "$t/ro" | md5sum) == "$before" ]] && ok "$name (d): folder and output untouched, no temporary" || bad "$name (d): $(ls -A "$t/ro")"
    chmod 755 "$t/ro"
  else
    bad "$name (d): cannot test a read-only folder: running as root without setpriv"
  fi

  # (f) a FIFO at the path: refused up front (never opened, so never blocks); the FIFO stays.
  mkfifo "$t/fifo.$ext"
  write "$name" "$t/fifo.$ext" --force; check "$name (f) FIFO --force" 1 "$t/fifo.$ext" "FIFO" $?
  [[ -p $t/fifo.$ext ]] && ok "$name (f): the FIFO is still there" || bad "$name (f): FIFO replaced"
  # (f) a dangling link: kept without --force; with --force a file is replaced by the new output
  # and the link's target is never created (links are not followed; a report refuses it).
  ln -s "$W/$t/nowhere.$ext" "$t/dangling.$ext"
  want=$([[ $ext == dir ]] && echo "is not a folder" || echo "already exists")
  write "$name" "$t/dangling.$ext"; check "$name (f) dangling link" 1 "$t/dangling.$ext" "$want" $?
  [[ -L $t/dangling.$ext ]] && ok "$name (f): link kept" || bad "$name (f): link replaced without --force"
  write "$name" "$t/dangling.$ext" --force; rc=$?
  if [[ $ext == dir ]]; then check "$name (f) dangling link, --force" 1 "$t/dangling.$ext" "not a folder" $rc
  else check "$name (f) dangling link, --force" 0 "$t/dangling.$ext" "" $rc
    [[ -f $t/dangling.$ext && ! -L $t/dangling.$ext ]] && ok "$name (f): the link is now the output" || bad "$name (f): $(ls -l "$t/dangling.$ext")"
  fi
  [[ ! -e $t/nowhere.$ext ]] && ok "$name (f): the link's target was not created" || bad "$name (f): wrote through the link"
  no_temporary "$name (f)" "$t"
done
finish
