# Shared helpers for the command-line test scripts: source it, then call ok/bad/expect_rc and
# finish with `finish`. Counts passes and failures; prints "N passed, M failed" at the end.
pass=0; fail=0
ok() { echo "ok   $1"; pass=$((pass+1)); }
bad() { echo "FAIL $1"; fail=$((fail+1)); }
expect_rc() {  # WANT LABEL CMD... (stdout to out.txt, stderr to err.txt)
  local want=$1 label=$2; shift 2
  "$@" >out.txt 2>err.txt; local rc=$?
  if [[ $rc == "$want" ]]; then ok "$label (exit $rc)"; else bad "$label: exit $rc, expected $want; stderr: $(head -c 300 err.txt)"; fi
}
finish() { echo "$pass passed, $fail failed"; [[ $fail == 0 ]]; }
# xvfb-run through tests/xvfb_run.sh (an authority file of our own, so xvfb-run's clean-up cannot
# replace the program's exit status under load).
XVFB="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)/xvfb_run.sh"
# has_command ELLIPSA NAME: NAME is listed in --help (a build without the viewer lists no view, render).
has_command() { "$1" --help | grep -q "^  $2 "; }
# refused_without_viewer LABEL CMD...: in a build without the viewer, CMD (view or render) is refused
# as bad usage (exit 2) with the reason (cli/cmd_no_viewer.cpp), not with its options called unknown.
refused_without_viewer() {
  local label=$1; shift
  expect_rc 2 "$label, a build without the viewer" "$@"
  if grep -qF "is not available: this build has no viewer (ELLIPSA_VIEWER=OFF)" err.txt && ! grep -q "unknown option" err.txt
  then ok "... says the build has no viewer"; else bad "... says the build has no viewer: $(head -c 300 err.txt)"; fi
}
