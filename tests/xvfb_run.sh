#!/usr/bin/env bash
# xvfb-run with an X authority file of our own, removed here. Left to itself, xvfb-run makes and
# removes a temporary folder, and on a loaded machine that removal sometimes fails: it then exits 5
# ("problem while cleaning up temporary directory") in place of the program's own exit status,
# which a test that expects a refusal (exit 1) reads as a wrong result. With -f it removes nothing.
# Usage: xvfb_run.sh [xvfb-run options] COMMAND [ARGS...]
set -u
command -v xvfb-run >/dev/null || { echo "xvfb_run.sh: xvfb-run is not installed" >&2; exit 127; }
auth=$(mktemp "${TMPDIR:-/tmp}/ellipsa-xauth.XXXXXX") || exit 1
xvfb-run -f "$auth" "$@"
rc=$?
rm -f "$auth" "$auth"-c "$auth"-l "$auth"-n 2>/dev/null
exit $rc
